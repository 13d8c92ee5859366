//! Inverse questions on a line: the flow a head delivers and the pump operating point.
//!
//! Both are one-dimensional roots of monotone functions (the required head rises strictly
//! with flow whenever the line has any loss), solved by a bracket that is kept at every
//! step and Newton steps on the analytic derivative, falling back to bisection whenever a
//! Newton step would leave the bracket. Convergence is therefore guaranteed, and the
//! iteration count is bounded.

use super::{Line, uncertainty};
use crate::band::Band;
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::math;
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

impl Line {
    /// The signed flow (m³/s) for which the required head equals `head` (m): gravity
    /// feed, tank to tank. A head below the static head gives reverse flow.
    ///
    /// # Errors
    /// A line without any loss; a head that needs reverse flow through a check or foot
    /// valve; a head no flow up to 1e6 m³/s reaches.
    pub fn flow_for_head(&self, fluid: &Fluid, head: f64) -> Result<FlowSolution> {
        check::finite("head", head)?;
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

/// A pump's head against flow, interpolated by a monotone cubic (Fritsch and Carlson,
/// 1980, SIAM J. Numer. Anal. 17(2) 238–246), so the interpolant never rises where the
/// data falls. Deserialising runs the checks of [`PumpCurve::new`] on the points and
/// works the slopes out again (they are never read from the stored form).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "PumpCurveSpec", into = "PumpCurveSpec")]
pub struct PumpCurve {
    flows: Vec<f64>,
    heads: Vec<f64>,
    slopes: Vec<f64>,
}

/// The stored form of a [`PumpCurve`]: its points only.
#[derive(Serialize, Deserialize)]
struct PumpCurveSpec {
    flows: Vec<f64>,
    heads: Vec<f64>,
}

impl TryFrom<PumpCurveSpec> for PumpCurve {
    type Error = Error;
    fn try_from(s: PumpCurveSpec) -> Result<PumpCurve> {
        PumpCurve::new(&s.flows, &s.heads)
    }
}

impl From<PumpCurve> for PumpCurveSpec {
    fn from(c: PumpCurve) -> PumpCurveSpec {
        PumpCurveSpec {
            flows: c.flows,
            heads: c.heads,
        }
    }
}

/// Most points a pump curve accepts (a measured curve has tens).
pub const PUMP_CURVE_MAX_POINTS: usize = 10_000;
/// Largest flow of a pump curve point, m³/s (the inverse solvers' range; the largest
/// pumps built pass tens of m³/s).
pub const PUMP_CURVE_MAX_FLOW: f64 = 1e6;
/// Largest head (in magnitude) of a pump curve point, m: far above any pump built, and
/// low enough that the interpolation cannot overflow.
pub const PUMP_CURVE_MAX_HEAD: f64 = 1e6;

impl PumpCurve {
    /// A curve through (flow m³/s, head m) points: 3 to [`PUMP_CURVE_MAX_POINTS`], flows
    /// from 0 to [`PUMP_CURVE_MAX_FLOW`] strictly increasing, heads within
    /// ±[`PUMP_CURVE_MAX_HEAD`] and non-increasing with flow, every slope between two
    /// points a finite number.
    ///
    /// # Errors
    /// Lists of different lengths or with too few or too many points; a flow or head not
    /// finite; flows not strictly increasing; a head that rises with flow; points so close
    /// together or heads so far apart that the slope between them is not a finite number.
    pub fn new(flows: &[f64], heads: &[f64]) -> Result<PumpCurve> {
        if flows.len() != heads.len() {
            return Err(Error::invalid(
                "heads",
                format!("has {} values but flows has {}", heads.len(), flows.len()),
            ));
        }
        if flows.len() < 3 {
            return Err(Error::invalid(
                "flows",
                format!("a pump curve needs at least 3 points, got {}", flows.len()),
            ));
        }
        for (i, (&q, &h)) in flows.iter().zip(heads).enumerate() {
            check::within("flows", q, 0.0, PUMP_CURVE_MAX_FLOW, "m³/s")
                .map_err(|e| e.at_index(i))?;
            check::within("heads", h, -PUMP_CURVE_MAX_HEAD, PUMP_CURVE_MAX_HEAD, "m")
                .map_err(|e| e.at_index(i))?;
            if i > 0 && q <= flows[i - 1] {
                return Err(Error::out_of_range(
                    "flows",
                    q,
                    format!(
                        "must increase strictly (point {i} is not above point {})",
                        i - 1
                    ),
                )
                .at_index(i));
            }
            if i > 0 && h > heads[i - 1] {
                return Err(Error::out_of_range("heads", h, format!("must not rise with flow (point {i} is above point {}): the curve is not monotonic", i - 1)).at_index(i));
            }
        }
        if flows.len() > PUMP_CURVE_MAX_POINTS {
            return Err(Error::invalid(
                "flows",
                format!(
                    "a pump curve takes at most {PUMP_CURVE_MAX_POINTS} points, got {}",
                    flows.len()
                ),
            ));
        }
        let n = flows.len();
        let mut delta = Vec::with_capacity(n - 1);
        for i in 0..n - 1 {
            let d = (heads[i + 1] - heads[i]) / (flows[i + 1] - flows[i]);
            if !d.is_finite() {
                return Err(Error::out_of_range(
                    "flows",
                    flows[i + 1],
                    format!(
                        "is too close to point {i} ({}) for the head change between them: \
                         the slope is not a finite number",
                        flows[i]
                    ),
                )
                .at_index(i + 1));
            }
            delta.push(d);
        }
        let mut m = vec![0.0; n];
        m[0] = delta[0];
        m[n - 1] = delta[n - 2];
        for i in 1..n - 1 {
            m[i] = if delta[i - 1] * delta[i] <= 0.0 {
                0.0
            } else {
                0.5 * delta[i - 1] + 0.5 * delta[i]
            };
        }
        // Fritsch–Carlson limiter: keep (α, β) inside the circle of radius 3.
        for i in 0..n - 1 {
            if delta[i] == 0.0 {
                m[i] = 0.0;
                m[i + 1] = 0.0;
                continue;
            }
            let a = m[i] / delta[i];
            let b = m[i + 1] / delta[i];
            let r = math::hypot(a, b);
            if r > 3.0 {
                let t = 3.0 / r;
                m[i] = t * a * delta[i];
                m[i + 1] = t * b * delta[i];
            }
        }
        Ok(PumpCurve {
            flows: flows.to_vec(),
            heads: heads.to_vec(),
            slopes: m,
        })
    }

    /// Flow range of the data, m³/s.
    pub fn range(&self) -> (f64, f64) {
        (self.flows[0], self.flows[self.flows.len() - 1])
    }

    /// Head (m) and dHead/dQ (s/m²) at `flow` inside the data range.
    ///
    /// # Errors
    /// A flow outside the range of the points (no extrapolation).
    pub fn head(&self, flow: f64) -> Result<(f64, f64)> {
        let (lo, hi) = self.range();
        check::within("flow", flow, lo, hi, "m³/s")?;
        let i = match self.flows.iter().position(|&q| q > flow) {
            Some(0) => 0,
            Some(j) => j - 1,
            None => self.flows.len() - 2,
        };
        let (x0, x1) = (self.flows[i], self.flows[i + 1]);
        let hgap = x1 - x0;
        let t = (flow - x0) / hgap;
        let (y0, y1, m0, m1) = (
            self.heads[i],
            self.heads[i + 1],
            self.slopes[i],
            self.slopes[i + 1],
        );
        let (t2, t3) = (t * t, t * t * t);
        let h00 = 2.0 * t3 - 3.0 * t2 + 1.0;
        let h10 = t3 - 2.0 * t2 + t;
        let h01 = -2.0 * t3 + 3.0 * t2;
        let h11 = t3 - t2;
        let value = h00 * y0 + h10 * hgap * m0 + h01 * y1 + h11 * hgap * m1;
        let d = ((6.0 * t2 - 6.0 * t) * y0
            + (3.0 * t2 - 4.0 * t + 1.0) * hgap * m0
            + (-6.0 * t2 + 6.0 * t) * y1
            + (3.0 * t2 - 2.0 * t) * hgap * m1)
            / hgap;
        Ok((value, d))
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
        let (g_lo, _) = gap(lo)?;
        let (g_hi, _) = gap(hi)?;
        if g_lo > 0.0 {
            return Err(Error::no_solution(format!(
                "the curves do not cross: at the pump curve's smallest flow ({lo} m³/s) the line needs {:.4} m more head than the pump gives",
                g_lo
            )));
        }
        if g_hi < 0.0 {
            return Err(Error::no_solution(format!(
                "the curves do not cross: at the pump curve's largest flow ({hi} m³/s) the pump still gives {:.4} m more head than the line needs",
                -g_hi
            )));
        }
        let (flow, _) = if g_lo == 0.0 {
            (lo, 0)
        } else {
            safeguarded_newton(gap, lo, hi)?
        };
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

    #[test]
    fn degenerate_pump_curves_are_refused() {
        let invalid = |f: &[f64], h: &[f64]| PumpCurve::new(f, h).unwrap_err();
        assert_eq!(invalid(&[], &[]).kind(), ErrorKind::Invalid);
        assert_eq!(invalid(&[0.0, 1.0], &[5.0, 4.0]).kind(), ErrorKind::Invalid);
        assert_eq!(
            invalid(&[0.0, 1.0, 2.0], &[5.0, 4.0]).kind(),
            ErrorKind::Invalid
        );
        // Subnormal spacing: the slope between the points overflows.
        let tiny = f64::from_bits(1); // the smallest subnormal
        let e = invalid(&[0.0, tiny, 1.0], &[10.0, 9.0, 5.0]);
        assert_eq!(e.kind(), ErrorKind::OutOfRange);
        assert!(
            e.to_string().contains("slope is not a finite number"),
            "{e}"
        );
        let e = invalid(&[0.0, 1.0, 2.0], &[f64::NAN, 9.0, 5.0]);
        assert_eq!(e.kind(), ErrorKind::NotFinite);
        let e = invalid(&[0.0, 1.0, 2.0], &[1e300, 9.0, -1e300]);
        assert_eq!(e.kind(), ErrorKind::OutOfRange);
        let e = invalid(&[0.0, 1.0, 1e300], &[10.0, 9.0, 5.0]);
        assert_eq!(e.kind(), ErrorKind::OutOfRange);
        let many: Vec<f64> = (0..=PUMP_CURVE_MAX_POINTS)
            .map(|i| i as f64 * 1e-3)
            .collect();
        let heads: Vec<f64> = many.iter().map(|q| 100.0 - q).collect();
        assert_eq!(invalid(&many, &heads).kind(), ErrorKind::Invalid);
    }

    #[test]
    fn pump_curve_serde_checks_points_and_rebuilds_slopes() {
        let c = PumpCurve::new(&[0.0, 0.01, 0.02], &[30.0, 26.0, 18.0]).unwrap();
        let text = serde_json::to_string(&c).unwrap();
        assert!(!text.contains("slopes"), "{text}");
        let back: PumpCurve = serde_json::from_str(&text).unwrap();
        assert_eq!(back, c);
        for bad in [
            r#"{"flows":[],"heads":[]}"#,
            r#"{"flows":[0.0,0.01],"heads":[30.0,26.0]}"#,
            r#"{"flows":[0.0,0.02,0.01],"heads":[30.0,26.0,18.0]}"#,
            r#"{"flows":[0.0,0.01,0.02],"heads":[30.0,36.0,18.0]}"#,
        ] {
            assert!(serde_json::from_str::<PumpCurve>(bad).is_err(), "{bad}");
        }
    }
}
