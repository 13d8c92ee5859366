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

    rc = dict(STYLE, **{"axes.prop_cycle": cycler(color=PALETTE)})
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
