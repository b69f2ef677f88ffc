/* Test helpers for the body tests (header-only, static): wave roots, one float solve,
 * and the excitation force of a plane wave from the force characteristics G.
 *
 * Plane wave (conventions.md): phi_I = -(i g A/omega) Z_0(z) exp(i k r cos(theta - beta)).
 * Jacobi-Anger (DLMF 10.12.1): exp(i x cos psi) = sum_n i^n J_n(x) e^{i n psi}, so the
 * incident partial-wave coefficients of body.h are a_{0n} = -(i g A/omega) i^n e^{-i n beta}
 * and X_j(beta) = sum_n a_{0n} G_j(0, n) per unit amplitude A. */
#ifndef SY_TEST_FLOAT_TESTLIB_H
#define SY_TEST_FLOAT_TESTLIB_H

#include <complex.h>
#include <math.h>
#include <stdlib.h>
#include "swellyield/body.h"
#include "swellyield/waves.h"

#define TL_PI 3.14159265358979323846

typedef struct {
    sy_body_plan *plan;
    sy_body_work *work;
    sy_body_waves *out;
    sy_wave_roots roots;
    double h, g, rho;
} tl_float;

static inline int tl_float_open(tl_float *t, double a, double d, double h, double z_rot, double tol,
                         size_t M, size_t Q, sy_error *err)
{
    sy_body_geometry geo = {SY_BODY_FLOAT, a, d, z_rot};
    t->h = h;
    t->g = 9.81;
    t->rho = 1025.0;
    t->plan = NULL;
    t->work = NULL;
    t->out = NULL;
    t->roots.k = NULL;
    int rc = sy_body_plan_create(&t->plan, &geo, h, tol, M, Q, err);
    if (rc == SY_OK)
        rc = sy_body_work_alloc(&t->work, t->plan, err);
    if (rc == SY_OK)
        rc = sy_body_waves_alloc(&t->out, M, Q, err);
    if (rc == SY_OK) {
        t->roots.k = malloc((sy_body_plan_roots_needed(t->plan) + 1) * sizeof *t->roots.k);
        if (t->roots.k == NULL)
            rc = SY_ENOMEM;
    }
    return rc;
}

static inline void tl_float_close(tl_float *t)
{
    sy_body_waves_free(t->out);
    sy_body_work_free(t->work);
    sy_body_plan_free(t->plan);
    free(t->roots.k);
}

static inline int tl_float_solve(tl_float *t, double complex omega, sy_error *err)
{
    int rc = sy_waves_roots_fill(&t->roots, omega, t->h, t->g,
                                 sy_body_plan_roots_needed(t->plan), err);
    if (rc == SY_OK)
        rc = sy_body_solve(t->plan, &t->roots, t->rho, t->work, t->out, err);
    return rc;
}

/* X_j(beta) per unit amplitude, j = 0..4, from G_j(0, n). */
static inline void tl_excitation(const sy_body_waves *w, double complex omega, double g, double beta,
                          double complex X[5])
{
    size_t M = w->n_order, Q = w->n_depth, nn = 2 * M + 1;
    for (int j = 0; j < 5; j++) {
        double complex s = 0.0;
        for (int n = -(int)M; n <= (int)M; n++) {
            double complex in = cpow(I, n);
            double complex an = -(I * g / omega) * in * cexp(-I * n * beta);
            s += an * w->force[((size_t)j * Q + 0) * nn + (size_t)(n + (int)M)];
        }
        X[j] = s;
    }
}

/* Impedance B - i omega A (the analytic quantity at complex omega). */
static inline double complex tl_impedance(const sy_body_waves *w, int i, int j)
{
    return w->damping[i * 5 + j] - I * w->omega * w->added_mass[i * 5 + j];
}

#endif
