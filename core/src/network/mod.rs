//! Networks: branched and looped systems of lines between nodes.
//!
//! A [`Network`] holds nodes and links. A junction node has an elevation `z` (m) and an
//! outflow (m³/s leaving the system there; negative for an inflow). A fixed-head node
//! holds a known piezometric head `H` (m): a tank or reservoir level, or a connection to
//! a main at a known pressure. A [`Link`] joins an upstream node to a downstream node
//! through a [`Line`], so every element a line accepts (pipes, fittings, rated
//! equipment, check valves, …) is available in a network. Positive flow runs from the
//! upstream node to the downstream node.
//!
//! # Equations
//!
//! The unknowns are the flow `Q_k` (m³/s) in every link and the head `H_n` (m) at every
//! junction. For a link `k` from node `u` to node `d`, energy:
//!
//! ```text
//! H_u − H_d = Δh_k(Q_k),   Δh_k(Q) = required_head_k(Q) − Σ rises_k
//! ```
//!
//! (the line's losses, signed with the flow; the geometric elevation change between the
//! nodes is already in their heads, so a line's own rises are not counted twice). At
//! every junction `n`, continuity: Σ inflow − Σ outflow of the links = outflow_n.
//!
//! # Method
//!
//! The global gradient method (Todini and Pilati, 1988, "A gradient algorithm for the
//! analysis of pipe networks", in Computer Applications in Water Supply, vol. 1,
//! Research Studies Press, 1–20): Newton's method on heads and flows together. Each
//! iteration linearises every link on its exact derivative `g_k = dΔh_k/dQ` (the line's
//! `drequired_head_dflow`), eliminates the flows and solves for the junction heads the
//! sparse symmetric positive definite system
//!
//! ```text
//! Σ_k∋n (H_n − H_m)/g_k = Σ_k∋n ±(Q_k − Δh_k/g_k) − outflow_n
//! ```
//!
//! by a sparse Cholesky factorisation (the `faer` crate; the symbolic analysis is done
//! once per solve), then updates the flows `Q_k ← Q_k + (H_u − H_d − Δh_k)/g_k`. The flows
//! so updated satisfy continuity at every junction to the rounding of the linear solve.
//! The iteration stops when both the largest flow change (relative to the largest flow)
//! and the largest energy imbalance of a link (m) are below their tolerances
//! ([`NetworkOptions`]); it fails with [`Error::NoSolution`] naming the worst link when
//! the iteration limit comes first.
//!
//! A link whose line stops reverse flow (a check or foot valve) closes when Newton would
//! drive flow backwards through it: it leaves the system with zero flow, and re-opens
//! when the head difference across it exceeds what forward flow needs at zero flow. The
//! iteration is not called converged in a step where any link changed state.
//!
//! # Results
//!
//! Flow, velocity (the largest along the link's line) and head drop of every link; head,
//! pressure head and gauge static pressure ρg(H − z) of every junction (with fixed heads
//! taken at atmospheric pressure on a free surface unless an elevation is given); the
//! flow every fixed-head node supplies; warnings for closed check valves, velocities above
//! the limit, pressures below atmospheric or below the vapour pressure, and each line's
//! own warnings. The per-element breakdown of a link is its line evaluated at the solved
//! flow ([`Network::link_result`]). The 95 % bands of every head, pressure and flow come
//! from [`Network::bands`]: first order from the converged system with the lines' own
//! uncertainty sources, one extra solve per source on the same factorisation.
//!
//! # Example
//!
//! ```
//! use hydrograde::network::Network;
//! use hydrograde::{Element, Fluid, Line, Pipe, Section};
//!
//! # fn main() -> hydrograde::Result<()> {
//! let pipe = |l: f64| -> hydrograde::Result<Line> {
//!     Line::new(vec![Element::Pipe(Pipe::new(Section::circle(0.1)?, l, 4.5e-5)?)])
//! };
//! let mut net = Network::new();
//! net.fixed_head("tank", 40.0, None)?;
//! net.node("a", 5.0, 0.004)?;
//! net.node("b", 8.0, 0.003)?;
//! net.link("main", "tank", "a", pipe(300.0)?)?;
//! net.link("branch", "a", "b", pipe(150.0)?)?;
//! let water = Fluid::water(288.15, 101_325.0)?;
//! let solution = net.solve(&water)?;
//! let b = solution.node("b").expect("node b exists");
//! assert!(b.head < 40.0 && b.pressure > 0.0);
//! # Ok(())
//! # }
//! ```
//!
//! **Safety.** Network results are engineering estimates: the friction correlations are
//! good to about ±10 %, and demands and roughness in service are uncertain. A design
//! must be checked by a competent engineer — licensed or registered where the law
//! requires it — against the codes and standards that apply where it is built (for fire
//! mains, the fire-protection codes).

mod available;
mod bands;
mod json;
mod result;
mod solve;
mod system;

pub use available::{AvailableFlow, LimitAt};
pub use bands::{MAX_BAND_WORK, NetworkBands};
pub use json::NETWORK_JSON_VERSION;
pub use result::{LinkResult, NetworkSolution, NetworkWarning, NetworkWarningKind, NodeResult};

use crate::error::{Error, Result, check};
use crate::fluid::Fluid;
use crate::line::{Line, LineResult};
use serde::{Deserialize, Serialize};
use std::collections::HashMap;

/// Lowest and highest elevation a node accepts, m: beyond the deepest mine and the
/// highest inhabited site, so a value outside is almost surely a slip (feet, millimetres,
/// a sign).
pub const ELEVATION_LIMIT: f64 = 10_000.0;
/// Largest fixed head (in magnitude) a node accepts, m (the rise limit of a line).
pub const HEAD_LIMIT: f64 = 1e6;
/// Largest plan coordinate (in magnitude) a node accepts: about the Earth's
/// circumference in metres, so projected map coordinates fit.
pub const POSITION_LIMIT: f64 = 1e8;
/// Largest outflow (in magnitude) a node accepts, m³/s (the flow limit of the solvers).
pub const OUTFLOW_LIMIT: f64 = 1e6;

/// What a node is.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub enum NodeKind {
    /// A junction with an outflow, m³/s (leaving the system; negative for an inflow).
    Junction {
        /// Outflow, m³/s.
        outflow: f64,
    },
    /// A node at a known piezometric head, m.
    FixedHead {
        /// Head, m.
        head: f64,
    },
}

/// A node of a network.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Node {
    /// Name, unique among the nodes.
    pub name: String,
    /// Elevation, m. For a fixed-head node given without one, its head (a free surface
    /// at atmospheric pressure).
    pub elevation: f64,
    /// True when the elevation was stated (always for a junction).
    pub elevation_given: bool,
    /// Junction or fixed head.
    pub kind: NodeKind,
    /// Plan position `[x, y]` for drawing the network (m, or any plan unit used
    /// consistently); `None` when not given. It plays no part in the hydraulics.
    #[serde(default)]
    pub position: Option<[f64; 2]>,
}

/// A link of a network: a line from an upstream node to a downstream node.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Link {
    /// Name, unique among the links.
    pub name: String,
    /// Index of the upstream node.
    pub upstream: usize,
    /// Index of the downstream node.
    pub downstream: usize,
    /// The route between them.
    pub line: Line,
}

/// Solver settings of a network.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NetworkOptions {
    /// Most Newton iterations before the solve fails.
    pub max_iterations: usize,
    /// Converged when no link's flow changes by more than this share of the largest
    /// flow in one iteration.
    pub flow_tolerance: f64,
    /// Converged when no link's energy balance is off by more than this, m.
    pub head_tolerance: f64,
    /// Velocity above which a link gets a warning, m/s (3 m/s: common practice for
    /// water mains).
    pub velocity_limit: f64,
}

impl Default for NetworkOptions {
    fn default() -> Self {
        NetworkOptions {
            max_iterations: 100,
            flow_tolerance: 1e-11,
            head_tolerance: 1e-9,
            velocity_limit: 3.0,
        }
    }
}

impl NetworkOptions {
    /// Checks the options.
    ///
    /// # Errors
    /// No iterations allowed; a tolerance not positive or a tolerance or limit not finite.
    pub fn validate(&self) -> Result<()> {
        if self.max_iterations == 0 {
            return Err(Error::out_of_range(
                "max_iterations",
                0.0,
                "must be at least 1",
            ));
        }
        check::within("flow_tolerance", self.flow_tolerance, 1e-15, 0.1, "")?;
        check::within("head_tolerance", self.head_tolerance, 1e-15, 1.0, "m")?;
        check::positive("velocity_limit", self.velocity_limit)?;
        Ok(())
    }
}

/// A network of nodes joined by lines, built through [`Network::node`],
/// [`Network::fixed_head`] and [`Network::link`], which check every input.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Network {
    nodes: Vec<Node>,
    links: Vec<Link>,
    options: NetworkOptions,
    node_index: HashMap<String, usize>,
    link_index: HashMap<String, usize>,
}

/// Checks a node or link name: not empty, not only spaces.
fn check_name(what: &'static str, name: &str) -> Result<()> {
    if name.trim().is_empty() {
        return Err(Error::invalid(what, "a name must not be empty"));
    }
    Ok(())
}

/// An unknown-node error listing up to a few known names.
fn unknown_node(given: &str, nodes: &[Node]) -> Error {
    const SHOWN: usize = 12;
    let mut known: Vec<&str> = nodes.iter().take(SHOWN).map(|n| n.name.as_str()).collect();
    if nodes.is_empty() {
        known.push("(none: add nodes before the links that join them)");
    } else if nodes.len() > SHOWN {
        known.push("…");
    }
    Error::unknown_name("node", given, &known)
}

impl Network {
    /// An empty network with default options.
    pub fn new() -> Network {
        Network::default()
    }

    /// The nodes, in the order they were added.
    pub fn nodes(&self) -> &[Node] {
        &self.nodes
    }

    /// The links, in the order they were added.
    pub fn links(&self) -> &[Link] {
        &self.links
    }

    /// The solver options.
    pub fn options(&self) -> &NetworkOptions {
        &self.options
    }

    /// Sets the solver options.
    ///
    /// # Errors
    /// The errors of [`NetworkOptions::validate`].
    pub fn set_options(&mut self, options: NetworkOptions) -> Result<()> {
        options.validate()?;
        self.options = options;
        Ok(())
    }

    /// The index of the node called `name`.
    pub fn node_index(&self, name: &str) -> Option<usize> {
        self.node_index.get(name).copied()
    }

    /// The index of the link called `name`.
    pub fn link_index(&self, name: &str) -> Option<usize> {
        self.link_index.get(name).copied()
    }

    fn add_node(&mut self, node: Node) -> Result<()> {
        check_name("name", &node.name)?;
        if self.node_index.contains_key(&node.name) {
            return Err(Error::invalid(
                "name",
                format!("a node called \"{}\" is already in the network", node.name),
            ));
        }
        self.node_index.insert(node.name.clone(), self.nodes.len());
        self.nodes.push(node);
        Ok(())
    }

    /// Adds a junction `name` at `elevation` m where `outflow` m³/s leaves the system
    /// (negative for an inflow).
    ///
    /// # Errors
    /// An empty or repeated name; an elevation outside ±[`ELEVATION_LIMIT`]; an outflow
    /// not finite or beyond ±[`OUTFLOW_LIMIT`].
    pub fn node(&mut self, name: &str, elevation: f64, outflow: f64) -> Result<()> {
        check::within(
            "elevation",
            elevation,
            -ELEVATION_LIMIT,
            ELEVATION_LIMIT,
            "m",
        )?;
        check::within("outflow", outflow, -OUTFLOW_LIMIT, OUTFLOW_LIMIT, "m³/s")?;
        self.add_node(Node {
            name: name.to_string(),
            elevation,
            elevation_given: true,
            kind: NodeKind::Junction { outflow },
            position: None,
        })
    }

    /// Adds a node `name` held at head `head` m (a tank level, or a main at a known
    /// pressure). `elevation` (m) is where its pressure is read; `None` puts it at the
    /// head (a free surface at atmospheric pressure).
    ///
    /// # Errors
    /// An empty or repeated name; a head beyond ±[`HEAD_LIMIT`]; an elevation outside
    /// ±[`ELEVATION_LIMIT`].
    pub fn fixed_head(&mut self, name: &str, head: f64, elevation: Option<f64>) -> Result<()> {
        check::within("head", head, -HEAD_LIMIT, HEAD_LIMIT, "m")?;
        if let Some(z) = elevation {
            check::within("elevation", z, -ELEVATION_LIMIT, ELEVATION_LIMIT, "m")?;
        }
        self.add_node(Node {
            name: name.to_string(),
            elevation: elevation.unwrap_or(head),
            elevation_given: elevation.is_some(),
            kind: NodeKind::FixedHead { head },
            position: None,
        })
    }

    /// Places node `name` at plan position (`x`, `y`) (m, or any plan unit used
    /// consistently), for drawing the network; the hydraulics do not use it.
    ///
    /// # Errors
    /// An unknown node; a coordinate not finite or beyond ±[`POSITION_LIMIT`].
    pub fn place(&mut self, name: &str, x: f64, y: f64) -> Result<()> {
        check::within("x", x, -POSITION_LIMIT, POSITION_LIMIT, "")?;
        check::within("y", y, -POSITION_LIMIT, POSITION_LIMIT, "")?;
        let i = self
            .node_index(name)
            .ok_or_else(|| unknown_node(name, &self.nodes))?;
        self.nodes[i].position = Some([x, y]);
        Ok(())
    }

    /// Adds a link `name` carrying `line` from node `upstream` to node `downstream`
    /// (positive flow runs that way). A line with rises must rise by the elevation
    /// difference of its nodes (within 1 mm) where both elevations are stated.
    ///
    /// # Errors
    /// An empty or repeated name; an unknown node ([`Error::UnknownName`]); a link from a
    /// node to itself; rises that disagree with the nodes' elevations.
    pub fn link(&mut self, name: &str, upstream: &str, downstream: &str, line: Line) -> Result<()> {
        check_name("name", name)?;
        if self.link_index.contains_key(name) {
            return Err(Error::invalid(
                "name",
                format!("a link called \"{name}\" is already in the network"),
            ));
        }
        let u = self
            .node_index(upstream)
            .ok_or_else(|| unknown_node(upstream, &self.nodes))?;
        let d = self
            .node_index(downstream)
            .ok_or_else(|| unknown_node(downstream, &self.nodes))?;
        if u == d {
            return Err(Error::invalid(
                "downstream",
                format!("link \"{name}\" joins node \"{upstream}\" to itself"),
            ));
        }
        let (nu, nd) = (&self.nodes[u], &self.nodes[d]);
        let rise = line.static_head();
        if rise != 0.0 && nu.elevation_given && nd.elevation_given {
            let dz = nd.elevation - nu.elevation;
            if (rise - dz).abs() > 1e-3 {
                return Err(Error::invalid(
                    "line",
                    format!(
                        "link \"{name}\": its rises add up to {rise} m but node \"{downstream}\" lies {dz} m above node \"{upstream}\"; the nodes' elevations set the static head (leave the rises out or make them agree)"
                    ),
                ));
            }
        }
        self.link_index.insert(name.to_string(), self.links.len());
        self.links.push(Link {
            name: name.to_string(),
            upstream: u,
            downstream: d,
            line,
        });
        Ok(())
    }

    /// Solves the network for `fluid` (see the module docs).
    ///
    /// # Errors
    /// No link; no fixed-head node; a part of the network with no fixed head; a node cut
    /// off from every fixed head by closed check valves; no convergence within
    /// [`NetworkOptions::max_iterations`] ([`Error::NoSolution`] naming the worst link);
    /// the errors of the links' lines at the flows tried.
    pub fn solve(&self, fluid: &Fluid) -> Result<NetworkSolution> {
        solve::solve(self, fluid)
    }

    /// The per-element breakdown of link `name`: its line evaluated at the solved flow.
    ///
    /// # Errors
    /// An unknown link name; the errors of [`Line::evaluate`].
    pub fn link_result(
        &self,
        fluid: &Fluid,
        solution: &NetworkSolution,
        name: &str,
    ) -> Result<LineResult> {
        let known: Vec<&str> = self.links.iter().map(|l| l.name.as_str()).collect();
        let k = self
            .link_index(name)
            .filter(|&k| k < solution.links.len())
            .ok_or_else(|| Error::unknown_name("link", name, &known))?;
        self.links[k].line.evaluate(fluid, solution.links[k].flow)
    }
}
