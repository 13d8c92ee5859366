"""Independent computation of line results for core/tests/line_reference.rs.

Everything is written out here with mpmath at 30 digits, formulas visible:

  pipe        h = f (L/D) V|V| / (2 g),  V = Q / (pi D^2 / 4),  Re = rho |V| D / mu
              f = 64/Re (Re < 2300), Colebrook-White (Re > 4000), and between them the
              smoothstep blend f = (1-w) 64/Re + w f_C(Re), w = 3t^2 - 2t^3,
              t = (Re - 2300)/(4000 - 2300)
  K fitting   h = K V|V| / (2 g) on the velocity of the bore it refers to
  3-K         K = K1/Re + Ki (1 + Kd / D_in^0.3), D_in the bore in inches (Darby 2001)
  expansion   K = (1 - (d1/d2)^2)^2 on the inlet velocity (Borda-Carnot); passed
              backwards it is a sudden contraction, K = 0.5 (1 - (d1/d2)^2) on the same
              (small-bore) velocity (Crane TP-410, 1988, from memory)
  rise        + dz
  g           9.80665 m/s^2 (standard gravity)

Outputs (CSV, 25 significant digits):
  evaluate.csv       flow, required_head, d(required_head)/dQ (mpmath.diff)
  flow_for_head.csv  head, flow                      (mpmath.findroot)
  operating.csv      flow, head of the pump curve below (Fritsch-Carlson cubic)
  split.csv          total, q_a, q_b, head for the two parallel branches below
  sizing.csv         pressure-loss limit, smallest bore of the sizing line below

Run from the repository root:  .venv/bin/python tests/reference/line/generate.py
"""

import csv
from pathlib import Path

import mpmath as mp

mp.mp.dps = 30
G = mp.mpf("9.80665")
RHO = mp.mpf("999.5")
MU = mp.mpf("1.2e-3")
HERE = Path(__file__).parent


def colebrook(re, rr):
    g = lambda x: x + 2 * mp.log10(rr / mp.mpf("3.7") + mp.mpf("2.51") * x / re)
    x = mp.findroot(g, mp.mpf(8))
    return 1 / x**2


def friction(re, rr):
    if re < 2300:
        return 64 / re
    fc = colebrook(re, rr)
    if re > 4000:
        return fc
    t = (re - 2300) / mp.mpf(1700)
    w = 3 * t**2 - 2 * t**3
    return (1 - w) * 64 / re + w * fc


def area(d):
    return mp.pi * d**2 / 4


def pipe(q, d, length, eps):
    v = q / area(d)
    if v == 0:
        return mp.mpf(0)
    re = RHO * abs(v) * d / MU
    return friction(re, eps / d) * length / d * v * abs(v) / (2 * G)


def k_loss(q, k, d):
    v = q / area(d)
    return k * v * abs(v) / (2 * G)


def three_k(q, k1, ki, kd, d):
    v = q / area(d)
    if v == 0:
        return mp.mpf(0)
    re = RHO * abs(v) * d / MU
    k = k1 / re + ki * (1 + kd / (d / mp.mpf("0.0254")) ** mp.mpf("0.3"))
    return k * v * abs(v) / (2 * G)


DA, DB = mp.mpf("0.0525"), mp.mpf("0.0779")


def main_line(q):
    """Entrance K 0.5, pipe A, 3-K elbow, expansion A->B, pipe B, rise 12.5 m, exit K 1."""
    h = k_loss(q, mp.mpf("0.5"), DA)
    h += pipe(q, DA, mp.mpf(120), mp.mpf("4.5e-5"))
    h += three_k(q, mp.mpf(800), mp.mpf("0.14"), mp.mpf("4.0"), DA)
    forward, backward = (1 - (DA / DB) ** 2) ** 2, (1 - (DA / DB) ** 2) / 2
    h += k_loss(q, forward if q >= 0 else backward, DA)
    h += pipe(q, DB, mp.mpf(250), mp.mpf("1.5e-6"))
    h += mp.mpf("12.5")
    h += k_loss(q, mp.mpf(1), DB)
    return h


def branch_a(q):
    return pipe(q, mp.mpf("0.04"), mp.mpf(60), mp.mpf("4.5e-5")) + k_loss(q, mp.mpf(6), mp.mpf("0.04"))


def branch_b(q):
    return pipe(q, mp.mpf("0.065"), mp.mpf(140), mp.mpf("1.5e-6")) + mp.mpf(2)


PUMP_Q = [0.0, 0.002, 0.004, 0.006, 0.008, 0.010]
PUMP_H = [60.0, 58.5, 55.0, 49.0, 40.5, 29.0]


def pump(q):
    """Monotone cubic Hermite with the Fritsch-Carlson (1980) limiter."""
    xs = [mp.mpf(x) for x in PUMP_Q]
    ys = [mp.mpf(y) for y in PUMP_H]
    n = len(xs)
    delta = [(ys[i + 1] - ys[i]) / (xs[i + 1] - xs[i]) for i in range(n - 1)]
    m = [delta[0]] + [
        mp.mpf(0) if delta[i - 1] * delta[i] <= 0 else (delta[i - 1] + delta[i]) / 2 for i in range(1, n - 1)
    ] + [delta[-1]]
    for i in range(n - 1):
        if delta[i] == 0:
            m[i] = m[i + 1] = mp.mpf(0)
            continue
        a, b = m[i] / delta[i], m[i + 1] / delta[i]
        r = mp.sqrt(a * a + b * b)
        if r > 3:
            m[i], m[i + 1] = 3 / r * a * delta[i], 3 / r * b * delta[i]
    i = max(j for j in range(n - 1) if xs[j] <= q)
    h = xs[i + 1] - xs[i]
    t = (q - xs[i]) / h
    return ((2 * t**3 - 3 * t**2 + 1) * ys[i] + (t**3 - 2 * t**2 + t) * h * m[i]
            + (-2 * t**3 + 3 * t**2) * ys[i + 1] + (t**3 - t**2) * h * m[i + 1])


def write(name, header, rows):
    with (HERE / name).open("w", newline="") as fh:
        w = csv.writer(fh)
        w.writerow(header)
        for r in rows:
            w.writerow([mp.nstr(v, 25) for v in r])


def main():
    flows = ["-3e-3", "-1e-4", "1e-6", "1e-4", "1.5e-4", "1.9e-4", "3e-3", "1e-2", "2.5e-2"]
    rows = []
    for qs in flows:
        q = mp.mpf(qs)
        rows.append((q, main_line(q), mp.diff(main_line, q)))
    write("evaluate.csv", ["flow", "required_head", "drequired_head_dflow"], rows)

    rows = []
    for hs in ["5", "12.5000001", "13", "20", "45", "150"]:
        h = mp.mpf(hs)
        q = mp.findroot(lambda x: main_line(x) - h, mp.mpf("1e-3") if h > 12.5 else mp.mpf("-1e-3"))
        rows.append((h, q))
    write("flow_for_head.csv", ["head", "flow"], rows)

    q = mp.findroot(lambda x: pump(x) - main_line(x), mp.mpf("0.006"))
    write("operating.csv", ["flow", "head"], [(q, pump(q))])

    rows = []
    for ts in ["1e-4", "2e-3", "8e-3"]:
        t = mp.mpf(ts)
        qa = mp.findroot(lambda x: branch_a(x) - branch_b(t - x), t / 2)
        rows.append((t, qa, t - qa, branch_a(qa)))
    write("split.csv", ["total", "q_a", "q_b", "head"], rows)
    sizing()


def sizing_loss(d, q):
    """Pipe 80 m, eps 4.5e-5, then a K = 3 valve on the same bore: pressure loss, Pa."""
    return RHO * G * (pipe(q, d, mp.mpf(80), mp.mpf("4.5e-5")) + k_loss(q, mp.mpf(3), d))


def sizing():
    q = mp.mpf("4e-3")
    rows = []
    for limit in ["5e4", "2e5"]:
        lim = mp.mpf(limit)
        lo, hi = mp.mpf("0.02"), mp.mpf("0.2")  # plain bisection: the loss falls as d grows
        for _ in range(110):
            mid = (lo + hi) / 2
            lo, hi = (mid, hi) if sizing_loss(mid, q) > lim else (lo, mid)
        d = (lo + hi) / 2
        rows.append((lim, d))
    write("sizing.csv", ["pressure_loss_limit", "min_inside_diameter"], rows)


if __name__ == "__main__":
    main()
