//! The flow available at a node at a minimum residual pressure (a hydrant test on paper).
//!
//! With the network's own demands in place, an extra outflow `q` drawn at one junction
//! lowers the pressures. The available flow is the largest `q` for which the static
//! pressure at that junction (or, with [`LimitAt::EveryJunction`], at every junction)
//! stays at or above a stated minimum. Pressure falls as `q` grows, so the answer is the
//! root of `g(q) = p_min(q) − minimum`, found by bracketing (`q` from 1 L/s, times four
//! per step) and then the Illinois variant of regula falsi (Dowell and Jarratt, 1971,
//! BIT 11, 168–174), each trial a full network solve. The flow returned is the largest
//! trial known to meet the minimum, within 1e-10 of itself of the root.

use super::{Network, NetworkSolution, NodeKind, OUTFLOW_LIMIT};
use crate::error::{Error, Result, check};
use crate::fluid::Fluid;

/// Where the minimum residual pressure must hold.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum LimitAt {
    /// At the node the flow is drawn from.
    Node,
    /// At every junction of the network.
    EveryJunction,
}

/// The flow available at a node at a minimum residual pressure.
#[derive(Debug, Clone, PartialEq)]
pub struct AvailableFlow {
    /// Extra outflow at the node beyond its own demand, m³/s.
    pub flow: f64,
    /// Static gauge pressure at the node with that flow drawn, Pa.
    pub pressure: f64,
    /// The junction where the minimum binds (the node itself, or with
    /// [`LimitAt::EveryJunction`] the junction of lowest pressure).
    pub critical: String,
    /// The network solved with that flow drawn (the node's outflow includes it).
    pub solution: NetworkSolution,
    /// Network solves used.
    pub solves: usize,
}

/// First trial flow of the bracket, m³/s (1 L/s), and its growth per step.
const FIRST_TRIAL: f64 = 1e-3;
const GROWTH: f64 = 4.0;
/// Most refinement steps after the bracket (bisection alone would need about 75 to
/// narrow 1e6 m³/s to 1e-10 of itself).
const MAX_STEPS: usize = 100;
/// Relative width of the final bracket.
const TOLERANCE: f64 = 1e-10;
/// Lowest and highest minimum pressure accepted, Pa (gauge): a full vacuum below
/// atmospheric, and 1000 bar.
const MIN_PRESSURE_RANGE: (f64, f64) = (-101_325.0, 1e8);

/// One trial solve: its lowest pressure in scope minus the minimum (Pa), the junction
/// where it occurs and the solution. A draw the network cannot carry (the solve fails)
/// counts as beyond the available flow.
struct Trial {
    excess: f64,
    critical: usize,
    solution: NetworkSolution,
}

impl Network {
    /// The largest extra outflow (m³/s) that junction `node` can draw, on top of its own
    /// demand, while the static gauge pressure there (or at every junction, by `at`)
    /// stays at or above `min_pressure` (Pa). See the module docs of `available` for the
    /// method; a draw at which the network cannot be solved counts as beyond the
    /// available flow.
    ///
    /// # Errors
    /// An unknown node, or a fixed-head one; `min_pressure` not finite or outside
    /// −101,325…1e8 Pa; the errors of [`Network::solve`] at the given demands;
    /// [`Error::NoSolution`] when the pressure is below the minimum already at the given
    /// demands (naming the junction), or is still above it at an extra 1e6 m³/s.
    ///
    /// # Example
    /// ```
    /// use hydrograde::network::{LimitAt, Network};
    /// use hydrograde::{Element, Fluid, Line, Pipe, Section};
    /// # fn main() -> hydrograde::Result<()> {
    /// let pipe = Line::new(vec![Element::Pipe(Pipe::new(Section::circle(0.15)?, 400.0, 4.5e-5)?)])?;
    /// let mut net = Network::new();
    /// net.fixed_head("tank", 45.0, None)?;
    /// net.node("hydrant", 2.0, 0.0)?;
    /// net.link("main", "tank", "hydrant", pipe)?;
    /// let water = Fluid::water(283.15, 101_325.0)?;
    /// let a = net.available_flow(&water, "hydrant", 1.4e5, LimitAt::Node)?;
    /// assert!(a.flow > 0.01 && (a.pressure - 1.4e5).abs() < 1.0);
    /// # Ok(())
    /// # }
    /// ```
    pub fn available_flow(
        &self,
        fluid: &Fluid,
        node: &str,
        min_pressure: f64,
        at: LimitAt,
    ) -> Result<AvailableFlow> {
        let (lo_p, hi_p) = MIN_PRESSURE_RANGE;
        check::within("min_pressure", min_pressure, lo_p, hi_p, "Pa")?;
        let index = self
            .node_index(node)
            .ok_or_else(|| super::unknown_node(node, &self.nodes))?;
        let NodeKind::Junction { outflow: base } = self.nodes[index].kind else {
            return Err(Error::invalid(
                "node",
                format!(
                    "\"{node}\" is a fixed-head node; a flow is drawn at a junction (add one beside it)"
                ),
            ));
        };
        let mut net = self.clone();
        let mut solves = 0;
        let mut run = |extra: f64| {
            solves += 1;
            trial(&mut net, fluid, index, base + extra, min_pressure, at)
        };

        let start = run(0.0)?;
        if start.excess < 0.0 {
            let n = &start.solution.nodes[start.critical];
            return Err(Error::no_solution(format!(
                "no flow is available at node \"{node}\": at the given demands the pressure at \"{}\" is already {} Pa, below min_pressure {min_pressure} Pa",
                n.name, n.pressure
            )));
        }
        // Bracket: `lo` meets the minimum, `hi` does not (or cannot be solved).
        let (mut lo, mut lo_t) = (0.0, start);
        let mut hi = FIRST_TRIAL;
        let mut g_hi = loop {
            if lo_t.excess == 0.0 {
                break None;
            }
            match run(hi) {
                Ok(t) if t.excess >= 0.0 => {
                    (lo, lo_t) = (hi, t);
                    if hi >= OUTFLOW_LIMIT {
                        return Err(Error::no_solution(format!(
                            "the pressure at node \"{node}\" stays above min_pressure {min_pressure} Pa even with {hi} m³/s drawn; check the fixed heads"
                        )));
                    }
                    hi = (hi * GROWTH).min(OUTFLOW_LIMIT);
                }
                Ok(t) => break Some(t.excess),
                Err(_) => break None,
            }
        };
        // Illinois steps where both ends are known, bisection where the upper end failed.
        let mut side = 0i8;
        let mut g_lo = lo_t.excess;
        for _ in 0..MAX_STEPS {
            if g_lo == 0.0 || hi - lo <= TOLERANCE * hi {
                break;
            }
            let mid = match g_hi {
                Some(gh) => {
                    let q = lo + (hi - lo) * g_lo / (g_lo - gh);
                    if q > lo && q < hi { q } else { 0.5 * (lo + hi) }
                }
                None => 0.5 * (lo + hi),
            };
            match run(mid) {
                Ok(t) if t.excess >= 0.0 => {
                    g_lo = t.excess;
                    (lo, lo_t) = (mid, t);
                    if side == 1 {
                        g_hi = g_hi.map(|gh| 0.5 * gh);
                    }
                    side = 1;
                }
                Ok(t) => {
                    (hi, g_hi) = (mid, Some(t.excess));
                    if side == -1 {
                        g_lo *= 0.5;
                    }
                    side = -1;
                }
                Err(_) => {
                    (hi, g_hi, side) = (mid, None, 0);
                }
            }
        }
        let pressure = lo_t.solution.nodes[index].pressure;
        let critical = lo_t.solution.nodes[lo_t.critical].name.clone();
        Ok(AvailableFlow {
            flow: lo,
            pressure,
            critical,
            solution: lo_t.solution,
            solves,
        })
    }
}

/// Solves `net` with `outflow` at junction `index`: the lowest pressure in scope minus
/// the minimum (Pa) and the junction where it occurs.
fn trial(
    net: &mut Network,
    fluid: &Fluid,
    index: usize,
    outflow: f64,
    min_pressure: f64,
    at: LimitAt,
) -> Result<Trial> {
    net.nodes[index].kind = NodeKind::Junction { outflow };
    let solution = net.solve(fluid)?;
    let (critical, lowest) = match at {
        LimitAt::Node => (index, solution.nodes[index].pressure),
        LimitAt::EveryJunction => solution
            .nodes
            .iter()
            .enumerate()
            .filter(|(_, n)| !n.fixed)
            .map(|(i, n)| (i, n.pressure))
            .fold((index, f64::INFINITY), |best, cur| {
                if cur.1 < best.1 { cur } else { best }
            }),
    };
    Ok(Trial {
        excess: lowest - min_pressure,
        critical,
        solution,
    })
}
