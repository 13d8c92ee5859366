//! Unit conversion between SI and the units engineers type.
//!
//! Every calculation in hydrograde takes and returns SI base units (m, s, kg, Pa, K, m³/s,
//! Pa·s, kg/m³). [`convert`] translates a value between two units of the same dimension;
//! [`convert_head`] translates between pressure and the height of a column of liquid of a
//! stated density (m or ft of head) under standard gravity.
//!
//! Unit names are plain ASCII and case-sensitive ([`names`] lists them):
//!
//! | dimension | names (SI unit first) |
//! |---|---|
//! | length | `m`, `mm`, `cm`, `in`, `ft` |
//! | volume flow | `m3/s`, `L/s`, `L/min`, `m3/h`, `gpm` (US gallon per minute) |
//! | pressure | `Pa`, `kPa`, `MPa`, `bar`, `psi`, `atm` |
//! | dynamic viscosity | `Pa*s`, `mPa*s`, `cP` |
//! | temperature | `K`, `degC`, `degF` (affine: offsets are applied) |
//! | velocity | `m/s`, `ft/s` |
//! | head ([`convert_head`] only) | `m_head`, `ft_head` |
//!
//! Temperatures convert as absolute temperatures (20 `degC` is 293.15 `K`), not as
//! temperature differences.
//!
//! Source of every factor: NIST Special Publication 811 (Thompson & Taylor, 2008), Guide
//! for the Use of the International System of Units, Appendix B. All factors used here
//! are exact by definition: inch = 0.0254 m and pound = 0.45359237 kg (international
//! yard and pound agreement, 1959); US gallon = 231 in³ = 3.785411784 × 10⁻³ m³;
//! pound-force = pound × standard gravity; standard gravity = 9.80665 m/s² (3rd CGPM,
//! 1901); standard atmosphere = 101 325 Pa; bar = 10⁵ Pa; centipoise = 10⁻³ Pa·s;
//! °C = K − 273.15; °F = °C × 9/5 + 32. NIST rounds psi to 6.894 757 × 10³ Pa; we keep
//! the exact product 0.45359237 × 9.80665 / 0.0254² Pa. The reference table
//! `tests/reference/units/` (generated with the general-purpose units library pint)
//! checks every pair to 1e-12 relative.

use crate::error::{Error, Result, check};

/// Standard acceleration of gravity, g₀ = 9.80665 m/s² (exact; 3rd CGPM 1901, NIST SP 811).
/// Every head ⇄ pressure conversion in hydrograde uses this one value.
pub const STANDARD_GRAVITY: f64 = 9.80665;

/// One inch in metres (exact, NIST SP 811).
pub const INCH: f64 = 0.0254;
/// One foot in metres (exact, NIST SP 811).
pub const FOOT: f64 = 0.3048;
/// One US liquid gallon in cubic metres (exact: 231 in³, NIST SP 811).
pub const US_GALLON: f64 = 3.785_411_784e-3;
/// One avoirdupois pound in kilograms (exact, NIST SP 811).
pub const POUND: f64 = 0.453_592_37;
/// One pound-force per square inch in pascals: 0.45359237 × 9.80665 / 0.0254² Pa, the
/// exact product of the defining factors (NIST SP 811 rounds it to 6.894 757 × 10³).
pub const PSI: f64 = POUND * STANDARD_GRAVITY / (INCH * INCH);
/// One bar in pascals (exact).
pub const BAR: f64 = 1e5;
/// One standard atmosphere in pascals (exact).
pub const ATMOSPHERE: f64 = 101_325.0;
/// One US gallon per minute in m³/s (exact).
pub const GPM: f64 = US_GALLON / 60.0;
/// One cubic metre per hour in m³/s (exact).
pub const M3_PER_HOUR: f64 = 1.0 / 3600.0;

/// The physical dimension of a unit; conversions only run between equal dimensions.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Dimension {
    Length,
    Flow,
    Pressure,
    Viscosity,
    Temperature,
    Velocity,
    Head,
}

impl Dimension {
    fn name(self) -> &'static str {
        match self {
            Dimension::Length => "length",
            Dimension::Flow => "volume flow",
            Dimension::Pressure => "pressure",
            Dimension::Viscosity => "dynamic viscosity",
            Dimension::Temperature => "temperature",
            Dimension::Velocity => "velocity",
            Dimension::Head => "head",
        }
    }
}

/// A unit: SI value = (value + offset) × scale / per. The offset is zero except for the
/// temperature scales, where it moves the zero to absolute zero before scaling. A
/// decimal or sexagesimal submultiple divides by its exact integer `per` instead of
/// multiplying by an inexact 10⁻ⁿ, so 4.5 L/s is the double nearest 0.0045 m³/s (a
/// division is correctly rounded; 4.5 × 1e-3 is not).
struct Unit {
    name: &'static str,
    dimension: Dimension,
    scale: f64,
    per: f64,
    offset: f64,
}

const fn unit(name: &'static str, dimension: Dimension, scale: f64) -> Unit {
    Unit {
        name,
        dimension,
        scale,
        per: 1.0,
        offset: 0.0,
    }
}

const fn part(name: &'static str, dimension: Dimension, per: f64) -> Unit {
    Unit {
        name,
        dimension,
        scale: 1.0,
        per,
        offset: 0.0,
    }
}

/// The table of units. Factors: NIST SP 811 (2008), Appendix B, all exact (see module doc).
const UNITS: [Unit; 26] = [
    unit("m", Dimension::Length, 1.0),
    part("mm", Dimension::Length, 1e3),
    part("cm", Dimension::Length, 1e2),
    unit("in", Dimension::Length, INCH),
    unit("ft", Dimension::Length, FOOT),
    unit("m3/s", Dimension::Flow, 1.0),
    part("L/s", Dimension::Flow, 1e3),
    part("L/min", Dimension::Flow, 6e4),
    part("m3/h", Dimension::Flow, 3600.0),
    unit("gpm", Dimension::Flow, GPM),
    unit("Pa", Dimension::Pressure, 1.0),
    unit("kPa", Dimension::Pressure, 1e3),
    unit("MPa", Dimension::Pressure, 1e6),
    unit("bar", Dimension::Pressure, BAR),
    unit("psi", Dimension::Pressure, PSI),
    unit("atm", Dimension::Pressure, ATMOSPHERE),
    unit("Pa*s", Dimension::Viscosity, 1.0),
    part("mPa*s", Dimension::Viscosity, 1e3),
    part("cP", Dimension::Viscosity, 1e3),
    unit("K", Dimension::Temperature, 1.0),
    Unit {
        name: "degC",
        dimension: Dimension::Temperature,
        scale: 1.0,
        per: 1.0,
        offset: 273.15,
    },
    Unit {
        name: "degF",
        dimension: Dimension::Temperature,
        scale: 5.0,
        per: 9.0,
        offset: 459.67,
    },
    unit("m/s", Dimension::Velocity, 1.0),
    unit("ft/s", Dimension::Velocity, FOOT),
    // Heads: scale is the height in metres; pressure needs a density (convert_head).
    unit("m_head", Dimension::Head, 1.0),
    unit("ft_head", Dimension::Head, FOOT),
];

/// Every unit name accepted by [`convert`] and [`convert_head`], grouped by dimension.
pub fn names() -> Vec<&'static str> {
    UNITS.iter().map(|u| u.name).collect()
}

fn lookup(name: &str, parameter: &'static str) -> Result<&'static Unit> {
    crate::names::find_unit(UNITS.iter(), |u| u.name, name)
        .ok_or_else(|| Error::unknown_name(parameter, name, &names()))
}

#[inline]
fn to_si(u: &Unit, value: f64) -> f64 {
    let v = if u.offset == 0.0 {
        value
    } else {
        value + u.offset
    };
    if u.scale == 1.0 {
        v / u.per
    } else {
        v * u.scale / u.per
    }
}

#[inline]
fn from_si(u: &Unit, si: f64) -> f64 {
    let v = if u.per == 1.0 {
        si / u.scale
    } else {
        si * u.per / u.scale
    };
    if u.offset == 0.0 { v } else { v - u.offset }
}

fn mismatch(from: &Unit, to: &Unit) -> Error {
    Error::invalid(
        "unit",
        format!(
            "cannot convert \"{}\" ({}) to \"{}\" ({})",
            from.name,
            from.dimension.name(),
            to.name,
            to.dimension.name()
        ),
    )
}

/// Converts `value` from unit `from` to unit `to` (names in the module table).
///
/// Linear units convert through SI with the exact NIST SP 811 factors; temperatures are
/// affine (absolute temperatures). Head units need a density: use [`convert_head`].
///
/// # Errors
/// [`Error::NotFinite`] for a NaN or infinite value; [`Error::UnknownName`] for a name not
/// in the table; [`Error::Invalid`] naming both units when their dimensions differ or a
/// head unit is given; [`Error::OutOfRange`] for a temperature below absolute zero.
///
/// # Example
/// ```
/// use hydrograde::units::convert;
/// assert_eq!(convert(2.0, "in", "mm").unwrap(), 50.8); // 1 in = 25.4 mm exactly
/// ```
pub fn convert(value: f64, from: &str, to: &str) -> Result<f64> {
    check::finite("value", value)?;
    let (uf, ut) = (lookup(from, "unit")?, lookup(to, "unit")?);
    if uf.dimension == Dimension::Head || ut.dimension == Dimension::Head {
        return Err(Error::invalid(
            "unit",
            format!(
                "cannot convert \"{from}\" to \"{to}\" without a density; use convert_head for m_head and ft_head"
            ),
        ));
    }
    if uf.dimension != ut.dimension {
        return Err(mismatch(uf, ut));
    }
    if uf.name == ut.name {
        return Ok(value);
    }
    let si = to_si(uf, value);
    if uf.dimension == Dimension::Temperature && si < 0.0 {
        return Err(Error::out_of_range(
            "value",
            value,
            format!("is below absolute zero in {from}"),
        ));
    }
    Ok(from_si(ut, si))
}

/// Converts between pressure units and heads of liquid: p = ρ · g₀ · h with g₀ the
/// [`STANDARD_GRAVITY`] and ρ = `density` (kg/m³).
///
/// `from` and `to` may each be a pressure unit (`Pa`, `kPa`, `MPa`, `bar`, `psi`, `atm`)
/// or a head unit (`m_head`, `ft_head`); head to head and pressure to pressure also work
/// (the density then plays no part but is still checked).
///
/// # Errors
/// [`Error::NotFinite`]/[`Error::OutOfRange`] for a value that is not finite or a density
/// that is not a positive finite number; [`Error::UnknownName`] for an unknown unit;
/// [`Error::Invalid`] naming both units when either is neither a pressure nor a head.
///
/// # Example
/// ```
/// use hydrograde::units::convert_head;
/// // 10 m of water at 1000 kg/m³ is 98 066.5 Pa (ρ g₀ h, g₀ exact)
/// let p = convert_head(10.0, "m_head", "Pa", 1000.0).unwrap();
/// assert!((p - 98_066.5).abs() < 1e-9);
/// ```
pub fn convert_head(value: f64, from: &str, to: &str, density: f64) -> Result<f64> {
    check::finite("value", value)?;
    check::positive("density", density)?;
    let (uf, ut) = (lookup(from, "unit")?, lookup(to, "unit")?);
    let usable = |u: &Unit| matches!(u.dimension, Dimension::Pressure | Dimension::Head);
    if !usable(uf) || !usable(ut) {
        return Err(Error::invalid(
            "unit",
            format!(
                "convert_head needs pressure or head units; got \"{}\" ({}) and \"{}\" ({})",
                uf.name,
                uf.dimension.name(),
                ut.name,
                ut.dimension.name()
            ),
        ));
    }
    // Work in pascals; a head of h metres is ρ g₀ h pascals.
    let weight = density * STANDARD_GRAVITY;
    let si = to_si(uf, value);
    if uf.dimension == ut.dimension {
        // Same dimension: skip the density so the result is exact in the factors alone.
        return Ok(from_si(ut, si));
    }
    Ok(match ut.dimension {
        Dimension::Head => from_si(ut, si / weight),
        _ => from_si(ut, si * weight),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn names_are_unique() {
        let n = names();
        for (i, a) in n.iter().enumerate() {
            assert!(!n[i + 1..].contains(a), "duplicate unit {a}");
        }
    }

    #[test]
    fn psi_is_the_exact_product() {
        // NIST SP 811 Appendix B: 1 psi = 6.894 757 E+03 Pa (rounded there)
        assert!((PSI - 6894.757).abs() < 1e-3);
        // exact product 0.45359237 * 9.80665 / 0.0254^2 = 6894.757293168361… (mpmath)
        assert!((PSI - 6_894.757_293_168_361).abs() < 1e-9);
    }
}
