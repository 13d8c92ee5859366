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

use super::eval::{Perturbation, State};
use super::{Element, Line, LineOptions, Resolved, Role};
use crate::band::{Band, Source, Term, log_uniform};
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::math;
use crate::pipe::Pipe;
use crate::units::STANDARD_GRAVITY;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use rayon::prelude::*;
use serde::{Deserialize, Serialize};
use std::borrow::Cow;
use std::collections::HashMap;

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
        let mut materials: HashMap<&str, u32> = HashMap::new();
        let mut entries: HashMap<&str, u32> = HashMap::new();
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
                        Some(m) => match materials.get(m) {
                            Some(&id) => id,
                            None => {
                                let id = push(
                                    &mut list,
                                    Source::Material(static_name(m, &crate::roughness::names())),
                                );
                                materials.insert(m, id);
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
                        Some(name) => match entries.get(name) {
                            Some(&id) => id,
                            None => {
                                let id = push(
                                    &mut list,
                                    Source::CatalogueK(static_name(
                                        name,
                                        &crate::fitting::Fitting::catalogue(),
                                    )),
                                );
                                entries.insert(name, id);
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
        let scale = geometry.dt / geometry.dh;
        let o = crate::friction::Options {
            laminar_constant: geometry.c * scale,
            ..line.options.friction
        };
        let re_t = re * scale;
        let half = P95_RECT * 3f64.sqrt() * s.roughness_u;
        let f_at = |dl: f64| {
            crate::friction::darcy_factor(re_t, pipe.roughness() * math::exp(dl) / geometry.dt, &o)
                .map(|r| r.f)
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

/// A line's head-loss terms at one flow.
pub(crate) struct HeadTerms {
    /// Friction plus minor losses, m.
    head_loss: f64,
    /// Required head, m.
    required: f64,
    /// d(required head)/dQ, s/m².
    pub(crate) slope: f64,
    /// Terms of the head loss, indexed by source.
    pub(crate) terms: Vec<Term>,
}

impl HeadTerms {
    /// The band of the required head, built exactly as [`line_bands`] builds it.
    fn required_band(&self, sources: &Sources) -> Band {
        sources
            .band(self.head_loss, &self.terms)
            .shifted(self.required - self.head_loss)
    }
}

/// Head-loss terms of `line` at signed `flow` (m³/s, at inlet conditions for a gas) with
/// the line's inlet pressure, in one pass over the elements.
pub(crate) fn head_terms(
    line: &Line,
    sources: &Sources,
    fluid: &Fluid,
    flow: f64,
) -> Result<HeadTerms> {
    let (work, q, _) = line.working_fluid(fluid, flow, line.options.inlet_pressure)?;
    let mut acc = vec![Term::default(); sources.len()];
    let (mut hl, mut h, mut d) = (0.0, 0.0, 0.0);
    for i in 0..line.resolved.len() {
        let s = line.element_state(i, &work, q, None, true)?;
        hl += s.head_loss;
        h += s.head_loss + s.static_head; // the order of the system curve
        d += s.dhead_dflow;
        sources.accumulate(line, [(i, &s)], &work, &mut acc);
    }
    let dq = if flow == 0.0 { 1.0 } else { q / flow };
    // The end pressure is a stated requirement, taken as exact (no band of its own).
    Ok(HeadTerms {
        head_loss: hl,
        required: h + line.end_head(&work),
        slope: d * dq,
        terms: acc,
    })
}

/// The band of the flow that balances a head, at the solved `flow` (m³/s) with slope
/// `slope` = d(required head)/dQ (s/m²): a head change `a` moves the flow by `−a/slope`.
pub(crate) fn flow_for_head_band(
    line: &Line,
    fluid: &Fluid,
    flow: f64,
    slope: f64,
) -> Result<Band> {
    let sources = Sources::of(line);
    let ht = head_terms(line, &sources, fluid, flow)?;
    let c = if slope != 0.0 { -1.0 / slope } else { 0.0 };
    let terms: Vec<Term> = ht.terms.iter().map(|t| t.times(c)).collect();
    Ok(sources.band(flow, &terms))
}

/// The flow and head bands of a pump operating point at `flow` (m³/s) and `head` (m),
/// with the line's slope `slope` and the pump curve's `dpump` (s/m²).
pub(crate) fn operating_point_bands(
    line: &Line,
    fluid: &Fluid,
    flow: f64,
    head: f64,
    slope: f64,
    dpump: f64,
) -> Result<(Band, Band)> {
    let sources = Sources::of(line);
    let ht = head_terms(line, &sources, fluid, flow)?;
    let gap = slope - dpump;
    let c = if gap != 0.0 { -1.0 / gap } else { 0.0 };
    let q_terms: Vec<Term> = ht.terms.iter().map(|t| t.times(c)).collect();
    let h_terms: Vec<Term> = q_terms.iter().map(|t| t.times(dpump)).collect();
    Ok((sources.band(flow, &q_terms), sources.band(head, &h_terms)))
}

/// Bands of a parallel split at branch `flows` (m³/s) and common `head` (m): the band of
/// the head and of each branch flow. Sources an element owns are the branch's own
/// ([`Source::Branch`]); shared causes (friction model, materials, catalogue entries,
/// bore tolerance, fluid) act on every branch together.
pub(crate) fn split_bands(
    branches: &[Line],
    fluid: &Fluid,
    flows: &[f64],
    head: f64,
) -> Result<(Band, Vec<Band>)> {
    let mut keys: Vec<Source> = Vec::new();
    let mut index: HashMap<Source, usize> = HashMap::new();
    let mut per_branch: Vec<Vec<(usize, Term)>> = Vec::with_capacity(branches.len());
    let mut slopes = Vec::with_capacity(branches.len());
    for (b, (line, &q)) in branches.iter().zip(flows).enumerate() {
        let sources = Sources::of(line);
        let ht = head_terms(line, &sources, fluid, q)?;
        let mut mine = Vec::new();
        for (s, &t) in sources.list().iter().zip(&ht.terms) {
            if t.u == 0.0 && t.shift == 0.0 {
                continue;
            }
            let key = if s.is_element_scoped() {
                Source::Branch {
                    branch: b,
                    source: Box::new(s.clone()),
                }
            } else {
                s.clone()
            };
            let k = match index.get(&key) {
                Some(&k) => k,
                None => {
                    keys.push(key.clone());
                    index.insert(key, keys.len() - 1);
                    keys.len() - 1
                }
            };
            mine.push((k, t));
        }
        per_branch.push(mine);
        slopes.push(ht.slope);
    }
    let inv_sum: f64 = slopes.iter().map(|d| 1.0 / d).sum();
    let mut dh = vec![Term::default(); keys.len()];
    for (mine, d) in per_branch.iter().zip(&slopes) {
        for &(k, t) in mine {
            dh[k] = dh[k].plus(t.times(1.0 / (d * inv_sum)));
        }
    }
    let band_of = |nominal: f64, terms: &[Term]| {
        Band::from_terms(
            nominal,
            keys.iter()
                .zip(terms)
                .filter(|(_, t)| t.u != 0.0)
                .map(|(s, t)| (s.clone(), *t)),
        )
    };
    let flow_bands = per_branch
        .iter()
        .zip(&slopes)
        .zip(flows)
        .map(|((mine, d), &q)| {
            let mut t = dh.clone();
            for &(k, a) in mine {
                t[k] = t[k].plus(a.times(-1.0));
            }
            for x in &mut t {
                *x = x.times(1.0 / d);
            }
            band_of(q, &t)
        })
        .collect();
    Ok((band_of(head, &dh), flow_bands))
}

/// The system curve with its band: required head (m) at each flow, with the 95 % band
/// from the same sources as [`Line::evaluate`].
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct CurveBand {
    /// The flows, m³/s.
    pub flows: Vec<f64>,
    /// Lower end of the band of the required head at each flow, m.
    pub low: Vec<f64>,
    /// Nominal required head at each flow, m (the same values as
    /// [`Line::system_curve`]).
    pub nominal: Vec<f64>,
    /// Upper end of the band at each flow, m.
    pub high: Vec<f64>,
}

impl Line {
    /// The system curve with its band: the required head at each of `flows` (m³/s) and
    /// the band of `evaluate(fluid, q).required_head_band` at each, in one pass over the
    /// elements per flow. Runs on the threads [`crate::threads::set_threads`] allows above
    /// 64 flows; the result is the same either way.
    ///
    /// # Errors
    /// As [`Line::evaluate`], with the index of the offending flow.
    pub fn system_curve_band(&self, fluid: &Fluid, flows: &[f64]) -> Result<CurveBand> {
        let sources = Sources::of(self);
        let one = |(i, &q): (usize, &f64)| -> Result<(f64, f64, f64)> {
            let ht = head_terms(self, &sources, fluid, q).map_err(|e| e.at_index(i))?;
            let b = ht.required_band(&sources);
            if !(b.low.is_finite() && ht.required.is_finite() && b.high.is_finite()) {
                return Err(Error::no_solution(format!(
                    "the required head or its band at flow {q} m³/s is not finite: the line's losses are too large to represent in double precision"
                ))
                .at_index(i));
            }
            Ok((b.low, ht.required, b.high))
        };
        let serial = || {
            flows
                .iter()
                .enumerate()
                .map(one)
                .collect::<Result<Vec<_>>>()
        };
        let rows = if flows.len() > 64 {
            match crate::threads::in_pool(|| flows.par_iter().enumerate().map(one).collect()) {
                Some(Ok(v)) => v,
                // One thread allowed, or an error: the serial pass gives the first failing flow.
                _ => serial()?,
            }
        } else {
            serial()?
        };
        Ok(CurveBand {
            flows: flows.to_vec(),
            low: rows.iter().map(|r| r.0).collect(),
            nominal: rows.iter().map(|r| r.1).collect(),
            high: rows.iter().map(|r| r.2).collect(),
        })
    }
}

/// A standard normal deviate (Box–Muller).
fn normal(rng: &mut StdRng) -> f64 {
    let u1: f64 = 1.0 - rng.random::<f64>(); // (0, 1]
    let u2: f64 = rng.random::<f64>();
    (-2.0 * math::ln(u1)).sqrt() * math::cos(std::f64::consts::TAU * u2)
}

/// `samples` draws of the required head (m) at `flow` with every source sampled from its
/// stated distribution (see [`crate::band::monte_carlo`]), from generator seed `seed`.
pub(crate) fn sample_required_head(
    line: &Line,
    fluid: &Fluid,
    flow: f64,
    samples: usize,
    seed: u64,
) -> Result<Vec<f64>> {
    let (work, q, _) = line.working_fluid(fluid, flow, line.options.inlet_pressure)?;
    let uo = &line.options.uncertainty;
    let sources = Sources::of(line);
    let n = line.resolved.len();
    let nominal: Vec<State> = (0..n)
        .map(|i| line.element_state(i, &work, q, None, true))
        .collect::<Result<_>>()?;
    let root3 = 3f64.sqrt();
    let mut rng = StdRng::seed_from_u64(seed);
    let mut xi = vec![0.0; sources.len()];
    let mut values = Vec::with_capacity(samples);
    for _ in 0..samples {
        let model_z = normal(&mut rng);
        let diameter = 1.0 + uo.diameter * normal(&mut rng);
        let (dz, vz) = if uo.fluid {
            (normal(&mut rng), normal(&mut rng))
        } else {
            (0.0, 0.0)
        };
        // One rectangular deviate on [−1, 1] per source beyond the four shared ones.
        for x in xi.iter_mut().skip(4) {
            *x = 2.0 * rng.random::<f64>() - 1.0;
        }
        let own = (0..n)
            .map(|i| {
                if let Some((k, shift)) = sources.roughness_of(i) {
                    // ln ε uniform over [ln ε₀ + shift − √3·u, ln ε₀ + shift + √3·u].
                    math::exp(shift + root3 * nominal[i].roughness_u * xi[k])
                } else if let Some(k) = sources.own_of(i) {
                    1.0 + root3 * nominal[i].own_u * xi[k]
                } else {
                    1.0
                }
            })
            .collect();
        let pert = Perturbation {
            model_z,
            diameter,
            density: 1.0 + work.density_rel_uncertainty * dz,
            viscosity: 1.0 + work.viscosity_rel_uncertainty * vz,
            own,
        };
        let mut fl = work.clone();
        fl.density *= pert.density;
        fl.viscosity *= pert.viscosity;
        let mut h = 0.0;
        for i in 0..n {
            let s = line.element_state(i, &fl, q, Some(&pert), true)?;
            h += s.head_loss + s.static_head;
        }
        // The end pressure is a stated requirement, taken as exact (as in the GUM bands).
        values.push(h + line.end_head(&work));
    }
    Ok(values)
}
