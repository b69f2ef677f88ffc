/* Complex resonances (poles) of the array, conventions.md: omega = omega_r - i gamma with
 * gamma > 0, quality factor Q = omega_r / (2 gamma).
 *
 * Two families:
 *   MOTION      zeros of det Z(omega), Z = C + K_pto - omega^2 M - i omega (Z_rad(omega)
 *               + B_pto + B_visc), Z_rad = B - i omega A of the whole array continued to
 *               complex omega (the equation of motion of conventions.md); with
 *               SY_POLES_NO_PTO the same without the PTO;
 *   SCATTERING  zeros of det(I - D T), the multiple-scattering operator of the array held
 *               fixed (near-trapped waves between bodies). Counted by the argument
 *               principle (count[SY_POLE_SCATTERING]); their locations are not yet
 *               computed (TODO(#6)), so found[] stays 0 for this family.
 * Method: contour integrals (Beyn 2012) on an ellipse covering the model's [resonance]
 * region, sized by the argument-principle count, each pole polished by a secant
 * iteration to max(1e-12, tolerance / 100) relative (the float body's truncation, chosen
 * per frequency from [solve] tolerance, makes T analytic only to about that level; use
 * tolerance 1e-8 or tighter for poles to 1e-10), see src/poles/poles_impl.h. For the motion family the
 * count is the winding number of det Z, i.e. zeros minus poles of det Z inside (Z_rad can
 * have poles where the bodies' own scattering is resonant, at close spacing): the count then
 * falls short of the zeros, and as it also caps the number of eigenvalues extracted
 * (the singular values of the moments are polluted by the float's per-frequency
 * truncation), poles can be missed at such spacings (open, issue #6). */
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
    double residual;         /* |Z v| / (|Z| |v|) estimate at the polished pole */
    int converged;           /* polish met 1e-10 */
    const double complex *mode; /* MOTION: complex amplitude of every dof (n_dof), largest 1;
                                   SCATTERING: NULL */
} sy_pole;

typedef struct sy_pole_set {
    size_t n;
    sy_pole *poles;              /* sorted by omega_r */
    size_t n_dof;
    double complex *modes;       /* storage for the mode shapes */
    int count[3];                /* argument-principle count per kind (SY_POLES_NOT_SEARCHED: not searched) */
    size_t found[3];             /* poles found per kind */
    size_t evaluations;          /* complex-frequency array evaluations (contour + polish) */
    double complex centre;       /* the ellipse used: centre and semi-axes, rad/s */
    double ax, ay;
} sy_pole_set;

/* Search the model's [resonance] region for the families in `kinds`. The layout, PTO and
 * truncation are the model's. SY_EINPUT if the model has no [resonance] region,
 * SY_ENOCONV if the contour capacity was too small (message says what to change). */
SY_API int sy_poles_find(sy_pole_set **out, const sy_model *model, unsigned kinds, sy_error *err);
SY_API void sy_pole_set_free(sy_pole_set *set);

#ifdef __cplusplus
}
#endif
#endif
