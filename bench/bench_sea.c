/* Timing of the sea module: JONSWAP construction (shape moments by quadrature), with the
 * DNV gamma rule solved for a given Te, spectrum evaluation, finite-depth power, and
 * spreading weights for 36 headings. Prints microseconds per call. */
#define _POSIX_C_SOURCE 200809L
#include <swellyield/swellyield.h>

#include <stdio.h>
#include "bench_clock.h"

int main(void)
{
    sy_init();
    sy_sea_spectrum s;
    double sink = 0, t0;
    enum { N_INIT = 200, N_EVAL = 1000000, N_POWER = 200, N_SPREAD = 20000 };
    t0 = bench_now();
    for (int i = 0; i < N_INIT; i++) {
        sy_sea_spectrum_spec sp = {.kind = SY_SEA_JONSWAP, .hs = 2, .te = 8, .gamma = 1 + 0.03 * i};
        if (sy_sea_spectrum_init(&s, &sp, NULL) != SY_OK)
            return 1;
        sink += s.tp;
    }
    printf("bench_sea: JONSWAP init (gamma given, Te): %.1f us\n",
           1e6 * (bench_now() - t0) / N_INIT);
    t0 = bench_now();
    for (int i = 0; i < 20; i++) {
        sy_sea_spectrum_spec sp = {.kind = SY_SEA_JONSWAP, .hs = 2 + 0.1 * i, .te = 7.5};
        if (sy_sea_spectrum_init(&s, &sp, NULL) != SY_OK)
            return 1;
        sink += s.gamma;
    }
    printf("bench_sea: JONSWAP init (DNV gamma rule, Te): %.1f us\n",
           1e6 * (bench_now() - t0) / 20);
    t0 = bench_now();
    for (int i = 0; i < N_EVAL; i++)
        sink += sy_sea_spectrum_eval(&s, 0.2 + 2e-6 * i);
    printf("bench_sea: spectrum eval: %.3f us\n", 1e6 * (bench_now() - t0) / N_EVAL);
    t0 = bench_now();
    for (int i = 0; i < N_POWER; i++) {
        double J;
        if (sy_sea_spectrum_power(&s, 1025, 9.81, 10 + i, &J, NULL) != SY_OK)
            return 1;
        sink += J;
    }
    printf("bench_sea: finite-depth power integral: %.1f us\n", 1e6 * (bench_now() - t0) / N_POWER);
    sy_sea_spreading d;
    double beta[36], D[36];
    for (int j = 0; j < 36; j++)
        beta[j] = j * 0.174532925199432957692;
    t0 = bench_now();
    for (int i = 0; i < N_SPREAD; i++) {
        if (sy_sea_spreading_init(&d, 1 + 0.001 * i, 0.3, NULL) != SY_OK ||
            sy_sea_spreading_weights(&d, beta, 36, D, NULL, NULL) != SY_OK)
            return 1;
        sink += D[3];
    }
    printf("bench_sea: spreading init + weights, 36 headings: %.1f us\n",
           1e6 * (bench_now() - t0) / N_SPREAD);
    return sink > 0 ? 0 : 1;
}
