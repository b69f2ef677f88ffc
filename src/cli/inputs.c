/* Input helpers shared by verbs. */
#include "cli.h"

#include <string.h>

int sy_cli_read_climate(const char *path, sy_climate_table **out, sy_error *err)
{
    size_t n = strlen(path);
    if (n > 4 && strcmp(path + n - 4, ".csv") == 0)
        return sy_climate_table_read_csv(out, path, err);
    return sy_climate_table_read(out, path, err);
}
