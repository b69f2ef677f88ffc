/* CF time coordinates (CF Conventions 1.12 section 4.4, references.md 6.2): units
 * "<unit> since <reference datetime>", decoded to seconds since 1970-01-01T00:00:00Z on
 * the proleptic Gregorian calendar. Accepted calendars: standard (default), gregorian
 * (deprecated synonym), proleptic_gregorian; the standard calendar only from 1582-10-15
 * on, where it equals proleptic Gregorian. Other calendars are rejected: their "years"
 * are not the years the annual statistics count. Day arithmetic: the days-from-civil
 * algorithm for the proleptic Gregorian calendar (400-year cycle of 146097 days). */
#include "climate_impl.h"

#include <ctype.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#define SECONDS_PER_DAY 86400.0
/* 1582-10-15, the first Gregorian day, in days since 1970-01-01. */
#define GREGORIAN_START_DAY (-141427L)

/* Days since 1970-01-01 of y-m-d, proleptic Gregorian (exact for any int year). */
static long days_from_civil(long y, int m, int d)
{
    y -= m <= 2;
    long era = (y >= 0 ? y : y - 399) / 400;
    long yoe = y - era * 400;                                        /* [0, 399] */
    long doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;       /* [0, 365] */
    long doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;                /* [0, 146096] */
    return era * 146097 + doe - 719468;
}

static void civil_from_days(long z, long *y, int *m, int *d)
{
    z += 719468;
    long era = (z >= 0 ? z : z - 146096) / 146097;
    long doe = z - era * 146097;
    long yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
    long doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    long mp = (5 * doy + 2) / 153;
    *d = (int)(doy - (153 * mp + 2) / 5 + 1);
    *m = (int)(mp < 10 ? mp + 3 : mp - 9);
    *y = yoe + era * 400 + (*m <= 2);
}

static int days_in_month(long y, int m)
{
    static const int n[12] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    int leap = (y % 4 == 0 && y % 100 != 0) || y % 400 == 0;
    return m == 2 && leap ? 29 : n[m - 1];
}

static const char *skip_space(const char *s)
{
    while (isspace((unsigned char)*s))
        s++;
    return s;
}

/* Reads an unsigned integer; returns the end pointer or NULL if no digit. */
static const char *read_uint(const char *s, long *v)
{
    if (!isdigit((unsigned char)*s))
        return NULL;
    long x = 0;
    while (isdigit((unsigned char)*s) && x < 100000000L)
        x = 10 * x + (*s++ - '0');
    *v = x;
    return s;
}

static int unit_seconds(const char *word, double *sec)
{
    static const struct { const char *name; double sec; } u[] = {
        {"days", 86400.0}, {"day", 86400.0}, {"d", 86400.0},
        {"hours", 3600.0}, {"hour", 3600.0}, {"hrs", 3600.0}, {"hr", 3600.0}, {"h", 3600.0},
        {"minutes", 60.0}, {"minute", 60.0}, {"mins", 60.0}, {"min", 60.0},
        {"seconds", 1.0}, {"second", 1.0}, {"secs", 1.0}, {"sec", 1.0}, {"s", 1.0},
    };
    for (size_t i = 0; i < sizeof u / sizeof u[0]; i++)
        if (strcmp(word, u[i].name) == 0) {
            *sec = u[i].sec;
            return 1;
        }
    return 0;
}

/* Parse "<unit> since <datetime>" into seconds per unit and the reference in unix s. */
static int parse_units(const char *units, double *unit_sec, double *ref, long *ref_day,
                       sy_error *err)
{
    const char *s = skip_space(units);
    char word[32];
    size_t n = 0;
    while (isalpha((unsigned char)*s) && n + 1 < sizeof word)
        word[n++] = (char)tolower((unsigned char)*s++);
    word[n] = '\0';
    if (!unit_seconds(word, unit_sec)) {
        if (strncmp(word, "year", 4) == 0 || strncmp(word, "month", 5) == 0 ||
            strcmp(word, "yr") == 0 || strcmp(word, "a") == 0)
            return sy_error_set(err, SY_EINPUT,
                                "time units '%s': '%s' is not a calendar unit (UDUNITS year = "
                                "365.242198781 days, CF 4.4), expected days, hours, minutes "
                                "or seconds",
                                units, word);
        return sy_error_set(err, SY_EINPUT,
                            "time units '%s': unknown unit '%s', expected days, hours, minutes "
                            "or seconds",
                            units, word);
    }
    s = skip_space(s);
    if (strncmp(s, "since", 5) != 0 || !isspace((unsigned char)s[5]))
        return sy_error_set(err, SY_EINPUT,
                            "time units '%s': expected '<unit> since <reference date>'", units);
    s = skip_space(s + 5);
    long y, mo, d, hh = 0, mm = 0, ss = 0;
    double frac = 0.0;
    int neg = 0;
    if (*s == '-' || *s == '+')
        neg = *s++ == '-';
    const char *p = read_uint(s, &y);
    if (p != NULL && *p == '-')
        p = read_uint(p + 1, &mo);
    else
        p = NULL;
    if (p != NULL && *p == '-')
        p = read_uint(p + 1, &d);
    else
        p = NULL;
    if (p == NULL)
        return sy_error_set(err, SY_EINPUT,
                            "time units '%s': reference date not y-m-d", units);
    if (neg)
        y = -y;
    const char *q = (*p == 'T') ? p + 1 : skip_space(p);
    if (isdigit((unsigned char)*q)) {
        /* H:M[:S[.f]] */
        const char *r = read_uint(q, &hh);
        if (r != NULL && *r == ':')
            r = read_uint(r + 1, &mm);
        else
            r = NULL;
        if (r != NULL && *r == ':') {
            r = read_uint(r + 1, &ss);
            if (r != NULL && *r == '.') {
                char *e;
                frac = strtod(r, &e);   /* ".5" */
                r = e;
            }
        }
        if (r == NULL)
            return sy_error_set(err, SY_EINPUT,
                                "time units '%s': reference time not H:M:S", units);
        p = r;
    }
    /* Time-zone offset: Z, UTC, or +-h[:mm] / +-hhmm. */
    double tz = 0.0;
    q = skip_space(p);
    if (*q == 'Z') {
        q++;
    } else if (strncmp(q, "UTC", 3) == 0) {
        q += 3;
    } else if (*q == '+' || *q == '-') {
        int sign = *q == '-' ? -1 : 1;
        long a, b = 0;
        const char *r = read_uint(q + 1, &a);
        if (r != NULL && *r == ':') {
            r = read_uint(r + 1, &b);
        } else if (r != NULL && r - (q + 1) == 4) {   /* hhmm */
            b = a % 100;
            a /= 100;
        }
        if (r == NULL || a > 14 || b > 59)
            return sy_error_set(err, SY_EINPUT,
                                "time units '%s': time-zone offset not +-h:mm", units);
        tz = sign * (a * 3600.0 + b * 60.0);
        q = r;
    }
    q = skip_space(q);
    if (*q != '\0')
        return sy_error_set(err, SY_EINPUT, "time units '%s': unexpected text '%s' after the "
                            "reference date", units, q);
    if (mo < 1 || mo > 12 || d < 1 || d > days_in_month(y, (int)mo) || hh > 23 || mm > 59 ||
        ss > 60)
        return sy_error_set(err, SY_EINPUT,
                            "time units '%s': reference %ld-%ld-%ld %ld:%ld:%ld is not a valid "
                            "date and time",
                            units, y, mo, d, hh, mm, ss);
    *ref_day = days_from_civil(y, (int)mo, (int)d);
    /* Local time = UTC + offset, so UTC = local - offset. */
    *ref = (double)*ref_day * SECONDS_PER_DAY + hh * 3600.0 + mm * 60.0 + ss + frac - tz;
    return SY_OK;
}

int sy_climate_cf_time_decode(const char *units, const char *calendar, const double *values,
                              size_t n, double *out, sy_error *err)
{
    if (units == NULL)
        return sy_error_set(err, SY_EINPUT, "time: no units attribute, expected "
                            "'<unit> since <date>' (CF 4.4 has no default)");
    if (n > 0 && (values == NULL || out == NULL))
        return sy_error_set(err, SY_EINVAL, "time decode: NULL values");
    int standard = 1;
    if (calendar != NULL && calendar[0] != '\0') {
        char cal[40];
        size_t k = 0;
        for (; calendar[k] != '\0' && k + 1 < sizeof cal; k++)
            cal[k] = (char)tolower((unsigned char)calendar[k]);
        cal[k] = '\0';
        if (strcmp(cal, "proleptic_gregorian") == 0)
            standard = 0;
        else if (strcmp(cal, "standard") != 0 && strcmp(cal, "gregorian") != 0)
            return sy_error_set(err, SY_EINPUT,
                                "time: calendar '%s' not supported for annual statistics, "
                                "expected standard, gregorian or proleptic_gregorian (convert "
                                "the data to real calendar time first)",
                                calendar);
    }
    double unit_sec = 0.0, ref = 0.0;
    long ref_day = 0;
    int rc = parse_units(units, &unit_sec, &ref, &ref_day, err);
    if (rc != SY_OK)
        return rc;
    if (standard && ref_day < GREGORIAN_START_DAY)
        return sy_error_set(err, SY_EINPUT,
                            "time units '%s': reference before 1582-10-15 in the standard "
                            "(mixed Julian/Gregorian) calendar is not supported, expected a "
                            "later reference or calendar proleptic_gregorian",
                            units);
    for (size_t i = 0; i < n; i++) {
        if (!isfinite(values[i]))
            return sy_error_set(err, SY_EINPUT, "time[%zu] = %g, expected a finite value", i,
                                values[i]);
        out[i] = ref + values[i] * unit_sec;
        if (standard && out[i] < GREGORIAN_START_DAY * SECONDS_PER_DAY)
            return sy_error_set(err, SY_EINPUT,
                                "time[%zu] = %g %s falls before 1582-10-15 (Julian part of "
                                "the standard calendar), not supported",
                                i, values[i], units);
    }
    return SY_OK;
}

void sy_climate_time_format(double t, char *buf, size_t size)
{
    if (buf == NULL || size == 0)
        return;
    if (!isfinite(t)) {
        snprintf(buf, size, "invalid time");
        return;
    }
    /* Round to the millisecond first so 59.9996 s does not print as 60. */
    double ms_total = floor(t * 1000.0 + 0.5);
    double day = floor(ms_total / (SECONDS_PER_DAY * 1000.0));
    long ms_of_day = (long)(ms_total - day * SECONDS_PER_DAY * 1000.0);
    long y;
    int m, d;
    civil_from_days((long)day, &y, &m, &d);
    long s = ms_of_day / 1000, ms = ms_of_day % 1000;
    if (ms != 0)
        snprintf(buf, size, "%04ld-%02d-%02dT%02ld:%02ld:%02ld.%03ldZ", y, m, d, s / 3600,
                 s / 60 % 60, s % 60, ms);
    else
        snprintf(buf, size, "%04ld-%02d-%02dT%02ld:%02ld:%02ldZ", y, m, d, s / 3600,
                 s / 60 % 60, s % 60);
}
