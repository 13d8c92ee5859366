//! Windows-1252 text, the ANSI code page VBA converts its strings to on Western systems.
//! Bytes 0x00–0x7F are ASCII and 0xA0–0xFF are Latin-1; 0x80–0x9F hold the characters
//! below (the five unassigned bytes map to the C1 controls of the same value, as Windows
//! itself converts them).

use std::ffi::{CStr, c_char};

/// The characters of bytes 0x80–0x9F (Windows-1252 code page table, Microsoft).
const HIGH: [char; 32] = [
    '\u{20AC}', '\u{81}', '\u{201A}', '\u{192}', '\u{201E}', '\u{2026}', '\u{2020}', '\u{2021}',
    '\u{2C6}', '\u{2030}', '\u{160}', '\u{2039}', '\u{152}', '\u{8D}', '\u{17D}', '\u{8F}',
    '\u{90}', '\u{2018}', '\u{2019}', '\u{201C}', '\u{201D}', '\u{2022}', '\u{2013}', '\u{2014}',
    '\u{2DC}', '\u{2122}', '\u{161}', '\u{203A}', '\u{153}', '\u{9D}', '\u{17E}', '\u{178}',
];

/// The text of Windows-1252 bytes.
pub(super) fn decode(bytes: &[u8]) -> String {
    bytes
        .iter()
        .map(|&b| match b {
            0x80..=0x9F => HIGH[(b - 0x80) as usize],
            _ => char::from(b),
        })
        .collect()
}

/// The Windows-1252 byte of a character, `?` for one the page lacks.
fn encode_char(c: char) -> u8 {
    match c as u32 {
        0..=0x7F | 0xA0..=0xFF => c as u32 as u8,
        _ => HIGH
            .iter()
            .position(|&h| h == c)
            .map_or(b'?', |i| 0x80 + i as u8),
    }
}

/// Reads a NUL-terminated Windows-1252 string.
///
/// # Safety
/// `p` must be non-null and NUL-terminated.
pub(super) unsafe fn read(p: *const c_char) -> String {
    // SAFETY: forwarded contract.
    decode(unsafe { CStr::from_ptr(p) }.to_bytes())
}

/// Writes `s` as Windows-1252 into a buffer of `len` bytes, cut to fit, NUL-terminated.
/// Nothing is written when `buf` is NULL or `len` < 1.
///
/// # Safety
/// `buf` must be NULL or valid for writing `len` bytes.
pub(super) unsafe fn write(s: &str, buf: *mut c_char, len: i32) {
    if buf.is_null() || len < 1 {
        return;
    }
    let room = len as usize - 1;
    let mut n = 0;
    for c in s.chars().take(room) {
        // SAFETY: n < room < len.
        unsafe { buf.add(n).write(encode_char(c) as c_char) };
        n += 1;
    }
    // SAFETY: n ≤ room < len.
    unsafe { buf.add(n).write(0) };
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn round_trips_every_byte() {
        // Windows-1252 is a bijection on 0x01–0xFF (with the C1 fill-ins), so every byte
        // comes back as itself.
        let bytes: Vec<u8> = (1..=255).collect();
        let s = decode(&bytes);
        let back: Vec<u8> = s.chars().map(encode_char).collect();
        assert_eq!(back, bytes);
        // Bytes from the Windows-1252 table (Microsoft; from memory): 0xB0 degree sign,
        // 0x80 euro sign, 0xB3 superscript three, 0x96 en dash.
        assert_eq!(decode(b"\xb0C"), "°C");
        assert_eq!(decode(b"\x80 m\xb3"), "€ m³");
        assert_eq!(decode(b"\x96"), "–");
        assert_eq!(encode_char('ε'), b'?');
    }

    #[test]
    fn writes_cut_to_fit() {
        let mut buf = [0x55 as c_char; 6];
        // SAFETY: the buffer holds 6 bytes.
        unsafe { write("é ±10 %", buf.as_mut_ptr(), 6) };
        let got: Vec<u8> = buf.iter().map(|&b| b as u8).collect();
        assert_eq!(got, b"\xe9 \xb110\0");
        // SAFETY: a NULL buffer is ignored.
        unsafe { write("x", std::ptr::null_mut(), 4) };
    }
}
