/* The edge-weighted Gegenbauer gap functions of the float solver (float_impl.h):
 * their depth-mode projections in closed form (Gradshteyn & Ryzhik 7.321, the Gegenbauer
 * integral int_{-1}^{1} (1-t^2)^(nu-1/2) C_n^nu(t) e^{ixt} dt =
 * pi 2^(1-nu) i^n Gamma(n+2nu)/(n! Gamma(nu)) x^(-nu) J_{n+nu}(x)) against direct
 * quadrature with GSL's QAWS rule for algebraic end-point weights (gsl_integration_qaws,
 * GSL 2.7) and GSL's Gegenbauer polynomials (gsl_sf_gegenpoly_n), for both families
 * nu = 1/6 and 5/6 and for the cosh (propagating) modes; and the moments m0, m2. */
#include <complex.h>
#include <math.h>
#include <gsl/gsl_integration.h>
#include <gsl/gsl_sf_gamma.h>
#include <gsl/gsl_sf_gegenbauer.h>
#include "check.h"
#include "body/float_impl.h"

typedef struct { double nu, x; int n, hyper; } par;

/* gamma_n(nu) = pi 2^(1-nu) Gamma(n + 2nu) / (n! Gamma(nu)) */
static double gegen_gamma(double nu, int n)
{
    return 3.14159265358979323846 * pow(2.0, 1.0 - nu) * gsl_sf_gamma(n + 2.0 * nu) /
           (gsl_sf_fact((unsigned)n) * gsl_sf_gamma(nu));
}

/* C_n^nu(t) cos(x t) or cosh(x t); the weight (1-t)^a (1+t)^a is QAWS's */
static double integrand(double t, void *p)
{
    const par *q = p;
    double c = gsl_sf_gegenpoly_n(q->n, q->nu, t);
    return c * (q->hyper ? cosh(q->x * t) : cos(q->x * t));
}

static double quad(double nu, int n, double x, int hyper)
{
    par q = {nu, x, n, hyper};
    gsl_function f = {integrand, &q};
    gsl_integration_workspace *w = gsl_integration_workspace_alloc(200);
    gsl_integration_qaws_table *tab = gsl_integration_qaws_table_alloc(nu - 0.5, nu - 0.5, 0, 0);
    double r = NAN, e;
    gsl_integration_qaws(&f, -1.0, 1.0, tab, 0.0, 1e-13, 200, w, &r, &e);
    gsl_integration_qaws_table_free(tab);
    gsl_integration_workspace_free(w);
    return r;
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* A plan only to reach the projection routine; b = h - d = 13 m. */
    sy_body_plan *plan = NULL;
    sy_body_geometry geo = {SY_BODY_FLOAT, 3.0, 7.0, 0.0};
    sy_check_ok(syi_body_float_plan_create(&plan, &geo, 20.0, 5, 2, 16, 1, 1, &err), &err,
                "plan with 5 + 2 gap functions");
    if (plan == NULL)
        return sy_check_summary();
    const syi_float_plan *fp = plan->impl;
    const double b = fp->b;
    const double xs[] = {0.37, 2.9, 11.3, 31.7};   /* small, moderate, recurrence, Hankel-free */
    for (size_t ix = 0; ix < 4; ix++) {
        double complex g[SYI_FLOAT_PMAX + 2];
        double k = xs[ix] / b;
        sy_check_ok(syi_float_proj_cos(fp, 0, k, g, &err), &err, "projections at x = %g", xs[ix]);
        for (size_t l = 0; l < fp->PG; l++) {
            double nu = fp->nu_l[l];
            int n = 2 * fp->ord_l[l];
            /* f_l = (2/gamma) (1-t^2)^(nu-1/2) C_n^nu, gamma = pi 2^(1-nu) Gamma(n+2nu)/(n! Gamma(nu));
             * int_0^b f_l(s/b) cos(k s) ds = (b/2) (2/gamma) int_{-1}^{1} ... */
            double gam = gegen_gamma(nu, n);
            double want = b / gam * quad(nu, n, xs[ix], 0);
            /* QAWS reaches ~1e-13; the closed form is exact up to Bessel round-off */
            sy_check_close(creal(g[l]), want, 1e-11, 1e-14, "G&R 7.321: family nu = %.4f, n = %d, x = %g",
                           nu, n, xs[ix]);
        }
    }
    /* moments: int_0^1 t^k f_l dt against QAWS with cos replaced by t^k: use x -> 0 limit
     * of the closed form: m0 = 2^-nu/Gamma(1+nu) for n = 0 (DLMF 10.2.2) */
    for (size_t l = 0; l < fp->PG; l++) {
        double nu = fp->nu_l[l];
        int n = 2 * fp->ord_l[l];
        double gam = gegen_gamma(nu, n);
        double want0 = quad(nu, n, 0.0, 0) / gam;                 /* int_0^1 f dt */
        /* second moment from the even part: (1/gamma) int t^2 w C dt via d^2/dx^2 at 0,
         * computed as [quad(x) - quad(0)] / (-x^2/2) with x small, error O(x^2) */
        double xe = 1e-3;
        double want2 = (quad(nu, n, xe, 1) - quad(nu, n, 0.0, 1)) / (xe * xe / 2.0) / gam;
        sy_check_close(fp->m0[l], want0, 1e-11, 1e-13, "moment m0 of gap function %zu", l);
        sy_check_close(fp->m2[l], want2, 1e-5, 1e-8, "moment m2 of gap function %zu (FD in x, O(x^2))", l);
    }
    sy_body_plan_free(plan);
    return sy_check_summary();
}
