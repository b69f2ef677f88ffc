/* Floating truncated vertical cylinder: the per-frequency solve (method in float_plan.c).
 * One code path for real and complex omega: every quantity below is an analytic function
 * of omega built from the roots k_q(omega) and Bessel functions (no conj, no modulus in
 * the physics; the modulus appears only in pivoting and in the convergence estimate).
 * Deep-water safe: cosh ratios are written with e^{-k0 d}, e^{-2 k0 h} (Re k0 > 0).
 *
 * Per order m the Galerkin unknowns are alpha_p (gap velocity u = sum alpha_p f_p) and,
 * for m = 0, the constant interior mode c_0 with the flux constraint
 * int_gap u dz = int_gap d_r phi_particular dz. Columns solved together: the Q incident
 * depth modes (diffraction) and, for m <= 1, the radiation profiles
 *   heave  (m = 0): wall u = 0, bottom dphi/dz = 1,
 *   surge  (m = 1): wall u = 1, bottom 0,
 *   pitch  (m = 1): wall u = z - z_rot, bottom dphi/dz = -r,
 * whose e^{i m theta} weights nu_{j,m} give the five rigid modes (see nu_mode below).
 * Profile functionals Pi_i[phi] = a int_wall phi V_i dz - int_0^a phi(r, -d) W_i r dr
 * give the generalised forces F_i = -i omega rho 2 pi sum_m nu_{i,-m} Pi_i[phi_m]. */
#include "float_impl.h"
#include "swellyield/special.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

enum { PR_HEAVE = 0, PR_SURGE = 1, PR_PITCH = 2 };

/* nu_{j,m}: mode j (0..4) as sum_m nu_{j,m} e^{i m theta} times its profile
 * (surge cos, sway sin, heave 1, roll -sin, pitch cos). */
static double complex nu_mode(int j, int m)
{
    switch (j) {
    case 0: return (m == 1 || m == -1) ? 0.5 : 0.0;
    case 1: return m == 1 ? -0.5 * I : m == -1 ? 0.5 * I : 0.0;
    case 2: return m == 0 ? 1.0 : 0.0;
    case 3: return m == 1 ? 0.5 * I : m == -1 ? -0.5 * I : 0.0;
    case 4: return (m == 1 || m == -1) ? 0.5 : 0.0;
    }
    return 0.0;
}
static const int profile_of[5] = {PR_SURGE, PR_SURGE, PR_HEAVE, PR_PITCH, PR_PITCH};

/* Per-mode depth data for q = 0..Qx: projections, norms, kappa; q < Q output data. */
static int modes(const syi_float_plan *fp, const sy_wave_roots *roots, syi_float_work *w,
                 sy_error *err)
{
    const size_t P = fp->PG, L = fp->L, M = fp->M, Q = fp->Q;
    const double a = fp->a, b = fp->b, d = fp->d, h = fp->h;
    double complex *v = w->kbuf, *dv = w->kbuf2;
    int rc = SY_OK;
    for (size_t q = 0; q < w->nq && rc == SY_OK; q++) {
        double complex *g = w->proj + q * L;
        double complex *kap = w->kap + q * (M + 1);
        if (q == 0) {
            double complex k = roots->k0, x = k * b;
            double complex e2 = cexp(-2.0 * k * h), ed = cexp(-k * d), eh = cexp(-k * (h + b));
            double complex den = 1.0 + e2;
            /* special.h scales I by e^{-|Re x|}, not analytic in x; times e^{-i Im x} it
             * becomes I e^{-x}, which is */
            double complex unscale = cexp(-I * cimag(x));
            for (size_t p = 0; p < P && rc == SY_OK; p++) {
                double complex iv;
                double nl = fp->nu_l[p];
                rc = sy_special_besseli_nu_scaled(nl + 2.0 * fp->ord_l[p], x, &iv, err);
                /* I e^{-x} * e^{x} / cosh(k h) = I_scaled 2 e^{-k d} / (1 + e^{-2kh}) */
                g[p] = b * cpow(x, -nl) * iv * unscale * 2.0 * ed / den;
            }
            if (rc != SY_OK)
                break;
            double complex th = (1.0 - e2) / den;                 /* tanh(k h) */
            double complex ch = (ed + eh) / den;                  /* cosh(k b) / cosh(k h) */
            /* extended wall functions (float_impl.h): int Z_0 dz, int max(z, -d) Z_0 dz */
            g[P] = th / k;
            g[P + 1] = -(1.0 - ch) / (k * k);
            w->norm[q] = th / (2.0 * k) + 2.0 * h * e2 / (den * den);
            double complex x2 = k * a;
            rc = sy_special_hankel1_array((int)M + 1, x2, v, err);
            if (rc != SY_OK)
                break;
            for (size_t m = 0; m <= M; m++)
                dv[m] = (m == 0) ? -v[1] : v[m - 1] - (double)m / x2 * v[m];
            for (size_t m = 0; m <= M; m++)
                kap[m] = v[m] / (k * dv[m]);
            if (Q > 0) {
                for (size_t m = 0; m <= M; m++) {
                    w->inh[m * Q] = 1.0 / (w->norm[q] * k * dv[m]);
                    w->w_hp[m * Q] = 2.0 * I / (SYI_PI * a) / (k * dv[m]);  /* W[J, H] = 2i/(pi x) */
                }
                rc = sy_special_besselj_array((int)M + 1, x2, v, err);
                if (rc != SY_OK)
                    break;
                for (size_t m = 0; m <= M; m++) {
                    double complex jd = (m == 0) ? -v[1] : v[m - 1] - (double)m / x2 * v[m];
                    w->ip_hp[m * Q] = jd / dv[m];
                }
            }
        } else {
            double complex k = roots->k[q - 1];
            rc = syi_float_proj_cos(fp, 2, k, g, err);
            if (rc != SY_OK)
                break;
            double complex c = ccos(k * h);
            for (size_t l = 0; l < L; l++)
                g[l] /= c;
            w->norm[q] = (h / 2.0 + csin(2.0 * k * h) / (4.0 * k)) / (c * c);
            double complex x2 = k * a;
            rc = sy_special_besselk_scaled_array((int)M + 1, x2, v, err);
            if (rc != SY_OK)
                break;
            for (size_t m = 0; m <= M; m++)
                dv[m] = (m == 0) ? -v[1] : -v[m - 1] - (double)m / x2 * v[m];
            for (size_t m = 0; m <= M; m++)
                kap[m] = v[m] / (k * dv[m]);
            if (q < Q) {
                /* scaled K e^{x}, I e^{-x}: Hhat' = k K' = k dv e^{-x} */
                double complex ex = cexp(x2);
                for (size_t m = 0; m <= M; m++) {
                    w->inh[m * Q + q] = ex / (w->norm[q] * k * dv[m]);
                    w->w_hp[m * Q + q] = -ex / (a * k * dv[m]);
                }
                rc = sy_special_besseli_scaled_array((int)M + 1, x2, v, err);
                if (rc != SY_OK)
                    break;
                /* special scales I by e^{-|Re x|} (Re x > 0): times e^{-i Im x} gives the
                 * analytic I e^{-x}, so I = v e^{-i Im x} e^{x} */
                double complex unscale = cexp(-I * cimag(x2));
                for (size_t m = 0; m <= M; m++) {
                    double complex id = (m == 0) ? v[1] : v[m - 1] - (double)m / x2 * v[m];
                    w->ip_hp[m * Q + q] = id * unscale / dv[m] * ex * ex;
                }
            }
        }
    }
    return rc;
}

/* Exterior Gram sums per level: direct sum to Qx[rung] plus the reference tail. */
static void gram(const syi_float_plan *fp, double complex K, syi_float_work *w)
{
    const size_t L = fp->L, M = fp->M, P = fp->PG;
    const size_t n = (M + 1) * L * L;
    memset(w->ext, 0, SYI_FLOAT_LEVELS * n * sizeof *w->ext);
    double complex *fine = w->ext + n, *coarse = w->ext;
    for (size_t q = 0; q < w->nq; q++) {
        const double complex *g = w->proj + q * L;
        const double complex invn = 1.0 / w->norm[q];
        for (size_t m = 0; m <= M; m++) {
            double complex c = w->kap[q * (M + 1) + m] * invn;
            size_t Lm = (m <= 1) ? L : P;
            double complex *e = fine + m * L * L;
            for (size_t l = 0; l < Lm; l++) {
                double complex cl = c * g[l];
                for (size_t lp = l; lp < Lm; lp++)
                    e[l * L + lp] += cl * g[lp];
            }
        }
        if (q == fp->Qx[w->qc])
            memcpy(coarse, fine, n * sizeof *fine);
    }
    for (int lev = 0; lev < SYI_FLOAT_LEVELS; lev++) {
        double complex *e = w->ext + lev * n;
        size_t r = lev ? w->qf : w->qc;
        for (size_t m = 0; m <= M; m++)
            for (size_t l = 0; l < L; l++)
                for (size_t lp = l; lp < L; lp++) {
                    size_t i = (m * L + l) * L + lp;
                    e[i] += fp->rtail[r][i] + K * (fp->t1[r][i] + K * fp->t2[r][i]);
                    e[(m * L + lp) * L + l] = e[i];
                }
    }
}

/* Solved columns of one order at one level. */
typedef struct {
    size_t n;          /* unknowns: P (+1 for m = 0) */
    size_t P;
    const size_t *idx; /* basis index of each gap unknown */
    size_t ncol;       /* columns: Q diffraction (or 1) then radiation profiles */
    size_t nrad;       /* radiation columns (m = 0: 1, m = 1: 2, else 0) */
} cols;

/* Wall-function coefficients (v_1, v_z) of a profile: surge (1, 0), pitch (-z_rot, 1). */
static void wall_coef(const syi_float_plan *fp, int prof, double *v1, double *vz)
{
    *v1 = (prof == PR_SURGE) ? 1.0 : (prof == PR_PITCH) ? -fp->z_rot : 0.0;
    *vz = (prof == PR_PITCH) ? 1.0 : 0.0;
}

/* Pi_i for profile i of the solution in column c: the wall part is the Galerkin residual
 * form tested with the extended wall function of i (exterior minus interior potential
 * on the gap cancels to the wall integral), the bottom part from the interior modes. */
static double complex functional(const syi_float_plan *fp, const syi_float_work *w,
                                 const double complex *e, const double *s, size_t m,
                                 const cols *cs, size_t c, int prof_i, int prof_j, int is_rad,
                                 size_t qinc)
{
    const size_t L = fp->L, P1 = fp->PG;
    const double complex *x = w->rhs;
    const size_t nc = cs->ncol;
    double v1, vz, u1 = 0.0, uz = 0.0;
    wall_coef(fp, prof_i, &v1, &vz);
    if (is_rad)
        wall_coef(fp, prof_j, &u1, &uz);
    double complex wall = 0.0, bot = 0.0;
    if (v1 != 0.0 || vz != 0.0) {
        for (size_t i = 0; i < cs->P; i++) {
            size_t p = cs->idx[i];
            double complex e1 = e[P1 * L + p] - s[P1 * L + p];
            double complex ez = e[(P1 + 1) * L + p] - s[(P1 + 1) * L + p];
            wall += (v1 * e1 + vz * ez) * x[i * nc + c];
        }
        if (is_rad) {
            for (size_t r = P1; r < P1 + 2; r++) {
                double ur = (r == P1) ? u1 : uz;
                double complex e1 = e[P1 * L + r] - s[P1 * L + r];
                double complex ez = e[(P1 + 1) * L + r] - s[(P1 + 1) * L + r];
                wall += (v1 * e1 + vz * ez) * ur;
            }
            if (prof_j == PR_PITCH)
                wall += v1 * (fp->pint_pitch[P1] - fp->phi_pitch[P1]) +
                        vz * (fp->pint_pitch[P1 + 1] - fp->phi_pitch[P1 + 1]);
        } else {
            const double complex *g = w->proj + qinc * L;
            wall += w->w_hp[m * fp->Q + qinc] * (v1 * g[P1] + vz * g[P1 + 1]);
        }
        wall *= fp->a;
    }
    if (prof_i == PR_HEAVE) {
        for (size_t i = 0; i < cs->P; i++)
            bot += fp->bg_heave[cs->idx[i]] * x[i * nc + c];
        bot += fp->bw0_heave * x[cs->P * nc + c];
        if (is_rad && prof_j == PR_HEAVE)
            bot += fp->bpp_heave;
    } else if (prof_i == PR_PITCH) {
        for (size_t i = 0; i < cs->P; i++)
            bot += fp->bg_pitch[cs->idx[i]] * x[i * nc + c];
        if (is_rad) {
            bot += fp->bg_pitch[P1] * u1 + fp->bg_pitch[P1 + 1] * uz;
            if (prof_j == PR_PITCH)
                bot += fp->bpp_pitch - fp->bp_pitch;
        }
    }
    return wall - bot;
}

/* Assemble and solve order m at level lev; columns in w->rhs. full: all Q diffraction
 * columns (else only q' = 0). */
static int order_solve(const syi_float_plan *fp, syi_float_work *w, size_t m, int lev,
                       int full, cols *cs, sy_error *err)
{
    const size_t L = fp->L, P1 = fp->PG, Q = fp->Q;
    const size_t P = fp->P[lev];
    const size_t *ix = fp->gidx[lev];
    const double complex *e = w->ext + (size_t)lev * (fp->M + 1) * L * L + m * L * L;
    const double *s = fp->sint + m * L * L;
    size_t n = P + (m == 0);
    size_t nd = full ? Q : 1;
    size_t nrad = (m == 0) ? 1 : (m == 1) ? 2 : 0;
    size_t nc = nd + nrad;
    cs->n = n;
    cs->P = P;
    cs->idx = ix;
    cs->ncol = nc;
    cs->nrad = nrad;
    double complex *A = w->mat, *r = w->rhs;
    for (size_t i = 0; i < P; i++)
        for (size_t j = 0; j < P; j++)
            A[i * n + j] = e[ix[i] * L + ix[j]] - s[ix[i] * L + ix[j]];
    if (m == 0) {
        for (size_t i = 0; i < P; i++) {
            A[i * n + P] = -fp->b * fp->m0[ix[i]];   /* -c_0 G_{p0} */
            A[P * n + i] = fp->b * fp->m0[ix[i]];    /* flux constraint */
        }
        A[P * n + P] = 0.0;
    }
    for (size_t c = 0; c < nd; c++) {
        const double complex *g = w->proj + c * L;
        for (size_t i = 0; i < P; i++)
            r[i * nc + c] = -w->w_hp[m * Q + c] * g[ix[i]];
        if (m == 0)
            r[P * nc + c] = 0.0;
    }
    if (m == 0) {
        for (size_t i = 0; i < P; i++)
            r[i * nc + nd] = fp->phi_heave[ix[i]];
        r[P * nc + nd] = fp->p0_heave;
    } else if (m == 1) {
        const double zr = fp->z_rot;
        for (size_t i = 0; i < P; i++) {
            size_t li = ix[i];
            double complex g1 = e[li * L + P1] - s[li * L + P1];
            double complex gz = e[li * L + P1 + 1] - s[li * L + P1 + 1];
            r[i * nc + nd] = -g1;
            r[i * nc + nd + 1] = -(-zr * g1 + gz) - fp->pint_pitch[li] + fp->phi_pitch[li];
        }
    }
    return syi_float_lsolve(A, n, r, nc, err);
}

/* Exterior coefficient beta_q of column c (q < Q). */
static double complex beta(const syi_float_plan *fp, const syi_float_work *w, size_t m,
                           const cols *cs, size_t c, int prof, int is_rad, size_t qinc, size_t q)
{
    const size_t L = fp->L, P1 = fp->PG, Q = fp->Q;
    const double complex *g = w->proj + q * L;
    double complex s = 0.0;
    for (size_t i = 0; i < cs->P; i++)
        s += w->rhs[i * cs->ncol + c] * g[cs->idx[i]];
    if (is_rad) {
        if (prof == PR_SURGE)
            s += g[P1];
        if (prof == PR_PITCH)
            s += -fp->z_rot * g[P1] + g[P1 + 1];
    }
    s *= w->inh[m * Q + q];
    if (!is_rad && q == qinc)
        s -= w->ip_hp[m * Q + q];
    return s;
}

int syi_float_solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                    syi_float_work *w, sy_body_waves *out, sy_error *err)
{
    const syi_float_plan *fp = plan->impl;
    const size_t Q = fp->Q, Mo = plan->n_order, nn = 2 * Mo + 1, L = fp->L;
    const double complex omega = roots->omega;
    const double complex K = omega * omega / roots->g;
    /* exterior rung for this frequency (float_impl.h) */
    size_t f = 1;
    double need = 2.0 * fp->b * cabs(K) / SYI_PI;   /* modulus: a truncation choice only */
    while (f + 1 < fp->nqlev && need / (double)fp->Qx[f] > fp->q_ratio)
        f++;
    w->qf = f;
    w->qc = f - 1;
    w->nq = fp->Qx[f] + 1;
    int rc = modes(fp, roots, w, err);
    if (rc != SY_OK) {
        sy_error_prefix(err, "float at omega = %g%+gi rad/s", creal(omega), cimag(omega));
        return rc;
    }
    gram(fp, K, w);
    memset(out->diffraction, 0, (Mo + 1) * Q * Q * sizeof *out->diffraction);
    memset(out->radiation, 0, SY_BODY_NMODES * Q * nn * sizeof *out->radiation);
    memset(out->force, 0, SY_BODY_NMODES * Q * nn * sizeof *out->force);
    double complex pi_rad[SYI_FLOAT_LEVELS][3][3];   /* Pi_i[phi_j] by profile */
    double complex d00[SYI_FLOAT_LEVELS][2] = {{0}};  /* D_0(0,0), D_1(0,0) */
    double dmax = 0.0, ddiff = 0.0;
    memset(pi_rad, 0, sizeof pi_rad);
    for (size_t m = 0; m <= fp->M; m++) {
        for (int lev = SYI_FLOAT_LEVELS - 1; lev >= 0; lev--) {
            int fine = lev == SYI_FLOAT_LEVELS - 1;
            if (!fine && m > 1)
                break;   /* the coarse level checks orders 0 and 1 (A, B, D_0, D_1) */
            cols cs;
            rc = order_solve(fp, w, m, lev, fine && m <= Mo, &cs, err);
            if (rc != SY_OK) {
                sy_error_prefix(err, "float order %zu at omega = %g%+gi rad/s", m, creal(omega),
                                cimag(omega));
                return rc;
            }
            const double complex *e = w->ext + (size_t)lev * (fp->M + 1) * L * L + m * L * L;
            const double *sm = fp->sint + m * L * L;
            size_t nd = cs.ncol - cs.nrad;
            double complex b00 = beta(fp, w, m, &cs, 0, 0, 0, 0, 0);
            if (m <= 1)
                d00[lev][m] = b00;
            if (fine && m <= Mo) {
                for (size_t c = 0; c < nd; c++)
                    for (size_t q = 0; q < Q; q++)
                        out->diffraction[(m * Q + q) * Q + c] = beta(fp, w, m, &cs, c, 0, 0, c, q);
                if (cabs(b00) > dmax)
                    dmax = cabs(b00);
            }
            int profs[2] = {PR_HEAVE, PR_HEAVE};
            if (m == 1) {
                profs[0] = PR_SURGE;
                profs[1] = PR_PITCH;
            }
            for (size_t jr = 0; jr < cs.nrad; jr++) {
                int pj = profs[jr];
                for (size_t ir = 0; ir < cs.nrad; ir++)
                    pi_rad[lev][profs[ir]][pj] = functional(fp, w, e, sm, m, &cs, nd + jr, profs[ir], pj, 1, 0);
                if (fine)
                    for (size_t q = 0; q < Q; q++)
                        w->rt[pj * Q + q] = beta(fp, w, m, &cs, nd + jr, pj, 1, 0, q);
            }
            if (fine && m <= Mo)
                for (size_t ir = 0; ir < cs.nrad; ir++)
                    for (size_t c = 0; c < nd; c++)
                        w->fdif[profs[ir] * Q + c] = functional(fp, w, e, sm, m, &cs, c, profs[ir], 0, 0, c);
        }
    }
    /* Radiation: X_ij = 2 pi sum_m nu_{i,-m} nu_{j,m} Pi_{prof i}[phi_{prof j}] */
    double complex X[2][5][5];
    for (int lev = 0; lev < SYI_FLOAT_LEVELS; lev++)
        for (int i = 0; i < 5; i++)
            for (int j = 0; j < 5; j++) {
                double complex s = 0.0;
                for (int mm = -1; mm <= 1; mm++)
                    s += nu_mode(i, -mm) * nu_mode(j, mm);
                X[lev][i][j] = 2.0 * SYI_PI * s * pi_rad[lev][profile_of[i]][profile_of[j]];
            }
    int real_axis = cimag(omega) == 0.0;
    double xmax = 0.0, xdiff = 0.0;
    for (int i = 0; i < 5; i++)
        for (int j = 0; j < 5; j++) {
            double complex z = I * omega * rho * X[1][i][j];   /* B - i omega A */
            if (real_axis) {
                out->damping[i * 5 + j] = creal(z);
                out->added_mass[i * 5 + j] = -cimag(z) / creal(omega);
            } else {
                /* analytic continuation: only B - i omega A is defined; carried in A */
                out->damping[i * 5 + j] = 0.0;
                out->added_mass[i * 5 + j] = I * z / omega;
            }
            if (cabs(X[1][i][j]) > xmax)
                xmax = cabs(X[1][i][j]);
            if (cabs(X[1][i][j] - X[0][i][j]) > xdiff)
                xdiff = cabs(X[1][i][j] - X[0][i][j]);
        }
    for (int m = 0; m < 2; m++)
        if (cabs(d00[1][m] - d00[0][m]) > ddiff)
            ddiff = cabs(d00[1][m] - d00[0][m]);
    if (dmax < cabs(d00[1][0]))
        dmax = cabs(d00[1][0]);
    out->convergence = fmax(xmax > 0 ? xdiff / xmax : xdiff, dmax > 0 ? ddiff / dmax : ddiff);
    /* R_j(q, n) = nu_{j,n} s(q,n) Rtilde_{prof j}(q); s = (-1)^n for q = 0, n < 0
     * (H_{-n} = (-1)^n H_n; K_{-n} = K_n). G likewise with nu_{i,-n}. */
    for (int j = 0; j < 5; j++)
        for (int n = -1; n <= 1; n++) {
            if ((size_t)abs(n) > Mo)
                continue;
            double complex nuj = nu_mode(j, n), nui = nu_mode(j, -n);
            if (nuj == 0.0 && nui == 0.0)
                continue;
            for (size_t q = 0; q < Q; q++) {
                double s = (q == 0 && n < 0) ? -1.0 : 1.0;   /* n = -1 odd */
                size_t idx = ((size_t)j * Q + q) * nn + (size_t)(n + (int)Mo);
                out->radiation[idx] = nuj * s * w->rt[profile_of[j] * Q + q];
                out->force[idx] = -I * omega * rho * 2.0 * SYI_PI * nui * s * w->fdif[profile_of[j] * Q + q];
            }
        }
    return SY_OK;
}
