//! Prints the Rust core's results on a fixed grid of inputs, one per line, with every
//! double as the 16 hex digits of its bits, so the C, C++ and Python tests can check that
//! the C ABI gives the same numbers bit for bit.
//!
//! Line formats (fields separated by one space):
//! - `darcy <correlation> <re> <rel_roughness> <f> <df_dre> <df_drel_roughness> <regime> <warnings>`
//! - `darcy_err <correlation> <re> <rel_roughness> <error kind name>`
//! - every other function: `<tag> <inputs…> | <outputs…>` or `<tag> <inputs…> | !<error kind>`,
//!   where a token is a double (16 hex digits), `s:<name>` or `i:<integer>`; the tag names
//!   the C function (`water` = `hg_water`, …) and the tests know each one's argument order.
//!
//! Run: `cargo run --release -p hydrograde-capi --example core_reference > FILE`.

use hydrograde::fitting::{Edge, Fitting};
use hydrograde::fluid::{Fluid, water_vapour_pressure};
use hydrograde::friction::{Correlation, Options, Regime, darcy_factor};
use hydrograde::line::{Element, Equipment, Limit, Line, LineOptions, PumpCurve, split_flow};
use hydrograde::pipe::Pipe;
use hydrograde::roughness;
use hydrograde::section::{Section, TurbulentDiameter};
use hydrograde::sizes::{self, PipeTable};
use hydrograde::units;
use std::io::{self, BufWriter, Write};

/// One token of a reference line.
enum Tok<'a> {
    D(f64),
    S(&'a str),
    I(i64),
}

fn tok(t: &Tok) -> String {
    match t {
        Tok::D(x) => hex(*x),
        // Spaces would split the token: names travel with '~' for ' '.
        Tok::S(s) => format!("s:{}", s.replace(' ', "~")),
        Tok::I(i) => format!("i:{i}"),
    }
}

fn emit(
    out: &mut impl Write,
    tag: &str,
    inputs: &[Tok],
    result: hydrograde::Result<Vec<Tok>>,
) -> io::Result<()> {
    let ins: Vec<String> = inputs.iter().map(tok).collect();
    let outs = match result {
        Ok(v) => v.iter().map(tok).collect::<Vec<_>>().join(" "),
        Err(e) => format!("!{}", e.kind().name()),
    };
    writeln!(out, "{tag} {} | {outs}", ins.join(" "))
}

/// The section of the C ABI's `(shape, a, b)` triple (b = 0 for one-dimension shapes).
fn section(shape: i64, a: f64, b: f64) -> hydrograde::Result<Section> {
    let one = |b: f64| {
        if b == 0.0 {
            Ok(())
        } else {
            Err(hydrograde::Error::invalid("b", "must be 0"))
        }
    };
    match shape {
        0 => one(b).and_then(|_| Section::circle(a)),
        1 => Section::annulus(a, b),
        2 => Section::rectangle(a, b),
        3 => Section::ellipse(a, b),
        4 => one(b).and_then(|_| Section::triangle(a)),
        _ => Err(hydrograde::Error::out_of_range(
            "shape",
            shape as f64,
            "unknown",
        )),
    }
}

fn hex(x: f64) -> String {
    format!("{:016x}", x.to_bits())
}

fn regime(r: Regime) -> u32 {
    match r {
        Regime::Laminar => 0,
        Regime::Transitional => 1,
        Regime::Turbulent => 2,
    }
}

fn main() -> io::Result<()> {
    let mut out = BufWriter::new(io::stdout().lock());
    // Reynolds numbers from 10 to 1e10, 12 per decade, plus the regime limits themselves
    // and points inside the transitional band; roughness from smooth to very rough,
    // including values outside every correlation's range and invalid ones.
    let mut res: Vec<f64> = (0..=108)
        .map(|i| 10f64.powf(1.0 + i as f64 / 12.0))
        .collect();
    res.extend([
        2300.0, 2300.5, 3000.0, 3999.0, 4000.0, 4000.5, -5.0, 0.0, 1e14,
    ]);
    let rrs = [
        0.0, 1e-7, 1e-6, 1e-5, 1e-4, 1e-3, 5e-3, 1e-2, 0.05, 0.1, 0.5, 0.6, -1e-4,
    ];
    for (ci, c) in Correlation::ALL.iter().enumerate() {
        let opts = Options::with_correlation(*c);
        for &re in &res {
            for &rr in &rrs {
                match darcy_factor(re, rr, &opts) {
                    Ok(fr) => writeln!(
                        out,
                        "darcy {ci} {} {} {} {} {} {} {}",
                        hex(re),
                        hex(rr),
                        hex(fr.f),
                        hex(fr.df_dre),
                        hex(fr.df_drel_roughness),
                        regime(fr.regime),
                        fr.warnings.bits()
                    )?,
                    Err(e) => writeln!(
                        out,
                        "darcy_err {ci} {} {} {}",
                        hex(re),
                        hex(rr),
                        e.kind().name()
                    )?,
                }
            }
        }
    }
    others(&mut out)?;
    materials(&mut out)?;
    lines(&mut out)?;
    pumps(&mut out)?;
    out.flush()
}

fn others(out: &mut impl Write) -> io::Result<()> {
    use Tok::{D, I, S};
    let bad = [f64::NAN, f64::INFINITY, -1.0, 0.0];
    for t in [
        273.15, 280.0, 293.15, 300.0, 350.0, 373.15, 400.0, 500.0, 600.0, 623.15, 273.0, 700.0,
        bad[0],
    ] {
        for p in [101_325.0, 1e5, 1e6, 1e7, 1e8, 2e8, 500.0, 0.0, -1.0, bad[1]] {
            let w = Fluid::water(t, p).map(|f| vec![D(f.density()), D(f.viscosity())]);
            emit(out, "water", &[D(t), D(p)], w)?;
        }
        emit(
            out,
            "vapour",
            &[D(t)],
            water_vapour_pressure(t).map(|p| vec![D(p)]),
        )?;
    }
    for t in [
        200.0, 250.0, 288.15, 300.0, 500.0, 1000.0, 150.0, 1100.0, bad[1],
    ] {
        for p in [1e3, 101_325.0, 1e6, 2e6, 3e6, 0.0, -5.0, bad[0]] {
            let a = Fluid::air(t, p).map(|f| vec![D(f.density()), D(f.viscosity())]);
            emit(out, "air", &[D(t), D(p)], a)?;
        }
    }
    let names = units::names();
    for &from in names.iter().chain(&["furlong"]) {
        for &to in &names {
            for v in [1.0, -3.5, 1234.5, 0.0, bad[0]] {
                let r = units::convert(v, from, to).map(|x| vec![D(x)]);
                emit(out, "convert", &[D(v), S(from), S(to)], r)?;
            }
            for rho in [1000.0, 998.2, 0.0] {
                let r = units::convert_head(2.5, from, to, rho).map(|x| vec![D(x)]);
                emit(out, "convert_head", &[D(2.5), S(from), S(to), D(rho)], r)?;
            }
        }
    }
    for (i, n) in units::names().iter().enumerate() {
        emit(out, "unit_name", &[I(i as i64)], Ok(vec![S(n)]))?;
    }
    let cat = Fitting::catalogue();
    for (i, n) in cat.iter().enumerate() {
        emit(out, "catalogue", &[I(i as i64)], Ok(vec![S(n)]))?;
    }
    for &name in cat.iter().chain(&["nonesuch"]) {
        for re in [10.0, 1e3, 1e5, 1e7, 0.0] {
            for bore in [0.025, 0.1, 0.0] {
                for rr in [0.0, 1e-3, -1.0] {
                    let r = Fitting::named(name)
                        .and_then(|f| f.k_at(re, bore, rr))
                        .map(|(k, dk)| vec![D(k), D(dk)]);
                    emit(out, "fitting_k", &[S(name), D(re), D(bore), D(rr)], r)?;
                }
            }
        }
    }
    let dims = [
        (0.1, 0.0),
        (0.1, 0.03),
        (0.05, 0.2),
        (0.0, 0.0),
        (-0.1, 0.05),
        (0.2, 0.2),
        (bad[0], 0.0),
    ];
    for shape in 0..6 {
        for (a, b) in dims {
            let r = section(shape, a, b).map(|s| {
                vec![
                    D(s.area()),
                    D(s.wetted_perimeter()),
                    D(s.hydraulic_diameter()),
                    D(s.laminar_constant()),
                ]
            });
            emit(out, "section", &[I(shape), D(a), D(b)], r)?;
            for (mi, mode) in [
                TurbulentDiameter::Hydraulic,
                TurbulentDiameter::LaminarEquivalent,
            ]
            .into_iter()
            .enumerate()
            {
                let r = section(shape, a, b).map(|s| vec![D(s.turbulent_diameter(mode))]);
                emit(
                    out,
                    "turbulent_diameter",
                    &[I(shape), D(a), D(b), I(mi as i64)],
                    r,
                )?;
            }
        }
    }
    let fluids = [(998.2, 1.002e-3), (1.2, 1.8e-5), (0.0, 1e-3)];
    let flows = [
        0.0, 1e-7, -1e-7, 1e-5, 1e-4, -1e-4, 2e-4, 1e-3, 1e-2, -0.1, bad[0],
    ];
    for d in [0.025, 0.1, 0.0] {
        for eps in [0.0, 4.5e-5, 0.02] {
            for (rho, mu) in fluids {
                for q in flows {
                    let r = Pipe::circular(d, 10.0, eps)
                        .and_then(|p| p.head_loss(&Fluid::new(rho, mu)?, q))
                        .map(|(h, dh)| vec![D(h), D(dh)]);
                    emit(
                        out,
                        "pipe_head_loss",
                        &[D(d), D(10.0), D(eps), D(rho), D(mu), D(q)],
                        r,
                    )?;
                }
            }
        }
    }
    for q in flows {
        for (rho, mu) in fluids {
            for d in [0.05, 0.0] {
                // The checks in the order hg_reynolds makes them.
                let r = Section::circle(d)
                    .and_then(|s| {
                        let f = Fluid::new(rho, mu)?;
                        hydrograde::error::check::finite("flow", q)?;
                        f.reynolds(s.velocity(q), d)
                    })
                    .map(|re| vec![D(re)]);
                emit(out, "reynolds", &[D(q), D(d), D(rho), D(mu)], r)?;
            }
        }
    }
    for shape in 0..5 {
        for (a, b) in [(0.1, 0.0), (0.1, 0.04), (0.0, 0.0)] {
            for q in flows {
                let r = section(shape, a, b)
                    .and_then(|s| Pipe::new(s, 20.0, 1e-4))
                    .and_then(|p| {
                        p.flow_state(
                            &Fluid::new(998.2, 1.002e-3)?,
                            q,
                            &Options::default(),
                            TurbulentDiameter::Hydraulic,
                        )
                    })
                    .map(|s| {
                        let f = if s.friction_factor.is_nan() {
                            0.0
                        } else {
                            s.friction_factor
                        };
                        vec![
                            D(s.velocity),
                            D(s.reynolds),
                            D(f),
                            D(s.head_loss),
                            D(s.dhead_dflow),
                            I(regime(s.regime) as i64),
                            I(s.warnings.bits() as i64),
                        ]
                    });
                emit(
                    out,
                    "duct_flow_state",
                    &[
                        I(shape),
                        D(a),
                        D(b),
                        D(20.0),
                        D(1e-4),
                        D(998.2),
                        D(1.002e-3),
                        D(q),
                    ],
                    r,
                )?;
            }
        }
    }
    Ok(())
}

/// Invented demonstration routes, built the same way by the C tests
/// (tests/c/test_line.c: `build_scenario`).
fn scenario(n: i64) -> hydrograde::Result<Line> {
    let fit = |name: &str| Fitting::named(name).map(Element::Fitting);
    match n {
        0 => {
            // A pump discharge: pipe, elbow, check valve, rise, fixed K, smaller pipe,
            // strainer rated by its drop.
            let opts = LineOptions::default().with_inlet_pressure(Some(3e5))?;
            Line::with_options(
                vec![
                    Element::Pipe(Pipe::circular(0.05, 30.0, 4.5e-5)?),
                    fit("elbow_90_standard")?,
                    fit("swing_check_valve")?,
                    Element::rise(3.0)?,
                    Element::Fitting(Fitting::k(0.5)?),
                    Element::Pipe(Pipe::circular(0.04, 12.0, 1.5e-6)?),
                    Element::Equipment(Equipment::pressure_drop("strainer", 2e4, 2e-3)?),
                ],
                opts,
            )
        }
        1 => {
            // A rectangular duct falling 2 m with a fixed-K fitting at its own bore.
            let opts = LineOptions::default()
                .with_friction(Options::with_correlation(Correlation::Haaland))?;
            Line::with_options(
                vec![
                    Element::Fitting(Fitting::k(1.5)?.with_diameter(0.15)?),
                    Element::Pipe(Pipe::new(Section::rectangle(0.2, 0.1)?, 50.0, 1e-4)?),
                    Element::rise(-2.0)?,
                ],
                opts,
            )
        }
        2 => {
            // A cooling-water run through every kind of fitting, with a catalogue
            // material, a custom duct, the laminar-equivalent diameter, a bore tolerance,
            // a widened valve spread and a stated roughness range.
            let opts = LineOptions::default()
                .with_turbulent_diameter(TurbulentDiameter::LaminarEquivalent)
                .with_uncertainty(
                    hydrograde::band::UncertaintyOptions::default().with_diameter(0.01)?,
                )?;
            let mut line = Line::with_options(
                vec![
                    Element::Fitting(Fitting::from_tank(Edge::Rounded { r_over_d: 0.1 })?),
                    Element::Pipe(Pipe::of_material(
                        Section::circle(0.1)?,
                        40.0,
                        "commercial_steel",
                    )?),
                    Element::Fitting(Fitting::bend(90.0, 1.5)?),
                    Element::Fitting(Fitting::two_k(800.0, 0.25)?),
                    Element::Fitting(Fitting::three_k(500.0, 0.15, 4.0)?),
                    Element::Fitting(Fitting::cv(120.0)?.with_k_spread(0.2)?),
                    Element::Fitting(Fitting::kv(100.0)?),
                    Element::Fitting(Fitting::equivalent_length(30.0)?),
                    Element::Fitting(Fitting::expansion(0.1, 0.15)?),
                    Element::Pipe(Pipe::new(Section::custom(0.0177, 0.48, 62.0)?, 10.0, 1e-4)?),
                    Element::Fitting(Fitting::contraction(0.15, 0.08)?),
                    Element::Pipe(Pipe::circular(0.08, 5.0, 1.5e-6)?),
                    Element::Fitting(Fitting::into_tank()),
                    Element::Fitting(Fitting::from_tank(Edge::Reentrant)?),
                    Element::Fitting(Fitting::from_tank(Edge::Square)?),
                    Element::Pipe(Pipe::new(Section::rectangle(0.12, 0.06)?, 3.0, 5e-5)?),
                ],
                opts,
            )?;
            line.set_roughness_range(11, 1e-6, 5e-6)?;
            Ok(line)
        }
        _ => Err(hydrograde::Error::invalid("scenario", "unknown")),
    }
}

fn lines(out: &mut impl Write) -> io::Result<()> {
    use Tok::{D, I, S};
    let fluids = [
        Fluid::new(998.2, 1.002e-3),
        Fluid::water(293.15, 2e5),
        Fluid::gas(1.2, 1.8e-5, 293.15, 101_325.0).and_then(|f| f.with_uncertainty(0.01, 0.02)),
    ];
    for sc in 0..3 {
        let line = scenario(sc).map_err(io::Error::other)?;
        for (fi, fluid) in fluids.iter().enumerate() {
            let fluid = fluid.clone().map_err(io::Error::other)?;
            for q in [0.0, 1e-6, 2e-4, 2e-3, -2e-3, 1e-2, f64::NAN] {
                let r = line.evaluate(&fluid, q);
                let totals = r.as_ref().map_err(Clone::clone).map(|r| {
                    vec![
                        D(r.head_loss),
                        D(r.pressure_loss),
                        D(r.static_head),
                        D(r.required_head),
                        D(r.drequired_head_dflow),
                        D(r.density),
                        D(r.outlet_pressure.unwrap_or(0.0)),
                        I(r.warnings.bits() as i64),
                        I(r.elements.len() as i64),
                        D(r.head_loss_band.low),
                        D(r.head_loss_band.high),
                        D(r.required_head_band.low),
                        D(r.required_head_band.high),
                    ]
                });
                emit(out, "line_eval", &[I(sc), I(fi as i64), D(q)], totals)?;
                if let Ok(r) = &r {
                    let n = r.head_loss_band.contributions.len();
                    for (i, c) in r.head_loss_band.contributions.iter().enumerate() {
                        emit(
                            out,
                            "line_band_source",
                            &[I(sc), I(fi as i64), D(q), I(i as i64)],
                            Ok(vec![S(&c.source.name()), D(c.share)]),
                        )?;
                    }
                    let past = Err(hydrograde::Error::out_of_range(
                        "index",
                        n as f64,
                        "past the end",
                    ));
                    emit(
                        out,
                        "line_band_source",
                        &[I(sc), I(fi as i64), D(q), I(n as i64)],
                        past,
                    )?;
                    for (i, e) in r.elements.iter().enumerate() {
                        element_sources(out, &[I(sc), I(fi as i64), D(q), I(i as i64)], e)?;
                        let fin = |x: f64| if x.is_finite() { x } else { 0.0 };
                        emit(
                            out,
                            "line_element",
                            &[I(sc), I(fi as i64), D(q), I(i as i64)],
                            Ok(vec![
                                D(fin(e.velocity.unwrap_or(0.0))),
                                D(fin(e.reynolds.unwrap_or(0.0))),
                                D(fin(e.friction_factor.unwrap_or(0.0))),
                                D(fin(e.k.unwrap_or(0.0))),
                                D(e.head_loss),
                                D(e.dhead_dflow),
                                D(e.pressure_out.unwrap_or(0.0)),
                                I(e.warnings.bits() as i64),
                                D(e.head_loss_band.low),
                                D(e.head_loss_band.high),
                            ]),
                        )?;
                    }
                }
            }
            line_checks(out, &line, &fluid, sc, fi as i64)?;
            for q in [0.0, 1e-6, -2e-4, 2e-3, f64::INFINITY] {
                let r = line.required_head(&fluid, q).map(|(h, d)| vec![D(h), D(d)]);
                emit(out, "line_required_head", &[I(sc), I(fi as i64), D(q)], r)?;
            }
            for d in [0.06, 0.0] {
                let r = line
                    .with_uniform_diameter(d)
                    .and_then(|u| u.evaluate(&fluid, 2e-3))
                    .map(|r| vec![D(r.head_loss), D(r.required_head), D(r.head_loss_band.high)]);
                emit(out, "line_uniform", &[I(sc), I(fi as i64), D(d)], r)?;
            }
            for head in [0.5, 3.0, 10.0, 40.0, -5.0, f64::INFINITY] {
                let r = line
                    .flow_for_head(&fluid, head)
                    .map(|s| vec![D(s.flow), D(s.flow_band.low), D(s.flow_band.high)]);
                emit(
                    out,
                    "line_flow_for_head",
                    &[I(sc), I(fi as i64), D(head)],
                    r,
                )?;
            }
            if sc == 0 {
                line_solves(out, &fluid, fi as i64)?;
            }
            let flows: Vec<f64> = (0..50).map(|i| -5e-3 + 2.5e-4 * i as f64).collect();
            let r = line
                .system_curve(&fluid, &flows)
                .map(|h| h.into_iter().map(D).collect());
            emit(out, "line_system_curve", &[I(sc), I(fi as i64)], r)?;
            // The system curve's band: low, nominal and high at 20 flows through zero.
            let flows: Vec<f64> = (0..20).map(|i| -5e-3 + 5e-4 * i as f64).collect();
            let r = line.system_curve_band(&fluid, &flows).map(|c| {
                c.low
                    .iter()
                    .chain(&c.nominal)
                    .chain(&c.high)
                    .map(|v| D(*v))
                    .collect()
            });
            emit(out, "line_curve_band", &[I(sc), I(fi as i64)], r)?;
            {
                // The offered Monte Carlo interval: flagged or not, and the run when flagged.
                for q in [2e-3, 2e-4, 2e-5, f64::NAN] {
                    let r = hydrograde::band::band_monte_carlo(&line, &fluid, q).map(|m| match m {
                        Some(m) => vec![I(1), D(m.mean), D(m.std_dev), D(m.low), D(m.high)],
                        None => vec![I(0)],
                    });
                    emit(out, "line_band_mc", &[I(sc), I(fi as i64), D(q)], r)?;
                }
            }
        }
    }
    Ok(())
}

/// The sources of one element's head-loss band, and one index past the last.
fn element_sources(
    out: &mut impl Write,
    inputs: &[Tok],
    e: &hydrograde::line::ElementResult,
) -> io::Result<()> {
    use Tok::{D, I, S};
    let list = &e.head_loss_band.contributions;
    for (j, c) in list.iter().enumerate() {
        let mut ins: Vec<Tok> = inputs.iter().map(copy_tok).collect();
        ins.push(I(j as i64));
        let name = c.source.name();
        let r = Ok(vec![S(&name), D(c.share)]);
        emit(out, "line_elem_source", &ins, r)?;
    }
    let mut ins: Vec<Tok> = inputs.iter().map(copy_tok).collect();
    ins.push(I(list.len() as i64));
    let past = Err(hydrograde::Error::out_of_range(
        "source",
        list.len() as f64,
        "past the end",
    ));
    emit(out, "line_elem_source", &ins, past)
}

fn copy_tok<'a>(t: &Tok<'a>) -> Tok<'a> {
    match t {
        Tok::D(x) => Tok::D(*x),
        Tok::S(s) => Tok::S(s),
        Tok::I(i) => Tok::I(*i),
    }
}

/// `hg_line_evaluate_at` (inlet pressure 0 = none) and `hg_line_monte_carlo`.
fn line_checks(
    out: &mut impl Write,
    line: &Line,
    fluid: &Fluid,
    sc: i64,
    fi: i64,
) -> io::Result<()> {
    use Tok::{D, I};
    for q in [2e-3, -2e-4, f64::NAN] {
        for p in [0.0, 1.5e5, 4e5, -1.0, f64::INFINITY] {
            let r = line
                .evaluate_at(fluid, q, if p == 0.0 { None } else { Some(p) })
                .map(|r| {
                    vec![
                        D(r.head_loss),
                        D(r.pressure_loss),
                        D(r.required_head),
                        D(r.inlet_pressure.unwrap_or(0.0)),
                        D(r.outlet_pressure.unwrap_or(0.0)),
                        I(r.warnings.bits() as i64),
                        D(r.required_head_band.low),
                        D(r.required_head_band.high),
                    ]
                });
            emit(out, "line_eval_at", &[I(sc), I(fi), D(q), D(p)], r)?;
        }
    }
    for (q, samples, seed) in [
        (2e-3, 400, 7),
        (2e-3, 400, 8),
        (-1e-3, 200, 7),
        (2e-3, 99, 7),
        (f64::NAN, 200, 7),
    ] {
        let r = hydrograde::band::monte_carlo(line, fluid, q, samples, seed).map(|m| {
            vec![
                D(m.mean),
                D(m.std_dev),
                D(m.low),
                D(m.high),
                I(m.samples as i64),
            ]
        });
        emit(
            out,
            "line_monte_carlo",
            &[I(sc), I(fi), D(q), I(samples as i64), I(seed as i64)],
            r,
        )?;
    }
    Ok(())
}

fn materials(out: &mut impl Write) -> io::Result<()> {
    use Tok::{D, I, S};
    for (ci, c) in Correlation::ALL.iter().enumerate() {
        let v = c.validity();
        let vals = vec![
            D(v.re_min),
            D(v.re_max),
            D(v.rel_roughness_min),
            D(v.rel_roughness_max),
            D(v.accuracy),
        ];
        emit(out, "validity", &[I(ci as i64)], Ok(vals))?;
    }
    for (ci, c) in Correlation::ALL.iter().enumerate() {
        for re in [2300.0, 3000.0, 3999.0, 1e5, -1.0] {
            let o = Options::with_correlation(*c);
            let r = hydrograde::friction::transition_limits(re, 1e-3, &o)
                .map(|(l, t)| vec![D(l), D(t)]);
            emit(out, "transition_limits", &[D(re), D(1e-3), I(ci as i64)], r)?;
        }
    }
    let pq = [0.0, 1e-3, 2e-3, 3e-3];
    let ph = [30.0, 28.0, 22.0, 12.0];
    for q in [0.0, 5e-4, 1.5e-3, 3e-3, 4e-3, -1e-3, f64::NAN] {
        let r = PumpCurve::new(&pq, &ph)
            .and_then(|p| p.head(q))
            .map(|(h, d)| vec![D(h), D(d)]);
        emit(out, "pump_curve_head", &[D(q)], r)?;
    }
    for p in [
        611.213,
        1e3,
        101_325.0,
        1e6,
        2.2e7,
        22.064e6,
        3e7,
        100.0,
        f64::NAN,
    ] {
        let r = hydrograde::fluid::water_saturation_temperature(p).map(|t| vec![D(t)]);
        emit(out, "saturation", &[D(p)], r)?;
    }
    for (i, n) in roughness::names().iter().enumerate() {
        emit(out, "material_name", &[I(i as i64)], Ok(vec![S(n)]))?;
    }
    for name in roughness::names().into_iter().chain(["unobtainium"]) {
        let r = roughness::material(name).map(|m| vec![D(m.typical), D(m.low), D(m.high)]);
        emit(out, "roughness", &[S(name)], r)?;
    }
    for (a, b, c) in [
        (4.5e-5, 1e-5, 20.0),
        (0.0, 0.0, 0.0),
        (-1.0, 0.0, 1.0),
        (1e-4, f64::NAN, 1.0),
    ] {
        emit(
            out,
            "roughness_aged",
            &[D(a), D(b), D(c)],
            roughness::aged(a, b, c).map(|r| vec![D(r)]),
        )?;
    }
    for table in PipeTable::ALL {
        for &sched in table.schedules() {
            for nominal in table.nominal_sizes() {
                let r = sizes::lookup(table, nominal, sched)
                    .map(|p| vec![D(p.outside_diameter), D(p.wall), D(p.inside_diameter)]);
                emit(
                    out,
                    "pipe_size",
                    &[S(table.name()), S(nominal), S(sched)],
                    r,
                )?;
            }
            for d in [0.001, 0.02, 0.05, 0.1, 0.3, 5.0, 0.0] {
                let r = sizes::smallest_at_least(table, sched, d)
                    .map(|p| vec![OwnedTok::D(p.inside_diameter), OwnedTok::S(p.nominal)]);
                emit_owned(
                    out,
                    "pipe_size_at_least",
                    &[S(table.name()), S(sched), D(d)],
                    r,
                )?;
            }
        }
        let r = sizes::lookup(table, "37", "40").map(|p| vec![D(p.inside_diameter)]);
        emit(out, "pipe_size", &[S(table.name()), S("37"), S("40")], r)?;
    }
    let r = "cast_iron".parse::<PipeTable>().map(|_| vec![]);
    emit(out, "pipe_size", &[S("cast_iron"), S("2"), S("40")], r)?;
    // Schedules and nominal sizes by index, one past the end, and an unknown table.
    let past = |n: usize| {
        Err(hydrograde::Error::out_of_range(
            "index",
            n as f64,
            "past the end",
        ))
    };
    for table in PipeTable::ALL {
        let scheds = table.schedules();
        for i in 0..=scheds.len() {
            let r = scheds.get(i).map_or_else(|| past(i), |s| Ok(vec![S(s)]));
            emit(out, "table_schedule", &[S(table.name()), I(i as i64)], r)?;
        }
        let noms = table.nominal_sizes();
        for i in 0..=noms.len() {
            let r = noms.get(i).map_or_else(|| past(i), |s| Ok(vec![S(s)]));
            emit(out, "table_nominal", &[S(table.name()), I(i as i64)], r)?;
        }
    }
    for tag in ["table_schedule", "table_nominal"] {
        let r = "cast_iron".parse::<PipeTable>().map(|_| vec![]);
        emit(out, tag, &[S("cast_iron"), I(0)], r)?;
    }
    Ok(())
}

/// A token whose string is owned (for names built at run time).
enum OwnedTok {
    D(f64),
    S(String),
}

impl Tok<'_> {
    fn owned(&self) -> OwnedTok {
        match self {
            Tok::D(x) => OwnedTok::D(*x),
            Tok::S(s) => OwnedTok::S(s.to_string()),
            Tok::I(i) => OwnedTok::D(*i as f64),
        }
    }
}

fn emit_owned(
    out: &mut impl Write,
    tag: &str,
    inputs: &[Tok],
    result: hydrograde::Result<Vec<OwnedTok>>,
) -> io::Result<()> {
    let r = result.map(|v| {
        v.into_iter()
            .map(|t| match t {
                OwnedTok::D(x) => hex(x),
                OwnedTok::S(s) => format!("s:{s}"),
            })
            .collect::<Vec<_>>()
    });
    let ins: Vec<String> = inputs.iter().map(tok).collect();
    let outs = match r {
        Ok(v) => v.join(" "),
        Err(e) => format!("!{}", e.kind().name()),
    };
    writeln!(out, "{tag} {} | {outs}", ins.join(" "))
}

/// Solves on the invented scenarios: a pump curve, a parallel pair, sizing.
fn line_solves(out: &mut impl Write, fluid: &Fluid, fi: i64) -> io::Result<()> {
    use Tok::{D, I, S};
    let pump_q = [0.0, 1e-3, 2e-3, 3e-3, 4e-3];
    for (pi, shut) in [40.0, 20.0, 2.0].into_iter().enumerate() {
        let pump_h: Vec<f64> = pump_q
            .iter()
            .map(|q| shut * (1.0 - (q / 5e-3) * (q / 5e-3)))
            .collect();
        let line = scenario(0).map_err(io::Error::other)?;
        let r = PumpCurve::new(&pump_q, &pump_h)
            .and_then(|p| line.operating_point(fluid, &p))
            .map(|o| {
                vec![
                    D(o.flow),
                    D(o.head),
                    D(o.flow_band.low),
                    D(o.flow_band.high),
                    D(o.head_band.low),
                    D(o.head_band.high),
                ]
            });
        emit(out, "line_operating_point", &[I(0), I(fi), I(pi as i64)], r)?;
    }
    let pair = [
        scenario(0).map_err(io::Error::other)?,
        scenario(1).map_err(io::Error::other)?,
    ];
    for total in [1e-3, 1e-2, -1e-3, f64::NAN] {
        let r =
            split_flow(&pair, fluid, total).map(|s| vec![D(s.flows[0]), D(s.flows[1]), D(s.head)]);
        emit(out, "line_split_flow", &[I(0), I(fi), D(total)], r)?;
        let r = split_flow(&pair, fluid, total).map(|s| {
            let (a, b) = (&s.flow_bands[0], &s.flow_bands[1]);
            vec![
                D(a.low),
                D(a.high),
                D(b.low),
                D(b.high),
                D(s.head_band.low),
                D(s.head_band.high),
            ]
        });
        emit(out, "line_split_bands", &[I(0), I(fi), D(total)], r)?;
    }
    let line = scenario(0).map_err(io::Error::other)?;
    for (li, limit) in [
        Limit::PressureLoss(5e4),
        Limit::Velocity(2.0),
        Limit::PressureLoss(-1.0),
    ]
    .into_iter()
    .enumerate()
    {
        for (table, sched) in [
            (None, ""),
            (Some(PipeTable::Steel), "40"),
            (Some(PipeTable::Pvc), "80"),
        ] {
            let r = line
                .size(fluid, 3e-3, limit, table.map(|t| (t, sched)))
                .map(|sz| {
                    let mut v = vec![D(sz.min_inside_diameter).owned()];
                    for c in [&sz.standard, &sz.standard_at_band] {
                        match c {
                            Some(c) => v.extend([
                                OwnedTok::S(c.size.nominal.clone()),
                                OwnedTok::D(c.size.inside_diameter),
                                OwnedTok::D(c.velocity),
                                OwnedTok::D(c.pressure_loss),
                                OwnedTok::D(c.pressure_loss_band.low),
                                OwnedTok::D(c.pressure_loss_band.high),
                            ]),
                            None => v.push(OwnedTok::S("-".into())),
                        }
                    }
                    v
                });
            let tname = table.map_or("-", |t| t.name());
            emit_owned(
                out,
                "line_size",
                &[
                    I(0),
                    I(fi),
                    I(li as i64),
                    S(tname),
                    S(if sched.is_empty() { "-" } else { sched }),
                ],
                r,
            )?;
        }
    }
    Ok(())
}

/// The pump line of the C, C++ and Python pump tests: a pump on H = 40 − 1.5e5 Q²
/// (11 points from 0 to 15 L/s, quadratic fit), a strainer K = 2.5 and a K = 12 on 50 mm,
/// a 15 m lift, 101 325 Pa at the inlet; its own flow with the pump's head and NPSH, and
/// the required head inside, beyond and reverse through the curve.
fn pumps(out: &mut impl Write) -> io::Result<()> {
    use Tok::{D, I};
    let q: Vec<f64> = (0..=10).map(|i| 0.015 * f64::from(i) / 10.0).collect();
    let h: Vec<f64> = q.iter().map(|q| 40.0 - 1.5e5 * q * q).collect();
    let build = || -> hydrograde::Result<Line> {
        let line = Line::new(vec![
            Element::Fitting(Fitting::k(2.5)?.with_diameter(0.05)?),
            Element::Pump(PumpCurve::fit(&q, &h, 2)?),
            Element::Fitting(Fitting::k(12.0)?.with_diameter(0.05)?),
            Element::rise(15.0)?,
        ])?;
        let o = line
            .options()
            .clone()
            .with_inlet_pressure(Some(101_325.0))?;
        line.set_options(o)
    };
    let line = build().map_err(io::Error::other)?;
    let fluids = [Fluid::new(998.2, 1.002e-3), Fluid::water(293.15, 2e5)];
    for (fi, fluid) in fluids.iter().enumerate() {
        let fluid = fluid.clone().map_err(io::Error::other)?;
        let r = line.pumped_flow(&fluid).map(|p| {
            vec![
                D(p.flow),
                D(p.pump_head),
                D(p.npsh_available.unwrap_or(0.0)),
                I(i64::from(p.npsh_available.is_some())),
            ]
        });
        emit(out, "pump_flow", &[I(fi as i64)], r)?;
        for flow in [0.005, 0.02, -0.001] {
            let r = line
                .required_head(&fluid, flow)
                .map(|(h, d)| vec![D(h), D(d)]);
            emit(out, "pump_eval", &[I(fi as i64), D(flow)], r)?;
        }
    }
    Ok(())
}
