//! The line builder: labels, counted fittings, slicing, joining and the shares table.

mod common;

use common::rel_err;
use hydrograde::line::{LineBuilder, MAX_LABEL_CHARS};
use hydrograde::{
    Element, ErrorKind, Fitting, Fluid, Line, LineOptions, Pipe, STANDARD_GRAVITY, Section,
    UncertaintyOptions,
};
use std::f64::consts::PI;
use std::ops::Bound;

fn water() -> Fluid {
    Fluid::new(998.0, 1.0e-3).unwrap()
}

fn pipe(d: f64, length: f64) -> Element {
    Element::Pipe(Pipe::new(Section::circle(d).unwrap(), length, 4.5e-5).unwrap())
}

fn k(value: f64) -> Element {
    Element::Fitting(Fitting::k(value).unwrap())
}

/// The flow that runs at `v` m/s in a bore of `d` m.
fn flow_at(v: f64, d: f64) -> f64 {
    v * PI * d * d / 4.0
}

#[test]
fn six_counted_elbows_lose_six_times_k() {
    let mut b = LineBuilder::new();
    b.push(pipe(0.05, 10.0));
    let i = b.push(k(0.3));
    b.set_count(i, 6).unwrap();
    let r = b
        .line()
        .unwrap()
        .evaluate(&water(), flow_at(2.0, 0.05))
        .unwrap();
    let row = &r.elements[1];
    // 6 · 0.3 · 2² / (2 g): exact from the definition of K, g standard (CGPM 1901).
    let expected = 6.0 * 0.3 * 2.0 * 2.0 / (2.0 * STANDARD_GRAVITY);
    assert!(
        rel_err(row.head_loss, expected) < 1e-12,
        "{}",
        row.head_loss
    );
    assert_eq!(row.label, "6 × fitting 1");
    assert_eq!(row.count, 6);
    assert_eq!(row.element, Some(1));
    assert_eq!(r.elements.len(), 2);
}

#[test]
fn a_counted_fitting_carries_one_shared_error() {
    let q = flow_at(2.0, 0.05);
    let row_band = |n: u32| {
        let mut b = LineBuilder::new();
        b.push(pipe(0.05, 10.0));
        b.push(k(0.3));
        b.set_count(1, n).unwrap();
        let r = b.line().unwrap().evaluate(&water(), q).unwrap();
        r.elements[1].head_loss_band.half_width()
    };
    // One error shared by the six: the band scales with N (first-order propagation is
    // linear, JCGM 100:2008 §5.1; exact).
    assert!(rel_err(row_band(6), 6.0 * row_band(1)) < 1e-12);

    // Six instances of one catalogue entry already share one error (DESIGN §5), so six
    // separate rows and one counted row give the same total loss and band.
    let elbow = || Element::Fitting(Fitting::named("elbow_90_long_radius").unwrap());
    let mut separate = vec![pipe(0.05, 10.0)];
    separate.extend((0..6).map(|_| elbow()));
    let separate = Line::new(separate).unwrap().evaluate(&water(), q).unwrap();
    let mut b = LineBuilder::new();
    b.push(pipe(0.05, 10.0));
    b.push(elbow());
    b.set_count(1, 6).unwrap();
    let counted = b.line().unwrap().evaluate(&water(), q).unwrap();
    assert!(rel_err(counted.head_loss, separate.head_loss) < 1e-12);
    let (a, c) = (&separate.head_loss_band, &counted.head_loss_band);
    assert!(rel_err(a.high - a.low, c.high - c.low) < 1e-9);
    assert_eq!(counted.elements[1].label, "6 × elbow_90_long_radius 1");
}

#[test]
fn labels_default_to_kind_and_index_and_travel_into_rows() {
    let mut b = LineBuilder::new();
    b.push(pipe(0.05, 10.0));
    b.push_labelled(k(0.5), "strainer").unwrap();
    b.push(Element::rise(3.0).unwrap());
    b.push(Element::Fitting(Fitting::expansion(0.05, 0.08).unwrap()));
    b.push(pipe(0.08, 5.0));
    let line = b.build().unwrap();
    let labels: Vec<String> = (0..line.len()).map(|i| line.label(i).unwrap()).collect();
    assert_eq!(
        labels,
        ["pipe 0", "strainer", "rise 2", "expansion 3", "pipe 4"]
    );
    assert_eq!(line.user_label(1), Some("strainer"));
    assert_eq!(line.user_label(0), None);
    assert_eq!(line.label(9), None);
    let r = line.evaluate(&water(), 0.004).unwrap();
    let rows: Vec<&str> = r.elements.iter().map(|e| e.label.as_str()).collect();
    assert_eq!(rows, labels);
    // Clearing a label brings the default back.
    b.set_label(1, None).unwrap();
    assert_eq!(b.line().unwrap().label(1).unwrap(), "fitting 1");
}

#[test]
fn bad_builder_input_names_the_parameter() {
    let mut b = LineBuilder::new();
    b.push(pipe(0.05, 10.0));
    b.push(k(0.3));
    let e = b.set_count(1, 0).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(e.to_string().starts_with("count = 0"), "{e}");
    let e = b.set_count(0, 2).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(e.to_string().starts_with("count: "), "{e}");
    let e = b.set_count(7, 2).unwrap_err();
    assert!(e.to_string().starts_with("index = 7"), "{e}");
    for bad in ["", "   ", "two\nlines", &"x".repeat(MAX_LABEL_CHARS + 1)] {
        let e = b.set_label(0, Some(bad)).unwrap_err();
        assert!(e.to_string().starts_with("label: "), "{e}");
    }
    assert!(b.push_labelled(k(1.0), "").is_err());
    assert_eq!(b.len(), 2, "a refused label appends nothing");
    assert!(b.set_label(0, Some(&"é".repeat(MAX_LABEL_CHARS))).is_ok());
    let e = b.set_k_spread(0, 0.2).unwrap_err();
    assert!(e.to_string().starts_with("index = 0"), "{e}");
    let e = b.set_roughness_range(1, 1e-5, 1e-4).unwrap_err();
    assert!(e.to_string().starts_with("index = 1"), "{e}");
    assert!(b.set_roughness_range(0, 1e-5, 1e-4).is_ok());
    assert_eq!(
        b.set_inlet_pressure(Some(-1.0)).unwrap_err().kind(),
        ErrorKind::OutOfRange
    );
    assert_eq!(
        b.options().inlet_pressure(),
        None,
        "a refused option changes nothing"
    );
}

#[test]
fn the_builder_waits_for_a_pipe_to_give_a_fitting_its_bore() {
    let mut b = LineBuilder::new();
    assert_eq!(b.line().unwrap_err().kind(), ErrorKind::Invalid);
    b.push(k(0.5));
    assert_eq!(b.line().unwrap_err().kind(), ErrorKind::Invalid);
    b.push(pipe(0.05, 10.0));
    let line = b.line().unwrap();
    assert_eq!(line.len(), 2);
    // A change after a build is seen by the next build.
    b.set_count(0, 3).unwrap();
    assert_eq!(b.line().unwrap().count(0), Some(3));
}

#[test]
fn slices_and_joins_rebuild_the_same_route() {
    let mut b = LineBuilder::new();
    b.push(pipe(0.05, 10.0));
    b.push_labelled(
        Element::Fitting(Fitting::named("gate_valve").unwrap()),
        "isolation",
    )
    .unwrap();
    b.push(pipe(0.05, 30.0));
    b.push(k(0.3));
    b.set_count(3, 4).unwrap();
    b.push(Element::rise(6.0).unwrap());
    let line = b.build().unwrap();
    let head = line.slice(..2).unwrap();
    let tail = line.slice(2..).unwrap();
    assert_eq!((head.len(), tail.len()), (2, 3));
    assert_eq!(
        tail.label(1).unwrap(),
        "4 × fitting 1",
        "default labels renumber"
    );
    assert_eq!(head.label(1).unwrap(), "isolation", "user labels travel");
    let joined = head.join(&tail).unwrap();
    assert_eq!(joined, line);
    let (w, q) = (water(), 0.003);
    let whole = line.evaluate(&w, q).unwrap().required_head;
    let parts =
        head.evaluate(&w, q).unwrap().required_head + tail.evaluate(&w, q).unwrap().required_head;
    // The same rows summed in another grouping: equal to rounding.
    assert!(rel_err(whole, parts) < 1e-12);
    assert_eq!(line.iter().count(), 5);
    assert_eq!((&line).into_iter().count(), 5);

    let e = line.slice(2..2).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::Invalid);
    assert!(e.to_string().starts_with("slice: "), "{e}");
    assert!(
        line.slice(3..9)
            .unwrap_err()
            .to_string()
            .starts_with("end = 9")
    );
    assert!(
        line.slice((Bound::Included(4), Bound::Excluded(3)))
            .unwrap_err()
            .to_string()
            .starts_with("start = 4")
    );
    // A fitting without a bore of its own cannot stand alone.
    assert_eq!(line.slice(3..4).unwrap_err().kind(), ErrorKind::Invalid);

    let other = Line::with_options(
        vec![pipe(0.05, 1.0)],
        LineOptions::default()
            .with_uncertainty(UncertaintyOptions::none())
            .unwrap(),
    )
    .unwrap();
    let e = line.join(&other).unwrap_err();
    assert!(e.to_string().starts_with("other: "), "{e}");
}

#[test]
fn stored_lines_keep_labels_and_counts_through_the_checks() {
    let mut b = LineBuilder::new();
    b.push(pipe(0.05, 10.0));
    b.push_labelled(k(0.3), "bends").unwrap();
    b.set_count(1, 6).unwrap();
    let line = b.build().unwrap();
    let text = serde_json::to_string(&line).unwrap();
    assert_eq!(serde_json::from_str::<Line>(&text).unwrap(), line);
    let tampered = text.replace("\"counts\":[1,6]", "\"counts\":[1,0]");
    assert_ne!(tampered, text);
    assert!(serde_json::from_str::<Line>(&tampered).is_err());
    let tampered = text.replace("\"counts\":[1,6]", "\"counts\":[6,6]");
    assert!(serde_json::from_str::<Line>(&tampered).is_err());
    let tampered = text.replace("\"bends\"", "\"\"");
    assert!(serde_json::from_str::<Line>(&tampered).is_err());
    // A line stored before labels and counts existed reads with the defaults.
    let old = text
        .replace(",\"labels\":[null,\"bends\"]", "")
        .replace(",\"counts\":[1,6]", "");
    assert_ne!(old, text);
    let l = serde_json::from_str::<Line>(&old).unwrap();
    assert_eq!(
        (l.label(1).unwrap().as_str(), l.count(1)),
        ("fitting 1", Some(1))
    );
}

#[test]
fn shares_split_loss_and_band_by_element_kind_and_source() {
    // Two fixed-K fittings on one 50 mm bore, K = 1 and 3, each its own ±30 % source,
    // no other source (fixed K: no fluid dependence; bore tolerance 0 by default).
    let d = 0.05;
    let fit = |v: f64| Element::Fitting(Fitting::k(v).unwrap().with_diameter(d).unwrap());
    let mut b = LineBuilder::new();
    b.push(fit(1.0));
    b.push(Element::rise(2.0).unwrap());
    b.push_labelled(fit(3.0), "control valve").unwrap();
    let r = b
        .line()
        .unwrap()
        .evaluate(&water(), flow_at(2.0, d))
        .unwrap();
    let s = r.shares();
    // Loss ∝ K at one velocity: 1/4 and 3/4 (exact from the definition of K).
    let loss: Vec<Option<f64>> = s.by_element.iter().map(|e| e.loss_share).collect();
    let band: Vec<Option<f64>> = s.by_element.iter().map(|e| e.band_share).collect();
    let near = |a: Option<f64>, b: f64| a.is_some_and(|a| (a - b).abs() < 1e-12);
    assert!(
        near(loss[0], 0.25) && near(loss[1], 0.0) && near(loss[2], 0.75),
        "{loss:?}"
    );
    // Independent rectangular errors u ∝ K: variance shares 1²/(1² + 3²) and 3²/(1² + 3²)
    // (exact, JCGM 100:2008 §5.1.2).
    assert!(
        near(band[0], 0.1) && near(band[1], 0.0) && near(band[2], 0.9),
        "{band:?}"
    );
    assert_eq!(s.by_element[2].name, "control valve");
    assert_eq!(s.by_element[1].kind, "rise");
    let kinds: Vec<&str> = s.by_kind.iter().map(|k| k.name.as_str()).collect();
    assert_eq!(kinds, ["fitting", "rise"]);
    assert!(near(s.by_kind[0].loss_share, 1.0) && near(s.by_kind[0].band_share, 1.0));
    let sources: Vec<(&str, Option<f64>)> = s
        .by_source
        .iter()
        .map(|c| (c.name.as_str(), c.band_share))
        .collect();
    assert_eq!(sources.len(), 2);
    assert_eq!(sources[0].0, "K of k (element 2)");
    assert!(
        near(sources[0].1, 0.9) && near(sources[1].1, 0.1),
        "{sources:?}"
    );
    // At zero flow there is no loss to share.
    let z = b.line().unwrap().evaluate(&water(), 0.0).unwrap().shares();
    assert!(
        z.by_element
            .iter()
            .all(|e| e.loss_share.is_none() && e.band_share.is_none())
    );
}

#[test]
fn element_band_shares_sum_to_one_with_shared_sources() {
    let line = Line::new(vec![
        pipe(0.05, 30.0),
        Element::Fitting(Fitting::named("elbow_90_standard").unwrap()),
        pipe(0.05, 12.0),
        Element::Fitting(Fitting::named("elbow_90_standard").unwrap()),
    ])
    .unwrap();
    let s = line.evaluate(&water(), 0.004).unwrap().shares();
    let sum: f64 = s.by_element.iter().filter_map(|e| e.band_share).sum();
    // The covariance shares add to the variance (exact identity of first-order
    // propagation).
    assert!((sum - 1.0).abs() < 1e-12, "{sum}");
    let sum: f64 = s.by_source.iter().filter_map(|e| e.band_share).sum();
    assert!((sum - 1.0).abs() < 1e-12, "{sum}");
}

#[test]
fn k_has_an_upper_bound_so_inverse_flows_stay_meaningful() {
    let e = Fitting::k(1e300).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(e.to_string().starts_with("k = 1e300"), "{e}");
    assert!(Fitting::k(Fitting::MAX_K * 1.000_001).is_err());
    assert!(hydrograde::Equipment::fixed_k("orifice", 2e6, Some(0.05)).is_err());
    // At the bound the inverse is exact: K·V²/(2g) = 10 m gives
    // V = √(2 g · 10 / K) (definition of K).
    let d = 0.05;
    let line = Line::new(vec![Element::Fitting(
        Fitting::k(Fitting::MAX_K)
            .unwrap()
            .with_diameter(d)
            .unwrap(),
    )])
    .unwrap();
    let q = line.flow_for_head(&water(), 10.0).unwrap().flow;
    let v = (2.0 * STANDARD_GRAVITY * 10.0 / Fitting::MAX_K).sqrt();
    assert!(rel_err(q, flow_at(v, d)) < 1e-9, "{q}");
}

#[test]
fn equipment_deserialises_through_its_checks() {
    let e = hydrograde::Equipment::pressure_drop("strainer", 2000.0, 0.003)
        .unwrap()
        .with_spread(0.2)
        .unwrap();
    assert_eq!((e.name(), e.spread()), ("strainer", 0.2));
    let text = serde_json::to_string(&e).unwrap();
    assert_eq!(
        serde_json::from_str::<hydrograde::Equipment>(&text).unwrap(),
        e
    );
    for (from, to) in [("2000.0", "-2000.0"), ("0.2", "1.5"), ("0.003", "0.0")] {
        let bad = text.replace(from, to);
        assert_ne!(bad, text);
        assert!(
            serde_json::from_str::<hydrograde::Equipment>(&bad).is_err(),
            "{bad}"
        );
    }
}
