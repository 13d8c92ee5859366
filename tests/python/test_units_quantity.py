"""pint quantities at every entry point and the display units.

Expected values: pint's own conversions (a general-purpose reference library) and exact
decimal arithmetic (4.5 L/s is 0.0045 m³/s by the definition of the litre).
"""

from __future__ import annotations

import numpy as np
import pint
import pytest

import hydrograde as hg

U = pint.UnitRegistry()
Q = U.Quantity


@pytest.fixture()
def water():
    return hg.Fluid.water(333.15)


@pytest.fixture()
def line():
    return hg.Line([
        hg.Fitting.from_tank(),
        hg.Pipe(0.0525, 30.0, 4.5e-5),
        hg.Fitting.named("elbow_90_long_radius"),
        hg.Rise(3.0),
    ])


def test_a_flow_in_litres_per_second_is_exactly_the_si_flow(line, water):
    # 4.5 L/s = 0.0045 m³/s exactly (1 L = 1e-3 m³, definition); the double nearest 0.0045.
    assert line.evaluate(water, 4.5 * U.L / U.s).flow == 0.0045
    assert line.required_head(water, 4.5 * U.L / U.s) == line.required_head(water, 0.0045)
    assert line.evaluate(water, Q(16.2, "m**3/hour")).flow == 0.0045  # 16.2/3600, exact


def test_arrays_of_quantities_broadcast(line, water):
    flows = np.array([1.0, 2.0, 4.5]) * U.L / U.s
    got = line.required_head(water, flows)
    want = line.required_head(water, np.array([1.0, 2.0, 4.5]) / 1000.0)
    np.testing.assert_array_equal(got, want)
    np.testing.assert_array_equal(line.system_curve(water, flows), want)


def test_every_kind_of_argument_takes_a_quantity(water):
    # pint: 60 °C = 333.15 K, 52.5 mm = 0.0525 m, 0.045 mm = 4.5e-5 m.
    assert hg.Fluid.water(Q(60.0, "degC")) == water
    assert hg.Fluid.water(Q(60.0, "degC"), 1.5 * U.bar).pressure == pytest.approx(1.5e5, rel=1e-15)
    p = hg.Pipe(52.5 * U.mm, 30 * U.m, 0.045 * U.mm)
    assert p == hg.Pipe(52.5 / 1000, 30.0, 0.045 / 1000)  # the core divides by 1000
    assert hg.Rise(10 * U.ft).height == pytest.approx(3.048, rel=1e-15)
    assert hg.Fitting.k(0.5, diameter=2 * U.inch).diameter == pytest.approx(0.0508, rel=1e-15)
    assert hg.Fitting.expansion(50 * U.mm, 80 * U.mm) == hg.Fitting.expansion(0.05, 0.08)
    assert hg.Section.rectangle(300 * U.mm, 200 * U.mm) == hg.Section.rectangle(0.3, 0.2)
    assert hg.darcy_factor(1e5 * U.dimensionless, 1e-4) == hg.darcy_factor(1e5, 1e-4)
    pump = hg.PumpCurve([0.0, 5.0, 10.0] * U.L / U.s, [30.0, 28.0, 20.0] * U.m)
    assert pump.range == hg.PumpCurve([0.0, 0.005, 0.01], [30.0, 28.0, 20.0]).range
    ln = hg.Line([hg.Pipe(0.0525, 30.0, 4.5e-5)], inlet_pressure=300 * U.kPa)
    assert ln.inlet_pressure == 3e5
    assert ln.flow_for_head(water, 2 * U.m).head == 2.0
    assert hg.smallest_pipe("steel", "40", 50 * U.mm)["nominal"] == "2"  # ASME B36.10M: 2" sch 40 bore 52.5 mm (from memory)


@pytest.mark.parametrize("call", [
    lambda ln, w: ln.evaluate(w, 4.5 * U.kPa),
    lambda ln, w: ln.required_head(w, 4.5 * U.kPa),
    lambda ln, w: ln.required_head(w, np.array([1.0, 2.0]) * U.kPa),
    lambda ln, w: ln.system_curve(w, 4.5 * U.kPa),
    lambda ln, w: hg.monte_carlo(ln, w, 4.5 * U.kPa, samples=100),
    lambda ln, w: ln.size(w, 4.5 * U.kPa, max_velocity=2.0),
])
def test_a_flow_of_the_wrong_dimension_is_the_same_error_everywhere(line, water, call):
    with pytest.raises(hg.InvalidInputError) as err:
        call(line, water)
    assert err.value.parameter in ("flow", "flows")
    assert "where a volume flow (m**3/s) is expected" in str(err.value)
    assert "kilopascal" in str(err.value)


def test_other_wrong_dimensions_name_their_argument():
    with pytest.raises(hg.InvalidInputError, match="^temperature: .*kilogram"):
        hg.Fluid.water(3 * U.kg)
    with pytest.raises(hg.InvalidInputError, match="^length: "):
        hg.Pipe(0.05, 3 * U.s, 1e-5)
    with pytest.raises(hg.InvalidInputError, match="^re: .*a plain number"):
        hg.darcy_factor(1e5 * U.m, 1e-4)


def test_display_units_change_views_not_attributes(line, water):
    r = line.evaluate(water, 0.0045)
    with hg.display(flow="L/s", pressure="kPa", length="mm"):
        assert hg.display_units()["flow"] == "L/s"
        assert r.flow == 0.0045
        q = hg.quantities(r, U)
        assert q["flow"].units == U.L / U.s
        assert q["flow"].magnitude == 4.5  # 0.0045 m³/s = 4.5 L/s exactly
        assert q["pressure_loss"].to("Pa").magnitude == pytest.approx(r.pressure_loss, rel=1e-14)
    assert hg.display_units()["flow"] == "m3/s"


def test_display_rejects_unknown_units():
    with pytest.raises(hg.UnknownNameError, match="display flow='L/h'"):
        hg.display(flow="L/h")
    with pytest.raises(hg.InvalidInputError, match="display pressure='mm'"):
        hg.display(pressure="mm")
    with pytest.raises(hg.UnknownNameError, match="unknown display dimension"):
        hg.display(power="W")
    assert hg.display_units()["pressure"] == "Pa"


def test_pint_is_not_imported_without_quantities():
    import subprocess
    import sys

    code = (
        "import sys, hydrograde as hg; w = hg.Fluid.water(300.0);"
        "hg.Line([hg.Pipe(0.05, 10.0, 1e-5)]).evaluate(w, 0.002)._repr_html_();"
        "print('pint' in sys.modules)"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"


def test_to_dataframe_follows_the_display_units(line, water):
    pytest.importorskip("pandas")
    r = line.evaluate(water, 0.0045)
    with hg.display(pressure="kPa", flow="L/s"):
        df = r.to_dataframe()
        one = hg.friction(1e5, 1e-4).to_dataframe()
    assert df.attrs["units"]["head_loss"] == "m"
    assert df.attrs["units"]["pressure_out"] == "kPa"
    assert list(df["head_loss"]) == [e.head_loss for e in r.elements]
    assert one.loc[0, "f"] == hg.darcy_factor(1e5, 1e-4)
    ln = hg.Line([hg.Pipe(0.0525, 30.0, 4.5e-5)], inlet_pressure=3e5)
    with hg.display(pressure="kPa"):
        df = ln.evaluate(water, 0.0045).to_dataframe()
    assert df.loc[0, "pressure_out"] == pytest.approx(ln.evaluate(water, 0.0045).elements[0].pressure_out / 1000, rel=1e-15)
