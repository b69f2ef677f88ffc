/* Wave power per metre of crest: deep-water closed form, finite-depth quadrature,
 * regular waves. Sources: references.md section 4 (values computed there by an
 * independent script) and ref_spectra.py (scipy 1.10 quad with its own brentq
 * dispersion solver, run at test time). rho = 1025, g = 9.81 unless stated. */
#include "check.h"
#include "pyref.h"
#include "swellyield/sea.h"

#include <float.h>
#include <math.h>

#define PI 3.14159265358979323846

static const double RHO = 1025, G = 9.81;

static sy_sea_spectrum make(sy_sea_spectrum_spec sp)
{
    sy_sea_spectrum s = {0};
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(sy_sea_spectrum_init(&s, &sp, &err), &err, "init");
    return s;
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* references.md 4: Hm0 = 2 m, Te = 8 s, deep water: J = 15.699362 kW/m; g = 9.80665:
     * 15.688642; rho = 1000: 15.316451 (8 digits: half-unit <= 3.3e-8 relative). */
    sy_check_close(sy_sea_power_deep(RHO, G, 2, 8), 15699.362, 3.3e-8, 0,
                   "deep J (references.md 4)");
    sy_check_close(sy_sea_power_deep(RHO, 9.80665, 2, 8), 15688.642, 3.3e-8, 0,
                   "deep J, g = 9.80665 (references.md 4)");
    sy_check_close(sy_sea_power_deep(1000, G, 2, 8), 15316.451, 3.3e-8, 0,
                   "deep J, rho = 1000 (references.md 4)");
    /* 0.4906 Hm0^2 Te kW/m: rho g^2/(64 pi) = 490.605 W/(m^3 s) (references.md 4, 6 digits). */
    sy_check_close(sy_sea_power_deep(RHO, G, 1, 1), 490.605, 1.1e-6, 0,
                   "rho g^2 / (64 pi) (references.md 4)");

    /* Deep-water quadrature of S cg equals the closed form for any shape (references.md
     * 4: exact in deep water); the quadrature is asked for 1e-12. */
    const sy_sea_spectrum_spec specs[] = {
        {.kind = SY_SEA_PM, .hs = 2, .te = 8},
        {.kind = SY_SEA_JONSWAP, .hs = 2, .te = 8, .gamma = 3.3, .norm = SY_SEA_NORM_EXACT},
        {.kind = SY_SEA_JONSWAP, .hs = 1.3, .tp = 11.7, .gamma = 6.2},
    };
    for (size_t i = 0; i < 3; i++) {
        sy_sea_spectrum s = make(specs[i]);
        double J;
        sy_check_ok(sy_sea_spectrum_power(&s, RHO, G, INFINITY, &J, &err), &err, "power deep");
        sy_check_close(J, sy_sea_power_deep(RHO, G, s.hm0, s.te), 1e-10, 0,
                       "deep quadrature = rho g^2 Hm0^2 Te/(64 pi), spectrum %zu", i);
        /* Finite but deep (kh > 60 for the energetic waves): the dispersion path. */
        sy_check_ok(sy_sea_spectrum_power(&s, RHO, G, 4000, &J, &err), &err, "power h = 4000");
        sy_check_close(J, sy_sea_power_deep(RHO, G, s.hm0, s.te), 1e-10, 0,
                       "h = 4000 m = deep, spectrum %zu", i);
    }

    /* references.md 4 finite-depth table, Hm0 = 2 m, Te = 8 s [computed]; 7 significant
     * digits in kW/m: half a unit <= 3.2e-7 relative. */
    const double depth[5] = {100, 50, 30, 20, 10};
    const double pm[5] = {15.79679, 16.61817, 17.64466, 18.06289, 17.06145};
    const double js[5] = {15.74216, 16.42836, 17.67563, 18.29749, 17.34175};
    sy_sea_spectrum a = make(specs[0]), b = make(specs[1]);
    for (int i = 0; i < 5; i++) {
        double J;
        sy_check_ok(sy_sea_spectrum_power(&a, RHO, G, depth[i], &J, &err), &err, "power PM");
        sy_check_close(J / 1e3, pm[i], 3.2e-7, 0, "PM Te 8 s, h = %g m (references.md 4)",
                       depth[i]);
        sy_check_ok(sy_sea_spectrum_power(&b, RHO, G, depth[i], &J, &err), &err, "power JONSWAP");
        sy_check_close(J / 1e3, js[i], 3.2e-7, 0,
                       "JONSWAP 3.3 exact, Te 8 s, h = %g m (references.md 4)", depth[i]);
    }
    /* A case of our own against scipy at test time: both quadratures ~1e-12, and the
     * period ratio and dispersion roots to ~1e-15: assert 1e-9. */
    double ref[1];
    sy_sea_spectrum c =
        make((sy_sea_spectrum_spec){.kind = SY_SEA_JONSWAP, .hs = 3.1, .te = 7.3, .gamma = 2.2});
    if (sy_check_true(pyref("power 2.2 dnv 3.1 7.3 27 1025 9.81", ref, 1) == 1,
                      "ref_spectra.py power ran")) {
        double J;
        sy_check_ok(sy_sea_spectrum_power(&c, RHO, G, 27, &J, &err), &err, "power");
        sy_check_close(J, ref[0], 1e-9, 0,
                       "JONSWAP 2.2 DNV Hs 3.1 Te 7.3 h 27 vs scipy 1.10 quad (ref_spectra.py)");
    }

    /* Regular waves, a = 1 m, T = 8 s (references.md 4): deep 31.39872 kW/m, h = 20 m:
     * 37.24984 kW/m (7 digits); deep closed form rho g^2 H^2 T / (32 pi), H = 2a. */
    double J;
    sy_check_ok(sy_sea_power_regular(RHO, G, 1, 2 * PI / 8, INFINITY, &J, &err), &err,
                "regular deep");
    sy_check_close(J / 1e3, 31.39872, 3.2e-7, 0, "regular deep (references.md 4)");
    sy_check_close(J, RHO * G * G * 4 * 8 / (32 * PI), 4 * DBL_EPSILON, 0,
                   "regular deep = rho g^2 H^2 T/(32 pi)");
    sy_check_close(
        J, 2 * sy_sea_power_deep(RHO, G, 2, 8), 4 * DBL_EPSILON, 0,
        "32 pi (regular, H) vs 64 pi (irregular, Hm0) forms differ by 2 (references.md 4)");
    sy_check_ok(sy_sea_power_regular(RHO, G, 1, 2 * PI / 8, 20, &J, &err), &err, "regular h 20");
    sy_check_close(J / 1e3, 37.24984, 3.2e-7, 0, "regular h = 20 m (references.md 4)");

    /* Bad input. */
    sy_check_fails(sy_sea_spectrum_power(&a, -1, G, 20, &J, &err), SY_EINPUT, &err,
                   "rho must be finite and > 0", "negative rho");
    sy_check_fails(sy_sea_spectrum_power(&a, RHO, G, 0, &J, &err), SY_EINPUT, &err,
                   "depth h must be > 0", "h = 0");
    sy_check_fails(sy_sea_power_regular(RHO, G, -1, 1, 20, &J, &err), SY_EINPUT, &err, "amplitude",
                   "a < 0");
    return sy_check_summary();
}
