/* Test helper: a model of floats built in code (see float_model.h). */
#include "float_model.h"

#include "swellyield/hydro.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

void sy_test_float_model(sy_model *m, sy_model_device *dev, size_t n, const double *x, const double *y,
                         double *omega, size_t n_omega, double *headings, size_t n_headings)
{
    memset(m, 0, sizeof *m);
    m->depth = 50, m->rho = 1025, m->g = 9.81, m->shape = SY_SHAPE_FLOAT, m->radius = 5, m->draft = 4;
    m->mass_displaced = 1, m->modes = SY_MODES_HEAVE, m->has_pto = 1, m->pto_mode = 3, m->efficiency = 1;
    m->rated_power = INFINITY, m->max_stroke = INFINITY, m->spectrum = SY_SPECTRUM_JONSWAP, m->gamma = 3.3;
    m->direction_from = NAN, m->tolerance = 1e-6, m->max_bodies = 100;
    m->omega = omega, m->n_omega = n_omega, m->headings = headings, m->n_headings = n_headings;
    strcpy(m->path, "test"), strcpy(m->climate, "test climate");
    for (size_t i = 0; i < n; i++) {
        memset(&dev[i], 0, sizeof dev[i]);
        snprintf(dev[i].name, sizeof dev[i].name, "F%zu", i + 1);
        dev[i].x = x[i], dev[i].y = y != NULL ? y[i] : 0.0, dev[i].radius = 5, dev[i].draft = 4;
    }
    m->devices = dev, m->n_devices = n;
    sy_test_pto_damping(m, 2e5);
}

void sy_test_pto_damping(sy_model *m, double b)
{
    m->pto_damping = b;
    for (size_t i = 0; i < m->n_devices; i++)
        m->devices[i].pto_damping = b;
}

void sy_test_pole_model(sy_model *m, sy_model_device *dev, size_t n, const double *x, double bpto)
{
    static double omega[2] = {0.4, 2.4}; /* the truncation is chosen for this band */
    sy_test_float_model(m, dev, n, x, NULL, omega, 2, NULL, 0);
    sy_test_pto_damping(m, bpto);
    m->has_resonance = 1, m->res_re_min = 0.4, m->res_re_max = 2.4, m->res_im_depth = 0.8;
    m->tolerance = 1e-9;
    sy_hydro_truncation(m, dev, n, &m->orders, &m->depth_modes);
}
