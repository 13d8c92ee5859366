//! Inverse questions on a line: the flow a head delivers and the pump operating point.
//!
//! Both are one-dimensional roots of monotone functions (the required head rises strictly
//! with flow whenever the line has any loss), solved by a bracket that is kept at every
//! step and Newton steps on the analytic derivative, falling back to bisection whenever a
//! Newton step would leave the bracket. Convergence is therefore guaranteed, and the
//! iteration count is bounded.

use super::{Line, PumpCurve, uncertainty};
use crate::band::Band;
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use serde::{Deserialize, Serialize};

/// Iteration cap of the safeguarded Newton solver (bisection alone would need ~2100 steps
/// to exhaust a double's range; Newton with bracketing finishes in well under 100).
const MAX_ITER: usize = 400;

/// The largest change of head that one rounding of the solved flow may cause before
/// [`Line::flow_for_head`] refuses its answer as unresolvable (relative to the larger of
/// the head, the static head and 1 m; an ordinary line is near 1e-15).
const HEAD_CHECK_TOL: f64 = 1e-8;

/// The largest flow the inverse solvers look for, m³/s.
const MAX_FLOW: f64 = 1e6;

#[path = "solve_guess.rs"]
mod guess;

#[path = "solve_curve.rs"]
mod curve;

#[path = "solve_hot.rs"]
mod hot;

/// The flow a line passes under a given head.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct FlowSolution {
    /// Signed flow, m³/s (negative when the head is below the static head).
    pub flow: f64,
    /// The head it was solved for, m.
    pub head: f64,
    /// d(required head)/dQ at the solution, s/m².
    pub drequired_head_dflow: f64,
    /// Band of the flow, m³/s (first order through the line's sensitivities).
    pub flow_band: Band,
    /// Solver iterations used.
    pub iterations: usize,
}

/// Finds `x` in the bracket `[lo, hi]` with `g(x) = 0`, where `g` returns (value, slope)
/// and `g(lo) ≤ 0 ≤ g(hi)` (g increasing). Returns (x, iterations).
///
/// # Errors
/// The errors of `g`; [`Error::NoSolution`] when the iteration limit is reached before
/// the bracket or the Newton step shrinks to the rounding of `x` (never a result that has
/// not converged).
pub(crate) fn safeguarded_newton(
    mut g: impl FnMut(f64) -> Result<(f64, f64)>,
    mut lo: f64,
    mut hi: f64,
) -> Result<(f64, usize)> {
    let mut x = 0.5 * (lo + hi);
    for it in 1..=MAX_ITER {
        let (v, d) = g(x)?;
        if v == 0.0 {
            return Ok((x, it));
        }
        if v < 0.0 {
            lo = x;
        } else {
            hi = x;
        }
        let newton = x - v / d;
        // Converged: the Newton step is below the rounding of x. (Tested before the
        // bracket, since a step that rounds to x itself is not strictly inside it.)
        if d > 0.0 && (newton - x).abs() <= 2.0 * f64::EPSILON * x.abs() {
            return Ok((newton, it));
        }
        let next = if d > 0.0 && newton > lo && newton < hi {
            newton
        } else {
            0.5 * (lo + hi)
        };
        if (next - x).abs() <= 2.0 * f64::EPSILON * x.abs()
            || hi - lo <= 2.0 * f64::EPSILON * x.abs().max(f64::MIN_POSITIVE)
        {
            return Ok((next, it));
        }
        x = next;
    }
    Err(Error::no_solution(format!(
        "the solver did not converge in {MAX_ITER} iterations (last bracket [{lo}, {hi}])"
    )))
}

/// The root of `g` (value, slope; increasing) in `[lo, hi]`, bracketed: `g` at both ends
/// first, then [`safeguarded_newton`]. Returns (x, iterations).
///
/// # Errors
/// [`Error::NoSolution`] with `above(g(lo))` when g(lo) > 0, `below(g(hi))` when
/// g(hi) < 0; the errors of `g` and of [`safeguarded_newton`].
pub(crate) fn root_in_range(
    mut g: impl FnMut(f64) -> Result<(f64, f64)>,
    (lo, hi): (f64, f64),
    above: impl FnOnce(f64) -> String,
    below: impl FnOnce(f64) -> String,
) -> Result<(f64, usize)> {
    let (g_lo, _) = g(lo)?;
    let (g_hi, _) = g(hi)?;
    if g_lo > 0.0 {
        return Err(Error::no_solution(above(g_lo)));
    }
    if g_hi < 0.0 {
        return Err(Error::no_solution(below(g_hi)));
    }
    if g_lo == 0.0 {
        return Ok((lo, 0));
    }
    if g_hi == 0.0 {
        return Ok((hi, 0));
    }
    safeguarded_newton(g, lo, hi)
}

impl Line {
    /// The signed flow (m³/s) for which the required head equals `head` (m): gravity
    /// feed, tank to tank. A head below the static head gives reverse flow.
    ///
    /// On a line with pumps the flow is looked for inside the range their curves share
    /// (see [`Line::pumped_flow`]).
    ///
    /// # Errors
    /// A line without any loss; a head that needs reverse flow through a check or foot
    /// valve; a head no flow up to 1e6 m³/s reaches; on a line with pumps, a head no flow
    /// inside their range reaches.
    pub fn flow_for_head(&self, fluid: &Fluid, head: f64) -> Result<FlowSolution> {
        check::finite("head", head)?;
        // With pumps, the flow lies inside their curves' common range (pumped.rs).
        if let Some(range) = self.pump_flow_range()? {
            return self.flow_for_head_pumped(fluid, head, range);
        }
        if !self.has_resistance() {
            return Err(Error::invalid(
                "line",
                "has no element with a loss, so no flow balances a head",
            ));
        }
        let h0 = self.static_head_in(fluid);
        let sign = if head > h0 {
            1.0
        } else if head < h0 {
            -1.0
        } else {
            0.0
        };
        if sign < 0.0 {
            if let Some(i) = self.blocking_row() {
                return Err(Error::no_solution(format!(
                    "head {head} m is below the static head {h0} m: {}",
                    self.reverse_blocked_reason(i)
                )));
            }
        }
        let (flow, iterations, slope) = if sign == 0.0 {
            (0.0, 0, self.required_head(fluid, 0.0)?.1)
        } else {
            // In the direction of flow: y = |Q|, G(y) = sign·(h(sign·y) − head) rises
            // from G(0) < 0.
            let g = |y: f64| {
                self.required_head(fluid, sign * y)
                    .map(|(h, d)| (sign * (h - head), d))
            };
            let y0 = guess::start(self, fluid, (head - h0).abs(), sign);
            // A trial flow the line cannot carry (its losses overflow) is the head's fault:
            // the message names the head the caller gave.
            let solved = guess::newton_up(g, y0, MAX_FLOW, MAX_ITER).map_err(|e| {
                if e.kind() == crate::ErrorKind::OutOfRange {
                    Error::out_of_range(
                        "head",
                        head,
                        format!("needs a flow whose losses cannot be evaluated ({e})"),
                    )
                } else {
                    e
                }
            })?;
            let Some(root) = solved else {
                return Err(Error::no_solution(format!(
                    "no flow up to {MAX_FLOW:e} m³/s reaches head {head} m"
                )));
            };
            (sign * root.y, root.evaluations, root.slope)
        };
        // Self-consistency: one rounding of the flow must not move the head by more than
        // the tolerance (it does when the line's losses are too steep to resolve).
        let resolution = (slope * flow).abs() * 4.0 * f64::EPSILON;
        if resolution > HEAD_CHECK_TOL * head.abs().max(h0.abs()).max(1.0) {
            return Err(Error::no_solution(format!(
                "the flow for head {head} m ({flow} m³/s) cannot be resolved in double precision: one rounding of it moves the head by {resolution:e} m (the line's losses are too steep)"
            )));
        }
        let flow_band = uncertainty::flow_for_head_band(self, fluid, flow, slope)?;
        Ok(FlowSolution {
            flow,
            head,
            drequired_head_dflow: slope,
            flow_band,
            iterations,
        })
    }
}

/// Where a pump curve meets a line's system curve.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct OperatingPoint {
    /// Flow, m³/s.
    pub flow: f64,
    /// Head, m.
    pub head: f64,
    /// Band of the flow, m³/s.
    pub flow_band: Band,
    /// Band of the head, m.
    pub head_band: Band,
}

impl Line {
    /// The operating point of `pump` on this line.
    ///
    /// # Errors
    /// [`Error::NoSolution`] when the curves do not cross inside the pump curve's range.
    pub fn operating_point(&self, fluid: &Fluid, pump: &PumpCurve) -> Result<OperatingPoint> {
        let (lo, hi) = pump.range();
        let gap = |q: f64| -> Result<(f64, f64)> {
            let (hs, ds) = self.required_head(fluid, q)?;
            let (hp, dp) = pump.head(q)?;
            Ok((hs - hp, ds - dp))
        };
        let (flow, _) = root_in_range(
            gap,
            (lo, hi),
            |g_lo| {
                format!(
                    "the curves do not cross: at the pump curve's smallest flow ({lo} m³/s) the line needs {g_lo:.4} m more head than the pump gives"
                )
            },
            |g_hi| {
                format!(
                    "the curves do not cross: at the pump curve's largest flow ({hi} m³/s) the pump still gives {:.4} m more head than the line needs",
                    -g_hi
                )
            },
        )?;
        let (head, dpump) = pump.head(flow)?;
        let (_, slope) = self.required_head(fluid, flow)?;
        let (flow_band, head_band) =
            uncertainty::operating_point_bands(self, fluid, flow, head, slope, dpump)?;
        let values = [
            ("flow", flow),
            ("head", head),
            ("flow band", flow_band.low),
            ("flow band", flow_band.high),
            ("head band", head_band.low),
            ("head band", head_band.high),
        ];
        if let Some((name, v)) = values.iter().find(|(_, v)| !v.is_finite()) {
            return Err(Error::no_solution(format!(
                "the operating point's {name} is not finite ({v}): the pump curve's heads or the line's losses are too large to combine in double precision"
            )));
        }
        Ok(OperatingPoint {
            flow,
            head,
            flow_band,
            head_band,
        })
    }
}

#[cfg(test)]
#[path = "solve_cost.rs"]
mod cost;

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ErrorKind;

    #[test]
    fn newton_reports_no_convergence_instead_of_a_guess() {
        // A zero slope forces bisection; from [0, 1e300] to a root at 1e-300 bisection
        // needs about 2000 halvings (log2(1e600)), far beyond the limit.
        let e = safeguarded_newton(|x| Ok((x - 1e-300, 0.0)), 0.0, 1e300).unwrap_err();
        assert_eq!(e.kind(), ErrorKind::NoSolution);
        assert!(e.to_string().contains("did not converge"), "{e}");
        // The same function from a sane bracket converges (exact root 0.5, by construction).
        let (x, _) = safeguarded_newton(|x| Ok((x - 0.5, 1.0)), 0.0, 1.0).unwrap();
        assert_eq!(x, 0.5);
    }
}
