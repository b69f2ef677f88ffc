#!/usr/bin/env bash
# The main job end to end on a small invented project (2 floats, invented sheltered
# site): the files of outputs.h exist with the summary keys the issue names, a re-run
# from the cache reproduces summary.json byte for byte, a failed run leaves the earlier
# outputs untouched, and bad input (zero total occurrence) writes nothing.
source "$2/tests/cli/common.sh"

small_project "$tmp"

"$prog" run "$tmp/p.ini" -o "$tmp/out" --quiet >"$tmp/stdout" 2>"$tmp/stderr"
ok $? "run exits 0"
for f in summary.json power_matrix.nc power_matrix.csv devices.csv hydro.nc; do
    [ -s "$tmp/out/$f" ]; ok $? "output $f written"
done
grep -q "Defer to the IEC TS 62600 series" "$tmp/stdout"; ok $? "human summary states the cautions"
"$py" - "$tmp/out/summary.json" <<'PY'
import json, math, sys
s = json.load(open(sys.argv[1]))
need = ["annual_energy_mwh", "q_factor", "mean_power_kw", "capacity_factor", "devices", "strategies", "cautions"]
missing = [k for k in need if k not in s]
assert not missing, missing
assert s["strategy"] == "site_optimal"
assert len(s["devices"]) == 2 and all(k in s["devices"][0] for k in ["name", "annual_energy_mwh", "mean_power_kw", "q_factor"])
# Array energy is the sum of the devices' (same strategy), and mean power = energy / 8766 h.
tot = sum(d["annual_energy_mwh"] for d in s["devices"])
assert abs(tot - s["annual_energy_mwh"]) <= 1e-9 * tot, (tot, s["annual_energy_mwh"])
assert abs(s["mean_power_kw"] - s["annual_energy_mwh"] * 1e3 / 8766) <= 1e-9 * s["mean_power_kw"]
# The bound is a ceiling for every strategy.
b = s["strategies"]["reactive_bound"]["annual_energy_mwh"]
assert all(s["strategies"][k]["annual_energy_mwh"] <= b for k in ["fixed", "per_sea_state", "site_optimal"])
PY
ok $? "summary.json: keys, device sum, mean power, bound is a ceiling"
cp "$tmp/out/summary.json" "$tmp/first.json"
"$prog" run "$tmp/p.ini" -o "$tmp/out" --quiet >/dev/null 2>&1
ok $? "re-run exits 0"
cmp -s "$tmp/first.json" "$tmp/out/summary.json"; ok $? "re-run from the cache reproduces summary.json byte for byte"
ls "$tmp/out/cache"/*.nc >/dev/null 2>&1; ok $? "cache kept in the output folder"

# A run that fails on bad input leaves the earlier outputs as they were.
"$py" - "$src/seastates/sheltered_site.nc" "$tmp/zero.nc" <<'PY'
import shutil, sys, netCDF4
shutil.copy(sys.argv[1], sys.argv[2])
with netCDF4.Dataset(sys.argv[2], "a") as d:
    d["occurrence"][:] = 0.0
PY
sed "s|climate = .*|climate = $tmp/zero.nc|" "$tmp/p.ini" >"$tmp/zero.ini"
"$prog" run "$tmp/zero.ini" -o "$tmp/out" --quiet >/dev/null 2>"$tmp/err"
code=$?
[ "$code" -eq 2 ]; ok $? "zero total occurrence: exit 2 (got $code)"
grep -q "zero.nc" "$tmp/err" && [ "$(wc -l <"$tmp/err")" -eq 1 ]; ok $? "zero total occurrence: one line naming the file ($(head -c 200 "$tmp/err"))"
cmp -s "$tmp/first.json" "$tmp/out/summary.json"; ok $? "earlier outputs untouched after the failed run"
ls -d "$tmp"/out.partial-* >/dev/null 2>&1; [ $? -ne 0 ]; ok $? "no staging folder left behind"

# Resonances: the flagged bands reach summary.json and poles.csv is written.
printf '[resonance]\nregion = 1.0:1.8:0.2\nq_threshold = 2\n' >>"$tmp/p.ini"
"$prog" run "$tmp/p.ini" -o "$tmp/res" --quiet --resonances >/dev/null 2>"$tmp/err"
ok $? "run --resonances exits 0 ($(head -c 200 "$tmp/err"))"
[ -s "$tmp/res/poles.csv" ]; ok $? "poles.csv written"
"$py" - "$tmp/res/summary.json" <<'PY'
import json, sys
s = json.load(open(sys.argv[1]))
assert "found" in s["resonance_search"], s["resonance_search"]
for b in s["flagged_bands"]:
    assert b["omega_min"] < b["pole_re"] < b["omega_max"] or b["omega_min"] <= b["omega_max"]
    assert b["Q"] > 2 and 0 <= b["energy_share"] <= 1, b
    assert all(k in b for k in ["omega_min", "omega_max", "pole_re", "pole_im", "Q", "energy_share"])
print(len(s["flagged_bands"]), "flagged bands")
PY
ok $? "summary.json flagged_bands well formed"
# The time response: written when motion poles were found (poles.csv has a motion row).
if grep -q '^motion,' "$tmp/res/poles.csv"; then
    [ -s "$tmp/res/time_response.png" ] && [ -s "$tmp/res/time_response.csv" ]
    ok $? "time_response.png and .csv written beside poles.csv"
    grep -q 'time_response.png' "$tmp/res/report.md"; ok $? "report.md links the time response"
fi

passed
