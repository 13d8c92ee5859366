//! Criterion benchmarks of the friction factor: exact Colebrook at single points and in
//! batches, and every explicit correlation.
use criterion::{BatchSize, BenchmarkId, Criterion, Throughput, criterion_group, criterion_main};
use hydrograde::friction::{Correlation, Options, darcy_factor, darcy_factor_batch};
use hydrograde_benches::turbulent_points;
use std::hint::black_box;

mod common;

/// Exact Colebrook at the corners and middle of the chart (the cost does not depend on
/// the point: fixed step count).
fn colebrook_scalar(c: &mut Criterion) {
    let o = Options::default();
    let mut g = c.benchmark_group("colebrook_scalar");
    for (re, rr) in [(4e3, 0.0), (1.3e5, 2e-4), (1e8, 0.05)] {
        g.bench_with_input(
            BenchmarkId::from_parameter(format!("re{re:e}_rr{rr:e}")),
            &(re, rr),
            |b, &(re, rr)| b.iter(|| darcy_factor(black_box(re), black_box(rr), &o)),
        );
    }
    g.finish();
}

/// Every correlation at one mid-chart point.
fn correlations(c: &mut Criterion) {
    let mut g = c.benchmark_group("correlation");
    for corr in Correlation::ALL {
        let o = Options::with_correlation(corr);
        g.bench_function(corr.name(), |b| {
            b.iter(|| darcy_factor(black_box(1.3e5), black_box(2e-4), &o))
        });
    }
    g.finish();
}

/// `darcy_factor_batch` below and above the parallel threshold.
fn batch(c: &mut Criterion) {
    let o = Options::default();
    let mut g = c.benchmark_group("colebrook_batch");
    for n in [1_000usize, 100_000] {
        let (re, rr) = turbulent_points(n, 11);
        g.throughput(Throughput::Elements(n as u64));
        g.bench_with_input(BenchmarkId::from_parameter(n), &n, |b, &n| {
            b.iter_batched_ref(
                || vec![0.0; n],
                |out| darcy_factor_batch(&re, &rr, &o, out),
                BatchSize::LargeInput,
            )
        });
    }
    g.finish();
}

criterion_group! {
    name = benches;
    config = common::quick();
    targets = colebrook_scalar, correlations, batch
}
criterion_main!(benches);
