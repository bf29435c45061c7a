#!/usr/bin/env python3
"""Interruption and unwritable output.

1. `solve` on a generated 40-person, 31-day scenario with --time-limit 60, interrupted after
   about 3 s by SIGINT and, in a second run, by SIGTERM: it must exit within 5 s of the signal with
   status 0 or 1 and leave complete roster.csv, report.json (valid JSON) and report.txt, and no
   temporary files (names starting with '.').
2. --out under an existing regular file, or naming one: exit 2, a clear message, nothing written
   and the file untouched.

Environment: ROTAWEAVE (binary), ROTAWEAVE_WORK (scratch folder to create).
"""
import csv
import json
import os
import shutil
import signal
import subprocess
import sys
import time

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from scenario_gen import write_scenario  # noqa: E402

BINARY = os.path.abspath(os.environ.get("ROTAWEAVE", "build/rotaweave"))
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-signals")
PEOPLE, DAYS = 40, 31

failures = []


def check(ok, what):
    print(("ok   " if ok else "FAIL ") + what)
    if not ok:
        failures.append(what)


def hidden_files(folder):
    return [os.path.join(r, n) for r, ds, fs in os.walk(folder) for n in ds + fs if n.startswith(".")]


def check_outputs(out, label):
    roster = os.path.join(out, "roster.csv")
    check(os.path.isfile(roster), f"{label}: roster.csv written")
    if os.path.isfile(roster):
        with open(roster, encoding="utf-8", newline="") as f:
            rows = list(csv.reader(f))
        check(len(rows) == PEOPLE + 1, f"{label}: roster.csv has a header and {PEOPLE} rows (found {len(rows)})")
        check(all(len(r) == DAYS + 1 for r in rows), f"{label}: every roster row has {DAYS + 1} cells")
        check(rows and rows[0][0] == "staff", f"{label}: roster header starts with 'staff'")
    report = os.path.join(out, "report.json")
    check(os.path.isfile(report), f"{label}: report.json written")
    if os.path.isfile(report):
        try:
            with open(report, encoding="utf-8") as f:
                data = json.load(f)
            ok = isinstance(data.get("summary"), dict) and isinstance(data.get("violations"), list)
            check(ok, f"{label}: report.json is valid JSON with summary and violations")
        except ValueError as e:
            check(False, f"{label}: report.json is valid JSON ({e})")
    text = os.path.join(out, "report.txt")
    check(os.path.isfile(text), f"{label}: report.txt written")
    if os.path.isfile(text):
        with open(text, encoding="utf-8") as f:
            body = f.read()
        # The caution closes every report: its presence shows the file was written to the end.
        check("Caution" in body.strip().splitlines()[-1] if body.strip() else False,
              f"{label}: report.txt is complete (ends with the caution)")
    check(not hidden_files(out), f"{label}: no temporary files left ({hidden_files(out)})")


def interrupted_run(scenario, sig, label):
    out = os.path.join(WORK, f"out-{label}")
    cmd = [BINARY, "solve", scenario, "--out", out, "--time-limit", "60", "--stall", "0", "--seed", "7", "--quiet"]
    proc = subprocess.Popen(cmd, stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    time.sleep(3)
    check(proc.poll() is None, f"{label}: still searching after 3 s")
    sent = time.monotonic()
    proc.send_signal(sig)
    try:
        stdout, stderr = proc.communicate(timeout=30)
    except subprocess.TimeoutExpired:
        proc.kill()
        stdout, stderr = proc.communicate()
        check(False, f"{label}: exits after the signal (killed after 30 s)")
        return
    waited = time.monotonic() - sent
    check(waited < 5, f"{label}: exits {waited:.1f} s after the signal (limit 5 s)")
    check(proc.returncode in (0, 1), f"{label}: exit status {proc.returncode} is 0 or 1; stderr: {stderr.decode()[-300:]}")
    check_outputs(out, label)


def unwritable_outputs(scenario):
    blocker = os.path.join(WORK, "a-regular-file")
    with open(blocker, "w") as f:
        f.write("not a folder\n")
    for label, out in [("out under a regular file", os.path.join(blocker, "out")), ("out is a regular file", blocker)]:
        p = subprocess.run([BINARY, "solve", scenario, "--out", out, "--time-limit", "2", "--quiet"],
                           capture_output=True, text=True, timeout=60)
        check(p.returncode == 2, f"{label}: exit 2 (got {p.returncode})")
        msg = p.stderr.strip()
        check(out in msg and "output folder" in msg and "--out" in msg,
              f"{label}: message names the folder and says what to do: {msg[:300]}")
        check("internal error" not in msg, f"{label}: not reported as an internal error")
        with open(blocker) as f:
            check(f.read() == "not a folder\n", f"{label}: the regular file is untouched")
        strays = [n for n in os.listdir(WORK) if n not in ("scenario.yaml", "a-regular-file") and not n.startswith("out-")]
        check(not strays, f"{label}: nothing else written ({strays})")


def main():
    if os.path.exists(WORK):
        shutil.rmtree(WORK)
    os.makedirs(WORK)
    scenario = write_scenario(os.path.join(WORK, "scenario.yaml"), PEOPLE, DAYS, shifts=3, seed=11)
    interrupted_run(scenario, signal.SIGINT, "SIGINT")
    interrupted_run(scenario, signal.SIGTERM, "SIGTERM")
    unwritable_outputs(scenario)
    print(f"{len(failures)} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
