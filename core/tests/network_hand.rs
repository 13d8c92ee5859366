//! A single loop solved by hand in the test: Hardy Cross iterations (Cross, 1936, "Analysis
//! of flow in networks of conduits or conductors", Univ. of Illinois Bulletin 286) written
//! out on fully rough pipes, whose losses are exactly r·Q|Q|.

use hydrograde::friction::Options as FrictionOptions;
use hydrograde::line::LineOptions;
use hydrograde::network::Network;
use hydrograde::{Correlation, Element, Fluid, Line, Pipe, STANDARD_GRAVITY, Section};
use std::f64::consts::PI;

/// A fully rough pipe line (f independent of Reynolds number).
fn rough_line(d: f64, l: f64, e: f64) -> Line {
    let options = LineOptions::default()
        .with_friction(FrictionOptions {
            correlation: Correlation::FullyRough,
            ..FrictionOptions::default()
        })
        .unwrap();
    let pipe = Pipe::new(Section::circle(d).unwrap(), l, e).unwrap();
    Line::with_options(vec![Element::Pipe(pipe)], options).unwrap()
}

/// r of Δh = r·Q|Q|: f = [2 log10(3.7 D/ε)]⁻² (von Kármán 1930, the rough-wall limit of
/// Colebrook 1939), Δh = 8 f L Q²/(g π² D⁵) (Darcy–Weisbach).
fn rough_r(d: f64, l: f64, e: f64) -> f64 {
    let f = 1.0 / (2.0 * (3.7 * d / e).log10()).powi(2);
    8.0 * f * l / (STANDARD_GRAVITY * PI * PI * d.powi(5))
}

#[test]
fn single_loop_matches_hardy_cross() {
    // Invented: tank (50 m) – feed – A; loop A→B, B→C, A→C; B draws 0.03, C 0.02 m³/s.
    let e = 1e-3;
    let pipes = [
        ("feed", "tank", "a", 0.3, 100.0),
        ("ab", "a", "b", 0.2, 400.0),
        ("bc", "b", "c", 0.15, 300.0),
        ("ac", "a", "c", 0.15, 500.0),
    ];
    let (qb, qc) = (0.03, 0.02);
    let mut net = Network::new();
    net.fixed_head("tank", 50.0, None).unwrap();
    net.node("a", 0.0, 0.0).unwrap();
    net.node("b", 0.0, qb).unwrap();
    net.node("c", 0.0, qc).unwrap();
    for &(n, u, d, dia, l) in &pipes {
        net.link(n, u, d, rough_line(dia, l, e)).unwrap();
    }
    let w = Fluid::water(288.15, 101_325.0).unwrap();
    let s = net.solve(&w).unwrap();

    // Hardy Cross by hand. Loop A→B→C→A (clockwise positive): ab +, bc +, ac −.
    let r: Vec<f64> = pipes.iter().map(|p| rough_r(p.3, p.4, e)).collect();
    // A start that satisfies continuity: all of C's demand through ac, B's through ab.
    let (mut q_ab, mut q_bc, mut q_ac) = (qb, 0.0, qc);
    for _ in 0..100 {
        // ΔQ = −Σ r Q|Q| / Σ 2 r |Q| around the loop (signed by direction).
        let num = r[1] * q_ab * q_ab.abs() + r[2] * q_bc * q_bc.abs() - r[3] * q_ac * q_ac.abs();
        let den = 2.0 * (r[1] * q_ab.abs() + r[2] * q_bc.abs() + r[3] * q_ac.abs());
        let dq = -num / den;
        q_ab += dq;
        q_bc += dq;
        q_ac -= dq;
        if dq.abs() < 1e-17 {
            break;
        }
    }
    let q_feed = qb + qc;
    let expected = [q_feed, q_ab, q_bc, q_ac];
    for (k, (l, q)) in s.links.iter().zip(expected).enumerate() {
        assert!(
            (l.flow - q).abs() <= 1e-12 * q_feed,
            "{}: {} against Hardy Cross {q} ({k})",
            l.name,
            l.flow
        );
    }
    // Heads from the tank down each pipe: H_a = 50 − r₀Q₀², H_b = H_a − r₁Q₁|Q₁|.
    let ha = 50.0 - r[0] * q_feed * q_feed;
    let hb = ha - r[1] * q_ab * q_ab.abs();
    let hc = ha - r[3] * q_ac * q_ac.abs();
    for (i, h) in [(1, ha), (2, hb), (3, hc)] {
        assert!(
            (s.nodes[i].head - h).abs() < 1e-9,
            "node {i}: {} {h}",
            s.nodes[i].head
        );
    }
    // Energy around the loop closes to 1e-10 m (heads are single-valued; the drops are the
    // links' own losses at their flows).
    let drop = |k: usize| {
        let (h, _) = net.links()[k]
            .line
            .required_head(&w, s.links[k].flow)
            .unwrap();
        h
    };
    assert!((drop(1) + drop(2) - drop(3)).abs() < 1e-10);
    // Mass balance at every junction to 1e-12 of the largest flow.
    let net_in = [
        s.links[0].flow - s.links[1].flow - s.links[3].flow,
        s.links[1].flow - s.links[2].flow - qb,
        s.links[2].flow + s.links[3].flow - qc,
    ];
    for m in net_in {
        assert!(m.abs() <= 1e-12 * q_feed, "{m}");
    }
}
