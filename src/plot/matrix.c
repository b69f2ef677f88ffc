/* Picture 2: the array's power matrix under the headline strategy (model->tuning), kW,
 * one filled cell per Hs x period bin of the climate (the true bin edges), the power of
 * a cell being the occurrence-weighted mean over its direction bins; cells without
 * occurrence stay blank (no sea state was evaluated there). Occurrence, h/yr summed over
 * directions, drawn as labelled contour lines through the bin centres. */
#include "plot_impl.h"

#include <math.h>
#include <plplot.h>
#include <stdio.h>
#include <stdlib.h>

/* Up to 5 contour levels on the 1-2-5 series between max/30 and max. */
static int levels(double max, PLFLT *lev)
{
    int n = 0;
    if (!(max > 0))
        return 0;
    double p = pow(10.0, floor(log10(max / 30.0)));
    static const double m[3] = {1, 2, 5};
    for (int k = 0; n < 12 && k < 40; k++) {
        double v = m[k % 3] * p * pow(10.0, k / 3);
        if (v >= max)
            break;
        if (v >= max / 30.0)
            lev[n++] = v;
    }
    if (n > 5) { /* the highest five */
        for (int i = 0; i < 5; i++)
            lev[i] = lev[n - 5 + i];
        n = 5;
    }
    return n;
}

int syi_plot_matrix(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                    const sy_yield_result *r, sy_error *err)
{
    const sy_climate_bins *b = sy_climate_table_bins(cl);
    size_t nh = b->n_hs, np = b->n_period, nd = b->n_dir > 0 ? b->n_dir : 1;
    const sy_yield_strategy *s = &r->s[m->tuning];
    double *pw = calloc(nh * np, sizeof *pw), *occ = calloc(nh * np, sizeof *occ);
    PLFLT **f = malloc(np * sizeof *f);
    if (pw == NULL || occ == NULL || f == NULL) {
        free(pw), free(occ), free(f);
        return sy_error_set(err, SY_ENOMEM, "power matrix picture for %zu bins", nh * np);
    }
    double pmax = 0.0, omax = 0.0;
    for (size_t i = 0; i < nh; i++)
        for (size_t j = 0; j < np; j++) {
            double h = 0.0, e = 0.0;
            for (size_t d = 0; d < nd; d++) {
                size_t idx = sy_climate_table_index(cl, i, j, d);
                double o = r->hours[idx];
                if (o > 0 && isfinite(s->power_array[idx]))
                    h += o, e += o * s->power_array[idx];
            }
            occ[i * np + j] = h;
            pw[i * np + j] = h > 0 ? e / h / 1e3 : NAN;
            if (h > 0)
                pmax = fmax(pmax, pw[i * np + j]);
            omax = fmax(omax, h);
        }
    if (!(pmax > 0))
        pmax = 1.0;
    syi_plot_canvas c;
    int rc = syi_plot_begin(&c, dir, "power_matrix", ext, err);
    if (rc != SY_OK) {
        free(pw), free(occ), free(f);
        return rc;
    }
    syi_plot_cmap1();
    double x0 = b->period_edges[0], x1 = b->period_edges[np], y0 = b->hs_edges[0], y1 = b->hs_edges[nh];
    plvpor(0.11, 0.78, 0.12, 0.85);
    plwind(x0, x1, y0, y1);
    for (size_t i = 0; i < nh; i++)
        for (size_t j = 0; j < np; j++) {
            double v = pw[i * np + j];
            if (isnan(v))
                continue;
            PLFLT xs[4] = {b->period_edges[j], b->period_edges[j + 1], b->period_edges[j + 1], b->period_edges[j]};
            PLFLT ys[4] = {b->hs_edges[i], b->hs_edges[i], b->hs_edges[i + 1], b->hs_edges[i + 1]};
            plcol1(v / pmax);
            plfill(4, xs, ys);
        }
    /* Occurrence contours through the bin centres (need 2 x 2 bins). */
    PLFLT lev[12];
    int nl = levels(omax, lev);
    if (nh >= 2 && np >= 2 && nl > 0) {
        PLFLT *xg = malloc(np * sizeof *xg), *yg = malloc(nh * sizeof *yg), *store = malloc(nh * np * sizeof *store);
        if (xg && yg && store) {
            for (size_t j = 0; j < np; j++) {
                xg[j] = 0.5 * (b->period_edges[j] + b->period_edges[j + 1]);
                f[j] = store + j * nh;
                for (size_t i = 0; i < nh; i++)
                    f[j][i] = occ[i * np + j];
            }
            for (size_t i = 0; i < nh; i++)
                yg[i] = 0.5 * (b->hs_edges[i] + b->hs_edges[i + 1]);
            PLcGrid grid = {xg, yg, NULL, (PLINT)np, (PLINT)nh, 0};
            plcol0(SYI_PC_A);
            plwidth(2.0);
            pl_setcontlabelformat(4, 2);
            pl_setcontlabelparam(0.008, 0.8, 0.3, 1);
            plcont((PLFLT_MATRIX)f, (PLINT)np, (PLINT)nh, 1, (PLINT)np, 1, (PLINT)nh, lev, nl, pltr1, &grid);
            pl_setcontlabelparam(0.006, 0.55, 0.35, 0);
            plwidth(1.5);
        } else
            rc = sy_error_set(err, SY_ENOMEM, "occurrence contours");
        free(xg), free(yg), free(store);
    }
    plcol0(SYI_PC_INK);
    plbox("bcnst", syi_plot_nice_step(x1 - x0, 8), 0, "bcnstv", syi_plot_nice_step(y1 - y0, 6), 0);
    char title[200], xl[64];
    snprintf(title, sizeof title, "Array power matrix, %s tuning",
             sy_yield_strategy_name((int)m->tuning));
    snprintf(xl, sizeof xl, "%s (s)", b->period == SY_CLIMATE_TE ? "energy period T#de#u" : "peak period T#dp#u");
    syi_plot_labels(xl, "significant wave height H#ds#u (m)", title);
    syi_plot_subtitle(SYI_PC_A, "lines: occurrence, h/yr summed over directions");
    syi_plot_colorbar(0.82, 0.85, 0.20, 0.80, 0.0, pmax, "array power (kW)");
    free(pw), free(occ), free(f);
    return syi_plot_end(&c, rc, err);
}
