//! Explicit friction correlations, for users who must match a hand calculation.
//!
//! Each returns the Darcy factor with its analytic derivatives with respect to the
//! Reynolds number and the relative roughness. Inputs are validated by the caller.
//! Published validity ranges and accuracies live in [`super::Correlation::validity`];
//! the tests in `core/tests/explicit_vs_colebrook.rs` check each accuracy claim against
//! the exact Colebrook solution.

use super::colebrook::Solution;
use crate::math;

/// 2/ln 10.
const C: f64 = 2.0 / std::f64::consts::LN_10;

/// Haaland (1983): 1/√f = −1.8 log10[(ε/3.7D)^1.11 + 6.9/Re].
///
/// Haaland, S. E. (1983), J. Fluids Eng. 105(1) 89–90.
#[inline(always)]
pub(crate) fn haaland(re: f64, rr: f64) -> Solution {
    let k = 1.8 / std::f64::consts::LN_10;
    let t = rr / 3.7;
    let tp = math::pow_pos(t, 1.11);
    let arg = tp + 6.9 / re;
    let x = -k * math::ln_pos(arg);
    let f = 1.0 / (x * x);
    let df_dx = -2.0 * f / x;
    let dx_darg = -k / arg;
    let darg_drr = if t > 0.0 { 1.11 * tp / t / 3.7 } else { 0.0 };
    Solution {
        f,
        df_dre: df_dx * dx_darg * (-6.9 / (re * re)),
        df_drel_roughness: df_dx * dx_darg * darg_drr,
    }
}

/// Swamee and Jain (1976): f = 0.25 / [log10(ε/3.7D + 5.74/Re^0.9)]².
///
/// Swamee, P. K. and Jain, A. K. (1976), J. Hydraul. Div. ASCE 102(5) 657–664.
#[inline(always)]
pub(crate) fn swamee_jain(re: f64, rr: f64) -> Solution {
    let arg = rr / 3.7 + 5.74 * math::pow_pos(re, -0.9);
    let l = math::log10_pos(arg);
    let f = 0.25 / (l * l);
    let df_dl = -2.0 * f / l;
    let dl_darg = 1.0 / (arg * std::f64::consts::LN_10);
    Solution {
        f,
        df_dre: df_dl * dl_darg * (-0.9 * 5.74 * math::pow_pos(re, -1.9)),
        df_drel_roughness: df_dl * dl_darg / 3.7,
    }
}

/// Churchill (1977), one formula for all regimes, with the laminar term generalised to
/// a laminar constant `lam` (64 for a circle):
/// f = 8 [ (lam/(8 Re))¹² + (A + B)^−1.5 ]^(1/12),
/// A = [2.457 ln(1/((7/Re)^0.9 + 0.27 ε/D))]¹⁶, B = (37530/Re)¹⁶.
///
/// Churchill, S. W. (1977), Chem. Eng. 84(24) 91–92.
#[inline(always)]
pub(crate) fn churchill(re: f64, rr: f64, lam: f64) -> Solution {
    let p = math::powi(lam / (8.0 * re), 12);
    let dp_dre = -12.0 * p / re;
    let r7 = math::pow_pos(7.0 / re, 0.9);
    let t = r7 + 0.27 * rr;
    let l = -2.457 * math::ln_pos(t);
    let a = math::powi(l, 16);
    let dl_dt = -2.457 / t;
    let da_dl = 16.0 * math::powi(l, 15);
    let dt_dre = -0.9 * r7 / re;
    let b = math::powi(37530.0 / re, 16);
    let db_dre = -16.0 * b / re;
    let ab = a + b;
    let q = math::pow_pos(ab, -1.5);
    let dq_dab = -1.5 * q / ab;
    let sum = p + q;
    let f = 8.0 * math::pow_pos(sum, 1.0 / 12.0);
    let df_dsum = f / (12.0 * sum);
    let dq_dre = dq_dab * (da_dl * dl_dt * dt_dre + db_dre);
    let dq_drr = dq_dab * da_dl * dl_dt * 0.27;
    Solution {
        f,
        df_dre: df_dsum * (dp_dre + dq_dre),
        df_drel_roughness: df_dsum * dq_drr,
    }
}

/// Serghides (1984): three fixed-point sweeps of Colebrook accelerated by Steffensen's
/// method. With ψ(x) = −2 log10(ε/3.7D + 2.51 x/Re): A = −2 log10(ε/3.7D + 12/Re),
/// B = ψ(A), C = ψ(B), 1/√f = A − (B − A)² / (C − 2B + A).
///
/// Serghides, T. K. (1984), Chem. Eng. 91(5) 63–64.
#[inline(always)]
pub(crate) fn serghides(re: f64, rr: f64) -> Solution {
    let a0 = rr / 3.7;
    // (value, d/dRe, d/da) of each sweep.
    let va = a0 + 12.0 / re;
    let xa = -C * math::ln_pos(va);
    let xa_re = -C / va * (-12.0 / (re * re));
    let xa_a = -C / va;
    let sweep = |x: f64, x_re: f64, x_a: f64| {
        let v = a0 + 2.51 * x / re;
        let v_re = 2.51 * (x_re / re - x / (re * re));
        let v_a = 1.0 + 2.51 * x_a / re;
        (-C * math::ln_pos(v), -C / v * v_re, -C / v * v_a)
    };
    let (xb, xb_re, xb_a) = sweep(xa, xa_re, xa_a);
    let (xc, xc_re, xc_a) = sweep(xb, xb_re, xb_a);
    let num = (xb - xa) * (xb - xa);
    let den = xc - 2.0 * xb + xa;
    let (x, x_re, x_a) = if den == 0.0 || num == 0.0 {
        // The sweeps have already converged (fully rough or exact start): no correction.
        (xc, xc_re, xc_a)
    } else {
        let d = |dxa: f64, dxb: f64, dxc: f64| {
            let dnum = 2.0 * (xb - xa) * (dxb - dxa);
            let dden = dxc - 2.0 * dxb + dxa;
            dxa - (dnum * den - num * dden) / (den * den)
        };
        (xa - num / den, d(xa_re, xb_re, xc_re), d(xa_a, xb_a, xc_a))
    };
    let f = 1.0 / (x * x);
    let df_dx = -2.0 * f / x;
    Solution {
        f,
        df_dre: df_dx * x_re,
        df_drel_roughness: df_dx * x_a / 3.7,
    }
}

/// Blasius (1913), smooth pipes: f = 0.3164 Re^−0.25.
///
/// Blasius, H. (1913), Forschungsarbeiten VDI 131.
#[inline(always)]
pub(crate) fn blasius(re: f64) -> Solution {
    let f = 0.3164 * math::pow_pos(re, -0.25);
    Solution {
        f,
        df_dre: -0.25 * f / re,
        df_drel_roughness: 0.0,
    }
}

/// Fully rough wall (von Kármán's rough-wall law as written by Nikuradse's data):
/// 1/√f = −2 log10(ε/3.7D), independent of Re. Needs ε/D > 0 (checked by the caller).
///
/// von Kármán, T. (1930); Nikuradse, J. (1933), VDI Forschungsheft 361.
#[inline(always)]
pub(crate) fn fully_rough(rr: f64) -> Solution {
    let a = rr / 3.7;
    let x = -C * math::ln_pos(a);
    let f = 1.0 / (x * x);
    Solution {
        f,
        df_dre: 0.0,
        df_drel_roughness: -2.0 * f / x * (-C / a) / 3.7,
    }
}
