//! Every result finite or an error: regression tests for the extreme but finite inputs
//! the C fuzz found returning inf or NaN (tests/fuzz/known_capi_findings.txt). Each case
//! either gives a finite, self-consistent answer or an error that names the caller's
//! parameter (a flow, a velocity, a total), never an internal Reynolds number the caller
//! did not give.

mod common;

use common::rel_err;
use hydrograde::band::monte_carlo;
use hydrograde::friction::{self, MIN_REYNOLDS, darcy_factor_batch, transition_limits};
use hydrograde::line::split_flow;
use hydrograde::{
    Correlation, Element, ErrorKind, Fitting, Fluid, Line, Options, Pipe, Regime, darcy_factor,
};

fn water() -> Fluid {
    Fluid::new(998.0, 1.0e-3).unwrap()
}

fn assert_finite(values: &[f64], what: &str) {
    assert!(values.iter().all(|v| v.is_finite()), "{what}: {values:?}");
}

#[test]
fn smallest_reynolds_numbers_are_refused_by_name() {
    let subnormal = 4.9e-324;
    for corr in Correlation::ALL {
        let e = darcy_factor(subnormal, 1e-3, &Options::with_correlation(corr)).unwrap_err();
        assert_eq!(e.kind(), ErrorKind::OutOfRange);
        assert!(e.to_string().starts_with("re = "), "{e}");
        assert!(e.to_string().contains("at least 1e-100"), "{e}");
    }
    let e = transition_limits(1e-310, 0.0, &Options::default()).unwrap_err();
    assert!(e.to_string().starts_with("re = "), "{e}");
    // The batch reports the element at fault.
    let mut out = [0.0; 3];
    let e = darcy_factor_batch(
        &[1e5, 1e-200, 1e5],
        &[0.0; 3],
        &Options::default(),
        &mut out,
    )
    .unwrap_err();
    assert!(e.to_string().starts_with("element 1: re = "), "{e}");
}

#[test]
fn laminar_at_the_smallest_reynolds_number_is_finite_and_exact() {
    // Exact analytical solution: Hagen–Poiseuille, f = 64/Re, df/dRe = −64/Re².
    for corr in Correlation::ALL {
        if corr == Correlation::FullyRough {
            continue;
        }
        let fr = darcy_factor(MIN_REYNOLDS, 1e-3, &Options::with_correlation(corr)).unwrap();
        assert_eq!(fr.regime, Regime::Laminar);
        assert!(
            rel_err(fr.f, 64.0 / MIN_REYNOLDS) < 1e-15,
            "{corr}: {}",
            fr.f
        );
        assert!(rel_err(fr.df_dre, -64.0 / (MIN_REYNOLDS * MIN_REYNOLDS)) < 1e-15);
        assert_finite(&[fr.df_drel_roughness], "df/d(ε/D)");
    }
}

#[test]
fn churchill_at_tiny_reynolds_is_the_laminar_law_with_a_finite_slope() {
    // Churchill (1977): the formula tends to 64/Re as Re → 0 (its laminar term); at
    // Re 1e-25 its turbulent terms overflowed and the slope came out NaN.
    let o = Options::with_correlation(Correlation::Churchill);
    for re in [1e-25, 1e-3, 0.5] {
        let fr = darcy_factor(re, 0.05, &o).unwrap();
        assert!(rel_err(fr.f, 64.0 / re) < 1e-15, "re {re}: {}", fr.f);
        assert!(rel_err(fr.df_dre, -64.0 / (re * re)) < 1e-15, "re {re}");
        assert_eq!(fr.df_drel_roughness, 0.0);
    }
    // Just above the switch the formula itself runs, still the laminar law to 1e-15
    // (its turbulent terms are below 1e-100 of the laminar one at Re = 1).
    let fr = darcy_factor(1.0, 0.05, &o).unwrap();
    assert!(rel_err(fr.f, 64.0) < 1e-15, "{}", fr.f);
    assert_finite(&[fr.df_dre, fr.df_drel_roughness], "slopes at Re 1");
}

#[test]
fn options_and_fully_rough_inputs_that_overflow_are_refused() {
    let huge_c = Options {
        laminar_constant: 1e300,
        ..Options::default()
    };
    let e = darcy_factor(1e3, 0.0, &huge_c).unwrap_err();
    assert!(e.to_string().starts_with("laminar_constant = 1e300"), "{e}");
    let o = Options::with_correlation(Correlation::FullyRough);
    let e = darcy_factor(1e6, 1e-310, &o).unwrap_err();
    assert!(e.to_string().starts_with("rel_roughness = "), "{e}");
    // At the smallest accepted ε/D the law and its slope are finite.
    let fr = darcy_factor(1e6, 1e-100, &o).unwrap();
    assert_finite(&[fr.f, fr.df_dre, fr.df_drel_roughness], "fully rough");
}

#[test]
fn a_pipe_names_the_flow_not_the_reynolds_number() {
    let p = Pipe::circular(0.05, 100.0, 4.5e-5).unwrap();
    let e = p.head_loss(&water(), 1e300).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(
        e.to_string()
            .starts_with("flow = 1e300: gives Reynolds number"),
        "{e}"
    );
    let e = p.head_loss(&water(), -1e12).unwrap_err();
    assert!(e.to_string().starts_with("flow = -1000000000000:"), "{e}");
}

#[test]
fn a_pipe_at_a_subnormal_flow_gives_the_exact_laminar_loss() {
    // Exact analytical solution: h = 128 μ L Q / (π ρ g D⁴) (Hagen–Poiseuille).
    let p = Pipe::circular(0.05, 100.0, 4.5e-5).unwrap();
    for q in [1e-320, 1e-200, 1e-60] {
        let (h, d) = p.head_loss(&water(), q).unwrap();
        let slope = 128.0 * 1e-3 * 100.0
            / (std::f64::consts::PI * 998.0 * hydrograde::STANDARD_GRAVITY * 0.05f64.powi(4));
        assert!(rel_err(d, slope) < 1e-14, "q {q}: {d}");
        assert!(h.is_finite() && h >= 0.0, "q {q}: {h}");
    }
    // Below the smallest Reynolds number the factor is undefined, as at zero flow.
    let s = p
        .flow_state(
            &water(),
            1e-320,
            &Options::default(),
            hydrograde::TurbulentDiameter::Hydraulic,
        )
        .unwrap();
    assert!(s.friction_factor.is_nan());
    assert_eq!(s.df_dre, 0.0);
}

#[test]
fn a_reynolds_number_that_overflows_names_the_velocity() {
    let e = water().reynolds(1e300, 1e300).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(e.to_string().starts_with("velocity = 1e300"), "{e}");
}

#[test]
fn fitting_k_is_finite_or_refused() {
    let f =
        Fitting::named("gate valve open").unwrap_or_else(|_| Fitting::two_k(500.0, 0.25).unwrap());
    let e = f.k_at(4.9e-324, 0.05, 1e-3).unwrap_err();
    assert!(e.to_string().starts_with("re = "), "{e}");
    let two_k = Fitting::two_k(1e300, 0.25).unwrap();
    let e = two_k.k_at(1e-10, 0.05, 1e-3).unwrap_err();
    assert!(e.to_string().contains("not a finite number"), "{e}");
    // 2-K (Hooper 1981): K = k1/Re + k_inf (1 + 1/D_in); at Re 1e-100 the viscous term
    // alone is 500e100.
    let (k, dk) = Fitting::two_k(500.0, 0.25)
        .unwrap()
        .k_at(1e-100, 0.05, 1e-3)
        .unwrap();
    assert!(rel_err(k, 5e102) < 1e-12, "{k}");
    assert!(dk.is_finite());
}

fn fittings_only() -> Line {
    Line::new(vec![
        Element::Fitting(Fitting::k_referred(2.0, 0.05).unwrap()),
        Element::Fitting(Fitting::k_referred(0.5, 0.05).unwrap()),
    ])
    .unwrap()
}

fn one_pipe() -> Line {
    Line::new(vec![Element::Pipe(
        Pipe::circular(0.05, 30.0, 4.5e-5).unwrap(),
    )])
    .unwrap()
}

#[test]
fn a_line_names_the_flow_when_its_losses_overflow() {
    for line in [one_pipe(), fittings_only()] {
        let e = line.required_head(&water(), 1e300).unwrap_err();
        assert!(e.to_string().starts_with("flow = 1e300"), "{e}");
        let e = line.system_curve(&water(), &[1e-3, 1e300]).unwrap_err();
        assert!(e.to_string().starts_with("element 1: flow = 1e300"), "{e}");
    }
    // K beyond its bound is refused where it is built; at the bound a line still
    // solves consistently (common practice: the solved flow gives back the head).
    let e = Fitting::k(1e300).unwrap_err();
    assert!(e.to_string().starts_with("k = 1e300"), "{e}");
    let steep = Line::new(vec![Element::Fitting(
        Fitting::k_referred(hydrograde::fitting::MAX_K, 0.05).unwrap(),
    )])
    .unwrap();
    let s = steep.flow_for_head(&water(), 10.0).unwrap();
    let (h, _) = steep.required_head(&water(), s.flow).unwrap();
    assert!(rel_err(h, 10.0) < 1e-12, "{h}");
}

#[test]
fn split_at_zero_total_through_branches_without_pipe_is_zero_flow_at_the_static_head() {
    // Exact: with no flow no branch loses head, so the common head is the static head
    // (0 here) and every branch carries nothing.
    let water = water();
    for branches in [
        vec![fittings_only(), fittings_only()],
        vec![fittings_only(), one_pipe()],
    ] {
        let s = split_flow(&branches, &water, 0.0).unwrap();
        assert_eq!(s.head, 0.0);
        assert!(s.flows.iter().all(|&q| q == 0.0), "{:?}", s.flows);
        assert_finite(&[s.head_band.low, s.head_band.high], "head band");
    }
    // And a small total still splits (both branches' slopes vanish only at zero).
    let s = split_flow(&[fittings_only(), fittings_only()], &water, 1e-3).unwrap();
    assert!(rel_err(s.flows[0], 5e-4) < 1e-9, "{:?}", s.flows);
}

#[test]
fn monte_carlo_at_an_overflowing_flow_is_an_error_naming_the_flow() {
    let e = monte_carlo(&one_pipe(), &water(), 1e300, 200, 1).unwrap_err();
    assert!(e.to_string().starts_with("flow = 1e300"), "{e}");
    let mc = monte_carlo(&one_pipe(), &water(), 1e-3, 200, 1).unwrap();
    assert_finite(&[mc.mean, mc.std_dev, mc.low, mc.high], "monte carlo");
}

#[test]
fn the_friction_module_constants_are_what_the_docs_say() {
    // Exact: the documented bounds (a changed bound must change the docs too).
    assert_eq!(friction::MIN_REYNOLDS, 1e-100);
    assert_eq!(friction::MAX_LAMINAR_CONSTANT, 1e4);
}

#[test]
fn flow_for_an_unreachable_head_names_the_head() {
    // A head of 1e300 m needs a flow far beyond what any pipe carries: the error names the
    // head the caller gave, not a trial flow or a Reynolds number.
    let e = one_pipe().flow_for_head(&water(), 1e300).unwrap_err();
    assert!(
        e.to_string().starts_with("head = 1e300") || e.to_string().contains("head 1e300"),
        "{e}"
    );
}
