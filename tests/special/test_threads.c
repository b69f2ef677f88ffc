/* Thread safety of the Bessel interface (special.h promises no shared mutable state):
 * two threads evaluate the same arrays on every path (GSL, fast double-complex, Arb
 * with recurrences, Arb for real orders) many times and must reproduce the serial
 * results bit for bit. Needs no outside reference: the serial run is the reference. */
#include "check.h"
#include "swellyield/special.h"

#include <flint/flint.h>
#include <pthread.h>
#include <stdlib.h>
#include <string.h>

#define NMAX 20
#define NZ 6
#define REPEAT 40

static const double complex ZS[NZ] = {1.37,                /* GSL */
                                      5.3 - 0.02 * I,      /* fast */
                                      0.4 + 3.1 * I,       /* fast */
                                      -7.2 - 2.5 * I,      /* Arb (H, K at Re z < 0) */
                                      3000.0 + 1.0 * I,    /* Arb (|z| above the fast range) */
                                      12.7 - 1.9 * I};

typedef struct {
    double complex v[NZ][4][NMAX + 1];
    double complex nu[NZ];
    int rc;
} results;

static void evaluate(results *r)
{
    r->rc = SY_OK;
    for (int k = 0; k < NZ && r->rc == SY_OK; k++) {
        double complex z = ZS[k];
        r->rc |= sy_special_besselj_array(NMAX, z, r->v[k][0], NULL);
        r->rc |= sy_special_hankel1_array(NMAX, z, r->v[k][1], NULL);
        r->rc |= sy_special_besseli_scaled_array(NMAX, z, r->v[k][2], NULL);
        r->rc |= sy_special_besselk_scaled_array(NMAX, z, r->v[k][3], NULL);
        r->rc |= sy_special_besselj_nu(13.0 / 6.0, creal(z) < 0.0 ? -z : z, &r->nu[k], NULL);
    }
}

static results serial;

static void *worker(void *arg)
{
    int *same = arg;
    results *mine = malloc(sizeof *mine);
    *same = mine != NULL;
    for (int i = 0; i < REPEAT && *same; i++) {
        evaluate(mine);
        *same = mine->rc == SY_OK && memcmp(mine->v, serial.v, sizeof serial.v) == 0 &&
                memcmp(mine->nu, serial.nu, sizeof serial.nu) == 0;
    }
    free(mine);
    flint_cleanup(); /* release this thread's Arb caches (special.h) */
    return NULL;
}

int main(void)
{
    sy_init();
    evaluate(&serial);
    sy_check_ok(serial.rc, NULL, "serial evaluation on every path");
    pthread_t t[2];
    int same[2] = {0, 0};
    for (int i = 0; i < 2; i++)
        sy_check_true(pthread_create(&t[i], NULL, worker, &same[i]) == 0, "start thread %d", i);
    for (int i = 0; i < 2; i++) {
        pthread_join(t[i], NULL);
        sy_check_true(same[i], "thread %d reproduced the serial values bit for bit, %d times",
                      i, REPEAT);
    }
    flint_cleanup();
    return sy_check_summary();
}
