//! Times the C ABI's batch entry point from the same process, by loading the shared
//! library the C users link (`libhydrograde.so`) with `dlopen`: that is the code a C
//! caller runs, with its own copy of the core and of the thread pool.

use std::ffi::{CStr, CString, c_char, c_int, c_void};

const RTLD_NOW: c_int = 2;
const HG_CORRELATION_COLEBROOK: i32 = 0;

unsafe extern "C" {
    fn dlopen(filename: *const c_char, flag: c_int) -> *mut c_void;
    fn dlsym(handle: *mut c_void, symbol: *const c_char) -> *mut c_void;
    fn dlerror() -> *mut c_char;
}

type BatchFn = unsafe extern "C" fn(*const f64, *const f64, usize, i32, *mut f64) -> i32;

/// `--capi <path>` from the command line, if given.
pub fn path_from_args() -> Option<String> {
    let args: Vec<String> = std::env::args().collect();
    args.iter()
        .position(|a| a == "--capi")
        .and_then(|i| args.get(i + 1).cloned())
}

/// `hg_darcy_factor_batch` of a loaded library (the library stays loaded for the life
/// of the process).
pub struct Batch(BatchFn);

fn last_dl_error() -> String {
    // SAFETY: dlerror returns NULL or a NUL-terminated string owned by libc.
    let p = unsafe { dlerror() };
    if p.is_null() {
        "unknown dlopen error".to_owned()
    } else {
        // SAFETY: non-NULL, NUL-terminated (above).
        unsafe { CStr::from_ptr(p) }.to_string_lossy().into_owned()
    }
}

impl Batch {
    /// Loads `path` and finds `hg_darcy_factor_batch`.
    pub fn open(path: &str) -> Result<Self, String> {
        let c_path = CString::new(path).map_err(|e| e.to_string())?;
        // SAFETY: a valid C string; loading runs the library's initialisers (none that
        // touch this process's state beyond its own).
        let h = unsafe { dlopen(c_path.as_ptr(), RTLD_NOW) };
        if h.is_null() {
            return Err(last_dl_error());
        }
        // SAFETY: a valid handle and a NUL-terminated name.
        let sym = unsafe { dlsym(h, c"hg_darcy_factor_batch".as_ptr()) };
        if sym.is_null() {
            return Err(last_dl_error());
        }
        // SAFETY: the symbol is the C ABI function with this signature (include/hydrograde.h).
        Ok(Batch(unsafe {
            std::mem::transmute::<*mut c_void, BatchFn>(sym)
        }))
    }

    /// Exact Colebrook factors of all points into `out` (same lengths).
    pub fn run(&self, re: &[f64], rr: &[f64], out: &mut [f64]) {
        let n = re.len().min(rr.len()).min(out.len());
        // SAFETY: the three arrays hold at least `n` doubles and do not overlap.
        let status = unsafe {
            (self.0)(
                re.as_ptr(),
                rr.as_ptr(),
                n,
                HG_CORRELATION_COLEBROOK,
                out.as_mut_ptr(),
            )
        };
        if status != 0 {
            eprintln!("hg_darcy_factor_batch returned status {status}");
        }
        std::hint::black_box(out);
    }
}
