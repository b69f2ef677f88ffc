/* Private to the poles module: the generic nonlinear eigenvalue solver behind the motion
 * and scattering resonance searches.
 *
 * Problem: find omega inside a closed contour where T(omega) v = 0, T analytic (n x n).
 * The caller supplies one function that, at a complex omega, factorises T and returns
 * T^-1 applied to a block of right-hand sides and log det T (for the argument-principle
 * count). Method: Beyn (2012), "An integral method for solving nonlinear eigenvalue
 * problems", Linear Algebra Appl. 436, with the higher-moment block-Hankel form (his
 * section 5) so that more eigenvalues than n can be found: moments
 *   A_p = (1 / 2 pi i) oint z^p T(z)^-1 V dz,   p = 0 .. 2K-1
 * by the trapezoid rule on an ellipse (exponentially convergent for analytic
 * integrands), SVD of the block Hankel matrix of A_0..A_{2K-2}, a small eigenproblem
 * for the eigenvalues; then each is polished by a secant iteration on the analytic
 * scalar g(omega) = 1 / (u^T T(omega)^-1 v) (zero at the eigenvalue; u = v for the
 * complex-symmetric T of reciprocal systems), and counted against the winding number of
 * det T along the contour (the argument principle). */
#ifndef SY_POLES_IMPL_H
#define SY_POLES_IMPL_H

#include <complex.h>
#include <stddef.h>
#include "swellyield/core.h"

/* At omega: factorise T(omega); if nrhs > 0 solve T x = rhs for the n x nrhs column-major
 * block rhs (x may alias rhs); if logdet != NULL return log det T (imaginary part mod
 * 2 pi). Returns a status; SY_ESINGULAR exactly at an eigenvalue. */
typedef int (*syi_nep_solve)(void *ctx, double complex omega, size_t nrhs, const double complex *rhs,
                             double complex *x, double complex *logdet, sy_error *err);

typedef struct syi_nep {
    size_t n;
    syi_nep_solve solve;
    void *ctx;
    double scale;           /* typical size of T's entries, for relative residuals */
} syi_nep;

/* Ellipse omega(t) = centre + ax cos t + i ay sin t. */
typedef struct syi_ellipse {
    double complex centre;
    double ax, ay;
} syi_ellipse;

typedef struct syi_nep_settings {
    size_t n_points;        /* quadrature points on the contour (e.g. 64) */
    size_t n_columns;       /* probing columns l (<= n) */
    size_t n_moments;       /* K: capacity K * l eigenvalues */
    double rank_tol;        /* singular values below rank_tol * sigma_max are dropped */
    double polish_tol;      /* relative step at which the secant polish stops (1e-12) */
    unsigned long seed;     /* probing matrix seed (deterministic runs) */
} syi_nep_settings;

typedef struct syi_nep_eig {
    double complex omega;   /* polished eigenvalue */
    double complex *v;      /* n: eigenvector, largest entry 1 (caller storage) */
    double residual;        /* |v| / |T^-1 v| relative to the scale of T at omega */
    int converged;          /* 1 if the polish met polish_tol */
} syi_nep_eig;

typedef struct syi_nep_result {
    size_t n_found;         /* eigenvalues inside the contour, distinct */
    int count;              /* argument-principle count (winding number of det T) */
    size_t evaluations;     /* calls of solve (contour + polish) */
} syi_nep_result;

/* Find eigenvalues inside the ellipse. eig[0..max_eig-1] must have v arrays of n entries.
 * SY_ENOCONV if max_eig is too small; statuses of solve otherwise. */
int syi_nep_contour(const syi_nep *p, const syi_ellipse *c, const syi_nep_settings *s, syi_nep_eig *eig,
                    size_t max_eig, syi_nep_result *res, sy_error *err);

/* Is omega strictly inside the ellipse (with relative margin m: 0 none)? */
int syi_ellipse_inside(const syi_ellipse *c, double complex omega, double m);

#endif

/* ---- The array's mechanical impedance at a complex frequency (impedance.c) ----------
 * Z(omega) = C + K_pto - omega^2 M - i omega (Z_rad(omega) + B_pto + B_visc), n_dof x n_dof
 * row-major, body-major dofs (conventions.md equation of motion; Z_rad = B - i omega A from
 * sy_array_solve). Used by the time response (response.c) and by tests; one object per
 * thread (it owns array work). */
struct sy_model;
typedef struct syi_imp syi_imp;

/* with_pto: 1 adds each device's PTO damping and stiffness on its PTO dof (heave). */
int syi_imp_create(syi_imp **out, const struct sy_model *model, int with_pto, sy_error *err);
void syi_imp_free(syi_imp *imp);
size_t syi_imp_n_dof(const syi_imp *imp);
/* Dof index of body b's heave (SIZE_MAX if the body has no heave dof). */
size_t syi_imp_heave_dof(const syi_imp *imp, size_t body);
/* z[n*n] = Z(omega); zrad[n*n] (optional, NULL) = Z_rad + B_pto + B_visc, i.e. everything
 * multiplied by -i omega. Rows/columns body-major, row-major storage. */
int syi_imp_eval(syi_imp *imp, double complex omega, double complex *z, double complex *zdamp, sy_error *err);
/* Static stiffness K0 = Z(0) = C + K_pto (row-major, owned by imp), and mass M. */
const double *syi_imp_k0(const syi_imp *imp);
const double *syi_imp_mass(const syi_imp *imp);
/* B_pto + B_visc per dof (diagonal, [n_dof]); body index and mode (1..5) of dof d. */
const double *syi_imp_damping(const syi_imp *imp);
void syi_imp_dof(const syi_imp *imp, size_t d, int *body, int *mode);
