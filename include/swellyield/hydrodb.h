/* The hydrodynamic database: array added mass, radiation damping and excitation per
 * frequency and heading, as computed by the array solver, and its NetCDF-4 file.
 *
 * File layout (CF-1.10 attributes; names are this project's own):
 *   dimensions  omega, heading, dof, dof2 (= dof), body, name_len
 *   omega(omega)                 rad/s
 *   heading(heading)             degree; direction waves travel toward, counter-clockwise from +x
 *   added_mass(omega,dof,dof2)   kg, kg m, kg m^2 by dof pair
 *   radiation_damping(omega,dof,dof2)   kg/s, kg m/s, kg m^2/s
 *   excitation_re/_im(omega,heading,dof)   N/m or N m/m per unit wave amplitude,
 *                                phases per conventions.md (e^{-i omega t}, crest at the origin)
 *   convergence(omega)           estimated relative truncation error of that frequency
 *   dof_body(dof) (0-based), dof_mode(dof) (1 surge .. 5 pitch)
 *   body_x(body), body_y(body) m; body_radius(body), body_draft(body) m; body_name(body,name_len)
 *   global: depth, density, gravity, tolerance, truncation (text), cache_key, software
 *   (truncation: the array plan's record, sy_array_plan_truncation: M, Q, tolerance,
 *   dropped pair couplings, then, from the per-mode angular truncation on, the largest
 *   evanescent orders per mode and the unknowns kept; free text, read back as it is)
 * dof order is body-major (conventions.md). Writes are atomic (temporary + rename). */
#ifndef SWELLYIELD_HYDRODB_H
#define SWELLYIELD_HYDRODB_H

#include <complex.h>
#include <stddef.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

#define SY_HYDRODB_NAME_LEN 64

typedef struct sy_hydro_db {
    size_t n_omega, n_headings, n_bodies, n_dof;
    double *omega;                 /* [n_omega] rad/s */
    double *headings;              /* [n_headings] rad */
    int *dof_body;                 /* [n_dof] */
    int *dof_mode;                 /* [n_dof] 1..5 */
    double *body_x, *body_y;       /* [n_bodies] m */
    double *body_radius, *body_draft; /* [n_bodies] m */
    char (*body_name)[SY_HYDRODB_NAME_LEN];
    double *added_mass;            /* [n_omega][n_dof][n_dof] */
    double *damping;               /* [n_omega][n_dof][n_dof] */
    double complex *excitation;    /* [n_omega][n_headings][n_dof] */
    double *convergence;           /* [n_omega] */
    double depth, rho, g, tolerance;
    char truncation[256];          /* how the series were truncated, for the record */
    char cache_key[32];            /* hex hash of geometry + settings ("" if none) */
} sy_hydro_db;

/* Allocate with every array zeroed; free with sy_hydro_db_free (NULL-safe). */
SY_API int sy_hydro_db_alloc(sy_hydro_db **out, size_t n_omega, size_t n_headings, size_t n_bodies,
                             size_t n_dof, sy_error *err);
SY_API void sy_hydro_db_free(sy_hydro_db *db);

/* Write db to path (NetCDF-4, atomic). SY_EIO with path, variable and nc_strerror. */
SY_API int sy_hydro_db_write(const sy_hydro_db *db, const char *path, sy_error *err);

/* Read a file written by sy_hydro_db_write. SY_EIO/SY_EINPUT naming path and variable. */
SY_API int sy_hydro_db_read(sy_hydro_db **out, const char *path, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
