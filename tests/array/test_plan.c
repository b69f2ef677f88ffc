/* Array plan: bad layouts and settings give one-line messages naming the input (table
 * driven); the cache key follows the geometry; index maps; describe. */
#include "check.h"

#include "swellyield/array.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

int main(void)
{
    sy_init();
    const sy_array_settings good = {30.0, 1025.0, 9.81, 1e-6, 4, 3, 0.5};
    const sy_array_type types[2] = {{{SY_BODY_COLUMN, 2.0, 30.0, 0.0}, SY_ARRAY_SURGE | SY_ARRAY_SWAY},
                                    {{SY_BODY_COLUMN, 3.0, 30.0, 0.0}, SY_ARRAY_SURGE}};
    const double beta[2] = {0.0, 1.0};
    static const struct {
        double x2, y2, h, tol, margin;
        size_t M, type2;
        const char *expect;
    } bad[] = {
        /* centres 5.3 apart, radii 2 + 3 + margin 0.5 = 5.5 */
        {5.3, 0.0, 30, 1e-6, 0.5, 4, 1, "bodies 0 at (0, 0) and 2 at (5.3, 0) overlap"},
        {20, 0, -5, 1e-6, 0.5, 4, 1, "depth h must be > 0 m"},
        {20, 0, 30, 2.0, 0.5, 4, 1, "tolerance must be in (0, 1), got 2"},
        {20, 0, 30, 1e-6, -1, 4, 1, "margin must be >= 0 m, got -1"},
        {20, 0, 30, 1e-6, 0.5, 0, 1, "angular order M must be in 1..64, got 0"},
        {20, 0, 30, 1e-6, 0.5, 4, 7, "body 2 has type 7, expected < 2"},
        {NAN, 0, 30, 1e-6, 0.5, 4, 1, "body 2 position (nan, 0) not finite"},
    };
    for (size_t c = 0; c < sizeof bad / sizeof bad[0]; c++) {
        sy_array_settings s = good;
        s.h = bad[c].h;
        s.tolerance = bad[c].tol;
        s.margin = bad[c].margin;
        s.n_order = bad[c].M;
        sy_array_body b[3] = {{0, 0, 0}, {-10, 4, 0}, {bad[c].x2, bad[c].y2, bad[c].type2}};
        sy_array_plan *p = NULL;
        sy_error err = SY_ERROR_INIT;
        int rc = sy_array_plan_create(&p, &s, types, 2, b, 3, beta, 2, &err);
        sy_check_fails(rc, SY_EINVAL, &err, bad[c].expect, "bad input %zu: %s", c, bad[c].expect);
        sy_array_plan_free(p);
    }
    /* A good layout: index maps, key, describe. */
    sy_array_body b[3] = {{0, 0, 0}, {-10, 4, 0}, {12, 1, 1}};
    sy_array_plan *p = NULL, *q = NULL;
    sy_error err = SY_ERROR_INIT;
    int rc = sy_array_plan_create(&p, &good, types, 2, b, 3, beta, 2, &err);
    if (sy_check_ok(rc, &err, "good plan")) {
        sy_check_true(sy_array_plan_n_dof(p) == 5, "dofs: 2 + 2 + 1 (got %zu)", sy_array_plan_n_dof(p));
        size_t body;
        int mode;
        sy_array_plan_dof(p, 3, &body, &mode);
        sy_check_true(body == 1 && mode == 2, "dof 3 is body 1 sway (got %zu, %d)", body, mode);
        sy_array_plan_dof(p, 4, &body, &mode);
        sy_check_true(body == 2 && mode == 1, "dof 4 is body 2 surge (got %zu, %d)", body, mode);
        /* columns only: the propagating mode alone, 2M+1 partial waves per body */
        sy_check_true(sy_array_plan_partial_waves(p, 1, 0) == 9 && sy_array_plan_partial_waves(p, 1, 1) == 0 &&
                          sy_array_plan_partial_waves(p, 3, 0) == 0 && sy_array_plan_n_unknowns(p) == 27,
                      "partial waves: 9 per body in mode 0, none in mode 1 or beyond the bodies");
        b[2].x += 1e-9;
        rc = sy_array_plan_create(&q, &good, types, 2, b, 3, beta, 2, &err);
        sy_check_true(rc == SY_OK && sy_array_plan_key(p) != sy_array_plan_key(q),
                      "key changes when a body moves by 1 nm");
        char buf[4096] = {0};
        FILE *f = fmemopen(buf, sizeof buf - 1, "w");
        sy_array_plan_describe(p, f);
        fclose(f);
        sy_check_true(strstr(buf, "3 bodies, 2 types") != NULL && strstr(buf, "key ") != NULL,
                      "describe names bodies, types and key");
    }
    sy_array_plan_free(p);
    sy_array_plan_free(q);
    return sy_check_summary();
}
