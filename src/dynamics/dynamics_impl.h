/* Private to the dynamics module. */
#ifndef SY_DYNAMICS_IMPL_H
#define SY_DYNAMICS_IMPL_H

#include "swellyield/dynamics.h"

struct sy_dyn_plan {
    const sy_model *model;
    const sy_hydro_db *db;
    size_t n_dof, n_devices;
    double *mass;        /* [n_dof * n_dof] body mass/inertia incl. surge-pitch coupling */
    double *stiff;       /* [n_dof * n_dof] hydrostatic + mooring */
    double *visc;        /* [n_dof] linearised viscous damping (diagonal) */
    size_t *pto_dof;     /* [n_devices] dof index of each device's PTO mode */
    size_t *device_body; /* [n_devices] body index */
};

struct sy_dyn_work {
    double complex *z;   /* [n_dof * n_dof] impedance, LU in place */
    double complex *rhs; /* [n_dof * n_headings] */
    int *ipiv;           /* [n_dof] */
};

#endif
