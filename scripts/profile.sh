#!/usr/bin/env bash
# Instructions per point of hydrograde's friction paths, counted by callgrind.
#   scripts/profile.sh [workload ...]     (default: ln, every correlation per call and through
#   the batch kernel on the baseline and AVX2 instruction sets, the line)
# Point generation (workload `none`) is subtracted. `line` is one flow through the
# 20-element benchmark line (required head), the system curve's work per flow;
# `flow_for_head` one flow for a head on it (band included); `bands` and `bands:split`
# count per element: one evaluation with bands of a long line, a two-branch split of two.
# Each workload runs twice (10k and 20k points); the difference / 10k is the cost of one
# point with start-up and input generation cancelled. Counts are reproducible on a busy
# machine, unlike wall-clock times.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
cargo build -q --release -p hydrograde-benches --bin profile
bin=target/release/profile
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
count() {
  # Band workloads build a long line first: only their evaluation (`measured`) counts.
  local only=()
  case "$1" in bands*) only=(--toggle-collect='*measured*') ;; esac
  valgrind --tool=callgrind "${only[@]}" --callgrind-out-file="$tmp/cg.$1.$2" "$bin" "$1" "$2" >/dev/null 2>"$tmp/log"
  grep -m1 '^summary:' "$tmp/cg.$1.$2" | awk '{print $2}'
}
per_point() { echo $(( ($(count "$1" 20000) - $(count "$1" 10000)) / 10000 )); }
base=$(per_point none)
ln=$(( $(per_point ln) - base ))
cb=$(( $(per_point colebrook) - base ))
ratio() { awk -v a="$1" -v b="$2" 'BEGIN{printf "%.2f", a/b}'; }
printf '| workload | instructions per point | vs ln | vs one exact Colebrook call |\n|---|---:|---:|---:|\n'
default="ln colebrook batch"
for c in colebrook haaland swamee_jain churchill serghides blasius fully_rough; do
  [ "$c" = colebrook ] || default+=" $c"
  default+=" batch:$c:baseline batch:$c:avx2"
done
for w in ${@:-$default line flow_for_head bands bands:split}; do
  case "$w" in bands*) n=$(per_point "$w") ;; *) n=$(( $(per_point "$w") - base )) ;; esac
  printf '| %s | %d | %s | %s |\n' "$w" "$n" "$(ratio "$n" "$ln")" "$(ratio "$n" "$cb")"
done
