"""Display units: what views, plots and ``to_dataframe`` show (never the SI attributes).

Every factor comes from the core's unit table through :func:`hydrograde.convert`; this
module only keeps the chosen unit names and maps result fields to their dimension.
pint is imported only when quantities are asked for.
"""

from __future__ import annotations

from typing import Any, Dict, Mapping, Optional

from hydrograde._errors import HydrogradeError
from hydrograde._native import convert

#: The SI unit (core name) of each display dimension.
SI: Dict[str, str] = {
    "flow": "m3/s",
    "pressure": "Pa",
    "length": "m",
    "distance": "m",
    "head": "m",
    "velocity": "m/s",
    "viscosity": "Pa*s",
    "temperature": "K",
}

_current: Dict[str, str] = dict(SI)

#: The dimension of each result field (fields not listed are shown as they are).
FIELDS: Dict[str, str] = {
    "flow": "flow",
    "flows": "flow",
    "total": "flow",
    "head_loss": "head",
    "static_head": "head",
    "required_head": "head",
    "head": "head",
    "pressure_loss": "pressure",
    "inlet_pressure": "pressure",
    "outlet_pressure": "pressure",
    "pressure_out": "pressure",
    "pressure": "pressure",
    "vapour_pressure": "pressure",
    "velocity": "velocity",
    "length": "distance",
    "diameter": "length",
    "bore": "length",
    "roughness": "length",
    "hydraulic_diameter": "length",
    "wetted_perimeter": "length",
    "outside_diameter": "length",
    "inside_diameter": "length",
    "min_inside_diameter": "length",
    "wall": "length",
    "width": "length",
    "height": "distance",
    "outer": "length",
    "inner": "length",
    "major": "length",
    "minor": "length",
    "side": "length",
    "d_in": "length",
    "d_out": "length",
    "viscosity": "viscosity",
    "temperature": "temperature",
    "elevation": "distance",
    "pressure_head": "head",
    "head_drop": "head",
    "outflow": "flow",
}

# Units shown with their usual typography.
_PRETTY = {
    "m3/s": "m³/s", "m3/h": "m³/h", "Pa*s": "Pa·s", "mPa*s": "mPa·s",
    "degC": "°C", "degF": "°F",
}
# The core's unit names as pint spells them (names only; factors stay in the core).
_PINT = {"m3/s": "m**3/s", "m3/h": "m**3/hour", "gpm": "gallon/minute", "in": "inch"}


class display:
    """Sets the display units of views, plots and tables; also a context manager.

    ``hydrograde.display(flow="L/s", pressure="kPa", length="mm", head="m")`` changes
    them from then on; ``with hydrograde.display(flow="m3/h"): ...`` changes them inside
    the block only. Dimensions: ``flow``, ``pressure``, ``length`` (bores, diameters,
    walls, roughness), ``distance`` (run lengths and rises), ``head``, ``velocity``, ``viscosity``, ``temperature``; names as
    :func:`hydrograde.unit_names`. An unknown unit or one of another dimension raises
    UnknownNameError / InvalidInputError naming the setting. Attributes stay SI.
    """

    def __init__(self, **units: str) -> None:
        checked = {}
        for dim, unit in units.items():
            if dim not in SI:
                raise _error("display", f"unknown display dimension {dim!r}; known: "
                             + ", ".join(SI), "unknown_name")
            try:
                convert(1.0, SI[dim], unit)
            except HydrogradeError as exc:
                raise type(exc)(f"display {dim}={unit!r}: {exc}", parameter=dim) from None
            checked[dim] = unit
        self._previous = dict(_current)
        _current.update(checked)

    def __enter__(self) -> "display":
        return self

    def __exit__(self, *exc: Any) -> None:
        _current.clear()
        _current.update(self._previous)

    def __repr__(self) -> str:
        return "display(" + ", ".join(f"{k}={v!r}" for k, v in _current.items()) + ")"


def _error(parameter: str, message: str, kind: str) -> HydrogradeError:
    from hydrograde._errors import BY_KIND

    return BY_KIND[kind](message, parameter=parameter)


def display_units() -> Dict[str, str]:
    """The current display unit of each dimension (core unit names)."""
    return dict(_current)


def unit_of(field: str) -> Optional[str]:
    """The display unit (core name) of result field ``field``, None when it has none."""
    dim = FIELDS.get(field)
    return _current[dim] if dim else None


def pretty(unit: Optional[str]) -> str:
    """A unit name as it is printed: m³/s, °C, Pa·s."""
    return "" if not unit else _PRETTY.get(unit, unit)


def shown(field: str, value: Any) -> Any:
    """``value`` of result field ``field`` (SI) in its display unit."""
    unit = unit_of(field)
    if unit is None or value is None or isinstance(value, (bool, str)):
        return value
    si = SI[FIELDS[field]]
    if unit == si:
        return value
    return convert(value, si, unit)


def quantity(field: str, value: Any, registry: Any = None) -> Any:
    """``value`` (SI) of result field ``field`` as a pint Quantity in its display unit.

    ``registry`` is the pint UnitRegistry to build it in (default pint's application
    registry). Fields without a dimension come back as plain dimensionless quantities.
    """
    import pint

    ureg = registry if registry is not None else pint.get_application_registry()
    unit = unit_of(field)
    if unit is None:
        return ureg.Quantity(value, "dimensionless")
    return ureg.Quantity(shown(field, value), _PINT.get(unit, unit))


def quantities(obj: Any, registry: Any = None) -> Dict[str, Any]:
    """The numeric fields of a result or value (its ``to_dict()``) as pint quantities in
    the display units; bands become ``(low, nominal, high)`` quantity triples."""
    data: Mapping[str, Any] = obj.to_dict() if hasattr(obj, "to_dict") else obj
    out: Dict[str, Any] = {}
    for key, value in data.items():
        if isinstance(value, bool):
            continue
        if isinstance(value, (int, float)):
            out[key] = quantity(key, value, registry)
        elif isinstance(value, Mapping) and {"low", "nominal", "high"} <= set(value):
            base = key[: -len("_band")] if key.endswith("_band") else key
            out[key] = tuple(quantity(base, value[k], registry) for k in ("low", "nominal", "high"))
    return out

