/* Input files as text: existence/type checks, UTF-8 validation, strict numbers,
 * relative paths, and CSV records with line numbers (libcsv). */
#include "core_impl.h"

#include <csv.h>
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

int syi_check_input_file(const char *path, size_t max_bytes, sy_error *err)
{
    struct stat st;
    if (path == NULL || path[0] == '\0')
        return sy_error_set(err, SY_EIO, "no file name given");
    if (stat(path, &st) != 0)
        return sy_error_set(err, SY_EIO, "%s: cannot open: %s", path, strerror(errno));
    if (S_ISDIR(st.st_mode))
        return sy_error_set(err, SY_EIO, "%s: is a directory, expected a file", path);
    if (!S_ISREG(st.st_mode))
        return sy_error_set(err, SY_EIO, "%s: not a regular file", path);
    if ((size_t)st.st_size > max_bytes)
        return sy_error_set(err, SY_EIO, "%s: %lld bytes, larger than the %zu-byte limit for this input (SYI_TEXT_MAX_BYTES "
                            "in src/core/core_impl.h: raise it and rebuild if you mean it)",
                            path, (long long)st.st_size, max_bytes);
    return SY_OK;
}

int syi_utf8_valid(const char *s, size_t n)
{
    const unsigned char *p = (const unsigned char *)s;
    size_t i = 0;
    while (i < n) {
        unsigned c = p[i];
        size_t extra;
        unsigned min;
        if (c == 0)
            return 0;
        if (c < 0x80) {
            i++;
            continue;
        } else if ((c & 0xE0) == 0xC0) {
            extra = 1, min = 0x80, c &= 0x1F;
        } else if ((c & 0xF0) == 0xE0) {
            extra = 2, min = 0x800, c &= 0x0F;
        } else if ((c & 0xF8) == 0xF0) {
            extra = 3, min = 0x10000, c &= 0x07;
        } else {
            return 0;
        }
        if (i + extra >= n)
            return 0; /* truncated sequence */
        for (size_t k = 1; k <= extra; k++) {
            if ((p[i + k] & 0xC0) != 0x80)
                return 0;
            c = (c << 6) | (p[i + k] & 0x3F);
        }
        if (c < min || c > 0x10FFFF || (c >= 0xD800 && c <= 0xDFFF))
            return 0; /* overlong, out of range, surrogate */
        i += extra + 1;
    }
    return 1;
}

int syi_parse_double(const char *text, double *value)
{
    if (text == NULL)
        return 0;
    while (*text == ' ' || *text == '\t')
        text++;
    if (*text == '\0')
        return 0;
    char *end;
    errno = 0;
    double v = strtod(text, &end);
    if (end == text || errno == ERANGE || !isfinite(v))
        return 0;
    while (*end == ' ' || *end == '\t' || *end == '\r')
        end++;
    if (*end != '\0')
        return 0;
    *value = v;
    return 1;
}

int syi_path_resolve(const char *base_file, const char *rel, char *out, size_t cap, sy_error *err)
{
    int n;
    if (rel[0] == '/') {
        n = snprintf(out, cap, "%s", rel);
    } else {
        const char *slash = strrchr(base_file, '/');
        if (slash == NULL)
            n = snprintf(out, cap, "%s", rel);
        else
            n = snprintf(out, cap, "%.*s/%s", (int)(slash - base_file), base_file, rel);
    }
    if (n < 0 || (size_t)n >= cap)
        return sy_error_set(err, SY_EINPUT, "path '%s' longer than %zu characters", rel, cap - 1);
    return SY_OK;
}

/* ---- CSV ---- */

typedef struct csv_state {
    syi_csv *csv;
    syi_csv_row cur;        /* record being assembled */
    size_t cap_rows, cap_fields;
    size_t line;            /* physical line being fed */
    size_t record_line;     /* line where the current record started (0: none yet) */
    int nomem;
} csv_state;

static void on_field(void *data, size_t len, void *user)
{
    csv_state *st = user;
    if (st->nomem)
        return;
    if (st->record_line == 0)
        st->record_line = st->line;
    if (st->cur.n_fields == st->cap_fields) {
        size_t cap = st->cap_fields ? 2 * st->cap_fields : 8;
        char **f = realloc(st->cur.fields, cap * sizeof *f);
        if (f == NULL) {
            st->nomem = 1;
            return;
        }
        st->cur.fields = f;
        st->cap_fields = cap;
    }
    char *copy = malloc(len + 1);
    if (copy == NULL) {
        st->nomem = 1;
        return;
    }
    if (len > 0)
        memcpy(copy, data, len);
    copy[len] = '\0';
    st->cur.fields[st->cur.n_fields++] = copy;
}

static void on_record(int term, void *user)
{
    (void)term;
    csv_state *st = user;
    if (st->nomem)
        return;
    if (st->cur.n_fields == 0) {
        st->record_line = 0;
        return;
    }
    syi_csv *csv = st->csv;
    if (csv->n_rows == st->cap_rows) {
        size_t cap = st->cap_rows ? 2 * st->cap_rows : 16;
        syi_csv_row *r = realloc(csv->rows, cap * sizeof *r);
        if (r == NULL) {
            st->nomem = 1;
            return;
        }
        csv->rows = r;
        st->cap_rows = cap;
    }
    st->cur.line = st->record_line ? st->record_line : st->line;
    csv->rows[csv->n_rows++] = st->cur;
    memset(&st->cur, 0, sizeof st->cur);
    st->cap_fields = 0;
    st->record_line = 0;
}

static void free_row(syi_csv_row *row)
{
    for (size_t i = 0; i < row->n_fields; i++)
        free(row->fields[i]);
    free(row->fields);
}

void syi_csv_free(syi_csv *csv)
{
    if (csv == NULL)
        return;
    for (size_t i = 0; i < csv->n_rows; i++)
        free_row(&csv->rows[i]);
    free(csv->rows);
    free(csv);
}

static int is_comment_or_blank(const char *line, size_t n)
{
    size_t i = 0;
    while (i < n && (line[i] == ' ' || line[i] == '\t' || line[i] == '\r' || line[i] == '\n'))
        i++;
    return i == n || line[i] == '#';
}

int syi_csv_read(const char *path, syi_csv **out, sy_error *err)
{
    int rc = syi_check_input_file(path, SYI_TEXT_MAX_BYTES, err);
    if (rc != SY_OK)
        return rc;
    FILE *f = fopen(path, "rb");
    if (f == NULL)
        return sy_error_set(err, SY_EIO, "%s: cannot open: %s", path, strerror(errno));
    struct csv_parser parser;
    csv_state st;
    memset(&st, 0, sizeof st);
    st.csv = calloc(1, sizeof *st.csv);
    if (st.csv == NULL || csv_init(&parser, CSV_STRICT | CSV_APPEND_NULL | CSV_STRICT_FINI) != 0) {
        fclose(f);
        free(st.csv);
        return sy_error_set(err, SY_ENOMEM, "%s: CSV parser", path);
    }
    char *line = NULL;
    size_t cap = 0;
    ssize_t n;
    rc = SY_OK;
    int in_quotes_possible = 0; /* a record spanning lines must not be filtered as comment */
    while (rc == SY_OK && (n = getline(&line, &cap, f)) != -1) {
        st.line++;
        if (!syi_utf8_valid(line, (size_t)n)) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: not valid UTF-8 text (or contains a NUL byte)",
                              path, st.line);
            break;
        }
        if (!in_quotes_possible && is_comment_or_blank(line, (size_t)n))
            continue;
        if (csv_parse(&parser, line, (size_t)n, on_field, on_record, &st) != (size_t)n)
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: malformed CSV: %s", path, st.line,
                              csv_strerror(csv_error(&parser)));
        else if (st.nomem)
            rc = sy_error_set(err, SY_ENOMEM, "%s:%zu: out of memory", path, st.line);
        /* A record still open after a full line means a quoted field holds a newline. */
        in_quotes_possible = st.record_line != 0;
    }
    if (rc == SY_OK && ferror(f))
        rc = sy_error_set(err, SY_EIO, "%s: read failed: %s", path, strerror(errno));
    if (rc == SY_OK && csv_fini(&parser, on_field, on_record, &st) != 0)
        rc = sy_error_set(err, SY_EINPUT, "%s:%zu: malformed CSV at end of file: %s", path, st.line,
                          csv_strerror(csv_error(&parser)));
    if (rc == SY_OK && st.nomem)
        rc = sy_error_set(err, SY_ENOMEM, "%s: out of memory", path);
    free(line);
    fclose(f);
    csv_free(&parser);
    free_row(&st.cur);
    if (rc != SY_OK) {
        syi_csv_free(st.csv);
        return rc;
    }
    *out = st.csv;
    return SY_OK;
}
