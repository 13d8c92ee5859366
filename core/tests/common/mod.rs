//! Shared helpers of the integration tests: reading reference tables and the one place
//! that says how results are compared.
//!
//! - ulp distance: for values produced by a solver that claims machine precision
//!   (Colebrook against the 40-digit reference);
//! - relative error: for explicit correlations and formulas against a published bound;
//! - absolute error: only where the expected value is zero.
#![allow(dead_code)]

use std::path::PathBuf;

/// Path of a file under the repository's `tests/reference/` folder.
pub fn reference_path(rel: &str) -> PathBuf {
    PathBuf::from(env!("CARGO_MANIFEST_DIR"))
        .join("..")
        .join("tests")
        .join("reference")
        .join(rel)
}

/// Rows of a CSV reference table (header skipped), every field parsed as f64 (Rust's
/// parser rounds correctly, so a 40-digit value becomes the nearest double).
pub fn read_csv(rel: &str) -> Vec<Vec<f64>> {
    let text = std::fs::read_to_string(reference_path(rel))
        .unwrap_or_else(|e| panic!("reading {rel}: {e}"));
    text.lines()
        .skip(1)
        .filter(|l| !l.trim().is_empty())
        .map(|l| {
            l.split(',')
                .map(|v| {
                    v.trim()
                        .parse::<f64>()
                        .unwrap_or_else(|e| panic!("{v}: {e}"))
                })
                .collect()
        })
        .collect()
}

/// Distance in units in the last place between two finite doubles of the same sign.
pub fn ulp_distance(a: f64, b: f64) -> u64 {
    assert!(a.is_finite() && b.is_finite() && a.signum() == b.signum());
    let (x, y) = (a.abs().to_bits(), b.abs().to_bits());
    x.abs_diff(y)
}

/// Relative error |a − b| / |b|: the one relative-error helper of the core's tests
/// (0 when the two are equal, zeros included; infinite for a ≠ 0 against b = 0).
pub fn rel_err(a: f64, b: f64) -> f64 {
    if a == b { 0.0 } else { ((a - b) / b).abs() }
}
