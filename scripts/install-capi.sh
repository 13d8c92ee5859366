#!/usr/bin/env bash
# Installs the C ABI of hydrograde to a prefix:
#   PREFIX/lib/libhydrograde.so.X.Y.Z (+ .so.ABI and .so links), PREFIX/lib/libhydrograde.a,
#   PREFIX/include/hydrograde.h, hydrograde.hpp,
#   PREFIX/lib/pkgconfig/hydrograde.pc, PREFIX/lib/cmake/hydrograde/*.cmake.
# Usage: scripts/install-capi.sh PREFIX [TARGET_DIR]   (build first:
#   cargo build --release -p hydrograde-capi; TARGET_DIR defaults to ./target)
set -euo pipefail
root="$(cd "$(dirname "${BASH_SOURCE[0]}")/.." && pwd)"
prefix="${1:?usage: install-capi.sh PREFIX [TARGET_DIR]}"
target="${2:-$root/target}"
mkdir -p "$prefix"
prefix="$(cd "$prefix" && pwd)"

version="$(sed -n 's/^version = "\(.*\)"/\1/p' "$root/Cargo.toml" | head -1)"
major="${version%%.*}"
# The SONAME's number: HG_ABI_VERSION (counts incompatible C ABI changes while 0.x).
abi="$(sed -n 's/^pub const HG_ABI_VERSION: u32 = \([0-9]*\);$/\1/p' "$root/capi/src/version.rs")"
[[ -n "$abi" ]] || { echo "install-capi: HG_ABI_VERSION not found in capi/src/version.rs" >&2; exit 1; }
rel="$target/release"
for f in libhydrograde.so libhydrograde.a; do
  [[ -f "$rel/$f" ]] || { echo "install-capi: $rel/$f missing; build first" >&2; exit 1; }
done

# The system libraries a static link needs (rustc --print native-static-libs on Linux),
# without -lgcc_s: the unwinder comes with the compiler driver (libgcc_s in a dynamic
# link, libgcc_eh in a -static one, where a libgcc_s.a does not exist).
libs_private="-lutil -lrt -lpthread -lm -ldl -lc"
cmake_libs_private="util;rt;pthread;m;dl;c"

install -d "$prefix/lib/pkgconfig" "$prefix/lib/cmake/hydrograde" "$prefix/include"
install -m 0755 "$rel/libhydrograde.so" "$prefix/lib/libhydrograde.so.$version"
ln -sf "libhydrograde.so.$version" "$prefix/lib/libhydrograde.so.$abi"
ln -sf "libhydrograde.so.$abi" "$prefix/lib/libhydrograde.so"
install -m 0644 "$rel/libhydrograde.a" "$prefix/lib/libhydrograde.a"
install -m 0644 "$root/capi/include/hydrograde.h" "$root/capi/include/hydrograde.hpp" "$prefix/include/"

subst() {
  sed -e "s|@PREFIX@|$prefix|g" -e "s|@VERSION@|$version|g" -e "s|@MAJOR@|$major|g" \
      -e "s|@LIBS_PRIVATE@|$libs_private|g" -e "s|@CMAKE_LIBS_PRIVATE@|$cmake_libs_private|g" \
      -e "s|@SHARED_FILE@|libhydrograde.so.$version|g" -e "s|@SONAME@|libhydrograde.so.$abi|g" "$1"
}
subst "$root/capi/cmake/hydrograde.pc.in" > "$prefix/lib/pkgconfig/hydrograde.pc"
subst "$root/capi/cmake/hydrogradeConfig.cmake.in" > "$prefix/lib/cmake/hydrograde/hydrogradeConfig.cmake"
subst "$root/capi/cmake/hydrogradeConfigVersion.cmake.in" > "$prefix/lib/cmake/hydrograde/hydrogradeConfigVersion.cmake"
echo "installed hydrograde $version to $prefix"
