#!/usr/bin/env bash
# The C ABI test suite: builds libhydrograde (release), checks the committed header is
# what cbindgen generates, installs to target/capi-prefix, then compiles and runs the C
# and C++ tests (shared and static, and under valgrind), builds a CMake consumer project
# from the prefix, checks the VBA declarations against the header and calls the library
# through ctypes with the VBA types. Every result is compared with the Rust core bit for
# bit. Installs cbindgen, cmake, valgrind and pkg-config when absent.
#
#   bash scripts/test-c.sh               run everything; last line "N passed, N failed"
#   bash scripts/test-c.sh --regenerate  rewrite capi/include/hydrograde.h, then run
set -uo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
cd "$root"
export CARGO_BUILD_JOBS="${CARGO_BUILD_JOBS:-2}"
export PATH="$HOME/.cargo/bin:$PATH"

out="$root/target/capi-test"
prefix="$root/target/capi-prefix"
mkdir -p "$out"
passed=0
failed=0
log="$out/log.txt"
: > "$log"

# run NAME CMD...: one counted check; output goes to the log and is shown on failure.
run() {
  local name="$1"
  shift
  if "$@" >> "$log" 2>&1; then
    passed=$((passed + 1))
    printf '  ok    %s\n' "$name"
  else
    failed=$((failed + 1))
    printf '  FAIL  %s\n' "$name"
    echo "---- output of: $*"
    "$@" 2>&1 | tail -30
    echo "----"
  fi
}
finish() {
  echo "$passed passed, $failed failed"
  [ "$failed" -eq 0 ] && exit 0 || exit 1
}
die() {
  echo "test-c: $*" >&2
  failed=$((failed + 1))
  finish
}

# ---- tools ----
apt_missing=()
command -v cmake >/dev/null || apt_missing+=(cmake)
command -v valgrind >/dev/null || apt_missing+=(valgrind)
command -v pkg-config >/dev/null || apt_missing+=(pkg-config)
if [ "${#apt_missing[@]}" -gt 0 ]; then
  echo "installing ${apt_missing[*]} with apt"
  (flock /tmp/hydrograde-apt.lock apt-get update -qq &&
    flock /tmp/hydrograde-apt.lock env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq "${apt_missing[@]}") \
    >> "$log" 2>&1 || die "apt-get install ${apt_missing[*]} failed (see $log)"
fi
if ! command -v cbindgen >/dev/null; then
  echo "installing cbindgen (cargo install, once)"
  cargo install cbindgen --locked >> "$log" 2>&1 || die "cargo install cbindgen failed"
fi
py="$root/.venv/bin/python"
if [ ! -x "$py" ]; then
  python3 -m venv "$root/.venv" && "$py" -m pip install -q pytest numpy >> "$log" 2>&1
fi

version="$(sed -n 's/^version = "\(.*\)"/\1/p' Cargo.toml | head -1)"
abi="$(sed -n 's/^pub const HG_ABI_VERSION: u32 = \([0-9]*\);$/\1/p' capi/src/version.rs)"
echo "hydrograde C ABI $version"

# ---- build ----
cargo build -q --release -p hydrograde-capi || die "cargo build failed"
cargo run -q --release -p hydrograde-capi --example core_reference > "$out/reference.txt" \
  || die "core reference failed"

header=capi/include/hydrograde.h
gen=(cbindgen --quiet --config capi/cbindgen.toml --crate hydrograde-capi)
if [ "${1:-}" = "--regenerate" ]; then
  "${gen[@]}" --output "$header"
fi
run "header is what cbindgen generates (cbindgen --verify)" "${gen[@]}" --verify --output "$header"

run "SONAME is libhydrograde.so.$abi (HG_ABI_VERSION)" \
  bash -c "readelf -d target/release/libhydrograde.so | grep -q 'SONAME.*\[libhydrograde.so.$abi\]'"
# Every entry point catches panics, so none may be exported without a check: the
# exported symbols must be exactly the header's functions.
check_exports() {
  diff <(nm -D --defined-only target/release/libhydrograde.so | awk '$3 ~ /^hg_/ {print $3}' | sort) \
       <(grep -oE '\bhg_[a-z0-9_]+\(' "$header" | tr -d '(' | sort -u)
}
run "exported hg_* symbols equal the header's functions" check_exports
check_coverage() {
  local f missing=0
  for f in $(grep -oE '\bhg_[a-z0-9_]+\(' "$header" | tr -d '(' | sort -u); do
    grep -q "\b$f\b" tests/c/test_capi.c tests/c/test_line.c tests/c/test_network.c || { echo "no C test calls $f"; missing=1; }
  done
  return $missing
}
run "the C tests call every function of the header" check_coverage
# The index at the top of the header names every function (by name or by an hg_*_ family).
check_index() {
  local f missing=0 index
  index="$(sed -n '/^ \* Index/,/^ \* Safety/p' "$header")"
  for f in $(grep -oE '\bhg_[a-z0-9_]+\(' "$header" | tr -d '(' | sort -u); do
    grep -qE "\b$f\b" <<< "$index" && continue
    grep -qE "\b${f%_*}_\*" <<< "$index" || grep -qE "\b${f%_*_*}_\*" <<< "$index" ||
      { echo "the header's index does not name $f"; missing=1; }
  done
  return $missing
}
run "the header's index names every function" check_index

# ---- install ----
rm -rf "$prefix"
run "install to $prefix" scripts/install-capi.sh "$prefix"
export PKG_CONFIG_PATH="$prefix/lib/pkgconfig"
run "pkg-config --cflags --libs hydrograde" pkg-config --exists --print-errors "hydrograde = $version"
cflags="$(pkg-config --cflags hydrograde)"
libs="$(pkg-config --libs hydrograde)"
static_libs="$prefix/lib/libhydrograde.a $(pkg-config --static --libs-only-other --libs-only-l hydrograde | sed 's/-lhydrograde//')"

# ---- C and C++ programs, shared and static ----
ccflags=(-Wall -Wextra -Werror -O1 -g -Itests/c)
run "compile C test (shared)" gcc -std=c11 "${ccflags[@]}" $cflags tests/c/test_capi.c -o "$out/test_c" \
  $libs -Wl,-rpath,"$prefix/lib" -lpthread -lm
run "compile C test (static)" gcc -std=c11 "${ccflags[@]}" $cflags tests/c/test_capi.c -o "$out/test_c_static" \
  $static_libs -lpthread -lm
run "compile C line test (shared)" gcc -std=c11 "${ccflags[@]}" $cflags tests/c/test_line.c -o "$out/test_line" \
  $libs -Wl,-rpath,"$prefix/lib" -lpthread -lm
run "compile C line test (static)" gcc -std=c11 "${ccflags[@]}" $cflags tests/c/test_line.c -o "$out/test_line_static" \
  $static_libs -lpthread -lm
run "compile C network test (shared)" gcc -std=c11 "${ccflags[@]}" $cflags tests/c/test_network.c -o "$out/test_network" \
  $libs -Wl,-rpath,"$prefix/lib" -lpthread -lm
run "compile C++ test (shared)" g++ -std=c++17 "${ccflags[@]}" $cflags tests/c/test_capi.cpp -o "$out/test_cpp" \
  $libs -Wl,-rpath,"$prefix/lib"
run "compile C++ test (static)" g++ -std=c++17 "${ccflags[@]}" $cflags tests/c/test_capi.cpp -o "$out/test_cpp_static" \
  $static_libs
run "compile C++ network test (shared)" g++ -std=c++17 "${ccflags[@]}" $cflags tests/c/test_network.cpp -o "$out/test_network_cpp" \
  $libs -Wl,-rpath,"$prefix/lib"
run "C test (shared)" "$out/test_c" "$out/reference.txt" "$version"
run "C test (static)" "$out/test_c_static" "$out/reference.txt" "$version"
run "C line test (shared)" "$out/test_line" "$out/reference.txt"
run "C line test (static)" "$out/test_line_static" "$out/reference.txt"
run "C network test (shared)" "$out/test_network"
run "C++ test (shared)" "$out/test_cpp"
run "C++ test (static)" "$out/test_cpp_static"
run "C++ network test (shared)" "$out/test_network_cpp"
grep -h -E '^(bitwise|test_)' "$log" | sort -u | sed 's/^/    /'

# One thread: the library then starts no worker pool, whose threads' storage valgrind
# would otherwise report as possibly lost at exit.
vg=(env HYDROGRADE_THREADS=1 valgrind --quiet --suppressions=tests/c/valgrind.supp --error-exitcode=97 --leak-check=full --errors-for-leak-kinds=definite,indirect
    --show-leak-kinds=definite,indirect)
run "valgrind: C test, zero errors and leaks" "${vg[@]}" "$out/test_c" "$out/reference.txt" "$version"
run "valgrind: C line test, zero errors and leaks" "${vg[@]}" "$out/test_line" "$out/reference.txt"
run "valgrind: C network test, zero errors and leaks" "${vg[@]}" "$out/test_network"
run "valgrind: C++ test, zero errors and leaks" "${vg[@]}" "$out/test_cpp"
run "valgrind: C++ network test, zero errors and leaks" "${vg[@]}" "$out/test_network_cpp"

# ---- CMake consumer ----
ref_hex="$(awk '$1 == "darcy" && $2 == 0 && $3 == "40f86a0000000000" && $4 == "3f1a36e2eb1c432d" {print $5}' "$out/reference.txt")"
rm -rf "$out/consumer"
run "CMake: find_package(hydrograde) configures" cmake -S tests/c/consumer -B "$out/consumer" \
  -DCMAKE_PREFIX_PATH="$prefix" -DCMAKE_BUILD_TYPE=Release
run "CMake: consumer builds" cmake --build "$out/consumer" -j2
run "CMake: consumer (shared) equals the core" "$out/consumer/consumer_shared" "$ref_hex"
run "CMake: consumer (static) equals the core" "$out/consumer/consumer_static" "$ref_hex"

# ---- bounded fuzz: every hg_* function with bad arguments, batches in subprocesses ----
run "fuzz: every function of the header with bad arguments (25 s at most)" \
  "$py" tests/fuzz/run_capi_fuzz.py "$header" target/release/libhydrograde.a "$out/fuzz" 25
grep -h -E '^  fuzz:' "$log" | tail -1 | sed 's/^  /    /'

# ---- packaging as a consumer finds it ----
# The installed tree moved elsewhere: the .pc finds its prefix from its own place.
moved="$out/moved-prefix"
rm -rf "$moved" && cp -a "$prefix" "$moved"
pc_consumer() {
  local cf lf
  cf="$(PKG_CONFIG_PATH="$moved/lib/pkgconfig" pkg-config --cflags hydrograde)" || return 1
  lf="$(PKG_CONFIG_PATH="$moved/lib/pkgconfig" pkg-config --libs hydrograde)" || return 1
  case "$cf $lf" in *"$prefix"*) echo "the .pc names the old prefix: $cf $lf"; return 1 ;; esac
  g++ -std=c++17 $cf tests/c/consumer/main.cpp -o "$out/pc_consumer" $lf &&
    LD_LIBRARY_PATH="$moved/lib" "$out/pc_consumer" "$ref_hex"
}
run "pkg-config from a relocated prefix builds and runs (LD_LIBRARY_PATH)" pc_consumer
# A fully static program from `pkg-config --static`: no -lgcc_s, which -static cannot find.
static_consumer() {
  local cf lf
  cf="$(pkg-config --cflags hydrograde)" && lf="$(pkg-config --static --libs hydrograde)" || return 1
  g++ -std=c++17 -static $cf tests/c/consumer/main.cpp -o "$out/static_consumer" \
    -L"$prefix/lib" -Wl,-Bstatic $lf &&
    "$out/static_consumer" "$ref_hex" && ! readelf -d "$out/static_consumer" 2>/dev/null | grep -q NEEDED
}
run "pkg-config --static links a -static program" static_consumer

# ---- spreadsheet module ----
run "VBA module matches its specification" "$py" tests/c/check_vba.py

# ---- the demo ----
# The C demo (capi/examples/demo.c) builds the same scenarios as the Rust demo: its key
# results must be the same doubles and its tables the same text.
cargo build -q --release -p hydrograde --example demo || die "cargo build of the Rust demo failed"
run "compile C demo" gcc -std=c11 "${ccflags[@]}" $cflags capi/examples/demo.c -o "$out/demo_c" \
  $libs -Wl,-rpath,"$prefix/lib" -lm
target/release/examples/demo --numbers > "$out/demo_rust_numbers.txt" 2>> "$log"
"$out/demo_c" --numbers > "$out/demo_c_numbers.txt" 2>> "$log"
run "demo: C and Rust --numbers are the same doubles" \
  "$py" tests/c/compare_numbers.py "$out/demo_rust_numbers.txt" "$out/demo_c_numbers.txt"
grep -h -E '^[0-9]+ values' "$log" | tail -1 | sed 's/^/    demo numbers: /'
run "demo: C tables equal the Rust tables" \
  bash -c "diff <(target/release/examples/demo) <('$out/demo_c')"
run "valgrind: C demo, zero errors and leaks" "${vg[@]}" "$out/demo_c"
run "scripts/demo-c.sh is executable and runs" bash -c "test -x scripts/demo-c.sh && scripts/demo-c.sh --numbers | cmp - '$out/demo_c_numbers.txt'"

finish
