"""Pipe, Line and their results from Python."""

from __future__ import annotations

import math

import numpy as np
import pytest

import hydrograde as hg

G0 = 9.80665  # standard gravity, exact (3rd CGPM 1901; NIST SP 811)


@pytest.fixture()
def water():
    return hg.Fluid.water(288.15)


@pytest.fixture()
def route():
    # Invented demo route: tank → 120 m of DN100 → elbow → 8 m up → reducer → 40 m of DN80
    # → tank.
    return hg.Line([
        hg.Fitting.from_tank(),
        hg.Pipe(0.1, 120.0, 4.5e-5),
        hg.Fitting.named(hg.Fitting.catalogue()[0]["name"]),
        hg.Rise(8.0),
        hg.Fitting.contraction(0.1, 0.08),
        hg.Pipe(hg.Section.circle(0.08), 40.0, 4.5e-5),
        hg.Fitting.into_tank(),
    ])


def test_single_pipe_is_darcy_weisbach(water):
    pipe = hg.Pipe(0.1, 50.0, 4.5e-5)
    q = 0.01
    v = q / (math.pi * 0.1**2 / 4)
    re = water.density * v * 0.1 / water.viscosity
    f = hg.darcy_factor(re, 4.5e-5 / 0.1)
    # Darcy–Weisbach (exact definition): h = f (L/D) V²/(2 g).
    expected = f * 50.0 / 0.1 * v * v / (2 * G0)
    r = hg.Line([pipe]).evaluate(water, q)
    assert r.head_loss == pytest.approx(expected, rel=1e-12)
    h, dh_dq = pipe.head_loss(water, q)
    assert h == pytest.approx(expected, rel=1e-12)
    # Central difference of the core's own head loss (truncation O(δ²), δ = 1e-6 q).
    step = 1e-6 * q
    fd = (pipe.head_loss(water, q + step)[0] - pipe.head_loss(water, q - step)[0]) / (2 * step)
    assert dh_dq == pytest.approx(fd, rel=1e-7)
    assert r.pressure_loss == pytest.approx(water.density * G0 * r.head_loss, rel=1e-14)
    assert r.elements[0].friction_factor == pytest.approx(f, rel=1e-14)


def test_laminar_is_hagen_poiseuille():
    oil = hg.Fluid(870.0, 0.1)
    q, d, length = 1e-4, 0.05, 30.0
    # Exact analytical solution (Hagen–Poiseuille): h = 128 μ L Q / (π ρ g D⁴).
    expected = 128 * 0.1 * length * q / (math.pi * 870.0 * G0 * d**4)
    r = hg.Line([hg.Pipe(d, length, 0.0)]).evaluate(oil, q)
    assert r.elements[0].regime == "laminar"
    assert r.head_loss == pytest.approx(expected, rel=1e-12)


def test_result_fields_breakdown_and_bands(route, water):
    r = route.evaluate(water, 0.012)
    assert r.required_head == pytest.approx(r.head_loss + r.static_head, rel=1e-15)
    assert r.static_head == 8.0 == route.static_head
    assert [e.kind for e in r.elements] == [
        "fitting", "pipe", "fitting", "rise", "fitting", "pipe", "fitting"
    ]
    assert sum(e.head_loss for e in r.elements) == pytest.approx(r.head_loss, rel=1e-13)
    for band in (r.head_loss_band, r.required_head_band, r.pressure_loss_band):
        assert band.low <= band.nominal <= band.high
        assert band.dominant in [c[0] for c in band.contributions]
        assert sum(s for _, s in band.contributions) == pytest.approx(1.0, rel=1e-9)
    assert r.head_loss_band.nominal == r.head_loss
    assert r.elements[1].friction_factor_band is not None
    assert "LineResult(flow=0.012" in repr(r)
    assert len(route) == 7 and repr(route).startswith("Line([Fitting('from_tank_square', edge='square'")


def test_head_loss_is_odd_in_flow(route, water):
    # Elements that lose the same either way give an odd head loss (Darcy–Weisbach and
    # K V|V|/2g are odd in V); the tank inlet, outlet and reducer of the route depend on
    # the direction, so it is only continuous through zero.
    same_either_way = hg.Line([
        hg.Pipe(0.1, 120.0, 4.5e-5),
        hg.Fitting.named(hg.Fitting.catalogue()[0]["name"]),
        hg.Rise(8.0),
    ])
    up = same_either_way.required_head(water, 0.01) - 8.0
    down = same_either_way.required_head(water, -0.01) - 8.0
    assert down == pytest.approx(-up, rel=1e-14)
    assert route.required_head(water, 0.0) == route.static_head


def test_system_curve_broadcasts_and_matches_evaluate(route, water):
    flows = np.linspace(-0.02, 0.02, 41).reshape(41, 1) * np.ones((1, 2))
    curve = route.system_curve(water, flows)
    assert curve.shape == (41, 2)
    for q, h in zip(flows[:, 0], curve[:, 0]):
        assert h == route.evaluate(water, float(q)).required_head
    assert type(route.system_curve(water, 0.01)) is float


def test_inverse_questions(route, water):
    sol = route.flow_for_head(water, 30.0)
    assert route.required_head(water, sol.flow) == pytest.approx(30.0, rel=1e-12)
    assert sol.flow_band.low < sol.flow < sol.flow_band.high
    pump = hg.PumpCurve([0.0, 0.01, 0.02, 0.03], [60.0, 55.0, 45.0, 28.0])
    op = route.operating_point(water, pump)
    assert pump.head(op.flow) == pytest.approx(route.required_head(water, op.flow), rel=1e-10)
    assert op.head == pytest.approx(pump.head(op.flow), rel=1e-10)
    twin = hg.Line([hg.Pipe(0.1, 120.0, 4.5e-5)])
    split = hg.split_flow([twin, twin], water, 0.02)
    # Two identical branches share the flow equally (symmetry, exact).
    assert split.flows == pytest.approx([0.01, 0.01], rel=1e-12)
    # Every source moves the two flows by equal and opposite amounts (the total is fixed),
    # so the two flow bands are equally wide (exact property of the linearised split).
    a, b = split.flow_bands
    assert (a.high - a.low) == pytest.approx(b.high - b.low, rel=1e-9)
    assert split.head_band.low < split.head < split.head_band.high
    with pytest.raises(hg.NoSolutionError):
        route.operating_point(water, hg.PumpCurve([0.0, 0.01, 0.02], [5.0, 4.0, 3.0]))


def test_line_options_and_errors(water):
    pipe = hg.Pipe(0.1, 100.0, 4.5e-5)
    a = hg.Line([pipe], correlation="haaland").evaluate(water, 0.01).head_loss
    b = hg.Line([pipe]).evaluate(water, 0.01).head_loss
    assert a != b and a == pytest.approx(b, rel=0.015)  # Haaland 1983: ±1.5 % of Colebrook
    none = hg.Line([pipe], uncertainty="none").evaluate(water, 0.01).head_loss_band
    assert none.low == none.nominal == none.high
    with pytest.raises(hg.InvalidInputError, match="at least one element"):
        hg.Line([])
    with pytest.raises(TypeError, match=r"elements\[1\]: expected Pipe, Fitting, Rise, Equipment or Pump"):
        hg.Line([pipe, "elbow"])
    with pytest.raises(hg.UnknownNameError):
        hg.Line([pipe], uncertainty="some")
    with pytest.raises(hg.NotFiniteError):
        hg.Line([pipe]).evaluate(water, float("nan"))
    with pytest.raises(hg.InvalidInputError):
        hg.Line([hg.Fitting.k(0.5)])  # no pipe to take a bore from
    with pytest.raises(hg.OutOfRangeError, match="roughness"):
        hg.Pipe(0.1, 10.0, 0.2)


def test_equipment_and_pressure_profile(water):
    line = hg.Line(
        [hg.Pipe(0.1, 50.0, 4.5e-5), hg.Equipment.pressure_drop("strainer", 20e3, 0.01)],
        inlet_pressure=3e5,
    )
    r = line.evaluate(water, 0.01)
    # The rated drop at the rating flow, scaled with the density over that of the rating
    # fluid (water at 20 degC unless stated): fixed K, dp = K rho V^2 / 2.
    rating = hg.Fluid.water(293.15).density
    assert r.elements[1].head_loss * water.density * G0 == pytest.approx(20e3 * water.density / rating, rel=1e-12)
    assert r.outlet_pressure == pytest.approx(3e5 - r.pressure_loss, rel=1e-12)
    assert r.elements[-1].pressure_out == pytest.approx(r.outlet_pressure, rel=1e-12)


def test_line_result_renders_breakdown_bands_and_warnings(route, water):
    r = route.evaluate(water, 0.0025)  # slow enough to be transitional in DN100
    html = r._repr_html_()
    assert html.count("<tr>") >= 7 + 6  # scalars and one row per element
    assert "required head" in html and "…" in html and "competent engineer" in html
    if r.warnings:
        assert "⚠" in html
    pd = pytest.importorskip("pandas")
    df = r.to_dataframe()
    assert isinstance(df, pd.DataFrame) and len(df) == 7
    assert list(df["head_loss"]) == [e.head_loss for e in r.elements]


def test_plots(route, water):
    pytest.importorskip("matplotlib")
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    from hydrograde import plotting

    pump = hg.PumpCurve([0.0, 0.01, 0.02, 0.03], [60.0, 55.0, 45.0, 28.0])
    ax = plotting.system_curve(route, water, np.linspace(0, 0.03, 31), pump=pump)
    x, y = ax.get_lines()[0].get_data()
    assert np.array_equal(y, route.system_curve(water, x))
    op = route.operating_point(water, pump)
    assert any(np.allclose(l.get_data(), ([op.flow], [op.head])) for l in ax.get_lines())
    plt.close(ax.figure)
    ax = plotting.grade_line(route, water, 0.012)
    x, energy = ax.get_lines()[0].get_data()
    assert x[-1] >= 160.0  # pipes 160 m, fittings spread over short gaps
    assert energy[-1] == pytest.approx(-route.evaluate(water, 0.012).head_loss, rel=1e-12)
    plt.close(ax.figure)
