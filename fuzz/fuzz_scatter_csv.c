/* libFuzzer harness: the long-form CSV scatter-table reader (sy_climate_table_read_csv)
 * on arbitrary bytes. */
#include "fuzz_input.h"

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
    (void)argc;
    (void)argv;
    fuzz_setup();
    return 0;
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    char path[512];
    fuzz_write("table.csv", data, size, path);
    sy_climate_table *t = NULL;
    sy_error err = SY_ERROR_INIT;
    int rc = sy_climate_table_read_csv(&t, path, &err);
    fuzz_check_failure(rc, t, &err);
    sy_climate_table_free(t);
    return 0;
}
