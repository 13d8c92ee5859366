"""Unit conversions from Python against pint."""

from __future__ import annotations

import numpy as np
import pint
import pytest

import hydrograde as hg

U = pint.UnitRegistry()
# Our unit names → pint's spelling of the same unit.
PINT = {
    "m": "m", "mm": "mm", "cm": "cm", "in": "inch", "ft": "foot",
    "m3/s": "m**3/s", "L/s": "L/s", "L/min": "L/min", "m3/h": "m**3/hour", "gpm": "gallon/minute",
    "Pa": "Pa", "kPa": "kPa", "MPa": "MPa", "bar": "bar", "psi": "psi", "atm": "atm",
    "Pa*s": "Pa*s", "mPa*s": "mPa*s", "cP": "cP",
    "K": "K", "degC": "degC", "degF": "degF",
    "m/s": "m/s", "ft/s": "ft/s",
}


def test_every_unit_is_covered_here():
    names = [n for n in hg.unit_names() if not n.endswith("_head")]
    assert sorted(names) == sorted(PINT)


def test_conversions_against_pint():
    for a in PINT:
        for b in PINT:
            qa = U.Quantity(1.0, PINT[a])
            if qa.dimensionality != U.Quantity(1.0, PINT[b]).dimensionality:
                with pytest.raises(hg.InvalidInputError):
                    hg.convert(1.0, a, b)
                continue
            for v in (0.5, 300.0):
                ref = U.Quantity(v, PINT[a]).to(PINT[b]).magnitude  # pint
                assert hg.convert(v, a, b) == pytest.approx(ref, rel=1e-12, abs=1e-12), (a, b, v)


def test_head_against_pint():
    # p = ρ g₀ h with pint's standard gravity.
    ref = (U.Quantity(10.0, "m") * U.Quantity(998.2, "kg/m**3") * U.Quantity(1, "gravity")).to("kPa")
    assert hg.convert_head(10.0, "m_head", "kPa", 998.2) == pytest.approx(ref.magnitude, rel=1e-12)
    out = hg.convert_head(np.array([1.0, 2.0]), "ft_head", "Pa", np.array([[1000.0], [800.0]]))
    assert out.shape == (2, 2)


def test_convert_broadcasts_and_reports_errors():
    assert hg.convert(2.0, "in", "mm") == 50.8  # 1 in = 25.4 mm exactly (NIST SP 811)
    arr = hg.convert(np.array([[0.0, 100.0]]), "degC", "K")
    assert arr.shape == (1, 2) and arr[0, 1] == pytest.approx(373.15, rel=1e-15)
    with pytest.raises(hg.UnknownNameError, match="furlong"):
        hg.convert(1.0, "furlong", "m")
    with pytest.raises(hg.OutOfRangeError):
        hg.convert(-500.0, "degC", "K")
