"""A pump as an element of a line: hydrograde.Pump, Line.pumped_flow, NPSH at the pump's
suction, bad input, and the same bits as the C ABI (ctypes on libhydrograde.so)."""

from __future__ import annotations

import ctypes
import math
import os
import pickle
from pathlib import Path

import pytest

import hydrograde as hg

G = 9.80665  # standard gravity, exact (NIST SP 811)
AREA = math.pi * 0.05**2 / 4.0
REPO = Path(__file__).resolve().parents[2]
LIB = Path(os.environ.get("HYDROGRADE_LIB", REPO / "target" / "release" / "libhydrograde.so"))

# Points on H = 40 - 1.5e5 Q^2 (m; Q in m^3/s, 0 ... 15 L/s): the quadratic least-squares
# fit through points of a parabola is that parabola (exact solution).
FLOWS = [0.015 * i / 10.0 for i in range(11)]
HEADS = [40.0 - 1.5e5 * q * q for q in FLOWS]


def pump_line(inlet_pressure=101325.0) -> hg.Line:
    """Strainer K = 2.5, the pump, K = 12 on 50 mm, a 15 m lift (core_reference.rs's pump line)."""
    return hg.Line(
        [
            hg.Fitting.k(2.5, diameter=0.05),
            hg.Pump(hg.PumpCurve.fit(FLOWS, HEADS, 2), label="booster"),
            hg.Fitting.k(12.0, diameter=0.05),
            hg.Rise(15.0),
        ],
        inlet_pressure=inlet_pressure,
    )


def test_pumped_flow_is_the_closed_form_with_npsh_at_the_suction():
    water = hg.Fluid.water(293.15, 2e5)
    p = pump_line().pumped_flow(water)
    # Energy balance, definition of K: 40 - 1.5e5 Q^2 = 15 + (2.5 + 12) Q^2 / (2 g A^2).
    want = math.sqrt(25.0 / (1.5e5 + 14.5 / (2.0 * G * AREA**2)))
    assert p.flow == pytest.approx(want, rel=1e-12)
    assert p.pump_head == pytest.approx(40.0 - 1.5e5 * want**2, abs=1e-9)
    assert p.pump_row == 1
    row = p.result.elements[1]
    assert row.kind == "pump" and row.label == "booster" and row.head_loss == -p.pump_head
    assert abs(p.result.required_head) < 1e-9
    # NPSH available at the suction (definition, ISO 9906): total pressure after the
    # strainer over the vapour pressure, (p_in + rho V^2/2 - p_v)/(rho g) - K V^2/(2 g).
    rho, pv = p.result.density, p.result.vapour_pressure
    v = p.flow / AREA
    npsh = (101325.0 + 0.5 * rho * v * v - pv) / (rho * G) - 2.5 * v * v / (2.0 * G)
    assert p.npsh_available == pytest.approx(npsh, abs=1e-9)
    assert p.npsh_available == p.result.npsh_available(0)
    # No vapour pressure stated: NPSH does not apply.
    assert pump_line().pumped_flow(hg.Fluid(998.2, 1.002e-3)).npsh_available is None


def test_the_pump_is_a_negative_loss_in_every_call():
    water = hg.Fluid(998.2, 1.0e-3)
    line = pump_line(inlet_pressure=None)
    plain = hg.Line(
        [hg.Fitting.k(2.5, diameter=0.05), hg.Fitting.k(12.0, diameter=0.05), hg.Rise(15.0)]
    )
    q = 0.008
    h_pump = 40.0 - 1.5e5 * q * q  # the curve's own definition
    r = line.evaluate(water, q)
    assert r.required_head == pytest.approx(plain.evaluate(water, q).required_head - h_pump, abs=1e-12)
    assert line.system_curve(water, [0.004, q])[1] == r.required_head
    assert line.flow_for_head(water, r.required_head).flow == pytest.approx(q, abs=1e-12)
    assert isinstance(line.elements[1], hg.Pump)
    assert pickle.loads(pickle.dumps(line.elements[1])) == line.elements[1]


def test_bad_pumps_and_flows_give_errors_naming_them():
    water = hg.Fluid(998.2, 1.0e-3)
    with pytest.raises(hg.HydrogradeError, match="curve"):
        hg.Pump(None)
    with pytest.raises(hg.HydrogradeError, match="curve"):
        hg.Pump([0.0, 0.01, 0.02])
    with pytest.raises(hg.HydrogradeError):
        hg.PumpCurve([], [])
    line = pump_line(inlet_pressure=None)
    with pytest.raises(hg.OutOfRangeError, match=r"not extrapolated.*'booster' \(element 1\).*0\.015"):
        line.evaluate(water, 0.02)
    with pytest.raises(hg.OutOfRangeError, match="reverse"):
        line.required_head(water, -1e-3)
    with pytest.raises(hg.HydrogradeError, match="no pump"):
        hg.Line([hg.Fitting.k(1.0, diameter=0.05)]).pumped_flow(water)
    tall = hg.Line(list(line.elements[:3]) + [hg.Rise(50.0)])
    with pytest.raises(hg.NoSolutionError, match="too weak"):
        tall.pumped_flow(water)


def test_a_negative_section_index_names_the_argument():
    line = hg.Line([hg.Pipe(0.05, 10.0, 4.5e-5), hg.Pipe(0.08, 10.0, 4.5e-5)])
    water = hg.Fluid(998.2, 1.0e-3)
    with pytest.raises(hg.OutOfRangeError, match="section = -1"):
        line.with_uniform_diameter(0.06, section=(-1, 2))
    with pytest.raises(hg.OutOfRangeError, match="section = -2"):
        line.size(water, 3e-3, max_velocity=2.0, section=(0, -2))


@pytest.mark.skipif(not LIB.exists(), reason=f"{LIB} is absent: build it with scripts/test-c.sh")
def test_same_bits_as_the_c_abi():
    lib = ctypes.CDLL(str(LIB))
    d, i32 = ctypes.c_double, ctypes.c_int32
    vp = ctypes.c_void_p
    lib.hg_line_new.argtypes = [ctypes.POINTER(vp)]
    lib.hg_line_add_fitting_k.argtypes = [vp, d, d]
    lib.hg_line_add_pump.argtypes = [vp, ctypes.POINTER(d), ctypes.POINTER(d), ctypes.c_size_t, i32]
    lib.hg_line_add_rise.argtypes = [vp, d]
    lib.hg_line_set_inlet_pressure.argtypes = [vp, d]
    lib.hg_fluid_water.argtypes = [d, d, ctypes.POINTER(vp)]
    lib.hg_line_pumped_flow.argtypes = [vp, vp] + [ctypes.POINTER(d)] * 3 + [ctypes.POINTER(i32), vp]
    lib.hg_line_free.argtypes = [vp]
    lib.hg_fluid_free.argtypes = [vp]
    line, fluid = vp(), vp()
    n = len(FLOWS)
    qs, hs = (d * n)(*FLOWS), (d * n)(*HEADS)
    assert lib.hg_line_new(ctypes.byref(line)) == 0
    assert lib.hg_line_add_fitting_k(line, 2.5, 0.05) == 0
    assert lib.hg_line_add_pump(line, qs, hs, n, 2) == 0
    assert lib.hg_line_add_fitting_k(line, 12.0, 0.05) == 0
    assert lib.hg_line_add_rise(line, 15.0) == 0
    assert lib.hg_line_set_inlet_pressure(line, 101325.0) == 0
    assert lib.hg_fluid_water(293.15, 2e5, ctypes.byref(fluid)) == 0
    q, h, npsh, has = d(), d(), d(), i32()
    status = lib.hg_line_pumped_flow(
        line, fluid, ctypes.byref(q), ctypes.byref(h), ctypes.byref(npsh), ctypes.byref(has), None
    )
    lib.hg_line_free(line)
    lib.hg_fluid_free(fluid)
    assert status == 0 and has.value == 1
    p = pump_line().pumped_flow(hg.Fluid.water(293.15, 2e5))
    assert (p.flow, p.pump_head, p.npsh_available) == (q.value, h.value, npsh.value)
