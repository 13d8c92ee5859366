//! The global gradient solver (module docs of [`super`]).

use super::result::{LinkResult, NetworkSolution, NetworkWarning, NetworkWarningKind, NodeResult};
use super::system::{HeadSystem, Slot};
use super::{Network, NodeKind};
use crate::error::{Error, Result};
use crate::fluid::Fluid;
use crate::line::{Line, Resolved, SURROUNDINGS_PRESSURE};
use crate::units::STANDARD_GRAVITY;
use crate::warning::Warnings;

/// Smallest link slope dΔh/dQ the linearisation uses, s/m². A line of fittings with
/// purely inertial K has zero slope at zero flow; the floor keeps the system definite
/// (it is far below the laminar slope of any real pipe, so it never acts on one).
pub(super) const MIN_SLOPE: f64 = 1e-8;

/// Links evaluated on the calling thread below this count; above it on the threads
/// [`crate::threads::set_threads`] allows (the result is the same either way).
const PARALLEL_LINKS: usize = 2048;

/// The factorised head system is kept (a chord step of Newton's method) while no open
/// link's slope differs from the one it was factorised with by more than this share. The
/// step then contracts the error by about that share per iteration instead of squaring
/// it, at a fraction of the cost of a new factorisation; flows, heads and the update all
/// use the kept slopes, so continuity holds at every step as in a full Newton step.
const KEEP_FACTOR_SLOPE_CHANGE: f64 = 0.01;

/// What the iteration needs of a link, worked out once per solve.
pub(super) struct LinkPlan {
    /// The line's rises, m (the nodes' heads already hold the elevation change).
    rise: f64,
    /// True when the fluid's properties do not change along the line (a liquid, or a
    /// gas with no inlet pressure): the hot path is then called directly.
    plain: bool,
}

impl LinkPlan {
    pub(super) fn of(line: &Line, fluid: &Fluid) -> LinkPlan {
        LinkPlan {
            rise: line.static_head(),
            plain: !fluid.is_gas() || line.options().inlet_pressure.or(fluid.pressure).is_none(),
        }
    }

    /// Δh(Q) = required head − the line's rises (m) and its slope (s/m²): the numbers of
    /// [`Line::required_head`], bit for bit, without its copy of the fluid where the
    /// fluid does not change along the line.
    pub(super) fn loss(&self, line: &Line, fluid: &Fluid, flow: f64) -> Result<(f64, f64)> {
        let (h, d) = if self.plain {
            crate::error::check::finite("flow", flow)?;
            line.head_and_slope(fluid, flow)?
        } else {
            line.required_head(fluid, flow)?
        };
        Ok((h - self.rise, d))
    }
}

/// Evaluates every open link at its flow into `dh` (m) and `g` (s/m², floored at
/// [`MIN_SLOPE`]), in parallel when there are many links and more than one thread is
/// allowed. On an error, the first failing link in order gives it.
fn evaluate_links(
    net: &Network,
    plans: &[LinkPlan],
    fluid: &Fluid,
    q: &[f64],
    closed: &[bool],
    dh: &mut [f64],
    g: &mut [f64],
) -> Result<()> {
    let one = |k: usize| -> Result<(f64, f64)> {
        if closed[k] {
            return Ok((0.0, MIN_SLOPE));
        }
        let (h, d) = plans[k].loss(&net.links[k].line, fluid, q[k])?;
        Ok((h, d.max(MIN_SLOPE)))
    };
    if q.len() >= PARALLEL_LINKS && crate::threads::threads() > 1 {
        use rayon::prelude::*;
        let done = crate::threads::in_pool(|| {
            dh.par_iter_mut()
                .zip(g.par_iter_mut())
                .enumerate()
                .try_for_each(|(k, (h, s))| {
                    let (a, b) = one(k)?;
                    (*h, *s) = (a, b);
                    Ok::<(), Error>(())
                })
        });
        if let Some(Ok(())) = done {
            return Ok(());
        }
    }
    for k in 0..q.len() {
        (dh[k], g[k]) = one(k)?;
    }
    Ok(())
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

/// Checks a network can be solved at all: links, a fixed head in every part, a loss in
/// every link.
fn check_solvable(net: &Network) -> Result<()> {
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
    Ok(())
}

/// The layout of a network's linear system: each node's slot, each junction's outflow
/// and each link's ends.
pub(super) struct Layout {
    pub(super) slots: Vec<Slot>,
    pub(super) rows: usize,
    pub(super) outflow: Vec<f64>,
    pub(super) ends: Vec<(usize, usize)>,
}

impl Layout {
    pub(super) fn of(net: &Network) -> Layout {
        let mut slots = Vec::with_capacity(net.nodes.len());
        let mut outflow = Vec::new();
        for node in &net.nodes {
            slots.push(match node.kind {
                NodeKind::Junction { outflow: o } => {
                    outflow.push(o);
                    Slot::Free(outflow.len() - 1)
                }
                NodeKind::FixedHead { head } => Slot::Fixed(head),
            });
        }
        Layout {
            rows: outflow.len(),
            slots,
            outflow,
            ends: net
                .links
                .iter()
                .map(|l| (l.upstream, l.downstream))
                .collect(),
        }
    }

    /// The head of node `i` with junction heads `heads`, m.
    pub(super) fn head(&self, i: usize, heads: &[f64]) -> f64 {
        match self.slots[i] {
            Slot::Free(r) => heads[r],
            Slot::Fixed(h) => h,
        }
    }
}

pub(super) fn solve(net: &Network, fluid: &Fluid) -> Result<NetworkSolution> {
    check_solvable(net)?;
    let opts = &net.options;
    let layout = Layout::of(net);
    let (slots, ends) = (&layout.slots, &layout.ends);
    let rows = layout.rows;
    let mut system = HeadSystem::new(rows, slots, ends)?;
    let plans: Vec<LinkPlan> = net
        .links
        .iter()
        .map(|l| LinkPlan::of(&l.line, fluid))
        .collect();
    let valve: Vec<bool> = net
        .links
        .iter()
        .map(|l| l.line.blocks_reverse_flow())
        .collect();
    let mut closed = vec![false; net.links.len()];
    let mut q: Vec<f64> = net.links.iter().map(|l| first_flow(&l.line)).collect();
    let mut heads = vec![0.0; rows];
    let nl = net.links.len();
    let mut dh = vec![0.0; nl];
    let mut g = vec![0.0; nl];
    // The slopes the factorisation holds (0: none yet).
    let mut g_used = vec![0.0; nl];
    let mut x = vec![0.0; rows];
    let mut last = (f64::INFINITY, 0usize); // (largest flow change, its link)
    let mut changed = true;
    for it in 1..=opts.max_iterations {
        // Evaluate every open link at the current flows, and the energy balance of the
        // heads from the last solve against them.
        evaluate_links(net, &plans, fluid, &q, &closed, &mut dh, &mut g)?;
        let mut worst = (0.0f64, 0usize);
        for k in 0..nl {
            if closed[k] {
                continue;
            }
            let (u, dn) = ends[k];
            let e = (layout.head(u, &heads) - layout.head(dn, &heads) - dh[k]).abs();
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
                &layout,
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
        // Only a change of valve states can cut a node off.
        if changed && closed.iter().any(|&c| c) {
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
        }
        // Keep the factorisation while the slopes barely moved and no valve changed.
        let keep = !changed
            && (0..nl).all(|k| {
                closed[k] || (g[k] - g_used[k]).abs() <= KEEP_FACTOR_SLOPE_CHANGE * g_used[k]
            });
        if !keep {
            g_used.copy_from_slice(&g);
        }
        // Assemble Σ (H_n − H_m)/g_k = rhs over the junctions.
        if !keep {
            system.clear();
        }
        for (r, o) in x.iter_mut().zip(&layout.outflow) {
            *r = -o;
        }
        for k in 0..nl {
            if closed[k] {
                continue;
            }
            let (u, d) = ends[k];
            let w = 1.0 / g_used[k];
            let c = q[k] - dh[k] * w;
            if let Slot::Free(r) = slots[d] {
                x[r] += c;
                if let Slot::Fixed(h) = slots[u] {
                    x[r] += h * w;
                }
            }
            if let Slot::Free(r) = slots[u] {
                x[r] -= c;
                if let Slot::Fixed(h) = slots[d] {
                    x[r] += h * w;
                }
            }
            if !keep {
                system.add_link(k, slots[u], slots[d], w);
            }
        }
        if !keep {
            system.factorise()?;
        }
        system.solve(&mut x);
        heads.copy_from_slice(&x);
        if let Some(r) = heads.iter().position(|h| !h.is_finite()) {
            let name = net
                .nodes
                .iter()
                .zip(slots)
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
            let drop = layout.head(u, &heads) - layout.head(d, &heads);
            let new = if closed[k] {
                // Re-open when the head difference exceeds what forward flow needs.
                let (h0, _) = plans[k].loss(&net.links[k].line, fluid, 0.0)?;
                if drop > h0 {
                    closed[k] = false;
                    changed = true;
                }
                0.0
            } else {
                let new = q[k] + (drop - dh[k]) / g_used[k];
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
    layout: &Layout,
    heads: &[f64],
    q: &[f64],
    closed: &[bool],
    iterations: usize,
    flow_change: f64,
    head_imbalance: f64,
) -> Result<NetworkSolution> {
    let rho_g = fluid.density * STANDARD_GRAVITY;
    let head_of = |i: usize| layout.head(i, heads);
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
