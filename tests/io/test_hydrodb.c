/* Hydrodynamic database file: write/read round trip is exact (NetCDF doubles), writes
 * are atomic (a failed write leaves the old file and no temporary), bad files are
 * rejected with path and variable. With "--write PATH" it only writes a sample file
 * (used by test_hydrodb_cf.py to check the file from outside with python3-netcdf4). */
#include "check.h"
#include "tmpfiles.h"
#include "swellyield/hydrodb.h"

#include <dirent.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

static sy_hydro_db *sample(void)
{
    sy_hydro_db *db = NULL;
    sy_error err = SY_ERROR_INIT;
    if (sy_hydro_db_alloc(&db, 3, 2, 2, 3, &err) != SY_OK)
        return NULL;
    for (size_t i = 0; i < 3; i++)
        db->omega[i] = 0.37 + 0.41 * (double)i;
    db->headings[0] = 0.0, db->headings[1] = M_PI / 4;
    int body[3] = {0, 1, 1}, mode[3] = {3, 3, 1};
    for (size_t d = 0; d < 3; d++)
        db->dof_body[d] = body[d], db->dof_mode[d] = mode[d];
    db->body_x[1] = 31.5, db->body_y[1] = -2.25;
    for (size_t b = 0; b < 2; b++) {
        db->body_radius[b] = 5, db->body_draft[b] = 4;
        snprintf(db->body_name[b], SY_HYDRODB_NAME_LEN, "F%zu", b + 1);
    }
    for (size_t i = 0; i < 27; i++) {
        db->added_mass[i] = 1e5 * sin(1.0 + (double)i);
        db->damping[i] = 1e4 * cos(2.0 + (double)i);
    }
    for (size_t i = 0; i < 18; i++)
        db->excitation[i] = 1e6 * (sin(0.3 * (double)i) + I * cos(0.7 * (double)i));
    for (size_t i = 0; i < 3; i++)
        db->convergence[i] = 1e-8 * (double)(i + 1);
    db->depth = 45, db->rho = 1025, db->g = 9.81, db->tolerance = 1e-6;
    snprintf(db->truncation, sizeof db->truncation, "sample: orders 0..8, 4 depth modes");
    snprintf(db->cache_key, sizeof db->cache_key, "0123456789abcdef");
    return db;
}

static int count_entries(const char *dir)
{
    DIR *d = opendir(dir);
    int n = 0;
    for (struct dirent *e; d != NULL && (e = readdir(d)) != NULL;)
        n += e->d_name[0] != '.' || (strcmp(e->d_name, ".") != 0 && strcmp(e->d_name, "..") != 0);
    if (d)
        closedir(d);
    return n;
}

int main(int argc, char **argv)
{
    sy_init();
    sy_error err = SY_ERROR_INIT;
    sy_hydro_db *db = sample();
    if (argc == 3 && strcmp(argv[1], "--write") == 0) {
        int rc = db ? sy_hydro_db_write(db, argv[2], &err) : SY_ENOMEM;
        if (rc != SY_OK)
            fprintf(stderr, "%s\n", err.msg);
        sy_hydro_db_free(db);
        return rc == SY_OK ? 0 : 1;
    }
    if (!sy_check_true(db != NULL, "sample allocated"))
        return sy_check_summary();
    char dir[512], path[600];
    snprintf(dir, sizeof dir, "%s", sy_test_tmpdir());
    snprintf(path, sizeof path, "%s/hydro.nc", dir);
    sy_check_ok(sy_hydro_db_write(db, path, &err), &err, "write");
    sy_hydro_db *back = NULL;
    if (sy_check_ok(sy_hydro_db_read(&back, path, &err), &err, "read back")) {
        int same = back->n_omega == 3 && back->n_dof == 3 && back->n_headings == 2 && back->n_bodies == 2;
        for (size_t i = 0; same && i < 27; i++)
            same = back->added_mass[i] == db->added_mass[i] && back->damping[i] == db->damping[i];
        for (size_t i = 0; same && i < 18; i++)
            same = back->excitation[i] == db->excitation[i];
        for (size_t i = 0; same && i < 3; i++)
            same = back->dof_body[i] == db->dof_body[i] && back->dof_mode[i] == db->dof_mode[i] &&
                   back->omega[i] == db->omega[i];
        sy_check_true(same, "round trip exact for matrices, excitation, dofs, omega");
        /* Headings pass through degrees in the file: pi/4 -> 45 -> pi/4 within rounding. */
        sy_check_close(back->headings[1], M_PI / 4, 2e-16, 0, "heading round trip through degrees");
        sy_check_true(strcmp(back->body_name[1], "F2") == 0 && back->body_x[1] == 31.5,
                      "body names and positions");
        sy_check_true(strcmp(back->cache_key, db->cache_key) == 0 && back->depth == 45,
                      "global attributes");
        sy_hydro_db_free(back);
    }
    /* A failed write into a missing folder: error names the path, nothing left behind. */
    char bad[700];
    snprintf(bad, sizeof bad, "%s/no-such-dir/hydro.nc", dir);
    sy_check_fails(sy_hydro_db_write(db, bad, &err), SY_EIO, &err, "no-such-dir/hydro.nc",
                   "write into a missing folder fails with the path");
    sy_check_true(count_entries(dir) == 1, "only the earlier file remains in the folder (no temporary)");
    /* A file that is not NetCDF. */
    const char *junk = sy_test_write(dir, "junk.nc", "this is not netcdf\n");
    sy_check_fails(sy_hydro_db_read(&back, junk, &err), SY_EIO, &err, "junk.nc: cannot open as NetCDF",
                   "a text file given as a database");
    sy_hydro_db_free(db);
    sy_test_rmtree(dir);
    return sy_check_summary();
}
