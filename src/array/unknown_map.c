/* Which body, depth mode and angular order an interaction unknown belongs to (array.h),
 * from the plan's index map (array_impl.h: unk_off[i] + q (2M+1) + (n + M)). Callers that
 * read vectors of the interaction system (the scattering resonances' null vectors) use
 * this instead of assuming the layout. */
#include "array_impl.h"

void sy_array_plan_unknown(const sy_array_plan *plan, size_t u, size_t *body, size_t *depth_mode, long *order)
{
    size_t i = 0;
    while (i + 1 < plan->n_bodies && plan->unk_off[i + 1] <= u)
        i++;
    size_t r = u - plan->unk_off[i];
    *body = i;
    *depth_mode = r / plan->nn;
    *order = (long)(r % plan->nn) - (long)plan->M;
}
