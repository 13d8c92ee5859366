//! The C ABI of hydrograde: thin `extern "C"` wrappers over the core crate.
//!
//! Every function returns an `int32_t` status (`HG_OK` = 0) and gives its results through
//! out-pointers; on failure the outputs are left untouched and `hg_last_error` gives the
//! message. Units are SI at every boundary. The header `include/hydrograde.h` is generated
//! from this crate by cbindgen; the doc comments here are its manual.
//!
//! Results are engineering estimates with stated uncertainty; designs must be checked by a
//! competent engineer against the codes and standards that apply where they are built.

#![allow(non_camel_case_types)]

// The modules mirror the core's, in the order of the header's topics (cbindgen writes
// the items in this order): status codes and errors, friction, fluids, sections,
// fittings, wall roughness and pipe sizes, straight pipes, lines (building, solving,
// sizing, parallel lines), line results, bands, units, warnings, version, threads.
mod ffi;

mod error;

mod friction;

mod fluid;

mod section;

mod fitting;

mod roughness;

mod sizes;

mod pipe;

mod line;
mod line_model;

mod network;

mod band_curve;

mod units;

mod warning;

mod version;

mod threads;

/// cbindgen:ignore
mod sheet;

pub use band_curve::*;
pub use error::*;
pub use ffi::{
    HG_ERR_BUFFER_TOO_SMALL, HG_ERR_INTERNAL, HG_ERR_INVALID, HG_ERR_NO_SOLUTION,
    HG_ERR_NOT_FINITE, HG_ERR_NULL_POINTER, HG_ERR_OUT_OF_RANGE, HG_ERR_UNKNOWN_NAME, HG_OK,
};
pub use fitting::*;
pub use fluid::*;
pub use friction::*;
pub use line::*;
pub use line_model::*;
pub use network::*;
pub use pipe::*;
pub use roughness::*;
pub use section::*;
pub use sheet::*;
pub use sizes::*;
pub use threads::*;
pub use units::*;
pub use version::*;
pub use warning::*;

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ffi::SizePrefixed;

    /// The smallest `struct_size` each growable struct accepts is the size of its first
    /// released layout (x86-64 and aarch64 Linux sizes, counted field by field). A field
    /// added at the end must not change these numbers, or old callers are rejected.
    #[cfg(target_pointer_width = "64")]
    #[test]
    fn min_sizes_are_the_first_layouts() {
        let pinned = [
            ("hg_friction_options", hg_friction_options::MIN_SIZE, 40),
            ("hg_friction", hg_friction::MIN_SIZE, 40),
            ("hg_pipe_flow", hg_pipe_flow::MIN_SIZE, 56),
            ("hg_monte_carlo", hg_monte_carlo::MIN_SIZE, 48),
            (
                "hg_uncertainty_options",
                hg_uncertainty_options::MIN_SIZE,
                72,
            ),
            ("hg_sizing", hg_sizing::MIN_SIZE, 144),
            ("hg_line_totals", hg_line_totals::MIN_SIZE, 152),
            ("hg_element_result", hg_element_result::MIN_SIZE, 144),
        ];
        for (name, got, want) in pinned {
            assert_eq!(got, want, "{name}");
        }
    }
}
