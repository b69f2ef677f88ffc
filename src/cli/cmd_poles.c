/* swellyield poles PROJECT [-o FILE.csv]: the array's complex resonances in the
 * project's [resonance] region (motion with the PTO as set, without it, and the fixed
 * array's scattering resonances). */
#include "cli.h"

#include <getopt.h>
#include <complex.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

static const char *help =
    "usage: swellyield poles PROJECT.ini [-o FILE.csv] [-t PREFIX] [--quiet]\n"
    "Finds the complex resonances omega = omega_r - i gamma (Q = omega_r / 2 gamma) inside the\n"
    "[resonance] region: motion resonances with the PTO as set and without it, and the\n"
    "scattering resonances of the array held fixed. Prints them; -o writes them as CSV with\n"
    "each motion resonance's mode shape (amplitude and phase of every body's dof).\n"
    "-t PREFIX writes PREFIX_decay.csv/.png (free decay after releasing the first body from\n"
    "1 m) and PREFIX_pulse.csv/.png (response to a short heave force pulse): the sum over the motion\n"
    "poles beside a direct Fourier inversion of the real-frequency response. A pole sum\n"
    "leaves out the non-pole (branch) part, which matters most at early times.\n";

int sy_cmd_poles(int argc, char **argv)
{
    static const struct option opts[] = {{"output", required_argument, NULL, 'o'}, {"quiet", no_argument, NULL, 'q'},
                                         {"time-response", required_argument, NULL, 't'},
                                         {"help", no_argument, NULL, 'h'},         {NULL, 0, NULL, 0}};
    const char *out = NULL, *tprefix = NULL;
    int c;
    optind = 1;
    while ((c = getopt_long(argc, argv, "o:t:qh", opts, NULL)) != -1) {
        switch (c) {
        case 'o': out = optarg; break;
        case 't': tprefix = optarg; break;
        case 'q': sy_cli_set_quiet(1); break;
        case 'h': fputs(help, stdout); return SY_EXIT_OK;
        default: return sy_cli_usage_error("poles", "unknown option");
        }
    }
    if (argc - optind != 1)
        return sy_cli_usage_error("poles", "expected exactly one project file");
    sy_error err = SY_ERROR_INIT;
    sy_model *m = NULL;
    sy_pole_set *set = NULL;
    int rc = sy_model_load(&m, argv[optind], &err);
    sy_progress prog = {0};
    if (rc == SY_OK)
        rc = sy_poles_find_progress(&set, m, SY_POLES_MOTION | SY_POLES_NO_PTO | SY_POLES_SCATTERING,
                                    sy_cli_poles_progress, &prog, &err);
    sy_progress_end(&prog);
    if (rc == SY_OK && out != NULL)
        rc = sy_outputs_write_poles(out, m, set, &err);
    if (rc == SY_OK && tprefix != NULL) { /* PREFIX = [folder/]stem */
        char dir[SY_OUTPUTS_PATH_MAX], stem[SY_OUTPUTS_PATH_MAX + 16];
        const char *slash = strrchr(tprefix, '/');
        size_t nd = slash == NULL ? 0 : (size_t)(slash - tprefix);
        if (nd + 1 >= sizeof dir || strlen(tprefix) + 8 >= sizeof dir) {
            rc = sy_error_set(&err, SY_EINVAL, "-t %.40s...: prefix too long", tprefix);
        } else {
            snprintf(dir, sizeof dir, "%.*s", (int)(slash == NULL ? 1 : nd == 0 ? 1 : nd),
                     slash == NULL ? "." : tprefix);
            const char *base = slash == NULL ? tprefix : slash + 1;
            for (int k = 0; k < 2 && rc == SY_OK; k++) {
                snprintf(stem, sizeof stem, "%s%s", base, k == 0 ? "_decay" : "_pulse");
                rc = sy_cli_time_response(m, set, k == 0 ? SY_RESPONSE_DECAY : SY_RESPONSE_PULSE, dir, stem, &err);
            }
        }
    }
    if (rc != SY_OK) {
        int code = sy_cli_fail("poles", rc, &err);
        sy_model_free(m);
        return code;
    }
    printf("resonances of %s in Re omega %g..%g rad/s, Im omega -%g..0 (%zu array evaluations)\n", m->path,
           m->res_re_min, m->res_re_max, m->res_im_depth, set->evaluations);
    for (int k = 0; k < 3; k++)
        if (set->count[k] != SY_POLES_NOT_SEARCHED)
            printf("  %-14s found %zu, argument-principle count %d%s\n", sy_pole_kind_name((sy_pole_kind)k),
                   set->found[k], set->count[k], set->count[k] == (int)set->found[k] ? "" : "  (differ: see docs)");
    printf("  %-14s %12s %12s %10s %9s\n", "kind", "omega_r", "gamma", "Q", "period s");
    for (size_t i = 0; i < set->n; i++) {
        const sy_pole *p = &set->poles[i];
        printf("  %-14s %12.6f %12.6f %10.3f %9.3f%s\n", sy_pole_kind_name(p->kind), p->omega_r, p->gamma, p->q,
               2 * M_PI / p->omega_r, p->converged ? "" : "  (not polished)");
    }
    sy_pole_set_free(set);
    sy_model_free(m);
    return SY_EXIT_OK;
}
