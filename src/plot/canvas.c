/* One picture file per canvas: a PLplot stream on a temporary name next to the target,
 * renamed into place after a successful plend (core_impl.h atomic helpers), plus the
 * module's colours and the drawing pieces every picture shares. PLplot's recoverable
 * errors (plabort) are captured here instead of printed. */
#include "plot_impl.h"
#include "core/core_impl.h"

#include <errno.h>
#include <math.h>
#include <plplot.h>
#include <stdio.h>
#include <string.h>
#include <sys/stat.h>

static char abort_msg[256];

static void on_abort(PLCHAR_VECTOR msg)
{
    snprintf(abort_msg, sizeof abort_msg, "%s", msg);
}

/* RGB of the cmap0 slots (plot_impl.h order) and their opacity. */
static const struct { int r, g, b; double a; } palette[SYI_PC_N] = {
    {255, 255, 255, 1.0}, /* background */
    {34, 40, 49, 1.0},    /* ink */
    {214, 219, 226, 1.0}, /* grid */
    {200, 82, 60, 1.0},   /* brick */
    {20, 120, 130, 1.0},  /* deep teal */
    {190, 140, 20, 1.0},  /* ochre */
    {110, 80, 160, 1.0},  /* violet */
    {236, 186, 90, 0.35}, /* band: translucent amber */
    {20, 120, 130, 0.16}, /* fill: translucent teal */
    {132, 140, 150, 1.0}, /* muted */
};

static const char *driver_for(const char *ext)
{
    if (strcmp(ext, "png") == 0)
        return "pngcairo";
    if (strcmp(ext, "svg") == 0)
        return "svgcairo";
    if (strcmp(ext, "pdf") == 0)
        return "pdfcairo";
    return NULL;
}

int syi_plot_begin(syi_plot_canvas *c, const char *dir, const char *name, const char *ext, sy_error *err)
{
    memset(c, 0, sizeof *c);
    const char *drv = driver_for(ext);
    if (drv == NULL)
        return sy_error_set(err, SY_EINVAL, "picture format '%s': expected png, svg or pdf", ext);
    int n = snprintf(c->path, sizeof c->path, "%s/%s.%s", dir, name, ext);
    if (n < 0 || (size_t)n >= sizeof c->path)
        return sy_error_set(err, SY_EINVAL, "picture path in '%s' is too long", dir);
    int rc = syi_atomic_tmpname(c->path, c->tmp, sizeof c->tmp, err);
    if (rc != SY_OK)
        return rc;
    /* PLplot exits the process when its driver cannot open the file: check first. */
    FILE *f = fopen(c->tmp, "wb");
    if (f == NULL)
        return sy_error_set(err, SY_EIO, "%s: cannot create picture: %s", c->tmp, strerror(errno));
    fclose(f);
    abort_msg[0] = '\0';
    plsabort(on_abort);
    plsdev(drv);
    plsfnam(c->tmp);
    plspage(0.0, 0.0, SY_PLOT_WIDTH, SY_PLOT_HEIGHT, 0, 0);
    plscolbg(255, 255, 255);
    plscmap0n(16);
    plinit();
    for (int i = 0; i < SYI_PC_N; i++)
        plscol0a(i, palette[i].r, palette[i].g, palette[i].b, palette[i].a);
    pladv(0);
    plschr(0.0, 1.15);
    plwidth(1.5);
    plcol0(SYI_PC_INK);
    c->open = 1;
    return SY_OK;
}

int syi_plot_end(syi_plot_canvas *c, int status, sy_error *err)
{
    if (c->open)
        plend();
    c->open = 0;
    plsabort(NULL);
    if (status == SY_OK && abort_msg[0] != '\0')
        status = sy_error_set(err, SY_EIO, "%s: PLplot: %s", c->path, abort_msg);
    struct stat sb;
    if (status == SY_OK && (stat(c->tmp, &sb) != 0 || sb.st_size == 0))
        status = sy_error_set(err, SY_EIO, "%s: the picture came out empty", c->path);
    if (status != SY_OK) {
        if (c->tmp[0] != '\0')
            syi_atomic_abort(c->tmp);
        return status;
    }
    return syi_atomic_commit(c->tmp, c->path, err);
}

void syi_plot_cmap1(void)
{
    /* Sand -> sea green -> ink blue: light for little, dark for much, monotone in
     * lightness so it also reads in grey. */
    static const PLFLT pos[3] = {0.0, 0.5, 1.0};
    static const PLFLT r[3] = {246 / 255.0, 74 / 255.0, 30 / 255.0};
    static const PLFLT g[3] = {232 / 255.0, 168 / 255.0, 52 / 255.0};
    static const PLFLT b[3] = {195 / 255.0, 150 / 255.0, 110 / 255.0};
    plscmap1n(256);
    plscmap1l(1, 3, pos, r, g, b, NULL);
}

double syi_plot_nice_step(double span, int n)
{
    if (!(span > 0) || n < 1)
        return 1.0;
    double raw = span / n, p = pow(10.0, floor(log10(raw))), f = raw / p;
    return (f < 1.5 ? 1.0 : f < 3.5 ? 2.0 : f < 7.5 ? 5.0 : 10.0) * p;
}

void syi_plot_colorbar(double x0, double x1, double y0, double y1, double lo, double hi, const char *label)
{
    if (!(hi > lo))
        hi = lo + 1.0;
    plvpor(x0, x1, y0, y1);
    plwind(0.0, 1.0, lo, hi);
    const int n = 128;
    for (int i = 0; i < n; i++) {
        PLFLT xs[4] = {0, 1, 1, 0};
        PLFLT ys[4] = {lo + (hi - lo) * i / n, lo + (hi - lo) * i / n, lo + (hi - lo) * (i + 1) / n,
                       lo + (hi - lo) * (i + 1) / n};
        plcol1((i + 0.5) / n);
        plfill(4, xs, ys);
    }
    plcol0(SYI_PC_INK);
    plbox("bc", 0.0, 0, "bcmtv", syi_plot_nice_step(hi - lo, 5), 1);
    plmtex("r", 5.2, 0.5, 0.5, label);
}

void syi_plot_labels(const char *xlabel, const char *ylabel, const char *title)
{
    plcol0(SYI_PC_INK);
    plmtex("b", 3.0, 0.5, 0.5, xlabel);
    plmtex("l", 4.2, 0.5, 0.5, ylabel);
    plschr(0.0, 1.35);
    plmtex("t", 2.5, 0.5, 0.5, title);
    plschr(0.0, 1.15);
}

void syi_plot_subtitle(int col0, const char *text)
{
    plcol0(col0);
    plschr(0.0, 0.95);
    plmtex("t", 0.7, 0.0, 0.0, text);
    plschr(0.0, 1.15);
    plcol0(SYI_PC_INK);
}

void syi_plot_dashed(int on)
{
    static const PLINT mark[1] = {6000}, space[1] = {3500};
    if (on)
        plstyl(1, mark, space);
    else
        plstyl(0, NULL, NULL);
}

void syi_plot_legend_box(size_t n, int right)
{
    PLFLT xmin, xmax, ymin, ymax;
    plgvpw(&xmin, &xmax, &ymin, &ymax);
    double dx = xmax - xmin, dy = ymax - ymin;
    double x0 = right ? xmin + 0.485 * dx : xmin + 0.015 * dx, x1 = right ? xmax - 0.015 * dx : xmin + 0.515 * dx;
    double y1 = ymax - 0.02 * dy, y0 = ymax - (0.06 + 0.065 * (double)n) * dy + 0.01 * dy;
    PLFLT xs[5] = {x0, x1, x1, x0, x0}, ys[5] = {y0, y0, y1, y1, y0};
    plcol0(SYI_PC_BG);
    plfill(4, xs, ys);
    plcol0(SYI_PC_GRID);
    plline(5, xs, ys);
    plcol0(SYI_PC_INK);
}

void syi_plot_legend_line(size_t i, int right, int col0, int dashed, const char *text)
{
    PLFLT xmin, xmax, ymin, ymax;
    plgvpw(&xmin, &xmax, &ymin, &ymax);
    double dx = xmax - xmin, dy = ymax - ymin;
    double x0 = right ? xmin + 0.50 * dx : xmin + 0.03 * dx;
    double y = ymax - (0.06 + 0.065 * (double)i) * dy;
    PLFLT xs[2] = {x0, x0 + 0.06 * dx}, ys[2] = {y, y};
    plcol0(col0);
    plwidth(3.0);
    syi_plot_dashed(dashed);
    plline(2, xs, ys);
    syi_plot_dashed(0);
    plwidth(1.5);
    plcol0(SYI_PC_INK);
    plptex(x0 + 0.075 * dx, y, 1.0, 0.0, 0.0, text);
}
