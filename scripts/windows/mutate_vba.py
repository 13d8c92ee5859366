#!/usr/bin/env python3
"""Shows that the checks of the spreadsheet module catch real mistakes: applies ten single
changes, one at a time, to a copy of capi/excel/hydrograde.bas and runs the module check
(tests/c/check_vba.py) on each copy. Every change must fail it; the unchanged copy must
pass. (The generator's regenerate-and-compare test would catch all of them trivially, so
it is not used here.) Exits non-zero when a change survives."""

from __future__ import annotations

import re
import sys
import tempfile
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "tests" / "c"))
import check_vba  # noqa: E402

MUTATIONS: list[tuple[str, str, str]] = [
    # (what, pattern, replacement); the pattern must match exactly once.
    ("density and viscosity swapped in a call",
     r"(s = hydro_pipe_head_loss\(.*?)density_v, viscosity_v", r"\1viscosity_v, density_v"),
    ("re and rel_roughness swapped in a Declare",
     r"(hydro_darcy_factor Lib \"hydrograde.dll\" \()ByVal re As Double, ByVal rel_roughness As Double",
     r"\1ByVal rel_roughness As Double, ByVal re As Double"),
    ("a wrong Lib name",
     r"(Function hydro_water) Lib \"hydrograde.dll\"", r'\1 Lib "hydrograd.dll"'),
    ("a syntax error (a closing parenthesis lost)",
     r"(s = hydro_convert\(value_v, from_unit_v, to_unit_v, result, msg, HYDRO_MSG_LEN)\)", r"\1"),
    ("Option Explicit removed", r"Option Explicit\r\n", ""),
    ("a buffer length of 3200 for a smaller buffer",
     r"(?s)(Function HydroLineDominant\(.*?s = hydro_line_head\(.*?dominant, )HYDRO_TEXT_LEN", r"\g<1>3200"),
    ("an output passed by value (ByRef -> ByVal)",
     r"(hydro_roughness Lib .*?)ByRef roughness As Double", r"\1ByVal roughness As Double"),
    ("a Double declared as Long",
     r"(hydro_line_head Lib .*?)ByVal flow As Double", r"\1ByVal flow As Long"),
    ("a wrapper returning the wrong output",
     r"HydroWaterDensity = density\r\n", "HydroWaterDensity = viscosity\r\n"),
    ("from_unit and to_unit swapped in a call",
     r"s = hydro_convert_head\(value_v, from_unit_v, to_unit_v", "s = hydro_convert_head(value_v, to_unit_v, from_unit_v"),
]


def main() -> int:
    original = check_vba.gen_vba.BAS.read_bytes().decode("cp1252")
    survivors = []
    with tempfile.TemporaryDirectory() as tmp:
        copy = Path(tmp) / "hydrograde.bas"
        copy.write_bytes(original.encode("cp1252"))
        base = check_vba.check(copy)
        if base:
            print("the unchanged module fails its check:", *base, sep="\n  ")
            return 1
        for i, (what, pat, rep) in enumerate(MUTATIONS, 1):
            changed, n = re.subn(pat, rep, original, flags=re.M)
            if n != 1:
                print(f"{i:2}. {what}: the pattern matched {n} times (the module changed?)")
                survivors.append(what)
                continue
            copy.write_bytes(changed.encode("cp1252"))
            fails = check_vba.check(copy)
            if fails:
                print(f"{i:2}. {what}: caught ({fails[0]})")
            else:
                print(f"{i:2}. {what}: NOT caught")
                survivors.append(what)
    print(f"mutate_vba: {len(MUTATIONS) - len(survivors)} of {len(MUTATIONS)} changes caught")
    return 1 if survivors else 0


if __name__ == "__main__":
    sys.exit(main())
