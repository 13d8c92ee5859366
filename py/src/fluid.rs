//! `hydrograde.Fluid` and the broadcasting water-property functions.

use crate::arrays::{self, si};
use crate::errors::CoreResult;
use crate::state;
use hydrograde::fluid::{self as core, Fluid};
use hydrograde::units::ATMOSPHERE;
use pyo3::prelude::*;
use pyo3::types::{PyBytes, PyDict, PyType};

/// A fluid: density (kg/m³), dynamic viscosity (Pa·s), phase, and the relative standard
/// uncertainties (k = 1) of density and viscosity used by the uncertainty bands.
///
/// ``Fluid(density, viscosity)`` is a liquid given by numbers (zero uncertainty unless
/// set with :meth:`with_uncertainty`). :meth:`water` uses IAPWS-IF97 region 1 for
/// density and IAPWS 2008 for viscosity; :meth:`air` an ideal gas with Sutherland's law;
/// :meth:`gas` a user gas. Properties are engineering estimates with the stated
/// uncertainty.
#[pyclass(name = "Fluid", module = "hydrograde._native", frozen, eq)]
#[derive(Clone, PartialEq)]
pub struct PyFluid {
    /// The core value.
    pub inner: Fluid,
}

#[pymethods]
impl PyFluid {
    #[new]
    fn new(
        #[pyo3(from_py_with = si::density)] density: f64,
        #[pyo3(from_py_with = si::viscosity)] viscosity: f64,
    ) -> PyResult<Self> {
        Ok(PyFluid {
            inner: Fluid::new(density, viscosity).py()?,
        })
    }
    /// Liquid water at ``temperature`` (K) and absolute ``pressure`` (Pa, default one
    /// standard atmosphere, 101 325 Pa). IAPWS-IF97 region 1 density, IAPWS 2008
    /// viscosity, IF97 saturation line for the vapour pressure; 273.15…623.15 K.
    #[classmethod]
    #[pyo3(signature = (temperature, pressure = ATMOSPHERE))]
    fn water(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::temperature)] temperature: f64,
        #[pyo3(from_py_with = si::pressure)] pressure: f64,
    ) -> PyResult<Self> {
        Ok(PyFluid {
            inner: Fluid::water(temperature, pressure).py()?,
        })
    }
    /// Dry air at ``temperature`` (K) and absolute ``pressure`` (Pa, default 101 325 Pa):
    /// ideal gas (M = 28.9647 g/mol) with Sutherland's law; 200…1000 K, up to 2 MPa.
    #[classmethod]
    #[pyo3(signature = (temperature, pressure = ATMOSPHERE))]
    fn air(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::temperature)] temperature: f64,
        #[pyo3(from_py_with = si::pressure)] pressure: f64,
    ) -> PyResult<Self> {
        Ok(PyFluid {
            inner: Fluid::air(temperature, pressure).py()?,
        })
    }
    /// A gas of ``density`` (kg/m³) and ``viscosity`` (Pa·s) at ``temperature`` (K) and
    /// absolute ``pressure`` (Pa); its density scales as an ideal gas with pressure.
    #[classmethod]
    fn gas(
        _cls: &Bound<'_, PyType>,
        #[pyo3(from_py_with = si::density)] density: f64,
        #[pyo3(from_py_with = si::viscosity)] viscosity: f64,
        #[pyo3(from_py_with = si::temperature)] temperature: f64,
        #[pyo3(from_py_with = si::pressure)] pressure: f64,
    ) -> PyResult<Self> {
        Ok(PyFluid {
            inner: Fluid::gas(density, viscosity, temperature, pressure).py()?,
        })
    }
    /// The same fluid with relative standard uncertainties (k = 1) of density and
    /// viscosity, e.g. ``0.01`` for 1 %.
    fn with_uncertainty(
        &self,
        #[pyo3(from_py_with = si::density_rel)] density_rel: f64,
        #[pyo3(from_py_with = si::viscosity_rel)] viscosity_rel: f64,
    ) -> PyResult<Self> {
        Ok(PyFluid {
            inner: self
                .inner
                .clone()
                .with_uncertainty(density_rel, viscosity_rel)
                .py()?,
        })
    }
    /// The same fluid with its vapour pressure (Pa) set, for cavitation warnings.
    fn with_vapour_pressure(
        &self,
        #[pyo3(from_py_with = si::vapour_pressure)] vapour_pressure: f64,
    ) -> PyResult<Self> {
        Ok(PyFluid {
            inner: self
                .inner
                .clone()
                .with_vapour_pressure(vapour_pressure)
                .py()?,
        })
    }
    /// The fluid re-evaluated at absolute ``pressure`` (Pa) and its own temperature
    /// (liquids are returned unchanged).
    fn at_pressure(&self, #[pyo3(from_py_with = si::pressure)] pressure: f64) -> PyResult<Self> {
        Ok(PyFluid {
            inner: self.inner.at_pressure(pressure).py()?,
        })
    }
    /// Reynolds number ρ·|V|·D/μ (dimensionless) at ``velocity`` (m/s, either sign) in
    /// ``diameter`` (m, > 0). Floats give a float; arrays broadcast.
    fn reynolds<'py>(
        &self,
        py: Python<'py>,
        velocity: &Bound<'py, PyAny>,
        diameter: &Bound<'py, PyAny>,
    ) -> PyResult<Bound<'py, PyAny>> {
        let f = &self.inner;
        arrays::map(
            py,
            ["velocity", "diameter"],
            [velocity, diameter],
            |[v, d]| f.reynolds(v, d),
        )
    }
    /// Density ρ, kg/m³.
    #[getter]
    fn density(&self) -> f64 {
        self.inner.density()
    }
    /// Dynamic viscosity μ, Pa·s.
    #[getter]
    fn viscosity(&self) -> f64 {
        self.inner.viscosity()
    }
    /// Kinematic viscosity ν = μ/ρ, m²/s.
    #[getter]
    fn kinematic_viscosity(&self) -> f64 {
        self.inner.kinematic_viscosity()
    }
    /// "liquid" or "gas".
    #[getter]
    fn phase(&self) -> &'static str {
        self.inner.phase().name()
    }
    /// Vapour pressure, Pa, where known (else None).
    #[getter]
    fn vapour_pressure(&self) -> Option<f64> {
        self.inner.vapour_pressure()
    }
    /// Temperature, K, where known (else None).
    #[getter]
    fn temperature(&self) -> Option<f64> {
        self.inner.temperature()
    }
    /// Pressure at which the properties were evaluated, Pa, where known (else None).
    #[getter]
    fn pressure(&self) -> Option<f64> {
        self.inner.pressure()
    }
    /// Relative standard uncertainty (k = 1) of the density.
    #[getter]
    fn density_rel_uncertainty(&self) -> f64 {
        self.inner.density_rel_uncertainty()
    }
    /// Relative standard uncertainty (k = 1) of the viscosity.
    #[getter]
    fn viscosity_rel_uncertainty(&self) -> f64 {
        self.inner.viscosity_rel_uncertainty()
    }
    /// Where the properties came from: "user", "water" or "air".
    #[getter]
    fn origin(&self) -> &'static str {
        self.inner.origin().name()
    }
    /// The fields as a dict of plain Python values.
    fn to_dict<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyDict>> {
        let d = PyDict::new(py);
        d.set_item("origin", self.origin())?;
        d.set_item("phase", self.phase())?;
        d.set_item("density", self.inner.density())?;
        d.set_item("viscosity", self.inner.viscosity())?;
        d.set_item("kinematic_viscosity", self.kinematic_viscosity())?;
        d.set_item("temperature", self.inner.temperature())?;
        d.set_item("pressure", self.inner.pressure())?;
        d.set_item("vapour_pressure", self.inner.vapour_pressure())?;
        d.set_item(
            "density_rel_uncertainty",
            self.inner.density_rel_uncertainty(),
        )?;
        d.set_item(
            "viscosity_rel_uncertainty",
            self.inner.viscosity_rel_uncertainty(),
        )?;
        Ok(d)
    }
    /// A one-row pandas DataFrame (needs pandas).
    fn to_dataframe<'py>(&self, py: Python<'py>) -> PyResult<Bound<'py, PyAny>> {
        state::dataframe(py, &self.to_dict(py)?)
    }
    fn _repr_html_(&self, py: Python<'_>) -> PyResult<String> {
        state::html(py, "Fluid", &self.to_dict(py)?)
    }
    fn __repr__(&self) -> String {
        let f = &self.inner;
        let mut s = format!(
            "Fluid.{}(density={:?}, viscosity={:?}",
            self.origin(),
            f.density(),
            f.viscosity()
        );
        if let Some(t) = f.temperature() {
            s += &format!(", temperature={t:?}");
        }
        if let Some(p) = f.pressure() {
            s += &format!(", pressure={p:?}");
        }
        s += &format!(", phase='{}')", self.phase());
        s
    }
    fn __reduce__<'py>(
        slf: &Bound<'py, Self>,
    ) -> PyResult<(Bound<'py, PyAny>, (Bound<'py, PyBytes>,))> {
        state::reduce(slf.as_any(), &slf.get().inner)
    }
    #[classmethod]
    fn _from_state(_cls: &Bound<'_, PyType>, state: &[u8]) -> PyResult<Self> {
        Ok(PyFluid {
            inner: state::loads(state)?,
        })
    }
}

/// Density of liquid water, kg/m³, at ``temperature`` (K) and absolute ``pressure`` (Pa,
/// default 101 325 Pa): IAPWS-IF97 region 1. Floats give a float; arrays broadcast.
#[pyfunction]
#[pyo3(signature = (temperature, pressure = None))]
pub fn water_density<'py>(
    py: Python<'py>,
    temperature: &Bound<'py, PyAny>,
    pressure: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyAny>> {
    water_property(py, temperature, pressure, |f| f.density())
}

/// Dynamic viscosity of liquid water, Pa·s, at ``temperature`` (K) and absolute
/// ``pressure`` (Pa, default 101 325 Pa): IAPWS 2008. Floats give a float; arrays broadcast.
#[pyfunction]
#[pyo3(signature = (temperature, pressure = None))]
pub fn water_viscosity<'py>(
    py: Python<'py>,
    temperature: &Bound<'py, PyAny>,
    pressure: Option<&Bound<'py, PyAny>>,
) -> PyResult<Bound<'py, PyAny>> {
    water_property(py, temperature, pressure, |f| f.viscosity())
}

fn water_property<'py>(
    py: Python<'py>,
    temperature: &Bound<'py, PyAny>,
    pressure: Option<&Bound<'py, PyAny>>,
    pick: fn(&Fluid) -> f64,
) -> PyResult<Bound<'py, PyAny>> {
    match pressure {
        Some(p) => arrays::map(
            py,
            ["temperature", "pressure"],
            [temperature, p],
            |[t, p]| Fluid::water(t, p).map(|f| pick(&f)),
        ),
        None => arrays::map(py, ["temperature"], [temperature], |[t]| {
            Fluid::water(t, ATMOSPHERE).map(|f| pick(&f))
        }),
    }
}

/// Vapour (saturation) pressure of water, Pa, at ``temperature`` (K), 273.15…647.096 K:
/// IAPWS-IF97 saturation line. Floats give a float; arrays broadcast.
#[pyfunction]
pub fn water_vapour_pressure<'py>(
    py: Python<'py>,
    temperature: &Bound<'py, PyAny>,
) -> PyResult<Bound<'py, PyAny>> {
    arrays::map(py, ["temperature"], [temperature], |[t]| {
        core::water_vapour_pressure(t)
    })
}

/// Saturation temperature of water, K, at absolute ``pressure`` (Pa), 611.213 Pa…22.064
/// MPa: IAPWS-IF97 saturation line. Floats give a float; arrays broadcast.
#[pyfunction]
pub fn water_saturation_temperature<'py>(
    py: Python<'py>,
    pressure: &Bound<'py, PyAny>,
) -> PyResult<Bound<'py, PyAny>> {
    arrays::map(py, ["pressure"], [pressure], |[p]| {
        core::water_saturation_temperature(p)
    })
}
