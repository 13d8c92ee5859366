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

mod builder;
mod eval;
mod path;
mod pump;
mod pumped;
mod resize;
pub(crate) use path::{Resolved, Role};
mod options;
mod parallel;
pub mod plausible;
mod result;
mod row;
pub mod rows;
mod shares;
mod sizing;
mod solve;
pub(crate) mod uncertainty;

use builder::LineSpec;
pub use builder::{LineBuilder, MAX_COUNT, MAX_LABEL_CHARS, Tag, check_count, check_label};
pub use options::{LineOptions, SURROUNDINGS_PRESSURE, SURROUNDINGS_TEMPERATURE};
pub use parallel::{Split, split_flow};
pub use pump::{
    PUMP_CURVE_MAX_FLOW, PUMP_CURVE_MAX_HEAD, PUMP_CURVE_MAX_POINTS, PumpCurve, PumpFit,
};
pub use pumped::PumpedFlow;
pub use resize::Resize;
pub use result::{ElementKind, ElementResult, LineResult, NpshCheck};
pub use shares::{Share, Shares};
pub use sizing::{Limit, SizeChoice, Sizing};
pub use solve::{FlowSolution, OperatingPoint};
pub use uncertainty::CurveBand;

use crate::error::{Error, Result, check};
use crate::fitting::Fitting;
use crate::fluid::Fluid;
use crate::pipe::Pipe;
use serde::{Deserialize, Serialize};

/// Equipment in a line: a component known by its rating rather than its geometry. Built
/// only through [`Equipment::pressure_drop`] and [`Equipment::fixed_k`] (and
/// [`Equipment::with_spread`]); deserialising runs the same checks.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "EquipmentSpec")]
pub struct Equipment {
    name: String,
    rating: Rating,
    spread: f64,
}

/// The stored form of [`Equipment`], checked when read.
#[derive(Deserialize)]
struct EquipmentSpec {
    name: String,
    rating: Rating,
    spread: f64,
}

impl TryFrom<EquipmentSpec> for Equipment {
    type Error = Error;
    fn try_from(s: EquipmentSpec) -> Result<Equipment> {
        match s.rating {
            Rating::PressureDrop {
                drop,
                at_flow,
                rating_density,
            } => Equipment::pressure_drop(&s.name, drop, at_flow)?
                .with_rating_density(rating_density),
            Rating::FixedK { k, diameter } => Equipment::fixed_k(&s.name, k, diameter),
        }?
        .with_spread(s.spread)
    }
}

/// How an equipment's loss is stated.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum Rating {
    /// A pressure drop `drop` (Pa) at flow `at_flow` (m³/s) of a fluid of density
    /// `rating_density` (kg/m³), scaled with Q|Q| and with the density (turbulent, fixed
    /// K: common practice for heat exchangers, filters and meters):
    /// Δp = drop · (ρ/ρ_rating) · Q|Q|/Q_rating², so the head loss
    /// drop/(ρ_rating g) · Q|Q|/Q_rating² does not depend on the fluid's density.
    PressureDrop {
        /// Pressure drop at the rating flow, Pa.
        drop: f64,
        /// The rating flow, m³/s.
        at_flow: f64,
        /// Density of the fluid the drop was rated with, kg/m³ (default: water at
        /// 20 °C and 101 325 Pa, from the core's water model).
        #[serde(default = "default_rating_density")]
        rating_density: f64,
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

/// Density of water at 20 °C and 101 325 Pa, kg/m³ (IAPWS-IF97 through the core's water
/// model): the fluid a pressure drop is rated with unless stated.
pub fn default_rating_density() -> f64 {
    // The water model covers 20 °C at 1 atm; the fallback is the same value rounded
    // (IAPWS-IF97, 998.21 kg/m³) and is never taken.
    Fluid::water(293.15, 101_325.0).map_or(998.21, |w| w.density)
}

impl Equipment {
    /// Equipment with a stated pressure drop `drop` (Pa, > 0) at `at_flow` (m³/s, > 0),
    /// rated with water at 20 °C ([`default_rating_density`]); see
    /// [`Equipment::with_rating_density`] for another rating fluid.
    pub fn pressure_drop(name: &str, drop: f64, at_flow: f64) -> Result<Equipment> {
        check::positive("drop", drop)?;
        check::positive("at_flow", at_flow)?;
        Ok(Equipment {
            name: name.to_string(),
            rating: Rating::PressureDrop {
                drop,
                at_flow,
                rating_density: default_rating_density(),
            },
            spread: EQUIPMENT_DEFAULT_SPREAD,
        })
    }

    /// The same pressure-drop equipment rated with a fluid of density `density` (kg/m³,
    /// > 0): in another fluid its drop scales with ρ/`density`.
    ///
    /// # Errors
    /// `density` not positive or not finite; equipment rated by a fixed K (its drop
    /// already follows the fluid's density).
    pub fn with_rating_density(mut self, density: f64) -> Result<Equipment> {
        check::positive("rating_density", density)?;
        match &mut self.rating {
            Rating::PressureDrop { rating_density, .. } => *rating_density = density,
            Rating::FixedK { .. } => {
                return Err(Error::invalid(
                    "rating_density",
                    format!(
                        "{} is rated by a fixed K, whose drop already follows the fluid's density",
                        self.name
                    ),
                ));
            }
        }
        Ok(self)
    }

    /// Equipment with a fixed K (0 … [`Fitting::MAX_K`]) on the velocity in `diameter` (m)
    /// or the adjoining pipe's bore.
    pub fn fixed_k(name: &str, k: f64, diameter: Option<f64>) -> Result<Equipment> {
        Fitting::check_k(k)?;
        if let Some(d) = diameter {
            check::positive("diameter", d)?;
        }
        Ok(Equipment {
            name: name.to_string(),
            rating: Rating::FixedK { k, diameter },
            spread: EQUIPMENT_DEFAULT_SPREAD,
        })
    }

    /// The name the user gave it (its label in results unless it has another).
    pub fn name(&self) -> &str {
        &self.name
    }

    /// How its loss is stated.
    pub fn rating(&self) -> &Rating {
        &self.rating
    }

    /// Relative half-width of the likely range of the loss (rectangular), e.g. 0.1 = ±10 %.
    pub fn spread(&self) -> f64 {
        self.spread
    }

    /// The same equipment with another spread (relative half-width, 0…1: a wider
    /// rectangular range would reach negative losses).
    ///
    /// # Errors
    /// `spread` not finite or outside 0…1.
    pub fn with_spread(mut self, spread: f64) -> Result<Equipment> {
        self.spread = check::within("spread", spread, 0.0, 1.0, "")?;
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
    /// An elevation change (positive up in the flow direction, negative for a drop).
    Rise(Rise),
    /// Rated equipment.
    Equipment(Equipment),
    /// A pump adding head H(Q) (m) from its curve: evaluated as the negative loss −H(Q)
    /// with slope −dH/dQ, inside the curve's flow range only (no extrapolation; reverse
    /// flow, a pump running backwards, is not modelled and is an error naming it). See
    /// [`Line::pumped_flow`] for where a line with its own pump runs.
    Pump(PumpCurve),
}

/// An elevation change of `height` m: positive up in the flow direction, negative for a
/// drop. Built only through [`Rise::new`], so it always holds a finite height within
/// ±[`Rise::MAX_HEIGHT`]; deserialising runs the same check.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "f64", into = "f64")]
pub struct Rise(f64);

impl Rise {
    /// The largest height (in magnitude) a rise accepts, m: above any route on Earth,
    /// low enough that heads and pressures built from it stay finite.
    pub const MAX_HEIGHT: f64 = 1e6;

    /// A rise of `height` m.
    ///
    /// # Errors
    /// `height` not finite, or beyond ±[`Rise::MAX_HEIGHT`].
    pub fn new(height: f64) -> Result<Rise> {
        check::within("height", height, -Rise::MAX_HEIGHT, Rise::MAX_HEIGHT, "m").map(Rise)
    }

    /// The height, m (positive up in the flow direction).
    pub fn height(self) -> f64 {
        self.0
    }
}

impl TryFrom<f64> for Rise {
    type Error = Error;
    fn try_from(height: f64) -> Result<Rise> {
        Rise::new(height)
    }
}

impl From<Rise> for f64 {
    fn from(r: Rise) -> f64 {
        r.0
    }
}

impl Element {
    /// A rise element of `height` m (see [`Rise::new`]).
    ///
    /// # Errors
    /// The errors of [`Rise::new`].
    pub fn rise(height: f64) -> Result<Element> {
        Rise::new(height).map(Element::Rise)
    }
}

/// A route of elements in series, ready to evaluate. Built by [`Line::new`],
/// [`Line::with_options`] or a [`LineBuilder`].
///
/// Serialised as its elements, labels, counts, options and roughness ranges only;
/// deserialising builds the line again through the same checks (the worked-out bores and
/// resistances are never read from the stored form).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "LineSpec", into = "LineSpec")]
pub struct Line {
    pub(crate) elements: Vec<Element>,
    pub(crate) options: LineOptions,
    /// Roughness ranges (low, high) given per pipe index, m.
    roughness_ranges: Vec<Option<(f64, f64)>>,
    /// Per element, the user's label.
    labels: Vec<Option<String>>,
    /// Per element, how many identical fittings it stands for (1 for other elements).
    counts: Vec<u32>,
    pub(crate) resolved: Vec<Resolved>,
    /// Per resolved row, the index of the element it comes from (`None` for an abrupt
    /// change of section the route implies).
    pub(crate) origin: Vec<Option<usize>>,
    /// Warnings raised when the line was built (bit, message).
    pub(crate) notes: Vec<(crate::warning::Warnings, String)>,
}

impl TryFrom<LineSpec> for Line {
    type Error = Error;
    fn try_from(s: LineSpec) -> Result<Line> {
        Line::from_spec(s)
    }
}

impl From<Line> for LineSpec {
    fn from(l: Line) -> LineSpec {
        l.spec()
    }
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
        Line::from_spec(LineSpec {
            elements,
            options,
            ..LineSpec::default()
        })
    }

    /// Checks what the user gave and works out the flow path.
    pub(crate) fn from_spec(spec: LineSpec) -> Result<Line> {
        spec.options.validate()?;
        if spec.elements.is_empty() {
            return Err(Error::invalid(
                "elements",
                "a line needs at least one element",
            ));
        }
        let LineSpec {
            elements,
            options,
            roughness_ranges,
            labels,
            counts,
        } = spec.normalised()?;
        if let Some(i) = (0..elements.len())
            .find(|&i| roughness_ranges[i].is_some() && !matches!(elements[i], Element::Pipe(_)))
        {
            return Err(Error::out_of_range(
                "index",
                i as f64,
                "a roughness range must belong to a pipe in the line",
            ));
        }
        let mut path = path::resolve(&elements, &options, &roughness_ranges)?;
        // N counted fittings: N times the resistance in both directions (see builder).
        for (row, origin) in path.rows.iter_mut().zip(&path.origin) {
            if let (
                Resolved::Fitting {
                    resistance,
                    reverse,
                    ..
                },
                Some(i),
            ) = (row, origin)
            {
                let n = f64::from(counts[*i]);
                for r in [resistance, reverse] {
                    r.k_viscous *= n;
                    r.k_inertial *= n;
                }
            }
        }
        Ok(Line {
            elements,
            options,
            roughness_ranges,
            labels,
            counts,
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
        Line::from_spec(LineSpec {
            options,
            ..self.spec()
        })
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
        let mut spec = self.spec();
        spec.roughness_ranges[index] = Some((low, high));
        *self = Line::from_spec(spec)?;
        Ok(())
    }

    /// The static head: the sum of the rises, m (the geometric height; see
    /// [`Line::static_head_in`] for what a fluid feels of it).
    pub fn static_head(&self) -> f64 {
        self.resolved
            .iter()
            .map(|r| match r {
                Resolved::Rise { height, .. } => *height,
                _ => 0.0,
            })
            .sum()
    }

    /// The static head `fluid` feels, m of that fluid: Σ Δz for a liquid (the air column
    /// neglected unless [`LineOptions::air_column_for_liquids`]); Σ Δz (1 − ρ_s/ρ) for a
    /// gas, with ρ_s the surroundings' density.
    pub fn static_head_in(&self, fluid: &Fluid) -> f64 {
        self.resolved
            .iter()
            .map(|r| self.rise_head(r, fluid))
            .sum::<f64>()
            + self.end_head(fluid)
    }

    /// The head (m of `fluid`) of the pressure the line must deliver at its end,
    /// p_end/(ρ g); 0 when it states none.
    pub fn end_head(&self, fluid: &Fluid) -> f64 {
        self.options.end_pressure.map_or(0.0, |p| {
            p / (fluid.density * crate::units::STANDARD_GRAVITY)
        })
    }

    /// The head (m of `fluid`) of one row's rise; 0 for other rows.
    pub(crate) fn rise_head(&self, r: &Resolved, fluid: &Fluid) -> f64 {
        match r {
            Resolved::Rise {
                height,
                air_density,
            } if fluid.is_gas() || self.options.air_column_for_liquids => {
                height * (1.0 - air_density / fluid.density)
            }
            Resolved::Rise { height, .. } => *height,
            _ => 0.0,
        }
    }

    /// True when some element has a loss (otherwise no flow can be solved for).
    pub fn has_resistance(&self) -> bool {
        self.resolved.iter().any(|r| match r {
            Resolved::Rise { .. } => false,
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

    /// The same line with every round pipe set to inside diameter `diameter` (m): fittings
    /// with a stated bore take the new one, transitions left between equal bores are
    /// removed, equipment with a fixed bore refuses (see [`Line::with_diameter_in`] and the
    /// rule in [`Resize`]'s module).
    ///
    /// # Errors
    /// As [`Line::with_diameter_in`].
    pub fn with_uniform_diameter(&self, diameter: f64) -> Result<Line> {
        self.with_diameter_in(diameter, &Resize::default())
    }
}
