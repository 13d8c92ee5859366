//! Evaluating a line: totals, per-element results, the inverse solve and the system curve.

use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::friction::regime_code;
use crate::line::{hg_line, sized};
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
/// with no contraction or expansion element (its own row, with
/// `HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION`).
pub const HG_ELEMENT_SECTION_CHANGE: i32 = 4;

/// A line evaluated at one flow. Set `struct_size` to `sizeof(hg_line_result)` before the
/// call; fields added in later versions go after the existing ones, so an old caller's
/// smaller struct keeps working. Heads are in m of the flowing fluid. The `*_low` and
/// `*_high` fields bound the expanded uncertainty (coverage factor k = 2).
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_line_result {
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
    /// Static pressure at the inlet, Pa absolute (0 when `has_pressures` is 0).
    pub inlet_pressure: f64,
    /// Static pressure at the outlet, Pa absolute (0 when `has_pressures` is 0).
    pub outlet_pressure: f64,
    /// 1 when the inlet pressure is known (set, or the gas's own), else 0.
    pub has_pressures: i32,
    /// Warning bits of the whole line, `HG_WARN_*`.
    pub warnings: u32,
    /// Number of elements (results by index through `hg_line_element`).
    pub element_count: usize,
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
}
sized!(hg_line_result);

/// One element's share of a line evaluated at one flow. Set `struct_size` to
/// `sizeof(hg_element_result)` before the call. Quantities an element does not have
/// (a rise's velocity, a fitting's friction factor) are 0; the flags `has_velocity`
/// (velocity and Reynolds number), `regime` = -1 (friction factor) and `has_pressure`
/// tell a true 0 from one that does not apply.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_element_result {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// What the element is, `HG_ELEMENT_*`.
    pub kind: i32,
    /// Flow regime of a pipe, `HG_REGIME_*`; -1 for other elements.
    pub regime: i32,
    /// Mean velocity in the element's bore, m/s (signed).
    pub velocity: f64,
    /// Reynolds number in that bore.
    pub reynolds: f64,
    /// Darcy friction factor (pipes).
    pub friction_factor: f64,
    /// Resistance coefficient K at this Reynolds number (fittings, fixed-K equipment).
    pub k: f64,
    /// Head loss, m (signed with the flow; 0 for rises).
    pub head_loss: f64,
    /// d(head loss)/dQ, s/m².
    pub dhead_dflow: f64,
    /// Elevation change, m (rises).
    pub static_head: f64,
    /// Static pressure at the element's outlet, Pa absolute (0 without an inlet pressure).
    pub pressure_out: f64,
    /// Warning bits of this element, `HG_WARN_*`.
    pub warnings: u32,
    /// 1 when `pressure_out` is known, else 0.
    pub has_pressure: i32,
    /// Lower end of the head-loss band, m.
    pub head_loss_low: f64,
    /// Upper end of the head-loss band, m.
    pub head_loss_high: f64,
    /// Lower end of the friction-factor band (pipes; else 0).
    pub friction_factor_low: f64,
    /// Upper end of the friction-factor band (pipes; else 0).
    pub friction_factor_high: f64,
    /// 1 when the element has a bore of its own, so `velocity` and `reynolds` apply;
    /// 0 for rises and rated pressure drops (both then 0).
    pub has_velocity: i32,
    /// Index of the line element this row stands for (as added to the line); -1 for an
    /// abrupt change of section the route implies (`HG_ELEMENT_SECTION_CHANGE`).
    pub element: i32,
}
sized!(hg_element_result);

/// The core marks absent quantities with NaN or `None`; C callers get 0 (documented).
fn or0(x: f64) -> f64 {
    if x.is_finite() { x } else { 0.0 }
}

pub(crate) fn line_to_c(r: &LineResult) -> hg_line_result {
    hg_line_result {
        struct_size: std::mem::size_of::<hg_line_result>(),
        flow: r.flow,
        head_loss: r.head_loss,
        pressure_loss: r.pressure_loss,
        static_head: r.static_head,
        required_head: r.required_head,
        drequired_head_dflow: r.drequired_head_dflow,
        density: r.density,
        inlet_pressure: r.inlet_pressure.unwrap_or(0.0),
        outlet_pressure: r.outlet_pressure.unwrap_or(0.0),
        has_pressures: i32::from(r.inlet_pressure.is_some()),
        warnings: r.warnings.bits(),
        element_count: r.elements.len(),
        head_loss_low: r.head_loss_band.low,
        head_loss_high: r.head_loss_band.high,
        pressure_loss_low: r.pressure_loss_band.low,
        pressure_loss_high: r.pressure_loss_band.high,
        required_head_low: r.required_head_band.low,
        required_head_high: r.required_head_band.high,
    }
}

fn element_to_c(e: &ElementResult) -> hg_element_result {
    let kind = match e.kind {
        ElementKind::Pipe => HG_ELEMENT_PIPE,
        ElementKind::Fitting => HG_ELEMENT_FITTING,
        ElementKind::Rise => HG_ELEMENT_RISE,
        ElementKind::Equipment => HG_ELEMENT_EQUIPMENT,
        ElementKind::SectionChange => HG_ELEMENT_SECTION_CHANGE,
    };
    let fb = e.friction_factor_band.as_ref();
    hg_element_result {
        struct_size: std::mem::size_of::<hg_element_result>(),
        kind,
        regime: e.regime.map_or(-1, regime_code),
        velocity: e.velocity.map_or(0.0, or0),
        reynolds: e.reynolds.map_or(0.0, or0),
        friction_factor: or0(e.friction_factor.unwrap_or(0.0)),
        k: or0(e.k.unwrap_or(0.0)),
        head_loss: e.head_loss,
        dhead_dflow: e.dhead_dflow,
        static_head: e.static_head,
        pressure_out: e.pressure_out.unwrap_or(0.0),
        warnings: e.warnings.bits(),
        has_pressure: i32::from(e.pressure_out.is_some()),
        head_loss_low: e.head_loss_band.low,
        head_loss_high: e.head_loss_band.high,
        friction_factor_low: or0(fb.map_or(0.0, |b| b.low)),
        friction_factor_high: or0(fb.map_or(0.0, |b| b.high)),
        has_velocity: i32::from(e.velocity.is_some()),
        element: e.element.and_then(|i| i32::try_from(i).ok()).unwrap_or(-1),
    }
}

/// Evaluates a line for a fluid at a flow (shared by the entry points).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles.
unsafe fn evaluate(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
) -> FfiResult<LineResult> {
    // SAFETY: forwarded contract.
    let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
    Ok(l.line()?.evaluate(&f.fluid, flow)?)
}

/// Evaluates `line` for `fluid` at signed volumetric flow `flow` (m³/s; at inlet
/// conditions for a gas) into `*out`: head loss, pressure loss, static and required
/// head with its derivative, pressures, warnings and uncertainty bands.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; `HG_ERR_INVALID` for a line that
/// cannot be built (no elements, a fitting with no bore to refer to) or a `struct_size`
/// too small; `HG_ERR_NO_SOLUTION` for transitional flow with `HG_TRANSITION_REFUSE`;
/// `HG_ERR_OUT_OF_RANGE` for a gas losing more than 40 % of its inlet pressure;
/// `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `out` NULL or a writable
/// `hg_line_result` of `out->struct_size` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_evaluate(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    out: *mut hg_line_result,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let r = unsafe { evaluate(line, fluid, flow)? };
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &line_to_c(&r)) }
    })
}

/// The result of element `index` (0-based, route order) of `line` evaluated for `fluid`
/// at `flow` (m³/s), into `*out` (set `out->struct_size` first).
///
/// Returns as `hg_line_evaluate`, and `HG_ERR_OUT_OF_RANGE` when `index` is not less
/// than the number of elements. Thread-safe (the line is only read).
///
/// # Safety
/// As `hg_line_evaluate`, with `out` a writable `hg_element_result`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_element(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    index: usize,
    out: *mut hg_element_result,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let r = unsafe { evaluate(line, fluid, flow)? };
        let e = element(&r.elements, index)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &element_to_c(e)) }
    })
}

pub(crate) fn element(list: &[ElementResult], index: usize) -> FfiResult<&ElementResult> {
    list.get(index).ok_or_else(|| {
        hydrograde::Error::out_of_range(
            "index",
            index as f64,
            format!("must be less than {} (the number of elements)", list.len()),
        )
        .into()
    })
}

/// Copies the label of element `index` ("pipe", "rise", the fitting's or equipment's
/// name) into `buf` (at most `len - 1` bytes and a NUL) and stores its full length in
/// `*needed`. The label does not depend on the flow, which is needed only to build the
/// result: pass any finite flow.
///
/// Returns as `hg_line_element`, and `HG_ERR_BUFFER_TOO_SMALL` when the label did not fit
/// (the cut copy is still written). Thread-safe (the line is only read).
///
/// # Safety
/// As `hg_line_evaluate`; `buf` NULL or valid for `len` bytes; `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_element_label(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("needed", needed)])?;
        // SAFETY: forwarded contract.
        let r = unsafe { evaluate(line, fluid, flow)? };
        let e = element(&r.elements, index)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_name(&e.label, buf, len, needed) }
    })
}

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

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ffi::HG_OK;
    use crate::fluid::{hg_fluid_free, hg_fluid_water};
    use crate::line::*;
    use hydrograde::fitting::Fitting;
    use hydrograde::fluid::Fluid;
    use hydrograde::line::{Element, Line};
    use hydrograde::pipe::Pipe;

    #[test]
    fn a_line_built_through_c_equals_the_core_line() {
        let mut l: *mut hg_line = std::ptr::null_mut();
        let mut f: *mut hg_fluid = std::ptr::null_mut();
        // SAFETY: valid out-pointers and live handles throughout; freed at the end.
        unsafe {
            assert_eq!(hg_line_new(&mut l), HG_OK);
            assert_eq!(hg_fluid_water(293.15, 2e5, &mut f), HG_OK);
            assert_eq!(hg_line_add_pipe(l, 0.05, 30.0, 4.5e-5), HG_OK);
            assert_eq!(hg_line_add_fitting(l, c"gate_valve".as_ptr(), 0.0), HG_OK);
            assert_eq!(hg_line_add_rise(l, 4.0), HG_OK);
        }
        let core = Line::new(vec![
            Element::Pipe(Pipe::circular(0.05, 30.0, 4.5e-5).unwrap()),
            Element::Fitting(Fitting::named("gate_valve").unwrap()),
            Element::rise(4.0).unwrap(),
        ])
        .unwrap();
        let water = Fluid::water(293.15, 2e5).unwrap();
        for q in [0.0, 1e-5, 3e-3, -3e-3] {
            let want = core.evaluate(&water, q).unwrap();
            let mut got = line_to_c(&want);
            got.head_loss = -1.0;
            // SAFETY: live handles, valid out-pointer.
            assert_eq!(unsafe { hg_line_evaluate(l, f, q, &mut got) }, HG_OK);
            assert_eq!(got, line_to_c(&want));
            let mut e = element_to_c(&want.elements[0]);
            e.k = -1.0;
            // SAFETY: live handles, valid out-pointer.
            assert_eq!(unsafe { hg_line_element(l, f, q, 1, &mut e) }, HG_OK);
            assert_eq!(e, element_to_c(&want.elements[1]));
        }
        // SAFETY: handles from the constructors above, not used afterwards.
        unsafe {
            hg_line_free(l);
            hg_fluid_free(f);
        }
    }

    #[test]
    fn element_kinds_follow_the_core() {
        for (k, c) in [
            (ElementKind::Pipe, HG_ELEMENT_PIPE),
            (ElementKind::Fitting, HG_ELEMENT_FITTING),
            (ElementKind::Rise, HG_ELEMENT_RISE),
            (ElementKind::Equipment, HG_ELEMENT_EQUIPMENT),
            (ElementKind::SectionChange, HG_ELEMENT_SECTION_CHANGE),
        ] {
            assert_eq!(
                ["pipe", "fitting", "rise", "equipment", "section_change"][c as usize],
                k.name()
            );
        }
    }
}
