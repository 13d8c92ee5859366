//! Liquid water: IAPWS-IF97 region 1, the IF97 saturation line and the IAPWS 2008
//! viscosity.
//!
//! Coefficients are typed from memory of the published releases and verified against the
//! `iapws` Python package (tests/reference/water/, checked by core/tests/fluid_reference.rs
//! to 1e-9 relative at over 100 states) and against the verification values printed in the
//! IF97 release (from memory).
//!
//! * IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial Formulation 1997 for the
//!   Thermodynamic Properties of Water and Steam": region 1 (eq. 7, table 2), the
//!   saturation-pressure equation (eq. 30, table 34) and its backward form (eq. 31).
//! * IAPWS R12-08, "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary
//!   Water Substance": eqs. 10–12, tables 1–2, used in its industrial form without the
//!   critical enhancement (μ̄₂ = 1), which the release allows away from the critical
//!   point (the enhancement is below 0.1 % outside a small region around it, from memory).

use crate::error::{Error, Result, check};
use crate::math;

/// Specific gas constant of water used by IF97, J/(kg·K).
const R_WATER: f64 = 461.526;
/// Critical temperature, K (IAPWS).
pub(crate) const T_CRITICAL: f64 = 647.096;
/// Critical pressure, Pa (IAPWS).
pub(crate) const P_CRITICAL: f64 = 22.064e6;
/// Critical density, kg/m³ (IAPWS).
const RHO_CRITICAL: f64 = 322.0;

/// Lowest temperature of IF97 region 1, K.
pub const WATER_T_MIN: f64 = 273.15;
/// Highest temperature of IF97 region 1, K.
pub const WATER_T_MAX: f64 = 623.15;
/// Highest pressure of IF97 region 1, Pa.
pub const WATER_P_MAX: f64 = 100e6;
/// Lowest pressure accepted by [`water_saturation_temperature`], Pa: the IF97 saturation
/// pressure at 273.15 K, rounded up as the release states it.
pub const WATER_P_SAT_MIN: f64 = 611.213;

/// IF97 region 1 coefficients (I, J, n), table 2 of the release (from memory; verified
/// against the `iapws` package to 1e-9, see the module doc).
const REGION1: [(i32, i32, f64); 34] = [
    (0, -2, 0.146_329_712_131_67),
    (0, -1, -0.845_481_871_691_14),
    (0, 0, -0.375_636_036_720_40e1),
    (0, 1, 0.338_551_691_683_85e1),
    (0, 2, -0.957_919_633_878_72),
    (0, 3, 0.157_720_385_132_28),
    (0, 4, -0.166_164_171_995_01e-1),
    (0, 5, 0.812_146_299_835_68e-3),
    (1, -9, 0.283_190_801_238_04e-3),
    (1, -7, -0.607_063_015_658_74e-3),
    (1, -1, -0.189_900_682_184_19e-1),
    (1, 0, -0.325_297_487_705_05e-1),
    (1, 1, -0.218_417_171_754_14e-1),
    (1, 3, -0.528_383_579_699_30e-4),
    (2, -3, -0.471_843_210_732_67e-3),
    (2, 0, -0.300_017_807_930_26e-3),
    (2, 1, 0.476_613_939_069_87e-4),
    (2, 3, -0.441_418_453_308_46e-5),
    (2, 17, -0.726_949_962_975_94e-15),
    (3, -4, -0.316_796_448_450_54e-4),
    (3, 0, -0.282_707_979_853_12e-5),
    (3, 6, -0.852_051_281_201_03e-9),
    (4, -5, -0.224_252_819_080_00e-5),
    (4, -2, -0.651_712_228_956_01e-6),
    (4, 10, -0.143_417_299_379_24e-12),
    (5, -8, -0.405_169_968_601_17e-6),
    (8, -11, -0.127_343_017_416_41e-8),
    (8, -6, -0.174_248_712_306_34e-9),
    (21, -29, -0.687_621_312_955_31e-18),
    (23, -31, 0.144_783_078_285_21e-19),
    (29, -38, 0.263_357_816_627_95e-22),
    (30, -39, -0.119_476_226_400_71e-22),
    (31, -40, 0.182_280_945_814_04e-23),
    (32, -41, -0.935_370_872_924_58e-25),
];

/// IF97 saturation-line coefficients n1…n10, table 34 of the release (from memory;
/// verified against the `iapws` package).
const SAT: [f64; 10] = [
    0.116_705_214_527_67e4,
    -0.724_213_167_032_06e6,
    -0.170_738_469_400_92e2,
    0.120_208_247_024_70e5,
    -0.323_255_503_223_33e7,
    0.149_151_086_135_30e2,
    -0.482_326_573_615_91e4,
    0.405_113_405_420_57e6,
    -0.238_555_575_678_49,
    0.650_175_348_447_98e3,
];

/// IAPWS 2008 dilute-gas coefficients H0…H3 (table 1, from memory).
const VISC_H0: [f64; 4] = [1.677_52, 2.204_62, 0.636_656_4, -0.241_605];

/// IAPWS 2008 residual coefficients (i, j, H_ij) (table 2, from memory); i counts powers
/// of (1/T̄ − 1), j powers of (ρ̄ − 1).
const VISC_H1: [(i32, i32, f64); 21] = [
    (0, 0, 5.200_94e-1),
    (1, 0, 8.508_95e-2),
    (2, 0, -1.083_74),
    (3, 0, -2.895_55e-1),
    (0, 1, 2.225_31e-1),
    (1, 1, 9.991_15e-1),
    (2, 1, 1.887_97),
    (3, 1, 1.266_13),
    (5, 1, 1.205_73e-1),
    (0, 2, -2.813_78e-1),
    (1, 2, -9.068_51e-1),
    (2, 2, -7.724_79e-1),
    (3, 2, -4.898_37e-1),
    (4, 2, -2.570_40e-1),
    (0, 3, 1.619_13e-1),
    (1, 3, 2.573_99e-1),
    (0, 4, -3.253_72e-2),
    (3, 4, 6.984_52e-2),
    (4, 5, 8.721_02e-3),
    (3, 6, -4.356_73e-3),
    (5, 6, -5.932_64e-4),
];

/// Saturation pressure of water at temperature `t` (K), in Pa, from the IF97 saturation
/// line (eq. 30 of IAPWS R7-97).
///
/// Valid from 273.15 K to the critical temperature 647.096 K. Agrees with the `iapws`
/// package to 1e-12 relative (tests/reference/water/). Example: 3536.59 Pa at 300 K (IF97
/// verification table, from memory).
///
/// # Errors
/// `temperature` not finite or outside 273.15…647.096 K.
pub fn water_vapour_pressure(t: f64) -> Result<f64> {
    check::within("temperature", t, WATER_T_MIN, T_CRITICAL, "K")?;
    Ok(p_sat_unchecked(t))
}

pub(crate) fn p_sat_unchecked(t: f64) -> f64 {
    let n = &SAT;
    let theta = t + n[8] / (t - n[9]);
    let a = theta * theta + n[0] * theta + n[1];
    let b = n[2] * theta * theta + n[3] * theta + n[4];
    let c = n[5] * theta * theta + n[6] * theta + n[7];
    let x = 2.0 * c / (-b + (b * b - 4.0 * a * c).sqrt());
    math::powi(x, 4) * 1e6
}

/// Saturation temperature of water at pressure `p` (Pa), in K, from the backward equation
/// of the IF97 saturation line (eq. 31 of IAPWS R7-97).
///
/// Valid from 611.213 Pa to the critical pressure 22.064 MPa. Example: 372.755919 K at
/// 0.1 MPa (IF97 verification table, from memory).
///
/// # Errors
/// `pressure` not finite or outside 611.213 Pa…22.064 MPa.
pub fn water_saturation_temperature(p: f64) -> Result<f64> {
    check::within("pressure", p, WATER_P_SAT_MIN, P_CRITICAL, "Pa")?;
    let n = &SAT;
    let beta = math::pow(p / 1e6, 0.25);
    let e = beta * beta + n[2] * beta + n[5];
    let f = n[0] * beta * beta + n[3] * beta + n[6];
    let g = n[1] * beta * beta + n[4] * beta + n[7];
    let d = 2.0 * g / (-f - (f * f - 4.0 * e * g).sqrt());
    let s = n[9] + d;
    Ok((s - (s * s - 4.0 * (n[8] + n[9] * d)).sqrt()) / 2.0)
}

/// Density of liquid water (kg/m³) from IF97 region 1: ρ = p / (R·T·π·γ_π).
///
/// The caller has checked that (t, p) lies in region 1.
pub(crate) fn region1_density(t: f64, p: f64) -> f64 {
    let pi = p / 16.53e6;
    let tau = 1386.0 / t;
    let a = 7.1 - pi;
    let b = tau - 1.222;
    // γ_π = Σ −n I (7.1 − π)^(I−1) (τ − 1.222)^J; the I = 0 terms vanish.
    let gamma_pi: f64 = REGION1
        .iter()
        .filter(|(i, _, _)| *i > 0)
        .map(|&(i, j, n)| -n * f64::from(i) * math::powi(a, i - 1) * math::powi(b, j))
        .sum();
    p / (R_WATER * t * pi * gamma_pi)
}

/// Dynamic viscosity (Pa·s) of water at density `rho` (kg/m³) and temperature `t` (K),
/// IAPWS 2008 without the critical enhancement.
pub(crate) fn viscosity_iapws2008(rho: f64, t: f64) -> f64 {
    let tr = t / T_CRITICAL;
    let dr = rho / RHO_CRITICAL;
    let denom: f64 = VISC_H0
        .iter()
        .enumerate()
        .map(|(i, h)| h / math::powi(tr, i as i32))
        .sum();
    let mu0 = 100.0 * tr.sqrt() / denom;
    let x = 1.0 / tr - 1.0;
    let y = dr - 1.0;
    let s: f64 = VISC_H1
        .iter()
        .map(|&(i, j, h)| h * math::powi(x, i) * math::powi(y, j))
        .sum();
    let mu1 = math::exp(dr * s);
    // μ_ref = 1e-6 Pa·s.
    mu0 * mu1 * 1e-6
}

/// Checks that (t, p) is liquid water inside IF97 region 1 and returns its vapour pressure.
pub(crate) fn check_liquid_state(t: f64, p: f64) -> Result<f64> {
    check::within("temperature", t, WATER_T_MIN, WATER_T_MAX, "K")?;
    check::finite("pressure", p)?;
    let p_sat = p_sat_unchecked(t);
    if p < p_sat {
        return Err(Error::out_of_range(
            "pressure",
            p,
            format!(
                "water at {t} K is vapour below its saturation pressure {p_sat:.6e} Pa; \
                 only liquid water is supported"
            ),
        ));
    }
    if p > WATER_P_MAX {
        return Err(Error::out_of_range(
            "pressure",
            p,
            format!("must not exceed {WATER_P_MAX} Pa (upper limit of IAPWS-IF97 region 1)"),
        ));
    }
    Ok(p_sat)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn if97_region1_verification_values() {
        // IAPWS R7-97 table 5, specific volume v (m³/kg), from memory.
        let cases = [
            (300.0, 3e6, 0.100_215_168e-2),
            (300.0, 80e6, 0.971_180_894e-3),
            (500.0, 3e6, 0.120_241_800e-2),
        ];
        for (t, p, v) in cases {
            let got = 1.0 / region1_density(t, p);
            assert!(((got - v) / v).abs() < 5e-9, "T={t} p={p}: {got} vs {v}");
        }
    }

    #[test]
    fn if97_saturation_verification_values() {
        // IAPWS R7-97 table 35, p_s in MPa, from memory.
        for (t, p) in [
            (300.0, 0.353_658_941e-2),
            (500.0, 0.263_889_776e1),
            (600.0, 0.123_443_146e2),
        ] {
            let got = water_vapour_pressure(t).unwrap() / 1e6;
            assert!(((got - p) / p).abs() < 5e-9, "T={t}: {got} vs {p}");
        }
        // IAPWS R7-97 table 36, T_s in K, from memory.
        for (p, t) in [
            (0.1e6, 0.372_755_919e3),
            (1e6, 0.453_035_632e3),
            (10e6, 0.584_149_488e3),
        ] {
            let got = water_saturation_temperature(p).unwrap();
            assert!(((got - t) / t).abs() < 5e-9, "p={p}: {got} vs {t}");
        }
    }

    #[test]
    fn iapws2008_verification_values() {
        // IAPWS R12-08 table 4 (μ in μPa·s, computed with μ̄₂ = 1), from memory.
        for (t, rho, mu) in [
            (298.15, 998.0, 889.735_100),
            (298.15, 1200.0, 1_437.649_467),
            (373.15, 1000.0, 307.883_622),
            (433.15, 1.0, 14.538_324),
        ] {
            let got = viscosity_iapws2008(rho, t) * 1e6;
            // Half a unit of the last printed digit.
            assert!((got - mu).abs() <= 5e-7, "T={t} rho={rho}: {got} vs {mu}");
        }
    }

    #[test]
    fn saturation_line_round_trips() {
        // Exact identity: the backward equation inverts the forward one (IF97 states the
        // two agree to within a few parts in 1e9, from memory).
        for t in [273.16, 300.0, 373.15, 450.0, 600.0, 640.0] {
            let p = water_vapour_pressure(t).unwrap();
            let back = water_saturation_temperature(p).unwrap();
            assert!((back - t).abs() < 1e-6, "{t} -> {p} -> {back}");
        }
    }

    #[test]
    fn vapour_states_are_refused() {
        let e = check_liquid_state(373.15, 50_000.0).unwrap_err();
        assert!(e.to_string().starts_with("pressure = 50000"), "{e}");
        assert!(check_liquid_state(373.15, 101_325.0).is_err());
        assert!(check_liquid_state(373.15, 101_500.0).is_ok());
        assert!(check_liquid_state(300.0, 1.1e8).is_err());
        assert!(check_liquid_state(700.0, 1e7).is_err());
    }
}
