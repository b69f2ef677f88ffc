/* Temporary files for tests (see tmpfiles.h). */
#include "tmpfiles.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

const char *sy_test_tmpdir(void)
{
    static char dir[512];
    const char *base = getenv("TMPDIR");
    snprintf(dir, sizeof dir, "%s/sytest-XXXXXX", base != NULL && base[0] ? base : "/tmp");
    if (mkdtemp(dir) == NULL) {
        perror("mkdtemp");
        exit(1);
    }
    return dir;
}

const char *sy_test_write_bytes(const char *dir, const char *name, const void *data, size_t n)
{
    static char paths[8][1024];
    static int next;
    char *p = paths[next++ % 8];
    snprintf(p, 1024, "%s/%s", dir, name);
    FILE *f = fopen(p, "wb");
    if (f == NULL || fwrite(data, 1, n, f) != n || fclose(f) != 0) {
        fprintf(stderr, "cannot write %s\n", p);
        exit(1);
    }
    return p;
}

const char *sy_test_write(const char *dir, const char *name, const char *text)
{
    return sy_test_write_bytes(dir, name, text, strlen(text));
}

void sy_test_rmtree(const char *dir)
{
    char cmd[1200];
    if (strncmp(dir, "/tmp/", 5) != 0 && getenv("TMPDIR") == NULL)
        return; /* never remove anything outside a temp area */
    snprintf(cmd, sizeof cmd, "rm -rf '%s'", dir);
    if (system(cmd) != 0)
        fprintf(stderr, "warning: could not remove %s\n", dir);
}
