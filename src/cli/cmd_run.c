/* swellyield run [PROJECT] [-o DIR]: the main job. Hydrodynamics of the array (cached),
 * PTO dynamics, the climate's sea states, four tuning strategies, power matrices,
 * annual energy and q-factor, written all-or-nothing into DIR. */
#include "cli.h"
#include "sy_config.h"

#include <complex.h>
#include <errno.h>
#include <getopt.h>
#include <sys/stat.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

static const char *help =
    "usage: swellyield run [PROJECT.ini] [-o DIR] [--jobs N] [--quiet]\n"
    "Estimates the energy yield of the project's array at its site and writes into DIR\n"
    "(default ./swellyield-out): hydro.nc (hydrodynamic database), power_matrix.nc and\n"
    "power_matrix.csv, devices.csv, summary.json. Without PROJECT it runs the bundled\n"
    "invented demo (examples/demo/project.ini). The folder is replaced only when the whole\n"
    "run succeeds; DIR/cache keeps solved frequencies so a re-run resumes.\n"
    "  -o, --output DIR   output folder\n"
    "  -j, --jobs N       threads for the frequency sweep (default: all cores)\n"
    "  -q, --quiet        no progress bar\n"
    "  -r, --resonances   also search the [resonance] region for the array's motion\n"
    "                     resonances, flag the bands of those with Q > q_threshold and\n"
    "                     report the share of the annual energy made inside them (poles.csv,\n"
    "                     summary.json flagged_bands); slower\n";

static void print_summary(const sy_model *m, const sy_yield_result *r, const char *dir, const char *note,
                          const sy_flagged_band *bands, size_t nb)
{
    int head = (int)m->tuning;
    const sy_yield_strategy *y = &r->s[head];
    printf("swellyield estimate for %s (%zu devices)\n", m->path, r->n_devices);
    printf("  site mean wave power   %.1f kW/m  (climate %s, %.0f h/yr covered of %.0f)\n", r->mean_resource / 1e3,
           m->climate, r->hours_covered, SY_CLIMATE_HOURS_PER_YEAR);
    printf("  tuning %-16s annual energy %.1f MWh/yr, mean power %.1f kW, q-factor %.3f", sy_yield_strategy_name(head),
           y->energy_array / 1e6, y->mean_power / 1e3, y->q_factor);
    if (isfinite(y->capacity_factor))
        printf(", capacity factor %.3f", y->capacity_factor);
    printf("\n\n  %-16s %14s %10s %8s %10s\n", "strategy", "energy MWh/yr", "mean kW", "q", "stroke!");
    for (int s = 0; s < SY_YIELD_N_STRATEGIES; s++) {
        const sy_yield_strategy *z = &r->s[s];
        printf("  %-16s %14.1f %10.1f %8.3f %10zu\n", sy_yield_strategy_name(s), z->energy_array / 1e6,
               z->mean_power / 1e3, z->q_factor, z->n_stroke_exceeded);
    }
    if (r->max_outside > 0.01)
        printf("\n  note: up to %.1f %% of a sea state's spectral energy lies outside [solve] omega\n",
               100 * r->max_outside);
    if (r->max_dir_outside > 0.01)
        printf("  note: up to %.1f %% of a sea state's spreading lies outside [solve] headings\n",
               100 * r->max_dir_outside);
    printf("\n  resonances: %s\n", note);
    for (size_t j = 0; j < nb; j++)
        printf("  flagged band %.3f..%.3f rad/s (pole %.4f%+.4fi, Q %.1f): %.1f %% of the annual energy\n",
               bands[j].omega_min, bands[j].omega_max, creal(bands[j].pole), cimag(bands[j].pole), bands[j].q,
               100 * r->s[m->tuning].energy_band[j] / r->s[m->tuning].energy_array);
    printf("\n  outputs in %s (summary.json, power_matrix.nc/.csv, devices.csv, hydro.nc)\n\ncautions:\n", dir);
    const char *t = sy_outputs_cautions();
    while (*t) {
        const char *nl = strchr(t, '\n');
        size_t len = nl ? (size_t)(nl - t) : strlen(t);
        printf("  - %.*s\n", (int)len, t);
        t += len + (nl != NULL);
    }
}

int sy_cmd_run(int argc, char **argv)
{
    static const struct option opts[] = {{"output", required_argument, NULL, 'o'}, {"jobs", required_argument, NULL, 'j'},
                                         {"quiet", no_argument, NULL, 'q'},        {"help", no_argument, NULL, 'h'},
                                         {"resonances", no_argument, NULL, 'r'},
                                         {NULL, 0, NULL, 0}};
    const char *dir = "swellyield-out";
    int jobs = 0, c, want_res = 0;
    optind = 1;
    while ((c = getopt_long(argc, argv, "o:j:qhr", opts, NULL)) != -1) {
        switch (c) {
        case 'o': dir = optarg; break;
        case 'j':
            if ((jobs = sy_cli_parse_jobs(optarg)) == 0)
                return sy_cli_usage_error("run", "--jobs expects a whole number 1..1024, got '%s'", optarg);
            break;
        case 'q': sy_cli_set_quiet(1); break;
        case 'r': want_res = 1; break;
        case 'h': fputs(help, stdout); return SY_EXIT_OK;
        default: return sy_cli_usage_error("run", "unknown option");
        }
    }
    if (argc - optind > 1)
        return sy_cli_usage_error("run", "expected at most one project file");
    const char *project = optind < argc ? argv[optind] : SY_DEMO_PROJECT;
    sy_error err = SY_ERROR_INIT;
    sy_model *m = NULL;
    sy_climate_table *cl = NULL;
    sy_hydro_set *hs = NULL;
    sy_yield_result *yr = NULL;
    sy_outputs_stage st;
    memset(&st, 0, sizeof st);
    int rc = sy_model_load(&m, project, &err);
    if (rc == SY_OK)
        rc = sy_model_require(m, SY_NEED_CLIMATE | SY_NEED_PTO, &err);
    if (rc == SY_OK && m->shape != SY_SHAPE_FLOAT)
        rc = sy_error_set(&err, SY_EINPUT, "%s: [device] shape = column has no PTO: run needs floats (use hydro for columns)",
                          m->path);
    if (rc == SY_OK && !(m->modes & SY_MODE_BIT(m->pto_mode)))
        rc = sy_error_set(&err, SY_EINPUT, "%s: [device] modes must include %s, the [pto] mode", m->path,
                          sy_model_mode_name(m->pto_mode));
    if (rc == SY_OK)
        rc = sy_climate_table_load(&cl, m->climate, &err);
    /* Inputs are valid from here on; the cache may be created. */
    char cache[SY_OUTPUTS_PATH_MAX + 16];
    if (rc == SY_OK) {
        snprintf(cache, sizeof cache, "%s/cache", dir);
        rc = sy_outputs_begin(&st, dir, &err); /* checks dir is usable before any work */
    }
    /* The cache must outlive a killed run, so it lives in DIR itself (created empty if
     * new); the outputs proper appear only at the atomic swap. */
    int made_dir = 0;
    if (rc == SY_OK) {
        made_dir = mkdir(st.dir, 0777) == 0;
        if (!made_dir && errno != EEXIST)
            rc = sy_error_set(&err, SY_EIO, "%s: cannot create the output folder: %s", st.dir, strerror(errno));
    }
    sy_progress prog = {0};
    if (rc == SY_OK)
        rc = sy_hydro_build(&hs, m, 1, cache, jobs, sy_cli_hydro_progress, &prog, &err);
    sy_progress_end(&prog);
    /* Resonances (optional, not fatal): flagged bands of the motion poles with high Q. */
    sy_pole_set *ps = NULL;
    sy_flagged_band bands[SY_YIELD_MAX_BANDS];
    double edges[2 * SY_YIELD_MAX_BANDS];
    size_t nb = 0;
    char note[SY_ERROR_MSG_MAX + 64] = "not run (swellyield run --resonances; needs a [resonance] region)";
    if (rc == SY_OK && want_res) {
        sy_error perr = SY_ERROR_INIT;
        sy_progress pprog = {0};
        int prc = sy_poles_find_progress(&ps, m, SY_POLES_MOTION | SY_POLES_SCATTERING, sy_cli_poles_progress, &pprog,
                                         &perr);
        sy_progress_end(&pprog);
        if (prc != SY_OK) {
            snprintf(note, sizeof note, "failed: %s", perr.msg);
        } else {
            double lo = m->omega[0], hi = m->omega[m->n_omega - 1];
            for (size_t i = 0; i < ps->n && nb < SY_YIELD_MAX_BANDS; i++) {
                const sy_pole *p = &ps->poles[i];
                double a = fmax(lo, p->omega_r - 2 * p->gamma), b = fmin(hi, p->omega_r + 2 * p->gamma);
                /* a multiple pole is listed once per mode shape; its band is one band */
                if (p->kind == SY_POLE_SCATTERING || !(p->q > m->q_threshold) || !(a < b) || sy_pole_repeats(ps, i))
                    continue;
                bands[nb] = (sy_flagged_band){a, b, p->omega, p->q, (int)p->kind};
                edges[2 * nb] = a, edges[2 * nb + 1] = b;
                nb++;
            }
            snprintf(note, sizeof note,
                     "%zu motion resonances found (argument-principle count %d), %zu bands with Q > %g flagged; "
                     "%zu scattering resonances of the fixed array found (count %d)",
                     ps->found[SY_POLE_MOTION], ps->count[SY_POLE_MOTION], nb, m->q_threshold,
                     ps->found[SY_POLE_SCATTERING], ps->count[SY_POLE_SCATTERING]);
        }
    }
    sy_progress yprog = {0};
    if (rc == SY_OK)
        rc = sy_yield_compute_progress(&yr, m, cl, hs->array, hs->iso_of_device, edges, nb, sy_cli_yield_progress,
                                       &yprog, &err);
    sy_progress_end(&yprog);
    char path[SY_OUTPUTS_PATH_MAX + 64];
    if (rc == SY_OK && (rc = sy_outputs_path(&st, "hydro.nc", path, sizeof path, &err)) == SY_OK)
        rc = sy_hydro_db_write(hs->array, path, &err);
    if (rc == SY_OK)
        rc = sy_outputs_write_yield(&st, m, cl, yr, bands, nb, note, &err);
    if (rc == SY_OK && ps != NULL && (rc = sy_outputs_path(&st, "poles.csv", path, sizeof path, &err)) == SY_OK)
        rc = sy_outputs_write_poles(path, m, ps, &err);
    if (rc == SY_OK) /* pictures and report.md; the flagged bands shaded on the q-factor picture */
        rc = sy_plot_run(st.stage, m, cl, hs->array, yr, ps, edges, nb, "png", &err);
    if (rc == SY_OK && ps != NULL && ps->found[SY_POLE_MOTION] > 0) { /* what the poles say in time */
        sy_error terr = SY_ERROR_INIT; /* optional like the search itself: a failure is reported, not fatal */
        if (sy_cli_time_response(m, ps, SY_RESPONSE_DECAY, st.stage, "time_response", &terr) != SY_OK)
            fprintf(stderr, "swellyield: run: time response left out: %s\n", terr.msg);
    }
    if (rc == SY_OK)
        rc = sy_outputs_commit(&st, &err);
    if (rc != SY_OK) {
        sy_outputs_abort(&st);
        /* A run refused before solving anything leaves no trace: an empty cache, and the
         * folder if this run made it, go (rmdir keeps them when they hold anything). */
        if (st.dir[0] != '\0' && rmdir(cache) == 0 && made_dir)
            (void)rmdir(st.dir);
    }
    int code = rc == SY_OK ? SY_EXIT_OK : sy_cli_fail("run", rc, &err);
    if (rc == SY_OK)
        print_summary(m, yr, st.dir, note, bands, nb);
    sy_pole_set_free(ps);
    sy_yield_result_free(yr);
    sy_hydro_set_free(hs);
    sy_climate_table_free(cl);
    sy_model_free(m);
    return code;
}
