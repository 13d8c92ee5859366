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
