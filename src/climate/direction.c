/* The one conversion between metocean directions (where waves come FROM, nautical degrees
 * clockwise from true north) and the hydrodynamic heading beta (where waves travel TOWARD,
 * radians counter-clockwise from the array's +x axis), given the bearing B of +x
 * (conventions.md, "Frames and directions"). toward = from + 180; a bearing b lies at
 * angle B - b counter-clockwise from +x (+y, 90 degrees counter-clockwise of +x, has
 * bearing B - 90), so beta = B - from - 180 degrees, wrapped to (-pi, pi]. */
#include "climate_impl.h"

#include <math.h>

static const double PI = 3.14159265358979323846;

/* Wrap degrees to (-180, 180]. */
static double wrap180(double a)
{
    a = fmod(a, 360.0);            /* (-360, 360) */
    if (a > 180.0)
        a -= 360.0;
    else if (a <= -180.0)
        a += 360.0;
    return a;
}

int sy_climate_heading(double from_deg, double x_axis_bearing_deg, double *beta, sy_error *err)
{
    if (!isfinite(from_deg) || !isfinite(x_axis_bearing_deg))
        return sy_error_set(err, SY_EINVAL,
                            "wave direction %g degrees from, x-axis bearing %g degrees: "
                            "expected finite values",
                            from_deg, x_axis_bearing_deg);
    double deg = wrap180(x_axis_bearing_deg - (from_deg + 180.0));
    *beta = deg * (PI / 180.0);
    return SY_OK;
}

int sy_climate_from_direction(double beta, double x_axis_bearing_deg, double *from_deg,
                              sy_error *err)
{
    if (!isfinite(beta) || !isfinite(x_axis_bearing_deg))
        return sy_error_set(err, SY_EINVAL,
                            "wave heading %g rad, x-axis bearing %g degrees: expected finite "
                            "values",
                            beta, x_axis_bearing_deg);
    double from = fmod(x_axis_bearing_deg - beta * (180.0 / PI) - 180.0, 360.0);
    if (from < 0.0)
        from += 360.0;
    if (from >= 360.0)   /* -tiny + 360 rounds to 360 */
        from -= 360.0;
    *from_deg = from;
    return SY_OK;
}
