/* A run's output folder, written all or nothing, and the files of the main job.
 *
 * Staging: every file of a run is written into a fresh sibling folder "<dir>.partial-<pid>"
 * and the folder is then swapped with <dir> in one atomic step (renameat2 RENAME_EXCHANGE
 * on Linux; a plain rename when <dir> does not exist yet). A run that fails or is killed
 * leaves <dir> exactly as it was; the hydrodynamic cache in <dir>/cache is carried over
 * into the new folder before the swap.
 *
 * Files (names are this project's own):
 *   power_matrix.nc   NetCDF-4, CF-1.10: per strategy, bin (Hs x period [x direction])
 *                     and device: electrical power (W), array power, isolated power,
 *                     q-factor, damping used, significant stroke, occurrence (h/yr),
 *                     wave power resource (W/m); global attributes record the settings.
 *   power_matrix.csv  the same, long form, kW
 *   devices.csv       per device: position, annual energy (MWh/yr), mean power (kW) and
 *                     q-factor under each strategy
 *   summary.json      headline figures (annual_energy_mwh, q_factor, mean_power_kw,
 *                     capacity_factor, devices[...]), every strategy, resource, cautions */
#ifndef SWELLYIELD_OUTPUTS_H
#define SWELLYIELD_OUTPUTS_H

#include <complex.h>
#include <stdio.h>
#include "swellyield/core.h"
#include "swellyield/climate.h"
#include "swellyield/model.h"
#include "swellyield/yield.h"
#include "swellyield/poles.h"

#ifdef __cplusplus
extern "C" {
#endif

#define SY_OUTPUTS_PATH_MAX 4096

typedef struct sy_outputs_stage {
    char dir[SY_OUTPUTS_PATH_MAX];    /* final folder */
    char stage[SY_OUTPUTS_PATH_MAX + 32];  /* folder being written */
} sy_outputs_stage;

/* Create the staging folder for dir. SY_EIO naming the path on failure. Also removes
 * staging folders "<dir>.partial-<pid>" left by processes that no longer exist (a run
 * killed by a signal), handing back a cache one carried when dir has none; folders of
 * live processes are left alone (kill(pid, 0); assumes one machine's pid space). */
SY_API int sy_outputs_begin(sy_outputs_stage *st, const char *dir, sy_error *err);
/* Path of file `name` inside the staging folder (static-free: into buf). */
SY_API int sy_outputs_path(const sy_outputs_stage *st, const char *name, char *buf, size_t cap,
                           sy_error *err);
/* Swap the staging folder into place (carrying <dir>/cache over) and remove the old one. */
SY_API int sy_outputs_commit(sy_outputs_stage *st, sy_error *err);
/* Remove the staging folder and everything in it (after a failure). NULL-safe. */
SY_API void sy_outputs_abort(sy_outputs_stage *st);

/* Write a text file atomically: fill(f, ctx) writes the content into a temporary file
 * next to path (returning non-zero on failure), which is then renamed over path. On any
 * failure path is untouched and the temporary removed. */
SY_API int sy_outputs_write_file(const char *path, int (*fill)(FILE *f, const void *ctx), const void *ctx,
                                 sy_error *err);

/* poles.csv: kind, omega_r, gamma, Q, period, residual, polished, and for motion poles the
 * amplitude and phase (deg) of every dof (columns named <device>_dof<i>_abs/_phase_deg). */
SY_API int sy_outputs_write_poles(const char *path, const sy_model *model, const sy_pole_set *set,
                                  sy_error *err);

/* The text of the standard cautions (linear potential flow, out-of-scope items, IEC TS
 * 62600 series), one caution per line. Static string. */
SY_API const char *sy_outputs_cautions(void);

/* A resonance-flagged frequency band: [omega_min, omega_max] = [omega_r - 2 gamma,
 * omega_r + 2 gamma] clipped to the run's frequencies, from a pole with Q above the
 * model's q_threshold; its index j matches the bands given to sy_yield_compute_banded. */
typedef struct sy_flagged_band {
    double omega_min, omega_max;  /* rad/s */
    double complex pole;          /* omega_r - i gamma */
    double q;
    int kind;                     /* sy_pole_kind */
} sy_flagged_band;

/* Share of a bin's spectral energy inside a band from which the bin is listed under it. */
#define SY_OUTPUTS_BAND_BIN_SHARE 0.1

/* Write the main job's files into the staging folder; the model's [pto] tuning leads
 * summary.json. bands[n_bands] (may be 0) go to summary.json "flagged_bands" with their
 * share of the headline annual energy and the sea-state bins holding at least
 * SY_OUTPUTS_BAND_BIN_SHARE of their spectral energy inside; resonance_note (may be NULL)
 * says how the resonance search went. */
SY_API int sy_outputs_write_yield(const sy_outputs_stage *st, const sy_model *model,
                                  const sy_climate_table *climate, const sy_yield_result *r,
                                  const sy_flagged_band *bands, size_t n_bands,
                                  const char *resonance_note, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
