//! The batch kernel: friction factors of many points on the widest vector unit the
//! processor has, chosen at run time, with the same bits as one point at a time.
//!
//! Every correlation is a fixed, branch-free sequence of IEEE basic operations (the
//! crate's own [`crate::math`] functions included), so the compiler's vectoriser can run
//! several points side by side without changing a single rounding: no fused
//! multiply-add is written or allowed to be formed (Rust never contracts `a * b + c`),
//! and lane-wise IEEE arithmetic is the scalar arithmetic. The same source is compiled
//! once per instruction set (`#[target_feature]`); [`Isa::detected`] picks the widest
//! one the processor supports, once per process.
//!
//! This is the only module of the crate with `unsafe`: calling a function compiled for
//! an instruction set is only sound on a processor that has it, which each call site
//! checks first.
#![allow(unsafe_code)]

use super::{
    CHURCHILL_LAMINAR_RE, Correlation, MIN_REL_ROUGHNESS_FULLY_ROUGH, Options, colebrook, explicit,
    inputs_ok,
};
use crate::error::{Error, Result};
use std::sync::OnceLock;

/// The instruction sets the batch kernel is compiled for.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Isa {
    /// The target's baseline: SSE2 on x86-64, NEON on aarch64, scalar code elsewhere.
    Baseline,
    /// AVX2 (x86-64, four doubles per instruction).
    Avx2,
    /// AVX-512F (x86-64, eight doubles per instruction).
    Avx512,
}

impl Isa {
    /// Every instruction set, narrowest first.
    pub const ALL: [Isa; 3] = [Isa::Baseline, Isa::Avx2, Isa::Avx512];

    /// `"baseline"`, `"avx2"` or `"avx512"`.
    pub fn name(self) -> &'static str {
        match self {
            Isa::Baseline => "baseline",
            Isa::Avx2 => "avx2",
            Isa::Avx512 => "avx512",
        }
    }

    /// True when this processor can run the kernel compiled for `self`.
    pub fn is_available(self) -> bool {
        match self {
            Isa::Baseline => true,
            #[cfg(target_arch = "x86_64")]
            Isa::Avx2 => std::arch::is_x86_feature_detected!("avx2"),
            #[cfg(target_arch = "x86_64")]
            Isa::Avx512 => std::arch::is_x86_feature_detected!("avx512f"),
            #[cfg(not(target_arch = "x86_64"))]
            _ => false,
        }
    }

    /// The widest available instruction set (detected once per process); what
    /// [`super::darcy_factor_batch`] uses.
    pub fn detected() -> Isa {
        static DETECTED: OnceLock<Isa> = OnceLock::new();
        *DETECTED.get_or_init(|| {
            Isa::ALL
                .into_iter()
                .rev()
                .find(|isa| isa.is_available())
                .unwrap_or(Isa::Baseline)
        })
    }
}

/// What one batch computes: the correlation and the settings that decide which points
/// the vector path may take.
#[derive(Clone, Copy)]
pub(crate) struct Kernel {
    corr: Correlation,
    laminar_constant: f64,
    turbulent_limit: f64,
}

impl Kernel {
    pub(crate) fn new(opts: &Options) -> Kernel {
        Kernel {
            corr: opts.correlation,
            laminar_constant: opts.laminar_constant,
            turbulent_limit: opts.turbulent_limit,
        }
    }

    /// True when the point is valid and its factor is the correlation's formula alone
    /// (turbulent, or any regime for Churchill): exactly the points where
    /// [`super::darcy_factor`] returns [`Kernel::factor`].
    #[inline(always)]
    fn takes(&self, re: f64, rr: f64) -> bool {
        let valid = inputs_ok(re, rr);
        match self.corr {
            Correlation::Churchill => valid && re >= CHURCHILL_LAMINAR_RE,
            Correlation::FullyRough => {
                valid && re > self.turbulent_limit && rr >= MIN_REL_ROUGHNESS_FULLY_ROUGH
            }
            _ => valid && re > self.turbulent_limit,
        }
    }

    /// The factors of a run of points that all qualify: the scalar formula itself (its
    /// derivatives are dead code here and vanish), so the bits are those of
    /// [`super::darcy_factor`]. The loop's length is known only at run time, which keeps
    /// the compiler from unrolling it whole and lets its loop vectoriser take it.
    #[inline(always)]
    fn segment(&self, re: &[f64], rr: &[f64], out: &mut [f64]) {
        macro_rules! lanes {
            ($f:expr) => {
                for ((o, &r), &e) in out.iter_mut().zip(re).zip(rr) {
                    *o = $f(r, e).f;
                }
            };
        }
        let lam = self.laminar_constant;
        match self.corr {
            Correlation::Colebrook => lanes!(colebrook::solve),
            Correlation::Haaland => lanes!(explicit::haaland),
            Correlation::SwameeJain => lanes!(explicit::swamee_jain),
            Correlation::Churchill => lanes!(|r, e| explicit::churchill(r, e, lam)),
            Correlation::Serghides => lanes!(explicit::serghides),
            Correlation::Blasius => lanes!(|r, _| explicit::blasius(r)),
            Correlation::FullyRough => lanes!(|_, e| explicit::fully_rough(e)),
        }
    }
}

/// The loop every instruction set compiles: each run of consecutive qualifying points
/// goes through [`Kernel::segment`]; every other point goes to `scalar(i, &mut out[i])`.
#[inline(always)]
fn run(
    kern: &Kernel,
    re: &[f64],
    rr: &[f64],
    out: &mut [f64],
    scalar: &mut dyn FnMut(usize, &mut f64) -> Result<()>,
) -> Result<()> {
    let n = re.len().min(rr.len()).min(out.len());
    let mut i = 0;
    while i < n {
        let mut j = i;
        while j < n && kern.takes(re[j], rr[j]) {
            j += 1;
        }
        kern.segment(&re[i..j], &rr[i..j], &mut out[i..j]);
        if j < n {
            scalar(j, &mut out[j])?;
            j += 1;
        }
        i = j;
    }
    Ok(())
}

#[cfg(target_arch = "x86_64")]
#[target_feature(enable = "avx2")]
/// [`run`] compiled for AVX2.
///
/// # Safety
/// The processor must support AVX2.
unsafe fn run_avx2(
    kern: &Kernel,
    re: &[f64],
    rr: &[f64],
    out: &mut [f64],
    scalar: &mut dyn FnMut(usize, &mut f64) -> Result<()>,
) -> Result<()> {
    run(kern, re, rr, out, scalar)
}

#[cfg(target_arch = "x86_64")]
#[target_feature(enable = "avx512f")]
/// [`run`] compiled for AVX-512F.
///
/// # Safety
/// The processor must support AVX-512F.
unsafe fn run_avx512(
    kern: &Kernel,
    re: &[f64],
    rr: &[f64],
    out: &mut [f64],
    scalar: &mut dyn FnMut(usize, &mut f64) -> Result<()>,
) -> Result<()> {
    run(kern, re, rr, out, scalar)
}

/// Runs the batch on `isa`; `re`, `rr` and `out` have one length (checked by the caller).
///
/// # Errors
/// [`Error::Invalid`] when `isa` is not available on this processor; otherwise whatever
/// `scalar` returns.
pub(crate) fn run_on(
    isa: Isa,
    kern: &Kernel,
    re: &[f64],
    rr: &[f64],
    out: &mut [f64],
    scalar: &mut dyn FnMut(usize, &mut f64) -> Result<()>,
) -> Result<()> {
    if !isa.is_available() {
        return Err(Error::invalid(
            "isa",
            format!("{} is not available on this processor", isa.name()),
        ));
    }
    match isa {
        Isa::Baseline => run(kern, re, rr, out, scalar),
        #[cfg(target_arch = "x86_64")]
        // SAFETY: `is_available` above found AVX2 on this processor, the only
        // requirement of `run_avx2`.
        Isa::Avx2 => unsafe { run_avx2(kern, re, rr, out, scalar) },
        #[cfg(target_arch = "x86_64")]
        // SAFETY: `is_available` above found AVX-512F on this processor, the only
        // requirement of `run_avx512`.
        Isa::Avx512 => unsafe { run_avx512(kern, re, rr, out, scalar) },
        #[cfg(not(target_arch = "x86_64"))]
        _ => run(kern, re, rr, out, scalar),
    }
}
