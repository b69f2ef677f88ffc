/* From the model to hydrodynamic databases (hydro.h): array plan from the layout,
 * truncation from the tolerance, block-wise sweeps with an atomic per-block cache. */
#include "core/core_impl.h"
#include "swellyield/array.h"
#include "swellyield/hydro.h"
#include "swellyield/waves.h"

#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

/* Angular orders: the larger of what one body's own partial waves need at the highest
 * frequency (n up to about k a plus a few: common practice for cylinder series) and what
 * the re-expansion about the nearest neighbour needs (the Graf series converges like
 * (a / (L - a))^M: measured in tests/array/test_floats.c). */
static size_t angular_order(const sy_model *m, double a_max, double l_min)
{
    double k = 0;
    sy_waves_wavenumber(m->omega[m->n_omega - 1], m->depth, m->g, &k, NULL);
    double ka = k * a_max, body = ceil(ka + 2 * cbrt(ka)) + 1, n = body;
    if (isfinite(l_min) && l_min > 2 * a_max)
        n = fmax(body, ceil(log(m->tolerance) / log(a_max / (l_min - a_max))));
    return n < SY_HYDRO_MIN_ORDER ? SY_HYDRO_MIN_ORDER : (size_t)n;
}

static size_t depth_modes(const sy_model *m, double gap)
{
    if (m->n_devices < 2 || !(gap > 0))
        return 1; /* one body: the transfer matrix needs no evanescent coupling */
    double q = 1 + ceil(m->depth * log(1 / m->tolerance) / (M_PI * gap));
    return q > SY_HYDRO_MAX_DEPTH ? SY_HYDRO_MAX_DEPTH : (size_t)q;
}

/* One database: a plan for `n` bodies of the model (all, or one device alone). */
typedef struct job {
    const sy_model *m;
    const sy_model_device *dev;   /* bodies */
    size_t n;
    const char *cache_dir;
    int n_threads;
} job;

/* Frequencies src[s0 .. s0+count) into dst[d0 ..): the per-frequency fields of two
 * databases of the same layout (the cache blocks and the whole sweep). */
static void copy_block(sy_hydro_db *dst, size_t d0, const sy_hydro_db *src, size_t s0, size_t count)
{
    size_t nd = src->n_dof, nh = src->n_headings;
    memcpy(dst->added_mass + d0 * nd * nd, src->added_mass + s0 * nd * nd, count * nd * nd * sizeof(double));
    memcpy(dst->damping + d0 * nd * nd, src->damping + s0 * nd * nd, count * nd * nd * sizeof(double));
    memcpy(dst->excitation + d0 * nh * nd, src->excitation + s0 * nh * nd, count * nh * nd * sizeof(double complex));
    memcpy(dst->convergence + d0, src->convergence + s0, count * sizeof(double));
    memcpy(dst->omega + d0, src->omega + s0, count * sizeof(double));
}

static int db_from_results(sy_hydro_db *db, size_t first, sy_array_hydro **res, size_t count)
{
    size_t nd = db->n_dof, nh = db->n_headings;
    for (size_t i = 0; i < count; i++) {
        size_t io = first + i;
        memcpy(db->added_mass + io * nd * nd, res[i]->added_mass, nd * nd * sizeof(double));
        memcpy(db->damping + io * nd * nd, res[i]->damping, nd * nd * sizeof(double));
        memcpy(db->excitation + io * nh * nd, res[i]->excitation, nh * nd * sizeof(double complex));
        db->convergence[io] = res[i]->convergence;
    }
    return SY_OK;
}

/* Geometry of the layout: largest radius, smallest centre distance, smallest gap. */
static void layout_extent(const sy_model_device *dev, size_t n, double *a_max, double *l_min, double *gap)
{
    *a_max = 0, *l_min = INFINITY, *gap = INFINITY;
    for (size_t b = 0; b < n; b++) {
        *a_max = fmax(*a_max, dev[b].radius);
        for (size_t c = 0; c < b; c++) {
            double l = hypot(dev[b].x - dev[c].x, dev[b].y - dev[c].y);
            *l_min = fmin(*l_min, l);
            *gap = fmin(*gap, l - dev[b].radius - dev[c].radius);
        }
    }
}

void sy_hydro_truncation(const sy_model *m, const sy_model_device *dev, size_t n, size_t *orders, size_t *depth)
{
    double a_max, l_min, gap;
    layout_extent(dev, n, &a_max, &l_min, &gap);
    *orders = m->orders ? m->orders : angular_order(m, a_max, l_min);
    *depth = m->depth_modes ? m->depth_modes : depth_modes(m, gap);
}

int sy_hydro_plan_create(sy_array_plan **out, const sy_model *m, const sy_model_device *dev, size_t n,
                         sy_error *err)
{
    /* Types: distinct (radius, draft). */
    sy_array_type *types = calloc(n, sizeof *types);
    sy_array_body *bodies = calloc(n, sizeof *bodies);
    int rc = types && bodies ? SY_OK : sy_error_set(err, SY_ENOMEM, "array of %zu bodies", n);
    size_t nt = 0;
    for (size_t b = 0; rc == SY_OK && b < n; b++) {
        const sy_model_device *d = &dev[b];
        size_t t;
        double draft = m->shape == SY_SHAPE_FLOAT ? d->draft : m->depth; /* a column stands on the seabed */
        for (t = 0; t < nt && !(types[t].geom.radius == d->radius && types[t].geom.draft == draft); t++)
            ;
        if (t == nt) {
            types[t].geom.kind = m->shape == SY_SHAPE_FLOAT ? SY_BODY_FLOAT : SY_BODY_COLUMN;
            types[t].geom.radius = d->radius;
            types[t].geom.draft = draft;
            types[t].geom.z_rot = 0.0;
            types[t].modes = m->modes;
            nt++;
        }
        bodies[b].x = d->x, bodies[b].y = d->y, bodies[b].type = t;
    }
    sy_array_settings s = {m->depth, m->rho, m->g, m->tolerance, 0, 0, 1e-3};
    sy_hydro_truncation(m, dev, n, &s.n_order, &s.n_depth);
    /* Memory bound, up front (before the body plans): one dense complex matrix of at most
     * N (2M+1) Q unknowns per thread (the plan's per-mode angular truncation keeps fewer). */
    double nu = (double)n * (double)(2 * s.n_order + 1) * (double)s.n_depth, bytes = 16.0 * nu * nu;
    if (rc == SY_OK && bytes > SY_HYDRO_MAX_MATRIX_BYTES)
        rc = sy_error_set(err, SY_ELIMIT,
                          "%s: the interaction matrix of %zu bodies x %zu orders x %zu depth modes needs %.1f GB per thread "
                          "(limit %.1f GB): set [solve] depth_modes or orders lower, or the tolerance looser",
                          m->path, n, 2 * s.n_order + 1, s.n_depth, bytes / 1e9, SY_HYDRO_MAX_MATRIX_BYTES / 1e9);
    if (rc == SY_OK)
        rc = sy_array_plan_create(out, &s, types, nt, bodies, n, m->headings, m->n_headings, err);
    free(types);
    free(bodies);
    return rc;
}

static int run_job(const job *j, sy_hydro_db **out, size_t *computed, size_t *cached, sy_hydro_progress progress,
                   void *pctx, size_t *done, size_t total, sy_error *err)
{
    const sy_model *m = j->m;
    sy_array_plan *plan = NULL;
    sy_hydro_db *db = NULL, *blk = NULL;
    sy_array_hydro **res = NULL;
    int rc = sy_hydro_plan_create(&plan, m, j->dev, j->n, err);
    size_t nd = rc == SY_OK ? sy_array_plan_n_dof(plan) : 0;
    if (rc == SY_OK)
        rc = sy_hydro_db_alloc(&db, m->n_omega, m->n_headings, j->n, nd, err);
    size_t blk_n = SY_HYDRO_BLOCK;
    if (rc == SY_OK && (res = calloc(blk_n, sizeof *res)) == NULL)
        rc = sy_error_set(err, SY_ENOMEM, "hydro results");
    for (size_t i = 0; rc == SY_OK && i < blk_n; i++)
        rc = sy_array_hydro_alloc(&res[i], plan, err);
    if (rc == SY_OK) {
        memcpy(db->omega, m->omega, m->n_omega * sizeof *db->omega);
        memcpy(db->headings, m->headings, m->n_headings * sizeof *db->headings);
        for (size_t d = 0; d < nd; d++) {
            size_t body;
            int mode;
            sy_array_plan_dof(plan, d, &body, &mode);
            db->dof_body[d] = (int)body, db->dof_mode[d] = mode;
        }
        for (size_t b = 0; b < j->n; b++) {
            db->body_x[b] = j->dev[b].x, db->body_y[b] = j->dev[b].y;
            db->body_radius[b] = j->dev[b].radius;
            db->body_draft[b] = m->shape == SY_SHAPE_FLOAT ? j->dev[b].draft : m->depth;
            snprintf(db->body_name[b], SY_HYDRODB_NAME_LEN, "%s", j->dev[b].name);
        }
        db->depth = m->depth, db->rho = m->rho, db->g = m->g, db->tolerance = m->tolerance;
        sy_array_plan_truncation(plan, db->truncation, sizeof db->truncation);
        snprintf(db->cache_key, sizeof db->cache_key, "%016llx", (unsigned long long)sy_array_plan_key(plan));
    }
    for (size_t first = 0; rc == SY_OK && first < m->n_omega; first += blk_n) {
        size_t count = m->n_omega - first < blk_n ? m->n_omega - first : blk_n;
        unsigned long long key = syi_hash64(sy_array_plan_key(plan), m->omega + first, count * sizeof(double));
        char path[SY_MODEL_PATH_MAX + 64];
        int have = 0;
        if (j->cache_dir != NULL) {
            snprintf(path, sizeof path, "%s/%016llx.nc", j->cache_dir, key);
            struct stat sb;
            if (stat(path, &sb) == 0 && sy_hydro_db_read(&blk, path, NULL) == SY_OK) {
                have = blk->n_omega == count && blk->n_dof == nd && blk->n_headings == m->n_headings;
                for (size_t i = 0; have && i < count; i++)
                    have = blk->omega[i] == m->omega[first + i];
                if (have) {
                    copy_block(db, first, blk, 0, count);
                    (*cached)++;
                }
                sy_hydro_db_free(blk);
                blk = NULL;
            }
        }
        if (!have) {
            rc = sy_array_sweep(plan, m->omega + first, count, res, j->n_threads, err);
            if (rc == SY_OK)
                rc = db_from_results(db, first, res, count);
            (*computed)++;
            if (rc == SY_OK && j->cache_dir != NULL) {
                /* The block as a small database of its own (same layout, same checks). */
                rc = sy_hydro_db_alloc(&blk, count, m->n_headings, j->n, nd, err);
                if (rc == SY_OK) {
                    memcpy(blk->headings, db->headings, m->n_headings * sizeof(double));
                    memcpy(blk->dof_body, db->dof_body, nd * sizeof(int));
                    memcpy(blk->dof_mode, db->dof_mode, nd * sizeof(int));
                    memcpy(blk->body_x, db->body_x, j->n * sizeof(double));
                    memcpy(blk->body_y, db->body_y, j->n * sizeof(double));
                    memcpy(blk->body_radius, db->body_radius, j->n * sizeof(double));
                    memcpy(blk->body_draft, db->body_draft, j->n * sizeof(double));
                    memcpy(blk->body_name, db->body_name, j->n * sizeof *db->body_name);
                    copy_block(blk, 0, db, first, count);
                    blk->depth = db->depth, blk->rho = db->rho, blk->g = db->g, blk->tolerance = db->tolerance;
                    memcpy(blk->truncation, db->truncation, sizeof db->truncation);
                    snprintf(blk->cache_key, sizeof blk->cache_key, "%016llx", key);
                    rc = sy_hydro_db_write(blk, path, err);
                }
                sy_hydro_db_free(blk);
                blk = NULL;
            }
        }
        *done += count;
        if (progress != NULL)
            progress(pctx, *done, total);
    }
    for (size_t i = 0; res != NULL && i < blk_n; i++)
        sy_array_hydro_free(res[i]);
    free(res);
    sy_array_plan_free(plan);
    if (rc != SY_OK) {
        sy_hydro_db_free(db);
        return rc;
    }
    *out = db;
    return SY_OK;
}

void sy_hydro_set_free(sy_hydro_set *set)
{
    if (set == NULL)
        return;
    sy_hydro_db_free(set->array);
    for (size_t i = 0; set->iso != NULL && i < set->n_iso; i++)
        sy_hydro_db_free(set->iso[i]);
    free(set->iso);
    free(set->iso_of_device);
    free(set);
}

int sy_hydro_build(sy_hydro_set **out, const sy_model *m, int with_isolated, const char *cache_dir, int n_threads,
                   sy_hydro_progress progress, void *pctx, sy_error *err)
{
    if (cache_dir != NULL && mkdir(cache_dir, 0777) != 0 && errno != EEXIST)
        return sy_error_set(err, SY_EIO, "%s: cannot create the cache folder: %s", cache_dir, strerror(errno));
    if (cache_dir != NULL)
        syi_atomic_sweep(cache_dir); /* blocks half-written by a killed run */
    sy_hydro_set *set = calloc(1, sizeof *set);
    size_t *rep = calloc(m->n_devices, sizeof *rep); /* representative device of each isolated class */
    if (set == NULL || rep == NULL || (set->iso_of_device = calloc(m->n_devices, sizeof *set->iso_of_device)) == NULL ||
        (set->iso = calloc(m->n_devices, sizeof *set->iso)) == NULL) {
        free(rep);
        sy_hydro_set_free(set);
        return sy_error_set(err, SY_ENOMEM, "hydro databases");
    }
    size_t n_cls = 0, *cls = calloc(m->n_devices, sizeof *cls);
    for (size_t q = 0; cls != NULL && with_isolated && q < m->n_devices; q++) {
        size_t c;
        for (c = 0; c < n_cls && !(m->devices[rep[c]].radius == m->devices[q].radius &&
                                   m->devices[rep[c]].draft == m->devices[q].draft);
             c++)
            ;
        if (c == n_cls)
            rep[n_cls++] = q;
        cls[q] = c;
    }
    size_t done = 0, total = m->n_omega * (1 + n_cls);
    job j = {m, m->devices, m->n_devices, cache_dir, n_threads};
    int rc = cls != NULL ? run_job(&j, &set->array, &set->blocks_computed, &set->blocks_cached, progress, pctx, &done,
                                   total, err)
                         : sy_error_set(err, SY_ENOMEM, "hydro classes");
    for (size_t c = 0; rc == SY_OK && c < n_cls; c++) {
        job ji = {m, &m->devices[rep[c]], 1, cache_dir, n_threads};
        rc = run_job(&ji, &set->iso[c], &set->blocks_computed, &set->blocks_cached, progress, pctx, &done, total, err);
        if (rc == SY_OK)
            set->n_iso++;
        else
            sy_error_prefix(err, "isolated device '%s'", m->devices[rep[c]].name);
    }
    for (size_t q = 0; rc == SY_OK && with_isolated && q < m->n_devices; q++)
        set->iso_of_device[q] = set->iso[cls[q]];
    free(rep);
    free(cls);
    if (rc != SY_OK) {
        sy_hydro_set_free(set);
        return rc;
    }
    *out = set;
    return SY_OK;
}
