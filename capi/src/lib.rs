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

mod correlation;
mod ffi;
mod fitting;
mod fluid;
mod friction;
mod line;
mod line_band;
mod line_eval;
mod line_more;
mod line_solve;
mod materials;
mod meta;
mod pipe;
mod section;
mod threads;
mod units;

pub use correlation::*;
pub use ffi::{
    HG_ERR_BUFFER_TOO_SMALL, HG_ERR_INTERNAL, HG_ERR_INVALID, HG_ERR_NO_SOLUTION,
    HG_ERR_NOT_FINITE, HG_ERR_NULL_POINTER, HG_ERR_OUT_OF_RANGE, HG_ERR_UNKNOWN_NAME, HG_OK,
};
pub use fitting::*;
pub use fluid::*;
pub use friction::*;
pub use line::*;
pub use line_band::*;
pub use line_eval::*;
pub use line_more::*;
pub use line_solve::*;
pub use materials::*;
pub use meta::*;
pub use pipe::*;
pub use section::*;
pub use threads::*;
pub use units::*;
