/* sy_error record: formatting, prefixing, status texts. Pure properties of our own code. */
#include "check.h"

#include <string.h>

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    int rc = sy_error_set(&err, SY_EINPUT, "radius must be > 0 m, got %g", -3.0);
    sy_check_true(rc == SY_EINPUT && err.code == SY_EINPUT, "set returns and stores the code");
    sy_error_prefix(&err, "%s:%d", "shelf.ini", 12);
    sy_check_true(strcmp(err.msg, "shelf.ini:12: radius must be > 0 m, got -3") == 0,
                  "prefix gives file:line: message (%s)", err.msg);
    sy_check_true(sy_error_set(NULL, SY_EIO, "x") == SY_EIO, "NULL error record is allowed");
    sy_check_true(strcmp(sy_status_text(SY_ESINGULAR), "singular system") == 0, "status text");
    sy_check_true(strcmp(sy_status_text(-7), "unknown status") == 0, "unknown status text");
    sy_error_clear(&err);
    sy_check_true(err.code == SY_OK && err.msg[0] == '\0', "clear");
    /* One line whatever is echoed (a layout CSV's quoted header field held newlines and
     * control bytes; found by fuzz_layout, fuzz/corpus/fuzz_layout/newline-in-header). */
    sy_error_set(&err, SY_EINPUT, "layout.csv:3: unknown column '%s'", "\003name\nA0,\v\r\x7f");
    sy_check_true(strcmp(err.msg, "layout.csv:3: unknown column '?name?A0,\?\?\?'") == 0, "control bytes become '?': %s",
                  err.msg);
    sy_error_prefix(&err, "%s", "p.ini\nline");
    sy_check_true(strchr(err.msg, '\n') == NULL && strncmp(err.msg, "p.ini?line: ", 12) == 0, "prefix kept on one line");
    sy_error_set(&err, SY_EINPUT, "%s", "h\xc3\xb6he");
    sy_check_true(strcmp(err.msg, "h\xc3\xb6he") == 0, "UTF-8 passes through");
    return sy_check_summary();
}
