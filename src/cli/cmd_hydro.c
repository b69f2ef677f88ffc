/* swellyield hydro PROJECT -o FILE.nc: the array's hydrodynamic database (added mass,
 * radiation damping, excitation per frequency and heading), cached per frequency block. */
#include "cli.h"

#include <getopt.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static const char *help =
    "usage: swellyield hydro PROJECT.ini -o FILE.nc [--cache DIR] [--jobs N] [--quiet]\n"
    "Solves the coupled radiation/diffraction problem of the project's layout at the\n"
    "[solve] frequencies and headings and writes the database (NetCDF-4, CF-1.10; layout in\n"
    "include/swellyield/hydrodb.h). Needs [site], [device], [layout], [solve] only.\n"
    "  -o, --output FILE  database file (written atomically)\n"
    "  --cache DIR        block cache (default FILE.cache); a re-run reuses solved blocks\n"
    "  --no-cache         solve everything, keep nothing\n"
    "  -j, --jobs N       threads for the frequency sweep (default: all cores)\n"
    "  -q, --quiet        no progress bar\n";

int sy_cmd_hydro(int argc, char **argv)
{
    static const struct option opts[] = {{"output", required_argument, NULL, 'o'}, {"cache", required_argument, NULL, 'c'},
                                         {"no-cache", no_argument, NULL, 'n'},     {"jobs", required_argument, NULL, 'j'},
                                         {"quiet", no_argument, NULL, 'q'},        {"help", no_argument, NULL, 'h'},
                                         {NULL, 0, NULL, 0}};
    const char *out = NULL, *cache = NULL;
    int jobs = 0, no_cache = 0, c;
    optind = 1;
    while ((c = getopt_long(argc, argv, "o:j:qh", opts, NULL)) != -1) {
        switch (c) {
        case 'o': out = optarg; break;
        case 'c': cache = optarg; break;
        case 'n': no_cache = 1; break;
        case 'j':
            if ((jobs = sy_cli_parse_jobs(optarg)) == 0)
                return sy_cli_usage_error("hydro", "--jobs expects a whole number 1..1024, got '%s'", optarg);
            break;
        case 'q': sy_cli_set_quiet(1); break;
        case 'h': fputs(help, stdout); return SY_EXIT_OK;
        default: return sy_cli_usage_error("hydro", "unknown option");
        }
    }
    if (argc - optind != 1)
        return sy_cli_usage_error("hydro", "expected exactly one project file");
    if (out == NULL)
        return sy_cli_usage_error("hydro", "missing -o FILE.nc");
    char cache_buf[4200];
    if (cache == NULL && !no_cache) {
        snprintf(cache_buf, sizeof cache_buf, "%s.cache", out);
        cache = cache_buf;
    }
    sy_error err = SY_ERROR_INIT;
    sy_model *m = NULL;
    sy_hydro_set *hs = NULL;
    int rc = sy_model_load(&m, argv[optind], &err);
    sy_progress prog = {0};
    if (rc == SY_OK)
        rc = sy_hydro_build(&hs, m, 0, no_cache ? NULL : cache, jobs, sy_cli_hydro_progress, &prog, &err);
    sy_progress_end(&prog);
    if (rc == SY_OK)
        rc = sy_hydro_db_write(hs->array, out, &err);
    int code = rc == SY_OK ? SY_EXIT_OK : sy_cli_fail("hydro", rc, &err);
    if (rc == SY_OK && !sy_cli_quiet())
        fprintf(stderr, "swellyield: hydro: %zu frequencies x %zu headings, %zu dofs -> %s (%s; %zu blocks solved, %zu from cache)\n",
                hs->array->n_omega, hs->array->n_headings, hs->array->n_dof, out, hs->array->truncation,
                hs->blocks_computed, hs->blocks_cached);
    sy_hydro_set_free(hs);
    sy_model_free(m);
    return code;
}
