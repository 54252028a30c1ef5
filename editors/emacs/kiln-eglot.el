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

(defclass kiln-eglot-server (eglot-lsp-server) ()
  :documentation "The kiln language server (`kiln serve').")

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
      (let ((s (window-start w))
            (e (or (window-end w t) (point-max))))
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
  (seq-doseq (h hints)
    (let* ((pos (eglot--lsp-position-to-point (plist-get h :position)))
           (ov (make-overlay pos pos nil t nil)))
      (overlay-put ov 'kiln-eglot-hint t)
      (overlay-put ov 'evaporate nil)
      (overlay-put ov 'after-string
                   (propertize (concat "  " (kiln-eglot--label (plist-get h :label)))
                               'face 'kiln-inlay-hint)))))

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

(provide 'kiln-eglot)
;;; kiln-eglot.el ends here
