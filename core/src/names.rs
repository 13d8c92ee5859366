//! How names typed by a person are matched against the library's catalogues (fittings,
//! materials, correlations, pipe tables, units): case, spaces, underscores and hyphens do
//! not matter, so "Gate Valve", "gate-valve" and "gate_valve" are one fitting. A
//! spreadsheet user types names by hand; an exact-spelling rule would only produce errors.
//!
//! Unit symbols are different: case carries meaning there ("mPa" is not "MPa"), so
//! [`find_unit`] tries the exact symbol first and accepts a loose match only when exactly
//! one unit has that loose spelling. It also reads the printed forms "°C", "°F", "m³/s",
//! "Pa·s".

/// The loose form of a name: lower case, without spaces, underscores and hyphens.
pub(crate) fn key(name: &str) -> String {
    name.chars()
        .filter(|c| !matches!(c, ' ' | '_' | '-' | '\t'))
        .flat_map(char::to_lowercase)
        .collect()
}

/// The item of `items` whose name (by `name_of`) matches `wanted` loosely.
pub(crate) fn find<T: Copy>(
    items: impl IntoIterator<Item = T>,
    name_of: impl Fn(T) -> &'static str,
    wanted: &str,
) -> Option<T> {
    let want = key(wanted);
    items.into_iter().find(|&t| key(name_of(t)) == want)
}

/// The loose form of a unit symbol: printed symbols (°, ³, ², ·) in their typed form,
/// lower case, without spaces and underscores.
fn unit_key(name: &str) -> String {
    let typed = name
        .replace('°', "deg")
        .replace('³', "3")
        .replace('²', "2")
        .replace('·', "*");
    typed
        .chars()
        .filter(|c| !matches!(c, ' ' | '_' | '\t'))
        .flat_map(char::to_lowercase)
        .collect()
}

/// The item of `items` whose unit symbol is `wanted`: exactly, or loosely when only one
/// symbol has that loose spelling.
pub(crate) fn find_unit<T: Copy>(
    items: impl IntoIterator<Item = T> + Clone,
    name_of: impl Fn(T) -> &'static str,
    wanted: &str,
) -> Option<T> {
    if let Some(t) = items.clone().into_iter().find(|&t| name_of(t) == wanted) {
        return Some(t);
    }
    let want = unit_key(wanted);
    let mut hits = items.into_iter().filter(|&t| unit_key(name_of(t)) == want);
    match (hits.next(), hits.next()) {
        (Some(t), None) => Some(t),
        _ => None,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn loose_names_match() {
        let names = ["gate_valve", "elbow_90_long_radius"];
        let f = |s: &'static str| s;
        assert_eq!(find(names, f, "Gate Valve"), Some("gate_valve"));
        assert_eq!(find(names, f, "GATE-VALVE"), Some("gate_valve"));
        assert_eq!(
            find(names, f, " elbow 90 long radius "),
            Some("elbow_90_long_radius")
        );
        assert_eq!(find(names, f, "globe_valve"), None);
    }

    #[test]
    fn units_keep_case_when_it_matters() {
        let units = ["mm", "Mm", "degC", "m3/s", "Pa*s", "mPa*s", "MPa"];
        let f = |s: &'static str| s;
        assert_eq!(find_unit(units, f, "mm"), Some("mm"));
        assert_eq!(find_unit(units, f, "Mm"), Some("Mm"));
        // "MM" could be either: refused rather than guessed.
        assert_eq!(find_unit(units, f, "MM"), None);
        assert_eq!(find_unit(units, f, "°C"), Some("degC"));
        assert_eq!(find_unit(units, f, "DEGC"), Some("degC"));
        assert_eq!(find_unit(units, f, "m³/s"), Some("m3/s"));
        assert_eq!(find_unit(units, f, "mPa·s"), Some("mPa*s"));
        assert_eq!(find_unit(units, f, "mpa"), Some("MPa"));
    }

    #[test]
    fn catalogue_lookups_are_loose() {
        use crate::{Correlation, Fitting, PipeTable, roughness, units};
        assert!(Fitting::named("Gate Valve").is_ok());
        assert!(roughness::material("Commercial Steel").is_ok());
        assert_eq!(
            "Swamee-Jain".parse::<Correlation>().ok(),
            Some(Correlation::SwameeJain)
        );
        assert_eq!("STEEL".parse::<PipeTable>().ok(), Some(PipeTable::Steel));
        // 20 °C = 293.15 K exactly (definition of the Celsius scale).
        assert_eq!(units::convert(20.0, "°C", "K").ok(), Some(293.15));
        assert_eq!(units::convert(1.0, "L/S", "m3/s").ok(), Some(1e-3));
        assert!(units::convert(1.0, "furlong", "m").is_err());
    }
}
