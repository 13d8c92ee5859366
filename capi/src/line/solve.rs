//! Solves on one line: the flow for a head, the system curve, the pump operating point,
//! the required head for a simulator, a pump curve alone and a copy at one diameter.

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
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let s = l.flow_for_head(f, head)?;
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
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        // SAFETY: forwarded contract.
        let q = unsafe { ffi::slice("flows", flows, n)? };
        // Checked before computing, without borrowing (it may alias `flows`).
        ffi::check_len("heads", heads.cast_const(), n)?;
        let h = l.system_curve(f, q)?;
        // SAFETY: `q` is no longer used, so `heads` may alias `flows`.
        let out = unsafe { ffi::slice_mut("heads", heads, n)? };
        out.copy_from_slice(&h);
        Ok(())
    })
}

/// The flow `*flow` (m³/s) and head `*head` (m) where the pump curve given by `n` points
/// (`pump_flows` increasing, m³/s; `pump_heads`, m) meets the line's system curve, with
/// the ends of their uncertainty bands. The pump curve is interpolated smoothly between
/// its points and not extrapolated.
///
/// Returns `HG_OK`; `HG_ERR_NO_SOLUTION` when the curves do not cross inside the pump
/// curve's range; `HG_ERR_NOT_FINITE`, `HG_ERR_OUT_OF_RANGE`, `HG_ERR_INVALID` for a bad
/// pump curve (too few points, flows not increasing) or line; `HG_ERR_NULL_POINTER`.
/// Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; the arrays NULL or valid for `n`
/// doubles; the outputs NULL or writable doubles.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_line_operating_point(
    line: *const hg_line,
    fluid: *const hg_fluid,
    pump_flows: *const f64,
    pump_heads: *const f64,
    n: usize,
    flow: *mut f64,
    head: *mut f64,
    flow_low: *mut f64,
    flow_high: *mut f64,
    head_low: *mut f64,
    head_high: *mut f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        crate::line::hg_line_operating_point_fit(
            line, fluid, pump_flows, pump_heads, n, 0, flow, head, flow_low, flow_high, head_low,
            head_high,
        )
    }
}

/// Required head `*head` (m of the flowing fluid) of `line` for `fluid` at signed flow
/// `flow` (m³/s) and its derivative `*dhead_dflow` (s/m²): the call a simulator's
/// Newton loop makes for a whole route. Continuous, with a continuous derivative,
/// through zero flow and the laminar–turbulent transition.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for a line that cannot be
/// built; `HG_ERR_NO_SOLUTION` (refused transition, a gas losing over 40 % of its
/// pressure); `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_required_head(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    head: *mut f64,
    dhead_dflow: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("head", head), out_ptr("dhead_dflow", dhead_dflow)])?;
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let (h, d) = l.required_head(f, flow)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("head", head, h)?;
            put("dhead_dflow", dhead_dflow, d)
        }
    })
}

/// Head `*head` (m) and slope `*dhead_dflow` (s/m²) of the pump curve through `n` points
/// (`flows` ≥ 0 strictly increasing, m³/s; `heads` not increasing, m) at `flow` (m³/s,
/// inside the curve's range), interpolated without overshoot as `hg_line_operating_point`
/// does.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a flow outside the
/// curve; `HG_ERR_INVALID` or `HG_ERR_OUT_OF_RANGE` for a bad curve (fewer than 3
/// points…); `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `flows` and `heads` must be NULL or valid for `n` doubles; the outputs NULL or
/// writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pump_curve_head(
    flows: *const f64,
    heads: *const f64,
    n: usize,
    flow: f64,
    head: *mut f64,
    dhead_dflow: *mut f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { crate::line::hg_pump_curve_fit_head(flows, heads, n, 0, flow, head, dhead_dflow) }
}

/// Makes a new line, stored in `*out`, equal to `line` with every round pipe set to
/// inside `diameter` (m, > 0), by the rule of `hg_line_with_diameter_in` over the whole
/// line: fittings take the new bore, contractions and expansions left between equal
/// bores are removed. Free it with `hg_line_free`; `line` is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
/// line without a round pipe, with equipment of a fixed bore (the message names it) or
/// that cannot be built; `HG_ERR_NULL_POINTER`. Thread-safe (`line` is only read).
///
/// # Safety
/// `line` must be NULL or a live handle; `out` NULL or a writable `hg_line *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_with_uniform_diameter(
    line: *const hg_line,
    diameter: f64,
    out: *mut *mut hg_line,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let l = unsafe { ffi::handle("line", line)? };
        let new = l.line()?.with_uniform_diameter(diameter)?;
        let handle = Box::new(hg_line::from_line(new));
        // SAFETY: forwarded contract; checked above.
        unsafe { put("out", out, Box::into_raw(handle)) }
    })
}
