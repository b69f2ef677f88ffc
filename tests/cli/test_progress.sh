#!/usr/bin/env bash
# Progress bars of `swellyield run` (issue 7): drawn on stderr only when stderr is a
# terminal, one per long loop (frequencies: "hydro"; sea states: "sea states"), each
# ending at 100 % with elapsed and remaining time; the same for the pole search
# (`poles`: "poles", one bar per contour); --quiet draws none, and a run whose stderr is a
# file or pipe writes none. The terminal is a pseudo-terminal from
# util-linux `script`. Runs the small invented project of test_run.sh.
source "$2/tests/cli/common.sh"

small_project "$tmp"
# Under `script`, stdout and stderr both go to the terminal; stdout goes to a file here
# so that only stderr is on the terminal (and captured by script into tty.txt).
tty_run() { # tty_run OUTDIR LOG [ARGS...]: run with stderr on a pseudo-terminal
    local out=$1 log=$2
    shift 2
    script -qec "$(printf '%q ' "$prog" run "$tmp/p.ini" -o "$out" "$@") >$tmp/stdout.txt" "$log" >/dev/null </dev/null
}

tty_run "$tmp/out1" "$tmp/tty1.txt"
ok $? "run with stderr on a terminal exits 0"
# The last redraw of each bar (after the last carriage return of its line).
bars=$(tr '\r' '\n' <"$tmp/tty1.txt" | grep -a '\] ')
echo "$bars" | grep -a '^hydro' | tail -1 | grep -aqE '\] 100%  [0-9]+/[0-9]+  [0-9.]+s elapsed, [0-9.]+s left'
ok $? "frequency bar ends at 100 % with elapsed and remaining time"
echo "$bars" | grep -a '^sea states' | tail -1 | grep -aqE '\] 100%  ([0-9]+)/\1  [0-9.]+s elapsed, 0.0s left'
ok $? "sea-state bar ends at 100 % (done = total) with elapsed and 0.0 s left"
grep -aq 'annual' "$tmp/stdout.txt"
ok $? "the summary still goes to stdout"

tty_run "$tmp/out2" "$tmp/tty2.txt" --quiet
ok $? "run --quiet on a terminal exits 0"
! grep -aq 'elapsed' "$tmp/tty2.txt"
ok $? "--quiet: no progress bar"

# (In the sanitizer build LeakSanitizer would list the suppressions it used on stderr.)
LSAN_OPTIONS="${LSAN_OPTIONS:-}:print_suppressions=0" \
    "$prog" run "$tmp/p.ini" -o "$tmp/out3" >/dev/null 2>"$tmp/stderr3.txt"
ok $? "run with stderr to a file exits 0"
[ ! -s "$tmp/stderr3.txt" ]
ok $? "stderr not a terminal: nothing written to it"

# The pole search (the region of test_run.sh's resonance case).
printf '[resonance]\nregion = 1.0:1.8:0.2\nq_threshold = 2\n' >>"$tmp/p.ini"
script -qec "$(printf '%q ' "$prog" poles "$tmp/p.ini" -o "$tmp/poles.csv") >$tmp/stdout.txt" "$tmp/tty4.txt" >/dev/null </dev/null
ok $? "poles with stderr on a terminal exits 0"
tr '\r' '\n' <"$tmp/tty4.txt" | grep -a '^poles  ' | tail -1 | grep -aqE '\] 100%  ([0-9]+)/\1  [0-9.]+s elapsed, 0.0s left'
ok $? "contour bar ends at 100 % (points done = points on the contour)"

passed
