/* Opening a NetCDF input file without letting a malformed one crash the program.
 * NetCDF-C 4.9.0 (Debian 12) reads a damaged classic header out of bounds (fuzz_climate_nc
 * finds SEGVs and negative memcpy sizes inside nc_open within seconds: docs/robustness.md),
 * so the header is first read by nc_open in a forked child; only when the child comes
 * back normally does this process open the file. A crash there becomes a one-line input
 * error. Cost: one fork per input file (copy-on-write, about a millisecond). */
#include "core_impl.h"

#include <errno.h>
#include <fcntl.h>
#include <netcdf.h>
#include <sys/types.h>
#include <sys/wait.h>
#include <unistd.h>

#define PROBE_REFUSED 3 /* child: nc_open returned an error (not a crash) */

int syi_nc_open(const char *path, int *ncid, sy_error *err)
{
    pid_t pid = fork();
    if (pid == 0) { /* quiet: the library's or the C library's crash report is not ours */
        int null = open("/dev/null", O_WRONLY);
        if (null >= 0)
            dup2(null, STDERR_FILENO);
        int id, st = nc_open(path, NC_NOWRITE, &id);
        if (st == NC_NOERR)
            nc_close(id);
        _exit(st == NC_NOERR ? 0 : PROBE_REFUSED);
    }
    if (pid > 0) {
        int ws = 0;
        pid_t w;
        while ((w = waitpid(pid, &ws, 0)) < 0 && errno == EINTR)
            ;
        if (w == pid && !(WIFEXITED(ws) && (WEXITSTATUS(ws) == 0 || WEXITSTATUS(ws) == PROBE_REFUSED)))
            return sy_error_set(err, SY_EIO,
                                "%s: cannot open as NetCDF: the NetCDF library failed reading its header "
                                "(a damaged or truncated file; expected a valid NetCDF file)",
                                path);
    } /* fork failed (resource limits): open without the probe */
    int st = nc_open(path, NC_NOWRITE, ncid);
    if (st != NC_NOERR)
        return sy_error_set(err, SY_EIO, "%s: cannot open as NetCDF: %s", path, nc_strerror(st));
    return SY_OK;
}
