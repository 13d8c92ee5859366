#!/usr/bin/env bash
# Installs what the Wine test of the Windows DLLs needs, idempotently: wine64 (64-bit
# programs) and, where the machine allows a multi-arch install, wine32:i386 (32-bit
# programs, to call the x86 DLL; without it the test reads the x86 exports with objdump).
# A failed 32-bit install is remembered in the cache for a day, so a machine that cannot
# have it does not retry on every run.
set -euo pipefail
CACHE="${HYDROGRADE_CACHE:-$HOME/.cache/hydrograde}"
sudo=""
[ "$(id -u)" -eq 0 ] || sudo="sudo"
installed() { dpkg-query -W -f='${Status}' "$1" 2>/dev/null | grep -q "install ok installed"; }
apt() { $sudo flock /tmp/hydrograde-apt.lock env DEBIAN_FRONTEND=noninteractive apt-get "$@"; }

if ! installed wine64; then
  apt update -q && apt install -y -q --no-install-recommends wine64 gcc-mingw-w64-x86-64 gcc-mingw-w64-i686
fi
marker="$CACHE/wine32-unavailable"
if ! installed wine32:i386 && ! [ -n "$(find "$marker" -mmin -1440 2>/dev/null)" ]; then
  mkdir -p "$CACHE"
  if { dpkg --print-foreign-architectures | grep -qx i386 || $sudo dpkg --add-architecture i386; } &&
    apt update -q && apt install -y -q --no-install-recommends wine32:i386; then
    rm -f "$marker"
  else
    echo "wine32:i386 could not be installed; the x86 DLL is checked by objdump only" >&2
    touch "$marker"
  fi
fi
