//! Names of correlations and regimes, and the correlations' published validity.

use crate::ffi::{self, guard, out_ptr, put};
use crate::friction::{
    HG_REGIME_LAMINAR, HG_REGIME_TRANSITIONAL, HG_REGIME_TURBULENT, correlation,
};
use hydrograde::friction::Correlation;
use std::ffi::c_char;

/// The `HG_CORRELATION_*` value of a correlation name: "colebrook", "haaland",
/// "swamee_jain", "churchill", "serghides", "blasius", "fully_rough".
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` (the message lists the known names);
/// `HG_ERR_NULL_POINTER`; `HG_ERR_INVALID` for a name that is not UTF-8. Thread-safe.
///
/// # Safety
/// `name` must be NULL or a NUL-terminated string; `correlation` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_correlation_from_name(
    name: *const c_char,
    correlation: *mut i32,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("correlation", correlation)])?;
        // SAFETY: forwarded contract.
        let s = unsafe { ffi::c_str("name", name)? };
        let c: Correlation = s.parse()?;
        let code = Correlation::ALL.iter().position(|x| *x == c).unwrap_or(0) as i32;
        // SAFETY: forwarded contract.
        unsafe { put("correlation", correlation, code) }
    })
}

/// The name of an `HG_CORRELATION_*` value as a static string ("colebrook", …); NULL for
/// an unknown value. Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_correlation_name(correlation: i32) -> *const c_char {
    const NAMES: [&str; 7] = [
        "colebrook\0",
        "haaland\0",
        "swamee_jain\0",
        "churchill\0",
        "serghides\0",
        "blasius\0",
        "fully_rough\0",
    ];
    usize::try_from(correlation)
        .ok()
        .and_then(|i| NAMES.get(i))
        .map_or(std::ptr::null(), |n| n.as_ptr().cast())
}

/// The name of an `HG_REGIME_*` value as a static string ("laminar", "transitional",
/// "turbulent"); NULL for an unknown value. Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_regime_name(regime: i32) -> *const c_char {
    match regime {
        HG_REGIME_LAMINAR => c"laminar".as_ptr(),
        HG_REGIME_TRANSITIONAL => c"transitional".as_ptr(),
        HG_REGIME_TURBULENT => c"turbulent".as_ptr(),
        _ => std::ptr::null(),
    }
}

/// The published validity range and accuracy of correlation `correlation`
/// (`HG_CORRELATION_*`): Reynolds numbers `*re_min`…`*re_max`, relative roughness
/// `*rel_roughness_min`…`*rel_roughness_max`, and `*accuracy`, the published largest
/// relative deviation from Colebrook inside that range (0 for Colebrook itself). An
/// unbounded end is +infinity. Outside the range a result carries a warning.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an unknown correlation;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// The outputs must be NULL or point to writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_correlation_validity(
    correlation: i32,
    re_min: *mut f64,
    re_max: *mut f64,
    rel_roughness_min: *mut f64,
    rel_roughness_max: *mut f64,
    accuracy: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("re_min", re_min),
            out_ptr("re_max", re_max),
            out_ptr("rel_roughness_min", rel_roughness_min),
            out_ptr("rel_roughness_max", rel_roughness_max),
            out_ptr("accuracy", accuracy),
        ])?;
        let v = self::correlation(correlation)?.validity();
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("re_min", re_min, v.re_min)?;
            put("re_max", re_max, v.re_max)?;
            put("rel_roughness_min", rel_roughness_min, v.rel_roughness_min)?;
            put("rel_roughness_max", rel_roughness_max, v.rel_roughness_max)?;
            put("accuracy", accuracy, v.accuracy)
        }
    })
}

/// The two limits a transitional friction factor lies between, at Reynolds number `re`
/// and relative roughness `rel_roughness` (as `hg_darcy_factor`): `*laminar` = 64/Re and
/// `*turbulent` = the correlation's value. The band of a transitional result spans both.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// The outputs must be NULL or point to writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_transition_limits(
    re: f64,
    rel_roughness: f64,
    correlation: i32,
    laminar: *mut f64,
    turbulent: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("laminar", laminar), out_ptr("turbulent", turbulent)])?;
        let opts = hydrograde::friction::Options::with_correlation(self::correlation(correlation)?);
        let (l, t) = hydrograde::friction::transition_limits(re, rel_roughness, &opts)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("laminar", laminar, l)?;
            put("turbulent", turbulent, t)
        }
    })
}
