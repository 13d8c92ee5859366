//! Unit conversion.

use crate::ffi::{self, guard, out_ptr, put};
use hydrograde::units;
use std::ffi::c_char;

/// Converts `value` from unit `from` to unit `to` into `*out`, with the exact factors of
/// NIST SP 811. Unit names are those of the core's table, e.g. "m", "mm", "in", "ft",
/// "m3/s", "L/s", "m3/h", "gpm", "Pa", "kPa", "bar", "psi", "Pa.s", "cP", "K", "degC",
/// "degF" (see `hg_unit_name` for the full list). Heads of liquid need a density: use
/// `hg_convert_head`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` for a NaN or infinite value;
/// `HG_ERR_UNKNOWN_NAME` for an unknown unit (the message lists the known ones);
/// `HG_ERR_INVALID` when the two units measure different things;
/// `HG_ERR_OUT_OF_RANGE` for a temperature below absolute zero; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `from` and `to` must be NULL or NUL-terminated strings; `out` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_convert(
    value: f64,
    from: *const c_char,
    to: *const c_char,
    out: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (f, t) = unsafe { (ffi::c_str("from", from)?, ffi::c_str("to", to)?) };
        let v = units::convert(value, f, t)?;
        // SAFETY: forwarded contract.
        unsafe { put("out", out, v) }
    })
}

/// Converts between pressures and heads of a liquid of `density` (kg/m³, > 0):
/// p = ρ·g₀·h with standard gravity g₀. `from` and `to` are each a pressure unit ("Pa",
/// "kPa", "MPa", "bar", "psi", "atm") or a head unit ("m_head", "ft_head").
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a density ≤ 0;
/// `HG_ERR_UNKNOWN_NAME`; `HG_ERR_INVALID` for a unit that is neither a pressure nor a
/// head; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `from` and `to` must be NULL or NUL-terminated strings; `out` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_convert_head(
    value: f64,
    from: *const c_char,
    to: *const c_char,
    density: f64,
    out: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (f, t) = unsafe { (ffi::c_str("from", from)?, ffi::c_str("to", to)?) };
        let v = units::convert_head(value, f, t, density)?;
        // SAFETY: forwarded contract.
        unsafe { put("out", out, v) }
    })
}

/// Copies the name of unit number `index` (0-based, in the core's table order) into
/// `buf` like `hg_last_error` (at most `len - 1` bytes and a NUL) and stores its full
/// length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is past the end (use it to count
/// the units); `HG_ERR_NULL_POINTER` for a NULL `needed`, or a NULL `buf` with `len` > 0;
/// `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (the cut copy is still written).
/// Thread-safe.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_unit_name(
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        let names = units::names();
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_list_item(&names, index, buf, len, needed) }
    })
}
