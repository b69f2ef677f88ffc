/* libFuzzer harness: the project-file parser (sy_model_load) on arbitrary bytes, with a
 * fixed valid layout beside it. */
#include "fuzz_input.h"

static const char layout[] = "name,x,y\nA,0,0\nB,30,0\n";

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
    (void)argc;
    (void)argv;
    fuzz_setup();
    char path[512];
    fuzz_write("layout.csv", (const uint8_t *)layout, sizeof layout - 1, path);
    return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    char path[512];
    fuzz_write("p.ini", data, size, path);
    sy_model *m = NULL;
    sy_error err = SY_ERROR_INIT;
    int rc = sy_model_load(&m, path, &err);
    fuzz_check_failure(rc, m, &err);
    sy_model_free(m);
    return 0;
}
