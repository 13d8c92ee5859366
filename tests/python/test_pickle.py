"""Every object pickles (through the core's serde form) and travels to worker processes."""

from __future__ import annotations

import pickle

import numpy as np
import pytest

import hydrograde as hg


def objects():
    """One instance of every pickleable class of the package."""
    return [
        hg.friction(3000.0, 1e-4),
        hg.friction(1e6, 0.0, "blasius"),
        hg.Fluid.water(293.15),
        hg.Fluid.air(300.0, 2e5),
        hg.Fluid(870.0, 0.03).with_uncertainty(0.01, 0.05).with_vapour_pressure(500.0),
        hg.Section.circle(0.1),
        hg.Section.rectangle(0.3, 0.1),
        hg.Section.custom(0.01, 0.5, 70.0),
        hg.Fitting.k(0.9, diameter=0.05),
        hg.Fitting.three_k(800.0, 0.14, 4.0),
        hg.Fitting.expansion(0.05, 0.1),
        hg.Fitting.named(hg.Fitting.catalogue()[0]["name"]),
        *_line_objects(),
    ]


def _line():
    return hg.Line(
        [hg.Fitting.from_tank(), hg.Pipe(0.1, 120.0, 4.5e-5), hg.Rise(8.0),
         hg.Equipment.pressure_drop("filter", 2e4, 0.01), hg.Fitting.into_tank()],
        inlet_pressure=2e5,
    )


def _line_objects():
    water = hg.Fluid.water(288.15)
    line = _line()
    result = line.evaluate(water, 0.012)
    pump = hg.PumpCurve([0.0, 0.01, 0.02, 0.03], [60.0, 55.0, 45.0, 28.0])
    return [
        line, hg.Pipe(hg.Section.annulus(0.1, 0.05), 3.0, 1e-5), hg.Rise(-2.5),
        hg.Equipment.fixed_k("meter", 3.0), pump, result, result.elements[2],
        result.head_loss_band, line.flow_for_head(water, 30.0),
        line.operating_point(water, pump),
        hg.split_flow([line, line], water, 0.02),
        hg.Pipe.of_material(0.1, 10.0, "commercial_steel"),
        line.size(water, 0.012, max_pressure_loss=1e5, table="steel", schedule="40"),
    ]


def state(obj):
    """The serde bytes of an object (compares NaN fields bit for bit, unlike ==)."""
    return obj.__reduce__()[1][0]


@pytest.mark.parametrize("protocol", range(2, pickle.HIGHEST_PROTOCOL + 1))
def test_objects_round_trip(protocol):
    for obj in objects():
        back = pickle.loads(pickle.dumps(obj, protocol=protocol))
        assert type(back) is type(obj)
        assert state(back) == state(obj)
        assert repr(back) == repr(obj)
        if not isinstance(obj, (hg.LineResult, hg.ElementResult)):  # these hold NaN fields
            assert back == obj


def test_state_is_the_core_serde_form():
    fr = hg.friction(1e5, 1e-4)
    _, (state,) = fr.__reduce__()
    assert isinstance(state, bytes)
    # MessagePack map of the core's serde field names.
    assert b"df_drel_roughness" in state and b"regime" in state
    with pytest.raises(hg.HydrogradeError, match="not a valid hydrograde state"):
        type(fr)._from_state(b"\x80")


def _batch(re: np.ndarray, rr: float) -> np.ndarray:
    return hg.darcy_factor(re, rr)


def test_batch_through_a_dask_local_cluster_with_two_worker_processes():
    distributed = pytest.importorskip("distributed")
    re_chunks = [np.logspace(3, 8, 1000) * (1 + k / 10) for k in range(4)]
    with distributed.LocalCluster(
        n_workers=2, threads_per_worker=1, processes=True, dashboard_address=None,
    ) as cluster, distributed.Client(cluster) as client:
        arrays = client.gather(client.map(_batch, re_chunks, rr=1e-4))
        objs = client.gather(client.map(hg.friction, [1e5, 3000.0], [1e-4, 0.0]))
        echoed = client.gather(client.map(lambda o: o, objects()))
        water = hg.Fluid.water(288.15)
        remote = client.gather(client.map(lambda q, line, fluid: line.evaluate(fluid, q),
                                          [0.005, 0.012], line=_line(), fluid=water))
        pids = set(client.run(lambda: __import__("os").getpid()).values())
    assert len(pids) == 2
    for chunk, out in zip(re_chunks, arrays):
        assert np.array_equal(out, hg.darcy_factor(chunk, 1e-4))
    assert objs == [hg.friction(1e5, 1e-4), hg.friction(3000.0, 0.0)]
    assert [state(o) for o in echoed] == [state(o) for o in objects()]
    assert [state(r) for r in remote] == [state(_line().evaluate(water, q)) for q in (0.005, 0.012)]
