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

/// The fewest samples [`monte_carlo`] accepts: fewer cannot place the 2.5 % and 97.5 %
/// quantiles between samples.
pub const MIN_SAMPLES: usize = 100;

/// The most samples [`monte_carlo`] accepts, for every binding: the samples are kept in
/// memory (8 bytes each, 80 MB at the limit), and JCGM 101:2008 needs of the order of
/// 1e6 for a 95 % interval good to two significant digits.
pub const MAX_SAMPLES: usize = 10_000_000;

/// Samples the line's required head at `flow` (m³/s) `samples` times ([`MIN_SAMPLES`] to
/// [`MAX_SAMPLES`]) with the uncertainty options of the line, from generator seed `seed`.
///
/// Each source is drawn once per sample and acts wherever the first-order band lets it
/// act: friction model, diameter, density and viscosity normal; each roughness source
/// log-uniform over its stated range (one draw shared by the pipes of one material);
/// each K source rectangular on ±its spread (one draw shared by the instances of one
/// catalogue entry); each equipment rectangular on ±its spread.
///
/// # Errors
/// [`Error::OutOfRange`] for `samples` outside [`MIN_SAMPLES`]..=[`MAX_SAMPLES`], or for a
/// `flow` whose sampled heads overflow; the errors of [`Line::evaluate`] at `flow`.
pub fn monte_carlo(
    line: &Line,
    fluid: &Fluid,
    flow: f64,
    samples: usize,
    seed: u64,
) -> Result<MonteCarlo> {
    if !(MIN_SAMPLES..=MAX_SAMPLES).contains(&samples) {
        return Err(Error::out_of_range(
            "samples",
            samples as f64,
            format!("must lie between {MIN_SAMPLES} and {MAX_SAMPLES}"),
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
    let mc = MonteCarlo {
        samples,
        mean,
        std_dev: var.sqrt(),
        low: quantile(0.025),
        high: quantile(0.975),
    };
    if ![mc.mean, mc.std_dev, mc.low, mc.high]
        .iter()
        .all(|v| v.is_finite())
    {
        return Err(Error::out_of_range(
            "flow",
            flow,
            "gives sampled heads whose mean or spread is not a finite number (the losses overflow double precision)",
        ));
    }
    Ok(mc)
}

/// Generator seed of the Monte Carlo interval [`band_monte_carlo`] offers: fixed, so the
/// offered interval is the same bits in every binding and on every run.
pub const BAND_MONTE_CARLO_SEED: u64 = 101;

/// The Monte Carlo interval offered with a first-order band that flags itself non-linear
/// ([`crate::band::Band::non_linear`]): evaluates `line` at `flow` (m³/s) and, when its
/// required-head band is flagged (a band wider than ±20 % of its value, or a pipe whose
/// Reynolds number reaches into the laminar–turbulent transition within its own 95 %
/// range), returns [`monte_carlo`] of the required head with
/// [`super::MONTE_CARLO_SAMPLES`] samples from seed [`BAND_MONTE_CARLO_SEED`]; `None`
/// when the first-order band stands. Its `low` and `high` are then the 95 % interval to
/// use in place of the band's (JCGM 101:2008 §7.7, probabilistically symmetric).
///
/// Kept apart from [`Line::evaluate`], whose cost stays linear in the line's length: this
/// call costs up to 20,000 evaluations when the band is flagged and one when it is not.
///
/// # Errors
/// The errors of [`Line::evaluate`] and [`monte_carlo`] at `flow`.
pub fn band_monte_carlo(line: &Line, fluid: &Fluid, flow: f64) -> Result<Option<MonteCarlo>> {
    if !line.evaluate(fluid, flow)?.required_head_band.non_linear {
        return Ok(None);
    }
    monte_carlo(
        line,
        fluid,
        flow,
        super::MONTE_CARLO_SAMPLES,
        BAND_MONTE_CARLO_SEED,
    )
    .map(Some)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{Element, Pipe};

    #[test]
    fn sample_count_has_one_limit_and_allocates_nothing_beyond_it() {
        let line = Line::new(vec![Element::Pipe(
            Pipe::circular(0.05, 10.0, 4.5e-5).unwrap(),
        )])
        .unwrap();
        let water = Fluid::new(998.0, 1.0e-3).unwrap();
        for bad in [
            0,
            MIN_SAMPLES - 1,
            MAX_SAMPLES + 1,
            100_000_000_000,
            1 << 62,
        ] {
            let e = monte_carlo(&line, &water, 1e-3, bad, 1).unwrap_err();
            assert_eq!(e.kind(), crate::ErrorKind::OutOfRange, "{bad}");
            assert!(e.to_string().starts_with("samples = "), "{e}");
            assert!(e.to_string().contains("10000000"), "{e}");
        }
        assert_eq!(
            monte_carlo(&line, &water, 1e-3, MIN_SAMPLES, 1)
                .unwrap()
                .samples,
            100
        );
    }
}
