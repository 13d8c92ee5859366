//! The strided batch equals the scalar friction factor bit for bit (exact: the same
//! kernel per point) over broadcast, reversed and sliced views, and refuses views that
//! do not fit.

use hydrograde::ErrorKind;
use hydrograde::friction::{
    Correlation, Options, Strided, darcy_factor, darcy_factor_batch, darcy_factor_batch_strided,
};

fn logspace(a: f64, b: f64, n: usize) -> Vec<f64> {
    (0..n)
        .map(|i| 10f64.powf(a + (b - a) * i as f64 / (n - 1).max(1) as f64))
        .collect()
}

#[test]
fn broadcast_tables_equal_the_scalar_bit_for_bit() {
    // 300 Reynolds numbers (laminar to 1e8) against 70 roughnesses, big enough to take
    // the threads and the vector kernel.
    let re = logspace(2.5, 8.0, 300);
    let rr = logspace(-6.0, -1.5, 70);
    for opts in [
        Options::default(),
        Options {
            correlation: Correlation::Haaland,
            ..Options::default()
        },
    ] {
        let mut out = vec![0.0; 300 * 70];
        let a = Strided {
            data: &re,
            offset: 0,
            strides: &[1, 0],
        };
        let b = Strided {
            data: &rr,
            offset: 0,
            strides: &[0, 1],
        };
        darcy_factor_batch_strided(&a, &b, &[300, 70], &opts, &mut out).unwrap();
        // The same points as full arrays through the contiguous batch.
        let full_re: Vec<f64> = (0..300 * 70).map(|i| re[i / 70]).collect();
        let full_rr: Vec<f64> = (0..300 * 70).map(|i| rr[i % 70]).collect();
        let mut full = vec![0.0; 300 * 70];
        darcy_factor_batch(&full_re, &full_rr, &opts, &mut full).unwrap();
        for i in 0..out.len() {
            let s = darcy_factor(re[i / 70], rr[i % 70], &opts).unwrap().f;
            assert_eq!(out[i].to_bits(), s.to_bits(), "point {i}");
            assert_eq!(full[i].to_bits(), s.to_bits(), "point {i}");
        }
    }
}

#[test]
fn reversed_sliced_and_three_axis_views() {
    let re = logspace(3.0, 7.0, 24);
    let rr = logspace(-5.0, -2.0, 10);
    let opts = Options::default();
    // re reversed along axis 0 (offset at its last element, stride −1), rr every second
    // value along axis 2, a middle axis of 3 broadcast from both: shape (24, 3, 5).
    let a = Strided {
        data: &re,
        offset: 23,
        strides: &[-1, 0, 0],
    };
    let b = Strided {
        data: &rr,
        offset: 0,
        strides: &[0, 0, 2],
    };
    let mut out = vec![0.0; 24 * 3 * 5];
    darcy_factor_batch_strided(&a, &b, &[24, 3, 5], &opts, &mut out).unwrap();
    for i in 0..24 {
        for j in 0..3 {
            for k in 0..5 {
                let s = darcy_factor(re[23 - i], rr[2 * k], &opts).unwrap().f;
                assert_eq!(out[(i * 3 + j) * 5 + k].to_bits(), s.to_bits());
            }
        }
    }
    // A scalar shape: one point.
    let mut one = [0.0];
    let c = Strided {
        data: &re[..1],
        offset: 0,
        strides: &[],
    };
    let d = Strided {
        data: &rr[..1],
        offset: 0,
        strides: &[],
    };
    darcy_factor_batch_strided(&c, &d, &[], &opts, &mut one).unwrap();
    assert_eq!(one[0], darcy_factor(re[0], rr[0], &opts).unwrap().f);
}

#[test]
fn views_that_do_not_fit_are_refused_and_bad_points_named_in_c_order() {
    let re = [1e4, 1e5, -1.0];
    let rr = [1e-4, 1e-3];
    let opts = Options::default();
    let mut out = vec![0.0; 6];
    let a = Strided {
        data: &re,
        offset: 0,
        strides: &[1, 0],
    };
    let b = Strided {
        data: &rr,
        offset: 0,
        strides: &[0, 1],
    };
    // re[2] = −1 is out of range: the first bad point in C order is flat index 4.
    let e = darcy_factor_batch_strided(&a, &b, &[3, 2], &opts, &mut out).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(e.to_string().starts_with("element 4:"), "{e}");
    let past = Strided {
        data: &rr,
        offset: 1,
        strides: &[0, 1],
    };
    let e = darcy_factor_batch_strided(&a, &past, &[3, 2], &opts, &mut out).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    let e = darcy_factor_batch_strided(&a, &b, &[3, 3], &opts, &mut out).unwrap_err();
    assert!(e.to_string().contains("out"), "{e}");
    let short = Strided {
        data: &rr,
        offset: 0,
        strides: &[1],
    };
    assert!(darcy_factor_batch_strided(&a, &short, &[3, 2], &opts, &mut out).is_err());
}
