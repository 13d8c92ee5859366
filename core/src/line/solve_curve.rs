//! The system curve through the vector kernel: the friction factors of each pipe at many
//! flows in one batch (run-time dispatched SIMD, the same bits as one call per point),
//! everything else as [`Line::required_head`] does it, summed in the same order, so the
//! curve is bit for bit the one a loop over `required_head` gives.
//!
//! Used for liquids (a gas with a known inlet pressure needs the mean-density iteration
//! per flow). Any error, or any non-finite head, sends the whole curve back to the loop
//! over `required_head`, which reports the first failing flow exactly as before.

use crate::error::Result;
use crate::fluid::Fluid;
use crate::friction;
use crate::line::{Line, Resolved};

/// Flows per block: the per-pipe buffers of a block stay in the first-level cache.
pub(super) const BLOCK: usize = 512;

/// Required heads (m) at `flows` (m³/s) into `out`, one block; `Err` or `Ok(false)` (a
/// head near overflow) means: take the loop over `required_head` instead.
pub(super) fn block(line: &Line, fluid: &Fluid, flows: &[f64], out: &mut [f64]) -> Result<bool> {
    let n = flows.len();
    let opts = &line.options.friction;
    let nu = fluid.viscosity / fluid.density;
    let mut re = vec![0.0; n];
    let mut rr = vec![0.0; n];
    let mut f = vec![0.0; n];
    let mut other = vec![0.0; n];
    out.iter_mut().for_each(|h| *h = 0.0);
    for (i, r) in line.resolved.iter().enumerate() {
        let Resolved::Pipe { pipe, geometry, .. } = r else {
            // Every other row as the hot path forms it (row.rs), same bits.
            for (k, &q) in flows.iter().enumerate() {
                let (loss, rise) = match line.lean_row(r, fluid, nu, q) {
                    Some((loss, _, rise)) => (loss, rise),
                    None => {
                        let s = line.element_state(i, fluid, q, None, false)?;
                        (s.head_loss, s.static_head)
                    }
                };
                out[k] += loss + rise;
            }
            continue;
        };
        // The Reynolds numbers and losses of Pipe::flow_state_in (pipe::Geometry).
        let o = geometry.friction_options(opts);
        for (k, &q) in flows.iter().enumerate() {
            re[k] = geometry.kinematics(nu, q).re_t;
            rr[k] = geometry.rel_roughness;
        }
        let mut scalar = |k: usize, slot: &mut f64| -> Result<()> {
            other[k] = pipe
                .flow_state_in(geometry, fluid, flows[k], opts)?
                .head_loss;
            *slot = f64::NAN; // marks a point the kernel did not take
            Ok(())
        };
        friction::factors_with(&re, &rr, &o, &mut f, &mut scalar)?;
        for k in 0..n {
            let loss = if f[k].is_nan() {
                other[k]
            } else {
                geometry.head(f[k], &geometry.kinematics(nu, flows[k]))
            };
            // element_state adds a zero static head.
            out[k] += loss + 0.0;
        }
    }
    // Far from overflow the slope is finite too (the loop's check covers both).
    Ok(out.iter().all(|h| h.abs() < 1e290))
}

impl Line {
    /// The system curve through the vector kernel, or `None` where the loop over
    /// [`Line::required_head`] must run (a gas with a known inlet pressure, an error, a
    /// head near overflow). Runs on the threads [`crate::threads::set_threads`] allows
    /// above 4096 flows.
    pub(crate) fn system_curve_vectorised(&self, fluid: &Fluid, flows: &[f64]) -> Option<Vec<f64>> {
        let inlet = self.options.inlet_pressure.or(fluid.pressure);
        if fluid.is_gas() && inlet.is_some() {
            return None;
        }
        let mut out = vec![0.0; flows.len()];
        let run = |(q, h): (&[f64], &mut [f64])| matches!(block(self, fluid, q, h), Ok(true));
        let all_ok = if flows.len() < 4096 {
            flows.chunks(BLOCK).zip(out.chunks_mut(BLOCK)).all(run)
        } else {
            use rayon::prelude::*;
            let par = |out: &mut Vec<f64>| {
                flows
                    .par_chunks(BLOCK)
                    .zip(out.par_chunks_mut(BLOCK))
                    .all(run)
            };
            match crate::threads::in_pool(|| par(&mut out)) {
                Some(ok) => ok,
                None => flows.chunks(BLOCK).zip(out.chunks_mut(BLOCK)).all(run),
            }
        };
        all_ok.then_some(out)
    }
}
