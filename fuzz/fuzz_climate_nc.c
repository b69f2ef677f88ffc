/* libFuzzer harness: the NetCDF scatter-table reader (sy_climate_table_read) on
 * arbitrary bytes, written to a file as the reader takes a path. The seeds
 * (fuzz/corpus/fuzz_climate_nc, made by fuzz/make_nc_seeds.py) are small tables in the
 * classic, 64-bit-offset and CDF-5 formats, plus broken ones.
 *
 * Classic formats only: inputs not starting with a classic magic number ("CDF" then 1, 2
 * or 5) are skipped, because NetCDF-4 files go to HDF5 1.10.8 (Debian 12), which leaks
 * and misbehaves on malformed files inside its own code (docs/robustness.md, Fuzzing),
 * and the reader's own code above nc_open is the same for every format. Set
 * SY_FUZZ_NC_HDF5=1 to fuzz NetCDF-4/HDF5 inputs too (with ASAN_OPTIONS=detect_leaks=0;
 * the seeds for it: fuzz/make_nc_seeds.py --hdf5). */
#include "fuzz_input.h"

static int with_hdf5;

int LLVMFuzzerInitialize(int *argc, char ***argv)
{
    (void)argc;
    (void)argv;
    fuzz_setup();
    const char *h = getenv("SY_FUZZ_NC_HDF5");
    with_hdf5 = h != NULL && strcmp(h, "1") == 0;
    return 0;
}

static int classic_magic(const uint8_t *data, size_t size)
{
    return size >= 4 && memcmp(data, "CDF", 3) == 0 &&
           (data[3] == 1 || data[3] == 2 || data[3] == 5);
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    if (!with_hdf5 && !classic_magic(data, size))
        return -1; /* not added to the corpus (libFuzzer >= 12) */
    char path[512];
    fuzz_write("table.nc", data, size, path);
    sy_climate_table *t = NULL;
    sy_error err = SY_ERROR_INIT;
    int rc = sy_climate_table_read(&t, path, &err);
    fuzz_check_failure(rc, t, &err);
    sy_climate_table_free(t);
    return 0;
}
