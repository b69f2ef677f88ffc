/* Binning a hindcast series into a scatter table of mean annual hours. Each record stands
 * for its time step dt_i (to the next record; the last record repeats the step before it),
 * so irregular series and gaps in the time axis are weighted by the time they cover.
 * Record length Y = (sum of all dt_i) / SY_CLIMATE_HOURS_PER_YEAR; a bin's mean annual
 * hours = (sum of dt_i of the valid records in it) / Y, times span / valid hours when
 * gaps are assumed unbiased (SY_CLIMATE_GAPS_SCALE). references.md 5.1: over whole years
 * this is the average-year basis of MAEP = (1/Y) sum_t P_t dt_t. */
#include "climate_impl.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* Bin of x in edges[0..n] with half-open bins [e_i, e_{i+1}), or (size_t)-1. */
static size_t edge_bin(const double *e, size_t n, double x)
{
    if (!(x >= e[0] && x < e[n]))
        return (size_t)-1;
    size_t lo = 0, hi = n;   /* e[lo] <= x < e[hi] */
    while (hi - lo > 1) {
        size_t mid = lo + (hi - lo) / 2;
        if (x >= e[mid])
            lo = mid;
        else
            hi = mid;
    }
    return lo;
}

int sy_climate_series_bin(sy_climate_table **out, const sy_climate_series *s,
                          const sy_climate_bins *bins, sy_climate_gap_policy gaps,
                          sy_climate_bin_report *rep, sy_error *err)
{
    if (out == NULL || s == NULL || bins == NULL)
        return sy_error_set(err, SY_EINVAL, "hindcast binning: NULL argument");
    *out = NULL;
    if (gaps != SY_CLIMATE_GAPS_SCALE && gaps != SY_CLIMATE_GAPS_KEEP)
        return sy_error_set(err, SY_EINVAL, "hindcast binning: gap policy %d, expected scale "
                            "or keep", (int)gaps);
    if (s->n < 2)
        return sy_error_set(err, SY_EINPUT, "%s: %zu record(s), expected at least 2 to know "
                            "the time step", s->file, s->n);
    if (bins->n_dir > 0 && s->dir_from == NULL)
        return sy_error_set(err, SY_EINVAL, "%s: direction bins given but the series was read "
                            "without directions", s->file);
    if (bins->period != s->period_kind)
        return sy_error_set(err, SY_EINVAL, "%s: bins are for %s, the series holds %s", s->file,
                            sy_climate_period_name(bins->period),
                            sy_climate_period_name(s->period_kind));
    sy_climate_table *t = NULL;
    int rc = sy_climate_table_create(&t, bins, SY_CLIMATE_HOURS, err);
    if (rc != SY_OK)
        return rc;
    sy_climate_bin_report r = {s->n, 0, 0, 0.0, 0.0, 0.0, 0.0, INFINITY, 0.0,
                               SY_CLIMATE_HOURS_PER_YEAR};
    for (size_t i = 0; i < s->n; i++) {
        double dt = (i + 1 < s->n ? s->time[i + 1] - s->time[i] : s->time[i] - s->time[i - 1])
                    / 3600.0;
        r.span_hours += dt;
        r.step_hours_min = fmin(r.step_hours_min, dt);
        r.step_hours_max = fmax(r.step_hours_max, dt);
        int dir_missing = bins->n_dir > 0 && isnan(s->dir_from[i]);
        if (isnan(s->hs[i]) || isnan(s->period[i]) || dir_missing) {
            r.n_missing++;
            continue;
        }
        r.valid_hours += dt;
        size_t ih = edge_bin(bins->hs_edges, bins->n_hs, s->hs[i]);
        size_t ip = edge_bin(bins->period_edges, bins->n_period, s->period[i]);
        size_t id = bins->n_dir > 0 ? syi_climate_dir_bin(bins, s->dir_from[i]) : 0;
        if (ih == (size_t)-1 || ip == (size_t)-1 || id == (size_t)-1) {
            r.n_outside++;
            r.outside_hours += dt;
            continue;
        }
        t->occ[sy_climate_table_index(t, ih, ip, id)] += dt;
    }
    r.record_years = r.span_hours / SY_CLIMATE_HOURS_PER_YEAR;
    if (r.valid_hours <= 0.0) {
        sy_climate_table_free(t);
        return sy_error_set(err, SY_EINPUT, "%s: all %zu records are missing, expected some "
                            "valid sea states", s->file, s->n);
    }
    double factor = 1.0 / r.record_years;
    if (gaps == SY_CLIMATE_GAPS_SCALE)
        factor *= r.span_hours / r.valid_hours;
    for (size_t i = 0; i < t->n_values; i++)
        t->occ[i] *= factor;

    const char *base = strrchr(s->file, '/');
    base = base != NULL ? base + 1 : s->file;
    char source[1024];
    snprintf(source, sizeof source,
             "hindcast %s binned by swellyield: Hs from '%s', %s from '%s'%s%s%s; %zu records "
             "over %.4g years (step %g-%g h), %zu missing, %zu outside the bins; gaps %s; "
             "%g hours per year",
             base, s->hs_var, sy_climate_period_name(s->period_kind), s->period_var,
             bins->n_dir > 0 ? ", direction from '" : "", bins->n_dir > 0 ? s->dir_var : "",
             bins->n_dir > 0 ? "'" : "", r.n_records, r.record_years, r.step_hours_min,
             r.step_hours_max, r.n_missing, r.n_outside,
             gaps == SY_CLIMATE_GAPS_SCALE ? "assumed unbiased (occurrence scaled by span/valid "
                                             "time)"
                                           : "left out",
             SY_CLIMATE_HOURS_PER_YEAR);
    sy_climate_meta m = {s->site, source, "", "", r.record_years, s->depth, s->invented};
    rc = sy_climate_table_set_meta(t, &m, err);
    if (rc == SY_OK)
        rc = sy_climate_table_validate(t, s->file, err);
    if (rc != SY_OK) {
        sy_climate_table_free(t);
        return rc;
    }
    if (rep != NULL)
        *rep = r;
    *out = t;
    return SY_OK;
}
