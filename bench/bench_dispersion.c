/* Timing of the dispersion roots: real and complex omega, 1 + 40 roots per frequency
 * (a typical body/array solve). Prints microseconds per root. */
#define _POSIX_C_SOURCE 200809L
#include <swellyield/swellyield.h>

#include <stdio.h>
#include "bench_clock.h"

int main(void)
{
    sy_init();
    enum { N_OMEGA = 2000, N_EV = 40 };
    double complex k[N_EV];
    sy_wave_roots r = {.k = k};
    double sum = 0;
    for (int pass = 0; pass < 2; pass++) {
        double t0 = bench_now();
        for (int i = 0; i < N_OMEGA; i++) {
            double complex w = 0.2 + 2.8 * i / N_OMEGA - (pass ? 0.15 * I : 0.0);
            if (sy_waves_roots_fill(&r, w, 25.0, 9.81, N_EV, NULL) != SY_OK)
                return 1;
            sum += creal(r.k0) + creal(k[N_EV - 1]);
        }
        double dt = bench_now() - t0;
        printf(
            "bench_dispersion: %s omega, h = 25 m: %.3f us per root (%d frequencies x %d roots)\n",
            pass ? "complex" : "real", 1e6 * dt / (N_OMEGA * (N_EV + 1)), N_OMEGA, N_EV + 1);
    }
    return sum > 0 ? 0 : 1;
}
