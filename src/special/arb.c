/* Complex-argument Bessel functions from Arb (FLINT ball arithmetic), rounded to double.
 * The only file of the library that includes Arb headers. Each value is computed at a
 * working precision of SYI_ARB_START_PREC bits and, while its relative accuracy
 * (acb_rel_accuracy_bits: the ball radius against the midpoint modulus) is below
 * SYI_ARB_GOAL_BITS, recomputed at twice the precision up to SYI_ARB_MAX_PREC; below
 * SYI_ARB_MIN_BITS at the end it is SY_ELOSS. Accuracy is measured on the complex value
 * as a whole, so a real or imaginary part much smaller than the modulus carries an
 * absolute (not relative) error of ~2^-53 |value|.
 * Branches: Arb's principal branches (cut along the negative real axis for Y, H, K and
 * non-integer orders), which agree with DLMF 10.2, 10.25 and with mpmath.
 * Arb keeps per-thread caches (constants such as pi); they are thread-local, so
 * concurrent calls are safe; a thread may call flint_cleanup() before it exits to
 * release them (optional: they are bounded). */
#include "special_impl.h"

#include <acb_hypgeom.h>
#include <math.h>

/* 64 bits already gives ~60 correct bits for moderate |z|; harder arguments (large
 * |z| with a large imaginary part, where J and Y nearly cancel in H, or orders near
 * |z|) double it. 4096 bits covers cancellations of e^{|Im z|} up to |Im z| ~ 2800,
 * far beyond what wave numbers of the hydrodynamics reach. */
#define SYI_ARB_START_PREC 64
#define SYI_ARB_MAX_PREC 4096

/* r = s i x (s = +-1). Exact; written as a product because GCC 12's object-size
 * checks misfire on the inline acb_mul_onei/acb_div_onei under the sanitizers
 * (-Wstringop-overread in acb.h). */
static void mul_i(acb_t r, const acb_t x, int s, slong prec)
{
    acb_t u;
    acb_init(u);
    acb_set_si_si(u, 0, s);
    acb_mul(r, x, u, prec);
    acb_clear(u);
}

/* res = kind(nu, z) at working precision prec (Arb's principal branches). */
static void eval(acb_t res, syi_bessel_kind kind, const acb_t nu, const acb_t z, slong prec)
{
    switch (kind) {
    case SYI_BESSEL_J:
        acb_hypgeom_bessel_j(res, nu, z, prec);
        break;
    case SYI_BESSEL_Y:
        acb_hypgeom_bessel_y(res, nu, z, prec);
        break;
    case SYI_BESSEL_H1:
    case SYI_BESSEL_H2: {
        /* Where it holds, H from K (DLMF 10.27.8): H1_nu(z) = (2/(pi i)) e^{-i nu pi/2}
         * K_nu(-iz) for -pi/2 < arg z <= pi, H2_nu(z) = (2i/pi) e^{i nu pi/2} K_nu(iz)
         * for -pi < arg z <= pi/2: no cancellation when |Im z| is large. Elsewhere
         * H = J +- iY (DLMF 10.4.3-4), whose cancellation the ball radius shows (the
         * caller then retries at higher precision). */
        int h1 = kind == SYI_BESSEL_H1;
        int re_pos = arf_sgn(arb_midref(acb_realref(z))) > 0;
        int im_sgn = arf_sgn(arb_midref(acb_imagref(z)));
        acb_t t;
        acb_init(t);
        if (re_pos || (h1 ? im_sgn > 0 : im_sgn < 0)) {
            if (h1)
                mul_i(t, z, -1, prec); /* -iz */
            else
                mul_i(t, z, 1, prec); /* iz */
            acb_hypgeom_bessel_k(res, nu, t, prec);
            acb_mul_2exp_si(t, nu, -1); /* nu/2 */
            if (h1)
                acb_neg(t, t);
            acb_exp_pi_i(t, t, prec); /* e^{-+i nu pi/2} */
            acb_mul(res, res, t, prec);
            acb_const_pi(t, prec);
            acb_inv(t, t, prec);
            acb_mul_2exp_si(t, t, 1); /* 2/pi */
            acb_mul(res, res, t, prec);
            if (h1)
                mul_i(res, res, -1, prec); /* 2/(pi i) = -2i/pi */
            else
                mul_i(res, res, 1, prec);
        } else {
            acb_hypgeom_bessel_jy(res, t, nu, z, prec);
            mul_i(t, t, 1, prec);
            if (h1)
                acb_add(res, res, t, prec);
            else
                acb_sub(res, res, t, prec);
        }
        acb_clear(t);
        break;
    }
    case SYI_BESSEL_I_SCALED: {
        /* Arb scales by e^{-z}; ours is e^{-|Re z|}: multiply by e^{z - |Re z|}, i.e.
         * e^{i Im z} for Re z >= 0 and e^{2 Re z + i Im z} for Re z < 0 (both exact
         * doubles as arguments; Arb's exponent range has no overflow). */
        acb_t w;
        acb_init(w);
        acb_hypgeom_bessel_i_scaled(res, nu, z, prec);
        double re = arf_get_d(arb_midref(acb_realref(z)), ARF_RND_NEAR);
        double im = arf_get_d(arb_midref(acb_imagref(z)), ARF_RND_NEAR);
        acb_set_d_d(w, re >= 0.0 ? 0.0 : 2.0 * re, im);
        acb_exp(w, w, prec);
        acb_mul(res, res, w, prec);
        acb_clear(w);
        break;
    }
    case SYI_BESSEL_K_SCALED:
        acb_hypgeom_bessel_k_scaled(res, nu, z, prec); /* e^{z} K_nu(z), as ours */
        break;
    }
}

/* Evaluate with the precision schedule; res holds the final ball. */
static int eval_checked(acb_t res, syi_bessel_kind kind, const acb_t nu, const acb_t z,
                        double nu_d, double complex z_d, sy_error *err)
{
    slong bits = 0;
    for (slong prec = SYI_ARB_START_PREC; prec <= SYI_ARB_MAX_PREC; prec *= 2) {
        eval(res, kind, nu, z, prec);
        if (!acb_is_finite(res)) {
            bits = -1;
            continue;
        }
        if (acb_is_zero(res))
            return SY_OK; /* exact zero, e.g. J_n(0) */
        bits = acb_rel_accuracy_bits(res);
        if (bits >= SYI_ARB_GOAL_BITS)
            return SY_OK;
    }
    if (bits >= SYI_ARB_MIN_BITS)
        return SY_OK;
    return sy_error_set(err, SY_ELOSS,
                        "%s_%g(%.17g%+.17gi): Arb reached only %ld correct bits at %d-bit "
                        "precision (need %d)",
                        syi_special_kind_name(kind), nu_d, creal(z_d), cimag(z_d),
                        (long)bits, SYI_ARB_MAX_PREC, SYI_ARB_MIN_BITS);
}

static double complex to_double(const acb_t x)
{
    double re = arf_get_d(arb_midref(acb_realref(x)), ARF_RND_NEAR);
    double im = arf_get_d(arb_midref(acb_imagref(x)), ARF_RND_NEAR);
    return CMPLX(re, im);
}

int syi_special_arb_value(syi_bessel_kind kind, double nu, double complex z,
                          double complex *out, sy_error *err)
{
    acb_t a_nu, a_z, res;
    acb_init(a_nu);
    acb_init(a_z);
    acb_init(res);
    acb_set_d(a_nu, nu);
    acb_set_d_d(a_z, creal(z), cimag(z));
    int rc = eval_checked(res, kind, a_nu, a_z, nu, z, err);
    if (rc == SY_OK) {
        *out = to_double(res);
        if (!isfinite(creal(*out)) || !isfinite(cimag(*out)))
            rc = sy_error_set(err, SY_EINVAL, "%s_%g(%.17g%+.17gi) overflows double",
                              syi_special_kind_name(kind), nu, creal(z), cimag(z));
    }
    acb_clear(a_nu);
    acb_clear(a_z);
    acb_clear(res);
    return rc;
}

/* Largest binary exponent b with |component| < 2^b over both parts of x; returns 0
 * for an exact zero (no information, leaves *have unset). */
static void bound_exp(const acb_t x, slong *b, int *have)
{
    const arf_struct *part[2] = {arb_midref(acb_realref(x)), arb_midref(acb_imagref(x))};
    for (int i = 0; i < 2; i++) {
        if (arf_is_zero(part[i]))
            continue;
        slong e = arf_abs_bound_lt_2exp_si(part[i]);
        if (!*have || e > *b)
            *b = e;
        *have = 1;
    }
}

int syi_special_arb_pair(syi_bessel_kind kind, int n, double complex z, double complex m[2],
                         long *e, sy_error *err)
{
    acb_t a_nu, a_z, res[2];
    acb_init(a_nu);
    acb_init(a_z);
    acb_init(res[0]);
    acb_init(res[1]);
    acb_set_d_d(a_z, creal(z), cimag(z));
    int rc = SY_OK;
    for (int k = 0; k < 2 && rc == SY_OK; k++) {
        acb_set_si(a_nu, (slong)n + k);
        rc = eval_checked(res[k], kind, a_nu, a_z, (double)n + k, z, err);
    }
    if (rc == SY_OK) {
        slong b = 0;
        int have = 0;
        bound_exp(res[0], &b, &have);
        bound_exp(res[1], &b, &have);
        for (int k = 0; k < 2; k++) {
            acb_mul_2exp_si(res[k], res[k], -b);
            m[k] = to_double(res[k]);
        }
        *e = (long)b;
    }
    acb_clear(a_nu);
    acb_clear(a_z);
    acb_clear(res[0]);
    acb_clear(res[1]);
    return rc;
}
