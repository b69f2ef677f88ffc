/* Picture 4: the site's most frequent sea state (the bin with most hours): its spectrum
 * S(omega) (the model's JONSWAP or Bretschneider, exact normalisation Hm0 = Hs, as the
 * yield builds it) and the array's absorbed power density in that sea at the fixed PTO
 * setting ([pto] mode), P(omega) = 2 S(omega) sum_j D_j sum_k p_k(omega, beta_j) (W s/rad), with p_k
 * the mechanical power per unit amplitude^2 from sy_dyn_response and D_j the cos-2s
 * weights about the bin's direction (conventions.md "factor 2"). Mechanical power,
 * before efficiency and rating; the spectral energy outside the run's grid is not drawn. */
#include "plot_impl.h"
#include "swellyield/dynamics.h"
#include "swellyield/sea.h"

#include <math.h>
#include <plplot.h>
#include <stdio.h>
#include <stdlib.h>

#define HEAVE 3 /* the PTO mode when a hand-built model leaves pto_mode 0 */

size_t syi_plot_most_frequent_bin(const sy_yield_result *r)
{
    size_t best = 0;
    for (size_t i = 1; i < r->n_bins; i++)
        if (r->hours[i] > r->hours[best])
            best = i;
    return best;
}

/* Power density at every grid frequency (W s/rad) for the sea (sp, D). */
static int absorbed(const sy_model *m, const sy_hydro_db *db, const sy_sea_spectrum *sp, const double *D,
                    double *P, sy_error *err)
{
    sy_dyn_plan *plan = NULL;
    sy_dyn_work *work = NULL;
    size_t nh = db->n_headings, nk = 0;
    double *b = NULL, *kst = NULL, *pw = NULL;
    int rc = sy_dyn_plan_create(&plan, m, db, m->pto_mode > 0 ? m->pto_mode : HEAVE, err);
    if (rc == SY_OK)
        rc = sy_dyn_work_alloc(&work, plan, err);
    if (rc == SY_OK) {
        nk = sy_dyn_n_devices(plan);
        b = malloc(nk * sizeof *b), kst = malloc(nk * sizeof *kst), pw = malloc(nh * nk * sizeof *pw);
        if (b == NULL || kst == NULL || pw == NULL)
            rc = sy_error_set(err, SY_ENOMEM, "power density for %zu devices", nk);
    }
    for (size_t k = 0; rc == SY_OK && k < nk; k++) {
        const sy_model_device *d = &m->devices[sy_dyn_device_body(plan, k)];
        b[k] = d->pto_damping, kst[k] = d->pto_stiffness;
    }
    for (size_t i = 0; rc == SY_OK && i < db->n_omega; i++) {
        rc = sy_dyn_response(plan, i, b, kst, work, NULL, pw, err);
        double sum = 0.0;
        for (size_t j = 0; rc == SY_OK && j < nh; j++)
            for (size_t k = 0; k < nk; k++)
                sum += D[j] * pw[j * nk + k];
        P[i] = 2.0 * sy_sea_spectrum_eval(sp, db->omega[i]) * sum;
        if (rc != SY_OK)
            sy_error_prefix(err, "omega %g rad/s", db->omega[i]);
    }
    free(b), free(kst), free(pw);
    sy_dyn_work_free(work);
    sy_dyn_plan_free(plan);
    return rc;
}

int syi_plot_spectrum(const char *dir, const char *ext, const sy_model *m, const sy_climate_table *cl,
                      const sy_hydro_db *db, const sy_yield_result *r, sy_error *err)
{
    const sy_climate_bins *bins = sy_climate_table_bins(cl);
    size_t nd = bins->n_dir > 0 ? bins->n_dir : 1, idx = syi_plot_most_frequent_bin(r);
    size_t id = idx % nd, ip = (idx / nd) % bins->n_period, ihs = idx / nd / bins->n_period;
    double hs = 0.5 * (bins->hs_edges[ihs] + bins->hs_edges[ihs + 1]);
    double per = 0.5 * (bins->period_edges[ip] + bins->period_edges[ip + 1]);
    sy_sea_spectrum_spec spec = {0};
    spec.kind = m->spectrum == SY_SPECTRUM_JONSWAP ? SY_SEA_JONSWAP : SY_SEA_PM;
    spec.hs = hs;
    spec.gamma = m->spectrum == SY_SPECTRUM_JONSWAP ? m->gamma : 0.0;
    spec.norm = SY_SEA_NORM_EXACT;
    if (bins->period == SY_CLIMATE_TE)
        spec.te = per;
    else
        spec.tp = per;
    sy_sea_spectrum sp;
    sy_sea_spreading spr;
    double from = bins->n_dir > 0 ? bins->dir_centres[id] : m->direction_from, beta = 0.0;
    size_t no = db->n_omega;
    double *D = malloc(db->n_headings * sizeof *D), *P = malloc(no * sizeof *P), *S = malloc(no * sizeof *S);
    double *dw = malloc(no * sizeof *dw);
    int rc = (D && P && S && dw) ? SY_OK : sy_error_set(err, SY_ENOMEM, "spectrum picture");
    if (rc == SY_OK)
        rc = sy_sea_spectrum_init(&sp, &spec, err);
    if (rc == SY_OK && !isnan(from))
        rc = sy_climate_heading(from, m->x_axis_bearing * 180.0 / M_PI, &beta, err);
    if (rc == SY_OK)
        rc = sy_sea_spreading_init(&spr, m->spreading, beta, err);
    if (rc == SY_OK)
        rc = sy_sea_spreading_weights(&spr, db->headings, db->n_headings, D, NULL, err);
    if (rc == SY_OK)
        rc = absorbed(m, db, &sp, D, P, err);
    if (rc == SY_OK)
        rc = sy_sea_omega_weights(db->omega, no, dw, NULL, NULL, err);
    if (rc != SY_OK) {
        free(D), free(P), free(S), free(dw);
        sy_error_prefix(err, "spectrum picture");
        return rc;
    }
    double smax = 0.0, pmax = 0.0, ptot = 0.0;
    for (size_t i = 0; i < no; i++) {
        S[i] = sy_sea_spectrum_eval(&sp, db->omega[i]);
        P[i] /= 1e3; /* kW s/rad */
        smax = fmax(smax, S[i]), pmax = fmax(pmax, P[i]), ptot += P[i] * dw[i];
    }
    smax = smax > 0 ? 1.4 * smax : 1.0, pmax = pmax > 0 ? 1.4 * pmax : 1.0;
    double x0 = db->omega[0], x1 = db->omega[no - 1];
    if (!(x1 > x0))
        x0 -= 0.1, x1 += 0.1;
    syi_plot_canvas c;
    if ((rc = syi_plot_begin(&c, dir, "spectrum", ext, err)) != SY_OK) {
        free(D), free(P), free(S), free(dw);
        return rc;
    }
    PLFLT *fx = malloc((no + 2) * sizeof *fx), *fy = malloc((no + 2) * sizeof *fy);
    plvpor(0.12, 0.88, 0.12, 0.85);
    /* Left axis: the spectrum, lightly filled. */
    plwind(x0, x1, 0.0, smax);
    plcol0(SYI_PC_GRID);
    plbox("g", syi_plot_nice_step(x1 - x0, 8), 0, "", 0, 0);
    if (fx != NULL && fy != NULL) {
        for (size_t i = 0; i < no; i++)
            fx[i] = db->omega[i], fy[i] = S[i];
        fx[no] = x1, fy[no] = 0.0, fx[no + 1] = x0, fy[no + 1] = 0.0;
        plcol0(SYI_PC_FILL);
        plfill((PLINT)no + 2, fx, fy);
        plcol0(SYI_PC_B);
        plwidth(3.0);
        plline((PLINT)no, fx, fy);
    }
    plwidth(1.5);
    plcol0(SYI_PC_INK);
    plbox("bcnst", syi_plot_nice_step(x1 - x0, 8), 0, "bfnstv", syi_plot_nice_step(smax, 5), 0);
    plcol0(SYI_PC_B);
    plmtex("l", 5.0, 0.5, 0.5, "wave spectrum S(#gw) (m#u2#d s/rad)");
    /* Right axis: absorbed power density. */
    plwind(x0, x1, 0.0, pmax);
    if (fx != NULL && fy != NULL) {
        for (size_t i = 0; i < no; i++)
            fy[i] = P[i];
        plcol0(SYI_PC_A);
        plwidth(3.0);
        plline((PLINT)no, fx, fy);
        plwidth(1.5);
    }
    plcol0(SYI_PC_INK);
    plbox("", 0, 0, "cfmstv", syi_plot_nice_step(pmax, 5), 0);
    plcol0(SYI_PC_A);
    plmtex("r", 4.0, 0.5, 0.5, "absorbed power density (kW s/rad)");
    char title[200], l1[128], l2[128];
    snprintf(title, sizeof title, "Most frequent sea state: H#ds#u %.2g m, %s %.3g s (%.0f h/yr)", hs,
             bins->period == SY_CLIMATE_TE ? "T#de#u" : "T#dp#u", per, r->hours[idx]);
    plcol0(SYI_PC_INK);
    plschr(0.0, 1.35);
    plmtex("t", 2.5, 0.5, 0.5, title);
    plschr(0.0, 1.15);
    plmtex("b", 3.0, 0.5, 0.5, "wave frequency #gw (rad/s)");
    syi_plot_subtitle(SYI_PC_A, "array power: fixed PTO damping, mechanical (before efficiency and rating)");
    snprintf(l1, sizeof l1, "S(#gw), %s", m->spectrum == SY_SPECTRUM_JONSWAP ? "JONSWAP" : "Bretschneider");
    snprintf(l2, sizeof l2, "array power (%.3g kW)", ptot);
    syi_plot_legend_box(2, 1);
    syi_plot_legend_line(0, 1, SYI_PC_B, 0, l1);
    syi_plot_legend_line(1, 1, SYI_PC_A, 0, l2);
    free(fx), free(fy);
    free(D), free(P), free(S), free(dw);
    return syi_plot_end(&c, SY_OK, err);
}
