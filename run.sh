#!/usr/bin/env bash
# The one entry point for building, testing and running hydrograde.
#
#   ./run.sh demo    run the main job on the built-in demo data (Rust, then C and Python)
#   ./run.sh test    run every test suite: Rust, C/C++ and Python
#   ./run.sh bench   run the benchmarks and the side-by-side comparison
#   ./run.sh windows build the Windows DLLs (x64, x86) into dist/windows (cached; see
#                    scripts/windows/build.sh)
#
# Each command installs what it needs, idempotently: a Python virtual environment in
# .venv with the packages of tests/requirements.txt, and (for the C suite) cbindgen and
# cmake. Run from anywhere; it works in the repository it lives in.
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")"
export CARGO_BUILD_JOBS="${CARGO_BUILD_JOBS:-2}"

say() { printf '\n== %s\n' "$*"; }

setup_python() {
  if [ ! -x .venv/bin/python ]; then
    say "creating .venv"
    python3 -m venv .venv
  fi
  local stamp=.venv/.requirements.sha256
  local want
  want=$(sha256sum tests/requirements.txt | cut -d' ' -f1)
  if [ ! -f "$stamp" ] || [ "$(cat "$stamp")" != "$want" ]; then
    say "installing Python packages (tests/requirements.txt)"
    .venv/bin/python -m pip install -q --upgrade pip
    .venv/bin/python -m pip install -q -r tests/requirements.txt
    echo "$want" > "$stamp"
  fi
}

build_python() {
  setup_python
  say "building the Python wheel (maturin, release)"
  .venv/bin/maturin develop --release -q -m py/Cargo.toml --target-dir target/py
}

cmd_demo() {
  say "demo: Rust"
  cargo run -q --release -p hydrograde --example demo
  if [ -x scripts/demo-c.sh ]; then
    say "demo: C"
    scripts/demo-c.sh
  fi
  if [ -f py/python/hydrograde/__init__.py ] && [ -f examples/demo.py ]; then
    build_python
    say "demo: Python"
    .venv/bin/python examples/demo.py
  fi
}

cmd_test() {
  setup_python
  say "Rust: format and lint"
  cargo fmt --all -- --check
  cargo clippy -q --workspace --all-targets -- -D warnings
  say "Rust: tests"
  cargo test -q --workspace
  if [ -f scripts/test-c.sh ]; then
    say "C and C++"
    bash scripts/test-c.sh
    say "README C examples"
    .venv/bin/python tests/c/readme_c.py
  fi
  if [ -f scripts/test-python.sh ]; then
    say "Python"
    bash scripts/test-python.sh
  fi
  test_windows
}

cmd_windows() {
  say "Windows DLLs (x64, x86)"
  bash scripts/windows/build.sh
}

# The spreadsheet door: the module against its specification, the ten mutations, and the
# DLLs (built or taken from the cache) under Wine against the Linux library.
test_windows() {
  say "Windows: spreadsheet module, mutations, DLLs under Wine"
  .venv/bin/python scripts/windows/gen_vba.py --check
  .venv/bin/python tests/c/check_vba.py
  .venv/bin/python scripts/windows/mutate_vba.py
  .venv/bin/python capi/excel/make_example.py --check
  bash scripts/windows/wine.sh
  .venv/bin/python tests/windows/test_dll.py
}

cmd_bench() {
  if [ -f scripts/bench.sh ]; then
    bash scripts/bench.sh
  else
    cargo bench -p hydrograde-benches
  fi
}

case "${1:-}" in
  demo) cmd_demo ;;
  test) cmd_test ;;
  bench) cmd_bench ;;
  windows) cmd_windows ;;
  *) echo "usage: ./run.sh demo|test|bench|windows" >&2; exit 2 ;;
esac
