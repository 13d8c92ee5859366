//! What a line means: the flow path every element sees, the direction the flow takes
//! through it, and the rows a route implies. Each scenario is written out by hand.

mod common;

use hydrograde::error::ErrorKind;
use hydrograde::fitting::{Edge, Fitting};
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
    // Each row names the bore its velocity refers to (the route as typed above) and a
    // pipe its length: the elbow sits in the 50 mm outlet.
    let bores: Vec<_> = r.elements.iter().map(|e| e.bore).collect();
    assert_eq!(bores, [Some(0.1), Some(0.05), Some(0.05), Some(0.05)]);
    let lengths: Vec<_> = r.elements.iter().map(|e| e.length).collect();
    assert_eq!(lengths, [Some(10.0), None, None, Some(10.0)]);
}

#[test]
fn rises_have_no_bore_nor_length() {
    let line = Line::new(vec![pipe(0.1), Element::rise(3.0).unwrap()]).unwrap();
    let r = line.evaluate(&water(), 0.004).unwrap();
    assert_eq!((r.elements[1].bore, r.elements[1].length), (None, None));
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
        fitting(Fitting::from_tank(Edge::Square).unwrap()),
        pipe(0.05),
        fitting(Fitting::into_tank()),
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
        Element::rise(5.0).unwrap(),
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
    let other = Line::new(vec![pipe(0.05), Element::rise(-20.0).unwrap()]).unwrap();
    let s = split_flow(&[line.clone(), other], &w, 1e-4);
    named(s.unwrap_err());
}

mod surroundings {
    use super::*;
    use hydrograde::line::LineOptions;

    /// Ideal-gas density of dry air, ρ = p M/(R T), M = 0.0289647 kg/mol (dry air, from
    /// memory), R = 8.314462618 J/(mol·K) (exact, SI 2019).
    fn air_density(t: f64, p: f64) -> f64 {
        p * 0.028_964_7 / (8.314_462_618 * t)
    }

    fn duct(rise: f64) -> Line {
        Line::new(vec![
            Element::Pipe(Pipe::circular(0.3, 30.0, 1.5e-4).unwrap()),
            Element::rise(rise).unwrap(),
        ])
        .unwrap()
    }

    #[test]
    fn air_rising_in_air_of_the_same_state_adds_no_pressure() {
        // Hydrostatics: inside and outside columns of equal density cancel, so the rise
        // adds (ρ − ρ_s)·g·Δz = 0 at zero flow exactly; with flow the mean density inside
        // drops by the friction loss and the rise adds exactly (ρ_mean − ρ_s)·g·100.
        let air = Fluid::air(293.15, 101_325.0).unwrap();
        let line = duct(100.0);
        let still = line.evaluate(&air, 0.0).unwrap();
        assert_eq!(still.required_pressure, 0.0);
        assert_eq!(still.elements[1].static_head, 0.0);
        let r = line.evaluate(&air, 0.5).unwrap();
        let rho_s = air_density(293.15, 101_325.0);
        let want = (r.density - rho_s) * G * 100.0;
        let got = r.elements[1].static_head * r.density * G;
        assert!((got - want).abs() < 1e-9, "{got} vs {want}");
        // Far from the 1.2 kPa of a 100 m column of the duct's own air.
        assert!(got.abs() < 1.0);
    }

    #[test]
    fn hot_flue_gas_rising_30_m_gives_the_stack_effect() {
        // Stack effect (hydrostatics): Δp = −(ρ_amb − ρ_hot)·g·30 m, i.e. the hot column
        // lifts itself; with ideal-gas densities at 101 325 Pa:
        // ρ_amb = 1.20412 kg/m³ (20 °C), ρ_hot = 0.74604 kg/m³ (200 °C), Δp ≈ −134.8 Pa.
        let hot = Fluid::air(473.15, 101_325.0).unwrap();
        let line = duct(30.0);
        let r = line.evaluate(&hot, 0.0).unwrap();
        let rho_amb = air_density(293.15, 101_325.0);
        let rho_hot = air_density(473.15, 101_325.0);
        let want = -(rho_amb - rho_hot) * G * 30.0;
        assert!(
            common::rel_err(r.required_pressure, want) < 1e-12,
            "{} vs {want}",
            r.required_pressure
        );
        assert!((want + 134.8).abs() < 0.1);
    }

    #[test]
    fn liquids_neglect_the_air_column_unless_asked() {
        // Water rising 10 m: static head 10 m by default; with the air column counted,
        // 10 (1 − ρ_air/ρ_water) m (hydrostatics).
        let w = water();
        let plain = duct(10.0);
        assert_eq!(plain.evaluate(&w, 0.0).unwrap().static_head, 10.0);
        let with_air = plain
            .set_options(LineOptions::default().with_air_column_for_liquids(true))
            .unwrap();
        let want = 10.0 * (1.0 - air_density(293.15, 101_325.0) / 998.2);
        let got = with_air.evaluate(&w, 0.0).unwrap().static_head;
        assert!(common::rel_err(got, want) < 1e-12, "{got} vs {want}");
    }

    #[test]
    fn surroundings_must_be_a_gas() {
        let e = LineOptions::default()
            .with_surroundings(Some(water()))
            .unwrap_err();
        assert_eq!(e.kind(), ErrorKind::Invalid);
        assert!(e.to_string().starts_with("surroundings:"), "{e}");
    }
}

mod pressures {
    use super::*;
    use hydrograde::line::LineOptions;

    #[test]
    fn a_60_c_suction_lift_of_7_m_at_3_m_s_cavitates() {
        // An open tank (101 325 Pa on its surface) feeds a square-edged inlet (K = 0.5),
        // a strainer (K = 2) and a 7 m lift in a 100 mm suction at 3 m/s of 60 °C water.
        // Bernoulli with losses from the tank surface (V = 0) to the top of the lift:
        //   p_total = p_atm − ρ g (7 + (0.5 + 2) V²/2g),   p_static = p_total − ½ρV²,
        //   NPSHa = (p_total − p_v)/(ρ g)          (definition).
        // ρ and p_v are the fluid's (inputs); V = 3 m/s is the scenario.
        let w = Fluid::water(333.15, 101_325.0).unwrap();
        let (rho, pv) = (w.density(), w.vapour_pressure().unwrap());
        assert!((pv - 19_946.0).abs() < 10.0); // IAPWS-IF97 saturation at 60 °C, from memory
        let area = PI * 0.1 * 0.1 / 4.0;
        let q = 3.0 * area;
        let line = Line::with_options(
            vec![
                fitting(Fitting::from_tank(Edge::Square).unwrap()),
                fitting(Fitting::k(2.0).unwrap()),
                Element::rise(7.0).unwrap(),
                Element::Pipe(Pipe::circular(0.1, 1.0, 4.5e-5).unwrap()),
            ],
            LineOptions::default()
                .with_inlet_pressure(Some(101_325.0))
                .unwrap(),
        )
        .unwrap();
        let r = line.evaluate(&w, q).unwrap();
        let v = q / area;
        let hv = v * v / (2.0 * G);
        let total = 101_325.0 - rho * G * (7.0 + 2.5 * hv);
        let stat = total - 0.5 * rho * v * v; // ≈ 18.3 kPa, below p_v ≈ 19.9 kPa
        let top = &r.elements[2];
        assert!(common::rel_err(top.total_pressure_out.unwrap(), total) < 1e-12);
        assert!(common::rel_err(top.pressure_out.unwrap(), stat) < 1e-12);
        assert_eq!(top.elevation_out, 7.0);
        assert!(stat < pv && (stat - 18_350.0).abs() < 200.0, "{stat}");
        assert!(top.warnings.contains(Warnings::BELOW_VAPOUR_PRESSURE));
        assert!(r.messages.iter().any(|m| m.contains("vapour pressure")));
        let npsha = (total - pv) / (rho * G); // ≈ 0.29 m
        assert!(common::rel_err(r.npsh_available(2).unwrap(), npsha) < 1e-12);
        let c = r.npsh_check(2, 0.2, 0.5).unwrap();
        assert!(!c.sufficient && common::rel_err(c.available, npsha) < 1e-12);
        // Bad questions.
        let e = r.npsh_available(9).unwrap_err();
        assert!(e.to_string().starts_with("index = 9"), "{e}");
        assert!(r.npsh_check(2, -1.0, 0.0).is_err());
        let no_p = Line::new(line.elements().to_vec()).unwrap();
        let e = no_p.evaluate(&w, q).unwrap().npsh_available(2).unwrap_err();
        assert!(e.to_string().starts_with("inlet_pressure"), "{e}");
    }

    #[test]
    fn a_line_starting_in_a_pipe_takes_the_inlet_pressure_as_static() {
        // Static pressure 2 bar in the first pipe: total = p + ½ρV² (definition).
        let w = water();
        let line = Line::with_options(
            vec![pipe(0.05)],
            LineOptions::default()
                .with_inlet_pressure(Some(2e5))
                .unwrap(),
        )
        .unwrap();
        let q = 2e-3;
        let r = line.evaluate(&w, q).unwrap();
        let v = q / (PI * 0.05 * 0.05 / 4.0);
        let want = 2e5 + 0.5 * 998.2 * v * v - 998.2 * G * r.elements[0].head_loss;
        assert!(common::rel_err(r.elements[0].total_pressure_out.unwrap(), want) < 1e-14);
    }
}
