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
;;   (`kiln-eglot-events-buffer-size').
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

(defclass kiln-eglot-server (eglot-lsp-server) ()
  :documentation "The kiln language server (`kiln serve').")

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
      ;; right also where redisplay has not run (batch).
      (let* ((s (window-start w))
             (e (save-excursion
                  (goto-char s)
                  (forward-line (1+ (window-body-height w)))
                  (point))))
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

(defun kiln-eglot--on-scroll (win _start)
  "Refresh the hints of WIN's buffer after a scroll."
  (kiln-eglot--schedule-hints (window-buffer win)))

(defun kiln-eglot--managed ()
  "Set up or tear down inlay hints as eglot starts or stops managing a buffer."
  (when (derived-mode-p 'kiln-mode)
    (if (and (bound-and-true-p eglot--managed-mode)
             (cl-typep (eglot-current-server) 'kiln-eglot-server)
             (kiln-eglot--own-hints-p))
        (progn
          (add-hook 'window-scroll-functions #'kiln-eglot--on-scroll nil t)
          (kiln-eglot--schedule-hints))
      (remove-hook 'window-scroll-functions #'kiln-eglot--on-scroll t)
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
        (line 0))
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
                (let ((tab-width 1)
                      (col (plist-get p :character)))
                  (funcall eglot-move-to-column-function (if (wholenump col) col 0))
                  (puthash p (point) out)
                  (goto-char bol))))))))
    out))

(defun kiln-eglot--diag-type (severity)
  "The Flymake type of an LSP SEVERITY."
  (cond ((null severity) 'eglot-error)
        ((<= severity 1) 'eglot-error)
        ((= severity 2) 'eglot-warning)
        (t 'eglot-note)))

(cl-defmethod eglot-handle-notification
  ((server kiln-eglot-server) (method (eql textDocument/publishDiagnostics))
   &rest args &key uri diagnostics &allow-other-keys)
  "Publish DIAGNOSTICS for URI to Flymake, converting positions in one pass.
Does what eglot 1.9 does, in time linear in the buffer and the diagnostics."
  (let ((buffer (find-buffer-visiting (eglot--uri-to-path uri))))
    (if (not (and buffer (kiln-eglot--fast-diagnostics-p)))
        (apply #'cl-call-next-method server method args)
      (with-current-buffer buffer
        (let* ((positions nil)
               (_ (seq-doseq (d diagnostics)
                    (let ((range (plist-get d :range)))
                      (push (plist-get range :start) positions)
                      (push (plist-get range :end) positions))))
               (points (kiln-eglot--points positions))
               (diags
                (cl-loop
                 for d across diagnostics
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
          (if (and flymake-no-changes-timeout eglot--current-flymake-report-fn)
              (eglot--report-to-flymake diags)
            (setq eglot--diagnostics diags)))))))

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
