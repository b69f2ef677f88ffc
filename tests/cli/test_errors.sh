#!/usr/bin/env bash
# The program's contract for bad input and usage: exit code 2, one line on stderr of the
# form "swellyield: <verb>: <message>" naming the file/line or option, and nothing
# written. Our own contract (DEVELOPERS.md), not an outside reference.
source "$2/tests/cli/common.sh"

check() { # name expected_exit expected_substring -- command...
    local name=$1 want=$2 text=$3
    shift 4
    local out err code
    out=$("$@" 2>"$tmp/stderr")
    code=$?
    err=$(head -n 1 "$tmp/stderr")
    local nlines
    nlines=$(wc -l <"$tmp/stderr")
    if [ "$code" -eq "$want" ] && [[ "$err" == *"$text"* ]] && { [ "$want" -eq 0 ] || [ "$nlines" -le 1 ]; }; then
        echo "PASS: $name"
        pass=$((pass + 1))
    else
        echo "FAIL: $name (exit $code, want $want; stderr '$err' ($nlines lines), want '$text')"
        fail=$((fail + 1))
    fi
}

cp "$src/examples/demo/layout.csv" "$tmp/layout.csv"
good="[site]
depth = 50
climate = $src/seastates/shelf_site.nc
[device]
shape = float
radius = 5
draft = 4
[pto]
damping = 2e5
[layout]
file = layout.csv
[solve]
omega = 0.5:1.0:3
"
printf '%s' "$good" >"$tmp/good.ini"
printf '%s' "${good/depth = 50/depth = -50}" >"$tmp/neg.ini"
printf '%s' "${good/efficiency/x}[pto2]
" >"$tmp/section.ini"
printf '%s' "${good/climate = $src\/seastates\/shelf_site.nc/climate = nowhere.nc}" >"$tmp/noclimate.ini"
printf 'name,x,y\nA,0,0\nB,3,0\n' >"$tmp/overlap.csv"
printf '%s' "${good/file = layout.csv/file = overlap.csv}" >"$tmp/overlap.ini"

check "no verb" 2 "swellyield: expected a verb" -- "$prog"
check "unknown verb" 2 "swellyield: unknown verb 'frobnicate'" -- "$prog" frobnicate
check "version" 0 "" -- "$prog" --version
check "help" 0 "" -- "$prog" --help
check "check: valid project" 0 "" -- "$prog" check "$tmp/good.ini"
check "check: negative depth" 2 "swellyield: check: $tmp/neg.ini:2: [site] depth must be > 0 m, got -50" -- "$prog" check "$tmp/neg.ini"
check "check: unknown section" 2 "unknown section '[pto2]'" -- "$prog" check "$tmp/section.ini"
check "check: overlapping devices" 2 "overlap.csv:3: devices 'B' and 'A' (line 2) overlap" -- "$prog" check "$tmp/overlap.ini"
check "check: missing file" 2 "swellyield: check: $tmp/missing.ini: cannot open" -- "$prog" check "$tmp/missing.ini"
check "check: a directory" 2 "is a directory, expected a file" -- "$prog" check "$tmp"
check "run: missing climate file" 2 "nowhere.nc" -- "$prog" run "$tmp/noclimate.ini" -o "$tmp/out1" --quiet
if [ -e "$tmp/out1" ] || ls "$tmp" | grep -q partial; then
    echo "FAIL: run with bad input left output behind"; fail=$((fail + 1))
else
    echo "PASS: run with bad input wrote nothing"; pass=$((pass + 1))
fi
check "run: bad --jobs" 2 "--jobs expects a whole number" -- "$prog" run "$tmp/good.ini" --jobs zero
check "hydro: missing -o" 2 "missing -o FILE.nc" -- "$prog" hydro "$tmp/good.ini"
check "sea: unknown action" 2 "unknown action 'plot'" -- "$prog" sea plot x.nc
check "sea: spectrum needs one period" 2 "exactly one of --tp, --te" -- "$prog" sea spectrum --hs 2 --tp 8 --te 7

passed
