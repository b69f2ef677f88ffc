/* The double-complex fast path (src/special/fast.c) against Arb values rounded from
 * >= 53 correct bits (src/special/arb.c, each order evaluated directly), on a grid of
 * arguments with Re z >= 0: |z| from 1e-5 to 1.5e3 on rays from just below -pi/2 to
 * pi/2, orders 0..NMAX. Also the fast path reports SY_CONTINUE (not a wrong value)
 * outside its range. The same for real orders nu (J_nu, I_nu scaled).
 * Error measure: |fast - arb| / scale with scale = |value| for H1 and K, and for the
 * minimal solutions J and I the larger of |value| and its partner (|Y_n|, |K_n| scaled
 * alike) in the oscillatory range n < |z|, as in special.h. Tolerance 1e-13: the
 * interface promises ~1e-14; the recurrences over 30 orders and the CF sums add a few
 * hundred roundings at most. */
#include "check.h"
#include "special/special_impl.h"

#include <math.h>
#include <stdio.h>

#define NMAX 30
#define TOL 1e-13

static double complex arb(syi_bessel_kind kind, int n, double complex z)
{
    double complex v = NAN;
    sy_error err = SY_ERROR_INIT;
    if (syi_special_arb_value(kind, n, z, &v, &err) != SY_OK)
        printf("# arb failed: %s\n", err.msg);
    return v;
}

int main(void)
{
    sy_init();
    const double mods[] = {1e-5, 0.013, 0.37, 1.37, 1.9999, 2.0001, 4.7, 9.3, 23.0, 61.0,
                           170.0, 1500.0};
    const double args[] = {-1.5707963, -1.2, -0.6, -0.02, -1e-4, 1e-4, 0.02, 0.6, 1.2, 1.5707963};
    const syi_bessel_kind kinds[] = {SYI_BESSEL_J, SYI_BESSEL_H1, SYI_BESSEL_I_SCALED,
                                     SYI_BESSEL_K_SCALED};
    const int orders[] = {0, 1, 2, 5, 11, 20, 29, 30};
    double worst[4] = {0};
    double complex out[NMAX + 1], scratch[SYI_FAST_SCRATCH(NMAX)];
    for (size_t a = 0; a < sizeof mods / sizeof mods[0]; a++)
        for (size_t b = 0; b < sizeof args / sizeof args[0]; b++) {
            double complex z = mods[a] * cexp(I * args[b]);
            for (int k = 0; k < 4; k++) {
                syi_bessel_kind kind = kinds[k];
                int rc = syi_special_fast_array(kind, NMAX, z, out, scratch);
                if (fabs(cimag(z)) > 300.0) { /* FAST_IM_MAX in fast.c */
                    sy_check_true(rc == SY_CONTINUE, "fast %s declines |Im z| > 300 at "
                                  "%.17g%+.17gi", syi_special_kind_name(kind), creal(z), cimag(z));
                    continue;
                }
                if (!sy_check_true(rc == SY_OK, "fast %s array accepts z = %.17g%+.17gi",
                                   syi_special_kind_name(kind), creal(z), cimag(z)))
                    continue;
                for (size_t o = 0; o < sizeof orders / sizeof orders[0]; o++) {
                    int n = orders[o];
                    double complex want = arb(kind, n, z);
                    double scale = cabs(want);
                    if (n < cabs(z) && kind == SYI_BESSEL_J)
                        scale = fmax(scale, cabs(arb(SYI_BESSEL_Y, n, z)));
                    if (n < cabs(z) && kind == SYI_BESSEL_I_SCALED)
                        scale = fmax(scale, cabs(arb(SYI_BESSEL_K_SCALED, n, z) *
                                                 cexp(-z - fabs(creal(z)))));
                    double e = cabs(out[n] - want) / scale;
                    if (e > worst[k])
                        worst[k] = e;
                    /* reference: Arb (FLINT arb 2.23) rounded from >= 53 correct bits */
                    sy_check_cclose(out[n], want, 0.0, TOL * scale,
                                    "fast %s_%d(%.17g%+.17gi) vs Arb, err/scale %.2e",
                                    syi_special_kind_name(kind), n, creal(z), cimag(z), e);
                }
            }
        }
    /* Real orders nu on the same grid (J_nu, I_nu scaled). */
    const double nus[] = {1.0 / 6.0, 13.0 / 6.0, 25.0 / 6.0, 0.5, 7.3, 30.25};
    double worst_nu[2] = {0};
    for (size_t a = 0; a < sizeof mods / sizeof mods[0]; a++)
        for (size_t b = 0; b < sizeof args / sizeof args[0]; b++) {
            double complex z = mods[a] * cexp(I * args[b]);
            if (fabs(cimag(z)) > 300.0)
                continue;
            for (size_t o = 0; o < sizeof nus / sizeof nus[0]; o++)
                for (int k = 0; k < 2; k++) {
                    syi_bessel_kind kind = k == 0 ? SYI_BESSEL_J : SYI_BESSEL_I_SCALED;
                    double nu = nus[o];
                    double complex got = NAN, want = NAN, partner = 0.0;
                    int rc = syi_special_fast_nu(kind, nu, z, &got);
                    if (!sy_check_true(rc == SY_OK, "fast %s_%g accepts z = %.17g%+.17gi",
                                       syi_special_kind_name(kind), nu, creal(z), cimag(z)))
                        continue;
                    syi_special_arb_value(kind, nu, z, &want, NULL);
                    if (nu < cabs(z))
                        syi_special_arb_value(k == 0 ? SYI_BESSEL_Y : SYI_BESSEL_K_SCALED, nu,
                                              z, &partner, NULL);
                    if (k == 1)
                        partner *= cexp(-z - fabs(creal(z)));
                    double scale = fmax(cabs(want), cabs(partner));
                    double e = cabs(got - want) / scale;
                    if (e > worst_nu[k])
                        worst_nu[k] = e;
                    /* reference: Arb (FLINT arb 2.23) rounded from >= 53 correct bits */
                    sy_check_cclose(got, want, 0.0, TOL * scale,
                                    "fast %s_%g(%.17g%+.17gi) vs Arb, err/scale %.2e",
                                    syi_special_kind_name(kind), nu, creal(z), cimag(z), e);
                }
        }
    for (int k = 0; k < 4; k++)
        printf("# worst err/scale fast %s: %.2e\n", syi_special_kind_name(kinds[k]), worst[k]);
    printf("# worst err/scale fast J_nu: %.2e, I_nu scaled: %.2e\n", worst_nu[0], worst_nu[1]);
    /* Outside the range: SY_CONTINUE, never a value. */
    sy_check_true(syi_special_fast_array(SYI_BESSEL_J, NMAX, -1.0 + 0.5 * I, out, scratch) ==
                      SY_CONTINUE, "fast path declines Re z < 0");
    sy_check_true(syi_special_fast_array(SYI_BESSEL_K_SCALED, NMAX, 1e-9 + 1e-9 * I, out,
                                         scratch) == SY_CONTINUE,
                  "fast path declines |z| below its range");
    sy_check_true(syi_special_fast_array(SYI_BESSEL_H1, NMAX, 1.0 + 900.0 * I, out, scratch) ==
                      SY_CONTINUE, "fast path declines |Im z| above its range");
    return sy_check_summary();
}
