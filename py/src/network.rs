//! `hydrograde.Network` and its solution.

use crate::arrays::si;
use crate::band::PyBand;
use crate::errors::CoreResult;
use crate::fluid::PyFluid;
use crate::line::PyLine;
use crate::line_result::PyLineResult;
use crate::state;
use hydrograde::network::{
    AvailableFlow, LimitAt, LinkResult, Network, NetworkBands, NetworkSolution, NodeKind,
    NodeResult,
};
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList};
use std::sync::Arc;

/// A network of nodes joined by lines: branched and looped systems.
///
/// Add nodes first (:meth:`node` for a junction, :meth:`fixed_head` for a tank,
/// reservoir or main at a known head), then the links that join them (:meth:`link`),
/// then :meth:`solve` for a fluid. Solved by the global gradient method (Todini and
/// Pilati, 1988) with a sparse Cholesky factorisation; check valves close against
/// reverse head. Units SI: m, m³/s, Pa.
///
/// Results are engineering estimates with stated uncertainty; designs must be checked
/// by a competent engineer (licensed or registered where the law requires it) against
/// the codes and standards that apply where they are built.
#[pyclass(name = "Network", module = "hydrograde._native")]
pub struct PyNetwork {
    inner: Network,
}

#[pymethods]
impl PyNetwork {
    #[new]
    fn new() -> Self {
        PyNetwork {
            inner: Network::new(),
        }
    }

    /// Adds a junction ``name`` at ``elevation`` (m) where ``outflow`` (m³/s) leaves
    /// the system (negative for an inflow).
    /// ``x``, ``y``: optional plan position for drawing (see :meth:`place`).
    #[pyo3(signature = (name, *, elevation, outflow = 0.0, x = None, y = None))]
    fn node(
        &mut self,
        name: &str,
        #[pyo3(from_py_with = si::elevation)] elevation: f64,
        #[pyo3(from_py_with = si::outflow)] outflow: f64,
        x: Option<f64>,
        y: Option<f64>,
    ) -> PyResult<()> {
        let position = position(x, y)?;
        self.inner.node(name, elevation, outflow).py()?;
        self.place_opt(name, position)
    }

    /// Places node ``name`` at plan position (``x``, ``y``) (m, or any plan unit used
    /// consistently) for drawing; the hydraulics do not use it.
    fn place(&mut self, name: &str, x: f64, y: f64) -> PyResult<()> {
        self.inner.place(name, x, y).py()
    }

    /// Adds a node ``name`` held at ``head`` (m): a tank level or a main at a known
    /// pressure. ``elevation`` (m) is where its pressure is read (default: at the
    /// head, a free surface).
    /// ``x``, ``y``: optional plan position for drawing (see :meth:`place`).
    #[pyo3(signature = (name, *, head, elevation = None, x = None, y = None))]
    fn fixed_head(
        &mut self,
        name: &str,
        #[pyo3(from_py_with = si::head)] head: f64,
        #[pyo3(from_py_with = si::opt_elevation)] elevation: Option<f64>,
        x: Option<f64>,
        y: Option<f64>,
    ) -> PyResult<()> {
        let position = position(x, y)?;
        self.inner.fixed_head(name, head, elevation).py()?;
        self.place_opt(name, position)
    }

    /// Adds a link ``name`` carrying ``line`` from node ``upstream`` to node
    /// ``downstream`` (positive flow runs that way).
    fn link(
        &mut self,
        name: &str,
        upstream: &str,
        downstream: &str,
        line: &PyLine,
    ) -> PyResult<()> {
        self.inner
            .link(name, upstream, downstream, line.inner.clone())
            .py()
    }

    /// Node names, in the order added.
    #[getter]
    fn node_names(&self) -> Vec<String> {
        self.inner.nodes().iter().map(|n| n.name.clone()).collect()
    }

    /// Link names, in the order added.
    #[getter]
    fn link_names(&self) -> Vec<String> {
        self.inner.links().iter().map(|l| l.name.clone()).collect()
    }

    /// Solves the network for ``fluid``: a :class:`NetworkSolution`.
    fn solve(&self, py: Python<'_>, fluid: &PyFluid) -> PyResult<PyNetworkSolution> {
        let net = self.inner.clone();
        let s = py.detach(|| net.solve(&fluid.inner)).py()?;
        Ok(PyNetworkSolution::new(s, &self.inner))
    }

    /// The flow available at junction ``node`` at a minimum residual pressure: the
    /// largest extra outflow (m³/s, beyond the node's own demand) with which the static
    /// gauge pressure stays at or above ``min_pressure`` (Pa) at the node, or at every
    /// junction with ``every_junction=True``. An :class:`AvailableFlow`. Each trial is a
    /// full solve (bracket, then Illinois regula falsi to 1e-10 of the flow).
    #[pyo3(signature = (fluid, node, min_pressure, *, every_junction = false))]
    fn available_flow(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        node: &str,
        #[pyo3(from_py_with = si::min_pressure)] min_pressure: f64,
        every_junction: bool,
    ) -> PyResult<PyAvailableFlow> {
        let at = if every_junction {
            LimitAt::EveryJunction
        } else {
            LimitAt::Node
        };
        let net = self.inner.clone();
        let a = py
            .detach(|| net.available_flow(&fluid.inner, node, min_pressure, at))
            .py()?;
        PyAvailableFlow::new(py, a, &self.inner)
    }

    /// The network as plain data: ``nodes`` (name, kind ``"junction"`` or
    /// ``"fixed_head"``, elevation m, outflow m³/s or head m, x, y) and ``links`` (name,
    /// upstream, downstream, number of elements).
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let nodes = PyList::empty(py);
        for n in self.inner.nodes() {
            let d = PyDict::new(py);
            d.set_item("name", &n.name)?;
            match n.kind {
                NodeKind::Junction { outflow } => {
                    d.set_item("kind", "junction")?;
                    d.set_item("elevation", n.elevation)?;
                    d.set_item("outflow", outflow)?;
                    d.set_item("head", py.None())?;
                }
                NodeKind::FixedHead { head } => {
                    d.set_item("kind", "fixed_head")?;
                    d.set_item("elevation", n.elevation)?;
                    d.set_item("outflow", py.None())?;
                    d.set_item("head", head)?;
                }
            }
            d.set_item("x", n.position.map(|p| p[0]))?;
            d.set_item("y", n.position.map(|p| p[1]))?;
            nodes.append(d)?;
        }
        let links = PyList::empty(py);
        for l in self.inner.links() {
            let d = PyDict::new(py);
            d.set_item("name", &l.name)?;
            d.set_item("upstream", &self.inner.nodes()[l.upstream].name)?;
            d.set_item("downstream", &self.inner.nodes()[l.downstream].name)?;
            d.set_item("elements", l.line.elements().len())?;
            links.append(d)?;
        }
        let d = PyDict::new(py);
        d.set_item("nodes", nodes)?;
        d.set_item("links", links)?;
        Ok(d)
    }

    fn _repr_html_<'py>(slf: &Bound<'py, Self>) -> PyResult<String> {
        state::html_object(slf.as_any(), "Network")
    }

    /// The per-element breakdown of link ``name``: its line evaluated at the flow of
    /// ``solution`` (a :class:`LineResult`).
    fn link_result(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        solution: &PyNetworkSolution,
        name: &str,
    ) -> PyResult<PyLineResult> {
        let r = self
            .inner
            .link_result(&fluid.inner, &solution.inner, name)
            .py()?;
        PyLineResult::new(py, r)
    }

    /// The 95 % bands of every node head and pressure and every link flow of
    /// ``solution`` (a solve of this network with ``fluid``): first order from the
    /// converged system, one solve per uncertainty source (a :class:`NetworkBands`).
    fn bands(
        &self,
        py: Python<'_>,
        fluid: &PyFluid,
        solution: &PyNetworkSolution,
    ) -> PyResult<PyNetworkBands> {
        let net = &self.inner;
        let b = py
            .detach(|| net.bands(&fluid.inner, &solution.inner))
            .py()?;
        Ok(PyNetworkBands { inner: b })
    }

    /// The network as a JSON document of hydrograde's own schema (version 1).
    fn to_json(&self) -> PyResult<String> {
        self.inner.to_json().py()
    }

    /// A network read from a JSON document of hydrograde's own schema (version 1),
    /// through the same checks as building it in code.
    #[staticmethod]
    fn from_json(text: &str) -> PyResult<Self> {
        Ok(PyNetwork {
            inner: Network::from_json(text).py()?,
        })
    }

    fn __repr__(&self) -> String {
        format!(
            "Network({} nodes, {} links)",
            self.inner.nodes().len(),
            self.inner.links().len()
        )
    }
}

/// A solved network: every node and link, the iterations and the warnings.
#[pyclass(name = "NetworkSolution", module = "hydrograde._native", frozen)]
pub struct PyNetworkSolution {
    inner: NetworkSolution,
    /// The solved network's drawing data: plan positions and link ends (node indices).
    layout: Arc<Layout>,
}

/// What a plot of a solution needs of its network.
struct Layout {
    positions: Vec<Option<[f64; 2]>>,
    ends: Vec<(usize, usize)>,
}

impl Layout {
    fn of(net: &Network) -> Arc<Layout> {
        Arc::new(Layout {
            positions: net.nodes().iter().map(|n| n.position).collect(),
            ends: net
                .links()
                .iter()
                .map(|l| (l.upstream, l.downstream))
                .collect(),
        })
    }
}

impl PyNetworkSolution {
    fn new(inner: NetworkSolution, net: &Network) -> Self {
        PyNetworkSolution {
            inner,
            layout: Layout::of(net),
        }
    }
}

/// Both of ``x`` and ``y`` or neither.
fn position(x: Option<f64>, y: Option<f64>) -> PyResult<Option<(f64, f64)>> {
    match (x, y) {
        (Some(x), Some(y)) => Ok(Some((x, y))),
        (None, None) => Ok(None),
        (Some(_), None) => Err(crate::errors::to_py(hydrograde::Error::invalid(
            "y",
            "give y together with x (a plan position has both)",
        ))),
        (None, Some(_)) => Err(crate::errors::to_py(hydrograde::Error::invalid(
            "x",
            "give x together with y (a plan position has both)",
        ))),
    }
}

impl PyNetwork {
    fn place_opt(&mut self, name: &str, position: Option<(f64, f64)>) -> PyResult<()> {
        match position {
            Some((x, y)) => self.inner.place(name, x, y).py(),
            None => Ok(()),
        }
    }
}

/// The flow available at a junction at a minimum residual pressure (SI units).
#[pyclass(name = "AvailableFlow", module = "hydrograde._native", frozen)]
pub struct PyAvailableFlow {
    flow: f64,
    pressure: f64,
    critical: String,
    solves: usize,
    solution: Py<PyNetworkSolution>,
}

impl PyAvailableFlow {
    fn new(py: Python<'_>, a: AvailableFlow, net: &Network) -> PyResult<Self> {
        Ok(PyAvailableFlow {
            flow: a.flow,
            pressure: a.pressure,
            critical: a.critical,
            solves: a.solves,
            solution: Py::new(py, PyNetworkSolution::new(a.solution, net))?,
        })
    }
}

#[pymethods]
impl PyAvailableFlow {
    /// Extra outflow at the node beyond its own demand, m³/s.
    #[getter]
    fn flow(&self) -> f64 {
        self.flow
    }
    /// Static gauge pressure at the node with that flow drawn, Pa.
    #[getter]
    fn pressure(&self) -> f64 {
        self.pressure
    }
    /// The junction where the minimum binds.
    #[getter]
    fn critical(&self) -> String {
        self.critical.clone()
    }
    /// Network solves used.
    #[getter]
    fn solves(&self) -> usize {
        self.solves
    }
    /// The network solved with the flow drawn (a :class:`NetworkSolution`).
    #[getter]
    fn solution(&self, py: Python<'_>) -> Py<PyNetworkSolution> {
        self.solution.clone_ref(py)
    }
    fn __repr__(&self) -> String {
        format!(
            "AvailableFlow(flow={:?} m³/s, pressure={:?} Pa, critical={:?})",
            self.flow, self.pressure, self.critical
        )
    }
}

fn unknown(what: &'static str, name: &str, known: Vec<&str>) -> PyErr {
    crate::errors::to_py(hydrograde::Error::unknown_name(what, name, &known))
}

#[pymethods]
impl PyNetworkSolution {
    /// Every node, in the order added.
    #[getter]
    fn nodes(&self) -> Vec<PyNodeResult> {
        self.inner
            .nodes
            .iter()
            .map(|n| PyNodeResult { inner: n.clone() })
            .collect()
    }
    /// Every link, in the order added.
    #[getter]
    fn links(&self) -> Vec<PyLinkResult> {
        self.inner
            .links
            .iter()
            .map(|l| PyLinkResult { inner: l.clone() })
            .collect()
    }
    /// The node called ``name``.
    fn node(&self, name: &str) -> PyResult<PyNodeResult> {
        self.inner
            .node(name)
            .map(|n| PyNodeResult { inner: n.clone() })
            .ok_or_else(|| {
                unknown(
                    "node",
                    name,
                    self.inner.nodes.iter().map(|n| n.name.as_str()).collect(),
                )
            })
    }
    /// The link called ``name``.
    fn link(&self, name: &str) -> PyResult<PyLinkResult> {
        self.inner
            .link(name)
            .map(|l| PyLinkResult { inner: l.clone() })
            .ok_or_else(|| {
                unknown(
                    "link",
                    name,
                    self.inner.links.iter().map(|l| l.name.as_str()).collect(),
                )
            })
    }
    /// Newton iterations used.
    #[getter]
    fn iterations(&self) -> usize {
        self.inner.iterations
    }
    /// Largest flow change of the last iteration, m³/s.
    #[getter]
    fn flow_change(&self) -> f64 {
        self.inner.flow_change
    }
    /// Largest energy imbalance of an open link at the solution, m.
    #[getter]
    fn head_imbalance(&self) -> f64 {
        self.inner.head_imbalance
    }
    /// Warnings as ``(kind, subject, message)`` tuples: kind one of
    /// ``"check_valve_closed"``, ``"velocity_above_limit"``,
    /// ``"pressure_below_atmospheric"``, ``"below_vapour_pressure"``,
    /// ``"line_warnings"``; subject the node or link name.
    #[getter]
    fn warnings(&self) -> Vec<(&'static str, String, String)> {
        self.inner
            .warnings
            .iter()
            .map(|w| (w.kind.name(), w.subject.clone(), w.message.clone()))
            .collect()
    }
    /// The solution as plain data: ``nodes`` and ``links`` (lists of dicts of the
    /// node and link fields, with each node's plan ``x``, ``y`` or None), ``iterations``,
    /// ``flow_change``, ``head_imbalance``, ``density`` and ``warnings``.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let nodes = PyList::empty(py);
        for (n, p) in self.inner.nodes.iter().zip(&self.layout.positions) {
            let d = PyDict::new(py);
            d.set_item("name", &n.name)?;
            d.set_item("fixed", n.fixed)?;
            d.set_item("elevation", n.elevation)?;
            d.set_item("head", n.head)?;
            d.set_item("pressure_head", n.pressure_head)?;
            d.set_item("pressure", n.pressure)?;
            d.set_item("outflow", n.outflow)?;
            d.set_item("x", p.map(|p| p[0]))?;
            d.set_item("y", p.map(|p| p[1]))?;
            nodes.append(d)?;
        }
        let links = PyList::empty(py);
        for (l, &(u, dn)) in self.inner.links.iter().zip(&self.layout.ends) {
            let d = PyDict::new(py);
            d.set_item("name", &l.name)?;
            d.set_item("upstream", &self.inner.nodes[u].name)?;
            d.set_item("downstream", &self.inner.nodes[dn].name)?;
            d.set_item("flow", l.flow)?;
            d.set_item("velocity", l.velocity)?;
            d.set_item("head_drop", l.head_drop)?;
            d.set_item("closed", l.closed)?;
            d.set_item("warnings", l.warnings.names())?;
            links.append(d)?;
        }
        let d = PyDict::new(py);
        d.set_item("nodes", nodes)?;
        d.set_item("links", links)?;
        d.set_item("iterations", self.inner.iterations)?;
        d.set_item("flow_change", self.inner.flow_change)?;
        d.set_item("head_imbalance", self.inner.head_imbalance)?;
        d.set_item("density", self.inner.density)?;
        d.set_item("warnings", self.warnings())?;
        Ok(d)
    }
    /// The ``"nodes"`` or ``"links"`` table as a pandas DataFrame in the display units
    /// (needs pandas); ``frame.attrs["units"]`` maps columns to units.
    #[pyo3(signature = (table = "nodes"))]
    fn to_dataframe<'py>(&self, py: Python<'py>, table: &str) -> PyResult<Bound<'py, PyAny>> {
        if table != "nodes" && table != "links" {
            return Err(crate::errors::to_py(hydrograde::Error::unknown_name(
                "table",
                table,
                &["nodes", "links"],
            )));
        }
        let d = self.to_dict(py)?;
        let rows = d
            .get_item(table)?
            .ok_or_else(|| crate::errors::to_py(hydrograde::Error::invalid("table", "missing")))?;
        let wrapped = PyDict::new(py);
        wrapped.set_item("elements", rows)?;
        state::dataframe(py, &wrapped)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "NetworkSolution", &self.to_dict(py)?)
    }
    /// The network drawn from its nodes' plan positions (needs matplotlib and every
    /// node placed): links coloured by flow with arrows in the flow direction, nodes by
    /// pressure, fixed heads as squares; on ``ax`` (a new one when None), in the display
    /// units. Returns the Axes.
    #[pyo3(signature = (ax = None))]
    fn plot<'py>(
        slf: &Bound<'py, Self>,
        ax: Option<&Bound<'py, PyAny>>,
    ) -> PyResult<Bound<'py, PyAny>> {
        slf.py()
            .import("hydrograde.plotting")?
            .call_method1("network_plot", (slf, ax))
    }
    fn __repr__(&self) -> String {
        format!(
            "NetworkSolution({} nodes, {} links, {} iterations, {} warnings)",
            self.inner.nodes.len(),
            self.inner.links.len(),
            self.inner.iterations,
            self.inner.warnings.len()
        )
    }
}

/// One node of a solved network (SI units).
#[pyclass(name = "NodeResult", module = "hydrograde._native", frozen)]
pub struct PyNodeResult {
    inner: NodeResult,
}

#[pymethods]
impl PyNodeResult {
    /// The node's name.
    #[getter]
    fn name(&self) -> String {
        self.inner.name.clone()
    }
    /// True for a fixed-head node.
    #[getter]
    fn fixed(&self) -> bool {
        self.inner.fixed
    }
    /// Piezometric head, m.
    #[getter]
    fn head(&self) -> f64 {
        self.inner.head
    }
    /// Elevation, m.
    #[getter]
    fn elevation(&self) -> f64 {
        self.inner.elevation
    }
    /// head − elevation, m.
    #[getter]
    fn pressure_head(&self) -> f64 {
        self.inner.pressure_head
    }
    /// Static gauge pressure ρ·g·(head − elevation), Pa.
    #[getter]
    fn pressure(&self) -> f64 {
        self.inner.pressure
    }
    /// Flow leaving the system here, m³/s (at a fixed head: negative when it feeds).
    #[getter]
    fn outflow(&self) -> f64 {
        self.inner.outflow
    }
    fn __repr__(&self) -> String {
        format!(
            "NodeResult({:?}, head={} m, pressure={} Pa)",
            self.inner.name, self.inner.head, self.inner.pressure
        )
    }
}

/// One link of a solved network (SI units).
#[pyclass(name = "LinkResult", module = "hydrograde._native", frozen)]
pub struct PyLinkResult {
    inner: LinkResult,
}

#[pymethods]
impl PyLinkResult {
    /// The link's name.
    #[getter]
    fn name(&self) -> String {
        self.inner.name.clone()
    }
    /// Flow, m³/s (positive from upstream to downstream).
    #[getter]
    fn flow(&self) -> f64 {
        self.inner.flow
    }
    /// Velocity of largest magnitude along the line, m/s (``None`` without a bore).
    #[getter]
    fn velocity(&self) -> Option<f64> {
        self.inner.velocity
    }
    /// Upstream head minus downstream head, m.
    #[getter]
    fn head_drop(&self) -> f64 {
        self.inner.head_drop
    }
    /// True when a check valve holds the link closed.
    #[getter]
    fn closed(&self) -> bool {
        self.inner.closed
    }
    /// The line's own warnings at the solved flow (names).
    #[getter]
    fn warnings(&self) -> Vec<&'static str> {
        self.inner.warnings.names()
    }
    fn __repr__(&self) -> String {
        format!(
            "LinkResult({:?}, flow={} m³/s, closed={})",
            self.inner.name, self.inner.flow, self.inner.closed
        )
    }
}

/// The 95 % bands of a solved network, in the order of its nodes and links.
#[pyclass(name = "NetworkBands", module = "hydrograde._native", frozen)]
pub struct PyNetworkBands {
    inner: NetworkBands,
}

fn bands_of(py: Python<'_>, b: &[hydrograde::Band]) -> PyResult<Vec<Py<PyBand>>> {
    b.iter().map(|x| PyBand::object(py, x)).collect()
}

#[pymethods]
impl PyNetworkBands {
    /// Band of each node's head, m (exact at fixed-head nodes).
    #[getter]
    fn heads(&self, py: Python<'_>) -> PyResult<Vec<Py<PyBand>>> {
        bands_of(py, &self.inner.heads)
    }

    /// Band of each node's static gauge pressure, Pa.
    #[getter]
    fn pressures(&self, py: Python<'_>) -> PyResult<Vec<Py<PyBand>>> {
        bands_of(py, &self.inner.pressures)
    }

    /// Band of each link's flow, m³/s.
    #[getter]
    fn flows(&self, py: Python<'_>) -> PyResult<Vec<Py<PyBand>>> {
        bands_of(py, &self.inner.flows)
    }

    fn __repr__(&self) -> String {
        format!(
            "NetworkBands({} nodes, {} links)",
            self.inner.heads.len(),
            self.inner.flows.len()
        )
    }
}
