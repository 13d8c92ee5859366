//! What a line means: the flow path every element sees, the direction the flow takes
//! through it, and the rows a route implies. Each scenario is written out by hand.

mod common;

use hydrograde::error::ErrorKind;
use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, ElementKind, Line, PumpCurve, split_flow};
use hydrograde::pipe::Pipe;
use hydrograde::warning::Warnings;
use std::f64::consts::PI;

const G: f64 = 9.80665; // standard gravity, m/s² (exact by definition, CGPM 1901)

fn water() -> Fluid {
    Fluid::new(998.2, 1.002e-3).unwrap()
}

fn pipe(d: f64) -> Element {
    Element::Pipe(Pipe::circular(d, 10.0, 4.5e-5).unwrap())
}

fn fitting(f: Fitting) -> Element {
    Element::Fitting(f)
}

#[test]
fn elbow_after_a_contraction_sees_the_downstream_velocity() {
    // Exact definition of the mean velocity: V = 4Q/(π d²) in the bore the elbow sits in,
    // the 50 mm outlet of the contraction, not the 100 mm pipe before it.
    let line = Line::new(vec![
        pipe(0.1),
        fitting(Fitting::contraction(0.1, 0.05).unwrap()),
        fitting(Fitting::named("elbow_90_standard").unwrap()),
        pipe(0.05),
    ])
    .unwrap();
    let q = 0.004;
    let v = 4.0 * 0.004 / (PI * 0.05 * 0.05); // 2.0372 m/s
    let r = line.evaluate(&water(), q).unwrap();
    assert_eq!(r.elements.len(), 4);
    let elbow = &r.elements[2];
    assert!(common::rel_err(elbow.velocity.unwrap(), v) < 1e-15);
    assert_eq!(elbow.element, Some(2));
    // Its loss is its own K on that velocity: h = K V²/2g (definition of K).
    let k = elbow.k.unwrap();
    assert!(common::rel_err(elbow.head_loss, k * v * v / (2.0 * G)) < 1e-14);
    // The contraction refers to its outlet too: K = 0.5 (1 − 0.25) on V₂ (Crane TP-410,
    // 1988, from memory).
    let c = &r.elements[1];
    assert!(common::rel_err(c.head_loss, 0.375 * v * v / (2.0 * G)) < 1e-14);
    assert!(
        !r.warnings
            .contains(Warnings::BORE_CHANGE_WITHOUT_TRANSITION)
    );
}

#[test]
fn a_fitting_standing_first_takes_the_inlet_of_what_follows() {
    // A K = 0.5 entrance before a contraction from 80 mm: V = 4Q/(π 0.08²) (definition).
    let line = Line::new(vec![
        fitting(Fitting::k(0.5).unwrap()),
        fitting(Fitting::contraction(0.08, 0.04).unwrap()),
        pipe(0.04),
    ])
    .unwrap();
    let r = line.evaluate(&water(), 0.002).unwrap();
    let v = 4.0 * 0.002 / (PI * 0.08 * 0.08);
    assert!(common::rel_err(r.elements[0].velocity.unwrap(), v) < 1e-15);
}

#[test]
fn a_bore_change_without_a_transition_is_its_own_row() {
    // 100 mm pipe straight into 50 mm pipe: an abrupt contraction, K = 0.5 (1 − A₂/A₁)
    // = 0.375 on the 50 mm velocity (Crane TP-410, 1988, from memory). Backwards it is an
    // abrupt expansion, K = (1 − A₂/A₁)² = 0.5625 on the same velocity (Borda–Carnot).
    let line = Line::new(vec![pipe(0.1), pipe(0.05)]).unwrap();
    let q = 0.003;
    let v = 4.0 * q / (PI * 0.05 * 0.05);
    let r = line.evaluate(&water(), q).unwrap();
    assert_eq!(r.elements.len(), 3);
    let row = &r.elements[1];
    assert_eq!(row.kind, ElementKind::SectionChange);
    assert_eq!(row.element, None);
    assert_eq!(r.elements[2].element, Some(1));
    assert!(common::rel_err(row.head_loss, 0.375 * v * v / (2.0 * G)) < 1e-14);
    assert!(
        row.warnings
            .contains(Warnings::BORE_CHANGE_WITHOUT_TRANSITION)
    );
    assert!(
        r.warnings
            .contains(Warnings::BORE_CHANGE_WITHOUT_TRANSITION)
    );
    assert!(
        r.messages
            .iter()
            .any(|m| m.contains("0.1 m") && m.contains("0.05 m")),
        "{:?}",
        r.messages
    );
    let back = line.evaluate(&water(), -q).unwrap();
    assert!(common::rel_err(back.elements[1].head_loss, -0.5625 * v * v / (2.0 * G)) < 1e-14);
    // The row is counted in the total.
    let sum: f64 = r.elements.iter().map(|e| e.head_loss).sum();
    assert!(common::rel_err(r.head_loss, sum) < 1e-15);
}

#[test]
fn a_stated_transition_that_does_not_match_its_pipe_implies_a_change() {
    // A 77.9 mm → 52.5 mm contraction after a 100 mm pipe: the step 100 → 77.9 mm is
    // built too, and is shown.
    let line = Line::new(vec![
        pipe(0.1),
        fitting(Fitting::contraction(0.0779, 0.0525).unwrap()),
        pipe(0.0525),
    ])
    .unwrap();
    let r = line.evaluate(&water(), 0.002).unwrap();
    assert_eq!(r.elements.len(), 4);
    assert_eq!(r.elements[1].kind, ElementKind::SectionChange);
    assert!(r.messages[0].contains("0.1 m") && r.messages[0].contains("0.0779 m"));
}

#[test]
fn reverse_flow_through_a_contraction_is_the_matching_expansion() {
    // Backwards through a 100 → 50 mm contraction the flow expands from 50 to 100 mm:
    // Borda–Carnot, K = (1 − (0.05/0.1)²)² = 0.5625 on the 50 mm velocity (exact
    // momentum balance), the same as a forward 50 → 100 mm expansion.
    let contraction = Line::new(vec![
        pipe(0.1),
        fitting(Fitting::contraction(0.1, 0.05).unwrap()),
        pipe(0.05),
    ])
    .unwrap();
    let expansion = Line::new(vec![
        pipe(0.05),
        fitting(Fitting::expansion(0.05, 0.1).unwrap()),
        pipe(0.1),
    ])
    .unwrap();
    let q = 0.004;
    let v = 4.0 * q / (PI * 0.05 * 0.05);
    let want = 0.5625 * v * v / (2.0 * G);
    let back = contraction.evaluate(&water(), -q).unwrap();
    let fwd = expansion.evaluate(&water(), q).unwrap();
    assert!(common::rel_err(back.elements[1].head_loss, -want) < 1e-14);
    assert!(common::rel_err(fwd.elements[1].head_loss, want) < 1e-14);
    // And the expansion backwards is the contraction: K = 0.5 (1 − 0.25) = 0.375.
    let eb = expansion.evaluate(&water(), -q).unwrap();
    assert!(common::rel_err(eb.elements[1].head_loss, -0.375 * v * v / (2.0 * G)) < 1e-14);
}

#[test]
fn reverse_flow_turns_a_tank_inlet_into_an_outlet() {
    // Backwards a square-edged inlet (K = 0.5) is an outlet into the tank: the velocity
    // head is lost, K = 1 (Borda–Carnot with an infinite outlet, exact); and the outlet
    // backwards is a square-edged inlet, K = 0.5 (Crane TP-410, 1988, from memory).
    let line = Line::new(vec![
        fitting(Fitting::entrance_sharp()),
        pipe(0.05),
        fitting(Fitting::exit()),
    ])
    .unwrap();
    let q = 0.003;
    let hv = (4.0 * q / (PI * 0.05 * 0.05)).powi(2) / (2.0 * G);
    let f = line.evaluate(&water(), q).unwrap();
    let b = line.evaluate(&water(), -q).unwrap();
    assert!(common::rel_err(f.elements[0].head_loss, 0.5 * hv) < 1e-14);
    assert!(common::rel_err(b.elements[0].head_loss, -hv) < 1e-14);
    assert!(common::rel_err(f.elements[2].head_loss, hv) < 1e-14);
    assert!(common::rel_err(b.elements[2].head_loss, -0.5 * hv) < 1e-14);
    // C¹ through zero: the slopes either side of zero agree with the slope at zero.
    let z = line.evaluate(&water(), 0.0).unwrap();
    for e in [1e-12, -1e-12] {
        let s = line.evaluate(&water(), e).unwrap();
        assert!(common::rel_err(s.drequired_head_dflow, z.drequired_head_dflow) < 1e-6);
    }
}

#[test]
fn a_check_valve_refuses_reverse_flow_in_every_call() {
    let line = Line::new(vec![
        pipe(0.05),
        fitting(Fitting::named("swing_check_valve").unwrap()),
        pipe(0.05),
        Element::Rise(5.0),
    ])
    .unwrap();
    let w = water();
    let named = |e: hydrograde::error::Error| {
        assert_eq!(e.kind(), ErrorKind::NoSolution, "{e}");
        let m = e.to_string();
        assert!(
            m.contains("swing_check_valve") && m.contains("element 1"),
            "{m}"
        );
    };
    named(line.evaluate(&w, -1e-3).unwrap_err());
    named(line.required_head(&w, -1e-3).unwrap_err());
    named(line.system_curve(&w, &[1e-3, -1e-3]).unwrap_err());
    named(line.flow_for_head(&w, 1.0).unwrap_err());
    named(hydrograde::band::monte_carlo(&line, &w, -1e-3, 200, 1).unwrap_err());
    // Forward flow and zero flow pass.
    assert!(line.evaluate(&w, 1e-3).is_ok() && line.evaluate(&w, 0.0).is_ok());
    // A pump that cannot lift the static head would drive the flow backwards.
    let pump = PumpCurve::new(&[0.0, 1e-3, 2e-3], &[3.0, 2.5, 1.5]).unwrap();
    assert!(line.operating_point(&w, &pump).is_err());
    // A split that would drive one branch backwards.
    let other = Line::new(vec![pipe(0.05), Element::Rise(-20.0)]).unwrap();
    let s = split_flow(&[line.clone(), other], &w, 1e-4);
    named(s.unwrap_err());
}
