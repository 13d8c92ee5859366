//! Rows of the network solver: the invented grid of `hydrograde_benches::grid_network` at
//! about 1,000, 10,000 and 100,000 links, solved on one thread (the target: 100,000 links
//! in under 1 s on one core) and on all.

use super::table::{Row, Table};
use hydrograde_benches::{grid_network, grid_side, water};
use std::hint::black_box;
use std::time::{Duration, Instant};

/// Sizes of the grid, in links (about).
const SIZES: [usize; 3] = [1_000, 10_000, 100_000];

/// The fastest of `reps` solves, and the iterations one solve takes.
fn time_solve(net: &hydrograde::network::Network, reps: usize) -> Option<(Duration, usize)> {
    let w = water().ok()?;
    let iterations = match net.solve(&w) {
        Ok(s) => s.iterations,
        Err(e) => {
            eprintln!("network solve failed: {e}");
            return None;
        }
    };
    let best = (0..reps)
        .map(|_| {
            let t = Instant::now();
            let _ = black_box(net.solve(black_box(&w)));
            t.elapsed()
        })
        .min()?;
    Some((best, iterations))
}

/// Appends the network rows (ns per link; the whole solve and each iteration in the
/// row's text).
pub fn network_rows(t: &mut Table) {
    let threads_before = hydrograde::threads();
    for links in SIZES {
        let net = match grid_network(grid_side(links)) {
            Ok(n) => n,
            Err(e) => {
                eprintln!("network rows skipped: {e}");
                return;
            }
        };
        let n = net.links().len();
        let reps = if n > 50_000 { 3 } else { 7 };
        let counts = if threads_before > 1 {
            vec![1, threads_before]
        } else {
            vec![1]
        };
        for threads in counts {
            if hydrograde::set_threads(threads).is_err() {
                continue;
            }
            let Some((d, it)) = time_solve(&net, reps) else {
                continue;
            };
            let s = d.as_secs_f64();
            let per_link = s * 1e9 / n as f64;
            let what = format!(
                "network grid, {n} links, {threads} thread(s): {it} iterations, {:.1} ms per solve, {:.2} ms per iteration, per link",
                1e3 * s,
                1e3 * s / it.max(1) as f64
            );
            let target = (threads == 1 && n > 50_000).then_some(("< 1 s per solve", s < 1.0));
            t.push(Row::ratio(&what, per_link, "", f64::NAN, target));
        }
    }
    let _ = hydrograde::set_threads(threads_before);
}
