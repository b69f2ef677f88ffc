/* Special functions behind one small interface (conventions.md): Bessel functions of
 * integer order (and of real fractional order for the Galerkin projections) at real or
 * complex argument. A real argument (cimag(z) == 0) uses GSL's fast real routines;
 * a complex argument uses Arb (FLINT), with the result rounded to double and checked for
 * accuracy. Every other module calls these, never GSL Bessel or Arb directly.
 *
 * Arguments are dimensionless (e.g. z = k r with k in rad/m, r in m).
 * Scaled forms avoid overflow: I_n(z) e^{-|Re z|} and K_n(z) e^{z}.
 * Branches: principal branches (DLMF 10.2, 10.25), cut along the negative real axis.
 * J_n and I_n of integer order are entire (any finite z, z = 0 included). Y_n, H^(1)_n,
 * K_n and the fractional orders accept any finite z off the cut: z != 0 and not
 * (cimag(z) == 0 and creal(z) < 0) (the side of the cut would depend on the sign of a
 * zero imaginary part, so it is refused rather than guessed); SY_EINVAL there.
 * Accuracy: the Arb path rounds values known to >= 53 bits (always >= 50, else
 * SY_ELOSS); arrays of orders add double-precision recurrences in the stable direction,
 * which keep ~1e-14 relative to the size of the pair (|J_n| + |Y_n|, |I_n| + |K_n|
 * scaled alike), i.e. near a zero of J_n the error is absolute at that scale. The GSL
 * path has GSL's accuracy (1e-15 to 1e-13 relative, same caveat near zeros).
 * Deep underflow gives 0 (or a subnormal) with SY_OK; a value that overflows double is
 * SY_EINVAL.
 * Status: SY_EINVAL (bad order or argument, overflow), SY_ELOSS (Arb could not reach
 * double accuracy), SY_ENOCONV (GSL iteration limit), SY_ENOMEM, SY_EINPUT (other GSL
 * failures). Messages name the function, order and argument.
 * Thread-safe: no shared mutable state. Arb keeps thread-local caches of constants; a
 * thread may call flint_cleanup() before it exits to release them (optional). */
#ifndef SWELLYIELD_SPECIAL_H
#define SWELLYIELD_SPECIAL_H

#include <complex.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Scalar convenience forms (integer order n >= 0 or < 0 by reflection,
 * C_{-n} = (-1)^n C_n), NaN + NaN i on failure (domain as above). */
SY_API double complex sy_special_besselj(int n, double complex z);
SY_API double complex sy_special_bessely(int n, double complex z);
SY_API double complex sy_special_hankel1(int n, double complex z);

/* Orders 0..nmax (nmax >= 0) into out[0..nmax] (caller-owned, nmax + 1 values).
 * Hankel1 = J + iY; I scaled = I_n(z) e^{-|Re z|}; K scaled = K_n(z) e^{z}.
 * Domain and accuracy as above (Y, H, K: z off the cut). */
SY_API int sy_special_besselj_array(int nmax, double complex z, double complex *out, sy_error *err);
SY_API int sy_special_hankel1_array(int nmax, double complex z, double complex *out, sy_error *err);
SY_API int sy_special_besseli_scaled_array(int nmax, double complex z, double complex *out, sy_error *err);
SY_API int sy_special_besselk_scaled_array(int nmax, double complex z, double complex *out, sy_error *err);

/* J_nu(z) for real order nu >= 0 (fractional orders for the edge-weighted Galerkin
 * projections), real or complex z (principal branch; integer nu also at real z < 0). */
SY_API int sy_special_besselj_nu(double nu, double complex z, double complex *out, sy_error *err);

/* I_nu(z) e^{-|Re z|} for real order nu >= 0 (cosh-type depth modes in the Galerkin
 * projections), real or complex z (principal branch; integer nu also at real z < 0).
 * The scale keeps arguments up to |Re z| ~ 1e3 and beyond in range. */
SY_API int sy_special_besseli_nu_scaled(double nu, double complex z, double complex *out, sy_error *err);

/* Which recurrence the derivative helper applies (DLMF 10.6.2, 10.29.2). */
typedef enum {
    SY_SPECIAL_CYLINDER,  /* J, Y, H^(1): C_n' = C_{n-1} - (n/z) C_n, C_0' = -C_1 */
    SY_SPECIAL_MODIFIED_I, /* I:  I_n' = I_{n-1} - (n/z) I_n, I_0' = I_1 */
    SY_SPECIAL_MODIFIED_K  /* K:  K_n' = -K_{n-1} - (n/z) K_n, K_0' = -K_1 */
} sy_special_family;

/* Derivatives d/dz of orders 0..nmax (nmax >= 1) from values val[0..nmax] of one
 * family at the same z (e.g. from the arrays above), into dval[0..nmax] (may not alias
 * val). No special-function calls. Scaled arrays give the derivative times the same
 * scale factor (I_n'(z) e^{-|Re z|}, K_n'(z) e^{z}). At z = 0 only J and I are finite:
 * uses C_n' = (C_{n-1} -+ C_{n+1}) / 2 with C_{nmax+1}(0) = 0; K at z = 0 is SY_EINVAL.
 * Thread-safe. */
SY_API int sy_special_deriv_array(sy_special_family family, int nmax, double complex z,
                                  const double complex *val, double complex *dval,
                                  sy_error *err);

/* ---- Added by the float body solver (src/special/fast_complex.c), not part of the
 * special module's own interface: fast double-precision evaluations for complex
 * arguments where the Arb path is too slow for per-frequency sums. ---- */

/* K_nu(z) e^{z} for real nu, Re z > 0, |z| >= 0.05, |arg z| <= 1, by the trapezoidal rule
 * on DLMF 10.32.9; relative accuracy ~1e-15. SY_EINVAL outside that range. */
SY_API int sy_special_besselk_scaled_quad(double nu, double complex z, double complex *out,
                                          sy_error *err);

/* J_nu(z) for real nu (|nu| <= ~4), |z| >= 25, |arg z| <= pi/4, by Hankel's asymptotic
 * expansion (DLMF 10.17.3); relative accuracy ~1e-15 where J is not near a zero (absolute
 * ~1e-16 sqrt(2/(pi|z|)) e^{|Im z|}). SY_EINVAL outside that range. */
SY_API int sy_special_besselj_nu_hankel(double nu, double complex z, double complex *out,
                                        sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
