//! Real pipe sizes: outside diameter, wall and inside diameter of standard pipe and tube.
//!
//! | table | standard | sizes | schedules / series / walls |
//! |---|---|---|---|
//! | [`PipeTable::Steel`] | ASME B36.10M | NPS 1/8 … 24 | 10, 40, 80, STD, XS |
//! | [`PipeTable::Stainless`] | ASME B36.19M | NPS 1/8 … 24 | 5S, 10S, 40S, 80S |
//! | [`PipeTable::Copper`] | ASTM B88 | 1/4 … 12 | K, L, M |
//! | [`PipeTable::Pvc`] | ASTM D1785 | NPS 1/8 … 24 | 40, 80 |
//! | [`PipeTable::SteelEn10220`] | EN 10220 / ISO 4200 | OD 10.2 … 610 mm | wall 1.6 … 12.5 mm |
//! | [`PipeTable::StainlessIso1127`] | ISO 1127 | OD 10.2 … 323.9 mm | wall 1.0 … 6.3 mm |
//! | [`PipeTable::CopperEn1057`] | EN 1057 | OD 6 … 219 mm | wall 0.6 … 3.0 mm |
//! | [`PipeTable::PeIso4427`] | ISO 4427-2 | dn 20 … 630 mm | SDR 33 … SDR 11 |
//! | [`PipeTable::PvcIso1452`] | ISO 1452-2 | dn 20 … 630 mm | SDR 41 … SDR 11 |
//! | [`PipeTable::HygienicBpe`] | ASME BPE | OD 1/4 … 6 in | wall 0.035 … 0.109 in |
//! | [`PipeTable::HygienicDin11850`] | DIN 11850 | OD 12 … 154 mm | series 1, 2, 3 |
//! | [`PipeTable::HygienicIso2037`] | ISO 2037 | OD 12 … 219.1 mm | wall 1.0 … 2.6 mm |
//!
//! US tables are typed in inches, metric ones in mm, as the standards print them, and
//! converted with 1 in = 0.0254 m and 1 mm = 0.001 m exactly (NIST SP 811). Inside
//! diameter = outside diameter − 2 × wall. For metal pipe and tube the wall is the
//! printed nominal wall (their tolerances are symmetric, or for B36.10M/B36.19M a mill
//! tolerance below). Plastic pipe standards print a *minimum* wall with a tolerance above
//! it only, so there the wall is the mean wall the tolerance implies, e_min + tolerance/2
//! ([`PipeTable::wall_rule`] states each rule and its source): a bore from the minimum
//! wall would be the largest the standard allows, about 1 % too large, and predict about
//! 5 % less friction than real pipe. Real pipe varies within the standards' tolerances.
//! Metric tube is designated by outside diameter × wall, so its nominal size is the
//! outside diameter as printed (`"60.3"`) and, where the standard has no named series,
//! its "schedule" is the wall as printed (`"2.9"`).
//!
//! Tables whose standard assigns a nominal size DN to each outside diameter (EN 10220 and
//! ISO 1127 series 1, DIN 11850) are also looked up by DN: [`lookup_dn`].

mod metric;
mod plastic;
mod tables;

use plastic::WallTolerance;

use crate::error::{Error, Result, check};
use serde::{Deserialize, Serialize};
use std::fmt;
use std::str::FromStr;

/// Metres per inch, exact (NIST SP 811).
const INCH: f64 = 0.0254;
/// Metres per millimetre, exact.
const MM: f64 = 0.001;

/// A table of standard pipe or tube dimensions.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum PipeTable {
    /// Carbon steel pipe, ASME B36.10M (`"steel"`).
    Steel,
    /// Stainless steel pipe, ASME B36.19M (`"stainless"`).
    Stainless,
    /// Copper water tube, ASTM B88 (`"copper"`).
    Copper,
    /// PVC pressure pipe, ASTM D1785 (`"pvc"`).
    Pvc,
    /// Steel tube, EN 10220 / ISO 4200 series 1 (`"steel_en10220"`).
    SteelEn10220,
    /// Stainless steel tube, ISO 1127 (`"stainless_iso1127"`).
    StainlessIso1127,
    /// Copper tube for water and gas, EN 1057 (`"copper_en1057"`).
    CopperEn1057,
    /// PE pressure pipe, ISO 4427-2 (`"pe_iso4427"`).
    PeIso4427,
    /// PVC-U pressure pipe, ISO 1452-2 (`"pvc_iso1452"`).
    PvcIso1452,
    /// Hygienic tubing, ASME BPE (`"hygienic_bpe"`).
    HygienicBpe,
    /// Hygienic stainless tube, DIN 11850 series 1–3 (`"hygienic_din11850"`).
    HygienicDin11850,
    /// Hygienic stainless tube, ISO 2037 (`"hygienic_iso2037"`).
    HygienicIso2037,
}

/// One standard size: a nominal size in one schedule (or tube type), lengths in metres.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PipeSize {
    /// The table it comes from.
    pub table: PipeTable,
    /// Nominal size as printed, e.g. `"2"`, `"1-1/2"`, `"3/4"`.
    pub nominal: String,
    /// Schedule or tube type as printed, e.g. `"40"`, `"STD"`, `"10S"`, `"K"`.
    pub schedule: String,
    /// Outside diameter, m.
    pub outside_diameter: f64,
    /// Wall thickness the bore is worked from, m: the printed wall, or for plastic pipe
    /// the mean wall its standard's tolerance implies (see [`PipeTable::wall_rule`]).
    pub wall: f64,
    /// The minimum wall the standard prints, m, where it prints a minimum wall (plastic
    /// pipe); `None` where it prints a nominal wall.
    #[serde(default)]
    pub minimum_wall: Option<f64>,
    /// Inside diameter (outside diameter − 2 × wall), m.
    pub inside_diameter: f64,
}

type Row = (&'static str, f64, &'static [f64]);

impl PipeTable {
    /// Every table, in a fixed order.
    pub const ALL: [PipeTable; 12] = [
        PipeTable::Steel,
        PipeTable::Stainless,
        PipeTable::Copper,
        PipeTable::Pvc,
        PipeTable::SteelEn10220,
        PipeTable::StainlessIso1127,
        PipeTable::CopperEn1057,
        PipeTable::PeIso4427,
        PipeTable::PvcIso1452,
        PipeTable::HygienicBpe,
        PipeTable::HygienicDin11850,
        PipeTable::HygienicIso2037,
    ];

    /// The name used by every binding: `"steel"`, `"stainless"`, `"copper"`, `"pvc"`,
    /// `"steel_en10220"`, `"stainless_iso1127"`, `"copper_en1057"`, `"pe_iso4427"`,
    /// `"pvc_iso1452"`, `"hygienic_bpe"`, `"hygienic_din11850"`, `"hygienic_iso2037"`.
    pub fn name(self) -> &'static str {
        match self {
            PipeTable::Steel => "steel",
            PipeTable::Stainless => "stainless",
            PipeTable::Copper => "copper",
            PipeTable::Pvc => "pvc",
            PipeTable::SteelEn10220 => "steel_en10220",
            PipeTable::StainlessIso1127 => "stainless_iso1127",
            PipeTable::CopperEn1057 => "copper_en1057",
            PipeTable::PeIso4427 => "pe_iso4427",
            PipeTable::PvcIso1452 => "pvc_iso1452",
            PipeTable::HygienicBpe => "hygienic_bpe",
            PipeTable::HygienicDin11850 => "hygienic_din11850",
            PipeTable::HygienicIso2037 => "hygienic_iso2037",
        }
    }

    /// Metres per printed unit of the table (inch or mm).
    fn unit(self) -> f64 {
        match self {
            PipeTable::Steel
            | PipeTable::Stainless
            | PipeTable::Copper
            | PipeTable::Pvc
            | PipeTable::HygienicBpe => INCH,
            _ => MM,
        }
    }

    fn tolerance(self) -> Option<WallTolerance> {
        match self {
            PipeTable::Pvc => Some(WallTolerance::D1785),
            PipeTable::PeIso4427 => Some(WallTolerance::GradeV),
            PipeTable::PvcIso1452 => Some(WallTolerance::Pvc),
            _ => None,
        }
    }

    /// How the table's wall (and so its bore) is worked out, with the rule's source.
    pub fn wall_rule(self) -> &'static str {
        match self.tolerance() {
            Some(t) => t.rule(),
            None => "nominal wall as printed (tolerances symmetric or below the nominal wall)",
        }
    }

    /// The standard the table follows and how its values were entered.
    pub fn source(self) -> &'static str {
        match self {
            PipeTable::Steel => {
                "ASME B36.10M, welded and seamless wrought steel pipe (from memory)"
            }
            PipeTable::Stainless => "ASME B36.19M, stainless steel pipe (from memory)",
            PipeTable::Copper => "ASTM B88, seamless copper water tube (from memory)",
            PipeTable::Pvc => "ASTM D1785, PVC plastic pipe, schedules 40 and 80 (from memory)",
            PipeTable::SteelEn10220 => {
                "EN 10220 / ISO 4200, plain end steel tubes, series 1 outside diameters with common walls (from memory)"
            }
            PipeTable::StainlessIso1127 => {
                "ISO 1127, stainless steel tubes, series 1 outside diameters with common walls (from memory)"
            }
            PipeTable::CopperEn1057 => {
                "EN 1057, seamless round copper tubes for water and gas (from memory, partly checked against published lists)"
            }
            PipeTable::PeIso4427 => {
                "ISO 4427-2, PE pipes for water supply, minimum walls by SDR (checked against published copies)"
            }
            PipeTable::PvcIso1452 => {
                "ISO 1452-2, PVC-U pipes for water supply, minimum walls by SDR (from memory)"
            }
            PipeTable::HygienicBpe => {
                "ASME BPE, hygienic tubing OD sizes (checked against a published ASTM A270 table; 3/8 in from memory)"
            }
            PipeTable::HygienicDin11850 => {
                "DIN 11850 (1985), stainless tubes for the food industry, series 1 to 3 (checked against a published copy)"
            }
            PipeTable::HygienicIso2037 => {
                "ISO 2037, stainless tubes for the food industry (from memory)"
            }
        }
    }

    /// The schedules (or tube types) of the table, in column order.
    pub fn schedules(self) -> &'static [&'static str] {
        match self {
            PipeTable::Steel => &tables::STEEL_SCHEDULES,
            PipeTable::Stainless => &tables::STAINLESS_SCHEDULES,
            PipeTable::Copper => &tables::COPPER_SCHEDULES,
            PipeTable::Pvc => &tables::PVC_SCHEDULES,
            PipeTable::SteelEn10220 => &metric::STEEL_EN10220_SCHEDULES,
            PipeTable::StainlessIso1127 => &metric::STAINLESS_ISO1127_SCHEDULES,
            PipeTable::CopperEn1057 => &metric::COPPER_EN1057_SCHEDULES,
            PipeTable::PeIso4427 => &plastic::PE_SCHEDULES,
            PipeTable::PvcIso1452 => &plastic::PVC_U_SCHEDULES,
            PipeTable::HygienicBpe => &metric::HYGIENIC_BPE_SCHEDULES,
            PipeTable::HygienicDin11850 => &metric::HYGIENIC_DIN11850_SCHEDULES,
            PipeTable::HygienicIso2037 => &metric::HYGIENIC_ISO2037_SCHEDULES,
        }
    }

    /// The nominal sizes of the table, smallest first.
    pub fn nominal_sizes(self) -> Vec<&'static str> {
        self.rows().map(|r| r.0).collect()
    }

    fn rows(self) -> Box<dyn Iterator<Item = Row>> {
        fn boxed<const N: usize>(
            t: &'static [(&'static str, f64, [f64; N])],
        ) -> Box<dyn Iterator<Item = Row>> {
            Box::new(t.iter().map(|(n, od, w)| (*n, *od, &w[..])))
        }
        match self {
            PipeTable::Steel => boxed(&tables::STEEL),
            PipeTable::Stainless => boxed(&tables::STAINLESS),
            PipeTable::Copper => boxed(&tables::COPPER),
            PipeTable::Pvc => boxed(&tables::PVC),
            PipeTable::SteelEn10220 => boxed(&metric::STEEL_EN10220),
            PipeTable::StainlessIso1127 => boxed(&metric::STAINLESS_ISO1127),
            PipeTable::CopperEn1057 => boxed(&metric::COPPER_EN1057),
            PipeTable::PeIso4427 => boxed(&plastic::PE),
            PipeTable::PvcIso1452 => boxed(&plastic::PVC_U),
            PipeTable::HygienicBpe => boxed(&metric::HYGIENIC_BPE),
            PipeTable::HygienicDin11850 => boxed(&metric::HYGIENIC_DIN11850),
            PipeTable::HygienicIso2037 => boxed(&metric::HYGIENIC_ISO2037),
        }
    }

    /// The column of `schedule`: matched loosely ("sdr11" is "SDR 11", "10s" is "10S"),
    /// or by value where both are numbers ("2.90" is wall "2.9").
    fn schedule_index(self, schedule: &str) -> Result<usize> {
        let want = crate::names::key(schedule);
        let number = schedule.trim().parse::<f64>().ok();
        self.schedules()
            .iter()
            .position(|s| {
                let k = crate::names::key(s);
                k == want
                    || k == format!("sdr{want}")
                    || (number.is_some() && s.parse::<f64>().ok() == number)
            })
            .ok_or_else(|| Error::unknown_name(schedule_word(self), schedule, self.schedules()))
    }

    /// Every size the table defines, in all its schedules, row by row.
    pub fn sizes(self) -> Vec<PipeSize> {
        let mut out = Vec::new();
        for (nominal, od, walls) in self.rows() {
            for (i, &w) in walls.iter().enumerate() {
                if w > 0.0 {
                    out.push(self.size(nominal, self.schedules()[i], od, w));
                }
            }
        }
        out
    }

    /// The size from a row's printed outside diameter and wall (inches or mm).
    fn size(self, nominal: &str, schedule: &str, od: f64, printed_wall: f64) -> PipeSize {
        let unit = self.unit();
        let (wall, minimum_wall) = match self.tolerance() {
            Some(t) => (t.mean_wall(printed_wall), Some(printed_wall * unit)),
            None => (printed_wall, None),
        };
        PipeSize {
            table: self,
            nominal: nominal.to_string(),
            schedule: schedule.to_string(),
            outside_diameter: od * unit,
            wall: wall * unit,
            minimum_wall,
            // Subtract in printed units, where the values are exact decimals.
            inside_diameter: (od - 2.0 * wall) * unit,
        }
    }
}

fn schedule_word(table: PipeTable) -> &'static str {
    match table {
        PipeTable::Copper => "copper tube type",
        PipeTable::PeIso4427 | PipeTable::PvcIso1452 => "SDR series",
        PipeTable::HygienicDin11850 => "tube series",
        PipeTable::Steel | PipeTable::Stainless | PipeTable::Pvc => "schedule",
        _ => "wall",
    }
}

/// Every pipe table, in the fixed order of [`PipeTable::ALL`] (C: `hg_pipe_tables`,
/// Python: `pipe_tables()`).
pub fn pipe_tables() -> &'static [PipeTable] {
    &PipeTable::ALL
}

impl fmt::Display for PipeTable {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.name())
    }
}

impl FromStr for PipeTable {
    type Err = Error;
    fn from_str(s: &str) -> Result<Self> {
        crate::names::find(PipeTable::ALL, |t| t.name(), s).ok_or_else(|| {
            let names: Vec<&str> = PipeTable::ALL.iter().map(|t| t.name()).collect();
            Error::unknown_name("pipe table", s, &names)
        })
    }
}

/// Reads a nominal size written as `"2"`, `"3/4"`, `"1-1/2"`, `"1 1/2"` or `"1.5"`, in
/// inches.
fn parse_nominal(s: &str) -> Option<f64> {
    let s = s.trim();
    let frac = |t: &str| -> Option<f64> {
        match t.split_once('/') {
            Some((a, b)) => {
                let (a, b) = (a.parse::<f64>().ok()?, b.parse::<f64>().ok()?);
                (b > 0.0).then(|| a / b)
            }
            None => t.parse::<f64>().ok(),
        }
    };
    let v = match s.split_once(['-', ' ']) {
        Some((whole, part)) => whole.trim().parse::<f64>().ok()? + frac(part.trim())?,
        None => frac(s)?,
    };
    (v.is_finite() && v > 0.0).then_some(v)
}

/// The size `nominal` (e.g. `"2"`, `"1-1/2"`, `"1.5"`; metric tube by its outside
/// diameter, `"60.3"`, plastic pipe by dn, `"110"`) in `schedule` (e.g. `"40"`, `"std"`,
/// `"10S"`, `"L"`, `"SDR 11"` or `"11"`, a wall `"2.9"`, a DIN 11850 series `"2"`; case
/// and spaces do not matter) of `table`.
///
/// ```
/// use hydrograde::sizes::{lookup, PipeTable};
/// let p = lookup(PipeTable::Steel, "2", "40")?;
/// assert!((p.inside_diameter - 2.067 * 0.0254).abs() < 1e-12); // ASME B36.10M, from memory
/// # Ok::<(), hydrograde::Error>(())
/// ```
///
/// # Errors
/// [`Error::UnknownName`] for a schedule or nominal size the table does not list, or a
/// schedule the standard does not define at that size.
pub fn lookup(table: PipeTable, nominal: &str, schedule: &str) -> Result<PipeSize> {
    let col = table.schedule_index(schedule)?;
    let want = parse_nominal(nominal);
    let row = table
        .rows()
        .find(|r| want.is_some() && parse_nominal(r.0) == want)
        .ok_or_else(|| Error::unknown_name("nominal size", nominal, &table.nominal_sizes()))?;
    let wall = row.2[col];
    if wall > 0.0 {
        Ok(table.size(row.0, table.schedules()[col], row.1, wall))
    } else {
        let defined: Vec<&str> = table
            .schedules()
            .iter()
            .zip(row.2)
            .filter(|(_, w)| **w > 0.0)
            .map(|(s, _)| *s)
            .collect();
        Err(Error::unknown_name(
            schedule_word(table),
            &format!("{schedule} at nominal size {}", row.0),
            &defined,
        ))
    }
}

impl PipeTable {
    /// Nominal size DN → row nominal size, for tables whose standard assigns a DN to each
    /// outside diameter (empty for the others).
    fn dn_rows(self) -> &'static [(u32, &'static str)] {
        match self {
            PipeTable::SteelEn10220 | PipeTable::StainlessIso1127 => &metric::SERIES1_DN,
            PipeTable::HygienicDin11850 => &metric::DIN11850_DN,
            _ => &[],
        }
    }

    /// The nominal sizes DN the table can be looked up by ([`lookup_dn`]), smallest
    /// first; empty for tables whose standard assigns no DN (US, copper, plastic pipe by
    /// dn, ASME BPE, ISO 2037).
    pub fn dn_sizes(self) -> Vec<u32> {
        let rows = self.nominal_sizes();
        let mut out: Vec<u32> = self
            .dn_rows()
            .iter()
            .filter(|(_, n)| rows.contains(n))
            .map(|(dn, _)| *dn)
            .collect();
        out.dedup();
        out
    }
}

/// The size of nominal size `dn` (DN, ISO 6708) in `schedule` of a metric `table` that
/// assigns DNs: `"steel_en10220"` and `"stainless_iso1127"` (series 1 outside diameters,
/// e.g. DN 50 is 60.3 mm) and `"hygienic_din11850"` (where the series picks the outside
/// diameter: DN 25 is 28 × 1.0, 29 × 1.5 or 30 × 2.0 in series 1, 2, 3). Same result as
/// [`lookup`] with the row's outside diameter.
///
/// ```
/// use hydrograde::sizes::{lookup_dn, PipeTable};
/// let p = lookup_dn(PipeTable::HygienicDin11850, 25, "2")?;
/// assert_eq!(p.nominal, "29"); // DIN 11850:1985 Table 1
/// # Ok::<(), hydrograde::Error>(())
/// ```
///
/// # Errors
/// [`Error::UnknownName`] for a table that assigns no DN (naming those that do), a DN the
/// table does not list (suggesting close ones), or a schedule not made at that DN.
pub fn lookup_dn(table: PipeTable, dn: u32, schedule: &str) -> Result<PipeSize> {
    let known = table.dn_sizes();
    if known.is_empty() {
        let with: Vec<&str> = PipeTable::ALL
            .iter()
            .filter(|t| !t.dn_sizes().is_empty())
            .map(|t| t.name())
            .collect();
        return Err(Error::unknown_name(
            "pipe table with DN sizes",
            table.name(),
            &with,
        ));
    }
    let col = table.schedule_index(schedule)?;
    if !known.contains(&dn) {
        let names: Vec<String> = known.iter().map(|d| d.to_string()).collect();
        let names: Vec<&str> = names.iter().map(String::as_str).collect();
        return Err(Error::unknown_name("DN", &dn.to_string(), &names));
    }
    let rows: Vec<&str> = table
        .dn_rows()
        .iter()
        .filter(|(d, _)| *d == dn)
        .map(|(_, n)| *n)
        .collect();
    let found = table.rows().find(|r| rows.contains(&r.0) && r.2[col] > 0.0);
    match found {
        Some(r) => Ok(table.size(r.0, table.schedules()[col], r.1, r.2[col])),
        None => {
            // Not made in that schedule at this DN: the schedules that are.
            let defined: Vec<&str> = table
                .rows()
                .filter(|r| rows.contains(&r.0))
                .flat_map(|r| {
                    table
                        .schedules()
                        .iter()
                        .zip(r.2)
                        .filter(|(_, w)| **w > 0.0)
                        .map(|(s, _)| *s)
                        .collect::<Vec<_>>()
                })
                .collect();
            Err(Error::unknown_name(
                schedule_word(table),
                &format!("{schedule} at DN {dn}"),
                &defined,
            ))
        }
    }
}

/// The smallest size of `table` in `schedule` whose inside diameter is at least
/// `min_inside_diameter` (m).
///
/// # Errors
/// Unknown `schedule`; `min_inside_diameter` not finite or not greater than 0, or larger
/// than every inside diameter of that schedule.
pub fn smallest_at_least(
    table: PipeTable,
    schedule: &str,
    min_inside_diameter: f64,
) -> Result<PipeSize> {
    let col = table.schedule_index(schedule)?;
    let d = check::positive("min_inside_diameter", min_inside_diameter)?;
    let candidates = table
        .rows()
        .filter(|r| r.2[col] > 0.0)
        .map(|r| table.size(r.0, table.schedules()[col], r.1, r.2[col]));
    let mut best: Option<PipeSize> = None;
    let mut largest = 0.0f64;
    for p in candidates {
        largest = largest.max(p.inside_diameter);
        if p.inside_diameter >= d
            && best
                .as_ref()
                .is_none_or(|b| p.inside_diameter < b.inside_diameter)
        {
            best = Some(p);
        }
    }
    best.ok_or_else(|| {
        Error::out_of_range(
            "min_inside_diameter",
            d,
            format!(
                "exceeds the largest inside diameter of {table} schedule {} ({largest} m)",
                table.schedules()[col]
            ),
        )
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn nominal_sizes_parse_in_every_spelling() {
        assert_eq!(parse_nominal("1-1/2"), Some(1.5));
        assert_eq!(parse_nominal("1 1/2"), Some(1.5));
        assert_eq!(parse_nominal("1.5"), Some(1.5));
        assert_eq!(parse_nominal("3/4"), Some(0.75));
        assert_eq!(parse_nominal("12"), Some(12.0));
        assert_eq!(parse_nominal("1/0"), None);
        assert_eq!(parse_nominal("big"), None);
        assert_eq!(parse_nominal("-2"), None);
    }

    #[test]
    fn nominal_sizes_are_increasing_in_every_table() {
        for t in PipeTable::ALL {
            let v: Vec<f64> = t
                .nominal_sizes()
                .iter()
                .map(|s| parse_nominal(s).unwrap())
                .collect();
            assert!(v.windows(2).all(|w| w[0] < w[1]), "{t}");
        }
    }
}
