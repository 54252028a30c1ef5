#!/usr/bin/env bash
# Batch ERT tests of kiln-mode (Emacs 27+; Debian: apt-get install emacs-nox).
# Usage: editors/emacs/test/run.sh [KILN_BINARY [BIG_FILE]]
# With KILN_BINARY and eglot available (Emacs 29, or Debian's elpa-eglot),
# the live eglot tests also run; with BIG_FILE (a generated mechanism of
# thousands of species) also the edit -> Flymake test on it.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
mode_dir=$(dirname "$here")
command -v emacs >/dev/null || { echo "emacs test: emacs not found (apt-get install emacs-nox)" >&2; exit 2; }
echo "emacs test: $(emacs --version | head -1)"

# Byte-compile with warnings as errors into a scratch directory; kiln-eglot.el
# only where eglot can be loaded.
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cp "$mode_dir/kiln-mode.el" "$mode_dir/kiln-eglot.el" "$work/"
emacs -batch -Q -L "$work" \
  --eval '(setq byte-compile-error-on-warn t)' \
  -f batch-byte-compile "$work/kiln-mode.el"
# Debian's elpa-* packages are not on the load path of `emacs -Q'.
init_eglot='(progn (require (quote package)) (add-to-list (quote package-directory-list) "/usr/share/emacs/site-lisp/elpa") (package-initialize))'
if emacs -batch -Q --eval "$init_eglot" --eval '(kill-emacs (if (require (quote eglot) nil t) 0 1))' 2>/dev/null; then
  emacs -batch -Q -L "$work" --eval "$init_eglot" \
    --eval '(setq byte-compile-error-on-warn t)' \
    -f batch-byte-compile "$work/kiln-eglot.el"
else
  echo "emacs test: eglot not available; eglot tests are skipped"
fi

binary=""
if [[ $# -ge 1 && -n "$1" ]]; then
  binary=$(readlink -f "$1")
fi
big=""
if [[ $# -ge 2 && -n "$2" ]]; then
  big=$(readlink -f "$2")
fi
KILN_BINARY="$binary" KILN_FIXTURE="$here/fixture.kiln" KILN_BIG_FILE="$big" \
  timeout 600 emacs -batch -Q -L "$work" -L "$here" \
  -l kiln-mode-test -l kiln-eglot-test \
  -f ert-run-tests-batch-and-exit
