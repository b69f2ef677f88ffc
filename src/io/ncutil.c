/* NetCDF writing helpers of the io module (io_impl.h). */
#include "io_impl.h"

#include <math.h>
#include <string.h>

int syi_nc_put_text(int nc, int var, const char *name, const char *text)
{
    return nc_put_att_text(nc, var, name, strlen(text), text);
}

int syi_nc_def_double(int nc, const char *name, int nd, const int *dims, const char *units, const char *long_name,
                      const char *std_name, int *v)
{
    int s = nc_def_var(nc, name, NC_DOUBLE, nd, dims, v);
    if (s == NC_NOERR && units != NULL)
        s = syi_nc_put_text(nc, *v, "units", units);
    if (s == NC_NOERR)
        s = syi_nc_put_text(nc, *v, "long_name", long_name);
    if (s == NC_NOERR && std_name != NULL)
        s = syi_nc_put_text(nc, *v, "standard_name", std_name);
    if (s == NC_NOERR && nd > 1) {
        double fill = NAN;
        s = nc_put_att_double(nc, *v, "_FillValue", NC_DOUBLE, 1, &fill);
    }
    return s;
}
