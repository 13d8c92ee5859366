//! Which sources enter a band: private fields behind setters, checked again when read
//! from a stored form.

use crate::math;
use serde::{Deserialize, Serialize};

/// Which sources enter a band, and user values that replace the defaults. Every value
/// is a relative standard uncertainty (k = 1) unless its name says otherwise.
///
/// Built from a preset ([`UncertaintyOptions::default`], [`UncertaintyOptions::none`],
/// [`UncertaintyOptions::model_only`]) with the `with_*` setters; the accessors read it.
/// Deserialising runs the same checks.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "UncertaintySpec")]
pub struct UncertaintyOptions {
    /// Include the friction correlation's model uncertainty.
    pub(crate) friction_model: bool,
    /// Replace the turbulent round-pipe model uncertainty (default 0.05).
    pub(crate) turbulent_model: f64,
    /// Replace the laminar model uncertainty (default 0.005).
    pub(crate) laminar_model: f64,
    /// Replace the non-circular turbulent model uncertainty (default 0.075).
    pub(crate) non_circular_model: f64,
    /// Include wall roughness.
    pub(crate) roughness: bool,
    /// Standard uncertainty of ln ε for a pipe with no stated roughness range (default: a
    /// factor of 2 either way, log-uniform: ln 4/√12 ≈ 0.400).
    pub(crate) roughness_default: f64,
    /// Catalogue materials whose pipes each get their own roughness error (pipes from
    /// different supplies); every other material's pipes share one error.
    #[serde(default)]
    pub(crate) independent_materials: Vec<String>,
    /// Relative standard uncertainty of every bore (manufacturing tolerance); default 0.
    pub(crate) diameter: f64,
    /// Include the fluid's density and viscosity uncertainties.
    pub(crate) fluid: bool,
    /// Include fitting K spreads.
    pub(crate) fittings: bool,
    /// Include equipment spreads.
    pub(crate) equipment: bool,
}

/// The stored form of [`UncertaintyOptions`], checked on the way in.
#[derive(Deserialize)]
struct UncertaintySpec {
    friction_model: bool,
    turbulent_model: f64,
    laminar_model: f64,
    non_circular_model: f64,
    roughness: bool,
    roughness_default: f64,
    #[serde(default)]
    independent_materials: Vec<String>,
    diameter: f64,
    fluid: bool,
    fittings: bool,
    equipment: bool,
}

impl TryFrom<UncertaintySpec> for UncertaintyOptions {
    type Error = crate::Error;
    fn try_from(s: UncertaintySpec) -> crate::Result<UncertaintyOptions> {
        let o = UncertaintyOptions {
            friction_model: s.friction_model,
            turbulent_model: s.turbulent_model,
            laminar_model: s.laminar_model,
            non_circular_model: s.non_circular_model,
            roughness: s.roughness,
            roughness_default: s.roughness_default,
            independent_materials: s.independent_materials,
            diameter: s.diameter,
            fluid: s.fluid,
            fittings: s.fittings,
            equipment: s.equipment,
        };
        o.validate()?;
        Ok(o)
    }
}

impl Default for UncertaintyOptions {
    fn default() -> Self {
        UncertaintyOptions {
            friction_model: true,
            turbulent_model: 0.05,
            laminar_model: 0.005,
            non_circular_model: 0.075,
            roughness: true,
            roughness_default: math::ln(4.0) / 12f64.sqrt(),
            independent_materials: Vec::new(),
            diameter: 0.0,
            fluid: true,
            fittings: true,
            equipment: true,
        }
    }
}

impl UncertaintyOptions {
    /// Whether the bands include the friction correlation's model uncertainty.
    pub fn friction_model(&self) -> bool {
        self.friction_model
    }

    /// The same options with `friction_model` switched on or off.
    pub fn with_friction_model(mut self, on: bool) -> UncertaintyOptions {
        self.friction_model = on;
        self
    }

    /// The turbulent round-pipe model uncertainty (default 0.05).
    pub fn turbulent_model(&self) -> f64 {
        self.turbulent_model
    }

    /// The same options with `turbulent_model` replaced.
    ///
    /// # Errors
    /// `turbulent_model` not finite or negative.
    pub fn with_turbulent_model(mut self, value: f64) -> crate::Result<UncertaintyOptions> {
        self.turbulent_model = crate::error::check::non_negative("turbulent_model", value)?;
        Ok(self)
    }

    /// The laminar model uncertainty (default 0.005).
    pub fn laminar_model(&self) -> f64 {
        self.laminar_model
    }

    /// The same options with `laminar_model` replaced.
    ///
    /// # Errors
    /// `laminar_model` not finite or negative.
    pub fn with_laminar_model(mut self, value: f64) -> crate::Result<UncertaintyOptions> {
        self.laminar_model = crate::error::check::non_negative("laminar_model", value)?;
        Ok(self)
    }

    /// The non-circular turbulent model uncertainty (default 0.075).
    pub fn non_circular_model(&self) -> f64 {
        self.non_circular_model
    }

    /// The same options with `non_circular_model` replaced.
    ///
    /// # Errors
    /// `non_circular_model` not finite or negative.
    pub fn with_non_circular_model(mut self, value: f64) -> crate::Result<UncertaintyOptions> {
        self.non_circular_model = crate::error::check::non_negative("non_circular_model", value)?;
        Ok(self)
    }

    /// Whether the bands include wall roughness.
    pub fn roughness(&self) -> bool {
        self.roughness
    }

    /// The same options with `roughness` switched on or off.
    pub fn with_roughness(mut self, on: bool) -> UncertaintyOptions {
        self.roughness = on;
        self
    }

    /// Standard uncertainty of ln ε for a pipe with no stated roughness range (default: a
    /// factor of 2 either way, log-uniform: ln 4/√12 ≈ 0.400).
    pub fn roughness_default(&self) -> f64 {
        self.roughness_default
    }

    /// The same options with `roughness_default` replaced.
    ///
    /// # Errors
    /// `roughness_default` not finite or negative.
    pub fn with_roughness_default(mut self, value: f64) -> crate::Result<UncertaintyOptions> {
        self.roughness_default = crate::error::check::non_negative("roughness_default", value)?;
        Ok(self)
    }

    /// Catalogue materials whose pipes each get their own roughness error (pipes from
    /// different supplies); every other material's pipes share one error.
    pub fn independent_materials(&self) -> &[String] {
        &self.independent_materials
    }

    /// The same options with these catalogue materials' pipes given their own
    /// roughness errors.
    ///
    /// # Errors
    /// [`crate::Error::UnknownName`] for a material not in the catalogue.
    pub fn with_independent_materials(
        mut self,
        materials: Vec<String>,
    ) -> crate::Result<UncertaintyOptions> {
        self.independent_materials = materials;
        self.validate()?;
        Ok(self)
    }

    /// Relative standard uncertainty of every bore (manufacturing tolerance); default 0.
    pub fn diameter(&self) -> f64 {
        self.diameter
    }

    /// The same options with `diameter` replaced.
    ///
    /// # Errors
    /// `diameter` not finite or negative.
    pub fn with_diameter(mut self, value: f64) -> crate::Result<UncertaintyOptions> {
        self.diameter = crate::error::check::non_negative("diameter", value)?;
        Ok(self)
    }

    /// Whether the bands include the fluid's density and viscosity uncertainties.
    pub fn fluid(&self) -> bool {
        self.fluid
    }

    /// The same options with `fluid` switched on or off.
    pub fn with_fluid(mut self, on: bool) -> UncertaintyOptions {
        self.fluid = on;
        self
    }

    /// Whether the bands include fitting K spreads.
    pub fn fittings(&self) -> bool {
        self.fittings
    }

    /// The same options with `fittings` switched on or off.
    pub fn with_fittings(mut self, on: bool) -> UncertaintyOptions {
        self.fittings = on;
        self
    }

    /// Whether the bands include equipment spreads.
    pub fn equipment(&self) -> bool {
        self.equipment
    }

    /// The same options with `equipment` switched on or off.
    pub fn with_equipment(mut self, on: bool) -> UncertaintyOptions {
        self.equipment = on;
        self
    }

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

    /// Checks every value is finite and non-negative and every material named is in the
    /// catalogue.
    pub fn validate(&self) -> crate::Result<()> {
        use crate::error::check::non_negative;
        for m in &self.independent_materials {
            crate::roughness::material(m).map_err(|_| {
                crate::Error::unknown_name("independent_materials", m, &crate::roughness::names())
            })?;
        }
        non_negative("turbulent_model", self.turbulent_model)?;
        non_negative("laminar_model", self.laminar_model)?;
        non_negative("non_circular_model", self.non_circular_model)?;
        non_negative("roughness_default", self.roughness_default)?;
        non_negative("diameter", self.diameter)?;
        Ok(())
    }
}
