/* Status texts and the sy_error record (see include/swellyield/core.h). */
#include "swellyield/core.h"

#include <stdarg.h>
#include <stdio.h>
#include <string.h>

const char *sy_status_text(int code)
{
#define SY_STATUS_CASE(name, text) case name: return text;
    switch (code) {
        SY_STATUS_LIST(SY_STATUS_CASE)
    default: break;
    }
#undef SY_STATUS_CASE
    return "unknown status";
}

int sy_error_set(sy_error *err, int code, const char *fmt, ...)
{
    if (err != NULL) {
        va_list ap;
        va_start(ap, fmt);
        err->code = code;
        vsnprintf(err->msg, sizeof err->msg, fmt, ap);
        va_end(ap);
    }
    return code;
}

void sy_error_prefix(sy_error *err, const char *fmt, ...)
{
    if (err == NULL)
        return;
    char head[SY_ERROR_MSG_MAX], joined[2 * SY_ERROR_MSG_MAX + 2];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(head, sizeof head, fmt, ap);
    va_end(ap);
    if (err->msg[0] != '\0')
        snprintf(joined, sizeof joined, "%s: %s", head, err->msg);
    else
        snprintf(joined, sizeof joined, "%s", head);
    /* Keep the head of the message when it is too long: the context is what matters. */
    snprintf(err->msg, sizeof err->msg, "%.*s", (int)(sizeof err->msg - 1), joined);
}

void sy_error_clear(sy_error *err)
{
    if (err != NULL) {
        err->code = SY_OK;
        err->msg[0] = '\0';
    }
}
