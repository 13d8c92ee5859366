"""hydrograde: pipe-flow friction and head loss for design notebooks.

The numbers come from the hydrograde Rust core (the same bits as its C ABI). Inputs and
outputs are SI: m, s, kg, Pa, K, m³/s, Pa·s, kg/m³. Functions of numbers broadcast over
numpy arrays (float64); results render as HTML tables in notebooks.

Safety: results are engineering estimates with stated uncertainty (the friction
correlations are good to about ±10 %). Designs must be checked by a competent engineer
against the codes and standards that apply where they are built.
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
    ERROR_KINDS,
    WARNING_NAMES,
    Friction,
    __version__,
    correlation_validity,
    correlations,
    darcy_factor,
    friction,
)

__all__ = [
    "ERROR_KINDS",
    "WARNING_NAMES",
    "Friction",
    "HydrogradeError",
    "InvalidInputError",
    "NoSolutionError",
    "NotFiniteError",
    "OutOfRangeError",
    "UnknownNameError",
    "__version__",
    "correlation_validity",
    "correlations",
    "darcy_factor",
    "friction",
]

del _native
