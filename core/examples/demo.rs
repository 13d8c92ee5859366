//! The demo behind `./run.sh demo`: two invented scenarios worked end to end.
//!
//! 1. A hillside orchard's irrigation main: water at 12 °C pumped from a pond through
//!    about 400 m of PVC and steel pipe, fifteen fittings and valves and 38 m of rise to a
//!    header tank.
//! 2. A workshop's rectangular exhaust duct: air at 30 °C through two duct sizes.
//! 3. A small industrial estate's looped fire-and-service main fed by an elevated tank
//!    and a booster station: node pressures, and the flow available at one hydrant at a
//!    minimum residual pressure.
//!
//! All data are invented for the demonstration.

use hydrograde::Result;
use hydrograde::band::Band;
use hydrograde::fitting::{Edge, Fitting};
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Equipment, Limit, Line, LineResult, PumpCurve, Resize};
use hydrograde::network::{AvailableFlow, LimitAt, Network, NetworkSolution};
use hydrograde::pipe::Pipe;
use hydrograde::section::Section;
use hydrograde::sizes::PipeTable;

/// Inside diameters of the orchard main, m (PVC 3 in and steel 2-1/2 in, schedule 40).
const PVC_BORE: f64 = 0.0779;
const STEEL_BORE: f64 = 0.0627;

fn orchard_line() -> Result<Line> {
    let pvc =
        |len: f64| Pipe::of_material(Section::circle(PVC_BORE)?, len, "pvc").map(Element::Pipe);
    let steel = |len: f64| {
        Pipe::of_material(Section::circle(STEEL_BORE)?, len, "commercial_steel").map(Element::Pipe)
    };
    let named = |n: &str| Fitting::named(n).map(Element::Fitting);
    Line::new(vec![
        Element::Fitting(Fitting::from_tank(Edge::Square)?),
        named("y_strainer")?,
        pvc(6.0)?,
        named("gate_valve")?,
        named("elbow_90_standard")?,
        pvc(140.0)?,
        named("elbow_45_standard")?,
        pvc(120.0)?,
        named("tee_run_flanged")?,
        Element::Fitting(Fitting::contraction(PVC_BORE, STEEL_BORE)?),
        steel(95.0)?,
        named("elbow_90_long_radius")?,
        named("elbow_90_long_radius")?,
        steel(45.0)?,
        named("elbow_45_long_radius")?,
        named("ball_valve")?,
        named("globe_valve")?,
        Element::rise(38.0)?,
        Element::Fitting(Fitting::into_tank()),
    ])
}

fn duct_line() -> Result<Line> {
    let big = Section::rectangle(0.40, 0.25)?;
    let small = Section::rectangle(0.30, 0.20)?;
    let (d1, d2) = (big.hydraulic_diameter(), small.hydraulic_diameter());
    Line::new(vec![
        Element::Fitting(Fitting::from_tank(Edge::Rounded { r_over_d: 0.1 })?),
        // Rated by its maker with air at 20 °C and 101 325 Pa.
        Element::Equipment(
            Equipment::pressure_drop("grease filter", 120.0, 0.9)?
                .with_rating_density(Fluid::air(293.15, 101_325.0)?.density())?,
        ),
        Element::Pipe(Pipe::of_material(big, 18.0, "galvanized_steel")?),
        Element::Fitting(Fitting::bend(90.0, 1.5)?),
        Element::Fitting(Fitting::contraction(d1, d2)?),
        Element::Pipe(Pipe::of_material(small, 12.0, "galvanized_steel")?),
        Element::Fitting(Fitting::bend(45.0, 1.5)?),
        Element::rise(4.5)?,
        Element::Fitting(Fitting::into_tank()),
    ])
}

fn band(b: &Band) -> String {
    format!("{:.3} … {:.3}", b.low, b.high)
}

fn print_breakdown(r: &LineResult) {
    println!(
        "  {:>2}  {:<22} {:>6} {:>9} {:>8}  {:>9}  {:<17} {:<22} warnings",
        "#", "element", "V m/s", "Re", "f or K", "loss m", "band (95 %) m", "largest source"
    );
    let mut elevation = 0.0;
    for (i, e) in r.elements.iter().enumerate() {
        // A rise prints its geometric height; its loss column is the head the fluid
        // feels of it (for a gas, net of the surrounding air's column).
        let height = e.elevation_out - elevation;
        elevation = e.elevation_out;
        let coef = match (e.friction_factor, e.k) {
            (Some(f), _) => format!("f {f:.4}"),
            (_, Some(k)) => format!("K {k:.3}"),
            _ => String::new(),
        };
        let v = e.velocity.map_or(String::new(), |v| format!("{v:.2}"));
        let re = e.reynolds.map_or(String::new(), |re| format!("{re:.0}"));
        let loss = if e.static_head != 0.0 {
            e.static_head
        } else {
            e.head_loss
        };
        let label = if e.static_head != 0.0 {
            format!("rise {height:+.1} m")
        } else {
            e.label.clone()
        };
        println!(
            "  {:>2}  {:<22} {:>6} {:>9} {:>8}  {:>9.3}  {:<17} {:<22} {}",
            i,
            label,
            v,
            re,
            coef,
            loss,
            if e.static_head != 0.0 {
                String::new()
            } else {
                band(&e.head_loss_band)
            },
            e.head_loss_band
                .dominant()
                .map(|s| s.name())
                .unwrap_or_default(),
            e.warnings.names().join(", ")
        );
    }
    println!(
        "  friction + minor loss {:.3} m ({}), pressure loss {:.1} kPa, static head {:.2} m",
        r.head_loss,
        band(&r.head_loss_band),
        r.pressure_loss / 1e3,
        r.static_head
    );
    println!(
        "  required head {:.3} m, band {} m",
        r.required_head,
        band(&r.required_head_band)
    );
    let top: Vec<String> = r
        .required_head_band
        .contributions
        .iter()
        .take(3)
        .map(|c| format!("{} {:.0} %", c.source, 100.0 * c.share))
        .collect();
    println!("  band sources: {}", top.join(", "));
}

fn orchard() -> Result<()> {
    println!("\n1. Hillside orchard irrigation main (water 12 °C, design flow 6.0 L/s)\n");
    let water = Fluid::water(285.15, 101_325.0)?;
    let line = orchard_line()?;
    let r = line.evaluate(&water, 6.0e-3)?;
    print_breakdown(&r);

    // An invented pump: flow L/s against head m.
    let pump_q = [0.0, 2.0, 4.0, 6.0, 8.0, 10.0].map(|q| q * 1e-3);
    let pump_h = [78.0, 77.0, 74.0, 68.5, 60.0, 47.0];
    let pump = PumpCurve::new(&pump_q, &pump_h)?;
    println!("\n  system curve against the pump");
    println!("  {:>8} {:>12} {:>10}", "Q L/s", "system m", "pump m");
    let flows: Vec<f64> = (0..=10).map(|i| i as f64 * 1e-3).collect();
    let curve = line.system_curve(&water, &flows)?;
    for (q, h) in flows.iter().zip(&curve) {
        println!("  {:>8.1} {:>12.2} {:>10.2}", q * 1e3, h, pump.head(*q)?.0);
    }
    let op = line.operating_point(&water, &pump)?;
    println!(
        "  operating point: {:.2} L/s at {:.2} m (flow band {:.2} … {:.2} L/s, largest source: {})",
        op.flow * 1e3,
        op.head,
        op.flow_band.low * 1e3,
        op.flow_band.high * 1e3,
        op.flow_band
            .dominant()
            .map_or("-".to_string(), |s| s.name())
    );

    let back = line.flow_for_head(&water, 0.0)?;
    println!(
        "  run backwards by gravity from the tank (pump bypassed): {:.2} L/s ({:.2} … {:.2} L/s)",
        -back.flow * 1e3,
        -back.flow_band.high * 1e3,
        -back.flow_band.low * 1e3
    );

    // Sized in PVC: the new pipes take PVC's roughness, the reducer goes.
    let s = line.size_in(
        &water,
        6.0e-3,
        Limit::Velocity(2.0),
        Some((PipeTable::Pvc, "40")),
        &Resize::default().in_material("pvc"),
    )?;
    println!(
        "  one size for the whole main in PVC, velocity ≤ 2 m/s at 6 L/s: inside diameter ≥ {:.1} mm",
        s.min_inside_diameter * 1e3
    );
    if let Some(c) = &s.standard {
        println!(
            "  smallest PVC schedule 40: NPS {} (ID {:.1} mm, {:.2} m/s, loss {:.1} kPa)",
            c.size.nominal,
            c.size.inside_diameter * 1e3,
            c.velocity,
            c.pressure_loss / 1e3
        );
    }
    Ok(())
}

fn duct() -> Result<()> {
    println!("\n2. Workshop exhaust duct (air 30 °C, 0.9 m³/s, galvanised rectangular duct)\n");
    let air = Fluid::air(303.15, 101_325.0)?;
    let r = duct_line()?.evaluate(&air, 0.9)?;
    print_breakdown(&r);
    // A gas line leads with pressure: what the fan supplies is ρ·g·(required head), the
    // losses plus the stack effect of the rise in the surrounding air.
    let rho_g = r.density * hydrograde::units::STANDARD_GRAVITY;
    println!(
        "  fan must supply {:.0} Pa ({:.0} … {:.0} Pa): losses {:.0} Pa, stack effect {:.0} Pa",
        r.required_pressure,
        r.required_head_band.low * rho_g,
        r.required_head_band.high * rho_g,
        r.pressure_loss,
        r.required_pressure - r.pressure_loss
    );
    Ok(())
}

/// The estate's junctions: name, elevation m, service demand L/s (invented).
const ESTATE_NODES: [(&str, f64, f64); 6] = [
    ("gate", 18.0, 2.0),
    ("unit_1", 19.0, 1.5),
    ("unit_2", 21.0, 2.5),
    ("hydrant_h3", 23.0, 0.0),
    ("unit_3", 22.0, 1.0),
    ("yard", 20.0, 0.5),
];
/// The estate's pipes: name, upstream, downstream, inside diameter m, length m
/// (cement-lined ductile iron, each with a gate valve; the booster main also a check valve).
const ESTATE_LINKS: [(&str, &str, &str, f64, f64); 9] = [
    ("tank_main", "tower_tank", "gate", 0.200, 350.0),
    ("booster_main", "break_tank", "unit_3", 0.150, 250.0),
    ("north_1", "gate", "unit_1", 0.150, 220.0),
    ("north_2", "unit_1", "unit_2", 0.150, 200.0),
    ("east_1", "unit_2", "hydrant_h3", 0.150, 120.0),
    ("east_2", "hydrant_h3", "unit_3", 0.150, 120.0),
    ("south", "unit_3", "yard", 0.100, 180.0),
    ("west", "yard", "gate", 0.150, 260.0),
    ("cross", "unit_1", "yard", 0.100, 150.0),
];
/// Water level in the elevated tank, m above the datum.
const TOWER_LEVEL: f64 = 62.0;
/// Water level in the booster station's break tank, m above the datum.
const BREAK_TANK_LEVEL: f64 = 19.0;
/// The booster pump's curve (invented): flow L/s, head m.
const BOOSTER_FLOWS: [f64; 6] = [0.0, 40.0, 80.0, 120.0, 160.0, 200.0];
const BOOSTER_HEADS: [f64; 6] = [42.0, 41.0, 38.5, 34.0, 27.5, 19.0];
/// The hydrant whose available flow is asked, and the minimum residual pressure, Pa
/// (an invented illustration, not a code value).
const HYDRANT: &str = "hydrant_h3";
const RESIDUAL_PRESSURE: f64 = 140e3;

/// The estate's main. The booster station draws from its break tank through its pump
/// (on its curve, no speed control) and a non-return valve into the booster main.
fn estate_network() -> Result<Network> {
    let mut net = Network::new();
    net.fixed_head("tower_tank", TOWER_LEVEL, None)?;
    net.fixed_head("break_tank", BREAK_TANK_LEVEL, Some(17.0))?;
    for (name, z, q) in ESTATE_NODES {
        net.node(name, z, q * 1e-3)?;
    }
    for (name, up, down, d, len) in ESTATE_LINKS {
        let mut elements = Vec::new();
        if name == "booster_main" {
            // The booster station: its pump and its non-return valve.
            let q = BOOSTER_FLOWS.map(|q| q * 1e-3);
            elements.push(Element::Pump(PumpCurve::new(&q, &BOOSTER_HEADS)?));
            elements.push(Element::Fitting(Fitting::named("swing_check_valve")?));
        }
        elements.push(Element::Pipe(Pipe::of_material(
            Section::circle(d)?,
            len,
            "cement_lined_ductile_iron",
        )?));
        elements.push(Element::Fitting(Fitting::named("gate_valve")?));
        let line = Line::new(elements)?;
        net.link(name, up, down, line)?;
    }
    Ok(net)
}

fn print_network(s: &NetworkSolution) {
    println!(
        "  {:<12} {:>7} {:>8} {:>10} {:>9}",
        "node", "z m", "head m", "p kPa", "out L/s"
    );
    for n in &s.nodes {
        println!(
            "  {:<12} {:>7.1} {:>8.2} {:>10.1} {:>9.2}",
            n.name,
            n.elevation,
            n.head,
            n.pressure / 1e3,
            n.outflow * 1e3
        );
    }
    println!("  {:<13} {:>9} {:>8}", "link", "Q L/s", "V m/s");
    for l in &s.links {
        println!(
            "  {:<13} {:>9.2} {:>8.2}",
            l.name,
            l.flow * 1e3,
            l.velocity.unwrap_or(0.0)
        );
    }
}

fn estate_available(net: &Network, water: &Fluid) -> Result<(AvailableFlow, AvailableFlow)> {
    let at_node = net.available_flow(water, HYDRANT, RESIDUAL_PRESSURE, LimitAt::Node)?;
    let everywhere =
        net.available_flow(water, HYDRANT, RESIDUAL_PRESSURE, LimitAt::EveryJunction)?;
    Ok((at_node, everywhere))
}

fn estate() -> Result<()> {
    println!(
        "\n3. Industrial estate fire-and-service main (water 10 °C, looped, tower tank and booster)\n"
    );
    println!(
        "  tower tank level {TOWER_LEVEL:.1} m; booster pump (shut-off head {:.0} m) from a break tank at {BREAK_TANK_LEVEL:.1} m",
        BOOSTER_HEADS[0]
    );
    let water = Fluid::water(283.15, 101_325.0)?;
    let net = estate_network()?;
    let s = net.solve(&water)?;
    println!(
        "  service demands only ({} Newton iterations):",
        s.iterations
    );
    print_network(&s);
    let (at_node, everywhere) = estate_available(&net, &water)?;
    println!(
        "\n  flow available at {HYDRANT} with {:.0} kPa residual there: {:.1} L/s on top of the service demands",
        RESIDUAL_PRESSURE / 1e3,
        at_node.flow * 1e3
    );
    println!(
        "  with {:.0} kPa kept at every junction: {:.1} L/s (the limit binds at {})",
        RESIDUAL_PRESSURE / 1e3,
        everywhere.flow * 1e3,
        everywhere.critical
    );
    for n in everywhere.solution.nodes.iter().filter(|n| n.fixed) {
        println!("  {} supplies {:.1} L/s", n.name, -n.outflow * 1e3);
    }
    for w in everywhere
        .solution
        .warnings
        .iter()
        .filter(|w| w.kind != hydrograde::network::NetworkWarningKind::LineWarnings)
    {
        println!("  warning: {}", w.message);
    }
    println!(
        "  Fire flow: the fire-protection codes that apply, and the authority that enforces them, set the\n  required flow, duration and residual pressure; the {:.0} kPa here is an invented figure. These\n  are estimates (friction ±10 %, roughness of a main in service uncertain), to be confirmed by\n  a competent engineer and by a flow test on the real main.",
        RESIDUAL_PRESSURE / 1e3
    );
    Ok(())
}

/// The demo's key results, one `name value` line each with every digit (`{:?}` prints
/// the shortest string that reads back to the same double), for the cross-language test
/// that the Python and C demos give the same numbers.
fn numbers() -> Result<()> {
    let water = Fluid::water(285.15, 101_325.0)?;
    let line = orchard_line()?;
    let r = line.evaluate(&water, 6.0e-3)?;
    let pump_q = [0.0, 2.0, 4.0, 6.0, 8.0, 10.0].map(|q| q * 1e-3);
    let pump = PumpCurve::new(&pump_q, &[78.0, 77.0, 74.0, 68.5, 60.0, 47.0])?;
    let op = line.operating_point(&water, &pump)?;
    let back = line.flow_for_head(&water, 0.0)?;
    // Sized in PVC: the new pipes take PVC's roughness, the reducer goes.
    let s = line.size_in(
        &water,
        6.0e-3,
        Limit::Velocity(2.0),
        Some((PipeTable::Pvc, "40")),
        &Resize::default().in_material("pvc"),
    )?;
    let air = Fluid::air(303.15, 101_325.0)?;
    let d = duct_line()?.evaluate(&air, 0.9)?;
    let rows = [
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
            s.standard.map_or(f64::NAN, |c| c.size.inside_diameter),
        ),
        ("duct_pressure_loss", d.pressure_loss),
        ("duct_pressure_loss_low", d.pressure_loss_band.low),
        ("duct_pressure_loss_high", d.pressure_loss_band.high),
    ];
    let water10 = Fluid::water(283.15, 101_325.0)?;
    let net = estate_network()?;
    let e = net.solve(&water10)?;
    let (at_node, everywhere) = estate_available(&net, &water10)?;
    let hydrant = net.node_index(HYDRANT).unwrap_or(0);
    let rows = rows.into_iter().chain([
        ("estate_hydrant_pressure", e.nodes[hydrant].pressure),
        ("estate_tank_main_flow", e.links[0].flow),
        ("estate_booster_main_flow", e.links[1].flow),
        ("estate_available_at_hydrant", at_node.flow),
        ("estate_available_everywhere", everywhere.flow),
        ("estate_available_pressure", everywhere.pressure),
    ]);
    for (name, v) in rows {
        println!("{name} {v:?}");
    }
    Ok(())
}

fn main() {
    if std::env::args().any(|a| a == "--numbers") {
        if let Err(e) = numbers() {
            eprintln!("error: {e}");
            std::process::exit(1);
        }
        return;
    }
    println!(
        "hydrograde {} demo: invented scenarios, engineering estimates with 95 % bands.",
        hydrograde::VERSION
    );
    if let Err(e) = orchard().and_then(|_| duct()).and_then(|_| estate()) {
        eprintln!("error: {e}");
        std::process::exit(1);
    }
    println!(
        "\nCaution: these are engineering estimates with stated uncertainty. A design built on \
         them must be checked by a competent engineer (licensed or registered where the law requires it) against the codes and standards that apply where it is built."
    );
}
