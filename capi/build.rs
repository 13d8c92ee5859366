//! Sets the SONAME of the shared library to `libhydrograde.so.<abi>`, so programs bind
//! to an ABI version rather than to one release. The ABI version is `HG_ABI_VERSION` in
//! src/version.rs (read here, so there is one number; version.rs checks it got the same).

fn main() {
    println!("cargo:rerun-if-changed=build.rs");
    println!("cargo:rerun-if-changed=src/version.rs");
    let meta = std::fs::read_to_string("src/version.rs").unwrap_or_default();
    let abi = meta
        .lines()
        .find_map(|l| l.strip_prefix("pub const HG_ABI_VERSION: u32 = "))
        .and_then(|rest| rest.strip_suffix(';'))
        .unwrap_or("unknown")
        .to_string();
    println!("cargo:rustc-env=HG_ABI_VERSION={abi}");
    let os = std::env::var("CARGO_CFG_TARGET_OS").unwrap_or_default();
    if os == "linux" || os == "freebsd" || os == "netbsd" || os == "openbsd" {
        println!("cargo:rustc-cdylib-link-arg=-Wl,-soname,libhydrograde.so.{abi}");
    }
}
