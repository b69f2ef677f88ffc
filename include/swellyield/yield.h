/* Yield: from the array's hydrodynamics, the PTO and the site's wave climate to power
 * matrices, annual energy per device and for the array, capacity factor, wave
 * resource and the array's q-factor, under four PTO tuning strategies side by side.
 *
 * Sea states. Each scatter-table bin with non-zero occurrence becomes a spectrum
 * (JONSWAP or Bretschneider per [sea], Hs = bin centre, Te or Tp = bin centre of the
 * table's period axis, normalised exactly so that Hm0 = Hs), spread by cos-2s about the
 * bin's direction (or [sea] direction) over the run's headings. A frequency cell i
 * carries amplitude^2 2 E_i with E_i the exact spectral energy in the cell, and mean
 * power is P = sum_i sum_j 2 E_i D_j p(omega_i, beta_j) (conventions.md "factor 2").
 * The spectral energy outside the run's frequency cells is not counted and is reported.
 *
 * Power chain per device and bin: mechanical P_mech from the PTO damping; electrical
 * P = min(efficiency x P_mech, rated_power) (the cap acts on the sea-state mean: a
 * first-estimate simplification, stated in reports). Stroke: the significant stroke
 * 4 sqrt(m0_xi) of the PTO motion (the motion analogue of Hs; individual strokes exceed
 * it ~13.5 % of the time in a narrow-band Rayleigh model, common practice for screening)
 * is compared with max_stroke.
 *
 * Strategies (one damping b shared by every PTO unless stated):
 *   FIXED          each device's damping and stiffness from the model, all bins;
 *   PER_SEA_STATE  b maximising the bin's array power subject to the stroke limit
 *                  (GSL Brent minimiser on log b after a coarse bracketing scan; the
 *                  stroke-limited lower bound on b by GSL Brent root finding);
 *   SITE_OPTIMAL   one b for the whole site maximising annual electrical energy
 *                  (GSL Brent minimiser on log b); stroke exceedances reported;
 *   REACTIVE_BOUND the unconstrained optimum (1/8) X^H B^-1 X over the PTO dofs,
 *                  times efficiency, no cap, no stroke limit: a theoretical ceiling
 *                  for the array as a whole (per-device values are not defined).
 * Annual energy E = sum_bins P_bin O_bin, O_bin the mean annual hours
 * (SY_CLIMATE_HOURS_PER_YEAR, IEC TS 62600-100/-101 practice; references.md 5.1).
 * q-factor = array energy / sum over devices of the isolated device's energy under the
 * same damping in the same sea (conventions.md).
 * Units: W, W h per year, m, N s/m. Not thread-safe per plan (single caller). */
#ifndef SWELLYIELD_YIELD_H
#define SWELLYIELD_YIELD_H

#include <stddef.h>
#include "swellyield/core.h"
#include "swellyield/climate.h"
#include "swellyield/hydrodb.h"
#include "swellyield/model.h"

#ifdef __cplusplus
extern "C" {
#endif

#define SY_YIELD_N_STRATEGIES 4

/* Strategy index = sy_tuning value (model.h): FIXED 0, PER_SEA_STATE 1, SITE_OPTIMAL 2,
 * REACTIVE_BOUND 3. */
SY_API const char *sy_yield_strategy_name(int strategy);

typedef struct sy_yield_strategy {
    double *power;          /* [n_bins_table][n_devices] electrical W (NAN for the bound) */
    double *power_array;    /* [n_bins_table] W (0 where occurrence is 0) */
    double *power_iso;      /* [n_bins_table] sum over devices of isolated power, W */
    double *power_iso_dev;  /* [n_bins_table][n_devices] isolated power of each device, W */
    double *damping;        /* [n_bins_table] b used (N s/m); NAN for FIXED/BOUND */
    double *stroke;         /* [n_bins_table][n_devices] significant stroke, m */
    unsigned char *stroke_limited; /* [n_bins_table] 1: stroke limit bound the tuning (or was exceeded) */
    double *energy;         /* [n_devices] W h per year (NAN for the bound) */
    double energy_array;    /* W h per year */
    double energy_iso;      /* W h per year, sum over devices of isolated energies */
    double *energy_iso_dev; /* [n_devices] W h per year of each device alone */
    double q_factor;        /* energy_array / energy_iso */
    double mean_power;      /* W, energy_array / hours covered */
    double capacity_factor; /* mean_power / (N rated), NAN without a rating */
    size_t n_stroke_exceeded; /* bins where the significant stroke exceeds max_stroke */
    double site_damping;    /* SITE_OPTIMAL: the b chosen; else NAN */
    double *energy_band;    /* [n_bands] W h per year produced by frequency components inside
                               each flagged band (electrical, in proportion to the mechanical) */
    double *q_omega;        /* [n_omega][n_headings] regular-wave q-factor sum P / sum P_isolated
                               at each frequency and heading (NAN for PER_SEA_STATE, whose
                               damping depends on the sea state) */
} sy_yield_strategy;

typedef struct sy_yield_result {
    size_t n_bins;          /* bins of the climate table (all, zero occurrence included) */
    size_t n_devices;
    size_t n_omega, n_headings;
    double *omega;          /* [n_omega] rad/s, the run's grid */
    double *headings;       /* [n_headings] rad */
    size_t n_bands;         /* flagged bands given to sy_yield_compute_banded */
    double *band_fraction;  /* [n_bins][n_bands] share of each bin's spectral energy inside each band */
    double *hours;          /* [n_bins] mean annual hours of each bin */
    double *resource;       /* [n_bins] wave power J per metre of crest at the site depth, W/m */
    double mean_resource;   /* occurrence-weighted mean J, W/m */
    double hours_covered;   /* h/yr with non-zero occurrence */
    double max_outside;     /* largest fraction of a bin spectrum's energy outside the run's frequency cells */
    double max_dir_outside; /* largest fraction of directional spread outside the run's headings */
    sy_yield_strategy s[SY_YIELD_N_STRATEGIES];
} sy_yield_result;

SY_API void sy_yield_result_free(sy_yield_result *r);

/* Evaluate every strategy. iso_db[k] is the isolated single-device database of device k
 * (pointers may repeat for identical devices), each on the same omega grid and headings as
 * array_db, heave-only or with the same modes per body. SY_EINPUT for inconsistent inputs
 * (message names which), SY_ESINGULAR/SY_ENOCONV from the solves, SY_ENOMEM. */
SY_API int sy_yield_compute(sy_yield_result **out, const sy_model *model,
                            const sy_climate_table *climate, const sy_hydro_db *array_db,
                            const sy_hydro_db *const *iso_db, sy_error *err);

/* The same, and for each flagged frequency band (bands[2 j], bands[2 j + 1], rad/s;
 * n_bands <= SY_YIELD_MAX_BANDS) the annual energy produced inside it (energy_band) and
 * each bin's share of spectral energy inside it (band_fraction). */
#define SY_YIELD_MAX_BANDS 64
SY_API int sy_yield_compute_banded(sy_yield_result **out, const sy_model *model,
                                   const sy_climate_table *climate, const sy_hydro_db *array_db,
                                   const sy_hydro_db *const *iso_db, const double *bands,
                                   size_t n_bands, sy_error *err);

/* Progress of a yield computation, for a caller's progress bar: `done` of `total` units
 * of work, where a unit is one sea-state group's damping search (per-sea-state tuning),
 * one bin's stroke check and store (per-sea-state tuning), or one group's share of the
 * site-wide damping search (reported when that search ends). Called from the calling
 * thread, with done non-decreasing and finally equal to total; it must not call back into
 * the library with the same objects. */
typedef void (*sy_yield_progress)(void *ctx, size_t done, size_t total);

/* sy_yield_compute_banded with a progress callback (progress may be NULL). */
SY_API int sy_yield_compute_progress(sy_yield_result **out, const sy_model *model,
                                     const sy_climate_table *climate, const sy_hydro_db *array_db,
                                     const sy_hydro_db *const *iso_db, const double *bands,
                                     size_t n_bands, sy_yield_progress progress,
                                     void *progress_ctx, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
