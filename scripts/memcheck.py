#!/usr/bin/python3
"""The whole ctest suite under valgrind memcheck (docs/robustness.md, "Valgrind").

Every test ctest knows (C executables, the bash CLI tests, the Python tests) is run with
its own command, environment and working folder, but against a shadow of the build
folder in which each test executable and the program are small scripts that exec the
real binary under valgrind. So the bash and Python tests, which start the program and
test executables themselves, run every one of those processes under memcheck too; only
bash, Python and the tools they call (netCDF4, ncdump) are not checked.

A test passes when its own exit status is 0 AND valgrind reported nothing: valgrind runs
with -q and --log-file, so any non-empty log is an error (an invalid read, a use of an
uninitialised value, a definite or possible leak...). The logs stay in the log folder.
Third-party reports are suppressed by tests/valgrind.supp (each entry commented).

Environment for speed, not for hiding anything: OPENBLAS_NUM_THREADS=1 (OpenBLAS's own
thread pool spins while idle, which valgrind, running one thread at a time, turns into
minutes; our code has no OpenBLAS-threaded path of its own) and OMP_WAIT_POLICY=passive
(the same for libgomp's idle threads); OMP_NUM_THREADS stays 2 so our OpenMP sweeps still
run with two threads. OPENBLAS_CORETYPE=Nehalem picks OpenBLAS's SSE kernels instead of
its AVX2/FMA ones: valgrind emulates each FMA instruction through a helper call, so a
zgetrf of order 200 runs 2.4 times faster under memcheck with the same result; the
kernels are OpenBLAS's, not ours, and our own code is checked the same either way.

Usage: /usr/bin/python3 scripts/memcheck.py [-j N] [--timeout S] [--logs DIR] [--origins]
                                            [BUILD [REGEX]]
"""
import argparse
import concurrent.futures
import json
import os
import re
import shutil
import signal
import subprocess
import sys
import tempfile
import time

SRC = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))


def wrapper(path, real, logs, name, vg):
    """A script at `path` running `real` under valgrind, logging to logs/name-<pid>.log."""
    args = " ".join(vg + ["--log-file=%s/%s-%%p.log" % (logs, name)])
    with open(path, "w") as f:
        f.write('#!/bin/sh\nexec valgrind %s "%s" "$@"\n' % (args, real))
    os.chmod(path, 0o755)


def shadow(build, logs, vg):
    """A folder mirroring `build` (symlinks) whose bin/swellyield and tests/* executables
    are valgrind wrappers."""
    root = tempfile.mkdtemp(prefix="sy-memcheck-")
    for entry in os.listdir(build):
        if entry not in ("bin", "tests"):
            os.symlink(os.path.join(build, entry), os.path.join(root, entry))
    for sub in ("bin", "tests"):
        os.mkdir(os.path.join(root, sub))
        for entry in os.listdir(os.path.join(build, sub)):
            real = os.path.join(build, sub, entry)
            dst = os.path.join(root, sub, entry)
            if os.path.isfile(real) and os.access(real, os.X_OK):
                wrapper(dst, real, logs, entry, vg)
            else:
                os.symlink(real, dst)
    return root


def probe_child(path):
    """True if the log at `path` is that of a NetCDF probe child (src/core/ncopen.c) that
    crashed inside NetCDF-C on a damaged file: the crash containment working as designed.
    Such a child forks from the program, calls nc_open on the file and may die there (the
    parent then refuses the file with a one-line error, which the test checks). Its log is
    accepted when the process was killed by a signal with syi_nc_open on the stack and
    every error before (invalid reads and writes inside the library's header reader) has
    syi_nc_open on its stack too; its leak records are those of a process stopped in the
    middle of a call, not a finding. Any other content makes the log an error."""
    text = open(path, errors="replace").read()
    blocks, cur = [], []
    for line in text.splitlines():
        body = re.sub(r"^==\d+== ?", "", line)
        if body.strip() == "":
            if cur:
                blocks.append(cur)
            cur = []
        else:
            cur.append(body)
    if cur:
        blocks.append(cur)
    crashed = any(b[0].startswith("Process terminating with default action of signal") and
                  any("syi_nc_open" in l for l in b) for b in blocks)
    if not crashed:
        return False
    for b in blocks:
        head = b[0]
        if head.startswith("Process terminating") or " lost in loss record " in head:
            continue
        if not any("syi_nc_open" in l for l in b):
            return False
    return True


def run_one(test, build, root, logs, timeout):
    name = test["name"]
    props = {p["name"]: p["value"] for p in test.get("properties", [])}
    swap = lambda s: s.replace(build, root)
    cmd = [swap(c) for c in test["command"]]
    env = dict(os.environ)
    for kv in props.get("ENVIRONMENT", []):
        k, v = kv.split("=", 1)
        env[k] = swap(v)
    env.update(OPENBLAS_NUM_THREADS="1", OMP_WAIT_POLICY="passive", OMP_NUM_THREADS="2",
               OPENBLAS_CORETYPE="Nehalem")
    before = set(os.listdir(logs))
    t0 = time.time()
    try:
        r = subprocess.run(cmd, cwd=props.get("WORKING_DIRECTORY", build), env=env,
                           stdout=subprocess.PIPE, stderr=subprocess.STDOUT, timeout=timeout)
        rc, out = r.returncode, r.stdout.decode(errors="replace")
    except subprocess.TimeoutExpired as e:
        rc, out = "timeout", (e.stdout or b"").decode(errors="replace")
    dt = time.time() - t0
    new = sorted(set(os.listdir(logs)) - before)
    dirty = [f for f in new if os.path.getsize(os.path.join(logs, f)) > 0]
    probes = [f for f in dirty if probe_child(os.path.join(logs, f))]
    dirty = [f for f in dirty if f not in probes]
    return name, rc, dt, len(new), dirty, out, probes


def main():
    ap = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    ap.add_argument("build", nargs="?", default=os.path.join(SRC, "build"))
    ap.add_argument("regex", nargs="?", default=".")
    ap.add_argument("-j", type=int, default=2)
    ap.add_argument("--timeout", type=float, default=3600)
    ap.add_argument("--logs", default=None)
    ap.add_argument("--origins", action="store_true", help="valgrind --track-origins=yes")
    ap.add_argument("--shortest-first", action="store_true",
                    help="run the quick tests first (most results early on a busy machine)")
    a = ap.parse_args()
    build = os.path.abspath(a.build)
    logs = os.path.abspath(a.logs or os.path.join(build, "memcheck-logs"))
    shutil.rmtree(logs, ignore_errors=True)
    os.makedirs(logs)
    # --track-origins=yes (where an uninitialised value came from) roughly doubles the
    # time and finds nothing more: add it with --origins when diagnosing a report.
    vg = ["-q", "--error-exitcode=99", "--leak-check=full",
          "--suppressions=%s/tests/valgrind.supp" % SRC] + (["--track-origins=yes"] if a.origins else [])
    listing = subprocess.run(["ctest", "--test-dir", build, "--show-only=json-v1"],
                             check=True, stdout=subprocess.PIPE).stdout
    tests = [t for t in json.loads(listing)["tests"] if re.search(a.regex, t["name"])]
    # Longest first (ctest's own timings of the last run), so -j 2 ends with short tests;
    # or the reverse.
    cost = {}
    cost_file = os.path.join(build, "Testing", "Temporary", "CTestCostData.txt")
    if os.path.exists(cost_file):
        for line in open(cost_file):
            f = line.split()
            if len(f) == 3:
                cost[f[0]] = float(f[2])
    tests.sort(key=lambda t: cost.get(t["name"], 0.0), reverse=not a.shortest_first)
    # Each test gets its own shadow folder and log subfolder, so the valgrind logs of
    # tests running side by side never mix.
    status = 0
    roots = []
    t_all = time.time()
    # Stopped (SIGTERM) or not, the shadow folders go.
    signal.signal(signal.SIGTERM, lambda *_: sys.exit(143))
    try:
        status = run_all(a, tests, build, logs, vg, roots)
    finally:
        for r in roots:
            shutil.rmtree(r, ignore_errors=True)
    print("memcheck: %d tests, %s, %.0f s wall (-j %d)" % (
        len(tests), "all clean" if status == 0 else "FAILURES", time.time() - t_all, a.j))
    return status


def run_all(a, tests, build, logs, vg, roots):
    status = 0
    with concurrent.futures.ThreadPoolExecutor(max_workers=max(1, a.j)) as pool:
        futs = []
        for t in tests:
            sub = os.path.join(logs, re.sub(r"[^A-Za-z0-9_.-]", "_", t["name"]))
            os.makedirs(sub)
            troot = shadow(build, sub, vg)
            roots.append(troot)
            futs.append(pool.submit(run_one, t, build, troot, sub, a.timeout))
        for f in concurrent.futures.as_completed(futs):
            name, rc, dt, nproc, dirty, out, probes = f.result()
            ok = rc == 0 and not dirty
            status |= not ok
            print("%-34s %s  %7.1f s  %3d processes%s%s" % (
                name, "clean" if ok else "FAILED", dt, nproc,
                "" if ok else "  (exit %s; valgrind logs with errors: %s)" % (rc, ", ".join(dirty) or "none"),
                "" if not probes else "  (%d NetCDF probe child(ren) stopped inside NetCDF-C, contained: %s)" % (
                    len(probes), ", ".join(probes))),
                flush=True)
            if rc != 0:
                sys.stdout.write("".join("    | " + l + "\n" for l in out.splitlines()[-15:]))
    return status


if __name__ == "__main__":
    sys.exit(main())
