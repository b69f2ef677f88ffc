/* Placeholder: the float body kind is being implemented (issue 3/4). Returns an error so
 * that nothing silently uses it. */
#include "body_impl.h"

static int plan_init(sy_body_plan *plan, sy_error *err)
{
    (void)plan;
    return sy_error_set(err, SY_EINVAL, "body: kind 'float' not implemented yet");
}
static void plan_free(sy_body_plan *plan) { (void)plan; }
static int work_init(sy_body_work *work, const sy_body_plan *plan, sy_error *err)
{
    (void)work; (void)plan;
    return sy_error_set(err, SY_EINVAL, "body: kind 'float' not implemented yet");
}
static void work_free(sy_body_work *work) { (void)work; }
static int solve(const sy_body_plan *plan, const sy_wave_roots *roots, double rho,
                 sy_body_work *work, sy_body_waves *out, sy_error *err)
{
    (void)plan; (void)roots; (void)rho; (void)work; (void)out;
    return sy_error_set(err, SY_EINVAL, "body: kind 'float' not implemented yet");
}

const syi_body_ops syi_body_float_ops = {plan_init, plan_free, work_init, work_free, solve};
