"""PASS/FAIL lines for the climate Python tests (mirrors tests/common/check.h)."""
import sys

failed = 0


def check(ok, what):
    """One PASS/FAIL line per check; counts failures."""
    global failed
    print("%s: %s" % ("PASS" if ok else "FAIL", what))
    if not ok:
        failed += 1
    return ok


def summary():
    """Print the failure count and exit non-zero if any check failed."""
    print("%d failed" % failed)
    sys.exit(1 if failed else 0)
