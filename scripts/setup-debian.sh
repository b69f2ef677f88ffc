#!/usr/bin/env bash
# Installs, from Debian 12 packages only, what swellyield needs to build, run and test.
# Idempotent: packages already present are skipped; runs as root without prompts
# (uses sudo when not root).
set -euo pipefail
pkgs=(
  build-essential cmake pkg-config
  libgsl-dev liblapacke-dev libopenblas-dev
  libnetcdf-dev netcdf-bin libcsv-dev libinih-dev libjansson-dev
  libflint-arb-dev libflint-dev
  libplplot-dev plplot-driver-cairo
  python3 python3-numpy python3-scipy python3-mpmath python3-netcdf4
  clang libclang-rt-14-dev  # only for the optional SY_FUZZ harnesses (docs/robustness.md)
)
missing=()
for p in "${pkgs[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing+=("$p")
done
if [ "${#missing[@]}" -gt 0 ]; then
  SUDO=""; [ "$(id -u)" -eq 0 ] || SUDO="sudo"
  echo "setup: installing ${missing[*]}" >&2
  $SUDO env DEBIAN_FRONTEND=noninteractive apt-get update -q
  $SUDO env DEBIAN_FRONTEND=noninteractive apt-get install -y -q --no-install-recommends "${missing[@]}"
fi
