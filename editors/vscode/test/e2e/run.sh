#!/usr/bin/env bash
# End-to-end test of the VS Code extension in a real VS Code: the code-server
# build of VS Code (npm package code-server 4.96.4, VS Code 1.96.4; the last
# release that runs on Node.js 20) driven headless by Debian's Chromium
# through playwright-core. Checks diagnostics, inlay hints, hover, the
# NASA-7 quick fix and the equilibrium code lens against the real server
# (drive.mjs).
#
# Usage: editors/vscode/test/e2e/run.sh KILN_BINARY VSIX
# Needs: node/npm, chromium (Debian), g++ and make (code-server's native
# modules are built from source: their prebuilt binaries are downloaded from
# hosts outside the package registries). The build is cached in
# $KILN_VSCODE_CACHE (default ~/.cache/kiln-vscode-e2e).
set -euo pipefail
if [[ $# -ne 2 ]]; then
  echo "usage: $0 KILN_BINARY VSIX" >&2
  exit 2
fi
binary=$(readlink -f "$1")
vsix=$(readlink -f "$2")
here=$(cd "$(dirname "$0")" && pwd)
chromium=${CHROMIUM:-/usr/bin/chromium}
[[ -x "$chromium" ]] || { echo "vscode e2e: $chromium not found (apt-get install chromium)" >&2; exit 2; }
cache=${KILN_VSCODE_CACHE:-$HOME/.cache/kiln-vscode-e2e}
version=4.96.4

if [[ ! -f "$cache/ready-$version" ]]; then
  echo "vscode e2e: setting up code-server $version in $cache"
  rm -rf "$cache"
  mkdir -p "$cache"
  (
    cd "$cache"
    echo '{"private": true}' >package.json
    # Without scripts: code-server's own install script fetches a git
    # dependency and prebuilt binaries from outside the registries.
    npm install --ignore-scripts --no-audit --no-fund "code-server@$version" playwright-core@1.65.2
    cd node_modules/code-server/lib/vscode
    # The shrinkwrap pins a dependency to a git commit; the registry has it.
    rm -f npm-shrinkwrap.json
    npm install --ignore-scripts --omit=dev --no-audit --no-fund
    export npm_config_nodedir=/usr # headers of Debian's/the machine's Node.js
    npm rebuild @vscode/spdlog node-pty @parcel/watcher native-watchdog
    cd "$cache"
    npm rebuild argon2
  )
  touch "$cache/ready-$version"
fi

work=$(mktemp -d)
server_pid=""
cleanup() {
  if [[ -n "$server_pid" ]]; then kill "$server_pid" 2>/dev/null || true; wait "$server_pid" 2>/dev/null || true; fi
  rm -rf "$work"
}
trap cleanup EXIT
mkdir -p "$work/ud/User" "$work/ext" "$work/ws" "$work/shots"
cp "$here/fixture.kiln" "$work/ws/"
cat >"$work/ud/User/settings.json" <<JSON
{
  "kiln.server.path": "$binary",
  "workbench.startupEditor": "none",
  "security.workspace.trust.enabled": false,
  "telemetry.telemetryLevel": "off",
  "workbench.tips.enabled": false,
  "extensions.ignoreRecommendations": true,
  "update.mode": "none"
}
JSON
cs=(node "$cache/node_modules/code-server/out/node/entry.js" --user-data-dir "$work/ud" --extensions-dir "$work/ext")
"${cs[@]}" --install-extension "$vsix" >"$work/install.log" 2>&1 || { cat "$work/install.log"; exit 1; }
port=$((20000 + RANDOM % 20000))
"${cs[@]}" --auth none --bind-addr "127.0.0.1:$port" --disable-telemetry "$work/ws" >"$work/code-server.log" 2>&1 &
server_pid=$!
for _ in $(seq 1 100); do
  if node -e "require('http').get('http://127.0.0.1:$port/healthz', r => process.exit(r.statusCode < 500 ? 0 : 1)).on('error', () => process.exit(1))"; then
    break
  fi
  sleep 0.3
done
echo "vscode e2e: code-server $version on port $port, server $binary"
cp "$here/drive.mjs" "$cache/drive.mjs"
status=0
PORT=$port WS="$work/ws" CHROMIUM="$chromium" SHOTS="${KILN_VSCODE_SHOTS:-$work/shots}" \
  timeout 600 node "$cache/drive.mjs" || status=$?
if [[ $status -ne 0 ]]; then
  echo "vscode e2e: code-server log:"; tail -40 "$work/code-server.log"
fi
exit $status
