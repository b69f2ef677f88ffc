/* cos-2s directional spreading (Longuet-Higgins, Cartwright & Smith 1963; references.md 3):
 *   D(theta) = G(s) cos^(2s)((theta - theta0)/2),  -pi < theta - theta0 <= pi,
 *   G(s) = Gamma(s+1) / (2 sqrt(pi) Gamma(s+1/2))   (log-gamma form: no overflow at large s),
 * and its discretisation onto a run's headings. The cumulative distribution is closed
 * form: with phi = theta - theta0 in [0, pi], substituting w = sin^2(v), v = phi'/2,
 *   int_0^phi D = 2 G int_0^{phi/2} cos^(2s) v dv = (1/2) I_{sin^2(phi/2)}(1/2, s + 1/2),
 * I the regularised incomplete beta function (G B(1/2, s+1/2) = 1/2), so every cell
 * weight is exact and the weights of a full-circle list sum to 1 to rounding.
 * s = 0 is the long-crested sentinel. Angles in rad. */
#include <complex.h>
#include "sea_impl.h"

#include <gsl/gsl_errno.h>
#include <gsl/gsl_sf_gamma.h>
#include <math.h>

/* A heading list whose end cells reach across the wrap gap to within this fraction of
 * it is taken as circular (rounding of a uniform full-circle list in radians). */
#define WRAP_TOL 1e-9

int sy_sea_spreading_init(sy_sea_spreading *d, double s, double theta0, sy_error *err)
{
    if (d == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: spreading record is NULL");
    if (!(s >= 0.0 && s <= SY_SEA_SPREAD_S_MAX))
        return sy_error_set(
            err, SY_EINPUT,
            "sea: spreading exponent s must be in [0, %g] (0 = long-crested), got %g",
            SY_SEA_SPREAD_S_MAX, s);
    if (!isfinite(theta0))
        return sy_error_set(err, SY_EINPUT, "sea: mean wave direction must be finite, got %g",
                            theta0);
    d->s = s;
    d->theta0 = theta0;
    d->norm = 0.0;
    if (s > 0.0) {
        gsl_sf_result a, b;
        int st = gsl_sf_lngamma_e(s + 1.0, &a);
        if (st == GSL_SUCCESS)
            st = gsl_sf_lngamma_e(s + 0.5, &b);
        if (st != GSL_SUCCESS)
            return sy_error_set(err, SY_ELOSS, "sea: log-gamma for spreading s = %g: %s", s,
                                gsl_strerror(st));
        d->norm = exp(a.val - b.val) / (2.0 * sqrt(SYI_PI));
    }
    return SY_OK;
}

/* theta - theta0 wrapped to (-pi, pi]. */
static double wrap(double phi)
{
    phi = remainder(phi, 2.0 * SYI_PI); /* [-pi, pi] */
    return phi == -SYI_PI ? SYI_PI : phi;
}

double sy_sea_spreading_eval(const sy_sea_spreading *d, double theta)
{
    if (d->s == 0.0)
        return 0.0;
    double c = cos(0.5 * wrap(theta - d->theta0));
    return d->norm * pow(fabs(c), 2.0 * d->s);
}

/* Continuous cumulative C(phi) = int_{-pi}^{phi} D(theta0 + u) du on the whole line
 * (C(phi + 2 pi) = C(phi) + 1). */
static int cumulative(const sy_sea_spreading *d, double phi, double *C, sy_error *err)
{
    double turns = floor((phi + SYI_PI) / (2.0 * SYI_PI));
    double p = fmin(SYI_PI, fmax(-SYI_PI, phi - 2.0 * SYI_PI * turns)); /* [-pi, pi] */
    double half = 0.0;
    if (d->s == 0.0) {
        half = p >= 0.0 ? 0.5 : -0.5; /* Dirac at 0: the step sits at phi = 0 */
    } else {
        double x = sin(0.5 * p);
        gsl_sf_result r;
        int st = gsl_sf_beta_inc_e(0.5, d->s + 0.5, x * x, &r);
        if (st != GSL_SUCCESS)
            return sy_error_set(err, SY_ELOSS,
                                "sea: incomplete beta for spreading s = %g at %g rad: %s", d->s, p,
                                gsl_strerror(st));
        half = copysign(0.5 * r.val, p);
    }
    *C = turns + 0.5 + half;
    return SY_OK;
}

int sy_sea_spreading_weights(const sy_sea_spreading *d, const double *beta, size_t n, double *D,
                             double *outside, sy_error *err)
{
    if (d == NULL || beta == NULL || D == NULL || n == 0)
        return sy_error_set(
            err, SY_EINVAL,
            "sea: spreading weights need a spreading, headings and output (n = %zu)", n);
    for (size_t j = 0; j < n; j++) {
        if (!isfinite(beta[j]) || (j > 0 && !(beta[j] > beta[j - 1])))
            return sy_error_set(
                err, SY_EINVAL,
                "sea: headings must be finite and strictly increasing, got beta[%zu] = %g rad", j,
                beta[j]);
    }
    double span = beta[n - 1] - beta[0];
    if (!(span < 2.0 * SYI_PI))
        return sy_error_set(
            err, SY_EINVAL,
            "sea: headings must span less than 2 pi (a full circle lists 0 or 360 deg, "
            "not both), got %g rad",
            span);
    double lo, hi;
    if (n == 1) {
        lo = beta[0] - SYI_PI;
        hi = beta[0] + SYI_PI;
    } else {
        double h_lo = 0.5 * (beta[1] - beta[0]), h_hi = 0.5 * (beta[n - 1] - beta[n - 2]);
        double gap = 2.0 * SYI_PI - span;
        if (h_lo + h_hi >= gap * (1.0 - WRAP_TOL)) {
            lo = beta[0] - 0.5 * gap; /* circular list: split the wrap gap */
            hi = beta[n - 1] + 0.5 * gap;
        } else {
            lo = beta[0] - h_lo;
            hi = beta[n - 1] + h_hi;
        }
    }
    double a = lo, Ca, Cb, sum = 0.0;
    int rc = cumulative(d, a - d->theta0, &Ca, err);
    for (size_t j = 0; rc == SY_OK && j < n; j++) {
        double b = j + 1 < n ? 0.5 * (beta[j] + beta[j + 1]) : hi;
        rc = cumulative(d, b - d->theta0, &Cb, err);
        D[j] = Cb - Ca;
        sum += D[j];
        Ca = Cb;
    }
    if (rc != SY_OK)
        return rc;
    if (outside != NULL)
        *outside = fmax(0.0, 1.0 - sum);
    return SY_OK;
}

double sy_sea_spreading_sigma(const sy_sea_spreading *d)
{
    return d->s == 0.0 ? 0.0 : sqrt(2.0 / (d->s + 1.0));
}

static double directionality_integrand(double u, void *p)
{
    const sy_sea_spreading *d = p;
    return d->norm * pow(cos(0.5 * u), 2.0 * d->s) * cos(u);
}

int sy_sea_spreading_directionality(const sy_sea_spreading *d, double *coef, sy_error *err)
{
    if (d->s == 0.0) {
        *coef = 1.0;
        return SY_OK;
    }
    /* Symmetric about u = 0: twice the integral over [0, pi/2]. */
    double half;
    int rc = syi_sea_integrate(directionality_integrand, (void *)d, 0.0, 0.5 * SYI_PI, &half,
                               "D cos (directionality)", err);
    if (rc == SY_OK)
        *coef = 2.0 * half;
    return rc;
}
