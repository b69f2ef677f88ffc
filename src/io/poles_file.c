/* poles.csv: the resonances found, one row each, with motion mode shapes (outputs.h). */
#include <complex.h>
#include "swellyield/outputs.h"

#include <math.h>
#include <stdio.h>

typedef struct poles_out {
    const sy_model *m;
    const sy_pole_set *set;
} poles_out;

static int fill_poles(FILE *f, const void *ctx)
{
    const poles_out *c = ctx;
    const sy_pole_set *s = c->set;
    size_t nd = s->n_dof;
    size_t per = nd / (c->m->n_devices ? c->m->n_devices : 1);
    fprintf(f, "kind,omega_r_rad_s,gamma_rad_s,q_factor,period_s,residual,converged");
    for (size_t d = 0; d < nd; d++) {
        const char *name = c->m->devices[d / (per ? per : 1)].name;
        fprintf(f, ",%s_dof%zu_abs,%s_dof%zu_phase_deg", name, d % (per ? per : 1), name, d % (per ? per : 1));
    }
    fprintf(f, "\n");
    for (size_t i = 0; i < s->n; i++) {
        const sy_pole *p = &s->poles[i];
        fprintf(f, "%s,%.12g,%.12g,%.6g,%.6g,%.3g,%d", sy_pole_kind_name(p->kind), p->omega_r, p->gamma, p->q,
                2 * M_PI / p->omega_r, p->residual, p->converged);
        for (size_t d = 0; d < nd; d++) {
            if (p->mode != NULL)
                fprintf(f, ",%.6g,%.4g", cabs(p->mode[d]), carg(p->mode[d]) * 180 / M_PI);
            else
                fprintf(f, ",,");
        }
        fprintf(f, "\n");
    }
    return ferror(f);
}

int sy_outputs_write_poles(const char *path, const sy_model *m, const sy_pole_set *set, sy_error *err)
{
    poles_out po = {m, set};
    return sy_outputs_write_file(path, fill_poles, &po, err);
}
