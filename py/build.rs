//! Lets `cargo test -p hydrograde-py` link against libpython. maturin sets
//! `PYO3_BUILD_EXTENSION_MODULE` when it builds the wheel, which must not link libpython.

fn main() {
    println!("cargo:rerun-if-env-changed=PYO3_BUILD_EXTENSION_MODULE");
    if std::env::var_os("PYO3_BUILD_EXTENSION_MODULE").is_none() {
        pyo3_build_config::add_libpython_rpath_link_args();
    }
}
