//! Band propagation for lines: every band of a line's results is built here, from the
//! per-element sensitivities ([`State::sens`]) that evaluation returns.
//!
//! Each element's head loss depends on a handful of sources (friction model, its
//! roughness source, the bore tolerance, density, viscosity, its own K or rating). The
//! sources of a line are numbered once per call ([`Sources::of`]); a result's
//! first-order terms are then accumulated in one pass over the elements into a vector
//! indexed by source, so every band costs time linear in the number of elements.
//!
//! Derived results are linear maps of the head-loss terms: the flow for a head moves by
//! `−a/h'` for a head change `a`; the operating point by `−a/(h' − h_pump')` in flow and
//! `h_pump'` times that in head; a parallel split by `dH = Σ(a_i/h_i')/Σ(1/h_i')` in the
//! common head and `(dH − a_i)/h_i'` in branch `i`'s flow. The same maps carry each
//! term's shift (an input whose mean is not its nominal value).

use super::eval::State;
use super::{Element, Line, LineOptions, Resolved, Role};
use crate::band::{Band, Source, Term, log_uniform};
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::friction;
use crate::math;
use crate::pipe::Pipe;
use crate::units::STANDARD_GRAVITY;
use std::borrow::Cow;

mod derived;
mod sample;
pub use derived::CurveBand;
pub(crate) use derived::{flow_for_head_band, head_terms, operating_point_bands, split_bands};
pub(crate) use sample::sample_required_head;

/// Source numbers shared by every line.
const MODEL: u32 = 0;
const DIAMETER: u32 = 1;
const DENSITY: u32 = 2;
const VISCOSITY: u32 = 3;
/// No source.
const NONE: u32 = u32::MAX;
/// The 95 % interval of a rectangular variable is this share of its half-width.
const P95_RECT: f64 = 0.95;

/// Standard uncertainty of ln ε and the offset of its mean from ln ε₀ for one pipe:
/// log-uniform over the range stated for the pipe (`own`) or carried by it (its
/// material's), else a factor of `exp(√3·roughness_default)` either way; nothing for a
/// smooth pipe without a range.
///
/// # Errors
/// A range whose low end is not positive, whose high end is below its low end or not
/// finite, or that does not contain the pipe's roughness.
pub(crate) fn roughness_input(
    p: &Pipe,
    own: Option<(f64, f64)>,
    options: &LineOptions,
) -> Result<(f64, f64)> {
    match own.or(p.roughness_range()) {
        Some((lo, hi)) => {
            check::positive("low", lo)?;
            check::positive("high", hi)?;
            if hi < lo {
                return Err(Error::out_of_range(
                    "high",
                    hi,
                    format!("must not be below low ({lo} m): the roughness range is inverted"),
                ));
            }
            if !(lo..=hi).contains(&p.roughness()) {
                return Err(Error::out_of_range(
                    "roughness",
                    p.roughness(),
                    format!("must lie inside its stated range {lo} … {hi} m"),
                ));
            }
            Ok(log_uniform(p.roughness(), lo, hi))
        }
        None if p.roughness() > 0.0 => Ok((options.uncertainty.roughness_default, 0.0)),
        None => Ok((0.0, 0.0)),
    }
}

/// `name` as the catalogue's own static string when it is one of `known` (so sources
/// clone without allocating), else owned.
fn static_name(name: &str, known: &[&'static str]) -> Cow<'static, str> {
    known
        .iter()
        .find(|k| **k == name)
        .map_or_else(|| Cow::Owned(name.to_string()), |k| Cow::Borrowed(*k))
}

/// The sources of one line, numbered: the four shared ones first, then each roughness
/// and each own K or rating in route order of first appearance.
pub(crate) struct Sources {
    list: Vec<Source>,
    /// Per element: its roughness source (pipes) or [`NONE`].
    rough: Vec<u32>,
    /// Per element: its own K or rating source or [`NONE`].
    own: Vec<u32>,
    /// Per element: the roughness shift in ln ε (pipes; 0 otherwise).
    shift: Vec<f64>,
}

impl Sources {
    /// Numbers the sources of `line` under its uncertainty options.
    pub(crate) fn of(line: &Line) -> Sources {
        let uo = &line.options.uncertainty;
        let n = line.resolved.len();
        let mut list = vec![
            Source::FrictionModel,
            Source::Diameter,
            Source::Density,
            Source::Viscosity,
        ];
        let (mut rough, mut own, mut shift) = (vec![NONE; n], vec![NONE; n], vec![0.0; n]);
        // A route has a few materials and catalogue entries (both lists are bounded by the
        // catalogues): a search of a short list is cheaper than hashing every element.
        let mut materials: Vec<(&str, u32)> = Vec::new();
        let mut entries: Vec<(&str, u32)> = Vec::new();
        let find = |list: &[(&str, u32)], name: &str| {
            list.iter().find(|(n, _)| *n == name).map(|&(_, id)| id)
        };
        let push = |list: &mut Vec<Source>, s: Source| {
            list.push(s);
            (list.len() - 1) as u32
        };
        for (i, r) in line.resolved.iter().enumerate() {
            // The line element this row stands for; an implied change of section is
            // named after the element it stands before.
            let element = line.origin[i]
                .or_else(|| line.origin[i + 1..].iter().find_map(|o| *o))
                .unwrap_or(0);
            let e = line.origin[i].map(|j| &line.elements[j]);
            match (r, e) {
                (
                    Resolved::Pipe {
                        pipe,
                        own_range,
                        roughness_shift,
                        ..
                    },
                    _,
                ) if uo.roughness => {
                    shift[i] = *roughness_shift;
                    let shared = pipe
                        .material()
                        .filter(|m| !own_range && !uo.independent_materials.iter().any(|x| x == m));
                    rough[i] = match shared {
                        Some(m) => match find(&materials, m) {
                            Some(id) => id,
                            None => {
                                let id = push(
                                    &mut list,
                                    Source::Material(static_name(m, &crate::roughness::names())),
                                );
                                materials.push((m, id));
                                id
                            }
                        },
                        None => push(&mut list, Source::PipeRoughness { element }),
                    };
                }
                (
                    Resolved::Fitting {
                        role: Role::Abrupt,
                        name,
                        ..
                    },
                    _,
                ) if uo.fittings => {
                    own[i] = push(
                        &mut list,
                        Source::FittingK {
                            element,
                            name: Cow::Owned(name.clone()),
                        },
                    );
                }
                (
                    Resolved::Fitting {
                        role: Role::Fitting,
                        ..
                    },
                    Some(Element::Fitting(f)),
                ) if uo.fittings => {
                    own[i] = match f.catalogue_name() {
                        Some(name) => match find(&entries, name) {
                            Some(id) => id,
                            None => {
                                let id = push(
                                    &mut list,
                                    Source::CatalogueK(static_name(
                                        name,
                                        &crate::fitting::Fitting::catalogue(),
                                    )),
                                );
                                entries.push((name, id));
                                id
                            }
                        },
                        None => push(
                            &mut list,
                            Source::FittingK {
                                element,
                                name: Cow::Borrowed(f.method().name()),
                            },
                        ),
                    };
                }
                (
                    Resolved::Fitting {
                        role: Role::Equipment,
                        name,
                        ..
                    }
                    | Resolved::Drop { name, .. },
                    _,
                ) if uo.equipment => {
                    own[i] = push(
                        &mut list,
                        Source::Equipment {
                            element,
                            name: name.clone(),
                        },
                    );
                }
                _ => {}
            }
        }
        Sources {
            list,
            rough,
            own,
            shift,
        }
    }

    /// Number of sources.
    pub(crate) fn len(&self) -> usize {
        self.list.len()
    }

    /// The sources in number order.
    pub(crate) fn list(&self) -> &[Source] {
        &self.list
    }

    /// Element `i`'s roughness source number and shift of ln ε, if it has one.
    pub(crate) fn roughness_of(&self, i: usize) -> Option<(usize, f64)> {
        (self.rough[i] != NONE).then(|| (self.rough[i] as usize, self.shift[i]))
    }

    /// Element `i`'s own K or rating source number, if it enters the bands.
    pub(crate) fn own_of(&self, i: usize) -> Option<usize> {
        (self.own[i] != NONE).then_some(self.own[i] as usize)
    }

    /// The roughness terms of pipe `i`'s head loss and friction factor.
    ///
    /// ln ε is uniform over `[c − √3·u, c + √3·u]` (`c` its centre). The friction
    /// factor is evaluated at the input's own 95 % points `c ± 0.95·√3·u` (two more
    /// friction solves): the term is the equivalent rectangular one whose 95 % interval
    /// has those two values as its ends, centred between them. For a band that this
    /// roughness dominates the interval is then exact however curved the response is
    /// over the range (the quoted ranges span factors of 3 to 10, too far for the tangent);
    /// elsewhere it is the secant over the input's range instead of the tangent at the
    /// nominal value. Falls back to the tangent where the secant cannot be evaluated.
    fn roughness_terms(&self, line: &Line, i: usize, s: &State) -> (Term, Term) {
        let shift = self.shift[i];
        let f_rr = s.f_sens.1;
        let tangent = (
            Term {
                u: s.sens.roughness * s.roughness_u,
                shift: s.sens.roughness * shift,
            },
            Term {
                u: f_rr * s.roughness_u,
                shift: f_rr * shift,
            },
        );
        let (Resolved::Pipe { pipe, geometry, .. }, Some(f0), Some(re)) =
            (&line.resolved[i], s.friction_factor, s.reynolds)
        else {
            return tangent;
        };
        if s.sens.roughness == 0.0 || s.roughness_u == 0.0 || f0 == 0.0 {
            return tangent;
        }
        let scale = geometry.scale;
        let o = geometry.friction_options(&line.options.friction);
        let re_t = re * scale;
        let half = P95_RECT * 3f64.sqrt() * s.roughness_u;
        let f_at = |dl: f64| {
            let rr = pipe.roughness() * math::exp(dl) / geometry.dt;
            // Pipes of one material and bore share these two solves (the memo).
            if friction::inputs_ok(re_t, rr) && friction::options_ok(&o) {
                friction::factor_remembered(re_t, rr, &o).map(|r| r.f)
            } else {
                friction::darcy_factor(re_t, rr, &o).map(|r| r.f)
            }
        };
        match (f_at(shift - half), f_at(shift + half)) {
            (Ok(lo), Ok(hi)) => {
                let f_term = Term {
                    u: (hi - lo) / (2.0 * P95_RECT * 3f64.sqrt()),
                    shift: 0.5 * (hi + lo) - f0,
                };
                (f_term.times(s.head_loss / f0), f_term)
            }
            _ => tangent,
        }
    }

    /// Calls `f(source, term)` for each source of element `i`'s head loss.
    fn element_terms(
        &self,
        line: &Line,
        i: usize,
        s: &State,
        fluid: &Fluid,
        f: impl FnMut(u32, Term),
    ) {
        let rough = (self.rough[i] != NONE).then(|| self.roughness_terms(line, i, s).0);
        self.element_terms_with(line, i, s, fluid, rough, f);
    }

    /// As [`Sources::element_terms`] with the roughness term already worked out.
    fn element_terms_with(
        &self,
        line: &Line,
        i: usize,
        s: &State,
        fluid: &Fluid,
        rough: Option<Term>,
        mut f: impl FnMut(u32, Term),
    ) {
        let uo = &line.options.uncertainty;
        f(MODEL, Term::of(s.sens.model * s.model_u));
        if let Some(t) = rough {
            f(self.rough[i], t);
        }
        f(DIAMETER, Term::of(s.sens.diameter * uo.diameter));
        if uo.fluid {
            f(
                DENSITY,
                Term::of(s.sens.density * fluid.density_rel_uncertainty),
            );
            f(
                VISCOSITY,
                Term::of(s.sens.viscosity * fluid.viscosity_rel_uncertainty),
            );
        }
        if self.own[i] != NONE {
            f(self.own[i], Term::of(s.sens.own * s.own_u));
        }
    }

    /// Adds the terms of elements' head losses into `acc` (indexed by source).
    fn accumulate<'a>(
        &self,
        line: &Line,
        states: impl IntoIterator<Item = (usize, &'a State)>,
        fluid: &Fluid,
        acc: &mut [Term],
    ) {
        for (i, s) in states {
            self.element_terms(line, i, s, fluid, |k, t| {
                acc[k as usize] = acc[k as usize].plus(t);
            });
        }
    }

    /// The band of `nominal` from terms indexed by source.
    fn band(&self, nominal: f64, terms: &[Term]) -> Band {
        Band::from_terms(
            nominal,
            self.list
                .iter()
                .zip(terms)
                .filter(|(_, t)| t.u != 0.0)
                .map(|(s, t)| (s.clone(), *t)),
        )
    }

    /// A zero term per source.
    pub(crate) fn zero_terms(&self) -> Vec<Term> {
        vec![Term::default(); self.len()]
    }

    /// The bands of element `i`'s head loss and (pipes) friction factor, adding the
    /// element's head-loss terms into `acc` on the way (each term worked out once), and
    /// those terms themselves (for the element's share of the line's band).
    pub(crate) fn element_bands(
        &self,
        line: &Line,
        i: usize,
        s: &State,
        fluid: &Fluid,
        acc: &mut [Term],
    ) -> ((Band, Option<Band>), ElementTerms) {
        let uo = &line.options.uncertainty;
        let rough = (self.rough[i] != NONE).then(|| self.roughness_terms(line, i, s));
        // At most six sources act on one element: gathered on the stack.
        let mut mine = [(0u32, Term::default()); 6];
        let mut n = 0;
        self.element_terms_with(line, i, s, fluid, rough.map(|r| r.0), |k, t| {
            acc[k as usize] = acc[k as usize].plus(t);
            if t.u != 0.0 {
                mine[n] = (k, t);
                n += 1;
            }
        });
        let head = Band::from_terms(
            s.head_loss,
            mine[..n]
                .iter()
                .map(|&(k, t)| (self.list[k as usize].clone(), t)),
        );
        let friction = s.friction_factor.map(|f| {
            let (f_re, f_rr) = s.f_sens;
            let fl = if uo.fluid { 1.0 } else { 0.0 };
            let shared = [
                (Source::FrictionModel, Term::of(f * s.model_u)),
                (Source::Diameter, Term::of(-(f_re + f_rr) * uo.diameter)),
                (
                    Source::Density,
                    Term::of(f_re * fluid.density_rel_uncertainty * fl),
                ),
                (
                    Source::Viscosity,
                    Term::of(-f_re * fluid.viscosity_rel_uncertainty * fl),
                ),
            ];
            let own = rough.map(|r| (self.list[self.rough[i] as usize].clone(), r.1));
            Band::from_terms(f, shared.into_iter().chain(own))
        });
        ((head, friction), ElementTerms { terms: mine, n })
    }
}

/// One element's head-loss terms, by source index (at most six sources act on one).
pub(crate) struct ElementTerms {
    terms: [(u32, Term); 6],
    n: usize,
}

/// Each element's share of the variance of the line's head loss: the covariance of its
/// loss with the total over the total's variance, Σₛ uₛ,ᵢ·uₛ / Σₛ uₛ² with uₛ,ᵢ the
/// element's term of source s and uₛ = Σᵢ uₛ,ᵢ the line's (first order, JCGM 100:2008
/// §5.2). The shares sum to 1; one is negative when the element's error offsets the
/// rest's. `None` for every element when the line's band has no width.
pub(crate) fn variance_shares(elements: &[ElementTerms], total: &[Term]) -> Vec<Option<f64>> {
    let usable = |u: f64| if (u * u).is_finite() { u } else { 0.0 };
    let var: f64 = total.iter().map(|t| usable(t.u) * usable(t.u)).sum();
    elements
        .iter()
        .map(|e| {
            (var > 0.0).then(|| {
                e.terms[..e.n]
                    .iter()
                    .map(|&(k, t)| usable(t.u) * usable(total[k as usize].u))
                    .sum::<f64>()
                    / var
            })
        })
        .collect()
}

/// The bands of a line's totals at one flow.
pub(crate) struct LineBands {
    pub head_loss: Band,
    pub pressure_loss: Band,
    pub required_head: Band,
}

/// Bands of the totals from the head-loss terms `acc` gathered by
/// [`Sources::element_bands`] (`fluid` the working fluid, `head_loss` and
/// `required_head` the nominal totals).
pub(crate) fn line_bands(
    line: &Line,
    sources: &Sources,
    mut acc: Vec<Term>,
    fluid: &Fluid,
    head_loss: f64,
    required_head: f64,
) -> LineBands {
    let head = sources.band(head_loss, &acc);
    let rho_g = fluid.density * STANDARD_GRAVITY;
    // The pressure loss ρ·g·h also moves with ρ directly.
    if line.options.uncertainty.fluid {
        let d = DENSITY as usize;
        acc[d] = acc[d].plus(Term::of(head_loss * fluid.density_rel_uncertainty));
    }
    for t in &mut acc {
        *t = t.times(rho_g);
    }
    LineBands {
        pressure_loss: sources.band(rho_g * head_loss, &acc),
        required_head: head.shifted(required_head - head_loss),
        head_loss: head,
    }
}
