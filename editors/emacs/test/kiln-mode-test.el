;;; kiln-mode-test.el --- ERT tests for kiln-mode  -*- lexical-binding: t; -*-

;;; Commentary:
;; Run with editors/emacs/test/run.sh.

;;; Code:

(require 'ert)
(require 'kiln-mode)

(defmacro kiln-test-with-buffer (text &rest body)
  "Insert TEXT in a fontified `kiln-mode' buffer and run BODY there."
  (declare (indent 1))
  `(with-temp-buffer
     (insert ,text)
     (kiln-mode)
     (font-lock-ensure)
     (goto-char (point-min))
     ,@body))

(defun kiln-test-face-at (needle &optional n offset)
  "Face at the N-th (default 1st) occurrence of NEEDLE plus OFFSET."
  (save-excursion
    (goto-char (point-min))
    (search-forward needle nil nil (or n 1))
    (let ((face (get-text-property (+ (match-beginning 0) (or offset 0)) 'face)))
      (if (listp face) (car face) face))))

(defun kiln-test-in-comment-p (needle &optional n offset)
  "Non-nil if the N-th occurrence of NEEDLE plus OFFSET is inside a comment."
  (save-excursion
    (goto-char (point-min))
    (search-forward needle nil nil (or n 1))
    (let ((pos (+ (match-beginning 0) (or offset 0))))
      (nth 4 (syntax-ppss pos)))))

(defconst kiln-test-sample
  "# Demo header comment
units kJ/mol            # energy unit of this file
include shared/c0-core.kiln   # relative path
group O-(Cd)(C)         # a user-defined Benson group value
  hf298 -127.6kJ/mol
  source Smith & Doe 2021, table 2      # free text
species ethyne C#C  # comment
species ethanol CCO
  multiplicity 1
  nasa7 300 1000 5000
    low  3.4 1.2e-2 0 0 0 -2.9e4 1.5d13
reaction CH3 + CH3 (+M) <=> C2H6 (+M)   A=2.1e16 n=-0.97 Ea=8350K
  troe alpha=0.62 T3=73 T1=1180 T2=5000
reaction H + O2 + M => HO2 + M   A=2.8e18 n=-0.86 Ea=69.5kJ/mol
")

(ert-deftest kiln-mode-auto-mode ()
  (should (eq (assoc-default "mech.kiln" auto-mode-alist #'string-match) 'kiln-mode)))

(ert-deftest kiln-mode-font-lock-statements-and-names ()
  (kiln-test-with-buffer kiln-test-sample
    (should (eq (kiln-test-face-at "units") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "kJ/mol") 'font-lock-type-face))
    (should (eq (kiln-test-face-at "include") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "shared/c0") 'font-lock-string-face))
    (should (eq (kiln-test-face-at "group") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "O-(Cd)(C)") 'font-lock-function-name-face))
    (should (eq (kiln-test-face-at "species ethyne") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "ethyne") 'font-lock-variable-name-face))
    (should (eq (kiln-test-face-at "C#C") 'font-lock-string-face))
    (should (eq (kiln-test-face-at "C#C" 1 2) 'font-lock-string-face))
    (should (eq (kiln-test-face-at "reaction CH3") 'font-lock-keyword-face))))

(ert-deftest kiln-mode-font-lock-attributes-numbers-operators ()
  (kiln-test-with-buffer kiln-test-sample
    (should (eq (kiln-test-face-at "hf298") 'font-lock-builtin-face))
    (should (eq (kiln-test-face-at "-127.6") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "kJ/mol" 2) 'font-lock-type-face))
    (should (eq (kiln-test-face-at "source") 'font-lock-builtin-face))
    (should (eq (kiln-test-face-at "Smith & Doe") 'font-lock-doc-face))
    (should (eq (kiln-test-face-at "multiplicity") 'font-lock-builtin-face))
    (should (eq (kiln-test-face-at "nasa7") 'font-lock-builtin-face))
    (should (eq (kiln-test-face-at "1000") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "low ") 'font-lock-builtin-face))
    (should (eq (kiln-test-face-at "1.2e-2") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "1.5d13") 'font-lock-warning-face))
    (should (eq (kiln-test-face-at "+ CH3") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "(+M)") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "<=>") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "=> HO2") 'font-lock-keyword-face))
    (should (eq (kiln-test-face-at "M =>") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "A=2.1") 'font-lock-preprocessor-face))
    (should (eq (kiln-test-face-at "2.1e16") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "n=-0.97") 'font-lock-preprocessor-face))
    (should (eq (kiln-test-face-at "-0.97") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "8350K") 'font-lock-constant-face))
    (should (eq (kiln-test-face-at "8350K" 1 4) 'font-lock-type-face))
    (should (eq (kiln-test-face-at "alpha") 'font-lock-preprocessor-face))
    (should (eq (kiln-test-face-at "T3") 'font-lock-preprocessor-face))
    (should (eq (kiln-test-face-at "69.5") 'font-lock-constant-face))
    ;; Digits inside names are not numbers.
    (should-not (eq (kiln-test-face-at "CH3") 'font-lock-constant-face))
    (should-not (eq (kiln-test-face-at "C2H6" 1 1) 'font-lock-constant-face))))

(ert-deftest kiln-mode-hash-inside-token-is-not-a-comment ()
  (kiln-test-with-buffer kiln-test-sample
    (should-not (kiln-test-in-comment-p "C#C" 1 1))
    (should-not (kiln-test-in-comment-p "C#C" 1 2))
    (should (kiln-test-in-comment-p "# comment" 1 2))
    (should (eq (kiln-test-face-at "# comment" 1 2) 'font-lock-comment-face))
    (should (eq (kiln-test-face-at "# Demo" 1 2) 'font-lock-comment-face))
    (should (eq (kiln-test-face-at "# free text" 1 2) 'font-lock-comment-face))
    ;; The species line ends after the comment: the next line is code.
    (should-not (kiln-test-in-comment-p "species ethanol"))))

(ert-deftest kiln-mode-comment-dwim ()
  ;; On an empty line before any statement: inserts "# " in column 0.
  (kiln-test-with-buffer "\nspecies ethanol CCO\n"
    (comment-dwim nil)
    (should (equal (buffer-substring-no-properties (line-beginning-position) (line-end-position)) "# ")))
  ;; On an empty line inside a statement: "# " at the attribute indentation.
  (kiln-test-with-buffer "species ethanol CCO\n\n"
    (forward-line 1)
    (comment-dwim nil)
    (should (equal (buffer-substring-no-properties (line-beginning-position) (line-end-position)) "  # "))
    ;; On a code line: an end-of-line comment that begins a token.
    (goto-char (point-min))
    (comment-dwim nil)
    (let ((line (buffer-substring-no-properties (line-beginning-position) (line-end-position))))
      (should (string-match-p "\\`species ethanol CCO[ \t]+# \\'" line))))
  ;; Commenting out a region uses "# " and keeps C#C inside the commented text.
  (kiln-test-with-buffer "species ethyne C#C\n"
    (comment-region (point-min) (point-max))
    (should (equal (buffer-string) "# species ethyne C#C\n"))
    (uncomment-region (point-min) (point-max))
    (should (equal (buffer-string) "species ethyne C#C\n"))))

(defconst kiln-test-indented
  "# header
units kJ/mol
group O-(Cd)(C)
  hf298 -30.5
  s298 9.7
  cp 300=3.4 400=3.7
  source Smith & Doe 2021
species ethanol CCO
  multiplicity 1
  nasa7 300 1000 5000
    low 1 2 3 4 5 6 7
    high 1 2 3 4 5 6 7
    source kiln estimate
  note after the block

  symmetry 3
species tar-lump
  composition C10H8
  thermo-table
    hf298 35.0
    s298 80.2
    cp 300=32.0
    source handbook
reaction CH3 + CH3 (+M) <=> C2H6 (+M)   A=2.1e16 n=-0.97 Ea=0.62
  low-pressure A=1.27e41 n=-7.0 Ea=2.76
  troe alpha=0.62 T3=73 T1=1180
  efficiencies H2O=6
")

(ert-deftest kiln-mode-indent-region-restores-layout ()
  (kiln-test-with-buffer kiln-test-indented
    ;; Flatten every line, then let the mode indent it again.
    (goto-char (point-min))
    (while (not (eobp))
      (delete-horizontal-space)
      (forward-line 1))
    (indent-region (point-min) (point-max))
    (should (equal (buffer-string) kiln-test-indented))))

(ert-deftest kiln-mode-indent-new-lines ()
  ;; A new line after a block line continues the block.
  (kiln-test-with-buffer "species ethanol CCO\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 7\n"
    (goto-char (point-max))
    (indent-according-to-mode)
    (should (= (current-indentation) 4)))
  ;; A new line after a statement is an attribute line.
  (kiln-test-with-buffer "reaction A => B\n"
    (goto-char (point-max))
    (indent-according-to-mode)
    (should (= (current-indentation) 2)))
  ;; An attribute keyword after a block goes back to the attribute level,
  ;; and a statement keyword to column 0.
  (kiln-test-with-buffer "species ethanol CCO\n  nasa7 300 1000 5000\n    low 1\n    symmetry 3\n    species x C\n"
    (forward-line 3)
    (indent-according-to-mode)
    (should (= (current-indentation) 2))
    (forward-line 1)
    (indent-according-to-mode)
    (should (= (current-indentation) 0)))
  ;; Before any statement everything stays in column 0.
  (kiln-test-with-buffer "# only a comment\n  foo\n"
    (forward-line 1)
    (indent-according-to-mode)
    (should (= (current-indentation) 0))))

;; Typing, as a user does: self-insert-command and newline with
;; `electric-indent-mode' (on by default).
(defun kiln-test-type (string)
  "Type STRING character by character as interactive commands."
  (dolist (c (string-to-list string))
    (let ((last-command-event c))
      (if (eq c ?\n)
          (call-interactively #'newline)
        (call-interactively #'self-insert-command)))))

(ert-deftest kiln-mode-typed-statement-goes-to-column-0 ()
  (kiln-test-with-buffer "species ethanol CCO\n  multiplicity 1"
    (electric-indent-local-mode 1)
    (goto-char (point-max))
    (kiln-test-type "\nspecies ethane CC\nreaction ethanol => ethane")
    (should (equal (buffer-string)
                   "species ethanol CCO\n  multiplicity 1\nspecies ethane CC\nreaction ethanol => ethane"))))

(ert-deftest kiln-mode-typed-block-layout ()
  (kiln-test-with-buffer ""
    (electric-indent-local-mode 1)
    (kiln-test-type "species ethanol CCO\nnasa7 300 1000 5000\nlow 1 2 3\nhigh 1 2 3\nsymmetry 3\ngroup C-(C)(H)3\nhf298 -10.2")
    (should (equal (buffer-string)
                   (concat "species ethanol CCO\n  nasa7 300 1000 5000\n    low 1 2 3\n"
                           "    high 1 2 3\n  symmetry 3\ngroup C-(C)(H)3\n  hf298 -10.2")))))

(provide 'kiln-mode-test)
;;; kiln-mode-test.el ends here
