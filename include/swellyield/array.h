/* Hydrodynamics of an array of N vertical cylinders (floats and columns, mixed radii
 * and drafts) by the multiple-scattering interaction method (Kagemoto & Yue 1986;
 * Siddorn & Eatock Taylor 2008): each body is described by its isolated partial-wave
 * characteristics (body.h: D, R, G, A, B); the outgoing waves of every body are
 * re-expanded about every other body by Graf's addition theorem,
 *   H_n(k r_j) e^{i n t_j} = sum_m H_{n-m}(k L) e^{i (n-m) alpha} J_m(k r_i) e^{i m t_i},
 *   K_n(k r_j) e^{i n t_j} = sum_m (-1)^m K_{n-m}(k L) e^{i (n-m) alpha} I_m(k r_i) e^{i m t_i},
 * (L, alpha: distance and direction from centre j to centre i, r_i < L), and one
 * linear system (I - D T) b = rhs per frequency gives the scattered coefficients of all
 * bodies for all headings and all radiating dofs at once (one LU, many right-hand sides).
 *
 * Conventions (conventions.md): SI; z up, seabed z = -h; heading beta = direction the
 * waves travel toward, radians counter-clockwise from +x; Re{X e^{-i omega t}}; incident
 * wave of unit amplitude eta = exp(i k (x cos beta + y sin beta)) (crest at the array
 * origin at t = 0). Dofs per body in the order surge, sway, heave, roll, pitch (those kept
 * by the body's mode mask), matrices body-major.
 *
 * Columns are fixed: their dofs carry loads (excitation) but no motion; their rows and
 * columns of the impedance, added mass and damping are zero.
 *
 * Usage (style.md): plan once per layout (geometry, truncation, index maps, body plans);
 * one work object per thread; sy_array_solve per frequency (const plan, no allocation);
 * sy_array_sweep for many frequencies (OpenMP threads over frequencies when built with
 * it). Every function returns SY_OK or a status with err filled (err may be NULL). */
#ifndef SWELLYIELD_ARRAY_H
#define SWELLYIELD_ARRAY_H

#include <complex.h>
#include <stdint.h>
#include <stdio.h>
#include "swellyield/core.h"
#include "swellyield/body.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Mode-mask bits (bit j-1 for rigid mode j of body.h). */
#define SY_ARRAY_SURGE (1u << 0)
#define SY_ARRAY_SWAY (1u << 1)
#define SY_ARRAY_HEAVE (1u << 2)
#define SY_ARRAY_ROLL (1u << 3)
#define SY_ARRAY_PITCH (1u << 4)
#define SY_ARRAY_ALL_MODES 0x1fu

/* One body type (identical bodies share it and its body plan). */
typedef struct sy_array_type {
    sy_body_geometry geom;   /* kind, radius, draft, z_rot (body.h) */
    unsigned modes;          /* SY_ARRAY_* mask of the dofs kept, e.g. SY_ARRAY_HEAVE */
} sy_array_type;

/* One body of the layout: its centre (m, array frame) and its type index. */
typedef struct sy_array_body {
    double x, y;
    size_t type;
} sy_array_body;

/* Settings for one layout. */
typedef struct sy_array_settings {
    double h;            /* water depth, m, > 0 */
    double rho, g;       /* kg/m^3, m/s^2 (conventions.md defaults 1025, 9.81) */
    double tolerance;    /* relative accuracy target: body solves, and the cut-off below
                            which an evanescent depth mode's coupling between two bodies
                            is dropped (its estimate K_0(k_q gap)/K_0(k_q a) < tolerance)
                            and below which an evanescent mode's angular orders are
                            dropped per body (every omitted Graf coupling coefficient
                            |K_{n-m}(k_q L)| I_m(k_q a_i) / K_n(k_q a_j), weighted by a
                            bound on the sending partial wave's size, < tolerance over
                            all real frequencies; src/array/plan.c) */
    size_t n_order;      /* M: angular orders -M..M kept per body in the propagating mode,
                            the most any evanescent mode keeps */
    size_t n_depth;      /* Q: depth modes (1 propagating + Q-1 evanescent) */
    double margin;       /* bodies closer than r_i + r_j + margin (m) are rejected */
} sy_array_settings;

typedef struct sy_array_plan sy_array_plan;
typedef struct sy_array_work sy_array_work;

/* Plan a layout. types[n_types], bodies[n_bodies] and headings[n_headings] (radians)
 * are copied. Fails with SY_EINVAL naming the body pair whose bounding circles overlap,
 * or the bad setting and its value; SY_ENOMEM. */
SY_API int sy_array_plan_create(sy_array_plan **out, const sy_array_settings *settings,
                                const sy_array_type *types, size_t n_types,
                                const sy_array_body *bodies, size_t n_bodies,
                                const double *headings, size_t n_headings, sy_error *err);
SY_API void sy_array_plan_free(sy_array_plan *plan);

/* Sizes and index maps. Dof index d (0..n_dof-1): body and rigid mode (1..5). */
SY_API size_t sy_array_plan_n_dof(const sy_array_plan *plan);
SY_API size_t sy_array_plan_n_unknowns(const sy_array_plan *plan);
SY_API size_t sy_array_plan_n_headings(const sy_array_plan *plan);
SY_API void sy_array_plan_dof(const sy_array_plan *plan, size_t d, size_t *body, int *mode);
/* Interaction unknown u (0..n_unknowns-1): its body, depth mode q (0 propagating) and
 * angular order n (-M_q..M_q, M_q <= M the orders kept for that body and mode; see
 * sy_array_plan_partial_waves). u out of range: body (size_t)-1, q 0, n 0. */
SY_API void sy_array_plan_unknown(const sy_array_plan *plan, size_t u, size_t *body, size_t *depth_mode,
                                  long *order);
/* Number of (body pair, evanescent mode) couplings dropped below the tolerance. */
SY_API size_t sy_array_plan_dropped(const sy_array_plan *plan);
/* Partial waves (angular orders, 2 M_q + 1) kept for depth mode q of a body: 2M+1 for the
 * propagating mode q = 0, fewer for evanescent modes whose high orders couple to no
 * neighbour above the tolerance, 0 if the body keeps no mode q (or body, q out of
 * range). n_unknowns is the sum over bodies and modes. */
SY_API size_t sy_array_plan_partial_waves(const sy_array_plan *plan, size_t body, size_t q);
/* 64-bit FNV-1a hash of geometry, settings and headings (a cache key). */
SY_API uint64_t sy_array_plan_key(const sy_array_plan *plan);
/* One-line truncation record for output files ("M = 8, Q = 5, tolerance 1e-06, 3 of
 * 30 (pair, evanescent mode) couplings dropped, evanescent orders M_q <= 5 3 2 1, 213 of
 * 340 unknowns": the largest order kept in each evanescent mode q = 1..Q-1 over the
 * bodies, "-" where no body keeps the mode, and the unknowns kept of those with 2M+1
 * orders in every kept mode), written into buf[n] (truncated to fit). */
SY_API void sy_array_plan_truncation(const sy_array_plan *plan, char *buf, size_t n);
/* Human-readable summary (bodies, types, truncation, dropped couplings) to f. */
SY_API void sy_array_plan_describe(const sy_array_plan *plan, FILE *f);

/* Caller-owned results at one frequency, sized by sy_array_hydro_alloc(plan).
 *   impedance[d * n_dof + e]   Z = B - i omega A: radiation force on dof d from unit
 *                              velocity of dof e is -Z[d, e] (body.h sign), N s/m etc.
 *   added_mass, damping        A, B (kg..., kg/s...), filled for real omega only (their
 *                              imaginary parts are rounding); for complex omega they are
 *                              NaN: use impedance (the equation of motion needs only
 *                              -omega^2 A - i omega B = -i omega Z).
 *   excitation[b * n_dof + d]  X(heading b, dof d) per unit wave amplitude, N/m, N m/m.
 * k0 the propagating wavenumber, cg the group velocity (real omega; NaN otherwise);
 * convergence: the largest relative-change estimate reported by the body solves
 * (body.h) at this frequency (the interaction truncation itself is set by the plan's
 * tolerance and orders; check it by re-running with larger M, Q). */
typedef struct sy_array_hydro {
    size_t n_dof, n_headings;
    double complex omega;
    double complex k0;
    double cg;
    double complex *impedance;
    double *added_mass;
    double *damping;
    double complex *excitation;
    double convergence;
} sy_array_hydro;

SY_API int sy_array_hydro_alloc(sy_array_hydro **out, const sy_array_plan *plan, sy_error *err);
SY_API void sy_array_hydro_free(sy_array_hydro *r);

/* Per-thread work (matrices, pivots, body work and results, roots storage). */
SY_API int sy_array_work_alloc(sy_array_work **out, const sy_array_plan *plan, sy_error *err);
SY_API void sy_array_work_free(sy_array_work *work);

/* Solve the array at omega (rad/s; real, or complex with Re omega > 0). No allocation.
 * SY_ESINGULAR if I - D T is singular (pivot index in the message), SY_EINVAL, or a
 * status from the roots, special functions or body solves. */
SY_API int sy_array_solve(const sy_array_plan *plan, double complex omega, sy_array_work *work,
                          sy_array_hydro *result, sy_error *err);

/* The "fixed array" scattering operator at omega: factorises I - D T (bodies held
 * fixed; diagonally scaled, which leaves the determinant unchanged) and returns
 * log det(I - D T) (sum of logarithms of the LU pivots, sign of the permutation
 * included; the imaginary part is defined modulo 2 pi). Zeros of the determinant in the
 * lower half omega plane are the scattering resonances. The factorisation stays in the
 * work for sy_array_interaction_solve. */
SY_API int sy_array_interaction_logdet(const sy_array_plan *plan, double complex omega,
                                       sy_array_work *work, double complex *logdet,
                                       sy_error *err);
/* log det(I - D T) of the factorisation left in the work by the last sy_array_solve or
 * sy_array_interaction_logdet (no new factorisation: the resonance search gets the
 * determinant of each array solve for free). SY_EINVAL if the work holds none. */
SY_API int sy_array_factored_logdet(const sy_array_plan *plan, const sy_array_work *work,
                                    double complex *logdet, sy_error *err);
/* Solve (I - D T) x = rhs with the factorisation from the last sy_array_solve or
 * sy_array_interaction_logdet on this work. rhs, x: n_unknowns values in the scaled
 * basis (each partial wave normalised by |Hhat_{qn}(k_q a)|), rhs and x may alias. */
SY_API int sy_array_interaction_solve(const sy_array_plan *plan, sy_array_work *work,
                                      const double complex *rhs, double complex *x,
                                      sy_error *err);

/* Solve at n_omega real frequencies into results[0..n_omega-1] (each from
 * sy_array_hydro_alloc). n_threads = 0: the OpenMP default; 1 or built without OpenMP:
 * serial. Each thread allocates its own work. On failure returns the status of the
 * lowest failing frequency with its index in the message; other results are still
 * filled where their solve succeeded. */
SY_API int sy_array_sweep(const sy_array_plan *plan, const double *omega, size_t n_omega,
                          sy_array_hydro **results, int n_threads, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
