/* CF time decoding. Check values from references.md 6.2 (computed there by
 * calc_11_cf_time.py and quoted from the CF 1.12 text); unix seconds of those dates from
 * Python 3.11.2 datetime(…, tzinfo=timezone.utc).timestamp(). Other cases are hand
 * derived from the Gregorian leap-year rule. Decoding is exact in double for these inputs
 * (integers and halves well below 2^53), so tolerances are 0 or stated. */
#include "check.h"
#include "swellyield/climate.h"

#include <math.h>
#include <string.h>

static double decode1(const char *units, const char *cal, double v, sy_error *err)
{
    double out = NAN;
    if (sy_climate_cf_time_decode(units, cal, &v, 1, &out, err) != SY_OK)
        return NAN;
    return out;
}

static void check_date(const char *units, const char *cal, double v, const char *want,
                       const char *src)
{
    sy_error err = SY_ERROR_INIT;
    double t = decode1(units, cal, v, &err);
    char buf[40];
    sy_climate_time_format(t, buf, sizeof buf);
    sy_check_true(strcmp(buf, want) == 0, "'%s' (%s) %g -> %s, want %s [%s] %s", units,
                  cal ? cal : "no calendar", v, buf, want, src, err.msg);
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    /* references.md 6.2: 1990 has 365 days, so 8766 h reach 1991-01-01T06:00. */
    check_date("hours since 1990-01-01", "standard", 8766.0, "1991-01-01T06:00:00Z",
               "references.md 6.2");
    sy_check_close(decode1("hours since 1990-01-01", "standard", 8766.0, &err), 662709600.0,
                   0.0, 0.0, "same as unix seconds (Python datetime)");
    /* references.md 6.2 / CF text: both spellings mean the same. */
    double a = decode1("days since 1990-1-1 0:0:0", NULL, 123.25, &err);
    double b = decode1("days since 1990-01-01", NULL, 123.25, &err);
    sy_check_true(a == b && !isnan(a), "'days since 1990-1-1 0:0:0' == 'days since 1990-01-01'");
    /* references.md 6.2: time-zone offset -6:00 means UTC = local + 6 h. */
    check_date("seconds since 1992-10-8 15:15:42.5 -6:00", NULL, 0.0,
               "1992-10-08T21:15:42.500Z", "references.md 6.2");
    sy_check_close(decode1("seconds since 1992-10-8 15:15:42.5 -6:00", NULL, 0.0, &err),
                   718578942.5, 0.0, 0.0, "same as unix seconds (Python datetime)");
    /* references.md 6.2: the 4-year cycle 2001-2004 averages 8766 h per year. */
    double t0 = decode1("hours since 2001-01-01", "gregorian", 0.0, &err);
    double t4 = decode1("hours since 2001-01-01", "gregorian", 4 * SY_CLIMATE_HOURS_PER_YEAR, &err);
    sy_check_close(t0, 978307200.0, 0.0, 0.0, "2001-01-01 (Python datetime)");
    sy_check_close(t4, 1104537600.0, 0.0, 0.0, "4 x 8766 h after 2001-01-01 is 2005-01-01");
    /* Hand derived: 2000 is a leap year (divisible by 400), 1900 is not (by 100 only). */
    check_date("minutes since 2000-02-28 23:00", "proleptic_gregorian", 120.0,
               "2000-02-29T01:00:00Z", "2000 leap");
    check_date("days since 1900-02-28", "standard", 1.0, "1900-03-01T00:00:00Z", "1900 common");
    check_date("seconds since 1970-01-01T00:00:00Z", NULL, 86400.0, "1970-01-02T00:00:00Z",
               "ISO 'T' and 'Z'");
    check_date("hours since 2010-06-30 12:00:00 +0130", NULL, 0.0, "2010-06-30T10:30:00Z",
               "offset +hhmm");
    check_date("d since 2020-12-31", NULL, -366.0, "2019-12-31T00:00:00Z", "2020 leap, backwards");
    /* A Gregorian 400-year cycle has 146097 days, i.e. 8765.82 h per year on average
     * (references.md 6.2). */
    check_date("days since 2000-01-01", "standard", 146097.0, "2400-01-01T00:00:00Z",
               "400-year cycle");
    /* Proleptic Gregorian before 1582: Python datetime is proleptic Gregorian too. */
    sy_check_close(decode1("days since 1500-01-01", "proleptic_gregorian", 0.0, &err),
                   -14831769600.0, 0.0, 0.0, "1500-01-01 proleptic (Python datetime)");

    /* Rejected: calendars and units that are not real calendar time. */
    static const struct { const char *units, *cal, *expect; } bad[] = {
        {"days since 2000-01-01", "360_day", "calendar '360_day' not supported for annual statistics"},
        {"days since 2000-01-01", "noleap", "calendar 'noleap' not supported"},
        {"days since 2000-01-01", "365_day", "calendar '365_day' not supported"},
        {"days since 2000-01-01", "all_leap", "calendar 'all_leap' not supported"},
        {"days since 2000-01-01", "julian", "calendar 'julian' not supported"},
        {"years since 2000-01-01", NULL, "'years' is not a calendar unit"},
        {"months since 2000-01-01", NULL, "'months' is not a calendar unit"},
        {"fortnights since 2000-01-01", NULL, "unknown unit 'fortnights'"},
        {"hours after 2000-01-01", NULL, "expected '<unit> since <reference date>'"},
        {"hours since 2000-13-01", NULL, "is not a valid date"},
        {"hours since 2001-02-29", NULL, "is not a valid date"},
        {"hours since 2000/01/01", NULL, "reference date not y-m-d"},
        {"hours since 2000-01-01 12:00:00 local", NULL, "unexpected text 'local'"},
        {"days since 1500-01-01", "standard", "reference before 1582-10-15"},
        {NULL, NULL, "no units attribute"},
    };
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        double v = 1.0, out;
        sy_error_clear(&err);
        int rc = sy_climate_cf_time_decode(bad[i].units, bad[i].cal, &v, 1, &out, &err);
        sy_check_fails(rc, SY_EINPUT, &err, bad[i].expect, "bad time %zu: %s", i, err.msg);
    }
    double v = -200000.0, out;
    sy_check_fails(sy_climate_cf_time_decode("days since 1600-01-01", NULL, &v, 1, &out, &err),
                   SY_EINPUT, &err, "falls before 1582-10-15", "value before the Gregorian start");
    return sy_check_summary();
}
