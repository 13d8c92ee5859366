//! `hydrograde.Network` and its solution.

use crate::arrays::si;
use crate::band::PyBand;
use crate::errors::CoreResult;
use crate::fluid::PyFluid;
use crate::line::PyLine;
use crate::line_result::PyLineResult;
use hydrograde::network::{LinkResult, Network, NetworkBands, NetworkSolution, NodeResult};
use pyo3::prelude::*;

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
    #[pyo3(signature = (name, *, elevation, outflow = 0.0))]
    fn node(
        &mut self,
        name: &str,
        #[pyo3(from_py_with = si::elevation)] elevation: f64,
        #[pyo3(from_py_with = si::outflow)] outflow: f64,
    ) -> PyResult<()> {
        self.inner.node(name, elevation, outflow).py()
    }

    /// Adds a node ``name`` held at ``head`` (m): a tank level or a main at a known
    /// pressure. ``elevation`` (m) is where its pressure is read (default: at the
    /// head, a free surface).
    #[pyo3(signature = (name, *, head, elevation = None))]
    fn fixed_head(
        &mut self,
        name: &str,
        #[pyo3(from_py_with = si::head)] head: f64,
        #[pyo3(from_py_with = si::opt_elevation)] elevation: Option<f64>,
    ) -> PyResult<()> {
        self.inner.fixed_head(name, head, elevation).py()
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
        Ok(PyNetworkSolution { inner: s })
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
