//! Standard pipe sizes: arithmetic of every row, printed values, lookups.

use hydrograde::ErrorKind;
use hydrograde::sizes::{PipeTable, lookup, smallest_at_least};

const INCH: f64 = 0.0254;

#[test]
fn inside_diameter_is_outside_minus_two_walls_on_every_row() {
    // Exact geometry: ID = OD − 2·wall.
    let mut rows = 0;
    for t in PipeTable::ALL {
        for p in t.sizes() {
            let id = p.outside_diameter - 2.0 * p.wall;
            assert!(
                (p.inside_diameter - id).abs() <= 4.0 * f64::EPSILON * p.outside_diameter,
                "{t} {} {}",
                p.nominal,
                p.schedule
            );
            assert!(p.wall > 0.0 && p.inside_diameter > 0.0);
            assert!(
                p.wall < 0.3 * p.outside_diameter,
                "{t} {} {}",
                p.nominal,
                p.schedule
            );
            rows += 1;
        }
    }
    assert!(rows > 250, "{rows}");
}

#[test]
fn printed_inside_diameters() {
    // Inside diameters in inches as printed in the standards' tables (from memory).
    let cases = [
        // ASME B36.10M
        (PipeTable::Steel, "2", "40", 2.067),
        (PipeTable::Steel, "4", "40", 4.026),
        (PipeTable::Steel, "6", "40", 6.065),
        (PipeTable::Steel, "8", "40", 7.981),
        (PipeTable::Steel, "3/4", "40", 0.824),
        (PipeTable::Steel, "1/2", "80", 0.546),
        (PipeTable::Steel, "1", "80", 0.957),
        (PipeTable::Steel, "12", "STD", 12.000),
        (PipeTable::Steel, "24", "XS", 23.000),
        // ASME B36.19M
        (PipeTable::Stainless, "2", "10S", 2.157),
        (PipeTable::Stainless, "4", "10S", 4.260),
        // ASTM B88
        (PipeTable::Copper, "1", "L", 1.025),
        (PipeTable::Copper, "3/4", "K", 0.745),
        (PipeTable::Copper, "1/2", "M", 0.569),
        (PipeTable::Copper, "2", "L", 1.985),
        // ASTM D1785: from the mean wall, minimum wall + tolerance/2 with the tolerance
        // 12 % of the minimum wall, at least 0.020 in (ASTM D1785, checked against a
        // published copy): NPS 2 sch 80 2.375 − 2·(0.218 + 0.013) = 1.913 in; NPS 4
        // sch 40 4.500 − 2·(0.237 + 0.014) = 3.998 in.
        (PipeTable::Pvc, "2", "80", 1.913),
        (PipeTable::Pvc, "4", "40", 3.998),
    ];
    for (t, nominal, schedule, id_in) in cases {
        let p = lookup(t, nominal, schedule).unwrap();
        assert!(
            (p.inside_diameter - id_in * INCH).abs() < 1e-12,
            "{t} {nominal} {schedule}: {} in",
            p.inside_diameter / INCH
        );
    }
}

#[test]
fn outside_diameters_follow_the_nominal_size() {
    // Common practice: from NPS 14 up the steel OD equals the nominal size; copper tube
    // OD is the standard size + 1/8 in (ASTM B88, from memory).
    for p in PipeTable::Steel.sizes() {
        let n: f64 = p.nominal.parse().unwrap_or(0.0);
        if n >= 14.0 {
            assert_eq!(p.outside_diameter, n * INCH);
        }
    }
    let c = lookup(PipeTable::Copper, "1-1/2", "K").unwrap();
    assert!((c.outside_diameter - 1.625 * INCH).abs() < 1e-15);
    for t in PipeTable::ALL {
        let ods: Vec<f64> = t
            .nominal_sizes()
            .iter()
            .map(|n| {
                let s = t
                    .schedules()
                    .iter()
                    .find_map(|s| lookup(t, n, s).ok())
                    .unwrap();
                s.outside_diameter
            })
            .collect();
        assert!(ods.windows(2).all(|w| w[0] < w[1]), "{t}");
    }
}

#[test]
fn heavier_schedules_have_thicker_walls() {
    // Common practice: within one size, 10 < 40 < 80 and STD ≤ XS; 5S < 10S < 40S < 80S;
    // K > L > M. Schedule 40 is STD up to NPS 10 and 80 is XS up to NPS 8.
    for t in PipeTable::ALL {
        let order: &[&str] = match t {
            PipeTable::Steel => &["10", "40", "80"],
            PipeTable::Stainless => &["5S", "10S", "40S", "80S"],
            PipeTable::Copper => &["M", "L", "K"],
            PipeTable::Pvc => &["40", "80"],
            PipeTable::PeIso4427 | PipeTable::PvcIso1452 => t.schedules(),
            // Wall-series and single-wall tables: the schedule is the wall itself.
            _ => &[],
        };
        for n in t.nominal_sizes() {
            let walls: Vec<f64> = order
                .iter()
                .filter_map(|s| lookup(t, n, s).ok().map(|p| p.wall))
                .collect();
            assert!(walls.windows(2).all(|w| w[0] < w[1]), "{t} {n}: {walls:?}");
        }
    }
    for n in PipeTable::Steel.nominal_sizes() {
        let std = lookup(PipeTable::Steel, n, "STD").unwrap();
        let xs = lookup(PipeTable::Steel, n, "XS").unwrap();
        assert!(std.wall < xs.wall);
        let size: f64 = match n.split_once('/') {
            Some(_) => 0.5,
            None => n.split('-').next().unwrap().parse().unwrap(),
        };
        if size <= 10.0 {
            assert_eq!(
                lookup(PipeTable::Steel, n, "40").unwrap().wall,
                std.wall,
                "{n}"
            );
        }
        if size <= 8.0 {
            assert_eq!(
                lookup(PipeTable::Steel, n, "80").unwrap().wall,
                xs.wall,
                "{n}"
            );
        }
    }
}

#[test]
fn lookups_accept_usual_spellings() {
    let a = lookup(PipeTable::Steel, "1-1/2", "STD").unwrap();
    assert_eq!(lookup(PipeTable::Steel, "1 1/2", "std").unwrap(), a);
    assert_eq!(lookup(PipeTable::Steel, "1.5", " Std ").unwrap(), a);
    assert_eq!(a.nominal, "1-1/2");
    assert_eq!(a.schedule, "STD");
    assert_eq!(
        lookup(PipeTable::Stainless, "2", "10s").unwrap().schedule,
        "10S"
    );
    assert_eq!("copper".parse::<PipeTable>().unwrap(), PipeTable::Copper);
}

#[test]
fn lookup_errors_name_what_is_known() {
    let e = lookup(PipeTable::Steel, "7", "40").unwrap_err();
    assert_eq!(e.kind(), ErrorKind::UnknownName);
    assert!(e.to_string().contains("1-1/2"), "{e}");
    let e = lookup(PipeTable::Steel, "2", "160").unwrap_err();
    assert!(e.to_string().contains("STD"), "{e}");
    // NPS 22 has no schedule 40 in B36.10M (from memory).
    let e = lookup(PipeTable::Steel, "22", "40").unwrap_err();
    assert!(e.to_string().contains("80"), "{e}");
    assert!(lookup(PipeTable::Copper, "1/4", "M").is_err());
    assert!("iron".parse::<PipeTable>().is_err());
}

#[test]
fn smallest_size_with_enough_bore() {
    // 50 mm bore in schedule 40: NPS 1-1/2 has 1.610 in = 40.9 mm, NPS 2 has 2.067 in =
    // 52.5 mm (ASME B36.10M, from memory).
    let p = smallest_at_least(PipeTable::Steel, "40", 0.050).unwrap();
    assert_eq!(p.nominal, "2");
    // Exactly the bore of NPS 2 still picks NPS 2.
    let p = smallest_at_least(PipeTable::Steel, "40", 2.067 * INCH).unwrap();
    assert_eq!(p.nominal, "2");
    // 20 mm bore in type L: 3/4 has 0.785 in = 19.94 mm, just short; 1 has 1.025 in
    // (ASTM B88, from memory).
    let p = smallest_at_least(PipeTable::Copper, "L", 0.020).unwrap();
    assert_eq!(p.nominal, "1");
    // Every answer is the smallest that fits (exact by exhaustion).
    for t in PipeTable::ALL {
        for s in t.schedules() {
            for d in [0.005, 0.013, 0.021, 0.1, 0.3] {
                if let Ok(p) = smallest_at_least(t, s, d) {
                    assert!(p.inside_diameter >= d);
                    for q in t.sizes().iter().filter(|q| q.schedule == *s) {
                        assert!(q.inside_diameter < d || q.inside_diameter >= p.inside_diameter);
                    }
                }
            }
        }
    }
    let e = smallest_at_least(PipeTable::Pvc, "80", 1.0).unwrap_err();
    assert!(e.to_string().starts_with("min_inside_diameter = 1"), "{e}");
    assert!(smallest_at_least(PipeTable::Pvc, "80", -1.0).is_err());
    assert!(smallest_at_least(PipeTable::Pvc, "XS", 0.1).is_err());
}

#[test]
fn sizes_round_trip_through_serde() {
    let p = lookup(PipeTable::Pvc, "3", "80").unwrap();
    let back = serde_json::from_str(&serde_json::to_string(&p).unwrap()).unwrap();
    assert_eq!(p, back);
}
