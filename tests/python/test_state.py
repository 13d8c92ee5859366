"""Checked state: threads, sample limits, pickles that cannot smuggle bad values."""

from __future__ import annotations

import numpy as np
import pytest

import hydrograde as hg


@pytest.fixture()
def line():
    # Invented route: 30 m of 50 mm pipe.
    return hg.Line([hg.Pipe(0.05, 30.0, 4.5e-5)])


@pytest.fixture()
def water():
    return hg.Fluid(998.0, 1.0e-3)


@pytest.fixture()
def restore_threads():
    before = hg.threads()
    yield
    hg.set_threads(before)


def test_threads_setting_changes_no_bit(line, water, restore_threads):
    flows = np.linspace(-2e-3, 2e-3, 5001)
    re = np.geomspace(5e3, 1e8, 20000)
    hg.set_threads(1)
    assert hg.threads() == 1
    curve1 = line.system_curve(water, flows)
    f1 = hg.darcy_factor(re, 1e-4)
    hg.set_threads(3)
    assert hg.threads() == 3
    assert np.array_equal(line.system_curve(water, flows), curve1)
    assert np.array_equal(hg.darcy_factor(re, 1e-4), f1)


@pytest.mark.parametrize("bad", [0, -1, 1025, 2**64, 10**40])
def test_threads_out_of_range_names_the_argument(bad, restore_threads):
    before = hg.threads()
    with pytest.raises(hg.OutOfRangeError, match=r"^threads = "):
        hg.set_threads(bad)
    assert hg.threads() == before


def test_threads_wants_an_int():
    with pytest.raises(TypeError, match="threads must be an int"):
        hg.set_threads(2.0)


@pytest.mark.parametrize("bad", [10**11, 2**62, 2**64, 10**40, -1, 99])
def test_monte_carlo_sample_limit_is_an_error(line, water, bad):
    with pytest.raises(hg.OutOfRangeError, match=r"^samples = ") as e:
        hg.monte_carlo(line, water, 1e-3, samples=bad)
    assert isinstance(e.value, hg.HydrogradeError)
    assert e.value.parameter == "samples"


def _state(obj) -> bytes:
    return obj.__reduce__()[1][0]


def _mp_str(s: str) -> bytes:
    b = s.encode()
    return bytes([0xA0 | len(b)]) + b


def _mp_f64(x: float) -> bytes:
    import struct

    return b"\xcb" + struct.pack(">d", x)


def test_pickles_round_trip_through_the_checks(line, water):
    import pickle

    back = pickle.loads(pickle.dumps(line))
    assert back.evaluate(water, 1e-3).required_head == line.evaluate(water, 1e-3).required_head
    assert pickle.loads(pickle.dumps(hg.Rise(-2.5))).height == -2.5


def test_truncated_line_state_is_a_hydrograde_error(line):
    state = _state(line)
    for cut in (0, 1, len(state) // 2, len(state) - 1):
        with pytest.raises(hg.HydrogradeError, match="not a valid hydrograde state"):
            hg.Line._from_state(state[:cut])


def test_tampered_states_break_no_rule():
    # A rise of NaN, a circle of negative diameter, an empty pump curve: each written
    # by hand in MessagePack, each refused by the constructor's own check.
    with pytest.raises(hg.HydrogradeError, match="height = NaN"):
        hg.Rise._from_state(_mp_f64(float("nan")))
    circle = b"\x81" + _mp_str("Circle") + b"\x81" + _mp_str("diameter") + _mp_f64(-0.05)
    with pytest.raises(hg.HydrogradeError, match="diameter = -0.05"):
        hg.Section._from_state(circle)
    empty = b"\x82" + _mp_str("flows") + b"\x90" + _mp_str("heads") + b"\x90"
    with pytest.raises(hg.HydrogradeError, match="at least 3 points"):
        hg.PumpCurve._from_state(empty)
    assert hg.Section._from_state(
        b"\x81" + _mp_str("Circle") + b"\x81" + _mp_str("diameter") + _mp_f64(0.05)
    ) == hg.Section.circle(0.05)


def test_overflowing_sizes_are_refused():
    with pytest.raises(hg.OutOfRangeError, match=r"^diameter = 1e300"):
        hg.Section.circle(1e300)
    with pytest.raises(hg.OutOfRangeError, match=r"^height = "):
        hg.Rise(1e300)


def _swap_f64(state: bytes, old: float, new: float) -> bytes:
    import struct

    before = b"\xcb" + struct.pack(">d", old)
    assert state.count(before) == 1, "the value to tamper with appears once"
    return state.replace(before, b"\xcb" + struct.pack(">d", new))


def test_tampered_fluid_and_option_states_are_refused():
    # Each state is a real pickle with one number edited: the constructors' own checks
    # refuse it as a HydrogradeError, never a panic or a fluid that breaks a rule.
    oil = hg.Fluid(870.0, 0.03)
    with pytest.raises(hg.HydrogradeError, match=r"density = -870"):
        hg.Fluid._from_state(_swap_f64(_state(oil), 870.0, -870.0))
    water = hg.Fluid.water(333.15, 3e5)
    with pytest.raises(hg.HydrogradeError, match=r"density = 1500: differs from the water model"):
        hg.Fluid._from_state(_swap_f64(_state(water), water.density, 1500.0))
    assert hg.Fluid._from_state(_state(water)) == water
    u = hg.Uncertainty(turbulent_model=0.07)
    with pytest.raises(hg.HydrogradeError, match=r"turbulent_model = -0.07"):
        hg.Uncertainty._from_state(_swap_f64(_state(u), 0.07, -0.07))
    line = hg.Line([hg.Pipe(0.05, 30.0, 4.5e-5)], inlet_pressure=2.5e5)
    with pytest.raises(hg.HydrogradeError, match=r"inlet_pressure = -250000"):
        hg.Line._from_state(_swap_f64(_state(line), 2.5e5, -2.5e5))
    with pytest.raises(hg.HydrogradeError, match="not a valid hydrograde state"):
        hg.Fluid._from_state(_state(water)[:-3])
