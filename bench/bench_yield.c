/* Benchmark of the main job's yield stage (issue: <= 1 s on 2 cores for a 3 x 3 array and
 * a 30 x 30 scatter table, from a ready hydrodynamic database): power matrix, annual
 * energy, q-factor and all four tuning strategies. The database is solved first (not
 * timed); the scatter table is INVENTED (every bin occupied, so nothing is skipped). */
#include "bench_clock.h"
#include "float_model.h"
#include "swellyield/swellyield.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

int main(void)
{
    sy_init();
    double omega[120], heads[36];
    for (int i = 0; i < 120; i++)
        omega[i] = 0.25 + 2.25 * i / 119.0;
    for (int i = 0; i < 36; i++)
        heads[i] = 2 * M_PI * i / 36;
    /* The demo's 3 x 3 grid, 40 m apart (INVENTED). */
    double gx[9], gy[9];
    for (int i = 0; i < 9; i++)
        gx[i] = 40.0 * (i % 3), gy[i] = 40.0 * (i / 3);
    sy_model m;
    sy_model_device dev[9];
    sy_test_float_model(&m, dev, 9, gx, gy, omega, 120, heads, 36);
    m.efficiency = 0.8, m.rated_power = 5e5, m.max_stroke = 4, m.spreading = 10, m.direction_from = 250;
    m.x_axis_bearing = 75 * M_PI / 180, m.tolerance = 1e-4;
    strcpy(m.path, "bench"), strcpy(m.climate, "invented 30 x 30 table");
    double he[31], te[31];
    for (int i = 0; i <= 30; i++)
        he[i] = 0.25 * i, te[i] = 3.0 + 0.5 * i;
    sy_climate_bins bins = {30, he, 30, te, SY_CLIMATE_TE, 0, NULL, 0};
    sy_climate_table *t = NULL;
    sy_hydro_set *hs = NULL;
    sy_error err = SY_ERROR_INIT;
    if (sy_climate_table_create(&t, &bins, SY_CLIMATE_FRACTION, &err) != SY_OK) {
        printf("bench_yield: %s\n", err.msg);
        return 1;
    }
    for (size_t i = 0; i < 900; i++)
        sy_climate_table_occurrence_mut(t)[i] = 1.0 / 900.0;
    double t0 = bench_now();
    if (sy_hydro_build(&hs, &m, 1, NULL, 0, NULL, NULL, &err) != SY_OK) {
        printf("bench_yield: %s\n", err.msg);
        return 1;
    }
    printf("bench_yield: hydrodynamic databases (3 x 3 floats + isolated, 120 frequencies x 36 headings, all threads): %.2f s\n",
           bench_now() - t0);
    double best = INFINITY;
    sy_yield_result *r = NULL;
    for (int rep = 0; rep < 3; rep++) {
        sy_yield_result_free(r);
        r = NULL;
        t0 = bench_now();
        if (sy_yield_compute(&r, &m, t, hs->array, hs->iso_of_device, &err) != SY_OK) {
            printf("bench_yield: %s\n", err.msg);
            return 1;
        }
        best = fmin(best, bench_now() - t0);
    }
    printf("bench_yield: yield of 900 bins x 4 strategies (cos-2s s = 10 over 36 headings): best of 3 %.3f s "
           "(target <= 1 s); annual energy %s %.1f MWh/yr, q %.3f\n",
           best, sy_yield_strategy_name(SY_TUNING_PER_SEA_STATE), r->s[SY_TUNING_PER_SEA_STATE].energy_array / 1e6,
           r->s[SY_TUNING_PER_SEA_STATE].q_factor);
    sy_yield_result_free(r);
    sy_hydro_set_free(hs);
    sy_climate_table_free(t);
    return 0;
}
