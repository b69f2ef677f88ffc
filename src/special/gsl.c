/* Real-argument Bessel functions from GSL (integer-order arrays and scalars, J_nu and
 * scaled I_nu of real order; bessel.c prefers fast.c for those, see there). sy_init() switched GSL's aborting handler off, so every
 * GSL status is checked here: underflow is accepted (the value is 0 or subnormal, as
 * the interface promises), anything else becomes a status with the arguments named.
 * Negative x for J and I: reflection J_n(-x) = (-1)^n J_n(x), I_n(-x) = (-1)^n I_n(x)
 * (DLMF 10.4.1, 10.27.1 with 10.11.1), the scale exp(-|x|) being even. */
#include "special_impl.h"

#include <gsl/gsl_errno.h>
#include <gsl/gsl_sf_bessel.h>
#include <math.h>
#include <stdlib.h>

/* GSL status -> ours; GSL_EUNDRFLW is fine (deep underflow is documented). */
static int check(int st, syi_bessel_kind kind, double nu, double x, sy_error *err)
{
    if (st == GSL_SUCCESS || st == GSL_EUNDRFLW)
        return SY_OK;
    int code = SY_EINPUT;
    switch (st) {
    case GSL_EDOM:
    case GSL_EOVRFLW:
        code = SY_EINVAL;
        break;
    case GSL_ELOSS:
        code = SY_ELOSS;
        break;
    case GSL_EMAXITER:
        code = SY_ENOCONV;
        break;
    default:
        break;
    }
    return sy_error_set(err, code, "%s_%g(%.17g): GSL: %s", syi_special_kind_name(kind), nu,
                        x, gsl_strerror(st));
}

/* GSL array routines need nmax + 1 doubles of scratch; kept on the stack for the
 * common sizes so the hot loop does not allocate. */
#define SYI_GSL_STACK_ORDERS 128

int syi_special_gsl_array(syi_bessel_kind kind, int nmax, double x, double complex *out,
                          sy_error *err)
{
    double stack[SYI_GSL_STACK_ORDERS], *buf = stack, *buf2 = NULL;
    size_t n_orders = (size_t)nmax + 1;
    int with_y = kind == SYI_BESSEL_H1;
    if (n_orders > SYI_GSL_STACK_ORDERS || with_y) {
        buf = malloc((with_y ? 2 : 1) * n_orders * sizeof *buf);
        if (buf == NULL)
            return sy_error_set(err, SY_ENOMEM, "%s array of %zu orders",
                                syi_special_kind_name(kind), n_orders);
        buf2 = buf + n_orders;
    }
    double ax = fabs(x);
    int st = GSL_SUCCESS, flip = x < 0.0; /* J, I only */
    switch (kind) {
    case SYI_BESSEL_J:
        st = gsl_sf_bessel_Jn_array(0, nmax, ax, buf);
        break;
    case SYI_BESSEL_I_SCALED:
        st = gsl_sf_bessel_In_scaled_array(0, nmax, ax, buf);
        break;
    case SYI_BESSEL_Y:
        st = gsl_sf_bessel_Yn_array(0, nmax, x, buf);
        break;
    case SYI_BESSEL_H1:
        st = gsl_sf_bessel_Jn_array(0, nmax, x, buf);
        if (st == GSL_SUCCESS || st == GSL_EUNDRFLW)
            st = gsl_sf_bessel_Yn_array(0, nmax, x, buf2);
        break;
    case SYI_BESSEL_K_SCALED:
        st = gsl_sf_bessel_Kn_scaled_array(0, nmax, x, buf);
        break;
    case SYI_BESSEL_H2: /* internal to the complex path */
        st = GSL_EINVAL;
        break;
    }
    if (st == GSL_EUNDRFLW && (kind == SYI_BESSEL_J || kind == SYI_BESSEL_I_SCALED)) {
        /* GSL 2.7 Jn_array starts its downward recurrence at nmax; when that seed
         * underflows it returns zeros for every order (J_0(1e-9) = 0 with nmax = 40).
         * Take each order from the scalar routine instead (series at such x). */
        st = GSL_SUCCESS;
        for (int n = 0; n <= nmax && (st == GSL_SUCCESS || st == GSL_EUNDRFLW); n++) {
            gsl_sf_result r = {0.0, 0.0};
            st = kind == SYI_BESSEL_J ? gsl_sf_bessel_Jn_e(n, ax, &r)
                                      : gsl_sf_bessel_In_scaled_e(n, ax, &r);
            buf[n] = r.val;
        }
    }
    int rc = check(st, kind, nmax, x, err);
    for (int n = 0; rc == SY_OK && n <= nmax; n++) {
        double v = (flip && (n & 1)) ? -buf[n] : buf[n];
        out[n] = with_y ? CMPLX(v, buf2[n]) : CMPLX(v, 0.0);
        if (!isfinite(creal(out[n])) || !isfinite(cimag(out[n])))
            rc = sy_error_set(err, SY_EINVAL, "%s_%d(%.17g) overflows double",
                              syi_special_kind_name(kind), n, x);
    }
    if (buf != stack)
        free(buf);
    return rc;
}

int syi_special_gsl_value(syi_bessel_kind kind, int n, double x, double complex *out,
                          sy_error *err)
{
    gsl_sf_result r = {0.0, 0.0}, ry = {0.0, 0.0};
    double ax = fabs(x);
    int st = GSL_SUCCESS, flip = x < 0.0 && (n & 1);
    switch (kind) {
    case SYI_BESSEL_J:
        st = gsl_sf_bessel_Jn_e(n, ax, &r);
        break;
    case SYI_BESSEL_I_SCALED:
        st = gsl_sf_bessel_In_scaled_e(n, ax, &r);
        break;
    case SYI_BESSEL_Y:
        st = gsl_sf_bessel_Yn_e(n, x, &r);
        break;
    case SYI_BESSEL_H1:
        st = gsl_sf_bessel_Jn_e(n, x, &r);
        if (st == GSL_SUCCESS || st == GSL_EUNDRFLW)
            st = gsl_sf_bessel_Yn_e(n, x, &ry);
        break;
    case SYI_BESSEL_K_SCALED:
        st = gsl_sf_bessel_Kn_scaled_e(n, x, &r);
        break;
    case SYI_BESSEL_H2: /* internal to the complex path */
        st = GSL_EINVAL;
        break;
    }
    int rc = check(st, kind, n, x, err);
    if (rc == SY_OK) {
        *out = CMPLX(flip ? -r.val : r.val, ry.val);
        if (!isfinite(creal(*out)) || !isfinite(cimag(*out)))
            rc = sy_error_set(err, SY_EINVAL, "%s_%d(%.17g) overflows double",
                              syi_special_kind_name(kind), n, x);
    }
    return rc;
}

int syi_special_gsl_nu(syi_bessel_kind kind, double nu, double x, double *out, sy_error *err)
{
    gsl_sf_result r = {0.0, 0.0};
    int st = kind == SYI_BESSEL_J ? gsl_sf_bessel_Jnu_e(nu, x, &r)
                                  : gsl_sf_bessel_Inu_scaled_e(nu, x, &r);
    int rc = check(st, kind, nu, x, err);
    if (rc == SY_OK)
        *out = r.val;
    return rc;
}
