//! Prints the Rust core's results on a fixed grid of inputs, one per line, with every
//! double as the 16 hex digits of its bits, so the C, C++ and Python tests can check that
//! the C ABI gives the same numbers bit for bit.
//!
//! Line formats (fields separated by one space):
//! - `darcy <correlation> <re> <rel_roughness> <f> <df_dre> <df_drel_roughness> <regime> <warnings>`
//! - `darcy_err <correlation> <re> <rel_roughness> <error kind name>`
//!
//! Run: `cargo run --release -p hydrograde-capi --example core_reference > FILE`.

use hydrograde::friction::{Correlation, Options, Regime, darcy_factor};
use std::io::{self, BufWriter, Write};

fn hex(x: f64) -> String {
    format!("{:016x}", x.to_bits())
}

fn regime(r: Regime) -> u32 {
    match r {
        Regime::Laminar => 0,
        Regime::Transitional => 1,
        Regime::Turbulent => 2,
    }
}

fn main() -> io::Result<()> {
    let mut out = BufWriter::new(io::stdout().lock());
    // Reynolds numbers from 10 to 1e10, 12 per decade, plus the regime limits themselves
    // and points inside the transitional band; roughness from smooth to very rough,
    // including values outside every correlation's range and invalid ones.
    let mut res: Vec<f64> = (0..=108)
        .map(|i| 10f64.powf(1.0 + i as f64 / 12.0))
        .collect();
    res.extend([
        2300.0, 2300.5, 3000.0, 3999.0, 4000.0, 4000.5, -5.0, 0.0, 1e14,
    ]);
    let rrs = [
        0.0, 1e-7, 1e-6, 1e-5, 1e-4, 1e-3, 5e-3, 1e-2, 0.05, 0.1, 0.5, 0.6, -1e-4,
    ];
    for (ci, c) in Correlation::ALL.iter().enumerate() {
        let opts = Options::with_correlation(*c);
        for &re in &res {
            for &rr in &rrs {
                match darcy_factor(re, rr, &opts) {
                    Ok(fr) => writeln!(
                        out,
                        "darcy {ci} {} {} {} {} {} {} {}",
                        hex(re),
                        hex(rr),
                        hex(fr.f),
                        hex(fr.df_dre),
                        hex(fr.df_drel_roughness),
                        regime(fr.regime),
                        fr.warnings.bits()
                    )?,
                    Err(e) => writeln!(
                        out,
                        "darcy_err {ci} {} {} {}",
                        hex(re),
                        hex(rr),
                        e.kind().name()
                    )?,
                }
            }
        }
    }
    out.flush()
}
