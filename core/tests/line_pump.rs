//! A pump as an element of a line: its head is the negative loss −H(Q) in every solver,
//! the line knows the flow it runs at by itself, and NPSH available is reported at the
//! pump's suction. Every expected value is worked by hand beside its source.

use hydrograde::ErrorKind;
use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, ElementKind, Line, PumpCurve, split_flow};
use hydrograde::pipe::Pipe;
use std::f64::consts::PI;

const G: f64 = 9.80665; // standard gravity, exact (NIST SP 811)

/// Points on H = a − b Q² from 0 to `q_max` (11 points), fitted by a quadratic: the fit
/// through points of a parabola is that parabola (exact solution of least squares).
fn parabola(a: f64, b: f64, q_max: f64) -> PumpCurve {
    let q: Vec<f64> = (0..=10).map(|i| q_max * f64::from(i) / 10.0).collect();
    let h: Vec<f64> = q.iter().map(|q| a - b * q * q).collect();
    PumpCurve::fit(&q, &h, 2).unwrap()
}

/// The line with a static inlet pressure of 101 325 Pa.
fn at_one_atmosphere(elements: Vec<Element>) -> Line {
    let line = Line::new(elements).unwrap();
    let o = line.options().clone().with_inlet_pressure(Some(101_325.0));
    line.set_options(o.unwrap()).unwrap()
}

fn area(d: f64) -> f64 {
    PI * d * d / 4.0
}

/// A pump H = 40 − 1.5e5 Q² (m, Q in m³/s, 0 … 15 L/s) behind a fixed K = 12 on 50 mm,
/// lifting 15 m.
fn fixed_k_line() -> (Line, f64, f64, f64) {
    let (a, b, k, d, lift) = (40.0, 1.5e5, 12.0, 0.05, 15.0);
    let line = Line::new(vec![
        Element::Pump(parabola(a, b, 0.015)),
        Element::Fitting(Fitting::k(k).unwrap().with_diameter(d).unwrap()),
        Element::rise(lift).unwrap(),
    ])
    .unwrap();
    // Exact operating point (energy balance, definition of K): a − b Q² = Hs + K Q²/(2 g A²)
    // ⇒ Q = sqrt((a − Hs)/(b + K/(2 g A²))).
    let r = k / (2.0 * G * area(d) * area(d));
    let q = ((a - lift) / (b + r)).sqrt();
    (line, q, a - b * q * q, r)
}

#[test]
fn a_line_with_a_pump_runs_where_its_head_meets_the_loss() {
    let (line, q, h, _) = fixed_k_line();
    let water = Fluid::new(998.2, 1.0e-3).unwrap();
    let p = line.pumped_flow(&water).unwrap();
    // Q ≈ 9.00 L/s (worked: r = 12/(2 g (1.9635e-3)²) = 1.5870e5 s²/m⁵, Q = sqrt(25/3.0870e5)).
    assert!((q - 8.9993e-3).abs() < 1e-6, "{q}");
    assert!((p.flow - q).abs() <= 1e-12 * q, "{} vs {q}", p.flow);
    assert!(
        (p.pump_head - h).abs() <= 1e-9 * h,
        "{} vs {h}",
        p.pump_head
    );
    assert_eq!(p.pump_row, 0);
    assert_eq!(p.result.elements[0].kind, ElementKind::Pump);
    // Required head zero at the point: the pump's head is the row's negative loss.
    assert!(
        p.result.required_head.abs() < 1e-9,
        "{}",
        p.result.required_head
    );
    assert_eq!(p.result.elements[0].head_loss, -p.pump_head);
    // The slope: d/dQ (Hs + r Q² − a + b Q²) = 2 (r + b) Q (exact derivative).
    let want = 2.0 * (1.5e5 + 12.0 / (2.0 * G * area(0.05).powi(2))) * q;
    assert!((p.drequired_head_dflow - want).abs() <= 1e-9 * want);
    // No inlet pressure stated: NPSH does not apply.
    assert_eq!(p.npsh_available, None);
}

#[test]
fn a_laminar_pipe_and_a_pump_meet_at_the_closed_form() {
    // Oil (ρ 880 kg/m³, μ 0.2 Pa·s) in 100 m of 40 mm pipe, pumped level (no lift) by
    // H = 30 − 1e5 Q². Laminar loss (Hagen–Poiseuille, exact): h = 128 μ L Q/(π ρ g D⁴) = c Q.
    // Balance a − b Q² = c Q ⇒ Q = (−c + sqrt(c² + 4 a b))/(2 b).
    let (a, b, d, len) = (30.0, 1e5, 0.04, 100.0);
    let oil = Fluid::new(880.0, 0.2).unwrap();
    let line = Line::new(vec![
        Element::Pump(parabola(a, b, 0.012)),
        Element::Pipe(Pipe::circular(d, len, 0.0).unwrap()),
    ])
    .unwrap();
    let c = 128.0 * 0.2 * len / (PI * 880.0 * G * d.powi(4));
    let q = (-c + (c * c + 4.0 * a * b).sqrt()) / (2.0 * b);
    let p = line.pumped_flow(&oil).unwrap();
    // Re = 4 ρ Q/(π μ D) ≈ 4·880·1.2e-3/(π·0.2·0.04) < 2300: laminar as assumed.
    let re = 4.0 * 880.0 * q / (PI * 0.2 * d);
    assert!(re < 2300.0, "{re}");
    assert!((p.flow - q).abs() <= 1e-10 * q, "{} vs {q}", p.flow);
}

#[test]
fn npsh_at_the_pump_suction_is_written_out() {
    // Water at 20 °C drawn through a strainer (K = 2.5 on 50 mm) up 3 m to a pump; the
    // inlet static pressure before the strainer is 101 325 Pa. NPSH available at the
    // suction (definition, ISO 9906): (p_in + ½ρV² − p_v)/(ρ g) − K V²/(2 g) − Δz.
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    let d = 0.05;
    let line = at_one_atmosphere(vec![
        Element::Fitting(Fitting::k(2.5).unwrap().with_diameter(d).unwrap()),
        Element::rise(3.0).unwrap(),
        Element::Pump(parabola(40.0, 1.5e5, 0.015)),
        Element::Fitting(Fitting::k(12.0).unwrap().with_diameter(d).unwrap()),
        Element::rise(12.0).unwrap(),
    ]);
    let p = line.pumped_flow(&water).unwrap();
    assert_eq!(p.pump_row, 2);
    let (rho, pv) = (water.density(), water.vapour_pressure().unwrap());
    let v = p.flow / area(d);
    let want = (101_325.0 + 0.5 * rho * v * v - pv) / (rho * G) - 2.5 * v * v / (2.0 * G) - 3.0;
    let got = p.npsh_available.unwrap();
    assert!((got - want).abs() < 1e-9, "{got} vs {want}");
    // The same figure as the result's own NPSH at the row before the pump.
    assert_eq!(got, p.result.npsh_available(1).unwrap());
    // A pump first in the line: NPSH at the line's start, (p_in + ½ρV² − p_v)/(ρ g).
    let first = at_one_atmosphere(vec![
        Element::Pump(parabola(40.0, 1.5e5, 0.015)),
        Element::Fitting(Fitting::k(12.0).unwrap().with_diameter(d).unwrap()),
        Element::rise(15.0).unwrap(),
    ]);
    let p = first.pumped_flow(&water).unwrap();
    let v = p.flow / area(d);
    let want = (101_325.0 + 0.5 * rho * v * v - pv) / (rho * G);
    let got = p.npsh_available.unwrap();
    assert!((got - want).abs() < 1e-9, "{got} vs {want}");
}

#[test]
fn every_solver_sees_the_same_pump() {
    // The fixed-K line of the first test behind a 25 m pipe: evaluate, required_head, the
    // system curve's fast path, flow_for_head, bands and Monte Carlo all carry the pump's
    // −H(Q) = −(40 − 1.5e5 Q²) (the curve's own definition).
    let pump = parabola(40.0, 1.5e5, 0.015);
    let pipe = Element::Pipe(Pipe::circular(0.05, 25.0, 4.5e-5).unwrap());
    let k = Element::Fitting(Fitting::k(12.0).unwrap());
    let with = Line::new(vec![pipe.clone(), Element::Pump(pump), k.clone()]).unwrap();
    let without = Line::new(vec![pipe, k]).unwrap();
    let water = Fluid::new(998.2, 1.0e-3).unwrap();
    let q = 0.008;
    let h_pump = 40.0 - 1.5e5 * q * q;
    let r = with.evaluate(&water, q).unwrap();
    assert!((r.elements[1].head_loss + h_pump).abs() < 1e-12);
    assert!((r.elements[1].dhead_dflow - 2.0 * 1.5e5 * q).abs() < 1e-8);
    let plain = without.evaluate(&water, q).unwrap();
    assert!((r.required_head - (plain.required_head - h_pump)).abs() < 1e-12);
    let (h, d) = with.required_head(&water, q).unwrap();
    assert_eq!(h.to_bits(), r.required_head.to_bits());
    assert_eq!(d.to_bits(), r.drequired_head_dflow.to_bits());
    let curve = with.system_curve(&water, &[0.0, 0.004, q]).unwrap();
    assert_eq!(curve[2].to_bits(), r.required_head.to_bits());
    let back = with.flow_for_head(&water, r.required_head).unwrap();
    assert!((back.flow - q).abs() < 1e-12, "{}", back.flow);
    // Bands: the pump adds no uncertainty source; the band is the plain line's shifted.
    let shift = r.required_head_band.nominal - plain.required_head_band.nominal;
    assert!((shift + h_pump).abs() < 1e-12);
    let width = |b: &hydrograde::band::Band| b.high - b.low;
    assert!((width(&r.required_head_band) - width(&plain.required_head_band)).abs() < 1e-9);
    let mc = hydrograde::band::monte_carlo(&with, &water, q, 1000, 7).unwrap();
    let mc_plain = hydrograde::band::monte_carlo(&without, &water, q, 1000, 7).unwrap();
    assert!((mc.mean - (mc_plain.mean - h_pump)).abs() < 1e-9);
    // An outside pump on the pumped line: two pumps in series meet the line where
    // H_outside(Q) = required head of the pumped line.
    let outside = parabola(40.0, 1.5e5, 0.015);
    let op = with.operating_point(&water, &outside).unwrap();
    let (need, _) = with.required_head(&water, op.flow).unwrap();
    assert!((need - op.head).abs() < 1e-9);
    // Parallel split: a pumped branch beside a plain one; both need the same head.
    let s = split_flow(&[with.clone(), without.clone()], &water, 0.012).unwrap();
    let (h1, _) = with.required_head(&water, s.flows[0]).unwrap();
    let (h2, _) = without.required_head(&water, s.flows[1]).unwrap();
    assert!((h1 - h2).abs() <= 1e-9 * h2.abs().max(1.0), "{h1} {h2}");
}

#[test]
fn a_network_link_with_a_booster_pump_carries_its_head() {
    // Two tanks at the same level joined by 200 m of 100 mm pipe with a booster
    // H = 20 − 5e4 Q² on 0 … 20 L/s: the link runs where the pump's head equals the
    // pipe's loss, the flow pumped_flow gives for the same line.
    use hydrograde::network::Network;
    let line = Line::new(vec![
        Element::Pump(parabola(20.0, 5e4, 0.02)),
        Element::Pipe(Pipe::circular(0.1, 200.0, 4.5e-5).unwrap()),
    ])
    .unwrap();
    let water = Fluid::new(998.2, 1.0e-3).unwrap();
    let own = line.pumped_flow(&water).unwrap().flow;
    let mut net = Network::new();
    net.fixed_head("a", 10.0, None).unwrap();
    net.fixed_head("b", 10.0, None).unwrap();
    net.link("booster", "a", "b", line).unwrap();
    let s = net.solve(&water).unwrap();
    assert!(
        (s.links[0].flow - own).abs() < 1e-6 * own,
        "{}",
        s.links[0].flow
    );
}

#[test]
fn a_pump_refuses_flows_off_its_curve_and_reverse_flow() {
    let (line, _, _, _) = fixed_k_line();
    let water = Fluid::new(998.2, 1.0e-3).unwrap();
    let labelled = {
        let mut b = hydrograde::line::LineBuilder::from_line(line.clone());
        b.set_label(0, Some("booster")).unwrap();
        b.build().unwrap()
    };
    for l in [&line, &labelled] {
        for q in [0.02, -0.001] {
            let e = l.evaluate(&water, q).unwrap_err();
            assert_eq!(e.kind(), ErrorKind::OutOfRange);
            let m = e.to_string();
            assert!(m.contains("element 0") && m.contains("0.015"), "{m}");
            if q < 0.0 {
                assert!(m.contains("reverse"), "{m}");
            } else {
                assert!(m.contains("not extrapolated"), "{m}");
            }
            assert!(l.required_head(&water, q).is_err());
            assert!(l.system_curve(&water, &[0.001, q]).is_err());
        }
    }
    let m = labelled.evaluate(&water, 0.02).unwrap_err().to_string();
    assert!(m.contains("'booster'"), "{m}");
    // A head beyond what the pump can give, or below what it gives at its largest flow.
    // Required head (exact): 15 + r Q² − (40 − 1.5e5 Q²), −25 m at Q = 0 and 44.46 m at
    // 15 L/s (r = 1.587e5 s²/m⁵).
    let e = line.flow_for_head(&water, -50.0).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::NoSolution);
    assert!(e.to_string().contains("smallest flow, 0 m³/s"), "{e}");
    let e = line.flow_for_head(&water, 50.0).unwrap_err();
    assert!(e.to_string().contains("largest flow, 0.015 m³/s"), "{e}");
    // A lift the pump cannot reach: no operating point of its own.
    let tall = Line::new(vec![
        Element::Pump(parabola(40.0, 1.5e5, 0.015)),
        Element::Fitting(Fitting::k(12.0).unwrap().with_diameter(0.05).unwrap()),
        Element::rise(45.0).unwrap(),
    ])
    .unwrap();
    assert_eq!(
        tall.pumped_flow(&water).unwrap_err().kind(),
        ErrorKind::NoSolution
    );
    // No pump: the question does not apply.
    let plain = Line::new(vec![Element::Fitting(
        Fitting::k(1.0).unwrap().with_diameter(0.05).unwrap(),
    )])
    .unwrap();
    let e = plain.pumped_flow(&water).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(e.to_string().contains("no pump"), "{e}");
    // An empty curve cannot be made.
    assert_eq!(
        PumpCurve::new(&[], &[]).unwrap_err().kind(),
        ErrorKind::Invalid
    );
    // Two pumps with no flow in common.
    let two = Line::new(vec![
        Element::Pump(parabola(40.0, 1.5e5, 0.015)),
        Element::Pump(PumpCurve::new(&[0.02, 0.03, 0.04], &[30.0, 25.0, 15.0]).unwrap()),
        Element::Fitting(Fitting::k(1.0).unwrap().with_diameter(0.05).unwrap()),
    ])
    .unwrap();
    assert!(
        two.pumped_flow(&water)
            .unwrap_err()
            .to_string()
            .contains("no flow in common")
    );
}
