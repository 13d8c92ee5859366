//! Band timings against line length: evaluate with bands, the system curve with its band,
//! the flow for a head, the pump operating point and a two-branch split, for lines of
//! 1 000, 10 000 and 100 000 elements, on one thread. Bands must cost time linear in the
//! number of elements: the last column is the time per element, which should stay flat.
//!
//! The line is an invented long distribution main: repeating groups of a commercial-steel
//! pipe, a catalogue elbow, a user fitting with its own K, a cast-iron pipe, a gate valve
//! and, every tenth group, a rated strainer. Water at 15 °C.
//!
//! Targets: 100 000 elements evaluate with bands in under 0.1 s; a two-branch split of
//! 100 000 elements each in under 0.5 s. Nothing fails on speed: the table says whether
//! each target is met.

use hydrograde::band::UncertaintyOptions;
use hydrograde::fluid::Fluid;
use hydrograde::line::{PumpCurve, split_flow};
use hydrograde_benches::long_line;
use std::time::Instant;

/// Time this thread has run on a core, ns (Linux `/proc/thread-self/schedstat`), if known.
/// On a machine shared with other work the wall clock also counts the time the thread
/// waited for a core; this does not.
fn on_cpu_ns() -> Option<u64> {
    std::fs::read_to_string("/proc/thread-self/schedstat")
        .ok()?
        .split_whitespace()
        .next()?
        .parse()
        .ok()
}

/// `reps` runs of `f`: (best wall-clock seconds, mean seconds on a core; the wall clock
/// where the latter is not known). The time on a core is counted in the scheduler's
/// ticks on some kernels (4 ms here): the mean of several runs, not the best, keeps
/// that rounding from biasing it low.
fn best(reps: usize, mut f: impl FnMut()) -> (f64, f64) {
    let (wall, cpu) = (0..reps)
        .map(|_| {
            let c = on_cpu_ns();
            let t = Instant::now();
            f();
            let wall = t.elapsed().as_secs_f64();
            let cpu = match (c, on_cpu_ns()) {
                (Some(a), Some(b)) => (b - a) as f64 * 1e-9,
                _ => wall,
            };
            (wall, cpu)
        })
        .fold((f64::INFINITY, 0.0), |(w, c), (a, b)| (w.min(a), c + b));
    (wall, cpu / reps as f64)
}

fn main() {
    // One thread: the figures are per core.
    hydrograde::threads::set_threads(1).unwrap();
    let water = Fluid::water(288.15, 3e5).unwrap();
    let q = 0.02;
    println!(
        "band timings, one thread (5 runs, Monte Carlo 1: best seconds on the wall clock, mean seconds on a core, ns per element on a core; figures under 0.02 s on a core are within the scheduler tick)"
    );
    println!(
        "{:>8} {:>22} {:>10} {:>10} {:>10}",
        "elements", "operation", "wall s", "core s", "ns/elem"
    );
    let mut eval_100k = f64::NAN;
    let mut split_100k = f64::NAN;
    for n in [1_000usize, 10_000, 100_000] {
        let line = long_line(n, 0.25).unwrap();
        let branches = [line.clone(), long_line(n, 0.2).unwrap()];
        let h = line.evaluate(&water, q).unwrap().required_head;
        let pump = PumpCurve::new(&[0.0, 0.02, 0.04], &[2.0 * h, 1.2 * h, 0.1 * h]).unwrap();
        let flows: Vec<f64> = (1..=10).map(|i| 0.004 * i as f64).collect();
        let bare = line
            .set_options(
                line.options()
                    .clone()
                    .with_uncertainty(UncertaintyOptions::none())
                    .unwrap(),
            )
            .unwrap();
        let rows: [(&str, (f64, f64)); 7] = [
            (
                "evaluate (no sources)",
                best(5, || {
                    bare.evaluate(&water, q).unwrap();
                }),
            ),
            (
                "evaluate (bands)",
                best(5, || {
                    line.evaluate(&water, q).unwrap();
                }),
            ),
            (
                "system curve band ×10",
                best(5, || {
                    line.system_curve_band(&water, &flows).unwrap();
                }),
            ),
            (
                "flow for head",
                best(5, || {
                    line.flow_for_head(&water, h).unwrap();
                }),
            ),
            (
                "operating point",
                best(5, || {
                    line.operating_point(&water, &pump).unwrap();
                }),
            ),
            (
                "split, 2 branches",
                best(5, || {
                    split_flow(&branches, &water, 2.0 * q).unwrap();
                }),
            ),
            (
                "monte carlo ×100",
                best(1, || {
                    hydrograde::band::monte_carlo(&line, &water, q, 100, 1).unwrap();
                }),
            ),
        ];
        for (what, (wall, t)) in rows {
            println!(
                "{n:>8} {what:>22} {wall:>10.5} {t:>10.5} {:>10.1}",
                t * 1e9 / n as f64
            );
            if n == 100_000 && what.starts_with("evaluate") {
                eval_100k = t;
            }
            if n == 100_000 && what.starts_with("split") {
                split_100k = t;
            }
        }
    }
    let met = |ok: bool| if ok { "met" } else { "missed" };
    println!("(targets judged on the time on a core)");
    println!(
        "target: evaluate with bands, 100 000 elements < 0.1 s: {eval_100k:.4} s ({})",
        met(eval_100k < 0.1)
    );
    println!(
        "target: two-branch split, 100 000 elements each < 0.5 s: {split_100k:.4} s ({})",
        met(split_100k < 0.5)
    );
}
