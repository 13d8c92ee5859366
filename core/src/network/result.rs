//! The solved state of a network: every node and link, and the warnings.

use serde::{Deserialize, Serialize};

use crate::warning::Warnings;

/// One node of a solved network.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NodeResult {
    /// The node's name.
    pub name: String,
    /// True for a fixed-head node.
    pub fixed: bool,
    /// Piezometric head, m.
    pub head: f64,
    /// Elevation, m.
    pub elevation: f64,
    /// head − elevation, m of the fluid.
    pub pressure_head: f64,
    /// Static gauge pressure ρ·g·(head − elevation), Pa (relative to the pressure on the
    /// free surfaces of the fixed-head nodes, atmospheric for open tanks).
    pub pressure: f64,
    /// Flow leaving the system at the node, m³/s: the given outflow at a junction; at a
    /// fixed-head node the net flow it takes from the links (negative when it feeds the
    /// network).
    pub outflow: f64,
}

/// One link of a solved network.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct LinkResult {
    /// The link's name.
    pub name: String,
    /// Flow, m³/s (positive from the upstream node to the downstream node).
    pub flow: f64,
    /// The velocity of largest magnitude along the link's line (its narrowest bore),
    /// m/s, signed with the flow; `None` for a line with no bore (rated equipment only).
    pub velocity: Option<f64>,
    /// Head of the upstream node minus head of the downstream node, m.
    pub head_drop: f64,
    /// True when a check or foot valve in the line holds it closed (flow 0).
    pub closed: bool,
    /// The line's own warnings at the solved flow.
    pub warnings: Warnings,
}

/// What a network warning is about.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
pub enum NetworkWarningKind {
    /// A check or foot valve holds a link closed.
    CheckValveClosed,
    /// A link's velocity exceeds the velocity limit of the options.
    VelocityAboveLimit,
    /// A junction's pressure is below the pressure on the fixed heads' free surfaces
    /// (atmospheric for open tanks): air can be drawn in at leaks, and the supply there
    /// is doubtful.
    PressureBelowAtmospheric,
    /// A junction's absolute pressure (atmospheric plus gauge) is below the liquid's
    /// vapour pressure: the liquid would flash or cavitate there.
    BelowVapourPressure,
    /// A link's line raised warnings of its own at the solved flow.
    LineWarnings,
}

impl NetworkWarningKind {
    /// Every kind, in a fixed order (the C ABI's `HG_NETWORK_WARNING_*` numbers).
    pub const ALL: [NetworkWarningKind; 5] = [
        NetworkWarningKind::CheckValveClosed,
        NetworkWarningKind::VelocityAboveLimit,
        NetworkWarningKind::PressureBelowAtmospheric,
        NetworkWarningKind::BelowVapourPressure,
        NetworkWarningKind::LineWarnings,
    ];

    /// A stable snake_case name.
    pub fn name(self) -> &'static str {
        match self {
            NetworkWarningKind::CheckValveClosed => "check_valve_closed",
            NetworkWarningKind::VelocityAboveLimit => "velocity_above_limit",
            NetworkWarningKind::PressureBelowAtmospheric => "pressure_below_atmospheric",
            NetworkWarningKind::BelowVapourPressure => "below_vapour_pressure",
            NetworkWarningKind::LineWarnings => "line_warnings",
        }
    }
}

/// A warning about one node or link.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NetworkWarning {
    /// What it is about.
    pub kind: NetworkWarningKind,
    /// The name of the node or link it concerns.
    pub subject: String,
    /// The finding in words, with the values.
    pub message: String,
}

/// A solved network.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct NetworkSolution {
    /// Every node, in the order they were added.
    pub nodes: Vec<NodeResult>,
    /// Every link, in the order they were added.
    pub links: Vec<LinkResult>,
    /// Newton iterations used.
    pub iterations: usize,
    /// Largest flow change of the last iteration, m³/s.
    pub flow_change: f64,
    /// Largest energy imbalance of an open link at the solution, m.
    pub head_imbalance: f64,
    /// Density the heads refer to, kg/m³.
    pub density: f64,
    /// Warnings, nodes first then links, each in the order added.
    pub warnings: Vec<NetworkWarning>,
}

impl NetworkSolution {
    /// The node called `name`.
    pub fn node(&self, name: &str) -> Option<&NodeResult> {
        self.nodes.iter().find(|n| n.name == name)
    }

    /// The link called `name`.
    pub fn link(&self, name: &str) -> Option<&LinkResult> {
        self.links.iter().find(|l| l.name == name)
    }
}
