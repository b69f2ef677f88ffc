/* Benchmark of the resonance search (issue: all poles of a 3 x 3 array in a region
 * holding about 10 poles with <= 64 array evaluations on the contour plus polishing,
 * <= 10 s on 2 cores). INVENTED layout: the demo's 3 x 3 floats. */
#include "bench_clock.h"
#include "float_model.h"
#include "swellyield/swellyield.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

int main(void)
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
        {0.8, 1.6, 0.15, SY_POLES_MOTION, "motion, PTO as set"},
        {0.8, 1.6, 0.15, SY_POLES_NO_PTO, "motion, no PTO (light damping: more poles near the axis)"},
    };
    for (size_t c = 0; c < sizeof cases / sizeof cases[0]; c++) {
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
        size_t found = set->found[SY_POLE_MOTION] + set->found[SY_POLE_MOTION_NO_PTO];
        printf("bench_poles: 3 x 3 floats, %s, region %g..%g x -%g rad/s: %zu poles, %zu array evaluations "
               "(64 on the contour), %.1f s, %.1f evaluations per pole\n",
               cases[c].what, cases[c].lo, cases[c].hi, cases[c].depth, found, set->evaluations, t,
               found ? (double)set->evaluations / (double)found : 0.0);
        sy_pole_set_free(set);
    }
    return 0;
}
