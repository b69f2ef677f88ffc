/* Complex-argument Bessel arrays in plain double complex arithmetic, the fast path
 * for Re z >= 0 (the hydrodynamics' k r, k a just off the positive real axis).
 * Everything is built from K_0, K_1 (scaled, e^{w} K(w), Re w >= 0):
 *  - |w| <= KSERIES_MAX: the ascending series DLMF 10.31.2 (K_0) and 10.31.1 with
 *    n = 1 (K_1); |w| > KSERIES_MAX: Steed's continued fraction CF2 with Temme's sum
 *    (Temme 1975, J. Comput. Phys. 19; as in Press et al., Numerical Recipes, 2nd ed.,
 *    section 6.7, routine bessik, at order 0), valid for |arg w| < pi.
 *  - K_n: upward recurrence (DLMF 10.29.1), stable for Re w >= 0 (K is dominant).
 *  - H^(1)_n(z) = (2/(pi i)) (-i)^n K_n(-iz), H^(2)_n(z) = (2i/pi) i^n K_n(iz)
 *    (DLMF 10.27.8), each used where its K argument has Re >= 0.
 *  - J_n, I_n: ratios from the continued fraction CF1 (DLMF 10.10.1, 10.33.1) at
 *    order nmax, downward recurrence (Miller), normalised by a Wronskian with the
 *    Hankel or K pair: J_1 H_0 - J_0 H_1 = 2i/(pi z) (H = H^(1); with H^(2) the sign
 *    flips), I_0 K_1 + I_1 K_0 = 1/z (DLMF 10.5.2-5, 10.28.2). The Hankel function
 *    is taken on the side where |J H| ~ 1/|z|, so the Wronskian sum does not cancel:
 *    H^(1) for Im z >= 0, H^(2) for Im z < 0, and then H^(1) = 2J - H^(2).
 * Real orders nu (syi_special_fast_nu): |z| <= 2 the ascending series; beyond, the
 * same CF1 + Wronskian scheme at orders mu = nu - floor(nu), mu + 1, with CF2 at order
 * mu (Temme's CF2 holds for 0 <= mu < 1).
 * Returns SY_CONTINUE (not an error) whenever the arguments lie outside the range
 * where this was verified against Arb (FAST_* limits) or a value is not finite; the
 * caller then uses the Arb path. Verified in tests/special/test_fast.c. */
#include "special_impl.h"

#include <float.h>
#include <math.h>

/* Range of the fast path: |z| in [FAST_ZMIN, FAST_ZMAX] (outside, the Wronskian pair
 * or CF1's iteration count leave double comfort), |Im z| <= FAST_IM_MAX (e^{|Im z|}
 * stays far from overflow), nmax <= FAST_NMAX. */
#define FAST_ZMIN 1e-6
#define FAST_ZMAX 2e3
#define FAST_IM_MAX 300.0
#define FAST_NMAX 400
#define KSERIES_MAX 2.0     /* series below, CF2 above (NR's choice at order 0) */
#define SERIES_MAXIT 200    /* |w|^2/4 <= 1: terms fall like 1/(k!)^2 */
#define CF_MAXIT 100000     /* CF1 needs ~|z| iterations, CF2 a few dozen */
#define CF_EPS (DBL_EPSILON / 2)
#define TINY 1e-300         /* Lentz's guard against zero denominators */
#define RESCALE 1e250       /* keep the Miller recurrence in range */

static const double EULER_GAMMA = 0.57721566490153286061; /* DLMF 5.2.3 */
static const double PI = 3.14159265358979323846;

static int finite_c(double complex v) { return isfinite(creal(v)) && isfinite(cimag(v)); }

/* e^{w} K_mu(w), e^{w} K_{mu+1}(w) for 0 <= mu < 1, |w| > KSERIES_MAX, Re w >= 0:
 * Steed's CF2 with Temme's sum (NR bessik, x >= 2 branch, complex x). */
static int cf2_scaled(double mu, double complex w, double complex *k0, double complex *k1)
{
    double complex b = 2.0 * (1.0 + w), d = 1.0 / b, h = d, delh = d;
    double complex a1 = 0.25 - mu * mu, q1 = 0.0, q2 = 1.0, q = a1, c = a1, a = -a1;
    double complex s = 1.0 + q * delh;
    int i;
    for (i = 2; i <= CF_MAXIT; i++) {
        a -= 2.0 * (i - 1);
        c = -a * c / (double)i;
        double complex qnew = (q1 - b * q2) / a;
        q1 = q2;
        q2 = qnew;
        q += c * qnew;
        b += 2.0;
        d = 1.0 / (b + a * d);
        delh = (b * d - 1.0) * delh;
        h += delh;
        double complex dels = q * delh;
        s += dels;
        if (cabs(dels) < CF_EPS * cabs(s))
            break;
    }
    if (i > CF_MAXIT)
        return SY_CONTINUE;
    h = a1 * h;
    *k0 = csqrt(PI / (2.0 * w)) / s;
    *k1 = *k0 * (mu + w + 0.5 - h) / w;
    return finite_c(*k0) && finite_c(*k1) ? SY_OK : SY_CONTINUE;
}

/* e^{w} K_0(w), e^{w} K_1(w), Re w >= 0, w != 0. */
static int k01_scaled(double complex w, double complex *k0, double complex *k1)
{
    if (cabs(w) <= KSERIES_MAX) {
        /* DLMF 10.31.2 and 10.31.1 (n = 1), t = w^2/4:
         * K0 = -(ln(w/2) + gamma) I0 + sum_{k>=1} t^k/(k!)^2 H_k,
         * K1 = 1/w + ln(w/2) I1 - (w/4) sum_{k>=0} (psi(k+1) + psi(k+2)) t^k/(k!(k+1)!),
         * psi(k+1) = -gamma + H_k. */
        double complex t = w * w / 4.0, lg = clog(w / 2.0);
        double complex term0 = 1.0, term1 = 1.0; /* t^k/(k!)^2, t^k/(k!(k+1)!) */
        double complex i0 = 1.0, i1s = 1.0, s0 = 0.0, s1 = -2.0 * EULER_GAMMA + 1.0;
        double hk = 0.0; /* H_k */
        for (int k = 1; k < SERIES_MAXIT; k++) {
            term0 *= t / ((double)k * k);
            term1 *= t / ((double)k * (k + 1));
            hk += 1.0 / k;
            i0 += term0;
            i1s += term1;
            s0 += term0 * hk;
            s1 += term1 * (-2.0 * EULER_GAMMA + 2.0 * hk + 1.0 / (k + 1));
            if (cabs(term0) * (hk + 1.0) < CF_EPS * cabs(i0) &&
                cabs(term1) * (2.0 * hk + 2.0) < CF_EPS * cabs(i1s))
                break;
        }
        double complex i1 = w / 2.0 * i1s;
        double complex e = cexp(w);
        *k0 = (-(lg + EULER_GAMMA) * i0 + s0) * e;
        *k1 = (1.0 / w + lg * i1 - w / 4.0 * s1) * e;
    } else if (cf2_scaled(0.0, w, k0, k1) != SY_OK) {
        return SY_CONTINUE;
    }
    return finite_c(*k0) && finite_c(*k1) ? SY_OK : SY_CONTINUE;
}

/* e^{w} K_n(w), n = 0..nmax, Re w >= 0. */
static int k_scaled(int nmax, double complex w, double complex *out)
{
    double complex k0, k1;
    if (k01_scaled(w, &k0, &k1) != SY_OK)
        return SY_CONTINUE;
    out[0] = k0;
    if (nmax >= 1)
        out[1] = k1;
    double complex two_over_w = 2.0 / w;
    for (int n = 1; n < nmax; n++) {
        out[n + 1] = (double)n * two_over_w * out[n] + out[n - 1];
        if (!finite_c(out[n + 1]))
            return SY_CONTINUE;
    }
    return SY_OK;
}

/* CF1: r = C_{v+1}/C_v for J (sign = -1) or I (+1) at real order v (DLMF 10.10.1,
 * 10.33.1), r = 1/(2(v+1)/z + sign r'), as b_0 + a_1/(b_1 + a_2/(b_2 + ...)) with
 * b_0 = 0, a_1 = 1, a_k = sign, b_k = 2(v + k)/z, by modified Lentz. */
static int cf1_ratio(double v, double complex z, double sign, double complex *r)
{
    double complex inv_z = 1.0 / z, fr = TINY, C = fr, D = 0.0;
    for (int k = 1; k <= CF_MAXIT; k++) {
        double complex bk = 2.0 * (v + k) * inv_z;
        double ak = k == 1 ? 1.0 : sign;
        D = bk + ak * D;
        if (D == 0.0)
            D = TINY;
        C = bk + ak / C;
        if (C == 0.0)
            C = TINY;
        D = 1.0 / D;
        double complex delta = C * D;
        fr *= delta;
        if (cabs(delta - 1.0) < CF_EPS) {
            *r = fr;
            return SY_OK;
        }
    }
    return SY_CONTINUE;
}

/* Unnormalised J (sign = -1) or I (sign = +1) at orders 0..nmax: CF1 for
 * C_{nmax+1}/C_{nmax}, then downward J_{n-1} = (2n/z) J_n - J_{n+1},
 * I_{n-1} = (2n/z) I_n + I_{n+1}, rescaled to stay in range. f needs nmax + 2. */
static int miller(int nmax, double complex z, double sign, double complex *f)
{
    double complex inv_z = 1.0 / z, fr;
    if (cf1_ratio(nmax, z, sign, &fr) != SY_OK)
        return SY_CONTINUE;
    f[nmax + 1] = fr;
    f[nmax] = 1.0;
    double complex two_over_z = 2.0 * inv_z;
    for (int n = nmax; n >= 1; n--) {
        f[n - 1] = (double)n * two_over_z * f[n] + sign * f[n + 1];
        if (cabs(f[n - 1]) > RESCALE)
            for (int j = n - 1; j <= nmax + 1; j++)
                f[j] /= RESCALE;
    }
    return SY_OK;
}

/* Powers of i: i^n for n mod 4. */
static double complex ipow(int n)
{
    static const double complex p[4] = {1.0, I, -1.0, -I};
    return p[((n % 4) + 4) % 4];
}

/* H^(1) (which = +1, needs Im z >= 0) or H^(2) (which = -1, Im z <= 0), orders
 * 0..nmax, from K at w = -+iz: H1_n = (2/(pi i)) (-i)^n K_n(-iz),
 * H2_n = (2i/pi) i^n K_n(iz), K_n(w) = e^{-w} (e^{w} K_n(w)). */
static int hankel(int which, int nmax, double complex z, double complex *out)
{
    double complex w = which > 0 ? -I * z : I * z;
    if (k_scaled(nmax, w, out) != SY_OK)
        return SY_CONTINUE;
    double complex pre = (which > 0 ? 2.0 / (PI * I) : 2.0 * I / PI) * cexp(-w);
    for (int n = 0; n <= nmax; n++) {
        out[n] *= pre * ipow(which > 0 ? -n : n);
        if (!finite_c(out[n]))
            return SY_CONTINUE;
    }
    return SY_OK;
}

/* J_n, n = 0..nmax, normalised with the Hankel pair h[0], h[1] of kind which:
 * J_1 H_0 - J_0 H_1 = which * 2i/(pi z). f: nmax + 2 values of scratch. */
static int besselj(int nmax, double complex z, int which, const double complex *h,
                   double complex *out, double complex *f)
{
    if (miller(nmax < 1 ? 1 : nmax, z, -1.0, f) != SY_OK)
        return SY_CONTINUE;
    double complex c = which * 2.0 * I / (PI * z * (f[1] * h[0] - f[0] * h[1]));
    for (int n = 0; n <= nmax; n++) {
        out[n] = c * f[n];
        if (!finite_c(out[n]))
            return SY_CONTINUE;
    }
    return SY_OK;
}

/* Large |z| near the real axis, all orders in the oscillatory range (n <= |z|/2): there
 * CF1 would need ~|z| steps (slow, and its rounding drifts to ~1e-16 |z|), while the
 * Hankel functions recur upward with little error growth. For Im z < 0 the H1
 * recurrence picks up the J part with a factor ~e^{2|Im z|} (H2 likewise for Im z > 0),
 * hence |Im z| <= LARGE_IM_MAX (factor e^2). J = (H1 + H2)/2 then carries an absolute
 * error ~1e-16 |H|, the scale special.h states for J. */
#define LARGE_Z_MIN 50.0
#define LARGE_IM_MAX 1.0
static int large_z(int nmax, double complex z)
{
    double az = cabs(z);
    return az >= LARGE_Z_MIN && 2.0 * nmax <= az && fabs(cimag(z)) <= LARGE_IM_MAX;
}

int syi_special_fast_array(syi_bessel_kind kind, int nmax, double complex z,
                           double complex *out, double complex *scratch)
{
    /* scratch: SYI_FAST_SCRATCH(nmax) values */
    double az = cabs(z);
    if (!(creal(z) >= 0.0) || az < FAST_ZMIN || az > FAST_ZMAX ||
        fabs(cimag(z)) > FAST_IM_MAX || nmax > FAST_NMAX)
        return SY_CONTINUE;
    double complex h[2];
    switch (kind) {
    case SYI_BESSEL_K_SCALED:
        return k_scaled(nmax, z, out);
    case SYI_BESSEL_I_SCALED: {
        double complex k[2];
        if (k_scaled(1, z, k) != SY_OK || miller(nmax < 1 ? 1 : nmax, z, +1.0, scratch) != SY_OK)
            return SY_CONTINUE;
        /* I_0 K_1 + I_1 K_0 = 1/z with K = e^{-z} Ks, I = c f e^{Re z}:
         * c = e^{z - Re z} / (z (f_0 Ks_1 + f_1 Ks_0)). */
        double complex c = cexp(I * cimag(z)) / (z * (scratch[0] * k[1] + scratch[1] * k[0]));
        for (int n = 0; n <= nmax; n++) {
            out[n] = c * scratch[n];
            if (!finite_c(out[n]))
                return SY_CONTINUE;
        }
        return SY_OK;
    }
    case SYI_BESSEL_J: {
        if (large_z(nmax, z)) {
            /* J = (H1 + H2) / 2 (DLMF 10.4.4), both by upward recurrence */
            if (hankel(1, nmax, z, out) != SY_OK || hankel(-1, nmax, z, scratch) != SY_OK)
                return SY_CONTINUE;
            for (int n = 0; n <= nmax; n++)
                out[n] = 0.5 * (out[n] + scratch[n]);
            return SY_OK;
        }
        int which = cimag(z) >= 0.0 ? 1 : -1;
        if (hankel(which, 1, z, h) != SY_OK)
            return SY_CONTINUE;
        return besselj(nmax, z, which, h, out, scratch);
    }
    case SYI_BESSEL_H1: {
        if (cimag(z) >= 0.0 || large_z(nmax, z))
            return hankel(1, nmax, z, out);
        /* H1 = 2J - H2: H2 in scratch[0..max(nmax,1)], Miller's f after it. */
        int m = nmax < 1 ? 1 : nmax;
        double complex *h2 = scratch, *f = scratch + m + 1;
        if (hankel(-1, m, z, h2) != SY_OK || besselj(nmax, z, -1, h2, out, f) != SY_OK)
            return SY_CONTINUE;
        for (int n = 0; n <= nmax; n++)
            out[n] = 2.0 * out[n] - h2[n];
        return SY_OK;
    }
    default:
        return SY_CONTINUE;
    }
}

/* Real order nu >= 0, |z| <= KSERIES_MAX: the ascending series (DLMF 10.2.2, 10.25.2)
 * J_nu, I_nu = (z/2)^nu sum_k (-+z^2/4)^k / (k! Gamma(nu + k + 1)); terms vary by at
 * most e^{|z|^2/4} <= e, so no significant cancellation. sign = -1 for J, +1 for I. */
static int series_nu(double nu, double complex z, double sign, double complex *out)
{
    double g = tgamma(nu + 1.0);
    if (!isfinite(g))
        return SY_CONTINUE;
    /* (z/2)^nu as |z/2|^nu e^{i nu arg z}: real pow keeps ~1 ulp where cpow's
     * exp(nu log(z/2)) loses nu |log(z/2)| ulps (5e-14 at nu = 33, |z| = 6e-6). */
    double complex t = sign * z * z / 4.0;
    double complex term = pow(cabs(z) / 2.0, nu) * cexp(I * (nu * carg(z))) / g, sum = term;
    for (int k = 1; k < SERIES_MAXIT; k++) {
        term *= t / ((double)k * (nu + k));
        sum += term;
        if (cabs(term) < CF_EPS * cabs(sum))
            break;
    }
    *out = sum;
    return finite_c(sum) ? SY_OK : SY_CONTINUE;
}

/* Unnormalised C_{mu+j}, j = 0, 1 and m, for J (sign = -1) or I (+1): CF1 for
 * C_{mu+m+1}/C_{mu+m} (as in miller()), then the downward recurrence to mu with
 * rolling values. */
static int miller_nu(double mu, int m, double complex z, double sign, double complex f[3])
{
    double complex inv_z = 1.0 / z, fr;
    if (cf1_ratio(mu + m, z, sign, &fr) != SY_OK)
        return SY_CONTINUE;
    double complex up = fr, cur = 1.0, top = 1.0; /* C_{mu+j+1}, C_{mu+j}, C_{mu+m} */
    for (int j = m; j >= 1; j--) {
        double complex down = 2.0 * (mu + j) * inv_z * cur + sign * up;
        up = cur;
        cur = down;
        if (cabs(cur) > RESCALE) {
            cur /= RESCALE;
            up /= RESCALE;
            top /= RESCALE;
        }
    }
    f[0] = cur;
    f[1] = up;
    f[2] = top;
    return SY_OK;
}

/* Hankel pair at orders mu, mu + 1 (0 <= mu < 1, |z| > KSERIES_MAX) from K (DLMF
 * 10.27.8): H1_v(z) = (2/(pi i)) e^{-i v pi/2} K_v(-iz) (which = +1),
 * H2_v(z) = (2i/pi) e^{i v pi/2} K_v(iz) (which = -1). */
static int hankel_pair_nu(int which, double mu, double complex z, double complex h[2])
{
    double complex w = which > 0 ? -I * z : I * z, k[2];
    if (cf2_scaled(mu, w, &k[0], &k[1]) != SY_OK)
        return SY_CONTINUE;
    double complex pre = (which > 0 ? 2.0 / (PI * I) : 2.0 * I / PI) * cexp(-w);
    for (int j = 0; j < 2; j++)
        h[j] = pre * cexp(-which * I * PI * (mu + j) / 2.0) * k[j];
    return finite_c(h[0]) && finite_c(h[1]) ? SY_OK : SY_CONTINUE;
}

int syi_special_fast_nu(syi_bessel_kind kind, double nu, double complex z, double complex *out)
{
    double az = cabs(z);
    /* no lower bound on |z|: the series needs no Wronskian pair */
    if (!(creal(z) >= 0.0) || az == 0.0 || az > FAST_ZMAX ||
        fabs(cimag(z)) > FAST_IM_MAX || !(nu >= 0.0 && nu <= FAST_NMAX) ||
        (kind != SYI_BESSEL_J && kind != SYI_BESSEL_I_SCALED))
        return SY_CONTINUE;
    int is_j = kind == SYI_BESSEL_J;
    if (az <= KSERIES_MAX) {
        if (series_nu(nu, z, is_j ? -1.0 : 1.0, out) != SY_OK)
            return SY_CONTINUE;
        if (!is_j)
            *out *= exp(-creal(z));
        return SY_OK;
    }
    int m = (int)floor(nu);
    double mu = nu - m;
    double complex f[3], k[2];
    if (!is_j) {
        /* I_mu K_{mu+1} + I_{mu+1} K_mu = 1/z (DLMF 10.28.2), scaled as in the arrays */
        if (miller_nu(mu, m, z, 1.0, f) != SY_OK || cf2_scaled(mu, z, &k[0], &k[1]) != SY_OK)
            return SY_CONTINUE;
        *out = cexp(I * cimag(z)) / (z * (f[0] * k[1] + f[1] * k[0])) * f[2];
    } else if (2.0 * nu <= az && az >= LARGE_Z_MIN && fabs(cimag(z)) <= LARGE_IM_MAX) {
        /* as large_z(): J = (H1 + H2)/2, each recurred upward from mu, mu + 1 */
        double complex h1[2], h2[2];
        if (hankel_pair_nu(1, mu, z, h1) != SY_OK || hankel_pair_nu(-1, mu, z, h2) != SY_OK)
            return SY_CONTINUE;
        double complex two_over_z = 2.0 / z;
        for (int j = 1; j < m + 1; j++) {
            double complex c = (mu + j) * two_over_z;
            double complex n1 = c * h1[1] - h1[0], n2 = c * h2[1] - h2[0];
            h1[0] = h1[1];
            h1[1] = n1;
            h2[0] = h2[1];
            h2[1] = n2;
        }
        /* after m steps h[0] holds order mu + m = nu */
        *out = 0.5 * (h1[0] + h2[0]);
    } else {
        /* J_{mu+1} H_mu - J_mu H_{mu+1} = +-2i/(pi z) (DLMF 10.5.5) with the Hankel
         * function on the side where |J H| ~ 1/|z|. */
        int which = cimag(z) >= 0.0 ? 1 : -1;
        double complex h[2];
        if (miller_nu(mu, m, z, -1.0, f) != SY_OK || hankel_pair_nu(which, mu, z, h) != SY_OK)
            return SY_CONTINUE;
        *out = which * 2.0 * I / (PI * z * (f[1] * h[0] - f[0] * h[1])) * f[2];
    }
    return finite_c(*out) ? SY_OK : SY_CONTINUE;
}

int syi_special_small_array(syi_bessel_kind kind, int nmax, double complex z, double complex *out)
{
    if (!(cabs(z) <= SYI_SMALL_ZMAX) || (kind != SYI_BESSEL_J && kind != SYI_BESSEL_I_SCALED))
        return SY_CONTINUE;
    /* C_n(z) = (z/2)^n / n! sum_k (-+z^2/4)^k / (k! (n+1)_k) (DLMF 10.2.2, 10.25.2);
     * with |z|^2/4 <= 2.5e-5 the terms fall by that factor, so a handful suffice. The
     * leading factor is built order by order and underflows gradually where the true
     * value does. */
    double complex t = (kind == SYI_BESSEL_J ? -1.0 : 1.0) * z * z / 4.0, lead = 1.0;
    double scale = kind == SYI_BESSEL_J ? 1.0 : exp(-fabs(creal(z)));
    for (int n = 0; n <= nmax; n++) {
        if (n > 0)
            lead *= z / (2.0 * n);
        double complex term = 1.0, sum = 1.0;
        for (int k = 1; k < SERIES_MAXIT && cabs(term) >= CF_EPS * cabs(sum); k++) {
            term *= t / ((double)k * (n + k));
            sum += term;
        }
        out[n] = scale * lead * sum;
    }
    return SY_OK;
}
