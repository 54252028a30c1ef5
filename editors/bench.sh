#!/usr/bin/env bash
# Real-editor benchmark: edit -> diagnostics shown in headless Neovim and
# edit -> Flymake updated in batch Emacs + eglot, through the kiln plugins
# and the real server, on a generated mechanism. Prints the figures that
# BENCHMARKS.md ("Editors") records.
#
# Usage: editors/bench.sh KILN_BINARY [MOLECULES [EDITS]]
#   MOLECULES: genmech -molecules (default 2500: ~5,000 species)
#   EDITS: edit/undo pairs per editor (default 10)
set -euo pipefail
if [[ $# -lt 1 ]]; then
  echo "usage: $0 KILN_BINARY [MOLECULES [EDITS]]" >&2
  exit 2
fi
binary=$(readlink -f "$1")
molecules=${2:-2500}
edits=${3:-10}
here=$(cd "$(dirname "$0")" && pwd)
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
big="$work/big.kiln"
(cd "$here/.." && go run ./internal/tools/genmech -molecules "$molecules" -seed 1 >"$big")
echo "file: $(grep -c '^species' "$big") species, $(grep -c '^reaction' "$big") reactions, $(wc -l <"$big") lines"
echo "machine: $(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg)"
echo "nvim: $(nvim --version | head -1)"
KILN_PLUGIN_DIR="$here/nvim" KILN_BINARY="$binary" KILN_BIG_FILE="$big" KILN_EDITS="$edits" \
  nvim --headless -u NONE -i NONE -n -c "lua dofile('$here/nvim/test/bigfile.lua')" </dev/null
echo "emacs: $(emacs --version | head -1)"
emacs -batch -Q -L "$here/emacs" -L "$here/emacs/test" \
  --eval '(progn (require (quote package)) (add-to-list (quote package-directory-list) "/usr/share/emacs/site-lisp/elpa") (package-initialize))' \
  --eval "(progn (require 'eglot) (require 'kiln-mode) (require 'kiln-bigfile)
           (kiln-bigfile-report \"$big\" (kiln-bigfile-measure \"$binary\" \"$big\" $edits 120)))" 2>&1 \
  | grep -v '^\[\(eglot\|jsonrpc\)\]'
