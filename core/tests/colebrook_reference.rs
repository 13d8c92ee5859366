//! Exact Colebrook against a 40-digit mpmath solution at 2550 points
//! (tests/reference/colebrook/colebrook.csv, written by generate.py beside it).

mod common;

use hydrograde::friction::{Correlation, Options, Transition, darcy_factor};

#[test]
fn colebrook_within_4_ulp_of_mpmath_40_digits() {
    // Reference: mpmath at 50 working digits, printed to 40 (generate.py).
    let rows = common::read_csv("colebrook/colebrook.csv");
    assert!(rows.len() >= 2000, "only {} rows", rows.len());
    // The transitional band is solved by the same solver when asked for the turbulent value.
    let opts = Options {
        correlation: Correlation::Colebrook,
        transition: Transition::Turbulent,
        ..Options::default()
    };
    let mut worst = (0u64, 0.0, 0.0);
    let mut hist = [0usize; 6];
    for r in &rows {
        let (re, rr, f_ref) = (r[0], r[1], r[2]);
        let f = darcy_factor(re, rr, &opts).unwrap().f;
        let d = common::ulp_distance(f, f_ref);
        hist[(d as usize).min(5)] += 1;
        if d > worst.0 {
            worst = (d, re, rr);
        }
    }
    println!(
        "ulp histogram 0,1,2,3,4,5+: {hist:?}; worst {} ulp at Re {} eps/D {}",
        worst.0, worst.1, worst.2
    );
    assert!(
        worst.0 <= 4,
        "worst {} ulp at Re {} eps/D {}",
        worst.0,
        worst.1,
        worst.2
    );
}
