/* Time response of the array by pole expansion (singularity expansion) next to the same
 * response by direct Fourier inversion of the real-frequency solution, to show what the
 * resonances (poles.h) say about the motion in time. Conventions.md: signals are
 * Re{X e^{-i omega t}}, x(t) = (1/2 pi) int X(omega) e^{-i omega t} d omega, motion poles
 * omega_p = omega_r - i gamma (gamma > 0) are the zeros of det Z(omega),
 *   Z(omega) = C + K_pto - omega^2 M - i omega (Z_rad(omega) + B_pto + B_visc).
 *
 * Two experiments, both on the heave of one body (all dofs respond):
 *   SY_RESPONSE_DECAY  the body is held at heave amplitude x0 (m), everything else at
 *                      rest, and released at t = 0 (free decay);
 *   SY_RESPONSE_PULSE  a half-sine heave force F0 sin(pi t / tau) on 0 < t < tau (N).
 *
 * Pole sum. Closing the inversion integral in the lower half plane (t > 0 for the decay,
 * t > tau for the pulse) picks up the residues of Z^-1 at the motion poles. For the
 * complex-symmetric Z (reciprocity) with Z(omega_p) v = 0, the residue is
 * v v^T / (v^T Z'(omega_p) v), and at a multiple (semisimple) pole listed once per
 * independent mode, V = [v_1 .. v_r], it is V (V^T Z' V)^-1 V^T (one term per distinct
 * pole). Z' is taken by an 8-point Cauchy integral on a circle of radius 2e-3 |omega_p|,
 * at most 1/4 of the distance to the nearest scattering pole in the set: Z itself has
 * poles there (Z_rad = Z_iso - F), often within 0.01 rad/s of a motion pole, and a circle
 * around one of them would spoil the residue. Z for the residues is the pole search's
 * (body solves to 1e-9, so the small circle does not amplify truncation noise); checked
 * against the contour integral of Z^-1 in tests/poles/test_array_poles.c. Each pole with
 * Re > 0 comes with its mirror -conj(omega_p), which contributes the complex conjugate:
 * (written for simple poles; R_p = V (V^T Z' V)^-1 V^T replaces v_p v_p^T / (v_p^T Z' v_p))
 *   decay:  x(t) = -2 Re sum_p v_p (v_p^T K0 x0) e^{-i omega_p t} / (omega_p v_p^T Z' v_p),
 *           K0 = Z(0) = C + K_pto (the holding force before release is K0 x0);
 *   pulse:  x(t) =  2 Re sum_p -i v_p (v_p^T e_b) F(omega_p) e^{-i omega_p t} / (v_p^T Z' v_p),
 *           F(omega) = int f(t) e^{i omega t} dt (closed form for the half-sine).
 * What a pole sum NEGLECTS: Z_rad has a branch point at omega = 0 (the Hankel functions'
 * logarithm), so the closed contour also wraps a branch cut down from omega = 0; its
 * integral (the non-pole or background part: slowly varying, non-oscillating) is left out,
 * and so are poles outside the model's [resonance] region. The background matters most at
 * early times (e.g. the pole-sum decay does not start exactly at x0); the pole terms decay
 * like e^{-gamma t}, and the background is small compared with them over the first periods
 * for a float, so agreement is best after the first few periods (measured in
 * tests/poles/test_response.c). The pulse pole sum holds only after the pulse (t > tau).
 *
 * Default grid: Omega = max(5, 5 max omega_r) rad/s, d_omega = min(gamma_min / 12, 0.01)
 * rad/s (Filon error ~1e-3 of the peak; several hundred array solves);
 * tests/poles/test_response.c uses Omega = 6 rad/s, d_omega = 0.005 rad/s for a float
 * resonating at 1.22 rad/s.
 * Direct inversion. x(t) = (1/pi) int_0^Omega (.) d omega on a uniform real grid
 * omega_j = j d_omega, j = 0..N (Omega = N d_omega), the smooth factor linear between grid
 * points and the oscillating e^{-i omega t} integrated exactly (piecewise-linear Filon
 * rule: error ~ d_omega^2 |g''| / 8, independent of t, no aliasing):
 *   decay:  x(t) = (1/pi) int_0^inf Im{ Z^-1 (omega M + i (Z_rad + B_pto + B_visc)) x0
 *           e^{-i omega t} } d omega   (t > 0), whose integrand tends to -x0/omega: the
 *           part beyond Omega is added in closed form, x0 (pi/2 - Si(Omega t)) / pi (its
 *           t -> 0+ limit at t = 0, so the direct curve starts at x0).
 *   pulse:  x(t) = (1/pi) int_0^inf Re{ Z^-1 F(omega) e_b e^{-i omega t} } d omega
 *           (integrand ~ omega^-4 beyond Omega: cut off).
 * At omega = 0 (where the hydrodynamics is not evaluated) the integrand is taken from
 * Z(0) = K0, assuming Z_rad(0) = 0 (radiation damping and omega A vanish at zero
 * frequency in finite depth). */
#ifndef SWELLYIELD_RESPONSE_H
#define SWELLYIELD_RESPONSE_H

#include <complex.h>
#include <stddef.h>
#include "swellyield/core.h"
#include "swellyield/model.h"
#include "swellyield/poles.h"

#ifdef __cplusplus
extern "C" {
#endif

typedef enum { SY_RESPONSE_DECAY = 0, SY_RESPONSE_PULSE = 1 } sy_response_kind;

typedef struct sy_response_settings {
    sy_response_kind kind;
    size_t body;        /* layout index of the released / pushed body (must have heave) */
    double amplitude;   /* DECAY: initial heave x0, m; PULSE: peak force F0, N */
    double duration;    /* PULSE: half-sine length tau, s (> 0); DECAY: unused */
    double t_end;       /* output times t_j = j t_end / (n_times - 1), s (> 0) */
    size_t n_times;     /* >= 2 */
    double omega_max;   /* direct inversion grid end Omega, rad/s (0: 5 max(omega_r), >= 5) */
    double d_omega;     /* grid step, rad/s (0: min(gamma_min / 12, 0.01)) */
} sy_response_settings;

typedef struct sy_response {
    sy_response_kind kind;
    size_t n_times, n_dof;
    double *t;          /* [n_times] s */
    double *pole_sum;   /* [j * n_dof + d] motion of dof d at t_j (m, rad), pole expansion */
    double *direct;     /* [j * n_dof + d] the same by direct Fourier inversion */
    int *dof_body, *dof_mode;  /* [n_dof] body index and mode (3 = heave) of each dof */
    size_t excited_dof; /* the dof released or pushed */
    size_t n_poles;     /* distinct motion poles used (Re omega_p > 0; mirrors implied; a
                           multiple pole, listed once per mode, counts once) */
    size_t n_omega;     /* real frequencies evaluated by the direct inversion */
    double omega_max, d_omega;
} sy_response;

/* Compute both responses. `poles` from sy_poles_find(model, SY_POLES_MOTION) (its
 * SY_POLE_MOTION poles and mode shapes are used; others are ignored). Cost: n_omega + 8 x
 * (poles) array solves. Returns SY_EINVAL for bad settings (message names the field),
 * SY_EINPUT if the body has no heave dof, statuses of the array solves. Result
 * caller-owned (sy_response_free). Threads may share model and poles (read only). */
SY_API int sy_poles_response(sy_response **out, const sy_model *model, const sy_pole_set *poles,
                             const sy_response_settings *settings, sy_error *err);
SY_API void sy_response_free(sy_response *r);

/* CSV time series: a comment line, then columns
 *   time_s, then per dof "pole_sum_<device>_<mode>", "direct_<device>_<mode>" (m or rad).
 * Written atomically (a failed write leaves no file). SY_EIO with the path on failure. */
SY_API int sy_response_write_csv(const sy_response *r, const sy_model *model, const char *path, sy_error *err);

/* The standard experiments of the `poles -t` and `run --resonances` outputs: body 0
 * released from 1 m heave (DECAY), or pushed by a half-sine heave force of rho g pi a^2 x
 * 1 m (the static force of a 1 m heave) lasting a quarter of the slowest motion pole's
 * period (PULSE); both over as many periods of that pole as the slowest-decaying pole
 * needs to fall to e^-7 (at least 3, at most 15), 40 samples per period, default grids.
 * SY_EINPUT if `poles` has no motion pole with Re > 0. */
SY_API int sy_response_settings_standard(sy_response_settings *s, const sy_model *model, const sy_pole_set *poles,
                                         sy_response_kind kind, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
