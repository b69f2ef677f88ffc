/* The `column` body kind (bottom-mounted surface-piercing cylinder) against MacCamy &
 * Fuchs (references.md section 8), directly and through the array path with one body;
 * structure of D and G (closed form). */
#include "check.h"

#include "swellyield/array.h"
#include "swellyield/body.h"
#include "swellyield/waves.h"

#include <gsl/gsl_sf_bessel.h>
#include <math.h>
#include <stdlib.h>

#define PI 3.14159265358979323846
#define RHO 1025.0
#define G 9.81

/* |H1'(x)| and alpha = atan2(Y1'(x), J1'(x)) from GSL's real Bessel routines (an
 * evaluation independent of the special module used by the library). */
static void h1prime(double x, double *mag, double *alpha)
{
    double jp = gsl_sf_bessel_J0(x) - gsl_sf_bessel_J1(x) / x;
    double yp = gsl_sf_bessel_Y0(x) - gsl_sf_bessel_Y1(x) / x;
    *mag = hypot(jp, yp);
    *alpha = atan2(yp, jp);
}

struct row {
    double a, h, H, T, k, abs_h1p, F_kN, alpha_deg, M_kNm;
    /* digits: rounding half-units of the table's last digit, relative */
    double rtol_F, rtol_M;
};

/* references.md section 8 table [computed: calc_05_maccamy_fuchs.py], rho 1025, g 9.81. */
static const struct row rows[] = {
    {5, 20, 2, 8, 0.07076243, 4.93076028, 1447.5766, 84.4517, 16489.525, 4e-8, 4e-8},
    {1, 20, 2, 8, 0.07076243, 126.420208, 56.4597, 89.7738, 643.140, 1e-6, 1e-6},
    {10, 30, 1, 10, 0.04576416, 2.99338903, 2820.8109, 81.1351, 47906.294, 2e-8, 2e-8},
    {5, 100, 2, 8, 0.06288018, 6.23856867, 1630.5623, 85.5726, 137221.172, 4e-8, 4e-9},
};

static void check_row(const struct row *r)
{
    sy_error err = SY_ERROR_INIT;
    const size_t M = 3, Q = 4;
    double omega = 2 * PI / r->T, k;
    sy_check_ok(sy_waves_wavenumber(omega, r->h, G, &k, &err), &err, "wavenumber T = %g", r->T);
    sy_check_close(k, r->k, 6e-8, 0.0, "k for a = %g, h = %g (table 8 digits)", r->a, r->h);
    double mag, alpha;
    h1prime(k * r->a, &mag, &alpha);
    sy_check_close(mag, r->abs_h1p, 1e-8, 0.0, "|H1'(ka)| GSL vs table, a = %g", r->a);

    /* Direct body path: column with moments about the seabed. */
    sy_body_geometry geom = {SY_BODY_COLUMN, r->a, r->h, -r->h};
    sy_body_plan *plan = NULL;
    sy_body_work *work = NULL;
    sy_body_waves *out = NULL;
    double complex kev[8];
    sy_wave_roots roots = {.k = kev};
    int rc = sy_body_plan_create(&plan, &geom, r->h, 1e-10, M, Q, &err);
    if (rc == SY_OK)
        rc = sy_body_work_alloc(&work, plan, &err);
    if (rc == SY_OK)
        rc = sy_body_waves_alloc(&out, M, Q, &err);
    if (rc == SY_OK)
        rc = sy_waves_roots_fill(&roots, omega, r->h, G, Q - 1, &err);
    if (rc == SY_OK)
        rc = sy_body_solve(plan, &roots, RHO, work, out, &err);
    if (!sy_check_ok(rc, &err, "column solve a = %g", r->a))
        goto done;
    /* Heading 0: a_{0n} = -(i g/omega) i^n (array.h / conventions.md Jacobi-Anger). */
    const size_t nn = 2 * M + 1;
    double complex amp = -I * G / omega, fx = 0, my = 0, fy = 0, fz = 0;
    for (long n = -(long)M; n <= (long)M; n++) {
        double complex an = amp * cpow(I, (double)n);
        size_t c = (size_t)(n + (long)M);
        fx += out->force[(0 * Q + 0) * nn + c] * an;
        fy += out->force[(1 * Q + 0) * nn + c] * an;
        fz += out->force[(2 * Q + 0) * nn + c] * an;
        my += out->force[(4 * Q + 0) * nn + c] * an;
    }
    double A = r->H / 2;   /* wave amplitude of the table's height */
    /* closed form (references.md section 8) with our k: 4 rho g tanh(kh)/(k^2 |H1'|) per unit
     * amplitude; GSL vs the special module and the pressure integral: rounding only. */
    double fcf = 4 * RHO * G * tanh(k * r->h) / (k * k * mag);
    double mcf = 4 * RHO * G * (k * r->h * sinh(k * r->h) - cosh(k * r->h) + 1) /
                 (k * k * k * cosh(k * r->h) * mag);
    sy_check_close(cabs(fx), fcf, 1e-12, 0.0, "|Fx| = closed form (GSL), a = %g h = %g", r->a, r->h);
    sy_check_close(cabs(my), mcf, 1e-12, 0.0, "|M| about seabed = closed form, a = %g", r->a);
    sy_check_close(cabs(fx) * A / 1e3, r->F_kN, r->rtol_F, 0.0, "|F| kN vs table 8, a = %g h = %g",
                   r->a, r->h);
    sy_check_close(cabs(my) * A / 1e3, r->M_kNm, r->rtol_M, 0.0, "|M| kN m vs table 8, a = %g h = %g",
                   r->a, r->h);
    /* Phase: eta = A cos(kx - wt) <-> Re{A e^{ikx} e^{-iwt}}; F(t) = |F| cos(wt + alpha)
     * = Re{|F| e^{-i alpha} e^{-iwt}}, so arg X = -alpha (references.md section 8). */
    sy_check_close(-carg(fx) * 180 / PI, r->alpha_deg, 0.0, 6e-5, "phase alpha deg vs table 8, a = %g", r->a);
    sy_check_close(carg(fx), -alpha, 0.0, 1e-12, "phase = -atan2(Y1', J1') (GSL)");
    sy_check_close(cabs(fy), 0.0, 0.0, 1e-9 * cabs(fx), "no sway force at heading 0");
    sy_check_close(cabs(fz), 0.0, 0.0, 0.0, "no heave force on a column");
    /* D diagonal in q, and D_n(0,0) = -J_n'/H_n' satisfies |1 + 2 D| = 1 (energy: the
     * propagating scattering coefficient of a fixed lossless body has unit modulus). */
    for (size_t n = 0; n <= M; n++) {
        double complex d00 = out->diffraction[(n * Q + 0) * Q + 0];
        sy_check_close(cabs(1.0 + 2.0 * d00), 1.0, 1e-13, 0.0, "|1 + 2 D_%zu(0,0)| = 1", n);
        sy_check_true(out->diffraction[(n * Q + 0) * Q + 1] == 0.0 &&
                      out->diffraction[(n * Q + 2) * Q + 1] == 0.0, "D_%zu diagonal in q", n);
        sy_check_true(creal(out->diffraction[(n * Q + 1) * Q + 1]) < 0 ||
                      creal(out->diffraction[(n * Q + 1) * Q + 1]) > 0, "D_%zu(1,1) finite", n);
    }
    sy_check_true(out->added_mass[0] == 0 && out->damping[12] == 0 && out->radiation[0] == 0,
                  "fixed column: no radiation");

    /* One column through the array path equals the body path (same closed form). */
    {
        sy_array_settings s = {r->h, RHO, G, 1e-10, M, Q, 0.0};
        sy_array_type t = {geom, SY_ARRAY_SURGE | SY_ARRAY_PITCH};
        sy_array_body b = {3.7, -1.2, 0};
        double beta[2] = {0.0, 0.9};
        sy_array_plan *ap = NULL;
        sy_array_work *aw = NULL;
        sy_array_hydro *res = NULL;
        rc = sy_array_plan_create(&ap, &s, &t, 1, &b, 1, beta, 2, &err);
        if (rc == SY_OK)
            rc = sy_array_work_alloc(&aw, ap, &err);
        if (rc == SY_OK)
            rc = sy_array_hydro_alloc(&res, ap, &err);
        if (rc == SY_OK)
            rc = sy_array_solve(ap, omega, aw, res, &err);
        if (sy_check_ok(rc, &err, "array of one column")) {
            /* body at (3.7, -1.2): phase exp(i k x) at heading 0; heading 0.9 rotates the
             * force: Fx(beta) = Fx(0) cos beta (axisymmetry). */
            double complex ph0 = cexp(I * k * 3.7);
            sy_check_cclose(res->excitation[0], fx * ph0, 1e-12, 0.0, "array N = 1: Fx(0)");
            sy_check_cclose(res->excitation[1], my * ph0, 1e-12, 0.0, "array N = 1: My(0)");
            double complex ph1 = cexp(I * k * (3.7 * cos(0.9) - 1.2 * sin(0.9)));
            sy_check_cclose(res->excitation[2], fx * ph1 * cos(0.9), 1e-12, 0.0, "array N = 1: Fx(0.9)");
            sy_check_true(res->impedance[0] == 0.0, "column impedance zero");
        }
        sy_array_hydro_free(res);
        sy_array_work_free(aw);
        sy_array_plan_free(ap);
    }
done:
    sy_body_waves_free(out);
    sy_body_work_free(work);
    sy_body_plan_free(plan);
}

int main(void)
{
    sy_init();
    for (size_t i = 0; i < sizeof rows / sizeof rows[0]; i++)
        check_row(&rows[i]);
    return sy_check_summary();
}
