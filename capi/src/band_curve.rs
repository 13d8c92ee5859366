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

/// The Monte Carlo interval offered with a band that flags itself non-linear: evaluates
/// `line` at `flow` (m³/s) and, when its required-head band is flagged
/// (`hg_line_totals.band_non_linear`: a band wider than ±20 % of its value, or
/// a pipe whose Reynolds number reaches into the laminar–turbulent transition), sets
/// `*offered` = 1 and writes into `*out` the `hg_line_monte_carlo` run with 20,000
/// samples from seed 101 (the same bits in every binding), whose `low` and `high` are the
/// 95 % interval to use; otherwise sets `*offered` = 0 and writes zeros (`samples` 0)
/// into `*out`, which then holds no interval.
/// Costs one evaluation when not flagged, 20,000 when flagged.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; the codes of `hg_line_evaluate` for
/// the line; `HG_ERR_INVALID` for a `struct_size` too small; `HG_ERR_NULL_POINTER`.
/// Thread-safe (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `offered` NULL or writable; `out` NULL
/// or a writable `hg_monte_carlo` of `out->struct_size` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_band_monte_carlo(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    offered: *mut i32,
    out: *mut crate::line::hg_monte_carlo,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[ffi::out_ptr("offered", offered)])?;
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let m = hydrograde::band::band_monte_carlo(l, f, flow)?;
        let c = crate::line::hg_monte_carlo {
            struct_size: std::mem::size_of::<crate::line::hg_monte_carlo>(),
            mean: m.as_ref().map_or(0.0, |m| m.mean),
            std_dev: m.as_ref().map_or(0.0, |m| m.std_dev),
            low: m.as_ref().map_or(0.0, |m| m.low),
            high: m.as_ref().map_or(0.0, |m| m.high),
            samples: m.as_ref().map_or(0, |m| m.samples),
        };
        // SAFETY: forwarded contract; checked above.
        unsafe {
            ffi::write_sized("out", out, &c)?;
            ffi::put("offered", offered, i32::from(m.is_some()))
        }
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
