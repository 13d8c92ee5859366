//! Shared inputs of hydrograde's benchmarks: the criterion benches in `benches/benches/`
//! and the one-process ratio table `src/bin/ratios.rs` draw the same points from here, so
//! their figures describe the same workload.

use hydrograde::Result;
use hydrograde::fitting::{Edge, Fitting};
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Equipment, Line};
use hydrograde::network::Network;
use hydrograde::pipe::Pipe;
use hydrograde::section::Section;

/// Smallest Reynolds number of the turbulent benchmark range (common-practice turbulent
/// limit).
pub const RE_MIN: f64 = 4e3;
/// Largest Reynolds number of the turbulent benchmark range.
pub const RE_MAX: f64 = 1e8;
/// Smallest relative roughness of the benchmark range.
pub const RR_MIN: f64 = 1e-6;
/// Largest relative roughness of the benchmark range.
pub const RR_MAX: f64 = 0.05;

/// A small deterministic generator (SplitMix64): the same seed gives the same points on
/// every machine, so runs can be compared.
#[derive(Debug, Clone)]
pub struct SplitMix(u64);

impl SplitMix {
    /// A generator started at `seed`.
    pub fn new(seed: u64) -> Self {
        SplitMix(seed)
    }

    /// The next value, uniform in [0, 1).
    pub fn next_unit(&mut self) -> f64 {
        self.0 = self.0.wrapping_add(0x9e37_79b9_7f4a_7c15);
        let mut z = self.0;
        z = (z ^ (z >> 30)).wrapping_mul(0xbf58_476d_1ce4_e5b9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94d0_49bb_1331_11eb);
        z ^= z >> 31;
        (z >> 11) as f64 * (1.0 / (1u64 << 53) as f64)
    }

    /// A value log-uniform in [lo, hi] (lo > 0).
    pub fn log_uniform(&mut self, lo: f64, hi: f64) -> f64 {
        (lo.ln() + (hi.ln() - lo.ln()) * self.next_unit()).exp()
    }
}

/// `n` turbulent points: Reynolds numbers log-uniform in [`RE_MIN`], [`RE_MAX`] and
/// relative roughnesses log-uniform in [`RR_MIN`], [`RR_MAX`] (both dimensionless).
pub fn turbulent_points(n: usize, seed: u64) -> (Vec<f64>, Vec<f64>) {
    let mut g = SplitMix::new(seed);
    let re = (0..n).map(|_| g.log_uniform(RE_MIN, RE_MAX)).collect();
    let rr = (0..n).map(|_| g.log_uniform(RR_MIN, RR_MAX)).collect();
    (re, rr)
}

/// An invented 20-element cooling-water route (9 pipes, 9 fittings, 2 rises) in two
/// bores, the workload of the line benchmarks.
pub fn line20() -> Result<Line> {
    let (big, small, steel) = (0.1023, 0.0779, 4.5e-5); // m, m, m
    let pipe = |d: f64, l: f64| Pipe::circular(d, l, steel).map(Element::Pipe);
    let fit = |f: Result<Fitting>| f.map(Element::Fitting);
    Line::new(vec![
        Element::Fitting(Fitting::from_tank(Edge::Square)?),
        pipe(big, 35.0)?,
        fit(Fitting::bend(90.0, 1.5))?,
        pipe(big, 12.0)?,
        Element::rise(6.0)?,
        fit(Fitting::three_k(800.0, 0.14, 4.0))?,
        pipe(big, 48.0)?,
        fit(Fitting::contraction(big, small))?,
        pipe(small, 20.0)?,
        fit(Fitting::two_k(500.0, 0.25))?,
        pipe(small, 15.0)?,
        fit(Fitting::k(2.0))?,
        pipe(small, 30.0)?,
        fit(Fitting::bend(45.0, 1.0))?,
        pipe(small, 22.0)?,
        fit(Fitting::expansion(small, big))?,
        pipe(big, 60.0)?,
        Element::rise(-2.5)?,
        pipe(big, 8.0)?,
        Element::Fitting(Fitting::into_tank()),
    ])
}

/// An invented long distribution main of `n` elements in bore `bore` (m), the workload of
/// the band timings: repeating groups of a commercial-steel pipe, a catalogue elbow, a
/// user fitting with its own K, a cast-iron pipe, a gate valve and, every tenth group, a
/// rated strainer.
pub fn long_line(n: usize, bore: f64) -> Result<Line> {
    let steel = Pipe::of_material(Section::circle(bore)?, 2.0, "commercial_steel")?;
    let iron = Pipe::of_material(Section::circle(bore)?, 3.0, "cast_iron")?;
    let elbow = Fitting::named("elbow_90_standard")?;
    let valve = Fitting::named("gate_valve")?;
    let own = Fitting::k(0.4)?;
    let strainer = Equipment::pressure_drop("strainer", 2e3, 0.02)?; // Pa at m³/s
    let mut els = Vec::with_capacity(n + 5);
    let mut g = 0;
    while els.len() < n {
        els.push(Element::Pipe(steel.clone()));
        els.push(Element::Fitting(elbow.clone()));
        els.push(Element::Fitting(own.clone()));
        els.push(Element::Pipe(iron.clone()));
        els.push(Element::Fitting(valve.clone()));
        if g % 10 == 0 {
            els.push(Element::Equipment(strainer.clone()));
        }
        g += 1;
    }
    els.truncate(n);
    Line::new(els)
}

/// Water at 20 °C and atmospheric pressure, the fluid of the line benchmarks.
pub fn water() -> Result<Fluid> {
    Fluid::water(293.15, 101_325.0)
}

/// `n` flows (m³/s) evenly spaced over 0.1…20 L/s: laminar, transitional and turbulent
/// in both bores of [`line20`].
pub fn flows(n: usize) -> Vec<f64> {
    let last = n.saturating_sub(1).max(1) as f64;
    (0..n)
        .map(|i| 1e-4 + (0.02 - 1e-4) * i as f64 / last)
        .collect()
}

/// An invented square grid of `side`×`side` junctions (at 0 m, each drawing 0.1 L/s) fed
/// by one tank (60 m) at a corner through a 0.5 m main: 2·side·(side − 1) + 1 links of
/// 100 m of 150 mm steel. `side` 23, 71 and 224 give about 1,000, 10,000 and 100,000
/// links, the network benchmark's sizes.
pub fn grid_network(side: usize) -> Result<Network> {
    let mut net = Network::new();
    net.fixed_head("tank", 60.0, None)?;
    let name = |i: usize, j: usize| format!("{i}_{j}");
    for i in 0..side {
        for j in 0..side {
            net.node(&name(i, j), 0.0, 1e-4)?;
        }
    }
    let pipe = |d: f64, l: f64| -> Result<Line> {
        Line::new(vec![Element::Pipe(Pipe::circular(d, l, 4.5e-5)?)])
    };
    net.link("feed", "tank", &name(0, 0), pipe(0.5, 10.0)?)?;
    let l = pipe(0.15, 100.0)?;
    for i in 0..side {
        for j in 0..side {
            if i + 1 < side {
                net.link(
                    &format!("v{i}_{j}"),
                    &name(i, j),
                    &name(i + 1, j),
                    l.clone(),
                )?;
            }
            if j + 1 < side {
                net.link(
                    &format!("h{i}_{j}"),
                    &name(i, j),
                    &name(i, j + 1),
                    l.clone(),
                )?;
            }
        }
    }
    Ok(net)
}

/// The side of the grid of [`grid_network`] with about `links` links.
pub fn grid_side(links: usize) -> usize {
    // 2·s·(s − 1) + 1 ≈ links.
    ((1.0 + (1.0 + 2.0 * links as f64).sqrt()) / 2.0).round() as usize
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn points_stay_in_range_and_repeat() {
        // Exact check: the generator's stated range, and determinism for a fixed seed.
        let (re, rr) = turbulent_points(10_000, 7);
        assert!(re.iter().all(|&r| (RE_MIN..=RE_MAX).contains(&r)));
        assert!(rr.iter().all(|&e| (RR_MIN..=RR_MAX).contains(&e)));
        assert_eq!(turbulent_points(10_000, 7), (re, rr));
        // Log-uniform: about half the Reynolds numbers below the geometric midpoint.
        let (re, _) = turbulent_points(10_000, 8);
        let mid = (RE_MIN * RE_MAX).sqrt();
        let below = re.iter().filter(|&&r| r < mid).count();
        assert!((4_700..5_300).contains(&below), "{below}");
    }

    #[test]
    fn the_benchmark_line_builds_and_has_twenty_elements() {
        // Exact check: the route as written above.
        let line = line20().unwrap();
        assert_eq!(line.elements().len(), 20);
        // Exact: the rises sum to 6 - 2.5 m.
        assert_eq!(line.static_head(), 3.5);
        let f = flows(100);
        assert_eq!(f.len(), 100);
        assert_eq!(f[0], 1e-4);
        assert!((f[99] - 0.02).abs() < 1e-15);
    }

    #[test]
    fn the_grid_has_the_links_it_states() {
        // Exact count: 2·s·(s − 1) grid links plus the feed.
        for (links, side) in [(1_000, 23), (10_000, 71), (100_000, 224)] {
            assert_eq!(grid_side(links), side);
        }
        let net = grid_network(5).unwrap();
        assert_eq!(net.links().len(), 2 * 5 * 4 + 1);
        assert_eq!(net.nodes().len(), 26);
    }
}
