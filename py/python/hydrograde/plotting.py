"""Plots for design notebooks (need matplotlib, imported only when a plot is drawn).

Each helper draws on a given Axes (or a new one) in the display units of
:func:`hydrograde.display`, applies hydrograde's quiet look to that Axes (also to one the
user made), and returns it. Every plotted number comes from the core.
"""

from __future__ import annotations

import contextlib
from typing import Any, Dict, Iterator, List, Optional, Sequence

import numpy as np

from hydrograde import _units
from hydrograde._native import darcy_factor

#: The look of hydrograde plots: light grid, no top/right frame, a muted palette. Fonts
#: keep matplotlib's default family and plain weights, so no font lookup can fail.
STYLE: Dict[str, Any] = {
    "axes.spines.top": False,
    "axes.spines.right": False,
    "axes.edgecolor": "#5b6770",
    "axes.labelcolor": "#1d3b53",
    "axes.titleweight": "bold",
    "axes.titlesize": 11,
    "axes.labelsize": 10,
    "axes.grid": True,
    "axes.grid.which": "both",
    "grid.color": "#d8dee4",
    "grid.linewidth": 0.6,
    "xtick.color": "#5b6770",
    "ytick.color": "#5b6770",
    "legend.frameon": False,
    "legend.fontsize": 9,
    "lines.linewidth": 1.6,
}

PALETTE = ["#1f5f8b", "#c8553d", "#3a8d6f", "#8a5fa8", "#d19a2a", "#4f6d7a", "#b0457a"]

SAFETY = ("estimate with 95 % bands; designs must be checked by a competent engineer "
          "(licensed or registered where required) against the codes that apply")


@contextlib.contextmanager
def style() -> Iterator[None]:
    """A context in which matplotlib draws new figures in hydrograde's look."""
    import matplotlib as mpl
    from cycler import cycler

    rc: Any = dict(STYLE, **{"axes.prop_cycle": cycler(color=PALETTE)})
    with mpl.rc_context(rc):
        yield


def _apply(ax: Any) -> None:
    """hydrograde's look on an existing Axes (rc settings only reach new ones)."""
    for side in ("top", "right"):
        ax.spines[side].set_visible(False)
    for side in ("left", "bottom"):
        ax.spines[side].set_color(STYLE["axes.edgecolor"])
    ax.grid(True, which="major", color=STYLE["grid.color"], linewidth=0.6)
    ax.grid(True, which="minor", color=STYLE["grid.color"], linewidth=0.3, alpha=0.6)
    ax.tick_params(colors=STYLE["xtick.color"], which="both")
    ax.xaxis.label.set_color(STYLE["axes.labelcolor"])
    ax.yaxis.label.set_color(STYLE["axes.labelcolor"])
    ax.title.set_fontweight("bold")
    ax.set_axisbelow(True)


def _axes(ax: Any) -> Any:
    if ax is None:
        import matplotlib.pyplot as plt

        with style():
            _, ax = plt.subplots(figsize=(7.0, 4.4), layout="constrained")
    _apply(ax)
    return ax


NETWORK_SAFETY = ("estimate; its 95 % bands come from Network.bands, not drawn here.\n"
                  "To be checked by a competent engineer (licensed or registered where the law "
                  "requires) against the codes that apply, fire codes for mains")


def _note(ax: Any, text: str = SAFETY) -> None:
    ax.annotate(text, xy=(0.0, 0.0), xycoords="figure fraction", xytext=(4, 3),
                textcoords="offset points", fontsize=6.5, color="#8a949c", style="italic")


def _unit(field: str) -> str:
    return _units.pretty(_units.unit_of(field))


def _shown(field: str, values: Any) -> Any:
    return np.asarray(_units.shown(field, np.asarray(values, dtype=float)), dtype=float)


def friction_chart(
    rel_roughness: Sequence[float] = (0.0, 1e-5, 1e-4, 1e-3, 1e-2, 5e-2),
    re: Optional[Any] = None,
    correlation: Optional[str] = None,
    ax: Any = None,
) -> Any:
    """The Darcy friction factor against Reynolds number, one curve per relative roughness.

    ``rel_roughness``: values of ε/D (dimensionless); ``re``: Reynolds numbers (default
    400 points from 600 to 1e8); ``correlation`` as :func:`hydrograde.darcy_factor`.
    Both axes are logarithmic; the laminar–turbulent band (Re 2300…4000, common practice)
    is shaded and shows the core's C¹ blend. The legend sits outside the plotting area.
    """
    re_values = np.logspace(np.log10(600.0), 8.0, 400) if re is None else np.asarray(re, float)
    ax = _axes(ax)
    ax.axvspan(2300.0, 4000.0, color="#eef3f7", zorder=0, label="transitional (2300–4000)")
    for i, rr in enumerate(rel_roughness):
        ax.plot(re_values, darcy_factor(re_values, float(rr), correlation),
                color=PALETTE[i % len(PALETTE)], label=f"ε/D = {rr:g}")
    ax.set_xscale("log")
    ax.set_yscale("log")
    ax.set_xlabel("Reynolds number Re")
    ax.set_ylabel("Darcy friction factor f")
    ax.set_title(f"Friction factor ({correlation or 'Colebrook, exact'})")
    ax.legend(loc="upper left", bbox_to_anchor=(1.01, 1.0), borderaxespad=0.0)
    _note(ax)
    return ax


def system_curve(line: Any, fluid: Any, flows: Any, pump: Any = None, ax: Any = None) -> Any:
    """The system curve of ``line`` (required head against flow) over ``flows`` (m³/s or
    a pint quantity), with the band of the required head shaded; with a ``pump``
    (:class:`PumpCurve`), its curve over its range and the operating point with its
    flow and head bands. Axes in the display units of flow and head.
    """
    q = np.atleast_1d(_si_flows(flows))
    low, heads, high = line.system_curve_band(fluid, q)
    ax = _axes(ax)
    ax.fill_between(_shown("flow", q), _shown("head", low), _shown("head", high),
                    color=PALETTE[0], alpha=0.15, linewidth=0, label="system band (95 %)")
    ax.plot(_shown("flow", q), _shown("head", heads), color=PALETTE[0], label="system curve")
    if pump is not None:
        lo, hi = pump.range
        qp = np.linspace(lo, hi, 200)
        ax.plot(_shown("flow", qp), _shown("head", pump.head(qp)), color=PALETTE[1],
                label="pump")
        op = line.operating_point(fluid, pump)
        f, h = float(_shown("flow", op.flow)), float(_shown("head", op.head))
        fb = _shown("flow", [op.flow_band.low, op.flow_band.high])
        hb = _shown("head", [op.head_band.low, op.head_band.high])
        ax.errorbar([f], [h], xerr=[[f - fb[0]], [fb[1] - f]], yerr=[[h - hb[0]], [hb[1] - h]],
                    fmt="o", color=PALETTE[2], capsize=3,
                    label=f"operating point {f:.3g} {_unit('flow')}, {h:.3g} {_unit('head')}")
    ax.set_xlabel(f"flow Q [{_unit('flow')}]")
    ax.set_ylabel(f"head [{_unit('head')}]")
    ax.set_title("System curve")
    ax.legend(loc="best")
    _note(ax)
    return ax


def _si_flows(flows: Any) -> Any:
    """Flows in m³/s from floats, arrays or a pint quantity."""
    if hasattr(flows, "m_as") and hasattr(flows, "dimensionality"):
        return np.asarray(flows.m_as("m**3/s"), dtype=float)
    return np.asarray(flows, dtype=float)


def _grade(rows: Sequence[Any], xs: Sequence[float], ax: Any, xlabel: str,
           labels: Sequence[str]) -> Any:
    """Energy grade (minus accumulated losses), its added band and elevation at the
    boundaries ``xs`` (len(rows) + 1 positions), with each element's step marked."""
    energy, low, high, elevation = [0.0], [0.0], [0.0], [0.0]
    for r in rows:
        band = r.head_loss_band
        energy.append(energy[-1] - r.head_loss)
        low.append(low[-1] - band.high)
        high.append(high[-1] - band.low)
        elevation.append(elevation[-1] + r.static_head)
    ax = _axes(ax)
    ax.fill_between(xs, _shown("head", low), _shown("head", high), color=PALETTE[0],
                    alpha=0.15, linewidth=0, label="element bands added (95 %)")
    ax.plot(xs, _shown("head", energy), color=PALETTE[0], marker=".", label="energy grade")
    ax.plot(xs, _shown("head", elevation), color=PALETTE[5], linestyle="--",
            label="elevation")
    for i, r in enumerate(rows):
        if r.kind != "pipe" and r.head_loss != 0.0:
            ax.annotate(labels[i], xy=(xs[i + 1], float(_shown("head", energy[i + 1]))),
                        xytext=(3, -9), textcoords="offset points", fontsize=7,
                        color="#5b6770")
    ax.set_xlabel(xlabel)
    ax.set_ylabel(f"head relative to the inlet [{_unit('head')}]")
    ax.legend(loc="best")
    _note(ax)
    return ax


def grade_line(line: Any, fluid: Any, flow: Any, ax: Any = None) -> Any:
    """The energy grade along the route of ``line`` at ``flow`` (m³/s or a quantity).

    Plots the total head left after each element relative to the inlet (minus the
    accumulated losses; rises do not change it) and the elevation profile from the rises,
    against the distance along the pipes (display unit of distance). Fittings and other
    elements without length are spread over a short gap each (1.5 % of the route) and
    labelled with their index, so several at one joint show as separate steps. The band
    adds the elements' 95 % bands end to end, which overstates the line's own band (that
    one is ``required_head_band``).
    """
    result = line.evaluate(fluid, flow)
    # Result rows follow the route; an abrupt bore change adds a row of its own.
    elements = iter(line.elements)
    lengths: List[float] = []
    labels: List[str] = []
    for i, r in enumerate(result.elements):
        e = None if r.kind == "section_change" else next(elements, None)
        lengths.append(float(getattr(e, "length", 0.0)))
        labels.append(f"{i} {r.label}")
    gap = 0.015 * (sum(lengths) or 1.0)
    xs = [0.0]
    for length in lengths:
        xs.append(xs[-1] + (length if length > 0.0 else gap))
    ax = _grade(result.elements, list(_shown("height", xs)), ax,
                f"distance along the route [{_unit('height')}] (fittings spread)", labels)
    ax.set_title(f"Grade line at Q = {float(_shown('flow', result.flow)):.4g} {_unit('flow')}")
    return ax


def result_plot(result: Any, ax: Any = None) -> Any:
    """The grade line of a :class:`LineResult` with each element at its own position
    (x = element index), band shaded, fittings labelled; see :func:`grade_line` for the
    same against distance."""
    labels = [f"{i} {r.label}" for i, r in enumerate(result.elements)]
    xs = list(range(len(result.elements) + 1))
    ax = _grade(result.elements, xs, ax, "element boundary (route order)", labels)
    ax.set_xticks(xs)
    ax.set_title(f"Grade line at Q = {float(_shown('flow', result.flow)):.4g} {_unit('flow')}")
    return ax


def network_plot(solution: Any, ax: Any = None) -> Any:
    """A solved network drawn from its nodes' plan positions (every node must be
    placed: ``net.node(..., x=, y=)`` or ``net.place``). Links are drawn in a shade and
    width that grow with the magnitude of their flow, with an arrow in the flow direction
    (none on a link closed by a check valve, drawn dashed); junctions are coloured by
    their static pressure (colour bar in the display unit of pressure); fixed-head nodes
    are squares. Plan coordinates are shown as given, with equal scales.
    """
    from hydrograde._errors import InvalidInputError

    data = solution.to_dict()
    nodes, links = data["nodes"], data["links"]
    missing = [n["name"] for n in nodes if n.get("x") is None]
    if missing:
        shown = ", ".join(repr(m) for m in missing[:8]) + (" …" if len(missing) > 8 else "")
        raise InvalidInputError(
            f"x: nodes {shown} have no plan position; give x= and y= when adding them, "
            "or call Network.place(name, x, y), to draw the network", parameter="x")
    import matplotlib as mpl

    at = {n["name"]: (float(n["x"]), float(n["y"])) for n in nodes}
    ax = _axes(ax)
    ax.grid(False, which="both")
    flows = np.abs(np.array([k["flow"] for k in links], dtype=float))
    top = float(flows.max()) if flows.size and flows.max() > 0.0 else 1.0
    blues = mpl.colormaps["Blues"]
    for k, q in zip(links, flows):
        (x0, y0), (x1, y1) = at[k["upstream"]], at[k["downstream"]]
        share = q / top
        style = "--" if k["closed"] else "-"
        ax.plot([x0, x1], [y0, y1], style, color=blues(0.35 + 0.6 * share),
                linewidth=1.0 + 4.0 * share, solid_capstyle="round", zorder=1)
        if not k["closed"] and k["flow"] != 0.0:
            a, b = ((x0, y0), (x1, y1)) if k["flow"] > 0.0 else ((x1, y1), (x0, y0))
            mid = (0.5 * (a[0] + b[0]), 0.5 * (a[1] + b[1]))
            tip = (mid[0] + 0.08 * (b[0] - a[0]), mid[1] + 0.08 * (b[1] - a[1]))
            ax.annotate("", xy=tip, xytext=mid, zorder=2,
                        arrowprops=dict(arrowstyle="-|>", color=PALETTE[5], lw=1.0))
        flow_text = f"{float(_shown('flow', abs(k['flow']))):.3g}"
        ax.annotate(f"{k['name']}\n{flow_text}", xy=(0.5 * (x0 + x1), 0.5 * (y0 + y1)),
                    xytext=(4, 4), textcoords="offset points", fontsize=6.5, color="#5b6770")
    junctions = [n for n in nodes if not n["fixed"]]
    fixed = [n for n in nodes if n["fixed"]]
    if junctions:
        pressures = _shown("pressure", [n["pressure"] for n in junctions])
        dots = ax.scatter([at[n["name"]][0] for n in junctions], [at[n["name"]][1] for n in junctions],
                          c=pressures, cmap="viridis", s=46, edgecolors="#1d3b53", linewidths=0.6,
                          zorder=3)
        # An inset colour bar stays beside the plan whatever the equal aspect does.
        bar = ax.figure.colorbar(dots, cax=ax.inset_axes((1.03, 0.1, 0.03, 0.8)))
        bar.set_label(f"static pressure [{_unit('pressure')}]")
    if fixed:
        ax.scatter([at[n["name"]][0] for n in fixed], [at[n["name"]][1] for n in fixed], marker="s",
                   s=70, color=PALETTE[1], edgecolors="#1d3b53", linewidths=0.6, zorder=3,
                   label="fixed head")
        ax.legend(loc="best")
    x_low, x_high = min(x for x, _ in at.values()), max(x for x, _ in at.values())
    for n in nodes:
        # Names to the right of the node, but to the left for the nodes in the right-hand
        # quarter of the plan, so that the outer nodes' names stay inside the axes.
        right = at[n["name"]][0] > x_high - 0.25 * (x_high - x_low)
        ax.annotate(n["name"], xy=at[n["name"]], xytext=(-5 if right else 5, -10),
                    textcoords="offset points", ha="right" if right else "left", fontsize=7.5,
                    color="#1d3b53")
    ax.set_aspect("equal", adjustable="datalim")
    ax.margins(x=0.15, y=0.12)  # room for the node names beside the outer nodes
    engine = ax.figure.get_layout_engine()
    if engine is not None and "rect" in engine.get():
        engine.set(rect=(0.0, 0.06, 1.0, 0.94))  # room for the caution below the x label
    ax.set_xlabel("plan x")
    ax.set_ylabel("plan y")
    ax.set_title(f"Network: link labels give |flow| [{_unit('flow')}]")
    _note(ax, NETWORK_SAFETY)
    return ax
