/* Parametric wave spectra: Pierson-Moskowitz (two-parameter Bretschneider) and JONSWAP
 * in the DNV-RP-C205 form, parameterised by Hs with Tp, Te or Tz.
 *   S(w) = A (5/16) Hs^2 wp^4 w^-5 exp(-(5/4)(w/wp)^-4) gamma^exp(-(w-wp)^2/(2 sigma^2 wp^2))
 * = scale s(u), u = w/wp, scale = A (5/16) Hs^2 / wp. Every spectral parameter follows
 * from the shape moments mu_n = int u^n s(u) du (n = -2..2): m_n = scale wp^(n+1) mu_n,
 * Te/Tp = mu_-1/mu_0, Tz/Tp = sqrt(mu_0/mu_2), T1/Tp = mu_0/mu_1. PM has the closed form
 * mu_n = (1/4) (5/4)^((n-4)/4) Gamma(1 - n/4) (substitute v = (5/4) u^-4); JONSWAP is
 * integrated adaptively (GSL QAG, rel. 1e-12), once per spectrum, so the period ratios
 * are those of the actual gamma (references.md 2.1-2.3). SI units. */
#include <complex.h>
#include "sea_impl.h"

#include <math.h>
#include <stdio.h>

/* JONSWAP peak widths and the DNV normalising coefficient (references.md 2.3). */
#define SIGMA_BELOW 0.07
#define SIGMA_ABOVE 0.09
#define DNV_A_COEF 0.287
/* Accepted gamma range: the DNV rule spans 1..5, measured seas rarely exceed 7; 20 keeps
 * A = 1 - 0.287 ln gamma > 0.14. */
#define GAMMA_MIN 1.0
#define GAMMA_MAX 20.0
/* exp(-700) ~ 1e-304: below this the shape is zero to double precision. */
#define SHAPE_EXP_MAX 700.0
/* DNV rule solved for gamma to this absolute accuracy (bisection on [1, 5]). */
#define GAMMA_RULE_TOL 1e-11

double syi_sea_shape(double u, double ln_gamma)
{
    if (!(u > 0.0))
        return 0.0;
    double u2 = u * u, u4 = u2 * u2, e = 1.25 / u4;
    if (e > SHAPE_EXP_MAX)
        return 0.0;
    double v = exp(-e) / (u4 * u);
    if (ln_gamma != 0.0) {
        double d = (u - 1.0) / (u <= 1.0 ? SIGMA_BELOW : SIGMA_ABOVE);
        v *= exp(ln_gamma * exp(-0.5 * d * d));
    }
    return v;
}

struct moment_arg {
    int n;
    double ln_gamma;
};

static double moment_integrand(double u, void *p)
{
    const struct moment_arg *a = p;
    return pow(u, a->n) * syi_sea_shape(u, a->ln_gamma);
}

/* mu_n of the JONSWAP shape. Split at the peak u = 1 (where sigma changes) and at 2. */
static int shape_moment(int n, double gamma, double *mu, sy_error *err)
{
    struct moment_arg a = {n, log(gamma)};
    const double cut[] = {0.0, 1.0, 2.0, INFINITY};
    char what[64];
    snprintf(what, sizeof what, "u^%d s(u) (JONSWAP shape, gamma %g)", n, gamma);
    *mu = 0.0;
    for (int i = 0; i < 3; i++) {
        double part;
        int rc = syi_sea_integrate(moment_integrand, &a, cut[i], cut[i + 1], &part, what, err);
        if (rc != SY_OK)
            return rc;
        *mu += part;
    }
    return SY_OK;
}

static int shape_moments(sy_sea_kind kind, double gamma, double mu[5], sy_error *err)
{
    for (int n = -2; n <= 2; n++) {
        if (kind == SY_SEA_PM) {
            mu[n + 2] = 0.25 * pow(1.25, (n - 4) / 4.0) * tgamma(1.0 - n / 4.0);
        } else {
            int rc = shape_moment(n, gamma, &mu[n + 2], err);
            if (rc != SY_OK)
                return rc;
        }
    }
    return SY_OK;
}

double sy_sea_gamma_dnv(double hs, double tp)
{
    double r = tp / sqrt(hs);
    if (r <= 3.6)
        return 5.0;
    if (r < 5.0)
        return exp(5.75 - 1.15 * r);
    return 1.0;
}

/* Tp from the given period for shape moments mu. */
static double tp_from(const sy_sea_spectrum_spec *sp, const double mu[5])
{
    if (sp->tp > 0)
        return sp->tp;
    if (sp->te > 0)
        return sp->te * mu[2] / mu[1];
    return sp->tz / sqrt(mu[2] / mu[4]);
}

/* gamma with rule(Hs, Tp(gamma)) = gamma when Te or Tz is given: bisection on [1, 5]
 * (rule(Tp(gamma)) - gamma changes sign there because the rule's range is [1, 5]). */
static int gamma_by_rule(const sy_sea_spectrum_spec *sp, double *gamma, sy_error *err)
{
    double mu[5];
    if (sp->tp > 0) {
        *gamma = sy_sea_gamma_dnv(sp->hs, sp->tp);
        return SY_OK;
    }
    double lo = GAMMA_MIN, hi = 5.0;
    while (hi - lo > GAMMA_RULE_TOL) {
        double mid = 0.5 * (lo + hi);
        int rc = SY_OK;
        for (int n = -1; rc == SY_OK && n <= 2; n++)
            if (n != 1) /* mu_-1, mu_0, mu_2 */
                rc = shape_moment(n, mid, &mu[n + 2], err);
        if (rc != SY_OK)
            return rc;
        if (sy_sea_gamma_dnv(sp->hs, tp_from(sp, mu)) > mid)
            lo = mid;
        else
            hi = mid;
    }
    *gamma = 0.5 * (lo + hi);
    return SY_OK;
}

static int check_spec(const sy_sea_spectrum_spec *sp, sy_error *err)
{
    if (sp->kind != SY_SEA_PM && sp->kind != SY_SEA_JONSWAP)
        return sy_error_set(err, SY_EINPUT, "sea: spectrum kind %d unknown, expected PM or JONSWAP",
                            (int)sp->kind);
    if (!(sp->hs > 0.0) || !isfinite(sp->hs))
        return sy_error_set(err, SY_EINPUT, "sea: Hs must be finite and > 0 m, got %g", sp->hs);
    const double per[3] = {sp->tp, sp->te, sp->tz};
    const char *name[3] = {"Tp", "Te", "Tz"};
    int given = 0;
    for (int i = 0; i < 3; i++) {
        if (per[i] == 0.0)
            continue;
        if (!(per[i] > 0.0) || !isfinite(per[i]))
            return sy_error_set(err, SY_EINPUT,
                                "sea: %s must be finite and > 0 s (or 0 = not given), got %g",
                                name[i], per[i]);
        given++;
    }
    if (given != 1)
        return sy_error_set(err, SY_EINPUT, "sea: give exactly one of Tp, Te, Tz, got %d", given);
    if (sp->kind == SY_SEA_PM && sp->gamma != 0.0 && sp->gamma != 1.0)
        return sy_error_set(
            err, SY_EINPUT,
            "sea: gamma must be 1 (or 0) for a Pierson-Moskowitz spectrum, got %g; use JONSWAP",
            sp->gamma);
    if (sp->kind == SY_SEA_JONSWAP && sp->gamma != 0.0 &&
        !(sp->gamma >= GAMMA_MIN && sp->gamma <= GAMMA_MAX))
        return sy_error_set(err, SY_EINPUT,
                            "sea: JONSWAP gamma must be in [%g, %g] (or 0 = DNV rule), got %g",
                            GAMMA_MIN, GAMMA_MAX, sp->gamma);
    if (sp->norm != SY_SEA_NORM_DNV && sp->norm != SY_SEA_NORM_EXACT)
        return sy_error_set(err, SY_EINPUT, "sea: normalisation %d unknown, expected DNV or EXACT",
                            (int)sp->norm);
    return SY_OK;
}

int sy_sea_spectrum_init(sy_sea_spectrum *out, const sy_sea_spectrum_spec *sp, sy_error *err)
{
    if (out == NULL || sp == NULL)
        return sy_error_set(err, SY_EINVAL, "sea: spectrum or its spec is NULL");
    int rc = check_spec(sp, err);
    if (rc != SY_OK)
        return rc;
    sy_sea_spectrum s = {
        .kind = sp->kind, .hs = sp->hs, .gamma = 1.0, .alpha = 1.0, .norm = SY_SEA_NORM_EXACT};
    if (sp->kind == SY_SEA_JONSWAP) {
        s.gamma = sp->gamma;
        if (sp->gamma == 0.0) {
            s.gamma_from_rule = 1;
            rc = gamma_by_rule(sp, &s.gamma, err);
            if (rc != SY_OK)
                return rc;
        }
        s.norm = sp->norm;
    }
    rc = shape_moments(s.kind, s.gamma, s.mu, err);
    if (rc != SY_OK)
        return rc;
    if (s.kind == SY_SEA_JONSWAP)
        s.alpha =
            s.norm == SY_SEA_NORM_DNV ? 1.0 - DNV_A_COEF * log(s.gamma) : 1.0 / (5.0 * s.mu[2]);
    s.tp = tp_from(sp, s.mu);
    s.omega_p = 2.0 * SYI_PI / s.tp;
    s.scale = s.alpha * (5.0 / 16.0) * s.hs * s.hs / s.omega_p;
    s.hm0 = s.hs * sqrt(5.0 * s.alpha * s.mu[2]);
    s.te = s.tp * s.mu[1] / s.mu[2];
    s.tz = s.tp * sqrt(s.mu[2] / s.mu[4]);
    s.t1 = s.tp * s.mu[2] / s.mu[3];
    s.eps0 = sqrt(s.mu[2] * s.mu[0] / (s.mu[1] * s.mu[1]) - 1.0);
    *out = s;
    return SY_OK;
}

double sy_sea_spectrum_eval(const sy_sea_spectrum *s, double omega)
{
    if (!(omega > 0.0))
        return 0.0;
    return s->scale * syi_sea_shape(omega / s->omega_p, s->gamma == 1.0 ? 0.0 : log(s->gamma));
}

double sy_sea_spectrum_eval_hz(const sy_sea_spectrum *s, double f)
{
    return 2.0 * SYI_PI * sy_sea_spectrum_eval(s, 2.0 * SYI_PI * f);
}

static double shape_integrand(double u, void *p)
{
    return syi_sea_shape(u, *(const double *)p);
}

/* int_{u0}^{u1} s(u) du (u1 may be INFINITY), split at the peak. */
static int shape_integral(const sy_sea_spectrum *s, double u0, double u1, double *val,
                          sy_error *err)
{
    if (s->kind == SY_SEA_PM) {
        /* d/du [(1/5) exp(-e(u))] = s(u), e = 5/4 u^-4; the difference written with
         * expm1 keeps full relative accuracy for narrow cells and upper tails. */
        double e1 = isinf(u1) ? 0.0 : 1.25 / pow(u1, 4);
        double e0 = u0 > 0 ? 1.25 / pow(u0, 4) : INFINITY;
        if (!(u1 > u0) || e1 > SHAPE_EXP_MAX) {
            *val = 0.0; /* empty band, or all of it where s(u) < 1e-300 */
            return SY_OK;
        }
        *val = -0.2 * exp(-e1) * expm1(e1 - e0);
        return SY_OK;
    }
    double lng = log(s->gamma);
    *val = 0.0;
    const double cut[] = {u0, fmax(u0, fmin(1.0, u1)), u1};
    for (int i = 0; i < 2; i++) {
        if (!(cut[i + 1] > cut[i]))
            continue;
        double part;
        int rc = syi_sea_integrate(shape_integrand, &lng, cut[i], cut[i + 1], &part,
                                   "the JONSWAP shape", err);
        if (rc != SY_OK)
            return rc;
        *val += part;
    }
    return SY_OK;
}

int sy_sea_spectrum_cdf(const sy_sea_spectrum *s, double omega, double *frac, sy_error *err)
{
    if (!(omega > 0.0)) {
        *frac = 0.0;
        return SY_OK;
    }
    double v;
    int rc = shape_integral(s, 0.0, omega / s->omega_p, &v, err);
    if (rc == SY_OK)
        *frac = v / s->mu[2];
    return rc;
}

int syi_sea_spectrum_band(const sy_sea_spectrum *s, double w0, double w1, double *frac,
                          sy_error *err)
{
    double v;
    int rc = shape_integral(s, w0 / s->omega_p, isinf(w1) ? INFINITY : w1 / s->omega_p, &v, err);
    if (rc == SY_OK)
        *frac = v / s->mu[2];
    return rc;
}

void sy_sea_spectrum_moments(const sy_sea_spectrum *s, sy_sea_moments *out)
{
    for (int n = -2; n <= 2; n++) {
        out->m[n + 2] = s->scale * pow(s->omega_p, n + 1) * s->mu[n + 2];
        out->mf[n + 2] = out->m[n + 2] * pow(2.0 * SYI_PI, -n);
    }
    out->hm0 = s->hm0;
    out->te = s->te;
    out->tz = s->tz;
    out->t1 = s->t1;
    out->eps0 = s->eps0;
}

int sy_sea_spectrum_describe(const sy_sea_spectrum *s, char *buf, size_t size)
{
    if (s->kind == SY_SEA_PM)
        return snprintf(buf, size, "Pierson-Moskowitz Hs %g m Tp %.6g s (Te %.6g s, Tz %.6g s)",
                        s->hs, s->tp, s->te, s->tz);
    return snprintf(buf, size,
                    "JONSWAP Hs %g m Tp %.6g s (Te %.6g s, Tz %.6g s) gamma %.6g%s sigma %g/%g "
                    "norm %s A %.6g Hm0 %.6g m",
                    s->hs, s->tp, s->te, s->tz, s->gamma, s->gamma_from_rule ? " (DNV rule)" : "",
                    SIGMA_BELOW, SIGMA_ABOVE, s->norm == SY_SEA_NORM_DNV ? "DNV" : "exact",
                    s->alpha, s->hm0);
}
