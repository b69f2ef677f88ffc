/* Floating truncated vertical cylinder: geometry-only set-up (omega independent).
 *
 * Method (per angular order m, e^{i m theta}): eigenfunction expansions in the exterior
 * r > a (depth modes Z_q of body.h with H_m / K_m) and under the body r < a, -h < z < -d
 * (I_m(j pi r / b) cos(j pi (z + h) / b), (r/a)^m for j = 0, plus the heave and pitch
 * particular solutions), matched on r = a through the unknown radial velocity u(z) on the
 * gap -h < z < -d. u carries the corner singularity (1 - t)^(-1/3) of the 270-degree
 * fluid corner at z = -d, so it is expanded in edge-weighted Gegenbauer functions
 * f_p(t) = (1 - t^2)^(-1/3) C_{2p}^{(1/6)}(t) (even about the seabed), as Porter & Evans
 * (1995, J. Fluid Mech. 294) do for vertical barriers. Their depth-mode projections are
 * closed form (Gegenbauer integral, Gradshteyn & Ryzhik 7.321):
 *   int_{-1}^{1} (1 - t^2)^{nu - 1/2} C_n^nu(t) e^{ixt} dt
 *       = pi 2^{1 - nu} i^n Gamma(n + 2 nu) / (n! Gamma(nu)) x^{-nu} J_{n + nu}(x),
 * checked by quadrature in tests/body/test_float_basis.c. Continuity of the potential on
 * the gap, tested with the same functions (Galerkin), gives a small complex-symmetric
 * system
 *   sum_p [E_{p'p} - S_{p'p}] alpha_p = rhs_p',
 * E the exterior sum over depth modes q of kappa_q <f_p', Z_q> <f_p, Z_q> / N_q with
 * kappa_q = Hhat_q / Hhat_q', S the interior sum over j. Forces come from the same sums with
 * the wall functions 1 and z appended to the basis (exact wall velocity).
 *
 * The sums converge like a power of the mode index (terms ~ q^(-7/3)), so:
 * - interior sums (omega independent) are summed here to J_INT terms plus a fitted
 *   asymptotic tail c0 j^-s (1 + c1/j + c2/j^2);
 * - exterior sums are summed per frequency to Qx modes; the rest is taken from the
 *   reference wavenumbers q pi / h (the omega -> 0 limit of k_q), expanded to second
 *   order in k_q - q pi / h = -K/(q pi) - K^2 h/(q pi)^3 + O(K^3), K = omega^2/g
 *   (dispersion k tan kh = -K near kh = q pi). The reference sums run to Q_REF terms plus
 *   the analytic leading smooth tail (Bessel asymptotics). All this is done once here.
 */
#include "float_impl.h"
#include "swellyield/special.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* Interior terms summed directly before the fitted tail: the tail is ~ J^(-4/3) of the
 * sum and the fit removes it to O(J^(-10/3)) ~ 1e-12 at J = 4096. */
#define J_INT 4096
/* Reference exterior terms summed directly: leading smooth tail added analytically,
 * the rest is O(Q_REF^(-4/3) / (Q_REF pi b / h)) ~ 1e-8 relative; oscillating parts
 * O(Q_REF^(-7/3)). */
#define Q_REF 2048

/* One family: g[i] = b (-1)^i x^(-nu) J_{nu+2i}(x), i < n. */
static int family_cos(double nu, size_t n, double b, double complex x, double complex *g,
                      sy_error *err)
{
    double complex xm = cpow(x, -nu);
    int rc = SY_OK;
    if (cabs(x) > 2.0 * (double)n + 4.0) {
        /* Upward recurrence J_{mu+1} = (2 mu / x) J_mu - J_{mu-1} is stable for mu < |x|
         * (DLMF 10.6.1); only orders nu and nu + 1 are evaluated. */
        double complex jm, jp;
        rc = sy_special_besselj_nu(nu, x, &jm, err);
        if (rc == SY_OK)
            rc = sy_special_besselj_nu(nu + 1.0, x, &jp, err);
        if (rc != SY_OK)
            return rc;
        double mu = nu + 1.0;
        for (size_t p = 0; p < n; p++) {
            g[p] = b * ((p % 2) ? -1.0 : 1.0) * xm * jm;
            double complex j2 = 2.0 * mu / x * jp - jm;    /* advance mu -> mu + 2 */
            double complex j3 = 2.0 * (mu + 1.0) / x * j2 - jp;
            jm = j2;
            jp = j3;
            mu += 2.0;
        }
        return SY_OK;
    }
    for (size_t p = 0; p < n && rc == SY_OK; p++) {
        double complex jv;
        rc = sy_special_besselj_nu(nu + 2.0 * (double)p, x, &jv, err);
        g[p] = b * ((p % 2) ? -1.0 : 1.0) * xm * jv;
    }
    return rc;
}

int syi_float_proj_cos(const syi_float_plan *fp, size_t nw, double complex k,
                       double complex *g, sy_error *err)
{
    double complex x = k * fp->b;
    int rc = family_cos(SYI_FLOAT_NU, fp->nfam[0], fp->b, x, g, err);
    if (rc == SY_OK && fp->nfam[1] > 0)
        rc = family_cos(SYI_FLOAT_NU2, fp->nfam[1], fp->b, x, g + fp->nfam[0], err);
    if (rc != SY_OK)
        return rc;
    size_t P = fp->PG;
    if (nw == 2) {
        /* int_{-h}^0 cos(k (z+h)) dz and int_{-h}^0 max(z, -d) cos(k (z+h)) dz */
        g[P] = csin(k * fp->h) / k;
        g[P + 1] = (ccos(k * fp->h) - ccos(k * fp->b)) / (k * k);
    }
    return SY_OK;
}

int syi_float_lsolve(double complex *mat, size_t n, double complex *rhs, size_t ncol,
                     sy_error *err)
{
    for (size_t c = 0; c < n; c++) {
        /* pivot by |re| + |im| (a choice of row order, not part of the physics) */
        size_t piv = c;
        double best = -1.0;
        for (size_t r = c; r < n; r++) {
            double v = fabs(creal(mat[r * n + c])) + fabs(cimag(mat[r * n + c]));
            if (v > best) {
                best = v;
                piv = r;
            }
        }
        if (!(best > 0.0))
            return sy_error_set(err, SY_ESINGULAR, "float: Galerkin system singular at column %zu", c);
        if (piv != c) {
            for (size_t j = 0; j < n; j++) {
                double complex t = mat[c * n + j];
                mat[c * n + j] = mat[piv * n + j];
                mat[piv * n + j] = t;
            }
            for (size_t j = 0; j < ncol; j++) {
                double complex t = rhs[c * ncol + j];
                rhs[c * ncol + j] = rhs[piv * ncol + j];
                rhs[piv * ncol + j] = t;
            }
        }
        double complex inv = 1.0 / mat[c * n + c];
        for (size_t r = c + 1; r < n; r++) {
            double complex f = mat[r * n + c] * inv;
            if (f == 0.0)
                continue;
            for (size_t j = c; j < n; j++)
                mat[r * n + j] -= f * mat[c * n + j];
            for (size_t j = 0; j < ncol; j++)
                rhs[r * ncol + j] -= f * rhs[c * ncol + j];
        }
    }
    for (size_t c = n; c-- > 0;) {
        double complex inv = 1.0 / mat[c * n + c];
        for (size_t j = 0; j < ncol; j++) {
            double complex s = rhs[c * ncol + j];
            for (size_t k = c + 1; k < n; k++)
                s -= mat[c * n + k] * rhs[k * ncol + j];
            rhs[c * ncol + j] = s * inv;
        }
    }
    return SY_OK;
}

/* Sum_{j > J} j^-s (c0 + c1/j + c2/j^2), the coefficients fitted to the terms at
 * J/4, J/2, J (t[0..2]); midpoint Euler-Maclaurin for each power:
 * sum_{j > J} j^-s = (J + 1/2)^(1-s)/(s-1) - (s/24)(J + 1/2)^(-s-1) + O(J^(-s-3)). */
static double em_tail(double s, double J)
{
    double x = J + 0.5;
    return pow(x, 1.0 - s) / (s - 1.0) - s / 24.0 * pow(x, -s - 1.0);
}

static double fitted_tail(const double t[3], double s, double J)
{
    double j[3] = {J / 4.0, J / 2.0, J};
    /* Solve c0 + c1 y + c2 y^2 = t_i j_i^s, y = 1/j_i (3 x 3 Vandermonde). */
    double y[3], v[3];
    for (int i = 0; i < 3; i++) {
        y[i] = 1.0 / j[i];
        v[i] = t[i] * pow(j[i], s);
    }
    double d01 = (v[1] - v[0]) / (y[1] - y[0]);
    double d12 = (v[2] - v[1]) / (y[2] - y[1]);
    double c2 = (d12 - d01) / (y[2] - y[0]);
    double c1 = d01 - c2 * (y[0] + y[1]);
    double c0 = v[0] - c1 * y[0] - c2 * y[0] * y[0];
    return c0 * em_tail(s, J) + c1 * em_tail(s + 1.0, J) + c2 * em_tail(s + 2.0, J);
}

/* Interior sums for order m (see float_impl.h). */
static int interior(syi_float_plan *fp, size_t m, sy_error *err)
{
    const size_t P = fp->PG, L = fp->L;
    const double a = fp->a, b = fp->b;
    const int j0 = (m == 0) ? 1 : 0;
    double *sint = fp->sint + m * L * L;
    /* terms at J/4, J/2, J kept for the tail fits */
    double tS[3][(SYI_FLOAT_PMAX + 2) * (SYI_FLOAT_PMAX + 2)];
    double tBG[3][SYI_FLOAT_PMAX + 2], tPI[3][SYI_FLOAT_PMAX + 2], tBP[3];
    double complex ib[SYI_FLOAT_PMAX + 8], g[SYI_FLOAT_PMAX + 2];
    memset(sint, 0, L * L * sizeof *sint);
    double *bg = (m == 0) ? fp->bg_heave : fp->bg_pitch;
    if (m <= 1) {
        memset(bg, 0, sizeof fp->bg_heave);
        if (m == 1)
            memset(fp->pint_pitch, 0, sizeof fp->pint_pitch);
    }
    double bp = 0.0;
    for (int j = j0; j <= J_INT; j++) {
        double w, bw = 0.0, pj = 0.0, sg = (j % 2) ? -1.0 : 1.0;
        double gp[SYI_FLOAT_PMAX + 2] = {0};
        if (j == 0) {
            /* (r/a)^m: Ihat' = m/a, M_0 = b, G_p0 = b m0_p; wall functions are the
             * constants 1 and -d on the gap */
            w = a / ((double)m * b);
            for (size_t p = 0; p < P; p++)
                gp[p] = b * fp->m0[p];
            gp[P] = b;
            gp[P + 1] = -fp->d * b;
            if (m == 1) {
                bw = -a * a * a / 4.0;                       /* -int_0^a (r/a) r^2 dr */
                pj = -(b * b / 3.0 - 0.75 * a * a) / 2.0;    /* int_gap d_r phi_p dz */
            }
        } else {
            double lam = (double)j * SYI_PI / b, x = lam * a;
            int rc = sy_special_besseli_scaled_array((int)m + 2, x, ib, err);
            if (rc != SY_OK)
                return rc;
            double r1 = creal(ib[m + 1]) / creal(ib[m]);     /* I_{m+1}/I_m */
            double ihp = lam * (r1 + (double)m / x);          /* I_m'/I_m * lam */
            w = 2.0 / (b * ihp);
            rc = syi_float_proj_cos(fp, 0, lam, g, err);
            if (rc != SY_OK)
                return rc;
            for (size_t p = 0; p < P; p++)
                gp[p] = creal(g[p]);
            if (m == 0)
                bw = a * r1 / lam;                            /* int_0^a Ihat r dr */
            if (m == 1) {
                bw = -a * a * creal(ib[2]) / creal(ib[1]) / lam; /* -int Ihat r^2 dr */
                pj = -sg / (lam * lam);
            }
        }
        int slot = (j == J_INT / 4) ? 0 : (j == J_INT / 2) ? 1 : (j == J_INT) ? 2 : -1;
        size_t Lm = (m <= 1) ? L : P;
        for (size_t p = 0; p < Lm; p++)
            for (size_t pp = 0; pp < Lm; pp++) {
                double t = w * gp[p] * gp[pp];
                sint[p * L + pp] += t;
                if (slot >= 0)
                    tS[slot][p * L + pp] = t;
            }
        if (m <= 1) {
            for (size_t p = 0; p < L; p++) {
                double t = w * gp[p] * sg * bw;
                bg[p] += t;
                if (slot >= 0)
                    tBG[slot][p] = t;
                if (m == 1) {
                    double u = w * pj * gp[p];
                    fp->pint_pitch[p] += u;
                    if (slot >= 0)
                        tPI[slot][p] = u;
                }
            }
            if (m == 1) {
                double t = w * pj * sg * bw;
                bp += t;
                if (slot >= 0)
                    tBP[slot] = t;
            }
        }
    }
    /* asymptotic tails; exponents from the Bessel asymptotics (float_plan.c header) */
    size_t Lm = (m <= 1) ? L : P;
    for (size_t p = 0; p < Lm; p++)
        for (size_t pp = 0; pp < Lm; pp++) {
            size_t i = p * L + pp;
            double t[3] = {tS[0][i], tS[1][i], tS[2][i]};
            /* G_lj ~ j^(-nu_l - 1/2), 1/(M_j Ihat'_j) ~ 1/j (wall entries vanish, j >= 1) */
            double nl = p < P ? fp->nu_l[p] : 0.0, nlp = pp < P ? fp->nu_l[pp] : 0.0;
            sint[i] += fitted_tail(t, 2.0 + nl + nlp, J_INT);
        }
    if (m <= 1)
        for (size_t p = 0; p < L; p++) {
            double t[3] = {tBG[0][p], tBG[1][p], tBG[2][p]};
            double nl = p < P ? fp->nu_l[p] : 0.0;
            bg[p] += fitted_tail(t, 2.5 + nl, J_INT);
            if (m == 1) {
                double u[3] = {tPI[0][p], tPI[1][p], tPI[2][p]};
                fp->pint_pitch[p] += fitted_tail(u, 3.5 + nl, J_INT);
            }
        }
    if (m == 1)
        fp->bp_pitch = bp + fitted_tail(tBP, 4.0, J_INT);
    return SY_OK;
}

/* E_ll'(k) = kappa_m(k) g_l g_l' / N(k) with unnormalised cos modes (normalisation
 * cancels), for all m = 0..M at once into e[(m L + l) L + l']. Real k. */
static int eref(const syi_float_plan *fp, double k, double *e, sy_error *err)
{
    const size_t P = fp->PG, L = fp->L, M = fp->M;
    double complex g[SYI_FLOAT_PMAX + 2], kb[SYI_FLOAT_PMAX + 64];
    double complex *kv = kb;
    double complex *heap = NULL;
    if (M + 3 > sizeof kb / sizeof kb[0]) {
        heap = malloc((M + 3) * sizeof *heap);   /* plan time only */
        if (heap == NULL)
            return sy_error_set(err, SY_ENOMEM, "float plan scratch");
        kv = heap;
    }
    int rc = syi_float_proj_cos(fp, 2, k, g, err);
    if (rc == SY_OK)
        rc = sy_special_besselk_scaled_array((int)M + 1, k * fp->a, kv, err);
    if (rc != SY_OK) {
        free(heap);
        return rc;
    }
    double nk = fp->h / 2.0 + sin(2.0 * k * fp->h) / (4.0 * k);
    double x = k * fp->a;
    for (size_t m = 0; m <= M; m++) {
        double km = creal(kv[m]);
        double kd = (m == 0) ? -creal(kv[1]) : -creal(kv[m - 1]) - (double)m / x * km;
        double kap = km / (k * kd) / nk;
        size_t Lm = (m <= 1) ? L : P;
        for (size_t l = 0; l < Lm; l++)
            for (size_t lp = 0; lp < Lm; lp++)
                e[(m * L + l) * L + lp] = kap * creal(g[l]) * creal(g[lp]);
    }
    free(heap);
    return SY_OK;
}

/* Leading smooth (non-oscillating) part of E_ll'(k) for large k, the same for every m
 * (kappa -> -1/k, N -> h/2, J_mu(x) ~ sqrt(2/(pi x)) cos(x - mu pi/2 - pi/4)):
 * returns coefficient c and power s with E ~ c k^-s. */
static void smooth_coef(const syi_float_plan *fp, size_t l, size_t lp, double *c, double *s)
{
    const size_t P = fp->PG;
    const double b = fp->b, h = fp->h;
    int gl = l < P, glp = lp < P;
    if (gl && glp) {
        /* gap-gap: -(2 b^2/(pi h)) cos((nu - nu') pi/2) b^(-nu-nu'-1) k^(-2-nu-nu') */
        double n1 = fp->nu_l[l], n2 = fp->nu_l[lp];
        *c = -2.0 * b * b / (SYI_PI * h) * cos((n1 - n2) * SYI_PI / 2.0) * pow(b, -n1 - n2 - 1.0);
        *s = 2.0 + n1 + n2;
    } else {
        /* extended wall functions: w_1 is orthogonal to every cos(q pi (z+h)/h), and
         * w_z is continuous, so its projections are O(k^-2): tails O(Q_REF^(-8/3)) */
        *c = 0.0;
        *s = 3.0;
    }
}

static int exterior_reference(syi_float_plan *fp, sy_error *err)
{
    const size_t L = fp->L, M = fp->M, n = (M + 1) * L * L;
    const double h = fp->h;
    double *buf = calloc(5 * n, sizeof *buf);
    if (buf == NULL)
        return sy_error_set(err, SY_ENOMEM, "float plan reference sums");
    double *tot = buf, *e0 = buf + n, *ep = buf + 2 * n, *em = buf + 3 * n, *part = buf + 4 * n;
    const int nl = (int)fp->nqlev;
    for (int lev = 0; lev < nl; lev++) {
        memset(fp->t1[lev], 0, n * sizeof(double));
        memset(fp->t2[lev], 0, n * sizeof(double));
    }
    /* Finite-difference step for dE/dk: E varies on scales 1/(2b) and 1/a. */
    const double dk = 1e-3 / (fp->a + fp->b);
    int rc = SY_OK;
    for (size_t q = 1; q <= Q_REF && rc == SY_OK; q++) {
        double qpi = (double)q * SYI_PI, k = qpi / h;
        rc = eref(fp, k, e0, err);
        if (rc != SY_OK)
            break;
        for (size_t i = 0; i < n; i++)
            tot[i] += e0[i];
        for (int lev = 0; lev < nl; lev++)
            if (q == fp->Qx[lev])
                memcpy(fp->rtail[lev], tot, n * sizeof(double)); /* partial sums */
        if (q <= fp->Qx[0])
            continue;
        rc = eref(fp, k + dk, ep, err);
        if (rc == SY_OK)
            rc = eref(fp, k - dk, em, err);
        if (rc != SY_OK)
            break;
        for (size_t i = 0; i < n; i++) {
            double d1 = (ep[i] - em[i]) / (2.0 * dk);
            double d2 = (ep[i] - 2.0 * e0[i] + em[i]) / (dk * dk);
            double c1 = -d1 / qpi;
            double c2 = d2 / (2.0 * qpi * qpi) - d1 * h / (qpi * qpi * qpi);
            for (int lev = 0; lev < nl; lev++)
                if (q > fp->Qx[lev]) {
                    fp->t1[lev][i] += c1;
                    fp->t2[lev][i] += c2;
                }
        }
    }
    if (rc == SY_OK) {
        /* analytic smooth tail beyond Q_REF: sum_{q > Q_REF} (q pi / h)^-s */
        for (size_t m = 0; m <= M; m++) {
            size_t Lm = (m <= 1) ? L : fp->PG;
            for (size_t l = 0; l < Lm; l++)
                for (size_t lp = 0; lp < Lm; lp++) {
                    double c, s;
                    smooth_coef(fp, l, lp, &c, &s);
                    size_t i = (m * L + l) * L + lp;
                    part[i] = c * pow(h / SYI_PI, s) * em_tail(s, Q_REF);
                }
        }
        for (int lev = 0; lev < nl; lev++)
            for (size_t i = 0; i < n; i++)
                fp->rtail[lev][i] = tot[i] + part[i] - fp->rtail[lev][i];
    }
    free(buf);
    return rc;
}

int syi_float_plan_build(syi_float_plan *fp, const sy_body_plan *plan, size_t P_force,
                         size_t Qx_force, int P2_force, sy_error *err)
{
    const double nu = SYI_FLOAT_NU;
    fp->a = plan->geom.radius;
    fp->d = plan->geom.draft;
    fp->h = plan->h;
    fp->b = fp->h - fp->d;
    fp->z_rot = plan->geom.z_rot;
    fp->M = plan->n_order > 1 ? plan->n_order : 1;   /* orders 0, 1 carry the radiation */
    fp->Q = plan->n_depth;
    /* Truncation from the tolerance (measured in docs/hydro-convergence.md). With both
     * corner families the Galerkin part converges fast: 4 + 2 functions give ~1e-8,
     * 6 + 2 ~1e-10 relative in A and B; larger sets only add round-off (the two families
     * are nearly dependent). The exterior tail after the second-order reference
     * correction falls like Qx^(-10/3) times (2 b K / pi)^3, so Qx grows with the digits
     * asked for and the error estimate watches the high-frequency end. */
    double digits = -log10(plan->tolerance > 0.0 ? plan->tolerance : 1e-6);
    size_t P1 = digits <= 4.0 ? 4 : digits <= 7.0 ? 5 : digits <= 10.0 ? 7 : 8;
    /* a long gap under a shallow draft resolves the corner layer with more functions
     * (measured: d/h = 0.04 needs about three more than d/h = 0.2 for the same error) */
    double gap_ratio = (plan->h - plan->geom.draft) / (4.0 * plan->geom.draft);
    if (gap_ratio > 1.0)
        P1 += (size_t)fmin(6.0, ceil(log2(gap_ratio)));
    size_t Q1 = (size_t)ceil(8.0 * digits);
    if (Q1 < 16)
        Q1 = 16;
    if (Q1 < fp->Q)
        Q1 = fp->Q;
    if (P_force > 0)
        P1 = P_force < 3 ? 3 : P_force > SYI_FLOAT_PMAX ? SYI_FLOAT_PMAX : P_force;
    if (Qx_force > 0)
        Q1 = Qx_force < fp->Q ? fp->Q : Qx_force;
    if (Q1 < 2)
        Q1 = 2;
    /* second family: two functions carry the (1 - t)^(1/3) corner term */
    size_t P2 = 2;
    if (P2_force >= 0)
        P2 = (size_t)P2_force;
    if (P1 + P2 > SYI_FLOAT_PMAX)
        P2 = SYI_FLOAT_PMAX - P1;
    fp->nfam[0] = P1;
    fp->nfam[1] = P2;
    fp->PG = P1 + P2;
    for (size_t l = 0; l < fp->PG; l++) {
        fp->nu_l[l] = l < P1 ? nu : SYI_FLOAT_NU2;
        fp->ord_l[l] = (int)(l < P1 ? l : l - P1);
    }
    /* fine level: all; coarse level: one fewer of the first family (and Qx / 2) */
    fp->P[1] = fp->PG;
    fp->P[0] = 0;
    for (size_t l = 0; l < fp->PG; l++) {
        fp->gidx[1][l] = l;
        if (l + 1 < P1 || l >= P1)
            fp->gidx[0][fp->P[0]++] = l;
    }
    /* exterior ladder: Q1/2, Q1, 2 Q1, 4 Q1, 8 Q1 (fine level chosen per frequency) */
    fp->nqlev = SYI_FLOAT_QLEV;
    fp->Qx[0] = Q1 / 2;
    for (size_t i = 1; i < fp->nqlev; i++)
        fp->Qx[i] = Q1 << (i - 1);
    if (Qx_force > 0)
        fp->nqlev = 2;   /* forced: exactly Q1 (fine) and Q1/2 (coarse) */
    /* measured (docs/hydro-convergence.md): the exterior error behaves like
     * (2 b |K| / (pi Qx))^5, about 1e-7 at a ratio of 0.17 */
    fp->q_ratio = 0.17 * pow(pow(10.0, -digits) / 1e-7, 0.2);
    fp->L = fp->PG + 2;
    P1 = fp->PG;   /* below: loops over all gap functions */
    for (size_t p = 0; p < P1; p++) {
        double nl = fp->nu_l[p];
        int o = fp->ord_l[p];
        /* moments from the small-x series of x^-nu J_{2p+nu}(x) (DLMF 10.2.2) */
        fp->m0[p] = (o == 0) ? pow(2.0, -nl) / tgamma(1.0 + nl) : 0.0;
        fp->m2[p] = (o == 0) ? pow(2.0, -nl - 1.0) / tgamma(2.0 + nl)
                  : (o == 1) ? pow(2.0, -nl - 1.0) / tgamma(3.0 + nl) : 0.0;
    }
    const double a = fp->a, b = fp->b;
    /* particular solutions: heave phi = ((z+h)^2 - r^2/2)/(2b) (dphi/dz = 1 at z = -d),
     * pitch (order-1 profile, dphi/dz = -r) phi = -((z+h)^2 r - r^3/4)/(2b) */
    for (size_t p = 0; p < P1; p++) {
        double s2 = b * b * b * fp->m2[p], s0 = b * fp->m0[p];
        fp->phi_heave[p] = (s2 - a * a / 2.0 * s0) / (2.0 * b);
        fp->phi_pitch[p] = -(a * s2 - a * a * a / 4.0 * s0) / (2.0 * b);
    }
    /* wall functions on the gap: constants 1 and -d; int_0^b phi_p(a, s) ds */
    double ph_gap = (b * b * b / 3.0 - a * a / 2.0 * b) / (2.0 * b);
    double pp_gap = -(a * b * b * b / 3.0 - a * a * a / 4.0 * b) / (2.0 * b);
    fp->phi_heave[P1] = ph_gap;
    fp->phi_heave[P1 + 1] = -fp->d * ph_gap;
    fp->phi_pitch[P1] = pp_gap;
    fp->phi_pitch[P1 + 1] = -fp->d * pp_gap;
    fp->bpp_heave = (b * b * a * a / 2.0 - a * a * a * a / 8.0) / (2.0 * b);  /* W = 1 */
    fp->bpp_pitch = (b * b * pow(a, 4) / 4.0 - pow(a, 6) / 24.0) / (2.0 * b);
    fp->bw0_heave = a * a / 2.0;
    fp->p0_heave = -a / 2.0;
    size_t n = (fp->M + 1) * fp->L * fp->L;
    fp->sint = calloc(n, sizeof *fp->sint);
    int ok = fp->sint != NULL;
    for (size_t lev = 0; lev < fp->nqlev; lev++) {
        fp->rtail[lev] = calloc(n, sizeof(double));
        fp->t1[lev] = calloc(n, sizeof(double));
        fp->t2[lev] = calloc(n, sizeof(double));
        ok = ok && fp->rtail[lev] && fp->t1[lev] && fp->t2[lev];
    }
    if (!ok)
        return sy_error_set(err, SY_ENOMEM, "float plan for M = %zu", fp->M);
    int rc = SY_OK;
    for (size_t m = 0; m <= fp->M && rc == SY_OK; m++)
        rc = interior(fp, m, err);
    if (rc == SY_OK)
        rc = exterior_reference(fp, err);
    return rc;
}

void syi_float_plan_release(syi_float_plan *fp)
{
    if (fp == NULL)
        return;
    free(fp->sint);
    for (int lev = 0; lev < SYI_FLOAT_QLEV; lev++) {
        free(fp->rtail[lev]);
        free(fp->t1[lev]);
        free(fp->t2[lev]);
    }
}
