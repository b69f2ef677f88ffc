/* Bessel interface: identities that need no outside table, the real path (GSL) equal
 * to the complex paths (fast double-complex and Arb) on the real axis, the derivative
 * helper, negative orders, z = 0, and bad input with its message.
 * Identities (DLMF 10.5.3, 10.28.2, 10.5.5, 10.4.1):
 *   J_n H_n' - J_n' H_n = 2i/(pi z),  I_n K_n' - I_n' K_n = -1/z,
 *   J_{n+1} Y_n - J_n Y_{n+1} = 2/(pi z),  C_{-n} = (-1)^n C_n.
 * Tolerances: 1e-13 relative to the size of the terms (|J H'| + |J' H| etc.), since a
 * Wronskian is a difference of two products each known to ~1e-14 relative. */
#include "check.h"
#include "swellyield/special.h"
#include "special/special_impl.h"

#include <limits.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#define NMAX 24
#define TOL 1e-13
static const double PI = 3.14159265358979323846;

/* Invented complex arguments: both sides of the real axis, near the imaginary axis,
 * Re z < 0 (Arb path for H and K), small and large. */
static const double complex ZS[] = {0.37 - 0.11 * I, 1.37 + 0.42 * I, 5.3 - 0.02 * I,
                                    12.7 - 1.9 * I, 0.02 + 6.1 * I, 0.05 - 7.3 * I,
                                    47.5 - 3.2 * I, 310.0 - 0.4 * I, 0.003 + 0.001 * I,
                                    -1.3 + 0.6 * I, -7.2 - 2.5 * I};

static void wronskians(double complex z)
{
    double complex j[NMAX + 1], h[NMAX + 1], dj[NMAX + 1], dh[NMAX + 1];
    double complex is[NMAX + 1], ks[NMAX + 1], dis[NMAX + 1], dks[NMAX + 1];
    sy_error err = SY_ERROR_INIT;
    int ok = sy_check_ok(sy_special_besselj_array(NMAX, z, j, &err), &err, "J array");
    ok &= sy_check_ok(sy_special_hankel1_array(NMAX, z, h, &err), &err, "H1 array");
    ok &= sy_check_ok(sy_special_besseli_scaled_array(NMAX, z, is, &err), &err, "I array");
    ok &= sy_check_ok(sy_special_besselk_scaled_array(NMAX, z, ks, &err), &err, "K array");
    ok &= sy_check_ok(sy_special_deriv_array(SY_SPECIAL_CYLINDER, NMAX, z, j, dj, &err), &err,
                      "J'");
    ok &= sy_check_ok(sy_special_deriv_array(SY_SPECIAL_CYLINDER, NMAX, z, h, dh, &err), &err,
                      "H'");
    ok &= sy_check_ok(sy_special_deriv_array(SY_SPECIAL_MODIFIED_I, NMAX, z, is, dis, &err),
                      &err, "I'");
    ok &= sy_check_ok(sy_special_deriv_array(SY_SPECIAL_MODIFIED_K, NMAX, z, ks, dks, &err),
                      &err, "K'");
    if (!ok)
        return;
    /* scaled: Is Ks' - Is' Ks = -e^{z - |Re z|} / z */
    double complex wik = -cexp(z - fabs(creal(z))) / z;
    for (int n = 0; n <= NMAX; n += 3) {
        double size = cabs(j[n] * dh[n]) + cabs(dj[n] * h[n]);
        sy_check_cclose(j[n] * dh[n] - dj[n] * h[n], 2.0 * I / (PI * z), 0.0, TOL * size,
                        "W{J_%d, H1_%d}(%g%+gi) = 2i/(pi z) (DLMF 10.5.3)", n, n, creal(z),
                        cimag(z));
        size = cabs(is[n] * dks[n]) + cabs(dis[n] * ks[n]);
        sy_check_cclose(is[n] * dks[n] - dis[n] * ks[n], wik, 0.0, TOL * size,
                        "W{I_%d, K_%d}(%g%+gi) = -1/z (DLMF 10.28.2), scaled", n, n, creal(z),
                        cimag(z));
    }
    for (int n = 0; n < 12; n += 5) {
        double complex yn = sy_special_bessely(n, z), yn1 = sy_special_bessely(n + 1, z);
        double size = cabs(j[n + 1] * yn) + cabs(j[n] * yn1);
        sy_check_cclose(j[n + 1] * yn - j[n] * yn1, 2.0 / (PI * z), 0.0, TOL * size,
                        "J_%d Y_%d - J_%d Y_%d at %g%+gi = 2/(pi z) (DLMF 10.5.5)", n + 1, n, n,
                        n + 1, creal(z), cimag(z));
    }
    /* negative orders by reflection, against the array; the scalar runs its own
     * array to order n (other recurrence start), so both carry ~1e-15..1e-14 */
    for (int n = 1; n <= 5; n++) {
        double complex s = (n & 1) ? -1.0 : 1.0;
        sy_check_cclose(sy_special_besselj(-n, z), s * j[n], 1e-14, 0.0,
                        "J_{-%d} = (-1)^%d J_%d at %g%+gi (DLMF 10.4.1)", n, n, n, creal(z),
                        cimag(z));
        sy_check_cclose(sy_special_hankel1(-n, z), s * h[n], 1e-14, 0.0,
                        "H1_{-%d} = (-1)^%d H1_%d at %g%+gi (DLMF 10.4.1)", n, n, n, creal(z),
                        cimag(z));
    }
}

/* The GSL path (cimag == 0) against the fast path and Arb at the same real x. */
static void real_equals_complex(double x)
{
    const syi_bessel_kind kinds[] = {SYI_BESSEL_J, SYI_BESSEL_H1, SYI_BESSEL_I_SCALED,
                                     SYI_BESSEL_K_SCALED};
    double complex g[NMAX + 1], f[NMAX + 1], scratch[SYI_FAST_SCRATCH(NMAX)];
    for (int k = 0; k < 4; k++) {
        syi_bessel_kind kind = kinds[k];
        const char *name = syi_special_kind_name(kind);
        sy_error err = SY_ERROR_INIT;
        if (!sy_check_ok(syi_special_gsl_array(kind, NMAX, x, g, &err), &err, "GSL %s", name))
            continue;
        int fast = syi_special_fast_array(kind, NMAX, CMPLX(x, 0.0), f, scratch) == SY_OK;
        sy_check_true(fast, "fast path takes %s at real x = %g", name, x);
        for (int n = 0; n <= NMAX; n += 4) {
            double complex a = NAN, partner = 0.0;
            sy_check_ok(syi_special_arb_value(kind, n, CMPLX(x, 0.0), &a, &err), &err,
                        "Arb %s_%d(%g)", name, n, x);
            /* J and I have an absolute error of the partner's size in n < x */
            if (kind == SYI_BESSEL_J && n < x)
                syi_special_arb_value(SYI_BESSEL_Y, n, CMPLX(x, 0.0), &partner, NULL);
            if (kind == SYI_BESSEL_I_SCALED && n < x) {
                syi_special_arb_value(SYI_BESSEL_K_SCALED, n, CMPLX(x, 0.0), &partner, NULL);
                partner *= exp(-2.0 * x);
            }
            double scale = fmax(cabs(a), cabs(partner));
            sy_check_cclose(g[n], a, 0.0, TOL * scale, "%s_%d(%g): GSL == Arb", name, n, x);
            if (fast)
                sy_check_cclose(g[n], f[n], 0.0, TOL * scale, "%s_%d(%g): GSL == fast", name,
                                n, x);
        }
    }
    for (int i = 0; i < 3; i++) {
        double nu = (1.0 + 12.0 * i) / 6.0; /* 1/6, 13/6, 25/6 */
        double complex g1, a1;
        sy_error err = SY_ERROR_INIT;
        sy_check_ok(sy_special_besselj_nu(nu, x, &g1, &err), &err, "J_nu(%g)", x);
        syi_special_arb_value(SYI_BESSEL_J, nu, CMPLX(x, 0.0), &a1, NULL);
        sy_check_cclose(g1, a1, TOL, 1e-300, "J_%g(%g): GSL == Arb", nu, x);
        sy_check_ok(sy_special_besseli_nu_scaled(nu, x, &g1, &err), &err, "I_nu(%g)", x);
        syi_special_arb_value(SYI_BESSEL_I_SCALED, nu, CMPLX(x, 0.0), &a1, NULL);
        sy_check_cclose(g1, a1, TOL, 1e-300, "I_%g(%g) scaled: GSL == Arb", nu, x);
    }
}

static void at_zero(void)
{
    double complex j[4], is[4], d[4];
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(sy_special_besselj_array(3, 0.0, j, &err), &err, "J array at 0");
    sy_check_ok(sy_special_deriv_array(SY_SPECIAL_CYLINDER, 3, 0.0, j, d, &err), &err, "J' at 0");
    /* J_0(0) = 1, J_n(0) = 0; J_1'(0) = 1/2, others 0 (DLMF 10.8.1 series) */
    sy_check_cclose(j[0], 1.0, 0.0, 0.0, "J_0(0) = 1");
    sy_check_cclose(j[2], 0.0, 0.0, 0.0, "J_2(0) = 0");
    sy_check_cclose(d[0], 0.0, 0.0, 0.0, "J_0'(0) = 0");
    sy_check_cclose(d[1], 0.5, 0.0, 0.0, "J_1'(0) = 1/2");
    sy_check_cclose(d[2], 0.0, 0.0, 0.0, "J_2'(0) = 0");
    sy_check_ok(sy_special_besseli_scaled_array(3, 0.0, is, &err), &err, "I array at 0");
    sy_check_ok(sy_special_deriv_array(SY_SPECIAL_MODIFIED_I, 3, 0.0, is, d, &err), &err,
                "I' at 0");
    sy_check_cclose(d[1], 0.5, 0.0, 0.0, "I_1'(0) = 1/2 (DLMF 10.25.2 series)");
    double complex v = NAN;
    sy_check_ok(sy_special_besselj_nu(1.0 / 6.0, 0.0, &v, &err), &err, "J_{1/6}(0)");
    sy_check_cclose(v, 0.0, 0.0, 0.0, "J_{1/6}(0) = 0 (DLMF 10.2.2)");
    sy_check_ok(sy_special_besseli_nu_scaled(0.0, 0.0, &v, &err), &err, "I_0(0)");
    sy_check_cclose(v, 1.0, 0.0, 0.0, "I_0(0) = 1 (DLMF 10.25.2)");
    /* underflow: J_30(1e-12) ~ (5e-13)^30 / 30! ~ 1e-402, below the double range */
    double complex big[31];
    sy_check_ok(sy_special_besselj_array(30, 1e-12 + 1e-12 * I, big, &err), &err,
                "J array 0..30 at 1e-12(1+i) (deep underflow at the top)");
    sy_check_true(big[30] == 0.0 && cabs(big[0] - 1.0) < 1e-15,
                  "J_30 underflows to 0, J_0 ~ 1 (got %g, %g)", cabs(big[30]), cabs(big[0]));
    /* I_n(iy) = i^n J_n(y) (DLMF 10.27.6); at y = 1e-300: I_0 = 1, I_1 = i y/2, I_2 = 0 */
    sy_check_ok(sy_special_besseli_scaled_array(20, 1e-300 * I, big, &err), &err,
                "I array 0..20 at 1e-300i");
    sy_check_cclose(big[0], 1.0, 1e-15, 0.0, "I_0(1e-300i) = 1");
    sy_check_cclose(big[1], 0.5e-300 * I, 1e-15, 0.0, "I_1(1e-300i) = 5e-301 i");
    sy_check_true(big[2] == 0.0, "I_2(1e-300i) underflows to 0");
    /* Real x = 1e-9 (GSL 2.7 gave all zeros for Jn_array(0, 40, x) and dropped e^{-x}
     * in I1_scaled): J_0 = 1 - x^2/4, I_1 e^{-x} = (x/2)(1 + x^2/8) e^{-x} (DLMF 10.2.2,
     * 10.25.2 series, exact to double here). */
    double x9 = 1e-9;
    sy_check_ok(sy_special_besselj_array(40, x9, big, &err), &err, "J array 0..40 at 1e-9");
    sy_check_cclose(big[0], 1.0 - x9 * x9 / 4.0, 1e-16, 0.0, "J_0(1e-9) from the array");
    sy_check_ok(sy_special_besseli_scaled_array(40, x9, big, &err), &err, "I array at 1e-9");
    sy_check_cclose(big[1], x9 / 2.0 * (1.0 + x9 * x9 / 8.0) * exp(-x9), 1e-15, 0.0,
                    "I_1(1e-9) e^{-1e-9} keeps the scale factor");
    /* GSL 2.7 Jnu(15.0294, 0.43) was off by 7e-9; series value (DLMF 10.2.2) from
     * mpmath 1.2.1 besselj(15.0294, 0.431162) = 6.788853219733043e-23 */
    double complex jv;
    sy_check_ok(sy_special_besselj_nu(15.0294, 0.431162, &jv, &err), &err, "J_15.0294(0.43)");
    sy_check_cclose(jv, 6.788853219733043e-23, 1e-14, 0.0,
                    "mpmath 1.2.1 besselj(15.0294, 0.431162)");
    /* H1 ~ e^{iz}: at 10 + 800i about e^{-800}, below the double range */
    sy_check_ok(sy_special_hankel1_array(20, 10.0 + 800.0 * I, big, &err), &err,
                "H1 array at 10 + 800i (deep underflow)");
    sy_check_true(big[0] == 0.0 && big[20] == 0.0, "H1_0, H1_20 at 10 + 800i underflow to 0");
}

static void bad_input(void)
{
    double complex out[4];
    static const struct {
        int which; /* 0 J array, 1 H array, 2 K array, 3 J_nu, 4 I_nu, 5 deriv K, 6 deriv */
        int n;
        double nu;
        double complex z;
        const char *expect;
    } bad[] = {
        {0, -1, 0.0, 1.0, "nmax must be >= 0, got -1"},
        {0, 3, 0.0, NAN, "argument must be finite"},
        {1, 3, 0.0, 0.0, "must not be 0 or on the negative real axis"},
        {1, 3, 0.0, -2.5, "must not be 0 or on the negative real axis"},
        {2, 3, 0.0, -0.5, "branch cut"},
        {3, 0, -0.5, 1.0, "order must be finite and >= 0, got -0.5"},
        {3, 0, 1.0 / 6.0, -2.0, "on the branch cut"},
        {4, 0, 0.5, -2.0, "on the branch cut"},
        {5, 3, 0.0, 0.0, "K is infinite at z = 0"},
        {6, 0, 0.0, 1.0, "nmax must be >= 1, got 0"},
    };
    double complex vals[4] = {1.0, 0.5, 0.25, 0.125};
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        sy_error err = SY_ERROR_INIT;
        int rc = SY_OK;
        switch (bad[i].which) {
        case 0: rc = sy_special_besselj_array(bad[i].n, bad[i].z, out, &err); break;
        case 1: rc = sy_special_hankel1_array(bad[i].n, bad[i].z, out, &err); break;
        case 2: rc = sy_special_besselk_scaled_array(bad[i].n, bad[i].z, out, &err); break;
        case 3: rc = sy_special_besselj_nu(bad[i].nu, bad[i].z, out, &err); break;
        case 4: rc = sy_special_besseli_nu_scaled(bad[i].nu, bad[i].z, out, &err); break;
        case 5:
            rc = sy_special_deriv_array(SY_SPECIAL_MODIFIED_K, bad[i].n, bad[i].z, vals, out, &err);
            break;
        case 6:
            rc = sy_special_deriv_array(SY_SPECIAL_CYLINDER, bad[i].n, bad[i].z, vals, out, &err);
            break;
        }
        sy_check_fails(rc, SY_EINVAL, &err, bad[i].expect, "bad input %zu: %s", i, bad[i].expect);
    }
    sy_error err = SY_ERROR_INIT;
    sy_check_fails(sy_special_besselj_array(3, 1.0, NULL, &err), SY_EINVAL, &err, "NULL",
                   "NULL output");
    sy_check_true(isnan(creal(sy_special_bessely(2, -3.0))), "scalar Y on the cut is NaN");
    sy_check_true(isnan(creal(sy_special_besselj(INT_MIN, 1.0 + I))), "scalar J at INT_MIN is NaN");
    /* Integer order on the negative real axis is single-valued: J_2(-x) = J_2(x). */
    double complex a, b;
    sy_check_ok(sy_special_besselj_nu(2.0, -2.0, &a, &err), &err, "J_2 at x = -2");
    sy_check_ok(sy_special_besselj_nu(2.0, 2.0, &b, &err), &err, "J_2 at x = 2");
    sy_check_cclose(a, b, 1e-15, 0.0, "J_2(-2) = J_2(2) (DLMF 10.4.1 with 10.11.1)");
    /* overflow is an error, not inf: Y_30 at 1e-12 ~ 29!/pi (2e12)^30 ~ 1e392 */
    double complex hv[31];
    sy_check_fails(sy_special_hankel1_array(30, 1e-12, hv, &err), SY_EINVAL, &err, "overflow",
                   "H1 array overflow at 1e-12 (GSL path)");
    sy_check_fails(sy_special_hankel1_array(30, 1e-12 - 1e-13 * I, hv, &err), SY_EINVAL, &err,
                   "overflows double", "H1 array overflow at 1e-12 - 1e-13i (Arb path)");
}

int main(void)
{
    sy_init();
    for (size_t i = 0; i < sizeof ZS / sizeof ZS[0]; i++)
        wronskians(ZS[i]);
    const double xs[] = {0.37, 2.4048255576957728, 5.3, 13.7, 47.5, 310.0};
    for (size_t i = 0; i < sizeof xs / sizeof xs[0]; i++)
        real_equals_complex(xs[i]);
    at_zero();
    bad_input();
    return sy_check_summary();
}
