#!/usr/bin/env python3
"""End to end: `rotaweave check` on each sample's hand-made roster finds exactly the planted
breaches listed in tests/data/expected/<sample>-check.tsv (kind, staff, first date, amount),
exits 1 when a hard breach is among them, and `solve` on each sample reaches zero hard
breaches within 30 s on 2 threads (design.md quality bar)."""
import json
import os
import subprocess
import sys
from collections import Counter
from pathlib import Path

ROTAWEAVE = os.environ["ROTAWEAVE"]
SOURCE = Path(os.environ["ROTAWEAVE_SOURCE_DIR"])
WORK = Path(os.environ["ROTAWEAVE_WORK"])
passed = failed = 0


def check(ok, what):
    global passed, failed
    print(("ok   " if ok else "FAIL ") + what)
    if ok:
        passed += 1
    else:
        failed += 1


def amount(text):
    return round(float(text), 4)


for sample in sorted((SOURCE / "samples").iterdir()):
    expected_file = SOURCE / "tests" / "data" / "expected" / f"{sample.name}-check.tsv"
    roster = sample / "roster-handmade.csv"
    if not expected_file.exists() or not roster.exists():
        continue
    out = WORK / sample.name / "check"
    run = subprocess.run([ROTAWEAVE, "check", str(sample / "scenario.yaml"), "--roster", str(roster), "--out", str(out)],
                         capture_output=True, text=True)
    report = json.loads((out / "report.json").read_text())
    found = Counter((v["kind"], v["staff"] or "-", v["dates"][0] if v["dates"] else "-", amount(v["amount"]))
                    for v in report["violations"])
    lines = expected_file.read_text().splitlines()[1:]
    wanted = Counter((k, s, d, amount(a)) for k, s, d, a in (line.split("\t") for line in lines if line.strip()))
    check(found == wanted, f"{sample.name}: check finds exactly the {sum(wanted.values())} planted breaches"
          + ("" if found == wanted else f"\n  missing: {sorted((wanted - found).elements())}\n  extra: {sorted((found - wanted).elements())}"))
    has_hard = any(v["severity"] == "hard" for v in report["violations"])
    check(run.returncode == (1 if has_hard else 0), f"{sample.name}: check exit status {run.returncode}")

    out = WORK / sample.name / "solve"
    # Bounded by generations (both samples reach zero hard breaches after the first one), with
    # a time cap far above what it needs, so a slow or busy machine gives the same roster.
    run = subprocess.run([ROTAWEAVE, "solve", str(sample / "scenario.yaml"), "--out", str(out), "--generations", "8",
                          "--time-limit", "900", "--threads", "2", "--seed", "1", "--quiet"], capture_output=True, text=True)
    report = json.loads((out / "report.json").read_text())
    check(run.returncode == 0 and report["summary"]["hard"] == 0,
          f"{sample.name}: solve reaches zero hard breaches in 8 generations (hard {report['summary']['hard']}, soft {report['summary']['soft']})")

print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed or passed == 0 else 0)
