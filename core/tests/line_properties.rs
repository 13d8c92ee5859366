//! Physics a Newton solver relies on, for random lines without check valves: required
//! head is continuous with a continuous derivative through zero flow and through the
//! laminar–turbulent transition, its derivative is the one returned, and it rises with
//! flow (every loss opposes the flow; exact for Darcy–Weisbach and K·V|V| terms).

use hydrograde::fitting::{Edge, Fitting};
use hydrograde::fluid::Fluid;
use hydrograde::line::{Element, Line};
use hydrograde::pipe::Pipe;
use proptest::prelude::*;
use std::f64::consts::PI;

/// A random route: a tank inlet or not, 1–3 pipes of possibly different bores (implied
/// abrupt changes between them), a K fitting, a rise and a tank outlet or not.
fn line() -> impl Strategy<Value = (Line, f64)> {
    (
        proptest::collection::vec((0.02f64..0.3, 1.0f64..200.0, 0.0f64..1e-3), 1..4),
        0.0f64..5.0,
        -10.0f64..10.0,
        any::<bool>(),
        any::<bool>(),
    )
        .prop_map(|(pipes, k, rise, inlet, outlet)| {
            let mut els = Vec::new();
            if inlet {
                els.push(Element::Fitting(Fitting::from_tank(Edge::Square).unwrap()));
            }
            let first = pipes[0].0;
            for (j, (d, l, e)) in pipes.into_iter().enumerate() {
                els.push(Element::Pipe(Pipe::circular(d, l, e).unwrap()));
                if j == 0 {
                    els.push(Element::Fitting(Fitting::k(k).unwrap()));
                    els.push(Element::rise(rise).unwrap());
                }
            }
            if outlet {
                els.push(Element::Fitting(Fitting::into_tank()));
            }
            (Line::new(els).unwrap(), first)
        })
}

fn head(line: &Line, fluid: &Fluid, q: f64) -> (f64, f64) {
    line.required_head(fluid, q).unwrap()
}

/// Relative difference, scaled by the larger magnitude (absolute near zero).
fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / a.abs().max(b.abs()).max(1e-300)
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(200))]

    #[test]
    fn required_head_is_c1_through_zero_and_the_transition_and_monotone(
        (line, d) in line(),
        mu in 5e-4f64..5e-2,
    ) {
        let fluid = Fluid::new(998.2, mu).unwrap();
        let nu = mu / 998.2;
        // Flow at Reynolds number re in the first pipe: Q = Re ν π d / 4 (definition).
        let q_at = |re: f64| re * nu * PI * d / 4.0;
        // Through zero: the value and the slope from both sides meet the ones at zero.
        let (h0, s0) = head(&line, &fluid, 0.0);
        let eps = q_at(1.0) * 1e-6;
        let (hp, sp) = head(&line, &fluid, eps);
        let (hm, sm) = head(&line, &fluid, -eps);
        prop_assert!((hp - h0).abs() <= 2.0 * s0.abs() * eps + 1e-12, "{h0} {hp}");
        prop_assert!((h0 - hm).abs() <= 2.0 * s0.abs() * eps + 1e-12, "{h0} {hm}");
        prop_assert!(rel(sp, s0) < 1e-4 && rel(sm, s0) < 1e-4, "slopes {sm} {s0} {sp}");
        // Through the transition limits (Re 2300 and 4000, common practice) of the first
        // pipe, either way: the slope is continuous.
        for re in [2300.0, 4000.0] {
            for sign in [1.0, -1.0] {
                let q = sign * q_at(re);
                let (_, below) = head(&line, &fluid, q * (1.0 - 1e-9));
                let (_, above) = head(&line, &fluid, q * (1.0 + 1e-9));
                prop_assert!(rel(below, above) < 1e-5, "Re {re}: {below} vs {above}");
            }
        }
        // Monotone over −Re 1e5 … Re 1e5, through zero and both transitions, and the
        // returned slope matches a central difference (rounding-limited step).
        let q_max = q_at(1e5);
        let mut last = f64::NEG_INFINITY;
        for k in -200..=200 {
            let q = q_max * f64::from(k) / 200.0;
            let (h, s) = head(&line, &fluid, q);
            prop_assert!(h > last, "not rising at {q}: {h} after {last}");
            prop_assert!(s > 0.0, "slope {s} at {q}");
            last = h;
            if k != 0 {
                let dq = q.abs() * 1e-6;
                let (h_up, h_down) = (head(&line, &fluid, q + dq).0, head(&line, &fluid, q - dq).0);
                let fd = (h_up - h_down) / (2.0 * dq);
                // The difference of two heads each rounded to half an ulp: a static rise
                // of metres beside micrometres of loss leaves a rounding error of about
                // ε (|h₊| + |h₋|)/(2 dq) in the quotient (exact bound of the subtraction).
                let rounding = f64::EPSILON * (h_up.abs() + h_down.abs()) / (2.0 * dq);
                prop_assert!(
                    (fd - s).abs() < 1e-4 * s.abs() + 2.0 * rounding,
                    "slope {s} vs difference {fd} at {q}"
                );
            }
        }
    }
}
