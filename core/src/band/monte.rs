//! Monte Carlo propagation (JCGM 101:2008) of the same inputs as the first-order band, for
//! checking it: sampled with a seeded generator, so a run is reproducible.

use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::line::Line;
use serde::{Deserialize, Serialize};

/// Summary of a Monte Carlo run on a line's required head.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct MonteCarlo {
    /// Number of samples.
    pub samples: usize,
    /// Sample mean, m.
    pub mean: f64,
    /// Sample standard deviation, m.
    pub std_dev: f64,
    /// 2.5 % quantile, m (the low end of the 95 % probabilistically symmetric interval).
    pub low: f64,
    /// 97.5 % quantile, m.
    pub high: f64,
}

/// Samples the line's required head at `flow` (m³/s) `samples` times (≥ 100) with the
/// uncertainty options of the line, from generator seed `seed`.
///
/// Each source is drawn once per sample and acts wherever the first-order band lets it
/// act: friction model, diameter, density and viscosity normal; each roughness source
/// log-uniform over its stated range (one draw shared by the pipes of one material);
/// each K source rectangular on ±its spread (one draw shared by the instances of one
/// catalogue entry); each equipment rectangular on ±its spread.
pub fn monte_carlo(
    line: &Line,
    fluid: &Fluid,
    flow: f64,
    samples: usize,
    seed: u64,
) -> Result<MonteCarlo> {
    if samples < 100 {
        return Err(Error::out_of_range(
            "samples",
            samples as f64,
            "must be at least 100",
        ));
    }
    let mut values =
        crate::line::uncertainty::sample_required_head(line, fluid, flow, samples, seed)?;
    values.sort_by(f64::total_cmp);
    let mean = values.iter().sum::<f64>() / samples as f64;
    let var = values.iter().map(|v| (v - mean) * (v - mean)).sum::<f64>() / (samples - 1) as f64;
    let quantile = |p: f64| {
        let x = p * (samples - 1) as f64;
        let i = x.floor() as usize;
        let t = x - i as f64;
        values[i] + t * (values[(i + 1).min(samples - 1)] - values[i])
    };
    Ok(MonteCarlo {
        samples,
        mean,
        std_dev: var.sqrt(),
        low: quantile(0.025),
        high: quantile(0.975),
    })
}
