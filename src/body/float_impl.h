/* Private to the float body kind (floating truncated vertical cylinder): plan and work
 * layouts shared by float.c (ops, work), float_plan.c (geometry-only set-up) and
 * float_solve.c (per-frequency solve). The method is described in float_plan.c.
 *
 * Notation (SI units): a radius, d draft, h depth, b = h - d gap height under the body,
 * z_rot centre of rotation; t = (z + h) / b in [0, 1] on the gap r = a, -h < z < -d.
 * Gap basis (edge-weighted Gegenbauer, nu = 1/6, even about the seabed t = 0):
 *   f_p(t) = (2 / gamma_p) (1 - t^2)^(-1/3) C_{2p}^{(1/6)}(t),  p = 0..P-1,
 * normalised so that int_0^1 f_p(t) cos(x t) dt = (-1)^p x^(-nu) J_{2p+nu}(x).
 * A second family with nu2 = 5/6, (1 - t^2)^(+1/3) C_{2p}^{(5/6)}(t), carries the next
 * corner term (velocity ~ (1 - t)^(+1/3), the 270-degree corner's second eigen-solution);
 * the gap functions are indexed l = 0..PG-1 with family order nu_l and index ord_l.
 * Wall functions, extended into the gap by their corner value so that the Galerkin part
 * carries only the singular and higher corner terms: w_1 = 1 on -h < z < 0 and
 * w_z = max(z, -d). A radiation profile's velocity on r = a is v_1 w_1 + v_z w_z +
 * sum_p alpha_p f_p (surge v = (1, 0), pitch v = (-z_rot, 1)).
 * "Basis index" l: 0..P-1 gap functions, P -> w_1, P+1 -> w_z (only for orders m <= 1).
 */
#ifndef SY_BODY_FLOAT_IMPL_H
#define SY_BODY_FLOAT_IMPL_H

#include <complex.h>
#include "body_impl.h"

#define SYI_PI 3.14159265358979323846
#define SYI_FLOAT_NU (1.0 / 6.0)   /* Gegenbauer index: weight (1 - t^2)^(nu - 1/2) */
#define SYI_FLOAT_NU2 (5.0 / 6.0)  /* second family: weight (1 - t^2)^(+1/3) */
#define SYI_FLOAT_PMAX 24          /* largest number of gap functions a plan may use */
#define SYI_FLOAT_LEVELS 2         /* truncation levels solved per frequency: 0 coarse, 1 fine */
#define SYI_FLOAT_QLEV 5           /* ladder of exterior truncations Qx[0] * 2^i */

typedef struct syi_float_plan {
    double a, d, h, b, z_rot;
    size_t M, Q;                   /* output orders 0..M, depth modes 0..Q-1 */
    size_t P[SYI_FLOAT_LEVELS];    /* gap functions per level */
    size_t gidx[SYI_FLOAT_LEVELS][SYI_FLOAT_PMAX]; /* their basis indices l */
    size_t PG;                     /* gap functions in the basis (fine level) */
    double nu_l[SYI_FLOAT_PMAX];   /* family order of gap function l */
    int ord_l[SYI_FLOAT_PMAX];     /* p of gap function l within its family */
    size_t nfam[2];                /* functions per family */
    size_t Qx[SYI_FLOAT_QLEV];     /* ladder of exterior mode counts; per frequency the fine
                                    * level is the first i >= 1 with 2 b |K| / (pi Qx[i]) <=
                                    * q_ratio (or the last), the coarse level is i - 1 */
    size_t nqlev;                  /* rungs in the ladder */
    double q_ratio;
    size_t L;                      /* PG + 2: basis size for orders m <= 1 (walls PG, PG+1) */
    double m0[SYI_FLOAT_PMAX];     /* int_0^1 f_p dt */
    double m2[SYI_FLOAT_PMAX];     /* int_0^1 t^2 f_p dt */
    /* Interior (r < a) sums, omega independent, for m = 0..M:
     * sint[m][p][p'] = sum_j G_pj G_p'j / (M_j Ihat'_j) (j >= 1 for m = 0, else j >= 0). */
    double *sint;                  /* (M+1) L L, basis index l as above */
    double bg_heave[SYI_FLOAT_PMAX + 2];  /* m = 0: sum_j G_lj (-1)^j Bw_j / (M_j Ihat'_j) */
    double bg_pitch[SYI_FLOAT_PMAX + 2];  /* m = 1, pitch bottom profile W = -r */
    double pint_pitch[SYI_FLOAT_PMAX + 2];/* m = 1: sum_j P_j G_lj / (M_j Ihat'_j) */
    double phi_heave[SYI_FLOAT_PMAX + 2]; /* int_gap phi_p(a, z) f_l dz, heave particular */
    double phi_pitch[SYI_FLOAT_PMAX + 2]; /* same, pitch particular */
    double bp_pitch;               /* sum_j P_j (-1)^j Bw_j / (M_j Ihat'_j), pitch-pitch */
    double bpp_heave, bpp_pitch;   /* int_0^a phi_p(r, -d) W r dr */
    double bw0_heave;              /* int_0^a W r dr for the m = 0 constant interior mode */
    double p0_heave;               /* m = 0 flux constraint: int_gap d_r phi_p dz = -a/2 */
    /* Exterior tails beyond Qx[i], from the reference wavenumbers q pi / h:
     * sum_{q > Qx} E(k_q) = rtail + K t1 + K^2 t2 + O(K^3), K = omega^2 / g.
     * Each (M+1) L L per rung, row-major [m][l][l']. */
    double *rtail[SYI_FLOAT_QLEV], *t1[SYI_FLOAT_QLEV], *t2[SYI_FLOAT_QLEV];
} syi_float_plan;

typedef struct syi_float_work {
    size_t nq;                     /* exterior modes q = 0..nq-1 of this frequency */
    size_t qf, qc;                 /* fine and coarse rungs of this frequency */
    double complex *proj;          /* nq L: int Z_q f_l dz (gap and wall) */
    double complex *norm;          /* nq: int_{-h}^0 Z_q^2 dz */
    double complex *kap;           /* nq (M+1): Hhat_q / Hhat_q' at r = a */
    double complex *ip_hp;         /* (M+1) Q: Jhat_q' / Hhat_q' */
    double complex *w_hp;          /* (M+1) Q: (Jhat Hhat' - Hhat Jhat') / Hhat' */
    double complex *inh;           /* (M+1) Q: 1 / (N_q Hhat_q') */
    double complex *ext;           /* LEVELS (M+1) L L: exterior Gram sums */
    double complex *mat;           /* (P1+1)^2 system matrix */
    double complex *rhs;           /* (P1+1) ncol right-hand sides */
    double complex *kbuf;          /* scratch for Bessel arrays, M + 3 */
    double complex *kbuf2;         /* second scratch, M + 3 */
    size_t ncol;                   /* Q + 2 columns */
    double complex *rt;            /* 3 Q: radiated coefficients by profile */
    double complex *fdif;          /* 3 Q: profile functionals of diffraction, |m| <= 1 */
} syi_float_work;

/* float_plan.c */
/* P_force, Qx_force: 0 = choose from plan->tolerance, else force that truncation. */
int syi_float_plan_build(syi_float_plan *fp, const sy_body_plan *plan, size_t P_force,
                         size_t Qx_force, int P2_force, sy_error *err);
void syi_float_plan_release(syi_float_plan *fp);

/* float.c: a float plan with forced truncation (P first-family and P2 second-family gap
 * functions, Qx exterior modes at the fine level; P2 < 0: default), for convergence
 * studies and tests; otherwise as sy_body_plan_create. */
int syi_body_float_plan_create(sy_body_plan **out, const sy_body_geometry *geom, double h,
                               size_t P, int P2, size_t Qx, size_t n_order, size_t n_depth,
                               sy_error *err);

/* float_solve.c */
int syi_float_solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                    syi_float_work *w, sy_body_waves *out, sy_error *err);

/* Shared small helpers (float_plan.c). */
/* Unnormalised projections at wavenumber k (evanescent form cos(k (z + h))): the PG gap
 * functions into g[0..PG-1], then w_1, w_z when nw = 2. b (-1)^p x^(-nu) J_mu(x), x = k b. */
int syi_float_proj_cos(const syi_float_plan *fp, size_t nw, double complex k,
                       double complex *g, sy_error *err);
/* Small dense complex solve with partial pivoting, n <= 17, ncol right-hand sides
 * stored row-major rhs[i * ncol + c]. Overwrites mat. SY_ESINGULAR on a zero pivot. */
int syi_float_lsolve(double complex *mat, size_t n, double complex *rhs, size_t ncol,
                     sy_error *err);

#endif
