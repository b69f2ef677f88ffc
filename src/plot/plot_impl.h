/* Private helpers of the plot module: one picture file per canvas (PLplot stream opened on
 * a temporary name next to the target, renamed when drawing succeeded), the module's
 * colours, and the small drawing pieces every picture shares (frame, colour bar, legend).
 * PLplot keeps global state: one canvas at a time, one thread. */
#ifndef SY_PLOT_IMPL_H
#define SY_PLOT_IMPL_H

#include "swellyield/plot.h"

#include <stddef.h>

/* cmap0 slots set by syi_plot_begin (RGB in canvas.c). */
enum {
    SYI_PC_BG = 0,     /* white background */
    SYI_PC_INK = 1,    /* axes, text */
    SYI_PC_GRID = 2,   /* faint grid lines */
    SYI_PC_A = 3,      /* series colours, in order of use */
    SYI_PC_B = 4,
    SYI_PC_C = 5,
    SYI_PC_D = 6,
    SYI_PC_BAND = 7,   /* shaded frequency bands (translucent) */
    SYI_PC_FILL = 8,   /* light fill under a curve (translucent) */
    SYI_PC_MUTED = 9,  /* secondary text, empty cells */
    SYI_PC_N = 10
};

typedef struct syi_plot_canvas {
    char path[4096 + 16]; /* final file */
    char tmp[4096 + 64];  /* file PLplot writes */
    int open;
} syi_plot_canvas;

/* Start a picture `name`.<ext> in dir: checks the temporary file can be created, opens a
 * PLplot stream with the driver for ext, white background, the module's colours and
 * character size. SY_EIO naming the file on failure. */
int syi_plot_begin(syi_plot_canvas *c, const char *dir, const char *name, const char *ext, sy_error *err);
/* Finish: close the stream and rename the file into place (status != SY_OK: discard). */
int syi_plot_end(syi_plot_canvas *c, int status, sy_error *err);

/* Sequential colour map 1 used for every shaded quantity (sand -> sea green -> ink blue). */
void syi_plot_cmap1(void);
/* Draw a vertical colour bar for values lo..hi at normalised viewport x0..x1, y0..y1 of the
 * page, labelled `label`; leaves the viewport to the caller to reset. */
void syi_plot_colorbar(double x0, double x1, double y0, double y1, double lo, double hi, const char *label);
/* Title and axis labels in the current viewport (PLplot text escapes allowed). */
void syi_plot_labels(const char *xlabel, const char *ylabel, const char *title);
/* A smaller line of text just above the frame, left-aligned, in colour col0. */
void syi_plot_subtitle(int col0, const char *text);
/* Legend entry i (0 = top) in the top-right (right = 1) or top-left corner of the current
 * window: a short line in colour col0 (dashed if dashed) and text. */
void syi_plot_legend_line(size_t i, int right, int col0, int dashed, const char *text);
/* White box with a thin frame behind n legend entries (same corner as the entries). */
void syi_plot_legend_box(size_t n, int right);
/* Dashed / solid line style. */
void syi_plot_dashed(int on);
/* Nice step (1, 2, 5 x 10^k) for about n ticks across span. */
double syi_plot_nice_step(double span, int n);

/* The pictures (each one canvas; see plot.h). */
int syi_plot_layout(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                    const sy_yield_result *r, sy_error *err);
int syi_plot_matrix(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                    const sy_yield_result *r, sy_error *err);
int syi_plot_qfactor(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                     const sy_yield_result *r, const double *bands, size_t n_bands, sy_error *err);
int syi_plot_spectrum(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                      const sy_hydro_db *db, const sy_yield_result *r, sy_error *err);
int syi_plot_poles(const char *dir, const char *ext, const sy_model *m, const sy_pole_set *p, sy_error *err);
int syi_plot_report(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                    const sy_yield_result *r, int with_poles, const double *bands, size_t n_bands,
                    sy_error *err);

/* The climate's dominant travel heading (rad, array frame): the direction bin with most
 * hours, else [sea] direction, else 0 (toward +x). */
int syi_plot_dominant_heading(const sy_model *m, const sy_climate_table *cl, double *beta, sy_error *err);
/* Index of the bin with most hours (flat climate index). */
size_t syi_plot_most_frequent_bin(const sy_yield_result *r);

#endif
