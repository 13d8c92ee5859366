//! Values that cannot hold bad state: the checks of the constructors also guard
//! deserialisation, and stored lines carry no worked-out cache.

use hydrograde::{Element, ErrorKind, Fitting, Fluid, Line, Pipe, Rise, Section, Shape};

fn water() -> Fluid {
    Fluid::new(998.0, 1.0e-3).unwrap()
}

#[test]
fn rises_refuse_non_finite_and_absurd_heights() {
    assert_eq!(
        Rise::new(f64::NAN).unwrap_err().kind(),
        ErrorKind::NotFinite
    );
    assert_eq!(
        Element::rise(f64::INFINITY).unwrap_err().kind(),
        ErrorKind::NotFinite
    );
    assert_eq!(Rise::new(2e6).unwrap_err().kind(), ErrorKind::OutOfRange);
    assert_eq!(Rise::new(-12.5).unwrap().height(), -12.5);
    for bad in ["NaN", "1e300", "null"] {
        assert!(serde_json::from_str::<Rise>(bad).is_err(), "{bad}");
    }
    assert_eq!(
        serde_json::to_string(&Rise::new(3.0).unwrap()).unwrap(),
        "3.0"
    );
}

#[test]
fn sections_have_bounds_and_deserialise_through_the_checks() {
    // A circle of 1e300 m would have an infinite area.
    let e = Section::circle(1e300).unwrap_err();
    assert_eq!(e.kind(), ErrorKind::OutOfRange);
    assert!(e.to_string().starts_with("diameter = 1e300"), "{e}");
    assert!(Section::rectangle(1e-300, 1.0).is_err());
    assert!(Section::custom(1e300, 1e300, 64.0).is_err());
    let s = Section::annulus(0.1, 0.05).unwrap();
    assert_eq!(
        s.shape(),
        Shape::Annulus {
            outer: 0.1,
            inner: 0.05
        }
    );
    let text = serde_json::to_string(&s).unwrap();
    assert_eq!(serde_json::from_str::<Section>(&text).unwrap(), s);
    for bad in [
        r#"{"Circle":{"diameter":-0.05}}"#,
        r#"{"Annulus":{"outer":0.05,"inner":0.1}}"#,
        r#"{"Custom":{"area":1.0,"wetted_perimeter":1.0,"laminar_constant":64.0}}"#,
    ] {
        assert!(serde_json::from_str::<Section>(bad).is_err(), "{bad}");
    }
    assert!(Section::from_shape(Shape::Circle { diameter: f64::NAN }).is_err());
}

#[test]
fn pipes_deserialise_through_the_checks() {
    let p = Pipe::of_material(Section::circle(0.1).unwrap(), 50.0, "commercial_steel").unwrap();
    let text = serde_json::to_string(&p).unwrap();
    assert_eq!(serde_json::from_str::<Pipe>(&text).unwrap(), p);
    let good = serde_json::to_value(&p).unwrap();
    for (field, value) in [
        ("length", serde_json::json!(-1.0)),
        ("length", serde_json::json!(1e300)),
        ("roughness", serde_json::json!(0.2)),
        ("roughness_range", serde_json::json!([1e-3, 1e-4])),
        ("material", serde_json::json!("unobtainium")),
    ] {
        let mut v = good.clone();
        v[field] = value;
        assert!(serde_json::from_value::<Pipe>(v).is_err(), "{field}");
    }
    assert!(Pipe::circular(0.1, 2e7, 0.0).is_err());
}

#[test]
fn lines_store_no_cache_and_rebuild_on_load() {
    let line = Line::new(vec![
        Element::Pipe(Pipe::circular(0.05, 30.0, 4.5e-5).unwrap()),
        Element::Fitting(Fitting::k(0.5).unwrap()),
    ])
    .unwrap();
    let v = serde_json::to_value(&line).unwrap();
    assert!(v.get("resolved").is_none(), "{v}");
    let back: Line = serde_json::from_value(v.clone()).unwrap();
    assert_eq!(back, line);
    let q = 2e-3;
    assert_eq!(
        back.evaluate(&water(), q).unwrap().required_head,
        line.evaluate(&water(), q).unwrap().required_head
    );
    // Tampered: an element more than there are roughness ranges; a range on a fitting;
    // no elements.
    let mut extra = v.clone();
    extra["elements"]
        .as_array_mut()
        .unwrap()
        .push(serde_json::json!({"Rise": 3.0}));
    assert!(serde_json::from_value::<Line>(extra).is_err());
    let mut on_fitting = v.clone();
    on_fitting["roughness_ranges"][1] = serde_json::json!([1e-5, 1e-4]);
    assert!(serde_json::from_value::<Line>(on_fitting).is_err());
    let mut empty = v.clone();
    empty["elements"] = serde_json::json!([]);
    empty["roughness_ranges"] = serde_json::json!([]);
    assert!(serde_json::from_value::<Line>(empty).is_err());
    let mut nan_rise = v;
    nan_rise["elements"][1] = serde_json::json!({"Rise": null});
    assert!(serde_json::from_value::<Line>(nan_rise).is_err());
}

#[test]
fn tank_inlets_round_trip_and_refuse_a_negative_rounding() {
    use hydrograde::Edge;
    for edge in [
        Edge::Square,
        Edge::Rounded { r_over_d: 0.1 },
        Edge::Reentrant,
    ] {
        let f = Fitting::from_tank(edge).unwrap();
        let text = serde_json::to_string(&f).unwrap();
        assert_eq!(serde_json::from_str::<Fitting>(&text).unwrap(), f, "{text}");
    }
    let text = serde_json::to_string(&Fitting::from_tank(Edge::Rounded { r_over_d: 0.1 }).unwrap())
        .unwrap();
    let bad = text.replace("0.1", "-0.1");
    assert!(serde_json::from_str::<Fitting>(&bad).is_err(), "{bad}");
    assert_eq!(
        Edge::named("conical", None).unwrap_err().kind(),
        ErrorKind::UnknownName
    );
    assert!(Edge::named("rounded", None).is_err() && Edge::named("square", Some(0.1)).is_err());
}

#[test]
fn fluids_deserialise_through_the_checks() {
    use hydrograde::fluid::{Origin, Phase};
    let oil = Fluid::new(870.0, 0.03)
        .unwrap()
        .with_uncertainty(0.01, 0.05)
        .unwrap();
    let gas = Fluid::gas(2.0, 1.8e-5, 300.0, 2e5).unwrap();
    let water = Fluid::water(333.15, 3e5)
        .unwrap()
        .with_vapour_pressure(2e4)
        .unwrap();
    let air = Fluid::air(300.0, 1e5).unwrap().at_pressure(3e5).unwrap();
    for f in [&oil, &gas, &water, &air] {
        let text = serde_json::to_string(f).unwrap();
        assert_eq!(&serde_json::from_str::<Fluid>(&text).unwrap(), f, "{text}");
    }
    assert_eq!(
        (water.phase(), water.origin(), water.vapour_pressure()),
        (Phase::Liquid, Origin::Water, Some(2e4))
    );
    let tampered = |f: &Fluid, field: &str, value: serde_json::Value| {
        let mut v = serde_json::to_value(f).unwrap();
        v[field] = value;
        serde_json::from_value::<Fluid>(v)
    };
    for (f, field, value) in [
        (&oil, "density", serde_json::json!(-870.0)),
        (&oil, "viscosity", serde_json::json!(0.0)),
        (&oil, "density", serde_json::Value::Null),
        (&oil, "density_rel_uncertainty", serde_json::json!(1.5)),
        (&oil, "temperature", serde_json::json!(300.0)),
        (&gas, "pressure", serde_json::Value::Null),
        (&gas, "temperature", serde_json::json!(-1.0)),
        (&water, "vapour_pressure", serde_json::json!(-5.0)),
        // A stored water or air must be its model at its own state.
        (&water, "density", serde_json::json!(1500.0)),
        (&water, "temperature", serde_json::json!(700.0)),
        (&air, "viscosity", serde_json::json!(1e-3)),
        (&air, "phase", serde_json::json!("Liquid")),
    ] {
        let e = tampered(f, field, value.clone()).unwrap_err();
        assert!(!e.to_string().is_empty(), "{field} = {value}");
    }
    let e = tampered(&water, "density", serde_json::json!(1500.0)).unwrap_err();
    assert!(e.to_string().starts_with("density = 1500"), "{e}");
}

#[test]
fn options_are_private_checked_and_deserialise_through_the_checks() {
    use hydrograde::band::UncertaintyOptions;
    use hydrograde::line::LineOptions;
    let o = LineOptions::default()
        .with_inlet_pressure(Some(2e5))
        .unwrap()
        .with_end_pressure(Some(5e4))
        .unwrap()
        .with_uncertainty(UncertaintyOptions::default().with_diameter(0.01).unwrap())
        .unwrap()
        .with_surroundings(Some(Fluid::air(280.0, 101_325.0).unwrap()))
        .unwrap()
        .with_air_column_for_liquids(true);
    assert_eq!(
        (
            o.inlet_pressure(),
            o.end_pressure(),
            o.uncertainty().diameter()
        ),
        (Some(2e5), Some(5e4), 0.01)
    );
    assert!(o.air_column_for_liquids() && o.surroundings().is_some());
    let text = serde_json::to_string(&o).unwrap();
    assert_eq!(serde_json::from_str::<LineOptions>(&text).unwrap(), o);
    // The setters refuse what validate refuses, naming the parameter.
    for (e, name) in [
        (
            LineOptions::default().with_inlet_pressure(Some(-1.0)),
            "inlet_pressure",
        ),
        (
            LineOptions::default().with_end_pressure(Some(f64::INFINITY)),
            "end_pressure",
        ),
        (
            LineOptions::default().with_surroundings(Some(water())),
            "surroundings",
        ),
    ] {
        let e = e.unwrap_err();
        assert!(e.to_string().starts_with(name), "{e}");
    }
    let u = UncertaintyOptions::default();
    assert!(u.clone().with_turbulent_model(-0.1).is_err());
    assert!(u.clone().with_diameter(f64::NAN).is_err());
    assert_eq!(
        u.clone()
            .with_independent_materials(vec!["unobtainium".into()])
            .unwrap_err()
            .kind(),
        ErrorKind::UnknownName
    );
    // Tampered stored options are refused, alone and inside a stored line.
    let good = serde_json::to_value(&o).unwrap();
    for (path, value) in [
        (&["inlet_pressure"][..], serde_json::json!(-2e5)),
        (&["end_pressure"][..], serde_json::json!(null)),
        (&["uncertainty", "diameter"][..], serde_json::json!(-0.01)),
        (
            &["uncertainty", "independent_materials"][..],
            serde_json::json!(["unobtainium"]),
        ),
        (&["surroundings", "phase"][..], serde_json::json!("Liquid")),
    ] {
        let mut v = good.clone();
        let mut slot = &mut v;
        for key in path {
            slot = &mut slot[*key];
        }
        *slot = value;
        // A JSON null for end_pressure is a valid "none"; every other edit breaks a rule.
        let back = serde_json::from_value::<LineOptions>(v);
        assert_eq!(back.is_ok(), path == ["end_pressure"], "{path:?}");
    }
    let line = Line::with_options(
        vec![Element::Pipe(Pipe::circular(0.05, 30.0, 4.5e-5).unwrap())],
        o,
    )
    .unwrap();
    let mut v = serde_json::to_value(&line).unwrap();
    v["options"]["inlet_pressure"] = serde_json::json!(f64::MIN);
    assert!(serde_json::from_value::<Line>(v).is_err());
}
