//! Criterion benchmarks of pipes and lines: one pipe's head loss, a 20-element line's
//! evaluation with and without its uncertainty bands, its system curve over 1e5 flows,
//! and the flow for a head.
use criterion::{Criterion, criterion_group, criterion_main};
use hydrograde::band::UncertaintyOptions;
use hydrograde::line::{Line, LineOptions};
use hydrograde::pipe::Pipe;
use hydrograde_benches::{flows, line20, water};
use std::hint::black_box;

mod common;

fn pipe(c: &mut Criterion) {
    let (Ok(p), Ok(w)) = (Pipe::circular(0.1023, 100.0, 4.5e-5), water()) else {
        eprintln!("cannot build the benchmark pipe");
        return;
    };
    c.bench_function("pipe_head_loss", |b| {
        b.iter(|| p.head_loss(&w, black_box(0.012)))
    });
}

fn line(c: &mut Criterion) {
    let (Ok(line), Ok(w)) = (line20(), water()) else {
        eprintln!("cannot build the benchmark line");
        return;
    };
    let no_bands = LineOptions::default()
        .with_uncertainty(UncertaintyOptions::none())
        .unwrap();
    let Ok(bare) = Line::with_options(line.elements().to_vec(), no_bands) else {
        eprintln!("cannot build the band-free line");
        return;
    };
    c.bench_function("line20_evaluate_with_bands", |b| {
        b.iter(|| line.evaluate(&w, black_box(0.012)))
    });
    c.bench_function("line20_evaluate_without_bands", |b| {
        b.iter(|| bare.evaluate(&w, black_box(0.012)))
    });
    c.bench_function("line20_required_head", |b| {
        b.iter(|| line.required_head(&w, black_box(0.012)))
    });
    c.bench_function("line20_flow_for_head", |b| {
        b.iter(|| line.flow_for_head(&w, black_box(25.0)))
    });
}

fn system_curve(c: &mut Criterion) {
    let (Ok(line), Ok(w)) = (line20(), water()) else {
        eprintln!("cannot build the benchmark line");
        return;
    };
    let q = flows(100_000);
    let mut g = c.benchmark_group("line20_system_curve");
    g.sample_size(10)
        .measurement_time(std::time::Duration::from_secs(3));
    g.bench_function("1e5_flows", |b| b.iter(|| line.system_curve(&w, &q)));
    g.finish();
}

criterion_group! {
    name = benches;
    config = common::quick();
    targets = pipe, line, system_curve
}
criterion_main!(benches);
