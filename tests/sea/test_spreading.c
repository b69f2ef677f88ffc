/* cos-2s directional spreading: normalisation, spread, directionality coefficient and
 * the energy-conserving discretisation onto heading lists. Sources: references.md
 * section 3 (values computed there, each D integrating to 1 within 1e-12) and 5.3; the
 * test's own composite Simpson rule as an independent integrator. */
#include "check.h"
#include "swellyield/sea.h"

#include <float.h>
#include <math.h>

#define PI 3.14159265358979323846
#define DEG (PI / 180)

static sy_sea_spreading make(double s, double theta0)
{
    sy_sea_spreading d = {0};
    sy_error err = SY_ERROR_INIT;
    sy_check_ok(sy_sea_spreading_init(&d, s, theta0, &err), &err, "spreading s = %g", s);
    return d;
}

/* int_a^b D(theta) cos^p(theta - theta0) dtheta by composite Simpson, n even intervals
 * (error ~ (b-a) h^4 D''''/180: below 1e-13 for the widths and s used here). */
static double simpson(const sy_sea_spreading *d, double a, double b, int p, int n)
{
    double h = (b - a) / n, sum = 0;
    for (int i = 0; i <= n; i++) {
        double t = a + i * h, w = (i == 0 || i == n) ? 1 : (i % 2 ? 4 : 2);
        sum += w * sy_sea_spreading_eval(d, t) * (p ? cos(t - d->theta0) : 1.0);
    }
    return sum * h / 3;
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* references.md 3 table [computed: calc_03_spreading.py]: G(s) 10 decimals, sigma
     * 4 decimals in degrees, d 6 decimals. */
    static const struct {
        double s, G, sigma_deg, d;
    } row[] = {
        {1, 0.3183098862, 57.2958, 0.568310},  {2, 0.4244131816, 46.7818, 0.687011},
        {5, 0.6467248481, 33.0797, 0.834343},  {10, 0.9032781269, 24.4310, 0.909105},
        {15, 1.1016893443, 20.2571, 0.937500}, {20, 1.2694749157, 17.6819, 0.952381},
    };
    for (size_t i = 0; i < sizeof row / sizeof row[0]; i++) {
        double s = row[i].s;
        sy_sea_spreading d = make(s, 0.7);
        sy_check_close(d.norm, row[i].G, 0, 5e-11, "G(%g) (references.md 3)", s);
        /* Second closed form G = 2^(2s-1) Gamma(s+1)^2 / (pi Gamma(2s+1)) (references.md 3). */
        sy_check_close(d.norm, pow(2, 2 * s - 1) * pow(tgamma(s + 1), 2) / (PI * tgamma(2 * s + 1)),
                       1e-13, 0, "G(%g) = duplication-formula form", s);
        sy_check_close(sy_sea_spreading_sigma(&d) / DEG, row[i].sigma_deg, 0, 5e-5,
                       "sigma(s = %g) deg (references.md 3)", s);
        double dc;
        sy_check_ok(sy_sea_spreading_directionality(&d, &dc, &err), &err, "directionality");
        sy_check_close(dc, row[i].d, 0, 5e-7,
                       "directionality coefficient s = %g (references.md 3, 5.3)", s);
    }
    /* Spot value (references.md 3): s = 10, 30 deg off the mean: D = 0.4515408601 /rad. */
    sy_sea_spreading d10 = make(10, -2.0);
    sy_check_close(sy_sea_spreading_eval(&d10, -2.0 + 30 * DEG), 0.4515408601, 0, 5e-11,
                   "D(30 deg), s = 10 (references.md 3)");
    sy_check_close(sy_sea_spreading_eval(&d10, -2.0 - 30 * DEG + 4 * PI), 0.4515408601, 0, 5e-11,
                   "D is 2 pi periodic and symmetric");
    /* Integrates to 1 (closed-form normalisation) and r1 = s/(s+1) (references.md 3), by
     * independent Simpson over the period [theta0 - pi, theta0 + pi], which keeps the
     * kink of |cos|^(2s) (non-integer s) at the ends. */
    const double ss[] = {0.5, 1, 2.5, 10, 75, 600};
    for (size_t i = 0; i < sizeof ss / sizeof ss[0]; i++) {
        sy_sea_spreading d = make(ss[i], 1.1);
        sy_check_close(simpson(&d, 1.1 - PI, 1.1 + PI, 0, 40000), 1.0, 1e-12, 0,
                       "int D = 1, s = %g", ss[i]);
        sy_check_close(simpson(&d, 1.1 - PI, 1.1 + PI, 1, 40000), ss[i] / (ss[i] + 1), 1e-12, 0,
                       "r1 = int D cos = s/(s+1), s = %g (references.md 3)", ss[i]);
    }

    /* Discretisation. Uniform full circle, 24 headings, origin at -pi: weights sum to 1,
     * nothing outside, each weight equals the Simpson integral over its cell. */
    double beta[720], D[720], out = -1;
    sy_sea_spreading d = make(7.3, 100 * DEG);
    for (int j = 0; j < 24; j++)
        beta[j] = -PI + j * 15 * DEG;
    sy_check_ok(sy_sea_spreading_weights(&d, beta, 24, D, &out, &err), &err, "weights 24");
    double sum = 0, worst = 0;
    for (int j = 0; j < 24; j++) {
        sum += D[j];
        worst = fmax(worst,
                     fabs(D[j] - simpson(&d, beta[j] - 7.5 * DEG, beta[j] + 7.5 * DEG, 0, 2000)));
    }
    sy_check_close(sum, 1, 8 * DBL_EPSILON, 0, "24 uniform headings: weights sum to 1");
    sy_check_close(out, 0, 0, 8 * DBL_EPSILON, "24 uniform headings: nothing outside");
    sy_check_close(worst, 0, 0, 1e-13, "each weight = Simpson integral of D over its cell");
    /* Non-uniform full circle (end cells reach across the wrap gap: circular). */
    const double nu[] = {0, 10, 30, 60, 100, 150, 200, 250, 300, 330, 350};
    for (int j = 0; j < 11; j++)
        beta[j] = nu[j] * DEG;
    sy_check_ok(sy_sea_spreading_weights(&d, beta, 11, D, &out, &err), &err, "weights non-uniform");
    sum = 0;
    for (int j = 0; j < 11; j++)
        sum += D[j];
    sy_check_close(sum, 1, 8 * DBL_EPSILON, 0, "non-uniform circular list: weights sum to 1");
    sy_check_close(D[0], simpson(&d, -5 * DEG, 5 * DEG, 0, 2000), 1e-12, 0,
                   "wrap cell split at the gap mid-point");
    /* Partial list 0..90 deg every 15 deg, mean 45 deg: cells [-7.5, 97.5] deg, the rest
     * outside; symmetric weights. */
    sy_sea_spreading d45 = make(4.2, 45 * DEG);
    for (int j = 0; j < 7; j++)
        beta[j] = j * 15 * DEG;
    sy_check_ok(sy_sea_spreading_weights(&d45, beta, 7, D, &out, &err), &err, "weights partial");
    sum = 0;
    for (int j = 0; j < 7; j++)
        sum += D[j];
    double inside = simpson(&d45, -7.5 * DEG, 97.5 * DEG, 0, 20000);
    sy_check_close(sum, inside, 1e-12, 0,
                   "partial list: sum = Simpson integral over the covered arc");
    sy_check_close(out, 1 - inside, 1e-11, 0, "partial list: outside fraction (%.6f)", out);
    sy_check_close(D[1], D[5], 1e-13, 0, "partial list symmetric about the mean (15 vs 75 deg)");
    /* One heading: the whole circle. Long-crested: all energy in the cell of theta0. */
    sy_check_ok(sy_sea_spreading_weights(&d45, beta, 1, D, &out, &err), &err, "one heading");
    sy_check_close(D[0], 1, 8 * DBL_EPSILON, 0, "one heading takes weight 1");
    sy_sea_spreading lc = make(0, 50 * DEG);
    sy_check_ok(sy_sea_spreading_weights(&lc, beta, 7, D, &out, &err), &err, "long-crested");
    sy_check_true(D[3] == 1 && D[2] == 0 && D[4] == 0 && out == 0,
                  "long-crested: weight 1 at 45 deg (cell 37.5..52.5)");
    sy_sea_spreading lc2 = make(0, 200 * DEG);
    sy_check_ok(sy_sea_spreading_weights(&lc2, beta, 7, D, &out, &err), &err,
                "long-crested outside");
    sy_check_true(out == 1, "long-crested mean outside the headings: outside = 1");
    double dc;
    sy_check_ok(sy_sea_spreading_directionality(&lc, &dc, &err), &err, "lc d");
    sy_check_true(dc == 1 && sy_sea_spreading_sigma(&lc) == 0, "long-crested: d = 1, sigma = 0");
    /* Large s: no overflow, weights still sum to 1. */
    sy_sea_spreading big = make(900, 0.3);
    for (int j = 0; j < 360; j++)
        beta[j] = j * DEG;
    sy_check_ok(sy_sea_spreading_weights(&big, beta, 360, D, &out, &err), &err, "s = 900");
    sum = 0;
    for (int j = 0; j < 360; j++)
        sum += D[j];
    sy_check_close(sum, 1, 1e-13, 0, "s = 900: weights sum to 1");

    /* J_theta (references.md 5.3) with the discrete weights of 720 headings: J_theta(theta0)
     * / J approaches d(s = 10) = 0.909105 (references.md 3); the cut at cos = 0 falls
     * inside a 0.5 deg cell, D there ~ 0.05/rad, so the discretisation error is < 1e-4. */
    for (int j = 0; j < 720; j++)
        beta[j] = -PI + j * 0.5 * DEG;
    sy_sea_spreading d10b = make(10, 0.25 * DEG);
    sy_check_ok(sy_sea_spreading_weights(&d10b, beta, 720, D, &out, &err), &err, "720 headings");
    sy_check_close(sy_sea_power_directional(2.0, beta, D, 720, 0.25 * DEG) / 2.0, 0.909105, 1e-4, 0,
                   "J_theta(theta0)/J -> d(s = 10) (references.md 3, 5.3)");
    double one = 1;
    sy_check_close(sy_sea_power_directional(3.0, &beta[300], &one, 1, beta[300]), 3.0, 0, 0,
                   "long-crested: J_theta = J at the heading");
    sy_check_close(sy_sea_power_directional(3.0, &beta[300], &one, 1, beta[300] + 100 * DEG), 0.0,
                   0, 0, "J_theta = 0 beyond 90 deg (delta_j)");

    /* Bad input. */
    sy_sea_spreading bad;
    sy_check_fails(sy_sea_spreading_init(&bad, -1, 0, &err), SY_EINPUT, &err,
                   "s must be in [0, 1000]", "s < 0");
    sy_check_fails(sy_sea_spreading_init(&bad, 2000, 0, &err), SY_EINPUT, &err, "got 2000",
                   "s too large");
    sy_check_fails(sy_sea_spreading_init(&bad, 2, NAN, &err), SY_EINPUT, &err,
                   "direction must be finite", "NaN theta0");
    const double unsorted[3] = {0, 1, 0.5}, wide[2] = {0, 7};
    sy_check_fails(sy_sea_spreading_weights(&d, unsorted, 3, D, &out, &err), SY_EINVAL, &err,
                   "strictly increasing, got beta[2] = 0.5", "unsorted headings");
    sy_check_fails(sy_sea_spreading_weights(&d, wide, 2, D, &out, &err), SY_EINVAL, &err,
                   "span less than 2 pi", "span >= 2 pi");
    return sy_check_summary();
}
