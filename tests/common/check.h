/* Test helpers: one PASS/FAIL line per check, 17 significant digits on failure;
 * sy_check_summary() returns the process exit status (non-zero if any check failed),
 * so ctest fails the test. */
#ifndef SY_TEST_CHECK_H
#define SY_TEST_CHECK_H

#include <complex.h>
#include "swellyield/core.h"

/* Passes if |got - want| <= atol + rtol |want| (and neither is NaN). */
int sy_check_close(double got, double want, double rtol, double atol, const char *fmt, ...)
    SY_PRINTF(5, 6);
/* Complex version: |got - want| <= atol + rtol |want|. */
int sy_check_cclose(double complex got, double complex want, double rtol, double atol,
                    const char *fmt, ...) SY_PRINTF(5, 6);
/* Passes if cond is non-zero. */
int sy_check_true(int cond, const char *fmt, ...) SY_PRINTF(2, 3);
/* Passes if status == SY_OK; prints err->msg otherwise (err may be NULL). */
int sy_check_ok(int status, const sy_error *err, const char *fmt, ...) SY_PRINTF(3, 4);
/* Passes if status == want and, when substr != NULL, err->msg contains substr. */
int sy_check_fails(int status, int want, const sy_error *err, const char *substr,
                   const char *fmt, ...) SY_PRINTF(5, 6);
/* Prints "N passed, N failed" and returns 0 if none failed, 1 otherwise. */
int sy_check_summary(void);

#endif
