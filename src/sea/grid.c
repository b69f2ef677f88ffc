/* Frequency-grid quadrature for irregular-sea sums. Each omega[i] owns the cell bounded
 * by the mid-points to its neighbours; the end cells extend half their neighbouring
 * spacing outward (the lower one clipped at 0). So dOmega[i] = (omega[i+1] - omega[i-1])/2
 * inside (the trapezoid weights), and on a uniform grid every weight is the spacing,
 * which makes sum 2 S(omega_i) dOmega_i the usual amplitude^2 of component i
 * (conventions.md, "factor 2"). The same cells give exact cell energies. SI units. */
#include <complex.h>
#include "sea_impl.h"

#include <math.h>

int syi_sea_check_grid(const double *omega, size_t n, const char *name, sy_error *err)
{
    if (omega == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: %s grid is NULL", name);
    if (n < 2)
        return sy_error_set(err, SY_EINVAL, "sea: %s grid needs at least 2 points, got %zu", name,
                            n);
    if (!(omega[0] > 0.0) || !isfinite(omega[0]))
        return sy_error_set(err, SY_EINVAL, "sea: %s[0] must be finite and > 0 rad/s, got %g", name,
                            omega[0]);
    for (size_t i = 1; i < n; i++)
        if (!(omega[i] > omega[i - 1]) || !isfinite(omega[i]))
            return sy_error_set(
                err, SY_EINVAL,
                "sea: %s must be finite and strictly increasing, got %s[%zu] = %g after %g", name,
                name, i, omega[i], omega[i - 1]);
    return SY_OK;
}

void syi_sea_cell(const double *omega, size_t n, size_t i, double *a, double *b)
{
    *a =
        i > 0 ? 0.5 * (omega[i - 1] + omega[i]) : fmax(0.0, omega[0] - 0.5 * (omega[1] - omega[0]));
    *b = i + 1 < n ? 0.5 * (omega[i] + omega[i + 1])
                   : omega[n - 1] + 0.5 * (omega[n - 1] - omega[n - 2]);
}

int sy_sea_omega_weights(const double *omega, size_t n, double *dOmega, double *lo, double *hi,
                         sy_error *err)
{
    int rc = syi_sea_check_grid(omega, n, "omega", err);
    if (rc != SY_OK)
        return rc;
    double a, b;
    for (size_t i = 0; i < n; i++) {
        syi_sea_cell(omega, n, i, &a, &b);
        if (dOmega != NULL)
            dOmega[i] = b - a;
        if (i == 0 && lo != NULL)
            *lo = a;
    }
    if (hi != NULL)
        *hi = b;
    return SY_OK;
}

int sy_sea_spectrum_cells(const sy_sea_spectrum *s, const double *omega, size_t n, double *E,
                          double *outside, sy_error *err)
{
    if (s == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: spectrum is NULL");
    int rc = syi_sea_check_grid(omega, n, "omega", err);
    if (rc != SY_OK)
        return rc;
    double m0 = s->scale * s->omega_p * s->mu[2], a, b, frac;
    for (size_t i = 0; E != NULL && i < n; i++) {
        syi_sea_cell(omega, n, i, &a, &b);
        rc = syi_sea_spectrum_band(s, a, b, &frac, err);
        if (rc != SY_OK)
            return rc;
        E[i] = m0 * frac;
    }
    if (outside != NULL) {
        double below, above;
        syi_sea_cell(omega, n, 0, &a, &b);
        rc = syi_sea_spectrum_band(s, 0.0, a, &below, err);
        syi_sea_cell(omega, n, n - 1, &a, &b);
        if (rc == SY_OK)
            rc = syi_sea_spectrum_band(s, b, INFINITY, &above, err);
        if (rc != SY_OK)
            return rc;
        *outside = below + above;
    }
    return SY_OK;
}
