"""Reference least-squares pump-curve fits by numpy.polyfit, for core/tests/pump_fit.rs.

An invented pump (H = 42 − 500 Q − 2.0e5 Q², Q in m³/s, H in m) sampled at 9 flows with
fixed pseudo-measurement noise of a few centimetres; numpy.polyfit (least squares by
LAPACK's SVD solver) fits degree 2 and 3. Prints the data and the coefficients in
ascending powers in shortest round-trip form (repr).

Run: .venv/bin/python tests/reference/pump_fit/generate.py
"""

import numpy as np

flows = [0.0, 0.0015, 0.003, 0.0045, 0.006, 0.0075, 0.009, 0.0105, 0.012]
noise = [0.031, -0.052, 0.018, 0.044, -0.027, -0.061, 0.036, 0.012, -0.023]
heads = [42.0 - 500.0 * q - 2.0e5 * q * q + e for q, e in zip(flows, noise)]
print("flows =", [repr(q) for q in flows])
print("heads =", [repr(h) for h in heads])
for degree in (2, 3):
    c = np.polyfit(flows, heads, degree)[::-1]
    r = np.polyval(c[::-1], flows) - np.array(heads)
    print(f"degree {degree}: coefficients =", [repr(float(x)) for x in c])
    print(f"  rms = {float(np.sqrt(np.mean(r * r)))!r}, max = {float(np.max(np.abs(r)))!r}")
