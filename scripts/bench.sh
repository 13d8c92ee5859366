#!/usr/bin/env bash
# hydrograde's speed figures, one command (`./run.sh bench` calls this):
#
#   scripts/bench.sh            all of the below, in this order
#   scripts/bench.sh ratios     only the Rust ratio table (about 30 s once built)
#   scripts/bench.sh compare    only the Python comparison
#   scripts/bench.sh criterion  only the criterion suites
#   scripts/bench.sh profile    only the callgrind instruction counts (scripts/profile.sh)
#   scripts/bench.sh bands      only the band timings against line length (about 1 min)
#   scripts/bench.sh readme     README's Performance tables from the last runs' tables
#
# The ratio table and the comparison each run in one process, so their ratios compare
# like with like on a busy machine; the targets and whether they are met are printed at
# the end of each. Benchmarks never fail on speed: a missed target is reported, not
# raised. Needs cargo and python3; makes .venv (numpy, scipy, maturin) when missing and
# builds the Python wheel into it when the py/ package is present.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
export CARGO_BUILD_JOBS="${CARGO_BUILD_JOBS:-2}"
what="${1:-all}"
# Each part's table also goes to target/bench/, from which `readme` rebuilds the
# Performance tables in README.md (between the bench-table markers): never typed by hand.
out=target/bench
mkdir -p "$out"

say() { printf '\n== %s\n' "$*"; }

criterion() {
  say "criterion benchmarks (benches/benches/*.rs)"
  cargo bench -q -p hydrograde-benches -- --output-format bencher 2>&1 \
    | grep -E '^test |Warning' || true
}

ratios() {
  local args=()
  if grep -qs 'fn hg_darcy_factor_batch' capi/src/*.rs; then
    say "building the C library (release)"
    cargo build -q --release -p hydrograde-capi
    args=(--capi "$PWD/target/release/libhydrograde.so")
  fi
  say "Rust ratio table (one process)"
  cargo build -q --release -p hydrograde-benches --bin ratios
  target/release/ratios "${args[@]}" | tee "$out/ratios.md"
}

python_env() {
  if [ ! -x .venv/bin/python ]; then
    say "creating .venv"
    python3 -m venv .venv
  fi
  if ! .venv/bin/python -c 'import numpy, scipy' 2>/dev/null || [ ! -x .venv/bin/maturin ]; then
    say "installing numpy, scipy, maturin into .venv"
    .venv/bin/python -m pip install -q numpy scipy maturin
  fi
  if [ -f py/python/hydrograde/__init__.py ]; then
    say "building the Python wheel (maturin, release)"
    .venv/bin/maturin develop --release -q -m py/Cargo.toml --target-dir target/py
  fi
}

compare() {
  python_env
  say "Python comparison (one process)"
  .venv/bin/python benches/compare.py | tee "$out/compare.md"
}

profile() {
  if command -v valgrind >/dev/null; then
    say "instructions per point (callgrind; reproducible on a busy machine)"
    bash scripts/profile.sh | tee "$out/profile.md"
  else
    say "valgrind not installed: instruction counts skipped"
  fi
}

bands() {
  say "band timings against line length (one thread)"
  cargo run -q --release -p hydrograde-benches --bin bands | tee "$out/bands.md"
}

readme() {
  say "README.md performance tables (from $out/*.md)"
  python3 - "$out" <<'PY'
import sys
from pathlib import Path

out = Path(sys.argv[1])
parts = []
for name, title in (("ratios", "Rust, one process"), ("compare", "Python, one process"),
                    ("profile", "instructions per point (callgrind, AVX2 at most under valgrind)")):
    f = out / f"{name}.md"
    if f.exists():
        text = f.read_text()
        # From the first summary line on (build chatter before it is dropped).
        start = min((i for i in (text.find("hydrograde speed"), text.find("Python comparison"),
                                 text.find("| workload")) if i >= 0), default=0)
        parts.append(f"**{title}** (`scripts/bench.sh {name}`)\n\n" + text[start:].strip())
bands = out / "bands.md"
if bands.exists():
    parts.append("**band timings against line length** (`scripts/bench.sh bands`)\n\n```text\n"
                 + bands.read_text().strip() + "\n```")
readme = Path("README.md")
s = readme.read_text()
begin, end = "<!-- bench-table:begin -->", "<!-- bench-table:end -->"
i, j = s.find(begin), s.find(end)
if i < 0 or j < 0:
    sys.exit("README.md has no bench-table markers")
readme.write_text(s[: i + len(begin)] + "\n" + "\n\n".join(parts) + "\n" + s[j:])
print("README.md updated")
PY
}

case "$what" in
  all) criterion; ratios; compare; profile; bands; readme ;;
  bands) bands ;;
  readme) readme ;;
  profile) profile ;;
  criterion) criterion ;;
  ratios) ratios ;;
  compare) compare ;;
  *) echo "usage: scripts/bench.sh [all|criterion|ratios|compare|profile|bands|readme]" >&2; exit 2 ;;
esac
