/* A time response's CSV and picture side by side (the `poles -t` and `run --resonances`
 * outputs): dir/stem.csv and dir/stem.png, each written atomically by its writer. */
#include "cli.h"

#include <stdio.h>

int sy_cli_time_response(const sy_model *m, const sy_pole_set *ps, sy_response_kind kind, const char *dir,
                         const char *stem, sy_error *err)
{
    char path[SY_OUTPUTS_PATH_MAX + 64];
    if ((size_t)snprintf(path, sizeof path, "%s/%s.csv", dir, stem) >= sizeof path)
        return sy_error_set(err, SY_EINVAL, "time response: path '%.40s...' too long", dir);
    sy_response_settings s;
    sy_response *r = NULL;
    int rc = sy_response_settings_standard(&s, m, ps, kind, err);
    if (rc == SY_OK)
        rc = sy_poles_response(&r, m, ps, &s, err);
    if (rc == SY_OK)
        rc = sy_response_write_csv(r, m, path, err);
    if (rc == SY_OK)
        rc = sy_plot_response(dir, stem, m, r, "png", err);
    sy_response_free(r);
    return rc;
}
