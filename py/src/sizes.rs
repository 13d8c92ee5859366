//! Standard pipe tables (`hydrograde.pipe_tables`, `pipe_sizes`, `pipe_size`,
//! `pipe_size_dn`, `smallest_pipe`).

use crate::arrays::si;
use crate::errors::CoreResult;
use hydrograde::sizes::{self, PipeSize, PipeTable};
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList};

/// The dict form of a standard size (diameters and wall in m).
pub fn size_dict<'py>(py: Python<'py>, s: &PipeSize) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("table", s.table.name())?;
    d.set_item("nominal", &s.nominal)?;
    d.set_item("schedule", &s.schedule)?;
    d.set_item("outside_diameter", s.outside_diameter)?;
    d.set_item("wall", s.wall)?;
    d.set_item("minimum_wall", s.minimum_wall)?;
    d.set_item("inside_diameter", s.inside_diameter)?;
    Ok(d)
}

fn table(name: &str) -> PyResult<PipeTable> {
    name.parse::<PipeTable>().py()
}

/// The pipe tables (the order of Rust's ``sizes::pipe_tables()`` and C's
/// ``hg_pipe_tables``): one dict per table with ``name``, ``source``, ``wall_rule`` and
/// ``schedules``.
#[pyfunction]
pub fn pipe_tables(py: Python<'_>) -> PyResult<Bound<'_, PyList>> {
    let list = PyList::empty(py);
    for &t in sizes::pipe_tables() {
        let d = PyDict::new(py);
        d.set_item("name", t.name())?;
        d.set_item("source", t.source())?;
        d.set_item("wall_rule", t.wall_rule())?;
        d.set_item("schedules", t.schedules().to_vec())?;
        list.append(d)?;
    }
    Ok(list)
}

/// Every size of table ``table`` (a name from ``pipe_tables()``: ``"steel"``,
/// ``"pe_iso4427"``, …) as dicts (m; ``minimum_wall`` is None where the standard prints
/// a nominal wall).
#[pyfunction]
pub fn pipe_sizes<'py>(py: Python<'py>, table: &str) -> PyResult<Bound<'py, PyList>> {
    let list = PyList::empty(py);
    for s in self::table(table)?.sizes() {
        list.append(size_dict(py, &s)?)?;
    }
    Ok(list)
}

/// The standard size ``nominal`` (as printed, e.g. ``"2"``, ``"1-1/2"``) in
/// ``schedule`` (e.g. ``"40"``, ``"K"``) of ``table``, as a dict (m).
#[pyfunction]
pub fn pipe_size<'py>(
    py: Python<'py>,
    table: &str,
    nominal: &str,
    schedule: &str,
) -> PyResult<Bound<'py, PyDict>> {
    size_dict(
        py,
        &sizes::lookup(self::table(table)?, nominal, schedule).py()?,
    )
}

/// The metric tube of nominal size ``dn`` (DN) in ``schedule`` of ``table``
/// (``"steel_en10220"``, ``"stainless_iso1127"``: DN 50 is 60.3 mm; ``"hygienic_din11850"``:
/// the series picks the outside diameter), as a dict (m).
#[pyfunction]
pub fn pipe_size_dn<'py>(
    py: Python<'py>,
    table: &str,
    dn: u32,
    schedule: &str,
) -> PyResult<Bound<'py, PyDict>> {
    size_dict(
        py,
        &sizes::lookup_dn(self::table(table)?, dn, schedule).py()?,
    )
}

/// The smallest size of ``table`` in ``schedule`` whose inside diameter is at least
/// ``min_inside_diameter`` (m), as a dict.
#[pyfunction]
pub fn smallest_pipe<'py>(
    py: Python<'py>,
    table: &str,
    schedule: &str,
    #[pyo3(from_py_with = si::min_inside_diameter)] min_inside_diameter: f64,
) -> PyResult<Bound<'py, PyDict>> {
    size_dict(
        py,
        &sizes::smallest_at_least(self::table(table)?, schedule, min_inside_diameter).py()?,
    )
}
