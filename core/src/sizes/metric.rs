//! Metric and hygienic tube, in mm as the standards print it (ASME BPE in inches).
//!
//! Metric tube is designated by outside diameter × wall ("60.3 × 2.9"): the nominal size
//! of a row is its outside diameter as printed, and the "schedule" of a wall-series table
//! is the wall as printed (`"2.9"`). Every row lists the walls it is made in; a wall of
//! 0.0 means no such tube. The walls of these standards are nominal walls with symmetric
//! tolerances, so the nominal wall is also the mean wall. Sources and what was checked
//! against published copies: core/tests/sizes_metric.rs.

/// Marks, for each wall of `series`, whether `walls` lists it: a wall typed that is not
/// in the series stops the build (a typo cannot vanish silently).
const fn pick<const N: usize>(series: [f64; N], walls: &[f64]) -> [f64; N] {
    let mut out = [0.0; N];
    let mut j = 0;
    while j < walls.len() {
        let mut i = 0;
        let mut found = false;
        while i < N {
            if series[i] == walls[j] {
                out[i] = walls[j];
                found = true;
            }
            i += 1;
        }
        assert!(found, "a wall that is not in the table's wall series");
        j += 1;
    }
    out
}

/// Every wall of `series` from `lo` to `hi` (both included, both in the series).
const fn span<const N: usize>(series: [f64; N], lo: f64, hi: f64) -> [f64; N] {
    let mut out = [0.0; N];
    let (mut i, mut seen) = (0, 0);
    while i < N {
        if series[i] >= lo && series[i] <= hi {
            out[i] = series[i];
            if series[i] == lo || series[i] == hi {
                seen += 1;
            }
        }
        i += 1;
    }
    assert!(
        seen == 2 || (seen == 1 && lo == hi),
        "span ends not in the wall series"
    );
    out
}

const STEEL_WALLS: [f64; 19] = [
    1.6, 1.8, 2.0, 2.3, 2.6, 2.9, 3.2, 3.6, 4.0, 4.5, 5.0, 5.6, 6.3, 7.1, 8.0, 8.8, 10.0, 11.0,
    12.5,
];
/// Walls of [`STEEL_EN10220`] (mm), in column order.
pub const STEEL_EN10220_SCHEDULES: [&str; 19] = [
    "1.6", "1.8", "2.0", "2.3", "2.6", "2.9", "3.2", "3.6", "4.0", "4.5", "5.0", "5.6", "6.3",
    "7.1", "8.0", "8.8", "10.0", "11.0", "12.5",
];

const fn st(lo: f64, hi: f64) -> [f64; 19] {
    span(STEEL_WALLS, lo, hi)
}

/// Steel tube, EN 10220 / ISO 4200 outside-diameter series 1 (the series with fittings
/// for every size, DN 6 to DN 600) and, for each, the commonly made walls from the
/// preferred wall series, a subset of the standard's table (from memory).
pub const STEEL_EN10220: [(&str, f64, [f64; 19]); 22] = [
    ("10.2", 10.2, st(1.6, 2.6)),
    ("13.5", 13.5, st(1.6, 2.9)),
    ("17.2", 17.2, st(1.6, 3.2)),
    ("21.3", 21.3, st(1.6, 3.6)),
    ("26.9", 26.9, st(1.6, 4.0)),
    ("33.7", 33.7, st(2.0, 4.5)),
    ("42.4", 42.4, st(2.0, 5.0)),
    ("48.3", 48.3, st(2.0, 5.6)),
    ("60.3", 60.3, st(2.0, 6.3)),
    ("76.1", 76.1, st(2.3, 7.1)),
    ("88.9", 88.9, st(2.3, 8.0)),
    ("114.3", 114.3, st(2.6, 8.8)),
    ("139.7", 139.7, st(2.9, 10.0)),
    ("168.3", 168.3, st(2.9, 11.0)),
    ("219.1", 219.1, st(3.6, 12.5)),
    ("273", 273.0, st(4.0, 12.5)),
    ("323.9", 323.9, st(4.5, 12.5)),
    ("355.6", 355.6, st(5.0, 12.5)),
    ("406.4", 406.4, st(6.3, 12.5)),
    ("457", 457.0, st(6.3, 12.5)),
    ("508", 508.0, st(6.3, 12.5)),
    ("610", 610.0, st(6.3, 12.5)),
];

const STAINLESS_WALLS: [f64; 14] = [
    1.0, 1.2, 1.6, 2.0, 2.3, 2.6, 2.9, 3.2, 3.6, 4.0, 4.5, 5.0, 5.6, 6.3,
];
/// Walls of [`STAINLESS_ISO1127`] (mm), in column order.
pub const STAINLESS_ISO1127_SCHEDULES: [&str; 14] = [
    "1.0", "1.2", "1.6", "2.0", "2.3", "2.6", "2.9", "3.2", "3.6", "4.0", "4.5", "5.0", "5.6",
    "6.3",
];

const fn ss(lo: f64, hi: f64) -> [f64; 14] {
    span(STAINLESS_WALLS, lo, hi)
}

/// Stainless steel tube, ISO 1127 (EN ISO 1127): outside-diameter series 1 (the ISO 4200
/// series) and, for each, the commonly made walls, a subset of the standard's table
/// (from memory). Wall tolerance classes T1 to T4 are symmetric (±15 % to ±7.5 %).
pub const STAINLESS_ISO1127: [(&str, f64, [f64; 14]); 17] = [
    ("10.2", 10.2, ss(1.0, 2.0)),
    ("13.5", 13.5, ss(1.0, 2.3)),
    ("17.2", 17.2, ss(1.0, 2.3)),
    ("21.3", 21.3, ss(1.0, 3.2)),
    ("26.9", 26.9, ss(1.0, 3.2)),
    ("33.7", 33.7, ss(1.2, 3.2)),
    ("42.4", 42.4, ss(1.2, 3.6)),
    ("48.3", 48.3, ss(1.2, 3.6)),
    ("60.3", 60.3, ss(1.6, 4.0)),
    ("76.1", 76.1, ss(1.6, 4.0)),
    ("88.9", 88.9, ss(1.6, 5.0)),
    ("114.3", 114.3, ss(1.6, 5.0)),
    ("139.7", 139.7, ss(2.0, 5.0)),
    ("168.3", 168.3, ss(2.0, 5.6)),
    ("219.1", 219.1, ss(2.0, 6.3)),
    ("273", 273.0, ss(2.6, 6.3)),
    ("323.9", 323.9, ss(2.6, 6.3)),
];

const COPPER_WALLS: [f64; 10] = [0.6, 0.7, 0.8, 0.9, 1.0, 1.2, 1.5, 2.0, 2.5, 3.0];
/// Walls of [`COPPER_EN1057`] (mm), in column order.
pub const COPPER_EN1057_SCHEDULES: [&str; 10] = [
    "0.6", "0.7", "0.8", "0.9", "1.0", "1.2", "1.5", "2.0", "2.5", "3.0",
];

const fn cu(walls: &[f64]) -> [f64; 10] {
    pick(COPPER_WALLS, walls)
}

/// Copper tube for water and gas, EN 1057: outside diameter × wall combinations made in
/// Europe, 6 to 219 mm (a subset of the standard's table; see the test for which were
/// checked against published lists).
pub const COPPER_EN1057: [(&str, f64, [f64; 10]); 18] = [
    ("6", 6.0, cu(&[0.6, 0.8])),
    ("8", 8.0, cu(&[0.6, 0.8])),
    ("10", 10.0, cu(&[0.6, 0.8, 1.0])),
    ("12", 12.0, cu(&[0.6, 0.8, 1.0])),
    ("15", 15.0, cu(&[0.7, 1.0, 1.2])),
    ("18", 18.0, cu(&[1.0, 1.2])),
    ("22", 22.0, cu(&[0.9, 1.0, 1.2, 1.5])),
    ("28", 28.0, cu(&[0.9, 1.0, 1.2, 1.5])),
    ("35", 35.0, cu(&[1.0, 1.2, 1.5, 2.0])),
    ("42", 42.0, cu(&[1.0, 1.2, 1.5, 2.0])),
    ("54", 54.0, cu(&[1.0, 1.2, 1.5, 2.0])),
    ("66.7", 66.7, cu(&[1.2, 2.0])),
    ("76.1", 76.1, cu(&[1.5, 2.0])),
    ("88.9", 88.9, cu(&[2.0])),
    ("108", 108.0, cu(&[1.5, 2.5])),
    ("133", 133.0, cu(&[1.5, 3.0])),
    ("159", 159.0, cu(&[2.0, 3.0])),
    ("219", 219.0, cu(&[3.0])),
];

/// Walls of [`HYGIENIC_BPE`] (in), in column order.
pub const HYGIENIC_BPE_SCHEDULES: [&str; 4] = ["0.035", "0.065", "0.083", "0.109"];

/// Hygienic tubing, ASME BPE (the tube OD sizes of ASTM A270 sanitary tube), in inches:
/// the nominal size is the outside diameter. Every row but 3/8 in checked against a
/// published A270 table (core/tests/sizes_metric.rs); 3/8 in from memory.
pub const HYGIENIC_BPE: [(&str, f64, [f64; 4]); 11] = [
    ("1/4", 0.250, [0.035, 0.0, 0.0, 0.0]),
    ("3/8", 0.375, [0.035, 0.0, 0.0, 0.0]),
    ("1/2", 0.500, [0.0, 0.065, 0.0, 0.0]),
    ("3/4", 0.750, [0.0, 0.065, 0.0, 0.0]),
    ("1", 1.000, [0.0, 0.065, 0.0, 0.0]),
    ("1-1/2", 1.500, [0.0, 0.065, 0.0, 0.0]),
    ("2", 2.000, [0.0, 0.065, 0.0, 0.0]),
    ("2-1/2", 2.500, [0.0, 0.065, 0.0, 0.0]),
    ("3", 3.000, [0.0, 0.065, 0.0, 0.0]),
    ("4", 4.000, [0.0, 0.0, 0.083, 0.0]),
    ("6", 6.000, [0.0, 0.0, 0.0, 0.109]),
];

/// Series of [`HYGIENIC_DIN11850`], in column order.
pub const HYGIENIC_DIN11850_SCHEDULES: [&str; 3] = ["1", "2", "3"];

/// Stainless tube for the food industry, DIN 11850 series 1, 2 and 3 (1985 edition;
/// series 2 continues as EN 10357 series A), DN 10 to DN 150: rows by outside diameter.
/// Wall tolerance ±10 %. Checked entry by entry against a published copy (see the test).
pub const HYGIENIC_DIN11850: [(&str, f64, [f64; 3]); 26] = [
    ("12", 12.0, [1.0, 0.0, 0.0]),
    ("13", 13.0, [0.0, 1.5, 0.0]),
    ("14", 14.0, [0.0, 0.0, 2.0]),
    ("18", 18.0, [1.0, 0.0, 0.0]),
    ("19", 19.0, [0.0, 1.5, 0.0]),
    ("20", 20.0, [0.0, 0.0, 2.0]),
    ("22", 22.0, [1.0, 0.0, 0.0]),
    ("23", 23.0, [0.0, 1.5, 0.0]),
    ("24", 24.0, [0.0, 0.0, 2.0]),
    ("28", 28.0, [1.0, 0.0, 0.0]),
    ("29", 29.0, [0.0, 1.5, 0.0]),
    ("30", 30.0, [0.0, 0.0, 2.0]),
    ("34", 34.0, [1.0, 0.0, 0.0]),
    ("35", 35.0, [0.0, 1.5, 0.0]),
    ("36", 36.0, [0.0, 0.0, 2.0]),
    ("40", 40.0, [1.0, 0.0, 0.0]),
    ("41", 41.0, [0.0, 1.5, 0.0]),
    ("42", 42.0, [0.0, 0.0, 2.0]),
    ("52", 52.0, [1.0, 0.0, 0.0]),
    ("53", 53.0, [0.0, 1.5, 0.0]),
    ("54", 54.0, [0.0, 0.0, 2.0]),
    ("70", 70.0, [2.0, 2.0, 2.0]),
    ("85", 85.0, [2.0, 2.0, 2.0]),
    ("104", 104.0, [2.0, 2.0, 2.0]),
    ("129", 129.0, [2.0, 2.0, 2.0]),
    ("154", 154.0, [2.0, 2.0, 2.0]),
];

const ISO2037_WALLS: [f64; 5] = [1.0, 1.2, 1.6, 2.0, 2.6];
/// Walls of [`HYGIENIC_ISO2037`] (mm), in column order.
pub const HYGIENIC_ISO2037_SCHEDULES: [&str; 5] = ["1.0", "1.2", "1.6", "2.0", "2.6"];

const fn iso(wall: f64) -> [f64; 5] {
    pick(ISO2037_WALLS, &[wall])
}

/// Stainless tube for the food industry, ISO 2037 (the series EN 10357 series B and
/// DIN 11866 series B follow), one wall per outside diameter (from memory).
pub const HYGIENIC_ISO2037: [(&str, f64, [f64; 5]); 18] = [
    ("12", 12.0, iso(1.0)),
    ("12.7", 12.7, iso(1.0)),
    ("17.2", 17.2, iso(1.0)),
    ("21.3", 21.3, iso(1.0)),
    ("25", 25.0, iso(1.2)),
    ("33.7", 33.7, iso(1.2)),
    ("38", 38.0, iso(1.2)),
    ("40", 40.0, iso(1.2)),
    ("51", 51.0, iso(1.2)),
    ("63.5", 63.5, iso(1.6)),
    ("70", 70.0, iso(1.6)),
    ("76.1", 76.1, iso(1.6)),
    ("88.9", 88.9, iso(2.0)),
    ("101.6", 101.6, iso(2.0)),
    ("114.3", 114.3, iso(2.0)),
    ("139.7", 139.7, iso(2.0)),
    ("168.3", 168.3, iso(2.6)),
    ("219.1", 219.1, iso(2.6)),
];

/// Nominal size DN of each ISO 4200 / EN 10220 series 1 outside diameter (shared by
/// [`STEEL_EN10220`] and [`STAINLESS_ISO1127`], whose rows are the same series): DN 15
/// to DN 32 and DN 40 to DN 400 as in published copies (see core/tests/sizes_metric.rs),
/// DN 6 to DN 10, 65, 125 and 450 to 600 from memory.
pub const SERIES1_DN: [(u32, &str); 22] = [
    (6, "10.2"),
    (8, "13.5"),
    (10, "17.2"),
    (15, "21.3"),
    (20, "26.9"),
    (25, "33.7"),
    (32, "42.4"),
    (40, "48.3"),
    (50, "60.3"),
    (65, "76.1"),
    (80, "88.9"),
    (100, "114.3"),
    (125, "139.7"),
    (150, "168.3"),
    (200, "219.1"),
    (250, "273"),
    (300, "323.9"),
    (350, "355.6"),
    (400, "406.4"),
    (450, "457"),
    (500, "508"),
    (600, "610"),
];

/// Nominal size DN of each [`HYGIENIC_DIN11850`] row, as DIN 11850:1985 Table 1 prints it
/// (one outside diameter per series up to DN 50, one for all three from DN 65).
pub const DIN11850_DN: [(u32, &str); 26] = [
    (10, "12"),
    (10, "13"),
    (10, "14"),
    (15, "18"),
    (15, "19"),
    (15, "20"),
    (20, "22"),
    (20, "23"),
    (20, "24"),
    (25, "28"),
    (25, "29"),
    (25, "30"),
    (32, "34"),
    (32, "35"),
    (32, "36"),
    (40, "40"),
    (40, "41"),
    (40, "42"),
    (50, "52"),
    (50, "53"),
    (50, "54"),
    (65, "70"),
    (80, "85"),
    (100, "104"),
    (125, "129"),
    (150, "154"),
];
