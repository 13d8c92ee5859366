//! Cross-sections: area, wetted perimeter, hydraulic diameter and laminar constant.

use crate::ffi::{self, FfiResult, bad_constant, guard, out_ptr, put};
use hydrograde::error::Error;
use hydrograde::section::Section;

/// Round pipe: `a` = inside diameter (m), `b` = 0.
pub const HG_SECTION_CIRCLE: i32 = 0;
/// Concentric annulus: `a` = bore of the outer pipe, `b` = outside diameter of the inner
/// tube (m), 0 < b < a.
pub const HG_SECTION_ANNULUS: i32 = 1;
/// Rectangle: `a` = width, `b` = height (m).
pub const HG_SECTION_RECTANGLE: i32 = 2;
/// Ellipse: `a` = major axis, `b` = minor axis (full axes, m), b ≤ a.
pub const HG_SECTION_ELLIPSE: i32 = 3;
/// Equilateral triangle: `a` = side (m), `b` = 0.
pub const HG_SECTION_TRIANGLE: i32 = 4;

/// The core section of a `(shape, a, b)` triple. One-dimension shapes require `b` = 0 so
/// that a stray value is not silently ignored.
pub(crate) fn section_of(shape: i32, a: f64, b: f64) -> FfiResult<Section> {
    let unused = |b: f64| -> FfiResult<()> {
        if b == 0.0 {
            Ok(())
        } else {
            Err(Error::invalid(
                "b",
                format!(
                    "b = {b}: must be 0 for a {} (it has one dimension)",
                    if shape == HG_SECTION_CIRCLE {
                        "circle"
                    } else {
                        "triangle"
                    }
                ),
            )
            .into())
        }
    };
    Ok(match shape {
        HG_SECTION_CIRCLE => {
            unused(b)?;
            Section::circle(a)?
        }
        HG_SECTION_ANNULUS => Section::annulus(a, b)?,
        HG_SECTION_RECTANGLE => Section::rectangle(a, b)?,
        HG_SECTION_ELLIPSE => Section::ellipse(a, b)?,
        HG_SECTION_TRIANGLE => {
            unused(b)?;
            Section::triangle(a)?
        }
        _ => return Err(bad_constant("shape", shape, "HG_SECTION_*", 5)),
    })
}

/// Geometry of a cross-section `shape` (`HG_SECTION_*`) with dimensions `a`, `b` (m; see
/// each constant): `*area` (m²), `*wetted_perimeter` (m), `*hydraulic_diameter` = 4A/P
/// (m) and `*laminar_constant` = f·Re of fully developed laminar flow on the hydraulic
/// diameter (dimensionless, exact for each shape: 64 for a circle).
///
/// Valid ranges: dimensions finite and > 0 (b = 0 for a circle and a triangle); annulus
/// b < a; ellipse b ≤ a.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad dimension or
/// shape; `HG_ERR_INVALID` for b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`
/// when an output is NULL (nothing is written). Thread-safe.
///
/// # Safety
/// Each output must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_section_properties(
    shape: i32,
    a: f64,
    b: f64,
    area: *mut f64,
    wetted_perimeter: *mut f64,
    hydraulic_diameter: *mut f64,
    laminar_constant: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("area", area),
            out_ptr("wetted_perimeter", wetted_perimeter),
            out_ptr("hydraulic_diameter", hydraulic_diameter),
            out_ptr("laminar_constant", laminar_constant),
        ])?;
        let s = section_of(shape, a, b)?;
        // SAFETY: forwarded contract; every pointer was checked.
        unsafe {
            put("area", area, s.area())?;
            put("wetted_perimeter", wetted_perimeter, s.wetted_perimeter())?;
            put(
                "hydraulic_diameter",
                hydraulic_diameter,
                s.hydraulic_diameter(),
            )?;
            put("laminar_constant", laminar_constant, s.laminar_constant())
        }
    })
}

/// The diameter `*diameter` (m) turbulent flow in the section `shape` (`HG_SECTION_*`,
/// dimensions `a`, `b` as for `hg_section_properties`) is computed on under `mode`
/// (`HG_TURBULENT_DIAMETER_*`): the hydraulic diameter, or with
/// `HG_TURBULENT_DIAMETER_LAMINAR_EQUIVALENT` for rectangles and annuli the
/// laminar-equivalent diameter 64/C·D_h (Jones 1976; Jones & Leung 1981). Lines choose
/// the mode with `hg_line_set_turbulent_diameter`.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a bad dimension, shape
/// or mode; `HG_ERR_INVALID` for b ≠ 0 on a one-dimension shape; `HG_ERR_NULL_POINTER`.
/// Thread-safe.
///
/// # Safety
/// `diameter` must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_turbulent_diameter(
    shape: i32,
    a: f64,
    b: f64,
    mode: i32,
    diameter: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("diameter", diameter)])?;
        let s = section_of(shape, a, b)?;
        let m = crate::line::turbulent_mode(mode)?;
        // SAFETY: forwarded contract; checked above.
        unsafe { put("diameter", diameter, s.turbulent_diameter(m)) }
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shape_constants_build_the_named_shapes() {
        for (code, a, b, name) in [
            (HG_SECTION_CIRCLE, 0.1, 0.0, "circle"),
            (HG_SECTION_ANNULUS, 0.1, 0.05, "annulus"),
            (HG_SECTION_RECTANGLE, 0.1, 0.05, "rectangle"),
            (HG_SECTION_ELLIPSE, 0.1, 0.05, "ellipse"),
            (HG_SECTION_TRIANGLE, 0.1, 0.0, "triangle"),
        ] {
            assert_eq!(section_of(code, a, b).unwrap().shape_name(), name);
        }
        assert_eq!(
            section_of(5, 0.1, 0.0).unwrap_err().code,
            crate::HG_ERR_OUT_OF_RANGE
        );
        assert_eq!(
            section_of(HG_SECTION_CIRCLE, 0.1, 0.1).unwrap_err().code,
            crate::HG_ERR_INVALID
        );
    }
}
