//! Uncertainty bands: an honest range around every result.
//!
//! Follows the GUM (JCGM 100:2008): each uncertain input `θ` is given a relative standard
//! uncertainty `u(θ)/θ`; a result `y` gets the first-order standard uncertainty
//! `u(y)² = Σ_s (Σ_i ∂y_i/∂ln θ_s · u_rel(θ_s))²` from the analytic sensitivities the core
//! already computes (not finite differences), and the band is `y ± k·u(y)` with coverage
//! factor `k = 2` (about 95 % for a near-normal output). Within one source the elements
//! are taken as fully correlated (one friction model, one roughness estimate, one diameter
//! tolerance for the whole line: the cautious choice); different sources, and different
//! fittings, are independent.
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
//! | roughness | (high − low)/√12 of the material range, else a factor of 2 either way | rectangular (common practice) |
//! | diameter | user tolerance, default none | |
//! | density, viscosity | the fluid's own | IAPWS / Sutherland statements |
//! | fitting K | spread/√3 (spread = half-width, rectangular) | catalogue, common practice |
//! | equipment | spread/√3 | user, default ±10 % |
//!
//! [`monte_carlo`] propagates the same inputs by sampling (JCGM 101:2008) for checking.

use serde::{Deserialize, Serialize};

/// Coverage factor of every band (JCGM 100:2008 §6.2: k = 2, about 95 %).
pub const COVERAGE_FACTOR: f64 = 2.0;

/// One source's share of a band's variance.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Contribution {
    /// The source, e.g. "friction model", "roughness", "K of gate_valve (element 4)".
    pub source: String,
    /// Share of the variance, 0…1; the shares of a band sum to 1.
    pub share: f64,
}

/// A result with its expanded uncertainty: `low ≤ nominal ≤ high`.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Band {
    /// Lower end, nominal − k·u (same unit as the nominal value).
    pub low: f64,
    /// The nominal result.
    pub nominal: f64,
    /// Upper end, nominal + k·u.
    pub high: f64,
    /// Each source's share of the variance, largest first; empty when the band has no
    /// width (for example at zero flow).
    pub contributions: Vec<Contribution>,
}

impl Band {
    /// A band of zero width.
    pub fn exact(nominal: f64) -> Band {
        Band {
            low: nominal,
            nominal,
            high: nominal,
            contributions: Vec::new(),
        }
    }

    /// A band from per-source standard uncertainties (same unit as `nominal`), combined in
    /// quadrature and expanded with [`COVERAGE_FACTOR`]. Sources with equal names are
    /// merged by adding their variances.
    pub fn from_sources(nominal: f64, sources: &[(String, f64)]) -> Band {
        let mut merged: Vec<(String, f64)> = Vec::new();
        for (name, u) in sources {
            let var = u * u;
            if var == 0.0 || !var.is_finite() {
                continue;
            }
            match merged.iter_mut().find(|(n, _)| n == name) {
                Some((_, v)) => *v += var,
                None => merged.push((name.clone(), var)),
            }
        }
        let total: f64 = merged.iter().map(|(_, v)| v).sum();
        if total == 0.0 {
            return Band::exact(nominal);
        }
        merged.sort_by(|a, b| b.1.total_cmp(&a.1));
        let half = COVERAGE_FACTOR * total.sqrt();
        Band {
            low: nominal - half,
            nominal,
            high: nominal + half,
            contributions: merged
                .into_iter()
                .map(|(source, v)| Contribution {
                    source,
                    share: v / total,
                })
                .collect(),
        }
    }

    /// Half-width k·u of the band.
    pub fn half_width(&self) -> f64 {
        0.5 * (self.high - self.low)
    }

    /// Standard uncertainty u = half-width / k.
    pub fn standard_uncertainty(&self) -> f64 {
        self.half_width() / COVERAGE_FACTOR
    }

    /// The source with the largest share, if any.
    pub fn dominant(&self) -> Option<&str> {
        self.contributions.first().map(|c| c.source.as_str())
    }

    /// The band scaled by a constant (e.g. head to pressure).
    pub fn scaled(&self, factor: f64) -> Band {
        let (a, b) = (self.low * factor, self.high * factor);
        Band {
            low: a.min(b),
            nominal: self.nominal * factor,
            high: a.max(b),
            contributions: self.contributions.clone(),
        }
    }

    /// The band shifted by a constant (e.g. loss to required head).
    pub fn shifted(&self, offset: f64) -> Band {
        Band {
            low: self.low + offset,
            nominal: self.nominal + offset,
            high: self.high + offset,
            contributions: self.contributions.clone(),
        }
    }
}

/// Which sources enter a band, and user values that replace the defaults. Every value
/// is a relative standard uncertainty (k = 1) unless its name says otherwise.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct UncertaintyOptions {
    /// Include the friction correlation's model uncertainty.
    pub friction_model: bool,
    /// Replace the turbulent round-pipe model uncertainty (default 0.05).
    pub turbulent_model: f64,
    /// Replace the laminar model uncertainty (default 0.005).
    pub laminar_model: f64,
    /// Replace the non-circular turbulent model uncertainty (default 0.075).
    pub non_circular_model: f64,
    /// Include wall roughness.
    pub roughness: bool,
    /// Relative standard uncertainty of roughness used when a pipe carries no material
    /// range (default: a factor of 2 either way, rectangular: 1.5/√12 ≈ 0.433).
    pub roughness_default: f64,
    /// Relative standard uncertainty of every bore (manufacturing tolerance); default 0.
    pub diameter: f64,
    /// Include the fluid's density and viscosity uncertainties.
    pub fluid: bool,
    /// Include fitting K spreads.
    pub fittings: bool,
    /// Include equipment spreads.
    pub equipment: bool,
}

impl Default for UncertaintyOptions {
    fn default() -> Self {
        UncertaintyOptions {
            friction_model: true,
            turbulent_model: 0.05,
            laminar_model: 0.005,
            non_circular_model: 0.075,
            roughness: true,
            roughness_default: 1.5 / 12f64.sqrt(),
            diameter: 0.0,
            fluid: true,
            fittings: true,
            equipment: true,
        }
    }
}

impl UncertaintyOptions {
    /// No source at all (every band has zero width).
    pub fn none() -> Self {
        UncertaintyOptions {
            friction_model: false,
            roughness: false,
            diameter: 0.0,
            fluid: false,
            fittings: false,
            equipment: false,
            ..UncertaintyOptions::default()
        }
    }

    /// Only the friction model (for checking the ±10 % statement).
    pub fn model_only() -> Self {
        UncertaintyOptions {
            friction_model: true,
            ..UncertaintyOptions::none()
        }
    }

    /// The names of the presets of [`UncertaintyOptions::preset`], in a fixed order.
    pub const PRESETS: [&'static str; 3] = ["default", "none", "model_only"];

    /// A preset by the name every binding uses: `"default"` ([`Default`]), `"none"`
    /// ([`UncertaintyOptions::none`]) or `"model_only"` ([`UncertaintyOptions::model_only`]).
    ///
    /// # Errors
    /// [`crate::Error::UnknownName`] for any other name.
    pub fn preset(name: &str) -> crate::Result<Self> {
        match name {
            "default" => Ok(UncertaintyOptions::default()),
            "none" => Ok(UncertaintyOptions::none()),
            "model_only" => Ok(UncertaintyOptions::model_only()),
            _ => Err(crate::Error::unknown_name(
                "uncertainty",
                name,
                &UncertaintyOptions::PRESETS,
            )),
        }
    }

    /// Checks every value is finite and non-negative.
    pub fn validate(&self) -> crate::Result<()> {
        use crate::error::check::non_negative;
        non_negative("turbulent_model", self.turbulent_model)?;
        non_negative("laminar_model", self.laminar_model)?;
        non_negative("non_circular_model", self.non_circular_model)?;
        non_negative("roughness_default", self.roughness_default)?;
        non_negative("diameter", self.diameter)?;
        Ok(())
    }
}

/// Relative standard uncertainty of a rectangular distribution of relative half-width
/// `spread` (JCGM 100:2008 §4.3.7: a/√3).
pub fn rectangular(spread: f64) -> f64 {
    spread / 3f64.sqrt()
}

/// Sample count the bindings use for [`monte_carlo`] when none is given. JCGM 101:2008
/// §7.2.2 suggests M ≥ 10⁴/(1 − p), 2·10⁵ for p = 0.95 (from memory), when the quantiles
/// themselves are the result; as a check of the first-order band a tenth of that settles
/// the mean and standard deviation to well under 1 % and runs in a fraction of a second.
pub const MONTE_CARLO_SAMPLES: usize = 20_000;

mod monte;
pub use monte::{MAX_SAMPLES, MIN_SAMPLES, MonteCarlo, monte_carlo};

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn contributions_sum_to_one_and_are_sorted() {
        let b = Band::from_sources(
            10.0,
            &[
                ("a".into(), 0.1),
                ("b".into(), 0.3),
                ("a".into(), 0.1),
                ("c".into(), 0.0),
            ],
        );
        let s: f64 = b.contributions.iter().map(|c| c.share).sum();
        assert!((s - 1.0).abs() < 1e-15);
        assert_eq!(b.dominant(), Some("b"));
        assert_eq!(b.contributions.len(), 2);
        // GUM: u² = 0.1² + 0.1² + 0.3² = 0.11; U = 2u.
        assert!((b.half_width() - 2.0 * 0.11f64.sqrt()).abs() < 1e-15);
        assert!(b.low < b.nominal && b.nominal < b.high);
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
        let b = Band::from_sources(3.0, &[]);
        assert_eq!((b.low, b.high), (3.0, 3.0));
        assert!(b.contributions.is_empty());
    }
}
