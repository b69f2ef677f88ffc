/* Arrays of floating cylinders (with a fixed column among them): identities of linear
 * potential flow that any correct array solution satisfies.
 *  - one body through the array path equals the isolated body (body.h) to 1e-12;
 *  - reciprocity A = A^T, B = B^T (Newman, Marine Hydrodynamics ch. 6) to 1e-8 of max;
 *  - generalised Haskind relation B = k / (8 pi rho g cg) int X X^H dbeta
 *    (references.md section 7.1) to 1e-6 for 2, 3 (one a column) and 5 unequal bodies in
 *    irregular layouts, all five modes on some bodies;
 *  - radiation: damping from the far-field energy flux equals the pressure-integral B;
 *  - fixed array (no motion): optical theorem int |A(theta)|^2 = -2 pi Re A(beta)
 *    (references.md section 9; energy is conserved by fixed lossless bodies);
 *  - two identical heaving bodies: the interaction damping approaches the point-absorber
 *    value B_12 = B_11 J0(k d) (references.md 7.3) as the spacing grows;
 *  - convergence in angular order M (geometric) and depth modes Q (algebraic);
 *  - the per-mode angular truncation of the evanescent modes (plan.c) changes A, B, X
 *    by a tolerance-level amount against 2M+1 orders in every mode, and keeps
 *    reciprocity and Haskind. */
#include "check.h"

#include "array/array_impl.h"
#include "swellyield/array.h"
#include "fixture.h"
#include "swellyield/waves.h"

#include <gsl/gsl_sf_bessel.h>
#include <math.h>
#include <stdlib.h>
#include <string.h>

#define PI 3.14159265358979323846
#define RHO 1025.0
#define G 9.81
#define DEPTH 30.0
#define NHEAD 72   /* trapezoid over a periodic integrand: exponential convergence; k D < 8 here */


static int make(setup *s, const sy_array_type *types, size_t nt, const sy_array_body *b, size_t n,
                size_t M, size_t Q, const double *beta, size_t nb, sy_error *err)
{
    sy_array_settings set = {DEPTH, RHO, G, 1e-10, M, Q, 0.0};
    return setup_open(s, &set, types, nt, b, n, beta, nb, err);
}


static double maxabs(const double *a, size_t n)
{
    double m = 0;
    for (size_t i = 0; i < n; i++)
        m = fmax(m, fabs(a[i]));
    return m;
}

/* Largest |a - b| over n complex values, relative to the largest |b|. */
static double cchange(const double complex *a, const double complex *b, size_t n)
{
    double d = 0, m = 0;
    for (size_t k = 0; k < n; k++) {
        d = fmax(d, cabs(a[k] - b[k]));
        m = fmax(m, cabs(b[k]));
    }
    return d / m;
}

/* Reciprocity and generalised Haskind on the float dofs of a solved layout. */
static void identities(setup *s, const char *name)
{
    const sy_array_plan *p = s->plan;
    const sy_array_hydro *r = s->res;
    const size_t nd = r->n_dof;
    double amax = maxabs(r->added_mass, nd * nd), bmax = maxabs(r->damping, nd * nd);
    for (size_t i = 0; i < nd; i++)
        for (size_t j = i + 1; j < nd; j++) {
            sy_check_close(r->added_mass[i * nd + j], r->added_mass[j * nd + i], 0, 1e-8 * amax,
                           "%s: A[%zu,%zu] = A[%zu,%zu]", name, i, j, j, i);
            sy_check_close(r->damping[i * nd + j], r->damping[j * nd + i], 0, 1e-8 * bmax,
                           "%s: B[%zu,%zu] = B[%zu,%zu]", name, i, j, j, i);
        }
    double k = creal(r->k0), c = k / (8 * PI * RHO * G * r->cg);
    for (size_t i = 0; i < nd; i++) {
        if (p->types[p->bodies[p->dof_body[i]].type].geom.kind != SY_BODY_FLOAT)
            continue;
        for (size_t j = 0; j < nd; j++) {
            if (p->types[p->bodies[p->dof_body[j]].type].geom.kind != SY_BODY_FLOAT)
                continue;
            double complex acc = 0;
            for (size_t b = 0; b < r->n_headings; b++)
                acc += r->excitation[b * nd + i] * conj(r->excitation[b * nd + j]);
            acc *= 2 * PI / r->n_headings;
            sy_check_close(c * creal(acc), r->damping[i * nd + j], 0, 1e-6 * bmax,
                           "%s: Haskind B[%zu,%zu]", name, i, j);
            sy_check_close(c * cimag(acc), 0.0, 0, 1e-6 * bmax, "%s: Haskind Im[%zu,%zu] = 0", name, i, j);
        }
    }
}

int main(void)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    double heads[NHEAD];
    for (int b = 0; b < NHEAD; b++)
        heads[b] = 2 * PI * b / NHEAD;
    const double omega = 0.9;
    const sy_array_type types[3] = {
        {{SY_BODY_FLOAT, 5.0, 4.0, 0.0}, SY_ARRAY_ALL_MODES},
        {{SY_BODY_FLOAT, 3.5, 6.0, -1.0}, SY_ARRAY_HEAVE | SY_ARRAY_SURGE | SY_ARRAY_PITCH},
        {{SY_BODY_COLUMN, 2.0, DEPTH, 0.0}, SY_ARRAY_SURGE},
    };

    /* --- One body: array path = isolated body path. */
    {
        setup s = {0};
        sy_array_body b = {7.3, -2.2, 0};
        if (sy_check_ok(make(&s, types, 1, &b, 1, 8, 6, heads, 4, &err), &err, "one-body plan") &&
            sy_check_ok(sy_array_solve(s.plan, omega, s.work, s.res, &err), &err, "one-body solve")) {
            const sy_body_waves *bw = s.work->bwaves[0];
            sy_check_true(s.res->convergence == bw->convergence && bw->convergence >= 0,
                          "N = 1: convergence estimate passed on (%g)", bw->convergence);
            char text[160];
            sy_array_plan_truncation(s.plan, text, sizeof text);
            sy_check_true(strstr(text, "M = 8, Q = 6") != NULL, "truncation record: %s", text);
            const size_t nd = 5, Q = s.plan->Q, nn = s.plan->nn;
            const long Ml = (long)s.plan->M;
            double k = creal(s.res->k0);
            for (size_t i = 0; i < nd; i++)
                for (size_t j = 0; j < nd; j++) {
                    sy_check_close(s.res->added_mass[i * nd + j], creal(bw->added_mass[i * 5 + j]), 1e-12,
                                   1e-12 * cabs(bw->added_mass[12]), "N = 1: A[%zu,%zu]", i, j);
                    sy_check_close(s.res->damping[i * nd + j], creal(bw->damping[i * 5 + j]), 1e-12,
                                   1e-12 * cabs(bw->damping[12]), "N = 1: B[%zu,%zu]", i, j);
                }
            for (size_t hb = 0; hb < 4; hb++) {
                double be = heads[hb];
                double complex ph = cexp(I * k * (b.x * cos(be) + b.y * sin(be))) * (-I * G / omega);
                for (size_t j = 0; j < nd; j++) {
                    double complex x = 0;
                    for (long n = -Ml; n <= Ml; n++)
                        x += bw->force[(j * Q + 0) * nn + (size_t)(n + Ml)] * ph * cpow(I, (double)n) *
                             cexp(-I * (double)n * be);
                    sy_check_cclose(s.res->excitation[hb * nd + j], x, 1e-12, 1e-12 * cabs(bw->force[(2 * Q) * nn + Ml]),
                                    "N = 1: X(heading %zu, dof %zu)", hb, j);
                }
            }
        }
        unmake(&s);
    }
    /* --- Reciprocity and Haskind: 2, 3 (one column) and 5 unequal bodies. */
    {
        const sy_array_body two[2] = {{0, 0, 0}, {14.1, 6.3, 1}};
        const sy_array_body three[3] = {{0, 0, 0}, {13.2, -4.5, 1}, {3.1, 12.7, 2}};
        const sy_array_body five[5] = {{0, 0, 0}, {15.2, 3.4, 1}, {-4.9, 14.6, 1}, {19.8, 18.1, 0}, {-17.3, -6.2, 1}};
        const struct {
            const char *name;
            const sy_array_body *b;
            size_t n;
        } cases[3] = {{"2 bodies", two, 2}, {"3 bodies (one column)", three, 3}, {"5 bodies", five, 5}};
        for (size_t c = 0; c < 3; c++) {
            setup s = {0};
            if (sy_check_ok(make(&s, types, 3, cases[c].b, cases[c].n, 8, 5, heads, NHEAD, &err), &err,
                            "%s plan", cases[c].name) &&
                sy_check_ok(sy_array_solve(s.plan, omega, s.work, s.res, &err), &err, "%s solve",
                            cases[c].name))
                identities(&s, cases[c].name);
            unmake(&s);
        }
    }
    /* --- Two identical heaving floats: B_12 -> B_11 J0(k d) (point-absorber limit). The
     * deviation shrinks as the spacing grows (scattering by the neighbour decays). */
    {
        double prev = INFINITY;
        const double spacing[3] = {20.0, 60.0, 180.0};
        sy_array_type th = {{SY_BODY_FLOAT, 2.0, 2.0, 0.0}, SY_ARRAY_HEAVE};
        for (int c = 0; c < 3; c++) {
            setup s = {0};
            sy_array_body b[2] = {{0, 0, 0}, {spacing[c], 0, 0}};
            if (sy_check_ok(make(&s, &th, 1, b, 2, 6, 4, heads, 1, &err), &err, "pair plan") &&
                sy_check_ok(sy_array_solve(s.plan, omega, s.work, s.res, &err), &err, "pair solve")) {
                double k = creal(s.res->k0);
                double b11 = s.res->damping[0], b12 = s.res->damping[1];
                double dev = fabs(b12 - b11 * gsl_sf_bessel_J0(k * spacing[c])) / b11;
                sy_check_true(dev < prev, "spacing %g m: |B12 - B11 J0(kd)|/B11 = %.3g decreasing", spacing[c], dev);
                prev = dev;
            }
            unmake(&s);
        }
    }
    /* --- Far-field energy balance of the radiation problems: with every body's total
     * outgoing propagating coefficients c_n^j for unit velocity of dof d (scattered beta
     * plus the body's own radiated R), the far field is
     *   A_d(theta) = sum_j e^{-ik(x_j cos + y_j sin)} sum_n c_n^j (-i)^n e^{i n theta}
     * (H_n ~ sqrt(2/(pi k r)) e^{i(kr - n pi/2 - pi/4)}), and the mean radiated power
     * through a large cylinder gives (Newman, Marine Hydrodynamics ch. 6, energy flux
     * p v_r with p = i omega rho phi)
     *   B_de = (2 omega rho / pi) int_{-h}^0 Z_0^2 dz  Re int A_d conj(A_e) dtheta.
     * An independent route to B (far field) from the near-field pressure integral. */
    {
        setup s = {0};
        const sy_array_body b[3] = {{0, 0, 0}, {13.2, -4.5, 1}, {3.1, 12.7, 2}};
        double beta = 0.4;
        if (sy_check_ok(make(&s, types, 3, b, 3, 8, 5, &beta, 1, &err), &err, "far-field plan") &&
            sy_check_ok(sy_array_solve(s.plan, omega, s.work, s.res, &err), &err, "far-field solve")) {
            const sy_array_plan *p = s.plan;
            const size_t nth = 720, nrad = p->n_rad, nu = p->n_unknowns, nd = s.res->n_dof, Q = p->Q;
            const long Ml = (long)p->M;
            const double k = creal(s.res->k0), kh = k * DEPTH;
            /* int Z_0^2 dz = (h/2 + sinh(2kh)/(4k)) / cosh^2(kh) */
            const double iz2 = (DEPTH / 2 + sinh(2 * kh) / (4 * k)) / (cosh(kh) * cosh(kh));
            double complex *far = calloc(nrad * nth, sizeof *far);
            for (size_t r = 0; r < nrad; r++) {
                size_t d = p->rad_dof[r], ib = p->dof_body[d];
                int mode = p->dof_mode[d];
                for (size_t it = 0; it < nth; it++) {
                    double th = 2 * PI * it / nth;
                    double complex A = 0;
                    for (size_t j = 0; j < p->n_bodies; j++) {
                        size_t tj = p->bodies[j].type;
                        double complex e = cexp(-I * k * (p->bodies[j].x * cos(th) + p->bodies[j].y * sin(th)));
                        for (long n = -Ml; n <= Ml; n++) {
                            size_t u = p->unk_off[j] + (size_t)(n + Ml);
                            double complex c = s.work->sol[(p->n_headings + r) * nu + u] /
                                               syi_array_scale(p, s.work, tj, 0, n);
                            if (j == ib)
                                c += s.work->bwaves[tj]->radiation[((size_t)(mode - 1) * Q + 0) * p->nn + (size_t)(n + Ml)];
                            A += e * c * cpow(-I, (double)n) * cexp(I * (double)n * th);
                        }
                    }
                    far[r * nth + it] = A;
                }
            }
            double bmax = maxabs(s.res->damping, nd * nd);
            for (size_t r = 0; r < nrad; r++)
                for (size_t q = 0; q < nrad; q++) {
                    double complex acc = 0;
                    for (size_t it = 0; it < nth; it++)
                        acc += far[r * nth + it] * conj(far[q * nth + it]);
                    double bff = 2 * omega * RHO / PI * iz2 * creal(acc) * 2 * PI / nth;
                    size_t d = p->rad_dof[r], e = p->rad_dof[q];
                    sy_check_close(bff, s.res->damping[d * nd + e], 0, 1e-6 * bmax,
                                   "far-field energy flux B[%zu,%zu]", d, e);
                }
            free(far);
        }
        unmake(&s);
    }
    /* --- Fixed floats: optical theorem (energy conservation), 3 bodies, heading 0.4. */
    {
        setup s = {0};
        const sy_array_body b[3] = {{0, 0, 0}, {13.2, -4.5, 1}, {3.1, 12.7, 2}};
        sy_array_type tf[3] = {types[0], types[1], types[2]};
        double beta = 0.4;
        if (sy_check_ok(make(&s, tf, 3, b, 3, 8, 5, &beta, 1, &err), &err, "fixed plan") &&
            sy_check_ok(sy_array_solve(s.plan, omega, s.work, s.res, &err), &err, "fixed solve")) {
            const sy_array_plan *p = s.plan;
            const size_t nth = 720;
            const long Ml = (long)p->M;
            double complex amp = -I * G / omega, k = s.res->k0, afwd = 0;
            double sum = 0;
            for (size_t it = 0; it <= nth; it++) {
                double th = it < nth ? 2 * PI * it / nth : beta;
                double complex A = 0;
                for (size_t j = 0; j < p->n_bodies; j++) {
                    double complex e = cexp(-I * k * (p->bodies[j].x * cos(th) + p->bodies[j].y * sin(th)));
                    for (long n = -Ml; n <= Ml; n++) {
                        size_t u = p->unk_off[j] + (size_t)(n + Ml);
                        double complex bn = s.work->sol[0 * p->n_unknowns + u] / syi_array_scale(p, s.work, p->bodies[j].type, 0, n);
                        A += e * bn / amp * cpow(-I, (double)n) * cexp(I * (double)n * th);
                    }
                }
                if (it < nth)
                    sum += creal(A * conj(A)) * 2 * PI / nth;
                else
                    afwd = A;
            }
            sy_check_close(sum, -2 * PI * creal(afwd), 1e-8, 0, "fixed array: int |A|^2 = -2 pi Re A(beta)");
        }
        unmake(&s);
    }
    /* --- Convergence, 3 bodies (closest gap 5.4 m). Angular order at Q = 3: the change
     * between successive M shrinks geometrically (Graf series ~ (a / (L - a'))^M), below
     * 1e-8 of the largest B by M = 12. Depth modes at M = 8: the change shrinks
     * algebraically (the float's sharp bottom corner; measured ~Q^-2.5), below 1e-3 by
     * Q = 8 -- so the depth-mode count, not the angular order, limits accuracy here. */
    {
        const sy_array_body b[3] = {{0, 0, 0}, {13.2, -4.5, 1}, {3.1, 12.7, 2}};
        const size_t Ms[6] = {4, 8, 12, 8, 8, 8}, Qs[6] = {3, 3, 3, 2, 4, 8};
        const double last_bound[2] = {1e-8, 1e-3};
        double prevB[128] = {0}, prevchange = INFINITY;
        for (size_t c = 0; c < 6; c++) {
            setup s = {0};
            if (c == 3)
                prevchange = INFINITY;
            if (!sy_check_ok(make(&s, types, 3, b, 3, Ms[c], Qs[c], heads, 1, &err), &err, "plan M %zu Q %zu",
                             Ms[c], Qs[c]) ||
                !sy_check_ok(sy_array_solve(s.plan, omega, s.work, s.res, &err), &err, "solve M %zu Q %zu",
                             Ms[c], Qs[c])) {
                unmake(&s);
                continue;
            }
            size_t nd = s.res->n_dof;
            double bmax = maxabs(s.res->damping, nd * nd);
            if (c != 0 && c != 3) {
                double change = 0;
                for (size_t k = 0; k < nd * nd; k++)
                    change = fmax(change, fabs(s.res->damping[k] - prevB[k]) / bmax);
                sy_check_true(change < prevchange, "M %zu Q %zu: change of B %.3g < previous %.3g", Ms[c], Qs[c],
                              change, prevchange);
                if (c == 2 || c == 5)
                    sy_check_true(change < last_bound[c == 5], "M %zu Q %zu: change %.3g < %.0e", Ms[c], Qs[c],
                                  change, last_bound[c == 5]);
                prevchange = change;
            }
            for (size_t k = 0; k < nd * nd; k++)
                prevB[k] = s.res->damping[k];
            unmake(&s);
        }
    }
    /* --- Per-mode angular truncation. Five unequal floats (irregular layout, gaps 5-15 m)
     * in 20 m of water, so centre distances (13-22 m) are comparable to the depth and
     * the first evanescent modes couple every pair strongly; tolerance 1e-4 (the demo's),
     * M = 8, Q = 5. The reduced plan must really reduce (fewer than 80% of the unknowns
     * of 2M+1 orders per kept mode, so the check below compares different systems), and
     * A, B, X must move by at most 10 tol relative to their largest entry against the
     * full truncation: every omitted coupling coefficient is < tol (plan.c), a result
     * collects omitted couplings from up to 4 neighbours with amplitudes <= 1 (scaled
     * basis) and a geometric tail over the orders (factor < 2 once below tol) -- about
     * 8 tol at worst; the measured change is printed. Reciprocity (1e-8) and Haskind
     * (1e-6) must still hold: the reduction removes unknowns (a row and its column
     * together), it does not perturb the symmetric structure. */
    {
        const sy_array_type tr[3] = {{{SY_BODY_FLOAT, 4.0, 3.0, 0.0}, SY_ARRAY_HEAVE | SY_ARRAY_SURGE | SY_ARRAY_PITCH},
                                     {{SY_BODY_FLOAT, 2.5, 2.0, 0.0}, SY_ARRAY_HEAVE},
                                     {{SY_BODY_FLOAT, 3.2, 4.5, -0.5}, SY_ARRAY_ALL_MODES}};
        const sy_array_body b[5] = {{0, 0, 0}, {15.7, 2.9, 1}, {4.3, 17.2, 2}, {21.4, 18.8, 0}, {-13.1, 9.6, 1}};
        const double tol = 1e-4, om[3] = {0.7, 1.3, 2.2};
        sy_array_settings set = {20.0, RHO, G, tol, 8, 5, 0.0};
        setup red = {0}, full = {0};
        int rc = setup_open(&red, &set, tr, 3, b, 5, heads, NHEAD, &err);
        if (rc == SY_OK)
            rc = syi_array_plan_create(&full.plan, &set, tr, 3, b, 5, heads, NHEAD, 1, &err);
        if (rc == SY_OK)
            rc = sy_array_work_alloc(&full.work, full.plan, &err);
        if (rc == SY_OK)
            rc = sy_array_hydro_alloc(&full.res, full.plan, &err);
        if (sy_check_ok(rc, &err, "per-mode truncation plans")) {
            size_t nr = sy_array_plan_n_unknowns(red.plan), nf = sy_array_plan_n_unknowns(full.plan);
            char text[256];
            sy_array_plan_truncation(red.plan, text, sizeof text);
            sy_check_true(nf == red.plan->n_full && nr < 0.8 * nf, "per-mode orders: %zu of %zu unknowns (%s)", nr,
                          nf, text);
            sy_check_true(sy_array_plan_partial_waves(red.plan, 0, 0) == 17 &&
                              sy_array_plan_partial_waves(red.plan, 0, 1) < 17 &&
                              sy_array_plan_partial_waves(red.plan, 0, 1) >= sy_array_plan_partial_waves(red.plan, 0, 4),
                          "body 0: 17 propagating partial waves, fewer evanescent (%zu, ..., %zu)",
                          sy_array_plan_partial_waves(red.plan, 0, 1), sy_array_plan_partial_waves(red.plan, 0, 4));
            /* the public unknown map follows the per-mode layout */
            size_t bad_map = 0;
            for (size_t i = 0; i < 5; i++)
                for (size_t q = 0; q < red.plan->nq[i]; q++) {
                    const long Mq = (long)syi_array_order(red.plan, i, q);
                    for (long n = -Mq; n <= Mq; n++) {
                        size_t bi, qi;
                        long ni;
                        sy_array_plan_unknown(red.plan, syi_array_unknown(red.plan, i, q, n), &bi, &qi, &ni);
                        bad_map += bi != i || qi != q || ni != n;
                    }
                }
            sy_check_true(bad_map == 0, "sy_array_plan_unknown inverts the per-mode index map (%zu wrong)", bad_map);
            for (int c = 0; c < 3; c++) {
                rc = sy_array_solve(red.plan, om[c], red.work, red.res, &err);
                if (rc == SY_OK)
                    rc = sy_array_solve(full.plan, om[c], full.work, full.res, &err);
                if (!sy_check_ok(rc, &err, "per-mode truncation solves at omega %g", om[c]))
                    continue;
                const size_t nd = red.res->n_dof;
                double da = 0, db = 0;
                for (size_t k = 0; k < nd * nd; k++) {
                    da = fmax(da, fabs(red.res->added_mass[k] - full.res->added_mass[k]));
                    db = fmax(db, fabs(red.res->damping[k] - full.res->damping[k]));
                }
                da /= maxabs(full.res->added_mass, nd * nd);
                db /= maxabs(full.res->damping, nd * nd);
                double dx = cchange(red.res->excitation, full.res->excitation, NHEAD * nd);
                sy_check_true(da <= 10 * tol && db <= 10 * tol && dx <= 10 * tol,
                              "omega %g: per-mode orders change A by %.2g, B by %.2g, X by %.2g (<= 10 tol)", om[c],
                              da, db, dx);
                sy_check_true(da > 0 || db > 0, "omega %g: the two truncations differ", om[c]);
                identities(&red, "per-mode orders");
            }
        }
        unmake(&red);
        unmake(&full);
    }
    return sy_check_summary();
}
