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
use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Equipment, Line, PumpCurve, split_flow};
use hydrograde::pipe::Pipe;
use hydrograde::section::Section;
use std::time::Instant;

/// A line of about `n` elements.
fn main_line(n: usize, bore: f64) -> Line {
    let steel = Pipe::of_material(Section::circle(bore).unwrap(), 2.0, "commercial_steel").unwrap();
    let iron = Pipe::of_material(Section::circle(bore).unwrap(), 3.0, "cast_iron").unwrap();
    let elbow = Fitting::named("elbow_90_standard").unwrap();
    let valve = Fitting::named("gate_valve").unwrap();
    let own = Fitting::k(0.4).unwrap();
    let strainer = Equipment::pressure_drop("strainer", 2e3, 0.02).unwrap();
    let mut els = Vec::with_capacity(n);
    let mut g = 0;
    while els.len() < n {
        els.push(Element::Pipe(steel.clone()));
        els.push(Element::Fitting(elbow.clone()));
        els.push(Element::Fitting(own.clone()));
        els.push(Element::Pipe(iron.clone()));
        els.push(Element::Fitting(valve.clone()));
        if g % 10 == 0 {
            els.push(Element::Equipment(strainer.clone()));
        }
        g += 1;
    }
    els.truncate(n);
    Line::new(els).unwrap()
}

/// Best of `reps` runs of `f`, seconds.
fn best(reps: usize, mut f: impl FnMut()) -> f64 {
    (0..reps)
        .map(|_| {
            let t = Instant::now();
            f();
            t.elapsed().as_secs_f64()
        })
        .fold(f64::INFINITY, f64::min)
}

fn main() {
    // One thread: the figures are per core.
    hydrograde::threads::set_threads(1).unwrap();
    let water = Fluid::water(288.15, 3e5).unwrap();
    let q = 0.02;
    println!("band timings, one thread (best of 3; seconds, and ns per element)");
    println!(
        "{:>8} {:>22} {:>12} {:>10}",
        "elements", "operation", "seconds", "ns/elem"
    );
    let mut eval_100k = f64::NAN;
    let mut split_100k = f64::NAN;
    for n in [1_000usize, 10_000, 100_000] {
        let line = main_line(n, 0.25);
        let branches = [line.clone(), main_line(n, 0.2)];
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
        let rows: [(&str, f64); 7] = [
            (
                "evaluate (no sources)",
                best(3, || {
                    bare.evaluate(&water, q).unwrap();
                }),
            ),
            (
                "evaluate (bands)",
                best(3, || {
                    line.evaluate(&water, q).unwrap();
                }),
            ),
            (
                "system curve band ×10",
                best(3, || {
                    line.system_curve_band(&water, &flows).unwrap();
                }),
            ),
            (
                "flow for head",
                best(3, || {
                    line.flow_for_head(&water, h).unwrap();
                }),
            ),
            (
                "operating point",
                best(3, || {
                    line.operating_point(&water, &pump).unwrap();
                }),
            ),
            (
                "split, 2 branches",
                best(3, || {
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
        for (what, t) in rows {
            println!("{n:>8} {what:>22} {t:>12.5} {:>10.1}", t * 1e9 / n as f64);
            if n == 100_000 && what.starts_with("evaluate") {
                eval_100k = t;
            }
            if n == 100_000 && what.starts_with("split") {
                split_100k = t;
            }
        }
    }
    let met = |ok: bool| if ok { "met" } else { "missed" };
    println!(
        "target: evaluate with bands, 100 000 elements < 0.1 s: {eval_100k:.4} s ({})",
        met(eval_100k < 0.1)
    );
    println!(
        "target: two-branch split, 100 000 elements each < 0.5 s: {split_100k:.4} s ({})",
        met(split_100k < 0.5)
    );
}
