#!/usr/bin/env bash
# README command (2): install what is missing, build, run the demo, then the whole test
# suite twice: the normal build and the AddressSanitizer + UBSan build; then the libFuzzer
# harnesses (clang, ASan + UBSan), a minute each from the committed seed corpus
# (docs/robustness.md). Idempotent. About 8 minutes on 2 free cores.
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
cmake -S . -B build-fuzz -DCMAKE_C_COMPILER=clang -DSY_FUZZ=ON -DSY_BUILD_TESTS=OFF -DSY_WITH_OPENMP=OFF >/dev/null
cmake --build build-fuzz -j "$jobs"
ctest --test-dir build-fuzz -j "$jobs" -L fuzz --output-on-failure
