"""Line options, uncertainty options, the Monte Carlo check and the element-level calls."""

from __future__ import annotations

import math
import pickle

import numpy as np
import pytest

import hydrograde as hg

G0 = 9.80665  # standard gravity, exact (3rd CGPM 1901; NIST SP 811)


@pytest.fixture()
def water():
    return hg.Fluid.water(288.15)


@pytest.fixture()
def route():
    # Invented route: inlet from a tank, 80 m of DN50 steel, a catalogue elbow, 5 m up, outlet into a tank.
    return hg.Line([
        hg.Fitting.from_tank(),
        hg.Pipe.of_material(0.0525, 80.0, "commercial_steel"),
        hg.Fitting.named("elbow_90_standard"),
        hg.Rise(5.0),
        hg.Fitting.into_tank(),
    ])


FIELDS = [
    "friction_model", "turbulent_model", "laminar_model", "non_circular_model", "roughness",
    "roughness_default", "diameter", "fluid", "fittings", "equipment",
]


def test_uncertainty_defaults_are_the_core_default_preset():
    u = hg.Uncertainty()
    assert u == hg.Uncertainty.preset("default")
    assert hg.Uncertainty.presets() == ["default", "none", "model_only"]
    # The core's documented defaults (core/src/band.rs table; common practice: Colebrook
    # is good to ±10 % at k = 2, i.e. 5 % standard; a factor of 2 either way on
    # roughness, log-uniform, gives u(ln ε) = ln 4/√12).
    assert u.turbulent_model == 0.05
    assert u.laminar_model == 0.005
    assert u.non_circular_model == 0.075
    assert u.roughness_default == pytest.approx(math.log(4) / math.sqrt(12), rel=1e-15)
    assert u.independent_materials == []
    assert u.diameter == 0.0
    assert all(getattr(u, f) for f in ("friction_model", "roughness", "fluid", "fittings", "equipment"))
    assert set(u.to_dict()) == set(FIELDS) | {"independent_materials"}
    none = hg.Uncertainty.preset("none")
    assert not any(getattr(none, f) for f in ("friction_model", "roughness", "fluid", "fittings"))
    assert hg.Uncertainty.preset("model_only").friction_model
    assert not hg.Uncertainty.preset("model_only").roughness


def test_every_uncertainty_field_is_a_keyword(route, water):
    u = hg.Uncertainty(friction_model=False, turbulent_model=0.02, laminar_model=0.01,
                       non_circular_model=0.1, roughness=False, roughness_default=0.2,
                       diameter=0.01, fluid=False, fittings=False, equipment=False)
    assert [getattr(u, f) for f in FIELDS] == [False, 0.02, 0.01, 0.1, False, 0.2, 0.01,
                                               False, False, False]
    assert u.replace(diameter=0.0) == hg.Uncertainty.preset("none").replace(
        turbulent_model=0.02, laminar_model=0.01, non_circular_model=0.1, roughness_default=0.2)
    assert pickle.loads(pickle.dumps(u)) == u
    assert eval(repr(u), {"Uncertainty": hg.Uncertainty}) == u
    with pytest.raises(hg.OutOfRangeError, match="diameter"):
        hg.Uncertainty(diameter=-0.1)
    with pytest.raises(hg.UnknownNameError, match="default, none, model_only"):
        hg.Uncertainty.preset("all")
    with pytest.raises(TypeError, match="uncertainty"):
        hg.Line(route.elements, uncertainty=0.05)


def test_diameter_tolerance_alone_gives_the_chain_rule_band(water):
    # Darcy–Weisbach at fixed Q (exact): h ∝ f D⁻⁵ with Re ∝ D⁻¹ and ε/D ∝ D⁻¹, so
    # ∂ln h/∂ln D = −5 − (Re/f) ∂f/∂Re − (ε/D / f) ∂f/∂(ε/D); GUM first order
    # (JCGM 100:2008): U = k·|∂ln h/∂ln D|·u_rel(D)·h with k = 2.
    d, eps, q = 0.1, 4.5e-5, 0.02
    pipe = hg.Pipe(d, 100.0, eps)
    only_d = hg.Uncertainty.preset("none").replace(diameter=0.01)
    r = hg.Line([pipe], uncertainty=only_d).evaluate(water, q)
    re = water.density * (q / (math.pi * d * d / 4)) * d / water.viscosity
    fr = hg.friction(re, eps / d)
    s = -5 - re / fr.f * fr.df_dre - (eps / d) / fr.f * fr.df_drel_roughness
    assert r.head_loss_band.half_width == pytest.approx(2 * abs(s) * 0.01 * r.head_loss, rel=1e-9)
    assert r.head_loss_band.dominant == "diameter"
    assert hg.Line([pipe], uncertainty=only_d).uncertainty == only_d


def test_monte_carlo_agrees_with_the_first_order_band(route, water):
    q = 4e-3
    r = route.evaluate(water, q)
    mc = hg.monte_carlo(route, water, q, samples=20000, seed=7)
    assert mc.samples == 20000
    # JCGM 101:2008 §9: Monte Carlo validates the GUM first-order result for a near-linear
    # model; the mean within a few standard errors of the nominal and σ within 10 %.
    u = r.required_head_band.standard_uncertainty
    assert abs(mc.mean - r.required_head) < 0.05 * u + 5 * mc.std_dev / math.sqrt(mc.samples)
    assert mc.std_dev == pytest.approx(u, rel=0.10)
    assert mc.low < mc.mean < mc.high
    # Exact: a 95 % interval of a near-normal output is about ±1.96 σ.
    assert (mc.high - mc.low) / 2 == pytest.approx(1.96 * mc.std_dev, rel=0.10)
    assert hg.monte_carlo(route, water, q, samples=20000, seed=7) == mc
    assert hg.monte_carlo(route, water, q, samples=20000, seed=8).mean != mc.mean
    assert hg.monte_carlo(route, water, q).samples == 20000
    assert pickle.loads(pickle.dumps(mc)) == mc
    assert set(mc.to_dict()) == {"samples", "mean", "std_dev", "low", "high"}
    with pytest.raises(hg.OutOfRangeError, match="samples"):
        hg.monte_carlo(route, water, q, samples=10)


def test_evaluate_with_an_inlet_pressure(water):
    pipe = hg.Pipe(0.08, 60.0, 4.5e-5)
    line = hg.Line([pipe, hg.Rise(3.0), hg.Pipe(0.08, 20.0, 4.5e-5)])
    q, p_in = 0.01, 4.0e5
    r = line.evaluate(water, q, inlet_pressure=p_in)
    # Bernoulli with one bore throughout (exact): p_out = p_in − ρ g (losses + rise).
    expected = p_in - water.density * G0 * (r.head_loss + 3.0)
    assert r.outlet_pressure == pytest.approx(expected, rel=1e-12)
    assert r.inlet_pressure == p_in
    assert line.evaluate(water, q).outlet_pressure is None
    same = hg.Line(line.elements, inlet_pressure=p_in)
    for other in (same.evaluate(water, q), same.evaluate(water, q, inlet_pressure=None)):
        assert other.outlet_pressure == r.outlet_pressure
        assert [e.pressure_out for e in other.elements] == [e.pressure_out for e in r.elements]
    with pytest.raises(hg.OutOfRangeError, match="inlet_pressure"):
        line.evaluate(water, q, inlet_pressure=-1.0)


def test_regime_limits_of_a_line(water):
    oil = hg.Fluid(870.0, 0.02)
    d = 0.05
    pipe = hg.Pipe(d, 10.0, 0.0)
    # Re = 3000 with the common-practice limits is transitional; moved limits make it
    # laminar, where f = 64/Re exactly (Hagen–Poiseuille).
    q = 3000 * oil.viscosity / oil.density * math.pi * d / 4
    default = hg.Line([pipe]).evaluate(oil, q).elements[0]
    assert default.regime == "transitional"
    moved = hg.Line([pipe], laminar_limit=3500.0, turbulent_limit=5000.0)
    e = moved.evaluate(oil, q).elements[0]
    assert e.regime == "laminar"
    assert e.friction_factor == pytest.approx(64 / 3000, rel=1e-12)
    assert (moved.laminar_limit, moved.turbulent_limit) == (3500.0, 5000.0)
    low = hg.Line([pipe], turbulent_limit=2800.0).evaluate(oil, q).elements[0]
    assert low.regime == "turbulent"
    with pytest.raises(hg.OutOfRangeError, match="turbulent_limit"):
        hg.Line([pipe], laminar_limit=4500.0)
    line = hg.Line([pipe])
    # The core's defaults, common practice: laminar below 2300, turbulent above 4000.
    assert (line.laminar_limit, line.turbulent_limit) == (2300.0, 4000.0)
    assert (line.correlation, line.transition, line.turbulent_diameter) == (
        "colebrook", "blend", "hydraulic")
    assert hg.Line([pipe], transition="refuse").transition == "refuse"
    with pytest.raises(hg.UnknownNameError, match="blend, turbulent, refuse"):
        hg.Line([pipe], transition="smooth")


def test_turbulent_diameter_of_a_line():
    air = hg.Fluid.air(293.15)
    duct = hg.Section.rectangle(0.4, 0.1)
    pipe = hg.Pipe(duct, 10.0, 1.5e-4)
    q = 0.5
    line = hg.Line([pipe], turbulent_diameter="laminar_equivalent")
    assert line.turbulent_diameter == "laminar_equivalent"
    e = line.evaluate(air, q).elements[0]
    # Jones (1976): turbulent friction of a rectangle from the circular law at the
    # laminar-equivalent diameter D_le = (64/C) D_h, ε/D on D_le.
    dle = duct.turbulent_diameter("laminar_equivalent")
    assert dle == pytest.approx(64 / duct.laminar_constant * duct.hydraulic_diameter, rel=1e-15)
    re_le = air.density * duct.velocity(q) * dle / air.viscosity
    assert e.friction_factor == pytest.approx(hg.darcy_factor(re_le, 1.5e-4 / dle), rel=1e-12)
    plain = hg.Line([pipe]).evaluate(air, q).elements[0]
    assert plain.friction_factor != e.friction_factor


def test_fitting_resistance_splits_k():
    # Hooper (1981) 2-K: K = K1/Re + K∞ (1 + 1/D[in]); at a 2 in bore K∞ part is 1.5 K∞.
    f = hg.Fitting.two_k(800.0, 0.25)
    kv, ki = f.resistance(2 * 0.0254, 0.0)
    assert kv == pytest.approx(800.0, rel=1e-15)
    assert ki == pytest.approx(0.25 * 1.5, rel=1e-12)
    assert f.k_at(1e4, 2 * 0.0254, 0.0) == pytest.approx(kv / 1e4 + ki, rel=1e-15)
    # A fixed K has no viscous part (definition).
    assert hg.Fitting.k(0.9).resistance(0.05, 1e-3) == (0.0, 0.9)
    # Borda–Carnot (exact): K = (1 − (d/D)²)² on the smaller bore.
    kv, ki = hg.Fitting.expansion(0.05, 0.1).resistance(0.05, 0.0)
    assert (kv, ki) == (0.0, pytest.approx((1 - 0.25) ** 2, rel=1e-14))
    with pytest.raises(hg.OutOfRangeError, match="bore"):
        f.resistance(0.0, 0.0)
    with pytest.raises(hg.OutOfRangeError, match="pipe_rel_roughness"):
        f.resistance(0.05, 0.9)


def test_pipe_head_loss_is_odd_with_an_even_derivative(water):
    pipe = hg.Pipe(0.05, 25.0, 4.5e-5)
    flows = np.array([-5e-3, -1e-5, 0.0, 1e-5, 5e-3])
    h, dh = pipe.head_loss(water, flows)
    assert h.shape == dh.shape == flows.shape
    # Odd head loss and even derivative (exact symmetry of Darcy–Weisbach in a straight pipe).
    np.testing.assert_array_equal(h, -h[::-1])
    np.testing.assert_array_equal(dh, dh[::-1])
    assert h[2] == 0.0 and dh[2] > 0.0
    # Hagen–Poiseuille (exact) at the tiny flows: dh/dQ = 128 μ L / (π ρ g D⁴).
    slope = 128 * water.viscosity * 25.0 / (math.pi * water.density * G0 * 0.05**4)
    assert dh[2] == pytest.approx(slope, rel=1e-12)
    for q, hi, di in zip(flows, h, dh):
        assert pipe.head_loss(water, float(q)) == (hi, di)


def test_line_flags_and_pipe_with_diameter(route, water):
    assert route.has_resistance and not route.blocks_reverse_flow
    assert not hg.Line([hg.Rise(3.0)]).has_resistance
    check = hg.Line([hg.Pipe(0.05, 10.0, 0.0), hg.Fitting.named("swing_check_valve")])
    assert check.blocks_reverse_flow
    pipe = hg.Pipe.of_material(0.05, 30.0, "commercial_steel")
    wider = pipe.with_diameter(0.08)
    assert (wider.bore, wider.length, wider.roughness) == (0.08, 30.0, pipe.roughness)
    assert wider.roughness_range == pipe.roughness_range
    # Darcy–Weisbach (exact): a wider bore at the same flow loses less.
    assert wider.head_loss(water, 3e-3)[0] < pipe.head_loss(water, 3e-3)[0]
    with pytest.raises(hg.OutOfRangeError, match="diameter"):
        pipe.with_diameter(0.0)


def test_fluid_reynolds_number():
    w = hg.Fluid(1000.0, 1e-3)
    # Exact: Re = ρ|V|D/μ = 1000 · 2 · 0.05 / 1e-3 = 1e5, whatever the direction.
    assert w.reynolds(2.0, 0.05) == 1e5
    assert w.reynolds(-2.0, 0.05) == 1e5
    np.testing.assert_array_equal(w.reynolds(np.array([1.0, -3.0]), 0.1), [1e5, 3e5])
    with pytest.raises(hg.OutOfRangeError, match="diameter"):
        w.reynolds(1.0, 0.0)
