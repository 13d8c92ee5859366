//! Version, status names, the last error message and warning names.

use crate::ffi::{self, STATUS_NAMES};
use hydrograde::Warnings;
use std::ffi::c_char;

/// Major version of the library (from Cargo.toml; the build fails if they disagree).
pub const HG_VERSION_MAJOR: u32 = 0;
/// Minor version of the library (from Cargo.toml; the build fails if they disagree).
pub const HG_VERSION_MINOR: u32 = 1;
/// Patch version of the library (from Cargo.toml; the build fails if they disagree).
pub const HG_VERSION_PATCH: u32 = 0;
/// ABI version: the number in the shared library's SONAME (`libhydrograde.so.<abi>`).
/// While the library is 0.x it counts the incompatible changes of the C ABI on its own
/// (from 1.0 on it will equal the major version). ABI 1 (library 0.1): `hg_line_evaluate`
/// returns an `hg_line_result` handle read by the `hg_line_result_*` accessors, and the
/// accessors that evaluated the line again (`hg_line_element`, `hg_line_element_label`,
/// `hg_line_band_source`, `hg_line_element_band_source`) are gone. A program compiled
/// against this header should check `hg_abi_version() == HG_ABI_VERSION` at start-up.
pub const HG_ABI_VERSION: u32 = 1;

/// Parses a decimal version component at compile time.
const fn parse_u32(s: &str) -> u32 {
    let b = s.as_bytes();
    let mut i = 0;
    let mut v = 0u32;
    while i < b.len() {
        assert!(b[i].is_ascii_digit(), "version component is not a number");
        v = v * 10 + (b[i] - b'0') as u32;
        i += 1;
    }
    v
}

// The header's version macros are these literals (cbindgen cannot read Cargo.toml), so the
// build refuses to go on when Cargo.toml's version moves without them.
const _: () = assert!(HG_VERSION_MAJOR == parse_u32(env!("CARGO_PKG_VERSION_MAJOR")));
const _: () = assert!(HG_VERSION_MINOR == parse_u32(env!("CARGO_PKG_VERSION_MINOR")));
const _: () = assert!(HG_VERSION_PATCH == parse_u32(env!("CARGO_PKG_VERSION_PATCH")));
// The SONAME comes from the same number (build.rs reads it from this file).
const _: () = assert!(HG_ABI_VERSION == parse_u32(env!("HG_ABI_VERSION")));
const _: () = assert!(HG_VERSION_MAJOR == 0 || HG_ABI_VERSION == HG_VERSION_MAJOR);

// The core's bits, typed as literals for cbindgen; a test checks them against the core.

/// The Reynolds number lies outside the published range of the correlation.
pub const HG_WARN_REYNOLDS_OUT_OF_RANGE: u32 = 1;
/// The relative roughness lies outside the published range of the correlation.
pub const HG_WARN_ROUGHNESS_OUT_OF_RANGE: u32 = 2;
/// Transitional flow: the friction factor is not well defined; its band spans both regimes.
pub const HG_WARN_TRANSITIONAL_FLOW: u32 = 4;
/// A non-circular section: turbulent results on the hydraulic diameter are less accurate.
pub const HG_WARN_NON_CIRCULAR_SECTION: u32 = 8;
/// A gas whose pressure loss exceeds 10 % of the inlet pressure: results are approximate.
pub const HG_WARN_GAS_COMPRESSIBILITY: u32 = 16;
/// The pressure falls below the vapour pressure: cavitation or flashing is likely.
pub const HG_WARN_BELOW_VAPOUR_PRESSURE: u32 = 32;
/// A fitting or equipment value used outside the range its data covers.
pub const HG_WARN_FITTING_OUT_OF_RANGE: u32 = 64;
/// The bore changes between two elements with no contraction or expansion element: the
/// change is counted as an abrupt contraction or expansion row of its own.
pub const HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION: u32 = 128;

/// The library version as a static string, e.g. "0.1.0" (never freed; never NULL).
/// Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_version() -> *const c_char {
    concat!(env!("CARGO_PKG_VERSION"), "\0").as_ptr().cast()
}

/// The ABI version of the loaded library; compare with `HG_ABI_VERSION`. Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_abi_version() -> u32 {
    HG_ABI_VERSION
}

/// The name of a status code as a static string, e.g. "HG_ERR_OUT_OF_RANGE"; for a code
/// that is not one of the `HG_*` status codes, "HG_UNKNOWN_STATUS". Never NULL, never
/// freed. Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_status_name(status: i32) -> *const c_char {
    STATUS_NAMES
        .iter()
        .find(|(c, _)| *c == status)
        .map_or("HG_UNKNOWN_STATUS\0", |(_, n)| n)
        .as_ptr()
        .cast()
}

/// The message of the last failed call on the calling thread, e.g.
/// "re = -1: must be greater than 0" (empty when the thread's last call succeeded).
///
/// Copies at most `len - 1` bytes of UTF-8 and a terminating NUL into `buf` (nothing when
/// `buf` is NULL or `len` is 0) and returns the message's full length in bytes, without
/// the NUL, like `snprintf`: a return value ≥ `len` means the copy was cut short.
/// Does not change the thread's last error. Thread-safe: each thread has its own message.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_last_error(buf: *mut c_char, len: usize) -> usize {
    ffi::guard_value(0, || {
        ffi::with_last_error(|msg| {
            if !buf.is_null() && len > 0 {
                let mut n = msg.len().min(len - 1);
                // Never cut a UTF-8 character in half.
                while !msg.is_char_boundary(n) {
                    n -= 1;
                }
                // SAFETY: `buf` holds `len` > n bytes by the caller's contract.
                unsafe {
                    std::ptr::copy_nonoverlapping(msg.as_ptr(), buf.cast::<u8>(), n);
                    buf.add(n).write(0);
                }
            }
            msg.len()
        })
    })
}

/// The name of one warning bit (`HG_WARN_*`) as a static string, e.g.
/// "transitional_flow"; NULL when `bit` is not exactly one known warning bit.
/// Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_warning_name(bit: u32) -> *const c_char {
    const NAMES: [&str; 8] = [
        "reynolds_out_of_range\0",
        "roughness_out_of_range\0",
        "transitional_flow\0",
        "non_circular_section\0",
        "gas_compressibility\0",
        "below_vapour_pressure\0",
        "fitting_out_of_range\0",
        "bore_change_without_transition\0",
    ];
    Warnings::ALL
        .iter()
        .zip(NAMES)
        .find(|((w, _), _)| w.bits() == bit)
        .map_or(std::ptr::null(), |(_, n)| n.as_ptr().cast())
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::ffi::CStr;

    #[test]
    fn version_matches_cargo() {
        // SAFETY: static NUL-terminated string.
        let v = unsafe { CStr::from_ptr(hg_version()) }.to_str().unwrap();
        assert_eq!(v, hydrograde::VERSION);
        assert_eq!(
            v,
            format!("{HG_VERSION_MAJOR}.{HG_VERSION_MINOR}.{HG_VERSION_PATCH}")
        );
        assert_eq!(hg_abi_version(), HG_ABI_VERSION);
    }

    #[test]
    fn warning_constants_and_names_follow_the_core() {
        let ours = [
            HG_WARN_REYNOLDS_OUT_OF_RANGE,
            HG_WARN_ROUGHNESS_OUT_OF_RANGE,
            HG_WARN_TRANSITIONAL_FLOW,
            HG_WARN_NON_CIRCULAR_SECTION,
            HG_WARN_GAS_COMPRESSIBILITY,
            HG_WARN_BELOW_VAPOUR_PRESSURE,
            HG_WARN_FITTING_OUT_OF_RANGE,
            HG_WARN_BORE_CHANGE_WITHOUT_TRANSITION,
        ];
        assert_eq!(
            ours.len(),
            Warnings::ALL.len(),
            "a core warning has no HG_WARN_*"
        );
        for (bit, (w, name)) in ours.iter().zip(Warnings::ALL) {
            assert_eq!(*bit, w.bits());
            // SAFETY: static NUL-terminated string.
            let got = unsafe { CStr::from_ptr(hg_warning_name(*bit)) };
            assert_eq!(got.to_str().unwrap(), name);
        }
        assert!(hg_warning_name(0).is_null());
        assert!(hg_warning_name(3).is_null());
    }

    #[test]
    fn last_error_copies_like_snprintf() {
        // SAFETY: NULL is rejected.
        let code = unsafe { crate::hg_darcy_factor(-1.0, 0.0, 0, std::ptr::null_mut()) };
        assert_eq!(code, crate::HG_ERR_NULL_POINTER);
        let mut f = 0.0;
        // SAFETY: valid out-pointer.
        let code = unsafe { crate::hg_darcy_factor(-1.0, 0.0, 0, &mut f) };
        assert_eq!(code, crate::HG_ERR_OUT_OF_RANGE);
        // SAFETY: NULL with 0 is allowed.
        let full = unsafe { hg_last_error(std::ptr::null_mut(), 0) };
        assert_eq!(full, "re = -1: must be greater than 0".len());
        let mut buf = [1 as c_char; 6];
        // SAFETY: buf holds 6 bytes.
        let n = unsafe { hg_last_error(buf.as_mut_ptr(), buf.len()) };
        assert_eq!(n, full);
        // SAFETY: NUL-terminated by hg_last_error.
        let got = unsafe { CStr::from_ptr(buf.as_ptr()) };
        assert_eq!(got.to_str().unwrap(), "re = ");
    }
}
