//! The flow path of a line: the bore, flow area and resistance every element sees at its
//! own position, worked out once when the line is built.
//!
//! Walking the route in order, the path has a current section. A pipe sets it to its own
//! section; a change of section (contraction or expansion) takes the flow from its inlet
//! bore to its outlet bore; every other element sees the current section: a fitting
//! without a stated bore refers its K to it, a rise or rated drop has none. Before the
//! first pipe or change of section, the path's section is the inlet of the first one that
//! follows.
//!
//! A bore change between consecutive elements with no change-of-section element (a pipe
//! of 100 mm followed by one of 50 mm) still happens in what is built: it becomes its own
//! row, an abrupt contraction (K = 0.5 (1 − A₂/A₁) on the outlet velocity; Crane Co.,
//! Technical Paper 410, 1988, from memory) or an abrupt expansion (K = (1 − A₁/A₂)² on the
//! inlet velocity; Borda–Carnot, exact momentum balance), with a warning naming the two
//! bores.

use super::{Element, LineOptions, Rating};
use crate::error::{Error, Result};
use crate::fitting::{Resistance, method};
use crate::friction;
use crate::pipe::Pipe;
use crate::warning::Warnings;
use serde::{Deserialize, Serialize};
use std::f64::consts::PI;

/// Relative difference below which two bores or areas are the same section.
const SAME_SECTION: f64 = 1e-9;

/// What a resolved row with a resistance coefficient stands for.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub(crate) enum Role {
    /// A fitting of the route.
    Fitting,
    /// Rated equipment with a fixed K.
    Equipment,
    /// An abrupt change of section the route implies between two elements.
    Abrupt,
}

/// An element with everything that does not depend on the fluid or the flow worked out.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub(crate) enum Resolved {
    Pipe {
        pipe: Pipe,
        geometry: crate::pipe::Geometry,
        /// Standard uncertainty of ln ε (ε log-uniform over its stated range).
        roughness_u: f64,
        /// Mean of ln ε minus ln of the nominal ε.
        roughness_shift: f64,
        /// The range was stated for this pipe alone (its roughness is a source of its own).
        own_range: bool,
    },
    Fitting {
        bore: f64,
        area: f64,
        /// Resistance for forward flow, on the velocity in `area`.
        resistance: Resistance,
        /// Resistance for reverse flow (same viscous part), on the same velocity.
        reverse: Resistance,
        spread: f64,
        name: String,
        role: Role,
        /// Stops reverse flow (check and foot valves).
        blocks_reverse: bool,
    },
    Rise {
        /// Elevation change, m.
        height: f64,
        /// Density of the surrounding air, kg/m³.
        air_density: f64,
    },
    Drop {
        drop: f64,
        at_flow: f64,
        /// Density of the rating fluid, kg/m³.
        rating_density: f64,
        spread: f64,
        name: String,
    },
    /// A pump: its head is a negative loss, inside the curve's flow range only.
    Pump { curve: super::PumpCurve },
}

/// The resolved rows of a line with, per row, the index of the element it comes from
/// (`None` for an abrupt change the route implies), and the notes the path raised.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, Default)]
pub(crate) struct Path {
    pub rows: Vec<Resolved>,
    pub origin: Vec<Option<usize>>,
    /// Warnings found when building (bit, message).
    pub notes: Vec<(Warnings, String)>,
}

/// A section of the flow path: hydraulic diameter (m) and flow area (m²).
#[derive(Debug, Clone, Copy, PartialEq)]
struct Section {
    bore: f64,
    area: f64,
}

impl Section {
    fn of_pipe(p: &Pipe) -> Section {
        Section {
            bore: p.bore(),
            area: p.section().area(),
        }
    }

    /// A stated bore `d`: the section `at` when its bore is `d` (a rectangular duct keeps
    /// its own area), else a round bore.
    fn stated(d: f64, at: Option<Section>) -> Section {
        match at {
            Some(s) if same(s.bore, d) => s,
            _ => Section {
                bore: d,
                area: 0.25 * PI * d * d,
            },
        }
    }
}

/// A length in m as mm with four significant figures, trailing zeros dropped.
fn mm(m: f64) -> String {
    let v = m * 1e3;
    let digits = (3 - v.abs().log10().floor() as i32).clamp(0, 6) as usize;
    let s = format!("{v:.digits$}");
    if s.contains('.') {
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        s
    }
}

fn same(a: f64, b: f64) -> bool {
    (a - b).abs() <= SAME_SECTION * a.abs().max(b.abs())
}

/// The section a pipe or change of section presents at its inlet, and the one it leaves.
/// `before` and `after` are the sections next to it (a change of section between
/// rectangular ducts takes the ducts' own areas where its bores are theirs).
fn sides(
    e: &Element,
    before: Option<Section>,
    after: Option<Section>,
) -> Option<(Section, Section)> {
    match e {
        Element::Pipe(p) => {
            let s = Section::of_pipe(p);
            Some((s, s))
        }
        Element::Fitting(f) => f
            .transition_bores()
            .map(|(d_in, d_out)| (Section::stated(d_in, before), Section::stated(d_out, after))),
        _ => None,
    }
}

/// A change of section `from` → `to` with no element of its own: (row, note).
fn abrupt(from: Section, to: Section, before: usize) -> (Resolved, String) {
    let (kind, small, fwd, rev, spread) = if to.area < from.area {
        let r = to.area / from.area;
        (
            "contraction",
            to,
            0.5 * (1.0 - r),
            (1.0 - r) * (1.0 - r),
            method::Method::Contraction {
                d_in: from.bore,
                d_out: to.bore,
            }
            .default_spread(),
        )
    } else {
        let r = from.area / to.area;
        (
            "expansion",
            from,
            (1.0 - r) * (1.0 - r),
            0.5 * (1.0 - r),
            method::Method::Expansion {
                d_in: from.bore,
                d_out: to.bore,
            }
            .default_spread(),
        )
    };
    let inertial = |k| Resistance {
        k_viscous: 0.0,
        k_inertial: k,
    };
    // Named by bore in mm (by area when the bores agree and the shapes do not).
    let name = if same(from.bore, to.bore) {
        format!(
            "abrupt {kind} {} to {} mm²",
            mm(from.area * 1e3),
            mm(to.area * 1e3)
        )
    } else {
        format!("abrupt {kind} {} to {} mm", mm(from.bore), mm(to.bore))
    };
    let note = format!(
        "the bore changes from {} m to {} m (flow area {} m² to {} m²) before element {before} with no contraction or expansion element; counted as an abrupt {kind} (add a transition element to state it)",
        from.bore, to.bore, from.area, to.area
    );
    (
        Resolved::Fitting {
            bore: small.bore,
            area: small.area,
            resistance: inertial(fwd),
            reverse: inertial(rev),
            spread,
            name,
            role: Role::Abrupt,
            blocks_reverse: false,
        },
        note,
    )
}

/// Works out the section every element sees, the implied abrupt changes, resistances in
/// both directions and roughness uncertainties.
///
/// # Errors
/// A fitting or fixed-K equipment with no stated bore in a line with no pipe or change of
/// section to take one from.
pub(crate) fn resolve(
    elements: &[Element],
    options: &LineOptions,
    ranges: &[Option<(f64, f64)>],
) -> Result<Path> {
    let pipe_before = |i: usize| elements[..i].iter().rev().find_map(as_pipe);
    let pipe_after = |i: usize| elements[i + 1..].iter().find_map(as_pipe);
    // Before the first pipe or change of section, the path has the inlet section of the
    // first one that follows.
    let mut current: Option<Section> = elements
        .iter()
        .find_map(|e| sides(e, None, None).map(|s| s.0));
    let mut path = Path::default();
    let air_density = options.surroundings_fluid()?.density;
    for (i, e) in elements.iter().enumerate() {
        path.notes.extend(super::plausible::element_notes(i, e));
        let after = pipe_after(i).map(Section::of_pipe);
        let here = sides(e, current, after);
        if let Some((inlet, outlet)) = here {
            if let Some(from) = current {
                if !same(from.bore, inlet.bore) || !same(from.area, inlet.area) {
                    let (row, note) = abrupt(from, inlet, i);
                    path.rows.push(row);
                    path.origin.push(None);
                    path.notes
                        .push((Warnings::BORE_CHANGE_WITHOUT_TRANSITION, note));
                }
            }
            current = Some(outlet);
        }
        let neighbour = pipe_before(i).or_else(|| pipe_after(i));
        // (bore, area, ε/D of the neighbouring pipe) seen by a fitting with bore `own`.
        let section_for = |own: Option<f64>, label: &str| -> Result<(Section, f64)> {
            let s = match (own, current) {
                (Some(d), at) => Section::stated(d, at),
                (None, Some(s)) => s,
                (None, None) => {
                    return Err(Error::invalid(
                        "elements",
                        format!(
                            "{label} (element {i}) has no diameter and the line has no pipe or change of section to take one from"
                        ),
                    ));
                }
            };
            let rr = neighbour.map_or(0.0, |p| p.roughness() / s.bore);
            Ok((s, rr.min(friction::MAX_REL_ROUGHNESS)))
        };
        path.rows.push(match e {
            Element::Pipe(p) => {
                let (roughness_u, roughness_shift) =
                    super::uncertainty::roughness_input(p, ranges[i], options)
                        .map_err(|e| e.at_index(i))?;
                Resolved::Pipe {
                    pipe: p.clone(),
                    geometry: p.geometry(options.turbulent_diameter),
                    roughness_u,
                    roughness_shift,
                    own_range: ranges[i].is_some(),
                }
            }
            Element::Fitting(f) => {
                let name = f.name();
                // A change of section refers K to its own bore: the outlet of a
                // contraction, the inlet of an expansion.
                let (s, rr) = match (f.transition_bores(), here) {
                    (Some((_, d_out)), Some((inlet, outlet))) => (
                        if f.diameter() == Some(d_out) {
                            outlet
                        } else {
                            inlet
                        },
                        0.0,
                    ),
                    _ => section_for(f.diameter(), &name)?,
                };
                Resolved::Fitting {
                    bore: s.bore,
                    area: s.area,
                    resistance: f.resistance(s.bore, rr)?,
                    reverse: f.reverse_resistance(s.bore, rr)?,
                    spread: f.k_spread(),
                    name,
                    role: Role::Fitting,
                    blocks_reverse: f.blocks_reverse_flow(),
                }
            }
            Element::Rise(h) => Resolved::Rise {
                height: h.height(),
                air_density,
            },
            Element::Equipment(eq) => match eq.rating() {
                Rating::PressureDrop {
                    drop,
                    at_flow,
                    rating_density,
                } => Resolved::Drop {
                    drop: *drop,
                    at_flow: *at_flow,
                    rating_density: *rating_density,
                    spread: eq.spread(),
                    name: eq.name().to_string(),
                },
                Rating::FixedK { k, diameter } => {
                    let (s, _) = section_for(*diameter, eq.name())?;
                    let r = Resistance {
                        k_viscous: 0.0,
                        k_inertial: *k,
                    };
                    Resolved::Fitting {
                        bore: s.bore,
                        area: s.area,
                        resistance: r,
                        reverse: r,
                        spread: eq.spread(),
                        name: eq.name().to_string(),
                        role: Role::Equipment,
                        blocks_reverse: false,
                    }
                }
            },
            Element::Pump(curve) => Resolved::Pump {
                curve: curve.clone(),
            },
        });
        path.origin.push(Some(i));
    }
    Ok(path)
}

fn as_pipe(e: &Element) -> Option<&Pipe> {
    match e {
        Element::Pipe(p) => Some(p),
        _ => None,
    }
}
