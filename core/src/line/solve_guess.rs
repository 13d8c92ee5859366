//! The starting flow of [`Line::flow_for_head`] and the one-sided Newton solver it runs.
//!
//! The start comes from a model of the line in which every loss is `a·Q + b·Q²`: fittings
//! and equipment exactly (their viscous and inertial parts), pipes laminar (`f = C/Re`,
//! linear in Q) or turbulent with Haaland's explicit factor at the model's own Reynolds
//! number (quadratic at fixed f). Three passes of the model settle the Reynolds numbers;
//! the start is then within a few per cent of the root (Haaland is within 1.5 % of
//! Colebrook), and the Newton steps on the exact required head take it from there.
//! Nothing here is a result: only the exact evaluations decide the answer.

use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::friction;
use crate::line::{Line, Resolved};
use crate::units::STANDARD_GRAVITY;

/// Passes of the guess model (each refines the Reynolds numbers of the pipes).
const GUESS_PASSES: usize = 3;

/// A Newton step smaller than this share of the flow ends the solve: the error after
/// the step is then of the order of the step squared (quadratic convergence), far below
/// the rounding of the flow.
const STOP_STEP: f64 = 1e-9;

/// The flow guess as a [`Line::flow_for_head`] start: the flow magnitude (m³/s) that
/// loses `loss` m (> 0) in the direction `sign` (±1).
pub(super) fn start(line: &Line, fluid: &Fluid, loss: f64, sign: f64) -> f64 {
    let nu = fluid.viscosity / fluid.density;
    let g2 = 2.0 * STANDARD_GRAVITY;
    let laminar_limit = line.options.friction.laminar_limit;
    // First pass at a mid-chart Reynolds number, then at the model's own flow.
    let mut q: Option<f64> = None;
    for _ in 0..GUESS_PASSES {
        let (mut a, mut b) = (0.0, 0.0);
        for r in &line.resolved {
            match r {
                Resolved::Pipe { pipe, geometry, .. } => {
                    let (area, dh, dt) = (geometry.area, geometry.dh, geometry.dt);
                    let per_f = pipe.length() / (dh * g2 * area * area); // h = f·per_f·Q²
                    let re_t = q.map_or(1e5, |q| q / area * dt / nu);
                    if re_t < laminar_limit {
                        a += geometry.c * nu * pipe.length() / (dh * dh * g2 * area);
                    } else {
                        b += friction::approximate_factor(re_t, pipe.roughness() / dt) * per_f;
                    }
                }
                Resolved::Fitting {
                    bore,
                    area,
                    resistance,
                    reverse,
                    ..
                } => {
                    let k = if sign < 0.0 { reverse } else { resistance };
                    a += k.k_viscous * nu / (bore * g2 * area);
                    b += k.k_inertial / (g2 * area * area);
                }
                Resolved::Drop {
                    drop,
                    at_flow,
                    rating_density,
                    ..
                } => {
                    b += drop / (at_flow * at_flow * rating_density * STANDARD_GRAVITY);
                }
                _ => {}
            }
        }
        // a·Q + b·Q² = loss, in the form that keeps its precision when b·loss ≪ a².
        let root = 2.0 * loss / (a + (a * a + 4.0 * b * loss).sqrt());
        q = Some(if root.is_finite() && root > 0.0 {
            root
        } else {
            1e-3
        });
    }
    q.unwrap_or(1e-3)
}

/// A root found by [`newton_up`]: where, after how many evaluations, and the slope there.
pub(super) struct Root {
    pub y: f64,
    pub evaluations: usize,
    pub slope: f64,
}

/// Finds `y` in (0, `cap`] with `g(y) = 0` for `g` increasing with `g(0) < 0`, from `y0`:
/// Newton steps on the analytic slope, kept inside the bracket that the signs of `g`
/// establish (bisection when a step would leave it; growth toward `cap` while no point
/// above the root is known). Returns `None` when `g(cap)` is still negative.
///
/// The slope returned is that at the root: the last evaluated slope carried over the last
/// step by the secant of the last two slopes (the step is below 1e-9 of `y`).
///
/// # Errors
/// The errors of `g`; [`Error::NoSolution`] when the iteration limit passes.
pub(super) fn newton_up(
    mut g: impl FnMut(f64) -> Result<(f64, f64)>,
    y0: f64,
    cap: f64,
    max_iter: usize,
) -> Result<Option<Root>> {
    let (mut lo, mut hi, mut hi_known) = (0.0, cap, false);
    let mut y = y0.clamp(f64::MIN_POSITIVE, cap);
    let mut prev: Option<(f64, f64)> = None; // (y, slope) of the previous evaluation
    for it in 1..=max_iter {
        let (v, d) = g(y)?;
        if v == 0.0 {
            return Ok(Some(Root {
                y,
                evaluations: it,
                slope: d,
            }));
        }
        if v < 0.0 {
            if y >= cap {
                return Ok(None);
            }
            lo = y;
        } else {
            hi = y;
            hi_known = true;
        }
        let newton = y - v / d;
        let inside = d > 0.0 && newton > lo && newton < hi;
        let step = newton - y;
        if inside && step.abs() <= STOP_STEP * y {
            let curvature = match prev {
                Some((py, pd)) if py != y => (d - pd) / (y - py),
                _ => 0.0,
            };
            return Ok(Some(Root {
                y: newton,
                evaluations: it,
                slope: d + curvature * step,
            }));
        }
        let next = if inside {
            newton
        } else if hi_known {
            0.5 * (lo + hi)
        } else {
            (4.0 * y).min(cap)
        };
        if (next - y).abs() <= 2.0 * f64::EPSILON * y || hi - lo <= 2.0 * f64::EPSILON * hi {
            return Ok(Some(Root {
                y: next,
                evaluations: it,
                slope: d,
            }));
        }
        prev = Some((y, d));
        y = next;
    }
    Err(Error::no_solution(format!(
        "the solver did not converge in {max_iter} iterations (last bracket [{lo}, {hi}])"
    )))
}
