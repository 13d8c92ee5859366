//! Sizing: the smallest bore that keeps a line within a limit at a given flow.
//!
//! Every round pipe of the line, or of a chosen section, takes the same trial inside
//! diameter, with fittings and transitions following by the rule of [`Resize`] (a
//! reducer left between equal bores is removed, fittings with a stated bore take the
//! new one, equipment with a fixed bore refuses); the pressure loss falls strictly as the bore
//! grows, so the smallest admissible bore is a bracketed root. The standard-size answer
//! walks up the chosen pipe table from there, and also names the size that still meets
//! the limit at the unfavourable end of the uncertainty band.

use super::solve::safeguarded_newton;
use super::{Line, Resize};
use crate::band::Band;
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::math;
use crate::sizes::{self, PipeSize, PipeTable};
use serde::{Deserialize, Serialize};

/// Smallest and largest trial bores, m.
const D_MIN: f64 = 1e-4;
const D_MAX: f64 = 20.0;

/// What must not be exceeded.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub enum Limit {
    /// Largest allowed pressure loss of the line (friction + minor, without rises), Pa.
    PressureLoss(f64),
    /// Largest allowed mean velocity in the round pipes, m/s.
    Velocity(f64),
}

/// A standard size checked against the limit.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct SizeChoice {
    /// The standard pipe.
    pub size: PipeSize,
    /// Velocity in it, m/s.
    pub velocity: f64,
    /// Pressure loss of the line with it, Pa.
    pub pressure_loss: f64,
    /// Band of that pressure loss, Pa.
    pub pressure_loss_band: Band,
}

/// The answer of [`Line::size`].
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Sizing {
    /// The smallest inside diameter that meets the limit at the nominal values, m.
    pub min_inside_diameter: f64,
    /// The smallest standard size that meets it at the nominal values.
    pub standard: Option<SizeChoice>,
    /// The smallest standard size that still meets it at the band's unfavourable end
    /// (the high end of the pressure-loss band; for a velocity limit, the same as
    /// `standard` unless a diameter tolerance is set).
    pub standard_at_band: Option<SizeChoice>,
}

impl Line {
    /// Sizes the line's round pipes for `flow` (m³/s, ≠ 0) under `limit`, optionally to a
    /// standard table and schedule (e.g. `(PipeTable::Pvc, "40")`).
    ///
    /// # Errors
    /// Zero or non-finite flow; a non-positive limit; a line without round pipes; a limit
    /// no bore up to 20 m meets; no standard size large enough; equipment with a fixed
    /// bore (see [`Line::with_diameter_in`]).
    pub fn size(
        &self,
        fluid: &Fluid,
        flow: f64,
        limit: Limit,
        table: Option<(PipeTable, &str)>,
    ) -> Result<Sizing> {
        self.size_in(fluid, flow, limit, table, &Resize::default())
    }

    /// Sizes the round pipes of the section and material `scope` names (see [`Resize`]):
    /// as [`Line::size`], every trial resizes only that section (its pipes made of the
    /// named material, with its roughness), and the loss limit applies to the whole line.
    ///
    /// # Errors
    /// As [`Line::size`]; the errors of [`Line::with_diameter_in`] for the scope.
    pub fn size_in(
        &self,
        fluid: &Fluid,
        flow: f64,
        limit: Limit,
        table: Option<(PipeTable, &str)>,
        scope: &Resize,
    ) -> Result<Sizing> {
        check::finite("flow", flow)?;
        if flow == 0.0 {
            return Err(Error::out_of_range(
                "flow",
                flow,
                "must not be zero for sizing",
            ));
        }
        self.resize_range(scope)?;
        let q = flow.abs();
        let min_d = match limit {
            Limit::Velocity(v) => {
                check::positive("velocity", v)?;
                (4.0 * q / (std::f64::consts::PI * v)).sqrt()
            }
            Limit::PressureLoss(dp) => {
                check::positive("pressure_loss", dp)?;
                let excess = |ln_d: f64| -> Result<(f64, f64)> {
                    let d = math::exp(ln_d);
                    let r = self.with_diameter_in(d, scope)?.evaluate(fluid, q)?;
                    // Decreasing in d: negate so the solver sees an increasing function.
                    Ok((dp - r.pressure_loss, f64::NAN))
                };
                let (lo, hi) = (math::ln(D_MIN), math::ln(D_MAX));
                if excess(hi)?.0 < 0.0 {
                    return Err(Error::no_solution(format!(
                        "even a {D_MAX} m bore loses more than {dp} Pa at {q} m³/s (the fixed-bore elements alone may exceed it)"
                    )));
                }
                if excess(lo)?.0 >= 0.0 {
                    D_MIN
                } else {
                    math::exp(safeguarded_newton(excess, lo, hi)?.0)
                }
            }
        };
        let (standard, standard_at_band) = match table {
            None => (None, None),
            Some((t, schedule)) => {
                let walk = |from, banded| {
                    self.walk_table(fluid, q, limit, (t, schedule), scope, from, banded)
                };
                let nominal = walk(min_d, false)?;
                let banded = walk(nominal.size.inside_diameter, true)?;
                (Some(nominal), Some(banded))
            }
        };
        Ok(Sizing {
            min_inside_diameter: min_d,
            standard,
            standard_at_band,
        })
    }

    /// The smallest size of the table at least `from` that meets the limit (at the band's
    /// high end when `banded`).
    #[allow(clippy::too_many_arguments)]
    fn walk_table(
        &self,
        fluid: &Fluid,
        q: f64,
        limit: Limit,
        (table, schedule): (PipeTable, &str),
        scope: &Resize,
        from: f64,
        banded: bool,
    ) -> Result<SizeChoice> {
        let mut want = from;
        loop {
            let size = sizes::smallest_at_least(table, schedule, want)?;
            let d = size.inside_diameter;
            let r = self.with_diameter_in(d, scope)?.evaluate(fluid, q)?;
            let velocity = q / (0.25 * std::f64::consts::PI * d * d);
            let tol = self.options.uncertainty.diameter;
            let ok = match limit {
                Limit::PressureLoss(dp) => {
                    (if banded {
                        r.pressure_loss_band.high
                    } else {
                        r.pressure_loss
                    }) <= dp
                }
                // A bore at the low end of its tolerance (k = 2) runs faster.
                Limit::Velocity(v) => {
                    velocity
                        * if banded {
                            math::powi(1.0 - 2.0 * tol, -2)
                        } else {
                            1.0
                        }
                        <= v
                }
            };
            if ok {
                return Ok(SizeChoice {
                    size,
                    velocity,
                    pressure_loss: r.pressure_loss,
                    pressure_loss_band: r.pressure_loss_band,
                });
            }
            // Next size up: anything strictly larger than this one's bore.
            want = d * (1.0 + 1e-9);
        }
    }
}
