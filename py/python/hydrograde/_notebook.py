"""Notebook rendering: HTML views and pandas frames of results and values.

Only formatting lives here; every number comes from the core through ``to_dict()`` or
the objects' own attributes, shown in the display units of :func:`hydrograde.display`.
Values that do not apply show as a dash, never as "None" or "nan". Tables wrap inside a
box that scrolls sideways when the notebook is narrower than the table.
"""

from __future__ import annotations

import html
import math
import re
from typing import Any, Callable, Dict, List, Mapping, Optional, Sequence, Tuple

from hydrograde import _units

DASH = "–"

SAFETY = (
    "Engineering estimate with stated uncertainty (95 % bands). Designs "
    "must be checked by a competent engineer — licensed or registered where the law "
    "requires it — against the codes and standards that apply where they are built."
)

#: Column and row headings of fields.
LABELS: Dict[str, str] = {
    "flow": "flow",
    "head_loss": "head loss",
    "pressure_loss": "pressure loss",
    "static_head": "static head",
    "required_head": "required head",
    "drequired_head_dflow": "slope dH/dQ",
    "dhead_dflow": "slope dH/dQ",
    "density": "density",
    "inlet_pressure": "inlet pressure",
    "outlet_pressure": "outlet pressure",
    "pressure_out": "p out",
    "velocity": "velocity",
    "reynolds": "Re",
    "friction_factor": "f",
    "k": "K",
    "head": "head",
    "iterations": "iterations",
    "min_inside_diameter": "min. inside diameter",
    "viscosity": "viscosity",
    "kinematic_viscosity": "kinematic viscosity",
    "vapour_pressure": "vapour pressure",
    "temperature": "temperature",
    "pressure": "pressure",
    "length": "length",
    "roughness": "roughness",
    "rel_roughness": "ε/D",
    "diameter": "diameter",
    "hydraulic_diameter": "hydraulic diameter",
    "area": "area",
    "wetted_perimeter": "wetted perimeter",
    "laminar_constant": "f·Re (laminar)",
    "f": "f",
    "df_dre": "∂f/∂Re",
    "df_drel_roughness": "∂f/∂(ε/D)",
    "k_spread": "K spread",
    "k1": "K₁",
    "k_inf": "K∞",
    "k_d": "K_d",
    "samples": "samples",
    "mean": "mean",
    "std_dev": "std. dev.",
}

#: Units of fields that have no display dimension (always SI).
FIXED_UNITS: Dict[str, str] = {
    "density": "kg/m³",
    "kinematic_viscosity": "m²/s",
    "drequired_head_dflow": "s/m²",
    "dhead_dflow": "s/m²",
    "area": "m²",
}

#: Warnings as short words.
SHORT_WARNINGS: Dict[str, str] = {
    "reynolds_out_of_range": "Re out of range",
    "roughness_out_of_range": "ε/D out of range",
    "transitional_flow": "transitional",
    "non_circular_section": "non-circular",
    "gas_compressibility": "gas: large Δp",
    "below_vapour_pressure": "cavitation risk",
    "fitting_out_of_range": "fitting out of range",
    "bore_change_without_transition": "bore change",
    "implausible_velocity": "velocity: unit?",
    "implausible_bore": "bore: unit?",
    "implausible_length": "length: unit?",
    "implausible_rated_drop": "rated drop: unit?",
    "implausible_viscosity": "viscosity: unit?",
}

_STYLE = (
    "<style>"
    ".hg{font:12px/1.4 system-ui,-apple-system,'Segoe UI',sans-serif;color:#1d2b36;"
    "max-width:100%;box-sizing:border-box}"
    ".hg .hg-box{max-width:100%;overflow-x:auto}"
    ".hg table{border-collapse:collapse;margin:4px 0 6px 0}"
    ".hg th,.hg td{padding:2px 8px;border-bottom:1px solid #dde3e8;text-align:right;"
    "vertical-align:top}"
    ".hg th{background:#eef3f7;color:#1d3b53;font-weight:600}"
    ".hg th.t{text-align:left}"
    ".hg td.t{text-align:left;max-width:22em;overflow-wrap:anywhere}"
    ".hg td.n{white-space:nowrap;font-variant-numeric:tabular-nums}"
    ".hg td.b{font-variant-numeric:tabular-nums;white-space:nowrap}"
    ".hg .u{color:#5b6770;font-weight:400}"
    ".hg .title{font-weight:600;font-size:13px;color:#1d3b53}"
    ".hg .w{color:#9a4d00}"
    ".hg .note{color:#5b6770;font-size:11px;font-style:italic;max-width:60em}"
    ".hg .bar{display:inline-block;height:8px;background:#1f5f8b;vertical-align:middle}"
    "</style>"
)


def number(value: Any, digits: int = 4) -> str:
    """Engineering formatting: ``digits`` significant figures, ×10ⁿ for very large or
    small magnitudes, a dash for None, NaN and infinities."""
    if value is None or isinstance(value, bool):
        return DASH
    try:
        v = float(value)
    except (TypeError, ValueError):
        return html.escape(str(value))
    if not math.isfinite(v):
        return DASH
    if v == 0.0:
        return "0"
    magnitude = abs(v)
    if 10 ** (digits - 1) <= magnitude < 1e6:
        return f"{v:.0f}".replace("-", "−")
    if 1e-3 <= magnitude < 1e6:
        text = f"{v:.{digits}g}"
        if "e" not in text:
            return text.replace("-", "−")
    mantissa, exponent = f"{v:.{digits - 1}e}".split("e")
    sup = str(int(exponent)).translate(str.maketrans("-0123456789", "⁻⁰¹²³⁴⁵⁶⁷⁸⁹"))
    return f"{mantissa.replace('-', '−')}×10{sup}"


def reynolds(value: Any) -> str:
    """A Reynolds number: whole, grouped by thin spaces up to 10⁷."""
    if value is None or not isinstance(value, (int, float)) or not math.isfinite(value):
        return DASH
    if abs(value) < 1e7:
        return f"{value:,.0f}".replace(",", " ")
    return number(value, 3)


def unit_text(field: str) -> str:
    """The unit shown for ``field``: its display unit, a fixed SI unit, or nothing."""
    return _units.pretty(_units.unit_of(field)) or FIXED_UNITS.get(field, "")


def value_text(field: str, value: Any) -> str:
    """``value`` of ``field`` converted to its display unit and formatted."""
    if field == "reynolds":
        return reynolds(value)
    if isinstance(value, str):
        return html.escape(value)
    if isinstance(value, float) and not math.isfinite(value):
        return DASH
    # Absolute temperatures keep hundredths of a kelvin (333.15 K, 60 °C).
    digits = 5 if field == "temperature" else 4
    return number(_units.shown(field, value), digits)


def _heading(field: str) -> str:
    unit = unit_text(field)
    name = html.escape(LABELS.get(field, field.replace("_", " ")))
    return f"{name} <span class='u'>[{html.escape(unit)}]</span>" if unit else name


def _is_band(value: Any) -> bool:
    return isinstance(value, Mapping) and {"low", "nominal", "high"} <= set(value)


def _band_cells(field: str, band: Optional[Mapping[str, Any]]) -> Tuple[str, str]:
    """(range in display units with its ± %, dominant source) of a band dict."""
    if not band:
        return DASH, DASH
    low, nominal, high = band["low"], band["nominal"], band["high"]
    text = f"{value_text(field, low)} … {value_text(field, high)}"
    if nominal and math.isfinite(nominal) and nominal != 0.0:
        half = 50.0 * (high - low) / abs(nominal)
        text += f"<br><span class='u'>±{half:.2g} %</span>"
    contributions = band.get("contributions") or []
    dominant = DASH
    if contributions:
        top = contributions[0]
        dominant = f"{html.escape(str(top['source']))} {100 * top['share']:.0f} %"
    return text, dominant


def _warnings_text(names: Sequence[str]) -> str:
    if not names:
        return ""
    return ", ".join(html.escape(SHORT_WARNINGS.get(n, n.replace("_", " "))) for n in names)


def _table(head: Sequence[str], rows: Sequence[Sequence[Tuple[str, str]]]) -> str:
    """A table; each cell is (css class, html)."""
    out = ["<div class='hg-box'><table><tr>"]
    kinds = [c for c, _ in rows[0]] if rows else ["n"] * len(head)
    out.extend(f"<th class='{k}'>{h}</th>" for k, h in zip(kinds, head))
    out.append("</tr>")
    for row in rows:
        out.append("<tr>" + "".join(f"<td class='{c}'>{v}</td>" for c, v in row) + "</tr>")
    out.append("</table></div>")
    return "".join(out)


def _quantity_rows(data: Mapping[str, Any], fields: Sequence[str]) -> List[List[Tuple[str, str]]]:
    rows = []
    for key in fields:
        if key not in data:
            continue
        band = data.get(f"{key}_band")
        rng, dominant = _band_cells(key, band if _is_band(band) else None)
        rows.append([
            ("t", html.escape(LABELS.get(key, key.replace("_", " ")))),
            ("n", value_text(key, data[key])),
            ("t", html.escape(unit_text(key)) or DASH),
            ("b", rng),
            ("t", dominant),
        ])
    return rows


def _quantities(data: Mapping[str, Any], fields: Sequence[str]) -> str:
    return _table(
        ["quantity", "value", "unit", "band (95 %)", "dominant source"],
        _quantity_rows(data, fields),
    )


def _frame(title: str, body: str, warnings: Sequence[str] = ()) -> str:
    name, _, what = title.partition(" · ")
    heading = html.escape(name) + (f" <span class='u'>· {html.escape(what)}</span>" if what else "")
    parts = [_STYLE, "<div class='hg'>", f"<div class='title'>{heading}</div>", body]
    if warnings:
        parts.append(f"<div class='w'>⚠ {_warnings_text(warnings)}</div>")
    parts.append(f"<div class='note'>{html.escape(SAFETY)}</div>")
    parts.append("</div>")
    return "".join(parts)


def _element_rows(elements: Sequence[Mapping[str, Any]]) -> str:
    has_pressure = any(e.get("pressure_out") is not None for e in elements)
    fields = ["velocity", "reynolds", "f_or_k", "head_loss", "band", "dominant", "static_head"]
    head = ["#", "element", _heading("bore"), _heading("length"), _heading("velocity"), "Re", "f / K", _heading("head_loss"),
            f"band <span class='u'>[{html.escape(unit_text('head_loss'))}]</span>",
            "dominant source", _heading("static_head")]
    if has_pressure:
        fields.append("pressure_out")
        head.append(_heading("pressure_out"))
    head.append("notes")
    rows = []
    for i, e in enumerate(elements):
        label = e.get("label") or e.get("kind", "")
        kind = e.get("kind", "")
        name = _breakable(str(label))
        if kind and kind != label:
            name += f" <span class='u'>{html.escape(kind)}</span>"
        if e.get("friction_factor") is not None:
            fk = f"f {number(e['friction_factor'])}"
        elif e.get("k") is not None:
            fk = f"K {number(e['k'])}"
        else:
            fk = DASH
        band: Dict[str, Any] = {"low": e.get("head_loss_low"), "nominal": e.get("head_loss"),
                "high": e.get("head_loss_high"), "contributions": []}
        rng = DASH
        if kind != "rise" and band["low"] is not None:
            rng = _band_cells("head_loss", band)[0]
        dominant = _own_source(str(e["dominant"]), str(label)) if e.get("dominant") else DASH
        notes = [html.escape(str(e["regime"]))] if e.get("regime") not in (None, "turbulent") else []
        warn = _warnings_text(e.get("warnings") or [])
        if warn:
            notes.append(f"<span class='w'>{warn}</span>")
        row = [("n", str(e.get("index", i))), ("t", name),
               ("n", value_text("bore", e.get("bore"))),
               ("n", value_text("length", e.get("length"))),
               ("n", value_text("velocity", e.get("velocity"))),
               ("n", reynolds(e.get("reynolds"))), ("n", fk),
               ("n", value_text("head_loss", e.get("head_loss"))), ("b", rng), ("t", dominant),
               ("n", value_text("static_head", e.get("static_head")) if kind == "rise" else DASH)]
        if has_pressure:
            row.append(("n", value_text("pressure_out", e.get("pressure_out"))))
        row.append(("t", ", ".join(notes) or DASH))
        rows.append(row)
    return _table(head, rows)


def _breakable(text: str) -> str:
    """Escaped text that may wrap after its underscores (long catalogue names)."""
    return html.escape(text).replace("_", "_<wbr>")


def _own_source(source: str, label: str) -> str:
    """A source as an element row shows it: its own K or rating in short."""
    source = re.sub(r" \(element \d+\)$", "", source)
    if source in (f"K of {label}", f"rating of {label}"):
        return source.split(" of ")[0] + " (own)"
    return _breakable(source)


def _line_result(data: Mapping[str, Any]) -> str:
    fields = ["flow", "head_loss", "pressure_loss", "static_head", "required_head",
              "inlet_pressure", "outlet_pressure"]
    shown = [f for f in fields if data.get(f) is not None]
    body = _quantities(data, shown) + _element_rows(data.get("elements") or [])
    return _frame("LineResult · the line at one flow", body, data.get("warnings") or [])


def _band(data: Mapping[str, Any]) -> str:
    field = data.get("quantity") or ""
    rng, _ = _band_cells(field, data)
    unit = unit_text(field)
    summary = (f"<div>{html.escape(field.replace('_', ' ') or 'value')}: "
               f"{value_text(field, data['nominal'])} {html.escape(unit)} — band {rng}"
               f"{' ' + html.escape(unit) if unit else ''}</div>")
    rows = []
    for c in data.get("contributions") or []:
        share = 100.0 * c["share"]
        rows.append([("t", _breakable(str(c["source"]))), ("n", f"{number(share, 3)} %"),
                     ("t", f"<span class='bar' style='width:{max(share, 0.5):.1f}px'></span>")])
    body = summary + (_table(["source", "share of variance", ""], rows) if rows else "")
    return _frame("Band · 95 % coverage interval", body)


def _sizing(data: Mapping[str, Any]) -> str:
    body = _quantities(data, ["min_inside_diameter"])
    rows = []
    for key, what in (("standard", "at nominal values"), ("standard_at_band", "at the band's end")):
        s = data.get(key)
        if not s:
            continue
        rng, dominant = _band_cells("pressure_loss", s.get("pressure_loss_band"))
        rows.append([("t", what), ("t", html.escape(f"{s['table']} {s['nominal']} {s['schedule']}")),
                     ("n", value_text("outside_diameter", s["outside_diameter"])),
                     ("n", value_text("wall", s["wall"])),
                     ("n", value_text("inside_diameter", s["inside_diameter"])),
                     ("n", value_text("velocity", s["velocity"])),
                     ("n", value_text("pressure_loss", s["pressure_loss"])), ("b", rng),
                     ("t", dominant)])
    if rows:
        body += _table(["choice", "size", _heading("outside_diameter"), _heading("wall"),
                        _heading("inside_diameter"), _heading("velocity"),
                        _heading("pressure_loss"), "band", "dominant source"], rows)
    return _frame("Sizing · smallest bore meeting the limit", body)


def _generic(title: str, data: Mapping[str, Any]) -> str:
    rows = []
    for key, value in data.items():
        if key.endswith("_band") or key == "warnings" or isinstance(value, (list, tuple)):
            continue
        if isinstance(value, Mapping):
            if _is_band(value):
                continue
            value = ", ".join(f"{k} {number(v) if isinstance(v, float) else v}"
                              for k, v in value.items())
        band = data.get(f"{key}_band")
        rng, dominant = _band_cells(key, band if _is_band(band) else None)
        cells = [("t", html.escape(LABELS.get(key, key.replace("_", " ")))),
                 ("n" if isinstance(value, (int, float)) else "t",
                  value_text(key, value) if value is not None else DASH),
                 ("t", html.escape(unit_text(key)) or DASH)]
        if any(_is_band(v) for v in data.values()):
            cells += [("b", rng), ("t", dominant)]
        rows.append(cells)
    head = ["quantity", "value", "unit"]
    if any(_is_band(v) for v in data.values()):
        head += ["band (95 %)", "dominant source"]
    return _frame(title, _table(head, rows), data.get("warnings") or [])


NETWORK_NOTE = ("Fire mains: the flow available at a hydrant is an estimate; the fire-protection "
                "codes that apply set the required flows, residual pressures and tests.")


def _network_solution(data: Mapping[str, Any]) -> str:
    nodes = data.get("nodes") or []
    links = data.get("links") or []
    node_rows = []
    for n in nodes:
        node_rows.append([
            ("t", _breakable(str(n["name"]))),
            ("t", "fixed head" if n["fixed"] else "junction"),
            ("n", value_text("elevation", n["elevation"])),
            ("n", value_text("head", n["head"])),
            ("n", value_text("pressure_head", n["pressure_head"])),
            ("n", value_text("pressure", n["pressure"])),
            ("n", value_text("outflow", n["outflow"])),
        ])
    link_rows = []
    for k in links:
        notes = ["closed (check valve)"] if k["closed"] else []
        warn = _warnings_text(k.get("warnings") or [])
        if warn:
            notes.append(f"<span class='w'>{warn}</span>")
        link_rows.append([
            ("t", _breakable(str(k["name"]))),
            ("t", f"{_breakable(str(k['upstream']))} → {_breakable(str(k['downstream']))}"),
            ("n", value_text("flow", k["flow"])),
            ("n", value_text("velocity", k.get("velocity"))),
            ("n", value_text("head_drop", k["head_drop"])),
            ("t", ", ".join(notes) or DASH),
        ])
    body = (f"<div>{len(nodes)} nodes, {len(links)} links; {data.get('iterations')} Newton "
            f"iterations, largest energy imbalance {number(data.get('head_imbalance'), 2)} m</div>"
            + _table(["node", "kind", _heading("elevation"), _heading("head"),
                      f"pressure head <span class='u'>[{html.escape(unit_text('pressure_head'))}]</span>",
                      _heading("pressure"), f"outflow <span class='u'>[{html.escape(unit_text('outflow'))}]</span>"],
                     node_rows)
            + _table(["link", "from → to", _heading("flow"), _heading("velocity"),
                      f"head drop <span class='u'>[{html.escape(unit_text('head_drop'))}]</span>", "notes"],
                     link_rows))
    messages = [w[2] if isinstance(w, (list, tuple)) else str(w) for w in data.get("warnings") or []]
    if messages:
        body += "".join(f"<div class='w'>⚠ {html.escape(m)}</div>" for m in messages)
    body += f"<div class='note'>{html.escape(NETWORK_NOTE)}</div>"
    return _frame("NetworkSolution · heads and flows of the network", body)


def _network(obj: Any) -> str:
    data = obj.to_dict()
    node_rows = []
    for n in data["nodes"]:
        fixed = n["kind"] == "fixed_head"
        where = DASH
        if n.get("x") is not None:
            where = f"{number(n['x'])}, {number(n['y'])}"
        node_rows.append([
            ("t", _breakable(str(n["name"]))),
            ("t", "fixed head" if fixed else "junction"),
            ("n", value_text("elevation", n["elevation"])),
            ("n", value_text("head", n["head"]) if fixed else DASH),
            ("n", DASH if fixed else value_text("outflow", n["outflow"])),
            ("n", where),
        ])
    link_rows = [[("t", _breakable(str(k["name"]))), ("t", _breakable(str(k["upstream"]))),
                  ("t", _breakable(str(k["downstream"]))), ("n", str(k["elements"]))]
                 for k in data["links"]]
    body = (_table(["node", "kind", _heading("elevation"), _heading("head"),
                    f"outflow <span class='u'>[{html.escape(unit_text('outflow'))}]</span>",
                    "plan x, y"], node_rows)
            + _table(["link", "upstream", "downstream", "elements"], link_rows))
    body += f"<div class='note'>{html.escape(NETWORK_NOTE)}</div>"
    return _frame(f"Network · {len(node_rows)} nodes, {len(link_rows)} links", body)


_TITLES = {"FlowSolution": "FlowSolution · the flow a head drives",
           "OperatingPoint": "OperatingPoint · pump curve meets system curve",
           "MonteCarlo": "MonteCarlo · sampling check, JCGM 101",
           "Friction": "Friction · Darcy friction factor"}


def render_html(title: str, data: Mapping[str, Any]) -> str:
    """The HTML view of an object's ``to_dict()``; ``title`` is its class name."""
    if title == "LineResult":
        return _line_result(data)
    if title == "Band":
        return _band(data)
    if title == "Sizing":
        return _sizing(data)
    if title == "NetworkSolution":
        return _network_solution(data)
    if title == "ElementResult":
        body = _element_rows([data])
        return _frame("ElementResult", body, data.get("warnings") or [])
    return _generic(_TITLES.get(title, title), data)


def _line(obj: Any) -> str:
    data = obj.to_dict()
    rows = []
    for i, element in enumerate(obj.elements):
        kind = type(element).__name__
        label = getattr(element, "label", None) or getattr(element, "name", None) or kind.lower()
        bore = length = roughness = DASH
        detail = DASH
        if kind == "Pipe":
            bore = value_text("bore", element.bore)
            length = value_text("length", element.length)
            roughness = value_text("roughness", element.roughness)
            shape = element.section.shape
            detail = html.escape(shape) if shape != "circle" else DASH
        elif kind == "Fitting":
            if element.diameter is not None:
                bore = value_text("bore", element.diameter)
            params = element.parameters
            if element.method == "k":
                detail = f"K {number(params.get('k'))}"
            else:
                detail = html.escape(element.method.replace("_", "-")) + (
                    ": " + ", ".join(f"{LABELS.get(k, k)} {number(v)}" for k, v in params.items())
                    if params else "")
        elif kind == "Rise":
            detail = f"{value_text('height', element.height)} {html.escape(unit_text('height'))}"
        rows.append([("n", str(i)), ("t", html.escape(str(label))), ("t", kind.lower()),
                     ("n", bore), ("n", length), ("n", roughness), ("t", detail)])
    body = _table(["#", "element", "kind", _heading("bore"), _heading("length"),
                   _heading("roughness"), "method / detail"], rows)
    options = [f"correlation {html.escape(str(data.get('correlation')))}",
               f"transition {html.escape(str(data.get('transition')))}",
               f"static head {value_text('static_head', data.get('static_head'))} "
               f"{html.escape(unit_text('static_head'))}"]
    if data.get("inlet_pressure") is not None:
        options.append(f"inlet pressure {value_text('inlet_pressure', data['inlet_pressure'])} "
                       f"{html.escape(unit_text('inlet_pressure'))}")
    body += f"<div>{'; '.join(options)}</div>"
    return _frame(f"Line · {len(rows)} elements", body)


def _pump(obj: Any) -> str:
    lo, hi = obj.range
    rows = []
    for j in range(7):
        q = hi if j == 6 else lo + (hi - lo) * j / 6
        rows.append([("n", value_text("flow", q)), ("n", value_text("head", obj.head(q)))])
    body = (f"<div>data from {value_text('flow', lo)} to {value_text('flow', hi)} "
            f"{html.escape(unit_text('flow'))} (no extrapolation)</div>"
            + _table([_heading("flow"), _heading("head")], rows))
    fit = getattr(obj, "fit_info", None)
    if not fit:
        return _frame("PumpCurve · monotone cubic through the data", body)
    unit = html.escape(unit_text("head"))
    body += (f"<div>residual at the points: RMS {value_text('head', fit['rms_residual'])} {unit}, "
             f"largest {value_text('head', fit['max_residual'])} {unit}</div>")
    return _frame(f"PumpCurve · least-squares fit of degree {fit['degree']}", body)


def _split(obj: Any) -> str:
    rows = []
    for i, (q, b) in enumerate(zip(obj.flows, obj.flow_bands)):
        rng, dominant = _band_cells("flow", b.to_dict())
        rows.append([("n", str(i)), ("n", value_text("flow", q)), ("b", rng), ("t", dominant)])
    head_band = obj.head_band.to_dict()
    body = (_quantities({"head": obj.head, "head_band": head_band}, ["head"])
            + _table(["branch", _heading("flow"), "band (95 %)", "dominant source"], rows)
            + f"<div class='u'>{obj.iterations} iterations</div>")
    return _frame("Split · parallel branches at one head", body)


_OBJECTS: Dict[str, Callable[[Any], str]] = {"Line": _line, "PumpCurve": _pump, "Split": _split,
                                             "Network": _network}


def render_object(title: str, obj: Any) -> str:
    """The HTML view of an object read through its attributes (Line, PumpCurve, Split)."""
    return _OBJECTS[title](obj)


def to_dataframe(data: Mapping[str, Any]) -> Any:
    """A pandas DataFrame in the display units: one row per element when there are
    elements, else one row; ``frame.attrs["units"]`` maps each column to its unit."""
    try:
        import pandas as pd  # type: ignore[import-untyped]
    except ImportError as exc:  # pragma: no cover - exercised without pandas only
        raise ImportError("to_dataframe() needs pandas: pip install pandas") from exc

    units: Dict[str, str] = {}

    def column(key: str) -> str:
        base = key.rsplit("_", 1)[0] if key.endswith(("_low", "_high")) else key
        unit = _units.unit_of(key) or _units.unit_of(base) or FIXED_UNITS.get(key)
        if unit:
            units[key] = _units.pretty(unit)
        return key

    def shown(key: str, value: Any) -> Any:
        base = key.rsplit("_", 1)[0] if key.endswith(("_low", "_high")) else key
        if value is None or isinstance(value, (str, bool, list)):
            return value
        return _units.shown(base if _units.unit_of(base) else key, value)

    elements = data.get("elements")
    if elements:
        rows = [{column(k): shown(k, v) for k, v in e.items() if not isinstance(v, Mapping)}
                for e in elements]
        frame = pd.DataFrame(rows)
        frame.attrs["units"] = units
        return frame
    row: Dict[str, Any] = {}
    for key, value in data.items():
        if _is_band(value):
            base = key[: -len("_band")]
            row[column(f"{base}_low")] = shown(f"{base}_low", value["low"])
            row[column(f"{base}_high")] = shown(f"{base}_high", value["high"])
        elif isinstance(value, list):
            row[key] = ", ".join(str(v) for v in value)
        elif not isinstance(value, Mapping):
            row[column(key)] = shown(key, value)
    frame = pd.DataFrame([row])
    frame.attrs["units"] = units
    return frame
