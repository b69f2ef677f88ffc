/* Picture 6: a pole-expansion time response (response.h) against the same response by
 * direct Fourier inversion. Two dofs are drawn: the one released or pushed, and the other
 * dof that moves most (the neighbour the resonance couples in); each as the direct curve
 * (solid) and the pole sum (dashed) in one colour. The subtitle gives the number of poles
 * summed and the largest difference over the second half of the record (where the
 * neglected branch part has faded), so the reader sees how far the poles explain the
 * motion. */
#include "plot_impl.h"

#include "swellyield/response.h"

#include <math.h>
#include <plplot.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* The dof other than the excited one with the largest direct motion (SIZE_MAX if none). */
static size_t partner_dof(const sy_response *r)
{
    size_t best = SIZE_MAX;
    double peak = 0.0;
    for (size_t d = 0; d < r->n_dof; d++) {
        if (d == r->excited_dof)
            continue;
        for (size_t j = 0; j < r->n_times; j++) {
            double v = fabs(r->direct[j * r->n_dof + d]);
            if (v > peak)
                peak = v, best = d;
        }
    }
    return best;
}

static int check(const sy_model *m, const sy_response *r, sy_error *err)
{
    if (m == NULL || r == NULL || r->n_times < 2 || r->n_dof == 0 || r->excited_dof >= r->n_dof)
        return sy_error_set(err, SY_EINVAL, "response picture: empty or inconsistent response");
    for (size_t d = 0; d < r->n_dof; d++)
        if (r->dof_body[d] < 0 || (size_t)r->dof_body[d] >= m->n_devices)
            return sy_error_set(err, SY_EINPUT, "response picture: dof %zu belongs to body %d, model has %zu", d,
                                r->dof_body[d], m->n_devices);
    for (size_t k = 0; k < r->n_times * r->n_dof; k++)
        if (!isfinite(r->direct[k]) || !isfinite(r->pole_sum[k]))
            return sy_error_set(err, SY_EINPUT, "response picture: non-finite motion at sample %zu", k / r->n_dof);
    return SY_OK;
}

static void curve(const sy_response *r, size_t d, const double *y, PLFLT *px, PLFLT *py)
{
    for (size_t j = 0; j < r->n_times; j++)
        px[j] = r->t[j], py[j] = y[j * r->n_dof + d];
    plline((PLINT)r->n_times, px, py);
}

int sy_plot_response(const char *dir, const char *name, const sy_model *m, const sy_response *r,
                     const char *format, sy_error *err)
{
    const char *ext = (format == NULL || format[0] == '\0') ? "png" : format;
    if (dir == NULL || name == NULL)
        return sy_error_set(err, SY_EINVAL, "response picture: NULL folder or name");
    if (strcmp(ext, "png") != 0 && strcmp(ext, "svg") != 0 && strcmp(ext, "pdf") != 0)
        return sy_error_set(err, SY_EINVAL, "plot: format '%s': expected png, svg or pdf", ext);
    int rc = check(m, r, err);
    if (rc != SY_OK)
        return rc;
    size_t nt = r->n_times, nd = r->n_dof, e = r->excited_dof, p = partner_dof(r);
    size_t dofs[2] = {e, p};
    double ymax = 0.0, diff = 0.0, ref = 0.0;
    for (size_t j = 0; j < nt; j++)
        for (size_t k = 0; k < 2 && dofs[k] != SIZE_MAX; k++) {
            double a = r->direct[j * nd + dofs[k]], b = r->pole_sum[j * nd + dofs[k]];
            ymax = fmax(ymax, fmax(fabs(a), fabs(b)));
            if (j >= nt / 2)
                diff = fmax(diff, fabs(a - b));
            ref = fmax(ref, fabs(a));
        }
    ymax = ymax > 0 ? 1.25 * ymax : 1.0;
    double t0 = r->t[0], t1 = r->t[nt - 1];
    PLFLT *px = malloc(nt * sizeof *px), *py = malloc(nt * sizeof *py);
    if (px == NULL || py == NULL) {
        free(px), free(py);
        return sy_error_set(err, SY_ENOMEM, "response picture: %zu samples", nt);
    }
    syi_plot_canvas c;
    if ((rc = syi_plot_begin(&c, dir, name, ext, err)) != SY_OK) {
        free(px), free(py);
        return rc;
    }
    plvpor(0.12, 0.95, 0.12, 0.85);
    plwind(t0, t1, -ymax, ymax);
    plcol0(SYI_PC_GRID);
    plbox("g", syi_plot_nice_step(t1 - t0, 8), 0, "g", syi_plot_nice_step(2 * ymax, 6), 0);
    static const int colour[2] = {SYI_PC_A, SYI_PC_B};
    char lab[4][128];
    for (size_t k = 0; k < 2 && dofs[k] != SIZE_MAX; k++) {
        const char *dev = m->devices[r->dof_body[dofs[k]]].name;
        plcol0(colour[k]);
        plwidth(2.5);
        curve(r, dofs[k], r->direct, px, py);
        syi_plot_dashed(1);
        plwidth(2.0);
        curve(r, dofs[k], r->pole_sum, px, py);
        syi_plot_dashed(0);
        snprintf(lab[2 * k], sizeof lab[0], "%s, direct inversion", dev);
        snprintf(lab[2 * k + 1], sizeof lab[0], "%s, sum over %zu poles", dev, r->n_poles);
    }
    plwidth(1.5);
    plcol0(SYI_PC_INK);
    plbox("bcnst", syi_plot_nice_step(t1 - t0, 8), 0, "bcnstv", syi_plot_nice_step(2 * ymax, 6), 0);
    size_t nl = p == SIZE_MAX ? 2 : 4;
    syi_plot_legend_box(nl, 1);
    for (size_t l = 0; l < nl; l++)
        syi_plot_legend_line(l, 1, colour[l / 2], (int)(l % 2), lab[l]);
    char title[160], sub[200];
    snprintf(title, sizeof title, "%s of %s: pole sum and direct inversion",
             r->kind == SY_RESPONSE_DECAY ? "Free decay" : "Heave pulse response",
             m->devices[r->dof_body[e]].name);
    snprintf(sub, sizeof sub,
             "second-half difference %.2g of the peak (pole sums omit the branch part)",
             ref > 0 ? diff / ref : 0.0);
    int rot = r->dof_mode[e] > 3 || (p != SIZE_MAX && r->dof_mode[p] > 3);
    syi_plot_labels("time t (s)", rot ? "motion (m; rotations rad)" : "motion (m)", title);
    syi_plot_subtitle(SYI_PC_MUTED, sub);
    free(px), free(py);
    return syi_plot_end(&c, SY_OK, err);
}
