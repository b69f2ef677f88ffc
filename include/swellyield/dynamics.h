/* Dynamics: the coupled equation of motion of the whole array per frequency and heading
 * (conventions.md)
 *   [ -omega^2 (M + A) - i omega (B + B_pto + B_visc) + (C + C_moor + K_pto) ] xi = X
 * and the power absorbed by each device's PTO, P = 1/2 omega^2 B_pto |xi_pto|^2, per unit
 * wave amplitude squared (W/m^2). Also the two textbook optima used as references:
 * the optimal passive damping of one mode, and the unconstrained (reactive) bound of
 * the array, P_max = (1/8) X^H B^-1 X over the PTO dofs.
 *
 * Body properties (SI): mass m = rho pi a^2 d for mass = displaced, else the given
 * mass; roll/pitch inertia about the still-water plane and centre of gravity from a
 * homogeneous solid filling the submerged volume (z_G = -d/2, I = m (a^2/4 + d^2/3));
 * that is a stated first-estimate assumption (common practice), not a measured body.
 * Hydrostatic stiffness of a floating vertical cylinder: C33 = rho g pi a^2,
 * C44 = C55 = rho g pi a^4 / 4 + rho g V z_B - m g z_G (z_B = -d/2). Columns are fixed.
 * The PTO acts on one mode per device (heave unless the model says otherwise). */
#ifndef SWELLYIELD_DYNAMICS_H
#define SWELLYIELD_DYNAMICS_H

#include <complex.h>
#include "swellyield/core.h"
#include "swellyield/hydrodb.h"
#include "swellyield/model.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Once per array: mass, stiffness, PTO dof map. Shares nothing mutable; threads may use
 * one plan with their own work. Reads model and db (both must outlive the plan). */
typedef struct sy_dyn_plan sy_dyn_plan;
typedef struct sy_dyn_work sy_dyn_work;

/* pto_mode: the mode (1..5) the PTO acts on; it must be among db's dofs of every body. */
SY_API int sy_dyn_plan_create(sy_dyn_plan **out, const sy_model *model, const sy_hydro_db *db,
                              int pto_mode, sy_error *err);
SY_API void sy_dyn_plan_free(sy_dyn_plan *plan);
SY_API int sy_dyn_work_alloc(sy_dyn_work **out, const sy_dyn_plan *plan, sy_error *err);
SY_API void sy_dyn_work_free(sy_dyn_work *work);

/* Number of devices (bodies) and dofs of the plan. */
SY_API size_t sy_dyn_n_devices(const sy_dyn_plan *plan);
SY_API size_t sy_dyn_n_dof(const sy_dyn_plan *plan);
/* Body index (layout order) of device k. */
SY_API size_t sy_dyn_device_body(const sy_dyn_plan *plan, size_t k);
/* Dof index (in the database's order) of device k's PTO mode. */
SY_API size_t sy_dyn_pto_dof(const sy_dyn_plan *plan, size_t k);

/* Motions and power at frequency index io of the database for every heading.
 * damping[n_devices] (N s/m or N m s/rad) and stiffness[n_devices] are each device's
 * PTO setting. Outputs (caller storage, any may be NULL):
 *   xi[n_headings * n_dof]       complex motion per unit wave amplitude (m/m, rad/m)
 *   power[n_headings * n_devices] absorbed mechanical power per unit amplitude^2 (W/m^2)
 * SY_ESINGULAR if the impedance is singular (e.g. no damping at an exact resonance). */
SY_API int sy_dyn_response(const sy_dyn_plan *plan, size_t io, const double *damping,
                           const double *stiffness, sy_dyn_work *work, double complex *xi,
                           double *power, sy_error *err);

/* The unconstrained reactive bound at frequency index io for every heading:
 * bound[n_headings] = (1/8) X^H B^-1 X per unit amplitude^2 (W/m^2) over the PTO dofs
 * (B restricted to them). SY_ESINGULAR when B is singular there. */
SY_API int sy_dyn_reactive_bound(const sy_dyn_plan *plan, size_t io, sy_dyn_work *work,
                                 double *bound, sy_error *err);

/* Single-mode textbook optimum (Falnes, Ocean Waves and Oscillating Systems):
 * B_opt = sqrt(B^2 + (omega (m + A) - (C + K)/omega)^2). Pure. */
SY_API double sy_dyn_passive_optimum(double omega, double mass, double added_mass, double damping,
                                     double stiffness);

/* Fast response under one damping b shared by every PTO (the tuning strategies' search
 * variable). Per frequency, with Z0 the impedance without PTO damping (PTO stiffness
 * included) and E the PTO dofs, the Woodbury identity gives the PTO-dof motions
 *   xi_p(b) = (I - i omega b G)^-1 xi0_p,   G = E^T Z0^-1 E,  xi0_p = E^T Z0^-1 X,
 * and with G = W diag(mu) W^-1 (eigen-decomposed once) each b costs O(n_devices^2) per
 * heading instead of a new LU. Created once per (array, PTO stiffness); read-only after,
 * so threads may share it. */
typedef struct sy_dyn_modal sy_dyn_modal;

/* stiffness: PTO stiffness of every device (N/m). SY_ESINGULAR if Z0 or W is singular
 * (then use sy_dyn_response). */
SY_API int sy_dyn_modal_create(sy_dyn_modal **out, const sy_dyn_plan *plan, double stiffness,
                               sy_error *err);
SY_API void sy_dyn_modal_free(sy_dyn_modal *modal);

/* Power (W/m^2) and |xi|^2 (m^2/m^2) of every device's PTO dof at frequency io, heading
 * ih, for damping b >= 0 (N s/m). power and motion2 have n_devices entries (either may
 * be NULL); scratch holds n_devices values (caller-owned, one per thread). */
SY_API void sy_dyn_modal_eval(const sy_dyn_modal *modal, size_t io, size_t ih, double b,
                              double complex *scratch, double *power, double *motion2);

/* The plan's matrices (n_dof x n_dof row-major, read-only, owned by the plan): body mass
 * and inertia, hydrostatic + mooring stiffness; visc[n_dof] the linearised viscous
 * damping (diagonal). For the resonance search, which builds the impedance itself. */
SY_API void sy_dyn_plan_matrices(const sy_dyn_plan *plan, const double **mass, const double **stiffness,
                                 const double **visc);

/* Mass, hydrostatic stiffness of body b's mode (1..5) as used by the plan. */
SY_API double sy_dyn_mass(const sy_dyn_plan *plan, size_t body, int mode);
SY_API double sy_dyn_stiffness(const sy_dyn_plan *plan, size_t body, int mode);

#ifdef __cplusplus
}
#endif
#endif
