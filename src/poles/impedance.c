/* The array's mechanical impedance at a complex frequency, assembled from the array
 * hydrodynamics (sy_array_solve, continued to complex omega) and the dynamics module's
 * mass and stiffness (conventions.md, equation of motion):
 *   Z(omega) = C + K_pto - omega^2 M - i omega (Z_rad(omega) + B_pto + B_visc).
 * A free motion x(t) = Re{v e^{-i omega t}} exists where Z(omega) v = 0 (poles.h). SI units;
 * matrices row-major n_dof x n_dof, body-major dofs. */
#include <complex.h>
#include "poles_impl.h"
#include "swellyield/array.h"
#include "swellyield/dynamics.h"
#include "swellyield/hydro.h"
#include "swellyield/hydrodb.h"
#include "swellyield/model.h"

#include <stdint.h>
#include <stdlib.h>

struct syi_imp {
    sy_array_plan *plan;
    sy_array_work *work;
    sy_array_hydro *res;
    sy_hydro_db *db;
    sy_dyn_plan *dyn;
    size_t nd;
    const double *mass, *stiff, *visc;
    double *k0, *bdamp;      /* [nd*nd] C + K_pto; [nd] B_pto + B_visc (diagonal) */
    size_t *heave;           /* [n bodies] heave dof of each body */
    size_t n_bodies;
};

void syi_imp_free(syi_imp *p)
{
    if (p == NULL)
        return;
    sy_dyn_plan_free(p->dyn);
    sy_hydro_db_free(p->db);
    sy_array_hydro_free(p->res);
    sy_array_work_free(p->work);
    sy_array_plan_free(p->plan);
    free(p->k0);
    free(p->bdamp);
    free(p->heave);
    free(p);
}

int syi_imp_create(syi_imp **out, const sy_model *m, int with_pto, sy_error *err)
{
    syi_imp *p = calloc(1, sizeof *p);
    if (p == NULL)
        return sy_error_set(err, SY_ENOMEM, "impedance");
    int rc = sy_hydro_plan_create(&p->plan, m, m->devices, m->n_devices, err);
    if (rc == SY_OK)
        rc = sy_array_work_alloc(&p->work, p->plan, err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&p->res, p->plan, err);
    size_t nd = rc == SY_OK ? sy_array_plan_n_dof(p->plan) : 0;
    p->nd = nd, p->n_bodies = m->n_devices;
    if (rc == SY_OK) {
        p->k0 = calloc(nd * nd + 1, sizeof *p->k0);
        p->bdamp = calloc(nd + 1, sizeof *p->bdamp);
        p->heave = malloc((m->n_devices + 1) * sizeof *p->heave);
        if (p->k0 == NULL || p->bdamp == NULL || p->heave == NULL)
            rc = sy_error_set(err, SY_ENOMEM, "impedance for %zu dofs", nd);
    }
    /* A one-frequency database only to carry the dof map into the dynamics plan. */
    if (rc == SY_OK)
        rc = sy_hydro_db_alloc(&p->db, 1, 1, m->n_devices, nd, err);
    for (size_t b = 0; rc == SY_OK && b < m->n_devices; b++)
        p->heave[b] = SIZE_MAX;
    for (size_t d = 0; rc == SY_OK && d < nd; d++) {
        size_t b;
        int mode;
        sy_array_plan_dof(p->plan, d, &b, &mode);
        p->db->dof_body[d] = (int)b, p->db->dof_mode[d] = mode;
        if (mode == 3 && b < m->n_devices)
            p->heave[b] = d;
    }
    if (rc == SY_OK)
        rc = sy_dyn_plan_create(&p->dyn, m, p->db, m->pto_mode, err);
    if (rc == SY_OK) {
        sy_dyn_plan_matrices(p->dyn, &p->mass, &p->stiff, &p->visc);
        for (size_t i = 0; i < nd * nd; i++)
            p->k0[i] = p->stiff[i];
        for (size_t i = 0; i < nd; i++)
            p->bdamp[i] = p->visc[i];
        for (size_t k = 0; with_pto && k < sy_dyn_n_devices(p->dyn); k++) {
            size_t d = sy_dyn_pto_dof(p->dyn, k);
            const sy_model_device *dev = &m->devices[sy_dyn_device_body(p->dyn, k)];
            p->bdamp[d] += dev->pto_damping;
            p->k0[d * nd + d] += dev->pto_stiffness;
        }
    }
    if (rc != SY_OK) {
        syi_imp_free(p);
        return rc;
    }
    *out = p;
    return SY_OK;
}

size_t syi_imp_n_dof(const syi_imp *p) { return p->nd; }
size_t syi_imp_heave_dof(const syi_imp *p, size_t b) { return b < p->n_bodies ? p->heave[b] : SIZE_MAX; }
const double *syi_imp_k0(const syi_imp *p) { return p->k0; }
const double *syi_imp_mass(const syi_imp *p) { return p->mass; }
const double *syi_imp_damping(const syi_imp *p) { return p->bdamp; }

void syi_imp_dof(const syi_imp *p, size_t d, int *body, int *mode)
{
    *body = p->db->dof_body[d], *mode = p->db->dof_mode[d];
}

int syi_imp_eval(syi_imp *p, double complex w, double complex *z, double complex *zdamp, sy_error *err)
{
    int rc = sy_array_solve(p->plan, w, p->work, p->res, err);
    if (rc != SY_OK)
        return rc;
    size_t n = p->nd;
    for (size_t i = 0; i < n; i++)
        for (size_t j = 0; j < n; j++) {
            double complex d = p->res->impedance[i * n + j] + (i == j ? p->bdamp[i] : 0.0);
            if (zdamp != NULL)
                zdamp[i * n + j] = d;
            z[i * n + j] = p->k0[i * n + j] - w * w * p->mass[i * n + j] - I * w * d;
        }
    return SY_OK;
}

int syi_imp_logdet_interaction(const syi_imp *p, double complex *logdet, sy_error *err)
{
    return sy_array_factored_logdet(p->plan, p->work, logdet, err);
}
