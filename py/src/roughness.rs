//! Wall roughness catalogue and aging (`hydrograde.materials`, `material`, `aged_roughness`).

use crate::arrays;
use crate::errors::CoreResult;
use hydrograde::roughness::{self, Material};
use pyo3::prelude::*;
use pyo3::types::{PyDict, PyList};

fn material_dict<'py>(py: Python<'py>, m: &Material) -> PyResult<Bound<'py, PyDict>> {
    let d = PyDict::new(py);
    d.set_item("name", &m.name)?;
    d.set_item("description", &m.description)?;
    d.set_item("typical", m.typical)?;
    d.set_item("low", m.low)?;
    d.set_item("high", m.high)?;
    d.set_item("source", &m.source)?;
    Ok(d)
}

/// The wall-material catalogue: one dict per material with ``name``, ``description``,
/// ``typical``, ``low`` and ``high`` absolute roughness of new pipe (m) and ``source``.
#[pyfunction]
pub fn materials(py: Python<'_>) -> PyResult<Bound<'_, PyList>> {
    let list = PyList::empty(py);
    for m in roughness::catalogue() {
        list.append(material_dict(py, &m)?)?;
    }
    Ok(list)
}

/// The catalogue entry of wall material ``name`` (e.g. ``"commercial_steel"``) as a dict
/// (roughness in m); UnknownNameError lists the known names.
#[pyfunction]
pub fn material<'py>(py: Python<'py>, name: &str) -> PyResult<Bound<'py, PyDict>> {
    material_dict(py, &roughness::material(name).py()?)
}

/// Roughness (m) after ``years`` of service growing linearly from ``initial`` (m) at
/// ``rate`` (m/year): ε(t) = ε₀ + α·t (Colebrook & White 1937). All three broadcast.
#[pyfunction]
pub fn aged_roughness<'py>(
    py: Python<'py>,
    initial: &Bound<'py, PyAny>,
    rate: &Bound<'py, PyAny>,
    years: &Bound<'py, PyAny>,
) -> PyResult<Bound<'py, PyAny>> {
    arrays::map(
        py,
        ["initial", "rate", "years"],
        [initial, rate, years],
        |[e, a, t]| roughness::aged(e, a, t),
    )
}
