/* Progress bar on stderr for loops that can take more than a second: shown only when
 * stderr is a terminal and --quiet was not given; elapsed and remaining time. */
#include "cli.h"

#include <stdio.h>
#include <stdlib.h>
#include <time.h>
#include <unistd.h>

static int quiet;

void sy_cli_set_quiet(int q) { quiet = q; }
int sy_cli_quiet(void) { return quiet; }

static double now(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

void sy_progress_start(sy_progress *p, const char *label, size_t total)
{
    p->label = label;
    p->total = total;
    p->done = 0;
    p->t0 = now();
    p->last = 0;
    p->active = !quiet && isatty(STDERR_FILENO) && total > 0;
}

void sy_progress_step(sy_progress *p, size_t done)
{
    if (!p->active)
        return;
    p->done = done;
    double t = now();
    if (t - p->last < 0.1 && done < p->total)
        return; /* redraw at most ten times a second */
    p->last = t;
    double el = t - p->t0, frac = (double)done / (double)p->total;
    double rem = frac > 0 ? el * (1 - frac) / frac : 0;
    int width = 30, fill = (int)(frac * width + 0.5);
    fprintf(stderr, "\r%-12s [", p->label);
    for (int i = 0; i < width; i++)
        fputc(i < fill ? '#' : '.', stderr);
    fprintf(stderr, "] %3.0f%%  %zu/%zu  %.1fs elapsed, %.1fs left ", 100 * frac, done, p->total, el, rem);
    fflush(stderr);
}

void sy_progress_end(sy_progress *p)
{
    if (!p->active)
        return;
    p->last = -1.0; /* redraw now, at what was done: all of it, or where a failure stopped */
    sy_progress_step(p, p->done);
    fputc('\n', stderr);
    p->active = 0;
}

/* The library's progress callbacks: ctx is a zeroed sy_progress, started on first call. */
static void callback(sy_progress *p, const char *label, size_t done, size_t total)
{
    if (p->total == 0)
        sy_progress_start(p, label, total);
    sy_progress_step(p, done);
}

void sy_cli_hydro_progress(void *ctx, size_t done, size_t total) { callback(ctx, "hydro", done, total); }
void sy_cli_yield_progress(void *ctx, size_t done, size_t total) { callback(ctx, "sea states", done, total); }

/* The pole search reports each contour's points; where it splits the region it starts
 * again on a smaller contour, which gets a bar of its own. */
void sy_cli_poles_progress(void *ctx, size_t done, size_t total)
{
    sy_progress *p = ctx;
    if (p->active && done < p->done) {
        sy_progress_end(p);
        p->total = 0;
    }
    callback(p, "poles", done, total);
}

int sy_cli_parse_jobs(const char *text)
{
    char *end;
    long v = strtol(text, &end, 10);
    return *end == '\0' && v >= 1 && v <= 1024 ? (int)v : 0;
}
