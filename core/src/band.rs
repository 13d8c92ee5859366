//! Uncertainty bands: an honest range around every result.
//!
//! Follows the GUM (JCGM 100:2008): each uncertain input `θ` is given a relative standard
//! uncertainty `u(θ)/θ` (for roughness, a standard uncertainty of ln ε); a result `y`
//! gets the first-order standard uncertainty `u(y)² = Σ_s (Σ_i ∂y_i/∂ln θ_s · u(θ_s))²`
//! from the analytic sensitivities the core already computes (not finite differences).
//! A [`Source`] is one physical cause and is fully correlated wherever it acts: the
//! friction model and the bore tolerance along the whole line, one material's roughness
//! over all its pipes, one catalogue entry's K over all its instances, each fluid
//! property; a user fitting's K, a pipe's own roughness range and each piece of equipment
//! are sources of their own. Different sources are independent.
//!
//! The band is a 95 % coverage interval: its centre is the nominal result plus the
//! first-order effect of inputs whose mean is not their nominal value (a roughness quoted
//! off the centre of its range), its half-width `k·u(y)` with `k` from
//! [`coverage_factor`]: 2 for a near-normal output, down to 1.645 when one rectangular
//! input dominates (so the band never leaves the range that input can reach). Each band
//! says which rule it used ([`Coverage`]).
//!
//! Sources and their default relative standard uncertainties:
//!
//! | source | default | why |
//! |---|---|---|
//! | friction model, turbulent, round pipe | 5 % (±10 % at k = 2) | common practice: Colebrook against measured data |
//! | friction model, laminar | 0.5 % | exact solution; entrance and property variation (common practice) |
//! | friction model, non-circular turbulent | 7.5 % | hydraulic-diameter method, common practice |
//! | friction model, transitional | half the distance to the farther regime limit, ⊕ turbulent | spans both regimes |
//! | explicit correlation | its stated accuracy / √3 added in quadrature | rectangular on its bound |
//! | roughness | ln ε uniform over the stated range: u(ln ε) = ln(high/low)/√12; without a range a factor of 2 either way (ln 4/√12) | log-uniform: the quoted ranges span factors of 3 to 10 (common practice) |
//! | diameter | user tolerance, default none | |
//! | density, viscosity | the fluid's own | IAPWS / Sutherland statements |
//! | diameter, density, viscosity, friction model | normal | |
//! | fitting K | spread/√3 (spread = half-width, rectangular) | catalogue, common practice |
//! | equipment | spread/√3, rectangular | user, default ±10 % |
//!
//! [`monte_carlo`] propagates the same inputs by sampling (JCGM 101:2008) for checking.

use crate::math;
use serde::{Deserialize, Serialize};
use std::borrow::Cow;
use std::sync::OnceLock;

/// Coverage factor of a band whose output is close to normal (JCGM 100:2008 §6.3.3:
/// k = 2, about 95 %).
pub const COVERAGE_FACTOR: f64 = 2.0;

/// The shape of an input's distribution, as the first-order band and the Monte Carlo
/// check both read it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Shape {
    /// Normal with the stated standard uncertainty.
    Normal,
    /// Rectangular on a stated half-width (a K spread, an equipment spread), or uniform in
    /// the logarithm over a stated range (roughness): either way the output moves, to
    /// first order, with a rectangular variable.
    Rectangular,
}

/// One physical cause of uncertainty. Errors of one source are fully correlated wherever
/// it acts; different sources are independent.
#[derive(Debug, Clone, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize, Deserialize)]
pub enum Source {
    /// The friction correlation's model error (one for the whole line).
    FrictionModel,
    /// The roughness of one catalogue material, shared by every pipe of it.
    Material(Cow<'static, str>),
    /// The roughness of one pipe on its own (no material, a range stated for that pipe,
    /// or a material whose pipes are treated as independent).
    PipeRoughness {
        /// Index of the pipe in the line.
        element: usize,
    },
    /// The manufacturing tolerance of every bore.
    Diameter,
    /// The fluid's density.
    Density,
    /// The fluid's viscosity.
    Viscosity,
    /// The K of one catalogue entry, shared by every instance of it.
    CatalogueK(Cow<'static, str>),
    /// The K of one fitting not from the catalogue.
    FittingK {
        /// Index of the fitting in the line.
        element: usize,
        /// The fitting's method name.
        name: Cow<'static, str>,
    },
    /// The rating of one piece of equipment.
    Equipment {
        /// Index of the equipment in the line.
        element: usize,
        /// The equipment's label.
        name: String,
    },
    /// A source that belongs to one branch of a parallel split (an element's own).
    Branch {
        /// Index of the branch.
        branch: usize,
        /// The source within that branch.
        source: Box<Source>,
    },
    /// A source that belongs to one link of a network (an element's own).
    Link {
        /// The link's name.
        link: String,
        /// The source within that link's line.
        source: Box<Source>,
    },
}

impl Source {
    /// The display name, e.g. `"friction model"`, `"roughness of commercial_steel"`,
    /// `"K of elbow_90_standard"` (every instance), `"K of k (element 4)"`,
    /// `"strainer (element 5)"`, `"branch 1: roughness of pipe (element 0)"`.
    pub fn name(&self) -> String {
        match self {
            Source::FrictionModel => "friction model".into(),
            Source::Material(m) => format!("roughness of {m}"),
            Source::PipeRoughness { element } => format!("roughness of pipe (element {element})"),
            Source::Diameter => "diameter".into(),
            Source::Density => "density".into(),
            Source::Viscosity => "viscosity".into(),
            Source::CatalogueK(n) => format!("K of {n}"),
            Source::FittingK { element, name } => format!("K of {name} (element {element})"),
            Source::Equipment { element, name } => format!("{name} (element {element})"),
            Source::Branch { branch, source } => format!("branch {branch}: {}", source.name()),
            Source::Link { link, source } => format!("link {link}: {}", source.name()),
        }
    }

    /// What kind of cause it is: `"friction_model"`, `"material_roughness"`,
    /// `"pipe_roughness"`, `"diameter"`, `"density"`, `"viscosity"`, `"catalogue_k"`,
    /// `"fitting_k"` or `"equipment"` (a branch's or a link's source gives its inner kind).
    pub fn kind(&self) -> &'static str {
        match self {
            Source::FrictionModel => "friction_model",
            Source::Material(_) => "material_roughness",
            Source::PipeRoughness { .. } => "pipe_roughness",
            Source::Diameter => "diameter",
            Source::Density => "density",
            Source::Viscosity => "viscosity",
            Source::CatalogueK(_) => "catalogue_k",
            Source::FittingK { .. } => "fitting_k",
            Source::Equipment { .. } => "equipment",
            Source::Branch { source, .. } | Source::Link { source, .. } => source.kind(),
        }
    }

    /// The shape of the source's distribution.
    pub fn shape(&self) -> Shape {
        match self {
            Source::FrictionModel | Source::Diameter | Source::Density | Source::Viscosity => {
                Shape::Normal
            }
            Source::Branch { source, .. } | Source::Link { source, .. } => source.shape(),
            _ => Shape::Rectangular,
        }
    }

    /// True for a source that belongs to one element of one line (so, in a parallel
    /// split, to one branch); false for causes shared across lines (the friction model,
    /// a material, a catalogue entry, the bore tolerance, the fluid).
    pub fn is_element_scoped(&self) -> bool {
        matches!(
            self,
            Source::PipeRoughness { .. } | Source::FittingK { .. } | Source::Equipment { .. }
        )
    }
}

impl std::fmt::Display for Source {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(&self.name())
    }
}

/// One source's share of a band's variance.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Contribution {
    /// The source.
    pub source: Source,
    /// Share of the variance, 0…1; the shares of a band sum to 1.
    pub share: f64,
}

impl Contribution {
    /// The source's display name.
    pub fn name(&self) -> String {
        self.source.name()
    }
}

/// How a band's coverage factor was chosen.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum Coverage {
    /// No width.
    Exact,
    /// The output is close to normal (no rectangular input carries half the variance):
    /// k near 2.
    Normal,
    /// One rectangular (or log-uniform) input carries at least half the variance: the
    /// factor of that input convolved with a normal rest, so the band stays inside the
    /// range the input can reach.
    DominantRectangular,
}

impl Coverage {
    /// `"exact"`, `"normal"` or `"dominant_rectangular"`.
    pub fn name(self) -> &'static str {
        match self {
            Coverage::Exact => "exact",
            Coverage::Normal => "normal",
            Coverage::DominantRectangular => "dominant_rectangular",
        }
    }
}

/// A result with its 95 % coverage interval `low ≤ high` (normally around `nominal`).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Band {
    /// Lower end of the interval (same unit as the nominal value).
    pub low: f64,
    /// The nominal result (at the nominal inputs).
    pub nominal: f64,
    /// Upper end of the interval.
    pub high: f64,
    /// The coverage factor k: the half-width is k·u.
    pub coverage_factor: f64,
    /// How k was chosen.
    pub coverage: Coverage,
    /// Each source's share of the variance, largest first; empty when the band has no
    /// width (for example at zero flow).
    pub contributions: Vec<Contribution>,
    /// The first-order band may be unreliable: it is wider than
    /// [`NON_LINEAR_HALF_WIDTH`] of its nominal value, or (line results) the Reynolds
    /// number of some pipe reaches into the laminar–turbulent transition within its own
    /// 95 % range ([`reaches_transition`]). The Monte Carlo interval
    /// ([`monte_carlo`]; C `hg_line_monte_carlo`, Python `hydrograde.monte_carlo`) is then
    /// the one to use: [`band_monte_carlo`] (C `hg_line_band_monte_carlo`, Python
    /// `hydrograde.band_monte_carlo`) offers it with a fixed seed and sample count
    /// whenever a line's required-head band carries this flag.
    #[serde(default)]
    pub non_linear: bool,
}

/// Contributions up to which a band sorts them by insertion.
const SMALL_BAND: usize = 12;

/// The relative half-width (of the nominal value) above which a band is flagged
/// non-linear. Losses are products of uncertain factors (f·L/D·V², K·V², D⁻⁵…), so the
/// result is closer to log-normal than normal once the band is wide: for a log-normal
/// result of relative standard uncertainty σ the 95 % ends are exp(±1.96σ) against the
/// first-order 1 ± 2σ, and at σ = 0.1 (a half-width of 20 %) they differ by 5.5 % of the
/// band's width (by hand: e^0.196 = 1.2165, e^−0.196 = 0.8220) — beyond the 5 % that
/// the first-order band is validated to against Monte Carlo (core/tests/band_validation.rs).
pub const NON_LINEAR_HALF_WIDTH: f64 = 0.2;

/// True when a Reynolds number `re` with relative standard uncertainty `u_re` reaches
/// into the transition between `laminar_limit` and `turbulent_limit` within its 95 %
/// range re·(1 ± 2u): the friction factor's slope changes abruptly there (and its model
/// uncertainty with it), so a first-order band does not describe the spread.
pub fn reaches_transition(re: f64, u_re: f64, laminar_limit: f64, turbulent_limit: f64) -> bool {
    let (lo, hi) = (re * (1.0 - 2.0 * u_re), re * (1.0 + 2.0 * u_re));
    hi >= laminar_limit && lo <= turbulent_limit
}

/// One source's first-order effect on a result: the signed change for one standard
/// uncertainty of the input (`u`, result unit) and the offset of the input's mean from
/// its nominal value carried to the result (`shift`, result unit; non-zero only for a
/// roughness whose nominal value is not the centre of its stated range).
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct Term {
    /// Sensitivity × standard uncertainty, result unit.
    pub u: f64,
    /// Sensitivity × (input mean − nominal), result unit.
    pub shift: f64,
}

impl Term {
    /// A term with no shift.
    pub fn of(u: f64) -> Term {
        Term { u, shift: 0.0 }
    }

    /// The term carried through a linear map `c` of the result.
    pub fn times(self, c: f64) -> Term {
        Term {
            u: self.u * c,
            shift: self.shift * c,
        }
    }

    /// The sum of two terms of the same source.
    pub fn plus(self, o: Term) -> Term {
        Term {
            u: self.u + o.u,
            shift: self.shift + o.shift,
        }
    }
}

impl Band {
    /// A band of zero width.
    pub fn exact(nominal: f64) -> Band {
        Band {
            low: nominal,
            nominal,
            high: nominal,
            coverage_factor: COVERAGE_FACTOR,
            coverage: Coverage::Exact,
            contributions: Vec::new(),
            non_linear: false,
        }
    }

    /// A band from per-source terms (same unit as `nominal`; each source once): the
    /// variances add, the shifts add, and the half-width is `k·u` with `k` from
    /// [`coverage_factor`] on the largest rectangular source's share of the variance.
    pub fn from_terms(nominal: f64, terms: impl IntoIterator<Item = (Source, Term)>) -> Band {
        let terms = terms.into_iter();
        // Shares hold the variances until the total is known.
        let mut kept: Vec<Contribution> = Vec::with_capacity(terms.size_hint().0);
        let (mut var, mut shift, mut rect) = (0.0, 0.0, 0.0f64);
        for (source, t) in terms {
            let v = t.u * t.u;
            if !v.is_finite() || v == 0.0 {
                continue;
            }
            if source.shape() == Shape::Rectangular {
                rect = rect.max(v);
            }
            var += v;
            if t.shift.is_finite() {
                shift += t.shift;
            }
            kept.push(Contribution { source, share: v });
        }
        if var == 0.0 {
            return Band::exact(nominal);
        }
        let order = |a: &Contribution, b: &Contribution| {
            b.share
                .total_cmp(&a.share)
                .then_with(|| a.source.cmp(&b.source))
        };
        if kept.len() <= SMALL_BAND {
            // An element's band has a handful of sources: insertion sort, far cheaper than
            // the general sort there. No two contributions share a source, so the order is
            // total and both sorts give the same one.
            for i in 1..kept.len() {
                let mut j = i;
                while j > 0 && order(&kept[j], &kept[j - 1]).is_lt() {
                    kept.swap(j, j - 1);
                    j -= 1;
                }
            }
        } else {
            kept.sort_by(order);
        }
        for c in &mut kept {
            c.share /= var;
        }
        let share = rect / var;
        let k = coverage_factor(share);
        let half = k * var.sqrt();
        let centre = nominal + shift;
        Band {
            low: centre - half,
            nominal,
            high: centre + half,
            coverage_factor: k,
            coverage: if share >= 0.5 {
                Coverage::DominantRectangular
            } else {
                Coverage::Normal
            },
            contributions: kept,
            non_linear: nominal != 0.0 && half > NON_LINEAR_HALF_WIDTH * nominal.abs(),
        }
    }

    /// Half-width k·u of the band.
    pub fn half_width(&self) -> f64 {
        0.5 * (self.high - self.low)
    }

    /// Standard uncertainty u = half-width / k.
    pub fn standard_uncertainty(&self) -> f64 {
        self.half_width() / self.coverage_factor
    }

    /// The source with the largest share, if any.
    pub fn dominant(&self) -> Option<&Source> {
        self.contributions.first().map(|c| &c.source)
    }

    /// The band scaled by a constant (e.g. head to pressure).
    pub fn scaled(&self, factor: f64) -> Band {
        let (a, b) = (self.low * factor, self.high * factor);
        Band {
            low: a.min(b),
            nominal: self.nominal * factor,
            high: a.max(b),
            ..self.clone()
        }
    }

    /// The band shifted by a constant (e.g. loss to required head).
    pub fn shifted(&self, offset: f64) -> Band {
        Band {
            low: self.low + offset,
            nominal: self.nominal + offset,
            high: self.high + offset,
            ..self.clone()
        }
    }
}

/// Standard normal distribution function Φ(x), from the complementary error function of
/// Press et al. (Numerical Recipes, 2nd ed. 1992, §6.2, `erfcc`, from memory: fractional
/// error below 1.2e-7 everywhere), ample for a coverage factor.
fn normal_cdf(x: f64) -> f64 {
    let z = x.abs() / std::f64::consts::SQRT_2;
    let t = 1.0 / (1.0 + 0.5 * z);
    let poly = -z * z - 1.265_512_23
        + t * (1.000_023_68
            + t * (0.374_091_96
                + t * (0.096_784_18
                    + t * (-0.186_288_06
                        + t * (0.278_868_07
                            + t * (-1.135_203_98
                                + t * (1.488_515_87 + t * (-0.822_152_23 + t * 0.170_872_77))))))));
    let erfc = t * math::exp(poly);
    if x >= 0.0 {
        1.0 - 0.5 * erfc
    } else {
        0.5 * erfc
    }
}

/// 95 % half-width, in units of the combined standard uncertainty, of a rectangular
/// variable carrying `share` of the variance plus an independent normal carrying the rest.
///
/// `P(|R + N| ≤ q) = σ/(2a)·[H((q+a)/σ) − H((q−a)/σ) − H((a−q)/σ) + H((−q−a)/σ)]` with
/// `H(t) = t·Φ(t) + φ(t)` (an antiderivative of Φ), solved for `q` by bisection.
fn k95(share: f64) -> f64 {
    let a = (3.0 * share).sqrt();
    let sigma = (1.0 - share).max(0.0).sqrt();
    if sigma < 1e-6 {
        return 0.95 * a;
    }
    let h =
        |t: f64| t * normal_cdf(t) + math::exp(-0.5 * t * t) / (2.0 * std::f64::consts::PI).sqrt();
    let p = |q: f64| {
        if a < 1e-9 {
            return 2.0 * normal_cdf(q / sigma) - 1.0;
        }
        sigma / (2.0 * a)
            * (h((q + a) / sigma) - h((q - a) / sigma) - h((a - q) / sigma) + h((-q - a) / sigma))
    };
    let (mut lo, mut hi) = (0.0, a + 3.0 * sigma);
    for _ in 0..80 {
        let mid = 0.5 * (lo + hi);
        if p(mid) < 0.95 {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

/// Intervals of the tabulated coverage factor.
const K_TABLE: usize = 1024;

/// The coverage factor of a band whose largest rectangular input carries `share` (0…1)
/// of the variance.
///
/// Rule: the exact 95 % factor `k₉₅(share)` of that rectangular input convolved with a
/// normal standing for all the rest (a dominant rectangular input makes the output far
/// from normal, JCGM 100:2008 annex G.2), plus `(2 − k₉₅(0))·(1 − share)`, so that an
/// output with no rectangular input gets the customary k = 2 (§6.3.3) and the factor
/// moves continuously to `0.95·√3 ≈ 1.645` for a single rectangular input, whose 95 %
/// interval is ±0.95 of its half-width and never leaves its range. Tabulated once and
/// interpolated linearly.
pub fn coverage_factor(share: f64) -> f64 {
    static TABLE: OnceLock<Vec<f64>> = OnceLock::new();
    let t = TABLE.get_or_init(|| {
        let k0 = k95(0.0);
        (0..=K_TABLE)
            .map(|i| {
                let s = i as f64 / K_TABLE as f64;
                k95(s) + (COVERAGE_FACTOR - k0) * (1.0 - s)
            })
            .collect()
    });
    let x = share.clamp(0.0, 1.0) * K_TABLE as f64;
    let i = (x.floor() as usize).min(K_TABLE - 1);
    let f = x - i as f64;
    t[i] + f * (t[i + 1] - t[i])
}

/// Relative standard uncertainty of a rectangular distribution of relative half-width
/// `spread` (JCGM 100:2008 §4.3.7: a/√3).
pub fn rectangular(spread: f64) -> f64 {
    spread / 3f64.sqrt()
}

/// Standard uncertainty of ln ε for ε log-uniform on `[low, high]` (ln ε rectangular:
/// ln(high/low)/√12), and the offset of the mean of ln ε from ln `nominal`.
pub fn log_uniform(nominal: f64, low: f64, high: f64) -> (f64, f64) {
    let (a, b) = (math::ln(low), math::ln(high));
    ((b - a) / 12f64.sqrt(), 0.5 * (a + b) - math::ln(nominal))
}

/// Sample count the bindings use for [`monte_carlo`] when none is given. JCGM 101:2008
/// §7.2.2 suggests M ≥ 10⁴/(1 − p), 2·10⁵ for p = 0.95 (from memory), when the quantiles
/// themselves are the result; as a check of the first-order band a tenth of that settles
/// the mean and standard deviation to well under 1 % and runs in a fraction of a second.
pub const MONTE_CARLO_SAMPLES: usize = 20_000;

mod monte;
mod options;
pub use monte::{
    BAND_MONTE_CARLO_SEED, MAX_SAMPLES, MIN_SAMPLES, MonteCarlo, band_monte_carlo, monte_carlo,
};
pub use options::UncertaintyOptions;

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn contributions_sum_to_one_and_are_sorted() {
        let b = Band::from_terms(
            10.0,
            [
                (Source::Density, Term::of(0.1)),
                (Source::FrictionModel, Term::of(0.3)),
                (Source::Viscosity, Term::of(0.0)),
            ],
        );
        let s: f64 = b.contributions.iter().map(|c| c.share).sum();
        assert!((s - 1.0).abs() < 1e-15);
        assert_eq!(b.dominant(), Some(&Source::FrictionModel));
        assert_eq!(b.contributions.len(), 2);
        // GUM: u² = 0.1² + 0.3² = 0.10 with normal inputs only, so k = 2.
        assert_eq!(b.coverage, Coverage::Normal);
        assert!((b.half_width() - 2.0 * 0.1f64.sqrt()).abs() < 1e-15);
        assert!(b.low < b.nominal && b.nominal < b.high);
    }

    #[test]
    fn coverage_factor_limits() {
        // Exact: a rectangular variable on ±a has its 95 % interval at ±0.95a, and
        // u = a/√3, so k = 0.95·√3.
        assert!((coverage_factor(1.0) - 0.95 * 3f64.sqrt()).abs() < 1e-9);
        // Customary k = 2 for a normal output (JCGM 100:2008 §6.3.3).
        assert!((coverage_factor(0.0) - 2.0).abs() < 1e-6);
        // k₉₅ of a normal alone is 1.959964 (scipy.stats.norm.ppf(0.975)).
        assert!((k95(0.0) - 1.959_964).abs() < 1e-5);
        // Monotone between the two limits.
        let mut last = f64::INFINITY;
        for i in 0..=100 {
            let k = coverage_factor(i as f64 / 100.0);
            assert!(k <= last + 1e-12, "{i}");
            last = k;
        }
        // Equal rectangular and normal variances: the convolution's 95 % point checked by
        // a direct numerical integration (midpoint rule, 20 000 panels) of
        // P(|R + N| ≤ q), exact formula of the sum's density.
        let share: f64 = 0.5;
        let (a, sigma) = ((3.0 * share).sqrt(), (1.0 - share).sqrt());
        let q = k95(share);
        let n = 20_000;
        let mut p = 0.0;
        for i in 0..n {
            let x = -a + (i as f64 + 0.5) * 2.0 * a / n as f64;
            p += normal_cdf((q - x) / sigma) - normal_cdf((-q - x) / sigma);
        }
        p /= n as f64;
        assert!((p - 0.95).abs() < 1e-6, "{p}");
    }

    #[test]
    fn shifts_move_the_centre_and_rectangular_dominance_narrows_k() {
        let b = Band::from_terms(
            1.0,
            [(
                Source::Material("pvc".into()),
                Term {
                    u: 0.1,
                    shift: 0.05,
                },
            )],
        );
        assert_eq!(b.coverage, Coverage::DominantRectangular);
        let a = 0.1 * 3f64.sqrt();
        assert!((b.low - (1.05 - 0.95 * a)).abs() < 1e-9);
        assert!((b.high - (1.05 + 0.95 * a)).abs() < 1e-9);
        assert!((b.standard_uncertainty() - 0.1).abs() < 1e-12);
    }

    #[test]
    fn source_names_and_kinds() {
        let s = Source::Branch {
            branch: 1,
            source: Box::new(Source::FittingK {
                element: 4,
                name: "k".into(),
            }),
        };
        assert_eq!(s.name(), "branch 1: K of k (element 4)");
        assert_eq!(s.kind(), "fitting_k");
        assert_eq!(s.shape(), Shape::Rectangular);
        assert_eq!(
            Source::CatalogueK("into_tank".into()).name(),
            "K of into_tank"
        );
        assert!(!Source::CatalogueK("into_tank".into()).is_element_scoped());
        assert!(Source::PipeRoughness { element: 0 }.is_element_scoped());
        assert_eq!(Source::Density.shape(), Shape::Normal);
    }

    #[test]
    fn unknown_independent_material_is_an_error() {
        let o = UncertaintyOptions {
            independent_materials: vec!["unobtainium".into()],
            ..UncertaintyOptions::default()
        };
        let e = o.validate().unwrap_err();
        assert_eq!(e.kind(), crate::ErrorKind::UnknownName);
        assert!(e.to_string().contains("independent_materials"), "{e}");
        assert!(e.to_string().contains("commercial_steel"), "{e}");
    }

    #[test]
    fn presets_by_name() {
        assert_eq!(
            UncertaintyOptions::preset("default").unwrap(),
            UncertaintyOptions::default()
        );
        assert_eq!(
            UncertaintyOptions::preset("none").unwrap(),
            UncertaintyOptions::none()
        );
        let m = UncertaintyOptions::preset("model_only").unwrap();
        assert_eq!(m, UncertaintyOptions::model_only());
        assert!(m.friction_model && !m.roughness && !m.fluid && !m.fittings);
        for name in UncertaintyOptions::PRESETS {
            assert!(UncertaintyOptions::preset(name).is_ok(), "{name}");
        }
        let e = UncertaintyOptions::preset("all").unwrap_err();
        assert_eq!(e.kind(), crate::ErrorKind::UnknownName);
        assert!(e.to_string().contains("default, none, model_only"), "{e}");
    }

    #[test]
    fn zero_sources_give_an_exact_band() {
        let b = Band::from_terms(3.0, []);
        assert_eq!((b.low, b.high), (3.0, 3.0));
        assert!(b.contributions.is_empty());
    }
}
