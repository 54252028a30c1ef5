;;; kiln-bigfile.el --- edit -> Flymake on a large mechanism, eglot  -*- lexical-binding: t; -*-

;;; Commentary:
;; Measures, in batch Emacs with eglot and the real server, how long an edit
;; of one species takes to show up in Flymake on a large generated
;; mechanism.  Used by the ERT test `kiln-eglot-bigfile-edit' (generous
;; limit) and by editors/bench.sh (real figures).
;;
;; Batch Emacs runs no command loop, so the two idle timers an interactive
;; session waits for after typing — eglot sending the change
;; (`eglot-send-changes-idle-time', 0.5 s) and Flymake starting a check
;; (`flymake-no-changes-timeout', 0.5 s) — are run here at once, by calling
;; what they call.  An interactive edit takes those 0.5 s longer.

;;; Code:

(require 'cl-lib)
(require 'seq)
(require 'flymake)
(require 'kiln-mode)

(defvar eglot-server-programs)
(declare-function eglot "eglot")
(declare-function eglot-current-server "eglot")
(declare-function eglot-shutdown "eglot")
(declare-function eglot--guess-contact "eglot")
(declare-function eglot--signal-textDocument/didChange "eglot")
(declare-function eglot-handle-notification "eglot")

(defvar kiln-bigfile--stalls nil
  "Seconds spent handling each publishDiagnostics notification.")

(defvar kiln-bigfile--publications 0
  "publishDiagnostics notifications handled so far.")

(defvar kiln-bigfile--published 0
  "Diagnostics in the latest publishDiagnostics notification.")

(defvar kiln-bigfile--blocks nil
  "Seconds of each other piece of diagnostics work the editor does at once:
Flymake's check calling eglot's backend, and the timers of kiln-eglot
that hand diagnostics to Flymake a block of lines at a time.")

(defun kiln-bigfile--time-notification (fn server method &rest args)
  "Around advice: time FN for publishDiagnostics (SERVER, METHOD, ARGS)."
  (if (eq method 'textDocument/publishDiagnostics)
      (let ((t0 (float-time)))
        (prog1 (apply fn server method args)
          (setq kiln-bigfile--publications (1+ kiln-bigfile--publications)
                kiln-bigfile--published (length (plist-get args :diagnostics)))
          (push (- (float-time) t0) kiln-bigfile--stalls)))
    (apply fn server method args)))

(defun kiln-bigfile--time-block (fn &rest args)
  "Around advice: time FN (called with ARGS) into `kiln-bigfile--blocks'."
  (let ((t0 (float-time)))
    (prog1 (apply fn args)
      (push (- (float-time) t0) kiln-bigfile--blocks))))

(defconst kiln-bigfile--timed '(eglot-flymake-backend kiln-eglot--render-rest)
  "Functions timed into `kiln-bigfile--blocks' (where defined).")

(defun kiln-bigfile--settled-p ()
  "Non-nil once all diagnostics of the latest publication are in Flymake."
  (not (bound-and-true-p kiln-eglot--todo)))

(defun kiln-bigfile--wait (pred seconds)
  "Process events until PRED holds or SECONDS pass; return PRED's value."
  (let ((deadline (+ (float-time) seconds))
        value)
    (while (and (not (setq value (funcall pred)))
                (< (float-time) deadline))
      (accept-process-output nil 0.002))
    value))

(defun kiln-bigfile--errors-on-line-p (line)
  "Non-nil if Flymake has an error on LINE."
  (seq-some (lambda (d)
              (and (eq (flymake-diagnostic-type d) 'eglot-error)
                   (= (line-number-at-pos (flymake-diagnostic-beg d)) line)))
            (flymake-diagnostics (save-excursion (goto-char (point-min))
                                                 (line-beginning-position line))
                                 (save-excursion (goto-char (point-min))
                                                 (line-end-position line)))))

(defun kiln-bigfile--percentile (xs p)
  "The P-th percentile (0..1) of the numbers XS."
  (let ((s (sort (copy-sequence xs) #'<)))
    (if (null s) 0 (nth (max 0 (1- (ceiling (* p (length s))))) s))))

(defun kiln-bigfile-measure (binary file edits timeout)
  "Open FILE with eglot running BINARY; EDITS edit/undo pairs of one SMILES.
Each wait gives up after TIMEOUT seconds.  Returns a plist :open (seconds),
:edits (list of seconds, edit -> Flymake shows the change), :stalls
\(seconds per diagnostics notification), :blocks (seconds per other piece
of diagnostics work done at once), :settle (seconds from the edit until
all diagnostics were in Flymake, per edit), :diagnostics (count in Flymake after
opening), :published (count the server sent then), :failures (list of strings).
An edit counts as shown once a publication that followed it has been
handled and Flymake shows the change on the edited line."
  (let* ((eglot-server-programs (cons `(kiln-mode . (kiln-eglot-server ,binary "serve"))
                                      eglot-server-programs))
         (kiln-bigfile--stalls nil)
         (kiln-bigfile--blocks nil)
         (kiln-bigfile--publications 0)
         (kiln-bigfile--published 0)
         (failures nil)
         (times nil)
         (settle nil)
         (buf (find-file-noselect file))
         open-time ndiags published)
    (advice-add 'eglot-handle-notification :around #'kiln-bigfile--time-notification)
    (dolist (f kiln-bigfile--timed)
      (when (fboundp f) (advice-add f :around #'kiln-bigfile--time-block)))
    (unwind-protect
        (with-current-buffer buf
          (switch-to-buffer buf)
          (let ((t0 (float-time)))
            (apply #'eglot (eglot--guess-contact))
            (unless (kiln-bigfile--wait
                     (lambda ()
                       (when (eglot-current-server)
                         (unless flymake-mode (flymake-mode 1))
                         (when (null (flymake-diagnostics)) (flymake-start)))
                       (and (flymake-diagnostics) (kiln-bigfile--settled-p)))
                     timeout)
              (push "no diagnostics after opening" failures))
            (setq open-time (- (float-time) t0)
                  ndiags (length (flymake-diagnostics))
                  published kiln-bigfile--published
                  ;; Opening calls Flymake's check in a loop: not counted.
                  kiln-bigfile--blocks nil))
          (let ((lines nil)
                (total (count-lines (point-min) (point-max))))
            (save-excursion
              (goto-char (point-min))
              (forward-line (/ total 4))
              (while (and (< (length lines) edits)
                          (re-search-forward "^species M[0-9]+ " nil t))
                (push (line-number-at-pos) lines)))
            (dolist (line (nreverse lines))
              (dolist (step '(edit undo))
                (kiln-bigfile--wait #'ignore 0.2)
                (goto-char (point-min))
                (forward-line (1- line))
                (end-of-line)
                (let ((t0 (float-time))
                      (seen kiln-bigfile--publications))
                  (if (eq step 'edit)
                      (insert "((")
                    (delete-char -2))
                  ;; What the idle timers would do.
                  (eglot--signal-textDocument/didChange)
                  (flymake-start)
                  (if (kiln-bigfile--wait
                       (lambda ()
                         (and (> kiln-bigfile--publications seen)
                              (let ((err (kiln-bigfile--errors-on-line-p line)))
                                (if (eq step 'edit) err (not err)))))
                       timeout)
                      (progn
                        (push (- (float-time) t0) times)
                        (kiln-bigfile--wait #'kiln-bigfile--settled-p timeout)
                        (push (- (float-time) t0) settle))
                    (push (format "%s on line %d: Flymake not updated within %d s"
                                  step line timeout)
                          failures)))))))
      (advice-remove 'eglot-handle-notification #'kiln-bigfile--time-notification)
      (dolist (f kiln-bigfile--timed)
        (advice-remove f #'kiln-bigfile--time-block))
      (with-current-buffer buf
        (when (eglot-current-server)
          (ignore-errors (eglot-shutdown (eglot-current-server))))
        (set-buffer-modified-p nil))
      (kill-buffer buf))
    (list :open open-time :edits (nreverse times) :stalls kiln-bigfile--stalls
          :blocks kiln-bigfile--blocks :settle (nreverse settle)
          :published published
          :diagnostics ndiags :failures (nreverse failures))))

(defun kiln-bigfile-report (file result)
  "Print RESULT of `kiln-bigfile-measure' on FILE."
  (let ((edits (plist-get result :edits))
        (stalls (plist-get result :stalls)))
    (princ (format "emacs: %s; open -> Flymake shows diagnostics %.0f ms (%d diagnostics)\n"
                   (file-name-nondirectory file)
                   (* 1000 (or (plist-get result :open) 0))
                   (or (plist-get result :diagnostics) 0)))
    (princ (format "emacs: edit -> Flymake updated: p50 %.0f ms, p95 %.0f ms, max %.0f ms (%d edits)\n"
                   (* 1000 (kiln-bigfile--percentile edits 0.5))
                   (* 1000 (kiln-bigfile--percentile edits 0.95))
                   (* 1000 (kiln-bigfile--percentile edits 1))
                   (length edits)))
    (princ (format "emacs: diagnostics notification handling (editor blocked): p50 %.0f ms, p95 %.0f ms, max %.0f ms (%d notifications)\n"
                   (* 1000 (kiln-bigfile--percentile stalls 0.5))
                   (* 1000 (kiln-bigfile--percentile stalls 0.95))
                   (* 1000 (kiln-bigfile--percentile stalls 1))
                   (length stalls)))
    (let ((blocks (plist-get result :blocks))
          (settle (plist-get result :settle)))
      (princ (format "emacs: other diagnostics work at once (Flymake check, kiln-eglot blocks; editor blocked): p50 %.0f ms, p95 %.0f ms, max %.0f ms (%d pieces)\n"
                     (* 1000 (kiln-bigfile--percentile blocks 0.5))
                     (* 1000 (kiln-bigfile--percentile blocks 0.95))
                     (* 1000 (kiln-bigfile--percentile blocks 1))
                     (length blocks)))
      (princ (format "emacs: edit -> all diagnostics in Flymake: p50 %.0f ms, p95 %.0f ms, max %.0f ms\n"
                     (* 1000 (kiln-bigfile--percentile settle 0.5))
                     (* 1000 (kiln-bigfile--percentile settle 0.95))
                     (* 1000 (kiln-bigfile--percentile settle 1)))))
    (dolist (f (plist-get result :failures))
      (princ (format "FAIL %s\n" f)))))

(provide 'kiln-bigfile)
;;; kiln-bigfile.el ends here
