#!/usr/bin/env bash
# README command (2): install what is missing, build, run the demo, then the whole test
# suite twice: the normal build and the AddressSanitizer + UBSan build. Idempotent.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup-debian.sh
jobs=$(nproc 2>/dev/null || echo 2)
cmake -S . -B build -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
cmake --build build -j "$jobs"
bash scripts/demo.sh --no-setup
ctest --test-dir build -j "$jobs" --output-on-failure
cmake -S . -B build-asan -DCMAKE_BUILD_TYPE=Debug -DSY_SANITIZE=ON >/dev/null
cmake --build build-asan -j "$jobs"
ASAN_OPTIONS=detect_leaks=1 UBSAN_OPTIONS=print_stacktrace=1 \
  ctest --test-dir build-asan -j "$jobs" --output-on-failure -LE slow
