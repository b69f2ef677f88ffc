#!/usr/bin/python3
"""Write the INVENTED demo hindcast time series of swellyield: shelf_hindcast.nc.

Four years (2001-01-01 to 2004-12-31, the 4-year cycle that averages exactly 8766 h per
year, references.md 6.2) of 3-hourly sea-state parameters for the invented shelf site
of make_demo_sites.py, as a CF-1.10 NetCDF time series. Nothing here is measured or
hindcast: the series is a made-up seasonal, autocorrelated random process (fixed seed,
so re-running reproduces the file except for the history time stamp).

The file exercises what a real hindcast file brings, on purpose:
  * variable names that say nothing (swh, t_e, f_pk, mwd): readers must find them by
    CF standard_name;
  * Hs and direction packed as 16-bit integers with scale_factor/add_offset and a
    _FillValue; Te stored as float with its own _FillValue; peak frequency fp with a
    missing_value instead;
  * missing records: scattered single records in each variable and a two-day outage
    in all of them;
  * CF time units "hours since 2001-01-01 00:00:00", calendar "standard".

Run with Debian's python3:  /usr/bin/python3 seastates/make_demo_hindcast.py
"""
import datetime
import math
import os

import numpy as np
import netCDF4

HERE = os.path.dirname(os.path.abspath(__file__))
INVENTED = ("INVENTED DATA for demonstration and testing: these numbers are not "
            "measurements or hindcast results of any real site.")
STEP_H = 3.0
START = datetime.datetime(2001, 1, 1)
END = datetime.datetime(2005, 1, 1)


def series(rng, n, t_hours):
    """Invented sea states: ln Hs an AR(1) process (about 1.5-day memory) around a seasonal
    mean (winter rougher), Te from Hs with its own noise, direction a slow random walk that
    is pulled back toward the invented prevailing 255 degrees."""
    day = t_hours / 24.0
    season = np.cos(2 * math.pi * (day - 15.0) / 365.25)      # +1 in mid-January
    phi = math.exp(-STEP_H / 36.0)
    noise = rng.standard_normal(n)
    x = np.empty(n)
    x[0] = 0.0
    for i in range(1, n):
        x[i] = phi * x[i - 1] + math.sqrt(1 - phi * phi) * noise[i]
    hs = np.exp(math.log(1.65) + 0.3 * season + 0.48 * x)
    te = (4.6 + 1.9 * hs ** 0.62) * np.exp(0.08 * rng.standard_normal(n))
    steep_cap = np.sqrt(hs * 2 * math.pi * 14.0 / 9.81)     # keep steepness below 1/14
    te = np.maximum(te, steep_cap)
    d = np.empty(n)
    d[0] = 255.0
    for i in range(1, n):
        d[i] = d[i - 1] + 0.1 * (255.0 - d[i - 1]) + 12.0 * rng.standard_normal()
    return hs, te, np.mod(d, 360.0)


def main():
    rng = np.random.default_rng(20011)
    n = int((END - START).total_seconds() / 3600.0 / STEP_H)      # 11688 records
    t = np.arange(n) * STEP_H
    hs, te, mwd = series(rng, n, t)
    tp = 1.2 * te                     # invented Tp/Te ratio, for the fp variable
    fp = 1.0 / tp

    # Missing records: 40 scattered per variable and a 2-day outage of everything.
    miss = {k: rng.choice(n, 40, replace=False) for k in ("hs", "te", "fp", "mwd")}
    outage = np.arange(5000, 5016)

    path = os.path.join(HERE, "shelf_hindcast.nc")
    tmp = path + ".tmp"
    with netCDF4.Dataset(tmp, "w", format="NETCDF4") as nc:
        nc.createDimension("time", None)
        vt = nc.createVariable("time", "f8", ("time",))
        vt.standard_name = "time"
        vt.long_name = "time"
        vt.units = "hours since 2001-01-01 00:00:00"
        vt.calendar = "standard"
        vt.axis = "T"
        vt[:] = t

        def packed(name, std, long_name, units, data, scale, offset, holes):
            v = nc.createVariable(name, "i2", ("time",), fill_value=-32767, zlib=True,
                                  complevel=4)
            v.standard_name = std
            v.long_name = long_name
            v.units = units
            v.scale_factor = np.float32(scale)
            v.add_offset = np.float32(offset)
            v.set_auto_maskandscale(False)       # we pack by hand, as CF 8.1 says
            raw = np.round((data - offset) / scale).astype(np.int16)
            raw[holes] = -32767
            raw[outage] = -32767
            v[:] = raw

        packed("swh", "sea_surface_wave_significant_height",
               "significant wave height Hm0", "m", hs, 0.001, 0.0, miss["hs"])
        packed("mwd", "sea_surface_wave_from_direction",
               "mean wave direction (from, clockwise from north)", "degree", mwd, 0.01, 180.0,
               miss["mwd"])

        v = nc.createVariable("t_e", "f4", ("time",), fill_value=np.float32(-999.0),
                              zlib=True, complevel=4)
        v.standard_name = ("sea_surface_wave_mean_period_from_variance_spectral_density_"
                           "inverse_frequency_moment")
        v.long_name = "energy period Te = m(-1)/m(0)"
        v.units = "s"
        v.set_auto_maskandscale(False)
        d = te.astype(np.float32)
        d[miss["te"]] = -999.0
        d[outage] = -999.0
        v[:] = d

        v = nc.createVariable("f_pk", "f4", ("time",), zlib=True, complevel=4)
        v.standard_name = "sea_surface_wave_frequency_at_variance_spectral_density_maximum"
        v.long_name = "peak frequency of the variance spectrum"
        v.units = "s-1"
        v.missing_value = np.float32(-9999.0)
        v.set_auto_maskandscale(False)
        d = fp.astype(np.float32)
        d[miss["fp"]] = -9999.0
        d[outage] = -9999.0
        v[:] = d

        vd = nc.createVariable("depth", "f4", ())
        vd.standard_name = "sea_floor_depth_below_mean_sea_level"
        vd.long_name = "water depth at the site"
        vd.units = "m"
        vd.positive = "down"
        vd.assignValue(50.0)

        nc.Conventions = "CF-1.10"
        nc.title = "Sea-state time series, 3-hourly, 2001-2004, Invented Shelf [INVENTED DATA]"
        nc.institution = "swellyield demo data (invented)"
        nc.source = ("invented by seastates/make_demo_hindcast.py: seasonal AR(1) ln Hs, Te "
                     "from Hs with noise, random-walk direction; seed 20011")
        stamp = datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%M:%SZ")
        nc.history = "%s: written by seastates/make_demo_hindcast.py" % stamp
        nc.comment = (INVENTED + " Variable names are deliberately uninformative: use the "
                      "standard_name attributes. Missing records: 40 per variable at random "
                      "plus records 5000-5015 in all variables.")
        nc.site_name = "Invented Shelf"
        nc.invented_data = "yes"
    os.replace(tmp, path)
    print("shelf_hindcast: %d records, Hs mean %.2f m, max %.2f m, Te mean %.2f s" % (
        n, hs.mean(), hs.max(), te.mean()))


if __name__ == "__main__":
    main()
