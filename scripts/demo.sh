#!/usr/bin/env bash
# README command (1): install what is missing, build, and run the main job on the bundled
# INVENTED demo (examples/demo: a 3 x 3 float array at the invented shelf site), writing
# ./swellyield-out. Idempotent: a second run reuses the hydrodynamic cache in
# swellyield-out/cache. --no-setup skips the package check (used by check.sh).
set -euo pipefail
cd "$(dirname "$0")/.."
[ "${1:-}" = "--no-setup" ] || bash scripts/setup-debian.sh
cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
cmake --build build -j "$(nproc 2>/dev/null || echo 2)"
./build/bin/swellyield run -o swellyield-out
