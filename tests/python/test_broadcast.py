"""Broadcast inputs read in place give the full-array results bit for bit (exact: the same
core batch per point; numpy broadcasting rules are the reference)."""

from __future__ import annotations

import numpy as np
import pytest

import hydrograde as hg


def bits(a):
    return np.ascontiguousarray(a, dtype=np.float64).view(np.uint64)


def full(*arrays):
    return [np.ascontiguousarray(a) for a in np.broadcast_arrays(*arrays)]


RE = np.logspace(2.5, 8.0, 300)  # laminar, transitional and turbulent
RR = np.logspace(-6.0, -1.5, 70)


@pytest.mark.parametrize("correlation", ["colebrook", "haaland", "churchill"])
def test_outer_broadcast_equals_full_arrays(correlation):
    got = hg.darcy_factor(RE[:, None], RR[None, :], correlation)
    want = hg.darcy_factor(*full(RE[:, None], RR[None, :]), correlation)
    assert got.shape == (300, 70)
    assert np.array_equal(bits(got), bits(want))
    # And each point is the scalar call (spot checks, exact).
    assert got[17, 3] == hg.darcy_factor(float(RE[17]), float(RR[3]), correlation)


@pytest.mark.parametrize(
    "re, rr",
    [
        (RE[::-1][:, None], RR[None, :]),  # reversed view (negative stride)
        (RE[:, None, None], RR[None, None, ::2]),  # three axes, strided slice
        (RE, 1e-4),  # array against a scalar
        (5e4, RR[:, None]),  # scalar against a column
        (RE.reshape(30, 10).T[:, :, None], RR[None, None, :5]),  # transposed (Fortran order)
        (np.broadcast_to(RE[:, None], (300, 4)), RR[:4]),  # zero strides from numpy
    ],
)
def test_views_equal_full_arrays(re, rr):
    got = hg.darcy_factor(re, rr)
    want = hg.darcy_factor(*full(re, rr))
    assert np.array_equal(bits(got), bits(want))


def test_general_functions_broadcast_without_changing_results():
    rates = np.array([1e-5, 2e-5, 4e-5])
    years = np.array([1.0, 10.0, 30.0, 50.0])
    got = hg.aged_roughness(1e-4, rates[:, None], years[None, :])
    r, y = full(rates[:, None], years[None, :])
    assert np.array_equal(bits(got), bits(hg.aged_roughness(1e-4, r, y)))


def test_broadcast_errors_name_the_first_bad_point_in_c_order():
    re = np.array([1e4, -1.0, 1e5])
    with pytest.raises(hg.OutOfRangeError, match="element 2"):
        hg.darcy_factor(re[:, None], RR[None, :2])
    with pytest.raises(hg.InvalidInputError, match="broadcast"):
        hg.darcy_factor(RE[:4], RR[:3])
