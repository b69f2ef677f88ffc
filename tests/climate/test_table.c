/* Scatter tables in memory: bin checks, occurrence validation, summary, and the weighted
 * averages the yield will use. Outside values: the worked example of references.md 5.4
 * (computed there by calc_04_power_aep.py with exact decimal arithmetic). */
#include "check.h"
#include "swellyield/climate.h"

#include <math.h>
#include <string.h>

/* references.md 5.4: Hm0 centres 1, 2, 3 m; Te centres 6, 8, 10 s; occurrence fractions
 * and an invented device power matrix in kW. Edges halfway between centres. */
static const double HS_E[] = {0.5, 1.5, 2.5, 3.5};
static const double TE_E[] = {5.0, 7.0, 9.0, 11.0};
static const double FRAC[9] = {0.10, 0.15, 0.05, 0.10, 0.25, 0.10, 0.05, 0.10, 0.10};
static const double POWER_KW[9] = {20, 30, 25, 80, 120, 100, 150, 250, 220};

static int power_of_bin(const sy_climate_bin *bin, void *ctx, double *q, sy_error *err)
{
    (void)ctx;
    (void)err;
    *q = POWER_KW[bin->i_hs * 3 + bin->i_period];
    return SY_OK;
}

/* references.md 5.4: deep-water J [kW/m] = 0.4906051 Hm0^2 Te at the bin centres. */
static int deep_j(const sy_climate_bin *bin, void *ctx, double *q, sy_error *err)
{
    (void)ctx;
    (void)err;
    *q = 0.4906051 * bin->hs * bin->hs * bin->period;
    return SY_OK;
}

static int failing(const sy_climate_bin *bin, void *ctx, double *q, sy_error *err)
{
    (void)bin;
    (void)ctx;
    (void)q;
    return sy_error_set(err, SY_EINPUT, "no power entry");
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    sy_climate_bins bins = {3, HS_E, 3, TE_E, SY_CLIMATE_TE, 0, NULL, 0.0};
    sy_climate_table *t = NULL;
    sy_check_ok(sy_climate_table_create(&t, &bins, SY_CLIMATE_FRACTION, &err), &err, "create");
    if (t == NULL)
        return sy_check_summary();
    memcpy(sy_climate_table_occurrence_mut(t), FRAC, sizeof FRAC);
    sy_check_ok(sy_climate_table_validate(t, "ref54", &err), &err, "valid fractions");
    sy_check_true(sy_climate_table_size(t) == 9, "size 9");
    sy_check_true(sy_climate_table_index(t, 2, 1, 0) == 7, "index (2, 1) = 7");
    sy_check_true(sy_climate_table_bins(t)->hs_edges != HS_E, "bins copied, not borrowed");

    /* Mean power 110.250 kW and MAEP 966.4515 MWh/yr with 8766 h: references.md 5.4
     * ("exact decimal arithmetic; assert to 1e-12 relative"). */
    sy_climate_average avg;
    sy_check_ok(sy_climate_table_average(t, power_of_bin, NULL, &avg, &err), &err, "average P");
    sy_check_close(avg.mean, 110.250, 1e-12, 0.0, "mean power kW (references.md 5.4)");
    sy_check_close(avg.per_year / 1000.0, 966.4515, 1e-12, 0.0,
                   "MAEP MWh/yr with 8766 h (references.md 5.4)");
    sy_check_close(avg.hours, SY_CLIMATE_HOURS_PER_YEAR, 1e-15, 0.0, "hours covered");
    sy_check_true(avg.hours_per_year == 8766.0, "average reports 8766 h per year");
    sy_check_true(avg.n_bins == 9, "9 bins evaluated");
    /* Mean J 17.4655 kW/m, resource 153.103 MWh/m/yr: references.md 5.4, printed to 6
     * digits, so rtol 5e-6 (half a unit in the last printed digit is 3e-6). */
    sy_check_ok(sy_climate_table_average(t, deep_j, NULL, &avg, &err), &err, "average J");
    sy_check_close(avg.mean, 17.4655, 5e-6, 0.0, "mean J kW/m (references.md 5.4)");
    sy_check_close(avg.per_year / 1000.0, 153.103, 5e-6, 0.0,
                   "resource MWh per m per year (references.md 5.4)");

    /* The same table in hours gives the same answers. */
    sy_climate_table *h = NULL;
    sy_check_ok(sy_climate_table_create(&h, &bins, SY_CLIMATE_HOURS, &err), &err, "hours table");
    for (size_t i = 0; h != NULL && i < 9; i++)
        sy_climate_table_occurrence_mut(h)[i] = FRAC[i] * SY_CLIMATE_HOURS_PER_YEAR;
    if (h != NULL) {
        sy_check_ok(sy_climate_table_average(h, power_of_bin, NULL, &avg, &err), &err, "P (h)");
        sy_check_close(avg.per_year / 1000.0, 966.4515, 1e-12, 0.0, "MAEP from an hours table");
    }
    sy_climate_table_free(h);

    /* Summary, with the top row and first column emptied. */
    double *occ = sy_climate_table_occurrence_mut(t);
    occ[6] = occ[7] = occ[8] = 0.0;
    occ[0] = occ[3] = 0.0;
    sy_climate_summary s;
    sy_check_ok(sy_climate_table_summarise(t, &s, &err), &err, "summary");
    sy_check_close(s.total, 0.15 + 0.05 + 0.25 + 0.10, 1e-15, 0.0, "total fraction");
    sy_check_close(s.total_hours, 0.55 * 8766.0, 1e-15, 0.0, "total hours = N_h x total");
    sy_check_true(s.hs_min == 0.5 && s.hs_max == 2.5, "Hs range %g-%g m", s.hs_min, s.hs_max);
    sy_check_true(s.period_min == 7.0 && s.period_max == 11.0, "Te range %g-%g s", s.period_min,
                  s.period_max);
    sy_check_true(s.n_nonzero == 4 && s.n_bins == 9, "4 of 9 bins non-zero");
    sy_check_true(s.hours_per_year == 8766.0, "reports 8766 h");

    /* A callback failure is passed on with the bin named. */
    sy_check_fails(sy_climate_table_average(t, failing, NULL, &avg, &err), SY_EINPUT, &err,
                   "bin Hs 0.5-1.5 m, Te 7-9 s: no power entry", "callback error with bin");

    /* Metadata copy. */
    sy_climate_meta m = {"Test Bay", "unit test", NULL, "c", 10.0, 42.0, 1};
    sy_check_ok(sy_climate_table_set_meta(t, &m, &err), &err, "set meta");
    sy_climate_table *c = NULL;
    sy_check_ok(sy_climate_table_copy(&c, t, &err), &err, "copy");
    if (c != NULL) {
        const sy_climate_meta *cm = sy_climate_table_meta(c);
        sy_check_true(strcmp(cm->site, "Test Bay") == 0 && strcmp(cm->institution, "") == 0 &&
                          cm->depth == 42.0 && cm->invented == 1 && cm->record_years == 10.0,
                      "copied metadata");
        sy_check_true(memcmp(sy_climate_table_occurrence(c), occ, 9 * sizeof *occ) == 0,
                      "copied occurrence");
    }
    sy_climate_table_free(c);

    /* Occurrence validation, table-driven: value at bin 4, expected message. */
    static const struct { double value; int kind; const char *expect; } bad_occ[] = {
        {-1.0, SY_CLIMATE_FRACTION, "value -1 at [hs 1, period 1, direction 0], expected a finite value >= 0"},
        {NAN, SY_CLIMATE_FRACTION, "value nan at [hs 1, period 1, direction 0]"},
        {INFINITY, SY_CLIMATE_HOURS, "value inf at [hs 1, period 1, direction 0]"},
        {2.0, SY_CLIMATE_FRACTION, "total fraction is 2.1, expected at most 1.01"},
        {9000.0, SY_CLIMATE_HOURS, "total hours per year is 9000.1, expected at most 8871.84"},
    };
    for (size_t i = 0; i < sizeof bad_occ / sizeof bad_occ[0]; i++) {
        sy_climate_table *b = NULL;
        sy_climate_table_create(&b, &bins, bad_occ[i].kind, NULL);
        if (b == NULL)
            continue;
        sy_climate_table_occurrence_mut(b)[4] = bad_occ[i].value;
        sy_climate_table_occurrence_mut(b)[5] = 0.1;
        sy_check_fails(sy_climate_table_validate(b, "x.nc", &err), SY_EINPUT, &err,
                       bad_occ[i].expect, "bad occurrence %zu: %s", i, err.msg);
        sy_climate_table_free(b);
    }
    sy_climate_table *z = NULL;
    sy_climate_table_create(&z, &bins, SY_CLIMATE_HOURS, NULL);
    sy_check_fails(sy_climate_table_validate(z, "x.nc", &err), SY_EINPUT, &err,
                   "total occurrence is 0 over 9 bins, expected > 0", "zero table: %s", err.msg);
    sy_climate_table_free(z);

    /* Bin checks, table-driven. */
    static const double up[] = {0.5, 1.5, 1.5, 3.5}, neg[] = {-0.5, 1.5, 2.5, 3.5};
    static const double tz[] = {0.0, 7.0, 9.0, 11.0}, nanh[] = {0.5, NAN, 2.5, 3.5};
    static const double d12[] = {0, 30, 60, 90, 120, 150, 180, 210, 240, 270, 300, 330};
    static const double dov[] = {0, 20, 60}, dwrap[] = {10, 100, 350}, dneg[] = {-10, 100};
    static const struct { sy_climate_bins b; const char *expect; } bad_bins[] = {
        {{3, up, 3, TE_E, SY_CLIMATE_TE, 0, NULL, 0}, "Hs edges unsorted or overlapping: edge 2 = 1.5 m after 1.5"},
        {{3, neg, 3, TE_E, SY_CLIMATE_TE, 0, NULL, 0}, "Hs edge 0 is -0.5 m, expected >= 0"},
        {{3, HS_E, 3, tz, SY_CLIMATE_TP, 0, NULL, 0}, "period edge 0 is 0 s, expected > 0"},
        {{3, nanh, 3, TE_E, SY_CLIMATE_TE, 0, NULL, 0}, "Hs edge 1 is nan, expected a finite value"},
        {{0, HS_E, 3, TE_E, SY_CLIMATE_TE, 0, NULL, 0}, "Hs bins: got none"},
        {{3, HS_E, 3, TE_E, SY_CLIMATE_TE, 12, d12, 31.0}, "direction bin width 31 degrees for 12 bins"},
        {{3, HS_E, 3, TE_E, SY_CLIMATE_TE, 3, dov, 30.0}, "direction bins unsorted or overlapping: centre 1 = 20 after 0"},
        {{3, HS_E, 3, TE_E, SY_CLIMATE_TE, 3, dwrap, 30.0}, "direction bins overlap through north: centres 350 and 10"},
        {{3, HS_E, 3, TE_E, SY_CLIMATE_TE, 2, dneg, 30.0}, "direction centre 0 is -10 degrees, expected in [0, 360)"},
    };
    for (size_t i = 0; i < sizeof bad_bins / sizeof bad_bins[0]; i++) {
        sy_climate_table *b = NULL;
        sy_check_fails(sy_climate_table_create(&b, &bad_bins[i].b, SY_CLIMATE_HOURS, &err),
                       SY_EINPUT, &err, bad_bins[i].expect, "bad bins %zu: %s", i, err.msg);
        sy_check_true(b == NULL, "no table on failure");
    }
    /* A full 12-sector rose of 30 degrees is valid, including the bin through north. */
    sy_climate_bins rose = {3, HS_E, 3, TE_E, SY_CLIMATE_TE, 12, d12, 30.0};
    sy_climate_table *r = NULL;
    sy_check_ok(sy_climate_table_create(&r, &rose, SY_CLIMATE_HOURS, &err), &err, "12-sector rose");
    sy_check_true(r != NULL && sy_climate_table_size(r) == 108, "3 x 3 x 12 bins");
    sy_climate_table_free(r);
    sy_climate_table_free(t);
    return sy_check_summary();
}
