"""Plots reachable from ``import hydrograde``, in display units, with no font warnings.

Writes docs/img/plot_*.png (README shows them). Every plotted number is compared with
the core's own call (the plot must show exactly what the library computes).
"""

from __future__ import annotations

import warnings
from pathlib import Path

import numpy as np
import pytest

import hydrograde as hg

mpl = pytest.importorskip("matplotlib")
mpl.use("Agg")
import matplotlib.pyplot as plt  # noqa: E402

OUT = Path(__file__).resolve().parents[2] / "docs" / "img"


@pytest.fixture()
def scene():
    water = hg.Fluid.water(333.15, 2.5e5)
    bore = hg.pipe_size("steel", "2", "40")["inside_diameter"]
    line = hg.Line([
        hg.Fitting.from_tank(),
        hg.Pipe.of_material(bore, 18.0, "commercial_steel"),
        hg.Fitting.named("elbow_90_long_radius"),
        hg.Fitting.named("y_strainer"),
        hg.Fitting.named("elbow_90_long_radius"),
        hg.Pipe.of_material(bore, 24.0, "commercial_steel"),
        hg.Fitting.named("globe_valve"),
        hg.Rise(6.0),
        hg.Pipe.of_material(bore, 12.5, "commercial_steel"),
        hg.Fitting.into_tank(),
    ])
    pump = hg.PumpCurve([0.0, 0.002, 0.004, 0.006, 0.008], [26.0, 25.2, 23.0, 19.0, 13.0])
    return line, water, pump


def test_plots_are_reachable_and_draw_in_display_units_without_warnings(scene):
    line, water, pump = scene
    OUT.mkdir(parents=True, exist_ok=True)
    with warnings.catch_warnings(record=True) as caught, hg.display(flow="L/s", head="m"):
        warnings.simplefilter("always")
        ax = line.plot_system(water, np.linspace(0.0, 0.008, 41), pump=pump)
        x, y = ax.get_lines()[0].get_data()
        # 0.008 m³/s is 8 L/s (definition of the litre); heads are the core's in m.
        assert x[-1] == pytest.approx(8.0, rel=1e-15)
        np.testing.assert_array_equal(y, line.system_curve(water, np.linspace(0.0, 0.008, 41)))
        assert "L/s" in ax.get_xlabel()
        ax.figure.savefig(OUT / "plot_system.png", dpi=110)
        plt.close(ax.figure)

        r = line.evaluate(water, 0.0045)
        ax = r.plot()
        xs, energy = ax.get_lines()[0].get_data()
        assert list(xs) == list(range(len(r.elements) + 1))  # every element at its own x
        assert energy[-1] == pytest.approx(-r.head_loss, rel=1e-12)
        ax.figure.savefig(OUT / "plot_grade.png", dpi=110)
        plt.close(ax.figure)

        ax = line.plot_grade(water, 0.0045)
        xs, _ = ax.get_lines()[0].get_data()
        assert len(set(np.round(xs, 9))) == len(xs)  # no two elements stacked at one x
        plt.close(ax.figure)

        ax = hg.plot_friction_chart()
        ax.figure.savefig(OUT / "plot_friction.png", dpi=110)
        legend = ax.get_legend().get_window_extent()
        assert legend.x0 >= ax.get_window_extent().x1  # the legend sits beside the curves
        plt.close(ax.figure)
    assert not [w for w in caught if "findfont" in str(w.message)], caught
    assert not caught, [str(w.message) for w in caught]


def test_the_style_reaches_the_users_own_axes(scene):
    line, water, pump = scene
    fig, ax = plt.subplots()
    assert ax.spines["top"].get_visible()
    line.plot_system(water, [0.0, 0.002, 0.004], ax=ax)
    assert not ax.spines["top"].get_visible() and not ax.spines["right"].get_visible()
    plt.close(fig)


def test_matplotlib_is_imported_lazily():
    import subprocess
    import sys

    code = "import sys, hydrograde; print('matplotlib' in sys.modules)"
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False"
