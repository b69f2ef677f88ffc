/* Kramers-Kronig relation for the float's heave added mass and damping (references.md
 * 7.4; Kotik & Mangulis 1962, from memory): A(w) - A_inf = (2/pi) PV int_0^inf B(x) /
 * (x^2 - w^2) dx, used as a difference between two frequencies so that A_inf drops out:
 *   A(w1) - A(w2) = (2/pi) PV int_0^inf B(x) [1/(x^2 - w1^2) - 1/(x^2 - w2^2)] dx.
 * The principal value is taken by subtracting B(w_i): int (B(x) - B(w_i))/(x^2 - w_i^2) dx
 * + B(w_i) (1/(2 w_i)) ln|(X - w_i)/(X + w_i)| on [0, X], X = 6 rad/s where heave damping
 * has decayed like exp(-2 k d) (k d = 14.7: e^-29 of its peak, far below the tolerance).
 * Quadrature: 10-point Gauss-Legendre on 8 panels per interval [0,w1], [w1,w2], [w2,X]
 * (panel edges at the w_i so the subtracted integrand is smooth on each). Tolerance: 2e-6
 * of |A(w1)| (the solver runs at 1e-7; with 4 instead of 8 panels the integral changed by
 * 2e-12 relative when this test was written; the two sides agreed to 2.4e-9). */
#include <complex.h>
#include <math.h>
#include <stdio.h>
#include "check.h"
#include "float_testlib.h"

static const double gx[10] = {-0.9739065285171717, -0.8650633666889845, -0.6794095682990244,
                              -0.4333953941292472, -0.1488743389816312, 0.1488743389816312,
                              0.4333953941292472, 0.6794095682990244, 0.8650633666889845,
                              0.9739065285171717};
static const double gw[10] = {0.0666713443086881, 0.1494513491505806, 0.2190863625159820,
                              0.2692667193099963, 0.2955242247147529, 0.2955242247147529,
                              0.2692667193099963, 0.2190863625159820, 0.1494513491505806,
                              0.0666713443086881};

static tl_float T;
static int failed;

static void heave(double w, double *A, double *B)
{
    sy_error err = SY_ERROR_INIT;
    if (tl_float_solve(&T, w, &err) != SY_OK) {
        failed = 1;
        *A = *B = NAN;
        return;
    }
    *A = creal(T.out->added_mass[12]);
    *B = creal(T.out->damping[12]);
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    if (!sy_check_ok(tl_float_open(&T, 5.0, 4.0, 20.0, 0.0, 1e-7, 0, 1, &err), &err, "open"))
        return sy_check_summary();
    const double w1 = 0.63, w2 = 1.37, X = 6.0;
    double A1, B1, A2, B2;
    heave(w1, &A1, &B1);
    heave(w2, &A2, &B2);
    const double edges[4] = {0.0, w1, w2, X};
    double s = 0.0;
    for (int r = 0; r < 3; r++) {
        const int np = 8;
        double h = (edges[r + 1] - edges[r]) / np;
        for (int p = 0; p < np; p++)
            for (int i = 0; i < 10; i++) {
                double x = edges[r] + h * (p + 0.5 + 0.5 * gx[i]);
                double A, B;
                heave(x, &A, &B);
                double f = (B - B1) / (x * x - w1 * w1) - (B - B2) / (x * x - w2 * w2);
                s += 0.5 * h * gw[i] * f;
            }
    }
    s += B1 / (2 * w1) * log(fabs((X - w1) / (X + w1))) - B2 / (2 * w2) * log(fabs((X - w2) / (X + w2)));
    double rhs = 2.0 / TL_PI * s;
    sy_check_true(!failed, "all solves succeeded");
    printf("A33(%g) - A33(%g): direct %.12g, Kramers-Kronig %.12g\n", w1, w2, A1 - A2, rhs);
    sy_check_close(rhs, A1 - A2, 0.0, 2e-6 * fabs(A1), "Kramers-Kronig: A33(w1) - A33(w2) from B33");
    tl_float_close(&T);
    return sy_check_summary();
}
