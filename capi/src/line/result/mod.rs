//! A line evaluated at one flow, kept as an opaque result: totals, each element's row and
//! label, and the sources of every band, all read without evaluating again.

use crate::ffi::{self, FfiResult, guard, out_ptr, put, sized};
use crate::fluid::hg_fluid;
use crate::friction::regime_code;
use crate::line::hg_line;
use hydrograde::line::{ElementKind, ElementResult, LineResult};
use std::ffi::c_char;

/// A straight run (pipe or duct).
pub const HG_ELEMENT_PIPE: i32 = 0;
/// A fitting (minor loss).
pub const HG_ELEMENT_FITTING: i32 = 1;
/// An elevation change.
pub const HG_ELEMENT_RISE: i32 = 2;
/// Rated equipment.
pub const HG_ELEMENT_EQUIPMENT: i32 = 3;
/// An abrupt change of section the route implies between two elements of different bore
/// with no contraction or expansion element: a row of its own (not an element of the
/// line), with `HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION`.
pub const HG_ELEMENT_SECTION_CHANGE: i32 = 4;
/// A pump (`hg_line_add_pump`): its head loss is the negative of the head it adds.
pub const HG_ELEMENT_PUMP: i32 = 5;

/// The `regime` of an element that has none (every element but a pipe).
pub const HG_REGIME_NONE: i32 = -1;

/// A line evaluated at one flow: opaque. Made by `hg_line_evaluate` or
/// `hg_line_evaluate_at`, released by `hg_line_result_free`. It owns a copy of every
/// number, so it stays valid after the line and the fluid are freed. Reading it is
/// thread-safe.
pub struct hg_line_result {
    pub(crate) result: LineResult,
}

/// The totals of a line evaluated at one flow, from `hg_line_result_totals`. Set
/// `struct_size` to `sizeof(hg_line_totals)` before the call; fields added in later
/// versions go after the existing ones, so an old caller's smaller struct keeps working.
/// Heads are in m of the flowing fluid. The `*_low` and `*_high` fields bound the
/// expanded uncertainty (coverage factor k = 2).
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_line_totals {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// The flow, m³/s (signed).
    pub flow: f64,
    /// Friction plus minor losses, m (signed with the flow).
    pub head_loss: f64,
    /// ρ·g·head_loss, Pa.
    pub pressure_loss: f64,
    /// Sum of the rises, m.
    pub static_head: f64,
    /// head_loss + static_head, m.
    pub required_head: f64,
    /// d(required_head)/dQ, s/m².
    pub drequired_head_dflow: f64,
    /// Density the heads refer to, kg/m³ (the mean density for a gas).
    pub density: f64,
    /// Static pressure at the inlet, Pa absolute; meaningful only when `has_pressures`
    /// is 1 (else 0).
    pub inlet_pressure: f64,
    /// Static pressure at the outlet, Pa absolute; meaningful only when `has_pressures`
    /// is 1 (else 0).
    pub outlet_pressure: f64,
    /// 1 when the inlet pressure is known (set, or the gas's own), else 0.
    pub has_pressures: i32,
    /// Warning bits of the whole line, `HG_WARN_*`.
    pub warnings: u32,
    /// Number of elements (rows through `hg_line_result_element`).
    pub element_count: usize,
    /// Number of sources of the head-loss band (through `hg_line_result_band_source`);
    /// 0 for a band of zero width.
    pub band_source_count: usize,
    /// Lower end of the head-loss band, m.
    pub head_loss_low: f64,
    /// Upper end of the head-loss band, m.
    pub head_loss_high: f64,
    /// Lower end of the pressure-loss band, Pa.
    pub pressure_loss_low: f64,
    /// Upper end of the pressure-loss band, Pa.
    pub pressure_loss_high: f64,
    /// Lower end of the required-head band, m.
    pub required_head_low: f64,
    /// Upper end of the required-head band, m.
    pub required_head_high: f64,
    /// ρ·g·required_head, Pa: the pressure rise a pump, fan or blower must supply (for a
    /// gas the figure to lead with; a rise counts (ρ − ρ_surroundings)·g·Δz). Added after
    /// the first layout: read it only when `struct_size` covers it.
    pub required_pressure: f64,
    /// 1 when the first-order bands above are flagged non-linear (wider than 20 % of
    /// their nominal value, or a pipe's Reynolds number reaches into the laminar–turbulent
    /// transition within its own 95 % range): take the interval from
    /// `hg_line_monte_carlo` instead; else 0. Added after the first layout: read it only
    /// when `struct_size` covers it.
    pub band_non_linear: i32,
    /// Always 0 (keeps the struct free of padding, so whole structs compare bytewise).
    pub band_reserved: i32,
}
sized!(hg_line_totals, required_head_high: f64);

/// One element's row of a line evaluated at one flow, from `hg_line_result_element`. Set
/// `struct_size` to `sizeof(hg_element_result)` before the call. A quantity the element
/// does not have (a rise's velocity, a pipe's K) has its `has_*` flag at 0 and the value
/// 0, which is then not a value.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_element_result {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// What the element is, `HG_ELEMENT_*`.
    pub kind: i32,
    /// Flow regime of a pipe, `HG_REGIME_*`; `HG_REGIME_NONE` for other elements.
    pub regime: i32,
    /// Mean velocity in the element's bore, m/s (signed); only when `has_velocity`.
    pub velocity: f64,
    /// Reynolds number in that bore; only when `has_velocity`.
    pub reynolds: f64,
    /// Darcy friction factor; only when `has_friction_factor` (pipes).
    pub friction_factor: f64,
    /// Resistance coefficient K at this Reynolds number; only when `has_k` (fittings,
    /// fixed-K equipment).
    pub k: f64,
    /// Head loss, m (signed with the flow; 0 for rises).
    pub head_loss: f64,
    /// d(head loss)/dQ, s/m².
    pub dhead_dflow: f64,
    /// Elevation change, m (rises; 0 for the others).
    pub static_head: f64,
    /// Static pressure at the element's outlet, Pa absolute; only when `has_pressure`.
    pub pressure_out: f64,
    /// Warning bits of this element, `HG_WARN_*`.
    pub warnings: u32,
    /// 1 when `pressure_out` is known, else 0.
    pub has_pressure: i32,
    /// Lower end of the head-loss band, m.
    pub head_loss_low: f64,
    /// Upper end of the head-loss band, m.
    pub head_loss_high: f64,
    /// Lower end of the friction-factor band; only when `has_friction_factor`.
    pub friction_factor_low: f64,
    /// Upper end of the friction-factor band; only when `has_friction_factor`.
    pub friction_factor_high: f64,
    /// 1 when `velocity` and `reynolds` apply (elements with a bore: not a rise nor a
    /// rated pressure drop), else 0.
    pub has_velocity: i32,
    /// 1 when `friction_factor` and its band apply (pipes), else 0.
    pub has_friction_factor: i32,
    /// 1 when `k` applies (fittings, fixed-K equipment), else 0.
    pub has_k: i32,
    /// Reserved, 0 (keeps the next field aligned alike on every platform).
    pub reserved: i32,
    /// Number of sources of this element's head-loss band (through
    /// `hg_line_result_element_band_source`); 0 for a band of zero width (a rise).
    pub band_source_count: usize,
    /// How many identical fittings the row stands for (`hg_line_set_count`; 1 for every
    /// other row). This and the fields after it came after the struct's first layout: a
    /// caller whose `struct_size` ends before them does not get them.
    pub count: usize,
    /// The row's share of the variance of the line's head loss: the covariance of its
    /// loss with the total over the total's variance (the shares of all rows sum to 1; a
    /// negative share offsets the rest); only when `has_band_share`.
    pub band_share: f64,
    /// 1 when `band_share` applies (the line's head-loss band has a width), else 0.
    pub has_band_share: i32,
    /// Reserved, 0.
    pub reserved_end: i32,
    /// Elevation of the element's outlet above the line's inlet, m (a rise's geometric
    /// height is the change of this from the row before).
    pub elevation_out: f64,
    /// Total pressure (static + ½ρV²) at the outlet, Pa absolute; valid when
    /// `has_pressure`.
    pub total_pressure_out: f64,
    /// The bore the velocity is referred to, m (a pipe's hydraulic diameter, a fitting's
    /// bore at its position in the flow path); only when `has_bore`.
    pub bore: f64,
    /// Length of a pipe, m; only when `has_length`.
    pub length: f64,
    /// 1 when `bore` applies (not a rise nor a rated drop), else 0.
    pub has_bore: i32,
    /// 1 when `length` applies (pipes), else 0.
    pub has_length: i32,
}
sized!(hg_element_result, band_source_count: usize);

/// A value and its flag: `(value, 1)` when it applies and is finite, else `(0, 0)`.
fn flagged(x: Option<f64>) -> (f64, i32) {
    match x {
        Some(v) if v.is_finite() => (v, 1),
        _ => (0.0, 0),
    }
}

pub(crate) fn totals_to_c(r: &LineResult) -> hg_line_totals {
    let (inlet_pressure, has_pressures) = flagged(r.inlet_pressure);
    hg_line_totals {
        struct_size: std::mem::size_of::<hg_line_totals>(),
        flow: r.flow,
        head_loss: r.head_loss,
        pressure_loss: r.pressure_loss,
        static_head: r.static_head,
        required_head: r.required_head,
        drequired_head_dflow: r.drequired_head_dflow,
        density: r.density,
        inlet_pressure,
        outlet_pressure: r.outlet_pressure.unwrap_or(0.0),
        has_pressures,
        warnings: r.warnings.bits(),
        element_count: r.elements.len(),
        band_source_count: r.head_loss_band.contributions.len(),
        head_loss_low: r.head_loss_band.low,
        head_loss_high: r.head_loss_band.high,
        pressure_loss_low: r.pressure_loss_band.low,
        pressure_loss_high: r.pressure_loss_band.high,
        required_head_low: r.required_head_band.low,
        required_head_high: r.required_head_band.high,
        required_pressure: r.required_pressure,
        band_non_linear: i32::from(r.required_head_band.non_linear),
        band_reserved: 0,
    }
}

pub(crate) fn element_to_c(e: &ElementResult) -> hg_element_result {
    let kind = match e.kind {
        ElementKind::Pipe => HG_ELEMENT_PIPE,
        ElementKind::Fitting => HG_ELEMENT_FITTING,
        ElementKind::Rise => HG_ELEMENT_RISE,
        ElementKind::Equipment => HG_ELEMENT_EQUIPMENT,
        ElementKind::SectionChange => HG_ELEMENT_SECTION_CHANGE,
        ElementKind::Pump => HG_ELEMENT_PUMP,
    };
    let (velocity, has_velocity) = flagged(e.velocity);
    let reynolds = if has_velocity == 1 {
        e.reynolds.unwrap_or(0.0)
    } else {
        0.0
    };
    let (friction_factor, has_friction_factor) = flagged(e.friction_factor);
    let (band_share, has_band_share) = flagged(e.band_share);
    let (k, has_k) = flagged(e.k);
    let (pressure_out, has_pressure) = flagged(e.pressure_out);
    let (bore, has_bore) = flagged(e.bore);
    let (length, has_length) = flagged(e.length);
    let fb = e
        .friction_factor_band
        .as_ref()
        .filter(|_| has_friction_factor == 1);
    hg_element_result {
        struct_size: std::mem::size_of::<hg_element_result>(),
        kind,
        regime: e.regime.map_or(HG_REGIME_NONE, regime_code),
        velocity,
        reynolds,
        friction_factor,
        k,
        head_loss: e.head_loss,
        dhead_dflow: e.dhead_dflow,
        static_head: e.static_head,
        pressure_out,
        warnings: e.warnings.bits(),
        has_pressure,
        head_loss_low: e.head_loss_band.low,
        head_loss_high: e.head_loss_band.high,
        friction_factor_low: fb.map_or(0.0, |b| b.low),
        friction_factor_high: fb.map_or(0.0, |b| b.high),
        has_velocity,
        has_friction_factor,
        has_k,
        reserved: 0,
        band_source_count: e.head_loss_band.contributions.len(),
        count: e.count as usize,
        band_share,
        has_band_share,
        reserved_end: 0,
        elevation_out: e.elevation_out,
        total_pressure_out: e.total_pressure_out.unwrap_or(0.0),
        bore,
        length,
        has_bore,
        has_length,
    }
}

/// Stores a new result handle in `*out` (checked before anything is computed).
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_line_result *`.
pub(crate) unsafe fn give(out: *mut *mut hg_line_result, r: LineResult) -> FfiResult {
    let h = Box::into_raw(Box::new(hg_line_result { result: r }));
    // SAFETY: forwarded contract; `out` was checked by the caller, so this cannot fail
    // and leak `h`.
    unsafe { put("out", out, h) }
}

/// Evaluates `line` for `fluid` at signed volumetric flow `flow` (m³/s; at inlet
/// conditions for a gas) and stores the result in `*out`: a new handle to read with
/// `hg_line_result_totals`, `hg_line_result_element`, `hg_line_result_label` and the
/// band-source accessors, then free with `hg_line_result_free`. The line is evaluated
/// once; reading the result computes nothing.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; `HG_ERR_INVALID` for a line that
/// cannot be built (no elements, a fitting with no bore to refer to);
/// `HG_ERR_NO_SOLUTION` for transitional flow with `HG_TRANSITION_REFUSE`;
/// `HG_ERR_OUT_OF_RANGE` for a gas losing more than 40 % of its inlet pressure;
/// `HG_ERR_NULL_POINTER`. On failure `*out` is left untouched. Thread-safe (the line is
/// only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `out` NULL or a writable
/// `hg_line_result *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_evaluate(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    out: *mut *mut hg_line_result,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let r = l.evaluate(f, flow)?;
        // SAFETY: forwarded contract; checked above.
        unsafe { give(out, r) }
    })
}

/// Evaluates `line` as `hg_line_evaluate`, but with the static pressure at the inlet
/// given for this call: `inlet_pressure` in Pa absolute (> 0), or 0 for none (a gas then
/// starts at its own pressure). The line's own setting (`hg_line_set_inlet_pressure`) is
/// not used and not changed, so threads may evaluate one line at different pressures.
///
/// Returns the codes of `hg_line_evaluate`, and `HG_ERR_NOT_FINITE` or
/// `HG_ERR_OUT_OF_RANGE` for a bad `inlet_pressure`. On failure `*out` is left
/// untouched. Thread-safe (the line is only read).
///
/// # Safety
/// As `hg_line_evaluate`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_evaluate_at(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    inlet_pressure: f64,
    out: *mut *mut hg_line_result,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let inlet = (inlet_pressure != 0.0).then_some(inlet_pressure);
        let r = l.evaluate_at(f, flow, inlet)?;
        // SAFETY: forwarded contract; checked above.
        unsafe { give(out, r) }
    })
}

/// Releases a result. NULL is accepted and ignored.
///
/// # Safety
/// `result` must be NULL or a live handle from `hg_line_evaluate*`, not used afterwards.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_free(result: *mut hg_line_result) {
    if !result.is_null() {
        // SAFETY: the handle came from Box::into_raw in `give`.
        ffi::guard_value((), || drop(unsafe { Box::from_raw(result) }));
    }
}

/// Checks a result handle and borrows the core result.
///
/// # Safety
/// `p` must be NULL or a live handle.
pub(crate) unsafe fn read<'a>(p: *const hg_line_result) -> FfiResult<&'a LineResult> {
    // SAFETY: forwarded contract.
    Ok(&unsafe { ffi::handle("result", p)? }.result)
}

/// The totals of `result` into `*out` (set `out->struct_size` first): flow, losses,
/// heads with their derivative and bands, pressures, warnings and the counts of elements
/// and band sources.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for a `struct_size` too small;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `out` NULL or a writable `hg_line_totals` of
/// `out->struct_size` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_totals(
    result: *const hg_line_result,
    out: *mut hg_line_totals,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let r = unsafe { read(result)? };
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &totals_to_c(r)) }
    })
}

fn element(r: &LineResult, index: usize) -> FfiResult<&ElementResult> {
    r.elements.get(index).ok_or_else(|| {
        ffi::size_out_of_range(
            "index",
            index,
            format!(
                "must be less than {} (the number of elements)",
                r.elements.len()
            ),
        )
    })
}

/// The row of element `index` (0-based, route order) of `result` into `*out` (set
/// `out->struct_size` first).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not less than the number of
/// elements; `HG_ERR_INVALID` for a `struct_size` too small; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `out` NULL or a writable `hg_element_result`
/// of `out->struct_size` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_element(
    result: *const hg_line_result,
    index: usize,
    out: *mut hg_element_result,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let e = element(unsafe { read(result)? }, index)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &element_to_c(e)) }
    })
}

/// Copies the label of element `index` of `result` (the user's, see `hg_line_set_label`,
/// or the default: "pipe 3", "fitting 4", "rise 5", …; "6 × …" for counted fittings) into `buf` (at most `len - 1` bytes and a NUL; `buf` may be NULL
/// when `len` is 0) and stores its full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not an element;
/// `HG_ERR_BUFFER_TOO_SMALL` when the label did not fit (`*needed` and the cut copy are
/// still written); `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `buf` NULL or valid for `len` bytes; `needed`
/// NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_label(
    result: *const hg_line_result,
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("needed", needed)])?;
        // SAFETY: forwarded contract.
        let e = element(unsafe { read(result)? }, index)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_name(&e.label, buf, len, needed) }
    })
}

mod band_source;
pub use band_source::*;

#[cfg(test)]
mod tests;
