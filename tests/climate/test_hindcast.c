/* Hindcast series: CF reading (variables by standard_name, packing, fill and missing
 * values, valid range, default fill, time decoding) and binning into mean annual hours,
 * on a small file written here whose every expected number is derived by hand in the
 * comments; then the invented demo hindcast (seastates/shelf_hindcast.nc) for the
 * properties that must hold on any file. Malformed files, table-driven.
 * With arguments `--bin IN OUT [te|tp] [dir]` it bins IN with the demo bins into OUT
 * (for tests/climate/test_hindcast_bins.py, which recounts with numpy). */
#define _XOPEN_SOURCE 700
#include "check.h"
#include "swellyield/climate.h"

#include <math.h>
#include <netcdf.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

/* Options for the small file. */
typedef struct {
    const char *calendar;
    const char *hs_units;
    int second_hs;        /* another variable claiming to be Hs */
    int no_te;            /* leave out Te (fp stays) */
    int decreasing;       /* time goes back at record 4 */
    int no_time_std;      /* time without standard_name/axis */
    int two_d;            /* Hs over (time, station=2) */
} spec;

#define N 8
/* Times (h): regular 3 h, except the last step of 6 h. */
static const double TIME_H[N] = {0, 3, 6, 9, 12, 15, 18, 24};
/* Hs packed: short, scale 0.01 m, _FillValue -999. Record 2 is fill; record 6 is 9 m. */
static const short HS_RAW[N] = {50, 75, -999, 150, 100, 120, 900, 60};
/* Te: double with no _FillValue attribute, so NC_FILL_DOUBLE means missing (record 3);
 * record 4 is NaN. */
static double TE[N] = {5.5, 6.0, 6.0, NC_FILL_DOUBLE, NAN, 7.0, 8.0, 5.0};
/* fp: float, missing_value -1 at record 1. 1/0.125 = 8 s exactly. */
static const float FP[N] = {0.125f, -1.0f, 0.1f, 0.1f, 0.1f, 0.1f, 0.1f, 0.2f};
/* Direction (from): float, valid_range [0, 360]: record 5 (400) is invalid. */
static const float DIR[N] = {10, 350, 10, 10, 10, 400, 180, 15};

static int make(const char *path, const spec *s)
{
    int nc, dt = -1, dst = -1, v, st = nc_create(path, NC_NETCDF4 | NC_CLOBBER, &nc);
    if (st)
        return st;
#define TRY(x) do { if (!st) st = (x); } while (0)
    TRY(nc_def_dim(nc, "obs", N, &dt));
    TRY(nc_def_var(nc, "t", NC_DOUBLE, 1, &dt, &v));
    const char *tu = "hours since 2000-02-28 21:00:00";
    TRY(nc_put_att_text(nc, v, "units", strlen(tu), tu));
    if (s->calendar)
        TRY(nc_put_att_text(nc, v, "calendar", strlen(s->calendar), s->calendar));
    if (!s->no_time_std)
        TRY(nc_put_att_text(nc, v, "axis", 1, "T"));
    double t[N];
    memcpy(t, TIME_H, sizeof t);
    if (s->decreasing)
        t[4] = 8.0;
    int vhs, vte = -1, vfp, vdir, vhs2 = -1;
    int dims[2] = {dt, 0};
    if (s->two_d) {
        TRY(nc_def_dim(nc, "station", 2, &dst));
        dims[1] = dst;
    }
    TRY(nc_def_var(nc, "a", NC_SHORT, s->two_d ? 2 : 1, dims, &vhs));
    short fill = -999;
    TRY(nc_def_var_fill(nc, vhs, 0, &fill));
    const char *hs_std = "sea_surface_wave_significant_height";
    TRY(nc_put_att_text(nc, vhs, "standard_name", strlen(hs_std), hs_std));
    const char *hu = s->hs_units ? s->hs_units : "m";
    TRY(nc_put_att_text(nc, vhs, "units", strlen(hu), hu));
    double scale = 0.01, offset = 0.0;
    TRY(nc_put_att_double(nc, vhs, "scale_factor", NC_DOUBLE, 1, &scale));
    TRY(nc_put_att_double(nc, vhs, "add_offset", NC_DOUBLE, 1, &offset));
    if (s->second_hs) {
        TRY(nc_def_var(nc, "hs_again", NC_FLOAT, 1, &dt, &vhs2));
        TRY(nc_put_att_text(nc, vhs2, "standard_name", strlen(hs_std), hs_std));
    }
    if (!s->no_te) {
        TRY(nc_def_var(nc, "b", NC_DOUBLE, 1, &dt, &vte));
        const char *te_std = "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment";
        TRY(nc_put_att_text(nc, vte, "standard_name", strlen(te_std), te_std));
        TRY(nc_put_att_text(nc, vte, "units", 1, "s"));
    }
    TRY(nc_def_var(nc, "c", NC_FLOAT, 1, &dt, &vfp));
    const char *fp_std = "sea_surface_wave_frequency_at_variance_spectral_density_maximum";
    TRY(nc_put_att_text(nc, vfp, "standard_name", strlen(fp_std), fp_std));
    TRY(nc_put_att_text(nc, vfp, "units", 3, "s-1"));
    float mv = -1.0f;
    TRY(nc_put_att_float(nc, vfp, "missing_value", NC_FLOAT, 1, &mv));
    TRY(nc_def_var(nc, "d", NC_FLOAT, 1, &dt, &vdir));
    const char *d_std = "sea_surface_wave_from_direction";
    TRY(nc_put_att_text(nc, vdir, "standard_name", strlen(d_std), d_std));
    TRY(nc_put_att_text(nc, vdir, "units", 6, "degree"));
    float vr[2] = {0.0f, 360.0f};
    TRY(nc_put_att_float(nc, vdir, "valid_range", NC_FLOAT, 2, vr));
    TRY(nc_put_att_text(nc, NC_GLOBAL, "site_name", 9, "Hand Made"));
    TRY(nc_enddef(nc));
    TRY(nc_put_var_double(nc, v, t));
    if (s->two_d) {
        short two[2 * N];
        for (int i = 0; i < 2 * N; i++)
            two[i] = HS_RAW[i / 2];
        TRY(nc_put_var_short(nc, vhs, two));
    } else {
        TRY(nc_put_var_short(nc, vhs, HS_RAW));
    }
    if (vte >= 0)
        TRY(nc_put_var_double(nc, vte, TE));
    TRY(nc_put_var_float(nc, vfp, FP));
    TRY(nc_put_var_float(nc, vdir, DIR));
    if (vhs2 >= 0) {
        float z[N] = {0};
        TRY(nc_put_var_float(nc, vhs2, z));
    }
#undef TRY
    int st2 = nc_close(nc);
    return st ? st : st2;
}

/* Demo bins: Hs 0.25..8.25 by 0.5 m, period 2.5..16.5 by 1 s, optional 12 x 30 degrees. */
static double HS_E[17], T_E[15], D_C[12];
static void demo_bins(sy_climate_bins *b, sy_climate_period_kind kind, int dirs)
{
    for (int i = 0; i < 17; i++)
        HS_E[i] = 0.25 + 0.5 * i;
    for (int i = 0; i < 15; i++)
        T_E[i] = 2.5 + i;
    for (int i = 0; i < 12; i++)
        D_C[i] = 30.0 * i;
    *b = (sy_climate_bins){16, HS_E, 14, T_E, kind, dirs ? 12 : 0, D_C, 30.0};
}

static int bin_mode(const char *in, const char *out, sy_climate_period_kind kind, int dirs)
{
    sy_error err = SY_ERROR_INIT;
    sy_climate_series *s = NULL;
    sy_climate_table *t = NULL;
    sy_climate_bins b;
    demo_bins(&b, kind, dirs);
    int rc = sy_climate_series_read(&s, in, kind, dirs, &err);
    if (rc == SY_OK)
        rc = sy_climate_series_bin(&t, s, &b, SY_CLIMATE_GAPS_KEEP, NULL, &err);
    if (rc == SY_OK)
        rc = sy_climate_table_write(t, out, "binned by test_hindcast --bin", &err);
    if (rc != SY_OK)
        fprintf(stderr, "%s\n", err.msg);
    sy_climate_table_free(t);
    sy_climate_series_free(s);
    return rc == SY_OK ? 0 : 1;
}

int main(int argc, char **argv)
{
    sy_init();
    if (argc >= 4 && strcmp(argv[1], "--bin") == 0)
        return bin_mode(argv[2], argv[3],
                        argc >= 5 && strcmp(argv[4], "tp") == 0 ? SY_CLIMATE_TP : SY_CLIMATE_TE,
                        argc >= 6 && strcmp(argv[5], "dir") == 0);
    sy_error err = SY_ERROR_INIT;
    char dir[] = "/tmp/sy_climate_hc_XXXXXX", path[128];
    if (mkdtemp(dir) == NULL) {
        sy_check_true(0, "temporary directory");
        return sy_check_summary();
    }
    snprintf(path, sizeof path, "%s/small.nc", dir);
    spec ok = {"standard", NULL, 0, 0, 0, 0, 0};
    sy_check_true(make(path, &ok) == NC_NOERR, "write small file");

    /* Reading: values unpacked, missing ones NAN, names found by standard_name. */
    sy_climate_series *s = NULL;
    sy_check_ok(sy_climate_series_read(&s, path, SY_CLIMATE_TE, 0, &err), &err, "read Te");
    if (s != NULL) {
        sy_check_true(strcmp(s->hs_var, "a") == 0 && strcmp(s->period_var, "b") == 0 &&
                          strcmp(s->time_var, "t") == 0 && strcmp(s->site, "Hand Made") == 0,
                      "variables by standard_name: a, b, t");
        sy_check_true(s->n == N && s->n_missing == 3, "8 records, 3 missing (fill, default "
                      "fill, NaN): got %zu", s->n_missing);
        sy_check_true(isnan(s->hs[2]) && isnan(s->period[3]) && isnan(s->period[4]),
                      "missing records are NAN");
        /* 150 x 0.01 and 900 x 0.01 in double: within an ulp of 1.5 and 9. */
        sy_check_close(s->hs[3], 1.5, 2e-16, 0.0, "unpacked 150 x 0.01");
        sy_check_close(s->hs[6], 9.0, 2e-16, 0.0, "unpacked 900 x 0.01");
        /* 2000-02-28T21:00 + 3 h = 2000-02-29T00:00 (2000 is a leap year). */
        char when[40];
        sy_climate_time_format(s->time[1], when, sizeof when);
        sy_check_true(strcmp(when, "2000-02-29T00:00:00Z") == 0, "time[1] = %s", when);
    }
    sy_climate_series_free(s);
    s = NULL;
    sy_check_ok(sy_climate_series_read(&s, path, SY_CLIMATE_TP, 1, &err), &err, "read Tp from fp");
    if (s != NULL) {
        sy_check_true(strcmp(s->period_var, "c") == 0 && strcmp(s->dir_var, "d") == 0,
                      "fp variable 'c', direction 'd'");
        sy_check_close(s->period[0], 8.0, 0.0, 0.0, "Tp = 1/fp = 1/0.125 = 8 s exactly");
        sy_check_true(isnan(s->period[1]) && isnan(s->dir_from[5]) && s->dir_from[1] == 350.0f,
                      "missing_value and valid_range respected");
        /* Records 1 (fp missing), 2 (Hs fill), 5 (direction invalid): 3 missing. */
        sy_check_true(s->n_missing == 3, "3 missing with Tp and direction: got %zu", s->n_missing);
    }
    sy_climate_series_free(s);

    /* Binning by hand. Steps dt = 3,3,3,3,3,3,6,6 h (the last repeats the one before):
     * span 30 h, so Y = 30/8766 years. Valid (Te): records 0,1,5,6,7 = 3+3+3+6+6 = 21 h;
     * record 6 (Hs 9 m) is outside the bins (6 h). Bins Hs [0.25,0.75,1.25),
     * Te [4.5,5.5,6.5,7.5): rec 0 (0.5, 5.5) -> (0,1); rec 1 (0.75, 6.0) -> (1,1) (a value
     * on an edge goes to the upper bin); rec 5 (1.2, 7.0) -> (1,2); rec 7 (0.6, 5.0) ->
     * (0,0) with 6 h. Keep gaps: 3 h / Y = 876.6 h/yr, 6 h / Y = 1753.2 h/yr.
     * Scale gaps: times span/valid = 30/21. */
    static const double hs_e[] = {0.25, 0.75, 1.25}, te_e[] = {4.5, 5.5, 6.5, 7.5};
    sy_climate_bins b = {2, hs_e, 3, te_e, SY_CLIMATE_TE, 0, NULL, 0.0};
    s = NULL;
    sy_climate_series_read(&s, path, SY_CLIMATE_TE, 0, NULL);
    for (int g = 0; s != NULL && g < 2; g++) {
        sy_climate_table *t = NULL;
        sy_climate_bin_report rep;
        sy_check_ok(sy_climate_series_bin(&t, s, &b, g ? SY_CLIMATE_GAPS_SCALE : SY_CLIMATE_GAPS_KEEP,
                                          &rep, &err), &err, "bin (gaps %d)", g);
        if (t == NULL)
            continue;
        double f = g ? 30.0 / 21.0 : 1.0;
        const double want[6] = {1753.2 * f, 876.6 * f, 0.0, 0.0, 876.6 * f, 876.6 * f};
        const double *o = sy_climate_table_occurrence(t);
        for (int i = 0; i < 6; i++)   /* a product and a quotient of exact-ish numbers */
            sy_check_close(o[i], want[i], 1e-14, 0.0, "gaps %d: bin %d (hs %d, te %d)", g, i,
                           i / 3, i % 3);
        sy_check_true(rep.n_records == 8 && rep.n_missing == 3 && rep.n_outside == 1,
                      "report: 8 records, 3 missing, 1 outside");
        sy_check_close(rep.span_hours, 30.0, 0.0, 0.0, "span 30 h");
        sy_check_close(rep.valid_hours, 21.0, 0.0, 0.0, "valid 21 h");
        sy_check_close(rep.outside_hours, 6.0, 0.0, 0.0, "outside 6 h");
        sy_check_true(rep.step_hours_min == 3.0 && rep.step_hours_max == 6.0, "steps 3-6 h");
        sy_check_close(rep.record_years, 30.0 / 8766.0, 1e-15, 0.0, "record years");
        const sy_climate_meta *m = sy_climate_table_meta(t);
        sy_check_true(strstr(m->source, "Hs from 'a', Te from 'b'") != NULL &&
                          strstr(m->source, "8766 hours per year") != NULL &&
                          strcmp(m->site, "Hand Made") == 0,
                      "table source names variables and hours per year: %s", m->source);
        sy_climate_table_free(t);
    }
    sy_climate_series_free(s);

    /* Directional binning: 2 sectors of 180 degrees centred on 0 and 180. With directions,
     * record 5 (direction 400 outside valid_range) is missing too; records 0 (10), 1 (350,
     * through north) and 7 (15) fall in the north sector. Keep gaps. */
    static const double dc[] = {0.0, 180.0};
    sy_climate_bins bd = {2, hs_e, 3, te_e, SY_CLIMATE_TE, 2, dc, 180.0};
    s = NULL;
    sy_check_ok(sy_climate_series_read(&s, path, SY_CLIMATE_TE, 1, &err), &err, "read with dir");
    sy_climate_table *t = NULL;
    if (s != NULL)
        sy_check_ok(sy_climate_series_bin(&t, s, &bd, SY_CLIMATE_GAPS_KEEP, NULL, &err), &err,
                    "directional bin");
    if (t != NULL) {
        const double *o = sy_climate_table_occurrence(t);
        sy_check_close(o[sy_climate_table_index(t, 0, 1, 0)], 876.6, 1e-14, 0.0, "rec 0 north");
        sy_check_close(o[sy_climate_table_index(t, 1, 1, 0)], 876.6, 1e-14, 0.0, "rec 1 (350) north");
        sy_check_close(o[sy_climate_table_index(t, 0, 0, 0)], 1753.2, 1e-14, 0.0, "rec 7 north");
        sy_check_close(o[sy_climate_table_index(t, 1, 2, 0)], 0.0, 0.0, 0.0, "rec 5 dropped");
    }
    sy_climate_table_free(t);
    sy_climate_series_free(s);

    /* Misuse: direction bins on a series read without directions; Tp bins on Te data. */
    s = NULL;
    sy_climate_series_read(&s, path, SY_CLIMATE_TE, 0, NULL);
    t = NULL;
    sy_check_fails(sy_climate_series_bin(&t, s, &bd, SY_CLIMATE_GAPS_KEEP, NULL, &err), SY_EINVAL,
                   &err, "direction bins given but the series was read without directions",
                   "direction bins need directions");
    bd.n_dir = 0;
    bd.period = SY_CLIMATE_TP;
    sy_check_fails(sy_climate_series_bin(&t, s, &bd, SY_CLIMATE_GAPS_KEEP, NULL, &err), SY_EINVAL,
                   &err, "bins are for Tp, the series holds Te", "period kinds must agree");
    sy_check_true(t == NULL, "no table on misuse");
    sy_climate_series_free(s);

    /* Malformed files. */
    static const struct { spec s; const char *expect; } bad[] = {
        {{"360_day", NULL, 0, 0, 0, 0, 0}, "variable 't': time: calendar '360_day' not supported for annual statistics"},
        {{"noleap", NULL, 0, 0, 0, 0, 0}, "calendar 'noleap' not supported"},
        {{"julian", NULL, 0, 0, 0, 0, 0}, "calendar 'julian' not supported"},
        {{NULL, "cm", 0, 0, 0, 0, 0}, "variable 'a': unknown units attribute 'cm', expected 'm'"},
        {{NULL, NULL, 1, 0, 0, 0, 0}, "variables 'a' and 'hs_again' both have standard_name 'sea_surface_wave_significant_height'"},
        {{NULL, NULL, 0, 1, 0, 0, 0}, "no variable with standard_name 'sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment' (Te)"},
        {{NULL, NULL, 0, 0, 1, 0, 0}, "variable 't': record 4 (8) not after record 3 (9), expected strictly increasing times"},
        {{NULL, NULL, 0, 0, 0, 1, 0}, "no time variable (standard_name 'time' or axis 'T') over dimension 'obs' of 'a'"},
        {{NULL, NULL, 0, 0, 0, 0, 1}, "variable 'a' has two dimensions longer than 1 (8 and 2)"},
    };
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        snprintf(path, sizeof path, "%s/bad%02zu.nc", dir, i);
        if (!sy_check_true(make(path, &bad[i].s) == NC_NOERR, "make bad hindcast %zu", i))
            continue;
        s = NULL;
        sy_error_clear(&err);
        int rc = sy_climate_series_read(&s, path, SY_CLIMATE_TE, 0, &err);
        sy_check_fails(rc, SY_EINPUT, &err, bad[i].expect, "bad hindcast %zu: %s", i, err.msg);
        sy_check_true(s == NULL && strncmp(err.msg, path, strlen(path)) == 0,
                      "bad hindcast %zu: message starts with the path", i);
        remove(path);
    }

    /* The invented demo hindcast: 4 years 2001-2004 of 3-hourly records. */
    const char *src = getenv("SY_SOURCE_DIR");
    snprintf(path, sizeof path, "%s/seastates/shelf_hindcast.nc", src ? src : "../..");
    s = NULL;
    sy_check_ok(sy_climate_series_read(&s, path, SY_CLIMATE_TE, 1, &err), &err, "demo hindcast");
    if (s != NULL) {
        sy_check_true(s->n == 11688 && strcmp(s->hs_var, "swh") == 0 &&
                          strcmp(s->period_var, "t_e") == 0 && strcmp(s->dir_var, "mwd") == 0 &&
                          s->invented && s->depth == 50.0,
                      "demo: 11688 records, swh/t_e/mwd found by standard_name, invented, 50 m");
        char a[40], z[40];
        sy_climate_time_format(s->time[0], a, sizeof a);
        sy_climate_time_format(s->time[s->n - 1], z, sizeof z);
        sy_check_true(strcmp(a, "2001-01-01T00:00:00Z") == 0 && strcmp(z, "2004-12-31T21:00:00Z") == 0,
                      "demo spans %s .. %s", a, z);
        sy_climate_bins db;
        demo_bins(&db, SY_CLIMATE_TE, 1);
        sy_climate_bin_report rep;
        t = NULL;
        sy_check_ok(sy_climate_series_bin(&t, s, &db, SY_CLIMATE_GAPS_SCALE, &rep, &err), &err,
                    "demo binning");
        /* 2001-2004: 1461 days = 35064 h = 4 x 8766 h (references.md 6.2). */
        sy_check_close(rep.record_years, 4.0, 1e-15, 0.0, "4.0 years of record");
        sy_check_true(rep.step_hours_min == 3.0 && rep.step_hours_max == 3.0, "3-hourly");
        if (t != NULL) {
            sy_climate_summary sum;
            sy_climate_table_summarise(t, &sum, NULL);
            /* Gaps scaled: total = 8766 (valid - outside) / valid. Sums of 11000 terms: 1e-12. */
            sy_check_close(sum.total, 8766.0 * (rep.valid_hours - rep.outside_hours) / rep.valid_hours,
                           1e-12, 0.0, "total hours = N_h x in-bin share of valid time");
        }
        sy_climate_table_free(t);
    }
    sy_climate_series_free(s);
    snprintf(path, sizeof path, "%s/small.nc", dir);
    remove(path);
    sy_check_true(rmdir(dir) == 0, "temporary directory empty at the end");
    return sy_check_summary();
}
