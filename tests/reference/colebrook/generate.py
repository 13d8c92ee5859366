"""Reference solutions of the Colebrook–White equation at 40 significant digits.

    1/sqrt(f) = -2 log10( (eps/D)/3.7 + 2.51 / (Re sqrt(f)) )

Solved with mpmath (mp.dps = 50, findroot on x = 1/sqrt(f), residual below 1e-45), then
printed with 40 significant digits. The points are a log-spaced grid of 50 Reynolds
numbers from 2300 to 1e9 times 41 relative roughnesses (0 and 40 log-spaced values from
1e-8 to 0.1), plus 500 seeded random points in the same box: 2550 rows.

Run from the repository root:  .venv/bin/python tests/reference/colebrook/generate.py
"""

import csv
import random
from pathlib import Path

import mpmath as mp

mp.mp.dps = 50


def solve(re, rr):
    re = mp.mpf(re)
    rr = mp.mpf(rr)
    g = lambda x: x + 2 * mp.log10(rr / mp.mpf("3.7") + mp.mpf("2.51") * x / re)
    x = mp.findroot(g, mp.mpf(8))
    assert abs(g(x)) < mp.mpf("1e-45"), (re, rr)
    return 1 / (x * x)


def points():
    res = [2300 * (1e9 / 2300) ** (i / 49) for i in range(50)]
    rrs = [0.0] + [1e-8 * (0.1 / 1e-8) ** (j / 39) for j in range(40)]
    for re in res:
        for rr in rrs:
            yield re, rr
    rng = random.Random(20261201)
    for _ in range(500):
        re = 10 ** rng.uniform(mp.log10(2300), 9)
        rr = 0.0 if rng.random() < 0.05 else 10 ** rng.uniform(-8, -1)
        yield float(re), float(rr)


def main():
    out = Path(__file__).with_name("colebrook.csv")
    with out.open("w", newline="") as fh:
        w = csv.writer(fh)
        w.writerow(["re", "rel_roughness", "f"])
        for re, rr in points():
            # repr() round-trips the exact double the Rust test parses back.
            w.writerow([repr(float(re)), repr(float(rr)), mp.nstr(solve(float(re), float(rr)), 40)])


if __name__ == "__main__":
    main()
