/* The scatter table: creation, copies, accessors, metadata, and the checks every reader
 * shares (bins sorted and non-overlapping, occurrence finite, non-negative, non-zero).
 * Units: m, s, nautical degrees; occurrence as the source gave it (climate.h). */
#include "climate_impl.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* Direction centres and widths come from files as decimals (22.5, 337.5); spacing
 * checks allow this much rounding, degrees. */
#define DIR_TOL 1e-9
/* Upper bound for an hours-per-year table: a leap year, h. */
#define HOURS_LEAP_YEAR 8784.0

const char *sy_climate_period_name(sy_climate_period_kind kind)
{
    return kind == SY_CLIMATE_TP ? "Tp" : "Te";
}

const char *sy_climate_occurrence_name(sy_climate_occurrence_kind kind)
{
    return kind == SY_CLIMATE_FRACTION ? "fraction" : "hours per year";
}

char *syi_climate_strdup(const char *s)
{
    if (s == NULL)
        s = "";
    size_t n = strlen(s) + 1;
    char *c = malloc(n);
    if (c != NULL)
        memcpy(c, s, n);
    return c;
}

const char *syi_climate_strip_invented(const char *s)
{
    size_t n = strlen(SYI_INVENTED_SENTENCE);
    if (s == NULL || strncmp(s, SYI_INVENTED_SENTENCE, n) != 0)
        return s;
    s += n;
    while (*s == ' ')
        s++;
    return s;
}

static int check_edges(const double *e, size_t n_bins, double lowest, int lowest_open,
                       const char *what, const char *unit, const char *where, sy_error *err)
{
    const char *w = where != NULL ? where : "scatter table";
    if (n_bins == 0 || e == NULL)
        return sy_error_set(err, SY_EINPUT, "%s: %s bins: got none, expected at least one",
                            w, what);
    for (size_t i = 0; i <= n_bins; i++) {
        if (!isfinite(e[i]))
            return sy_error_set(err, SY_EINPUT, "%s: %s edge %zu is %g, expected a finite value",
                                w, what, i, e[i]);
        if (i == 0 && (lowest_open ? !(e[0] > lowest) : !(e[0] >= lowest)))
            return sy_error_set(err, SY_EINPUT, "%s: %s edge 0 is %g %s, expected %s %g",
                                w, what, e[0], unit, lowest_open ? ">" : ">=", lowest);
        if (i > 0 && !(e[i] > e[i - 1]))
            return sy_error_set(err, SY_EINPUT,
                                "%s: %s edges unsorted or overlapping: edge %zu = %g %s after "
                                "%g, expected strictly increasing",
                                w, what, i, e[i], unit, e[i - 1]);
    }
    return SY_OK;
}

int syi_climate_check_bins(const sy_climate_bins *b, const char *where, sy_error *err)
{
    const char *w = where != NULL ? where : "scatter table";
    if (b == NULL)
        return sy_error_set(err, SY_EINVAL, "%s: no bins given", w);
    if (b->period != SY_CLIMATE_TE && b->period != SY_CLIMATE_TP)
        return sy_error_set(err, SY_EINVAL, "%s: period kind %d, expected Te or Tp", w,
                            (int)b->period);
    int rc = check_edges(b->hs_edges, b->n_hs, 0.0, 0, "Hs", "m", where, err);
    if (rc == SY_OK)
        rc = check_edges(b->period_edges, b->n_period, 0.0, 1, "period", "s", where, err);
    if (rc != SY_OK || b->n_dir == 0)
        return rc;
    double wd = b->dir_width;
    if (b->dir_centres == NULL)
        return sy_error_set(err, SY_EINPUT, "%s: %zu direction bins but no centres", w, b->n_dir);
    if (!(wd > 0.0) || !(wd * (double)b->n_dir <= 360.0 + DIR_TOL))
        return sy_error_set(err, SY_EINPUT,
                            "%s: direction bin width %g degrees for %zu bins, expected > 0 "
                            "and at most 360/%zu",
                            w, wd, b->n_dir, b->n_dir);
    for (size_t d = 0; d < b->n_dir; d++) {
        double c = b->dir_centres[d];
        if (!(c >= 0.0 && c < 360.0))
            return sy_error_set(err, SY_EINPUT,
                                "%s: direction centre %zu is %g degrees, expected in [0, 360)",
                                w, d, c);
        if (d > 0 && !(c - b->dir_centres[d - 1] >= wd - DIR_TOL))
            return sy_error_set(err, SY_EINPUT,
                                "%s: direction bins unsorted or overlapping: centre %zu = %g "
                                "after %g with width %g, expected increasing by >= the width",
                                w, d, c, b->dir_centres[d - 1], wd);
    }
    double wrap = b->dir_centres[0] + 360.0 - b->dir_centres[b->n_dir - 1];
    if (b->n_dir > 1 && !(wrap >= wd - DIR_TOL))
        return sy_error_set(err, SY_EINPUT,
                            "%s: direction bins overlap through north: centres %g and %g with "
                            "width %g",
                            w, b->dir_centres[b->n_dir - 1], b->dir_centres[0], wd);
    return SY_OK;
}

size_t syi_climate_dir_bin(const sy_climate_bins *b, double from_deg)
{
    for (size_t d = 0; d < b->n_dir; d++) {
        double diff = fmod(from_deg - b->dir_centres[d], 360.0);   /* (-360, 360) */
        if (diff < -180.0)
            diff += 360.0;
        else if (diff >= 180.0)
            diff -= 360.0;
        if (diff >= -0.5 * b->dir_width && diff < 0.5 * b->dir_width)
            return d;
    }
    return (size_t)-1;
}

void sy_climate_table_free(sy_climate_table *t)
{
    if (t == NULL)
        return;
    free(t->hs_edges);
    free(t->period_edges);
    free(t->dir_centres);
    free(t->occ);
    free(t->site);
    free(t->source);
    free(t->institution);
    free(t->comment);
    free(t);
}

int sy_climate_table_create(sy_climate_table **out, const sy_climate_bins *bins,
                            sy_climate_occurrence_kind occurrence, sy_error *err)
{
    if (out == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table: NULL output");
    *out = NULL;
    if (occurrence != SY_CLIMATE_HOURS && occurrence != SY_CLIMATE_FRACTION)
        return sy_error_set(err, SY_EINVAL, "scatter table: occurrence kind %d, expected "
                            "hours or fraction", (int)occurrence);
    int rc = syi_climate_check_bins(bins, NULL, err);
    if (rc != SY_OK)
        return rc;
    size_t nd = bins->n_dir > 0 ? bins->n_dir : 1;
    sy_climate_table *t = calloc(1, sizeof *t);
    if (t != NULL) {
        t->n_values = bins->n_hs * bins->n_period * nd;
        t->hs_edges = malloc((bins->n_hs + 1) * sizeof *t->hs_edges);
        t->period_edges = malloc((bins->n_period + 1) * sizeof *t->period_edges);
        t->dir_centres = bins->n_dir > 0 ? malloc(bins->n_dir * sizeof *t->dir_centres) : NULL;
        t->occ = calloc(t->n_values, sizeof *t->occ);
        t->site = syi_climate_strdup(NULL);
        t->source = syi_climate_strdup(NULL);
        t->institution = syi_climate_strdup(NULL);
        t->comment = syi_climate_strdup(NULL);
    }
    if (t == NULL || t->hs_edges == NULL || t->period_edges == NULL || t->occ == NULL ||
        (bins->n_dir > 0 && t->dir_centres == NULL) || t->site == NULL ||
        t->source == NULL || t->institution == NULL || t->comment == NULL) {
        sy_climate_table_free(t);
        return sy_error_set(err, SY_ENOMEM, "scatter table of %zu x %zu x %zu bins",
                            bins->n_hs, bins->n_period, nd);
    }
    memcpy(t->hs_edges, bins->hs_edges, (bins->n_hs + 1) * sizeof *t->hs_edges);
    memcpy(t->period_edges, bins->period_edges, (bins->n_period + 1) * sizeof *t->period_edges);
    if (bins->n_dir > 0)
        memcpy(t->dir_centres, bins->dir_centres, bins->n_dir * sizeof *t->dir_centres);
    t->bins = *bins;
    t->bins.hs_edges = t->hs_edges;
    t->bins.period_edges = t->period_edges;
    t->bins.dir_centres = t->dir_centres;
    if (bins->n_dir == 0)
        t->bins.dir_width = 0.0;
    t->kind = occurrence;
    t->meta = (sy_climate_meta){t->site, t->source, t->institution, t->comment, NAN, NAN, 0};
    *out = t;
    return SY_OK;
}

int sy_climate_table_copy(sy_climate_table **out, const sy_climate_table *t, sy_error *err)
{
    if (t == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table copy: NULL table");
    sy_climate_table *c = NULL;
    int rc = sy_climate_table_create(&c, &t->bins, t->kind, err);
    if (rc == SY_OK)
        rc = sy_climate_table_set_meta(c, &t->meta, err);
    if (rc != SY_OK) {
        sy_climate_table_free(c);
        return rc;
    }
    memcpy(c->occ, t->occ, t->n_values * sizeof *c->occ);
    *out = c;
    return SY_OK;
}

const sy_climate_bins *sy_climate_table_bins(const sy_climate_table *t) { return &t->bins; }

sy_climate_occurrence_kind sy_climate_table_occurrence_kind(const sy_climate_table *t)
{
    return t->kind;
}

size_t sy_climate_table_size(const sy_climate_table *t) { return t->n_values; }

size_t sy_climate_table_index(const sy_climate_table *t, size_t i_hs, size_t i_period,
                              size_t i_dir)
{
    size_t nd = t->bins.n_dir > 0 ? t->bins.n_dir : 1;
    return (i_hs * t->bins.n_period + i_period) * nd + i_dir;
}

const double *sy_climate_table_occurrence(const sy_climate_table *t) { return t->occ; }

double *sy_climate_table_occurrence_mut(sy_climate_table *t) { return t->occ; }

double sy_climate_table_hours(const sy_climate_table *t, size_t index)
{
    double v = t->occ[index];
    return t->kind == SY_CLIMATE_FRACTION ? v * SY_CLIMATE_HOURS_PER_YEAR : v;
}

const sy_climate_meta *sy_climate_table_meta(const sy_climate_table *t) { return &t->meta; }

int sy_climate_table_set_meta(sy_climate_table *t, const sy_climate_meta *m, sy_error *err)
{
    if (t == NULL || m == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table metadata: NULL argument");
    char *s[4] = {syi_climate_strdup(m->site), syi_climate_strdup(m->source),
                  syi_climate_strdup(m->institution),
                  syi_climate_strdup(syi_climate_strip_invented(m->comment))};
    if (s[0] == NULL || s[1] == NULL || s[2] == NULL || s[3] == NULL) {
        for (int i = 0; i < 4; i++)
            free(s[i]);
        return sy_error_set(err, SY_ENOMEM, "scatter table metadata");
    }
    free(t->site);
    free(t->source);
    free(t->institution);
    free(t->comment);
    t->site = s[0];
    t->source = s[1];
    t->institution = s[2];
    t->comment = s[3];
    t->meta = (sy_climate_meta){t->site, t->source, t->institution, t->comment,
                                m->record_years, m->depth, m->invented != 0};
    return SY_OK;
}

int sy_climate_table_validate(const sy_climate_table *t, const char *where, sy_error *err)
{
    const char *w = where != NULL ? where : "scatter table";
    if (t == NULL)
        return sy_error_set(err, SY_EINVAL, "%s: NULL table", w);
    int rc = syi_climate_check_bins(&t->bins, where, err);
    if (rc != SY_OK)
        return rc;
    size_t nd = t->bins.n_dir > 0 ? t->bins.n_dir : 1;
    double total = 0.0;
    for (size_t i = 0; i < t->n_values; i++) {
        double v = t->occ[i];
        if (!(v >= 0.0) || !isfinite(v)) {
            size_t id = i % nd, ip = (i / nd) % t->bins.n_period, ih = i / nd / t->bins.n_period;
            return sy_error_set(err, SY_EINPUT,
                                "%s: variable 'occurrence': value %g at [hs %zu, period %zu, "
                                "direction %zu], expected a finite value >= 0",
                                w, v, ih, ip, id);
        }
        total += v;
    }
    if (!(total > 0.0))
        return sy_error_set(err, SY_EINPUT,
                            "%s: variable 'occurrence': total occurrence is 0 over %zu bins, "
                            "expected > 0",
                            w, t->n_values);
    double limit = (t->kind == SY_CLIMATE_FRACTION ? 1.0 : HOURS_LEAP_YEAR) *
                   (1.0 + SY_CLIMATE_TOTAL_SLACK);
    if (total > limit)
        return sy_error_set(err, SY_EINPUT,
                            "%s: variable 'occurrence': total %s is %g, expected at most %g",
                            w, sy_climate_occurrence_name(t->kind), total, limit);
    if (t->meta.depth == t->meta.depth && !(t->meta.depth > 0.0))
        return sy_error_set(err, SY_EINPUT, "%s: variable 'depth': water depth %g m, expected > 0", w,
                            t->meta.depth);
    return SY_OK;
}

static int units_in(const char *u, const char *const *list)
{
    if (u == NULL)
        return 0;
    for (; *list != NULL; list++)
        if (strcmp(u, *list) == 0)
            return 1;
    return 0;
}

int syi_climate_units_metre(const char *u)
{
    static const char *const ok[] = {"m", "meter", "meters", "metre", "metres", NULL};
    return units_in(u, ok);
}

int syi_climate_units_second(const char *u)
{
    static const char *const ok[] = {"s", "sec", "second", "seconds", NULL};
    return units_in(u, ok);
}

int syi_climate_units_hertz(const char *u)
{
    static const char *const ok[] = {"s-1", "s^-1", "1/s", "Hz", "hertz", NULL};
    return units_in(u, ok);
}

int syi_climate_units_degree(const char *u)
{
    static const char *const ok[] = {"degree", "degrees", "degree_true", "degrees_true",
                                     "degree_T", NULL};
    return units_in(u, ok);
}
