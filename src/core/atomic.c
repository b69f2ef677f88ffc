/* Atomic output files (temporary name + rename) and the cache-key hash. A run killed at
 * any moment leaves either the previous file or the new one, never a mix. */
#include "core_impl.h"

#include <ctype.h>
#include <dirent.h>
#include <errno.h>
#include <signal.h>
#include <stdlib.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

int syi_atomic_tmpname(const char *path, char *tmp, size_t cap, sy_error *err)
{
    const char *slash = strrchr(path, '/');
    int n;
    if (slash == NULL)
        n = snprintf(tmp, cap, ".%s.tmp-%ld", path, (long)getpid());
    else
        n = snprintf(tmp, cap, "%.*s/.%s.tmp-%ld", (int)(slash - path), path, slash + 1, (long)getpid());
    if (n < 0 || (size_t)n >= cap)
        return sy_error_set(err, SY_EIO, "%s: path too long for a temporary name", path);
    return SY_OK;
}

int syi_atomic_commit(const char *tmp, const char *path, sy_error *err)
{
    if (rename(tmp, path) != 0) {
        int e = errno;
        unlink(tmp);
        return sy_error_set(err, SY_EIO, "%s: cannot replace with %s: %s", path, tmp, strerror(e));
    }
    return SY_OK;
}

void syi_atomic_abort(const char *tmp) { unlink(tmp); }

void syi_atomic_sweep(const char *dir)
{
    DIR *d = opendir(dir);
    if (d == NULL)
        return;
    struct dirent *e;
    while ((e = readdir(d)) != NULL) {
        const char *tag = e->d_name[0] == '.' ? strstr(e->d_name, ".tmp-") : NULL;
        if (tag == NULL || tag == e->d_name || !isdigit((unsigned char)tag[5]))
            continue;
        char *end;
        long pid = strtol(tag + 5, &end, 10);
        if (*end != '\0' || pid <= 0 || pid == (long)getpid() || kill((pid_t)pid, 0) == 0 || errno != ESRCH)
            continue;
        char path[4096];
        if (snprintf(path, sizeof path, "%s/%s", dir, e->d_name) < (int)sizeof path)
            (void)unlink(path);
    }
    closedir(d);
}

unsigned long long syi_hash64(unsigned long long h, const void *data, size_t n)
{
    const unsigned char *p = data;
    for (size_t i = 0; i < n; i++) {
        h ^= p[i];
        h *= 0x100000001b3ULL; /* FNV-1a 64-bit prime */
    }
    return h;
}
