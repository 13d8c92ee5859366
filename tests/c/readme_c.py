"""Compiles and runs every ```c block of README.md against the installed C library.

Run after scripts/test-c.sh (which installs to target/capi-prefix). Each block must be a
whole program; it is built with the flags `pkg-config --cflags --libs hydrograde` gives
and must exit 0. Prints "N passed, N failed" and exits non-zero on any failure or when
README.md has no C block.
"""

import os
import re
import subprocess
import sys
import tempfile
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
PREFIX = ROOT / "target" / "capi-prefix"


def main() -> int:
    blocks = re.findall(r"```c\n(.*?)```", (ROOT / "README.md").read_text(), re.S)
    if not blocks:
        print("README.md has no ```c block\n0 passed, 1 failed")
        return 1
    env = dict(os.environ, PKG_CONFIG_PATH=str(PREFIX / "lib" / "pkgconfig"))
    flags = subprocess.run(
        ["pkg-config", "--cflags", "--libs", "hydrograde"], env=env, check=True, capture_output=True, text=True
    ).stdout.split()
    passed = failed = 0
    with tempfile.TemporaryDirectory() as tmp:
        for i, code in enumerate(blocks):
            src, exe = Path(tmp) / f"readme{i}.c", Path(tmp) / f"readme{i}"
            src.write_text(code)
            build = subprocess.run(
                ["gcc", "-std=c99", "-Wall", "-Wextra", "-Werror", str(src), *flags,
                 f"-Wl,-rpath,{PREFIX / 'lib'}", "-o", str(exe)],
                capture_output=True, text=True,
            )
            run = subprocess.run([str(exe)], capture_output=True, text=True) if build.returncode == 0 else None
            if run is not None and run.returncode == 0:
                passed += 1
                print(f"  ok    README C block {i + 1}: {run.stdout.strip()}")
            else:
                failed += 1
                print(f"  FAIL  README C block {i + 1}\n{build.stderr}{run.stderr if run else ''}")
    print(f"{passed} passed, {failed} failed")
    return 0 if failed == 0 else 1


if __name__ == "__main__":
    sys.exit(main())
