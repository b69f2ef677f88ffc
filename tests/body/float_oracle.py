"""TEST ORACLE (not library code): plain eigenfunction mode matching for one floating
truncated vertical cylinder (radius a, draft d, depth h), written independently of the C
Galerkin solver in src/body/float_*.c, so that the two can be compared number by number.

Method (Yeung 1981; Garrett 1971 for diffraction; the textbook two-region matching):
exterior r > a, -h < z < 0:   phi = sum_q (a_q Jhat_q(r) + beta_q Hhat_q(r)) Z_q(z)
interior r < a, -h < z < -d:  phi = phi_p + sum_j c_j Ihat_j(r) cos(j pi (z + h) / b)
matched on r = a: normal velocity projected on Z_q over -h < z < 0 (wall velocity on the
body, interior velocity in the gap), potential projected on cos_j over the gap. No edge
treatment, so it converges algebraically; run it with many modes. Real omega only, scipy.

Conventions as include/swellyield/body.h: e^{-i omega t}, Z_0 = cosh(k0 (z+h))/cosh(k0 h),
Z_q = cos(k_q (z+h))/cos(k_q h), Jhat = J_n, I_n; Hhat = H^(1)_n, K_n; modes surge..pitch,
rotation about (0, 0, z_rot); B - i omega A = i omega rho int phi_j n_i dS.
"""
import numpy as np
from scipy import special as sp
from scipy.optimize import brentq


def roots(omega, h, g, n):
    """Propagating root k0 and the first n evanescent roots (rad/m)."""
    K = omega * omega / g
    f = lambda k: k * np.tanh(k * h) - K
    hi = max(K, np.sqrt(K / h)) * 2 + 1.0 / h
    k0 = brentq(f, 1e-14, hi, xtol=1e-15, rtol=1e-15)
    ks = []
    for m in range(1, n + 1):
        fe = lambda x: x * np.tan(x) + K * h  # x = k h
        lo, up = (m - 0.5) * np.pi + 1e-12 * m, m * np.pi - 1e-12 * m
        ks.append(brentq(fe, lo, up, xtol=1e-15, rtol=1e-15) / h)
    return k0, np.array(ks)


class Float:
    def __init__(self, a, d, h, z_rot=0.0, g=9.81, rho=1025.0, nq=200, nj=None):
        self.a, self.d, self.h, self.zr, self.g, self.rho = a, d, h, z_rot, g, rho
        self.b = h - d
        self.nq = nq
        self.nj = nj if nj is not None else max(8, int(round(nq * self.b / h)))

    # depth-mode integrals ------------------------------------------------------------
    def setup(self, omega):
        h, b, d = self.h, self.b, self.d
        k0, ke = roots(omega, h, self.g, self.nq - 1)
        self.omega, self.k0 = omega, k0
        k = np.concatenate([[k0], ke])
        self.k = k
        N = np.empty(self.nq)
        wall1 = np.empty(self.nq)  # int_{-d}^0 Z_q dz
        wallz = np.empty(self.nq)  # int_{-d}^0 z Z_q dz
        L = np.empty((self.nj, self.nq))  # int_gap cos_j Z_q dz
        lam = np.arange(self.nj) * np.pi / b
        self.lam = lam
        sgn = (-1.0) ** np.arange(self.nj)
        # q = 0 (hyperbolic)
        c = np.cosh(k0 * h)
        N[0] = (h / 2 + np.sinh(2 * k0 * h) / (4 * k0)) / c**2
        wall1[0] = (np.sinh(k0 * h) - np.sinh(k0 * b)) / (k0 * c)
        wallz[0] = (d * np.sinh(k0 * b) / k0 - (np.cosh(k0 * h) - np.cosh(k0 * b)) / k0**2) / c
        L[:, 0] = sgn * k0 * np.sinh(k0 * b) / (k0**2 + lam**2) / c
        for q in range(1, self.nq):
            kq = k[q]
            c = np.cos(kq * h)
            N[q] = (h / 2 + np.sin(2 * kq * h) / (4 * kq)) / c**2
            wall1[q] = (np.sin(kq * h) - np.sin(kq * b)) / (kq * c)
            wallz[q] = (d * np.sin(kq * b) / kq + (np.cos(kq * h) - np.cos(kq * b)) / kq**2) / c
            L[:, q] = sgn * kq * np.sin(kq * b) / (kq**2 - lam**2) / c
        self.N, self.wall1, self.wallz, self.L = N, wall1, wallz, L

    def radial(self, m):
        """Values and r-derivatives at r = a of Jhat, Hhat (exterior) and Ihat (interior)."""
        a, k = self.a, self.k
        J = np.empty(self.nq, complex); Jp = np.empty(self.nq, complex)
        H = np.empty(self.nq, complex); Hp = np.empty(self.nq, complex)
        x = k[0] * a
        J[0], Jp[0] = sp.jv(m, x), k[0] * sp.jvp(m, x)
        H[0], Hp[0] = sp.hankel1(m, x), k[0] * sp.h1vp(m, x)
        x = k[1:] * a
        # scaled forms: only ratios are used, common factors cancel per mode
        J[1:] = sp.ive(m, x); Jp[1:] = k[1:] * sp.ivp(m, x) * np.exp(-x)
        H[1:] = sp.kve(m, x); Hp[1:] = k[1:] * sp.kvp(m, x) * np.exp(x)
        Ip = np.empty(self.nj)
        Ip[0] = m / a
        x = self.lam[1:] * a
        Ip[1:] = self.lam[1:] * sp.ivp(m, x) / sp.iv(m, x) if m == 0 or True else 0
        return J, Jp, H, Hp, Ip

    def solve(self, m, V=None, part=None, inc=None):
        """Order m. V: wall velocity projections (vector over q) or None; part:
        ('heave'|'pitch') interior particular solution; inc: incident mode index q'.
        Returns beta (nq), c (nj) and the exterior/interior values needed for forces."""
        nq, nj, b, a = self.nq, self.nj, self.b, self.a
        J, Jp, H, Hp, Ip = self.radial(m)
        lam = self.lam
        Mj = np.full(nj, b / 2); Mj[0] = b
        # particular solution projections: P_j = int_gap d_r phi_p cos_j, S_j = int_gap phi_p cos_j
        Pg = np.zeros(nq, complex)   # int_gap d_r phi_p Z_q
        Sj = np.zeros(nj)            # int_gap phi_p cos_j
        if part == 'heave':
            # phi_p = ((z+h)^2 - r^2/2)/(2b); d_r phi_p = -a/(2b)
            Pg = -a / (2 * b) * self.gap1()
            s2 = self.gap_s2_cos()
            Sj = (s2 - a * a / 2 * self.gap_cos1()) / (2 * b)
        elif part == 'pitch':
            # phi_p = -((z+h)^2 r - r^3/4)/(2b); d_r phi_p = -((z+h)^2 - 3a^2/4)/(2b)
            Pg = -(self.gap_s2() - 0.75 * a * a * self.gap1()) / (2 * b)
            Sj = -(a * self.gap_s2_cos() - a**3 / 4 * self.gap_cos1()) / (2 * b)
        # unknowns: beta (nq), c (nj)
        A = np.zeros((nq + nj, nq + nj), complex)
        rhs = np.zeros(nq + nj, complex)
        # velocity: N_q (a_q Jp + beta Hp) = V_q + sum_j c_j Ip_j L_jq + Pg_q
        A[:nq, :nq] = np.diag(self.N * Hp)
        A[:nq, nq:] = -(self.L * Ip[:, None]).T
        rhs[:nq] = Pg + (V if V is not None else 0)
        # potential: sum_q (a_q J + beta H) L_jq = M_j c_j + S_j
        A[nq:, :nq] = self.L * H[None, :]
        A[nq:, nq:] = -np.diag(Mj)
        rhs[nq:] = Sj
        if inc is not None:
            rhs[inc] -= self.N[inc] * Jp[inc]
            rhs[nq:] -= self.L[:, inc] * J[inc]
        x = np.linalg.solve(A, rhs)
        beta, c = x[:nq], x[nq:]
        phi_ext = beta * H  # coefficients of Z_q of phi(a, z) (scattered/radiated part)
        if inc is not None:
            phi_ext = phi_ext.copy(); phi_ext[inc] += J[inc]
        return beta, c, phi_ext

    # gap integrals, s = z + h in [0, b]
    def gap1(self):
        k, b, h = self.k, self.b, self.h
        out = np.empty(self.nq)
        out[0] = np.sinh(k[0] * b) / k[0] / np.cosh(k[0] * h)
        out[1:] = np.sin(k[1:] * b) / k[1:] / np.cos(k[1:] * h)
        return out

    def gap_s2(self):
        k, b, h = self.k, self.b, self.h
        out = np.empty(self.nq)
        x = k[0]
        out[0] = ((b * b / x + 2 / x**3) * np.sinh(x * b) - 2 * b / x**2 * np.cosh(x * b)) / np.cosh(x * h)
        x = k[1:]
        out[1:] = ((b * b / x - 2 / x**3) * np.sin(x * b) + 2 * b / x**2 * np.cos(x * b)) / np.cos(x * h)
        return out

    def gap_cos1(self):
        o = np.zeros(self.nj); o[0] = self.b; return o

    def gap_s2_cos(self):
        b, lam = self.b, self.lam
        o = np.empty(self.nj)
        o[0] = b**3 / 3
        o[1:] = 2 * b * np.cos(lam[1:] * b) / lam[1:] ** 2
        return o

    # bottom integrals int_0^a Ihat_j(r) r^{m+1} dr
    def bottom_int(self, m):
        a, lam = self.a, self.lam
        o = np.empty(self.nj)
        o[0] = a ** (m + 2) / (2 * m + 2)  # (r/a)^m r^{m+1}
        x = lam[1:] * a
        o[1:] = a ** (m + 1) * sp.ive(m + 1, x) / (lam[1:] * sp.ive(m, x))
        return o

    def radiation(self, omega):
        """5x5 added mass and damping, and R (exterior coefficients) for heave (m = 0),
        surge-profile and pitch-profile (m = 1)."""
        self.setup(omega)
        a, b, rho, zr = self.a, self.b, self.rho, self.zr
        sgn = (-1.0) ** np.arange(self.nj)
        out = {}
        # heave, m = 0: Pi_3 = - int_0^a phi(r,-d) r dr
        beta, c, pe = self.solve(0, part='heave')
        bot = np.sum(c * sgn * self.bottom_int(0)) + (b * b * a * a / 2 - a**4 / 8) / (2 * b)
        X33 = 2 * np.pi * (-bot)
        out['heave'] = (beta, X33)
        # m = 1 profiles: surge (wall 1) and pitch (wall z - zr, bottom dphi/dz = -r)
        Vs = self.wall1.astype(complex)
        Vp = (self.wallz - zr * self.wall1).astype(complex)
        bs, cs, pes = self.solve(1, V=Vs)
        bp, cp, pep = self.solve(1, V=Vp, part='pitch')
        bi = self.bottom_int(1)
        def Pi(pe, c, mode, partp):
            wallI = a * np.sum(pe * (self.wall1 if mode == 's' else self.wallz - zr * self.wall1))
            if mode == 's':
                return wallI
            bot = np.sum(c * sgn * bi)
            if partp:
                bot += -(b * b * a**4 / 4 - a**6 / 24) / (2 * b)  # int phi_p(r,-d) r^2 dr
            return wallI + bot  # - int phi W r dr with W = -r
        # X_ij = 2 pi sum_m nu_{i,-m} nu_{j,m} Pi_i[phi_j] = pi Pi_i[phi_j] for i, j in {1, 5}
        X11 = np.pi * Pi(pes, cs, 's', False)
        X15 = np.pi * Pi(pep, cp, 's', True)
        X51 = np.pi * Pi(pes, cs, 'p', False)
        X55 = np.pi * Pi(pep, cp, 'p', True)
        Z = lambda X: 1j * omega * rho * X
        A = np.zeros((5, 5)); B = np.zeros((5, 5))
        for (i, j, X) in [(0, 0, X11), (0, 4, X15), (4, 0, X51), (4, 4, X55), (2, 2, X33)]:
            z = Z(X)
            B[i, j], A[i, j] = z.real, -z.imag / omega
        A[1, 1], B[1, 1] = A[0, 0], B[0, 0]
        A[3, 3], B[3, 3] = A[4, 4], B[4, 4]
        A[1, 3], B[1, 3] = -A[0, 4], -B[0, 4]
        A[3, 1], B[3, 1] = -A[4, 0], -B[4, 0]
        out['A'], out['B'] = A, B
        out['R_surge'], out['R_pitch'] = bs, bp
        return out

    def excitation(self, omega, beta_dir=0.0, A_wave=1.0):
        """Excitation force/moment per unit amplitude for a plane wave (conventions.md):
        phi_I = -(i g A/omega) Z_0 exp(i k r cos(theta - beta)) = sum_n a_n J_n Z_0 e^{i n theta},
        a_n = -(i g A/omega) i^n e^{-i n beta}. Returns X[5]."""
        self.setup(omega)
        a, b, rho, zr = self.a, self.b, self.rho, self.zr
        sgn = (-1.0) ** np.arange(self.nj)
        g = self.g
        an = lambda n: -(1j * g * A_wave / omega) * (1j ** n) * np.exp(-1j * n * beta_dir)
        X = np.zeros(5, complex)
        # m = 0: heave
        _, c0, _ = self.solve(0, inc=0)
        Pi3 = -np.sum(c0 * sgn * self.bottom_int(0))
        X[2] = -1j * omega * rho * 2 * np.pi * an(0) * Pi3
        # m = 1: order +1 and -1 components; J_{-1} = -J_1 so a_{-1} J_{-1} = -a_{-1} J_1
        _, c1, pe1 = self.solve(1, inc=0)
        bi = self.bottom_int(1)
        Pis = a * np.sum(pe1 * self.wall1)
        Pip = a * np.sum(pe1 * (self.wallz - zr * self.wall1)) + np.sum(c1 * sgn * bi)
        w1, wm1 = an(1), -an(-1)   # coefficients of J_1 Z_0 e^{+i theta}, e^{-i theta}
        nu = {1: (0.5, 0.5), 2: (1 / 2j, -1 / 2j), 4: (-1 / 2j, 1 / 2j), 5: (0.5, 0.5)}
        for i, Pi in [(1, Pis), (2, Pis), (4, Pip), (5, Pip)]:
            nup, num = nu[i]  # nu_{i,+1}, nu_{i,-1}
            # F_i = -i omega rho 2 pi sum_m nu_{i,-m} Pi_i[phi_m]
            X[i - 1] = -1j * omega * rho * 2 * np.pi * (num * w1 * Pi + nup * wm1 * Pi)
        return X


def quantities(a, d, h, z_rot, omega, nq):
    f = Float(a, d, h, z_rot=z_rot, nq=nq)
    r = f.radiation(omega)
    X = f.excitation(omega)
    A, B = r['A'], r['B']
    return {'A11': A[0, 0], 'A15': A[0, 4], 'A55': A[4, 4], 'A33': A[2, 2],
            'B11': B[0, 0], 'B15': B[0, 4], 'B55': B[4, 4], 'B33': B[2, 2],
            'X1': abs(X[0]), 'X3': abs(X[2]), 'X5': abs(X[4])}


if __name__ == "__main__":
    # usage: float_oracle.py a d h z_rot omega nq
    # prints "name extrapolated change" per quantity: values at nq and 2 nq exterior modes,
    # Richardson-extrapolated with the observed O(nq^-2) rate, and |v(2nq) - v(nq)|.
    import sys
    a, d, h, zr, om = (float(v) for v in sys.argv[1:6])
    nq = int(sys.argv[6]) if len(sys.argv) > 6 else 200
    v1 = quantities(a, d, h, zr, om, nq)
    v2 = quantities(a, d, h, zr, om, 2 * nq)
    for key in v1:
        ext = v2[key] + (v2[key] - v1[key]) / 3.0
        print(key, repr(float(ext)), repr(float(abs(v2[key] - v1[key]))))
