//! The result of evaluating a line at one flow: per-element breakdown, totals, the grade
//! line and the uncertainty bands.

use super::eval::State;
use super::uncertainty::{self, Sources};
use super::{Element, Line, Resolved, Role, plausible};
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
    /// An abrupt change of section the route implies between two elements of different
    /// bore with no contraction or expansion element of its own.
    SectionChange,
    /// A pump (its head is the row's negative head loss).
    Pump,
}

impl ElementKind {
    /// `"pipe"`, `"fitting"`, `"rise"`, `"equipment"`, `"section_change"` or `"pump"`.
    pub fn name(self) -> &'static str {
        match self {
            ElementKind::Pipe => "pipe",
            ElementKind::Fitting => "fitting",
            ElementKind::Rise => "rise",
            ElementKind::Equipment => "equipment",
            ElementKind::SectionChange => "section_change",
            ElementKind::Pump => "pump",
        }
    }
}

/// One element's share of the result.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct ElementResult {
    /// What the element is.
    pub kind: ElementKind,
    /// The element's label (see [`Line::label`]: the user's, or kind and index such as
    /// `"pipe 3"`, `"6 × elbow_90_long 2"` for counted fittings); an implied change of
    /// section is named by its bores.
    pub label: String,
    /// Index of the line element this row stands for; `None` for an abrupt change of
    /// section the route implies between two elements.
    pub element: Option<usize>,
    /// Mean velocity in the element's bore, m/s (signed; `None` for rises and rated drops,
    /// which have no bore of their own).
    pub velocity: Option<f64>,
    /// Reynolds number in that bore (`None` where there is no bore).
    pub reynolds: Option<f64>,
    /// The bore the velocity is referred to, m: a pipe's hydraulic diameter, a fitting's
    /// bore at its position in the flow path (the downstream bore of a transition);
    /// `None` for rises and rated drops.
    pub bore: Option<f64>,
    /// Length of a pipe, m (`None` for every other row).
    pub length: Option<f64>,
    /// Flow regime (pipes).
    pub regime: Option<Regime>,
    /// Darcy friction factor (pipes).
    pub friction_factor: Option<f64>,
    /// Resistance coefficient K at this Reynolds number (fittings and fixed-K equipment).
    pub k: Option<f64>,
    /// Head loss, m of the flowing fluid (signed with the flow; 0 for rises; for a pump
    /// the negative of the head it adds, −H(Q)).
    pub head_loss: f64,
    /// d(head loss)/dQ, s/m².
    pub dhead_dflow: f64,
    /// Elevation change, m (rises; 0 otherwise).
    pub static_head: f64,
    /// Static pressure at the element's outlet, Pa absolute (with an inlet pressure).
    pub pressure_out: Option<f64>,
    /// Total pressure (static + ½ρV²) at the element's outlet, Pa absolute (with an inlet
    /// pressure).
    pub total_pressure_out: Option<f64>,
    /// Elevation of the element's outlet above the line's inlet, m.
    pub elevation_out: f64,
    /// Warnings of this element.
    pub warnings: Warnings,
    /// Band of the head loss, m.
    pub head_loss_band: Band,
    /// Band of the friction factor (pipes).
    pub friction_factor_band: Option<Band>,
    /// How many identical fittings the row stands for (1 for every other row).
    #[serde(default = "one")]
    pub count: u32,
    /// The row's share of the variance of the line's head loss (see
    /// [`LineResult::shares`]); `None` when the line's band has no width.
    #[serde(default)]
    pub band_share: Option<f64>,
}

fn one() -> u32 {
    1
}

/// A line evaluated at one flow.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LineResult {
    /// The flow, m³/s (signed; at inlet conditions for a gas).
    pub flow: f64,
    /// Friction plus minor losses, m of the flowing fluid, less the head of the line's
    /// pumps (a pump row's head loss is −H(Q)).
    pub head_loss: f64,
    /// ρ·g·head_loss, Pa.
    pub pressure_loss: f64,
    /// Sum of the rises, m.
    pub static_head: f64,
    /// head_loss + static_head, m (summed element by element in route order).
    pub required_head: f64,
    /// d(required_head)/dQ, s/m².
    pub drequired_head_dflow: f64,
    /// ρ·g·required_head, Pa: the pressure rise a pump, fan or blower must supply to drive
    /// the flow (for a gas the figure to lead with: friction and fittings plus
    /// (ρ − ρ_surroundings)·g·Δz for each rise).
    pub required_pressure: f64,
    /// Density the heads refer to, kg/m³ (the mean density for a gas).
    pub density: f64,
    /// Vapour pressure of the liquid, Pa, where known (for NPSH and cavitation).
    pub vapour_pressure: Option<f64>,
    /// Static pressure at the inlet, Pa absolute, when known (for a line that starts with
    /// an inlet from a tank: the pressure on the tank's surface).
    pub inlet_pressure: Option<f64>,
    /// Static pressure at the outlet, Pa absolute, when the inlet pressure is known.
    pub outlet_pressure: Option<f64>,
    /// Per element, in route order.
    pub elements: Vec<ElementResult>,
    /// Union of the elements' warnings and the line's own (gas, cavitation).
    pub warnings: Warnings,
    /// What each warning found, in words (the element, the values, the likely cause).
    pub messages: Vec<String>,
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
        // Sized once: collecting through a `Result` would grow it by copies.
        let mut states: Vec<State> = Vec::with_capacity(self.resolved.len());
        for i in 0..self.resolved.len() {
            states.push(self.element_state(i, &work, q, None, true)?);
        }
        let rho_g = work.density * STANDARD_GRAVITY;
        let dq = if flow == 0.0 { 1.0 } else { q / flow };
        let head_loss: f64 = states.iter().map(|s| s.head_loss).sum();
        let static_head: f64 = states.iter().map(|s| s.static_head).sum();
        // Summed in route order exactly as the system curve does, so both agree bit for bit.
        let required_head: f64 = states
            .iter()
            .fold(0.0, |acc, s| acc + (s.head_loss + s.static_head))
            + self.end_head(&work);
        let slope: f64 = states.iter().map(|s| s.dhead_dflow).sum::<f64>() * dq;
        let mut warnings = gas_warn;
        let mut messages: Vec<String> = Vec::new();
        for (w, m) in &self.notes {
            warnings |= *w;
            messages.push(m.clone());
        }
        if let Some((w, m)) = plausible::fluid_note(fluid) {
            warnings |= w;
            messages.push(m);
        }
        for (i, r) in self.resolved.iter().enumerate() {
            if let Resolved::Drop {
                name,
                rating_density,
                ..
            } = r
            {
                if let Some(m) =
                    plausible::rating_note(self.origin[i], name, *rating_density, fluid)
                {
                    warnings |= Warnings::IMPLAUSIBLE_RATED_DROP;
                    messages.push(m);
                }
            }
        }
        let v_limit = plausible::max_velocity(fluid);
        let mut fastest: Option<(usize, f64)> = None;
        // Grade line: total pressure falls by ρg·loss and by ρg·Δz of the fluid's own
        // column (absolute pressures inside the line); static = total − ½ρV². A line that
        // starts with an inlet from a tank starts at the tank's surface, where the
        // velocity is zero: the inlet pressure is then a total pressure, and the velocity
        // head is spent through the inlet. Otherwise it is the static pressure in the
        // first element's bore.
        let first_v = states.iter().find_map(|s| s.velocity).unwrap_or(0.0);
        let from_tank =
            matches!(self.elements.first(), Some(Element::Fitting(f)) if f.is_from_tank());
        let mut total = inlet.map(|p| {
            if from_tank {
                p
            } else {
                p + 0.5 * work.density * first_v * first_v
            }
        });
        let mut last_v = first_v;
        let mut elevation = 0.0;
        let mut elements = Vec::with_capacity(states.len());
        let sources = Sources::of(self);
        let mut terms = sources.zero_terms();
        let mut element_terms = Vec::with_capacity(states.len());
        for (i, s) in states.iter().enumerate() {
            if let Some(v) = s.velocity {
                last_v = v;
            }
            let height = match &self.resolved[i] {
                Resolved::Rise { height, .. } => *height,
                _ => 0.0,
            };
            elevation += height;
            total = total.map(|t| t - rho_g * (s.head_loss + height));
            let pressure_out = total.map(|t| t - 0.5 * work.density * last_v * last_v);
            let mut w = s.warnings;
            if let Some(v) = s.velocity.filter(|v| v.abs() > v_limit) {
                w.insert(Warnings::IMPLAUSIBLE_VELOCITY);
                if fastest.is_none_or(|(_, f)| v.abs() > f) {
                    fastest = Some((i, v.abs()));
                }
            }
            // No vapour pressure compares as −∞. Written as a select rather than a match on
            // both options, so that no branch reads an absent option's payload (memcheck
            // reports such speculated comparisons).
            let pv = work.vapour_pressure.unwrap_or(f64::NEG_INFINITY);
            if pressure_out.is_some_and(|p| p < pv) {
                let p = pressure_out.unwrap_or(pv);
                w.insert(Warnings::BELOW_VAPOUR_PRESSURE);
                messages.push(format!(
                    "static pressure {p:.0} Pa after element {} is below the vapour pressure {pv:.0} Pa: cavitation or flashing is likely",
                    self.origin[i].map_or_else(|| "(implied change of section)".to_string(), |e| e.to_string())
                ));
            }
            warnings |= w;
            let (bands, own) = sources.element_bands(self, i, s, &work, &mut terms);
            element_terms.push(own);
            let mut e = self.element_result(i, s, bands, pressure_out, w);
            e.total_pressure_out = total;
            e.elevation_out = elevation;
            elements.push(e);
        }
        for (e, share) in elements
            .iter_mut()
            .zip(uncertainty::variance_shares(&element_terms, &terms))
        {
            e.band_share = share;
        }
        if let Some((i, v)) = fastest {
            messages.push(plausible::velocity_note(self.origin[i], v, flow, v_limit));
        }
        let mut bands =
            uncertainty::line_bands(self, &sources, terms, &work, head_loss, required_head);
        if self.reaches_transition(&states, &work) {
            for b in [
                &mut bands.head_loss,
                &mut bands.pressure_loss,
                &mut bands.required_head,
            ] {
                b.non_linear = true;
            }
        }
        Ok(LineResult {
            flow,
            head_loss,
            pressure_loss: rho_g * head_loss,
            static_head,
            required_head,
            drequired_head_dflow: slope,
            required_pressure: rho_g * required_head,
            density: work.density,
            vapour_pressure: work.vapour_pressure,
            inlet_pressure: inlet,
            outlet_pressure: elements.last().and_then(|e| e.pressure_out),
            warnings,
            messages,
            pressure_loss_band: bands.pressure_loss,
            required_head_band: bands.required_head,
            head_loss_band: bands.head_loss,
            elements,
        })
    }

    fn element_result(
        &self,
        i: usize,
        s: &State,
        (head_loss_band, friction_factor_band): (Band, Option<Band>),
        pressure_out: Option<f64>,
        warnings: Warnings,
    ) -> ElementResult {
        let (kind, name) = match &self.resolved[i] {
            Resolved::Pipe { .. } => (ElementKind::Pipe, "pipe".to_string()),
            Resolved::Fitting { name, role, .. } => (
                match role {
                    Role::Fitting => ElementKind::Fitting,
                    Role::Equipment => ElementKind::Equipment,
                    Role::Abrupt => ElementKind::SectionChange,
                },
                name.clone(),
            ),
            Resolved::Rise { .. } => (ElementKind::Rise, "rise".to_string()),
            Resolved::Drop { name, .. } => (ElementKind::Equipment, name.clone()),
            Resolved::Pump { .. } => (ElementKind::Pump, "pump".to_string()),
        };
        let warnings = if self.origin[i].is_none() {
            warnings | Warnings::BORE_CHANGE_WITHOUT_TRANSITION
        } else {
            warnings
        };
        // A row of the route shows its element's label; an implied change of section its
        // own name.
        let label = self.origin[i].and_then(|j| self.label(j)).unwrap_or(name);
        let (bore, length) = match &self.resolved[i] {
            Resolved::Pipe { pipe, .. } => (Some(pipe.bore()), Some(pipe.length())),
            Resolved::Fitting { bore, .. } => (Some(*bore), None),
            Resolved::Rise { .. } | Resolved::Drop { .. } | Resolved::Pump { .. } => (None, None),
        };
        ElementResult {
            bore,
            length,
            kind,
            label,
            count: self.origin[i].and_then(|j| self.count(j)).unwrap_or(1),
            band_share: None,
            element: self.origin[i],
            velocity: s.velocity,
            reynolds: s.reynolds,
            regime: s.regime,
            friction_factor: s.friction_factor,
            k: s.k,
            head_loss: s.head_loss,
            dhead_dflow: s.dhead_dflow,
            static_head: s.static_head,
            pressure_out,
            total_pressure_out: None,
            elevation_out: 0.0,
            warnings,
            head_loss_band,
            friction_factor_band,
        }
    }
}

/// NPSH available at a boundary of a line, checked against a pump's NPSH required.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct NpshCheck {
    /// NPSH available, m: (p_total − p_v)/(ρ g).
    pub available: f64,
    /// The NPSH required as stated, m.
    pub required: f64,
    /// The margin asked for above the NPSH required, m.
    pub margin: f64,
    /// available ≥ required + margin.
    pub sufficient: bool,
}

impl Line {
    /// True when some pipe's Reynolds number (on its turbulent diameter) reaches into the
    /// laminar–turbulent transition within its own 95 % range, from the bore tolerance
    /// and the fluid's uncertainties ([`crate::band::reaches_transition`]).
    fn reaches_transition(&self, states: &[State], fluid: &Fluid) -> bool {
        let uo = &self.options.uncertainty;
        let u_fluid = if uo.fluid {
            crate::math::hypot(
                fluid.viscosity_rel_uncertainty,
                fluid.density_rel_uncertainty,
            )
        } else {
            0.0
        };
        // Re = 4ρQ/(πμD) at a fixed flow: every input enters with exponent ±1.
        let u_re = crate::math::hypot(uo.diameter, u_fluid);
        let fo = &self.options.friction;
        states
            .iter()
            .zip(&self.resolved)
            .any(|(s, r)| match (r, s.reynolds) {
                (Resolved::Pipe { geometry, .. }, Some(re)) if re > 0.0 => {
                    let re_t = re * geometry.dt / geometry.dh;
                    crate::band::reaches_transition(
                        re_t,
                        u_re,
                        fo.laminar_limit,
                        fo.turbulent_limit,
                    )
                }
                _ => false,
            })
    }
}

impl LineResult {
    /// NPSH available (m) at the outlet of row `index` of [`LineResult::elements`]: the
    /// total pressure there over the vapour pressure, in metres of the liquid,
    /// NPSHa = (p + ½ρV² − p_v)/(ρ g) (definition, e.g. ISO 9906 and the Hydraulic
    /// Institute standards).
    ///
    /// # Errors
    /// `index` not a row of the result; no pressure along the line (no inlet pressure);
    /// no vapour pressure (a gas, or a liquid stated without one).
    pub fn npsh_available(&self, index: usize) -> Result<f64> {
        let n = self.elements.len();
        let row = self.elements.get(index).ok_or_else(|| {
            crate::Error::out_of_range(
                "index",
                index as f64,
                format!(
                    "must be the index of a row of the result (0 … {})",
                    n.saturating_sub(1)
                ),
            )
        })?;
        let total = row.total_pressure_out.ok_or_else(|| {
            crate::Error::invalid(
                "inlet_pressure",
                "NPSH needs the pressure along the line: state the inlet pressure",
            )
        })?;
        let pv = self.vapour_pressure.ok_or_else(|| {
            crate::Error::invalid(
                "fluid",
                "NPSH needs the liquid's vapour pressure (water has it; give a user liquid one)",
            )
        })?;
        Ok((total - pv) / (self.density * STANDARD_GRAVITY))
    }

    /// NPSH available at the outlet of row `index` against `required` (m, ≥ 0, the pump
    /// maker's NPSH required) plus a `margin` (m, ≥ 0; common practice asks 0.5–1 m or
    /// 10–30 % above NPSH required, by the standard that applies).
    ///
    /// # Errors
    /// As [`LineResult::npsh_available`]; `required` or `margin` negative or not finite.
    pub fn npsh_check(&self, index: usize, required: f64, margin: f64) -> Result<NpshCheck> {
        check::non_negative("required", required)?;
        check::non_negative("margin", margin)?;
        let available = self.npsh_available(index)?;
        Ok(NpshCheck {
            available,
            required,
            margin,
            sufficient: available >= required + margin,
        })
    }
}
