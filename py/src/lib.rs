//! Python bindings of hydrograde (module `hydrograde._native`).
//!
//! Thin by design: each wrapper holds a core value and delegates to it. This crate
//! converts types, maps errors, releases the GIL, broadcasts arrays and formats; no
//! formula, table or default value lives here. Files mirror the core's module names.

mod arrays;
mod band;
mod broadcast;
mod errors;
mod fitting;
mod fluid;
mod friction;
mod line;
mod line_result;
mod network;
mod pipe;
mod pump;
mod roughness;
mod section;
mod sizes;
mod state;
mod threads;
mod units;

use hydrograde::warning::Warnings;
use pyo3::prelude::*;

#[pymodule]
fn _native(m: &Bound<'_, PyModule>) -> PyResult<()> {
    let py = m.py();
    m.add("__version__", hydrograde::VERSION)?;
    m.add("ERROR_KINDS", errors::kinds_list(py)?)?;
    let warning_names: Vec<&str> = Warnings::ALL.iter().map(|(_, n)| *n).collect();
    m.add("WARNING_NAMES", warning_names)?;

    // friction
    m.add_function(wrap_pyfunction!(friction::darcy_factor, m)?)?;
    m.add_function(wrap_pyfunction!(friction::friction, m)?)?;
    m.add_function(wrap_pyfunction!(friction::correlations, m)?)?;
    m.add_function(wrap_pyfunction!(friction::correlation_validity, m)?)?;
    m.add_class::<friction::PyFriction>()?;

    // fluid
    m.add_class::<fluid::PyFluid>()?;
    m.add_function(wrap_pyfunction!(fluid::water_density, m)?)?;
    m.add_function(wrap_pyfunction!(fluid::water_viscosity, m)?)?;
    m.add_function(wrap_pyfunction!(fluid::water_vapour_pressure, m)?)?;
    m.add_function(wrap_pyfunction!(fluid::water_saturation_temperature, m)?)?;

    // fitting
    m.add_class::<fitting::PyFitting>()?;

    // section
    m.add_class::<section::PySection>()?;

    // pipe and line
    m.add_class::<pipe::PyPipe>()?;
    m.add_class::<pipe::PyRise>()?;
    m.add_class::<pipe::PyEquipment>()?;
    m.add_class::<pump::PyPump>()?;
    m.add_class::<pump::PyPumpedFlow>()?;
    m.add_class::<line::PyLine>()?;
    m.add_class::<line::PyPumpCurve>()?;
    m.add_function(wrap_pyfunction!(line::split_flow, m)?)?;
    m.add_class::<line_result::PyLineResult>()?;
    m.add_class::<line_result::PyElementResult>()?;
    m.add_class::<line_result::PyFlowSolution>()?;
    m.add_class::<line_result::PyOperatingPoint>()?;
    m.add_class::<line_result::PySplit>()?;
    m.add_class::<line_result::PySizing>()?;

    // network
    m.add_class::<network::PyNetwork>()?;
    m.add_class::<network::PyNetworkSolution>()?;
    m.add_class::<network::PyNetworkBands>()?;
    m.add_class::<network::PyNodeResult>()?;
    m.add_class::<network::PyLinkResult>()?;
    m.add_class::<network::PyAvailableFlow>()?;

    // roughness and sizes
    m.add_function(wrap_pyfunction!(roughness::materials, m)?)?;
    m.add_function(wrap_pyfunction!(roughness::material, m)?)?;
    m.add_function(wrap_pyfunction!(roughness::aged_roughness, m)?)?;
    m.add_function(wrap_pyfunction!(sizes::pipe_tables, m)?)?;
    m.add_function(wrap_pyfunction!(sizes::pipe_sizes, m)?)?;
    m.add_function(wrap_pyfunction!(sizes::pipe_size, m)?)?;
    m.add_function(wrap_pyfunction!(sizes::smallest_pipe, m)?)?;
    m.add_function(wrap_pyfunction!(sizes::pipe_size_dn, m)?)?;

    // band
    m.add_class::<band::PyBand>()?;
    m.add_class::<band::PyUncertainty>()?;
    m.add_class::<band::PyMonteCarlo>()?;
    m.add_function(wrap_pyfunction!(band::monte_carlo, m)?)?;
    m.add_function(wrap_pyfunction!(band::band_monte_carlo, m)?)?;

    // threads
    m.add_function(wrap_pyfunction!(threads::set_threads, m)?)?;
    m.add_function(wrap_pyfunction!(threads::threads, m)?)?;

    // units
    m.add_function(wrap_pyfunction!(units::convert, m)?)?;
    m.add_function(wrap_pyfunction!(units::convert_head, m)?)?;
    m.add_function(wrap_pyfunction!(units::unit_names, m)?)?;
    Ok(())
}
