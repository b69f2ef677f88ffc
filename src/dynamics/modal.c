/* Response under one shared PTO damping by a per-frequency eigen-decomposition
 * (dynamics.h, sy_dyn_modal). Lets the tuning strategies evaluate hundreds of damping
 * values per sea state at O(n_devices^2) each. */
#include <complex.h>
#include "dynamics_impl.h"

#include <lapacke.h>
#include <stdlib.h>
#include <string.h>

struct sy_dyn_modal {
    size_t n_omega, n_headings, n;  /* n = devices */
    double *omega;                  /* copy of the db's grid */
    double complex *mu;             /* [n_omega][n] eigenvalues of G */
    double complex *w;              /* [n_omega][n][n] eigenvectors (columns) */
    double complex *c;              /* [n_omega][n_headings][n] W^-1 xi0_p */
};

void sy_dyn_modal_free(sy_dyn_modal *m)
{
    if (m == NULL)
        return;
    free(m->omega);
    free(m->mu);
    free(m->w);
    free(m->c);
    free(m);
}

int sy_dyn_modal_create(sy_dyn_modal **out, const sy_dyn_plan *p, double stiffness, sy_error *err)
{
    const sy_hydro_db *db = p->db;
    size_t no = db->n_omega, nh = db->n_headings, nd = p->n_dof, n = p->n_devices;
    if (n == 0)
        return sy_error_set(err, SY_EINVAL, "modal response: no PTO devices");
    sy_dyn_modal *m = calloc(1, sizeof *m);
    double complex *z = malloc(nd * nd * sizeof *z), *rhs = malloc(nd * (n + nh) * sizeof *rhs);
    double complex *g = malloc(n * n * sizeof *g), *vl = NULL, *wlu = malloc(n * n * sizeof *wlu);
    double complex *cc = malloc(n * nh * sizeof *cc);
    lapack_int *ipiv = malloc(nd * sizeof *ipiv);
    int rc = SY_OK;
    if (m != NULL) {
        m->n_omega = no, m->n_headings = nh, m->n = n;
        m->omega = malloc(no * sizeof *m->omega);
        m->mu = malloc(no * n * sizeof *m->mu);
        m->w = malloc(no * n * n * sizeof *m->w);
        m->c = malloc(no * nh * n * sizeof *m->c);
    }
    if (!m || !z || !rhs || !g || !wlu || !cc || !ipiv || !m->omega || !m->mu || !m->w || !m->c) {
        rc = sy_error_set(err, SY_ENOMEM, "modal response for %zu devices, %zu frequencies", n, no);
        goto done;
    }
    memcpy(m->omega, db->omega, no * sizeof *m->omega);
    size_t nr = n + nh; /* right-hand sides: the PTO unit vectors, then every heading's X */
    for (size_t io = 0; io < no && rc == SY_OK; io++) {
        double om = db->omega[io];
        const double *am = db->added_mass + io * nd * nd, *bd = db->damping + io * nd * nd;
        for (size_t i = 0; i < nd; i++)
            for (size_t j = 0; j < nd; j++) {
                size_t ij = i * nd + j;
                z[ij] = -om * om * (p->mass[ij] + am[ij]) - I * om * bd[ij] + p->stiff[ij];
            }
        for (size_t i = 0; i < nd; i++)
            z[i * nd + i] += -I * om * p->visc[i];
        for (size_t k = 0; k < n; k++)
            z[p->pto_dof[k] * nd + p->pto_dof[k]] += stiffness;
        memset(rhs, 0, nd * nr * sizeof *rhs);
        for (size_t k = 0; k < n; k++)
            rhs[p->pto_dof[k] * nr + k] = 1.0;
        const double complex *x = db->excitation + io * nh * nd;
        for (size_t h = 0; h < nh; h++)
            for (size_t i = 0; i < nd; i++)
                rhs[i * nr + n + h] = x[h * nd + i];
        lapack_int info = LAPACKE_zgesv(LAPACK_ROW_MAJOR, (lapack_int)nd, (lapack_int)nr, z, (lapack_int)nd, ipiv,
                                        rhs, (lapack_int)nr);
        if (info != 0) {
            rc = sy_error_set(err, SY_ESINGULAR, "modal response: impedance singular at omega = %g rad/s", om);
            break;
        }
        for (size_t k = 0; k < n; k++)
            for (size_t l = 0; l < n; l++)
                g[k * n + l] = rhs[p->pto_dof[k] * nr + l];
        double complex *mu = m->mu + io * n, *w = m->w + io * n * n;
        info = LAPACKE_zgeev(LAPACK_ROW_MAJOR, 'N', 'V', (lapack_int)n, g, (lapack_int)n, mu, vl, 1, w,
                             (lapack_int)n);
        if (info != 0) {
            rc = sy_error_set(err, SY_ENOCONV, "modal response: eigenvalues failed at omega = %g rad/s", om);
            break;
        }
        /* c = W^-1 xi0_p for every heading. */
        memcpy(wlu, w, n * n * sizeof *wlu);
        for (size_t k = 0; k < n; k++)
            for (size_t h = 0; h < nh; h++)
                cc[k * nh + h] = rhs[p->pto_dof[k] * nr + n + h];
        info = LAPACKE_zgesv(LAPACK_ROW_MAJOR, (lapack_int)n, (lapack_int)nh, wlu, (lapack_int)n, ipiv, cc,
                             (lapack_int)nh);
        if (info != 0) {
            rc = sy_error_set(err, SY_ESINGULAR, "modal response: defective PTO coupling at omega = %g rad/s", om);
            break;
        }
        for (size_t h = 0; h < nh; h++)
            for (size_t k = 0; k < n; k++)
                m->c[(io * nh + h) * n + k] = cc[k * nh + h];
    }
done:
    free(z);
    free(rhs);
    free(g);
    free(wlu);
    free(cc);
    free(ipiv);
    if (rc != SY_OK) {
        sy_dyn_modal_free(m);
        return rc;
    }
    *out = m;
    return SY_OK;
}

void sy_dyn_modal_eval(const sy_dyn_modal *m, size_t io, size_t ih, double b, double complex *scratch,
                       double *power, double *motion2)
{
    size_t n = m->n;
    double om = m->omega[io];
    const double complex *mu = m->mu + io * n, *w = m->w + io * n * n, *c = m->c + (io * m->n_headings + ih) * n;
    for (size_t j = 0; j < n; j++) {
        /* c / (1 - i w b mu) written out: C99 complex division (Annex G) is slow here. */
        double dr = 1.0 + om * b * cimag(mu[j]), di = -om * b * creal(mu[j]), inv = 1.0 / (dr * dr + di * di);
        double cr = creal(c[j]), ci = cimag(c[j]);
        scratch[j] = ((cr * dr + ci * di) + I * (ci * dr - cr * di)) * inv;
    }
    for (size_t k = 0; k < n; k++) {
        double complex xi = 0;
        for (size_t j = 0; j < n; j++)
            xi += w[k * n + j] * scratch[j];
        double a2 = creal(xi) * creal(xi) + cimag(xi) * cimag(xi);
        if (power != NULL)
            power[k] = 0.5 * om * om * b * a2;
        if (motion2 != NULL)
            motion2[k] = a2;
    }
}
