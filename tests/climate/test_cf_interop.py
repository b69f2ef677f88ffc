#!/usr/bin/python3
"""Files written by the C scatter-table writer must be usable outside swellyield: open
them with Debian's python3-netCDF4 and find the CF-1.10 metadata (references.md 6.1
standard names, units, CF cell bounds, global attributes) and the values.

Usage: test_cf_interop.py BUILD_DIR   (ctest passes it). The C side writes the files via
`climate_test_netcdf --write DIR` (the same sample tables its own round trip uses:
occurrence[i] = scale * (0.5 + 0.25 sin(1 + i)), scale 100 h/yr or 1/n)."""
import math
import os
import subprocess
import sys
import tempfile

import numpy as np
import netCDF4

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from pycheck import check, summary  # noqa: E402

CF_HS = "sea_surface_wave_significant_height"
CF_TE = "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment"
CF_TP = "sea_surface_wave_period_at_variance_spectral_density_maximum"
CF_DIR = "sea_surface_wave_from_direction"
CF_DEPTH = "sea_floor_depth_below_mean_sea_level"


def check_axis(nc, name, std, units, edges=None):
    v = nc[name]
    check(v.standard_name == std, "%s standard_name %s" % (name, v.standard_name))
    check(v.units == units, "%s units '%s'" % (name, v.units))
    check(len(v.long_name) > 0, "%s has a long_name" % name)
    b = nc[v.bounds]
    check(b.dimensions == (name, "bound") and b.shape[1] == 2,
          "%s bounds variable %s(%s, bound=2)" % (name, v.bounds, name))
    lo, hi = b[:, 0], b[:, 1]
    check(np.all(lo < hi), "%s bounds lower < upper" % name)
    check(np.allclose(v[:], 0.5 * (lo + hi), rtol=0, atol=1e-12),
          "%s centres are the middle of the bounds" % name)
    if edges is not None:
        check(np.array_equal(np.append(lo, hi[-1]), edges) and np.array_equal(lo[1:], hi[:-1]),
              "%s bounds are contiguous with edges %s" % (name, edges))


def main():
    build = sys.argv[1]
    exe = os.path.join(build, "tests", "climate_test_netcdf")
    with tempfile.TemporaryDirectory() as tmp:
        r = subprocess.run([exe, "--write", tmp], capture_output=True, text=True)
        check(r.returncode == 0, "C writer ran (%s)" % r.stderr.strip())
        if r.returncode != 0:
            return

        with netCDF4.Dataset(os.path.join(tmp, "dir_hours.nc")) as nc:
            check(nc.data_model == "NETCDF4", "NetCDF-4 file (%s)" % nc.data_model)
            check(nc.Conventions == "CF-1.10", "Conventions = CF-1.10")
            for att in ("title", "institution", "source", "history", "comment"):
                check(att in nc.ncattrs() and len(getattr(nc, att)) > 0, "global %s present" % att)
            check("swellyield" in nc.history, "history names swellyield: %s" % nc.history)
            check(nc.comment.startswith("INVENTED DATA"), "comment states invented data")
            check("INVENTED" in nc.title, "title flags invented data")
            check(nc.site_name == "Round Trip Bay" and nc.invented_data == "yes", "site, invented")
            check(abs(nc.record_length_years - 12.5) == 0.0, "record_length_years 12.5")
            check_axis(nc, "hs", CF_HS, "m", edges=[0.25, 0.75, 1.25, 1.75])
            check_axis(nc, "period", CF_TE, "s", edges=[4.5, 5.5, 6.5, 7.5, 8.5])
            check_axis(nc, "direction", CF_DIR, "degree")
            check(np.array_equal(nc["direction"][:], [0, 90, 180, 270]), "direction centres")
            check(np.array_equal(nc["direction_bounds"][0], [-45, 45]),
                  "bin through north has bounds -45..45")
            occ = nc["occurrence"]
            check(occ.dimensions == ("hs", "period", "direction"), "occurrence(hs, period, direction)")
            check(occ.units == "h year-1" and occ.hours_per_year == 8766.0,
                  "occurrence units h year-1, hours_per_year 8766")
            n = occ.size
            # Python math.sin and C sin agree to an ulp or so here: rtol 1e-15.
            want = np.array([100.0 * (0.5 + 0.25 * math.sin(1.0 + i)) for i in range(n)])
            check(np.allclose(np.ravel(occ[:]), want, rtol=1e-15, atol=0),
                  "occurrence values in C row-major order (hs, period, direction)")
            d = nc["depth"]
            check(d.standard_name == CF_DEPTH and d.units == "m" and float(d[...]) == 47.5,
                  "depth 47.5 m with its CF standard name")

        with netCDF4.Dataset(os.path.join(tmp, "omni_fraction.nc")) as nc:
            check("direction" not in nc.dimensions, "omnidirectional: no direction dimension")
            check_axis(nc, "period", CF_TP, "s")
            occ = nc["occurrence"]
            check(occ.units == "1" and occ.occurrence_kind == "fraction", "fraction units '1'")
            check(occ.dimensions == ("hs", "period"), "occurrence(hs, period)")
            check("depth" not in nc.variables, "unknown depth: no depth variable")
            n = occ.size
            want = np.array([(1.0 / n) * (0.5 + 0.25 * math.sin(1.0 + i)) for i in range(n)])
            check(np.allclose(np.ravel(occ[:]), want, rtol=1e-15, atol=0), "fraction values")
        leftovers = [f for f in os.listdir(tmp) if ".tmp-" in f]
        check(leftovers == [], "no temporary files next to the outputs")


main()
summary()
