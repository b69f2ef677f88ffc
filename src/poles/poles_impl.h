/* Private to the poles module: the generic nonlinear eigenvalue solver behind the motion
 * and scattering resonance searches.
 *
 * Problem: find omega inside a closed contour where T(omega) v = 0, T analytic (n x n), or,
 * for a determinant-only problem (n = 0), where an analytic scalar f(omega) vanishes (f is
 * given through log f). Several problems may share the contour points (the motion and
 * scattering searches of one array share every array solve); each problem has its own
 * callback, which at a complex omega factorises T and returns T^-1 applied to a block of
 * right-hand sides, log det T, and optionally log p(omega) of an analytic function p whose
 * zeros are the poles of T (T meromorphic).
 *
 * Method, matrix problems: Beyn (2012), "An integral method for solving nonlinear
 * eigenvalue problems", Linear Algebra Appl. 436, with the higher-moment block-Hankel form
 * (his section 5): moments
 *   A_p = (1 / 2 pi i) oint u^p T(z)^-1 V dz,  u = (z - c) / rho,  p = 0 .. 2K-1
 * by the trapezoid rule on an ellipse (exponentially convergent for analytic integrands;
 * the scaled variable u keeps the block Hankel matrices well conditioned), SVD of the block
 * Hankel matrix, a small eigenproblem for the eigenvalues and the residues of T^-1 V; then
 * each is polished on the analytic scalar g(omega) = 1 / (v^H T(omega)^-1 V c) with c
 * chosen so that the residue is v at this eigenvalue and 0 at its neighbours: g' = 1 there,
 * so the first step is Newton's from one evaluation, then a secant (contour.c, polish()).
 * Determinant-only problems: Delves & Lyness (1967), "A numerical method for locating the
 * zeros of an analytic function", Math. Comp. 21: power sums
 *   s_p = (1 / 2 pi i) oint u^p f'(z) / f(z) dz = sum over zeros u_k^p,
 * from the unwrapped log f along the contour (its periodic part differentiated spectrally),
 * the zeros as eigenvalues of the Hankel pencil (s_{i+j+1}, s_{i+j}) (the moment form of
 * Kravanja & Van Barel, "Computing the zeros of analytic functions", LNM 1727, 2000), then a
 * secant polish on f (on f^(1/2) for a double zero, recognised by the secant's linear
 * rate), with deflation of the zeros already found when two converge to one.
 *
 * Counting (argument principle): the winding of det T along the contour is zeros minus poles
 * of det T inside; with the pole function p, zeros of T inside = winding(det T) + winding(p)
 * when every pole of T is a zero of p (and a zero of p that is not a pole of T makes this an
 * upper bound: res.count_low, res.count). The phase is tracked continuously: where it jumps
 * by more than MAX_PHASE_STEP between neighbouring points the interval is bisected
 * (log-determinants only, no right-hand sides), at most REFINE_DEPTH times.
 * Rank (matrix problems): singular values of the moment matrix above a floor set by the
 * accuracy of T (settings.noise, relative: the body solver's tolerance) and rank_tol; the
 * rank must lie between the two counts, otherwise res.consistent = 0 and the caller should
 * split the region. */
#ifndef SY_POLES_IMPL_H
#define SY_POLES_IMPL_H

#include <complex.h>
#include <stddef.h>
#include "swellyield/core.h"

/* At omega: factorise T(omega); if nrhs > 0 solve T x = rhs for the n x nrhs column-major
 * block rhs (x may alias rhs); if logdet != NULL return log det T (imaginary part mod 2 pi;
 * for n = 0: log f); if logpole != NULL return log p(omega) of the pole function (0 when
 * T has no poles). Returns a status; SY_ESINGULAR exactly at an eigenvalue. */
typedef int (*syi_nep_solve)(void *ctx, double complex omega, size_t nrhs, const double complex *rhs,
                             double complex *x, double complex *logdet, double complex *logpole, sy_error *err);

typedef struct syi_nep {
    size_t n;               /* matrix size; 0: determinant-only problem (log f via logdet) */
    syi_nep_solve solve;
    void *ctx;
    double scale;           /* typical size of T's entries, for relative residuals */
} syi_nep;

/* Ellipse omega(t) = centre + ax cos t + i ay sin t. */
typedef struct syi_ellipse {
    double complex centre;
    double ax, ay;
} syi_ellipse;

typedef void (*syi_nep_progress)(void *ctx, size_t done, size_t total);

typedef struct syi_nep_settings {
    size_t n_points;        /* quadrature points on the contour (e.g. 64) */
    size_t n_columns;       /* probing columns l (<= n; matrix problems) */
    size_t n_moments;       /* K at most: capacity K * l eigenvalues (the solver uses the
                               smallest K that holds the count) */
    double rank_tol;        /* singular values below rank_tol * sigma_max are dropped */
    double polish_tol;      /* relative step at which the secant polish stops (1e-12) */
    unsigned long seed;     /* probing matrix seed (deterministic runs) */
    double noise;           /* relative accuracy of T's evaluation (0: exact) */
    syi_nep_progress progress; /* after each contour point (may be NULL) */
    void *progress_ctx;
} syi_nep_settings;

typedef struct syi_nep_eig {
    double complex omega;   /* polished eigenvalue */
    double complex *v;      /* n: eigenvector, largest entry 1 (caller storage; unused for n = 0) */
    double residual;        /* |v| / |T^-1 v| relative to the scale of T (n = 0: |polish step| / |omega|) */
    int converged;          /* 1 if the polish met polish_tol */
    int multiplicity;       /* determinant-only problems: 2 for a double zero (polished on
                               f^(1/2)), else 1; listed as two entries of eig */
} syi_nep_eig;

typedef struct syi_nep_result {
    size_t n_found;         /* eigenvalues inside the contour, distinct */
    int count;              /* argument-principle count: winding(det T) + winding(p) */
    int count_low;          /* winding(det T) alone (zeros minus poles of det T) */
    size_t rank;            /* eigenvalues extracted from the moments (matrix problems) */
    int consistent;         /* rank within [count_low, count] and found == rank */
    int near_edge;          /* a found eigenvalue lies close to the contour */
    size_t refined;         /* extra points evaluated for the phase tracking */
    size_t evaluations;     /* calls of solve (contour + refinement + polish) */
} syi_nep_result;

/* Find the eigenvalues of n_prob problems sharing the contour points: the callbacks are
 * called point by point in problem order, so a shared context can reuse one expensive
 * evaluation per point. eig[q][0..max_eig[q]-1] must have v arrays of p[q].n entries.
 * SY_ENOCONV if the capacity or max_eig is too small; statuses of solve otherwise. */
#define SYI_NEP_MAX_PROBLEMS 4
int syi_nep_contour_multi(const syi_nep *p, size_t n_prob, const syi_ellipse *c, const syi_nep_settings *s,
                          syi_nep_eig *const *eig, const size_t *max_eig, syi_nep_result *res, sy_error *err);
/* One problem. */
int syi_nep_contour(const syi_nep *p, const syi_ellipse *c, const syi_nep_settings *s, syi_nep_eig *eig,
                    size_t max_eig, syi_nep_result *res, sy_error *err);

/* Is omega strictly inside the ellipse (with relative margin m: 0 none)? */
int syi_ellipse_inside(const syi_ellipse *c, double complex omega, double m);
/* Normalised radius of omega in the ellipse (< 1 inside). */
double syi_ellipse_radius(const syi_ellipse *c, double complex omega);

#endif

/* ---- The array's mechanical impedance at a complex frequency (impedance.c) ----------
 * Z(omega) = C + K_pto - omega^2 M - i omega (Z_rad(omega) + B_pto + B_visc), n_dof x n_dof
 * row-major, body-major dofs (conventions.md equation of motion; Z_rad = B - i omega A from
 * sy_array_solve). Used by the time response (response.c) and by tests; one object per
 * thread (it owns array work). */
struct sy_model;
typedef struct syi_imp syi_imp;

/* The model the pole search evaluates Z on (array_poles.c): the run's truncation, body
 * solves to 1e-9. */
void syi_poles_model(const struct sy_model *m, struct sy_model *mt);
/* with_pto: 1 adds each device's PTO damping and stiffness on its PTO dof (heave). */
int syi_imp_create(syi_imp **out, const struct sy_model *model, int with_pto, sy_error *err);
void syi_imp_free(syi_imp *imp);
size_t syi_imp_n_dof(const syi_imp *imp);
/* Dof index of body b's heave (SIZE_MAX if the body has no heave dof). */
size_t syi_imp_heave_dof(const syi_imp *imp, size_t body);
/* z[n*n] = Z(omega); zrad[n*n] (optional, NULL) = Z_rad + B_pto + B_visc, i.e. everything
 * multiplied by -i omega. Rows/columns body-major, row-major storage. */
int syi_imp_eval(syi_imp *imp, double complex omega, double complex *z, double complex *zdamp, sy_error *err);
/* log det(I - D T) of the array solve behind the last syi_imp_eval (the pole function of Z). */
int syi_imp_logdet_interaction(const syi_imp *imp, double complex *logdet, sy_error *err);
/* Static stiffness K0 = Z(0) = C + K_pto (row-major, owned by imp), and mass M. */
const double *syi_imp_k0(const syi_imp *imp);
const double *syi_imp_mass(const syi_imp *imp);
/* B_pto + B_visc per dof (diagonal, [n_dof]); body index and mode (1..5) of dof d. */
const double *syi_imp_damping(const syi_imp *imp);
void syi_imp_dof(const syi_imp *imp, size_t d, int *body, int *mode);

/* Residue of Z^-1 at the motion pole ps->poles[i] (R: n_dof x n_dof row-major): with the
 * entries of ps that are the same pole (sy_pole_same) and their independent modes
 * V = [v_1 .. v_r], R = V (V^T Z' V)^-1 V^T (response.h); Z' by a Cauchy integral on a
 * circle that keeps clear of the scattering poles in ps. z: 2 n^2 scratch. */
struct sy_pole_set;
int syi_pole_residue(syi_imp *imp, const struct sy_pole_set *ps, size_t i, double complex *R, double complex *z,
                     sy_error *err);
