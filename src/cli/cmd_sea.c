/* swellyield sea <action>: wave climates and spectra.
 *   summary FILE        occurrence totals, Hs and period ranges, mean wave power J
 *   import CSV -o NC    long-form CSV scatter table -> swellyield NetCDF table
 *   bin HINDCAST -o NC  CF hindcast time series -> scatter table with stated bin edges
 *   spectrum ...        a spectrum (and spreading) for given Hs, Tp or Te, gamma */
#include "cli.h"

#include <getopt.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static const char *help =
    "usage: swellyield sea summary FILE.nc|FILE.csv [--depth H] [--spectrum jonswap|bretschneider] [--gamma G]\n"
    "       swellyield sea import TABLE.csv -o TABLE.nc\n"
    "       swellyield sea bin HINDCAST.nc -o TABLE.nc [--period te|tp] [--hs-step 0.5] [--hs-max 10]\n"
    "                                      [--period-step 1] [--period-min 1] [--period-max 21] [--dir-bins N]\n"
    "       swellyield sea spectrum --hs HS (--tp TP | --te TE) [--spectrum jonswap|bretschneider]\n"
    "                               [--gamma G] [--spreading S] [--depth H] [-o FILE.csv]\n"
    "summary: occurrence totals, Hs/period ranges and the occurrence-weighted mean wave power J\n"
    "  (finite depth: --depth, else the table's depth attribute, else deep water; stated).\n"
    "import: converts a long-form CSV scatter table (docs/formats.md) to the NetCDF form.\n"
    "bin: reads a CF time series (variables found by standard_name) and bins it; missing\n"
    "  records are skipped and counted; occurrence in mean hours per year (8766 h/yr).\n"
    "spectrum: prints spectral parameters (Hm0, Tp, Te, Tz, J) and S(omega) in m^2 s/rad on\n"
    "  0.1..3 rad/s, and with --spreading the cos-2s weights on 10-degree headings.\n";

typedef struct opts {
    const char *out;
    double hs, tp, te, gamma, spreading, depth;
    int spectrum; /* 0 jonswap, 1 bretschneider */
    int period;   /* 0 te, 1 tp */
    double hs_step, hs_max, p_step, p_min, p_max;
    int dir_bins;
} opts;

static int number(const char *verb, const char *name, const char *s, double *v)
{
    char *end;
    *v = strtod(s, &end);
    if (*end != '\0' || !isfinite(*v))
        return sy_cli_usage_error(verb, "%s expects a number, got '%s'", name, s);
    return SY_EXIT_OK;
}

static int parse(int argc, char **argv, opts *o)
{
    enum { O_HS = 256, O_TP, O_TE, O_GAMMA, O_SPREAD, O_DEPTH, O_SPEC, O_PERIOD, O_HSSTEP, O_HSMAX, O_PSTEP, O_PMIN, O_PMAX, O_DIRS };
    static const struct option lo[] = {
        {"output", required_argument, NULL, 'o'},   {"hs", required_argument, NULL, O_HS},
        {"tp", required_argument, NULL, O_TP},      {"te", required_argument, NULL, O_TE},
        {"gamma", required_argument, NULL, O_GAMMA}, {"spreading", required_argument, NULL, O_SPREAD},
        {"depth", required_argument, NULL, O_DEPTH}, {"spectrum", required_argument, NULL, O_SPEC},
        {"period", required_argument, NULL, O_PERIOD}, {"hs-step", required_argument, NULL, O_HSSTEP},
        {"hs-max", required_argument, NULL, O_HSMAX}, {"period-step", required_argument, NULL, O_PSTEP},
        {"period-min", required_argument, NULL, O_PMIN}, {"period-max", required_argument, NULL, O_PMAX},
        {"dir-bins", required_argument, NULL, O_DIRS}, {"quiet", no_argument, NULL, 'q'},
        {NULL, 0, NULL, 0}};
    memset(o, 0, sizeof *o);
    o->gamma = NAN, o->depth = NAN, o->hs_step = 0.5, o->hs_max = 10, o->p_step = 1, o->p_min = 1, o->p_max = 21;
    int c, bad = 0;
    double v;
    optind = 2;
    while (!bad && (c = getopt_long(argc, argv, "o:q", lo, NULL)) != -1) {
        switch (c) {
        case 'o': o->out = optarg; break;
        case 'q': sy_cli_set_quiet(1); break;
        case O_HS: bad = number("sea", "--hs", optarg, &o->hs); break;
        case O_TP: bad = number("sea", "--tp", optarg, &o->tp); break;
        case O_TE: bad = number("sea", "--te", optarg, &o->te); break;
        case O_GAMMA: bad = number("sea", "--gamma", optarg, &o->gamma); break;
        case O_SPREAD: bad = number("sea", "--spreading", optarg, &o->spreading); break;
        case O_DEPTH: bad = number("sea", "--depth", optarg, &o->depth); break;
        case O_HSSTEP: bad = number("sea", "--hs-step", optarg, &o->hs_step); break;
        case O_HSMAX: bad = number("sea", "--hs-max", optarg, &o->hs_max); break;
        case O_PSTEP: bad = number("sea", "--period-step", optarg, &o->p_step); break;
        case O_PMIN: bad = number("sea", "--period-min", optarg, &o->p_min); break;
        case O_PMAX: bad = number("sea", "--period-max", optarg, &o->p_max); break;
        case O_DIRS:
            bad = number("sea", "--dir-bins", optarg, &v);
            if (!bad && (v < 0 || v > 72 || v != floor(v)))
                bad = sy_cli_usage_error("sea", "--dir-bins expects a whole number 0..72, got '%s'", optarg);
            o->dir_bins = (int)v;
            break;
        case O_SPEC:
            if (strcmp(optarg, "jonswap") == 0 || strcmp(optarg, "bretschneider") == 0)
                o->spectrum = optarg[0] == 'b';
            else
                bad = sy_cli_usage_error("sea", "--spectrum expects jonswap or bretschneider, got '%s'", optarg);
            break;
        case O_PERIOD:
            if (strcmp(optarg, "te") == 0 || strcmp(optarg, "tp") == 0)
                o->period = optarg[1] == 'p';
            else
                bad = sy_cli_usage_error("sea", "--period expects te or tp, got '%s'", optarg);
            break;
        default: bad = sy_cli_usage_error("sea", "unknown option"); break;
        }
    }
    return bad;
}

static int spec_init(const opts *o, double hs, double per, int per_is_tp, sy_sea_spectrum *sp, sy_error *err)
{
    sy_sea_spectrum_spec spec = {0};
    spec.kind = o->spectrum ? SY_SEA_PM : SY_SEA_JONSWAP;
    spec.hs = hs;
    spec.gamma = o->spectrum ? 0 : (isnan(o->gamma) ? 3.3 : o->gamma);
    spec.norm = SY_SEA_NORM_EXACT;
    if (per_is_tp)
        spec.tp = per;
    else
        spec.te = per;
    return sy_sea_spectrum_init(sp, &spec, err);
}

typedef struct jctx {
    const opts *o;
    double depth;
    sy_climate_period_kind kind;
} jctx;

static int bin_power(const sy_climate_bin *bin, void *ctx, double *q, sy_error *err)
{
    const jctx *c = ctx;
    sy_sea_spectrum sp;
    int rc = spec_init(c->o, bin->hs, bin->period, c->kind == SY_CLIMATE_TP, &sp, err);
    return rc == SY_OK ? sy_sea_spectrum_power(&sp, 1025.0, 9.81, c->depth, q, err) : rc;
}

static int summary(const opts *o, const char *file)
{
    sy_error err = SY_ERROR_INIT;
    sy_climate_table *t = NULL;
    int rc = sy_climate_table_load(&t, file, &err);
    if (rc != SY_OK)
        return sy_cli_fail("sea", rc, &err);
    const sy_climate_bins *b = sy_climate_table_bins(t);
    const sy_climate_meta *meta = sy_climate_table_meta(t);
    sy_climate_summary s;
    rc = sy_climate_table_summarise(t, &s, &err);
    double depth = isfinite(o->depth) ? o->depth : isfinite(meta->depth) ? meta->depth : INFINITY;
    jctx jc = {o, depth, b->period};
    sy_climate_average avg = {0};
    if (rc == SY_OK)
        rc = sy_climate_table_average(t, bin_power, &jc, &avg, &err);
    if (rc == SY_OK) {
        printf("climate      %s%s\n", file, meta->invented ? "  (INVENTED demo data)" : "");
        if (meta->site && meta->site[0])
            printf("site         %s\n", meta->site);
        if (meta->source && meta->source[0])
            printf("source       %s\n", meta->source);
        printf("bins         %zu Hs x %zu %s%s, %zu with occurrence\n", b->n_hs, b->n_period,
               sy_climate_period_name(b->period), b->n_dir ? " x directions" : "", s.n_nonzero);
        printf("occurrence   total %g (%s) = %.1f h/yr of %.0f\n", s.total,
               sy_climate_occurrence_name(sy_climate_table_occurrence_kind(t)), s.total_hours, s.hours_per_year);
        if (isfinite(meta->record_years))
            printf("record       %.2f years\n", meta->record_years);
        printf("Hs range     %g .. %g m\n", s.hs_min, s.hs_max);
        printf("%s range     %g .. %g s\n", sy_climate_period_name(b->period), s.period_min, s.period_max);
        printf("mean J       %.2f kW/m (%s spectrum, rho 1025 kg/m^3, g 9.81 m/s^2, %s)\n", avg.mean / 1e3,
               o->spectrum ? "Bretschneider" : "JONSWAP", isfinite(depth) ? "finite depth" : "deep water");
        if (isfinite(depth))
            printf("depth        %g m\n", depth);
    }
    sy_climate_table_free(t);
    return rc == SY_OK ? SY_EXIT_OK : sy_cli_fail("sea", rc, &err);
}

static int import(const opts *o, const char *file)
{
    if (o->out == NULL)
        return sy_cli_usage_error("sea", "import needs -o TABLE.nc");
    sy_error err = SY_ERROR_INIT;
    sy_climate_table *t = NULL;
    int rc = sy_climate_table_read_csv(&t, file, &err);
    if (rc == SY_OK)
        rc = sy_climate_table_write(t, o->out, "converted from CSV by swellyield sea import", &err);
    sy_climate_table_free(t);
    return rc == SY_OK ? SY_EXIT_OK : sy_cli_fail("sea", rc, &err);
}

static int bin(const opts *o, const char *file)
{
    if (o->out == NULL)
        return sy_cli_usage_error("sea", "bin needs -o TABLE.nc");
    if (!(o->hs_step > 0 && o->hs_max > o->hs_step && o->p_step > 0 && o->p_min > 0 && o->p_max > o->p_min))
        return sy_cli_usage_error("sea", "bin edges need --hs-step > 0, --hs-max > step, 0 < --period-min < --period-max");
    size_t nh = (size_t)ceil(o->hs_max / o->hs_step - 1e-9), np = (size_t)ceil((o->p_max - o->p_min) / o->p_step - 1e-9);
    if (nh > 1000 || np > 1000)
        return sy_cli_usage_error("sea", "more than 1000 bins per axis: choose larger steps");
    double *he = malloc((nh + 1) * sizeof *he), *pe = malloc((np + 1) * sizeof *pe), *dc = malloc(72 * sizeof *dc);
    for (size_t i = 0; he && i <= nh; i++)
        he[i] = (double)i * o->hs_step;
    for (size_t i = 0; pe && i <= np; i++)
        pe[i] = o->p_min + (double)i * o->p_step;
    for (int i = 0; dc && i < o->dir_bins; i++)
        dc[i] = 360.0 * i / o->dir_bins;
    sy_climate_bins bins = {nh, he, np, pe, o->period ? SY_CLIMATE_TP : SY_CLIMATE_TE, (size_t)o->dir_bins, dc,
                            o->dir_bins ? 360.0 / o->dir_bins : 0};
    sy_error err = SY_ERROR_INIT;
    sy_climate_series *s = NULL;
    sy_climate_table *t = NULL;
    sy_climate_bin_report rep;
    int rc = he && pe && dc ? SY_OK : sy_error_set(&err, SY_ENOMEM, "bin edges");
    if (rc == SY_OK)
        rc = sy_climate_series_read(&s, file, bins.period, o->dir_bins > 0, &err);
    if (rc == SY_OK)
        rc = sy_climate_series_bin(&t, s, &bins, SY_CLIMATE_GAPS_SCALE, &rep, &err);
    if (rc == SY_OK)
        rc = sy_climate_table_write(t, o->out, "binned from a hindcast by swellyield sea bin", &err);
    if (rc == SY_OK)
        printf("binned %zu records (%zu missing skipped, %zu outside the bins) over %.2f years -> %s\n", rep.n_records,
               rep.n_missing, rep.n_outside, rep.record_years, o->out);
    sy_climate_table_free(t);
    sy_climate_series_free(s);
    free(he);
    free(pe);
    free(dc);
    return rc == SY_OK ? SY_EXIT_OK : sy_cli_fail("sea", rc, &err);
}

typedef struct spec_out {
    const opts *o;
    const sy_sea_spectrum *sp;
    const sy_sea_spreading *spr;
    double J, depth;
} spec_out;

static int fill_spectrum(FILE *f, const void *ctx)
{
    const spec_out *c = ctx;
    char desc[256];
    sy_sea_spectrum_describe(c->sp, desc, sizeof desc);
    fprintf(f, "# %s\n# Hm0 %.4f m, Tp %.4f s, Te %.4f s, Tz %.4f s, eps0 %.4f, J %.3f kW/m (%s, rho 1025, g 9.81)\n",
            desc, c->sp->hm0, c->sp->tp, c->sp->te, c->sp->tz, c->sp->eps0, c->J / 1e3,
            isfinite(c->depth) ? "finite depth" : "deep water");
    fprintf(f, "omega_rad_s,S_m2_s_per_rad\n");
    for (int i = 1; i <= 300; i++) {
        double w = 0.01 * i;
        fprintf(f, "%.2f,%.8g\n", w, sy_sea_spectrum_eval(c->sp, w));
    }
    if (c->o->spreading > 0) {
        double beta[36], D[36], outside;
        for (int j = 0; j < 36; j++)
            beta[j] = (j * 10.0 - 180.0) * M_PI / 180.0;
        if (sy_sea_spreading_weights(c->spr, beta, 36, D, &outside, NULL) != SY_OK)
            return 1;
        fprintf(f, "# cos-2s spreading s = %g about heading 0: weight of each 10-degree heading cell\n", c->o->spreading);
        fprintf(f, "heading_deg,weight\n");
        for (int j = 0; j < 36; j++)
            fprintf(f, "%.0f,%.8g\n", j * 10.0 - 180.0, D[j]);
    }
    return ferror(f);
}

static int spectrum(const opts *o)
{
    if (!(o->hs > 0) || (o->tp > 0) == (o->te > 0))
        return sy_cli_usage_error("sea", "spectrum needs --hs > 0 and exactly one of --tp, --te");
    sy_error err = SY_ERROR_INIT;
    sy_sea_spectrum sp;
    sy_sea_spreading spr;
    spec_out c = {o, &sp, &spr, 0, isfinite(o->depth) ? o->depth : INFINITY};
    int rc = spec_init(o, o->hs, o->tp > 0 ? o->tp : o->te, o->tp > 0, &sp, &err);
    if (rc == SY_OK)
        rc = sy_sea_spectrum_power(&sp, 1025.0, 9.81, c.depth, &c.J, &err);
    if (rc == SY_OK)
        rc = sy_sea_spreading_init(&spr, o->spreading, 0.0, &err);
    if (rc == SY_OK && o->out != NULL)
        rc = sy_outputs_write_file(o->out, fill_spectrum, &c, &err);
    else if (rc == SY_OK && fill_spectrum(stdout, &c) != 0)
        rc = sy_error_set(&err, SY_EIO, "stdout: write failed");
    return rc == SY_OK ? SY_EXIT_OK : sy_cli_fail("sea", rc, &err);
}

int sy_cmd_sea(int argc, char **argv)
{
    if (argc < 2 || strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
        fputs(help, argc < 2 ? stderr : stdout);
        return argc < 2 ? SY_EXIT_USAGE : SY_EXIT_OK;
    }
    const char *action = argv[1];
    opts o;
    int bad = parse(argc, argv, &o);
    if (bad)
        return bad;
    const char *file = optind < argc ? argv[optind] : NULL;
    if (strcmp(action, "spectrum") == 0)
        return file == NULL ? spectrum(&o) : sy_cli_usage_error("sea", "spectrum takes no file");
    if (file == NULL || optind + 1 != argc)
        return sy_cli_usage_error("sea", "%s expects exactly one file", action);
    if (strcmp(action, "summary") == 0)
        return summary(&o, file);
    if (strcmp(action, "import") == 0)
        return import(&o, file);
    if (strcmp(action, "bin") == 0)
        return bin(&o, file);
    return sy_cli_usage_error("sea", "unknown action '%s' (summary, import, bin, spectrum)", action);
}
