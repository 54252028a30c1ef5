;;; kiln-eglot.el --- eglot support for kiln-mode  -*- lexical-binding: t; -*-

;; Package-Requires: ((emacs "27.1") (eglot "1.9"))
;; Keywords: languages, data

;;; Commentary:

;; Loaded by kiln-mode.el once eglot is loaded.
;;
;; - Registers `kiln serve' for `kiln-mode' buffers, as the server class
;;   `kiln-eglot-server'.
;; - Inlay hints: the server offers the estimated ΔHf°298 and S°298 of
;;   species without thermo data, and ΔH°r of reactions, as inlay hints at
;;   line ends.  Where eglot shows inlay hints itself (`eglot-inlay-hints-mode',
;;   Emacs 29), that is used.  Older eglot (1.9, Debian bookworm) has none:
;;   there this file asks for the hints of the visible part of the buffer
;;   after each diagnostics update and each scroll, shows them as overlays
;;   (face `kiln-inlay-hint'), and tells the server so through the client
;;   capability textDocument.inlayHint.
;;
;; - Large files: eglot 1.9 converts each diagnostic's position by
;;   scanning from the top of the buffer, and pretty-prints every message
;;   into its events buffer; with thousands of diagnostics that blocks Emacs
;;   for seconds per update.  For the kiln server, positions are converted
;;   in one pass over the buffer, and the events log is off by default
;;   (`kiln-eglot-events-buffer-size').  Diagnostics are handed to Flymake
;;   for the lines shown in windows first and for the rest in blocks from
;;   timers that yield to typing (`kiln-eglot-diagnostics-chunk-lines');
;;   Flymake's idle check no longer redraws the diagnostics of the text
;;   before an edit; the garbage collector is held back while a publication
;;   is read and shown (`kiln-eglot-gc-cons-threshold'); changes go to the
;;   server after 0.25 s idle (`kiln-eglot-send-changes-idle-time').
;;
;; - Equilibrium: M-x kiln-equilibrium reads a mixture ("CH4:1, O2:2,
;;   N2:7.52") and shows the equilibrium over the buffer's species, from
;;   the file's own thermo, in the buffer *kiln equilibrium*: by default the
;;   adiabatic flame temperature at constant pressure from 298.15 K and
;;   1 atm (options `kiln-equilibrium-temperature', `-pressure',
;;   `-adiabatic', `-volume'; `kiln-equilibrium-default-mix' is offered at
;;   the prompt).  It runs the server's kiln.equilibrium command, the code of
;;   `kiln equilibrium'.  eglot shows no code lenses, so the server's
;;   "Equilibrium / flame temperature…" lens is not shown in Emacs.
;;
;; Server settings go through `eglot-workspace-configuration', e.g.
;;   (setq-default eglot-workspace-configuration
;;                 '(:kiln (:units "kJ/mol" :estimateNotes :json-false)))

;;; Code:

(require 'cl-lib)
(require 'eglot)
(require 'jsonrpc)

(defgroup kiln-eglot nil
  "kiln language server through eglot."
  :group 'kiln
  :prefix "kiln-eglot-")

(defcustom kiln-eglot-inlay-hints t
  "Non-nil to show the server's inlay hints (estimated thermochemistry)."
  :type 'boolean)

(defface kiln-inlay-hint '((t :inherit shadow :height 0.9))
  "Face of the inlay hints shown by kiln-eglot.")

(defcustom kiln-eglot-events-buffer-size 0
  "Size of the kiln server's eglot events buffer; nil: `eglot-events-buffer-size'.
0 (the default) keeps no log: eglot pretty-prints every message into it,
which on a large mechanism costs seconds per diagnostics update."
  :type '(choice (const :tag "As eglot-events-buffer-size" nil) integer))

(defcustom kiln-eglot-diagnostics-chunk-lines 500
  "Lines whose diagnostics are handed to Flymake at a time, outside windows."
  :type 'integer)

(defcustom kiln-eglot-send-changes-idle-time 0.25
  "Idle seconds before changes are sent to the kiln server, in kiln buffers.
Sets `eglot-send-changes-idle-time' locally; nil leaves it alone."
  :type '(choice (const :tag "As eglot-send-changes-idle-time" nil) number))

(defcustom kiln-eglot-gc-cons-threshold (* 64 1024 1024)
  "`gc-cons-threshold' while kiln's server messages are read and shown.
Reading a publication of thousands of diagnostics and handing them to
Flymake conses megabytes; at Emacs's default threshold that runs the
garbage collector ten times or more per publication, for most of the time
the editor is blocked.  With this threshold the work runs through and one
collection follows.  nil leaves `gc-cons-threshold' alone."
  :type '(choice (const :tag "As gc-cons-threshold" nil) integer))

(defmacro kiln-eglot--with-gc-threshold (&rest body)
  "Run BODY with `gc-cons-threshold' at least `kiln-eglot-gc-cons-threshold'."
  (declare (indent 0) (debug t))
  `(let ((gc-cons-threshold (if kiln-eglot-gc-cons-threshold
                                (max gc-cons-threshold kiln-eglot-gc-cons-threshold)
                              gc-cons-threshold)))
     ,@body))

(defclass kiln-eglot-server (eglot-lsp-server) ()
  :documentation "The kiln language server (`kiln serve').")

(defun kiln-eglot--process-filter (fn proc string)
  "Around `jsonrpc--process-filter' (FN, PROC, STRING): for the kiln server
read with the garbage collector held back (`kiln-eglot-gc-cons-threshold')."
  (if (cl-typep (process-get proc 'jsonrpc-connection) 'kiln-eglot-server)
      (kiln-eglot--with-gc-threshold (funcall fn proc string))
    (funcall fn proc string)))

(advice-add 'jsonrpc--process-filter :around #'kiln-eglot--process-filter)

(cl-defmethod initialize-instance :after ((s kiln-eglot-server) &rest _)
  "Apply `kiln-eglot-events-buffer-size' to S."
  (when kiln-eglot-events-buffer-size
    (setf (jsonrpc--events-buffer-scrollback-size s) kiln-eglot-events-buffer-size)))

(add-to-list 'eglot-server-programs '(kiln-mode . (kiln-eglot-server "kiln" "serve")))

(defun kiln-eglot--own-hints-p ()
  "Non-nil if kiln-eglot shows inlay hints itself (eglot has none)."
  (and kiln-eglot-inlay-hints (not (fboundp 'eglot-inlay-hints-mode))))

(cl-defmethod eglot-client-capabilities ((_s kiln-eglot-server))
  "Add the inlay-hint capability when kiln-eglot shows the hints."
  (let ((caps (cl-call-next-method)))
    (when (kiln-eglot--own-hints-p)
      (setq caps (plist-put caps :textDocument
                            (plist-put (copy-sequence (plist-get caps :textDocument))
                                       :inlayHint '(:dynamicRegistration :json-false))))
      (setq caps (plist-put caps :workspace
                            (plist-put (copy-sequence (plist-get caps :workspace))
                                       :inlayHint '(:refreshSupport t)))))
    caps))

;;;; Inlay hints shown as overlays

(defvar-local kiln-eglot--hint-timer nil
  "Pending refresh of this buffer's inlay hints.")

(defun kiln-eglot--visible-region ()
  "The part of the current buffer shown in windows, as (BEG . END), or nil."
  (let (beg end)
    (dolist (w (get-buffer-window-list nil nil t))
      ;; From the window start, as many lines as the window has: cheap, and
      ;; right also where redisplay has not run (batch).  Where the window's
      ;; point lies outside that (batch again: no redisplay follows it), the
      ;; lines around point, as redisplay would show them.
      (let* ((h (window-body-height w))
             (s (window-start w))
             (e (save-excursion
                  (goto-char s)
                  (forward-line (1+ h))
                  (point)))
             (p (window-point w)))
        (unless (and (<= s p) (<= p e))
          (save-excursion
            (goto-char p)
            (forward-line (- (/ h 2)))
            (setq s (point))
            (forward-line (1+ h))
            (setq e (point))))
        (setq beg (if beg (min beg s) s)
              end (if end (max end e) e))))
    (and beg (cons beg end))))

(defun kiln-eglot--label (label)
  "The text of an inlay-hint LABEL (a string or a vector of parts)."
  (if (stringp label)
      label
    (mapconcat (lambda (part) (or (plist-get part :value) "")) label "")))

(defun kiln-eglot--clear-hints ()
  "Remove the inlay-hint overlays of the current buffer."
  (remove-overlays (point-min) (point-max) 'kiln-eglot-hint t))

(defun kiln-eglot--render-hints (hints)
  "Show HINTS (a vector of LSP InlayHint) as overlays in the current buffer."
  (kiln-eglot--clear-hints)
  (let ((points (kiln-eglot--points (mapcar (lambda (h) (plist-get h :position)) hints))))
    (seq-doseq (h hints)
      (let* ((pos (gethash (plist-get h :position) points))
             (ov (make-overlay pos pos nil t nil)))
        (overlay-put ov 'kiln-eglot-hint t)
        (overlay-put ov 'after-string
                     (propertize (concat "  " (kiln-eglot--label (plist-get h :label)))
                                 'face 'kiln-inlay-hint))))))

(defun kiln-eglot--drop-stale-hints (beg end _len)
  "Remove the inlay hints of the lines BEG..END just changed; ask again.
A hint describes its line as the server last analysed it.  Left in place,
text typed at the end of a line would land after it.  The request waits
for the change to reach the server (it is deferred), and a publication
after the analysis refreshes the hints again."
  (let ((from (save-excursion (goto-char beg) (line-beginning-position)))
        (to (save-excursion (goto-char end) (min (point-max) (1+ (line-end-position))))))
    (dolist (ov (overlays-in from to))
      (when (overlay-get ov 'kiln-eglot-hint)
        (delete-overlay ov))))
  (kiln-eglot--schedule-hints (current-buffer) 0.3))

(defun kiln-eglot-refresh-hints (&optional buffer)
  "Ask the server for the inlay hints of the visible part of BUFFER; show them."
  (interactive)
  (with-current-buffer (or buffer (current-buffer))
    (let ((server (and (bound-and-true-p eglot--managed-mode) (eglot-current-server)))
          (region (kiln-eglot--visible-region))
          (buf (current-buffer))
          (tick (buffer-chars-modified-tick)))
      (when (and server (cl-typep server 'kiln-eglot-server) region
                 (kiln-eglot--own-hints-p))
        (jsonrpc-async-request
         server :textDocument/inlayHint
         (list :textDocument (eglot--TextDocumentIdentifier)
               :range (list :start (eglot--pos-to-lsp-position (car region))
                            :end (eglot--pos-to-lsp-position (cdr region))))
         :success-fn (lambda (hints)
                       (when (buffer-live-p buf)
                         (with-current-buffer buf
                           ;; A later edit asks again once analysed.
                           (when (= tick (buffer-chars-modified-tick))
                             (kiln-eglot--render-hints hints)))))
         :error-fn #'ignore
         :timeout-fn #'ignore
         :deferred 'kiln-eglot-inlay-hints)))))

(defun kiln-eglot--schedule-hints (&optional buffer delay)
  "Refresh BUFFER's inlay hints after DELAY seconds (default 0.1)."
  (with-current-buffer (or buffer (current-buffer))
    (when (timerp kiln-eglot--hint-timer)
      (cancel-timer kiln-eglot--hint-timer))
    (let ((buf (current-buffer)))
      (setq kiln-eglot--hint-timer
            (run-with-timer (or delay 0.1) nil
                            (lambda ()
                              (when (buffer-live-p buf)
                                (with-current-buffer buf
                                  (setq kiln-eglot--hint-timer nil))
                                (kiln-eglot-refresh-hints buf))))))))

(defvar kiln-eglot--todo)
(defvar kiln-eglot--render-timer)
(defvar kiln-eglot--diags)
(defvar kiln-eglot--diag-lines)
(defvar kiln-eglot--diags-tick)
(defvar kiln-eglot--shown)
(defvar kiln-eglot--paused)

(defvar-local kiln-eglot--scroll-timer nil
  "Pending display of the diagnostics of lines scrolled into view.")

(defun kiln-eglot--on-scroll (win _start)
  "Refresh the hints of WIN's buffer after a scroll.
Diagnostics not yet handed to Flymake are shown for the new lines."
  (with-current-buffer (window-buffer win)
    (when (kiln-eglot--own-hints-p)
      (kiln-eglot--schedule-hints))
    (when (and kiln-eglot--todo (not (timerp kiln-eglot--scroll-timer)))
      (let ((buf (current-buffer)))
        (setq kiln-eglot--scroll-timer
              (run-with-timer
               0.05 nil
               (lambda ()
                 (when (buffer-live-p buf)
                   (with-current-buffer buf
                     (setq kiln-eglot--scroll-timer nil)
                     (when (and kiln-eglot--todo (kiln-eglot--current-p))
                       (kiln-eglot--render-visible)))))))))))

(defvar-local kiln-eglot--set-idle-time nil
  "Non-nil if kiln-eglot set `eglot-send-changes-idle-time' in this buffer.")

(defun kiln-eglot--managed ()
  "Set up or tear down kiln's parts as eglot starts or stops managing a buffer."
  (when (derived-mode-p 'kiln-mode)
    (if (and (bound-and-true-p eglot--managed-mode)
             (cl-typep (eglot-current-server) 'kiln-eglot-server))
        (progn
          (when kiln-eglot-send-changes-idle-time
            (setq-local eglot-send-changes-idle-time kiln-eglot-send-changes-idle-time)
            (setq kiln-eglot--set-idle-time t))
          (add-hook 'window-scroll-functions #'kiln-eglot--on-scroll nil t)
          (when (kiln-eglot--own-hints-p)
            (add-hook 'after-change-functions #'kiln-eglot--drop-stale-hints nil t)
            (kiln-eglot--schedule-hints)))
      (remove-hook 'window-scroll-functions #'kiln-eglot--on-scroll t)
      (remove-hook 'after-change-functions #'kiln-eglot--drop-stale-hints t)
      (when kiln-eglot--set-idle-time
        (kill-local-variable 'eglot-send-changes-idle-time)
        (setq kiln-eglot--set-idle-time nil))
      (dolist (timer (list kiln-eglot--render-timer kiln-eglot--scroll-timer))
        (when (timerp timer) (cancel-timer timer)))
      (setq kiln-eglot--render-timer nil
            kiln-eglot--scroll-timer nil
            kiln-eglot--todo nil
            kiln-eglot--diags nil
            kiln-eglot--diag-lines nil
            kiln-eglot--diags-tick nil
            kiln-eglot--shown nil
            kiln-eglot--paused nil)
      (kiln-eglot--clear-hints))))

(add-hook 'eglot-managed-mode-hook #'kiln-eglot--managed)

;;;; Diagnostics of large files

(defun kiln-eglot--fast-diagnostics-p ()
  "Non-nil if this eglot's diagnostics internals are the ones handled here.
That is eglot 1.9 and its kind (no inlay hints of its own)."
  (and (not (fboundp 'eglot-inlay-hints-mode))
       (fboundp 'eglot--report-to-flymake)
       (fboundp 'eglot--make-diag)
       (boundp 'eglot--current-flymake-report-fn)
       (boundp 'eglot--diagnostics)))

(defun kiln-eglot--points (positions)
  "Buffer positions of the LSP POSITIONS (a list of plists), in one pass.
Returns a hash table from each plist (by `eq') to its point."
  (let ((out (make-hash-table :test #'eq :size (length positions)))
        (sorted (sort (copy-sequence positions)
                      (lambda (a b) (< (plist-get a :line) (plist-get b :line)))))
        (line 0)
        ;; Columns count characters on printable ASCII (and tabs) in both
        ;; of eglot's own conversions: there, no conversion is needed.
        (ascii-ok (memq eglot-move-to-column-function
                        '(eglot-move-to-lsp-abiding-column eglot-move-to-column))))
    (save-excursion
      (save-restriction
        (widen)
        (goto-char (point-min))
        (dolist (p sorted)
          (let ((want (plist-get p :line)))
            (when (> want line)
              (let ((short (forward-line (- want line))))
                ;; -1: the buffer ended first.
                (setq line (if (and (= short 0) (bolp)) want -1))))
            (let ((bol (point)))
              (if (< line 0)
                  (puthash p (point-max) out)
                (let* ((tab-width 1)
                       (col (plist-get p :character))
                       (col (if (wholenump col) col 0))
                       (stop (min (line-end-position) (+ bol col))))
                  (unless (and ascii-ok
                               (= stop (progn (skip-chars-forward "\t -~" stop) (point))))
                    (goto-char bol)
                    (funcall eglot-move-to-column-function col))
                  (puthash p (point) out)
                  (goto-char bol))))))))
    out))

(defun kiln-eglot--diag-type (severity)
  "The Flymake type of an LSP SEVERITY."
  (cond ((null severity) 'eglot-error)
        ((<= severity 1) 'eglot-error)
        ((= severity 2) 'eglot-warning)
        (t 'eglot-note)))

;; Flymake draws an overlay per diagnostic, and a publication replaces them
;; all: on a file with thousands of diagnostics that blocks Emacs for a
;; large part of a second per publication, and eglot 1.9 does it twice per
;; edit (once when Flymake starts its idle check, with the diagnostics of
;; the text before the edit, and once when the new ones arrive).  For the
;; kiln server the diagnostics are handed to Flymake a part of the buffer
;; at a time (the `:region' of a Flymake report): first the lines shown in
;; windows, at once; then the rest in blocks of
;; `kiln-eglot-diagnostics-chunk-lines' lines from timers, each yielding to
;; pending input, and only while the buffer is the text they describe.
;; Flymake's idle check does not re-send old diagnostics when the buffer
;; has changed since they came: the server's answer to the change follows.

(defvar-local kiln-eglot--diags nil
  "Diagnostics of the latest publication: a vector of LSP diagnostics by line.")

(defvar-local kiln-eglot--diag-lines nil
  "Start line of each element of `kiln-eglot--diags' (a vector).")

(defvar-local kiln-eglot--diags-tick nil
  "`buffer-chars-modified-tick' when `kiln-eglot--diags' arrived.")

(defvar-local kiln-eglot--inner-lines nil
  "Lines (hash) inside a multi-line diagnostic: no block starts there.")

(defvar-local kiln-eglot--todo nil
  "Line blocks (A . B) of `kiln-eglot--diags' not yet handed to Flymake.")

(defvar-local kiln-eglot--render-timer nil
  "Timer handing the next block of diagnostics to Flymake.")

(defvar-local kiln-eglot--shown nil
  "Non-nil once `kiln-eglot--diags' have been handed to Flymake (or are being).")

(defvar-local kiln-eglot--paused nil
  "(TICK . TIME): blocks wait since TIME for the text to stay at TICK.")

(defconst kiln-eglot--resume-after 1.5
  "Seconds the text must stay unchanged before waiting blocks are shown.
The server sends no publication when an analysis finds the diagnostics
it sent last: then these are the diagnostics of the text as it is.")

(defun kiln-eglot--own-diagnostics-p ()
  "Non-nil if the current buffer's diagnostics go through kiln-eglot."
  (and (kiln-eglot--fast-diagnostics-p)
       (bound-and-true-p eglot--managed-mode)
       (cl-typep (eglot-current-server) 'kiln-eglot-server)))

(defun kiln-eglot--bol (line)
  "Position of the start of 0-based LINE, or `point-max' past the end."
  (save-excursion
    (save-restriction
      (widen)
      (goto-char (point-min))
      (if (and (= 0 (forward-line line)) (bolp)) (point) (point-max)))))

(defun kiln-eglot--line-count ()
  "Lines of the widened buffer (a final line without newline counts)."
  (save-restriction
    (widen)
    (line-number-at-pos (point-max))))

(defun kiln-eglot--snap (line up)
  "LINE, or the nearest block boundary after (UP) or before it.
No diagnostic of `kiln-eglot--diags' crosses a block boundary, so each
block's diagnostics lie inside the block's region and no other block's
report deletes them."
  (while (and (> line 0) (gethash line kiln-eglot--inner-lines))
    (setq line (if up (1+ line) (1- line))))
  line)

(defun kiln-eglot--visible-lines (nlines)
  "The 0-based lines (A . B), B excluded, shown in windows, snapped."
  (let ((region (kiln-eglot--visible-region)))
    (if (null region)
        (cons 0 0)
      (cons (kiln-eglot--snap (1- (line-number-at-pos (car region) t)) nil)
            (min nlines (kiln-eglot--snap (line-number-at-pos (cdr region) t) t))))))

(defun kiln-eglot--first-at-or-after (line)
  "Index of the first element of `kiln-eglot--diags' on LINE or later."
  (let ((lo 0) (hi (length kiln-eglot--diag-lines)))
    (while (< lo hi)
      (let ((mid (/ (+ lo hi) 2)))
        (if (< (aref kiln-eglot--diag-lines mid) line)
            (setq lo (1+ mid))
          (setq hi mid))))
    lo))

(defun kiln-eglot--make-diags (diagnostics)
  "Flymake diagnostics of the list of LSP DIAGNOSTICS."
  (let* ((positions nil)
         (_ (dolist (d diagnostics)
              (let ((range (plist-get d :range)))
                (push (plist-get range :start) positions)
                (push (plist-get range :end) positions))))
         (points (kiln-eglot--points positions)))
    (cl-loop
     for d in diagnostics
     collect
     (let* ((range (plist-get d :range))
            (beg (gethash (plist-get range :start) points))
            (end (gethash (plist-get range :end) points))
            (code (plist-get d :code))
            (msg (concat (plist-get d :source)
                         (and code (format " [%s]" code))
                         ": " (plist-get d :message))))
       (when (>= beg end)
         (let* ((st (plist-get range :start))
                (region (flymake-diag-region
                         (current-buffer) (1+ (plist-get st :line))
                         (plist-get st :character))))
           (if region
               (setq beg (car region) end (cdr region))
             (save-excursion
               (goto-char beg)
               (setq beg (line-beginning-position)
                     end (line-end-position))))))
       (eglot--make-diag (current-buffer) beg end
                         (kiln-eglot--diag-type (plist-get d :severity))
                         msg `((eglot-lsp-diag . ,d)))))))

(defun kiln-eglot--render-block (block nlines)
  "Hand the diagnostics of the line BLOCK (A . B) to Flymake.
NLINES is the buffer's line count: the last block also takes what lies
beyond it."
  (let* ((a (car block))
         (b (cdr block))
         (last (>= b nlines))
         (i (kiln-eglot--first-at-or-after a))
         (n (length kiln-eglot--diags))
         (in nil))
    (while (and (< i n) (or last (< (aref kiln-eglot--diag-lines i) b)))
      (push (aref kiln-eglot--diags i) in)
      (setq i (1+ i)))
    (save-restriction
      (widen)
      (funcall eglot--current-flymake-report-fn
               (kiln-eglot--make-diags (nreverse in))
               :region (cons (kiln-eglot--bol a)
                             (if last (point-max) (kiln-eglot--bol b)))))))

(defun kiln-eglot--plan (visible nlines)
  "Blocks of `kiln-eglot-diagnostics-chunk-lines' lines covering NLINES
lines outside the block VISIBLE, in order, snapped."
  (let ((size (max 1 kiln-eglot-diagnostics-chunk-lines))
        (out nil)
        (a 0))
    (while (< a nlines)
      (if (and (< (car visible) (cdr visible)) (= a (car visible)))
          (setq a (cdr visible))
        (let ((b (min nlines (kiln-eglot--snap (+ a size) t))))
          (when (and (< (car visible) (cdr visible)) (< a (car visible)) (> b (car visible)))
            (setq b (car visible)))
          (push (cons a b) out)
          (setq a b))))
    (nreverse out)))

(defun kiln-eglot--current-p ()
  "Non-nil if the stored diagnostics describe the buffer's text as it is."
  (and kiln-eglot--diags-tick
       (= kiln-eglot--diags-tick (buffer-chars-modified-tick))))

(defun kiln-eglot--render-visible ()
  "Hand the diagnostics of the lines shown in windows to Flymake now."
  (when (and kiln-eglot--diags eglot--current-flymake-report-fn)
    (let* ((nlines (kiln-eglot--line-count))
           (visible (kiln-eglot--visible-lines nlines)))
      (when (< (car visible) (cdr visible))
        (kiln-eglot--render-block visible nlines))
      visible)))

(defun kiln-eglot--render-rest (buffer)
  "Hand the next block of BUFFER's diagnostics to Flymake; schedule the next."
  (when (buffer-live-p buffer)
    (with-current-buffer buffer
      (setq kiln-eglot--render-timer nil)
      (cond
       ((or (null kiln-eglot--todo) (null eglot--current-flymake-report-fn))
        (setq kiln-eglot--todo nil))
       ((not (kiln-eglot--current-p))
        ;; The text moved on.  A publication for it restarts the blocks;
        ;; if none comes, the server found the same diagnostics, which then
        ;; describe the text once it has stayed as it is for a while.
        (let ((tick (buffer-chars-modified-tick)))
          (cond
           ((not (eql (car kiln-eglot--paused) tick))
            (setq kiln-eglot--paused (cons tick (float-time)))
            (kiln-eglot--schedule-rest 0.5))
           ((< (- (float-time) (cdr kiln-eglot--paused)) kiln-eglot--resume-after)
            (kiln-eglot--schedule-rest 0.5))
           (t
            (setq kiln-eglot--diags-tick tick
                  kiln-eglot--paused nil)
            (kiln-eglot--schedule-rest 0.01)))))
       ((input-pending-p)
        (kiln-eglot--schedule-rest 0.05))
       (t
        (condition-case err
            (kiln-eglot--with-gc-threshold
              (kiln-eglot--render-block (pop kiln-eglot--todo) (kiln-eglot--line-count)))
          ;; Flymake refuses the report (turned off, or a newer check
          ;; started without eglot's backend): the next check shows them.
          (error
           (setq kiln-eglot--todo nil
                 kiln-eglot--shown nil)
           (message "kiln-eglot: diagnostics not shown: %s" (error-message-string err))))
        (when kiln-eglot--todo
          (kiln-eglot--schedule-rest 0.01)))))))

(defconst kiln-eglot--block-idle 0.15
  "Idle seconds before a block of diagnostics outside the windows is shown.
Keys typed faster than this are never held up by those blocks.")

(defun kiln-eglot--schedule-rest (delay)
  "Run `kiln-eglot--render-rest' for the current buffer after DELAY seconds.
Interactively only once Emacs has been idle `kiln-eglot--block-idle'
seconds (counted on, when idle already); in batch after DELAY."
  (when (timerp kiln-eglot--render-timer)
    (cancel-timer kiln-eglot--render-timer))
  (setq kiln-eglot--render-timer
        (if noninteractive
            (run-with-timer delay nil #'kiln-eglot--render-rest (current-buffer))
          (let ((idle (current-idle-time)))
            (run-with-idle-timer
             (if idle
                 (time-add idle (max delay (- kiln-eglot--block-idle (float-time idle))))
               (max delay kiln-eglot--block-idle))
             nil #'kiln-eglot--render-rest (current-buffer))))))

(defun kiln-eglot--show-diagnostics ()
  "Hand the stored diagnostics to Flymake: visible lines now, the rest later."
  (when (and kiln-eglot--diags eglot--current-flymake-report-fn)
    (setq kiln-eglot--shown t)
    (let* ((nlines (kiln-eglot--line-count))
           (visible (or (kiln-eglot--render-visible) (cons 0 0))))
      (setq kiln-eglot--todo (kiln-eglot--plan visible nlines))
      (if kiln-eglot--todo
          (kiln-eglot--schedule-rest 0.01)
        (when (timerp kiln-eglot--render-timer)
          (cancel-timer kiln-eglot--render-timer))))))

(defun kiln-eglot--store-diagnostics (diagnostics)
  "Keep the vector of LSP DIAGNOSTICS, by line, as the buffer's latest."
  (let* ((sorted (sort (append diagnostics nil)
                       (lambda (x y)
                         (< (plist-get (plist-get (plist-get x :range) :start) :line)
                            (plist-get (plist-get (plist-get y :range) :start) :line)))))
         (inner (make-hash-table :test #'eql)))
    (dolist (d sorted)
      (let* ((range (plist-get d :range))
             (l0 (plist-get (plist-get range :start) :line))
             (end (plist-get range :end))
             (l1 (if (> (plist-get end :character) 0)
                     (plist-get end :line)
                   (1- (plist-get end :line)))))
        (cl-loop for l from (1+ l0) to l1 do (puthash l t inner))))
    (setq kiln-eglot--diags (vconcat sorted)
          kiln-eglot--diag-lines
          (vconcat (mapcar (lambda (d) (plist-get (plist-get (plist-get d :range) :start) :line))
                           sorted))
          kiln-eglot--inner-lines inner
          kiln-eglot--diags-tick (buffer-chars-modified-tick)
          kiln-eglot--shown nil
          kiln-eglot--paused nil
          kiln-eglot--todo nil)))

(cl-defmethod eglot-handle-notification
  ((server kiln-eglot-server) (method (eql textDocument/publishDiagnostics))
   &rest args &key uri diagnostics &allow-other-keys)
  "Keep DIAGNOSTICS for URI and hand them to Flymake, visible lines first."
  (let ((buffer (find-buffer-visiting (eglot--uri-to-path uri))))
    (if (not (and buffer (kiln-eglot--fast-diagnostics-p)))
        (apply #'cl-call-next-method server method args)
      (with-current-buffer buffer
        (kiln-eglot--store-diagnostics diagnostics)
        (when (and flymake-no-changes-timeout eglot--current-flymake-report-fn)
          (kiln-eglot--show-diagnostics))))))

(defun kiln-eglot--flymake-backend (fn report-fn &rest more)
  "Around `eglot-flymake-backend' (FN, REPORT-FN, MORE) in kiln buffers.
Diagnostics not yet shown are shown.  Otherwise Flymake's check changes
nothing: the diagnostics shown move with the text, and the server's
answer to a change (if it changes them) follows as a publication.  The
empty report only tells Flymake that the check is answered: its region
lies before the buffer, so that no diagnostic shown is removed."
  (if (not (kiln-eglot--own-diagnostics-p))
      (apply fn report-fn more)
    (setq eglot--current-flymake-report-fn report-fn)
    (if (and kiln-eglot--diags (not kiln-eglot--shown) (kiln-eglot--current-p))
        (kiln-eglot--show-diagnostics)
      (funcall report-fn nil :region (cons 0 0)))))

(advice-add 'eglot-flymake-backend :around #'kiln-eglot--flymake-backend)

(cl-defmethod eglot-handle-notification :after
  ((_server kiln-eglot-server) (_method (eql textDocument/publishDiagnostics))
   &key uri &allow-other-keys)
  "A publication means a finished analysis: refresh the hints of URI's buffer."
  (when (kiln-eglot--own-hints-p)
    (when-let ((buf (find-buffer-visiting (eglot--uri-to-path uri))))
      (kiln-eglot--schedule-hints buf 0.05))))

(cl-defmethod eglot-handle-request
  ((server kiln-eglot-server) (_method (eql workspace/inlayHint/refresh)) &rest _)
  "Refresh the hints of every buffer SERVER manages."
  (dolist (buf (eglot--managed-buffers server))
    (kiln-eglot--schedule-hints buf))
  nil)


;;;; Equilibrium and flame temperature

(defcustom kiln-equilibrium-default-mix nil
  "Mixture offered by `kiln-equilibrium', e.g. \"CH4:1, O2:2, N2:7.52\"."
  :type '(choice (const :tag "None" nil) string))

(defcustom kiln-equilibrium-temperature 298.15
  "Initial temperature (K) of the mixture for `kiln-equilibrium'."
  :type 'number)

(defcustom kiln-equilibrium-pressure "1atm"
  "Initial pressure for `kiln-equilibrium', a number with its unit (1atm, 10bar)."
  :type 'string)

(defcustom kiln-equilibrium-adiabatic t
  "Non-nil: `kiln-equilibrium' finds the adiabatic (flame) temperature.
nil holds the temperature."
  :type 'boolean)

(defcustom kiln-equilibrium-volume nil
  "Non-nil: `kiln-equilibrium' holds the volume instead of the pressure."
  :type 'boolean)

(defvar kiln-equilibrium-history nil
  "Mixtures given to `kiln-equilibrium'.")

(defconst kiln-equilibrium-buffer-name "*kiln equilibrium*"
  "Name of the buffer showing `kiln-equilibrium' results.")

(defun kiln-eglot--error-message (err)
  "The server's message in the jsonrpc error ERR (condition data)."
  (or (cl-loop for x in (cdr err)
               when (and (consp x) (eq (car x) 'jsonrpc-error-message))
               return (cdr x))
      (error-message-string err)))

(defun kiln-eglot--show-equilibrium (mix answer)
  "Show ANSWER of kiln.equilibrium for MIX in `kiln-equilibrium-buffer-name'.
Returns the buffer."
  (let ((buf (get-buffer-create kiln-equilibrium-buffer-name)))
    (with-current-buffer buf
      (let ((inhibit-read-only t))
        (erase-buffer)
        (insert "mix: " mix "\n" (or (plist-get answer :text) ""))
        (seq-doseq (w (or (plist-get answer :warnings) []))
          (insert "note: " w "\n")))
      (goto-char (point-min))
      (special-mode))
    (display-buffer buf)
    buf))

(defun kiln-equilibrium (mix)
  "Show the equilibrium of MIX over the species of the current kiln buffer.
MIX is \"NAME:AMOUNT, NAME:AMOUNT, ...\" with the species names of the file.
The species and their thermochemistry are the file's (as the language
server last analysed it).  The initial state and constraint come from
`kiln-equilibrium-temperature', `kiln-equilibrium-pressure',
`kiln-equilibrium-adiabatic' and `kiln-equilibrium-volume'.  The result,
as `kiln equilibrium' prints it, goes to the buffer *kiln equilibrium*."
  (interactive
   (list (read-string (if kiln-equilibrium-default-mix
                          (format "Mixture (default %s): " kiln-equilibrium-default-mix)
                        "Mixture (NAME:AMOUNT, ...): ")
                      nil 'kiln-equilibrium-history kiln-equilibrium-default-mix)))
  (let ((server (and (bound-and-true-p eglot--managed-mode) (eglot-current-server))))
    (unless (cl-typep server 'kiln-eglot-server)
      (user-error "kiln: no kiln language server manages this buffer (M-x eglot)"))
    (let* ((args (list :uri (plist-get (eglot--TextDocumentIdentifier) :uri)
                       :mix mix
                       :temperature kiln-equilibrium-temperature
                       :pressure kiln-equilibrium-pressure
                       :adiabatic (if kiln-equilibrium-adiabatic t :json-false)
                       :volume (if kiln-equilibrium-volume t :json-false)))
           (answer (condition-case err
                       (jsonrpc-request server :workspace/executeCommand
                                        (list :command "kiln.equilibrium" :arguments (vector args)))
                     (jsonrpc-error
                      (user-error "kiln: %s" (kiln-eglot--error-message err))))))
      (kiln-eglot--show-equilibrium mix answer))))

(provide 'kiln-eglot)
;;; kiln-eglot.el ends here
