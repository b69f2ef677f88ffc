/* All-or-nothing output folders (outputs.h): write into a sibling staging folder, then
 * swap it with the target in one atomic renameat2(RENAME_EXCHANGE). */
#define _GNU_SOURCE 1
#include "swellyield/outputs.h"

#include <ctype.h>
#include <dirent.h>
#include <errno.h>
#include <signal.h>
#include <stdlib.h>
#include <fcntl.h>
#include <ftw.h>
#include <stdio.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

static int rm_entry(const char *path, const struct stat *sb, int flag, struct FTW *ftw)
{
    (void)sb;
    (void)flag;
    (void)ftw;
    return remove(path);
}

static void rmtree(const char *path) { nftw(path, rm_entry, 16, FTW_DEPTH | FTW_PHYS); }

/* Staging folders "<dir>.partial-<pid>" of processes that no longer exist (killed by
 * SIGKILL or SIGINT before they could clean up) are removed, after handing a cache they
 * carried back to <dir> if <dir> has none (a kill between the cache hand-over and the
 * swap). kill(pid, 0) failing with ESRCH is the test for "no longer exists"; a folder of
 * a live process, or of a pid we may not signal (EPERM: alive), is left alone. Assumes
 * the processes writing into the parent folder share this machine's pid space (not so
 * for a folder shared over a network by several hosts: there a live run's folder whose
 * pid is free here would be removed). Best effort: failures only leave the folder. */
static void remove_stale_stages(const char *dir)
{
    const char *slash = strrchr(dir, '/');
    char parent[SY_OUTPUTS_PATH_MAX];
    const char *base = slash ? slash + 1 : dir;
    if (slash == NULL)
        snprintf(parent, sizeof parent, ".");
    else if (slash == dir)
        snprintf(parent, sizeof parent, "/");
    else
        snprintf(parent, sizeof parent, "%.*s", (int)(slash - dir), dir);
    size_t nb = strlen(base);
    DIR *d = opendir(parent);
    if (d == NULL)
        return;
    struct dirent *e;
    while ((e = readdir(d)) != NULL) {
        const char *name = e->d_name, *p = name + nb + 9; /* after "<base>.partial-" */
        if (strncmp(name, base, nb) != 0 || strncmp(name + nb, ".partial-", 9) != 0 || *p == '\0')
            continue;
        char *end;
        long pid = strtol(p, &end, 10);
        if (*end != '\0' || !isdigit((unsigned char)*p) || pid <= 0 || pid == (long)getpid())
            continue;
        if (kill((pid_t)pid, 0) == 0 || errno != ESRCH)
            continue;
        char stale[SY_OUTPUTS_PATH_MAX + 300], from[SY_OUTPUTS_PATH_MAX + 310], to[SY_OUTPUTS_PATH_MAX + 8];
        struct stat sb;
        snprintf(stale, sizeof stale, "%s/%s", parent, name);
        snprintf(from, sizeof from, "%s/cache", stale);
        snprintf(to, sizeof to, "%s/cache", dir);
        if (stat(dir, &sb) == 0 && S_ISDIR(sb.st_mode) && stat(to, &sb) != 0 && stat(from, &sb) == 0)
            (void)rename(from, to);
        rmtree(stale);
    }
    closedir(d);
}

int sy_outputs_begin(sy_outputs_stage *st, const char *dir, sy_error *err)
{
    size_t n = strlen(dir);
    while (n > 1 && dir[n - 1] == '/')
        n--; /* "out/" and "out" name the same folder */
    if (n == 0 || n + 32 >= sizeof st->dir)
        return sy_error_set(err, SY_EINPUT, "output folder name '%s' is empty or too long", dir);
    memcpy(st->dir, dir, n);
    st->dir[n] = '\0';
    snprintf(st->stage, sizeof st->stage, "%s.partial-%ld", st->dir, (long)getpid());
    struct stat sb;
    if (stat(st->dir, &sb) == 0 && !S_ISDIR(sb.st_mode))
        return sy_error_set(err, SY_EINPUT, "%s: exists and is not a folder", st->dir);
    rmtree(st->stage); /* a leftover of an earlier process with the same pid */
    remove_stale_stages(st->dir);
    if (mkdir(st->stage, 0777) != 0)
        return sy_error_set(err, SY_EIO, "%s: cannot create: %s", st->stage, strerror(errno));
    return SY_OK;
}

int sy_outputs_path(const sy_outputs_stage *st, const char *name, char *buf, size_t cap, sy_error *err)
{
    int n = snprintf(buf, cap, "%s/%s", st->stage, name);
    if (n < 0 || (size_t)n >= cap)
        return sy_error_set(err, SY_EINPUT, "%s/%s: path too long", st->stage, name);
    return SY_OK;
}

int sy_outputs_commit(sy_outputs_stage *st, sy_error *err)
{
    struct stat sb;
    if (stat(st->dir, &sb) != 0) {
        if (rename(st->stage, st->dir) != 0)
            return sy_error_set(err, SY_EIO, "%s: cannot move %s into place: %s", st->dir, st->stage, strerror(errno));
        st->stage[0] = '\0';
        return SY_OK;
    }
    /* Carry the cache over; a failure here only costs a recomputation later. */
    char from[SY_OUTPUTS_PATH_MAX + 8], to[SY_OUTPUTS_PATH_MAX + 48];
    snprintf(from, sizeof from, "%s/cache", st->dir);
    snprintf(to, sizeof to, "%s/cache", st->stage);
    if (stat(from, &sb) == 0 && stat(to, &sb) != 0)
        (void)rename(from, to);
    if (renameat2(AT_FDCWD, st->stage, AT_FDCWD, st->dir, RENAME_EXCHANGE) != 0)
        return sy_error_set(err, SY_EIO, "%s: cannot swap in the new outputs from %s: %s", st->dir, st->stage,
                            strerror(errno));
    rmtree(st->stage); /* now holds the previous outputs */
    st->stage[0] = '\0';
    return SY_OK;
}

void sy_outputs_abort(sy_outputs_stage *st)
{
    if (st != NULL && st->stage[0] != '\0') {
        rmtree(st->stage);
        st->stage[0] = '\0';
    }
}

const char *sy_outputs_cautions(void)
{
    return "Estimate from linear potential-flow theory: small waves and small motions; viscous losses, "
           "end stops, slamming and non-linear hydrostatics are not modelled, so figures are optimistic "
           "near resonance and near-trapping.\n"
           "Survival loads, extreme and fatigue loads, moorings, availability, electrical losses beyond the "
           "stated efficiency and environmental constraints are out of scope.\n"
           "The reactive bound is a theoretical ceiling, not an achievable production.\n"
           "A power matrix depends on the spectral shape and spreading assumed; it does not transfer to "
           "another site without care (IEC TS 62600-102).\n"
           "A mean annual figure is not a guarantee for any single year: inter-annual variability is large.\n"
           "Defer to the IEC TS 62600 series, local codes and certified practice for any design, financing "
           "or safety decision.\n";
}
