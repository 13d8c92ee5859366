//! The `hydro_*` exports. Each converts its arguments, calls the core and converts back;
//! see the module documentation of `sheet` for the conventions shared by all.

use super::{SheetResult, arg_cells, arg_text, fail, from_si, in_si, put, run, text};
use crate::ffi::HG_ERR_INVALID;
use hydrograde::line::rows::{Cell, RowUnits, RowsLine, line_from_rows};
use hydrograde::{Correlation, Fitting, Fluid, Options, PipeTable, PumpCurve, sizes};
use std::ffi::c_char;

/// The library version, e.g. "0.1.0", into `out` (`out_len` bytes).
///
/// # Safety
/// `out` and `msg` must be NULL or hold `out_len` and `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_version(
    out: *mut c_char,
    out_len: i32,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        unsafe { text::write(hydrograde::VERSION, out, out_len) };
        Ok(())
    })
}

/// Darcy friction factor at Reynolds number `re` and relative roughness `rel_roughness`
/// with the named correlation (empty: the library's default, Colebrook).
///
/// # Safety
/// Strings NUL-terminated; `f` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_darcy_factor(
    re: f64,
    rel_roughness: f64,
    correlation: *const c_char,
    f: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let name = unsafe { arg_text("correlation", correlation)? };
        let mut opts = Options::default();
        if !name.trim().is_empty() {
            opts.correlation = name.parse::<Correlation>()?;
        }
        let fr = hydrograde::darcy_factor(re, rel_roughness, &opts)?;
        // SAFETY: forwarded contract.
        unsafe { put("f", f, fr.f) }
    })
}

/// The fluid of a property export: water or air at a temperature and absolute pressure.
unsafe fn fluid_at(
    air: bool,
    temperature: f64,
    temperature_unit: *const c_char,
    pressure: f64,
    pressure_unit: *const c_char,
) -> SheetResult<Fluid> {
    // SAFETY: forwarded contract.
    let (t, p) = unsafe {
        (
            in_si("temperature", temperature, temperature_unit, "K")?,
            in_si("pressure", pressure, pressure_unit, "Pa")?,
        )
    };
    Ok(if air {
        Fluid::air(t, p)?
    } else {
        Fluid::water(t, p)?
    })
}

/// Density (kg/m³) and dynamic viscosity (Pa·s) of liquid water at `temperature` (in
/// `temperature_unit`, empty: K) and absolute `pressure` (in `pressure_unit`, empty: Pa).
///
/// # Safety
/// Strings NUL-terminated; outputs writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_water(
    temperature: f64,
    temperature_unit: *const c_char,
    pressure: f64,
    pressure_unit: *const c_char,
    density: *mut f64,
    viscosity: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        unsafe {
            let w = fluid_at(
                false,
                temperature,
                temperature_unit,
                pressure,
                pressure_unit,
            )?;
            put("density", density, w.density())?;
            put("viscosity", viscosity, w.viscosity())
        }
    })
}

/// Density (kg/m³) and dynamic viscosity (Pa·s) of dry air, arguments as [`hydro_water`].
///
/// # Safety
/// Strings NUL-terminated; outputs writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_air(
    temperature: f64,
    temperature_unit: *const c_char,
    pressure: f64,
    pressure_unit: *const c_char,
    density: *mut f64,
    viscosity: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        unsafe {
            let a = fluid_at(true, temperature, temperature_unit, pressure, pressure_unit)?;
            put("density", density, a.density())?;
            put("viscosity", viscosity, a.viscosity())
        }
    })
}

/// `value` converted from unit `from_unit` to unit `to_unit`.
///
/// # Safety
/// Strings NUL-terminated; `result` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_convert(
    value: f64,
    from_unit: *const c_char,
    to_unit: *const c_char,
    result: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (a, b) = unsafe {
            (
                arg_text("from_unit", from_unit)?,
                arg_text("to_unit", to_unit)?,
            )
        };
        let r = hydrograde::convert(value, &a, &b)?;
        // SAFETY: forwarded contract.
        unsafe { put("result", result, r) }
    })
}

/// A pressure or a head of a liquid of `density` (kg/m³) converted from `from_unit` to `to_unit`.
///
/// # Safety
/// Strings NUL-terminated; `result` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_convert_head(
    value: f64,
    from_unit: *const c_char,
    to_unit: *const c_char,
    density: f64,
    result: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (a, b) = unsafe {
            (
                arg_text("from_unit", from_unit)?,
                arg_text("to_unit", to_unit)?,
            )
        };
        let r = hydrograde::convert_head(value, &a, &b, density)?;
        // SAFETY: forwarded contract.
        unsafe { put("result", result, r) }
    })
}

/// K of the catalogue fitting `fitting_name` at Reynolds number `re` in a bore of `bore` (in
/// `bore_unit`, empty: m), beside a pipe of relative roughness `pipe_rel_roughness`.
///
/// # Safety
/// Strings NUL-terminated; `k` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_fitting_k(
    fitting_name: *const c_char,
    re: f64,
    bore: f64,
    bore_unit: *const c_char,
    pipe_rel_roughness: f64,
    k: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (n, d) = unsafe {
            (
                arg_text("fitting_name", fitting_name)?,
                in_si("bore", bore, bore_unit, "m")?,
            )
        };
        let (kv, _) = Fitting::named(&n)?.k_at(re, d, pipe_rel_roughness)?;
        // SAFETY: forwarded contract.
        unsafe { put("k", k, kv) }
    })
}

/// Head loss (m of fluid) of a round pipe: `diameter` and `roughness` in `diameter_unit`,
/// `length` in `length_unit` (empty: m), fluid `density` (kg/m³) and `viscosity` (Pa·s),
/// signed `flow` in `flow_unit` (empty: m³/s).
///
/// # Safety
/// Strings NUL-terminated; `head_loss` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_pipe_head_loss(
    diameter: f64,
    roughness: f64,
    diameter_unit: *const c_char,
    length: f64,
    length_unit: *const c_char,
    density: f64,
    viscosity: f64,
    flow: f64,
    flow_unit: *const c_char,
    head_loss: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (d, e, l, q) = unsafe {
            (
                in_si("diameter", diameter, diameter_unit, "m")?,
                in_si("roughness", roughness, diameter_unit, "m")?,
                in_si("length", length, length_unit, "m")?,
                in_si("flow", flow, flow_unit, "m3/s")?,
            )
        };
        let pipe = hydrograde::Pipe::circular(d, l, e)?;
        let (h, _) = pipe.head_loss(&Fluid::new(density, viscosity)?, q)?;
        // SAFETY: forwarded contract.
        unsafe { put("head_loss", head_loss, h) }
    })
}

/// Typical absolute roughness of new pipe of the catalogue material `material`, in `unit`
/// (empty: m).
///
/// # Safety
/// Strings NUL-terminated; `roughness` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_roughness(
    material: *const c_char,
    unit: *const c_char,
    roughness: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let m = hydrograde::roughness::material(&unsafe { arg_text("material", material)? })?;
        // SAFETY: forwarded contract.
        unsafe {
            put(
                "roughness",
                roughness,
                from_si("roughness", m.typical, unit, "m")?,
            )
        }
    })
}

/// Inside diameter of a standard pipe (`table` e.g. "steel", `nominal` e.g. "1-1/2",
/// `schedule` e.g. "40"), in `unit` (empty: m).
///
/// # Safety
/// Strings NUL-terminated; `inside_diameter` writable; `msg` NULL or `msg_len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_pipe_inside_diameter(
    table: *const c_char,
    nominal: *const c_char,
    schedule: *const c_char,
    unit: *const c_char,
    inside_diameter: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (t, n, s) = unsafe {
            (
                arg_text("table", table)?,
                arg_text("nominal", nominal)?,
                arg_text("schedule", schedule)?,
            )
        };
        let size = sizes::lookup(t.parse::<PipeTable>()?, &n, &s)?;
        // SAFETY: forwarded contract.
        unsafe {
            let d = from_si("inside diameter", size.inside_diameter, unit, "m")?;
            put("inside_diameter", inside_diameter, d)
        }
    })
}

/// The line of a packed range of rows (see `line::rows` in the core), in the given units.
unsafe fn sheet_line(
    rows: i32,
    cols: i32,
    types: *const i32,
    numbers: *const f64,
    texts: *const c_char,
    diameter_unit: *const c_char,
    length_unit: *const c_char,
) -> SheetResult<RowsLine> {
    // SAFETY: forwarded contract.
    let (cells, du, lu) = unsafe {
        (
            arg_cells("rows", rows, cols, types, numbers, texts)?,
            arg_text("diameter unit", diameter_unit)?,
            arg_text("length unit", length_unit)?,
        )
    };
    let or_m = |u: &str| {
        if u.trim().is_empty() {
            "m".to_string()
        } else {
            u.to_string()
        }
    };
    let (du, lu) = (or_m(&du), or_m(&lu));
    let units = RowUnits {
        diameter: &du,
        length: &lu,
    };
    Ok(line_from_rows(&cells, &units)?)
}

/// Required head (m) of the line of a range of rows at `flow` (in `flow_unit`, empty:
/// m³/s) of a fluid of `density` (kg/m³) and `viscosity` (Pa·s), with the low and high
/// ends of its band and the source that dominates the band (into `dominant`).
///
/// # Safety
/// `types` and `numbers` hold `rows * cols` elements; strings NUL-terminated; outputs
/// writable; `dominant` and `msg` NULL or of their lengths.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_line_head(
    rows: i32,
    cols: i32,
    types: *const i32,
    numbers: *const f64,
    texts: *const c_char,
    diameter_unit: *const c_char,
    length_unit: *const c_char,
    density: f64,
    viscosity: f64,
    flow: f64,
    flow_unit: *const c_char,
    head: *mut f64,
    low: *mut f64,
    high: *mut f64,
    dominant: *mut c_char,
    dominant_len: i32,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (line, q) = unsafe {
            (
                sheet_line(
                    rows,
                    cols,
                    types,
                    numbers,
                    texts,
                    diameter_unit,
                    length_unit,
                )?,
                in_si("flow", flow, flow_unit, "m3/s")?,
            )
        };
        let r = line.line.evaluate(&Fluid::new(density, viscosity)?, q)?;
        let band = &r.required_head_band;
        let source = band
            .dominant()
            .map(|s| line.describe_source(&s.name()))
            .unwrap_or_default();
        // SAFETY: forwarded contract.
        unsafe {
            put("head", head, r.required_head)?;
            put("low", low, band.low)?;
            put("high", high, band.high)?;
            text::write(&source, dominant, dominant_len);
        }
        Ok(())
    })
}

/// Flow (in `flow_unit`, empty: m³/s) through the line of a range of rows under `head`
/// (m), with the low and high ends of its band.
///
/// # Safety
/// As [`hydro_line_head`].
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_line_flow(
    rows: i32,
    cols: i32,
    types: *const i32,
    numbers: *const f64,
    texts: *const c_char,
    diameter_unit: *const c_char,
    length_unit: *const c_char,
    density: f64,
    viscosity: f64,
    head: f64,
    flow_unit: *const c_char,
    flow: *mut f64,
    low: *mut f64,
    high: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let line = unsafe {
            sheet_line(
                rows,
                cols,
                types,
                numbers,
                texts,
                diameter_unit,
                length_unit,
            )?
        };
        let s = line
            .line
            .flow_for_head(&Fluid::new(density, viscosity)?, head)?;
        // SAFETY: forwarded contract.
        unsafe {
            put("flow", flow, from_si("flow", s.flow, flow_unit, "m3/s")?)?;
            put(
                "low",
                low,
                from_si("flow", s.flow_band.low, flow_unit, "m3/s")?,
            )?;
            put(
                "high",
                high,
                from_si("flow", s.flow_band.high, flow_unit, "m3/s")?,
            )
        }
    })
}

/// Operating point of a pump on the line of a range of rows: the pump curve is a range
/// of `pump_rows` × 2 cells (flow in `flow_unit`, empty: m³/s; head in m), packed like
/// the rows. Gives the flow (in `flow_unit`) and the head (m).
///
/// # Safety
/// As [`hydro_line_head`]; `pump_types` and `pump_numbers` hold `pump_rows * 2` elements.
#[unsafe(no_mangle)]
pub unsafe extern "system" fn hydro_line_operating_point(
    rows: i32,
    cols: i32,
    types: *const i32,
    numbers: *const f64,
    texts: *const c_char,
    diameter_unit: *const c_char,
    length_unit: *const c_char,
    density: f64,
    viscosity: f64,
    pump_rows: i32,
    pump_cols: i32,
    pump_types: *const i32,
    pump_numbers: *const f64,
    pump_texts: *const c_char,
    flow_unit: *const c_char,
    flow: *mut f64,
    head: *mut f64,
    msg: *mut c_char,
    msg_len: i32,
) -> i32 {
    run(msg, msg_len, || {
        // SAFETY: forwarded contract.
        let (line, pump) = unsafe {
            (
                sheet_line(
                    rows,
                    cols,
                    types,
                    numbers,
                    texts,
                    diameter_unit,
                    length_unit,
                )?,
                arg_cells(
                    "pump",
                    pump_rows,
                    pump_cols,
                    pump_types,
                    pump_numbers,
                    pump_texts,
                )?,
            )
        };
        if pump_cols != 2 {
            return Err(fail(
                HG_ERR_INVALID,
                format!("pump: {pump_cols} columns; expected 2 (flow, head)"),
            ));
        }
        let (mut flows, mut heads) = (Vec::new(), Vec::new());
        for (i, row) in pump.iter().enumerate() {
            let value = |c: usize| -> SheetResult<f64> {
                match &row[c] {
                    Cell::Number(v) => Ok(*v),
                    Cell::Text(t) => Err(fail(
                        HG_ERR_INVALID,
                        format!(
                            "pump: row {}, column {}: expected a number, got \"{t}\"",
                            i + 1,
                            c + 1
                        ),
                    )),
                    Cell::Blank => Err(fail(
                        HG_ERR_INVALID,
                        format!(
                            "pump: row {}, column {} is blank; expected a number",
                            i + 1,
                            c + 1
                        ),
                    )),
                }
            };
            let (q, h) = (value(0)?, value(1)?);
            // SAFETY: forwarded contract.
            flows.push(unsafe { in_si("pump flow", q, flow_unit, "m3/s")? });
            heads.push(h);
        }
        let curve = PumpCurve::new(&flows, &heads)?;
        let op = line
            .line
            .operating_point(&Fluid::new(density, viscosity)?, &curve)?;
        // SAFETY: forwarded contract.
        unsafe {
            put("flow", flow, from_si("flow", op.flow, flow_unit, "m3/s")?)?;
            put("head", head, op.head)
        }
    })
}
