/* Time response by pole expansion and by direct Fourier inversion (response.h has the
 * formulas, their conditions and what the pole sum leaves out). SI units. */
#include <complex.h>
#include "poles_impl.h"
#include "swellyield/outputs.h"
#include "swellyield/response.h"

#include <gsl/gsl_sf_expint.h>
#include <lapacke.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>
#include <string.h>

/* Z' at a pole by the Cauchy integral on a circle: 8 points make the error
 * ~ (radius / R)^8, R the distance to the nearest singularity of Z. Z itself has poles:
 * the fixed array's scattering resonances (Z_rad = Z_iso - F has them), which sit near
 * motion poles (0.006-0.02 rad/s in the demo, where 0.02 |omega_p| put them inside the
 * circle and made the residues wrong by orders of magnitude). So the radius is
 * 2e-3 |omega_p| and at most a quarter of the distance to the nearest scattering pole
 * of the set ((1/4)^8 = 2e-5); the evaluation noise of Z (the body tolerance, 1e-9)
 * over that radius stays ~1e-6 of Z'. */
#define DERIV_POINTS 8
#define DERIV_RADIUS 2e-3    /* relative to |omega_p| */
#define DERIV_SHARE 0.25     /* of the distance to the nearest scattering pole */
#define DEFAULT_OMAX_FACTOR 5.0 /* heave response past 5 omega_r: the closed-form tail / omega^-4 */
#define DEFAULT_OMAX_MIN 5.0 /* rad/s */
#define DEFAULT_DW_PER_GAMMA 12.0  /* Filon error ~ (d_omega / gamma)^2 / 8 ~ 1e-3 */
#define FILE_PERIODS 15.0    /* sy_response_settings_standard: length, samples per period, pulse */
#define FILE_SAMPLES 40.0
#define FILE_PERIODS_MIN 3.0
#define FILE_DECAY 7.0       /* e^-7: the slowest pole's share left at the end */
#define FILE_PULSE 0.25
#define DEFAULT_DW_MAX 0.01  /* rad/s */
#define SMALL_Z 1e-3         /* below: series for the exponential quotients */

/* (e^z - 1) / z */
static double complex phi1(double complex z)
{
    return cabs(z) < SMALL_Z ? 1 + z / 2 + z * z / 6 + z * z * z / 24 : (cexp(z) - 1) / z;
}

/* (e^z - 1 - z) / z^2 */
static double complex phi2(double complex z)
{
    return cabs(z) < SMALL_Z ? 0.5 + z / 6 + z * z / 24 + z * z * z / 120 : (cexp(z) - 1 - z) / (z * z);
}

/* Spectrum of the half-sine pulse F0 sin(a t), 0 < t < tau, a = pi / tau:
 * F(omega) = int f e^{i omega t} dt = F0 [E(omega + a) - E(omega - a)] / (2 i),
 * E(u) = int_0^tau e^{i u t} dt = tau phi1(i u tau) (no cancellation near omega = a). */
static double complex pulse_spectrum(double f0, double tau, double complex w)
{
    double a = M_PI / tau;
    return f0 * tau * (phi1(I * (w + a) * tau) - phi1(I * (w - a) * tau)) / (2 * I);
}

/* Solve the n x n complex system a x = b in place (a destroyed; row-major). */
static int csolve(double complex *a, double complex *b, lapack_int *ipiv, size_t n, double complex w, sy_error *err)
{
    lapack_int info = LAPACKE_zgesv(LAPACK_ROW_MAJOR, (lapack_int)n, 1, a, (lapack_int)n, ipiv, b, 1);
    if (info > 0)
        return sy_error_set(err, SY_ESINGULAR, "impedance singular at omega = %g%+gi rad/s (pivot %d)", creal(w),
                            cimag(w), (int)info);
    return info == 0 ? SY_OK : sy_error_set(err, SY_EINVAL, "zgesv argument %d", (int)-info);
}

void sy_response_free(sy_response *r)
{
    if (r == NULL)
        return;
    free(r->t);
    free(r->pole_sum);
    free(r->direct);
    free(r->dof_body);
    free(r->dof_mode);
    free(r);
}

static int check_settings(const sy_response_settings *s, const sy_model *m, sy_error *err)
{
    if (s->kind != SY_RESPONSE_DECAY && s->kind != SY_RESPONSE_PULSE)
        return sy_error_set(err, SY_EINVAL, "response kind %d: expected decay (0) or pulse (1)", (int)s->kind);
    if (s->body >= m->n_devices)
        return sy_error_set(err, SY_EINVAL, "response body %zu: the layout has %zu bodies", s->body, m->n_devices);
    if (!isfinite(s->amplitude))
        return sy_error_set(err, SY_EINVAL, "response amplitude must be finite, got %g", s->amplitude);
    if (s->kind == SY_RESPONSE_PULSE && !(s->duration > 0 && isfinite(s->duration)))
        return sy_error_set(err, SY_EINVAL, "pulse duration must be > 0 s, got %g", s->duration);
    if (!(s->t_end > 0 && isfinite(s->t_end)))
        return sy_error_set(err, SY_EINVAL, "response t_end must be > 0 s, got %g", s->t_end);
    if (s->n_times < 2)
        return sy_error_set(err, SY_EINVAL, "response n_times must be >= 2, got %zu", s->n_times);
    if (!(s->omega_max >= 0) || !(s->d_omega >= 0) || (s->omega_max > 0 && s->d_omega > s->omega_max))
        return sy_error_set(err, SY_EINVAL, "response grid: omega_max %g, d_omega %g rad/s: expected 0 < d_omega <= omega_max",
                            s->omega_max, s->d_omega);
    return SY_OK;
}

#define MAX_MULT 4
int syi_pole_residue(syi_imp *imp, const sy_pole_set *ps, size_t i, double complex *R, double complex *z,
                     sy_error *err)
{
    size_t n = syi_imp_n_dof(imp);
    double complex *dz = z + n * n;
    const sy_pole *p = &ps->poles[i];
    if (p->kind != SY_POLE_MOTION || p->mode == NULL || ps->n_dof != n)
        return sy_error_set(err, SY_EINVAL, "residue: pole %zu is not a motion pole with a mode of %zu dofs", i, n);
    const double complex *v[MAX_MULT] = {p->mode};
    size_t r = 1;
    for (size_t j = 0; j < ps->n && r < MAX_MULT && r < n; j++) /* at most n independent modes */
        if (j != i && sy_pole_same(&ps->poles[j], p) && ps->poles[j].mode != NULL)
            v[r++] = ps->poles[j].mode;
    /* Z'(omega_p) = (1 / 2 pi i) oint Z(w) / (w - omega_p)^2 dw on a circle: the mean of
     * Z(omega_p + rad e^{i theta}) e^{-i theta} / rad over equally spaced theta. */
    double rad = DERIV_RADIUS * cabs(p->omega);
    for (size_t j = 0; j < ps->n; j++)
        if (ps->poles[j].kind == SY_POLE_SCATTERING)
            rad = fmin(rad, DERIV_SHARE * cabs(ps->poles[j].omega - p->omega));
    memset(dz, 0, n * n * sizeof *dz);
    for (size_t k = 0; k < DERIV_POINTS; k++) {
        double complex e = cexp(I * 2 * M_PI * (double)k / DERIV_POINTS);
        int rc = syi_imp_eval(imp, p->omega + rad * e, z, NULL, err);
        if (rc != SY_OK)
            return sy_error_prefix(err, "pole %g%+gi rad/s: derivative", creal(p->omega), cimag(p->omega)), rc;
        for (size_t j = 0; j < n * n; j++)
            dz[j] += z[j] / (e * rad * DERIV_POINTS);
    }
    /* S = V^T Z' V (r x r, row-major), X = S^-1 V^T (r x n, in z: the evaluations are
     * done), R = V X. */
    double complex S[MAX_MULT * MAX_MULT], *X = z;
    lapack_int piv[MAX_MULT];
    for (size_t a = 0; a < r; a++) {
        for (size_t b = 0; b < r; b++) {
            double complex acc = 0;
            for (size_t x = 0; x < n; x++)
                for (size_t y = 0; y < n; y++)
                    acc += v[a][x] * dz[x * n + y] * v[b][y];
            S[a * r + b] = acc;
        }
        memcpy(X + a * n, v[a], n * sizeof *X);
    }
    lapack_int info = LAPACKE_zgesv(LAPACK_ROW_MAJOR, (lapack_int)r, (lapack_int)n, S, (lapack_int)r, piv, X,
                                    (lapack_int)n);
    if (info != 0)
        return sy_error_set(err, SY_ESINGULAR, "pole %g%+gi rad/s: V^T Z' V of its %zu modes singular (%d)",
                            creal(p->omega), cimag(p->omega), r, (int)info);
    for (size_t x = 0; x < n; x++)
        for (size_t y = 0; y < n; y++) {
            double complex acc = 0;
            for (size_t a = 0; a < r; a++)
                acc += v[a][x] * X[a * n + y];
            R[x * n + y] = acc;
        }
    return SY_OK;
}

/* Pole part: coefficient c_p (vector) so that x(t) = 2 Re sum_p c_p e^{-i omega_p t}, one
 * per distinct pole: c = R y (syi_pole_residue) with y = -K0 e_b x0 / omega_p (decay) or
 * -i F(omega_p) e_b (pulse). z: 3 n^2 scratch (y in its first n after the residue). */
static int pole_terms(syi_imp *imp, const sy_pole_set *ps, const sy_response_settings *s, size_t eb,
                      double complex *coef, double complex *wp, size_t *np, double complex *z, sy_error *err)
{
    size_t n = syi_imp_n_dof(imp);
    const double *k0 = syi_imp_k0(imp);
    double complex *R = z + 2 * n * n;
    *np = 0;
    for (size_t i = 0; i < ps->n; i++) {
        const sy_pole *p = &ps->poles[i];
        if (p->kind != SY_POLE_MOTION || p->mode == NULL || !(creal(p->omega) > 0) || sy_pole_repeats(ps, i))
            continue;
        int rc = syi_pole_residue(imp, ps, i, R, z, err);
        if (rc != SY_OK)
            return rc;
        double complex *y = z;
        for (size_t x = 0; x < n; x++)
            y[x] = s->kind == SY_RESPONSE_DECAY ? -k0[x * n + eb] * s->amplitude / p->omega : 0;
        if (s->kind == SY_RESPONSE_PULSE)
            y[eb] = -I * pulse_spectrum(s->amplitude, s->duration, p->omega);
        for (size_t x = 0; x < n; x++) {
            double complex acc = 0;
            for (size_t c = 0; c < n; c++)
                acc += R[x * n + c] * y[c];
            coef[*np * n + x] = acc;
        }
        wp[*np] = p->omega;
        (*np)++;
    }
    return SY_OK;
}

/* The direct integrand g(omega) (vector, n) on the grid: decay Z^-1 (omega M + i Zd) x0,
 * pulse Z^-1 F e_b; omega = 0 from Z(0) = K0 (Z_rad(0) = 0). */
static int integrand(syi_imp *imp, const sy_response_settings *s, size_t eb, double w, double complex *g,
                     double complex *z, double complex *zd, lapack_int *ipiv, sy_error *err)
{
    size_t n = syi_imp_n_dof(imp);
    const double *mass = syi_imp_mass(imp);
    int rc = SY_OK;
    if (w == 0) { /* pulse only: Z(0) = K0 */
        const double *k0 = syi_imp_k0(imp);
        for (size_t j = 0; j < n * n; j++)
            z[j] = k0[j];
    } else {
        rc = syi_imp_eval(imp, w, z, zd, err);
    }
    if (rc != SY_OK)
        return sy_error_prefix(err, "omega = %g rad/s", w), rc;
    for (size_t a = 0; a < n; a++)
        g[a] = s->kind == SY_RESPONSE_DECAY ? (w * mass[a * n + eb] + I * zd[a * n + eb]) * s->amplitude
                                            : (a == eb ? pulse_spectrum(s->amplitude, s->duration, w) : 0);
    return csolve(z, g, ipiv, n, w, err);
}

int sy_poles_response(sy_response **out, const sy_model *m, const sy_pole_set *ps, const sy_response_settings *s,
                      sy_error *err)
{
    int rc = check_settings(s, m, err);
    if (rc != SY_OK)
        return rc;
    /* The residues on the Z the poles were found on (syi_poles_model: body solves to
     * 1e-9, so the Cauchy derivative's small circle does not amplify truncation noise),
     * the direct inversion on the model's own Z (what a run computes). */
    syi_imp *imp = NULL, *tight = NULL;
    sy_model mt;
    syi_poles_model(m, &mt);
    rc = syi_imp_create(&imp, m, 1, err);
    if (rc == SY_OK)
        rc = syi_imp_create(&tight, &mt, 1, err);
    if (rc != SY_OK) {
        syi_imp_free(imp);
        return rc;
    }
    /* One dof map for both: the devices fix it, not the truncation or the tolerance. */
    size_t n = syi_imp_n_dof(imp), eb = syi_imp_heave_dof(imp, s->body);
    if (eb == SIZE_MAX) {
        syi_imp_free(imp);
        syi_imp_free(tight);
        return sy_error_set(err, SY_EINPUT, "response body %zu (%s) has no heave dof", s->body, m->devices[s->body].name);
    }
    /* Grid from the poles: fine against the narrowest resonance, long past the highest. */
    double gmin = INFINITY, wmax = 0;
    for (size_t i = 0; i < ps->n; i++)
        if (ps->poles[i].kind == SY_POLE_MOTION && ps->poles[i].omega_r > 0) {
            gmin = fmin(gmin, ps->poles[i].gamma);
            wmax = fmax(wmax, ps->poles[i].omega_r);
        }
    double omax = s->omega_max > 0 ? s->omega_max : fmax(DEFAULT_OMAX_MIN, DEFAULT_OMAX_FACTOR * wmax);
    double dw = s->d_omega > 0 ? s->d_omega : fmin(DEFAULT_DW_MAX, gmin / DEFAULT_DW_PER_GAMMA);
    size_t nw = (size_t)ceil(omax / dw);
    dw = omax / (double)nw;

    sy_response *r = calloc(1, sizeof *r);
    size_t nt = s->n_times, np = 0;
    double complex *z = malloc((3 * n * n + 1) * sizeof *z), *zd = malloc((n * n + 1) * sizeof *zd);
    double complex *g = malloc((nw + 1) * n * sizeof *g);
    double complex *coef = malloc((ps->n + 1) * n * sizeof *coef), *wp = malloc((ps->n + 1) * sizeof *wp);
    lapack_int *ipiv = malloc((n + 1) * sizeof *ipiv);
    if (r != NULL) {
        r->t = malloc(nt * sizeof *r->t);
        r->pole_sum = calloc(nt * n, sizeof *r->pole_sum);
        r->direct = calloc(nt * n, sizeof *r->direct);
        r->dof_body = malloc((n + 1) * sizeof *r->dof_body);
        r->dof_mode = malloc((n + 1) * sizeof *r->dof_mode);
    }
    if (r == NULL || !z || !zd || !g || !coef || !wp || !ipiv || !r->t || !r->pole_sum || !r->direct || !r->dof_body ||
        !r->dof_mode)
        rc = sy_error_set(err, SY_ENOMEM, "response: %zu times x %zu dofs, %zu frequencies", nt, n, nw + 1);
    if (rc == SY_OK) {
        r->kind = s->kind, r->n_times = nt, r->n_dof = n, r->excited_dof = eb;
        r->omega_max = omax, r->d_omega = dw, r->n_omega = nw;
        for (size_t d = 0; d < n; d++)
            syi_imp_dof(imp, d, &r->dof_body[d], &r->dof_mode[d]);
        for (size_t j = 0; j < nt; j++)
            r->t[j] = s->t_end * (double)j / (double)(nt - 1);
        rc = pole_terms(tight, ps, s, eb, coef, wp, &np, z, err);
        r->n_poles = np;
    }
    /* Direct: grid points 1..nw, then omega = 0 (its decay damping from point 1). */
    for (size_t j = 1; rc == SY_OK && j <= nw; j++)
        rc = integrand(imp, s, eb, dw * (double)j, g + j * n, z, zd, ipiv, err);
    if (rc == SY_OK) {
        if (s->kind == SY_RESPONSE_DECAY) {
            /* g(0) = i K0^-1 (B_pto + B_visc) x0 (the radiation part vanishes at omega = 0). */
            const double *k0 = syi_imp_k0(imp);
            for (size_t j = 0; j < n * n; j++)
                z[j] = k0[j];
            for (size_t a = 0; a < n; a++)
                g[a] = 0;
            g[eb] = I * syi_imp_damping(imp)[eb] * s->amplitude;
            rc = csolve(z, g, ipiv, n, 0, err);
        } else {
            rc = integrand(imp, s, eb, 0, g, z, zd, ipiv, err);
        }
    }
    for (size_t j = 0; rc == SY_OK && j < nt; j++) {
        double t = r->t[j], th = dw * t;
        double complex c = -I * th;
        double complex wint = cabs(c) < SMALL_Z ? 1 + c * c / 12 : -4 * sin(th / 2) * sin(th / 2) / (c * c);
        double complex w0 = phi2(c), wn = phi2(-c);
        for (size_t a = 0; a < n; a++) {
            double complex acc = 0;
            for (size_t k = 0; k <= nw; k++) {
                double complex wk = k == 0 ? w0 : k == nw ? wn : wint;
                acc += wk * g[k * n + a] * cexp(-I * dw * (double)k * t);
            }
            acc *= dw / M_PI;
            double x = s->kind == SY_RESPONSE_DECAY ? cimag(acc) : creal(acc);
            if (s->kind == SY_RESPONSE_DECAY && a == eb)
                x += s->amplitude * (M_PI / 2 - gsl_sf_Si(omax * t)) / M_PI; /* tail -x0 / omega */
            r->direct[j * n + a] = x;
            double complex ps_ = 0;
            for (size_t p = 0; p < np; p++)
                ps_ += coef[p * n + a] * cexp(-I * wp[p] * t);
            r->pole_sum[j * n + a] = 2 * creal(ps_);
        }
    }
    free(z);
    free(zd);
    free(g);
    free(coef);
    free(wp);
    free(ipiv);
    syi_imp_free(imp);
    syi_imp_free(tight);
    if (rc != SY_OK) {
        sy_response_free(r);
        return rc;
    }
    *out = r;
    return SY_OK;
}

typedef struct csv_ctx {
    const sy_response *r;
    const sy_model *m;
} csv_ctx;

static int fill_csv(FILE *f, const void *p)
{
    const csv_ctx *c = p;
    const sy_response *r = c->r;
    fprintf(f, "# swellyield %s response: pole expansion (motion poles only, no branch-cut part) and direct "
               "Fourier inversion (Omega %.6g rad/s, d_omega %.6g rad/s); m or rad\n",
            r->kind == SY_RESPONSE_DECAY ? "free-decay" : "heave-pulse", r->omega_max, r->d_omega);
    fprintf(f, "time_s");
    for (size_t d = 0; d < r->n_dof; d++) {
        const char *name = r->dof_body[d] >= 0 ? c->m->devices[r->dof_body[d]].name : "dof";
        fprintf(f, ",pole_sum_%s_%d,direct_%s_%d", name, r->dof_mode[d], name, r->dof_mode[d]);
    }
    fprintf(f, "\n");
    for (size_t j = 0; j < r->n_times; j++) {
        fprintf(f, "%.9g", r->t[j]);
        for (size_t d = 0; d < r->n_dof; d++)
            fprintf(f, ",%.9g,%.9g", r->pole_sum[j * r->n_dof + d], r->direct[j * r->n_dof + d]);
        fprintf(f, "\n");
    }
    return ferror(f) ? -1 : 0;
}

int sy_response_write_csv(const sy_response *r, const sy_model *m, const char *path, sy_error *err)
{
    csv_ctx c = {r, m};
    return sy_outputs_write_file(path, fill_csv, &c, err);
}

int sy_response_settings_standard(sy_response_settings *s, const sy_model *m, const sy_pole_set *ps,
                                  sy_response_kind kind, sy_error *err)
{
    double wr = INFINITY, gmin = INFINITY;
    for (size_t i = 0; i < ps->n; i++)
        if (ps->poles[i].kind == SY_POLE_MOTION && ps->poles[i].omega_r > 0) {
            wr = fmin(wr, ps->poles[i].omega_r);
            gmin = fmin(gmin, ps->poles[i].gamma);
        }
    if (!isfinite(wr))
        return sy_error_set(err, SY_EINPUT, "time response: no motion pole with omega_r > 0 in the region to time it by");
    /* Long enough for the slowest-decaying pole to fall to e^-7 ~ 1e-3, at least 3 and at
     * most 15 periods of the slowest pole. */
    double period = 2 * M_PI / wr, a = m->n_devices > 0 ? m->devices[0].radius : m->radius;
    double periods = fmax(FILE_PERIODS_MIN, fmin(FILE_PERIODS, ceil(FILE_DECAY / (gmin * period))));
    *s = (sy_response_settings){SY_RESPONSE_DECAY, 0, 1.0, 0, periods * period,
                                (size_t)(periods * FILE_SAMPLES) + 1, 0, 0};
    if (kind == SY_RESPONSE_PULSE) { /* the static force of a 1 m heave, over a quarter period */
        s->kind = SY_RESPONSE_PULSE, s->amplitude = m->rho * m->g * M_PI * a * a, s->duration = FILE_PULSE * period;
    }
    return SY_OK;
}
