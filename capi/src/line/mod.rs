//! Lines: an opaque handle that collects elements in route order, then evaluates.

// Building, then solving, sizing and parallel lines, then results and bands: the order of
// the header's topics.
mod builder;

mod solve;

mod pump;

mod sizing;

mod parallel;

mod result;

mod uncertainty;

pub use builder::*;
pub use parallel::*;
pub use pump::*;
pub use result::*;
pub use sizing::*;
pub use solve::*;
pub use uncertainty::*;

use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::section::{HG_SECTION_CIRCLE, section_of};
use hydrograde::fitting::Fitting;
use hydrograde::friction::Options;
use hydrograde::line::{Element, Equipment, Line, LineBuilder};
use hydrograde::pipe::Pipe;
use std::ffi::c_char;

/// A route of pipes, fittings, rises and equipment in series: opaque. Made by
/// `hg_line_new`, released by `hg_line_free`. Adding elements or changing options needs
/// exclusive use of the handle; evaluating only reads it, so several threads may
/// evaluate one line at once.
pub struct hg_line {
    /// The core's builder: it holds the elements, labels, counts and options, and builds
    /// (and keeps) the checked line on first use after a change.
    pub(crate) builder: LineBuilder,
}

impl hg_line {
    pub(crate) fn push(&mut self, e: Element) {
        self.builder.push(e);
    }

    /// A handle holding an already built line.
    pub(crate) fn from_line(line: Line) -> hg_line {
        hg_line {
            builder: LineBuilder::from_line(line),
        }
    }

    pub(crate) fn line(&self) -> FfiResult<&Line> {
        Ok(self.builder.line()?)
    }
}

/// Checks a line and a fluid handle (in that order) and lends the built line with the
/// fluid: the start of every entry point that computes on a line.
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles.
pub(crate) unsafe fn line_and_fluid<'a>(
    line: *const hg_line,
    fluid: *const crate::fluid::hg_fluid,
) -> FfiResult<(&'a Line, &'a hydrograde::fluid::Fluid)> {
    // SAFETY: forwarded contract.
    let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
    Ok((l.line()?, &f.fluid))
}

/// Makes an empty line with the default options and stores it in `*out`; free it with
/// `hg_line_free`.
///
/// Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_line *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_new(out: *mut *mut hg_line) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        let line = Box::new(hg_line {
            builder: LineBuilder::new(),
        });
        // SAFETY: forwarded contract; checked above.
        unsafe { put("out", out, Box::into_raw(line)) }
    })
}

/// Releases a line. NULL is accepted and ignored.
///
/// # Safety
/// `line` must be NULL or a live handle from `hg_line_new`, used by no other thread and
/// not used afterwards.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_free(line: *mut hg_line) {
    if !line.is_null() {
        // SAFETY: the handle came from Box::into_raw in `hg_line_new`.
        ffi::guard_value((), || drop(unsafe { Box::from_raw(line) }));
    }
}

/// Runs `f` on a line handle that the caller lends exclusively.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
pub(crate) unsafe fn with_line(
    line: *mut hg_line,
    f: impl FnOnce(&mut hg_line) -> FfiResult,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let l = unsafe { ffi::handle_mut("line", line)? };
        f(l)
    })
}

/// Appends a round pipe: inside `diameter` (m, > 0), `length` (m, > 0), absolute wall
/// `roughness` (m, ≥ 0, at most half the diameter).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_pipe(
    line: *mut hg_line,
    diameter: f64,
    length: f64,
    roughness: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let p = Pipe::new(
                section_of(HG_SECTION_CIRCLE, diameter, 0.0)?,
                length,
                roughness,
            )?;
            l.push(Element::Pipe(p));
            Ok(())
        })
    }
}

/// Appends a straight duct of section `shape` (`HG_SECTION_*`, dimensions `a`, `b` as
/// for `hg_section_properties`), `length` (m, > 0) and `roughness` (m, ≥ 0). Fittings
/// beside it refer to its hydraulic diameter.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for
/// b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_duct(
    line: *mut hg_line,
    shape: i32,
    a: f64,
    b: f64,
    length: f64,
    roughness: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let p = Pipe::new(section_of(shape, a, b)?, length, roughness)?;
            l.push(Element::Pipe(p));
            Ok(())
        })
    }
}

/// Appends a straight duct of section `shape` (`HG_SECTION_*`, dimensions `a`, `b` as
/// for `hg_section_properties`) and `length` (m, > 0) whose wall is the catalogue
/// `material` (see `hg_roughness`): its roughness is the material's typical value, and
/// the material's range feeds the roughness uncertainty of the bands (as
/// `hg_line_add_pipe_material` for a round pipe).
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`;
/// `HG_ERR_INVALID` for b ≠ 0 on a one-dimension shape or a name not UTF-8;
/// `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `material` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_duct_material(
    line: *mut hg_line,
    shape: i32,
    a: f64,
    b: f64,
    length: f64,
    material: *const c_char,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let m = ffi::c_str("material", material)?;
            let p = Pipe::of_material(section_of(shape, a, b)?, length, m)?;
            l.push(Element::Pipe(p));
            Ok(())
        })
    }
}

/// A fitting referred to `diameter`, or to the adjoining pipe's bore when it is 0.
pub(crate) fn refer(f: Fitting, diameter: f64) -> FfiResult<Fitting> {
    if diameter == 0.0 {
        Ok(f)
    } else {
        Ok(f.with_diameter(diameter)?)
    }
}

/// Appends the catalogue fitting `name` (see `hg_fitting_catalogue_name`). Its K refers
/// to the velocity in `diameter` (m, > 0), or, when `diameter` is 0, in the bore of the
/// pipe before it (after it when it stands first); a line with no pipe to take it from
/// fails when evaluated (`HG_ERR_INVALID`).
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`
/// for a negative diameter; `HG_ERR_INVALID` (a name not UTF-8, or a diameter given to a
/// fitting whose bore its geometry fixes); `HG_ERR_NULL_POINTER`. Needs exclusive use of
/// `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `name` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_fitting(
    line: *mut hg_line,
    name: *const c_char,
    diameter: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let n = ffi::c_str("name", name)?;
            let f = refer(Fitting::named(n)?, diameter)?;
            l.push(Element::Fitting(f));
            Ok(())
        })
    }
}

/// Appends a fitting of fixed resistance coefficient `k` (≥ 0) on the velocity in
/// `diameter` (m, > 0), or in the adjoining pipe's bore when `diameter` is 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_fitting_k(line: *mut hg_line, k: f64, diameter: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let f = refer(Fitting::k(k)?, diameter)?;
            l.push(Element::Fitting(f));
            Ok(())
        })
    }
}

/// Appends an elevation change `height` (m; positive up in the flow direction, negative
/// for a drop).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_NULL_POINTER`. Needs exclusive use of
/// `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_rise(line: *mut hg_line, height: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            l.push(Element::rise(height)?);
            Ok(())
        })
    }
}

/// Appends rated equipment labelled `name` with a pressure drop `drop` (Pa, > 0) at the
/// rating flow `at_flow` (m³/s, > 0), scaled with Q·|Q| at other flows (fixed K).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
/// label not UTF-8; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `name` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_equipment(
    line: *mut hg_line,
    name: *const c_char,
    drop: f64,
    at_flow: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let n = ffi::c_str("name", name)?;
            l.push(Element::Equipment(Equipment::pressure_drop(
                n, drop, at_flow,
            )?));
            Ok(())
        })
    }
}

/// Sets the friction options of every pipe of the line (correlation, regime limits and
/// transition; the laminar constant is each section's own). See `hg_darcy_factor_opts`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for a
/// `struct_size` too small; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `opts` NULL or a
/// readable `hg_friction_options`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_friction_options(
    line: *mut hg_line,
    opts: *const crate::friction::hg_friction_options,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let o: Options = crate::friction::read_options("opts", opts)?;
            Ok(l.builder.set_friction(o)?)
        })
    }
}

/// Sets the static pressure at the line's inlet (Pa absolute, > 0), which enables the
/// outlet pressures and the cavitation and gas checks. 0 clears it.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_inlet_pressure(line: *mut hg_line, pressure: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let p = if pressure == 0.0 {
                None
            } else {
                Some(pressure)
            };
            Ok(l.builder.set_inlet_pressure(p)?)
        })
    }
}

/// The number of elements of the line in `*count`.
///
/// Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe for concurrent readers.
///
/// # Safety
/// `line` must be NULL or a live handle; `count` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_count(line: *const hg_line, count: *mut usize) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("count", count)])?;
        // SAFETY: forwarded contract.
        let l = unsafe { ffi::handle("line", line)? };
        // SAFETY: forwarded contract; checked above.
        unsafe { put("count", count, l.builder.len()) }
    })
}
