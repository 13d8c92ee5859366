//! Spot values of every explicit correlation: the published formula written out here
//! with the standard library's own functions (not the crate's), evaluated at a chart
//! point, must match the crate to rounding; and a chart value read from memory checks the
//! formula's constants against the literature.
//!
//! A changed constant (e.g. Blasius 0.3164 → 0.3150) moves the result by far more than
//! the 1e-13 allowed here, which only covers the ulp-level differences between the
//! standard library's and the crate's logarithms and powers.

use hydrograde::friction::{Correlation, Options, darcy_factor};

mod common;
use common::rel_err;

/// Relative tolerance between the written-out formula and the crate: both round a few
/// dozen operations, each within an ulp.
const REL: f64 = 1e-13;

fn f(corr: Correlation, re: f64, rr: f64) -> f64 {
    darcy_factor(re, rr, &Options::with_correlation(corr))
        .unwrap()
        .f
}

fn close(got: f64, want: f64, tol: f64, what: &str) {
    assert!(rel_err(got, want) <= tol, "{what}: got {got}, want {want}");
}

/// Colebrook at Re 1e5, ε/D 1e-4 (mpmath, 40 digits: tests/reference/colebrook).
const COLEBROOK_1E5_1E4: f64 = 0.018_513_866_077_471_64;

#[test]
fn blasius_spot_value() {
    // Blasius (1913): f = 0.3164 Re^-0.25; at Re 1e5 (Re^0.25 = 17.7827941…).
    let want = 0.3164 * 1e5f64.powf(-0.25);
    close(
        f(Correlation::Blasius, 1e5, 0.0),
        want,
        REL,
        "Blasius formula",
    );
    // 0.3164 / 17.78279410038923 = 0.017792… (hand division).
    close(want, 0.017_792_5, 1e-5, "Blasius by hand");
}

#[test]
fn haaland_spot_value() {
    // Haaland (1983): 1/√f = −1.8 log10[(ε/D / 3.7)^1.11 + 6.9/Re].
    let (re, rr): (f64, f64) = (1e5, 1e-4);
    let x = -1.8 * ((rr / 3.7f64).powf(1.11) + 6.9 / re).log10();
    let want = 1.0 / (x * x);
    close(
        f(Correlation::Haaland, re, rr),
        want,
        REL,
        "Haaland formula",
    );
    // Haaland's stated ±1.5 % against Colebrook (from memory).
    close(want, COLEBROOK_1E5_1E4, 0.015, "Haaland vs Colebrook");
}

#[test]
fn swamee_jain_spot_value() {
    // Swamee and Jain (1976): f = 0.25 / [log10(ε/D / 3.7 + 5.74 / Re^0.9)]².
    let (re, rr): (f64, f64) = (1e5, 1e-4);
    let l = (rr / 3.7 + 5.74 / re.powf(0.9)).log10();
    let want = 0.25 / (l * l);
    close(
        f(Correlation::SwameeJain, re, rr),
        want,
        REL,
        "Swamee–Jain formula",
    );
    // Stated ±1 % against Colebrook inside their range (from memory).
    close(want, COLEBROOK_1E5_1E4, 0.01, "Swamee–Jain vs Colebrook");
}

fn churchill_formula(re: f64, rr: f64) -> f64 {
    // Churchill (1977): f = 8 [(8/Re)^12 + (A + B)^-1.5]^(1/12),
    // A = [2.457 ln(1 / ((7/Re)^0.9 + 0.27 ε/D))]^16, B = (37530/Re)^16.
    let a = (2.457 * (1.0 / ((7.0 / re).powf(0.9) + 0.27 * rr)).ln()).powi(16);
    let b = (37530.0 / re).powi(16);
    8.0 * ((8.0 / re).powi(12) + (a + b).powf(-1.5)).powf(1.0 / 12.0)
}

#[test]
fn churchill_spot_values() {
    let want = churchill_formula(1e5, 1e-4);
    close(
        f(Correlation::Churchill, 1e5, 1e-4),
        want,
        REL,
        "Churchill turbulent",
    );
    close(want, COLEBROOK_1E5_1E4, 0.035, "Churchill vs Colebrook");
    // Laminar: Churchill reduces to 64/Re (exact Hagen–Poiseuille) far below Re 2000.
    let want = churchill_formula(500.0, 1e-4);
    close(
        f(Correlation::Churchill, 500.0, 1e-4),
        want,
        REL,
        "Churchill laminar",
    );
    close(want, 64.0 / 500.0, 1e-6, "Churchill laminar limit");
    // Transitional, where the B term (37530/Re)^16 decides the value.
    let want = churchill_formula(3000.0, 1e-4);
    close(
        f(Correlation::Churchill, 3000.0, 1e-4),
        want,
        REL,
        "Churchill transitional",
    );
}

#[test]
fn serghides_spot_value() {
    // Serghides (1984): ψ(x) = −2 log10(ε/D / 3.7 + 2.51 x / Re), A = ψ-start with 12/Re,
    // B = ψ(A), C = ψ(B), 1/√f = A − (B − A)² / (C − 2B + A).
    let (re, rr): (f64, f64) = (1e5, 1e-4);
    let a = -2.0 * (rr / 3.7 + 12.0 / re).log10();
    let b = -2.0 * (rr / 3.7 + 2.51 * a / re).log10();
    let c = -2.0 * (rr / 3.7 + 2.51 * b / re).log10();
    let x = a - (b - a) * (b - a) / (c - 2.0 * b + a);
    let want = 1.0 / (x * x);
    close(
        f(Correlation::Serghides, re, rr),
        want,
        REL,
        "Serghides formula",
    );
    // Stated 0.003 % against Colebrook (from memory).
    close(want, COLEBROOK_1E5_1E4, 3e-5, "Serghides vs Colebrook");
}

#[test]
fn fully_rough_spot_value() {
    // von Kármán / Nikuradse rough-wall law: 1/√f = −2 log10(ε/D / 3.7); at ε/D = 0.01:
    // −2 log10(0.0027027…) = 5.1361…, f = 0.037906…
    let x = -2.0 * (0.01f64 / 3.7).log10();
    let want = 1.0 / (x * x);
    close(
        f(Correlation::FullyRough, 1e8, 0.01),
        want,
        REL,
        "fully rough formula",
    );
    // Moody chart, fully rough limit of the ε/D = 0.01 curve: about 0.038 (from memory).
    close(want, 0.038, 0.01, "fully rough chart value");
}
