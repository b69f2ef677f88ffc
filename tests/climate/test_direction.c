/* sy_climate_heading: metocean from-direction (nautical degrees) + x-axis bearing ->
 * hydrodynamic heading beta (rad, toward, counter-clockwise from +x). Every expected
 * value below is derived by hand from the geometry in the comment beside it (no outside
 * table exists). Tolerance: the conversion is one subtraction in degrees and one product
 * by pi/180, so a few ulps of pi: 8 DBL_EPSILON absolute. */
#include "check.h"
#include "swellyield/climate.h"

#include <float.h>
#include <math.h>

static const double PI = 3.14159265358979323846;
#define TOL (8 * DBL_EPSILON)

int main(void)
{
    sy_init();
    static const struct { double from, bearing, beta_deg; const char *why; } cases[] = {
        /* +x east (bearing 90), so +y is north (bearing 0). */
        {270.0, 90.0, 0.0, "x east: waves from west travel east, along +x"},
        {180.0, 90.0, 90.0, "x east: waves from south travel north, along +y"},
        {0.0, 90.0, -90.0, "x east: waves from north travel south, along -y"},
        {90.0, 90.0, 180.0, "x east: waves from east travel west, along -x: +pi, not -pi"},
        {225.0, 90.0, 45.0, "x east: from south-west travel north-east, between +x and +y"},
        /* +x north (bearing 0), so +y is west (bearing 270). */
        {180.0, 0.0, 0.0, "x north: waves from south travel north, along +x"},
        {90.0, 0.0, 90.0, "x north: waves from east travel west, along +y"},
        {270.0, 0.0, -90.0, "x north: waves from west travel east, along -y"},
        /* Oblique axes. */
        {255.0, 75.0, 0.0, "x at 75: waves from 255 travel toward 75, along +x"},
        {345.0, 120.0, -45.0, "x at 120: toward 165 is 45 deg clockwise of +x"},
        {15.0, 300.0, 105.0, "x at 300: toward 195; 300 - 195 = 105 deg counter-clockwise"},
        /* Inputs outside [0, 360) wrap the same way. */
        {-90.0, 90.0, 0.0, "from -90 is from 270"},
        {630.0, 450.0, 0.0, "from 630 = 270 with bearing 450 = 90"},
    };
    for (size_t i = 0; i < sizeof cases / sizeof cases[0]; i++) {
        double beta = NAN;
        sy_error err = SY_ERROR_INIT;
        sy_check_ok(sy_climate_heading(cases[i].from, cases[i].bearing, &beta, &err), &err,
                    "heading call %zu", i);
        sy_check_close(beta, cases[i].beta_deg * PI / 180.0, 0.0, TOL, "%s", cases[i].why);
        sy_check_true(beta > -PI && beta <= PI, "beta %g in (-pi, pi]", beta);
    }
    /* Round trip through the inverse over a grid of directions and bearings. */
    double worst = 0.0;
    for (int b = 0; b < 24; b++)
        for (int f = 0; f < 72; f++) {
            double from = 5.0 * f + 0.37, bearing = 15.0 * b + 0.11, beta, back;
            sy_climate_heading(from, bearing, &beta, NULL);
            sy_climate_from_direction(beta, bearing, &back, NULL);
            double d = fabs(remainder(back - from, 360.0));
            worst = d > worst ? d : worst;
        }
    /* 360 degrees of range in double: a few ulps of 360 is ~1e-13 deg. */
    sy_check_close(worst, 0.0, 0.0, 1e-12, "from -> beta -> from round trip (degrees)");
    sy_error err = SY_ERROR_INIT;
    double beta;
    sy_check_fails(sy_climate_heading(NAN, 90.0, &beta, &err), SY_EINVAL, &err,
                   "expected finite", "NaN direction rejected");
    sy_check_fails(sy_climate_heading(10.0, INFINITY, &beta, &err), SY_EINVAL, &err,
                   "expected finite", "infinite bearing rejected");
    return sy_check_summary();
}
