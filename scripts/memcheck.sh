#!/usr/bin/env bash
# The C test executables under valgrind memcheck (zero errors expected; OpenBLAS kernel
# over-reads suppressed by tests/valgrind.supp). Slow: not part of check.sh. Usage:
#   bash scripts/memcheck.sh [BUILD_DIR] [REGEX]   (default build, all tests)
set -uo pipefail
cd "$(dirname "$0")/.."
src=$PWD
build=$(cd "${1:-build}" && pwd)
regex=${2:-.}
status=0
for t in "$build"/tests/*_test_*; do
    name=$(basename "$t")
    [[ "$name" =~ $regex ]] || continue
    module=${name%%_test_*}
    if (cd "$src/tests/$module" && SY_SOURCE_DIR=$src SY_BUILD_DIR=$build SY_PYTHON=/usr/bin/python3 \
        valgrind -q --error-exitcode=9 --leak-check=full --suppressions="$src/tests/valgrind.supp" "$t" >/dev/null); then
        echo "memcheck clean: $name"
    else
        echo "memcheck FAILED: $name"
        status=1
    fi
done
exit $status
