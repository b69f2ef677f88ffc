/* The model: everything a run needs (site, device, PTO, layout, sea, solver settings,
 * resonance search region), read from a project file once, validated once, and then
 * read — never the file — by every other module.
 *
 * Project file: INI (libinih), SI units, ';' or '#' comments, relative paths resolved
 * from the file's own folder. Sections and keys (anything else is an error, so typos do
 * not pass silently):
 *   [site]      depth (m, > 0), density (kg/m^3, default 1025), gravity (m/s^2, default
 *               9.81), climate (path), x_axis_bearing (deg clockwise from north of the
 *               array's +x axis, default 0)
 *   [device]    shape = float | column, radius (m), draft (m; float: 0 < draft < depth),
 *               mass = displaced | <kg>, modes = comma list of surge, sway, heave, roll,
 *               pitch (default heave), mooring_stiffness (N/m on surge and sway, default 0),
 *               viscous_damping (N s/m, linearised, on heave, default 0)
 *   [pto]       damping (N s/m, >= 0), stiffness (N/m), efficiency (0, 1], rated_power (W,
 *               > 0 or absent), max_stroke (m, > 0 or absent: the significant motion
 *               amplitude limit), tuning = fixed | per_sea_state | site_optimal | reactive_bound
 *   [layout]    file = CSV with header name,x,y and optional per-device columns
 *               radius,draft,damping,stiffness (an empty cell takes the [device]/[pto] value)
 *   [sea]       spectrum = jonswap | bretschneider, gamma (JONSWAP, default 3.3),
 *               spreading (cos-2s exponent s, 0 = long-crested, default 0),
 *               period = te | tp (which period the climate's period axis holds, default te;
 *               a climate file that states its period kind must agree),
 *               direction (deg, nautical FROM-direction used when the climate has no
 *               direction bins; default: waves travel toward the array's +x axis)
 *   [solve]     omega = min:max:count | comma list (rad/s), headings = min:max:count |
 *               comma list (deg, direction waves travel toward, counter-clockwise from +x),
 *               tolerance (relative, default 1e-6), orders and depth_modes (the array's
 *               angular orders M and depth modes Q; 0 or absent: chosen from the
 *               tolerance, see hydro.h), max_bodies, max_frequencies (resource bounds)
 *   [resonance] region = re_min:re_max:im_depth (rad/s), q_threshold (default 5)
 * Errors read "FILE:LINE: message" (or "FILE: message" when no line applies).
 *
 * Inside the model everything is SI and radians. The struct is plain read-only data
 * after sy_model_load; free it with sy_model_free. Thread-safe to read. */
#ifndef SWELLYIELD_MODEL_H
#define SWELLYIELD_MODEL_H

#include <stddef.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Up-front resource bounds; the message names the limit and the key that raises it. */
#define SY_MODEL_MAX_BODIES_DEFAULT 400
#define SY_MODEL_MAX_OMEGA_DEFAULT 5000
#define SY_MODEL_MAX_HEADINGS 3600
#define SY_MODEL_PATH_MAX 4096

typedef enum { SY_SHAPE_FLOAT = 0, SY_SHAPE_COLUMN = 1 } sy_shape;
typedef enum { SY_SPECTRUM_JONSWAP = 0, SY_SPECTRUM_BRETSCHNEIDER = 1 } sy_spectrum_kind;
typedef enum { SY_PERIOD_TE = 0, SY_PERIOD_TP = 1 } sy_period_kind;
typedef enum {
    SY_TUNING_FIXED = 0,
    SY_TUNING_PER_SEA_STATE,
    SY_TUNING_SITE_OPTIMAL,
    SY_TUNING_REACTIVE_BOUND
} sy_tuning;

/* Mode bits, in the conventions.md order surge 1 .. pitch 5: bit (mode - 1). */
#define SY_MODE_BIT(mode) (1u << ((mode) - 1))
#define SY_MODES_HEAVE SY_MODE_BIT(3)

typedef struct sy_model_device {
    char name[64];
    double x, y;            /* m, array frame */
    double radius, draft;   /* m */
    double pto_damping;     /* N s/m */
    double pto_stiffness;   /* N/m */
    size_t line;            /* line in the layout file, for messages */
} sy_model_device;

typedef struct sy_model {
    char path[SY_MODEL_PATH_MAX];          /* the project file */
    /* [site] */
    double depth, rho, g;
    char climate[SY_MODEL_PATH_MAX];       /* resolved path, "" if absent */
    double x_axis_bearing;                 /* rad, clockwise from north */
    /* [device] */
    sy_shape shape;
    double radius, draft;                  /* defaults for the layout, m */
    int mass_displaced;                    /* 1: mass = rho * displaced volume */
    double mass;                           /* kg when mass_displaced == 0 */
    unsigned modes;                        /* SY_MODE_BIT mask */
    double mooring_stiffness;              /* N/m, surge and sway */
    double viscous_damping;                /* N s/m, heave */
    /* [pto] */
    int has_pto;
    double pto_damping, pto_stiffness;     /* defaults for the layout */
    double efficiency;                     /* (0, 1] */
    double rated_power;                    /* W; INFINITY when absent */
    double max_stroke;                     /* m; INFINITY when absent */
    sy_tuning tuning;
    int pto_mode;                          /* 1..5, the mode the PTO acts on */
    /* [layout] */
    char layout[SY_MODEL_PATH_MAX];
    sy_model_device *devices;
    size_t n_devices;
    /* [sea] */
    sy_spectrum_kind spectrum;
    double gamma;
    double spreading;                      /* cos-2s exponent s */
    sy_period_kind period;
    int period_given;                      /* 1 if [sea] period was in the file */
    double direction_from;                 /* deg nautical from; NAN: toward +x */
    /* [solve] */
    double *omega;                         /* rad/s, ascending */
    size_t n_omega;
    double *headings;                      /* rad, toward, counter-clockwise from +x */
    size_t n_headings;
    double tolerance;
    size_t orders, depth_modes;            /* 0: automatic */
    size_t max_bodies, max_omega;          /* resource bounds in force */
    /* [resonance] */
    int has_resonance;
    double res_re_min, res_re_max, res_im_depth; /* rad/s */
    double q_threshold;
} sy_model;

/* What a verb needs beyond [site], [device], [layout], [solve]. */
#define SY_NEED_CLIMATE 1u
#define SY_NEED_PTO 2u
#define SY_NEED_RESONANCE 4u

/* Read and validate a project file. On success *out is a new model (free with
 * sy_model_free). SY_EINPUT with "file:line: message" for bad content, SY_EIO when a
 * file cannot be read, SY_ELIMIT when a resource bound is exceeded, SY_ENOMEM. */
SY_API int sy_model_load(sy_model **out, const char *path, sy_error *err);

/* Check that the optional sections a verb needs are present; SY_EINPUT naming the
 * missing section and key otherwise. */
SY_API int sy_model_require(const sy_model *model, unsigned needs, sy_error *err);

SY_API void sy_model_free(sy_model *model);

/* Parse "min:max:count" (inclusive, evenly spaced) or a comma list of numbers into a
 * new array (free() it). scale multiplies every value (e.g. pi/180). SY_EINPUT with a
 * message naming what is wrong (caller adds file:line). */
SY_API int sy_model_parse_grid(const char *text, double scale, size_t max_count, double **values,
                               size_t *count, sy_error *err);

/* Name of a mode 1..5 ("surge" .. "pitch"). */
SY_API const char *sy_model_mode_name(int mode);

#ifdef __cplusplus
}
#endif
#endif
