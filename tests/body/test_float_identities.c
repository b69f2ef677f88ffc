/* Floating truncated cylinder (src/body/float_*.c): identities of linear potential flow
 * that the solution must satisfy, at several ka, kh, d/h.
 *  - Haskind relations (references.md 7.1; Newman 1962): B33 = k |X3|^2 / (4 rho g cg),
 *    B11 = k |X1(0)|^2 / (8 rho g cg), same for pitch; X from the force characteristics G
 *    with the plane-wave partial waves of conventions.md (float_testlib.h).
 *  - A, B symmetric; B positive semi-definite; sway/roll equal surge/pitch, A24 = -A15
 *    (axisymmetry: sway = surge rotated by 90 degrees, roll = -pitch rotated).
 *  - Energy (optical) identity of the propagating block: |1 + 2 D_n(0,0)| = 1 for every
 *    order n at real omega (J_n = (H1 + H2)/2: incoming amplitude 1/2 is reflected with
 *    1/2 + D_n, evanescent modes carry no energy).
 *  - Reciprocity between diffraction and radiation per partial wave (Green's theorem on
 *    r = a, Wronskians DLMF 10.5.5 and 10.28.2): G_j(0,n) = 4 omega rho N_0 (-1)^n
 *    R_j(0,-n), G_j(q,n) = 2 pi i omega rho N_q R_j(q,-n) (q >= 1), N_q = int Z_q^2 dz.
 *    G comes from the diffraction solutions, R from the radiation solutions.
 *  - Centre of rotation: pitch about z_rot has n_5' = n_5 - z_rot n_1, so
 *    A55' = A55 - 2 z_rot A15 + z_rot^2 A11, A15' = A15 - z_rot A11, X5' = X5 - z_rot X1.
 *  - Long waves: heave excitation -> rho g pi a^2 (hydrostatic / Froude-Krylov limit,
 *    Newman 1977 ch. 6), heading-independent heave excitation.
 *  - Bad input gives a clear message. */
#include <complex.h>
#include <math.h>
#include <stdio.h>
#include "check.h"
#include "float_testlib.h"

static double norm_q(const sy_wave_roots *r, size_t q)
{
    double h = r->h;
    if (q == 0) {
        double k = creal(r->k0);
        return tanh(k * h) / (2.0 * k) + h / (2.0 * cosh(k * h) * cosh(k * h));
    }
    double k = creal(r->k[q - 1]), c = cos(k * h);
    return (h / 2.0 + sin(2.0 * k * h) / (4.0 * k)) / (c * c);
}

static void one_case(double a, double d, double h, double z_rot, double omega)
{
    sy_error err = SY_ERROR_INIT;
    tl_float t;
    const size_t M = 3, Q = 3, nn = 2 * M + 1;
    if (!sy_check_ok(tl_float_open(&t, a, d, h, z_rot, 1e-7, M, Q, &err), &err, "open") ||
        !sy_check_ok(tl_float_solve(&t, omega, &err), &err, "solve a=%g d=%g h=%g omega=%g", a, d, h, omega)) {
        tl_float_close(&t);
        return;
    }
    const sy_body_waves *o = t.out;
    double k = creal(t.roots.k0), rho = t.rho, g = t.g;
    double cg = sy_waves_group_velocity(omega, k, h);
    printf("case a=%g d=%g h=%g z_rot=%g omega=%g: ka=%.3f kh=%.3f d/h=%.3f, convergence %.2e\n",
           a, d, h, z_rot, omega, k * a, k * h, d / h, o->convergence);
    double complex X[5];
    tl_excitation(o, omega, g, 0.0, X);
    double B[25], A[25];
    for (int i = 0; i < 25; i++) {
        B[i] = creal(o->damping[i]);
        A[i] = creal(o->added_mass[i]);
    }
    /* Haskind: the Galerkin solution satisfies reciprocity to round-off; 1e-6 is the
     * brief's requirement, we assert 1e-8 (well above round-off, well below truncation). */
    sy_check_close(B[2 * 5 + 2], k * pow(cabs(X[2]), 2) / (4 * rho * g * cg), 1e-8, 0.0, "Haskind heave");
    sy_check_close(B[0], k * pow(cabs(X[0]), 2) / (8 * rho * g * cg), 1e-8, 0.0, "Haskind surge");
    sy_check_close(B[4 * 5 + 4], k * pow(cabs(X[4]), 2) / (8 * rho * g * cg), 1e-8, 0.0, "Haskind pitch");
    /* generalised Haskind off-diagonal: B15 = k/(8 rho g cg) Re(X1 conj X5) * (2 pi / pi) */
    sy_check_close(B[4], k * creal(X[0] * conj(X[4])) / (8 * rho * g * cg), 1e-8,
                   1e-10 * sqrt(B[0] * B[24]), "Haskind surge-pitch coupling");
    /* beam sea: sway excitation equals surge at beta = 0 */
    double complex X90[5];
    tl_excitation(o, omega, g, 1.5707963267948966, X90);
    sy_check_close(cabs(X90[1]), cabs(X[0]), 1e-12, 0.0, "sway excitation at 90 deg = surge at 0");
    sy_check_close(cabs(X90[2]), cabs(X[2]), 1e-12, 0.0, "heave excitation heading-independent");
    /* symmetry and axisymmetry */
    double s15 = sqrt(fabs(A[0] * A[24]));
    sy_check_close(A[4], A[20], 1e-9, 1e-12 * s15, "A15 = A51");
    sy_check_close(B[4], B[20], 1e-9, 1e-12 * sqrt(B[0] * B[24]), "B15 = B51");
    sy_check_close(A[1 * 5 + 3], A[3 * 5 + 1], 1e-9, 1e-12 * s15, "A24 = A42");
    sy_check_close(A[1 * 5 + 1], A[0], 1e-14, 0.0, "A22 = A11");
    sy_check_close(A[3 * 5 + 3], A[24], 1e-14, 0.0, "A44 = A55");
    sy_check_close(A[1 * 5 + 3], -A[4], 1e-14, 0.0, "A24 = -A15");
    sy_check_close(B[1 * 5 + 3], -B[4], 1e-14, 0.0, "B24 = -B15");
    double offmax = 0.0;
    const int zero_pairs[][2] = {{0, 1}, {0, 2}, {0, 3}, {1, 2}, {1, 4}, {2, 3}, {2, 4}, {3, 4}};
    for (size_t i = 0; i < sizeof zero_pairs / sizeof zero_pairs[0]; i++) {
        int p = zero_pairs[i][0], q = zero_pairs[i][1];
        offmax = fmax(offmax, fabs(A[p * 5 + q]) + fabs(A[q * 5 + p]));
    }
    sy_check_close(offmax, 0.0, 0.0, 1e-12 * A[0], "uncoupled pairs vanish (axisymmetry)");
    /* B positive semi-definite: blocks {3}, {1,5}, {2,4} */
    sy_check_true(B[0] >= 0 && B[12] >= 0 && B[24] >= 0, "B diagonal >= 0");
    /* one body radiates surge and pitch into the same n = +-1 far-field waves, so the
     * {1,5} block has rank one: det = 0 up to round-off of the entries (1e-8 relative) */
    sy_check_true(B[0] * B[24] - B[4] * B[20] >= -1e-8 * B[0] * B[24], "det B{1,5} >= 0 (PSD), det/B11B55 = %.2e",
                  (B[0] * B[24] - B[4] * B[20]) / (B[0] * B[24]));
    /* energy identity of the propagating block */
    for (size_t n = 0; n <= M; n++)
        sy_check_close(cabs(1.0 + 2.0 * o->diffraction[(n * Q + 0) * Q + 0]), 1.0, 0.0, 1e-12,
                       "|1 + 2 D_%zu(0,0)| = 1", n);
    /* reciprocity diffraction <-> radiation per partial wave */
    for (int j = 0; j < 5; j++)
        for (int n = -1; n <= 1; n++)
            for (size_t q = 0; q < Q; q++) {
                double complex Gd = o->force[((size_t)j * Q + q) * nn + (size_t)(n + (int)M)];
                double complex R = o->radiation[((size_t)j * Q + q) * nn + (size_t)(-n + (int)M)];
                double Nq = norm_q(&t.roots, q);
                double complex want = (q == 0) ? 4.0 * omega * rho * Nq * ((n % 2) ? -1.0 : 1.0) * R
                                               : 2.0 * TL_PI * I * omega * rho * Nq * R;
                double scale = cabs(o->force[((size_t)j * Q + 0) * nn + (size_t)(n + (int)M)]);
                if (scale == 0.0)
                    scale = 1.0;
                sy_check_cclose(Gd, want, 1e-8, 1e-9 * scale, "G_%d(%zu,%d) from R (reciprocity)", j + 1, q, n);
            }
    tl_float_close(&t);
}

int main(void)
{
    sy_init();
    /* invented geometries spanning ka, kh and d/h */
    one_case(5.0, 4.0, 20.0, 0.0, 0.9);     /* ka 0.4, kh 1.7, d/h 0.2 */
    one_case(5.0, 4.0, 20.0, -1.3, 1.7);    /* rotation centre below the waterline */
    one_case(3.0, 6.0, 12.0, 0.0, 1.37);    /* deep draft, d/h 0.5 */
    one_case(8.0, 2.0, 50.0, 0.0, 0.63);    /* shallow draft, wide */
    one_case(2.0, 9.0, 10.0, 0.0, 2.3);     /* small gap b = 1 m */

    /* centre of rotation */
    {
        sy_error err = SY_ERROR_INIT;
        tl_float t0, t1;
        const double zr = -1.3, om = 1.1;
        if (sy_check_ok(tl_float_open(&t0, 5.0, 4.0, 20.0, 0.0, 1e-8, 1, 1, &err), &err, "open") &&
            sy_check_ok(tl_float_open(&t1, 5.0, 4.0, 20.0, zr, 1e-8, 1, 1, &err), &err, "open") &&
            sy_check_ok(tl_float_solve(&t0, om, &err), &err, "solve") &&
            sy_check_ok(tl_float_solve(&t1, om, &err), &err, "solve")) {
            const sy_body_waves *a = t0.out, *b = t1.out;
            double complex X0[5], X1[5];
            tl_excitation(a, om, t0.g, 0.4, X0);
            tl_excitation(b, om, t1.g, 0.4, X1);
            double A11 = creal(a->added_mass[0]), A15 = creal(a->added_mass[4]), A55 = creal(a->added_mass[24]);
            double B11 = creal(a->damping[0]), B15 = creal(a->damping[4]), B55 = creal(a->damping[24]);
            /* both solves at 1e-8; the transformation is exact linear algebra */
            sy_check_close(creal(b->added_mass[24]), A55 - 2 * zr * A15 + zr * zr * A11, 1e-7, 0.0, "A55 about z_rot");
            sy_check_close(creal(b->added_mass[4]), A15 - zr * A11, 1e-7, 1e-9 * A11, "A15 about z_rot");
            sy_check_close(creal(b->damping[24]), B55 - 2 * zr * B15 + zr * zr * B11, 1e-7, 0.0, "B55 about z_rot");
            sy_check_cclose(X1[4], X0[4] - zr * X0[0], 1e-7, 0.0, "X5 about z_rot");
            sy_check_cclose(X1[2], X0[2], 1e-12, 0.0, "heave unaffected by z_rot");
        }
        tl_float_close(&t0);
        tl_float_close(&t1);
    }
    /* long-wave heave excitation -> rho g pi a^2: corrections O((k a)^2, k d), here
     * k a ~ 6e-3: assert 1e-3 relative (common practice for this limit) */
    {
        sy_error err = SY_ERROR_INIT;
        tl_float t;
        double a = 5.0, om = 0.02;
        if (sy_check_ok(tl_float_open(&t, a, 4.0, 20.0, 0.0, 1e-7, 1, 1, &err), &err, "open") &&
            sy_check_ok(tl_float_solve(&t, om, &err), &err, "solve at omega = %g", om)) {
            double complex X[5];
            tl_excitation(t.out, om, t.g, 0.3, X);
            sy_check_close(cabs(X[2]), t.rho * t.g * TL_PI * a * a, 1e-3, 0.0,
                           "heave excitation -> rho g pi a^2 (hydrostatic limit)");
        }
        tl_float_close(&t);
    }
    /* bad input */
    {
        sy_error err = SY_ERROR_INIT;
        sy_body_plan *p = NULL;
        sy_body_geometry geo = {SY_BODY_FLOAT, 5.0, 25.0, 0.0};
        sy_check_fails(sy_body_plan_create(&p, &geo, 20.0, 1e-6, 2, 2, &err), SY_EINVAL, &err,
                       "draft must be > 0 and < depth", "draft below the seabed rejected");
        sy_body_plan_free(p);
    }
    return sy_check_summary();
}
