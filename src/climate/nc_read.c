/* NetCDF file in the swellyield scatter-table layout -> scatter table (docs/formats.md).
 * Every structural fault is reported with the path, the variable, the value found and
 * what was expected; NetCDF failures carry nc_strerror(). Bin edges come from the CF
 * bounds variables, which must be contiguous (upper edge of bin i = lower edge of bin
 * i + 1) and contain their centres. */
#include "climate_impl.h"
#include "core/core_impl.h"

#include <math.h>
#include <netcdf.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* Bounds written by other programs may be recomputed from centres in float arithmetic:
 * edges agreeing to this relative difference count as the same edge. */
#define EDGE_RTOL 1e-9

typedef struct {
    int ncid;
    const char *path;
    sy_error *err;
} reader;

static int nc_fail(reader *r, const char *var, const char *what, int st)
{
    return sy_error_set(r->err, SY_EIO, "%s: variable '%s': %s: %s", r->path, var, what,
                        nc_strerror(st));
}

static int find_var(reader *r, const char *name, const char *expect, int *varid)
{
    int st = nc_inq_varid(r->ncid, name, varid);
    if (st == NC_ENOTVAR)
        return sy_error_set(r->err, SY_EINPUT, "%s: variable '%s' missing, expected %s (%s)",
                            r->path, name, expect, nc_strerror(st));
    return st == NC_NOERR ? SY_OK : nc_fail(r, name, "look up", st);
}

/* Append "[, ]name=len" to buf (truncating quietly; only used in messages). */
static void append_dim(char *buf, size_t size, int comma, const char *name, size_t len)
{
    char item[NC_MAX_NAME + 32];
    snprintf(item, sizeof item, "%s%.*s=%zu", comma ? ", " : "", NC_MAX_NAME, name, len);
    size_t used = strlen(buf);
    if (used + 1 < size)
        strncat(buf, item, size - used - 1);
}

/* Check that variable `name` has exactly the dimensions dims[0..nd-1]. */
static int check_dims(reader *r, const char *name, int varid, const int *dims, int nd)
{
    int have_nd, have[NC_MAX_VAR_DIMS];
    int st = nc_inq_varndims(r->ncid, varid, &have_nd);
    if (st == NC_NOERR && have_nd <= NC_MAX_VAR_DIMS)
        st = nc_inq_vardimid(r->ncid, varid, have);
    if (st != NC_NOERR)
        return nc_fail(r, name, "dimensions", st);
    int ok = have_nd == nd;
    for (int i = 0; ok && i < nd; i++)
        ok = have[i] == dims[i];
    if (ok)
        return SY_OK;
    char got[256] = "", want[256] = "", dn[NC_MAX_NAME + 1];
    for (int i = 0; i < have_nd; i++) {
        if (nc_inq_dimname(r->ncid, have[i], dn) != NC_NOERR)
            snprintf(dn, sizeof dn, "?");
        size_t len = 0;
        nc_inq_dimlen(r->ncid, have[i], &len);
        append_dim(got, sizeof got, i > 0, dn, len);
    }
    for (int i = 0; i < nd; i++) {
        if (nc_inq_dimname(r->ncid, dims[i], dn) != NC_NOERR)
            snprintf(dn, sizeof dn, "?");
        size_t len = 0;
        nc_inq_dimlen(r->ncid, dims[i], &len);
        append_dim(want, sizeof want, i > 0, dn, len);
    }
    return sy_error_set(r->err, SY_EINPUT,
                        "%s: variable '%s' has dimensions (%s), expected (%s)", r->path, name,
                        got, want);
}

static int read_doubles(reader *r, const char *name, int varid, double *v)
{
    int st = nc_get_var_double(r->ncid, varid, v);
    return st == NC_NOERR ? SY_OK : nc_fail(r, name, "read", st);
}

/* units attribute, required, checked by `ok`. */
static int check_units(reader *r, const char *name, int varid, int (*ok)(const char *),
                       const char *expect)
{
    char *u = NULL;
    int rc = syi_climate_nc_text_att(r->ncid, varid, "units", &u, r->path, r->err);
    if (rc != SY_OK)
        return rc;
    if (u == NULL)
        return sy_error_set(r->err, SY_EINPUT,
                            "%s: variable '%s': units attribute missing, expected '%s'",
                            r->path, name, expect);
    if (!ok(u))
        rc = sy_error_set(r->err, SY_EINPUT,
                          "%s: variable '%s': unknown units attribute '%s', expected '%s'",
                          r->path, name, u, expect);
    free(u);
    return rc;
}

static int same_edge(double a, double b)
{
    return fabs(a - b) <= EDGE_RTOL * fmax(fabs(a), fabs(b));
}

/* Read centres and bounds of axis `name` over dimension dim (length n); bounds are
 * [lo, hi] pairs. lo, hi, centre: caller arrays of n. */
static int read_axis(reader *r, const char *name, int dim, int dim_bound, size_t n, double *lo,
                     double *hi, double *centre, int *varid)
{
    int rc = find_var(r, name, "a coordinate variable of bin centres", varid);
    if (rc == SY_OK)
        rc = check_dims(r, name, *varid, &dim, 1);
    if (rc == SY_OK)
        rc = read_doubles(r, name, *varid, centre);
    char *bname = NULL;
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, *varid, "bounds", &bname, r->path, r->err);
    if (rc == SY_OK && bname == NULL)
        rc = sy_error_set(r->err, SY_EINPUT,
                          "%s: variable '%s': bounds attribute missing, expected the name of "
                          "its CF cell-bounds variable",
                          r->path, name);
    int bid;
    double *b = NULL;
    if (rc == SY_OK)
        rc = find_var(r, bname, "the bounds variable named by the bounds attribute", &bid);
    int dims[2] = {dim, dim_bound};
    if (rc == SY_OK)
        rc = check_dims(r, bname, bid, dims, 2);
    if (rc == SY_OK && (b = malloc(2 * n * sizeof *b)) == NULL)
        rc = sy_error_set(r->err, SY_ENOMEM, "%s: variable '%s'", r->path, bname);
    if (rc == SY_OK)
        rc = read_doubles(r, bname, bid, b);
    for (size_t i = 0; rc == SY_OK && i < n; i++) {
        lo[i] = b[2 * i];
        hi[i] = b[2 * i + 1];
        if (!(lo[i] < hi[i]))
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: variable '%s': bin %zu bounds [%g, %g], expected lower < upper",
                              r->path, bname, i, lo[i], hi[i]);
        else if (!(centre[i] >= lo[i] && centre[i] <= hi[i]))
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: variable '%s': bin %zu centre %g outside its bounds [%g, %g]",
                              r->path, name, i, centre[i], lo[i], hi[i]);
    }
    free(b);
    free(bname);
    return rc;
}

/* Edges from contiguous bounds. */
static int edges_from_bounds(reader *r, const char *name, const double *lo, const double *hi,
                             size_t n, double *edges)
{
    for (size_t i = 0; i + 1 < n; i++)
        if (!(lo[i + 1] > lo[i]))
            return sy_error_set(r->err, SY_EINPUT,
                                "%s: variable '%s_bounds': bins unsorted or overlapping: bin %zu "
                                "starts at %g, not after bin %zu at %g, expected increasing bins",
                                r->path, name, i + 1, lo[i + 1], i, lo[i]);
    for (size_t i = 0; i + 1 < n; i++) {
        if (hi[i] > lo[i + 1] && !same_edge(hi[i], lo[i + 1]))
            return sy_error_set(r->err, SY_EINPUT,
                                "%s: variable '%s_bounds': bins unsorted or overlapping: bin %zu "
                                "ends at %g after bin %zu starts at %g, expected contiguous "
                                "increasing bins",
                                r->path, name, i, hi[i], i + 1, lo[i + 1]);
        if (!same_edge(hi[i], lo[i + 1]))
            return sy_error_set(r->err, SY_EINPUT,
                                "%s: variable '%s_bounds': gap between bin %zu (upper %g) and "
                                "bin %zu (lower %g), expected contiguous bins",
                                r->path, name, i, hi[i], i + 1, lo[i + 1]);
        edges[i] = lo[i];
    }
    edges[n - 1] = lo[n - 1];
    edges[n] = hi[n - 1];
    return SY_OK;
}

static int get_dim(reader *r, const char *name, int required, int *dimid, size_t *len)
{
    int st = nc_inq_dimid(r->ncid, name, dimid);
    if (st == NC_EBADDIM && !required) {
        *dimid = -1;
        *len = 0;
        return SY_OK;
    }
    if (st == NC_EBADDIM)
        return sy_error_set(r->err, SY_EINPUT, "%s: dimension '%s' missing (%s)", r->path, name,
                            nc_strerror(st));
    if (st == NC_NOERR)
        st = nc_inq_dimlen(r->ncid, *dimid, len);
    if (st != NC_NOERR)
        return nc_fail(r, name, "dimension", st);
    if (*len == 0)
        return sy_error_set(r->err, SY_EINPUT,
                            "%s: dimension '%s' has length 0 (empty table), expected "
                            "at least one bin", r->path, name);
    return SY_OK;
}

static int read_contents(reader *r, sy_climate_table **out)
{
    int d_hs, d_per, d_dir, d_bnd;
    size_t n_hs = 0, n_per = 0, n_dir = 0, n_bnd = 0;
    int rc = get_dim(r, "hs", 1, &d_hs, &n_hs);
    if (rc == SY_OK)
        rc = get_dim(r, "period", 1, &d_per, &n_per);
    if (rc == SY_OK)
        rc = get_dim(r, "direction", 0, &d_dir, &n_dir);
    if (rc == SY_OK)
        rc = get_dim(r, "bound", 1, &d_bnd, &n_bnd);
    if (rc == SY_OK && n_bnd != 2)
        rc = sy_error_set(r->err, SY_EINPUT, "%s: dimension 'bound' has length %zu, expected 2",
                          r->path, n_bnd);
    double cells = (double)n_hs * (double)n_per * (double)(n_dir > 0 ? n_dir : 1);
    if (rc == SY_OK && cells > (double)SY_CLIMATE_MAX_CELLS)
        rc = sy_error_set(r->err, SY_ELIMIT,
                          "%s: dimensions hs x period x direction = %zu x %zu x %zu declare %.3g "
                          "bins, above the limit of %zu (SY_CLIMATE_MAX_CELLS in "
                          "include/swellyield/climate.h: raise it and rebuild if you mean it)",
                          r->path, n_hs, n_per, n_dir, cells, SY_CLIMATE_MAX_CELLS);
    if (rc != SY_OK)
        return rc;
    size_t nmax = n_hs > n_per ? n_hs : n_per;
    nmax = n_dir > nmax ? n_dir : nmax;
    double *lo = malloc(nmax * sizeof *lo), *hi = malloc(nmax * sizeof *hi);
    double *c = malloc(nmax * sizeof *c);
    double *he = malloc((n_hs + 1) * sizeof *he), *pe = malloc((n_per + 1) * sizeof *pe);
    double *dc = malloc((n_dir + 1) * sizeof *dc);
    char *std = NULL, *occ_units = NULL;
    sy_climate_table *t = NULL;
    sy_climate_bins bins = {n_hs, he, n_per, pe, SY_CLIMATE_TE, n_dir, dc, 0.0};
    int vid;
    if (lo == NULL || hi == NULL || c == NULL || he == NULL || pe == NULL || dc == NULL)
        rc = sy_error_set(r->err, SY_ENOMEM, "%s: %zu x %zu x %zu bins", r->path, n_hs, n_per,
                          n_dir);
    /* Hs. */
    if (rc == SY_OK)
        rc = read_axis(r, "hs", d_hs, d_bnd, n_hs, lo, hi, c, &vid);
    if (rc == SY_OK)
        rc = check_units(r, "hs", vid, syi_climate_units_metre, "m");
    if (rc == SY_OK)
        rc = edges_from_bounds(r, "hs", lo, hi, n_hs, he);
    /* Period, kind from its standard_name. */
    if (rc == SY_OK)
        rc = read_axis(r, "period", d_per, d_bnd, n_per, lo, hi, c, &vid);
    if (rc == SY_OK)
        rc = check_units(r, "period", vid, syi_climate_units_second, "s");
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, vid, "standard_name", &std, r->path, r->err);
    if (rc == SY_OK) {
        if (std != NULL && strcmp(std, SYI_CF_TE) == 0)
            bins.period = SY_CLIMATE_TE;
        else if (std != NULL && strcmp(std, SYI_CF_TP) == 0)
            bins.period = SY_CLIMATE_TP;
        else
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: variable 'period': standard_name '%s', expected "
                              "'" SYI_CF_TE "' (Te) or '" SYI_CF_TP "' (Tp)",
                              r->path, std != NULL ? std : "(missing)");
    }
    if (rc == SY_OK)
        rc = edges_from_bounds(r, "period", lo, hi, n_per, pe);
    /* Direction (optional): centres as stored, one common width. */
    if (rc == SY_OK && n_dir > 0) {
        rc = read_axis(r, "direction", d_dir, d_bnd, n_dir, lo, hi, dc, &vid);
        if (rc == SY_OK)
            rc = check_units(r, "direction", vid, syi_climate_units_degree, "degree");
        bins.dir_width = n_dir > 0 ? hi[0] - lo[0] : 0.0;
        for (size_t d = 0; rc == SY_OK && d < n_dir; d++)
            if (!same_edge(hi[d] - lo[d], bins.dir_width))
                rc = sy_error_set(r->err, SY_EINPUT,
                                  "%s: variable 'direction_bounds': bin %zu is %g degrees wide, "
                                  "expected the common width %g of bin 0",
                                  r->path, d, hi[d] - lo[d], bins.dir_width);
    }
    if (rc == SY_OK)
        rc = syi_climate_check_bins(&bins, r->path, r->err);
    /* Occurrence. */
    int v_occ;
    if (rc == SY_OK)
        rc = find_var(r, "occurrence", "occurrence(hs, period[, direction])", &v_occ);
    int dims[3] = {d_hs, d_per, d_dir};
    if (rc == SY_OK)
        rc = check_dims(r, "occurrence", v_occ, dims, n_dir > 0 ? 3 : 2);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, v_occ, "units", &occ_units, r->path, r->err);
    sy_climate_occurrence_kind kind = SY_CLIMATE_HOURS;
    double scale = 1.0;
    if (rc == SY_OK) {
        const char *u = occ_units != NULL ? occ_units : "(missing)";
        if (strcmp(u, "h year-1") == 0 || strcmp(u, "h yr-1") == 0 || strcmp(u, "h/year") == 0 ||
            strcmp(u, "hours per year") == 0)
            kind = SY_CLIMATE_HOURS;
        else if (strcmp(u, "1") == 0)
            kind = SY_CLIMATE_FRACTION;
        else if (strcmp(u, "percent") == 0 || strcmp(u, "%") == 0) {
            kind = SY_CLIMATE_FRACTION;
            scale = 0.01;
        } else
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: variable 'occurrence': unknown units attribute '%s', expected "
                              "'h year-1' (mean annual hours), '1' (fraction) or 'percent'",
                              r->path, u);
    }
    if (rc == SY_OK)
        rc = sy_climate_table_create(&t, &bins, kind, r->err);
    if (rc == SY_OK)
        rc = read_doubles(r, "occurrence", v_occ, t->occ);
    if (rc == SY_OK && scale != 1.0)
        for (size_t i = 0; i < t->n_values; i++)
            t->occ[i] *= scale;

    /* Metadata. */
    char *site = NULL, *source = NULL, *inst = NULL, *comment = NULL, *inv = NULL;
    sy_climate_meta m = {NULL, NULL, NULL, NULL, NAN, NAN, 0};
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "site_name", &site, r->path, r->err);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "source", &source, r->path, r->err);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "institution", &inst, r->path, r->err);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "comment", &comment, r->path, r->err);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "invented_data", &inv, r->path, r->err);
    if (rc == SY_OK) {
        m.site = site;
        m.source = source;
        m.institution = inst;
        m.comment = comment;
        m.invented = inv != NULL && strcmp(inv, "yes") == 0;
        m.comment = syi_climate_strip_invented(comment);
        double y;
        int st = nc_get_att_double(r->ncid, NC_GLOBAL, "record_length_years", &y);
        if (st == NC_NOERR)
            m.record_years = y;
        else if (st != NC_ENOTATT)
            rc = nc_fail(r, "global", "attribute record_length_years", st);
    }
    int v_depth;
    if (rc == SY_OK && nc_inq_varid(r->ncid, "depth", &v_depth) == NC_NOERR) {
        rc = check_dims(r, "depth", v_depth, NULL, 0);
        if (rc == SY_OK)
            rc = check_units(r, "depth", v_depth, syi_climate_units_metre, "m");
        if (rc == SY_OK)
            rc = read_doubles(r, "depth", v_depth, &m.depth);
    }
    if (rc == SY_OK)
        rc = sy_climate_table_set_meta(t, &m, r->err);
    if (rc == SY_OK)
        rc = sy_climate_table_validate(t, r->path, r->err);
    free(site);
    free(source);
    free(inst);
    free(comment);
    free(inv);
    free(std);
    free(occ_units);
    free(lo);
    free(hi);
    free(c);
    free(he);
    free(pe);
    free(dc);
    if (rc != SY_OK) {
        sy_climate_table_free(t);
        return rc;
    }
    *out = t;
    return SY_OK;
}

int sy_climate_table_read(sy_climate_table **out, const char *path, sy_error *err)
{
    if (out == NULL || path == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table read: NULL argument");
    *out = NULL;
    reader r = {-1, path, err};
    int rc0 = syi_check_input_file(path, SIZE_MAX, err); /* missing, a directory, ... */
    if (rc0 != SY_OK)
        return rc0;
    int rc = syi_nc_open(path, &r.ncid, err);
    if (rc != SY_OK)
        return rc;
    rc = read_contents(&r, out);
    nc_close(r.ncid);
    return rc;
}
