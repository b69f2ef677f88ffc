/* The coupled equation of motion of the array and the PTO power (dynamics.h). One LU
 * per frequency serves every heading. */
#include <complex.h>
#include "dynamics_impl.h"

#include <lapacke.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

/* Mass and hydrostatics of one floating cylinder about the still-water plane on its
 * axis (see dynamics.h for the homogeneous-body assumption). */
static void body_props(const sy_model *m, const sy_model_device *d, double *mass, double *inertia,
                       double *z_g, double *c33, double *c55)
{
    double a = d->radius, dr = d->draft, vol = M_PI * a * a * dr;
    *mass = m->mass_displaced ? m->rho * vol : m->mass;
    *z_g = -dr / 2;
    *inertia = *mass * (a * a / 4 + dr * dr / 3);
    *c33 = m->rho * m->g * M_PI * a * a;
    double z_b = -dr / 2;
    *c55 = m->rho * m->g * (M_PI * pow(a, 4) / 4 + vol * z_b) - *mass * m->g * *z_g;
}

int sy_dyn_plan_create(sy_dyn_plan **out, const sy_model *model, const sy_hydro_db *db, int pto_mode,
                       sy_error *err)
{
    if (pto_mode < 1 || pto_mode > 5)
        return sy_error_set(err, SY_EINVAL, "dynamics: PTO mode %d is not 1..5", pto_mode);
    if (db->n_bodies != model->n_devices)
        return sy_error_set(err, SY_EINVAL, "dynamics: database has %zu bodies, layout %zu", db->n_bodies,
                            model->n_devices);
    size_t nd = db->n_dof;
    sy_dyn_plan *p = calloc(1, sizeof *p);
    if (p != NULL) {
        p->mass = calloc(nd * nd, sizeof *p->mass);
        p->stiff = calloc(nd * nd, sizeof *p->stiff);
        p->visc = calloc(nd, sizeof *p->visc);
        p->pto_dof = calloc(db->n_bodies, sizeof *p->pto_dof);
        p->device_body = calloc(db->n_bodies, sizeof *p->device_body);
    }
    if (p == NULL || !p->mass || !p->stiff || !p->visc || !p->pto_dof || !p->device_body) {
        sy_dyn_plan_free(p);
        return sy_error_set(err, SY_ENOMEM, "dynamics plan for %zu dofs", nd);
    }
    p->model = model, p->db = db, p->n_dof = nd;
    for (size_t i = 0; i < nd; i++) {
        size_t b = (size_t)db->dof_body[i];
        int mi = db->dof_mode[i];
        double mass, inertia, z_g, c33, c55;
        body_props(model, &model->devices[b], &mass, &inertia, &z_g, &c33, &c55);
        if (mi == pto_mode) {
            p->pto_dof[p->n_devices] = i;
            p->device_body[p->n_devices++] = b;
        }
        for (size_t j = 0; j < nd; j++) {
            if ((size_t)db->dof_body[j] != b)
                continue;
            int mj = db->dof_mode[j];
            double mij = 0, cij = 0;
            if (mi == mj) {
                mij = mi <= 3 ? mass : inertia;
                cij = mi == 3 ? c33 : mi >= 4 ? c55 : model->mooring_stiffness;
            } else if ((mi == 1 && mj == 5) || (mi == 5 && mj == 1)) {
                mij = mass * z_g;   /* surge-pitch: rotation about a point above G */
            } else if ((mi == 2 && mj == 4) || (mi == 4 && mj == 2)) {
                mij = -mass * z_g;  /* sway-roll: opposite sign by the right-hand rule */
            }
            p->mass[i * nd + j] = mij;
            p->stiff[i * nd + j] = cij;
        }
        p->visc[i] = mi == 3 ? model->viscous_damping : 0.0;
    }
    for (size_t b = 0; b < db->n_bodies && model->shape == SY_SHAPE_FLOAT; b++) {
        int found = 0;
        for (size_t k = 0; k < p->n_devices; k++)
            found |= p->device_body[k] == b;
        if (!found) {
            sy_dyn_plan_free(p);
            return sy_error_set(err, SY_EINPUT, "dynamics: device '%s' has no %s dof for its PTO (add it to [device] modes)",
                                model->devices[b].name, sy_model_mode_name(pto_mode));
        }
    }
    *out = p;
    return SY_OK;
}

void sy_dyn_plan_free(sy_dyn_plan *p)
{
    if (p == NULL)
        return;
    free(p->mass);
    free(p->stiff);
    free(p->visc);
    free(p->pto_dof);
    free(p->device_body);
    free(p);
}

int sy_dyn_work_alloc(sy_dyn_work **out, const sy_dyn_plan *plan, sy_error *err)
{
    size_t nd = plan->n_dof, nh = plan->db->n_headings;
    sy_dyn_work *w = calloc(1, sizeof *w);
    if (w != NULL) {
        w->z = malloc(nd * nd * sizeof *w->z);
        w->rhs = malloc(nd * nh * sizeof *w->rhs);
        w->ipiv = malloc(nd * sizeof *w->ipiv);
    }
    if (w == NULL || !w->z || !w->rhs || !w->ipiv) {
        sy_dyn_work_free(w);
        return sy_error_set(err, SY_ENOMEM, "dynamics work for %zu dofs", nd);
    }
    *out = w;
    return SY_OK;
}

void sy_dyn_work_free(sy_dyn_work *w)
{
    if (w == NULL)
        return;
    free(w->z);
    free(w->rhs);
    free(w->ipiv);
    free(w);
}

size_t sy_dyn_n_devices(const sy_dyn_plan *plan) { return plan->n_devices; }
size_t sy_dyn_n_dof(const sy_dyn_plan *plan) { return plan->n_dof; }
size_t sy_dyn_device_body(const sy_dyn_plan *plan, size_t k) { return plan->device_body[k]; }
size_t sy_dyn_pto_dof(const sy_dyn_plan *plan, size_t k) { return plan->pto_dof[k]; }

void sy_dyn_plan_matrices(const sy_dyn_plan *plan, const double **mass, const double **stiffness,
                          const double **visc)
{
    *mass = plan->mass, *stiffness = plan->stiff, *visc = plan->visc;
}

double sy_dyn_mass(const sy_dyn_plan *plan, size_t body, int mode)
{
    for (size_t i = 0; i < plan->n_dof; i++)
        if ((size_t)plan->db->dof_body[i] == body && plan->db->dof_mode[i] == mode)
            return plan->mass[i * plan->n_dof + i];
    return NAN;
}

double sy_dyn_stiffness(const sy_dyn_plan *plan, size_t body, int mode)
{
    for (size_t i = 0; i < plan->n_dof; i++)
        if ((size_t)plan->db->dof_body[i] == body && plan->db->dof_mode[i] == mode)
            return plan->stiff[i * plan->n_dof + i];
    return NAN;
}

int sy_dyn_response(const sy_dyn_plan *p, size_t io, const double *damping, const double *stiffness,
                    sy_dyn_work *w, double complex *xi, double *power, sy_error *err)
{
    const sy_hydro_db *db = p->db;
    size_t nd = p->n_dof, nh = db->n_headings;
    if (io >= db->n_omega)
        return sy_error_set(err, SY_EINVAL, "dynamics: frequency index %zu >= %zu", io, db->n_omega);
    double om = db->omega[io];
    const double *am = db->added_mass + io * nd * nd, *bd = db->damping + io * nd * nd;
    for (size_t i = 0; i < nd; i++)
        for (size_t j = 0; j < nd; j++) {
            size_t ij = i * nd + j;
            w->z[ij] = -om * om * (p->mass[ij] + am[ij]) - I * om * bd[ij] + p->stiff[ij];
        }
    for (size_t i = 0; i < nd; i++)
        w->z[i * nd + i] += -I * om * p->visc[i];
    for (size_t k = 0; k < p->n_devices; k++) {
        size_t i = p->pto_dof[k];
        w->z[i * nd + i] += -I * om * damping[k] + stiffness[k];
    }
    const double complex *x = db->excitation + io * nh * nd;
    for (size_t h = 0; h < nh; h++)
        for (size_t i = 0; i < nd; i++)
            w->rhs[i * nh + h] = x[h * nd + i];
    lapack_int info = LAPACKE_zgesv(LAPACK_ROW_MAJOR, (lapack_int)nd, (lapack_int)nh, w->z, (lapack_int)nd,
                                    w->ipiv, w->rhs, (lapack_int)nh);
    if (info > 0)
        return sy_error_set(err, SY_ESINGULAR, "dynamics: impedance singular at omega = %g rad/s (pivot %d)", om,
                            (int)info);
    if (info < 0)
        return sy_error_set(err, SY_EINVAL, "dynamics: zgesv argument %d", (int)-info);
    for (size_t h = 0; h < nh; h++) {
        if (xi != NULL)
            for (size_t i = 0; i < nd; i++)
                xi[h * nd + i] = w->rhs[i * nh + h];
        if (power != NULL)
            for (size_t k = 0; k < p->n_devices; k++) {
                double complex u = w->rhs[p->pto_dof[k] * nh + h];
                power[h * p->n_devices + k] = 0.5 * om * om * damping[k] * (creal(u) * creal(u) + cimag(u) * cimag(u));
            }
    }
    return SY_OK;
}

int sy_dyn_reactive_bound(const sy_dyn_plan *p, size_t io, sy_dyn_work *w, double *bound, sy_error *err)
{
    const sy_hydro_db *db = p->db;
    size_t nd = p->n_dof, nh = db->n_headings, n = p->n_devices;
    if (io >= db->n_omega)
        return sy_error_set(err, SY_EINVAL, "dynamics: frequency index %zu >= %zu", io, db->n_omega);
    const double *bd = db->damping + io * nd * nd;
    const double complex *x = db->excitation + io * nh * nd;
    for (size_t k = 0; k < n; k++)
        for (size_t l = 0; l < n; l++)
            w->z[k * n + l] = bd[p->pto_dof[k] * nd + p->pto_dof[l]];
    for (size_t h = 0; h < nh; h++)
        for (size_t k = 0; k < n; k++)
            w->rhs[k * nh + h] = x[h * nd + p->pto_dof[k]];
    lapack_int info = LAPACKE_zgesv(LAPACK_ROW_MAJOR, (lapack_int)n, (lapack_int)nh, w->z, (lapack_int)n,
                                    w->ipiv, w->rhs, (lapack_int)nh);
    if (info != 0)
        return sy_error_set(err, SY_ESINGULAR, "dynamics: radiation damping singular at omega = %g rad/s",
                            db->omega[io]);
    for (size_t h = 0; h < nh; h++) {
        double complex s = 0;
        for (size_t k = 0; k < n; k++)
            s += conj(x[h * nd + p->pto_dof[k]]) * w->rhs[k * nh + h];
        bound[h] = creal(s) / 8.0;
    }
    return SY_OK;
}

double sy_dyn_passive_optimum(double omega, double mass, double added_mass, double damping, double stiffness)
{
    double reactance = omega * (mass + added_mass) - stiffness / omega;
    return hypot(damping, reactance);
}
