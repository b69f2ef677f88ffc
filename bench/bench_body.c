/* Benchmark: one floating truncated cylinder (a = 5 m, d = 4 m, h = 20 m, invented), at
 * tolerance 1e-6: heave, surge and pitch radiation, diffraction and its transfer matrix
 * for orders n = 0..8 and depth modes Q = 4, per frequency. Median wall time per
 * frequency on one core, at real omega (target <= 1 ms) and at complex omega (target
 * <= 20 ms), roots included and excluded. Record the figures in docs/benchmarks.md. */
#include <complex.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>
#include "swellyield/body.h"
#include "swellyield/waves.h"

static double now(void)
{
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return (double)t.tv_sec + 1e-9 * (double)t.tv_nsec;
}

static int cmp(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    const double h = 20.0, g = 9.81, rho = 1025.0;
    const size_t M = 8, Q = 4;
    sy_body_geometry geo = {SY_BODY_FLOAT, 5.0, 4.0, 0.0};
    sy_body_plan *plan = NULL;
    sy_body_work *work = NULL;
    sy_body_waves *out = NULL;
    double t0 = now();
    int rc = sy_body_plan_create(&plan, &geo, h, 1e-6, M, Q, &err);
    double tplan = now() - t0;
    if (rc == SY_OK)
        rc = sy_body_work_alloc(&work, plan, &err);
    if (rc == SY_OK)
        rc = sy_body_waves_alloc(&out, M, Q, &err);
    size_t nr = rc == SY_OK ? sy_body_plan_roots_needed(plan) : 0;
    sy_wave_roots roots;
    roots.k = malloc((nr + 1) * sizeof *roots.k);
    enum { N = 41 };
    double ts[2][N], tr[2][N];
    for (int c = 0; c < 2 && rc == SY_OK; c++)
        for (int i = 0; i < N && rc == SY_OK; i++) {
            double complex om = 0.3 + 0.05 * i + (c ? -0.05 * I : 0.0);
            double a = now();
            rc = sy_waves_roots_fill(&roots, om, h, g, nr, &err);
            double b = now();
            if (rc == SY_OK)
                rc = sy_body_solve(plan, &roots, rho, work, out, &err);
            double e = now();
            tr[c][i] = b - a;
            ts[c][i] = e - b;
        }
    if (rc != SY_OK) {
        fprintf(stderr, "bench_body: %s\n", err.msg);
        return 1;
    }
    printf("bench_body: float a = 5 m, d = 4 m, h = 20 m, tolerance 1e-6, M = %zu, Q = %zu, "
           "%zu exterior modes\n", M, Q, nr);
    printf("  plan: %.1f ms (once per body type)\n", 1e3 * tplan);
    const char *lab[2] = {"real omega   ", "complex omega"};
    for (int c = 0; c < 2; c++) {
        qsort(ts[c], N, sizeof ts[c][0], cmp);
        qsort(tr[c], N, sizeof tr[c][0], cmp);
        printf("  %s: median solve %.3f ms, roots %.3f ms per frequency (%d frequencies)\n",
               lab[c], 1e3 * ts[c][N / 2], 1e3 * tr[c][N / 2], N);
    }
    free(roots.k);
    sy_body_waves_free(out);
    sy_body_work_free(work);
    sy_body_plan_free(plan);
    return 0;
}
