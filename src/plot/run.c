/* sy_plot_run: checks the inputs agree (so PLplot is never handed something it would
 * exit on), then draws every picture and report.md into the run's folder. */
#include "plot_impl.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

static int check(const char *dir, const sy_model *m, const sy_climate_table *cl, const sy_hydro_db *db,
                 const sy_yield_result *r, const double *bands, size_t n_bands, sy_error *err)
{
    if (dir == NULL || m == NULL || cl == NULL || db == NULL || r == NULL || (n_bands > 0 && bands == NULL))
        return sy_error_set(err, SY_EINVAL, "plot: NULL argument");
    if (r->n_devices != m->n_devices || db->n_bodies != m->n_devices)
        return sy_error_set(err, SY_EINPUT, "plot: result has %zu devices, database %zu bodies, model %zu",
                            r->n_devices, db->n_bodies, m->n_devices);
    if (r->n_omega != db->n_omega || r->n_headings != db->n_headings || r->n_omega < 2 || r->n_headings < 1)
        return sy_error_set(err, SY_EINPUT, "plot: result grid %zu x %zu, database %zu x %zu (need >= 2 frequencies)",
                            r->n_omega, r->n_headings, db->n_omega, db->n_headings);
    if (r->n_bins != sy_climate_table_size(cl))
        return sy_error_set(err, SY_EINPUT, "plot: result has %zu bins, climate %zu", r->n_bins,
                            sy_climate_table_size(cl));
    for (size_t k = 0; k < n_bands; k++)
        if (!(isfinite(bands[2 * k]) && isfinite(bands[2 * k + 1]) && bands[2 * k] < bands[2 * k + 1]))
            return sy_error_set(err, SY_EINVAL, "plot: band %zu = [%g, %g] rad/s: expected omega_min < omega_max",
                                k, bands[2 * k], bands[2 * k + 1]);
    for (size_t k = 0; k < m->n_devices; k++)
        if (!(isfinite(m->devices[k].x) && isfinite(m->devices[k].y) && m->devices[k].radius > 0))
            return sy_error_set(err, SY_EINPUT, "plot: device %s has no finite position or radius",
                                m->devices[k].name);
    return SY_OK;
}

int sy_plot_run(const char *dir, const sy_model *model, const sy_climate_table *climate,
                const sy_hydro_db *array_db, const sy_yield_result *result, const sy_pole_set *poles,
                const double *bands, size_t n_bands, const char *format, sy_error *err)
{
    const char *ext = (format == NULL || format[0] == '\0') ? "png" : format;
    if (strcmp(ext, "png") != 0 && strcmp(ext, "svg") != 0 && strcmp(ext, "pdf") != 0)
        return sy_error_set(err, SY_EINVAL, "plot: format '%s': expected png, svg or pdf", ext);
    int rc = check(dir, model, climate, array_db, result, bands, n_bands, err);
    if (rc == SY_OK)
        rc = syi_plot_layout(dir, ext, model, climate, result, err);
    if (rc == SY_OK)
        rc = syi_plot_matrix(dir, ext, model, climate, result, err);
    if (rc == SY_OK)
        rc = syi_plot_qfactor(dir, ext, model, climate, result, bands, n_bands, err);
    if (rc == SY_OK)
        rc = syi_plot_spectrum(dir, ext, model, climate, array_db, result, err);
    if (rc == SY_OK && poles != NULL)
        rc = syi_plot_poles(dir, ext, model, poles, err);
    if (rc == SY_OK)
        rc = syi_plot_report(dir, ext, model, climate, result, poles != NULL, bands, n_bands, err);
    return rc;
}
