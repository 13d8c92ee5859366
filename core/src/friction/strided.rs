//! Friction factors over strided (and broadcast) inputs without copying them: the batch
//! for numpy views such as `re[:, None]` against `rr[None, :]`, where a stride of 0
//! repeats a value along an axis.
//!
//! Points are gathered a block at a time into small buffers on the stack and run through
//! the same per-thread batch as [`super::darcy_factor_batch`], so every value is the
//! scalar [`super::darcy_factor`] bit for bit, and the memory in use stays a few
//! kilobytes whatever the broadcast size.

use super::{Isa, Options, PARALLEL_THRESHOLD, batch_serial, darcy_factor};
use crate::error::{Error, Result};
use rayon::prelude::*;

/// Points gathered per block (two 4 KiB buffers).
const BLOCK: usize = 512;
/// Points per parallel task (a multiple of [`BLOCK`]).
const TASK: usize = 8 * BLOCK;

/// A read-only n-dimensional view of `data`: the element at multi-index `i` is
/// `data[offset + Σ i_k · strides[k]]`, strides counted in elements (0 repeats a value
/// along that axis; negative walks backwards).
#[derive(Debug, Clone, Copy)]
pub struct Strided<'a> {
    /// The memory the view reads.
    pub data: &'a [f64],
    /// Index in `data` of the element at multi-index 0.
    pub offset: usize,
    /// Step in `data` per step along each axis of the batch's shape.
    pub strides: &'a [isize],
}

impl Strided<'_> {
    /// Checks the view against `shape`: one stride per axis, every element inside `data`.
    fn check(&self, name: &'static str, shape: &[usize]) -> Result<()> {
        if self.strides.len() != shape.len() {
            return Err(Error::invalid(
                name,
                format!(
                    "has {} strides for a shape of {} axes",
                    self.strides.len(),
                    shape.len()
                ),
            ));
        }
        if shape.contains(&0) {
            return Ok(());
        }
        let (mut lo, mut hi) = (self.offset as i128, self.offset as i128);
        for (&d, &s) in shape.iter().zip(self.strides) {
            let reach = (d as i128 - 1) * s as i128;
            if reach < 0 {
                lo += reach;
            } else {
                hi += reach;
            }
        }
        if lo < 0 || hi >= self.data.len() as i128 {
            return Err(Error::invalid(
                name,
                format!(
                    "the view reaches elements {lo} to {hi} of a buffer of {}",
                    self.data.len()
                ),
            ));
        }
        Ok(())
    }

    /// Copies the elements at flat (C-order) indices `start..start + dst.len()` of
    /// `shape` into `dst`: a run along the innermost axis at a time (a fill for a
    /// broadcast axis, a slice copy for a contiguous one), then an odometer step of the
    /// outer axes.
    fn gather(&self, shape: &[usize], start: usize, dst: &mut [f64]) {
        let Some((&inner, outer)) = shape.split_last() else {
            dst.fill(self.data[self.offset]);
            return;
        };
        let step = self.strides[shape.len() - 1];
        let mut idx = [0usize; 32];
        let mut rest = start;
        let mut pos = self.offset as isize;
        for k in (0..shape.len()).rev() {
            idx[k] = rest % shape[k];
            rest /= shape[k];
            pos += idx[k] as isize * self.strides[k];
        }
        let mut done = 0;
        while done < dst.len() {
            let run = (inner - idx[shape.len() - 1]).min(dst.len() - done);
            let out = &mut dst[done..done + run];
            let p = pos as usize;
            match step {
                0 => out.fill(self.data[p]),
                1 => out.copy_from_slice(&self.data[p..p + run]),
                _ => {
                    for (j, d) in out.iter_mut().enumerate() {
                        *d = self.data[(pos + j as isize * step) as usize];
                    }
                }
            }
            done += run;
            if done == dst.len() {
                break;
            }
            // The run reached the end of the innermost axis: back to its start, and carry
            // into the outer axes.
            pos -= idx[shape.len() - 1] as isize * step;
            idx[shape.len() - 1] = 0;
            for k in (0..outer.len()).rev() {
                idx[k] += 1;
                pos += self.strides[k];
                if idx[k] < shape[k] {
                    break;
                }
                pos -= idx[k] as isize * self.strides[k];
                idx[k] = 0;
            }
        }
    }
}

/// Friction factors over the broadcast of two strided views: `out` in C order of `shape`
/// holds `darcy_factor(re[i], rel_roughness[i]).f` for every multi-index `i`, bit for bit,
/// without copying the inputs (numpy broadcasting is strides of 0). Threads and vector
/// units as [`super::darcy_factor_batch`].
///
/// ```
/// use hydrograde::friction::{darcy_factor, darcy_factor_batch_strided, Options, Strided};
/// // Three Reynolds numbers against two roughnesses: a 3 × 2 table, no copies.
/// let re = [1e4, 1e5, 1e6];
/// let rr = [1e-4, 1e-3];
/// let (a, b) = (
///     Strided { data: &re, offset: 0, strides: &[1, 0] },
///     Strided { data: &rr, offset: 0, strides: &[0, 1] },
/// );
/// let mut out = [0.0; 6];
/// darcy_factor_batch_strided(&a, &b, &[3, 2], &Options::default(), &mut out)?;
/// assert_eq!(out[3], darcy_factor(1e5, 1e-3, &Options::default())?.f);
/// # Ok::<(), hydrograde::Error>(())
/// ```
///
/// # Errors
/// [`Error::Invalid`] when a view does not fit `shape` or its buffer, when `shape` has
/// more than 32 axes, or `out` is not the size of `shape`; otherwise the error of the
/// first failing element in C order, wrapped in [`Error::AtIndex`] with its flat index.
pub fn darcy_factor_batch_strided(
    re: &Strided<'_>,
    rel_roughness: &Strided<'_>,
    shape: &[usize],
    opts: &Options,
    out: &mut [f64],
) -> Result<()> {
    if shape.len() > 32 {
        return Err(Error::invalid(
            "shape",
            format!("has {} axes; at most 32", shape.len()),
        ));
    }
    let n = shape.iter().try_fold(1usize, |a, &d| a.checked_mul(d));
    if n != Some(out.len()) {
        return Err(Error::invalid(
            "out",
            format!("has {} elements for a shape of {shape:?}", out.len()),
        ));
    }
    re.check("re", shape)?;
    rel_roughness.check("rel_roughness", shape)?;
    opts.validate()?;
    let isa = Isa::detected();
    let task = |start: usize, o: &mut [f64]| -> Result<()> {
        let (mut r, mut e) = ([0.0; BLOCK], [0.0; BLOCK]);
        for (b, chunk) in o.chunks_mut(BLOCK).enumerate() {
            let at = start + b * BLOCK;
            let len = chunk.len();
            re.gather(shape, at, &mut r[..len]);
            rel_roughness.gather(shape, at, &mut e[..len]);
            batch_serial(isa, &r[..len], &e[..len], opts, chunk, at)?;
        }
        Ok(())
    };
    if out.len() < PARALLEL_THRESHOLD {
        return task(0, out);
    }
    let parallel = crate::threads::in_pool(|| {
        out.par_chunks_mut(TASK)
            .enumerate()
            .try_for_each(|(c, o)| task(c * TASK, o))
    });
    match parallel {
        None => task(0, out),
        Some(Ok(())) => Ok(()),
        // Report the first failing element in C order, whichever thread failed first.
        Some(Err(_)) => {
            let (mut r, mut e) = ([0.0; 1], [0.0; 1]);
            for i in 0..out.len() {
                re.gather(shape, i, &mut r);
                rel_roughness.gather(shape, i, &mut e);
                darcy_factor(r[0], e[0], opts).map_err(|err| err.at_index(i))?;
            }
            Ok(())
        }
    }
}
