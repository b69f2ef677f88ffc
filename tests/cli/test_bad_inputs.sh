#!/usr/bin/env bash
# A catalogue of bad inputs across every reader the program has (project file, layout CSV,
# scatter CSV, scatter NetCDF, hindcast NetCDF) and every verb that reads them. Each case
# must give exit code 2, exactly one stderr line "swellyield: <verb>: <message>" containing
# the expected text (file, line or variable, and what was expected), and leave no output:
# the -o target keeps its earlier content and no staging folder (*.partial-*) or temporary
# file (.*.tmp-*) remains. This checks our own contract (DEVELOPERS.md), not outside data.
# It extends tests/cli/test_errors.sh and tests/model/test_load.c without repeating them.
source "$2/tests/cli/common.sh"
ncase=0

# Earlier outputs that a failing command must leave as they are: a run's folder and a file.
# (Bash built-ins only in the per-case checks: the machine may be loaded and forks cost.)
shopt -s nullglob dotglob
reset_outputs() {
    rm -rf "$tmp/out" "$tmp/out.nc" "$tmp"/*.partial-* "$tmp"/.*.tmp-*
    mkdir -p "$tmp/out"
    echo OLD >"$tmp/out/summary.json"
    echo OLD >"$tmp/out.nc"
}
reset_outputs

bad() { # name verb expected_substring -- command...
    local name=$1 verb=$2 text=$3
    shift 4
    ncase=$((ncase + 1))
    "$@" >"$tmp/stdout" 2>"$tmp/stderr"
    local code=$? why="" lines=() left=() old="" old2=""
    mapfile -t lines <"$tmp/stderr"
    local err=${lines[0]-}
    [ "$code" -eq 2 ] || why="$why exit $code, want 2;"
    [ "${#lines[@]}" -eq 1 ] || why="$why ${#lines[@]} stderr lines, want 1;"
    [[ "$err" == "swellyield: $verb: "* ]] || why="$why not 'swellyield: $verb: ...';"
    [[ "$err" == *"$text"* ]] || why="$why want '$text';"
    left=("$tmp"/out/*)
    [ -f "$tmp/out/summary.json" ] && read -r old <"$tmp/out/summary.json"
    [ "$old" = OLD ] && [ "${#left[@]}" -eq 1 ] || why="$why output folder changed;"
    [ -f "$tmp/out.nc" ] && read -r old2 <"$tmp/out.nc"
    [ "$old2" = OLD ] || why="$why out.nc overwritten;"
    left=("$tmp"/*.partial-* "$tmp"/.*.tmp-* "$tmp"/out/.*.tmp-*)
    [ "${#left[@]}" -eq 0 ] || why="$why staging or temporary file left (${left[*]});"
    if [ -z "$why" ]; then
        echo "PASS: $name"
        pass=$((pass + 1))
    else
        echo "FAIL: $name:$why stderr: ${lines[*]:0:3}"
        fail=$((fail + 1))
        reset_outputs
    fi
}

sheltered=$src/seastates/sheltered_site.nc
hindcast=$src/seastates/shelf_hindcast.nc
d=$tmp/in
mkdir -p "$d"
printf 'name,x,y\nP1,0,0\nP2,30,12\n' >"$d/layout.csv"
# An invented small project (the pattern of test_run.sh), valid as written.
project() { # extra lines replace nothing; callers edit with sed
    cat <<INI
[site]
depth = 25
climate = $sheltered
[device]
shape = float
radius = 4
draft = 3
[pto]
damping = 1.5e5
[layout]
file = layout.csv
[solve]
omega = 0.3:2.8:20
INI
}
project >"$d/good.ini"
# mk NAME SED-EXPRESSION: a project file edited from the good one.
mk() { sed "$2" "$d/good.ini" >"$d/$1.ini"; }

# ---------------------------------------------------------------- project file
mk nodepth '/^depth/d'
bad "project: missing key depth (run)" run "nodepth.ini: missing key 'depth' in [site]" -- "$prog" run "$d/nodepth.ini" -o "$tmp/out" --quiet
mk noradius '/^radius/d'
bad "project: missing key radius (hydro)" hydro "missing key 'radius' in [device]" -- "$prog" hydro "$d/noradius.ini" -o "$tmp/out.nc" --quiet
mk unkpto 's/^damping = .*/dampingg = 1e5/'
bad "project: unknown key in [pto] (run)" run "unkpto.ini:9: unknown key 'dampingg' in [pto]" -- "$prog" run "$d/unkpto.ini" -o "$tmp/out" --quiet
mk radtype 's/^radius = .*/radius = four/'
bad "project: wrong type radius (hydro)" hydro "radtype.ini:6: [device] radius = 'four' is not a number" -- "$prog" hydro "$d/radtype.ini" -o "$tmp/out.nc" --quiet
mk radnan 's/^radius = .*/radius = NaN/'
bad "project: NaN radius (run)" run "radnan.ini:6: [device] radius = 'NaN' is not a number" -- "$prog" run "$d/radnan.ini" -o "$tmp/out" --quiet
mk depthinf 's/^depth = .*/depth = inf/'
bad "project: infinite depth (check)" check "depthinf.ini:2: [site] depth = 'inf' is not a number" -- "$prog" check "$d/depthinf.ini"
mk negdepth 's/^depth = .*/depth = -25/'
bad "project: negative depth (run)" run "negdepth.ini:2: [site] depth must be > 0 m, got -25" -- "$prog" run "$d/negdepth.ini" -o "$tmp/out" --quiet
mk deepdraft 's/^draft = .*/draft = 25/'
bad "project: draft = depth (hydro)" hydro "deepdraft.ini:7: [device] draft must be < [site] depth 25 m" -- "$prog" hydro "$d/deepdraft.ini" -o "$tmp/out.nc" --quiet
mk tol 's/^omega = .*/tolerance = -1e-4/'
bad "project: negative tolerance (check)" check "tol.ini:13: [solve] tolerance must be in [1e-13, 0.1], got -0.0001" -- "$prog" check "$d/tol.ini"
mk dupsec 's/^\[pto\]/[pto]\nefficiency = 0.8\nefficiency = 0.7/'
bad "project: repeated key (run)" run "key 'efficiency' repeated in [pto]" -- "$prog" run "$d/dupsec.ini" -o "$tmp/out" --quiet
mk utf8 's/^\[device\]/[device]\n; caf\xe9 in Latin-1/'
bad "project: non-UTF-8 byte (check)" check "utf8.ini:5: not valid UTF-8" -- "$prog" check "$d/utf8.ini"
printf '[site]\ndepth = 25\0\n' >"$d/nul.ini"
bad "project: NUL byte (hydro)" hydro "nul.ini:2: NUL byte in the line, expected UTF-8 text" -- "$prog" hydro "$d/nul.ini" -o "$tmp/out.nc" --quiet
bad "project: a directory (run)" run "$d: is a directory, expected a file" -- "$prog" run "$d" -o "$tmp/out" --quiet
bad "project: missing file (hydro)" hydro "$d/none.ini: cannot open" -- "$prog" hydro "$d/none.ini" -o "$tmp/out.nc" --quiet
mk manyomega 's/^omega = .*/omega = 0.1:3:10000000/'
bad "project: 10^7 frequencies refused (run)" run "manyomega.ini:13: [solve] omega (raise [solve] max_frequencies if you mean it): '0.1:3:10000000': 10000000 values exceed the limit of 5000" -- "$prog" run "$d/manyomega.ini" -o "$tmp/out" --quiet
truncate -s 80M "$d/huge.ini"
bad "project: 80 MB file refused up front (check)" check "huge.ini: 83886080 bytes, larger than the 67108864-byte limit for this input (SYI_TEXT_MAX_BYTES" -- "$prog" check "$d/huge.ini"
mk climdir "s|^climate = .*|climate = $d|"
bad "project: climate is a directory (run)" run "$d" -- "$prog" run "$d/climdir.ini" -o "$tmp/out" --quiet
mk norun 's/^damping = .*//; s/^\[pto\]//'
bad "project: run without [pto] (run)" run "missing section [pto]" -- "$prog" run "$d/norun.ini" -o "$tmp/out" --quiet

# ---------------------------------------------------------------- layout CSV
lay() { # name csv-text: a project using that layout
    printf '%b' "$2" >"$d/$1.csv"
    sed "s|^file = .*|file = $1.csv|" "$d/good.ini" >"$d/$1.ini"
}
lay lempty ''
bad "layout: empty file (run)" run "lempty.csv" -- "$prog" run "$d/lempty.ini" -o "$tmp/out" --quiet
lay lhead 'name,x,y\n'
bad "layout: header only (hydro)" hydro "lhead.csv" -- "$prog" hydro "$d/lhead.ini" -o "$tmp/out.nc" --quiet
lay ldup 'name,x,y\nP1,0,0\nP1,40,0\n'
bad "layout: duplicate names (run)" run "ldup.csv:3: device name 'P1' already used on line 2" -- "$prog" run "$d/ldup.ini" -o "$tmp/out" --quiet
lay lover 'name,x,y\nP1,0,0\nP2,7,0\n'
bad "layout: overlapping devices (hydro)" hydro "lover.csv:3: devices 'P2' and 'P1' (line 2) overlap" -- "$prog" hydro "$d/lover.ini" -o "$tmp/out.nc" --quiet
lay lnan 'name,x,y\nP1,0,0\nP2,nan,0\n'
bad "layout: NaN coordinate (run)" run "lnan.csv:3: x = 'nan' is not a number" -- "$prog" run "$d/lnan.ini" -o "$tmp/out" --quiet
lay lutf 'name,x,y\nP\xe91,0,0\n'
bad "layout: non-UTF-8 name (hydro)" hydro "lutf.csv:2: not valid UTF-8" -- "$prog" hydro "$d/lutf.ini" -o "$tmp/out.nc" --quiet
lay ldraft 'name,x,y,draft\nP1,0,0,25\n'
bad "layout: draft >= depth (run)" run "ldraft.csv:2: draft of 'P1' must be > 0 and < depth 25 m, got 25" -- "$prog" run "$d/ldraft.ini" -o "$tmp/out" --quiet
lay lunk 'name,x,y,z\nP1,0,0,0\n'
bad "layout: unknown column (check)" check "lunk.csv:1: unknown column 'z'" -- "$prog" check "$d/lunk.ini"
lay lfields 'name,x,y\nP1,0,0,9\n'
bad "layout: extra field (run)" run "lfields.csv:2: 4 fields, the header has 3" -- "$prog" run "$d/lfields.ini" -o "$tmp/out" --quiet
sed "s|^file = .*|file = $d|" "$d/good.ini" >"$d/ldir.ini"
bad "layout: a directory (run)" run "is a directory, expected a file" -- "$prog" run "$d/ldir.ini" -o "$tmp/out" --quiet
sed "s|^file = .*|file = nowhere.csv|" "$d/good.ini" >"$d/lmiss.ini"
bad "layout: missing file (hydro)" hydro "nowhere.csv: cannot open" -- "$prog" hydro "$d/lmiss.ini" -o "$tmp/out.nc" --quiet
awk 'BEGIN { print "name,x,y"; for (i = 0; i < 100001; i++) printf "B%d,%d,%d\n", i, 20 * (i % 400), 20 * int(i / 400) }' >"$d/lbig.csv"
sed "s|^file = .*|file = lbig.csv|" "$d/good.ini" >"$d/lbig.ini"
bad "layout: 10^5 bodies refused (run)" run "100001 devices exceed the limit of" -- "$prog" run "$d/lbig.ini" -o "$tmp/out" --quiet
truncate -s 2G "$d/lhuge.csv"
sed "s|^file = .*|file = lhuge.csv|" "$d/good.ini" >"$d/lhuge.ini"
bad "layout: 2 GB file refused up front (hydro)" hydro "lhuge.csv: 2147483648 bytes, larger than the 67108864-byte limit for this input (SYI_TEXT_MAX_BYTES" -- "$prog" hydro "$d/lhuge.ini" -o "$tmp/out.nc" --quiet
rm -f "$d/lhuge.csv"
printf 'name,x,y\nP1,0,0\nP2,30,12\nP3,60,0\n' >"$d/l3.csv"
sed "s|^file = .*|file = l3.csv|; s|^omega = .*|omega = 0.3:2.8:20\nmax_bodies = 2|" "$d/good.ini" >"$d/lmax.ini"
bad "layout: above [solve] max_bodies = 2 (check)" check "3 devices exceed the limit of 2 (raise [solve] max_bodies" -- "$prog" check "$d/lmax.ini"

sed "s|^file = .*|file = l3.csv|; s|^omega = .*|omega = 0.3:2.8:20\norders = 60\ndepth_modes = 60|" "$d/good.ini" >"$d/lmatrix.ini"
# 3 bodies x 121 orders x 60 depth modes = 21780 unknowns: 16 B x 21780^2 = 7.6 GB per thread.
bad "hydro: interaction matrix above 4 GB refused up front (hydro)" hydro "needs 7.6 GB per thread (limit 4.0 GB): set [solve] depth_modes or orders lower" -- "$prog" hydro "$d/lmatrix.ini" -o "$tmp/out.nc" --quiet
bad "hydro: interaction matrix above 4 GB refused up front (run)" run "needs 7.6 GB per thread (limit 4.0 GB)" -- "$prog" run "$d/lmatrix.ini" -o "$tmp/out" --quiet

# ---------------------------------------------------------------- scatter CSV
head -n 9 "$src/seastates/shelf_site.csv" >"$d/hdr.csv" # metadata + header
hdr=$(tail -n 1 "$d/hdr.csv")
scsv() { # name body-lines (after the metadata; first line is the header)
    { head -n 8 "$d/hdr.csv"; printf '%b' "$2"; } >"$d/$1.csv"
}
scsv cnocol 'hs_min,te_min,te_max,hours_per_year\n0.25,3.5,4.5,1\n'
bad "scatter CSV: missing column hs_max (sea import)" sea "cnocol.csv:9" -- "$prog" sea import "$d/cnocol.csv" -o "$tmp/out.nc"
scsv cunk 'hs_min,hs_max,te_min,te_max,hours_per_year,colour\n0.25,0.75,3.5,4.5,1,red\n'
bad "scatter CSV: unknown column (sea summary)" sea "cunk.csv:9" -- "$prog" sea summary "$d/cunk.csv"
scsv ctwo 'hs_min,hs_max,te_min,te_max,hours_per_year,fraction\n0.25,0.75,3.5,4.5,1,0.1\n'
bad "scatter CSV: two occurrence columns (sea import)" sea "ctwo.csv:9" -- "$prog" sea import "$d/ctwo.csv" -o "$tmp/out.nc"
scsv cneg 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5,-1\n'
bad "scatter CSV: negative occurrence (sea import)" sea "cneg.csv:10" -- "$prog" sea import "$d/cneg.csv" -o "$tmp/out.nc"
scsv cnan 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5,nan\n'
bad "scatter CSV: NaN occurrence (sea summary)" sea "cnan.csv:10" -- "$prog" sea summary "$d/cnan.csv"
scsv ctype 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,four,1\n'
bad "scatter CSV: wrong type (sea import)" sea "ctype.csv:10" -- "$prog" sea import "$d/ctype.csv" -o "$tmp/out.nc"
scsv corder 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.75,0.25,3.5,4.5,1\n'
bad "scatter CSV: hs_min > hs_max (sea import)" sea "corder.csv:10" -- "$prog" sea import "$d/corder.csv" -o "$tmp/out.nc"
scsv ctwice 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5,1\n0.25,0.75,3.5,4.5,2\n'
bad "scatter CSV: bin listed twice (sea import)" sea "ctwice.csv:11" -- "$prog" sea import "$d/ctwice.csv" -o "$tmp/out.nc"
scsv cspan 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,1.25,3.5,4.5,1\n0.75,1.25,3.5,4.5,2\n'
bad "scatter CSV: overlapping rows (sea summary)" sea "cspan.csv:10" -- "$prog" sea summary "$d/cspan.csv"
scsv cutf 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5,1 \xff\n'
bad "scatter CSV: non-UTF-8 byte (sea import)" sea "cutf.csv:10" -- "$prog" sea import "$d/cutf.csv" -o "$tmp/out.nc"
scsv cshort 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5\n'
bad "scatter CSV: missing field (sea import)" sea "cshort.csv:10" -- "$prog" sea import "$d/cshort.csv" -o "$tmp/out.nc"
scsv chdr 'hs_min,hs_max,te_min,te_max,hours_per_year\n'
bad "scatter CSV: header but no rows (sea summary)" sea "chdr.csv" -- "$prog" sea summary "$d/chdr.csv"
: >"$d/cempty.csv"
bad "scatter CSV: empty file (sea import)" sea "cempty.csv" -- "$prog" sea import "$d/cempty.csv" -o "$tmp/out.nc"
{ printf '# depth_m: -50\n'; printf 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5,1\n'; } >"$d/cdepth.csv"
bad "scatter CSV: negative depth_m (sea import)" sea "cdepth.csv:1" -- "$prog" sea import "$d/cdepth.csv" -o "$tmp/out.nc"
scsv ctetp 'hs_min,hs_max,te_min,tp_max,hours_per_year\n0.25,0.75,3.5,4.5,1\n'
bad "scatter CSV: Te and Tp mixed (sea import)" sea "ctetp.csv:9" -- "$prog" sea import "$d/ctetp.csv" -o "$tmp/out.nc"
mkdir -p "$d/cdir.csv"
bad "scatter CSV: a directory (sea import)" sea "cdir.csv: is a directory, expected a file" -- "$prog" sea import "$d/cdir.csv" -o "$tmp/out.nc"
bad "scatter CSV: missing file (sea summary)" sea "cnone.csv: cannot open" -- "$prog" sea summary "$d/cnone.csv"
truncate -s 2G "$d/chuge.csv"
bad "scatter CSV: 2 GB file refused up front (sea import)" sea "chuge.csv: 2147483648 bytes, larger than the" -- "$prog" sea import "$d/chuge.csv" -o "$tmp/out.nc"
rm -f "$d/chuge.csv"
scsv czero 'hs_min,hs_max,te_min,te_max,hours_per_year\n0.25,0.75,3.5,4.5,0\n'
sed "s|^climate = .*|climate = $d/czero.csv|" "$d/good.ini" >"$d/czero.ini"
bad "scatter CSV: zero total occurrence as a run's climate (run)" run "czero.csv" -- "$prog" run "$d/czero.ini" -o "$tmp/out" --quiet

# ---------------------------------------------------------------- NetCDF files
# One Python run makes every bad NetCDF file from the invented demo files.
"$py" - "$sheltered" "$hindcast" "$d" <<'PY' || { echo "FAIL: making the bad NetCDF files"; exit 1; }
import shutil, sys, os, numpy as np, netCDF4
good, hind, d = sys.argv[1:4]
def edit(name, src, f):
    p = os.path.join(d, name)
    shutil.copy(src, p)
    with netCDF4.Dataset(p, "a") as n:
        f(n)
def attr(v, a, x): return lambda n: n[v].setncattr(a, x)
def setval(v, idx, x):
    def f(n):
        a = n[v][:]; a = np.ma.filled(a, np.nan) if np.ma.isMaskedArray(a) else a
        a[idx] = x; n[v][:] = a
    return f
edit("n_hsunits.nc", good, attr("hs", "units", "cm"))
edit("n_occunits.nc", good, attr("occurrence", "units", "furlongs"))
edit("n_nan.nc", good, setval("occurrence", (3, 4), np.nan))
edit("n_neg.nc", good, setval("occurrence", (3, 4), -0.01))
edit("n_gap.nc", good, setval("hs_bounds", (2, 1), 1.0e3))
edit("n_stdname.nc", good, attr("period", "standard_name", "sea_surface_wave_period"))
edit("n_depth.nc", good, setval("depth", (), -25.0))
edit("n_occdims.nc", good, lambda n: n.renameVariable("occurrence", "occ"))
# Mismatched sizes: hs_bounds on a dimension of a different length than hs.
def mism(n):
    n.createDimension("hs2", 5)
    n.renameVariable("hs_bounds", "old_bounds")
    v = n.createVariable("hs_bounds", "f8", ("hs2", "bound"))
    v[:] = n["old_bounds"][:5, :]
edit("n_mism.nc", good, mism)
# Truncated: the first half of a valid file.
data = open(good, "rb").read()
open(os.path.join(d, "n_trunc.nc"), "wb").write(data[: len(data) // 2])
open(os.path.join(d, "n_text.nc"), "w").write("hs,period\n1,2\n")
# A huge table declared in a tiny file: dimensions of 10^8 x 10^8, nothing written.
with netCDF4.Dataset(os.path.join(d, "n_huge.nc"), "w") as n:
    for name, size in (("hs", 100000000), ("period", 100000000), ("bound", 2)):
        n.createDimension(name, size)
    for name in ("hs", "period"):
        v = n.createVariable(name, "f8", (name,), fill_value=1.0)
        v.units = "m" if name == "hs" else "s"
        n.createVariable(name + "_bounds", "f8", (name, "bound"), fill_value=1.0)
    n["period"].standard_name = "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment"
    o = n.createVariable("occurrence", "f8", ("hs", "period"), fill_value=0.0)
    o.units = "1"
# Hindcasts.
edit("h_units.nc", hind, attr("swh", "units", "cm"))
edit("h_time.nc", hind, attr("time", "units", "fortnights since the flood"))
edit("h_cal.nc", hind, attr("time", "calendar", "martian"))
edit("h_order.nc", hind, setval("time", slice(100, 101), 1.0))
edit("h_nohs.nc", hind, attr("swh", "standard_name", "sea_surface_wave_height_of_sorts"))
def hmism(n):
    n.createDimension("time2", 7)
    n.renameVariable("t_e", "old_te")
    v = n.createVariable("t_e", "f4", ("time2",))
    v.standard_name = n["old_te"].standard_name
    v.units = "s"
    v[:] = 7.0
    n["old_te"].standard_name = "unknown"
edit("h_mism.nc", hind, hmism)
data = open(hind, "rb").read()
open(os.path.join(d, "h_trunc.nc"), "wb").write(data[: len(data) * 2 // 3])
with netCDF4.Dataset(os.path.join(d, "h_huge.nc"), "w") as n:
    n.createDimension("time", 3000000000)
    t = n.createVariable("time", "f8", ("time",), fill_value=0.0)
    t.standard_name = "time"; t.units = "hours since 2001-01-01 00:00:00"; t.calendar = "standard"
    h = n.createVariable("swh", "f4", ("time",), fill_value=1.0)
    h.standard_name = "sea_surface_wave_significant_height"; h.units = "m"
    p = n.createVariable("t_e", "f4", ("time",), fill_value=7.0)
    p.standard_name = "sea_surface_wave_mean_period_from_variance_spectral_density_inverse_frequency_moment"; p.units = "s"
PY

sea_nc() { # name expected verb-args...: a bad scatter NetCDF through sea summary
    bad "scatter NetCDF: $1 (sea summary)" sea "$2" -- "$prog" sea summary "$d/$3"
}
sea_nc "hs units cm" "n_hsunits.nc: variable 'hs'" n_hsunits.nc
sea_nc "occurrence units furlongs" "n_occunits.nc: variable 'occurrence'" n_occunits.nc
sea_nc "NaN occurrence" "n_nan.nc" n_nan.nc
sea_nc "negative occurrence" "n_neg.nc" n_neg.nc
sea_nc "bins not contiguous" "n_gap.nc: variable 'hs_bounds'" n_gap.nc
sea_nc "unknown period standard_name" "n_stdname.nc: variable 'period'" n_stdname.nc
sea_nc "negative depth" "n_depth.nc: variable 'depth': water depth -25 m, expected > 0" n_depth.nc
sea_nc "no occurrence variable" "n_occdims.nc: variable 'occurrence'" n_occdims.nc
sea_nc "mismatched dimension sizes" "n_mism.nc: variable 'hs_bounds'" n_mism.nc
sea_nc "truncated file" "n_trunc.nc" n_trunc.nc
sea_nc "text file named .nc" "n_text.nc" n_text.nc
# A damaged classic header on which NetCDF-C 4.9.0 itself crashes inside nc_open (found by
# fuzz_climate_nc; the header is probed in a child process, src/core/ncopen.c).
cp "$src/fuzz/corpus/fuzz_climate_nc/header-crash-netcdf-c" "$d/n_crash.nc"
sea_nc "header that crashes the NetCDF library" "n_crash.nc: cannot open as NetCDF: the NetCDF library failed reading its header" n_crash.nc
sea_nc "10^8 x 10^8 bins declared in a tiny file" "n_huge.nc: dimensions hs x period x direction = 100000000 x 100000000 x 0 declare 1e+16 bins, above the limit of 10000000 (SY_CLIMATE_MAX_CELLS" n_huge.nc
: >"$d/n_empty.nc"
sea_nc "empty file" "n_empty.nc" n_empty.nc
mkdir -p "$d/n_dir.nc"
sea_nc "a directory" "n_dir.nc: is a directory, expected a file" n_dir.nc
sea_nc "missing file" "n_none.nc: cannot open" n_none.nc
sed "s|^climate = .*|climate = $d/n_trunc.nc|" "$d/good.ini" >"$d/ntrunc.ini"
bad "scatter NetCDF: truncated file as a run's climate (run)" run "n_trunc.nc" -- "$prog" run "$d/ntrunc.ini" -o "$tmp/out" --quiet
sed "s|^climate = .*|climate = $d/n_huge.nc|" "$d/good.ini" >"$d/nhuge.ini"
bad "scatter NetCDF: huge declared table as a run's climate (run)" run "n_huge.nc: dimensions hs x period" -- "$prog" run "$d/nhuge.ini" -o "$tmp/out" --quiet
sed "s|^climate = .*|climate = $d/n_hsunits.nc|" "$d/good.ini" >"$d/nunits.ini"
bad "scatter NetCDF: wrong units as a project's climate (check)" check "n_hsunits.nc: variable 'hs'" -- "$prog" check "$d/nunits.ini"

hc() { # name expected file
    bad "hindcast: $1 (sea bin)" sea "$2" -- "$prog" sea bin "$d/$3" -o "$tmp/out.nc"
}
hc "Hs units cm" "h_units.nc: variable 'swh'" h_units.nc
hc "time units unparsable" "h_time.nc: variable 'time'" h_time.nc
hc "unknown calendar" "h_cal.nc: variable 'time'" h_cal.nc
hc "time not increasing" "h_order.nc: variable 'time'" h_order.nc
hc "no Hs variable" "h_nohs.nc" h_nohs.nc
hc "mismatched dimension sizes" "h_mism.nc: variable 't_e'" h_mism.nc
hc "truncated file" "h_trunc.nc" h_trunc.nc
hc "3x10^9 records declared in a tiny file" "h_huge.nc: variable 'swh' has 3000000000 records, above the limit of 20000000 (SY_CLIMATE_MAX_RECORDS" h_huge.nc
hc "a directory" "n_dir.nc: is a directory, expected a file" n_dir.nc
hc "missing file" "h_none.nc: cannot open" h_none.nc
bad "hindcast: bad --hs-step (sea bin)" sea "--hs-step" -- "$prog" sea bin "$hindcast" -o "$tmp/out.nc" --hs-step -0.5
bad "hindcast: output is a directory (sea bin)" sea "$tmp/out" -- "$prog" sea bin "$hindcast" -o "$tmp/out"

echo "$ncase cases"
passed && [ "$ncase" -ge 50 ]
