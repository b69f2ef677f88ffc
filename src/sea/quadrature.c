/* Adaptive quadrature shared by the sea module: GSL QAG (41-point Gauss-Kronrod) on
 * finite intervals, QAGIU on [a, inf), with GSL statuses turned into sy_error codes
 * (sy_init() has switched GSL's aborting handler off). */
#include <complex.h>
#include "sea_impl.h"

#include <gsl/gsl_errno.h>
#include <gsl/gsl_integration.h>
#include <math.h>

/* Subintervals GSL may create: generous for smooth integrands with one sharp peak. */
#define WORKSPACE_INTERVALS 1000

int syi_sea_integrate(double (*f)(double x, void *p), void *p, double a, double b, double *result,
                      const char *what, sy_error *err)
{
    gsl_integration_workspace *w = gsl_integration_workspace_alloc(WORKSPACE_INTERVALS);
    if (w == NULL)
        return sy_error_set(err, SY_ENOMEM, "sea: quadrature workspace for %s", what);
    gsl_function F = {.function = f, .params = p};
    double abserr = 0;
    int st = isinf(b) ? gsl_integration_qagiu(&F, a, 0.0, SYI_SEA_EPSREL, WORKSPACE_INTERVALS, w,
                                              result, &abserr)
                      : gsl_integration_qag(&F, a, b, 0.0, SYI_SEA_EPSREL, WORKSPACE_INTERVALS,
                                            GSL_INTEG_GAUSS41, w, result, &abserr);
    gsl_integration_workspace_free(w);
    if (st == GSL_SUCCESS || (isfinite(*result) && abserr <= SYI_SEA_EPSREL_ACCEPT * fabs(*result)))
        return SY_OK;
    return sy_error_set(err, SY_ENOCONV,
                        "sea: integral of %s over [%g, %g] failed: %s (estimate %g +- %g)", what, a,
                        b, gsl_strerror(st), *result, abserr);
}
