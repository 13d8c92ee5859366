"""Section and Fitting from Python: exact solutions and the core's numbers."""

from __future__ import annotations

import math

import numpy as np
import pytest

import hydrograde as hg


def test_circle_exact():
    s = hg.Section.circle(0.1)
    # Exact geometry: A = πd²/4, P = πd, D_h = d; laminar f·Re = 64 (Hagen–Poiseuille).
    assert s.area == pytest.approx(math.pi * 0.01 / 4, rel=1e-15)
    assert s.wetted_perimeter == pytest.approx(math.pi * 0.1, rel=1e-15)
    assert (s.hydraulic_diameter, s.laminar_constant, s.is_circular, s.warnings) == (0.1, 64.0, True, [])
    assert repr(s) == "Section.circle(diameter=0.1)"
    assert s.velocity(np.array([0.0, 0.01])).tolist() == [0.0, 0.01 / s.area]


def test_non_circular_shapes():
    # Exact analytical solution: equilateral triangle, f·Re = 160/3 (Shah & London 1978).
    assert hg.Section.triangle(0.2).laminar_constant == pytest.approx(160 / 3, rel=1e-14)
    r = hg.Section.rectangle(0.3, 0.1)
    # Exact geometry: D_h = 2wh/(w+h).
    assert r.hydraulic_diameter == pytest.approx(2 * 0.3 * 0.1 / 0.4, rel=1e-15)
    assert r.warnings == ["non_circular_section"]
    assert r.dimensions == {"width": 0.3, "height": 0.1}
    assert r.turbulent_diameter("laminar_equivalent") == pytest.approx(64 / r.laminar_constant * r.hydraulic_diameter)
    a = hg.Section.annulus(0.1, 0.05)
    assert a.hydraulic_diameter == pytest.approx(0.05, rel=1e-15)  # exact: D_h = outer − inner
    assert hg.Section.ellipse(0.2, 0.2).laminar_constant == pytest.approx(64.0, rel=1e-12)  # circle limit
    c = hg.Section.custom(0.01, 0.5, 70.0)
    assert (c.shape, c.laminar_constant) == ("custom", 70.0)
    with pytest.raises(hg.OutOfRangeError, match="inner"):
        hg.Section.annulus(0.05, 0.1)
    with pytest.raises(hg.UnknownNameError):
        r.turbulent_diameter("mean")


def test_fittings():
    f = hg.Fitting.expansion(0.05, 0.1)
    # Borda–Carnot: K = (1 − (d_in/d_out)²)² on the inlet velocity (exact for the model).
    assert f.k_at(1e5, 0.05, 0.0) == pytest.approx((1 - 0.25) ** 2, rel=1e-14)
    k = hg.Fitting.k(0.9, diameter=0.05)
    assert (k.method, k.diameter, k.parameters) == ("k", 0.05, {"k": 0.9})
    # K referred from bore d₁ to bore d₂ scales with (d₂/d₁)⁴ (continuity, exact).
    assert k.k_at(1e5, 0.1, 0.0) == pytest.approx(0.9 * 16, rel=1e-14)
    ks = hg.Fitting.three_k(800.0, 0.14, 4.0).k_at(np.array([1e3, 1e5]), 0.1, 0.0)
    assert ks.shape == (2,) and ks[0] > ks[1]
    cat = hg.Fitting.catalogue()
    assert cat and {"name", "description", "method", "k_spread", "source"} <= set(cat[0])
    named = hg.Fitting.named(cat[0]["name"])
    assert named.name == cat[0]["name"]
    assert named.with_k_spread(0.5).k_spread == 0.5
    assert repr(k) == "Fitting('k', k=0.9, diameter=0.05, k_spread=0.3)"
    with pytest.raises(hg.UnknownNameError):
        hg.Fitting.named("no such fitting")
    with pytest.raises(hg.InvalidInputError):
        f.with_diameter(0.2)
