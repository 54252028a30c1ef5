#!/usr/bin/env bash
# Headless test of the kiln Neovim plugin (Neovim 0.7+, no TTY needed).
# Usage: editors/nvim/test/run.sh KILN_BINARY
set -euo pipefail

if [[ $# -ne 1 ]]; then
  echo "usage: $0 KILN_BINARY" >&2
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
cp "$here/fixture.kiln" "$here/syntax.kiln" "$here/severity.kiln" "$work/"
# A fresh LSP log (stdpath cache/state) for the stderr check.
export XDG_CACHE_HOME="$work/cache" XDG_STATE_HOME="$work/state"

echo "nvim test: $(nvim --version | head -1), server $binary"
# timeout guards against a hung server; every wait inside the test is <= 20 s.
KILN_PLUGIN_DIR="$plugin" KILN_BINARY="$binary" KILN_WORKDIR="$work" \
  timeout 120 nvim --headless -u NONE -i NONE -n \
  -c "lua dofile('$here/test.lua')" </dev/null
