//! The Darcy friction factor: laminar, transitional and turbulent.
//!
//! [`darcy_factor`] is the one entry point. It classifies the regime from the Reynolds
//! number, evaluates the laminar law `f = C/Re` (C is the section's laminar constant, 64
//! for a circle), the chosen turbulent correlation, or — between the two limits — a C¹
//! blend of both, and returns `f` with `∂f/∂Re`, `∂f/∂(ε/D)`, the regime and warnings.
//!
//! Accuracy of each turbulent correlation, against the exact Colebrook solution. "Stated"
//! is the bound this crate promises and tests (`core/tests/explicit_vs_colebrook.rs`, a
//! 121 × 61 log grid over the range); "published" is the paper's own claim as we recall it
//! (from memory; the papers were not at hand). Where a published claim is not met over
//! the whole published range we state the measured figure instead and say so.
//!
//! | correlation | validity (published) | published | measured max | stated | source |
//! |---|---|---|---|---|---|
//! | Colebrook (exact) | Re 4e3…1e8, ε/D 0…0.05 (chart range) | — | ≤ 1 ulp | ≤ 4 ulp | Colebrook 1939 |
//! | Haaland | Re 4e3…1e8, ε/D 1e-6…0.05 | ±1.5 % | 1.42 % | 1.5 % | Haaland 1983 |
//! | Swamee–Jain | Re 5e3…1e8, ε/D 1e-6…1e-2 | ±1 % | 2.83 % (Re 5e3, ε/D 1e-2) | 3 % | Swamee & Jain 1976 |
//! | Churchill | all Re, ε/D 0…0.05 | none stated | 3.14 % (Re ≈ 4.4e3) | 3.5 % | Churchill 1977 |
//! | Serghides | Re 4e3…1e8, ε/D 0…0.05 | ±0.003 % | 0.0031 % | 0.004 % | Serghides 1984 |
//! | Blasius | Re 4e3…1e5, smooth | none stated | 2.84 % | 3.5 % (common practice) | Blasius 1913 |
//! | fully rough | ε⁺ = Re (ε/D) √(f/8) ≥ 70 | exact limit | — | limit test | Nikuradse 1933 |
//!
//! Swamee–Jain exceeds its 1 % claim only near the low-Re, rough corner of its range;
//! Churchill deviates most just above Re 4000, where its built-in transition still acts.

mod colebrook;
mod explicit;
mod kernel;
mod memo;
mod strided;

#[cfg(test)]
pub(crate) use colebrook::calls as colebrook_calls;
pub use kernel::Isa;
pub(crate) use memo::factor_remembered;
pub use strided::{Strided, darcy_factor_batch_strided};

use crate::error::{Error, Result, check};
use crate::warning::Warnings;
use rayon::prelude::*;
use serde::{Deserialize, Serialize};
use std::fmt;
use std::str::FromStr;

/// The largest relative roughness accepted; beyond it there is hardly a bore left.
pub const MAX_REL_ROUGHNESS: f64 = 0.5;
/// The largest Reynolds number accepted (no pipe flow comes near; the cheap start of the
/// Colebrook solver needs the argument of its logarithm to stay a normal number).
pub const MAX_REYNOLDS: f64 = 1e13;

/// The smallest Reynolds number accepted. Far below any creeping flow met in practice
/// (from memory: a heavy oil in a capillary stays above 1e-12); the bound keeps the
/// laminar factor C/Re and its slope −C/Re² finite for every accepted laminar constant.
pub const MIN_REYNOLDS: f64 = 1e-100;
/// The largest laminar constant C = f·Re accepted (the exact constants of real sections
/// lie between about 50 and 100; a custom section accepts up to the same bound).
pub const MAX_LAMINAR_CONSTANT: f64 = 1e4;
/// Below this Reynolds number Churchill's formula is the laminar law to the last bit:
/// its turbulent terms are below 1e-100 of the laminar term there, and evaluating them
/// would overflow at the smallest accepted Re.
pub(crate) const CHURCHILL_LAMINAR_RE: f64 = 1.0;
/// The smallest relative roughness the fully rough law accepts: its slope ∝ 1/(ε/D)
/// stays finite above it.
pub const MIN_REL_ROUGHNESS_FULLY_ROUGH: f64 = 1e-100;

/// The smallest laminar limit accepted: the turbulent correlations (and the Colebrook
/// solver's fixed step count) are not meant for lower Reynolds numbers.
pub const MIN_LAMINAR_LIMIT: f64 = 1000.0;

/// Which correlation gives the turbulent friction factor.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum Correlation {
    /// Colebrook–White, solved exactly (the default).
    #[default]
    Colebrook,
    /// Haaland (1983), explicit.
    Haaland,
    /// Swamee and Jain (1976), explicit.
    SwameeJain,
    /// Churchill (1977), explicit, all regimes in one formula.
    Churchill,
    /// Serghides (1984), explicit.
    Serghides,
    /// Blasius (1913), smooth pipes only.
    Blasius,
    /// Fully rough wall (von Kármán, Nikuradse), independent of Re.
    FullyRough,
}

/// Published validity range and accuracy of a correlation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Validity {
    /// Smallest Reynolds number of the published range.
    pub re_min: f64,
    /// Largest Reynolds number of the published range.
    pub re_max: f64,
    /// Smallest relative roughness of the published range.
    pub rel_roughness_min: f64,
    /// Largest relative roughness of the published range.
    pub rel_roughness_max: f64,
    /// Stated largest relative deviation from Colebrook inside the range, as a fraction
    /// (0 for Colebrook itself): the published figure where it holds, otherwise the
    /// measured one (module table).
    pub accuracy: f64,
}

impl Correlation {
    /// Every correlation, in a fixed order (the C constants follow this order).
    pub const ALL: [Correlation; 7] = [
        Correlation::Colebrook,
        Correlation::Haaland,
        Correlation::SwameeJain,
        Correlation::Churchill,
        Correlation::Serghides,
        Correlation::Blasius,
        Correlation::FullyRough,
    ];

    /// The name used by every binding: `"colebrook"`, `"haaland"`, `"swamee_jain"`,
    /// `"churchill"`, `"serghides"`, `"blasius"`, `"fully_rough"`.
    pub fn name(self) -> &'static str {
        match self {
            Correlation::Colebrook => "colebrook",
            Correlation::Haaland => "haaland",
            Correlation::SwameeJain => "swamee_jain",
            Correlation::Churchill => "churchill",
            Correlation::Serghides => "serghides",
            Correlation::Blasius => "blasius",
            Correlation::FullyRough => "fully_rough",
        }
    }

    /// The published validity range and the stated accuracy (see the module table).
    pub fn validity(self) -> Validity {
        let v = |re_min, re_max, rr_min, rr_max, accuracy| Validity {
            re_min,
            re_max,
            rel_roughness_min: rr_min,
            rel_roughness_max: rr_max,
            accuracy,
        };
        match self {
            Correlation::Colebrook => v(4e3, 1e8, 0.0, 0.05, 0.0),
            Correlation::Haaland => v(4e3, 1e8, 1e-6, 0.05, 0.015),
            Correlation::SwameeJain => v(5e3, 1e8, 1e-6, 1e-2, 0.03),
            Correlation::Churchill => v(0.0, 1e8, 0.0, 0.05, 0.035),
            Correlation::Serghides => v(4e3, 1e8, 0.0, 0.05, 4e-5),
            Correlation::Blasius => v(4e3, 1e5, 0.0, 0.0, 0.035),
            Correlation::FullyRough => v(0.0, f64::INFINITY, 1e-6, 0.05, 0.0),
        }
    }

    /// True for correlations that cover the laminar and transitional regimes themselves.
    fn covers_all_regimes(self) -> bool {
        matches!(self, Correlation::Churchill)
    }
}

impl fmt::Display for Correlation {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.name())
    }
}

impl FromStr for Correlation {
    type Err = Error;
    fn from_str(s: &str) -> Result<Self> {
        crate::names::find(Correlation::ALL, |c| c.name(), s).ok_or_else(|| {
            let names: Vec<&str> = Correlation::ALL.iter().map(|c| c.name()).collect();
            Error::unknown_name("correlation", s, &names)
        })
    }
}

/// The flow regime.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Regime {
    /// Re below the laminar limit (2300 by default).
    Laminar,
    /// Re between the laminar and turbulent limits.
    Transitional,
    /// Re above the turbulent limit (4000 by default).
    Turbulent,
}

impl Regime {
    /// `"laminar"`, `"transitional"` or `"turbulent"`.
    pub fn name(self) -> &'static str {
        match self {
            Regime::Laminar => "laminar",
            Regime::Transitional => "transitional",
            Regime::Turbulent => "turbulent",
        }
    }
}

/// What to do between the laminar and turbulent limits.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum Transition {
    /// A C¹ blend (smoothstep in Re) from the laminar value to the turbulent correlation:
    /// values and slopes match at both limits, so solvers see no jump.
    #[default]
    Blend,
    /// Use the turbulent correlation right down to the laminar limit.
    Turbulent,
    /// Refuse with [`Error::NoSolution`].
    Refuse,
}

impl Transition {
    /// Every treatment, in a fixed order (the C constants follow this order).
    pub const ALL: [Transition; 3] = [Transition::Blend, Transition::Turbulent, Transition::Refuse];

    /// The name used by every binding: `"blend"`, `"turbulent"` or `"refuse"`.
    pub fn name(self) -> &'static str {
        match self {
            Transition::Blend => "blend",
            Transition::Turbulent => "turbulent",
            Transition::Refuse => "refuse",
        }
    }
}

impl fmt::Display for Transition {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.name())
    }
}

impl FromStr for Transition {
    type Err = Error;
    fn from_str(s: &str) -> Result<Self> {
        crate::names::find(Transition::ALL, |t| t.name(), s).ok_or_else(|| {
            let names: Vec<&str> = Transition::ALL.iter().map(|t| t.name()).collect();
            Error::unknown_name("transition", s, &names)
        })
    }
}

/// Options of [`darcy_factor`]. `Options::default()` is Colebrook with the common-practice
/// regime limits 2300 and 4000 and the circle's laminar constant 64.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Options {
    /// Turbulent correlation.
    pub correlation: Correlation,
    /// Laminar constant C = f·Re of the section (64 for a circle), dimensionless.
    pub laminar_constant: f64,
    /// Re below which flow is laminar (2300, common practice).
    pub laminar_limit: f64,
    /// Re above which flow is turbulent (4000, common practice).
    pub turbulent_limit: f64,
    /// Treatment of the transitional band.
    pub transition: Transition,
}

impl Default for Options {
    fn default() -> Self {
        Options {
            correlation: Correlation::Colebrook,
            laminar_constant: 64.0,
            laminar_limit: 2300.0,
            turbulent_limit: 4000.0,
            transition: Transition::Blend,
        }
    }
}

impl Options {
    /// Default options with another correlation.
    pub fn with_correlation(correlation: Correlation) -> Self {
        Options {
            correlation,
            ..Options::default()
        }
    }

    /// Checks the options themselves.
    pub fn validate(&self) -> Result<()> {
        check::positive("laminar_constant", self.laminar_constant)?;
        if self.laminar_constant > MAX_LAMINAR_CONSTANT {
            return Err(Error::out_of_range(
                "laminar_constant",
                self.laminar_constant,
                format!("must not exceed {MAX_LAMINAR_CONSTANT:e}"),
            ));
        }
        check::finite("laminar_limit", self.laminar_limit)?;
        if self.laminar_limit < MIN_LAMINAR_LIMIT {
            return Err(Error::out_of_range(
                "laminar_limit",
                self.laminar_limit,
                format!(
                    "must be at least {MIN_LAMINAR_LIMIT} (turbulent correlations are not meant below it)"
                ),
            ));
        }
        check::positive("turbulent_limit", self.turbulent_limit)?;
        if self.turbulent_limit < self.laminar_limit {
            return Err(Error::out_of_range(
                "turbulent_limit",
                self.turbulent_limit,
                format!("must not be below laminar_limit ({})", self.laminar_limit),
            ));
        }
        Ok(())
    }
}

/// A friction factor with its sensitivities.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Friction {
    /// Darcy friction factor, dimensionless.
    pub f: f64,
    /// ∂f/∂Re.
    pub df_dre: f64,
    /// ∂f/∂(ε/D).
    pub df_drel_roughness: f64,
    /// Flow regime.
    pub regime: Regime,
    /// Validity warnings.
    pub warnings: Warnings,
}

/// Validates a Reynolds number and a relative roughness (shared by every entry point).
#[inline]
pub fn check_inputs(re: f64, rel_roughness: f64) -> Result<()> {
    check::positive("re", re)?;
    if re < MIN_REYNOLDS {
        return Err(Error::out_of_range(
            "re",
            re,
            format!("must be at least {MIN_REYNOLDS:e} (f = C/Re would not be a finite number)"),
        ));
    }
    if re > MAX_REYNOLDS {
        return Err(Error::out_of_range(
            "re",
            re,
            format!("must not exceed {MAX_REYNOLDS:e}"),
        ));
    }
    check::non_negative("rel_roughness", rel_roughness)?;
    if rel_roughness > MAX_REL_ROUGHNESS {
        return Err(Error::out_of_range(
            "rel_roughness",
            rel_roughness,
            format!("must not exceed {MAX_REL_ROUGHNESS} (roughness half the bore)"),
        ));
    }
    Ok(())
}

/// The Darcy friction factor at Reynolds number `re` and relative roughness
/// `rel_roughness` = ε/D (both dimensionless).
///
/// Laminar (Re < `laminar_limit`): f = C/Re with C = `opts.laminar_constant`, exact for
/// fully developed flow. Turbulent (Re > `turbulent_limit`): the chosen correlation.
/// Between: per `opts.transition`. Churchill covers all regimes by itself.
///
/// # Errors
/// [`Error::NotFinite`] for NaN or ±∞; [`Error::OutOfRange`] for Re ≤ 0, Re > 1e13,
/// ε/D < 0 or ε/D > 0.5, invalid options, or ε/D = 0 with the fully rough law;
/// [`Error::NoSolution`] for transitional flow with [`Transition::Refuse`].
///
/// # Example
/// ```
/// use hydrograde::friction::{darcy_factor, Options, Regime};
/// let fr = darcy_factor(1e5, 1e-4, &Options::default()).unwrap();
/// assert_eq!(fr.regime, Regime::Turbulent);
/// // mpmath, 40 digits: 0.018513866077471642672…
/// assert!((fr.f - 0.018_513_866_077_471_64).abs() < 1e-17);
/// ```
pub fn darcy_factor(re: f64, rel_roughness: f64, opts: &Options) -> Result<Friction> {
    // One combined test on the hot path (NaN fails every comparison); the checks that
    // build the error run only when it fails.
    if !inputs_ok(re, rel_roughness) {
        check_inputs(re, rel_roughness)?;
    }
    if !options_ok(opts) {
        opts.validate()?;
    }
    factor_checked(re, rel_roughness, opts)
}

/// True when [`check_inputs`] passes (one combined test: NaN fails every comparison).
#[inline(always)]
pub(crate) fn inputs_ok(re: f64, rel_roughness: f64) -> bool {
    (MIN_REYNOLDS..=MAX_REYNOLDS).contains(&re)
        && (0.0..=MAX_REL_ROUGHNESS).contains(&rel_roughness)
}

/// True when [`Options::validate`] passes.
#[inline(always)]
pub(crate) fn options_ok(opts: &Options) -> bool {
    opts.laminar_constant > 0.0
        && opts.laminar_constant <= MAX_LAMINAR_CONSTANT
        && opts.laminar_limit >= MIN_LAMINAR_LIMIT
        && opts.laminar_limit < f64::INFINITY
        && opts.turbulent_limit >= opts.laminar_limit
        && opts.turbulent_limit < f64::INFINITY
}

/// [`darcy_factor`] for inputs the caller has already checked ([`inputs_ok`] and
/// [`options_ok`] hold): a pipe checks its flow once, with an error that names the flow,
/// and does not pay for the checks again.
#[inline]
pub(crate) fn factor_checked(re: f64, rel_roughness: f64, opts: &Options) -> Result<Friction> {
    let (s, regime) = solution(re, rel_roughness, opts)?;
    let corr = opts.correlation;
    let mut warnings = Warnings::NONE;
    match regime {
        Regime::Transitional => warnings.insert(Warnings::TRANSITIONAL_FLOW),
        Regime::Turbulent => warnings |= range_warnings(corr, re, rel_roughness, s.f),
        Regime::Laminar => {}
    }
    Ok(finish(s, regime, warnings))
}

/// The factor with its sensitivities and the regime, for checked inputs.
#[inline(always)]
fn solution(re: f64, rel_roughness: f64, opts: &Options) -> Result<(colebrook::Solution, Regime)> {
    let corr = opts.correlation;
    if corr == Correlation::FullyRough && rel_roughness < MIN_REL_ROUGHNESS_FULLY_ROUGH {
        return Err(too_smooth_for_fully_rough(rel_roughness));
    }
    let regime = if re < opts.laminar_limit {
        Regime::Laminar
    } else if re <= opts.turbulent_limit {
        Regime::Transitional
    } else {
        Regime::Turbulent
    };
    if corr.covers_all_regimes() {
        let s = if re < CHURCHILL_LAMINAR_RE {
            laminar(re, opts.laminar_constant)
        } else {
            explicit::churchill(re, rel_roughness, opts.laminar_constant)
        };
        return Ok((s, regime));
    }
    let s = match regime {
        Regime::Laminar => laminar(re, opts.laminar_constant),
        Regime::Turbulent => turbulent(corr, re, rel_roughness),
        Regime::Transitional => match opts.transition {
            Transition::Refuse => {
                return Err(Error::NoSolution {
                    reason: format!(
                        "re = {re} is transitional (between {} and {}) and the transition option is 'refuse'",
                        opts.laminar_limit, opts.turbulent_limit
                    ),
                });
            }
            Transition::Turbulent => turbulent(corr, re, rel_roughness),
            Transition::Blend => blend(re, rel_roughness, opts),
        },
    };
    Ok((s, regime))
}

fn too_smooth_for_fully_rough(rel_roughness: f64) -> Error {
    Error::out_of_range(
        "rel_roughness",
        rel_roughness,
        format!(
            "must be at least {MIN_REL_ROUGHNESS_FULLY_ROUGH:e} for the fully rough law (a smooth wall is never fully rough)"
        ),
    )
}

/// The laminar law f = C/Re.
#[inline]
fn laminar(re: f64, c: f64) -> colebrook::Solution {
    let f = c / re;
    colebrook::Solution {
        f,
        df_dre: -f / re,
        df_drel_roughness: 0.0,
    }
}

/// The turbulent correlation. The exact Colebrook solve, the default and the hot one, is
/// inlined into each caller (it needs few registers, so a caller's loop keeps its own
/// values in registers instead of saving them around a call); the rest are one call.
#[inline(always)]
fn turbulent(corr: Correlation, re: f64, rr: f64) -> colebrook::Solution {
    if corr == Correlation::Colebrook {
        colebrook::solve(re, rr)
    } else {
        other_turbulent(corr, re, rr)
    }
}

#[inline(never)]
fn other_turbulent(corr: Correlation, re: f64, rr: f64) -> colebrook::Solution {
    match corr {
        Correlation::Colebrook => colebrook::solve(re, rr),
        Correlation::Haaland => explicit::haaland(re, rr),
        Correlation::SwameeJain => explicit::swamee_jain(re, rr),
        Correlation::Serghides => explicit::serghides(re, rr),
        Correlation::Blasius => explicit::blasius(re),
        Correlation::FullyRough => explicit::fully_rough(rr),
        // Churchill is handled before the regime split; evaluating it here keeps the
        // match total without a panic path.
        Correlation::Churchill => explicit::churchill(re, rr, 64.0),
    }
}

/// The smoothstep weight w(t) = 3t² − 2t³ on t = (Re − Re_lam)/(Re_turb − Re_lam), and
/// dw/dRe. w and its slope are 0 at the laminar limit; w = 1 with zero slope at the
/// turbulent limit, which makes the blend C¹.
#[inline]
pub fn blend_weight(re: f64, opts: &Options) -> (f64, f64) {
    let span = opts.turbulent_limit - opts.laminar_limit;
    if span <= 0.0 {
        return (1.0, 0.0);
    }
    let t = ((re - opts.laminar_limit) / span).clamp(0.0, 1.0);
    let w = t * t * (3.0 - 2.0 * t);
    let dw = 6.0 * t * (1.0 - t) / span;
    (w, dw)
}

#[inline]
fn blend(re: f64, rr: f64, opts: &Options) -> colebrook::Solution {
    let lam = laminar(re, opts.laminar_constant);
    let tur = turbulent(opts.correlation, re, rr);
    let (w, dw) = blend_weight(re, opts);
    colebrook::Solution {
        f: (1.0 - w) * lam.f + w * tur.f,
        df_dre: (1.0 - w) * lam.df_dre + w * tur.df_dre + dw * (tur.f - lam.f),
        df_drel_roughness: w * tur.df_drel_roughness,
    }
}

/// A cheap turbulent friction factor for solvers' starting guesses only: Haaland's
/// explicit form (within 1.5 % of Colebrook over its range; see the module table), for
/// `re` ≥ 1 and `rel_roughness` ≥ 0. Never a result.
#[inline]
pub(crate) fn approximate_factor(re: f64, rel_roughness: f64) -> f64 {
    let re = re.clamp(MIN_LAMINAR_LIMIT, MAX_REYNOLDS);
    if rel_roughness > 0.0 {
        explicit::haaland(re, rel_roughness.min(MAX_REL_ROUGHNESS)).f
    } else {
        // Haaland's smooth-wall form: 1/√f = −1.8 log10(6.9/Re).
        let x = -1.8 / std::f64::consts::LN_10 * crate::math::ln_pos(6.9 / re);
        1.0 / (x * x)
    }
}

/// The laminar and turbulent limiting values at a transitional Re (for bands that span
/// both regimes): `(laminar f, turbulent f)`.
///
/// # Errors
/// As [`darcy_factor`], and `re` below [`MIN_LAMINAR_LIMIT`] (the turbulent correlations
/// are not meant there, and the exact Colebrook solver's fixed step count does not hold).
pub fn transition_limits(re: f64, rel_roughness: f64, opts: &Options) -> Result<(f64, f64)> {
    check_inputs(re, rel_roughness)?;
    opts.validate()?;
    if re < MIN_LAMINAR_LIMIT {
        return Err(Error::out_of_range(
            "re",
            re,
            format!(
                "must be at least {MIN_LAMINAR_LIMIT} for a turbulent limit (the turbulent correlations are not meant below it)"
            ),
        ));
    }
    if opts.correlation == Correlation::FullyRough && rel_roughness < MIN_REL_ROUGHNESS_FULLY_ROUGH
    {
        return Err(too_smooth_for_fully_rough(rel_roughness));
    }
    Ok((
        laminar(re, opts.laminar_constant).f,
        turbulent(opts.correlation, re, rel_roughness).f,
    ))
}

fn range_warnings(corr: Correlation, re: f64, rr: f64, f: f64) -> Warnings {
    let v = corr.validity();
    let mut w = Warnings::NONE;
    if corr == Correlation::FullyRough {
        // Nikuradse's fully rough threshold on the roughness Reynolds number (from memory).
        if re * rr * (f / 8.0).sqrt() < 70.0 {
            w.insert(Warnings::REYNOLDS_OUT_OF_RANGE);
        }
    } else if re < v.re_min || re > v.re_max {
        w.insert(Warnings::REYNOLDS_OUT_OF_RANGE);
    }
    // A smooth wall (ε/D = 0) counts as inside every range that starts near zero.
    if rr > v.rel_roughness_max || (rr > 0.0 && rr < v.rel_roughness_min) {
        w.insert(Warnings::ROUGHNESS_OUT_OF_RANGE);
    }
    w
}

#[inline]
fn finish(s: colebrook::Solution, regime: Regime, warnings: Warnings) -> Friction {
    Friction {
        f: s.f,
        df_dre: s.df_dre,
        df_drel_roughness: s.df_drel_roughness,
        regime,
        warnings,
    }
}

/// Below this many elements a batch runs on the calling thread.
pub const PARALLEL_THRESHOLD: usize = 16_384;

/// Friction factors of many points at once: `out[i] = darcy_factor(re[i], rel_roughness[i]).f`.
///
/// Runs on the threads [`crate::threads::set_threads`] allows above [`PARALLEL_THRESHOLD`]
/// elements, and on each thread on the widest vector unit the processor has
/// ([`Isa::detected`]); the result is the same bit for bit either way.
///
/// # Errors
/// [`Error::Invalid`] when the three slices differ in length; otherwise the error of the
/// first failing element, wrapped in [`Error::AtIndex`].
pub fn darcy_factor_batch(
    re: &[f64],
    rel_roughness: &[f64],
    opts: &Options,
    out: &mut [f64],
) -> Result<()> {
    darcy_factor_batch_on(Isa::detected(), re, rel_roughness, opts, out)
}

/// [`darcy_factor_batch`] on a chosen instruction set, for tests and benchmarks that
/// compare them: every available one gives the same bits.
///
/// # Errors
/// As [`darcy_factor_batch`], and [`Error::Invalid`] when `isa` is not available on this
/// processor.
pub fn darcy_factor_batch_on(
    isa: Isa,
    re: &[f64],
    rel_roughness: &[f64],
    opts: &Options,
    out: &mut [f64],
) -> Result<()> {
    if re.len() != rel_roughness.len() || re.len() != out.len() {
        return Err(Error::invalid(
            "rel_roughness",
            format!(
                "lengths differ: re has {}, rel_roughness {}, out {}",
                re.len(),
                rel_roughness.len(),
                out.len()
            ),
        ));
    }
    opts.validate()?;
    if re.len() < PARALLEL_THRESHOLD {
        return batch_serial(isa, re, rel_roughness, opts, out, 0);
    }
    let parallel = crate::threads::in_pool(|| {
        out.par_chunks_mut(BATCH_CHUNK)
            .zip(re.par_chunks(BATCH_CHUNK))
            .zip(rel_roughness.par_chunks(BATCH_CHUNK))
            .enumerate()
            .try_for_each(|(c, ((o, r), e))| batch_serial(isa, r, e, opts, o, c * BATCH_CHUNK))
    });
    match parallel {
        // One thread allowed: no pool, the calling thread does it all.
        None => batch_serial(isa, re, rel_roughness, opts, out, 0),
        Some(Ok(())) => Ok(()),
        // Report the first failing element, whichever thread saw an error first.
        Some(Err(_)) => first_error(re, rel_roughness, opts),
    }
}

/// Friction factors at many points for a caller that handles the points the vector
/// kernel does not take: those the kernel takes (valid, turbulent; any regime from Re 1
/// for Churchill) get exactly [`darcy_factor`]'s value; every other point goes to
/// `other(i, &mut out[i])`. `re`, `rr` and `out` have one length.
pub(crate) fn factors_with(
    re: &[f64],
    rr: &[f64],
    opts: &Options,
    out: &mut [f64],
    other: &mut dyn FnMut(usize, &mut f64) -> Result<()>,
) -> Result<()> {
    kernel::run_on(
        Isa::detected(),
        &kernel::Kernel::new(opts),
        re,
        rr,
        out,
        other,
    )
}

/// Points per parallel task of [`darcy_factor_batch`].
const BATCH_CHUNK: usize = 4096;

/// One thread's share of a batch; `offset` is the index of its first point in the batch.
///
/// Blocks of points that are all valid and take the correlation's formula alone go
/// through the vector kernel; every other point takes [`darcy_factor`] (same bits).
fn batch_serial(
    isa: Isa,
    re: &[f64],
    rr: &[f64],
    opts: &Options,
    out: &mut [f64],
    offset: usize,
) -> Result<()> {
    let mut one = |i: usize, o: &mut f64| -> Result<()> {
        *o = darcy_factor(re[i], rr[i], opts)
            .map_err(|err| err.at_index(offset + i))?
            .f;
        Ok(())
    };
    kernel::run_on(isa, &kernel::Kernel::new(opts), re, rr, out, &mut one)
}

fn first_error(re: &[f64], rr: &[f64], opts: &Options) -> Result<()> {
    for (i, (&r, &e)) in re.iter().zip(rr).enumerate() {
        darcy_factor(r, e, opts).map_err(|err| err.at_index(i))?;
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn laminar_is_64_over_re_for_a_circle() {
        // Exact analytical solution: Hagen–Poiseuille, f = 64/Re.
        let fr = darcy_factor(1000.0, 0.01, &Options::default()).unwrap();
        assert_eq!(fr.regime, Regime::Laminar);
        assert_relative_eq!(fr.f, 0.064, max_relative = 1e-15);
        assert_relative_eq!(fr.df_dre, -64.0 / 1e6, max_relative = 1e-15);
        assert_eq!(fr.df_drel_roughness, 0.0);
    }

    #[test]
    fn laminar_uses_the_given_constant() {
        // Exact analytical solution: parallel plates, f·Re = 96 (on the hydraulic diameter).
        let opts = Options {
            laminar_constant: 96.0,
            ..Options::default()
        };
        let fr = darcy_factor(500.0, 0.0, &opts).unwrap();
        assert_relative_eq!(fr.f, 96.0 / 500.0, max_relative = 1e-15);
    }

    #[test]
    fn bad_inputs_name_the_parameter() {
        let o = Options::default();
        for (re, rr, needle) in [
            (f64::NAN, 0.0, "re = NaN"),
            (f64::INFINITY, 0.0, "re = inf"),
            (-1.0, 0.0, "re = -1"),
            (0.0, 0.0, "re = 0"),
            (1e14, 0.0, "re = 100000000000000"),
            (1e5, -1e-3, "rel_roughness = -0.001"),
            (1e5, f64::NAN, "rel_roughness = NaN"),
            (1e5, 0.9, "rel_roughness = 0.9"),
        ] {
            let e = darcy_factor(re, rr, &o).unwrap_err();
            assert!(e.to_string().starts_with(needle), "{e}");
        }
        let fr = Options::with_correlation(Correlation::FullyRough);
        assert!(darcy_factor(1e6, 0.0, &fr).is_err());
        let bad = Options {
            laminar_limit: 5000.0,
            ..Options::default()
        };
        assert!(
            darcy_factor(1e5, 0.0, &bad)
                .unwrap_err()
                .to_string()
                .contains("turbulent_limit")
        );
    }

    #[test]
    fn names_round_trip_and_unknown_names_fail() {
        for c in Correlation::ALL {
            assert_eq!(c.name().parse::<Correlation>().unwrap(), c);
        }
        let e = "moody".parse::<Correlation>().unwrap_err();
        assert!(e.to_string().contains("colebrook, haaland"));
    }

    #[test]
    fn transition_names_round_trip_and_unknown_names_fail() {
        for t in Transition::ALL {
            assert_eq!(t.name().parse::<Transition>().unwrap(), t);
            assert_eq!(t.to_string(), t.name());
        }
        let e = "smooth".parse::<Transition>().unwrap_err();
        assert_eq!(e.kind(), crate::ErrorKind::UnknownName);
        assert!(e.to_string().contains("blend, turbulent, refuse"), "{e}");
    }

    #[test]
    fn transition_options() {
        let re = 3000.0;
        let blend = darcy_factor(re, 1e-4, &Options::default()).unwrap();
        assert_eq!(blend.regime, Regime::Transitional);
        assert!(blend.warnings.contains(Warnings::TRANSITIONAL_FLOW));
        let (lam, tur) = transition_limits(re, 1e-4, &Options::default()).unwrap();
        assert!(blend.f > lam.min(tur) && blend.f < lam.max(tur));
        let turb = Options {
            transition: Transition::Turbulent,
            ..Options::default()
        };
        assert_eq!(darcy_factor(re, 1e-4, &turb).unwrap().f, tur);
        let refuse = Options {
            transition: Transition::Refuse,
            ..Options::default()
        };
        let e = darcy_factor(re, 1e-4, &refuse).unwrap_err();
        assert_eq!(e.kind(), crate::ErrorKind::NoSolution);
    }

    #[test]
    fn warnings_outside_published_ranges() {
        let o = Options::with_correlation(Correlation::Blasius);
        let w = darcy_factor(1e6, 0.0, &o).unwrap().warnings;
        assert!(w.contains(Warnings::REYNOLDS_OUT_OF_RANGE));
        let w = darcy_factor(5e4, 1e-3, &o).unwrap().warnings;
        assert!(w.contains(Warnings::ROUGHNESS_OUT_OF_RANGE));
        let w = darcy_factor(5e4, 0.0, &o).unwrap().warnings;
        assert!(w.is_empty());
        let o = Options::with_correlation(Correlation::FullyRough);
        assert!(
            darcy_factor(1e4, 1e-5, &o)
                .unwrap()
                .warnings
                .contains(Warnings::REYNOLDS_OUT_OF_RANGE)
        );
        assert!(darcy_factor(1e9, 1e-2, &o).unwrap().warnings.is_empty());
    }

    #[test]
    fn batch_matches_scalar_bit_for_bit_and_reports_first_error() {
        let n = PARALLEL_THRESHOLD + 100;
        let re: Vec<f64> = (0..n).map(|i| 1e3 + 37.0 * i as f64).collect();
        let rr: Vec<f64> = (0..n).map(|i| 1e-6 * (i % 100) as f64).collect();
        let mut out = vec![0.0; n];
        let o = Options::default();
        darcy_factor_batch(&re, &rr, &o, &mut out).unwrap();
        for i in (0..n).step_by(997) {
            assert_eq!(
                out[i].to_bits(),
                darcy_factor(re[i], rr[i], &o).unwrap().f.to_bits()
            );
        }
        let mut bad = re.clone();
        bad[n - 5] = -1.0;
        bad[n - 2] = f64::NAN;
        let e = darcy_factor_batch(&bad, &rr, &o, &mut out).unwrap_err();
        assert!(
            e.to_string()
                .starts_with(&format!("element {}: re = -1", n - 5)),
            "{e}"
        );
        let e = darcy_factor_batch(&re[..3], &rr, &o, &mut out).unwrap_err();
        assert_eq!(e.kind(), crate::ErrorKind::Invalid);
    }
}
