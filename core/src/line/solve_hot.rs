//! The solvers' hot path: a line's required head and its slope at one flow, with nothing
//! else worked out (no warnings, no band inputs, no result rows). Each row's two numbers
//! come from [`Line::lean_row`], which forms them with the functions
//! [`Line::element_state`] uses (row.rs, [`crate::pipe::Geometry`]), so the bits are
//! evaluate's; a row it does not take, and every case that ends in an error, goes through
//! `element_state` itself, which gives the error.

use crate::error::Result;
use crate::fluid::Fluid;
use crate::line::Line;

impl Line {
    /// Σ (head loss + static head) and Σ d(head loss)/dQ over the rows at `flow` (m³/s)
    /// in `fluid`, summed in route order.
    pub(crate) fn hot_head_and_slope(&self, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
        let nu = fluid.viscosity / fluid.density;
        let (mut h, mut d) = (0.0, 0.0);
        for (i, r) in self.resolved.iter().enumerate() {
            let (loss, slope, rise) = match self.lean_row(r, fluid, nu, flow) {
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
