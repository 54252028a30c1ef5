#!/usr/bin/env bash
# Interactive measurements in a real terminal editor under tmux, on a
# generated mechanism: edit -> diagnostics shown (N edit/undo pairs, from the
# probe log the editor writes) and per-key echo lag with pauses.
#
# Usage: editors/interactive/run.sh emacs|nvim KILN_BINARY [PLUGIN_DIR [MOLECULES [EDITS]]]
#   PLUGIN_DIR: editors/emacs or editors/nvim of some checkout (default: this one)
# Needs tmux, and emacs-nox + elpa-eglot or neovim.
set -euo pipefail
editor=$1
binary=$(readlink -f "$2")
here=$(cd "$(dirname "$0")" && pwd)
plugin=$(readlink -f "${3:-$here/../$editor}")
molecules=${4:-2500}
edits=${5:-4}
work=$(mktemp -d)
session=kiln-interactive-$$
trap 'tmux kill-session -t "$session" 2>/dev/null; rm -rf "$work"' EXIT
(cd "$here/../.." && go run ./internal/tools/genmech -molecules "$molecules" -seed 1 >"$work/big.kiln")
log=$work/probe.log
line=5001 # a species line near 40 % of the file
echo "file: $(wc -l <"$work/big.kiln") lines; machine: $(nproc) cores, load average $(cut -d' ' -f1-3 /proc/loadavg)"
if [[ $editor == emacs ]]; then
  tmux new-session -d -s "$session" -x 160 -y 40 \
    "KILN_EMACS_DIR=$plugin KILN_BINARY=$binary KILN_PROBE_LOG=$log emacs -nw -Q -l $here/emacs-probe.el +$line $work/big.kiln"
  edit=(C-e) text='((' after=() undo=(BSpace BSpace) next=(C-n) newline=(C-e Enter) done=()
else
  tmux new-session -d -s "$session" -x 160 -y 40 \
    "KILN_PLUGIN_DIR=$plugin KILN_BINARY=$binary KILN_PROBE_LOG=$log nvim -u $here/nvim-probe.lua -i NONE -n +$line $work/big.kiln"
  edit=(A) text='((' after=(Escape) undo=(u) next=(j) newline=(o) done=(Escape)
fi
sleep 10 # server start and first diagnostics
for ((k=0;k<edits;k++)); do
  : >"$log"; tmux send-keys -t "$session" "${edit[@]}"; tmux send-keys -t "$session" -l "$text"
  [[ ${#after[@]} -gt 0 ]] && tmux send-keys -t "$session" "${after[@]}"
  sleep 3.5
  e=$(grep -m1 ' err ' "$log" | cut -d' ' -f1 || true)
  : >"$log"; tmux send-keys -t "$session" "${undo[@]}"; sleep 3.5
  # Emacs: the first report without the error after a publication was
  # handled (Flymake's own check reports too); Neovim: the first update.
  if [[ $editor == emacs ]]; then
    u=$(awk '/publication/{p=1} p && / ok /{print $1; exit}' "$log")
  else
    u=$(awk '/ ok /{print $1; exit}' "$log")
  fi
  echo "$editor: edit -> error shown ${e:-never} s, undo -> error gone ${u:-never} s"
  tmux send-keys -t "$session" "${next[@]}"
done
tmux send-keys -t "$session" "${newline[@]}"; sleep 1
echo "$editor: typing with pauses: $("$here/typelag-pauses.sh" "$session" '#qy ab cd ef gh ij kl mn op qr st uv wx yz ab cd ef gh' | tail -1)"
[[ ${#done[@]} -gt 0 ]] && tmux send-keys -t "$session" "${done[@]}"
echo "load average after: $(cut -d' ' -f1-3 /proc/loadavg)"
