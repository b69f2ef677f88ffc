/* The main job's files (outputs.h): power_matrix.nc, power_matrix.csv, devices.csv,
 * summary.json. Each is written to a temporary name inside the staging folder and
 * renamed, so even the staging folder never holds a half-written file. SI in NetCDF;
 * kW, MWh/yr in CSV and JSON (the edges, conventions.md). */
#include "core/core_impl.h"
#include "io_impl.h"
#include "swellyield/outputs.h"

#include <errno.h>
#include <jansson.h>
#include <math.h>
#include <netcdf.h>
#include <stdio.h>
#include <string.h>

static int write_nc(const char *path, const sy_model *m, const sy_climate_table *cl, const sy_yield_result *r,
                    sy_error *err)
{
    const sy_climate_bins *b = sy_climate_table_bins(cl);
    size_t nhs = b->n_hs, np = b->n_period, ndir = b->n_dir > 0 ? b->n_dir : 1, nt = r->n_bins, nd = r->n_devices;
    size_t ns = SY_YIELD_N_STRATEGIES;
    int nc = -1, rc = SY_OK;
    double *buf = malloc((ns * nt * (nd > 1 ? nd : 1) + 2 * (nhs + np + 2)) * sizeof *buf);
    if (buf == NULL)
        return sy_error_set(err, SY_ENOMEM, "%s: write buffer", path);
    SYI_NC(nc_create(path, NC_NETCDF4 | NC_CLOBBER, &nc), "create");
    int d_st, d_dev, d_hs, d_p, d_dir, d_b2, d_name, d_om, d_hd;
    SYI_NC(nc_def_dim(nc, "strategy", ns, &d_st), "dimension strategy");
    SYI_NC(nc_def_dim(nc, "device", nd, &d_dev), "dimension device");
    SYI_NC(nc_def_dim(nc, "hs", nhs, &d_hs), "dimension hs");
    SYI_NC(nc_def_dim(nc, "period", np, &d_p), "dimension period");
    SYI_NC(nc_def_dim(nc, "direction", ndir, &d_dir), "dimension direction");
    SYI_NC(nc_def_dim(nc, "bounds2", 2, &d_b2), "dimension bounds2");
    SYI_NC(nc_def_dim(nc, "name_len", 64, &d_name), "dimension name_len");
    SYI_NC(nc_def_dim(nc, "omega", r->n_omega, &d_om), "dimension omega");
    SYI_NC(nc_def_dim(nc, "heading", r->n_headings, &d_hd), "dimension heading");
    int v_om, v_hd, v_qo, s3[3] = {d_st, d_om, d_hd};
    SYI_NC(syi_nc_def_double(nc, "omega", 1, &d_om, "rad s-1", "wave angular frequency", "angular_frequency", &v_om), "omega");
    SYI_NC(syi_nc_def_double(nc, "heading", 1, &d_hd, "degree", "wave heading: direction of travel, counter-clockwise from the array +x axis", NULL, &v_hd), "heading");
    SYI_NC(syi_nc_def_double(nc, "q_factor_regular", 3, s3, "1", "regular-wave q-factor (sum of device powers / sum of isolated powers) per frequency and heading; not defined for per_sea_state", NULL, &v_qo), "q_factor_regular");
    int v_hs, v_hsb, v_p, v_pb, v_dir, v_occ, v_res, v_pa, v_pi, v_q, v_bd, v_pd, v_sk, v_sn, v_dn, v_e, v_ea;
    int two[2] = {d_hs, d_b2};
    SYI_NC(syi_nc_def_double(nc, "hs", 1, &d_hs, "m", "significant wave height (Hm0) at bin centre", "sea_surface_wave_significant_height", &v_hs), "hs");
    SYI_NC(syi_nc_put_text(nc, v_hs, "bounds", "hs_bounds"), "hs");
    SYI_NC(syi_nc_def_double(nc, "hs_bounds", 2, two, "m", "Hs bin edges", NULL, &v_hsb), "hs_bounds");
    two[0] = d_p;
    const char *pstd = b->period == SY_CLIMATE_TE
                           ? "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment"
                           : "sea_surface_wave_period_at_variance_spectral_density_maximum";
    SYI_NC(syi_nc_def_double(nc, "period", 1, &d_p, "s", b->period == SY_CLIMATE_TE ? "energy period Te at bin centre" : "peak period Tp at bin centre", pstd, &v_p), "period");
    SYI_NC(syi_nc_put_text(nc, v_p, "bounds", "period_bounds"), "period");
    SYI_NC(syi_nc_def_double(nc, "period_bounds", 2, two, "s", "period bin edges", NULL, &v_pb), "period_bounds");
    SYI_NC(syi_nc_def_double(nc, "direction", 1, &d_dir, "degree", b->n_dir ? "wave from-direction at bin centre (nautical)" : "omnidirectional table: not used", b->n_dir ? "sea_surface_wave_from_direction" : NULL, &v_dir), "direction");
    int bins3[3] = {d_hs, d_p, d_dir};
    SYI_NC(syi_nc_def_double(nc, "occurrence", 3, bins3, "h", "mean annual hours in the bin (per year)", NULL, &v_occ), "occurrence");
    SYI_NC(syi_nc_def_double(nc, "resource", 3, bins3, "W m-1", "wave power per metre of crest at the site depth", NULL, &v_res), "resource");
    int s4[4] = {d_st, d_hs, d_p, d_dir}, s5[5] = {d_st, d_dev, d_hs, d_p, d_dir};
    SYI_NC(syi_nc_def_double(nc, "power_array", 4, s4, "W", "mean electrical power of the array", NULL, &v_pa), "power_array");
    SYI_NC(syi_nc_def_double(nc, "power_isolated", 4, s4, "W", "sum over devices of the isolated device's mean electrical power", NULL, &v_pi), "power_isolated");
    SYI_NC(syi_nc_def_double(nc, "q_factor", 4, s4, "1", "array power / sum of isolated powers (interaction factor)", NULL, &v_q), "q_factor");
    SYI_NC(syi_nc_def_double(nc, "pto_damping", 4, s4, "N s m-1", "shared PTO damping chosen (per-sea-state and site-optimal strategies)", NULL, &v_bd), "pto_damping");
    SYI_NC(syi_nc_def_double(nc, "power_device", 5, s5, "W", "mean electrical power of each device", NULL, &v_pd), "power_device");
    SYI_NC(syi_nc_def_double(nc, "stroke_significant", 5, s5, "m", "significant PTO stroke 4 sqrt(m0) of the PTO motion", NULL, &v_sk), "stroke_significant");
    int st2[2] = {d_st, d_name}, dv2[2] = {d_dev, d_name};
    SYI_NC(nc_def_var(nc, "strategy_name", NC_CHAR, 2, st2, &v_sn), "strategy_name");
    SYI_NC(nc_def_var(nc, "device_name", NC_CHAR, 2, dv2, &v_dn), "device_name");
    int sd[2] = {d_st, d_dev};
    SYI_NC(syi_nc_def_double(nc, "annual_energy_device", 2, sd, "W h", "annual energy of each device per year", NULL, &v_e), "annual_energy_device");
    SYI_NC(syi_nc_def_double(nc, "annual_energy_array", 1, &d_st, "W h", "annual energy of the array per year", NULL, &v_ea), "annual_energy_array");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "Conventions", "CF-1.10"), "attributes");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "title", "swellyield power matrix and annual energy of a wave-energy array (estimate)"), "attributes");
    char txt[2 * SY_MODEL_PATH_MAX + 512];
    snprintf(txt, sizeof txt, "project %s; climate %s; hours per year %.0f; spectrum %s gamma %g, cos-2s s = %g; efficiency %g, rated power %g W, max stroke %g m",
             m->path, m->climate, SY_CLIMATE_HOURS_PER_YEAR, m->spectrum == SY_SPECTRUM_JONSWAP ? "JONSWAP" : "Bretschneider",
             m->spectrum == SY_SPECTRUM_JONSWAP ? m->gamma : 1.0, m->spreading, m->efficiency, m->rated_power, m->max_stroke);
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "source", txt), "attributes");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "comment", sy_outputs_cautions()), "attributes");
    snprintf(txt, sizeof txt, "swellyield %s (%s)", sy_version(), sy_dependency_versions());
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "software", txt), "attributes");
    SYI_NC(nc_enddef(nc), "enddef");
    SYI_NC(nc_put_var_double(nc, v_om, r->omega), "omega");
    {
        double deg[SY_MODEL_MAX_HEADINGS];
        for (size_t i = 0; i < r->n_headings && i < SY_MODEL_MAX_HEADINGS; i++)
            deg[i] = r->headings[i] * 180.0 / M_PI;
        SYI_NC(nc_put_var_double(nc, v_hd, deg), "heading");
    }
    for (size_t s = 0; s < ns; s++) {
        size_t start[3] = {s, 0, 0}, count[3] = {1, r->n_omega, r->n_headings};
        SYI_NC(nc_put_vara_double(nc, v_qo, start, count, r->s[s].q_omega), "q_factor_regular");
    }
    for (size_t i = 0; i < nhs; i++) {
        buf[i] = 0.5 * (b->hs_edges[i] + b->hs_edges[i + 1]);
        buf[nhs + 2 * i] = b->hs_edges[i], buf[nhs + 2 * i + 1] = b->hs_edges[i + 1];
    }
    SYI_NC(nc_put_var_double(nc, v_hs, buf), "hs");
    SYI_NC(nc_put_var_double(nc, v_hsb, buf + nhs), "hs_bounds");
    for (size_t i = 0; i < np; i++) {
        buf[i] = 0.5 * (b->period_edges[i] + b->period_edges[i + 1]);
        buf[np + 2 * i] = b->period_edges[i], buf[np + 2 * i + 1] = b->period_edges[i + 1];
    }
    SYI_NC(nc_put_var_double(nc, v_p, buf), "period");
    SYI_NC(nc_put_var_double(nc, v_pb, buf + np), "period_bounds");
    for (size_t i = 0; i < ndir; i++)
        buf[i] = b->n_dir ? b->dir_centres[i] : NAN;
    SYI_NC(nc_put_var_double(nc, v_dir, buf), "direction");
    SYI_NC(nc_put_var_double(nc, v_occ, r->hours), "occurrence");
    SYI_NC(nc_put_var_double(nc, v_res, r->resource), "resource");
    for (size_t s = 0; s < ns; s++)
        memcpy(buf + s * nt, r->s[s].power_array, nt * sizeof *buf);
    SYI_NC(nc_put_var_double(nc, v_pa, buf), "power_array");
    for (size_t s = 0; s < ns; s++)
        memcpy(buf + s * nt, r->s[s].power_iso, nt * sizeof *buf);
    SYI_NC(nc_put_var_double(nc, v_pi, buf), "power_isolated");
    for (size_t s = 0; s < ns; s++)
        for (size_t t = 0; t < nt; t++)
            buf[s * nt + t] = r->s[s].power_iso[t] > 0 ? r->s[s].power_array[t] / r->s[s].power_iso[t] : NAN;
    SYI_NC(nc_put_var_double(nc, v_q, buf), "q_factor");
    for (size_t s = 0; s < ns; s++)
        memcpy(buf + s * nt, r->s[s].damping, nt * sizeof *buf);
    SYI_NC(nc_put_var_double(nc, v_bd, buf), "pto_damping");
    /* [strategy][device][bin] from the results' [bin][device]. */
    for (int pass = 0; pass < 2; pass++) {
        for (size_t s = 0; s < ns; s++)
            for (size_t q = 0; q < nd; q++)
                for (size_t t = 0; t < nt; t++)
                    buf[(s * nd + q) * nt + t] = pass == 0 ? r->s[s].power[t * nd + q] : r->s[s].stroke[t * nd + q];
        if (pass == 0)
            SYI_NC(nc_put_var_double(nc, v_pd, buf), "power_device");
        else
            SYI_NC(nc_put_var_double(nc, v_sk, buf), "stroke_significant");
    }
    char names[SY_YIELD_N_STRATEGIES][64];
    memset(names, 0, sizeof names);
    for (size_t s = 0; s < ns; s++)
        snprintf(names[s], 64, "%s", sy_yield_strategy_name((int)s));
    SYI_NC(nc_put_var_text(nc, v_sn, &names[0][0]), "strategy_name");
    for (size_t q = 0; q < nd; q++) {
        char nm[64] = {0};
        snprintf(nm, sizeof nm, "%s", m->devices[q].name);
        size_t start[2] = {q, 0}, count[2] = {1, 64};
        SYI_NC(nc_put_vara_text(nc, v_dn, start, count, nm), "device_name");
    }
    for (size_t s = 0; s < ns; s++) {
        memcpy(buf + s * nd, r->s[s].energy, nd * sizeof *buf);
        buf[ns * nd + s] = r->s[s].energy_array;
    }
    SYI_NC(nc_put_var_double(nc, v_e, buf), "annual_energy_device");
    SYI_NC(nc_put_var_double(nc, v_ea, buf + ns * nd), "annual_energy_array");
    int closing = nc;
    nc = -1;
    SYI_NC(nc_close(closing), "close");
    free(buf);
    return SY_OK;
fail:
    if (nc >= 0)
        nc_close(nc);
    free(buf);
    return rc;
}

int sy_outputs_write_file(const char *path, int (*fill)(FILE *f, const void *ctx), const void *ctx, sy_error *err)
{
    char tmp[SY_OUTPUTS_PATH_MAX + 64];
    int rc = syi_atomic_tmpname(path, tmp, sizeof tmp, err);
    if (rc != SY_OK)
        return rc;
    FILE *f = fopen(tmp, "w");
    if (f == NULL)
        return sy_error_set(err, SY_EIO, "%s: cannot create: %s", tmp, strerror(errno));
    int ok = fill(f, ctx) == 0;
    ok = (fclose(f) == 0) && ok;
    if (!ok) {
        syi_atomic_abort(tmp);
        return sy_error_set(err, SY_EIO, "%s: write failed", path);
    }
    return syi_atomic_commit(tmp, path, err);
}

typedef struct files_ctx {
    const sy_model *m;
    const sy_climate_table *cl;
    const sy_yield_result *r;
    const sy_flagged_band *bands;
    size_t n_bands;
    const char *note;
} files_ctx;

static int fill_matrix_csv(FILE *f, const void *p)
{
    const files_ctx *c = p;
    const sy_climate_bins *b = sy_climate_table_bins(c->cl);
    const char *per = b->period == SY_CLIMATE_TE ? "te" : "tp";
    fprintf(f, "# swellyield power matrix (estimate; linear potential flow; see summary.json cautions)\n");
    fprintf(f, "strategy,hs_min_m,hs_max_m,%s_min_s,%s_max_s,dir_from_deg,hours_per_year,resource_kw_per_m,"
               "array_power_kw,isolated_power_kw,q_factor,pto_damping_n_s_per_m,stroke_flag\n", per, per);
    size_t ndir = b->n_dir > 0 ? b->n_dir : 1;
    for (int s = 0; s < SY_YIELD_N_STRATEGIES; s++)
        for (size_t i = 0; i < b->n_hs; i++)
            for (size_t j = 0; j < b->n_period; j++)
                for (size_t d = 0; d < ndir; d++) {
                    size_t t = sy_climate_table_index(c->cl, i, j, d);
                    if (!(c->r->hours[t] > 0))
                        continue;
                    const sy_yield_strategy *y = &c->r->s[s];
                    fprintf(f, "%s,%g,%g,%g,%g,", sy_yield_strategy_name(s), b->hs_edges[i], b->hs_edges[i + 1],
                            b->period_edges[j], b->period_edges[j + 1]);
                    if (b->n_dir)
                        fprintf(f, "%g", b->dir_centres[d]);
                    fprintf(f, ",%.6g,%.6g,%.6g,%.6g,%.6g,", c->r->hours[t], c->r->resource[t] / 1e3,
                            y->power_array[t] / 1e3, y->power_iso[t] / 1e3,
                            y->power_iso[t] > 0 ? y->power_array[t] / y->power_iso[t] : NAN);
                    if (isfinite(y->damping[t]))
                        fprintf(f, "%.6g", y->damping[t]);
                    fprintf(f, ",%s\n", y->stroke_limited[t] == 2 ? "exceeded" : y->stroke_limited[t] ? "limited" : "");
                }
    return ferror(f);
}

static int fill_devices_csv(FILE *f, const void *p)
{
    const files_ctx *c = p;
    fprintf(f, "# swellyield per-device annual energy (estimate); MWh per year with %.0f h/yr\n", SY_CLIMATE_HOURS_PER_YEAR);
    fprintf(f, "name,x_m,y_m");
    for (int s = 0; s < SY_TUNING_REACTIVE_BOUND; s++)
        fprintf(f, ",%s_energy_mwh,%s_mean_power_kw,%s_q_factor", sy_yield_strategy_name(s), sy_yield_strategy_name(s),
                sy_yield_strategy_name(s));
    fprintf(f, "\n");
    for (size_t q = 0; q < c->r->n_devices; q++) {
        const sy_model_device *d = &c->m->devices[q];
        fprintf(f, "%s,%g,%g", d->name, d->x, d->y);
        for (int s = 0; s < SY_TUNING_REACTIVE_BOUND; s++) {
            const sy_yield_strategy *y = &c->r->s[s];
            fprintf(f, ",%.6g,%.6g,%.6g", y->energy[q] / 1e6, y->energy[q] / SY_CLIMATE_HOURS_PER_YEAR / 1e3,
                    y->energy[q] / y->energy_iso_dev[q]);
        }
        fprintf(f, "\n");
    }
    return ferror(f);
}

/* JSON numbers: NaN and infinities become null. */
static json_t *num(double x) { return isfinite(x) ? json_real(x) : json_null(); }

static json_t *strategy_json(const sy_yield_result *r, int s, const sy_model *m)
{
    const sy_yield_strategy *y = &r->s[s];
    json_t *o = json_object();
    json_object_set_new(o, "annual_energy_mwh", num(y->energy_array / 1e6));
    json_object_set_new(o, "q_factor", num(y->q_factor));
    json_object_set_new(o, "mean_power_kw", num(y->mean_power / 1e3));
    json_object_set_new(o, "capacity_factor", num(y->capacity_factor));
    json_object_set_new(o, "isolated_annual_energy_mwh", num(y->energy_iso / 1e6));
    json_object_set_new(o, "bins_stroke_exceeded", json_integer((json_int_t)y->n_stroke_exceeded));
    if (s == SY_TUNING_SITE_OPTIMAL)
        json_object_set_new(o, "pto_damping_n_s_per_m", num(y->site_damping));
    json_t *devs = json_array();
    for (size_t q = 0; s != SY_TUNING_REACTIVE_BOUND && q < r->n_devices; q++) {
        json_t *d = json_object();
        json_object_set_new(d, "name", json_string(m->devices[q].name));
        json_object_set_new(d, "annual_energy_mwh", num(y->energy[q] / 1e6));
        json_object_set_new(d, "mean_power_kw", num(y->energy[q] / SY_CLIMATE_HOURS_PER_YEAR / 1e3));
        json_object_set_new(d, "q_factor", num(y->energy[q] / y->energy_iso_dev[q]));
        json_array_append_new(devs, d);
    }
    json_object_set_new(o, "devices", devs);
    return o;
}

static int fill_summary(FILE *f, const void *p)
{
    const files_ctx *c = p;
    const sy_yield_result *r = c->r;
    int head = (int)c->m->tuning;
    json_t *root = strategy_json(r, head, c->m); /* headline figures at the top level */
    json_object_set_new(root, "strategy", json_string(sy_yield_strategy_name(head)));
    json_t *all = json_object();
    for (int s = 0; s < SY_YIELD_N_STRATEGIES; s++)
        json_object_set_new(all, sy_yield_strategy_name(s), strategy_json(r, s, c->m));
    json_object_set_new(root, "strategies", all);
    json_t *res = json_object();
    json_object_set_new(res, "mean_wave_power_kw_per_m", num(r->mean_resource / 1e3));
    json_object_set_new(res, "hours_per_year_covered", num(r->hours_covered));
    json_object_set_new(res, "hours_per_year_convention", num(SY_CLIMATE_HOURS_PER_YEAR));
    json_object_set_new(res, "max_spectral_energy_outside_frequencies", num(r->max_outside));
    json_object_set_new(res, "max_spreading_outside_headings", num(r->max_dir_outside));
    json_object_set_new(root, "resource", res);
    json_t *fb = json_array();
    const sy_climate_bins *bins = sy_climate_table_bins(c->cl);
    size_t ndir = bins->n_dir > 0 ? bins->n_dir : 1;
    for (size_t j = 0; j < c->n_bands; j++) {
        const sy_flagged_band *b = &c->bands[j];
        json_t *o = json_object();
        static const char *const kinds[] = {"motion", "motion_no_pto", "scattering"};
        json_object_set_new(o, "omega_min", num(b->omega_min));
        json_object_set_new(o, "omega_max", num(b->omega_max));
        json_object_set_new(o, "pole_re", num(creal(b->pole)));
        json_object_set_new(o, "pole_im", num(cimag(b->pole)));
        json_object_set_new(o, "Q", num(b->q));
        json_object_set_new(o, "kind", json_string(b->kind >= 0 && b->kind < 3 ? kinds[b->kind] : "?"));
        json_object_set_new(o, "energy_share", num(r->s[head].energy_band[j] / r->s[head].energy_array));
        json_t *ss = json_array();
        for (size_t i = 0; i < bins->n_hs; i++)
            for (size_t p2 = 0; p2 < bins->n_period; p2++)
                for (size_t d = 0; d < ndir; d++) {
                    size_t t = sy_climate_table_index(c->cl, i, p2, d);
                    double share = r->band_fraction[t * r->n_bands + j];
                    if (!(r->hours[t] > 0) || share < SY_OUTPUTS_BAND_BIN_SHARE)
                        continue;
                    json_t *e = json_object();
                    json_object_set_new(e, "hs_min", num(bins->hs_edges[i]));
                    json_object_set_new(e, "hs_max", num(bins->hs_edges[i + 1]));
                    json_object_set_new(e, "period_min", num(bins->period_edges[p2]));
                    json_object_set_new(e, "period_max", num(bins->period_edges[p2 + 1]));
                    if (bins->n_dir)
                        json_object_set_new(e, "dir_from_deg", num(bins->dir_centres[d]));
                    json_object_set_new(e, "spectral_share", num(share));
                    json_array_append_new(ss, e);
                }
        json_object_set_new(o, "sea_states", ss);
        json_array_append_new(fb, o);
    }
    json_object_set_new(root, "flagged_bands", fb);
    if (c->note != NULL)
        json_object_set_new(root, "resonance_search", json_string(c->note));
    json_object_set_new(root, "project", json_string(c->m->path));
    json_object_set_new(root, "climate", json_string(c->m->climate));
    json_object_set_new(root, "software", json_string(sy_version()));
    json_t *cautions = json_array();
    const char *t = sy_outputs_cautions();
    while (*t) {
        const char *nl = strchr(t, '\n');
        size_t len = nl ? (size_t)(nl - t) : strlen(t);
        json_array_append_new(cautions, json_stringn(t, len));
        t += len + (nl != NULL);
    }
    json_object_set_new(root, "cautions", cautions);
    int rc = json_dumpf(root, f, JSON_INDENT(2) | JSON_ENSURE_ASCII);
    fputc('\n', f);
    json_decref(root);
    return rc != 0 || ferror(f);
}

int sy_outputs_write_yield(const sy_outputs_stage *st, const sy_model *m, const sy_climate_table *cl,
                           const sy_yield_result *r, const sy_flagged_band *bands, size_t n_bands, const char *note,
                           sy_error *err)
{
    files_ctx c = {m, cl, r, bands, n_bands, note};
    char path[SY_OUTPUTS_PATH_MAX + 64], tmp[SY_OUTPUTS_PATH_MAX + 128];
    int rc = sy_outputs_path(st, "power_matrix.nc", path, sizeof path, err);
    if (rc == SY_OK)
        rc = syi_atomic_tmpname(path, tmp, sizeof tmp, err);
    if (rc == SY_OK) {
        rc = write_nc(tmp, m, cl, r, err);
        rc = rc == SY_OK ? syi_atomic_commit(tmp, path, err) : (syi_atomic_abort(tmp), rc);
    }
    if (rc == SY_OK && (rc = sy_outputs_path(st, "power_matrix.csv", path, sizeof path, err)) == SY_OK)
        rc = sy_outputs_write_file(path, fill_matrix_csv, &c, err);
    if (rc == SY_OK && (rc = sy_outputs_path(st, "devices.csv", path, sizeof path, err)) == SY_OK)
        rc = sy_outputs_write_file(path, fill_devices_csv, &c, err);
    if (rc == SY_OK && (rc = sy_outputs_path(st, "summary.json", path, sizeof path, err)) == SY_OK)
        rc = sy_outputs_write_file(path, fill_summary, &c, err);
    return rc;
}
