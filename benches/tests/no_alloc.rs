//! The scalar hot paths allocate nothing: a counting global allocator watches them.
//! (A correctness property of the hot paths, not a timing: it cannot fail on a slow
//! machine.)
use hydrograde::friction::{Correlation, Options, darcy_factor, darcy_factor_batch};
use hydrograde::pipe::Pipe;
use hydrograde_benches::{flows, line20, turbulent_points, water};
use std::alloc::{GlobalAlloc, Layout, System};
use std::cell::Cell;

struct Counting;

thread_local! {
    static ALLOCATIONS: Cell<usize> = const { Cell::new(0) };
}

// SAFETY: forwards to the system allocator; only counts calls on the current thread.
unsafe impl GlobalAlloc for Counting {
    unsafe fn alloc(&self, layout: Layout) -> *mut u8 {
        let _ = ALLOCATIONS.try_with(|c| c.set(c.get() + 1));
        // SAFETY: same contract as the caller's.
        unsafe { System.alloc(layout) }
    }
    unsafe fn dealloc(&self, ptr: *mut u8, layout: Layout) {
        // SAFETY: same contract as the caller's.
        unsafe { System.dealloc(ptr, layout) }
    }
}

#[global_allocator]
static GLOBAL: Counting = Counting;

/// Allocations made on this thread while `f` runs.
fn allocations(f: impl FnOnce()) -> usize {
    let before = ALLOCATIONS.with(Cell::get);
    f();
    ALLOCATIONS.with(Cell::get) - before
}

#[test]
fn friction_factor_allocates_nothing() {
    let (re, rr) = turbulent_points(2_000, 5);
    // Laminar and transitional points too (Re from 500 up).
    let low: Vec<f64> = (0..200).map(|i| 500.0 + 25.0 * i as f64).collect();
    for corr in Correlation::ALL {
        let o = Options::with_correlation(corr);
        let n = allocations(|| {
            for (&r, &e) in re.iter().zip(&rr).chain(low.iter().zip(&rr)) {
                let _ = std::hint::black_box(darcy_factor(r, e.max(1e-6), &o).map(|f| f.f));
            }
        });
        assert_eq!(n, 0, "{}", corr.name());
    }
}

#[test]
fn serial_batch_allocates_nothing() {
    // Below the parallel threshold the batch runs on the calling thread.
    let (re, rr) = turbulent_points(4_000, 6);
    let mut out = vec![0.0; re.len()];
    let o = Options::default();
    let n = allocations(|| {
        darcy_factor_batch(&re, &rr, &o, &mut out).expect("valid points");
    });
    assert_eq!(n, 0);
}

#[test]
fn pipe_head_loss_and_line_required_head_allocate_nothing() {
    let w = water().expect("water");
    let p = Pipe::circular(0.1023, 100.0, 4.5e-5).expect("pipe");
    let line = line20().expect("line");
    let q = flows(200);
    let n = allocations(|| {
        for &f in &q {
            let _ = std::hint::black_box(p.head_loss(&w, f).map(|h| h.0));
        }
    });
    assert_eq!(n, 0, "pipe head loss");
    let n = allocations(|| {
        for &f in &q {
            let _ = std::hint::black_box(line.required_head(&w, f).map(|h| h.0));
        }
    });
    assert_eq!(n, 0, "line required head");
}
