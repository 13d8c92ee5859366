//! Rated equipment in another fluid, and what a line must deliver at its end. Every
//! expected value is worked by hand beside its source.

use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Equipment, Line, default_rating_density};

const G: f64 = 9.80665; // standard gravity, exact (NIST SP 811)

#[test]
fn a_rated_drop_scales_with_density_over_the_rating_density() {
    // A strainer rated 20 kPa at 10 L/s with a fluid of 1000 kg/m³, passing a glycol mix
    // of 1100 kg/m³ at 10 L/s: fixed K, Δp = drop · ρ/ρ_rating = 20 000 · 1.1 = 22 000 Pa
    // (definition of K, Δp = K ½ρV²); at 5 L/s a quarter of that, 5 500 Pa.
    let strainer = Equipment::pressure_drop("strainer", 2e4, 0.01)
        .unwrap()
        .with_rating_density(1000.0)
        .unwrap();
    let line = Line::new(vec![Element::Equipment(strainer)]).unwrap();
    let glycol = Fluid::new(1100.0, 4e-3).unwrap();
    let r = line.evaluate(&glycol, 0.01).unwrap();
    assert!(
        (r.pressure_loss - 22_000.0).abs() < 1e-9,
        "{}",
        r.pressure_loss
    );
    // Head = Δp/(ρ g) = 20 000/(1000 g): independent of the fluid's density.
    assert!((r.head_loss - 2e4 / (1000.0 * G)).abs() < 1e-12);
    let r = line.evaluate(&glycol, 0.005).unwrap();
    assert!(
        (r.pressure_loss - 5_500.0).abs() < 1e-9,
        "{}",
        r.pressure_loss
    );
    // Unless stated, the rating fluid is water at 20 °C: 998.21 kg/m³ (IAPWS-IF97, from
    // memory), so in that same water the drop is the rated one.
    assert!((default_rating_density() - 998.21).abs() < 0.01);
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    let plain = Line::new(vec![Element::Equipment(
        Equipment::pressure_drop("strainer", 2e4, 0.01).unwrap(),
    )])
    .unwrap();
    let r = plain.evaluate(&water, 0.01).unwrap();
    assert!((r.pressure_loss - 2e4).abs() < 1e-9, "{}", r.pressure_loss);
    // Bad input names the parameter; a fixed-K rating has no rating fluid.
    let e = Equipment::pressure_drop("strainer", 2e4, 0.01)
        .unwrap()
        .with_rating_density(-5.0)
        .unwrap_err();
    assert!(e.to_string().contains("rating_density"), "{e}");
    let e = Equipment::fixed_k("valve", 2.0, None)
        .unwrap()
        .with_rating_density(1000.0)
        .unwrap_err();
    assert!(e.to_string().contains("fixed K"), "{e}");
}

#[test]
fn every_solver_sees_the_same_rated_drop() {
    // The strainer above in the glycol mix, behind a pipe: the fast paths of
    // required_head, the system curve and flow_for_head form the same head as evaluate,
    // h = drop/(ρ_rating g) · (Q/Q_r)² = 2.038... m at the rating flow (definition of K).
    let strainer = Equipment::pressure_drop("strainer", 2e4, 0.01)
        .unwrap()
        .with_rating_density(1000.0)
        .unwrap();
    let line = Line::new(vec![
        Element::Pipe(hydrograde::pipe::Pipe::circular(0.08, 25.0, 4.5e-5).unwrap()),
        Element::Equipment(strainer),
    ])
    .unwrap();
    let glycol = Fluid::new(1100.0, 4e-3).unwrap();
    let r = line.evaluate(&glycol, 0.01).unwrap();
    assert!((r.elements[1].head_loss - 2e4 / (1000.0 * G)).abs() < 1e-12);
    let (h, d) = line.required_head(&glycol, 0.01).unwrap();
    assert_eq!(h.to_bits(), r.required_head.to_bits());
    assert_eq!(d.to_bits(), r.drequired_head_dflow.to_bits());
    let curve = line.system_curve(&glycol, &[0.0, 0.005, 0.01]).unwrap();
    assert!((curve[2] - r.required_head).abs() <= 1e-12 * r.required_head);
    let q = line.flow_for_head(&glycol, r.required_head).unwrap().flow;
    assert!((q - 0.01).abs() < 1e-12, "{q}");
}

#[test]
fn a_line_that_must_deliver_a_pressure_counts_it_in_the_required_head() {
    // A spray header 12 m above an open tank needs 2.5 bar above the tank's pressure at
    // the end of 60 m of 50 mm pipe. Energy balance (Bernoulli with losses):
    // required head = Δz + losses + p_end/(ρ g), p_end/(ρ g) = 2.5e5/(998.2 g) = 25.539 m.
    use hydrograde::line::LineOptions;
    let water = Fluid::new(998.2, 1.002e-3).unwrap();
    let elements = vec![
        Element::Pipe(hydrograde::pipe::Pipe::circular(0.05, 60.0, 4.5e-5).unwrap()),
        Element::rise(12.0).unwrap(),
    ];
    let open = Line::new(elements.clone()).unwrap();
    let header = Line::with_options(
        elements,
        LineOptions::default()
            .with_end_pressure(Some(2.5e5))
            .unwrap(),
    )
    .unwrap();
    let q = 4e-3;
    let end_head = 2.5e5 / (998.2 * G);
    assert!((end_head - 25.539).abs() < 1e-3);
    let (a, b) = (
        open.evaluate(&water, q).unwrap(),
        header.evaluate(&water, q).unwrap(),
    );
    assert!((b.required_head - (a.required_head + end_head)).abs() < 1e-12);
    assert!((b.required_pressure - (a.required_pressure + 2.5e5)).abs() < 1e-8);
    assert_eq!(b.head_loss, a.head_loss);
    // The solvers see the same head: the flow for that head is the flow again.
    let (h, _) = header.required_head(&water, q).unwrap();
    assert_eq!(h, b.required_head);
    let back = header.flow_for_head(&water, b.required_head).unwrap();
    assert!(((back.flow - q) / q).abs() < 1e-10, "{}", back.flow);
    // At zero flow the pump must still hold the rise and the end pressure.
    let z = header.evaluate(&water, 0.0).unwrap();
    assert!((z.required_head - (12.0 + end_head)).abs() < 1e-12);
    // A non-finite end pressure is refused naming it.
    let e = LineOptions::default()
        .with_end_pressure(Some(f64::NAN))
        .unwrap_err();
    assert!(e.to_string().contains("end_pressure"), "{e}");
}
