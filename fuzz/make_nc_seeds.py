#!/usr/bin/python3
"""Seed corpus for fuzz_climate_nc (run once; the output is committed): small scatter
tables cut from the invented demo tables in seastates/ (INVENTED DATA), in each NetCDF
classic format the reader may meet (and NetCDF-4/HDF5 with --hdf5, for the optional
HDF5 runs of fuzz/fuzz_climate_nc.c), and a few slightly broken ones. Usage:
    /usr/bin/python3 fuzz/make_nc_seeds.py [--hdf5 DIR]
writes fuzz/corpus/fuzz_climate_nc/ (or the two NetCDF-4 seeds into DIR)."""
import os
import sys
import netCDF4

HERE = os.path.dirname(os.path.abspath(__file__))
SRC = os.path.dirname(HERE)
OUT = os.path.join(HERE, "corpus", "fuzz_climate_nc")
# Long text attributes are cut to this many characters: shorter seeds fuzz faster.
MAX_TEXT = 40


def cut(name, out, fmt, n_keep, drop=(), edit=None):
    """Copy seastates/<name> keeping the first n_keep bins of every axis."""
    with netCDF4.Dataset(os.path.join(SRC, "seastates", name)) as src, \
            netCDF4.Dataset(out, "w", format=fmt) as dst:
        for d, dim in src.dimensions.items():
            dst.createDimension(d, len(dim) if d == "bound" else min(len(dim), n_keep))
        for k in src.ncattrs():
            v = src.getncattr(k)
            dst.setncattr(k, v[:MAX_TEXT] if isinstance(v, str) and k != "comment" else v)
        for vn, var in src.variables.items():
            if vn in drop:
                continue
            v = dst.createVariable(vn, var.dtype, var.dimensions)
            for k in var.ncattrs():
                a = var.getncattr(k)
                v.setncattr(k, a[:MAX_TEXT] if isinstance(a, str) and k not in
                            ("bounds", "standard_name", "units", "occurrence_kind") else a)
            idx = tuple(slice(0, len(dst.dimensions[d])) for d in var.dimensions)
            v[...] = var[idx] if idx else var[...]
        if edit:
            edit(dst)


def main():
    if len(sys.argv) == 3 and sys.argv[1] == "--hdf5":
        os.makedirs(sys.argv[2], exist_ok=True)
        cut("sheltered_site.nc", os.path.join(sys.argv[2], "sheltered_hdf5.nc"), "NETCDF4", 3)
        cut("shelf_site.nc", os.path.join(sys.argv[2], "shelf_dir_hdf5.nc"), "NETCDF4", 2)
        return
    os.makedirs(OUT, exist_ok=True)
    formats = {"classic": "NETCDF3_CLASSIC", "offset64": "NETCDF3_64BIT_OFFSET",
               "cdf5": "NETCDF3_64BIT_DATA"}
    for tag, fmt in formats.items():
        cut("sheltered_site.nc", os.path.join(OUT, "sheltered_%s.nc" % tag), fmt, 3)
    cut("shelf_site.nc", os.path.join(OUT, "shelf_dir_classic.nc"), "NETCDF3_CLASSIC", 3)

    # Slightly broken, each readable as NetCDF: the reader's own checks must catch them.
    def gap(d):  # period bounds no longer contiguous
        d["period_bounds"][1, 0] = d["period_bounds"][1, 0] + 0.25
    cut("sheltered_site.nc", os.path.join(OUT, "broken_gap.nc"), "NETCDF3_CLASSIC", 3, edit=gap)
    cut("sheltered_site.nc", os.path.join(OUT, "broken_no_bounds.nc"), "NETCDF3_CLASSIC", 3,
        drop=("hs_bounds",))

    def units(d):
        d["hs"].units = "ft"
        d["occurrence"][0, 0] = float("nan")
    cut("sheltered_site.nc", os.path.join(OUT, "broken_units_nan.nc"), "NETCDF3_CLASSIC", 3,
        edit=units)
    # Not readable as NetCDF: cut in half.
    with open(os.path.join(OUT, "sheltered_classic.nc"), "rb") as f:
        data = f.read()
    with open(os.path.join(OUT, "broken_truncated.nc"), "wb") as f:
        f.write(data[: len(data) // 2])
    for f in sorted(os.listdir(OUT)):
        print("%6d  %s" % (os.path.getsize(os.path.join(OUT, f)), f))


if __name__ == "__main__":
    main()
