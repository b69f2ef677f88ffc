/* The project's hydrodynamic databases: the model's layout solved by the array module
 * over the run's frequencies and headings, plus one isolated-device database per
 * distinct device geometry (for q-factors), with a resumable on-disk cache.
 *
 * Truncation ([solve] orders / depth_modes, or chosen here from the model's tolerance;
 * recorded in the database):
 *   angular orders M = max(ceil(k a + 2 (k a)^(1/3)) + 1, ceil(ln tol / ln(a / (L - a)))),
 *     at least SY_HYDRO_MIN_ORDER, with k at the highest frequency, a the largest radius
 *     and L the smallest centre distance: a cylinder's own partial waves decay beyond
 *     n ~ k a (common practice for cylinder series) and the re-expansion about the
 *     nearest neighbour converges like (a / (L - a))^M (measured in
 *     tests/array/test_floats.c);
 *   depth modes Q = 1 + ceil(h ln(1/tol) / (pi gap_min)), at most SY_HYDRO_MAX_DEPTH,
 *     so that the weakest kept evanescent coupling e^{-k_Q gap} (k_q ~ q pi / h) is
 *     below the tolerance at the smallest gap between bounding circles. The float's
 *     sharp corner makes the convergence in Q algebraic at small gaps; the cap keeps
 *     the cost bounded and docs/hydro-convergence.md records what it costs in accuracy;
 *   within those, the array plan keeps fewer angular orders in each evanescent mode
 *     (every omitted Graf coupling coefficient below the tolerance, src/array/plan.c):
 *     M orders for the propagating mode, M_q <= M for mode q (the truncation record
 *     lists them and the unknowns kept).
 *
 * Cache: with a cache folder, frequencies are solved in blocks of SY_HYDRO_BLOCK; each
 * block is stored as "<key>.nc" (a small database file; key = hash of the array plan,
 * the block's frequencies and the solver settings) written atomically, and read back
 * instead of recomputed when present. A run killed part-way resumes at the first
 * missing block and reproduces the same numbers bit for bit.
 * Progress: an optional callback after each block (the library never prints). */
#ifndef SWELLYIELD_HYDRO_H
#define SWELLYIELD_HYDRO_H

#include "swellyield/core.h"
#include "swellyield/array.h"
#include "swellyield/hydrodb.h"
#include "swellyield/model.h"

#ifdef __cplusplus
extern "C" {
#endif

#define SY_HYDRO_BLOCK 16
#define SY_HYDRO_MAX_DEPTH 8
#define SY_HYDRO_MIN_ORDER 4
/* Largest interaction matrix (bytes, per thread) planned without an explicit setting. */
#define SY_HYDRO_MAX_MATRIX_BYTES 4e9

typedef void (*sy_hydro_progress)(void *ctx, size_t done, size_t total);

typedef struct sy_hydro_set {
    sy_hydro_db *array;        /* the whole layout */
    size_t n_iso;
    sy_hydro_db **iso;         /* [n_iso] distinct isolated devices */
    const sy_hydro_db **iso_of_device; /* [n_devices] pointer into iso for each device */
    size_t blocks_computed, blocks_cached;
} sy_hydro_set;

/* Solve (or read from cache_dir, which may be NULL for no cache) the layout's database and
 * with_isolated ? the isolated devices' databases. n_threads as sy_array_sweep (0: the
 * OpenMP default). SY_EINPUT for an invalid layout (overlap pair named), statuses of the
 * solvers otherwise. */
SY_API int sy_hydro_build(sy_hydro_set **out, const sy_model *model, int with_isolated,
                          const char *cache_dir, int n_threads, sy_hydro_progress progress,
                          void *progress_ctx, sy_error *err);
SY_API void sy_hydro_set_free(sy_hydro_set *set);

/* The array plan for n of the model's devices (dev may point at one device for an
 * isolated body), with the truncation above. Used by the sweeps here and by the
 * resonance search. */
SY_API int sy_hydro_plan_create(sy_array_plan **out, const sy_model *model, const sy_model_device *dev,
                                size_t n, sy_error *err);

/* The angular orders M and depth modes Q the rule above (or the model's overrides)
 * gives for n of the model's devices. */
SY_API void sy_hydro_truncation(const sy_model *model, const sy_model_device *dev, size_t n, size_t *orders,
                                size_t *depth_modes);

#ifdef __cplusplus
}
#endif
#endif
