//! The cost of the solvers, counted in exact Colebrook solves on the benchmark line (the
//! 20-element route of `benches/src/lib.rs`, written out again here).

use crate::fitting::Fitting;
use crate::fluid::Fluid;
use crate::friction::colebrook_calls;
use crate::line::{Element, Line};
use crate::pipe::Pipe;

/// The invented 20-element cooling-water route of the line benchmarks (9 pipes, 9
/// fittings, 2 rises, two bores of commercial steel).
fn line20() -> Line {
    let (big, small, steel) = (0.1023, 0.0779, 4.5e-5);
    let pipe = |d: f64, l: f64| Element::Pipe(Pipe::circular(d, l, steel).unwrap());
    let fit = Element::Fitting;
    Line::new(vec![
        fit(Fitting::from_tank(crate::fitting::Edge::Square).unwrap()),
        pipe(big, 35.0),
        fit(Fitting::bend(90.0, 1.5).unwrap()),
        pipe(big, 12.0),
        Element::rise(6.0).unwrap(),
        fit(Fitting::three_k(800.0, 0.14, 4.0).unwrap()),
        pipe(big, 48.0),
        fit(Fitting::contraction(big, small).unwrap()),
        pipe(small, 20.0),
        fit(Fitting::two_k(500.0, 0.25).unwrap()),
        pipe(small, 15.0),
        fit(Fitting::k(2.0).unwrap()),
        pipe(small, 30.0),
        fit(Fitting::bend(45.0, 1.0).unwrap()),
        pipe(small, 22.0),
        fit(Fitting::expansion(small, big).unwrap()),
        pipe(big, 60.0),
        Element::rise(-2.5).unwrap(),
        pipe(big, 8.0),
        fit(Fitting::into_tank()),
    ])
    .unwrap()
}

/// Colebrook solves that `f` makes on this thread.
fn count<T>(f: impl FnOnce() -> T) -> (T, u64) {
    let before = colebrook_calls();
    let r = f();
    (r, colebrook_calls() - before)
}

#[test]
fn required_head_for_one_flow_costs_at_most_ten_colebrook_solves() {
    let line = line20();
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    for q in [2e-3, 8e-3, 0.02] {
        let (_, n) = count(|| line.required_head(&water, q).unwrap());
        assert!(n <= 10, "{n} solves at {q} m³/s");
        // Exact count: the nine pipes are of two kinds (bore and roughness), and pipes of
        // one kind at one flow share one solve (friction/memo.rs).
        assert!(n <= 2, "{n} solves at {q} m³/s");
    }
}

#[test]
fn flow_for_head_stays_within_its_solve_budget_and_gives_back_the_head() {
    // Exact check: the solved flow reproduces the head asked for, and the slope is the
    // line's slope there. Budget: at most 4 evaluations of the line (2 pipe kinds each:
    // pipes of one kind share a solve) plus the band's 6 solves (each kind's state and
    // its two roughness ends).
    let line = line20();
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    let mut worst = 0;
    for head in [3.6, 4.0, 8.0, 25.0, 60.0, 400.0, 3.0, 0.0, -5.0, -40.0] {
        let (s, n) = count(|| line.flow_for_head(&water, head).unwrap());
        let (h, d) = line.required_head(&water, s.flow).unwrap();
        assert!(
            (h - head).abs() <= 1e-13 * head.abs().max(3.5),
            "head {head}: {h}"
        );
        assert!(
            ((s.drequired_head_dflow - d) / d).abs() < 1e-12,
            "slope at {head}"
        );
        assert!(
            s.iterations <= 4,
            "head {head}: {} evaluations",
            s.iterations
        );
        worst = worst.max(n);
    }
    assert!(worst <= 4 * 2 + 6, "{worst} solves");
}

#[test]
fn the_vectorised_system_curve_is_the_required_head_loop_bit_for_bit() {
    // Exact check: same bits as one required_head call per flow, over laminar,
    // transitional, turbulent and reverse flows, for every correlation; and the vector
    // path is the one taken.
    use crate::friction::{Correlation, Options, Transition};
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    let flows: Vec<f64> = (0..1000)
        .map(|i| -0.02 + 0.04 * i as f64 / 999.0)
        .chain([0.0, -0.0, 1e-9, 2.5e-4, 3.1e-4])
        .collect();
    for corr in Correlation::ALL {
        for transition in Transition::ALL {
            let mut options = line20().options().clone();
            options.friction = Options {
                correlation: corr,
                transition,
                ..Options::default()
            };
            let line = line20().set_options(options).unwrap();
            let looped: Result<Vec<f64>, _> = flows
                .iter()
                .map(|&q| line.required_head(&water, q).map(|r| r.0))
                .collect();
            let curve = line.system_curve(&water, &flows);
            match (looped, curve) {
                (Ok(a), Ok(b)) => {
                    assert!(line.system_curve_vectorised(&water, &flows).is_some());
                    for (x, y) in a.iter().zip(&b) {
                        assert_eq!(x.to_bits(), y.to_bits(), "{corr} {transition}");
                    }
                }
                (Err(_), Err(e)) => assert!(e.to_string().starts_with("element "), "{e}"),
                (a, b) => panic!("{corr} {transition}: {a:?} vs {b:?}"),
            }
        }
    }
}

#[test]
fn the_hot_path_gives_the_evaluated_numbers_bit_for_bit() {
    // Exact check: required_head (the lean hot path) against evaluate (every element's
    // full state) at laminar, transitional, turbulent and reverse flows, for every
    // correlation.
    use crate::friction::{Correlation, Options};
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    for corr in Correlation::ALL {
        let mut options = line20().options().clone();
        options.friction = Options::with_correlation(corr);
        let line = line20().set_options(options).unwrap();
        for q in [0.0, 1e-9, 1e-5, 2.5e-4, 3.1e-4, 2e-3, 0.012, -0.012, 0.03] {
            let (h, d) = line.required_head(&water, q).unwrap();
            let r = line.evaluate(&water, q).unwrap();
            assert_eq!(h.to_bits(), r.required_head.to_bits(), "{corr} at {q}");
            assert_eq!(
                d.to_bits(),
                r.drequired_head_dflow.to_bits(),
                "{corr} at {q}"
            );
        }
    }
}
