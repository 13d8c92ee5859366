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
