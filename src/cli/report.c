/* Error lines and exit codes shared by every verb. */
#include "cli.h"

#include <stdarg.h>
#include <stdio.h>

int sy_cli_fail(const char *verb, int rc, const sy_error *err)
{
    fprintf(stderr, "swellyield: %s: %s\n", verb, err != NULL && err->msg[0] ? err->msg : sy_status_text(rc));
    return rc == SY_EINPUT || rc == SY_EINVAL || rc == SY_EIO || rc == SY_ELIMIT ? SY_EXIT_USAGE : SY_EXIT_FAIL;
}

int sy_cli_usage_error(const char *verb, const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    fprintf(stderr, "swellyield: %s: ", verb);
    vfprintf(stderr, fmt, ap);
    fprintf(stderr, " (swellyield %s --help)\n", verb);
    va_end(ap);
    return SY_EXIT_USAGE;
}
