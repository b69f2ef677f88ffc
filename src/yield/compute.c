/* The four tuning strategies over a climate: power matrices, annual energy, q-factor
 * (yield.h). Responses come from the dynamics module, sea states from seastates.c.
 * Responses that do not depend on the bin (fixed damping, one site damping, the
 * reactive bound) are tabulated once per (omega, heading) and each bin is a weighted
 * sum of the table; the per-sea-state search evaluates only the bin's headings. */
#include <complex.h>
#include "yield_impl.h"
#include "swellyield/dynamics.h"

#include <gsl/gsl_errno.h>
#include <gsl/gsl_min.h>
#include <gsl/gsl_roots.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>


/* Search range for the shared damping, relative to the isolated device's passive optimum
 * at the bin's energy frequency: +-3 decades hold every sensible PTO setting. */
#define B_RANGE 1e3
#define BRACKET_STEP 1.0986 /* ln 3: first step of the bracketing search in log b */
#define LOGB_TOL 1e-5   /* precision of log b: the power is flat at its maximum, so this
                           is far below any effect on energy */
/* Sea-state cells (frequency x heading) whose share of a group's energy is below this
 * are skipped: at most n_omega x n_headings x 1e-12 of the energy, far below any digit
 * reported. */
#define CELL_FLOOR 1e-12
/* The damping searches only need the location of a flat maximum: cells below 1e-7 of a
 * group's energy (together < 1e-4 of it) are left out of the search, not of the results. */
#define SEARCH_FLOOR 1e-7
#define MAX_ITER 100
/* A significant stroke within 0.1 % of max_stroke counts as meeting it: the limit itself
 * is a screening value (yield.h), and the stroke search runs on the search cells. */
#define STROKE_SLACK 1e-3

const char *sy_yield_strategy_name(int s)
{
    static const char *const names[] = {"fixed", "per_sea_state", "site_optimal", "reactive_bound"};
    return s >= 0 && s < SY_YIELD_N_STRATEGIES ? names[s] : "?";
}

/* The (frequency, heading) cells of each group with a non-negligible energy share. */
typedef struct cells {
    size_t *start;      /* [n_groups + 1] each group's cells */
    unsigned *io, *ih;  /* frequency and heading index of each cell */
    double *a2;         /* amplitude^2 per unit Hs^2 of each cell, m^2/m^2 */
} cells;

typedef struct ctx {
    const sy_model *m;
    const syi_yield_seas *seas;
    const sy_hydro_db *db;
    size_t nd, no, nh;              /* devices, frequencies, headings */
    sy_dyn_plan *plan;
    sy_dyn_work *work;
    sy_dyn_modal *modal;
    size_t n_iso;                   /* distinct isolated databases */
    const sy_hydro_db **iso_db;     /* [n_iso] */
    size_t *iso_of;                 /* [nd] */
    sy_model *iso_model;            /* [n_iso] one-device models */
    sy_dyn_plan **iso_plan;         /* [n_iso] */
    sy_dyn_work **iso_work;         /* [n_iso] */
    sy_dyn_modal **iso_modal;       /* [n_iso] */
    double complex *scratch, *xi;   /* [nd], [nh * n_dof] */
    double *pw, *m2, *pdev, *vdev;  /* [nd] each */
    double *ph;                     /* [nh] */
    double *tab_p, *tab_v;          /* [no][nh][nd] power, motion^2 per unit amplitude^2 */
    double *tab_ip;                 /* [no][nh][nd] isolated power of each device */
    double *gp;                     /* [n_groups][nd] unit-Hs group powers */
    cells full;                     /* every cell above CELL_FLOOR: the reported values */
    cells search;                   /* cells above SEARCH_FLOOR: the damping searches */
    size_t group;                   /* group being optimised */
    const double *bands;            /* [nb][2] flagged frequency bands (lo, hi), rad/s */
    size_t nb;
    double *pband;                  /* [nb] mechanical power of the bin being stored inside each band, W */
    double limit_v;                 /* motion variance at the stroke limit for the bin being solved */
    sy_yield_progress progress;     /* may be NULL; units in yield.h */
    void *progress_ctx;
    size_t done, total;
    sy_error *err;
} ctx;

static void advance(ctx *c, size_t units)
{
    c->done += units;
    if (c->progress != NULL)
        c->progress(c->progress_ctx, c->done, c->total);
}

static double electrical(const sy_model *m, double mech) { return fmin(m->efficiency * mech, m->rated_power); }

/* Each group's cells with more than `floor` of its energy. */
static int build_cells(const ctx *c, double floor, cells *cs, sy_error *err)
{
    const syi_yield_seas *s = c->seas;
    size_t cap = s->n_groups * c->no * c->nh, k = 0;
    cs->start = malloc((s->n_groups + 1) * sizeof *cs->start);
    cs->io = malloc(cap * sizeof *cs->io);
    cs->ih = malloc(cap * sizeof *cs->ih);
    cs->a2 = malloc(cap * sizeof *cs->a2);
    if (!cs->start || !cs->io || !cs->ih || !cs->a2)
        return sy_error_set(err, SY_ENOMEM, "sea-state cells");
    for (size_t g = 0; g < s->n_groups; g++) {
        double total = 0;
        for (size_t ih = 0; ih < c->nh; ih++)
            for (size_t io = 0; io < c->no; io++)
                total += s->amp2[g * c->no + io] * s->dir[g * c->nh + ih];
        cs->start[g] = k;
        for (size_t ih = 0; ih < c->nh; ih++)
            for (size_t io = 0; io < c->no; io++) {
                double a2 = s->amp2[g * c->no + io] * s->dir[g * c->nh + ih];
                if (a2 > floor * total) {
                    cs->io[k] = (unsigned)io, cs->ih[k] = (unsigned)ih, cs->a2[k] = a2;
                    k++;
                }
            }
    }
    cs->start[s->n_groups] = k;
    return SY_OK;
}

static void free_cells(cells *cs)
{
    free(cs->start);
    free(cs->io);
    free(cs->ih);
    free(cs->a2);
}

/* Unit-Hs array power and motion variance of group g for shared damping b, into pdev, vdev. */
static void group_modal(ctx *c, const cells *cs, size_t g, double b)
{
    memset(c->pdev, 0, c->nd * sizeof *c->pdev);
    memset(c->vdev, 0, c->nd * sizeof *c->vdev);
    for (size_t k = cs->start[g]; k < cs->start[g + 1]; k++) {
        double a2 = cs->a2[k];
        sy_dyn_modal_eval(c->modal, cs->io[k], cs->ih[k], b, c->scratch, c->pw, c->m2);
        for (size_t q = 0; q < c->nd; q++) {
            c->pdev[q] += a2 * c->pw[q];
            c->vdev[q] += 0.5 * a2 * c->m2[q];
        }
    }
}

/* Sum a per-(omega, heading, device) table over group g (unit Hs) into out[nd]. */
static void group_table(const ctx *c, size_t g, const double *tab, double scale, double *out)
{
    memset(out, 0, c->nd * sizeof *out);
    const cells *cs = &c->full;
    for (size_t k = cs->start[g]; k < cs->start[g + 1]; k++) {
        double a2 = scale * cs->a2[k];
        const double *t = tab + ((size_t)cs->io[k] * c->nh + cs->ih[k]) * c->nd;
        for (size_t q = 0; q < c->nd; q++)
            out[q] += a2 * t[q];
    }
}

/* Unit-Hs power of all devices in group g from cells inside band j: from a table (tab != NULL)
 * or the modal response at shared damping b. */
static double group_band(ctx *c, size_t g, size_t j, const double *tab, double b)
{
    const cells *cs = &c->full;
    double lo = c->bands[2 * j], hi = c->bands[2 * j + 1], p = 0;
    for (size_t k = cs->start[g]; k < cs->start[g + 1]; k++) {
        double w = c->db->omega[cs->io[k]];
        if (w < lo || w > hi)
            continue;
        const double *t = tab;
        if (tab == NULL) {
            sy_dyn_modal_eval(c->modal, cs->io[k], cs->ih[k], b, c->scratch, c->pw, NULL);
            t = c->pw;
        } else {
            t = tab + ((size_t)cs->io[k] * c->nh + cs->ih[k]) * c->nd;
        }
        for (size_t q = 0; q < c->nd; q++)
            p += cs->a2[k] * t[q];
    }
    return p;
}

static void scale(double *v, size_t n, double f)
{
    for (size_t i = 0; i < n; i++)
        v[i] *= f;
}

/* Isolated power of every device at shared damping b into tab_ip (all omega, headings). */
static void iso_table_modal(ctx *c, double b)
{
    double complex sc;
    for (size_t io = 0; io < c->no; io++)
        for (size_t ih = 0; ih < c->nh; ih++)
            for (size_t q = 0; q < c->nd; q++) {
                double p;
                sy_dyn_modal_eval(c->iso_modal[c->iso_of[q]], io, ih, b, &sc, &p, NULL);
                c->tab_ip[(io * c->nh + ih) * c->nd + q] = p;
            }
}

static void array_table_modal(ctx *c, double b)
{
    for (size_t io = 0; io < c->no; io++)
        for (size_t ih = 0; ih < c->nh; ih++) {
            size_t at = (io * c->nh + ih) * c->nd;
            sy_dyn_modal_eval(c->modal, io, ih, b, c->scratch, c->tab_p + at, c->tab_v + at);
        }
}

/* ---- one-dimensional searches on x = log b ---- */

typedef struct scalar_fn {
    double (*f)(double x, void *p);
    void *p;
} scalar_fn;

static double neg_fn(double x, void *pp)
{
    const scalar_fn *o = pp;
    return -o->f(x, o->p);
}

/* Argmax of o on [xlo, xhi]: a coarse scan brackets the maximum, then GSL Brent. An
 * optimum on the boundary of the range is kept as is. */
static int maximise(const scalar_fn *o, double xlo, double xhi, double *xbest, sy_error *err)
{
    /* Bracket from the middle of the range (the reference damping) outward in growing
     * steps; an optimum that runs into the end of the range is kept there. */
    double xa, xb = 0.5 * (xlo + xhi), xc, fb = o->f(xb, o->p), fa, fc, h = BRACKET_STEP;
    xc = fmin(xb + h, xhi), fc = o->f(xc, o->p);
    xa = fmax(xb - h, xlo), fa = o->f(xa, o->p);
    while (fc > fb || fa > fb) {
        if (fc > fb) { /* uphill to the right */
            if (xc >= xhi) {
                *xbest = xhi;
                return SY_OK;
            }
            xa = xb, fa = fb, xb = xc, fb = fc;
            h *= 2;
            xc = fmin(xb + h, xhi), fc = o->f(xc, o->p);
        } else { /* uphill to the left */
            if (xa <= xlo) {
                *xbest = xlo;
                return SY_OK;
            }
            xc = xb, fc = fb, xb = xa, fb = fa;
            h *= 2;
            xa = fmax(xb - h, xlo), fa = o->f(xa, o->p);
        }
    }
    *xbest = xb;
    if (!(fb > fa && fb > fc))
        return SY_OK; /* flat (e.g. capped at rated power everywhere): any point serves */
    gsl_min_fminimizer *mn = gsl_min_fminimizer_alloc(gsl_min_fminimizer_brent);
    if (mn == NULL)
        return sy_error_set(err, SY_ENOMEM, "damping search");
    gsl_function g = {neg_fn, (void *)o};
    int st = gsl_min_fminimizer_set_with_values(mn, &g, xb, -fb, xa, -fa, xc, -fc);
    for (int it = 0; st == GSL_SUCCESS && it < MAX_ITER; it++) {
        st = gsl_min_fminimizer_iterate(mn);
        if (gsl_min_test_interval(gsl_min_fminimizer_x_lower(mn), gsl_min_fminimizer_x_upper(mn), LOGB_TOL, 0.0) ==
            GSL_SUCCESS)
            break;
    }
    if (st == GSL_SUCCESS)
        *xbest = gsl_min_fminimizer_x_minimum(mn);
    gsl_min_fminimizer_free(mn);
    return st == GSL_SUCCESS ? SY_OK : sy_error_set(err, SY_ENOCONV, "damping search: %s", gsl_strerror(st));
}

/* Root of o on [xlo, xhi] (o changes sign there) by GSL Brent. */
static int root(const scalar_fn *o, double xlo, double xhi, double *x, sy_error *err)
{
    gsl_root_fsolver *rs = gsl_root_fsolver_alloc(gsl_root_fsolver_brent);
    if (rs == NULL)
        return sy_error_set(err, SY_ENOMEM, "stroke limit search");
    gsl_function g = {o->f, o->p};
    int st = gsl_root_fsolver_set(rs, &g, xlo, xhi);
    for (int it = 0; st == GSL_SUCCESS && it < MAX_ITER; it++) {
        st = gsl_root_fsolver_iterate(rs);
        if (gsl_root_test_interval(gsl_root_fsolver_x_lower(rs), gsl_root_fsolver_x_upper(rs), LOGB_TOL, 0.0) ==
            GSL_SUCCESS)
            break;
    }
    /* The upper end keeps the stroke within the limit. */
    *x = gsl_root_fsolver_x_upper(rs);
    gsl_root_fsolver_free(rs);
    return st == GSL_SUCCESS ? SY_OK : sy_error_set(err, SY_ENOCONV, "stroke limit search: %s", gsl_strerror(st));
}

static double group_power_fn(double x, void *p)
{
    ctx *c = p;
    group_modal(c, &c->search, c->group, exp(x));
    double s = 0;
    for (size_t q = 0; q < c->nd; q++)
        s += c->pdev[q];
    return s;
}

/* Largest unit-Hs motion variance minus the bin's limit variance (decreasing in b), on
 * the search cells: the limit is then met to ~1e-4, inside STROKE_SLACK. */
static double group_stroke_fn(double x, void *p)
{
    ctx *c = p;
    group_modal(c, &c->search, c->group, exp(x));
    double v = 0;
    for (size_t q = 0; q < c->nd; q++)
        v = fmax(v, c->vdev[q]);
    return v - c->limit_v;
}

static double site_energy_fn(double x, void *p)
{
    ctx *c = p;
    const syi_yield_seas *s = c->seas;
    array_table_modal(c, exp(x));
    for (size_t g = 0; g < s->n_groups; g++)
        group_table(c, g, c->tab_p, 1.0, c->gp + g * c->nd);
    double e = 0;
    for (size_t k = 0; k < s->n; k++)
        for (size_t q = 0; q < c->nd; q++)
            e += s->hours[k] * electrical(c->m, s->hs2[k] * c->gp[s->group[k] * c->nd + q]);
    return e;
}

/* Reference damping for group g: the first isolated device's passive optimum at the
 * grid frequency nearest the group's energy frequency (Falnes; dynamics.h). */
static double reference_damping(const ctx *c, size_t g)
{
    const sy_hydro_db *iso = c->iso_db[0];
    size_t io = 0, dof = 0, n = iso->n_dof;
    for (size_t i = 1; i < c->no; i++)
        if (fabs(iso->omega[i] - c->seas->omega_e[g]) < fabs(iso->omega[io] - c->seas->omega_e[g]))
            io = i;
    for (size_t i = 0; i < n; i++)
        if (iso->dof_mode[i] == c->m->pto_mode)
            dof = i;
    double om = iso->omega[io];
    double b = sy_dyn_passive_optimum(om, sy_dyn_mass(c->iso_plan[0], 0, c->m->pto_mode),
                                      iso->added_mass[(io * n + dof) * n + dof], iso->damping[(io * n + dof) * n + dof],
                                      sy_dyn_stiffness(c->iso_plan[0], 0, c->m->pto_mode) + c->m->pto_stiffness);
    return b > 0 && isfinite(b) ? b : 1e5; /* 1e5 N s/m: order of a 5 m float's radiation damping */
}

/* Store bin k's results for strategy st; pdev/vdev hold the array's mechanical power
 * and motion variance, iso[nd] the isolated devices' mechanical power. */
static void store_bin(const ctx *c, sy_yield_result *r, int st, size_t k, const double *iso, double b, int limited)
{
    sy_yield_strategy *y = &r->s[st];
    size_t t = c->seas->bin[k], nd = c->nd;
    double parr = 0, piso = 0;
    for (size_t q = 0; q < nd; q++) {
        double pe = electrical(c->m, c->pdev[q]);
        y->power[t * nd + q] = pe;
        y->stroke[t * nd + q] = 4.0 * sqrt(c->vdev[q]);
        parr += pe;
        y->power_iso_dev[t * nd + q] = electrical(c->m, iso[q]);
        piso += y->power_iso_dev[t * nd + q];
        if (y->stroke[t * nd + q] > c->m->max_stroke * (1 + STROKE_SLACK))
            limited = 2;
    }
    y->power_array[t] = parr;
    y->power_iso[t] = piso;
    y->damping[t] = b;
    double mech = 0;
    for (size_t q = 0; q < nd; q++)
        mech += c->pdev[q];
    for (size_t j = 0; j < c->nb && mech > 0; j++) /* electrical share in proportion to the mechanical */
        y->energy_band[j] += c->seas->hours[k] * parr * c->pband[j] / mech;
    y->stroke_limited[t] = (unsigned char)limited;
    y->n_stroke_exceeded += limited == 2;
}

/* Bins from per-(omega, heading) tables: the group sums scaled by each bin's Hs^2. */
static void store_from_tables(ctx *c, sy_yield_result *r, int st, double *iso, double b)
{
    const syi_yield_seas *s = c->seas;
    size_t nd = c->nd;
    for (size_t i = 0; i < c->no * c->nh; i++) { /* q per frequency and heading */
        double pa = 0, pi = 0;
        for (size_t q = 0; q < nd; q++)
            pa += c->tab_p[i * nd + q], pi += c->tab_ip[i * nd + q];
        r->s[st].q_omega[i] = pa / pi;
    }
    double *gv = c->gp + s->n_groups * nd, *gi = gv + s->n_groups * nd;
    for (size_t g = 0; g < s->n_groups; g++) {
        group_table(c, g, c->tab_p, 1.0, c->gp + g * nd);
        group_table(c, g, c->tab_v, 0.5, gv + g * nd);
        group_table(c, g, c->tab_ip, 1.0, gi + g * nd);
    }
    for (size_t k = 0; k < s->n; k++) {
        size_t g = s->group[k];
        for (size_t q = 0; q < nd; q++) {
            c->pdev[q] = s->hs2[k] * c->gp[g * nd + q];
            c->vdev[q] = s->hs2[k] * gv[g * nd + q];
            iso[q] = s->hs2[k] * gi[g * nd + q];
        }
        for (size_t j = 0; j < c->nb; j++)
            c->pband[j] = s->hs2[k] * group_band(c, g, j, c->tab_p, 0);
        store_bin(c, r, st, k, iso, b, 0);
    }
}

static int strategy_fixed(ctx *c, sy_yield_result *r)
{
    size_t nd = c->nd, no = c->no, nh = c->nh, ndof = sy_dyn_n_dof(c->plan);
    double *damp = malloc(nd * sizeof *damp), *stiff = malloc(nd * sizeof *stiff), *iso = malloc(nd * sizeof *iso);
    int rc = damp && stiff && iso ? SY_OK : sy_error_set(c->err, SY_ENOMEM, "fixed tuning");
    for (size_t q = 0; rc == SY_OK && q < nd; q++) {
        const sy_model_device *d = &c->m->devices[sy_dyn_device_body(c->plan, q)];
        damp[q] = d->pto_damping, stiff[q] = d->pto_stiffness;
    }
    for (size_t io = 0; rc == SY_OK && io < no; io++) {
        rc = sy_dyn_response(c->plan, io, damp, stiff, c->work, c->xi, c->tab_p + io * nh * nd, c->err);
        for (size_t ih = 0; rc == SY_OK && ih < nh; ih++)
            for (size_t q = 0; q < nd; q++) {
                double complex x = c->xi[ih * ndof + sy_dyn_pto_dof(c->plan, q)];
                c->tab_v[(io * nh + ih) * nd + q] = creal(x) * creal(x) + cimag(x) * cimag(x);
            }
        for (size_t q = 0; rc == SY_OK && q < nd; q++) {
            size_t g = c->iso_of[q];
            rc = sy_dyn_response(c->iso_plan[g], io, &damp[q], &stiff[q], c->iso_work[g], NULL, c->ph, c->err);
            for (size_t ih = 0; rc == SY_OK && ih < nh; ih++)
                c->tab_ip[(io * nh + ih) * nd + q] = c->ph[ih];
        }
    }
    if (rc == SY_OK)
        store_from_tables(c, r, SY_TUNING_FIXED, iso, NAN);
    free(damp);
    free(stiff);
    free(iso);
    return rc;
}

/* Per sea state: the unconstrained optimum depends only on the bin's group (the power
 * scales with Hs^2), so it is searched once per group; the stroke limit, which depends
 * on Hs, then raises the damping bin by bin to b_min with stroke(b_min) = max_stroke
 * (the power is taken as unimodal in b, so the constrained optimum is max(b_opt, b_min)). */
/* Unit-Hs isolated power of every device in group g at damping b, into out[nd]. */
static void group_iso(ctx *c, size_t g, double b, double *out)
{
    double complex sc;
    memset(out, 0, c->nd * sizeof *out);
    const cells *cs = &c->full;
    for (size_t j = cs->start[g]; j < cs->start[g + 1]; j++)
        for (size_t q = 0; q < c->nd; q++) {
            double p;
            sy_dyn_modal_eval(c->iso_modal[c->iso_of[q]], cs->io[j], cs->ih[j], b, &sc, &p, NULL);
            out[q] += cs->a2[j] * p;
        }
}

static int strategy_per_sea_state(ctx *c, sy_yield_result *r)
{
    const syi_yield_seas *s = c->seas;
    size_t nd = c->nd, ng = s->n_groups;
    double *iso = malloc(nd * sizeof *iso), *bopt = malloc(2 * ng * sizeof *bopt), *xhi_g = bopt + ng;
    double *gv = c->gp + ng * nd, *gi = gv + ng * nd; /* unit-Hs results at each group's optimum */
    int rc = iso && bopt ? SY_OK : sy_error_set(c->err, SY_ENOMEM, "per-sea-state tuning");
    scalar_fn power = {group_power_fn, c}, stroke = {group_stroke_fn, c};
    for (size_t g = 0; rc == SY_OK && g < ng; g++) {
        double bref = reference_damping(c, g), x;
        c->group = g;
        xhi_g[g] = log(bref * B_RANGE);
        rc = maximise(&power, log(bref / B_RANGE), xhi_g[g], &x, c->err);
        bopt[g] = exp(x);
        group_modal(c, &c->full, g, bopt[g]);
        memcpy(c->gp + g * nd, c->pdev, nd * sizeof *c->pdev);
        memcpy(gv + g * nd, c->vdev, nd * sizeof *c->vdev);
        group_iso(c, g, bopt[g], gi + g * nd);
        advance(c, 1);
    }
    for (size_t k = 0; rc == SY_OK && k < s->n; k++) {
        size_t g = s->group[k];
        double b = bopt[g], xhi = xhi_g[g], vmax = 0;
        int limited = 0;
        c->group = g;
        for (size_t q = 0; q < nd; q++)
            vmax = fmax(vmax, gv[g * nd + q]);
        /* Stroke 4 sqrt(Hs^2 v) <= limit  <=>  v <= limit^2 / (16 Hs^2). */
        c->limit_v = c->m->max_stroke * c->m->max_stroke / (16.0 * s->hs2[k]);
        if (isfinite(c->m->max_stroke) && vmax > c->limit_v) {
            limited = 1;
            double x = xhi;
            if (group_stroke_fn(xhi, c) <= 0) /* else even the largest damping exceeds it: flagged */
                rc = root(&stroke, log(b), xhi, &x, c->err);
            if (rc != SY_OK)
                break;
            b = exp(x);
            group_modal(c, &c->full, g, b);
            group_iso(c, g, b, iso);
        } else {
            memcpy(c->pdev, c->gp + g * nd, nd * sizeof *c->pdev);
            memcpy(c->vdev, gv + g * nd, nd * sizeof *c->vdev);
            memcpy(iso, gi + g * nd, nd * sizeof *iso);
        }
        scale(c->pdev, nd, s->hs2[k]);
        scale(c->vdev, nd, s->hs2[k]);
        scale(iso, nd, s->hs2[k]);
        for (size_t j = 0; j < c->nb; j++)
            c->pband[j] = s->hs2[k] * group_band(c, g, j, NULL, b);
        store_bin(c, r, SY_TUNING_PER_SEA_STATE, k, iso, b, limited);
        advance(c, 1);
    }
    free(iso);
    free(bopt);
    return rc;
}

static int strategy_site(ctx *c, sy_yield_result *r)
{
    /* Range: around the reference damping of the most frequent bin's group. */
    size_t kmax = 0;
    for (size_t k = 1; k < c->seas->n; k++)
        if (c->seas->hours[k] > c->seas->hours[kmax])
            kmax = k;
    double bref = reference_damping(c, c->seas->group[kmax]), x;
    scalar_fn energy = {site_energy_fn, c};
    int rc = maximise(&energy, log(bref / B_RANGE), log(bref * B_RANGE), &x, c->err);
    advance(c, c->seas->n_groups);
    double *iso = malloc(c->nd * sizeof *iso);
    if (rc == SY_OK && iso == NULL)
        rc = sy_error_set(c->err, SY_ENOMEM, "site tuning");
    if (rc == SY_OK) {
        double b = exp(x);
        r->s[SY_TUNING_SITE_OPTIMAL].site_damping = b;
        array_table_modal(c, b);
        iso_table_modal(c, b);
        store_from_tables(c, r, SY_TUNING_SITE_OPTIMAL, iso, b);
    }
    free(iso);
    return rc;
}

static int strategy_bound(ctx *c, sy_yield_result *r)
{
    const syi_yield_seas *s = c->seas;
    size_t no = c->no, nh = c->nh, nd = c->nd;
    double *arr = malloc(no * nh * sizeof *arr), *iso = malloc(c->n_iso * no * nh * sizeof *iso);
    double *ga = malloc(2 * s->n_groups * sizeof *ga);
    int rc = arr && iso && ga ? SY_OK : sy_error_set(c->err, SY_ENOMEM, "reactive bound");
    for (size_t io = 0; rc == SY_OK && io < no; io++) {
        rc = sy_dyn_reactive_bound(c->plan, io, c->work, arr + io * nh, c->err);
        for (size_t g = 0; rc == SY_OK && g < c->n_iso; g++)
            rc = sy_dyn_reactive_bound(c->iso_plan[g], io, c->iso_work[g], iso + (g * no + io) * nh, c->err);
    }
    for (size_t g = 0; rc == SY_OK && g < s->n_groups; g++) {
        double pa = 0, pi = 0;
        for (size_t j = c->full.start[g]; j < c->full.start[g + 1]; j++) {
            size_t io = c->full.io[j], ih = c->full.ih[j];
            pa += c->full.a2[j] * arr[io * nh + ih];
            for (size_t q = 0; q < nd; q++)
                pi += c->full.a2[j] * iso[(c->iso_of[q] * no + io) * nh + ih];
        }
        ga[2 * g] = pa, ga[2 * g + 1] = pi;
    }
    sy_yield_strategy *y = &r->s[SY_TUNING_REACTIVE_BOUND];
    for (size_t io = 0; rc == SY_OK && io < no; io++)
        for (size_t ih = 0; ih < nh; ih++) {
            double pi = 0;
            for (size_t q = 0; q < nd; q++)
                pi += iso[(c->iso_of[q] * no + io) * nh + ih];
            y->q_omega[io * nh + ih] = arr[io * nh + ih] / pi;
        }
    for (size_t k = 0; rc == SY_OK && k < s->n; k++) {
        size_t t = s->bin[k], g = s->group[k];
        y->power_array[t] = c->m->efficiency * s->hs2[k] * ga[2 * g];
        for (size_t j = 0; j < c->nb; j++) {
            double pb = 0;
            for (size_t q = c->full.start[g]; q < c->full.start[g + 1]; q++) {
                double w = c->db->omega[c->full.io[q]];
                if (w >= c->bands[2 * j] && w <= c->bands[2 * j + 1])
                    pb += c->full.a2[q] * arr[c->full.io[q] * nh + c->full.ih[q]];
            }
            y->energy_band[j] += s->hours[k] * c->m->efficiency * s->hs2[k] * pb;
        }
        y->power_iso[t] = c->m->efficiency * s->hs2[k] * ga[2 * g + 1];
        for (size_t q = 0; q < nd; q++)
            y->power[t * nd + q] = y->power_iso_dev[t * nd + q] = NAN;
    }
    free(arr);
    free(iso);
    free(ga);
    return rc;
}

void sy_yield_result_free(sy_yield_result *r)
{
    if (r == NULL)
        return;
    free(r->hours);
    free(r->resource);
    for (int st = 0; st < SY_YIELD_N_STRATEGIES; st++) {
        sy_yield_strategy *y = &r->s[st];
        free(y->power);
        free(y->power_array);
        free(y->power_iso);
        free(y->power_iso_dev);
        free(y->energy_iso_dev);
        free(y->damping);
        free(y->stroke);
        free(y->stroke_limited);
        free(y->energy);
        free(y->q_omega);
        free(y->energy_band);
    }
    free(r->band_fraction);
    free(r->omega);
    free(r->headings);
    free(r);
}

static int result_alloc(sy_yield_result **out, size_t nt, size_t nd, const sy_hydro_db *db, size_t nb,
                        sy_error *err)
{
    sy_yield_result *r = calloc(1, sizeof *r);
    size_t ng = db->n_omega * db->n_headings;
    int ok = r != NULL;
    if (ok) {
        r->n_bins = nt, r->n_devices = nd, r->n_omega = db->n_omega, r->n_headings = db->n_headings;
        r->omega = malloc(db->n_omega * sizeof *r->omega);
        r->headings = malloc(db->n_headings * sizeof *r->headings);
        ok = r->omega && r->headings;
        if (ok) {
            memcpy(r->omega, db->omega, db->n_omega * sizeof *r->omega);
            memcpy(r->headings, db->headings, db->n_headings * sizeof *r->headings);
        }
        r->n_bands = nb;
        r->band_fraction = calloc(nt * (nb ? nb : 1), sizeof *r->band_fraction);
        ok = ok && r->band_fraction;
        r->hours = calloc(nt, sizeof *r->hours);
        r->resource = calloc(nt, sizeof *r->resource);
        ok = ok && r->hours && r->resource;
        for (int st = 0; ok && st < SY_YIELD_N_STRATEGIES; st++) {
            sy_yield_strategy *y = &r->s[st];
            y->power = calloc(nt * nd, sizeof *y->power);
            y->power_array = calloc(nt, sizeof *y->power_array);
            y->power_iso = calloc(nt, sizeof *y->power_iso);
            y->power_iso_dev = calloc(nt * nd, sizeof *y->power_iso_dev);
            y->energy_iso_dev = calloc(nd, sizeof *y->energy_iso_dev);
            y->damping = calloc(nt, sizeof *y->damping);
            y->stroke = calloc(nt * nd, sizeof *y->stroke);
            y->stroke_limited = calloc(nt, sizeof *y->stroke_limited);
            y->energy = calloc(nd, sizeof *y->energy);
            y->q_omega = malloc(ng * sizeof *y->q_omega);
            y->energy_band = calloc(nb ? nb : 1, sizeof *y->energy_band);
            ok = ok && y->energy_band;
            for (size_t i = 0; y->q_omega != NULL && i < ng; i++)
                y->q_omega[i] = NAN;
            ok = ok && y->q_omega && y->power && y->power_array && y->power_iso && y->power_iso_dev && y->energy_iso_dev && y->damping && y->stroke && y->stroke_limited && y->energy;
            y->site_damping = NAN;
            for (size_t t = 0; ok && t < nt; t++)
                y->damping[t] = NAN;
        }
    }
    if (!ok) {
        sy_yield_result_free(r);
        return sy_error_set(err, SY_ENOMEM, "yield results for %zu bins", nt);
    }
    *out = r;
    return SY_OK;
}

/* Annual energy (W h/yr) of a per-bin power (W), strided: the climate module's
 * occurrence-weighted sum, E = sum_bins P_bin O_bin (references.md 5.1). */
typedef struct bin_power {
    const double *p;
    size_t stride;
} bin_power;

static int bin_power_of(const sy_climate_bin *bin, void *ctx, double *q, sy_error *err)
{
    (void)err;
    const bin_power *bp = ctx;
    *q = bp->p[bin->index * bp->stride];
    return SY_OK;
}

static int annual(const sy_climate_table *climate, const double *p, size_t stride, double *energy, sy_error *err)
{
    bin_power bp = {p, stride};
    sy_climate_average avg;
    int rc = sy_climate_table_average(climate, bin_power_of, &bp, &avg, err);
    *energy = rc == SY_OK ? avg.per_year : NAN;
    return rc;
}

static void ctx_free(ctx *c)
{
    for (size_t g = 0; c->iso_plan != NULL && g < c->n_iso; g++) {
        sy_dyn_modal_free(c->iso_modal[g]);
        sy_dyn_work_free(c->iso_work[g]);
        sy_dyn_plan_free(c->iso_plan[g]);
    }
    free(c->iso_db);
    free(c->iso_of);
    free(c->iso_model);
    free(c->iso_plan);
    free(c->iso_work);
    free(c->iso_modal);
    sy_dyn_modal_free(c->modal);
    sy_dyn_work_free(c->work);
    sy_dyn_plan_free(c->plan);
    free(c->scratch);
    free(c->xi);
    free(c->pw);
    free(c->m2);
    free(c->pdev);
    free(c->vdev);
    free(c->ph);
    free(c->tab_p);
    free(c->tab_v);
    free(c->tab_ip);
    free(c->gp);
    free_cells(&c->full);
    free_cells(&c->search);
    syi_yield_seas_free((syi_yield_seas *)c->seas);
}

/* Same grids and a heave dof on every body: the isolated databases must match the array's. */
static int check_iso(const sy_hydro_db *a, const sy_hydro_db *iso, size_t k, sy_error *err)
{
    if (iso->n_bodies != 1 || iso->n_omega != a->n_omega || iso->n_headings != a->n_headings)
        return sy_error_set(err, SY_EINPUT, "isolated database of device %zu: %zu bodies, %zu x %zu grid; expected 1 body on the array's %zu x %zu grid",
                            k, iso->n_bodies, iso->n_omega, iso->n_headings, a->n_omega, a->n_headings);
    for (size_t i = 0; i < a->n_omega; i++)
        if (iso->omega[i] != a->omega[i])
            return sy_error_set(err, SY_EINPUT, "isolated database of device %zu: omega[%zu] = %g, array %g", k, i,
                                iso->omega[i], a->omega[i]);
    return SY_OK;
}

int sy_yield_compute(sy_yield_result **out, const sy_model *m, const sy_climate_table *climate,
                     const sy_hydro_db *db, const sy_hydro_db *const *iso_db, sy_error *err)
{
    return sy_yield_compute_banded(out, m, climate, db, iso_db, NULL, 0, err);
}

int sy_yield_compute_banded(sy_yield_result **out, const sy_model *m, const sy_climate_table *climate,
                            const sy_hydro_db *db, const sy_hydro_db *const *iso_db, const double *bands,
                            size_t n_bands, sy_error *err)
{
    return sy_yield_compute_progress(out, m, climate, db, iso_db, bands, n_bands, NULL, NULL, err);
}

int sy_yield_compute_progress(sy_yield_result **out, const sy_model *m, const sy_climate_table *climate,
                              const sy_hydro_db *db, const sy_hydro_db *const *iso_db, const double *bands,
                              size_t n_bands, sy_yield_progress progress, void *progress_ctx, sy_error *err)
{
    ctx c;
    memset(&c, 0, sizeof c);
    c.m = m, c.db = db, c.err = err, c.bands = bands, c.nb = n_bands;
    c.progress = progress, c.progress_ctx = progress_ctx;
    double pband_store[SY_YIELD_MAX_BANDS];
    c.pband = pband_store;
    if (n_bands > SY_YIELD_MAX_BANDS)
        return sy_error_set(err, SY_EINVAL, "yield: %zu flagged bands exceed %d", n_bands, SY_YIELD_MAX_BANDS);
    c.no = db->n_omega, c.nh = db->n_headings;
    sy_yield_result *r = NULL;
    syi_yield_seas *seas = NULL;
    int rc = syi_yield_seas_create(&seas, m, climate, db->omega, db->n_omega, db->headings, db->n_headings, err);
    c.seas = seas;
    if (rc == SY_OK) /* per-sea-state searches and bins, then the site-wide search */
        c.total = 2 * seas->n_groups + seas->n;
    if (rc == SY_OK && seas->n == 0)
        rc = sy_error_set(err, SY_EINPUT, "climate %s: no bin has non-zero occurrence", m->climate);
    if (rc == SY_OK)
        rc = sy_dyn_plan_create(&c.plan, m, db, m->pto_mode, err);
    if (rc == SY_OK)
        rc = sy_dyn_work_alloc(&c.work, c.plan, err);
    if (rc == SY_OK) {
        c.nd = sy_dyn_n_devices(c.plan);
        size_t nd = c.nd, ndof = sy_dyn_n_dof(c.plan);
        c.scratch = malloc(nd * sizeof *c.scratch);
        c.xi = malloc(c.nh * ndof * sizeof *c.xi);
        c.pw = malloc(nd * sizeof *c.pw);
        c.m2 = malloc(nd * sizeof *c.m2);
        c.pdev = malloc(nd * sizeof *c.pdev);
        c.vdev = malloc(nd * sizeof *c.vdev);
        c.ph = malloc(c.nh * sizeof *c.ph);
        c.tab_p = malloc(c.no * c.nh * nd * sizeof *c.tab_p);
        c.tab_v = malloc(c.no * c.nh * nd * sizeof *c.tab_v);
        c.tab_ip = malloc(c.no * c.nh * nd * sizeof *c.tab_ip);
        c.gp = malloc(3 * seas->n_groups * nd * sizeof *c.gp); /* power, variance, isolated */
        c.iso_db = calloc(nd, sizeof *c.iso_db);
        c.iso_of = calloc(nd, sizeof *c.iso_of);
        c.iso_model = calloc(nd, sizeof *c.iso_model);
        c.iso_plan = calloc(nd, sizeof *c.iso_plan);
        c.iso_work = calloc(nd, sizeof *c.iso_work);
        c.iso_modal = calloc(nd, sizeof *c.iso_modal);
        if (!c.scratch || !c.xi || !c.pw || !c.m2 || !c.pdev || !c.vdev || !c.ph || !c.tab_p || !c.tab_v ||
            !c.tab_ip || !c.gp || !c.iso_db || !c.iso_of || !c.iso_model || !c.iso_plan || !c.iso_work || !c.iso_modal)
            rc = sy_error_set(err, SY_ENOMEM, "yield workspace for %zu devices", nd);
    }
    if (rc == SY_OK)
        rc = build_cells(&c, CELL_FLOOR, &c.full, err);
    if (rc == SY_OK)
        rc = build_cells(&c, SEARCH_FLOOR, &c.search, err);
    if (rc == SY_OK)
        rc = sy_dyn_modal_create(&c.modal, c.plan, m->pto_stiffness, err);
    /* Distinct isolated devices: one plan and modal response each. */
    for (size_t q = 0; rc == SY_OK && q < c.nd; q++) {
        size_t body = sy_dyn_device_body(c.plan, q), g;
        const sy_hydro_db *iso = iso_db[body];
        for (g = 0; g < c.n_iso && c.iso_db[g] != iso; g++)
            ;
        c.iso_of[q] = g;
        if (g < c.n_iso)
            continue;
        if ((rc = check_iso(db, iso, body, err)) != SY_OK)
            break;
        c.iso_db[g] = iso;
        c.iso_model[g] = *m;
        c.iso_model[g].devices = (sy_model_device *)&m->devices[body];
        c.iso_model[g].n_devices = 1;
        c.n_iso++;
        rc = sy_dyn_plan_create(&c.iso_plan[g], &c.iso_model[g], iso, m->pto_mode, err);
        if (rc == SY_OK)
            rc = sy_dyn_work_alloc(&c.iso_work[g], c.iso_plan[g], err);
        if (rc == SY_OK)
            rc = sy_dyn_modal_create(&c.iso_modal[g], c.iso_plan[g], m->pto_stiffness, err);
    }
    if (rc == SY_OK)
        rc = result_alloc(&r, sy_climate_table_size(climate), c.nd, db, n_bands, err);
    if (rc == SY_OK) {
        for (size_t k = 0; k < seas->n; k++) {
            r->hours[seas->bin[k]] = seas->hours[k];
            r->resource[seas->bin[k]] = seas->resource[k];
            r->hours_covered += seas->hours[k];
            r->mean_resource += seas->hours[k] * seas->resource[k];
        }
        r->mean_resource /= r->hours_covered;
        for (size_t k = 0; k < seas->n; k++) /* spectral energy share of each bin inside each band */
            for (size_t j = 0; j < n_bands; j++) {
                size_t g = seas->group[k];
                double in = 0, all = 0;
                for (size_t q = c.full.start[g]; q < c.full.start[g + 1]; q++) {
                    double w = db->omega[c.full.io[q]];
                    all += c.full.a2[q];
                    if (w >= bands[2 * j] && w <= bands[2 * j + 1])
                        in += c.full.a2[q];
                }
                r->band_fraction[seas->bin[k] * n_bands + j] = in / all;
            }
        r->max_outside = seas->max_outside;
        r->max_dir_outside = seas->max_dir_outside;
        rc = strategy_fixed(&c, r);
    }
    if (rc == SY_OK)
        rc = strategy_per_sea_state(&c, r);
    if (rc == SY_OK)
        rc = strategy_site(&c, r);
    if (rc == SY_OK)
        rc = strategy_bound(&c, r);
    for (int st = 0; rc == SY_OK && st < SY_YIELD_N_STRATEGIES; st++) {
        sy_yield_strategy *y = &r->s[st];
        rc = annual(climate, y->power_array, 1, &y->energy_array, err);
        if (rc == SY_OK)
            rc = annual(climate, y->power_iso, 1, &y->energy_iso, err);
        for (size_t q = 0; rc == SY_OK && q < c.nd; q++) /* per device: not defined for the bound */
            if (st == SY_TUNING_REACTIVE_BOUND) {
                y->energy[q] = y->energy_iso_dev[q] = NAN;
            } else {
                rc = annual(climate, y->power + q, c.nd, &y->energy[q], err);
                if (rc == SY_OK)
                    rc = annual(climate, y->power_iso_dev + q, c.nd, &y->energy_iso_dev[q], err);
            }
        y->q_factor = y->energy_array / y->energy_iso;
        y->mean_power = y->energy_array / SY_CLIMATE_HOURS_PER_YEAR;
        y->capacity_factor = isfinite(m->rated_power) && st != SY_TUNING_REACTIVE_BOUND
                                 ? y->mean_power / ((double)c.nd * m->rated_power)
                                 : NAN;
    }
    ctx_free(&c);
    if (rc != SY_OK) {
        sy_yield_result_free(r);
        return rc;
    }
    *out = r;
    return SY_OK;
}
