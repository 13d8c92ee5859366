//! Dry air as an ideal gas with Sutherland's law for viscosity.
//!
//! * Density: ρ = p·M / (R·T) with M = 28.9647 g/mol (the dry-air molar mass of the
//!   U.S. Standard Atmosphere 1976, from memory) and R = 8.314 462 618 J/(mol·K) (exact
//!   since the 2019 SI redefinition), so R_air = 287.055 J/(kg·K).
//! * Viscosity: μ = μ₀ (T/T₀)^{3/2} (T₀ + S)/(T + S) with μ₀ = 1.716e-5 Pa·s, T₀ = 273.15 K,
//!   S = 110.4 K (Sutherland 1893 form with the constants of White, *Viscous Fluid Flow*,
//!   from memory).
//!
//! Humidity is ignored: saturated air at 20 °C is about 1 % lighter than dry air (common
//! practice), which the stated density uncertainty does not cover.

use crate::error::{Result, check};
use crate::math;

/// Molar gas constant, J/(mol·K) (exact, SI 2019).
const R_MOLAR: f64 = 8.314_462_618;
/// Molar mass of dry air, kg/mol (U.S. Standard Atmosphere 1976, from memory).
const M_AIR: f64 = 0.028_964_7;
/// Specific gas constant of dry air, J/(kg·K).
pub const R_AIR: f64 = R_MOLAR / M_AIR;

/// Sutherland reference viscosity, Pa·s (White, from memory).
const MU0: f64 = 1.716e-5;
/// Sutherland reference temperature, K.
const T0: f64 = 273.15;
/// Sutherland constant for air, K (White, from memory).
const S: f64 = 110.4;

/// Lowest temperature accepted for air, K.
pub const AIR_T_MIN: f64 = 200.0;
/// Highest temperature accepted for air, K (below dissociation and where Sutherland's law
/// still holds to a few per cent).
pub const AIR_T_MAX: f64 = 1000.0;
/// Highest pressure accepted for air, Pa: beyond it the ideal-gas density is off by more
/// than a few per cent at the low end of the temperature range.
pub const AIR_P_MAX: f64 = 2.0e6;

/// Largest magnitude of the second virial coefficient of air over 200…1000 K, m³/mol
/// (about −35 cm³/mol at 200 K, from memory); bounds the ideal-gas error.
const B_VIRIAL_BOUND: f64 = 35e-6;

/// Density of dry air (kg/m³), ideal gas.
pub(crate) fn density(t: f64, p: f64) -> f64 {
    p / (R_AIR * t)
}

/// Viscosity of dry air (Pa·s), Sutherland's law.
pub(crate) fn viscosity(t: f64) -> f64 {
    MU0 * math::pow(t / T0, 1.5) * (T0 + S) / (t + S)
}

/// Relative standard uncertainty of the ideal-gas density: 1e-4 for the composition plus
/// the second-virial bound |B|·p/(R·T) taken as the half-width of a rectangular
/// distribution (divided by √3, JCGM 100:2008 §4.3.7).
pub(crate) fn density_uncertainty(t: f64, p: f64) -> f64 {
    1e-4 + B_VIRIAL_BOUND * p / (R_MOLAR * t) / 3f64.sqrt()
}

/// Relative standard uncertainty of Sutherland's law: 2 % inside 250…500 K (from memory),
/// 5 % outside (our conservative judgement; the law is a two-constant fit).
pub(crate) fn viscosity_uncertainty(t: f64) -> f64 {
    if (250.0..=500.0).contains(&t) {
        0.02
    } else {
        0.05
    }
}

/// Validates an air state: temperature in 200…1000 K, pressure in (0, 2 MPa].
pub(crate) fn check_state(t: f64, p: f64) -> Result<()> {
    check::within("temperature", t, AIR_T_MIN, AIR_T_MAX, "K")?;
    check::positive("pressure", p)?;
    check::within("pressure", p, 0.0, AIR_P_MAX, "Pa")?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn sea_level_air() {
        // U.S. Standard Atmosphere 1976 sea level: ρ = 1.2250 kg/m³ at 288.15 K and
        // 101 325 Pa, μ = 1.7894e-5 Pa·s (from memory; it uses β = 1.458e-6, S = 110.4 K,
        // which agrees with μ₀ = 1.716e-5 at 273.15 K to about 0.1 %).
        let rho = density(288.15, 101_325.0);
        assert!((rho - 1.2250).abs() < 5e-4, "{rho}");
        let mu = viscosity(288.15);
        assert!((mu / 1.7894e-5 - 1.0).abs() < 2e-3, "{mu}");
    }

    #[test]
    fn sutherland_reference_point() {
        // Exact: the law returns μ₀ at T₀.
        assert!((viscosity(T0) - MU0).abs() < 1e-20);
    }

    #[test]
    fn gas_constant() {
        // 287.05 J/(kg·K), common practice (rounded; older R and M give 287.053).
        assert!((R_AIR - 287.05).abs() < 0.01, "{R_AIR}");
    }
}
