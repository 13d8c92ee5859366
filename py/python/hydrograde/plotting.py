"""Plotting helpers for design notebooks (need matplotlib).

Each helper draws on a given Axes (or a new one), in hydrograde's own quiet look, and
returns the Axes. Every plotted number comes from the core.
"""

from __future__ import annotations

import contextlib
from typing import Any, Dict, Iterator, Optional, Sequence

import numpy as np

from hydrograde._native import darcy_factor

#: The look of hydrograde plots: light grid, no top/right frame, a muted palette.
STYLE: Dict[str, Any] = {
    "axes.spines.top": False,
    "axes.spines.right": False,
    "axes.edgecolor": "#5b6770",
    "axes.labelcolor": "#1d3b53",
    "axes.titleweight": "semibold",
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
    "axes.prop_cycle": None,  # filled in lazily (needs matplotlib's cycler)
}

PALETTE = ["#1f5f8b", "#c8553d", "#3a8d6f", "#8a5fa8", "#d19a2a", "#4f6d7a", "#b0457a"]

SAFETY = "engineering estimate; designs must be checked by a competent engineer"


@contextlib.contextmanager
def style() -> Iterator[None]:
    """A context in which matplotlib draws in hydrograde's look."""
    import matplotlib as mpl
    from cycler import cycler

    rc: Any = dict(STYLE, **{"axes.prop_cycle": cycler(color=PALETTE)})
    with mpl.rc_context(rc):
        yield


def _axes(ax: Any) -> Any:
    if ax is not None:
        return ax
    import matplotlib.pyplot as plt

    _, new = plt.subplots(figsize=(6.4, 4.2), layout="constrained")
    return new


def _note(ax: Any) -> None:
    ax.text(
        1.0, -0.14, SAFETY, transform=ax.transAxes, ha="right", va="top",
        fontsize=7, color="#8a949c", style="italic",
    )


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
    shows the core's C¹ blend.
    """
    re_values = np.logspace(np.log10(600.0), 8.0, 400) if re is None else np.asarray(re, float)
    with style():
        ax = _axes(ax)
        for rr in rel_roughness:
            ax.plot(re_values, darcy_factor(re_values, float(rr), correlation), label=f"ε/D = {rr:g}")
        ax.set_xscale("log")
        ax.set_yscale("log")
        ax.set_xlabel("Reynolds number Re")
        ax.set_ylabel("Darcy friction factor f")
        ax.set_title(f"Friction factor ({correlation or 'core default'})")
        ax.legend(loc="upper right")
        _note(ax)
    return ax


def system_curve(
    line: Any,
    fluid: Any,
    flows: Any,
    pump: Any = None,
    ax: Any = None,
) -> Any:
    """The system curve of ``line`` (required head, m, against flow, m³/s) over ``flows``,
    with the band of the required head shaded; with a ``pump`` (:class:`PumpCurve`), its
    curve over its range and the operating point with its flow and head bands.
    """
    q = np.asarray(flows, dtype=float)
    low, heads, high = line.system_curve_band(fluid, q)
    with style():
        ax = _axes(ax)
        ax.fill_between(
            q, low, high,
            color=PALETTE[0], alpha=0.15, linewidth=0, label="system band (95 %)",
        )
        ax.plot(q, heads, color=PALETTE[0], label="system curve")
        if pump is not None:
            lo, hi = pump.range
            qp = np.linspace(lo, hi, 200)
            ax.plot(qp, pump.head(qp), color=PALETTE[1], label="pump")
            op = line.operating_point(fluid, pump)
            fb, hb = op.flow_band, op.head_band
            ax.errorbar(
                [op.flow], [op.head],
                xerr=[[op.flow - fb.low], [fb.high - op.flow]],
                yerr=[[op.head - hb.low], [hb.high - op.head]],
                fmt="o", color=PALETTE[2], capsize=3,
                label=f"operating point ({op.flow:.4g} m³/s, {op.head:.4g} m)",
            )
        ax.set_xlabel("flow Q [m³/s]")
        ax.set_ylabel("head [m]")
        ax.set_title("System curve")
        ax.legend(loc="best")
        _note(ax)
    return ax


def grade_line(line: Any, fluid: Any, flow: float, ax: Any = None) -> Any:
    """The energy grade along the route of ``line`` at ``flow`` (m³/s).

    Plots the total head left after each element relative to the inlet (m: minus the
    accumulated losses; rises do not change it) and the elevation profile from the rises,
    against the distance along the pipes (m); fittings, equipment and rises take no
    length, so their losses show as steps. The shaded band adds the elements' k = 2 bands
    end to end, which overstates the line's own band (that one is ``required_head_band``).
    """
    result = line.evaluate(fluid, float(flow))
    x, energy, low, high, elevation = [0.0], [0.0], [0.0], [0.0], [0.0]
    elements = line.elements
    for r in result.elements:
        # A row the route implies (an abrupt change of section) has no element and no length.
        element = None if r.element is None else elements[r.element]
        band = r.head_loss_band
        x.append(x[-1] + float(getattr(element, "length", 0.0)))
        energy.append(energy[-1] - r.head_loss)
        low.append(low[-1] - band.high)
        high.append(high[-1] - band.low)
        elevation.append(elevation[-1] + r.static_head)
    with style():
        ax = _axes(ax)
        ax.fill_between(x, low, high, color=PALETTE[0], alpha=0.15, linewidth=0,
                        label="element bands added (k = 2)")
        ax.plot(x, energy, color=PALETTE[0], marker=".", label="energy grade")
        ax.plot(x, elevation, color=PALETTE[5], linestyle="--", label="elevation")
        ax.set_xlabel("distance along the route [m]")
        ax.set_ylabel("head relative to the inlet [m]")
        ax.set_title(f"Grade line at Q = {flow:.4g} m³/s")
        ax.legend(loc="best")
        _note(ax)
    return ax
