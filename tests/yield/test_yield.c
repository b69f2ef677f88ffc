/* Yield on synthetic hydrodynamic data (the hydrodynamics are tested elsewhere): annual
 * energy aggregation against the worked example of references.md 5.4, the tuning
 * strategies against the single-mode passive optimum (Falnes 2002; references.md 7.2),
 * the stroke limit, the rated-power cap, the q-factor of one body, and convergence of the
 * spectral sum with frequency resolution. */
#include "check.h"
#include "float_model.h"
#include "swellyield/yield.h"
#include "swellyield/dynamics.h"
#include "swellyield/sea.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

/* ---- references.md 5.4: tiny worked example (computed there by calc_04_power_aep.py) ---- */
static const double wx_power_kw[3][3] = {{20, 30, 25}, {80, 120, 100}, {150, 250, 220}};

static int wx_power(const sy_climate_bin *bin, void *ctx, double *q, sy_error *err)
{
    (void)ctx;
    (void)err;
    *q = 1e3 * wx_power_kw[bin->i_hs][bin->i_period];
    return SY_OK;
}

static void worked_example(void)
{
    double hs_e[4] = {0.5, 1.5, 2.5, 3.5}, te_e[4] = {5, 7, 9, 11};
    sy_climate_bins bins = {3, hs_e, 3, te_e, SY_CLIMATE_TE, 0, NULL, 0};
    static const double f[9] = {0.10, 0.15, 0.05, 0.10, 0.25, 0.10, 0.05, 0.10, 0.10};
    sy_climate_table *t = NULL;
    sy_error err = SY_ERROR_INIT;
    if (!sy_check_ok(sy_climate_table_create(&t, &bins, SY_CLIMATE_FRACTION, &err), &err, "worked example table"))
        return;
    memcpy(sy_climate_table_occurrence_mut(t), f, sizeof f);
    sy_climate_average avg;
    if (sy_check_ok(sy_climate_table_average(t, wx_power, NULL, &avg, &err), &err, "annual sum")) {
        /* MAEP = 966.4515 MWh/yr with 8766 h (references.md 5.4, exact decimal arithmetic). */
        sy_check_close(avg.per_year / 1e6, 966.4515, 1e-12, 0, "MAEP of the worked example, 8766 h/yr");
        sy_check_close(avg.mean / 1e3, 110.250, 1e-12, 0, "mean power sum P f");
    }
    sy_climate_table_free(t);
}

/* ---- one synthetic heaving body ---- */

static void make_model(sy_model *m, sy_model_device *dev)
{
    static double x0 = 0;
    sy_test_float_model(m, dev, 1, &x0, NULL, NULL, 0, NULL, 0);
    m->depth = 60;
}

/* Smooth invented coefficients (shapes only; not a real body): B rises then falls with
 * omega, X from the heave Haskind relation in deep water B = omega^3 |X|^2/(2 rho g^3). */
static sy_hydro_db *make_db(size_t n, double w_lo, double w_hi, int single_line)
{
    sy_hydro_db *db = NULL;
    if (sy_hydro_db_alloc(&db, n, 1, 1, 1, NULL) != SY_OK)
        return NULL;
    db->dof_mode[0] = 3, db->body_radius[0] = 5, db->body_draft[0] = 4;
    for (size_t i = 0; i < n; i++) {
        double w = n == 1 ? w_lo : w_lo + (w_hi - w_lo) * (double)i / (double)(n - 1);
        db->omega[i] = w;
        db->added_mass[i] = 1.4e5 + 3e4 * exp(-w * w);
        db->damping[i] = 8e4 * w * w * exp(-0.8 * w * w);
        double x = sqrt(db->damping[i] * 2 * 1025 * pow(9.81, 3) / pow(w, 3));
        db->excitation[i] = (single_line && i > 0) ? 0 : x * cexp(0.2 * I * w);
    }
    return db;
}

static sy_climate_table *one_bin(double hs, double te)
{
    double hs_e[2] = {hs - 0.25, hs + 0.25}, te_e[2] = {te - 0.5, te + 0.5};
    sy_climate_bins bins = {1, hs_e, 1, te_e, SY_CLIMATE_TE, 0, NULL, 0};
    sy_climate_table *t = NULL;
    if (sy_climate_table_create(&t, &bins, SY_CLIMATE_HOURS, NULL) != SY_OK)
        return NULL;
    sy_climate_table_occurrence_mut(t)[0] = 1000.0;
    return t;
}

/* Two frequencies, only the first excited: every strategy sees a regular wave at w0, so
 * the best shared damping is the passive optimum sqrt(B^2 + (w (m + A) - C/w)^2). */
static void passive_optimum(void)
{
    sy_model m;
    sy_model_device dev;
    make_model(&m, &dev);
    sy_hydro_db *db = make_db(2, 0.8, 0.9, 1);
    sy_climate_table *t = one_bin(2.0, 8.0);
    sy_yield_result *r = NULL;
    sy_error err = SY_ERROR_INIT;
    const sy_hydro_db *iso[1] = {db};
    if (db && t && sy_check_ok(sy_yield_compute(&r, &m, t, db, iso, &err), &err, "yield, single line")) {
        double w = db->omega[0], mass = 1025 * M_PI * 25 * 4, c33 = 1025 * 9.81 * M_PI * 25;
        double bopt = sy_dyn_passive_optimum(w, mass, db->added_mass[0], db->damping[0], c33);
        /* log-b search tolerance 1e-5 -> b to ~1e-5 relative; the optimum is flat, so
         * power agrees far better. */
        sy_check_close(r->s[SY_TUNING_PER_SEA_STATE].damping[0], bopt, 1e-4, 0,
                       "per-sea-state minimiser finds the passive optimum (Falnes)");
        sy_check_close(r->s[SY_TUNING_SITE_OPTIMAL].site_damping, bopt, 1e-4, 0,
                       "site-optimal minimiser finds the passive optimum");
        /* Independent power: P = 2 E0 |X|^2 / (4 (B + b_opt)) (references.md 7.2, F = X a). */
        sy_sea_spectrum_spec spec = {SY_SEA_JONSWAP, 2.0, 0, 8.0, 0, 3.3, SY_SEA_NORM_EXACT};
        sy_sea_spectrum sp;
        double e[2];
        sy_sea_spectrum_init(&sp, &spec, &err);
        sy_sea_spectrum_cells(&sp, db->omega, 2, e, NULL, &err);
        double x2 = creal(db->excitation[0] * conj(db->excitation[0]));
        double want = 2 * e[0] * x2 / (4 * (db->damping[0] + bopt));
        sy_check_close(r->s[SY_TUNING_PER_SEA_STATE].power_array[0], want, 1e-9, 0,
                       "bin power = 2 E0 |X|^2 / (4 (B + b_opt))");
        sy_check_close(r->s[SY_TUNING_REACTIVE_BOUND].power_array[0], 2 * e[0] * x2 / (8 * db->damping[0]), 1e-12, 0,
                       "reactive bound = 2 E0 |X|^2 / (8 B)");
        sy_check_close(r->s[SY_TUNING_PER_SEA_STATE].q_factor, 1.0, 1e-14, 0, "q = 1 for one body");
        sy_check_close(r->s[SY_TUNING_PER_SEA_STATE].energy_array, want * 1000.0, 1e-9, 0,
                       "annual energy = power x 1000 h");
    }
    sy_yield_result_free(r);
    r = NULL;
    /* Stroke limit: a limit below the optimum's stroke forces a larger damping whose
     * significant stroke equals the limit. */
    m.max_stroke = 0.05;
    if (db && t && sy_check_ok(sy_yield_compute(&r, &m, t, db, iso, &err), &err, "yield, stroke-limited")) {
        const sy_yield_strategy *y = &r->s[SY_TUNING_PER_SEA_STATE];
        sy_check_close(y->stroke[0], 0.05, 1e-4, 0, "significant stroke held at max_stroke");
        sy_check_true(y->stroke_limited[0] == 1, "bin flagged as stroke-limited");
        sy_check_true(r->s[SY_TUNING_FIXED].stroke_limited[0] == 2 && r->s[SY_TUNING_FIXED].n_stroke_exceeded == 1,
                      "fixed tuning reports the exceedance");
    }
    sy_yield_result_free(r);
    r = NULL;
    /* Rated power and efficiency. */
    m.max_stroke = INFINITY, m.efficiency = 0.7, m.rated_power = 1e3;
    if (db && t && sy_check_ok(sy_yield_compute(&r, &m, t, db, iso, &err), &err, "yield, rated")) {
        sy_check_close(r->s[SY_TUNING_FIXED].power[0], 1e3, 0, 0, "rated power caps the electrical power");
        sy_check_close(r->s[SY_TUNING_FIXED].capacity_factor, 1e3 * 1000 / 8766.0 / 1e3, 1e-12, 0,
                       "capacity factor = mean power / rated, 8766 h/yr");
    }
    sy_yield_result_free(r);
    sy_hydro_db_free(db);
    sy_climate_table_free(t);
}

/* The spectral sum converges with frequency resolution (second order for the mid-point
 * cells: each halving of the step should cut the change by about 4; we require 2.5). */
static void resolution(void)
{
    sy_model m;
    sy_model_device dev;
    make_model(&m, &dev);
    sy_climate_table *t = one_bin(2.0, 8.0);
    double p[4];
    size_t ns[4] = {41, 81, 161, 321};
    for (int i = 0; i < 4; i++) {
        sy_hydro_db *db = make_db(ns[i], 0.3, 2.3, 0);
        const sy_hydro_db *iso[1] = {db};
        sy_yield_result *r = NULL;
        sy_error err = SY_ERROR_INIT;
        p[i] = NAN;
        if (db && sy_yield_compute(&r, &m, t, db, iso, &err) == SY_OK)
            p[i] = r->s[SY_TUNING_FIXED].power_array[0];
        sy_yield_result_free(r);
        sy_hydro_db_free(db);
    }
    double d1 = fabs(p[1] - p[0]), d2 = fabs(p[2] - p[1]), d3 = fabs(p[3] - p[2]);
    sy_check_true(d2 < d1 / 2.5 && d3 < d2 / 2.5, "spectral sum converges with resolution (changes %.3g, %.3g, %.3g W)",
                  d1, d2, d3);
    sy_check_close(p[3], p[2], 1e-4, 0, "321 vs 161 frequencies agree to 1e-4");
    sy_climate_table_free(t);
}

/* A narrowing spectrum approaches the regular wave of the same variance: with a^2/2 = m0,
 * P -> a^2 p(omega_p) = (Hs^2 / 8) p(omega_p) (linear superposition; common practice).
 * p(omega) here is the single-mode closed form for the synthetic coefficients. */
static double p_unit(const sy_hydro_db *db, double w, double b)
{
    /* The synthetic shapes of make_db evaluated at any omega. */
    double A = 1.4e5 + 3e4 * exp(-w * w), B = 8e4 * w * w * exp(-0.8 * w * w);
    double X2 = B * 2 * 1025 * pow(9.81, 3) / pow(w, 3), m = 1025 * M_PI * 25 * 4, C = 1025 * 9.81 * M_PI * 25;
    (void)db;
    double re = C - w * w * (m + A), im = w * (B + b);
    return 0.5 * w * w * b * X2 / (re * re + im * im);
}

static void narrow(void)
{
    sy_model m;
    sy_model_device dev;
    make_model(&m, &dev);
    sy_hydro_db *db = make_db(801, 0.3, 2.3, 0);
    const sy_hydro_db *iso[1] = {db};
    sy_climate_table *t = one_bin(2.0, 8.0);
    double gammas[4] = {1.0, 3.3, 7.0, 20.0}, err_prev = INFINITY;
    for (int i = 0; i < 4 && db && t; i++) {
        m.gamma = gammas[i];
        sy_yield_result *r = NULL;
        sy_error err = SY_ERROR_INIT;
        sy_sea_spectrum_spec spec = {SY_SEA_JONSWAP, 2.0, 0, 8.0, 0, gammas[i], SY_SEA_NORM_EXACT};
        sy_sea_spectrum sp;
        if (sy_yield_compute(&r, &m, t, db, iso, &err) != SY_OK || sy_sea_spectrum_init(&sp, &spec, &err) != SY_OK) {
            sy_check_ok(SY_EINVAL, &err, "narrow spectrum, gamma %g", gammas[i]);
            sy_yield_result_free(r);
            continue;
        }
        double reg = 4.0 / 8.0 * p_unit(db, sp.omega_p, 2e5), got = r->s[SY_TUNING_FIXED].power_array[0];
        double rel = fabs(got - reg) / reg;
        sy_check_true(rel < err_prev, "gamma %g: |P - P_regular| / P_regular = %.4f, smaller than for the wider spectrum",
                      gammas[i], rel);
        err_prev = rel;
        sy_yield_result_free(r);
    }
    sy_hydro_db_free(db);
    sy_climate_table_free(t);
}

/* Band accounting is a partition: a band holding every frequency holds all the energy,
 * two complementary bands add up to it (our own bookkeeping; no outside reference). */
static void bands(void)
{
    sy_model m;
    sy_model_device dev;
    make_model(&m, &dev);
    m.rated_power = 3e4; /* the cap is shared out in proportion too */
    sy_hydro_db *db = make_db(81, 0.3, 2.3, 0);
    const sy_hydro_db *iso[1] = {db};
    sy_climate_table *t = one_bin(2.0, 8.0);
    double b[6] = {0.0, 10.0, 0.0, 0.9, 0.9 + 1e-9, 10.0};
    sy_yield_result *r = NULL;
    sy_error err = SY_ERROR_INIT;
    if (db && t && sy_check_ok(sy_yield_compute_banded(&r, &m, t, db, iso, b, 3, &err), &err, "banded yield")) {
        for (int st = 0; st < SY_YIELD_N_STRATEGIES; st++) {
            const sy_yield_strategy *y = &r->s[st];
            sy_check_close(y->energy_band[0], y->energy_array, 1e-12, 0, "%s: a band over all frequencies holds all energy",
                           sy_yield_strategy_name(st));
            sy_check_close(y->energy_band[1] + y->energy_band[2], y->energy_array, 1e-12, 0,
                           "%s: complementary bands add up", sy_yield_strategy_name(st));
        }
        sy_check_close(r->band_fraction[0], 1.0, 1e-12, 0, "spectral fraction in the all-frequency band");
        sy_check_close(r->band_fraction[1] + r->band_fraction[2], 1.0, 1e-12, 0, "complementary spectral fractions");
    }
    sy_yield_result_free(r);
    sy_hydro_db_free(db);
    sy_climate_table_free(t);
}

int main(void)
{
    sy_init();
    worked_example();
    passive_optimum();
    resolution();
    narrow();
    bands();
    return sy_check_summary();
}
