/* Dispatch of the Bessel interface (include/swellyield/special.h): argument checks,
 * real arguments to GSL (gsl.c), complex arguments to the double-complex fast path
 * (fast.c) where it applies and otherwise to Arb (arb.c). For Arb, arrays of orders
 * run the three-term recurrence C_{n-1} + C_{n+1} = (2n/z) C_n (DLMF 10.6.1; for I and
 * K the signs of 10.29.1) in double from two Arb values, in the direction in which the
 * wanted solution dominates: J and I downward from orders nmax, nmax - 1 (minimal
 * solutions as n grows), H^(1) and K upward from orders 0, 1. The recurrence carries a
 * binary exponent so that the seeds may lie outside the double range (tiny or huge
 * |z|/n); values are scaled back once at the end, underflowing to 0 where the true
 * value does. */
#include "special_impl.h"

#include <limits.h>
#include <math.h>
#include <stddef.h>
#include <stdlib.h>

const char *syi_special_kind_name(syi_bessel_kind kind)
{
    switch (kind) {
    case SYI_BESSEL_J: return "J";
    case SYI_BESSEL_Y: return "Y";
    case SYI_BESSEL_H1: return "H1";
    case SYI_BESSEL_I_SCALED: return "I scaled";
    case SYI_BESSEL_K_SCALED: return "K scaled";
    case SYI_BESSEL_H2: return "H2";
    }
    return "?";
}

static int is_real(double complex z) { return cimag(z) == 0.0; }

static int finite_arg(double complex z)
{
    return isfinite(creal(z)) && isfinite(cimag(z));
}

/* Y, H, K and fractional orders: z off the cut (z != 0, not on the negative real axis). */
static int off_cut(double complex z) { return !(cimag(z) == 0.0 && creal(z) <= 0.0); }

/* Check the arguments common to every entry point. */
static int check_args(syi_bessel_kind kind, int nmax, double complex z, const void *out,
                      sy_error *err)
{
    const char *name = syi_special_kind_name(kind);
    if (out == NULL)
        return sy_error_set(err, SY_EINVAL, "%s: output array is NULL", name);
    if (nmax < 0)
        return sy_error_set(err, SY_EINVAL, "%s: nmax must be >= 0, got %d", name, nmax);
    if (!finite_arg(z))
        return sy_error_set(err, SY_EINVAL, "%s: argument must be finite, got %g%+gi", name,
                            creal(z), cimag(z));
    if ((kind == SYI_BESSEL_Y || kind == SYI_BESSEL_H1 || kind == SYI_BESSEL_K_SCALED) &&
        !off_cut(z))
        return sy_error_set(err, SY_EINVAL,
                            "%s: argument %.17g must not be 0 or on the negative real axis "
                            "(branch cut); expected Re z > 0 or Im z != 0",
                            name, creal(z));
    return SY_OK;
}

/* Orders whose scratch lives on the stack; larger nmax allocates. */
#define STACK_ORDERS 128

/* Rescale when the recurrence leaves [2^-SCALE_BITS, 2^SCALE_BITS]: far from the double
 * limits (2^+-1022) so one more step cannot overflow. */
#define SCALE_BITS 600

/* Three-term recurrence over orders from the two seeds (values m[] * 2^e at orders
 * (nmax - 1, nmax) going down or (0, 1) going up). sign = -1 for cylinder functions,
 * +1 for I (down) and K (up): next = (2n/z) cur + sign * prev. */
static int recur(syi_bessel_kind kind, int nmax, double complex z, int down, double sign,
                 double complex *out, sy_error *err)
{
    double complex m[2];
    long e = 0;
    int start = down ? nmax - 1 : 0;
    int rc = syi_special_arb_pair(kind, start, z, m, &e, err);
    if (rc != SY_OK)
        return rc;
    double complex two_over_z = 2.0 / z;
    out[start] = m[0];
    out[start + 1] = m[1];
    if (down) {
        for (int n = nmax - 1; n >= 1; n--) {
            out[n - 1] = (double)n * two_over_z * out[n] + sign * out[n + 1];
            if (cabs(out[n - 1]) > ldexp(1.0, SCALE_BITS)) {
                for (int j = n - 1; j <= nmax; j++)
                    out[j] *= ldexp(1.0, -SCALE_BITS);
                e += SCALE_BITS;
            }
        }
    } else {
        for (int n = 1; n < nmax; n++) {
            out[n + 1] = (double)n * two_over_z * out[n] + sign * out[n - 1];
            if (cabs(out[n + 1]) > ldexp(1.0, SCALE_BITS)) {
                for (int j = 0; j <= n + 1; j++)
                    out[j] *= ldexp(1.0, -SCALE_BITS);
                e += SCALE_BITS;
            }
        }
    }
    for (int n = 0; n <= nmax; n++) {
        out[n] = CMPLX(ldexp(creal(out[n]), (int)e), ldexp(cimag(out[n]), (int)e));
        if (!isfinite(creal(out[n])) || !isfinite(cimag(out[n])))
            return sy_error_set(err, SY_EINVAL, "%s_%d(%.17g%+.17gi) overflows double",
                                syi_special_kind_name(kind), n, creal(z), cimag(z));
    }
    return SY_OK;
}

/* The upward recurrence is stable where the wanted solution dominates the other one
 * (H1 for Im z >= 0, H2 for Im z <= 0, K for Re z >= 0: each is then a K function of
 * an argument in the right half-plane). In the left half-plane (Re z < 0) this is not
 * guaranteed, so the result at order nmax is compared with a direct Arb value and, if
 * they differ by more than RECUR_TOL relative, every order is taken from Arb. */
#define RECUR_TOL 1e-14

static int verified_or_direct(syi_bessel_kind kind, int nmax, double complex z,
                              double complex *out, sy_error *err)
{
    double complex top;
    int rc = syi_special_arb_value(kind, nmax, z, &top, err);
    if (rc != SY_OK || cabs(out[nmax] - top) <= RECUR_TOL * cabs(top))
        return rc;
    for (int n = 0; rc == SY_OK && n <= nmax; n++)
        rc = syi_special_arb_value(kind, n, z, &out[n], err);
    return rc;
}

/* H1 for Im z < 0, where H1 grows and upward recurrence of H1 would pick up the J part
 * with a factor ~e^{2|Im z|}: H1 = 2J - H2 (DLMF 10.4.3-4), J downward and H2 upward
 * both stable there, and no cancellation since |H2| <= |H1| for Im z < 0. */
static int hankel1_lower(int nmax, double complex z, double complex *out, sy_error *err)
{
    double complex stack[STACK_ORDERS], *h2 = stack;
    if (nmax >= STACK_ORDERS) {
        h2 = malloc(((size_t)nmax + 1) * sizeof *h2);
        if (h2 == NULL)
            return sy_error_set(err, SY_ENOMEM, "H1 array of %d orders", nmax + 1);
    }
    int rc = recur(SYI_BESSEL_J, nmax, z, 1, -1.0, out, err);
    if (rc == SY_OK)
        rc = recur(SYI_BESSEL_H2, nmax, z, 0, -1.0, h2, err);
    if (rc != SY_OK)
        sy_error_prefix(err, "H1 = 2J - H2");
    for (int n = 0; rc == SY_OK && n <= nmax; n++)
        out[n] = 2.0 * out[n] - h2[n];
    if (h2 != stack)
        free(h2);
    return rc;
}

/* Below this |z| consecutive orders differ by factors ~2n/|z| > 1e6, so a few steps
 * of the downward recurrence (J, I) leave the double range; each order is then taken
 * from Arb (the series converge in a few terms there). Upward (H, K) only grows to
 * the true value, whose overflow is reported. */
#define DIRECT_ZMAX 1e-6

/* Complex z by the Arb seeds and recurrences above (any z off the cut). */
static int array_arb(syi_bessel_kind kind, int nmax, double complex z, double complex *out,
                     sy_error *err)
{
    int rc = SY_OK;
    int down = kind == SYI_BESSEL_J || kind == SYI_BESSEL_I_SCALED;
    if (nmax == 0 || (down && cabs(z) < DIRECT_ZMAX)) {
        for (int n = 0; rc == SY_OK && n <= nmax; n++)
            rc = syi_special_arb_value(kind, n, z, &out[n], err);
        return rc;
    }
    switch (kind) {
    case SYI_BESSEL_J:
        return recur(kind, nmax, z, 1, -1.0, out, err);
    case SYI_BESSEL_I_SCALED:
        return recur(kind, nmax, z, 1, +1.0, out, err);
    case SYI_BESSEL_H1:
        rc = cimag(z) >= 0.0 ? recur(kind, nmax, z, 0, -1.0, out, err)
                             : hankel1_lower(nmax, z, out, err);
        break;
    case SYI_BESSEL_K_SCALED:
        rc = recur(kind, nmax, z, 0, +1.0, out, err);
        break;
    case SYI_BESSEL_Y:
    case SYI_BESSEL_H2:
        rc = recur(kind, nmax, z, 0, -1.0, out, err);
        break;
    }
    if (rc == SY_OK && creal(z) < 0.0)
        rc = verified_or_direct(kind, nmax, z, out, err);
    return rc;
}

/* Complex z: the double-complex fast path (fast.c) where it applies — Re z >= 0, and
 * J, I at Re z < 0 through J_n(-z) = (-1)^n J_n(z), I_n(-z) = (-1)^n I_n(z) (DLMF
 * 10.11.1, 10.34.1; the scale e^{-|Re z|} is even) — else Arb. */
static int array_complex(syi_bessel_kind kind, int nmax, double complex z,
                         double complex *out, sy_error *err)
{
    double complex stack[SYI_FAST_SCRATCH(STACK_ORDERS)], *scratch = stack;
    if (nmax >= STACK_ORDERS) {
        scratch = malloc(SYI_FAST_SCRATCH(nmax) * sizeof *scratch);
        if (scratch == NULL)
            return sy_error_set(err, SY_ENOMEM, "%s array of %d orders",
                                syi_special_kind_name(kind), nmax + 1);
    }
    int reflect = creal(z) < 0.0 && (kind == SYI_BESSEL_J || kind == SYI_BESSEL_I_SCALED);
    int rc = syi_special_fast_array(kind, nmax, reflect ? -z : z, out, scratch);
    if (rc == SY_OK && reflect)
        for (int n = 1; n <= nmax; n += 2)
            out[n] = -out[n];
    if (scratch != stack)
        free(scratch);
    if (rc == SY_CONTINUE)
        rc = array_arb(kind, nmax, z, out, err);
    return rc;
}

static int array(syi_bessel_kind kind, int nmax, double complex z, double complex *out,
                 sy_error *err)
{
    int rc = check_args(kind, nmax, z, out, err);
    if (rc != SY_OK)
        return rc;
    if (syi_special_small_array(kind, nmax, z, out) == SY_OK) /* J, I at |z| <= 1e-2 */
        return SY_OK;
    if (is_real(z))
        return syi_special_gsl_array(kind, nmax, creal(z), out, err);
    return array_complex(kind, nmax, z, out, err);
}

int sy_special_besselj_array(int nmax, double complex z, double complex *out, sy_error *err)
{
    return array(SYI_BESSEL_J, nmax, z, out, err);
}

int sy_special_hankel1_array(int nmax, double complex z, double complex *out, sy_error *err)
{
    return array(SYI_BESSEL_H1, nmax, z, out, err);
}

int sy_special_besseli_scaled_array(int nmax, double complex z, double complex *out,
                                    sy_error *err)
{
    return array(SYI_BESSEL_I_SCALED, nmax, z, out, err);
}

int sy_special_besselk_scaled_array(int nmax, double complex z, double complex *out,
                                    sy_error *err)
{
    return array(SYI_BESSEL_K_SCALED, nmax, z, out, err);
}

/* One integer order, any sign: C_{-n} = (-1)^n C_n for J, Y, H (DLMF 10.4.1).
 * Complex z: the arrays up to order |n| (fast path) for |n| < STACK_ORDERS, with
 * Y = -i (H1 - J) (DLMF 10.4.3): error ~1e-16 max(|J|, |H1|), which is the size of
 * |Y| except near a zero of Y (absolute error there, as for J in the arrays).
 * Larger orders: Arb directly. */
static double complex scalar(syi_bessel_kind kind, int n, double complex z)
{
    if (n == INT_MIN) /* -n would overflow */
        return CMPLX(NAN, NAN);
    int an = n < 0 ? -n : n;
    double complex v, a[STACK_ORDERS], b[STACK_ORDERS];
    if (check_args(kind, an, z, &v, NULL) != SY_OK)
        return CMPLX(NAN, NAN);
    int rc;
    if (is_real(z))
        rc = syi_special_gsl_value(kind, an, creal(z), &v, NULL);
    else if (an >= STACK_ORDERS)
        rc = syi_special_arb_value(kind, an, z, &v, NULL);
    else if (kind == SYI_BESSEL_Y) {
        rc = array_complex(SYI_BESSEL_H1, an, z, a, NULL);
        if (rc == SY_OK)
            rc = array_complex(SYI_BESSEL_J, an, z, b, NULL);
        v = -I * (a[an] - b[an]);
    } else {
        rc = array_complex(kind, an, z, a, NULL);
        v = a[an];
    }
    if (rc != SY_OK)
        return CMPLX(NAN, NAN);
    return (n < 0 && (an & 1)) ? -v : v;
}

double complex sy_special_besselj(int n, double complex z) { return scalar(SYI_BESSEL_J, n, z); }
double complex sy_special_bessely(int n, double complex z) { return scalar(SYI_BESSEL_Y, n, z); }
double complex sy_special_hankel1(int n, double complex z) { return scalar(SYI_BESSEL_H1, n, z); }

/* Real x above which J_nu comes from GSL (see order_nu): GSL's errors were <= 5e-15
 * from x = 30 up (measured to 1.9e3, orders 0..40) and the bad orders lie below 20. */
#define JNU_GSL_XMIN 30.0

/* J_nu or scaled I_nu of real order. */
static int order_nu(syi_bessel_kind kind, double nu, double complex z, double complex *out,
                    sy_error *err)
{
    const char *name = syi_special_kind_name(kind);
    if (out == NULL)
        return sy_error_set(err, SY_EINVAL, "%s_nu: output is NULL", name);
    if (!(isfinite(nu) && nu >= 0.0))
        return sy_error_set(err, SY_EINVAL, "%s_nu: order must be finite and >= 0, got %g",
                            name, nu);
    if (!finite_arg(z))
        return sy_error_set(err, SY_EINVAL, "%s_%g: argument must be finite, got %g%+gi",
                            name, nu, creal(z), cimag(z));
    if (!is_real(z)) {
        if (syi_special_fast_nu(kind, nu, z, out) == SY_OK)
            return SY_OK;
        return syi_special_arb_value(kind, nu, z, out, err);
    }
    double x = creal(z), v;
    if (x == 0.0) { /* J_nu(0), I_nu(0) = 1 for nu = 0, else 0 (DLMF 10.2.2, 10.25.2) */
        *out = nu == 0.0 ? 1.0 : 0.0;
        return SY_OK;
    }
    if (x > 0.0) {
        /* GSL 2.7's Jnu and Inu_scaled are off by up to 7e-9 relative for orders near
         * 15.03, 17.03 (1e-10 near 39.99) at x <= 20 (measured against Arb; their
         * error estimates say 5e-15). The fast path (series, CF1 + CF2) is within
         * 4e-15 there; for J at x >= 50 with nu <= x/2 it uses the Hankel pair
         * (~1e-15); in between (and for nu > x/2 beyond) its CF1 drifts like ~1e-16 x,
         * where GSL is better, so J uses GSL there. I: fast path (2e-15) up to its
         * range, GSL beyond. */
        if ((kind != SYI_BESSEL_J || x <= JNU_GSL_XMIN || (x >= 50.0 && 2.0 * nu <= x)) &&
            syi_special_fast_nu(kind, nu, z, out) == SY_OK)
            return SY_OK;
        int rc = syi_special_gsl_nu(kind, nu, x, &v, err);
        if (rc == SY_OK)
            *out = CMPLX(v, 0.0);
        return rc;
    }
    /* Negative real axis: only integer orders are single-valued there. */
    if (nu != floor(nu) || nu > INT_MAX)
        return sy_error_set(err, SY_EINVAL,
                            "%s_%g: argument %.17g on the branch cut (negative real axis); "
                            "expected x >= 0 or Im z != 0 for a fractional order",
                            name, nu, x);
    return syi_special_gsl_value(kind, (int)nu, x, out, err);
}

int sy_special_besselj_nu(double nu, double complex z, double complex *out, sy_error *err)
{
    return order_nu(SYI_BESSEL_J, nu, z, out, err);
}

int sy_special_besseli_nu_scaled(double nu, double complex z, double complex *out,
                                 sy_error *err)
{
    return order_nu(SYI_BESSEL_I_SCALED, nu, z, out, err);
}

int sy_special_deriv_array(sy_special_family family, int nmax, double complex z,
                           const double complex *val, double complex *dval, sy_error *err)
{
    if (val == NULL || dval == NULL)
        return sy_error_set(err, SY_EINVAL, "Bessel derivatives: value or output array is NULL");
    if (nmax < 1)
        return sy_error_set(err, SY_EINVAL, "Bessel derivatives: nmax must be >= 1, got %d",
                            nmax);
    if (!finite_arg(z))
        return sy_error_set(err, SY_EINVAL, "Bessel derivatives: argument must be finite, "
                            "got %g%+gi", creal(z), cimag(z));
    if (family != SY_SPECIAL_CYLINDER && family != SY_SPECIAL_MODIFIED_I &&
        family != SY_SPECIAL_MODIFIED_K)
        return sy_error_set(err, SY_EINVAL, "Bessel derivatives: unknown family %d",
                            (int)family);
    /* sign of C_{n-1} in C_n' */
    double s_prev = family == SY_SPECIAL_MODIFIED_K ? -1.0 : 1.0;
    if (z == 0.0) {
        if (family == SY_SPECIAL_MODIFIED_K)
            return sy_error_set(err, SY_EINVAL, "Bessel derivatives: K is infinite at z = 0");
        /* J: C_n' = (C_{n-1} - C_{n+1})/2, I: (I_{n-1} + I_{n+1})/2 (DLMF 10.6.1,
         * 10.29.1); C_{-1} = -+C_1, C_{nmax+1}(0) = 0. */
        double s = family == SY_SPECIAL_CYLINDER ? -1.0 : 1.0;
        dval[0] = s * val[1];
        for (int n = 1; n <= nmax; n++)
            dval[n] = (val[n - 1] + s * (n < nmax ? val[n + 1] : 0.0)) / 2.0;
        return SY_OK;
    }
    double complex inv = 1.0 / z;
    switch (family) {
    case SY_SPECIAL_CYLINDER: dval[0] = -val[1]; break;
    case SY_SPECIAL_MODIFIED_I: dval[0] = val[1]; break;
    case SY_SPECIAL_MODIFIED_K: dval[0] = -val[1]; break;
    }
    for (int n = 1; n <= nmax; n++)
        dval[n] = s_prev * val[n - 1] - (double)n * inv * val[n];
    return SY_OK;
}
