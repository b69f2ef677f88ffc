/* Shared set-up of the array tests: a plan, one work and one result, made and freed
 * together (NULL-safe free). */
#ifndef SY_TEST_ARRAY_FIXTURE_H
#define SY_TEST_ARRAY_FIXTURE_H

#include "swellyield/array.h"

typedef struct {
    sy_array_plan *plan;
    sy_array_work *work;
    sy_array_hydro *res;
} setup;

static inline int setup_open(setup *s, const sy_array_settings *set, const sy_array_type *types,
                             size_t nt, const sy_array_body *b, size_t n, const double *beta,
                             size_t nb, sy_error *err)
{
    int rc = sy_array_plan_create(&s->plan, set, types, nt, b, n, beta, nb, err);
    if (rc == SY_OK)
        rc = sy_array_work_alloc(&s->work, s->plan, err);
    if (rc == SY_OK)
        rc = sy_array_hydro_alloc(&s->res, s->plan, err);
    return rc;
}

static inline void unmake(setup *s)
{
    sy_array_hydro_free(s->res);
    sy_array_work_free(s->work);
    sy_array_plan_free(s->plan);
    s->res = NULL;
    s->work = NULL;
    s->plan = NULL;
}

#endif
