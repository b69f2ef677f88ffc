/* Project-file loading: a complete file read back into the model (values and unit
 * conversions), defaults, and a table of bad inputs each with its expected message.
 * These check our own contract (project file format in model.h), not outside data. */
#include "check.h"
#include "tmpfiles.h"
#include "swellyield/model.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

static const char *good_layout = "name,x,y,damping\nA1,0,0,\nA2,30,0,2.5e5\n# a comment line\nA3,0,30,\n";

static const char *good_ini =
    "; invented test project\n"
    "[site]\ndepth = 45\ndensity = 1025\ngravity = 9.81\nclimate = site.nc\nx_axis_bearing = 90\n"
    "[device]\nshape = float\nradius = 5\ndraft = 4\nmass = displaced\nmodes = heave, surge\n"
    "[pto]\ndamping = 3e5\nstiffness = 0\nefficiency = 0.8\nrated_power = 5e5\nmax_stroke = 2.5\ntuning = per_sea_state\n"
    "[layout]\nfile = layout.csv\n"
    "[sea]\nspectrum = jonswap\ngamma = 2.0\nspreading = 10\nperiod = te\n"
    "[solve]\nomega = 0.3:1.5:5\nheadings = 0, 45, 90\ntolerance = 1e-7\n"
    "[resonance]\nregion = 0.3:1.5:0.2\n";

static void good(const char *dir)
{
    sy_error err = SY_ERROR_INIT;
    sy_test_write(dir, "layout.csv", good_layout);
    const char *ini = sy_test_write(dir, "p.ini", good_ini);
    sy_model *m = NULL;
    if (!sy_check_ok(sy_model_load(&m, ini, &err), &err, "load a complete project file"))
        return;
    sy_check_close(m->depth, 45, 0, 0, "depth");
    sy_check_close(m->x_axis_bearing, M_PI / 2, 4e-16, 0, "bearing converted to radians once");
    sy_check_true(m->modes == (SY_MODE_BIT(1) | SY_MODE_BIT(3)), "modes heave + surge");
    sy_check_close(m->efficiency, 0.8, 0, 0, "efficiency");
    sy_check_true(m->tuning == SY_TUNING_PER_SEA_STATE, "tuning");
    sy_check_true(m->pto_mode == 3, "PTO on heave by default");
    sy_check_true(m->n_devices == 3, "three devices (comment line skipped)");
    sy_check_close(m->devices[0].pto_damping, 3e5, 0, 0, "empty damping cell takes [pto] damping");
    sy_check_close(m->devices[1].pto_damping, 2.5e5, 0, 0, "per-device damping");
    sy_check_true(m->devices[2].line == 5, "layout line numbers count the comment line");
    sy_check_true(m->n_omega == 5, "omega grid count");
    sy_check_close(m->omega[4], 1.5, 0, 0, "omega grid end inclusive");
    sy_check_close(m->omega[1], 0.6, 1e-15, 0, "omega grid step");
    sy_check_close(m->headings[2], M_PI / 2, 4e-16, 0, "headings in radians");
    sy_check_true(strstr(m->climate, dir) == m->climate, "climate path resolved from the file's folder");
    sy_check_true(m->has_resonance && m->res_im_depth == 0.2, "resonance region");
    sy_check_ok(sy_model_require(m, SY_NEED_CLIMATE | SY_NEED_PTO | SY_NEED_RESONANCE, &err), &err,
                "all optional sections present");
    sy_model_free(m);

    /* Minimal file: defaults. */
    ini = sy_test_write(dir, "min.ini", "[site]\ndepth=30\n[device]\nshape=float\nradius=3\ndraft=2\n[layout]\nfile=layout.csv\n");
    if (sy_check_ok(sy_model_load(&m, ini, &err), &err, "minimal project file")) {
        sy_check_true(m->rho == 1025 && m->g == 9.81, "default density and gravity (conventions.md)");
        sy_check_true(m->modes == SY_MODES_HEAVE, "default mode heave");
        sy_check_true(m->n_headings == 1 && m->headings[0] == 0, "default heading 0");
        sy_check_fails(sy_model_require(m, SY_NEED_CLIMATE, &err), SY_EINPUT, &err, "missing key 'climate' in [site]",
                       "climate required by a verb");
        sy_check_fails(sy_model_require(m, SY_NEED_PTO, &err), SY_EINPUT, &err, "missing section [pto]",
                       "pto required by a verb");
        sy_model_free(m);
    }
}

static const char *base_site = "[site]\ndepth = 30\n";
static const char *base_dev = "[device]\nshape = float\nradius = 3\ndraft = 2\n";
static const char *base_lay = "[layout]\nfile = layout.csv\n";

static const struct {
    const char *site, *dev, *extra, *layout, *expect;
} bad[] = {
    {"[site]\ndepth = -5\n", NULL, NULL, NULL, "p.ini:2: [site] depth must be > 0 m, got -5"},
    {"[site]\ndeptth = 30\n", NULL, NULL, NULL, "p.ini:2: unknown key 'deptth' in [site]"},
    {"[site]\ndepth = 30\ndepth = 31\n", NULL, NULL, NULL, "p.ini:3: key 'depth' repeated in [site] (first on line 2)"},
    {"[site]\ndepth = thirty\n", NULL, NULL, NULL, "p.ini:2: [site] depth = 'thirty' is not a number"},
    {"[site]\ndepth = nan\n", NULL, NULL, NULL, "'nan' is not a number"},
    {"[site]\ndepth = 30\n[sites]\nx = 1\n", NULL, NULL, NULL, "p.ini:3: unknown section '[sites]'"},
    {"[site]\n", NULL, NULL, NULL, "missing key 'depth' in [site]"},
    {"[site]\ndepth 30\n", NULL, NULL, NULL, "p.ini:2: expected 'key = value' or '[section]'"},
    {"[site]\ndepth = 30\n[sea\n", NULL, NULL, NULL, "p.ini:3: section header '[sea' lacks its closing ']'"},
    {NULL, "[device]\nshape = float\nradius = 3\ndraft = 30\n", NULL, NULL, "p.ini:6: [device] draft must be < [site] depth 30 m"},
    {NULL, "[device]\nshape = float\nradius = 3\ndraft = 40\n", NULL, NULL, "draft must be < [site] depth"},
    {NULL, "[device]\nshape = float\nradius = 0\ndraft = 2\n", NULL, NULL, "p.ini:5: [device] radius must be > 0 m, got 0"},
    {NULL, "[device]\nshape = sphere\nradius = 3\n", NULL, NULL, "[device] shape = 'sphere' is not one of float, column"},
    {NULL, "[device]\nshape = column\nradius = 3\ndraft = 2\n", NULL, NULL, "draft does not apply to a column"},
    {NULL, "[device]\nshape=float\nradius=3\ndraft=2\nmodes = heave, yaw\n", NULL, NULL, "'yaw' is not one of surge, sway, heave, roll, pitch"},
    {NULL, "[device]\nshape=float\nradius=3\ndraft=2\nmass = -4\n", NULL, NULL, "[device] mass must be 'displaced' or a mass > 0 kg, got -4"},
    {NULL, NULL, "[pto]\nefficiency = 1.2\n", NULL, "[pto] efficiency must be in (0, 1], got 1.2"},
    {NULL, NULL, "[pto]\nefficiency = 0\n", NULL, "[pto] efficiency must be in (0, 1], got 0"},
    {NULL, NULL, "[pto]\ndamping = -1e5\n", NULL, "[pto] damping must be >= 0 N s/m, got -100000"},
    {NULL, NULL, "[pto]\ntuning = best\n", NULL, "tuning = 'best' is not one of fixed, per_sea_state"},
    {NULL, NULL, "[pto]\nmode = pitch\n", NULL, "[pto] mode = pitch is not among [device] modes"},
    {NULL, NULL, "[pto]\nmode = yaw\n", NULL, "[pto] mode = 'yaw' is not one of surge, sway, heave, roll, pitch"},
    {NULL, NULL, "[sea]\nspectrum = pm\n", NULL, "spectrum = 'pm' is not one of jonswap, bretschneider"},
    {NULL, NULL, "[sea]\nspectrum = bretschneider\ngamma = 3.3\n", NULL, "gamma applies to spectrum = jonswap only"},
    {NULL, NULL, "[solve]\nomega = 1.0:0.5:10\n", NULL, "[solve] omega: '1.0:0.5:10': max must be > min"},
    {NULL, NULL, "[solve]\nomega = 0:1:10\n", NULL, "omega values must be > 0 rad/s, got 0"},
    {NULL, NULL, "[solve]\nomega = 0.1:3:10000000\n", NULL, "exceed the limit of 5000"},
    {NULL, NULL, "[solve]\nomega = 0.5, 0.4\n", NULL, "values must be strictly increasing"},
    {NULL, NULL, "[solve]\nheadings = 0,,90\n", NULL, "empty entry"},
    {NULL, NULL, "[resonance]\nregion = 1:0.5:0.1\n", NULL, "[resonance] region = '1:0.5:0.1': expected re_min:re_max:im_depth"},
    {NULL, NULL, NULL, "name,x\nA,0\n", "layout.csv:1: header lacks column 'y'"},
    {NULL, NULL, NULL, "name,x,y,colour\nA,0,0,red\n", "layout.csv:1: unknown column 'colour'"},
    {NULL, NULL, NULL, "name,x,y\n", "layout has a header but no devices"},
    {NULL, NULL, NULL, "", "empty layout"},
    {NULL, NULL, NULL, "name,x,y\nA,0,0\nA,20,0\n", "layout.csv:3: device name 'A' already used on line 2"},
    {NULL, NULL, NULL, "name,x,y\nA,0,0\nB,0,0\n", "layout.csv:3: device 'B' at the same position (0, 0) as 'A' on line 2"},
    {NULL, NULL, NULL, "name,x,y\nA,0,0\nB,5,0\n", "layout.csv:3: devices 'B' and 'A' (line 2) overlap"},
    {NULL, NULL, NULL, "name,x,y\nA,0,zero\n", "layout.csv:2: y = 'zero' is not a number"},
    {NULL, NULL, NULL, "name,x,y\nA,0\n", "layout.csv:2: 2 fields, the header has 3"},
    {NULL, NULL, NULL, "name,x,y,radius\nA,0,0,-1\n", "layout.csv:2: radius of 'A' must be > 0 m, got -1"},
    {NULL, NULL, NULL, "name,x,y,draft\nA,0,0,31\n", "layout.csv:2: draft of 'A' must be > 0 and < depth 30 m, got 31"},
    {NULL, NULL, NULL, "name,x,y\n\"A,0,0\n", "layout.csv:2: malformed CSV"},
    {NULL, NULL, NULL, "name,x,y\nA\xff,0,0\n", "layout.csv:2: not valid UTF-8"},
};

static void bad_inputs(const char *dir)
{
    for (size_t i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char text[2048];
        snprintf(text, sizeof text, "%s%s%s%s", bad[i].site ? bad[i].site : base_site,
                 bad[i].dev ? bad[i].dev : base_dev, base_lay, bad[i].extra ? bad[i].extra : "");
        sy_test_write(dir, "layout.csv", bad[i].layout ? bad[i].layout : "name,x,y\nA,0,0\n");
        const char *ini = sy_test_write(dir, "p.ini", text);
        sy_model *m = NULL;
        sy_error err = SY_ERROR_INIT;
        int rc = sy_model_load(&m, ini, &err);
        int ok = sy_check_fails(rc, rc == SY_ELIMIT ? SY_ELIMIT : SY_EINPUT, &err, bad[i].expect,
                                "bad input %zu rejected", i);
        if (ok)
            sy_check_true(strchr(err.msg, '\n') == NULL && m == NULL, "bad input %zu: one line, no model", i);
        sy_model_free(m);
    }
    sy_model *m = NULL;
    sy_error err = SY_ERROR_INIT;
    sy_check_fails(sy_model_load(&m, dir, &err), SY_EIO, &err, "is a directory, expected a file",
                   "a directory given as the project file");
    char missing[600];
    snprintf(missing, sizeof missing, "%s/nope.ini", dir);
    sy_check_fails(sy_model_load(&m, missing, &err), SY_EIO, &err, "nope.ini: cannot open",
                   "a missing project file");
}

int main(void)
{
    sy_init();
    const char *dir = sy_test_tmpdir();
    char d[512];
    snprintf(d, sizeof d, "%s", dir);
    good(d);
    bad_inputs(d);
    sy_test_rmtree(d);
    return sy_check_summary();
}
