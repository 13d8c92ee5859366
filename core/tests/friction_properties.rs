//! Physics of the friction factor as properties: derivatives, monotonicity, limits and the
//! continuity of the transitional blend.

mod common;

use hydrograde::friction::{Correlation, Options, Regime, Transition, darcy_factor};
use proptest::prelude::*;

/// Central finite difference of g at x with a relative step h.
fn central(g: impl Fn(f64) -> f64, x: f64, h: f64) -> f64 {
    let dx = h * x.abs().max(1e-300);
    (g(x + dx) - g(x - dx)) / (2.0 * dx)
}

#[test]
fn derivatives_match_central_differences() {
    // Reference: central finite differences (truncation O(h²), h = 1e-6 relative).
    for corr in Correlation::ALL {
        let o = Options::with_correlation(corr);
        for &re in &[500.0, 1500.0, 2500.0, 3000.0, 3900.0, 5e3, 1e5, 1e7] {
            for &rr in &[0.0, 1e-5, 1e-3, 3e-2] {
                if corr == Correlation::FullyRough && rr == 0.0 {
                    continue;
                }
                let fr = darcy_factor(re, rr, &o).unwrap();
                let fd_re = central(|x| darcy_factor(x, rr, &o).unwrap().f, re, 1e-6);
                assert!(
                    (fr.df_dre - fd_re).abs() <= 1e-5 * fd_re.abs() + 1e-14,
                    "{corr} re {re} rr {rr}: {} vs {fd_re}",
                    fr.df_dre
                );
                if rr > 0.0 {
                    let fd_rr = central(|x| darcy_factor(re, x, &o).unwrap().f, rr, 1e-6);
                    assert!(
                        (fr.df_drel_roughness - fd_rr).abs() <= 1e-5 * fd_rr.abs() + 1e-9 * fr.f,
                        "{corr} re {re} rr {rr}: {} vs {fd_rr}",
                        fr.df_drel_roughness
                    );
                }
            }
        }
    }
}

#[test]
fn blend_is_c1_at_both_limits() {
    // Exact analytical property of the smoothstep weight: value and slope match the
    // laminar law at Re = 2300 and the turbulent correlation at Re = 4000.
    let o = Options::default();
    let turb = Options {
        transition: Transition::Turbulent,
        ..o
    };
    for &rr in &[0.0, 1e-4, 1e-2] {
        let at = |re: f64, opts: &Options| darcy_factor(re, rr, opts).unwrap();
        let (lo, hi) = (o.laminar_limit, o.turbulent_limit);
        let eps = 1e-9;
        // Laminar side.
        let below = at(lo * (1.0 - eps), &o);
        let above = at(lo * (1.0 + eps), &o);
        assert!(common::rel_err(above.f, below.f) < 1e-8);
        assert!(common::rel_err(above.df_dre, below.df_dre) < 1e-6);
        // Turbulent side.
        let below = at(hi * (1.0 - eps), &o);
        let above = at(hi * (1.0 + eps), &o);
        assert_eq!(above.regime, Regime::Turbulent);
        assert!(common::rel_err(above.f, below.f) < 1e-8);
        assert!(common::rel_err(above.df_dre, below.df_dre) < 1e-6);
        // Inside the band the blend lies between the laminar value and the turbulent option's.
        let mid = at(3000.0, &o).f;
        let (l, t): (f64, f64) = (64.0 / 3000.0, at(3000.0, &turb).f);
        assert!(mid > l.min(t) && mid < l.max(t));
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(512))]

    // Colebrook (1939): in a smooth pipe f falls as Re grows.
    #[test]
    fn smooth_turbulent_f_falls_with_re(lg in 3.61f64..8.99, step in 1e-3f64..0.5) {
        let o = Options::default();
        let a = darcy_factor(10f64.powf(lg), 0.0, &o).unwrap().f;
        let b = darcy_factor(10f64.powf(lg + step), 0.0, &o).unwrap().f;
        prop_assert!(b < a);
    }

    // Colebrook (1939): at fixed Re a rougher wall gives a larger f.
    #[test]
    fn f_rises_with_roughness(lg_re in 3.61f64..9.0, lg_rr in -7.0f64..-1.5, step in 1e-3f64..0.5) {
        for corr in [Correlation::Colebrook, Correlation::Haaland, Correlation::SwameeJain,
                     Correlation::Churchill, Correlation::Serghides, Correlation::FullyRough] {
            let o = Options::with_correlation(corr);
            let re = 10f64.powf(lg_re);
            let a = darcy_factor(re, 10f64.powf(lg_rr), &o).unwrap().f;
            let b = darcy_factor(re, 10f64.powf(lg_rr + step), &o).unwrap().f;
            prop_assert!(b > a, "{} {} {}", corr, a, b);
        }
    }

    // Exact analytical solution (Hagen–Poiseuille): laminar f = 64/Re whatever the wall.
    #[test]
    fn laminar_f_ignores_roughness(re in 1.0f64..2299.0, rr in 0.0f64..0.5) {
        let o = Options::default();
        let fr = darcy_factor(re, rr, &o).unwrap();
        prop_assert_eq!(fr.regime, Regime::Laminar);
        prop_assert_eq!(fr.f, 64.0 / re);
        prop_assert_eq!(fr.f, darcy_factor(re, 0.0, &o).unwrap().f);
    }

    // Nikuradse (1933): at very high Re a rough wall's f no longer depends on Re.
    #[test]
    fn fully_rough_f_independent_of_re(lg_rr in -3.0f64..-1.0, lg_re in 11.0f64..12.5) {
        let o = Options::default();
        let rr = 10f64.powf(lg_rr);
        let a = darcy_factor(10f64.powf(lg_re), rr, &o).unwrap().f;
        let b = darcy_factor(10f64.powf(lg_re + 0.5), rr, &o).unwrap().f;
        prop_assert!(common::rel_err(a, b) < 1e-5);
    }

    // The C¹ blend: f is continuous and monotone across the transitional band for a smooth pipe
    // (laminar 64/Re and smooth Colebrook both fall with Re; the blend rises from one to the
    // other only where the turbulent value is larger, so check continuity by small steps).
    #[test]
    fn blend_is_continuous(re in 2300.0f64..4000.0, rr in 0.0f64..0.05) {
        let o = Options::default();
        let h = 1e-7 * re;
        let a = darcy_factor(re, rr, &o).unwrap();
        let b = darcy_factor(re + h, rr, &o).unwrap();
        prop_assert!((b.f - a.f).abs() <= 2.0 * h * a.df_dre.abs().max(b.df_dre.abs()) + 1e-15);
    }
}
