//! The published methods that give a fitting's resistance coefficient K.
//!
//! Each method evaluates to a [`Resistance`] at its own reference bore `d` (m), with the
//! Reynolds number and the velocity both taken in that bore. [`super::Fitting`] then
//! refers the result to whatever bore the caller asks for.

use super::Resistance;
use crate::error::{Error, Result, check};
use crate::friction::{Correlation, Options, darcy_factor};
use crate::math;
use crate::units::{BAR, GPM, INCH, M3_PER_HOUR, PSI};
use serde::{Deserialize, Serialize};
use std::f64::consts::PI;

/// Absolute roughness of clean commercial steel, 0.045 mm (common practice; Moody 1944
/// lists 0.046 mm, from memory). Fittings are cast or forged and are never smoother than
/// this, and published L/D data were reduced with the fully rough factor of clean steel
/// (Crane Co., Technical Paper 410, 1988, from memory), so the fully rough factor used
/// for L/D fittings and bends never falls below that of steel of the same bore.
pub const FITTING_WALL_ROUGHNESS: f64 = 0.045e-3;

/// Density of water at 60 °F (15.556 °C) and 101.325 kPa, kg/m³: 999.017 (IAPWS-95 through
/// the iapws library, rounded to six digits). Cv is defined for water of specific
/// gravity 1 "relative to water at 60 °F" (ANSI/ISA-75.01, from memory), so this is the
/// density of the liquid in the definition.
pub const CV_REFERENCE_DENSITY: f64 = 999.017;

/// Density of the water in the definition of Kv, kg/m³: 1000. Kv is the flow in m³/h of
/// water at 1 bar drop with relative density ρ/ρ₀ = 1, ρ₀ = 1000 kg/m³ (IEC 60534-2-1 and
/// VDI/VDE 2173, from memory).
pub const KV_REFERENCE_DENSITY: f64 = 1000.0;

/// K = [`CV_K_FACTOR`] · d⁴ / Cv² with d the bore in metres.
///
/// From Δp = K ρ V²/2 with V = 4Q/(π d²) and the definition Q = Cv · gpm · √(Δp/psi) at
/// ρ = [`CV_REFERENCE_DENSITY`]: K = π² psi / (8 ρ gpm²) · d⁴/Cv², with psi and gpm in SI
/// from the exact NIST SP 811 factors. Value ≈ 2.139 × 10⁹ m⁻⁴ (890.3 with d in inches).
pub const CV_K_FACTOR: f64 = PI * PI * PSI / (8.0 * CV_REFERENCE_DENSITY * GPM * GPM);

/// K = [`KV_K_FACTOR`] · d⁴ / Kv² with d the bore in metres; derived as [`CV_K_FACTOR`]
/// with m³/h, bar and [`KV_REFERENCE_DENSITY`]. Value ≈ 1.599 × 10⁹ m⁻⁴ (1.599 × 10⁻³ with
/// d in millimetres).
pub const KV_K_FACTOR: f64 =
    PI * PI * BAR / (8.0 * KV_REFERENCE_DENSITY * M3_PER_HOUR * M3_PER_HOUR);

/// Inlet from a tank through a square (sharp-edged) entrance, K = 0.5 (Crane Co., TP-410,
/// 1988, from memory; common practice).
pub const K_FROM_TANK_SQUARE: f64 = 0.5;
/// Inlet from a tank through a pipe end projecting into it (re-entrant entrance), K = 0.78
/// (Crane Co., TP-410, 1988, from memory).
pub const K_FROM_TANK_REENTRANT: f64 = 0.78;
/// Outlet into a large tank, K = 1: the whole kinetic energy of a uniform stream is
/// lost (Borda–Carnot with an infinite outlet; exact).
pub const K_INTO_TANK: f64 = 1.0;

/// The edge of the pipe end where flow enters it from a tank.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(tag = "edge", rename_all = "snake_case")]
pub enum Edge {
    /// Square (sharp-edged) end flush with the tank wall, K = 0.5.
    Square,
    /// Rounded end of radius r = `r_over_d` · d, K from the Crane TP-410 table.
    Rounded {
        /// Radius of the rounding over the bore, ≥ 0.
        r_over_d: f64,
    },
    /// Pipe end projecting into the tank (re-entrant entrance), K = 0.78.
    Reentrant,
}

impl Edge {
    /// The names of the edges in the order of the C constants `HG_EDGE_*`.
    pub const NAMES: [&'static str; 3] = ["square", "rounded", "reentrant"];

    /// The edge called `name` (one of [`Edge::NAMES`]); `r_over_d` (the rounding radius
    /// over the bore, ≥ 0) is given for a rounded edge and only for it.
    ///
    /// # Errors
    /// An unknown name; a rounded edge without `r_over_d`; `r_over_d` with another edge;
    /// `r_over_d` negative or not finite.
    pub fn named(name: &str, r_over_d: Option<f64>) -> Result<Edge> {
        let edge = match (name, r_over_d) {
            ("rounded", Some(r_over_d)) => {
                check::non_negative("r_over_d", r_over_d)?;
                Edge::Rounded { r_over_d }
            }
            ("rounded", None) => {
                return Err(Error::invalid(
                    "r_over_d",
                    "a rounded edge needs its rounding radius over the bore, r_over_d",
                ));
            }
            ("square" | "reentrant", Some(r_over_d)) => {
                return Err(Error::invalid(
                    "r_over_d",
                    format!("r_over_d = {r_over_d} applies only to a rounded edge, not to {name}"),
                ));
            }
            ("square", None) => Edge::Square,
            ("reentrant", None) => Edge::Reentrant,
            _ => return Err(Error::unknown_name("edge", name, &Edge::NAMES)),
        };
        Ok(edge)
    }

    /// The edge's name, as Python and the C constants spell it: `"square"`,
    /// `"rounded"`, `"reentrant"`.
    pub fn name(&self) -> &'static str {
        match self {
            Edge::Square => "square",
            Edge::Rounded { .. } => "rounded",
            Edge::Reentrant => "reentrant",
        }
    }
}

/// Rounded entrance: K against r/d, Crane Co., TP-410 (1988), typed from memory;
/// interpolated linearly, K = 0.04 beyond r/d = 0.15.
const ROUNDED_ENTRANCE: [(f64, f64); 6] = [
    (0.0, 0.5),
    (0.02, 0.28),
    (0.04, 0.24),
    (0.06, 0.15),
    (0.10, 0.09),
    (0.15, 0.04),
];

/// How a fitting's K is obtained. Every length is in metres, every angle in degrees.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(tag = "method", rename_all = "snake_case")]
pub enum Method {
    /// A fixed resistance coefficient K (dimensionless).
    K {
        /// K, ≥ 0.
        k: f64,
    },
    /// Equivalent length: K = f_T · (L/D) with f_T the fully rough Darcy factor of the
    /// adjoining pipe (never below that of clean commercial steel, see
    /// [`FITTING_WALL_ROUGHNESS`]).
    EquivalentLength {
        /// L/D, ≥ 0.
        l_over_d: f64,
    },
    /// Hooper (1981): K = K₁/Re + K∞ (1 + 1/D) with D the bore in inches.
    TwoK {
        /// K₁, ≥ 0.
        k1: f64,
        /// K∞, ≥ 0.
        k_inf: f64,
    },
    /// Darby (1999, 2001): K = K₁/Re + Kᵢ (1 + K_d / D^0.3) with D the bore in inches.
    ThreeK {
        /// K₁, ≥ 0.
        k1: f64,
        /// Kᵢ, ≥ 0.
        k_inf: f64,
        /// K_d, ≥ 0 (inches^0.3).
        k_d: f64,
    },
    /// Sudden expansion, Borda–Carnot: K = (1 − (d_in/d_out)²)² on the inlet velocity.
    Expansion {
        /// Inlet bore (m).
        d_in: f64,
        /// Outlet bore (m), > d_in.
        d_out: f64,
    },
    /// Sudden contraction, Crane TP-410 (1988): K = 0.5 (1 − β²), β = d_out/d_in, on the
    /// outlet velocity.
    Contraction {
        /// Inlet bore (m).
        d_in: f64,
        /// Outlet bore (m), < d_in.
        d_out: f64,
    },
    /// Inlet from a tank through a pipe end with the given edge.
    FromTank {
        /// The edge of the pipe end.
        #[serde(flatten)]
        edge: Edge,
    },
    /// Outlet into a tank, K = 1.
    IntoTank,
    /// Smooth bend (Rennels & Hudson, 2012).
    Bend {
        /// Bend angle in degrees, 0…180.
        angle_deg: f64,
        /// Centre-line radius over bore, ≥ 0.5.
        r_over_d: f64,
    },
    /// Valve flow coefficient Cv (US gal/min of water at 60 °F with 1 psi drop).
    Cv {
        /// Cv, > 0.
        cv: f64,
    },
    /// Valve flow coefficient Kv (m³/h of water with 1 bar drop).
    Kv {
        /// Kv, > 0.
        kv: f64,
    },
}

impl Method {
    /// A short snake_case name of the method, e.g. `"three_k"`.
    pub fn name(&self) -> &'static str {
        match self {
            Method::K { .. } => "k",
            Method::EquivalentLength { .. } => "equivalent_length",
            Method::TwoK { .. } => "two_k",
            Method::ThreeK { .. } => "three_k",
            Method::Expansion { .. } => "expansion",
            Method::Contraction { .. } => "contraction",
            Method::FromTank { edge: Edge::Square } => "from_tank_square",
            Method::FromTank {
                edge: Edge::Rounded { .. },
            } => "from_tank_rounded",
            Method::FromTank {
                edge: Edge::Reentrant,
            } => "from_tank_reentrant",
            Method::IntoTank => "into_tank",
            Method::Bend { .. } => "bend",
            Method::Cv { .. } => "cv",
            Method::Kv { .. } => "kv",
        }
    }

    /// The published source of the method, for reports.
    pub fn source(&self) -> &'static str {
        match self {
            Method::K { .. } => "given resistance coefficient",
            Method::EquivalentLength { .. } => {
                "equivalent length with the fully rough factor (Crane TP-410, 1988, practice)"
            }
            Method::TwoK { .. } => "2-K method (Hooper, 1981)",
            Method::ThreeK { .. } => "3-K method (Darby, 1999, 2001)",
            Method::Expansion { .. } => "Borda–Carnot (exact momentum balance)",
            Method::Contraction { .. } => "Crane TP-410 (1988), sudden contraction, from memory",
            Method::FromTank { .. } => "Crane TP-410 (1988) entrance data, from memory",
            Method::IntoTank => "Borda–Carnot with an infinite outlet (exact)",
            Method::Bend { .. } => "Rennels & Hudson (2012) bend formula, from memory",
            Method::Cv { .. } => "definition of Cv (ANSI/ISA-75.01) with exact NIST SP 811 factors",
            Method::Kv { .. } => "definition of Kv (IEC 60534) with exact NIST SP 811 factors",
        }
    }

    /// The default relative half-width of K for a fitting built with this method
    /// (common practice: fitting data scatter by ±20–50 %; a maker's Cv by about ±10 %).
    pub fn default_spread(&self) -> f64 {
        match self {
            Method::K { .. } | Method::EquivalentLength { .. } => 0.3,
            Method::TwoK { .. } => 0.35,
            Method::ThreeK { .. } => 0.25,
            Method::Expansion { .. } | Method::IntoTank => 0.1,
            Method::Contraction { .. } | Method::FromTank { edge: Edge::Square } => 0.2,
            Method::FromTank { .. } => 0.3,
            Method::Bend { .. } => 0.3,
            Method::Cv { .. } | Method::Kv { .. } => 0.1,
        }
    }

    /// The fixed reference bore of methods defined by their own geometry.
    pub(crate) fn own_diameter(&self) -> Option<f64> {
        match *self {
            Method::Expansion { d_in, .. } => Some(d_in),
            Method::Contraction { d_out, .. } => Some(d_out),
            _ => None,
        }
    }

    /// K at reference bore `d` (m), velocity and Reynolds number taken in that bore.
    /// `rel_roughness` is ε/D of the adjoining pipe (used by L/D and bends only).
    pub(crate) fn resistance_at(&self, d: f64, rel_roughness: f64) -> Result<Resistance> {
        let inertial = |k| Resistance {
            k_viscous: 0.0,
            k_inertial: k,
        };
        Ok(match *self {
            Method::K { k } => inertial(k),
            Method::EquivalentLength { l_over_d } => {
                inertial(fully_rough_factor(rel_roughness, d)? * l_over_d)
            }
            Method::TwoK { k1, k_inf } => Resistance {
                k_viscous: k1,
                k_inertial: k_inf * (1.0 + INCH / d),
            },
            Method::ThreeK { k1, k_inf, k_d } => Resistance {
                k_viscous: k1,
                k_inertial: k_inf * (1.0 + k_d / math::pow(d / INCH, 0.3)),
            },
            Method::Expansion { d_in, d_out } => {
                let area_ratio = math::powi(d_in / d_out, 2);
                inertial(math::powi(1.0 - area_ratio, 2))
            }
            Method::Contraction { d_in, d_out } => {
                let area_ratio = math::powi(d_out / d_in, 2);
                inertial(0.5 * (1.0 - area_ratio))
            }
            Method::FromTank { edge } => inertial(match edge {
                Edge::Square => K_FROM_TANK_SQUARE,
                Edge::Rounded { r_over_d } => rounded_entrance(r_over_d),
                Edge::Reentrant => K_FROM_TANK_REENTRANT,
            }),
            Method::IntoTank => inertial(K_INTO_TANK),
            Method::Bend {
                angle_deg,
                r_over_d,
            } => inertial(bend(
                angle_deg,
                r_over_d,
                fully_rough_factor(rel_roughness, d)?,
            )),
            Method::Cv { cv } => inertial(CV_K_FACTOR * math::powi(d, 4) / (cv * cv)),
            Method::Kv { kv } => inertial(KV_K_FACTOR * math::powi(d, 4) / (kv * kv)),
        })
    }
}

/// Fully rough Darcy factor f_T for a pipe of relative roughness `rel_roughness` and a
/// fitting of bore `d` (m), floored at clean commercial steel of that bore.
pub fn fully_rough_factor(rel_roughness: f64, d: f64) -> Result<f64> {
    let floor = FITTING_WALL_ROUGHNESS / d;
    let rr = rel_roughness
        .max(floor)
        .min(crate::friction::MAX_REL_ROUGHNESS);
    // The fully rough law ignores Re; any turbulent value will do.
    let fr = darcy_factor(1e8, rr, &Options::with_correlation(Correlation::FullyRough))?;
    Ok(fr.f)
}

/// K of a rounded entrance: linear interpolation in the Crane TP-410 table.
fn rounded_entrance(r_over_d: f64) -> f64 {
    let mut prev = ROUNDED_ENTRANCE[0];
    for &(x, k) in &ROUNDED_ENTRANCE[1..] {
        if r_over_d <= x {
            let t = (r_over_d - prev.0) / (x - prev.0);
            return prev.1 + t * (k - prev.1);
        }
        prev = (x, k);
    }
    prev.1
}

/// K of a smooth bend of angle α and relative radius r/d with Darcy factor f
/// (Rennels & Hudson, 2012, Pipe Flow: A Practical and Comprehensive Guide, typed from
/// memory):
///
/// K = f α (r/d) + (0.10 + 2.4 f) sin(α/2) + 6.6 f (√sin(α/2) + sin(α/2)) / (r/d)^(4α/π)
///
/// with α in radians. The first term is the friction of the bend's own length, the rest
/// the secondary-flow and separation losses.
fn bend(angle_deg: f64, r_over_d: f64, f: f64) -> f64 {
    let a = angle_deg.to_radians();
    let s = math::sin(a / 2.0);
    f * a * r_over_d
        + (0.10 + 2.4 * f) * s
        + 6.6 * f * (s.sqrt() + s) / math::pow(r_over_d, 4.0 * a / PI)
}
