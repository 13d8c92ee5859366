"""The Python demo behind ``./run.sh demo``: the same two invented scenarios as the Rust
demo (core/examples/demo.rs), built through the Python API.

1. A hillside orchard's irrigation main: water at 12 °C pumped from a pond through about
   400 m of PVC and steel pipe, fifteen fittings and valves and 38 m of rise to a header
   tank.
2. A workshop's rectangular exhaust duct: air at 30 °C through two duct sizes.
3. A small industrial estate's looped fire-and-service main fed by an elevated tank and a
   booster station: node pressures, and the flow available at one hydrant at a minimum
   residual pressure (the network drawn into target/demo/estate_network.png).

All data are invented for the demonstration. ``python examples/demo.py --numbers`` prints
the key results as ``name value`` lines with every digit (``repr(float)``), the same lines
as ``cargo run --release -p hydrograde --example demo -- --numbers``; a test checks that
both agree bit for bit. With matplotlib installed the demo also draws the orchard's system
curve against the pump into target/demo/orchard_system_curve.png.
"""

from __future__ import annotations

import sys
from pathlib import Path
from typing import List, Optional, Tuple

import hydrograde as hg

REPO = Path(__file__).resolve().parents[1]
PLOT = REPO / "target" / "demo" / "orchard_system_curve.png"

# Inside diameters of the orchard main, m (PVC 3 in and steel 2-1/2 in, schedule 40).
PVC_BORE = 0.0779
STEEL_BORE = 0.0627

# Water at 12 °C and one standard atmosphere; the orchard's design flow, m³/s.
WATER_TEMPERATURE = 285.15
DESIGN_FLOW = 6.0e-3
# An invented pump: flow L/s against head m.
PUMP_FLOWS_LPS = [0.0, 2.0, 4.0, 6.0, 8.0, 10.0]
PUMP_HEADS = [78.0, 77.0, 74.0, 68.5, 60.0, 47.0]

# Air at 30 °C and one standard atmosphere through the duct, m³/s.
AIR_TEMPERATURE = 303.15
DUCT_FLOW = 0.9

ATMOSPHERE = 101_325.0
CAUTION = (
    "Caution: these are engineering estimates with stated uncertainty. A design built on "
    "them must be checked by a competent engineer (licensed or registered where the law requires it) against the codes and standards that apply where it is built."
)


def orchard_line() -> hg.Line:
    def pvc(length: float) -> hg.Pipe:
        return hg.Pipe.of_material(hg.Section.circle(PVC_BORE), length, "pvc")

    def steel(length: float) -> hg.Pipe:
        return hg.Pipe.of_material(hg.Section.circle(STEEL_BORE), length, "commercial_steel")

    named = hg.Fitting.named
    return hg.Line([
        hg.Fitting.from_tank(),
        named("y_strainer"),
        pvc(6.0),
        named("gate_valve"),
        named("elbow_90_standard"),
        pvc(140.0),
        named("elbow_45_standard"),
        pvc(120.0),
        named("tee_run_flanged"),
        hg.Fitting.contraction(PVC_BORE, STEEL_BORE),
        steel(95.0),
        named("elbow_90_long_radius"),
        named("elbow_90_long_radius"),
        steel(45.0),
        named("elbow_45_long_radius"),
        named("ball_valve"),
        named("globe_valve"),
        hg.Rise(38.0),
        hg.Fitting.into_tank(),
    ])


def duct_line() -> hg.Line:
    big = hg.Section.rectangle(0.40, 0.25)
    small = hg.Section.rectangle(0.30, 0.20)
    d1, d2 = big.hydraulic_diameter, small.hydraulic_diameter
    return hg.Line([
        hg.Fitting.from_tank("rounded", 0.1),
        # Rated by its maker with air at 20 °C and 101 325 Pa.
        hg.Equipment.pressure_drop("grease filter", 120.0, 0.9, rating_density=hg.Fluid.air(293.15).density),
        hg.Pipe.of_material(big, 18.0, "galvanized_steel"),
        hg.Fitting.bend(90.0, 1.5),
        hg.Fitting.contraction(d1, d2),
        hg.Pipe.of_material(small, 12.0, "galvanized_steel"),
        hg.Fitting.bend(45.0, 1.5),
        hg.Rise(4.5),
        hg.Fitting.into_tank(),
    ])


def pump_curve() -> hg.PumpCurve:
    return hg.PumpCurve([q * 1e-3 for q in PUMP_FLOWS_LPS], PUMP_HEADS)


def water() -> hg.Fluid:
    return hg.Fluid.water(WATER_TEMPERATURE, ATMOSPHERE)


def air() -> hg.Fluid:
    return hg.Fluid.air(AIR_TEMPERATURE, ATMOSPHERE)


def band_text(b: hg.Band, digits: int = 3) -> str:
    return f"{b.low:.{digits}f} … {b.high:.{digits}f}"


def source_text(source: Optional[str], index: int, label: str) -> str:
    """The band's largest source, with an element's own K or rating named briefly."""
    if source is None:
        return ""
    own = source.removesuffix(f" (element {index})")
    if own == f"K of {label}":
        return "its own K"
    if own == label:
        return "its own rating"
    return source


def breakdown_rows(r: hg.LineResult) -> List[Tuple[str, ...]]:
    rows: List[Tuple[str, ...]] = []
    elevation = 0.0
    for i, e in enumerate(r.elements):
        # A rise prints its geometric height; its loss column is the head the fluid
        # feels of it (for a gas, net of the surrounding air's column).
        height, elevation = e.elevation_out - elevation, e.elevation_out
        if e.friction_factor is not None:
            coef = f"f {e.friction_factor:.4f}"
        elif e.k is not None:
            coef = f"K {e.k:.3f}"
        else:
            coef = ""
        moving = e.velocity is not None  # None for elements without a bore of their own
        rise = e.static_head != 0.0
        rows.append((
            str(i),
            f"rise {height:+.1f} m" if rise else e.label,
            f"{e.velocity:.2f}" if moving else "",
            f"{e.reynolds:.0f}" if moving else "",
            coef,
            f"{e.static_head if rise else e.head_loss:.3f}",
            "" if rise else band_text(e.head_loss_band),
            "" if rise else source_text(e.head_loss_band.dominant, i, e.label),
            ", ".join(e.warnings),
        ))
    return rows


def print_breakdown(r: hg.LineResult, pressure_unit: str) -> None:
    head = ("#", "element", "V m/s", "Re", "f or K", "loss m", "band (95 %) m",
            "largest source", "warnings")
    rows = [head] + breakdown_rows(r)
    widths = [max(len(row[c]) for row in rows) for c in range(len(head))]
    right = {0, 2, 3, 5}
    for row in rows:
        cells = [
            cell.rjust(w) if c in right else cell.ljust(w)
            for c, (cell, w) in enumerate(zip(row, widths))
        ]
        print("  " + "  ".join(cells).rstrip())
    if pressure_unit == "kPa":
        pressure = f"{r.pressure_loss / 1e3:.1f} kPa"
    else:
        pressure = f"{r.pressure_loss:.0f} Pa"
    print(
        f"  friction + minor loss {r.head_loss:.3f} m ({band_text(r.head_loss_band)}), "
        f"pressure loss {pressure}, static head {r.static_head:.2f} m"
    )
    print(f"  required head {r.required_head:.3f} m, band {band_text(r.required_head_band)} m")
    top = [f"{s} {100 * share:.0f} %" for s, share in r.required_head_band.contributions[:3]]
    print(f"  band sources: {', '.join(top)}")


def orchard() -> None:
    print(f"\n1. Hillside orchard irrigation main (water 12 °C, design flow "
          f"{DESIGN_FLOW * 1e3:.1f} L/s)\n")
    w, line, pump = water(), orchard_line(), pump_curve()
    r = line.evaluate(w, DESIGN_FLOW)
    print_breakdown(r, "kPa")

    print("\n  system curve against the pump")
    print(f"  {'Q L/s':>8} {'system m':>12} {'pump m':>10}")
    flows = [i * 1e-3 for i in range(11)]
    for q, h in zip(flows, line.system_curve(w, flows)):
        print(f"  {q * 1e3:>8.1f} {h:>12.2f} {pump.head(q):>10.2f}")
    op = line.operating_point(w, pump)
    print(
        f"  operating point: {op.flow * 1e3:.2f} L/s at {op.head:.2f} m (flow band "
        f"{op.flow_band.low * 1e3:.2f} … {op.flow_band.high * 1e3:.2f} L/s, largest source: "
        f"{op.flow_band.dominant or '-'})"
    )
    back = line.flow_for_head(w, 0.0)
    print(
        f"  run backwards by gravity from the tank (pump bypassed): {-back.flow * 1e3:.2f} L/s "
        f"({-back.flow_band.high * 1e3:.2f} … {-back.flow_band.low * 1e3:.2f} L/s)"
    )
    s = line.size(w, DESIGN_FLOW, max_velocity=2.0, table="pvc", schedule="40", material="pvc")
    print(
        f"  one size for the whole main in PVC, velocity ≤ 2 m/s at {DESIGN_FLOW * 1e3:.0f} L/s: "
        f"inside diameter ≥ {s.min_inside_diameter * 1e3:.1f} mm"
    )
    c = s.standard
    if c is not None:
        print(
            f"  smallest PVC schedule 40: NPS {c['nominal']} (ID {c['inside_diameter'] * 1e3:.1f} "
            f"mm, {c['velocity']:.2f} m/s, loss {c['pressure_loss'] / 1e3:.1f} kPa)"
        )
    plot(line, w, pump)


def plot(line: hg.Line, fluid: hg.Fluid, pump: hg.PumpCurve) -> None:
    """The system curve with its band, the pump and the operating point, as a PNG."""
    try:
        import matplotlib

        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
    except ImportError:
        print("  (matplotlib is not installed: no plot drawn)")
        return
    import numpy as np

    from hydrograde import plotting

    fig, ax = plt.subplots(figsize=(7.2, 4.6), layout="constrained")
    plotting.system_curve(line, fluid, np.linspace(0.0, 10e-3, 81), pump=pump, ax=ax)
    ax.set_title("Orchard main: system curve against the pump (invented data)")
    ax.set_xlim(0.0, 10.5e-3)
    PLOT.parent.mkdir(parents=True, exist_ok=True)
    fig.savefig(PLOT, dpi=130)
    plt.close(fig)
    print(f"  plot of the system curve and the pump written to {PLOT}")


def duct() -> None:
    print(f"\n2. Workshop exhaust duct (air 30 °C, {DUCT_FLOW} m³/s, galvanised rectangular duct)\n")
    r = duct_line().evaluate(air(), DUCT_FLOW)
    print_breakdown(r, "Pa")
    # A gas line leads with pressure: rho g (required head), losses plus the stack effect.
    b = r.required_head_band
    rho_g = r.density * 9.80665
    print(
        f"  fan must supply {r.required_pressure:.0f} Pa ({b.low * rho_g:.0f} … "
        f"{b.high * rho_g:.0f} Pa): losses {r.pressure_loss:.0f} Pa, stack effect "
        f"{r.required_pressure - r.pressure_loss:.0f} Pa"
    )


# The estate's junctions: name, elevation m, service demand L/s, plan x, y m (invented).
ESTATE_NODES = [
    ("gate", 18.0, 2.0, 0.0, 0.0),
    ("unit_1", 19.0, 1.5, 0.0, 220.0),
    ("unit_2", 21.0, 2.5, 200.0, 220.0),
    ("hydrant_h3", 23.0, 0.0, 240.0, 110.0),
    ("unit_3", 22.0, 1.0, 260.0, 0.0),
    ("yard", 20.0, 0.5, 110.0, 60.0),
]
# The estate's pipes: name, upstream, downstream, inside diameter m, length m
# (cement-lined ductile iron, each with a gate valve; the booster main also a check valve).
ESTATE_LINKS = [
    ("tank_main", "tower_tank", "gate", 0.200, 350.0),
    ("booster_main", "break_tank", "unit_3", 0.150, 250.0),
    ("north_1", "gate", "unit_1", 0.150, 220.0),
    ("north_2", "unit_1", "unit_2", 0.150, 200.0),
    ("east_1", "unit_2", "hydrant_h3", 0.150, 120.0),
    ("east_2", "hydrant_h3", "unit_3", 0.150, 120.0),
    ("south", "unit_3", "yard", 0.100, 180.0),
    ("west", "yard", "gate", 0.150, 260.0),
    ("cross", "unit_1", "yard", 0.100, 150.0),
]
TOWER_LEVEL = 62.0  # m above the datum
BREAK_TANK_LEVEL = 19.0  # m above the datum: the booster station's break tank
# The booster pump's curve (invented): flow L/s, head m.
BOOSTER_FLOWS = [0.0, 40.0, 80.0, 120.0, 160.0, 200.0]
BOOSTER_HEADS = [42.0, 41.0, 38.5, 34.0, 27.5, 19.0]
HYDRANT = "hydrant_h3"
RESIDUAL_PRESSURE = 140e3  # Pa: an invented illustration, not a code value
ESTATE_PLOT = REPO / "target" / "demo" / "estate_network.png"


def estate_network() -> hg.Network:
    net = hg.Network()
    net.fixed_head("tower_tank", head=TOWER_LEVEL, x=-250.0, y=-120.0)
    net.fixed_head("break_tank", head=BREAK_TANK_LEVEL, elevation=17.0, x=420.0, y=-120.0)
    for name, z, q, x, y in ESTATE_NODES:
        net.node(name, elevation=z, outflow=q * 1e-3, x=x, y=y)
    for name, up, down, d, length in ESTATE_LINKS:
        elements = []
        if name == "booster_main":  # the booster station: its pump and non-return valve
            curve = hg.PumpCurve([q * 1e-3 for q in BOOSTER_FLOWS], BOOSTER_HEADS)
            elements += [hg.Pump(curve, label="booster pump"), hg.Fitting.named("swing_check_valve")]
        elements += [
            hg.Pipe.of_material(hg.Section.circle(d), length, "cement_lined_ductile_iron"),
            hg.Fitting.named("gate_valve"),
        ]
        net.link(name, up, down, hg.Line(elements))
    return net


def estate() -> None:
    print("\n3. Industrial estate fire-and-service main (water 10 °C, looped, tower tank and "
          "booster)\n")
    print(f"  tower tank level {TOWER_LEVEL:.1f} m; booster pump (shut-off head {BOOSTER_HEADS[0]:.0f} m) "
          f"from a break tank at {BREAK_TANK_LEVEL:.1f} m")
    w = hg.Fluid.water(283.15, ATMOSPHERE)
    net = estate_network()
    s = net.solve(w)
    print(f"  service demands only ({s.iterations} Newton iterations):")
    print(f"  {'node':<12} {'z m':>7} {'head m':>8} {'p kPa':>10} {'out L/s':>9}")
    for n in s.nodes:
        print(f"  {n.name:<12} {n.elevation:>7.1f} {n.head:>8.2f} {n.pressure / 1e3:>10.1f} "
              f"{n.outflow * 1e3:>9.2f}")
    print(f"  {'link':<13} {'Q L/s':>9} {'V m/s':>8}")
    for k in s.links:
        print(f"  {k.name:<13} {k.flow * 1e3:>9.2f} {k.velocity or 0.0:>8.2f}")
    at_node = net.available_flow(w, HYDRANT, RESIDUAL_PRESSURE)
    everywhere = net.available_flow(w, HYDRANT, RESIDUAL_PRESSURE, every_junction=True)
    print(f"\n  flow available at {HYDRANT} with {RESIDUAL_PRESSURE / 1e3:.0f} kPa residual there: "
          f"{at_node.flow * 1e3:.1f} L/s on top of the service demands")
    print(f"  with {RESIDUAL_PRESSURE / 1e3:.0f} kPa kept at every junction: "
          f"{everywhere.flow * 1e3:.1f} L/s (the limit binds at {everywhere.critical})")
    for n in everywhere.solution.nodes:
        if n.fixed:
            print(f"  {n.name} supplies {-n.outflow * 1e3:.1f} L/s")
    for kind, _, message in everywhere.solution.warnings:
        if kind != "line_warnings":
            print(f"  warning: {message}")
    print(f"  Fire flow: the fire-protection codes that apply, and the authority that enforces them, "
          f"set the\n  required flow, duration and residual pressure; the "
          f"{RESIDUAL_PRESSURE / 1e3:.0f} kPa here is an invented figure. These\n  are estimates "
          "(friction ±10 %, roughness of a main in service uncertain), to be confirmed by\n  a "
          "competent engineer and by a flow test on the real main.")
    plot_estate(everywhere.solution)


def plot_estate(solution: hg.NetworkSolution) -> None:
    """The main with the hydrant drawing its available flow, as a PNG."""
    try:
        import matplotlib

        matplotlib.use("Agg")
        import matplotlib.pyplot as plt
    except ImportError:
        return
    fig, ax = plt.subplots(figsize=(7.2, 5.0), layout="constrained")
    with hg.display(flow="L/s", pressure="kPa"):
        solution.plot(ax=ax)
    ax.set_title("Estate main, hydrant_h3 drawing its available flow (invented data)")
    ESTATE_PLOT.parent.mkdir(parents=True, exist_ok=True)
    fig.savefig(ESTATE_PLOT, dpi=130)
    plt.close(fig)
    print(f"  plot of the main written to {ESTATE_PLOT}")


def numbers() -> None:
    """The key results, one ``name value`` line each with every digit (repr of a float is
    the shortest string that reads back to the same double, as Rust's ``{:?}``)."""
    w, line = water(), orchard_line()
    r = line.evaluate(w, DESIGN_FLOW)
    op = line.operating_point(w, pump_curve())
    back = line.flow_for_head(w, 0.0)
    s = line.size(w, DESIGN_FLOW, max_velocity=2.0, table="pvc", schedule="40", material="pvc")
    d = duct_line().evaluate(air(), DUCT_FLOW)
    rows = [
        ("orchard_required_head", r.required_head),
        ("orchard_required_head_low", r.required_head_band.low),
        ("orchard_required_head_high", r.required_head_band.high),
        ("orchard_pressure_loss", r.pressure_loss),
        ("orchard_operating_flow", op.flow),
        ("orchard_operating_head", op.head),
        ("orchard_gravity_flow", back.flow),
        ("orchard_min_inside_diameter", s.min_inside_diameter),
        (
            "orchard_standard_inside_diameter",
            float("nan") if s.standard is None else s.standard["inside_diameter"],
        ),
        ("duct_pressure_loss", d.pressure_loss),
        ("duct_pressure_loss_low", d.pressure_loss_band.low),
        ("duct_pressure_loss_high", d.pressure_loss_band.high),
    ]
    w10, net = hg.Fluid.water(283.15, ATMOSPHERE), estate_network()
    e = net.solve(w10)
    at_node = net.available_flow(w10, HYDRANT, RESIDUAL_PRESSURE)
    everywhere = net.available_flow(w10, HYDRANT, RESIDUAL_PRESSURE, every_junction=True)
    rows += [
        ("estate_hydrant_pressure", e.node(HYDRANT).pressure),
        ("estate_tank_main_flow", e.links[0].flow),
        ("estate_booster_main_flow", e.links[1].flow),
        ("estate_available_at_hydrant", at_node.flow),
        ("estate_available_everywhere", everywhere.flow),
        ("estate_available_pressure", everywhere.pressure),
    ]
    for name, value in rows:
        print(f"{name} {float(value)!r}")


def main(argv: List[str]) -> int:
    try:
        if "--numbers" in argv:
            numbers()
            return 0
        print(f"hydrograde {hg.__version__} demo (Python): invented scenarios, engineering "
              "estimates with 95 % bands.")
        orchard()
        duct()
        estate()
    except hg.HydrogradeError as e:
        print(f"error: {e}", file=sys.stderr)
        return 1
    print(f"\n{CAUTION}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
