/* Runs tests/sea/ref_spectra.py (Debian /usr/bin/python3 with scipy 1.10 and mpmath 1.2,
 * or $SY_PYTHON) and reads the numbers it prints: independent reference values computed
 * at test time. Returns how many were read (0 if the script failed). */
#ifndef SY_TEST_SEA_PYREF_H
#define SY_TEST_SEA_PYREF_H

#include <stdio.h>
#include <stdlib.h>

static size_t pyref(const char *args, double *vals, size_t max)
{
    const char *py = getenv("SY_PYTHON"), *src = getenv("SY_SOURCE_DIR");
    char cmd[1024];
    snprintf(cmd, sizeof cmd, "%s %s%sref_spectra.py %s", py ? py : "/usr/bin/python3",
             src ? src : "", src ? "/tests/sea/" : "", args);
    FILE *p = popen(cmd, "r");
    if (p == NULL)
        return 0;
    size_t n = 0;
    while (n < max && fscanf(p, "%lf", &vals[n]) == 1)
        n++;
    return pclose(p) == 0 ? n : 0;
}

#endif
