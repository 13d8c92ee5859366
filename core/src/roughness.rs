//! Wall roughness: a catalogue of pipe materials and the linear aging model.
//!
//! Absolute roughness ε is the equivalent sand-grain roughness of Nikuradse (1933), the
//! length the Colebrook equation expects, in metres. Published values scatter widely:
//! the same material, new, is quoted over a factor of two to ten, and service changes it
//! more than that. Each entry therefore gives a typical value and a low–high range for the
//! uncertainty band, with its source. The values are the ones repeated across engineering
//! handbooks since Moody (1944) and are typed from memory ("common practice, from
//! memory"); check the supplier's data for a real design.

use crate::error::{Error, Result, check};
use serde::{Deserialize, Serialize};

/// A wall material with its absolute roughness (m).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Material {
    /// Catalogue name, plain lowercase words joined by `_`, e.g. `"commercial_steel"`.
    pub name: String,
    /// What the name covers, in words.
    pub description: String,
    /// Typical absolute roughness of new pipe, m.
    pub typical: f64,
    /// Low end of the quoted range, m.
    pub low: f64,
    /// High end of the quoted range, m.
    pub high: f64,
    /// Where the numbers come from.
    pub source: String,
}

/// Source note for the handbook values.
const HANDBOOK: &str =
    "common practice (handbook values in the tradition of Moody 1944), from memory";

/// (name, description, typical, low, high) in millimetres, converted on the way out.
const CATALOGUE_MM: [(&str, &str, f64, f64, f64); 16] = [
    (
        "drawn_tubing",
        "drawn tubing: glass, brass, drawn metal",
        0.0015,
        0.001,
        0.0025,
    ),
    ("copper", "drawn copper or brass tube", 0.0015, 0.001, 0.003),
    ("pvc", "PVC and other rigid plastics", 0.0015, 0.0015, 0.007),
    (
        "plastic",
        "plastic pipe in general (PP, PVDF, ABS)",
        0.0015,
        0.0015,
        0.01,
    ),
    ("hdpe", "high-density polyethylene", 0.007, 0.0015, 0.02),
    (
        "stainless_steel",
        "stainless steel, new",
        0.015,
        0.002,
        0.045,
    ),
    (
        "commercial_steel",
        "commercial (welded or seamless) carbon steel, new",
        0.045,
        0.02,
        0.09,
    ),
    ("wrought_iron", "wrought iron, new", 0.045, 0.03, 0.09),
    ("galvanized_steel", "galvanized steel, new", 0.15, 0.06, 0.3),
    (
        "asphalted_cast_iron",
        "asphalt-coated cast iron",
        0.12,
        0.05,
        0.2,
    ),
    ("cast_iron", "cast iron, new and uncoated", 0.26, 0.15, 0.6),
    ("ductile_iron", "ductile iron, uncoated", 0.25, 0.1, 0.6),
    (
        "cement_lined_ductile_iron",
        "ductile iron with cement-mortar lining",
        0.1,
        0.03,
        0.3,
    ),
    ("concrete", "concrete, smooth to rough forms", 1.0, 0.3, 3.0),
    ("wood_stave", "wood stave", 0.5, 0.18, 0.9),
    ("riveted_steel", "riveted steel", 3.0, 0.9, 9.0),
];

/// Every material of the catalogue, in a fixed order, roughness in metres.
pub fn catalogue() -> Vec<Material> {
    CATALOGUE_MM
        .iter()
        .map(|&(name, description, typical, low, high)| Material {
            name: name.to_string(),
            description: description.to_string(),
            typical: typical / 1000.0,
            low: low / 1000.0,
            high: high / 1000.0,
            source: HANDBOOK.to_string(),
        })
        .collect()
}

/// The names of the catalogue, in catalogue order.
pub fn names() -> Vec<&'static str> {
    CATALOGUE_MM.iter().map(|m| m.0).collect()
}

/// The catalogue entry named `name` (e.g. `"commercial_steel"`).
///
/// ```
/// let steel = hydrograde::roughness::material("commercial_steel")?;
/// assert!((steel.typical - 4.5e-5).abs() < 1e-15); // 0.045 mm, common practice, from memory
/// # Ok::<(), hydrograde::Error>(())
/// ```
///
/// # Errors
/// [`Error::UnknownName`] listing the known names when `name` is not in the catalogue.
pub fn material(name: &str) -> Result<Material> {
    let wanted = crate::names::key(name);
    catalogue()
        .into_iter()
        .find(|m| crate::names::key(&m.name) == wanted)
        .ok_or_else(|| Error::unknown_name("material", name, &names()))
}

/// Roughness (m) after `years` of service when it grows linearly from `initial` (m) at
/// `rate` (m per year): ε(t) = ε₀ + α·t.
///
/// This is the linear aging model of Colebrook & White (1937, "The reduction of carrying
/// capacity of pipes with age", J. Inst. Civil Eng.; from memory), the classic model for
/// water mains. Reported rates range from about 0.01 mm/year for non-aggressive water to
/// over 0.5 mm/year for aggressive water in unlined iron (common practice, from memory);
/// it does not apply to plastics or lined pipe that do not corrode.
///
/// # Errors
/// Any argument not finite or negative.
pub fn aged(initial: f64, rate: f64, years: f64) -> Result<f64> {
    let initial = check::non_negative("initial", initial)?;
    let rate = check::non_negative("rate", rate)?;
    let years = check::non_negative("years", years)?;
    check::finite("roughness", initial + rate * years)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_entry_is_ordered_and_sourced() {
        let cat = catalogue();
        assert_eq!(cat.len(), CATALOGUE_MM.len());
        for m in &cat {
            assert!(
                m.low > 0.0 && m.low <= m.typical && m.typical <= m.high,
                "{}",
                m.name
            );
            assert!(m.high < 0.1, "{}", m.name);
            assert!(!m.source.is_empty());
            assert!(
                m.name.chars().all(|c| c.is_ascii_lowercase() || c == '_'),
                "{}",
                m.name
            );
        }
        let mut n = names();
        n.sort_unstable();
        n.dedup();
        assert_eq!(n.len(), cat.len(), "names are unique");
    }

    #[test]
    fn lookup_and_unknown_names() {
        // Moody (1944) chart: commercial steel 0.00015 ft = 0.046 mm (from memory); the
        // rounded 0.045 mm is common practice.
        let s = material("commercial_steel").unwrap();
        assert!((s.typical - 0.045e-3).abs() < 1e-12);
        // Moody (1944): cast iron 0.00085 ft = 0.26 mm (from memory).
        assert!((material("cast_iron").unwrap().typical - 0.26e-3).abs() < 1e-12);
        let e = material("unobtainium").unwrap_err();
        assert_eq!(e.kind(), crate::ErrorKind::UnknownName);
        assert!(e.to_string().contains("commercial_steel"));
    }

    #[test]
    fn linear_aging() {
        // Exact arithmetic of the linear model: 0.26 mm + 0.1 mm/yr × 20 yr = 2.26 mm.
        let e = aged(0.26e-3, 0.1e-3, 20.0).unwrap();
        assert!((e - 2.26e-3).abs() < 1e-15);
        assert_eq!(aged(1e-4, 0.0, 50.0).unwrap(), 1e-4);
        assert!(aged(1e-4, -1e-5, 10.0).is_err());
        assert!(aged(1e-4, 1e-5, f64::NAN).is_err());
        assert!(aged(1e-4, 1e300, 1e300).is_err());
    }
}
