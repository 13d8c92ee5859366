"""Bands from Python: typed sources, coverage, the system curve's band, bad input."""

from __future__ import annotations

import math

import numpy as np
import pytest

import hydrograde as hg


@pytest.fixture()
def water():
    return hg.Fluid.water(293.15)


def steel_main(**uncertainty):
    # Invented route: 60 m of 80 mm commercial steel, three standard elbows, 30 m more.
    return hg.Line(
        [
            hg.Pipe.of_material(0.08, 60.0, "commercial_steel"),
            hg.Fitting.named("elbow_90_standard"),
            hg.Fitting.named("elbow_90_standard"),
            hg.Fitting.named("elbow_90_standard"),
            hg.Pipe.of_material(0.08, 30.0, "commercial_steel"),
        ],
        uncertainty=hg.Uncertainty(**uncertainty) if uncertainty else None,
    )


def test_system_curve_band_is_the_evaluated_band_bit_for_bit(water):
    line = steel_main()
    flows = [0.002, 0.005, 0.01, 0.02]
    low, nominal, high = line.system_curve_band(water, flows)
    assert list(nominal) == list(line.system_curve(water, np.array(flows)))
    for q, lo, hi in zip(flows, low, high):
        b = line.evaluate(water, q).required_head_band
        assert (lo, hi) == (b.low, b.high)
        assert lo < hi


def test_sources_are_typed_and_shared(water):
    b = steel_main().evaluate(water, 0.01).required_head_band
    kinds = {name: kind for name, kind, _ in b.sources}
    # One source per material and one per catalogue entry, however many instances.
    assert kinds["roughness of commercial_steel"] == "material_roughness"
    assert kinds["K of elbow_90_standard"] == "catalogue_k"
    assert kinds["friction model"] == "friction_model"
    assert math.isclose(sum(s for _, _, s in b.sources), 1.0, rel_tol=1e-12)
    assert b.to_dict()["contributions"][0]["kind"] in kinds.values()


def test_three_shared_elbows_give_three_times_one(water):
    # Exact arithmetic of the GUM sum: fully correlated errors add linearly.
    def width(n):
        els = [hg.Pipe(0.05, 1.0, 0.0)] + [hg.Fitting.named("elbow_90_standard")] * n
        line = hg.Line(els, uncertainty=hg.Uncertainty.preset("none").replace(fittings=True))
        return line.evaluate(water, 0.004).required_head_band.half_width

    assert math.isclose(width(3) / width(1), 3.0, rel_tol=1e-12)


def test_strainer_band_stays_inside_its_range(water):
    # A ±50 % rectangular rating: its 95 % interval is ±0.95 of the half-width (exact).
    q = 0.01
    line = hg.Line([
        hg.Pipe(0.1, 5.0, 4.5e-5),
        hg.Equipment.pressure_drop("strainer", 5e4, q).with_spread(0.5),
    ])
    e = line.evaluate(water, q).elements[1].head_loss_band
    assert e.coverage == "dominant_rectangular"
    assert 0.5 * e.nominal <= e.low < e.high <= 1.5 * e.nominal
    assert math.isclose(e.coverage_factor, 0.95 * math.sqrt(3), rel_tol=1e-6)


def test_independent_materials(water):
    shared = steel_main(friction_model=False, fluid=False, fittings=False)
    indep = steel_main(
        friction_model=False, fluid=False, fittings=False,
        independent_materials=["commercial_steel"],
    )
    assert indep.uncertainty.independent_materials == ["commercial_steel"]
    b1 = shared.evaluate(water, 0.01).required_head_band
    b2 = indep.evaluate(water, 0.01).required_head_band
    assert b2.half_width < b1.half_width
    assert {k for _, k, _ in b2.sources} == {"pipe_roughness"}


def test_bad_band_input(water):
    with pytest.raises(hg.UnknownNameError, match="independent_materials"):
        hg.Uncertainty(independent_materials=["unobtainium"])
    line = hg.Line([hg.Pipe(0.05, 10.0, 4.5e-5)])
    with pytest.raises(hg.OutOfRangeError, match="roughness"):
        line.with_roughness_range(0, 1e-4, 2e-4)  # nominal 4.5e-5 outside
    with pytest.raises(hg.OutOfRangeError, match="high"):
        line.with_roughness_range(0, 9e-5, 2e-5)  # inverted
    with pytest.raises(hg.OutOfRangeError, match="low"):
        line.with_roughness_range(0, 0.0, 1e-4)  # log-uniform needs low > 0
    with pytest.raises(hg.NotFiniteError):
        line.with_roughness_range(0, 2e-5, math.inf)
    with pytest.raises(hg.NotFiniteError):
        line.system_curve_band(water, [0.001, math.nan])


def test_curve_band_plot(water, tmp_path):
    pytest.importorskip("matplotlib")
    import matplotlib

    matplotlib.use("Agg")
    from hydrograde import plotting

    ax = plotting.system_curve(steel_main(), water, np.linspace(0.001, 0.02, 30))
    labels = [h.get_label() for h in ax.get_legend_handles_labels()[0]]
    assert "system band (95 %)" in labels
    ax.figure.savefig(tmp_path / "curve.png")


def test_non_linear_flag_near_the_transition_and_not_far_from_it():
    # Invented: 20 m of smooth 20 mm tube at Re ≈ 2200, just below the laminar limit 2300;
    # a 3 % bore tolerance and 2 % viscosity carry Re across 2300 within the band, so the
    # first-order band is flagged and Monte Carlo parts from it (as in the core's test).
    fluid = hg.Fluid(998.2, 1.002e-3).with_uncertainty(0.001, 0.02)
    nu = 1.002e-3 / 998.2
    flow = 2200.0 * nu * math.pi * 0.02 / 4.0  # Re = 4Q/(π d ν)
    tube = hg.Line([hg.Pipe(0.02, 20.0, 0.0)], uncertainty=hg.Uncertainty(diameter=0.03))
    band = tube.evaluate(fluid, flow).required_head_band
    assert band.non_linear is True
    assert band.to_dict()["non_linear"] is True
    mc = hg.monte_carlo(tube, fluid, flow, samples=20_000, seed=7)
    assert abs(mc.high - band.high) > 0.05 * (band.high - band.low)
    # Far from the transition (Re ≈ 7.6e4, roughness-dominated): not flagged.
    steel = hg.Line([hg.Pipe.of_material(0.05, 100.0, "commercial_steel")])
    assert steel.evaluate(fluid, 3e-3).required_head_band.non_linear is False
