#!/usr/bin/env python3
"""Scale and edge sizes.

- A generated 500 people x 31 days x 6 shifts scenario loads, solves (work bounded by
  ROTAWEAVE_SCALE_GENERATIONS generations, default 1, with a far time cap) and reports, with a
  peak memory (largest resident set of the child processes) under 2 GiB. The time it took is
  printed, not judged: keeping the time limit is measured by `rotaweave-bench limits`.
- A 1-day scenario and a 1-person scenario each give a valid roster (exit 0 or 1), or a clear
  message (exit 2 naming the file).

Environment: ROTAWEAVE (binary), ROTAWEAVE_WORK (scratch folder to create),
ROTAWEAVE_SCALE_GENERATIONS (generations of the large run).
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
GENERATIONS = int(os.environ.get("ROTAWEAVE_SCALE_GENERATIONS", "1"))
MEMORY_LIMIT_KIB = 2 * 1024 * 1024
TIME_CAP = 900  # seconds; far above what the bounded work needs

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


def run(scenario, out, generations):
    start = time.monotonic()
    p = subprocess.run([BINARY, "solve", scenario, "--out", out, "--generations", str(generations), "--time-limit", str(TIME_CAP),
                        "--seed", "3", "--quiet"], capture_output=True, text=True, timeout=TIME_CAP + 120)
    return p, time.monotonic() - start


def large():
    people, days, shifts = 500, 31, 6
    scenario = write_scenario(os.path.join(WORK, "large.yaml"), people, days, shifts=shifts, seed=5)
    out = os.path.join(WORK, "out-large")
    p, took = run(scenario, out, GENERATIONS)
    check(p.returncode in (0, 1), f"500x31x6: exit {p.returncode} is 0 or 1 after {GENERATIONS} generation(s), {took:.1f} s; "
          f"stderr: {p.stderr[-400:]}")
    peak = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss  # KiB on Linux
    check(peak < MEMORY_LIMIT_KIB, f"500x31x6: peak memory {peak / 1024:.0f} MiB (limit 2048 MiB)")
    if p.returncode in (0, 1):
        check_roster(out, people, days, "500x31x6")


def edge(label, people, days, shifts):
    scenario = write_scenario(os.path.join(WORK, f"{label}.yaml"), people, days, shifts=shifts, seed=9)
    out = os.path.join(WORK, f"out-{label}")
    p, _ = run(scenario, out, 1)
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
