/* Contour-integral eigenvalue solver (poles_impl.h): Beyn's method with higher moments for
 * matrix problems, Delves-Lyness power sums for determinant-only problems, both sized by
 * the argument principle with continuous phase tracking, then a secant polish.
 * Matrices column-major (LAPACK_COL_MAJOR). */
#include <complex.h>
#include "poles_impl.h"

#include <lapacke.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

#define POLISH_MAX_ITER 16
#define DEDUP_REL 1e-7      /* two polished eigenvalues closer than this (relative) are one */
#define DEDUP_LOOSE 1e-4   /* ... when one of them did not converge (noise of T reached) */
/* A polish that stalls with the residual |T v| / (|T| |v|) above this is not near an
 * eigenvalue (a stall at T's noise leaves ~1e-8): the estimate is dropped. */
#define NOT_AN_EIGENVALUE 1e-4
#define CLUSTER_REL 1e-4   /* contour estimates this close: a multiple eigenvalue, split by quadrature error */
/* Near the contour the quadrature error can split a multiple eigenvalue's estimates far
 * apart (0.1 rho seen for a double pole at normalised radius 0.93: the member whose
 * estimate is off stalls in the polish). A stalled estimate is polished again from the
 * nearest eigenvalue already found within RESCUE_REL rho (scaled variable), while the
 * argument-principle count says one is missing; it is kept only if it converges there
 * with an eigenvector independent of those found (add_candidate's test). */
#define RESCUE_REL 0.25
#define INSIDE_MARGIN 1e-9
#define NOTHING_INSIDE 1e-9 /* moments this small relative to |T^-1 V| r: no eigenvalue inside */
/* Phase tracking: a wrapped phase step above this between neighbouring points may hide a
 * whole turn; the interval is bisected (one zero subtends less than pi from a chord, so
 * pi/3 leaves room for two close zeros). */
#define MAX_PHASE_STEP (M_PI / 3)
#define REFINE_DEPTH 6      /* at most 2^6 sub-intervals per quadrature interval */
/* Moments below NOISE_FACTOR x (accuracy of T) x |T^-1 V| x sum |weights| are noise: the
 * factor covers the growth of a relative error of T in T^-1 near the eigenvalues. */
#define NOISE_FACTOR 1e3
#define NEAR_EDGE 0.9       /* normalised radius beyond which a found eigenvalue is "near the contour" */
#define MAX_DET_ZEROS 24    /* Delves-Lyness: more zeros than this: split the region */
#define DEFLATE_ROUNDS 3

int syi_ellipse_inside(const syi_ellipse *c, double complex w, double m)
{
    return syi_ellipse_radius(c, w) < 1.0 - m;
}

double syi_ellipse_radius(const syi_ellipse *c, double complex w)
{
    double x = creal(w - c->centre) / c->ax, y = cimag(w - c->centre) / c->ay;
    return sqrt(x * x + y * y);
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

static double wrap(double d)
{
    return d - 2 * M_PI * round(d / (2 * M_PI));
}

static double complex point(const syi_ellipse *c, double t)
{
    return c->centre + c->ax * cos(t) + I * c->ay * sin(t);
}

/* Per-problem state of one contour pass. */
typedef struct pstate {
    const syi_nep *p;
    size_t l, np;               /* columns, moments accumulated (2 K_max) */
    double complex *V, *X, *A;  /* probing block, solution block, moments */
    double complex *logf;       /* [N] unwrapped log det at the quadrature points */
    double ph_det, ph_pole;     /* accumulated phase change along the contour */
    double xmax;
} pstate;

typedef struct pass {
    const syi_ellipse *c;
    pstate *ps;
    size_t n_prob, refined;
    double rate[2 * SYI_NEP_MAX_PROBLEMS]; /* phase turned per unit t on the last interval */
    sy_error *err;
} pass;

/* Phase increments of every problem's det and pole function from t0 to t1 (values a at t0,
 * b at t1: [2 q] det, [2 q + 1] pole). The increment is taken relative to the trend of the
 * previous interval (det(I - D T) turns steadily and fast below the real axis: a smooth
 * turn of more than pi between points is followed without extra points); where the step
 * departs from the trend by more than MAX_PHASE_STEP the interval is bisected. */
static int track(pass *ps, double t0, const double complex *a, double t1, const double complex *b, int depth,
                 double *inc)
{
    int big = 0;
    double d[2 * SYI_NEP_MAX_PROBLEMS];
    for (size_t k = 0; k < 2 * ps->n_prob; k++) {
        double pred = ps->rate[k] * (t1 - t0);
        double dev = wrap(cimag(b[k]) - cimag(a[k]) - pred);
        d[k] = pred + dev;
        big |= fabs(dev) > MAX_PHASE_STEP;
    }
    if (!big || depth >= REFINE_DEPTH) {
        for (size_t k = 0; k < 2 * ps->n_prob; k++)
            inc[k] += d[k];
        return SY_OK;
    }
    double tm = 0.5 * (t0 + t1);
    double complex z = point(ps->c, tm), m[2 * SYI_NEP_MAX_PROBLEMS];
    for (size_t q = 0; q < ps->n_prob; q++) {
        const syi_nep *p = ps->ps[q].p;
        m[2 * q + 1] = 0;
        int rc = p->solve(p->ctx, z, 0, NULL, NULL, &m[2 * q], &m[2 * q + 1], ps->err);
        if (rc != SY_OK) {
            sy_error_prefix(ps->err, "contour point omega = %g%+gi rad/s", creal(z), cimag(z));
            return rc;
        }
    }
    ps->refined++;
    int rc = track(ps, t0, a, tm, m, depth + 1, inc);
    return rc == SY_OK ? track(ps, tm, m, t1, b, depth + 1, inc) : rc;
}

/* Polish of one eigenvalue estimate w0.
 * Matrix problems: g(w) = 1 / (v^H T(w)^-1 b), v the eigenvector estimate (|v| = 1). When
 * b = V c is the probing block combined so that the contour's residue of T^-1 V c at the
 * eigenvalue is v itself and those of the other eigenvalues vanish (beyn()), g(w) ~ w -
 * lambda near lambda (g' = 1, known without an evaluation): the first step is a Newton
 * step from one evaluation, and the secant takes over from the second. Without b (b ==
 * NULL) the secant starts from two evaluations, b = v. Determinant-only problems: secant
 * on f itself, f0 / f1 = exp(log f0 - log f1), two evaluations to start; with
 * multiplicity m > 1 on f^(1/m) (a double zero, e.g. a two-dimensional representation of a
 * symmetric layout, converges linearly on f and stalls at the square root of its noise).
 * Stop when the predicted error of the new iterate (step x the observed contraction of the
 * steps; for the first Newton step, step x RESIDUE_TRUST) is below polish_tol (a Newton
 * start that diverges falls back to the secant from the best point so far): the
 * eigenvector and residual come from the last evaluation (within one step of the pole),
 * so a pole whose contour estimate is already accurate costs one evaluation. */
#define RESIDUE_TRUST 1e-2 /* the contour's residue is taken to be accurate to 1 %% */
#define DOUBLE_RATIO_LO 0.45 /* secant on a double root: steps shrink by ~0.6 (golden ratio) */
#define DOUBLE_RATIO_HI 0.85
static int polish(const syi_nep *p, const syi_nep_settings *st, double complex w0, double complex *v,
                  const double complex *b, double complex *x, syi_nep_eig *out, size_t *evals, sy_error *err)
{
    size_t n = p->n;
    double m = 1.0;
    int reverted = 0, restarted = 0;
    const double complex *rhs = b != NULL ? b : v;
    double complex w = w0, wprev = 0, gprev = 0, wbest = w0, wnext = w0;
    double last_step = INFINITY, gbest = INFINITY, res = 0;
    int rc = SY_OK, conv = 0, have_prev = 0, have_x = 0;
    for (int it = 0; it < POLISH_MAX_ITER && !conv; it++) {
        double complex ld = 0, g;
        rc = p->solve(p->ctx, w, n ? 1 : 0, rhs, x, n ? NULL : &ld, NULL, err);
        (*evals)++;
        if (rc == SY_ESINGULAR) { /* exactly at the eigenvalue */
            sy_error_clear(err);
            rc = SY_OK, conv = 1, wnext = w;
            break;
        }
        if (rc != SY_OK)
            return rc;
        if (n > 0) {
            double complex s = 0;
            for (size_t i = 0; i < n; i++)
                s += conj(v[i]) * x[i];
            if (b == NULL) { /* v^T T^-1 v: the symmetric form for a symmetric T */
                s = 0;
                for (size_t i = 0; i < n; i++)
                    s += v[i] * x[i];
            }
            g = 1.0 / s;
            res = vnorm(rhs, n) / vnorm(x, n) / p->scale;
            have_x = 1;
        } else {
            g = ld / m; /* log f^(1/m): the secant below uses ratios */
        }
        double size = n > 0 ? log(cabs(g)) : creal(ld); /* |g| or |f|: closeness to the eigenvalue */
        if (size < gbest)
            gbest = size, wbest = w;
        double complex step;
        double predicted;
        if (!have_prev && n > 0 && b != NULL && !restarted) {
            step = g, predicted = cabs(step) * RESIDUE_TRUST;
        } else if (!have_prev) { /* second starting point */
            wprev = w, gprev = g, have_prev = 1;
            w = w * (1.0 + 1e-7) + 1e-9;
            continue;
        } else {
            step = n > 0 ? g * (w - wprev) / (g - gprev) : (w - wprev) / (1.0 - cexp(gprev - g));
            predicted = isfinite(last_step) ? cabs(step) * fmin(1.0, cabs(step) / last_step) : cabs(step);
            double ratio = cabs(step) / last_step;
            if (n == 0 && m == 1.0 && !reverted && it >= 3 && ratio > DOUBLE_RATIO_LO && ratio < DOUBLE_RATIO_HI) {
                /* linear convergence at the secant's double-root rate: go on with f^(1/2) */
                m = 2.0, g /= 2.0, gprev /= 2.0;
                step = (w - wprev) / (1.0 - cexp(gprev - g));
                predicted = cabs(step), last_step = INFINITY;
            }
        }
        if (!isfinite(creal(step)) || !isfinite(cimag(step))) {
            wnext = wbest;
            break;
        }
        /* Past the first steps a secant on an analytic function shrinks its step
         * superlinearly; a step that stops shrinking means T's own noise (truncation that
         * varies with omega) has been reached: stop there, not polished. A double root
         * guessed wrongly (the zero is simple) stalls too: start again from the best point
         * with m = 1. */
        if ((it >= 3 && cabs(step) > 0.5 * last_step) || (b != NULL && !restarted && it == 1 && cabs(step) > last_step)) {
            wnext = wbest;
            if (b != NULL && !restarted) { /* the residue's Newton step diverged: secant from the best point */
                restarted = 1, have_prev = 0, last_step = INFINITY, w = wbest;
                continue;
            }
            if (m == 1.0 || reverted)
                break;
            m = 1.0, reverted = 1, have_prev = 0, last_step = INFINITY, w = wbest;
            continue;
        }
        last_step = cabs(step);
        wprev = w, gprev = g, have_prev = 1;
        wnext = w - step;
        conv = predicted <= st->polish_tol * cabs(wnext);
        w = wnext;
    }
    out->omega = wnext;
    out->converged = conv;
    out->multiplicity = conv && m == 2.0 ? 2 : 1;
    if (n == 0) {
        out->residual = isfinite(last_step) ? last_step / cabs(wnext) : 0.0;
        return SY_OK;
    }
    /* Eigenvector from the last evaluation: x = T^-1 b, dominated by the pole term. */
    if (have_x)
        for (size_t i = 0; i < n; i++)
            v[i] = x[i];
    size_t imax = 0;
    for (size_t i = 1; i < n; i++)
        if (cabs(v[i]) > cabs(v[imax]))
            imax = i;
    double complex vm = v[imax];
    for (size_t i = 0; i < n; i++)
        out->v[i] = v[i] / vm;
    out->residual = res;
    return SY_OK;
}

/* Are two eigenvectors independent (|cos| of their angle below SAME_VECTOR)? */
#define SAME_VECTOR 0.9
static int independent(const double complex *a, const double complex *b, size_t n)
{
    double complex s = 0;
    for (size_t i = 0; i < n; i++)
        s += conj(a[i]) * b[i];
    return cabs(s) < SAME_VECTOR * vnorm(a, n) * vnorm(b, n);
}

/* Polish candidate lambda (scaled variable) and keep it if inside and new. With
 * rescue != 0 (a second pass over estimates whose polish stalled, matrix problems) start
 * at the nearest eigenvalue found within RESCUE_REL rho instead (none, or no residue-
 * isolating bb: skip, so a rescue never repeats the first polish). *stalled
 * (may be NULL) is set when the polish found no eigenvalue near the estimate. */
static int add_candidate(const syi_nep *p, const syi_ellipse *c, double rho, const syi_nep_settings *st,
                         double complex lam, double complex *vv, const double complex *bb,
                         double complex *xx, syi_nep_eig *eig, size_t max_eig, syi_nep_result *res, int rescue,
                         int *stalled, sy_error *err)
{
    double complex w0 = c->centre + rho * lam;
    if (!syi_ellipse_inside(c, w0, -0.05)) /* spurious (outside): skip; 5 % slack before polishing */
        return SY_OK;
    if (res->n_found >= max_eig)
        return sy_error_set(err, SY_ENOCONV, "contour: more than %zu eigenvalues", max_eig);
    syi_nep_eig *o = &eig[res->n_found];
    /* A multiple eigenvalue of a symmetric layout comes out of the moments as a cluster
     * (split by the quadrature error): start at the member already polished, where the
     * Newton step of this one (its residue isolated by bb) is at once small. */
    double reach = rescue ? RESCUE_REL * rho : CLUSTER_REL * cabs(w0);
    size_t start = SIZE_MAX;
    for (size_t q = 0; bb != NULL && q < res->n_found; q++)
        if (eig[q].converged && cabs(eig[q].omega - w0) <= reach)
            reach = cabs(eig[q].omega - w0), start = q;
    if (rescue && start == SIZE_MAX)
        return SY_OK;
    if (start != SIZE_MAX)
        w0 = eig[start].omega;
    int rc = polish(p, st, w0, vv, bb, xx, o, &res->evaluations, err);
    if (rc != SY_OK || !syi_ellipse_inside(c, o->omega, INSIDE_MARGIN))
        return rc;
    if (p->n > 0 && !o->converged && o->residual > NOT_AN_EIGENVALUE) {
        if (stalled != NULL)
            *stalled = 1;
        return SY_OK; /* the polish found no eigenvalue near this estimate: spurious */
    }
    /* The same eigenvalue twice: within DEDUP_REL, or within DEDUP_LOOSE when one of the two
     * polishes stalled (T's noise reached before the secant converged). */
    for (size_t q = 0; q < res->n_found; q++) {
        double d = cabs(eig[q].omega - o->omega) / cabs(o->omega);
        if (d <= DEDUP_REL && p->n > 0 && independent(eig[q].v, o->v, p->n))
            continue; /* a multiple (semisimple) eigenvalue: symmetric layouts have them */
        if (d <= DEDUP_REL || (d <= DEDUP_LOOSE && !o->converged))
            return SY_OK;
        if (d <= DEDUP_LOOSE && !eig[q].converged) { /* replace the stalled one */
            double complex *v = eig[q].v;
            if (v != NULL && p->n > 0)
                memcpy(v, o->v, p->n * sizeof *v);
            eig[q].omega = o->omega, eig[q].residual = o->residual, eig[q].converged = o->converged;
            return SY_OK;
        }
    }
    if (syi_ellipse_radius(c, o->omega) > NEAR_EDGE)
        res->near_edge = 1;
    res->n_found++;
    if (o->multiplicity == 2 && p->n == 0) { /* a double zero: two entries, as the count has it */
        if (res->n_found >= max_eig)
            return sy_error_set(err, SY_ENOCONV, "contour: more than %zu eigenvalues", max_eig);
        eig[res->n_found].omega = o->omega, eig[res->n_found].residual = o->residual;
        eig[res->n_found].converged = o->converged, eig[res->n_found].multiplicity = 2;
        res->n_found++;
    }
    return SY_OK;
}

/* Beyn: block Hankel SVD, rank between the counts, small eigenproblem, polish. */
static int beyn(pstate *s, const syi_ellipse *c, double rho, double wsum, const syi_nep_settings *st,
                syi_nep_eig *eig, size_t max_eig, syi_nep_result *res, sy_error *err)
{
    const syi_nep *p = s->p;
    size_t n = p->n, l = s->l;
    int upper = res->count, lower = res->count_low < 0 ? 0 : res->count_low;
    if (upper < lower)
        upper = lower;
    size_t K = ((size_t)upper + 1 + l - 1) / l;
    if (K < 1)
        K = 1;
    if (2 * K > s->np)
        return sy_error_set(err, SY_ENOCONV,
                            "contour: argument-principle count %d exceeds the capacity %zu (columns x moments); "
                            "split the region", upper, (s->np / 2) * l - 1);
    size_t kn = K * n, kl = K * l;
    double complex *H0 = malloc(kn * kl * sizeof *H0), *H1 = malloc(kn * kl * sizeof *H1);
    double complex *U = malloc(kn * kl * sizeof *U), *Wt = malloc(kl * kl * sizeof *Wt);
    double *sv = malloc(kl * sizeof *sv), *superb = malloc(kl * sizeof *superb);
    double complex *D = malloc(kl * kl * sizeof *D), *lam = malloc(kl * sizeof *lam), *S = malloc(kl * kl * sizeof *S);
    double complex *vv = malloc(n * sizeof *vv), *xx = malloc(n * sizeof *xx);
    int rc = SY_OK;
    if (!H0 || !H1 || !U || !Wt || !sv || !superb || !D || !lam || !S || !vv || !xx) {
        rc = sy_error_set(err, SY_ENOMEM, "contour moments for n = %zu", n);
        goto done;
    }
    /* Block Hankel matrices (column-major kn x kl): block (a, b) = A_{a+b} (H0), A_{a+b+1} (H1). */
    for (size_t a = 0; a < K; a++)
        for (size_t b = 0; b < K; b++)
            for (size_t jj = 0; jj < l; jj++)
                for (size_t i = 0; i < n; i++) {
                    size_t at = (b * l + jj) * kn + a * n + i;
                    H0[at] = s->A[(a + b) * n * l + jj * n + i];
                    H1[at] = s->A[(a + b + 1) * n * l + jj * n + i];
                }
    {
        double complex *T1 = malloc(kn * kl * sizeof *T1);
        if (T1 == NULL) {
            rc = sy_error_set(err, SY_ENOMEM, "contour SVD");
            goto done;
        }
        memcpy(T1, H0, kn * kl * sizeof *T1);
        lapack_int info = LAPACKE_zgesvd(LAPACK_COL_MAJOR, 'S', 'S', (lapack_int)kn, (lapack_int)kl, T1,
                                         (lapack_int)kn, sv, U, (lapack_int)kn, Wt, (lapack_int)kl, superb);
        free(T1);
        if (info != 0) {
            rc = sy_error_set(err, SY_ENOCONV, "contour: SVD failed (%d)", (int)info);
            goto done;
        }
    }
    /* Singular values above the noise of T (its evaluation accuracy carried through the
     * quadrature) and above rank_tol relative. */
    double floor_abs = NOISE_FACTOR * st->noise * s->xmax * wsum;
    size_t ksv = 0;
    if (sv[0] > NOTHING_INSIDE * s->xmax * wsum)
        while (ksv < kl && sv[ksv] > st->rank_tol * sv[0] && sv[ksv] > floor_abs)
            ksv++;
    size_t k = ksv;
    res->consistent = (int)ksv >= lower && (int)ksv <= upper;
    if ((int)k < lower)
        k = (size_t)lower; /* the argument principle guarantees at least this many */
    if ((int)k > upper)
        k = (size_t)upper;
    res->rank = k;
    if (k == 0)
        goto done;
    /* D = U0^H H1 W0 Sigma0^-1 (k x k); W0 = Wt^H first k columns. */
    for (size_t a = 0; a < k; a++)
        for (size_t b = 0; b < k; b++) {
            double complex acc = 0;
            for (size_t r = 0; r < kn; r++) {
                double complex hw = 0;
                for (size_t q = 0; q < kl; q++)
                    hw += H1[q * kn + r] * conj(Wt[q * kl + b]);
                acc += conj(U[a * kn + r]) * hw;
            }
            D[b * k + a] = acc / sv[b];
        }
    lapack_int info = LAPACKE_zgeev(LAPACK_COL_MAJOR, 'N', 'V', (lapack_int)k, D, (lapack_int)k, lam, NULL, 1, S,
                                    (lapack_int)k);
    if (info != 0) {
        rc = sy_error_set(err, SY_ENOCONV, "contour: small eigenproblem failed (%d)", (int)info);
        goto done;
    }
    /* Residue rows: H0 = (U0 S)(S^-1 Sigma0 W0^H), so with x_e = U0 s_e (first n rows) the
     * residue of T^-1 V at eigenvalue e is x_e r_e, r_e = row e of S^-1 Sigma0 W0^H (first l
     * columns: the block of A_0). */
    double complex *R = malloc(k * l * sizeof *R + 1), *Sc = malloc(k * k * sizeof *Sc + 1);
    double complex *cc = malloc(l * l * sizeof *cc + 1), *bb = malloc(n * sizeof *bb + 1);
    lapack_int *piv = malloc(k * sizeof *piv + 1);
    size_t *near = malloc(k * sizeof *near + 1);
    int have_res = R && Sc && cc && bb && piv && near;
    if (have_res) {
        memcpy(Sc, S, k * k * sizeof *Sc);
        for (size_t a = 0; a < k; a++)
            for (size_t j = 0; j < l; j++)
                R[j * k + a] = sv[a] * Wt[j * kl + a];
        have_res = LAPACKE_zgesv(LAPACK_COL_MAJOR, (lapack_int)k, (lapack_int)l, Sc, (lapack_int)k, piv, R,
                                 (lapack_int)k) == 0;
    }
    unsigned char *stall = calloc(k, 1);
    if (stall == NULL) {
        rc = sy_error_set(err, SY_ENOMEM, "contour candidates");
        goto done;
    }
    /* pass 0: every estimate; pass 1: the stalled ones again (RESCUE_REL) */
    for (size_t it = 0; it < 2 * k && rc == SY_OK; it++) {
        size_t e = it % k;
        int rescue = it >= k;
        if (rescue && (!stall[e] || res->n_found >= (size_t)upper))
            continue;
        /* Eigenvector: first n rows of U0 s. */
        for (size_t i = 0; i < n; i++) {
            double complex acc = 0;
            for (size_t a = 0; a < k; a++)
                acc += U[a * kn + i] * S[e * k + a];
            vv[i] = acc;
        }
        double nv = vnorm(vv, n);
        for (size_t i = 0; i < n; i++)
            vv[i] /= nv;
        /* c with r_e c = 1 / nv and r_j c = 0 for the nearest others (at most l rows,
         * minimum norm): T^-1 V c then has residue vv at lambda_e and none at those. */
        int use_b = have_res;
        if (use_b) {
            size_t m = 0;
            near[m++] = e;
            for (size_t j = 0; j < k; j++)
                if (j != e)
                    near[m++] = j;
            for (size_t a = 1; a < m; a++) /* nearest first (insertion sort) */
                for (size_t q = a; q > 1 && cabs(lam[near[q]] - lam[e]) < cabs(lam[near[q - 1]] - lam[e]); q--) {
                    size_t tmp = near[q];
                    near[q] = near[q - 1], near[q - 1] = tmp;
                }
            if (m > l)
                m = l;
            for (size_t a = 0; a < m; a++)
                for (size_t j = 0; j < l; j++)
                    cc[j * m + a] = R[j * k + near[a]];
            for (size_t j = 0; j < l; j++)
                bb[j] = j == 0 ? 1.0 / nv : 0.0;
            /* minimum-norm solution of the m x l system (m <= l), right-hand side in bb */
            use_b = LAPACKE_zgels(LAPACK_COL_MAJOR, 'N', (lapack_int)m, (lapack_int)l, 1, cc, (lapack_int)m, bb,
                                  (lapack_int)(l > m ? l : m)) == 0;
            if (use_b) {
                for (size_t j = 0; j < l; j++)
                    xx[j] = bb[j];
                for (size_t i = 0; i < n; i++) {
                    double complex acc = 0;
                    for (size_t j = 0; j < l; j++)
                        acc += s->V[j * n + i] * xx[j];
                    bb[i] = acc;
                }
            }
        }
        int stalled = 0;
        rc = add_candidate(p, c, rho, st, lam[e], vv, use_b ? bb : NULL, xx, eig, max_eig, res, rescue,
                           rescue ? NULL : &stalled, err);
        stall[e] = (unsigned char)stalled;
    }
    free(stall);
    free(R);
    free(Sc);
    free(cc);
    free(bb);
    free(piv);
    free(near);
    res->consistent = res->consistent && res->n_found == k;
done:
    free(H0);
    free(H1);
    free(U);
    free(Wt);
    free(sv);
    free(superb);
    free(D);
    free(lam);
    free(S);
    free(vv);
    free(xx);
    return rc;
}

/* Delves-Lyness: power sums of the zeros from the unwrapped log f, Hankel pencil, polish,
 * deflation of the zeros found when fewer than the count come out. */
static int delves_lyness(pstate *s, const syi_ellipse *c, double rho, size_t N, const syi_nep_settings *st,
                         syi_nep_eig *eig, size_t max_eig, syi_nep_result *res, sy_error *err)
{
    int C = res->count;
    if (C <= 0)
        return SY_OK;
    if (C > MAX_DET_ZEROS)
        return sy_error_set(err, SY_ENOCONV, "contour: %d zeros of the determinant exceed %d; split the region", C,
                            MAX_DET_ZEROS);
    size_t nc = (size_t)C, ns = 2 * nc + 1;
    double complex *dl = malloc(N * sizeof *dl), *sp = calloc(ns, sizeof *sp);
    double complex *H0 = malloc(nc * nc * sizeof *H0), *H1 = malloc(nc * nc * sizeof *H1);
    double complex *al = malloc(nc * sizeof *al), *be = malloc(nc * sizeof *be);
    int rc = SY_OK;
    if (!dl || !sp || !H0 || !H1 || !al || !be) {
        rc = sy_error_set(err, SY_ENOMEM, "Delves-Lyness moments for %d zeros", C);
        goto done;
    }
    /* Periodic part L(t) - i C t, differentiated by its trigonometric interpolant. */
    for (size_t j = 0; j < N; j++)
        dl[j] = 0;
    for (long k = -(long)(N / 2) + 1; k < (long)(N / 2); k++) {
        double complex ck = 0;
        for (size_t j = 0; j < N; j++) {
            double t = 2 * M_PI * (double)j / (double)N;
            ck += (s->logf[j] - I * (double)C * t) * cexp(-I * (double)k * t);
        }
        ck /= (double)N;
        for (size_t j = 0; j < N && k != 0; j++) {
            double t = 2 * M_PI * (double)j / (double)N;
            dl[j] += I * (double)k * ck * cexp(I * (double)k * t);
        }
    }
    for (size_t j = 0; j < N; j++) {
        double t = 2 * M_PI * (double)j / (double)N;
        double complex u = (point(c, t) - c->centre) / rho, up = 1, d = dl[j] + I * (double)C;
        for (size_t q = 0; q < ns; q++, up *= u)
            sp[q] += up * d / (I * (double)N);
    }
    for (int round_ = 0; round_ < DEFLATE_ROUNDS && rc == SY_OK; round_++) {
        /* Power sums of the zeros not yet found. */
        size_t m = nc - res->n_found;
        if (m == 0)
            break;
        double complex *r = calloc(2 * m + 1, sizeof *r);
        if (r == NULL) {
            rc = sy_error_set(err, SY_ENOMEM, "Delves-Lyness");
            break;
        }
        for (size_t q = 0; q <= 2 * m; q++) {
            r[q] = sp[q];
            for (size_t f = 0; f < res->n_found; f++)
                r[q] -= cpow((eig[f].omega - c->centre) / rho, (double complex)q);
        }
        for (size_t a = 0; a < m; a++)
            for (size_t b = 0; b < m; b++)
                H0[b * m + a] = r[a + b], H1[b * m + a] = r[a + b + 1];
        free(r);
        lapack_int info = LAPACKE_zggev(LAPACK_COL_MAJOR, 'N', 'N', (lapack_int)m, H1, (lapack_int)m, H0, (lapack_int)m,
                                        al, be, NULL, 1, NULL, 1);
        if (info != 0) {
            rc = sy_error_set(err, SY_ENOCONV, "contour: Delves-Lyness pencil failed (%d)", (int)info);
            break;
        }
        size_t before = res->n_found;
        for (size_t e = 0; e < m && rc == SY_OK && res->n_found < nc; e++) {
            if (cabs(be[e]) == 0)
                continue;
            rc = add_candidate(s->p, c, rho, st, al[e] / be[e], NULL, NULL, NULL, eig, max_eig, res, 0, NULL, err);
        }
        if (res->n_found == before)
            break; /* no progress */
    }
    res->rank = nc;
    res->consistent = res->n_found == nc;
done:
    free(dl);
    free(sp);
    free(H0);
    free(H1);
    free(al);
    free(be);
    return rc;
}

int syi_nep_contour_multi(const syi_nep *p, size_t n_prob, const syi_ellipse *c, const syi_nep_settings *st,
                          syi_nep_eig *const *eig, const size_t *max_eig, syi_nep_result *res, sy_error *err)
{
    size_t N = st->n_points;
    if (n_prob == 0 || n_prob > SYI_NEP_MAX_PROBLEMS || N < 8 || st->n_moments == 0)
        return sy_error_set(err, SY_EINVAL, "contour: %zu problems (1..%d), %zu points (>= 8), moments %zu", n_prob,
                            SYI_NEP_MAX_PROBLEMS, N, st->n_moments);
    pstate ps[SYI_NEP_MAX_PROBLEMS];
    memset(ps, 0, sizeof ps);
    int rc = SY_OK;
    double rho = fmax(c->ax, c->ay), wsum = 0;
    unsigned long long seed = st->seed ? st->seed : 0x9E3779B97F4A7C15ULL;
    for (size_t q = 0; q < n_prob && rc == SY_OK; q++) {
        pstate *s = &ps[q];
        size_t n = p[q].n;
        memset(&res[q], 0, sizeof res[q]);
        s->p = &p[q];
        s->l = n == 0 ? 0 : (st->n_columns < n ? st->n_columns : n);
        if (n > 0 && s->l == 0)
            rc = sy_error_set(err, SY_EINVAL, "contour: no probing columns");
        s->np = n ? 2 * st->n_moments : 0;
        s->V = malloc((n * s->l + 1) * sizeof *s->V);
        s->X = malloc((n * s->l + 1) * sizeof *s->X);
        s->A = calloc(s->np * n * s->l + 1, sizeof *s->A);
        s->logf = malloc(N * sizeof *s->logf);
        if (!s->V || !s->X || !s->A || !s->logf)
            rc = sy_error_set(err, SY_ENOMEM, "contour integrals for n = %zu", n);
        for (size_t i = 0; rc == SY_OK && i < n * s->l; i++)
            s->V[i] = rnd(&seed);
    }
    pass pa = {c, ps, n_prob, 0, {0}, err};
    double complex first[2 * SYI_NEP_MAX_PROBLEMS], prev[2 * SYI_NEP_MAX_PROBLEMS], cur[2 * SYI_NEP_MAX_PROBLEMS];
    double inc[2 * SYI_NEP_MAX_PROBLEMS];
    /* Trapezoid rule: (1/2 pi i) oint f dz = (1/(i N)) sum f(z_j) z'(t_j). */
    for (size_t j = 0; j < N && rc == SY_OK; j++) {
        double t = 2 * M_PI * (double)j / (double)N;
        double complex z = point(c, t), dz = -c->ax * sin(t) + I * c->ay * cos(t);
        double complex w = dz / (I * (double)N), u = (z - c->centre) / rho;
        wsum += cabs(w);
        for (size_t q = 0; q < n_prob && rc == SY_OK; q++) {
            pstate *s = &ps[q];
            size_t n = p[q].n, nl = n * s->l;
            cur[2 * q + 1] = 0;
            rc = p[q].solve(p[q].ctx, z, s->l, s->V, s->X, &cur[2 * q], &cur[2 * q + 1], err);
            res[q].evaluations++;
            if (rc != SY_OK) {
                sy_error_prefix(err, "contour point omega = %g%+gi rad/s", creal(z), cimag(z));
                break;
            }
            s->xmax = fmax(s->xmax, vnorm(s->X, nl));
            double complex up = 1;
            for (size_t k = 0; k < s->np; k++, up *= u)
                for (size_t i = 0; i < nl; i++)
                    s->A[k * nl + i] += up * w * s->X[i];
        }
        if (rc != SY_OK)
            break;
        if (j == 0) {
            memcpy(first, cur, sizeof cur);
            for (size_t q = 0; q < n_prob; q++)
                ps[q].logf[0] = cur[2 * q];
        } else {
            memset(inc, 0, sizeof inc);
            rc = track(&pa, 2 * M_PI * (double)(j - 1) / (double)N, prev, t, cur, 0, inc);
            for (size_t k = 0; k < 2 * n_prob; k++)
                pa.rate[k] = inc[k] / (2 * M_PI / (double)N);
            for (size_t q = 0; q < n_prob; q++) {
                ps[q].ph_det += inc[2 * q], ps[q].ph_pole += inc[2 * q + 1];
                ps[q].logf[j] = creal(cur[2 * q]) + I * (cimag(ps[q].logf[j - 1]) + inc[2 * q]);
            }
        }
        memcpy(prev, cur, sizeof cur);
        if (st->progress != NULL)
            st->progress(st->progress_ctx, j + 1, N);
    }
    if (rc == SY_OK) { /* close the loop */
        memset(inc, 0, sizeof inc);
        rc = track(&pa, 2 * M_PI * (double)(N - 1) / (double)N, prev, 2 * M_PI, first, 0, inc);
        for (size_t q = 0; q < n_prob; q++) {
            ps[q].ph_det += inc[2 * q], ps[q].ph_pole += inc[2 * q + 1];
            res[q].count_low = (int)lround(ps[q].ph_det / (2 * M_PI));
            res[q].count = (int)lround((ps[q].ph_det + ps[q].ph_pole) / (2 * M_PI));
            res[q].refined = pa.refined;
            res[q].evaluations += pa.refined;
        }
    }
    for (size_t q = 0; q < n_prob && rc == SY_OK; q++) {
        if (p[q].n > 0)
            rc = beyn(&ps[q], c, rho, wsum, st, eig[q], max_eig[q], &res[q], err);
        else
            rc = delves_lyness(&ps[q], c, rho, N, st, eig[q], max_eig[q], &res[q], err);
    }
    for (size_t q = 0; q < n_prob; q++) {
        free(ps[q].V);
        free(ps[q].X);
        free(ps[q].A);
        free(ps[q].logf);
    }
    return rc;
}

int syi_nep_contour(const syi_nep *p, const syi_ellipse *c, const syi_nep_settings *st, syi_nep_eig *eig,
                    size_t max_eig, syi_nep_result *res, sy_error *err)
{
    syi_nep_eig *const e[1] = {eig};
    return syi_nep_contour_multi(p, 1, c, st, e, &max_eig, res, err);
}
