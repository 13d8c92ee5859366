//! The junction-head system of the global gradient method, built once per solve: its
//! sparsity pattern in compressed columns, the symbolic Cholesky analysis (fill-reducing
//! ordering, elimination tree) and every buffer the numeric factorisation and the solves
//! need. An iteration only refills the values, factorises and solves: no allocation, no
//! new analysis. The bands reuse the factorisation at the solution for one more solve per
//! uncertainty source.

use crate::error::{Error, Result};
use faer::dyn_stack::{MemBuffer, MemStack, StackReq};
use faer::linalg::cholesky::llt::factor::LltRegularization;
use faer::sparse::linalg::cholesky::{
    CholeskySymbolicParams, LltRef, SymbolicCholesky, SymmetricOrdering,
    factorize_symbolic_cholesky,
};
use faer::sparse::{SparseColMatRef, SymbolicSparseColMatRef};
use faer::{Conj, MatMut, Par, Side};

/// Where a node sits in the linear system.
#[derive(Clone, Copy, Debug, PartialEq)]
pub(super) enum Slot {
    /// A junction: its row.
    Free(usize),
    /// A fixed-head node: its head, m.
    Fixed(f64),
}

/// The lower triangle of the symmetric head matrix `Σ_k∋n (H_n − H_m)/g_k`, with its
/// Cholesky factorisation.
pub(super) struct HeadSystem {
    rows: usize,
    col_ptr: Vec<usize>,
    row_idx: Vec<usize>,
    /// Matrix values in compressed-column order.
    vals: Vec<f64>,
    /// Value slot of each junction's diagonal.
    diag: Vec<usize>,
    /// Value slot of each link's off-diagonal entry (both ends junctions).
    off: Vec<Option<usize>>,
    symbolic: SymbolicCholesky<usize>,
    factor: Vec<f64>,
    mem: MemBuffer,
    factored: bool,
}

fn internal(what: &str) -> Error {
    Error::no_solution(format!(
        "the sparse solver could not {what} the network's head system"
    ))
}

impl HeadSystem {
    /// The system of `rows` junctions for links joining `ends` (node indices, placed by
    /// `slots`).
    pub(super) fn new(rows: usize, slots: &[Slot], ends: &[(usize, usize)]) -> Result<Self> {
        // Entries (column, row) of the lower triangle, one per distinct pair of junctions
        // joined by a link, and every diagonal.
        let mut entries: Vec<(usize, usize)> = (0..rows).map(|i| (i, i)).collect();
        let mut link_entry = Vec::with_capacity(ends.len());
        for &(u, d) in ends {
            link_entry.push(match (slots[u], slots[d]) {
                (Slot::Free(a), Slot::Free(b)) => {
                    entries.push((a.min(b), a.max(b)));
                    Some(entries.len() - 1)
                }
                _ => None,
            });
        }
        let mut order: Vec<usize> = (0..entries.len()).collect();
        order.sort_unstable_by_key(|&e| entries[e]);
        // Slot of each entry in compressed-column order, duplicates merged.
        let mut slot_of = vec![0usize; entries.len()];
        let mut col_ptr = vec![0usize; rows + 1];
        let mut row_idx = Vec::with_capacity(entries.len());
        let mut last = None;
        for &e in &order {
            if last != Some(entries[e]) {
                row_idx.push(entries[e].1);
                col_ptr[entries[e].0 + 1] += 1;
                last = Some(entries[e]);
            }
            slot_of[e] = row_idx.len() - 1;
        }
        for c in 0..rows {
            col_ptr[c + 1] += col_ptr[c];
        }
        let pattern = SymbolicSparseColMatRef::new_checked(rows, rows, &col_ptr, None, &row_idx);
        let symbolic = factorize_symbolic_cholesky(
            pattern,
            Side::Lower,
            SymmetricOrdering::Amd,
            CholeskySymbolicParams::default(),
        )
        .map_err(|_| internal("analyse"))?;
        let req = StackReq::any_of(&[
            symbolic.factorize_numeric_llt_scratch::<f64>(Par::Seq, Default::default()),
            symbolic.solve_in_place_scratch::<f64>(1, Par::Seq),
        ]);
        let mem = MemBuffer::try_new(req).map_err(|_| internal("allocate"))?;
        Ok(HeadSystem {
            rows,
            vals: vec![0.0; row_idx.len()],
            factor: vec![0.0; symbolic.len_val()],
            col_ptr,
            row_idx,
            diag: (0..rows).map(|i| slot_of[i]).collect(),
            off: link_entry
                .into_iter()
                .map(|e| e.map(|e| slot_of[e]))
                .collect(),
            symbolic,
            mem,
            factored: false,
        })
    }

    /// Sets every value to zero, ready for [`HeadSystem::add_link`].
    pub(super) fn clear(&mut self) {
        self.vals.fill(0.0);
        self.factored = false;
    }

    /// Adds link `k`'s conductance `w` = 1/g (m²/s) between its ends' rows.
    pub(super) fn add_link(&mut self, k: usize, up: Slot, down: Slot, w: f64) {
        if let Slot::Free(r) = up {
            self.vals[self.diag[r]] += w;
        }
        if let Slot::Free(r) = down {
            self.vals[self.diag[r]] += w;
        }
        if let Some(s) = self.off[k] {
            self.vals[s] -= w;
        }
    }

    /// Factorises the values last assembled.
    ///
    /// # Errors
    /// [`Error::NoSolution`] when the matrix is not positive definite.
    pub(super) fn factorise(&mut self) -> Result<()> {
        let pattern = SymbolicSparseColMatRef::new_checked(
            self.rows,
            self.rows,
            &self.col_ptr,
            None,
            &self.row_idx,
        );
        let a = SparseColMatRef::new(pattern, &self.vals);
        self.symbolic
            .factorize_numeric_llt(
                &mut self.factor,
                a,
                Side::Lower,
                LltRegularization::default(),
                Par::Seq,
                MemStack::new(&mut self.mem),
                Default::default(),
            )
            .map_err(|_| {
                Error::no_solution(
                    "the network's head system is not positive definite (a link's loss falls with flow)",
                )
            })?;
        self.factored = true;
        Ok(())
    }

    /// Solves the factorised system for right-hand side `x` in place (one value per row).
    pub(super) fn solve(&mut self, x: &mut [f64]) {
        debug_assert!(self.factored && x.len() == self.rows);
        let llt = LltRef::new(&self.symbolic, &self.factor);
        llt.solve_in_place_with_conj(
            Conj::No,
            MatMut::from_column_major_slice_mut(x, self.rows, 1),
            Par::Seq,
            MemStack::new(&mut self.mem),
        );
    }
}
