/* Hydrodynamics of one isolated axisymmetric body at one (real or complex) frequency,
 * in the partial-wave form the array interaction method consumes.
 *
 * Body types: SY_BODY_FLOAT, a floating truncated vertical circular cylinder (radius a,
 * draft d < h); SY_BODY_COLUMN, a fixed bottom-mounted surface-piercing cylinder (d = h).
 *
 * Frames and conventions (conventions.md): z up, z = 0 the still water level, seabed
 * z = -h; local polar coordinates (r, theta) about the body axis, theta counter-clockwise
 * from +x; complex amplitudes X mean Re{X e^{-i omega t}}; pressure p = i omega rho phi.
 *
 * Partial-wave basis (the contract between the body and array modules). Depth modes
 * q = 0..Q-1 share the roots of sy_wave_roots: k_0 = roots.k0, k_q = roots.k[q-1]:
 *   Z_0(z) = cosh(k_0 (z + h)) / cosh(k_0 h),   Z_q(z) = cos(k_q (z + h)) / cos(k_q h),
 * (every Z_q(0) = 1). Angular orders n = -M..M. Regular (incident) partial waves
 *   Jhat_{0n}(r) = J_n(k_0 r),  Jhat_{qn}(r) = I_n(k_q r)            (q >= 1)
 * and outgoing (scattered / radiated) partial waves
 *   Hhat_{0n}(r) = H^(1)_n(k_0 r),  Hhat_{qn}(r) = K_n(k_q r)        (q >= 1).
 * An incident potential phi = sum a_{qn} Z_q(z) Jhat_{qn}(r) e^{i n theta} is scattered
 * into sum b_{qn} Z_q Hhat_{qn} e^{i n theta}, with b_{qn} = sum_{q'} D_{|n|}(q, q') a_{q'n}
 * (axisymmetry: D is block diagonal in n and only n >= 0 is stored; by mirror symmetry
 * D_{-n}(q, q') = s_q(n) s_q'(n) D_n(q, q') with s_0(n) = (-1)^n (J_{-n} = (-1)^n J_n)
 * and s_q(n) = 1 for q >= 1 (I_{-n} = I_n): the propagating/evanescent blocks change
 * sign for odd n. The array module applies this; see src/array/solve.c dscaled()).
 *
 * Rigid modes j = 1..5 (surge, sway, heave, roll, pitch; index j-1 in arrays), rotations
 * about the centre of rotation (0, 0, z_rot). Velocity amplitude U_j of mode j radiates
 *   phi_rad = U_j sum R_j(q, n) Z_q Hhat_{qn} e^{i n theta}.
 * Generalised force in mode j (force N, moment N m; F_j = -int p n_j dS, n out of the
 * body into the fluid) from an incident partial wave of unit coefficient a_{qn},
 * including the body's own scattered wave: G_j(q, n).
 * Isolated-body radiation force: F_i = -sum_j (B_ij - i omega A_ij) U_j, i.e.
 * F = (omega^2 A + i omega B) xi for displacement xi; A [kg, kg m, kg m^2] and B [kg/s...]
 * are real on the real omega axis and their analytic continuation elsewhere.
 */
#ifndef SWELLYIELD_BODY_H
#define SWELLYIELD_BODY_H

#include <complex.h>
#include "swellyield/core.h"
#include "swellyield/waves.h"

#ifdef __cplusplus
extern "C" {
#endif

#define SY_BODY_NMODES 5

typedef enum { SY_BODY_FLOAT = 0, SY_BODY_COLUMN = 1 } sy_body_kind;

typedef struct sy_body_geometry {
    sy_body_kind kind;
    double radius;   /* a, m, > 0 */
    double draft;    /* d, m, 0 < d < h for a float; ignored (= h) for a column */
    double z_rot;    /* centre of rotation on the axis, m (default 0: still-water plane) */
} sy_body_geometry;

/* Isolated-body results at one frequency. Caller-owned; allocate with
 * sy_body_waves_alloc for the plan's (M, Q). Layouts are flat, row-major:
 *   diffraction[((size_t)n * Q + q) * Q + qp]        n = 0..M        D_n(q, qp)
 *   radiation[((size_t)j * Q + q) * (2M+1) + (n+M)]   j = 0..4        R_{j+1}(q, n)
 *   force[((size_t)j * Q + q) * (2M+1) + (n+M)]       j = 0..4        G_{j+1}(q, n)
 *   added_mass[i * 5 + j], damping[i * 5 + j]         i, j = 0..4
 * A column (fixed) has zero radiation, added_mass and damping; its force is still
 * filled (forces on a fixed structure). */
typedef struct sy_body_waves {
    size_t n_order;               /* M */
    size_t n_depth;               /* Q */
    double complex omega;         /* frequency these values belong to */
    double complex *diffraction;  /* (M+1) Q Q */
    double complex *radiation;    /* 5 Q (2M+1) */
    double complex *force;        /* 5 Q (2M+1) */
    double complex added_mass[SY_BODY_NMODES * SY_BODY_NMODES];
    double complex damping[SY_BODY_NMODES * SY_BODY_NMODES];
    double convergence;           /* achieved relative change estimate of this solve */
} sy_body_waves;

SY_API int sy_body_waves_alloc(sy_body_waves **out, size_t n_order, size_t n_depth, sy_error *err);
SY_API void sy_body_waves_free(sy_body_waves *w);

/* Geometry-dependent set-up, once per body type in a layout (identical bodies share a
 * plan). h: depth (m); tolerance: target relative accuracy of A, B, D, R, G (e.g. 1e-6);
 * n_order M, n_depth Q: the partial-wave truncation the caller needs in its output.
 * The plan chooses its internal truncation (Galerkin terms, exterior modes) from the
 * tolerance; n_evanescent_needed tells the caller how many evanescent roots to supply. */
typedef struct sy_body_plan sy_body_plan;
typedef struct sy_body_work sy_body_work;

SY_API int sy_body_plan_create(sy_body_plan **out, const sy_body_geometry *geom, double h,
                               double tolerance, size_t n_order, size_t n_depth, sy_error *err);
SY_API void sy_body_plan_free(sy_body_plan *plan);
SY_API size_t sy_body_plan_roots_needed(const sy_body_plan *plan);
SY_API int sy_body_work_alloc(sy_body_work **out, const sy_body_plan *plan, sy_error *err);
SY_API void sy_body_work_free(sy_body_work *work);

/* Solve the isolated body at roots->omega (real or complex, Re omega > 0). roots must
 * hold at least sy_body_plan_roots_needed(plan) evanescent roots for the plan's depth.
 * Plans may be shared between threads; each thread owns its work. No allocation. */
SY_API int sy_body_solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                         sy_body_work *work, sy_body_waves *out, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
