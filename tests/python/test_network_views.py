"""Networks in notebooks: the available flow at a hydrant against a closed form, plan
positions, tables (to_dict, to_dataframe) and the plot (written to docs/img)."""

from __future__ import annotations

import math
import warnings
from pathlib import Path

import pytest

import hydrograde as hg

G0 = 9.80665  # standard gravity, exact (3rd CGPM 1901; NIST SP 811)
OUT = Path(__file__).resolve().parents[2] / "docs" / "img"


def colebrook_flow(rho: float, mu: float, d: float, length: float, e: float, h: float) -> float:
    """The flow of a pipe with friction head h, exactly: Colebrook (1939) with
    Darcy–Weisbach gives Re·√f = D·√(2 g D S)/ν (S = h/L), so
    V = −2 √(2 g D S) log10(ε/(3.7 D) + 2.51 ν/(D √(2 g D S)))."""
    root = math.sqrt(2.0 * G0 * d * h / length)
    nu = mu / rho
    v = -2.0 * root * math.log10(e / (3.7 * d) + 2.51 * nu / (d * root))
    return v * math.pi * d * d / 4.0


def looped() -> hg.Network:
    """An invented looped block: a tank and four junctions on a square with a diagonal."""
    net = hg.Network()
    net.fixed_head("tank", head=52.0, x=0.0, y=0.0)
    for name, z, q, x, y in [("a", 8.0, 0.004, 200.0, 0.0), ("b", 10.0, 0.006, 400.0, 0.0),
                             ("c", 9.0, 0.003, 200.0, 180.0), ("d", 12.0, 0.005, 400.0, 180.0)]:
        net.node(name, elevation=z, outflow=q, x=x, y=y)
    for name, u, v, d, length in [("feed", "tank", "a", 0.2, 200.0), ("ab", "a", "b", 0.15, 200.0),
                                  ("ac", "a", "c", 0.15, 180.0), ("bd", "b", "d", 0.1, 180.0),
                                  ("cd", "c", "d", 0.1, 200.0), ("ad", "a", "d", 0.1, 270.0)]:
        net.link(name, u, v, hg.Line([hg.Pipe(d, length, 4.5e-5)]))
    return net


def test_available_flow_of_a_single_pipe_matches_the_closed_form():
    rho, mu = 999.1, 1.138e-3
    water = hg.Fluid(rho, mu)
    d, length, e, tank, z, base, p_min = 0.15, 400.0, 4.5e-5, 45.0, 2.0, 0.01, 1.4e5
    net = hg.Network()
    net.fixed_head("tank", head=tank)
    net.node("hydrant", elevation=z, outflow=base)
    net.link("main", "tank", "hydrant", hg.Line([hg.Pipe(d, length, e)]))
    a = net.available_flow(water, "hydrant", p_min)
    # Energy: tank − (z + p_min/(ρ g)) is the friction head at the total flow.
    expected = colebrook_flow(rho, mu, d, length, e, tank - z - p_min / (rho * G0)) - base
    assert a.flow == pytest.approx(expected, rel=1e-8)
    assert a.pressure == pytest.approx(p_min, abs=1e-3)
    assert a.critical == "hydrant"
    assert a.solution.node("hydrant").outflow == base + a.flow
    with pytest.raises(hg.NoSolutionError, match="hydrant"):
        net.available_flow(water, "hydrant", 5e5)  # 45 m of water is about 441 kPa
    with pytest.raises(hg.InvalidInputError, match="tank"):
        net.available_flow(water, "tank", 1e5)
    with pytest.raises(hg.NotFiniteError, match="min_pressure"):
        net.available_flow(water, "hydrant", math.nan)


def test_every_junction_is_no_more_than_the_node_alone():
    water = hg.Fluid.water(288.15)
    net = looped()
    alone = net.available_flow(water, "d", 1.5e5)
    everywhere = net.available_flow(water, "d", 1.5e5, every_junction=True)
    assert everywhere.flow <= alone.flow
    lowest = min(n.pressure for n in everywhere.solution.nodes if not n.fixed)
    assert lowest == pytest.approx(1.5e5, abs=1e-2)
    assert everywhere.solution.node(everywhere.critical).pressure == lowest


def test_positions_need_both_coordinates_and_a_known_node():
    net = hg.Network()
    with pytest.raises(hg.InvalidInputError, match="y"):
        net.node("a", elevation=0.0, x=1.0)
    with pytest.raises(hg.UnknownNameError):
        net.place("nowhere", 0.0, 0.0)
    net.node("a", elevation=0.0)
    with pytest.raises(hg.OutOfRangeError, match="x"):
        net.place("a", 1e9, 0.0)
    net.place("a", 3.0, 4.0)
    assert net.to_dict()["nodes"][0]["x"] == 3.0


def test_tables_carry_every_node_and_link_in_display_units():
    pd = pytest.importorskip("pandas")
    water = hg.Fluid.water(288.15)
    s = looped().solve(water)
    data = s.to_dict()
    assert [n["name"] for n in data["nodes"]] == ["tank", "a", "b", "c", "d"]
    with hg.display(flow="L/s", pressure="kPa"):
        nodes = s.to_dataframe()
        links = s.to_dataframe("links")
    assert isinstance(nodes, pd.DataFrame) and len(nodes) == 5 and len(links) == 6
    # 1 kPa = 1000 Pa and 1 L/s = 0.001 m³/s (definitions).
    assert nodes["pressure"].iloc[1] == pytest.approx(s.nodes[1].pressure / 1e3, rel=1e-15)
    assert links["flow"].iloc[0] == pytest.approx(s.links[0].flow * 1e3, rel=1e-15)
    assert nodes.attrs["units"]["pressure"] == "kPa"
    with pytest.raises(hg.UnknownNameError):
        s.to_dataframe("pipes")


def test_plot_draws_the_plan_in_display_units():
    mpl = pytest.importorskip("matplotlib")
    mpl.use("Agg")
    import matplotlib.pyplot as plt

    water = hg.Fluid.water(288.15)
    net = looped()
    s = net.solve(water)
    with warnings.catch_warnings(record=True) as caught, hg.display(flow="L/s", pressure="kPa"):
        warnings.simplefilter("always")
        ax = s.plot()
        x, y = ax.get_lines()[0].get_data()
        assert list(x) == [0.0, 200.0] and list(y) == [0.0, 0.0]  # the feed, tank → a
        dots = ax.collections[0].get_array()
        # The colour scale is the junctions' pressure in kPa (1 kPa = 1000 Pa).
        assert list(dots) == pytest.approx([n.pressure / 1e3 for n in s.nodes if not n.fixed],
                                           rel=1e-15)
        OUT.mkdir(parents=True, exist_ok=True)
        ax.figure.savefig(OUT / "plot_network.png", dpi=110)
        plt.close(ax.figure)
    assert not [w for w in caught if "font" in str(w.message).lower()]
    unplaced = hg.Network()
    unplaced.fixed_head("t", head=10.0)
    unplaced.node("n", elevation=0.0, outflow=0.001)
    unplaced.link("p", "t", "n", hg.Line([hg.Pipe(0.1, 10.0, 1e-5)]))
    with pytest.raises(hg.InvalidInputError, match="plan position"):
        unplaced.solve(water).plot()
