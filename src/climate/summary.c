/* Summary statistics of a scatter table: totals, the Hs and period ranges that carry
 * occurrence, and occurrence-weighted means / annual sums of a caller's per-bin quantity
 * (mean wave power J, device power -> annual energy; references.md 5.1, 5.4).
 * Hours per year: SY_CLIMATE_HOURS_PER_YEAR for fraction tables. */
#include "climate_impl.h"

#include <math.h>

int sy_climate_table_summarise(const sy_climate_table *t, sy_climate_summary *s, sy_error *err)
{
    if (t == NULL || s == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table summary: NULL argument");
    const sy_climate_bins *b = &t->bins;
    size_t nd = b->n_dir > 0 ? b->n_dir : 1;
    *s = (sy_climate_summary){0.0, 0.0, SY_CLIMATE_HOURS_PER_YEAR, NAN, NAN, NAN, NAN,
                              t->n_values, 0};
    size_t ih_lo = (size_t)-1, ih_hi = 0, ip_lo = (size_t)-1, ip_hi = 0;
    for (size_t i = 0; i < t->n_values; i++) {
        double v = t->occ[i];
        s->total += v;
        s->total_hours += sy_climate_table_hours(t, i);
        if (v > 0.0) {
            size_t ip = (i / nd) % b->n_period, ih = i / nd / b->n_period;
            s->n_nonzero++;
            ih_lo = ih < ih_lo ? ih : ih_lo;
            ih_hi = ih > ih_hi ? ih : ih_hi;
            ip_lo = ip < ip_lo ? ip : ip_lo;
            ip_hi = ip > ip_hi ? ip : ip_hi;
        }
    }
    if (s->n_nonzero > 0) {
        s->hs_min = b->hs_edges[ih_lo];
        s->hs_max = b->hs_edges[ih_hi + 1];
        s->period_min = b->period_edges[ip_lo];
        s->period_max = b->period_edges[ip_hi + 1];
    }
    return SY_OK;
}

int sy_climate_table_average(const sy_climate_table *t, sy_climate_bin_fn fn, void *ctx,
                             sy_climate_average *avg, sy_error *err)
{
    if (t == NULL || fn == NULL || avg == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table average: NULL argument");
    const sy_climate_bins *b = &t->bins;
    size_t nd = b->n_dir > 0 ? b->n_dir : 1;
    *avg = (sy_climate_average){NAN, 0.0, 0.0, SY_CLIMATE_HOURS_PER_YEAR, 0};
    double sum_qo = 0.0;
    for (size_t i = 0; i < t->n_values; i++) {
        if (!(t->occ[i] > 0.0))
            continue;
        sy_climate_bin bin;
        bin.index = i;
        bin.i_dir = i % nd;
        bin.i_period = (i / nd) % b->n_period;
        bin.i_hs = i / nd / b->n_period;
        bin.hs_lo = b->hs_edges[bin.i_hs];
        bin.hs_hi = b->hs_edges[bin.i_hs + 1];
        bin.hs = 0.5 * (bin.hs_lo + bin.hs_hi);
        bin.period_lo = b->period_edges[bin.i_period];
        bin.period_hi = b->period_edges[bin.i_period + 1];
        bin.period = 0.5 * (bin.period_lo + bin.period_hi);
        bin.period_kind = b->period;
        bin.dir_from = b->n_dir > 0 ? b->dir_centres[bin.i_dir] : NAN;
        bin.hours = sy_climate_table_hours(t, i);
        double q = NAN;
        int rc = fn(&bin, ctx, &q, err);
        if (rc != SY_OK) {
            sy_error_prefix(err, "bin Hs %g-%g m, %s %g-%g s", bin.hs_lo, bin.hs_hi,
                            sy_climate_period_name(b->period), bin.period_lo, bin.period_hi);
            return rc;
        }
        if (!isfinite(q))
            return sy_error_set(err, SY_EINPUT,
                                "bin Hs %g-%g m, %s %g-%g s: per-bin value %g, expected finite",
                                bin.hs_lo, bin.hs_hi, sy_climate_period_name(b->period),
                                bin.period_lo, bin.period_hi, q);
        /* Weighted in the table's own unit; fractions and hours give the same mean. */
        sum_qo += q * t->occ[i];
        avg->per_year += q * bin.hours;
        avg->hours += bin.hours;
        avg->n_bins++;
    }
    if (avg->n_bins == 0)
        return sy_error_set(err, SY_EINPUT, "scatter table average: no bin has occurrence > 0");
    double total = 0.0;
    for (size_t i = 0; i < t->n_values; i++)
        total += t->occ[i] > 0.0 ? t->occ[i] : 0.0;
    avg->mean = sum_qo / total;
    return SY_OK;
}
