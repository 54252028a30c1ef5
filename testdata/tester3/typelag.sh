#!/bin/bash
# usage: typelag.sh SESSION TEXT ; types char by char at ~8 chars/s, reports lag per char
s=$1; text=$2; max=0; tot=0; n=0
for ((i=0;i<${#text};i++)); do
  c=${text:$i:1}
  pre=${text:0:$((i+1))}; pre="${pre%"${pre##*[! ]}"}"
  start=$(date +%s%N)
  tmux send-keys -t $s -l "$c"
  while ! tmux capture-pane -p -t $s | grep -qF -- "$pre"; do sleep 0.005; now=$(date +%s%N); if (( (now-start)/1000000 > 5000 )); then echo "timeout at $i"; break; fi; done
  now=$(date +%s%N); lag=$(( (now-start)/1000000 )); tot=$((tot+lag)); n=$((n+1)); (( lag>max )) && max=$lag
  echo -n "$lag "
  sleep 0.12
done
echo; echo "chars=$n mean=$((tot/n)) ms max=$max ms"
