//! Criterion settings shared by every bench file: short runs, so the whole suite stays
//! within a few minutes on two cores. The figures are for comparison between runs on
//! one machine; the targets are checked by `src/bin/ratios`.
use criterion::Criterion;
use std::time::Duration;

/// Short warm-up and measurement, 20 samples.
pub fn quick() -> Criterion {
    Criterion::default()
        .sample_size(20)
        .warm_up_time(Duration::from_millis(300))
        .measurement_time(Duration::from_millis(1500))
        .without_plots()
}
