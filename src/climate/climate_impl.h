/* Private to the climate module: the scatter-table body and helpers shared between its
 * files (bin checks, NetCDF error text, string copies). See include/swellyield/climate.h. */
#ifndef SY_CLIMATE_IMPL_H
#define SY_CLIMATE_IMPL_H

#include "swellyield/climate.h"

struct sy_climate_table {
    sy_climate_bins bins;            /* points into the owned arrays below */
    double *hs_edges;                /* n_hs + 1 */
    double *period_edges;            /* n_period + 1 */
    double *dir_centres;             /* n_dir, NULL if omnidirectional */
    sy_climate_occurrence_kind kind;
    size_t n_values;                 /* n_hs * n_period * max(n_dir, 1) */
    double *occ;                     /* n_values */
    sy_climate_meta meta;            /* strings point into the owned copies below */
    char *site, *source, *institution, *comment;
};

/* Check a bin layout; `where` (may be NULL) starts the message. */
int syi_climate_check_bins(const sy_climate_bins *b, const char *where, sy_error *err);

/* Direction bin of a from-direction (degrees), or (size_t)-1 if in none. */
size_t syi_climate_dir_bin(const sy_climate_bins *b, double from_deg);

/* malloc'd copy of s (NULL gives ""), NULL on allocation failure. */
char *syi_climate_strdup(const char *s);

/* Read a text attribute of variable varid (NC_GLOBAL for the file) into a new string;
 * *out = NULL and SY_OK when the attribute is absent. */
int syi_climate_nc_text_att(int ncid, int varid, const char *name, char **out,
                            const char *path, sy_error *err);

/* Sentence the writer puts before the comment of an invented table; readers strip it so
 * meta.comment holds only the source's own comment. */
#define SYI_INVENTED_SENTENCE                                                             \
    "INVENTED DATA for demonstration and testing: these numbers are not measurements or " \
    "hindcast results of any real site."

/* s without a leading SYI_INVENTED_SENTENCE (and the spaces after it). */
const char *syi_climate_strip_invented(const char *s);

/* Period standard names (references.md 6.1). */
#define SYI_CF_HS "sea_surface_wave_significant_height"
#define SYI_CF_TE "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment"
#define SYI_CF_TP "sea_surface_wave_period_at_variance_spectral_density_maximum"
#define SYI_CF_FP "sea_surface_wave_frequency_at_variance_spectral_density_maximum"
#define SYI_CF_DIR "sea_surface_wave_from_direction"
#define SYI_CF_DIR_PEAK "sea_surface_wave_from_direction_at_variance_spectral_density_maximum"
#define SYI_CF_DEPTH "sea_floor_depth_below_mean_sea_level"
#define SYI_CF_DEPTH_SURFACE "sea_floor_depth_below_sea_surface"

/* Accepted unit spellings (UDUNITS-compatible). */
int syi_climate_units_metre(const char *u);
int syi_climate_units_second(const char *u);
int syi_climate_units_hertz(const char *u);
int syi_climate_units_degree(const char *u);

#endif
