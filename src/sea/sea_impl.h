/* Cross-file internals of the sea module (not exported). */
#ifndef SY_SEA_IMPL_H
#define SY_SEA_IMPL_H

#include "swellyield/sea.h"

#define SYI_PI 3.14159265358979323846

/* Relative accuracy requested from every adaptive integral: near double precision, so
 * quadrature error stays far below the 1e-6..1e-9 the tests and references.md ask. */
#define SYI_SEA_EPSREL 1e-12
/* GSL may stop short of SYI_SEA_EPSREL by rounding (GSL_EROUND etc.); its own error
 * estimate is then accepted up to this relative size, else the call fails. */
#define SYI_SEA_EPSREL_ACCEPT 1e-9

/* int_a^b f(x) dx with GSL's adaptive Gauss-Kronrod rule (b = INFINITY allowed). `what`
 * names the integral in error messages. SY_ENOMEM, SY_ENOCONV. */
int syi_sea_integrate(double (*f)(double x, void *p), void *p, double a, double b, double *result,
                      const char *what, sy_error *err);

/* The dimensionless spectral shape s(u) = u^-5 exp(-5/4 u^-4) gamma^r(u), u = w/wp,
 * ln_gamma = ln(gamma) (0 for PM). */
double syi_sea_shape(double u, double ln_gamma);

/* Checks omega[0] > 0, strictly increasing, finite, n >= 2 (`name` for messages). */
int syi_sea_check_grid(const double *omega, size_t n, const char *name, sy_error *err);

/* Cell bounds of grid point i: [*a, *b] (mid-point rule of sy_sea_omega_weights). */
void syi_sea_cell(const double *omega, size_t n, size_t i, double *a, double *b);

/* Fraction of m0 between w0 and w1 (rad/s, w1 may be INFINITY), without the
 * cancellation of a difference of CDFs. */
int syi_sea_spectrum_band(const sy_sea_spectrum *s, double w0, double w1, double *frac,
                          sy_error *err);

#endif
