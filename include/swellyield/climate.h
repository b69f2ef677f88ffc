/* Wave climate of a site: sea-state scatter tables (occurrence per Hs x period
 * [x direction] bin), their NetCDF-4/CF-1.10 file form and CSV import, hindcast time
 * series (CF NetCDF) binned into tables, CF time decoding, summary statistics, and the
 * one conversion from metocean directions to the hydrodynamic wave heading.
 *
 * Units (conventions.md): Hs in m, periods in s, directions at this interface in
 * nautical degrees (the direction waves come FROM, clockwise from true north), times in
 * s since 1970-01-01T00:00:00Z on the proleptic Gregorian calendar. The heading beta the
 * hydrodynamics uses (radians, direction of travel, counter-clockwise from the array's +x
 * axis) is produced ONLY by sy_climate_heading() below.
 *
 * Hours per year: SY_CLIMATE_HOURS_PER_YEAR = 8766 h (an average year of 365.25 days;
 * IEC TS 62600-100/-101 practice as recorded in references.md 5.1, marked there "from
 * memory, unverified"; a 4-year cycle of real calendar years averages exactly 8766 h,
 * references.md 6.2). Every function that converts between fractions and hours says so
 * and callers should report the constant with any annual figure.
 *
 * Bins: Hs bin i covers [hs_edges[i], hs_edges[i+1]), period bin j covers
 * [period_edges[j], period_edges[j+1]) (half-open, edges strictly increasing).
 * Direction bin d is centred on dir_centres[d] with the common width dir_width, covering
 * [c - w/2, c + w/2) modulo 360 (a bin centred on 0 covers 345..15 for w = 30, through
 * north). n_dir = 0 means an omnidirectional table (one implicit direction bin).
 * Occurrence is stored row-major: occ[(i * n_period + j) * max(n_dir, 1) + d].
 *
 * Status codes: SY_EINVAL (bad argument from the caller), SY_EINPUT (bad file or table
 * contents; the message names file, line or variable, the value and what was expected),
 * SY_EIO (file system or NetCDF failure; the message carries path, variable and
 * nc_strerror()), SY_ENOMEM.
 * Thread safety: tables and series are not shared-mutable; reading a table from several
 * threads is safe, the NetCDF functions are not (the NetCDF-C library is not
 * thread-safe): call them from one thread at a time. */
#ifndef SWELLYIELD_CLIMATE_H
#define SWELLYIELD_CLIMATE_H

#include <stddef.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

/* Hours in the average year used to turn fractions into hours per year and hindcast
 * records into mean annual hours: 365.25 d x 24 h (references.md 5.1, from memory). */
#define SY_CLIMATE_HOURS_PER_YEAR 8766.0

/* Resource bounds on what a file may ask the readers to allocate, checked from the
 * declared dimensions before any read (a tiny NetCDF file may declare huge unwritten
 * dimensions). Both are far above any real table or record: a scatter table of 10^7
 * cells is 80 MB of doubles; 2 x 10^7 records are 2 300 years of hourly data (five
 * arrays of doubles, 800 MB). Raise them here and rebuild if you really mean it;
 * exceeding one is SY_ELIMIT with a message naming the file, dimension and limit. */
#define SY_CLIMATE_MAX_CELLS ((size_t)10000000)
#define SY_CLIMATE_MAX_RECORDS ((size_t)20000000)

/* Which period the table's period axis holds. */
typedef enum {
    SY_CLIMATE_TE = 0,  /* energy period Te = m_{-1}/m_0 */
    SY_CLIMATE_TP = 1   /* peak period Tp = 1/fp */
} sy_climate_period_kind;

/* What the occurrence numbers are (kept as the source gave them). */
typedef enum {
    SY_CLIMATE_HOURS = 0,    /* mean hours per year in the bin, h/yr */
    SY_CLIMATE_FRACTION = 1  /* fraction of time (all bins of the climate, calm and
                                out-of-range included, sum to 1; a table may hold less) */
} sy_climate_occurrence_kind;

/* Short name of a period kind ("Te", "Tp") and of an occurrence kind ("hours per
 * year", "fraction"). Static strings. */
SY_API const char *sy_climate_period_name(sy_climate_period_kind kind);
SY_API const char *sy_climate_occurrence_name(sy_climate_occurrence_kind kind);

/* Bin layout. As input (sy_climate_table_create, sy_climate_series_bin) the arrays are
 * the caller's and are copied; as output (sy_climate_table_bins) they belong to the
 * table and live as long as it. */
typedef struct sy_climate_bins {
    size_t n_hs;                  /* number of Hs bins, >= 1 */
    const double *hs_edges;       /* n_hs + 1 edges, m, >= 0, strictly increasing */
    size_t n_period;              /* number of period bins, >= 1 */
    const double *period_edges;   /* n_period + 1 edges, s, > 0, strictly increasing */
    sy_climate_period_kind period;
    size_t n_dir;                 /* number of direction bins; 0 = omnidirectional */
    const double *dir_centres;    /* n_dir from-directions, degrees in [0, 360),
                                     strictly increasing, spaced >= dir_width apart
                                     (also across north) */
    double dir_width;             /* degrees, 0 < w, n_dir * w <= 360 */
} sy_climate_bins;

/* Descriptive metadata. As input the strings are copied (NULL = empty); as output
 * (sy_climate_table_meta) they belong to the table. */
typedef struct sy_climate_meta {
    const char *site;         /* site name */
    const char *source;       /* where the numbers came from */
    const char *institution;  /* who made them (CF attribute), may be empty */
    const char *comment;      /* free text, may be empty */
    double record_years;      /* length of the underlying record, years; NAN if unknown */
    double depth;             /* water depth at the site, m; NAN if unknown */
    int invented;             /* 1 if the data are invented (demo/test data) */
} sy_climate_meta;

typedef struct sy_climate_table sy_climate_table;

/* A table with the given bins, zero occurrence and empty metadata (record_years and depth
 * NAN). Checks the bins (SY_EINPUT with the offending edge and value). Free with
 * sy_climate_table_free. */
SY_API int sy_climate_table_create(sy_climate_table **out, const sy_climate_bins *bins,
                                   sy_climate_occurrence_kind occurrence, sy_error *err);
SY_API void sy_climate_table_free(sy_climate_table *t);

/* Deep copy. */
SY_API int sy_climate_table_copy(sy_climate_table **out, const sy_climate_table *t,
                                 sy_error *err);

SY_API const sy_climate_bins *sy_climate_table_bins(const sy_climate_table *t);
SY_API sy_climate_occurrence_kind sy_climate_table_occurrence_kind(const sy_climate_table *t);
/* Number of occurrence values: n_hs * n_period * max(n_dir, 1). */
SY_API size_t sy_climate_table_size(const sy_climate_table *t);
/* Flat index of bin (i_hs, i_period, i_dir); i_dir = 0 for an omnidirectional table. */
SY_API size_t sy_climate_table_index(const sy_climate_table *t, size_t i_hs, size_t i_period,
                                     size_t i_dir);
/* The occurrence values (layout in the file comment), read-only and writable views. */
SY_API const double *sy_climate_table_occurrence(const sy_climate_table *t);
SY_API double *sy_climate_table_occurrence_mut(sy_climate_table *t);
/* Mean annual hours of bin `index`: the value itself for an hours table, the fraction
 * times SY_CLIMATE_HOURS_PER_YEAR for a fraction table (O = N_h f, references.md 5.1). */
SY_API double sy_climate_table_hours(const sy_climate_table *t, size_t index);

/* Metadata strings are copied; a comment starting with the sentence the writer adds to
 * invented tables ("INVENTED DATA for demonstration ...") is stored without it. */
SY_API const sy_climate_meta *sy_climate_table_meta(const sy_climate_table *t);
SY_API int sy_climate_table_set_meta(sy_climate_table *t, const sy_climate_meta *meta,
                                     sy_error *err);

/* Check the occurrence: every value finite and >= 0, total > 0, a fraction table's total
 * <= 1 + SY_CLIMATE_TOTAL_SLACK and an hours table's total <= 8784 h (a leap year) times
 * (1 + SY_CLIMATE_TOTAL_SLACK). `where` (file name or NULL) starts the message. */
#define SY_CLIMATE_TOTAL_SLACK 0.01  /* published tables rounded to 0.01 % per bin over
                                        ~100 bins can overshoot by ~1 %; common practice */
SY_API int sy_climate_table_validate(const sy_climate_table *t, const char *where,
                                     sy_error *err);

/* ---- NetCDF form (layout in docs/formats.md) ------------------------------------ */

/* Read a scatter table written in the swellyield layout (by sy_climate_table_write or
 * by any program following docs/formats.md) and validate it. */
SY_API int sy_climate_table_read(sy_climate_table **out, const char *path, sy_error *err);

/* Write t (validated first) as NetCDF-4 with CF-1.10 metadata. Atomic: the file is
 * written to a temporary file in the same directory and renamed over path; on any
 * failure the temporary file is removed and an existing file at path is untouched.
 * history records the swellyield version; `history_note` (may be NULL) is appended. */
SY_API int sy_climate_table_write(const sy_climate_table *t, const char *path,
                                  const char *history_note, sy_error *err);

/* ---- CSV import (layout in docs/formats.md) -------------------------------------- */

/* Read a long-form CSV scatter table: '#' lines carry "key: value" metadata (site,
 * source, institution, comment, record_years, depth_m, invented) or comments; the first
 * other line is the header, naming columns
 *   hs_min, hs_max, te_min, te_max (or tp_min, tp_max),
 *   [dir_from_min, dir_from_max,] and one of hours_per_year | fraction | percent;
 * each later line is one bin (bins not listed have zero occurrence; percent is divided
 * by 100 into a fraction table). Bin edges are the union of the listed limits; a row
 * spanning more than one of them is an overlap error. */
SY_API int sy_climate_table_read_csv(sy_climate_table **out, const char *path, sy_error *err);

/* Read a scatter table from either form: paths ending in ".csv" (any case) as CSV, all
 * others as NetCDF. For the command line's summarise and convert verbs. */
SY_API int sy_climate_table_load(sy_climate_table **out, const char *path, sy_error *err);

/* ---- Summary statistics ----------------------------------------------------------- */

typedef struct sy_climate_summary {
    double total;           /* sum of occurrence, in the table's unit */
    double total_hours;     /* mean annual hours covered by the table, h/yr */
    double hours_per_year;  /* the constant used: SY_CLIMATE_HOURS_PER_YEAR */
    double hs_min, hs_max;  /* lower edge of the lowest / upper edge of the highest Hs bin
                               with non-zero occurrence, m */
    double period_min, period_max;  /* the same for the period axis, s */
    size_t n_bins;          /* bins in the table */
    size_t n_nonzero;       /* bins with occurrence > 0 */
} sy_climate_summary;

SY_API int sy_climate_table_summarise(const sy_climate_table *t, sy_climate_summary *s,
                                      sy_error *err);

/* One bin as handed to a caller's function: indices, centres and limits. */
typedef struct sy_climate_bin {
    size_t i_hs, i_period, i_dir, index;  /* index = flat index in the occurrence array */
    double hs, hs_lo, hs_hi;              /* centre and edges, m */
    double period, period_lo, period_hi;  /* s; kind from the table's bins */
    sy_climate_period_kind period_kind;
    double dir_from;                      /* centre, nautical degrees from; NAN if the
                                             table is omnidirectional */
    double hours;                         /* mean annual hours in the bin, h/yr */
} sy_climate_bin;

/* A per-bin quantity q (for example mean wave power J in W/m, or device power in W).
 * Return SY_OK and set *q; any other status stops the loop and is passed on. */
typedef int (*sy_climate_bin_fn)(const sy_climate_bin *bin, void *ctx, double *q,
                                 sy_error *err);

typedef struct sy_climate_average {
    double mean;      /* occurrence-weighted mean of q over bins with occurrence > 0 */
    double per_year;  /* sum of q x hours per year (q in W gives W h per year) */
    double hours;     /* mean annual hours covered, h/yr (weight total) */
    double hours_per_year;  /* SY_CLIMATE_HOURS_PER_YEAR, used for fraction tables */
    size_t n_bins;    /* bins evaluated (those with occurrence > 0) */
} sy_climate_average;

/* Evaluate fn on every bin with non-zero occurrence (in flat index order) and form the
 * occurrence-weighted mean and the annual sum. The lead's uses: mean J of a climate,
 * annual energy = sum P_bin O_bin (references.md 5.1; O from sy_climate_table_hours).
 * A bin the caller cannot value (for example no power-matrix entry while the bin has
 * occurrence, which references.md 5.1 says must be reported, not treated as 0): return an
 * error from fn; the message gets the bin's limits in front.
 * SY_EINPUT if the table has no occurrence; the callback's status otherwise. */
SY_API int sy_climate_table_average(const sy_climate_table *t, sy_climate_bin_fn fn,
                                    void *ctx, sy_climate_average *avg, sy_error *err);

/* ---- Directions ------------------------------------------------------------------- */

/* The one conversion between metocean and hydrodynamic directions.
 * from_deg: direction waves come FROM, nautical degrees clockwise from north;
 * x_axis_bearing_deg: bearing of the array's +x axis, degrees clockwise from north.
 * beta: heading the waves travel TOWARD, radians counter-clockwise from +x, in (-pi, pi].
 * Derivation: toward-bearing = from + 180; +x has bearing B and +y (90 degrees
 * counter-clockwise of +x) bearing B - 90, so beta = B - (from + 180), in radians.
 * SY_EINVAL for non-finite input. Pure, thread-safe. */
SY_API int sy_climate_heading(double from_deg, double x_axis_bearing_deg, double *beta,
                              sy_error *err);
/* The inverse, for reports: beta (rad) -> from-direction in [0, 360) degrees. */
SY_API int sy_climate_from_direction(double beta, double x_axis_bearing_deg, double *from_deg,
                                     sy_error *err);

/* ---- CF time ---------------------------------------------------------------------- */

/* Decode CF time values: units "<unit> since <y-m-d[ H:M:S[.f]][ Z|+h:mm|-h:mm|+hmm]>"
 * (unit one of days/day/d, hours/hour/hr/h, minutes/minute/min, seconds/second/sec/s;
 * 'T' may separate date and time), calendar "standard" (also NULL or empty),
 * "gregorian" or "proleptic_gregorian" (the standard calendar only for reference dates
 * on or after 1582-10-15, where it equals proleptic Gregorian). Other calendars
 * (julian, noleap/365_day, all_leap/366_day, 360_day, utc, tai, none) and the units
 * year/month are rejected with SY_EINPUT: annual statistics need real calendar time.
 * out[i] = seconds since 1970-01-01T00:00:00Z. */
SY_API int sy_climate_cf_time_decode(const char *units, const char *calendar,
                                     const double *values, size_t n, double *out,
                                     sy_error *err);
/* Format unix seconds as "YYYY-MM-DDTHH:MM:SS[.fff]Z" (proleptic Gregorian, fraction
 * printed when non-zero, to the millisecond). buf_size >= 32 always suffices. */
SY_API void sy_climate_time_format(double unix_seconds, char *buf, size_t buf_size);

/* ---- Hindcast time series --------------------------------------------------------- */

/* A CF NetCDF time series of sea-state parameters, all records kept (missing values as
 * NAN) so time steps stay known. Plain struct, read-only for callers; free with
 * sy_climate_series_free. */
typedef struct sy_climate_series {
    size_t n;                  /* records (time steps) in the file */
    double *time;              /* s since 1970-01-01T00:00:00Z, strictly increasing */
    double *hs;                /* m, NAN where missing */
    double *period;            /* s, NAN where missing (Tp = 1/fp when read from fp) */
    double *dir_from;          /* nautical degrees from; NULL if not requested */
    sy_climate_period_kind period_kind;
    size_t n_missing;          /* records with a missing Hs, period or (if read) direction */
    double depth;              /* m, from a sea_floor_depth_* variable; NAN if none */
    char hs_var[64], period_var[64], dir_var[64], time_var[64];  /* names in the file */
    char site[128];            /* global attribute site_name, else empty */
    char file[256];            /* the path read (truncated if longer) */
    int invented;              /* global attribute invented_data == "yes" */
} sy_climate_series;

/* Read the series from path, finding variables by CF standard_name, not by name:
 *   Hs   sea_surface_wave_significant_height (units m);
 *   Te   sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment,
 *   Tp   sea_surface_wave_period_at_variance_spectral_density_maximum, or
 *   fp   sea_surface_wave_frequency_at_variance_spectral_density_maximum (s-1; Tp = 1/fp)
 *        as `period` asks (SY_CLIMATE_TE or SY_CLIMATE_TP);
 *   from-direction sea_surface_wave_from_direction (else the _at_variance_spectral_density_
 *        maximum variant), degrees, only when want_direction;
 *   time: the variable with standard_name "time" or axis "T", CF units and calendar.
 * Each variable is 1-D over time (other dimensions of length 1 allowed). Values are
 * unpacked (scale_factor, add_offset); records equal to _FillValue (or the NetCDF default
 * fill when none is given) or missing_value (compared packed), or NaN, count as missing. */
SY_API int sy_climate_series_read(sy_climate_series **out, const char *path,
                                  sy_climate_period_kind period, int want_direction,
                                  sy_error *err);
SY_API void sy_climate_series_free(sy_climate_series *s);

/* How binning treats records that are missing. */
typedef enum {
    SY_CLIMATE_GAPS_SCALE = 0,  /* gaps assumed unbiased: occurrence scaled by
                                   span / observed time, table total = N_h less any
                                   out-of-range share */
    SY_CLIMATE_GAPS_KEEP = 1    /* gaps left out: totals fall short of N_h by the
                                   missing share */
} sy_climate_gap_policy;

typedef struct sy_climate_bin_report {
    size_t n_records, n_missing, n_outside;  /* outside: valid but in no bin */
    double span_hours;       /* sum of record steps (last step = the one before it), h */
    double valid_hours;      /* the same over valid records, h */
    double outside_hours;    /* valid hours falling in no bin, h */
    double record_years;     /* span_hours / SY_CLIMATE_HOURS_PER_YEAR */
    double step_hours_min, step_hours_max;  /* smallest and largest time step, h */
    double hours_per_year;   /* SY_CLIMATE_HOURS_PER_YEAR */
} sy_climate_bin_report;

/* Bin a series into a new hours-per-year table with the given bins (direction bins need a
 * series read with want_direction). Each record stands for its time step dt_i (the time
 * to the next record; the last record repeats the step before it); bin hours per year =
 * sum dt_i / record_years, times span/valid under SY_CLIMATE_GAPS_SCALE. Metadata: site
 * from the series, source naming the variables and counts, record_years, invented.
 * rep may be NULL. SY_EINPUT if no record is valid or the series has < 2 records. */
SY_API int sy_climate_series_bin(sy_climate_table **out, const sy_climate_series *s,
                                 const sy_climate_bins *bins, sy_climate_gap_policy gaps,
                                 sy_climate_bin_report *rep, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
