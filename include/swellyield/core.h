/* swellyield core: status codes, the error record every fallible call fills, and
 * library initialisation. The library never prints, exits or aborts; it returns a
 * status (SY_OK = 0) and, when given a non-NULL sy_error, a one-line message that
 * says which input, its value and what was expected.
 * Thread safety: sy_error records are per caller; sy_init() is called once, before
 * any threads start. */
#ifndef SWELLYIELD_CORE_H
#define SWELLYIELD_CORE_H

#include <stddef.h>

#ifdef __cplusplus
extern "C" {
#endif

#if defined(SY_BUILDING_LIBRARY)
#define SY_API __attribute__((visibility("default")))
#else
#define SY_API
#endif

#if defined(__GNUC__)
#define SY_PRINTF(fmt, args) __attribute__((format(printf, fmt, args)))
#else
#define SY_PRINTF(fmt, args)
#endif

/* One list for codes and their texts. */
#define SY_STATUS_LIST(X)                                                        \
    X(SY_OK, "success")                                                          \
    X(SY_EINVAL, "invalid argument")                                             \
    X(SY_EINPUT, "invalid input")                                                \
    X(SY_ENOMEM, "out of memory")                                                \
    X(SY_EIO, "read or write failed")                                            \
    X(SY_ESINGULAR, "singular system")                                           \
    X(SY_ENOCONV, "did not converge")                                            \
    X(SY_ELOSS, "loss of accuracy")                                              \
    X(SY_ELIMIT, "resource limit exceeded")                                      \
    X(SY_CONTINUE, "iteration not finished")

#define SY_STATUS_ENUM(name, text) name,
typedef enum { SY_STATUS_LIST(SY_STATUS_ENUM) SY_STATUS_COUNT } sy_status;
#undef SY_STATUS_ENUM

#define SY_ERROR_MSG_MAX 512

/* Code plus one-line message. Initialise with SY_ERROR_INIT. */
typedef struct sy_error {
    int code;
    char msg[SY_ERROR_MSG_MAX];
} sy_error;

#define SY_ERROR_INIT {SY_OK, {0}}

/* Static text for a status code ("unknown status" for anything else). */
SY_API const char *sy_status_text(int code);

/* Record code and a printf-style message in err (err may be NULL); returns code so
 * callers can write `return sy_error_set(err, SY_EINPUT, "...", ...)`. The message is
 * kept one line: control bytes echoed from input (newlines in a quoted CSV field...)
 * become '?' (also in sy_error_prefix). */
SY_API int sy_error_set(sy_error *err, int code, const char *fmt, ...) SY_PRINTF(3, 4);

/* Prepend caller context: "context: old message". Keeps the code. NULL-safe. */
SY_API void sy_error_prefix(sy_error *err, const char *fmt, ...) SY_PRINTF(2, 3);

/* Reset to SY_OK with an empty message. NULL-safe. */
SY_API void sy_error_clear(sy_error *err);

/* Once per process, before any other call: switches GSL's aborting error handler
 * off, so library code checks every GSL status itself. Idempotent. */
SY_API void sy_init(void);

/* Library version string ("0.1.0") and a one-line list of dependency versions. */
SY_API const char *sy_version(void);
SY_API const char *sy_dependency_versions(void);

#ifdef __cplusplus
}
#endif
#endif
