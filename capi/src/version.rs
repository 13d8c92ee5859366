//! The library and ABI versions.

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
}
