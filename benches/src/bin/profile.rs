//! One workload per run, for instruction counting under callgrind
//! (`scripts/profile.sh`): `profile <none|ln|colebrook|haaland|...|batch|batch:CORR:ISA|line> <points>`
//! (`none` only draws the points: its count is subtracted from the others).
//!
//! Counting instructions is reproducible on a busy machine where wall-clock timings are
//! not; the per-point count is the difference between two runs of different sizes, which
//! cancels start-up and point generation.

use hydrograde::band::UncertaintyOptions;
use hydrograde::fluid::Fluid;
use hydrograde::friction::{
    Correlation, Isa, Options, darcy_factor, darcy_factor_batch, darcy_factor_batch_on,
};
use hydrograde::line::split_flow;
use hydrograde_benches::{flows, line20, long_line, turbulent_points, water};
use std::hint::black_box;
use std::process::ExitCode;

fn main() -> ExitCode {
    let args: Vec<String> = std::env::args().collect();
    let (Some(what), Some(n)) = (args.get(1), args.get(2).and_then(|s| s.parse().ok())) else {
        eprintln!(
            "usage: profile <none|ln|batch|line|flow_for_head|bands|bands:plain|bands:split|CORRELATION> <points>"
        );
        return ExitCode::from(2);
    };
    let (re, rr) = turbulent_points(n, 2026);
    let mut out = vec![0.0; n];
    match what.as_str() {
        "none" => {}
        "ln" => {
            for (o, &r) in out.iter_mut().zip(&re) {
                *o = black_box(r).ln();
            }
        }
        "line" => {
            // One flow per point through the 20-element line (the system curve's work
            // per flow, on the calling thread).
            let (Ok(line), Ok(w)) = (line20(), water()) else {
                return ExitCode::FAILURE;
            };
            for (o, &q) in out.iter_mut().zip(&flows(n)) {
                *o = line
                    .required_head(&w, black_box(q))
                    .map_or(f64::NAN, |h| h.0);
            }
        }
        "flow_for_head" => {
            // One flow for a head per point through the 20-element line (band included),
            // heads spread over 4…60 m.
            let (Ok(line), Ok(w)) = (line20(), water()) else {
                return ExitCode::FAILURE;
            };
            for (k, o) in out.iter_mut().enumerate() {
                let head = 4.0 + 56.0 * (k % 97) as f64 / 96.0;
                *o = line
                    .flow_for_head(&w, black_box(head))
                    .map_or(f64::NAN, |s| s.flow);
            }
        }
        band if band.starts_with("bands") => {
            // `bands`, `bands:plain`, `bands:split`: one evaluation of a line of `n`
            // elements (with its bands; without any source; a two-branch split of two such
            // lines), so the count per point is the cost per element. Only `measured` is
            // counted (scripts/profile.sh turns callgrind on there): building the line is
            // not the workload.
            let Ok(w) = Fluid::water(288.15, 3e5) else {
                return ExitCode::FAILURE;
            };
            let (Ok(line), Ok(other)) = (long_line(n, 0.25), long_line(n, 0.2)) else {
                return ExitCode::FAILURE;
            };
            let bare = line
                .options()
                .clone()
                .with_uncertainty(UncertaintyOptions::none());
            let bare = bare.and_then(|o| line.set_options(o));
            let branches = [line.clone(), other];
            let r = match (band, bare) {
                ("bands", _) => {
                    measured(|| line.evaluate(&w, black_box(0.02)).map(|r| r.required_head))
                }
                ("bands:plain", Ok(bare)) => {
                    measured(|| bare.evaluate(&w, black_box(0.02)).map(|r| r.required_head))
                }
                ("bands:split", _) => {
                    measured(|| split_flow(&branches, &w, black_box(0.04)).map(|s| s.head))
                }
                _ => {
                    eprintln!("unknown workload {band}");
                    return ExitCode::from(2);
                }
            };
            out[0] = r.unwrap_or(f64::NAN);
        }
        name if name.starts_with("network:") => {
            // `network:<links>`: solve the invented grid of about that many links
            // `points` times (building it is counted too: subtract a run with 0 solves).
            let Some(side) = name[8..].parse().ok().map(hydrograde_benches::grid_side) else {
                eprintln!("unknown workload {name}");
                return ExitCode::from(2);
            };
            let (Ok(net), Ok(w)) = (hydrograde_benches::grid_network(side), water()) else {
                return ExitCode::FAILURE;
            };
            for o in out.iter_mut() {
                match net.solve(&w) {
                    Ok(s) => *o = s.iterations as f64,
                    Err(e) => {
                        eprintln!("{e}");
                        return ExitCode::FAILURE;
                    }
                }
            }
        }
        "batch" => {
            if let Err(e) = darcy_factor_batch(&re, &rr, &Options::default(), &mut out) {
                eprintln!("{e}");
                return ExitCode::FAILURE;
            }
        }
        name if name.starts_with("batch:") => {
            // `batch:<correlation>:<isa>`: the batch kernel on a chosen instruction set
            // (callgrind runs AVX2 at most).
            let mut parts = name.split(':').skip(1);
            let corr = parts.next().and_then(|c| c.parse::<Correlation>().ok());
            let isa = parts
                .next()
                .and_then(|i| Isa::ALL.into_iter().find(|x| x.name() == i));
            let (Some(corr), Some(isa)) = (corr, isa) else {
                eprintln!("unknown workload {name}");
                return ExitCode::from(2);
            };
            let opts = Options::with_correlation(corr);
            if let Err(e) = darcy_factor_batch_on(isa, &re, &rr, &opts, &mut out) {
                eprintln!("{e}");
                return ExitCode::FAILURE;
            }
        }
        name => {
            let Ok(corr) = name.parse::<Correlation>() else {
                eprintln!("unknown workload {name}");
                return ExitCode::from(2);
            };
            let opts = Options::with_correlation(corr);
            for ((o, &r), &e) in out.iter_mut().zip(&re).zip(&rr) {
                *o = darcy_factor(black_box(r), black_box(e), &opts).map_or(f64::NAN, |f| f.f);
            }
        }
    }
    println!("{}", black_box(out.iter().sum::<f64>()));
    ExitCode::SUCCESS
}

/// The part of a workload callgrind counts when asked to (`--toggle-collect`).
#[inline(never)]
fn measured<T>(f: impl FnOnce() -> T) -> T {
    f()
}
