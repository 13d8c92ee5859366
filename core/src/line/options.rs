//! Options of a line: private fields behind checking setters, checked again when read
//! from a stored form.

use crate::band::UncertaintyOptions;
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::friction;
use crate::section::TurbulentDiameter;
use serde::{Deserialize, Serialize};

/// Options of a line.
///
/// Built from [`LineOptions::default`] with the checking `with_*` setters; the accessors
/// read it. Deserialising runs the same checks.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "LineOptionsSpec")]
pub struct LineOptions {
    /// Correlation, regime limits and transition treatment for every pipe.
    pub(crate) friction: friction::Options,
    /// Diameter used for turbulent flow in non-circular sections.
    pub(crate) turbulent_diameter: TurbulentDiameter,
    /// Static pressure at the inlet, Pa absolute (enables the grade line, cavitation and
    /// gas checks). For a gas without it, the gas's own stated pressure is used.
    pub(crate) inlet_pressure: Option<f64>,
    /// Uncertainty sources of the bands.
    pub(crate) uncertainty: UncertaintyOptions,
    /// The air around the line, a gas: `None` for dry air at
    /// [`SURROUNDINGS_TEMPERATURE`] and [`SURROUNDINGS_PRESSURE`]. A line open to it at
    /// both ends feels, over a rise Δz, only the difference between the column inside and
    /// the column outside: (ρ − ρ_surroundings)·g·Δz of pressure (the stack effect of a
    /// chimney; hydrostatics, exact for uniform densities).
    #[serde(default)]
    pub(crate) surroundings: Option<Fluid>,
    /// Count the surrounding air column for a liquid line too. Off by default: for water
    /// it changes a rise's head by ρ_air/ρ ≈ 0.12 %, and a liquid line usually runs between
    /// free surfaces whose own air columns cancel it.
    #[serde(default)]
    pub(crate) air_column_for_liquids: bool,
    /// The pressure the line must deliver at its end, Pa, above the pressure at its start
    /// (a spray header, a burner, a process inlet fed from a tank open to the same
    /// atmosphere: the gauge pressure it needs). Counted in the required head as
    /// p_end/(ρ g); `None` (the default) asks for none.
    #[serde(default)]
    pub(crate) end_pressure: Option<f64>,
}

/// The stored form of [`LineOptions`]: the same fields, checked on the way in.
#[derive(Deserialize)]
struct LineOptionsSpec {
    friction: friction::Options,
    turbulent_diameter: TurbulentDiameter,
    inlet_pressure: Option<f64>,
    uncertainty: UncertaintyOptions,
    #[serde(default)]
    surroundings: Option<Fluid>,
    #[serde(default)]
    air_column_for_liquids: bool,
    #[serde(default)]
    end_pressure: Option<f64>,
}

impl TryFrom<LineOptionsSpec> for LineOptions {
    type Error = Error;
    fn try_from(s: LineOptionsSpec) -> Result<LineOptions> {
        let o = LineOptions {
            friction: s.friction,
            turbulent_diameter: s.turbulent_diameter,
            inlet_pressure: s.inlet_pressure,
            uncertainty: s.uncertainty,
            surroundings: s.surroundings,
            air_column_for_liquids: s.air_column_for_liquids,
            end_pressure: s.end_pressure,
        };
        o.validate()?;
        Ok(o)
    }
}

/// Temperature of the default surroundings, K (20 °C).
pub const SURROUNDINGS_TEMPERATURE: f64 = 293.15;
/// Pressure of the default surroundings, Pa (one standard atmosphere).
pub const SURROUNDINGS_PRESSURE: f64 = 101_325.0;

impl Default for LineOptions {
    fn default() -> Self {
        LineOptions {
            friction: friction::Options::default(),
            turbulent_diameter: TurbulentDiameter::Hydraulic,
            inlet_pressure: None,
            uncertainty: UncertaintyOptions::default(),
            surroundings: None,
            air_column_for_liquids: false,
            end_pressure: None,
        }
    }
}

impl LineOptions {
    /// Correlation, regime limits and transition treatment for every pipe.
    pub fn friction(&self) -> &friction::Options {
        &self.friction
    }

    /// Diameter used for turbulent flow in non-circular sections.
    pub fn turbulent_diameter(&self) -> TurbulentDiameter {
        self.turbulent_diameter
    }

    /// Static pressure at the inlet, Pa absolute, if stated.
    pub fn inlet_pressure(&self) -> Option<f64> {
        self.inlet_pressure
    }

    /// Uncertainty sources of the bands.
    pub fn uncertainty(&self) -> &UncertaintyOptions {
        &self.uncertainty
    }

    /// The stated surrounding air, if any (see [`LineOptions::surroundings_fluid`]).
    pub fn surroundings(&self) -> Option<&Fluid> {
        self.surroundings.as_ref()
    }

    /// Whether the surrounding air column counts for a liquid line too.
    pub fn air_column_for_liquids(&self) -> bool {
        self.air_column_for_liquids
    }

    /// The pressure the line must deliver at its end, Pa above its start, if stated.
    pub fn end_pressure(&self) -> Option<f64> {
        self.end_pressure
    }

    /// The same options with other friction options.
    ///
    /// # Errors
    /// The errors of [`friction::Options::validate`].
    pub fn with_friction(mut self, friction: friction::Options) -> Result<LineOptions> {
        friction.validate()?;
        self.friction = friction;
        Ok(self)
    }

    /// The same options with another turbulent diameter for non-circular sections.
    pub fn with_turbulent_diameter(mut self, mode: TurbulentDiameter) -> LineOptions {
        self.turbulent_diameter = mode;
        self
    }

    /// The same options with the inlet pressure (Pa absolute) stated, or cleared by `None`.
    ///
    /// # Errors
    /// `inlet_pressure` not finite or not greater than 0.
    pub fn with_inlet_pressure(mut self, pressure: Option<f64>) -> Result<LineOptions> {
        if let Some(p) = pressure {
            check::positive("inlet_pressure", p)?;
        }
        self.inlet_pressure = pressure;
        Ok(self)
    }

    /// The same options with other uncertainty sources.
    ///
    /// # Errors
    /// The errors of [`UncertaintyOptions::validate`].
    pub fn with_uncertainty(mut self, uncertainty: UncertaintyOptions) -> Result<LineOptions> {
        uncertainty.validate()?;
        self.uncertainty = uncertainty;
        Ok(self)
    }

    /// The same options with the surrounding air stated, or the default by `None`.
    ///
    /// # Errors
    /// [`Error::Invalid`] naming `surroundings` when the fluid is a liquid.
    pub fn with_surroundings(mut self, surroundings: Option<Fluid>) -> Result<LineOptions> {
        self.surroundings = surroundings;
        self.surroundings_fluid()?;
        Ok(self)
    }

    /// The same options with the air column counted for liquid lines too, or not.
    pub fn with_air_column_for_liquids(mut self, on: bool) -> LineOptions {
        self.air_column_for_liquids = on;
        self
    }

    /// The same options with the end pressure (Pa above the start) stated, or cleared.
    ///
    /// # Errors
    /// `end_pressure` not finite.
    pub fn with_end_pressure(mut self, pressure: Option<f64>) -> Result<LineOptions> {
        if let Some(p) = pressure {
            check::finite("end_pressure", p)?;
        }
        self.end_pressure = pressure;
        Ok(self)
    }

    /// Checks the options.
    pub fn validate(&self) -> Result<()> {
        self.friction.validate()?;
        if let Some(p) = self.inlet_pressure {
            check::positive("inlet_pressure", p)?;
        }
        self.surroundings_fluid()?;
        if let Some(p) = self.end_pressure {
            check::finite("end_pressure", p)?;
        }
        self.uncertainty.validate()
    }

    /// The surrounding air: the stated one, or dry air at 20 °C and 101 325 Pa.
    ///
    /// # Errors
    /// [`Error::Invalid`] naming `surroundings` when the stated fluid is a liquid.
    pub fn surroundings_fluid(&self) -> Result<Fluid> {
        match &self.surroundings {
            Some(f) if f.is_gas() => Ok(f.clone()),
            Some(f) => Err(Error::invalid(
                "surroundings",
                format!(
                    "a liquid (density {} kg/m³): the surroundings of a line must be a gas (the air around it)",
                    f.density
                ),
            )),
            None => Fluid::air(SURROUNDINGS_TEMPERATURE, SURROUNDINGS_PRESSURE),
        }
    }
}
