/* Body plans, work objects and result storage: argument checks common to all kinds and
 * dispatch to the kind's operations (float.c, column.c). */
#include "body_impl.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

static const syi_body_ops *ops_for(sy_body_kind kind)
{
    switch (kind) {
    case SY_BODY_FLOAT: return &syi_body_float_ops;
    case SY_BODY_COLUMN: return &syi_body_column_ops;
    }
    return NULL;
}

int sy_body_waves_alloc(sy_body_waves **out, size_t n_order, size_t n_depth, sy_error *err)
{
    if (n_depth == 0)
        return sy_error_set(err, SY_EINVAL, "body waves: need at least one depth mode");
    size_t nn = 2 * n_order + 1;
    sy_body_waves *w = calloc(1, sizeof *w);
    if (w != NULL) {
        w->n_order = n_order;
        w->n_depth = n_depth;
        w->diffraction = calloc((n_order + 1) * n_depth * n_depth, sizeof *w->diffraction);
        w->radiation = calloc(SY_BODY_NMODES * n_depth * nn, sizeof *w->radiation);
        w->force = calloc(SY_BODY_NMODES * n_depth * nn, sizeof *w->force);
    }
    if (w == NULL || w->diffraction == NULL || w->radiation == NULL || w->force == NULL) {
        sy_body_waves_free(w);
        return sy_error_set(err, SY_ENOMEM, "body waves for M = %zu, Q = %zu", n_order, n_depth);
    }
    *out = w;
    return SY_OK;
}

void sy_body_waves_free(sy_body_waves *w)
{
    if (w == NULL)
        return;
    free(w->diffraction);
    free(w->radiation);
    free(w->force);
    free(w);
}

int sy_body_plan_create(sy_body_plan **out, const sy_body_geometry *geom, double h,
                        double tolerance, size_t n_order, size_t n_depth, sy_error *err)
{
    const syi_body_ops *ops = geom != NULL ? ops_for(geom->kind) : NULL;
    if (ops == NULL)
        return sy_error_set(err, SY_EINVAL, "body: unknown body kind");
    if (!(h > 0.0) || !isfinite(h))
        return sy_error_set(err, SY_EINVAL, "body: depth must be > 0 m and finite, got %g", h);
    if (!(geom->radius > 0.0) || !isfinite(geom->radius))
        return sy_error_set(err, SY_EINVAL, "body: radius must be > 0 m, got %g", geom->radius);
    if (geom->kind == SY_BODY_FLOAT && !(geom->draft > 0.0 && geom->draft < h))
        return sy_error_set(err, SY_EINVAL,
                            "body: draft must be > 0 and < depth %g m for a float, got %g", h,
                            geom->draft);
    if (!(tolerance > 0.0 && tolerance < 1.0))
        return sy_error_set(err, SY_EINVAL, "body: tolerance must be in (0, 1), got %g", tolerance);
    if (n_depth == 0)
        return sy_error_set(err, SY_EINVAL, "body: need at least one depth mode");
    sy_body_plan *p = calloc(1, sizeof *p);
    if (p == NULL)
        return sy_error_set(err, SY_ENOMEM, "body plan");
    p->geom = *geom;
    if (p->geom.kind == SY_BODY_COLUMN)
        p->geom.draft = h;
    p->h = h;
    p->tolerance = tolerance;
    p->n_order = n_order;
    p->n_depth = n_depth;
    int rc = ops->plan_init(p, err);
    if (rc != SY_OK) {
        sy_body_plan_free(p);
        return rc;
    }
    *out = p;
    return SY_OK;
}

void sy_body_plan_free(sy_body_plan *plan)
{
    if (plan == NULL)
        return;
    const syi_body_ops *ops = ops_for(plan->geom.kind);
    if (ops != NULL && plan->impl != NULL)
        ops->plan_free(plan);
    free(plan);
}

size_t sy_body_plan_roots_needed(const sy_body_plan *plan) { return plan->n_roots; }

int sy_body_work_alloc(sy_body_work **out, const sy_body_plan *plan, sy_error *err)
{
    sy_body_work *w = calloc(1, sizeof *w);
    if (w == NULL)
        return sy_error_set(err, SY_ENOMEM, "body work");
    w->kind = plan->geom.kind;
    int rc = ops_for(plan->geom.kind)->work_init(w, plan, err);
    if (rc != SY_OK) {
        sy_body_work_free(w);
        return rc;
    }
    *out = w;
    return SY_OK;
}

void sy_body_work_free(sy_body_work *work)
{
    if (work == NULL)
        return;
    const syi_body_ops *ops = ops_for(work->kind);
    if (ops != NULL && work->impl != NULL)
        ops->work_free(work);
    free(work);
}

int sy_body_solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                  sy_body_work *work, sy_body_waves *out, sy_error *err)
{
    if (roots == NULL || out == NULL || work == NULL)
        return sy_error_set(err, SY_EINVAL, "body solve: NULL argument");
    if (!(creal(roots->omega) > 0.0))
        return sy_error_set(err, SY_EINVAL, "body solve: Re omega must be > 0 rad/s, got %g",
                            creal(roots->omega));
    if (roots->n_evanescent < plan->n_roots || roots->h != plan->h)
        return sy_error_set(err, SY_EINVAL,
                            "body solve: roots for depth %g m with %zu evanescent modes, plan needs "
                            "depth %g m and %zu", roots->h, roots->n_evanescent, plan->h,
                            plan->n_roots);
    if (out->n_order != plan->n_order || out->n_depth != plan->n_depth)
        return sy_error_set(err, SY_EINVAL, "body solve: result sized M = %zu, Q = %zu, plan has %zu, %zu",
                            out->n_order, out->n_depth, plan->n_order, plan->n_depth);
    if (!(rho > 0.0))
        return sy_error_set(err, SY_EINVAL, "body solve: density must be > 0, got %g", rho);
    out->omega = roots->omega;
    return ops_for(plan->geom.kind)->solve(plan, roots, rho, work, out, err);
}
