/* The climate's sea states on the run's frequency and heading grids (yield_impl.h):
 * exact spectral energy per frequency cell, cos-2s spreading weights per heading, and
 * the wave power resource J of each bin at the site depth. Bins are grouped by
 * (period, direction): one unit-Hs spectrum per group. */
#include "yield_impl.h"
#include "swellyield/sea.h"

#include <math.h>
#include <stdlib.h>

/* The model's spectrum for Hs with the bin's period (exact normalisation: Hm0 = Hs). */
static int spectrum(const sy_model *m, sy_climate_period_kind kind, double hs, double per, sy_sea_spectrum *sp,
                    sy_error *err)
{
    sy_sea_spectrum_spec spec = {0};
    spec.kind = m->spectrum == SY_SPECTRUM_JONSWAP ? SY_SEA_JONSWAP : SY_SEA_PM;
    spec.hs = hs;
    spec.gamma = m->spectrum == SY_SPECTRUM_JONSWAP ? m->gamma : 0.0;
    spec.norm = SY_SEA_NORM_EXACT;
    if (kind == SY_CLIMATE_TE)
        spec.te = per;
    else
        spec.tp = per;
    return sy_sea_spectrum_init(sp, &spec, err);
}

void syi_yield_seas_free(syi_yield_seas *s)
{
    if (s == NULL)
        return;
    free(s->bin);
    free(s->group);
    free(s->hs2);
    free(s->hours);
    free(s->resource);
    free(s->amp2);
    free(s->dir);
    free(s->omega_e);
    free(s->resource_unit);
    free(s);
}

int syi_yield_seas_create(syi_yield_seas **out, const sy_model *m, const sy_climate_table *climate,
                          const double *omega, size_t no, const double *headings, size_t nh, sy_error *err)
{
    const sy_climate_bins *bins = sy_climate_table_bins(climate);
    size_t nt = sy_climate_table_size(climate), nd = bins->n_dir > 0 ? bins->n_dir : 1;
    size_t ng_max = bins->n_period * nd;
    const double *occ = sy_climate_table_occurrence(climate);
    if (m->period_given && (int)bins->period != (int)m->period)
        return sy_error_set(err, SY_EINPUT, "%s: [sea] period = %s but the climate %s has %s bins", m->path,
                            m->period == SY_PERIOD_TE ? "te" : "tp", m->climate,
                            sy_climate_period_name(bins->period));
    size_t n = 0;
    for (size_t i = 0; i < nt; i++)
        n += occ[i] > 0;
    syi_yield_seas *s = calloc(1, sizeof *s);
    size_t *gid = malloc(ng_max * sizeof *gid); /* (period, direction) -> group, or SIZE_MAX */
    if (s != NULL) {
        s->bin = malloc(n * sizeof *s->bin);
        s->group = malloc(n * sizeof *s->group);
        s->hs2 = malloc(n * sizeof *s->hs2);
        s->hours = malloc(n * sizeof *s->hours);
        s->resource = malloc(n * sizeof *s->resource);
        s->amp2 = malloc(ng_max * no * sizeof *s->amp2);
        s->dir = malloc(ng_max * nh * sizeof *s->dir);
        s->omega_e = malloc(ng_max * sizeof *s->omega_e);
        s->resource_unit = malloc(ng_max * sizeof *s->resource_unit);
    }
    if (s == NULL || gid == NULL || !s->bin || !s->group || !s->hs2 || !s->hours || !s->resource || !s->amp2 ||
        !s->dir || !s->omega_e || !s->resource_unit) {
        syi_yield_seas_free(s);
        free(gid);
        return sy_error_set(err, SY_ENOMEM, "sea states for %zu bins", n);
    }
    for (size_t g = 0; g < ng_max; g++)
        gid[g] = (size_t)-1;
    s->n = n, s->n_omega = no, s->n_headings = nh;
    double bearing = m->x_axis_bearing * 180.0 / M_PI;
    int rc = SY_OK;
    size_t k = 0;
    for (size_t ih = 0; ih < bins->n_hs && rc == SY_OK; ih++)
        for (size_t ip = 0; ip < bins->n_period && rc == SY_OK; ip++)
            for (size_t id = 0; id < nd && rc == SY_OK; id++) {
                size_t idx = sy_climate_table_index(climate, ih, ip, id);
                if (!(occ[idx] > 0))
                    continue;
                double hs = 0.5 * (bins->hs_edges[ih] + bins->hs_edges[ih + 1]);
                double per = 0.5 * (bins->period_edges[ip] + bins->period_edges[ip + 1]);
                size_t pg = ip * nd + id;
                if (gid[pg] == (size_t)-1) {
                    sy_sea_spectrum sp;
                    /* New group: the unit-Hs spectrum on the cells and the spread on the headings. */
                    size_t g = s->n_groups;
                    double outside, dout, beta = 0.0; /* no direction anywhere: toward +x */
                    double from = bins->n_dir > 0 ? bins->dir_centres[id] : m->direction_from;
                    rc = spectrum(m, bins->period, 1.0, per, &sp, err);
                    if (rc == SY_OK)
                        rc = sy_sea_spectrum_cells(&sp, omega, no, s->amp2 + g * no, &outside, err);
                    if (rc == SY_OK) /* J also scales with Hs^2 */
                        rc = sy_sea_spectrum_power(&sp, m->rho, m->g, m->depth, &s->resource_unit[g], err);
                    if (rc == SY_OK && !isnan(from))
                        rc = sy_climate_heading(from, bearing, &beta, err);
                    sy_sea_spreading spr;
                    if (rc == SY_OK)
                        rc = sy_sea_spreading_init(&spr, m->spreading, beta, err);
                    if (rc == SY_OK)
                        rc = sy_sea_spreading_weights(&spr, headings, nh, s->dir + g * nh, &dout, err);
                    if (rc != SY_OK)
                        break;
                    for (size_t i = 0; i < no; i++)
                        s->amp2[g * no + i] *= 2.0;
                    s->omega_e[g] = 2 * M_PI / sp.te;
                    s->max_outside = fmax(s->max_outside, outside);
                    s->max_dir_outside = fmax(s->max_dir_outside, dout);
                    gid[pg] = s->n_groups++;
                }
                s->resource[k] = hs * hs * s->resource_unit[gid[pg]];
                s->bin[k] = idx;
                s->group[k] = gid[pg];
                s->hs2[k] = hs * hs;
                s->hours[k] = sy_climate_table_hours(climate, idx);
                k++;
            }
    free(gid);
    if (rc != SY_OK) {
        sy_error_prefix(err, "climate %s", m->climate);
        syi_yield_seas_free(s);
        return rc;
    }
    *out = s;
    return SY_OK;
}
