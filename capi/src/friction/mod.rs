//! The Darcy friction factor: scalar, with derivatives, with options, and in batches.

mod correlation;
pub use correlation::*;

use crate::ffi::{self, FfiResult, bad_constant, guard, out_ptr, put};
use hydrograde::friction::{self, Correlation, Friction, Options, Regime, Transition};

/// Colebrook–White, solved exactly (the default correlation).
pub const HG_CORRELATION_COLEBROOK: i32 = 0;
/// Haaland (1983), explicit.
pub const HG_CORRELATION_HAALAND: i32 = 1;
/// Swamee and Jain (1976), explicit.
pub const HG_CORRELATION_SWAMEE_JAIN: i32 = 2;
/// Churchill (1977), explicit, one formula for all regimes.
pub const HG_CORRELATION_CHURCHILL: i32 = 3;
/// Serghides (1984), explicit.
pub const HG_CORRELATION_SERGHIDES: i32 = 4;
/// Blasius (1913), smooth pipes only.
pub const HG_CORRELATION_BLASIUS: i32 = 5;
/// The fully rough wall law, independent of Re.
pub const HG_CORRELATION_FULLY_ROUGH: i32 = 6;

/// Laminar flow (Re below the laminar limit, 2300 by default).
pub const HG_REGIME_LAMINAR: i32 = 0;
/// Transitional flow (between the laminar and turbulent limits).
pub const HG_REGIME_TRANSITIONAL: i32 = 1;
/// Turbulent flow (Re above the turbulent limit, 4000 by default).
pub const HG_REGIME_TURBULENT: i32 = 2;

/// In the transitional band, a C¹ blend of the laminar and turbulent values (default).
pub const HG_TRANSITION_BLEND: i32 = 0;
/// In the transitional band, the turbulent correlation down to the laminar limit.
pub const HG_TRANSITION_TURBULENT: i32 = 1;
/// In the transitional band, refuse with `HG_ERR_NO_SOLUTION`.
pub const HG_TRANSITION_REFUSE: i32 = 2;

// The HG_TRANSITION_* values follow the core's fixed order, `Transition::ALL`.
const TRANSITIONS: [Transition; 3] = Transition::ALL;

/// Options of `hg_darcy_factor_opts`. Fill it with `hg_friction_options_default`, then
/// change what you need; `struct_size` must be `sizeof(hg_friction_options)`.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_friction_options {
    /// Size of this struct in bytes, set by `hg_friction_options_default`.
    pub struct_size: usize,
    /// Turbulent correlation, one of `HG_CORRELATION_*`.
    pub correlation: i32,
    /// Treatment of the transitional band, one of `HG_TRANSITION_*`.
    pub transition: i32,
    /// Laminar constant C = f·Re of the section (64 for a circle), > 0, dimensionless.
    pub laminar_constant: f64,
    /// Reynolds number below which flow is laminar (default 2300), > 0.
    pub laminar_limit: f64,
    /// Reynolds number above which flow is turbulent (default 4000), ≥ `laminar_limit`.
    pub turbulent_limit: f64,
}

crate::ffi::sized!(hg_friction_options, turbulent_limit: f64);

/// A friction factor with its sensitivities. Set `struct_size` to `sizeof(hg_friction)`
/// before the call; the library fills the other fields.
#[repr(C)]
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct hg_friction {
    /// Size of this struct in bytes, set by the caller.
    pub struct_size: usize,
    /// Darcy friction factor, dimensionless.
    pub f: f64,
    /// ∂f/∂Re, dimensionless.
    pub df_dre: f64,
    /// ∂f/∂(ε/D), dimensionless.
    pub df_drel_roughness: f64,
    /// Flow regime, one of `HG_REGIME_*`.
    pub regime: i32,
    /// Warning bits, `HG_WARN_*`.
    pub warnings: u32,
}

crate::ffi::sized!(hg_friction, warnings: u32);

pub(crate) fn regime_code(r: Regime) -> i32 {
    match r {
        Regime::Laminar => HG_REGIME_LAMINAR,
        Regime::Transitional => HG_REGIME_TRANSITIONAL,
        Regime::Turbulent => HG_REGIME_TURBULENT,
    }
}

pub(crate) fn correlation(code: i32) -> FfiResult<Correlation> {
    usize::try_from(code)
        .ok()
        .and_then(|i| Correlation::ALL.get(i).copied())
        .ok_or_else(|| {
            bad_constant(
                "correlation",
                code,
                "HG_CORRELATION_*",
                Correlation::ALL.len(),
            )
        })
}

fn transition(code: i32) -> FfiResult<Transition> {
    usize::try_from(code)
        .ok()
        .and_then(|i| TRANSITIONS.get(i).copied())
        .ok_or_else(|| bad_constant("transition", code, "HG_TRANSITION_*", TRANSITIONS.len()))
}

fn transition_code(t: Transition) -> i32 {
    match t {
        Transition::Blend => HG_TRANSITION_BLEND,
        Transition::Turbulent => HG_TRANSITION_TURBULENT,
        Transition::Refuse => HG_TRANSITION_REFUSE,
    }
}

fn options_to_c(o: &Options) -> hg_friction_options {
    hg_friction_options {
        struct_size: std::mem::size_of::<hg_friction_options>(),
        correlation: Correlation::ALL
            .iter()
            .position(|c| *c == o.correlation)
            .map_or(HG_CORRELATION_COLEBROOK, |i| i as i32),
        transition: transition_code(o.transition),
        laminar_constant: o.laminar_constant,
        laminar_limit: o.laminar_limit,
        turbulent_limit: o.turbulent_limit,
    }
}

fn options_from_c(o: &hg_friction_options) -> FfiResult<Options> {
    Ok(Options {
        correlation: correlation(o.correlation)?,
        transition: transition(o.transition)?,
        laminar_constant: o.laminar_constant,
        laminar_limit: o.laminar_limit,
        turbulent_limit: o.turbulent_limit,
    })
}

/// Reads a caller's `hg_friction_options` into core options.
///
/// # Safety
/// `p` must be NULL or point to a readable `hg_friction_options`.
pub(crate) unsafe fn read_options(name: &str, p: *const hg_friction_options) -> FfiResult<Options> {
    let defaults = options_to_c(&Options::default());
    // SAFETY: forwarded contract.
    let o = unsafe { ffi::read_sized(name, p, defaults)? };
    options_from_c(&o)
}

pub(crate) fn friction_to_c(fr: &Friction) -> hg_friction {
    hg_friction {
        struct_size: std::mem::size_of::<hg_friction>(),
        f: fr.f,
        df_dre: fr.df_dre,
        df_drel_roughness: fr.df_drel_roughness,
        regime: regime_code(fr.regime),
        warnings: fr.warnings.bits(),
    }
}

/// Fills `opts` with the library's default friction options (Colebrook, regime limits
/// 2300 and 4000, laminar constant 64, C¹ blend in the transitional band) and sets
/// `opts->struct_size`.
///
/// Returns `HG_OK`, or `HG_ERR_NULL_POINTER` when `opts` is NULL. Thread-safe.
///
/// # Safety
/// `opts` must be NULL or point to a writable `hg_friction_options`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_friction_options_default(opts: *mut hg_friction_options) -> i32 {
    // SAFETY: forwarded contract.
    guard(|| unsafe { put("opts", opts, options_to_c(&Options::default())) })
}

/// The Darcy friction factor `*f` at Reynolds number `re` and relative roughness
/// `rel_roughness` = ε/D (both dimensionless), with the turbulent correlation
/// `correlation` (`HG_CORRELATION_*`) and the default regime treatment: laminar
/// f = 64/Re below Re 2300, the correlation above 4000, a C¹ blend between.
///
/// Valid ranges: 1e-100 ≤ re ≤ 1e13; 0 ≤ rel_roughness ≤ 0.5 (≥ 1e-100 for the fully rough law).
/// Outside a correlation's published range the value still computes (see
/// `hg_darcy_factor_full` for the warnings).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE` for NaN or ±inf; `HG_ERR_OUT_OF_RANGE` for values
/// outside the ranges or an unknown correlation; `HG_ERR_NULL_POINTER` when `f` is NULL.
/// On error `*f` is unchanged and `hg_last_error` says why. Thread-safe.
///
/// # Safety
/// `f` must be NULL or point to a writable double.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_darcy_factor(
    re: f64,
    rel_roughness: f64,
    correlation: i32,
    f: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("f", f)])?;
        let opts = Options::with_correlation(self::correlation(correlation)?);
        let fr = friction::darcy_factor(re, rel_roughness, &opts)?;
        // SAFETY: forwarded contract.
        unsafe { put("f", f, fr.f) }
    })
}

/// Like `hg_darcy_factor`, and also gives `*df_dre` = ∂f/∂Re, `*df_drel_roughness` =
/// ∂f/∂(ε/D), `*regime` (`HG_REGIME_*`) and `*warnings` (`HG_WARN_*` bits: Reynolds number
/// or roughness outside the correlation's published range, transitional flow).
///
/// Same ranges and status codes as `hg_darcy_factor`; every pointer must be non-NULL
/// (`HG_ERR_NULL_POINTER` otherwise, with nothing written). Thread-safe.
///
/// # Safety
/// Each pointer must be NULL or point to a writable value of its type.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_darcy_factor_full(
    re: f64,
    rel_roughness: f64,
    correlation: i32,
    f: *mut f64,
    df_dre: *mut f64,
    df_drel_roughness: *mut f64,
    regime: *mut i32,
    warnings: *mut u32,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("f", f),
            out_ptr("df_dre", df_dre),
            out_ptr("df_drel_roughness", df_drel_roughness),
            out_ptr("regime", regime),
            out_ptr("warnings", warnings),
        ])?;
        let opts = Options::with_correlation(self::correlation(correlation)?);
        let fr = friction::darcy_factor(re, rel_roughness, &opts)?;
        // SAFETY: forwarded contract; all pointers were checked above.
        unsafe {
            put("f", f, fr.f)?;
            put("df_dre", df_dre, fr.df_dre)?;
            put("df_drel_roughness", df_drel_roughness, fr.df_drel_roughness)?;
            put("regime", regime, regime_code(fr.regime))?;
            put("warnings", warnings, fr.warnings.bits())
        }
    })
}

/// The friction factor with full options: `opts` (from `hg_friction_options_default`,
/// then edited) chooses the correlation, the laminar constant of the section and the
/// regime limits and treatment; the result goes to `*out` (set `out->struct_size` first).
///
/// Ranges as `hg_darcy_factor`, plus: laminar_constant, laminar_limit, turbulent_limit
/// finite and > 0, turbulent_limit ≥ laminar_limit.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`, `HG_ERR_OUT_OF_RANGE` for bad numbers or
/// constants; `HG_ERR_NO_SOLUTION` for transitional flow with `HG_TRANSITION_REFUSE`;
/// `HG_ERR_NULL_POINTER`; `HG_ERR_INVALID` when a `struct_size` is too small.
/// Thread-safe.
///
/// # Safety
/// `opts` must be NULL or point to a readable `hg_friction_options`; `out` NULL or a
/// writable `hg_friction` of at least `out->struct_size` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_darcy_factor_opts(
    re: f64,
    rel_roughness: f64,
    opts: *const hg_friction_options,
    out: *mut hg_friction,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        unsafe { ffi::check_sized_out("out", out)? };
        // SAFETY: forwarded contract.
        let o = unsafe { read_options("opts", opts)? };
        let fr = friction::darcy_factor(re, rel_roughness, &o)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::write_sized("out", out, &friction_to_c(&fr)) }
    })
}

/// Friction factors of `n` points: `out[i]` = the factor at `re[i]`, `rel_roughness[i]`
/// with `correlation` (as `hg_darcy_factor`). Uses all cores above 16384 points; the
/// results equal the scalar call's bit for bit. `out` may be the same array as an input.
///
/// Returns `HG_OK`; the status of the first failing element (the message starts
/// "element <i>: "), with `out` partly written; `HG_ERR_NULL_POINTER` for a NULL array;
/// `HG_ERR_INVALID` for `n` = 0. Thread-safe.
///
/// # Safety
/// `re`, `rel_roughness` and `out` must be NULL or valid for `n` doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_darcy_factor_batch(
    re: *const f64,
    rel_roughness: *const f64,
    n: usize,
    correlation: i32,
    out: *mut f64,
) -> i32 {
    guard(|| {
        let opts = Options::with_correlation(self::correlation(correlation)?);
        // SAFETY: forwarded contract.
        let (r, e) = unsafe {
            (
                ffi::slice("re", re, n)?,
                ffi::slice("rel_roughness", rel_roughness, n)?,
            )
        };
        // Checked before computing, without borrowing (it may alias an input).
        ffi::check_len("out", out.cast_const(), n)?;
        // Computed aside, so a failing point leaves `out` untouched (one copy of n
        // doubles, small beside n Colebrook solves).
        let mut f = vec![0.0; n];
        friction::darcy_factor_batch(r, e, &opts, &mut f)?;
        // SAFETY: `r` and `e` are no longer used, so `out` may alias them.
        unsafe { ffi::slice_mut("out", out, n)? }.copy_from_slice(&f);
        Ok(())
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ffi::*;
    use crate::{hg_correlation_from_name, hg_correlation_name, hg_regime_name};
    use std::ffi::CStr;

    #[test]
    fn correlation_constants_follow_the_core_order() {
        let ours = [
            HG_CORRELATION_COLEBROOK,
            HG_CORRELATION_HAALAND,
            HG_CORRELATION_SWAMEE_JAIN,
            HG_CORRELATION_CHURCHILL,
            HG_CORRELATION_SERGHIDES,
            HG_CORRELATION_BLASIUS,
            HG_CORRELATION_FULLY_ROUGH,
        ];
        assert_eq!(
            ours.len(),
            Correlation::ALL.len(),
            "a correlation has no constant"
        );
        for (i, c) in Correlation::ALL.iter().enumerate() {
            assert_eq!(ours[i], i as i32);
            assert_eq!(correlation(ours[i]).unwrap(), *c);
            // SAFETY: static NUL-terminated string.
            let name = unsafe { CStr::from_ptr(hg_correlation_name(ours[i])) };
            assert_eq!(name.to_str().unwrap(), c.name());
        }
        assert!(hg_correlation_name(7).is_null());
        assert!(hg_correlation_name(-1).is_null());
    }

    #[test]
    fn regime_and_transition_codes_round_trip() {
        for r in [Regime::Laminar, Regime::Transitional, Regime::Turbulent] {
            // SAFETY: static NUL-terminated string.
            let n = unsafe { CStr::from_ptr(hg_regime_name(regime_code(r))) };
            assert_eq!(n.to_str().unwrap(), r.name());
        }
        for t in TRANSITIONS {
            assert_eq!(transition(transition_code(t)).unwrap(), t);
        }
    }

    #[test]
    fn scalar_full_opts_and_batch_equal_the_core_bit_for_bit() {
        // Points in each regime; expected values are the core's own (the binding must add
        // nothing to them).
        let pts = [
            (1e3, 0.0),
            (3e3, 1e-4),
            (1e5, 1e-4),
            (1e8, 0.01),
            (5e4, 0.0),
        ];
        for (i, c) in Correlation::ALL.iter().enumerate() {
            let core: Vec<f64> = pts
                .iter()
                .map(|&(re, rr)| {
                    let rr = if *c == Correlation::FullyRough {
                        rr + 1e-3
                    } else {
                        rr
                    };
                    friction::darcy_factor(re, rr, &Options::with_correlation(*c))
                        .unwrap()
                        .f
                })
                .collect();
            let mut batch_re = Vec::new();
            let mut batch_rr = Vec::new();
            for (k, &(re, rr)) in pts.iter().enumerate() {
                let rr = if *c == Correlation::FullyRough {
                    rr + 1e-3
                } else {
                    rr
                };
                batch_re.push(re);
                batch_rr.push(rr);
                let mut f = 0.0;
                // SAFETY: valid out-pointer.
                assert_eq!(unsafe { hg_darcy_factor(re, rr, i as i32, &mut f) }, HG_OK);
                assert_eq!(f.to_bits(), core[k].to_bits());
                let (mut f2, mut d1, mut d2, mut reg, mut w) = (0.0, 0.0, 0.0, -1, 0);
                // SAFETY: valid out-pointers.
                let s = unsafe {
                    hg_darcy_factor_full(
                        re, rr, i as i32, &mut f2, &mut d1, &mut d2, &mut reg, &mut w,
                    )
                };
                assert_eq!(s, HG_OK);
                let fr = friction::darcy_factor(re, rr, &Options::with_correlation(*c)).unwrap();
                assert_eq!(
                    friction_to_c(&fr),
                    hg_friction {
                        struct_size: std::mem::size_of::<hg_friction>(),
                        f: f2,
                        df_dre: d1,
                        df_drel_roughness: d2,
                        regime: reg,
                        warnings: w,
                    }
                );
                let mut o = hg_friction_options {
                    struct_size: 0,
                    correlation: 0,
                    transition: 0,
                    laminar_constant: 0.0,
                    laminar_limit: 0.0,
                    turbulent_limit: 0.0,
                };
                // SAFETY: valid pointer.
                assert_eq!(unsafe { hg_friction_options_default(&mut o) }, HG_OK);
                o.correlation = i as i32;
                let mut out = hg_friction {
                    struct_size: std::mem::size_of::<hg_friction>(),
                    f: 0.0,
                    df_dre: 0.0,
                    df_drel_roughness: 0.0,
                    regime: 0,
                    warnings: 0,
                };
                // SAFETY: valid pointers.
                assert_eq!(unsafe { hg_darcy_factor_opts(re, rr, &o, &mut out) }, HG_OK);
                assert_eq!(out, friction_to_c(&fr));
            }
            let mut out = vec![0.0; pts.len()];
            // SAFETY: arrays of pts.len() doubles.
            let s = unsafe {
                hg_darcy_factor_batch(
                    batch_re.as_ptr(),
                    batch_rr.as_ptr(),
                    pts.len(),
                    i as i32,
                    out.as_mut_ptr(),
                )
            };
            assert_eq!(s, HG_OK);
            assert_eq!(
                out.iter().map(|x| x.to_bits()).collect::<Vec<_>>(),
                core.iter().map(|x| x.to_bits()).collect::<Vec<_>>()
            );
            // In place: the output overwrites the Reynolds numbers.
            // SAFETY: arrays of pts.len() doubles; aliasing is allowed by the contract.
            let s = unsafe {
                hg_darcy_factor_batch(
                    batch_re.as_ptr(),
                    batch_rr.as_ptr(),
                    pts.len(),
                    i as i32,
                    batch_re.as_mut_ptr(),
                )
            };
            assert_eq!(s, HG_OK);
            assert_eq!(batch_re, out);
        }
    }

    #[test]
    fn bad_input_gives_codes_and_leaves_outputs_alone() {
        let mut f = 42.0;
        for (re, rr, corr, code) in [
            (f64::NAN, 0.0, 0, HG_ERR_NOT_FINITE),
            (f64::INFINITY, 0.0, 0, HG_ERR_NOT_FINITE),
            (-1.0, 0.0, 0, HG_ERR_OUT_OF_RANGE),
            (0.0, 0.0, 0, HG_ERR_OUT_OF_RANGE),
            (1e5, -1.0, 0, HG_ERR_OUT_OF_RANGE),
            (1e5, 0.0, 7, HG_ERR_OUT_OF_RANGE),
            (1e5, 0.0, -1, HG_ERR_OUT_OF_RANGE),
        ] {
            // SAFETY: valid out-pointer.
            assert_eq!(unsafe { hg_darcy_factor(re, rr, corr, &mut f) }, code);
            assert_eq!(f, 42.0);
            with_last_error(|m| assert!(!m.is_empty()));
        }
        let mut o = options_to_c(&Options::default());
        o.transition = HG_TRANSITION_REFUSE;
        let mut out =
            friction_to_c(&friction::darcy_factor(1e5, 0.0, &Options::default()).unwrap());
        // SAFETY: valid pointers.
        assert_eq!(
            unsafe { hg_darcy_factor_opts(3000.0, 0.0, &o, &mut out) },
            HG_ERR_NO_SOLUTION
        );
        o.struct_size = 8;
        // SAFETY: valid pointers.
        assert_eq!(
            unsafe { hg_darcy_factor_opts(1e5, 0.0, &o, &mut out) },
            HG_ERR_INVALID
        );
        let re = [1e5, -1.0];
        let rr = [0.0, 0.0];
        let mut outv = [0.0; 2];
        // SAFETY: arrays of 2 doubles.
        let s = unsafe { hg_darcy_factor_batch(re.as_ptr(), rr.as_ptr(), 2, 0, outv.as_mut_ptr()) };
        assert_eq!(s, HG_ERR_OUT_OF_RANGE);
        with_last_error(|m| assert!(m.starts_with("element 1: re = -1"), "{m}"));
        // SAFETY: n = 0 is rejected before any access.
        let s = unsafe { hg_darcy_factor_batch(re.as_ptr(), re.as_ptr(), 0, 0, outv.as_mut_ptr()) };
        assert_eq!(s, HG_ERR_INVALID);
        // SAFETY: NULL is rejected.
        let s = unsafe {
            hg_darcy_factor_batch(std::ptr::null(), re.as_ptr(), 2, 0, outv.as_mut_ptr())
        };
        assert_eq!(s, HG_ERR_NULL_POINTER);
        let mut c = 0;
        // SAFETY: NUL-terminated literal.
        let s = unsafe { hg_correlation_from_name(c"moody".as_ptr(), &mut c) };
        assert_eq!(s, HG_ERR_UNKNOWN_NAME);
        // SAFETY: NUL-terminated literal.
        let s = unsafe { hg_correlation_from_name(c"swamee_jain".as_ptr(), &mut c) };
        assert_eq!((s, c), (HG_OK, HG_CORRELATION_SWAMEE_JAIN));
    }
}
