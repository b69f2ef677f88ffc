/* Special functions behind one small interface (conventions.md): Bessel functions of
 * integer order (and of real fractional order for the Galerkin projections) at real or
 * complex argument. A real argument (cimag(z) == 0) uses GSL's fast real routines;
 * a complex argument uses Arb (FLINT), with the result rounded to double and checked for
 * accuracy. Every other module calls these, never GSL Bessel or Arb directly.
 * Scaled forms avoid overflow: I_n(z) e^{-|Re z|} and K_n(z) e^{z}.
 * Thread-safe (no shared state). Status SY_EINVAL (bad order/argument), SY_ELOSS (Arb
 * could not reach double accuracy), SY_EINPUT/ENOCONV from the underlying routine. */
#ifndef SWELLYIELD_SPECIAL_H
#define SWELLYIELD_SPECIAL_H

#include <complex.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Scalar convenience forms (integer order n >= 0 or < 0), NaN on failure. */
SY_API double complex sy_special_besselj(int n, double complex z);
SY_API double complex sy_special_bessely(int n, double complex z);
SY_API double complex sy_special_hankel1(int n, double complex z);

/* Orders 0..nmax into out[0..nmax]; each relative accuracy ~1e-14 where the value is
 * not in deep underflow. Require Re z > 0 for Y, H, K (principal branch). */
SY_API int sy_special_besselj_array(int nmax, double complex z, double complex *out, sy_error *err);
SY_API int sy_special_hankel1_array(int nmax, double complex z, double complex *out, sy_error *err);
SY_API int sy_special_besseli_scaled_array(int nmax, double complex z, double complex *out, sy_error *err);
SY_API int sy_special_besselk_scaled_array(int nmax, double complex z, double complex *out, sy_error *err);

/* J_nu(z) for real order nu >= 0 (fractional orders for the edge-weighted Galerkin
 * projections), real or complex z (principal branch). */
SY_API int sy_special_besselj_nu(double nu, double complex z, double complex *out, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
