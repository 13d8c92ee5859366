//! The flow available at a node at a minimum residual pressure, against closed forms, and
//! node plan positions.

mod common;

use common::rel_err;
use hydrograde::network::{LimitAt, Network};
use hydrograde::{Element, ErrorKind, Fluid, Line, Pipe, STANDARD_GRAVITY, Section};
use std::f64::consts::PI;

fn water() -> Fluid {
    Fluid::water(283.15, 101_325.0).unwrap()
}

fn pipe_line(d: f64, l: f64, e: f64) -> Line {
    Line::new(vec![Element::Pipe(
        Pipe::new(Section::circle(d).unwrap(), l, e).unwrap(),
    )])
    .unwrap()
}

/// The flow of a pipe of bore `d`, length `l`, roughness `e` with friction head `h` over
/// it, exactly: Colebrook (1939) 1/√f = −2 log10(ε/(3.7 D) + 2.51/(Re √f)) with
/// V = √(2 g D h / (f L)) (Darcy–Weisbach) gives Re √f = D √(2 g D S)/ν (S = h/L), so
/// V = −2 √(2 g D S) log10(ε/(3.7 D) + 2.51 ν/(D √(2 g D S))) without iteration.
fn colebrook_flow(fluid: &Fluid, d: f64, l: f64, e: f64, h: f64) -> f64 {
    let nu = fluid.viscosity() / fluid.density();
    let root = (2.0 * STANDARD_GRAVITY * d * h / l).sqrt();
    let v = -2.0 * root * (e / (3.7 * d) + 2.51 * nu / (d * root)).log10();
    let re = v * d / nu;
    assert!(
        re > 4000.0,
        "the closed form needs turbulent flow, Re = {re}"
    );
    v * PI * d * d / 4.0
}

#[test]
fn a_single_pipe_from_a_tank_delivers_the_closed_form_flow() {
    let w = water();
    let (d, l, e) = (0.15, 400.0, 4.5e-5);
    let (tank, z, base, p_min) = (45.0, 2.0, 0.01, 1.4e5);
    let mut net = Network::new();
    net.fixed_head("tank", tank, None).unwrap();
    net.node("hydrant", z, base).unwrap();
    net.link("main", "tank", "hydrant", pipe_line(d, l, e))
        .unwrap();
    let a = net
        .available_flow(&w, "hydrant", p_min, LimitAt::Node)
        .unwrap();
    // Energy: tank − (z + p_min/(ρ g)) is the friction head at the total flow.
    let h = tank - z - p_min / (w.density() * STANDARD_GRAVITY);
    let expected = colebrook_flow(&w, d, l, e, h) - base;
    assert!(rel_err(a.flow, expected) < 1e-8, "{} vs {expected}", a.flow);
    assert!((a.pressure - p_min).abs() < 1e-3, "{}", a.pressure);
    assert_eq!(a.critical, "hydrant");
    let drawn = a.solution.node("hydrant").unwrap().outflow;
    assert_eq!(drawn, base + a.flow);
    assert!(a.solves < 40, "{} solves", a.solves);
}

#[test]
fn every_junction_binds_at_the_highest_node() {
    // Tank → hydrant (low) → hill (high, no demand): with no flow to the hill its head
    // equals the hydrant's, so its pressure is lower and binds first. Closed form as
    // above with the hill's elevation in place of the hydrant's.
    let w = water();
    let (d, l, e) = (0.2, 600.0, 1.5e-4);
    let (tank, z_hydrant, z_hill, p_min) = (60.0, 5.0, 18.0, 1.5e5);
    let mut net = Network::new();
    net.fixed_head("tank", tank, None).unwrap();
    net.node("hydrant", z_hydrant, 0.0).unwrap();
    net.node("hill", z_hill, 0.0).unwrap();
    net.link("main", "tank", "hydrant", pipe_line(d, l, e))
        .unwrap();
    net.link("spur", "hydrant", "hill", pipe_line(0.1, 80.0, e))
        .unwrap();
    let at_node = net
        .available_flow(&w, "hydrant", p_min, LimitAt::Node)
        .unwrap();
    let everywhere = net
        .available_flow(&w, "hydrant", p_min, LimitAt::EveryJunction)
        .unwrap();
    let rho_g = w.density() * STANDARD_GRAVITY;
    let expected_node = colebrook_flow(&w, d, l, e, tank - z_hydrant - p_min / rho_g);
    let expected_all = colebrook_flow(&w, d, l, e, tank - z_hill - p_min / rho_g);
    assert!(rel_err(at_node.flow, expected_node) < 1e-8);
    assert!(rel_err(everywhere.flow, expected_all) < 1e-8);
    assert_eq!(everywhere.critical, "hill");
    assert!(everywhere.flow < at_node.flow);
}

#[test]
fn bad_requests_name_the_node_or_the_value() {
    let w = water();
    let mut net = Network::new();
    net.fixed_head("tank", 30.0, None).unwrap();
    net.node("a", 0.0, 0.0).unwrap();
    net.link("main", "tank", "a", pipe_line(0.1, 100.0, 4.5e-5))
        .unwrap();
    let err = net
        .available_flow(&w, "tank", 1e5, LimitAt::Node)
        .unwrap_err();
    assert_eq!(err.kind(), ErrorKind::Invalid);
    assert!(err.to_string().contains("tank"), "{err}");
    let err = net.available_flow(&w, "b", 1e5, LimitAt::Node).unwrap_err();
    assert_eq!(err.kind(), ErrorKind::UnknownName);
    let err = net
        .available_flow(&w, "a", f64::NAN, LimitAt::Node)
        .unwrap_err();
    assert_eq!(err.kind(), ErrorKind::NotFinite);
    // 30 m of water is about 294 kPa (ρ g h): 400 kPa cannot be met even at no draw.
    let err = net.available_flow(&w, "a", 4e5, LimitAt::Node).unwrap_err();
    assert_eq!(err.kind(), ErrorKind::NoSolution);
    assert!(err.to_string().contains("\"a\""), "{err}");
}

#[test]
fn positions_are_stored_and_checked() {
    let mut net = Network::new();
    net.fixed_head("tank", 30.0, None).unwrap();
    net.node("a", 0.0, 0.0).unwrap();
    assert_eq!(net.nodes()[1].position, None);
    net.place("a", 120.0, -35.5).unwrap();
    assert_eq!(net.nodes()[1].position, Some([120.0, -35.5]));
    assert_eq!(
        net.place("z", 0.0, 0.0).unwrap_err().kind(),
        ErrorKind::UnknownName
    );
    let err = net.place("a", f64::INFINITY, 0.0).unwrap_err();
    assert_eq!(err.kind(), ErrorKind::NotFinite);
    assert!(err.to_string().contains('x'), "{err}");
    assert_eq!(
        net.place("a", 0.0, 1e9).unwrap_err().kind(),
        ErrorKind::OutOfRange
    );
}
