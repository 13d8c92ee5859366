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
        put("density", density, f.density())?;
        put("viscosity", viscosity, f.viscosity())
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

/// A fluid for line evaluations: opaque; made by `hg_fluid_water`, `hg_fluid_air` or
/// `hg_fluid_liquid`, released with `hg_fluid_free`. A fluid never changes after it is
/// made, so any number of threads may use one at once.
pub struct hg_fluid {
    pub(crate) fluid: Fluid,
}

/// Stores a new fluid handle in `*out` (the caller owns it).
///
/// # Safety
/// `out` must be NULL or writable.
unsafe fn new_fluid(out: *mut *mut hg_fluid, make: impl FnOnce() -> ffi::FfiResult<Fluid>) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        let f = make()?;
        let p = Box::into_raw(Box::new(hg_fluid { fluid: f }));
        // SAFETY: forwarded contract; checked above.
        unsafe { put("out", out, p) }
    })
}

/// Makes liquid water at `temperature` (K) and absolute `pressure` (Pa), as `hg_water`,
/// with its vapour pressure (for cavitation warnings) and property uncertainties (for the
/// bands). Stores the handle in `*out`; free it with `hg_fluid_free`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_fluid *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_water(
    temperature: f64,
    pressure: f64,
    out: *mut *mut hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { new_fluid(out, || Ok(Fluid::water(temperature, pressure)?)) }
}

/// Makes dry air at `temperature` (K) and absolute `pressure` (Pa), as `hg_air`; lines
/// evaluated with a gas warn when the pressure loss exceeds 10 % of the inlet pressure.
/// Stores the handle in `*out`; free it with `hg_fluid_free`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_fluid *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_air(
    temperature: f64,
    pressure: f64,
    out: *mut *mut hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { new_fluid(out, || Ok(Fluid::air(temperature, pressure)?)) }
}

/// Makes a liquid of `density` (kg/m³, > 0) and dynamic `viscosity` (Pa·s, > 0), with
/// no stated uncertainty and no vapour pressure. Stores the handle in `*out`; free it
/// with `hg_fluid_free`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_fluid *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_liquid(
    density: f64,
    viscosity: f64,
    out: *mut *mut hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { new_fluid(out, || Ok(Fluid::new(density, viscosity)?)) }
}

/// Density (kg/m³) and dynamic viscosity (Pa·s) of a fluid handle.
///
/// Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `fluid` must be NULL or a live handle; the outputs NULL or writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_properties(
    fluid: *const hg_fluid,
    density: *mut f64,
    viscosity: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("density", density), out_ptr("viscosity", viscosity)])?;
        // SAFETY: forwarded contract.
        let f = unsafe { ffi::handle("fluid", fluid)? };
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("density", density, f.fluid.density())?;
            put("viscosity", viscosity, f.fluid.viscosity())
        }
    })
}

/// Releases a fluid made by `hg_fluid_*`. NULL is accepted and ignored. Not thread-safe
/// with respect to other uses of the same handle.
///
/// # Safety
/// `fluid` must be NULL or a live handle from `hg_fluid_*`, not used afterwards.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_free(fluid: *mut hg_fluid) {
    if !fluid.is_null() {
        // SAFETY: the handle came from Box::into_raw in `new_fluid`.
        ffi::guard_value((), || drop(unsafe { Box::from_raw(fluid) }));
    }
}

/// Saturation temperature of water (K) at absolute `pressure` (Pa), IAPWS-IF97.
///
/// Valid range: 611.213 Pa ≤ pressure ≤ 22.064 MPa (the critical point).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `temperature` must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_water_saturation_temperature(
    pressure: f64,
    temperature: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("temperature", temperature)])?;
        let t = fluid::water_saturation_temperature(pressure)?;
        // SAFETY: forwarded contract.
        unsafe { put("temperature", temperature, t) }
    })
}

/// Makes a gas of `density` (kg/m³, > 0) and `viscosity` (Pa·s, > 0) stated at
/// `temperature` (K, > 0) and absolute `pressure` (Pa, > 0); its density follows the
/// ideal-gas law at other pressures. Free it with `hg_fluid_free`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_fluid *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_gas(
    density: f64,
    viscosity: f64,
    temperature: f64,
    pressure: f64,
    out: *mut *mut hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        new_fluid(out, || {
            Ok(Fluid::gas(density, viscosity, temperature, pressure)?)
        })
    }
}

/// Makes a copy of `fluid` with the relative standard uncertainties (k = 1, 0 ≤ u < 1)
/// of its density `density_rel` and viscosity `viscosity_rel`, for the bands. Free the
/// new handle with `hg_fluid_free`; `fluid` is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `fluid` must be NULL or a live handle; `out` NULL or a writable `hg_fluid *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_with_uncertainty(
    fluid: *const hg_fluid,
    density_rel: f64,
    viscosity_rel: f64,
    out: *mut *mut hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        new_fluid(out, || {
            let f = ffi::handle("fluid", fluid)?;
            Ok(f.fluid
                .clone()
                .with_uncertainty(density_rel, viscosity_rel)?)
        })
    }
}

/// Makes a copy of `fluid` with its vapour pressure `vapour_pressure` (Pa, ≥ 0) set, for
/// cavitation warnings. Free the new handle with `hg_fluid_free`; `fluid` is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `fluid` must be NULL or a live handle; `out` NULL or a writable `hg_fluid *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fluid_with_vapour_pressure(
    fluid: *const hg_fluid,
    vapour_pressure: f64,
    out: *mut *mut hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        new_fluid(out, || {
            let f = ffi::handle("fluid", fluid)?;
            Ok(f.fluid.clone().with_vapour_pressure(vapour_pressure)?)
        })
    }
}
