#!/usr/bin/env python3
"""Changes per absent day of `rotaweave replan` on the two samples.

For each sample: a published roster (clinic-ward's published.csv; for the plant, a roster
solved here with a fixed seed and generation count), two people off sick from the re-plan
date (the two who work most of the sick days, as chosen below), one replan. Printed per
sample: changed cells, absent days (days a sick person was published to work), changes per
absent day, and "far" changes: cells changed more than --near days from every such day.

Work is bounded by --generations (never by time), so the figures do not depend on machine
speed. Compare two builds with --binary, or the distance weight on and off with one build:

  scripts/replan_figures.py --binary build/rotaweave                  # as the build runs replan
  scripts/replan_figures.py --binary build/rotaweave --no-distance    # far_weight = weight
  scripts/replan_figures.py --binary ../main/build/rotaweave --source ../main   # an older build
"""
import argparse
import csv
import datetime
import os
import subprocess
import sys
import tempfile

import yaml

ROOT = os.path.abspath(os.path.join(os.path.dirname(__file__), ".."))


def read_roster(path):
    with open(path, newline="", encoding="utf-8-sig") as f:
        rows = list(csv.reader(f))
    return rows[0][1:], {r[0]: dict(zip(rows[0][1:], r[1:])) for r in rows[1:] if r}


def days(start, end):
    a, b = datetime.date.fromisoformat(start), datetime.date.fromisoformat(end)
    return [(a + datetime.timedelta(n)).isoformat() for n in range((b - a).days + 1)]


def pick_sick(published, spans, exclude=()):
    """For each span, the person (not already picked) published to work most of its days."""
    picked = []
    for span in spans:
        ids = [s for s in published if s not in picked and s not in exclude]
        picked.append(max(ids, key=lambda s: (sum(1 for d in span if published[s][d]), -ids.index(s))))
    return picked


def run(binary, args):
    p = subprocess.run([binary] + args, capture_output=True, text=True)
    if p.returncode not in (0, 1):
        sys.exit(f"{' '.join(args[:2])}: exit {p.returncode}: {p.stderr[-600:]}")
    return p


def scenario_copy(path, work, no_distance):
    """The scenario with absolute include paths; with no_distance, a changes rule as replan's
    default but with far_weight equal to weight."""
    text = open(path, encoding="utf-8").read()
    if not no_distance:
        return path
    # Only the rules section is touched; the rest of the file is copied as text so that YAML
    # 1.1 readers cannot turn `off` into a boolean.
    doc = yaml.safe_load(text)
    base = os.path.dirname(path)
    includes = [os.path.normpath(os.path.join(base, i)) for i in doc.get("rules", {}).get("include", [])]
    head = text[:text.index("\nrules:")]
    rules = {"include": includes, "list": (doc.get("rules", {}).get("list") or []) + [
        {"id": "changes", "kind": "changes", "severity": "soft", "weight": 2, "early_days": 3, "early_weight": 10,
         "far_weight": 2}]}
    out = os.path.join(work, os.path.basename(os.path.dirname(path)) + "-no-distance.yaml")
    with open(out, "w", encoding="utf-8") as f:
        f.write(head + "\n" + yaml.safe_dump({"rules": rules}, sort_keys=False, default_flow_style=None))
    return out


def figures(binary, name, scenario, published_csv, start, spans, gens, near, work, no_distance):
    dates, published = read_roster(published_csv)
    sick = pick_sick(published, spans)
    out = os.path.join(work, name + "-replan")
    args = ["replan", scenario_copy(scenario, work, no_distance), "--roster", published_csv, "--from", start, "--out", out,
            "--generations", str(gens), "--time-limit", "3600", "--threads", "2", "--seed", "1", "--quiet"]
    for who, span in zip(sick, spans):
        args += ["--absence", f"{who}:{span[0]}..{span[-1]}:sick"]
    run(binary, args)
    _, roster = read_roster(os.path.join(out, "roster.csv"))
    first = dates.index(start)
    absent = [(who, d) for who, span in zip(sick, spans) for d in span if published[who][d]]
    gap = sorted({dates.index(d) for _, d in absent})
    changed = [(s, i) for s in published for i in range(first, len(dates)) if roster[s][dates[i]] != published[s][dates[i]]]
    far = [c for c in changed if min(abs(c[1] - g) for g in gap) > near]
    people = len({s for s, _ in changed})
    return {"sample": name, "sick": ", ".join(f"{w} {s[0][5:]}..{s[-1][5:]}" for w, s in zip(sick, spans)),
            "absent_days": len(absent), "changes": len(changed), "people": people,
            "per_absent_day": len(changed) / max(1, len(absent)), "far": len(far)}


def main():
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("--binary", default=os.path.join(ROOT, "build", "rotaweave"))
    ap.add_argument("--generations", type=int, default=8)
    ap.add_argument("--near", type=int, default=2, help="a change more than this many days from every absent day is far")
    ap.add_argument("--no-distance", action="store_true", help="replan without the distance weight (far_weight = weight)")
    ap.add_argument("--work", default=None)
    ap.add_argument("--source", default=ROOT, help="repository whose samples and presets to use (e.g. an older checkout)")
    ap.add_argument("--only", choices=["clinic-ward", "plant"], help="one sample only")
    a = ap.parse_args()
    work = a.work or tempfile.mkdtemp(prefix="replan-figures-")
    os.makedirs(work, exist_ok=True)
    binary = os.path.abspath(a.binary)

    clinic = os.path.join(a.source, "samples", "clinic-ward")
    rows = []
    if a.only != "plant":
        rows.append(figures(binary, "clinic-ward", os.path.join(clinic, "scenario.yaml"), os.path.join(clinic, "published.csv"),
                    "2027-03-15", [days("2027-03-15", "2027-03-18"), days("2027-03-17", "2027-03-19")],
                    a.generations, a.near, work, a.no_distance))
    # The plant has no published roster: solve one first (the same for every build that solves
    # alike; the seed and generation count fix it).
    plant = os.path.join(a.source, "samples", "plant", "scenario.yaml")
    plant_pub = os.path.join(work, "plant-published")
    if a.only != "clinic-ward":
        if not os.path.exists(os.path.join(plant_pub, "roster.csv")):  # kept between runs with --work
            run(binary, ["solve", plant, "--out", plant_pub, "--generations", str(a.generations), "--time-limit", "3600",
                         "--threads", "2", "--seed", "1", "--quiet"])
        rows.append(figures(binary, "plant", plant, os.path.join(plant_pub, "roster.csv"), "2027-04-12",
                            [days("2027-04-12", "2027-04-15"), days("2027-04-14", "2027-04-16")],
                            a.generations, a.near, work, a.no_distance))

    print(f"binary {binary}, --generations {a.generations}, seed 1, far = more than {a.near} days from every absent day"
          + (", distance weight off" if a.no_distance else ""))
    print("| sample | sick | absent days | changed cells | people | changes per absent day | far changes |")
    print("| --- | --- | --- | --- | --- | --- | --- |")
    for r in rows:
        print(f"| {r['sample']} | {r['sick']} | {r['absent_days']} | {r['changes']} | {r['people']} | "
              f"{r['per_absent_day']:.2f} | {r['far']} |")


if __name__ == "__main__":
    main()
