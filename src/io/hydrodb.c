/* Hydrodynamic database storage and its NetCDF-4 file (layout in hydrodb.h). */
#include "core/core_impl.h"
#include "io_impl.h"
#include "swellyield/hydrodb.h"

#include <math.h>
#include <netcdf.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

int sy_hydro_db_alloc(sy_hydro_db **out, size_t n_omega, size_t n_headings, size_t n_bodies,
                      size_t n_dof, sy_error *err)
{
    if (n_omega == 0 || n_headings == 0 || n_bodies == 0 || n_dof == 0)
        return sy_error_set(err, SY_EINVAL, "hydro database needs >= 1 frequency, heading, body, dof");
    sy_hydro_db *db = calloc(1, sizeof *db);
    if (db != NULL) {
        db->n_omega = n_omega, db->n_headings = n_headings, db->n_bodies = n_bodies, db->n_dof = n_dof;
        db->omega = calloc(n_omega, sizeof *db->omega);
        db->headings = calloc(n_headings, sizeof *db->headings);
        db->dof_body = calloc(n_dof, sizeof *db->dof_body);
        db->dof_mode = calloc(n_dof, sizeof *db->dof_mode);
        db->body_x = calloc(n_bodies, sizeof *db->body_x);
        db->body_y = calloc(n_bodies, sizeof *db->body_y);
        db->body_radius = calloc(n_bodies, sizeof *db->body_radius);
        db->body_draft = calloc(n_bodies, sizeof *db->body_draft);
        db->body_name = calloc(n_bodies, sizeof *db->body_name);
        db->added_mass = calloc(n_omega * n_dof * n_dof, sizeof *db->added_mass);
        db->damping = calloc(n_omega * n_dof * n_dof, sizeof *db->damping);
        db->excitation = calloc(n_omega * n_headings * n_dof, sizeof *db->excitation);
        db->convergence = calloc(n_omega, sizeof *db->convergence);
    }
    if (db == NULL || !db->omega || !db->headings || !db->dof_body || !db->dof_mode || !db->body_x ||
        !db->body_y || !db->body_radius || !db->body_draft || !db->body_name || !db->added_mass ||
        !db->damping || !db->excitation || !db->convergence) {
        sy_hydro_db_free(db);
        return sy_error_set(err, SY_ENOMEM, "hydro database %zu x %zu x %zu", n_omega, n_headings, n_dof);
    }
    *out = db;
    return SY_OK;
}

void sy_hydro_db_free(sy_hydro_db *db)
{
    if (db == NULL)
        return;
    free(db->omega);
    free(db->headings);
    free(db->dof_body);
    free(db->dof_mode);
    free(db->body_x);
    free(db->body_y);
    free(db->body_radius);
    free(db->body_draft);
    free(db->body_name);
    free(db->added_mass);
    free(db->damping);
    free(db->excitation);
    free(db->convergence);
    free(db);
}

int sy_hydro_db_write(const sy_hydro_db *db, const char *path, sy_error *err)
{
    char tmp[SY_ERROR_MSG_MAX];
    int rc = syi_atomic_tmpname(path, tmp, sizeof tmp, err);
    if (rc != SY_OK)
        return rc;
    size_t no = db->n_omega, nh = db->n_headings, nd = db->n_dof, nb = db->n_bodies;
    double *buf = malloc((no * nh * nd > nb ? no * nh * nd : nb) * sizeof *buf);
    double *deg = malloc(nh * sizeof *deg);
    int nc = -1;
    if (buf == NULL || deg == NULL) {
        free(buf);
        free(deg);
        return sy_error_set(err, SY_ENOMEM, "%s: write buffer", path);
    }
    SYI_NC(nc_create(tmp, NC_NETCDF4 | NC_CLOBBER, &nc), "create");
    int d_om, d_hd, d_dof, d_dof2, d_body, d_name;
    SYI_NC(nc_def_dim(nc, "omega", no, &d_om), "dimension omega");
    SYI_NC(nc_def_dim(nc, "heading", nh, &d_hd), "dimension heading");
    SYI_NC(nc_def_dim(nc, "dof", nd, &d_dof), "dimension dof");
    SYI_NC(nc_def_dim(nc, "dof2", nd, &d_dof2), "dimension dof2");
    SYI_NC(nc_def_dim(nc, "body", nb, &d_body), "dimension body");
    SYI_NC(nc_def_dim(nc, "name_len", SY_HYDRODB_NAME_LEN, &d_name), "dimension name_len");
    int v_om, v_hd, v_am, v_bd, v_xr, v_xi, v_cv, v_db, v_dm, v_bx, v_by, v_br, v_bdr, v_bn;
    int dims3[3];
    SYI_NC(syi_nc_def_double(nc, "omega", 1, &d_om, "rad s-1", "wave angular frequency", NULL, &v_om), "omega");
    SYI_NC(syi_nc_put_text(nc, v_om, "standard_name", "angular_frequency"), "omega");
    SYI_NC(syi_nc_def_double(nc, "heading", 1, &d_hd, "degree", "wave heading: direction of travel, counter-clockwise from the array +x axis", NULL, &v_hd), "heading");
    dims3[0] = d_om, dims3[1] = d_dof, dims3[2] = d_dof2;
    SYI_NC(syi_nc_def_double(nc, "added_mass", 3, dims3, NULL, "added mass (kg for translations, kg m coupled, kg m2 for rotations)", NULL, &v_am), "added_mass");
    SYI_NC(syi_nc_def_double(nc, "radiation_damping", 3, dims3, NULL, "radiation damping (kg s-1 for translations, kg m s-1 coupled, kg m2 s-1 for rotations)", NULL, &v_bd), "radiation_damping");
    dims3[0] = d_om, dims3[1] = d_hd, dims3[2] = d_dof;
    SYI_NC(syi_nc_def_double(nc, "excitation_re", 3, dims3, NULL, "real part of the excitation force (N m-1) or moment (N) per unit wave amplitude", NULL, &v_xr), "excitation_re");
    SYI_NC(syi_nc_def_double(nc, "excitation_im", 3, dims3, NULL, "imaginary part of the excitation force (N m-1) or moment (N) per unit wave amplitude", NULL, &v_xi), "excitation_im");
    SYI_NC(syi_nc_def_double(nc, "convergence", 1, &d_om, "1", "estimated relative truncation error", NULL, &v_cv), "convergence");
    SYI_NC(nc_def_var(nc, "dof_body", NC_INT, 1, &d_dof, &v_db), "dof_body");
    SYI_NC(syi_nc_put_text(nc, v_db, "long_name", "body index of each degree of freedom (0-based)"), "dof_body");
    SYI_NC(nc_def_var(nc, "dof_mode", NC_INT, 1, &d_dof, &v_dm), "dof_mode");
    SYI_NC(syi_nc_put_text(nc, v_dm, "long_name", "rigid-body mode: 1 surge, 2 sway, 3 heave, 4 roll, 5 pitch"), "dof_mode");
    SYI_NC(syi_nc_def_double(nc, "body_x", 1, &d_body, "m", "body axis x in the array frame", NULL, &v_bx), "body_x");
    SYI_NC(syi_nc_def_double(nc, "body_y", 1, &d_body, "m", "body axis y in the array frame", NULL, &v_by), "body_y");
    SYI_NC(syi_nc_def_double(nc, "body_radius", 1, &d_body, "m", "body radius", NULL, &v_br), "body_radius");
    SYI_NC(syi_nc_def_double(nc, "body_draft", 1, &d_body, "m", "body draft (equal to depth for a bottom-standing column)", NULL, &v_bdr), "body_draft");
    int dname[2] = {d_body, d_name};
    SYI_NC(nc_def_var(nc, "body_name", NC_CHAR, 2, dname, &v_bn), "body_name");
    SYI_NC(syi_nc_put_text(nc, v_bn, "long_name", "device name from the layout"), "body_name");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "Conventions", "CF-1.10"), "attributes");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "title", "swellyield hydrodynamic database (linear potential flow, array of cylinders)"), "attributes");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "comment", "Time convention Re{X exp(-i omega t)}; z up; dof order body-major. Linear potential-flow estimate."), "attributes");
    char sw[300];
    snprintf(sw, sizeof sw, "swellyield %s (%s)", sy_version(), sy_dependency_versions());
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "software", sw), "attributes");
    SYI_NC(nc_put_att_double(nc, NC_GLOBAL, "depth", NC_DOUBLE, 1, &db->depth), "attributes");
    SYI_NC(nc_put_att_double(nc, NC_GLOBAL, "density", NC_DOUBLE, 1, &db->rho), "attributes");
    SYI_NC(nc_put_att_double(nc, NC_GLOBAL, "gravity", NC_DOUBLE, 1, &db->g), "attributes");
    SYI_NC(nc_put_att_double(nc, NC_GLOBAL, "tolerance", NC_DOUBLE, 1, &db->tolerance), "attributes");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "truncation", db->truncation), "attributes");
    SYI_NC(syi_nc_put_text(nc, NC_GLOBAL, "cache_key", db->cache_key), "attributes");
    SYI_NC(nc_enddef(nc), "enddef");
    SYI_NC(nc_put_var_double(nc, v_om, db->omega), "omega");
    for (size_t i = 0; i < nh; i++)
        deg[i] = db->headings[i] * 180.0 / M_PI;
    SYI_NC(nc_put_var_double(nc, v_hd, deg), "heading");
    SYI_NC(nc_put_var_double(nc, v_am, db->added_mass), "added_mass");
    SYI_NC(nc_put_var_double(nc, v_bd, db->damping), "radiation_damping");
    for (size_t i = 0; i < no * nh * nd; i++)
        buf[i] = creal(db->excitation[i]);
    SYI_NC(nc_put_var_double(nc, v_xr, buf), "excitation_re");
    for (size_t i = 0; i < no * nh * nd; i++)
        buf[i] = cimag(db->excitation[i]);
    SYI_NC(nc_put_var_double(nc, v_xi, buf), "excitation_im");
    SYI_NC(nc_put_var_double(nc, v_cv, db->convergence), "convergence");
    SYI_NC(nc_put_var_int(nc, v_db, db->dof_body), "dof_body");
    SYI_NC(nc_put_var_int(nc, v_dm, db->dof_mode), "dof_mode");
    SYI_NC(nc_put_var_double(nc, v_bx, db->body_x), "body_x");
    SYI_NC(nc_put_var_double(nc, v_by, db->body_y), "body_y");
    SYI_NC(nc_put_var_double(nc, v_br, db->body_radius), "body_radius");
    SYI_NC(nc_put_var_double(nc, v_bdr, db->body_draft), "body_draft");
    SYI_NC(nc_put_var_text(nc, v_bn, &db->body_name[0][0]), "body_name");
    int closing = nc;
    nc = -1;
    SYI_NC(nc_close(closing), "close");
    free(buf);
    free(deg);
    return syi_atomic_commit(tmp, path, err);
fail:
    if (nc >= 0)
        nc_close(nc);
    syi_atomic_abort(tmp);
    free(buf);
    free(deg);
    return rc;
}

static int dim_len(int nc, const char *name, size_t *len)
{
    int d, s = nc_inq_dimid(nc, name, &d);
    return s == NC_NOERR ? nc_inq_dimlen(nc, d, len) : s;
}

static int get_var(int nc, const char *name, double *out)
{
    int v, s = nc_inq_varid(nc, name, &v);
    return s == NC_NOERR ? nc_get_var_double(nc, v, out) : s;
}

int sy_hydro_db_read(sy_hydro_db **out, const char *path, sy_error *err)
{
    int rc = syi_check_input_file(path, (size_t)1 << 40, err);
    if (rc != SY_OK)
        return rc;
    int nc = -1, v;
    sy_hydro_db *db = NULL;
    double *buf = NULL;
    size_t no, nh, nd, nb, nd2;
    if ((rc = syi_nc_open(path, &nc, err)) != SY_OK) {
        nc = -1;
        goto fail;
    }
    SYI_NC(dim_len(nc, "omega", &no), "dimension omega");
    SYI_NC(dim_len(nc, "heading", &nh), "dimension heading");
    SYI_NC(dim_len(nc, "dof", &nd), "dimension dof");
    SYI_NC(dim_len(nc, "dof2", &nd2), "dimension dof2");
    SYI_NC(dim_len(nc, "body", &nb), "dimension body");
    if (nd2 != nd) {
        rc = sy_error_set(err, SY_EINPUT, "%s: dimension dof2 = %zu differs from dof = %zu", path, nd2, nd);
        goto fail;
    }
    if ((rc = sy_hydro_db_alloc(&db, no, nh, nb, nd, err)) != SY_OK)
        goto fail;
    buf = malloc(no * nh * nd * sizeof *buf);
    if (buf == NULL) {
        rc = sy_error_set(err, SY_ENOMEM, "%s: read buffer", path);
        goto fail;
    }
    SYI_NC(get_var(nc, "omega", db->omega), "omega");
    SYI_NC(get_var(nc, "heading", db->headings), "heading");
    for (size_t i = 0; i < nh; i++)
        db->headings[i] *= M_PI / 180.0;
    SYI_NC(get_var(nc, "added_mass", db->added_mass), "added_mass");
    SYI_NC(get_var(nc, "radiation_damping", db->damping), "radiation_damping");
    SYI_NC(get_var(nc, "excitation_re", buf), "excitation_re");
    for (size_t i = 0; i < no * nh * nd; i++)
        db->excitation[i] = buf[i];
    SYI_NC(get_var(nc, "excitation_im", buf), "excitation_im");
    for (size_t i = 0; i < no * nh * nd; i++)
        db->excitation[i] += I * buf[i];
    SYI_NC(get_var(nc, "convergence", db->convergence), "convergence");
    SYI_NC(nc_inq_varid(nc, "dof_body", &v), "dof_body");
    SYI_NC(nc_get_var_int(nc, v, db->dof_body), "dof_body");
    SYI_NC(nc_inq_varid(nc, "dof_mode", &v), "dof_mode");
    SYI_NC(nc_get_var_int(nc, v, db->dof_mode), "dof_mode");
    SYI_NC(get_var(nc, "body_x", db->body_x), "body_x");
    SYI_NC(get_var(nc, "body_y", db->body_y), "body_y");
    SYI_NC(get_var(nc, "body_radius", db->body_radius), "body_radius");
    SYI_NC(get_var(nc, "body_draft", db->body_draft), "body_draft");
    SYI_NC(nc_inq_varid(nc, "body_name", &v), "body_name");
    SYI_NC(nc_get_var_text(nc, v, &db->body_name[0][0]), "body_name");
    SYI_NC(nc_get_att_double(nc, NC_GLOBAL, "depth", &db->depth), "attribute depth");
    SYI_NC(nc_get_att_double(nc, NC_GLOBAL, "density", &db->rho), "attribute density");
    SYI_NC(nc_get_att_double(nc, NC_GLOBAL, "gravity", &db->g), "attribute gravity");
    SYI_NC(nc_get_att_double(nc, NC_GLOBAL, "tolerance", &db->tolerance), "attribute tolerance");
    size_t len;
    SYI_NC(nc_inq_attlen(nc, NC_GLOBAL, "truncation", &len), "attribute truncation");
    if (len < sizeof db->truncation)
        SYI_NC(nc_get_att_text(nc, NC_GLOBAL, "truncation", db->truncation), "attribute truncation");
    SYI_NC(nc_inq_attlen(nc, NC_GLOBAL, "cache_key", &len), "attribute cache_key");
    if (len < sizeof db->cache_key)
        SYI_NC(nc_get_att_text(nc, NC_GLOBAL, "cache_key", db->cache_key), "attribute cache_key");
    for (size_t i = 0; i < nd; i++)
        if (db->dof_mode[i] < 1 || db->dof_mode[i] > 5 || db->dof_body[i] < 0 || (size_t)db->dof_body[i] >= nb) {
            rc = sy_error_set(err, SY_EINPUT, "%s: dof %zu has body %d, mode %d (expected body < %zu, mode 1..5)",
                              path, i, db->dof_body[i], db->dof_mode[i], nb);
            goto fail;
        }
    nc_close(nc);
    free(buf);
    *out = db;
    return SY_OK;
fail:
    if (nc >= 0)
        nc_close(nc);
    free(buf);
    sy_hydro_db_free(db);
    return rc;
}
