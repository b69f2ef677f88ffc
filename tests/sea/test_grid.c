/* Frequency-grid weights, exact cell energies, and moments / power of sampled spectra.
 * Properties of the rule documented in sea.h plus comparison with the parametric
 * spectrum's exact moments (themselves checked against references.md 2 in
 * test_spectrum.c) and adaptive power integral (test_power.c). */
#include "check.h"
#include "swellyield/sea.h"

#include <float.h>
#include <math.h>

#define PI 3.14159265358979323846

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* Uniform grid omega_i = i dw, i = 1..100: every weight is dw, cells [dw/2, 100.5 dw]. */
    enum { NU = 100, NG = 4000 };
    double w[NG], dw[NG], S[NG], E[NG], lo, hi;
    for (int i = 0; i < NU; i++)
        w[i] = (i + 1) * 0.05;
    sy_check_ok(sy_sea_omega_weights(w, NU, dw, &lo, &hi, &err), &err, "uniform weights");
    double worst = 0;
    for (int i = 0; i < NU; i++)
        worst = fmax(worst, fabs(dw[i] - 0.05));
    sy_check_close(worst, 0, 0, 64 * DBL_EPSILON, "uniform grid: every weight = spacing");
    sy_check_close(lo, 0.025, 1e-14, 0, "uniform grid: lower cell bound half a step below");
    sy_check_close(hi, 5.025, 1e-14, 0, "uniform grid: upper cell bound half a step above");
    /* Geometric grid 0.2 .. ~40 rad/s: weights tile [lo, hi]; interior weights are the
     * trapezoid weights, so sum f w is exact for linear f away from the ends. */
    size_t n = 0;
    for (double x = 0.2; x < 40 && n < NG; x *= 1.002)
        w[n++] = x;
    sy_check_ok(sy_sea_omega_weights(w, n, dw, &lo, &hi, &err), &err, "geometric weights");
    double sum = 0, lin = 0;
    for (size_t i = 0; i < n; i++) {
        sum += dw[i];
        lin += (3 - 2 * w[i]) * dw[i];
    }
    sy_check_close(sum, hi - lo, 1e-13, 0, "weights tile the cells");
    /* Exact for linear f on [w0, w_{n-1}] plus the two half end cells taken at the end values. */
    double h0 = 0.5 * (w[1] - w[0]), h1 = 0.5 * (w[n - 1] - w[n - 2]);
    double want = (3 * (w[n - 1] - w[0]) - (w[n - 1] * w[n - 1] - w[0] * w[0])) +
                  h0 * (3 - 2 * w[0]) + h1 * (3 - 2 * w[n - 1]);
    sy_check_close(lin, want, 1e-12, 0, "linear function: trapezoid inside plus end half cells");

    /* Sampled JONSWAP on the geometric grid vs its exact moments. Step 0.2 % of omega:
     * the step error (dw^2/12) S''/S is at most ~ (0.0013 / 0.044)^2 / 12 ~ 1e-4 at the
     * peak (sigma wp = 0.044 rad/s) and largely cancels across it (measured: Hm0 3e-7,
     * Te 6e-8, T1 4e-6, eps0 6e-7, J 7e-7); the tail above 40 rad/s holds (1/4)(40/wp)^-4
     * / mu0 ~ 1e-7 of m0 but ~ 3e-4 of m2 (measured Tz 1.3e-4). Tolerances are about 5
     * times the measured errors, 3e-4 for Tz by the tail estimate. */
    sy_sea_spectrum s;
    sy_sea_spectrum_spec sp = {.kind = SY_SEA_JONSWAP, .hs = 2.4, .tp = 9.7, .gamma = 3.3};
    sy_check_ok(sy_sea_spectrum_init(&s, &sp, &err), &err, "spectrum");
    for (size_t i = 0; i < n; i++)
        S[i] = sy_sea_spectrum_eval(&s, w[i]);
    sy_sea_moments got, ref;
    sy_check_ok(sy_sea_moments_sampled(w, S, n, &got, &err), &err, "sampled moments");
    sy_sea_spectrum_moments(&s, &ref);
    sy_check_close(got.hm0, ref.hm0, 2e-6, 0, "sampled Hm0");
    sy_check_close(got.te, ref.te, 5e-7, 0, "sampled Te");
    sy_check_close(got.t1, ref.t1, 2e-5, 0, "sampled T1");
    sy_check_close(got.tz, ref.tz, 3e-4, 0, "sampled Tz");
    sy_check_close(got.eps0, ref.eps0, 3e-6, 0, "sampled eps0");
    for (int k = -2; k <= 2; k++)
        sy_check_close(got.mf[k + 2], got.m[k + 2] * pow(2 * PI, -k), 4 * DBL_EPSILON, 0,
                       "frequency moment m_%d = (2 pi)^-n angular moment (references.md 2.2)", k);
    sy_check_close(ref.te, 2 * PI * ref.m[1] / ref.m[2], 1e-14, 0,
                   "Te = 2 pi m_-1/m_0 in angular moments");
    sy_check_close(ref.te, ref.mf[1] / ref.mf[2], 1e-14, 0, "Te = m_-1/m_0 in frequency moments");
    sy_check_close(ref.tz, sqrt(ref.mf[2] / ref.mf[4]), 1e-14, 0,
                   "Tz = sqrt(m0/m2) in frequency moments");

    /* Exact cell energies: sum E + outside m0 = m0; E_i ~ S(w_i) dw_i on this fine grid. */
    double out;
    sy_check_ok(sy_sea_spectrum_cells(&s, w, n, E, &out, &err), &err, "cells");
    double sumE = 0, worstE = 0, m0 = ref.m[2];
    for (size_t i = 0; i < n; i++) {
        sumE += E[i];
        worstE = fmax(worstE, fabs(E[i] - S[i] * dw[i]) / m0);
    }
    sy_check_close(sumE + out * m0, m0, 1e-11, 0, "cell energies + outside = m0 (outside %.3g)",
                   out);
    sy_check_close(worstE, 0, 0, 1e-6, "cell energy ~ S dOmega on a 0.2 %% grid (share of m0)");
    /* PM cells in closed form vs JONSWAP gamma 1 cells by quadrature. */
    sy_sea_spectrum pm, j1;
    sy_sea_spectrum_spec spm = {.kind = SY_SEA_PM, .hs = 1, .tp = 6};
    sy_sea_spectrum_spec sj1 = {.kind = SY_SEA_JONSWAP, .hs = 1, .tp = 6, .gamma = 1};
    sy_check_ok(sy_sea_spectrum_init(&pm, &spm, &err), &err, "pm");
    sy_check_ok(sy_sea_spectrum_init(&j1, &sj1, &err), &err, "j1");
    double Ep[20], Ej[20], op, oj;
    const double coarse[20] = {0.5, 0.6, 0.7, 0.8, 0.85, 0.9, 0.95, 1.0, 1.05, 1.1,
                               1.2, 1.3, 1.4, 1.6, 1.8,  2.0, 2.3,  2.6, 3.0,  3.5};
    sy_check_ok(sy_sea_spectrum_cells(&pm, coarse, 20, Ep, &op, &err), &err, "pm cells");
    sy_check_ok(sy_sea_spectrum_cells(&j1, coarse, 20, Ej, &oj, &err), &err, "j1 cells");
    worst = 0;
    for (int i = 0; i < 20; i++)
        worst = fmax(worst, fabs(Ep[i] - Ej[i]) / (1.0 / 16));
    sy_check_close(worst, 0, 0, 1e-11, "PM closed-form cells = JONSWAP gamma 1 quadrature cells");
    sy_check_close(op, oj, 1e-10, 0, "outside fractions agree (%.4g)", op);

    /* Sampled power on the fine grid vs the adaptive integral (the same step error). */
    double Js, Ja;
    sy_check_ok(sy_sea_power_sampled(w, S, n, 1025, 9.81, 23, &Js, &err), &err, "sampled power");
    sy_check_ok(sy_sea_spectrum_power(&s, 1025, 9.81, 23, &Ja, &err), &err, "adaptive power");
    sy_check_close(Js, Ja, 4e-6, 0, "sampled J = adaptive J, h = 23 m");

    /* Bad grids. */
    const double bad1[3] = {0.5, 0.4, 0.6}, bad2[2] = {0.0, 0.4}, bad3[1] = {0.5};
    sy_check_fails(sy_sea_omega_weights(bad1, 3, dw, NULL, NULL, &err), SY_EINVAL, &err,
                   "strictly increasing, got omega[1] = 0.4 after 0.5", "unsorted grid");
    sy_check_fails(sy_sea_omega_weights(bad2, 2, dw, NULL, NULL, &err), SY_EINVAL, &err,
                   "omega[0] must be finite and > 0", "zero frequency");
    sy_check_fails(sy_sea_omega_weights(bad3, 1, dw, NULL, NULL, &err), SY_EINVAL, &err,
                   "at least 2 points", "one point");
    S[3] = -1;
    sy_check_fails(sy_sea_moments_sampled(w, S, n, &got, &err), SY_EINPUT, &err, "got S[3] = -1",
                   "negative density");
    return sy_check_summary();
}
