"""Least-squares pump-curve fits from Python, against numpy.polyfit (reference library)."""

from __future__ import annotations

import numpy as np
import pytest

import hydrograde as hg

FLOWS = [0.0, 0.0015, 0.003, 0.0045, 0.006, 0.0075, 0.009, 0.0105, 0.012]
# An invented pump, H = 42 − 500 Q − 2.0e5 Q², with fixed centimetre-level noise.
NOISE = [0.031, -0.052, 0.018, 0.044, -0.027, -0.061, 0.036, 0.012, -0.023]
HEADS = [42.0 - 500.0 * q - 2.0e5 * q * q + e for q, e in zip(FLOWS, NOISE)]


@pytest.mark.parametrize("degree", [2, 3])
def test_fit_matches_numpy_polyfit(degree):
    curve = hg.PumpCurve.fit(FLOWS, HEADS, degree=degree)
    info = curve.fit_info
    want = np.polyfit(FLOWS, HEADS, degree)[::-1]  # numpy.polyfit: reference library
    assert info["degree"] == degree
    assert info["coefficients"] == pytest.approx(want, rel=1e-9)
    r = np.polyval(want[::-1], FLOWS) - np.array(HEADS)
    assert info["rms_residual"] == pytest.approx(np.sqrt(np.mean(r * r)), rel=1e-9)
    assert info["max_residual"] == pytest.approx(np.max(np.abs(r)), rel=1e-9)
    # Heads from the curve are the polynomial's values (arrays broadcast).
    q = np.linspace(0.0, 0.012, 5)
    assert curve.head(q) == pytest.approx(np.polyval(want[::-1], q), rel=1e-9)


def test_exact_quadratic_and_operating_point():
    # Points on H = 40 − 20000 Q²: the fit is that parabola (exact solution).
    q = [0.005 * i for i in range(7)]
    h = [40.0 - 20000.0 * x * x for x in q]
    fit = hg.PumpCurve.fit(q, h)
    c = fit.fit_info["coefficients"]
    assert c[0] == pytest.approx(40.0, rel=1e-12) and abs(c[1]) < 1e-8
    assert c[2] == pytest.approx(-20000.0, rel=1e-11)
    assert hg.PumpCurve(q, h).fit_info is None
    water = hg.Fluid.water(293.15)
    line = hg.Line([hg.Pipe(0.08, 150.0, 4.5e-5), hg.Rise(12.0)])
    op = line.operating_point(water, fit)
    # At the operating point the pump's head is the line's required head (definition).
    assert line.required_head(water, op.flow) == pytest.approx(op.head, rel=1e-9)
    assert op.head == pytest.approx(40.0 - 20000.0 * op.flow**2, rel=1e-10)
    import pickle

    back = pickle.loads(pickle.dumps(fit))
    assert back == fit and back.fit_info == fit.fit_info
    view = fit._repr_html_()
    assert "least-squares fit of degree 2" in view and "RMS" in view


def test_degenerate_fits_are_clear_errors():
    with pytest.raises(hg.InvalidInputError, match="degree-3 fit needs at least 4 points, got 3"):
        hg.PumpCurve.fit([0.0, 0.01, 0.02], [30.0, 29.0, 26.0], degree=3)
    with pytest.raises(hg.OutOfRangeError, match="degree"):
        hg.PumpCurve.fit([0.0, 0.01, 0.02], [30.0, 29.0, 26.0], degree=5)
    with pytest.raises(hg.OutOfRangeError, match="degree"):
        hg.PumpCurve.fit([0.0, 0.01, 0.02], [30.0, 29.0, 26.0], degree=-1)
    with pytest.raises(hg.OutOfRangeError, match="must increase strictly"):
        hg.PumpCurve.fit([0.0, 0.02, 0.01], [30.0, 29.0, 26.0])
    with pytest.raises(hg.NotFiniteError):
        hg.PumpCurve.fit([0.0, 0.01, float("nan")], [30.0, 29.0, 26.0])
