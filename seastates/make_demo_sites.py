#!/usr/bin/python3
"""Write the INVENTED demo scatter tables of swellyield (see README.md in this folder).

Two invented sites, written as NetCDF-4 files in the swellyield scatter-table layout
(docs/formats.md), plus the shelf site again as a long-form CSV for the import path:

  shelf_site.nc   moderately energetic shelf site, 50 m deep, Hs x Te x direction
                  (12 sectors of 30 degrees), occurrence in mean annual hours;
  shelf_site.csv  the same table in the CSV layout (zero bins omitted);
  sheltered_site.nc  milder sheltered site, 25 m deep, Hs x Te, occurrence as fractions.

Nothing here is measured or hindcast: the joint distributions are made-up smooth shapes
(a Weibull marginal for Hs, a log-normal Te given Hs whose median grows with Hs, a
steepness cut-off, and for the shelf site a mixture of two von Mises direction lobes),
integrated over bins of 0.5 m in Hs and 1 s in Te (the bin widths IEC TS 62600-100 asks
for, references.md 5.1). The numbers are deterministic (no random draws), so re-running
the script reproduces the files bit for bit except the history time stamp.

Run with Debian's python3:  /usr/bin/python3 seastates/make_demo_sites.py
"""
import datetime
import math
import os

import numpy as np
import netCDF4

HOURS_PER_YEAR = 8766.0          # average year, 365.25 d (references.md 5.1, from memory)
G = 9.81
HERE = os.path.dirname(os.path.abspath(__file__))

CF_HS = "sea_surface_wave_significant_height"
CF_TE = ("sea_surface_wave_mean_period_from_variance_spectral_density_"
         "inverse_frequency_moment")
CF_DIR = "sea_surface_wave_from_direction"
CF_DEPTH = "sea_floor_depth_below_mean_sea_level"
INVENTED = ("INVENTED DATA for demonstration and testing: these numbers are not "
            "measurements or hindcast results of any real site.")

HS_EDGES = np.arange(0.25, 8.25 + 1e-9, 0.5)     # 16 bins, centres 0.5 .. 8.0 m
TE_EDGES = np.arange(2.5, 16.5 + 1e-9, 1.0)      # 14 bins, centres 3 .. 16 s


def weibull_cdf(h, scale, shape):
    h = np.maximum(h, 0.0)
    return 1.0 - np.exp(-(h / scale) ** shape)


def joint_hs_te(hs_edges, te_edges, hs_scale, hs_shape, te0, te1, te_pow, te_sigma,
                max_steepness, n_sub=40):
    """Probability per (Hs, Te) bin of the invented joint distribution.

    Hs ~ Weibull(hs_scale, hs_shape); ln Te | Hs ~ Normal(ln(te0 + te1 Hs^te_pow), te_sigma);
    sea states steeper than max_steepness (Hs / (g Te^2 / 2 pi)) are removed.
    Each Hs bin is split into n_sub slices (midpoint rule) to integrate the conditional.
    Returns p[i, j] (not renormalised: mass outside the bins or removed is the rest)."""
    from math import erf, sqrt
    p = np.zeros((len(hs_edges) - 1, len(te_edges) - 1))
    for i in range(len(hs_edges) - 1):
        sub = np.linspace(hs_edges[i], hs_edges[i + 1], n_sub + 1)
        mass = np.diff(weibull_cdf(sub, hs_scale, hs_shape))
        hmid = 0.5 * (sub[:-1] + sub[1:])
        for h, m in zip(hmid, mass):
            mu = math.log(te0 + te1 * h ** te_pow)
            cdf = np.array([0.5 * (1.0 + erf((math.log(t) - mu) / (te_sigma * sqrt(2.0))))
                            for t in te_edges])
            cell = m * np.diff(cdf)
            te_mid = 0.5 * (te_edges[:-1] + te_edges[1:])
            steep = h / (G * te_mid ** 2 / (2.0 * math.pi))
            cell[steep > max_steepness] = 0.0
            p[i, :] += cell
    return p


def von_mises_sectors(centres_deg, width_deg, lobes):
    """Fraction per direction sector of a mixture of von Mises lobes (weight, mean, kappa),
    integrated with 60 points per sector."""
    frac = np.zeros(len(centres_deg))
    for d, c in enumerate(centres_deg):
        th = np.radians(np.linspace(c - width_deg / 2, c + width_deg / 2, 61))
        th_mid = 0.5 * (th[:-1] + th[1:])
        dth = th[1] - th[0]
        for w, mean, kappa in lobes:
            dens = np.exp(kappa * np.cos(th_mid - np.radians(mean))) / (2 * math.pi * np.i0(kappa))
            frac[d] += w * np.sum(dens) * dth
    return frac


def decimal(x, digits):
    """Nearest double to the decimal text of x with `digits` decimals (what a CSV reader
    gets back), so the CSV and NetCDF copies hold identical doubles."""
    return np.array([float(f"{v:.{digits}f}") for v in np.ravel(x)]).reshape(np.shape(x))


def write_table(path, occurrence, kind, hs_edges, te_edges, dir_centres, dir_width, site,
                depth, source, comment, institution="swellyield demo data (invented)"):
    """Write one scatter table in the swellyield layout (docs/formats.md)."""
    tmp = path + ".tmp"
    with netCDF4.Dataset(tmp, "w", format="NETCDF4") as nc:
        nc.createDimension("hs", len(hs_edges) - 1)
        nc.createDimension("period", len(te_edges) - 1)
        if dir_centres is not None:
            nc.createDimension("direction", len(dir_centres))
        nc.createDimension("bound", 2)

        def axis(name, edges, centres=None):
            v = nc.createVariable(name, "f8", (name,))
            b = nc.createVariable(name + "_bounds", "f8", (name, "bound"))
            v.bounds = name + "_bounds"
            lo, hi = np.asarray(edges[:-1]), np.asarray(edges[1:])
            v[:] = 0.5 * (lo + hi) if centres is None else centres
            b[:, 0], b[:, 1] = lo, hi
            return v

        v = axis("hs", hs_edges)
        v.standard_name = CF_HS
        v.long_name = "significant wave height (spectral Hm0 = 4 sqrt(m0)), bin centre"
        v.units = "m"
        v = axis("period", te_edges)
        v.standard_name = CF_TE
        v.long_name = "energy period Te = m(-1)/m(0), bin centre"
        v.units = "s"
        dims = ("hs", "period")
        if dir_centres is not None:
            lo = np.asarray(dir_centres) - dir_width / 2
            v = axis("direction", np.append(lo, lo[-1] + dir_width), centres=dir_centres)
            v.standard_name = CF_DIR
            v.long_name = ("direction waves come from, clockwise from true north, bin centre "
                           "(bounds may be below 0 for the bin through north)")
            v.units = "degree"
            # axis() made contiguous bounds from the lower edges: right for equal widths
            nc["direction_bounds"][:, 0] = lo
            nc["direction_bounds"][:, 1] = lo + dir_width
            dims = dims + ("direction",)
        v = nc.createVariable("occurrence", "f8", dims)
        if kind == "hours_per_year":
            v.long_name = "mean annual hours of sea states in the bin"
            v.units = "h year-1"
            v.comment = ("hours_per_year is the average year (365.25 d) used to relate "
                         "hours to fractions")
        else:
            v.long_name = "fraction of time with sea states in the bin"
            v.units = "1"
            v.comment = ("fractions of all time; mean annual hours = fraction x "
                         "hours_per_year (average year of 365.25 d)")
        v.occurrence_kind = kind
        v.hours_per_year = HOURS_PER_YEAR
        v[:] = occurrence
        d = nc.createVariable("depth", "f8", ())
        d.standard_name = CF_DEPTH
        d.long_name = "water depth at the site"
        d.units = "m"
        d.positive = "down"
        d.assignValue(depth)

        nc.Conventions = "CF-1.10"
        nc.title = ("Sea-state scatter table (Hs x Te%s) for %s [INVENTED DATA]"
                    % (" x direction" if dir_centres is not None else "", site))
        nc.institution = institution
        nc.source = source
        stamp = datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%dT%H:%M:%SZ")
        nc.history = "%s: written by seastates/make_demo_sites.py" % stamp
        nc.comment = INVENTED + " " + comment
        nc.site_name = site
        nc.invented_data = "yes"
        nc.scatter_table_layout = "swellyield scatter table 1"
    os.replace(tmp, path)


def shelf_site():
    p = joint_hs_te(HS_EDGES, TE_EDGES, hs_scale=2.1, hs_shape=1.55, te0=4.6, te1=1.9,
                    te_pow=0.62, te_sigma=0.12, max_steepness=1.0 / 14.0)
    centres = np.arange(0.0, 360.0, 30.0)
    # Invented: a dominant swell lobe from WSW and a weaker wind-sea lobe from N.
    dfrac = von_mises_sectors(centres, 30.0, [(0.75, 255.0, 3.0), (0.25, 350.0, 1.5)])
    occ = p[:, :, None] * dfrac[None, None, :] * HOURS_PER_YEAR
    occ = decimal(occ, 1)            # tenths of an hour, like a printed table
    return occ, centres, float(p.sum())


def sheltered_site():
    p = joint_hs_te(HS_EDGES, TE_EDGES, hs_scale=0.85, hs_shape=1.35, te0=3.6, te1=1.7,
                    te_pow=0.7, te_sigma=0.11, max_steepness=1.0 / 13.0)
    return decimal(p, 6), float(p.sum())


def write_csv(path, occ, centres, width, site, depth, source, comment):
    with open(path, "w") as f:
        f.write("# swellyield long-form scatter table (docs/formats.md)\n")
        f.write("# site: %s\n" % site)
        f.write("# source: %s\n" % source)
        f.write("# comment: %s %s\n" % (INVENTED, comment))
        f.write("# institution: swellyield demo data (invented)\n")
        f.write("# invented: yes\n")
        f.write("# depth_m: %g\n" % depth)
        f.write("# Directions: where waves come FROM, degrees clockwise from north; "
                "345,15 wraps through north.\n")
        f.write("hs_min,hs_max,te_min,te_max,dir_from_min,dir_from_max,hours_per_year\n")
        for i in range(occ.shape[0]):
            for j in range(occ.shape[1]):
                for d in range(occ.shape[2]):
                    if occ[i, j, d] > 0.0:
                        lo = (centres[d] - width / 2) % 360.0
                        hi = (centres[d] + width / 2) % 360.0
                        f.write("%g,%g,%g,%g,%g,%g,%.1f\n" % (
                            HS_EDGES[i], HS_EDGES[i + 1], TE_EDGES[j], TE_EDGES[j + 1],
                            lo, hi, occ[i, j, d]))


def main():
    occ, centres, inside = shelf_site()
    src = ("invented by seastates/make_demo_sites.py: Weibull Hs (scale 2.1 m, shape 1.55), "
           "log-normal Te given Hs, steepness < 1/14, two von Mises direction lobes")
    comment = ("Moderately energetic shelf site, 50 m deep. %.1f %% of the invented "
               "distribution falls inside the bins; the rest (calm Hs < 0.25 m, steeper "
               "or out-of-range states) is not tabulated." % (100 * inside))
    write_table(os.path.join(HERE, "shelf_site.nc"), occ, "hours_per_year", HS_EDGES,
                TE_EDGES, centres, 30.0, "Invented Shelf", 50.0, src, comment)
    write_csv(os.path.join(HERE, "shelf_site.csv"), occ, centres, 30.0, "Invented Shelf",
              50.0, src, comment)
    print("shelf_site: %.1f h/yr tabulated of %.0f, %d non-zero bins" % (
        occ.sum(), HOURS_PER_YEAR, np.count_nonzero(occ)))

    frac, inside = sheltered_site()
    src = ("invented by seastates/make_demo_sites.py: Weibull Hs (scale 0.85 m, shape 1.35), "
           "log-normal Te given Hs, steepness < 1/13")
    comment = ("Milder sheltered site, 25 m deep, omnidirectional. %.1f %% of the invented "
               "distribution falls inside the bins; the rest (mostly calm, Hs < 0.25 m) is "
               "not tabulated." % (100 * inside))
    write_table(os.path.join(HERE, "sheltered_site.nc"), frac, "fraction", HS_EDGES,
                TE_EDGES, None, 0.0, "Invented Sound", 25.0, src, comment)
    print("sheltered_site: fractions sum to %.6f, %d non-zero bins" % (
        frac.sum(), np.count_nonzero(frac)))


if __name__ == "__main__":
    main()
