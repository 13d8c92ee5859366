"""Writes units_reference.csv: conversions between hydrograde's unit names, computed
with pint (a general-purpose units library) and its own unit definitions.

Run from the repository root with pint installed:
    python tests/reference/units/make_units_reference.py

Columns: value, from, to, density (kg/m3, empty unless a head is involved), expected.
core/tests/units_reference.rs checks hydrograde::units::{convert, convert_head} against
every row to 1e-12 relative.
"""

import csv
import itertools
import pathlib

import pint

ureg = pint.UnitRegistry()

# hydrograde unit name -> pint expression
PINT = {
    "m": "meter", "mm": "millimeter", "cm": "centimeter", "in": "inch", "ft": "foot",
    "m3/s": "meter**3/second", "L/s": "liter/second", "L/min": "liter/minute",
    "m3/h": "meter**3/hour", "gpm": "gallon/minute",
    "Pa": "pascal", "kPa": "kilopascal", "MPa": "megapascal", "bar": "bar",
    "psi": "pound_force/inch**2", "atm": "atmosphere",
    "Pa*s": "pascal*second", "mPa*s": "millipascal*second", "cP": "centipoise",
    "K": "kelvin", "degC": "degC", "degF": "degF",
    "m/s": "meter/second", "ft/s": "foot/second",
}
GROUPS = [
    ["m", "mm", "cm", "in", "ft"],
    ["m3/s", "L/s", "L/min", "m3/h", "gpm"],
    ["Pa", "kPa", "MPa", "bar", "psi", "atm"],
    ["Pa*s", "mPa*s", "cP"],
    ["K", "degC", "degF"],
    ["m/s", "ft/s"],
]
# Values away from the zeros of the affine temperature scales, so a relative test is fair.
VALUES = [1.0, 2.5, 123.456, 1e-3, 7.3e4, 310.0]
HEADS = {"m_head": "meter", "ft_head": "foot"}
PRESSURES = GROUPS[2]
DENSITIES = [998.2071, 1000.0, 13534.0, 1.2041]


def head_rows():
    g0 = ureg.Quantity(1, "standard_gravity")
    for value, density in itertools.product([0.75, 12.5, 310.0], DENSITIES):
        rho = ureg.Quantity(density, "kilogram/meter**3")
        for h, hp in HEADS.items():
            pa = (ureg.Quantity(value, hp) * rho * g0).to("pascal")
            for p in PRESSURES:
                yield value, h, p, density, pa.to(PINT[p]).magnitude
                # and back: the pressure of that magnitude converts to `value` of head
                back = (ureg.Quantity(value, PINT[p]) / (rho * g0)).to(hp)
                yield value, p, h, density, back.magnitude
        for a, b in itertools.permutations(HEADS, 2):
            yield value, a, b, density, ureg.Quantity(value, HEADS[a]).to(HEADS[b]).magnitude


def main():
    out = pathlib.Path(__file__).with_name("units_reference.csv")
    with out.open("w", newline="") as fh:
        w = csv.writer(fh, lineterminator="\n")
        w.writerow(["value", "from", "to", "density", "expected"])
        for group in GROUPS:
            for a, b in itertools.permutations(group, 2):
                for v in VALUES:
                    q = ureg.Quantity(v, PINT[a]).to(PINT[b]).magnitude
                    w.writerow([repr(v), a, b, "", repr(float(q))])
        for v, a, b, rho, q in head_rows():
            w.writerow([repr(v), a, b, repr(rho), repr(float(q))])


if __name__ == "__main__":
    main()
