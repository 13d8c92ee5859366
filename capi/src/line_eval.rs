//! A line's flow for a head and its system curve.

use crate::ffi::{self, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::hg_line;

/// The flow `*flow` (m³/s, signed: negative when `head` is below the static head) at
/// which the line's required head equals `head` (m of the flowing fluid), with the ends
/// `*flow_low`, `*flow_high` of its uncertainty band (k = 2).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for a line without any loss or
/// that cannot be built; `HG_ERR_NO_SOLUTION` when no flow meets the head (e.g. reverse
/// flow through a check valve); `HG_ERR_NULL_POINTER`. Thread-safe (the line is only
/// read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_flow_for_head(
    line: *const hg_line,
    fluid: *const hg_fluid,
    head: f64,
    flow: *mut f64,
    flow_low: *mut f64,
    flow_high: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("flow", flow),
            out_ptr("flow_low", flow_low),
            out_ptr("flow_high", flow_high),
        ])?;
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
        let s = l.line()?.flow_for_head(&f.fluid, head)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("flow", flow, s.flow)?;
            put("flow_low", flow_low, s.flow_band.low)?;
            put("flow_high", flow_high, s.flow_band.high)
        }
    })
}

/// The system curve: `heads[i]` = the required head (m) of the line at `flows[i]` (m³/s),
/// for `n` flows; uses all cores above 4096 points, with the same results.
/// `heads` may be the `flows` array itself.
///
/// Returns `HG_OK`; the status of the first failing flow (message "element <i>: ..."),
/// with `heads` unchanged; `HG_ERR_INVALID` for `n` = 0 or a line that cannot be built;
/// `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `flows` and `heads` NULL or valid for
/// `n` doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_system_curve(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flows: *const f64,
    n: usize,
    heads: *mut f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
        // SAFETY: forwarded contract.
        let q = unsafe { ffi::slice("flows", flows, n)? };
        // Checked before computing, without borrowing (it may alias `flows`).
        ffi::check_len("heads", heads.cast_const(), n)?;
        let h = l.line()?.system_curve(&f.fluid, q)?;
        // SAFETY: `q` is no longer used, so `heads` may alias `flows`.
        let out = unsafe { ffi::slice_mut("heads", heads, n)? };
        out.copy_from_slice(&h);
        Ok(())
    })
}
