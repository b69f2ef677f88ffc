#!/usr/bin/env bash
# The whole ctest suite under valgrind memcheck, zero errors expected: see
# scripts/memcheck.py and docs/robustness.md ("Valgrind"). Slow (about half an hour on two idle cores):
# not part of check.sh. Usage:
#   bash scripts/memcheck.sh [-j N] [--timeout S] [--logs DIR] [--shortest-first] [BUILD_DIR [REGEX]]
exec /usr/bin/python3 "$(dirname "$0")/memcheck.py" "$@"
