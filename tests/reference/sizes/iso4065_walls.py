"""Writes the minimum-wall rows of core/src/sizes/plastic.rs (PE ISO 4427-2, PVC-U ISO 1452-2).

The standards' wall tables follow ISO 4065: e_min = dn / (2 S + 1) with S the exact
preferred number of the pipe series (R10: S 5 = 10^0.7, S 6.3 = 10^0.8, S 8 = 10^0.9,
S 10, S 12.5 = 10^1.1, S 16 = 10^1.2, S 20 = 10^1.3), taken to 0.01 mm and then rounded
up to 0.1 mm (rule as recalled, from memory; it reproduces every published value checked
in core/tests/sizes_metric.rs). PE small sizes take at least 2.0 mm, and ISO 4427-2 sets
32 SDR 11 to 3.0 mm (both as printed in published copies of the table). Cells whose
calculated wall is below 1.8 mm (PE) or 1.5 mm (PVC-U) are not in the tables.

Run: python3 tests/reference/sizes/iso4065_walls.py  (prints Rust rows)
"""

import math

S = {"SDR 41": 10**1.3, "SDR 33": 10**1.2, "SDR 26": 10**1.1, "SDR 21": 10.0,
     "SDR 17": 10**0.9, "SDR 13.6": 10**0.8, "SDR 11": 10**0.7}
DN = [20, 25, 32, 40, 50, 63, 75, 90, 110, 125, 140, 160, 180, 200, 225, 250, 280, 315,
      355, 400, 450, 500, 560, 630]


def e_min(dn, s):
    v = dn / (2 * s + 1)
    return v, math.ceil(round(round(v, 2) * 10, 6)) / 10


def rows(series, least, floor, fixed):
    out = []
    for dn in DN:
        walls = []
        for k in series:
            calc, e = e_min(dn, S[k])
            if calc < least:
                walls.append(0.0)
                continue
            walls.append(fixed.get((dn, k), max(e, floor)))
        if any(walls):
            out.append(f'    ("{dn}", {dn:.1f}, [{", ".join(f"{w:.1f}" for w in walls)}]),')
    return out


PE = ["SDR 33", "SDR 26", "SDR 21", "SDR 17", "SDR 13.6", "SDR 11"]
PVC = ["SDR 41", "SDR 33", "SDR 26", "SDR 21", "SDR 17", "SDR 13.6", "SDR 11"]
print("// PE, ISO 4427-2")
print("\n".join(rows(PE, 1.8, 2.0, {(32, "SDR 11"): 3.0})))
print("// PVC-U, ISO 1452-2")
print("\n".join(rows(PVC, 1.5, 0.0, {})))
