//! Networks against hand-worked solutions: closed forms, independent one-dimensional
//! solves and the single-line and parallel-split solvers of the crate.

use hydrograde::friction::Options as FrictionOptions;
use hydrograde::line::LineOptions;
use hydrograde::network::{Network, NetworkSolution, NetworkWarningKind};
use hydrograde::{
    Correlation, Element, ErrorKind, Fitting, Fluid, Line, Pipe, STANDARD_GRAVITY, Section,
    split_flow,
};
use std::f64::consts::PI;

fn water() -> Fluid {
    Fluid::water(288.15, 101_325.0).unwrap()
}

fn pipe(d: f64, l: f64, e: f64) -> Element {
    Element::Pipe(Pipe::new(Section::circle(d).unwrap(), l, e).unwrap())
}

fn line(elements: Vec<Element>) -> Line {
    Line::new(elements).unwrap()
}

/// A line of one pipe with the fully rough friction factor (von Kármán's rough-wall law,
/// f independent of Reynolds number): its loss is r·Q|Q| exactly.
fn rough_line(d: f64, l: f64, e: f64) -> Line {
    let options = LineOptions::default()
        .with_friction(FrictionOptions {
            correlation: Correlation::FullyRough,
            ..FrictionOptions::default()
        })
        .unwrap();
    Line::with_options(vec![pipe(d, l, e)], options).unwrap()
}

/// r of Δh = r·Q|Q| for a fully rough pipe: f = [2 log10(3.7 D/ε)]⁻² (von Kármán 1930,
/// the rough-wall limit of Colebrook 1939), Δh = 8 f L Q²/(g π² D⁵) (Darcy–Weisbach).
fn rough_r(d: f64, l: f64, e: f64) -> f64 {
    let f = 1.0 / (2.0 * (3.7 * d / e).log10()).powi(2);
    8.0 * f * l / (STANDARD_GRAVITY * PI * PI * d.powi(5))
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

/// Continuity at every junction, relative to the largest link flow.
fn assert_continuity(net: &Network, s: &NetworkSolution, tol: f64) {
    let qmax = s.links.iter().fold(0.0f64, |m, l| m.max(l.flow.abs()));
    for (i, node) in s.nodes.iter().enumerate() {
        let mut net_in = 0.0;
        for (l, r) in net.links().iter().zip(&s.links) {
            if l.downstream == i {
                net_in += r.flow;
            }
            if l.upstream == i {
                net_in -= r.flow;
            }
        }
        assert!(
            (net_in - node.outflow).abs() <= tol * qmax,
            "node {}: in {net_in}, out {}",
            node.name,
            node.outflow
        );
    }
}

/// Energy balance of every open link: head drop equals the line's loss at its flow.
fn assert_energy(net: &Network, s: &NetworkSolution, fluid: &Fluid, tol: f64) {
    for (l, r) in net.links().iter().zip(&s.links) {
        if r.closed {
            continue;
        }
        let (h, _) = l.line.required_head(fluid, r.flow).unwrap();
        let dh = h - l.line.static_head();
        assert!(
            (r.head_drop - dh).abs() <= tol,
            "link {}: drop {} loss {dh}",
            l.name,
            r.head_drop
        );
    }
}

#[test]
fn two_reservoirs_one_pipe_match_the_line_and_the_rough_closed_form() {
    let w = water();
    // Colebrook friction: the network flow equals the line's own flow for the head.
    let l = line(vec![pipe(0.2, 1000.0, 4.5e-5)]);
    let mut net = Network::new();
    net.fixed_head("upper", 50.0, None).unwrap();
    net.fixed_head("lower", 20.0, None).unwrap();
    net.link("p", "upper", "lower", l.clone()).unwrap();
    let s = net.solve(&w).unwrap();
    let expected = l.flow_for_head(&w, 30.0).unwrap().flow;
    assert!(
        rel(s.links[0].flow, expected) < 1e-12,
        "{} {expected}",
        s.links[0].flow
    );
    assert_eq!(s.links[0].head_drop, 30.0);
    // Tanks supply and take the flow.
    assert!(rel(-s.nodes[0].outflow, expected) < 1e-12);
    assert!(rel(s.nodes[1].outflow, expected) < 1e-12);

    // Fully rough friction: Q = sqrt(ΔH / r) in closed form (exact solution).
    let (d, len, e) = (0.15, 800.0, 1.5e-3);
    let mut net = Network::new();
    net.fixed_head("upper", 35.0, None).unwrap();
    net.fixed_head("lower", 12.0, None).unwrap();
    net.link("p", "upper", "lower", rough_line(d, len, e))
        .unwrap();
    let s = net.solve(&w).unwrap();
    let q = (23.0 / rough_r(d, len, e)).sqrt();
    assert!(rel(s.links[0].flow, q) < 1e-12, "{} {q}", s.links[0].flow);
    // Velocity in the bore: Q/A.
    let v = s.links[0].velocity.unwrap();
    assert!(rel(v, q / (PI * d * d / 4.0)) < 1e-12);
}

#[test]
fn a_network_in_series_equals_the_series_line() {
    // Reservoir – junction – reservoir: the two links in series carry the flow of the one
    // line made of both pipes (the same elements, the same equation).
    let w = water();
    let (a, b) = (pipe(0.1, 300.0, 4.5e-5), pipe(0.1, 200.0, 4.5e-5));
    let mut net = Network::new();
    net.fixed_head("t1", 40.0, None).unwrap();
    net.node("j", 10.0, 0.0).unwrap();
    net.fixed_head("t2", 25.0, None).unwrap();
    net.link("a", "t1", "j", line(vec![a.clone()])).unwrap();
    net.link("b", "j", "t2", line(vec![b.clone()])).unwrap();
    let s = net.solve(&w).unwrap();
    let expected = line(vec![a, b]).flow_for_head(&w, 15.0).unwrap().flow;
    for l in &s.links {
        assert!(rel(l.flow, expected) < 1e-12, "{} {expected}", l.flow);
    }
    assert_continuity(&net, &s, 1e-12);
}

/// The junction head of a three-reservoir problem with losses r_i Q|Q|, by bisection on
/// continuity (an independent solve: each pipe's flow is sqrt(|ΔH|/r) in closed form).
fn junction_head(tanks: &[(f64, f64)], outflow: f64) -> f64 {
    let net_in = |h: f64| -> f64 {
        tanks
            .iter()
            .map(|&(ht, r)| (ht - h).signum() * ((ht - h).abs() / r).sqrt())
            .sum::<f64>()
            - outflow
    };
    let (mut lo, mut hi) = (-1000.0, 1000.0);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if net_in(mid) > 0.0 {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

#[test]
fn three_reservoirs_with_constant_friction_match_an_independent_solve() {
    // An invented three-reservoir layout: tanks at 100, 80 and 40 m joined at one
    // junction that also draws 0.02 m³/s. Fully rough friction makes each loss r·Q|Q|.
    let w = water();
    let pipes = [
        (0.3, 1500.0, 1e-3),
        (0.25, 1000.0, 1e-3),
        (0.2, 2000.0, 1e-3),
    ];
    let levels = [100.0, 80.0, 40.0];
    let mut net = Network::new();
    net.node("j", 30.0, 0.02).unwrap();
    for (i, (&(d, l, e), &h)) in pipes.iter().zip(&levels).enumerate() {
        let t = format!("t{i}");
        net.fixed_head(&t, h, None).unwrap();
        net.link(&format!("p{i}"), &t, "j", rough_line(d, l, e))
            .unwrap();
    }
    let s = net.solve(&w).unwrap();
    let tanks: Vec<(f64, f64)> = pipes
        .iter()
        .zip(&levels)
        .map(|(&(d, l, e), &h)| (h, rough_r(d, l, e)))
        .collect();
    let hj = junction_head(&tanks, 0.02);
    let node = s.node("j").unwrap();
    assert!((node.head - hj).abs() < 1e-9, "{} {hj}", node.head);
    for (i, &(ht, r)) in tanks.iter().enumerate() {
        let q = (ht - hj).signum() * ((ht - hj).abs() / r).sqrt();
        assert!(
            rel(s.links[i].flow, q) < 1e-9,
            "p{i}: {} {q}",
            s.links[i].flow
        );
    }
    // The lowest tank receives flow (the junction head lies above 40 m).
    assert!(hj > 40.0 && s.links[2].flow < 0.0);
    // Pressure at the junction: ρ g (H − z).
    assert!(rel(node.pressure, w.density() * STANDARD_GRAVITY * (hj - 30.0)) < 1e-9);
    assert_continuity(&net, &s, 1e-12);
    assert_energy(&net, &s, &w, 1e-9);
}

#[test]
fn two_parallel_links_split_like_split_flow() {
    let w = water();
    let l1 = line(vec![
        pipe(0.1, 120.0, 4.5e-5),
        Element::Fitting(Fitting::named("elbow_90_standard").unwrap()),
    ]);
    let l2 = line(vec![pipe(0.08, 90.0, 1.5e-6)]);
    let mut net = Network::new();
    net.fixed_head("source", 60.0, None).unwrap();
    net.node("a", 0.0, 0.0).unwrap();
    net.node("b", 0.0, 0.03).unwrap();
    net.link("feed", "source", "a", line(vec![pipe(0.15, 50.0, 4.5e-5)]))
        .unwrap();
    net.link("one", "a", "b", l1.clone()).unwrap();
    net.link("two", "a", "b", l2.clone()).unwrap();
    let s = net.solve(&w).unwrap();
    let split = split_flow(&[l1, l2], &w, 0.03).unwrap();
    assert!(rel(s.links[1].flow, split.flows[0]) < 1e-12);
    assert!(rel(s.links[2].flow, split.flows[1]) < 1e-12);
    assert!(rel(s.links[1].head_drop, split.head) < 1e-10);
    assert_continuity(&net, &s, 1e-12);
}

/// Solves a small dense linear system by Gauss elimination with partial pivoting.
fn gauss(mut a: Vec<Vec<f64>>, mut b: Vec<f64>) -> Vec<f64> {
    let n = b.len();
    for c in 0..n {
        let p = (c..n)
            .max_by(|&i, &j| a[i][c].abs().total_cmp(&a[j][c].abs()))
            .unwrap();
        a.swap(c, p);
        b.swap(c, p);
        for r in c + 1..n {
            let m = a[r][c] / a[c][c];
            let pivot = a[c].clone();
            for (x, p) in a[r].iter_mut().zip(&pivot).skip(c) {
                *x -= m * p;
            }
            b[r] -= m * b[c];
        }
    }
    let mut x = vec![0.0; n];
    for r in (0..n).rev() {
        x[r] = (b[r] - (r + 1..n).map(|k| a[r][k] * x[k]).sum::<f64>()) / a[r][r];
    }
    x
}

#[test]
fn two_loop_laminar_network_matches_the_linear_closed_form() {
    // A viscous oil in small bores: every link is laminar, so its loss is R·Q with
    // R = 128 μ L/(π ρ g D⁴) (Hagen–Poiseuille, exact), and the junction heads solve a
    // linear system: Σ_links (H_n − H_m)/R = −outflow_n (exact solution).
    let oil = Fluid::new(900.0, 0.5).unwrap();
    let d: f64 = 0.05;
    let r =
        |l: f64| 128.0 * oil.viscosity() * l / (PI * oil.density() * STANDARD_GRAVITY * d.powi(4));
    // Nodes: 0 = tank (20 m), 1..=4 junctions; links (from, to, length).
    let links = [
        (0, 1, 50.0),
        (1, 2, 80.0),
        (1, 3, 60.0),
        (2, 4, 70.0),
        (3, 4, 90.0),
        (2, 3, 40.0),
    ];
    let outflow = [0.0, 0.0, 2e-4, 1e-4, 3e-4];
    let mut net = Network::new();
    net.fixed_head("n0", 20.0, None).unwrap();
    for (i, &o) in outflow.iter().enumerate().skip(1) {
        net.node(&format!("n{i}"), 0.0, o).unwrap();
    }
    for (k, &(a, b, l)) in links.iter().enumerate() {
        net.link(
            &format!("k{k}"),
            &format!("n{a}"),
            &format!("n{b}"),
            line(vec![pipe(d, l, 0.0)]),
        )
        .unwrap();
    }
    let s = net.solve(&oil).unwrap();
    // Nodal equations for junctions 1..=4 (unknown x = H1..H4).
    let mut a = vec![vec![0.0; 4]; 4];
    let mut rhs: Vec<f64> = outflow[1..].iter().map(|o| -o).collect();
    for &(u, v, l) in &links {
        let c = 1.0 / r(l);
        for (n, m) in [(u, v), (v, u)] {
            if n == 0 {
                continue;
            }
            a[n - 1][n - 1] += c;
            if m == 0 {
                rhs[n - 1] += c * 20.0;
            } else {
                a[n - 1][m - 1] -= c;
            }
        }
    }
    let h = gauss(a, rhs);
    for i in 1..=4 {
        let got = s.nodes[i].head;
        assert!((got - h[i - 1]).abs() < 1e-10, "n{i}: {got} {}", h[i - 1]);
    }
    for (k, &(u, v, l)) in links.iter().enumerate() {
        let hu = if u == 0 { 20.0 } else { h[u - 1] };
        let q = (hu - h[v - 1]) / r(l);
        assert!((s.links[k].flow - q).abs() < 1e-12 * 6e-4, "k{k}");
    }
    // Energy around each loop closes (heads are single-valued, so the drops sum to 0).
    let loop1 = s.links[1].head_drop + s.links[5].head_drop - s.links[2].head_drop;
    let loop2 = s.links[3].head_drop - s.links[4].head_drop - s.links[5].head_drop;
    assert!(loop1.abs() < 1e-10 && loop2.abs() < 1e-10);
    assert_continuity(&net, &s, 1e-12);
    assert_energy(&net, &s, &oil, 1e-9);
}

/// Tank A (50 m) feeds junction J (0.01 m³/s out); J connects to tank B through a line
/// with a swing check valve that lets flow go only from J to B.
fn valve_net(b_level: f64) -> (Network, Line, Line) {
    let feed = line(vec![pipe(0.1, 200.0, 4.5e-5)]);
    let guarded = line(vec![
        pipe(0.1, 150.0, 4.5e-5),
        Element::Fitting(Fitting::named("swing_check_valve").unwrap()),
    ]);
    let mut net = Network::new();
    net.fixed_head("A", 50.0, None).unwrap();
    net.node("J", 5.0, 0.01).unwrap();
    net.fixed_head("B", b_level, None).unwrap();
    net.link("feed", "A", "J", feed.clone()).unwrap();
    net.link("guarded", "J", "B", guarded.clone()).unwrap();
    (net, feed, guarded)
}

#[test]
fn a_check_valve_closes_against_reverse_head_and_opens_for_forward_head() {
    let w = water();
    // B at 60 m would push water back to J: the valve closes, and A alone supplies J.
    let (net, feed, _) = valve_net(60.0);
    let s = net.solve(&w).unwrap();
    assert!(s.links[1].closed);
    assert_eq!(s.links[1].flow, 0.0);
    assert!(rel(s.links[0].flow, 0.01) < 1e-12);
    let (h, _) = feed.required_head(&w, 0.01).unwrap();
    assert!((s.nodes[1].head - (50.0 - h)).abs() < 1e-9);
    assert!(
        s.warnings
            .iter()
            .any(|x| x.kind == NetworkWarningKind::CheckValveClosed && x.subject == "guarded")
    );
    // B at 10 m: the valve opens and J passes flow on to B. Independent solve: bisection
    // on the junction head with each line's own flow for its head.
    let (net, feed, guarded) = valve_net(10.0);
    let s = net.solve(&w).unwrap();
    assert!(!s.links[1].closed && s.links[1].flow > 0.0);
    let (mut lo, mut hi) = (10.0, 50.0);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        let q_in = feed.flow_for_head(&w, 50.0 - mid).unwrap().flow;
        let q_out = guarded.flow_for_head(&w, mid - 10.0).unwrap().flow;
        if q_in - q_out > 0.01 {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    assert!((s.nodes[1].head - 0.5 * (lo + hi)).abs() < 1e-9);
    assert_continuity(&net, &s, 1e-12);
}

#[test]
fn a_check_valve_opens_under_a_small_forward_head() {
    // With B 0.5 m below the head J has while the valve is shut, the valve must end open
    // with a small forward flow, whatever state the iteration passes through.
    let w = water();
    let (net, _, _) = valve_net(60.0);
    let hj = net.solve(&w).unwrap().nodes[1].head;
    let (net, _, _) = valve_net(hj - 0.5);
    let s = net.solve(&w).unwrap();
    assert!(
        !s.links[1].closed && s.links[1].flow > 0.0,
        "{:?}",
        s.links[1]
    );
    assert_continuity(&net, &s, 1e-12);
    assert_energy(&net, &s, &w, 1e-9);
}

#[test]
fn bad_input_gives_errors_naming_the_node_or_link() {
    let p = || line(vec![pipe(0.1, 100.0, 4.5e-5)]);
    let mut net = Network::new();
    net.fixed_head("tank", 30.0, None).unwrap();
    net.node("a", 0.0, 0.001).unwrap();
    // Duplicate node name.
    let e = net.node("a", 0.0, 0.0).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(e.to_string().contains("\"a\""), "{e}");
    // Unknown node.
    let e = net.link("x", "tank", "nowhere", p()).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::UnknownName);
    assert!(e.to_string().contains("nowhere"), "{e}");
    // A link to itself.
    let e = net.link("loop", "a", "a", p()).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(e.to_string().contains("itself"), "{e}");
    // Duplicate link name.
    net.link("main", "tank", "a", p()).unwrap();
    let e = net.link("main", "tank", "a", p()).unwrap_err();
    assert!(e.to_string().contains("\"main\""), "{e}");
    // Elevation far outside reason, NaN outflow, empty name.
    assert_eq!(
        net.node("deep", -50_000.0, 0.0).unwrap_err().kind(),
        ErrorKind::OutOfRange
    );
    assert_eq!(
        net.node("nan", 0.0, f64::NAN).unwrap_err().kind(),
        ErrorKind::NotFinite
    );
    assert_eq!(
        net.node(" ", 0.0, 0.0).unwrap_err().kind(),
        ErrorKind::Invalid
    );
    // A part with no fixed head.
    net.node("c", 0.0, 0.0).unwrap();
    net.node("d", 0.0, 0.001).unwrap();
    net.link("island", "c", "d", p()).unwrap();
    let e = net.solve(&water()).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(
        e.to_string().contains("\"c\"") && e.to_string().contains("no fixed-head"),
        "{e}"
    );
    // No fixed head at all.
    let mut net = Network::new();
    net.node("a", 0.0, 0.0).unwrap();
    net.node("b", 0.0, 0.0).unwrap();
    net.link("p", "a", "b", p()).unwrap();
    let e = net.solve(&water()).unwrap_err();
    assert!(e.to_string().contains("no fixed-head node"), "{e}");
    // No links.
    let mut net = Network::new();
    net.fixed_head("t", 1.0, None).unwrap();
    assert_eq!(net.solve(&water()).unwrap_err().kind(), ErrorKind::Invalid);
    // Rises that disagree with the nodes' elevations.
    let mut net = Network::new();
    net.node("low", 0.0, 0.0).unwrap();
    net.node("high", 10.0, 0.0).unwrap();
    let climbing = line(vec![pipe(0.1, 100.0, 4.5e-5), Element::rise(4.0).unwrap()]);
    let e = net.link("c", "low", "high", climbing).unwrap_err();
    assert!(e.to_string().contains("rises add up to 4"), "{e}");
}

#[test]
fn junction_cut_off_by_a_closed_valve_is_an_error_naming_it() {
    // J's only supply passes a check valve pointing away from it: J cannot be fed.
    let w = water();
    let mut net = Network::new();
    net.fixed_head("T", 30.0, None).unwrap();
    net.node("J", 0.0, 0.002).unwrap();
    let guarded = line(vec![
        pipe(0.05, 20.0, 4.5e-5),
        Element::Fitting(Fitting::named("swing_check_valve").unwrap()),
    ]);
    net.link("v", "J", "T", guarded).unwrap();
    let e = net.solve(&w).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::NoSolution);
    assert!(e.to_string().contains("\"J\""), "{e}");
}

#[test]
fn link_breakdown_is_the_line_at_the_solved_flow() {
    let w = water();
    let (net, feed, _) = valve_net(10.0);
    let s = net.solve(&w).unwrap();
    let r = net.link_result(&w, &s, "feed").unwrap();
    assert_eq!(r, feed.evaluate(&w, s.links[0].flow).unwrap());
    assert_eq!(
        net.link_result(&w, &s, "nope").unwrap_err().kind(),
        ErrorKind::UnknownName
    );
}

/// An invented square grid of `n`×`n` junctions fed by one tank at a corner: 2n(n−1)
/// links. Run with `cargo test --release --test network -- --ignored --nocapture` for the
/// timing; the checks are continuity and energy.
#[test]
#[ignore = "timing of a large invented grid; run on demand in release"]
fn grid_network_scales() {
    let w = water();
    for n in [23usize, 71, 224] {
        let mut net = Network::new();
        net.fixed_head("tank", 60.0, None).unwrap();
        for i in 0..n {
            for j in 0..n {
                net.node(&format!("{i}_{j}"), 0.0, 1e-4).unwrap();
            }
        }
        let l = line(vec![pipe(0.15, 100.0, 4.5e-5)]);
        net.link("feed", "tank", "0_0", line(vec![pipe(0.5, 10.0, 4.5e-5)]))
            .unwrap();
        for i in 0..n {
            for j in 0..n {
                if i + 1 < n {
                    net.link(
                        &format!("v{i}_{j}"),
                        &format!("{i}_{j}"),
                        &format!("{}_{j}", i + 1),
                        l.clone(),
                    )
                    .unwrap();
                }
                if j + 1 < n {
                    net.link(
                        &format!("h{i}_{j}"),
                        &format!("{i}_{j}"),
                        &format!("{i}_{}", j + 1),
                        l.clone(),
                    )
                    .unwrap();
                }
            }
        }
        let t = std::time::Instant::now();
        let s = net.solve(&w).unwrap();
        let dt = t.elapsed().as_secs_f64();
        println!(
            "grid {n}x{n}: {} links, {} iterations, {:.3} s, {:.1} ms per iteration",
            net.links().len(),
            s.iterations,
            dt,
            1e3 * dt / s.iterations as f64
        );
        assert_continuity(&net, &s, 1e-10);
        assert_energy(&net, &s, &w, 1e-8);
    }
}
