//! Standard pipe sizes: dimensions by table, nominal size and schedule.

use crate::ffi::{self, guard, out_ptr, put};
use hydrograde::sizes::{self, PipeTable};
use std::ffi::c_char;

/// Dimensions of a standard pipe: `table` ("steel" ASME B36.10M, "stainless" ASME
/// B36.19M, "copper" ASTM B88, "pvc" ASTM D1785, "steel_en10220" EN 10220 / ISO 4200,
/// "stainless_iso1127" ISO 1127, "copper_en1057" EN 1057, "pe_iso4427" ISO 4427-2,
/// "pvc_iso1452" ISO 1452-2, "hygienic_bpe" ASME BPE, "hygienic_din11850" DIN 11850,
/// "hygienic_iso2037" ISO 2037; `hg_pipe_tables` lists them), `nominal` size as printed
/// ("2", "1-1/2", "3/4"; metric tube by outside diameter "60.3", plastic pipe by dn
/// "110") and `schedule`, tube type, SDR series or wall ("40", "STD", "10S", "K",
/// "SDR 11", "2.9"): outside diameter, wall thickness and inside diameter, all in m. For
/// plastic pipe the wall is the mean wall the standard's tolerance implies
/// (`hg_pipe_table_wall_rule`), and the inside diameter follows from it.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table, size or schedule not listed (the
/// message suggests close names and lists the known ones); `HG_ERR_INVALID` for a string
/// not UTF-8; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// The strings must be NULL or NUL-terminated; the outputs NULL or writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_size(
    table: *const c_char,
    nominal: *const c_char,
    schedule: *const c_char,
    outside_diameter: *mut f64,
    wall: *mut f64,
    inside_diameter: *mut f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        dimensions(outside_diameter, wall, inside_diameter, || {
            let (t, n, s) = (
                ffi::c_str("table", table)?,
                ffi::c_str("nominal", nominal)?,
                ffi::c_str("schedule", schedule)?,
            );
            Ok(sizes::lookup(t.parse::<PipeTable>()?, n, s)?)
        })
    }
}

/// Checks the three outputs, finds the size and writes its dimensions: the body of
/// `hg_pipe_size` and `hg_pipe_size_dn`.
///
/// # Safety
/// The outputs NULL or writable doubles; `find` may read the caller's strings.
unsafe fn dimensions(
    outside_diameter: *mut f64,
    wall: *mut f64,
    inside_diameter: *mut f64,
    find: impl FnOnce() -> ffi::FfiResult<sizes::PipeSize>,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("outside_diameter", outside_diameter),
            out_ptr("wall", wall),
            out_ptr("inside_diameter", inside_diameter),
        ])?;
        let p = find()?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("outside_diameter", outside_diameter, p.outside_diameter)?;
            put("wall", wall, p.wall)?;
            put("inside_diameter", inside_diameter, p.inside_diameter)
        }
    })
}

/// Dimensions of a metric tube by its nominal size `dn` (DN): `table` "steel_en10220" or
/// "stainless_iso1127" (series 1 outside diameters: DN 50 is 60.3 mm) or
/// "hygienic_din11850" (the series picks the outside diameter: DN 25 in series "2" is
/// 29 × 1.5 mm), `schedule` as `hg_pipe_size` (a wall "2.9", a series "2"): outside
/// diameter, wall thickness and inside diameter, all in m, the same as `hg_pipe_size`
/// with the row's outside diameter.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table that assigns no DN (the message
/// names those that do), a DN the table does not list (the message lists them) or a
/// schedule not made at that DN; `HG_ERR_INVALID` for a string not UTF-8;
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// The strings must be NULL or NUL-terminated; the outputs NULL or writable doubles.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_size_dn(
    table: *const c_char,
    dn: u32,
    schedule: *const c_char,
    outside_diameter: *mut f64,
    wall: *mut f64,
    inside_diameter: *mut f64,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe {
        dimensions(outside_diameter, wall, inside_diameter, || {
            let (t, s) = (
                ffi::c_str("table", table)?,
                ffi::c_str("schedule", schedule)?,
            );
            Ok(sizes::lookup_dn(t.parse::<PipeTable>()?, dn, s)?)
        })
    }
}

/// The smallest standard pipe of `table` in `schedule` (as `hg_pipe_size`) whose inside
/// diameter is at least `min_inside_diameter` (m, > 0): its inside diameter in
/// `*inside_diameter` (m) and its nominal size copied into `nominal` (at most `len - 1`
/// bytes and a NUL; full length in `*needed`).
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME`; `HG_ERR_NOT_FINITE`; `HG_ERR_OUT_OF_RANGE`
/// for a diameter ≤ 0 or larger than the table's largest; `HG_ERR_BUFFER_TOO_SMALL`
/// when the nominal size did not fit (the diameter is still written);
/// `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// The strings must be NULL or NUL-terminated; `nominal` NULL or valid for `len` bytes;
/// `needed` and `inside_diameter` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_size_at_least(
    table: *const c_char,
    schedule: *const c_char,
    min_inside_diameter: f64,
    inside_diameter: *mut f64,
    nominal: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[
            out_ptr("inside_diameter", inside_diameter),
            out_ptr("needed", needed),
        ])?;
        if len > 0 && nominal.is_null() {
            return Err(ffi::Fail::new(
                crate::HG_ERR_NULL_POINTER,
                "nominal: must not be NULL",
            ));
        }
        // SAFETY: forwarded contract.
        let (t, s) = unsafe {
            (
                ffi::c_str("table", table)?,
                ffi::c_str("schedule", schedule)?,
            )
        };
        let p = sizes::smallest_at_least(t.parse::<PipeTable>()?, s, min_inside_diameter)?;
        // SAFETY: forwarded contract; checked above.
        unsafe {
            put("inside_diameter", inside_diameter, p.inside_diameter)?;
            ffi::copy_name(&p.nominal, nominal, len, needed)
        }
    })
}

/// Copies name `index` (0-based) of a list into a caller's buffer for the entry points
/// below.
///
/// # Safety
/// As `ffi::copy_name`; `table` NULL or a NUL-terminated string.
unsafe fn table_item(
    table: *const c_char,
    list: fn(PipeTable) -> Vec<&'static str>,
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("needed", needed)])?;
        // SAFETY: forwarded contract.
        let t = unsafe { ffi::c_str("table", table)? }.parse::<PipeTable>()?;
        let name = ffi::list_item("index", &list(t), index)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_name(name, buf, len, needed) }
    })
}

/// Copies schedule (or tube type) number `index` (0-based, the table's order, e.g. "40",
/// "STD", "K") of pipe `table` (as `hg_pipe_size`) into `buf` (at most `len - 1` bytes and
/// a NUL) and stores its full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table; `HG_ERR_OUT_OF_RANGE` when `index`
/// is past the end (use it to count the schedules); `HG_ERR_BUFFER_TOO_SMALL` when the
/// name did not fit (the cut copy is still written); `HG_ERR_INVALID` for a table name
/// not UTF-8; `HG_ERR_NULL_POINTER` for a NULL `table` or `needed`, or a NULL `buf` with
/// `len` > 0. Thread-safe.
///
/// # Safety
/// `table` must be NULL or NUL-terminated; `buf` NULL or valid for writing `len` bytes;
/// `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_table_schedule(
    table: *const c_char,
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { table_item(table, |t| t.schedules().to_vec(), index, buf, len, needed) }
}

/// Copies nominal size number `index` (0-based, smallest first, as printed: "1/2", "2",
/// "1-1/2") of pipe `table` (as `hg_pipe_size`) into `buf` (at most `len - 1` bytes and a
/// NUL) and stores its full length in `*needed`. Not every size exists in every schedule.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table; `HG_ERR_OUT_OF_RANGE` when `index`
/// is past the end (use it to count the sizes); `HG_ERR_BUFFER_TOO_SMALL` when the name
/// did not fit (the cut copy is still written); `HG_ERR_INVALID` for a table name not
/// UTF-8; `HG_ERR_NULL_POINTER` for a NULL `table` or `needed`, or a NULL `buf` with
/// `len` > 0. Thread-safe.
///
/// # Safety
/// `table` must be NULL or NUL-terminated; `buf` NULL or valid for writing `len` bytes;
/// `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_table_nominal(
    table: *const c_char,
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { table_item(table, PipeTable::nominal_sizes, index, buf, len, needed) }
}

/// Copies the name of pipe table number `index` (0-based, a fixed order: "steel",
/// "stainless", "copper", "pvc", "steel_en10220", …) into `buf` (at most `len - 1` bytes
/// and a NUL) and stores its full length in `*needed`. The same list as Rust's
/// `sizes::pipe_tables()` and Python's `pipe_tables()`.
///
/// Returns `HG_OK`; `HG_ERR_OUT_OF_RANGE` when `index` is past the end (use it to count
/// the tables); `HG_ERR_BUFFER_TOO_SMALL` when the name did not fit (the cut copy is
/// still written); `HG_ERR_NULL_POINTER` for a NULL `needed`, or a NULL `buf` with
/// `len` > 0. Thread-safe.
///
/// # Safety
/// `buf` NULL or valid for writing `len` bytes; `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_tables(
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("needed", needed)])?;
        let names: Vec<&str> = sizes::pipe_tables().iter().map(|t| t.name()).collect();
        let name = ffi::list_item("index", &names, index)?;
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_name(name, buf, len, needed) }
    })
}

/// Copies the text of one property of pipe `table` into `buf`.
///
/// # Safety
/// As `ffi::copy_name`; `table` NULL or a NUL-terminated string.
unsafe fn table_text(
    table: *const c_char,
    text: fn(PipeTable) -> &'static str,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    guard(|| {
        ffi::check_outs(&[out_ptr("needed", needed)])?;
        // SAFETY: forwarded contract.
        let t = unsafe { ffi::c_str("table", table)? }.parse::<PipeTable>()?;
        // SAFETY: forwarded contract.
        unsafe { ffi::copy_name(text(t), buf, len, needed) }
    })
}

/// Copies the source of pipe `table` (as `hg_pipe_size`: the standard, and "from memory"
/// or what was checked against published copies) into `buf` (at most `len - 1` bytes and
/// a NUL) and stores its full length in `*needed`.
///
/// Returns `HG_OK`; `HG_ERR_UNKNOWN_NAME` for a table (the message suggests close
/// names); `HG_ERR_BUFFER_TOO_SMALL` when the text did not fit (the cut copy is still
/// written); `HG_ERR_INVALID` for a name not UTF-8; `HG_ERR_NULL_POINTER`. Thread-safe.
///
/// # Safety
/// `table` must be NULL or NUL-terminated; `buf` NULL or valid for writing `len` bytes;
/// `needed` NULL or writable.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_table_source(
    table: *const c_char,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { table_text(table, PipeTable::source, buf, len, needed) }
}

/// Copies how pipe `table` works out the wall its bore comes from (nominal wall, or for
/// plastic pipe the mean wall e_min + tolerance/2 with the tolerance rule and its source)
/// into `buf`, as `hg_pipe_table_source`.
///
/// Returns and thread-safety as `hg_pipe_table_source`.
///
/// # Safety
/// As `hg_pipe_table_source`.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_pipe_table_wall_rule(
    table: *const c_char,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> i32 {
    // SAFETY: forwarded contract.
    unsafe { table_text(table, PipeTable::wall_rule, buf, len, needed) }
}
