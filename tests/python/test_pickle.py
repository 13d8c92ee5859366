"""Every object pickles (through the core's serde form) and travels to worker processes."""

from __future__ import annotations

import pickle

import numpy as np
import pytest

import hydrograde as hg


def objects():
    """One instance of every pickleable class of the package."""
    return [hg.friction(3000.0, 1e-4), hg.friction(1e6, 0.0, "blasius")]


@pytest.mark.parametrize("protocol", range(2, pickle.HIGHEST_PROTOCOL + 1))
def test_objects_round_trip(protocol):
    for obj in objects():
        back = pickle.loads(pickle.dumps(obj, protocol=protocol))
        assert type(back) is type(obj)
        assert back == obj
        assert repr(back) == repr(obj)


def test_state_is_the_core_serde_form():
    fr = hg.friction(1e5, 1e-4)
    _, (state,) = fr.__reduce__()
    assert isinstance(state, bytes) and state.startswith(b"{")
    with pytest.raises(ValueError, match="not a hydrograde state"):
        type(fr)._from_state(b"{}")


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
        pids = set(client.run(lambda: __import__("os").getpid()).values())
    assert len(pids) == 2
    for chunk, out in zip(re_chunks, arrays):
        assert np.array_equal(out, hg.darcy_factor(chunk, 1e-4))
    assert objs == [hg.friction(1e5, 1e-4), hg.friction(3000.0, 0.0)]
    assert echoed == objects()
