"""The hydrodynamic database is usable outside this project: python3-netcdf4 (Debian)
opens a file written by the C code and finds the CF attributes, units and dimensions
documented in include/swellyield/hydrodb.h. Values checked against the sample that
tests/io/test_hydrodb.c writes (our own data; this checks the file contract)."""
import math, os, subprocess, sys, tempfile
import netCDF4

build = sys.argv[1]
fails = passes = 0
def check(cond, what):
    global fails, passes
    passes += 1 if cond else 0
    print(("PASS: " if cond else "FAIL: ") + what)
    fails += 0 if cond else 1

with tempfile.TemporaryDirectory() as d:
    path = os.path.join(d, "hydro.nc")
    subprocess.run([os.path.join(build, "tests", "io_test_hydrodb"), "--write", path], check=True)
    with netCDF4.Dataset(path) as ds:
        check(ds.Conventions == "CF-1.10", "global Conventions = CF-1.10")
        check(ds.data_model == "NETCDF4", "NetCDF-4 file")
        check(ds["omega"].units == "rad s-1" and ds["heading"].units == "degree", "units of omega and heading")
        check(ds["added_mass"].dimensions == ("omega", "dof", "dof2"), "added_mass dimensions")
        check(ds["excitation_re"].dimensions == ("omega", "heading", "dof"), "excitation dimensions")
        check(abs(ds["heading"][1] - 45.0) < 1e-12, "heading written in degrees")
        check(list(ds["dof_mode"][:]) == [3, 3, 1], "dof_mode values")
        check(float(ds.depth) == 45.0 and float(ds.density) == 1025.0, "depth and density attributes")
        am = ds["added_mass"][:]
        check(abs(am[0, 0, 1] - 1e5 * math.sin(2.0)) <= 1e-9 * 1e5, "added_mass value [0,0,1]")
        names = netCDF4.chartostring(ds["body_name"][:])
        check(list(names) == ["F1", "F2"], "body names readable as strings")
        check("swellyield" in ds.software, "software attribute")
print(f"{passes} passed, {fails} failed")
sys.exit(1 if fails else 0)
