//! Bands of the results derived from a line's head-loss terms: the flow for a head, a
//! pump's operating point, a parallel split and the system curve (the linear maps are in
//! the parent module's documentation).

use super::Sources;
use crate::band::{Band, Source, Term};
use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::line::Line;
use rayon::prelude::*;
use serde::{Deserialize, Serialize};
use std::collections::HashMap;

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
