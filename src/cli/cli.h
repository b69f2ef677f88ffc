/* Shared by the program's verb files. The program uses the public API only. */
#ifndef SY_CLI_H
#define SY_CLI_H

#include <stddef.h>
#include "swellyield/swellyield.h"

enum { SY_EXIT_OK = 0, SY_EXIT_FAIL = 1, SY_EXIT_USAGE = 2 };

typedef struct sy_cli_verb {
    const char *name;
    const char *summary;
    int (*run)(int argc, char **argv); /* argv[0] is the verb */
} sy_cli_verb;

/* One line "swellyield: VERB: MESSAGE" on stderr; returns the exit code for status rc
 * (2 for bad input or usage, 1 for a failed computation). */
int sy_cli_fail(const char *verb, int rc, const sy_error *err);
int sy_cli_usage_error(const char *verb, const char *fmt, ...) SY_PRINTF(2, 3);

/* Progress bar (progress.c). */
typedef struct sy_progress {
    const char *label;
    size_t total, done;
    double t0, last;
    int active;
} sy_progress;
void sy_cli_set_quiet(int quiet);
int sy_cli_quiet(void);
void sy_progress_start(sy_progress *p, const char *label, size_t total);
void sy_progress_step(sy_progress *p, size_t done);
void sy_progress_end(sy_progress *p);
/* sy_hydro_build progress callback: ctx is a zeroed sy_progress, started on first call. */
void sy_cli_hydro_progress(void *ctx, size_t done, size_t total);
/* sy_yield_compute_progress callback (sea-state searches and bins), the same way. */
void sy_cli_yield_progress(void *ctx, size_t done, size_t total);
/* sy_poles_find_progress callback (contour points); a new bar for each contour. */
void sy_cli_poles_progress(void *ctx, size_t done, size_t total);
/* --jobs value 1..1024, or 0 if the text is not one. */
int sy_cli_parse_jobs(const char *text);

/* dir/stem.csv and dir/stem.png of the standard time response `kind`
 * (sy_response_settings_standard) over the motion poles of ps (response_out.c). */
int sy_cli_time_response(const sy_model *m, const sy_pole_set *ps, sy_response_kind kind, const char *dir,
                         const char *stem, sy_error *err);

int sy_cmd_version(int argc, char **argv);
int sy_cmd_check(int argc, char **argv);
int sy_cmd_run(int argc, char **argv);
int sy_cmd_hydro(int argc, char **argv);
int sy_cmd_sea(int argc, char **argv);
int sy_cmd_poles(int argc, char **argv);


#endif
