/* Long-form CSV scatter tables (docs/formats.md): a good file with every feature (metadata
 * lines, Tp limits, percent, direction bins through north, zero bins omitted, quoted
 * fields, CRLF) read back exactly, and every malformed case with its one-line message
 * naming file and line. Files are written here in a temporary directory. */
#define _XOPEN_SOURCE 700
#include "check.h"
#include "swellyield/climate.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

static char dir_[64];

static const char *write_file(const char *name, const char *text)
{
    static char path[256];
    snprintf(path, sizeof path, "%s/%s", dir_, name);
    FILE *f = fopen(path, "w");
    if (f != NULL) {
        fputs(text, f);
        fclose(f);
    }
    return path;
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    snprintf(dir_, sizeof dir_, "/tmp/sy_climate_csv_XXXXXX");
    if (mkdtemp(dir_) == NULL) {
        sy_check_true(0, "temporary directory");
        return sy_check_summary();
    }
    const char *good =
        "\xEF\xBB\xBF# site: CSV Cove\r\n"
        "# source: typed in by hand for test_csv.c\r\n"
        "# depth_m: 33.5\r\n"
        "# record_years: 7\r\n"
        "# invented: yes\r\n"
        "# A free comment: keys that are not metadata are ignored.\r\n"
        "HS_MIN, hs_max ,tp_min,tp_max,dir_from_min,dir_from_max,percent\r\n"
        "0.5,1.0,6,8,345,15,10\r\n"
        "0.5,1.0,6,8,15,45,\"20\"\r\n"
        "\r\n"
        "# rows may come in any order; gaps in the grid stay empty\r\n"
        "1.5,2.0,8,10,45,75,30.5\r\n"
        "1.0,1.5,6,8,345,15,0\r\n";
    sy_climate_table *t = NULL;
    const char *p = write_file("good.csv", good);
    sy_check_ok(sy_climate_table_read_csv(&t, p, &err), &err, "good CSV");
    if (t != NULL) {
        const sy_climate_bins *b = sy_climate_table_bins(t);
        /* Edges are the union of the limits: Hs 0.5 1 1.5 2, Tp 6 8 10; centres 0 30 60. */
        sy_check_true(b->n_hs == 3 && b->hs_edges[0] == 0.5 && b->hs_edges[3] == 2.0 &&
                          b->n_period == 2 && b->period_edges[2] == 10.0 &&
                          b->period == SY_CLIMATE_TP,
                      "Hs 3 bins 0.5-2 m, Tp 2 bins 6-10 s");
        sy_check_true(b->n_dir == 3 && b->dir_width == 30.0 && b->dir_centres[0] == 0.0 &&
                          b->dir_centres[1] == 30.0 && b->dir_centres[2] == 60.0,
                      "directions 0 (345-15 through north), 30, 60 with width 30");
        sy_check_true(sy_climate_table_occurrence_kind(t) == SY_CLIMATE_FRACTION,
                      "percent read as fraction");
        const double *o = sy_climate_table_occurrence(t);
        /* percent / 100: one rounding each, so within 1 ulp of the decimal fraction. */
        sy_check_close(o[sy_climate_table_index(t, 0, 0, 0)], 0.10, 2e-16, 0.0, "bin 0.5-1, 6-8, N");
        sy_check_close(o[sy_climate_table_index(t, 0, 0, 1)], 0.20, 2e-16, 0.0, "bin 0.5-1, 6-8, 30");
        sy_check_close(o[sy_climate_table_index(t, 2, 1, 2)], 0.305, 2e-16, 0.0, "bin 1.5-2, 8-10, 60");
        double total = 0.0;
        for (size_t i = 0; i < sy_climate_table_size(t); i++)
            total += o[i];
        sy_check_close(total, 0.605, 1e-15, 0.0, "nothing else filled");
        const sy_climate_meta *m = sy_climate_table_meta(t);
        sy_check_true(strcmp(m->site, "CSV Cove") == 0 && m->depth == 33.5 &&
                          m->record_years == 7.0 && m->invented == 1 &&
                          strcmp(m->source, "typed in by hand for test_csv.c") == 0,
                      "metadata lines read");
    }
    sy_climate_table_free(t);

    static const char *hdr = "hs_min,hs_max,te_min,te_max,hours_per_year\n";
    static const struct { const char *body; int header; const char *expect; } bad[] = {
        {"", 0, "no header line, expected hs_min,hs_max,te_min,te_max,... (empty table)"},
        {"# only comments\n", 0, "no header line"},
        {"", 1, ":1: no bins after the header, expected at least one row (empty table)"},
        {"0.5,1,5,6,-3\n", 1, ":2: column 'hours_per_year': occurrence -3, expected a finite value >= 0"},
        {"0.5,1,5,6,nan\n", 1, ":2: column 'hours_per_year': occurrence nan, expected a finite value >= 0"},
        {"0.5,1,5,6,12\n1,1.5,5,6,abc\n", 1, ":3: column 'hours_per_year': 'abc' is not a number"},
        {"0.5,1,5,6,0\n1,1.5,5,6,0\n", 1, "total occurrence is 0 over 2 bins, expected > 0"},
        {"1,0.5,5,6,3\n", 1, ":2: Hs bin 1-0.5 m, expected hs_min < hs_max"},
        {"0.5,1,6,5,3\n", 1, ":2: Te bin 6-5 s, expected te_min < te_max"},
        {"0.5,1.5,5,6,3\n1,1.5,5,6,3\n", 1, ":2: Hs bin 0.5-1.5 m overlaps another bin (edge 1 m inside it)"},
        {"0.5,1,5,7,3\n0.5,1,6,7,3\n", 1, ":2: Te bin 5-7 s overlaps another bin (edge 6 s inside it)"},
        {"0.5,1,5,6,3\n0.5,1,5,6,4\n", 1, ":3: bin Hs 0.5-1 m, Te 5-6 s listed again (first at line 2)"},
        {"0.5,1,5,6\n", 1, ":2: 4 fields, expected 5 as in the header"},
        {"0.5,1,5,6,3,9\n", 1, ":2: 6 fields, expected 5"},
        {"0.5,1,5,6,\"3\n", 1, ":2: CSV syntax"},
        {"0.5,1,5,6,1e999\n", 1, ":2: column 'hours_per_year': '1e999' is not a number"},
        {"0.5,1,5,6,9000\n", 1, "total hours per year is 9000, expected at most 8871.84"},
        {"-0.5,1,5,6,3\n", 1, "Hs edge 0 is -0.5 m, expected >= 0"},
        {"hs_min,hs_max,te_min,te_max,hours\n0.5,1,5,6,3\n", 0,
         ":1: unknown column 'hours', expected hs_min, hs_max, te_min, te_max (or tp_min, tp_max)"},
        {"hs_min,hs_max,te_min,te_max\n", 0, ":1: header lacks column hours_per_year, fraction or percent"},
        {"hs_min,hs_max,te_min,tp_max,fraction\n", 0, ":1: column 'tp_max' mixes Te and Tp limits"},
        {"hs_min,hs_max,hs_min,te_min,te_max,fraction\n", 0, ":1: column 'hs_min' duplicates column 'hs_min'"},
        {"hs_min,hs_max,te_min,te_max,dir_from_min,fraction\n", 0, ":1: header has only one of dir_from_min, dir_from_max"},
        {"hs_min,hs_max,te_min,te_max,dir_from_min,dir_from_max,fraction\n0.5,1,5,6,0,30,0.1\n"
         "0.5,1,5,6,30,90,0.1\n", 0, ":3: direction bin 30-90 is 60 degrees wide, expected the common width 30 of line 2"},
        {"hs_min,hs_max,te_min,te_max,dir_from_min,dir_from_max,fraction\n0.5,1,5,6,0,30,0.1\n"
         "0.5,1,5,6,20,50,0.1\n", 0, "direction bins unsorted or overlapping: centre 1 = 35 after 15"},
        {"hs_min,hs_max,te_min,te_max,dir_from_min,dir_from_max,fraction\n0.5,1,5,6,10,10,0.1\n", 0,
         ":2: direction bin 10-10 degrees is empty"},
        {"hs_min,hs_max,te_min,te_max,dir_from_min,dir_from_max,fraction\n0.5,1,5,6,10,400,0.1\n", 0,
         ":2: column 'dir_from_max': 400 degrees, expected 0..360"},
        {"# depth_m: -4\n", 0, ":1: metadata 'depth_m': '-4', expected a number > 0"},
        {"# invented: maybe\n", 0, ":1: metadata 'invented': 'maybe', expected yes or no"},
    };
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char text[1024], name[32];
        snprintf(text, sizeof text, "%s%s", bad[i].header ? hdr : "", bad[i].body);
        snprintf(name, sizeof name, "bad%02zu.csv", i);
        p = write_file(name, text);
        sy_climate_table *r = NULL;
        sy_error_clear(&err);
        int rc = sy_climate_table_read_csv(&r, p, &err);
        sy_check_fails(rc, SY_EINPUT, &err, bad[i].expect, "bad CSV %zu: %s", i, err.msg);
        sy_check_true(r == NULL && strncmp(err.msg, p, strlen(p)) == 0,
                      "bad CSV %zu: no table, message starts with the file name", i);
        remove(p);
    }
    sy_climate_table *r = NULL;
    sy_check_fails(sy_climate_table_read_csv(&r, "/nonexistent/x.csv", &err), SY_EIO, &err,
                   "/nonexistent/x.csv: cannot open: No such file or directory", "absent CSV");
    remove(write_file("good.csv", ""));
    sy_check_true(rmdir(dir_) == 0, "temporary directory empty at the end");
    return sy_check_summary();
}
