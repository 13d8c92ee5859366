//! `hydrograde.convert`, `convert_head` and `unit_names`.

use crate::arrays;
use hydrograde::units;
use pyo3::prelude::*;

/// Converts ``value`` from unit ``from_unit`` to unit ``to_unit`` (same dimension).
///
/// Factors are the exact ones of NIST SP 811 (2008), Appendix B. Names (ASCII,
/// case-sensitive; :func:`unit_names` lists them): length ``m mm cm in ft``; volume flow
/// ``m3/s L/s L/min m3/h gpm``; pressure ``Pa kPa MPa bar psi atm``; dynamic viscosity
/// ``Pa*s mPa*s cP``; temperature ``K degC degF`` (absolute temperatures); velocity
/// ``m/s ft/s``. ``value`` may be a float (gives a float) or an array (broadcasts).
///
/// Raises UnknownNameError for an unknown unit, InvalidInputError for units of different
/// dimensions or a head unit (use :func:`convert_head`), NotFiniteError for NaN/inf and
/// OutOfRangeError for a temperature below absolute zero.
#[pyfunction]
pub fn convert<'py>(
    py: Python<'py>,
    value: &Bound<'py, PyAny>,
    from_unit: &str,
    to_unit: &str,
) -> PyResult<Bound<'py, PyAny>> {
    arrays::map(py, ["value"], [value], |[v]| {
        units::convert(v, from_unit, to_unit)
    })
}

/// Converts between pressures and heads of liquid: p = ρ·g₀·h, g₀ = 9.80665 m/s²
/// (standard gravity, exact), ρ = ``density`` (kg/m³).
///
/// ``from_unit`` and ``to_unit`` are each a pressure unit (``Pa kPa MPa bar psi atm``) or
/// a head unit (``m_head``, ``ft_head``). ``value`` and ``density`` broadcast.
#[pyfunction]
pub fn convert_head<'py>(
    py: Python<'py>,
    value: &Bound<'py, PyAny>,
    from_unit: &str,
    to_unit: &str,
    density: &Bound<'py, PyAny>,
) -> PyResult<Bound<'py, PyAny>> {
    arrays::map(py, ["value", "density"], [value, density], |[v, rho]| {
        units::convert_head(v, from_unit, to_unit, rho)
    })
}

/// Every unit name :func:`convert` and :func:`convert_head` accept, grouped by dimension.
#[pyfunction]
pub fn unit_names() -> Vec<&'static str> {
    units::names()
}
