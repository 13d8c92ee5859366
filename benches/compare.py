"""Side-by-side cost of the Darcy friction factor in Python, in one process.

    .venv/bin/python benches/compare.py [--points 1000000] [--scipy-points 1000]

Times, on the same 1e6 random turbulent points (Re log-uniform in 4e3…1e8, eps/D
log-uniform in 1e-6…0.05, fixed seed):

- ``np.log`` on the Reynolds array: the cost floor of anything that takes a logarithm;
- ``hydrograde.darcy_factor`` (exact Colebrook), on all cores and in single-threaded
  chunks below the library's parallel threshold;
- numpy-vectorized Haaland (1983): what a notebook user writes;
- a numpy-vectorized exact solver: Haaland start, two Halley steps on 1/sqrt(f);
- a per-element ``scipy.optimize.brentq`` loop on Colebrook, on a 1,000-point subset,
  scaled to the full size;
- ``hydrograde.darcy_factor`` on a 1000 x 1000 broadcast (``re[:, None]`` against
  ``rr[None, :]``, read in place through the core's strided batch) and on the same
  1e6 points as full arrays: broadcasting should cost no more than 10 % extra.

Every time is the best of several repetitions, so the ratios compare like with like on a
busy machine. The table ends with the targets and whether each is met.
"""

from __future__ import annotations

import argparse
import math
import os
import sys
import time
from typing import Callable

import numpy as np

LN10 = math.log(10.0)
PARALLEL_THRESHOLD = 16_384  # hydrograde.friction::PARALLEL_THRESHOLD (core/src/friction/mod.rs)


def points(n: int, seed: int = 2026) -> tuple[np.ndarray, np.ndarray]:
    """n turbulent points, log-uniform in Re 4e3…1e8 and eps/D 1e-6…0.05."""
    rng = np.random.default_rng(seed)
    re = np.exp(rng.uniform(math.log(4e3), math.log(1e8), n))
    rr = np.exp(rng.uniform(math.log(1e-6), math.log(0.05), n))
    return re, rr


def haaland(re: np.ndarray, rr: np.ndarray) -> np.ndarray:
    """Haaland (1983): 1/sqrt(f) = -1.8 log10((eps/D / 3.7)^1.11 + 6.9/Re)."""
    x = -1.8 * np.log10((rr / 3.7) ** 1.11 + 6.9 / re)
    return 1.0 / (x * x)


def colebrook_two_step(re: np.ndarray, rr: np.ndarray) -> np.ndarray:
    """Colebrook solved in x = 1/sqrt(f): Haaland start, two Halley steps.

    g(x) = x + 2 log10(a + b x), a = eps/D / 3.7, b = 2.51/Re;
    g' = 1 + c/u, g'' = -c b/u^2 with u = a + b x, c = 2 b / ln 10.
    """
    a = rr / 3.7
    b = 2.51 / re
    c = 2.0 * b / LN10
    x = -1.8 * np.log10(a**1.11 + 6.9 / re)
    for _ in range(2):
        u = a + b * x
        g = x + (2.0 / LN10) * np.log(u)
        g1 = 1.0 + c / u
        g2 = -c * b / (u * u)
        x = x - 2.0 * g * g1 / (2.0 * g1 * g1 - g * g2)
    return 1.0 / (x * x)


def scipy_loop(re: np.ndarray, rr: np.ndarray) -> np.ndarray:
    """One scipy root-find per point, on the same residual in x = 1/sqrt(f)."""
    from scipy.optimize import brentq

    out = np.empty_like(re)
    for i in range(re.size):
        a, b = rr[i] / 3.7, 2.51 / re[i]
        x = brentq(
            lambda x: x + 2.0 * math.log10(a + b * x), 1.0, 40.0, xtol=1e-15, rtol=1e-15
        )
        out[i] = 1.0 / (x * x)
    return out


def race(work: list[Callable[[], object]], reps: int) -> list[float]:
    """Fastest wall time (s) of each callable, run in turns: one warm-up round, then
    `reps` rounds. Taking turns exposes every method to the same disturbances from other
    work on the machine, so the ratios stay meaningful when it is busy."""
    best = [math.inf] * len(work)
    for round_ in range(reps + 1):
        for i, fn in enumerate(work):
            t = time.perf_counter()
            fn()
            if round_ > 0:
                best[i] = min(best[i], time.perf_counter() - t)
    return best


def main() -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--points", type=int, default=1_000_000)
    ap.add_argument("--scipy-points", type=int, default=1_000)
    ap.add_argument("--reps", type=int, default=7)
    args = ap.parse_args()
    n, ns = args.points, args.scipy_points
    re, rr = points(n)

    try:
        import hydrograde  # noqa: PLC0415 (optional: the table says when it is missing)
    except ImportError as e:
        hydrograde = None
        print(f"hydrograde not importable ({e}); its rows are left out", file=sys.stderr)

    sub_re, sub_rr = re[:ns], rr[:ns]
    work: list[tuple[str, Callable[[], object], int]] = [
        ("np.log(re) (cost floor)", lambda: np.log(re), n),
        ("numpy Haaland (explicit, ~1.5 %)", lambda: haaland(re, rr), n),
        ("numpy exact two-step (Haaland + 2 Halley)", lambda: colebrook_two_step(re, rr), n),
        (f"scipy brentq loop ({ns} points, scaled)", lambda: scipy_loop(sub_re, sub_rr), ns),
    ]
    hg = None
    chunk = PARALLEL_THRESHOLD - 384
    if hydrograde is not None:
        hg = hydrograde.darcy_factor(re, rr)

        def chunked() -> None:
            for s in range(0, n, chunk):
                hydrograde.darcy_factor(re[s : s + chunk], rr[s : s + chunk])

        work[1:1] = [
            ("hydrograde.darcy_factor, exact, all cores", lambda: hydrograde.darcy_factor(re, rr), n),
            (f"hydrograde.darcy_factor, exact, 1 thread (chunks of {chunk})", chunked, n),
        ]
    grid = ("hydrograde.darcy_factor, 1000 x 1000 broadcast re[:, None], rr[None, :]",
            "hydrograde.darcy_factor, the same 1e6 points as full arrays")
    if hydrograde is not None:
        gre, grr = re[:1000], rr[:1000]
        full_re, full_rr = (np.ascontiguousarray(a) for a in np.broadcast_arrays(gre[:, None], grr[None, :]))
        work[-1:-1] = [
            (grid[0], lambda: hydrograde.darcy_factor(gre[:, None], grr[None, :]), gre.size * grr.size),
            (grid[1], lambda: hydrograde.darcy_factor(full_re, full_rr), full_re.size),
        ]
    times = race([fn for _, fn, _ in work], args.reps)
    per = {name: t / count for (name, _, count), t in zip(work, times)}
    names = [name for name, _, _ in work]
    t_log = per[names[0]]
    t_haal = per["numpy Haaland (explicit, ~1.5 %)"]
    t_sp = per[names[-1]]
    two = colebrook_two_step(re, rr)
    values: dict[str, np.ndarray | None] = {
        names[0]: None,
        "numpy Haaland (explicit, ~1.5 %)": haaland(re, rr),
        "numpy exact two-step (Haaland + 2 Halley)": two,
        names[-1]: None,
    }
    if hg is not None:
        t_hg, t_hg1 = per[names[1]], per[names[2]]
        values[names[1]] = hg
        values[names[2]] = hg
        values[grid[0]] = values[grid[1]] = None  # another set of points: no error column
    rows = [(name, per[name], values[name]) for name in names]

    ref = hg if hg is not None else two
    ref_name = "hydrograde" if hg is not None else "numpy two-step"
    sp_vals = scipy_loop(sub_re, sub_rr)
    sp_err = float(np.max(np.abs(sp_vals / ref[:ns] - 1.0)))

    print(
        f"Python comparison: {n} turbulent points (Re 4e3..1e8, eps/D 1e-6..0.05, "
        f"log-uniform), best of {args.reps} taken in turns; numpy {np.__version__}, "
        f"{os.cpu_count()} CPUs"
    )
    print()
    print(f"| method | ns per element | vs np.log | vs hydrograde | max rel. diff vs {ref_name} |")
    print("|---|---:|---:|---:|---:|")
    hg_t = rows[1][1] if hg is not None else math.nan
    for what, t, vals in rows:
        err = "" if vals is None else f"{float(np.max(np.abs(vals / ref - 1.0))):.1e}"
        if what.startswith("scipy"):
            err = f"{sp_err:.1e}"
        vs_hg = "" if math.isnan(hg_t) else f"{t / hg_t:.2f}"
        print(f"| {what} | {t * 1e9:.2f} | {t / t_log:.2f} | {vs_hg} | {err} |")

    print()
    print("| target | measured | met |")
    print("|---|---:|---|")
    if hg is not None:
        r = t_hg / t_haal
        print(f"| darcy_factor (1e6, exact) <= 0.7x numpy Haaland's time | {r:.2f}x Haaland's time | {'met' if r <= 0.7 else 'NOT met'} |")
        r1 = t_hg1 / t_haal
        print(f"| same, single-threaded | {r1:.2f}x Haaland's time | {'met' if r1 <= 0.7 else 'NOT met'} |")
        s = t_sp / t_hg
        print(f"| >= 2000x faster than the scipy loop | {s:.0f}x | {'met' if s >= 2000 else 'NOT met'} |")
        s1 = t_sp / t_hg1
        print(f"| same, single-threaded | {s1:.0f}x | {'met' if s1 >= 2000 else 'NOT met'} |")
        b = per[grid[0]] / per[grid[1]]
        print(f"| broadcast inputs within 10 % of full arrays (1e6 points) | {b:.2f}x full arrays' time | {'met' if b <= 1.10 else 'NOT met'} |")
    else:
        print("| (hydrograde not installed: targets not measured) | | |")
    return 0


if __name__ == "__main__":
    sys.exit(main())
