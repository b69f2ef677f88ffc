/* libFuzzer harness: the layout CSV reader (through sy_model_load) on arbitrary bytes,
 * with a fixed valid project file naming it. */
#include "fuzz_input.h"

static const char project[] = "[site]\ndepth = 30\n[device]\nshape = float\nradius = 3\ndraft = 2\n"
                              "[layout]\nfile = layout.csv\n[solve]\nmax_bodies = 200\n";
static char project_path[512];

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
    (void)argc;
    (void)argv;
    fuzz_setup();
    fuzz_write("p.ini", (const uint8_t *)project, sizeof project - 1, project_path);
    return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    char path[512];
    fuzz_write("layout.csv", data, size, path);
    sy_model *m = NULL;
    sy_error err = SY_ERROR_INIT;
    int rc = sy_model_load(&m, project_path, &err);
    fuzz_check_failure(rc, m, &err);
    sy_model_free(m);
    return 0;
}
