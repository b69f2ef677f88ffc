/* Private to the body module: the plan and work bodies, and the per-kind entry points
 * the dispatch in plan.c calls. Each body kind lives in its own file (float.c,
 * column.c) and keeps its own state behind `impl`. See include/swellyield/body.h. */
#ifndef SY_BODY_IMPL_H
#define SY_BODY_IMPL_H

#include "swellyield/body.h"

struct sy_body_plan {
    sy_body_geometry geom;
    double h;               /* depth, m */
    double tolerance;       /* target relative accuracy */
    size_t n_order;         /* M of the output */
    size_t n_depth;         /* Q of the output */
    size_t n_roots;         /* evanescent roots the solve reads from sy_wave_roots */
    void *impl;             /* kind-specific plan data, owned */
};

struct sy_body_work {
    sy_body_kind kind;
    void *impl;             /* kind-specific scratch, owned, sized from the plan */
};

/* Per-kind operations. plan_init fills plan->n_roots and plan->impl (the common fields
 * are set before the call); plan_free releases plan->impl; work_init/work_free likewise
 * for work->impl; solve fills every field of out (already sized to M, Q). */
typedef struct syi_body_ops {
    int (*plan_init)(sy_body_plan *plan, sy_error *err);
    void (*plan_free)(sy_body_plan *plan);
    int (*work_init)(sy_body_work *work, const sy_body_plan *plan, sy_error *err);
    void (*work_free)(sy_body_work *work);
    int (*solve)(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                 sy_body_work *work, sy_body_waves *out, sy_error *err);
} syi_body_ops;

extern const syi_body_ops syi_body_float_ops;   /* float.c */
extern const syi_body_ops syi_body_column_ops;  /* column.c */

#endif
