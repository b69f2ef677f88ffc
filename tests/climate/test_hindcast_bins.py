#!/usr/bin/python3
"""Hindcast binning checked against an independent numpy count of the same file.

The C code (`climate_test_hindcast --bin IN OUT te|tp [dir]`) bins the invented demo
hindcast seastates/shelf_hindcast.nc into the demo bins (Hs 0.25..8.25 by 0.5 m, period
2.5..16.5 by 1 s, optionally 12 sectors of 30 degrees) with gaps left out and writes a
scatter table. Here the same file is read with python3-netCDF4, unpacked by hand in
float64 following CF 1.12 section 8.1 (value = packed x scale_factor + add_offset;
_FillValue / missing_value compared in packed form), counted with numpy boolean masks,
converted to hours per year with the actual time steps and the record length in years
(span / 8766 h), and compared. The missing-record masks are also compared with
netCDF4's own automatic masking (a second, independent implementation)."""
import os
import subprocess
import sys
import tempfile

import numpy as np
import netCDF4

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from pycheck import check, summary  # noqa: E402

HOURS_PER_YEAR = 8766.0
def by_standard_name(nc, name):
    found = [v for v in nc.variables.values() if getattr(v, "standard_name", None) == name]
    assert len(found) == 1, name
    return found[0]


def unpack(v):
    v.set_auto_maskandscale(False)
    raw = np.asarray(v[:], dtype=np.float64)
    bad = np.isnan(raw)
    if "_FillValue" in v.ncattrs():
        bad |= raw == np.float64(v._FillValue)
    if "missing_value" in v.ncattrs():
        bad |= np.isin(raw, np.atleast_1d(np.asarray(v.missing_value, dtype=np.float64)))
    scale = np.float64(getattr(v, "scale_factor", 1.0))
    offset = np.float64(getattr(v, "add_offset", 0.0))
    x = raw * scale + offset
    x[bad] = np.nan
    # netCDF4's own masking must flag the same records
    v.set_auto_maskandscale(True)
    auto = np.ma.getmaskarray(v[:])
    return x, np.array_equal(auto, bad)


def count(path, period, with_dir):
    with netCDF4.Dataset(path) as nc:
        t = nc["time"]
        hours = np.asarray(t[:], dtype=np.float64)     # units are hours since ...
        assert t.units.startswith("hours since")
        hs, ok1 = unpack(by_standard_name(nc, "sea_surface_wave_significant_height"))
        if period == "te":
            per, ok2 = unpack(by_standard_name(
                nc, "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment"))
        else:
            fp, ok2 = unpack(by_standard_name(
                nc, "sea_surface_wave_frequency_at_variance_spectral_density_maximum"))
            per = 1.0 / fp
        d, ok3 = unpack(by_standard_name(nc, "sea_surface_wave_from_direction"))
    check(ok1 and ok2 and ok3, "hand masks equal netCDF4's automatic masks (%s)" % period)
    dt = np.diff(hours)
    dt = np.append(dt, dt[-1])
    span = dt.sum()
    years = span / HOURS_PER_YEAR
    valid = ~np.isnan(hs) & ~np.isnan(per)
    if with_dir:
        valid &= ~np.isnan(d)
    hs_e = 0.25 + 0.5 * np.arange(17)
    t_e = 2.5 + np.arange(15)
    centres = 30.0 * np.arange(12)
    nd = 12 if with_dir else 1
    occ = np.zeros((16, 14, nd))
    for i in range(16):
        in_h = valid & (hs >= hs_e[i]) & (hs < hs_e[i + 1])
        for j in range(14):
            in_ht = in_h & (per >= t_e[j]) & (per < t_e[j + 1])
            for k in range(nd):
                sel = in_ht
                if with_dir:
                    diff = np.mod(d - centres[k] + 180.0, 360.0) - 180.0
                    sel = sel & (diff >= -15.0) & (diff < 15.0)
                occ[i, j, k] = dt[sel].sum() / years
    return occ if with_dir else occ[:, :, 0], years, int((~valid).sum())


def main():
    build = sys.argv[1]
    src = os.environ.get("SY_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
    hindcast = os.path.join(src, "seastates", "shelf_hindcast.nc")
    exe = os.path.join(build, "tests", "climate_test_hindcast")
    with tempfile.TemporaryDirectory() as tmp:
        for period, with_dir in (("te", True), ("te", False), ("tp", False)):
            out = os.path.join(tmp, "binned_%s_%d.nc" % (period, with_dir))
            args = [exe, "--bin", hindcast, out, period] + (["dir"] if with_dir else [])
            r = subprocess.run(args, capture_output=True, text=True)
            check(r.returncode == 0, "C binning ran: %s" % r.stderr.strip())
            if r.returncode != 0:
                continue
            want, years, n_missing = count(hindcast, period, with_dir)
            with netCDF4.Dataset(out) as nc:
                got = np.asarray(nc["occurrence"][:])
                check(abs(nc.record_length_years - years) <= 1e-15 * years,
                      "record length %.15g years" % nc.record_length_years)
                check(("%d missing" % n_missing) in nc.source,
                      "source reports %d missing records: %s" % (n_missing, nc.source))
            check(got.shape == want.shape, "shape %s" % (got.shape,))
            # Both sides sum the same 3 h steps; only the summation order differs, so a few
            # ulps of the largest bin (~300 h/yr): rtol 1e-12.
            worst = np.max(np.abs(got - want)) / np.max(want)
            check(worst <= 1e-12, "%s%s: C bins equal numpy counts (max rel diff %.2e, "
                  "total %.3f h/yr)" % (period, " x direction" if with_dir else "", worst, got.sum()))
            check(np.count_nonzero(got) == np.count_nonzero(want), "same non-zero bins")


main()
summary()
