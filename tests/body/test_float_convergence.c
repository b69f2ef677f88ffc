/* Convergence of the float solver under refinement (docs/hydro-convergence.md):
 *  (1) the tolerance sequence 1e-3 .. 1e-10 (automatic truncation): each level's A, B
 *      and D_n(0,0) agree with the finest level within the level's tolerance (relative to
 *      the largest entry of the same kind), and the reported convergence estimate is not
 *      smaller than the true change by more than a factor 10 (it is a change between two
 *      truncation levels, so it is usually pessimistic). The solver's floor is ~3e-9
 *      relative (reference-tail truncation, near-dependent corner families), so the
 *      finest level is not used as a target itself;
 *  (2) the Galerkin sequence P = 3..7 first-family functions (two corner functions of the
 *      second family, Qx = 96): the change per step falls by at least 4 per step until
 *      round-off, printed with the observed rate;
 *  (3) the exterior-mode sequence Qx = 8..128 at P = 6: the change falls at least like
 *      Qx^-2 (predicted Qx^-10/3 after the second-order tail correction). */
#include <complex.h>
#include <math.h>
#include <stdio.h>
#include "check.h"
#include "float_testlib.h"
#include "body/float_impl.h"

#define NV 8

static int values(tl_float *t, double omega, double v[NV], double *conv, sy_error *err)
{
    int rc = tl_float_solve(t, omega, err);
    if (rc != SY_OK)
        return rc;
    const sy_body_waves *o = t->out;
    v[0] = creal(o->added_mass[12]);
    v[1] = creal(o->damping[12]);
    v[2] = creal(o->added_mass[0]);
    v[3] = creal(o->damping[0]);
    v[4] = creal(o->added_mass[24]);
    v[5] = creal(o->added_mass[4]);
    v[6] = creal(o->diffraction[0]);
    v[7] = cimag(o->diffraction[0]);
    *conv = o->convergence;
    return SY_OK;
}

static double reldiff(const double a[NV], const double b[NV])
{
    /* A entries relative to max |A|, B to max |B|, D to 1 */
    double sa = fmax(fabs(b[0]), fmax(fabs(b[2]), fabs(b[4]))), sb = fmax(fabs(b[1]), fabs(b[3]));
    double r = 0.0;
    for (int i = 0; i < NV; i++) {
        double s = (i == 1 || i == 3) ? sb : (i >= 6) ? 1.0 : sa;
        r = fmax(r, fabs(a[i] - b[i]) / s);
    }
    return r;
}

static int forced(tl_float *t, size_t P, size_t Qx, double a, double d, double h, sy_error *err)
{
    sy_body_geometry geo = {SY_BODY_FLOAT, a, d, 0.0};
    sy_body_work_free(t->work);
    sy_body_plan_free(t->plan);
    t->work = NULL;
    t->plan = NULL;
    int rc = syi_body_float_plan_create(&t->plan, &geo, h, P, 2, Qx, 1, 1, err);
    if (rc == SY_OK)
        rc = sy_body_work_alloc(&t->work, t->plan, err);
    free(t->roots.k);
    t->roots.k = malloc((Qx + 1) * sizeof *t->roots.k);
    return rc;
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    const double a = 5.0, d = 4.0, h = 20.0;
    const double omegas[2] = {0.9, 2.0};
    for (int io = 0; io < 2; io++) {
        double om = omegas[io];
        const double tols[5] = {1e-3, 1e-5, 1e-7, 1e-8, 1e-10};
        double v[5][NV], conv[5];
        int ok = 1;
        for (int i = 0; i < 5 && ok; i++) {
            tl_float t;
            ok = sy_check_ok(tl_float_open(&t, a, d, h, 0.0, tols[i], 1, 1, &err), &err, "open") &&
                 sy_check_ok(values(&t, om, v[i], &conv[i], &err), &err, "solve");
            tl_float_close(&t);
        }
        if (!ok)
            continue;
        printf("omega = %g: tolerance, A33, B33, A11, B11, A55, change vs finest, estimate\n", om);
        for (int i = 0; i < 5; i++) {
            double r = reldiff(v[i], v[4]);
            printf("  %.0e  %.10g %.10g %.10g %.10g %.10g  %.2e  %.2e\n", tols[i], v[i][0], v[i][1],
                   v[i][2], v[i][3], v[i][4], r, conv[i]);
            if (i < 4) {
                sy_check_close(r, 0.0, 0.0, tols[i], "omega %g: tolerance %.0e met (change %.2e)", om, tols[i], r);
                sy_check_true(conv[i] >= 0.1 * r, "omega %g: estimate %.2e not below a tenth of the change %.2e",
                              om, conv[i], r);
            }
        }
    }
    /* Galerkin sequence at fixed exterior truncation */
    {
        tl_float t;
        double prev[NV], cur[NV], c, last = 0.0;
        if (sy_check_ok(tl_float_open(&t, a, d, h, 0.0, 1e-6, 1, 1, &err), &err, "open")) {
            printf("Galerkin sequence (P first-family + 2 corner functions, Qx = 96), omega = 0.9:\n");
            for (size_t P = 3; P <= 7; P++) {
                if (!sy_check_ok(forced(&t, P, 96, a, d, h, &err), &err, "plan P = %zu", P) ||
                    !sy_check_ok(values(&t, 0.9, cur, &c, &err), &err, "solve"))
                    break;
                if (P > 3) {
                    double r = reldiff(prev, cur);
                    printf("  P = %zu: A33 %.12g  change %.2e  ratio %.1f\n", P, cur[0], r,
                           last > 0 && r > 0 ? last / r : 0.0);
                    if (last > 1e-12)
                        sy_check_true(r < last / 4.0 || r < 1e-11, "P = %zu: change %.2e < previous/4 or round-off", P, r);
                    last = r;
                }
                for (int i = 0; i < NV; i++)
                    prev[i] = cur[i];
            }
        }
        tl_float_close(&t);
    }
    /* exterior-mode sequence */
    {
        tl_float t;
        double prev[NV], cur[NV], c, last = 0.0;
        if (sy_check_ok(tl_float_open(&t, a, d, h, 0.0, 1e-6, 1, 1, &err), &err, "open")) {
            printf("exterior sequence (Qx modes, P = 6 + 2), omega = 2.0 (K h = 8.2):\n");
            for (size_t Qx = 8; Qx <= 128; Qx *= 2) {
                if (!sy_check_ok(forced(&t, 6, Qx, a, d, h, &err), &err, "plan Qx = %zu", Qx) ||
                    !sy_check_ok(values(&t, 2.0, cur, &c, &err), &err, "solve"))
                    break;
                if (Qx > 8) {
                    double r = reldiff(prev, cur);
                    printf("  Qx = %3zu: A11 %.12g  change %.2e  ratio %.1f\n", Qx, cur[2], r,
                           last > 0 && r > 0 ? last / r : 0.0);
                    if (last > 1e-11)
                        sy_check_true(r < last / 4.0 || r < 1e-10, "Qx = %zu: change %.2e < previous/4 or round-off", Qx, r);
                    last = r;
                }
                for (int i = 0; i < NV; i++)
                    prev[i] = cur[i];
            }
        }
        tl_float_close(&t);
    }
    return sy_check_summary();
}
