"""Networks from Python: an independent scipy solution, the line and split solvers, check
valves, errors, and the same bits as the C ABI."""

from __future__ import annotations

import ctypes
import math
import os
from pathlib import Path

import pytest
from scipy.optimize import fsolve

import hydrograde as hg

G0 = 9.80665  # standard gravity, exact (3rd CGPM 1901; NIST SP 811)
REPO = Path(__file__).resolve().parents[2]
LIB = Path(os.environ.get("HYDROGRADE_LIB", REPO / "target" / "release" / "libhydrograde.so"))

# An invented layout: three tanks (100, 80, 40 m) feed or take from one junction at
# 30 m that draws 0.02 m³/s. Pipes (D m, L m, roughness m).
PIPES = [(0.3, 1500.0, 1e-3), (0.25, 1000.0, 1e-3), (0.2, 2000.0, 1e-3)]
LEVELS = [100.0, 80.0, 40.0]


@pytest.fixture()
def water():
    return hg.Fluid(999.1, 1.138e-3)


def rough_r(d: float, length: float, e: float) -> float:
    """r of Δh = r·Q|Q|: fully rough f = [2 log10(3.7 D/ε)]⁻² (von Kármán), Darcy–Weisbach."""
    f = 1.0 / (2.0 * math.log10(3.7 * d / e)) ** 2
    return 8.0 * f * length / (G0 * math.pi**2 * d**5)


def three_reservoirs() -> hg.Network:
    net = hg.Network()
    net.node("j", elevation=30.0, outflow=0.02)
    for i, ((d, length, e), level) in enumerate(zip(PIPES, LEVELS)):
        net.fixed_head(f"t{i}", head=level)
        line = hg.Line([hg.Pipe(d, length, e)], correlation="fully_rough")
        net.link(f"p{i}", f"t{i}", "j", line)
    return net


def test_three_reservoirs_match_scipy_fsolve(water):
    s = three_reservoirs().solve(water)
    rs = [rough_r(*p) for p in PIPES]

    # Reference: scipy.optimize.fsolve on continuity at the junction, flows in closed form.
    def residual(h):
        return [
            sum(math.copysign(math.sqrt(abs(t - h[0]) / r), t - h[0]) for t, r in zip(LEVELS, rs))
            - 0.02
        ]

    (hj,) = fsolve(residual, [60.0], xtol=1e-14)
    j = s.node("j")
    assert j.head == pytest.approx(hj, abs=1e-9)
    assert j.pressure == pytest.approx(999.1 * G0 * (hj - 30.0), rel=1e-9)
    for i, (t, r) in enumerate(zip(LEVELS, rs)):
        q = math.copysign(math.sqrt(abs(t - hj) / r), t - hj)
        assert s.link(f"p{i}").flow == pytest.approx(q, rel=1e-9)
    # Continuity at the junction to 1e-12 of the largest flow.
    flows = [link.flow for link in s.links]
    assert abs(sum(flows) - 0.02) <= 1e-12 * max(map(abs, flows))
    # Tanks: outflow is what they take (negative when they feed).
    assert sum(n.outflow for n in s.nodes if n.fixed) == pytest.approx(-0.02, rel=1e-12)


def test_two_parallel_links_match_split_flow(water):
    one = hg.Line([hg.Pipe(0.1, 120.0, 4.5e-5), hg.Fitting.named("elbow_90_standard")])
    two = hg.Line([hg.Pipe(0.08, 90.0, 1.5e-6)])
    net = hg.Network()
    net.fixed_head("source", head=60.0)
    net.node("a", elevation=0.0)
    net.node("b", elevation=0.0, outflow=0.03)
    net.link("feed", "source", "a", hg.Line([hg.Pipe(0.15, 50.0, 4.5e-5)]))
    net.link("one", "a", "b", one)
    net.link("two", "a", "b", two)
    s = net.solve(water)
    split = hg.split_flow([one, two], water, 0.03)
    assert s.link("one").flow == pytest.approx(split.flows[0], rel=1e-12)
    assert s.link("two").flow == pytest.approx(split.flows[1], rel=1e-12)
    # Breakdown of a link: its line at the solved flow.
    r = net.link_result(water, s, "one")
    assert r == one.evaluate(water, s.link("one").flow)


def test_single_pipe_between_tanks_equals_flow_for_head(water):
    line = hg.Line([hg.Pipe(0.2, 1000.0, 4.5e-5)])
    net = hg.Network()
    net.fixed_head("upper", head=50.0)
    net.fixed_head("lower", head=20.0)
    net.link("p", "upper", "lower", line)
    s = net.solve(water)
    assert s.link("p").flow == pytest.approx(line.flow_for_head(water, 30.0).flow, rel=1e-12)


def test_check_valve_closes_and_warns(water):
    guarded = hg.Line([hg.Pipe(0.1, 150.0, 4.5e-5), hg.Fitting.named("swing_check_valve")])
    net = hg.Network()
    net.fixed_head("A", head=50.0)
    net.node("J", elevation=5.0, outflow=0.01)
    net.fixed_head("B", head=60.0)
    net.link("feed", "A", "J", hg.Line([hg.Pipe(0.1, 200.0, 4.5e-5)]))
    net.link("guarded", "J", "B", guarded)
    s = net.solve(water)
    assert s.link("guarded").closed and s.link("guarded").flow == 0.0
    assert s.link("feed").flow == pytest.approx(0.01, rel=1e-12)
    assert ("check_valve_closed", "guarded") in [(k, n) for k, n, _ in s.warnings]


def test_bad_input_errors_name_the_node_or_link(water):
    line = hg.Line([hg.Pipe(0.1, 100.0, 4.5e-5)])
    net = hg.Network()
    net.node("a", elevation=0.0, outflow=0.001)
    with pytest.raises(hg.InvalidInputError, match='"a"'):
        net.node("a", elevation=1.0)
    with pytest.raises(hg.UnknownNameError, match="nowhere"):
        net.link("x", "a", "nowhere", line)
    with pytest.raises(hg.InvalidInputError, match="itself"):
        net.link("self", "a", "a", line)
    with pytest.raises(hg.OutOfRangeError, match="elevation"):
        net.node("deep", elevation=-50_000.0)
    with pytest.raises(hg.NotFiniteError):
        net.node("nan", elevation=0.0, outflow=float("nan"))
    net.node("b", elevation=0.0)
    net.link("p", "a", "b", line)
    with pytest.raises(hg.InvalidInputError, match="fixed-head"):
        net.solve(water)
    with pytest.raises(hg.InvalidInputError, match='"p"'):
        net.link("p", "a", "b", line)
    net.fixed_head("t", head=10.0)
    net.link("feed", "t", "a", line)
    net.node("island", elevation=0.0)
    with pytest.raises(hg.InvalidInputError, match='"island" is joined to no link'):
        net.solve(water)
    s = three_reservoirs().solve(water)
    with pytest.raises(hg.UnknownNameError):
        s.node("zz")


@pytest.mark.skipif(not LIB.exists(), reason=f"{LIB} is absent: build it with scripts/test-c.sh")
def test_same_bits_as_the_c_abi(water):
    so = ctypes.CDLL(str(LIB))
    vp = ctypes.c_void_p
    d = ctypes.c_double
    so.hg_fluid_liquid.argtypes = [d, d, ctypes.POINTER(vp)]
    so.hg_line_new.argtypes = [ctypes.POINTER(vp)]
    so.hg_line_add_pipe.argtypes = [vp, d, d, d]
    so.hg_line_free.argtypes = [vp]
    so.hg_fluid_free.argtypes = [vp]
    so.hg_network_new.argtypes = [ctypes.POINTER(vp)]
    so.hg_network_add_node.argtypes = [vp, ctypes.c_char_p, d, d]
    so.hg_network_add_fixed_head.argtypes = [vp, ctypes.c_char_p, d, ctypes.POINTER(d)]
    so.hg_network_add_link.argtypes = [vp, ctypes.c_char_p, ctypes.c_char_p, ctypes.c_char_p, vp]
    so.hg_network_solve.argtypes = [vp, vp, ctypes.POINTER(vp)]
    so.hg_network_solution_node.argtypes = [vp, ctypes.c_size_t] + [ctypes.POINTER(d)] * 4
    so.hg_network_solution_link.argtypes = [
        vp, ctypes.c_size_t, ctypes.POINTER(d), ctypes.POINTER(d), ctypes.POINTER(ctypes.c_int32),
        ctypes.POINTER(d), ctypes.POINTER(ctypes.c_int32), ctypes.POINTER(ctypes.c_uint32),
    ]
    so.hg_network_free.argtypes = [vp]
    so.hg_network_solution_free.argtypes = [vp]
    # A looped invented main: tank → a → (b, c) → d, with a cross link b–c (Colebrook).
    links = [("m", "T", "a", 0.2, 400.0), ("ab", "a", "b", 0.15, 300.0), ("ac", "a", "c", 0.1, 250.0),
             ("bd", "b", "d", 0.1, 350.0), ("cd", "c", "d", 0.15, 200.0), ("bc", "b", "c", 0.08, 150.0)]
    nodes = [("a", 12.0, 0.005), ("b", 15.0, 0.01), ("c", 9.0, 0.004), ("d", 11.0, 0.012)]
    net = hg.Network()
    net.fixed_head("T", head=70.0)
    for n, z, q in nodes:
        net.node(n, elevation=z, outflow=q)
    for name, u, v, dia, length in links:
        net.link(name, u, v, hg.Line([hg.Pipe(dia, length, 4.5e-5)]))
    s = net.solve(water)

    fl, cn = vp(), vp()
    assert so.hg_fluid_liquid(999.1, 1.138e-3, ctypes.byref(fl)) == 0
    assert so.hg_network_new(ctypes.byref(cn)) == 0
    assert so.hg_network_add_fixed_head(cn, b"T", 70.0, None) == 0
    for n, z, q in nodes:
        assert so.hg_network_add_node(cn, n.encode(), z, q) == 0
    for name, u, v, dia, length in links:
        ln = vp()
        assert so.hg_line_new(ctypes.byref(ln)) == 0
        assert so.hg_line_add_pipe(ln, dia, length, 4.5e-5) == 0
        assert so.hg_network_add_link(cn, name.encode(), u.encode(), v.encode(), ln) == 0
        so.hg_line_free(ln)
    cs = vp()
    assert so.hg_network_solve(cn, fl, ctypes.byref(cs)) == 0
    for i, n in enumerate(s.nodes):
        h, z, p, o = d(), d(), d(), d()
        assert so.hg_network_solution_node(cs, i, ctypes.byref(h), ctypes.byref(z), ctypes.byref(p), ctypes.byref(o)) == 0
        assert (h.value, p.value, o.value) == (n.head, n.pressure, n.outflow)
    for i, link in enumerate(s.links):
        q, v, drop = d(), d(), d()
        hv, closed, w = ctypes.c_int32(), ctypes.c_int32(), ctypes.c_uint32()
        assert so.hg_network_solution_link(
            cs, i, ctypes.byref(q), ctypes.byref(v), ctypes.byref(hv), ctypes.byref(drop),
            ctypes.byref(closed), ctypes.byref(w),
        ) == 0
        assert (q.value, v.value, drop.value) == (link.flow, link.velocity, link.head_drop)
    so.hg_network_solution_free(cs)
    so.hg_network_free(cn)
    so.hg_fluid_free(fl)


def test_bands_hold_the_solution_and_name_their_sources(water):
    net = three_reservoirs()
    s = net.solve(water)
    b = net.bands(water, s)
    assert isinstance(b, hg.NetworkBands)
    assert len(b.heads) == len(s.nodes) and len(b.flows) == len(s.links)
    # The nominal values are the solution's own numbers, bit for bit (same core).
    j = b.heads[0]
    assert j.nominal == s.nodes[0].head and j.low < j.nominal < j.high
    assert b.pressures[0].nominal == s.nodes[0].pressure
    for band, link in zip(b.flows, s.links):
        assert band.nominal == link.flow and band.low < band.high
    # Tank heads are given: exact.
    assert b.heads[1].low == b.heads[1].high
    # A solution of another network is refused, naming the argument.
    other = hg.Network()
    other.fixed_head("t", head=10.0)
    with pytest.raises(hg.HydrogradeError, match="solution"):
        other.bands(water, s)


def test_json_round_trip_and_bad_versions(water):
    net = three_reservoirs()
    text = net.to_json()
    back = hg.Network.from_json(text)
    # Same document back, and the same solution bit for bit (exact: the text keeps every bit).
    assert back.to_json() == text
    assert back.solve(water).nodes[0].head == net.solve(water).nodes[0].head
    with pytest.raises(hg.HydrogradeError, match="version 7"):
        hg.Network.from_json(text.replace('"hydrograde_network": 1', '"hydrograde_network": 7'))
    with pytest.raises(hg.HydrogradeError, match="not a network document"):
        hg.Network.from_json("[]")
