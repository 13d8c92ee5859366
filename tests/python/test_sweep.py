"""Network sweeps over a Dask LocalCluster give exactly the solves made here."""

from __future__ import annotations

import numpy as np
import pytest

import hydrograde as hg
from hydrograde.sweep import network_sweep


def estate(case: tuple) -> hg.Network:
    """An invented looped block: demand at "c" (m³/s) and one roughness (m) per case."""
    demand, roughness = case
    net = hg.Network()
    net.fixed_head("tank", head=50.0)
    net.node("a", elevation=8.0, outflow=0.004)
    net.node("b", elevation=10.0, outflow=0.003)
    net.node("c", elevation=12.0, outflow=demand)
    for name, u, v, d, length in [("feed", "tank", "a", 0.2, 300.0), ("ab", "a", "b", 0.15, 200.0),
                                  ("ac", "a", "c", 0.1, 250.0), ("bc", "b", "c", 0.1, 150.0)]:
        net.link(name, u, v, hg.Line([hg.Pipe(d, length, roughness)]))
    return net


def cases() -> list:
    rng = np.random.default_rng(11)
    demands = np.linspace(0.001, 0.02, 6)
    # Roughness draws log-uniform over 0.01…1 mm (an invented range for the sweep).
    draws = 10 ** rng.uniform(-5.0, -3.0, size=6)
    return [(float(q), float(e)) for q in demands for e in draws[:2]]


def test_sweep_on_a_local_cluster_equals_the_solves_made_here():
    distributed = pytest.importorskip("distributed")
    water = hg.Fluid.water(288.15)
    local = network_sweep(estate, cases(), water)
    with distributed.LocalCluster(n_workers=2, threads_per_worker=1, processes=False,
                                  dashboard_address=None) as cluster, \
            distributed.Client(cluster) as client:
        remote = network_sweep(estate, cases(), water, client=client)
        hydrants = network_sweep(estate, cases()[:3], water, client=client, hydrant="c",
                                 min_pressure=1.5e5)
    assert remote == local  # the same core: the same bits wherever it ran
    for case, out in zip(cases(), local):
        direct = estate(case).solve(water)
        assert [n["head"] for n in out["nodes"]] == [n.head for n in direct.nodes]
    for case, out in zip(cases()[:3], hydrants):
        assert out["available_flow"] == estate(case).available_flow(water, "c", 1.5e5).flow


def test_sweep_reports_a_failing_case_and_a_half_given_hydrant():
    water = hg.Fluid.water(288.15)
    with pytest.raises(hg.InvalidInputError, match="min_pressure"):
        network_sweep(estate, cases()[:1], water, hydrant="c")
    with pytest.raises(hg.NoSolutionError):
        network_sweep(estate, [(0.001, 1e-4)], water, hydrant="c", min_pressure=9e5)
