//! Uncertainty bands of a solved network, first order from the converged system.
//!
//! Each uncertainty source `s` moves link `k`'s loss by `a_k,s` (m, one standard
//! uncertainty; the line's own first-order terms, [`crate::line`]'s band sources). With the
//! link slopes `g_k = dΔh_k/dQ` at the solution, the perturbed energy equations
//! `δH_u − δH_d = g_k·δQ_k + a_k` and continuity `Σ ±δQ_k = 0` at every junction (the
//! outflows are given, so exact) give the same symmetric system as a Newton step of the
//! solver,
//!
//! ```text
//! Σ_k∋n (δH_n − δH_m)/g_k = Σ_{k: n upstream} a_k/g_k − Σ_{k: n downstream} a_k/g_k
//! ```
//!
//! with `δH = 0` at fixed heads; then `δQ_k = (δH_u − δH_d − a_k)/g_k`. The matrix is
//! factorised once at the solution; each source costs one more pair of triangular solves
//! (a second for the shift of a roughness quoted off the centre of its range). A source is
//! the same physical cause in every link: the friction model, a material's roughness, a
//! catalogue entry's K, the bore tolerance and the fluid's properties act on all links
//! together; a pipe's own roughness, a user K and a piece of equipment belong to one
//! link ([`Source::Link`]). The band of each result follows [`Band::from_terms`] (95 %
//! coverage, as for lines). Node pressures ρ·g·(H − z) also move with the density itself.
//!
//! Cost: (nodes + links) × sources. Networks whose pipes each carry their own roughness
//! source have as many sources as pipes, so the work grows with the square of the size;
//! [`MAX_BAND_WORK`] bounds it.

use super::solve::{Layout, LinkPlan, MIN_SLOPE};
use super::system::{HeadSystem, Slot};
use super::{Network, NetworkSolution};
use crate::band::{Band, Source, Term};
use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::line::uncertainty::{Sources, head_terms};
use crate::units::STANDARD_GRAVITY;
use serde::{Deserialize, Serialize};
use std::collections::HashMap;

/// Largest (junctions + links) × sources a band computation takes on, about a second of
/// work; beyond it [`Network::bands`] refuses with the counts.
pub const MAX_BAND_WORK: usize = 200_000_000;

/// The bands of a solved network, in the order of its nodes and links.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NetworkBands {
    /// Band of each node's head, m (exact at fixed-head nodes).
    pub heads: Vec<Band>,
    /// Band of each node's static gauge pressure ρ·g·(H − z), Pa.
    pub pressures: Vec<Band>,
    /// Band of each link's flow, m³/s (exact for a link a check valve holds closed).
    pub flows: Vec<Band>,
}

/// The sources of every link, numbered across the network, with each link's terms.
struct NetworkSources {
    keys: Vec<Source>,
    /// Per link: (source number, term of its loss, m).
    per_link: Vec<Vec<(usize, Term)>>,
    /// Per link: its slope at the solution, s/m².
    slopes: Vec<f64>,
}

fn gather(net: &Network, fluid: &Fluid, solution: &NetworkSolution) -> Result<NetworkSources> {
    let mut keys: Vec<Source> = Vec::new();
    let mut index: HashMap<Source, usize> = HashMap::new();
    let mut per_link = Vec::with_capacity(net.links.len());
    let mut slopes = Vec::with_capacity(net.links.len());
    for (l, r) in net.links.iter().zip(&solution.links) {
        if r.closed {
            per_link.push(Vec::new());
            slopes.push(MIN_SLOPE);
            continue;
        }
        let sources = Sources::of(&l.line);
        let ht = head_terms(&l.line, &sources, fluid, r.flow)?;
        let mut mine = Vec::new();
        for (s, &t) in sources.list().iter().zip(&ht.terms) {
            if t.u == 0.0 && t.shift == 0.0 {
                continue;
            }
            let key = if s.is_element_scoped() {
                Source::Link {
                    link: l.name.clone(),
                    source: Box::new(s.clone()),
                }
            } else {
                s.clone()
            };
            let k = *index.entry(key.clone()).or_insert_with(|| {
                keys.push(key);
                keys.len() - 1
            });
            mine.push((k, t));
        }
        per_link.push(mine);
        // The solver's slope at the solved flow (the same floor).
        let (_, d) = LinkPlan::of(&l.line, fluid).loss(&l.line, fluid, r.flow)?;
        slopes.push(d.max(MIN_SLOPE));
    }
    Ok(NetworkSources {
        keys,
        per_link,
        slopes,
    })
}

impl Network {
    /// The 95 % bands of every node head and pressure and every link flow of `solution`
    /// (a solve of this network with `fluid`), first order from the converged system with
    /// each link line's own uncertainty sources (see the module docs of
    /// `network::bands`).
    ///
    /// # Errors
    /// A solution of another network (other node or link counts); more work than
    /// [`MAX_BAND_WORK`]; the errors of the links' band terms at their solved flows.
    pub fn bands(&self, fluid: &Fluid, solution: &NetworkSolution) -> Result<NetworkBands> {
        if solution.nodes.len() != self.nodes.len() || solution.links.len() != self.links.len() {
            return Err(Error::invalid(
                "solution",
                format!(
                    "has {} nodes and {} links but the network has {} and {}: pass a solution of this network",
                    solution.nodes.len(),
                    solution.links.len(),
                    self.nodes.len(),
                    self.links.len()
                ),
            ));
        }
        let src = gather(self, fluid, solution)?;
        let layout = Layout::of(self);
        let outputs = layout.rows + self.links.len();
        if outputs.saturating_mul(src.keys.len()) > MAX_BAND_WORK {
            return Err(Error::invalid(
                "network",
                format!(
                    "its bands would take {} sources over {} junctions and links, beyond {MAX_BAND_WORK} source-results: share roughness by material (Pipe::of_material) or turn element sources off in the lines' uncertainty options",
                    src.keys.len(),
                    outputs
                ),
            ));
        }
        let mut system = HeadSystem::new(layout.rows, &layout.slots, &layout.ends)?;
        system.clear();
        for (k, &(u, d)) in layout.ends.iter().enumerate() {
            if !solution.links[k].closed {
                system.add_link(k, layout.slots[u], layout.slots[d], 1.0 / src.slopes[k]);
            }
        }
        system.factorise()?;
        // Which links each source acts on.
        let mut acts: Vec<Vec<(usize, Term)>> = vec![Vec::new(); src.keys.len()];
        for (k, mine) in src.per_link.iter().enumerate() {
            for &(s, t) in mine {
                acts[s].push((k, t));
            }
        }
        let nn = self.nodes.len();
        let mut node_terms: Vec<Vec<(usize, Term)>> = vec![Vec::new(); nn];
        let mut link_terms: Vec<Vec<(usize, Term)>> = vec![Vec::new(); self.links.len()];
        let mut du = vec![0.0; layout.rows];
        let mut ds = vec![0.0; layout.rows];
        for (s, on) in acts.iter().enumerate() {
            du.fill(0.0);
            ds.fill(0.0);
            let mut shifted = false;
            for &(k, t) in on {
                let (u, d) = layout.ends[k];
                let w = 1.0 / src.slopes[k];
                if let Slot::Free(r) = layout.slots[u] {
                    du[r] += t.u * w;
                    ds[r] += t.shift * w;
                }
                if let Slot::Free(r) = layout.slots[d] {
                    du[r] -= t.u * w;
                    ds[r] -= t.shift * w;
                }
                shifted |= t.shift != 0.0;
            }
            system.solve(&mut du);
            if shifted {
                system.solve(&mut ds);
            }
            let head = |i: usize, x: &[f64]| match layout.slots[i] {
                Slot::Free(r) => x[r],
                Slot::Fixed(_) => 0.0,
            };
            for (i, terms) in node_terms.iter_mut().enumerate() {
                let t = Term {
                    u: head(i, &du),
                    shift: if shifted { head(i, &ds) } else { 0.0 },
                };
                if t.u != 0.0 || t.shift != 0.0 {
                    terms.push((s, t));
                }
            }
            let own: HashMap<usize, Term> = on.iter().copied().collect();
            for (k, &(u, d)) in layout.ends.iter().enumerate() {
                if solution.links[k].closed {
                    continue;
                }
                let a = own.get(&k).copied().unwrap_or_default();
                let g = src.slopes[k];
                let t = Term {
                    u: (head(u, &du) - head(d, &du) - a.u) / g,
                    shift: if shifted {
                        (head(u, &ds) - head(d, &ds) - a.shift) / g
                    } else {
                        -a.shift / g
                    },
                };
                if t.u != 0.0 || t.shift != 0.0 {
                    link_terms[k].push((s, t));
                }
            }
        }
        let band = |nominal: f64, terms: &[(usize, Term)]| {
            Band::from_terms(
                nominal,
                terms.iter().map(|&(s, t)| (src.keys[s].clone(), t)),
            )
        };
        let rho_g = fluid.density * STANDARD_GRAVITY;
        let fluid_on = self
            .links
            .iter()
            .any(|l| l.line.options().uncertainty.fluid);
        let mut heads = Vec::with_capacity(nn);
        let mut pressures = Vec::with_capacity(nn);
        for (i, n) in solution.nodes.iter().enumerate() {
            heads.push(band(n.head, &node_terms[i]));
            let mut p: Vec<(Source, Term)> = node_terms[i]
                .iter()
                .map(|&(s, t)| (src.keys[s].clone(), t.times(rho_g)))
                .collect();
            // ρ·g·(H − z) moves with ρ directly too.
            if fluid_on {
                let direct = Term::of(n.pressure * fluid.density_rel_uncertainty);
                match p.iter_mut().find(|(s, _)| *s == Source::Density) {
                    Some((_, t)) => *t = t.plus(direct),
                    None => p.push((Source::Density, direct)),
                }
            }
            pressures.push(Band::from_terms(n.pressure, p));
        }
        let flows = solution
            .links
            .iter()
            .zip(&link_terms)
            .map(|(l, t)| band(l.flow, t))
            .collect();
        Ok(NetworkBands {
            heads,
            pressures,
            flows,
        })
    }
}
