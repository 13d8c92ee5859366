"""Roughness catalogue, pipe tables and sizing from Python."""

from __future__ import annotations

import numpy as np
import pytest

import hydrograde as hg


def test_materials_and_aging():
    names = [m["name"] for m in hg.materials()]
    assert "commercial_steel" in names
    steel = hg.material("commercial_steel")
    # 0.045 mm for new commercial steel (common practice, from memory).
    assert steel["typical"] == pytest.approx(4.5e-5, rel=1e-12)
    assert steel["low"] <= steel["typical"] <= steel["high"]
    pipe = hg.Pipe.of_material(0.1, 10.0, "commercial_steel")
    assert (pipe.roughness, pipe.roughness_range) == (steel["typical"], (steel["low"], steel["high"]))
    # Linear aging, ε(t) = ε₀ + α t (Colebrook & White 1937): exact arithmetic here.
    out = hg.aged_roughness(1e-4, np.array([1e-5, 2e-5]), 10.0)
    assert out.tolist() == pytest.approx([2e-4, 3e-4], rel=1e-15)
    with pytest.raises(hg.UnknownNameError, match="commercial_steel"):
        hg.material("unobtainium")


def test_pipe_tables():
    tables = {t["name"]: t for t in hg.pipe_tables()}
    assert list(tables) == ["steel", "stainless", "copper", "pvc", "steel_en10220", "stainless_iso1127",
                            "copper_en1057", "pe_iso4427", "pvc_iso1452", "hygienic_bpe",
                            "hygienic_din11850", "hygienic_iso2037"]
    assert "mean wall" in tables["pe_iso4427"]["wall_rule"]
    two = hg.pipe_size("steel", "2", "40")
    # ASME B36.10M: NPS 2 schedule 40 has a 2.067 in bore (from memory).
    assert two["inside_diameter"] == pytest.approx(2.067 * 0.0254, rel=1e-12)
    assert two["inside_diameter"] == pytest.approx(two["outside_diameter"] - 2 * two["wall"], rel=1e-14)
    assert any(s["nominal"] == "2" for s in hg.pipe_sizes("steel"))
    smallest = hg.smallest_pipe("steel", "40", 0.05)
    assert smallest["inside_diameter"] >= 0.05
    with pytest.raises(hg.UnknownNameError):
        hg.pipe_size("steel", "2", "999")


def test_sizing_meets_the_limit_exactly_at_the_minimum_bore():
    water = hg.Fluid.water(288.15)
    line = hg.Line([hg.Pipe.of_material(0.1, 200.0, "commercial_steel"), hg.Fitting.into_tank()])
    s = line.size(water, 0.01, max_pressure_loss=5e4, table="steel", schedule="40")
    at_min = line.with_uniform_diameter(s.min_inside_diameter).evaluate(water, 0.01)
    assert at_min.pressure_loss == pytest.approx(5e4, rel=1e-9)
    assert s.standard is not None and s.standard["inside_diameter"] >= s.min_inside_diameter
    assert s.standard["pressure_loss"] <= 5e4
    assert s.standard_at_band["pressure_loss_band"]["high"] <= 5e4
    v = line.size(water, 0.01, max_velocity=2.0)
    # Continuity: V = 4Q/(πd²) = 2 m/s at the minimum bore (exact).
    assert 4 * 0.01 / (np.pi * v.min_inside_diameter**2) == pytest.approx(2.0, rel=1e-9)
    with pytest.raises(hg.InvalidInputError, match="exactly one"):
        line.size(water, 0.01)
    with pytest.raises(hg.InvalidInputError, match="both table and schedule"):
        line.size(water, 0.01, max_velocity=2.0, table="steel")


def test_metric_and_plastic_tables():
    # ISO 4427-2 110 SDR 11: e_min 10.0 mm, e_max 11.1 mm (published copies, see
    # core/tests/sizes_metric.rs); mean wall 10.55 mm, bore 88.9 mm (exact arithmetic).
    pe = hg.pipe_size("pe_iso4427", "110", "sdr11")
    assert pe["minimum_wall"] == pytest.approx(0.010, rel=1e-15)
    assert pe["inside_diameter"] == pytest.approx(0.0889, rel=1e-14)
    # ASTM D1785 NPS 2 sch 40: bore from the mean wall 0.154 + 0.010 in = 2.047 in.
    assert hg.pipe_size("pvc", "2", "40")["inside_diameter"] == pytest.approx(2.047 * 0.0254, rel=1e-14)
    assert hg.pipe_size("steel", "2", "40")["minimum_wall"] is None
    # Every table sizes: the answer is the smallest that fits (exact by exhaustion).
    for t in hg.pipe_tables():
        for s in t["schedules"]:
            try:
                p = hg.smallest_pipe(t["name"], s, 0.04)
            except hg.OutOfRangeError:
                continue
            same = [q["inside_diameter"] for q in hg.pipe_sizes(t["name"]) if q["schedule"] == s]
            assert p["inside_diameter"] == min(d for d in same if d >= 0.04)
    water = hg.Fluid.water(288.15)
    line = hg.Line([hg.Pipe.of_material(0.1, 100.0, "hdpe"), hg.Fitting.into_tank()])
    s = line.size(water, 0.01, max_velocity=2.0, table="pe_iso4427", schedule="SDR 17")
    # Continuity: d_min = sqrt(4Q/(πV)) = 79.8 mm; SDR 17 dn 90 has 90 − 2·5.75 = 78.5 mm,
    # dn 110 has 110 − 2·7.0 = 96.0 mm (mean walls; e_min 5.4 and 6.6 mm, ISO 4427-2).
    assert s.standard["nominal"] == "110"


def test_unknown_tables_and_sizes_suggest_close_names():
    with pytest.raises(hg.UnknownNameError, match='did you mean "steel"'):
        hg.pipe_size("stel", "2", "40")
    with pytest.raises(hg.UnknownNameError, match='did you mean "pe_iso4427"'):
        hg.smallest_pipe("iso4427", "SDR 11", 0.05)
    with pytest.raises(hg.UnknownNameError, match='did you mean "STD"'):
        hg.pipe_size("steel", "2", "STF")


def test_pipe_size_by_dn():
    # DIN 11850:1985 Table 1 (published copy): DN 25 is 28, 29 or 30 mm in series 1, 2, 3.
    for series, od in [("1", 0.028), ("2", 0.029), ("3", 0.030)]:
        p = hg.pipe_size_dn("hygienic_din11850", 25, series)
        assert p["outside_diameter"] == pytest.approx(od, rel=1e-15)
        assert p == hg.pipe_size("hygienic_din11850", p["nominal"], series)
    # EN 10220 / ISO 4200 series 1: DN 50 is 60.3 mm (published copies, see
    # core/tests/sizes_metric.rs); 60.3 x 2.9 bore 54.5 mm (exact arithmetic).
    p = hg.pipe_size_dn("steel_en10220", 50, "2.9")
    assert p["nominal"] == "60.3" and p["inside_diameter"] == pytest.approx(0.0545, rel=1e-14)
    with pytest.raises(hg.UnknownNameError, match="50, 65"):
        hg.pipe_size_dn("steel_en10220", 55, "2.9")
    with pytest.raises(hg.UnknownNameError, match="steel_en10220"):
        hg.pipe_size_dn("copper", 50, "L")
    with pytest.raises(hg.UnknownNameError, match='did you mean "stainless_iso1127"'):
        hg.pipe_size_dn("stainless_iso112", 50, "2.0")
