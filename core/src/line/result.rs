//! The result of evaluating a line at one flow: per-element breakdown, totals, the grade
//! line and the uncertainty bands.

use super::eval::State;
use super::uncertainty::{self, Sources};
use super::{Line, Resolved};
use crate::band::Band;
use crate::error::{Result, check};
use crate::fluid::Fluid;
use crate::friction::Regime;
use crate::units::STANDARD_GRAVITY;
use crate::warning::Warnings;
use serde::{Deserialize, Serialize};

/// What an element is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum ElementKind {
    /// A straight run.
    Pipe,
    /// A minor loss.
    Fitting,
    /// An elevation change.
    Rise,
    /// Rated equipment.
    Equipment,
}

impl ElementKind {
    /// `"pipe"`, `"fitting"`, `"rise"` or `"equipment"`.
    pub fn name(self) -> &'static str {
        match self {
            ElementKind::Pipe => "pipe",
            ElementKind::Fitting => "fitting",
            ElementKind::Rise => "rise",
            ElementKind::Equipment => "equipment",
        }
    }
}

/// One element's share of the result.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ElementResult {
    /// What the element is.
    pub kind: ElementKind,
    /// A label: the fitting's or equipment's name, "pipe" or "rise".
    pub label: String,
    /// Mean velocity in the element's bore, m/s (NaN for rises and rated drops).
    pub velocity: f64,
    /// Reynolds number in that bore (NaN where there is none).
    pub reynolds: f64,
    /// Flow regime (pipes).
    pub regime: Option<Regime>,
    /// Darcy friction factor (pipes).
    pub friction_factor: Option<f64>,
    /// Resistance coefficient K at this Reynolds number (fittings and fixed-K equipment).
    pub k: Option<f64>,
    /// Head loss, m of the flowing fluid (signed with the flow; 0 for rises).
    pub head_loss: f64,
    /// d(head loss)/dQ, s/m².
    pub dhead_dflow: f64,
    /// Elevation change, m (rises; 0 otherwise).
    pub static_head: f64,
    /// Static pressure at the element's outlet, Pa absolute (with an inlet pressure).
    pub pressure_out: Option<f64>,
    /// Warnings of this element.
    pub warnings: Warnings,
    /// Band of the head loss, m.
    pub head_loss_band: Band,
    /// Band of the friction factor (pipes).
    pub friction_factor_band: Option<Band>,
}

/// A line evaluated at one flow.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LineResult {
    /// The flow, m³/s (signed; at inlet conditions for a gas).
    pub flow: f64,
    /// Friction plus minor losses, m of the flowing fluid.
    pub head_loss: f64,
    /// ρ·g·head_loss, Pa.
    pub pressure_loss: f64,
    /// Sum of the rises, m.
    pub static_head: f64,
    /// head_loss + static_head, m (summed element by element in route order).
    pub required_head: f64,
    /// d(required_head)/dQ, s/m².
    pub drequired_head_dflow: f64,
    /// Density the heads refer to, kg/m³ (the mean density for a gas).
    pub density: f64,
    /// Static pressure at the inlet, Pa absolute, when known.
    pub inlet_pressure: Option<f64>,
    /// Static pressure at the outlet, Pa absolute, when the inlet pressure is known.
    pub outlet_pressure: Option<f64>,
    /// Per element, in route order.
    pub elements: Vec<ElementResult>,
    /// Union of the elements' warnings and the line's own (gas, cavitation).
    pub warnings: Warnings,
    /// Band of head_loss, m.
    pub head_loss_band: Band,
    /// Band of pressure_loss, Pa.
    pub pressure_loss_band: Band,
    /// Band of required_head, m.
    pub required_head_band: Band,
}

impl Line {
    /// Evaluates the line at signed flow `flow` (m³/s; at inlet conditions for a gas) with
    /// the inlet pressure of the options.
    ///
    /// # Errors
    /// A non-finite flow; transitional flow with the refuse option; a gas whose pressure
    /// loss exceeds 40 % of the inlet pressure.
    pub fn evaluate(&self, fluid: &Fluid, flow: f64) -> Result<LineResult> {
        self.evaluate_at(fluid, flow, self.options.inlet_pressure)
    }

    /// Evaluates with a given inlet static pressure (Pa absolute), or none.
    pub fn evaluate_at(
        &self,
        fluid: &Fluid,
        flow: f64,
        inlet_pressure: Option<f64>,
    ) -> Result<LineResult> {
        if let Some(p) = inlet_pressure {
            check::positive("inlet_pressure", p)?;
        }
        let (work, q, gas_warn) = self.working_fluid(fluid, flow, inlet_pressure)?;
        let inlet = inlet_pressure.or(if fluid.is_gas() { fluid.pressure } else { None });
        let states = (0..self.resolved.len())
            .map(|i| self.element_state(i, &work, q, None, true))
            .collect::<Result<Vec<State>>>()?;
        let rho_g = work.density * STANDARD_GRAVITY;
        let dq = if flow == 0.0 { 1.0 } else { q / flow };
        let head_loss: f64 = states.iter().map(|s| s.head_loss).sum();
        let static_head: f64 = states.iter().map(|s| s.static_head).sum();
        // Summed in route order exactly as the system curve does, so both agree bit for bit.
        let required_head: f64 = states
            .iter()
            .fold(0.0, |acc, s| acc + (s.head_loss + s.static_head));
        let slope: f64 = states.iter().map(|s| s.dhead_dflow).sum::<f64>() * dq;
        let mut warnings = gas_warn;
        // Grade line: total pressure falls by ρg(loss + rise); static = total − ½ρV².
        let first_v = states
            .iter()
            .map(|s| s.velocity)
            .find(|v| v.is_finite())
            .unwrap_or(0.0);
        let mut total = inlet.map(|p| p + 0.5 * work.density * first_v * first_v);
        let mut last_v = first_v;
        let mut elements = Vec::with_capacity(states.len());
        let sources = Sources::of(self);
        for (i, s) in states.iter().enumerate() {
            if s.velocity.is_finite() {
                last_v = s.velocity;
            }
            total = total.map(|t| t - rho_g * (s.head_loss + s.static_head));
            let pressure_out = total.map(|t| t - 0.5 * work.density * last_v * last_v);
            let mut w = s.warnings;
            if let (Some(p), Some(pv)) = (pressure_out, work.vapour_pressure) {
                if p < pv {
                    w.insert(Warnings::BELOW_VAPOUR_PRESSURE);
                }
            }
            warnings |= w;
            elements.push(self.element_result(&sources, i, s, &work, pressure_out, w));
        }
        let bands =
            uncertainty::line_bands(self, &sources, &states, &work, head_loss, required_head);
        Ok(LineResult {
            flow,
            head_loss,
            pressure_loss: rho_g * head_loss,
            static_head,
            required_head,
            drequired_head_dflow: slope,
            density: work.density,
            inlet_pressure: inlet,
            outlet_pressure: elements.last().and_then(|e| e.pressure_out),
            warnings,
            pressure_loss_band: bands.pressure_loss,
            required_head_band: bands.required_head,
            head_loss_band: bands.head_loss,
            elements,
        })
    }

    fn element_result(
        &self,
        sources: &Sources,
        i: usize,
        s: &State,
        fluid: &Fluid,
        pressure_out: Option<f64>,
        warnings: Warnings,
    ) -> ElementResult {
        let (kind, label) = match &self.resolved[i] {
            Resolved::Pipe { .. } => (ElementKind::Pipe, "pipe".to_string()),
            Resolved::Fitting {
                name, equipment, ..
            } => (
                if *equipment {
                    ElementKind::Equipment
                } else {
                    ElementKind::Fitting
                },
                name.clone(),
            ),
            Resolved::Rise(_) => (ElementKind::Rise, "rise".to_string()),
            Resolved::Drop { name, .. } => (ElementKind::Equipment, name.clone()),
        };
        ElementResult {
            kind,
            label,
            velocity: s.velocity,
            reynolds: s.reynolds,
            regime: s.regime,
            friction_factor: s.friction_factor,
            k: s.k,
            head_loss: s.head_loss,
            dhead_dflow: s.dhead_dflow,
            static_head: s.static_head,
            pressure_out,
            warnings,
            head_loss_band: sources.element_band(self, i, s, fluid),
            friction_factor_band: sources.friction_factor_band(self, i, s, fluid),
        }
    }
}
