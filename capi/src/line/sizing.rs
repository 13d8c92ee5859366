//! Sizing the round pipes of a line to a limit, optionally to a standard table.

use crate::ffi::sized;
use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::hg_line;
use hydrograde::line::{Limit, Resize, SizeChoice};
use hydrograde::sizes::PipeTable;
use std::ffi::c_char;

/// Sizing limit: the line's pressure loss (friction + minor, without rises), Pa.
pub const HG_LIMIT_PRESSURE_LOSS: i32 = 0;
/// Sizing limit: the mean velocity in the round pipes, m/s.
pub const HG_LIMIT_VELOCITY: i32 = 1;

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
/// and at the band's unfavourable end. The result goes to `*out`. Every trial resizes as
/// `hg_line_with_uniform_diameter` does (reducers between equal bores removed, fittings
/// with a stated bore following, equipment with a fixed bore refused).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a zero flow, a limit
/// ≤ 0 or an unknown `limit`; `HG_ERR_UNKNOWN_NAME` for a table or schedule;
/// `HG_ERR_INVALID` for a line without round pipes, equipment with a fixed bore or a
/// `struct_size` too small; `HG_ERR_NO_SOLUTION` when no bore up to 20 m or no standard
/// size meets the limit; `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
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
    // SAFETY: forwarded contract.
    guard(|| unsafe {
        size_scoped(
            line,
            fluid,
            (flow, limit, limit_value),
            (table, schedule),
            None,
            std::ptr::null(),
            out,
        )
    })
}

/// As `hg_line_size`, resizing only the elements `start` … `end − 1` of `line` (indices as
/// `hg_line_count` counts them, `end` excluded); with `material` (a catalogue name as
/// `hg_line_add_pipe_material`, or NULL to keep each pipe's own roughness) the resized
/// pipes are of that material, with its roughness. The limit applies to the whole line.
/// Transitions at the section's borders are rebuilt from the bores that meet there (see
/// `hg_line_with_diameter_in`).
///
/// Returns as `hg_line_size`; also `HG_ERR_OUT_OF_RANGE` for a section past the line's
/// end or empty, `HG_ERR_INVALID` for a section without a round pipe,
/// `HG_ERR_UNKNOWN_NAME` for `material`. Thread-safe (the line is only read).
///
/// # Safety
/// As `hg_line_size`; `material` NULL or NUL-terminated.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_line_size_in(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    limit: i32,
    limit_value: f64,
    table: *const c_char,
    schedule: *const c_char,
    start: usize,
    end: usize,
    material: *const c_char,
    out: *mut hg_sizing,
) -> i32 {
    // SAFETY: forwarded contract.
    guard(|| unsafe {
        size_scoped(
            line,
            fluid,
            (flow, limit, limit_value),
            (table, schedule),
            Some((start, end)),
            material,
            out,
        )
    })
}

/// The scope of a resize: a section (or the whole line) and an optional material.
///
/// # Safety
/// `material` NULL or NUL-terminated.
unsafe fn scope(section: Option<(usize, usize)>, material: *const c_char) -> FfiResult<Resize> {
    Ok(Resize {
        section,
        material: if material.is_null() {
            None
        } else {
            // SAFETY: forwarded contract.
            Some(unsafe { ffi::c_str("material", material)? }.to_string())
        },
    })
}

/// The body of `hg_line_size` and `hg_line_size_in`.
///
/// # Safety
/// As `hg_line_size_in`.
unsafe fn size_scoped(
    line: *const hg_line,
    fluid: *const hg_fluid,
    (flow, limit, limit_value): (f64, i32, f64),
    (table, schedule): (*const c_char, *const c_char),
    section: Option<(usize, usize)>,
    material: *const c_char,
    out: *mut hg_sizing,
) -> FfiResult<()> {
    // SAFETY: forwarded contract.
    unsafe { ffi::check_sized_out("out", out)? };
    // SAFETY: forwarded contract.
    let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
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
    // SAFETY: forwarded contract.
    let scope = unsafe { scope(section, material)? };
    let sz = l.size_in(f, flow, lim, std_table, &scope)?;
    let c = hg_sizing {
        struct_size: std::mem::size_of::<hg_sizing>(),
        min_inside_diameter: sz.min_inside_diameter,
        standard: choice_to_c(sz.standard.as_ref())?,
        standard_at_band: choice_to_c(sz.standard_at_band.as_ref())?,
    };
    // SAFETY: forwarded contract.
    unsafe { ffi::write_sized("out", out, &c) }
}

/// Makes a new line, stored in `*out`, equal to `line` with the round pipes of elements
/// `start` … `end − 1` set to inside `diameter` (m, > 0), of `material` when not NULL (a
/// catalogue name; NULL keeps each pipe's roughness). Fittings in the section with a
/// stated bore take the new bore; a contraction or expansion next to a resized pipe is
/// rebuilt from the bores that now meet there and removed when they are equal (the new
/// line then has fewer elements); a section border where the new bore meets another with
/// no transition element is counted as an abrupt change with its warning. Equipment with
/// a fixed bore in the section refuses, the message naming its index and label. Free the
/// line with `hg_line_free`; `line` is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for `diameter` ≤ 0 or a
/// section past the end or empty; `HG_ERR_INVALID` for a section without a round pipe or
/// with fixed-bore equipment; `HG_ERR_UNKNOWN_NAME` for `material`;
/// `HG_ERR_NULL_POINTER`. Thread-safe (`line` is only read).
///
/// # Safety
/// `line` must be NULL or a live handle; `material` NULL or NUL-terminated; `out` NULL or
/// a writable `hg_line *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_with_diameter_in(
    line: *const hg_line,
    diameter: f64,
    start: usize,
    end: usize,
    material: *const c_char,
    out: *mut *mut hg_line,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let l = unsafe { ffi::handle("line", line)? };
        // SAFETY: forwarded contract.
        let scope = unsafe { scope(Some((start, end)), material)? };
        let new = l.line()?.with_diameter_in(diameter, &scope)?;
        let handle = Box::new(hg_line::from_line(new));
        // SAFETY: forwarded contract; checked above.
        unsafe { put("out", out, Box::into_raw(handle)) }
    })
}
