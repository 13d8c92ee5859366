//! More elements and options for lines: every fitting method, pipes of catalogue
//! materials, custom ducts, roughness ranges, K spreads, the turbulent diameter and the
//! uncertainty sources.

use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::line::{hg_line, refer, with_line};
use crate::section::{HG_SECTION_CIRCLE, section_of};
use hydrograde::fitting::{Edge, Fitting};
use hydrograde::line::Element;
use hydrograde::pipe::Pipe;
use hydrograde::section::{Section, TurbulentDiameter};
use std::ffi::c_char;

/// Inlet from a tank through a square (sharp-edged) pipe end, K = 0.5 (`r_over_d` must be 0).
pub const HG_EDGE_SQUARE: i32 = 0;
/// Inlet from a tank through a pipe end rounded with radius `r_over_d` times the bore.
pub const HG_EDGE_ROUNDED: i32 = 1;
/// Inlet from a tank through a pipe end projecting into it (re-entrant entrance), K = 0.78
/// (`r_over_d` must be 0).
pub const HG_EDGE_REENTRANT: i32 = 2;

/// Turbulent flow in non-circular ducts on the hydraulic diameter (default).
pub const HG_TURBULENT_DIAMETER_HYDRAULIC: i32 = 0;
/// Turbulent flow in rectangles and annuli on the laminar-equivalent diameter (Jones
/// 1976; Jones & Leung 1981).
pub const HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT: i32 = 1;

/// Pushes an element built by `make` onto a line.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
unsafe fn add(line: *mut hg_line, make: impl FnOnce() -> FfiResult<Element>) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let e = make()?;
            l.push(e);
            Ok(())
        })
    }
}

/// Appends a round pipe of the catalogue wall `material` (see `hg_roughness`): inside
/// `diameter` (m, > 0), `length` (m, > 0); its roughness is the material's typical
/// value, and the material's range feeds the roughness uncertainty of the bands.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`;
/// `HG_ERR_INVALID` for a name not UTF-8; `HG_ERR_NULL_POINTER`. Needs exclusive use
/// of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `material` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_pipe_material(
    line: *mut hg_line,
    diameter: f64,
    length: f64,
    material: *const c_char,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            let m = ffi::c_str("material", material)?;
            let s = section_of(HG_SECTION_CIRCLE, diameter, 0.0)?;
            Ok(Element::Pipe(Pipe::of_material(s, length, m)?))
        })
    }
}

/// Appends a duct of any shape given by its `area` (m², positive), wetted `perimeter`
/// (m, at least the circle's of that area) and `laminar_constant` (f·Re on the
/// hydraulic diameter, positive), with `length` (m, positive) and `roughness` (m, ≥ 0).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_custom_duct(
    line: *mut hg_line,
    area: f64,
    perimeter: f64,
    laminar_constant: f64,
    length: f64,
    roughness: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            let s = Section::custom(area, perimeter, laminar_constant)?;
            Ok(Element::Pipe(Pipe::new(s, length, roughness)?))
        })
    }
}

/// Appends a sudden expansion from bore `d_in` to bore `d_out` (m, 0 < d_in ≤ d_out):
/// Borda–Carnot, K on the inlet velocity.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_expansion(line: *mut hg_line, d_in: f64, d_out: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(Fitting::expansion(d_in, d_out)?))
        })
    }
}

/// Appends a sudden contraction from bore `d_in` to bore `d_out` (m, 0 < d_out ≤ d_in),
/// K on the outlet velocity.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_contraction(line: *mut hg_line, d_in: f64, d_out: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(Fitting::contraction(d_in, d_out)?))
        })
    }
}

/// Appends a 2-K fitting (Hooper 1981): K = k1/Re + k_inf·(1 + 1/D_in), D_in the bore in
/// inches; `k1`, `k_inf` ≥ 0; K on `diameter` (m) or the adjoining pipe's bore when 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_two_k(
    line: *mut hg_line,
    k1: f64,
    k_inf: f64,
    diameter: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(refer(
                Fitting::two_k(k1, k_inf)?,
                diameter,
            )?))
        })
    }
}

/// Appends a 3-K fitting (Darby 1999): K = k1/Re + k_inf·(1 + k_d/D_in^0.3), D_in the
/// bore in inches; constants ≥ 0; K on `diameter` (m) or the adjoining pipe's bore
/// when 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_three_k(
    line: *mut hg_line,
    k1: f64,
    k_inf: f64,
    k_d: f64,
    diameter: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(refer(
                Fitting::three_k(k1, k_inf, k_d)?,
                diameter,
            )?))
        })
    }
}

/// Appends a valve of flow coefficient `cv` (US gpm at 1 psi, > 0), whose K refers to
/// `diameter` (m) or the adjoining pipe's bore when 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_cv(line: *mut hg_line, cv: f64, diameter: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(refer(Fitting::cv(cv)?, diameter)?))
        })
    }
}

/// Appends a valve of flow coefficient `kv` (m³/h at 1 bar, > 0), whose K refers to
/// `diameter` (m) or the adjoining pipe's bore when 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_kv(line: *mut hg_line, kv: f64, diameter: f64) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(refer(Fitting::kv(kv)?, diameter)?))
        })
    }
}

/// Appends a fitting given as an equivalent length `l_over_d` (L/D, ≥ 0): K = f_T·L/D
/// with the fully rough factor of the adjoining pipe; on `diameter` (m) or the
/// adjoining pipe's bore when 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_equivalent_length(
    line: *mut hg_line,
    l_over_d: f64,
    diameter: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(refer(
                Fitting::equivalent_length(l_over_d)?,
                diameter,
            )?))
        })
    }
}

/// Appends a smooth bend of `angle_deg` degrees (0…180) and centreline radius `r_over_d`
/// times the bore (≥ 0.5), Rennels & Hudson (2012); on `diameter` (m) or the adjoining
/// pipe's bore when 0.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_bend(
    line: *mut hg_line,
    angle_deg: f64,
    r_over_d: f64,
    diameter: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            Ok(Element::Fitting(refer(
                Fitting::bend(angle_deg, r_over_d)?,
                diameter,
            )?))
        })
    }
}

/// Appends an inlet from a tank through a pipe end with edge `edge` (`HG_EDGE_*`):
/// square (sharp-edged entrance, K = 0.5), rounded (K from `r_over_d`, the rounding radius
/// over the bore, ≥ 0) or re-entrant (K = 0.78). `r_over_d` must be 0 unless the edge is
/// rounded. A line that starts with one starts at the tank's surface; reverse flow turns
/// it into an outlet into the tank.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad edge or radius;
/// `HG_ERR_INVALID` for a radius with another edge; `HG_ERR_NULL_POINTER`. Needs
/// exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_from_tank(
    line: *mut hg_line,
    edge: i32,
    r_over_d: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        add(line, || {
            let name = usize::try_from(edge)
                .ok()
                .and_then(|i| Edge::NAMES.get(i))
                .ok_or_else(|| ffi::bad_constant("edge", edge, "HG_EDGE_*", Edge::NAMES.len()))?;
            // C has no "absent": a radius of 0 stands for none except on a rounded edge.
            let radius = (edge == HG_EDGE_ROUNDED || r_over_d != 0.0).then_some(r_over_d);
            Ok(Element::Fitting(Fitting::from_tank(Edge::named(
                name, radius,
            )?)?))
        })
    }
}

/// Appends an outlet into a large tank (K = 1 on the pipe's velocity); reverse flow turns
/// it into a square-edged inlet from the tank.
///
/// Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_add_into_tank(line: *mut hg_line) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { add(line, || Ok(Element::Fitting(Fitting::into_tank()))) }
}

/// Sets the relative half-width `spread` (0…1, e.g. 0.3 for ±30 %) of the K of the
/// fitting at `index` (0-based), read by the bands as a rectangular distribution.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad spread or an
/// index that is not a fitting; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_k_spread(
    line: *mut hg_line,
    index: usize,
    spread: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { with_line(line, |l| Ok(l.builder.set_k_spread(index, spread)?)) }
}

/// States the likely range `low`…`high` (m, 0 ≤ low ≤ high) of the roughness of the pipe
/// at `index` (0-based), for the roughness uncertainty of the bands (log-uniform between
/// the two). Checked at once: an index that is not a pipe gives `HG_ERR_OUT_OF_RANGE`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_roughness_range(
    line: *mut hg_line,
    index: usize,
    low: f64,
    high: f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            Ok(l.builder.set_roughness_range(index, low, high)?)
        })
    }
}

/// The core's turbulent diameter of an `HG_TURBULENT_DIAMETER_*` value.
pub(crate) fn turbulent_mode(mode: i32) -> FfiResult<TurbulentDiameter> {
    match mode {
        HG_TURBULENT_DIAMETER_HYDRAULIC => Ok(TurbulentDiameter::Hydraulic),
        HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT => Ok(TurbulentDiameter::LaminarEquivalent),
        _ => Err(ffi::bad_constant(
            "mode",
            mode,
            "HG_TURBULENT_DIAMETER_*",
            2,
        )),
    }
}

/// Chooses the diameter turbulent flow in non-circular ducts uses (`HG_TURBULENT_DIAMETER_*`).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an unknown mode; `HG_ERR_NULL_POINTER`.
/// Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_turbulent_diameter(line: *mut hg_line, mode: i32) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            l.builder.set_turbulent_diameter(turbulent_mode(mode)?);
            Ok(())
        })
    }
}

/// Sets the label of element `index` (0-based) to `label` (UTF-8, 1 to 120 characters,
/// one line), shown in its result row (`hg_line_result_label`); NULL gives back the
/// default label: kind and index, such as "pipe 3", "fitting 4", "rise 5", a fitting's
/// catalogue or method name and index, or an equipment's name. A count above 1 shows as
/// "6 × …" before either.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index that is not an element;
/// `HG_ERR_INVALID` for a label empty, too long, with a control character or not UTF-8;
/// `HG_ERR_NULL_POINTER` for `line`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `label` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_label(
    line: *mut hg_line,
    index: usize,
    label: *const c_char,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let text = if label.is_null() {
                None
            } else {
                Some(ffi::c_str("label", label)?)
            };
            Ok(l.builder.set_label(index, text)?)
        })
    }
}

/// Makes the fitting at `index` (0-based) stand for `count` identical fittings (1 to
/// 10000): one result row with `count` times the fitting's K, so `count`·K·V²/(2g) of
/// head loss, and one shared K error (its band is `count` times one fitting's).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for a count out of range or an index that is
/// not an element; `HG_ERR_INVALID` for a count above 1 on an element that is not a
/// fitting; `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_count(line: *mut hg_line, index: usize, count: u32) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { with_line(line, |l| Ok(l.builder.set_count(index, count)?)) }
}

/// Makes a new line, stored in `*out`, of the elements `start` to `end - 1` of `line`
/// (0-based, `start < end ≤` the element count) with their labels, counts and roughness
/// ranges and `line`'s options; default labels follow the new indices. Free it with
/// `hg_line_free`; `line` is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for `end` past the last element or `start`
/// after `end`; `HG_ERR_INVALID` when `start == end` (a line needs an element) or the
/// slice cannot be built (a fitting left with no bore to take); `HG_ERR_NULL_POINTER`.
/// Thread-safe (`line` is only read).
///
/// # Safety
/// `line` must be NULL or a live handle; `out` NULL or a writable `hg_line *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_slice(
    line: *const hg_line,
    start: usize,
    end: usize,
    out: *mut *mut hg_line,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let l = unsafe { ffi::handle("line", line)? };
        let part = l.line()?.slice(start..end)?;
        let handle = Box::new(hg_line::from_line(part));
        // SAFETY: forwarded contract; checked above.
        unsafe { put("out", out, Box::into_raw(handle)) }
    })
}

/// Appends every element of `other` to `line`, with their labels, counts and roughness
/// ranges; `line` keeps its options, and `other`'s must be the same except its inlet
/// pressure. `other` must be complete (it is built to be read); it is unchanged.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` when the options differ or `other` cannot be built;
/// `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`; `other` may be `line` itself
/// (the route is then doubled).
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `other` NULL or a live
/// handle.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_append_line(line: *mut hg_line, other: *const hg_line) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            // `other` may be `line` itself: then it is read through the exclusive borrow.
            let o = if std::ptr::eq(other, &raw const *l) {
                l.line()?.clone()
            } else {
                ffi::handle("other", other)?.line()?.clone()
            };
            Ok(l.builder.push_line(&o)?)
        })
    }
}
