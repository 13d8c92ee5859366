//! Least-squares pump-curve fits: exact data from known polynomials (exact solutions),
//! noisy data against numpy.polyfit (reference library; tests/reference/pump_fit/
//! generate.py and reference.txt), degenerate data, and the operating point with a fit.

use hydrograde::ErrorKind;
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Line, PumpCurve};
use hydrograde::pipe::Pipe;

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn exact_quadratic_and_cubic_data_give_their_polynomials() {
    // H = 40 + 300 Q − 20000 Q² and H = 40 + 300 Q − 20000 Q² − 4e5 Q³ at 7 flows: the
    // least-squares fit of exact polynomial data is that polynomial (exact solution).
    let q: Vec<f64> = (0..7).map(|i| i as f64 * 0.005).collect();
    let quad = [40.0, 300.0, -20000.0];
    let cubic = [40.0, 300.0, -20000.0, -4e5];
    for (want, degree) in [(&quad[..], 2), (&cubic[..], 3)] {
        let h: Vec<f64> = q
            .iter()
            .map(|&x| want.iter().rev().fold(0.0, |acc, c| acc * x + c))
            .collect();
        let c = PumpCurve::fit(&q, &h, degree).unwrap();
        let f = c.fit_info().unwrap();
        assert_eq!(f.degree, degree);
        for (got, w) in f.coefficients.iter().zip(want) {
            assert!(rel(*got, *w) < 1e-11, "degree {degree}: {got} vs {w}");
        }
        assert!(f.rms_residual < 1e-12 && f.max_residual < 1e-12, "{f:?}");
        // The slope is the polynomial's derivative (exact): 300 − 40000 Q (− 1.2e6 Q²).
        let (_, d) = c.head(0.01).unwrap();
        let exact = 300.0 - 40000.0 * 0.01 - if degree == 3 { 1.2e6 * 1e-4 } else { 0.0 };
        assert!(rel(d, exact) < 1e-10, "{d} vs {exact}");
    }
    // A cubic fit of exact quadratic data has no cubic term (exact solution): its
    // contribution over the range stays at rounding level.
    let h: Vec<f64> = q
        .iter()
        .map(|&x| 40.0 + 300.0 * x - 20000.0 * x * x)
        .collect();
    let c3 = PumpCurve::fit(&q, &h, 3).unwrap();
    assert!((c3.fit_info().unwrap().coefficients[3] * 0.03f64.powi(3)).abs() < 1e-11);
    // Exactly degree + 1 points: the polynomial through them (exact solution).
    let c = PumpCurve::fit(&[0.0, 0.01, 0.02], &[30.0, 28.0, 22.0], 2).unwrap();
    // Through (0, 30), (0.01, 28), (0.02, 22): H = 30 − 0 Q − 20000 Q² → c1 = 0.
    let f = c.fit_info().unwrap();
    assert!(rel(f.coefficients[0], 30.0) < 1e-14 && f.coefficients[1].abs() < 1e-9);
    assert!(rel(f.coefficients[2], -20000.0) < 1e-12);
}

#[test]
fn noisy_data_matches_numpy_polyfit() {
    // tests/reference/pump_fit/reference.txt (numpy.polyfit, numpy 2.4).
    let flows = [
        0.0, 0.0015, 0.003, 0.0045, 0.006, 0.0075, 0.009, 0.0105, 0.012,
    ];
    let heads = [
        42.031,
        40.748,
        38.718,
        35.744,
        31.773,
        26.939,
        21.336000000000006,
        14.712,
        7.177,
    ];
    let cases: [(usize, &[f64], f64, f64); 2] = [
        (
            2,
            &[42.007199999999976, -503.00158730159, -199835.97883597834],
            0.036672914330642674,
            0.055066666666640174,
        ),
        (
            3,
            &[
                42.01417171717173,
                -513.0165143498383,
                -197622.7352894045,
                -122957.97480966414,
            ],
            0.036299096666323964,
            0.059396103896112606,
        ),
    ];
    for (degree, coefficients, rms, max) in cases {
        let c = PumpCurve::fit(&flows, &heads, degree).unwrap();
        let f = c.fit_info().unwrap();
        for (got, want) in f.coefficients.iter().zip(coefficients) {
            assert!(rel(*got, *want) < 1e-9, "degree {degree}: {got} vs {want}");
        }
        assert!(rel(f.rms_residual, rms) < 1e-9, "{}", f.rms_residual);
        assert!(rel(f.max_residual, max) < 1e-9, "{}", f.max_residual);
    }
}

#[test]
fn degenerate_data_is_refused_clearly() {
    let q = [0.0, 0.01, 0.02, 0.03];
    let h = [30.0, 29.0, 26.0, 20.0];
    let fail = |q: &[f64], h: &[f64], d: usize| PumpCurve::fit(q, h, d).unwrap_err();
    let e = fail(&q[..3], &h[..3], 3);
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(
        e.to_string()
            .contains("degree-3 fit needs at least 4 points, got 3"),
        "{e}"
    );
    let e = fail(&q, &h, 4);
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(e.to_string().starts_with("degree = 4"), "{e}");
    assert_eq!(fail(&q, &h, 1).kind(), ErrorKind::OutOfRange);
    let e = fail(&[0.0, 0.02, 0.01, 0.03], &h, 2);
    assert!(e.to_string().contains("must increase strictly"), "{e}");
    let e = fail(&q, &[30.0, f64::NAN, 26.0, 20.0], 2);
    assert_eq!(e.kind(), ErrorKind::NotFinite);
    assert!(e.to_string().contains("element 1"), "{e}");
    assert_eq!(fail(&q, &h[..3], 2).kind(), ErrorKind::Invalid);
    assert_eq!(
        fail(&[0.0, 0.01, f64::INFINITY], &h[..3], 2).kind(),
        ErrorKind::NotFinite
    );
    // Rising heads are measured data, not an error, for a fit.
    assert!(PumpCurve::fit(&q, &[30.0, 30.5, 26.0, 20.0], 2).is_ok());
}

#[test]
fn operating_point_works_with_a_fit() {
    let water = Fluid::water(293.15, 101_325.0).unwrap();
    let line = Line::new(vec![
        Element::Pipe(Pipe::circular(0.08, 150.0, 4.5e-5).unwrap()),
        Element::rise(12.0).unwrap(),
    ])
    .unwrap();
    // Points on H = 40 − 20000 Q² (invented pump).
    let q: Vec<f64> = (0..7).map(|i| i as f64 * 0.005).collect();
    let h: Vec<f64> = q.iter().map(|&x| 40.0 - 20000.0 * x * x).collect();
    let fit = PumpCurve::fit(&q, &h, 2).unwrap();
    let op = line.operating_point(&water, &fit).unwrap();
    // At the operating point the pump's head is the line's required head (definition).
    let (need, _) = line.required_head(&water, op.flow).unwrap();
    assert!(
        (need - op.head).abs() < 1e-9 * op.head,
        "{need} vs {}",
        op.head
    );
    assert!((op.head - (40.0 - 20000.0 * op.flow * op.flow)).abs() < 1e-10);
    // The monotone cubic through the same points is within 0.1 % of the parabola there.
    let through = PumpCurve::new(&q, &h).unwrap();
    let op2 = line.operating_point(&water, &through).unwrap();
    assert!(rel(op2.flow, op.flow) < 1e-3, "{} vs {}", op2.flow, op.flow);
    assert!(through.fit_info().is_none());
}

#[test]
fn fitted_curves_round_trip_through_serde() {
    let q = [0.0, 0.01, 0.02, 0.03];
    let c = PumpCurve::fit(&q, &[30.0, 29.0, 26.0, 20.1], 3).unwrap();
    let text = serde_json::to_string(&c).unwrap();
    assert!(
        text.contains("\"degree\":3") && !text.contains("coefficients"),
        "{text}"
    );
    let back: PumpCurve = serde_json::from_str(&text).unwrap();
    assert_eq!(back, c);
    let bad = r#"{"flows":[0.0,0.01,0.02],"heads":[30.0,29.0,26.0],"degree":3}"#;
    assert!(serde_json::from_str::<PumpCurve>(bad).is_err());
}
