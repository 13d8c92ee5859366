//! Plastic pressure pipe by SDR: minimum walls as ISO 4427-2 (PE) and ISO 1452-2 (PVC-U)
//! print them, in mm, and the mean wall each standard's tolerance implies.
//!
//! The rows were written by tests/reference/sizes/iso4065_walls.py from ISO 4065's rule
//! (e_min = dn / (2 S + 1), S the exact preferred number of the series, rounded up to
//! 0.1 mm; from memory); core/tests/sizes_metric.rs checks entries against published
//! copies of the tables and lists where. A wall of 0.0 means the standard lists no such
//! pipe. Outside diameters are the nominal (minimum mean) outside diameters dn.

/// Series of [`PE`], in column order (thinnest wall first).
pub const PE_SCHEDULES: [&str; 6] = ["SDR 33", "SDR 26", "SDR 21", "SDR 17", "SDR 13.6", "SDR 11"];

/// PE pressure pipe, ISO 4427-2 (and EN 12201-2, which prints the same walls): minimum
/// wall e_min in mm by SDR, dn 20 to 630. Small sizes take at least 2.0 mm; 32 SDR 11 is
/// 3.0 mm as printed.
pub const PE: [(&str, f64, [f64; 6]); 24] = [
    ("20", 20.0, [0.0, 0.0, 0.0, 0.0, 0.0, 2.0]),
    ("25", 25.0, [0.0, 0.0, 0.0, 0.0, 2.0, 2.3]),
    ("32", 32.0, [0.0, 0.0, 0.0, 2.0, 2.4, 3.0]),
    ("40", 40.0, [0.0, 0.0, 2.0, 2.4, 3.0, 3.7]),
    ("50", 50.0, [0.0, 2.0, 2.4, 3.0, 3.7, 4.6]),
    ("63", 63.0, [2.0, 2.5, 3.0, 3.8, 4.7, 5.8]),
    ("75", 75.0, [2.3, 2.9, 3.6, 4.5, 5.6, 6.8]),
    ("90", 90.0, [2.8, 3.5, 4.3, 5.4, 6.7, 8.2]),
    ("110", 110.0, [3.4, 4.2, 5.3, 6.6, 8.1, 10.0]),
    ("125", 125.0, [3.9, 4.8, 6.0, 7.4, 9.2, 11.4]),
    ("140", 140.0, [4.3, 5.4, 6.7, 8.3, 10.3, 12.7]),
    ("160", 160.0, [4.9, 6.2, 7.7, 9.5, 11.8, 14.6]),
    ("180", 180.0, [5.5, 6.9, 8.6, 10.7, 13.3, 16.4]),
    ("200", 200.0, [6.2, 7.7, 9.6, 11.9, 14.7, 18.2]),
    ("225", 225.0, [6.9, 8.6, 10.8, 13.4, 16.6, 20.5]),
    ("250", 250.0, [7.7, 9.6, 11.9, 14.8, 18.4, 22.7]),
    ("280", 280.0, [8.6, 10.7, 13.4, 16.6, 20.6, 25.4]),
    ("315", 315.0, [9.7, 12.1, 15.0, 18.7, 23.2, 28.6]),
    ("355", 355.0, [10.9, 13.6, 16.9, 21.1, 26.1, 32.2]),
    ("400", 400.0, [12.3, 15.3, 19.1, 23.7, 29.4, 36.3]),
    ("450", 450.0, [13.8, 17.2, 21.5, 26.7, 33.1, 40.9]),
    ("500", 500.0, [15.3, 19.1, 23.9, 29.7, 36.8, 45.4]),
    ("560", 560.0, [17.2, 21.4, 26.7, 33.2, 41.2, 50.8]),
    ("630", 630.0, [19.3, 24.1, 30.0, 37.4, 46.3, 57.2]),
];

/// Series of [`PVC_U`], in column order (thinnest wall first).
pub const PVC_U_SCHEDULES: [&str; 7] = [
    "SDR 41", "SDR 33", "SDR 26", "SDR 21", "SDR 17", "SDR 13.6", "SDR 11",
];

/// PVC-U pressure pipe, ISO 1452-2 (and EN 1452-2): minimum wall e_min in mm by SDR
/// (pipe series S = (SDR − 1)/2), dn 20 to 630 (from memory). Cells under 1.5 mm are
/// left out.
pub const PVC_U: [(&str, f64, [f64; 7]); 24] = [
    ("20", 20.0, [0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 1.9]),
    ("25", 25.0, [0.0, 0.0, 0.0, 0.0, 0.0, 1.9, 2.3]),
    ("32", 32.0, [0.0, 0.0, 0.0, 1.6, 1.9, 2.4, 2.9]),
    ("40", 40.0, [0.0, 0.0, 1.6, 1.9, 2.4, 3.0, 3.7]),
    ("50", 50.0, [0.0, 1.6, 2.0, 2.4, 3.0, 3.7, 4.6]),
    ("63", 63.0, [1.6, 2.0, 2.5, 3.0, 3.8, 4.7, 5.8]),
    ("75", 75.0, [1.9, 2.3, 2.9, 3.6, 4.5, 5.6, 6.8]),
    ("90", 90.0, [2.2, 2.8, 3.5, 4.3, 5.4, 6.7, 8.2]),
    ("110", 110.0, [2.7, 3.4, 4.2, 5.3, 6.6, 8.1, 10.0]),
    ("125", 125.0, [3.1, 3.9, 4.8, 6.0, 7.4, 9.2, 11.4]),
    ("140", 140.0, [3.5, 4.3, 5.4, 6.7, 8.3, 10.3, 12.7]),
    ("160", 160.0, [4.0, 4.9, 6.2, 7.7, 9.5, 11.8, 14.6]),
    ("180", 180.0, [4.4, 5.5, 6.9, 8.6, 10.7, 13.3, 16.4]),
    ("200", 200.0, [4.9, 6.2, 7.7, 9.6, 11.9, 14.7, 18.2]),
    ("225", 225.0, [5.5, 6.9, 8.6, 10.8, 13.4, 16.6, 20.5]),
    ("250", 250.0, [6.2, 7.7, 9.6, 11.9, 14.8, 18.4, 22.7]),
    ("280", 280.0, [6.9, 8.6, 10.7, 13.4, 16.6, 20.6, 25.4]),
    ("315", 315.0, [7.7, 9.7, 12.1, 15.0, 18.7, 23.2, 28.6]),
    ("355", 355.0, [8.7, 10.9, 13.6, 16.9, 21.1, 26.1, 32.2]),
    ("400", 400.0, [9.8, 12.3, 15.3, 19.1, 23.7, 29.4, 36.3]),
    ("450", 450.0, [11.0, 13.8, 17.2, 21.5, 26.7, 33.1, 40.9]),
    ("500", 500.0, [12.3, 15.3, 19.1, 23.9, 29.7, 36.8, 45.4]),
    ("560", 560.0, [13.7, 17.2, 21.4, 26.7, 33.2, 41.2, 50.8]),
    ("630", 630.0, [15.4, 19.3, 24.1, 30.0, 37.4, 46.3, 57.2]),
];

/// The wall tolerance a plastic pipe standard allows above its minimum wall, and so the
/// mean wall: e_mean = e_min + tolerance / 2 (the midpoint of the allowed band; real
/// pipe is extruded close to it, so the bore is neither the largest nor the smallest the
/// standard allows).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum WallTolerance {
    /// ISO 11922-1 grade V, as ISO 4427-2 applies it: 0.1 e_min + 0.1 mm, rounded up to
    /// 0.1 mm (checked against the e_max column of published copies of the table).
    GradeV,
    /// ISO 1452-2: 0.1 e_min + 0.2 mm, rounded up to 0.1 mm (from memory).
    Pvc,
    /// ASTM D1785: 12 % of the minimum wall, at least 0.020 in, to 0.001 in (checked
    /// against the minimum and maximum walls of a published copy of the table).
    D1785,
}

impl WallTolerance {
    /// The mean wall for a printed minimum wall `e_min` (mm for the ISO rules, in for
    /// D1785). Works in whole tenths (thousandths) of the printed unit, where the rules'
    /// rounding is exact.
    pub(crate) fn mean_wall(self, e_min: f64) -> f64 {
        match self {
            WallTolerance::GradeV | WallTolerance::Pvc => {
                let tenths = (e_min * 10.0).round() as i64;
                let extra = if self == WallTolerance::GradeV { 1 } else { 2 };
                // ceil(0.1 e + c) in tenths of a mm = ceil(tenths / 10) + c·10.
                let tol = (tenths + 9) / 10 + extra;
                (2 * tenths + tol) as f64 / 20.0
            }
            WallTolerance::D1785 => {
                let th = (e_min * 1000.0).round() as i64;
                let tol = ((12 * th + 50) / 100).max(20);
                (2 * th + tol) as f64 / 2000.0
            }
        }
    }

    /// How the rule reads, for documentation and the table listing.
    pub(crate) fn rule(self) -> &'static str {
        match self {
            WallTolerance::GradeV => {
                "mean wall = e_min + tolerance/2, tolerance 0.1·e_min + 0.1 mm rounded up to 0.1 mm (ISO 11922-1 grade V, as ISO 4427-2 applies it)"
            }
            WallTolerance::Pvc => {
                "mean wall = e_min + tolerance/2, tolerance 0.1·e_min + 0.2 mm rounded up to 0.1 mm (ISO 1452-2, from memory)"
            }
            WallTolerance::D1785 => {
                "mean wall = minimum wall + tolerance/2, tolerance 12 % of the minimum wall, at least 0.020 in, to 0.001 in (ASTM D1785)"
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn tolerance_rules_give_the_published_maximum_walls() {
        // e_max = e_min + tolerance, as printed in published copies of ISO 4427-2
        // (MS 1058-2:2005 table, a national adoption; and a PE100 maker's table):
        // 110 SDR 11 10.0/11.1, 63 SDR 11 5.8/6.5, 160 SDR 17 9.5/10.6, 20 SDR 11 2.0/2.3.
        for (e, emax) in [(10.0, 11.1), (5.8, 6.5), (9.5, 10.6), (2.0, 2.3)] {
            let mean = WallTolerance::GradeV.mean_wall(e);
            assert!((mean - (e + emax) / 2.0).abs() < 1e-12, "{e}");
        }
        // ASTM D1785-88 as printed in a published metric copy: 2 in schedule 40
        // 3.91/4.42 mm (0.154 in + 0.020 in), 4 in schedule 40 6.02/6.73 mm
        // (0.237 + 0.028 in), 8 in schedule 80 12.70/14.22 mm (0.500 + 0.060 in).
        for (w, tol) in [(0.154, 0.020), (0.237, 0.028), (0.500, 0.060)] {
            let mean = WallTolerance::D1785.mean_wall(w);
            assert!((mean - (w + tol / 2.0)).abs() < 1e-12, "{w}");
        }
        // ISO 1452-2, 110 SDR 26: 4.2 mm + 0.7 mm (from memory).
        assert!((WallTolerance::Pvc.mean_wall(4.2) - 4.55).abs() < 1e-12);
    }
}
