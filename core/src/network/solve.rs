//! The global gradient solver (module docs of [`super`]).

use super::result::{LinkResult, NetworkSolution, NetworkWarning, NetworkWarningKind, NodeResult};
use super::{Network, NodeKind};
use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::line::{Line, Resolved, SURROUNDINGS_PRESSURE};
use crate::units::STANDARD_GRAVITY;
use crate::warning::Warnings;
use faer::linalg::solvers::Solve;
use faer::sparse::linalg::solvers::{Llt, SymbolicLlt};
use faer::sparse::{Pair, SparseColMat, SymbolicSparseColMat};
use faer::{Mat, Side};
use std::collections::HashMap;

/// Smallest link slope dΔh/dQ the linearisation uses, s/m². A line of fittings with
/// purely inertial K has zero slope at zero flow; the floor keeps the system definite
/// (it is far below the laminar slope of any real pipe, so it never acts on one).
const MIN_SLOPE: f64 = 1e-8;

/// Where a node sits in the linear system.
#[derive(Clone, Copy)]
enum Slot {
    /// A junction: its row.
    Free(usize),
    /// A fixed-head node: its head, m.
    Fixed(f64),
}

/// The sparsity pattern of the head system, fixed for the whole solve: a diagonal entry
/// per junction and one lower-triangle entry per pair of junctions joined by a link.
struct Pattern {
    symbolic: SymbolicSparseColMat<usize>,
    argsort: faer::sparse::Argsort<usize>,
    llt: SymbolicLlt<usize>,
    /// Number of distinct entries.
    len: usize,
    /// Value slot of each junction's diagonal.
    diag: Vec<usize>,
    /// Value slot of each link's off-diagonal entry (both ends junctions).
    off: Vec<Option<usize>>,
}

impl Pattern {
    fn new(n: usize, slots: &[Slot], ends: &[(usize, usize)]) -> Result<Pattern> {
        let mut pairs: Vec<Pair<usize, usize>> = (0..n).map(|i| Pair::new(i, i)).collect();
        let mut seen: HashMap<(usize, usize), usize> = HashMap::new();
        let mut off = Vec::with_capacity(ends.len());
        for &(u, d) in ends {
            off.push(match (slots[u], slots[d]) {
                (Slot::Free(a), Slot::Free(b)) => {
                    let key = (a.max(b), a.min(b));
                    Some(*seen.entry(key).or_insert_with(|| {
                        pairs.push(Pair::new(key.0, key.1));
                        pairs.len() - 1
                    }))
                }
                _ => None,
            });
        }
        let internal = |what: &str| {
            Error::no_solution(format!(
                "the sparse solver could not {what} the network's head system"
            ))
        };
        let (symbolic, argsort) = SymbolicSparseColMat::try_new_from_indices(n, n, &pairs)
            .map_err(|_| internal("build"))?;
        let llt = SymbolicLlt::try_new(symbolic.as_ref(), Side::Lower)
            .map_err(|_| internal("analyse"))?;
        Ok(Pattern {
            symbolic,
            argsort,
            llt,
            len: pairs.len(),
            diag: (0..n).collect(),
            off,
        })
    }
}

/// Δh(Q) = required head − the line's rises (m) and its slope (s/m²), for a link.
fn loss(line: &Line, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
    let (h, d) = line.required_head(fluid, flow)?;
    Ok((h - line.static_head(), d))
}

/// A first flow for a link: 1 m/s in its narrowest bore (common practice as a start for
/// network iterations), forward.
fn first_flow(line: &Line) -> f64 {
    let area = line
        .resolved
        .iter()
        .filter_map(|r| match r {
            Resolved::Pipe { geometry, .. } => Some(geometry.area),
            Resolved::Fitting { area, .. } => Some(*area),
            _ => None,
        })
        .fold(f64::INFINITY, f64::min);
    if area.is_finite() { area } else { 1e-3 }
}

/// Labels the nodes by connected part (over all links); each part must hold a fixed
/// head, or its heads are undetermined.
fn check_parts(net: &Network) -> Result<()> {
    let n = net.nodes.len();
    let mut part: Vec<usize> = (0..n).collect();
    fn root(part: &mut [usize], mut i: usize) -> usize {
        while part[i] != i {
            part[i] = part[part[i]];
            i = part[i];
        }
        i
    }
    for l in &net.links {
        let (a, b) = (root(&mut part, l.upstream), root(&mut part, l.downstream));
        part[a] = b;
    }
    let mut fed = vec![false; n];
    for (i, node) in net.nodes.iter().enumerate() {
        if matches!(node.kind, NodeKind::FixedHead { .. }) {
            let r = root(&mut part, i);
            fed[r] = true;
        }
    }
    for i in 0..n {
        let r = root(&mut part, i);
        if !fed[r] {
            let size = (0..n).filter(|&j| root(&mut part, j) == r).count();
            let name = &net.nodes[i].name;
            let linked = net
                .links
                .iter()
                .any(|l| l.upstream == i || l.downstream == i);
            let why = if linked {
                format!(
                    "node \"{name}\" lies in a part of the network ({size} node(s)) with no fixed-head node, so its heads are undetermined: link it to a tank, reservoir or main"
                )
            } else {
                format!("node \"{name}\" is joined to no link")
            };
            return Err(Error::invalid("network", why));
        }
    }
    Ok(())
}

/// Junctions reachable from a fixed head over open links; the first that is not, if any.
fn cut_off(net: &Network, closed: &[bool]) -> Option<usize> {
    let n = net.nodes.len();
    let mut adj: Vec<Vec<usize>> = vec![Vec::new(); n];
    for (k, l) in net.links.iter().enumerate() {
        if !closed[k] {
            adj[l.upstream].push(l.downstream);
            adj[l.downstream].push(l.upstream);
        }
    }
    let mut seen = vec![false; n];
    let mut stack: Vec<usize> = (0..n)
        .filter(|&i| matches!(net.nodes[i].kind, NodeKind::FixedHead { .. }))
        .collect();
    for &i in &stack {
        seen[i] = true;
    }
    while let Some(i) = stack.pop() {
        for &j in &adj[i] {
            if !seen[j] {
                seen[j] = true;
                stack.push(j);
            }
        }
    }
    (0..n).find(|&i| !seen[i])
}

pub(super) fn solve(net: &Network, fluid: &Fluid) -> Result<NetworkSolution> {
    if net.links.is_empty() {
        return Err(Error::invalid("network", "has no links to solve for"));
    }
    if !net
        .nodes
        .iter()
        .any(|n| matches!(n.kind, NodeKind::FixedHead { .. }))
    {
        return Err(Error::invalid(
            "network",
            "has no fixed-head node (a tank, reservoir or main at a known head), so its heads are undetermined",
        ));
    }
    check_parts(net)?;
    if let Some(k) = net.links.iter().position(|l| !l.line.has_resistance()) {
        return Err(Error::invalid(
            "line",
            format!(
                "link \"{}\" has no element with a loss, so no flow in it balances a head",
                net.links[k].name
            ),
        ));
    }
    let opts = &net.options;
    let mut slots = Vec::with_capacity(net.nodes.len());
    let mut rows = 0;
    for node in &net.nodes {
        slots.push(match node.kind {
            NodeKind::Junction { .. } => {
                rows += 1;
                Slot::Free(rows - 1)
            }
            NodeKind::FixedHead { head } => Slot::Fixed(head),
        });
    }
    let outflow: Vec<f64> = net
        .nodes
        .iter()
        .filter_map(|n| match n.kind {
            NodeKind::Junction { outflow } => Some(outflow),
            NodeKind::FixedHead { .. } => None,
        })
        .collect();
    let ends: Vec<(usize, usize)> = net
        .links
        .iter()
        .map(|l| (l.upstream, l.downstream))
        .collect();
    let pattern = Pattern::new(rows, &slots, &ends)?;
    let valve: Vec<bool> = net
        .links
        .iter()
        .map(|l| l.line.blocks_reverse_flow())
        .collect();
    let mut closed = vec![false; net.links.len()];
    let mut q: Vec<f64> = net.links.iter().map(|l| first_flow(&l.line)).collect();
    let mut heads = vec![0.0; rows];
    let head_of = |slot: Slot, heads: &[f64]| match slot {
        Slot::Free(r) => heads[r],
        Slot::Fixed(h) => h,
    };
    let nl = net.links.len();
    let mut dh = vec![0.0; nl];
    let mut g = vec![0.0; nl];
    let mut last = (f64::INFINITY, 0usize); // (largest flow change, its link)
    let mut changed = true;
    for it in 1..=opts.max_iterations {
        // Evaluate every open link at the current flows, and the energy balance of the
        // heads from the last solve against them.
        let mut worst = (0.0f64, 0usize);
        for k in 0..nl {
            if closed[k] {
                continue;
            }
            let (h, d) = loss(&net.links[k].line, fluid, q[k])?;
            dh[k] = h;
            g[k] = d.max(MIN_SLOPE);
            let (u, dn) = ends[k];
            let e = (head_of(slots[u], &heads) - head_of(slots[dn], &heads) - h).abs();
            if e > worst.0 || e.is_nan() {
                worst = (e, k);
            }
        }
        let q_scale = q.iter().fold(1e-12f64, |m, x| m.max(x.abs()));
        if it > 1
            && !changed
            && last.0 <= opts.flow_tolerance * q_scale
            && worst.0 <= opts.head_tolerance
        {
            return finish(
                net,
                fluid,
                &slots,
                &heads,
                &q,
                &closed,
                it - 1,
                last.0,
                worst.0,
            );
        }
        if it == opts.max_iterations {
            let (e, k) = worst;
            let l = &net.links[k];
            return Err(Error::no_solution(format!(
                "the network did not converge in {} iterations: worst link \"{}\" (from \"{}\" to \"{}\") is off its energy balance by {e:.3e} m at flow {:.6e} m³/s; the largest flow change was {:.3e} m³/s in link \"{}\"",
                opts.max_iterations,
                l.name,
                net.nodes[l.upstream].name,
                net.nodes[l.downstream].name,
                q[k],
                last.0,
                net.links[last.1].name
            )));
        }
        if let Some(i) = cut_off(net, &closed) {
            let shut: Vec<&str> = (0..nl)
                .filter(|&k| closed[k])
                .map(|k| net.links[k].name.as_str())
                .collect();
            return Err(Error::no_solution(format!(
                "node \"{}\" is cut off from every fixed head by closed check valves (links {}): no flow can reach it",
                net.nodes[i].name,
                shut.join(", ")
            )));
        }
        // Assemble Σ (H_n − H_m)/g_k = rhs over the junctions.
        let mut vals = vec![0.0; pattern.len];
        let mut rhs: Vec<f64> = outflow.iter().map(|o| -o).collect();
        for k in 0..nl {
            if closed[k] {
                continue;
            }
            let (u, d) = ends[k];
            let w = 1.0 / g[k];
            let c = q[k] - dh[k] * w;
            if let Slot::Free(r) = slots[d] {
                vals[pattern.diag[r]] += w;
                rhs[r] += c;
                if let Slot::Fixed(h) = slots[u] {
                    rhs[r] += h * w;
                }
            }
            if let Slot::Free(r) = slots[u] {
                vals[pattern.diag[r]] += w;
                rhs[r] -= c;
                if let Slot::Fixed(h) = slots[d] {
                    rhs[r] += h * w;
                }
            }
            if let Some(s) = pattern.off[k] {
                vals[s] -= w;
            }
        }
        let mat = SparseColMat::new_from_argsort(pattern.symbolic.clone(), &pattern.argsort, &vals)
            .map_err(|_| Error::no_solution("the network's head system could not be assembled"))?;
        let llt = Llt::try_new_with_symbolic(pattern.llt.clone(), mat.as_ref(), Side::Lower)
            .map_err(|_| {
                Error::no_solution(
                    "the network's head system is not positive definite (a link's loss falls with flow)",
                )
            })?;
        let mut x = Mat::<f64>::from_fn(rows, 1, |i, _| rhs[i]);
        llt.solve_in_place(x.as_mut());
        for (r, h) in heads.iter_mut().enumerate() {
            *h = x[(r, 0)];
        }
        if let Some(r) = heads.iter().position(|h| !h.is_finite()) {
            let name = net
                .nodes
                .iter()
                .zip(&slots)
                .find(|(_, s)| matches!(s, Slot::Free(j) if *j == r))
                .map_or("?", |(n, _)| n.name.as_str());
            return Err(Error::no_solution(format!(
                "the head at node \"{name}\" is not a finite number: the links' losses are too large to combine"
            )));
        }
        // Flow update and check-valve states.
        changed = false;
        last = (0.0, 0);
        for k in 0..nl {
            let (u, d) = ends[k];
            let drop = head_of(slots[u], &heads) - head_of(slots[d], &heads);
            let new = if closed[k] {
                // Re-open when the head difference exceeds what forward flow needs.
                let (h0, _) = loss(&net.links[k].line, fluid, 0.0)?;
                if drop > h0 {
                    closed[k] = false;
                    changed = true;
                }
                0.0
            } else {
                let new = q[k] + (drop - dh[k]) / g[k];
                if valve[k] && new < 0.0 {
                    closed[k] = true;
                    changed = true;
                    0.0
                } else {
                    new
                }
            };
            let change = (new - q[k]).abs();
            if change > last.0 {
                last = (change, k);
            }
            q[k] = new;
        }
    }
    // The loop returns at its last iteration; only `max_iterations` = 0 gets here.
    Err(Error::out_of_range(
        "max_iterations",
        0.0,
        "must be at least 1",
    ))
}

/// The results at the converged state.
#[allow(clippy::too_many_arguments)]
fn finish(
    net: &Network,
    fluid: &Fluid,
    slots: &[Slot],
    heads: &[f64],
    q: &[f64],
    closed: &[bool],
    iterations: usize,
    flow_change: f64,
    head_imbalance: f64,
) -> Result<NetworkSolution> {
    let rho_g = fluid.density * STANDARD_GRAVITY;
    let head_of = |i: usize| match slots[i] {
        Slot::Free(r) => heads[r],
        Slot::Fixed(h) => h,
    };
    let mut warnings = Vec::new();
    let mut nodes = Vec::with_capacity(net.nodes.len());
    for (i, node) in net.nodes.iter().enumerate() {
        let head = head_of(i);
        let pressure_head = head - node.elevation;
        let pressure = rho_g * pressure_head;
        let outflow = match node.kind {
            NodeKind::Junction { outflow } => outflow,
            NodeKind::FixedHead { .. } => net
                .links
                .iter()
                .zip(q)
                .map(|(l, &f)| {
                    if l.downstream == i {
                        f
                    } else if l.upstream == i {
                        -f
                    } else {
                        0.0
                    }
                })
                .sum(),
        };
        if matches!(node.kind, NodeKind::Junction { .. }) {
            let absolute = SURROUNDINGS_PRESSURE + pressure;
            match fluid.vapour_pressure {
                Some(pv) if absolute < pv => warnings.push(NetworkWarning {
                    kind: NetworkWarningKind::BelowVapourPressure,
                    subject: node.name.clone(),
                    message: format!(
                        "node \"{}\": absolute pressure {absolute:.0} Pa (atmospheric plus {pressure:.0} Pa gauge) is below the vapour pressure {pv:.0} Pa: the liquid would flash or cavitate",
                        node.name
                    ),
                }),
                _ if pressure < 0.0 => warnings.push(NetworkWarning {
                    kind: NetworkWarningKind::PressureBelowAtmospheric,
                    subject: node.name.clone(),
                    message: format!(
                        "node \"{}\": pressure {pressure:.0} Pa gauge ({pressure_head:.3} m of head) is below atmospheric",
                        node.name
                    ),
                }),
                _ => {}
            }
        }
        nodes.push(NodeResult {
            name: node.name.clone(),
            fixed: matches!(node.kind, NodeKind::FixedHead { .. }),
            head,
            elevation: node.elevation,
            pressure_head,
            pressure,
            outflow,
        });
    }
    let mut links = Vec::with_capacity(net.links.len());
    for (k, l) in net.links.iter().enumerate() {
        let (velocity, line_warnings) = state_at(&l.line, fluid, q[k])?;
        let head_drop = head_of(l.upstream) - head_of(l.downstream);
        if closed[k] {
            warnings.push(NetworkWarning {
                kind: NetworkWarningKind::CheckValveClosed,
                subject: l.name.clone(),
                message: format!(
                    "link \"{}\": a check valve holds it closed (the head at \"{}\" is {:.3} m above the head at \"{}\")",
                    l.name,
                    net.nodes[l.downstream].name,
                    -head_drop,
                    net.nodes[l.upstream].name
                ),
            });
        }
        if let Some(v) = velocity.filter(|v| v.abs() > net.options.velocity_limit) {
            warnings.push(NetworkWarning {
                kind: NetworkWarningKind::VelocityAboveLimit,
                subject: l.name.clone(),
                message: format!(
                    "link \"{}\": velocity {:.2} m/s is above the limit {} m/s",
                    l.name,
                    v.abs(),
                    net.options.velocity_limit
                ),
            });
        }
        if !line_warnings.is_empty() {
            warnings.push(NetworkWarning {
                kind: NetworkWarningKind::LineWarnings,
                subject: l.name.clone(),
                message: format!(
                    "link \"{}\": {} (evaluate the link for the details)",
                    l.name,
                    line_warnings.names().join(", ")
                ),
            });
        }
        links.push(LinkResult {
            name: l.name.clone(),
            flow: q[k],
            velocity,
            head_drop,
            closed: closed[k],
            warnings: line_warnings,
        });
    }
    Ok(NetworkSolution {
        nodes,
        links,
        iterations,
        flow_change,
        head_imbalance,
        density: fluid.density,
        warnings,
    })
}

/// The velocity of largest magnitude along a line at `flow` and the union of its rows'
/// warnings (no bands: the cheap pass of the line's own evaluation).
fn state_at(line: &Line, fluid: &Fluid, flow: f64) -> Result<(Option<f64>, Warnings)> {
    let (work, qw, mut warnings) =
        line.working_fluid(fluid, flow, line.options().inlet_pressure)?;
    let mut velocity: Option<f64> = None;
    for i in 0..line.resolved.len() {
        let s = line.element_state(i, &work, qw, None, false)?;
        warnings |= s.warnings;
        if let Some(v) = s.velocity {
            if velocity.is_none_or(|w| v.abs() > w.abs()) {
                velocity = Some(v);
            }
        }
    }
    for (w, _) in &line.notes {
        warnings |= *w;
    }
    Ok((velocity, warnings))
}
