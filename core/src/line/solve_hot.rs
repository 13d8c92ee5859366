//! The solvers' hot path: a line's required head and its slope at one flow, with nothing
//! else worked out (no warnings, no band inputs, no result rows), operation for operation
//! as [`Line::element_state`] and [`crate::pipe::Pipe::flow_state`] compute the same two
//! numbers, so the bits are theirs (checked against `evaluate` by the line tests). An
//! element this path does not know, and every case that ends in an error, goes through
//! `element_state` itself, which gives the error.

use crate::error::Result;
use crate::fluid::Fluid;
use crate::friction::{self, Correlation, Options};
use crate::line::{Line, Resolved};
use crate::units::STANDARD_GRAVITY;

impl Line {
    /// Σ (head loss + static head) and Σ d(head loss)/dQ over the rows at `flow` (m³/s)
    /// in `fluid`, summed in route order.
    pub(crate) fn hot_head_and_slope(&self, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
        let g = STANDARD_GRAVITY;
        let nu = fluid.viscosity / fluid.density;
        let opts = &self.options.friction;
        let (mut h, mut d) = (0.0, 0.0);
        for (i, r) in self.resolved.iter().enumerate() {
            let lean = match r {
                Resolved::Rise { .. } => Some((0.0, 0.0, self.rise_head(r, fluid))),
                Resolved::Pipe { pipe, geometry, .. } => {
                    pipe_loss(pipe.length(), pipe.roughness(), geometry, nu, flow, opts)
                        .map(|(l, s)| (l, s, 0.0))
                }
                Resolved::Fitting {
                    bore,
                    area,
                    resistance,
                    reverse,
                    blocks_reverse,
                    ..
                } if !(flow < 0.0 && *blocks_reverse) => {
                    let k = if flow < 0.0 { reverse } else { resistance };
                    let v = flow / area;
                    let hv = k.k_viscous * nu * v / (bore * 2.0 * g) * 1.0;
                    let hi = k.k_inertial * v * v.abs() / (2.0 * g) * 1.0;
                    let slope = (k.k_viscous * nu / bore + 2.0 * k.k_inertial * v.abs())
                        / (2.0 * g * area)
                        * 1.0;
                    Some((hv + hi, slope, 0.0))
                }
                Resolved::Drop {
                    drop,
                    at_flow,
                    rating_density,
                    ..
                } => {
                    // As `element_state`: Δp scales with ρ/ρ_rating, so the head is
                    // drop/(ρ_rating g) · Q|Q|/Q_r².
                    let r = flow / at_flow;
                    let loss = drop * r * r.abs() / (rating_density * g) * 1.0;
                    let slope = 2.0 * drop * r.abs() / (at_flow * rating_density * g) * 1.0;
                    Some((loss, slope, 0.0))
                }
                _ => None,
            };
            let (loss, slope, rise) = match lean {
                Some(v) => v,
                None => {
                    let s = self.element_state(i, fluid, flow, None, false)?;
                    (s.head_loss, s.dhead_dflow, s.static_head)
                }
            };
            h += loss + rise; // the order of LineResult::required_head
            d += slope;
        }
        Ok((h, d))
    }
}

/// A pipe's head loss and slope as `Pipe::flow_state_in` forms them (times the model
/// factor 1 of a nominal evaluation), or `None` where it would fail or where its checks
/// must speak (non-finite flow, Reynolds number out of range, non-finite result).
#[inline]
fn pipe_loss(
    length: f64,
    roughness: f64,
    gm: &crate::pipe::Geometry,
    nu: f64,
    flow: f64,
    opts: &Options,
) -> Option<(f64, f64)> {
    if !flow.is_finite() {
        return None;
    }
    let (area, dh, dt, c) = (gm.area, gm.dh, gm.dt, gm.c);
    let scale = dt / dh;
    let velocity = flow / area;
    let speed = velocity.abs();
    let re_h = speed * dh / nu;
    let re_t = re_h * scale;
    let geom = length / (dh * (2.0 * STANDARD_GRAVITY));
    if re_t > friction::MAX_REYNOLDS {
        return None;
    }
    let laminar_direct = re_t < opts.laminar_limit && opts.correlation != Correlation::Churchill;
    let (loss, slope) = if laminar_direct || re_t < friction::MIN_REYNOLDS {
        let lam_head_per_speed = c * nu / dh * geom;
        (lam_head_per_speed * velocity, lam_head_per_speed / area)
    } else {
        let o = Options {
            laminar_constant: c * scale,
            ..*opts
        };
        let rr = roughness / dt;
        // Re is inside its range here (checked above); the options were checked when the
        // line was built, and c·scale is the section's constant or 64 (Jones): only ε/D
        // on the turbulent diameter is left to check.
        if !(0.0..=friction::MAX_REL_ROUGHNESS).contains(&rr) {
            return None;
        }
        let (f, df_dre) = friction::factor_slope(re_t, rr, &o).ok()?;
        (
            f * geom * velocity * speed,
            geom * speed * (re_t * df_dre + 2.0 * f) / area,
        )
    };
    (loss.is_finite() && slope.is_finite()).then_some((loss * 1.0, slope * 1.0))
}
