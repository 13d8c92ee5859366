//! Evaluation of a line's elements at one flow, with optional perturbations of the
//! uncertain inputs (used by the Monte Carlo check; the nominal evaluation has none).

use super::{Line, Resolved, row};
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::friction::{self, Correlation, Regime};
use crate::math;
use crate::pipe::Pipe;
use crate::section::Section;
use crate::units::STANDARD_GRAVITY;
use crate::warning::Warnings;
use rayon::prelude::*;

/// A gas whose pressure loss exceeds this share of the inlet pressure gets a warning
/// (common practice for incompressible treatment of gas flow).
pub const GAS_WARN_RATIO: f64 = 0.1;
/// Beyond this share the incompressible treatment is refused (common practice).
pub const GAS_REFUSE_RATIO: f64 = 0.4;

/// Perturbations of the uncertain inputs. The model acts through one common standard
/// normal deviate, scaled by every pipe's own relative model uncertainty; the sampled
/// factors of each element's own input are drawn by the caller, one draw per source.
#[derive(Debug, Clone)]
pub(crate) struct Perturbation {
    /// Standard normal deviate of the friction model.
    pub model_z: f64,
    /// Factor on every bore.
    pub diameter: f64,
    /// Factor on the density.
    pub density: f64,
    /// Factor on the viscosity.
    pub viscosity: f64,
    /// Factor on each element's own uncertain input: a pipe's roughness, a fitting's K,
    /// an equipment's rating (1 for rises).
    pub own: Vec<f64>,
}

/// Sensitivities ∂h/∂ln θ of one element's head loss, m.
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub(crate) struct Sens {
    pub model: f64,
    pub roughness: f64,
    pub diameter: f64,
    pub density: f64,
    pub viscosity: f64,
    pub own: f64,
}

/// The state of one element at one flow.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct State {
    pub head_loss: f64,
    pub dhead_dflow: f64,
    pub static_head: f64,
    /// Mean velocity, m/s (`None` for an element with no flow area of its own).
    pub velocity: Option<f64>,
    /// Reynolds number in the element's bore (`None` where there is no bore).
    pub reynolds: Option<f64>,
    pub regime: Option<Regime>,
    pub friction_factor: Option<f64>,
    pub k: Option<f64>,
    pub warnings: Warnings,
    pub sens: Sens,
    /// Friction-factor sensitivities for the f band: (∂f/∂ln Re_t, ∂f/∂ln(ε/D)).
    pub f_sens: (f64, f64),
    /// Relative standard uncertainty of the friction model (pipes).
    pub model_u: f64,
    /// Relative standard uncertainty of the roughness (pipes).
    pub roughness_u: f64,
    /// Relative standard uncertainty of the element's own K or rating.
    pub own_u: f64,
}

impl State {
    fn passive(static_head: f64) -> State {
        State {
            head_loss: 0.0,
            dhead_dflow: 0.0,
            static_head,
            velocity: None,
            reynolds: None,
            regime: None,
            friction_factor: None,
            k: None,
            warnings: Warnings::NONE,
            sens: Sens::default(),
            f_sens: (0.0, 0.0),
            model_u: 0.0,
            roughness_u: 0.0,
            own_u: 0.0,
        }
    }
}

/// A section with every length scaled by `k` (for a perturbed diameter).
fn scaled_section(s: &Section, k: f64) -> Result<Section> {
    s.scaled(k)
}

impl Line {
    /// The relative standard uncertainty of a pipe's friction model at its state.
    fn model_u(
        &self,
        pipe: &Pipe,
        regime: Regime,
        re_t: f64,
        rr_t: f64,
        f: f64,
        scale: f64,
    ) -> f64 {
        let uo = &self.options.uncertainty;
        if !uo.friction_model {
            return 0.0;
        }
        let opts = &self.options.friction;
        let turbulent = if pipe.section().is_circular() {
            uo.turbulent_model
        } else {
            uo.non_circular_model
        };
        let explicit = if opts.correlation == Correlation::Colebrook {
            0.0
        } else {
            crate::band::rectangular(opts.correlation.validity().accuracy)
        };
        let turbulent = math::hypot(turbulent, explicit);
        match regime {
            Regime::Laminar => uo.laminar_model,
            Regime::Turbulent => turbulent,
            Regime::Transitional => {
                let o = friction::Options {
                    laminar_constant: pipe.section().laminar_constant() * scale,
                    ..*opts
                };
                match friction::transition_limits(re_t, rr_t, &o) {
                    // ±2u reaches the farther of the two regime values.
                    Ok((fl, ft)) => {
                        math::hypot((f - fl).abs().max((ft - f).abs()) / (2.0 * f), turbulent)
                    }
                    Err(_) => turbulent,
                }
            }
        }
    }

    /// One element's state at signed flow `flow` (m³/s) in `fluid`.
    ///
    /// `bands` asks for the uncertainty inputs (the model uncertainty costs extra
    /// friction evaluations in transitional flow); the solvers' hot path leaves it off.
    pub(crate) fn element_state(
        &self,
        i: usize,
        fluid: &Fluid,
        flow: f64,
        pert: Option<&Perturbation>,
        bands: bool,
    ) -> Result<State> {
        let own = pert.map_or(1.0, |p| p.own[i]);
        let dk = pert.map_or(1.0, |p| p.diameter);
        let nu = fluid.viscosity / fluid.density;
        Ok(match &self.resolved[i] {
            r @ Resolved::Rise { .. } => State::passive(self.rise_head(r, fluid)),
            Resolved::Pipe {
                pipe,
                geometry,
                roughness_u,
                ..
            } => {
                let roughness_u = if self.options.uncertainty.roughness {
                    *roughness_u
                } else {
                    0.0
                };
                let mut m = 1.0;
                let owned;
                let (pipe, geometry) = match pert {
                    None => (pipe, *geometry),
                    Some(p) => {
                        let perturbed = pipe.perturbed(
                            scaled_section(pipe.section(), dk)?,
                            pipe.roughness() * p.own[i],
                        );
                        let g = perturbed.geometry(self.options.turbulent_diameter);
                        owned = perturbed;
                        (&owned, g)
                    }
                };
                let ps = pipe.flow_state_in(&geometry, fluid, flow, &self.options.friction)?;
                let scale = geometry.scale;
                let re_t = ps.reynolds * scale;
                let rr_t = geometry.rel_roughness;
                let model_u = if bands || pert.is_some() {
                    self.model_u(pipe, ps.regime, re_t, rr_t, ps.friction_factor, scale)
                } else {
                    0.0
                };
                if let Some(p) = pert {
                    m = (1.0 + p.model_z * model_u).max(0.0);
                }
                let h = ps.head_loss * m;
                let dhf = ps.dhead_dfactor * m;
                let f_re = ps.df_dre * re_t;
                let f_rr = ps.df_drel_roughness * rr_t;
                State {
                    head_loss: h,
                    dhead_dflow: ps.dhead_dflow * m,
                    static_head: 0.0,
                    velocity: Some(ps.velocity),
                    reynolds: Some(ps.reynolds),
                    regime: Some(ps.regime),
                    friction_factor: Some(ps.friction_factor * m).filter(|f| f.is_finite()),
                    k: None,
                    warnings: ps.warnings,
                    sens: Sens {
                        model: h,
                        roughness: dhf * f_rr,
                        diameter: -5.0 * h - dhf * (f_re + f_rr),
                        density: dhf * f_re,
                        viscosity: -dhf * f_re,
                        own: 0.0,
                    },
                    f_sens: (f_re, f_rr),
                    model_u,
                    roughness_u,
                    own_u: 0.0,
                }
            }
            Resolved::Fitting {
                bore,
                area,
                resistance,
                reverse,
                spread,
                blocks_reverse,
                ..
            } => {
                if flow < 0.0 && *blocks_reverse {
                    return Err(self.reverse_blocked(i, flow));
                }
                // Each direction has its own inertial K (a contraction passed backwards is
                // an expansion); the viscous part is common, so the slope is continuous.
                let resistance = if flow < 0.0 { reverse } else { resistance };
                let (bore, area) = (bore * dk, area * dk * dk);
                let l = row::fitting_loss(resistance, bore, area, nu, flow, own);
                let (hv, hi, re) = (l.viscous, l.inertial, l.reynolds);
                State {
                    head_loss: l.head(),
                    dhead_dflow: l.slope,
                    velocity: Some(l.velocity),
                    reynolds: Some(re),
                    k: (re > 0.0).then(|| resistance.k(re) * own),
                    sens: Sens {
                        diameter: -3.0 * hv - 4.0 * hi,
                        density: -hv,
                        viscosity: hv,
                        own: l.head(),
                        ..Sens::default()
                    },
                    own_u: crate::band::rectangular(*spread),
                    ..State::passive(0.0)
                }
            }
            Resolved::Drop {
                drop,
                at_flow,
                rating_density,
                spread,
                ..
            } => {
                let (h, slope) = row::rated_loss(*drop, *at_flow, *rating_density, flow, own);
                State {
                    head_loss: h,
                    dhead_dflow: slope,
                    sens: Sens {
                        own: h,
                        ..Sens::default()
                    },
                    own_u: crate::band::rectangular(*spread),
                    ..State::passive(0.0)
                }
            }
            Resolved::Pump { curve } => {
                let (lo, hi) = curve.range();
                if !(lo..=hi).contains(&flow) {
                    return Err(self.pump_out_of_range(i, flow));
                }
                // The head it adds is a negative loss; the curve gives H and dH/dQ.
                let (head, slope) = curve.head(flow)?;
                State {
                    head_loss: -head,
                    dhead_dflow: -slope,
                    ..State::passive(0.0)
                }
            }
        })
    }

    /// The error for flow `flow` (m³/s) outside the curve of the pump at row `i`: the
    /// curve is not extrapolated, and a pump run backwards is not modelled.
    pub(crate) fn pump_out_of_range(&self, i: usize, flow: f64) -> Error {
        let (lo, hi) = match &self.resolved[i] {
            Resolved::Pump { curve } => curve.range(),
            _ => (0.0, 0.0),
        };
        let at = self.origin[i].map_or(String::new(), |e| {
            format!(" '{}' (element {e})", self.label(e).unwrap_or_default())
        });
        let why = if flow < 0.0 {
            "is reverse through the pump: a pump run backwards (no check valve) is not modelled"
        } else {
            "is outside the pump's curve: the curve is not extrapolated"
        };
        Error::out_of_range(
            "flow",
            flow,
            format!("{why}; pump{at} has a curve from {lo} to {hi} m³/s"),
        )
    }

    /// The error for reverse flow `flow` (m³/s) through row `i`, which stops it. Every
    /// call that takes a flow gives this one error kind ([`Error::NoSolution`]).
    pub(crate) fn reverse_blocked(&self, i: usize, flow: f64) -> Error {
        Error::no_solution(format!(
            "flow {flow} m³/s is reverse: {}",
            self.reverse_blocked_reason(i)
        ))
    }

    /// "it would pass backwards through NAME (element N), which stops reverse flow".
    pub(crate) fn reverse_blocked_reason(&self, i: usize) -> String {
        let name = match &self.resolved[i] {
            Resolved::Fitting { name, .. } => name.as_str(),
            _ => "an element",
        };
        let at = self.origin[i].map_or(String::new(), |e| format!(" (element {e})"));
        format!(
            "it would pass backwards through {name}{at}, a check valve or foot valve that stops reverse flow"
        )
    }

    /// The first row that stops reverse flow (a check or foot valve), if any.
    pub(crate) fn blocking_row(&self) -> Option<usize> {
        self.resolved.iter().position(|r| {
            matches!(
                r,
                Resolved::Fitting {
                    blocks_reverse: true,
                    ..
                }
            )
        })
    }

    /// Required head (m) and its derivative (s/m²) at one flow, for a liquid or a gas at
    /// a fixed density. No allocation: this is the hot path of solvers and curves.
    pub(crate) fn head_and_slope(&self, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
        // element_state's numbers without the rest (row.rs, solve_hot.rs), same bits.
        let (h, d) = self.hot_head_and_slope(fluid, flow)?;
        if !(h.is_finite() && d.is_finite()) {
            return Err(Error::out_of_range(
                "flow",
                flow,
                "gives a required head or slope that is not a finite number (the losses overflow double precision)",
            ));
        }
        Ok((h + self.end_head(fluid), d))
    }

    /// The fluid to evaluate with and the flow in it: for a gas with a known inlet
    /// pressure, the mean density along the line (fixed-point on the mean pressure) and
    /// the volumetric flow at that density (mass is conserved; `flow` is taken at inlet
    /// conditions). Also returns the warnings of the gas check.
    pub(crate) fn working_fluid(
        &self,
        fluid: &Fluid,
        flow: f64,
        inlet: Option<f64>,
    ) -> Result<(Fluid, f64, Warnings)> {
        check::finite("flow", flow)?;
        let inlet = inlet.or(if fluid.is_gas() { fluid.pressure } else { None });
        let (true, Some(p_in)) = (fluid.is_gas(), inlet) else {
            return Ok((fluid.clone(), flow, Warnings::NONE));
        };
        let gas_in = fluid.at_pressure(p_in)?;
        let mut work = gas_in.clone();
        let mut q = flow;
        let mut dp = 0.0;
        // Converges geometrically (ratio ≈ Δp/2p ≤ 0.2); 60 sweeps reach machine precision.
        for _ in 0..60 {
            let (h, _) = self.head_and_slope(&work, q)?;
            let new_dp = (h - self.static_head_in(&work)) * work.density * STANDARD_GRAVITY;
            let ratio = new_dp.abs() / p_in;
            if ratio > GAS_REFUSE_RATIO {
                return Err(Error::no_solution(format!(
                    "gas pressure loss {:.0} Pa is {:.0} % of the inlet pressure {p_in} Pa; beyond {:.0} % the incompressible treatment does not hold (use a compressible-flow method)",
                    new_dp.abs(),
                    100.0 * ratio,
                    100.0 * GAS_REFUSE_RATIO
                )));
            }
            let converged = (new_dp - dp).abs() <= 1e-14 * new_dp.abs().max(1e-300);
            dp = new_dp;
            work = gas_in.at_pressure(p_in - 0.5 * dp)?;
            q = flow * gas_in.density / work.density;
            if converged {
                break;
            }
        }
        let w = if dp.abs() > GAS_WARN_RATIO * p_in {
            Warnings::GAS_COMPRESSIBILITY
        } else {
            Warnings::NONE
        };
        Ok((work, q, w))
    }

    /// Required head (m of the flowing fluid) at signed flow `flow` (m³/s) and its
    /// derivative d(required head)/dQ (s/m²). For a gas the head is at the mean density.
    pub fn required_head(&self, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
        let (work, q, _) = self.working_fluid(fluid, flow, self.options.inlet_pressure)?;
        let (h, d) = self.head_and_slope(&work, q)?;
        Ok((h, d * q_ratio(flow, q)))
    }

    /// Required head (m) at each of `flows` (m³/s): the system curve. Runs on the threads
    /// [`crate::threads::set_threads`] allows above 4096 points; the result is the same
    /// either way.
    pub fn system_curve(&self, fluid: &Fluid, flows: &[f64]) -> Result<Vec<f64>> {
        // The pipes' friction factors through the vector kernel, same bits (solve_curve.rs).
        if let Some(heads) = self.system_curve_vectorised(fluid, flows) {
            return Ok(heads);
        }
        let one = |(i, &q): (usize, &f64)| {
            self.required_head(fluid, q)
                .map(|r| r.0)
                .map_err(|e| e.at_index(i))
        };
        if flows.len() < 4096 {
            return flows.iter().enumerate().map(one).collect();
        }
        let parallel = crate::threads::in_pool(|| -> Result<Vec<f64>> {
            flows.par_iter().enumerate().map(one).collect()
        });
        match parallel {
            Some(Ok(v)) => Ok(v),
            // One thread allowed, or an error: the serial pass gives the first failing point.
            _ => flows.iter().enumerate().map(one).collect(),
        }
    }
}

/// dQ_work/dQ for the gas mean-density flow (1 for liquids).
fn q_ratio(flow: f64, q: f64) -> f64 {
    if flow == 0.0 { 1.0 } else { q / flow }
}
