"""Fluid and water properties from Python against the iapws package."""

from __future__ import annotations

import iapws
import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

import hydrograde as hg


@given(st.floats(min_value=273.16, max_value=620.0), st.floats(min_value=0.0, max_value=1.0))
def test_water_against_iapws_if97(t, frac):
    # Reference: iapws.IAPWS97 (IF97 region 1) for density and the saturation line.
    p_sat = iapws.iapws97._PSat_T(t) * 1e6
    p = p_sat * 1.001 + frac * (100e6 - p_sat * 1.001)
    ref = iapws.IAPWS97(T=t, P=p / 1e6)
    if ref.region != 1:
        return
    w = hg.Fluid.water(t, p)
    assert w.density == pytest.approx(ref.rho, rel=1e-9)
    assert w.vapour_pressure == pytest.approx(p_sat, rel=1e-9)
    # Reference: iapws._Viscosity (IAPWS 2008, without the critical enhancement).
    assert w.viscosity == pytest.approx(iapws._iapws._Viscosity(ref.rho, t), rel=1e-9)


def test_water_functions_broadcast_and_equal_the_fluid():
    t = np.array([[283.15], [313.15]])
    p = np.array([1e5, 5e5, 2e6])
    rho = hg.water_density(t, p)
    assert rho.shape == (2, 3)
    assert rho[1, 2] == hg.Fluid.water(313.15, 2e6).density
    assert hg.water_viscosity(293.15) == hg.Fluid.water(293.15).viscosity
    # Reference: iapws.iapws97._PSat_T / _TSat_P (IF97 saturation line).
    assert hg.water_vapour_pressure(373.15) == pytest.approx(iapws.iapws97._PSat_T(373.15) * 1e6, rel=1e-12)
    ts = hg.water_saturation_temperature(np.array([1e4, 1e5, 1e6]))
    assert np.allclose(ts, [iapws.iapws97._TSat_P(p / 1e6) for p in (1e4, 1e5, 1e6)], rtol=1e-12, atol=0)


def test_water_default_pressure_is_one_atmosphere():
    # 101 325 Pa, the standard atmosphere (exact by definition, NIST SP 811).
    assert hg.Fluid.water(293.15) == hg.Fluid.water(293.15, 101325.0)
    assert hg.Fluid.water(293.15).pressure == 101325.0


def test_air_and_user_fluids():
    air = hg.Fluid.air(288.15)
    # U.S. Standard Atmosphere 1976 sea-level density 1.225 kg/m³ (from memory).
    assert air.density == pytest.approx(1.225, abs=1e-3)
    assert (air.phase, air.origin) == ("gas", "air")
    oil = hg.Fluid(870.0, 0.03).with_uncertainty(0.01, 0.05)
    assert (oil.phase, oil.origin, oil.temperature) == ("liquid", "user", None)
    assert oil.kinematic_viscosity == 0.03 / 870.0  # ν = μ/ρ, exact
    assert oil.density_rel_uncertainty == 0.01
    gas = hg.Fluid.gas(1.2, 1.8e-5, 293.15, 1e5)
    # Ideal gas at constant temperature: ρ ∝ p (exact).
    assert gas.at_pressure(2e5).density == pytest.approx(2.4, rel=1e-15)
    assert repr(oil) == "Fluid.user(density=870.0, viscosity=0.03, phase='liquid')"
    assert "Fluid.water(density=" in repr(hg.Fluid.water(293.15))


def test_fluid_errors():
    with pytest.raises(hg.OutOfRangeError, match="^density = -1: must be greater than 0$"):
        hg.Fluid(-1.0, 1e-3)
    with pytest.raises(hg.OutOfRangeError, match="temperature"):
        hg.Fluid.water(700.0)
    with pytest.raises(hg.NotFiniteError):
        hg.water_density(np.array([293.15, np.nan]))
