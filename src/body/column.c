/* The `column` body kind: a fixed, bottom-mounted, surface-piercing vertical circular
 * cylinder of radius a in depth h (draft = h). Closed form (MacCamy & Fuchs 1954; Mei,
 * ch. 7): a full-depth cylinder does not couple the depth modes, so D is diagonal in q,
 *   D_n(0, 0) = -J_n'(k_0 a) / H_n'(k_0 a)       (no normal velocity on r = a),
 *   D_n(q, q) = -I_n'(k_q a) / K_n'(k_q a)       (q >= 1).
 * The total potential on r = a of the partial wave (q, n) plus its scattered wave is
 * Z_q(z) psi_{qn} e^{i n theta}, by the Wronskians J H' - J' H = 2i/(pi x) and
 * I K' - I' K = -1/x:
 *   psi_{0n} = 2i / (pi x H_n'(x)),   psi_{qn} = -1 / (x K_n'(x)),
 * and G_j(q, n) = -i omega rho a psi_{qn} int_{-h}^0 int_0^{2pi} Z_q n_j e^{i n theta}.
 * Only n = +-1 contribute (surge, sway, roll, pitch; heave and the seabed carry no load
 * on a column). Rotations are about (0, 0, z_rot): n_4 = -(z - z_rot) sin theta,
 * n_5 = (z - z_rot) cos theta; z_rot = -h gives the overturning moment about the seabed.
 * The column is fixed: radiation, added mass and damping are zero.
 * Real or complex omega (the roots and the special functions carry the continuation).
 * Overflow: D_n(q, q) grows like exp(2 k_q a); k_q a < 300 is required (checked). */
#include "body_impl.h"

#include "swellyield/special.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* exp(2 k_q a) must stay finite in double for D_n(q, q): k_q a below this bound. */
#define COLUMN_MAX_KA_EVANESCENT 300.0
#define COLUMN_PI 3.14159265358979323846

typedef struct column_work {
    size_t n_fn;             /* M + 2 orders 0..M+1 */
    double complex *f, *g;   /* two Bessel rows of length n_fn */
} column_work;

static int plan_init(sy_body_plan *plan, sy_error *err)
{
    (void)err;
    plan->n_roots = plan->n_depth - 1;
    plan->impl = NULL;
    return SY_OK;
}

static void plan_free(sy_body_plan *plan) { (void)plan; }

static int work_init(sy_body_work *work, const sy_body_plan *plan, sy_error *err)
{
    column_work *w = calloc(1, sizeof *w);
    if (w != NULL) {
        w->n_fn = plan->n_order + 2;
        w->f = malloc(w->n_fn * sizeof *w->f);
        w->g = malloc(w->n_fn * sizeof *w->g);
    }
    if (w == NULL || w->f == NULL || w->g == NULL) {
        if (w != NULL) {
            free(w->f);
            free(w->g);
        }
        free(w);
        return sy_error_set(err, SY_ENOMEM, "column work for M = %zu", plan->n_order);
    }
    work->impl = w;
    return SY_OK;
}

static void work_free(sy_body_work *work)
{
    column_work *w = work->impl;
    if (w != NULL) {
        free(w->f);
        free(w->g);
        free(w);
    }
    work->impl = NULL;
}

/* Derivative of the order-n member of a cylinder-function row c[0..n+1] (n >= 0) with
 * c_{-1} = sign_m1 * c_1: c_n' = (c_{n-1} - c_{n+1}) / 2 for J, Y, H (sign_m1 = -1) and
 * c_n' = (c_{n-1} + c_{n+1}) / 2 for I (sign_m1 = +1). K uses -(K_{n-1} + K_{n+1})/2. */
static double complex deriv_jh(const double complex *c, size_t n)
{
    double complex prev = n == 0 ? -c[1] : c[n - 1];
    return 0.5 * (prev - c[n + 1]);
}
static double complex deriv_i(const double complex *c, size_t n)
{
    double complex prev = n == 0 ? c[1] : c[n - 1];
    return 0.5 * (prev + c[n + 1]);
}

/* int_{-h}^0 Z_q dz and int_{-h}^0 (z + h) Z_q dz, in forms free of cosh overflow:
 * propagating Z_0 = cosh(k(z+h))/cosh(kh): tanh(kh)/k, h tanh(kh)/k - (1 - sech(kh))/k^2;
 * evanescent Z_q = cos(k(z+h))/cos(kh): tan(kh)/k, h tan(kh)/k + (1 - sec(kh))/k^2. */
static void depth_integrals(double complex k, double h, int evanescent, double complex *i0,
                            double complex *i1)
{
    double complex kh = k * h;
    if (!evanescent) {
        double complex sech = 2.0 * cexp(-kh) / (1.0 + cexp(-2.0 * kh));
        *i0 = ctanh(kh) / k;
        *i1 = h * ctanh(kh) / k - (1.0 - sech) / (k * k);
    } else {
        *i0 = ctan(kh) / k;
        *i1 = h * ctan(kh) / k + (1.0 - 1.0 / ccos(kh)) / (k * k);
    }
}

static int solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                 sy_body_work *work, sy_body_waves *out, sy_error *err)
{
    column_work *w = work->impl;
    const size_t M = plan->n_order, Q = plan->n_depth, nn = 2 * M + 1;
    const double a = plan->geom.radius, h = plan->h;
    const double complex omega = roots->omega;
    const int mp1 = (int)M + 1;

    memset(out->diffraction, 0, (M + 1) * Q * Q * sizeof *out->diffraction);
    memset(out->radiation, 0, SY_BODY_NMODES * Q * nn * sizeof *out->radiation);
    memset(out->force, 0, SY_BODY_NMODES * Q * nn * sizeof *out->force);
    memset(out->added_mass, 0, sizeof out->added_mass);
    memset(out->damping, 0, sizeof out->damping);
    out->convergence = 0.0;   /* closed form: exact up to rounding */

    for (size_t q = 0; q < Q; q++) {
        double complex k = q == 0 ? roots->k0 : roots->k[q - 1];
        double complex x = k * a, psi1, psim1;
        int rc;
        if (q == 0) {
            rc = sy_special_besselj_array(mp1, x, w->f, err);
            if (rc == SY_OK)
                rc = sy_special_hankel1_array(mp1, x, w->g, err);
            if (rc != SY_OK) {
                sy_error_prefix(err, "column: k0 a = %g%+gi", creal(x), cimag(x));
                return rc;
            }
            for (size_t n = 0; n <= M; n++)
                out->diffraction[(n * Q + q) * Q + q] = -deriv_jh(w->f, n) / deriv_jh(w->g, n);
            double complex h1p = deriv_jh(w->g, 1);
            psi1 = 2.0 * I / (COLUMN_PI * x * h1p);
            psim1 = -psi1;     /* J_{-1} = -J_1, H_{-1} = -H_1 */
        } else {
            if (creal(x) > COLUMN_MAX_KA_EVANESCENT)
                return sy_error_set(err, SY_ELOSS,
                                    "column: evanescent mode %zu has k a = %g > %g (D overflows); "
                                    "use fewer depth modes", q, creal(x),
                                    COLUMN_MAX_KA_EVANESCENT);
            /* scaled: I_n = Is_n e^{|Re x|}, K_n = Ks_n e^{-x} */
            rc = sy_special_besseli_scaled_array(mp1, x, w->f, err);
            if (rc == SY_OK)
                rc = sy_special_besselk_scaled_array(mp1, x, w->g, err);
            if (rc != SY_OK) {
                sy_error_prefix(err, "column: k%zu a = %g%+gi", q, creal(x), cimag(x));
                return rc;
            }
            double complex growth = cexp(fabs(creal(x)) + x);
            for (size_t n = 0; n <= M; n++) {
                double complex kp = -deriv_i(w->g, n);   /* K' = -(K_{n-1} + K_{n+1}) / 2 */
                out->diffraction[(n * Q + q) * Q + q] = -deriv_i(w->f, n) / kp * growth;
            }
            double complex k1p = -deriv_i(w->g, 1) * cexp(-x);
            psi1 = -1.0 / (x * k1p);
            psim1 = psi1;      /* I_{-1} = I_1, K_{-1} = K_1 */
        }
        double complex iz0, iz1;
        depth_integrals(k, h, q > 0, &iz0, &iz1);
        /* moment arm about z_rot: int (z - z_rot) Z = int (z + h) Z - (z_rot + h) int Z */
        double complex izr = iz1 - (plan->geom.z_rot + h) * iz0;
        double complex pre = -I * omega * rho * a;
        /* angular integrals: int e^{i n t} cos t = pi (n = +-1);
         *                    int e^{i n t} sin t = i pi (n = 1), -i pi (n = -1) */
        const double complex c1[2] = {COLUMN_PI, COLUMN_PI};           /* n = -1, +1 */
        const double complex c2[2] = {-I * COLUMN_PI, I * COLUMN_PI};
        const double complex psi[2] = {psim1, psi1};
        for (int s = 0; s < 2 && M >= 1; s++) {
            size_t col = s == 0 ? M - 1 : M + 1;
            double complex base = pre * psi[s];
            out->force[(0 * Q + q) * nn + col] = base * iz0 * c1[s];
            out->force[(1 * Q + q) * nn + col] = base * iz0 * c2[s];
            out->force[(3 * Q + q) * nn + col] = -base * izr * c2[s];
            out->force[(4 * Q + q) * nn + col] = base * izr * c1[s];
        }
    }
    return SY_OK;
}

const syi_body_ops syi_body_column_ops = {plan_init, plan_free, work_init, work_free, solve};
