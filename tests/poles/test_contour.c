/* The contour-integral eigenvalue solver (Beyn 2012, higher-moment form) on problems with
 * known eigenvalues: a damped oscillator (roots of a quadratic, textbook), an undamped
 * one (pole sqrt(C/M) on the real axis), a scalar cubic (more eigenvalues than the
 * matrix size: needs the higher moments), and a symmetric 2 x 2 pair whose eigenvalues
 * are those of its decoupled symmetric/antisymmetric combinations (group-theory
 * reduction of a symmetric system). Also: the argument-principle count equals the
 * number found, and no eigenvalue is reported twice. */
#include "check.h"
#include "poles/poles_impl.h"

#include <math.h>
#include <string.h>

/* T(w) = K - w^2 M - i w B for small dense symmetric M, B, K (n <= 4). */
typedef struct lin {
    size_t n;
    double m[16], b[16], k[16];
    double complex cubic[3]; /* if n == 0: scalar (w - c0)(w - c1)(w - c2) */
} lin;

static int solve(void *ctx, double complex w, size_t nrhs, const double complex *rhs, double complex *x,
                 double complex *logdet, double complex *logpole, sy_error *err)
{
    if (logpole != NULL) /* T has no poles here */
        *logpole = 0;
    const lin *p = ctx;
    if (p->n == 0) {
        double complex t = (w - p->cubic[0]) * (w - p->cubic[1]) * (w - p->cubic[2]);
        if (t == 0)
            return sy_error_set(err, SY_ESINGULAR, "exact eigenvalue");
        for (size_t j = 0; j < nrhs; j++)
            x[j] = rhs[j] / t;
        if (logdet)
            *logdet = clog(t);
        return SY_OK;
    }
    size_t n = p->n;
    double complex a[16], r[16 * 8];
    for (size_t i = 0; i < n * n; i++)
        a[i] = p->k[i] - w * w * p->m[i] - I * w * p->b[i];
    memcpy(r, rhs, n * nrhs * sizeof *r);
    /* Gaussian elimination with partial pivoting (column-major rhs). */
    double complex det = 1;
    for (size_t c = 0; c < n; c++) {
        size_t piv = c;
        for (size_t i = c + 1; i < n; i++)
            if (cabs(a[i * n + c]) > cabs(a[piv * n + c]))
                piv = i;
        if (a[piv * n + c] == 0)
            return sy_error_set(err, SY_ESINGULAR, "exact eigenvalue");
        if (piv != c) {
            det = -det;
            for (size_t j = 0; j < n; j++) {
                double complex t = a[c * n + j];
                a[c * n + j] = a[piv * n + j], a[piv * n + j] = t;
            }
            for (size_t j = 0; j < nrhs; j++) {
                double complex t = r[j * n + c];
                r[j * n + c] = r[j * n + piv], r[j * n + piv] = t;
            }
        }
        det *= a[c * n + c];
        for (size_t i = c + 1; i < n; i++) {
            double complex f = a[i * n + c] / a[c * n + c];
            for (size_t j = c; j < n; j++)
                a[i * n + j] -= f * a[c * n + j];
            for (size_t j = 0; j < nrhs; j++)
                r[j * n + i] -= f * r[j * n + c];
        }
    }
    for (size_t j = 0; j < nrhs; j++)
        for (size_t i = n; i-- > 0;) {
            double complex s = r[j * n + i];
            for (size_t q = i + 1; q < n; q++)
                s -= a[i * n + q] * x[j * n + q];
            x[j * n + i] = s / a[i * n + i];
        }
    if (logdet)
        *logdet = clog(det);
    return SY_OK;
}

static const syi_nep_settings settings = {64, 1, 4, 1e-9, 1e-13, 7, 0, NULL, NULL};

static size_t run(lin *p, syi_ellipse c, syi_nep_eig *eig, double complex *vs, syi_nep_result *res,
                  size_t n_cols)
{
    syi_nep nep = {p->n ? p->n : 1, solve, p, 1.0};
    syi_nep_settings s = settings;
    s.n_columns = n_cols;
    for (int i = 0; i < 8; i++)
        eig[i].v = vs + 4 * i;
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(syi_nep_contour(&nep, &c, &s, eig, 8, res, &err), &err, "contour solve");
    return res->n_found;
}

int main(void)
{
    sy_init();
    syi_nep_eig eig[8];
    double complex vs[32];
    syi_nep_result res;

    /* Damped oscillator: M w^2 + i B w - C = 0 -> w = (+-sqrt(4 M C - B^2) - i B) / (2 M). */
    lin osc = {1, {3.2e5}, {4.1e4}, {7.9e5}, {0}};
    double mm = 3.2e5, bb = 4.1e4, cc = 7.9e5;
    double complex want = (sqrt(4 * mm * cc - bb * bb) - I * bb) / (2 * mm);
    syi_ellipse box = {1.4 - 0.15 * I, 0.6, 0.15};
    if (sy_check_true(run(&osc, box, eig, vs, &res, 1) == 1, "oscillator: one pole found")) {
        /* Both sides are double-precision roots of the same quadratic. */
        sy_check_cclose(eig[0].omega, want, 1e-12, 0, "oscillator pole = quadratic root (textbook)");
        sy_check_true(res.count == 1, "oscillator: argument-principle count 1 (got %d)", res.count);
    }
    /* Undamped: the pole is real, sqrt(C/M); contour straddles the real axis. */
    lin und = {1, {3.2e5}, {0}, {7.9e5}, {0}};
    syi_ellipse around = {1.5 + 0.01 * I, 0.5, 0.2};
    if (sy_check_true(run(&und, around, eig, vs, &res, 1) == 1, "undamped: one pole")) {
        sy_check_cclose(eig[0].omega, sqrt(7.9e5 / 3.2e5), 1e-13, 1e-15, "undamped pole sqrt(C/M) (textbook)");
        sy_check_close(fabs(cimag(eig[0].omega)), 0, 0, 1e-13, "undamped pole is real");
    }
    /* Scalar cubic: three eigenvalues from a 1 x 1 problem need the higher moments. */
    lin cub = {0, {0}, {0}, {0}, {1.1 - 0.05 * I, 1.3 - 0.2 * I, 0.9 - 0.31 * I}};
    syi_ellipse reg = {1.1 - 0.2 * I, 0.5, 0.25};
    size_t nf = run(&cub, reg, eig, vs, &res, 1);
    sy_check_true(nf == 3 && res.count == 3, "cubic: 3 found, count %d", res.count);
    for (size_t r = 0; r < 3; r++) {
        double best = INFINITY;
        for (size_t i = 0; i < nf; i++)
            best = fmin(best, cabs(eig[i].omega - cub.cubic[r]));
        sy_check_close(best, 0, 0, 1e-12, "cubic root %zu found", r);
    }
    /* Two identical coupled oscillators (symmetric pair): eigenvalues are those of the
     * decoupled scalar problems with M11 +- M12, B11 +- B12, K11 +- K12. */
    lin two = {2, {3.0e5, 0.4e5, 0.4e5, 3.0e5}, {3e4, 1.2e4, 1.2e4, 3e4}, {7.9e5, 0, 0, 7.9e5}, {0}};
    syi_ellipse reg2 = {1.5 - 0.1 * I, 0.5, 0.12};
    nf = run(&two, reg2, eig, vs, &res, 2);
    sy_check_true(nf == 2 && res.count == 2, "pair: two poles, count %d", res.count);
    for (int sgn = -1; sgn <= 1; sgn += 2) {
        double m = 3.0e5 + sgn * 0.4e5, b = 3e4 + sgn * 1.2e4, k = 7.9e5;
        double complex w = (sqrt(4 * m * k - b * b) - I * b) / (2 * m);
        double best = INFINITY;
        size_t at = 0;
        for (size_t i = 0; i < nf; i++)
            if (cabs(eig[i].omega - w) < best)
                best = cabs(eig[i].omega - w), at = i;
        sy_check_close(best / cabs(w), 0, 0, 1e-10, "pair: %s pole matches decoupled problem",
                       sgn > 0 ? "symmetric" : "antisymmetric");
        sy_check_cclose(eig[at].v[1] / eig[at].v[0], sgn, 1e-8, 0, "pair: %s mode shape (1, %+d)",
                        sgn > 0 ? "symmetric" : "antisymmetric", sgn);
    }
    return sy_check_summary();
}
