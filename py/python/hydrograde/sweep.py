"""Parameter sweeps of networks, locally or on a Dask cluster.

A sweep maps the core's network solve over cases: each case (a demand set, a roughness
draw, …) goes to a ``build`` function that returns a :class:`hydrograde.Network`, which
is solved for the fluid where the task runs. Nothing here computes: the numbers are the
core's, the same bits whichever worker solved them. Dask stays optional: pass a
``distributed.Client`` and its ``map``/``gather`` carry the tasks; without one the cases
run here, one after another.
"""

from __future__ import annotations

from typing import Any, Callable, Dict, Iterable, List, Optional

from hydrograde._native import Fluid, Network


def _solve_case(build: Callable[[Any], Network], case: Any, fluid: Fluid,
                hydrant: Optional[str], min_pressure: Optional[float]) -> Dict[str, Any]:
    net = build(case)
    if hydrant is None:
        return net.solve(fluid).to_dict()
    assert min_pressure is not None
    a = net.available_flow(fluid, hydrant, min_pressure)
    out = a.solution.to_dict()
    out["available_flow"] = a.flow
    return out


def network_sweep(
    build: Callable[[Any], Network],
    cases: Iterable[Any],
    fluid: Fluid,
    *,
    client: Any = None,
    hydrant: Optional[str] = None,
    min_pressure: Optional[float] = None,
) -> List[Dict[str, Any]]:
    """Solves ``build(case)`` for ``fluid`` for every case and returns each solution's
    ``to_dict()`` (plain data, so it travels between processes), in the order of
    ``cases``. With ``hydrant`` and ``min_pressure`` (Pa) each case also answers
    :meth:`Network.available_flow` there (key ``"available_flow"``, m³/s; the tables are
    then those of the solution with that flow drawn). ``client``: a
    ``distributed.Client`` to spread the cases over its workers (``build`` must then be
    picklable for process workers: a module-level function). A failing case raises its
    :class:`hydrograde.HydrogradeError` here.
    """
    if (hydrant is None) != (min_pressure is None):
        from hydrograde._errors import InvalidInputError

        raise InvalidInputError("min_pressure: give hydrant and min_pressure together",
                                parameter="min_pressure")
    items = list(cases)
    if client is None:
        return [_solve_case(build, c, fluid, hydrant, min_pressure) for c in items]
    n = len(items)
    futures = client.map(_solve_case, [build] * n, items, [fluid] * n, [hydrant] * n,
                         [min_pressure] * n, pure=False)
    return list(client.gather(futures))
