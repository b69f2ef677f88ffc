/* Dispersion relation, group velocity and evanescent roots, real and complex omega.
 * Reference values: references.md section 1 (computed there by an independent script,
 * roots cross-checked against 40-digit roots), the DNV compendium deep-water example,
 * and ref_roots.py (mpmath 1.2, 40 digits, run at test time). */
#include "check.h"
#include "waves/waves_impl.h"

#include <float.h>
#include <math.h>

#define PI 3.14159265358979323846
#include <stdio.h>
#include <stdlib.h>

static const double G = 9.81; /* references.md section 0 */

static double k_of(double T, double h)
{
    double k = NAN;
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(sy_waves_wavenumber(2 * PI / T, h, G, &k, &err), &err, "wavenumber T = %g, h = %g",
                T, h);
    return k;
}

/* Relative residual of the propagating relation, computed in long double so the check
 * measures the root, not the rounding of the residual evaluation. */
static double resid0(double complex omega, double complex k, double h)
{
    long double complex w = omega, kk = k;
    long double complex r = w * w - (long double)G * kk * ctanhl(kk * (long double)h);
    return (double)(cabsl(r) / cabsl(w * w));
}

static double residm(double complex omega, double complex k, double h)
{
    long double complex w = omega, kk = k;
    long double complex r = w * w + (long double)G * kk * ctanl(kk * (long double)h);
    return (double)(cabsl(r) / cabsl(w * w));
}

static void table_values(void)
{
    /* references.md section 1 table, g = 9.81 [computed: calc_01_dispersion.py]. k has 10
     * significant digits (half-unit 5e-11 / 0.035 = 1.4e-9 relative at worst), cg 7
     * (half-unit 5e-7 / 6.2 = 8e-8). */
    static const struct {
        double T, h, k, cg;
    } row[] = {
        {8, 20, 0.0707624287, 7.409033},   {8, 50, 0.0631085968, 6.365258},
        {8, 1000, 0.0628797426, 6.245240}, {10, 10, 0.0680190743, 8.069934},
        {12, 30, 0.0354897788, 11.166007},
    };
    for (size_t i = 0; i < sizeof row / sizeof row[0]; i++) {
        double k = k_of(row[i].T, row[i].h), w = 2 * PI / row[i].T;
        sy_check_close(k, row[i].k, 1.5e-9, 0, "k, T = %g s, h = %g m (references.md 1)", row[i].T,
                       row[i].h);
        sy_check_close(sy_waves_group_velocity(w, k, row[i].h), row[i].cg, 1e-7, 0,
                       "cg, T = %g s, h = %g m (references.md 1)", row[i].T, row[i].h);
    }
    /* Deep limit T = 8 s (references.md 1): k0 = 0.0628797426, cg0 = 6.245240 m/s. */
    double k0 = k_of(8, INFINITY);
    sy_check_close(k0, 0.0628797426, 1.5e-9, 0, "deep k0, T = 8 s (references.md 1)");
    sy_check_close(sy_waves_group_velocity(2 * PI / 8, k0, INFINITY), 6.245240, 1e-7, 0,
                   "deep cg0, T = 8 s (references.md 1)");
    /* h = L0/2: k = 0.0631096765 (references.md 1, 10 digits). */
    double L0 = 9.81 * 64 / (2 * PI);
    sy_check_close(k_of(8, L0 / 2), 0.0631096765, 1.5e-9, 0, "k at h = L0/2 (references.md 1)");
    /* Shallow h = 1 m, T = 20 s: c = 3.126839 m/s (references.md 1, 7 digits). */
    sy_check_close(2 * PI / 20 / k_of(20, 1), 3.126839, 2e-7, 0,
                   "c, h = 1 m, T = 20 s (references.md 1)");
    /* Evanescent roots T = 8 s, h = 20 m (references.md 1, 7 digits: half-unit 5e-8 abs). */
    double complex kk[3];
    sy_wave_roots r = {.k = kk};
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(sy_waves_roots_fill(&r, 2 * PI / 8, 20, G, 3, &err), &err, "roots T = 8, h = 20");
    const double want[3] = {0.1353318, 0.3039597, 0.4645114};
    for (int m = 0; m < 3; m++) {
        sy_check_close(creal(kk[m]), want[m], 0, 5e-8, "k_%d, T = 8 s, h = 20 m (references.md 1)",
                       m + 1);
        sy_check_true(cimag(kk[m]) == 0.0, "k_%d real on the real axis", m + 1);
    }
    sy_check_close(creal(r.k0), 0.0707624287, 1.5e-9, 0,
                   "roots_fill k0 = table k (references.md 1)");
    /* DNV compendium worked example [references.md 1, verified]: omega = 0.62832 rad/s in
     * deep water, k = 0.040243 rad/m, lambda = 156.13 m, c = 15.613 m/s, cg = 7.8066 m/s;
     * the page prints 5 digits, references.md asserts 1e-4 relative. */
    double w = 0.62832, k = NAN;
    sy_check_ok(sy_waves_wavenumber(w, INFINITY, G, &k, &err), &err, "DNV deep example");
    sy_check_close(k, 0.040243, 1e-4, 0, "DNV example k");
    sy_check_close(2 * PI / k, 156.13, 1e-4, 0, "DNV example wavelength");
    sy_check_close(w / k, 15.613, 1e-4, 0, "DNV example c");
    sy_check_close(sy_waves_group_velocity(w, k, INFINITY), 7.8066, 1e-4, 0, "DNV example cg");
}

static void limits_and_residuals(void)
{
    /* style.md example: kh = 765, tanh(kh) == 1 in double, so k = omega^2/g exactly. */
    double k = NAN;
    sy_check_ok(sy_waves_wavenumber(1.37, 4000.0, G, &k, NULL), NULL, "wavenumber");
    sy_check_close(k, 1.37 * 1.37 / G, 4 * DBL_EPSILON, 0.0, "deep-water limit kh = 765");
    /* Very large kh: no overflow, k = omega^2/g exactly, cg = c/2. */
    sy_check_ok(sy_waves_wavenumber(30.0, 1e5, G, &k, NULL), NULL, "kh ~ 9e6");
    sy_check_close(k, 900.0 / G, 4 * DBL_EPSILON, 0.0, "deep limit kh ~ 9e6");
    sy_check_close(sy_waves_group_velocity(30.0, k, 1e5), 0.5 * 30.0 / k, 4 * DBL_EPSILON, 0,
                   "cg = c/2 at kh ~ 9e6 (no overflow in sinh)");
    /* Shallow limit: c/sqrt(gh) = sqrt(tanh x / x) = 1 - x^2/6 + O(x^4) (Taylor series);
     * cg/sqrt(gh) = 1 - x^2/2 + O(x^4). */
    double h = 0.0137, w = 2 * PI / 23.0;
    sy_check_ok(sy_waves_wavenumber(w, h, G, &k, NULL), NULL, "shallow");
    double x = k * h, c0 = sqrt(G * h);
    sy_check_close(w / k / c0, 1 - x * x / 6, 0, x * x * x * x,
                   "shallow limit c -> sqrt(gh), kh = %.3g", x);
    sy_check_close(sy_waves_group_velocity(w, k, h) / c0, 1 - x * x / 2, 0, x * x * x * x,
                   "shallow limit cg -> sqrt(gh)");
    /* Residuals over a wide grid: the header promises < 1e-14 relative. */
    double worst = 0, worst_m = 0;
    int failed = 0, outside = 0, cases = 0;
    double complex kk[10];
    for (double T = 1.3; T < 40; T *= 1.37)
        for (double hh = 0.37; hh < 9000; hh *= 2.9) {
            double om = 2 * PI / T;
            sy_wave_roots r = {.k = kk};
            cases++;
            if (sy_waves_wavenumber(om, hh, G, &k, NULL) != SY_OK ||
                sy_waves_roots_fill(&r, om, hh, G, 10, NULL) != SY_OK) {
                failed++;
                continue;
            }
            worst = fmax(worst, resid0(om, k, hh));
            for (int m = 0; m < 10; m++) {
                if (!(creal(kk[m]) * hh > (m + 0.5) * PI && creal(kk[m]) * hh < (m + 1) * PI))
                    outside++;
                /* Condition of the relation: rounding k_m to double (|dx| <= eps x / 2,
                 * x = k_m h) alone moves x tan x by |tan x + x sec^2 x| eps x / 2, which
                 * exceeds 1e-12 y for long waves (small y) at higher m. The bound is the
                 * larger of 1e-12 and 4 times that rounding limit. */
                double xm = creal(kk[m]) * hh, y = om * om * hh / G, tx = tan(xm);
                double limit =
                    fmax(1e-12, 4 * DBL_EPSILON * fabs(tx + xm * (1 + tx * tx)) * xm / y);
                worst_m = fmax(worst_m, residm(om, kk[m], hh) / limit);
            }
        }
    sy_check_true(failed == 0, "all %d (T, h) cases solved, T 1.3..40 s, h 0.37..9000 m", cases);
    sy_check_true(outside == 0, "every k_m h in ((m - 1/2) pi, m pi), m <= 10 (%d outside)",
                  outside);
    sy_check_close(worst, 0, 0, 1e-14, "worst propagating residual (relative) over T, h grid");
    sy_check_close(worst_m, 0, 0, 1.0,
                   "worst evanescent residual m <= 10 / max(1e-12, rounding limit)");
    /* Bad input. */
    sy_error err = SY_ERROR_INIT;
    sy_check_fails(sy_waves_wavenumber(-1.0, 10, G, &k, &err), SY_EINVAL, &err,
                   "omega must be finite and > 0 rad/s, got -1", "omega < 0");
    sy_check_fails(sy_waves_wavenumber(1.0, 0.0, G, &k, &err), SY_EINVAL, &err,
                   "depth h must be > 0", "h = 0");
    sy_check_fails(sy_waves_wavenumber(1.0, 10, NAN, &k, &err), SY_EINVAL, &err, "gravity",
                   "g NaN");
    sy_wave_roots r = {.k = kk};
    sy_check_fails(sy_waves_roots_fill(&r, 1.0, INFINITY, G, 2, &err), SY_EINVAL, &err,
                   "need a finite depth", "evanescent roots in deep water");
    sy_check_fails(sy_waves_roots_fill(&r, -0.5 - 0.1 * I, 10, G, 0, &err), SY_EINVAL, &err,
                   "Re(omega) > 0 rad/s, got -0.5-0.1i", "complex omega with Re < 0");
    sy_check_ok(sy_waves_roots_fill(&r, 1.0 - 0.1 * I, INFINITY, G, 0, &err), &err,
                "deep complex k0");
    sy_check_cclose(r.k0, (1.0 - 0.1 * I) * (1.0 - 0.1 * I) / G, 4 * DBL_EPSILON, 0,
                    "deep complex k0 = omega^2/g");
}

/* Runs ref_roots.py and compares. */
static void against_mpmath(double wr, double wi, double h, const char *ms, double rtol)
{
    char cmd[512];
    const char *py = getenv("SY_PYTHON");
    const char *src = getenv("SY_SOURCE_DIR");
    snprintf(cmd, sizeof cmd, "%s %s%sref_roots.py %.17g %.17g %.17g %.17g %s",
             py ? py : "/usr/bin/python3", src ? src : "", src ? "/tests/waves/" : "", wr, wi, h, G,
             ms);
    FILE *p = popen(cmd, "r");
    if (!sy_check_true(p != NULL, "run %s", cmd))
        return;
    int m, n = 0;
    double re, im;
    double complex kk[1000];
    sy_wave_roots r = {.k = kk};
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(sy_waves_roots_fill(&r, wr + I * wi, h, G, 1000, &err), &err,
                "roots_fill 1000 roots");
    while (fscanf(p, "%d %lf %lf", &m, &re, &im) == 3) {
        double complex got = m == 0 ? r.k0 : kk[m - 1];
        sy_check_cclose(
            got, re + I * im, rtol, 0,
            "k_%d at omega = %g%+gi, h = %g vs mpmath 1.2 40-digit continuation (ref_roots.py)", m,
            wr, wi, h);
        n++;
    }
    sy_check_true(pclose(p) == 0 && n > 0, "ref_roots.py ran and printed %d roots", n);
}

static void complex_roots(void)
{
    sy_error err = SY_ERROR_INIT;
    const double h = 20;
    /* Real path == complex continuation path on the real axis (Newton polishing a root
     * already at rounding level may move it by an ulp or two). */
    double complex kr[8];
    sy_wave_roots r = {.k = kr};
    for (double T = 3.1; T < 30; T *= 1.7) {
        double w = 2 * PI / T;
        sy_check_ok(sy_waves_roots_fill(&r, w, h, G, 8, &err), &err, "real roots T %g", T);
        double complex kc;
        sy_check_ok(syi_waves_root_continue(0, w, h, G, &kc, &err), &err, "complex path k0");
        sy_check_cclose(kc, r.k0, 4 * DBL_EPSILON, 0, "k0 complex path = real path on axis, T %g",
                        T);
        for (size_t m = 1; m <= 8; m++) {
            sy_check_ok(syi_waves_root_continue(m, w, h, G, &kc, &err), &err, "complex path k_m");
            sy_check_cclose(kc, kr[m - 1], 4 * DBL_EPSILON, 0,
                            "k_%zu complex path = real path, T %g", m, T);
        }
    }
    /* Complex omega: residuals, conjugate symmetry k(conj w) = conj k(w) (the relation has
     * real coefficients), analyticity (Cauchy-Riemann by central differences, step 1e-4:
     * O(1e-8) truncation, O(1e-12) rounding relative). */
    double complex ka[8], kb[8];
    sy_wave_roots a = {.k = ka}, b = {.k = kb};
    const double complex ws[] = {0.78 - 0.2 * I, 0.4 - 0.35 * I, 2.3 - 0.9 * I, 0.13 - 0.1 * I,
                                 1.1 + 0.3 * I};
    for (size_t i = 0; i < sizeof ws / sizeof ws[0]; i++) {
        double complex w = ws[i];
        sy_check_ok(sy_waves_roots_fill(&a, w, h, G, 8, &err), &err, "complex roots");
        sy_check_ok(sy_waves_roots_fill(&b, conj(w), h, G, 8, &err), &err, "conjugate roots");
        sy_check_close(resid0(w, a.k0, h), 0, 0, 1e-12, "k0 residual at omega %g%+gi", creal(w),
                       cimag(w));
        sy_check_cclose(b.k0, conj(a.k0), 4 * DBL_EPSILON, 0, "k0(conj w) = conj k0(w)");
        for (int m = 0; m < 8; m++) {
            sy_check_close(residm(w, ka[m], h), 0, 0, 1e-12, "k_%d residual at omega %g%+gi", m + 1,
                           creal(w), cimag(w));
            sy_check_cclose(kb[m], conj(ka[m]), 4 * DBL_EPSILON, 0, "k_%d(conj w) = conj k_%d(w)",
                            m + 1, m + 1);
        }
        double d = 1e-4;
        double complex kp, km, kip, kim;
        syi_waves_root_continue(0, w + d, h, G, &kp, NULL);
        syi_waves_root_continue(0, w - d, h, G, &km, NULL);
        syi_waves_root_continue(0, w + I * d, h, G, &kip, NULL);
        syi_waves_root_continue(0, w - I * d, h, G, &kim, NULL);
        double complex dr = (kp - km) / (2 * d), di = (kip - kim) / (2 * I * d);
        sy_check_cclose(di, dr, 1e-6, 0, "k0 analytic at %g%+gi (Cauchy-Riemann)", creal(w),
                        cimag(w));
    }
    /* Continuity along a path into the lower half plane, omega = 0.9 - i s: each step of
     * every root stays within 3 |dk/domega| ds (dk/domega from implicit differentiation of
     * omega^2 = g k tanh kh: 2 omega = g (tanh kh + kh sech^2 kh) dk/domega), i.e. no jump
     * to another branch; and the evanescent roots keep their order in Re(k). */
    double complex prev0 = 0, prev[8] = {0};
    double ds = 0.005;
    int jumps = 0, order = 0;
    for (int j = 0; j <= 160; j++) {
        double complex w = 0.9 - I * (j * ds);
        sy_check_ok(sy_waves_roots_fill(&a, w, h, G, 8, &err), &err, "path root");
        double complex x = a.k0 * h, t = ctanh(x);
        double complex dk = 2 * w / (G * (t + x * (1 - t * t)));
        if (j > 0 && cabs(a.k0 - prev0) > 3 * cabs(dk) * ds)
            jumps++;
        for (int m = 0; m < 8; m++) {
            double complex xm = ka[m] * h, tm = ctan(xm);
            double complex dkm = -2 * w / (G * (tm + xm * (1 + tm * tm)));
            if (j > 0 && cabs(ka[m] - prev[m]) > 3 * cabs(dkm) * ds)
                jumps++;
            if (m > 0 && !(creal(ka[m]) > creal(ka[m - 1])))
                order++;
            prev[m] = ka[m];
        }
        prev0 = a.k0;
    }
    sy_check_true(jumps == 0, "roots continuous along omega = 0.9 - i s, s in [0, 0.8] (%d jumps)",
                  jumps);
    sy_check_true(order == 0, "evanescent roots keep their order along the path (%d swaps)", order);
    /* Sweep of the documented domain |Im omega| <= 0.8 Re omega: omega 0.03..20 rad/s,
     * h 0.5..5000 m, 100 evanescent roots; every root found, each residual within
     * max(1e-12, 8 x the rounding limit of k in double: eps |x| |d(x tanh x)/dx| / |Y|,
     * Y = omega^2 h / g), conjugate symmetry exact to 4 ulps. */
    static double complex kc[100], kd[100];
    sy_wave_roots c = {.k = kc}, dd = {.k = kd};
    int cases = 0, lost = 0, bad = 0, asym = 0;
    for (double wr = 0.03; wr < 20; wr *= 1.5)
        for (double q = -0.8; q < 0.81; q += 0.2)
            for (double hh = 0.5; hh < 5000; hh *= 3) {
                double complex w = wr + I * (q * wr), Y = w * w * hh / G;
                cases++;
                if (sy_waves_roots_fill(&c, w, hh, G, 100, NULL) != SY_OK ||
                    sy_waves_roots_fill(&dd, conj(w), hh, G, 100, NULL) != SY_OK) {
                    lost++;
                    continue;
                }
                for (int m = 0; m <= 100; m++) {
                    double complex km = m == 0 ? c.k0 : kc[m - 1], x = km * hh;
                    double complex tx = m == 0 ? ctanh(x) : ctan(x);
                    double complex dfx = m == 0 ? tx + x * (1 - tx * tx) : tx + x * (1 + tx * tx);
                    double limit = fmax(1e-12, 8 * DBL_EPSILON * cabs(x) * cabs(dfx) / cabs(Y));
                    if ((m == 0 ? resid0(w, km, hh) : residm(w, km, hh)) > limit)
                        bad++;
                    double complex kb = m == 0 ? dd.k0 : kd[m - 1];
                    if (cabs(kb - conj(km)) > 4 * DBL_EPSILON * cabs(km))
                        asym++;
                }
            }
    sy_check_true(lost == 0, "sweep |Im w| <= 0.8 Re w: all %d cases continued (%d lost)", cases,
                  lost);
    sy_check_true(bad == 0, "sweep: residuals within max(1e-12, rounding limit) (%d not)", bad);
    sy_check_true(asym == 0, "sweep: k(conj w) = conj k(w) (%d not)", asym);
    /* Independent continuation (mpmath, 40 digits) including high orders where the
     * asymptotic start matters; 1e-13 relative = a few hundred ulps of cancellation slack
     * in k_m = (m pi - t)/h. */
    against_mpmath(0.7853981633974483, 0.0, 20, "0 1 2 3 10 100 1000", 2 * DBL_EPSILON);
    against_mpmath(0.7853981633974483, -0.2, 20, "0 1 2 3 10 100 1000", 1e-13);
    against_mpmath(3.1, -1.7, 7.5, "0 1 2 5 50 999", 1e-13);
}

int main(void)
{
    sy_init();
    table_values();
    limits_and_residuals();
    complex_roots();
    return sy_check_summary();
}
