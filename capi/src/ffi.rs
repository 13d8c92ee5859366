//! The plumbing every entry point shares: status codes, the thread's last error message,
//! the panic guard and the pointer checks. An entry point is a call to [`guard`] around a
//! closure that checks its pointers with the helpers here and calls the core.

use hydrograde::error::{Error, ErrorKind};
use std::cell::RefCell;
use std::ffi::{CStr, c_char};
use std::panic::{AssertUnwindSafe, catch_unwind};

/// Success.
pub const HG_OK: i32 = 0;
/// A number that must be finite was NaN or ±infinity.
pub const HG_ERR_NOT_FINITE: i32 = 10;
/// A finite number outside its accepted range (or an unknown `HG_*` constant value).
pub const HG_ERR_OUT_OF_RANGE: i32 = 11;
/// A name (correlation, fitting, unit…) that the library does not know.
pub const HG_ERR_UNKNOWN_NAME: i32 = 12;
/// Input malformed as a whole: a zero length, an empty line, a string that is not UTF-8,
/// a struct whose `struct_size` is too small.
pub const HG_ERR_INVALID: i32 = 13;
/// The question has no answer (e.g. a head that no flow meets).
pub const HG_ERR_NO_SOLUTION: i32 = 20;
/// A pointer argument that must not be NULL was NULL (or was misaligned).
pub const HG_ERR_NULL_POINTER: i32 = 30;
/// A caller's buffer is too small for the result.
pub const HG_ERR_BUFFER_TOO_SMALL: i32 = 31;
/// A bug in hydrograde (a panic was caught at the boundary); please report it.
pub const HG_ERR_INTERNAL: i32 = 99;

/// Every status code with its name, as returned by `hg_status_name`.
pub(crate) const STATUS_NAMES: [(i32, &str); 9] = [
    (HG_OK, "HG_OK\0"),
    (HG_ERR_NOT_FINITE, "HG_ERR_NOT_FINITE\0"),
    (HG_ERR_OUT_OF_RANGE, "HG_ERR_OUT_OF_RANGE\0"),
    (HG_ERR_UNKNOWN_NAME, "HG_ERR_UNKNOWN_NAME\0"),
    (HG_ERR_INVALID, "HG_ERR_INVALID\0"),
    (HG_ERR_NO_SOLUTION, "HG_ERR_NO_SOLUTION\0"),
    (HG_ERR_NULL_POINTER, "HG_ERR_NULL_POINTER\0"),
    (HG_ERR_BUFFER_TOO_SMALL, "HG_ERR_BUFFER_TOO_SMALL\0"),
    (HG_ERR_INTERNAL, "HG_ERR_INTERNAL\0"),
];

/// The status code of a core error kind. The match is exhaustive on purpose: a new kind
/// in the core stops this crate from compiling until it has a code.
pub(crate) fn status_of(kind: ErrorKind) -> i32 {
    match kind {
        ErrorKind::NotFinite => HG_ERR_NOT_FINITE,
        ErrorKind::OutOfRange => HG_ERR_OUT_OF_RANGE,
        ErrorKind::UnknownName => HG_ERR_UNKNOWN_NAME,
        ErrorKind::Invalid => HG_ERR_INVALID,
        ErrorKind::NoSolution => HG_ERR_NO_SOLUTION,
    }
}

thread_local! {
    static LAST_ERROR: RefCell<String> = const { RefCell::new(String::new()) };
}

/// Runs `f` with the thread's last error message.
pub(crate) fn with_last_error<R>(f: impl FnOnce(&str) -> R) -> R {
    LAST_ERROR.with(|m| f(&m.borrow()))
}

fn set_last_error(message: &str) {
    LAST_ERROR.with(|m| {
        let mut m = m.borrow_mut();
        m.clear();
        // Interior NULs would cut the C string short; a message never needs them.
        m.extend(message.chars().map(|c| if c == '\0' { ' ' } else { c }));
    });
}

/// Why an entry point failed: a status code and its message.
#[derive(Debug)]
pub(crate) struct Fail {
    pub(crate) code: i32,
    pub(crate) message: String,
}

impl Fail {
    pub(crate) fn new(code: i32, message: impl Into<String>) -> Self {
        Fail {
            code,
            message: message.into(),
        }
    }
}

impl From<Error> for Fail {
    fn from(e: Error) -> Self {
        Fail::new(status_of(e.kind()), e.to_string())
    }
}

/// The result of an entry point's body.
pub(crate) type FfiResult<T = ()> = Result<T, Fail>;

/// Runs an entry point's body: clears the thread's last error, catches panics, and turns
/// the outcome into a status code (storing the message on failure).
pub(crate) fn guard(body: impl FnOnce() -> FfiResult) -> i32 {
    LAST_ERROR.with(|m| m.borrow_mut().clear());
    match catch_unwind(AssertUnwindSafe(body)) {
        Ok(Ok(())) => HG_OK,
        Ok(Err(fail)) => {
            set_last_error(&fail.message);
            fail.code
        }
        Err(payload) => {
            let what = payload
                .downcast_ref::<&str>()
                .map(|s| s.to_string())
                .or_else(|| payload.downcast_ref::<String>().cloned())
                .unwrap_or_else(|| "unknown panic".to_string());
            set_last_error(&format!("internal error (please report): {what}"));
            HG_ERR_INTERNAL
        }
    }
}

/// Like [`guard`] for entry points that return a value rather than a status; `fallback`
/// is returned if the body panics.
pub(crate) fn guard_value<T>(fallback: T, body: impl FnOnce() -> T) -> T {
    catch_unwind(AssertUnwindSafe(body)).unwrap_or(fallback)
}

fn null(name: &str) -> Fail {
    Fail::new(HG_ERR_NULL_POINTER, format!("{name}: must not be NULL"))
}

fn check_ptr<T>(name: &str, p: *const T) -> FfiResult {
    if p.is_null() {
        return Err(null(name));
    }
    if !p.is_aligned() {
        return Err(Fail::new(
            HG_ERR_NULL_POINTER,
            format!(
                "{name}: pointer {p:p} is not aligned to {} bytes",
                std::mem::align_of::<T>()
            ),
        ));
    }
    Ok(())
}

/// Checks an out-pointer and stores `value` through it.
///
/// # Safety
/// `p` must be NULL or valid for writing one `T`.
pub(crate) unsafe fn put<T>(name: &str, p: *mut T, value: T) -> FfiResult {
    check_ptr(name, p.cast_const())?;
    // SAFETY: non-null and aligned was checked; validity is the caller's contract.
    unsafe { p.write(value) };
    Ok(())
}

/// Checks that every out-pointer is usable before anything is computed, so a call with a
/// NULL among its outputs writes nothing.
pub(crate) fn check_outs(ptrs: &[(&str, *const u8, usize)]) -> FfiResult {
    for &(name, p, align) in ptrs {
        if p.is_null() {
            return Err(null(name));
        }
        if (p as usize) % align != 0 {
            return Err(Fail::new(
                HG_ERR_NULL_POINTER,
                format!("{name}: pointer {p:p} is not aligned to {align} bytes"),
            ));
        }
    }
    Ok(())
}

/// An entry for [`check_outs`].
pub(crate) fn out_ptr<T>(name: &str, p: *mut T) -> (&str, *const u8, usize) {
    (name, p.cast_const().cast(), std::mem::align_of::<T>())
}

pub(crate) fn check_len<T>(name: &str, p: *const T, n: usize) -> FfiResult {
    check_ptr(name, p)?;
    if n == 0 {
        return Err(Fail::new(
            HG_ERR_INVALID,
            format!("{name}: length is 0; pass at least one element"),
        ));
    }
    if n.checked_mul(std::mem::size_of::<T>())
        .is_none_or(|bytes| bytes > isize::MAX as usize)
    {
        return Err(Fail::new(
            HG_ERR_INVALID,
            format!("{name}: length {n} is larger than any array can be"),
        ));
    }
    Ok(())
}

/// Checks an input array and borrows it.
///
/// # Safety
/// `p` must be NULL or valid for reading `n` elements for the lifetime `'a`, and not be
/// written through while borrowed.
pub(crate) unsafe fn slice<'a, T>(name: &str, p: *const T, n: usize) -> FfiResult<&'a [T]> {
    check_len(name, p, n)?;
    // SAFETY: checked non-null, aligned, non-empty and within isize; the rest is the
    // caller's contract.
    Ok(unsafe { std::slice::from_raw_parts(p, n) })
}

/// Checks an output array and borrows it mutably.
///
/// # Safety
/// `p` must be NULL or valid for writing `n` elements for the lifetime `'a`, with no
/// other live reference to that memory.
pub(crate) unsafe fn slice_mut<'a, T>(name: &str, p: *mut T, n: usize) -> FfiResult<&'a mut [T]> {
    check_len(name, p.cast_const(), n)?;
    // SAFETY: as for `slice`, plus exclusivity, which the caller guarantees by passing
    // copies of any input that overlaps (see `overlaps`).
    Ok(unsafe { std::slice::from_raw_parts_mut(p, n) })
}

/// True when two arrays share memory (a caller may compute in place).
pub(crate) fn overlaps<T, U>(a: *const T, na: usize, b: *const U, nb: usize) -> bool {
    let (a0, b0) = (a as usize, b as usize);
    let a1 = a0.saturating_add(na.saturating_mul(std::mem::size_of::<T>()));
    let b1 = b0.saturating_add(nb.saturating_mul(std::mem::size_of::<U>()));
    a0 < b1 && b0 < a1
}

/// Checks a NUL-terminated UTF-8 string and borrows it.
///
/// # Safety
/// `p` must be NULL or point to a NUL-terminated string valid for `'a`.
pub(crate) unsafe fn c_str<'a>(name: &str, p: *const c_char) -> FfiResult<&'a str> {
    if p.is_null() {
        return Err(null(name));
    }
    // SAFETY: non-null; NUL termination is the caller's contract.
    let s = unsafe { CStr::from_ptr(p) };
    s.to_str()
        .map_err(|e| Fail::new(HG_ERR_INVALID, format!("{name}: not valid UTF-8 ({e})")))
}

/// A struct that starts with its own size (`size_t struct_size`), so it can grow.
///
/// # Safety
/// The implementor must be `#[repr(C)]` with a `usize` first field holding its size.
pub(crate) unsafe trait SizePrefixed: Copy {
    /// The size of the struct in its first release: the smallest `struct_size` accepted.
    /// It never changes when fields are added, so old callers keep working.
    const MIN_SIZE: usize;
}

/// The size of a `#[repr(C)]` struct that ends with `field` of type `ty`: the offset of
/// the field's end rounded up to the struct's alignment, i.e. `sizeof` of the struct as
/// it was when `field` was its last member.
pub(crate) const fn size_through(field_end: usize, align: usize) -> usize {
    field_end.div_ceil(align) * align
}

/// Implements [`SizePrefixed`] for a struct whose first released layout ended with
/// `$last: $ty`. Fields added later go after it and leave `MIN_SIZE` as it is (the
/// literal sizes on 64-bit targets are pinned by `min_sizes_are_the_first_layouts`).
macro_rules! sized {
    ($t:ty, $last:ident: $ty:ty) => {
        // SAFETY: repr(C), first field is the usize size.
        unsafe impl crate::ffi::SizePrefixed for $t {
            const MIN_SIZE: usize = crate::ffi::size_through(
                std::mem::offset_of!($t, $last) + std::mem::size_of::<$ty>(),
                std::mem::align_of::<$t>(),
            );
        }
    };
}
pub(crate) use sized;

/// Reads the `struct_size` of a caller's struct and checks it.
///
/// # Safety
/// `p` must be NULL or point to at least a readable `size_t`.
unsafe fn struct_size<T: SizePrefixed>(name: &str, p: *const T) -> FfiResult<usize> {
    check_ptr(name, p)?;
    // SAFETY: non-null and aligned; every `SizePrefixed` struct starts with a usize.
    let size = unsafe { p.cast::<usize>().read() };
    if size < T::MIN_SIZE {
        return Err(Fail::new(
            HG_ERR_INVALID,
            format!(
                "{name}->struct_size = {size}: must be at least {} (set it to sizeof the struct)",
                T::MIN_SIZE
            ),
        ));
    }
    Ok(size)
}

/// Reads a size-prefixed input struct: the fields the caller knows come from the caller,
/// later fields keep the values of `defaults`.
///
/// # Safety
/// `p` must be NULL or valid for reading `p->struct_size` bytes.
pub(crate) unsafe fn read_sized<T: SizePrefixed>(
    name: &str,
    p: *const T,
    defaults: T,
) -> FfiResult<T> {
    // SAFETY: forwarded contract.
    let size = unsafe { struct_size(name, p)? }.min(std::mem::size_of::<T>());
    let mut value = defaults;
    // SAFETY: both regions hold at least `size` bytes and do not overlap.
    unsafe {
        std::ptr::copy_nonoverlapping(p.cast::<u8>(), (&raw mut value).cast::<u8>(), size);
    }
    Ok(value)
}

/// Checks a size-prefixed output struct before anything is computed.
///
/// # Safety
/// `p` must be NULL or point to a readable `size_t`.
pub(crate) unsafe fn check_sized_out<T: SizePrefixed>(name: &str, p: *mut T) -> FfiResult {
    // SAFETY: forwarded contract.
    unsafe { struct_size(name, p.cast_const()) }.map(|_| ())
}

/// Writes a size-prefixed output struct: only the first `p->struct_size` bytes (the
/// fields the caller knows); the caller's `struct_size` is kept.
///
/// # Safety
/// `p` must be NULL or valid for writing `p->struct_size` bytes.
pub(crate) unsafe fn write_sized<T: SizePrefixed>(name: &str, p: *mut T, value: &T) -> FfiResult {
    // SAFETY: forwarded contract.
    let size = unsafe { struct_size(name, p.cast_const())? };
    let n = size.min(std::mem::size_of::<T>());
    let skip = std::mem::size_of::<usize>();
    // SAFETY: the caller's struct holds `size` ≥ `n` bytes; the source holds `n`.
    unsafe {
        std::ptr::copy_nonoverlapping(
            (value as *const T).cast::<u8>().add(skip),
            p.cast::<u8>().add(skip),
            n - skip,
        );
    }
    Ok(())
}

/// An out-of-range error for an `HG_*` constant argument.
pub(crate) fn bad_constant(name: &'static str, value: i32, family: &str, max: usize) -> Fail {
    Error::out_of_range(
        name,
        f64::from(value),
        format!("must be one of the {family} constants (0 to {})", max - 1),
    )
    .into()
}

/// An out-of-range error for a `size_t` argument, with the value printed exactly (a
/// `SIZE_MAX` would lose its last digits through a double).
pub(crate) fn size_out_of_range(name: &str, value: usize, rule: impl std::fmt::Display) -> Fail {
    Fail::new(HG_ERR_OUT_OF_RANGE, format!("{name} = {value}: {rule}"))
}

/// Item `index` of a list of names, or an out-of-range error that gives the count.
pub(crate) fn list_item<'a>(
    name: &'static str,
    list: &[&'a str],
    index: usize,
) -> FfiResult<&'a str> {
    list.get(index).copied().ok_or_else(|| {
        size_out_of_range(
            name,
            index,
            format!("must be less than {} (the number of entries)", list.len()),
        )
    })
}

/// Copies name `index` of `list` into a caller's buffer as [`copy_name`], or fails with
/// an out-of-range error that gives the count: the body of every `hg_*_name` listing.
///
/// # Safety
/// As [`copy_name`].
pub(crate) unsafe fn copy_list_item(
    list: &[&str],
    index: usize,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> FfiResult {
    check_outs(&[out_ptr("needed", needed)])?;
    let name = list_item("index", list, index)?;
    // SAFETY: forwarded contract.
    unsafe { copy_name(name, buf, len, needed) }
}

/// Copies `s` into a caller's buffer like `snprintf` and stores its full length.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes; `needed` NULL or writable.
pub(crate) unsafe fn copy_name(
    s: &str,
    buf: *mut c_char,
    len: usize,
    needed: *mut usize,
) -> FfiResult {
    check_outs(&[out_ptr("needed", needed)])?;
    if len > 0 && buf.is_null() {
        return Err(null("buf"));
    }
    if len > 0 {
        let n = s.len().min(len - 1);
        // SAFETY: `buf` holds `len` > n bytes by the caller's contract.
        unsafe {
            std::ptr::copy_nonoverlapping(s.as_ptr(), buf.cast::<u8>(), n);
            buf.add(n).write(0);
        }
    }
    // SAFETY: checked above.
    unsafe { put("needed", needed, s.len())? };
    if s.len() >= len {
        return Err(Fail::new(
            HG_ERR_BUFFER_TOO_SMALL,
            format!(
                "buf: {len} bytes hold less than \"{s}\" and its NUL ({} bytes)",
                s.len() + 1
            ),
        ));
    }
    Ok(())
}

/// Checks a handle argument and borrows it.
///
/// # Safety
/// `p` must be NULL or a live handle made by this library.
pub(crate) unsafe fn handle<'a, T>(name: &str, p: *const T) -> FfiResult<&'a T> {
    check_ptr(name, p)?;
    // SAFETY: non-null and aligned; liveness is the caller's contract.
    Ok(unsafe { &*p })
}

/// Checks a handle argument and borrows it mutably.
///
/// # Safety
/// `p` must be NULL or a live handle made by this library, used by no other thread.
pub(crate) unsafe fn handle_mut<'a, T>(name: &str, p: *mut T) -> FfiResult<&'a mut T> {
    check_ptr(name, p.cast_const())?;
    // SAFETY: non-null and aligned; liveness and exclusivity are the caller's contract.
    Ok(unsafe { &mut *p })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_error_kind_has_a_distinct_code_and_name() {
        let mut seen = Vec::new();
        for kind in ErrorKind::ALL {
            let code = status_of(kind);
            assert_ne!(code, HG_OK);
            assert!(!seen.contains(&code), "{kind:?} shares code {code}");
            seen.push(code);
            let named = STATUS_NAMES.iter().find(|(c, _)| *c == code);
            let (_, name) = named.unwrap_or_else(|| panic!("code {code} has no name"));
            // The C name is the core's kind name in upper case.
            assert_eq!(
                name.trim_end_matches('\0'),
                format!("HG_ERR_{}", kind.name().to_uppercase())
            );
        }
    }

    #[test]
    fn status_codes_are_distinct() {
        for (i, (a, na)) in STATUS_NAMES.iter().enumerate() {
            assert!(na.ends_with('\0'));
            for (b, _) in &STATUS_NAMES[i + 1..] {
                assert_ne!(a, b);
            }
        }
    }

    #[test]
    fn guard_maps_errors_and_panics() {
        let code = guard(|| Err(Error::out_of_range("re", -1.0, "must be greater than 0").into()));
        assert_eq!(code, HG_ERR_OUT_OF_RANGE);
        with_last_error(|m| assert_eq!(m, "re = -1: must be greater than 0"));
        let code = guard(|| panic!("boom"));
        assert_eq!(code, HG_ERR_INTERNAL);
        with_last_error(|m| assert!(m.contains("boom")));
        assert_eq!(guard(|| Ok(())), HG_OK);
        with_last_error(|m| assert!(m.is_empty()));
    }

    #[test]
    fn overlap_detection() {
        let v = [0.0f64; 8];
        let p = v.as_ptr();
        assert!(overlaps(p, 4, p.wrapping_add(3), 4));
        assert!(!overlaps(p, 4, p.wrapping_add(4), 4));
        assert!(overlaps(p, 8, p, 1));
    }
}
