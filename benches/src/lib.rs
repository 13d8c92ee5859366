//! Benchmarks of hydrograde live in `benches/benches/`; this crate has no library code.
