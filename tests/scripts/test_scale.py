#!/usr/bin/env python3
"""Scale and edge sizes.

- A generated 500 people x 31 days x 6 shifts scenario loads, solves within a bounded time
  (--time-limit ROTAWEAVE_SCALE_SECONDS, default 60, as the issue asks) and reports, with a peak memory (largest
  resident set of the child processes) under 2 GiB.
- A 1-day scenario and a 1-person scenario each give a valid roster (exit 0 or 1), or a clear
  message (exit 2 naming the file).

Environment: ROTAWEAVE (binary), ROTAWEAVE_WORK (scratch folder to create),
ROTAWEAVE_SCALE_SECONDS (search time of the large run).
"""
import csv
import json
import os
import resource
import shutil
import subprocess
import sys
import time

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from scenario_gen import write_scenario  # noqa: E402

BINARY = os.path.abspath(os.environ.get("ROTAWEAVE", "build/rotaweave"))
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-scale")
SECONDS = float(os.environ.get("ROTAWEAVE_SCALE_SECONDS", "60"))
MEMORY_LIMIT_KIB = 2 * 1024 * 1024
# Loading, construction and writing the outputs may take this long on top of the search.
SLACK_SECONDS = 60

failures = []


def check(ok, what):
    print(("ok   " if ok else "FAIL ") + what)
    if not ok:
        failures.append(what)


def check_roster(out, people, days, label):
    path = os.path.join(out, "roster.csv")
    if not os.path.isfile(path):
        return check(False, f"{label}: roster.csv written")
    with open(path, encoding="utf-8", newline="") as f:
        rows = list(csv.reader(f))
    check(len(rows) == people + 1 and all(len(r) == days + 1 for r in rows),
          f"{label}: roster.csv is {people} rows x {days} days")
    with open(os.path.join(out, "report.json"), encoding="utf-8") as f:
        data = json.load(f)
    check("summary" in data and "violations" in data, f"{label}: report.json has summary and violations")
    check(os.path.getsize(os.path.join(out, "report.txt")) > 0, f"{label}: report.txt written")


def run(scenario, out, seconds, label):
    start = time.monotonic()
    p = subprocess.run([BINARY, "solve", scenario, "--out", out, "--time-limit", str(seconds), "--seed", "3", "--quiet"],
                       capture_output=True, text=True, timeout=seconds + 10 * SLACK_SECONDS)
    return p, time.monotonic() - start


def large():
    people, days, shifts = 500, 31, 6
    scenario = write_scenario(os.path.join(WORK, "large.yaml"), people, days, shifts=shifts, seed=5)
    out = os.path.join(WORK, "out-large")
    p, took = run(scenario, out, SECONDS, "large")
    check(p.returncode in (0, 1), f"500x31x6: exit {p.returncode} is 0 or 1; stderr: {p.stderr[-400:]}")
    check(took < SECONDS + SLACK_SECONDS, f"500x31x6: finished in {took:.1f} s (search limit {SECONDS:g} s + {SLACK_SECONDS} s)")
    peak = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss  # KiB on Linux
    check(peak < MEMORY_LIMIT_KIB, f"500x31x6: peak memory {peak / 1024:.0f} MiB (limit 2048 MiB)")
    if p.returncode in (0, 1):
        check_roster(out, people, days, "500x31x6")


def edge(label, people, days, shifts):
    scenario = write_scenario(os.path.join(WORK, f"{label}.yaml"), people, days, shifts=shifts, seed=9)
    out = os.path.join(WORK, f"out-{label}")
    p, _ = run(scenario, out, 5, label)
    if p.returncode == 2:
        msg = p.stderr.strip()
        check(f"{label}.yaml" in msg and "internal error" not in msg, f"{label}: rejected with a clear message: {msg[:300]}")
        check(not os.path.exists(out) or not os.listdir(out), f"{label}: nothing written when rejected")
    else:
        check(p.returncode in (0, 1), f"{label}: exit {p.returncode} is 0, 1 or 2; stderr: {p.stderr[-400:]}")
        if p.returncode in (0, 1):
            check_roster(out, people, days, label)


def main():
    if os.path.exists(WORK):
        shutil.rmtree(WORK)
    os.makedirs(WORK)
    large()
    edge("one-day", 12, 1, 3)
    edge("one-person", 1, 31, 3)
    edge("one-person-one-day", 1, 1, 1)
    print(f"{len(failures)} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
