/* The array's resonances (poles.h): the motion and scattering eigenproblems handed to the
 * contour solver (contour.c) through one solve callback each. */
#include <complex.h>
#include "poles_impl.h"
#include "swellyield/array.h"
#include "swellyield/dynamics.h"
#include "swellyield/hydro.h"
#include "swellyield/poles.h"

#include <lapacke.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#define N_POINTS 64        /* trapezoid points on the ellipse: geometric convergence */
#define POLES_BODY_TOL 1e-9
#define SAME_POLE 1e-6     /* poles closer than this (relative) from two sub-regions are one */
#define MAX_SPLIT 2        /* a region whose contour fails is halved, at most twice */
#define RANK_TOL 1e-10     /* singular values of the moment matrix below this (relative) are noise */
#define POLISH_TOL 1e-12   /* secant stop when the hydrodynamics are tight enough for it */
#define MAX_POLES 256

const char *sy_pole_kind_name(sy_pole_kind k)
{
    static const char *const names[] = {"motion", "motion_no_pto", "scattering"};
    return (unsigned)k < 3 ? names[k] : "?";
}

typedef struct motion_ctx {
    const sy_array_plan *plan;
    sy_array_work *work;
    sy_array_hydro *res;
    size_t nd;
    const double *mass, *stiff, *visc;
    double *bpto, *kpto;      /* [nd] diagonal PTO damping and stiffness (0 off the PTO dofs) */
    double complex *t;        /* [nd * nd] column-major impedance, LU in place */
    lapack_int *ipiv;
} motion_ctx;

static double complex lu_logdet(const double complex *a, const lapack_int *ipiv, size_t n)
{
    double complex s = 0;
    size_t swaps = 0;
    for (size_t i = 0; i < n; i++) {
        s += clog(a[i * n + i]);
        swaps += (size_t)ipiv[i] != i + 1;
    }
    return (swaps & 1) ? s + I * M_PI : s;
}

static int motion_solve(void *p, double complex w, size_t nrhs, const double complex *rhs, double complex *x,
                        double complex *logdet, sy_error *err)
{
    motion_ctx *c = p;
    size_t n = c->nd;
    int rc = sy_array_solve(c->plan, w, c->work, c->res, err);
    if (rc != SY_OK)
        return rc;
    for (size_t i = 0; i < n; i++)
        for (size_t j = 0; j < n; j++) {
            double complex z = c->stiff[i * n + j] - w * w * c->mass[i * n + j] - I * w * c->res->impedance[i * n + j];
            if (i == j)
                z += c->kpto[i] - I * w * (c->bpto[i] + c->visc[i]);
            c->t[j * n + i] = z;
        }
    lapack_int info = LAPACKE_zgetrf(LAPACK_COL_MAJOR, (lapack_int)n, (lapack_int)n, c->t, (lapack_int)n, c->ipiv);
    if (info > 0)
        return sy_error_set(err, SY_ESINGULAR, "array impedance singular at omega = %g%+gi", creal(w), cimag(w));
    if (logdet != NULL)
        *logdet = lu_logdet(c->t, c->ipiv, n);
    if (nrhs > 0) {
        if (x != rhs)
            memcpy(x, rhs, n * nrhs * sizeof *x);
        info = LAPACKE_zgetrs(LAPACK_COL_MAJOR, 'N', (lapack_int)n, (lapack_int)nrhs, c->t, (lapack_int)n, c->ipiv, x,
                              (lapack_int)n);
        if (info != 0)
            return sy_error_set(err, SY_EINVAL, "zgetrs %d", (int)info);
    }
    return SY_OK;
}

void sy_pole_set_free(sy_pole_set *s)
{
    if (s == NULL)
        return;
    free(s->poles);
    free(s->modes);
    free(s);
}

static int by_frequency(const void *a, const void *b)
{
    double x = ((const sy_pole *)a)->omega_r, y = ((const sy_pole *)b)->omega_r;
    return (x > y) - (x < y);
}

/* The ellipse over the region re_min..re_max x -im_depth..0: scaled by sqrt 2 so it covers
 * the rectangle, but kept clear of omega = 0 (branch point of the wavenumber). */
static syi_ellipse region_ellipse(double re_min, double re_max, double im_depth)
{
    double cr = 0.5 * (re_min + re_max), hw = 0.5 * (re_max - re_min);
    syi_ellipse e = {cr - 0.5 * I * im_depth, fmin(M_SQRT2 * hw, 0.9 * cr), M_SQRT2 * 0.5 * im_depth};
    return e;
}

static int add_poles(sy_pole_set *set, const syi_nep_eig *eig, const syi_nep_result *res, sy_pole_kind kind,
                     const sy_model *m, size_t nd)
{
    for (size_t i = 0; i < res->n_found; i++) {
        double complex w = eig[i].omega;
        /* Keep only the region itself (the ellipse is larger), each pole once (the
         * ellipses of a split region overlap). */
        if (creal(w) < m->res_re_min || creal(w) > m->res_re_max || cimag(w) < -m->res_im_depth || cimag(w) > 0)
            continue;
        int seen = 0;
        for (size_t q = 0; q < set->n && !seen; q++)
            seen = set->poles[q].kind == kind && cabs(set->poles[q].omega - w) <= SAME_POLE * cabs(w);
        if (seen)
            continue;
        sy_pole *p = &set->poles[set->n];
        p->omega = w, p->omega_r = creal(w), p->gamma = -cimag(w);
        p->q = p->gamma > 0 ? p->omega_r / (2 * p->gamma) : INFINITY;
        p->kind = kind;
        p->residual = eig[i].residual;
        p->converged = eig[i].converged;
        if (kind != SY_POLE_SCATTERING) {
            memcpy(set->modes + set->n * nd, eig[i].v, nd * sizeof *set->modes);
            p->mode = NULL; /* pointers fixed up after the last realloc-free fill */
        }
        set->n++;
        set->found[kind]++;
    }
    return SY_OK;
}

int sy_poles_find(sy_pole_set **out, const sy_model *m, unsigned kinds, sy_error *err)
{
    int rc = sy_model_require(m, SY_NEED_RESONANCE, err);
    if (rc != SY_OK)
        return rc;
    sy_array_plan *plan = NULL;
    sy_array_work *work = NULL;
    sy_array_hydro *res = NULL;
    sy_hydro_db *db = NULL;
    sy_dyn_plan *dyn = NULL;
    sy_pole_set *set = calloc(1, sizeof *set);
    syi_nep_eig *eig = calloc(MAX_POLES, sizeof *eig);
    double complex *vbuf = NULL;
    motion_ctx mc = {0};
    if (set == NULL || eig == NULL) {
        free(set);
        free(eig);
        return sy_error_set(err, SY_ENOMEM, "pole search");
    }
    set->count[0] = set->count[1] = set->count[2] = SY_POLES_NOT_SEARCHED;
    /* The same truncation as the run, but the body solves to 1e-9: the float chooses its
     * exterior modes per frequency from the tolerance, and the contour integrals and the
     * polish need T analytic well below the accuracy asked of the poles. */
    sy_model mt = *m;
    sy_hydro_truncation(m, m->devices, m->n_devices, &mt.orders, &mt.depth_modes);
    mt.tolerance = fmin(m->tolerance, POLES_BODY_TOL);
    rc = sy_hydro_plan_create(&plan, &mt, m->devices, m->n_devices, err);
    if (rc == SY_OK)
        rc = sy_array_work_alloc(&work, plan, err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&res, plan, err);
    size_t nd = rc == SY_OK ? sy_array_plan_n_dof(plan) : 0, nu = rc == SY_OK ? sy_array_plan_n_unknowns(plan) : 0;
    size_t vn = nd > nu ? nd : nu;
    if (rc == SY_OK) {
        set->n_dof = nd;
        set->poles = calloc(MAX_POLES, sizeof *set->poles);
        set->modes = calloc(MAX_POLES * (nd ? nd : 1), sizeof *set->modes);
        vbuf = malloc(MAX_POLES * vn * sizeof *vbuf);
        mc.bpto = calloc(nd, sizeof *mc.bpto);
        mc.kpto = calloc(nd, sizeof *mc.kpto);
        mc.t = malloc(nd * nd * sizeof *mc.t);
        mc.ipiv = malloc(nd * sizeof *mc.ipiv);
        if (!set->poles || !set->modes || !vbuf || !mc.bpto || !mc.kpto || !mc.t || !mc.ipiv)
            rc = sy_error_set(err, SY_ENOMEM, "pole search for %zu dofs", nd);
    }
    for (size_t i = 0; rc == SY_OK && i < MAX_POLES; i++)
        eig[i].v = vbuf + i * vn;
    /* Mass and stiffness from the dynamics module: a one-frequency database carries the dof map. */
    if (rc == SY_OK && (kinds & (SY_POLES_MOTION | SY_POLES_NO_PTO)) && m->shape == SY_SHAPE_FLOAT) {
        rc = sy_hydro_db_alloc(&db, 1, 1, m->n_devices, nd, err);
        for (size_t d = 0; rc == SY_OK && d < nd; d++) {
            size_t b;
            int mode;
            sy_array_plan_dof(plan, d, &b, &mode);
            db->dof_body[d] = (int)b, db->dof_mode[d] = mode;
        }
        if (rc == SY_OK)
            rc = sy_dyn_plan_create(&dyn, m, db, m->pto_mode, err);
        if (rc == SY_OK)
            sy_dyn_plan_matrices(dyn, &mc.mass, &mc.stiff, &mc.visc);
    }
    syi_ellipse ell = region_ellipse(m->res_re_min, m->res_re_max, m->res_im_depth);
    set->centre = ell.centre, set->ax = ell.ax, set->ay = ell.ay;
    mc.plan = plan, mc.work = work, mc.res = res, mc.nd = nd;
    for (int pass = 0; rc == SY_OK && pass < 2 && dyn != NULL; pass++) {
        sy_pole_kind kind = pass == 0 ? SY_POLE_MOTION : SY_POLE_MOTION_NO_PTO;
        if (!(kinds & (pass == 0 ? SY_POLES_MOTION : SY_POLES_NO_PTO)))
            continue;
        memset(mc.bpto, 0, nd * sizeof *mc.bpto);
        memset(mc.kpto, 0, nd * sizeof *mc.kpto);
        for (size_t k = 0; pass == 0 && k < sy_dyn_n_devices(dyn); k++) {
            size_t d = sy_dyn_pto_dof(dyn, k);
            const sy_model_device *dev = &m->devices[sy_dyn_device_body(dyn, k)];
            mc.bpto[d] = dev->pto_damping, mc.kpto[d] = dev->pto_stiffness;
        }
        /* Scale of Z for relative residuals: hydrostatic stiffness, or mass omega^2. */
        double scale = 0;
        for (size_t i = 0; i < nd; i++)
            scale = fmax(scale, fmax(fabs(mc.stiff[i * nd + i]), mc.mass[i * nd + i] * cabs(ell.centre * ell.centre)));
        syi_nep nep = {nd, motion_solve, &mc, scale};
        /* The polish can only resolve the pole as well as T is analytic: the float body's
         * truncation (chosen per frequency from the tolerance) bounds it. */
        syi_nep_settings st = {N_POINTS, nd, 4, RANK_TOL, fmax(POLISH_TOL, 1e-2 * mt.tolerance), 11};
        /* The whole region first; where the contour fails (capacity reached, e.g. the
         * count is spoiled by poles of Z inside), halve it along Re omega and retry, at
         * most MAX_SPLIT times: 1, 2, 4 ellipses. */
        for (int level = 0; level <= MAX_SPLIT; level++) {
            size_t parts = (size_t)1 << level, n_before = set->n, fk = set->found[kind];
            int count = 0;
            double w = (m->res_re_max - m->res_re_min) / (double)parts;
            for (size_t q = 0; q < parts; q++) {
                syi_ellipse e = region_ellipse(m->res_re_min + w * (double)q, m->res_re_min + w * (double)(q + 1),
                                               m->res_im_depth);
                syi_nep_result r;
                rc = syi_nep_contour(&nep, &e, &st, eig, MAX_POLES - set->n, &r, err);
                set->evaluations += r.evaluations;
                if (rc != SY_OK)
                    break;
                count += r.count;
                add_poles(set, eig, &r, kind, m, nd);
            }
            if (rc == SY_OK) {
                set->count[kind] = count; /* sum over the sub-contours (overlaps may double-count) */
                break;
            }
            if (rc != SY_ENOCONV || level == MAX_SPLIT)
                break;
            set->n = n_before, set->found[kind] = fk; /* retry the kind with smaller contours */
            sy_error_clear(err);
        }
    }
    if (rc == SY_OK && (kinds & SY_POLES_SCATTERING)) {
        /* The scattering operator is solved in a basis scaled by |Hhat(k a)|, which is not
         * analytic in omega, so Beyn's moments do not apply to its solves; its determinant
         * is scale-free and analytic, so the argument principle counts its zeros.
         * TODO(#6): locate them (Delves-Lyness moments of d log det, Newton polish). */
        double phase = 0, prev = 0, first = 0;
        for (size_t j = 0; rc == SY_OK && j < N_POINTS; j++) {
            double t = 2 * M_PI * (double)j / N_POINTS;
            double complex z = ell.centre + ell.ax * cos(t) + I * ell.ay * sin(t), ld;
            rc = sy_array_interaction_logdet(plan, z, work, &ld, err);
            set->evaluations++;
            double ph = cimag(ld), d = ph - prev;
            if (j == 0)
                first = ph;
            else
                phase += d - 2 * M_PI * round(d / (2 * M_PI));
            prev = ph;
        }
        if (rc == SY_OK) {
            double d = first - prev;
            phase += d - 2 * M_PI * round(d / (2 * M_PI));
            set->count[SY_POLE_SCATTERING] = (int)lround(phase / (2 * M_PI));
        }
    }
    if (rc == SY_OK) {
        /* Sort with the mode storage: sort indices through a copy. */
        sy_pole *sorted = malloc(set->n * sizeof *sorted + 1);
        double complex *modes = malloc(set->n * (nd ? nd : 1) * sizeof *modes + 1);
        if (sorted == NULL || modes == NULL) {
            rc = sy_error_set(err, SY_ENOMEM, "pole list");
        } else {
            for (size_t i = 0; i < set->n; i++)
                set->poles[i].mode = set->poles[i].kind != SY_POLE_SCATTERING ? set->modes + i * nd : NULL;
            memcpy(sorted, set->poles, set->n * sizeof *sorted);
            qsort(sorted, set->n, sizeof *sorted, by_frequency);
            for (size_t i = 0; i < set->n; i++) {
                if (sorted[i].mode != NULL) {
                    memcpy(modes + i * nd, sorted[i].mode, nd * sizeof *modes);
                    sorted[i].mode = NULL;
                }
            }
            memcpy(set->poles, sorted, set->n * sizeof *sorted);
            for (size_t i = 0; i < set->n; i++)
                set->poles[i].mode = set->poles[i].kind != SY_POLE_SCATTERING ? set->modes + i * nd : NULL;
            memcpy(set->modes, modes, set->n * (nd ? nd : 1) * sizeof *modes);
        }
        free(sorted);
        free(modes);
    }
    free(mc.bpto);
    free(mc.kpto);
    free(mc.t);
    free(mc.ipiv);
    free(vbuf);
    free(eig);
    sy_dyn_plan_free(dyn);
    sy_hydro_db_free(db);
    sy_array_hydro_free(res);
    sy_array_work_free(work);
    sy_array_plan_free(plan);
    if (rc != SY_OK) {
        sy_pole_set_free(set);
        return rc;
    }
    *out = set;
    return SY_OK;
}
