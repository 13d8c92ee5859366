//! Pump curves fitted by least squares: coefficients and residual, head, and the
//! operating point on a line with either kind of curve.

use crate::ffi::{self, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::hg_line;
use hydrograde::Error;
use hydrograde::line::PumpCurve;

/// The curve `degree` asks for: 0 the monotone cubic through the points, 2 or 3 the
/// least-squares polynomial.
fn curve(flows: &[f64], heads: &[f64], degree: i32) -> Result<PumpCurve, Error> {
    match degree {
        0 => PumpCurve::new(flows, heads),
        2 | 3 => PumpCurve::fit(flows, heads, degree as usize),
        _ => Err(Error::out_of_range(
            "degree",
            f64::from(degree),
            "must be 0 (monotone cubic through the points), 2 (quadratic fit) or 3 (cubic fit)",
        )),
    }
}

/// The least-squares polynomial of `degree` (2 or 3) through `n` pump points (`flows`
/// ≥ 0 strictly increasing, m³/s; `heads`, m, which may wiggle): H(Q) = Σ c_k Q^k with
/// `coefficients[0..4]` = c₀ … c₃ in SI units (ascending powers; c₃ = 0 for a quadratic),
/// `*rms_residual` and `*max_residual` (m) the root mean square and largest |H(Q_i) −
/// H_i| at the points. At least `degree + 1` points.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for a degree other than 2 or 3, a flow or head
/// out of range or flows not increasing; `HG_ERR_NOT_FINITE`; `HG_ERR_INVALID` for too
/// few points or flows too close together; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `flows` and `heads` must be NULL or valid for `n` doubles; `coefficients` NULL or
/// valid for writing 4 doubles; the other outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pump_curve_fit(
    flows: *const f64,
    heads: *const f64,
    n: usize,
    degree: i32,
    coefficients: *mut f64,
    rms_residual: *mut f64,
    max_residual: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("coefficients", coefficients),
            out_ptr("rms_residual", rms_residual),
            out_ptr("max_residual", max_residual),
        ])?;
        // SAFETY: forwarded contract.
        let (q, h) = unsafe {
            (
                ffi::slice("flows", flows, n)?,
                ffi::slice("heads", heads, n)?,
            )
        };
        if !(2..=3).contains(&degree) {
            let rule = "must be 2 (quadratic) or 3 (cubic)";
            return Err(Error::out_of_range("degree", f64::from(degree), rule).into());
        }
        let c = curve(q, h, degree)?;
        let f = c
            .fit_info()
            .ok_or_else(|| Error::invalid("degree", "the curve is not a fit"))?;
        let mut all = [0.0; 4];
        all[..f.coefficients.len()].copy_from_slice(&f.coefficients);
        // SAFETY: forwarded contract; checked above (4 doubles).
        unsafe {
            for (k, c) in all.iter().enumerate() {
                put("coefficients", coefficients.add(k), *c)?;
            }
            put("rms_residual", rms_residual, f.rms_residual)?;
            put("max_residual", max_residual, f.max_residual)
        }
    })
}

/// Head `*head` (m) and slope `*dhead_dflow` (s/m²) at `flow` (m³/s, inside the points'
/// range) of the pump curve through `n` points: `degree` 0 the monotone cubic of
/// `hg_pump_curve_head`, 2 or 3 the least-squares fit of `hg_pump_curve_fit`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for a flow outside the curve or a bad degree;
/// the errors of `hg_pump_curve_head` and `hg_pump_curve_fit` for bad points;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// As `hg_pump_curve_head`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pump_curve_fit_head(
    flows: *const f64,
    heads: *const f64,
    n: usize,
    degree: i32,
    flow: f64,
    head: *mut f64,
    dhead_dflow: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("head", head), out_ptr("dhead_dflow", dhead_dflow)])?;
        // SAFETY: forwarded contract.
        let (q, h) = unsafe {
            (
                ffi::slice("flows", flows, n)?,
                ffi::slice("heads", heads, n)?,
            )
        };
        let (v, d) = curve(q, h, degree)?.head(flow)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("head", head, v)?;
            put("dhead_dflow", dhead_dflow, d)
        }
    })
}

/// As `hg_line_operating_point`, with the pump curve of `degree`: 0 the monotone cubic
/// through the points (exactly `hg_line_operating_point`), 2 or 3 the least-squares fit
/// of `hg_pump_curve_fit`.
///
/// Returns the codes of `hg_line_operating_point`, and `HG_ERR_OUT_OF_RANGE` for a bad
/// degree. Thread-safe (the line is only read).
///
/// # Safety
/// As `hg_line_operating_point`.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_line_operating_point_fit(
    line: *const hg_line,
    fluid: *const hg_fluid,
    pump_flows: *const f64,
    pump_heads: *const f64,
    n: usize,
    degree: i32,
    flow: *mut f64,
    head: *mut f64,
    flow_low: *mut f64,
    flow_high: *mut f64,
    head_low: *mut f64,
    head_high: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("flow", flow),
            out_ptr("head", head),
            out_ptr("flow_low", flow_low),
            out_ptr("flow_high", flow_high),
            out_ptr("head_low", head_low),
            out_ptr("head_high", head_high),
        ])?;
        // SAFETY: forwarded contract.
        let (l, f, q, h) = unsafe {
            let (l, f) = crate::line::line_and_fluid(line, fluid)?;
            (
                l,
                f,
                ffi::slice("pump_flows", pump_flows, n)?,
                ffi::slice("pump_heads", pump_heads, n)?,
            )
        };
        let op = l.operating_point(f, &curve(q, h, degree)?)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("flow", flow, op.flow)?;
            put("head", head, op.head)?;
            put("flow_low", flow_low, op.flow_band.low)?;
            put("flow_high", flow_high, op.flow_band.high)?;
            put("head_low", head_low, op.head_band.low)?;
            put("head_high", head_high, op.head_band.high)
        }
    })
}

/// Appends a pump to `line`: its curve through `n` points (`flows` ≥ 0 strictly
/// increasing, m³/s; `heads`, m), `degree` 0 the monotone cubic through the points (heads
/// must not rise with flow), 2 or 3 the least-squares fit of `hg_pump_curve_fit`. In
/// every evaluation the pump is the negative loss −H(Q) (its row's head loss, kind
/// `HG_ELEMENT_PUMP`) with slope −dH/dQ, inside the curve's flow range only: a flow
/// outside it (no extrapolation) or reverse through it (a pump run backwards is not
/// modelled) is `HG_ERR_OUT_OF_RANGE` naming the pump and its range.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for too few points (a pump needs a curve);
/// `HG_ERR_OUT_OF_RANGE` for a bad degree, flows not increasing or heads rising (degree
/// 0); `HG_ERR_NOT_FINITE`; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `flows` and `heads` NULL
/// or valid for `n` doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_pump(
    line: *mut hg_line,
    flows: *const f64,
    heads: *const f64,
    n: usize,
    degree: i32,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        crate::line::with_line(line, |l| {
            let (q, h) = (
                ffi::slice("flows", flows, n)?,
                ffi::slice("heads", heads, n)?,
            );
            l.push(hydrograde::line::Element::Pump(curve(q, h, degree)?));
            Ok(())
        })
    }
}

/// Where a line with its own pumps runs by itself: the flow `*flow` (m³/s) at which its
/// required head (static head + losses + end pressure head − the pumps' head) is zero,
/// solved in a kept bracket over the flow range the pumps' curves share; `*pump_head`
/// (m) the pumps' head there. `*npsh_available` (m) is the NPSH available at the first
/// pump's suction (the boundary just upstream of it) and `*has_npsh` 1, or 0 and 0 when
/// the line has no inlet pressure or the fluid no vapour pressure. When `result` is not
/// NULL, `*result` receives the line evaluated at the flow (free it with
/// `hg_line_result_free`).
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for a line without a pump or one that cannot be
/// built; `HG_ERR_NO_SOLUTION` when the pumps' curves share no flow or the required head
/// does not change sign over their range (the curves are not extrapolated);
/// `HG_ERR_NULL_POINTER`. Nothing is written on error. Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; the outputs NULL or writable
/// (`result` may be NULL).
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_pumped_flow(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: *mut f64,
    pump_head: *mut f64,
    npsh_available: *mut f64,
    has_npsh: *mut i32,
    result: *mut *mut crate::line::hg_line_result,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("flow", flow),
            out_ptr("pump_head", pump_head),
            out_ptr("npsh_available", npsh_available),
            out_ptr("has_npsh", has_npsh),
        ])?;
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let p = l.pumped_flow(f)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("flow", flow, p.flow)?;
            put("pump_head", pump_head, p.pump_head)?;
            put(
                "npsh_available",
                npsh_available,
                p.npsh_available.unwrap_or(0.0),
            )?;
            put("has_npsh", has_npsh, i32::from(p.npsh_available.is_some()))?;
            if !result.is_null() {
                crate::line::give(result, p.result)?;
            }
        }
        Ok(())
    })
}
