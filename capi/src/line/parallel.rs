//! Parallel lines: the split of a flow between branches and its bands.

use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::hg_line;
use hydrograde::line::{Line, split_flow};

/// Checks the branch handles (each by its index) and the fluid, and gives the built
/// lines (copies: the split owns its branches) with the fluid.
///
/// # Safety
/// `branches` must be NULL or valid for `n` pointers, each NULL or a live handle;
/// `fluid` NULL or a live handle.
unsafe fn branches_and_fluid<'a>(
    branches: *const *const hg_line,
    n: usize,
    fluid: *const hg_fluid,
) -> FfiResult<(Vec<Line>, &'a hydrograde::fluid::Fluid)> {
    // SAFETY: forwarded contract.
    let (b, f) = unsafe {
        (
            ffi::slice("branches", branches, n)?,
            ffi::handle("fluid", fluid)?,
        )
    };
    let lines = b
        .iter()
        .enumerate()
        .map(|(i, &p)| -> FfiResult<Line> {
            // SAFETY: forwarded contract.
            let l = unsafe { ffi::handle(&format!("branches[{i}]"), p)? };
            Ok(l.line()?.clone())
        })
        .collect::<FfiResult<Vec<Line>>>()?;
    Ok((lines, &f.fluid))
}

/// Splits a total flow `total` (m³/s) between `n` lines in parallel so that all need the
/// same head: `flows[i]` is the flow in `branches[i]` (m³/s) and `*head` the common
/// required head (m).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for `n` = 0, a branch without
/// any loss or that cannot be built; `HG_ERR_NO_SOLUTION`; `HG_ERR_NULL_POINTER` (also
/// for a NULL branch). Thread-safe (the lines are only read).
///
/// # Safety
/// `branches` must be NULL or valid for `n` pointers, each NULL or a live handle;
/// `fluid` NULL or live; `flows` NULL or valid for `n` doubles; `head` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_split_flow(
    branches: *const *const hg_line,
    n: usize,
    fluid: *const hg_fluid,
    total: f64,
    flows: *mut f64,
    head: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("head", head)])?;
        ffi::check_len("flows", flows.cast_const(), n)?;
        // SAFETY: forwarded contract.
        let (lines, f) = unsafe { branches_and_fluid(branches, n, fluid)? };
        let s = split_flow(&lines, f, total)?;
        // SAFETY: forwarded contract; the length was checked above.
        let out = unsafe { ffi::slice_mut("flows", flows, n)? };
        out.copy_from_slice(&s.flows);
        // SAFETY: forwarded contract.
        unsafe { put("head", head, s.head) }
    })
}

/// The bands (k = 2) of `hg_line_split_flow`: for each branch `i`, `flows_low[i]` …
/// `flows_high[i]` (m³/s), and the common head's band `*head_low` … `*head_high` (m).
/// Line-wide sources (friction model, roughness, diameter, fluid) act on all branches
/// together, each fitting's K on its own branch.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for `n` = 0, a branch without
/// any loss or that cannot be built; `HG_ERR_NO_SOLUTION`; `HG_ERR_NULL_POINTER` (also
/// for a NULL branch). Thread-safe (the lines are only read).
///
/// # Safety
/// `branches` must be NULL or valid for `n` pointers, each NULL or a live handle;
/// `fluid` NULL or live; `flows_low` and `flows_high` NULL or valid for `n` doubles;
/// `head_low` and `head_high` NULL or writable.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_line_split_flow_bands(
    branches: *const *const hg_line,
    n: usize,
    fluid: *const hg_fluid,
    total: f64,
    flows_low: *mut f64,
    flows_high: *mut f64,
    head_low: *mut f64,
    head_high: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("head_low", head_low),
            out_ptr("head_high", head_high),
        ])?;
        ffi::check_len("flows_low", flows_low.cast_const(), n)?;
        ffi::check_len("flows_high", flows_high.cast_const(), n)?;
        // SAFETY: forwarded contract.
        let (lines, f) = unsafe { branches_and_fluid(branches, n, fluid)? };
        let s = split_flow(&lines, f, total)?;
        // SAFETY: forwarded contract; the lengths were checked above.
        let (lo, hi) = unsafe {
            (
                ffi::slice_mut("flows_low", flows_low, n)?,
                ffi::slice_mut("flows_high", flows_high, n)?,
            )
        };
        for (i, band) in s.flow_bands.iter().enumerate() {
            lo[i] = band.low;
            hi[i] = band.high;
        }
        // SAFETY: forwarded contract.
        unsafe {
            put("head_low", head_low, s.head_band.low)?;
            put("head_high", head_high, s.head_band.high)
        }
    })
}
