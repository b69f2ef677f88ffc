/* Test helpers (see check.h). */
#include "check.h"

#include <math.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

static int n_pass, n_fail;

static int report(int ok, const char *detail, const char *fmt, va_list ap)
{
    printf("%s: ", ok ? "PASS" : "FAIL");
    vprintf(fmt, ap);
    if (!ok && detail != NULL && detail[0] != '\0')
        printf("  [%s]", detail);
    printf("\n");
    if (ok)
        n_pass++;
    else
        n_fail++;
    fflush(stdout);
    return ok;
}

int sy_check_close(double got, double want, double rtol, double atol, const char *fmt, ...)
{
    double diff = fabs(got - want);
    int ok = !isnan(got) && !isnan(want) && diff <= atol + rtol * fabs(want);
    char detail[200];
    snprintf(detail, sizeof detail, "got %.17g want %.17g diff %.3g rel %.3g", got, want, diff,
             want != 0.0 ? diff / fabs(want) : diff);
    va_list ap;
    va_start(ap, fmt);
    report(ok, detail, fmt, ap);
    va_end(ap);
    return ok;
}

int sy_check_cclose(double complex got, double complex want, double rtol, double atol,
                    const char *fmt, ...)
{
    double diff = cabs(got - want);
    int ok = !isnan(creal(got)) && !isnan(cimag(got)) && diff <= atol + rtol * cabs(want);
    char detail[240];
    snprintf(detail, sizeof detail, "got %.17g%+.17gi want %.17g%+.17gi diff %.3g", creal(got),
             cimag(got), creal(want), cimag(want), diff);
    va_list ap;
    va_start(ap, fmt);
    report(ok, detail, fmt, ap);
    va_end(ap);
    return ok;
}

int sy_check_true(int cond, const char *fmt, ...)
{
    va_list ap;
    va_start(ap, fmt);
    report(cond != 0, NULL, fmt, ap);
    va_end(ap);
    return cond != 0;
}

int sy_check_ok(int status, const sy_error *err, const char *fmt, ...)
{
    char detail[SY_ERROR_MSG_MAX + 64];
    snprintf(detail, sizeof detail, "status %d (%s): %s", status, sy_status_text(status),
             err != NULL ? err->msg : "");
    va_list ap;
    va_start(ap, fmt);
    report(status == SY_OK, detail, fmt, ap);
    va_end(ap);
    return status == SY_OK;
}

int sy_check_fails(int status, int want, const sy_error *err, const char *substr,
                   const char *fmt, ...)
{
    const char *msg = err != NULL ? err->msg : "";
    int ok = status == want && (substr == NULL || strstr(msg, substr) != NULL);
    char detail[SY_ERROR_MSG_MAX + 128];
    snprintf(detail, sizeof detail, "status %d want %d, message '%s' want substring '%s'", status,
             want, msg, substr != NULL ? substr : "");
    va_list ap;
    va_start(ap, fmt);
    report(ok, detail, fmt, ap);
    va_end(ap);
    return ok;
}

int sy_check_summary(void)
{
    printf("%d passed, %d failed\n", n_pass, n_fail);
    return n_fail == 0 && n_pass > 0 ? 0 : 1;
}
