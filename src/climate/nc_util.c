/* NetCDF helpers shared by the table reader, writer and the hindcast reader. */
#include "climate_impl.h"

#include <netcdf.h>
#include <stdlib.h>

int syi_climate_nc_text_att(int ncid, int varid, const char *name, char **out,
                            const char *path, sy_error *err)
{
    *out = NULL;
    nc_type type;
    size_t len;
    int st = nc_inq_att(ncid, varid, name, &type, &len);
    if (st == NC_ENOTATT)
        return SY_OK;
    char var[NC_MAX_NAME + 1] = "global";
    if (varid != NC_GLOBAL)
        nc_inq_varname(ncid, varid, var);
    if (st != NC_NOERR)
        return sy_error_set(err, SY_EIO, "%s: variable '%s': attribute '%s': %s", path, var,
                            name, nc_strerror(st));
    if (type == NC_STRING) {
        if (len != 1)
            return sy_error_set(err, SY_EINPUT,
                                "%s: variable '%s': attribute '%s' holds %zu strings, "
                                "expected one", path, var, name, len);
        char *s = NULL;
        st = nc_get_att_string(ncid, varid, name, &s);
        if (st != NC_NOERR)
            return sy_error_set(err, SY_EIO, "%s: variable '%s': attribute '%s': %s", path, var,
                                name, nc_strerror(st));
        *out = syi_climate_strdup(s);
        nc_free_string(1, &s);
    } else if (type == NC_CHAR) {
        char *s = malloc(len + 1);
        if (s == NULL)
            return sy_error_set(err, SY_ENOMEM, "%s: attribute '%s'", path, name);
        st = nc_get_att_text(ncid, varid, name, s);
        if (st != NC_NOERR) {
            free(s);
            return sy_error_set(err, SY_EIO, "%s: variable '%s': attribute '%s': %s", path, var,
                                name, nc_strerror(st));
        }
        s[len] = '\0';
        while (len > 0 && s[len - 1] == '\0')   /* some writers count the terminator */
            len--;
        *out = s;
        return SY_OK;
    } else {
        return sy_error_set(err, SY_EINPUT,
                            "%s: variable '%s': attribute '%s' is not text (NetCDF type %d)",
                            path, var, name, (int)type);
    }
    if (*out == NULL)
        return sy_error_set(err, SY_ENOMEM, "%s: attribute '%s'", path, name);
    return SY_OK;
}
