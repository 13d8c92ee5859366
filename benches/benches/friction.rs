//! Criterion benchmarks of the friction factor.
use criterion::{Criterion, black_box, criterion_group, criterion_main};
use hydrograde::friction::{Correlation, Options, darcy_factor};

fn bench(c: &mut Criterion) {
    for corr in Correlation::ALL {
        let o = Options::with_correlation(corr);
        c.bench_function(&format!("darcy_factor/{}", corr.name()), |b| {
            b.iter(|| darcy_factor(black_box(1.3e5), black_box(2e-4), &o))
        });
    }
}

criterion_group!(benches, bench);
criterion_main!(benches);
