/* Bessel values against mpmath, computed at test time: runs
 * tests/special/mpmath_reference.py with $SY_PYTHON (Debian /usr/bin/python3,
 * python3-mpmath) and compares every line it prints, each reference named
 * "mpmath <version> <function>(n, z)". Covers the GSL path (real z) and the Arb path
 * with recurrences (complex z), arrays of orders 0..30, the scalar forms with negative
 * orders, and real orders nu (1/6, 13/6, 25/6, ...).
 * Tolerance: 1e-12 relative to the line's scale (the interface's stated accuracy is
 * ~1e-14; 1e-12 leaves room for GSL on large real arguments), the scale being |value|
 * or, for J and I in the oscillatory range n < |z|, the partner |Y_n| (|K_n|) where the
 * recurrence keeps an absolute error (see mpmath_reference.py); absolute floor 1e-300
 * (values below the double range are returned as 0 or subnormal). */
#include "check.h"
#include "swellyield/special.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#define RTOL 1e-12
#define ATOL 1e-300
#define NMAX_REF 30

static const char *fn_name(const char *kind)
{
    if (strcmp(kind, "J") == 0) return "besselj";
    if (strcmp(kind, "Y") == 0) return "bessely";
    if (strcmp(kind, "H1") == 0) return "hankel1";
    if (strcmp(kind, "I") == 0) return "besseli(n,z)*exp(-|Re z|) as besseli";
    return "besselk(n,z)*exp(z) as besselk";
}

/* worst error / scale per path, printed for the report */
static double worst[2][5];
static int kind_index(const char *kind)
{
    static const char *k[5] = {"J", "Y", "H1", "I", "K"};
    for (int i = 0; i < 5; i++)
        if (strcmp(kind, k[i]) == 0)
            return i;
    return 0;
}

static int array_of(const char *kind, int nmax, double complex z, double complex *out,
                    sy_error *err)
{
    switch (kind[0]) {
    case 'J': return sy_special_besselj_array(nmax, z, out, err);
    case 'H': return sy_special_hankel1_array(nmax, z, out, err);
    case 'I': return sy_special_besseli_scaled_array(nmax, z, out, err);
    default: return sy_special_besselk_scaled_array(nmax, z, out, err);
    }
}

int main(void)
{
    sy_init();
    const char *py = getenv("SY_PYTHON"), *src = getenv("SY_SOURCE_DIR");
    char cmd[4096];
    snprintf(cmd, sizeof cmd, "%s %s/tests/special/mpmath_reference.py",
             py != NULL ? py : "/usr/bin/python3", src != NULL ? src : "../..");
    FILE *f = popen(cmd, "r");
    if (!sy_check_true(f != NULL, "run %s", cmd))
        return sy_check_summary();
    char line[1024], version[64] = "?", kind[8] = "", last_kind[8] = "";
    double complex arr[NMAX_REF + 1], last_z = NAN;
    int have = 0, count = 0;
    sy_error err = SY_ERROR_INIT;
    while (fgets(line, sizeof line, f) != NULL) {
        char tag;
        double ord, zr, zi, vr, vi, scale;
        int nmax = 0;
        if (sscanf(line, "version %63s", version) == 1)
            continue;
        if (line[0] == 'A') {
            if (sscanf(line, "%c %7s %d %lf %lf %lf %lf %lf %lf", &tag, kind, &nmax, &ord, &zr,
                       &zi, &vr, &vi, &scale) != 9 || nmax != NMAX_REF) {
                sy_check_true(0, "parse reference line: %s", line);
                continue;
            }
        } else if (sscanf(line, "%c %7s %lf %lf %lf %lf %lf %lf", &tag, kind, &ord, &zr, &zi,
                          &vr, &vi, &scale) != 8) {
            sy_check_true(0, "parse reference line: %s", line);
            continue;
        }
        double complex z = CMPLX(zr, zi), want = CMPLX(vr, vi), got = NAN;
        int rc = SY_OK;
        if (line[0] == 'A') {
            if (!have || strcmp(kind, last_kind) != 0 || z != last_z) {
                rc = array_of(kind, NMAX_REF, z, arr, &err);
                have = rc == SY_OK;
                strcpy(last_kind, kind);
                last_z = z;
                if (!sy_check_ok(rc, &err, "%s array 0..%d at %g%+gi", kind, NMAX_REF, zr, zi))
                    continue;
            }
            got = arr[(int)ord];
        } else if (line[0] == 'S') {
            int n = (int)ord;
            got = kind[0] == 'J' ? sy_special_besselj(n, z)
                : kind[0] == 'Y' ? sy_special_bessely(n, z)
                                 : sy_special_hankel1(n, z);
        } else {
            rc = kind[0] == 'J' ? sy_special_besselj_nu(ord, z, &got, &err)
                                : sy_special_besseli_nu_scaled(ord, z, &got, &err);
            if (!sy_check_ok(rc, &err, "%s_nu(%g, %g%+gi)", kind, ord, zr, zi))
                continue;
        }
        count++;
        double e = cabs(got - want) / (scale > 0.0 ? scale : 1.0);
        int path = zi != 0.0;
        if (scale > 1e3 * ATOL && e > worst[path][kind_index(kind)]) /* skip subnormals */
            worst[path][kind_index(kind)] = e;
        /* source: mpmath <version> <function>(order, z), see mpmath_reference.py;
         * the bound is absolute: ATOL + RTOL * scale */
        sy_check_cclose(got, want, 0.0, ATOL + RTOL * scale,
                        "mpmath %s %s(%g, %.17g%+.17gi) [%c, scale %.3g, err/scale %.2e]",
                        version, fn_name(kind), ord, zr, zi, tag, scale, e);
    }
    int status = pclose(f);
    sy_check_true(status == 0, "reference script exit status %d", status);
    sy_check_true(count > 1000, "compared %d reference values from mpmath %s", count, version);
    const char *kn[5] = {"J", "Y", "H1", "I scaled", "K scaled"};
    for (int p = 0; p < 2; p++)
        for (int i = 0; i < 5; i++)
            printf("# worst error/scale, %s path, %s: %.2e\n", p ? "complex (fast/Arb)" : "real (GSL)",
                   kn[i], worst[p][i]);
    return sy_check_summary();
}
