//! Solves on lines: the pump operating point, the split of a flow between parallel
//! lines, and sizing to a limit.

use crate::ffi::sized;
use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::hg_line;
use hydrograde::line::{Limit, Line, PumpCurve, SizeChoice, split_flow};
use hydrograde::sizes::PipeTable;
use std::ffi::c_char;

/// Sizing limit: the line's pressure loss (friction + minor, without rises), Pa.
pub const HG_LIMIT_PRESSURE_LOSS: i32 = 0;
/// Sizing limit: the mean velocity in the round pipes, m/s.
pub const HG_LIMIT_VELOCITY: i32 = 1;

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
            (
                ffi::handle("line", line)?,
                ffi::handle("fluid", fluid)?,
                ffi::slice("pump_flows", pump_flows, n)?,
                ffi::slice("pump_heads", pump_heads, n)?,
            )
        };
        let pump = PumpCurve::new(q, h)?;
        let op = l.line()?.operating_point(&f.fluid, &pump)?;
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
        let (b, f) = unsafe {
            (
                ffi::slice("branches", branches, n)?,
                ffi::handle("fluid", fluid)?,
            )
        };
        let lines = b
            .iter()
            .map(|&p| -> FfiResult<Line> {
                // SAFETY: forwarded contract.
                let l = unsafe { ffi::handle("branches[i]", p)? };
                Ok(l.line()?.clone())
            })
            .collect::<FfiResult<Vec<Line>>>()?;
        let s = split_flow(&lines, &f.fluid, total)?;
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
        let (b, f) = unsafe {
            (
                ffi::slice("branches", branches, n)?,
                ffi::handle("fluid", fluid)?,
            )
        };
        let lines = b
            .iter()
            .map(|&p| -> FfiResult<Line> {
                // SAFETY: forwarded contract.
                let l = unsafe { ffi::handle("branches[i]", p)? };
                Ok(l.line()?.clone())
            })
            .collect::<FfiResult<Vec<Line>>>()?;
        let s = split_flow(&lines, &f.fluid, total)?;
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

/// A standard size chosen by `hg_line_size`: zero everywhere when `found` is 0.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_size_choice {
    /// 1 when a standard size was found, else 0.
    pub found: i32,
    /// Nominal size as printed, NUL-terminated (e.g. "1-1/2").
    pub nominal: [c_char; 16],
    /// Inside diameter, m.
    pub inside_diameter: f64,
    /// Velocity in it, m/s.
    pub velocity: f64,
    /// Pressure loss of the line with it, Pa.
    pub pressure_loss: f64,
    /// Lower end of the pressure-loss band, Pa.
    pub pressure_loss_low: f64,
    /// Upper end of the pressure-loss band, Pa.
    pub pressure_loss_high: f64,
}

/// The answer of `hg_line_size`. Set `struct_size` to `sizeof(hg_sizing)` first.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_sizing {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// The smallest inside diameter that meets the limit at the nominal values, m.
    pub min_inside_diameter: f64,
    /// The smallest standard size that meets it at the nominal values.
    pub standard: hg_size_choice,
    /// The smallest standard size that still meets it at the unfavourable end of the
    /// band (the high end of the pressure-loss band).
    pub standard_at_band: hg_size_choice,
}
sized!(hg_sizing, standard_at_band: hg_size_choice);

fn choice_to_c(c: Option<&SizeChoice>) -> FfiResult<hg_size_choice> {
    let mut out = hg_size_choice {
        found: 0,
        nominal: [0; 16],
        inside_diameter: 0.0,
        velocity: 0.0,
        pressure_loss: 0.0,
        pressure_loss_low: 0.0,
        pressure_loss_high: 0.0,
    };
    if let Some(c) = c {
        let bytes = c.size.nominal.as_bytes();
        if bytes.len() >= out.nominal.len() {
            return Err(ffi::Fail::new(
                crate::HG_ERR_INTERNAL,
                format!(
                    "nominal size \"{}\" longer than the struct holds",
                    c.size.nominal
                ),
            ));
        }
        for (d, s) in out.nominal.iter_mut().zip(bytes) {
            *d = *s as c_char;
        }
        out.found = 1;
        out.inside_diameter = c.size.inside_diameter;
        out.velocity = c.velocity;
        out.pressure_loss = c.pressure_loss;
        out.pressure_loss_low = c.pressure_loss_band.low;
        out.pressure_loss_high = c.pressure_loss_band.high;
    }
    Ok(out)
}

/// Sizes the round pipes of `line` (all set to one inside diameter) for `fluid` at flow
/// `flow` (m³/s, ≠ 0) under the limit `limit` (`HG_LIMIT_*`) of value `limit_value`
/// (Pa or m/s, > 0); with `table` and `schedule` (as `hg_pipe_size`; both NULL for none)
/// it also picks the smallest standard size that meets the limit, at the nominal values
/// and at the band's unfavourable end. The result goes to `*out`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a zero flow, a limit
/// ≤ 0 or an unknown `limit`; `HG_ERR_UNKNOWN_NAME` for a table or schedule;
/// `HG_ERR_INVALID` for a line without round pipes or a `struct_size` too small;
/// `HG_ERR_NO_SOLUTION` when no bore up to 20 m or no standard size meets the limit;
/// `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `table` and `schedule` NULL or
/// NUL-terminated; `out` NULL or a writable `hg_sizing` of `out->struct_size` bytes.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_line_size(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    limit: i32,
    limit_value: f64,
    table: *const c_char,
    schedule: *const c_char,
    out: *mut hg_sizing,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
        let lim = match limit {
            HG_LIMIT_PRESSURE_LOSS => Limit::PressureLoss(limit_value),
            HG_LIMIT_VELOCITY => Limit::Velocity(limit_value),
            _ => return Err(ffi::bad_constant("limit", limit, "HG_LIMIT_*", 2)),
        };
        let std_table = match (table.is_null(), schedule.is_null()) {
            (true, true) => None,
            _ => {
                // SAFETY: forwarded contract.
                let (t, s) = unsafe {
                    (
                        ffi::c_str("table", table)?,
                        ffi::c_str("schedule", schedule)?,
                    )
                };
                Some((t.parse::<PipeTable>()?, s))
            }
        };
        let sz = l.line()?.size(&f.fluid, flow, lim, std_table)?;
        let c = hg_sizing {
            struct_size: std::mem::size_of::<hg_sizing>(),
            min_inside_diameter: sz.min_inside_diameter,
            standard: choice_to_c(sz.standard.as_ref())?,
            standard_at_band: choice_to_c(sz.standard_at_band.as_ref())?,
        };
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &c) }
    })
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
        let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
        let (h, d) = l.line()?.required_head(&f.fluid, flow)?;
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
    guard(|| {
        ffi::check_outs(&[out_ptr("head", head), out_ptr("dhead_dflow", dhead_dflow)])?;
        // SAFETY: forwarded contract.
        let (q, h) = unsafe {
            (
                ffi::slice("flows", flows, n)?,
                ffi::slice("heads", heads, n)?,
            )
        };
        let (v, d) = PumpCurve::new(q, h)?.head(flow)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("head", head, v)?;
            put("dhead_dflow", dhead_dflow, d)
        }
    })
}

/// Makes a new line, stored in `*out`, equal to `line` with every round pipe set to
/// inside `diameter` (m, > 0); fittings that follow their pipe's bore follow it too.
/// Free it with `hg_line_free`; `line` is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
/// line that cannot be built; `HG_ERR_NULL_POINTER`. Thread-safe (`line` is only read).
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
        let handle = Box::new(hg_line::from_line(new, l.roughness_ranges.clone()));
        // SAFETY: forwarded contract; checked above.
        unsafe { put("out", out, Box::into_raw(handle)) }
    })
}
