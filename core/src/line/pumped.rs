//! Lines with their own pumps ([`super::Element::Pump`]): the flow range they can be
//! evaluated in, the flow for a head inside it, and the flow the line runs at by itself.
//!
//! A pump is a negative loss −H(Q) in every evaluation, so the required head of a line
//! with a pump is static head + losses + end pressure head − Σ pump heads. Its curve
//! holds only inside the range of its points: every solver looks for the flow inside the
//! range common to the line's pumps, in a bracket that is kept at every step (Newton on
//! the analytic slope, bisection when a step would leave the bracket), and refuses with
//! the values at the ends of the range when the answer lies outside it.

use super::solve::{FlowSolution, root_in_range};
use super::{Line, LineResult, Resolved, uncertainty};
use crate::band::Band;
use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::units::STANDARD_GRAVITY;
use serde::{Deserialize, Serialize};

/// Where a line with its own pumps runs by itself: the flow at which the pumps' head
/// equals what the line needs ([`Line::pumped_flow`]).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PumpedFlow {
    /// Flow, m³/s.
    pub flow: f64,
    /// Head the line's pumps add at that flow, m (the sum over its pumps).
    pub pump_head: f64,
    /// d(required head)/dQ at that flow, s/m² (the pumps' slopes included).
    pub drequired_head_dflow: f64,
    /// Band of the flow, m³/s (first order through the line's sensitivities; the pump
    /// curve is taken as stated, without a band of its own).
    pub flow_band: Band,
    /// Row of [`LineResult::elements`] that holds the first pump.
    pub pump_row: usize,
    /// NPSH available at the first pump's suction (the boundary just upstream of it), m:
    /// (p + ½ρV² − p_v)/(ρ g) there. `None` when the line has no inlet pressure or the
    /// fluid no vapour pressure (a gas, or a liquid stated without one).
    pub npsh_available: Option<f64>,
    /// The line evaluated at the flow.
    pub result: LineResult,
    /// Solver iterations used.
    pub iterations: usize,
}

impl Line {
    /// True when some element of the line is a pump.
    pub fn has_pump(&self) -> bool {
        self.pump_rows().next().is_some()
    }

    fn pump_rows(&self) -> impl Iterator<Item = usize> + '_ {
        self.resolved
            .iter()
            .enumerate()
            .filter_map(|(i, r)| matches!(r, Resolved::Pump { .. }).then_some(i))
    }

    /// The flow range (m³/s) every pump of the line covers: the largest of their
    /// smallest flows to the smallest of their largest. `None` for a line without a pump.
    ///
    /// # Errors
    /// [`Error::NoSolution`] when the pumps' curves have no flow in common.
    pub fn pump_flow_range(&self) -> Result<Option<(f64, f64)>> {
        let mut range: Option<(f64, f64)> = None;
        for i in self.pump_rows() {
            let Resolved::Pump { curve } = &self.resolved[i] else {
                continue;
            };
            let (lo, hi) = curve.range();
            range = Some(range.map_or((lo, hi), |(a, b)| (a.max(lo), b.min(hi))));
        }
        match range {
            Some((lo, hi)) if lo > hi => Err(Error::no_solution(format!(
                "the curves of the line's pumps have no flow in common (the largest smallest flow {lo} m³/s is above the smallest largest flow {hi} m³/s)"
            ))),
            r => Ok(r),
        }
    }

    /// [`Line::flow_for_head`] on a line with pumps: the flow in `range` (m³/s) where the
    /// required head equals `head` (m).
    pub(super) fn flow_for_head_pumped(
        &self,
        fluid: &Fluid,
        head: f64,
        (lo, hi): (f64, f64),
    ) -> Result<FlowSolution> {
        let g = |q: f64| -> Result<(f64, f64)> {
            let (h, d) = self.required_head(fluid, q)?;
            Ok((h - head, d))
        };
        let (flow, iterations) = root_in_range(
            g,
            (lo, hi),
            |g_lo| {
                format!(
                    "no flow on the pumps' curves ({lo} … {hi} m³/s) reaches head {head} m: at their smallest flow, {lo} m³/s, the line's required head is already {g_lo:.6} m above it (the pumps are too weak for it; a curve is not extrapolated)"
                )
            },
            |g_hi| {
                format!(
                    "no flow on the pumps' curves ({lo} … {hi} m³/s) reaches head {head} m: at their largest flow, {hi} m³/s, the line's required head is still {:.6} m below it (the flow would run beyond the curves, which are not extrapolated)",
                    -g_hi
                )
            },
        )?;
        let flow = flow.clamp(lo, hi);
        let (_, slope) = self.required_head(fluid, flow)?;
        let flow_band = uncertainty::flow_for_head_band(self, fluid, flow, slope)?;
        Ok(FlowSolution {
            flow,
            head,
            drequired_head_dflow: slope,
            flow_band,
            iterations,
        })
    }

    /// The flow (m³/s) a line with its own pumps runs at: where its required head,
    /// static head + losses + end pressure head − Σ H_pump(Q), is zero, solved in a
    /// kept bracket over the flow range common to its pumps. The line is evaluated there
    /// ([`PumpedFlow::result`]), with the NPSH available at the first pump's suction.
    ///
    /// ```
    /// use hydrograde::fluid::Fluid;
    /// use hydrograde::line::{Element, Line, PumpCurve};
    /// // A fixed K = 8 on 50 mm after a pump H = 30 − 2e5 Q², lifting 10 m. Exact:
    /// // 30 − 2e5 Q² = 10 + K Q²/(2 g A²), so Q = sqrt(20 / (2e5 + K/(2 g A²))).
    /// let q: Vec<f64> = (0..=10).map(|i| i as f64 * 1e-3).collect();
    /// let h: Vec<f64> = q.iter().map(|q| 30.0 - 2e5 * q * q).collect();
    /// let pump = PumpCurve::fit(&q, &h, 2)?;
    /// let k = hydrograde::fitting::Fitting::k(8.0)?.with_diameter(0.05)?;
    /// let line = Line::new(vec![Element::Pump(pump), Element::Fitting(k), Element::rise(10.0)?])?;
    /// let water = Fluid::new(998.2, 1.0e-3)?;
    /// let a = std::f64::consts::PI * 0.05 * 0.05 / 4.0;
    /// let exact = (20.0 / (2e5 + 8.0 / (2.0 * 9.80665 * a * a))).sqrt();
    /// let p = line.pumped_flow(&water)?;
    /// assert!((p.flow - exact).abs() < 1e-12);
    /// # Ok::<(), hydrograde::Error>(())
    /// ```
    ///
    /// # Errors
    /// [`Error::Invalid`] naming `line` when it has no pump; [`Error::NoSolution`] when
    /// the pumps' curves share no flow, or the required head does not change sign over
    /// their range (the pumps too weak for the line at their smallest flow, or still
    /// too strong at their largest: the curve is not extrapolated).
    pub fn pumped_flow(&self, fluid: &Fluid) -> Result<PumpedFlow> {
        let range = self.pump_flow_range()?.ok_or_else(|| {
            Error::invalid(
                "line",
                "has no pump element, so it has no operating point of its own (use operating_point with a pump curve)",
            )
        })?;
        let solved = self.flow_for_head_pumped(fluid, 0.0, range)?;
        let result = self.evaluate(fluid, solved.flow)?;
        let pump_row = result
            .elements
            .iter()
            .position(|e| e.kind == super::ElementKind::Pump)
            .unwrap_or(0);
        let pump_head = -result
            .elements
            .iter()
            .filter(|e| e.kind == super::ElementKind::Pump)
            .map(|e| e.head_loss)
            .sum::<f64>();
        let npsh_available = suction_npsh(&result, pump_row)?;
        Ok(PumpedFlow {
            flow: solved.flow,
            pump_head,
            drequired_head_dflow: solved.drequired_head_dflow,
            flow_band: solved.flow_band,
            pump_row,
            npsh_available,
            result,
            iterations: solved.iterations,
        })
    }
}

/// NPSH available (m) at the inlet of row `row`: at the outlet of the row before it, or
/// for the first row at the line's start (its outlet total pressure with the row's own
/// change undone). `None` without an inlet pressure or a vapour pressure.
fn suction_npsh(result: &LineResult, row: usize) -> Result<Option<f64>> {
    let here = &result.elements[row];
    if here.total_pressure_out.is_none() || result.vapour_pressure.is_none() {
        return Ok(None);
    }
    if row > 0 {
        return result.npsh_available(row - 1).map(Some);
    }
    let rho_g = result.density * STANDARD_GRAVITY;
    let total = here
        .total_pressure_out
        .map(|t| t + rho_g * (here.head_loss + here.static_head));
    Ok(total
        .zip(result.vapour_pressure)
        .map(|(t, pv)| (t - pv) / rho_g))
}
