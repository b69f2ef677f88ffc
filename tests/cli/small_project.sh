# Sourced by tests/cli/test_run.sh and test_kill.sh (not a test itself): the small invented
# project of the main-job tests, 2 floats at the invented sheltered site.
# small_project DIR SRC: writes DIR/layout.csv and DIR/p.ini (26 frequencies, 12 headings).
small_project() {
    printf 'name,x,y\nP1,0,0\nP2,30,12\n' >"$1/layout.csv"
    cat >"$1/p.ini" <<INI
; invented test project
[site]
depth = 25
climate = $2/seastates/sheltered_site.nc
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
