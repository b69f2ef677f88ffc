/* The layout CSV: header name,x,y (any order) and optional per-device columns
 * radius,draft,damping,stiffness; an empty cell takes the [device]/[pto] value.
 * Checks names (non-empty, unique), numbers, ranges, coincident positions and
 * overlapping bounding circles, each reported as "FILE:LINE: message". */
#include "core/core_impl.h"
#include "model_impl.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

enum { C_NAME, C_X, C_Y, C_RADIUS, C_DRAFT, C_DAMPING, C_STIFFNESS, C_COUNT };
static const char *const columns[C_COUNT] = {"name", "x", "y", "radius", "draft", "damping", "stiffness"};

/* Gap below which two bodies' bounding circles count as overlapping: the array's
 * multiple-scattering expansions need the circles apart (common practice: a small
 * positive margin; 1 mm here is far below any real spacing). */
#define LAYOUT_MIN_GAP 1e-3

static int cell(const syi_csv_row *row, int col, double def, double *v, const char *path,
                const char *what, sy_error *err)
{
    if (col < 0 || (size_t)col >= row->n_fields || row->fields[col][0] == '\0') {
        *v = def;
        return SY_OK;
    }
    if (!syi_parse_double(row->fields[col], v))
        return sy_error_set(err, SY_EINPUT, "%s:%zu: %s = '%s' is not a number", path, row->line, what,
                            row->fields[col]);
    return SY_OK;
}

int syi_model_read_layout(sy_model *m, sy_error *err)
{
    syi_csv *csv = NULL;
    int rc = syi_csv_read(m->layout, &csv, err);
    if (rc != SY_OK)
        return rc;
    const char *path = m->layout;
    int col[C_COUNT];
    for (int c = 0; c < C_COUNT; c++)
        col[c] = -1;
    if (csv->n_rows == 0) {
        rc = sy_error_set(err, SY_EINPUT, "%s: empty layout (expected a header name,x,y and one row per device)", path);
        goto done;
    }
    const syi_csv_row *head = &csv->rows[0];
    for (size_t i = 0; i < head->n_fields; i++) {
        int c;
        for (c = 0; c < C_COUNT && strcmp(head->fields[i], columns[c]) != 0; c++)
            ;
        if (c == C_COUNT) {
            rc = sy_error_set(err, SY_EINPUT,
                              "%s:%zu: unknown column '%s' (expected name, x, y and optionally radius, draft, damping, stiffness)",
                              path, head->line, head->fields[i]);
            goto done;
        }
        if (col[c] >= 0) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: column '%s' appears twice", path, head->line, columns[c]);
            goto done;
        }
        col[c] = (int)i;
    }
    for (int c = C_NAME; c <= C_Y; c++)
        if (col[c] < 0) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: header lacks column '%s' (expected name,x,y)", path,
                              head->line, columns[c]);
            goto done;
        }
    size_t n = csv->n_rows - 1;
    if (n == 0) {
        rc = sy_error_set(err, SY_EINPUT, "%s: layout has a header but no devices", path);
        goto done;
    }
    if (n > m->max_bodies) {
        rc = sy_error_set(err, SY_ELIMIT, "%s: %zu devices exceed the limit of %zu (raise [solve] max_bodies if you mean it)",
                          path, n, m->max_bodies);
        goto done;
    }
    m->devices = calloc(n, sizeof *m->devices);
    if (m->devices == NULL) {
        rc = sy_error_set(err, SY_ENOMEM, "%s: %zu devices", path, n);
        goto done;
    }
    for (size_t i = 0; i < n; i++) {
        const syi_csv_row *row = &csv->rows[i + 1];
        sy_model_device *d = &m->devices[i];
        d->line = row->line;
        if (row->n_fields != head->n_fields) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: %zu fields, the header has %zu", path, row->line,
                              row->n_fields, head->n_fields);
            goto done;
        }
        const char *name = row->fields[col[C_NAME]];
        if (name[0] == '\0' || strlen(name) >= sizeof d->name) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: device name must be 1 to %zu characters", path, row->line,
                              sizeof d->name - 1);
            goto done;
        }
        strcpy(d->name, name);
        if (row->fields[col[C_X]][0] == '\0' || row->fields[col[C_Y]][0] == '\0') {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: device '%s' needs both x and y (m)", path, row->line, name);
            goto done;
        }
        if ((rc = cell(row, col[C_X], 0, &d->x, path, "x", err)) != SY_OK ||
            (rc = cell(row, col[C_Y], 0, &d->y, path, "y", err)) != SY_OK ||
            (rc = cell(row, col[C_RADIUS], m->radius, &d->radius, path, "radius", err)) != SY_OK ||
            (rc = cell(row, col[C_DRAFT], m->draft, &d->draft, path, "draft", err)) != SY_OK ||
            (rc = cell(row, col[C_DAMPING], m->pto_damping, &d->pto_damping, path, "damping", err)) != SY_OK ||
            (rc = cell(row, col[C_STIFFNESS], m->pto_stiffness, &d->pto_stiffness, path, "stiffness", err)) != SY_OK)
            goto done;
        if (!(d->radius > 0)) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: radius of '%s' must be > 0 m, got %g", path, row->line, name, d->radius);
            goto done;
        }
        if (m->shape == SY_SHAPE_FLOAT && !(d->draft > 0 && d->draft < m->depth)) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: draft of '%s' must be > 0 and < depth %g m, got %g", path,
                              row->line, name, m->depth, d->draft);
            goto done;
        }
        if (m->shape == SY_SHAPE_COLUMN && col[C_DRAFT] >= 0 && row->fields[col[C_DRAFT]][0] != '\0') {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: draft does not apply to column '%s'", path, row->line, name);
            goto done;
        }
        if (!(d->pto_damping >= 0)) {
            rc = sy_error_set(err, SY_EINPUT, "%s:%zu: damping of '%s' must be >= 0 N s/m, got %g", path, row->line,
                              name, d->pto_damping);
            goto done;
        }
        for (size_t j = 0; j < i; j++) {
            const sy_model_device *o = &m->devices[j];
            double dist = hypot(d->x - o->x, d->y - o->y);
            if (strcmp(o->name, d->name) == 0) {
                rc = sy_error_set(err, SY_EINPUT, "%s:%zu: device name '%s' already used on line %zu", path,
                                  row->line, name, o->line);
                goto done;
            }
            if (dist == 0.0) {
                rc = sy_error_set(err, SY_EINPUT, "%s:%zu: device '%s' at the same position (%g, %g) as '%s' on line %zu",
                                  path, row->line, name, d->x, d->y, o->name, o->line);
                goto done;
            }
            if (dist < d->radius + o->radius + LAYOUT_MIN_GAP) {
                rc = sy_error_set(err, SY_EINPUT,
                                  "%s:%zu: devices '%s' and '%s' (line %zu) overlap: centre distance %g m < sum of radii %g m",
                                  path, row->line, name, o->name, o->line, dist, d->radius + o->radius);
                goto done;
            }
        }
    }
    m->n_devices = n;
done:
    syi_csv_free(csv);
    return rc;
}
