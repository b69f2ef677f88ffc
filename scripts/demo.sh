#!/usr/bin/env bash
# README command (1): install what is missing, build, and run the main job on the bundled
# (invented) demo site. Idempotent. --no-setup skips the package check (used by check.sh).
set -euo pipefail
cd "$(dirname "$0")/.."
[ "${1:-}" = "--no-setup" ] || bash scripts/setup-debian.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
cmake --build build -j "$(nproc 2>/dev/null || echo 2)"
./build/bin/swellyield --version
