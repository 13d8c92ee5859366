"""The bounded fuzz of the C ABI: generates the sweep from the header, builds it against the
static library and runs batches of random calls, each in its own process (a crash or an
abort ends one batch and is reported with its seed).

A finding is a call that broke the contract (see gen_capi_fuzz.py). Findings listed in
known_capi_findings.txt are open defects recorded there with their cause; any other
finding, a crash, a hang or a batch that dies fails the run.

Usage: run_capi_fuzz.py HEADER STATIC_LIB OUT_DIR [SECONDS]   (HG_FUZZ_SEED moves the seeds)
Prints "N passed, N failed" last.
"""

import os
import re
import subprocess
import sys
import time
from pathlib import Path

HERE = Path(__file__).resolve().parent


# Codes no call can be made to return on purpose: HG_ERR_INTERNAL is a caught panic.
NEVER_ON_PURPOSE = {"HG_ERR_INTERNAL"}


def documented_codes(header: str) -> dict:
    """Each status-returning function's documented codes: the HG_ names of the paragraph of
    its doc comment that starts with "Returns"."""
    values = {m.group(1): int(m.group(2)) for m in re.finditer(r"#define (HG_(?:OK|ERR_\w+)) (-?\d+)", header)}
    out = {}
    for doc, name in re.findall(r"/\*\*((?:(?!\*/).)*)\*/\s*\nint32_t (hg_\w+)\(", header, flags=re.S):
        para = re.search(r"Returns .*?(?:\n \*\s*\n|$)", doc, flags=re.S)
        same = re.search(r"status codes as `(hg_\w+)`", doc)
        if para is None and same and same.group(1) in out:
            out[name] = set(out[same.group(1)])  # "same status codes as hg_x"
            continue
        names = set(re.findall(r"\b(HG_(?:OK|ERR_[A-Z_]+))\b", para.group(0) if para else ""))
        out[name] = {(c, values[c]) for c in names & set(values) - NEVER_ON_PURPOSE}
    return out


def checked_in_c_tests() -> set:
    """(function, code) pairs that a C test asserts: `hg_x(...) == HG_CODE`."""
    pairs = set()
    for src in sorted((HERE.parent / "c").glob("*.c")):
        for fn, code in re.findall(r"\b(hg_\w+)\([^;]*?\)\s*==\s*(HG_(?:OK|ERR_[A-Z_]+))\b", src.read_text()):
            pairs.add((fn, code))
    return pairs


def unprovoked(header: str, seen: set) -> list:
    """(function, code) pairs that a function documents and neither a call of the sweep
    returned nor a C test asserts."""
    tested = checked_in_c_tests()
    return sorted((fn, c) for fn, codes in documented_codes(header).items() for c, v in codes
                  if (fn, v) not in seen and (fn, c) not in tested)


def main() -> int:
    header, lib, out = sys.argv[1], sys.argv[2], Path(sys.argv[3])
    budget = float(sys.argv[4]) if len(sys.argv) > 4 else 40.0
    out.mkdir(parents=True, exist_ok=True)
    src, exe = out / "fuzz_capi.c", out / "fuzz_capi"
    n = subprocess.run([sys.executable, str(HERE / "gen_capi_fuzz.py"), header, str(src)], check=True,
                       capture_output=True, text=True).stdout.strip()
    inc = str(Path(header).parent)
    subprocess.run(["gcc", "-std=c11", "-O1", "-g", "-Wall", "-Wextra", "-Werror", "-Wno-unused-parameter",
                    "-I" + inc, str(src), "-o", str(exe), lib, "-lpthread", "-lm", "-ldl"], check=True)
    known = set()
    for line in (HERE / "known_capi_findings.txt").read_text().splitlines():
        if line.strip() and not line.startswith("#"):
            known.add(line.strip())
    base = int(os.environ.get("HG_FUZZ_SEED", "20261202"))
    passed = failed = 0
    calls = 0
    seen_known = set()
    seen_codes = set()
    start = time.monotonic()
    batch = 0
    while time.monotonic() - start < budget and batch < 64:
        seed = base + batch
        batch += 1
        try:
            p = subprocess.run([str(exe), str(seed), "50000"], capture_output=True, text=True, timeout=60)
        except subprocess.TimeoutExpired:
            failed += 1
            print(f"  FAIL  batch seed {seed}: no answer within 60 s")
            continue
        if p.returncode not in (0, 1):
            failed += 1
            print(f"  FAIL  batch seed {seed}: died with status {p.returncode}\n{p.stderr[-2000:]}")
            continue
        for f in re.finditer(r"^SEEN (\S+) (-?\d+)$", p.stdout, flags=re.M):
            seen_codes.add((f.group(1), int(f.group(2))))
        m = re.search(r"(\d+) calls", p.stdout)
        calls += int(m.group(1)) if m else 0
        new = []
        for line in p.stderr.splitlines():
            f = re.match(r"FAIL (\S+): (.*?) \(status", line)
            if not f:
                continue
            key = f"{f.group(1)}: {f.group(2)}"
            if key in known:
                seen_known.add(key)
            else:
                new.append(line)
        if new:
            failed += 1
            print(f"  FAIL  batch seed {seed}: {len(new)} new findings")
            for line in new[:20]:
                print("        " + line[:300])
        else:
            passed += 1
    print(f"  fuzz: {calls} calls over {n} functions in {batch} batches ({time.monotonic() - start:.1f} s); "
          f"{len(seen_known)} known open findings seen")
    missing = unprovoked(Path(header).read_text(), seen_codes)
    if missing:
        failed += 1
        print(f"  FAIL  documented return codes that neither the sweep nor a C test provoked ({len(missing)}):")
        for fn, code in missing:
            print(f"        {fn}: {code}")
    print(f"{passed} passed, {failed} failed")
    return 1 if failed or passed == 0 else 0


if __name__ == "__main__":
    sys.exit(main())
