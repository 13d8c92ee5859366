//! Real pipe sizes: outside diameter, wall and inside diameter of standard pipe and tube.
//!
//! | table | standard | sizes | schedules / types |
//! |---|---|---|---|
//! | [`PipeTable::Steel`] | ASME B36.10M | NPS 1/8 … 24 | 10, 40, 80, STD, XS |
//! | [`PipeTable::Stainless`] | ASME B36.19M | NPS 1/8 … 24 | 5S, 10S, 40S, 80S |
//! | [`PipeTable::Copper`] | ASTM B88 | 1/4 … 12 | K, L, M |
//! | [`PipeTable::Pvc`] | ASTM D1785 | NPS 1/8 … 24 | 40, 80 |
//!
//! The tables are typed in inches from memory of the standards (see `tables.rs`) and
//! converted with 1 in = 0.0254 m exactly (NIST SP 811). Inside diameter = outside
//! diameter − 2 × wall, nominal (real pipe varies within the standards' tolerances).

mod tables;

use crate::error::{Error, Result, check};
use serde::{Deserialize, Serialize};
use std::fmt;
use std::str::FromStr;

/// Metres per inch, exact (NIST SP 811).
const INCH: f64 = 0.0254;

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
    /// Wall thickness, m.
    pub wall: f64,
    /// Inside diameter (outside diameter − 2 × wall), m.
    pub inside_diameter: f64,
}

type Row = (&'static str, f64, &'static [f64]);

impl PipeTable {
    /// Every table, in a fixed order.
    pub const ALL: [PipeTable; 4] = [
        PipeTable::Steel,
        PipeTable::Stainless,
        PipeTable::Copper,
        PipeTable::Pvc,
    ];

    /// The name used by every binding: `"steel"`, `"stainless"`, `"copper"`, `"pvc"`.
    pub fn name(self) -> &'static str {
        match self {
            PipeTable::Steel => "steel",
            PipeTable::Stainless => "stainless",
            PipeTable::Copper => "copper",
            PipeTable::Pvc => "pvc",
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
        }
    }

    /// The schedules (or tube types) of the table, in column order.
    pub fn schedules(self) -> &'static [&'static str] {
        match self {
            PipeTable::Steel => &tables::STEEL_SCHEDULES,
            PipeTable::Stainless => &tables::STAINLESS_SCHEDULES,
            PipeTable::Copper => &tables::COPPER_SCHEDULES,
            PipeTable::Pvc => &tables::PVC_SCHEDULES,
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
        }
    }

    fn schedule_index(self, schedule: &str) -> Result<usize> {
        let want = schedule.trim().to_ascii_uppercase();
        self.schedules()
            .iter()
            .position(|s| *s == want)
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

    fn size(self, nominal: &str, schedule: &str, od_in: f64, wall_in: f64) -> PipeSize {
        PipeSize {
            table: self,
            nominal: nominal.to_string(),
            schedule: schedule.to_string(),
            outside_diameter: od_in * INCH,
            wall: wall_in * INCH,
            // Subtract in inches, where the printed values are exact decimals.
            inside_diameter: (od_in - 2.0 * wall_in) * INCH,
        }
    }
}

fn schedule_word(table: PipeTable) -> &'static str {
    if table == PipeTable::Copper {
        "copper tube type"
    } else {
        "schedule"
    }
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

/// The size `nominal` (e.g. `"2"`, `"1-1/2"`, `"1.5"`) in `schedule` (e.g. `"40"`,
/// `"std"`, `"10S"`, `"L"`; case does not matter) of `table`.
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
