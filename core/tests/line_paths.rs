//! Every path that evaluates a line forms each row's loss with one arithmetic (row.rs and
//! pipe::Geometry): `evaluate` (every element's full state), `required_head` (the
//! solvers' hot path), `system_curve` (the vector kernel) and `flow_for_head` (Newton on
//! `required_head`). Exact checks: the paths must agree to the bit, on a line that has
//! every kind of row, at laminar, transitional, turbulent, zero and reverse flows.

use hydrograde::fitting::{Edge, Fitting};
use hydrograde::fluid::Fluid;
use hydrograde::friction::{Correlation, Options};
use hydrograde::line::{Element, Equipment, Line, LineBuilder};
use hydrograde::pipe::Pipe;
use hydrograde::section::{Section, TurbulentDiameter};

/// An invented plant route: round pipes of three bores and a rectangular duct (so the
/// route implies abrupt changes of section), a contraction and an expansion, catalogue
/// fittings (one counted 4 ×), user K and 2-K fittings, a rated strainer with its own
/// rating density, fixed-K equipment, and rises up and down.
fn mixed_line(mode: TurbulentDiameter, corr: Correlation) -> Line {
    let (big, mid, small, steel) = (0.1023, 0.0779, 0.0525, 4.5e-5); // m
    let pipe = |d: f64, l: f64| Element::Pipe(Pipe::circular(d, l, steel).unwrap());
    let mut b = LineBuilder::new();
    b.push(Element::Fitting(Fitting::from_tank(Edge::Square).unwrap()));
    b.push(pipe(big, 30.0));
    let elbows = b.push(Element::Fitting(
        Fitting::named("elbow_90_standard").unwrap(),
    ));
    b.set_count(elbows, 4).unwrap();
    b.push(Element::rise(7.5).unwrap());
    b.push(Element::Pipe(
        Pipe::of_material(Section::circle(big).unwrap(), 12.0, "commercial_steel").unwrap(),
    ));
    b.push(Element::Fitting(Fitting::contraction(big, mid).unwrap()));
    b.push(pipe(mid, 18.0));
    b.push(Element::Fitting(Fitting::named("gate_valve").unwrap()));
    b.push(Element::Equipment(
        Equipment::pressure_drop("strainer", 1.5e4, 0.008)
            .unwrap()
            .with_rating_density(1030.0)
            .unwrap(),
    ));
    b.push(pipe(small, 9.0)); // abrupt contraction from 77.9 mm
    b.push(Element::Fitting(Fitting::two_k(800.0, 0.25).unwrap()));
    b.push(Element::Equipment(
        Equipment::fixed_k("meter", 3.2, None).unwrap(),
    ));
    b.push(Element::Pipe(
        Pipe::new(Section::rectangle(0.12, 0.05).unwrap(), 6.0, 1.5e-4).unwrap(),
    )); // abrupt change to a duct of another shape
    b.push(Element::Fitting(Fitting::k(1.1).unwrap()));
    b.push(Element::rise(-3.0).unwrap());
    b.push(Element::Fitting(Fitting::expansion(mid, big).unwrap()));
    b.push(pipe(big, 40.0));
    b.push(Element::Fitting(Fitting::into_tank()));
    b.set_turbulent_diameter(mode);
    b.set_friction(Options::with_correlation(corr)).unwrap();
    b.build().unwrap()
}

/// Flows (m³/s) from reverse turbulent through zero to laminar, transitional and
/// turbulent in every bore (Re ≈ 4Q/(πDν): 2300 in the 52.5 mm bore at about 1e-4 m³/s).
const FLOWS: [f64; 14] = [
    -0.02, -2e-3, -1.5e-4, -1e-9, 0.0, 1e-9, 1e-5, 8e-5, 1.3e-4, 2e-4, 3.2e-4, 2e-3, 0.012, 0.03,
];

fn same(a: f64, b: f64, what: &str) {
    assert_eq!(a.to_bits(), b.to_bits(), "{what}: {a} vs {b}");
}

#[test]
fn every_path_gives_the_evaluated_bits_on_a_mixed_line() {
    let water = Fluid::water(288.15, 101_325.0).unwrap();
    let oil = Fluid::new(870.0, 0.03).unwrap(); // laminar over most of the flows
    for mode in [
        TurbulentDiameter::Hydraulic,
        TurbulentDiameter::LaminarEquivalent,
    ] {
        for corr in [
            Correlation::Colebrook,
            Correlation::Churchill,
            Correlation::Haaland,
        ] {
            let line = mixed_line(mode, corr);
            assert!(line.evaluate(&water, 0.01).unwrap().elements.len() > 19);
            for fluid in [&water, &oil] {
                let curve = line.system_curve(fluid, &FLOWS).unwrap();
                let banded = line.system_curve_band(fluid, &FLOWS).unwrap();
                for (k, &q) in FLOWS.iter().enumerate() {
                    let at = format!("{mode:?} {corr} q = {q}");
                    let r = line.evaluate(fluid, q).unwrap();
                    let (h, d) = line.required_head(fluid, q).unwrap();
                    same(h, r.required_head, &format!("required_head, {at}"));
                    same(d, r.drequired_head_dflow, &format!("slope, {at}"));
                    same(curve[k], r.required_head, &format!("system_curve, {at}"));
                    same(
                        banded.nominal[k],
                        r.required_head,
                        &format!("curve band, {at}"),
                    );
                    // The rows sum to the total in route order (the order every path uses).
                    let summed = r
                        .elements
                        .iter()
                        .fold(0.0, |acc, e| acc + (e.head_loss + e.static_head));
                    same(summed, r.required_head, &format!("rows, {at}"));
                    if q == 0.0 {
                        continue;
                    }
                    // flow_for_head solves on required_head, whose bits are evaluate's: the
                    // flow it returns gives back the head asked for, to the rounding of the
                    // head (a few ulp of the largest term).
                    let s = line.flow_for_head(fluid, r.required_head).unwrap();
                    let back = line.evaluate(fluid, s.flow).unwrap();
                    same(
                        line.required_head(fluid, s.flow).unwrap().0,
                        back.required_head,
                        &format!("required_head at the solved flow, {at}"),
                    );
                    let scale = r.required_head.abs().max(line.static_head().abs());
                    assert!(
                        (back.required_head - r.required_head).abs() <= 1e-13 * scale,
                        "flow_for_head, {at}: {} for {}",
                        back.required_head,
                        r.required_head
                    );
                }
            }
        }
    }
}

#[test]
fn a_check_valve_stops_reverse_flow_the_same_way_on_every_path() {
    // Exact check: reverse flow through a check valve is one error kind on every path.
    let mut b = LineBuilder::new();
    b.push(Element::Pipe(Pipe::circular(0.05, 10.0, 4.5e-5).unwrap()));
    b.push(Element::Fitting(
        Fitting::named("swing_check_valve").unwrap(),
    ));
    let line = b.build().unwrap();
    let water = Fluid::water(288.15, 101_325.0).unwrap();
    let kinds = [
        line.evaluate(&water, -1e-3).unwrap_err().kind(),
        line.required_head(&water, -1e-3).unwrap_err().kind(),
        line.system_curve(&water, &[1e-3, -1e-3])
            .unwrap_err()
            .kind(),
    ];
    assert!(kinds.iter().all(|k| *k == kinds[0]), "{kinds:?}");
    // Forward flow passes on every path with the same bits.
    let r = line.evaluate(&water, 1e-3).unwrap();
    same(
        line.required_head(&water, 1e-3).unwrap().0,
        r.required_head,
        "forward",
    );
    same(
        line.system_curve(&water, &[1e-3]).unwrap()[0],
        r.required_head,
        "curve",
    );
}
