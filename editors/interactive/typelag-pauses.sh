#!/usr/bin/env bash
# usage: typelag-pauses.sh TMUX-SESSION TEXT
# Like testdata/tester3/typelag.sh (types char by char, ~8 chars/s, and times
# each key until its echo shows in the pane), but pauses 0.6-1.5 s after each
# space, so that the editor's idle work (sending the change, the diagnostics
# that come back) runs while the next keys arrive. Prints each lag and
# mean/p50/p95/max.
s=$1; text=$2; pauses=(0.6 0.9 1.2 1.5 0.75 1.05); p=0; max=0; tot=0; n=0; lags=()
for ((i=0;i<${#text};i++)); do
  c=${text:$i:1}
  pre=${text:0:$((i+1))}; pre="${pre%"${pre##*[! ]}"}"
  start=$(date +%s%N)
  tmux send-keys -t "$s" -l "$c"
  while ! tmux capture-pane -p -t "$s" | grep -qF -- "$pre"; do
    sleep 0.005; now=$(date +%s%N)
    if (( (now-start)/1000000 > 5000 )); then echo "timeout at $i"; break; fi
  done
  now=$(date +%s%N); lag=$(( (now-start)/1000000 )); tot=$((tot+lag)); n=$((n+1)); (( lag>max )) && max=$lag
  lags+=("$lag"); echo -n "$lag "
  if [[ "$c" == " " ]]; then sleep "${pauses[$((p % ${#pauses[@]}))]}"; p=$((p+1)); else sleep 0.12; fi
done
mapfile -t sorted < <(printf '%s\n' "${lags[@]}" | sort -n)
echo; echo "chars=$n mean=$((tot/n)) ms p50=${sorted[$((n/2))]} ms p95=${sorted[$(( (n*95+99)/100 - 1 ))]} ms max=$max ms"
