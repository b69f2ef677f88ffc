/* Monotonic wall clock in seconds for the benchmarks. */
#ifndef SY_BENCH_CLOCK_H
#define SY_BENCH_CLOCK_H

#include <time.h>

static double bench_now(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return ts.tv_sec + 1e-9 * ts.tv_nsec;
}

#endif
