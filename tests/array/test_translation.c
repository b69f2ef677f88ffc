/* Graf's addition theorem as used by the array (H_n for the propagating mode, K_n with
 * its (-1)^m for the evanescent modes): on an irregular layout of unequal bodies in
 * shallow water (strong evanescent coupling), the field of the other bodies' outgoing
 * waves, summed directly from their own expansions at points of one body's surface
 * (GSL Bessel functions, no addition theorem), equals the field of the translated
 * incident coefficients (the module's T~ matrix), depth mode by depth mode. A wrong sign
 * in the K translation fails (the evanescent part is checked to be significant). */
#include "check.h"

#include "array/array_impl.h"
#include "swellyield/array.h"

#include <gsl/gsl_sf_bessel.h>
#include <math.h>
#include <stdlib.h>

#define PI 3.14159265358979323846

/* Hhat_{qn}(r) and Jhat_{qn}(r) (body.h basis) for real k, integer n of any sign. */
static double complex hhat(size_t q, int n, double kr)
{
    int an = abs(n);
    double sgn = (n < 0 && (an & 1)) ? -1.0 : 1.0;
    if (q == 0)
        return sgn * (gsl_sf_bessel_Jn(an, kr) + I * gsl_sf_bessel_Yn(an, kr));
    return gsl_sf_bessel_Kn(an, kr);
}
static double complex jhat(size_t q, int n, double kr)
{
    int an = abs(n);
    double sgn = (n < 0 && (an & 1)) ? -1.0 : 1.0;
    if (q == 0)
        return sgn * gsl_sf_bessel_Jn(an, kr);
    return gsl_sf_bessel_In(an, kr);
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* Depth 4 m, unequal bodies 2-3 radii apart: k_1..k_3 ~ 0.5, 1.3, 2.0 rad/m, so the
     * evanescent waves reach the neighbours with 1e-1..1e-3 of their size. */
    const double h = 4.0;
    const size_t M = 24, Q = 4;
    sy_array_settings set = {h, 1025.0, 9.81, 1e-12, M, Q, 0.0};
    /* floats (a column-only array keeps no evanescent modes); one column among them */
    sy_array_type types[3] = {{{SY_BODY_FLOAT, 1.0, 0.8, 0}, SY_ARRAY_SURGE},
                              {{SY_BODY_FLOAT, 1.6, 1.5, 0}, SY_ARRAY_HEAVE},
                              {{SY_BODY_COLUMN, 0.7, h, 0}, SY_ARRAY_SURGE}};
    sy_array_body bodies[4] = {{0.0, 0.0, 0}, {5.3, 1.1, 1}, {1.2, -4.1, 2}, {-3.9, 2.8, 1}};
    double beta = 0.3;
    sy_array_plan *plan = NULL;
    sy_array_work *w = NULL;
    int rc = sy_array_plan_create(&plan, &set, types, 3, bodies, 4, &beta, 1, &err);
    if (rc == SY_OK)
        rc = sy_array_work_alloc(&w, plan, &err);
    const double omega = 1.1;
    if (rc == SY_OK)
        rc = syi_array_prepare(plan, omega, w, &err);
    if (rc == SY_OK)
        rc = syi_array_translation(plan, w, &err);
    if (!sy_check_ok(rc, &err, "plan, prepare, translation")) {
        sy_array_work_free(w);
        sy_array_plan_free(plan);
        return sy_check_summary();
    }
    const size_t N = plan->n_bodies, nu = plan->n_unknowns;
    sy_check_true(plan->nq[0] == Q, "all %zu depth modes couple to body 0 (got %zu)", Q, plan->nq[0]);
    /* Random scaled outgoing coefficients beta, fixed seed, each partial wave at most the
     * plan's sending bound B^j_{qn} <= 1 (its size on its own body's surface that the
     * angular truncation assumes, plan.c; 1 for the propagating mode). */
    double complex *beta_v = malloc(nu * sizeof *beta_v), *alpha = malloc(nu * sizeof *alpha);
    srand(12345);
    for (size_t u = 0; u < nu; u++) { /* two statements: the order of the draws is then the
                                         same for every compiler (within one expression C
                                         leaves it unspecified; clang and GCC differ) */
        size_t bj, qj;
        long nj;
        sy_array_plan_unknown(plan, u, &bj, &qj, &nj);
        double bound = exp(plan->lsend[(bj * Q + qj) * (M + 1) + (size_t)labs(nj)]);
        double im = rand() / (double)RAND_MAX - 0.5;
        double re = rand() / (double)RAND_MAX - 0.5;
        beta_v[u] = bound * (re + I * im);
    }
    /* alpha = T~ beta from the module's translation blocks */
    double complex *blk = malloc(plan->nn * plan->nn * sizeof *blk);
    for (size_t u = 0; u < nu; u++)
        alpha[u] = 0.0;
    for (size_t i = 0; i < N; i++)
        for (size_t j = 0; j < N; j++)
            for (size_t q = 0; j != i && q < plan->pair_nq[i * N + j]; q++) {
                syi_array_block(plan, w, i, j, q, blk);
                const long Mi = (long)syi_array_order(plan, i, q), Mj = (long)syi_array_order(plan, j, q);
                for (long m = -Mi; m <= Mi; m++)
                    for (long n = -Mj; n <= Mj; n++)
                        alpha[syi_array_unknown(plan, i, q, m)] +=
                            blk[(size_t)(m + Mi) * (size_t)(2 * Mj + 1) + (size_t)(n + Mj)] *
                            beta_v[syi_array_unknown(plan, j, q, n)];
            }
    free(blk);
    for (size_t i = 0; i < N; i++) {
        size_t ti = plan->bodies[i].type;
        double ai = plan->types[ti].geom.radius;
        double maxdiff[8] = {0}, maxval[8] = {0};
        for (int it = 0; it < 16; it++) {
            double th = 2 * PI * it / 16 + 0.1;
            double px = plan->bodies[i].x + ai * cos(th), py = plan->bodies[i].y + ai * sin(th);
            for (size_t q = 0; q < plan->nq[i]; q++) {
                double k = creal(q == 0 ? w->roots.k0 : w->roots.k[q - 1]);
                /* direct: other bodies' own expansions at the point */
                double complex direct = 0.0;
                for (size_t j = 0; j < N; j++) {
                    if (j == i || q >= plan->pair_nq[i * N + j])
                        continue;
                    size_t tj = plan->bodies[j].type;
                    double dx = px - plan->bodies[j].x, dy = py - plan->bodies[j].y;
                    double rj = hypot(dx, dy), thj = atan2(dy, dx);
                    const int Mj = (int)syi_array_order(plan, j, q);
                    for (int n = -Mj; n <= Mj; n++) {
                        size_t u = syi_array_unknown(plan, j, q, n);
                        double complex b = beta_v[u] / syi_array_scale(plan, w, tj, q, n);
                        direct += b * hhat(q, n, k * rj) * cexp(I * n * thj);
                    }
                }
                /* translated: incident coefficients of body i */
                double complex trans = 0.0;
                const int Mi = (int)syi_array_order(plan, i, q);
                for (int m = -Mi; m <= Mi; m++) {
                    size_t u = syi_array_unknown(plan, i, q, m);
                    double complex a = alpha[u] * syi_array_scale(plan, w, ti, q, m);
                    trans += a * jhat(q, m, k * ai) * cexp(I * m * th);
                }
                maxdiff[q] = fmax(maxdiff[q], cabs(direct - trans));
                maxval[q] = fmax(maxval[q], cabs(direct));
            }
        }
        /* Tolerance 1e-8 of the largest value in that mode: the truncation at |m| <= 24 of
         * the addition theorem converges like ((a_i + a_j) / L)^M, < 1e-9 here. */
        for (size_t q = 0; q < plan->nq[i]; q++)
            sy_check_close(maxdiff[q], 0.0, 0.0, 1e-8 * maxval[q],
                           "body %zu, depth mode %zu: direct = translated (max |field| %.3g)", i, q,
                           maxval[q]);
        /* the evanescent field is significant relative to its own size on the source body
         * surface (|beta| ~ 1), so a sign error would show */
        sy_check_true(maxval[1] > 1e-2, "body %zu: evanescent mode 1 field %.3g is significant", i,
                      maxval[1]);
    }
    free(beta_v);
    free(alpha);
    sy_array_work_free(w);
    sy_array_plan_free(plan);
    return sy_check_summary();
}
