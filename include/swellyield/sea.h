/* Sea states: parametric wave spectra (Pierson-Moskowitz/Bretschneider, JONSWAP),
 * spectral moments and periods, wave power per metre of crest, cos-2s directional
 * spreading, and the quadrature weights that turn a run's frequency and heading grids
 * into irregular-sea sums.
 *
 * Units (SI, conventions.md): omega rad/s, f Hz, periods s, Hs and Hm0 m, headings and
 * directions rad (the direction waves travel TOWARD, counter-clockwise from +x; the
 * climate module converts from nautical "from" bearings), rho kg/m^3, g m/s^2, depth h m
 * (INFINITY = deep water), wave power J W/m.
 * Spectra are one-sided variance densities: S(omega) in m^2 s/rad, S(f) = 2 pi S(omega)
 * in m^2/Hz, m0 = int S(omega) domega = int S(f) df = Hm0^2 / 16.
 * Irregular-sea sums ("factor 2", conventions.md): a component of density S carries
 * amplitude^2 = 2 S dOmega, so
 *   P = sum_i sum_j 2 S(omega_i) dOmega_i D_j p(omega_i, beta_j),
 * p the power per unit amplitude^2, dOmega_i from sy_sea_omega_weights (mid-point
 * cells) and D_j from sy_sea_spreading_weights (the integral of D over heading cell j).
 * For exact energy per frequency cell use E_i = int_cell S from sy_sea_spectrum_cells in
 * place of S(omega_i) dOmega_i.
 *
 * Value types: sy_sea_spectrum and sy_sea_spreading are small plain structs (no owned
 * memory; copy freely), filled and validated once by their _init function and then only
 * read (plain data, public like sy_model: callers keep them in arrays and report their
 * fields). All functions are pure and thread-safe; the quadrature-based ones
 * (sy_sea_spectrum_init for JONSWAP, _cdf, _cells, _power, _directionality) allocate a
 * GSL integration workspace per call (SY_ENOMEM if that fails); the _eval functions and
 * the weights never allocate.
 *
 * Status codes: SY_OK; SY_EINPUT for a bad sea-state value (message names the variable,
 * the value and the accepted range); SY_EINVAL for a bad argument from the program
 * (NULL pointers, unsorted grids); SY_ENOCONV / SY_ELOSS when a GSL quadrature fails
 * (GSL's message and the integral named); SY_ENOMEM. */
#ifndef SWELLYIELD_SEA_H
#define SWELLYIELD_SEA_H

#include <stddef.h>
#include "swellyield/core.h"

#ifdef __cplusplus
extern "C" {
#endif

/* ---- Spectra ------------------------------------------------------------------------ */

typedef enum sy_sea_kind {
    /* Pierson-Moskowitz shape in Hs and Tp, a.k.a. two-parameter Bretschneider:
     * S = (5/16) Hs^2 wp^4 w^-5 exp(-(5/4)(w/wp)^-4)   (references.md 2.1) */
    SY_SEA_PM = 1,
    SY_SEA_BRETSCHNEIDER = SY_SEA_PM, /* the same shape (project files say "bretschneider") */
    /* JONSWAP, DNV-RP-C205 form: A S_PM(w) gamma^exp(-(w - wp)^2 / (2 sigma^2 wp^2)),
     * sigma = 0.07 (w <= wp), 0.09 (w > wp)   (references.md 2.3) */
    SY_SEA_JONSWAP = 2
} sy_sea_kind;

typedef enum sy_sea_norm {
    /* A = 1 - 0.287 ln(gamma) (DNV-RP-C205; coefficient from memory, unverified, see
     * references.md 2.3): 4 sqrt(m0) misses Hs by +0.12 % at gamma 3.3, -0.88 % at 7. */
    SY_SEA_NORM_DNV = 0,
    /* A chosen so that m0 = Hs^2/16 exactly (A = 1 / (5 mu0(gamma)), by quadrature). */
    SY_SEA_NORM_EXACT = 1
} sy_sea_norm;

/* What the caller knows about a sea state. Give Hs and exactly one of tp, te, tz (> 0,
 * the others 0). gamma: JONSWAP peak enhancement 1 <= gamma <= 20, or 0 to use the DNV
 * rule sy_sea_gamma_dnv (solved consistently when te or tz is given); must be 0 or 1
 * for SY_SEA_PM. norm is ignored for PM (A = 1 is exact there).
 * A zeroed spec's norm is SY_SEA_NORM_DNV (the standard's form). For climate-driven
 * yields, where the table's Hs is the spectral Hm0 = 4 sqrt(m0), SY_SEA_NORM_EXACT keeps
 * the spectrum's energy equal to the bin's: J ~ Hm0^2, and the DNV factor alone moves
 * J by +0.24 % at gamma 3.3 and -1.8 % at gamma 7. */
typedef struct sy_sea_spectrum_spec {
    sy_sea_kind kind;
    double hs; /* significant wave height the spectrum is built from, m */
    double tp, te, tz; /* peak, energy (m_-1/m_0) or zero-crossing period, s */
    double gamma;
    sy_sea_norm norm;
} sy_sea_spectrum_spec;

/* A validated spectrum, filled by sy_sea_spectrum_init; read-only afterwards. */
typedef struct sy_sea_spectrum {
    sy_sea_kind kind;
    sy_sea_norm norm; /* normalisation actually used (DNV or EXACT; EXACT for PM) */
    int gamma_from_rule; /* 1 if gamma came from the DNV rule */
    double hs; /* Hs as given, m */
    double gamma; /* 1 for PM */
    double alpha; /* normalising factor A actually applied (1 for PM) */
    double tp, omega_p; /* s, rad/s */
    /* Spectral parameters of the spectrum as built (from the shape's moments, exact
     * for PM, adaptive quadrature to ~1e-12 for JONSWAP): */
    double hm0; /* 4 sqrt(m0), m (= hs except with the DNV normalisation) */
    double te, tz, t1; /* energy, zero-crossing, mean period, s */
    double eps0; /* spectral width sqrt(m0 m_-2 / m_-1^2 - 1) */
    double mu[5]; /* shape moments int u^n s(u) du, n = -2..2 (mu[n + 2]),
                               u = omega/omega_p, s(u) = u^-5 e^{-5/4 u^-4} gamma^r(u) */
    double scale; /* A (5/16) Hs^2 / omega_p, m^2 s/rad: S = scale s(u) */
} sy_sea_spectrum;

/* Validate spec and fill *out. For JONSWAP this integrates the shape's moments once
 * (5 adaptive integrals, about 0.07 ms; with gamma = 0 and Te or Tz given, the DNV rule
 * is solved by bisection, about 2 ms). No cache, so no shared state. The Te/Tp and Tz/Tp ratios are those of
 * the actual shape, not fixed constants. SY_EINPUT (bad value, message names it),
 * SY_EINVAL (NULL), SY_ENOMEM, SY_ENOCONV/SY_ELOSS (quadrature). */
SY_API int sy_sea_spectrum_init(sy_sea_spectrum *out, const sy_sea_spectrum_spec *spec,
                                sy_error *err);

/* S(omega) in m^2 s/rad; 0 for omega <= 0. Never allocates. */
SY_API double sy_sea_spectrum_eval(const sy_sea_spectrum *s, double omega);

/* S(f) = 2 pi S(2 pi f) in m^2/Hz; 0 for f <= 0. */
SY_API double sy_sea_spectrum_eval_hz(const sy_sea_spectrum *s, double f);

/* Fraction of m0 below omega: int_0^omega S / m0 (closed form for PM, quadrature for
 * JONSWAP). Used for cell energies and grid coverage. */
SY_API int sy_sea_spectrum_cdf(const sy_sea_spectrum *s, double omega, double *frac, sy_error *err);

/* DNV gamma rule (DNV-RP-C205, from memory, unverified; references.md 2.3), Tp in s,
 * Hs in m: 5 for Tp/sqrt(Hs) <= 3.6, exp(5.75 - 1.15 Tp/sqrt(Hs)) up to 5, 1 beyond. */
SY_API double sy_sea_gamma_dnv(double hs, double tp);

/* A short one-line description, e.g. "JONSWAP Hs 2 m Tp 10 s (Te 9.03 s) gamma 3.3
 * sigma 0.07/0.09 norm DNV A 0.657 Hm0 2.0024 m", for logs and file attributes.
 * Returns the length snprintf would have written. */
SY_API int sy_sea_spectrum_describe(const sy_sea_spectrum *s, char *buf, size_t size);

/* ---- Moments and periods ------------------------------------------------------------ */

typedef struct sy_sea_moments {
    double m[5]; /* angular-frequency moments m_n = int omega^n S(omega) domega,
                       n = -2..2 at m[n + 2], in m^2 (rad/s)^n */
    double mf[5]; /* frequency moments m_n = int f^n S(f) df = (2 pi)^-n m[n + 2], m^2 Hz^n */
    double hm0; /* 4 sqrt(m0), m */
    double te; /* energy period m_-1 / m_0 (frequency moments), s */
    double t1; /* mean period m_0 / m_1, s */
    double tz; /* zero-crossing period sqrt(m_0 / m_2), s */
    double eps0; /* spectral width sqrt(m_0 m_-2 / m_-1^2 - 1) (references.md 2.2) */
} sy_sea_moments;

/* Moments of a parametric spectrum (from its shape moments; no quadrature). */
SY_API void sy_sea_spectrum_moments(const sy_sea_spectrum *s, sy_sea_moments *out);

/* Moments of a sampled spectrum S[i] = S(omega[i]) (m^2 s/rad) on a strictly increasing
 * grid omega[0] > 0 (n >= 2), using the weights of sy_sea_omega_weights: energy outside
 * the grid cells is not counted. For a hindcast S(f) on f[i] pass omega = 2 pi f and
 * S = S(f) / (2 pi). SY_EINVAL for a bad grid, SY_EINPUT if m0 <= 0 or S has a negative
 * or non-finite value (index named). */
SY_API int sy_sea_moments_sampled(const double *omega, const double *S, size_t n,
                                  sy_sea_moments *out, sy_error *err);

/* ---- Frequency grid ----------------------------------------------------------------- */

/* Quadrature weights dOmega[i] (rad/s) for a strictly increasing grid omega[0] > 0,
 * n >= 2: each omega[i] owns the cell bounded by the mid-points to its neighbours; the
 * end cells extend half the neighbouring spacing outward (the lower one clipped at 0).
 * Interior weights equal the trapezoid weights; on a uniform grid every weight is the
 * spacing, so sum 2 S dOmega is the usual component amplitude^2. Optional lo, hi
 * (may be NULL) receive the outer cell bounds. SY_EINVAL for a bad grid. */
SY_API int sy_sea_omega_weights(const double *omega, size_t n, double *dOmega, double *lo,
                                double *hi, sy_error *err);

/* Exact energy of spectrum s in each cell of sy_sea_omega_weights: E[i] = int_cell S
 * (m^2), and the fraction of m0 outside all cells (*outside, may be NULL). E may be NULL
 * to get the fraction alone. */
SY_API int sy_sea_spectrum_cells(const sy_sea_spectrum *s, const double *omega, size_t n, double *E,
                                 double *outside, sy_error *err);

/* ---- Wave power per metre of crest -------------------------------------------------- */

/* Deep-water closed form J = rho g^2 Hm0^2 Te / (64 pi) (W/m), exact for any spectral
 * shape in deep water (references.md 4). */
SY_API double sy_sea_power_deep(double rho, double g, double hm0, double te);

/* Regular wave of amplitude a (m): J = rho g a^2 cg / 2 at depth h (INFINITY = deep). */
SY_API int sy_sea_power_regular(double rho, double g, double a, double omega, double h, double *J,
                                sy_error *err);

/* J = rho g int S(omega) cg(omega, h) domega (W/m) by adaptive quadrature, depth h
 * (INFINITY = deep water); relative accuracy ~1e-10. */
SY_API int sy_sea_spectrum_power(const sy_sea_spectrum *s, double rho, double g, double h,
                                 double *J, sy_error *err);

/* J = rho g sum S[i] cg(omega[i], h) dOmega[i] for a sampled spectrum (grid and units as
 * sy_sea_moments_sampled). */
SY_API int sy_sea_power_sampled(const double *omega, const double *S, size_t n, double rho,
                                double g, double h, double *J, sy_error *err);

/* Directionally resolved power J_theta = J sum_j D_j cos(theta - beta_j) [cos >= 0]
 * (IEC TS 62600-101 form, from memory, unverified; references.md 5.3) for a
 * frequency-independent spread discretised as D[j] at headings beta[j] (rad). */
SY_API double sy_sea_power_directional(double J, const double *beta, const double *D, size_t n,
                                       double theta);

/* ---- Directional spreading ---------------------------------------------------------- */

/* cos-2s spreading D(theta) = G(s) cos^(2s)((theta - theta0)/2), -pi < theta - theta0 <= pi,
 * G(s) = Gamma(s+1) / (2 sqrt(pi) Gamma(s+1/2)) (Longuet-Higgins et al. 1963; references.md
 * 3), per radian, integrating to 1 over the circle. s = 0 is a sentinel meaning
 * LONG-CRESTED (all energy at theta0), not the isotropic s -> 0 limit of the formula. */
typedef struct sy_sea_spreading {
    double s; /* spreading exponent, 0 = long-crested */
    double theta0; /* mean direction (toward), rad, as given */
    double norm; /* G(s), 1/rad (0 when long-crested) */
} sy_sea_spreading;

#define SY_SEA_SPREAD_S_MAX 1000.0 /* beyond this the spread is < 2.6 deg: use s = 0 */

/* Validate (0 <= s <= SY_SEA_SPREAD_S_MAX, theta0 finite) and fill. SY_EINPUT. */
SY_API int sy_sea_spreading_init(sy_sea_spreading *d, double s, double theta0, sy_error *err);

/* D(theta) per radian; 0 everywhere when long-crested (a Dirac: use the weights). */
SY_API double sy_sea_spreading_eval(const sy_sea_spreading *d, double theta);

/* Discretise onto a run's headings beta[0] < ... < beta[n-1] (rad, span < 2 pi, any
 * origin). Heading j receives the exact integral of D over its cell (closed form via the
 * regularised incomplete beta function), cells bounded by the mid-points between
 * neighbouring headings. The two end cells extend half their neighbouring spacing
 * outward; if they would then meet or overlap across the wrap-around (e.g. a uniform
 * list over the full circle), the list is circular and the wrap gap is split at its
 * mid-point, so nothing is outside. One heading takes the whole circle (weight 1).
 * Long-crested: weight 1 to the cell holding theta0. *outside (may be NULL) receives
 * the fraction of energy in no cell; sum D + outside = 1. SY_EINVAL for a bad list. */
SY_API int sy_sea_spreading_weights(const sy_sea_spreading *d, const double *beta, size_t n,
                                    double *D, double *outside, sy_error *err);

/* Directional spread sigma = sqrt(2 (1 - r1)) = sqrt(2 / (s + 1)) rad (circular-moment
 * spread; references.md 3), 0 when long-crested. */
SY_API double sy_sea_spreading_sigma(const sy_sea_spreading *d);

/* Directionality coefficient d = J_theta(theta0) / J = int_{-pi/2}^{pi/2} D(theta0 + u)
 * cos u du for a frequency-independent unimodal spread (references.md 3 and 5.3), by
 * adaptive quadrature; 1 when long-crested. */
SY_API int sy_sea_spreading_directionality(const sy_sea_spreading *d, double *coef, sy_error *err);

#ifdef __cplusplus
}
#endif
#endif
