/* Private to the io module: NetCDF writing helpers shared by the output files. */
#ifndef SY_IO_IMPL_H
#define SY_IO_IMPL_H

#include <netcdf.h>
#include "swellyield/core.h"

/* A NetCDF call inside a function that has `int rc`, `const char *path`, `sy_error *err`
 * and a `fail:` label: on failure record path, what and nc_strerror, then jump. */
#define SYI_NC(call, what)                                                                   \
    do {                                                                                     \
        int nc_rc_ = (call);                                                                 \
        if (nc_rc_ != NC_NOERR) {                                                            \
            rc = sy_error_set(err, SY_EIO, "%s: %s: %s", path, (what), nc_strerror(nc_rc_)); \
            goto fail;                                                                       \
        }                                                                                    \
    } while (0)

/* Text attribute (NC_GLOBAL for the file). */
int syi_nc_put_text(int nc, int var, const char *name, const char *text);

/* A double variable with units, long_name, optional standard_name (NULL: none) and, for
 * multi-dimensional fields, _FillValue NaN. */
int syi_nc_def_double(int nc, const char *name, int ndims, const int *dims, const char *units,
                      const char *long_name, const char *standard_name, int *var);

#endif
