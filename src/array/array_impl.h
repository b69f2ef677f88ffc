/* Private to the array module: plan and work bodies, and the cross-file helpers
 * (translation blocks and scalings, shared by solve.c and the tests).
 *
 * Unknowns: for body i, depth modes q = 0..nq[i]-1 and orders n = -M_iq..M_iq
 * (M_i0 = M; M_iq <= M chosen by the plan from the tolerance, plan.c), at
 *   syi_array_unknown(plan, i, q, n) = blk_off[i Q + q] + (n + M_iq),
 * the modes of one body one after the other (blk_off[i Q] = unk_off[i]),
 * in the scaled basis beta_{qn} = s_{qn} b_{qn} (outgoing) and alpha_{qn} = a_{qn} / s_{qn}
 * (incident), s_{qn} = |Hhat_{qn}(k_q a)| of the body (body.h basis). Then
 *   D~ = S D S,  T~ = S^-1 T S^-1,  G~ = G S,
 * and D~ T~ = S (D T) S^-1 is similar to D T, so det(I - D~ T~) = det(I - D T). */
#ifndef SY_ARRAY_IMPL_H
#define SY_ARRAY_IMPL_H

#include "swellyield/array.h"
#include "swellyield/waves.h"

#define SY_ARRAY_PI 3.14159265358979323846
/* Largest angular order M accepted (stack buffers of 4M+1 phases; far beyond any
 * useful truncation for bodies that are not touching). */
#define SY_ARRAY_MAX_ORDER 64

struct sy_array_plan {
    sy_array_settings set;
    size_t n_types, n_bodies, n_headings;
    sy_array_type *types;
    sy_array_body *bodies;
    double *headings;
    sy_body_plan **bplan;      /* per type */
    size_t n_roots;            /* evanescent roots to compute per frequency */
    size_t M, Q, nn;           /* orders -M..M (nn = 2M+1), depth modes */
    /* pairs, row-major N x N: distance and direction from centre j to centre i,
     * and the number of depth modes coupled (0 on the diagonal) */
    double *pair_L, *pair_alpha;
    size_t *pair_nq;
    size_t *nq;                /* per body: depth modes among the unknowns (>= 1) */
    size_t *ord;               /* per body and depth mode (i Q + q): M_iq, orders -M_iq..M_iq
                                  kept (meaningful for q < nq[i]; M_i0 = M) */
    size_t *blk_off;           /* per body and depth mode (i Q + q): unknown of order -M_iq */
    double *lsend;             /* per body, depth mode and order ((i Q + q) (M+1) + |n|): log of
                                  the bound B^i_{qn} <= 1 on the scaled outgoing amplitude
                                  (plan.c, "sending bound"); 0 where not sharpened */
    size_t *unk_off;           /* per body, length N + 1 */
    size_t n_unknowns;
    size_t n_full;             /* unknowns with 2M+1 orders in every kept depth mode */
    int full_orders;           /* 1: per-mode angular truncation off (M_iq = M) */
    size_t *dof_off;           /* per body, length N + 1 */
    size_t n_dof;
    size_t *dof_body;          /* per dof */
    int *dof_mode;             /* per dof, 1..5 */
    size_t n_rad;              /* radiating dofs (floats only) */
    size_t *rad_dof;           /* per radiating column: its dof index */
    size_t *rad_first;         /* per body, length N + 1: its first radiating column */
    size_t n_rhs;              /* n_headings + n_rad */
    size_t dropped;            /* (pair, evanescent mode) couplings dropped */
};

struct sy_array_work {
    size_t n_types;
    double complex *roots_k;          /* n_roots */
    sy_wave_roots roots;
    sy_body_work **bwork;             /* per type */
    sy_body_waves **bwaves;           /* per type */
    double *scale;                    /* per type: Q x (M+1), s_{q|n|} */
    double complex *pairfn;           /* per ordered pair slot i < j (i N + j), per depth
                                         mode q: orders 0..2M of H_p(k0 L) (q = 0) or
                                         K_p(kq L) (q >= 1), (4M+1) values with room */
    double complex *mat;              /* n_u x n_u row-major I - D~ T~, then the LU of its
                                         transpose (column-major view, solve.c) */
    int *pivots;                      /* n_u (lapack_int) */
    /* right-hand sides column after column: element u of column c at [c n_u + u];
     * columns: headings, then radiating dofs (plan->rad_dof) */
    double complex *inc;              /* direct incident alpha (the total is not formed) */
    double complex *sol;              /* right-hand sides D~ inc, then beta */
    double complex *fn;               /* 2M + 2 Bessel values */
    double complex *blk;              /* (2M+1)^2: one translation block */
    double complex *force;            /* n_dof x n_rhs */
    double complex *gt;               /* n_dof x n_u row-major: G~^i T~^{ij} for the body i
                                         of each dof (zero in its own columns), the force
                                         per unit scattered amplitude of the other bodies */
    int factored;                     /* mat holds a valid LU */
    double complex omega;             /* of the last factorisation */
};

/* sy_array_plan_create with the per-mode angular truncation switched off when
 * full_orders != 0 (every kept depth mode carries all 2M+1 orders): the reference the
 * tests and the benchmark compare the reduced truncation with. */
int syi_array_plan_create(sy_array_plan **out, const sy_array_settings *settings,
                          const sy_array_type *types, size_t n_types, const sy_array_body *bodies,
                          size_t n_bodies, const double *headings, size_t n_headings, int full_orders,
                          sy_error *err);
/* Fill work->roots, body results and scalings at omega (steps 1-2 of a solve). */
int syi_array_prepare(const sy_array_plan *plan, double complex omega, sy_array_work *work,
                      sy_error *err);
/* Bessel rows of every coupled pair and depth mode at the prepared omega (needs prepare). */
int syi_array_translation(const sy_array_plan *plan, sy_array_work *work, sy_error *err);
/* The (2M_iq+1) x (2M_jq+1) block T~^{ij}_q (row m of body i, column n of body j,
 * row-major, leading dimension 2M_jq+1): alpha^i_{qm} += sum_n T~[m, n] beta^j_{qn}.
 * Needs syi_array_translation; q must be < pair_nq[i N + j]. */
void syi_array_block(const sy_array_plan *plan, const sy_array_work *work, size_t i, size_t j,
                     size_t q, double complex *out);
/* Scale s_{qn} of body type t at depth mode q, order n (any sign). */
static inline double syi_array_scale(const sy_array_plan *plan, const sy_array_work *work,
                                     size_t t, size_t q, long n)
{
    size_t an = (size_t)(n < 0 ? -n : n);
    return work->scale[(t * plan->Q + q) * (plan->M + 1) + an];
}

/* Highest angular order M_iq kept for depth mode q of body i (q < nq[i]). */
static inline size_t syi_array_order(const sy_array_plan *plan, size_t i, size_t q)
{
    return plan->ord[i * plan->Q + q];
}
/* Index of unknown (body i, depth mode q, order n), |n| <= M_iq. */
static inline size_t syi_array_unknown(const sy_array_plan *plan, size_t i, size_t q, long n)
{
    return plan->blk_off[i * plan->Q + q] + (size_t)(n + (long)plan->ord[i * plan->Q + q]);
}

#endif
