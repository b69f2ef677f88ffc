/* The swellyield program: verb dispatch, --help, --version, exit codes
 * (0 ok, 1 computation failed, 2 bad input or usage). One file per verb (cmd_<verb>.c). */
#include "cli.h"

#include <stdio.h>
#include <string.h>

static const sy_cli_verb verbs[] = {
    {"run", "the main job: array yield, power matrices, annual energy, q-factor", sy_cmd_run},
    {"hydro", "solve the array's hydrodynamics and write the database (NetCDF)", sy_cmd_hydro},
    {"sea", "wave climates and spectra: summary, CSV import, spectrum", sy_cmd_sea},
    {"check", "validate a project's inputs and say what a run would do", sy_cmd_check},
    {"version", "print the version and dependency versions", sy_cmd_version},
};

static void usage(FILE *f)
{
    fprintf(f, "usage: swellyield <verb> [options]   (swellyield <verb> --help for details)\n\nverbs:\n");
    for (size_t i = 0; i < sizeof verbs / sizeof verbs[0]; i++)
        fprintf(f, "  %-10s %s\n", verbs[i].name, verbs[i].summary);
}

int main(int argc, char **argv)
{
    sy_init();
    if (argc < 2) {
        fprintf(stderr, "swellyield: expected a verb (swellyield --help lists them)\n");
        return SY_EXIT_USAGE;
    }
    if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
        usage(stdout);
        return SY_EXIT_OK;
    }
    if (strcmp(argv[1], "--version") == 0)
        return sy_cmd_version(argc - 1, argv + 1);
    for (size_t i = 0; i < sizeof verbs / sizeof verbs[0]; i++)
        if (strcmp(argv[1], verbs[i].name) == 0)
            return verbs[i].run(argc - 1, argv + 1);
    fprintf(stderr, "swellyield: unknown verb '%s' (swellyield --help lists them)\n", argv[1]);
    return SY_EXIT_USAGE;
}
