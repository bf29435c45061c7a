#!/usr/bin/env python3
"""Absence credit, absences outside the period, PyYAML-written scenarios and report.json's
shortfall fields, as a user sees them.

  - A person on leave needs fewer worked hours: solve gives them fewer shifts than an unpaid
    absence of the same days would, report.json `people` shows worked, credited and counted
    hours, report.txt the same, and no contract-hours breach is charged.
  - An absence wholly outside the period exits 2 naming file and line; one partly outside is
    clipped with a note on stderr and in report.json `notes`.
  - A scenario round-tripped through PyYAML (YAML 1.1) with `off: true` arrives as
    `false: true` and exits 2 with an explanation; `day_off: true` survives the round trip.
  - Every report.json violation has a numeric shortfall and its unit; a rolling-hours breach
    its window; a cover breach its shift and skill; unknown shift ids list the known ones.
Environment: ROTAWEAVE (binary), ROTAWEAVE_SOURCE_DIR (repository), ROTAWEAVE_WORK (scratch).
"""
import json
import os
import shutil
import subprocess
import sys

import yaml

BINARY = os.path.abspath(os.environ.get("ROTAWEAVE", "build/rotaweave"))
WORK = os.path.abspath(os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-absence-credit-test"))
# Work bounded by generations, with a far time cap: the same rosters on a slow or busy machine.
SOLVE = ["--generations", "3", "--time-limit", "900", "--threads", "1", "--quiet", "--seed", "1"]

passed, failed = 0, 0


def check(ok, what):
    global passed, failed
    if ok:
        passed += 1
    else:
        failed += 1
        print("FAIL", what)


def scenario(absence_reason, extra_staff=None, requests=None):
    # Two weeks from Monday 2027-03-01: 10 working days; 80 h minimum = 8 h a working day.
    ana = {"id": "ana", "contract": "ft", "skills": ["rn"],
           "absences": [{"from": "2027-03-01", "to": "2027-03-05", "reason": absence_reason}]}
    if requests:
        ana["requests"] = requests
    staff = [ana] + [{"id": n, "contract": "ft", "skills": ["rn"]} for n in ("ben", "cat", "dee")] + (extra_staff or [])
    return {
        "name": "absence credit",
        "period": {"start": "2027-03-01", "end": "2027-03-14"},
        "shifts": [{"id": "E", "start": "07:00", "end": "15:00"}, {"id": "L", "start": "14:00", "end": "22:00"}],
        "skills": ["rn"],
        "contracts": {"ft": {"hours": {"min": 80, "max": 88}}},
        "staff": staff,
        "demand": [{"shift": "E", "skill": "rn", "min": 1, "target": 2}, {"shift": "L", "skill": "rn", "min": 1, "target": 1}],
        "rules": {"list": [{"kind": "min-rest", "hours": 11}, {"kind": "max-hours", "hours": 48, "window_days": 7}]},
    }


def write(name, text):
    path = os.path.join(WORK, name)
    with open(path, "w", encoding="utf-8") as f:
        f.write(text)
    return path


def run(*args):
    return subprocess.run([BINARY, *args], capture_output=True, text=True, timeout=600)


def solve(name, data):
    path = write(name + ".yaml", yaml.safe_dump(data, sort_keys=False) if isinstance(data, dict) else data)
    out = os.path.join(WORK, name)
    p = run("solve", path, "--out", out, *SOLVE)
    report = json.load(open(os.path.join(out, "report.json"))) if p.returncode in (0, 1) else None
    return p, report, out


shutil.rmtree(WORK, ignore_errors=True)
os.makedirs(WORK)

# 1. Leave counts; unpaid leave does not.
p, leave, out = solve("leave", scenario("leave"))
check(p.returncode in (0, 1), f"solve with leave ran ({p.returncode}: {p.stderr})")
ana = next(x for x in leave["people"] if x["staff"] == "ana")
check(ana["credited_hours"] == 40 and ana["absent_days"] == 5, f"ana's 5 days of leave credit 40 h ({ana})")
check(ana["counted_hours"] == ana["worked_hours"] + 40, f"counted = worked + credited ({ana})")
check(not any(v["staff"] == "ana" and v["rule"].startswith("contract-") for v in leave["violations"]),
      "no contract-hours breach for ana once leave counts")
check(ana["worked_hours"] <= 48, f"ana works at most 48 h beside 40 h of leave ({ana['worked_hours']} h)")
text = open(os.path.join(out, "report.txt")).read()
check("40.0 h credited" in text, "report.txt shows the credited hours")
_, unpaid, _ = solve("unpaid", scenario("unpaid"))
ana_unpaid = next(x for x in unpaid["people"] if x["staff"] == "ana")
check(ana_unpaid["credited_hours"] == 0, "unpaid leave credits nothing")
check(any(v["staff"] == "ana" and v["kind"] == "min-hours" for v in unpaid["violations"]),
      "unpaid: ana cannot reach 80 h in 5 working days, a min-hours breach")
print(f"ana on leave: {ana['worked_hours']} h worked + {ana['credited_hours']} h credited; "
      f"unpaid: {ana_unpaid['worked_hours']} h worked")

# 2. Absences outside the period.
wrong_month = scenario("leave")
wrong_month["staff"][0]["absences"] = [{"from": "2027-04-01", "to": "2027-04-05", "reason": "leave"}]
p, _, out = solve("wrong_month", wrong_month)
check(p.returncode == 2 and "wrong_month.yaml:" in p.stderr and "outside the period" in p.stderr,
      f"an absence wholly outside the period is an input error ({p.returncode}: {p.stderr.strip()})")
check(not os.path.exists(out) or not os.listdir(out), "nothing written for the bad input")
partly = scenario("leave")
partly["staff"][0]["absences"] = [{"from": "2027-02-24", "to": "2027-03-02", "reason": "leave"}]
p, report, _ = solve("partly", partly)
check(p.returncode in (0, 1) and "note:" in p.stderr and "only 2027-03-01 to 2027-03-02 count" in p.stderr,
      f"an absence partly outside is clipped with a note ({p.stderr.strip()})")
check(report and len(report["notes"]) == 1, "report.json carries the note")

# 3. PyYAML round trip: unquoted `off` becomes false.
plain = yaml.safe_dump(scenario("leave"), sort_keys=False)
with_off = plain.replace("  skills:\n  - rn\n  absences:", "  skills:\n  - rn\n  requests:\n  - {date: 2027-03-10, off: true}\n  absences:", 1)
round_trip = yaml.safe_dump(yaml.safe_load(with_off), sort_keys=False)
check("false: true" in round_trip, "PyYAML writes the key off back as false")
p, _, _ = solve("pyyaml_off", round_trip)
check(p.returncode == 2 and "PyYAML" in p.stderr and "day_off: true" in p.stderr,
      f"the false: key is explained ({p.stderr.strip()})")
day_off = yaml.safe_dump(yaml.safe_load(yaml.safe_dump(scenario("leave", requests=[{"date": "2027-03-10", "day_off": True}]))))
p, report, _ = solve("pyyaml_day_off", day_off)
check(p.returncode in (0, 1), f"day_off: true survives PyYAML ({p.stderr.strip()})")

# 4. report.json: shortfall, window, cover shift and skill; a check of a roster built to break them.
hours = scenario("leave")
hours["rules"]["list"].append({"kind": "max-hours", "hours": 16, "window_days": 3, "id": "short-window"})
path = write("hours.yaml", yaml.safe_dump(hours, sort_keys=False))
dates = [f"2027-03-{d:02d}" for d in range(1, 15)]
rows = {"ana": [""] * 5 + ["L", "E", "E", "E", "", "", "", "", ""],
        "ben": ["E"] * 4 + [""] * 10, "cat": [""] * 14, "dee": [""] * 14}
roster = write("hours.csv", "staff," + ",".join(dates) + "\n" + "".join(n + "," + ",".join(c) + "\n" for n, c in rows.items()))
p = run("check", path, "--roster", roster, "--out", os.path.join(WORK, "hours"))
report = json.load(open(os.path.join(WORK, "hours", "report.json")))
check(all(isinstance(v.get("shortfall"), (int, float)) and v.get("shortfall_unit") for v in report["violations"]),
      "every violation has a numeric shortfall and a unit")
rest = [v for v in report["violations"] if v["kind"] == "min-rest"]
check(len(rest) == 1 and rest[0]["shortfall"] == 2 and rest[0]["shortfall_unit"] == "h",
      f"L 14-22 then E 07:00 is 9 h rest: 2 h short of 11 ({rest})")
window = [v for v in report["violations"] if v["rule"] == "short-window" and v["staff"] == "ana"]
check(len(window) == 1 and window[0]["shortfall"] == 8 and window[0]["shortfall_unit"] == "h"
      and window[0]["window_start"] == "2027-03-06" and window[0]["window_end"] == "2027-03-08",
      f"the rolling-hours breach names its 3-day window ({window})")
cover = [v for v in report["violations"] if v["kind"] == "cover"]
check(cover and all(v["shift"] in ("E", "L") and v["skill"] == "rn" and v["shortfall_unit"] == "people" for v in cover),
      "cover records carry shift and skill")
contract = [v for v in report["violations"] if v["rule"] == "contract-ft-min-hours" and v["staff"] == "dee"]
check(len(contract) == 1 and contract[0]["shortfall"] == 80, f"dee is 80 h short of the contract ({contract})")

# 5. Unknown shift ids list the known ones.
bad = scenario("leave")
bad["demand"][0]["shift"] = "X"
p, _, _ = solve("unknown_shift", bad)
check(p.returncode == 2 and "unknown shift 'X'" in p.stderr and "known shifts: E, L" in p.stderr,
      f"an unknown shift lists the known ones ({p.stderr.strip()})")

print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed or passed == 0 else 0)
