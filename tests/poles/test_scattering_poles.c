/* Scattering resonances (poles.h, family SCATTERING): zeros of det(I - D T) of the array
 * held fixed, located by Delves-Lyness power sums of the contour's log-determinants and
 * polished by a secant on the determinant.
 *  - Two bottom-mounted columns (radius 5 m, centres 12 m apart, depth 50 m, orders
 *    -16..16, propagating mode only): the resonance nearest the real axis compared with an
 *    independent implementation of the two-cylinder multiple-scattering system
 *    (Linton & Evans 1990, J. Fluid Mech. 215, with D_n = -J_n'(ka) / H_n'(ka) and Graf's
 *    addition theorem), solved by a secant on its determinant in the k plane and mapped to
 *    omega by omega^2 = g k tanh(k h): tests/poles/ref_two_columns.py (numpy 1.24,
 *    scipy 1.10), output pasted below;
 *  - the argument-principle count equals the number found, no pole twice;
 *  - the mode is per body and symmetric in size for the mirror-symmetric pair (both
 *    bodies amplitude 1);
 *  - four columns at the corners of a square (radius 5 m, side 14 m, orders -12..12): the
 *    square's symmetry group has a two-dimensional representation, so det(I - D T) has
 *    double zeros (a symmetric system's determinant factorises by representations, each
 *    factor raised to the representation's dimension: group-theory reduction); the one at
 *    1.3558 - 0.2330i is compared with tests/poles/ref_four_columns.py (the same
 *    independent system, secant on f^(1/2), winding 2 on a small circle), output pasted
 *    below, and must be listed twice, polished, with count = found and two independent
 *    mode shapes. */
#include "check.h"
#include "float_model.h"
#include "swellyield/swellyield.h"

#include <math.h>

int main(void)
{
    sy_init();
    double x[2] = {0, 12}, omega[2] = {0.4, 2.4};
    sy_model m;
    sy_model_device dev[2];
    sy_test_float_model(&m, dev, 2, x, NULL, omega, 2, NULL, 0);
    m.shape = SY_SHAPE_COLUMN;
    m.orders = 16, m.depth_modes = 1; /* the reference's truncation */
    m.tolerance = 1e-9;
    m.has_resonance = 1, m.res_re_min = 1.15, m.res_re_max = 1.45, m.res_im_depth = 0.3;
    sy_error err = SY_ERROR_INIT;
    sy_pole_set *ps = NULL;
    /* ref_two_columns.py: k = 0.164075083285261-0.065970671824324i,
       omega = 1.293133193970050-0.250234189276294i */
    const double complex want = 1.293133193970050 - 0.250234189276294 * I;
    if (sy_check_ok(sy_poles_find(&ps, &m, SY_POLES_SCATTERING, &err), &err, "two columns: poles")) {
        sy_check_true(ps->count[SY_POLE_SCATTERING] == (int)ps->found[SY_POLE_SCATTERING],
                      "two columns: argument-principle count %d = found %zu", ps->count[SY_POLE_SCATTERING],
                      ps->found[SY_POLE_SCATTERING]);
        double best = INFINITY;
        size_t at = 0;
        for (size_t i = 0; i < ps->n; i++) {
            if (cabs(ps->poles[i].omega - want) < best)
                best = cabs(ps->poles[i].omega - want), at = i;
            for (size_t j = 0; j < i; j++)
                sy_check_true(cabs(ps->poles[i].omega - ps->poles[j].omega) > 1e-6, "two columns: poles %zu, %zu distinct",
                              j, i);
        }
        /* 1e-9: the secant stops at 1e-11 relative; the body solves are exact Bessel
           ratios for columns, so both sides are the same truncated determinant. */
        if (sy_check_true(ps->n > 0, "two columns: a scattering pole found")) {
            sy_check_close(best / cabs(want), 0, 0, 1e-9, "two columns: pole %.12f%+.12fi = reference root",
                           creal(ps->poles[at].omega), cimag(ps->poles[at].omega));
            sy_check_true(ps->poles[at].kind == SY_POLE_SCATTERING, "two columns: kind scattering");
            if (sy_check_true(ps->poles[at].mode != NULL, "two columns: mode shape present"))
                sy_check_close(cabs(ps->poles[at].mode[0]) * cabs(ps->poles[at].mode[1]), 1.0, 1e-6, 0,
                               "two columns: both bodies amplitude 1 (mirror symmetry), got %.8f and %.8f",
                               cabs(ps->poles[at].mode[0]), cabs(ps->poles[at].mode[1]));
        }
    }
    sy_pole_set_free(ps);
    ps = NULL;
    double sx[4] = {0, 14, 0, 14}, sy[4] = {0, 0, 14, 14};
    sy_model_device dev4[4];
    sy_test_float_model(&m, dev4, 4, sx, sy, omega, 2, NULL, 0);
    m.shape = SY_SHAPE_COLUMN;
    m.orders = 12, m.depth_modes = 1;
    m.tolerance = 1e-9;
    m.has_resonance = 1, m.res_re_min = 1.0, m.res_re_max = 1.4, m.res_im_depth = 0.3;
    /* ref_four_columns.py: k = 0.181839300526570-0.064401526942350i,
       omega = 1.355776628895154-0.232995228377780i, winding 2.000 */
    const double complex dbl = 1.355776628895154 - 0.232995228377780 * I;
    if (sy_check_ok(sy_poles_find(&ps, &m, SY_POLES_SCATTERING, &err), &err, "square: poles")) {
        sy_check_true(ps->count[SY_POLE_SCATTERING] == (int)ps->found[SY_POLE_SCATTERING],
                      "square: argument-principle count %d = found %zu", ps->count[SY_POLE_SCATTERING],
                      ps->found[SY_POLE_SCATTERING]);
        size_t hits = 0, polished = 0, at[2] = {0, 0};
        for (size_t i = 0; i < ps->n; i++) {
            /* 1e-9 as for the pair: a double zero polished on f^(1/2) converges like a simple one */
            if (cabs(ps->poles[i].omega - dbl) <= 1e-9 * cabs(dbl)) {
                if (hits < 2)
                    at[hits] = i;
                hits++, polished += (size_t)ps->poles[i].converged;
            }
        }
        sy_check_true(hits == 2, "square: double zero %.12f%+.12fi listed twice (got %zu)", creal(dbl), cimag(dbl),
                      hits);
        sy_check_true(polished == 2, "square: double zero polished (%zu of 2)", polished);
        /* The two entries span the two-dimensional null space: their body-wise modes are
         * independent (the square's two dipole-like patterns; |cos| < 0.9, the solver's
         * own test of a new mode), not one mode twice. */
        const double complex *a = ps->poles[at[0]].mode, *b = ps->poles[at[1]].mode;
        if (hits == 2 && sy_check_true(a != NULL && b != NULL, "square: mode shapes present")) {
            double complex c = 0;
            double na = 0, nb = 0;
            for (size_t d = 0; d < 4; d++)
                c += conj(a[d]) * b[d], na += pow(cabs(a[d]), 2), nb += pow(cabs(b[d]), 2);
            sy_check_true(cabs(c) < 0.9 * sqrt(na * nb), "square: the double zero's two modes independent, |cos| %.3f",
                          cabs(c) / sqrt(na * nb));
        }
    }
    sy_pole_set_free(ps);
    return sy_check_summary();
}
