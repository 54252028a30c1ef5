#!/usr/bin/env bash
# Runs every editor-plugin test: VS Code (grammar + unit tests, compile,
# package; end to end in a code-server build of VS Code driven by headless
# Chromium), Neovim (headless, live server) and Emacs (ERT, live eglot tests
# when eglot is installed), the last two also on a generated 5,000-species
# mechanism. Fails if any of them fails.
#
# Usage: editors/test.sh KILN_BINARY
# Needs: node/npm (run `npm ci` in editors/vscode first, or this script does),
#        nvim >= 0.7, emacs >= 27 (Debian: neovim emacs-nox [elpa-eglot]),
#        go (to generate the large mechanism), chromium, g++ and make (VS Code
#        end-to-end test; see vscode/test/e2e/run.sh).
set -uo pipefail

if [[ $# -ne 1 ]]; then
  echo "usage: $0 KILN_BINARY" >&2
  exit 2
fi
binary=$(readlink -f "$1")
here=$(cd "$(dirname "$0")" && pwd)
failed=()

run() {
  local name=$1
  shift
  echo "=== editors: $name"
  if "$@"; then
    echo "=== editors: $name: ok"
  else
    echo "=== editors: $name: FAILED"
    failed+=("$name")
  fi
}

vscode() {
  cd "$here/vscode" || return 1
  if [[ ! -d node_modules ]]; then
    npm ci --no-audit --no-fund || return 1
  fi
  npm test && npm run package && [[ -s kiln-0.1.0.vsix ]]
}

# A generated mechanism of ~5,000 species for the edit -> diagnostics tests.
big=""
if command -v go >/dev/null; then
  bigdir=$(mktemp -d)
  trap 'rm -rf "$bigdir"' EXIT
  if (cd "$here/.." && go run ./internal/tools/genmech -molecules 2500 -seed 1 >"$bigdir/big5k.kiln"); then
    big="$bigdir/big5k.kiln"
  else
    failed+=("genmech")
  fi
else
  echo "editors: go not found; the large-file editor tests are skipped"
fi

run vscode vscode
if [[ -x /usr/bin/chromium || -n "${CHROMIUM:-}" ]]; then
  run vscode-e2e "$here/vscode/test/e2e/run.sh" "$binary" "$here/vscode/kiln-0.1.0.vsix"
else
  echo "editors: chromium not found; the VS Code end-to-end test is skipped (apt-get install chromium)"
fi
run nvim "$here/nvim/test/run.sh" "$binary" "$big"
run emacs "$here/emacs/test/run.sh" "$binary" "$big"

if ((${#failed[@]} > 0)); then
  echo "editors: failed: ${failed[*]}"
  exit 1
fi
echo "editors: all passed"
