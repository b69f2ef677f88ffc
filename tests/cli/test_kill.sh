#!/usr/bin/env bash
# Atomic outputs under kill: `swellyield run` on a small invented project (the pattern of
# test_run.sh: 2 floats, the invented sheltered site, 20 frequencies) into a folder that
# already holds an earlier run's outputs, killed by SIGINT and by SIGKILL at several
# moments. The folder must then hold exactly the earlier files or exactly the new ones
# (summary.json equal to the old one or to a reference full run; same file set; no
# temporary file), never a mix. A re-run after each kill must remove the dead process's
# staging folder, reuse the cache blocks the killed run left (not rewrite them), and
# reproduce the reference summary.json byte for byte. Our own contract (outputs.h).
source "$2/tests/cli/common.sh"

small_project "$tmp"
sed -i 's/^omega = .*/omega = 0.3:2.8:20/' "$tmp/p.ini" # 20 frequencies
# The earlier run: another PTO damping and frequency grid, so every output differs.
sed 's/^damping = .*/damping = 9e4/; s/^omega = .*/omega = 0.3:2.8:14/' "$tmp/p.ini" >"$tmp/old.ini"

t0=$(date +%s%N)
"$prog" run "$tmp/p.ini" -o "$tmp/ref" --quiet >/dev/null 2>&1
ok $? "reference run exits 0"
ms=$((($(date +%s%N) - t0) / 1000000))
# Kill moments as fractions of the reference run's wall time (so they land in the hydro
# sweep, the yield and near the swap alike in fast and in sanitizer builds).
delays=$(awk -v t="$ms" 'BEGIN { printf "%.3f %.3f %.3f %.3f", 0.05 * t / 1e3, 0.2 * t / 1e3, 0.5 * t / 1e3, 0.85 * t / 1e3 }')
echo "reference run: $ms ms; kill after $delays s"
"$prog" run "$tmp/old.ini" -o "$tmp/old" --quiet >/dev/null 2>&1
ok $? "earlier run exits 0"
cmp -s "$tmp/ref/summary.json" "$tmp/old/summary.json"
[ $? -ne 0 ]; ok $? "earlier and new summary.json differ (so the test can tell them apart)"
files() { (cd "$1" && find . -path ./cache -prune -o -type f -print | sort); }
same_as() { # folder reference: same file set outside cache/, every file byte-equal
    [ "$(files "$1")" = "$(files "$2")" ] || return 1
    local f
    for f in $(files "$2"); do cmp -s "$1/$f" "$2/$f" || return 1; done
}

n_old=0 n_new=0 n_cached=0 n_stale=0
for sig in INT KILL; do
    for delay in $delays; do
        rm -rf "$tmp/out"
        cp -a "$tmp/old" "$tmp/out"
        # A non-interactive shell starts background jobs with SIGINT ignored; env puts
        # back the default action so SIGINT reaches the program as from a terminal.
        env --default-signal=INT "$prog" run "$tmp/p.ini" -o "$tmp/out" --quiet >/dev/null 2>&1 &
        pid=$!
        sleep "$delay"
        kill -s "$sig" "$pid" 2>/dev/null
        wait "$pid" 2>/dev/null
        what="SIG$sig after $delay s"
        if same_as "$tmp/out" "$tmp/old"; then
            n_old=$((n_old + 1)); state=old
        elif cmp -s "$tmp/out/summary.json" "$tmp/ref/summary.json" && [ "$(files "$tmp/out")" = "$(files "$tmp/ref")" ]; then
            n_new=$((n_new + 1)); state=new
        else
            state=mixed
        fi
        [ "$state" != mixed ]; ok $? "$what: folder holds exactly the old or the new outputs ($state)"
        left=$(find "$tmp/out" -name '.*.tmp-*' ! -path '*/cache/*' | head -n 3)
        [ -z "$left" ]; ok $? "$what: no half-written file among the outputs ($left)"
        # Cache blocks the killed run completed, with their inode and time: a resume reuses them.
        # (The earlier run's own blocks, for its other settings, are left out.)
        before=$(cd "$tmp/out" && stat -c '%n %i %Y' cache/*.nc 2>/dev/null | grep -v -F -f <(cd "$tmp/old" && ls cache) | sort)
        [ -n "$before" ] && n_cached=$((n_cached + 1))
        ls -d "$tmp"/out.partial-* >/dev/null 2>&1 && n_stale=$((n_stale + 1))
        "$prog" run "$tmp/p.ini" -o "$tmp/out" --quiet >/dev/null 2>&1
        ok $? "$what: re-run exits 0"
        cmp -s "$tmp/out/summary.json" "$tmp/ref/summary.json"
        ok $? "$what: re-run reproduces the reference summary.json byte for byte"
        after=$(cd "$tmp/out" && stat -c '%n %i %Y' cache/*.nc 2>/dev/null | sort)
        kept=$(comm -23 <(printf '%s\n' "$before" | sed '/^$/d') <(printf '%s\n' "$after"))
        [ -z "$kept" ]; ok $? "$what: re-run reused the killed run's cache blocks unchanged ($(printf '%s' "$before" | grep -c .) blocks)"
        left=$(find "$tmp/out" -name '.*.tmp-*' | head -n 3)
        [ -z "$left" ]; ok $? "$what: re-run removed the dead run's temporaries in cache/ ($left)"
        stale=$(ls -d "$tmp"/out.partial-* 2>/dev/null)
        [ -z "$stale" ]; ok $? "$what: re-run removed the dead run's staging folder ($stale)"
    done
done
echo "kills that left the old outputs: $n_old, the new ones: $n_new; with new cache blocks: $n_cached; with a staging folder: $n_stale"
[ "$n_cached" -gt 0 ]; ok $? "at least one kill left new cache blocks, so resuming was exercised"
[ "$n_stale" -gt 0 ]; ok $? "at least one kill left a staging folder, so its removal was exercised"

passed
