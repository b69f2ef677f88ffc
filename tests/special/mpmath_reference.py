"""Reference values for tests/special/test_mpmath.c, computed at test time with
mpmath (Debian python3-mpmath) at 20 significant digits (the scale column at 15). Run by the C test through
$SY_PYTHON; prints one value per line:

    version <mpmath version>
    A <kind> <nmax> <n> <Re z> <Im z> <Re value> <Im value> <scale>   (arrays, orders 0..nmax)
    S <kind> <n> <Re z> <Im z> <Re value> <Im value> <scale>          (scalars, n may be < 0)
    N <kind> <nu> <Re z> <Im z> <Re value> <Im value> <scale>         (real order nu)

kinds: J = besselj(n, z), Y = bessely(n, z), H1 = hankel1(n, z),
I = besseli(n, z) * exp(-|Re z|), K = besselk(n, z) * exp(z).
scale: the size against which the error is measured (see the C test): |value| for the
minimal solution where it decays; for J (and I) in the oscillatory range n < |z| also
the partner |Y_n| (|K_n| scaled alike), because the double-precision recurrence (and
GSL) keeps an absolute error of that size near zeros of J_n.
Invented argument table (nothing measured): small, moderate, large |z|, near the real
and imaginary axes, Re z < 0, orders 0..30 and fractional orders 1/6, 13/6, 25/6."""
import mpmath as mp

mp.mp.dps = 20
NMAX = 30
# Orders checked in each array (mpmath's integer-order Y and K are slow; these cover
# the start, the middle and the end of each recurrence).
ORDERS = [0, 1, 2, 3, 5, 8, 12, 17, 23, 29, 30]

COMPLEX_Z = [
    0.01 + 0.005j, 1e-3 - 2e-3j,                       # small
    0.37 + 0.11j, 1.37 - 0.42j, 2.4048 - 0.3j,          # moderate, near a zero of J0
    5.3 + 0.02j, 5.3 - 0.02j, 12.7 - 1.9j,              # near the real axis
    0.4 + 3.1j, 0.05 + 7.3j, 0.02 - 6.1j, 3.7j,         # near the imaginary axis
    47.5 - 3.2j, 120.3 + 0.7j, 980.0 - 12.0j,           # large
    3.0 + 25.0j,                                        # H1 exponentially small
    10.0 - 400.0j, 1e-7 + 1e-7j,                         # beyond the fast path (Arb)
    -1.3 + 0.6j, -7.2 - 2.5j, -0.3 - 0.05j, -4.1 + 1e-3j,  # Re z < 0 (principal branch)
]
REAL_Z = [0.37, 2.4048255576957728, 13.7, 47.5, 980.0]
REAL_Z_J_I = [0.0, -3.3, -0.61, 1e-9]                    # J, I only (entire); 1e-9: J_30 subnormal
# Fractional orders as the doubles the C code passes (1/6 rounded to double, etc.).
NU = [mp.mpf(1.0 / 6), mp.mpf(13.0 / 6), mp.mpf(25.0 / 6), mp.mpf(0.5), mp.mpf(7), mp.mpf(30.25),
      mp.mpf(15.0294)]  # GSL 2.7 Jnu is off by 7e-9 there


def value(kind, n, z):
    z = mp.mpc(z)
    if kind == 'J':
        return mp.besselj(n, z)
    if kind == 'Y':
        return mp.bessely(n, z)
    if kind == 'H1':
        # mpmath sums J + iY: for Im z > 0 that cancels ~2 Im z / ln 10 digits, so
        # the working precision is raised by as much (checked: at 3+25i, 30 digits
        # give H1_0 right to only 1e-13 relative).
        extra = int(2 * max(0, float(z.imag)) / 2.3) + 5
        with mp.workdps(mp.mp.dps + extra):
            return +mp.hankel1(n, z)
    if kind == 'I':
        return mp.besseli(n, z) * mp.exp(-abs(z.real))
    if kind == 'K':
        return mp.besselk(n, z) * mp.exp(z)
    raise ValueError(kind)


def scale(kind, n, z, v):
    """Size of the error budget (see the module comment); a tolerance, so 15 digits
    (mpmath's integer-order Y and K are several times faster there)."""
    with mp.workdps(15):
        return +scale_exact(kind, n, z, v)


def scale_exact(kind, n, z, v):
    if kind == 'J' and abs(n) < abs(z) and z != 0 and not (mp.im(z) == 0 and mp.re(z) < 0):
        return max(abs(v), abs(mp.bessely(n, z)))
    if kind == 'I' and abs(n) < abs(z) and z != 0 and not (mp.im(z) == 0 and mp.re(z) < 0):
        return max(abs(v), abs(mp.besselk(n, z) * mp.exp(-abs(mp.re(z)))))
    return abs(v)


def emit(tag, kind, order, z, extra=''):
    v = value(kind, order, z)
    s = scale(kind, order, z, v)
    z = complex(z)
    order = repr(float(order)) if tag == 'N' else order
    print(f"{tag} {kind} {extra}{order} {z.real!r} {z.imag!r} "
          f"{mp.nstr(mp.re(v), 20)} {mp.nstr(mp.im(v), 20)} {mp.nstr(s, 20)}")


print("version", mp.__version__)
for z in COMPLEX_Z + REAL_Z:
    for kind in ('J', 'H1', 'I', 'K'):
        for n in ORDERS:
            emit('A', kind, n, z, f"{NMAX} ")
for z in REAL_Z_J_I:
    for kind in ('J', 'I'):
        for n in ORDERS:
            emit('A', kind, n, z, f"{NMAX} ")
for z in [1.37 - 0.42j, -7.2 - 2.5j, 13.7, 0.37]:
    for kind in ('J', 'Y', 'H1'):
        for n in (-7, -2, 0, 1, 5, 23):
            emit('S', kind, n, z)
for z in [0.37 + 0.11j, 12.7 - 1.9j, 980.0 - 12.0j, -1.3 + 0.6j, 0.4 + 3.1j, 0.37, 13.7, 980.0,
          1e-7 + 2e-7j, 1e-7, 2500.0]:
    for nu in NU:
        for kind in ('J', 'I'):
            emit('N', kind, nu, z)
