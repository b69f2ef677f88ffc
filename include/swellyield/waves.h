/* Linear water waves in finite depth h: the dispersion relation omega^2 = g k tanh(k h),
 * its evanescent roots omega^2 = -g k_m tan(k_m h) with k_m h in ((m - 1/2) pi, m pi),
 * group velocity; for real and complex omega (the complex roots are the analytic
 * continuation of the real ones, see conventions.md). SI units: omega rad/s, k rad/m,
 * h m, g m/s^2. Spectra and wave power are declared in sea.h.
 * All functions are pure and thread-safe. */
#ifndef SWELLYIELD_WAVES_H
#define SWELLYIELD_WAVES_H

#include <complex.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Propagating wavenumber k > 0 for real omega > 0, depth h > 0 (use h = INFINITY for
 * deep water), gravity g > 0. Relative residual < 1e-14; exact (k = omega^2/g) once
 * tanh(kh) rounds to 1, no overflow at any kh. SY_EINVAL on bad arguments. */
SY_API int sy_waves_wavenumber(double omega, double h, double g, double *k, sy_error *err);

/* Group velocity cg = (omega/k)/2 (1 + 2kh/sinh(2kh)) [m/s]; deep limit for large kh. */
SY_API double sy_waves_group_velocity(double omega, double k, double h);

/* The roots of the dispersion relation at one (possibly complex) frequency.
 * Filled by sy_waves_roots_fill; the caller owns k[] (capacity n_evanescent).
 * Real omega: k0 real > 0, k[m-1] = k_m real with k_m h in ((m - 1/2) pi, m pi).
 * Complex omega: the same roots continued analytically (k0 -> k0(omega), ...). */
typedef struct sy_wave_roots {
    double complex omega; /* rad/s */
    double h, g; /* m, m/s^2 */
    double complex k0; /* propagating root, rad/m */
    size_t n_evanescent; /* number of evanescent roots filled (<= capacity) */
    double complex *k; /* k[m-1] = k_m, m = 1..n_evanescent, rad/m */
} sy_wave_roots;

/* Fill r with the propagating root and the first n_evanescent evanescent roots at
 * omega (Re omega > 0). r->k must point to caller storage for n_evanescent values.
 * Each root is within a few ulps of the exact root (checked against 40-digit mpmath up
 * to m = 1000), so it satisfies its relation to 1e-12 relative except where the relation
 * itself is worse conditioned than that (long waves at high m: rounding k_m to double
 * alone moves x tan x by ~ (m pi)^2 eps / y relative, y = omega^2 h / g).
 * Real omega (Im omega == 0): real safeguarded Newton, k0 and k[] have zero imaginary
 * parts. Complex omega: analytic continuation from the real roots at Re(omega) along
 * the vertical path (Euler predictor + Newton corrector with step halving, never
 * jumping branch); on the real axis the continuation agrees with the real path to
 * 4 ulps; k(conj omega) = conj k(omega). Tested domain: |Im omega| <= 0.8 Re omega
 * (Q >= 0.625 for a pole), omega 0.03..20 rad/s, h 0.5..5000 m, 100 roots: no
 * failures. Near arg omega = -+pi/4 the path passes close to branch points of the
 * evanescent relation (|Y| ~ m pi, Y = omega^2 h/g, where two roots meet) and the root's
 * identity becomes path-dependent: there the call may return SY_ENOCONV, or a root
 * that carries a neighbour's label. For Im omega < 0, Im k0 < 0 (outgoing waves grow
 * with r, as they must at a resonance pole). Deep water (h = INFINITY): k0 = omega^2/g and n_evanescent must
 * be 0. No allocation; about 0.1-0.25 us per real root, 0.6-1.5 us per complex root
 * (bench/bench_dispersion.c). SY_EINVAL (bad argument, r or r->k NULL),
 * SY_ENOCONV (continuation lost the root). */
SY_API int sy_waves_roots_fill(sy_wave_roots *r, double complex omega, double h, double g,
                               size_t n_evanescent, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
