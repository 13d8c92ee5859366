//! Minor losses: fittings, valves, entrances, exits and changes of section.
//!
//! A [`Fitting`] is everything in a line that is not straight pipe. Its head loss is
//! h = K · V |V| / 2g₀ ([`head_loss`]), signed with the flow, where V is the mean velocity
//! in the bore K refers to. K may depend on the Reynolds number and the size; every
//! method here has the form K(Re) = k_viscous / Re + k_inertial ([`Resistance`]), so the
//! loss k_viscous·ν V/(2 g₀ d) + k_inertial V|V|/(2 g₀) is well defined through zero flow.
//!
//! | constructor | method | K (velocity in the bore of `diameter`) |
//! |---|---|---|
//! | [`Fitting::k`], [`Fitting::k_referred`] | given K | K |
//! | [`Fitting::equivalent_length`] | L/D | f_T · L/D, f_T fully rough (Crane TP-410 practice) |
//! | [`Fitting::two_k`] | Hooper (1981) | K₁/Re + K∞ (1 + 1/D_in) |
//! | [`Fitting::three_k`] | Darby (1999, 2001) | K₁/Re + Kᵢ (1 + K_d / D_in^0.3) |
//! | [`Fitting::expansion`] | Borda–Carnot (exact momentum balance) | (1 − (d₁/d₂)²)² on V₁ |
//! | [`Fitting::contraction`] | Crane TP-410 (1988) | 0.5 (1 − (d₂/d₁)²) on V₂ |
//! | [`Fitting::from_tank`] (square-edged / rounded / re-entrant entrance) | Crane TP-410 | 0.5 / table in r/d / 0.78 |
//! | [`Fitting::into_tank`] | Borda–Carnot, d₂ → ∞ | 1 |
//! | [`Fitting::bend`] | Rennels & Hudson (2012) | f_T α r/d + (0.10 + 2.4 f_T) sin(α/2) + … |
//! | [`Fitting::cv`], [`Fitting::kv`] | definition of Cv, Kv | [`method::CV_K_FACTOR`] d⁴/Cv², [`method::KV_K_FACTOR`] d⁴/Kv² |
//! | [`Fitting::tee_run`], [`Fitting::tee_branch`] | Darby 3-K | catalogue constants |
//! | [`Fitting::named`] | [`catalogue`] | per entry |
//!
//! D_in is the bore in inches. Darby's table is written for the nominal size in inches;
//! the bore stands in for it here because a line knows bores, not nominal sizes (the two
//! differ by a few per cent, and the 0.3 power shrinks that further).
//!
//! **K referred to another bore.** A K that refers to bore d applies to the velocity in
//! d. At another bore b (same flow), V_d = V_b (b/d)² and Re_d = Re_b (b/d), so the same
//! loss is K_b(Re_b) = (b/d)³ k_viscous / Re_b + (b/d)⁴ k_inertial: the familiar fourth
//! power of the diameter ratio for the inertial part.
//!
//! # Example
//! ```
//! use hydrograde::fitting::{Fitting, head_loss};
//! // A long-radius elbow (Darby 3-K) in a 2 in bore at Re = 5e4:
//! // K = 800/5e4 + 0.056 (1 + 3.9/2^0.3) = 0.2494
//! let elbow = Fitting::named("elbow_90_long_radius").unwrap();
//! let (k, dk_dre) = elbow.k_at(5e4, 0.0508, 0.0).unwrap();
//! assert!((k - 0.2494).abs() < 1e-4 && dk_dre < 0.0);
//! let h = head_loss(k, 2.0); // m, at 2 m/s
//! assert!((h - 0.0509).abs() < 1e-4);
//! ```
//!
//! **Caution.** Published fitting data scatter widely (±20–50 %, common practice); each
//! fitting carries a relative spread of K ([`Fitting::k_spread`]) that the uncertainty
//! bands use. The catalogue constants were typed from memory of the published tables
//! (see [`catalogue`]); use a maker's data where you have it.

pub mod catalogue;
pub mod method;

pub use catalogue::{CatalogueEntry, catalogue_entries, entry as catalogue_entry};
pub use method::{Edge, Method};

use crate::error::{Error, Result, check};
use crate::units::STANDARD_GRAVITY;
use serde::{Deserialize, Serialize};

/// Minor-loss resistance of a fitting at a given reference bore, split so that zero flow is
/// well defined: K(Re) = k_viscous / Re + k_inertial (both dimensionless). Every method of
/// this module has this form (2-K and 3-K: K₁/Re + …; every other method k_viscous = 0).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Resistance {
    /// Coefficient of 1/Re (K₁ of the 2-K and 3-K methods), ≥ 0.
    pub k_viscous: f64,
    /// The Reynolds-independent part of K, ≥ 0.
    pub k_inertial: f64,
}

impl Resistance {
    /// K at Reynolds number `re` (> 0): k_viscous/re + k_inertial.
    #[inline]
    pub fn k(&self, re: f64) -> f64 {
        self.k_viscous / re + self.k_inertial
    }

    /// ∂K/∂Re at Reynolds number `re` (> 0): −k_viscous/re².
    #[inline]
    pub fn dk_dre(&self, re: f64) -> f64 {
        -self.k_viscous / (re * re)
    }

    /// The same loss expressed on the velocity and Reynolds number of bore `to` (m),
    /// when this resistance refers to bore `from` (m); see the module doc.
    #[inline]
    fn referred(self, from: f64, to: f64) -> Resistance {
        if from == to {
            return self;
        }
        let r = to / from;
        let r3 = r * r * r;
        Resistance {
            k_viscous: self.k_viscous * r3,
            k_inertial: self.k_inertial * r3 * r,
        }
    }
}

/// Head loss (m) of resistance coefficient `k` at mean velocity `velocity` (m/s, signed):
/// h = k · v · |v| / (2 g₀), g₀ = [`STANDARD_GRAVITY`]. Odd in v, so reverse flow gives a
/// negative loss.
#[inline]
pub fn head_loss(k: f64, velocity: f64) -> f64 {
    k * velocity * velocity.abs() / (2.0 * STANDARD_GRAVITY)
}

/// ∂h/∂v (s) of [`head_loss`] at fixed K: k · |v| / g₀.
#[inline]
pub fn head_loss_dv(k: f64, velocity: f64) -> f64 {
    k * velocity.abs() / STANDARD_GRAVITY
}

/// A minor-loss element: a method giving K, the bore K refers to, the relative spread of
/// K and (for catalogue fittings) its name. Deserialising runs the same checks as the
/// constructors.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "FittingData")]
pub struct Fitting {
    method: Method,
    diameter: Option<f64>,
    k_spread: f64,
    name: Option<String>,
}

/// The largest fixed resistance coefficient accepted; see [`Fitting::MAX_K`].
pub const MAX_K: f64 = Fitting::MAX_K;

impl Fitting {
    fn from_method(method: Method) -> Fitting {
        Fitting {
            method,
            diameter: method.own_diameter(),
            k_spread: method.default_spread(),
            name: None,
        }
    }

    /// The largest fixed K accepted. Published K values stop in the thousands (a nearly
    /// closed valve; from memory); a K of 1e6 already costs 51 km of head at 1 m/s. Beyond
    /// it a "fitting" is a closed line, and the inverse solvers would return flows so
    /// small that no stated tolerance means anything.
    pub const MAX_K: f64 = 1e6;

    /// Checks a fixed K: finite, not negative, at most [`Fitting::MAX_K`]; errors name `k`.
    pub fn check_k(value: f64) -> Result<f64> {
        let k = check::non_negative("k", value)?;
        if k > Fitting::MAX_K {
            return Err(Error::out_of_range(
                "k",
                k,
                format!(
                    "must not exceed {:e} (a larger K is a closed line, not a fitting)",
                    Fitting::MAX_K
                ),
            ));
        }
        Ok(k)
    }

    /// A fixed resistance coefficient `value` (dimensionless, 0 … [`Fitting::MAX_K`]) on
    /// the velocity of the adjoining pipe.
    ///
    /// # Errors
    /// `k` not finite, negative or above [`Fitting::MAX_K`].
    pub fn k(value: f64) -> Result<Fitting> {
        Fitting::check_k(value)?;
        Ok(Fitting::from_method(Method::K { k: value }))
    }

    /// A resistance coefficient `value` (≥ 0) that refers to the velocity in bore
    /// `ref_diameter` (m, > 0); at another bore b it becomes value · (b/ref_diameter)⁴.
    ///
    /// # Errors
    /// `k` negative or `diameter` not positive (either not finite).
    pub fn k_referred(value: f64, ref_diameter: f64) -> Result<Fitting> {
        Fitting::k(value)?.with_diameter(ref_diameter)
    }

    /// An equivalent length `l_over_d` (L/D, dimensionless, ≥ 0): K = f_T · L/D with f_T
    /// the fully rough Darcy factor of the adjoining pipe's relative roughness, floored at
    /// clean commercial steel of the same bore (see [`method::FITTING_WALL_ROUGHNESS`];
    /// common practice after Crane TP-410).
    ///
    /// # Errors
    /// `l_over_d` not finite or negative.
    pub fn equivalent_length(l_over_d: f64) -> Result<Fitting> {
        check::non_negative("l_over_d", l_over_d)?;
        Ok(Fitting::from_method(Method::EquivalentLength { l_over_d }))
    }

    /// The 2-K method (Hooper, 1981): K = k1/Re + k_inf (1 + 1/D), D the bore in inches.
    ///
    /// # Errors
    /// `k1` or `k_inf` not finite or negative.
    pub fn two_k(k1: f64, k_inf: f64) -> Result<Fitting> {
        check::non_negative("k1", k1)?;
        check::non_negative("k_inf", k_inf)?;
        Ok(Fitting::from_method(Method::TwoK { k1, k_inf }))
    }

    /// The 3-K method (Darby, 1999 and 2001): K = k1/Re + k_inf (1 + k_d / D^0.3), D the
    /// bore in inches.
    ///
    /// # Errors
    /// `k1`, `k_inf` or `k_d` not finite or negative.
    pub fn three_k(k1: f64, k_inf: f64, k_d: f64) -> Result<Fitting> {
        check::non_negative("k1", k1)?;
        check::non_negative("k_inf", k_inf)?;
        check::non_negative("k_d", k_d)?;
        Ok(Fitting::from_method(Method::ThreeK { k1, k_inf, k_d }))
    }

    /// A sudden expansion from bore `d_in` to bore `d_out` (m), Borda–Carnot:
    /// K = (1 − (d_in/d_out)²)² on the inlet velocity, exact from the momentum balance
    /// for uniform velocity. Its diameter is `d_in`.
    ///
    /// # Errors
    /// Either bore not positive, or `d_out` not larger than `d_in`.
    pub fn expansion(d_in: f64, d_out: f64) -> Result<Fitting> {
        check::positive("d_in", d_in)?;
        check::positive("d_out", d_out)?;
        if d_out <= d_in {
            return Err(Error::out_of_range(
                "d_out",
                d_out,
                format!("an expansion's outlet must be larger than its inlet (d_in = {d_in})"),
            ));
        }
        Ok(Fitting::from_method(Method::Expansion { d_in, d_out }))
    }

    /// A sudden contraction from bore `d_in` to bore `d_out` (m): K = 0.5 (1 − β²),
    /// β = d_out/d_in, on the outlet velocity (Crane Co., Technical Paper 410, 1988,
    /// formula for a contraction of angle 180°, from memory). Its diameter is `d_out`.
    ///
    /// # Errors
    /// Either bore not positive, or `d_out` not smaller than `d_in`.
    pub fn contraction(d_in: f64, d_out: f64) -> Result<Fitting> {
        check::positive("d_in", d_in)?;
        check::positive("d_out", d_out)?;
        if d_out >= d_in {
            return Err(Error::out_of_range(
                "d_out",
                d_out,
                format!("a contraction's outlet must be smaller than its inlet (d_in = {d_in})"),
            ));
        }
        Ok(Fitting::from_method(Method::Contraction { d_in, d_out }))
    }

    /// An inlet from a tank (a large space at rest) into the pipe, through a pipe end with
    /// the given edge: square (a sharp-edged entrance, K = 0.5), rounded with radius
    /// r = `r_over_d` · d (K from the Crane TP-410 table, 0.5 at r/d = 0 down to 0.04 at
    /// r/d ≥ 0.15, linear in between) or re-entrant (the pipe projects into the tank,
    /// K = 0.78); Crane Co., TP-410 (1988), from memory. A line that starts with one
    /// starts at the tank's surface. With reverse flow it is an outlet into the tank.
    ///
    /// # Errors
    /// A rounded edge's `r_over_d` not finite or negative.
    pub fn from_tank(edge: Edge) -> Result<Fitting> {
        if let Edge::Rounded { r_over_d } = edge {
            check::non_negative("r_over_d", r_over_d)?;
        }
        Ok(Fitting::from_method(Method::FromTank { edge }))
    }

    /// An outlet from the pipe into a large tank, K = 1 (the velocity head is lost; exact
    /// for a uniform stream). With reverse flow it is a square-edged inlet from the tank.
    pub fn into_tank() -> Fitting {
        Fitting::from_method(Method::IntoTank)
    }

    /// A smooth bend of `angle_deg` degrees (0…180) with centre-line radius
    /// `r_over_d` times the bore (≥ 0.5), Rennels & Hudson (2012), with the fully rough
    /// factor f_T of the adjoining pipe as for L/D fittings.
    ///
    /// # Errors
    /// `angle_deg` outside 0…180, `r_over_d` below 0.5 (use a mitre bend from the
    /// catalogue or a K), either not finite.
    pub fn bend(angle_deg: f64, r_over_d: f64) -> Result<Fitting> {
        check::within("angle_deg", angle_deg, 0.0, 180.0, "degrees")?;
        check::finite("r_over_d", r_over_d)?;
        if r_over_d < 0.5 {
            return Err(Error::out_of_range(
                "r_over_d",
                r_over_d,
                "must be at least 0.5 for a smooth bend",
            ));
        }
        Ok(Fitting::from_method(Method::Bend {
            angle_deg,
            r_over_d,
        }))
    }

    /// A valve of flow coefficient Cv = `value` (US gal/min of water at 60 °F per √psi):
    /// K = [`method::CV_K_FACTOR`] · d⁴ / Cv² with d the bore (m). The loss does not
    /// depend on the bore chosen, only K does.
    ///
    /// # Errors
    /// `cv` not finite or not positive.
    pub fn cv(value: f64) -> Result<Fitting> {
        check::positive("cv", value)?;
        Ok(Fitting::from_method(Method::Cv { cv: value }))
    }

    /// A valve of flow coefficient Kv = `value` (m³/h of water per √bar):
    /// K = [`method::KV_K_FACTOR`] · d⁴ / Kv² with d the bore (m).
    ///
    /// # Errors
    /// `kv` not finite or not positive.
    pub fn kv(value: f64) -> Result<Fitting> {
        check::positive("kv", value)?;
        Ok(Fitting::from_method(Method::Kv { kv: value }))
    }

    /// A flanged or welded tee with all the flow passing straight through the run
    /// (catalogue entry `tee_run_flanged`, Darby 3-K). Dividing and combining flows,
    /// whose K depends on the flow split, are not modelled.
    pub fn tee_run() -> Fitting {
        catalogue::fitting_of(&catalogue::TEE_RUN)
    }

    /// A flanged or welded tee with all the flow turning through the branch (catalogue
    /// entry `tee_branch_flanged`, Darby 3-K).
    pub fn tee_branch() -> Fitting {
        catalogue::fitting_of(&catalogue::TEE_BRANCH)
    }

    /// The catalogue fitting called `name` (see [`Fitting::catalogue`]).
    ///
    /// # Errors
    /// [`Error::UnknownName`] listing the catalogue when `name` is not in it.
    pub fn named(name: &str) -> Result<Fitting> {
        catalogue::entry(name).map(catalogue::fitting_of)
    }

    /// The names of the catalogue fittings, in catalogue order.
    pub fn catalogue() -> Vec<&'static str> {
        catalogue_entries().iter().map(|e| e.name).collect()
    }

    /// The method that gives K.
    pub fn method(&self) -> &Method {
        &self.method
    }

    /// Bore (m) whose velocity K refers to; `None` = take the adjoining pipe's inside
    /// diameter.
    pub fn diameter(&self) -> Option<f64> {
        self.diameter
    }

    /// The same fitting with K referring to bore `d` (m).
    ///
    /// # Errors
    /// `diameter` not positive or not finite; [`Error::Invalid`] for an expansion or a
    /// contraction, whose bore is fixed by its own geometry.
    pub fn with_diameter(mut self, d: f64) -> Result<Fitting> {
        check::positive("diameter", d)?;
        if self.method.own_diameter().is_some() {
            return Err(Error::invalid(
                "diameter",
                format!(
                    "{} = {d}: an {}'s K refers to its own bore; build it with other diameters instead",
                    self.name(),
                    self.method.name()
                ),
            ));
        }
        self.diameter = Some(d);
        Ok(self)
    }

    /// Relative half-width of the likely range of K (0.3 for ±30 %), read as a
    /// rectangular distribution by the uncertainty bands.
    pub fn k_spread(&self) -> f64 {
        self.k_spread
    }

    /// The same fitting with another relative spread of K, 0 ≤ `spread` ≤ 1.
    ///
    /// # Errors
    /// `k_spread` outside 0…1 or not finite.
    pub fn with_k_spread(mut self, spread: f64) -> Result<Fitting> {
        self.k_spread = check::within("k_spread", spread, 0.0, 1.0, "")?;
        Ok(self)
    }

    /// True for a catalogue check valve or foot valve, which stops reverse flow; the
    /// head loss formulas themselves stay odd in the flow, so a caller that needs the
    /// valve's behaviour in reverse flow must ask this.
    pub fn blocks_reverse_flow(&self) -> bool {
        self.name
            .as_deref()
            .and_then(|n| catalogue::entry(n).ok())
            .is_some_and(|e| e.blocks_reverse_flow)
    }

    /// Where K comes from: the catalogue entry's source, or the method's publication.
    pub fn source(&self) -> &'static str {
        self.name
            .as_deref()
            .and_then(|n| catalogue::entry(n).ok())
            .map_or_else(|| self.method.source(), |e| e.source)
    }

    /// The catalogue entry this fitting is, if any (every instance of one entry shares
    /// one K error in the bands).
    pub fn catalogue_name(&self) -> Option<&str> {
        self.name.as_deref()
    }

    /// The catalogue name, or the method's name (`"k"`, `"three_k"`, `"expansion"`…).
    pub fn name(&self) -> String {
        match &self.name {
            Some(n) => n.clone(),
            None => self.method.name().to_string(),
        }
    }

    /// K split as k_viscous/Re + k_inertial, with the velocity and the Reynolds number
    /// taken in `bore` (m). `pipe_rel_roughness` is ε/D of the adjoining pipe (used by
    /// L/D fittings and bends for the fully rough factor; 0 for a smooth pipe).
    ///
    /// # Errors
    /// `bore` not positive; `pipe_rel_roughness` negative, above 0.5 or not finite.
    pub fn resistance(&self, bore: f64, pipe_rel_roughness: f64) -> Result<Resistance> {
        check::positive("bore", bore)?;
        check::non_negative("pipe_rel_roughness", pipe_rel_roughness)?;
        let max = crate::friction::MAX_REL_ROUGHNESS;
        if pipe_rel_roughness > max {
            return Err(Error::out_of_range(
                "pipe_rel_roughness",
                pipe_rel_roughness,
                format!("must not exceed {max}"),
            ));
        }
        let own = self.diameter.unwrap_or(bore);
        Ok(self
            .method
            .resistance_at(own, pipe_rel_roughness)?
            .referred(own, bore))
    }

    /// K for flow through the fitting in the reverse direction, referred to the same
    /// `bore` (m) as [`Fitting::resistance`]: a contraction passed backwards is a sudden
    /// expansion (Borda–Carnot) and the reverse, an inlet from a tank is an outlet into a
    /// tank (K = 1) and an outlet into a tank is a square-edged inlet (K = 0.5; the edge
    /// of the outlet is not known). Every other fitting loses the same either way.
    ///
    /// The viscous part is the forward one, so a loss built from the two directions has a
    /// continuous derivative through zero flow (the inertial parts have zero slope there).
    ///
    /// # Errors
    /// As [`Fitting::resistance`].
    pub fn reverse_resistance(&self, bore: f64, pipe_rel_roughness: f64) -> Result<Resistance> {
        let forward = self.resistance(bore, pipe_rel_roughness)?;
        let inertial_at = |k: f64, own: f64| {
            Resistance {
                k_viscous: 0.0,
                k_inertial: k,
            }
            .referred(own, bore)
            .k_inertial
        };
        let k_inertial = match self.method {
            // Backwards: from d_out up to d_in, a sudden expansion on the d_out velocity.
            Method::Contraction { d_in, d_out } => inertial_at(
                crate::math::powi(1.0 - crate::math::powi(d_out / d_in, 2), 2),
                d_out,
            ),
            // Backwards: from d_out down to d_in, a sudden contraction on the d_in velocity.
            Method::Expansion { d_in, d_out } => {
                inertial_at(0.5 * (1.0 - crate::math::powi(d_in / d_out, 2)), d_in)
            }
            Method::FromTank { .. } => {
                inertial_at(method::K_INTO_TANK, self.diameter.unwrap_or(bore))
            }
            Method::IntoTank => {
                inertial_at(method::K_FROM_TANK_SQUARE, self.diameter.unwrap_or(bore))
            }
            _ => forward.k_inertial,
        };
        Ok(Resistance {
            k_viscous: forward.k_viscous,
            k_inertial,
        })
    }

    /// True for an inlet from a tank (square-edged, rounded or re-entrant): a line that
    /// starts with one starts at the tank's surface.
    pub fn is_from_tank(&self) -> bool {
        matches!(self.method, Method::FromTank { .. })
    }

    /// The bores (m) on the upstream and downstream side of a change of section
    /// (contraction or expansion); `None` for every other fitting.
    pub fn transition_bores(&self) -> Option<(f64, f64)> {
        match self.method {
            Method::Contraction { d_in, d_out } | Method::Expansion { d_in, d_out } => {
                Some((d_in, d_out))
            }
            _ => None,
        }
    }

    /// K and ∂K/∂Re at Reynolds number `re` (> 0, in `bore`) and bore `bore` (m).
    ///
    /// # Errors
    /// As [`Fitting::resistance`]; `re` not finite or below [`crate::friction::MIN_REYNOLDS`];
    /// a K that overflows at this `re` and bore (the error names `re`).
    pub fn k_at(&self, re: f64, bore: f64, pipe_rel_roughness: f64) -> Result<(f64, f64)> {
        check::positive("re", re)?;
        let min = crate::friction::MIN_REYNOLDS;
        if re < min {
            return Err(Error::out_of_range(
                "re",
                re,
                format!("must be at least {min:e}"),
            ));
        }
        let r = self.resistance(bore, pipe_rel_roughness)?;
        let (k, dk) = (r.k(re), r.dk_dre(re));
        if !(k.is_finite() && dk.is_finite()) {
            return Err(Error::out_of_range(
                "re",
                re,
                format!("with bore {bore} m gives a K that is not a finite number"),
            ));
        }
        Ok((k, dk))
    }
}

/// The serialised form of a [`Fitting`], checked on the way in.
#[derive(Deserialize)]
struct FittingData {
    method: Method,
    diameter: Option<f64>,
    k_spread: f64,
    name: Option<String>,
}

impl TryFrom<FittingData> for Fitting {
    type Error = Error;

    fn try_from(d: FittingData) -> Result<Fitting> {
        let mut f = match d.method {
            Method::K { k } => Fitting::k(k)?,
            Method::EquivalentLength { l_over_d } => Fitting::equivalent_length(l_over_d)?,
            Method::TwoK { k1, k_inf } => Fitting::two_k(k1, k_inf)?,
            Method::ThreeK { k1, k_inf, k_d } => Fitting::three_k(k1, k_inf, k_d)?,
            Method::Expansion { d_in, d_out } => Fitting::expansion(d_in, d_out)?,
            Method::Contraction { d_in, d_out } => Fitting::contraction(d_in, d_out)?,
            Method::FromTank { edge } => Fitting::from_tank(edge)?,
            Method::IntoTank => Fitting::into_tank(),
            Method::Bend {
                angle_deg,
                r_over_d,
            } => Fitting::bend(angle_deg, r_over_d)?,
            Method::Cv { cv } => Fitting::cv(cv)?,
            Method::Kv { kv } => Fitting::kv(kv)?,
        };
        if let Some(dia) = d.diameter {
            if f.diameter != Some(dia) {
                f = f.with_diameter(dia)?;
            }
        } else if f.diameter.is_some() {
            return Err(Error::invalid(
                "diameter",
                format!("an {} needs its own bore", f.method.name()),
            ));
        }
        f.name = d.name;
        f.with_k_spread(d.k_spread)
    }
}
