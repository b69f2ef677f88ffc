/* Array solve timings (docs/benchmarks.md, section "array"): time per frequency for
 * N = 1..100 bodies on a square grid (heave, 36 headings), the fitted cost exponent,
 * the ratio to a bare dense LU (zgetrf) of the same size in the same run, a 3 x 3 array
 * at 120 frequencies x 36 headings through sy_array_sweep on 2 threads, and peak memory.
 * Bodies: floats (radius 5 m, draft 4 m, heave) if the float kind is available, else
 * fixed columns (radius 5 m, surge) and the output says so. Invented layout: spacing
 * 30 m, depth 30 m, M = 6 orders, Q = 4 depth modes, tolerance 1e-6.
 * Then the demo-like geometry (INVENTED: floats a = 5 m, d = 4 m, 40 m apart in 50 m of
 * water, tolerance 1e-4, frequencies 0.25..2.5 rad/s) at the automatic truncation of the
 * hydro module, with the per-mode angular truncation (what a run gets) and without it
 * (2M+1 orders in every kept depth mode): N = 100 per frequency, and the 3 x 3 sweep. */
#include "array/array_impl.h"
#include "float_model.h"
#include "swellyield/array.h"
#include "swellyield/hydro.h"

#include <cblas.h>
#include <lapacke.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/resource.h>
#include <time.h>

#define PI 3.14159265358979323846

static double now(void)
{
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return t.tv_sec + 1e-9 * t.tv_nsec;
}

static sy_array_type body_type(int use_float)
{
    sy_array_type t = {{SY_BODY_FLOAT, 5.0, 4.0, 0.0}, SY_ARRAY_HEAVE};
    if (!use_float) {
        t.geom.kind = SY_BODY_COLUMN;
        t.modes = SY_ARRAY_SURGE;
    }
    return t;
}

static int make_plan_q(sy_array_plan **plan, size_t N, int use_float, size_t Q, sy_error *err)
{
    sy_array_settings s = {30.0, 1025.0, 9.81, 1e-6, 6, Q, 0.0};
    sy_array_type t = body_type(use_float);
    double beta[36];
    for (int b = 0; b < 36; b++)
        beta[b] = 2 * PI * b / 36;
    size_t side = (size_t)ceil(sqrt((double)N));
    sy_array_body *bodies = malloc(N * sizeof *bodies);
    for (size_t i = 0; i < N; i++)
        bodies[i] = (sy_array_body){30.0 * (double)(i % side), 30.0 * (double)(i / side), 0};
    int rc = sy_array_plan_create(plan, &s, &t, 1, bodies, N, beta, 36, err);
    free(bodies);
    return rc;
}

static int make_plan(sy_array_plan **plan, size_t N, int use_float, sy_error *err)
{
    return make_plan_q(plan, N, use_float, 4, err);
}

/* seconds for one zgetrf of a random diagonally dominant n x n complex matrix */
static double bare_lu(size_t n)
{
    double complex *a = malloc(n * n * sizeof *a);
    lapack_int *piv = malloc(n * sizeof *piv);
    srand(7);
    for (size_t i = 0; i < n * n; i++)
        a[i] = (rand() / (double)RAND_MAX - 0.5) + I * (rand() / (double)RAND_MAX - 0.5);
    for (size_t i = 0; i < n; i++)
        a[i * n + i] += (double)n;
    double t0 = now();
    /* column-major: in place, as the array solve factorises (row-major would add LAPACKE's
     * two transposed copies to the figure) */
    LAPACKE_zgetrf(LAPACK_COL_MAJOR, (lapack_int)n, (lapack_int)n, a, (lapack_int)n, piv);
    double t = now() - t0;
    free(a);
    free(piv);
    return t;
}

/* The sweep over omega[nw] on 1 and 2 threads, one line each. */
static int sweep_rows(const sy_array_plan *plan, const double *omega, size_t nw, sy_array_hydro **res,
                      const char *label, sy_error *err)
{
    int rc = SY_OK;
    for (int threads = 1; threads <= 2 && rc == SY_OK; threads++) {
        double t0 = now();
        rc = sy_array_sweep(plan, omega, nw, res, threads, err);
        double t = now() - t0;
        if (rc == SY_OK)
            printf("bench_array: %s (%zu unknowns), %zu frequencies x %zu headings, %d thread%s: %.3f s\n", label,
                   sy_array_plan_n_unknowns(plan), nw, sy_array_plan_n_headings(plan), threads,
                   threads > 1 ? "s" : "", t);
    }
    return rc;
}

/* Plan for the first n devices of the demo-like model: full = 0 through the hydro
 * module (automatic truncation, per-mode orders), full = 1 the same M, Q with 2M+1 orders
 * in every kept depth mode. */
static int demo_plan(sy_array_plan **plan, const sy_model *m, size_t n, int full, sy_error *err)
{
    if (!full)
        return sy_hydro_plan_create(plan, m, m->devices, n, err);
    sy_array_settings s = {m->depth, m->rho, m->g, m->tolerance, 0, 0, 1e-3};
    sy_hydro_truncation(m, m->devices, n, &s.n_order, &s.n_depth);
    sy_array_type t = {{SY_BODY_FLOAT, 5.0, 4.0, 0.0}, SY_ARRAY_HEAVE};
    sy_array_body *b = malloc(n * sizeof *b);
    for (size_t i = 0; i < n; i++)
        b[i] = (sy_array_body){m->devices[i].x, m->devices[i].y, 0};
    int rc = syi_array_plan_create(plan, &s, &t, 1, b, n, m->headings, m->n_headings, 1, err);
    free(b);
    return rc;
}

static void demo_like(int use_float)
{
    if (!use_float)
        return;
    enum { NB = 100, NW = 120, NH = 36 };
    static sy_model_device dev[NB];
    double x[NB], y[NB], omega[NW], heads[NH];
    for (size_t i = 0; i < NB; i++)
        x[i] = 40.0 * (double)(i % 10), y[i] = 40.0 * (double)(i / 10);
    for (size_t i = 0; i < NW; i++)
        omega[i] = 0.25 + 2.25 * (double)i / (NW - 1);
    for (size_t b = 0; b < NH; b++)
        heads[b] = 2 * PI * (double)b / NH;
    sy_model m;
    sy_test_float_model(&m, dev, NB, x, y, omega, NW, heads, NH);
    m.tolerance = 1e-4;
    sy_error err = SY_ERROR_INIT;
    size_t M, Q;
    sy_hydro_truncation(&m, dev, NB, &M, &Q);
    printf("bench_array: demo-like geometry (40 m spacing, 50 m depth, tolerance 1e-4): automatic M = %zu, Q = %zu\n",
           M, Q);
    /* N = 100, one frequency; the full truncation (8500 unknowns, ~45 s) only on request */
    int with_full = getenv("SY_BENCH_FULL") != NULL;
    for (int full = 0; full <= with_full; full++)
        for (int bt = 1; bt <= 2; bt++) {
            sy_array_plan *plan = NULL;
            sy_array_work *work = NULL;
            sy_array_hydro *res = NULL;
            openblas_set_num_threads(bt);
            double t0 = now();
            int rc = demo_plan(&plan, &m, NB, full, &err);
            double tp = now() - t0;
            if (rc == SY_OK)
                rc = sy_array_work_alloc(&work, plan, &err);
            if (rc == SY_OK)
                rc = sy_array_hydro_alloc(&res, plan, &err);
            /* the first solve with a fresh work also pays the first touch of its pages
             * (the n_u^2 matrix); a sweep reuses the work, so the second is the figure */
            t0 = now();
            if (rc == SY_OK)
                rc = sy_array_solve(plan, 0.8, work, res, &err);
            double t1 = now() - t0;
            t0 = now();
            if (rc == SY_OK)
                rc = sy_array_solve(plan, 0.81, work, res, &err);
            double t = now() - t0;
            if (rc == SY_OK) {
                size_t nu = sy_array_plan_n_unknowns(plan);
                printf("bench_array: demo-like N = 100, %s: %zu unknowns, %d BLAS thread%s: %.3f s per frequency "
                       "(first solve with a fresh work %.3f s; bare LU %.3f s, plan %.2f s)\n",
                       full ? "2M+1 orders per mode" : "per-mode orders", nu, bt, bt > 1 ? "s" : "", t, t1,
                       bare_lu(nu), tp);
            } else {
                printf("bench_array: demo-like N = 100 failed: %s\n", err.msg);
            }
            if (rc == SY_OK && !full && bt == 1) {
                char text[256];
                sy_array_plan_truncation(plan, text, sizeof text);
                printf("bench_array: demo-like N = 100: %s\n", text);
            }
            sy_array_hydro_free(res);
            sy_array_work_free(work);
            sy_array_plan_free(plan);
        }
    openblas_set_num_threads(1);
    /* the 3 x 3 demo layout, 120 frequencies x 36 headings */
    static const double x9[9] = {0, 40, 80, 0, 40, 80, 0, 40, 80}, y9[9] = {0, 0, 0, 40, 40, 40, 80, 80, 80};
    sy_test_float_model(&m, dev, 9, x9, y9, omega, NW, heads, NH);
    m.tolerance = 1e-4;
    for (int full = 0; full <= 1; full++) {
        sy_array_plan *plan = NULL;
        sy_array_hydro *res[NW] = {0};
        int rc = demo_plan(&plan, &m, 9, full, &err);
        for (size_t i = 0; rc == SY_OK && i < NW; i++)
            rc = sy_array_hydro_alloc(&res[i], plan, &err);
        if (rc == SY_OK)
            rc = sweep_rows(plan, omega, NW, res, full ? "demo-like 3x3, 2M+1 orders per mode" : "demo-like 3x3, per-mode orders",
                            &err);
        if (rc != SY_OK)
            printf("bench_array: demo-like sweep failed: %s\n", err.msg);
        for (size_t i = 0; i < NW; i++)
            sy_array_hydro_free(res[i]);
        sy_array_plan_free(plan);
    }
}

int main(int argc, char **argv)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    sy_array_plan *probe = NULL;
    int use_float = make_plan(&probe, 1, 1, &err) == SY_OK;
    sy_array_plan_free(probe);
    if (argc > 1 && strcmp(argv[1], "demo") == 0) {
        /* only the demo-like section (N = 100 and the 3 x 3 sweep) */
        demo_like(use_float);
        return 0;
    }
    printf("bench_array: bodies are %s (%s)\n", use_float ? "floats, heave" : "columns, surge",
           use_float ? "float kind available" : "float kind not available");
    openblas_set_num_threads(1);
    printf("bench_array: single-threaded BLAS for the per-frequency table\n");
    printf("%5s %9s %8s %12s %12s %8s %8s\n", "N", "unknowns", "dropped", "s/frequency", "bare LU s",
           "ratio", "MB");
    const size_t Ns[] = {1, 2, 4, 9, 16, 36, 64, 100};
    double lx[8], ly[8];
    size_t nfit = 0;
    for (size_t c = 0; c < sizeof Ns / sizeof Ns[0]; c++) {
        sy_array_plan *plan = NULL;
        sy_array_work *work = NULL;
        sy_array_hydro *res = NULL;
        int rc = make_plan(&plan, Ns[c], use_float, &err);
        if (rc == SY_OK)
            rc = sy_array_work_alloc(&work, plan, &err);
        if (rc == SY_OK)
            rc = sy_array_hydro_alloc(&res, plan, &err);
        size_t reps = Ns[c] <= 16 ? 10 : Ns[c] <= 36 ? 3 : 1;
        /* one untimed solve first: a sweep reuses its work, so the pages of the n_u^2
         * matrix are touched once per thread, not once per frequency */
        if (rc == SY_OK)
            rc = sy_array_solve(plan, 0.79, work, res, &err);
        double t0 = now();
        for (size_t r = 0; rc == SY_OK && r < reps; r++)
            rc = sy_array_solve(plan, 0.8 + 0.01 * (double)r, work, res, &err);
        double t = (now() - t0) / (double)reps;
        if (rc != SY_OK) {
            printf("bench_array: N = %zu failed: %s\n", Ns[c], err.msg);
        } else {
            size_t nu = sy_array_plan_n_unknowns(plan);
            double lu = bare_lu(nu);
            struct rusage ru;
            getrusage(RUSAGE_SELF, &ru);
            printf("%5zu %9zu %8zu %12.4g %12.4g %8.2f %8.1f\n", Ns[c], nu, sy_array_plan_dropped(plan), t,
                   lu, lu > 0 ? t / lu : 0.0, ru.ru_maxrss / 1024.0);
            if (Ns[c] >= 9) {
                lx[nfit] = log((double)Ns[c]);
                ly[nfit] = log(t);
                nfit++;
            }
        }
        sy_array_hydro_free(res);
        sy_array_work_free(work);
        sy_array_plan_free(plan);
    }
    if (nfit >= 2) {
        double mx = 0, my = 0, sxx = 0, sxy = 0;
        for (size_t i = 0; i < nfit; i++) {
            mx += lx[i] / nfit;
            my += ly[i] / nfit;
        }
        for (size_t i = 0; i < nfit; i++) {
            sxx += (lx[i] - mx) * (lx[i] - mx);
            sxy += (lx[i] - mx) * (ly[i] - my);
        }
        printf("bench_array: cost exponent (least squares, N >= 9): time ~ N^%.2f\n", sxy / sxx);
    }
    /* N = 100 with fewer depth modes, and Q = 4 (the table above) again, on 1 and 2 BLAS
     * threads */
    for (size_t Q = 1; Q <= 4; Q += Q)
        for (int bt = 1; bt <= 2; bt++) {
            sy_array_plan *plan = NULL;
            sy_array_work *work = NULL;
            sy_array_hydro *res = NULL;
            openblas_set_num_threads(bt);
            int rc = make_plan_q(&plan, 100, use_float, Q, &err);
            if (rc == SY_OK)
                rc = sy_array_work_alloc(&work, plan, &err);
            if (rc == SY_OK)
                rc = sy_array_hydro_alloc(&res, plan, &err);
            if (rc == SY_OK)
                rc = sy_array_solve(plan, 0.79, work, res, &err);   /* untimed, as above */
            double t0 = now();
            if (rc == SY_OK)
                rc = sy_array_solve(plan, 0.8, work, res, &err);
            double t = now() - t0;
            if (rc == SY_OK)
                printf("bench_array: N = 100, Q = %zu (%zu unknowns), %d BLAS thread%s: %.3f s per frequency\n", Q,
                       sy_array_plan_n_unknowns(plan), bt, bt > 1 ? "s" : "", t);
            else
                printf("bench_array: N = 100, Q = %zu failed: %s\n", Q, err.msg);
            sy_array_hydro_free(res);
            sy_array_work_free(work);
            sy_array_plan_free(plan);
        }
    openblas_set_num_threads(1);
    /* 3 x 3 array, 120 frequencies x 36 headings, sweep on 1 and 2 threads, Q = 4 and 2 */
    for (size_t Q = 4; Q >= 2; Q -= 2) {
        sy_array_plan *plan = NULL;
        const size_t nw = 120;
        double omega[120];
        sy_array_hydro *res[120] = {0};
        int rc = make_plan_q(&plan, 9, use_float, Q, &err);
        for (size_t i = 0; i < nw; i++) {
            omega[i] = 0.3 + 1.5 * (double)i / (nw - 1);
            if (rc == SY_OK)
                rc = sy_array_hydro_alloc(&res[i], plan, &err);
        }
        char label[64];
        snprintf(label, sizeof label, "3x3 array, Q = %zu", Q);
        if (rc == SY_OK)
            rc = sweep_rows(plan, omega, nw, res, label, &err);
        if (rc != SY_OK)
            printf("bench_array: sweep failed: %s\n", err.msg);
        for (size_t i = 0; i < nw; i++)
            sy_array_hydro_free(res[i]);
        sy_array_plan_free(plan);
    }
    {
        sy_array_plan *plan = NULL;
        if (make_plan(&plan, 100, use_float, &err) == SY_OK) {
            char text[256];
            sy_array_plan_truncation(plan, text, sizeof text);
            printf("bench_array: bench geometry, N = 100: %s\n", text);
        }
        sy_array_plan_free(plan);
    }
    demo_like(use_float);
    struct rusage ru;
    getrusage(RUSAGE_SELF, &ru);
    printf("bench_array: peak resident memory %.1f MB\n", ru.ru_maxrss / 1024.0);
    return 0;
}
