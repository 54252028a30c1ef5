#!/usr/bin/env bash
# Batch ERT tests of kiln-mode (Emacs 27+; Debian: apt-get install emacs-nox).
# Usage: editors/emacs/test/run.sh [KILN_BINARY]
# With KILN_BINARY and eglot available (Emacs 29, or Debian's elpa-eglot),
# a live eglot test against `KILN_BINARY serve` also runs.
set -euo pipefail
here=$(cd "$(dirname "$0")" && pwd)
mode_dir=$(dirname "$here")
command -v emacs >/dev/null || { echo "emacs test: emacs not found (apt-get install emacs-nox)" >&2; exit 2; }
echo "emacs test: $(emacs --version | head -1)"

# Byte-compile with warnings as errors into a scratch directory.
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cp "$mode_dir/kiln-mode.el" "$work/"
emacs -batch -Q -L "$work" \
  --eval '(setq byte-compile-error-on-warn t)' \
  -f batch-byte-compile "$work/kiln-mode.el"

binary=""
if [[ $# -ge 1 && -n "$1" ]]; then
  binary=$(readlink -f "$1")
fi
KILN_BINARY="$binary" KILN_FIXTURE="$here/fixture.kiln" \
  timeout 180 emacs -batch -Q -L "$work" -L "$here" \
  -l kiln-mode-test -l kiln-eglot-test \
  -f ert-run-tests-batch-and-exit
