/* Scatter tables as NetCDF files: write/read round trip (identical bins, values and
 * metadata), the Python-written demo files read by the C reader, CSV import against the
 * NetCDF copy of the same invented table, every malformed-file case with its message
 * (files made here, in a temporary directory, by editing a good file with the NetCDF C
 * API), and the atomic writer leaving no temporary file behind on failure.
 * With arguments `--write DIR` it only writes dir_hours.nc and omni_fraction.nc into DIR
 * for tests/climate/test_cf_interop.py. */
#define _XOPEN_SOURCE 700
#include "check.h"
#include "swellyield/climate.h"

#include <dirent.h>
#include <math.h>
#include <netcdf.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

static const double HS_E[] = {0.25, 0.75, 1.25, 1.75};
static const double TE_E[] = {4.5, 5.5, 6.5, 7.5, 8.5};
static const double DIRS[] = {0, 90, 180, 270};

/* A 3 x 4 (x 4 directions) table with distinct values, invented metadata. */
static sy_climate_table *sample(int directional, sy_climate_occurrence_kind kind)
{
    sy_climate_bins b = {3, HS_E, 4, TE_E, directional ? SY_CLIMATE_TE : SY_CLIMATE_TP,
                         directional ? 4 : 0, DIRS, 90.0};
    sy_climate_table *t = NULL;
    if (sy_climate_table_create(&t, &b, kind, NULL) != SY_OK)
        return NULL;
    double *o = sy_climate_table_occurrence_mut(t);
    size_t n = sy_climate_table_size(t);
    for (size_t i = 0; i < n; i++)   /* irrational-ish values exercise every bit */
        o[i] = (kind == SY_CLIMATE_HOURS ? 100.0 : 1.0 / n) * (0.5 + 0.25 * sin(1.0 + i));
    sy_climate_meta m = {"Round Trip Bay", "made by test_netcdf.c", "swellyield tests",
                         "a comment, with 'quotes'", 12.5, directional ? 47.5 : NAN, 1};
    sy_climate_table_set_meta(t, &m, NULL);
    return t;
}

static void compare(const sy_climate_table *a, const sy_climate_table *b, const char *what)
{
    const sy_climate_bins *x = sy_climate_table_bins(a), *y = sy_climate_table_bins(b);
    int same = x->n_hs == y->n_hs && x->n_period == y->n_period && x->n_dir == y->n_dir &&
               x->period == y->period && x->dir_width == y->dir_width &&
               memcmp(x->hs_edges, y->hs_edges, (x->n_hs + 1) * sizeof(double)) == 0 &&
               memcmp(x->period_edges, y->period_edges, (x->n_period + 1) * sizeof(double)) == 0 &&
               (x->n_dir == 0 || memcmp(x->dir_centres, y->dir_centres, x->n_dir * sizeof(double)) == 0);
    sy_check_true(same, "%s: identical bins", what);
    sy_check_true(sy_climate_table_occurrence_kind(a) == sy_climate_table_occurrence_kind(b),
                  "%s: same occurrence kind", what);
    sy_check_true(sy_climate_table_size(a) == sy_climate_table_size(b) &&
                      memcmp(sy_climate_table_occurrence(a), sy_climate_table_occurrence(b),
                             sy_climate_table_size(a) * sizeof(double)) == 0,
                  "%s: bit-identical occurrence", what);
    const sy_climate_meta *p = sy_climate_table_meta(a), *q = sy_climate_table_meta(b);
    sy_check_true(strcmp(p->site, q->site) == 0 && strcmp(p->source, q->source) == 0 &&
                      strcmp(p->institution, q->institution) == 0 &&
                      strcmp(p->comment, q->comment) == 0 && p->invented == q->invented,
                  "%s: same text metadata ('%s' vs '%s')", what, p->comment, q->comment);
    sy_check_true((p->depth == q->depth || (isnan(p->depth) && isnan(q->depth))) &&
                      (p->record_years == q->record_years ||
                       (isnan(p->record_years) && isnan(q->record_years))),
                  "%s: same depth and record length", what);
}

static char dir_[256];

static const char *in_dir(const char *name)
{
    static char buf[4][512];
    static int k;
    k = (k + 1) % 4;
    snprintf(buf[k], sizeof buf[k], "%s/%s", dir_, name);
    return buf[k];
}

/* Number of directory entries whose name contains `part`. */
static int count_entries(const char *dir, const char *part)
{
    DIR *d = opendir(dir);
    int n = 0;
    struct dirent *e;
    while (d != NULL && (e = readdir(d)) != NULL)
        n += strstr(e->d_name, part) != NULL;
    if (d != NULL)
        closedir(d);
    return n;
}

/* ---- malformed files: edits of a good file ---- */

static int rename_var(int nc, const char *from, const char *to)
{
    int v, st = nc_inq_varid(nc, from, &v);
    return st ? st : nc_rename_var(nc, v, to);
}
static int set_units(int nc, const char *var, const char *u)
{
    int v, st = nc_inq_varid(nc, var, &v);
    return st ? st : nc_put_att_text(nc, v, "units", strlen(u), u);
}
static int del_att(int nc, const char *var, const char *att)
{
    int v, st = nc_inq_varid(nc, var, &v);
    return st ? st : nc_del_att(nc, v, att);
}
static int put_value(int nc, const char *var, size_t i, size_t j, double x)
{
    int v, st = nc_inq_varid(nc, var, &v);
    size_t start[3] = {i, j, 0};
    return st ? st : nc_put_var1_double(nc, v, start, &x);
}

static int e_no_hs_bounds(int nc) { return rename_var(nc, "hs_bounds", "hs_edges_x"); }
static int e_no_occ(int nc) { return rename_var(nc, "occurrence", "occ"); }
static int e_occ_units(int nc) { return set_units(nc, "occurrence", "days"); }
static int e_hs_units(int nc) { return set_units(nc, "hs", "ft"); }
static int e_no_units(int nc) { return del_att(nc, "period", "units"); }
static int e_negative(int nc) { return put_value(nc, "occurrence", 1, 2, -5.0); }
static int e_nan(int nc) { return put_value(nc, "occurrence", 2, 3, NAN); }
static int e_zero(int nc)
{
    int st = 0;
    for (size_t i = 0; i < 3 && !st; i++)
        for (size_t j = 0; j < 4 && !st; j++)
            st = put_value(nc, "occurrence", i, j, 0.0);
    return st;
}
static int e_unsorted(int nc)
{
    /* swap Hs bins 1 and 2 (centres and bounds together) */
    int st = put_value(nc, "hs_bounds", 1, 0, 1.25);
    if (!st) st = put_value(nc, "hs_bounds", 1, 1, 1.75);
    if (!st) st = put_value(nc, "hs_bounds", 2, 0, 0.75);
    if (!st) st = put_value(nc, "hs_bounds", 2, 1, 1.25);
    int v;
    double c[3] = {0.5, 1.5, 1.0};
    if (!st) st = nc_inq_varid(nc, "hs", &v);
    return st ? st : nc_put_var_double(nc, v, c);
}
static int e_overlap(int nc) { return put_value(nc, "period_bounds", 1, 0, 5.25); }
static int e_gap(int nc) { return put_value(nc, "period_bounds", 1, 0, 5.75); }
static int e_centre(int nc) { return put_value(nc, "hs", 0, 0, 5.0); }
static int e_no_bounds_att(int nc) { return del_att(nc, "hs", "bounds"); }
static int e_no_std(int nc) { return del_att(nc, "period", "standard_name"); }
static int e_swap_dims(int nc)
{
    int st = nc_redef(nc), dh = -1, dp = -1, v;
    if (!st) st = rename_var(nc, "occurrence", "occurrence_old");
    if (!st) st = nc_inq_dimid(nc, "hs", &dh);
    if (!st) st = nc_inq_dimid(nc, "period", &dp);
    int dims[2] = {dp, dh};
    if (!st) st = nc_def_var(nc, "occurrence", NC_DOUBLE, 2, dims, &v);
    if (!st) st = nc_put_att_text(nc, v, "units", 8, "h year-1");
    return st;
}
static int e_bounds_three(int nc)
{
    int st = nc_redef(nc), dh = -1, d3 = -1, v;
    if (!st) st = rename_var(nc, "hs_bounds", "hs_bounds_old");
    if (!st) st = nc_inq_dimid(nc, "hs", &dh);
    if (!st) st = nc_def_dim(nc, "three", 3, &d3);
    int dims[2] = {dh, d3};
    if (!st) st = nc_def_var(nc, "hs_bounds", NC_DOUBLE, 2, dims, &v);
    return st;
}
/* Marker: this case is made from scratch (an unlimited hs dimension with no records). */
static int e_empty(int nc)
{
    (void)nc;
    return NC_NOERR;
}

static int make_empty(const char *path)
{
    int nc, d, st = nc_create(path, NC_NETCDF4 | NC_CLOBBER, &nc);
    if (st)
        return st;
    st = nc_def_dim(nc, "hs", NC_UNLIMITED, &d);
    if (!st) st = nc_def_dim(nc, "period", 4, &d);
    if (!st) st = nc_def_dim(nc, "bound", 2, &d);
    int st2 = nc_close(nc);
    return st ? st : st2;
}
static int e_no_period_dim(int nc)
{
    int st = nc_redef(nc), d;
    if (!st) st = nc_inq_dimid(nc, "period", &d);
    return st ? st : nc_rename_dim(nc, d, "per");
}
static int e_dir_width(int nc) { return put_value(nc, "direction_bounds", 2, 1, 235.0); }
static int e_dir_units(int nc) { return set_units(nc, "direction", "radian"); }

int main(int argc, char **argv)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    if (argc == 3 && strcmp(argv[1], "--write") == 0) {
        sy_climate_table *a = sample(1, SY_CLIMATE_HOURS), *b = sample(0, SY_CLIMATE_FRACTION);
        snprintf(dir_, sizeof dir_, "%s", argv[2]);
        int rc = sy_climate_table_write(a, in_dir("dir_hours.nc"), "test --write", &err);
        if (rc == SY_OK)
            rc = sy_climate_table_write(b, in_dir("omni_fraction.nc"), NULL, &err);
        if (rc != SY_OK)
            fprintf(stderr, "%s\n", err.msg);
        sy_climate_table_free(a);
        sy_climate_table_free(b);
        return rc == SY_OK ? 0 : 1;
    }
    snprintf(dir_, sizeof dir_, "/tmp/sy_climate_nc_XXXXXX");
    if (mkdtemp(dir_) == NULL) {
        sy_check_true(0, "temporary directory");
        return sy_check_summary();
    }

    /* Round trips: directional hours, omnidirectional fractions with Tp. */
    for (int k = 0; k < 2; k++) {
        sy_climate_table *a = sample(k == 0, k == 0 ? SY_CLIMATE_HOURS : SY_CLIMATE_FRACTION), *b = NULL;
        const char *p = in_dir(k == 0 ? "rt_dir.nc" : "rt_omni.nc");
        sy_check_ok(sy_climate_table_write(a, p, "round trip", &err), &err, "write %s", p);
        sy_check_ok(sy_climate_table_read(&b, p, &err), &err, "read %s", p);
        if (a != NULL && b != NULL)
            compare(a, b, k == 0 ? "directional hours round trip" : "omni fraction round trip");
        sy_climate_table_free(a);
        sy_climate_table_free(b);
    }
    sy_check_true(count_entries(dir_, ".tmp-") == 0, "no temporary file after successful writes");

    /* Demo files written by seastates/make_demo_sites.py (Python netCDF4). */
    const char *src = getenv("SY_SOURCE_DIR");
    char path[1024];
    sy_climate_table *shelf = NULL, *sheltered = NULL, *csv = NULL;
    snprintf(path, sizeof path, "%s/seastates/shelf_site.nc", src ? src : "../..");
    sy_check_ok(sy_climate_table_read(&shelf, path, &err), &err, "read demo %s", path);
    snprintf(path, sizeof path, "%s/seastates/sheltered_site.nc", src ? src : "../..");
    sy_check_ok(sy_climate_table_load(&sheltered, path, &err), &err, "load demo %s (NetCDF)", path);
    snprintf(path, sizeof path, "%s/seastates/shelf_site.csv", src ? src : "../..");
    sy_check_ok(sy_climate_table_load(&csv, path, &err), &err, "load demo %s (CSV by name)", path);
    if (shelf != NULL && sheltered != NULL && csv != NULL) {
        const sy_climate_bins *b = sy_climate_table_bins(shelf);
        sy_check_true(b->n_hs == 16 && b->n_period == 14 && b->n_dir == 12 &&
                          b->dir_width == 30.0 && b->period == SY_CLIMATE_TE,
                      "shelf: 16 x 14 x 12 bins of Te");
        const sy_climate_meta *m = sy_climate_table_meta(shelf);
        sy_check_true(m->invented && m->depth == 50.0 && strcmp(m->site, "Invented Shelf") == 0,
                      "shelf: invented, 50 m, named");
        sy_check_true(sy_climate_table_occurrence_kind(sheltered) == SY_CLIMATE_FRACTION &&
                          sy_climate_table_meta(sheltered)->depth == 25.0,
                      "sheltered: fractions, 25 m");
        /* CSV copy: every bin of the CSV table equals the NetCDF bin with the same
         * limits; totals equal (zero bins are omitted from the CSV). */
        const sy_climate_bins *c = sy_climate_table_bins(csv);
        size_t mismatched = 0, missing = 0;
        double tot_c = 0.0, tot_n = 0.0;
        for (size_t i = 0; i < c->n_hs; i++)
            for (size_t j = 0; j < c->n_period; j++)
                for (size_t d = 0; d < c->n_dir; d++) {
                    size_t ii = 0, jj = 0, dd = 0;
                    while (ii < b->n_hs && b->hs_edges[ii] != c->hs_edges[i]) ii++;
                    while (jj < b->n_period && b->period_edges[jj] != c->period_edges[j]) jj++;
                    while (dd < b->n_dir && b->dir_centres[dd] != c->dir_centres[d]) dd++;
                    if (ii == b->n_hs || jj == b->n_period || dd == b->n_dir) {
                        missing++;
                        continue;
                    }
                    double vc = sy_climate_table_occurrence(csv)[sy_climate_table_index(csv, i, j, d)];
                    double vn = sy_climate_table_occurrence(shelf)[sy_climate_table_index(shelf, ii, jj, dd)];
                    mismatched += vc != vn;
                    tot_c += vc;
                }
        for (size_t i = 0; i < sy_climate_table_size(shelf); i++)
            tot_n += sy_climate_table_occurrence(shelf)[i];
        sy_check_true(missing == 0 && mismatched == 0, "CSV bins equal NetCDF bins (%zu missing, "
                      "%zu different)", missing, mismatched);
        /* Summed in different orders: a few ulps of ~8400 h. */
        sy_check_close(tot_c, tot_n, 1e-12, 0.0, "CSV total equals NetCDF total");
        sy_check_true(strcmp(sy_climate_table_meta(csv)->comment,
                             sy_climate_table_meta(shelf)->comment) == 0 &&
                          strncmp(sy_climate_table_meta(csv)->comment, "Moderately", 10) == 0,
                      "CSV and NetCDF comments equal, without the invented-data sentence");
        sy_check_true(strcmp(sy_climate_table_meta(csv)->site, "Invented Shelf") == 0 &&
                          sy_climate_table_meta(csv)->invented &&
                          sy_climate_table_meta(csv)->depth == 50.0,
                      "CSV metadata");
    }
    /* The convert path: CSV -> NetCDF -> read back, identical. */
    if (csv != NULL) {
        sy_climate_table *back = NULL;
        const char *conv = in_dir("converted.nc");
        sy_check_ok(sy_climate_table_write(csv, conv, "converted from CSV", &err), &err,
                    "write converted CSV");
        sy_check_ok(sy_climate_table_read(&back, conv, &err), &err, "read converted CSV");
        if (back != NULL)
            compare(csv, back, "CSV -> NetCDF conversion");
        sy_climate_table_free(back);
        remove(conv);
    }
    sy_climate_table_free(shelf);
    sy_climate_table_free(sheltered);
    sy_climate_table_free(csv);

    /* Malformed files: each case edits a fresh good file. */
    static const struct { int (*edit)(int); int dir; int code; const char *expect; } bad[] = {
        {e_no_hs_bounds, 0, SY_EINPUT, "variable 'hs_bounds' missing, expected the bounds variable"},
        {e_no_occ, 0, SY_EINPUT, "variable 'occurrence' missing, expected occurrence(hs, period[, direction]) (NetCDF: Variable not found)"},
        {e_occ_units, 0, SY_EINPUT, "variable 'occurrence': unknown units attribute 'days', expected 'h year-1'"},
        {e_hs_units, 0, SY_EINPUT, "variable 'hs': unknown units attribute 'ft', expected 'm'"},
        {e_no_units, 0, SY_EINPUT, "variable 'period': units attribute missing, expected 's'"},
        {e_negative, 0, SY_EINPUT, "variable 'occurrence': value -5 at [hs 1, period 2, direction 0], expected a finite value >= 0"},
        {e_nan, 0, SY_EINPUT, "variable 'occurrence': value nan at [hs 2, period 3, direction 0]"},
        {e_zero, 0, SY_EINPUT, "variable 'occurrence': total occurrence is 0 over 12 bins, expected > 0"},
        {e_unsorted, 0, SY_EINPUT, "variable 'hs_bounds': bins unsorted or overlapping: bin 2 starts at 0.75, not after bin 1 at 1.25"},
        {e_overlap, 0, SY_EINPUT, "variable 'period_bounds': bins unsorted or overlapping: bin 0 ends at 5.5 after bin 1 starts at 5.25"},
        {e_gap, 0, SY_EINPUT, "variable 'period_bounds': gap between bin 0 (upper 5.5) and bin 1 (lower 5.75)"},
        {e_centre, 0, SY_EINPUT, "variable 'hs': bin 0 centre 5 outside its bounds [0.25, 0.75]"},
        {e_no_bounds_att, 0, SY_EINPUT, "variable 'hs': bounds attribute missing"},
        {e_no_std, 0, SY_EINPUT, "variable 'period': standard_name '(missing)', expected"},
        {e_swap_dims, 0, SY_EINPUT, "variable 'occurrence' has dimensions (period=4, hs=3), expected (hs=3, period=4)"},
        {e_bounds_three, 0, SY_EINPUT, "variable 'hs_bounds' has dimensions (hs=3, three=3), expected (hs=3, bound=2)"},
        {e_empty, 0, SY_EINPUT, "dimension 'hs' has length 0"},
        {e_no_period_dim, 0, SY_EINPUT, "dimension 'period' missing"},
        {e_dir_width, 1, SY_EINPUT, "variable 'direction_bounds': bin 2 is 100 degrees wide, expected the common width 90"},
        {e_dir_units, 1, SY_EINPUT, "variable 'direction': unknown units attribute 'radian', expected 'degree'"},
    };
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char name[32];
        snprintf(name, sizeof name, "bad%02zu.nc", i);
        const char *p = in_dir(name);
        sy_climate_table *t = sample(bad[i].dir, SY_CLIMATE_HOURS), *r = NULL;
        int rc = bad[i].edit == e_empty ? SY_OK : sy_climate_table_write(t, p, NULL, &err);
        sy_climate_table_free(t);
        int nc, st = rc == SY_OK ? NC_NOERR : NC_EINVAL;
        if (bad[i].edit == e_empty)
            st = make_empty(p);
        else if (st == NC_NOERR && (st = nc_open(p, NC_WRITE, &nc)) == NC_NOERR) {
            st = bad[i].edit(nc);
            int st2 = nc_close(nc);
            st = st ? st : st2;
        }
        if (!sy_check_true(st == NC_NOERR, "make bad file %zu (%s)", i, nc_strerror(st)))
            continue;
        sy_error_clear(&err);
        rc = sy_climate_table_read(&r, p, &err);
        sy_check_fails(rc, bad[i].code, &err, bad[i].expect, "bad file %zu: %s", i, err.msg);
        sy_check_true(strncmp(err.msg, p, strlen(p)) == 0 && r == NULL,
                      "bad file %zu: message starts with the path, no table", i);
        remove(p);
    }
    /* Not a NetCDF file at all: an I/O error with nc_strerror. */
    const char *junk = in_dir("junk.nc");
    FILE *f = fopen(junk, "w");
    if (f != NULL) {
        fputs("hs,period\n1,2\n", f);
        fclose(f);
    }
    sy_climate_table *r = NULL;
    sy_check_fails(sy_climate_table_read(&r, junk, &err), SY_EIO, &err,
                   "cannot open as NetCDF: NetCDF: Unknown file format", "junk file: %s", err.msg);
    remove(junk);
    sy_check_fails(sy_climate_table_read(&r, in_dir("absent.nc"), &err), SY_EIO, &err,
                   "absent.nc: cannot open: No such file or directory",
                   "absent file: %s", err.msg);

    /* Atomic writer. */
    sy_climate_table *good = sample(1, SY_CLIMATE_HOURS);
    /* (1) the target is a directory: written fully, the rename fails, temp removed. */
    const char *as_dir = in_dir("target.nc");
    mkdir(as_dir, 0755);
    sy_check_fails(sy_climate_table_write(good, as_dir, NULL, &err), SY_EIO, &err,
                   "cannot rename the temporary file into place", "rename failure: %s", err.msg);
    sy_check_true(count_entries(dir_, ".tmp-") == 0, "no temporary file left after a failed rename");
    rmdir(as_dir);
    /* (2) a directory that does not exist: nothing created. */
    sy_check_fails(sy_climate_table_write(good, in_dir("nowhere/x.nc"), NULL, &err), SY_EIO,
                   &err, "cannot create a temporary file beside it", "missing dir: %s", err.msg);
    /* (3) an invalid table over an existing file: refused, the old file untouched. */
    const char *keep = in_dir("keep.nc");
    sy_check_ok(sy_climate_table_write(good, keep, NULL, &err), &err, "write keep.nc");
    struct stat s0, s1;
    stat(keep, &s0);
    sy_climate_table *worse = sample(1, SY_CLIMATE_HOURS);
    sy_climate_table_occurrence_mut(worse)[3] = -1.0;
    sy_check_fails(sy_climate_table_write(worse, keep, NULL, &err), SY_EINPUT, &err,
                   "expected a finite value >= 0", "invalid table refused");
    stat(keep, &s1);
    sy_check_true(s0.st_size == s1.st_size && s0.st_mtime == s1.st_mtime && s0.st_ino == s1.st_ino,
                  "existing file untouched");
    /* (4) overwrite succeeds and replaces the file (new inode from the rename). */
    sy_climate_table_occurrence_mut(worse)[3] = 7.0;
    sy_check_ok(sy_climate_table_write(worse, keep, NULL, &err), &err, "overwrite");
    stat(keep, &s1);
    sy_check_true(s0.st_ino != s1.st_ino, "overwrite replaced the file by rename");
    sy_check_true(count_entries(dir_, ".tmp-") == 0, "no temporary file at the end");
    mode_t mask = umask(0);
    umask(mask);
    sy_check_true((s1.st_mode & 0777) == (0666 & ~mask), "permissions 0666 & ~umask, not mkstemp's 0600");
    sy_climate_table_free(good);
    sy_climate_table_free(worse);

    remove(keep);
    remove(in_dir("rt_dir.nc"));
    remove(in_dir("rt_omni.nc"));
    sy_check_true(rmdir(dir_) == 0, "temporary directory empty at the end");
    return sy_check_summary();
}
