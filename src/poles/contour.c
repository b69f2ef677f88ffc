/* Beyn's contour-integral method with higher moments, argument-principle count and
 * secant polishing (poles_impl.h). Matrices column-major (LAPACK_COL_MAJOR). */
#include <complex.h>
#include "poles_impl.h"

#include <lapacke.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#define POLISH_MAX_ITER 16
#define DEDUP_REL 1e-7   /* two polished eigenvalues closer than this (relative) are one */
#define INSIDE_MARGIN 1e-9
#define NOTHING_INSIDE 1e-9 /* moments this small relative to |T^-1 V| r: no eigenvalue inside */

int syi_ellipse_inside(const syi_ellipse *c, double complex w, double m)
{
    double x = creal(w - c->centre) / c->ax, y = cimag(w - c->centre) / c->ay;
    return x * x + y * y < (1.0 - m) * (1.0 - m);
}

/* Deterministic complex probing entries in [-1, 1]^2 (xorshift64*). */
static double complex rnd(unsigned long long *s)
{
    double part[2];
    for (int i = 0; i < 2; i++) {
        *s ^= *s >> 12, *s ^= *s << 25, *s ^= *s >> 27;
        part[i] = 2.0 * (double)((*s * 2685821657736338717ULL) >> 11) / 9007199254740992.0 - 1.0;
    }
    return part[0] + I * part[1];
}

static double vnorm(const double complex *v, size_t n)
{
    double s = 0;
    for (size_t i = 0; i < n; i++)
        s += creal(v[i] * conj(v[i]));
    return sqrt(s);
}

/* Secant on g(w) = 1 / (v^T T(w)^-1 v); v updated by inverse iteration at the end. */
static int polish(const syi_nep *p, const syi_nep_settings *st, double complex w0, double complex *v,
                  double complex *x, syi_nep_eig *out, size_t *evals, sy_error *err)
{
    size_t n = p->n;
    double complex wprev = w0 * (1.0 + 1e-7) + 1e-9, w = w0, gprev = 0, g = 0, wbest = w0;
    double last_step = INFINITY, gbest = INFINITY;
    int rc = SY_OK, conv = 0;
    for (int it = 0; it < POLISH_MAX_ITER && !conv; it++) {
        for (int pass = (it == 0 ? 0 : 1); pass < 2; pass++) {
            double complex at = pass == 0 ? wprev : w;
            rc = p->solve(p->ctx, at, 1, v, x, NULL, err);
            (*evals)++;
            if (rc == SY_ESINGULAR) { /* exactly at the eigenvalue */
                w = at, conv = 1, rc = SY_OK;
                break;
            }
            if (rc != SY_OK)
                return rc;
            double complex s = 0;
            for (size_t i = 0; i < n; i++)
                s += v[i] * x[i];
            double complex gv = 1.0 / s;
            if (pass == 0)
                gprev = gv;
            else
                g = gv;
            if (cabs(gv) < gbest) /* |g| ~ distance to the eigenvalue: keep the closest point */
                gbest = cabs(gv), wbest = at;
        }
        if (conv)
            break;
        double complex step = g * (w - wprev) / (g - gprev);
        if (!isfinite(creal(step)) || !isfinite(cimag(step)))
            break;
        /* v stays fixed: g is then one analytic function with a simple zero at the
         * eigenvalue, which the secant needs (v is refined once, at the end). */
        /* Past the first steps a secant on an analytic function shrinks its step
         * superlinearly; a step that stops shrinking means T's own noise (truncation that
         * varies with omega) has been reached: stop there, not polished. */
        if (it >= 3 && cabs(step) > 0.5 * last_step) {
            w = wbest;
            break;
        }
        last_step = cabs(step);
        wprev = w, gprev = g;
        w -= step;
        conv = cabs(step) <= st->polish_tol * cabs(w);
    }
    /* Final eigenvector and residual at w: x = T^-1 v, residual |v| / |x| / scale. */
    rc = p->solve(p->ctx, w, 1, v, x, NULL, err);
    (*evals)++;
    double res = 0;
    if (rc == SY_OK) {
        double nx = vnorm(x, n), nv = vnorm(v, n);
        res = nv / nx / p->scale;
        for (size_t i = 0; i < n; i++)
            v[i] = x[i];
    } else if (rc == SY_ESINGULAR) {
        rc = SY_OK;
    } else {
        return rc;
    }
    size_t imax = 0;
    for (size_t i = 1; i < n; i++)
        if (cabs(v[i]) > cabs(v[imax]))
            imax = i;
    double complex vm = v[imax];
    for (size_t i = 0; i < n; i++)
        out->v[i] = v[i] / vm;
    out->omega = w;
    out->residual = res;
    out->converged = conv;
    return SY_OK;
}

int syi_nep_contour(const syi_nep *p, const syi_ellipse *c, const syi_nep_settings *st, syi_nep_eig *eig,
                    size_t max_eig, syi_nep_result *res, sy_error *err)
{
    size_t n = p->n, l = st->n_columns, K = st->n_moments, N = st->n_points, np = 2 * K;
    if (l == 0 || l > n || K == 0 || N < 8)
        return sy_error_set(err, SY_EINVAL, "contour: columns %zu (1..%zu), moments %zu, points %zu (>= 8)", l, n, K, N);
    size_t kn = K * n, kl = K * l;
    double complex *V = malloc(n * l * sizeof *V), *X = malloc(n * l * sizeof *X);
    double complex *A = calloc(np * n * l, sizeof *A);           /* A_p, p = 0..2K-1, each n x l col-major */
    double complex *H0 = malloc(kn * kl * sizeof *H0), *H1 = malloc(kn * kl * sizeof *H1);
    double complex *U = malloc(kn * kl * sizeof *U), *Wt = malloc(kl * kl * sizeof *Wt);
    double *sv = malloc(kl * sizeof *sv), *superb = malloc(kl * sizeof *superb);
    double complex *D = malloc(kl * kl * sizeof *D), *T1 = malloc(kn * kl * sizeof *T1);
    double complex *lam = malloc(kl * sizeof *lam), *S = malloc(kl * kl * sizeof *S);
    double complex *vv = malloc(n * sizeof *vv), *xx = malloc(n * sizeof *xx);
    int rc = SY_OK;
    memset(res, 0, sizeof *res);
    if (!V || !X || !A || !H0 || !H1 || !U || !Wt || !sv || !superb || !D || !T1 || !lam || !S || !vv || !xx) {
        rc = sy_error_set(err, SY_ENOMEM, "contour integrals for n = %zu", n);
        goto done;
    }
    unsigned long long seed = st->seed ? st->seed : 0x9E3779B97F4A7C15ULL;
    for (size_t i = 0; i < n * l; i++)
        V[i] = rnd(&seed);
    /* Trapezoid rule: (1/2 pi i) oint f dz = (1/(i N)) sum f(z_j) z'(t_j). */
    double phase = 0, prev = 0, first = 0, xmax = 0;
    for (size_t j = 0; j < N && rc == SY_OK; j++) {
        double t = 2 * M_PI * (double)j / (double)N;
        double complex z = c->centre + c->ax * cos(t) + I * c->ay * sin(t);
        double complex dz = -c->ax * sin(t) + I * c->ay * cos(t), ld;
        rc = p->solve(p->ctx, z, l, V, X, &ld, err);
        res->evaluations++;
        if (rc != SY_OK) {
            sy_error_prefix(err, "contour point omega = %g%+gi rad/s", creal(z), cimag(z));
            break;
        }
        /* Unwrapped phase of det T for the winding number. */
        double ph = cimag(ld);
        if (j == 0) {
            first = ph;
        } else {
            double d = ph - prev;
            d -= 2 * M_PI * round(d / (2 * M_PI));
            phase += d;
        }
        prev = ph;
        xmax = fmax(xmax, vnorm(X, n * l));
        double complex w = dz / (I * (double)N), zp = 1;
        for (size_t q = 0; q < np; q++, zp *= z)
            for (size_t i = 0; i < n * l; i++)
                A[q * n * l + i] += zp * w * X[i];
    }
    if (rc != SY_OK)
        goto done;
    {
        double d = first - prev; /* close the loop */
        d -= 2 * M_PI * round(d / (2 * M_PI));
        phase += d;
        res->count = (int)lround(phase / (2 * M_PI));
    }
    /* Block Hankel matrices (column-major kn x kl): block (a, b) = A_{a+b} (H0), A_{a+b+1} (H1). */
    for (size_t a = 0; a < K; a++)
        for (size_t b = 0; b < K; b++)
            for (size_t jj = 0; jj < l; jj++)
                for (size_t i = 0; i < n; i++) {
                    size_t at = (b * l + jj) * kn + a * n + i;
                    H0[at] = A[(a + b) * n * l + jj * n + i];
                    H1[at] = A[(a + b + 1) * n * l + jj * n + i];
                }
    memcpy(T1, H0, kn * kl * sizeof *T1);
    lapack_int info = LAPACKE_zgesvd(LAPACK_COL_MAJOR, 'S', 'S', (lapack_int)kn, (lapack_int)kl, T1, (lapack_int)kn, sv,
                                     U, (lapack_int)kn, Wt, (lapack_int)kl, superb);
    if (info != 0) {
        rc = sy_error_set(err, SY_ENOCONV, "contour: SVD failed (%d)", (int)info);
        goto done;
    }
    /* No eigenvalue inside: the moments are quadrature noise, far below the size
     * |T^-1 V| r they have when a pole contributes a residue. */
    size_t k = 0;
    if (sv[0] > NOTHING_INSIDE * xmax * fmax(c->ax, c->ay))
        while (k < kl && sv[k] > st->rank_tol * sv[0])
            k++;
    /* The argument principle is robust to small non-analytic noise in T (truncation that
     * changes with omega), the singular values are not: where the count is positive and
     * within capacity it decides the rank. */
    if (res->count > 0 && (size_t)res->count < k)
        k = (size_t)res->count;
    if (k == 0)
        goto done; /* nothing inside */
    if (k == kl) {
        rc = sy_error_set(err, SY_ENOCONV,
                          "contour: %zu eigenvalues may exceed the capacity %zu (columns x moments; "
                          "argument-principle count %d); raise them or split the region",
                          k, kl, res->count);
        goto done;
    }
    /* D = U0^H H1 W0 Sigma0^-1 (k x k); W0 = Wt^H first k columns. */
    for (size_t a = 0; a < k; a++)
        for (size_t b = 0; b < k; b++) {
            double complex s = 0;
            for (size_t r = 0; r < kn; r++) {
                double complex hw = 0;
                for (size_t q = 0; q < kl; q++)
                    hw += H1[q * kn + r] * conj(Wt[q * kl + b]);
                s += conj(U[a * kn + r]) * hw;
            }
            D[b * k + a] = s / sv[b];
        }
    info = LAPACKE_zgeev(LAPACK_COL_MAJOR, 'N', 'V', (lapack_int)k, D, (lapack_int)k, lam, NULL, 1, S, (lapack_int)k);
    if (info != 0) {
        rc = sy_error_set(err, SY_ENOCONV, "contour: small eigenproblem failed (%d)", (int)info);
        goto done;
    }
    for (size_t e = 0; e < k && rc == SY_OK; e++) {
        if (!syi_ellipse_inside(c, lam[e], -0.05)) /* spurious (outside): skip; 5 % slack before polishing */
            continue;
        /* Eigenvector: first n rows of U0 s. */
        for (size_t i = 0; i < n; i++) {
            double complex s = 0;
            for (size_t a = 0; a < k; a++)
                s += U[a * kn + i] * S[e * k + a];
            vv[i] = s;
        }
        double nv = vnorm(vv, n);
        for (size_t i = 0; i < n; i++)
            vv[i] /= nv;
        if (res->n_found >= max_eig) {
            rc = sy_error_set(err, SY_ENOCONV, "contour: more than %zu eigenvalues", max_eig);
            break;
        }
        syi_nep_eig *o = &eig[res->n_found];
        rc = polish(p, st, lam[e], vv, xx, o, &res->evaluations, err);
        if (rc != SY_OK)
            break;
        if (!syi_ellipse_inside(c, o->omega, INSIDE_MARGIN))
            continue;
        size_t dup = 0;
        for (size_t q = 0; q < res->n_found && !dup; q++)
            dup = cabs(eig[q].omega - o->omega) <= DEDUP_REL * cabs(o->omega);
        if (!dup)
            res->n_found++;
    }
done:
    free(V);
    free(X);
    free(A);
    free(H0);
    free(H1);
    free(U);
    free(Wt);
    free(sv);
    free(superb);
    free(D);
    free(T1);
    free(lam);
    free(S);
    free(vv);
    free(xx);
    return rc;
}
