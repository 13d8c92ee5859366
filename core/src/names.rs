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

/// Edit distance between two loose keys: insertions, deletions, substitutions and swaps
/// of neighbours each count one (optimal string alignment; Damerau, 1964).
fn distance(a: &[char], b: &[char]) -> usize {
    let w = b.len() + 1;
    let mut d = vec![0usize; (a.len() + 1) * w];
    for (i, row) in d.chunks_mut(w).enumerate() {
        row[0] = i;
    }
    for (j, cell) in d.iter_mut().enumerate().take(w) {
        *cell = j;
    }
    for i in 1..=a.len() {
        for j in 1..=b.len() {
            let cost = usize::from(a[i - 1] != b[j - 1]);
            let mut v = (d[(i - 1) * w + j] + 1)
                .min(d[i * w + j - 1] + 1)
                .min(d[(i - 1) * w + j - 1] + cost);
            if i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1] {
                v = v.min(d[(i - 2) * w + j - 2] + 1);
            }
            d[i * w + j] = v;
        }
    }
    d[a.len() * w + b.len()]
}

/// The names of `known` a person most likely meant by `given`, best first, at most
/// three: those within one edit per three characters of the loose form (at least one for
/// names of three characters or more), and those whose loose form contains `given`'s
/// (three characters or more: "iso4427" finds "pe_iso4427"); for a number, the known
/// numbers within 5 % of it ("60" finds the tube "60.3").
pub(crate) fn suggestions<'a>(
    given: &str,
    known: impl IntoIterator<Item = &'a str>,
) -> Vec<&'a str> {
    let g: Vec<char> = key(given).chars().collect();
    if g.is_empty() {
        return Vec::new();
    }
    let limit = g.len() / 3;
    let gs: String = g.iter().collect();
    let mut scored: Vec<(usize, &str)> = known
        .into_iter()
        .filter_map(|k| {
            let kk = key(k);
            let kc: Vec<char> = kk.chars().collect();
            let d = distance(&g, &kc);
            if let (Ok(a), Ok(b)) = (gs.parse::<f64>(), kk.parse::<f64>()) {
                // Sizes and walls: numbers within 5 % of each other ("60" for "60.3").
                return (a > 0.0 && (a - b).abs() <= 0.05 * b.abs()).then_some((d, k));
            }
            if d <= limit && d < kc.len() {
                Some((d, k))
            } else if g.len() >= 3 && kk.contains(&gs) {
                Some((limit + 1, k))
            } else {
                None
            }
        })
        .collect();
    scored.sort_by_key(|&(d, _)| d);
    scored.dedup_by_key(|s| s.1);
    scored.into_iter().take(3).map(|(_, k)| k).collect()
}

/// The "; did you mean …?" part of an unknown-name message (empty when nothing is close):
/// `known` is the comma-separated list the message shows.
pub(crate) struct DidYouMean<'a>(pub &'a str, pub &'a str);

impl std::fmt::Display for DidYouMean<'_> {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        let s = suggestions(self.0, self.1.split(", ").filter(|k| !k.is_empty()));
        let quoted: Vec<String> = s.iter().map(|k| format!("\"{k}\"")).collect();
        match quoted.len() {
            0 => Ok(()),
            1 => write!(f, "; did you mean {}?", quoted[0]),
            n => write!(
                f,
                "; did you mean {} or {}?",
                quoted[..n - 1].join(", "),
                quoted[n - 1]
            ),
        }
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

    #[test]
    fn suggestions_by_edit_distance_and_containment() {
        let tables = [
            "steel",
            "stainless",
            "copper",
            "pvc",
            "pe_iso4427",
            "hygienic_bpe",
        ];
        assert_eq!(suggestions("stel", tables), vec!["steel"]);
        assert_eq!(suggestions("pcv", tables), vec!["pvc"]);
        assert_eq!(suggestions("coper", tables), vec!["copper"]);
        assert_eq!(suggestions("iso4427", tables), vec!["pe_iso4427"]);
        assert_eq!(suggestions("BPE", tables), vec!["hygienic_bpe"]);
        assert!(suggestions("cast_iron", tables).is_empty());
        assert!(suggestions("", tables).is_empty());
        // One character is too short to guess from.
        assert!(suggestions("7", ["8", "6", "1/2"]).is_empty());
        assert_eq!(suggestions("60", ["48.3", "60.3", "76.1"]), vec!["60.3"]);
        assert_eq!(suggestions("2.9", ["2.6", "2.9", "3.2"]), vec!["2.9"]);
        let m = DidYouMean("colbrook", "colebrook, haaland").to_string();
        assert_eq!(m, "; did you mean \"colebrook\"?");
        assert_eq!(DidYouMean("xyz", "colebrook").to_string(), "");
    }
}
