//! Uncertainty bands: the statements of the band module checked, and the first-order
//! (GUM, JCGM 100:2008) band compared with Monte Carlo propagation (JCGM 101:2008).

mod common;

use hydrograde::band::{Source, UncertaintyOptions, monte_carlo};
use hydrograde::fitting::{Edge, Fitting};
use hydrograde::fluid::Fluid;
use hydrograde::friction::Regime;
use hydrograde::line::{Element, Equipment, Line, LineOptions};
use hydrograde::pipe::Pipe;
use hydrograde::section::Section;

fn water() -> Fluid {
    Fluid::water(293.15, 101_325.0).unwrap()
}

fn with_uncertainty(elements: Vec<Element>, u: UncertaintyOptions) -> Line {
    Line::with_options(
        elements,
        LineOptions::default().with_uncertainty(u).unwrap(),
    )
    .unwrap()
}

#[test]
fn smooth_turbulent_pipe_with_model_only_is_ten_percent() {
    // Common practice: Colebrook is good to about ±10 % (k = 2) in turbulent flow.
    let line = with_uncertainty(
        vec![Element::Pipe(Pipe::circular(0.1, 100.0, 0.0).unwrap())],
        UncertaintyOptions::model_only(),
    );
    let r = line.evaluate(&water(), 0.02).unwrap();
    assert_eq!(r.elements[0].regime, Some(Regime::Turbulent));
    let b = &r.head_loss_band;
    assert!(common::rel_err(b.high / b.nominal, 1.10) < 1e-12, "{b:?}");
    assert!(common::rel_err(b.low / b.nominal, 0.90) < 1e-12);
    assert_eq!(b.dominant(), Some(&Source::FrictionModel));
    let fb = r.elements[0].friction_factor_band.as_ref().unwrap();
    assert!(common::rel_err(fb.high / fb.nominal, 1.10) < 1e-12);
}

#[test]
fn laminar_pipe_band_is_small() {
    // Exact Hagen–Poiseuille solution: only the small laminar allowance (±1 % at k = 2).
    let line = with_uncertainty(
        vec![Element::Pipe(Pipe::circular(0.01, 10.0, 1e-5).unwrap())],
        UncertaintyOptions::model_only(),
    );
    let r = line.evaluate(&water(), 1e-6).unwrap();
    assert_eq!(r.elements[0].regime, Some(Regime::Laminar));
    let b = &r.head_loss_band;
    assert!(common::rel_err(b.high / b.nominal, 1.01) < 1e-12, "{b:?}");
    // Roughness does not act in laminar flow.
    let all = Line::new(vec![Element::Pipe(
        Pipe::circular(0.01, 10.0, 1e-5).unwrap(),
    )])
    .unwrap();
    let r = all.evaluate(&water(), 1e-6).unwrap();
    assert!(
        r.head_loss_band
            .contributions
            .iter()
            .all(|c| c.source.kind() != "pipe_roughness")
    );
}

#[test]
fn transitional_band_spans_both_regimes() {
    // The band must reach both the laminar value 64/Re and the turbulent Colebrook value.
    let d = 0.05;
    let pipe = Pipe::circular(d, 20.0, 4.5e-5).unwrap();
    let line = with_uncertainty(vec![Element::Pipe(pipe)], UncertaintyOptions::model_only());
    let w = water();
    let q = 3000.0 * w.viscosity() / w.density() * std::f64::consts::PI * d / 4.0; // Re = 3000
    let r = line.evaluate(&w, q).unwrap();
    let e = &r.elements[0];
    assert_eq!(e.regime, Some(Regime::Transitional));
    let fb = e.friction_factor_band.as_ref().unwrap();
    let (fl, ft) = hydrograde::friction::transition_limits(
        e.reynolds.unwrap(),
        4.5e-5 / d,
        &Default::default(),
    )
    .unwrap();
    assert!(
        fb.low <= fl.min(ft) && fb.high >= fl.max(ft),
        "{fb:?} vs {fl} {ft}"
    );
}

#[test]
fn contributions_sum_to_one_and_bands_contain_nominal() {
    for (i, line) in varied_lines().iter().enumerate() {
        let (fluid, q) = (&line.1, line.2);
        let r = line.0.evaluate(fluid, q).unwrap();
        let mut bands = vec![
            &r.head_loss_band,
            &r.pressure_loss_band,
            &r.required_head_band,
        ];
        bands.extend(r.elements.iter().map(|e| &e.head_loss_band));
        bands.extend(
            r.elements
                .iter()
                .filter_map(|e| e.friction_factor_band.as_ref()),
        );
        for b in bands {
            assert!(b.low <= b.nominal && b.nominal <= b.high, "line {i}: {b:?}");
            if !b.contributions.is_empty() {
                let s: f64 = b.contributions.iter().map(|c| c.share).sum();
                assert!((s - 1.0).abs() < 1e-12, "line {i}: {s}");
                assert!(b.contributions.windows(2).all(|w| w[0].share >= w[1].share));
            }
        }
    }
}

/// Twenty varied lines: (line, fluid, flow).
fn varied_lines() -> Vec<(Line, Fluid, f64)> {
    let mut out = Vec::new();
    let temps = [278.15, 293.15, 313.15, 333.15, 353.15];
    for i in 0..20 {
        let t = temps[i % 5];
        let fluid = Fluid::water(t, 3e5).unwrap();
        let d1 = [0.025, 0.05, 0.08, 0.15][i % 4];
        let d2 = d1 * [1.0, 1.5, 0.8, 2.0][(i / 4) % 4];
        let eps = [0.0, 1.5e-6, 4.5e-5, 2.6e-4, 1e-3][i % 5];
        let mut els = vec![
            Element::Fitting(Fitting::from_tank(Edge::Square).unwrap()),
            Element::Pipe(Pipe::circular(d1, 20.0 + 15.0 * i as f64, eps).unwrap()),
            Element::Fitting(
                Fitting::named(
                    [
                        "elbow_90_standard",
                        "gate_valve",
                        "globe_valve",
                        "ball_valve",
                    ][i % 4],
                )
                .unwrap(),
            ),
        ];
        if d2 > d1 {
            els.push(Element::Fitting(Fitting::expansion(d1, d2).unwrap()));
        } else if d2 < d1 {
            els.push(Element::Fitting(Fitting::contraction(d1, d2).unwrap()));
        }
        els.push(Element::Pipe(Pipe::circular(d2, 40.0, eps * 2.0).unwrap()));
        if i % 3 == 0 {
            els.push(Element::Pipe(
                Pipe::new(Section::rectangle(d2, 0.5 * d2).unwrap(), 10.0, eps).unwrap(),
            ));
        }
        if i % 4 == 1 {
            els.push(Element::Equipment(
                Equipment::pressure_drop("filter", 2e4, 0.003).unwrap(),
            ));
        }
        els.push(Element::rise(3.0 * (i as f64 - 8.0)).unwrap());
        els.push(Element::Fitting(Fitting::into_tank()));
        let u = UncertaintyOptions::default()
            .with_diameter(if i % 2 == 0 { 0.005 } else { 0.0 })
            .unwrap();
        let line =
            Line::with_options(els, LineOptions::default().with_uncertainty(u).unwrap()).unwrap();
        // Velocities from 0.05 to 3 m/s in the first pipe.
        let v = [0.05, 0.3, 1.0, 2.0, 3.0][(i * 3) % 5];
        let q = v * std::f64::consts::PI * d1 * d1 / 4.0;
        out.push((line, fluid, q));
    }
    out
}

/// Cases where the first-order band is not expected to match Monte Carlo within 15 % of
/// the interval width: strongly non-linear (documented in core/src/band.rs).
const NON_LINEAR: &[usize] = &[];

#[test]
fn first_order_band_agrees_with_monte_carlo() {
    // Reference: Monte Carlo propagation of the same input distributions (JCGM 101:2008),
    // 20 000 seeded samples per line; agreement of both ends within 15 % of the width.
    for (i, (line, fluid, q)) in varied_lines().iter().enumerate() {
        let r = line.evaluate(fluid, *q).unwrap();
        let b = &r.required_head_band;
        let mc = monte_carlo(line, fluid, *q, 20_000, 1000 + i as u64).unwrap();
        let width = mc.high - mc.low;
        let dev = (b.low - mc.low).abs().max((b.high - mc.high).abs());
        println!(
            "line {i:2}: band [{:.4}, {:.4}] MC [{:.4}, {:.4}] dev/width {:.3} top {:?}",
            b.low,
            b.high,
            mc.low,
            mc.high,
            dev / width,
            b.dominant().map(|s| s.name())
        );
        if NON_LINEAR.contains(&i) {
            continue;
        }
        assert!(
            dev <= 0.15 * width,
            "line {i}: deviation {dev} of width {width}"
        );
    }
}
