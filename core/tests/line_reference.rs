//! Lines against the independent mpmath computation in tests/reference/line/generate.py
//! (formulas written out there), plus the exact properties every line must have.

mod common;

use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Equipment, Line, PumpCurve, split_flow};
use hydrograde::pipe::Pipe;

fn fluid() -> Fluid {
    Fluid::new(999.5, 1.2e-3).unwrap()
}

/// Entrance K 0.5, pipe A, 3-K elbow, expansion A→B, pipe B, rise 12.5 m, exit K 1.
fn main_line() -> Line {
    Line::new(vec![
        Element::Fitting(Fitting::k(0.5).unwrap()),
        Element::Pipe(Pipe::circular(0.0525, 120.0, 4.5e-5).unwrap()),
        Element::Fitting(Fitting::three_k(800.0, 0.14, 4.0).unwrap()),
        Element::Fitting(Fitting::expansion(0.0525, 0.0779).unwrap()),
        Element::Pipe(Pipe::circular(0.0779, 250.0, 1.5e-6).unwrap()),
        Element::rise(12.5).unwrap(),
        Element::Fitting(Fitting::k(1.0).unwrap()),
    ])
    .unwrap()
}

#[test]
fn evaluate_matches_mpmath() {
    // Reference: tests/reference/line/evaluate.csv (mpmath, 30 digits).
    let line = main_line();
    for r in common::read_csv("line/evaluate.csv") {
        let res = line.evaluate(&fluid(), r[0]).unwrap();
        assert!(
            common::rel_err(res.required_head, r[1]) < 1e-13,
            "Q {}: {} vs {}",
            r[0],
            res.required_head,
            r[1]
        );
        assert!(
            common::rel_err(res.drequired_head_dflow, r[2]) < 1e-9,
            "Q {}: {} vs {}",
            r[0],
            res.drequired_head_dflow,
            r[2]
        );
        let sum: f64 = res
            .elements
            .iter()
            .map(|e| e.head_loss + e.static_head)
            .sum();
        assert!(common::rel_err(sum, res.required_head) < 1e-15);
    }
}

#[test]
fn flow_for_head_matches_mpmath_and_round_trips() {
    // Reference: tests/reference/line/flow_for_head.csv (mpmath findroot).
    let line = main_line();
    let st = line.static_head();
    for r in common::read_csv("line/flow_for_head.csv") {
        let s = line.flow_for_head(&fluid(), r[0]).unwrap();
        // The flow is only as well conditioned as H − H_static: a head 1e-7 m above the
        // static head leaves 8 digits (the cancellation is in the question, not the solver).
        let tol = 1e-11 * (r[0] / (r[0] - st)).abs().max(1.0);
        assert!(
            common::rel_err(s.flow, r[1]) < tol,
            "H {}: {} vs {}",
            r[0],
            s.flow,
            r[1]
        );
        // Round trip: the head at the solved flow is the head asked for, to 1e-12.
        let back = line.evaluate(&fluid(), s.flow).unwrap().required_head;
        assert!(
            common::rel_err(back, r[0]) < 1e-12,
            "H {}: back {back}",
            r[0]
        );
        assert!(s.flow_band.low <= s.flow && s.flow <= s.flow_band.high);
    }
}

#[test]
fn operating_point_matches_mpmath() {
    // Reference: tests/reference/line/operating.csv (Fritsch–Carlson cubic, mpmath findroot).
    let q = [0.0, 0.002, 0.004, 0.006, 0.008, 0.010];
    let h = [60.0, 58.5, 55.0, 49.0, 40.5, 29.0];
    let pump = PumpCurve::new(&q, &h).unwrap();
    let op = main_line().operating_point(&fluid(), &pump).unwrap();
    let r = &common::read_csv("line/operating.csv")[0];
    assert!(
        common::rel_err(op.flow, r[0]) < 1e-11,
        "{} vs {}",
        op.flow,
        r[0]
    );
    assert!(
        common::rel_err(op.head, r[1]) < 1e-12,
        "{} vs {}",
        op.head,
        r[1]
    );
    assert!(op.flow_band.low < op.flow && op.flow < op.flow_band.high);
    assert!(op.head_band.low < op.head && op.head < op.head_band.high);
}

#[test]
fn parallel_split_matches_mpmath_and_balances_heads() {
    // Reference: tests/reference/line/split.csv (mpmath findroot on equal heads).
    let a = Line::new(vec![
        Element::Pipe(Pipe::circular(0.04, 60.0, 4.5e-5).unwrap()),
        Element::Fitting(Fitting::k(6.0).unwrap()),
    ])
    .unwrap();
    let b = Line::new(vec![
        Element::Pipe(Pipe::circular(0.065, 140.0, 1.5e-6).unwrap()),
        Element::rise(2.0).unwrap(),
    ])
    .unwrap();
    let branches = [a, b];
    for r in common::read_csv("line/split.csv") {
        let s = split_flow(&branches, &fluid(), r[0]).unwrap();
        assert!(
            common::rel_err(s.flows[0], r[1]) < 1e-9,
            "{} vs {}",
            s.flows[0],
            r[1]
        );
        assert!(
            common::rel_err(s.flows[1], r[2]) < 1e-9,
            "{} vs {}",
            s.flows[1],
            r[2]
        );
        assert!(common::rel_err(s.head, r[3]) < 1e-10);
        // Heads balance to 1e-10 relative.
        let ha = branches[0].required_head(&fluid(), s.flows[0]).unwrap().0;
        let hb = branches[1].required_head(&fluid(), s.flows[1]).unwrap().0;
        assert!(common::rel_err(ha, hb) < 1e-10, "{ha} vs {hb}");
        assert!(common::rel_err(s.flows[0] + s.flows[1], r[0]) < 1e-12);
    }
}

#[test]
fn loss_is_odd_and_c1_through_zero_and_the_transition() {
    // Exact properties: every element but the expansion loses the same either way, and
    // the expansion passed backwards is a sudden contraction, so
    // h(Q) + h(−Q) = (K_expansion − K_contraction) V_A²/2g with
    // K_expansion = (1 − β²)², K_contraction = 0.5 (1 − β²), β = d_A/d_B (Borda–Carnot;
    // Crane TP-410, 1988, from memory); slope continuous at 0 and across Re 2300 / 4000.
    let line = main_line();
    let f = fluid();
    let st = line.static_head();
    let b2 = (0.0525f64 / 0.0779).powi(2);
    let dk = (1.0 - b2).powi(2) - 0.5 * (1.0 - b2);
    for q in [1e-7, 1e-5, 1e-4, 3e-3, 2e-2] {
        let a = line.evaluate(&f, q).unwrap();
        let b = line.evaluate(&f, -q).unwrap();
        let v = q / (0.25 * std::f64::consts::PI * 0.0525f64.powi(2));
        let want = dk * v * v / (2.0 * 9.80665);
        let scale = a.head_loss.abs();
        assert!(
            (a.head_loss + b.head_loss - want).abs() < 1e-14 * scale,
            "{q}: {} vs {want}",
            a.head_loss + b.head_loss
        );
    }
    let z = line.evaluate(&f, 0.0).unwrap();
    assert_eq!(z.head_loss, 0.0);
    let eps = 1e-12;
    let (lo, hi) = (
        line.evaluate(&f, -eps).unwrap(),
        line.evaluate(&f, eps).unwrap(),
    );
    assert!(common::rel_err(lo.drequired_head_dflow, z.drequired_head_dflow) < 1e-6);
    assert!(common::rel_err(hi.drequired_head_dflow, z.drequired_head_dflow) < 1e-6);
    assert!(common::rel_err(z.required_head, st) < 1e-15);
    // Scan through the transition of pipe A (Re 2300 at Q ≈ 1.14e-4, 4000 at ≈ 1.98e-4).
    let mut prev = line.evaluate(&f, 1.0e-4).unwrap();
    let n = 4000;
    for i in 1..=n {
        let q = 1.0e-4 + 1.2e-4 * i as f64 / n as f64;
        let cur = line.evaluate(&f, q).unwrap();
        let dq = 1.2e-4 / n as f64;
        // Mean-value check: the head step matches the slopes at both ends (continuity of h').
        let mid = 0.5 * (cur.drequired_head_dflow + prev.drequired_head_dflow) * dq;
        assert!(
            ((cur.required_head - prev.required_head) - mid).abs() < 1e-3 * mid.abs(),
            "q {q}"
        );
        assert!(
            (cur.drequired_head_dflow - prev.drequired_head_dflow).abs()
                < 0.02 * cur.drequired_head_dflow
        );
        prev = cur;
    }
}

#[test]
fn system_curve_equals_pointwise_evaluation() {
    // Exact property: the batch gives the same numbers, bit for bit.
    let line = main_line();
    let flows: Vec<f64> = (0..5000)
        .map(|i| -0.01 + 0.02 * i as f64 / 4999.0)
        .collect();
    let curve = line.system_curve(&fluid(), &flows).unwrap();
    for (i, q) in flows.iter().enumerate().step_by(97) {
        assert_eq!(
            curve[i].to_bits(),
            line.evaluate(&fluid(), *q).unwrap().required_head.to_bits()
        );
    }
}

#[test]
fn bad_inputs_are_clear_errors() {
    let f = fluid();
    assert!(
        Line::new(vec![])
            .unwrap_err()
            .to_string()
            .contains("at least one element")
    );
    let e = Line::new(vec![
        Element::Fitting(Fitting::k(1.0).unwrap()),
        Element::rise(3.0).unwrap(),
    ])
    .unwrap_err();
    assert!(e.to_string().contains("no diameter"), "{e}");
    let line = main_line();
    assert!(
        line.evaluate(&f, f64::NAN)
            .unwrap_err()
            .to_string()
            .starts_with("flow = NaN")
    );
    assert!(line.flow_for_head(&f, f64::INFINITY).is_err());
    let rises = Line::new(vec![Element::rise(3.0).unwrap()]).unwrap();
    assert!(rises.flow_for_head(&f, 5.0).is_err());
    // Pump curves: too few points, not monotonic, flows not increasing.
    assert!(
        PumpCurve::new(&[0.0, 1.0], &[10.0, 5.0])
            .unwrap_err()
            .to_string()
            .contains("at least 3")
    );
    assert!(
        PumpCurve::new(&[0.0, 1.0, 2.0], &[10.0, 11.0, 5.0])
            .unwrap_err()
            .to_string()
            .contains("not monotonic")
    );
    assert!(PumpCurve::new(&[0.0, 2.0, 1.0], &[10.0, 9.0, 5.0]).is_err());
    // A pump too weak for the static head.
    let weak = PumpCurve::new(&[0.0, 0.005, 0.01], &[10.0, 8.0, 4.0]).unwrap();
    assert!(
        line.operating_point(&f, &weak)
            .unwrap_err()
            .to_string()
            .contains("do not cross")
    );
    // Reverse flow through a check valve.
    let checked = Line::new(vec![
        Element::Pipe(Pipe::circular(0.05, 10.0, 0.0).unwrap()),
        Element::Fitting(Fitting::named("swing_check_valve").unwrap()),
        Element::rise(5.0).unwrap(),
    ])
    .unwrap();
    assert!(
        checked
            .flow_for_head(&f, 1.0)
            .unwrap_err()
            .to_string()
            .contains("check valve")
    );
    assert!(checked.flow_for_head(&f, 9.0).unwrap().flow > 0.0);
    // Negative length and roughness are refused when the pipe is built.
    assert!(Pipe::circular(0.05, -3.0, 0.0).is_err());
}

#[test]
fn sizing_matches_mpmath_and_standard_sizes_meet_the_limit() {
    // Reference: tests/reference/line/sizing.csv (mpmath bisection on the bore).
    use hydrograde::line::Limit;
    use hydrograde::sizes::PipeTable;
    let line = Line::new(vec![
        Element::Pipe(Pipe::circular(0.05, 80.0, 4.5e-5).unwrap()),
        Element::Fitting(Fitting::k(3.0).unwrap()),
    ])
    .unwrap();
    let f = fluid();
    for r in common::read_csv("line/sizing.csv") {
        let s = line
            .size(
                &f,
                4e-3,
                Limit::PressureLoss(r[0]),
                Some((PipeTable::Steel, "40")),
            )
            .unwrap();
        assert!(
            common::rel_err(s.min_inside_diameter, r[1]) < 1e-10,
            "{} vs {}",
            s.min_inside_diameter,
            r[1]
        );
        let std = s.standard.unwrap();
        assert!(std.size.inside_diameter >= s.min_inside_diameter && std.pressure_loss <= r[0]);
        let banded = s.standard_at_band.unwrap();
        assert!(banded.size.inside_diameter >= std.size.inside_diameter);
        assert!(banded.pressure_loss_band.high <= r[0]);
    }
    // Velocity limit: exact closed form d = √(4Q/(πV)).
    let s = line.size(&f, 4e-3, Limit::Velocity(1.5), None).unwrap();
    assert!(
        common::rel_err(
            s.min_inside_diameter,
            (4.0 * 4e-3 / (std::f64::consts::PI * 1.5)).sqrt()
        ) < 1e-15
    );
    // Bad input: zero flow, a negative limit, an impossible limit.
    assert!(
        line.size(&f, 0.0, Limit::Velocity(1.5), None)
            .unwrap_err()
            .to_string()
            .contains("must not be zero")
    );
    assert!(line.size(&f, 1e-3, Limit::Velocity(-1.0), None).is_err());
    // Rated equipment losing 1e5 Pa at the flow: no bore brings the line under 1e3 Pa
    // (a fitting with a stated bore would take the new bore; see line_resize.rs).
    let fixed = Line::new(vec![
        Element::Pipe(Pipe::circular(0.05, 1.0, 0.0).unwrap()),
        Element::Equipment(Equipment::pressure_drop("orifice plate", 1e5, 1e-2).unwrap()),
    ])
    .unwrap();
    assert!(
        fixed
            .size(&f, 1e-2, Limit::PressureLoss(1e3), None)
            .is_err()
    );
}

#[test]
fn split_bands_conserve_the_total_flow() {
    // Exact consequences of the linearised balance (Σ dQ_i = 0 for every source): with two
    // branches each source moves both flows by equal and opposite amounts, so the flow
    // bands have equal widths; two identical branches under a source common to both
    // (the friction model) keep equal flows, so their flow bands have no width.
    use hydrograde::band::UncertaintyOptions;
    use hydrograde::line::LineOptions;
    let f = fluid();
    let a = Line::new(vec![
        Element::Pipe(Pipe::circular(0.04, 60.0, 4.5e-5).unwrap()),
        Element::Fitting(Fitting::named("globe_valve").unwrap()),
    ])
    .unwrap();
    let b = Line::new(vec![
        Element::Pipe(Pipe::circular(0.065, 140.0, 1.5e-6).unwrap()),
        Element::rise(0.5).unwrap(),
    ])
    .unwrap();
    let s = split_flow(&[a.clone(), b], &f, 6e-3).unwrap();
    let (w0, w1) = (s.flow_bands[0].half_width(), s.flow_bands[1].half_width());
    assert!(w0 > 0.0 && common::rel_err(w0, w1) < 1e-9, "{w0} vs {w1}");
    assert!(s.head_band.low < s.head && s.head < s.head_band.high);
    let model = LineOptions::default()
        .with_uncertainty(UncertaintyOptions::model_only())
        .unwrap();
    let twin = a.set_options(model).unwrap();
    let s = split_flow(&[twin.clone(), twin], &f, 6e-3).unwrap();
    assert!(common::rel_err(s.flows[0], s.flows[1]) < 1e-12);
    assert!(s.flow_bands[0].half_width() <= 1e-12 * s.flows[0]);
    assert!(s.head_band.half_width() > 0.0);
}
