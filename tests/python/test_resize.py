"""Sizing that resizes everything it should, from Python. Laminar oil throughout, where the
loss of a round pipe has the exact closed form of Hagen–Poiseuille: Δp = 128 μ L Q / (π D⁴)."""

from __future__ import annotations

import math

import pytest

import hydrograde as hg

MU, RHO, Q = 0.1, 900.0, 1e-4  # an invented oil (Pa·s, kg/m³) and its flow (m³/s)


def oil():
    return hg.Fluid(RHO, MU)


def poiseuille(length, d):
    # Hagen–Poiseuille, exact for laminar flow in a round pipe.
    return 128.0 * MU * length * Q / (math.pi * d**4)


def reduced():
    return hg.Line([hg.Pipe(0.1, 10.0, 4.5e-5), hg.Fitting.contraction(0.1, 0.05), hg.Pipe(0.05, 10.0, 4.5e-5)])


def test_uniform_sizing_leaves_no_phantom_reducer():
    sized = reduced().with_uniform_diameter(0.03)
    assert len(sized) == 2
    r = sized.evaluate(oil(), Q)
    assert [e.kind for e in r.elements] == ["pipe", "pipe"]
    assert r.pressure_loss == pytest.approx(poiseuille(20.0, 0.03), rel=1e-12)


def test_a_section_rebuilds_the_transition_at_its_border():
    line = reduced()
    assert len(line.with_uniform_diameter(0.1, section=(2, 3))) == 2  # 100 → 100: removed
    grown = line.with_uniform_diameter(0.12, section=(2, 3))
    r = grown.evaluate(oil(), Q)
    # Now an expansion 100 → 120 mm: Borda–Carnot K = (1 − (0.1/0.12)²)² (exact).
    assert r.elements[1].k == pytest.approx((1 - (0.1 / 0.12) ** 2) ** 2, rel=1e-14)
    with pytest.raises(hg.HydrogradeError, match="start"):
        line.with_uniform_diameter(0.08, section=(2, 2))
    with pytest.raises(hg.HydrogradeError, match="end"):
        line.with_uniform_diameter(0.08, section=(0, 9))


def test_fixed_bore_equipment_refuses_by_index_and_label():
    line = hg.Line([hg.Pipe(0.1, 10.0, 4.5e-5), hg.Equipment.fixed_k("plate cooler", 4.0, 0.065),
                    hg.Pipe(0.1, 10.0, 4.5e-5)])
    with pytest.raises(hg.HydrogradeError, match=r"element 1 \('plate cooler'"):
        line.with_uniform_diameter(0.08)
    with pytest.raises(hg.HydrogradeError, match="plate cooler"):
        line.size(oil(), Q, max_velocity=1.0)
    # The section before it sizes: D = sqrt(4Q/(π v)), exact.
    s = line.size(oil(), Q, max_velocity=1.0, section=(0, 1))
    assert s.min_inside_diameter == pytest.approx(math.sqrt(4 * Q / math.pi), rel=1e-15)


def test_sizing_in_a_material_takes_its_roughness():
    line = hg.Line([hg.Pipe(0.1, 10.0, 4.5e-5), hg.Pipe(0.1, 10.0, 4.5e-5)])
    sized = line.with_uniform_diameter(0.08, section=(1, 2), material="pvc")
    assert [p.roughness for p in sized.elements] == [4.5e-5, hg.material("pvc")["typical"]]
    with pytest.raises(hg.UnknownNameError):
        line.size(oil(), Q, max_velocity=1.0, material="cheese")
