;;; kiln-eglot-test.el --- eglot integration tests for kiln-mode  -*- lexical-binding: t; -*-

;;; Commentary:
;; Skipped when eglot cannot be loaded.  The live test also needs the
;; environment variable KILN_BINARY naming the kiln binary, and
;; KILN_FIXTURE naming a file with an undeclared species.

;;; Code:

(require 'ert)
(require 'kiln-mode)
(require 'package)

(defun kiln-eglot-test--load ()
  "Load eglot, from Emacs itself or from an installed package; non-nil on success."
  (or (featurep 'eglot)
      (progn
        (unless package--initialized
          ;; Debian's elpa-* packages; `emacs -Q' does not list them.
          (dolist (d '("/usr/share/emacs/site-lisp/elpa"))
            (when (file-directory-p d)
              (add-to-list 'package-directory-list d)))
          (package-initialize))
        (require 'eglot nil t))))

(defvar eglot-server-programs)
(declare-function eglot "eglot")
(declare-function eglot-current-server "eglot")
(declare-function eglot-shutdown "eglot")
(declare-function eglot--guess-contact "eglot")
(declare-function eglot--TextDocumentPositionParams "eglot")
(declare-function jsonrpc-request "jsonrpc")
(declare-function eglot--signal-textDocument/didChange "eglot")

(ert-deftest kiln-eglot-server-registered ()
  (skip-unless (kiln-eglot-test--load))
  (should (featurep 'kiln-eglot))
  (should (equal (cdr (assoc 'kiln-mode eglot-server-programs))
                 '(kiln-eglot-server "kiln" "serve"))))

(defun kiln-eglot-test--wait (pred seconds)
  "Process events until PRED holds or SECONDS pass; return PRED's value."
  (let ((deadline (+ (float-time) seconds))
        value)
    (while (and (not (setq value (funcall pred)))
                (< (float-time) deadline))
      (accept-process-output nil 0.05))
    value))

(ert-deftest kiln-eglot-live-diagnostics-and-hover ()
  (skip-unless (kiln-eglot-test--load))
  (let ((binary (getenv "KILN_BINARY"))
        (fixture (getenv "KILN_FIXTURE")))
    (skip-unless (and binary (not (string-empty-p binary)) fixture))
    (let* ((dir (make-temp-file "kiln-eglot" t))
           (file (expand-file-name "fixture.kiln" dir))
           (eglot-server-programs (cons `(kiln-mode . (kiln-eglot-server ,binary "serve"))
                                        eglot-server-programs))
           (buf nil))
      (unwind-protect
          (progn
            (copy-file fixture file)
            (setq buf (find-file-noselect file))
            ;; Shown in the (batch) frame's window: hints are asked for the
            ;; visible part of the buffer.
            (switch-to-buffer buf)
            (with-current-buffer buf
              (should (eq major-mode 'kiln-mode))
              (apply #'eglot (eglot--guess-contact))
              (should (kiln-eglot-test--wait #'eglot-current-server 20))
              ;; Diagnostics arrive through flymake. Batch Emacs runs no
              ;; command loop, so start flymake's check by hand (once a
              ;; second until the diagnostic shows up).
              (let* ((tick 0)
                     (diag (kiln-eglot-test--wait
                           (lambda ()
                             (when (= 0 (% tick 20))
                               (flymake-start))
                             (setq tick (1+ tick))
                             (seq-find (lambda (d)
                                         (string-match-p "HO2" (flymake-diagnostic-text d)))
                                       (flymake-diagnostics)))
                           20)))
                (should diag)
                (should (= (line-number-at-pos (flymake-diagnostic-beg diag)) 4)))
              ;; Hover on the species name.
              (goto-char (point-min))
              (search-forward "species ethanol")
              (backward-char 3)
              (let* ((res (jsonrpc-request (eglot-current-server) :textDocument/hover
                                           (eglot--TextDocumentPositionParams)))
                     (contents (plist-get res :contents))
                     (text (if (stringp contents) contents (format "%S" contents))))
                (should (or (string-match-p "ΔHf" text) (string-match-p "kJ/mol\\|kcal/mol" text))))
              ;; Inlay hints: native where eglot has them, else overlays.
              (if (fboundp 'eglot-inlay-hints-mode)
                  (ert-pass)
                (let ((caps (eglot-client-capabilities (eglot-current-server))))
                  (should (plist-get (plist-get caps :textDocument) :inlayHint)))
                (let ((hint (kiln-eglot-test--wait
                             (lambda ()
                               (seq-find
                                (lambda (ov)
                                  (and (overlay-get ov 'kiln-eglot-hint)
                                       (string-match-p "ΔHf" (overlay-get ov 'after-string))
                                       (save-excursion
                                         (goto-char (overlay-start ov))
                                         ;; At the end of the ethane line (no thermo data).
                                         (and (eolp)
                                              (string-match-p
                                               "^species ethane "
                                               (buffer-substring (line-beginning-position)
                                                                 (line-end-position)))))))
                                (overlays-in (point-min) (point-max))))
                             20)))
                  (should hint)
                  ;; Text typed at the end of that line: the stale hint goes
                  ;; at once (else the text would land after it) and comes
                  ;; back after the text once the server has analysed it.
                  (goto-char (overlay-start hint))
                  (insert "  # typed")
                  (eglot--signal-textDocument/didChange) ; batch: no idle time to send it
                  (should-not (seq-find (lambda (ov) (overlay-get ov 'kiln-eglot-hint))
                                        (overlays-in (line-beginning-position)
                                                     (min (point-max) (1+ (line-end-position))))))
                  (should (kiln-eglot-test--wait
                           (lambda ()
                             (seq-find (lambda (ov)
                                         (overlay-get ov 'kiln-eglot-hint))
                                       (overlays-in (line-beginning-position)
                                                    (min (point-max) (1+ (line-end-position))))))
                           20))))))
        (when buf
          (with-current-buffer buf
            (when (eglot-current-server)
              (eglot-shutdown (eglot-current-server))))
          (kill-buffer buf))
        (delete-directory dir t)))))

(declare-function kiln-equilibrium "kiln-eglot")

(ert-deftest kiln-eglot-live-equilibrium ()
  ;; M-x kiln-equilibrium on a file of combustion products: the buffer
  ;; *kiln equilibrium* shows the mixture and exactly what `kiln
  ;; equilibrium' prints for it; a mistake is a user-error with the
  ;; server's message.
  (skip-unless (kiln-eglot-test--load))
  (let ((binary (getenv "KILN_BINARY"))
        (fixture (getenv "KILN_FIXTURE")))
    (skip-unless (and binary (not (string-empty-p binary)) fixture))
    (let* ((dir (make-temp-file "kiln-eglot" t))
           (file (expand-file-name "flame.kiln" dir))
           (eglot-server-programs (cons `(kiln-mode . (kiln-eglot-server ,binary "serve"))
                                        eglot-server-programs))
           (mix "CH4:1, O2:2, N2:7.52")
           (buf nil))
      (unwind-protect
          (progn
            (copy-file (expand-file-name "flame.kiln" (file-name-directory fixture)) file)
            (setq buf (find-file-noselect file))
            (switch-to-buffer buf)
            (with-current-buffer buf
              (apply #'eglot (eglot--guess-contact))
              (should (kiln-eglot-test--wait #'eglot-current-server 20))
              (let* ((out (kiln-equilibrium mix))
                     (shown (with-current-buffer out (buffer-string)))
                     (cli (with-temp-buffer
                            (let ((default-directory (file-name-as-directory dir)))
                              (should (= 0 (call-process binary nil t nil "equilibrium" "flame.kiln"
                                                         "--adiabatic" "--mix" mix))))
                            (buffer-string))))
                (should (equal (buffer-name out) "*kiln equilibrium*"))
                (should (get-buffer-window out))
                (should (equal shown (concat "mix: " mix "\n" cli)))
                ;; Stoichiometric methane-air from 298.15 K at 1 atm: about
                ;; 2225 K (common practice).
                (should (string-match "final    T = \\([0-9.]+\\) K" shown))
                (should (< (abs (- (string-to-number (match-string 1 shown)) 2225)) 10)))
              (let ((err (should-error (kiln-equilibrium "CH4:1, XY:2") :type 'user-error)))
                (should (string-match-p "mix species XY is not declared in flame.kiln"
                                        (error-message-string err))))
              (let ((err (should-error (kiln-equilibrium "CH4:1, O2") :type 'user-error)))
                (should (string-match-p "mix item 2 (column 8)" (error-message-string err))))))
        (when buf
          (with-current-buffer buf
            (when (eglot-current-server)
              (eglot-shutdown (eglot-current-server))))
          (kill-buffer buf))
        (delete-directory dir t)))))

(declare-function kiln-eglot--points "kiln-eglot")
(declare-function eglot--lsp-position-to-point "eglot")

(ert-deftest kiln-eglot-positions-in-one-pass-agree-with-eglot ()
  ;; The one-pass conversion used for large diagnostics lists gives the
  ;; points eglot's own conversion gives, also for non-ASCII text, columns
  ;; past the end of a line and lines past the end of the buffer.
  (skip-unless (kiln-eglot-test--load))
  (with-temp-buffer
    (insert "species ethanol CCO   # ΔHf°298 −56.0\n\n  note α and β\n"
            "reaction a => b   A=1 n=0 Ea=0\nlast line without newline")
    (let ((positions nil)
          (seed 7))
      (dotimes (_ 400)
        (setq seed (% (+ (* seed 1103515245) 12345) 2147483648))
        (push (list :line (% seed 8) :character (% (/ seed 8) 40)) positions))
      (let ((points (kiln-eglot--points positions)))
        (dolist (p positions)
          (should (equal (cons p (gethash p points))
                         (cons p (eglot--lsp-position-to-point p)))))))))

(declare-function kiln-bigfile-measure "kiln-bigfile")
(declare-function kiln-bigfile-report "kiln-bigfile")

(ert-deftest kiln-eglot-bigfile-edit ()
  ;; A large generated mechanism: opening shows diagnostics, and an edit of
  ;; one SMILES (and its undo) reaches Flymake.  The limit is generous: the
  ;; test proves the path works; editors/bench.sh prints the real figures.
  (skip-unless (kiln-eglot-test--load))
  (let ((binary (getenv "KILN_BINARY"))
        (big (getenv "KILN_BIG_FILE")))
    (skip-unless (and binary (not (string-empty-p binary)) big (not (string-empty-p big))))
    (require 'kiln-bigfile)
    (let* ((copy (make-temp-file "kiln-big" nil ".kiln")))
      (unwind-protect
          (progn
            (copy-file big copy t)
            (let ((r (kiln-bigfile-measure binary copy 1 120)))
              (kiln-bigfile-report copy r)
              (should (null (plist-get r :failures)))
              (should (= (length (plist-get r :edits)) 2))
              (should (> (plist-get r :diagnostics) 0))
              ;; Handed to Flymake a block at a time: each exactly once.
              (should (= (plist-get r :diagnostics) (plist-get r :published)))))
        (delete-file copy)))))

;; Diagnostics handed to Flymake a block of lines at a time.

(defvar eglot--current-flymake-report-fn)
(defvar kiln-eglot--todo)
(defvar kiln-eglot-diagnostics-chunk-lines)
(declare-function kiln-eglot--store-diagnostics "kiln-eglot")
(declare-function kiln-eglot--show-diagnostics "kiln-eglot")
(declare-function kiln-eglot--flymake-backend "kiln-eglot")
(declare-function kiln-eglot--own-diagnostics-p "kiln-eglot")
(declare-function flymake-diagnostic-beg "flymake")
(declare-function flymake-diagnostic-end "flymake")
(declare-function flymake-diagnostic-text "flymake")

(defun kiln-eglot-test--diag (l0 c0 l1 c1 msg)
  "An LSP diagnostic from L0:C0 to L1:C1 with message MSG."
  (list :range (list :start (list :line l0 :character c0)
                     :end (list :line l1 :character c1))
        :severity 2 :source "kiln" :message msg))

(defun kiln-eglot-test--run-timers (pred seconds)
  "Let timers run until PRED holds or SECONDS pass."
  (let ((deadline (+ (float-time) seconds)))
    (while (and (not (funcall pred)) (< (float-time) deadline))
      (accept-process-output nil 0.01)
      (sit-for 0))
    (funcall pred)))

(ert-deftest kiln-eglot-diagnostics-in-blocks ()
  ;; 1,000 lines, a diagnostic on every third line, some spanning lines
  ;; across where blocks of 50 lines would end, one past the end of the
  ;; buffer: the lines in the window are reported at once, the rest from
  ;; timers; every diagnostic is reported once, inside its report's region;
  ;; the regions do not overlap and cover the buffer.
  (skip-unless (kiln-eglot-test--load))
  (require 'kiln-eglot)
  (with-temp-buffer
    (dotimes (i 1000) (insert (format "species s%d CCO\n" i)))
    (switch-to-buffer (current-buffer))
    (goto-char (point-min))
    (forward-line 500)
    (set-window-start (selected-window) (point))
    (let* ((reports nil)
           (kiln-eglot-diagnostics-chunk-lines 50)
           (eglot--current-flymake-report-fn
            (lambda (diags &rest args)
              (push (cons (plist-get args :region) diags) reports)))
           (lsp (vconcat
                 (cl-loop for l from 0 below 1000 by 3
                          collect (if (= 0 (% l 49))
                                      (kiln-eglot-test--diag l 2 (+ l 3) 4 (format "m%d" l))
                                    (kiln-eglot-test--diag l 8 l 10 (format "m%d" l))))
                 (list (kiln-eglot-test--diag 1200 0 1200 1 "beyond")))))
      (kiln-eglot--store-diagnostics lsp)
      (kiln-eglot--show-diagnostics)
      ;; At once: one report, for the lines around the window start.
      (should (= (length reports) 1))
      (let ((first (car reports))
            (wstart (window-start)))
        (should (<= (car (car first)) wstart))
        (should (> (cdr (car first)) wstart))
        (should (cl-some (lambda (d) (equal (flymake-diagnostic-text d) "kiln: m501"))
                         (cdr first))))
      (should (kiln-eglot-test--run-timers (lambda () (null kiln-eglot--todo)) 10))
      (should (> (length reports) 10))
      (let ((seen (make-hash-table :test #'equal))
            (regions nil))
        (dolist (r reports)
          (push (car r) regions)
          (dolist (d (cdr r))
            (should-not (gethash (flymake-diagnostic-text d) seen))
            (puthash (flymake-diagnostic-text d) t seen)
            (should (<= (car (car r)) (flymake-diagnostic-beg d)))
            (should (or (< (flymake-diagnostic-end d) (cdr (car r)))
                        (= (cdr (car r)) (point-max))))))
        (should (= (hash-table-count seen) (length lsp)))
        (setq regions (sort regions (lambda (a b) (< (car a) (car b)))))
        (should (= (car (car regions)) (point-min)))
        (should (= (cdr (car (last regions))) (point-max)))
        (cl-loop for (a b) on regions while b
                 do (should (= (cdr a) (car b))))))))

;; An ERT test of `kiln-eglot--flymake-backend' (Flymake's check).
(ert-deftest kiln-eglot-diagnostics-not-resent-after-a-change ()
  ;; Flymake's check shows diagnostics not yet shown; otherwise it answers
  ;; with an empty report whose region no diagnostic can touch: after a
  ;; change the shown diagnostics stay (they move with the text) until the
  ;; server's answer, and the old ones are not redrawn at old positions.
  (skip-unless (kiln-eglot-test--load))
  (require 'kiln-eglot)
  (with-temp-buffer
    (dotimes (i 20) (insert (format "species s%d CCO\n" i)))
    (switch-to-buffer (current-buffer))
    (let ((eglot--current-flymake-report-fn nil)
          (reports nil))
      (cl-letf (((symbol-function 'kiln-eglot--own-diagnostics-p) (lambda () t)))
        (kiln-eglot--store-diagnostics (vector (kiln-eglot-test--diag 3 0 3 5 "m")))
        (kiln-eglot--flymake-backend #'ignore (lambda (d &rest a) (push (cons d a) reports)))
        (should (= (length reports) 1))
        (should (= (length (car (car reports))) 1))
        (goto-char (point-max))
        (insert "species x C\n")
        (kiln-eglot--flymake-backend #'ignore (lambda (d &rest a) (push (cons d a) reports)))
        (should (= (length reports) 2))
        (should (null (car (car reports))))
        (let ((region (plist-get (cdr (car reports)) :region)))
          (should (and (< (car region) (point-min)) (< (cdr region) (point-min)))))))))

(ert-deftest kiln-eglot-diagnostics-blocks-resume-when-text-settles ()
  ;; Blocks pause while the text changes; a publication restarts them; if
  ;; none comes (the server found the same diagnostics), they resume once
  ;; the text has stayed unchanged for `kiln-eglot--resume-after'.
  (skip-unless (kiln-eglot-test--load))
  (require 'kiln-eglot)
  (with-temp-buffer
    (dotimes (i 600) (insert (format "species s%d CCO\n" i)))
    (switch-to-buffer (current-buffer))
    (goto-char (point-min))
    (set-window-start (selected-window) (point))
    (let* ((reports 0)
           (kiln-eglot-diagnostics-chunk-lines 50)
           (kiln-eglot--resume-after 0.3)
           (eglot--current-flymake-report-fn (lambda (&rest _) (cl-incf reports))))
      (kiln-eglot--store-diagnostics
       (vconcat (cl-loop for l from 0 below 600 by 7
                         collect (kiln-eglot-test--diag l 0 l 3 (format "m%d" l)))))
      (kiln-eglot--show-diagnostics)
      (should kiln-eglot--todo)
      (goto-char (point-max))
      (insert "# typed\n")
      (let ((n reports))
        (kiln-eglot-test--run-timers #'ignore 0.2)
        (should (= reports n))          ; paused
        (should kiln-eglot--todo))
      (should (kiln-eglot-test--run-timers (lambda () (null kiln-eglot--todo)) 10))
      (should (> reports 10)))))

(provide 'kiln-eglot-test)
;;; kiln-eglot-test.el ends here
