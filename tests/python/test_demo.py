"""The Python demo gives the same numbers as the Rust demo, bit for bit.

Both print their key results with every digit (Rust ``{:?}``, Python ``repr``: the
shortest decimal string that reads back to the same double), so reading them back and
comparing the bits is an exact check that one core gave one answer through both languages.
"""

from __future__ import annotations

import os
import shutil
import struct
import subprocess
import sys
from pathlib import Path
from typing import Dict

import pytest

REPO = Path(__file__).resolve().parents[2]
DEMO = REPO / "examples" / "demo.py"


def parse(text: str) -> Dict[str, int]:
    """``name value`` lines as the bits of each double."""
    out: Dict[str, int] = {}
    for line in text.splitlines():
        name, value = line.split()
        assert name not in out, f"{name} printed twice"
        out[name] = struct.unpack("<Q", struct.pack("<d", float(value)))[0]
    return out


def run(cmd: list, timeout: float = 900.0) -> str:
    env = dict(os.environ, CARGO_BUILD_JOBS=os.environ.get("CARGO_BUILD_JOBS", "2"))
    done = subprocess.run(cmd, cwd=REPO, capture_output=True, text=True, timeout=timeout, env=env)
    assert done.returncode == 0, f"{cmd} failed:\n{done.stderr}"
    return done.stdout


@pytest.mark.skipif(shutil.which("cargo") is None, reason="cargo is not on PATH (it is in CI)")
def test_python_demo_numbers_equal_the_rust_demo_bitwise():
    rust = parse(run(["cargo", "run", "-q", "--release", "-p", "hydrograde", "--example", "demo",
                      "--", "--numbers"]))
    python = parse(run([sys.executable, str(DEMO), "--numbers"]))
    assert len(rust) >= 12
    assert list(python) == list(rust)
    for name, bits in rust.items():
        # The same core, the same inputs: the same double (every binding calls one core).
        assert python[name] == bits, (
            f"{name}: Python {struct.unpack('<d', struct.pack('<Q', python[name]))[0]!r} "
            f"≠ Rust {struct.unpack('<d', struct.pack('<Q', bits))[0]!r}"
        )


def test_python_demo_runs_end_to_end_and_shows_the_caution():
    text = run([sys.executable, str(DEMO)], timeout=120.0)
    for needle in ("Hillside orchard", "operating point", "smallest PVC schedule 40",
                   "Workshop exhaust duct", "fan must supply", "Caution:", "competent engineer"):
        assert needle in text, needle
    assert text.rstrip().splitlines()[-1].startswith("Caution:")
    try:
        import matplotlib  # noqa: F401
    except ImportError:
        return
    png = REPO / "target" / "demo" / "orchard_system_curve.png"
    assert f"written to {png}" in text
    # The PNG signature (ISO/IEC 15948:2004 §5.2).
    assert png.read_bytes()[:8] == b"\x89PNG\r\n\x1a\n"
