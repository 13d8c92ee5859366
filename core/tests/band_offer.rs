//! The Monte Carlo interval offered with a band that flags itself non-linear
//! (`band::band_monte_carlo`): present exactly when the first-order band is flagged,
//! reproducible to the bit, and equal to `monte_carlo` with the documented seed and count.

use hydrograde::band::{
    BAND_MONTE_CARLO_SEED, MONTE_CARLO_SAMPLES, UncertaintyOptions, band_monte_carlo, monte_carlo,
};
use hydrograde::line::LineOptions;
use hydrograde::{Element, Fluid, Line, Pipe, Section};

fn water() -> Fluid {
    // Water at 20 °C with 2 % viscosity and 0.1 % density uncertainty (invented).
    Fluid::new(998.2, 1.002e-3)
        .unwrap()
        .with_uncertainty(0.001, 0.02)
        .unwrap()
}

#[test]
fn a_transitional_line_is_offered_the_monte_carlo_interval() {
    // 20 m of smooth 20 mm tube at Re = 3000, inside the transition 2300…4000 (common
    // practice), with a 3 % bore tolerance (invented): the band flags itself.
    let fluid = water();
    let nu = 1.002e-3 / 998.2;
    let d = 0.02;
    let flow = 3000.0 * nu * std::f64::consts::PI * d / 4.0; // Re = 4Q/(π d ν), exact
    let options = LineOptions::default()
        .with_uncertainty(UncertaintyOptions::default().with_diameter(0.03).unwrap())
        .unwrap();
    let line = Line::with_options(
        vec![Element::Pipe(Pipe::circular(d, 20.0, 0.0).unwrap())],
        options,
    )
    .unwrap();
    let band = line.evaluate(&fluid, flow).unwrap().required_head_band;
    assert!(band.non_linear, "{band:?}");
    let offered = band_monte_carlo(&line, &fluid, flow).unwrap().unwrap();
    // The documented run: the same seed and count give the same bits.
    let direct = monte_carlo(
        &line,
        &fluid,
        flow,
        MONTE_CARLO_SAMPLES,
        BAND_MONTE_CARLO_SEED,
    )
    .unwrap();
    assert_eq!(offered, direct);
    assert_eq!(band_monte_carlo(&line, &fluid, flow).unwrap(), Some(direct));
    assert_eq!(offered.samples, 20_000);
    // A 95 % interval around the nominal head: the nominal sits inside it (the inputs are
    // centred on their nominal values).
    assert!(
        offered.low < band.nominal && band.nominal < offered.high,
        "{offered:?}"
    );
    println!(
        "first-order [{:.6}, {:.6}] m, offered Monte Carlo [{:.6}, {:.6}] m",
        band.low, band.high, offered.low, offered.high
    );
}

#[test]
fn a_linear_band_is_offered_nothing() {
    // 100 m of 50 mm commercial steel at 3 L/s: Re ≈ 7.6e4, a band of about ±15 %
    // (core/tests/non_linear.rs): the first-order band stands.
    let line = Line::new(vec![Element::Pipe(
        Pipe::of_material(Section::circle(0.05).unwrap(), 100.0, "commercial_steel").unwrap(),
    )])
    .unwrap();
    let fluid = water();
    assert!(
        !line
            .evaluate(&fluid, 3e-3)
            .unwrap()
            .required_head_band
            .non_linear
    );
    assert_eq!(band_monte_carlo(&line, &fluid, 3e-3).unwrap(), None);
    // Bad flow: the evaluation's error, naming the flow.
    let e = band_monte_carlo(&line, &fluid, f64::NAN).unwrap_err();
    assert!(e.to_string().contains("flow"), "{e}");
}
