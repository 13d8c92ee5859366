//! Sets the SONAME of the shared library to `libhydrograde.so.<major>`, so programs bind
//! to an ABI version rather than to one release.

fn main() {
    println!("cargo:rerun-if-changed=build.rs");
    let os = std::env::var("CARGO_CFG_TARGET_OS").unwrap_or_default();
    let major = std::env::var("CARGO_PKG_VERSION_MAJOR").unwrap_or_else(|_| "0".into());
    if os == "linux" || os == "freebsd" || os == "netbsd" || os == "openbsd" {
        println!("cargo:rustc-cdylib-link-arg=-Wl,-soname,libhydrograde.so.{major}");
    }
}
