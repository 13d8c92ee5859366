//! The last few friction factors this thread solved, so that the pipes of one route that
//! share a bore, a roughness and the flow (the usual case: a route is a few sizes of one
//! material, each in many runs) solve their correlation once per evaluation instead of
//! once per pipe. The factor is a pure function of (Re, ε/D, options), so a remembered
//! one is the same bits as a new solve; errors are never remembered.

use super::{Correlation, Friction, Options, Regime, Transition, factor_checked};
use crate::error::Result;
use crate::warning::Warnings;
use std::cell::RefCell;

/// Entries kept: a band asks three values of each pipe kind (its state and the two ends of
/// its roughness range), and a route rarely alternates between more than two or three
/// kinds.
const SLOTS: usize = 8;

/// The entries, key by key, so that a miss costs a few integer compares. A Reynolds
/// number of 0 (never a valid input) marks an empty slot.
struct Memo {
    re: [u64; SLOTS],
    rr: [u64; SLOTS],
    opts: [Options; SLOTS],
    value: [Friction; SLOTS],
    /// The slot the next new entry replaces (round robin).
    next: usize,
}

const NO_OPTIONS: Options = Options {
    correlation: Correlation::Colebrook,
    laminar_constant: 64.0,
    laminar_limit: 2300.0,
    turbulent_limit: 4000.0,
    transition: Transition::Blend,
};

const NO_VALUE: Friction = Friction {
    f: 0.0,
    df_dre: 0.0,
    df_drel_roughness: 0.0,
    regime: Regime::Laminar,
    warnings: Warnings::NONE,
};

thread_local! {
    static MEMO: RefCell<Memo> = const {
        RefCell::new(Memo {
            re: [0; SLOTS],
            rr: [0; SLOTS],
            opts: [NO_OPTIONS; SLOTS],
            value: [NO_VALUE; SLOTS],
            next: 0,
        })
    };
}

/// [`factor_checked`] (for inputs that pass [`super::inputs_ok`] and
/// [`super::options_ok`]) through this thread's memo: the same result, bit for bit.
///
/// # Errors
/// As [`factor_checked`].
#[inline]
pub(crate) fn factor_remembered(re: f64, rel_roughness: f64, opts: &Options) -> Result<Friction> {
    let (re_bits, rr_bits) = (re.to_bits(), rel_roughness.to_bits());
    let found = MEMO.with(|m| {
        let m = m.borrow();
        (0..SLOTS)
            .find(|&s| m.re[s] == re_bits && m.rr[s] == rr_bits && m.opts[s] == *opts)
            .map(|s| m.value[s])
    });
    if let Some(v) = found {
        return Ok(v);
    }
    let value = factor_checked(re, rel_roughness, opts)?;
    MEMO.with(|m| {
        let mut m = m.borrow_mut();
        let s = m.next;
        m.re[s] = re_bits;
        m.rr[s] = rr_bits;
        m.opts[s] = *opts;
        m.value[s] = value;
        m.next = (s + 1) % SLOTS;
    });
    Ok(value)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_remembered_factor_is_the_solved_one_bit_for_bit() {
        // Exact check: the memo returns what factor_checked returns, for repeated, new and
        // interleaved inputs (more kinds than slots), and a miss after eviction solves again.
        let opts = Options::default();
        let points: Vec<(f64, f64)> = (0..SLOTS + 3)
            .map(|i| (3e3 * 1.9f64.powi(i as i32), 1e-5 * 2.3f64.powi(i as i32)))
            .collect();
        for round in 0..3 {
            for &(re, rr) in points.iter().cycle().skip(round).take(3 * SLOTS) {
                let a = factor_remembered(re, rr, &opts).unwrap();
                let b = factor_checked(re, rr, &opts).unwrap();
                assert_eq!(a.f.to_bits(), b.f.to_bits());
                assert_eq!(a.df_dre.to_bits(), b.df_dre.to_bits());
                assert_eq!(a, b);
            }
        }
        // Other options at the same point are another entry.
        let lam = Options {
            laminar_constant: 96.0,
            ..opts
        };
        let a = factor_remembered(3e3, 0.0, &lam).unwrap();
        assert_eq!(a, factor_checked(3e3, 0.0, &lam).unwrap());
        assert_ne!(a.f, factor_checked(3e3, 0.0, &opts).unwrap().f);
    }
}
