//! The Colebrook–White equation, solved to machine precision in a fixed number of steps.
//!
//! ```text
//! 1/√f = −2 log10( ε/(3.7 D) + 2.51 / (Re √f) )
//! ```
//!
//! With `s = (ln 10 / 2)/√f`, `a = (ε/D)/3.7` and `β = 2.51·(2/ln 10)/Re` the equation
//! becomes `F(s) = s + ln(a + β s) = 0`. Every derivative of `F` beyond the first is
//! rational in `u = a + β s`, so a Householder step of any order costs one logarithm and
//! one division. The solver takes
//!
//! 1. a start from two fixed-point sweeps `s ← −ln(a + β s)` with a cheap logarithm
//!    (error below 0.3 in `s` over the accepted range: the sweep contracts by
//!    `β/(a + β s) ≤ 0.2`),
//! 2. a fifth-order step with the full-precision logarithm (the error falls from 0.3 to
//!    about 1e-6), then a fourth-order one (the error falls below the rounding of `s`).
//!
//! The residual `s + ln u` is formed by [`math::add_ln`], which adds the exponent part of
//! the logarithm to `s` before rounding: the residual's absolute error is ~6e-17 instead
//! of an ulp of ln u (~1e-15), which is what brings the result to within 1 ulp. No fused
//! multiply-add (the exact products are Dekker's), so the same operations run in the
//! scalar and the vector code and on every platform.
//!
//! Cost: two exact logarithms, two cheap ones and five divisions (each step finds 1/u
//! and 1/(u + β) from one division); no allocation, no branch on the data.
//!
//! Accuracy: within 1 ulp of a 40-digit mpmath solution over Re 2300…1e9 and
//! ε/D 0…0.1 (1740 of 2550 points exact, the rest 1 ulp; the stated bound is 4 ulp, checked at every point of `tests/reference/colebrook.csv` by
//! `core/tests/colebrook_reference.rs`). Reference: Colebrook (1939), J. Inst. Civ. Eng.
//! 11(4) 133–156.

use crate::math;

/// 2/ln 10: converts natural logarithms to the `−2 log10` of the equation.
const TWO_OVER_LN10: f64 = 2.0 / std::f64::consts::LN_10;
/// (ln 10 / 2)² as a double-double, K_HI + K_LO (mpmath, 40 digits:
/// 1.325474527619599502640416597148504422899): f = K / s².
const K_HI: f64 = 1.325_474_527_619_599_6;
const K_LO: f64 = -1.046_794_391_525_167_9e-16;

/// The solution with its sensitivities.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Solution {
    pub f: f64,
    pub df_dre: f64,
    pub df_drel_roughness: f64,
}

/// A logarithm good to about 1e-3 absolute, for the starting guess only.
///
/// Splits `x` into `m · 2^e` with `m` in [1, 2) and fits `ln m` by a cubic in `m − 1`
/// (least squares, max error 9.1e-4). `x` must be a positive normal number.
#[inline(always)]
fn rough_ln(x: f64) -> f64 {
    let bits = x.to_bits();
    let e = math::small_uint_to_f64((bits >> 52) & 0x7ff) - 1023.0;
    let m = f64::from_bits((bits & 0x000f_ffff_ffff_ffff) | 0x3ff0_0000_0000_0000);
    let t = m - 1.0;
    let p = t * (0.986_684_83 + t * (-0.407_386_01 + t * 0.114_756_65));
    e * std::f64::consts::LN_2 + p
}

/// One fifth-order Householder step for `F(s) = s + ln(a + β s)`; returns the
/// correction δ (the new iterate is `s + δ`).
#[inline(always)]
fn step(s: f64, a: f64, beta: f64) -> f64 {
    let (q, inv_d, _) = slopes(s, a, beta);
    let u = a + beta * s;
    let big_f = math::add_ln(s, u);
    let q2 = q * q;
    let r = -big_f * inv_d; // Newton step
    let a2 = -0.5 * q2 * inv_d; // F''/(2F')
    let a3 = (q2 * q * (1.0 / 3.0)) * inv_d; // F'''/(6F')
    let a4 = -0.25 * q2 * q2 * inv_d; // F''''/(24F')
    // Series reversion of F(s + δ) = 0 to fourth order in the Newton step r.
    let c3 = 2.0 * a2 * a2 - a3;
    let c4 = -5.0 * a2 * a2 * a2 + 5.0 * a2 * a3 - a4;
    r + r * r * (-a2 + r * (c3 + r * c4))
}

/// `q = β/u` (F' = 1 + q, F'' = −q², F''' = 2q³, F'''' = −6q⁴), `1/F' = u/(u + β)` and
/// `u + β` at `s`, with one division: w = 1/(u (u + β)) gives both reciprocals.
#[inline(always)]
fn slopes(s: f64, a: f64, beta: f64) -> (f64, f64, f64) {
    let u = a + beta * s;
    let v = u + beta;
    let w = 1.0 / (u * v);
    (beta * v * w, u * u * w, v)
}

/// The last correction, from an iterate already within about 1e-6 of the root: the
/// series reversion to third order in the Newton step r leaves an error of order
/// r⁴ ≈ 1e-24, far below the rounding of `s`. Returns δ and `u + β` at `s`.
#[inline(always)]
fn final_step(s: f64, a: f64, beta: f64) -> (f64, f64) {
    let (q, inv_d, v) = slopes(s, a, beta);
    let u = a + beta * s;
    let big_f = math::add_ln(s, u);
    let q2 = q * q;
    let r = -big_f * inv_d;
    let a2 = -0.5 * q2 * inv_d;
    let a3 = (q2 * q * (1.0 / 3.0)) * inv_d;
    let c3 = 2.0 * a2 * a2 - a3;
    (r + r * r * (-a2 + r * c3), v)
}

/// f = K / (s + δ)² with the square and the quotient carried in double-double, so the
/// last correction δ is not rounded into `s` before use and the result is rounded once.
#[inline(always)]
fn factor(s: f64, delta: f64) -> f64 {
    let (sq, sq_err) = math::two_prod(s, s);
    let d_hi = sq;
    let d_lo = sq_err + delta * (2.0 * s + delta);
    // q need only be within a few ulp of K/d: the remainder corrects it.
    let inv = 1.0 / d_hi;
    let q = K_HI * inv;
    // K_HI − q·d_hi exactly: q·d_hi = p + e exactly, and K_HI − p is exact (Sterbenz:
    // p is within a few ulp of K_HI).
    let (p, e) = math::two_prod(q, d_hi);
    let rem = ((K_HI - p) - e) - q * d_lo + K_LO;
    q + rem * inv
}

#[cfg(test)]
thread_local! {
    /// Exact Colebrook solves on this thread (tests count them to pin the solvers' cost).
    static CALLS: std::cell::Cell<u64> = const { std::cell::Cell::new(0) };
}

/// The number of exact Colebrook solves this thread has made so far (tests only).
#[cfg(test)]
pub(crate) fn calls() -> u64 {
    CALLS.with(|c| c.get())
}

/// Solves Colebrook–White for `re` > 0 and `rel_roughness` ≥ 0 (already validated).
#[inline(always)]
pub(crate) fn solve(re: f64, rel_roughness: f64) -> Solution {
    #[cfg(test)]
    CALLS.with(|c| c.set(c.get() + 1));
    let a = rel_roughness * (1.0 / 3.7);
    let inv_re = 1.0 / re;
    let beta = 2.51 * TWO_OVER_LN10 * inv_re;
    // Start: two cheap fixed-point sweeps from s = 8 (f ≈ 0.02, mid-chart).
    let mut s = -rough_ln(a + beta * 8.0);
    s = -rough_ln(a + beta * s);
    s += step(s, a, beta);
    let (delta, v) = final_step(s, a, beta);
    let f = factor(s, delta);
    // Implicit-function derivatives of F(s; a, β) = 0: ∂s/∂a = −1/(u + β),
    // ∂s/∂β = −s/(u + β), ∂f/∂s = −2f/s. `v` = u + β before the last correction, which
    // moves it by a relative 1e-7 at most: far inside what a derivative needs.
    let s = s + delta;
    let g = 2.0 * f / (s * v);
    Solution {
        f,
        df_dre: -g * s * beta * inv_re,     // (∂f/∂s)(∂s/∂β)(∂β/∂Re)
        df_drel_roughness: g * (1.0 / 3.7), // (∂f/∂s)(∂s/∂a)(∂a/∂(ε/D))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rough_ln_is_within_its_stated_error() {
        // Exact analytical reference: f64::ln.
        for i in 0..2000 {
            let x = 10f64.powf(-12.0 + 24.0 * i as f64 / 1999.0);
            assert!((rough_ln(x) - x.ln()).abs() < 1e-3, "x = {x}");
        }
    }

    #[test]
    fn converges_over_the_whole_accepted_domain() {
        // Exact analytical check: the residual of F(s) = s + ln(a + βs) after the solve,
        // over Re 1000…1e13 and ε/D 0…0.5 (wider than the 4-ulp claim).
        let mut worst: f64 = 0.0;
        for i in 0..=200 {
            let re = 1e3 * 10f64.powf(10.0 * i as f64 / 200.0);
            for j in 0..=60 {
                let rr = if j == 0 {
                    0.0
                } else {
                    0.5 * 10f64.powf(-12.0 * (60 - j) as f64 / 60.0)
                };
                let f = solve(re, rr).f;
                assert!(f.is_finite() && f > 0.0, "re {re} rr {rr}");
                let s = (std::f64::consts::LN_10 / 2.0) / f.sqrt();
                let res = s + (rr / 3.7 + 2.51 * TWO_OVER_LN10 / re * s).ln();
                worst = worst.max(res.abs() / s);
            }
        }
        assert!(worst < 1e-14, "worst relative residual {worst}");
    }

    #[test]
    fn solution_satisfies_the_equation() {
        // Exact analytical check: the residual of Colebrook–White itself.
        for &re in &[2300.0, 1e4, 1e6, 1e9] {
            for &rr in &[0.0, 1e-6, 1e-3, 0.1] {
                let f = solve(re, rr).f;
                let lhs = 1.0 / f.sqrt();
                let rhs = -2.0 * (rr / 3.7 + 2.51 / (re * f.sqrt())).log10();
                assert!((lhs - rhs).abs() < 1e-13 * lhs, "re {re} rr {rr}");
            }
        }
    }
}
