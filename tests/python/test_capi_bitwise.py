"""One core, one answer: Python and the C ABI give the same bits on the same inputs.

Needs target/release/libhydrograde.so, built by scripts/test-c.sh (which ./run.sh test
runs before the Python suite); HYDROGRADE_LIB overrides the path.
"""

from __future__ import annotations

import ctypes
import os
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

import hydrograde as hg

REPO = Path(__file__).resolve().parents[2]
LIB = Path(os.environ.get("HYDROGRADE_LIB", REPO / "target" / "release" / "libhydrograde.so"))

pytestmark = pytest.mark.skipif(
    not LIB.exists(), reason=f"{LIB} is absent: build it with scripts/test-c.sh"
)

c_double_p = ctypes.POINTER(ctypes.c_double)


@pytest.fixture(scope="module")
def lib():
    so = ctypes.CDLL(str(LIB))
    so.hg_darcy_factor.argtypes = [ctypes.c_double, ctypes.c_double, ctypes.c_int32, c_double_p]
    so.hg_darcy_factor.restype = ctypes.c_int32
    so.hg_darcy_factor_full.argtypes = [
        ctypes.c_double, ctypes.c_double, ctypes.c_int32, c_double_p, c_double_p, c_double_p,
        ctypes.POINTER(ctypes.c_int32), ctypes.POINTER(ctypes.c_uint32),
    ]
    so.hg_darcy_factor_full.restype = ctypes.c_int32
    so.hg_darcy_factor_batch.argtypes = [c_double_p, c_double_p, ctypes.c_size_t, ctypes.c_int32, c_double_p]
    so.hg_darcy_factor_batch.restype = ctypes.c_int32
    so.hg_correlation_from_name.argtypes = [ctypes.c_char_p, ctypes.POINTER(ctypes.c_int32)]
    so.hg_correlation_from_name.restype = ctypes.c_int32
    so.hg_version.restype = ctypes.c_char_p
    return so


def code(lib, name: str) -> int:
    out = ctypes.c_int32(-1)
    assert lib.hg_correlation_from_name(name.encode(), ctypes.byref(out)) == 0
    return out.value


def c_full(lib, re: float, rr: float, corr: int):
    f, d_re, d_rr = ctypes.c_double(), ctypes.c_double(), ctypes.c_double()
    regime, warns = ctypes.c_int32(), ctypes.c_uint32()
    status = lib.hg_darcy_factor_full(
        re, rr, corr, ctypes.byref(f), ctypes.byref(d_re), ctypes.byref(d_rr),
        ctypes.byref(regime), ctypes.byref(warns),
    )
    return status, f.value, d_re.value, d_rr.value, regime.value, warns.value


def test_same_version(lib):
    assert lib.hg_version().decode() == hg.__version__


@given(
    st.floats(min_value=1.0, max_value=9.0),
    st.one_of(st.just(0.0), st.floats(min_value=1e-7, max_value=0.1)),
    st.sampled_from(hg.correlations()),
)
def test_scalar_bits_equal(lib, lre, rr, correlation):
    re = 10.0**lre
    if correlation == "fully_rough" and rr == 0.0:
        rr = 1e-4
    status, f, d_re, d_rr, regime, warns = c_full(lib, re, rr, code(lib, correlation))
    assert status == 0
    fr = hg.friction(re, rr, correlation)
    assert (fr.f, fr.df_dre, fr.df_drel_roughness) == (f, d_re, d_rr)  # bit for bit
    assert ["laminar", "transitional", "turbulent"][regime] == fr.regime
    names = [n for bit, n in enumerate(hg.WARNING_NAMES) if warns >> bit & 1]
    assert names == fr.warnings
    one = ctypes.c_double()
    assert lib.hg_darcy_factor(re, rr, code(lib, correlation), ctypes.byref(one)) == 0
    assert hg.darcy_factor(re, rr, correlation) == one.value


def test_batch_bits_equal(lib):
    rng = np.random.default_rng(11)
    n = 40_000  # above the core's parallel threshold on both sides
    re = 10.0 ** rng.uniform(2.0, 9.0, n)
    rr = rng.uniform(0.0, 0.05, n)
    out = np.empty(n)
    assert lib.hg_darcy_factor_batch(
        re.ctypes.data_as(c_double_p), rr.ctypes.data_as(c_double_p), n, code(lib, "colebrook"),
        out.ctypes.data_as(c_double_p),
    ) == 0
    assert np.array_equal(hg.darcy_factor(re, rr).view(np.uint64), out.view(np.uint64))


def test_errors_agree(lib):
    f = ctypes.c_double()
    assert lib.hg_darcy_factor(float("nan"), 0.0, 0, ctypes.byref(f)) != 0
    with pytest.raises(hg.NotFiniteError):
        hg.darcy_factor(float("nan"), 0.0)
