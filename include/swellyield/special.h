/* Special functions behind one small interface (conventions.md): Bessel functions of
 * integer order (and of real fractional order for the Galerkin projections) at real or
 * complex argument. Every other module calls these, never GSL Bessel or Arb directly.
 *  - Real argument (cimag(z) == 0): GSL's real routines (~0.2-5 us per call or array),
 *    except where GSL 2.7 was measured wrong: J_n, I_n at |x| <= 1e-2 (series here) and
 *    J_nu (x <= 30), I_nu (x <= 2e3) of fractional order (the fast path below).
 *  - Complex argument, Re z >= 0, 1e-6 <= |z| <= 2e3, |Im z| <= 300, orders <= 400:
 *    double-complex algorithms (K_0, K_1 by series or Temme's CF2, Hankel from K, J and I
 *    by CF1 + Miller + Wronskian; ~1-15 us per array of 21 orders), checked against Arb.
 *    J, I at Re z < 0 by reflection; J_n, I_n arrays at |z| <= 1e-2 (real or complex) by
 *    the ascending series; J_nu, I_nu of real order also below |z| = 1e-6.
 *  - Anything else complex: Arb (FLINT) ball arithmetic, retried at higher precision
 *    until >= 53 correct bits (slower: ~10 us to ~1 ms).
 *
 * Arguments are dimensionless (e.g. z = k r with k in rad/m, r in m).
 * Scaled forms avoid overflow: I_n(z) e^{-|Re z|} and K_n(z) e^{z}.
 * Branches: principal branches (DLMF 10.2, 10.25), cut along the negative real axis.
 * J_n and I_n of integer order are entire (any finite z, z = 0 included). Y_n, H^(1)_n,
 * K_n and the fractional orders accept any finite z off the cut: z != 0 and not
 * (cimag(z) == 0 and creal(z) < 0) (the side of the cut would depend on the sign of a
 * zero imaginary part, so it is refused rather than guessed); SY_EINVAL there.
 * (J_nu, I_nu at real x = 0 are fine: 1 for nu = 0, else 0.)
 * Accuracy (measured against mpmath and Arb, tests/special): error / scale <= 1.5e-14
 * on the fast path (3000 random points, |z| 1e-6..2e3, orders 0..40, nu 0..40), <= 1e-14
 * on the Arb path; GSL on the real axis <= 1e-13 (3e-13 for I_nu at x = 2.5e3, beyond
 * the fast range). The scale is |value| for H^(1),
 * Y, K; for J and I (minimal solutions) in the oscillatory range n < |z| it is the larger
 * of |value| and its partner |Y_n| (|K_n| scaled alike): near a zero of J_n the error
 * is absolute at that size, as with any recurrence (and with GSL).
 * Deep underflow gives 0 (or a subnormal) with SY_OK; a value that overflows double is
 * SY_EINVAL.
 * Status: SY_EINVAL (bad order or argument, overflow), SY_ELOSS (Arb could not reach
 * double accuracy), SY_ENOCONV (GSL iteration limit), SY_ENOMEM, SY_EINPUT (other GSL
 * failures). Messages name the function, order and argument.
 * Thread-safe: no shared mutable state, no allocation below 128 orders. Arb keeps
 * thread-local caches of constants; a thread may call flint_cleanup() before it exits
 * to release them (optional). */
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

#ifdef __cplusplus
}
#endif
#endif
