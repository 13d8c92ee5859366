//! Fluids: density, viscosity, phase, vapour pressure and the uncertainty of each.
//!
//! A [`Fluid`] is a plain value. Build one from numbers ([`Fluid::new`], [`Fluid::gas`]),
//! or from a state: [`Fluid::water`] (IAPWS-IF97 region 1 with the IAPWS 2008 viscosity)
//! and [`Fluid::air`] (ideal gas with Sutherland's law). Every fluid carries the relative
//! standard uncertainty (k = 1) of its density and viscosity for the uncertainty bands.
//!
//! | fluid | density (source, u) | viscosity (source, u) |
//! |---|---|---|
//! | water | IF97 region 1 (IAPWS R7-97); u = 1e-4 to 150 °C, 1e-3 above | IAPWS 2008 (R12-08), μ̄₂ = 1; u = 1 % |
//! | air | ideal gas, M = 28.9647 g/mol; u = 1e-4 + virial bound | Sutherland, S = 110.4 K; u = 2 % (250–500 K), 5 % outside |
//! | user | as given; u = 0 unless set | as given; u = 0 unless set |
//!
//! Where the water figures come from: the IF97 region 1 density differs from the
//! scientific IAPWS-95 formulation by at most 1.7e-5 relative up to 150 °C and 3.3e-5 up
//! to 350 °C (measured with the `iapws` package, tests/reference/water/); IAPWS-95's own
//! uncertainty for the liquid is of the order of 1e-5 near ambient and grows towards the
//! critical region (from memory). We state 1e-4 up to 150 °C and, conservatively, 1e-3
//! above. IAPWS 2008 gives about 1 % for liquid water over this range (from memory; we
//! do not recall whether the release quotes it at k = 2, so we take it as a standard
//! uncertainty, which can only widen the bands).

mod air;
mod water;

pub use air::{AIR_P_MAX, AIR_T_MAX, AIR_T_MIN, R_AIR};
pub use water::{
    WATER_P_MAX, WATER_P_SAT_MIN, WATER_T_MAX, WATER_T_MIN, water_saturation_temperature,
    water_vapour_pressure,
};

use crate::error::{Error, Result, check};
use serde::{Deserialize, Serialize};

/// Whether a fluid is a liquid or a gas. Gas flow is checked for compressibility.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Phase {
    /// A liquid: density taken as independent of pressure along a line.
    Liquid,
    /// A gas: density follows pressure; large pressure losses raise a warning.
    Gas,
}

impl Phase {
    /// The name used by every binding: `"liquid"` or `"gas"`.
    pub fn name(self) -> &'static str {
        match self {
            Phase::Liquid => "liquid",
            Phase::Gas => "gas",
        }
    }
}

/// Where a fluid's properties came from; decides how [`Fluid::at_pressure`] re-evaluates.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum Origin {
    /// Numbers given by the user.
    User,
    /// [`Fluid::water`].
    Water,
    /// [`Fluid::air`].
    Air,
}

impl Origin {
    /// The name used by every binding: `"user"`, `"water"` or `"air"`.
    pub fn name(self) -> &'static str {
        match self {
            Origin::User => "user",
            Origin::Water => "water",
            Origin::Air => "air",
        }
    }
}

/// A fluid: its density, dynamic viscosity and what the flow calculations need besides.
///
/// Built only through the checking constructors ([`Fluid::new`], [`Fluid::gas`],
/// [`Fluid::water`], [`Fluid::air`]) and setters ([`Fluid::with_uncertainty`],
/// [`Fluid::with_vapour_pressure`]); the accessors read it. Deserialising runs the same
/// checks, and a stored water or air must match its model at its own state.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "FluidSpec", into = "FluidSpec")]
pub struct Fluid {
    pub(crate) density: f64,
    pub(crate) viscosity: f64,
    pub(crate) phase: Phase,
    pub(crate) vapour_pressure: Option<f64>,
    pub(crate) temperature: Option<f64>,
    pub(crate) pressure: Option<f64>,
    pub(crate) density_rel_uncertainty: f64,
    pub(crate) viscosity_rel_uncertainty: f64,
    pub(crate) origin: Origin,
}

/// The stored form of a [`Fluid`]: the same fields, checked on the way in.
#[derive(Serialize, Deserialize)]
struct FluidSpec {
    density: f64,
    viscosity: f64,
    phase: Phase,
    vapour_pressure: Option<f64>,
    temperature: Option<f64>,
    pressure: Option<f64>,
    density_rel_uncertainty: f64,
    viscosity_rel_uncertainty: f64,
    origin: Origin,
}

impl TryFrom<FluidSpec> for Fluid {
    type Error = Error;
    fn try_from(s: FluidSpec) -> Result<Fluid> {
        let base = match (s.origin, s.phase, s.temperature, s.pressure) {
            (Origin::User, Phase::Liquid, None, None) => Fluid::new(s.density, s.viscosity)?,
            (Origin::User, Phase::Gas, Some(t), Some(p)) => {
                Fluid::gas(s.density, s.viscosity, t, p)?
            }
            (Origin::Water, Phase::Liquid, Some(t), Some(p)) => Fluid::water(t, p)?,
            (Origin::Air, Phase::Gas, Some(t), Some(p)) => Fluid::air(t, p)?,
            (origin, phase, _, _) => {
                return Err(Error::invalid(
                    "fluid",
                    format!(
                        "a stored {} fluid that is a {} needs {}",
                        origin.name(),
                        phase.name(),
                        if origin == Origin::User && phase == Phase::Liquid {
                            "no temperature and no pressure"
                        } else {
                            "its temperature and pressure"
                        }
                    ),
                ));
            }
        };
        // A model fluid is rebuilt from its state; its stored properties must agree.
        for (name, stored, model) in [
            ("density", s.density, base.density),
            ("viscosity", s.viscosity, base.viscosity),
        ] {
            if stored.to_bits() != model.to_bits() {
                return Err(Error::out_of_range(
                    name,
                    stored,
                    format!(
                        "differs from the {} model at its state ({model})",
                        base.origin.name()
                    ),
                ));
            }
        }
        let mut f =
            base.with_uncertainty(s.density_rel_uncertainty, s.viscosity_rel_uncertainty)?;
        f.vapour_pressure = match s.vapour_pressure {
            Some(v) => Some(check::non_negative("vapour_pressure", v)?),
            None => None,
        };
        Ok(f)
    }
}

impl From<Fluid> for FluidSpec {
    fn from(f: Fluid) -> FluidSpec {
        FluidSpec {
            density: f.density,
            viscosity: f.viscosity,
            phase: f.phase,
            vapour_pressure: f.vapour_pressure,
            temperature: f.temperature,
            pressure: f.pressure,
            density_rel_uncertainty: f.density_rel_uncertainty,
            viscosity_rel_uncertainty: f.viscosity_rel_uncertainty,
            origin: f.origin,
        }
    }
}

impl Fluid {
    /// A liquid of given density ρ (kg/m³) and dynamic viscosity μ (Pa·s), with zero
    /// uncertainty (set it with [`Fluid::with_uncertainty`]) and no vapour pressure (set it
    /// with [`Fluid::with_vapour_pressure`]).
    ///
    /// ```
    /// let oil = hydrograde::fluid::Fluid::new(870.0, 0.03)?;
    /// assert!((oil.kinematic_viscosity() - 0.03 / 870.0).abs() < 1e-18);
    /// # Ok::<(), hydrograde::Error>(())
    /// ```
    ///
    /// # Errors
    /// `density` or `viscosity` not finite or not greater than 0.
    pub fn new(density: f64, viscosity: f64) -> Result<Fluid> {
        Ok(Fluid {
            density: check::positive("density", density)?,
            viscosity: check::positive("viscosity", viscosity)?,
            phase: Phase::Liquid,
            vapour_pressure: None,
            temperature: None,
            pressure: None,
            density_rel_uncertainty: 0.0,
            viscosity_rel_uncertainty: 0.0,
            origin: Origin::User,
        })
    }

    /// A gas of given density ρ (kg/m³) and viscosity μ (Pa·s) at temperature `t` (K) and
    /// absolute pressure `p` (Pa). [`Fluid::at_pressure`] rescales its density as an ideal
    /// gas at constant temperature.
    ///
    /// # Errors
    /// Any argument not finite or not greater than 0.
    pub fn gas(density: f64, viscosity: f64, temperature: f64, pressure: f64) -> Result<Fluid> {
        let mut f = Fluid::new(density, viscosity)?;
        f.phase = Phase::Gas;
        f.temperature = Some(check::positive("temperature", temperature)?);
        f.pressure = Some(check::positive("pressure", pressure)?);
        Ok(f)
    }

    /// Liquid water at temperature `t` (K) and absolute pressure `p` (Pa).
    ///
    /// Density from IAPWS-IF97 region 1, viscosity from IAPWS 2008 without the critical
    /// enhancement, vapour pressure from the IF97 saturation line. Accepts 273.15…623.15 K
    /// (0…350 °C) and the saturation pressure at `t` up to 100 MPa (region 1). Agrees with
    /// the `iapws` package to 1e-9 relative (core/tests/fluid_reference.rs).
    ///
    /// ```
    /// let w = hydrograde::fluid::Fluid::water(293.15, 101_325.0)?;
    /// assert!((w.density() - 998.2).abs() < 0.1); // common practice: 998.2 kg/m³ at 20 °C
    /// # Ok::<(), hydrograde::Error>(())
    /// ```
    ///
    /// # Errors
    /// `temperature` outside 273.15…623.15 K; `pressure` below the saturation pressure
    /// (the water would be vapour) or above 100 MPa; either not finite.
    pub fn water(t: f64, p: f64) -> Result<Fluid> {
        let p_sat = water::check_liquid_state(t, p)?;
        let density = water::region1_density(t, p);
        Ok(Fluid {
            density,
            viscosity: water::viscosity_iapws2008(density, t),
            phase: Phase::Liquid,
            vapour_pressure: Some(p_sat),
            temperature: Some(t),
            pressure: Some(p),
            density_rel_uncertainty: if t <= 423.15 { 1e-4 } else { 1e-3 },
            viscosity_rel_uncertainty: 0.01,
            origin: Origin::Water,
        })
    }

    /// Dry air at temperature `t` (K) and absolute pressure `p` (Pa): ideal gas with
    /// M = 28.9647 g/mol, Sutherland's law for viscosity (see the module table for the
    /// sources and uncertainties). Accepts 200…1000 K and pressures up to 2 MPa.
    ///
    /// ```
    /// let a = hydrograde::fluid::Fluid::air(288.15, 101_325.0)?;
    /// assert!((a.density() - 1.225).abs() < 1e-3); // U.S. Standard Atmosphere 1976, from memory
    /// assert!(a.is_gas());
    /// # Ok::<(), hydrograde::Error>(())
    /// ```
    ///
    /// # Errors
    /// `temperature` outside 200…1000 K; `pressure` not greater than 0 or above 2 MPa.
    pub fn air(t: f64, p: f64) -> Result<Fluid> {
        air::check_state(t, p)?;
        Ok(Fluid {
            density: air::density(t, p),
            viscosity: air::viscosity(t),
            phase: Phase::Gas,
            vapour_pressure: None,
            temperature: Some(t),
            pressure: Some(p),
            density_rel_uncertainty: air::density_uncertainty(t, p),
            viscosity_rel_uncertainty: air::viscosity_uncertainty(t),
            origin: Origin::Air,
        })
    }

    /// The same fluid with the given relative standard uncertainties (k = 1) of density
    /// and viscosity, e.g. `0.01` for 1 %.
    ///
    /// # Errors
    /// Either value not finite, negative, or 1 or more.
    pub fn with_uncertainty(mut self, density_rel: f64, viscosity_rel: f64) -> Result<Fluid> {
        self.density_rel_uncertainty = rel_uncertainty("density_rel_uncertainty", density_rel)?;
        self.viscosity_rel_uncertainty =
            rel_uncertainty("viscosity_rel_uncertainty", viscosity_rel)?;
        Ok(self)
    }

    /// The same fluid with its vapour pressure (Pa) set, for cavitation warnings.
    ///
    /// # Errors
    /// `vapour_pressure` not finite or negative.
    pub fn with_vapour_pressure(mut self, vapour_pressure: f64) -> Result<Fluid> {
        self.vapour_pressure = Some(check::non_negative("vapour_pressure", vapour_pressure)?);
        Ok(self)
    }

    /// The fluid re-evaluated at absolute pressure `p` (Pa) and its own temperature.
    ///
    /// Air is rebuilt with [`Fluid::air`] (with that model's uncertainties at the new
    /// state); a user gas has its density scaled by
    /// p / p_old (ideal gas, constant temperature, viscosity unchanged); a liquid is
    /// returned unchanged (its density hardly depends on pressure).
    ///
    /// # Errors
    /// For a gas: `pressure` not finite, not greater than 0, or outside the range of its
    /// model (air: up to 2 MPa).
    pub fn at_pressure(&self, p: f64) -> Result<Fluid> {
        if self.phase == Phase::Liquid {
            return Ok(self.clone());
        }
        let p = check::positive("pressure", p)?;
        match (self.origin, self.temperature, self.pressure) {
            (Origin::Air, Some(t), _) => Fluid::air(t, p),
            (_, _, Some(p_old)) => {
                let mut f = self.clone();
                f.density = self.density * (p / p_old);
                f.pressure = Some(p);
                Ok(f)
            }
            _ => Err(Error::invalid(
                "fluid",
                "a gas needs its pressure to be re-evaluated at another pressure",
            )),
        }
    }

    /// Density ρ, kg/m³.
    #[inline]
    pub fn density(&self) -> f64 {
        self.density
    }

    /// Dynamic viscosity μ, Pa·s.
    #[inline]
    pub fn viscosity(&self) -> f64 {
        self.viscosity
    }

    /// Liquid or gas.
    #[inline]
    pub fn phase(&self) -> Phase {
        self.phase
    }

    /// Vapour (saturation) pressure at the fluid's temperature, Pa, for liquids where it
    /// is known; used to warn of cavitation.
    #[inline]
    pub fn vapour_pressure(&self) -> Option<f64> {
        self.vapour_pressure
    }

    /// Temperature, K, where known (always for water, air and user gases).
    #[inline]
    pub fn temperature(&self) -> Option<f64> {
        self.temperature
    }

    /// Pressure at which the properties were evaluated, Pa, where known (always for
    /// water, air and user gases).
    #[inline]
    pub fn pressure(&self) -> Option<f64> {
        self.pressure
    }

    /// Relative standard uncertainty (k = 1) of the density, dimensionless.
    #[inline]
    pub fn density_rel_uncertainty(&self) -> f64 {
        self.density_rel_uncertainty
    }

    /// Relative standard uncertainty (k = 1) of the viscosity, dimensionless.
    #[inline]
    pub fn viscosity_rel_uncertainty(&self) -> f64 {
        self.viscosity_rel_uncertainty
    }

    /// Where the properties came from.
    #[inline]
    pub fn origin(&self) -> Origin {
        self.origin
    }

    /// Kinematic viscosity ν = μ/ρ, m²/s.
    #[inline]
    pub fn kinematic_viscosity(&self) -> f64 {
        self.viscosity / self.density
    }

    /// Reynolds number ρ·|V|·D/μ of a mean velocity `velocity` (m/s, signed) in a duct of
    /// (hydraulic) diameter `diameter` (m).
    ///
    /// # Errors
    /// A velocity that is not finite; a diameter that is not finite and positive; a
    /// velocity and diameter whose Reynolds number overflows (the error names the
    /// velocity).
    ///
    /// # Example
    /// ```
    /// let w = hydrograde::Fluid::new(1000.0, 1e-3).unwrap();
    /// // Exact: 1000 · 2 · 0.05 / 1e-3 = 1e5, whatever the direction of flow.
    /// assert_eq!(w.reynolds(-2.0, 0.05).unwrap(), 1e5);
    /// assert!(w.reynolds(1.0, 0.0).is_err());
    /// ```
    pub fn reynolds(&self, velocity: f64, diameter: f64) -> Result<f64> {
        check::finite("velocity", velocity)?;
        check::positive("diameter", diameter)?;
        let re = self.density * velocity.abs() * diameter / self.viscosity;
        if !re.is_finite() {
            return Err(Error::out_of_range(
                "velocity",
                velocity,
                format!(
                    "with diameter {diameter} m gives a Reynolds number that is not a finite number"
                ),
            ));
        }
        Ok(re)
    }

    /// True for a gas.
    #[inline]
    pub fn is_gas(&self) -> bool {
        self.phase == Phase::Gas
    }
}

fn rel_uncertainty(name: &'static str, v: f64) -> Result<f64> {
    let v = check::non_negative(name, v)?;
    if v < 1.0 {
        Ok(v)
    } else {
        Err(Error::out_of_range(name, v, "must be less than 1"))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn user_fluids_are_validated() {
        assert!(Fluid::new(1000.0, 1e-3).is_ok());
        let e = Fluid::new(-1.0, 1e-3).unwrap_err();
        assert_eq!(e.to_string(), "density = -1: must be greater than 0");
        assert!(Fluid::new(1000.0, f64::NAN).is_err());
        assert!(
            Fluid::new(1000.0, 1e-3)
                .unwrap()
                .with_uncertainty(1.5, 0.0)
                .is_err()
        );
        assert!(
            Fluid::new(1000.0, 1e-3)
                .unwrap()
                .with_vapour_pressure(-1.0)
                .is_err()
        );
        assert!(Fluid::gas(1.2, 1.8e-5, 0.0, 1e5).is_err());
    }

    #[test]
    fn liquids_ignore_pressure_changes() {
        let w = Fluid::water(300.0, 2e5).unwrap();
        assert_eq!(w.at_pressure(1e5).unwrap(), w);
    }

    #[test]
    fn gases_scale_with_pressure() {
        // Exact for an ideal gas at constant temperature: ρ ∝ p.
        let a = Fluid::air(300.0, 2e5).unwrap();
        let b = a.at_pressure(1e5).unwrap();
        assert!((b.density / a.density - 0.5).abs() < 1e-15);
        assert_eq!(b.viscosity, a.viscosity);
        assert_eq!(b.pressure, Some(1e5));
        let g = Fluid::gas(2.0, 1e-5, 300.0, 1e5).unwrap();
        let h = g.at_pressure(3e5).unwrap();
        assert!((h.density - 6.0).abs() < 1e-14);
        assert!(g.at_pressure(0.0).is_err());
    }

    #[test]
    fn water_carries_its_vapour_pressure_and_uncertainty() {
        let w = Fluid::water(373.15, 2e5).unwrap();
        // IF97 saturation line: 0.101418 MPa at 100 °C (from memory).
        let pv = w.vapour_pressure.unwrap();
        assert!((pv - 101_418.0).abs() < 5.0, "{pv}");
        assert_eq!(w.phase, Phase::Liquid);
        assert!(w.density_rel_uncertainty > 0.0 && w.viscosity_rel_uncertainty > 0.0);
    }

    #[test]
    fn phase_and_origin_have_binding_names() {
        let w = Fluid::water(293.15, 101_325.0).unwrap();
        assert_eq!((w.phase.name(), w.origin.name()), ("liquid", "water"));
        let a = Fluid::air(293.15, 101_325.0).unwrap();
        assert_eq!((a.phase.name(), a.origin.name()), ("gas", "air"));
        let u = Fluid::new(1000.0, 1e-3).unwrap();
        assert_eq!((u.phase.name(), u.origin.name()), ("liquid", "user"));
    }

    #[test]
    fn values_round_trip_through_serde() {
        let w = Fluid::air(300.0, 1e5).unwrap();
        let s = serde_json::to_string(&w).unwrap();
        let back: Fluid = serde_json::from_str(&s).unwrap();
        assert_eq!(back, w);
    }
}
