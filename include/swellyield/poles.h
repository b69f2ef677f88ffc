/* Complex resonances (poles) of the array, conventions.md: omega = omega_r - i gamma with
 * gamma > 0, quality factor Q = omega_r / (2 gamma).
 *
 * Two families:
 *   MOTION      zeros of det Z(omega), Z = C + K_pto - omega^2 M - i omega (Z_rad(omega)
 *               + B_pto + B_visc), Z_rad = B - i omega A of the whole array continued to
 *               complex omega (the equation of motion of conventions.md); with
 *               SY_POLES_NO_PTO the same without the PTO;
 *   SCATTERING  zeros of det(I - D T), the multiple-scattering operator of the array held
 *               fixed (near-trapped waves between bodies).
 * Method (src/poles/poles_impl.h): one ellipse covering the model's [resonance] region
 * (the rectangle scaled by sqrt 2); all families asked for share its 64 points, each point
 * one array solve. Motion: contour integrals (Beyn 2012) on Z^-1, the number of
 * eigenvalues extracted set by the singular values of the moments (floor: the body
 * solver's accuracy) and checked against the argument-principle bounds
 * winding(det Z) <= zeros of Z <= winding(det Z) + winding(det(I - D T)) (Z is meromorphic:
 * its poles are the coupled scattering resonances). Scattering: Delves-Lyness power sums of
 * the zeros of det(I - D T) from the same contour's log-determinants (free with each array
 * solve). Every pole is polished to a predicted error of max(1e-12, tolerance / 100)
 * relative (the float body's truncation, chosen per frequency from [solve] tolerance, makes
 * T analytic only to about that level; use tolerance 1e-8 or tighter for poles to 1e-10):
 * motion poles by a Newton step whose derivative comes from the contour's residue (one
 * evaluation when the contour estimate is already accurate, two or three otherwise), then
 * a secant; scattering poles by a secant on det(I - D T), on its square root where the
 * secant's rate shows a double zero (the two-dimensional representations of a symmetric
 * layout: such a zero is listed twice, as the count has it). The residual and the mode
 * come from the last evaluation, within the final step of the pole. A motion count below
 * the upper bound winding(det Z) + winding(det(I - D T)) is accepted without a check that
 * the scattering zeros left over are not poles of Z (a zero whose wave pattern does not
 * move the bodies' dofs, e.g. by symmetry, decouples): `found` within [lower, upper] is
 * what the search verifies.
 * The phase of the determinants is tracked continuously, with extra points where it turns
 * fast (det(I - D T) turns quickly well below the real axis: there the scattering count
 * needs many points, see docs/benchmarks.md). Where a family's count, rank and found
 * disagree, the region is halved along Re omega (at most twice: 1, 2, 4 ellipses).
 * Found poles are those inside the searched ellipse(s), each once. */
#ifndef SWELLYIELD_POLES_H
#define SWELLYIELD_POLES_H

#include <complex.h>
#include "swellyield/core.h"
#include "swellyield/model.h"

#ifdef __cplusplus
extern "C" {
#endif

typedef enum { SY_POLE_MOTION = 0, SY_POLE_MOTION_NO_PTO = 1, SY_POLE_SCATTERING = 2 } sy_pole_kind;

#define SY_POLES_MOTION 1u
#define SY_POLES_NO_PTO 2u
#define SY_POLES_SCATTERING 4u
#define SY_POLES_NOT_SEARCHED (-1000000)

SY_API const char *sy_pole_kind_name(sy_pole_kind kind);

typedef struct sy_pole {
    double complex omega;    /* omega_r - i gamma, rad/s */
    double omega_r, gamma;   /* rad/s */
    double q;                /* omega_r / (2 gamma) (INFINITY for a real pole) */
    sy_pole_kind kind;
    double residual;         /* |Z v| / (|Z| |v|) at the last evaluation of the polish (within
                                its final step); SCATTERING: last step / |omega| */
    int converged;           /* polish met 1e-10 */
    const double complex *mode; /* MOTION: complex amplitude of every dof (n_dof), largest 1;
                                   SCATTERING (models with one dof per body, else NULL):
                                   per body, the amplitude of the waves it scatters in the
                                   resonance (2-norm of its outgoing partial-wave
                                   coefficients in the null vector of I - D T, each
                                   measured at the body's radius), with the phase of its
                                   axisymmetric propagating coefficient; largest 1 */
} sy_pole;

typedef struct sy_pole_set {
    size_t n;
    sy_pole *poles;              /* sorted by omega_r */
    size_t n_dof;
    double complex *modes;       /* storage for the mode shapes */
    int count[3];                /* argument-principle count per kind (SY_POLES_NOT_SEARCHED: not searched) */
    size_t found[3];             /* poles found per kind */
    size_t evaluations;          /* complex-frequency array evaluations (contour + polish + modes) */
    size_t evaluations_contour;  /* of which quadrature points of the contour(s) */
    size_t evaluations_tracking; /* of which extra points of the phase tracking */
    double complex centre;       /* the ellipse used: centre and semi-axes, rad/s */
    double ax, ay;
} sy_pole_set;

/* 1 if poles[i] repeats an earlier pole of the same kind in set (a multiple pole is
 * listed once per independent mode shape): same omega within 1e-6 relative, above the
 * polish accuracy (1e-8 or better) and far below any distinct resonances' spacing that
 * a band (width 4 gamma) or a picture could resolve. */
SY_API int sy_pole_repeats(const sy_pole_set *set, size_t i);
/* 1 if a and b are one (multiple) pole by that rule: same kind, omega within 1e-6. */
SY_API int sy_pole_same(const sy_pole *a, const sy_pole *b);

/* Search the model's [resonance] region for the families in `kinds`. The layout, PTO and
 * truncation are the model's. SY_EINPUT if the model has no [resonance] region,
 * SY_ENOCONV if the contour capacity was too small (message says what to change). */
SY_API int sy_poles_find(sy_pole_set **out, const sy_model *model, unsigned kinds, sy_error *err);
/* The same with a progress callback (may be NULL) called after each contour point with
 * (ctx, points done, points on the contour); threads: one search per model at a time. */
SY_API int sy_poles_find_progress(sy_pole_set **out, const sy_model *model, unsigned kinds,
                                  void (*progress)(void *ctx, size_t done, size_t total), void *progress_ctx,
                                  sy_error *err);
SY_API void sy_pole_set_free(sy_pole_set *set);

#ifdef __cplusplus
}
#endif
#endif
