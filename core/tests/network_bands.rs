//! Network bands against Monte Carlo propagation of the same input distributions
//! (JCGM 101:2008 §8) on two invented networks: a single loop and a two-loop network.
//!
//! Sources sampled: one material's roughness shared by every pipe (ln ε uniform over the
//! catalogue range), a user K with its rectangular spread (one link's own source), and
//! the fluid's density and viscosity (normal). Each sample rebuilds the network with the
//! drawn inputs and solves it again.
//!
//! Tolerance (stated here; JCGM 101:2008 §8.1 leaves it to the user): each end of the
//! first-order 95 % interval lies within 8 % of the Monte Carlo interval's width of the
//! Monte Carlo end, with 4 000 samples (sampling error of the quantiles near 1.5 % of the
//! width, from memory of JCGM 101 §7.9.4) — the tolerance of core/tests/band_validation.rs
//! for lines.

use hydrograde::band::{Source, UncertaintyOptions};
use hydrograde::fitting::Fitting;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Line, LineOptions};
use hydrograde::network::Network;
use hydrograde::pipe::Pipe;
use hydrograde::roughness;
use hydrograde::section::Section;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};

const SAMPLES: usize = 4_000;
const MATERIAL: &str = "commercial_steel";
const K: f64 = 6.0;
const K_SPREAD: f64 = 0.3;
const DENSITY: f64 = 998.0;
const VISCOSITY: f64 = 1.0e-3;
const DENSITY_U: f64 = 0.01;
const VISCOSITY_U: f64 = 0.05;

/// One draw of the inputs: roughness (m), K, density (kg/m³), viscosity (Pa·s).
#[derive(Clone, Copy)]
struct Draw {
    roughness: Option<f64>,
    k: f64,
    density: f64,
    viscosity: f64,
}

/// A link of the test networks: (name, from, to, bore m, length m, has the K fitting).
type Spec = (&'static str, &'static str, &'static str, f64, f64, bool);

fn options() -> LineOptions {
    LineOptions::default()
        .with_uncertainty(UncertaintyOptions::default().with_friction_model(false))
        .unwrap()
}

/// The network with nominal inputs (`draw.roughness` None: the catalogue material with
/// its range) or drawn ones.
fn build(tank: f64, nodes: &[(&str, f64)], links: &[Spec], draw: Draw) -> Network {
    let mut net = Network::new();
    net.fixed_head("tank", tank, None).unwrap();
    for &(n, o) in nodes {
        net.node(n, 0.0, o).unwrap();
    }
    for &(name, a, b, d, l, fitting) in links {
        let s = Section::circle(d).unwrap();
        let pipe = match draw.roughness {
            None => Pipe::of_material(s, l, MATERIAL).unwrap(),
            Some(e) => Pipe::new(s, l, e).unwrap(),
        };
        let mut elements = vec![Element::Pipe(pipe)];
        if fitting {
            let f = Fitting::k(draw.k).unwrap().with_k_spread(K_SPREAD).unwrap();
            elements.push(Element::Fitting(f));
        }
        net.link(name, a, b, Line::with_options(elements, options()).unwrap())
            .unwrap();
    }
    net
}

/// The 2.5 % and 97.5 % quantiles of `v`.
fn interval(mut v: Vec<f64>) -> (f64, f64) {
    v.sort_by(f64::total_cmp);
    let n = v.len() as f64;
    (
        v[(0.025 * n) as usize],
        v[((0.975 * n) as usize).min(v.len() - 1)],
    )
}

fn check(tank: f64, nodes: &[(&str, f64)], links: &[Spec], seed: u64) {
    let m = roughness::material(MATERIAL).unwrap();
    let nominal = Draw {
        roughness: None,
        k: K,
        density: DENSITY,
        viscosity: VISCOSITY,
    };
    let fluid = |d: &Draw| {
        Fluid::new(d.density, d.viscosity)
            .unwrap()
            .with_uncertainty(DENSITY_U, VISCOSITY_U)
            .unwrap()
    };
    let net = build(tank, nodes, links, nominal);
    let w = fluid(&nominal);
    let s = net.solve(&w).unwrap();
    let bands = net.bands(&w, &s).unwrap();
    // The sources named as the band module states: one material, one link's own K.
    let b = &bands.flows[0];
    let names: Vec<String> = b.contributions.iter().map(|c| c.name()).collect();
    assert!(
        b.contributions
            .iter()
            .any(|c| c.source == Source::Material(MATERIAL.into())),
        "{names:?}"
    );
    assert!(
        names
            .iter()
            .any(|n| n.starts_with("link ") && n.contains("K of k")),
        "{names:?}"
    );

    let mut rng = StdRng::seed_from_u64(seed);
    let normal = |rng: &mut StdRng| {
        // Box–Muller.
        let u1: f64 = 1.0 - rng.random::<f64>();
        let u2: f64 = rng.random::<f64>();
        (-2.0 * u1.ln()).sqrt() * (std::f64::consts::TAU * u2).cos()
    };
    let outputs = nodes.len() + links.len();
    let mut samples: Vec<Vec<f64>> = vec![Vec::with_capacity(SAMPLES); outputs];
    for _ in 0..SAMPLES {
        let (lo, hi) = (m.low.ln(), m.high.ln());
        let d = Draw {
            roughness: Some((lo + (hi - lo) * rng.random::<f64>()).exp()),
            k: K * (1.0 + K_SPREAD * (2.0 * rng.random::<f64>() - 1.0)),
            density: DENSITY * (1.0 + DENSITY_U * normal(&mut rng)),
            viscosity: VISCOSITY * (1.0 + VISCOSITY_U * normal(&mut rng)),
        };
        let sol = build(tank, nodes, links, d).solve(&fluid(&d)).unwrap();
        let values = sol.nodes[1..]
            .iter()
            .map(|n| n.head)
            .chain(sol.links.iter().map(|l| l.flow));
        for (v, x) in samples.iter_mut().zip(values) {
            v.push(x);
        }
    }
    for (o, v) in samples.into_iter().enumerate() {
        let (band, what) = if o < nodes.len() {
            (&bands.heads[o + 1], format!("head at {}", nodes[o].0))
        } else {
            let k = o - nodes.len();
            (&bands.flows[k], format!("flow in {}", links[k].0))
        };
        let (lo, hi) = interval(v);
        let width = hi - lo;
        if width <= 1e-9 * lo.abs() {
            // Fixed by continuity alone (the feed carries the total demand, exact): the
            // band has no width beyond rounding either.
            assert!(
                band.half_width() <= 1e-9 * band.nominal.abs(),
                "{what}: {band:?}"
            );
            continue;
        }
        for (got, want, end) in [(band.low, lo, "low"), (band.high, hi, "high")] {
            assert!(
                (got - want).abs() <= 0.08 * width,
                "{what}: {end} end {got} against Monte Carlo {want} (width {width}); band {band:?}"
            );
        }
    }
}

#[test]
fn single_loop_bands_match_monte_carlo() {
    // An invented single loop: a tank feeds A; A–B–C–A closes the loop; B and C draw.
    let nodes = [("a", 0.0), ("b", 0.012), ("c", 0.008)];
    let links: [Spec; 4] = [
        ("feed", "tank", "a", 0.2, 200.0, false),
        ("ab", "a", "b", 0.125, 300.0, true),
        ("bc", "b", "c", 0.1, 250.0, false),
        ("ac", "a", "c", 0.1, 400.0, false),
    ];
    check(40.0, &nodes, &links, 11);
}

#[test]
fn two_loop_bands_match_monte_carlo() {
    // An invented two-loop network: loops A–B–D–C–A and B–E–D–B.
    let nodes = [
        ("a", 0.0),
        ("b", 0.006),
        ("c", 0.004),
        ("d", 0.007),
        ("e", 0.005),
    ];
    let links: [Spec; 7] = [
        ("feed", "tank", "a", 0.25, 150.0, false),
        ("ab", "a", "b", 0.15, 300.0, false),
        ("ac", "a", "c", 0.125, 250.0, false),
        ("bd", "b", "d", 0.1, 200.0, true),
        ("cd", "c", "d", 0.1, 300.0, false),
        ("be", "b", "e", 0.1, 220.0, false),
        ("ed", "e", "d", 0.08, 260.0, false),
    ];
    check(45.0, &nodes, &links, 12);
}

#[test]
fn bands_refuse_a_solution_of_another_network() {
    let w = Fluid::new(DENSITY, VISCOSITY).unwrap();
    let nominal = Draw {
        roughness: None,
        k: K,
        density: DENSITY,
        viscosity: VISCOSITY,
    };
    let one = build(
        30.0,
        &[("a", 0.01)],
        &[("feed", "tank", "a", 0.1, 100.0, false)],
        nominal,
    );
    let two = build(
        30.0,
        &[("a", 0.01), ("b", 0.0)],
        &[
            ("feed", "tank", "a", 0.1, 100.0, false),
            ("ab", "a", "b", 0.1, 100.0, false),
        ],
        nominal,
    );
    let s = one.solve(&w).unwrap();
    let e = two.bands(&w, &s).unwrap_err();
    assert!(e.to_string().contains("solution"), "{e}");
    // The fixed head's band is exact (zero width): its head is given.
    let b = one.bands(&w, &s).unwrap();
    assert_eq!(b.heads[0].low, b.heads[0].high);
}
