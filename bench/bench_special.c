/* Time per call of the Bessel interface (include/swellyield/special.h): scalars, arrays
 * of orders 0..20, and real orders, at real arguments (GSL path) and complex arguments
 * (double-complex fast path, Arb outside its range) of small, moderate and large
 * modulus. Complex arguments sit just below the real axis, as k r does for a decaying
 * complex frequency (conventions.md; 310 - 0.4i takes the large-argument Hankel path),
 * plus two further away. Prints microseconds per call; record figures in docs/benchmarks.md. */
#include <complex.h>
#include "swellyield/special.h"

#include <stdio.h>
#include <time.h>

#define NMAX 20
#define MIN_SECONDS 0.05 /* long enough to average out timer resolution */

static double now(void)
{
    struct timespec t;
    clock_gettime(CLOCK_MONOTONIC, &t);
    return (double)t.tv_sec + 1e-9 * (double)t.tv_nsec;
}

typedef enum { J, Y, H, JA, HA, IA, KA, JNU, INU } what;
static const char *names[] = {"J_3 scalar", "Y_3 scalar", "H1_3 scalar", "J array 0..20",
                              "H1 array 0..20", "I scaled array 0..20", "K scaled array 0..20",
                              "J_nu (nu = 13/6)", "I_nu scaled (nu = 13/6)"};

static volatile double sink;

static int once(what w, double complex z)
{
    double complex out[NMAX + 1], v = 0.0;
    int rc = SY_OK;
    switch (w) {
    case J: v = sy_special_besselj(3, z); break;
    case Y: v = sy_special_bessely(3, z); break;
    case H: v = sy_special_hankel1(3, z); break;
    case JA: rc = sy_special_besselj_array(NMAX, z, out, NULL); v = out[NMAX]; break;
    case HA: rc = sy_special_hankel1_array(NMAX, z, out, NULL); v = out[NMAX]; break;
    case IA: rc = sy_special_besseli_scaled_array(NMAX, z, out, NULL); v = out[NMAX]; break;
    case KA: rc = sy_special_besselk_scaled_array(NMAX, z, out, NULL); v = out[NMAX]; break;
    case JNU: rc = sy_special_besselj_nu(13.0 / 6.0, z, &v, NULL); break;
    case INU: rc = sy_special_besseli_nu_scaled(13.0 / 6.0, z, &v, NULL); break;
    }
    sink += creal(v);
    return rc;
}

static double per_call_us(what w, double complex z)
{
    long n = 0;
    double t0 = now(), t;
    do {
        for (int i = 0; i < 16; i++)
            if (once(w, z) != SY_OK)
                return -1.0;
        n += 16;
        t = now() - t0;
    } while (t < MIN_SECONDS);
    return 1e6 * t / (double)n;
}

int main(void)
{
    sy_init();
    const double complex zs[] = {0.37, 5.3, 47.5, 0.37 - 0.01 * I, 5.3 - 0.02 * I,
                                 47.5 - 0.3 * I, 310.0 - 0.4 * I, 12.7 - 1.9 * I, 0.4 + 3.1 * I};
    size_t nz = sizeof zs / sizeof zs[0];
    printf("bench_special: microseconds per call (z real -> GSL; complex -> double-complex fast path, Arb where it declines)\n");
    printf("%-26s", "function \\ z");
    for (size_t k = 0; k < nz; k++) {
        char buf[32];
        snprintf(buf, sizeof buf, "%g%+gi", creal(zs[k]), cimag(zs[k]));
        printf(" %12s", buf);
    }
    printf("\n");
    for (int w = J; w <= INU; w++) {
        printf("%-26s", names[w]);
        for (size_t k = 0; k < nz; k++)
            printf(" %12.2f", per_call_us((what)w, zs[k]));
        printf("\n");
    }
    return 0;
}
