//! The uncertainty of a line's results: which sources its bands include and how
//! large they are, and the Monte Carlo check of the first-order band.

use crate::ffi::sized;
use crate::ffi::{self, FfiResult, guard, put};
use crate::fluid::hg_fluid;
use crate::line::{hg_line, with_line};
use hydrograde::Error;
use hydrograde::band::{UncertaintyOptions, monte_carlo};

/// Which uncertainty sources the bands of a line include, and their sizes (relative
/// standard uncertainties, k = 1). Fill it with `hg_uncertainty_options_default`.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_uncertainty_options {
    /// Size of this struct in bytes, set by `hg_uncertainty_options_default`.
    pub struct_size: usize,
    /// 1 to include the friction correlation's model uncertainty, else 0.
    pub friction_model: i32,
    /// 1 to include wall roughness, else 0.
    pub roughness: i32,
    /// 1 to include the fluid's density and viscosity uncertainties, else 0.
    pub fluid: i32,
    /// 1 to include fitting K spreads, else 0.
    pub fittings: i32,
    /// 1 to include equipment spreads, else 0.
    pub equipment: i32,
    /// Model uncertainty of turbulent flow in round pipe.
    pub turbulent_model: f64,
    /// Model uncertainty of laminar flow.
    pub laminar_model: f64,
    /// Model uncertainty of turbulent flow in non-circular ducts.
    pub non_circular_model: f64,
    /// Relative uncertainty of roughness where a pipe states no range.
    pub roughness_default: f64,
    /// Relative uncertainty of every bore (manufacturing tolerance).
    pub diameter: f64,
}
sized!(hg_uncertainty_options, diameter: f64);

fn uncertainty_to_c(u: &UncertaintyOptions) -> hg_uncertainty_options {
    hg_uncertainty_options {
        struct_size: std::mem::size_of::<hg_uncertainty_options>(),
        friction_model: i32::from(u.friction_model()),
        roughness: i32::from(u.roughness()),
        fluid: i32::from(u.fluid()),
        fittings: i32::from(u.fittings()),
        equipment: i32::from(u.equipment()),
        turbulent_model: u.turbulent_model(),
        laminar_model: u.laminar_model(),
        non_circular_model: u.non_circular_model(),
        roughness_default: u.roughness_default(),
        diameter: u.diameter(),
    }
}

fn flag(name: &'static str, v: i32) -> FfiResult<bool> {
    match v {
        0 => Ok(false),
        1 => Ok(true),
        _ => Err(Error::out_of_range(name, f64::from(v), "must be 0 or 1").into()),
    }
}

/// Fills `opts` with the library's default uncertainty sources and sets its
/// `struct_size`.
///
/// Returns `HG_OK` or `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `opts` must be NULL or point to a writable `hg_uncertainty_options`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_uncertainty_options_default(opts: *mut hg_uncertainty_options) -> i32 {
    // SAFETY: forwarded contract.
    guard(|| unsafe {
        put(
            "opts",
            opts,
            uncertainty_to_c(&UncertaintyOptions::default()),
        )
    })
}

/// Sets the uncertainty sources of the bands of `line` (see `hg_uncertainty_options`).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE` for a negative size or a
/// flag other than 0 or 1; `HG_ERR_INVALID` for a `struct_size` too small;
/// `HG_ERR_NULL_POINTER`. Needs exclusive use of `line`.
///
/// # Safety
/// `line` must be NULL or a live handle used by no other thread; `opts` NULL or a
/// readable `hg_uncertainty_options`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_set_uncertainty(
    line: *mut hg_line,
    opts: *const hg_uncertainty_options,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        with_line(line, |l| {
            let d = uncertainty_to_c(&UncertaintyOptions::default());
            let c = ffi::read_sized("opts", opts, d)?;
            let u = l
                .builder
                .options()
                .uncertainty()
                .clone()
                .with_friction_model(flag("friction_model", c.friction_model)?)
                .with_roughness(flag("roughness", c.roughness)?)
                .with_fluid(flag("fluid", c.fluid)?)
                .with_fittings(flag("fittings", c.fittings)?)
                .with_equipment(flag("equipment", c.equipment)?)
                .with_turbulent_model(c.turbulent_model)?
                .with_laminar_model(c.laminar_model)?
                .with_non_circular_model(c.non_circular_model)?
                .with_roughness_default(c.roughness_default)?
                .with_diameter(c.diameter)?;
            Ok(l.builder.set_uncertainty(u)?)
        })
    }
}

/// The largest number of samples `hg_line_monte_carlo` accepts: the samples are kept in
/// memory (8 bytes each), and a larger request is far more than any check needs. The
/// same limit holds in every binding.
pub const HG_MONTE_CARLO_MAX_SAMPLES: usize = 10_000_000;
// The header needs a literal; the build stops if it drifts from the core's limit.
const _: () = assert!(HG_MONTE_CARLO_MAX_SAMPLES == hydrograde::band::MAX_SAMPLES);

/// The result of `hg_line_monte_carlo`: the required head sampled with the line's
/// uncertainty sources. Set `struct_size` to `sizeof(hg_monte_carlo)` before the call.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_monte_carlo {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// Sample mean of the required head, m.
    pub mean: f64,
    /// Sample standard deviation, m.
    pub std_dev: f64,
    /// 2.5 % quantile, m (the low end of the 95 % probabilistically symmetric interval).
    pub low: f64,
    /// 97.5 % quantile, m.
    pub high: f64,
    /// Number of samples drawn.
    pub samples: usize,
}
sized!(hg_monte_carlo, samples: usize);

/// Propagates the uncertainty sources of `line` (see `hg_line_set_uncertainty`) to its
/// required head at `flow` (m³/s) by sampling (JCGM 101:2008), `samples` times (100 to
/// `HG_MONTE_CARLO_MAX_SAMPLES`) from the generator seed `seed`, into `*out`: the check
/// of the first-order band of `hg_line_evaluate`. The same seed gives the same numbers.
/// Friction model, diameter, density and viscosity are drawn normal; roughness, fitting K
/// and equipment ratings rectangular. Time grows with `samples` × elements.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` for the flow; `HG_ERR_OUT_OF_RANGE` for a sample
/// count outside the range; the codes of `hg_line_evaluate` for the line;
/// `HG_ERR_INVALID` for a `struct_size` too small; `HG_ERR_NULL_POINTER`. Thread-safe
/// (the line is only read).
///
/// # Safety
/// `line` and `fluid` must be NULL or live handles; `out` NULL or a writable
/// `hg_monte_carlo` of `out->struct_size` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_line_monte_carlo(
    line: *const hg_line,
    fluid: *const hg_fluid,
    flow: f64,
    samples: usize,
    seed: u64,
    out: *mut hg_monte_carlo,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let (l, f) = unsafe { crate::line::line_and_fluid(line, fluid)? };
        let m = monte_carlo(l, f, flow, samples, seed)?;
        let c = hg_monte_carlo {
            struct_size: std::mem::size_of::<hg_monte_carlo>(),
            mean: m.mean,
            std_dev: m.std_dev,
            low: m.low,
            high: m.high,
            samples: m.samples,
        };
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &c) }
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ffi::{HG_ERR_INVALID, HG_ERR_OUT_OF_RANGE, HG_OK};
    use crate::fluid::{hg_fluid_free, hg_fluid_water};
    use crate::line::hg_line_add_pipe_material;
    use crate::line::{hg_line_add_fitting, hg_line_free, hg_line_new};
    use hydrograde::fitting::Fitting;
    use hydrograde::fluid::Fluid;
    use hydrograde::line::{Element, Line};
    use hydrograde::pipe::Pipe;
    use hydrograde::section::Section;

    #[test]
    fn monte_carlo_equals_the_core() {
        let mut l: *mut hg_line = std::ptr::null_mut();
        let mut f: *mut hg_fluid = std::ptr::null_mut();
        // SAFETY: valid out-pointers and live handles; freed at the end.
        unsafe {
            assert_eq!(hg_line_new(&mut l), HG_OK);
            assert_eq!(hg_fluid_water(293.15, 2e5, &mut f), HG_OK);
            let steel = c"commercial_steel".as_ptr();
            assert_eq!(hg_line_add_pipe_material(l, 0.05, 30.0, steel), HG_OK);
            assert_eq!(hg_line_add_fitting(l, c"gate_valve".as_ptr(), 0.0), HG_OK);
        }
        let section = Section::circle(0.05).unwrap();
        let core = Line::new(vec![
            Element::Pipe(Pipe::of_material(section, 30.0, "commercial_steel").unwrap()),
            Element::Fitting(Fitting::named("gate_valve").unwrap()),
        ])
        .unwrap();
        let water = Fluid::water(293.15, 2e5).unwrap();
        let want = monte_carlo(&core, &water, 2e-3, 300, 11).unwrap();
        let mut got = hg_monte_carlo {
            struct_size: std::mem::size_of::<hg_monte_carlo>(),
            mean: 0.0,
            std_dev: 0.0,
            low: 0.0,
            high: 0.0,
            samples: 0,
        };
        // SAFETY: live handles, valid out-pointer.
        assert_eq!(
            unsafe { hg_line_monte_carlo(l, f, 2e-3, 300, 11, &mut got) },
            HG_OK
        );
        assert_eq!(
            (got.mean, got.std_dev, got.samples),
            (want.mean, want.std_dev, 300)
        );
        assert_eq!((got.low, got.high), (want.low, want.high));
        let too_many = HG_MONTE_CARLO_MAX_SAMPLES + 1;
        // SAFETY: as above.
        unsafe {
            assert_eq!(
                hg_line_monte_carlo(l, f, 2e-3, too_many, 1, &mut got),
                HG_ERR_OUT_OF_RANGE
            );
            assert_eq!(
                hg_line_monte_carlo(l, f, 2e-3, 99, 1, &mut got),
                HG_ERR_OUT_OF_RANGE
            );
            got.struct_size = 8;
            assert_eq!(
                hg_line_monte_carlo(l, f, 2e-3, 200, 1, &mut got),
                HG_ERR_INVALID
            );
        }
        // SAFETY: handles from the constructors above, not used afterwards.
        unsafe {
            hg_line_free(l);
            hg_fluid_free(f);
        }
    }
}
