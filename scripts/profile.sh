#!/usr/bin/env bash
# Instructions per point of hydrograde's friction paths, counted by callgrind.
#   scripts/profile.sh [workload ...]     (default: ln and five correlations)
# Point generation (workload `none`) is subtracted.
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
  valgrind --tool=callgrind --callgrind-out-file="$tmp/cg.$1.$2" "$bin" "$1" "$2" >/dev/null 2>"$tmp/log"
  grep -m1 '^summary:' "$tmp/cg.$1.$2" | awk '{print $2}'
}
per_point() { echo $(( ($(count "$1" 20000) - $(count "$1" 10000)) / 10000 )); }
base=$(per_point none)
ln=$(per_point ln)
printf '| workload | instructions per point | vs ln |\n|---|---:|---:|\n'
for w in ${@:-ln colebrook haaland swamee_jain serghides blasius}; do
  n=$(( $(per_point "$w") - base ))
  printf '| %s | %d | %s |\n' "$w" "$n" "$(awk -v a="$n" -v b="$((ln - base))" 'BEGIN{printf "%.2f", a/b}')"
done
