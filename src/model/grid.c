/* Frequency and heading grids: "min:max:count" (inclusive, evenly spaced) or a comma
 * list, in the file's units; the caller's scale converts (deg -> rad). */
#include "core/core_impl.h"
#include "swellyield/model.h"

#include <stdlib.h>
#include <string.h>

static int parse_count(const char *s, size_t *n)
{
    double v;
    /* range first: casting a double beyond size_t is undefined (fuzz_project found 4.8e67) */
    if (!syi_parse_double(s, &v) || !(v >= 1 && v <= 1e12) || v != (double)(size_t)v)
        return 0;
    *n = (size_t)v;
    return 1;
}

int sy_model_parse_grid(const char *text, double scale, size_t max_count, double **values,
                        size_t *count, sy_error *err)
{
    char buf[4096];
    if (strlen(text) >= sizeof buf)
        return sy_error_set(err, SY_EINPUT, "list longer than %zu characters", sizeof buf - 1);
    strcpy(buf, text);
    double *v = NULL;
    size_t n = 0;
    char *c1 = strchr(buf, ':');
    if (c1 != NULL) {
        char *c2 = strchr(c1 + 1, ':');
        double lo, hi;
        size_t m;
        if (c2 == NULL || strchr(c2 + 1, ':') != NULL)
            return sy_error_set(err, SY_EINPUT, "'%s': expected min:max:count", text);
        *c1 = *c2 = '\0';
        if (!syi_parse_double(buf, &lo) || !syi_parse_double(c1 + 1, &hi))
            return sy_error_set(err, SY_EINPUT, "'%s': min and max must be numbers", text);
        if (!parse_count(c2 + 1, &m))
            return sy_error_set(err, SY_EINPUT, "'%s': count must be a whole number >= 1", text);
        if (m > max_count)
            return sy_error_set(err, SY_ELIMIT, "'%s': %zu values exceed the limit of %zu", text, m,
                                max_count);
        if (m == 1 ? hi != lo : !(hi > lo))
            return sy_error_set(err, SY_EINPUT, "'%s': max must be > min (or equal with count 1)", text);
        v = malloc(m * sizeof *v);
        if (v == NULL)
            return sy_error_set(err, SY_ENOMEM, "grid of %zu values", m);
        for (size_t i = 0; i < m; i++)
            v[i] = scale * (m == 1 ? lo : lo + (hi - lo) * (double)i / (double)(m - 1));
        n = m;
    } else {
        size_t cap = 1;
        for (const char *p = buf; *p; p++)
            cap += *p == ',';
        if (cap > max_count)
            return sy_error_set(err, SY_ELIMIT, "%zu values exceed the limit of %zu", cap, max_count);
        v = malloc(cap * sizeof *v);
        if (v == NULL)
            return sy_error_set(err, SY_ENOMEM, "list of %zu values", cap);
        char *save = NULL;
        for (char *tok = strtok_r(buf, ",", &save); tok != NULL; tok = strtok_r(NULL, ",", &save)) {
            double x;
            if (!syi_parse_double(tok, &x)) {
                free(v);
                return sy_error_set(err, SY_EINPUT, "'%s' is not a number", tok);
            }
            v[n++] = scale * x;
        }
        if (n != cap) {
            free(v);
            return sy_error_set(err, SY_EINPUT, "'%s': empty entry in the list", text);
        }
        for (size_t i = 1; i < n; i++)
            if (!(v[i] > v[i - 1])) {
                free(v);
                return sy_error_set(err, SY_EINPUT, "'%s': values must be strictly increasing", text);
            }
    }
    *values = v;
    *count = n;
    return SY_OK;
}
