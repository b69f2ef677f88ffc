/* Array solve at one frequency (real or complex): roots, isolated-body characteristics
 * per body type, the translation matrix T~ (Graf's addition theorem, array.h), the
 * interaction matrix I - D~ T~ (one LU, LAPACKE zgetrf row-major), all right-hand sides
 * at once (headings, then every radiating dof), then the forces on the total incident
 * field alpha = direct incident + T~ beta,
 *   F = G~ alpha = G~ alpha_direct + (G~ T~) beta   (one zgemm, n_dof x n_u x n_rhs:
 *   the total field itself, n_u x n_u x n_rhs, is never formed),
 *   X = F (headings),   Z = Z_iso - F (radiation columns).
 * Scaled basis and index maps (each body and depth mode with its own orders
 * -M_iq..M_iq, chosen by the plan): array_impl.h. Incident wave of unit amplitude about the
 * centre c_i of body i (Jacobi-Anger): a_{0n} = -(i g / omega) P_i i^n e^{-i n beta},
 * P_i = exp(i k0 (x_i cos beta + y_i sin beta)). No allocation here. */
#include "array_impl.h"

#include "swellyield/special.h"

#include <cblas.h>
#include <lapacke.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

int sy_array_work_alloc(sy_array_work **out, const sy_array_plan *plan, sy_error *err)
{
    const size_t nu = plan->n_unknowns, nr = plan->n_rhs ? plan->n_rhs : 1, M = plan->M;
    sy_array_work *w = calloc(1, sizeof *w);
    int ok = w != NULL;
    if (ok) {
        w->n_types = plan->n_types;
        w->roots_k = malloc((plan->n_roots + 1) * sizeof *w->roots_k);
        w->bwork = calloc(plan->n_types, sizeof *w->bwork);
        w->bwaves = calloc(plan->n_types, sizeof *w->bwaves);
        w->scale = malloc(plan->n_types * plan->Q * (M + 1) * sizeof *w->scale);
        w->pairfn = malloc((plan->n_bodies * plan->n_bodies * plan->Q * (2 * M + 1)) * sizeof *w->pairfn);
        w->blk = malloc((2 * M + 1) * (2 * M + 1) * sizeof *w->blk);
        w->mat = malloc(nu * nu * sizeof *w->mat);
        w->pivots = malloc(nu * sizeof(lapack_int));
        w->inc = malloc(nu * nr * sizeof *w->inc);
        w->sol = malloc(nu * nr * sizeof *w->sol);
        w->fn = malloc((2 * M + 2) * sizeof *w->fn);
        w->force = malloc((plan->n_dof + 1) * nr * sizeof *w->force);
        w->gt = malloc((plan->n_dof + 1) * nu * sizeof *w->gt);
        ok = w->roots_k && w->bwork && w->bwaves && w->scale && w->pairfn && w->blk && w->mat && w->pivots &&
             w->inc && w->sol && w->fn && w->force && w->gt;
    }
    if (!ok) {
        sy_array_work_free(w);
        return sy_error_set(err, SY_ENOMEM, "array work for %zu unknowns (%.3g MB)", nu,
                            (double)(2 * nu * nu + 2 * nu * nr) * sizeof(double complex) / 1e6);
    }
    for (size_t t = 0; t < plan->n_types; t++) {
        int rc = sy_body_work_alloc(&w->bwork[t], plan->bplan[t], err);
        if (rc == SY_OK)
            rc = sy_body_waves_alloc(&w->bwaves[t], M, plan->Q, err);
        if (rc != SY_OK) {
            sy_array_work_free(w);
            return rc;
        }
    }
    *out = w;
    return SY_OK;
}

void sy_array_work_free(sy_array_work *w)
{
    if (w == NULL)
        return;
    for (size_t t = 0; w->bwork != NULL && t < w->n_types; t++)
        sy_body_work_free(w->bwork[t]);
    for (size_t t = 0; w->bwaves != NULL && t < w->n_types; t++)
        sy_body_waves_free(w->bwaves[t]);
    free(w->bwork);
    free(w->bwaves);
    free(w->roots_k);
    free(w->scale);
    free(w->pairfn);
    free(w->blk);
    free(w->mat);
    free(w->pivots);
    free(w->inc);
    free(w->sol);
    free(w->fn);
    free(w->force);
    free(w->gt);
    free(w);
}

int sy_array_hydro_alloc(sy_array_hydro **out, const sy_array_plan *plan, sy_error *err)
{
    size_t nd = plan->n_dof, nh = plan->n_headings;
    sy_array_hydro *r = calloc(1, sizeof *r);
    if (r != NULL) {
        r->n_dof = nd;
        r->n_headings = nh;
        r->impedance = calloc(nd * nd + 1, sizeof *r->impedance);
        r->added_mass = calloc(nd * nd + 1, sizeof *r->added_mass);
        r->damping = calloc(nd * nd + 1, sizeof *r->damping);
        r->excitation = calloc(nh * nd + 1, sizeof *r->excitation);
    }
    if (r == NULL || !r->impedance || !r->added_mass || !r->damping || !r->excitation) {
        sy_array_hydro_free(r);
        return sy_error_set(err, SY_ENOMEM, "array results for %zu dofs, %zu headings", nd, nh);
    }
    *out = r;
    return SY_OK;
}

void sy_array_hydro_free(sy_array_hydro *r)
{
    if (r == NULL)
        return;
    free(r->impedance);
    free(r->added_mass);
    free(r->damping);
    free(r->excitation);
    free(r);
}

/* a * b without C99 Annex G's infinity recovery (a branch and a library call per
 * product in the hot loops; the values here are finite by construction). */
static inline double complex cmul(double complex a, double complex b)
{
    double ar = creal(a), ai = cimag(a), br = creal(b), bi = cimag(b);
    return CMPLX(ar * br - ai * bi, ar * bi + ai * br);
}

static double complex wavenumber(const sy_array_work *w, size_t q)
{
    return q == 0 ? w->roots.k0 : w->roots.k[q - 1];
}

int syi_array_prepare(const sy_array_plan *plan, double complex omega, sy_array_work *w,
                      sy_error *err)
{
    const size_t M = plan->M, Q = plan->Q;
    if (!(creal(omega) > 0.0) || !isfinite(creal(omega)) || !isfinite(cimag(omega)))
        return sy_error_set(err, SY_EINVAL, "array: Re omega must be > 0 rad/s and finite, got %g%+gi",
                            creal(omega), cimag(omega));
    w->factored = 0;
    w->roots.k = w->roots_k;
    int rc = sy_waves_roots_fill(&w->roots, omega, plan->set.h, plan->set.g, plan->n_roots, err);
    if (rc != SY_OK) {
        sy_error_prefix(err, "array: roots at omega = %g%+gi rad/s", creal(omega), cimag(omega));
        return rc;
    }
    for (size_t t = 0; t < plan->n_types; t++) {
        rc = sy_body_solve(plan->bplan[t], &w->roots, plan->set.rho, w->bwork[t], w->bwaves[t], err);
        if (rc != SY_OK) {
            sy_error_prefix(err, "array: body type %zu at omega = %g%+gi rad/s", t, creal(omega),
                            cimag(omega));
            return rc;
        }
        double a = plan->types[t].geom.radius;
        for (size_t q = 0; q < Q; q++) {
            double complex x = wavenumber(w, q) * a;
            double *s = &w->scale[(t * Q + q) * (M + 1)];
            if (q == 0)
                rc = sy_special_hankel1_array((int)M, x, w->fn, err);
            else
                rc = sy_special_besselk_scaled_array((int)M, x, w->fn, err);
            if (rc != SY_OK) {
                sy_error_prefix(err, "array: scaling of type %zu, depth mode %zu", t, q);
                return rc;
            }
            /* |K_n(x)| = |Ks_n(x)| e^{-Re x} */
            double damp = q == 0 ? 1.0 : exp(-creal(x));
            for (size_t n = 0; n <= M; n++) {
                s[n] = cabs(w->fn[n]) * damp;
                if (!(s[n] > 0.0) || !isfinite(s[n]))
                    return sy_error_set(err, SY_ELOSS,
                                        "array: partial wave (q %zu, n %zu) of type %zu has "
                                        "|Hhat(k a)| = %g at k a = %g%+gi (under/overflow); "
                                        "reduce the depth modes or orders", q, n, t, s[n],
                                        creal(x), cimag(x));
            }
        }
    }
    return SY_OK;
}

int syi_array_translation(const sy_array_plan *plan, sy_array_work *w, sy_error *err)
{
    const size_t N = plan->n_bodies, M = plan->M, Q = plan->Q, np = 2 * M + 1;
    for (size_t i = 0; i < N; i++)
        for (size_t j = i + 1; j < N; j++) {
            double L = plan->pair_L[i * N + j];
            for (size_t q = 0; q < plan->pair_nq[i * N + j]; q++) {
                double complex k = wavenumber(w, q);
                double complex *f = &w->pairfn[((i * N + j) * Q + q) * np];
                /* orders |n - m| up to M_iq + M_jq of the block */
                size_t pmax = syi_array_order(plan, i, q) + syi_array_order(plan, j, q);
                int rc;
                if (q == 0) {
                    rc = sy_special_hankel1_array((int)pmax, k * L, f, err);
                } else {
                    rc = sy_special_besselk_scaled_array((int)pmax, k * L, f, err);
                    /* K(kL) = Ks(kL) e^{-kL}; the scales hold |K(k a)| itself */
                    double complex e = cexp(-k * L);
                    for (size_t p = 0; p <= pmax; p++)
                        f[p] *= e;
                }
                if (rc != SY_OK) {
                    sy_error_prefix(err, "array: translation between bodies %zu and %zu, mode %zu",
                                    i, j, q);
                    return rc;
                }
            }
        }
    return SY_OK;
}

void syi_array_block(const sy_array_plan *plan, const sy_array_work *w, size_t i, size_t j, size_t q,
                     double complex *out)
{
    const size_t N = plan->n_bodies, M = plan->M, Q = plan->Q;
    const long Mi = (long)syi_array_order(plan, i, q), Mj = (long)syi_array_order(plan, j, q);
    const size_t nc = (size_t)(2 * Mj + 1), pmax = (size_t)(Mi + Mj);
    const size_t lo = i < j ? i : j, hi = i < j ? j : i;
    const double complex *f = &w->pairfn[((lo * N + hi) * Q + q) * (2 * M + 1)];
    /* alpha is the direction from centre j to centre i (pair_alpha[i N + j]) */
    const double complex e1 = cexp(I * plan->pair_alpha[i * N + j]);
    const size_t ti = plan->bodies[i].type, tj = plan->bodies[j].type;
    double complex ph[4 * SY_ARRAY_MAX_ORDER + 1], *phase = ph + 2 * M;
    phase[0] = 1.0;
    for (size_t p = 1; p <= pmax; p++) {
        phase[p] = phase[p - 1] * e1;
        phase[-(long)p] = conj(phase[p]) / (creal(e1) * creal(e1) + cimag(e1) * cimag(e1));
    }
    for (long m = -Mi; m <= Mi; m++) {
        double si = syi_array_scale(plan, w, ti, q, m);
        /* (-1)^m of the K addition theorem (array.h) */
        double sgn_m = (q > 0 && (m & 1)) ? -1.0 : 1.0;
        double complex *row = &out[(size_t)(m + Mi) * nc];
        for (long n = -Mj; n <= Mj; n++) {
            long p = n - m, ap = p < 0 ? -p : p;
            double complex v = f[ap];
            if (q == 0 && p < 0 && (ap & 1))   /* H_{-p} = (-1)^p H_p; K_{-p} = K_p */
                v = -v;
            row[n + Mj] = sgn_m * v * phase[p] / (si * syi_array_scale(plan, w, tj, q, n));
        }
    }
}

/* D~ of body type t at order n (|n| <= M) between depth modes q, qp. The body stores
 * n >= 0. Mirror symmetry (theta -> -theta) maps the partial wave (q, n) to
 * sigma_q(n) (q, -n), sigma_0(n) = (-1)^n (J_{-n} = (-1)^n J_n, same for H) and
 * sigma_q(n) = 1 for q >= 1 (I_{-n} = I_n, K_{-n} = K_n), so
 *   D_{-n}(q, qp) = sigma_q(n) sigma_qp(n) D_n(q, qp):
 * the blocks coupling the propagating and an evanescent mode change sign for odd n. */
static double complex dscaled(const sy_array_plan *plan, const sy_array_work *w, size_t t, long n,
                              size_t q, size_t qp)
{
    size_t an = (size_t)(n < 0 ? -n : n), Q = plan->Q;
    double complex d = w->bwaves[t]->diffraction[(an * Q + q) * Q + qp] *
                       syi_array_scale(plan, w, t, q, n) * syi_array_scale(plan, w, t, qp, n);
    if (n < 0 && (an & 1) && ((q == 0) != (qp == 0)))
        d = -d;
    return d;
}

/* mat = I - D~ T~, block by block: rows (i, q, m), columns (j, q', n) get
 * -D~^i_m(q, q') T~^{ij}_{q'}[m, n] for |m| <= min(M_iq, M_iq') (an incident order
 * of mode q' that body i does not keep is below the tolerance, plan.c). With
 * radiation != 0 the same pass fills the direct incident columns of every radiating dof
 * of body j on body i: inc = T~^{ij} rho^j. */
static void assemble(const sy_array_plan *plan, sy_array_work *w, int radiation)
{
    const size_t N = plan->n_bodies, nn = plan->nn, nu = plan->n_unknowns;
    const size_t Q = plan->Q;
    const long Ml = (long)plan->M;
    memset(w->mat, 0, nu * nu * sizeof *w->mat);
    for (size_t u = 0; u < nu; u++)
        w->mat[u * nu + u] = 1.0;
    if (radiation)
        memset(w->gt, 0, plan->n_dof * nu * sizeof *w->gt);
    for (size_t i = 0; i < N; i++) {
        size_t ti = plan->bodies[i].type, nqi = plan->nq[i];
        for (size_t j = 0; j < N; j++) {
            if (j == i)
                continue;
            size_t tj = plan->bodies[j].type;
            for (size_t qp = 0; qp < plan->pair_nq[i * N + j]; qp++) {
                syi_array_block(plan, w, i, j, qp, w->blk);
                const long Mi = (long)syi_array_order(plan, i, qp), Mj = (long)syi_array_order(plan, j, qp);
                const size_t nc = (size_t)(2 * Mj + 1), col0 = syi_array_unknown(plan, j, qp, -Mj);
                for (size_t q = 0; q < nqi; q++) {
                    long Mq = (long)syi_array_order(plan, i, q);
                    if (Mq > Mi)
                        Mq = Mi;
                    for (long m = -Mq; m <= Mq; m++) {
                        double complex d = dscaled(plan, w, ti, m, q, qp);
                        if (d == 0.0)
                            continue;
                        double complex *out = &w->mat[syi_array_unknown(plan, i, q, m) * nu + col0];
                        const double complex *b = &w->blk[(size_t)(m + Mi) * nc];
                        for (size_t c = 0; c < nc; c++)
                            out[c] -= cmul(d, b[c]);
                    }
                }
                if (!radiation)
                    continue;
                for (size_t d = plan->dof_off[i]; d < plan->dof_off[i + 1]; d++) {
                    const double complex *G = &w->bwaves[ti]->force[((size_t)(plan->dof_mode[d] - 1) * Q + qp) * nn];
                    double complex *out = &w->gt[d * nu + col0];
                    for (long m = -Mi; m <= Mi; m++) {
                        double complex g = G[m + Ml] * syi_array_scale(plan, w, ti, qp, m);
                        if (g == 0.0)
                            continue;
                        const double complex *b = &w->blk[(size_t)(m + Mi) * nc];
                        for (size_t c = 0; c < nc; c++)
                            out[c] += cmul(g, b[c]);
                    }
                }
                if (plan->types[tj].geom.kind != SY_BODY_FLOAT)
                    continue;
                for (size_t r = plan->rad_first[j]; r < plan->rad_first[j + 1]; r++) {
                    int mode = plan->dof_mode[plan->rad_dof[r]];
                    const double complex *R = &w->bwaves[tj]->radiation[((size_t)(mode - 1) * Q + qp) * nn];
                    size_t col = plan->n_headings + r;
                    for (long m = -Mi; m <= Mi; m++) {
                        const double complex *b = &w->blk[(size_t)(m + Mi) * nc];
                        double complex acc = 0.0;
                        for (long n = -Mj; n <= Mj; n++)
                            acc += b[n + Mj] * R[n + Ml] * syi_array_scale(plan, w, tj, qp, n);
                        w->inc[col * nu + syi_array_unknown(plan, i, qp, m)] = acc;
                    }
                }
            }
        }
    }
}

static int factorise(const sy_array_plan *plan, sy_array_work *w, double complex omega, sy_error *err)
{
    const size_t nu = plan->n_unknowns;
    /* mat is row-major; read as column-major it is its transpose, whose LU LAPACK computes
     * in place (LAPACKE's row-major path would copy and transpose n_u^2 values twice).
     * Solves then use trans = 'T'; det(A^T) = det(A). */
    lapack_int info = LAPACKE_zgetrf(LAPACK_COL_MAJOR, (lapack_int)nu, (lapack_int)nu, w->mat,
                                     (lapack_int)nu, (lapack_int *)w->pivots);
    if (info > 0)
        return sy_error_set(err, SY_ESINGULAR,
                            "array: interaction matrix I - D T singular at omega = %g%+gi rad/s "
                            "(zero pivot %d of %zu)", creal(omega), cimag(omega), (int)info, nu);
    if (info < 0)
        return sy_error_set(err, SY_EINVAL, "array: zgetrf argument %d invalid", (int)-info);
    w->factored = 1;
    w->omega = omega;
    return SY_OK;
}

/* Direct incident ambient waves: heading columns of w->inc (scaled alpha). */
static void incident_waves(const sy_array_plan *plan, sy_array_work *w, double complex omega)
{
    const size_t N = plan->n_bodies, nu = plan->n_unknowns;
    const long Ml = (long)plan->M;
    const double complex k0 = w->roots.k0, amp = -I * plan->set.g / omega;
    /* headings: only q = 0 of the ambient wave is non-zero */
    for (size_t i = 0; i < N; i++) {
        size_t t = plan->bodies[i].type;
        for (size_t b = 0; b < plan->n_headings; b++) {
            double beta = plan->headings[b];
            double complex pi = amp * cexp(I * k0 * (plan->bodies[i].x * cos(beta) + plan->bodies[i].y * sin(beta)));
            double complex step = I * cexp(-I * beta);   /* i e^{-i beta}, |step| = 1 */
            double complex fp = pi, fm = pi;
            for (long n = 0; n <= Ml; n++) {
                /* n >= 0: i^n e^{-i n beta};  -n: i^{-n} e^{i n beta} */
                double s = syi_array_scale(plan, w, t, 0, n);
                w->inc[b * nu + syi_array_unknown(plan, i, 0, n)] = fp / s;
                w->inc[b * nu + syi_array_unknown(plan, i, 0, -n)] = fm / s;
                fp *= step;
                fm /= step;
            }
        }
    }
}

/* Right-hand sides sol = D~ inc (every column). */
static void apply_diffraction(const sy_array_plan *plan, sy_array_work *w)
{
    const size_t N = plan->n_bodies, nr = plan->n_rhs, nu = plan->n_unknowns;
    memset(w->sol, 0, nu * nr * sizeof *w->sol);
    for (size_t i = 0; i < N; i++) {
        size_t t = plan->bodies[i].type, nq = plan->nq[i];
        for (size_t q = 0; q < nq; q++) {
            const long Mq = (long)syi_array_order(plan, i, q);
            for (long m = -Mq; m <= Mq; m++) {
                size_t row = syi_array_unknown(plan, i, q, m);
                for (size_t qp = 0; qp < nq; qp++) {
                    double complex dd = dscaled(plan, w, t, m, q, qp);
                    if (dd == 0.0 || labs(m) > (long)syi_array_order(plan, i, qp))
                        continue;
                    size_t src = syi_array_unknown(plan, i, qp, m);
                    for (size_t c = 0; c < nr; c++)
                        w->sol[c * nu + row] += cmul(dd, w->inc[c * nu + src]);
                }
            }
        }
    }
}

int sy_array_solve(const sy_array_plan *plan, double complex omega, sy_array_work *w,
                   sy_array_hydro *res, sy_error *err)
{
    if (plan == NULL || w == NULL || res == NULL)
        return sy_error_set(err, SY_EINVAL, "array solve: NULL argument");
    if (res->n_dof != plan->n_dof || res->n_headings != plan->n_headings)
        return sy_error_set(err, SY_EINVAL, "array solve: result sized for %zu dofs, %zu headings; plan has %zu, %zu",
                            res->n_dof, res->n_headings, plan->n_dof, plan->n_headings);
    const size_t N = plan->n_bodies, nn = plan->nn, nu = plan->n_unknowns, nr = plan->n_rhs;
    const size_t Q = plan->Q, nd = plan->n_dof;
    const long Ml = (long)plan->M;
    int rc = syi_array_prepare(plan, omega, w, err);
    if (rc == SY_OK)
        rc = syi_array_translation(plan, w, err);
    if (rc != SY_OK)
        return rc;
    memset(w->inc, 0, nu * nr * sizeof *w->inc);
    incident_waves(plan, w, omega);
    assemble(plan, w, 1);
    apply_diffraction(plan, w);
    rc = factorise(plan, w, omega, err);
    if (rc != SY_OK)
        return rc;
    if (nr > 0) {
        /* mat holds the LU of the transpose (see factorise): solve with 'T' */
        lapack_int info = LAPACKE_zgetrs(LAPACK_COL_MAJOR, 'T', (lapack_int)nu, (lapack_int)nr, w->mat,
                                         (lapack_int)nu, (const lapack_int *)w->pivots, w->sol, (lapack_int)nu);
        if (info != 0)
            return sy_error_set(err, SY_EINVAL, "array: zgetrs argument %d invalid", (int)-info);
    }
    /* forces on the direct incident field, F[d, c] = sum G~ alpha_direct, then
     * F += (G~ T~) beta below */
    for (size_t d = 0; d < nd; d++) {
        size_t i = plan->dof_body[d], t = plan->bodies[i].type;
        int mode = plan->dof_mode[d];
        const double complex *G = &w->bwaves[t]->force[(size_t)(mode - 1) * Q * nn];
        double complex *f = &w->force[d * nr];
        memset(f, 0, nr * sizeof *f);
        for (size_t q = 0; q < plan->nq[i]; q++) {
            const long Mq = (long)syi_array_order(plan, i, q);
            for (long n = -Mq; n <= Mq; n++) {
                double complex g = G[q * nn + (size_t)(n + Ml)] * syi_array_scale(plan, w, t, q, n);
                if (g == 0.0)
                    continue;
                size_t u = syi_array_unknown(plan, i, q, n);
                for (size_t c = 0; c < nr; c++)
                    f[c] += cmul(g, w->inc[c * nu + u]);
            }
        }
    }
    if (nd > 0 && nr > 0) {
        /* force (row-major n_dof x n_rhs) += gt (row-major n_dof x n_u) sol (column-major
         * n_u x n_rhs, i.e. the transpose of a row-major n_rhs x n_u) */
        const double complex one = 1.0;
        cblas_zgemm(CblasRowMajor, CblasNoTrans, CblasTrans, (int)nd, (int)nr, (int)nu, &one, w->gt, (int)nu,
                    w->sol, (int)nu, &one, w->force, (int)nr);
    }
    (void)N;
    res->omega = omega;
    res->k0 = w->roots.k0;
    res->convergence = 0.0;
    for (size_t t = 0; t < plan->n_types; t++)
        if (w->bwaves[t]->convergence > res->convergence)
            res->convergence = w->bwaves[t]->convergence;
    int real_axis = cimag(omega) == 0.0;
    res->cg = real_axis ? sy_waves_group_velocity(creal(omega), creal(w->roots.k0), plan->set.h) : NAN;
    for (size_t b = 0; b < plan->n_headings; b++)
        for (size_t d = 0; d < nd; d++)
            res->excitation[b * nd + d] = w->force[d * nr + b];
    memset(res->impedance, 0, nd * nd * sizeof *res->impedance);
    for (size_t r = 0; r < plan->n_rad; r++) {
        size_t e = plan->rad_dof[r], col = plan->n_headings + r;
        size_t ie = plan->dof_body[e], te = plan->bodies[ie].type;
        int me = plan->dof_mode[e];
        for (size_t d = 0; d < nd; d++) {
            size_t id = plan->dof_body[d];
            if (plan->types[plan->bodies[id].type].geom.kind != SY_BODY_FLOAT)
                continue;
            double complex z = -w->force[d * nr + col];
            if (id == ie) {
                int md = plan->dof_mode[d];
                size_t k = (size_t)(md - 1) * SY_BODY_NMODES + (size_t)(me - 1);
                z += w->bwaves[te]->damping[k] - I * omega * w->bwaves[te]->added_mass[k];
            }
            res->impedance[d * nd + e] = z;
        }
    }
    for (size_t k = 0; k < nd * nd; k++) {
        if (real_axis) {
            res->damping[k] = creal(res->impedance[k]);
            res->added_mass[k] = -cimag(res->impedance[k]) / creal(omega);
        } else {
            res->damping[k] = NAN;
            res->added_mass[k] = NAN;
        }
    }
    return SY_OK;
}

int sy_array_interaction_logdet(const sy_array_plan *plan, double complex omega, sy_array_work *w,
                                double complex *logdet, sy_error *err)
{
    if (plan == NULL || w == NULL || logdet == NULL)
        return sy_error_set(err, SY_EINVAL, "array logdet: NULL argument");
    int rc = syi_array_prepare(plan, omega, w, err);
    if (rc == SY_OK)
        rc = syi_array_translation(plan, w, err);
    if (rc != SY_OK)
        return rc;
    assemble(plan, w, 0);
    rc = factorise(plan, w, omega, err);
    if (rc != SY_OK)
        return rc;
    return sy_array_factored_logdet(plan, w, logdet, err);
}

int sy_array_factored_logdet(const sy_array_plan *plan, const sy_array_work *w, double complex *logdet,
                             sy_error *err)
{
    if (!w->factored)
        return sy_error_set(err, SY_EINVAL, "array logdet: no factorisation in this work");
    const size_t nu = plan->n_unknowns;
    const lapack_int *piv = (const lapack_int *)w->pivots;
    double complex s = 0.0;
    size_t swaps = 0;
    for (size_t r = 0; r < nu; r++) {
        s += clog(w->mat[r * nu + r]);
        if ((size_t)piv[r] != r + 1)
            swaps++;
    }
    if (swaps & 1)
        s += I * SY_ARRAY_PI;
    *logdet = s;
    return SY_OK;
}

int sy_array_interaction_solve(const sy_array_plan *plan, sy_array_work *w, const double complex *rhs,
                               double complex *x, sy_error *err)
{
    if (plan == NULL || w == NULL || rhs == NULL || x == NULL)
        return sy_error_set(err, SY_EINVAL, "array interaction solve: NULL argument");
    if (!w->factored)
        return sy_error_set(err, SY_EINVAL, "array interaction solve: no factorisation in this work");
    const size_t nu = plan->n_unknowns;
    if (x != rhs)
        memcpy(x, rhs, nu * sizeof *x);
    lapack_int info = LAPACKE_zgetrs(LAPACK_COL_MAJOR, 'T', (lapack_int)nu, 1, w->mat, (lapack_int)nu,
                                     (const lapack_int *)w->pivots, x, (lapack_int)nu);
    if (info != 0)
        return sy_error_set(err, SY_EINVAL, "array: zgetrs argument %d invalid", (int)-info);
    return SY_OK;
}
