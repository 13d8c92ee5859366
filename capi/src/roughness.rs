//! Wall roughness of catalogue materials and its growth with age.

use crate::ffi::{self, guard, out_ptr, put};
use hydrograde::roughness;
use std::ffi::c_char;

/// Absolute roughness of new pipe of the catalogue material `material` (e.g.
/// "commercial_steel"; see `hg_roughness_material_name`): `*typical`, and the quoted
/// range `*low` to `*high`, all in m (handbook values; common practice).
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` (the message lists the catalogue);
/// `HG_ERR_INVALID` for a name not UTF-8; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `material` must be NULL or a NUL-terminated string; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_roughness(
    material: *const c_char,
    typical: *mut f64,
    low: *mut f64,
    high: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("typical", typical),
            out_ptr("low", low),
            out_ptr("high", high),
        ])?;
        // SAFETY: forwarded contract.
        let m = roughness::material(unsafe { ffi::c_str("material", material)? })?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("typical", typical, m.typical)?;
            put("low", low, m.low)?;
            put("high", high, m.high)
        }
    })
}

/// Copies the name of catalogue material number `index` (0-based) into `buf` (at most
/// `len - 1` bytes and a NUL) and stores its full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` past the end; `HG_ERR_BUFFER_TOO_SMALL` when
/// the name did not fit (the cut copy is still written); `HG_ERR_NULL_POINTER` for a NULL
/// `needed`, or a NULL `buf` with `len` > 0. Thread-safe.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_roughness_material_name(
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        let names = roughness::names();
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_list_item(&names, index, buf, len, needed) }
    })
}

/// Roughness `*roughness` (m) after `years` of service growing linearly from `initial`
/// (m) at `rate` (m per year): ε = ε₀ + α·t (Colebrook & White 1937 aging model).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a negative argument;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `roughness` must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_roughness_aged(
    initial: f64,
    rate: f64,
    years: f64,
    roughness: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("roughness", roughness)])?;
        let r = roughness::aged(initial, rate, years)?;
        // SAFETY: forwarded contract.
        unsafe { put("roughness", roughness, r) }
    })
}
