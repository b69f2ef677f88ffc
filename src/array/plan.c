/* Array plan: once per layout. Copies the layout, checks it (positive sizes, no two
 * bounding circles closer than the margin), makes one body plan per body type, and
 * prepares the pair geometry (distance L and direction alpha from centre j to centre i),
 * the per-pair depth-mode truncation, the per-mode angular truncation and the index maps
 * of unknowns and dofs.
 *
 * Per-pair truncation: the evanescent wave of depth mode q leaving body j, normalised to
 * its value on r = a_j, reaches the nearest point of body i with relative size
 *   c_q(i, j) = K_0(kq (L - a_i)) / K_0(kq a_j)        (kq = (q - 1/2) pi / h, a lower
 * bound of the real evanescent root, so c_q is an upper bound; K_n(x')/K_n(x) with
 * x' > x decreases with n, so n = 0 is the largest). Modes with max(c_q(i,j), c_q(j,i))
 * below the tolerance are dropped for that pair; the count is reported. An array of
 * columns only keeps q = 0: nothing there excites evanescent waves.
 *
 * Per-mode angular truncation: body i keeps orders -M_iq..M_iq of evanescent mode q
 * (M_i0 = M for the propagating mode). Graf's theorem for K (array.h) re-expands the
 * outgoing partial wave (q, n) of body j, of unit size on its own surface r = a_j (the
 * scaled basis), about body i; its incident component of order m has the size
 *   C^{ij}_q(m, n) = |K_{n-m}(kq L)| I_m(kq a_i) / K_n(kq a_j)
 * on body i's surface. Orders are kept in +-pairs and K_p grows with p, so the largest
 * over the signs is at |n - m| = |m| + |n|. That partial wave of body j has at most the
 * size B^j_{qn} <= 1 (sending bound, below), so body i receives at most C B. Dropping
 * order m of mode q on body i omits row m (body i receives) and column m (body i sends)
 * of its couplings, so M_iq is the largest |m| with C^{ij}_q(m, n) B^j_{qn} >= tol or
 * C^{ji}_q(n, m) B^i_{qm} >= tol for some neighbour j coupled in mode q and some
 * |n| <= M: every omitted incident wave is below the tolerance (the same measure as the
 * per-pair cut-off, now per order). The coefficients fall with the order like
 * (a / (L - a))^m in the Laplace limit kq L -> 0 and faster (times
 * e^{-kq (L - a_i - a_j)}) for larger kq, so higher modes need fewer orders. C is
 * bounded over the whole interval of the real root, kq h in ((q - 1/2) pi, q pi)
 * (SAMPLES points: not monotone in kq for close bodies), i.e. over all real
 * frequencies: the plan (matrix size, unknowns) does not depend on omega, and
 * log det(I - D T) stays one analytic function of omega for the resonance search, which
 * uses the same truncation off the axis. Values are carried as logarithms (high orders
 * at small kq a overflow double).
 *
 * Sending bound B^i_{qn} (evanescent q >= 1): the scaled outgoing amplitude of body i in
 * (q, n). An axisymmetric body scatters order n only into order n (D block diagonal in
 * n, body.h), so beta_{qn} = sum_q' D~_n(q, q') alpha_{q'n} + radiation, and
 *   B^i_{qn} = min(1, max over frequency samples of
 *              sum_q' |D~_n(q, q')| A^i_{q'n} + R^i_{qn}),
 * with the incident bounds A: the ambient wave (|a_{0n}| = 1 in units of its potential
 * amplitude g / omega, Jacobi-Anger; scaled 1 / |H_n(k0 a_i)|) plus, for every mode, what
 * all other bodies' outgoing partial waves of unit scaled size bring (sum over the
 * neighbours coupled in that mode of max_p |T~_q[n, p]|, i.e. the unweighted rule's
 * assumption one step earlier: B <= 1 makes it consistent); and R the body's own
 * radiated partial wave (q, n) relative to the largest scaled partial wave of the same
 * rigid-body dof (non-zero for |n| <= 1 only). What the rule sharpens: an evanescent
 * order n >= 2 is only excited by incident order-n content (propagating incident order
 * n is small until k0 a ~ n, and the float converts it to evanescent modes weakly:
 * |D~_n(q, 0)| falls like the incident wave at the float's bottom, e^{-k0 d}), and a
 * float spanning the top d of the depth scatters evanescent modes weakly
 * (|D~_n(q, q')| ~ 1e-2..1e-5, against I_n K_n ~ 1/(2n) for a full-depth column).
 * Frequency samples: WSAMPLES values of k0, geometric from K0A_LOW / a_max (the static
 * limit: the scaled D~ and T~ no longer change) to 2 ln(1/tol) / d_min (the incident
 * wave at the float's bottom below tol^2), body solves at each (a few ms per body type).
 * A failed sample solve keeps B = 1 (the unweighted rule) for every body. */
#include "array_impl.h"

#include "swellyield/special.h"

#include <inttypes.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

static int check_settings(const sy_array_settings *s, sy_error *err)
{
    if (!(s->h > 0.0) || !isfinite(s->h))
        return sy_error_set(err, SY_EINVAL, "array: depth h must be > 0 m and finite, got %g", s->h);
    if (!(s->rho > 0.0) || !(s->g > 0.0))
        return sy_error_set(err, SY_EINVAL, "array: rho and g must be > 0, got %g, %g", s->rho, s->g);
    if (!(s->tolerance > 0.0 && s->tolerance < 1.0))
        return sy_error_set(err, SY_EINVAL, "array: tolerance must be in (0, 1), got %g", s->tolerance);
    if (s->n_order < 1 || s->n_order > SY_ARRAY_MAX_ORDER)
        return sy_error_set(err, SY_EINVAL, "array: angular order M must be in 1..%d, got %zu",
                            SY_ARRAY_MAX_ORDER, s->n_order);
    if (s->n_depth < 1)
        return sy_error_set(err, SY_EINVAL, "array: need at least one depth mode, got %zu", s->n_depth);
    if (!(s->margin >= 0.0))
        return sy_error_set(err, SY_EINVAL, "array: margin must be >= 0 m, got %g", s->margin);
    return SY_OK;
}

/* K_0(x') / K_0(x) for real x, x' > 0, from the scaled function. */
static double k0_ratio(double xp, double x)
{
    double complex kp, k;
    if (sy_special_besselk_scaled_array(0, xp, &kp, NULL) != SY_OK ||
        sy_special_besselk_scaled_array(0, x, &k, NULL) != SY_OK)
        return 1.0;   /* keep the mode if the estimate fails */
    return cabs(kp) / cabs(k) * exp(-(xp - x));
}

/* kq samples per evanescent mode for the per-mode orders (endpoints of the interval of
 * the real root and three points between; see the file comment). */
#define SAMPLES 5
/* Frequency samples of the sending bound, k0 from K0A_LOW / a (the static limit: scaled
 * D~ and T~ no longer change below it) to 2 ln(1/tol) / d (file comment). */
#define WSAMPLES 16
#define K0A_LOW 0.05

/* log K_n(x), n = 0..nmax, real x > 0: upward recurrence of the ratio K_n / K_{n-1}
 * (K_{n+1} = K_{n-1} + (2n/x) K_n, stable for K). Returns 0, or -1 if K_0, K_1 fail. */
static int log_besselk(size_t nmax, double x, double *out)
{
    double complex k[2];
    if (sy_special_besselk_scaled_array(1, x, k, NULL) != SY_OK || !(creal(k[0]) > 0) || !(creal(k[1]) > 0))
        return -1;
    out[0] = log(creal(k[0])) - x;
    double r = creal(k[1]) / creal(k[0]);
    for (size_t n = 1; n <= nmax; n++) {
        out[n] = out[n - 1] + log(r);
        r = 1.0 / r + 2.0 * (double)n / x;
    }
    return 0;
}

/* log I_m(x), m = 0..mmax, real x > 0: the ratio I_{m+1}/I_m by backward recurrence
 * (I_{m-1} = I_{m+1} + (2m/x) I_m, stable downward) started far enough above mmax
 * that its start value no longer matters at the precision needed for a cut-off. */
static int log_besseli(size_t mmax, double x, double *out)
{
    double complex i0;
    if (sy_special_besseli_scaled_array(0, x, &i0, NULL) != SY_OK || !(creal(i0) > 0))
        return -1;
    size_t top = mmax + 30 + (size_t)(2 * x);
    double rq = 0.0;   /* I_{m+1} / I_m, from m = top down */
    out[0] = log(creal(i0)) + x;
    double ratio[2 * SY_ARRAY_MAX_ORDER + 1];
    for (size_t m = top; m-- > 0;) {
        rq = 1.0 / (2.0 * (double)(m + 1) / x + rq);
        if (m < mmax)
            ratio[m] = rq;
    }
    for (size_t m = 1; m <= mmax; m++)
        out[m] = out[m - 1] + log(ratio[m - 1]);
    return 0;
}

static void raise(long *x, size_t v)
{
    if ((long)v > *x)
        *x = (long)v;
}

/* Orders needed by the pair (i, j) in evanescent mode q (file comment): need_i, need_j
 * raised to the largest order of each body with a weighted coupling coefficient
 * C B >= tol (left as they are when none is). On a failed Bessel evaluation every order
 * is kept. */
static void pair_orders(const sy_array_plan *p, size_t i, size_t j, size_t q, long *need_i, long *need_j)
{
    const size_t M = p->M, Q = p->Q;
    const double L = p->pair_L[i * p->n_bodies + j], ltol = log(p->set.tolerance);
    const double ai = p->types[p->bodies[i].type].geom.radius, aj = p->types[p->bodies[j].type].geom.radius;
    const double *bi = &p->lsend[(i * Q + q) * (M + 1)], *bj = &p->lsend[(j * Q + q) * (M + 1)];
    double lkl[2 * SY_ARRAY_MAX_ORDER + 1], lii[SY_ARRAY_MAX_ORDER + 1], lij[SY_ARRAY_MAX_ORDER + 1];
    double lki[SY_ARRAY_MAX_ORDER + 1], lkj[SY_ARRAY_MAX_ORDER + 1];
    for (int s = 0; s < SAMPLES; s++) {
        double kq = ((double)q - 0.5 + 0.5 * s / (SAMPLES - 1)) * SY_ARRAY_PI / p->set.h;
        if (log_besselk(2 * M, kq * L, lkl) || log_besseli(M, kq * ai, lii) || log_besseli(M, kq * aj, lij) ||
            log_besselk(M, kq * ai, lki) || log_besselk(M, kq * aj, lkj)) {
            *need_i = *need_j = (long)M;
            return;
        }
        for (size_t m = 0; m <= M; m++)
            for (size_t n = 0; n <= M; n++) {
                /* body i receives m from n of body j (sent with amplitude <= B^j_{qn}),
                 * and body j receives m from n of i */
                if (lkl[m + n] + lii[m] - lkj[n] + bj[n] >= ltol) {
                    raise(need_i, m);
                    raise(need_j, n);
                }
                if (lkl[m + n] + lij[m] - lki[n] + bi[n] >= ltol) {
                    raise(need_j, m);
                    raise(need_i, n);
                }
            }
    }
}

/* log(e^a + e^b), either may be -inf. */
static double log_add(double a, double b)
{
    if (a == -INFINITY)
        return b;
    if (b == -INFINITY)
        return a;
    double hi = fmax(a, b);
    return hi + log(exp(a - hi) + exp(b - hi));
}

/* log |H_n(x)|, n = 0..nmax, real x > 0. Returns 0, or -1 on failure or overflow. */
static int log_hankel(size_t nmax, double x, double *out)
{
    double complex h[2 * SY_ARRAY_MAX_ORDER + 1];
    if (sy_special_hankel1_array((int)nmax, x, h, NULL) != SY_OK)
        return -1;
    for (size_t n = 0; n <= nmax; n++) {
        double v = cabs(h[n]);
        if (!(v > 0.0) || !isfinite(v))
            return -1;
        out[n] = log(v);
    }
    return 0;
}

/* Incident bounds at body i from every other body at one frequency sample, added to
 * la[q (M+1) + n] (log, scaled basis): each neighbour's outgoing partial waves of unit
 * scaled size, re-expanded by Graf's theorem, |T~_q[n, p]| largest at |n| + |p|. ls:
 * log scales per type, mode, order at this sample; kq: wavenumbers. */
static int incident_bounds(const sy_array_plan *p, size_t i, const double *ls, const double *kq, double *la)
{
    const size_t N = p->n_bodies, Q = p->Q, M = p->M;
    const size_t ti = p->bodies[i].type;
    double lf[2 * SY_ARRAY_MAX_ORDER + 1];
    for (size_t j = 0; j < N; j++) {
        if (j == i)
            continue;
        const size_t tj = p->bodies[j].type;
        const double L = p->pair_L[i * N + j];
        for (size_t q = 0; q < p->pair_nq[i * N + j]; q++) {
            if (q == 0 ? log_hankel(2 * M, kq[0] * L, lf) : log_besselk(2 * M, kq[q] * L, lf))
                return -1;
            const double *si = &ls[(ti * Q + q) * (M + 1)], *sj = &ls[(tj * Q + q) * (M + 1)];
            for (size_t n = 0; n <= M; n++) {
                double most = -INFINITY;
                for (size_t k = 0; k <= M; k++)
                    most = fmax(most, lf[n + k] - si[n] - sj[k]);
                la[q * (M + 1) + n] = log_add(la[q * (M + 1) + n], most);
            }
        }
    }
    return 0;
}

/* Sending bounds lsend (file comment) at the WSAMPLES frequencies; bodies of a type whose
 * sample solve fails keep B = 1 (the unweighted rule). */
static int send_bounds(sy_array_plan *p, sy_error *err)
{
    const size_t N = p->n_bodies, Q = p->Q, M = p->M, T = p->n_types, nw = M + 1;
    for (size_t u = 0; u < N * Q * nw; u++)
        p->lsend[u] = 0.0;
    double amax = 0.0, dmin = INFINITY;
    for (size_t t = 0; t < T; t++) {
        amax = fmax(amax, p->types[t].geom.radius);
        if (p->types[t].geom.kind == SY_BODY_FLOAT)
            dmin = fmin(dmin, p->types[t].geom.draft);
    }
    if (p->full_orders || Q < 2 || !isfinite(dmin))
        return SY_OK;
    double *lb = malloc(N * Q * nw * sizeof *lb), *ls = malloc(T * Q * nw * sizeof *ls);
    double *la = malloc(Q * nw * sizeof *la), *kq = malloc(Q * sizeof *kq);
    double complex *roots_k = malloc((p->n_roots + 1) * sizeof *roots_k);
    sy_body_work **bw = calloc(T, sizeof *bw);
    sy_body_waves **bv = calloc(T, sizeof *bv);
    int *ok = malloc(T * sizeof *ok);
    int rc = lb && ls && la && kq && roots_k && bw && bv && ok ? SY_OK
                                                               : sy_error_set(err, SY_ENOMEM, "array plan sending bounds");
    for (size_t t = 0; rc == SY_OK && t < T; t++) {
        rc = sy_body_work_alloc(&bw[t], p->bplan[t], err);
        if (rc == SY_OK)
            rc = sy_body_waves_alloc(&bv[t], M, Q, err);
        ok[t] = 1;
    }
    for (size_t u = 0; rc == SY_OK && u < N * Q * nw; u++)
        lb[u] = -INFINITY;
    const double klo = K0A_LOW / amax, khi = 2.0 * log(1.0 / p->set.tolerance) / dmin;
    for (int s = 0; rc == SY_OK && s < WSAMPLES; s++) {
        double k0 = klo * pow(khi / klo, (double)s / (WSAMPLES - 1));
        double omega = sqrt(p->set.g * k0 * tanh(k0 * p->set.h));
        sy_wave_roots roots = {0};
        roots.k = roots_k;
        if (sy_waves_roots_fill(&roots, omega, p->set.h, p->set.g, p->n_roots, NULL) != SY_OK)
            break;   /* keep B = 1 everywhere */
        kq[0] = creal(roots.k0);
        for (size_t q = 1; q < Q; q++)
            kq[q] = creal(roots.k[q - 1]);
        for (size_t t = 0; t < T; t++) {
            double a = p->types[t].geom.radius;
            if (ok[t] && sy_body_solve(p->bplan[t], &roots, p->set.rho, bw[t], bv[t], NULL) != SY_OK)
                ok[t] = 0;
            for (size_t q = 0; ok[t] && q < Q; q++)
                if (q == 0 ? log_hankel(M, kq[0] * a, &ls[(t * Q) * nw])
                           : log_besselk(M, kq[q] * a, &ls[(t * Q + q) * nw]))
                    ok[t] = 0;
        }
        /* the incident bounds read every type's scales: one failure stops them all */
        int all = 1;
        for (size_t t = 0; t < T; t++)
            all &= ok[t];
        for (size_t t = 0; t < T; t++)
            ok[t] = all;
        for (size_t i = 0; i < N; i++) {
            const size_t t = p->bodies[i].type;
            if (!ok[t])
                continue;
            /* ambient wave: |a_{0n}| = 1 (Jacobi-Anger), scaled 1 / |H_n(k0 a)| */
            for (size_t u = 0; u < Q * nw; u++)
                la[u] = u < nw ? -ls[(t * Q) * nw + u] : -INFINITY;
            if (incident_bounds(p, i, ls, kq, la)) {
                ok[t] = 0;
                continue;
            }
            const double complex *D = bv[t]->diffraction, *R = bv[t]->radiation;
            const sy_array_type *ty = &p->types[t];
            for (size_t q = 1; q < p->nq[i]; q++)
                for (size_t n = 0; n <= M; n++) {
                    /* B = sum_q' |D~_n(q, q')| A_{q'n},  D~ = s_q D s_q' */
                    double b = -INFINITY;
                    for (size_t qp = 0; qp < p->nq[i]; qp++) {
                        double d = cabs(D[(n * Q + q) * Q + qp]);
                        if (d > 0.0)
                            b = log_add(b, log(d) + ls[(t * Q + q) * nw + n] + ls[(t * Q + qp) * nw + n] +
                                               la[qp * nw + n]);
                    }
                    /* radiation columns: the radiated wave relative to the largest scaled
                     * partial wave of the same dof (|n| <= 1 for rigid modes) */
                    for (int j = 0; ty->geom.kind == SY_BODY_FLOAT && j < SY_BODY_NMODES; j++) {
                        const double complex *Rj = &R[(size_t)j * Q * (2 * M + 1)];
                        double r = cabs(Rj[q * (2 * M + 1) + M + n]);
                        if (!(ty->modes & (1u << j)) || r == 0.0)
                            continue;
                        double top = -INFINITY;
                        for (size_t qp = 0; qp < Q; qp++)
                            for (size_t k = 0; k <= M; k++)
                                if (Rj[qp * (2 * M + 1) + M + k] != 0.0)
                                    top = fmax(top, log(cabs(Rj[qp * (2 * M + 1) + M + k])) +
                                                        ls[(t * Q + qp) * nw + k]);
                        b = fmax(b, log(r) + ls[(t * Q + q) * nw + n] - top);
                    }
                    double *x = &lb[(i * Q + q) * nw + n];
                    *x = fmax(*x, b);
                }
        }
        if (s == WSAMPLES - 1)
            for (size_t i = 0; i < N; i++)
                for (size_t q = 1; ok[p->bodies[i].type] && q < p->nq[i]; q++)
                    for (size_t n = 0; n <= M; n++)
                        p->lsend[(i * Q + q) * nw + n] = fmin(0.0, lb[(i * Q + q) * nw + n]);
    }
    for (size_t t = 0; bw != NULL && bv != NULL && t < T; t++) {
        sy_body_work_free(bw[t]);
        sy_body_waves_free(bv[t]);
    }
    free(bw);
    free(bv);
    free(ok);
    free(lb);
    free(ls);
    free(la);
    free(kq);
    free(roots_k);
    return rc;
}

/* M_iq for every body and kept evanescent mode, and the offsets of the unknowns. */
static void mode_orders(sy_array_plan *p)
{
    const size_t N = p->n_bodies, Q = p->Q, M = p->M;
    for (size_t i = 0; i < N; i++)
        for (size_t q = 0; q < Q; q++)
            p->ord[i * Q + q] = p->full_orders || q == 0 ? M : 0;
    for (size_t q = 1; q < Q && !p->full_orders; q++)
        for (size_t i = 0; i < N; i++)
            for (size_t j = i + 1; j < N; j++) {
                if (p->pair_nq[i * N + j] <= q)
                    continue;
                long ni = (long)p->ord[i * Q + q], nj = (long)p->ord[j * Q + q];
                pair_orders(p, i, j, q, &ni, &nj);
                p->ord[i * Q + q] = (size_t)ni;
                p->ord[j * Q + q] = (size_t)nj;
            }
    size_t u = 0;
    p->n_full = 0;
    for (size_t i = 0; i < N; i++) {
        p->unk_off[i] = u;
        for (size_t q = 0; q < p->nq[i]; q++) {
            p->blk_off[i * Q + q] = u;
            u += 2 * p->ord[i * Q + q] + 1;
        }
        p->n_full += p->nq[i] * p->nn;
    }
    p->unk_off[N] = u;
    p->n_unknowns = u;
}

static int layout(sy_array_plan *p, sy_error *err)
{
    const size_t N = p->n_bodies, Q = p->Q;
    /* Without floats nothing excites evanescent waves: the ambient wave is propagating
     * and a column's D is diagonal in q, so only q = 0 is kept (not counted as dropped). */
    int any_float = 0;
    for (size_t i = 0; i < N; i++)
        any_float |= p->types[p->bodies[i].type].geom.kind == SY_BODY_FLOAT;
    for (size_t i = 0; i < N; i++) {
        const sy_array_body *bi = &p->bodies[i];
        double ai = p->types[bi->type].geom.radius;
        for (size_t j = 0; j < N; j++) {
            if (i == j)
                continue;
            const sy_array_body *bj = &p->bodies[j];
            double aj = p->types[bj->type].geom.radius;
            double dx = bi->x - bj->x, dy = bi->y - bj->y, L = hypot(dx, dy);
            if (j > i && !(L >= ai + aj + p->set.margin))
                return sy_error_set(err, SY_EINVAL,
                                    "array: bodies %zu at (%g, %g) and %zu at (%g, %g) overlap: "
                                    "centre distance %g m < r1 + r2 + margin = %g m",
                                    i, bi->x, bi->y, j, bj->x, bj->y, L, ai + aj + p->set.margin);
            p->pair_L[i * N + j] = L;
            p->pair_alpha[i * N + j] = atan2(dy, dx);
            size_t nq = 1;
            for (size_t q = 1; q < Q && any_float; q++) {
                double kq = (q - 0.5) * SY_ARRAY_PI / p->set.h;
                double c = fmax(k0_ratio(kq * (L - ai), kq * aj), k0_ratio(kq * (L - aj), kq * ai));
                if (c < p->set.tolerance)
                    break;
                nq = q + 1;
            }
            p->pair_nq[i * N + j] = nq;
            if (j > i && any_float)
                p->dropped += Q - nq;
        }
    }
    /* unknowns and dofs */
    p->dof_off[0] = 0;
    p->n_rad = 0;
    for (size_t i = 0; i < N; i++) {
        size_t nq = 1;
        for (size_t j = 0; j < N; j++)
            if (j != i && p->pair_nq[i * N + j] > nq)
                nq = p->pair_nq[i * N + j];
        p->nq[i] = nq;
        const sy_array_type *t = &p->types[p->bodies[i].type];
        size_t nd = 0;
        for (int m = 0; m < SY_BODY_NMODES; m++)
            if (t->modes & (1u << m))
                nd++;
        p->dof_off[i + 1] = p->dof_off[i] + nd;
        if (t->geom.kind == SY_BODY_FLOAT)
            p->n_rad += nd;
    }
    p->n_dof = p->dof_off[N];
    p->n_rhs = p->n_headings + p->n_rad;
    p->dof_body = malloc((p->n_dof + 1) * sizeof *p->dof_body);
    p->dof_mode = malloc((p->n_dof + 1) * sizeof *p->dof_mode);
    p->rad_dof = malloc((p->n_rad + 1) * sizeof *p->rad_dof);
    p->rad_first = malloc((N + 1) * sizeof *p->rad_first);
    if (p->dof_body == NULL || p->dof_mode == NULL || p->rad_dof == NULL || p->rad_first == NULL)
        return sy_error_set(err, SY_ENOMEM, "array plan index maps for %zu dofs", p->n_dof);
    size_t d = 0, r = 0;
    for (size_t i = 0; i < N; i++) {
        const sy_array_type *t = &p->types[p->bodies[i].type];
        p->rad_first[i] = r;
        for (int m = 0; m < SY_BODY_NMODES; m++) {
            if (!(t->modes & (1u << m)))
                continue;
            p->dof_body[d] = i;
            p->dof_mode[d] = m + 1;
            if (t->geom.kind == SY_BODY_FLOAT)
                p->rad_dof[r++] = d;
            d++;
        }
    }
    p->rad_first[N] = r;
    return SY_OK;
}

int sy_array_plan_create(sy_array_plan **out, const sy_array_settings *settings,
                         const sy_array_type *types, size_t n_types,
                         const sy_array_body *bodies, size_t n_bodies,
                         const double *headings, size_t n_headings, sy_error *err)
{
    return syi_array_plan_create(out, settings, types, n_types, bodies, n_bodies, headings, n_headings, 0, err);
}

int syi_array_plan_create(sy_array_plan **out, const sy_array_settings *settings,
                          const sy_array_type *types, size_t n_types, const sy_array_body *bodies,
                          size_t n_bodies, const double *headings, size_t n_headings, int full_orders,
                          sy_error *err)
{
    if (out == NULL || settings == NULL || types == NULL || bodies == NULL ||
        (headings == NULL && n_headings > 0))
        return sy_error_set(err, SY_EINVAL, "array plan: NULL argument");
    int rc = check_settings(settings, err);
    if (rc != SY_OK)
        return rc;
    if (n_types == 0 || n_bodies == 0)
        return sy_error_set(err, SY_EINVAL, "array plan: need at least one body and one type, got %zu, %zu",
                            n_bodies, n_types);
    for (size_t i = 0; i < n_bodies; i++) {
        if (bodies[i].type >= n_types)
            return sy_error_set(err, SY_EINVAL, "array plan: body %zu has type %zu, expected < %zu", i,
                                bodies[i].type, n_types);
        if (!isfinite(bodies[i].x) || !isfinite(bodies[i].y))
            return sy_error_set(err, SY_EINVAL, "array plan: body %zu position (%g, %g) not finite", i,
                                bodies[i].x, bodies[i].y);
    }
    for (size_t t = 0; t < n_types; t++)
        if ((types[t].modes & ~SY_ARRAY_ALL_MODES) != 0)
            return sy_error_set(err, SY_EINVAL, "array plan: type %zu mode mask 0x%x has bits beyond 0x1f",
                                t, types[t].modes);
    for (size_t b = 0; b < n_headings; b++)
        if (!isfinite(headings[b]))
            return sy_error_set(err, SY_EINVAL, "array plan: heading %zu is not finite", b);

    sy_array_plan *p = calloc(1, sizeof *p);
    if (p == NULL)
        return sy_error_set(err, SY_ENOMEM, "array plan");
    const size_t N = n_bodies;
    p->set = *settings;
    p->n_types = n_types;
    p->n_bodies = N;
    p->n_headings = n_headings;
    p->M = settings->n_order;
    p->Q = settings->n_depth;
    p->nn = 2 * p->M + 1;
    p->full_orders = full_orders != 0;
    p->types = malloc(n_types * sizeof *p->types);
    p->bodies = malloc(N * sizeof *p->bodies);
    p->headings = malloc((n_headings + 1) * sizeof *p->headings);
    p->bplan = calloc(n_types, sizeof *p->bplan);
    p->pair_L = calloc(N * N, sizeof *p->pair_L);
    p->pair_alpha = calloc(N * N, sizeof *p->pair_alpha);
    p->pair_nq = calloc(N * N, sizeof *p->pair_nq);
    p->nq = calloc(N, sizeof *p->nq);
    p->ord = calloc(N * p->Q, sizeof *p->ord);
    p->blk_off = calloc(N * p->Q, sizeof *p->blk_off);
    p->lsend = calloc(N * p->Q * (p->M + 1), sizeof *p->lsend);
    p->unk_off = calloc(N + 1, sizeof *p->unk_off);
    p->dof_off = calloc(N + 1, sizeof *p->dof_off);
    if (p->types == NULL || p->bodies == NULL || p->headings == NULL || p->bplan == NULL ||
        p->pair_L == NULL || p->pair_alpha == NULL || p->pair_nq == NULL || p->nq == NULL ||
        p->ord == NULL || p->blk_off == NULL || p->lsend == NULL ||
        p->unk_off == NULL || p->dof_off == NULL) {
        sy_array_plan_free(p);
        return sy_error_set(err, SY_ENOMEM, "array plan for %zu bodies", N);
    }
    memcpy(p->types, types, n_types * sizeof *types);
    memcpy(p->bodies, bodies, N * sizeof *bodies);
    if (n_headings > 0)
        memcpy(p->headings, headings, n_headings * sizeof *headings);

    rc = layout(p, err);
    for (size_t t = 0; rc == SY_OK && t < n_types; t++) {
        rc = sy_body_plan_create(&p->bplan[t], &types[t].geom, settings->h, settings->tolerance,
                                 p->M, p->Q, err);
        if (rc != SY_OK)
            sy_error_prefix(err, "array plan: body type %zu", t);
        else if (sy_body_plan_roots_needed(p->bplan[t]) > p->n_roots)
            p->n_roots = sy_body_plan_roots_needed(p->bplan[t]);
    }
    if (rc != SY_OK) {
        sy_array_plan_free(p);
        return rc;
    }
    if (p->n_roots < p->Q - 1)
        p->n_roots = p->Q - 1;
    rc = send_bounds(p, err);
    if (rc != SY_OK) {
        sy_array_plan_free(p);
        return rc;
    }
    mode_orders(p);
    *out = p;
    return SY_OK;
}

void sy_array_plan_free(sy_array_plan *p)
{
    if (p == NULL)
        return;
    if (p->bplan != NULL)
        for (size_t t = 0; t < p->n_types; t++)
            sy_body_plan_free(p->bplan[t]);
    free(p->bplan);
    free(p->types);
    free(p->bodies);
    free(p->headings);
    free(p->pair_L);
    free(p->pair_alpha);
    free(p->pair_nq);
    free(p->nq);
    free(p->ord);
    free(p->blk_off);
    free(p->lsend);
    free(p->unk_off);
    free(p->dof_off);
    free(p->dof_body);
    free(p->dof_mode);
    free(p->rad_dof);
    free(p->rad_first);
    free(p);
}

size_t sy_array_plan_n_dof(const sy_array_plan *plan) { return plan->n_dof; }
size_t sy_array_plan_n_unknowns(const sy_array_plan *plan) { return plan->n_unknowns; }
size_t sy_array_plan_n_headings(const sy_array_plan *plan) { return plan->n_headings; }
size_t sy_array_plan_dropped(const sy_array_plan *plan) { return plan->dropped; }

void sy_array_plan_dof(const sy_array_plan *plan, size_t d, size_t *body, int *mode)
{
    if (d >= plan->n_dof) {
        *body = (size_t)-1;
        *mode = 0;
        return;
    }
    *body = plan->dof_body[d];
    *mode = plan->dof_mode[d];
}

static uint64_t fnv(uint64_t h, const void *data, size_t n)
{
    const unsigned char *c = data;
    for (size_t i = 0; i < n; i++) {
        h ^= c[i];
        h *= 1099511628211ull;   /* FNV-1a 64-bit prime */
    }
    return h;
}

uint64_t sy_array_plan_key(const sy_array_plan *p)
{
    uint64_t h = 14695981039346656037ull;   /* FNV-1a 64-bit offset basis */
    const sy_array_settings *s = &p->set;
    double sd[6] = {s->h, s->rho, s->g, s->tolerance, s->margin, 0.0};
    uint64_t sz[2] = {s->n_order, s->n_depth};
    h = fnv(h, sd, sizeof sd);
    h = fnv(h, sz, sizeof sz);
    for (size_t t = 0; t < p->n_types; t++) {
        const sy_array_type *ty = &p->types[t];
        double g[3] = {ty->geom.radius, ty->geom.kind == SY_BODY_COLUMN ? s->h : ty->geom.draft,
                       ty->geom.z_rot};
        uint64_t k[2] = {(uint64_t)ty->geom.kind, ty->modes};
        h = fnv(h, g, sizeof g);
        h = fnv(h, k, sizeof k);
    }
    for (size_t i = 0; i < p->n_bodies; i++) {
        double xy[2] = {p->bodies[i].x, p->bodies[i].y};
        uint64_t t = p->bodies[i].type;
        h = fnv(h, xy, sizeof xy);
        h = fnv(h, &t, sizeof t);
    }
    h = fnv(h, p->headings, p->n_headings * sizeof *p->headings);
    /* the per-mode orders: a change of the truncation rule changes the key (cache) */
    h = fnv(h, p->ord, p->n_bodies * p->Q * sizeof *p->ord);
    return h;
}

/* "M_q <= 4 3 2 1 -" (q = 1..Q-1; "-": no body keeps the mode) into buf[n]. */
static void orders_text(const sy_array_plan *p, char *buf, size_t n)
{
    size_t used = (size_t)snprintf(buf, n, "evanescent orders M_q <=");
    for (size_t q = 1; q < p->Q && used < n; q++) {
        long most = -1;
        for (size_t i = 0; i < p->n_bodies; i++)
            if (q < p->nq[i])
                raise(&most, p->ord[i * p->Q + q]);
        used += most < 0 ? (size_t)snprintf(buf + used, n - used, " -")
                         : (size_t)snprintf(buf + used, n - used, " %ld", most);
    }
}

void sy_array_plan_truncation(const sy_array_plan *p, char *buf, size_t n)
{
    if (buf == NULL || n == 0)
        return;
    size_t pairs = p->n_bodies * (p->n_bodies - 1) / 2 * (p->Q - 1);
    char ord[128];
    orders_text(p, ord, sizeof ord);
    snprintf(buf, n,
             "M = %zu, Q = %zu, tolerance %g, %zu of %zu (pair, evanescent mode) couplings dropped, "
             "%s, %zu of %zu unknowns",
             p->M, p->Q, p->set.tolerance, p->dropped, pairs, ord, p->n_unknowns, p->n_full);
}

size_t sy_array_plan_partial_waves(const sy_array_plan *p, size_t body, size_t q)
{
    if (body >= p->n_bodies || q >= p->nq[body])
        return 0;
    return 2 * p->ord[body * p->Q + q] + 1;
}

void sy_array_plan_describe(const sy_array_plan *p, FILE *f)
{
    const sy_array_settings *s = &p->set;
    fprintf(f, "array: %zu bodies, %zu types, depth %g m, rho %g kg/m^3, g %g m/s^2\n",
            p->n_bodies, p->n_types, s->h, s->rho, s->g);
    fprintf(f, "array: orders -%zu..%zu, %zu depth modes, tolerance %g, margin %g m\n", p->M, p->M,
            p->Q, s->tolerance, s->margin);
    for (size_t t = 0; t < p->n_types; t++) {
        const sy_array_type *ty = &p->types[t];
        fprintf(f, "array: type %zu: %s, radius %g m, draft %g m, z_rot %g m, modes 0x%x\n", t,
                ty->geom.kind == SY_BODY_COLUMN ? "column" : "float", ty->geom.radius,
                ty->geom.kind == SY_BODY_COLUMN ? s->h : ty->geom.draft, ty->geom.z_rot, ty->modes);
    }
    fprintf(f, "array: %zu unknowns, %zu dofs (%zu radiating), %zu headings, %zu right-hand sides\n",
            p->n_unknowns, p->n_dof, p->n_rad, p->n_headings, p->n_rhs);
    fprintf(f, "array: %zu (pair, evanescent mode) couplings below tolerance dropped\n", p->dropped);
    char ord[128];
    orders_text(p, ord, sizeof ord);
    fprintf(f, "array: %s (largest over bodies), %zu of %zu unknowns%s\n", ord, p->n_unknowns, p->n_full,
            p->full_orders ? " (per-mode orders off)" : "");
    fprintf(f, "array: key %016" PRIx64 "\n", sy_array_plan_key(p));
}
