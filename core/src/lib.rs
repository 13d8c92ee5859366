//! # hydrograde
//!
//! Pipe-flow friction and head loss: the Darcy–Weisbach equation with the Colebrook
//! equation solved exactly, explicit correlations, exact laminar solutions for
//! non-circular sections, minor losses, fluid properties, lines of pipe and fittings,
//! inverse solves, derivatives for solvers and uncertainty bands.
//!
//! Units are SI at every boundary: m, s, kg, Pa, K, m³/s, Pa·s, kg/m³. Flow is signed.
//!
//! **Safety.** Results are engineering estimates with stated uncertainty (the friction
//! correlations are good to about ±10 %, fitting data scatter more). Designs must be
//! checked by a competent engineer (licensed or registered where the law requires it)
//! against the codes and standards that apply where they are built.

// `unsafe` only in friction/kernel.rs (calls into code compiled for an instruction set
// the processor was checked to have); everywhere else it stays an error.
#![deny(unsafe_code)]
#![warn(missing_docs)]

// One module per domain; bindings mirror these names.
pub mod band;
pub mod error;
pub mod fitting;
pub mod fluid;
pub mod friction;
pub mod line;
pub mod math;
mod names;
pub mod network;
pub mod pipe;
pub mod roughness;
pub mod section;
pub mod sizes;
pub mod threads;
pub mod units;
pub mod warning;

pub use error::{Error, ErrorKind, Result};
pub use friction::{Correlation, Friction, Options, Regime, Transition, darcy_factor};
pub use warning::Warnings;
// Physical inputs: fluid, section, roughness, sizes.
pub use fluid::{Fluid, Phase};
pub use roughness::Material;
pub use section::{Section, Shape, TurbulentDiameter};
pub use sizes::{PipeSize, PipeTable};
// fitting (minor losses) and units
pub use fitting::{Edge, Fitting, Resistance};
pub use units::{STANDARD_GRAVITY, convert, convert_head};
// Lines, pipes and bands.
pub use band::{Band, Contribution, UncertaintyOptions};
pub use line::{
    Element, Equipment, Limit, Line, LineBuilder, LineOptions, LineResult, PumpCurve, PumpFit,
    Rise, Share, Shares, split_flow,
};
pub use pipe::Pipe;
pub use threads::{set_threads, threads};

/// The crate version, from Cargo.toml.
pub const VERSION: &str = env!("CARGO_PKG_VERSION");

/// The README's Rust examples, compiled and run as doctests.
#[doc = include_str!("../../README.md")]
#[cfg(doctest)]
pub struct ReadmeDoctests;
