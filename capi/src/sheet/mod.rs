//! The spreadsheet layer: `hydro_*` exports with exactly the types a VBA `Declare` passes
//! (Double and Long by value, String as an ANSI `char *`, ranges as arrays), the calling
//! convention VBA needs (`extern "system"`: stdcall on 32-bit Windows, the one convention
//! on 64-bit) and the error text of each call written into the caller's own buffer, so a
//! later call can never clear it.
//!
//! Every export returns a status (the `HG_*` codes) and takes, last, `msg` and `msg_len`:
//! a buffer of `msg_len` bytes that receives the message of a failure (empty on success),
//! cut to fit and always NUL-terminated.
//!
//! Text comes and goes in the Windows-1252 code page, the ANSI page VBA converts strings to
//! on Western systems, so "°C" arrives as the degree sign. A unit argument left empty
//! means the SI unit of that quantity.
//!
//! These exports are for the spreadsheet module (capi/excel/hydrograde.bas, generated from
//! capi/excel/spec.json) and are left out of hydrograde.h: C callers use the `hg_*` API.

mod exports;
mod text;

pub use exports::*;

use crate::ffi::{HG_ERR_INTERNAL, HG_ERR_INVALID, HG_ERR_NULL_POINTER, HG_OK, status_of};
use hydrograde::Error;
use hydrograde::line::rows::Cell;
use std::ffi::c_char;
use std::panic::{AssertUnwindSafe, catch_unwind};

/// Why a call failed: a status code and its message.
struct Fail {
    code: i32,
    message: String,
}

impl From<Error> for Fail {
    fn from(e: Error) -> Self {
        Fail {
            code: status_of(e.kind()),
            message: e.to_string(),
        }
    }
}

fn fail(code: i32, message: impl Into<String>) -> Fail {
    Fail {
        code,
        message: message.into(),
    }
}

type SheetResult<T = ()> = Result<T, Fail>;

/// Runs an export's body: catches panics and writes the outcome's message into `msg`.
fn run(msg: *mut c_char, msg_len: i32, body: impl FnOnce() -> SheetResult) -> i32 {
    let (code, message) = match catch_unwind(AssertUnwindSafe(body)) {
        Ok(Ok(())) => (HG_OK, String::new()),
        Ok(Err(f)) => (f.code, f.message),
        Err(_) => (
            HG_ERR_INTERNAL,
            "internal error in hydrograde (please report it)".to_string(),
        ),
    };
    // SAFETY: the caller's contract: `msg` is NULL or holds `msg_len` bytes.
    unsafe { text::write(&message, msg, msg_len) };
    code
}

/// Stores `value` through an out-pointer.
///
/// # Safety
/// `p` must be NULL or valid for writing one `T`.
unsafe fn put<T>(name: &str, p: *mut T, value: T) -> SheetResult {
    if p.is_null() || !p.is_aligned() {
        return Err(fail(
            HG_ERR_NULL_POINTER,
            format!("{name}: no place to store the result"),
        ));
    }
    // SAFETY: checked non-null and aligned; validity is the caller's contract.
    unsafe { p.write(value) };
    Ok(())
}

/// An ANSI text argument.
///
/// # Safety
/// `p` must be NULL or a NUL-terminated string.
unsafe fn arg_text(name: &str, p: *const c_char) -> SheetResult<String> {
    if p.is_null() {
        return Err(fail(HG_ERR_NULL_POINTER, format!("{name}: missing text")));
    }
    // SAFETY: forwarded contract.
    Ok(unsafe { text::read(p) })
}

/// A value given in `unit` (empty: the SI unit `si`) converted to `si`.
///
/// # Safety
/// `unit` must be NULL or a NUL-terminated string.
unsafe fn in_si(name: &str, value: f64, unit: *const c_char, si: &str) -> SheetResult<f64> {
    // SAFETY: forwarded contract.
    let u = unsafe { arg_text(&format!("{name} unit"), unit)? };
    if u.trim().is_empty() {
        return Ok(value);
    }
    hydrograde::convert(value, &u, si)
        .map_err(|e| fail(status_of(e.kind()), format!("{name}: {e}")))
}

/// A value in `si` converted to `unit` (empty: left in SI).
///
/// # Safety
/// `unit` must be NULL or a NUL-terminated string.
unsafe fn from_si(name: &str, value: f64, unit: *const c_char, si: &str) -> SheetResult<f64> {
    // SAFETY: forwarded contract.
    let u = unsafe { arg_text(&format!("{name} unit"), unit)? };
    if u.trim().is_empty() {
        return Ok(value);
    }
    hydrograde::convert(value, si, &u)
        .map_err(|e| fail(status_of(e.kind()), format!("{name}: {e}")))
}

/// Cell type codes of a packed range.
const CELL_BLANK: i32 = 0;
const CELL_NUMBER: i32 = 1;
const CELL_TEXT: i32 = 2;
/// Separator of the cell texts of a packed range (ASCII unit separator).
const CELL_SEPARATOR: char = '\u{1f}';
/// More rows than any route a sheet would hold; guards the array lengths.
const MAX_CELLS: i32 = 1_000_000;

/// A range packed by the VBA module: `rows` × `cols` cells in row order, each with a type
/// code (0 blank, 1 number, 2 text), its number (used when 1) and its text (the
/// `CELL_SEPARATOR`-joined `texts`, used when 2).
///
/// # Safety
/// `types` and `numbers` must be NULL or hold `rows * cols` elements; `texts` NULL or a
/// NUL-terminated string.
unsafe fn arg_cells(
    name: &str,
    rows: i32,
    cols: i32,
    types: *const i32,
    numbers: *const f64,
    texts: *const c_char,
) -> SheetResult<Vec<Vec<Cell>>> {
    if rows < 1 || cols < 1 || rows.saturating_mul(cols) > MAX_CELLS {
        return Err(fail(
            HG_ERR_INVALID,
            format!(
                "{name}: a range of {rows} x {cols} cells; expected at least one cell and at most {MAX_CELLS}"
            ),
        ));
    }
    if types.is_null() || numbers.is_null() || !types.is_aligned() || !numbers.is_aligned() {
        return Err(fail(HG_ERR_NULL_POINTER, format!("{name}: missing cells")));
    }
    let n = (rows * cols) as usize;
    // SAFETY: non-null, aligned, `n` elements by the caller's contract.
    let (types, numbers) = unsafe {
        (
            std::slice::from_raw_parts(types, n),
            std::slice::from_raw_parts(numbers, n),
        )
    };
    // SAFETY: forwarded contract.
    let joined = unsafe { arg_text(name, texts)? };
    let texts: Vec<&str> = joined.split(CELL_SEPARATOR).collect();
    if texts.len() != n {
        return Err(fail(
            HG_ERR_INVALID,
            format!("{name}: {} cell texts for {n} cells", texts.len()),
        ));
    }
    let mut out = Vec::with_capacity(rows as usize);
    for r in 0..rows as usize {
        let mut row = Vec::with_capacity(cols as usize);
        for c in 0..cols as usize {
            let i = r * cols as usize + c;
            row.push(match types[i] {
                CELL_BLANK => Cell::Blank,
                CELL_NUMBER => Cell::Number(numbers[i]),
                CELL_TEXT => Cell::Text(texts[i].to_string()),
                t => {
                    return Err(fail(
                        HG_ERR_INVALID,
                        format!(
                            "{name}: row {}, column {}: cell type {t}; expected 0, 1 or 2",
                            r + 1,
                            c + 1
                        ),
                    ));
                }
            });
        }
        out.push(row);
    }
    Ok(out)
}
