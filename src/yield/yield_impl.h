/* Private to the yield module: the sea states of a climate on a run's grids. */
#ifndef SY_YIELD_IMPL_H
#define SY_YIELD_IMPL_H

#include "swellyield/yield.h"

/* Every climate bin with non-zero occurrence, discretised on the run's grids. With the
 * exact normalisation (m0 = Hs^2/16) a spectrum is Hs^2 times a shape that depends only
 * on the period (and gamma), and the spreading only on the direction: bins sharing
 * (period, direction) form a group whose responses scale with Hs^2 (linear theory).
 * The group holds the unit-Hs sea; a bin holds its Hs^2. */
typedef struct syi_yield_seas {
    size_t n;               /* active bins */
    size_t n_groups;
    size_t n_omega, n_headings;
    size_t *bin;            /* [n] flat table index */
    size_t *group;          /* [n] group of each bin */
    double *hs2;            /* [n] Hs^2 of the bin, m^2 */
    double *hours;          /* [n] h/yr */
    double *resource;       /* [n] J, W/m */
    double *amp2;           /* [n_groups][n_omega] 2 E_i per unit Hs^2: amplitude^2 of cell i / Hs^2 */
    double *dir;            /* [n_groups][n_headings] D_j, fraction of the spread on heading j */
    double *omega_e;        /* [n_groups] 2 pi / Te of the group's spectrum, rad/s */
    double *resource_unit;  /* [n_groups] J per unit Hs^2, W/m^3 */
    double max_outside, max_dir_outside;
} syi_yield_seas;

int syi_yield_seas_create(syi_yield_seas **out, const sy_model *model, const sy_climate_table *climate,
                          const double *omega, size_t n_omega, const double *headings, size_t n_headings,
                          sy_error *err);
void syi_yield_seas_free(syi_yield_seas *s);

#endif
