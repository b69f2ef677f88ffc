# Reference for tests/poles/test_scattering_poles.c (not a test itself; run by hand with
# /usr/bin/python3): a double scattering resonance of four bottom-mounted columns at the
# corners of a square (radius 5 m, side 14 m, depth 50 m, orders -12..12), written
# independently of the C code as ref_two_columns.py (Linton & Evans 1990, J. Fluid Mech.
# 215: D_n = -J_n'(ka) / H_n'(ka), Graf's addition theorem H_{n-m}(kL) e^{i (n-m) alpha},
# alpha the direction from the source to the receiving body). The square's symmetry group
# (C4v) has a two-dimensional representation, so det(I - D T) has double zeros; a double
# zero is a simple zero of f^(1/2), found here by a secant on f^(1/2) in the complex k plane
# (ratios f0 / f1 from log-determinants) from the start given below, then mapped to omega by
# omega^2 = g k tanh(k h). log |f| at the root against its size nearby shows the zero; the
# winding of f on a small circle around it (radius 1e-3 |k|, 64 points) is its multiplicity.
# numpy 1.24, scipy 1.10 (Debian).
import numpy as np, scipy.special as sp
a, M, h, g = 5.0, 12, 50.0, 9.81
xy = np.array([[0.0, 0.0], [14.0, 0.0], [0.0, 14.0], [14.0, 14.0]])
n = np.arange(-M, M + 1)
N = 2 * M + 1
def system(k):
    D = -sp.jvp(n, k * a) / sp.h1vp(n, k * a)
    A = np.eye(4 * N, dtype=complex)
    for i in range(4):
        for j in range(4):
            if i == j:
                continue
            d = xy[i] - xy[j]
            L, al = np.hypot(*d), np.arctan2(d[1], d[0])
            T = np.array([[sp.hankel1(q - p, k * L) * np.exp(1j * (q - p) * al) for q in n] for p in n])
            A[i * N:(i + 1) * N, j * N:(j + 1) * N] = -D[:, None] * T
    return A
def logdet(k):
    s, l = np.linalg.slogdet(system(k))
    return np.log(s) + l
def wavenumber(w):  # Newton on w^2 = g k tanh(k h), complex
    k = w * w / g
    for _ in range(50):
        f = g * k * np.tanh(k * h) - w * w
        k -= f / (g * np.tanh(k * h) + g * k * h / np.cosh(k * h) ** 2)
    return k
k0 = wavenumber(1.3558 - 0.2330j)  # start: near the C code's pole (within ~1e-3 works)
k1 = k0 * (1 + 1e-4)
l0, l1 = logdet(k0), logdet(k1)
for it in range(60):
    step = (k1 - k0) / (1 - np.exp((l0 - l1) / 2))
    k0, l0 = k1, l1
    k1 = k1 - step
    l1 = logdet(k1)
    if abs(step) < 1e-15 * abs(k1):
        break
k = k1
w = np.sqrt(g * k * np.tanh(k * h))
ph = np.unwrap([logdet(k + 1e-3 * abs(k) * np.exp(2j * np.pi * j / 64)).imag for j in range(65)])
print("k = %.15f%+.15fi, omega = %.15f%+.15fi, log|f| at the root %.1f, at 1e-3 from it %.1f, winding %.3f"
      % (k.real, k.imag, w.real, w.imag, logdet(k).real, logdet(k * (1 + 1e-3)).real, (ph[-1] - ph[0]) / (2 * np.pi)))
