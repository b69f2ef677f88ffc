/* The float solver's fast complex Bessel evaluations (src/special/fast_complex.c) against
 * the special module's Arb path (sy_special_besselk_scaled_array, sy_special_besselj_nu:
 * Arb/FLINT, rounded to double), an independent implementation. Arguments like the
 * float's exterior modes at complex omega: k_q a, k_q b with small imaginary parts. */
#include <complex.h>
#include <math.h>
#include "check.h"
#include "swellyield/special.h"

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* K_0, K_1 scaled, wide range of |z|; tolerance 1e-14 relative (trapezoid error
     * ~e^-34 plus round-off of ~40 terms). */
    const double complex zs[] = {0.3 - 0.02 * I, 1.37 + 0.1 * I, 4.2 - 0.3 * I, 12.5 + 0.01 * I,
                                 37.7 - 0.05 * I, 150.0 + 0.2 * I, 2.0 + 1.5 * I};
    for (size_t i = 0; i < sizeof zs / sizeof zs[0]; i++) {
        double complex ref[3], got;
        sy_check_ok(sy_special_besselk_scaled_array(1, zs[i], ref, &err), &err, "Arb K array");
        for (int n = 0; n <= 1; n++) {
            sy_check_ok(sy_special_besselk_scaled_quad(n, zs[i], &got, &err), &err, "K quad");
            sy_check_cclose(got, ref[n], 1e-14, 0.0, "K_%d(z) e^z at z = %g%+gi vs Arb", n,
                            creal(zs[i]), cimag(zs[i]));
        }
    }
    /* J_nu for the Gegenbauer orders nu = 1/6, 7/6, 5/6, 11/6 at |z| >= 25; tolerance
     * 2e-16 |z| relative to the envelope sqrt(2/(pi|z|)) e^{|Im z|}: J has zeros, and
     * its condition number at large argument is ~|z| (the phase z - nu pi/2 - pi/4 is
     * formed in double). */
    const double complex zj[] = {25.3 - 0.01 * I, 40.1 + 0.3 * I, 97.2 - 0.004 * I, 310.0 + 0.5 * I};
    const double nus[] = {1.0 / 6.0, 7.0 / 6.0, 5.0 / 6.0, 11.0 / 6.0};
    for (size_t i = 0; i < sizeof zj / sizeof zj[0]; i++)
        for (size_t k = 0; k < 4; k++) {
            double complex ref, got;
            sy_check_ok(sy_special_besselj_nu(nus[k], zj[i], &ref, &err), &err, "Arb J_nu");
            sy_check_ok(sy_special_besselj_nu_hankel(nus[k], zj[i], &got, &err), &err, "J Hankel");
            double env = sqrt(2.0 / (3.14159265358979323846 * cabs(zj[i]))) * exp(fabs(cimag(zj[i])));
            sy_check_cclose(got, ref, 0.0, 2e-16 * cabs(zj[i]) * env, "J_%.4f(%g%+gi) Hankel vs Arb", nus[k],
                            creal(zj[i]), cimag(zj[i]));
        }
    /* outside the range: a clear error */
    double complex dummy;
    sy_check_fails(sy_special_besselj_nu_hankel(0.5, 3.0, &dummy, &err), SY_EINVAL, &err,
                   "|z| >= 25", "J Hankel rejects small |z|");
    sy_check_fails(sy_special_besselk_scaled_quad(0.0, -1.0, &dummy, &err), SY_EINVAL, &err,
                   "Re z > 0", "K quadrature rejects Re z <= 0");
    return sy_check_summary();
}
