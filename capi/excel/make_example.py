#!/usr/bin/env python3
"""Writes capi/excel/example.xlsx: the layout of a workbook that uses the Hydro* worksheet
functions, with the formulas in place, for an invented line (a transfer pump lifting
water from a sump to a roof tank) and an invented pump table.

An .xlsx holds no macros: import hydrograde.bas into it and save it as .xlsm (README,
"Excel"). Until then the formula cells show #NAME?.

    make_example.py            write example.xlsx
    make_example.py --check    fail when example.xlsx differs from a fresh generation
                               (cell values and formulas)"""

from __future__ import annotations

import sys
import tempfile
from datetime import datetime
from pathlib import Path

from openpyxl import Workbook, load_workbook
from openpyxl.styles import Font

HERE = Path(__file__).resolve().parent
OUT = HERE / "example.xlsx"

CAUTION = ("Results are engineering estimates with stated uncertainty (friction correlations about "
           "+-10 %, fitting data more). Designs must be checked by a competent engineer - licensed or "
           "registered where the law requires - against the codes and standards that apply where they are built.")

# The invented line: kind, size, length, material or roughness, fitting or K, rise, label.
LINE = [
    ("fitting", "steel 3 40", None, None, "foot_valve_hinged", None, "sump inlet"),
    ("pipe", "steel 3 40", 4, "commercial steel", None, 2.5, "suction"),
    ("fitting", None, None, None, "elbow_90_long_radius", None, "pump inlet bend"),
    ("pipe", "steel 2-1/2 40", 6, "commercial steel", None, None, "discharge"),
    ("fitting", None, None, None, "swing_check_valve", None, "non-return"),
    ("fitting", None, None, None, "gate_valve", None, "isolation"),
    ("pipe", 62.7, 38, 0.05, None, 16, "riser (bore and roughness in mm)"),
    ("fitting", None, None, None, "elbow_90_standard", None, "roof bend"),
    ("fitting", None, None, None, 1.0, None, "tank entry (K = 1)"),
    (None, None, None, None, None, None, None),
]
# The invented pump: flow (L/s), head (m).
PUMP = [(0, 34), (2, 33.4), (4, 31.6), (6, 28.4), (8, 23.9), (10, 18.0), (12, 10.8)]


def build(path: Path) -> None:
    wb = Workbook()
    ws = wb.active
    ws.title = "Line"
    bold = Font(bold=True)
    ws["A1"] = "hydrograde example: sump to roof tank (invented line and pump)"
    ws["A1"].font = Font(bold=True, size=14)
    ws["A2"] = CAUTION
    ws["A4"], ws["B4"], ws["C4"] = "Water temperature", 15, "degC"
    ws["A5"], ws["B5"], ws["C5"] = "Absolute pressure", 1.013, "bar"
    ws["A6"], ws["B6"], ws["C6"] = "Density (kg/m3)", "=HydroWaterDensity(B4, B5, C4, C5)", ""
    ws["A7"], ws["B7"], ws["C7"] = "Viscosity (Pa*s)", "=HydroWaterViscosity(B4, B5, C4, C5)", ""
    ws["A8"], ws["B8"], ws["C8"] = "Design flow", 6, "L/s"
    header = ["kind", "size (mm or table nominal schedule)", "length (m)", "material or roughness (mm)",
              "fitting or K", "rise (m)", "label"]
    for c, h in enumerate(header, 1):
        ws.cell(row=10, column=c, value=h).font = bold
    for r, row in enumerate(LINE, 11):
        for c, v in enumerate(row, 1):
            if v is not None:
                ws.cell(row=r, column=c, value=v)
    last = 10 + len(LINE)
    rng = f"$A$11:$G${last}"
    results = [
        ("Required head at the design flow (m)", f'=HydroLineHead({rng}, $B$6, $B$7, $B$8, $C$8, "mm", "m")'),
        ("  band low (m)", f'=HydroLineHeadLow({rng}, $B$6, $B$7, $B$8, $C$8, "mm", "m")'),
        ("  band high (m)", f'=HydroLineHeadHigh({rng}, $B$6, $B$7, $B$8, $C$8, "mm", "m")'),
        ("  dominant source of the band", f'=HydroLineDominant({rng}, $B$6, $B$7, $B$8, $C$8, "mm", "m")'),
        ("Flow under 25 m of head (L/s)", f'=HydroLineFlow({rng}, $B$6, $B$7, 25, "L/s", "mm", "m")'),
        ("Operating point: flow (L/s)", f'=HydroOperatingFlow({rng}, $B$6, $B$7, $J$11:$K${10 + len(PUMP)}, "L/s", "mm", "m")'),
        ("Operating point: head (m)", f'=HydroOperatingHead({rng}, $B$6, $B$7, $J$11:$K${10 + len(PUMP)}, "L/s", "mm", "m")'),
        ("Darcy factor at Re 1e5, e/D 1e-4", '=HydroDarcyFactor(100000, 0.0001)'),
        ("Error text example (negative Re)", '=HydroDarcyFactor(-1, 0.0001)'),
    ]
    for i, (label, formula) in enumerate(results, last + 2):
        ws.cell(row=i, column=1, value=label)
        ws.cell(row=i, column=2, value=formula)
    ws["J10"], ws["K10"] = "pump flow (L/s)", "pump head (m)"
    ws["J10"].font = ws["K10"].font = bold
    for r, (q, h) in enumerate(PUMP, 11):
        ws.cell(row=r, column=10, value=q)
        ws.cell(row=r, column=11, value=h)
    # The system curve: one formula over the pump table's flows spills a column of heads
    # (a dynamic array; older Excel: select L11:L17 and enter it with Ctrl+Shift+Enter).
    ws["L10"] = "line head (m)"
    ws["L10"].font = bold
    ws["L11"] = f'=HydroLineHead({rng}, $B$6, $B$7, $J$11:$J${10 + len(PUMP)}, "L/s", "mm", "m")'
    for col, width in zip("ABCDEFGHIJKL", (38, 22, 11, 24, 22, 9, 32, 3, 3, 16, 15, 15)):
        ws.column_dimensions[col].width = width
    fixed = datetime(2026, 1, 1)
    wb.properties.created = wb.properties.modified = fixed
    wb.save(path)


def cells(path: Path) -> list:
    wb = load_workbook(path)
    return [(ws.title, c.coordinate, c.value) for ws in wb for row in ws.iter_rows() for c in row
            if c.value is not None]


def main() -> int:
    if "--check" in sys.argv:
        with tempfile.TemporaryDirectory() as tmp:
            fresh = Path(tmp) / "example.xlsx"
            build(fresh)
            if not OUT.exists() or cells(fresh) != cells(OUT):
                print("capi/excel/example.xlsx differs from make_example.py; run it", file=sys.stderr)
                return 1
        print("example.xlsx is up to date")
        return 0
    build(OUT)
    return 0


if __name__ == "__main__":
    sys.exit(main())
