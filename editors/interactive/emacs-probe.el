;;; emacs-probe.el --- interactive edit -> Flymake probe  -*- lexical-binding: t; -*-

;;; Commentary:
;; Init file for an interactive `emacs -nw' driven by editors/interactive/run.sh.
;; Environment: KILN_EMACS_DIR (the plugin), KILN_BINARY, KILN_PROBE_LOG.
;; Logs, after every Flymake report, the seconds since the last buffer change
;; and whether the line of point has an error, and once per publication the
;; start of eglot's handler (a line "publication").

;;; Code:

(require 'package)
(add-to-list 'package-directory-list "/usr/share/emacs/site-lisp/elpa")
(package-initialize)
(add-to-list 'load-path (getenv "KILN_EMACS_DIR"))
(require 'eglot)
(require 'kiln-mode)
(setq eglot-server-programs
      (cons `(kiln-mode . (kiln-eglot-server ,(getenv "KILN_BINARY") "serve")) eglot-server-programs))
(add-hook 'kiln-mode-hook #'eglot-ensure)
(setq inhibit-startup-screen t)

(defvar probe-t0 nil)
(defvar probe-log (getenv "KILN_PROBE_LOG"))

(defun probe-change (&rest _)
  "Note the time of a change of a kiln buffer."
  (when (derived-mode-p 'kiln-mode) (setq probe-t0 (float-time))))
(add-hook 'after-change-functions #'probe-change)

(defun probe-write (s)
  "Append S to the probe log."
  (write-region s nil probe-log t 'silent))

(defun probe-report (&rest _)
  "Log a Flymake report."
  (when (and probe-t0 (derived-mode-p 'kiln-mode))
    (let ((err (seq-some (lambda (d) (eq (flymake-diagnostic-type d) 'eglot-error))
                         (flymake-diagnostics (line-beginning-position) (line-end-position)))))
      (probe-write (format "%.3f %s %d\n" (- (float-time) probe-t0) (if err "err" "ok")
                           (line-number-at-pos))))))
(advice-add 'flymake--handle-report :after #'probe-report)

(cl-defmethod eglot-handle-notification :before
  (_server (_method (eql textDocument/publishDiagnostics)) &rest _)
  "Log the start of a publication's handler."
  (when probe-t0
    (probe-write (format "%.3f publication\n" (- (float-time) probe-t0)))))

;;; emacs-probe.el ends here
