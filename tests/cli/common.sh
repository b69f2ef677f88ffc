# Sourced by every tests/cli/test_*.sh (not a test itself): what they all start with.
# It takes the caller's arguments, $1 the program and $2 the source tree, and gives:
#   prog, src, py (the Debian Python with scipy/netCDF4), tmp (a folder removed at exit),
#   pass/fail counters, ok STATUS NAME (count and print one check), passed (the summary
#   line; true when nothing failed), small_project DIR (the main-job tests' project).
set -u
prog=$1
src=$2
py=${SY_PYTHON:-/usr/bin/python3}
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
pass=0 fail=0
ok() { if [ "$1" -eq 0 ]; then echo "PASS: $2"; pass=$((pass + 1)); else echo "FAIL: $2"; fail=$((fail + 1)); fi; }
passed() {
    echo "$pass passed, $fail failed"
    [ "$fail" -eq 0 ]
}

# The small invented project of the main-job tests, 2 floats at the invented sheltered site.
# small_project DIR: writes DIR/layout.csv and DIR/p.ini (26 frequencies, 12 headings).
small_project() {
    printf 'name,x,y\nP1,0,0\nP2,30,12\n' >"$1/layout.csv"
    cat >"$1/p.ini" <<INI
; invented test project
[site]
depth = 25
climate = $src/seastates/sheltered_site.nc
[device]
shape = float
radius = 4
draft = 3
[pto]
damping = 1.5e5
efficiency = 0.75
rated_power = 3e5
max_stroke = 3
tuning = site_optimal
[layout]
file = layout.csv
[sea]
spectrum = bretschneider
[solve]
omega = 0.3:2.8:26
headings = 0:330:12
tolerance = 1e-4
INI
}
