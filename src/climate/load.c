/* One entry point for reading a scatter table in either file form, chosen by the name:
 * "*.csv" (any case) is the long-form CSV, anything else the NetCDF layout. */
#include "climate_impl.h"

#include <ctype.h>
#include <string.h>

int sy_climate_table_load(sy_climate_table **out, const char *path, sy_error *err)
{
    if (out == NULL || path == NULL)
        return sy_error_set(err, SY_EINVAL, "scatter table load: NULL argument");
    size_t n = strlen(path);
    int csv = n >= 4 && path[n - 4] == '.' && tolower((unsigned char)path[n - 3]) == 'c' &&
              tolower((unsigned char)path[n - 2]) == 's' &&
              tolower((unsigned char)path[n - 1]) == 'v';
    return csv ? sy_climate_table_read_csv(out, path, err) : sy_climate_table_read(out, path, err);
}
