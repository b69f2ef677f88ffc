/* The float solver at complex omega (analytic continuation through the same code):
 *  - on the real axis the complex path (omega + 1e-13 i: roots continued, Arb / Hankel /
 *    quadrature Bessel functions) equals the real path (GSL) to 1e-12 relative, for the
 *    impedance B - i omega A, D, R and G;
 *  - Cauchy-Riemann: d/d omega of the heave and surge impedances, of a force
 *    characteristic and of a diffraction coefficient at a complex point, by central
 *    differences along Re omega and along Im omega, agree (step 1e-4: difference error
 *    O(delta^2) ~ 1e-8 relative; assert 1e-6). A non-analytic step anywhere (conj, modulus,
 *    a branch cut) breaks this. */
#include <complex.h>
#include <math.h>
#include <stdio.h>
#include "check.h"
#include "float_testlib.h"

#define M_ORD 2
#define Q_DEP 3

typedef struct { double complex z[4]; double complex d[Q_DEP * Q_DEP * (M_ORD + 1)];
                 double complex r[5 * Q_DEP * (2 * M_ORD + 1)], g[5 * Q_DEP * (2 * M_ORD + 1)]; } snap;

static int take(tl_float *t, double complex om, snap *s, sy_error *err)
{
    int rc = tl_float_solve(t, om, err);
    if (rc != SY_OK)
        return rc;
    s->z[0] = tl_impedance(t->out, 2, 2);
    s->z[1] = tl_impedance(t->out, 0, 0);
    s->z[2] = tl_impedance(t->out, 0, 4);
    s->z[3] = tl_impedance(t->out, 4, 4);
    for (size_t i = 0; i < sizeof s->d / sizeof s->d[0]; i++)
        s->d[i] = t->out->diffraction[i];
    for (size_t i = 0; i < sizeof s->r / sizeof s->r[0]; i++) {
        s->r[i] = t->out->radiation[i];
        s->g[i] = t->out->force[i];
    }
    return SY_OK;
}

static double maxabs(const double complex *v, size_t n)
{
    double m = 0.0;
    for (size_t i = 0; i < n; i++)
        m = fmax(m, cabs(v[i]));
    return m;
}

static void compare(const double complex *a, const double complex *b, size_t n, double rtol,
                    const char *what)
{
    double m = maxabs(b, n), worst = 0.0;
    for (size_t i = 0; i < n; i++)
        worst = fmax(worst, cabs(a[i] - b[i]));
    sy_check_close(worst, 0.0, 0.0, rtol * m, "%s: max difference %.2e relative to max %.3g", what,
                   m > 0 ? worst / m : worst, m);
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    tl_float t;
    if (!sy_check_ok(tl_float_open(&t, 5.0, 4.0, 20.0, -0.7, 1e-8, M_ORD, Q_DEP, &err), &err, "open"))
        return sy_check_summary();
    static snap re, cx;
    const double w0 = 0.93;
    if (sy_check_ok(take(&t, w0, &re, &err), &err, "real path") &&
        sy_check_ok(take(&t, w0 + 1e-13 * I, &cx, &err), &err, "complex path")) {
        /* 1e-13 i moves every value by ~1e-13 relative times its log-derivative (< 10) */
        for (int i = 0; i < 4; i++)
            sy_check_cclose(cx.z[i], re.z[i], 1e-12, 0.0, "impedance %d: complex path = real path", i);
        compare(cx.d, re.d, sizeof re.d / sizeof re.d[0], 1e-12, "D complex = real");
        compare(cx.r, re.r, sizeof re.r / sizeof re.r[0], 1e-12, "R complex = real");
        compare(cx.g, re.g, sizeof re.g / sizeof re.g[0], 1e-12, "G complex = real");
    }
    /* Cauchy-Riemann at complex points (decaying motions have Im omega < 0) */
    const double complex pts[] = {0.8 - 0.1 * I, 1.6 - 0.25 * I, 0.5 + 0.05 * I};
    const double dl = 1e-4;
    static snap sp, sm, sip, sim;
    for (size_t k = 0; k < 3; k++) {
        double complex w = pts[k];
        if (!sy_check_ok(take(&t, w + dl, &sp, &err), &err, "solve") ||
            !sy_check_ok(take(&t, w - dl, &sm, &err), &err, "solve") ||
            !sy_check_ok(take(&t, w + I * dl, &sip, &err), &err, "solve") ||
            !sy_check_ok(take(&t, w - I * dl, &sim, &err), &err, "solve"))
            continue;
        printf("omega = %g%+gi: convergence %.2e\n", creal(w), cimag(w), t.out->convergence);
        const char *names[4] = {"Z33", "Z11", "Z15", "Z55"};
        for (int i = 0; i < 4; i++) {
            double complex dre = (sp.z[i] - sm.z[i]) / (2 * dl);
            double complex dim = (sip.z[i] - sim.z[i]) / (2 * I * dl);
            sy_check_cclose(dim, dre, 1e-6, 0.0, "Cauchy-Riemann d%s/domega at %g%+gi", names[i],
                            creal(w), cimag(w));
        }
        size_t nn = 2 * M_ORD + 1;
        size_t ig = (2 * Q_DEP + 0) * nn + M_ORD;      /* G_3(0, 0): heave force */
        double complex gre = (sp.g[ig] - sm.g[ig]) / (2 * dl), gim = (sip.g[ig] - sim.g[ig]) / (2 * I * dl);
        sy_check_cclose(gim, gre, 1e-6, 0.0, "Cauchy-Riemann dG_3(0,0)/domega");
        size_t id = (1 * Q_DEP + 0) * Q_DEP + 1;       /* D_1(0, 1): propagating <- evanescent */
        double complex dre = (sp.d[id] - sm.d[id]) / (2 * dl), dim = (sip.d[id] - sim.d[id]) / (2 * I * dl);
        sy_check_cclose(dim, dre, 1e-6, 0.0, "Cauchy-Riemann dD_1(0,1)/domega");
    }
    tl_float_close(&t);
    return sy_check_summary();
}
