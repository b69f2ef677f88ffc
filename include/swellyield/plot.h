/* Pictures and a one-page report of a run, drawn with PLplot (cairo driver) from data the
 * run already holds (model, climate, array database, yield result, optional poles).
 *
 * Files written into `dir` (which must exist), each atomically (temporary name in the
 * same folder, then rename; a failure leaves no partial file):
 *   layout.<ext>          the array to scale: circles of the true radius at the device
 *                         positions, coloured by annual energy (per_sea_state strategy,
 *                         MWh/yr), device names, the dominant wave direction as an arrow;
 *   power_matrix.<ext>    array power of the headline strategy (model->tuning, kW) per
 *                         Hs x period bin (occurrence-weighted over direction bins), with
 *                         the occurrence (h/yr summed over directions) as contour lines;
 *   q_factor.<ext>        regular-wave q-factor against omega for the 1-3 headings that
 *                         carry most of the climate's wave energy, fixed and reactive-bound
 *                         strategies, with the caller's frequency bands shaded;
 *   spectrum.<ext>        the spectrum of the most frequent sea state (bin with most hours)
 *                         and the array's absorbed power density in it at the fixed PTO
 *                         damping (mechanical, before efficiency and rating);
 *   (time_response.<ext>  drawn by the caller with sy_plot_response, below)
 *   poles.<ext>           (only when poles is non-NULL) the poles in the complex omega
 *                         plane, marker size by quality factor Q, and the search region;
 *   report.md             one page: headline numbers, the four strategies side by side,
 *                         the bands with their share of the annual energy (when result
 *                         was computed with the same bands, sy_yield_compute_banded),
 *                         links to the pictures, the hours-per-year convention, cautions.
 * Pictures are 1000 x 700 px (PNG) or the same aspect in SVG/PDF, white background.
 *
 * Units: inputs SI as in the structs; pictures show m, s, rad/s, kW, MWh/yr, h/yr.
 * Status: SY_EINVAL (NULL argument, unknown format, bands not ordered), SY_EINPUT
 * (result and database disagree in size), SY_EIO (a file cannot be written; the message
 * names it), SY_ENOMEM, and statuses of the dynamics solve for the spectrum picture.
 * Thread safety: NOT thread-safe (PLplot keeps global state); call from one thread.
 * PLplot's recoverable errors are captured into err; PLplot exits the process only on
 * its own fatal errors (it offers no way back), which the checks before drawing avoid
 * (folder writable, sizes consistent, finite ranges). */
#ifndef SWELLYIELD_PLOT_H
#define SWELLYIELD_PLOT_H

#include <stddef.h>
#include "swellyield/core.h"
#include "swellyield/climate.h"
#include "swellyield/hydrodb.h"
#include "swellyield/model.h"
#include "swellyield/poles.h"
#include "swellyield/response.h"
#include "swellyield/yield.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Picture size in pixels (PNG); vector formats keep the aspect. */
#define SY_PLOT_WIDTH 1000
#define SY_PLOT_HEIGHT 700

/* Draw every picture and report.md of a run into dir.
 *   model, climate, array_db, result: the run's inputs and result (result on the same
 *       omega grid and headings as array_db; array_db of the model's layout);
 *   poles: the resonance search result, or NULL (no poles picture);
 *   bands: n_bands pairs [omega_min, omega_max] (rad/s, omega_min < omega_max) shaded on
 *       the q-factor picture, e.g. resonance-flagged bands; NULL when n_bands == 0.
 *       Shaded as given: the caller decides what is flagged;
 *   format: "png" (also NULL or ""), "svg" or "pdf".
 * Statuses in the file comment. */
SY_API int sy_plot_run(const char *dir, const sy_model *model, const sy_climate_table *climate,
                       const sy_hydro_db *array_db, const sy_yield_result *result,
                       const sy_pole_set *poles, const double *bands, size_t n_bands,
                       const char *format, sy_error *err);

/* Picture `name`.<format> in dir of a time response (response.h): the released or pushed
 * dof and the other dof that moves most, each as the direct Fourier inversion (solid) and
 * the pole sum (dashed); the subtitle gives the largest difference over the second half of
 * the record relative to the peak. format as above. SY_EINVAL (NULL, bad format, empty
 * response), SY_EINPUT (non-finite samples, dofs not of the model), SY_EIO, SY_ENOMEM.
 * Not thread-safe (PLplot). */
SY_API int sy_plot_response(const char *dir, const char *name, const sy_model *model,
                            const sy_response *response, const char *format, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
