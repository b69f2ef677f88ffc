/* Which body, depth mode and angular order an interaction unknown belongs to (array.h),
 * from the plan's index map (array_impl.h: blk_off[i Q + q] + (n + M_iq), the depth modes
 * of a body one after the other, each with its own orders). Callers that read vectors
 * of the interaction system (the scattering resonances' null vectors) use this instead
 * of assuming the layout. */
#include "array_impl.h"

void sy_array_plan_unknown(const sy_array_plan *plan, size_t u, size_t *body, size_t *depth_mode, long *order)
{
    if (u >= plan->n_unknowns) {
        *body = (size_t)-1;
        *depth_mode = 0;
        *order = 0;
        return;
    }
    size_t i = 0, q = 0;
    while (i + 1 < plan->n_bodies && plan->unk_off[i + 1] <= u)
        i++;
    while (q + 1 < plan->nq[i] && plan->blk_off[i * plan->Q + q + 1] <= u)
        q++;
    *body = i;
    *depth_mode = q;
    *order = (long)(u - plan->blk_off[i * plan->Q + q]) - (long)syi_array_order(plan, i, q);
}
