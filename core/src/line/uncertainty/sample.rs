//! Monte Carlo draws of a line's required head, every source sampled from its stated
//! distribution.

use super::Sources;
use crate::error::Result;
use crate::fluid::Fluid;
use crate::line::Line;
use crate::line::eval::{Perturbation, State};
use crate::math;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};

/// A standard normal deviate (Box–Muller).
fn normal(rng: &mut StdRng) -> f64 {
    let u1: f64 = 1.0 - rng.random::<f64>(); // (0, 1]
    let u2: f64 = rng.random::<f64>();
    (-2.0 * math::ln(u1)).sqrt() * math::cos(std::f64::consts::TAU * u2)
}

/// `samples` draws of the required head (m) at `flow` with every source sampled from its
/// stated distribution (see [`crate::band::monte_carlo`]), from generator seed `seed`.
pub(crate) fn sample_required_head(
    line: &Line,
    fluid: &Fluid,
    flow: f64,
    samples: usize,
    seed: u64,
) -> Result<Vec<f64>> {
    let (work, q, _) = line.working_fluid(fluid, flow, line.options.inlet_pressure)?;
    let uo = &line.options.uncertainty;
    let sources = Sources::of(line);
    let n = line.resolved.len();
    let nominal: Vec<State> = (0..n)
        .map(|i| line.element_state(i, &work, q, None, true))
        .collect::<Result<_>>()?;
    let root3 = 3f64.sqrt();
    let mut rng = StdRng::seed_from_u64(seed);
    let mut xi = vec![0.0; sources.len()];
    let mut values = Vec::with_capacity(samples);
    for _ in 0..samples {
        let model_z = normal(&mut rng);
        let diameter = 1.0 + uo.diameter * normal(&mut rng);
        let (dz, vz) = if uo.fluid {
            (normal(&mut rng), normal(&mut rng))
        } else {
            (0.0, 0.0)
        };
        // One rectangular deviate on [−1, 1] per source beyond the four shared ones.
        for x in xi.iter_mut().skip(4) {
            *x = 2.0 * rng.random::<f64>() - 1.0;
        }
        let own = (0..n)
            .map(|i| {
                if let Some((k, shift)) = sources.roughness_of(i) {
                    // ln ε uniform over [ln ε₀ + shift − √3·u, ln ε₀ + shift + √3·u].
                    math::exp(shift + root3 * nominal[i].roughness_u * xi[k])
                } else if let Some(k) = sources.own_of(i) {
                    1.0 + root3 * nominal[i].own_u * xi[k]
                } else {
                    1.0
                }
            })
            .collect();
        let pert = Perturbation {
            model_z,
            diameter,
            density: 1.0 + work.density_rel_uncertainty * dz,
            viscosity: 1.0 + work.viscosity_rel_uncertainty * vz,
            own,
        };
        let mut fl = work.clone();
        fl.density *= pert.density;
        fl.viscosity *= pert.viscosity;
        let mut h = 0.0;
        for i in 0..n {
            let s = line.element_state(i, &fl, q, Some(&pert), true)?;
            h += s.head_loss + s.static_head;
        }
        // The end pressure is a stated requirement, taken as exact (as in the GUM bands).
        values.push(h + line.end_head(&work));
    }
    Ok(values)
}
