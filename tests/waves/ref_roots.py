#!/usr/bin/python3
"""Independent reference roots of the finite-depth dispersion relation, printed one per
line as "m re im" for tests/waves/test_dispersion.c (called at test time).

usage: ref_roots.py omega_re omega_im h g m1 [m2 ...]
m = 0: omega^2 = g k tanh(k h); m >= 1: omega^2 = -g k tan(k h).
Method (mpmath, 40 digits), independent of the C code: the real root at Re(omega) by
bisection-polished findroot in the bracket of references.md section 1, then continuation
to complex omega along the vertical path in 100 equal steps, each a findroot started
from the previous root (secant method)."""
import sys
import mpmath as mp

mp.mp.dps = 40


def real_root(m, y):
    if m == 0:
        f = lambda x: x * mp.tanh(x) - y
        lo, hi = max(y, mp.sqrt(y)), y + mp.sqrt(y)
    else:
        f = lambda x: x * mp.tan(x) + y
        lo, hi = (m - mp.mpf(1) / 2) * mp.pi * (1 + mp.mpf(10) ** -30), m * mp.pi * (1 - mp.mpf(10) ** -30)
    return mp.findroot(f, (lo, hi), solver='anderson')


def main():
    wr, wi, h, g = (mp.mpf(a) for a in sys.argv[1:5])
    for m in (int(a) for a in sys.argv[5:]):
        x = real_root(m, wr * wr * h / g)
        n = 100 if wi != 0 else 0
        for j in range(1, n + 1):
            w = mp.mpc(wr, wi * j / n)
            y = w * w * h / g
            if m == 0:
                f = lambda x: x * mp.tanh(x) - y
            else:
                f = lambda x: x * mp.tan(x) + y
            x = mp.findroot(f, x)
        k = x / h
        print(m, mp.nstr(mp.re(k), 25), mp.nstr(mp.im(k), 25))


main()
