"""What a line means, from Python: flow path, direction, surroundings, pressures, NPSH.

Each expected value is written out by hand beside its source."""

from __future__ import annotations

import math

import pytest

import hydrograde as hg

G0 = 9.80665  # standard gravity, exact (3rd CGPM 1901; NIST SP 811)


def air_density(t: float, p: float) -> float:
    # Ideal gas, M = 0.0289647 kg/mol (dry air, from memory), R = 8.314462618 J/(mol K) (SI 2019).
    return p * 0.0289647 / (8.314462618 * t)


def test_elbow_after_a_contraction_sees_the_outlet_velocity():
    line = hg.Line([
        hg.Pipe(0.1, 10.0, 4.5e-5),
        hg.Fitting.contraction(0.1, 0.05),
        hg.Fitting.named("elbow_90_standard"),
        hg.Pipe(0.05, 10.0, 4.5e-5),
    ])
    r = line.evaluate(hg.Fluid(998.2, 1.002e-3), 0.004)
    # Definition of mean velocity: V = 4Q/(pi d^2) in the 50 mm bore.
    assert r.elements[2].velocity == pytest.approx(4 * 0.004 / (math.pi * 0.05**2), rel=1e-15)
    # Each row names the bore its velocity refers to (the route as typed) and a pipe its
    # length; the views show both.
    assert [e.bore for e in r.elements] == [0.1, 0.05, 0.05, 0.05]
    assert [e.length for e in r.elements] == [10.0, None, None, 10.0]
    assert r.to_dict()["elements"][1]["bore"] == 0.05
    assert hg.Line([hg.Rise(2.0)]).evaluate(hg.Fluid(998.2, 1.002e-3), 0.0).elements[0].bore is None


def test_a_bore_change_without_a_transition_is_a_row_and_a_message():
    line = hg.Line([hg.Pipe(0.1, 10.0, 4.5e-5), hg.Pipe(0.05, 10.0, 4.5e-5)])
    q = 0.003
    r = line.evaluate(hg.Fluid(998.2, 1.002e-3), q)
    row = r.elements[1]
    assert row.kind == "section_change" and row.element is None
    v = 4 * q / (math.pi * 0.05**2)
    # Abrupt contraction K = 0.5 (1 - A2/A1) = 0.375 on V2 (Crane TP-410, 1988, from memory).
    assert row.head_loss == pytest.approx(0.375 * v * v / (2 * G0), rel=1e-14)
    assert "bore_change_without_transition" in r.warnings
    assert any("0.1 m" in m and "0.05 m" in m for m in r.messages)


def test_rise_and_rated_drop_have_no_velocity():
    line = hg.Line([hg.Pipe(0.05, 10.0, 4.5e-5), hg.Rise(2.0)])
    r = line.evaluate(hg.Fluid(998.2, 1.002e-3), 1e-3)
    assert r.elements[1].velocity is None and r.elements[1].reynolds is None


def test_check_valve_refuses_reverse_flow_naming_it():
    line = hg.Line([hg.Pipe(0.05, 10.0, 4.5e-5), hg.Fitting.named("swing_check_valve")])
    w = hg.Fluid(998.2, 1.002e-3)
    for call in (lambda: line.evaluate(w, -1e-3), lambda: line.system_curve(w, [1e-3, -1e-3])):
        with pytest.raises(hg.HydrogradeError, match=r"swing_check_valve \(element 1\)"):
            call()


def test_hot_flue_gas_stack_effect_in_pascal():
    line = hg.Line([hg.Pipe(0.3, 30.0, 1.5e-4), hg.Rise(30.0)])
    r = line.evaluate(hg.Fluid.air(473.15), 0.0)
    # Stack effect (hydrostatics): -(rho_amb - rho_hot) g 30 m.
    want = -(air_density(293.15, 101325.0) - air_density(473.15, 101325.0)) * G0 * 30.0
    assert r.required_pressure == pytest.approx(want, rel=1e-12)
    same = hg.Line([hg.Pipe(0.3, 30.0, 1.5e-4), hg.Rise(30.0)], surroundings=hg.Fluid.air(473.15))
    assert same.evaluate(hg.Fluid.air(473.15), 0.0).required_pressure == 0.0
    with pytest.raises(hg.HydrogradeError, match="^surroundings"):
        hg.Line([hg.Rise(1.0)], surroundings=hg.Fluid(998.2, 1e-3))


def test_suction_lift_npsh():
    w = hg.Fluid.water(333.15)
    q = 3.0 * math.pi * 0.1**2 / 4
    line = hg.Line(
        [hg.Fitting.from_tank(), hg.Fitting.k(2.0), hg.Rise(7.0), hg.Pipe(0.1, 1.0, 4.5e-5)],
        inlet_pressure=101325.0,
    )
    r = line.evaluate(w, q)
    rho, pv = r.density, r.vapour_pressure
    # Bernoulli from the tank surface with losses 0.5 + 2 velocity heads, V = 3 m/s.
    total = 101325.0 - rho * G0 * (7.0 + 2.5 * 9.0 / (2 * G0))
    assert r.elements[2].total_pressure_out == pytest.approx(total, rel=1e-12)
    assert r.elements[2].pressure_out == pytest.approx(total - 0.5 * rho * 9.0, rel=1e-12)
    assert "below_vapour_pressure" in r.warnings
    assert r.npsh_available(2) == pytest.approx((total - pv) / (rho * G0), rel=1e-12)
    assert r.npsh_check(2, 0.2, margin=0.5)["sufficient"] is False
    with pytest.raises(hg.HydrogradeError, match="^index = 9"):
        r.npsh_available(9)


def test_tank_inlets_and_outlet_by_edge():
    water = hg.Fluid(998.2, 1.002e-3)

    def k_of(f: hg.Fitting) -> float:
        r = hg.Line([f, hg.Pipe(0.1, 1.0, 0.0)]).evaluate(water, 0.01)
        return r.elements[0].k

    # Crane TP-410 (1988), from memory: square (sharp-edged) 0.5, re-entrant 0.78,
    # rounded r/d = 0.04 -> 0.24; the outlet into a tank loses the velocity head, K = 1 (exact).
    assert k_of(hg.Fitting.from_tank()) == 0.5
    assert k_of(hg.Fitting.from_tank("reentrant")) == 0.78
    assert k_of(hg.Fitting.from_tank("rounded", r_over_d=0.04)) == pytest.approx(0.24, rel=1e-12)
    assert k_of(hg.Fitting.into_tank()) == 1.0
    with pytest.raises(hg.HydrogradeError, match="edge"):
        hg.Fitting.from_tank("bellmouth")
    with pytest.raises(hg.HydrogradeError, match="r_over_d"):
        hg.Fitting.from_tank("rounded")
    with pytest.raises(hg.HydrogradeError, match="r_over_d"):
        hg.Fitting.from_tank("square", r_over_d=0.1)
    with pytest.raises(hg.HydrogradeError, match="r_over_d"):
        hg.Fitting.from_tank("rounded", r_over_d=-0.1)


def test_unit_slips_warn_with_the_likely_unit():
    water = hg.Fluid(998.2, 1.002e-3)
    # Bore 47.5 m (meant mm): 47.5 mm = 0.0475 m (SI prefix, exact).
    r = hg.Line([hg.Pipe(47.5, 100.0, 4.5e-5)]).evaluate(water, 4.5e-3)
    assert "implausible_bore" in r.warnings
    assert any("47.5 mm is 0.0475 m" in m for m in r.messages)
    # Flow 4.5 m3/s in 50 mm (meant L/s): V = 4Q/(pi d^2) = 2292 m/s > 15 m/s (common practice).
    line = hg.Line([hg.Pipe(0.05, 100.0, 4.5e-5)])
    r = line.evaluate(water, 4.5)
    assert "implausible_velocity" in r.warnings
    assert any("4.5 L/s is 0.0045 m³/s" in m for m in r.messages)
    assert "implausible_velocity" not in line.evaluate(water, 4.5e-3).warnings
    # Rated drop 1.5 Pa (meant bar): 1.5 bar = 150000 Pa (NIST SP 811, exact).
    r = hg.Line([hg.Pipe(0.05, 10.0, 4.5e-5), hg.Equipment.pressure_drop("filter", 1.5, 0.005)]).evaluate(
        water, 0.005
    )
    assert "implausible_rated_drop" in r.warnings
    assert any("1.5 bar is 150000 Pa" in m for m in r.messages)
    # Viscosity 0.377 Pa s at water's density (meant cP): 0.377 cP = 0.000377 Pa s.
    r = line.evaluate(hg.Fluid(975.0, 0.377), 1e-3)
    assert "implausible_viscosity" in r.warnings
    assert any("0.377 cP is 0.000377 Pa·s" in m for m in r.messages)
    # Length 250 km: 250000 mm = 250 m.
    r = hg.Line([hg.Pipe(0.5, 250e3, 4.5e-5)]).evaluate(water, 0.3)
    assert "implausible_length" in r.warnings
    assert set(hg.WARNING_NAMES[-5:]) == {
        "implausible_velocity", "implausible_bore", "implausible_length",
        "implausible_rated_drop", "implausible_viscosity",
    }


def test_rated_drop_scales_with_density():
    # A strainer rated 20 kPa at 10 L/s with 1000 kg/m3, passing 1100 kg/m3 at 10 L/s:
    # fixed K, dp = drop * rho / rho_rating = 22 000 Pa (definition of K, dp = K rho V^2 / 2).
    eq = hg.Equipment.pressure_drop("strainer", 2e4, 0.01, rating_density=1000.0)
    r = hg.Line([eq]).evaluate(hg.Fluid(1100.0, 4e-3), 0.01)
    assert r.pressure_loss == pytest.approx(22000.0, rel=1e-14)
    with pytest.raises(hg.HydrogradeError, match="rating_density"):
        hg.Equipment.pressure_drop("strainer", 2e4, 0.01, rating_density=0.0)
    assert "rating_density=" in repr(eq)


def test_end_pressure_counts_in_the_required_head():
    # A header 12 m up needing 2.5 bar above the start: required head = dz + losses +
    # p_end/(rho g) (energy balance), so at zero flow 12 + 2.5e5/(998.2 g0).
    water = hg.Fluid(998.2, 1.002e-3)
    els = [hg.Pipe(0.05, 60.0, 4.5e-5), hg.Rise(12.0)]
    line = hg.Line(els, end_pressure=2.5e5)
    assert line.evaluate(water, 0.0).required_head == pytest.approx(12.0 + 2.5e5 / (998.2 * G0), rel=1e-15)
    a, b = hg.Line(els).evaluate(water, 4e-3), line.evaluate(water, 4e-3)
    assert b.required_pressure - a.required_pressure == pytest.approx(2.5e5, rel=1e-12)
    with pytest.raises(hg.HydrogradeError, match="end_pressure"):
        hg.Line(els, end_pressure=float("nan"))
