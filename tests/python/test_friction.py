"""darcy_factor and friction from Python: values, broadcasting, references."""

from __future__ import annotations

import math
import threading
import time

import mpmath
import numpy as np
import pytest
import scipy.special
from hypothesis import given
from hypothesis import strategies as st

import hydrograde as hg

mpmath.mp.dps = 40

# Turbulent Re (above the common-practice limit 4000) and ε/D over the design's range.
log_re = st.floats(min_value=math.log10(4001.0), max_value=9.0)
rel_rough = st.one_of(st.just(0.0), st.floats(min_value=1e-8, max_value=0.1))


def colebrook_mp(re: float, rr: float) -> mpmath.mpf:
    """Colebrook (1939) solved with mpmath at 40 digits: 1/√f = −2 log10(ε/3.7D + 2.51/(Re√f))."""
    re_m, rr_m = mpmath.mpf(re), mpmath.mpf(rr)
    g = lambda x: x + 2 * mpmath.log10(rr_m / mpmath.mpf("3.7") + mpmath.mpf("2.51") * x / re_m)
    x = mpmath.findroot(g, mpmath.mpf(8))
    return 1 / x**2


def ulps(a: float, b: float) -> float:
    return abs(a - b) / np.spacing(b)


@given(log_re, rel_rough)
def test_colebrook_within_4_ulp_of_mpmath_40_digits(lre, rr):
    re = 10.0**lre
    ref = float(colebrook_mp(re, rr))  # mpmath, 40 digits
    f = hg.darcy_factor(re, rr)
    assert ulps(f, ref) <= 4.0, (re, rr, f, ref)


def colebrook_lambertw(re: float, rr: float) -> tuple[float, float]:
    """Exact closed form of Colebrook via Lambert W (scipy.special.lambertw).

    With x = 1/√f, a = ε/(3.7 D), b = 2.51/Re, c = 2/ln 10:
    x = c·W(e^{a/(bc)}/(bc)) − a/b. Returns (f, relative rounding bound of the float64
    evaluation: the subtraction loses about a/b·x⁻¹ ulp).
    """
    a, b, c = rr / 3.7, 2.51 / re, 2.0 / math.log(10.0)
    z = math.exp(a / (b * c)) / (b * c)
    x = c * scipy.special.lambertw(z).real - a / b
    return 1.0 / x**2, 1e-14 * (1.0 + a / b) / x


@given(log_re, st.one_of(st.just(0.0), st.floats(min_value=1e-8, max_value=1e-3)))
def test_colebrook_matches_the_lambert_w_closed_form(lre, rr):
    re = 10.0**lre
    a_over_bc = (rr / 3.7) * re * math.log(10.0) / (2.0 * 2.51)
    if a_over_bc > 600.0:  # e^(a/bc) would overflow float64 in the closed form
        return
    ref, rel_bound = colebrook_lambertw(re, rr)  # scipy.special.lambertw
    assert hg.darcy_factor(re, rr) == pytest.approx(ref, rel=max(2e-14, 4 * rel_bound))


def test_derivatives_against_mpmath():
    re, rr = 2.5e5, 3e-4
    fr = hg.friction(re, rr)
    # mpmath.diff of the 40-digit Colebrook solution.
    d_re = mpmath.diff(lambda r: colebrook_mp(r, rr), re)
    d_rr = mpmath.diff(lambda e: colebrook_mp(re, e), rr)
    assert fr.df_dre == pytest.approx(float(d_re), rel=1e-12)
    assert fr.df_drel_roughness == pytest.approx(float(d_rr), rel=1e-12)


def test_laminar_is_64_over_re():
    # Exact analytical solution (Hagen–Poiseuille): f = 64/Re for a circle.
    assert hg.darcy_factor(1000.0, 0.0) == 64.0 / 1000.0
    fr = hg.friction(1000.0, 0.0)
    assert (fr.regime, fr.warnings, fr.df_dre) == ("laminar", [], -64.0 / 1000.0**2)
    # Exact analytical solution: parallel plates, f·Re = 96.
    assert hg.darcy_factor(500.0, 0.0, laminar_constant=96.0) == 96.0 / 500.0


def test_friction_fields_regime_and_warnings():
    fr = hg.friction(3000.0, 1e-4)
    assert fr.regime == "transitional"
    assert fr.warnings == ["transitional_flow"]
    assert fr.f == hg.darcy_factor(3000.0, 1e-4)
    # Blasius (1913) is published for smooth pipe up to Re 1e5 (from memory).
    assert hg.friction(1e6, 0.0, "blasius").warnings == ["reynolds_out_of_range"]
    assert set(hg.friction(1e6, 0.0, "blasius").warnings) <= set(hg.WARNING_NAMES)
    assert repr(fr).startswith("Friction(f=0.0295")
    assert "regime='transitional'" in repr(fr) and "warnings=['transitional_flow']" in repr(fr)
    with pytest.raises(TypeError, match="re: expected a number, got an array"):
        hg.friction(np.array([1e5]), 0.0)


def test_every_correlation_is_reachable_and_close_to_colebrook():
    assert hg.correlations() == [
        "colebrook", "haaland", "swamee_jain", "churchill", "serghides", "blasius", "fully_rough",
    ]
    re, rr = 1e5, 1e-4
    ref = hg.darcy_factor(re, rr)
    for name in hg.correlations():
        v = hg.correlation_validity(name)
        if name in ("blasius", "fully_rough"):
            continue
        assert v["re_min"] <= re <= v["re_max"]
        # Each correlation's published accuracy against Colebrook (module table of the core).
        assert hg.darcy_factor(re, rr, name) == pytest.approx(ref, rel=v["accuracy"] + 1e-15)


def test_scalars_give_floats_and_arrays_give_broadcast_arrays():
    assert type(hg.darcy_factor(1e5, 1e-4)) is float
    assert type(hg.darcy_factor(100_000, 0)) is float
    assert type(hg.darcy_factor(np.float64(1e5), 1e-4)) is float
    one = hg.darcy_factor(np.array([1e5]), 1e-4)
    assert isinstance(one, np.ndarray) and one.shape == (1,)
    zero_d = hg.darcy_factor(np.array(1e5), 1e-4)
    assert isinstance(zero_d, np.ndarray) and zero_d.shape == ()
    re = np.logspace(3, 8, 12).reshape(3, 1, 4)
    rr = np.array([[0.0], [1e-5], [1e-3]]).reshape(1, 3, 1)
    out = hg.darcy_factor(re, rr)
    assert out.shape == (3, 3, 4) and out.dtype == np.float64
    for idx in np.ndindex(out.shape):
        assert out[idx] == hg.darcy_factor(float(re[idx[0], 0, idx[2]]), float(rr[0, idx[1], 0]))
    assert hg.darcy_factor(np.empty((0, 2)), 0.0).shape == (0, 2)


def test_other_dtypes_and_layouts_convert_to_float64():
    expected = hg.darcy_factor(np.array([5000.0, 10000.0, 20000.0]), 0.0)
    for re in (
        [5000, 10000, 20000],
        np.array([5000, 10000, 20000], dtype=np.int32),
        np.array([5000, 10000, 20000], dtype=np.uint64),
        np.array([5000, 10000, 20000], dtype=np.float32),
        np.array([20000.0, 10000.0, 5000.0])[::-1],
        np.array([5000.0, 0.0, 10000.0, 0.0, 20000.0])[::2],
    ):
        assert np.array_equal(hg.darcy_factor(re, 0.0), expected)
    fortran = np.asfortranarray(np.logspace(4, 7, 6).reshape(2, 3))
    assert np.array_equal(hg.darcy_factor(fortran, 1e-4), hg.darcy_factor(np.ascontiguousarray(fortran), 1e-4))


def test_large_arrays_equal_the_scalar_call_bit_for_bit():
    rng = np.random.default_rng(7)
    re = 10.0 ** rng.uniform(2.0, 9.0, 50_000)
    rr = rng.uniform(0.0, 0.05, 50_000)
    out = hg.darcy_factor(re, rr, "haaland")
    for i in range(0, 50_000, 2_500):
        assert out[i] == hg.darcy_factor(float(re[i]), float(rr[i]), "haaland")


def test_the_gil_is_released_during_array_work():
    re = np.full(3_000_000, 1.5e5)
    ticks = 0
    stop = threading.Event()

    def count() -> None:
        nonlocal ticks
        while not stop.is_set():
            ticks += 1
            time.sleep(0)

    t = threading.Thread(target=count)
    t.start()
    time.sleep(0.01)
    before = ticks
    start = time.perf_counter()
    hg.darcy_factor(re, 1e-4)
    elapsed = time.perf_counter() - start
    during = ticks - before
    stop.set()
    t.join()
    # A Python thread can only make progress while the native call runs if the GIL is free.
    assert elapsed > 0.02 and during > 100, (elapsed, during)


@given(st.floats(min_value=4.0, max_value=8.5), st.floats(min_value=1e-6, max_value=0.05))
def test_physics_monotonic_in_re_and_roughness(lre, rr):
    # Moody (1944) chart shape: turbulent f falls with Re and rises with ε/D.
    re = 10.0**lre
    f = hg.darcy_factor(re, rr)
    assert hg.darcy_factor(re * 1.01, rr) <= f <= hg.darcy_factor(re, rr * 1.01)
    fr = hg.friction(re, rr)
    assert fr.df_dre <= 0.0 <= fr.df_drel_roughness


@given(st.floats(min_value=2300.0, max_value=4000.0))
def test_transition_blend_stays_between_the_limits(re):
    # The transitional value is a C¹ blend of the laminar value and Colebrook, so a Newton solver sees no jump.
    lam = 64.0 / re
    tur = hg.darcy_factor(re, 1e-4, transition="turbulent")
    f = hg.darcy_factor(re, 1e-4)
    assert min(lam, tur) - 1e-15 <= f <= max(lam, tur) + 1e-15
