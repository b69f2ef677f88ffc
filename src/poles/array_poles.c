/* The array's resonances (poles.h): the motion and scattering eigenproblems handed to the
 * contour solver (contour.c) through one solve callback each. All families searched in
 * one call share the contour points, and every contour point costs one array solve: the
 * motion problems assemble Z(omega) from it, and the LU of I - D T it leaves in the work
 * gives log det(I - D T) (the scattering determinant, and the pole function of Z) for free. */
#include <complex.h>
#include "poles_impl.h"
#include "swellyield/array.h"
#include "swellyield/dynamics.h"
#include "swellyield/hydro.h"
#include "swellyield/poles.h"

#include <float.h>
#include <lapacke.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#define N_POINTS 64        /* trapezoid points on the ellipse: geometric convergence */
#define POLES_BODY_TOL 1e-9
#define SAME_POLE 1e-6     /* poles closer than this (relative) from two sub-regions are one */
#define MAX_SPLIT 2        /* a region whose contour fails or disagrees is halved, at most twice */
#define RANK_TOL 1e-12     /* singular values of the moment matrix below this (relative) are dropped */
#define POLISH_TOL 1e-12   /* secant stop when the hydrodynamics are tight enough for it */
#define MAX_MOMENTS 4      /* K <= 4: capacity 4 n_dof - 1 motion poles per contour */
#define MAX_POLES 256
#define NULL_ITER 2        /* inverse-iteration steps for a scattering null vector */
#define SEED 11

const char *sy_pole_kind_name(sy_pole_kind k)
{
    static const char *const names[] = {"motion", "motion_no_pto", "scattering"};
    return (unsigned)k < 3 ? names[k] : "?";
}

int sy_pole_same(const sy_pole *a, const sy_pole *b)
{
    return a->kind == b->kind && cabs(a->omega - b->omega) <= 1e-6 * cabs(b->omega);
}

int sy_pole_repeats(const sy_pole_set *set, size_t i)
{
    for (size_t k = 0; k < i; k++)
        if (sy_pole_same(&set->poles[k], &set->poles[i]))
            return 1;
    return 0;
}

/* One array evaluation per distinct omega, shared by every problem of the search. */
typedef struct shared {
    const sy_array_plan *plan;
    sy_array_work *work;
    sy_array_hydro *res;
    double complex omega;
    int state;                /* 0 nothing, 1 I - D T factorised, 2 full solve at omega */
    size_t evaluations;
} shared;

static int need(shared *s, double complex w, int state, sy_error *err)
{
    if (s->state >= state && s->omega == w)
        return SY_OK;
    double complex ld;
    int rc = state == 2 ? sy_array_solve(s->plan, w, s->work, s->res, err)
                        : sy_array_interaction_logdet(s->plan, w, s->work, &ld, err);
    s->evaluations++;
    s->state = rc == SY_OK ? state : 0;
    s->omega = w;
    return rc;
}

typedef struct motion_ctx {
    shared *sh;
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

/* Z(omega) with det(I - D T) as its pole function: zeros of Z inside a contour =
 * winding(det Z) + winding(det(I - D T)) (Z = Schur complement of the coupled
 * body-and-wave system, whose determinant is det Z det(I - D T)). */
static int motion_solve(void *p, double complex w, size_t nrhs, const double complex *rhs, double complex *x,
                        double complex *logdet, double complex *logpole, sy_error *err)
{
    motion_ctx *c = p;
    size_t n = c->nd;
    int rc = need(c->sh, w, 2, err);
    if (rc != SY_OK)
        return rc;
    const double complex *zr = c->sh->res->impedance;
    for (size_t i = 0; i < n; i++)
        for (size_t j = 0; j < n; j++) {
            double complex z = c->stiff[i * n + j] - w * w * c->mass[i * n + j] - I * w * zr[i * n + j];
            if (i == j)
                z += c->kpto[i] - I * w * (c->bpto[i] + c->visc[i]);
            c->t[j * n + i] = z;
        }
    if (logpole != NULL) {
        rc = sy_array_factored_logdet(c->sh->plan, c->sh->work, logpole, err);
        if (rc != SY_OK)
            return rc;
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

/* Pole order of det Z at each scattering zero (a zero listed twice is one double zero),
 * summed: from |det Z| ~ |omega - z|^-m at two offsets, POLE_PROBE and twice that
 * (relative), so 2 evaluations per distinct zero. A zero whose wave pattern does not move
 * the bodies' dofs (e.g. by symmetry) has m = 0: it is no pole of Z. */
#define POLE_PROBE 1e-6
static int coupled_zeros(void *ctx, const syi_nep_eig *sz, size_t n_sz, int *poles, sy_error *err)
{
    int total = 0;
    for (size_t i = 0; i < n_sz; i++) {
        if (i > 0 && sz[i].omega == sz[i - 1].omega)
            continue;
        double complex w = sz[i].omega, ld[2];
        for (int j = 0; j < 2; j++) {
            int rc = motion_solve(ctx, w * (1.0 + POLE_PROBE * (j + 1)), 0, NULL, NULL, &ld[j], NULL, err);
            if (rc != SY_OK)
                return rc;
        }
        long m = lround((creal(ld[0]) - creal(ld[1])) / M_LN2);
        total += m > 0 ? (int)m : 0;
    }
    *poles = total;
    return SY_OK;
}

/* det(I - D T) of the fixed array: a determinant-only problem. */
static int scatter_solve(void *p, double complex w, size_t nrhs, const double complex *rhs, double complex *x,
                         double complex *logdet, double complex *logpole, sy_error *err)
{
    shared *s = p;
    (void)nrhs, (void)rhs, (void)x;
    if (logpole != NULL)
        *logpole = 0;
    int rc = need(s, w, 1, err);
    if (rc == SY_OK && logdet != NULL)
        rc = sy_array_factored_logdet(s->plan, s->work, logdet, err);
    return rc;
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

/* Body-wise amplitude of a scattering resonance: the null vector of I - D T (scaled basis:
 * each outgoing partial wave measured at its body's radius) by inverse iteration at the
 * polished pole; body b's amplitude is the 2-norm of its coefficients, with the phase of
 * its axisymmetric propagating coefficient (q = 0, n = 0) when that carries at least
 * AXI_SHARE of the body's norm (else the phase of its largest coefficient); largest 1.
 * against (may be NULL): the unit null vector of the first entry of a double zero; the
 * iteration is kept orthogonal to it, so the second entry gets the other direction of
 * the two-dimensional null space. vec: n_u, the unit null vector on return. */
#define AXI_SHARE 1e-3
static int scattering_mode(shared *s, double complex w, double complex *vec, const double complex *against,
                           double complex *mode, size_t n_bodies, sy_error *err)
{
    size_t nu = sy_array_plan_n_unknowns(s->plan);
    int rc = need(s, w, 1, err);
    if (rc == SY_ESINGULAR) { /* exactly singular in double: step off by a rounding unit */
        sy_error_clear(err);
        rc = need(s, w * (1 + 4 * DBL_EPSILON), 1, err);
    }
    if (rc != SY_OK)
        return rc;
    unsigned long long seed = SEED;
    for (size_t u = 0; u < nu; u++) {
        seed ^= seed >> 12, seed ^= seed << 25, seed ^= seed >> 27;
        vec[u] = (double)((seed * 2685821657736338717ULL) >> 11) / 9007199254740992.0 - 0.5;
    }
    for (int it = 0; it < NULL_ITER && rc == SY_OK; it++) {
        rc = sy_array_interaction_solve(s->plan, s->work, vec, vec, err);
        if (against != NULL) {
            double complex c = 0;
            for (size_t u = 0; u < nu; u++)
                c += conj(against[u]) * vec[u];
            for (size_t u = 0; u < nu; u++)
                vec[u] -= c * against[u];
        }
        double nv = 0;
        for (size_t u = 0; u < nu; u++)
            nv += creal(vec[u] * conj(vec[u]));
        nv = sqrt(nv);
        for (size_t u = 0; rc == SY_OK && u < nu; u++)
            vec[u] /= nv;
    }
    if (rc != SY_OK)
        return rc;
    double *norm = calloc(n_bodies, sizeof *norm), *big = calloc(n_bodies, sizeof *big);
    double complex *axi = calloc(n_bodies, sizeof *axi), *top = calloc(n_bodies, sizeof *top);
    if (!norm || !big || !axi || !top) {
        free(norm), free(big), free(axi), free(top);
        return sy_error_set(err, SY_ENOMEM, "scattering mode of %zu bodies", n_bodies);
    }
    for (size_t u = 0; u < nu; u++) {
        size_t b, q;
        long ord;
        sy_array_plan_unknown(s->plan, u, &b, &q, &ord);
        if (b >= n_bodies)
            continue;
        double a = cabs(vec[u]);
        norm[b] += a * a;
        if (a > big[b])
            big[b] = a, top[b] = vec[u];
        if (q == 0 && ord == 0)
            axi[b] = vec[u];
    }
    double nmax = 0;
    size_t bmax = 0;
    for (size_t b = 0; b < n_bodies; b++) {
        norm[b] = sqrt(norm[b]);
        double complex ref = cabs(axi[b]) >= AXI_SHARE * norm[b] ? axi[b] : top[b];
        mode[b] = ref != 0 ? norm[b] * ref / cabs(ref) : 0;
        if (norm[b] > nmax)
            nmax = norm[b], bmax = b;
    }
    double complex scale = mode[bmax];
    for (size_t b = 0; b < n_bodies; b++)
        mode[b] = scale != 0 ? mode[b] / scale : 0;
    free(norm), free(big), free(axi), free(top);
    return SY_OK;
}

/* Poles of one contour into the set, each once (the ellipses of a split region overlap);
 * returns how many of them an earlier contour had found. */
static size_t add_poles(sy_pole_set *set, size_t earlier, const syi_nep_eig *eig, size_t n_found, sy_pole_kind kind,
                        size_t nd)
{
    size_t repeated = 0;
    for (size_t i = 0; i < n_found; i++) {
        double complex w = eig[i].omega;
        int seen = 0; /* found by an earlier contour (poles[0..earlier-1]); one contour's
                         repeated values are a multiple eigenvalue with independent modes */
        for (size_t q = 0; q < earlier && !seen; q++)
            seen = set->poles[q].kind == kind && cabs(set->poles[q].omega - w) <= SAME_POLE * cabs(w);
        if (seen) {
            repeated++;
            continue;
        }
        if (set->n >= MAX_POLES)
            break;
        sy_pole *p = &set->poles[set->n];
        p->omega = w, p->omega_r = creal(w), p->gamma = -cimag(w);
        p->q = p->gamma > 0 ? p->omega_r / (2 * p->gamma) : INFINITY;
        p->kind = kind;
        p->residual = eig[i].residual;
        p->converged = eig[i].converged;
        if (kind != SY_POLE_SCATTERING)
            memcpy(set->modes + set->n * nd, eig[i].v, nd * sizeof *set->modes);
        p->mode = NULL; /* pointers fixed up after the last fill */
        set->n++;
        set->found[kind]++;
    }
    return repeated;
}

/* The same truncation as the run, but the body solves to 1e-9: the float chooses its
 * exterior modes per frequency from the tolerance, and the contour integrals, the polish
 * and the residues need T analytic well below the accuracy asked of the poles. */
void syi_poles_model(const sy_model *m, sy_model *mt)
{
    *mt = *m;
    sy_hydro_truncation(m, m->devices, m->n_devices, &mt->orders, &mt->depth_modes);
    mt->tolerance = fmin(m->tolerance, POLES_BODY_TOL);
}

int sy_poles_find(sy_pole_set **out, const sy_model *m, unsigned kinds, sy_error *err)
{
    return sy_poles_find_progress(out, m, kinds, NULL, NULL, err);
}

int sy_poles_find_progress(sy_pole_set **out, const sy_model *m, unsigned kinds,
                           void (*progress)(void *ctx, size_t done, size_t total), void *progress_ctx, sy_error *err)
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
    double complex *vbuf = NULL, *nullv = NULL, *firstv = NULL;
    motion_ctx mc[2] = {{0}, {0}};
    shared sh = {0};
    if (set == NULL) {
        return sy_error_set(err, SY_ENOMEM, "pole search");
    }
    set->count[0] = set->count[1] = set->count[2] = SY_POLES_NOT_SEARCHED;
    sy_model mt;
    syi_poles_model(m, &mt);
    rc = sy_hydro_plan_create(&plan, &mt, m->devices, m->n_devices, err);
    if (rc == SY_OK)
        rc = sy_array_work_alloc(&work, plan, err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&res, plan, err);
    size_t nd = rc == SY_OK ? sy_array_plan_n_dof(plan) : 0, nu = rc == SY_OK ? sy_array_plan_n_unknowns(plan) : 0;
    if (rc == SY_OK) {
        set->n_dof = nd;
        set->poles = calloc(MAX_POLES, sizeof *set->poles);
        set->modes = calloc(MAX_POLES * (nd ? nd : 1), sizeof *set->modes);
        vbuf = malloc(3 * MAX_POLES * (nd + 1) * sizeof *vbuf);
        nullv = malloc((nu + 1) * sizeof *nullv);
        firstv = malloc((nu + 1) * sizeof *firstv);
        if (!set->poles || !set->modes || !vbuf || !nullv || !firstv)
            rc = sy_error_set(err, SY_ENOMEM, "pole search for %zu dofs", nd);
    }
    for (int k = 0; rc == SY_OK && k < 2; k++) {
        mc[k].bpto = calloc(nd + 1, sizeof *mc[k].bpto);
        mc[k].kpto = calloc(nd + 1, sizeof *mc[k].kpto);
        mc[k].t = malloc((nd * nd + 1) * sizeof *mc[k].t);
        mc[k].ipiv = malloc((nd + 1) * sizeof *mc[k].ipiv);
        if (!mc[k].bpto || !mc[k].kpto || !mc[k].t || !mc[k].ipiv)
            rc = sy_error_set(err, SY_ENOMEM, "pole search for %zu dofs", nd);
    }
    /* Three eigenvalue lists (one per family), MAX_POLES each. */
    syi_nep_eig *eigs = rc == SY_OK ? calloc(3 * MAX_POLES, sizeof *eigs) : NULL;
    if (rc == SY_OK && eigs == NULL)
        rc = sy_error_set(err, SY_ENOMEM, "pole search");
    for (size_t i = 0; rc == SY_OK && i < 3 * MAX_POLES; i++)
        eigs[i].v = vbuf + i * (nd + 1);
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
    }
    sh.plan = plan, sh.work = work, sh.res = res;
    /* The problems of this search: motion with the PTO, without it, scattering. */
    syi_nep nep[3];
    sy_pole_kind kind_of[3];
    size_t n_prob = 0;
    double scale = 0;
    for (int k = 0; rc == SY_OK && dyn != NULL && k < 2; k++) {
        if (!(kinds & (k == 0 ? SY_POLES_MOTION : SY_POLES_NO_PTO)))
            continue;
        motion_ctx *c = &mc[k];
        c->sh = &sh, c->nd = nd;
        sy_dyn_plan_matrices(dyn, &c->mass, &c->stiff, &c->visc);
        for (size_t q = 0; k == 0 && q < sy_dyn_n_devices(dyn); q++) {
            size_t d = sy_dyn_pto_dof(dyn, q);
            const sy_model_device *dev = &m->devices[sy_dyn_device_body(dyn, q)];
            c->bpto[d] = dev->pto_damping, c->kpto[d] = dev->pto_stiffness;
        }
        /* Scale of Z for relative residuals: hydrostatic stiffness, or mass omega^2. */
        double wc = 0.5 * (m->res_re_min + m->res_re_max);
        for (size_t i = 0; i < nd; i++)
            scale = fmax(scale, fmax(fabs(c->stiff[i * nd + i]), c->mass[i * nd + i] * wc * wc));
        nep[n_prob] = (syi_nep){nd, motion_solve, c, scale};
        kind_of[n_prob++] = k == 0 ? SY_POLE_MOTION : SY_POLE_MOTION_NO_PTO;
    }
    if (rc == SY_OK && (kinds & SY_POLES_SCATTERING)) {
        nep[n_prob] = (syi_nep){0, scatter_solve, &sh, 1.0};
        kind_of[n_prob++] = SY_POLE_SCATTERING;
    }
    syi_ellipse ell = region_ellipse(m->res_re_min, m->res_re_max, m->res_im_depth);
    set->centre = ell.centre, set->ax = ell.ax, set->ay = ell.ay;
    /* The polish can only resolve the pole as well as T is analytic: the float body's
     * truncation (chosen per frequency from the tolerance) bounds it. */
    syi_nep_settings st = {N_POINTS, nd, MAX_MOMENTS, RANK_TOL, fmax(POLISH_TOL, 1e-2 * mt.tolerance), SEED,
                           mt.tolerance, progress, progress_ctx};
    /* The whole region first; where a contour fails (capacity) or its rank, count and found
     * disagree, halve the region along Re omega and retry, at most MAX_SPLIT times: 1, 2, 4
     * ellipses. Counts of overlapping ellipses are combined by subtracting the poles found
     * in more than one of them. */
    for (int level = 0; rc == SY_OK && n_prob > 0 && level <= MAX_SPLIT; level++) {
        size_t parts = (size_t)1 << level, n_before = set->n;
        int count[3] = {0, 0, 0}, consistent = 1;
        double w = (m->res_re_max - m->res_re_min) / (double)parts;
        for (size_t q = 0; q < parts && rc == SY_OK; q++) {
            syi_ellipse e = region_ellipse(m->res_re_min + w * (double)q, m->res_re_min + w * (double)(q + 1),
                                           m->res_im_depth);
            syi_nep_result r[3];
            syi_nep_eig *const el[3] = {eigs, eigs + MAX_POLES, eigs + 2 * MAX_POLES};
            size_t room[3] = {MAX_POLES, MAX_POLES, MAX_POLES};
            rc = syi_nep_contour_multi(nep, n_prob, &e, &st, el, room, r, err);
            if (rc != SY_OK)
                break;
            set->evaluations_contour += N_POINTS, set->evaluations_tracking += r[0].refined;
            size_t earlier = set->n;
            /* The scattering zeros of this contour (when searched) tell how many of them
             * are poles of Z: the motion count becomes exact where found is short of it. */
            const syi_nep_eig *sz = NULL;
            size_t n_sz = 0;
            int exact[3] = {0, 0, 0};
            for (size_t k = 0; k < n_prob; k++)
                exact[k] = r[k].count;
            for (size_t k = 0; k < n_prob; k++)
                if (kind_of[k] == SY_POLE_SCATTERING)
                    sz = el[k], n_sz = r[k].n_found;
            for (size_t k = 0; k < n_prob && rc == SY_OK; k++) {
                if (kind_of[k] == SY_POLE_SCATTERING || sz == NULL || (int)r[k].n_found >= r[k].count)
                    continue;
                int poles = 0;
                rc = coupled_zeros(nep[k].ctx, sz, n_sz, &poles, err);
                exact[k] = r[k].count_low + poles;
            }
            for (size_t k = 0; k < n_prob && rc == SY_OK; k++) {
                size_t rep = add_poles(set, earlier, el[k], r[k].n_found, kind_of[k], nd);
                count[kind_of[k]] += exact[k] - (int)rep;
                /* Motion: found within the argument-principle bounds (a zero of det(I - D T)
                 * whose mode does not couple to the bodies' dofs, e.g. by symmetry, is not a
                 * pole of Z and leaves found below the upper bound). Where found is short of
                 * the upper bound and the scattering zeros were searched too, the count
                 * reported is the exact one (coupled_zeros): a difference from found then
                 * means a pole missed (near the contour; the contour's rescue pass already
                 * retried stalled estimates from the poles next to them), reported, not
                 * retried: splitting a thin region does not recover it reliably
                 * (docs/benchmarks.md).
                 * Scattering: found equal to the count. */
                int nf = (int)r[k].n_found;
                consistent &= kind_of[k] == SY_POLE_SCATTERING ? nf == r[k].count
                                                               : nf >= r[k].count_low && nf <= r[k].count;
            }
        }
        if (rc == SY_OK && (consistent || level == MAX_SPLIT)) {
            for (size_t k = 0; k < n_prob; k++)
                set->count[kind_of[k]] = count[kind_of[k]];
            break;
        }
        if (rc != SY_OK && (rc != SY_ENOCONV || level == MAX_SPLIT))
            break;
        /* retry every family with smaller contours */
        set->n = n_before;
        set->found[0] = set->found[1] = set->found[2] = 0;
        rc = SY_OK;
        sy_error_clear(err);
    }
    /* Scattering resonances: body-wise mode shapes from the null vectors; the two entries
     * of a double zero (consecutive, add_poles) get two independent ones. */
    int mode_rows = nd == m->n_devices; /* scattering modes are per body: stored when one dof per body */
    size_t first = SIZE_MAX; /* the previous scattering pole, if it may start a pair */
    for (size_t i = 0; rc == SY_OK && mode_rows && i < set->n; i++) {
        if (set->poles[i].kind != SY_POLE_SCATTERING)
            continue;
        int second = first != SIZE_MAX && sy_pole_same(&set->poles[first], &set->poles[i]);
        if (second)
            memcpy(firstv, nullv, nu * sizeof *nullv);
        rc = scattering_mode(&sh, set->poles[i].omega, nullv, second ? firstv : NULL, set->modes + i * nd,
                             m->n_devices, err);
        first = second ? SIZE_MAX : i;
    }
    set->evaluations = sh.evaluations;
    if (rc == SY_OK) {
        /* Sort with the mode storage. */
        sy_pole *sorted = malloc(set->n * sizeof *sorted + 1);
        double complex *modes = malloc(set->n * (nd ? nd : 1) * sizeof *modes + 1);
        if (sorted == NULL || modes == NULL) {
            rc = sy_error_set(err, SY_ENOMEM, "pole list");
        } else {
            for (size_t i = 0; i < set->n; i++)
                set->poles[i].mode = set->modes + i * nd; /* original slot, to recover the index */
            memcpy(sorted, set->poles, set->n * sizeof *sorted);
            qsort(sorted, set->n, sizeof *sorted, by_frequency);
            for (size_t i = 0; i < set->n; i++)
                memcpy(modes + i * nd, sorted[i].mode, nd * sizeof *modes);
            memcpy(set->poles, sorted, set->n * sizeof *sorted);
            memcpy(set->modes, modes, set->n * nd * sizeof *modes);
            for (size_t i = 0; i < set->n; i++)
                set->poles[i].mode = set->poles[i].kind != SY_POLE_SCATTERING || mode_rows ? set->modes + i * nd : NULL;
        }
        free(sorted);
        free(modes);
    }
    for (int k = 0; k < 2; k++) {
        free(mc[k].bpto);
        free(mc[k].kpto);
        free(mc[k].t);
        free(mc[k].ipiv);
    }
    free(vbuf);
    free(nullv);
    free(firstv);
    free(eigs);
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
