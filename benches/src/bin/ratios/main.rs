//! hydrograde's speed targets, measured side by side in one process.
//!
//! Every figure in the table is the best of several repetitions of the same workload
//! (1e6 turbulent points from `hydrograde_benches::turbulent_points`), so the ratios
//! compare like with like on whatever the machine is doing at the time. Run with
//! `cargo run --release -p hydrograde-benches --bin ratios` (or `./run.sh bench`).
//! Pass `--capi <path to libhydrograde.so>` to time the C batch entry point too.

mod capi;
mod table;

use hydrograde::friction::{Correlation, Options, darcy_factor, darcy_factor_batch};
use hydrograde_benches::turbulent_points;
use std::hint::black_box;
use std::time::{Duration, Instant};
use table::{Row, Table};

/// Points of the friction workloads.
const N: usize = 1_000_000;
/// Repetitions of each workload; the fastest counts (the least disturbed by other work).
const REPS: usize = 9;

/// The fastest of `REPS` runs of `f`.
fn best_of<F: FnMut()>(mut f: F) -> Duration {
    f(); // warm caches and the thread pool
    (0..REPS)
        .map(|_| {
            let t = Instant::now();
            f();
            t.elapsed()
        })
        .min()
        .unwrap_or_default()
}

/// Nanoseconds per item.
fn per_item(d: Duration, items: usize) -> f64 {
    d.as_secs_f64() * 1e9 / items as f64
}

/// Per-element nanoseconds of a scalar friction loop on the calling thread.
fn scalar_loop(re: &[f64], rr: &[f64], opts: &Options, out: &mut [f64]) -> f64 {
    let d = best_of(|| {
        for ((o, &r), &e) in out.iter_mut().zip(re).zip(rr) {
            *o = darcy_factor(black_box(r), black_box(e), opts).map_or(f64::NAN, |fr| fr.f);
        }
        black_box(&mut *out);
    });
    per_item(d, re.len())
}

/// Per-element nanoseconds of `darcy_factor_batch` in a rayon pool of `threads` threads
/// (0: rayon's default, one per core).
fn batch_in_pool(threads: usize, re: &[f64], rr: &[f64], out: &mut [f64]) -> f64 {
    let pool = match rayon::ThreadPoolBuilder::new().num_threads(threads).build() {
        Ok(p) => p,
        Err(e) => {
            eprintln!("cannot build a rayon pool of {threads} threads: {e}");
            return f64::NAN;
        }
    };
    let opts = Options::default();
    let d = pool.install(|| {
        best_of(|| {
            if let Err(e) = darcy_factor_batch(re, rr, &opts, out) {
                eprintln!("batch failed: {e}");
            }
            black_box(&mut *out);
        })
    });
    per_item(d, re.len())
}

fn main() {
    let capi_path = capi::path_from_args();
    let threads = rayon::current_num_threads();
    let (re, rr) = turbulent_points(N, 2026);
    let mut out = vec![0.0; N];
    let mut t = Table::new();

    // The cost floor: one natural logarithm per element, same loop shape and memory traffic.
    let ln = per_item(
        best_of(|| {
            for (o, &r) in out.iter_mut().zip(&re) {
                *o = black_box(r).ln();
            }
            black_box(&mut out);
        }),
        N,
    );
    t.push(Row::time("ln (f64::ln), per element", ln));

    let exact = scalar_loop(&re, &rr, &Options::default(), &mut out);
    t.push(Row::ratio(
        "exact Colebrook darcy_factor, 1 thread, per element",
        exact,
        "ln",
        exact / ln,
        Some(("<= 4", exact / ln <= 4.0)),
    ));
    for corr in Correlation::ALL.into_iter().skip(1) {
        let ns = scalar_loop(&re, &rr, &Options::with_correlation(corr), &mut out);
        t.push(Row::ratio(
            &format!("{} darcy_factor, 1 thread, per element", corr.name()),
            ns,
            "ln",
            ns / ln,
            None,
        ));
    }

    let one = batch_in_pool(1, &re, &rr, &mut out);
    let all = batch_in_pool(0, &re, &rr, &mut out);
    t.push(Row::time("darcy_factor_batch, 1e6, 1 thread", one));
    t.push(Row::ratio(
        &format!("darcy_factor_batch, 1e6, {threads} threads (speed-up)"),
        all,
        "1 thread",
        one / all,
        Some(("≥ 1.7 on 2 cores", one / all >= 1.7)),
    ));

    if let Some(path) = capi_path {
        match capi::Batch::open(&path) {
            Ok(c) => {
                let ns = per_item(best_of(|| c.run(&re, &rr, &mut out)), N);
                t.push(Row::ratio(
                    &format!("hg_darcy_factor_batch (C ABI), 1e6, {threads} threads"),
                    ns,
                    "Rust batch",
                    ns / all,
                    Some(("≤ 1.1 (as fast)", ns / all <= 1.1)),
                ));
            }
            Err(e) => eprintln!("C ABI not timed: {e}"),
        }
    }

    println!(
        "hydrograde speed ratios: {N} turbulent points (Re 4e3..1e8, eps/D 1e-6..0.05, \
         log-uniform), best of {REPS}, {threads} rayon threads"
    );
    t.print();
}
