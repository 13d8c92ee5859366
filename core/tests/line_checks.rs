//! Gas compressibility, cavitation and grade-line checks of a line.

mod common;

use hydrograde::Warnings;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Line, LineOptions};
use hydrograde::pipe::Pipe;
use hydrograde::units::STANDARD_GRAVITY;

fn air_line() -> Line {
    Line::new(vec![Element::Pipe(
        Pipe::circular(0.02, 30.0, 1.5e-6).unwrap(),
    )])
    .unwrap()
}

#[test]
fn gas_warns_above_ten_percent_uses_mean_density_and_refuses_beyond_forty() {
    // Common practice: incompressible treatment within 10 % of the inlet pressure, at the
    // mean density up to 40 %, a compressible method beyond.
    let air = Fluid::air(293.15, 2e5).unwrap();
    let line = air_line();
    let small = line.evaluate(&air, 2e-3).unwrap();
    assert!(small.pressure_loss / 2e5 < 0.1, "{}", small.pressure_loss);
    assert!(!small.warnings.contains(Warnings::GAS_COMPRESSIBILITY));
    let mid = line.evaluate(&air, 1.1e-2).unwrap();
    let ratio = mid.pressure_loss / 2e5;
    assert!(ratio > 0.1 && ratio < 0.4, "{ratio}");
    assert!(mid.warnings.contains(Warnings::GAS_COMPRESSIBILITY));
    // Self-consistency (ideal gas, exact): the density used is the density at the mean pressure.
    let mean = air.at_pressure(2e5 - 0.5 * mid.pressure_loss).unwrap();
    assert!(
        common::rel_err(mid.density, mean.density()) < 1e-12,
        "{} vs {}",
        mid.density,
        mean.density()
    );
    let e = line.evaluate(&air, 2e-2).unwrap_err();
    assert!(e.to_string().contains("compressible"), "{e}");
}

#[test]
fn cavitation_warning_where_the_grade_line_falls_below_vapour_pressure() {
    // A suction line lifting 9.5 m from a tank at atmospheric pressure: the static pressure
    // at the top falls below the vapour pressure of water at 60 °C (about 19.9 kPa, IAPWS-IF97).
    let water = Fluid::water(333.15, 101_325.0).unwrap();
    let opts = LineOptions::default()
        .with_inlet_pressure(Some(101_325.0))
        .unwrap();
    let line = Line::with_options(
        vec![
            Element::Pipe(Pipe::circular(0.05, 5.0, 4.5e-5).unwrap()),
            Element::rise(9.5).unwrap(),
            Element::Pipe(Pipe::circular(0.05, 5.0, 4.5e-5).unwrap()),
        ],
        opts,
    )
    .unwrap();
    let r = line.evaluate(&water, 4e-3).unwrap();
    assert!(r.warnings.contains(Warnings::BELOW_VAPOUR_PRESSURE));
    assert!(
        r.elements[1]
            .warnings
            .contains(Warnings::BELOW_VAPOUR_PRESSURE)
    );
    assert!(
        !r.elements[0]
            .warnings
            .contains(Warnings::BELOW_VAPOUR_PRESSURE)
    );
    // Energy balance along a constant bore (exact): p_out = p_in − ρ g (Σ losses + rises).
    let expect = 101_325.0 - water.density() * STANDARD_GRAVITY * r.required_head;
    assert!(common::rel_err(r.outlet_pressure.unwrap(), expect) < 1e-12);
    // A gentle flow with a small lift does not warn.
    let calm = line.evaluate(&water, 1e-4).unwrap();
    let low = Line::with_options(
        vec![
            Element::Pipe(Pipe::circular(0.05, 5.0, 4.5e-5).unwrap()),
            Element::rise(2.0).unwrap(),
        ],
        LineOptions::default()
            .with_inlet_pressure(Some(101_325.0))
            .unwrap(),
    )
    .unwrap();
    assert!(
        !low.evaluate(&water, 1e-4)
            .unwrap()
            .warnings
            .contains(Warnings::BELOW_VAPOUR_PRESSURE)
    );
    assert!(calm.outlet_pressure.is_some());
}

#[test]
fn no_grade_line_without_an_inlet_pressure_for_a_liquid() {
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    let line = Line::new(vec![Element::Pipe(
        Pipe::circular(0.05, 5.0, 4.5e-5).unwrap(),
    )])
    .unwrap();
    let r = line.evaluate(&water, 1e-3).unwrap();
    assert!(r.outlet_pressure.is_none() && r.elements[0].pressure_out.is_none());
    assert!(
        line.evaluate_at(&water, 1e-3, Some(-5.0))
            .unwrap_err()
            .to_string()
            .starts_with("inlet_pressure = -5")
    );
}

mod properties {
    use super::common;
    use hydrograde::fitting::Fitting;
    use hydrograde::fluid::Fluid;
    use hydrograde::line::{Element, Line};
    use hydrograde::pipe::Pipe;
    use proptest::prelude::*;

    fn line(d1: f64, d2: f64, eps: f64, k: f64, rise: f64) -> Line {
        Line::new(vec![
            Element::Pipe(Pipe::circular(d1, 25.0, eps).unwrap()),
            Element::Fitting(Fitting::k(k).unwrap()),
            Element::Fitting(Fitting::three_k(500.0, 0.2, 4.0).unwrap()),
            Element::Pipe(Pipe::circular(d2, 40.0, eps).unwrap()),
            Element::rise(rise).unwrap(),
        ])
        .unwrap()
    }

    proptest! {
        #![proptest_config(ProptestConfig::with_cases(256))]

        // Exact properties of the Darcy–Weisbach line: with one bore throughout the loss
        // is odd in the flow; it rises strictly with the flow and the analytic slope
        // matches a central difference (also across the implied change of bore, whose
        // K depends on the direction).
        #[test]
        fn loss_is_odd_monotone_and_its_slope_is_right(
            d1 in 0.01f64..0.3, d2 in 0.01f64..0.3, lg_eps in -7.0f64..-3.0, k in 0.0f64..10.0,
            rise in -20.0f64..20.0, lg_q in -7.0f64..-0.5, step in 1e-4f64..0.3,
        ) {
            let l = line(d1, d2, 10f64.powf(lg_eps), k, rise);
            let w = Fluid::new(998.0, 1.0e-3).unwrap();
            let q = 10f64.powf(lg_q);
            let same = line(d1, d1, 10f64.powf(lg_eps), k, rise);
            let a = same.evaluate(&w, q).unwrap();
            let b = same.evaluate(&w, -q).unwrap();
            prop_assert!(common::rel_err(a.head_loss, -b.head_loss) < 1e-14);
            let a = l.evaluate(&w, q).unwrap();
            let c = l.evaluate(&w, q * (1.0 + step)).unwrap();
            prop_assert!(c.head_loss > a.head_loss);
            let h = 1e-6 * q;
            let fd = (l.evaluate(&w, q + h).unwrap().head_loss - l.evaluate(&w, q - h).unwrap().head_loss) / (2.0 * h);
            prop_assert!(common::rel_err(a.drequired_head_dflow, fd) < 1e-5, "{} vs {}", a.drequired_head_dflow, fd);
        }
    }
}

#[test]
fn fitting_after_a_rectangular_duct_sees_the_duct_velocity() {
    // Exact definition of K: h = K V²/(2g) with V = Q/A the mean velocity of the duct the
    // fitting sits in (not of a round bore of the hydraulic diameter).
    use hydrograde::fitting::Fitting;
    use hydrograde::section::Section;
    let duct = Section::rectangle(0.4, 0.25).unwrap();
    let line = Line::new(vec![
        Element::Pipe(Pipe::new(duct, 5.0, 1.5e-4).unwrap()),
        Element::Fitting(Fitting::k(0.8).unwrap()),
    ])
    .unwrap();
    // Constant density (no gas mean-density correction) so V is exactly Q/A.
    let fluid = Fluid::new(1.165, 1.86e-5).unwrap();
    let r = line.evaluate(&fluid, 0.9).unwrap();
    let v = 0.9 / (0.4 * 0.25);
    assert!(common::rel_err(r.elements[1].velocity.unwrap(), v) < 1e-15);
    let h = 0.8 * v * v / (2.0 * STANDARD_GRAVITY);
    assert!(
        common::rel_err(r.elements[1].head_loss, h) < 1e-14,
        "{} vs {h}",
        r.elements[1].head_loss
    );
}

#[test]
fn contraction_between_rectangular_ducts_uses_the_outlet_duct_velocity() {
    // K of a contraction refers to the outlet velocity (Crane 1988, from memory); between
    // rectangular ducts given by their hydraulic diameters that is the outlet duct's Q/A.
    use hydrograde::fitting::Fitting;
    use hydrograde::section::Section;
    let (big, small) = (
        Section::rectangle(0.4, 0.25).unwrap(),
        Section::rectangle(0.3, 0.2).unwrap(),
    );
    let (d1, d2) = (big.hydraulic_diameter(), small.hydraulic_diameter());
    let line = Line::new(vec![
        Element::Pipe(Pipe::new(big, 5.0, 1.5e-4).unwrap()),
        Element::Fitting(Fitting::contraction(d1, d2).unwrap()),
        Element::Pipe(Pipe::new(small, 5.0, 1.5e-4).unwrap()),
    ])
    .unwrap();
    let r = line
        .evaluate(&Fluid::new(1.165, 1.86e-5).unwrap(), 0.9)
        .unwrap();
    assert!(common::rel_err(r.elements[1].velocity.unwrap(), 0.9 / (0.3 * 0.2)) < 1e-15);
}
