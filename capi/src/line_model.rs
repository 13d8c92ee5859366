//! What a line means beyond its elements: the air around it and the direction flow may
//! take through it, and the NPSH available along an evaluated line.

use crate::ffi::{self, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::{hg_line, hg_line_result, read, with_line};
use hydrograde::line::{Element, Equipment};
use std::ffi::c_char;

/// Sets the air around `line` to `surroundings` (a gas handle, copied), or back to the
/// default dry air at 20 °C and 101 325 Pa when `surroundings` is NULL. A rise in a gas
/// line then adds (ρ − ρ_surroundings)·g·Δz of pressure (the stack effect); a liquid line
/// neglects the air column unless `hg_line_set_air_column_for_liquids` turns it on.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` when `surroundings` is a liquid;
/// `HG_ERR_NULL_POINTER` for `line`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `surroundings` NULL or a
/// live fluid handle.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_surroundings(
    line: *mut hg_line,
    surroundings: *const hg_fluid,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let air = if surroundings.is_null() {
                None
            } else {
                Some(ffi::handle("surroundings", surroundings)?.fluid.clone())
            };
            Ok(l.builder.set_surroundings(air)?)
        })
    }
}

/// Counts the surrounding air column for a liquid line too (`on` = 1) or neglects it (0,
/// the default: for water it changes a rise's head by about 0.12 %).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for `on` other than 0 or 1;
/// `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_air_column_for_liquids(line: *mut hg_line, on: i32) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            if on != 0 && on != 1 {
                return Err(
                    hydrograde::Error::out_of_range("on", f64::from(on), "must be 0 or 1").into(),
                );
            }
            l.builder.set_air_column_for_liquids(on == 1);
            Ok(())
        })
    }
}

/// Writes 1 to `*blocks` when some element of `line` stops reverse flow (a check or foot
/// valve), else 0. Every call that takes a flow refuses a reverse flow through such a
/// line with `HG_ERR_NO_SOLUTION` and a message naming the valve.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for a line that cannot be built;
/// `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
///
/// # Safety
/// `line` must be NULL or a live handle; `blocks` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_blocks_reverse_flow(
    line: *const hg_line,
    blocks: *mut i32,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("blocks", blocks)])?;
        // SAFETY: forwarded contract.
        let l = unsafe { ffi::handle("line", line)? };
        let b = l.line()?.blocks_reverse_flow();
        // SAFETY: forwarded contract; checked above.
        unsafe { put("blocks", blocks, i32::from(b)) }
    })
}

/// Writes the NPSH available (m) at the outlet of row `index` (0-based, route order) of
/// `result` to `*npsh`: the total pressure there over the vapour pressure in metres of
/// the liquid, NPSHa = (p + ½ρV² − p_v)/(ρ g) (definition, e.g. ISO 9906).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not a row of the result;
/// `HG_ERR_INVALID` when the line was evaluated without an inlet pressure or the fluid
/// has no vapour pressure (a gas, or a liquid stated without one); `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `npsh` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_npsh_available(
    result: *const hg_line_result,
    index: usize,
    npsh: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("npsh", npsh)])?;
        // SAFETY: forwarded contract.
        let r = unsafe { read(result)? };
        let available = r.npsh_available(index)?;
        // SAFETY: forwarded contract; checked above.
        unsafe { put("npsh", npsh, available) }
    })
}

/// Checks the NPSH available at the outlet of row `index` of `result` against
/// `required` (m, ≥ 0, the pump maker's NPSH required) plus `margin` (m, ≥ 0): writes the
/// NPSH available (m) to `*available` and 1 to `*sufficient` when available ≥ required +
/// margin, else 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` or `HG_ERR_OUT_OF_RANGE` for a bad `required` or
/// `margin`; otherwise as `hg_line_result_npsh_available`. Nothing is written on error.
/// Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `available` and `sufficient` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_npsh_check(
    result: *const hg_line_result,
    index: usize,
    required: f64,
    margin: f64,
    available: *mut f64,
    sufficient: *mut i32,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("available", available),
            out_ptr("sufficient", sufficient),
        ])?;
        // SAFETY: forwarded contract.
        let r = unsafe { read(result)? };
        let c = r.npsh_check(index, required, margin)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("available", available, c.available)?;
            put("sufficient", sufficient, i32::from(c.sufficient))
        }
    })
}

/// Writes the number of messages of `result` to `*count`: each says in words what a
/// warning found (the element, the values, and for a likely unit slip the value in the
/// unit probably meant).
///
/// Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `count` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_message_count(
    result: *const hg_line_result,
    count: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("count", count)])?;
        // SAFETY: forwarded contract.
        let r = unsafe { read(result)? };
        // SAFETY: forwarded contract; checked above.
        unsafe { put("count", count, r.messages.len()) }
    })
}

/// Copies message `index` (0-based, see `hg_line_result_message_count`) of `result` into
/// `buf` (at most `len - 1` bytes and a NUL, UTF-8; `buf` may be NULL when `len` is 0) and
/// stores its full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is not a message;
/// `HG_ERR_BUFFER_TOO_SMALL` when the message did not fit (`*needed` and the cut copy are
/// still written); `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `result` must be NULL or a live handle; `buf` NULL or valid for `len` bytes; `needed`
/// NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_result_message(
    result: *const hg_line_result,
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("needed", needed)])?;
        // SAFETY: forwarded contract.
        let r = unsafe { read(result)? };
        let m = r.messages.get(index).ok_or_else(|| {
            ffi::size_out_of_range(
                "index",
                index,
                format!(
                    "must be less than {} (the number of messages)",
                    r.messages.len()
                ),
            )
        })?;
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_name(m, buf, len, needed) }
    })
}

/// Appends rated equipment labelled `name` with a pressure drop `drop` (Pa, > 0) at the
/// rating flow `at_flow` (m³/s, > 0) of a fluid of density `rating_density` (kg/m³, > 0):
/// in the line's fluid of density ρ the drop is drop · (ρ/ρ_rating) · Q|Q|/Q_rating².
/// `hg_line_add_equipment` rates with water at 20 °C.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
/// label not UTF-8; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `name` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_equipment_rated(
    line: *mut hg_line,
    name: *const c_char,
    drop: f64,
    at_flow: f64,
    rating_density: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let n = ffi::c_str("name", name)?;
            let e =
                Equipment::pressure_drop(n, drop, at_flow)?.with_rating_density(rating_density)?;
            l.push(Element::Equipment(e));
            Ok(())
        })
    }
}

/// Sets the pressure the line must deliver at its end, Pa above the pressure at its start
/// (a spray header, a burner, a process inlet), counted in the required head as
/// p_end/(ρ g); 0 asks for none (the default).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_NULL_POINTER`. Needs exclusive use of
/// `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_end_pressure(line: *mut hg_line, pressure: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            Ok(l.builder
                .set_end_pressure((pressure != 0.0).then_some(pressure))?)
        })
    }
}
