;;; kiln-mode.el --- Major mode for kiln mechanism files  -*- lexical-binding: t; -*-

;; Version: 0.1.0
;; Package-Requires: ((emacs "27.1"))
;; Keywords: languages, data

;;; Commentary:

;; A major mode for `.kiln' chemical-kinetics mechanism files.
;;
;; - Font-lock for statements (column 0), attributes and block lines
;;   (indented), species names and SMILES, Benson group names, numbers with
;;   attached units, rate parameters, arrows and comments.
;; - A `#' starts a comment only at the start of a token (line start or after
;;   a blank); inside a token, as in the SMILES C#C, it is part of the token.
;;   This is done with `syntax-propertize-function'.
;; - Indentation: attribute lines by `kiln-attribute-indent' (2), the lines
;;   of a nasa7 or thermo-table block by `kiln-block-indent' (4).
;; - Typing a keyword as the first word of a line re-indents it, so a
;;   statement typed under an indented line goes back to column 0.
;; - If eglot is loaded, `kiln serve' is registered as the language server
;;   (kiln-eglot.el), and the estimates the server offers as inlay hints are
;;   shown at line ends, also on eglot versions without inlay hints.
;;
;; Usage:
;;   (add-to-list 'load-path "/path/to/kiln/editors/emacs")
;;   (require 'kiln-mode)
;;   (add-hook 'kiln-mode-hook #'eglot-ensure)   ; optional

;;; Code:

(defgroup kiln nil
  "Editing kiln mechanism files."
  :group 'languages
  :prefix "kiln-")

(defcustom kiln-attribute-indent 2
  "Indentation of attribute lines under a statement."
  :type 'integer
  :safe #'integerp)

(defcustom kiln-block-indent 4
  "Indentation of the lines of a nasa7 or thermo-table block."
  :type 'integer
  :safe #'integerp)

(defconst kiln-statement-keywords
  '("species" "reaction" "units" "include" "group")
  "Keywords that start a statement in column 0.")

(defconst kiln-attribute-keywords
  '("multiplicity" "symmetry" "optical-isomers" "composition" "note"
    "nasa7" "thermo-table"
    "low-pressure" "troe" "efficiencies" "pressure" "duplicate" "reverse"
    "hf298" "s298" "cp" "source")
  "Keywords of attribute lines (indented under a statement).")

(defconst kiln-block-keywords
  '(("nasa7" "low" "high" "source")
    ("thermo-table" "hf298" "s298" "cp" "source"))
  "Block header keywords, each with the keywords of its block lines.")

(defconst kiln--units-re
  (regexp-opt '("kJ/mol/K" "kcal/mol/K" "J/mol/K" "cal/mol/K"
                "kJ/mol" "kcal/mol" "J/mol" "cal/mol"
                "kPa" "Pa" "atm" "bar" "Torr" "K"))
  "Units that may be attached to a number, e.g. 69.5kJ/mol or 8350K.")

(defconst kiln--number-re
  (concat "\\([-+]?\\(?:[0-9]+\\(?:\\.[0-9]*\\)?\\|\\.[0-9]+\\)"
          "\\(?:[eE][-+]?[0-9]+\\)?\\)"
          "\\(" kiln--units-re "\\)?")
  "A number (group 1) with an optional attached unit (group 2).")

(defconst kiln--bad-number-re
  "[-+]?\\(?:[0-9]+\\(?:\\.[0-9]*\\)?\\|\\.[0-9]+\\)[dD][-+]?[0-9]+"
  "A number with a Fortran `d' exponent, which kiln rejects.")

;;;; Syntax

(defvar kiln-mode-syntax-table
  (let ((st (make-syntax-table)))
    ;; '#' is punctuation; `kiln-syntax-propertize' marks token-initial ones
    ;; as comment starters.
    (modify-syntax-entry ?# "." st)
    (modify-syntax-entry ?\n ">" st)
    ;; Free text and SMILES may hold quotes; they never delimit strings.
    (modify-syntax-entry ?\" "." st)
    (modify-syntax-entry ?' "." st)
    (modify-syntax-entry ?- "_" st)
    (modify-syntax-entry ?_ "_" st)
    (modify-syntax-entry ?= "." st)
    (modify-syntax-entry ?+ "." st)
    (modify-syntax-entry ?/ "." st)
    st)
  "Syntax table for `kiln-mode'.")

(defconst kiln-syntax-propertize
  (syntax-propertize-rules
   ("\\(?:^\\|[ \t]\\)\\(#\\)" (1 "<")))
  "Make a `#' at the start of a token a comment starter.")

;;;; Font-lock

(defun kiln--token-bounded-p (beg end &optional before)
  "Non-nil if BEG..END is a whole token.
The character before BEG must be a blank, a newline or one of BEFORE
\(a list of characters), or BEG must start a line; the character after
END must be a blank or a newline, or END must end the buffer."
  (and (or (= beg (point-min))
           (memq (char-before beg) (append '(?\s ?\t ?\n) before)))
       (or (>= end (point-max))
           (memq (char-after end) '(?\s ?\t ?\n)))))

(defun kiln--search (re limit pred)
  "Search forward for RE before LIMIT until PRED (no arguments) holds.
Leaves the match data of the accepted match and returns non-nil."
  (let (found)
    (while (and (not found) (re-search-forward re limit t))
      (setq found (funcall pred)))
    found))

(defun kiln--match-number (limit)
  "Font-lock matcher for numbers with optional units, up to LIMIT."
  (kiln--search kiln--number-re limit
                (lambda ()
                  (let ((beg (match-beginning 0)) (end (match-end 0)))
                    (and (or (= beg (point-min))
                             (memq (char-before beg) '(?\s ?\t ?\n ?=)))
                         (or (>= end (point-max))
                             (memq (char-after end) '(?\s ?\t ?\n ?=))))))))

(defun kiln--match-bad-number (limit)
  "Font-lock matcher for Fortran-style numbers such as 1.5d13, up to LIMIT."
  (kiln--search kiln--bad-number-re limit
                (lambda () (kiln--token-bounded-p (match-beginning 0) (match-end 0) '(?=)))))

(defun kiln--match-operator (limit)
  "Font-lock matcher for arrows and `+' between blanks, up to LIMIT."
  (kiln--search "<=>\\|=>\\|\\+" limit
                (lambda ()
                  (and (save-excursion (beginning-of-line) (looking-at-p "reaction\\_>"))
                       (kiln--token-bounded-p (match-beginning 0) (match-end 0))))))

(defun kiln--match-third-body (limit)
  "Font-lock matcher for the third body M and falloff markers, up to LIMIT."
  (kiln--search "(\\+[^ \t\n()]+)\\|M" limit
                (lambda ()
                  (and (save-excursion (beginning-of-line) (looking-at-p "reaction\\_>"))
                       (or (eq (char-after (match-beginning 0)) ?\()
                           (kiln--token-bounded-p (match-beginning 0) (match-end 0)))))))

(defun kiln--match-parameter (limit)
  "Font-lock matcher for parameter keys such as A=, n=, Ea=, T3=, up to LIMIT."
  (kiln--search "\\(A\\|n\\|Ea\\|alpha\\|T[123]\\)=" limit
                (lambda ()
                  (let ((beg (match-beginning 0)))
                    (or (= beg (line-beginning-position))
                        (memq (char-before beg) '(?\s ?\t)))))))

(defconst kiln-font-lock-keywords
  `((,(concat "^" (regexp-opt kiln-statement-keywords t) "\\(?:[ \t]\\|$\\)")
     (1 font-lock-keyword-face))
    ("^species[ \t]+\\([^ \t\n#][^ \t\n]*\\)\\(?:[ \t]+\\([^ \t\n#][^ \t\n]*\\)\\)?"
     (1 font-lock-variable-name-face)
     (2 font-lock-string-face nil t))
    ("^group[ \t]+\\([^ \t\n#][^ \t\n]*\\)" (1 font-lock-function-name-face))
    ("^include[ \t]+\\([^ \t\n#][^ \t\n]*\\)" (1 font-lock-string-face))
    ("^units[ \t]+\\(kcal/mol\\|kJ/mol\\|cal/mol\\|J/mol\\)\\(?:[ \t]\\|$\\)"
     (1 font-lock-type-face))
    (,(concat "^[ \t]+"
              (regexp-opt (append kiln-attribute-keywords '("low" "high")) t)
              "\\(?:[ \t]\\|$\\)")
     (1 font-lock-builtin-face))
    ("^[ \t]+composition[ \t]+\\([^ \t\n#][^ \t\n]*\\)" (1 font-lock-constant-face))
    ;; Free text up to a token-initial '#'.
    ("^[ \t]+\\(?:note\\|source\\)[ \t]+\\(.*?\\)[ \t]*\\(?:[ \t]#.*\\)?$"
     (1 font-lock-doc-face))
    (kiln--match-parameter (1 font-lock-preprocessor-face))
    (kiln--match-bad-number (0 font-lock-warning-face))
    (kiln--match-number (1 font-lock-constant-face) (2 font-lock-type-face nil t))
    (kiln--match-operator (0 font-lock-keyword-face))
    (kiln--match-third-body (0 font-lock-constant-face)))
  "Font-lock keywords for `kiln-mode'.")

;;;; Indentation

(defun kiln--line-keyword ()
  "The first token of the current line, or nil for a blank or comment line."
  (save-excursion
    (back-to-indentation)
    (when (looking-at "[^ \t\n#][^ \t\n]*")
      (match-string-no-properties 0))))

(defun kiln--previous-code-line ()
  "Move to the previous line that is not blank or comment-only.
Return non-nil if there is one."
  (let (found)
    (while (and (not found) (= 0 (forward-line -1)))
      (setq found (kiln--line-keyword)))
    found))

(defun kiln--context ()
  "What the current line continues.
Returns `top' before any statement, `statement' inside a statement, or
the header keyword (\"nasa7\" or \"thermo-table\") inside a block."
  (save-excursion
    (if (not (kiln--previous-code-line))
        'top
      (let ((kw (kiln--line-keyword))
            (indent (current-indentation)))
        (cond
         ((assoc kw kiln-block-keywords) kw)
         ((and (= indent 0) (member kw kiln-statement-keywords)) 'statement)
         ((= indent 0) 'top)
         (t
          ;; A block line or an attribute line: find what encloses it.
          (let (result)
            (while (and (not result) (kiln--previous-code-line))
              (when (< (current-indentation) indent)
                (let ((k (kiln--line-keyword)))
                  (setq result (if (assoc k kiln-block-keywords) k 'statement)))))
            (or result 'statement))))))))

(defun kiln--desired-indentation ()
  "The column the current line should be indented to."
  (let ((kw (kiln--line-keyword)))
    (if (member kw kiln-statement-keywords)
        0
      (let ((ctx (kiln--context)))
        (cond
         ((eq ctx 'top) 0)
         ((eq ctx 'statement) kiln-attribute-indent)
         ((and kw (member kw kiln-attribute-keywords)
               (not (member kw (cdr (assoc ctx kiln-block-keywords)))))
          kiln-attribute-indent)
         (t kiln-block-indent))))))

(defun kiln-indent-line ()
  "Indent the current line of a kiln file.
Statements go to column 0, attributes to `kiln-attribute-indent' and the
lines of a nasa7 or thermo-table block to `kiln-block-indent'. A
comment-only line in column 0 is left there."
  (interactive)
  (let ((comment-at-0 (save-excursion
                        (beginning-of-line)
                        (looking-at-p "#"))))
    (unless comment-at-0
      (let ((col (kiln--desired-indentation))
            (offset (- (current-column) (current-indentation))))
        (indent-line-to col)
        (when (> offset 0)
          (move-to-column (+ col offset)))))))

(defconst kiln--reindent-keywords
  (append kiln-statement-keywords kiln-attribute-keywords)
  "Keywords that re-indent their line when typed as its first word.")

(defun kiln--electric-indent-p (char)
  "Non-nil if the CHAR just typed should re-indent the current line.
That is a blank ending a keyword that is the first word of its line,
so that a statement typed under an indented line moves to column 0.
For `electric-indent-functions'."
  (and (memq char '(?\s ?\t))
       (save-excursion
         (skip-chars-backward " \t")
         (let ((end (point)))
           (back-to-indentation)
           (and (< (point) end)
                (member (buffer-substring-no-properties (point) end)
                        kiln--reindent-keywords)
                t)))))

;;;; Mode

(defvar kiln-imenu-generic-expression
  '(("Species" "^species[ \t]+\\([^ \t\n#]+\\)" 1)
    ("Groups" "^group[ \t]+\\([^ \t\n#]+\\)" 1)
    ("Includes" "^include[ \t]+\\([^ \t\n#]+\\)" 1))
  "Imenu entries for `kiln-mode'.")

;;;###autoload
(define-derived-mode kiln-mode prog-mode "kiln"
  "Major mode for kiln chemical-kinetics mechanism files.

\\{kiln-mode-map}"
  :syntax-table kiln-mode-syntax-table
  (setq-local comment-start "# ")
  (setq-local comment-end "")
  (setq-local comment-start-skip "\\(?:^\\|[ \t]\\)#+[ \t]*")
  (setq-local comment-use-syntax t)
  (setq-local syntax-propertize-function kiln-syntax-propertize)
  (setq-local font-lock-defaults '(kiln-font-lock-keywords))
  (setq-local indent-line-function #'kiln-indent-line)
  (setq-local indent-tabs-mode nil)
  (setq-local tab-width 8)
  (setq-local electric-indent-chars '(?\n))
  (add-hook 'electric-indent-functions #'kiln--electric-indent-p nil t)
  (setq-local imenu-generic-expression kiln-imenu-generic-expression))

;;;###autoload
(add-to-list 'auto-mode-alist '("\\.kiln\\'" . kiln-mode))

;;;###autoload
(autoload 'kiln-equilibrium "kiln-eglot"
  "Show the equilibrium of a mixture over the current kiln buffer's species." t)



(provide 'kiln-mode)

;; Language server: `kiln serve' over stdio, through eglot (kiln-eglot.el:
;; inlay hints on eglot versions without them).
(with-eval-after-load 'eglot
  (require 'kiln-eglot nil t))
;;; kiln-mode.el ends here
