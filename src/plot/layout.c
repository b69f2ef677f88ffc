/* Picture 1: the array to scale. Circles of each device's true radius at its position
 * (m, array frame, equal aspect), filled by its annual energy under the per_sea_state
 * strategy (MWh/yr, colour bar), names beside, and the climate's dominant direction of
 * travel as an arrow (syi_plot_dominant_heading). */
#include "plot_impl.h"

#include <math.h>
#include <plplot.h>
#include <stdio.h>

int syi_plot_dominant_heading(const sy_model *m, const sy_climate_table *cl, double *beta, sy_error *err)
{
    const sy_climate_bins *b = sy_climate_table_bins(cl);
    double bearing = m->x_axis_bearing * 180.0 / M_PI, from = m->direction_from;
    *beta = 0.0; /* no direction anywhere: toward +x, as the yield module does */
    if (b->n_dir > 0) {
        double best = -1.0;
        for (size_t d = 0; d < b->n_dir; d++) {
            double h = 0.0;
            for (size_t i = 0; i < b->n_hs; i++)
                for (size_t j = 0; j < b->n_period; j++)
                    h += sy_climate_table_hours(cl, sy_climate_table_index(cl, i, j, d));
            if (h > best)
                best = h, from = b->dir_centres[d];
        }
    }
    return isnan(from) ? SY_OK : sy_climate_heading(from, bearing, beta, err);
}

int syi_plot_layout(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                    const sy_yield_result *r, sy_error *err)
{
    size_t n = m->n_devices;
    const sy_yield_strategy *s = &r->s[SY_TUNING_PER_SEA_STATE];
    double beta;
    int rc = syi_plot_dominant_heading(m, cl, &beta, err);
    if (rc != SY_OK)
        return rc;
    double xmin = INFINITY, xmax = -INFINITY, ymin = INFINITY, ymax = -INFINITY;
    double emin = INFINITY, emax = -INFINITY;
    for (size_t k = 0; k < n; k++) {
        const sy_model_device *d = &m->devices[k];
        xmin = fmin(xmin, d->x - d->radius), xmax = fmax(xmax, d->x + d->radius);
        ymin = fmin(ymin, d->y - d->radius), ymax = fmax(ymax, d->y + d->radius);
        double e = s->energy[k] / 1e6;
        if (isfinite(e))
            emin = fmin(emin, e), emax = fmax(emax, e);
    }
    /* Margins: room for names below the circles and for the arrow in a corner. */
    double span = fmax(xmax - xmin, ymax - ymin), pad = 0.22 * span + 2.0 * m->radius;
    xmin -= pad, xmax += pad, ymin -= pad, ymax += pad;
    if (!(emax > emin)) { /* one device or equal energies: a band around the value */
        double e0 = isfinite(emin) ? emin : 0.0;
        emin = e0 * 0.95, emax = e0 * 1.05 + 1e-9;
    }
    syi_plot_canvas c;
    if ((rc = syi_plot_begin(&c, dir, "layout", ext, err)) != SY_OK)
        return rc;
    syi_plot_cmap1();
    plvpas(0.11, 0.78, 0.12, 0.85, (ymax - ymin) / (xmax - xmin));
    plwind(xmin, xmax, ymin, ymax);
    double step = syi_plot_nice_step(xmax - xmin, 6);
    plcol0(SYI_PC_GRID);
    plbox("g", step, 0, "g", step, 0);
    plcol0(SYI_PC_INK);
    plbox("bcnst", step, 0, "bcnstv", step, 0);
    for (size_t k = 0; k < n; k++) {
        const sy_model_device *d = &m->devices[k];
        double e = s->energy[k] / 1e6;
        if (isfinite(e)) {
            plcol1((e - emin) / (emax - emin));
            plarc(d->x, d->y, d->radius, d->radius, 0.0, 360.0, 0.0, 1);
        }
        plcol0(SYI_PC_INK);
        plarc(d->x, d->y, d->radius, d->radius, 0.0, 360.0, 0.0, 0);
        plptex(d->x, d->y - d->radius - 0.035 * (ymax - ymin), 1.0, 0.0, 0.5, d->name);
    }
    char title[160];
    snprintf(title, sizeof title, "Array layout (%zu devices), energy per device", n);
    syi_plot_labels("x (m)", "y (m)", title);
    syi_plot_subtitle(SYI_PC_MUTED, "to scale: circles of the device radius; colour: annual energy");
    /* Compass inset beside the frame (never over a device), in the frame's orientation:
     * an arrow toward beta, the direction the main waves travel. */
    plvpas(0.78, 0.94, 0.66, 0.86, 1.0);
    plwind(-1.3, 1.3, -1.3, 1.3);
    plcol0(SYI_PC_GRID);
    plarc(0.0, 0.0, 1.0, 1.0, 0.0, 360.0, 0.0, 0);
    double ux = cos(beta), uy = sin(beta), hl = 0.55, hw = 0.28;
    PLFLT ax[2] = {-0.9 * ux, (0.9 - 0.8 * hl) * ux}, ay[2] = {-0.9 * uy, (0.9 - 0.8 * hl) * uy};
    PLFLT hx[3] = {0.9 * ux, (0.9 - hl) * ux - hw * uy, (0.9 - hl) * ux + hw * uy};
    PLFLT hy[3] = {0.9 * uy, (0.9 - hl) * uy + hw * ux, (0.9 - hl) * uy - hw * ux};
    plcol0(SYI_PC_A);
    plwidth(4.0);
    plline(2, ax, ay);
    plwidth(1.5);
    plfill(3, hx, hy);
    double from = NAN;
    sy_climate_from_direction(beta, m->x_axis_bearing * 180.0 / M_PI, &from, NULL);
    char lab[64];
    snprintf(lab, sizeof lab, "waves from %.0f°", from);
    plschr(0.0, 0.95);
    plcol0(SYI_PC_INK);
    plmtex("b", 1.4, 0.5, 0.5, lab);
    plschr(0.0, 1.15);
    syi_plot_colorbar(0.83, 0.86, 0.12, 0.54, emin, emax, "annual energy (MWh/yr)");
    return syi_plot_end(&c, SY_OK, err);
}
