//! Minor losses: K of a catalogue fitting.

use crate::ffi::{self, guard, out_ptr, put};
use hydrograde::fitting::Fitting;
use std::ffi::c_char;

/// The resistance coefficient K (dimensionless) of the catalogue fitting `name` and its
/// derivative ∂K/∂Re, at Reynolds number `re` (1e-100 or more, in `bore`), for the velocity in
/// `bore` (m, > 0), next to a pipe of relative roughness `pipe_rel_roughness`
/// (0 ≤ ε/D ≤ 0.5; used by fittings whose K follows the pipe's fully rough friction
/// factor). K(Re) = k_viscous/Re + k_inertial; fitting data scatter by ±20–50 %.
/// `hg_fitting_catalogue_name` lists the names.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` (the message lists the catalogue);
/// `HG_ERR_NOT_FINITE`, `HG_ERR_OUT_OF_RANGE` for bad numbers; `HG_ERR_NULL_POINTER`;
/// `HG_ERR_INVALID` for a name that is not UTF-8. Thread-safe.
///
/// # Safety
/// `name` must be NULL or a NUL-terminated string; `k` and `dk_dre` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fitting_k(
    name: *const c_char,
    re: f64,
    bore: f64,
    pipe_rel_roughness: f64,
    k: *mut f64,
    dk_dre: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("k", k), out_ptr("dk_dre", dk_dre)])?;
        // SAFETY: forwarded contract.
        let n = unsafe { ffi::c_str("name", name)? };
        let (kv, dk) = Fitting::named(n)?.k_at(re, bore, pipe_rel_roughness)?;
        // SAFETY: forwarded contract; both pointers were checked.
        unsafe {
            put("k", k, kv)?;
            put("dk_dre", dk_dre, dk)
        }
    })
}

/// Copies the name of catalogue fitting number `index` (0-based, catalogue order) into
/// `buf` (at most `len - 1` bytes and a NUL) and stores its full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is past the end (use it to count
/// the entries); `HG_ERR_NULL_POINTER` for a NULL `needed`, or a NULL `buf` with
/// `len` > 0; `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (the cut copy is still
/// written). Thread-safe.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_fitting_catalogue_name(
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        let names = Fitting::catalogue();
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_list_item(&names, index, buf, len, needed) }
    })
}
