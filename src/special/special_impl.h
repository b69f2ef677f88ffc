/* Private interface of the special module: the two back ends behind
 * include/swellyield/special.h. gsl.c evaluates real arguments with GSL; arb.c
 * (the only file that touches Arb) evaluates complex arguments and rounds to double.
 * bessel.c dispatches and runs the double-precision recurrences over orders.
 * No shared mutable state: everything lives on the caller's stack. */
#ifndef SY_SPECIAL_IMPL_H
#define SY_SPECIAL_IMPL_H

#include <complex.h>
#include "swellyield/special.h"

/* Which function; the scaled kinds carry the factors of special.h. */
typedef enum {
    SYI_BESSEL_J,        /* J_nu(z) */
    SYI_BESSEL_Y,        /* Y_nu(z) */
    SYI_BESSEL_H1,       /* H^(1)_nu(z) = J_nu + i Y_nu */
    SYI_BESSEL_I_SCALED, /* I_nu(z) exp(-|Re z|) */
    SYI_BESSEL_K_SCALED, /* K_nu(z) exp(z) */
    SYI_BESSEL_H2        /* H^(2)_nu(z) = J_nu - i Y_nu (internal: H^(1) = 2J - H^(2)) */
} syi_bessel_kind;

/* Short name ("J", "Y", "H1", "I scaled", "K scaled", "H2") for messages. */
const char *syi_special_kind_name(syi_bessel_kind kind);

/* Relative accuracy (bits) an Arb result must reach before it is rounded to double;
 * results that stay below SYI_ARB_MIN_BITS at the highest working precision are
 * SY_ELOSS. 53 bits is double rounding; 50 bits (~1e-15) is what the interface
 * promises with a margin. */
#define SYI_ARB_GOAL_BITS 53
#define SYI_ARB_MIN_BITS 50

/* Arb, one value of kind at real order nu and complex z (principal branch), rounded
 * to double. SY_ELOSS if Arb cannot reach SYI_ARB_MIN_BITS, SY_EINVAL if the value
 * overflows double. Thread-safe. */
int syi_special_arb_value(syi_bessel_kind kind, double nu, double complex z,
                          double complex *out, sy_error *err);

/* Arb, the two values at integer orders n and n + 1 as mantissas m[0], m[1] with a
 * common binary exponent: value = m * 2^(*e), the larger |m| in [1/2, 1). Lets the
 * recurrences start from values outside the double range. */
int syi_special_arb_pair(syi_bessel_kind kind, int n, double complex z, double complex m[2],
                         long *e, sy_error *err);

/* Double-complex fast path (fast.c) for arrays of orders 0..nmax at Re z >= 0 (J, H1,
 * I scaled, K scaled): SY_OK, or SY_CONTINUE when z or nmax is outside its verified
 * range or a value is not finite (the caller then uses Arb). scratch holds
 * SYI_FAST_SCRATCH(nmax) values. Never sets an error. */
#define SYI_FAST_SCRATCH(nmax) (2 * ((size_t)(nmax) + 3))
int syi_special_fast_array(syi_bessel_kind kind, int nmax, double complex z,
                           double complex *out, double complex *scratch);

/* Fast path for J_nu (kind J) or I_nu e^{-|Re z|} (kind I scaled) of real order
 * 0 <= nu <= 400 at Re z >= 0; SY_OK or SY_CONTINUE as above. */
int syi_special_fast_nu(syi_bessel_kind kind, double nu, double complex z, double complex *out);

/* J_n or I_n e^{-|Re z|}, n = 0..nmax, for |z| <= SYI_SMALL_ZMAX (real or complex) by
 * the ascending series; SY_CONTINUE for larger |z| or other kinds. Used below 1e-2
 * because there GSL's Jn_array (all zeros when its top seed underflows) and
 * I1_scaled (drops e^{-x} below x ~ 1e-8) are wrong, and the Wronskian pair of the
 * fast path leaves double range. */
#define SYI_SMALL_ZMAX 1e-2
int syi_special_small_array(syi_bessel_kind kind, int nmax, double complex z, double complex *out);

/* GSL, integer orders 0..nmax at real x into out (imaginary parts 0 for J, I, K;
 * H1 = J + iY). x > 0 for Y, H1, K; any x for J, I. */
int syi_special_gsl_array(syi_bessel_kind kind, int nmax, double x, double complex *out,
                          sy_error *err);

/* GSL, one integer order n >= 0 at real x (same domain as above). */
int syi_special_gsl_value(syi_bessel_kind kind, int n, double x, double complex *out,
                          sy_error *err);

/* GSL, J_nu(x) or I_nu(x) exp(-x) for real nu >= 0, x >= 0. */
int syi_special_gsl_nu(syi_bessel_kind kind, double nu, double x, double *out, sy_error *err);

#endif
