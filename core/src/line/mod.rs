//! Lines: a route of pipes, fittings, rises and equipment in series.
//!
//! A [`Line`] is evaluated at a signed volumetric flow `Q` (m³/s):
//!
//! ```text
//! required_head(Q) = static_head + Σ head_loss_i(Q)
//! ```
//!
//! Every loss is an odd, continuous function of `Q` with a continuous derivative, so
//! `required_head` can be handed to a Newton solver through zero flow and through the
//! laminar–turbulent transition. Inverse questions (flow for a head, pump operating
//! point, sizing, parallel split) live in the submodules.
//!
//! A fitting without its own diameter takes the bore of the pipe before it in the route
//! (of the pipe after it when no pipe comes before); a line where no pipe is there to
//! take it from is an error when the line is built.

mod eval;
mod path;
pub(crate) use path::{Resolved, Role};
mod parallel;
mod result;
pub mod rows;
mod sizing;
mod solve;
pub(crate) mod uncertainty;

pub use parallel::{Split, split_flow};
pub use result::{ElementKind, ElementResult, LineResult};
pub use sizing::{Limit, SizeChoice, Sizing};
pub use solve::{FlowSolution, OperatingPoint, PumpCurve};
pub use uncertainty::CurveBand;

use crate::band::UncertaintyOptions;
use crate::error::{Error, Result, check};
use crate::fitting::Fitting;
use crate::friction;
use crate::pipe::Pipe;
use crate::section::TurbulentDiameter;
use serde::{Deserialize, Serialize};

/// Equipment in a line: a component known by its rating rather than its geometry.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Equipment {
    /// A label of the user's choosing (shown in results).
    pub name: String,
    /// How its loss is stated.
    pub rating: Rating,
    /// Relative half-width of the likely range of the loss (rectangular), e.g. 0.1 = ±10 %.
    pub spread: f64,
}

/// How an equipment's loss is stated.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum Rating {
    /// A pressure drop `drop` (Pa) at flow `at_flow` (m³/s), scaled with Q|Q|
    /// (turbulent, fixed K: common practice for heat exchangers, filters and meters).
    PressureDrop {
        /// Pressure drop at the rating flow, Pa.
        drop: f64,
        /// The rating flow, m³/s.
        at_flow: f64,
    },
    /// A fixed resistance coefficient on the velocity in `diameter` (m), or in the bore of
    /// the adjoining pipe when `None`.
    FixedK {
        /// Resistance coefficient K.
        k: f64,
        /// Reference bore, m.
        diameter: Option<f64>,
    },
}

/// Default relative half-width of an equipment rating (±10 %, common practice for
/// manufacturers' stated drops).
pub const EQUIPMENT_DEFAULT_SPREAD: f64 = 0.1;

impl Equipment {
    /// Equipment with a stated pressure drop `drop` (Pa, > 0) at `at_flow` (m³/s, > 0).
    pub fn pressure_drop(name: &str, drop: f64, at_flow: f64) -> Result<Equipment> {
        check::positive("drop", drop)?;
        check::positive("at_flow", at_flow)?;
        Ok(Equipment {
            name: name.to_string(),
            rating: Rating::PressureDrop { drop, at_flow },
            spread: EQUIPMENT_DEFAULT_SPREAD,
        })
    }

    /// Equipment with a fixed K (≥ 0) on the velocity in `diameter` (m) or the adjoining
    /// pipe's bore.
    pub fn fixed_k(name: &str, k: f64, diameter: Option<f64>) -> Result<Equipment> {
        check::non_negative("k", k)?;
        if let Some(d) = diameter {
            check::positive("diameter", d)?;
        }
        Ok(Equipment {
            name: name.to_string(),
            rating: Rating::FixedK { k, diameter },
            spread: EQUIPMENT_DEFAULT_SPREAD,
        })
    }

    /// The same equipment with another spread (relative half-width, ≥ 0).
    pub fn with_spread(mut self, spread: f64) -> Result<Equipment> {
        self.spread = check::non_negative("spread", spread)?;
        Ok(self)
    }
}

/// One element of a route.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum Element {
    /// A straight run.
    Pipe(Pipe),
    /// A minor loss.
    Fitting(Fitting),
    /// An elevation change, m (positive up in the flow direction, negative for a drop).
    Rise(f64),
    /// Rated equipment.
    Equipment(Equipment),
}

impl Element {
    /// A rise (m), validated finite.
    pub fn rise(height: f64) -> Result<Element> {
        Ok(Element::Rise(check::finite("height", height)?))
    }
}

/// Options of a line.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LineOptions {
    /// Correlation, regime limits and transition treatment for every pipe.
    pub friction: friction::Options,
    /// Diameter used for turbulent flow in non-circular sections.
    pub turbulent_diameter: TurbulentDiameter,
    /// Static pressure at the inlet, Pa absolute (enables the grade line, cavitation and
    /// gas checks). For a gas without it, the gas's own stated pressure is used.
    pub inlet_pressure: Option<f64>,
    /// Uncertainty sources of the bands.
    pub uncertainty: UncertaintyOptions,
}

impl Default for LineOptions {
    fn default() -> Self {
        LineOptions {
            friction: friction::Options::default(),
            turbulent_diameter: TurbulentDiameter::Hydraulic,
            inlet_pressure: None,
            uncertainty: UncertaintyOptions::default(),
        }
    }
}

impl LineOptions {
    /// Checks the options.
    pub fn validate(&self) -> Result<()> {
        self.friction.validate()?;
        if let Some(p) = self.inlet_pressure {
            check::positive("inlet_pressure", p)?;
        }
        self.uncertainty.validate()
    }
}

/// A route of elements in series, ready to evaluate.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Line {
    pub(crate) elements: Vec<Element>,
    pub(crate) options: LineOptions,
    /// Roughness ranges (low, high) given per pipe index, m.
    roughness_ranges: Vec<Option<(f64, f64)>>,
    pub(crate) resolved: Vec<Resolved>,
    /// Per resolved row, the index of the element it comes from (`None` for an abrupt
    /// change of section the route implies).
    pub(crate) origin: Vec<Option<usize>>,
    /// Warnings raised when the line was built (bit, message).
    pub(crate) notes: Vec<(crate::warning::Warnings, String)>,
}

impl Line {
    /// A line of the given elements in route order, with default options.
    ///
    /// # Errors
    /// An empty route; a fitting with no diameter and no pipe to take it from.
    pub fn new(elements: Vec<Element>) -> Result<Line> {
        Line::with_options(elements, LineOptions::default())
    }

    /// A line with options.
    pub fn with_options(elements: Vec<Element>, options: LineOptions) -> Result<Line> {
        let n = elements.len();
        Line::build(elements, options, vec![None; n])
    }

    fn build(
        elements: Vec<Element>,
        options: LineOptions,
        roughness_ranges: Vec<Option<(f64, f64)>>,
    ) -> Result<Line> {
        options.validate()?;
        if elements.is_empty() {
            return Err(Error::invalid(
                "elements",
                "a line needs at least one element",
            ));
        }
        let path = path::resolve(&elements, &options, &roughness_ranges)?;
        Ok(Line {
            elements,
            options,
            roughness_ranges,
            resolved: path.rows,
            origin: path.origin,
            notes: path.notes,
        })
    }

    /// The elements in route order.
    pub fn elements(&self) -> &[Element] {
        &self.elements
    }

    /// The options.
    pub fn options(&self) -> &LineOptions {
        &self.options
    }

    /// The same line with other options.
    pub fn set_options(&self, options: LineOptions) -> Result<Line> {
        Line::build(
            self.elements.clone(),
            options,
            self.roughness_ranges.clone(),
        )
    }

    /// States the likely range (low, high; m) of the roughness of the pipe at `index`, for
    /// the roughness uncertainty (ε log-uniform between the two; that pipe's roughness
    /// becomes a source of its own). The pipe's roughness must lie inside the range.
    ///
    /// # Errors
    /// `low` not positive, `high` below `low`, either not finite, the pipe's roughness
    /// outside the range, or `index` not a pipe.
    pub fn set_roughness_range(&mut self, index: usize, low: f64, high: f64) -> Result<()> {
        match self.elements.get(index) {
            Some(Element::Pipe(_)) => {}
            _ => {
                return Err(Error::out_of_range(
                    "index",
                    index as f64,
                    "must be the index of a pipe in the line",
                ));
            }
        }
        let mut ranges = self.roughness_ranges.clone();
        ranges[index] = Some((low, high));
        *self = Line::build(self.elements.clone(), self.options.clone(), ranges)?;
        Ok(())
    }

    /// The static head: the sum of the rises, m.
    pub fn static_head(&self) -> f64 {
        self.resolved
            .iter()
            .map(|r| if let Resolved::Rise(h) = r { *h } else { 0.0 })
            .sum()
    }

    /// True when some element has a loss (otherwise no flow can be solved for).
    pub fn has_resistance(&self) -> bool {
        self.resolved.iter().any(|r| match r {
            Resolved::Rise(_) => false,
            Resolved::Fitting { resistance, .. } => {
                resistance.k_viscous > 0.0 || resistance.k_inertial > 0.0
            }
            _ => true,
        })
    }

    /// True when some fitting stops reverse flow (a check or foot valve).
    pub fn blocks_reverse_flow(&self) -> bool {
        self.elements.iter().any(|e| match e {
            Element::Fitting(f) => f.blocks_reverse_flow(),
            _ => false,
        })
    }

    /// The same line with every round pipe set to inside diameter `diameter` (m); fittings
    /// that follow their pipe's bore follow it too.
    pub fn with_uniform_diameter(&self, diameter: f64) -> Result<Line> {
        let elements = self
            .elements
            .iter()
            .map(|e| match e {
                Element::Pipe(p) if p.section.is_circular() => {
                    Ok(Element::Pipe(p.with_diameter(diameter)?))
                }
                other => Ok(other.clone()),
            })
            .collect::<Result<Vec<_>>>()?;
        Line::build(
            elements,
            self.options.clone(),
            self.roughness_ranges.clone(),
        )
    }
}
