//! Plausibility checks that catch a value typed in the wrong unit.
//!
//! Every input is SI (m, m³/s, Pa, Pa·s). A value far outside what is built is more often
//! a slip of unit than a design: a bore of 47.5 (meant mm), a flow of 4.5 (meant L/s), a
//! rated drop of 1.5 (meant bar). These checks never refuse a value; they set a warning
//! bit and say what was given and what it would be in the unit the user probably meant.
//!
//! | check | limit (common practice) | warning |
//! |---|---|---|
//! | bore of a pipe, fitting or equipment | under 2 mm or over 5 m | [`Warnings::IMPLAUSIBLE_BORE`] |
//! | pipe length | over 200 km | [`Warnings::IMPLAUSIBLE_LENGTH`] |
//! | rated pressure drop | under 10 Pa | [`Warnings::IMPLAUSIBLE_RATED_DROP`] |
//! | mean velocity | over 15 m/s (liquid), 80 m/s (gas) | [`Warnings::IMPLAUSIBLE_VELOCITY`] |
//! | viscosity of a liquid | over 1 Pa·s below 1100 kg/m³, or over 0.1 Pa·s at the density of water (950…1050 kg/m³) | [`Warnings::IMPLAUSIBLE_VISCOSITY`] |

use super::{Element, Rating};
use crate::fluid::Fluid;
use crate::warning::Warnings;

/// Smallest plausible bore, m (instrument tubing is a few millimetres; common practice).
pub const MIN_BORE: f64 = 0.002;
/// Largest plausible bore, m (penstocks and tunnels reach a few metres; common practice).
pub const MAX_BORE: f64 = 5.0;
/// Longest plausible single pipe, m (long pipelines are split into runs; common practice).
pub const MAX_LENGTH: f64 = 200e3;
/// Smallest plausible rated pressure drop of equipment, Pa (common practice).
pub const MIN_RATED_DROP: f64 = 10.0;
/// Highest plausible mean velocity of a liquid, m/s (common practice: erosion and
/// water hammer keep designs well below it).
pub const MAX_LIQUID_VELOCITY: f64 = 15.0;
/// Highest plausible mean velocity of a gas in a duct or pipe, m/s (common practice).
pub const MAX_GAS_VELOCITY: f64 = 80.0;

/// Notes on the values of element `i` that look like a unit slip.
pub(crate) fn element_notes(i: usize, e: &Element) -> Vec<(Warnings, String)> {
    let mut notes = Vec::new();
    let mut bore = |what: &str, d: f64| {
        if let Some(note) = bore_note(i, what, d) {
            notes.push((Warnings::IMPLAUSIBLE_BORE, note));
        }
    };
    match e {
        Element::Pipe(p) => {
            bore("pipe", p.section().hydraulic_diameter());
        }
        Element::Fitting(f) => {
            let name = f.name();
            match f.transition_bores() {
                Some((d_in, d_out)) => {
                    bore(&name, d_in);
                    bore(&name, d_out);
                }
                None => {
                    if let Some(d) = f.diameter() {
                        bore(&name, d);
                    }
                }
            }
        }
        Element::Equipment(eq) => {
            if let Rating::FixedK {
                diameter: Some(d), ..
            } = eq.rating
            {
                bore(&eq.name, d);
            }
        }
        _ => {}
    }
    match e {
        Element::Pipe(p) if p.length() > MAX_LENGTH => notes.push((
            Warnings::IMPLAUSIBLE_LENGTH,
            format!(
                "element {i} (pipe): length {} m ({} km) is over 200 km; inputs are SI: {} mm is {} m, {} ft is {} m",
                p.length(),
                p.length() / 1e3,
                p.length(),
                p.length() / 1e3,
                p.length(),
                p.length() * crate::units::FOOT,
            ),
        )),
        Element::Equipment(eq) => {
            if let Rating::PressureDrop { drop, .. } = eq.rating {
                if drop.abs() < MIN_RATED_DROP {
                    notes.push((
                        Warnings::IMPLAUSIBLE_RATED_DROP,
                        format!(
                            "element {i} ({}): rated pressure drop {drop} Pa is under 10 Pa; inputs are SI: {drop} bar is {} Pa, {drop} kPa is {} Pa",
                            eq.name,
                            drop * crate::units::BAR,
                            drop * 1e3,
                        ),
                    ));
                }
            }
        }
        _ => {}
    }
    notes
}

fn bore_note(i: usize, what: &str, d: f64) -> Option<String> {
    if d > MAX_BORE {
        Some(format!(
            "element {i} ({what}): bore {d} m; inputs are SI: {d} mm is {} m (a bore over 5 m is rare)",
            d / 1e3
        ))
    } else if d < MIN_BORE {
        Some(format!(
            "element {i} ({what}): bore {d} m ({} mm) is under 2 mm; inputs are SI metres: check the unit",
            d * 1e3
        ))
    } else {
        None
    }
}

/// A note when the fluid's viscosity looks like centipoise typed as Pa·s.
pub(crate) fn fluid_note(fluid: &Fluid) -> Option<(Warnings, String)> {
    if fluid.is_gas() {
        return None;
    }
    let (rho, mu) = (fluid.density, fluid.viscosity);
    let light = rho < 1100.0 && mu > 1.0;
    let water_like = (950.0..=1050.0).contains(&rho) && mu > 0.1;
    (light || water_like).then(|| {
        (
            Warnings::IMPLAUSIBLE_VISCOSITY,
            format!(
                "viscosity {mu} Pa·s is high for a liquid of {rho} kg/m³; inputs are SI: {mu} cP is {} Pa·s",
                mu / 1e3
            ),
        )
    })
}

/// The largest plausible mean velocity for `fluid`, m/s.
pub(crate) fn max_velocity(fluid: &Fluid) -> f64 {
    if fluid.is_gas() {
        MAX_GAS_VELOCITY
    } else {
        MAX_LIQUID_VELOCITY
    }
}

/// The note for the fastest element `i` (velocity `v`, m/s) at flow `flow` (m³/s).
pub(crate) fn velocity_note(i: Option<usize>, v: f64, flow: f64, limit: f64) -> String {
    let at = i.map_or_else(
        || "an implied change of section".to_string(),
        |i| format!("element {i}"),
    );
    format!(
        "velocity {:.4} m/s in {at} is over {limit} m/s at a flow of {flow} m³/s; inputs are SI: {flow} L/s is {} m³/s, {flow} m³/h is {} m³/s",
        v.abs(),
        flow / 1e3,
        flow / 3600.0,
    )
}

/// A note when a gas flows through equipment rated with a fluid more than 100 times
/// denser (a liquid, usually the default water): its drop then scales by ρ/ρ_rating.
pub(crate) fn rating_note(
    i: Option<usize>,
    name: &str,
    rating_density: f64,
    fluid: &Fluid,
) -> Option<String> {
    (fluid.is_gas() && rating_density > 100.0 * fluid.density).then(|| {
        let at = i.map_or_else(String::new, |i| format!("element {i} "));
        format!(
            "{at}({name}) is rated with a fluid of {rating_density} kg/m³ and passes a gas of {} kg/m³: its drop is scaled by their ratio; state the rating gas's density if it was rated with a gas",
            fluid.density
        )
    })
}
