#!/usr/bin/env bash
# The C demo: builds libhydrograde (release), compiles capi/examples/demo.c against
# capi/include with gcc and runs it with the library of target/release (rpath).
#
#   scripts/demo-c.sh            the tables (called by ./run.sh demo)
#   scripts/demo-c.sh --numbers  the key results with every digit
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$root"
export CARGO_BUILD_JOBS="${CARGO_BUILD_JOBS:-2}"
cargo build -q --release -p hydrograde-capi
# The library's SONAME is libhydrograde.so.<abi>: give it that name beside the build.
abi="$(sed -n 's/^pub const HG_ABI_VERSION: u32 = \([0-9]*\);$/\1/p' capi/src/version.rs)"
ln -sf libhydrograde.so "target/release/libhydrograde.so.$abi"
out="$root/target/capi-demo"
mkdir -p "$out"
gcc -std=c11 -Wall -Wextra -Werror -O2 -Icapi/include capi/examples/demo.c -o "$out/demo" \
  -Ltarget/release -lhydrograde -Wl,-rpath,"$root/target/release" -lm
exec "$out/demo" "$@"
