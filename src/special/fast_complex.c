/* Fast double-precision Bessel evaluations for complex arguments in the right half-plane,
 * added for the float body solver's exterior depth-mode sums (many evaluations per
 * frequency, where the Arb path of bessel.c costs 20-300 us per call). Declared in the
 * separate block at the end of include/swellyield/special.h; checked against the Arb path
 * in tests/special/test_fast_complex.c.
 *
 * K_nu(z) e^z = int_0^inf exp(-z (cosh t - 1)) cosh(nu t) dt  (DLMF 10.32.9), Re z > 0:
 *   trapezoidal rule, exponentially convergent for this analytic integrand (Trefethen &
 *   Weideman, SIAM Review 56 (2014)): step hs = 2 pi d / 40 for a strip half-width
 *   d = min(1.2 - |arg z|, sqrt(6 / |z|)), where the integrand stays below e^6 of its
 *   value on the real line, so the discretisation error is ~ e^(6 - 40) relative.
 * J_nu(z) for |z| >= 25, |arg z| <= pi/4: Hankel's expansion (DLMF 10.17.3), summed to
 *   the smallest term (~ e^(-2|z|) < 1e-21 here).
 * Thread-safe, no allocation. */
#include <complex.h>
#include "swellyield/special.h"

#include <math.h>

#define FC_PI 3.14159265358979323846
#define HANKEL_MIN_ABS 25.0

int sy_special_besselk_scaled_quad(double nu, double complex z, double complex *out, sy_error *err)
{
    double r = cabs(z), arg = carg(z);
    if (!(creal(z) > 0.0) || !(r >= 0.05) || !isfinite(r) || fabs(arg) > 1.0)
        return sy_error_set(err, SY_EINVAL,
                            "K scaled quadrature: need Re z > 0, |z| >= 0.05, |arg z| <= 1, got %g%+gi",
                            creal(z), cimag(z));
    double d = fmin(1.2 - fabs(arg), sqrt(6.0 / r));
    double hs = 2.0 * FC_PI * d / 40.0;
    /* stop where Re(z) (cosh t - 1) - |nu| t > 45: terms below e^-45 of the first */
    double complex sum = 0.5;   /* t = 0 term, halved (even integrand, int_0^inf) */
    double cr = creal(z) > 0.2 * r ? creal(z) : 0.2 * r;
    for (int i = 1; i < 100000; i++) {
        double t = i * hs;
        double e = cosh(t) - 1.0;
        double complex term = cexp(-z * e) * cosh(nu * t);
        sum += term;
        if (cr * e - fabs(nu) * t > 45.0)
            break;
    }
    *out = hs * sum;
    return SY_OK;
}

int sy_special_besselj_nu_hankel(double nu, double complex z, double complex *out, sy_error *err)
{
    double r = cabs(z);
    if (!(r >= HANKEL_MIN_ABS) || !(creal(z) > 0.0) || fabs(carg(z)) > FC_PI / 4.0 || !isfinite(r))
        return sy_error_set(err, SY_EINVAL,
                            "J Hankel expansion: need |z| >= %g and |arg z| <= pi/4, got %g%+gi",
                            HANKEL_MIN_ABS, creal(z), cimag(z));
    double mu = 4.0 * nu * nu;
    double complex zi = 1.0 / z;
    double complex p = 0.0, q = 0.0, zk = 1.0;
    double ak = 1.0, prev = INFINITY;
    for (int k = 0; k < 200; k++) {
        double complex term = ak * zk;
        double mag = cabs(term);
        if (mag > prev)
            break;   /* asymptotic series: stop at the smallest term */
        /* (-1)^floor(k/2) pattern: P gets k even with sign (-1)^(k/2), Q k odd */
        double sg = ((k / 2) % 2) ? -1.0 : 1.0;
        if (k % 2 == 0)
            p += sg * term;
        else
            q += sg * term;
        if (mag < 1e-18 * cabs(p))
            break;
        prev = mag;
        ak *= (mu - (2.0 * k + 1.0) * (2.0 * k + 1.0)) / (8.0 * (k + 1.0));
        zk *= zi;
    }
    double complex w = z - nu * FC_PI / 2.0 - FC_PI / 4.0;
    *out = csqrt(2.0 / (FC_PI * z)) * (ccos(w) * p - csin(w) * q);
    return SY_OK;
}
