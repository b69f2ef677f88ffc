/* Wave power per metre of crest (references.md 4): J = rho g int S(omega) cg(omega, h)
 * domega in finite depth (adaptive quadrature, cg from the dispersion relation), the
 * deep-water closed form rho g^2 Hm0^2 Te / (64 pi) (exact for any shape in deep water,
 * since cg = g / (2 omega)), regular waves rho g a^2 cg / 2, and the directionally
 * resolved power J_theta of references.md 5.3. SI units: W/m. */
#include <complex.h>
#include "sea_impl.h"
#include "swellyield/waves.h"

#include <math.h>

static int check_rho_g(double rho, double g, sy_error *err)
{
    if (!(rho > 0.0) || !isfinite(rho))
        return sy_error_set(err, SY_EINPUT,
                            "sea: water density rho must be finite and > 0 kg/m^3, got %g", rho);
    if (!(g > 0.0) || !isfinite(g))
        return sy_error_set(err, SY_EINPUT, "sea: gravity g must be finite and > 0 m/s^2, got %g",
                            g);
    return SY_OK;
}

double sy_sea_power_deep(double rho, double g, double hm0, double te)
{
    return rho * g * g * hm0 * hm0 * te / (64.0 * SYI_PI);
}

/* cg at omega; deep water without the root solve. */
static int group_velocity(double omega, double g, double h, double *cg, sy_error *err)
{
    if (isinf(h)) {
        *cg = 0.5 * g / omega;
        return SY_OK;
    }
    double k;
    int rc = sy_waves_wavenumber(omega, h, g, &k, err);
    if (rc == SY_OK)
        *cg = sy_waves_group_velocity(omega, k, h);
    return rc;
}

int sy_sea_power_regular(double rho, double g, double a, double omega, double h, double *J,
                         sy_error *err)
{
    int rc = check_rho_g(rho, g, err);
    if (rc != SY_OK)
        return rc;
    if (!(a >= 0.0) || !isfinite(a))
        return sy_error_set(err, SY_EINPUT, "sea: wave amplitude must be finite and >= 0 m, got %g",
                            a);
    double cg;
    rc = group_velocity(omega, g, h, &cg, err);
    if (rc == SY_OK)
        *J = 0.5 * rho * g * a * a * cg;
    return rc;
}

struct power_arg {
    const sy_sea_spectrum *s;
    double g, h;
    int failed;
};

static double power_integrand(double omega, void *p)
{
    struct power_arg *a = p;
    double S = sy_sea_spectrum_eval(a->s, omega), cg;
    if (S == 0.0)
        return 0.0;
    if (group_velocity(omega, a->g, a->h, &cg, NULL) != SY_OK) {
        a->failed = 1;
        return 0.0;
    }
    return S * cg;
}

int sy_sea_spectrum_power(const sy_sea_spectrum *s, double rho, double g, double h, double *J,
                          sy_error *err)
{
    if (s == NULL || J == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: spectrum or result is NULL");
    int rc = check_rho_g(rho, g, err);
    if (rc != SY_OK)
        return rc;
    if (!(h > 0.0))
        return sy_error_set(err, SY_EINPUT,
                            "sea: depth h must be > 0 m (INFINITY for deep water), got %g", h);
    struct power_arg a = {s, g, h, 0};
    /* Split at the peak and at 2 wp: the JONSWAP peak is sharp, the tail smooth. */
    const double wp = s->omega_p, cut[] = {0.0, wp, 2.0 * wp, INFINITY};
    double sum = 0.0;
    for (int i = 0; i < 3 && rc == SY_OK; i++) {
        double part = 0.0;
        rc = syi_sea_integrate(power_integrand, &a, cut[i], cut[i + 1], &part, "S cg", err);
        sum += part;
    }
    if (rc == SY_OK && a.failed)
        rc = sy_error_set(err, SY_ENOCONV,
                          "sea: group velocity failed inside the power integral (h = %g m)", h);
    if (rc == SY_OK)
        *J = rho * g * sum;
    return rc;
}

int sy_sea_power_sampled(const double *omega, const double *S, size_t n, double rho, double g,
                         double h, double *J, sy_error *err)
{
    if (S == NULL || J == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: spectrum samples or result is NULL");
    int rc = check_rho_g(rho, g, err);
    if (rc == SY_OK)
        rc = syi_sea_check_grid(omega, n, "omega", err);
    if (rc != SY_OK)
        return rc;
    double sum = 0.0;
    for (size_t i = 0; i < n; i++) {
        double a, b, cg;
        if (!(S[i] >= 0.0) || !isfinite(S[i]))
            return sy_error_set(
                err, SY_EINPUT,
                "sea: spectral density must be finite and >= 0 m^2 s/rad, got S[%zu] = %g", i,
                S[i]);
        syi_sea_cell(omega, n, i, &a, &b);
        rc = group_velocity(omega[i], g, h, &cg, err);
        if (rc != SY_OK)
            return rc;
        sum += S[i] * cg * (b - a);
    }
    *J = rho * g * sum;
    return SY_OK;
}

double sy_sea_power_directional(double J, const double *beta, const double *D, size_t n,
                                double theta)
{
    double sum = 0.0;
    for (size_t j = 0; j < n; j++) {
        double c = cos(theta - beta[j]);
        if (c >= 0.0)
            sum += D[j] * c;
    }
    return J * sum;
}
