/* Test helper: a model of n floats built in code (no project file), with the defaults the
 * physics tests share; a test overrides what it studies after the call. */
#ifndef SY_TEST_FLOAT_MODEL_H
#define SY_TEST_FLOAT_MODEL_H

#include <stddef.h>
#include "swellyield/model.h"

/* n floats of radius 5 m, draft 4 m, named F1..Fn, at (x[i], y[i]) (y may be NULL: 0), in
 * 50 m of water (rho 1025, g 9.81), heave only, PTO on heave with damping 2e5 N s/m,
 * efficiency 1, no rating or stroke limit, JONSWAP 3.3 long-crested, tolerance 1e-6. The
 * grids are the caller's arrays (kept by pointer); dev must hold n devices. */
void sy_test_float_model(sy_model *m, sy_model_device *dev, size_t n, const double *x, const double *y,
                         double *omega, size_t n_omega, double *headings, size_t n_headings);

/* Set every device's PTO damping and the model default to b (N s/m). */
void sy_test_pto_damping(sy_model *m, double b);

/* The poles tests' model: sy_test_float_model on the band 0.4..2.4 rad/s (no headings),
 * PTO damping bpto, [resonance] region 0.4..2.4 x -0.8, and the truncation
 * sy_poles_find uses (tolerance 1e-9, automatic orders), so that an impedance evaluated
 * by a test is the same analytic function as the search's. */
void sy_test_pole_model(sy_model *m, sy_model_device *dev, size_t n, const double *x, double bpto);

#endif
