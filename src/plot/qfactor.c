/* Picture 3: the regular-wave q-factor against omega (sy_yield_strategy.q_omega) for the
 * headings that carry most of the climate's wave energy, under the fixed PTO damping
 * (solid) and the reactive bound (dashed), q = 1 marked, and the caller's frequency
 * bands [omega_min, omega_max] shaded (the hook for resonance-flagged bands).
 * Heading weights: each bin's resource J times its hours, spread over the run's headings
 * with the model's cos-2s spreading about the bin's direction (as the yield does). */
#include "plot_impl.h"
#include "swellyield/sea.h"

#include <math.h>
#include <plplot.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#define MAX_SHOWN 3 /* more lines than this are hard to tell apart */
#define MIRROR_TOL 1e-6 /* q curves this close (absolute) are drawn as one: q is O(1) and
                           the solver's tolerance is >= 1e-10 relative */

/* Headings (indices) in decreasing wave energy; shown = how many carry >= 10 % of the
 * largest (at most MAX_SHOWN), so a unidirectional site shows one. */
static int main_headings(const sy_model *m, const sy_climate_table *cl, const sy_yield_result *r, size_t *pick,
                         size_t *shown, sy_error *err)
{
    size_t nh = r->n_headings;
    const sy_climate_bins *b = sy_climate_table_bins(cl);
    size_t nd = b->n_dir > 0 ? b->n_dir : 1, nt = sy_climate_table_size(cl);
    double *w = calloc(nh, sizeof *w), *D = malloc(nh * sizeof *D);
    if (w == NULL || D == NULL) {
        free(w), free(D);
        return sy_error_set(err, SY_ENOMEM, "heading weights");
    }
    double bearing = m->x_axis_bearing * 180.0 / M_PI;
    int rc = SY_OK;
    for (size_t d = 0; d < nd && rc == SY_OK; d++) {
        double e = 0.0;
        for (size_t idx = 0; idx < nt; idx++)
            if (idx % nd == d && r->hours[idx] > 0)
                e += r->hours[idx] * r->resource[idx];
        if (!(e > 0))
            continue;
        double from = b->n_dir > 0 ? b->dir_centres[d] : m->direction_from, beta = 0.0;
        sy_sea_spreading spr;
        if (!isnan(from))
            rc = sy_climate_heading(from, bearing, &beta, err);
        if (rc == SY_OK)
            rc = sy_sea_spreading_init(&spr, m->spreading, beta, err);
        if (rc == SY_OK)
            rc = sy_sea_spreading_weights(&spr, r->headings, nh, D, NULL, err);
        for (size_t j = 0; rc == SY_OK && j < nh; j++)
            w[j] += e * D[j];
    }
    for (size_t j = 0; j < nh; j++)
        pick[j] = j;
    for (size_t a = 0; a < nh; a++) /* selection sort, nh is small */
        for (size_t q = a + 1; q < nh; q++)
            if (w[pick[q]] > w[pick[a]]) {
                size_t t = pick[a];
                pick[a] = pick[q], pick[q] = t;
            }
    *shown = 1;
    while (*shown < MAX_SHOWN && *shown < nh && w[pick[*shown]] >= 0.1 * w[pick[0]] && w[pick[*shown]] > 0)
        (*shown)++;
    free(w), free(D);
    return rc;
}

static void series(const sy_yield_result *r, const double *q, size_t ih, int col, int dashed)
{
    plcol0(col);
    plwidth(3.0);
    syi_plot_dashed(dashed);
    size_t i = 0;
    PLFLT *x = malloc(r->n_omega * sizeof *x), *y = malloc(r->n_omega * sizeof *y);
    if (x != NULL && y != NULL)
        while (i < r->n_omega) { /* NAN splits the line */
            PLINT k = 0;
            while (i < r->n_omega && isfinite(q[i * r->n_headings + ih]))
                x[k] = r->omega[i], y[k] = q[i * r->n_headings + ih], k++, i++;
            if (k > 1)
                plline(k, x, y);
            i++;
        }
    free(x), free(y);
    syi_plot_dashed(0);
    plwidth(1.5);
}

int syi_plot_qfactor(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                     const sy_yield_result *r, const double *bands, size_t n_bands, sy_error *err)
{
    size_t nh = r->n_headings, no = r->n_omega, shown = 0;
    size_t *pick = malloc(nh * sizeof *pick);
    if (pick == NULL)
        return sy_error_set(err, SY_ENOMEM, "heading list");
    int rc = main_headings(m, cl, r, pick, &shown, err);
    if (rc != SY_OK) {
        free(pick);
        return rc;
    }
    const double *qf = r->s[SY_TUNING_FIXED].q_omega, *qb = r->s[SY_TUNING_REACTIVE_BOUND].q_omega;
    double ymin = 1.0, ymax = 1.0;
    for (size_t a = 0; a < shown; a++)
        for (size_t i = 0; i < no; i++) {
            double v[2] = {qf[i * nh + pick[a]], qb[i * nh + pick[a]]};
            for (int k = 0; k < 2; k++)
                if (isfinite(v[k]))
                    ymin = fmin(ymin, v[k]), ymax = fmax(ymax, v[k]);
        }
    double pad = 0.08 * (ymax - ymin) + 0.02;
    ymin = fmax(0.0, ymin - pad), ymax += pad + 0.09 * (double)(shown + 2) * (ymax - ymin + pad); /* legend room */
    double x0 = r->omega[0], x1 = r->omega[no - 1];
    if (!(x1 > x0))
        x0 -= 0.1, x1 += 0.1;
    syi_plot_canvas c;
    if ((rc = syi_plot_begin(&c, dir, "q_factor", ext, err)) != SY_OK) {
        free(pick);
        return rc;
    }
    plvpor(0.11, 0.95, 0.12, 0.85);
    plwind(x0, x1, ymin, ymax);
    for (size_t k = 0; k < n_bands; k++) { /* shaded as given, clipped to the window */
        PLFLT lo = fmax(bands[2 * k], x0), hi = fmin(bands[2 * k + 1], x1);
        if (!(hi > lo))
            continue;
        PLFLT xs[4] = {lo, hi, hi, lo}, ys[4] = {ymin, ymin, ymax, ymax};
        plcol0(SYI_PC_BAND);
        plfill(4, xs, ys);
    }
    plcol0(SYI_PC_GRID);
    plbox("g", syi_plot_nice_step(x1 - x0, 8), 0, "g", syi_plot_nice_step(ymax - ymin, 6), 0);
    PLFLT lx[2] = {x0, x1}, ly[2] = {1.0, 1.0};
    plcol0(SYI_PC_MUTED);
    plwidth(2.0);
    plline(2, lx, ly);
    static const int cols[MAX_SHOWN] = {SYI_PC_B, SYI_PC_A, SYI_PC_D};
    /* A heading whose curves equal an earlier one's (mirror image in a symmetric layout)
     * joins that one's legend entry instead of hiding under it. */
    char txt[MAX_SHOWN][96];
    size_t entry = 0, of[MAX_SHOWN];
    for (size_t a = 0; a < shown; a++) {
        double deg = r->headings[pick[a]] * 180.0 / M_PI;
        of[a] = entry;
        for (size_t e = 0; e < a; e++) {
            double diff = 0.0;
            for (size_t i = 0; i < no; i++)
                diff = fmax(diff, fmax(fabs(qf[i * nh + pick[a]] - qf[i * nh + pick[e]]),
                                       fabs(qb[i * nh + pick[a]] - qb[i * nh + pick[e]])));
            if (diff <= MIRROR_TOL && of[e] < entry) {
                of[a] = of[e];
                size_t l = strlen(txt[of[a]]);
                snprintf(txt[of[a]] + l, sizeof txt[0] - l, " and %.0f°", deg);
                break;
            }
        }
        if (of[a] == entry)
            snprintf(txt[entry++], sizeof txt[0], "toward %.0f°", deg);
    }
    syi_plot_legend_box(entry + 2, 1);
    for (size_t a = 0; a < shown; a++) {
        series(r, qf, pick[a], cols[of[a]], 0);
        series(r, qb, pick[a], cols[of[a]], 1);
    }
    for (size_t e = 0; e < entry; e++)
        syi_plot_legend_line(e, 1, cols[e], 0, txt[e]);
    shown = entry;
    syi_plot_legend_line(shown, 1, SYI_PC_INK, 0, "fixed PTO damping");
    syi_plot_legend_line(shown + 1, 1, SYI_PC_INK, 1, "reactive bound");
    if (n_bands > 0) {
        plcol0(SYI_PC_INK);
        plptex(x0 + 0.02 * (x1 - x0), ymin + 0.04 * (ymax - ymin), 1.0, 0.0, 0.0, "shaded: flagged bands");
    }
    plcol0(SYI_PC_INK);
    plbox("bcnst", syi_plot_nice_step(x1 - x0, 8), 0, "bcnstv", syi_plot_nice_step(ymax - ymin, 6), 0);
    syi_plot_labels("wave frequency #gw (rad/s)", "q-factor (array / isolated devices)",
                    "Regular-wave q-factor of the array");
    syi_plot_subtitle(SYI_PC_MUTED, "the headings carrying most of the site's wave energy");
    free(pick);
    return syi_plot_end(&c, SY_OK, err);
}
