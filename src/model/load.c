/* Project file -> validated model. Two passes: libinih collects every (section, key,
 * value, line), rejecting unknown and repeated keys; then each value is converted and
 * checked, with cross-field checks (draft < depth...), so every message can say
 * "FILE:LINE: what was wrong and what is expected". */
#include "core/core_impl.h"
#include "model_impl.h"

#include <ini.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

enum {
    K_DEPTH, K_DENSITY, K_GRAVITY, K_CLIMATE, K_BEARING,
    K_SHAPE, K_RADIUS, K_DRAFT, K_MASS, K_MODES, K_MOORING, K_VISCOUS,
    K_DAMPING, K_STIFFNESS, K_EFFICIENCY, K_RATED, K_STROKE, K_TUNING, K_PTO_MODE,
    K_LAYOUT_FILE,
    K_SPECTRUM, K_GAMMA, K_SPREADING, K_PERIOD, K_DIRECTION,
    K_OMEGA, K_HEADINGS, K_TOLERANCE, K_MAX_BODIES, K_MAX_OMEGA, K_ORDERS, K_DEPTH_MODES,
    K_REGION, K_QTHRESH,
    K_COUNT
};

static const struct {
    const char *section, *key;
} keys[K_COUNT] = {
    [K_DEPTH] = {"site", "depth"},           [K_DENSITY] = {"site", "density"},
    [K_GRAVITY] = {"site", "gravity"},       [K_CLIMATE] = {"site", "climate"},
    [K_BEARING] = {"site", "x_axis_bearing"},
    [K_SHAPE] = {"device", "shape"},         [K_RADIUS] = {"device", "radius"},
    [K_DRAFT] = {"device", "draft"},         [K_MASS] = {"device", "mass"},
    [K_MODES] = {"device", "modes"},
    [K_MOORING] = {"device", "mooring_stiffness"}, [K_VISCOUS] = {"device", "viscous_damping"},
    [K_DAMPING] = {"pto", "damping"},        [K_STIFFNESS] = {"pto", "stiffness"},
    [K_EFFICIENCY] = {"pto", "efficiency"},  [K_RATED] = {"pto", "rated_power"},
    [K_STROKE] = {"pto", "max_stroke"},      [K_TUNING] = {"pto", "tuning"},
    [K_PTO_MODE] = {"pto", "mode"},
    [K_LAYOUT_FILE] = {"layout", "file"},
    [K_SPECTRUM] = {"sea", "spectrum"},      [K_GAMMA] = {"sea", "gamma"},
    [K_SPREADING] = {"sea", "spreading"},    [K_PERIOD] = {"sea", "period"},
    [K_DIRECTION] = {"sea", "direction"},
    [K_OMEGA] = {"solve", "omega"},          [K_HEADINGS] = {"solve", "headings"},
    [K_TOLERANCE] = {"solve", "tolerance"},  [K_MAX_BODIES] = {"solve", "max_bodies"},
    [K_MAX_OMEGA] = {"solve", "max_frequencies"},
    [K_ORDERS] = {"solve", "orders"},        [K_DEPTH_MODES] = {"solve", "depth_modes"},
    [K_REGION] = {"resonance", "region"},    [K_QTHRESH] = {"resonance", "q_threshold"},
};

static const char *const sections[] = {"site", "device", "pto", "layout", "sea", "solve", "resonance"};

#define VALUE_MAX 4096

typedef struct entry {
    size_t line;            /* 0: absent */
    char value[VALUE_MAX];
} entry;

typedef struct reader {
    FILE *f;
    const char *path;
    size_t line;
    size_t err_line;        /* line of the first error the handler or reader found */
    size_t section_line[sizeof sections / sizeof sections[0]];
    entry e[K_COUNT];
    sy_error *err;
    int rc;
} reader;

/* Feeds inih one line at a time so the handler knows the line number. */
static char *read_line(char *str, int num, void *stream)
{
    reader *r = stream;
    long before = ftell(r->f);
    if (r->rc != SY_OK || fgets(str, num, r->f) == NULL)
        return NULL;
    r->line++;
    r->err_line = r->line; /* only read when r->rc is set */
    size_t n = strlen(str);
    /* fgets reads through a NUL byte, which would silently cut the line short: the
     * bytes consumed and the string's length differ exactly then. */
    long after = ftell(r->f);
    if (before >= 0 && after >= 0 && (size_t)(after - before) != n) {
        r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: NUL byte in the line, expected UTF-8 text", r->path,
                             r->line);
        return NULL;
    }
    if (n + 1 == (size_t)num && str[n - 1] != '\n' && !feof(r->f)) {
        r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: line longer than %d characters", r->path,
                             r->line, num - 2);
        return NULL;
    }
    if (!syi_utf8_valid(str, n)) {
        r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: not valid UTF-8 text", r->path, r->line);
        return NULL;
    }
    /* Section headers are checked here too: inih reports only keys, so an unknown
     * section without keys would otherwise pass silently. */
    const char *p = str + strspn(str, " \t");
    if (*p == '[') {
        size_t len = strcspn(p + 1, "]\r\n"), ns = sizeof sections / sizeof sections[0], s;
        if (p[1 + len] != ']') { /* found by fuzzing: the newline went into the message */
            r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: section header '[%.*s' lacks its closing ']'",
                                 r->path, r->line, (int)len, p + 1);
            return NULL;
        }
        for (s = 0; s < ns && !(strlen(sections[s]) == len && strncmp(p + 1, sections[s], len) == 0); s++)
            ;
        if (s == ns) {
            r->rc = sy_error_set(r->err, SY_EINPUT,
                                 "%s:%zu: unknown section '[%.*s]' (expected site, device, pto, layout, sea, solve, resonance)",
                                 r->path, r->line, (int)len, p + 1);
            return NULL;
        }
        if (r->section_line[s] == 0)
            r->section_line[s] = r->line;
    }
    return str;
}

static int on_key(void *user, const char *section, const char *name, const char *value)
{
    reader *r = user;
    if (r->rc != SY_OK)
        return 0;
    r->err_line = r->line;
    size_t ns = sizeof sections / sizeof sections[0], s;
    for (s = 0; s < ns && strcmp(section, sections[s]) != 0; s++)
        ;
    if (s == ns) {
        r->rc = sy_error_set(r->err, SY_EINPUT,
                             "%s:%zu: unknown section '[%s]' (expected site, device, pto, layout, sea, solve, resonance)",
                             r->path, r->line, section);
        return 0;
    }
    if (r->section_line[s] == 0)
        r->section_line[s] = r->line;
    if (name == NULL)
        return 1; /* section header only (INI_CALL_HANDLER_ON_NEW_SECTION builds) */
    for (int k = 0; k < K_COUNT; k++) {
        if (strcmp(keys[k].section, section) != 0 || strcmp(keys[k].key, name) != 0)
            continue;
        if (r->e[k].line != 0) {
            r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: key '%s' repeated in [%s] (first on line %zu)",
                                 r->path, r->line, name, section, r->e[k].line);
            return 0;
        }
        if (strlen(value) >= VALUE_MAX) {
            r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: value of '%s' too long", r->path, r->line, name);
            return 0;
        }
        r->e[k].line = r->line;
        strcpy(r->e[k].value, value);
        return 1;
    }
    r->rc = sy_error_set(r->err, SY_EINPUT, "%s:%zu: unknown key '%s' in [%s]", r->path, r->line, name,
                         section);
    return 0;
}

/* ---- conversion helpers: each returns SY_OK or sets "FILE:LINE: message" ---- */

typedef struct ctx {
    const reader *r;
    sy_error *err;
} ctx;

static int missing(const ctx *c, int k, const char *why)
{
    return sy_error_set(c->err, SY_EINPUT, "%s: missing key '%s' in [%s] (%s)", c->r->path, keys[k].key,
                        keys[k].section, why);
}

/* Number with bounds; lo_open/hi_open choose > vs >=. Absent: *v = def (if !required). */
static int number(const ctx *c, int k, double *v, double def, int required, double lo, int lo_open,
                  double hi, int hi_open, const char *expect)
{
    const entry *e = &c->r->e[k];
    if (e->line == 0) {
        if (required)
            return missing(c, k, expect);
        *v = def;
        return SY_OK;
    }
    double x;
    if (!syi_parse_double(e->value, &x))
        return sy_error_set(c->err, SY_EINPUT, "%s:%zu: [%s] %s = '%s' is not a number (expected %s)",
                            c->r->path, e->line, keys[k].section, keys[k].key, e->value, expect);
    if ((lo_open ? !(x > lo) : !(x >= lo)) || (hi_open ? !(x < hi) : !(x <= hi)))
        return sy_error_set(c->err, SY_EINPUT, "%s:%zu: [%s] %s must be %s, got %g", c->r->path, e->line,
                            keys[k].section, keys[k].key, expect, x);
    *v = x;
    return SY_OK;
}

/* One of a list of words; *v = index. Absent: def (or error when def < 0). */
static int word(const ctx *c, int k, int *v, int def, const char *const *words, size_t n_words,
                const char *expect)
{
    const entry *e = &c->r->e[k];
    if (e->line == 0) {
        if (def < 0)
            return missing(c, k, expect);
        *v = def;
        return SY_OK;
    }
    for (size_t i = 0; i < n_words; i++)
        if (strcmp(e->value, words[i]) == 0) {
            *v = (int)i;
            return SY_OK;
        }
    return sy_error_set(c->err, SY_EINPUT, "%s:%zu: [%s] %s = '%s' is not one of %s", c->r->path, e->line,
                        keys[k].section, keys[k].key, e->value, expect);
}

static int path_key(const ctx *c, int k, char *out, sy_error *err)
{
    const entry *e = &c->r->e[k];
    if (e->value[0] == '\0')
        return sy_error_set(err, SY_EINPUT, "%s:%zu: [%s] %s is empty (expected a file path)", c->r->path,
                            e->line, keys[k].section, keys[k].key);
    int rc = syi_path_resolve(c->r->path, e->value, out, SY_MODEL_PATH_MAX, err);
    if (rc != SY_OK)
        sy_error_prefix(err, "%s:%zu", c->r->path, e->line);
    return rc;
}

static int grid(const ctx *c, int k, const char *def, double scale, size_t max, double **v, size_t *n)
{
    const entry *e = &c->r->e[k];
    int rc = sy_model_parse_grid(e->line ? e->value : def, scale, max, v, n, c->err);
    if (rc != SY_OK) {
        if (rc == SY_ELIMIT)
            sy_error_prefix(c->err, "%s:%zu: [%s] %s (raise [solve] %s if you mean it)", c->r->path,
                            e->line, keys[k].section, keys[k].key,
                            k == K_OMEGA ? "max_frequencies" : "headings");
        else
            sy_error_prefix(c->err, "%s:%zu: [%s] %s", c->r->path, e->line, keys[k].section, keys[k].key);
    }
    return rc;
}

static int parse_modes(const ctx *c, unsigned *modes)
{
    const entry *e = &c->r->e[K_MODES];
    if (e->line == 0) {
        *modes = SY_MODES_HEAVE;
        return SY_OK;
    }
    char buf[VALUE_MAX];
    strcpy(buf, e->value);
    unsigned m = 0;
    char *save = NULL;
    for (char *tok = strtok_r(buf, ", \t", &save); tok != NULL; tok = strtok_r(NULL, ", \t", &save)) {
        int found = 0;
        for (int mode = 1; mode <= 5; mode++)
            if (strcmp(tok, sy_model_mode_name(mode)) == 0) {
                if (m & SY_MODE_BIT(mode))
                    return sy_error_set(c->err, SY_EINPUT, "%s:%zu: [device] modes lists '%s' twice",
                                        c->r->path, e->line, tok);
                m |= SY_MODE_BIT(mode);
                found = 1;
            }
        if (!found)
            return sy_error_set(c->err, SY_EINPUT,
                                "%s:%zu: [device] modes: '%s' is not one of surge, sway, heave, roll, pitch",
                                c->r->path, e->line, tok);
    }
    if (m == 0)
        return sy_error_set(c->err, SY_EINPUT, "%s:%zu: [device] modes is empty (expected e.g. heave)",
                            c->r->path, e->line);
    *modes = m;
    return SY_OK;
}

const char *sy_model_mode_name(int mode)
{
    static const char *const names[] = {"surge", "sway", "heave", "roll", "pitch"};
    return mode >= 1 && mode <= 5 ? names[mode - 1] : "?";
}

static int convert(sy_model *m, const reader *r, sy_error *err)
{
    const ctx c = {r, err};
    int rc = SY_OK, v;
    double x;
#define TRY(call) do { if ((rc = (call)) != SY_OK) return rc; } while (0)
    TRY(number(&c, K_DEPTH, &m->depth, 0, 1, 0, 1, 1e5, 0, "> 0 m"));
    TRY(number(&c, K_DENSITY, &m->rho, 1025.0, 0, 0, 1, 1e5, 0, "> 0 kg/m^3"));
    TRY(number(&c, K_GRAVITY, &m->g, 9.81, 0, 0, 1, 1e3, 0, "> 0 m/s^2"));
    if (r->e[K_CLIMATE].line)
        TRY(path_key(&c, K_CLIMATE, m->climate, err));
    TRY(number(&c, K_BEARING, &x, 0.0, 0, -360, 0, 360, 0, "a bearing in [-360, 360] deg"));
    m->x_axis_bearing = x * M_PI / 180.0;

    static const char *const shapes[] = {"float", "column"};
    TRY(word(&c, K_SHAPE, &v, -1, shapes, 2, "float, column"));
    m->shape = (sy_shape)v;
    TRY(number(&c, K_RADIUS, &m->radius, 0, 1, 0, 1, 1e4, 0, "> 0 m"));
    if (m->shape == SY_SHAPE_FLOAT) {
        TRY(number(&c, K_DRAFT, &m->draft, 0, 1, 0, 1, 1e5, 0, "> 0 m"));
        if (!(m->draft < m->depth))
            return sy_error_set(err, SY_EINPUT, "%s:%zu: [device] draft must be < [site] depth %g m for a float, got %g",
                                r->path, r->e[K_DRAFT].line, m->depth, m->draft);
    } else {
        if (r->e[K_DRAFT].line)
            return sy_error_set(err, SY_EINPUT, "%s:%zu: [device] draft does not apply to a column (it stands on the seabed)",
                                r->path, r->e[K_DRAFT].line);
        m->draft = m->depth;
    }
    m->mass_displaced = 1;
    if (r->e[K_MASS].line && strcmp(r->e[K_MASS].value, "displaced") != 0) {
        TRY(number(&c, K_MASS, &m->mass, 0, 1, 0, 1, 1e12, 0, "'displaced' or a mass > 0 kg"));
        m->mass_displaced = 0;
    }
    TRY(parse_modes(&c, &m->modes));
    TRY(number(&c, K_MOORING, &m->mooring_stiffness, 0.0, 0, 0, 0, 1e15, 0, ">= 0 N/m"));
    TRY(number(&c, K_VISCOUS, &m->viscous_damping, 0.0, 0, 0, 0, 1e15, 0, ">= 0 N s/m"));

    m->has_pto = r->section_line[2] != 0;
    TRY(number(&c, K_DAMPING, &m->pto_damping, 0.0, 0, 0, 0, 1e15, 0, ">= 0 N s/m"));
    TRY(number(&c, K_STIFFNESS, &m->pto_stiffness, 0.0, 0, -1e15, 0, 1e15, 0, "a stiffness in N/m"));
    TRY(number(&c, K_EFFICIENCY, &m->efficiency, 1.0, 0, 0, 1, 1, 0, "in (0, 1]"));
    TRY(number(&c, K_RATED, &m->rated_power, INFINITY, 0, 0, 1, 1e12, 0, "> 0 W"));
    TRY(number(&c, K_STROKE, &m->max_stroke, INFINITY, 0, 0, 1, 1e4, 0, "> 0 m"));
    static const char *const tunings[] = {"fixed", "per_sea_state", "site_optimal", "reactive_bound"};
    TRY(word(&c, K_TUNING, &v, 0, tunings, 4, "fixed, per_sea_state, site_optimal, reactive_bound"));
    m->tuning = (sy_tuning)v;
    static const char *const pto_modes[] = {"surge", "sway", "heave", "roll", "pitch"};
    TRY(word(&c, K_PTO_MODE, &v, 2, pto_modes, 5, "surge, sway, heave, roll, pitch"));
    m->pto_mode = v + 1;
    if ((m->has_pto || r->e[K_PTO_MODE].line) && !(m->modes & SY_MODE_BIT(m->pto_mode)))
        return sy_error_set(err, SY_EINPUT, "%s:%zu: [pto] mode = %s is not among [device] modes", r->path,
                            r->e[K_PTO_MODE].line ? r->e[K_PTO_MODE].line : r->e[K_MODES].line,
                            sy_model_mode_name(m->pto_mode));

    if (!r->e[K_LAYOUT_FILE].line)
        return missing(&c, K_LAYOUT_FILE, "a CSV with header name,x,y");
    TRY(path_key(&c, K_LAYOUT_FILE, m->layout, err));

    static const char *const spectra[] = {"jonswap", "bretschneider"};
    TRY(word(&c, K_SPECTRUM, &v, 0, spectra, 2, "jonswap, bretschneider"));
    m->spectrum = (sy_spectrum_kind)v;
    TRY(number(&c, K_GAMMA, &m->gamma, 3.3, 0, 1, 0, 20, 0, "a JONSWAP peak enhancement in [1, 20]"));
    if (m->spectrum == SY_SPECTRUM_BRETSCHNEIDER && r->e[K_GAMMA].line && m->gamma != 1.0)
        return sy_error_set(err, SY_EINPUT, "%s:%zu: [sea] gamma applies to spectrum = jonswap only",
                            r->path, r->e[K_GAMMA].line);
    TRY(number(&c, K_SPREADING, &m->spreading, 0.0, 0, 0, 0, 1000, 0, "a cos-2s exponent in [0, 1000] (0: long-crested)"));
    static const char *const periods[] = {"te", "tp"};
    TRY(word(&c, K_PERIOD, &v, 0, periods, 2, "te, tp"));
    m->period = (sy_period_kind)v;
    m->period_given = r->e[K_PERIOD].line != 0;
    TRY(number(&c, K_DIRECTION, &m->direction_from, NAN, 0, -360, 0, 360, 0, "a from-direction in [-360, 360] deg"));

    TRY(number(&c, K_MAX_BODIES, &x, SY_MODEL_MAX_BODIES_DEFAULT, 0, 1, 0, 1e6, 0, "a count >= 1"));
    m->max_bodies = (size_t)x;
    TRY(number(&c, K_MAX_OMEGA, &x, SY_MODEL_MAX_OMEGA_DEFAULT, 0, 1, 0, 1e8, 0, "a count >= 1"));
    m->max_omega = (size_t)x;
    TRY(grid(&c, K_OMEGA, "0.2:2.2:101", 1.0, m->max_omega, &m->omega, &m->n_omega));
    if (!(m->omega[0] > 0.0))
        return sy_error_set(err, SY_EINPUT, "%s:%zu: [solve] omega values must be > 0 rad/s, got %g", r->path,
                            r->e[K_OMEGA].line, m->omega[0]);
    TRY(grid(&c, K_HEADINGS, "0", M_PI / 180.0, SY_MODEL_MAX_HEADINGS, &m->headings, &m->n_headings));
    TRY(number(&c, K_TOLERANCE, &m->tolerance, 1e-6, 0, 1e-13, 0, 0.1, 0, "in [1e-13, 0.1]"));
    TRY(number(&c, K_ORDERS, &x, 0, 0, 0, 0, 60, 0, "a whole number 0..60 (0: from the tolerance)"));
    m->orders = (size_t)x;
    if ((double)m->orders != x)
        return sy_error_set(err, SY_EINPUT, "%s:%zu: [solve] orders must be a whole number, got %g", r->path,
                            r->e[K_ORDERS].line, x);
    TRY(number(&c, K_DEPTH_MODES, &x, 0, 0, 0, 0, 60, 0, "a whole number 0..60 (0: from the tolerance)"));
    m->depth_modes = (size_t)x;
    if ((double)m->depth_modes != x)
        return sy_error_set(err, SY_EINPUT, "%s:%zu: [solve] depth_modes must be a whole number, got %g", r->path,
                            r->e[K_DEPTH_MODES].line, x);

    m->has_resonance = r->e[K_REGION].line != 0;
    if (m->has_resonance) {
        /* region is re_min:re_max:im_depth, three numbers (not a grid). */
        const char *val = r->e[K_REGION].value;
        double a, b, d;
        char extra;
        int bad = sscanf(val, "%lf:%lf:%lf%c", &a, &b, &d, &extra) != 3;
        if (bad || !(a > 0) || !(b > a) || !(d > 0) || !isfinite(b) || !isfinite(d))
            return sy_error_set(err, SY_EINPUT,
                                "%s:%zu: [resonance] region = '%s': expected re_min:re_max:im_depth with 0 < re_min < re_max and im_depth > 0 (rad/s)",
                                r->path, r->e[K_REGION].line, val);
        m->res_re_min = a, m->res_re_max = b, m->res_im_depth = d;
    }
    TRY(number(&c, K_QTHRESH, &m->q_threshold, 5.0, 0, 0, 1, 1e9, 0, "> 0"));
#undef TRY
    return SY_OK;
}

int sy_model_load(sy_model **out, const char *path, sy_error *err)
{
    int rc = syi_check_input_file(path, SYI_TEXT_MAX_BYTES, err);
    if (rc != SY_OK)
        return rc;
    reader *r = calloc(1, sizeof *r);
    sy_model *m = calloc(1, sizeof *m);
    if (r == NULL || m == NULL) {
        free(r);
        free(m);
        return sy_error_set(err, SY_ENOMEM, "%s: model", path);
    }
    r->path = path;
    r->err = err;
    r->f = fopen(path, "r");
    if (r->f == NULL) {
        free(r);
        free(m);
        return sy_error_set(err, SY_EIO, "%s: cannot open", path);
    }
    int ini_rc = ini_parse_stream(read_line, r, on_key, r);
    fclose(r->f);
    rc = r->rc;
    /* inih reports the first bad line; it wins over a later handler error. */
    if (ini_rc > 0 && (rc == SY_OK || (size_t)ini_rc < r->err_line))
        rc = sy_error_set(err, SY_EINPUT, "%s:%d: expected 'key = value' or '[section]'", path, ini_rc);
    else if (rc == SY_OK && ini_rc != 0)
        rc = sy_error_set(err, SY_EIO, "%s: could not be parsed (inih status %d)", path, ini_rc);
    if (rc == SY_OK && snprintf(m->path, sizeof m->path, "%s", path) >= (int)sizeof m->path)
        rc = sy_error_set(err, SY_EINPUT, "%s: path too long", path);
    if (rc == SY_OK)
        rc = convert(m, r, err);
    if (rc == SY_OK)
        rc = syi_model_read_layout(m, err);
    free(r);
    if (rc != SY_OK) {
        sy_model_free(m);
        return rc;
    }
    *out = m;
    return SY_OK;
}

int sy_model_require(const sy_model *m, unsigned needs, sy_error *err)
{
    if ((needs & SY_NEED_CLIMATE) && m->climate[0] == '\0')
        return sy_error_set(err, SY_EINPUT, "%s: missing key 'climate' in [site] (this verb needs a wave climate)",
                            m->path);
    if ((needs & SY_NEED_PTO) && !m->has_pto)
        return sy_error_set(err, SY_EINPUT, "%s: missing section [pto] (this verb needs the power take-off)",
                            m->path);
    if ((needs & SY_NEED_RESONANCE) && !m->has_resonance)
        return sy_error_set(err, SY_EINPUT,
                            "%s: missing key 'region' in [resonance] (re_min:re_max:im_depth in rad/s)", m->path);
    return SY_OK;
}

void sy_model_free(sy_model *m)
{
    if (m == NULL)
        return;
    free(m->devices);
    free(m->omega);
    free(m->headings);
    free(m);
}
