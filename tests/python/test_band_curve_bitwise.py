"""One core, one answer for the bands along the system curve and the offered Monte Carlo
interval: Python and the C ABI give the same bits on the same line (the C tests check the
C ABI against the Rust core's records, capi/examples/core_reference.rs, so Rust = C =
Python).

Needs target/release/libhydrograde.so, built by scripts/test-c.sh; HYDROGRADE_LIB
overrides the path.
"""

from __future__ import annotations

import ctypes
import math
import os
from pathlib import Path

import numpy as np
import pytest

import hydrograde as hg

REPO = Path(__file__).resolve().parents[2]
LIB = Path(os.environ.get("HYDROGRADE_LIB", REPO / "target" / "release" / "libhydrograde.so"))

pytestmark = pytest.mark.skipif(
    not LIB.exists(), reason=f"{LIB} is absent: build it with scripts/test-c.sh"
)

dp = ctypes.POINTER(ctypes.c_double)
vp = ctypes.c_void_p


class MonteCarloC(ctypes.Structure):
    """hg_monte_carlo as the header declares it."""

    _fields_ = [
        ("struct_size", ctypes.c_size_t),
        ("mean", ctypes.c_double),
        ("std_dev", ctypes.c_double),
        ("low", ctypes.c_double),
        ("high", ctypes.c_double),
        ("samples", ctypes.c_size_t),
    ]


@pytest.fixture(scope="module")
def lib():
    so = ctypes.CDLL(str(LIB))
    so.hg_line_new.argtypes = [ctypes.POINTER(vp)]
    so.hg_line_add_pipe.argtypes = [vp, ctypes.c_double, ctypes.c_double, ctypes.c_double]
    so.hg_line_add_fitting.argtypes = [vp, ctypes.c_char_p, ctypes.c_double]
    so.hg_line_add_rise.argtypes = [vp, ctypes.c_double]
    so.hg_line_free.argtypes = [vp]
    so.hg_fluid_water.argtypes = [ctypes.c_double, ctypes.c_double, ctypes.POINTER(vp)]
    so.hg_fluid_free.argtypes = [vp]
    so.hg_line_system_curve_band.argtypes = [vp, vp, dp, ctypes.c_size_t, dp, dp, dp]
    so.hg_line_band_monte_carlo.argtypes = [
        vp, vp, ctypes.c_double, ctypes.POINTER(ctypes.c_int32), ctypes.POINTER(MonteCarloC),
    ]
    return so


def c_line(lib, build):
    line = vp()
    assert lib.hg_line_new(ctypes.byref(line)) == 0
    for call in build:
        assert call(line) == 0
    return line


def c_water(lib, temperature):
    fluid = vp()
    assert lib.hg_fluid_water(temperature, 101325.0, ctypes.byref(fluid)) == 0
    return fluid


def same_bits(a, b) -> bool:
    return np.array_equal(np.asarray(a, dtype=np.float64).view(np.uint64),
                          np.asarray(b, dtype=np.float64).view(np.uint64))


def test_system_curve_band_is_the_same_bits_in_python_and_c(lib):
    # An invented route: 30 m of 50 mm steel, a long-radius elbow, 4 m up, 10 m of 40 mm.
    py_line = hg.Line([
        hg.Pipe(0.05, 30.0, 4.5e-5),
        hg.Fitting.named("elbow_90_long_radius"),
        hg.Rise(4.0),
        hg.Pipe(0.04, 10.0, 4.5e-5),
    ])
    line = c_line(lib, [
        lambda l: lib.hg_line_add_pipe(l, 0.05, 30.0, 4.5e-5),
        lambda l: lib.hg_line_add_fitting(l, b"elbow_90_long_radius", 0.0),
        lambda l: lib.hg_line_add_rise(l, 4.0),
        lambda l: lib.hg_line_add_pipe(l, 0.04, 10.0, 4.5e-5),
    ])
    fluid = c_water(lib, 293.15)
    try:
        # Through zero and reverse flow, across laminar, transitional and turbulent flow.
        flows = np.concatenate([np.linspace(-4e-3, 4e-3, 41), [1e-7, 5e-5, 1e-4, 2e-4]])
        n = len(flows)
        low, nom, high = (np.zeros(n) for _ in range(3))
        status = lib.hg_line_system_curve_band(
            line, fluid, flows.ctypes.data_as(dp), n,
            low.ctypes.data_as(dp), nom.ctypes.data_as(dp), high.ctypes.data_as(dp),
        )
        assert status == 0
        p_low, p_nom, p_high = py_line.system_curve_band(hg.Fluid.water(293.15), flows.tolist())
        assert same_bits(p_low, low) and same_bits(p_nom, nom) and same_bits(p_high, high)
        # A band is a band: low ≤ nominal ≤ high at every flow, with width away from zero
        # flow (exact: the static head alone at zero flow has no flow-dependent spread).
        assert np.all(low <= nom) and np.all(nom <= high)
        assert np.all(high[flows != 0.0] > low[flows != 0.0])
    finally:
        lib.hg_line_free(line)
        lib.hg_fluid_free(fluid)


def test_offered_monte_carlo_is_the_same_bits_in_python_and_c(lib):
    # 20 m of smooth 20 mm tube at Re = 3000, inside the transition 2300…4000 (common
    # practice): the band flags itself and the Monte Carlo interval is offered.
    water = hg.Fluid.water(293.15)
    nu = water.viscosity / water.density
    flow = 3000.0 * nu * math.pi * 0.02 / 4.0  # Re = 4Q/(π d ν), exact
    py_line = hg.Line([hg.Pipe(0.02, 20.0, 0.0)])
    assert py_line.evaluate(water, flow).required_head_band.non_linear
    mc = hg.band_monte_carlo(py_line, water, flow)
    assert mc is not None and mc.samples == 20_000
    assert mc == hg.monte_carlo(py_line, water, flow, samples=20_000, seed=101)
    line = c_line(lib, [lambda l: lib.hg_line_add_pipe(l, 0.02, 20.0, 0.0)])
    fluid = c_water(lib, 293.15)
    try:
        out = MonteCarloC(struct_size=ctypes.sizeof(MonteCarloC))
        offered = ctypes.c_int32(-1)
        assert lib.hg_line_band_monte_carlo(line, fluid, flow, ctypes.byref(offered), ctypes.byref(out)) == 0
        assert offered.value == 1
        assert same_bits([mc.mean, mc.std_dev, mc.low, mc.high], [out.mean, out.std_dev, out.low, out.high])
        # Turbulent, narrow band: nothing offered, in both.
        assert hg.band_monte_carlo(py_line, water, 1e-3) is None
        assert lib.hg_line_band_monte_carlo(line, fluid, 1e-3, ctypes.byref(offered), ctypes.byref(out)) == 0
        assert offered.value == 0
    finally:
        lib.hg_line_free(line)
        lib.hg_fluid_free(fluid)


def test_offered_monte_carlo_bad_input():
    line = hg.Line([hg.Pipe(0.02, 20.0, 0.0)])
    with pytest.raises(hg.HydrogradeError, match="flow"):
        hg.band_monte_carlo(line, hg.Fluid.water(293.15), float("nan"))
