//! The C ABI of hydrograde: thin `extern "C"` wrappers over the core crate.

use std::ffi::c_char;

/// Version string of the library, e.g. "0.1.0" (static, never freed). Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_version() -> *const c_char {
    concat!(env!("CARGO_PKG_VERSION"), "\0").as_ptr().cast()
}
