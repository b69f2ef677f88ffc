/* The float body kind (floating truncated vertical cylinder): plan and work objects and
 * the ops table the dispatch in plan.c calls. Geometry-only set-up in float_plan.c, the
 * per-frequency solve in float_solve.c; layouts in float_impl.h. */
#include "float_impl.h"

#include <stdlib.h>

static void plan_free(sy_body_plan *plan)
{
    syi_float_plan_release(plan->impl);
    free(plan->impl);
    plan->impl = NULL;
}

static int plan_init_forced(sy_body_plan *plan, size_t P, int P2, size_t Qx, sy_error *err)
{
    syi_float_plan *fp = calloc(1, sizeof *fp);
    if (fp == NULL)
        return sy_error_set(err, SY_ENOMEM, "float plan");
    plan->impl = fp;
    int rc = syi_float_plan_build(fp, plan, P, Qx, P2, err);
    if (rc != SY_OK) {
        sy_error_prefix(err, "float plan (a = %g m, d = %g m, h = %g m)", plan->geom.radius,
                        plan->geom.draft, plan->h);
        return rc;   /* plan_free releases the half-built plan */
    }
    plan->n_roots = fp->Qx[fp->nqlev - 1];
    return SY_OK;
}

static int plan_init(sy_body_plan *plan, sy_error *err) { return plan_init_forced(plan, 0, -1, 0, err); }

int syi_body_float_plan_create(sy_body_plan **out, const sy_body_geometry *geom, double h,
                               size_t P, int P2, size_t Qx, size_t n_order, size_t n_depth,
                               sy_error *err)
{
    /* validate through the public path (a plan at the default truncation is cheap to
     * discard next to the forced one) */
    sy_body_plan *check = NULL;
    int rc = sy_body_plan_create(&check, geom, h, 1e-3, n_order, n_depth, err);
    sy_body_plan_free(check);
    if (rc != SY_OK)
        return rc;
    sy_body_plan *p = calloc(1, sizeof *p);
    if (p == NULL)
        return sy_error_set(err, SY_ENOMEM, "body plan");
    p->geom = *geom;
    p->h = h;
    p->tolerance = 0.0;
    p->n_order = n_order;
    p->n_depth = n_depth;
    rc = plan_init_forced(p, P, P2, Qx, err);
    if (rc != SY_OK) {
        sy_body_plan_free(p);
        return rc;
    }
    *out = p;
    return SY_OK;
}

static void work_free(sy_body_work *work)
{
    syi_float_work *w = work->impl;
    if (w == NULL)
        return;
    free(w->proj);
    free(w->norm);
    free(w->kap);
    free(w->ip_hp);
    free(w->w_hp);
    free(w->inh);
    free(w->ext);
    free(w->mat);
    free(w->rhs);
    free(w->kbuf);
    free(w->kbuf2);
    free(w->rt);
    free(w->fdif);
    free(w);
    work->impl = NULL;
}

static int work_init(sy_body_work *work, const sy_body_plan *plan, sy_error *err)
{
    const syi_float_plan *fp = plan->impl;
    syi_float_work *w = calloc(1, sizeof *w);
    if (w == NULL)
        return sy_error_set(err, SY_ENOMEM, "float work");
    work->impl = w;
    size_t M1 = fp->M + 1, Q = fp->Q, L = fp->L, n = fp->PG + 1;
    size_t qs = Q > 0 ? Q : 1;
    w->nq = fp->Qx[fp->nqlev - 1] + 1;   /* capacity; each solve uses its rung */
    w->ncol = Q + 2;
    w->proj = malloc(w->nq * L * sizeof *w->proj);
    w->norm = malloc(w->nq * sizeof *w->norm);
    w->kap = malloc(w->nq * M1 * sizeof *w->kap);
    w->ip_hp = malloc(M1 * qs * sizeof *w->ip_hp);
    w->w_hp = malloc(M1 * qs * sizeof *w->w_hp);
    w->inh = malloc(M1 * qs * sizeof *w->inh);
    w->ext = malloc(SYI_FLOAT_LEVELS * M1 * L * L * sizeof *w->ext);
    w->mat = malloc(n * n * sizeof *w->mat);
    w->rhs = malloc(n * w->ncol * sizeof *w->rhs);
    w->kbuf = malloc((fp->M + 3) * sizeof *w->kbuf);
    w->kbuf2 = malloc((fp->M + 3) * sizeof *w->kbuf2);
    w->rt = malloc(3 * qs * sizeof *w->rt);
    w->fdif = malloc(3 * qs * sizeof *w->fdif);
    if (!w->proj || !w->norm || !w->kap || !w->ip_hp || !w->w_hp || !w->inh || !w->ext ||
        !w->mat || !w->rhs || !w->kbuf || !w->kbuf2 || !w->rt || !w->fdif)
        return sy_error_set(err, SY_ENOMEM, "float work for %zu modes", w->nq);
    return SY_OK;
}

static int solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                 sy_body_work *work, sy_body_waves *out, sy_error *err)
{
    return syi_float_solve(plan, roots, rho, work->impl, out, err);
}

const syi_body_ops syi_body_float_ops = {plan_init, plan_free, work_init, work_free, solve};
