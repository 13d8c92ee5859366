#!/usr/bin/env bash
# Builds the Windows DLLs from this Debian machine:
#
#   dist/windows/x64/hydrograde.dll  libhydrograde.dll.a  libhydrograde.a   (64-bit Office)
#   dist/windows/x86/hydrograde.dll  libhydrograde.dll.a  libhydrograde.a   (32-bit Office)
#   dist/windows/include/hydrograde.h, dist/windows/excel/hydrograde.bas
#
# Route: Debian's rustc/cargo 1.96 (packages rustc-web, cargo-web) with the standard
# library built from Debian's source package (rust-web-src, -Zbuild-std) and MinGW-w64 as
# the linker; rustup here has only the Linux target and cannot download others. The
# 32-bit link needs rsbegin.o/rsend.o, which -Zbuild-std does not build: they are compiled
# from the same source's library/rtstartup.
#
# Slow the first time (about 5 minutes per DLL on 2 cores), so the cargo target folder
# lives outside the checkout and the finished DLLs are cached under a key made of the
# sources (Cargo.lock, the manifests, core/ and capi/ sources, this script and the
# compiler's version): a warm run only copies files.
#
#   scripts/windows/build.sh            both DLLs
#   scripts/windows/build.sh x64        one of them (x64 or x86)
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/../.."
export CARGO_BUILD_JOBS="${CARGO_BUILD_JOBS:-2}"

CACHE="${HYDROGRADE_CACHE:-$HOME/.cache/hydrograde}"
TARGET_DIR="$CACHE/windows-target"
DIST=dist/windows
PACKAGES=(gcc-mingw-w64-x86-64 gcc-mingw-w64-i686 rustc-web cargo-web rust-web-src)

# Installs the Debian packages the route needs, when one is missing.
ensure_packages() {
  local missing=()
  for p in "$@"; do
    dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
  done
  if [ ${#missing[@]} -gt 0 ]; then
    echo "installing ${missing[*]}" >&2
    local sudo=""
    [ "$(id -u)" -eq 0 ] || sudo="sudo"
    $sudo flock /tmp/hydrograde-apt.lock apt-get update -q
    $sudo flock /tmp/hydrograde-apt.lock env DEBIAN_FRONTEND=noninteractive \
      apt-get install -y -q --no-install-recommends "${missing[@]}"
  fi
}

# The full path of a file a Debian package installs (rustup's tools come first in PATH).
package_file() {
  local files
  files=$(dpkg -L "$1" | grep -E "$2") || { echo "no $2 in package $1" >&2; exit 1; }
  echo "${files%%$'\n'*}"
}

# A hash of everything the DLL is built from.
source_key() {
  {
    "$RUSTC" --version
    sha256sum scripts/windows/build.sh Cargo.lock Cargo.toml core/Cargo.toml capi/Cargo.toml capi/build.rs
    find core/src capi/src -type f -name '*.rs' | LC_ALL=C sort | xargs sha256sum
  } | sha256sum | cut -c1-16
}

# Builds one architecture into the cache folder $2.
build_arch() {
  local arch=$1 out=$2 triple linker
  case "$arch" in
    x64) triple=x86_64-pc-windows-gnu linker=x86_64-w64-mingw32-gcc ;;
    x86) triple=i686-pc-windows-gnu linker=i686-w64-mingw32-gcc ;;
    *) echo "unknown architecture $arch (x64 or x86)" >&2; exit 2 ;;
  esac
  local extra=()
  if [ "$arch" = x86 ]; then
    # The startup objects of the 32-bit target, from the same standard-library source.
    local rt="$TARGET_DIR/rtstartup-$triple" src
    src=$(dirname "$(package_file rust-web-src '/library/rtstartup/rsbegin\.rs$')")
    mkdir -p "$rt"
    for f in rsbegin rsend; do
      [ -f "$rt/$f.o" ] || RUSTC_BOOTSTRAP=1 "$RUSTC" --target "$triple" --emit=obj \
        -C panic=abort -C opt-level=2 -o "$rt/$f.o" "$src/$f.rs"
    done
    # --kill-at: export stdcall functions as `name`, not `name@N`, so VBA's Declare finds them.
    extra=(-- -L "native=$rt" -C link-arg=-Wl,--kill-at)
  fi
  local t0=$SECONDS
  echo "building hydrograde.dll for $arch ($triple); the first build takes minutes" >&2
  local upper=${triple^^}
  env RUSTC="$RUSTC" RUSTC_BOOTSTRAP=1 RUSTFLAGS="" "CARGO_TARGET_${upper//-/_}_LINKER=$linker" \
    "$CARGO" rustc -q -Zbuild-std=std,panic_unwind --target "$triple" -p hydrograde-capi \
    --lib --release --target-dir "$TARGET_DIR" "${extra[@]}"
  echo "built $arch in $((SECONDS - t0)) s" >&2
  local built="$TARGET_DIR/$triple/release"
  mkdir -p "$out"
  cp "$built/hydrograde.dll" "$built/libhydrograde.dll.a" "$built/libhydrograde.a" "$out/"
}

main() {
  local arches=("$@")
  [ ${#arches[@]} -gt 0 ] || arches=(x64 x86)
  ensure_packages "${PACKAGES[@]}"
  RUSTC=$(package_file rustc-web '^/usr/bin/rustc$')
  CARGO=$(package_file cargo-web '^/usr/bin/cargo$')
  local key
  key=$(source_key)
  for arch in "${arches[@]}"; do
    local cached="$CACHE/windows-dll/$key/$arch"
    if [ -f "$cached/hydrograde.dll" ]; then
      echo "hydrograde.dll for $arch from the cache ($key)" >&2
    else
      build_arch "$arch" "$cached.tmp"
      rm -rf "$cached" && mv "$cached.tmp" "$cached"
    fi
    rm -rf "${DIST:?}/$arch" && mkdir -p "$DIST/$arch"
    cp "$cached"/* "$DIST/$arch/"
  done
  mkdir -p "$DIST/include" "$DIST/excel"
  cp capi/include/hydrograde.h "$DIST/include/"
  cp capi/excel/*.bas "$DIST/excel/"
  # Keep the cache small: the five newest builds.
  ls -1dt "$CACHE"/windows-dll/*/ 2>/dev/null | tail -n +6 | xargs -r rm -rf
  echo "Windows DLLs in $DIST/ (key $key)" >&2
}

main "$@"
