/* Benchmark of the resonance search (issue #6: all poles of a 3 x 3 array in a region
 * holding about 10 poles with <= 64 array evaluations on the contour plus polishing,
 * <= 10 s on 2 cores). INVENTED layout: the demo's 3 x 3 floats. Prints count, found,
 * evaluations and time per family (docs/benchmarks.md); `bench_poles RE_MIN RE_MAX
 * IM_DEPTH KINDS` searches another region (KINDS: SY_POLES_* bits). */
#include "bench_clock.h"
#include "float_model.h"
#include "swellyield/swellyield.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

int main(int argc, char **argv)
{
    sy_init();
    double omega[2] = {0.3, 2.5}, head = 0;
    /* The demo's 3 x 3 grid, 40 m apart (INVENTED). */
    double gx[9], gy[9];
    for (int i = 0; i < 9; i++)
        gx[i] = 40.0 * (i % 3), gy[i] = 40.0 * (i / 3);
    sy_model m;
    sy_model_device dev[9];
    sy_test_float_model(&m, dev, 9, gx, gy, omega, 2, &head, 1);
    m.tolerance = 1e-4, m.has_resonance = 1, m.q_threshold = 5;
    strcpy(m.path, "bench");
    struct { double lo, hi, depth; unsigned kinds; const char *what; } cases[] = {
        {1.15, 1.30, 0.05, SY_POLES_NO_PTO | SY_POLES_SCATTERING,
         "no PTO (lightly damped heave modes) and fixed-array scattering"},
        {1.15, 1.45, 0.05, SY_POLES_NO_PTO | SY_POLES_SCATTERING,
         "no PTO (lightly damped heave modes) and fixed-array scattering"},
    };
    size_t n_cases = sizeof cases / sizeof cases[0];
    if (argc == 5) { /* bench_poles RE_MIN RE_MAX IM_DEPTH KINDS: another region */
        n_cases = 1;
        cases[0].lo = atof(argv[1]), cases[0].hi = atof(argv[2]), cases[0].depth = atof(argv[3]);
        cases[0].kinds = (unsigned)atoi(argv[4]);
    }
    for (size_t c = 0; c < n_cases; c++) {
        m.res_re_min = cases[c].lo, m.res_re_max = cases[c].hi, m.res_im_depth = cases[c].depth;
        sy_pole_set *set = NULL;
        sy_error err = SY_ERROR_INIT;
        double t0 = bench_now();
        int rc = sy_poles_find(&set, &m, cases[c].kinds, &err);
        double t = bench_now() - t0;
        if (rc != SY_OK) {
            printf("bench_poles: %s: %s\n", cases[c].what, err.msg);
            continue;
        }
        size_t found = set->found[0] + set->found[1] + set->found[2];
        printf("bench_poles: 3 x 3 floats, %s, region %g..%g x -%g rad/s: %zu array evaluations, %.1f s, "
               "%.1f evaluations per pole\n", cases[c].what, cases[c].lo, cases[c].hi, cases[c].depth,
               set->evaluations, t, found ? (double)set->evaluations / (double)found : 0.0);
        printf("    evaluations: %zu contour + %zu phase tracking + %zu polish (%.2f polish per pole)\n",
               set->evaluations_contour, set->evaluations_tracking,
               set->evaluations - set->evaluations_contour - set->evaluations_tracking,
               found ? (double)(set->evaluations - set->evaluations_contour - set->evaluations_tracking) / (double)found
                     : 0.0);
        for (int k = 0; k < 3; k++)
            if (set->count[k] != SY_POLES_NOT_SEARCHED)
                printf("    %-14s count %d, found %zu\n", sy_pole_kind_name((sy_pole_kind)k), set->count[k], set->found[k]);
        for (size_t i = 0; i < set->n; i++)
            printf("    %-14s %.8f %+.8fi  Q %.2f  residual %.2g%s\n", sy_pole_kind_name(set->poles[i].kind),
                   set->poles[i].omega_r, -set->poles[i].gamma, set->poles[i].q, set->poles[i].residual,
                   set->poles[i].converged ? "" : " (not polished)");
        sy_pole_set_free(set);
    }
    return 0;
}
