//! Values typed in the wrong unit warn with the likely intended unit; valid engineering
//! values pass without a word. Each scenario is written out with its arithmetic.

use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Equipment, Line, LineResult};
use hydrograde::pipe::Pipe;
use hydrograde::warning::Warnings;
use std::f64::consts::PI;

fn water() -> Fluid {
    Fluid::new(998.2, 1.002e-3).unwrap()
}

fn pipe(d: f64, length: f64) -> Element {
    Element::Pipe(Pipe::circular(d, length, 4.5e-5).unwrap())
}

fn says(r: &LineResult, w: Warnings, text: &str) {
    assert!(r.warnings.contains(w), "{:?} not in {:?}", w, r.warnings);
    assert!(
        r.messages.iter().any(|m| m.contains(text)),
        "no message with {text:?}: {:#?}",
        r.messages
    );
}

const SLIPS: Warnings = Warnings::IMPLAUSIBLE_VELOCITY
    .union(Warnings::IMPLAUSIBLE_BORE)
    .union(Warnings::IMPLAUSIBLE_LENGTH)
    .union(Warnings::IMPLAUSIBLE_RATED_DROP)
    .union(Warnings::IMPLAUSIBLE_VISCOSITY);

fn no_slip(r: &LineResult) {
    let slips = Warnings::from_bits_truncate(r.warnings.bits() & SLIPS.bits());
    assert!(slips.is_empty(), "{:?}: {:#?}", slips, r.messages);
}

#[test]
fn a_bore_in_millimetres_typed_as_metres() {
    // 47.5 m of bore: 47.5 mm / 1000 = 0.0475 m is what was meant (SI prefix, exact).
    let r = Line::new(vec![pipe(47.5, 100.0)])
        .unwrap()
        .evaluate(&water(), 4.5e-3)
        .unwrap();
    says(&r, Warnings::IMPLAUSIBLE_BORE, "bore 47.5 m");
    says(&r, Warnings::IMPLAUSIBLE_BORE, "47.5 mm is 0.0475 m");
    // 1.5 mm of bore, under the 2 mm of the smallest tubing (common practice).
    let r = Line::new(vec![pipe(0.0015, 1.0)])
        .unwrap()
        .evaluate(&water(), 1e-6)
        .unwrap();
    says(&r, Warnings::IMPLAUSIBLE_BORE, "(1.5 mm) is under 2 mm");
}

#[test]
fn a_flow_in_litres_per_second_typed_as_cubic_metres() {
    // 4.5 m³/s in a 50 mm bore: V = 4Q/(πd²) = 4·4.5/(π·0.0025) ≈ 2292 m/s (definition),
    // far over 15 m/s for a liquid (common practice); 4.5 L/s = 0.0045 m³/s.
    let line = Line::new(vec![pipe(0.05, 100.0)]).unwrap();
    let r = line.evaluate(&water(), 4.5).unwrap();
    let v = 4.0 * 4.5 / (PI * 0.05 * 0.05);
    assert!((v - 2291.83).abs() < 0.01);
    says(
        &r,
        Warnings::IMPLAUSIBLE_VELOCITY,
        "in element 0 is over 15 m/s",
    );
    says(&r, Warnings::IMPLAUSIBLE_VELOCITY, "4.5 L/s is 0.0045 m³/s");
    assert!(
        r.elements[0]
            .warnings
            .contains(Warnings::IMPLAUSIBLE_VELOCITY)
    );
    // The same flow in L/s, 4.5e-3 m³/s: V = 2.29 m/s, an ordinary design velocity.
    no_slip(&line.evaluate(&water(), 4.5e-3).unwrap());
    // Reverse flow is judged by its size.
    says(
        &line.evaluate(&water(), -4.5).unwrap(),
        Warnings::IMPLAUSIBLE_VELOCITY,
        "-4.5 L/s",
    );
}

#[test]
fn gas_velocity_limit_is_80_m_per_s() {
    // Air in a 0.2 m duct: V = 4Q/(πd²). 2 m³/s → 63.7 m/s passes; 3 m³/s → 95.5 m/s warns.
    let air = Fluid::air(293.15, 101_325.0).unwrap();
    let line = Line::new(vec![pipe(0.2, 10.0)]).unwrap();
    no_slip(&line.evaluate(&air, 2.0).unwrap());
    says(
        &line.evaluate(&air, 3.0).unwrap(),
        Warnings::IMPLAUSIBLE_VELOCITY,
        "is over 80 m/s",
    );
}

#[test]
fn a_rated_drop_in_bar_typed_as_pascal() {
    // 1.5 Pa across a filter: 1.5 bar = 1.5e5 Pa (1 bar = 1e5 Pa exactly, NIST SP 811).
    let filter = Equipment::pressure_drop("filter", 1.5, 0.005).unwrap();
    let r = Line::new(vec![pipe(0.05, 10.0), Element::Equipment(filter)])
        .unwrap()
        .evaluate(&water(), 0.005)
        .unwrap();
    says(&r, Warnings::IMPLAUSIBLE_RATED_DROP, "element 1 (filter)");
    says(&r, Warnings::IMPLAUSIBLE_RATED_DROP, "1.5 bar is 150000 Pa");
    // 1.5 bar typed in Pa passes.
    let filter = Equipment::pressure_drop("filter", 1.5e5, 0.005).unwrap();
    no_slip(
        &Line::new(vec![pipe(0.05, 10.0), Element::Equipment(filter)])
            .unwrap()
            .evaluate(&water(), 0.005)
            .unwrap(),
    );
}

#[test]
fn a_viscosity_in_centipoise_typed_as_pascal_seconds() {
    // Water-like density with 0.377 "Pa·s": 0.377 cP = 0.000377 Pa·s (1 cP = 1e-3 Pa·s,
    // NIST SP 811) is what water at about 75 °C has (from memory).
    let line = Line::new(vec![pipe(0.05, 10.0)]).unwrap();
    let slip = Fluid::new(975.0, 0.377).unwrap();
    says(
        &line.evaluate(&slip, 1e-3).unwrap(),
        Warnings::IMPLAUSIBLE_VISCOSITY,
        "0.377 cP is 0.000377 Pa·s",
    );
    // A light liquid over 1 Pa·s: 2.5 Pa·s at 880 kg/m³.
    let slip = Fluid::new(880.0, 2.5).unwrap();
    says(
        &line.evaluate(&slip, 1e-3).unwrap(),
        Warnings::IMPLAUSIBLE_VISCOSITY,
        "viscosity 2.5 Pa·s",
    );
    // Valid values pass: a lubricating oil of 0.377 Pa·s at 880 kg/m³, glycerine of
    // about 1.4 Pa·s at 1260 kg/m³ (from memory).
    for (rho, mu) in [(880.0, 0.377), (1260.0, 1.41)] {
        no_slip(&line.evaluate(&Fluid::new(rho, mu).unwrap(), 1e-3).unwrap());
    }
}

#[test]
fn a_length_over_200_km() {
    // 250 000 m of pipe: 250 000 mm = 250 m (SI prefix, exact).
    let r = Line::new(vec![pipe(0.5, 250e3)])
        .unwrap()
        .evaluate(&water(), 0.3)
        .unwrap();
    says(&r, Warnings::IMPLAUSIBLE_LENGTH, "length 250000 m (250 km)");
    says(&r, Warnings::IMPLAUSIBLE_LENGTH, "250000 mm is 250 m");
}

#[test]
fn an_ordinary_route_raises_no_slip_warning() {
    // 100 mm main of 120 m, 5 m up, a filter of 0.4 bar at 12 L/s, at 12 L/s of water:
    // V = 1.53 m/s; every value is ordinary.
    let filter = Equipment::pressure_drop("filter", 4e4, 0.012).unwrap();
    let r = Line::new(vec![
        pipe(0.1, 120.0),
        Element::rise(5.0).unwrap(),
        Element::Equipment(filter),
    ])
    .unwrap()
    .evaluate(&water(), 0.012)
    .unwrap();
    no_slip(&r);
}

#[test]
fn a_gas_through_equipment_rated_with_water_is_pointed_out() {
    // A duct filter stated as 120 Pa at 0.9 m³/s without its rating fluid is taken as
    // rated with water (998 kg/m³); in air of 1.2 kg/m³ its drop scales by ρ/ρ_rating
    // ≈ 1/830 (fixed K), which is rarely what was meant: the result says so.
    let air = Fluid::air(293.15, 101_325.0).unwrap();
    let filter = Equipment::pressure_drop("filter", 120.0, 0.9).unwrap();
    let line = Line::new(vec![pipe(0.5, 10.0), Element::Equipment(filter.clone())]).unwrap();
    says(
        &line.evaluate(&air, 0.9).unwrap(),
        Warnings::IMPLAUSIBLE_RATED_DROP,
        "element 1 (filter) is rated with a fluid of",
    );
    // Rated with this air: no note. Fixed K at the mean density along the duct, with the
    // volume flow there Q_in ρ_in/ρ_mean (mass conserved): Δp = 120 (ρ_mean/ρ_rating)
    // (ρ_in/ρ_mean)² = 120 ρ_in/ρ_mean for ρ_rating = ρ_in.
    let rated = filter.with_rating_density(air.density()).unwrap();
    let r = Line::new(vec![pipe(0.5, 10.0), Element::Equipment(rated)])
        .unwrap()
        .evaluate(&air, 0.9)
        .unwrap();
    no_slip(&r);
    let dp = r.elements[1].head_loss * r.density * 9.80665;
    let want = 120.0 * air.density() / r.density;
    assert!(
        (dp - want).abs() < 1e-9 && (want - 120.0).abs() < 0.5,
        "{dp} vs {want}"
    );
}
