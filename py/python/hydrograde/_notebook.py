"""Notebook rendering: HTML tables and pandas frames of any result's ``to_dict()``.

Only formatting lives here; every number comes from the core through ``to_dict()``.
"""

from __future__ import annotations

import html
import math
from typing import Any, Dict, List, Mapping, Sequence

#: Units shown beside the SI fields of results (display only).
UNITS: Dict[str, str] = {
    "f": "–",
    "friction_factor": "–",
    "df_dre": "1/Re",
    "df_drel_roughness": "1/(ε/D)",
    "head_loss": "m",
    "static_head": "m",
    "required_head": "m",
    "pressure_loss": "Pa",
    "velocity": "m/s",
    "reynolds": "–",
    "k": "–",
    "flow": "m³/s",
    "head": "m",
    "length": "m",
    "diameter": "m",
    "hydraulic_diameter": "m",
    "area": "m²",
    "wetted_perimeter": "m",
    "laminar_constant": "–",
    "roughness": "m",
    "rel_roughness": "–",
    "height": "m",
    "density": "kg/m³",
    "viscosity": "Pa·s",
    "kinematic_viscosity": "m²/s",
    "vapour_pressure": "Pa",
    "temperature": "K",
    "pressure": "Pa",
    "dhead_dflow": "s/m²",
    "value": "",
    "drequired_head_dflow": "s/m²",
    "inlet_pressure": "Pa",
    "outlet_pressure": "Pa",
    "pressure_out": "Pa",
    "head_loss_low": "m",
    "head_loss_high": "m",
}

SAFETY = (
    "Engineering estimate with stated uncertainty. Designs must be checked by a "
    "competent engineer against the codes and standards that apply where they are built."
)

_STYLE = (
    "<style>"
    ".hg-table{border-collapse:collapse;font:12px/1.4 system-ui,sans-serif;margin:4px 0}"
    ".hg-table th,.hg-table td{padding:2px 10px;border-bottom:1px solid #d8dee4;"
    "text-align:right}"
    ".hg-table th{background:#eef3f7;color:#1d3b53;font-weight:600}"
    ".hg-table td.hg-name{text-align:left;color:#1d3b53}"
    ".hg-warn{color:#9a4d00;font:12px system-ui,sans-serif}"
    ".hg-note{color:#5b6770;font:11px system-ui,sans-serif;font-style:italic}"
    "</style>"
)


def _fmt(value: Any) -> str:
    if isinstance(value, bool) or value is None:
        return html.escape(str(value))
    if isinstance(value, float):
        if math.isfinite(value) and value != 0.0 and not 1e-4 <= abs(value) < 1e7:
            return f"{value:.5e}"
        return f"{value:.6g}"
    if isinstance(value, (list, tuple)):
        return html.escape(", ".join(str(v) for v in value)) or "–"
    return html.escape(str(value))


def _is_band(value: Any) -> bool:
    return isinstance(value, Mapping) and {"low", "nominal", "high"} <= set(value)


def _band_text(band: Mapping[str, Any]) -> str:
    text = f"{_fmt(band['low'])} … {_fmt(band['high'])}"
    contributions = band.get("contributions") or []
    if contributions:
        top = contributions[0]
        name = top.get("source", top) if isinstance(top, Mapping) else top
        text += f" (dominated by {html.escape(str(name))})"
    return text


def _scalar_rows(data: Mapping[str, Any]) -> List[str]:
    rows = []
    for key, value in data.items():
        if key in ("elements", "warnings") or key.endswith("_band"):
            continue
        if isinstance(value, (list, Mapping)):
            continue
        band = data.get(f"{key}_band")
        band_cell = _band_text(band) if isinstance(band, Mapping) and _is_band(band) else ""
        rows.append(
            f"<tr><td class='hg-name'>{html.escape(key)}</td><td>{_fmt(value)}</td>"
            f"<td>{html.escape(UNITS.get(key, ''))}</td><td>{band_cell}</td></tr>"
        )
    return rows


def _elements_table(elements: Sequence[Mapping[str, Any]]) -> str:
    columns: List[str] = []
    for element in elements:
        for key, value in element.items():
            if key not in columns and not isinstance(value, Mapping):
                columns.append(key)
    head = "".join(
        f"<th>{html.escape(c)}{' [' + UNITS[c] + ']' if UNITS.get(c, '–') != '–' else ''}</th>"
        for c in columns
    )
    body = "".join(
        "<tr>" + "".join(f"<td>{_fmt(e.get(c, ''))}</td>" for c in columns) + "</tr>"
        for e in elements
    )
    return f"<table class='hg-table'><tr>{head}</tr>{body}</table>"


def render_html(title: str, data: Mapping[str, Any]) -> str:
    """An HTML table of a result's fields, bands, per-element breakdown and warnings."""
    parts = [_STYLE, f"<div class='hg-result'><strong>{html.escape(title)}</strong>"]
    rows = _scalar_rows(data)
    if rows:
        parts.append(
            "<table class='hg-table'><tr><th>quantity</th><th>value</th><th>unit</th>"
            "<th>band (k = 2)</th></tr>" + "".join(rows) + "</table>"
        )
    elements = data.get("elements")
    if elements:
        parts.append(_elements_table(elements))
    warnings = data.get("warnings") or []
    if warnings:
        parts.append(
            "<div class='hg-warn'>⚠ warnings: " + html.escape(", ".join(warnings)) + "</div>"
        )
    parts.append(f"<div class='hg-note'>{html.escape(SAFETY)}</div></div>")
    return "".join(parts)


def to_dataframe(data: Mapping[str, Any]) -> Any:
    """A pandas DataFrame: one row per element when there are elements, else one row."""
    try:
        import pandas as pd  # type: ignore[import-untyped]
    except ImportError as exc:  # pragma: no cover - exercised without pandas only
        raise ImportError("to_dataframe() needs pandas: pip install pandas") from exc
    elements = data.get("elements")
    if elements:
        rows = [
            {k: v for k, v in e.items() if not isinstance(v, Mapping)} for e in elements
        ]
        return pd.DataFrame(rows)
    row = {}
    for key, value in data.items():
        if _is_band(value):
            row[f"{key}_low"] = value["low"]
            row[f"{key}_high"] = value["high"]
        elif isinstance(value, list):
            row[key] = ", ".join(str(v) for v in value)
        elif not isinstance(value, Mapping):
            row[key] = value
    return pd.DataFrame([row])
