/* Shared by the libFuzzer harnesses (SY_FUZZ=ON): the readers take file paths, so each
 * input is written to a file in one private temporary folder made at start-up. A
 * harness traps (so libFuzzer reports the input) when a reader breaks its contract:
 * a failure must carry a non-empty one-line message and produce no object. It also traps
 * on SY_ENOMEM: the fuzz runs make allocations above 1 GB fail (ASAN_OPTIONS in
 * fuzz/CMakeLists.txt), and a reader whose resource bounds hold never asks for that. */
#ifndef SY_FUZZ_INPUT_H
#define SY_FUZZ_INPUT_H

#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include "swellyield/swellyield.h"

static char fuzz_dir[256];

/* At exit (libFuzzer exits normally at -max_total_time): the files and the folder go. */
static void fuzz_cleanup(void)
{
    static const char *const names[] = {"p.ini", "layout.csv", "table.csv", "table.nc"};
    char path[512];
    for (size_t i = 0; i < sizeof names / sizeof names[0]; i++) {
        snprintf(path, sizeof path, "%s/%s", fuzz_dir, names[i]);
        remove(path);
    }
    remove(fuzz_dir);
}

static void fuzz_setup(void)
{
    sy_init();
    snprintf(fuzz_dir, sizeof fuzz_dir, "/tmp/sy-fuzz-XXXXXX");
    if (mkdtemp(fuzz_dir) == NULL)
        abort();
    atexit(fuzz_cleanup);
}

/* Write n bytes to <fuzz_dir>/<name>; the full path goes into path (capacity 512). */
static void fuzz_write(const char *name, const uint8_t *data, size_t n, char *path)
{
    snprintf(path, 512, "%s/%s", fuzz_dir, name);
    FILE *f = fopen(path, "wb");
    if (f == NULL || fwrite(data, 1, n, f) != n || fclose(f) != 0)
        abort();
}

static void fuzz_check_failure(int rc, const void *obj, const sy_error *err)
{
    if (rc == SY_ENOMEM)
        __builtin_trap();
    if (rc != SY_OK && (obj != NULL || err->msg[0] == '\0' || strchr(err->msg, '\n') != NULL))
        __builtin_trap();
    if (rc == SY_OK && obj == NULL)
        __builtin_trap();
}

#endif
