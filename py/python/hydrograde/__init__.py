"""hydrograde: pipe-flow friction and head loss for design notebooks.

The numbers come from the hydrograde Rust core (the same bits as its C ABI). Inputs and
outputs are SI: m, s, kg, Pa, K, m³/s, Pa·s, kg/m³. Functions of numbers broadcast over
numpy arrays (float64); results render as HTML tables in notebooks.

Safety: results are engineering estimates with stated uncertainty (the friction
correlations are good to about ±10 %). Designs must be checked by a competent engineer
(licensed or registered where the law requires it) against the codes and standards that
apply where they are built.
"""

from __future__ import annotations

from hydrograde import _native
from hydrograde._errors import (
    HydrogradeError,
    InvalidInputError,
    NoSolutionError,
    NotFiniteError,
    OutOfRangeError,
    UnknownNameError,
)
from hydrograde._native import (
    __version__,
    aged_roughness,
    Band,
    convert,
    convert_head,
    correlation_validity,
    correlations,
    darcy_factor,
    ElementResult,
    Equipment,
    ERROR_KINDS,
    Fitting,
    FlowSolution,
    Fluid,
    friction,
    Friction,
    Line,
    LineResult,
    material,
    materials,
    monte_carlo,
    MonteCarlo,
    Network,
    NetworkBands,
    NetworkSolution,
    OperatingPoint,
    Pipe,
    pipe_size,
    pipe_sizes,
    pipe_tables,
    PumpCurve,
    Rise,
    Section,
    set_threads,
    Sizing,
    smallest_pipe,
    Split,
    split_flow,
    threads,
    Uncertainty,
    unit_names,
    WARNING_NAMES,
    water_density,
    water_saturation_temperature,
    water_vapour_pressure,
    water_viscosity,
)
from hydrograde._units import display, display_units, quantities
from hydrograde.plotting import friction_chart as plot_friction_chart

__all__ = [
    "__version__",
    "aged_roughness",
    "Band",
    "convert",
    "convert_head",
    "correlation_validity",
    "correlations",
    "darcy_factor",
    "display",
    "display_units",
    "ElementResult",
    "Equipment",
    "ERROR_KINDS",
    "Fitting",
    "FlowSolution",
    "Fluid",
    "friction",
    "Friction",
    "HydrogradeError",
    "InvalidInputError",
    "Line",
    "LineResult",
    "material",
    "materials",
    "monte_carlo",
    "MonteCarlo",
    "Network",
    "NetworkBands",
    "NetworkSolution",
    "NoSolutionError",
    "NotFiniteError",
    "OperatingPoint",
    "OutOfRangeError",
    "Pipe",
    "pipe_size",
    "pipe_sizes",
    "pipe_tables",
    "plot_friction_chart",
    "PumpCurve",
    "quantities",
    "Rise",
    "Section",
    "set_threads",
    "Sizing",
    "smallest_pipe",
    "Split",
    "split_flow",
    "threads",
    "Uncertainty",
    "unit_names",
    "UnknownNameError",
    "WARNING_NAMES",
    "water_density",
    "water_saturation_temperature",
    "water_vapour_pressure",
    "water_viscosity",
]

del _native
