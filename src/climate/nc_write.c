/* Scatter table -> NetCDF-4 file in the swellyield layout with CF-1.10 metadata
 * (docs/formats.md). Dimensions hs, period, [direction,] bound = 2; coordinate variables
 * hold bin centres and point to CF cell-bounds variables; occurrence(hs, period
 * [, direction]) in h year-1 (mean annual hours, with the hours-per-year constant as an
 * attribute) or 1 (fraction). Atomic: written to a mkstemp file beside the target, then
 * renamed; any failure removes the temporary file. */
#define _POSIX_C_SOURCE 200809L
#include "climate_impl.h"

#include <errno.h>
#include <math.h>
#include <netcdf.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <time.h>
#include <unistd.h>

/* Layout version written to the global attribute scatter_table_layout. */
#define LAYOUT_NAME "swellyield scatter table 1"

typedef struct {
    int ncid;
    const char *path;   /* the final path, for messages */
    sy_error *err;
} writer;

static int fail(writer *w, const char *var, const char *what, int st)
{
    return sy_error_set(w->err, SY_EIO, "%s: variable '%s': %s: %s", w->path, var, what,
                        nc_strerror(st));
}

static int put_text(writer *w, int varid, const char *var, const char *name, const char *v)
{
    int st = nc_put_att_text(w->ncid, varid, name, strlen(v), v);
    return st == NC_NOERR ? SY_OK : fail(w, var, name, st);
}

static int put_double(writer *w, int varid, const char *var, const char *name, double v)
{
    int st = nc_put_att_double(w->ncid, varid, name, NC_DOUBLE, 1, &v);
    return st == NC_NOERR ? SY_OK : fail(w, var, name, st);
}

/* A coordinate variable of bin centres plus its bounds variable (n x 2). */
static int def_axis(writer *w, const char *name, int dim, int dim_bound, int *varid,
                    int *bounds_id)
{
    char bname[NC_MAX_NAME + 1];
    snprintf(bname, sizeof bname, "%s_bounds", name);
    int dims[2] = {dim, dim_bound};
    int st = nc_def_var(w->ncid, name, NC_DOUBLE, 1, &dim, varid);
    if (st != NC_NOERR)
        return fail(w, name, "define", st);
    st = nc_def_var(w->ncid, bname, NC_DOUBLE, 2, dims, bounds_id);
    if (st != NC_NOERR)
        return fail(w, bname, "define", st);
    return put_text(w, *varid, name, "bounds", bname);
}

static int put_axis(writer *w, const char *name, int varid, int bounds_id, const double *lo,
                    const double *hi, size_t n)
{
    double *c = malloc(n * sizeof *c), *b = malloc(2 * n * sizeof *b);
    if (c == NULL || b == NULL) {
        free(c);
        free(b);
        return sy_error_set(w->err, SY_ENOMEM, "%s: variable '%s'", w->path, name);
    }
    for (size_t i = 0; i < n; i++) {
        c[i] = 0.5 * (lo[i] + hi[i]);
        b[2 * i] = lo[i];
        b[2 * i + 1] = hi[i];
    }
    int st = nc_put_var_double(w->ncid, varid, c);
    int rc = st == NC_NOERR ? SY_OK : fail(w, name, "write", st);
    if (rc == SY_OK && (st = nc_put_var_double(w->ncid, bounds_id, b)) != NC_NOERR)
        rc = fail(w, name, "write bounds", st);
    free(c);
    free(b);
    return rc;
}

static int write_contents(writer *w, const sy_climate_table *t, const char *note)
{
    const sy_climate_bins *b = &t->bins;
    const sy_climate_meta *m = &t->meta;
    int nc = w->ncid, st, rc = SY_OK;
    int d_hs, d_per, d_dir = -1, d_bnd;
    int v_hs, v_hsb, v_per, v_perb, v_dir = -1, v_dirb = -1, v_occ, v_depth = -1;
    if ((st = nc_def_dim(nc, "hs", b->n_hs, &d_hs)) != NC_NOERR ||
        (st = nc_def_dim(nc, "period", b->n_period, &d_per)) != NC_NOERR ||
        (b->n_dir > 0 && (st = nc_def_dim(nc, "direction", b->n_dir, &d_dir)) != NC_NOERR) ||
        (st = nc_def_dim(nc, "bound", 2, &d_bnd)) != NC_NOERR)
        return fail(w, "(dimensions)", "define", st);

    /* Hs axis. */
    rc = def_axis(w, "hs", d_hs, d_bnd, &v_hs, &v_hsb);
    if (rc == SY_OK)
        rc = put_text(w, v_hs, "hs", "standard_name", SYI_CF_HS);
    if (rc == SY_OK)
        rc = put_text(w, v_hs, "hs", "long_name",
                      "significant wave height (spectral Hm0 = 4 sqrt(m0)), bin centre");
    if (rc == SY_OK)
        rc = put_text(w, v_hs, "hs", "units", "m");

    /* Period axis. */
    int te = b->period == SY_CLIMATE_TE;
    if (rc == SY_OK)
        rc = def_axis(w, "period", d_per, d_bnd, &v_per, &v_perb);
    if (rc == SY_OK)
        rc = put_text(w, v_per, "period", "standard_name", te ? SYI_CF_TE : SYI_CF_TP);
    if (rc == SY_OK)
        rc = put_text(w, v_per, "period", "long_name",
                      te ? "energy period Te = m(-1)/m(0), bin centre"
                         : "peak period Tp = 1/fp, bin centre");
    if (rc == SY_OK)
        rc = put_text(w, v_per, "period", "units", "s");

    /* Direction axis (optional). */
    if (rc == SY_OK && b->n_dir > 0) {
        rc = def_axis(w, "direction", d_dir, d_bnd, &v_dir, &v_dirb);
        if (rc == SY_OK)
            rc = put_text(w, v_dir, "direction", "standard_name", SYI_CF_DIR);
        if (rc == SY_OK)
            rc = put_text(w, v_dir, "direction", "long_name",
                          "direction waves come from, clockwise from true north, bin centre "
                          "(bounds may be below 0 for the bin through north)");
        if (rc == SY_OK)
            rc = put_text(w, v_dir, "direction", "units", "degree");
    }

    /* Occurrence. */
    int dims[3] = {d_hs, d_per, d_dir};
    if (rc == SY_OK && (st = nc_def_var(nc, "occurrence", NC_DOUBLE, b->n_dir > 0 ? 3 : 2,
                                        dims, &v_occ)) != NC_NOERR)
        rc = fail(w, "occurrence", "define", st);
    int hours = t->kind == SY_CLIMATE_HOURS;
    if (rc == SY_OK)
        rc = put_text(w, v_occ, "occurrence", "long_name",
                      hours ? "mean annual hours of sea states in the bin"
                            : "fraction of time with sea states in the bin");
    if (rc == SY_OK)
        rc = put_text(w, v_occ, "occurrence", "units", hours ? "h year-1" : "1");
    if (rc == SY_OK)
        rc = put_text(w, v_occ, "occurrence", "occurrence_kind",
                      hours ? "hours_per_year" : "fraction");
    if (rc == SY_OK)
        rc = put_double(w, v_occ, "occurrence", "hours_per_year", SY_CLIMATE_HOURS_PER_YEAR);
    if (rc == SY_OK)
        rc = put_text(w, v_occ, "occurrence", "comment",
                      hours ? "hours_per_year is the average year (365.25 d) used to relate "
                              "hours to fractions"
                            : "fractions of all time; mean annual hours = fraction x "
                              "hours_per_year (average year of 365.25 d)");

    /* Depth (optional scalar). */
    if (rc == SY_OK && m->depth == m->depth) {
        if ((st = nc_def_var(nc, "depth", NC_DOUBLE, 0, NULL, &v_depth)) != NC_NOERR)
            rc = fail(w, "depth", "define", st);
        if (rc == SY_OK)
            rc = put_text(w, v_depth, "depth", "standard_name", SYI_CF_DEPTH);
        if (rc == SY_OK)
            rc = put_text(w, v_depth, "depth", "long_name", "water depth at the site");
        if (rc == SY_OK)
            rc = put_text(w, v_depth, "depth", "units", "m");
        if (rc == SY_OK)
            rc = put_text(w, v_depth, "depth", "positive", "down");
    }

    /* Global attributes. */
    char buf[2048];
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "Conventions", "CF-1.10");
    snprintf(buf, sizeof buf, "Sea-state scatter table (Hs x %s%s)%s%s%s",
             sy_climate_period_name(b->period), b->n_dir > 0 ? " x direction" : "",
             m->site[0] != '\0' ? " for " : "", m->site, m->invented ? " [INVENTED DATA]" : "");
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "title", buf);
    if (rc == SY_OK && m->institution[0] != '\0')
        rc = put_text(w, NC_GLOBAL, "global", "institution", m->institution);
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "source",
                      m->source[0] != '\0' ? m->source : "unknown");
    char stamp[32] = "unknown time";
    time_t now = time(NULL);
    struct tm tm;
    if (gmtime_r(&now, &tm) != NULL)
        strftime(stamp, sizeof stamp, "%Y-%m-%dT%H:%M:%SZ", &tm);
    snprintf(buf, sizeof buf, "%s: written by swellyield %s%s%s", stamp, sy_version(),
             note != NULL && note[0] != '\0' ? "; " : "", note != NULL ? note : "");
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "history", buf);
    snprintf(buf, sizeof buf, "%s%s%s",
             m->invented ? SYI_INVENTED_SENTENCE : "",
             m->invented && m->comment[0] != '\0' ? " " : "", m->comment);
    if (rc == SY_OK && buf[0] != '\0')
        rc = put_text(w, NC_GLOBAL, "global", "comment", buf);
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "site_name", m->site);
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "invented_data", m->invented ? "yes" : "no");
    if (rc == SY_OK && m->record_years == m->record_years)
        rc = put_double(w, NC_GLOBAL, "global", "record_length_years", m->record_years);
    if (rc == SY_OK)
        rc = put_text(w, NC_GLOBAL, "global", "scatter_table_layout", LAYOUT_NAME);
    if (rc != SY_OK)
        return rc;
    if ((st = nc_enddef(nc)) != NC_NOERR)
        return fail(w, "(header)", "end define mode", st);

    /* Data. */
    const double *he = b->hs_edges, *pe = b->period_edges;
    rc = put_axis(w, "hs", v_hs, v_hsb, he, he + 1, b->n_hs);
    if (rc == SY_OK)
        rc = put_axis(w, "period", v_per, v_perb, pe, pe + 1, b->n_period);
    if (rc == SY_OK && b->n_dir > 0) {
        double *lo = malloc(b->n_dir * sizeof *lo), *hi = malloc(b->n_dir * sizeof *hi);
        if (lo == NULL || hi == NULL) {
            rc = sy_error_set(w->err, SY_ENOMEM, "%s: variable 'direction'", w->path);
        } else {
            for (size_t d = 0; d < b->n_dir; d++) {
                lo[d] = b->dir_centres[d] - 0.5 * b->dir_width;
                hi[d] = b->dir_centres[d] + 0.5 * b->dir_width;
            }
            /* Centres are written exactly, not recomputed as (lo + hi) / 2. */
            rc = put_axis(w, "direction", v_dir, v_dirb, lo, hi, b->n_dir);
            if (rc == SY_OK && (st = nc_put_var_double(nc, v_dir, b->dir_centres)) != NC_NOERR)
                rc = fail(w, "direction", "write", st);
        }
        free(lo);
        free(hi);
    }
    if (rc == SY_OK && (st = nc_put_var_double(nc, v_occ, t->occ)) != NC_NOERR)
        rc = fail(w, "occurrence", "write", st);
    if (rc == SY_OK && v_depth >= 0 && (st = nc_put_var_double(nc, v_depth, &m->depth)) != NC_NOERR)
        rc = fail(w, "depth", "write", st);
    return rc;
}

int sy_climate_table_write(const sy_climate_table *t, const char *path, const char *note,
                           sy_error *err)
{
    if (t == NULL || path == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table write: NULL argument");
    int rc = sy_climate_table_validate(t, path, err);
    if (rc != SY_OK)
        return rc;
    size_t n = strlen(path);
    char *tmp = malloc(n + 16);
    if (tmp == NULL)
        return sy_error_set(err, SY_ENOMEM, "%s: temporary file name", path);
    snprintf(tmp, n + 16, "%s.tmp-XXXXXX", path);
    int fd = mkstemp(tmp);
    if (fd < 0) {
        rc = sy_error_set(err, SY_EIO, "%s: cannot create a temporary file beside it: %s", path,
                          strerror(errno));
        free(tmp);
        return rc;
    }
    /* mkstemp makes the file 0600; give it the usual 0666 & ~umask. */
    mode_t mask = umask(0);
    umask(mask);
    fchmod(fd, 0666 & ~mask);
    close(fd);

    writer w = {-1, path, err};
    int st = nc_create(tmp, NC_NETCDF4 | NC_CLOBBER, &w.ncid);
    if (st != NC_NOERR) {
        rc = sy_error_set(err, SY_EIO, "%s: cannot create NetCDF file %s: %s", path, tmp,
                          nc_strerror(st));
        w.ncid = -1;
    } else {
        rc = write_contents(&w, t, note);
        st = nc_close(w.ncid);
        if (rc == SY_OK && st != NC_NOERR)
            rc = fail(&w, "(file)", "close", st);
    }
    if (rc == SY_OK && rename(tmp, path) != 0)
        rc = sy_error_set(err, SY_EIO, "%s: cannot rename the temporary file into place: %s",
                          path, strerror(errno));
    if (rc != SY_OK)
        remove(tmp);
    free(tmp);
    return rc;
}
