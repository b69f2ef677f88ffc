/* Cross-module internals of the core: text-file and CSV reading with line numbers, and
 * strict number parsing. Not exported (syi_ prefix, hidden visibility). */
#ifndef SY_CORE_IMPL_H
#define SY_CORE_IMPL_H

#include <stddef.h>
#include "swellyield/core.h"

/* Largest text input read (layouts, CSV tables, project files): far above any real
 * table; protects against a multi-gigabyte file given by mistake. */
#define SYI_TEXT_MAX_BYTES ((size_t)64 << 20)

/* SY_OK if path names a readable regular file; SY_EIO "PATH: <why>" otherwise
 * (missing, a directory, unreadable, larger than max_bytes). */
int syi_check_input_file(const char *path, size_t max_bytes, sy_error *err);

/* nc_open(path, NC_NOWRITE) after a probe of the header in a forked child, so that a
 * damaged file that crashes the NetCDF library gives SY_EIO naming path instead of a
 * crash (ncopen.c). SY_EIO with the library's reason when it refuses the file. */
int syi_nc_open(const char *path, int *ncid, sy_error *err);

/* One CSV record: its fields (NUL-terminated, surrounding blanks trimmed) and the
 * 1-based line of the file where it starts. */
typedef struct syi_csv_row {
    size_t line;
    size_t n_fields;
    char **fields;
} syi_csv_row;

typedef struct syi_csv {
    size_t n_rows;
    syi_csv_row *rows;
} syi_csv;

/* Read a CSV file (RFC 4180 quoting, libcsv) into rows. Blank lines and lines whose
 * first non-blank character is '#' are skipped. Rejects non-UTF-8 text and NUL bytes
 * with "PATH:LINE: ...". Free with syi_csv_free. */
int syi_csv_read(const char *path, syi_csv **out, sy_error *err);
void syi_csv_free(syi_csv *csv);

/* Strict parse of a whole string as a finite double (leading/trailing blanks allowed).
 * Returns 1 on success, 0 otherwise (empty, trailing text, NaN, inf, overflow). */
int syi_parse_double(const char *text, double *value);

/* 1 if the n bytes are valid UTF-8 without NUL, else 0. */
int syi_utf8_valid(const char *s, size_t n);

/* Resolve rel against the folder of base_file (unless rel is absolute) into out
 * (capacity cap). SY_EINPUT if the result does not fit. */
int syi_path_resolve(const char *base_file, const char *rel, char *out, size_t cap, sy_error *err);

#endif

/* ---- atomic outputs: write to a temporary name in the target's folder, then rename ---- */

/* Fill tmp (capacity cap) with "<dir>/.<name>.tmp-<pid>" for final path `path`. */
int syi_atomic_tmpname(const char *path, char *tmp, size_t cap, sy_error *err);
/* Rename tmp over path (atomic on POSIX within one file system); on failure tmp is
 * removed and SY_EIO names both. */
int syi_atomic_commit(const char *tmp, const char *path, sy_error *err);
/* Remove tmp if it exists (after a failed write). */
void syi_atomic_abort(const char *tmp);
/* Remove the temporaries ".<name>.tmp-<pid>" in folder dir left by processes that no
 * longer exist (killed between creating and renaming them: kill(pid, 0) gives ESRCH).
 * Best effort, never fails; temporaries of live processes are left alone. */
void syi_atomic_sweep(const char *dir);

/* 64-bit FNV-1a hash of n bytes, chained from h (start with SYI_HASH_SEED). */
#define SYI_HASH_SEED 0xcbf29ce484222325ULL
unsigned long long syi_hash64(unsigned long long h, const void *data, size_t n);
