#!/usr/bin/python3
"""Independent reference values for tests/sea (called at test time with /usr/bin/python3).

usage: ref_spectra.py shape GAMMA...
         prints per gamma: gamma A_exact Hm0/Hs(DNV A) Te/Tp Tz/Tp T1/Tp eps0
       ref_spectra.py power GAMMA NORM HS TE H RHO G
         prints J [W/m] = rho g int S(w) cg(w, h) dw for the JONSWAP (GAMMA = 1: PM) with
         Hs, Te given, NORM = dnv|exact; H = inf for deep water.
Shape s(u) = u^-5 exp(-5/4 u^-4) gamma^exp(-(u-1)^2/(2 sigma^2)), sigma 0.07/0.09
(references.md 2.3, DNV-RP-C205 form). Every integral is done twice, by
scipy.integrate.quad and by mpmath.quad (30 digits), split at the peak; the script
fails if the two disagree by more than 1e-10 relative. The dispersion relation is
solved with scipy.optimize.brentq, independently of the C code."""
import math
import sys

import mpmath as mp
from scipy import integrate, optimize

mp.mp.dps = 30
CUTS = [0.0, 0.5, 0.9, 1.0, 1.1, 1.5, 2.0, 4.0, math.inf]


def shape(u, g):
    if u <= 0.0 or 1.25 / u ** 4 > 700:
        return 0.0
    sig = 0.07 if u <= 1 else 0.09
    return u ** -5 * math.exp(-1.25 / u ** 4) * g ** math.exp(-(u - 1) ** 2 / (2 * sig * sig))


def shape_mp(u, g):
    if u <= 0:
        return mp.mpf(0)
    sig = mp.mpf('0.07') if u <= 1 else mp.mpf('0.09')
    return u ** -5 * mp.exp(-mp.mpf(5) / 4 / u ** 4) * mp.mpf(g) ** mp.exp(-(u - 1) ** 2 / (2 * sig * sig))


def quad_both(f, fmp):
    a = sum(integrate.quad(f, lo, hi, epsabs=0, epsrel=1e-13, limit=500)[0]
            for lo, hi in zip(CUTS[:-1], CUTS[1:]))
    b = float(mp.quad(fmp, [mp.mpf(c) if c != math.inf else mp.inf for c in CUTS]))
    if abs(a - b) > 1e-10 * abs(b):
        sys.exit("scipy %r and mpmath %r disagree" % (a, b))
    return b


def mu(n, g):
    return quad_both(lambda u: u ** n * shape(u, g), lambda u: u ** n * shape_mp(u, g))


def shape_mode(gammas):
    for g in gammas:
        m = {n: mu(n, g) for n in (-2, -1, 0, 1, 2)}
        a_exact = 1 / (5 * m[0])
        a_dnv = 1 - 0.287 * math.log(g)
        print(g, repr(a_exact), repr(math.sqrt(5 * a_dnv * m[0])), repr(m[-1] / m[0]),
              repr(math.sqrt(m[0] / m[2])), repr(m[0] / m[1]),
              repr(math.sqrt(m[0] * m[-2] / m[-1] ** 2 - 1)))


def wavenumber(w, h, grav):
    if math.isinf(h):
        return w * w / grav
    y = w * w * h / grav
    x = optimize.brentq(lambda x: x * math.tanh(x) - y, max(y, math.sqrt(y)) * (1 - 1e-15),
                        y + math.sqrt(y) + 1e-300, xtol=1e-300, rtol=1e-15, maxiter=500)
    return x / h


def cg(w, h, grav):
    k = wavenumber(w, h, grav)
    if math.isinf(h) or k * h > 350:
        return 0.5 * w / k
    return 0.5 * w / k * (1 + 2 * k * h / math.sinh(2 * k * h))


def power_mode(g, norm, hs, te, h, rho, grav):
    m0, m_1 = mu(0, g), mu(-1, g)
    tp = te * m0 / m_1
    wp = 2 * math.pi / tp
    a = 1 / (5 * m0) if norm == 'exact' else 1 - 0.287 * math.log(g)
    scale = a * 5 / 16 * hs * hs / wp

    def f(w):
        return scale * shape(w / wp, g) * cg(w, h, grav) if w > 0 else 0.0
    cuts = [c * wp for c in CUTS]
    total = sum(integrate.quad(f, lo, hi, epsabs=0, epsrel=1e-12, limit=500)[0]
                for lo, hi in zip(cuts[:-1], cuts[1:]))
    print(repr(rho * grav * total))


if sys.argv[1] == 'shape':
    shape_mode([float(g) for g in sys.argv[2:]])
else:
    g, norm, hs, te, h, rho, grav = sys.argv[2:9]
    power_mode(float(g), norm, float(hs), float(te), float(h), float(rho), float(grav))
