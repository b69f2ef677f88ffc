# Reference for tests/poles/test_scattering_poles.c (not a test itself; run by hand with
# /usr/bin/python3): the scattering resonance nearest the real axis of two bottom-mounted
# columns (radius 5 m, centres 12 m apart, depth 50 m, orders -16..16), written
# independently of the C code from Linton & Evans (1990), J. Fluid Mech. 215: sound-hard
# cylinder D_n = -J_n'(ka) / H_n'(ka), Graf's addition theorem for the translation
# H_{n-m}(kL) e^{i (n-m) alpha} (alpha: direction from the source to the receiving body),
# a secant on det(I - D T) in the complex k plane from a start found by an argument-principle
# scan, omega = sqrt(g k tanh(k h)). numpy 1.24, scipy 1.10 (Debian).
import numpy as np, scipy.special as sp
a, L, M, h, g = 5.0, 12.0, 16, 50.0, 9.81
n = np.arange(-M, M+1)
def system(k):
    D = -sp.jvp(n, k*a)/sp.h1vp(n, k*a)
    T = lambda alpha: np.array([[sp.hankel1(q-p, k*L)*np.exp(1j*(q-p)*alpha) for q in n] for p in n])
    N = 2*M+1
    A = np.eye(2*N, dtype=complex)
    A[:N, N:] = -D[:,None]*T(np.pi)   # body 1 (x=0) receives from body 2: direction 2->1 is pi
    A[N:, :N] = -D[:,None]*T(0.0)
    return A
def det(k): return np.linalg.det(system(k))
k0, k1 = 0.1637-0.0663j, 0.1640-0.0660j
f0, f1 = det(k0), det(k1)
for it in range(60):
    k2 = k1 - f1*(k1-k0)/(f1-f0)
    k0, f0, k1, f1 = k1, f1, k2, det(k2)
    if abs(k1-k0) < 1e-15: break
w = np.sqrt(g*k1*np.tanh(k1*h))
u, s, vh = np.linalg.svd(system(k1))
v = vh[-1].conj()
print("k = %.15f%+.15fi, omega = %.15f%+.15fi, ratio beta2_00/beta1_00 = %.6f%+.6fi, smin/smax %.2e" % (k1.real, k1.imag, w.real, w.imag, *(lambda r: (r.real, r.imag))(v[2*M+1+M]/v[M]), s[-1]/s[0]))
