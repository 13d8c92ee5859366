//! hydrograde's speed targets, measured side by side in one process.
//!
//! Every figure in the table is the best of several repetitions of the same workload
//! (1e6 turbulent points from `hydrograde_benches::turbulent_points`), so the ratios
//! compare like with like on whatever the machine is doing at the time. Run with
//! `cargo run --release -p hydrograde-benches --bin ratios` (or `./run.sh bench`).
//! Pass `--capi <path to libhydrograde.so>` to time the C batch entry point too, and
//! `--network` to print only the network rows.

mod capi;
mod network;
mod table;

use hydrograde::friction::{
    Correlation, Isa, Options, darcy_factor, darcy_factor_batch, darcy_factor_batch_on,
};
use hydrograde_benches::{flows, line20, turbulent_points, water};
use std::hint::black_box;
use std::time::{Duration, Instant};
use table::{Row, Table};

/// Points of the friction workloads.
const N: usize = 1_000_000;
/// Flows of the system-curve workload.
const CURVE_POINTS: usize = 100_000;
/// Repetitions of each workload; the fastest counts (the least disturbed by other work).
const REPS: usize = 9;

/// The fastest of `reps` runs of `f`.
fn best_of_n<F: FnMut()>(reps: usize, mut f: F) -> Duration {
    f(); // warm caches and the thread pool
    (0..reps)
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

/// Runs the workloads in turns, `reps` rounds after one warm-up round, and returns the
/// fastest time of each. Taking turns exposes every workload to the same disturbances
/// from other work on the machine, so their ratios stay meaningful when it is busy.
fn race(reps: usize, work: &mut [&mut dyn FnMut()]) -> Vec<Duration> {
    let mut best = vec![Duration::MAX; work.len()];
    for round in 0..=reps {
        for (b, w) in best.iter_mut().zip(work.iter_mut()) {
            let t = Instant::now();
            w();
            let d = t.elapsed();
            if round > 0 {
                *b = (*b).min(d);
            }
        }
    }
    best
}

/// A scalar friction loop on the calling thread: `darcy_factor` called once per point.
fn scalar_loop(re: &[f64], rr: &[f64], opts: &Options, out: &mut [f64]) {
    for ((o, &r), &e) in out.iter_mut().zip(re).zip(rr) {
        *o = darcy_factor(black_box(r), black_box(e), opts).map_or(f64::NAN, |fr| fr.f);
    }
    black_box(out);
}

/// A rayon pool of `threads` threads (0: rayon's default, one per core).
fn pool(threads: usize) -> Option<rayon::ThreadPool> {
    rayon::ThreadPoolBuilder::new()
        .num_threads(threads)
        .build()
        .map_err(|e| eprintln!("cannot build a rayon pool of {threads} threads: {e}"))
        .ok()
}

/// `darcy_factor_batch` (exact Colebrook) inside `pool`.
fn batch_in(pool: &rayon::ThreadPool, re: &[f64], rr: &[f64], out: &mut [f64]) {
    pool.install(|| {
        if let Err(e) = darcy_factor_batch(re, rr, &Options::default(), out) {
            eprintln!("batch failed: {e}");
        }
    });
    black_box(out);
}

/// `darcy_factor_batch_on(isa)` with `opts` inside `pool`.
fn batch_on_in(
    pool: &rayon::ThreadPool,
    isa: Isa,
    opts: &Options,
    re: &[f64],
    rr: &[f64],
    out: &mut [f64],
) {
    pool.install(|| {
        if let Err(e) = darcy_factor_batch_on(isa, re, rr, opts, out) {
            eprintln!("batch on {} failed: {e}", isa.name());
        }
    });
    black_box(out);
}

/// Exact Colebrook through the batch kernel on each available instruction set, one
/// thread, against `ln` in the same turns (target: the detected set within 2 × ln).
fn isa_rows(t: &mut Table, single: &rayon::ThreadPool, re: &[f64], rr: &[f64]) {
    let isas: Vec<Isa> = Isa::ALL.into_iter().filter(|i| i.is_available()).collect();
    let mut bufs = vec![vec![0.0; re.len()]; isas.len() + 1];
    let (b_ln, rest) = bufs.split_at_mut(1);
    let opts = Options::default();
    let mut ln_loop = || {
        for (o, &r) in b_ln[0].iter_mut().zip(re) {
            *o = black_box(r).ln();
        }
        black_box(&mut b_ln[0]);
    };
    let mut work: Vec<Box<dyn FnMut() + '_>> = vec![Box::new(&mut ln_loop)];
    for (&isa, buf) in isas.iter().zip(rest.iter_mut()) {
        let opts = &opts;
        work.push(Box::new(move || {
            batch_on_in(single, isa, opts, re, rr, buf)
        }));
    }
    let mut refs: Vec<&mut dyn FnMut()> = work.iter_mut().map(|w| &mut **w as _).collect();
    let times: Vec<f64> = race(REPS, &mut refs)
        .into_iter()
        .map(|d| per_item(d, re.len()))
        .collect();
    let ln = times[0];
    for (&isa, &ns) in isas.iter().zip(&times[1..]) {
        let detected = isa == Isa::detected();
        t.push(Row::ratio(
            &format!(
                "exact Colebrook, batch kernel on {}{}, 1 thread",
                isa.name(),
                if detected { " (detected)" } else { "" }
            ),
            ns,
            "ln (same turns)",
            ns / ln,
            detected.then_some(("<= 2", ns / ln <= 2.0)),
        ));
    }
}

/// Each explicit correlation: one `darcy_factor` call per point against the batch
/// kernel on one thread, in the same turns (target: the kernel at least 3 × faster).
fn correlation_rows(t: &mut Table, single: &rayon::ThreadPool, re: &[f64], rr: &[f64]) {
    let mut a = vec![0.0; re.len()];
    let mut b = vec![0.0; re.len()];
    for corr in Correlation::ALL.into_iter().skip(1) {
        let o = Options::with_correlation(corr);
        let times = race(
            5,
            &mut [&mut || scalar_loop(re, rr, &o, &mut a), &mut || {
                batch_on_in(single, Isa::detected(), &o, re, rr, &mut b)
            }],
        );
        let [call, kernel] = [0, 1].map(|i| per_item(times[i], re.len()));
        t.push(Row::ratio(
            &format!("{}, darcy_factor called per point, 1 thread", corr.name()),
            call,
            "",
            f64::NAN,
            None,
        ));
        t.push(Row::ratio(
            &format!("{}, batch kernel, 1 thread", corr.name()),
            kernel,
            "per point call (speed-up)",
            call / kernel,
            Some((">= 3", call / kernel >= 3.0)),
        ));
    }
}

/// Rows of the 20-element line: its system curve over 1e5 flows on one thread and on all,
/// against one exact Colebrook call per flow (timed in the same turns), and single
/// evaluations for scale.
fn line_rows(t: &mut Table, single: &rayon::ThreadPool, multi: &rayon::ThreadPool) {
    let (line, water) = match (line20(), water()) {
        (Ok(l), Ok(w)) => (l, w),
        (Err(e), _) | (_, Err(e)) => {
            eprintln!("line rows skipped: {e}");
            return;
        }
    };
    let q = flows(CURVE_POINTS);
    let curve = |p: &rayon::ThreadPool| {
        p.install(|| {
            if let Err(e) = line.system_curve(&water, black_box(&q)) {
                eprintln!("system curve failed: {e}");
            }
        })
    };
    // The Colebrook reference runs in the same turns as the curve (1e5 points of the
    // friction workload), so a burst of other work cannot fall on one side only.
    let (re, rr) = turbulent_points(CURVE_POINTS, 2027);
    let mut buf = vec![0.0; CURVE_POINTS];
    let opts = Options::default();
    let mut reference = || scalar_loop(&re, &rr, &opts, &mut buf);
    let times = race(
        5,
        &mut [&mut || curve(single), &mut || curve(multi), &mut reference],
    );
    let [one, all, exact] = [0, 1, 2].map(|i| per_item(times[i], CURVE_POINTS));
    t.push(Row::ratio(
        "20-element line system curve, 1e5 flows, 1 thread, per flow",
        one,
        "Colebrook (per point call)",
        one / exact,
        Some(("<= 30", one / exact <= 30.0)),
    ));
    t.push(Row::ratio(
        &format!("same, {} threads, per flow", multi.current_num_threads()),
        all,
        "Colebrook (per point call)",
        all / exact,
        None,
    ));
    let single = |f: &dyn Fn()| {
        per_item(
            best_of_n(REPS, || {
                for _ in 0..100 {
                    f()
                }
            }),
            100,
        )
    };
    let with_bands = single(&|| {
        let _ = black_box(line.evaluate(&water, black_box(0.012)));
    });
    t.push(Row::ratio(
        "20-element line evaluate (with bands), one flow",
        with_bands,
        "Colebrook (per point call)",
        with_bands / exact,
        None,
    ));
    let solve = single(&|| {
        let _ = black_box(line.flow_for_head(&water, black_box(25.0)));
    });
    let iterations = line.flow_for_head(&water, 25.0).map_or(0, |s| s.iterations);
    t.push(Row::ratio(
        &format!("20-element line flow_for_head ({iterations} iterations)"),
        solve,
        "Colebrook (per point call)",
        solve / exact,
        None,
    ));
}

/// The 1-, 5- and 15-minute load averages (Linux), printed with the table: other work
/// on the machine shows up in the timings, above all in the multi-thread speed-up.
fn load_average() -> String {
    std::fs::read_to_string("/proc/loadavg")
        .map(|s| s.split_whitespace().take(3).collect::<Vec<_>>().join(" "))
        .unwrap_or_else(|_| "unknown".to_owned())
}

fn main() {
    if std::env::args().any(|a| a == "--network") {
        let mut t = Table::new();
        network::network_rows(&mut t);
        println!("hydrograde network rows; load average {}", load_average());
        t.print();
        return;
    }
    let capi = capi::path_from_args().and_then(|p| {
        capi::Batch::open(&p)
            .map_err(|e| eprintln!("C ABI not timed: {e}"))
            .ok()
    });
    let threads = rayon::current_num_threads();
    let load_before = load_average();
    let (re, rr) = turbulent_points(N, 2026);
    let (Some(single), Some(multi)) = (pool(1), pool(0)) else {
        return;
    };
    let mut t = Table::new();

    // The head-to-head friction workloads, timed in turns.
    let mut bufs = vec![vec![0.0; N]; 5];
    let [b_ln, b_scalar, b_one, b_all, b_c] = &mut bufs[..] else {
        return;
    };
    // The cost floor: one natural logarithm per element, same loop shape and memory traffic.
    let mut ln_loop = || {
        for (o, &r) in b_ln.iter_mut().zip(&re) {
            *o = black_box(r).ln();
        }
        black_box(&mut *b_ln);
    };
    let opts = Options::default();
    let mut scalar = || scalar_loop(&re, &rr, &opts, b_scalar);
    let mut one = || batch_in(&single, &re, &rr, b_one);
    let mut all = || batch_in(&multi, &re, &rr, b_all);
    let mut c_batch = || {
        if let Some(c) = &capi {
            c.run(&re, &rr, b_c);
        }
    };
    let times: Vec<f64> = race(
        REPS,
        &mut [&mut ln_loop, &mut scalar, &mut one, &mut all, &mut c_batch],
    )
    .into_iter()
    .map(|d| per_item(d, N))
    .collect();
    let [ln, exact, one, all, c] = times[..] else {
        return;
    };
    t.push(Row::time("ln (f64::ln), per element", ln));
    t.push(Row::ratio(
        "exact Colebrook, darcy_factor called per point, 1 thread",
        exact,
        "ln",
        exact / ln,
        None,
    ));
    t.push(Row::ratio(
        "exact Colebrook, darcy_factor_batch 1e6, 1 thread",
        one,
        "ln",
        one / ln,
        Some(("<= 2", one / ln <= 2.0)),
    ));
    t.push(Row::ratio(
        &format!("exact Colebrook, darcy_factor_batch 1e6, {threads} threads"),
        all,
        "1 thread (speed-up)",
        one / all,
        Some(("≥ 1.7 on 2 cores", one / all >= 1.7)),
    ));
    if capi.is_some() {
        t.push(Row::ratio(
            &format!("exact Colebrook, hg_darcy_factor_batch (C ABI) 1e6, {threads} threads"),
            c,
            "Rust batch",
            c / all,
            Some(("≤ 1.1 (as fast)", c / all <= 1.1)),
        ));
    }

    isa_rows(&mut t, &single, &re, &rr);
    correlation_rows(&mut t, &single, &re, &rr);

    line_rows(&mut t, &single, &multi);
    network::network_rows(&mut t);

    println!(
        "hydrograde speed ratios: {N} turbulent points (Re 4e3..1e8, eps/D 1e-6..0.05, \
         log-uniform), best of {REPS} taken in turns, {threads} rayon threads; load average \
         {load_before} before, {} after",
        load_average()
    );
    t.print();
}
