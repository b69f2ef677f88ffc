/* The run's pictures and report (src/plot) on a small real case: 2 invented floats at the
 * invented sheltered site (seastates/sheltered_site.nc), hydrodynamics and yield computed
 * by the library, then sy_plot_run. Checks: every picture exists, is a PNG (signature and
 * IHDR per the PNG specification, ISO/IEC 15948 sections 5.2 and 11.2.2) of 1000 x 700
 * px; SVG on request; the optional poles picture; report.md carries the result's numbers,
 * the 8766 h convention and the cautions; no temporary file is left; bad bands, an unknown
 * format and an unwritable folder fail with a message and leave no picture. */
#include "check.h"
#include "tmpfiles.h"
#include "swellyield/swellyield.h"

#include <dirent.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

static const char *pictures[] = {"layout", "power_matrix", "q_factor", "spectrum"};
#define N_PICTURES (sizeof pictures / sizeof pictures[0])

static long read_file(const char *path, unsigned char *buf, size_t cap)
{
    FILE *f = fopen(path, "rb");
    if (f == NULL)
        return -1;
    size_t n = fread(buf, 1, cap, f);
    fclose(f);
    return (long)n;
}

static unsigned long be32(const unsigned char *p)
{
    return ((unsigned long)p[0] << 24) | ((unsigned long)p[1] << 16) | ((unsigned long)p[2] << 8) | p[3];
}

static void check_png(const char *dir, const char *name)
{
    char path[4096];
    unsigned char b[32];
    snprintf(path, sizeof path, "%s/%s.png", dir, name);
    long n = read_file(path, b, sizeof b);
    if (!sy_check_true(n >= 24, "%s.png exists (%ld bytes read)", name, n))
        return;
    /* PNG signature 89 50 4E 47 0D 0A 1A 0A, then the IHDR chunk: length 13, "IHDR",
     * width and height as 4-byte big-endian integers (PNG specification 5.2, 11.2.2). */
    static const unsigned char sig[8] = {0x89, 'P', 'N', 'G', 0x0D, 0x0A, 0x1A, 0x0A};
    sy_check_true(memcmp(b, sig, 8) == 0, "%s.png has the PNG signature", name);
    sy_check_true(memcmp(b + 12, "IHDR", 4) == 0, "%s.png starts with IHDR", name);
    sy_check_true(be32(b + 16) == SY_PLOT_WIDTH && be32(b + 20) == SY_PLOT_HEIGHT, "%s.png is %d x %d px (got %lu x %lu)",
                  name, SY_PLOT_WIDTH, SY_PLOT_HEIGHT, be32(b + 16), be32(b + 20));
}

/* 1 if no file in dir starts with '.' (the atomic writer's temporaries are ".name.tmp-pid"). */
static int no_temporaries(const char *dir)
{
    DIR *d = opendir(dir);
    if (d == NULL)
        return 0;
    struct dirent *e;
    int ok = 1;
    while ((e = readdir(d)) != NULL)
        if (e->d_name[0] == '.' && strcmp(e->d_name, ".") != 0 && strcmp(e->d_name, "..") != 0)
            ok = 0;
    closedir(d);
    return ok;
}

static size_t count_files(const char *dir)
{
    DIR *d = opendir(dir);
    size_t n = 0;
    if (d == NULL)
        return 0;
    struct dirent *e;
    while ((e = readdir(d)) != NULL)
        n += strcmp(e->d_name, ".") != 0 && strcmp(e->d_name, "..") != 0;
    closedir(d);
    return n;
}

static void check_report(const char *dir, const sy_model *m, const sy_yield_result *r)
{
    char path[8192], want[128];
    static char text[65536];
    snprintf(path, sizeof path, "%s/report.md", dir);
    long n = read_file(path, (unsigned char *)text, sizeof text - 1);
    if (!sy_check_true(n > 0, "report.md exists"))
        return;
    text[n] = '\0';
    const sy_yield_strategy *h = &r->s[m->tuning];
    snprintf(want, sizeof want, "| annual energy | %.1f MWh/yr |", h->energy_array / 1e6);
    sy_check_true(strstr(text, want) != NULL, "report: headline '%s'", want);
    snprintf(want, sizeof want, "| q-factor | %.3f |", h->q_factor);
    sy_check_true(strstr(text, want) != NULL, "report: headline '%s'", want);
    snprintf(want, sizeof want, "| mean wave resource | %.1f kW/m |", r->mean_resource / 1e3);
    sy_check_true(strstr(text, want) != NULL, "report: '%s'", want);
    for (int s = 0; s < SY_YIELD_N_STRATEGIES; s++) {
        const sy_yield_strategy *t = &r->s[s];
        snprintf(want, sizeof want, "| %s | %.1f | %.1f | %.3f | %zu |", sy_yield_strategy_name(s),
                 t->energy_array / 1e6, t->mean_power / 1e3, t->q_factor, t->n_stroke_exceeded);
        sy_check_true(strstr(text, want) != NULL, "report: strategy row '%s'", want);
    }
    sy_check_true(r->n_bands == 2, "result carries the 2 bands (got %zu)", r->n_bands);
    for (size_t j = 0; j < r->n_bands; j++) {
        double share = 100.0 * h->energy_band[j] / h->energy_array;
        snprintf(want, sizeof want, "| %.3f .. %.3f | %.1f %% |", j == 0 ? 0.85 : 1.5, j == 0 ? 0.95 : 1.7, share);
        sy_check_true(strstr(text, want) != NULL && share >= 0 && share <= 100, "report: band row '%s'", want);
    }
    sy_check_true(strstr(text, "8766 h per year") != NULL, "report states the hours-per-year convention");
    for (size_t i = 0; i < N_PICTURES; i++) {
        snprintf(want, sizeof want, "(%s.png)", pictures[i]);
        sy_check_true(strstr(text, want) != NULL, "report links %s.png", pictures[i]);
    }
    /* Every caution line of the outputs module appears. */
    const char *t = sy_outputs_cautions();
    size_t k = 0;
    while (*t) {
        const char *nl = strchr(t, '\n');
        size_t len = nl ? (size_t)(nl - t) : strlen(t);
        char line[1024];
        snprintf(line, sizeof line, "%.*s", (int)(len < 1000 ? len : 1000), t);
        if (len > 0)
            sy_check_true(strstr(text, line) != NULL, "report carries caution %zu", k++);
        t += len + (nl != NULL);
    }
}

int main(void)
{
    sy_init();
    const char *src = getenv("SY_SOURCE_DIR");
    if (!sy_check_true(src != NULL, "SY_SOURCE_DIR is set"))
        return sy_check_summary();
    const char *tmp = sy_test_tmpdir();
    char ini[8192], out[4096], svg[4096], bad[4096];
    sy_test_write(tmp, "layout.csv", "name,x,y\nP1,0,0\nP2,30,12\n");
    snprintf(ini, sizeof ini,
             "; invented test project\n[site]\ndepth = 25\nclimate = %s/seastates/sheltered_site.nc\n"
             "[device]\nshape = float\nradius = 4\ndraft = 3\n"
             "[pto]\ndamping = 1.5e5\nefficiency = 0.75\nrated_power = 3e5\nmax_stroke = 3\ntuning = site_optimal\n"
             "[layout]\nfile = layout.csv\n[sea]\nspectrum = bretschneider\n"
             "[solve]\nomega = 0.3:2.8:26\nheadings = 0:330:12\ntolerance = 1e-4\n"
             "[resonance]\nregion = 0.5:2.0:0.3\n",
             src);
    const char *project = sy_test_write(tmp, "p.ini", ini);
    snprintf(out, sizeof out, "%s/out", tmp);
    snprintf(svg, sizeof svg, "%s/svg", tmp);
    snprintf(bad, sizeof bad, "%s/bad", tmp);
    sy_error err = SY_ERROR_INIT;
    sy_model *m = NULL;
    sy_climate_table *cl = NULL;
    sy_hydro_set *hs = NULL;
    sy_yield_result *r = NULL;
    const double bands[4] = {0.85, 0.95, 1.5, 1.7}; /* rad/s, invented flagged bands */
    int ok = sy_check_ok(sy_model_load(&m, project, &err), &err, "load the project") &&
             sy_check_ok(sy_climate_table_load(&cl, m->climate, &err), &err, "load the climate") &&
             sy_check_ok(sy_hydro_build(&hs, m, 1, NULL, 1, NULL, NULL, &err), &err, "hydrodynamics") &&
             sy_check_ok(sy_yield_compute_banded(&r, m, cl, hs->array, hs->iso_of_device, bands, 2, &err), &err,
                         "yield with two flagged bands");
    if (ok) {
        /* Two invented poles inside the region, so the poles picture is drawn. */
        sy_pole poles[2] = {{.omega = 0.9 - 0.05 * I, .omega_r = 0.9, .gamma = 0.05, .q = 9.0, .kind = SY_POLE_MOTION},
                            {.omega = 1.6 - 0.2 * I, .omega_r = 1.6, .gamma = 0.2, .q = 4.0, .kind = SY_POLE_MOTION}};
        sy_pole_set ps = {.n = 2, .poles = poles, .count = {2, -1, -1}, .found = {2, 0, 0}};
        sy_check_true(mkdir(out, 0777) == 0 && mkdir(svg, 0777) == 0 && mkdir(bad, 0777) == 0, "output folders made");
        if (sy_check_ok(sy_plot_run(out, m, cl, hs->array, r, &ps, bands, 2, NULL, &err), &err, "plot the run (PNG)")) {
            for (size_t i = 0; i < N_PICTURES; i++)
                check_png(out, pictures[i]);
            check_png(out, "poles");
            check_report(out, m, r);
            sy_check_true(no_temporaries(out), "no temporary file left in the folder");
        }
        /* SVG on request: an XML document with an <svg> element. */
        if (sy_check_ok(sy_plot_run(svg, m, cl, hs->array, r, NULL, NULL, 0, "svg", &err), &err, "plot the run (SVG)")) {
            char path[8192];
            static char text[4096];
            snprintf(path, sizeof path, "%s/q_factor.svg", svg);
            long n = read_file(path, (unsigned char *)text, sizeof text - 1);
            text[n > 0 ? n : 0] = '\0';
            sy_check_true(n > 0 && strstr(text, "<svg") != NULL, "q_factor.svg is an SVG document");
            snprintf(path, sizeof path, "%s/poles.svg", svg);
            sy_check_true(read_file(path, (unsigned char *)text, 8) < 0, "no poles picture without poles");
        }
        /* Bad input: each fails with its message and writes nothing. */
        const double reversed[2] = {1.2, 0.8};
        sy_check_fails(sy_plot_run(bad, m, cl, hs->array, r, NULL, reversed, 1, "png", &err), SY_EINVAL, &err,
                       "band 0 = [1.2, 0.8] rad/s: expected omega_min < omega_max", "reversed band");
        sy_check_fails(sy_plot_run(bad, m, cl, hs->array, r, NULL, NULL, 0, "gif", &err), SY_EINVAL, &err,
                       "format 'gif': expected png, svg or pdf", "unknown format");
        char missing[4200];
        snprintf(missing, sizeof missing, "%s/no/such/folder", tmp);
        sy_check_fails(sy_plot_run(missing, m, cl, hs->array, r, NULL, NULL, 0, "png", &err), SY_EIO, &err,
                       "cannot create picture", "folder that does not exist");
        sy_check_true(count_files(bad) == 0, "failed calls wrote nothing (%zu files in the folder)", count_files(bad));
    }
    sy_yield_result_free(r);
    sy_hydro_set_free(hs);
    sy_climate_table_free(cl);
    sy_model_free(m);
    sy_test_rmtree(tmp);
    return sy_check_summary();
}
