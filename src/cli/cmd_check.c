/* swellyield check PROJECT: validate the inputs without computing and say what a run
 * would do (bodies, frequencies, headings, sea states, estimated work). */
#include "cli.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

static const char *help =
    "usage: swellyield check PROJECT.ini\n"
    "Reads and validates the project file, its layout and climate, and prints what a run\n"
    "would compute. Nothing is written. Exit 0 if the inputs are valid, 2 if not.\n";

int sy_cmd_check(int argc, char **argv)
{
    if (argc == 2 && (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0)) {
        fputs(help, stdout);
        return SY_EXIT_OK;
    }
    if (argc != 2 || argv[1][0] == '-')
        return sy_cli_usage_error("check", "expected exactly one project file");
    sy_error err = SY_ERROR_INIT;
    sy_model *m = NULL;
    int rc = sy_model_load(&m, argv[1], &err);
    if (rc != SY_OK)
        return sy_cli_fail("check", rc, &err);
    size_t n_modes = 0;
    for (int mode = 1; mode <= 5; mode++)
        n_modes += (m->modes & SY_MODE_BIT(mode)) != 0;
    printf("project     %s\n", m->path);
    printf("site        depth %g m, density %g kg/m^3, gravity %g m/s^2, +x axis bearing %g deg\n", m->depth,
           m->rho, m->g, m->x_axis_bearing * 180 / M_PI);
    printf("device      %s, radius %g m%s", m->shape == SY_SHAPE_FLOAT ? "float" : "column", m->radius,
           m->shape == SY_SHAPE_FLOAT ? "" : "\n");
    if (m->shape == SY_SHAPE_FLOAT) {
        printf(", draft %g m, modes", m->draft);
        for (int mode = 1; mode <= 5; mode++)
            if (m->modes & SY_MODE_BIT(mode))
                printf(" %s", sy_model_mode_name(mode));
        printf("\n");
    }
    printf("layout      %zu devices from %s\n", m->n_devices, m->layout);
    printf("frequencies %zu from %g to %g rad/s\n", m->n_omega, m->omega[0], m->omega[m->n_omega - 1]);
    printf("headings    %zu from %g to %g deg\n", m->n_headings, m->headings[0] * 180 / M_PI,
           m->headings[m->n_headings - 1] * 180 / M_PI);
    if (m->climate[0]) {
        sy_climate_table *cl = NULL;
        sy_climate_summary cs;
        rc = sy_climate_table_load(&cl, m->climate, &err);
        if (rc == SY_OK)
            rc = sy_climate_table_summarise(cl, &cs, &err);
        if (rc != SY_OK) {
            sy_climate_table_free(cl);
            sy_model_free(m);
            return sy_cli_fail("check", rc, &err);
        }
        printf("climate     %s: %zu sea states with occurrence of %zu bins, %.0f h/yr, Hs %g..%g m\n", m->climate,
               cs.n_nonzero, cs.n_bins, cs.total_hours, cs.hs_min, cs.hs_max);
        sy_climate_table_free(cl);
    }
    if (m->has_resonance)
        printf("resonances  Re omega %g..%g rad/s, Im omega down to -%g rad/s, flag Q > %g\n", m->res_re_min,
               m->res_re_max, m->res_im_depth, m->q_threshold);
    /* Work estimate: one dense LU of the N (2M+1) Q interaction unknowns per frequency
     * dominates for large arrays; ~1e10 flop/s per core is what the benchmarks measured
     * (docs/benchmarks.md), so this is a rough guide, not a promise. */
    sy_array_plan *plan = NULL;
    rc = sy_hydro_plan_create(&plan, m, m->devices, m->n_devices, &err);
    if (rc != SY_OK) {
        sy_model_free(m);
        return sy_cli_fail("check", rc, &err);
    }
    char trunc[256];
    sy_array_plan_truncation(plan, trunc, sizeof trunc);
    double nu = (double)sy_array_plan_n_unknowns(plan), flops = 8.0 / 3.0 * nu * nu * nu * (double)m->n_omega;
    printf("hydro       %zu bodies x %zu modes, %.0f interaction unknowns (%s)\n", m->n_devices, n_modes, nu, trunc);
    printf("estimate    about %.0f s for the frequency sweep on 2 cores (dense LU; first run only, then cached)\n",
           fmax(1.0, flops / 2e10));
    sy_array_plan_free(plan);
    sy_model_free(m);
    printf("inputs are valid\n");
    return SY_EXIT_OK;
}
