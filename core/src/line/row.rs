//! One row's head loss and its slope at one flow: the arithmetic that every path shares,
//! written once. [`Line::element_state`] (evaluate, bands, Monte Carlo), the solvers' hot
//! path ([`Line::lean_row`], behind `required_head` and `flow_for_head`) and the vector
//! system curve all form their numbers through these functions, so they agree bit for bit
//! by construction (pipes: [`crate::pipe::Geometry`]).
//!
//! A new kind of row adds its arithmetic here, one arm to `element_state` (its full
//! state) and one to [`Line::lean_row`] (its two numbers).

use super::{Line, Resolved};
use crate::fitting::Resistance;
use crate::fluid::Fluid;
use crate::units::STANDARD_GRAVITY;

/// A fitting's loss at one flow.
#[derive(Debug, Clone, Copy)]
pub(crate) struct FittingLoss {
    /// Mean velocity in the fitting's reference area, m/s (signed).
    pub velocity: f64,
    /// Reynolds number in its bore.
    pub reynolds: f64,
    /// The viscous part of the head loss, m.
    pub viscous: f64,
    /// The inertial part of the head loss, m.
    pub inertial: f64,
    /// d(head loss)/dQ, s/m².
    pub slope: f64,
}

impl FittingLoss {
    /// The head loss, m.
    #[inline(always)]
    pub(crate) fn head(&self) -> f64 {
        self.viscous + self.inertial
    }
}

/// The loss of resistance `k` (the one for the flow's direction) referred to bore `bore`
/// (m) and area `area` (m²) at signed flow `flow` (m³/s), kinematic viscosity `nu`
/// (m²/s), all scaled by `own` (1 nominally; a Monte Carlo draw of the K otherwise):
///
/// ```text
/// h = (K₁ ν/(D V) + K∞) · V|V| / 2g    (K₁ the viscous, K∞ the inertial part)
/// ```
///
/// The viscous part is linear in V, so the slope is continuous through zero flow.
#[inline(always)]
pub(crate) fn fitting_loss(
    k: &Resistance,
    bore: f64,
    area: f64,
    nu: f64,
    flow: f64,
    own: f64,
) -> FittingLoss {
    let g = STANDARD_GRAVITY;
    let v = flow / area;
    FittingLoss {
        velocity: v,
        reynolds: v.abs() * bore / nu,
        viscous: k.k_viscous * nu * v / (bore * 2.0 * g) * own,
        inertial: k.k_inertial * v * v.abs() / (2.0 * g) * own,
        slope: (k.k_viscous * nu / bore + 2.0 * k.k_inertial * v.abs()) / (2.0 * g * area) * own,
    }
}

/// Head loss (m) and slope (s/m²) of equipment rated at pressure drop `drop` (Pa) at flow
/// `at_flow` (m³/s) in a fluid of density `rating_density` (kg/m³), at signed flow `flow`,
/// scaled by `own`: Δp = drop (ρ/ρ_rating) Q|Q|/Q_r² (a fixed K), so the head Δp/(ρ g)
/// does not depend on the flowing fluid's density.
#[inline(always)]
pub(crate) fn rated_loss(
    drop: f64,
    at_flow: f64,
    rating_density: f64,
    flow: f64,
    own: f64,
) -> (f64, f64) {
    let g = STANDARD_GRAVITY;
    let r = flow / at_flow;
    (
        drop * r * r.abs() / (rating_density * g) * own,
        2.0 * drop * r.abs() / (at_flow * rating_density * g) * own,
    )
}

impl Line {
    /// Row `r`'s nominal (head loss m, slope s/m², static head m) at signed flow `flow`
    /// (m³/s) in `fluid` of kinematic viscosity `nu`, with nothing else worked out; the
    /// same bits as [`Line::element_state`] gives. `None` where `element_state` must run
    /// instead: it gives the error (reverse flow through a check valve, a flow out of a
    /// pipe's range) or the state of a row this path does not know.
    #[inline(always)]
    pub(crate) fn lean_row(
        &self,
        r: &Resolved,
        fluid: &Fluid,
        nu: f64,
        flow: f64,
    ) -> Option<(f64, f64, f64)> {
        match r {
            Resolved::Rise { .. } => Some((0.0, 0.0, self.rise_head(r, fluid))),
            Resolved::Pipe { geometry, .. } => geometry
                .lean_loss(nu, flow, &self.options.friction)
                .map(|(loss, slope)| (loss, slope, 0.0)),
            Resolved::Fitting {
                bore,
                area,
                resistance,
                reverse,
                blocks_reverse,
                ..
            } if !(flow < 0.0 && *blocks_reverse) => {
                let k = if flow < 0.0 { reverse } else { resistance };
                let l = fitting_loss(k, *bore, *area, nu, flow, 1.0);
                Some((l.head(), l.slope, 0.0))
            }
            Resolved::Drop {
                drop,
                at_flow,
                rating_density,
                ..
            } => {
                let (loss, slope) = rated_loss(*drop, *at_flow, *rating_density, flow, 1.0);
                Some((loss, slope, 0.0))
            }
            // A blocked reverse flow (the error) and a pump (its curve, with the range
            // check) go through element_state.
            Resolved::Fitting { .. } | Resolved::Pump { .. } => None,
        }
    }
}
