/* Finite-depth dispersion omega^2 = g k tanh(k h), group velocity, and the evanescent
 * roots k_m with omega^2 = -g k_m tan(k_m h), k_m h in ((m - 1/2) pi, m pi).
 *
 * Real omega: safeguarded Newton (Newton steps kept inside a shrinking bracket, bisection
 * otherwise) on dimensionless unknowns, y = omega^2 h / g:
 *   propagating  x = k h,          f(x) = x tanh x - y,                x in [max(y, sqrt y), y + sqrt y]
 *   evanescent   t = m pi - k_m h,  F(t) = (m pi - t) sin t - y cos t,   t in (0, pi/2)
 * The bracket of x follows from x^2/(1 + x) <= x tanh x <= min(x, x^2). Writing the
 * evanescent root as m pi - t keeps full relative accuracy at large m, where t ~ y/(m pi)
 * is small (the asymptotic start), and F has no poles, unlike x tan x.
 * Complex omega: analytic continuation along the vertical path omega_r + i s Im(omega),
 * s: 0 -> 1, from the real root at omega_r = Re(omega): Euler predictor dz/dY, complex
 * Newton corrector; a step is accepted only if Newton converges close to the predictor
 * (so it cannot jump to another branch), else the step is halved.
 * Sources: Newman (1977) ch. 6, Mei ch. 1 (references.md section 1). SI units; k in rad/m.
 * No allocation; every function is pure and thread-safe. */
#include "waves_impl.h"

#include <float.h>
#include <math.h>

#define PI 3.14159265358979323846

/* Newton stops when the step is below this many ulps of the unknown: the residual is
 * then at rounding level (a few eps), well inside the 1e-12 contract. */
#define NEWTON_ULPS 4.0
/* Iteration caps. Safeguarded Newton on a bracket halves it at worst, so 200 bisections
 * exhaust any double bracket; quadratic convergence needs ~6. */
#define REAL_ITER_MAX 200
#define COMPLEX_ITER_MAX 40
/* Continuation: a corrected root may lie at most this fraction of the distance to the
 * nearest other root away from its predictor (roots are >= ~pi/2 apart in x or t,
 * except x0 and -x0 in shallow water, 2|x0| apart). */
#define BRANCH_FRACTION 0.25
#define ROOT_SEPARATION 1.5
/* Smallest continuation step (fraction of the path) and the most steps before giving up. */
#define STEP_MIN 1e-9
#define STEPS_MAX 10000
/* Beyond this kh, 2kh / sinh(2kh) < 1e-300: the deep-water group velocity is exact. */
#define KH_DEEP 350.0

static int check_args(double complex omega, double h, double g, sy_error *err)
{
    if (!isfinite(creal(omega)) || !isfinite(cimag(omega)) || !(creal(omega) > 0.0)) {
        if (cimag(omega) == 0.0)
            return sy_error_set(err, SY_EINVAL, "waves: omega must be finite and > 0 rad/s, got %g",
                                creal(omega));
        return sy_error_set(err, SY_EINVAL,
                            "waves: omega must be finite with Re(omega) > 0 rad/s, got %g%+gi",
                            creal(omega), cimag(omega));
    }
    if (!(h > 0.0) || isnan(h))
        return sy_error_set(err, SY_EINVAL,
                            "waves: depth h must be > 0 m (INFINITY for deep water), got %g", h);
    if (!(g > 0.0) || !isfinite(g))
        return sy_error_set(err, SY_EINVAL, "waves: gravity g must be finite and > 0 m/s^2, got %g",
                            g);
    return SY_OK;
}

/* x tanh x = y, y > 0 (real, safeguarded Newton). */
static int solve_x0(double y, double *x_out)
{
    double lo = fmax(y, sqrt(y)), hi = y + sqrt(y);
    double x = y / sqrt(tanh(y));
    if (!(x > lo && x < hi))
        x = 0.5 * (lo + hi);
    for (int it = 0; it < REAL_ITER_MAX; it++) {
        double t = tanh(x);
        double f = x * t - y;
        if (f == 0.0)
            break;
        if (f < 0.0)
            lo = x;
        else
            hi = x;
        double ch = x < KH_DEEP ? cosh(x) : INFINITY;
        double df = t + x / (ch * ch);
        double dx = f / df;
        /* A step below the stopping size is taken as is: near the root it can round
         * onto a bracket end, which must not trigger a bisection. */
        if (fabs(dx) <= NEWTON_ULPS * DBL_EPSILON * x) {
            *x_out = x - dx;
            return SY_OK;
        }
        double xn = x - dx;
        if (!(xn > lo && xn < hi))
            xn = 0.5 * (lo + hi);
        x = xn;
        if (hi - lo <= NEWTON_ULPS * DBL_EPSILON * x) {
            *x_out = x;
            return SY_OK;
        }
    }
    *x_out = x;
    return SY_OK; /* bracket collapsed to the last representable interval */
}

/* (m pi - t) sin t = y cos t for t in (0, pi/2), m >= 1 (real, safeguarded Newton). */
static double solve_tm(size_t m, double y)
{
    double mpi = (double)m * PI;
    double lo = 0.0, hi = (0.5 * PI);
    /* Asymptotic start: t = atan(y / (m pi - t)), two fixed-point sweeps; exact to
     * O((y / (m pi))^3) at large m. */
    double t = atan(y / mpi);
    t = atan(y / (mpi - t));
    t = atan(y / (mpi - t));
    for (int it = 0; it < REAL_ITER_MAX; it++) {
        double s = sin(t), c = cos(t), a = mpi - t;
        double f = a * s - y * c;
        if (f == 0.0)
            break;
        if (f < 0.0)
            lo = t;
        else
            hi = t;
        double df = -s + a * c + y * s;
        double dt = f / df;
        if (fabs(dt) <= NEWTON_ULPS * DBL_EPSILON * t)
            return t - dt; /* see solve_x0 */
        double tn = t - dt;
        if (!(tn > lo && tn < hi))
            tn = 0.5 * (lo + hi);
        t = tn;
        if (hi - lo <= NEWTON_ULPS * DBL_EPSILON * t)
            break;
    }
    return t;
}

int sy_waves_wavenumber(double omega, double h, double g, double *k, sy_error *err)
{
    int rc = check_args(omega, h, g, err);
    if (rc != SY_OK)
        return rc;
    if (isinf(h)) {
        *k = omega * omega / g;
        return SY_OK;
    }
    double x;
    rc = solve_x0(omega * omega * h / g, &x);
    *k = x / h;
    return rc;
}

double sy_waves_group_velocity(double omega, double k, double h)
{
    double x = k * h;
    double ratio = (isinf(h) || x > KH_DEEP) ? 0.0 : 2.0 * x / sinh(2.0 * x);
    return 0.5 * (omega / k) * (1.0 + ratio);
}

/* The complex unknown z (x for m = 0, t for m >= 1), its function value and derivative
 * at parameter Y = omega^2 h / g, and dz/dY for the predictor. */
static void fun(size_t m, double complex z, double complex Y, double complex *f, double complex *df,
                double complex *dzdY)
{
    if (m == 0) {
        double complex t = ctanh(z);
        *f = z * t - Y;
        *df = t + z * (1.0 - t * t);
        *dzdY = 1.0 / *df;
    } else {
        double complex s = csin(z), c = ccos(z), a = (double)m * PI - z;
        *f = a * s - Y * c;
        *df = -s + a * c + Y * s;
        *dzdY = c / *df;
    }
}

static int newton_complex(size_t m, double complex Y, double complex *z)
{
    double complex x = *z, f, df, d;
    for (int it = 0; it < COMPLEX_ITER_MAX; it++) {
        fun(m, x, Y, &f, &df, &d);
        if (f == 0.0)
            break;
        double complex dx = f / df;
        if (!isfinite(creal(dx)) || !isfinite(cimag(dx)))
            return SY_ENOCONV;
        x -= dx;
        if (cabs(dx) <= NEWTON_ULPS * DBL_EPSILON * cabs(x)) {
            *z = x;
            return SY_OK;
        }
    }
    if (f == 0.0) {
        *z = x;
        return SY_OK;
    }
    return SY_ENOCONV;
}

static double branch_radius(size_t m, double complex z)
{
    double sep = m == 0 ? fmin(2.0 * cabs(z), ROOT_SEPARATION) : ROOT_SEPARATION;
    return BRANCH_FRACTION * sep;
}

int syi_waves_root_continue(size_t m, double complex omega, double h, double g, double complex *k,
                            sy_error *err)
{
    int rc = check_args(omega, h, g, err);
    if (rc != SY_OK)
        return rc;
    if (!isfinite(h))
        return sy_error_set(err, SY_EINVAL, "waves: complex root continuation needs finite depth");
    double wr = creal(omega), wi = cimag(omega);
    double yr = wr * wr * h / g;
    double complex z;
    if (m == 0) {
        double x;
        solve_x0(yr, &x);
        z = x;
    } else {
        z = solve_tm(m, yr);
    }
    double complex Ys = yr;
    double s = 0.0, ds = 1.0;
    int steps = 0, polished = 0;
    while (s < 1.0 || !polished) {
        if (++steps > STEPS_MAX || ds < STEP_MIN)
            return sy_error_set(err, SY_ENOCONV,
                                "waves: root %zu lost on the path to omega = %g%+gi rad/s "
                                "(h = %g m) at s = %g",
                                m, wr, wi, h, s);
        double s1 = fmin(1.0, s + ds);
        double complex w1 = wr + I * (s1 * wi);
        double complex Y1 = w1 * w1 * h / g;
        double complex f, df, dzdY;
        fun(m, z, Ys, &f, &df, &dzdY);
        double complex pred = z + dzdY * (Y1 - Ys);
        double complex z1 = pred;
        int ok = newton_complex(m, Y1, &z1) == SY_OK && cabs(z1 - pred) <= branch_radius(m, pred);
        if (ok) {
            z = z1;
            Ys = Y1;
            s = s1;
            polished = 1;
            ds = fmin(1.0, 2.0 * ds);
        } else {
            ds *= 0.5;
        }
    }
    *k = (m == 0 ? z : (double)m * PI - z) / h;
    return SY_OK;
}

int sy_waves_roots_fill(sy_wave_roots *r, double complex omega, double h, double g,
                        size_t n_evanescent, sy_error *err)
{
    if (r == NULL || (n_evanescent > 0 && r->k == NULL))
        return sy_error_set(err, SY_EINVAL, "waves: roots record or its k[] storage is NULL");
    int rc = check_args(omega, h, g, err);
    if (rc != SY_OK)
        return rc;
    if (isinf(h) && n_evanescent > 0)
        return sy_error_set(
            err, SY_EINVAL,
            "waves: evanescent roots need a finite depth, got h = inf with %zu roots",
            n_evanescent);
    r->omega = omega;
    r->h = h;
    r->g = g;
    r->n_evanescent = 0;
    if (isinf(h)) {
        r->k0 = omega * omega / g;
        return SY_OK;
    }
    if (cimag(omega) == 0.0) {
        double wr = creal(omega), y = wr * wr * h / g, x;
        solve_x0(y, &x);
        r->k0 = x / h;
        for (size_t m = 1; m <= n_evanescent; m++)
            r->k[m - 1] = ((double)m * PI - solve_tm(m, y)) / h;
    } else {
        rc = syi_waves_root_continue(0, omega, h, g, &r->k0, err);
        for (size_t m = 1; rc == SY_OK && m <= n_evanescent; m++)
            rc = syi_waves_root_continue(m, omega, h, g, &r->k[m - 1], err);
        if (rc != SY_OK)
            return rc;
    }
    r->n_evanescent = n_evanescent;
    return SY_OK;
}
