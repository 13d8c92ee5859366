//! Bands along the whole system curve, and the correlation of roughness sources.

use crate::ffi::{self, guard};
use crate::fluid::hg_fluid;
use crate::line::{hg_line, with_line};
use std::ffi::c_char;

/// The system curve with its 95 % band: at each of the `n` flows `flows[i]` (m³/s),
/// `nominal[i]` = the required head (m, the same value as `hg_line_system_curve`) and
/// `low[i]`, `high[i]` = the ends of its band (the band of `hg_line_evaluate`'s required
/// head at that flow). One pass over the elements per flow; uses all cores above 64
/// flows, with the same results.
///
/// Returns `HG_OK`; the status of the first failing flow (message "element <i>: ..."),
/// with the outputs unchanged; `HG_ERR_INVALID` for `n` = 0 or a line that cannot be
/// built; `HG_ERR_NULL_POINTER`. Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `flows`, `low`, `nominal` and `high`
/// NULL or valid for `n` doubles (the outputs may not overlap `flows` or each other).
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_system_curve_band(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flows: *const f64,
    n: usize,
    low: *mut f64,
    nominal: *mut f64,
    high: *mut f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
        // SAFETY: forwarded contract.
        let q = unsafe { ffi::slice("flows", flows, n)? };
        ffi::check_len("low", low.cast_const(), n)?;
        ffi::check_len("nominal", nominal.cast_const(), n)?;
        ffi::check_len("high", high.cast_const(), n)?;
        let c = l.line()?.system_curve_band(&f.fluid, q)?;
        // SAFETY: forwarded contract; lengths checked above.
        unsafe {
            ffi::slice_mut("low", low, n)?.copy_from_slice(&c.low);
            ffi::slice_mut("nominal", nominal, n)?.copy_from_slice(&c.nominal);
            ffi::slice_mut("high", high, n)?.copy_from_slice(&c.high);
        }
        Ok(())
    })
}

/// Treats the pipes of catalogue material `material` as independent in the bands (each
/// pipe its own roughness error, as for pipes from different supplies) when `independent`
/// is 1, or as sharing one error (the default) when 0.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a name not in the material catalogue;
/// `HG_ERR_OUT_OF_RANGE` for `independent` other than 0 or 1; `HG_ERR_NULL_POINTER`.
/// Not thread-safe for the same line (it changes the line).
///
/// # Safety
/// `line` must be NULL or a live handle; `material` NULL or a NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_material_independent(
    line: *mut hg_line,
    material: *const c_char,
    independent: i32,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let name = ffi::c_str("material", material)?;
            if !(0..=1).contains(&independent) {
                return Err(hydrograde::Error::out_of_range(
                    "independent",
                    independent as f64,
                    "must be 0 or 1",
                )
                .into());
            }
            let u = l.builder.options().uncertainty();
            let mut materials = u.independent_materials().to_vec();
            materials.retain(|m| m != name);
            if independent == 1 {
                materials.push(name.to_string());
            }
            let u = u.clone().with_independent_materials(materials)?;
            Ok(l.builder.set_uncertainty(u)?)
        })
    }
}
