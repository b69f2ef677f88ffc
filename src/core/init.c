/* Library initialisation and version strings. */
#include <complex.h>
#include "swellyield/core.h"
#include "sy_config.h"

#include <gsl/gsl_errno.h>
#include <gsl/gsl_version.h>
#include <netcdf.h>
#include <stdio.h>

/* OpenBLAS's own thread pool (declared here: the seam to the BLAS build). */
void openblas_set_num_threads(int num_threads);

void sy_init(void)
{
    /* GSL's default handler aborts; the library returns statuses instead. */
    gsl_set_error_handler_off();
    /* Parallelism lives in the frequency sweeps (OpenMP, one LU per thread); BLAS
     * threads inside them only oversubscribe the cores and cost more than they give on
     * the small dense systems of a frequency. */
    openblas_set_num_threads(1);
}

const char *sy_version(void) { return SY_VERSION_STRING; }

const char *sy_dependency_versions(void)
{
    static char buf[256];
    /* Written once; callers use it from the main thread (program --version, file
     * attributes). */
    snprintf(buf, sizeof buf, "GSL %s, NetCDF %s, LAPACKE %s, OpenBLAS %s, inih %s, jansson %s, PLplot %s, OpenMP %s",
             gsl_version, nc_inq_libvers(), SY_LAPACKE_VERSION, SY_OPENBLAS_VERSION,
             SY_INIH_VERSION, SY_JANSSON_VERSION, SY_PLPLOT_VERSION, SY_HAVE_OPENMP ? "on" : "off");
    return buf;
}
