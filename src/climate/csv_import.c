/* Long-form CSV scatter tables (docs/formats.md): one row per bin with explicit limits,
 *   hs_min,hs_max,te_min,te_max[,dir_from_min,dir_from_max],hours_per_year
 * (tp_min/tp_max for peak period; fraction or percent instead of hours_per_year), '#'
 * lines before or between rows for comments and "key: value" metadata. Parsed with
 * libcsv, one line at a time so messages carry the line number. Bin edges are the union
 * of the limits in the file; a row must cover exactly one bin between neighbouring
 * edges, and each bin may appear once. Units: m, s, nautical degrees (from). */
#include "climate_impl.h"
#include "core/core_impl.h"

#include <csv.h>
#include <ctype.h>
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#define MAX_FIELDS 16
#define MAX_FIELD_LEN 128
/* Direction widths from decimal limits (e.g. 22.5) agree to this, degrees. */
#define DIR_TOL 1e-9

enum { C_HS_MIN, C_HS_MAX, C_T_MIN, C_T_MAX, C_DIR_MIN, C_DIR_MAX, C_OCC, C_COUNT };

typedef struct {
    char field[MAX_FIELDS][MAX_FIELD_LEN];
    size_t n_fields;
    int overflow;       /* too many fields or a field too long */
    int row_done;
} csv_row;

typedef struct {
    double v[C_COUNT];  /* limits and occurrence; direction limits NAN if absent */
    size_t line;
} bin_row;

static void on_field(void *s, size_t len, void *data)
{
    csv_row *r = data;
    if (r->n_fields >= MAX_FIELDS || len >= MAX_FIELD_LEN) {
        r->overflow = 1;
        return;
    }
    memcpy(r->field[r->n_fields], s, len);
    r->field[r->n_fields][len] = '\0';
    r->n_fields++;
}

static void on_row(int c, void *data)
{
    (void)c;
    ((csv_row *)data)->row_done = 1;
}

static char *trim(char *s)
{
    while (isspace((unsigned char)*s))
        s++;
    size_t n = strlen(s);
    while (n > 0 && isspace((unsigned char)s[n - 1]))
        s[--n] = '\0';
    return s;
}

static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

/* Sorted unique values of v[0..n-1] in place; returns the count. */
static size_t unique(double *v, size_t n)
{
    qsort(v, n, sizeof *v, cmp_double);
    size_t k = 0;
    for (size_t i = 0; i < n; i++)
        if (k == 0 || v[i] != v[k - 1])
            v[k++] = v[i];
    return k;
}

static size_t find(const double *v, size_t n, double x)
{
    const double *p = bsearch(&x, v, n, sizeof *v, cmp_double);
    return p != NULL ? (size_t)(p - v) : (size_t)-1;
}

typedef struct {
    const char *path;
    sy_error *err;
    int col[C_COUNT];             /* field index of each column, -1 if absent */
    const char *col_name[C_COUNT];
    sy_climate_period_kind period;
    sy_climate_occurrence_kind kind;
    double occ_scale;
    bin_row *rows;
    size_t n_rows, cap_rows;
    char *site, *source, *institution, *comment;
    double record_years, depth;
    int invented;
} importer;

static int parse_header(importer *im, csv_row *row, size_t line)
{
    static const struct { const char *name; int col; int period; int kind; double scale; } known[] = {
        {"hs_min", C_HS_MIN, -1, -1, 0}, {"hs_max", C_HS_MAX, -1, -1, 0},
        {"te_min", C_T_MIN, SY_CLIMATE_TE, -1, 0}, {"te_max", C_T_MAX, SY_CLIMATE_TE, -1, 0},
        {"tp_min", C_T_MIN, SY_CLIMATE_TP, -1, 0}, {"tp_max", C_T_MAX, SY_CLIMATE_TP, -1, 0},
        {"dir_from_min", C_DIR_MIN, -1, -1, 0}, {"dir_from_max", C_DIR_MAX, -1, -1, 0},
        {"hours_per_year", C_OCC, -1, SY_CLIMATE_HOURS, 1.0},
        {"fraction", C_OCC, -1, SY_CLIMATE_FRACTION, 1.0},
        {"percent", C_OCC, -1, SY_CLIMATE_FRACTION, 0.01},
    };
    int period = -1;
    for (size_t f = 0; f < row->n_fields; f++) {
        char *name = trim(row->field[f]);
        for (char *p = name; *p; p++)
            *p = (char)tolower((unsigned char)*p);
        size_t k = 0;
        while (k < sizeof known / sizeof known[0] && strcmp(name, known[k].name) != 0)
            k++;
        if (k == sizeof known / sizeof known[0])
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: unknown column '%s', expected hs_min, hs_max, te_min, "
                                "te_max (or tp_min, tp_max), [dir_from_min, dir_from_max,] and "
                                "hours_per_year, fraction or percent",
                                im->path, line, name);
        int c = known[k].col;
        if (im->col[c] >= 0)
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: column '%s' duplicates column '%s', expected each "
                                "quantity once",
                                im->path, line, name, im->col_name[c]);
        if (known[k].period >= 0) {
            if (period >= 0 && period != known[k].period)
                return sy_error_set(im->err, SY_EINPUT,
                                    "%s:%zu: column '%s' mixes Te and Tp limits, expected one "
                                    "period kind", im->path, line, name);
            period = known[k].period;
        }
        if (known[k].kind >= 0) {
            im->kind = (sy_climate_occurrence_kind)known[k].kind;
            im->occ_scale = known[k].scale;
        }
        im->col[c] = (int)f;
        im->col_name[c] = known[k].name;
    }
    static const char *const need[C_COUNT] = {"hs_min", "hs_max", "te_min or tp_min",
                                               "te_max or tp_max", NULL, NULL,
                                               "hours_per_year, fraction or percent"};
    for (int c = 0; c < C_COUNT; c++)
        if (need[c] != NULL && im->col[c] < 0)
            return sy_error_set(im->err, SY_EINPUT, "%s:%zu: header lacks column %s", im->path,
                                line, need[c]);
    if ((im->col[C_DIR_MIN] < 0) != (im->col[C_DIR_MAX] < 0))
        return sy_error_set(im->err, SY_EINPUT,
                            "%s:%zu: header has only one of dir_from_min, dir_from_max, "
                            "expected both or neither", im->path, line);
    im->period = (sy_climate_period_kind)period;
    return SY_OK;
}

static int parse_data(importer *im, csv_row *row, size_t line)
{
    size_t want = 0;
    for (int c = 0; c < C_COUNT; c++)
        want += im->col[c] >= 0;
    if (row->n_fields != want)
        return sy_error_set(im->err, SY_EINPUT, "%s:%zu: %zu fields, expected %zu as in the "
                            "header", im->path, line, row->n_fields, want);
    bin_row b = {{NAN, NAN, NAN, NAN, NAN, NAN, NAN}, line};
    for (int c = 0; c < C_COUNT; c++) {
        if (im->col[c] < 0)
            continue;
        char *s = trim(row->field[im->col[c]]), *end;
        errno = 0;
        double v = strtod(s, &end);
        if (s[0] == '\0' || *end != '\0' || errno == ERANGE)
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: column '%s': '%s' is not a number", im->path, line,
                                im->col_name[c], s);
        if (c != C_OCC && !isfinite(v))
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: column '%s': %g, expected a finite bin limit",
                                im->path, line, im->col_name[c], v);
        b.v[c] = v;
    }
    double occ = b.v[C_OCC];
    if (!(occ >= 0.0) || !isfinite(occ))
        return sy_error_set(im->err, SY_EINPUT,
                            "%s:%zu: column '%s': occurrence %g, expected a finite value >= 0",
                            im->path, line, im->col_name[C_OCC], occ);
    b.v[C_OCC] = occ * im->occ_scale;
    if (!(b.v[C_HS_MIN] < b.v[C_HS_MAX]))
        return sy_error_set(im->err, SY_EINPUT,
                            "%s:%zu: Hs bin %g-%g m, expected hs_min < hs_max", im->path, line,
                            b.v[C_HS_MIN], b.v[C_HS_MAX]);
    if (!(b.v[C_T_MIN] < b.v[C_T_MAX]))
        return sy_error_set(im->err, SY_EINPUT,
                            "%s:%zu: %s bin %g-%g s, expected %s < %s", im->path, line,
                            sy_climate_period_name(im->period), b.v[C_T_MIN], b.v[C_T_MAX],
                            im->col_name[C_T_MIN], im->col_name[C_T_MAX]);
    if (im->col[C_DIR_MIN] >= 0) {
        for (int c = C_DIR_MIN; c <= C_DIR_MAX; c++)
            if (!(b.v[c] >= 0.0 && b.v[c] <= 360.0))
                return sy_error_set(im->err, SY_EINPUT,
                                    "%s:%zu: column '%s': %g degrees, expected 0..360",
                                    im->path, line, im->col_name[c], b.v[c]);
        if (fmod(b.v[C_DIR_MAX] - b.v[C_DIR_MIN] + 360.0, 360.0) == 0.0)
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: direction bin %g-%g degrees is empty, expected a "
                                "sector (min > max wraps through north)",
                                im->path, line, b.v[C_DIR_MIN], b.v[C_DIR_MAX]);
    }
    if (im->n_rows == im->cap_rows) {
        size_t cap = im->cap_rows ? 2 * im->cap_rows : 64;
        bin_row *p = realloc(im->rows, cap * sizeof *p);
        if (p == NULL)
            return sy_error_set(im->err, SY_ENOMEM, "%s:%zu: rows", im->path, line);
        im->rows = p;
        im->cap_rows = cap;
    }
    im->rows[im->n_rows++] = b;
    return SY_OK;
}

/* "# key: value" metadata; other '#' lines are comments. */
static int parse_meta(importer *im, char *text, size_t line)
{
    char *colon = strchr(text, ':');
    if (colon == NULL)
        return SY_OK;
    *colon = '\0';
    char *key = trim(text), *val = trim(colon + 1);
    char **dst = NULL;
    if (strcmp(key, "site") == 0)
        dst = &im->site;
    else if (strcmp(key, "source") == 0)
        dst = &im->source;
    else if (strcmp(key, "institution") == 0)
        dst = &im->institution;
    else if (strcmp(key, "comment") == 0)
        dst = &im->comment;
    if (dst != NULL) {
        free(*dst);
        *dst = syi_climate_strdup(val);
        return *dst != NULL ? SY_OK : sy_error_set(im->err, SY_ENOMEM, "%s:%zu", im->path, line);
    }
    if (strcmp(key, "record_years") == 0 || strcmp(key, "depth_m") == 0) {
        char *end;
        double v = strtod(val, &end);
        if (val[0] == '\0' || *end != '\0' || !(v > 0.0) || !isfinite(v))
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: metadata '%s': '%s', expected a number > 0", im->path,
                                line, key, val);
        *(key[0] == 'r' ? &im->record_years : &im->depth) = v;
    } else if (strcmp(key, "invented") == 0) {
        if (strcmp(val, "yes") != 0 && strcmp(val, "no") != 0)
            return sy_error_set(im->err, SY_EINPUT,
                                "%s:%zu: metadata 'invented': '%s', expected yes or no",
                                im->path, line, val);
        im->invented = strcmp(val, "yes") == 0;
    }
    return SY_OK;
}

/* Bins from the rows, then the table. */
static int build(importer *im, sy_climate_table **out)
{
    size_t n = im->n_rows;
    int has_dir = im->col[C_DIR_MIN] >= 0;
    double *he = malloc(2 * n * sizeof *he), *pe = malloc(2 * n * sizeof *pe);
    double *dc = malloc((n + 1) * sizeof *dc);
    size_t *first = NULL;
    sy_climate_table *t = NULL;
    int rc = SY_OK;
    if (he == NULL || pe == NULL || dc == NULL)
        rc = sy_error_set(im->err, SY_ENOMEM, "%s: %zu rows", im->path, n);
    size_t nh = 0, np = 0, nd = 0;
    double width = 0.0;
    if (rc == SY_OK) {
        for (size_t i = 0; i < n; i++) {
            he[2 * i] = im->rows[i].v[C_HS_MIN];
            he[2 * i + 1] = im->rows[i].v[C_HS_MAX];
            pe[2 * i] = im->rows[i].v[C_T_MIN];
            pe[2 * i + 1] = im->rows[i].v[C_T_MAX];
        }
        nh = unique(he, 2 * n);
        np = unique(pe, 2 * n);
    }
    for (size_t i = 0; rc == SY_OK && has_dir && i < n; i++) {
        const bin_row *b = &im->rows[i];
        double w = fmod(b->v[C_DIR_MAX] - b->v[C_DIR_MIN] + 360.0, 360.0);
        double c = fmod(b->v[C_DIR_MIN] + 0.5 * w, 360.0);
        if (i == 0)
            width = w;
        if (fabs(w - width) > DIR_TOL)
            rc = sy_error_set(im->err, SY_EINPUT,
                              "%s:%zu: direction bin %g-%g is %g degrees wide, expected the "
                              "common width %g of line %zu",
                              im->path, b->line, b->v[C_DIR_MIN], b->v[C_DIR_MAX], w, width,
                              im->rows[0].line);
        dc[i] = c;
    }
    if (rc == SY_OK && has_dir) {
        nd = unique(dc, n);
        /* Merge centres that differ only by decimal rounding. */
        size_t k = 0;
        for (size_t d = 0; d < nd; d++)
            if (k == 0 || dc[d] - dc[k - 1] > DIR_TOL)
                dc[k++] = dc[d];
        nd = k;
    }
    sy_climate_bins bins = {nh - 1, he, np - 1, pe, im->period, nd, dc, width};
    if (rc == SY_OK)
        rc = syi_climate_check_bins(&bins, im->path, im->err);
    if (rc == SY_OK)
        rc = sy_climate_table_create(&t, &bins, im->kind, im->err);
    if (rc == SY_OK && (first = calloc(t->n_values, sizeof *first)) == NULL)
        rc = sy_error_set(im->err, SY_ENOMEM, "%s: bins", im->path);
    for (size_t i = 0; rc == SY_OK && i < n; i++) {
        const bin_row *b = &im->rows[i];
        size_t ih = find(he, nh, b->v[C_HS_MIN]), ip = find(pe, np, b->v[C_T_MIN]), id = 0;
        if (he[ih + 1] != b->v[C_HS_MAX]) {
            rc = sy_error_set(im->err, SY_EINPUT,
                              "%s:%zu: Hs bin %g-%g m overlaps another bin (edge %g m inside it), "
                              "expected non-overlapping bins",
                              im->path, b->line, b->v[C_HS_MIN], b->v[C_HS_MAX], he[ih + 1]);
            break;
        }
        if (pe[ip + 1] != b->v[C_T_MAX]) {
            rc = sy_error_set(im->err, SY_EINPUT,
                              "%s:%zu: %s bin %g-%g s overlaps another bin (edge %g s inside it), "
                              "expected non-overlapping bins",
                              im->path, b->line, sy_climate_period_name(im->period),
                              b->v[C_T_MIN], b->v[C_T_MAX], pe[ip + 1]);
            break;
        }
        if (has_dir) {
            double w = fmod(b->v[C_DIR_MAX] - b->v[C_DIR_MIN] + 360.0, 360.0);
            id = syi_climate_dir_bin(&t->bins, fmod(b->v[C_DIR_MIN] + 0.5 * w, 360.0));
        }
        size_t idx = sy_climate_table_index(t, ih, ip, id);
        if (first[idx] != 0) {
            rc = sy_error_set(im->err, SY_EINPUT,
                              "%s:%zu: bin Hs %g-%g m, %s %g-%g s%s listed again (first at "
                              "line %zu), expected each bin once",
                              im->path, b->line, b->v[C_HS_MIN], b->v[C_HS_MAX],
                              sy_climate_period_name(im->period), b->v[C_T_MIN], b->v[C_T_MAX],
                              has_dir ? " (same direction)" : "", first[idx]);
            break;
        }
        first[idx] = b->line;
        t->occ[idx] = b->v[C_OCC];
    }
    sy_climate_meta m = {im->site, im->source, im->institution, im->comment, im->record_years,
                         im->depth, im->invented};
    if (rc == SY_OK)
        rc = sy_climate_table_set_meta(t, &m, im->err);
    if (rc == SY_OK)
        rc = sy_climate_table_validate(t, im->path, im->err);
    free(he);
    free(pe);
    free(dc);
    free(first);
    if (rc != SY_OK) {
        sy_climate_table_free(t);
        return rc;
    }
    *out = t;
    return SY_OK;
}

/* Whole file into memory, NUL-terminated. */
static int slurp(const char *path, char **text, sy_error *err)
{
    int rc = syi_check_input_file(path, SYI_TEXT_MAX_BYTES, err);
    if (rc != SY_OK)
        return rc;
    FILE *f = fopen(path, "rb");
    if (f == NULL)
        return sy_error_set(err, SY_EIO, "%s: cannot open: %s", path, strerror(errno));
    size_t cap = 4096, n = 0;
    char *buf = malloc(cap);
    while (buf != NULL) {
        if (n + 1 >= cap) {
            char *p = realloc(buf, 2 * cap);
            if (p == NULL) {
                free(buf);
                buf = NULL;
                break;
            }
            buf = p;
            cap *= 2;
        }
        size_t got = fread(buf + n, 1, cap - n - 1, f);
        n += got;
        if (got == 0)
            break;
    }
    int bad = ferror(f);
    fclose(f);
    if (buf == NULL)
        return sy_error_set(err, SY_ENOMEM, "%s: reading", path);
    if (bad) {
        free(buf);
        return sy_error_set(err, SY_EIO, "%s: read failed", path);
    }
    buf[n] = '\0';
    *text = buf;
    return SY_OK;
}

int sy_climate_table_read_csv(sy_climate_table **out, const char *path, sy_error *err)
{
    if (out == NULL || path == NULL)
        return sy_error_set(err, SY_EINVAL, "CSV scatter table: NULL argument");
    *out = NULL;
    char *text = NULL;
    int rc = slurp(path, &text, err);
    if (rc != SY_OK)
        return rc;
    importer im = {path, err, {-1, -1, -1, -1, -1, -1, -1}, {NULL}, SY_CLIMATE_TE,
                   SY_CLIMATE_HOURS, 1.0, NULL, 0, 0, NULL, NULL, NULL, NULL, NAN, NAN, 0};
    int have_header = 0;
    size_t line = 0, header_line = 0;
    char *p = text;
    while (rc == SY_OK && *p != '\0') {
        char *eol = strchr(p, '\n');
        char *next = eol != NULL ? eol + 1 : p + strlen(p);
        if (eol != NULL)
            *eol = '\0';
        line++;
        size_t len = strlen(p);
        if (len > 0 && p[len - 1] == '\r')
            p[--len] = '\0';
        char *s = trim(p);
        if (line == 1 && (unsigned char)s[0] == 0xEF && (unsigned char)s[1] == 0xBB &&
            (unsigned char)s[2] == 0xBF)
            s += 3;   /* UTF-8 byte-order mark from spreadsheet exports */
        if (s[0] == '#') {
            rc = parse_meta(&im, s + 1, line);
        } else if (s[0] != '\0') {
            struct csv_parser parser;
            csv_row row;
            row.n_fields = 0;
            row.overflow = 0;
            row.row_done = 0;
            if (csv_init(&parser, CSV_STRICT | CSV_STRICT_FINI | CSV_APPEND_NULL) != 0) {
                rc = sy_error_set(err, SY_ENOMEM, "%s:%zu: CSV parser", path, line);
                break;
            }
            size_t slen = strlen(s);
            int bad = csv_parse(&parser, s, slen, on_field, on_row, &row) != slen ||
                      csv_fini(&parser, on_field, on_row, &row) != 0;
            if (bad)
                rc = sy_error_set(err, SY_EINPUT, "%s:%zu: CSV syntax: %s", path, line,
                                  csv_strerror(csv_error(&parser)));
            csv_free(&parser);
            if (rc == SY_OK && row.overflow)
                rc = sy_error_set(err, SY_EINPUT,
                                  "%s:%zu: more than %d fields or a field longer than %d "
                                  "characters", path, line, MAX_FIELDS, MAX_FIELD_LEN - 1);
            if (rc == SY_OK && !have_header) {
                rc = parse_header(&im, &row, line);
                have_header = 1;
                header_line = line;
            } else if (rc == SY_OK) {
                rc = parse_data(&im, &row, line);
            }
        }
        p = next;
    }
    if (rc == SY_OK && !have_header)
        rc = sy_error_set(err, SY_EINPUT, "%s: no header line, expected hs_min,hs_max,te_min,"
                          "te_max,... (empty table)", path);
    if (rc == SY_OK && im.n_rows == 0)
        rc = sy_error_set(err, SY_EINPUT,
                          "%s:%zu: no bins after the header, expected at least one row (empty "
                          "table)", path, header_line);
    if (rc == SY_OK)
        rc = build(&im, out);
    free(im.rows);
    free(im.site);
    free(im.source);
    free(im.institution);
    free(im.comment);
    free(text);
    return rc;
}
