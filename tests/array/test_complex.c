/* Complex frequency, the fixed-array determinant and the sweep:
 *  - the excitation and log det(I - D T) at omega + i eps equal their real-axis Taylor
 *    expansion f(omega) + i eps f'(omega) (the complex path is the analytic
 *    continuation of the real one; f' by central differences on the real axis);
 *  - log det(I - D T) equals the determinant of the unscaled matrix built independently
 *    here from GSL Bessel functions (Graf's theorem, MacCamy-Fuchs D) for two columns;
 *  - sy_array_interaction_solve solves with that factorisation;
 *  - sy_array_sweep (threads) gives the same numbers as serial solves. */
#include "check.h"

#include "array/array_impl.h"
#include "swellyield/array.h"

#include <gsl/gsl_sf_bessel.h>
#include <lapacke.h>
#include <math.h>
#include <stdlib.h>

#define PI 3.14159265358979323846

static double complex hank(int n, double x)
{
    int an = abs(n);
    double s = (n < 0 && (an & 1)) ? -1.0 : 1.0;
    return s * (gsl_sf_bessel_Jn(an, x) + I * gsl_sf_bessel_Yn(an, x));
}
static double complex hankp(int n, double x) { return 0.5 * (hank(n - 1, x) - hank(n + 1, x)); }
static double besjp(int n, double x)
{
    int an = abs(n);
    double s = (n < 0 && (an & 1)) ? -1.0 : 1.0;
    return s * 0.5 * (gsl_sf_bessel_Jn(an - 1, x) - gsl_sf_bessel_Jn(an + 1, x));
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    const double h = 12.0;
    const size_t M = 5;
    sy_array_settings set = {h, 1025.0, 9.81, 1e-8, M, 3, 0.0};
    sy_array_type types[2] = {{{SY_BODY_COLUMN, 1.0, h, 0}, SY_ARRAY_SURGE | SY_ARRAY_SWAY},
                              {{SY_BODY_COLUMN, 1.4, h, 0}, SY_ARRAY_SURGE}};
    sy_array_body bodies[3] = {{0, 0, 0}, {4.1, 1.3, 1}, {-0.7, 3.9, 0}};
    double beta[2] = {0.2, 2.1};
    sy_array_plan *plan = NULL;
    sy_array_work *w = NULL;
    sy_array_hydro *r0 = NULL, *rp = NULL, *rm = NULL, *rc_ = NULL;
    int rc = sy_array_plan_create(&plan, &set, types, 2, bodies, 3, beta, 2, &err);
    if (rc == SY_OK)
        rc = sy_array_work_alloc(&w, plan, &err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&r0, plan, &err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&rp, plan, &err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&rm, plan, &err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&rc_, plan, &err);
    if (!sy_check_ok(rc, &err, "plan and work"))
        goto done;
    const size_t nd = plan->n_dof, nh = plan->n_headings;
    /* --- Analytic continuation. Step d = 1e-4 on the real axis (derivative error
     * ~ d^2 f''' ~ 1e-8 f), eps = 1e-4 (Taylor remainder eps^2 f''/2 ~ 1e-8 f): 1e-6. */
    const double om = 1.3, d = 1e-4, eps = 1e-4;
    double complex ld0, ldp, ldm, ldc;
    rc = sy_array_solve(plan, om + d, w, rp, &err);
    if (rc == SY_OK)
        rc = sy_array_interaction_logdet(plan, om + d, w, &ldp, &err);
    if (rc == SY_OK)
        rc = sy_array_solve(plan, om - d, w, rm, &err);
    if (rc == SY_OK)
        rc = sy_array_interaction_logdet(plan, om - d, w, &ldm, &err);
    if (rc == SY_OK)
        rc = sy_array_solve(plan, om + I * eps, w, rc_, &err);
    if (rc == SY_OK)
        rc = sy_array_interaction_logdet(plan, om + I * eps, w, &ldc, &err);
    if (rc == SY_OK)
        rc = sy_array_solve(plan, om, w, r0, &err);
    if (rc == SY_OK)
        rc = sy_array_interaction_logdet(plan, om, w, &ld0, &err);
    if (!sy_check_ok(rc, &err, "solves near omega = %g", om))
        goto done;
    double xmax = 0;
    for (size_t k = 0; k < nh * nd; k++)
        xmax = fmax(xmax, cabs(r0->excitation[k]));
    for (size_t k = 0; k < nh * nd; k++) {
        double complex deriv = (rp->excitation[k] - rm->excitation[k]) / (2 * d);
        sy_check_cclose(rc_->excitation[k], r0->excitation[k] + I * eps * deriv, 0.0, 1e-6 * xmax,
                        "X[%zu] at omega + i eps = Taylor expansion", k);
    }
    sy_check_cclose(ldc, ld0 + I * eps * (ldp - ldm) / (2 * d), 0.0, 1e-6 * (1 + cabs(ld0)),
                    "log det at omega + i eps = Taylor expansion");
    sy_check_true(isnan(rc_->added_mass[0]) && isnan(rc_->damping[0]) && isnan(rc_->cg),
                  "complex omega: A, B, cg are NaN (impedance is the result)");
    sy_check_true(!isnan(r0->added_mass[0]) && r0->cg > 0, "real omega: A, B, cg filled");

    /* --- log det against an independent unscaled construction: a_{i,m} = sum_j sum_n
     * T^{ij}_{mn} b_{j,n}, T_{mn} = H_{n-m}(kL) e^{i(n-m) alpha_ij} (the Graf form of
     * references.md section 9), b = D a with D_n = -J_n'(ka)/H_n'(ka); det(I - D T).
     * Only q = 0 is excited for columns, and the evanescent block of I - D T is the
     * identity plus the evanescent coupling, whose determinant the module includes:
     * compare the q = 0 part using a columns-only plan with one depth mode. */
    {
        sy_array_settings s1 = set;
        s1.n_depth = 1;
        sy_array_plan *p1 = NULL;
        sy_array_work *w1 = NULL;
        double complex ld;
        rc = sy_array_plan_create(&p1, &s1, types, 2, bodies, 3, beta, 2, &err);
        if (rc == SY_OK)
            rc = sy_array_work_alloc(&w1, p1, &err);
        if (rc == SY_OK)
            rc = sy_array_interaction_logdet(p1, om, w1, &ld, &err);
        if (sy_check_ok(rc, &err, "logdet Q = 1")) {
            const size_t N = 3, nn = 2 * M + 1, n = N * nn;
            double k = creal(w1->roots.k0);
            double complex *a = calloc(n * n, sizeof *a);
            lapack_int *piv = malloc(n * sizeof *piv);
            for (size_t i = 0; i < N; i++) {
                double ai = types[bodies[i].type].geom.radius;
                for (size_t j = 0; j < N; j++) {
                    if (i == j)
                        continue;
                    double dx = bodies[i].x - bodies[j].x, dy = bodies[i].y - bodies[j].y;
                    double L = hypot(dx, dy), al = atan2(dy, dx);
                    for (int m = -(int)M; m <= (int)M; m++) {
                        double complex dm = -besjp(m, k * ai) / hankp(m, k * ai);
                        for (int nq = -(int)M; nq <= (int)M; nq++)
                            a[(i * nn + (size_t)(m + (int)M)) * n + j * nn + (size_t)(nq + (int)M)] =
                                -dm * hank(nq - m, k * L) * cexp(I * (nq - m) * al);
                    }
                }
            }
            for (size_t u = 0; u < n; u++)
                a[u * n + u] += 1.0;
            double complex *a0 = malloc(n * n * sizeof *a0);
            for (size_t u = 0; u < n * n; u++)
                a0[u] = a[u];
            LAPACKE_zgetrf(LAPACK_ROW_MAJOR, (lapack_int)n, (lapack_int)n, a, (lapack_int)n, piv);
            double complex det = 1.0;
            for (size_t u = 0; u < n; u++)
                det *= a[u * n + u] * ((size_t)piv[u] != u + 1 ? -1.0 : 1.0);
            /* scaled vs unscaled LU: rounding of a 33 x 33 well-conditioned system */
            sy_check_cclose(cexp(ld), det, 1e-11, 0.0, "det(I - D T) scaled = unscaled (GSL)");
            sy_check_true(cabs(det - 1.0) > 1e-3, "interaction is not negligible (|det - 1| = %.3g)",
                          cabs(det - 1.0));
            /* interaction_solve with the factorisation, in the scaled basis x = S y:
             * (I - D T) y = S^-1 e_0 for the unscaled matrix built above (residual ~
             * rounding times the condition number, small here). */
            double complex *x = calloc(n, sizeof *x);
            x[0] = 1.0;
            rc = sy_array_interaction_solve(p1, w1, x, x, &err);
            if (sy_check_ok(rc, &err, "interaction solve")) {
                double worst = 0;
                for (size_t u = 0; u < n; u++) {
                    double complex acc = 0;
                    for (size_t v = 0; v < n; v++) {
                        size_t jb = v / nn;
                        long nv = (long)(v % nn) - (long)M;
                        acc += a0[u * n + v] * x[v] / syi_array_scale(p1, w1, bodies[jb].type, 0, nv);
                    }
                    if (u == 0)
                        acc -= 1.0 / syi_array_scale(p1, w1, bodies[0].type, 0, -(long)M);
                    worst = fmax(worst, cabs(acc) * syi_array_scale(p1, w1, bodies[u / nn].type, 0,
                                                                    (long)(u % nn) - (long)M));
                }
                sy_check_close(worst, 0.0, 0.0, 1e-12, "interaction solve residual (scaled)");
            }
            free(x);
            free(a0);
            free(a);
            free(piv);
        }
        sy_array_work_free(w1);
        sy_array_plan_free(p1);
    }

    /* --- Floats: the array impedance Z = B - i omega A at omega + i eps equals its
     * real-axis Taylor expansion (the radiation path continued, not only the scattering). */
    {
        sy_array_type tf[2] = {{{SY_BODY_FLOAT, 2.0, 1.5, 0.0}, SY_ARRAY_HEAVE | SY_ARRAY_SURGE},
                               {{SY_BODY_FLOAT, 1.2, 2.5, 0.0}, SY_ARRAY_HEAVE}};
        sy_array_body bf[2] = {{0, 0, 0}, {6.1, 2.3, 1}};
        sy_array_plan *pf = NULL;
        sy_array_work *wf = NULL;
        sy_array_hydro *z[4] = {0};
        rc = sy_array_plan_create(&pf, &set, tf, 2, bf, 2, beta, 2, &err);
        if (rc == SY_OK)
            rc = sy_array_work_alloc(&wf, pf, &err);
        for (int c = 0; c < 4 && rc == SY_OK; c++)
            rc = sy_array_hydro_alloc(&z[c], pf, &err);
        const double complex om4[4] = {om, om + d, om - d, om + I * eps};
        for (int c = 0; c < 4 && rc == SY_OK; c++)
            rc = sy_array_solve(pf, om4[c], wf, z[c], &err);
        if (sy_check_ok(rc, &err, "float pair near omega = %g", om)) {
            size_t n = z[0]->n_dof;
            double zmax = 0;
            for (size_t k = 0; k < n * n; k++)
                zmax = fmax(zmax, cabs(z[0]->impedance[k]));
            for (size_t k = 0; k < n * n; k++) {
                double complex deriv = (z[1]->impedance[k] - z[2]->impedance[k]) / (2 * d);
                sy_check_cclose(z[3]->impedance[k], z[0]->impedance[k] + I * eps * deriv, 0.0, 1e-6 * zmax,
                                "float Z[%zu] at omega + i eps = Taylor expansion", k);
            }
        }
        for (int c = 0; c < 4; c++)
            sy_array_hydro_free(z[c]);
        sy_array_work_free(wf);
        sy_array_plan_free(pf);
    }
    /* --- Sweep on threads equals serial solves (same code path per frequency). */
    {
        double omegas[5] = {0.6, 0.9, 1.2, 1.5, 1.8};
        sy_array_hydro *res[5] = {0};
        for (size_t i = 0; i < 5; i++)
            sy_array_hydro_alloc(&res[i], plan, &err);
        rc = sy_array_sweep(plan, omegas, 5, res, 2, &err);
        if (sy_check_ok(rc, &err, "sweep")) {
            for (size_t i = 0; i < 5; i++) {
                sy_array_solve(plan, omegas[i], w, r0, &err);
                double worst = 0;
                for (size_t k = 0; k < nh * nd; k++)
                    worst = fmax(worst, cabs(res[i]->excitation[k] - r0->excitation[k]));
                sy_check_close(worst, 0.0, 0.0, 1e-9 * xmax, "sweep = serial at omega %g", omegas[i]);
            }
        }
        /* a bad frequency names its index */
        omegas[3] = -1.0;
        rc = sy_array_sweep(plan, omegas, 5, res, 2, &err);
        sy_check_fails(rc, SY_EINVAL, &err, "omega[3]", "sweep reports the failing index");
        for (size_t i = 0; i < 5; i++)
            sy_array_hydro_free(res[i]);
    }
done:
    sy_array_hydro_free(r0);
    sy_array_hydro_free(rp);
    sy_array_hydro_free(rm);
    sy_array_hydro_free(rc_);
    sy_array_work_free(w);
    sy_array_plan_free(plan);
    return sy_check_summary();
}
