//! Shared inputs of hydrograde's benchmarks: the criterion benches in `benches/benches/`
//! and the one-process ratio table `src/bin/ratios.rs` draw the same points from here, so
//! their figures describe the same workload.

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
}
