#!/usr/bin/env bash
# Builds the hydrograde wheel into the repo's .venv and runs the Python checks:
# the type stubs against the built module (mypy.stubtest) and the pytest suites.
# Expects .venv at the repo root with tests/requirements.txt installed (./run.sh does that).
# The ctypes bitwise test uses target/release/libhydrograde.so from scripts/test-c.sh.
set -euo pipefail
cd "$(dirname "$0")/.."
PY=.venv/bin/python
if [ ! -x "$PY" ]; then
    echo "test-python.sh: no .venv at the repo root (python3 -m venv .venv && .venv/bin/pip install -r tests/requirements.txt)" >&2
    exit 2
fi

echo "== building the wheel (maturin develop --release, target/py)"
.venv/bin/maturin develop --release -m py/Cargo.toml --target-dir target/py -q

echo "== mypy.stubtest hydrograde"
"$PY" -m mypy.stubtest hydrograde --allowlist tests/python/stubtest-allowlist.txt

echo "== pytest tests/python"
"$PY" -m pytest tests/python -q -p no:cacheprovider "$@"
