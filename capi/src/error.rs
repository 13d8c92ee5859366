//! Status names and the thread's last error message.

use crate::ffi::{self, STATUS_NAMES};
use std::ffi::c_char;

/// The name of a status code as a static string, e.g. "HG_ERR_OUT_OF_RANGE"; for a code
/// that is not one of the `HG_*` status codes, "HG_UNKNOWN_STATUS". Never NULL, never
/// freed. Thread-safe.
#[unsafe(no_mangle)]
pub extern "C" fn hg_status_name(status: i32) -> *const c_char {
    STATUS_NAMES
        .iter()
        .find(|(c, _)| *c == status)
        .map_or("HG_UNKNOWN_STATUS\0", |(_, n)| n)
        .as_ptr()
        .cast()
}

/// The message of the last failed call on the calling thread, e.g.
/// "re = -1: must be greater than 0" (empty when the thread's last call succeeded).
///
/// Copies at most `len - 1` bytes of UTF-8 and a terminating NUL into `buf` (nothing when
/// `buf` is NULL or `len` is 0) and returns the message's full length in bytes, without
/// the NUL, like `snprintf`: a return value ≥ `len` means the copy was cut short.
/// Does not change the thread's last error. Thread-safe: each thread has its own message.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes.
#[unsafe(no_mangle)]
pub unsafe extern "C" fn hg_last_error(buf: *mut c_char, len: usize) -> usize {
    ffi::guard_value(0, || {
        ffi::with_last_error(|msg| {
            if !buf.is_null() && len > 0 {
                let mut n = msg.len().min(len - 1);
                // Never cut a UTF-8 character in half.
                while !msg.is_char_boundary(n) {
                    n -= 1;
                }
                // SAFETY: `buf` holds `len` > n bytes by the caller's contract.
                unsafe {
                    std::ptr::copy_nonoverlapping(msg.as_ptr(), buf.cast::<u8>(), n);
                    buf.add(n).write(0);
                }
            }
            msg.len()
        })
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::ffi::CStr;

    #[test]
    fn last_error_copies_like_snprintf() {
        // SAFETY: NULL is rejected.
        let code = unsafe { crate::hg_darcy_factor(-1.0, 0.0, 0, std::ptr::null_mut()) };
        assert_eq!(code, crate::HG_ERR_NULL_POINTER);
        let mut f = 0.0;
        // SAFETY: valid out-pointer.
        let code = unsafe { crate::hg_darcy_factor(-1.0, 0.0, 0, &mut f) };
        assert_eq!(code, crate::HG_ERR_OUT_OF_RANGE);
        // SAFETY: NULL with 0 is allowed.
        let full = unsafe { hg_last_error(std::ptr::null_mut(), 0) };
        assert_eq!(full, "re = -1: must be greater than 0".len());
        let mut buf = [1 as c_char; 6];
        // SAFETY: buf holds 6 bytes.
        let n = unsafe { hg_last_error(buf.as_mut_ptr(), buf.len()) };
        assert_eq!(n, full);
        // SAFETY: NUL-terminated by hg_last_error.
        let got = unsafe { CStr::from_ptr(buf.as_ptr()) };
        assert_eq!(got.to_str().unwrap(), "re = ");
    }
}
