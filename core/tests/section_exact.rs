//! Cross-sections against their exact analytical solutions.
//!
//! Values marked "mpmath" were evaluated at 40 digits with this snippet (mpmath 1.3):
//!
//! ```python
//! from mpmath import mp, tanh, pi, nsum, inf, ellipe, log
//! mp.dps = 40
//! rect = lambda al: 96/((1+al)**2*(1-192*al/pi**5*nsum(lambda k: tanh((2*k+1)*pi/(2*al))/(2*k+1)**5, [0, inf])))
//! ell = lambda a, b: 128*pi**2*(a*a+b*b)/(4*a*ellipe(1-(b/a)**2))**2
//! ann = lambda r: 64*(1-r)**2/((1+r**2)-(1-r**2)/log(1/r))
//! ```

// Reference values keep the digits the reference printed.
#![allow(clippy::excessive_precision)]

use hydrograde::section::{Section, TurbulentDiameter, ellipse_perimeter};
use hydrograde::warning::Warnings;
use proptest::prelude::*;
use std::f64::consts::PI;

mod common;
use common::rel_err as rel;

#[test]
fn circle_poiseuille() {
    // Exact: Hagen–Poiseuille, f = 64/Re; A = πd²/4, P = πd, D_h = d.
    let c = Section::circle(0.2).unwrap();
    assert_eq!(c.laminar_constant(), 64.0);
    assert_eq!(c.hydraulic_diameter(), 0.2);
    assert!(rel(c.area(), PI * 0.01) < 1e-15);
    assert!(rel(c.wetted_perimeter(), PI * 0.2) < 1e-15);
    assert!(c.is_circular());
    assert!(c.warnings().is_empty());
}

#[test]
fn annulus_closed_form() {
    // mpmath, 40 digits (closed form of Shah & London 1978; 95.25 at r = 0.5 there, from memory).
    for (r, want) in [
        (0.1, 89.371_842_723_987_76),
        (0.5, 95.250_160_636_451_04),
        (0.9, 95.982_248_980_699_69),
    ] {
        let s = Section::annulus(1.0, r).unwrap();
        assert!(
            rel(s.laminar_constant(), want) < 4e-15,
            "r={r}: {}",
            s.laminar_constant()
        );
        // Exact: D_h = D_o − D_i.
        assert!(rel(s.hydraulic_diameter(), 1.0 - r) < 1e-15);
        assert!(rel(4.0 * s.area() / s.wetted_perimeter(), 1.0 - r) < 1e-14);
    }
}

#[test]
fn annulus_tends_to_parallel_plates() {
    // Exact limit: plane Poiseuille flow between parallel plates, f·Re = 96 on D_h = 2 gap;
    // the series of the closed form gives 96 (1 − x²/60 …) for x = ln(D_o/D_i).
    for gap in [1e-2, 1e-4, 1e-6, 1e-9] {
        let s = Section::annulus(1.0, 1.0 - gap).unwrap();
        let c = s.laminar_constant();
        assert!(
            (c - 96.0).abs() < 96.0 * gap * gap + 1e-12,
            "gap={gap}: {c}"
        );
        assert!(c <= 96.0);
    }
}

#[test]
fn annulus_tends_to_circle_slowly() {
    // Exact limit: a vanishing core rod leaves a circle, 64, but only logarithmically
    // (the ln(1/r) term): at r = 1e-12 the constant is still near 64·(1 + 1/ln r).
    let c = Section::annulus(1.0, 1e-12).unwrap().laminar_constant();
    let r: f64 = 1e-12;
    let want = 64.0 * (1.0 - r).powi(2) / (1.0 + r * r - (1.0 - r * r) / (1.0 / r).ln());
    assert!(rel(c, want) < 1e-14 && c > 64.0, "{c}");
}

#[test]
fn rectangle_series() {
    // mpmath, 40 digits (series of Shah & London 1978; square 56.91, 1:2 62.19, 1:4 72.93,
    // 1:8 82.34 in their table, from memory).
    for (alpha, want) in [
        (1.0, 56.908_307_539_124_56),
        (0.5, 62.192_224_586_431_78),
        (0.25, 72.931_107_322_906_19),
        (0.125, 82.338_576_245_920_39),
        (0.1, 84.675_507_308_181_12),
    ] {
        let s = Section::rectangle(1.0, alpha).unwrap();
        assert!(
            rel(s.laminar_constant(), want) < 4e-15,
            "α={alpha}: {}",
            s.laminar_constant()
        );
        // Exact: the constant does not depend on which side is called the width.
        let t = Section::rectangle(alpha, 1.0).unwrap();
        assert_eq!(t.laminar_constant(), s.laminar_constant());
        // Exact: D_h = 2wh/(w+h).
        assert!(rel(s.hydraulic_diameter(), 2.0 * alpha / (1.0 + alpha)) < 1e-15);
    }
}

#[test]
fn rectangle_series_against_brute_force() {
    // Exact series summed term by term (no ζ(5) identity) to n = 400 001 plus the
    // integral of the tail, ∫ dn/(2n⁵) = 1/(8N⁴): independent check of the fast form.
    for alpha in [1.0, 0.7, 0.3] {
        let mut sum = 0.0;
        let mut n = 400_001.0f64;
        while n >= 1.0 {
            sum += (n * PI / (2.0 * alpha)).tanh() / n.powi(5);
            n -= 2.0;
        }
        sum += 1.0 / (8.0 * 400_002.0f64.powi(4));
        let want =
            96.0 / ((1.0 + alpha) * (1.0 + alpha) * (1.0 - 192.0 * alpha / PI.powi(5) * sum));
        let got = Section::rectangle(1.0, alpha).unwrap().laminar_constant();
        assert!(rel(got, want) < 1e-14, "α={alpha}: {got} vs {want}");
    }
}

#[test]
fn rectangle_tends_to_parallel_plates() {
    // Exact limit: α → 0 gives plane Poiseuille flow, 96, with C ≈ 96 (1 − 2α + …).
    for alpha in [1e-3, 1e-6, 1e-9] {
        let c = Section::rectangle(1.0, alpha).unwrap().laminar_constant();
        assert!((c - 96.0).abs() < 96.0 * 2.0 * alpha, "α={alpha}: {c}");
    }
}

#[test]
fn ellipse_closed_form() {
    // mpmath, 40 digits, with the complete elliptic integral E (Shah & London 1978 list
    // 67.29 at b/a = 0.5, from memory).
    for (ratio, want) in [
        (0.5, 67.293_214_480_505_53),
        (0.25, 72.959_836_876_700_80),
        (0.1, 77.255_464_613_003_20),
    ] {
        let s = Section::ellipse(2.0, 2.0 * ratio).unwrap();
        assert!(
            rel(s.laminar_constant(), want) < 4e-15,
            "b/a={ratio}: {}",
            s.laminar_constant()
        );
    }
    // Exact: equal axes give the circle.
    let c = Section::ellipse(0.3, 0.3).unwrap();
    assert!(rel(c.laminar_constant(), 64.0) < 1e-15);
    assert!(rel(c.hydraulic_diameter(), 0.3) < 1e-15);
    // Exact limit b/a → 0: P → 4a, f·Re → 8π² (the Poiseuille slot between two parabolas).
    let thin = Section::ellipse(1.0, 1e-9).unwrap();
    assert!(rel(thin.laminar_constant(), 8.0 * PI * PI) < 1e-8);
}

#[test]
fn ellipse_perimeter_against_quadrature() {
    // Exact: P = ∫₀^{2π} √(a² sin²θ + b² cos²θ) dθ; the trapezoid rule on a periodic
    // analytic integrand converges geometrically, so 4000 points are exact to rounding.
    for (a, b) in [(1.0, 1.0), (1.0, 0.8), (3.0, 1.0), (1.0, 0.1), (2.0, 0.02)] {
        let n = 4000;
        let h = 2.0 * PI / f64::from(n);
        let p: f64 = (0..n)
            .map(|i| {
                let t = f64::from(i) * h;
                (a * a * t.sin().powi(2) + b * b * t.cos().powi(2)).sqrt()
            })
            .sum::<f64>()
            * h;
        let got = ellipse_perimeter(a, b);
        assert!(rel(got, p) < 1e-13, "a={a} b={b}: {got} vs {p}");
    }
}

#[test]
fn equilateral_triangle() {
    // Exact: Saint-Venant / Boussinesq solution, f·Re = 160/3; A = √3 s²/4, D_h = s/√3.
    let t = Section::triangle(0.3).unwrap();
    assert_eq!(t.laminar_constant(), 160.0 / 3.0);
    assert!(rel(t.area(), 3f64.sqrt() / 4.0 * 0.09) < 1e-15);
    assert!(rel(t.hydraulic_diameter(), 0.3 / 3f64.sqrt()) < 1e-15);
    assert!(
        rel(
            4.0 * t.area() / t.wetted_perimeter(),
            t.hydraulic_diameter()
        ) < 1e-15
    );
}

#[test]
fn custom_section_passes_its_numbers_through() {
    // Exact: a 1 m × 1 m square typed by hand, C from the square above.
    let s = Section::custom(1.0, 4.0, 56.908).unwrap();
    assert_eq!(s.area(), 1.0);
    assert_eq!(s.wetted_perimeter(), 4.0);
    assert_eq!(s.hydraulic_diameter(), 1.0);
    assert_eq!(s.laminar_constant(), 56.908);
    assert_eq!(
        s.turbulent_diameter(TurbulentDiameter::LaminarEquivalent),
        1.0
    );
    assert_eq!(s.warnings(), Warnings::NON_CIRCULAR_SECTION);
}

#[test]
fn laminar_equivalent_diameter() {
    // Jones (1976): D_le = (64/C)·D_h; for the square 64/56.908… = 1.1246 (exact from the
    // constant above).
    let sq = Section::rectangle(1.0, 1.0).unwrap();
    let d = sq.turbulent_diameter(TurbulentDiameter::LaminarEquivalent);
    assert!(rel(d, 64.0 / 56.908_307_539_124_56) < 1e-15);
    assert_eq!(sq.turbulent_diameter(TurbulentDiameter::Hydraulic), 1.0);
    // Jones & Leung (1981) for annuli: same rule, D_le = (64/C)(D_o − D_i).
    let an = Section::annulus(1.0, 0.5).unwrap();
    let d = an.turbulent_diameter(TurbulentDiameter::LaminarEquivalent);
    assert!(rel(d, 64.0 / 95.250_160_636_451_04 * 0.5) < 1e-15);
    // Other shapes keep D_h.
    let tri = Section::triangle(1.0).unwrap();
    assert_eq!(
        tri.turbulent_diameter(TurbulentDiameter::LaminarEquivalent),
        tri.hydraulic_diameter()
    );
}

#[test]
fn sections_round_trip_through_serde() {
    for s in [
        Section::circle(0.1).unwrap(),
        Section::annulus(0.1, 0.05).unwrap(),
        Section::ellipse(0.2, 0.1).unwrap(),
    ] {
        let back: Section = serde_json::from_str(&serde_json::to_string(&s).unwrap()).unwrap();
        assert_eq!(back, s);
    }
}

proptest! {
    #[test]
    fn circle_hydraulic_diameter_is_its_diameter(d in 1e-6f64..1e3) {
        // Exact: 4A/P = d for a circle.
        let c = Section::circle(d).unwrap();
        prop_assert_eq!(c.hydraulic_diameter(), d);
        prop_assert!(rel(4.0 * c.area() / c.wetted_perimeter(), d) < 1e-15);
    }

    #[test]
    fn rectangle_constant_falls_towards_the_square(a in 1e-4f64..1.0, da in 1e-4f64..0.5) {
        // Exact solution is monotonic: 96 for plates down to 56.908 for the square.
        let b = (a + da).min(1.0);
        prop_assume!(b > a);
        let ca = Section::rectangle(1.0, a).unwrap().laminar_constant();
        let cb = Section::rectangle(1.0, b).unwrap().laminar_constant();
        prop_assert!(cb < ca);
        prop_assert!(ca < 96.0 && cb >= 56.9);
    }

    #[test]
    fn annulus_constant_rises_towards_plates(r in 1e-6f64..0.999, dr in 1e-4f64..0.5) {
        // Exact solution is monotonic in r = D_i/D_o: from 64 (r → 0) to 96 (r → 1).
        let s = (r + dr).min(0.9999);
        prop_assume!(s > r);
        let cr = Section::annulus(1.0, r).unwrap().laminar_constant();
        let cs = Section::annulus(1.0, s).unwrap().laminar_constant();
        prop_assert!(cs > cr);
        prop_assert!(cr > 64.0 && cs < 96.0);
    }

    #[test]
    fn ellipse_constant_falls_towards_the_circle(q in 1e-4f64..1.0, dq in 1e-4f64..0.5) {
        // Exact solution is monotonic in b/a: from 8π² (slot) to 64 (circle).
        let p = (q + dq).min(1.0);
        prop_assume!(p > q);
        let cq = Section::ellipse(1.0, q).unwrap().laminar_constant();
        let cp = Section::ellipse(1.0, p).unwrap().laminar_constant();
        prop_assert!(cp < cq);
        prop_assert!(cq < 8.0 * PI * PI && cp > 64.0 - 1e-12);
    }

    #[test]
    fn shapes_scale(k in 1e-3f64..1e3, a in 0.05f64..1.0) {
        // Exact: C is dimensionless (size-independent); D_h scales with length, A with its square.
        for (s1, s2) in [
            (Section::rectangle(1.0, a).unwrap(), Section::rectangle(k, k * a).unwrap()),
            (Section::annulus(1.0, a * 0.99).unwrap(), Section::annulus(k, k * a * 0.99).unwrap()),
            (Section::ellipse(1.0, a).unwrap(), Section::ellipse(k, k * a).unwrap()),
        ] {
            prop_assert!(rel(s2.laminar_constant(), s1.laminar_constant()) < 1e-13);
            prop_assert!(rel(s2.hydraulic_diameter(), k * s1.hydraulic_diameter()) < 1e-13);
            prop_assert!(rel(s2.area(), k * k * s1.area()) < 1e-13);
            prop_assert!(rel(s2.hydraulic_diameter(), 4.0 * s2.area() / s2.wetted_perimeter()) < 1e-13);
        }
    }
}
