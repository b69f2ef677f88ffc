/* Cross-file internals of the waves module (not exported). */
#ifndef SY_WAVES_IMPL_H
#define SY_WAVES_IMPL_H

#include <complex.h>
#include "swellyield/waves.h"

/* Root number m of the dispersion relation at (possibly complex) omega, always by the
 * complex continuation path (m = 0: propagating, omega^2 = g k tanh(kh); m >= 1:
 * evanescent, omega^2 = -g k tan(kh)). sy_waves_roots_fill uses the real path when
 * Im(omega) == 0; the tests call this one on the real axis to check both paths agree.
 * h finite. SY_ENOCONV if the continuation cannot follow the root. */
int syi_waves_root_continue(size_t m, double complex omega, double h, double g, double complex *k,
                            sy_error *err);

#endif
