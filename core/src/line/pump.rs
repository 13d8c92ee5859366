//! Pump curves: head against flow from a pump's catalogue or test points, either through
//! every point by a monotone cubic (Fritsch and Carlson, 1980, SIAM J. Numer. Anal.
//! 17(2) 238–246) or as a least-squares polynomial of degree 2 or 3, the way pump data
//! is usually fitted, with the fit's residual reported.
//!
//! A least-squares fit is solved by Householder QR on the Vandermonde matrix of the
//! flows scaled to [0, 1] (Golub and Van Loan, Matrix Computations, 4th ed., §5.3: the
//! normal equations would square the condition number), then written back in powers of
//! the flow in SI units.

use crate::error::{Error, Result, check};
use crate::math;
use serde::{Deserialize, Serialize};

/// Most points a pump curve accepts (a measured curve has tens).
pub const PUMP_CURVE_MAX_POINTS: usize = 10_000;
/// Largest flow of a pump curve point, m³/s (the inverse solvers' range; the largest
/// pumps built pass tens of m³/s).
pub const PUMP_CURVE_MAX_FLOW: f64 = 1e6;
/// Largest head (in magnitude) of a pump curve point, m: far above any pump built, and
/// low enough that the interpolation cannot overflow.
pub const PUMP_CURVE_MAX_HEAD: f64 = 1e6;

/// A pump's head against flow: a monotone cubic through the points ([`PumpCurve::new`]),
/// so the interpolant never rises where the data falls, or a least-squares polynomial
/// ([`PumpCurve::fit`]). Either answers [`PumpCurve::head`] inside the range of the
/// points (no extrapolation) and works in [`crate::line::Line::operating_point`].
/// Deserialising runs the checks of `new` or `fit` on the points and works the slopes or
/// coefficients out again (they are never read from the stored form).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(try_from = "PumpCurveSpec", into = "PumpCurveSpec")]
pub struct PumpCurve {
    flows: Vec<f64>,
    heads: Vec<f64>,
    shape: Shape,
}

#[derive(Debug, Clone, PartialEq)]
enum Shape {
    /// Hermite slopes at the points of the monotone cubic, s/m².
    Monotone(Vec<f64>),
    /// A least-squares polynomial.
    Fit(PumpFit),
}

/// A least-squares polynomial fit of head against flow.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PumpFit {
    /// Degree of the polynomial (2 or 3).
    pub degree: usize,
    /// Coefficients c₀ … c_degree of H(Q) = Σ c_k Q^k, ascending powers, SI units
    /// (m, m/(m³/s), m/(m³/s)², …).
    pub coefficients: Vec<f64>,
    /// Root mean square of the residuals H(Q_i) − H_i at the points, m.
    pub rms_residual: f64,
    /// Largest |H(Q_i) − H_i| at the points, m.
    pub max_residual: f64,
}

/// The stored form of a [`PumpCurve`]: its points, and the degree when it is a fit.
#[derive(Serialize, Deserialize)]
struct PumpCurveSpec {
    flows: Vec<f64>,
    heads: Vec<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    degree: Option<usize>,
}

impl TryFrom<PumpCurveSpec> for PumpCurve {
    type Error = Error;
    fn try_from(s: PumpCurveSpec) -> Result<PumpCurve> {
        match s.degree {
            Some(d) => PumpCurve::fit(&s.flows, &s.heads, d),
            None => PumpCurve::new(&s.flows, &s.heads),
        }
    }
}

impl From<PumpCurve> for PumpCurveSpec {
    fn from(c: PumpCurve) -> PumpCurveSpec {
        let degree = match &c.shape {
            Shape::Fit(f) => Some(f.degree),
            Shape::Monotone(_) => None,
        };
        PumpCurveSpec {
            flows: c.flows,
            heads: c.heads,
            degree,
        }
    }
}

/// Checks the points both kinds of curve share: equal lengths, `least` to
/// [`PUMP_CURVE_MAX_POINTS`] points, flows in [0, [`PUMP_CURVE_MAX_FLOW`]] strictly
/// increasing, heads within ±[`PUMP_CURVE_MAX_HEAD`], and (for the monotone cubic) heads
/// that never rise with flow.
fn check_points(flows: &[f64], heads: &[f64], least: usize, falling: bool) -> Result<()> {
    if flows.len() != heads.len() {
        return Err(Error::invalid(
            "heads",
            format!("has {} values but flows has {}", heads.len(), flows.len()),
        ));
    }
    if flows.len() < least {
        let what = if falling {
            "a pump curve".to_string()
        } else {
            format!("a degree-{} fit", least - 1)
        };
        return Err(Error::invalid(
            "flows",
            format!("{what} needs at least {least} points, got {}", flows.len()),
        ));
    }
    for (i, (&q, &h)) in flows.iter().zip(heads).enumerate() {
        check::within("flows", q, 0.0, PUMP_CURVE_MAX_FLOW, "m³/s").map_err(|e| e.at_index(i))?;
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
        if falling && i > 0 && h > heads[i - 1] {
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
    Ok(())
}

impl PumpCurve {
    /// A curve through (flow m³/s, head m) points: 3 to [`PUMP_CURVE_MAX_POINTS`], flows
    /// from 0 to [`PUMP_CURVE_MAX_FLOW`] strictly increasing, heads within
    /// ±[`PUMP_CURVE_MAX_HEAD`] and non-increasing with flow, every slope between two
    /// points a finite number; a monotone cubic through every point.
    ///
    /// # Errors
    /// Lists of different lengths or with too few or too many points; a flow or head not
    /// finite; flows not strictly increasing; a head that rises with flow; points so close
    /// together or heads so far apart that the slope between them is not a finite number.
    pub fn new(flows: &[f64], heads: &[f64]) -> Result<PumpCurve> {
        check_points(flows, heads, 3, true)?;
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
            shape: Shape::Monotone(m),
        })
    }

    /// The least-squares polynomial of `degree` (2 or 3) through (flow m³/s, head m)
    /// points: H(Q) = Σ c_k Q^k minimising Σ (H(Q_i) − H_i)², with its residual (RMS and
    /// largest, m) in [`PumpCurve::fit_info`]. At least `degree + 1` points (exactly that
    /// many: the polynomial through them), flows as for [`PumpCurve::new`]; heads may
    /// wiggle (measured data is noisy), and the curve is used inside the range of the
    /// flows only.
    ///
    /// ```
    /// use hydrograde::line::PumpCurve;
    /// // Points on H = 40 − 20000 Q²: the fit is that parabola (exact solution).
    /// let q = [0.0, 0.01, 0.02, 0.03];
    /// let h: Vec<f64> = q.iter().map(|q| 40.0 - 20000.0 * q * q).collect();
    /// let c = PumpCurve::fit(&q, &h, 2)?;
    /// assert!((c.head(0.015)?.0 - 35.5).abs() < 1e-12);
    /// # Ok::<(), hydrograde::Error>(())
    /// ```
    ///
    /// # Errors
    /// `degree` other than 2 or 3; fewer than `degree + 1` points or lists of different
    /// lengths; a flow or head not finite or out of range; flows not strictly increasing;
    /// flows so close together that the fit is not determined.
    pub fn fit(flows: &[f64], heads: &[f64], degree: usize) -> Result<PumpCurve> {
        if !(2..=3).contains(&degree) {
            return Err(Error::out_of_range(
                "degree",
                degree as f64,
                "must be 2 (quadratic) or 3 (cubic)",
            ));
        }
        check_points(flows, heads, degree + 1, false)?;
        let scale = flows[flows.len() - 1];
        let scaled = least_squares(flows, heads, degree, scale)?;
        let mut coefficients = Vec::with_capacity(degree + 1);
        let mut power = 1.0;
        for d in scaled {
            coefficients.push(d / power);
            power *= scale;
        }
        let (mut sum2, mut max) = (0.0f64, 0.0f64);
        for (&q, &h) in flows.iter().zip(heads) {
            let r = horner(&coefficients, q).0 - h;
            sum2 += r * r;
            max = max.max(r.abs());
        }
        let rms_residual = f64::sqrt(sum2 / flows.len() as f64);
        if coefficients.iter().any(|c| !c.is_finite()) || !rms_residual.is_finite() {
            return Err(Error::invalid(
                "flows",
                "the fit's coefficients are not finite numbers: flows too close together",
            ));
        }
        Ok(PumpCurve {
            flows: flows.to_vec(),
            heads: heads.to_vec(),
            shape: Shape::Fit(PumpFit {
                degree,
                coefficients,
                rms_residual,
                max_residual: max,
            }),
        })
    }

    /// The least-squares fit (coefficients and residual) of a curve made by
    /// [`PumpCurve::fit`]; `None` for the monotone cubic of [`PumpCurve::new`], which
    /// passes through every point.
    pub fn fit_info(&self) -> Option<&PumpFit> {
        match &self.shape {
            Shape::Fit(f) => Some(f),
            Shape::Monotone(_) => None,
        }
    }

    /// The (flow m³/s, head m) points the curve was made from.
    pub fn points(&self) -> (&[f64], &[f64]) {
        (&self.flows, &self.heads)
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
        let slopes = match &self.shape {
            Shape::Fit(f) => return Ok(horner(&f.coefficients, flow)),
            Shape::Monotone(m) => m,
        };
        let i = match self.flows.iter().position(|&q| q > flow) {
            Some(0) => 0,
            Some(j) => j - 1,
            None => self.flows.len() - 2,
        };
        let (x0, x1) = (self.flows[i], self.flows[i + 1]);
        let hgap = x1 - x0;
        let t = (flow - x0) / hgap;
        let (y0, y1, m0, m1) = (self.heads[i], self.heads[i + 1], slopes[i], slopes[i + 1]);
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

/// Σ c_k x^k and its derivative, by Horner's rule.
fn horner(c: &[f64], x: f64) -> (f64, f64) {
    let (mut v, mut d) = (0.0, 0.0);
    for &ck in c.iter().rev() {
        d = d * x + v;
        v = v * x + ck;
    }
    (v, d)
}

/// Coefficients d_k of Σ d_k (q/scale)^k fitted to (q, h) by least squares: Householder
/// QR of the Vandermonde matrix, then back substitution.
fn least_squares(q: &[f64], h: &[f64], degree: usize, scale: f64) -> Result<Vec<f64>> {
    let (n, m) = (q.len(), degree + 1);
    // Column-major Vandermonde matrix of t = q/scale in [0, 1].
    let mut a = vec![0.0; n * m];
    for (i, &qi) in q.iter().enumerate() {
        let t = qi / scale;
        let mut p = 1.0;
        for k in 0..m {
            a[k * n + i] = p;
            p *= t;
        }
    }
    let mut b = h.to_vec();
    let mut v = vec![0.0; n];
    for k in 0..m {
        let col = &a[k * n..(k + 1) * n];
        let norm = f64::sqrt(col[k..].iter().map(|x| x * x).sum::<f64>());
        if norm == 0.0 {
            return Err(Error::invalid(
                "flows",
                format!("the points do not determine a degree-{degree} fit"),
            ));
        }
        let alpha = if col[k] > 0.0 { -norm } else { norm };
        v[k..].copy_from_slice(&col[k..]);
        v[k] -= alpha;
        let vv: f64 = v[k..].iter().map(|x| x * x).sum();
        for j in k..m {
            let cj = &mut a[j * n..(j + 1) * n];
            let s: f64 = v[k..].iter().zip(&cj[k..]).map(|(x, y)| x * y).sum();
            let f = 2.0 * s / vv;
            for (y, x) in cj[k..].iter_mut().zip(&v[k..]) {
                *y -= f * x;
            }
        }
        let s: f64 = v[k..].iter().zip(&b[k..]).map(|(x, y)| x * y).sum();
        let f = 2.0 * s / vv;
        for (y, x) in b[k..].iter_mut().zip(&v[k..]) {
            *y -= f * x;
        }
    }
    // R is the upper triangle of a; a diagonal this small against the largest means the
    // scaled flows are (numerically) fewer than degree + 1 distinct values.
    let rmax = (0..m).map(|k| a[k * n + k].abs()).fold(0.0, f64::max);
    let mut d = vec![0.0; m];
    for k in (0..m).rev() {
        let r = a[k * n + k];
        if r.abs() <= 1e-12 * rmax {
            return Err(Error::invalid(
                "flows",
                format!("too close together to determine a degree-{degree} fit"),
            ));
        }
        let s: f64 = (k + 1..m).map(|j| a[j * n + k] * d[j]).sum();
        d[k] = (b[k] - s) / r;
    }
    Ok(d)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ErrorKind;

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
