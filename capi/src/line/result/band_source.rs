//! The sources of a result's bands, largest share first, read from the kept result.

use super::{element, hg_line_result, read};
use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use hydrograde::band::Contribution;
use std::ffi::c_char;

/// Copies contribution `source` of `list` out: the name as `copy_name`, then the share,
/// which is written only when the name fitted.
///
/// # Safety
/// As `copy_name`; `share` NULL or writable.
unsafe fn give_source(
    list: &[Contribution],
    source: usize,
    what: &str,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
    share: *mut f64,
) -> FfiResult {
    ffi::check_outs(&[out_ptr("needed", needed), out_ptr("share", share)])?;
    let c = list.get(source).ok_or_else(|| {
        ffi::size_out_of_range(
            "source",
            source,
            format!(
                "must be less than {} (the number of sources of {what})",
                list.len()
            ),
        )
    })?;
    // SAFETY: forwarded contract; checked above.
    unsafe {
        ffi::copy_name(&c.source.name(), buf, len, needed)?;
        put("share", share, c.share)
    }
}

/// Source number `source` (0-based, largest share first; fewer than
/// `hg_line_totals.band_source_count`) of the head-loss band of the whole line in
/// `result`: its name copied into `buf` (e.g. "friction model", "roughness",
/// "K of gate_valve (element 2)"; at most `len - 1` bytes and a NUL; full length in
/// `*needed`) and its share of the variance (0…1) in `*share`. Source 0 is the input
/// that dominates the band.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `source` is past the last source (a band
/// of zero width, as at zero flow, has none); `HG_ERR_BUFFER_TOO_SMALL` when the name did
/// not fit (`*needed` and the cut copy are written, `*share` is not);
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `buf` NULL or valid for `len` bytes; `needed`
/// and `share` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_band_source(
    result: *const hg_line_result,
    source: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
    share: *mut f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let r = unsafe { read(result)? };
        let list = &r.head_loss_band.contributions;
        // SAFETY: forwarded contract.
        unsafe { give_source(list, source, "the line's band", buf, len, needed, share) }
    })
}

/// Source number `source` (0-based, largest share first; fewer than
/// `hg_element_result.band_source_count`) of the head-loss band of element `index`
/// (0-based, route order) of `result`, as `hg_line_result_band_source` gives them for
/// the whole line.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not an element or `source` is
/// past the last source (a rise, and any band of zero width, has none);
/// `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (`*needed` and the cut copy are
/// written, `*share` is not); `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// As `hg_line_result_band_source`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_element_band_source(
    result: *const hg_line_result,
    index: usize,
    source: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
    share: *mut f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let e = element(unsafe { read(result)? }, index)?;
        let list = &e.head_loss_band.contributions;
        let what = format!("element {index}'s band");
        // SAFETY: forwarded contract.
        unsafe { give_source(list, source, &what, buf, len, needed, share) }
    })
}
