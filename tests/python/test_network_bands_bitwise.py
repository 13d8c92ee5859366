"""One core, one answer for a network's bands: Python and the C ABI give the same bits for
the band of every node head, node pressure and link flow of the same invented two-loop
network (the C tests check the C ABI's network solve against the Rust core's numbers, so
Rust = C = Python).

Needs target/release/libhydrograde.so, built by scripts/test-c.sh; HYDROGRADE_LIB
overrides the path.
"""

from __future__ import annotations

import ctypes
import os
from pathlib import Path

import numpy as np
import pytest

import hydrograde as hg

REPO = Path(__file__).resolve().parents[2]
LIB = Path(os.environ.get("HYDROGRADE_LIB", REPO / "target" / "release" / "libhydrograde.so"))

pytestmark = pytest.mark.skipif(
    not LIB.exists(), reason=f"{LIB} is absent: build it with scripts/test-c.sh"
)

vp = ctypes.c_void_p
dp = ctypes.POINTER(ctypes.c_double)

# An invented two-loop main: a tank, five junctions (name, elevation m, outflow m³/s).
TANK = ("tank", 48.0)
NODES = [("a", 10.0, 0.004), ("b", 12.0, 0.006), ("c", 11.0, 0.003), ("d", 9.0, 0.005),
         ("e", 13.0, 0.002)]
# name, upstream, downstream, bore m, length m, material, fittings
LINKS = [
    ("feed", "tank", "a", 0.15, 400.0, "commercial_steel", ["gate_valve"]),
    ("ab", "a", "b", 0.10, 250.0, "cast_iron", ["elbow_90_standard"]),
    ("bc", "b", "c", 0.08, 200.0, "cast_iron", []),
    ("ad", "a", "d", 0.10, 300.0, "commercial_steel", ["elbow_90_standard", "gate_valve"]),
    ("dc", "d", "c", 0.08, 220.0, "cast_iron", []),
    ("be", "b", "e", 0.08, 180.0, "commercial_steel", ["swing_check_valve"]),
    ("ce", "c", "e", 0.065, 240.0, "cast_iron", []),
]


@pytest.fixture(scope="module")
def lib():
    so = ctypes.CDLL(str(LIB))
    so.hg_line_new.argtypes = [ctypes.POINTER(vp)]
    so.hg_line_add_pipe_material.argtypes = [vp, ctypes.c_double, ctypes.c_double, ctypes.c_char_p]
    so.hg_line_add_fitting.argtypes = [vp, ctypes.c_char_p, ctypes.c_double]
    so.hg_line_free.argtypes = [vp]
    so.hg_fluid_water.argtypes = [ctypes.c_double, ctypes.c_double, ctypes.POINTER(vp)]
    so.hg_fluid_free.argtypes = [vp]
    so.hg_network_new.argtypes = [ctypes.POINTER(vp)]
    so.hg_network_free.argtypes = [vp]
    so.hg_network_add_node.argtypes = [vp, ctypes.c_char_p, ctypes.c_double, ctypes.c_double]
    so.hg_network_add_fixed_head.argtypes = [vp, ctypes.c_char_p, ctypes.c_double, dp]
    so.hg_network_add_link.argtypes = [vp, ctypes.c_char_p, ctypes.c_char_p, ctypes.c_char_p, vp]
    so.hg_network_solve.argtypes = [vp, vp, ctypes.POINTER(vp)]
    so.hg_network_solution_free.argtypes = [vp]
    so.hg_network_bands_new.argtypes = [vp, vp, vp, ctypes.POINTER(vp)]
    so.hg_network_bands_free.argtypes = [vp]
    so.hg_network_bands_node.argtypes = [vp, ctypes.c_size_t] + [dp] * 6
    so.hg_network_bands_flow.argtypes = [vp, ctypes.c_size_t] + [dp] * 3
    return so


def python_bands():
    net = hg.Network()
    net.fixed_head(TANK[0], head=TANK[1])
    for name, z, q in NODES:
        net.node(name, elevation=z, outflow=q)
    for name, up, down, d, length, material, fittings in LINKS:
        elements = [hg.Pipe.of_material(hg.Section.circle(d), length, material)]
        elements += [hg.Fitting.named(f) for f in fittings]
        net.link(name, up, down, hg.Line(elements))
    water = hg.Fluid.water(288.15, 101325.0)
    b = net.bands(water, net.solve(water))
    heads = [(x.low, x.nominal, x.high) for x in b.heads]
    pressures = [(x.low, x.nominal, x.high) for x in b.pressures]
    flows = [(x.low, x.nominal, x.high) for x in b.flows]
    return heads, pressures, flows


def c_bands(so):
    net, water, sol, bands = vp(), vp(), vp(), vp()
    assert so.hg_network_new(ctypes.byref(net)) == 0
    assert so.hg_network_add_fixed_head(net, TANK[0].encode(), TANK[1], None) == 0
    for name, z, q in NODES:
        assert so.hg_network_add_node(net, name.encode(), z, q) == 0
    for name, up, down, d, length, material, fittings in LINKS:
        line = vp()
        assert so.hg_line_new(ctypes.byref(line)) == 0
        assert so.hg_line_add_pipe_material(line, d, length, material.encode()) == 0
        for f in fittings:
            assert so.hg_line_add_fitting(line, f.encode(), 0.0) == 0
        assert so.hg_network_add_link(net, name.encode(), up.encode(), down.encode(), line) == 0
        so.hg_line_free(line)
    assert so.hg_fluid_water(288.15, 101325.0, ctypes.byref(water)) == 0
    assert so.hg_network_solve(net, water, ctypes.byref(sol)) == 0
    assert so.hg_network_bands_new(net, water, sol, ctypes.byref(bands)) == 0
    heads, pressures, flows = [], [], []
    for i in range(1 + len(NODES)):
        v = [ctypes.c_double() for _ in range(6)]
        assert so.hg_network_bands_node(bands, i, *[ctypes.byref(x) for x in v]) == 0
        heads.append(tuple(x.value for x in v[:3]))
        pressures.append(tuple(x.value for x in v[3:]))
    for k in range(len(LINKS)):
        v = [ctypes.c_double() for _ in range(3)]
        assert so.hg_network_bands_flow(bands, k, *[ctypes.byref(x) for x in v]) == 0
        flows.append(tuple(x.value for x in v))
    so.hg_network_bands_free(bands)
    so.hg_network_solution_free(sol)
    so.hg_fluid_free(water)
    so.hg_network_free(net)
    return heads, pressures, flows


def bits(rows):
    return np.asarray(rows, dtype=np.float64).view(np.uint64)


def test_network_bands_are_the_same_bits_in_python_and_c(lib):
    py = python_bands()
    c = c_bands(lib)
    for what, a, b in zip(("heads", "pressures", "flows"), py, c):
        assert len(a) == len(b), what
        assert np.array_equal(bits(a), bits(b)), what
    # The bands are real bands: some node head and some link flow has a non-zero width
    # (the catalogue roughness ranges and K spreads are not zero, common practice).
    heads, _, flows = py
    assert any(lo < hi for lo, _, hi in heads[1:])
    assert any(lo < hi for lo, _, hi in flows)
