/* Frequency sweep: sy_array_solve over many real frequencies, threads over frequencies
 * (OpenMP, the only file of the library with OpenMP pragmas; guarded by SY_HAVE_OPENMP).
 * Each thread allocates one work object; the plan is shared read-only. With more than
 * one sweep thread, OpenBLAS (the LAPACK the build links, cmake/SyLapacke.cmake) is set
 * to one thread for the duration of the sweep and restored afterwards, so threads over
 * frequencies do not also spawn BLAS threads (oversubscription); the setting is
 * process-wide, so do not run BLAS work in other threads during a parallel sweep. */
#include "array_impl.h"
#include "sy_config.h"

#include <stdlib.h>
#if SY_HAVE_OPENMP
#include <omp.h>
/* OpenBLAS thread control (declared here to keep GSL's and OpenBLAS's cblas.h apart). */
extern void openblas_set_num_threads(int n);
extern int openblas_get_num_threads(void);
#endif

int sy_array_sweep(const sy_array_plan *plan, const double *omega, size_t n_omega,
                   sy_array_hydro **results, int n_threads, sy_error *err)
{
    if (plan == NULL || (n_omega > 0 && (omega == NULL || results == NULL)))
        return sy_error_set(err, SY_EINVAL, "array sweep: NULL argument");
    size_t first_bad = n_omega;
    int first_rc = SY_OK;
    sy_error first_err = SY_ERROR_INIT;
#if SY_HAVE_OPENMP
    int nt = n_threads > 0 ? n_threads : omp_get_max_threads();
    int blas_threads = openblas_get_num_threads();
    if (nt > 1)
        openblas_set_num_threads(1);
#pragma omp parallel num_threads(nt)
#else
    (void)n_threads;
#endif
    {
        sy_array_work *w = NULL;
        sy_error e = SY_ERROR_INIT;
        int wrc = sy_array_work_alloc(&w, plan, &e);
#if SY_HAVE_OPENMP
#pragma omp for schedule(dynamic, 1)
#endif
        for (size_t i = 0; i < n_omega; i++) {
            int rc = wrc;
            if (rc == SY_OK)
                rc = sy_array_solve(plan, omega[i], w, results[i], &e);
            if (rc != SY_OK) {
#if SY_HAVE_OPENMP
#pragma omp critical(sy_array_sweep_error)
#endif
                if (i < first_bad) {
                    first_bad = i;
                    first_rc = rc;
                    first_err = e;
                }
            }
        }
        sy_array_work_free(w);
    }
#if SY_HAVE_OPENMP
    if (nt > 1)
        openblas_set_num_threads(blas_threads);
#endif
    if (first_rc != SY_OK) {
        if (err != NULL)
            *err = first_err;
        sy_error_prefix(err, "array sweep: omega[%zu] = %g rad/s", first_bad, omega[first_bad]);
        return first_rc;
    }
    return SY_OK;
}
