"""Reference values of the elementary functions at 40 significant digits (mpmath).

Each row is `function,x,y,value,nearest,remainder`: the exact double inputs (printed as
Python's shortest round-trip repr, so they read back to the same double), the
mathematically exact result of the function at those doubles rounded to 40 digits, that
result's nearest double and the remainder (value − nearest, as a double), from which a
test measures errors in fractions of an ulp. The points cover the ranges the core's
correlations and property formulas use, and wider:

- ln, log10: log-uniform over 1e-300…1e300, and uniform over 0.5…2 (near 1, where the
  result is small and the relative error hardest to keep);
- ln_1p: uniform over −0.5…1e3 (log-uniform above 1), ±1e-12…1e-1 log-uniform;
- exp: uniform over −700…700 and −1…1;
- pow: x log-uniform over 1e-12…1e12, y uniform over −3…3, plus the exponents the
  correlations use (0.9, −0.9, 1.11, −1.5, 1/12, −0.25, 0.25, 1.5, 0.3);
- sinh: log-uniform over 1e-8…20;
- sin, cos: uniform over 0…2π;
- hypot: both arguments log-uniform over 1e-200…1e200, and ratios within 1e-8…1.

Run from the repository root:  .venv/bin/python tests/reference/elementary/generate.py
"""

import csv
import math
import random
from pathlib import Path

import mpmath as mp

mp.mp.dps = 60
N = 1000


def loguni(rng, lo, hi):
    return math.exp(rng.uniform(math.log(lo), math.log(hi)))


def main():
    rng = random.Random(20261202)
    rows = []

    def add(name, x, y, v):
        hi = float(v)
        lo = float(v - mp.mpf(hi))
        rows.append((name, repr(float(x)), repr(float(y)), mp.nstr(v, 40, strip_zeros=False), repr(hi), repr(lo)))

    for i in range(N):
        x = loguni(rng, 1e-300, 1e300) if i % 2 else rng.uniform(0.5, 2.0)
        add("ln", x, 0.0, mp.log(mp.mpf(x)))
        add("log10", x, 0.0, mp.log10(mp.mpf(x)))
    for i in range(N):
        r = i % 3
        if r == 0:
            x = rng.uniform(-0.5, 1.0)
        elif r == 1:
            x = loguni(rng, 1.0, 1e3)
        else:
            x = loguni(rng, 1e-12, 1e-1) * rng.choice((-1.0, 1.0))
        add("ln_1p", x, 0.0, mp.log1p(mp.mpf(x)))
    for i in range(N):
        x = rng.uniform(-700.0, 700.0) if i % 2 else rng.uniform(-1.0, 1.0)
        add("exp", x, 0.0, mp.exp(mp.mpf(x)))
    special = [0.9, -0.9, 1.11, -1.5, 1.0 / 12.0, -0.25, 0.25, 1.5, 0.3]
    for i in range(N):
        x = loguni(rng, 1e-12, 1e12)
        y = special[i % len(special)] if i % 2 else rng.uniform(-3.0, 3.0)
        add("pow", x, y, mp.power(mp.mpf(x), mp.mpf(y)))
    for i in range(N):
        x = loguni(rng, 1e-8, 20.0)
        add("sinh", x, 0.0, mp.sinh(mp.mpf(x)))
    for i in range(N):
        x = rng.uniform(0.0, 2.0 * math.pi)
        add("sin", x, 0.0, mp.sin(mp.mpf(x)))
        add("cos", x, 0.0, mp.cos(mp.mpf(x)))
    for i in range(N):
        x = loguni(rng, 1e-200, 1e200)
        y = x * loguni(rng, 1e-8, 1.0) if i % 2 else loguni(rng, 1e-200, 1e200)
        add("hypot", x, y, mp.sqrt(mp.mpf(x) ** 2 + mp.mpf(y) ** 2))

    out = Path(__file__).with_name("elementary.csv")
    with out.open("w", newline="") as fh:
        w = csv.writer(fh, lineterminator="\n")
        w.writerow(("function", "x", "y", "value", "nearest", "remainder"))
        w.writerows(rows)
    print(f"wrote {len(rows)} rows to {out}")


if __name__ == "__main__":
    main()
