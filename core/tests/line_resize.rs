//! Sizing that resizes everything it should: transitions, fittings with a stated bore,
//! equipment with a fixed bore, sections of a line and the material of the new pipes.
//! Each expected value is written out by hand in laminar flow, where the loss has the
//! closed form of Hagen–Poiseuille (exact: Δp = 128 μ L Q / (π D⁴)).

use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, ElementKind, Equipment, Limit, Line, Resize};
use hydrograde::pipe::Pipe;
use hydrograde::roughness;
use hydrograde::warning::Warnings;
use std::f64::consts::PI;

const G: f64 = 9.80665; // standard gravity, m/s² (exact by definition, CGPM 1901)
const RHO: f64 = 900.0; // an invented oil, kg/m³
const MU: f64 = 0.1; // its viscosity, Pa·s
const Q: f64 = 1e-4; // m³/s: Re = 4ρQ/(πDμ) ≤ 1.2e3 for D ≥ 1 mm, laminar throughout

fn oil() -> Fluid {
    Fluid::new(RHO, MU).unwrap()
}

fn pipe(d: f64, l: f64) -> Element {
    Element::Pipe(Pipe::circular(d, l, 4.5e-5).unwrap())
}

/// Hagen–Poiseuille (exact for laminar flow in a round pipe): Δp = 128 μ L Q / (π D⁴).
fn poiseuille(l: f64, d: f64) -> f64 {
    128.0 * MU * l * Q / (PI * d.powi(4))
}

fn bores(line: &Line) -> Vec<String> {
    line.elements()
        .iter()
        .map(|e| match e {
            Element::Pipe(p) => format!("pipe {}", p.bore()),
            Element::Fitting(f) => match f.transition_bores() {
                Some((a, b)) => format!("{} {a} {b}", f.method().name()),
                None => format!("{} {:?}", f.name(), f.diameter()),
            },
            _ => "other".to_string(),
        })
        .collect()
}

/// 100 mm, a contraction to 50 mm, 50 mm: 10 m each.
fn reduced() -> Line {
    Line::new(vec![
        pipe(0.1, 10.0),
        Element::Fitting(Fitting::contraction(0.1, 0.05).unwrap()),
        pipe(0.05, 10.0),
    ])
    .unwrap()
}

#[test]
fn a_line_sized_uniformly_has_no_phantom_reducer() {
    let line = reduced();
    let sized = line.with_uniform_diameter(0.03).unwrap();
    assert_eq!(bores(&sized), ["pipe 0.03", "pipe 0.03"]);
    let r = sized.evaluate(&oil(), Q).unwrap();
    assert!(r.elements.iter().all(|e| e.kind == ElementKind::Pipe));
    assert!(
        !r.warnings
            .contains(Warnings::BORE_CHANGE_WITHOUT_TRANSITION)
    );
    // Two 10 m runs of 30 mm: the loss of 20 m of 30 mm pipe, nothing else.
    let want = poiseuille(20.0, 0.03);
    assert!(
        (r.pressure_loss - want).abs() <= 1e-12 * want,
        "{} vs {want}",
        r.pressure_loss
    );
    assert!((r.required_head - want / (RHO * G)).abs() <= 1e-12 * r.required_head);
}

#[test]
fn sizing_the_line_removes_the_reducer_and_finds_the_closed_form_bore() {
    // Laminar: Δp(D) = 128 μ (20 m) Q / (π D⁴) = limit ⇒ D = (128 μ 20 Q / (π limit))^¼.
    let line = reduced();
    let limit = 2.0e4;
    let s = line
        .size(&oil(), Q, Limit::PressureLoss(limit), None)
        .unwrap();
    let want = (128.0 * MU * 20.0 * Q / (PI * limit)).powf(0.25);
    assert!(
        (s.min_inside_diameter - want).abs() <= 1e-9 * want,
        "{} vs {want}",
        s.min_inside_diameter
    );
}

#[test]
fn fittings_with_a_stated_bore_take_the_new_bore() {
    // K = 0.8 referred to 100 mm in a 100 mm line sized to 50 mm: the same kind of
    // fitting in the new bore, K = 0.8 on V = 4Q/(π 0.05²) (definition of K).
    let line = Line::new(vec![
        pipe(0.1, 10.0),
        Element::Fitting(Fitting::k_referred(0.8, 0.1).unwrap()),
        Element::Fitting(Fitting::k(0.3).unwrap()),
    ])
    .unwrap();
    let sized = line.with_uniform_diameter(0.05).unwrap();
    assert_eq!(bores(&sized), ["pipe 0.05", "k Some(0.05)", "k None"]);
    let r = sized.evaluate(&oil(), Q).unwrap();
    let v = 4.0 * Q / (PI * 0.05 * 0.05);
    for (row, k) in [(1, 0.8), (2, 0.3)] {
        let want = k * v * v / (2.0 * G);
        let got = r.elements[row].head_loss;
        assert!(
            (got - want).abs() <= 1e-14 * want,
            "row {row}: {got} vs {want}"
        );
    }
}

#[test]
fn equipment_with_a_fixed_bore_refuses_naming_itself() {
    let line = Line::new(vec![
        pipe(0.1, 10.0),
        Element::Equipment(Equipment::fixed_k("plate cooler", 4.0, Some(0.065)).unwrap()),
        pipe(0.1, 10.0),
    ])
    .unwrap();
    for e in [
        line.with_uniform_diameter(0.08).unwrap_err(),
        line.size(&oil(), Q, Limit::Velocity(1.0), None)
            .unwrap_err(),
    ] {
        let msg = e.to_string();
        assert!(
            msg.contains("element 1") && msg.contains("plate cooler"),
            "{msg}"
        );
    }
    // The sections on either side still size; the cooler keeps its bore.
    let before = line.with_diameter_in(0.08, &Resize::section(0, 1)).unwrap();
    assert_eq!(bores(&before)[0], "pipe 0.08");
    assert_eq!(bores(&before)[2], "pipe 0.1");
    // Equipment on the adjoining pipe's bore follows it.
    let follows = Line::new(vec![
        pipe(0.1, 10.0),
        Element::Equipment(Equipment::fixed_k("strainer", 2.0, None).unwrap()),
    ])
    .unwrap();
    assert!(follows.with_uniform_diameter(0.08).is_ok());
}

#[test]
fn a_section_resizes_its_pipes_and_the_transitions_at_its_borders() {
    let line = Line::new(vec![
        pipe(0.1, 10.0),
        pipe(0.1, 10.0),
        Element::Fitting(Fitting::contraction(0.1, 0.05).unwrap()),
        pipe(0.05, 10.0),
    ])
    .unwrap();
    // Upstream section to 80 mm: the contraction now starts at 80 mm.
    let up = line.with_diameter_in(0.08, &Resize::section(0, 2)).unwrap();
    assert_eq!(
        bores(&up),
        [
            "pipe 0.08",
            "pipe 0.08",
            "contraction 0.08 0.05",
            "pipe 0.05"
        ]
    );
    // Downstream pipe to 100 mm: the contraction joins equal bores and goes.
    let down = line.with_diameter_in(0.1, &Resize::section(3, 4)).unwrap();
    assert_eq!(bores(&down), ["pipe 0.1", "pipe 0.1", "pipe 0.1"]);
    // Downstream pipe to 120 mm: the change of section becomes an expansion 100 → 120.
    let grown = line.with_diameter_in(0.12, &Resize::section(3, 4)).unwrap();
    assert_eq!(bores(&grown)[2], "expansion 0.1 0.12");
    // A border without a transition: the path counts an abrupt contraction 100 → 80 with
    // its warning, K = 0.5 (1 − (0.08/0.1)²) = 0.18 on the 80 mm velocity.
    let mid = line.with_diameter_in(0.08, &Resize::section(1, 2)).unwrap();
    let r = mid.evaluate(&oil(), Q).unwrap();
    assert!(
        r.warnings
            .contains(Warnings::BORE_CHANGE_WITHOUT_TRANSITION)
    );
    let abrupt = r.elements.iter().find(|e| e.element.is_none()).unwrap();
    assert!((abrupt.k.unwrap() - 0.18).abs() < 1e-15);
    // Bad sections name the parameter.
    for (s, e, name) in [(0, 5, "end"), (2, 2, "start"), (2, 3, "section")] {
        let msg = line
            .with_diameter_in(0.08, &Resize::section(s, e))
            .unwrap_err()
            .to_string();
        assert!(msg.contains(name), "{s}..{e}: {msg}");
    }
}

#[test]
fn sizing_a_section_meets_the_limit_of_the_whole_line() {
    // A fixed 40 mm run of 30 m, then 50 m to size; the limit is for the whole line,
    // and the border (no transition element) is an abrupt contraction 40 mm → D:
    // Δp(D) = 128 μ Q/π (30/0.04⁴ + 50/D⁴) + ρ · 0.5 (1 − (D/0.04)²) · V²/2, V = 4Q/(πD²)
    // (Hagen–Poiseuille, exact; contraction K as the path's rule). Solved here by
    // bisection on the written-out formula.
    let line = Line::new(vec![pipe(0.04, 30.0), pipe(0.1, 50.0)]).unwrap();
    let limit = 3.0e4;
    let dp = |d: f64| {
        let v = 4.0 * Q / (PI * d * d);
        poiseuille(30.0, 0.04)
            + poiseuille(50.0, d)
            + RHO * 0.5 * (1.0 - (d / 0.04).powi(2)) * v * v / 2.0
    };
    let (mut lo, mut hi) = (0.02, 0.039);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if dp(mid) > limit { lo = mid } else { hi = mid }
    }
    let want = 0.5 * (lo + hi);
    let s = line
        .size_in(
            &oil(),
            Q,
            Limit::PressureLoss(limit),
            None,
            &Resize::section(1, 2),
        )
        .unwrap();
    assert!(
        (s.min_inside_diameter - want).abs() <= 1e-9 * want,
        "{} vs {want}",
        s.min_inside_diameter
    );
    // Without the abrupt row the bore would be (128 μ 50 Q / (π (limit − Δp₀)))^¼.
    let plain = (128.0 * MU * 50.0 * Q / (PI * (limit - poiseuille(30.0, 0.04)))).powf(0.25);
    assert!(want > plain);
}

#[test]
fn sized_pipes_take_the_roughness_of_the_named_material() {
    let line = Line::new(vec![pipe(0.1, 10.0), pipe(0.1, 10.0)]).unwrap();
    let pvc = roughness::material("pvc").unwrap();
    let sized = line
        .with_diameter_in(0.08, &Resize::section(1, 2).in_material("pvc"))
        .unwrap();
    let eps: Vec<f64> = sized
        .elements()
        .iter()
        .map(|e| match e {
            Element::Pipe(p) => p.roughness(),
            _ => f64::NAN,
        })
        .collect();
    assert_eq!(eps, [4.5e-5, pvc.typical]);
    let msg = line
        .with_diameter_in(0.08, &Resize::default().in_material("cheese"))
        .unwrap_err()
        .to_string();
    assert!(msg.contains("cheese"), "{msg}");
}
