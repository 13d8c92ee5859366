//! Parallel branches: lines that share their two end nodes split a total flow so that
//! every branch needs the same head.
//!
//! Newton on the branch derivatives: linearising each branch, `h_i + h_i'·ΔQ_i = H`
//! with `Σ ΔQ_i = Q − Σ Q_i` gives the common head `H` and the corrections in closed form
//! (the simultaneous form of the Hardy Cross correction, Cross 1936). Should Newton not
//! settle within its cap, a bracketed search on the common head finishes the job, so the
//! split always converges.
//!
//! Bands follow from the linearised balance: with `a_i` the change of branch `i`'s head
//! from one uncertain input, the common head moves by `dH = Σ(a_i/h_i') / Σ(1/h_i')` and
//! each branch flow by `(dH − a_i)/h_i'`. Shared causes (friction model, a material's
//! roughness, a catalogue entry's K, bore tolerance, fluid) act on all branches together;
//! what an element owns (a user fitting's K, a pipe's own roughness range, equipment) on
//! its own branch.

use super::Line;
use crate::band::Band;
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use serde::{Deserialize, Serialize};

/// Heads agree to this relative tolerance when the split is done.
const HEAD_TOL: f64 = 1e-12;

/// The result of [`split_flow`].
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Split {
    /// Flow in each branch, m³/s, in the order given.
    pub flows: Vec<f64>,
    /// The common required head, m.
    pub head: f64,
    /// Newton iterations used (0 when the bracketed search finished).
    pub iterations: usize,
    /// Band of the common head, m.
    pub head_band: Band,
    /// Band of each branch flow, m³/s.
    pub flow_bands: Vec<Band>,
}

/// Splits `total` (m³/s) between `branches` so that all need the same head.
///
/// # Errors
/// No branches; a branch with no loss; a non-finite total; a solve error of a branch.
pub fn split_flow(branches: &[Line], fluid: &Fluid, total: f64) -> Result<Split> {
    check::finite("total", total)?;
    if branches.is_empty() {
        return Err(Error::invalid("branches", "need at least one branch"));
    }
    if let Some(i) = branches.iter().position(|b| !b.has_resistance()) {
        return Err(Error::invalid(
            "branches",
            format!("branch {i} has no loss, so the split is undefined"),
        ));
    }
    let n = branches.len();
    let mut q = vec![total / n as f64; n];
    for it in 1..=100 {
        let mut hs = Vec::with_capacity(n);
        for (b, &qi) in branches.iter().zip(&q) {
            hs.push(b.required_head(fluid, qi)?);
        }
        // A branch with no slope here (no pipe, at zero flow) cannot take a Newton step:
        // the bracketed search does without slopes.
        if hs.iter().any(|&(_, d)| !(d > 0.0 && d.is_finite())) {
            // Already balanced (zero total through branches of equal static head)?
            let h0 = hs[0].0;
            let spread = hs.iter().map(|(h, _)| (h - h0).abs()).fold(0.0, f64::max);
            if spread <= HEAD_TOL * h0.abs().max(1e-300) && q.iter().sum::<f64>() == total {
                return with_bands(branches, fluid, q, h0, it);
            }
            break;
        }
        let inv: f64 = hs.iter().map(|(_, d)| 1.0 / d).sum();
        let head = (total
            - q.iter()
                .zip(&hs)
                .map(|(qi, (h, d))| qi - h / d)
                .sum::<f64>())
            / inv;
        let spread = hs.iter().map(|(h, _)| (h - head).abs()).fold(0.0, f64::max);
        let scale = hs
            .iter()
            .map(|(h, _)| h.abs())
            .fold(head.abs(), f64::max)
            .max(1e-300);
        if spread <= HEAD_TOL * scale {
            return with_bands(branches, fluid, q, head, it);
        }
        if !inv.is_finite() || !head.is_finite() {
            break;
        }
        for (qi, (h, d)) in q.iter_mut().zip(&hs) {
            *qi += (head - h) / d;
        }
    }
    bracketed(branches, fluid, total)
}

/// Bisection on the common head: each branch's flow for a head rises with the head, so
/// the total does too.
fn bracketed(branches: &[Line], fluid: &Fluid, total: f64) -> Result<Split> {
    let flows_at = |h: f64| -> Result<Vec<f64>> {
        branches
            .iter()
            .map(|b| b.flow_for_head(fluid, h).map(|s| s.flow))
            .collect()
    };
    let sum_at = |h: f64| -> Result<f64> { Ok(flows_at(h)?.iter().sum()) };
    let statics: Vec<f64> = branches.iter().map(|b| b.static_head()).collect();
    let mut lo = statics.iter().cloned().fold(f64::INFINITY, f64::min) - 1.0;
    let mut hi = statics.iter().cloned().fold(f64::NEG_INFINITY, f64::max) + 1.0;
    while sum_at(lo)? > total {
        lo -= 2.0 * (hi - lo);
    }
    while sum_at(hi)? < total {
        hi += 2.0 * (hi - lo);
    }
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if sum_at(mid)? < total {
            lo = mid;
        } else {
            hi = mid;
        }
        if hi - lo <= HEAD_TOL * hi.abs().max(1.0) {
            break;
        }
    }
    let head = 0.5 * (lo + hi);
    with_bands(branches, fluid, flows_at(head)?, head, 0)
}

/// The split with its first-order bands (module docs).
fn with_bands(
    branches: &[Line],
    fluid: &Fluid,
    flows: Vec<f64>,
    head: f64,
    iterations: usize,
) -> Result<Split> {
    let (head_band, flow_bands) = super::uncertainty::split_bands(branches, fluid, &flows, head)?;
    let band_ok = |b: &Band| b.low.is_finite() && b.high.is_finite();
    let finite = head.is_finite()
        && flows.iter().all(|q| q.is_finite())
        && band_ok(&head_band)
        && flow_bands.iter().all(band_ok);
    if !finite {
        return Err(Error::no_solution(
            "the split's head, flows or bands are not finite numbers: the branches' losses are too large to combine in double precision",
        ));
    }
    Ok(Split {
        flows,
        head,
        iterations,
        head_band,
        flow_bands,
    })
}
