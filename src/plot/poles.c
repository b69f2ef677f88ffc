/* Picture 5 (when the run searched for resonances): the poles in the complex omega plane
 * (Re omega horizontal, Im omega <= 0 vertical), marker size growing with the quality
 * factor Q = omega_r / (2 gamma) (log scale: Q 1 -> small, Q >= 100 -> largest), motion,
 * no-PTO and scattering families in their own colours, and the [resonance] search
 * rectangle. A multiple pole (listed once per mode shape) is one dot. */
#include "plot_impl.h"

#include <math.h>
#include <plplot.h>
#include <stdio.h>

int syi_plot_poles(const char *dir, const char *ext, const sy_model *m, const sy_pole_set *p, sy_error *err)
{
    double x0 = m->has_resonance ? m->res_re_min : INFINITY, x1 = m->has_resonance ? m->res_re_max : -INFINITY;
    double y0 = m->has_resonance ? -m->res_im_depth : INFINITY, y1 = 0.0;
    for (size_t i = 0; i < p->n; i++)
        x0 = fmin(x0, p->poles[i].omega_r), x1 = fmax(x1, p->poles[i].omega_r), y0 = fmin(y0, -p->poles[i].gamma);
    if (!(x1 > x0))
        x0 = isfinite(x0) ? x0 - 0.5 : 0.0, x1 = x0 + 1.0;
    if (!(y0 < 0) || !isfinite(y0))
        y0 = -0.1;
    double dx = 0.08 * (x1 - x0), dy = 0.12 * (y1 - y0);
    x0 -= dx, x1 += dx, y0 -= dy, y1 += 3.0 * dy; /* legend room above Im omega = 0 */
    syi_plot_canvas c;
    int rc = syi_plot_begin(&c, dir, "poles", ext, err);
    if (rc != SY_OK)
        return rc;
    plvpor(0.13, 0.95, 0.12, 0.85);
    plwind(x0, x1, y0, y1);
    plcol0(SYI_PC_GRID);
    plbox("g", syi_plot_nice_step(x1 - x0, 8), 0, "g", syi_plot_nice_step(y1 - y0, 6), 0);
    PLFLT ax[2] = {x0, x1}, ay[2] = {0.0, 0.0};
    plcol0(SYI_PC_MUTED);
    plline(2, ax, ay);
    if (m->has_resonance) {
        PLFLT rx[5] = {m->res_re_min, m->res_re_max, m->res_re_max, m->res_re_min, m->res_re_min};
        PLFLT ry[5] = {0.0, 0.0, -m->res_im_depth, -m->res_im_depth, 0.0};
        plcol0(SYI_PC_C);
        plwidth(2.5);
        syi_plot_dashed(1);
        plline(5, rx, ry);
        syi_plot_dashed(0);
        plwidth(1.5);
    }
    /* One dot and label per distinct pole (a multiple pole is listed once per mode shape);
     * a label that would sit on an earlier one goes below its dot. */
    size_t distinct = 0;
    for (size_t i = 0; i < p->n; i++) {
        const sy_pole *q = &p->poles[i];
        if (sy_pole_repeats(p, i))
            continue;
        int below = 0;
        for (size_t k = 0; k < i; k++) {
            const sy_pole *o = &p->poles[k];
            below |= fabs(o->omega_r - q->omega_r) < 0.08 * (x1 - x0) && fabs(o->gamma - q->gamma) < 0.08 * (y1 - y0);
        }
        distinct++;
        double size = 0.8 + 1.6 * fmin(1.0, fmax(0.0, log10(fmax(q->q, 1.0)) / 2.0));
        PLFLT px[1] = {q->omega_r}, py[1] = {-q->gamma};
        plcol0(q->kind == SY_POLE_MOTION ? SYI_PC_A : q->kind == SY_POLE_MOTION_NO_PTO ? SYI_PC_D : SYI_PC_B);
        plssym(0.0, size * 1.4);
        plpoin(1, px, py, 17);
        char lab[32];
        snprintf(lab, sizeof lab, "Q %.3g", q->q);
        plcol0(SYI_PC_INK);
        plschr(0.0, 0.85);
        double off = 0.04 * (y1 - y0) * size;
        plptex(q->omega_r, -q->gamma + (below ? -1.6 * off : off), 1.0, 0.0, 0.5, lab);
        plschr(0.0, 1.15);
    }
    plssym(0.0, 1.0);
    plcol0(SYI_PC_INK);
    plsyax(6, 0); /* plain numbers: a separate x10^k label would sit on the title */
    plbox("bcnst", syi_plot_nice_step(x1 - x0, 8), 0, "bcnstv", syi_plot_nice_step(y1 - y0, 6), 0);
    plsyax(0, 0);
    /* Legend: the region, then each family present (dot size grows with Q). */
    static const struct { sy_pole_kind kind; int col; const char *text; } fam[3] = {
        {SY_POLE_MOTION, SYI_PC_A, "motion, PTO as set (size grows with Q)"},
        {SY_POLE_MOTION_NO_PTO, SYI_PC_D, "motion, PTO removed"},
        {SY_POLE_SCATTERING, SYI_PC_B, "scattering, array held fixed"}};
    int present[3] = {0, 0, 0};
    size_t nl = 1;
    for (size_t i = 0; i < p->n; i++)
        for (int k = 0; k < 3; k++)
            if (p->poles[i].kind == fam[k].kind && !present[k])
                present[k] = 1, nl++;
    syi_plot_legend_box(nl, 0);
    syi_plot_legend_line(0, 0, SYI_PC_C, 1, "search region ([resonance])");
    for (int k = 0, l = 1; k < 3; k++)
        if (present[k])
            syi_plot_legend_line((size_t)l++, 0, fam[k].col, 0, fam[k].text);
    char title[128];
    snprintf(title, sizeof title, "Array resonances: %zu poles in the complex frequency plane", distinct);
    syi_plot_labels("Re #gw (rad/s)", "", title);
    plmtex("l", 5.2, 0.5, 0.5, "Im #gw (rad/s)");
    return syi_plot_end(&c, SY_OK, err);
}
