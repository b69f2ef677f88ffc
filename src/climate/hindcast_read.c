/* Hindcast time series from a CF NetCDF file: variables found by standard_name
 * (references.md 6.1), CF time decoded (cftime.c), packed values unpacked as
 * value = packed x scale_factor + add_offset, with _FillValue (or the NetCDF default fill
 * of the type), missing_value, valid_min/valid_max/valid_range compared in packed form
 * (CF 1.12 section 8.1, references.md 6.2); such records and NaNs become NAN. */
#include "climate_impl.h"
#include "core/core_impl.h"

#include <math.h>
#include <netcdf.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#define MAX_MISSING_VALUES 8

typedef struct {
    int ncid;
    const char *path;
    sy_error *err;
    int nvars;
} reader;

static int nc_fail(reader *r, const char *var, const char *what, int st)
{
    return sy_error_set(r->err, SY_EIO, "%s: variable '%s': %s: %s", r->path, var, what,
                        nc_strerror(st));
}

/* The one variable whose standard_name is `name` (-1 if none). */
static int find_standard(reader *r, const char *name, int *varid)
{
    *varid = -1;
    for (int v = 0; v < r->nvars; v++) {
        char *sn = NULL;
        int rc = syi_climate_nc_text_att(r->ncid, v, "standard_name", &sn, r->path, r->err);
        if (rc != SY_OK)
            return rc;
        int match = sn != NULL && strcmp(sn, name) == 0;
        free(sn);
        if (!match)
            continue;
        if (*varid >= 0) {
            char a[NC_MAX_NAME + 1] = "?", b[NC_MAX_NAME + 1] = "?";
            nc_inq_varname(r->ncid, *varid, a);
            nc_inq_varname(r->ncid, v, b);
            return sy_error_set(r->err, SY_EINPUT,
                                "%s: variables '%s' and '%s' both have standard_name '%s', "
                                "expected one", r->path, a, b, name);
        }
        *varid = v;
    }
    return SY_OK;
}

/* The record dimension of variable v: the one dimension longer than 1 (or its only
 * dimension); every other dimension must have length 1. */
static int record_dim(reader *r, int v, const char *name, int *dim, size_t *n)
{
    int nd, dims[NC_MAX_VAR_DIMS];
    int st = nc_inq_varndims(r->ncid, v, &nd);
    if (st == NC_NOERR)
        st = nc_inq_vardimid(r->ncid, v, dims);
    if (st != NC_NOERR)
        return nc_fail(r, name, "dimensions", st);
    if (nd < 1)
        return sy_error_set(r->err, SY_EINPUT, "%s: variable '%s' is a scalar, expected a time "
                            "series", r->path, name);
    *dim = -1;
    *n = 0;
    for (int i = 0; i < nd; i++) {
        size_t len;
        if ((st = nc_inq_dimlen(r->ncid, dims[i], &len)) != NC_NOERR)
            return nc_fail(r, name, "dimension length", st);
        if (len > 1 && *dim >= 0)
            return sy_error_set(r->err, SY_EINPUT,
                                "%s: variable '%s' has two dimensions longer than 1 (%zu and "
                                "%zu), expected a single time series (one point)",
                                r->path, name, *n, len);
        if (len > 1 || (nd == 1)) {
            *dim = dims[i];
            *n = len;
        }
    }
    if (*dim < 0) {   /* all dimensions of length 1: a single record */
        *dim = dims[0];
        *n = 1;
    }
    return SY_OK;
}

static double default_fill(nc_type type)
{
    switch (type) {
    case NC_BYTE: return NC_FILL_BYTE;
    case NC_UBYTE: return NC_FILL_UBYTE;
    case NC_SHORT: return NC_FILL_SHORT;
    case NC_USHORT: return NC_FILL_USHORT;
    case NC_INT: return NC_FILL_INT;
    case NC_UINT: return NC_FILL_UINT;
    case NC_FLOAT: return NC_FILL_FLOAT;
    case NC_DOUBLE: return NC_FILL_DOUBLE;
    default: return NAN;
    }
}

/* Optional numeric attribute (first `max` values); *count = 0 when absent. */
static int num_att(reader *r, int v, const char *var, const char *att, double *vals, size_t max,
                   size_t *count)
{
    size_t len;
    nc_type type;
    *count = 0;
    int st = nc_inq_att(r->ncid, v, att, &type, &len);
    if (st == NC_ENOTATT)
        return SY_OK;
    if (st != NC_NOERR)
        return nc_fail(r, var, att, st);
    if (type == NC_CHAR || type == NC_STRING || len == 0 || len > max)
        return sy_error_set(r->err, SY_EINPUT,
                            "%s: variable '%s': attribute '%s' has %zu values of type %d, "
                            "expected 1..%zu numbers", r->path, var, att, len, (int)type, max);
    if ((st = nc_get_att_double(r->ncid, v, att, vals)) != NC_NOERR)
        return nc_fail(r, var, att, st);
    *count = len;
    return SY_OK;
}

/* Read variable v (n records) unpacked, NAN where missing; check its units with ok(). */
static int read_var(reader *r, int v, int dim, size_t n, int (*ok)(const char *),
                    const char *expect_units, double *out)
{
    char name[NC_MAX_NAME + 1];
    int st = nc_inq_varname(r->ncid, v, name);
    if (st != NC_NOERR)
        return nc_fail(r, "?", "name", st);
    int vdim;
    size_t vn;
    int rc = record_dim(r, v, name, &vdim, &vn);
    if (rc != SY_OK)
        return rc;
    if (vdim != dim || vn != n)
        return sy_error_set(r->err, SY_EINPUT,
                            "%s: variable '%s' has %zu records on another dimension, expected "
                            "%zu on the time dimension", r->path, name, vn, n);
    char *u = NULL;
    rc = syi_climate_nc_text_att(r->ncid, v, "units", &u, r->path, r->err);
    if (rc == SY_OK && (u == NULL || !ok(u)))
        rc = sy_error_set(r->err, SY_EINPUT,
                          "%s: variable '%s': %s units attribute '%s', expected '%s'",
                          r->path, name, u == NULL ? "missing" : "unknown",
                          u == NULL ? "" : u, expect_units);
    free(u);
    if (rc != SY_OK)
        return rc;
    nc_type type;
    if ((st = nc_inq_vartype(r->ncid, v, &type)) != NC_NOERR)
        return nc_fail(r, name, "type", st);
    double scale = 1.0, offset = 0.0, fill = default_fill(type);
    double miss[MAX_MISSING_VALUES], vr[2];
    size_t n_scale, n_offset, n_fill, n_miss, n_vmin, n_vmax, n_vr;
    double vmin = -INFINITY, vmax = INFINITY;
    rc = num_att(r, v, name, "scale_factor", &scale, 1, &n_scale);
    if (rc == SY_OK)
        rc = num_att(r, v, name, "add_offset", &offset, 1, &n_offset);
    if (rc == SY_OK)
        rc = num_att(r, v, name, "_FillValue", &fill, 1, &n_fill);
    if (rc == SY_OK)
        rc = num_att(r, v, name, "missing_value", miss, MAX_MISSING_VALUES, &n_miss);
    if (rc == SY_OK)
        rc = num_att(r, v, name, "valid_min", &vmin, 1, &n_vmin);
    if (rc == SY_OK)
        rc = num_att(r, v, name, "valid_max", &vmax, 1, &n_vmax);
    if (rc == SY_OK)
        rc = num_att(r, v, name, "valid_range", vr, 2, &n_vr);
    if (rc != SY_OK)
        return rc;
    if (n_vr == 2) {
        vmin = vr[0];
        vmax = vr[1];
    }
    if ((st = nc_get_var_double(r->ncid, v, out)) != NC_NOERR)
        return nc_fail(r, name, "read", st);
    for (size_t i = 0; i < n; i++) {
        double p = out[i];
        int missing = isnan(p) || p == fill || p < vmin || p > vmax;
        for (size_t k = 0; !missing && k < n_miss; k++)
            missing = p == miss[k];
        out[i] = missing ? NAN : p * scale + offset;
    }
    return SY_OK;
}

/* Copy a name into a fixed buffer. */
static void set_name(char *dst, size_t size, const char *src)
{
    snprintf(dst, size, "%.*s", (int)size - 1, src);
}

static int read_series(reader *r, sy_climate_series *s, sy_climate_period_kind want, int want_dir)
{
    int st = nc_inq_nvars(r->ncid, &r->nvars);
    if (st != NC_NOERR)
        return nc_fail(r, "(file)", "variables", st);
    int v_hs, v_per = -1, v_dir = -1, v_time = -1, from_fp = 0;
    int rc = find_standard(r, SYI_CF_HS, &v_hs);
    if (rc == SY_OK && v_hs < 0)
        rc = sy_error_set(r->err, SY_EINPUT,
                          "%s: no variable with standard_name '" SYI_CF_HS "' (Hs)", r->path);
    if (rc == SY_OK && want == SY_CLIMATE_TE) {
        rc = find_standard(r, SYI_CF_TE, &v_per);
        if (rc == SY_OK && v_per < 0)
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: no variable with standard_name '" SYI_CF_TE "' (Te)", r->path);
    } else if (rc == SY_OK) {
        rc = find_standard(r, SYI_CF_TP, &v_per);
        if (rc == SY_OK && v_per < 0) {
            rc = find_standard(r, SYI_CF_FP, &v_per);
            from_fp = 1;
        }
        if (rc == SY_OK && v_per < 0)
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: no variable with standard_name '" SYI_CF_TP "' (Tp) or '"
                              SYI_CF_FP "' (fp)", r->path);
    }
    if (rc == SY_OK && want_dir) {
        rc = find_standard(r, SYI_CF_DIR, &v_dir);
        if (rc == SY_OK && v_dir < 0)
            rc = find_standard(r, SYI_CF_DIR_PEAK, &v_dir);
        if (rc == SY_OK && v_dir < 0)
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: no variable with standard_name '" SYI_CF_DIR "' (or its "
                              "_at_variance_spectral_density_maximum form), expected one for "
                              "direction bins", r->path);
    }
    if (rc != SY_OK)
        return rc;
    char hs_name[NC_MAX_NAME + 1];
    nc_inq_varname(r->ncid, v_hs, hs_name);
    int dim;
    size_t n;
    rc = record_dim(r, v_hs, hs_name, &dim, &n);
    if (rc == SY_OK && n > SY_CLIMATE_MAX_RECORDS)
        rc = sy_error_set(r->err, SY_ELIMIT,
                          "%s: variable '%s' has %zu records, above the limit of %zu "
                          "(SY_CLIMATE_MAX_RECORDS in include/swellyield/climate.h: raise it "
                          "and rebuild if you mean it)", r->path, hs_name, n,
                          SY_CLIMATE_MAX_RECORDS);
    if (rc != SY_OK)
        return rc;
    /* Time: standard_name "time" or axis "T", 1-D over the record dimension. */
    for (int v = 0; rc == SY_OK && v < r->nvars && v_time < 0; v++) {
        char *sn = NULL, *axis = NULL;
        rc = syi_climate_nc_text_att(r->ncid, v, "standard_name", &sn, r->path, r->err);
        if (rc == SY_OK)
            rc = syi_climate_nc_text_att(r->ncid, v, "axis", &axis, r->path, r->err);
        int nd = 0, d = -1;
        if (rc == SY_OK && ((sn != NULL && strcmp(sn, "time") == 0) ||
                            (axis != NULL && strcmp(axis, "T") == 0)) &&
            nc_inq_varndims(r->ncid, v, &nd) == NC_NOERR && nd == 1 &&
            nc_inq_vardimid(r->ncid, v, &d) == NC_NOERR && d == dim)
            v_time = v;
        free(sn);
        free(axis);
    }
    if (rc == SY_OK && v_time < 0) {
        char dname[NC_MAX_NAME + 1] = "?";
        nc_inq_dimname(r->ncid, dim, dname);
        rc = sy_error_set(r->err, SY_EINPUT,
                          "%s: no time variable (standard_name 'time' or axis 'T') over "
                          "dimension '%s' of '%s'", r->path, dname, hs_name);
    }
    if (rc != SY_OK)
        return rc;
    if (n < 1)
        return sy_error_set(r->err, SY_EINPUT, "%s: variable '%s' has no records", r->path,
                            hs_name);
    s->n = n;
    s->time = malloc(n * sizeof *s->time);
    s->hs = malloc(n * sizeof *s->hs);
    s->period = malloc(n * sizeof *s->period);
    s->dir_from = want_dir ? malloc(n * sizeof *s->dir_from) : NULL;
    double *raw = malloc(n * sizeof *raw);
    if (s->time == NULL || s->hs == NULL || s->period == NULL || raw == NULL ||
        (want_dir && s->dir_from == NULL)) {
        free(raw);
        return sy_error_set(r->err, SY_ENOMEM, "%s: %zu records", r->path, n);
    }
    set_name(s->hs_var, sizeof s->hs_var, hs_name);
    char name[NC_MAX_NAME + 1];
    nc_inq_varname(r->ncid, v_per, name);
    set_name(s->period_var, sizeof s->period_var, name);
    if (want_dir) {
        nc_inq_varname(r->ncid, v_dir, name);
        set_name(s->dir_var, sizeof s->dir_var, name);
    }
    nc_inq_varname(r->ncid, v_time, name);
    set_name(s->time_var, sizeof s->time_var, name);

    rc = read_var(r, v_hs, dim, n, syi_climate_units_metre, "m", s->hs);
    if (rc == SY_OK)
        rc = read_var(r, v_per, dim, n, from_fp ? syi_climate_units_hertz : syi_climate_units_second,
                      from_fp ? "s-1" : "s", s->period);
    if (rc == SY_OK && from_fp)
        for (size_t i = 0; i < n; i++)
            s->period[i] = s->period[i] > 0.0 ? 1.0 / s->period[i] : NAN;
    if (rc == SY_OK && want_dir)
        rc = read_var(r, v_dir, dim, n, syi_climate_units_degree, "degree", s->dir_from);
    s->period_kind = want;

    /* Time. */
    char *units = NULL, *cal = NULL;
    if (rc == SY_OK && (st = nc_get_var_double(r->ncid, v_time, raw)) != NC_NOERR)
        rc = nc_fail(r, s->time_var, "read", st);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, v_time, "units", &units, r->path, r->err);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, v_time, "calendar", &cal, r->path, r->err);
    if (rc == SY_OK) {
        rc = sy_climate_cf_time_decode(units, cal, raw, n, s->time, r->err);
        if (rc != SY_OK)
            sy_error_prefix(r->err, "%s: variable '%s'", r->path, s->time_var);
    }
    for (size_t i = 1; rc == SY_OK && i < n; i++)
        if (!(s->time[i] > s->time[i - 1]))
            rc = sy_error_set(r->err, SY_EINPUT,
                              "%s: variable '%s': record %zu (%g) not after record %zu (%g), "
                              "expected strictly increasing times",
                              r->path, s->time_var, i, raw[i], i - 1, raw[i - 1]);
    free(units);
    free(cal);
    free(raw);
    if (rc != SY_OK)
        return rc;
    for (size_t i = 0; i < n; i++)
        s->n_missing += isnan(s->hs[i]) || isnan(s->period[i]) ||
                        (want_dir && isnan(s->dir_from[i]));

    /* Optional depth and descriptive attributes. */
    int v_depth;
    rc = find_standard(r, SYI_CF_DEPTH, &v_depth);
    if (rc == SY_OK && v_depth < 0)
        rc = find_standard(r, SYI_CF_DEPTH_SURFACE, &v_depth);
    size_t len = 1;
    int nd = 0, dd[NC_MAX_VAR_DIMS];
    if (rc == SY_OK && v_depth >= 0 && nc_inq_varndims(r->ncid, v_depth, &nd) == NC_NOERR &&
        nd <= NC_MAX_VAR_DIMS && nc_inq_vardimid(r->ncid, v_depth, dd) == NC_NOERR) {
        for (int i = 0; i < nd; i++) {
            size_t l = 0;
            nc_inq_dimlen(r->ncid, dd[i], &l);
            len *= l;
        }
        char *u = NULL;
        if (len == 1)
            rc = syi_climate_nc_text_att(r->ncid, v_depth, "units", &u, r->path, r->err);
        double depth;
        if (rc == SY_OK && len == 1 && syi_climate_units_metre(u) &&
            nc_get_var_double(r->ncid, v_depth, &depth) == NC_NOERR && depth > 0.0)
            s->depth = depth;   /* optional: anything unusable leaves NAN */
        free(u);
    }
    char *site = NULL, *inv = NULL;
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "site_name", &site, r->path, r->err);
    if (rc == SY_OK)
        rc = syi_climate_nc_text_att(r->ncid, NC_GLOBAL, "invented_data", &inv, r->path, r->err);
    if (rc == SY_OK) {
        set_name(s->site, sizeof s->site, site != NULL ? site : "");
        s->invented = inv != NULL && strcmp(inv, "yes") == 0;
    }
    free(site);
    free(inv);
    return rc;
}

void sy_climate_series_free(sy_climate_series *s)
{
    if (s == NULL)
        return;
    free(s->time);
    free(s->hs);
    free(s->period);
    free(s->dir_from);
    free(s);
}

int sy_climate_series_read(sy_climate_series **out, const char *path,
                           sy_climate_period_kind period, int want_direction, sy_error *err)
{
    if (out == NULL || path == NULL)
        return sy_error_set(err, SY_EINVAL, "hindcast read: NULL argument");
    if (period != SY_CLIMATE_TE && period != SY_CLIMATE_TP)
        return sy_error_set(err, SY_EINVAL, "hindcast read: period kind %d, expected Te or Tp",
                            (int)period);
    *out = NULL;
    int rc0 = syi_check_input_file(path, SIZE_MAX, err); /* missing, a directory, ... */
    if (rc0 != SY_OK)
        return rc0;
    sy_climate_series *s = calloc(1, sizeof *s);
    if (s == NULL)
        return sy_error_set(err, SY_ENOMEM, "%s: series", path);
    s->depth = NAN;
    set_name(s->file, sizeof s->file, path);
    reader r = {-1, path, err, 0};
    int rc = syi_nc_open(path, &r.ncid, err);
    if (rc != SY_OK) {
        free(s);
        return rc;
    }
    rc = read_series(&r, s, period, want_direction != 0);
    nc_close(r.ncid);
    if (rc != SY_OK) {
        sy_climate_series_free(s);
        return rc;
    }
    *out = s;
    return SY_OK;
}
