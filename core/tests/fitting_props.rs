//! Property tests of hydrograde::fitting: physics that must hold for any valid input.

use hydrograde::fitting::{Fitting, head_loss};
use proptest::prelude::*;

mod common;
use common::rel_err;

proptest! {
    // 2-K (Hooper 1981) and 3-K (Darby 2001) with K1 ≥ 0: K never rises with Re
    #[test]
    fn k_non_increasing_in_re(
        k1 in 0.0..3000.0f64, k_inf in 0.0..5.0f64, k_d in 0.0..5.0f64,
        bore in 0.005..2.0f64, re in 1.0..1e8f64, step in 1.0001..10.0f64,
    ) {
        for f in [Fitting::two_k(k1, k_inf).unwrap(), Fitting::three_k(k1, k_inf, k_d).unwrap()] {
            let (ka, da) = f.k_at(re, bore, 0.0).unwrap();
            let (kb, _) = f.k_at(re * step, bore, 0.0).unwrap();
            prop_assert!(kb <= ka);
            prop_assert!(da <= 0.0);
        }
    }

    // ∂K/∂Re agrees with a central difference (the derivative is exact: −K1/Re²)
    #[test]
    fn dk_dre_matches_finite_difference(
        k1 in 100.0..3000.0f64, k_inf in 0.0..5.0f64, k_d in 0.0..5.0f64,
        bore in 0.005..2.0f64, re in 10.0..1e4f64,
    ) {
        // Re/K1 ≤ 100 keeps the difference of K values well above rounding
        let f = Fitting::three_k(k1, k_inf, k_d).unwrap();
        let h = re * 1e-5;
        let (kp, _) = f.k_at(re + h, bore, 0.0).unwrap();
        let (km, _) = f.k_at(re - h, bore, 0.0).unwrap();
        let (_, dk) = f.k_at(re, bore, 0.0).unwrap();
        prop_assert!(rel_err((kp - km) / (2.0 * h), dk) < 1e-5);
    }

    // Borda–Carnot, exact from the momentum balance: h = (V1 − V2)²/2g for any diameters
    #[test]
    fn expansion_loss_is_velocity_difference_head(
        d1 in 0.001..2.0f64, ratio in 1.001..20.0f64, v1 in -30.0..30.0f64,
    ) {
        let d2 = d1 * ratio;
        let f = Fitting::expansion(d1, d2).unwrap();
        let v2 = v1 * (d1 / d2).powi(2);
        let exact = (v1 - v2) * (v1 - v2).abs() / (2.0 * 9.80665);
        let k = f.resistance(d1, 0.0).unwrap().k_inertial;
        prop_assert!((head_loss(k, v1) - exact).abs() <= 1e-13 * exact.abs().max(1e-300));
        // the same loss written on the outlet velocity
        let k2 = f.resistance(d2, 0.0).unwrap().k_inertial;
        prop_assert!((head_loss(k2, v2) - exact).abs() <= 1e-12 * exact.abs().max(1e-300));
    }

    // Continuity: K at bore d2 = K at d1 · (d2/d1)⁴ (exact)
    #[test]
    fn k_referred_scales_with_fourth_power(
        k in 0.0..100.0f64, d1 in 0.001..2.0f64, d2 in 0.001..2.0f64,
    ) {
        let f = Fitting::k_referred(k, d1).unwrap();
        let got = f.resistance(d2, 0.0).unwrap().k_inertial;
        prop_assert!((got - k * (d2 / d1).powi(4)).abs() <= 1e-13 * k * (d2 / d1).powi(4) + 1e-300);
        // and a Cv valve's K follows the same rule whatever bore it is written on
        let c = Fitting::cv(37.0).unwrap();
        let (c1, c2) = (c.resistance(d1, 0.0).unwrap(), c.resistance(d2, 0.0).unwrap());
        prop_assert!(rel_err(c2.k_inertial, c1.k_inertial * (d2 / d1).powi(4)) < 1e-12);
    }

    // A 3-K fitting with its own bore: the loss at a given flow does not depend on the
    // bore the caller writes it on (velocity and Re both follow continuity)
    #[test]
    fn referred_loss_is_invariant(
        d_fit in 0.01..1.0f64, bore in 0.01..1.0f64, q in 1e-5..1.0f64, nu in 1e-7..1e-4f64,
    ) {
        let f = Fitting::named("diaphragm_valve").unwrap().with_diameter(d_fit).unwrap();
        let loss = |b: f64| {
            let v = q / (std::f64::consts::PI / 4.0 * b * b);
            let (k, _) = f.k_at(v * b / nu, b, 0.0).unwrap();
            head_loss(k, v)
        };
        prop_assert!(rel_err(loss(bore), loss(d_fit)) < 1e-12);
    }

    // Head loss is odd in velocity (reverse flow gives a negative loss)
    #[test]
    fn head_loss_is_odd(k in 0.0..50.0f64, v in -50.0..50.0f64) {
        prop_assert_eq!(head_loss(k, -v), -head_loss(k, v));
    }
}
