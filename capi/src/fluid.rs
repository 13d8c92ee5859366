//! Fluid properties: water and air at a state.

use crate::ffi::{self, guard, out_ptr, put};
use hydrograde::fluid::{self, Fluid};

/// Density (kg/m³) and dynamic viscosity (Pa·s) of liquid water at `temperature` (K) and
/// absolute `pressure` (Pa): IAPWS-IF97 region 1 and the IAPWS 2008 viscosity.
///
/// Valid ranges: 273.15 K ≤ temperature ≤ 623.15 K; the saturation pressure at that
/// temperature ≤ pressure ≤ 100 MPa (below it the water would boil).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` outside the ranges;
/// `HG_ERR_NULL_POINTER` when an output is NULL (nothing is written). Thread-safe.
///
/// # Safety
/// `density` and `viscosity` must be NULL or point to writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_water(
    temperature: f64,
    pressure: f64,
    density: *mut f64,
    viscosity: *mut f64,
) -> i32 {
    // SAFETY: forwarded contract.
    guard(|| unsafe { state(Fluid::water, temperature, pressure, density, viscosity) })
}

/// Density (kg/m³) and dynamic viscosity (Pa·s) of dry air at `temperature` (K) and
/// absolute `pressure` (Pa): ideal gas and Sutherland's law.
///
/// Valid ranges: 200 K ≤ temperature ≤ 1000 K; 0 < pressure ≤ 2 MPa.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` outside the ranges;
/// `HG_ERR_NULL_POINTER` when an output is NULL (nothing is written). Thread-safe.
///
/// # Safety
/// `density` and `viscosity` must be NULL or point to writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_air(
    temperature: f64,
    pressure: f64,
    density: *mut f64,
    viscosity: *mut f64,
) -> i32 {
    // SAFETY: forwarded contract.
    guard(|| unsafe { state(Fluid::air, temperature, pressure, density, viscosity) })
}

unsafe fn state(
    make: fn(f64, f64) -> hydrograde::Result<Fluid>,
    t: f64,
    p: f64,
    density: *mut f64,
    viscosity: *mut f64,
) -> ffi::FfiResult {
    ffi::check_outs(&[out_ptr("density", density), out_ptr("viscosity", viscosity)])?;
    let f = make(t, p)?;
    // SAFETY: the caller's contract; both pointers were checked.
    unsafe {
        put("density", density, f.density)?;
        put("viscosity", viscosity, f.viscosity)
    }
}

/// Vapour (saturation) pressure of water (Pa) at `temperature` (K), IAPWS-IF97.
///
/// Valid range: 273.15 K ≤ temperature ≤ 647.096 K (the critical point).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `pressure` must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_water_vapour_pressure(temperature: f64, pressure: *mut f64) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("pressure", pressure)])?;
        let p = fluid::water_vapour_pressure(temperature)?;
        // SAFETY: forwarded contract.
        unsafe { put("pressure", pressure, p) }
    })
}
