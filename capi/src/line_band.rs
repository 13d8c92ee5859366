//! The Monte Carlo check of a line's first-order band.

use crate::ffi::sized;
use crate::ffi::{self, guard};
use crate::fluid::hg_fluid;
use crate::line::hg_line;
use hydrograde::band::monte_carlo;

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
        let (l, f) = unsafe { (ffi::handle("line", line)?, ffi::handle("fluid", fluid)?) };
        let m = monte_carlo(l.line()?, &f.fluid, flow, samples, seed)?;
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
    use crate::line::{hg_line_add_fitting, hg_line_free, hg_line_new};
    use crate::line_more::hg_line_add_pipe_material;
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
