//! Networks: nodes joined by lines, solved for heads and flows together.

use crate::ffi::{self, FfiResult, guard, out_ptr, put};
use crate::fluid::hg_fluid;
use crate::line::{give, hg_line, hg_line_result};
use hydrograde::Error;
use hydrograde::network::{LimitAt, Network, NetworkBands, NetworkSolution, NetworkWarningKind};
use std::ffi::c_char;

/// A check or foot valve holds a link closed (`hg_network_solution_warning`).
pub const HG_NETWORK_WARNING_CHECK_VALVE_CLOSED: i32 = 0;
/// A link's velocity is above the limit (3 m/s).
pub const HG_NETWORK_WARNING_VELOCITY_ABOVE_LIMIT: i32 = 1;
/// A junction's pressure is below atmospheric.
pub const HG_NETWORK_WARNING_PRESSURE_BELOW_ATMOSPHERIC: i32 = 2;
/// A junction's absolute pressure is below the liquid's vapour pressure.
pub const HG_NETWORK_WARNING_BELOW_VAPOUR_PRESSURE: i32 = 3;
/// A link's line has warnings of its own at the solved flow (`HG_WARN_*` bits of
/// `hg_network_solution_link`).
pub const HG_NETWORK_WARNING_LINE_WARNINGS: i32 = 4;

/// A network of nodes joined by lines: opaque. Made by `hg_network_new`, released by
/// `hg_network_free`. Adding nodes and links needs exclusive use of the handle; solving
/// only reads it.
pub struct hg_network {
    net: Network,
}

/// A solved network: opaque. Made by `hg_network_solve`, released by
/// `hg_network_solution_free`. It owns every number, so reading it computes nothing and
/// it stays valid after the network and the fluid are freed.
pub struct hg_network_solution {
    solution: NetworkSolution,
}

/// The 95 % bands of a solved network: opaque. Made by `hg_network_bands_new`, released
/// by `hg_network_bands_free`. It owns every number, so reading it computes nothing.
pub struct hg_network_bands {
    bands: NetworkBands,
}

/// Makes an empty network and stores it in `*out`; free it with `hg_network_free`.
///
/// Returns `HG_OK`; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `out` must be NULL or point to a writable `hg_network *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_new(out: *mut *mut hg_network) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        let h = Box::into_raw(Box::new(hg_network {
            net: Network::new(),
        }));
        // SAFETY: checked above.
        unsafe { put("out", out, h) }
    })
}

/// Releases a network. NULL is accepted and ignored.
///
/// # Safety
/// `network` must be NULL or a live handle from `hg_network_new`, not used afterwards.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_free(network: *mut hg_network) {
    if !network.is_null() {
        // SAFETY: the handle came from Box::into_raw in `hg_network_new`.
        ffi::guard_value((), || drop(unsafe { Box::from_raw(network) }));
    }
}

/// Adds a junction `name` at `elevation` (m, within ±10,000) where `outflow` (m³/s)
/// leaves the system (negative for an inflow).
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for an
/// empty or repeated name or text that is not UTF-8; `HG_ERR_NULL_POINTER`. Not
/// thread-safe for one network.
///
/// # Safety
/// `network` NULL or a live handle used by no other thread; `name` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_add_node(
    network: *mut hg_network,
    name: *const c_char,
    elevation: f64,
    outflow: f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let (n, name) = unsafe {
            (
                ffi::handle_mut("network", network)?,
                ffi::c_str("name", name)?,
            )
        };
        Ok(n.net.node(name, elevation, outflow)?)
    })
}

/// Adds a node `name` held at `head` (m): a tank level or a main at a known pressure.
/// `elevation` points to the elevation (m) where its pressure is read, or is NULL for a
/// free surface at the head.
///
/// Returns `HG_OK`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_INVALID` for an
/// empty or repeated name; `HG_ERR_NULL_POINTER`. Not thread-safe for one network.
///
/// # Safety
/// `network` NULL or a live handle used by no other thread; `name` NULL or a
/// NUL-terminated string; `elevation` NULL or readable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_add_fixed_head(
    network: *mut hg_network,
    name: *const c_char,
    head: f64,
    elevation: *const f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let (n, name) = unsafe {
            (
                ffi::handle_mut("network", network)?,
                ffi::c_str("name", name)?,
            )
        };
        // SAFETY: forwarded contract (NULL checked).
        let z = (!elevation.is_null()).then(|| unsafe { *elevation });
        Ok(n.net.fixed_head(name, head, z)?)
    })
}

/// Adds a link `name` carrying a copy of `line` from node `upstream` to node
/// `downstream` (positive flow runs that way). Nodes must be added first.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a node not in the network;
/// `HG_ERR_INVALID` for an empty or repeated name, a link from a node to itself, rises
/// that disagree with the nodes' elevations or a line that cannot be built;
/// `HG_ERR_NULL_POINTER`. Not thread-safe for one network.
///
/// # Safety
/// `network` NULL or a live handle used by no other thread; the strings NULL or
/// NUL-terminated; `line` NULL or a live handle.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_add_link(
    network: *mut hg_network,
    name: *const c_char,
    upstream: *const c_char,
    downstream: *const c_char,
    line: *const hg_line,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let (n, name, up, down, l) = unsafe {
            (
                ffi::handle_mut("network", network)?,
                ffi::c_str("name", name)?,
                ffi::c_str("upstream", upstream)?,
                ffi::c_str("downstream", downstream)?,
                ffi::handle("line", line)?,
            )
        };
        let line = l.line()?.clone();
        Ok(n.net.link(name, up, down, line)?)
    })
}

/// Places node `name` at plan position (`x`, `y`) (m, or any plan unit used
/// consistently; within ±1e8), for drawing the network; the hydraulics do not use it.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a node not in the network;
/// `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NULL_POINTER`. Not thread-safe for
/// one network.
///
/// # Safety
/// `network` NULL or a live handle used by no other thread; `name` NULL or a
/// NUL-terminated string.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_place_node(
    network: *mut hg_network,
    name: *const c_char,
    x: f64,
    y: f64,
) -> i32 {
    guard(|| {
        // SAFETY: forwarded contract.
        let (n, name) = unsafe {
            (
                ffi::handle_mut("network", network)?,
                ffi::c_str("name", name)?,
            )
        };
        Ok(n.net.place(name, x, y)?)
    })
}

/// The plan position of node `index` (in the order added): `x`, `y` and `*has_position`
/// (1 when placed by `hg_network_place_node`; 0 with `x` = `y` = 0 otherwise).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last node;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `network` NULL or a live handle; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_node_position(
    network: *const hg_network,
    index: usize,
    x: *mut f64,
    y: *mut f64,
    has_position: *mut i32,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("x", x),
            out_ptr("y", y),
            out_ptr("has_position", has_position),
        ])?;
        // SAFETY: forwarded contract.
        let n = unsafe { ffi::handle("network", network)? };
        let node = at(n.net.nodes(), index, "nodes")?;
        let [px, py] = node.position.unwrap_or([0.0, 0.0]);
        // SAFETY: checked above.
        unsafe {
            put("x", x, px)?;
            put("y", y, py)?;
            put(
                "has_position",
                has_position,
                i32::from(node.position.is_some()),
            )
        }
    })
}

/// The flow available at junction `node` at a minimum residual pressure: the largest
/// extra outflow (m³/s, on top of the node's own demand) with which the static gauge
/// pressure stays at or above `min_pressure` (Pa, −101,325…1e8) at the node
/// (`every_junction` = 0) or at every junction (≠ 0). Stores the flow, the node's
/// pressure at that flow (Pa), the index of the junction where the minimum binds and,
/// when `solution` is not NULL, the network solved with that flow drawn (a new
/// `hg_network_solution`; free it with `hg_network_solution_free`). Each trial is a full
/// solve (bracket, then Illinois regula falsi to 1e-10 of the flow); a draw the network
/// cannot be solved at counts as beyond the available flow.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a node not in the network;
/// `HG_ERR_INVALID` for a fixed-head node and the errors of `hg_network_solve` at the
/// given demands; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`; `HG_ERR_NO_SOLUTION` when
/// the pressure is below the minimum already at the given demands (the message names
/// the junction); `HG_ERR_NULL_POINTER`. On failure the outputs are left untouched.
/// Thread-safe (the network is only read).
///
/// # Safety
/// `network` and `fluid` NULL or live handles; `node` NULL or NUL-terminated; `flow`,
/// `pressure` and `critical` NULL or writable; `solution` NULL or a writable
/// `hg_network_solution *`.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_network_available_flow(
    network: *const hg_network,
    fluid: *const hg_fluid,
    node: *const c_char,
    min_pressure: f64,
    every_junction: i32,
    flow: *mut f64,
    pressure: *mut f64,
    critical: *mut usize,
    solution: *mut *mut hg_network_solution,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("flow", flow),
            out_ptr("pressure", pressure),
            out_ptr("critical", critical),
        ])?;
        // SAFETY: forwarded contract.
        let (n, f, name) = unsafe {
            (
                ffi::handle("network", network)?,
                ffi::handle("fluid", fluid)?,
                ffi::c_str("node", node)?,
            )
        };
        let at = if every_junction != 0 {
            LimitAt::EveryJunction
        } else {
            LimitAt::Node
        };
        let a = n.net.available_flow(&f.fluid, name, min_pressure, at)?;
        let index = n.net.node_index(&a.critical).unwrap_or(0);
        // SAFETY: checked above; `solution` is written only when not NULL.
        unsafe {
            put("flow", flow, a.flow)?;
            put("pressure", pressure, a.pressure)?;
            put("critical", critical, index)?;
            if !solution.is_null() {
                let h = Box::into_raw(Box::new(hg_network_solution {
                    solution: a.solution,
                }));
                put("solution", solution, h)?;
            }
        }
        Ok(())
    })
}

/// The number of nodes and links in the network.
///
/// Returns `HG_OK`; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `network` NULL or a live handle; `nodes` and `links` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_counts(
    network: *const hg_network,
    nodes: *mut usize,
    links: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("nodes", nodes), out_ptr("links", links)])?;
        // SAFETY: forwarded contract.
        let n = unsafe { ffi::handle("network", network)? };
        // SAFETY: checked above.
        unsafe {
            put("nodes", nodes, n.net.nodes().len())?;
            put("links", links, n.net.links().len())
        }
    })
}

/// The index (in the order added) of node `name` (`is_link` = 0) or link `name`
/// (`is_link` ≠ 0), for the `hg_network_solution_*` accessors.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `network` NULL or a live handle; `name` NULL or NUL-terminated; `index` NULL or
/// writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_index(
    network: *const hg_network,
    name: *const c_char,
    is_link: i32,
    index: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("index", index)])?;
        // SAFETY: forwarded contract.
        let (n, name) = unsafe { (ffi::handle("network", network)?, ffi::c_str("name", name)?) };
        let (what, found, known): (&'static str, _, Vec<&str>) = if is_link != 0 {
            let known = n.net.links().iter().map(|l| l.name.as_str()).collect();
            ("link", n.net.link_index(name), known)
        } else {
            let known = n.net.nodes().iter().map(|x| x.name.as_str()).collect();
            ("node", n.net.node_index(name), known)
        };
        let i = found.ok_or_else(|| Error::unknown_name(what, name, &known))?;
        // SAFETY: checked above.
        unsafe { put("index", index, i) }
    })
}

/// Solves `network` for `fluid` (global gradient method, Todini and Pilati 1988) and
/// stores the solution in `*out`; free it with `hg_network_solution_free`.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for no links, no fixed-head node, a part with no
/// fixed head or a link with no loss (the message names the node or link);
/// `HG_ERR_NO_SOLUTION` when the iteration does not converge (naming the worst link) or
/// a node is cut off by closed check valves; `HG_ERR_NULL_POINTER`. On failure `*out`
/// is left untouched. Thread-safe (the network is only read).
///
/// # Safety
/// `network` and `fluid` NULL or live handles; `out` NULL or a writable
/// `hg_network_solution *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_solve(
    network: *const hg_network,
    fluid: *const hg_fluid,
    out: *mut *mut hg_network_solution,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (n, f) = unsafe {
            (
                ffi::handle("network", network)?,
                ffi::handle("fluid", fluid)?,
            )
        };
        let solution = n.net.solve(&f.fluid)?;
        let h = Box::into_raw(Box::new(hg_network_solution { solution }));
        // SAFETY: checked above.
        unsafe { put("out", out, h) }
    })
}

/// Releases a solution. NULL is accepted and ignored.
///
/// # Safety
/// `solution` must be NULL or a live handle from `hg_network_solve`, not used
/// afterwards.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_solution_free(solution: *mut hg_network_solution) {
    if !solution.is_null() {
        // SAFETY: the handle came from Box::into_raw in `hg_network_solve`.
        ffi::guard_value((), || drop(unsafe { Box::from_raw(solution) }));
    }
}

/// Newton iterations used, the largest flow change of the last one (m³/s), the largest
/// energy imbalance of a link at the solution (m) and the number of warnings.
///
/// Returns `HG_OK`; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `solution` NULL or a live handle; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_solution_summary(
    solution: *const hg_network_solution,
    iterations: *mut usize,
    flow_change: *mut f64,
    head_imbalance: *mut f64,
    warnings: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("iterations", iterations),
            out_ptr("flow_change", flow_change),
            out_ptr("head_imbalance", head_imbalance),
            out_ptr("warnings", warnings),
        ])?;
        // SAFETY: forwarded contract.
        let s = unsafe { &ffi::handle("solution", solution)?.solution };
        // SAFETY: checked above.
        unsafe {
            put("iterations", iterations, s.iterations)?;
            put("flow_change", flow_change, s.flow_change)?;
            put("head_imbalance", head_imbalance, s.head_imbalance)?;
            put("warnings", warnings, s.warnings.len())
        }
    })
}

fn at<'a, T>(items: &'a [T], index: usize, what: &str) -> FfiResult<&'a T> {
    items.get(index).ok_or_else(|| {
        Error::out_of_range(
            "index",
            index as f64,
            format!("must be below the number of {what} ({})", items.len()),
        )
        .into()
    })
}

/// Node `index` (in the order added) of a solution: piezometric `head` (m), `elevation`
/// (m), static gauge `pressure` ρg(head − elevation) (Pa) and `outflow` (m³/s leaving
/// the system; at a fixed-head node negative when it feeds the network).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last node;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `solution` NULL or a live handle; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_solution_node(
    solution: *const hg_network_solution,
    index: usize,
    head: *mut f64,
    elevation: *mut f64,
    pressure: *mut f64,
    outflow: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("head", head),
            out_ptr("elevation", elevation),
            out_ptr("pressure", pressure),
            out_ptr("outflow", outflow),
        ])?;
        // SAFETY: forwarded contract.
        let s = unsafe { &ffi::handle("solution", solution)?.solution };
        let n = at(&s.nodes, index, "nodes")?;
        // SAFETY: checked above.
        unsafe {
            put("head", head, n.head)?;
            put("elevation", elevation, n.elevation)?;
            put("pressure", pressure, n.pressure)?;
            put("outflow", outflow, n.outflow)
        }
    })
}

/// Link `index` (in the order added) of a solution: `flow` (m³/s, positive from
/// upstream to downstream), `velocity` (m/s, the largest along the line; 0 with
/// `*has_velocity` = 0 for a line with no bore), `head_drop` (m, upstream head minus
/// downstream head), `closed` (1 when a check valve holds it shut) and `warnings` (the
/// line's own `HG_WARN_*` bits at the solved flow).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last link;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `solution` NULL or a live handle; the outputs NULL or writable.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_network_solution_link(
    solution: *const hg_network_solution,
    index: usize,
    flow: *mut f64,
    velocity: *mut f64,
    has_velocity: *mut i32,
    head_drop: *mut f64,
    closed: *mut i32,
    warnings: *mut u32,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("flow", flow),
            out_ptr("velocity", velocity),
            out_ptr("has_velocity", has_velocity),
            out_ptr("head_drop", head_drop),
            out_ptr("closed", closed),
            out_ptr("warnings", warnings),
        ])?;
        // SAFETY: forwarded contract.
        let s = unsafe { &ffi::handle("solution", solution)?.solution };
        let l = at(&s.links, index, "links")?;
        // SAFETY: checked above.
        unsafe {
            put("flow", flow, l.flow)?;
            put("velocity", velocity, l.velocity.unwrap_or(0.0))?;
            put(
                "has_velocity",
                has_velocity,
                i32::from(l.velocity.is_some()),
            )?;
            put("head_drop", head_drop, l.head_drop)?;
            put("closed", closed, i32::from(l.closed))?;
            put("warnings", warnings, l.warnings.bits())
        }
    })
}

/// Warning `index` of a solution: its `kind` (`HG_NETWORK_WARNING_*`) and its message
/// (naming the node or link and the values) copied into `buf` like `snprintf`, with the
/// full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last warning;
/// `HG_ERR_BUFFER_TOO_SMALL` (the kind, the needed length and a cut copy are stored);
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `solution` NULL or a live handle; `kind` and `needed` NULL or writable; `buf` NULL or
/// valid for `len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_solution_warning(
    solution: *const hg_network_solution,
    index: usize,
    kind: *mut i32,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("kind", kind), out_ptr("needed", needed)])?;
        // SAFETY: forwarded contract.
        let s = unsafe { &ffi::handle("solution", solution)?.solution };
        let w = at(&s.warnings, index, "warnings")?;
        let code = NetworkWarningKind::ALL
            .iter()
            .position(|k| *k == w.kind)
            .map_or(-1, |i| i as i32);
        // SAFETY: checked above; forwarded contract for the buffer.
        unsafe {
            put("kind", kind, code)?;
            ffi::copy_name(&w.message, buf, len, needed)
        }
    })
}

/// The per-element breakdown of link `index`: its line evaluated for `fluid` at the flow
/// of `solution`, stored in `*out` as a new `hg_line_result` (free it with
/// `hg_line_result_free`).
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index past the last link; the errors
/// of `hg_line_evaluate`; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `network`, `solution` and `fluid` NULL or live handles; `out` NULL or a writable
/// `hg_line_result *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_link_result(
    network: *const hg_network,
    solution: *const hg_network_solution,
    fluid: *const hg_fluid,
    index: usize,
    out: *mut *mut hg_line_result,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (n, s, f) = unsafe {
            (
                ffi::handle("network", network)?,
                ffi::handle("solution", solution)?,
                ffi::handle("fluid", fluid)?,
            )
        };
        let link = at(n.net.links(), index, "links")?;
        let r = n.net.link_result(&f.fluid, &s.solution, &link.name)?;
        // SAFETY: checked above.
        unsafe { give(out, r) }
    })
}

/// Reads a network from a JSON document of hydrograde's own schema (version 1: a
/// `"hydrograde_network": 1` field, `"nodes"`, `"links"` with each link's line, optional
/// `"options"`) and stores it in `*out`; free it with `hg_network_free`. The document goes
/// through the same checks as building in code.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for text that is not such a document, another
/// version, or any bad node, link or option (the message names it);
/// `HG_ERR_NULL_POINTER`. On failure `*out` is left untouched. Thread-safe.
///
/// # Safety
/// `text` NULL or a NUL-terminated UTF-8 string; `out` NULL or a writable `hg_network *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_from_json(
    text: *const c_char,
    out: *mut *mut hg_network,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let text = unsafe { ffi::c_str("text", text)? };
        let net = Network::from_json(text)?;
        let h = Box::into_raw(Box::new(hg_network { net }));
        // SAFETY: checked above.
        unsafe { put("out", out, h) }
    })
}

/// Computes the 95 % bands of every node head and pressure and every link flow of
/// `solution` (a solve of `network` with `fluid`): first order from the converged
/// system, one solve per uncertainty source. Stores them in `*out`; free with
/// `hg_network_bands_free`.
///
/// Returns `HG_OK`; `HG_ERR_INVALID` for a solution of another network or a network
/// whose bands would exceed the work limit (the message gives the counts);
/// `HG_ERR_NULL_POINTER`. On failure `*out` is left untouched. Thread-safe.
///
/// # Safety
/// `network`, `fluid` and `solution` NULL or live handles; `out` NULL or a writable
/// `hg_network_bands *`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_bands_new(
    network: *const hg_network,
    fluid: *const hg_fluid,
    solution: *const hg_network_solution,
    out: *mut *mut hg_network_bands,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("out", out)])?;
        // SAFETY: forwarded contract.
        let (n, f, s) = unsafe {
            (
                ffi::handle("network", network)?,
                ffi::handle("fluid", fluid)?,
                ffi::handle("solution", solution)?,
            )
        };
        let bands = n.net.bands(&f.fluid, &s.solution)?;
        let h = Box::into_raw(Box::new(hg_network_bands { bands }));
        // SAFETY: checked above.
        unsafe { put("out", out, h) }
    })
}

/// Releases network bands. NULL is accepted and ignored.
///
/// # Safety
/// `bands` must be NULL or a live handle from `hg_network_bands_new`, not used
/// afterwards.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_bands_free(bands: *mut hg_network_bands) {
    if !bands.is_null() {
        // SAFETY: the handle came from Box::into_raw in `hg_network_bands_new`.
        ffi::guard_value((), || drop(unsafe { Box::from_raw(bands) }));
    }
}

/// Writes one band's low, nominal and high ends.
fn band_out(
    band: &hydrograde::Band,
    low: *mut f64,
    nominal: *mut f64,
    high: *mut f64,
) -> FfiResult {
    // SAFETY: the callers checked the pointers.
    unsafe {
        put("low", low, band.low)?;
        put("nominal", nominal, band.nominal)?;
        put("high", high, band.high)
    }
}

/// The band of node `index`'s head (m) and of its static gauge pressure (Pa): the
/// 95 % interval `low` … `high` around the `nominal` value, for head and pressure.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index beyond the nodes;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `bands` NULL or a live handle; the outputs NULL or writable.
#[unsafe(no_mangle)]
#[allow(clippy::too_many_arguments)]
pub unsafe extern "C" fn hg_network_bands_node(
    bands: *const hg_network_bands,
    index: usize,
    head_low: *mut f64,
    head: *mut f64,
    head_high: *mut f64,
    pressure_low: *mut f64,
    pressure: *mut f64,
    pressure_high: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("head_low", head_low),
            out_ptr("head", head),
            out_ptr("head_high", head_high),
            out_ptr("pressure_low", pressure_low),
            out_ptr("pressure", pressure),
            out_ptr("pressure_high", pressure_high),
        ])?;
        // SAFETY: forwarded contract.
        let b = unsafe { &ffi::handle("bands", bands)?.bands };
        band_out(at(&b.heads, index, "nodes")?, head_low, head, head_high)?;
        band_out(
            at(&b.pressures, index, "nodes")?,
            pressure_low,
            pressure,
            pressure_high,
        )
    })
}

/// The band of link `index`'s flow (m³/s): the 95 % interval `low` … `high` around the
/// `nominal` flow.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` for an index beyond the links;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `bands` NULL or a live handle; the outputs NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_network_bands_flow(
    bands: *const hg_network_bands,
    index: usize,
    low: *mut f64,
    nominal: *mut f64,
    high: *mut f64,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("low", low),
            out_ptr("nominal", nominal),
            out_ptr("high", high),
        ])?;
        // SAFETY: forwarded contract.
        let b = unsafe { &ffi::handle("bands", bands)?.bands };
        band_out(at(&b.flows, index, "links")?, low, nominal, high)
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn warning_codes_follow_the_core_order() {
        let names: Vec<&str> = NetworkWarningKind::ALL.iter().map(|k| k.name()).collect();
        assert_eq!(
            names,
            [
                "check_valve_closed",
                "velocity_above_limit",
                "pressure_below_atmospheric",
                "below_vapour_pressure",
                "line_warnings"
            ]
        );
        assert_eq!(HG_NETWORK_WARNING_LINE_WARNINGS, 4);
    }
}
