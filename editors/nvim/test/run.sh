#!/usr/bin/env bash
# Headless test of the kiln Neovim plugin (Neovim 0.7+, no TTY needed).
# Usage: editors/nvim/test/run.sh KILN_BINARY [BIG_FILE]
# With BIG_FILE (a generated mechanism of thousands of species) also the
# edit -> diagnostics shown test on it (limit 60 s per edit: it proves the
# path works; editors/bench.sh prints the real figures).
set -euo pipefail

if [[ $# -lt 1 || $# -gt 2 ]]; then
  echo "usage: $0 KILN_BINARY [BIG_FILE]" >&2
  exit 2
fi
binary=$(readlink -f "$1")
if [[ ! -x "$binary" ]]; then
  echo "nvim test: kiln binary '$1' is not executable" >&2
  exit 2
fi
command -v nvim >/dev/null || { echo "nvim test: nvim not found (apt-get install neovim)" >&2; exit 2; }

here=$(cd "$(dirname "$0")" && pwd)
plugin=$(dirname "$here")
work=$(mktemp -d)
trap 'rm -rf "$work"' EXIT
cp "$here/fixture.kiln" "$here/syntax.kiln" "$here/severity.kiln" "$here/flame.kiln" "$work/"
# A fresh LSP log (stdpath cache/state) for the stderr check.
export XDG_CACHE_HOME="$work/cache" XDG_STATE_HOME="$work/state"

echo "nvim test: $(nvim --version | head -1), server $binary"
# timeout guards against a hung server; every wait inside the test is <= 20 s.
KILN_PLUGIN_DIR="$plugin" KILN_BINARY="$binary" KILN_WORKDIR="$work" \
  timeout 120 nvim --headless -u NONE -i NONE -n \
  -c "lua dofile('$here/test.lua')" </dev/null

if [[ $# -eq 2 && -n "$2" ]]; then
  echo "nvim test: edit -> diagnostics on $(basename "$2")"
  KILN_PLUGIN_DIR="$plugin" KILN_BINARY="$binary" KILN_BIG_FILE="$(readlink -f "$2")" \
    KILN_EDITS=1 KILN_LIMIT_MS=60000 \
    timeout 300 nvim --headless -u NONE -i NONE -n \
    -c "lua dofile('$here/bigfile.lua')" </dev/null
  echo "nvim test: big file ok"
fi
