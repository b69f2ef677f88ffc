/* report.md: one human page per run, next to the pictures. Headline figures of the
 * model's [pto] tuning, the four strategies side by side, relative links to the
 * pictures, the hours-per-year convention and the standard cautions
 * (sy_outputs_cautions). Written atomically through sy_outputs_write_file. */
#include "plot_impl.h"
#include "swellyield/outputs.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

typedef struct {
    const sy_model *m;
    const sy_climate_table *cl;
    const sy_yield_result *r;
    const char *ext;
    int with_poles;
    const double *bands;
    size_t n_bands;
} report_ctx;

/* A number or "n/a" (NAN: not defined for that strategy, e.g. no rating). */
static void num(FILE *f, const char *fmt, double v)
{
    if (isfinite(v))
        fprintf(f, fmt, v);
    else
        fputs("n/a", f);
}

static int fill(FILE *f, const void *vctx)
{
    const report_ctx *c = vctx;
    const sy_model *m = c->m;
    const sy_yield_result *r = c->r;
    const sy_climate_meta *meta = sy_climate_table_meta(c->cl);
    const sy_yield_strategy *h = &r->s[m->tuning];
    fprintf(f, "# swellyield run report\n\n");
    fprintf(f, "Project `%s`: %zu devices; climate `%s`", m->path, m->n_devices, m->climate);
    if (meta->site != NULL && meta->site[0] != '\0')
        fprintf(f, " (site: %s)", meta->site);
    fprintf(f, "%s.\n\n", meta->invented ? " -- **invented data**, for demonstration only" : "");
    fprintf(f, "## Headline (tuning `%s`)\n\n", sy_yield_strategy_name((int)m->tuning));
    fprintf(f, "| figure | value |\n|---|---|\n");
    fprintf(f, "| annual energy | ");
    num(f, "%.1f MWh/yr", h->energy_array / 1e6);
    fprintf(f, " |\n| mean power | ");
    num(f, "%.1f kW", h->mean_power / 1e3);
    fprintf(f, " |\n| q-factor | ");
    num(f, "%.3f", h->q_factor);
    fprintf(f, " |\n| capacity factor | ");
    num(f, "%.3f", h->capacity_factor);
    fprintf(f, " |\n| mean wave resource | ");
    num(f, "%.1f kW/m", r->mean_resource / 1e3);
    fprintf(f, " |\n\n## Tuning strategies\n\n");
    fprintf(f, "| strategy | annual energy (MWh/yr) | mean power (kW) | q-factor | stroke exceedances (bins) |\n");
    fprintf(f, "|---|---:|---:|---:|---:|\n");
    for (int s = 0; s < SY_YIELD_N_STRATEGIES; s++) {
        const sy_yield_strategy *t = &r->s[s];
        fprintf(f, "| %s | ", sy_yield_strategy_name(s));
        num(f, "%.1f", t->energy_array / 1e6);
        fputs(" | ", f);
        num(f, "%.1f", t->mean_power / 1e3);
        fputs(" | ", f);
        num(f, "%.3f", t->q_factor);
        fprintf(f, " | %zu |\n", t->n_stroke_exceeded);
    }
    fprintf(f, "\n`reactive_bound` is a theoretical ceiling (complex-conjugate control, no stroke limit, "
               "no rating), not a production figure.\n\n## Pictures\n\n");
    const char *ext = c->ext;
    fprintf(f, "- [Array layout](layout.%s): devices to scale, coloured by annual energy (per_sea_state), "
               "main wave direction.\n", ext);
    fprintf(f, "- [Power matrix](power_matrix.%s): array power per Hs x period bin (`%s`), occurrence "
               "contours.\n", ext, sy_yield_strategy_name((int)m->tuning));
    fprintf(f, "- [q-factor](q_factor.%s): regular-wave q-factor against frequency, main headings, fixed "
               "damping and reactive bound.\n", ext);
    fprintf(f, "- [Spectrum](spectrum.%s): the most frequent sea state and the array's absorbed power "
               "in it (fixed damping).\n", ext);
    if (c->with_poles)
        fprintf(f, "- [Resonances](poles.%s): poles in the complex frequency plane; "
                   "[free decay](time_response.png) of the first device by the pole sum against direct "
                   "inversion (written when motion poles were found).\n", ext);
    if (strcmp(ext, "png") == 0)
        fprintf(f, "\n![Array layout](layout.png)\n\n![Power matrix](power_matrix.png)\n");
    if (c->n_bands > 0) {
        fprintf(f, "\n## Flagged frequency bands (shaded on the q-factor picture)\n\n"
                   "| band (rad/s) | share of the annual energy (`%s`) |\n|---|---:|\n",
                sy_yield_strategy_name((int)m->tuning));
        for (size_t j = 0; j < c->n_bands; j++) {
            fprintf(f, "| %.3f .. %.3f | ", c->bands[2 * j], c->bands[2 * j + 1]);
            /* Shares exist only when the yield was computed with these same bands. */
            if (r->n_bands == c->n_bands && h->energy_band != NULL && h->energy_array > 0)
                fprintf(f, "%.1f %% |\n", 100.0 * h->energy_band[j] / h->energy_array);
            else
                fputs("n/a |\n", f);
        }
    }
    fprintf(f, "\n## Hours per year\n\nAnnual figures use %.0f h per year (365.25 days); the climate "
               "covers %.0f h/yr with non-zero occurrence (the rest, calm or outside the table, yields "
               "nothing); mean power = annual energy / %.0f h.\n",
            SY_CLIMATE_HOURS_PER_YEAR, r->hours_covered, SY_CLIMATE_HOURS_PER_YEAR);
    fprintf(f, "\n## Cautions\n\n");
    const char *t = sy_outputs_cautions();
    while (*t) {
        const char *nl = strchr(t, '\n');
        size_t len = nl ? (size_t)(nl - t) : strlen(t);
        if (len > 0)
            fprintf(f, "- %.*s\n", (int)len, t);
        t += len + (nl != NULL);
    }
    return ferror(f) ? -1 : 0;
}

int syi_plot_report(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                    const sy_yield_result *r, int with_poles, const double *bands, size_t n_bands,
                    sy_error *err)
{
    char path[4096 + 16];
    int n = snprintf(path, sizeof path, "%s/report.md", dir);
    if (n < 0 || (size_t)n >= sizeof path)
        return sy_error_set(err, SY_EINVAL, "report path in '%s' is too long", dir);
    report_ctx c = {m, cl, r, ext, with_poles, bands, n_bands};
    return sy_outputs_write_file(path, fill, &c, err);
}
