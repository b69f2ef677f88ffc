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

/* A message is one line of text whatever the input echoed into it (a quoted CSV field
 * may hold newlines, a file any control byte): control bytes become '?'. UTF-8 (bytes
 * >= 0x80) passes through. */
static void one_line(char *s)
{
    for (; *s != '\0'; s++)
        if ((unsigned char)*s < 0x20 || *s == 0x7f)
            *s = '?';
}

int sy_error_set(sy_error *err, int code, const char *fmt, ...)
{
    if (err != NULL) {
        va_list ap;
        va_start(ap, fmt);
        err->code = code;
        vsnprintf(err->msg, sizeof err->msg, fmt, ap);
        va_end(ap);
        one_line(err->msg);
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
    one_line(err->msg);
}

void sy_error_clear(sy_error *err)
{
    if (err != NULL) {
        err->code = SY_OK;
        err->msg[0] = '\0';
    }
}
