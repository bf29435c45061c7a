#!/usr/bin/env python3
"""`rotaweave replan` on the clinic-ward sample: a four-day sickness from mid-month.

The published roster (samples/clinic-ward/published.csv) is re-planned from 2027-03-15 with
the nurse who works most of 15-18 March off sick. The script checks, with its own readers
(csv, json, PyYAML, openpyxl) rather than rotaweave's:
  - every cell before --from is exactly as published, and the sick person is off;
  - cover is restored where staff allow (no hard breach if a fresh solve manages none);
  - the seam joins without a hard breach (rest, sequences computed here from the shift times);
  - changes.csv, report.json `changes`, report.txt and the workbook agree with the real diff;
  - replan changes far fewer cells than a fresh solve of the scenario with the absence added;
  - a `changes` rule in the scenario (weight, early_days, early_weight) replaces the default;
  - bad input (unknown person, dates outside the period, a roster for another month or team)
    exits 2 and writes nothing.
Environment: ROTAWEAVE (binary), ROTAWEAVE_SOURCE_DIR (repository), ROTAWEAVE_WORK (scratch).
"""
import csv
import datetime
import json
import os
import re
import shutil
import subprocess
import sys

import openpyxl
import yaml

BINARY = os.path.abspath(os.environ.get("ROTAWEAVE", "build/rotaweave"))
SOURCE = os.path.abspath(os.environ.get("ROTAWEAVE_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", "..")))
WORK = os.path.abspath(os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-replan-test"))
SAMPLE = os.path.join(SOURCE, "samples", "clinic-ward")
SCENARIO = os.path.join(SAMPLE, "scenario.yaml")
PUBLISHED = os.path.join(SAMPLE, "published.csv")
FROM = "2027-03-15"
SICK_DAYS = ["2027-03-15", "2027-03-16", "2027-03-17", "2027-03-18"]
# Work bounded by generations, with a far time cap: the same rosters on a slow or busy machine.
SOLVE = ["--generations", "8", "--time-limit", "900", "--threads", "2", "--quiet", "--seed", "1"]

passed, failed = 0, 0


def result(ok, name, why=""):
    global passed, failed
    if ok:
        passed += 1
        print(f"ok   {name}")
    else:
        failed += 1
        print(f"FAIL {name}: {why}")


def run(args, timeout=900):
    p = subprocess.run([BINARY] + args, capture_output=True, text=True, timeout=timeout)
    return p.returncode, p.stdout + p.stderr


def read_roster(path):
    with open(path, newline="", encoding="utf-8-sig") as f:
        rows = list(csv.reader(f))
    dates = rows[0][1:]
    return dates, {r[0]: dict(zip(dates, r[1:])) for r in rows[1:] if r}


def shift_of(cell):
    return cell.split("/")[0] if cell else ""


class Yaml12Loader(yaml.SafeLoader):
    """YAML 1.2 booleans: `off` (a request key and a history item) stays the word "off"."""


Yaml12Loader.yaml_implicit_resolvers = {
    first: [(tag, rx) for tag, rx in resolvers if tag != "tag:yaml.org,2002:bool"]
    for first, resolvers in yaml.SafeLoader.yaml_implicit_resolvers.items()}
Yaml12Loader.add_implicit_resolver("tag:yaml.org,2002:bool", re.compile(r"^(?:true|True|TRUE|false|False|FALSE)$"), list("tTfF"))


def scenario_with(extra_absence=None, extra_rule=None):
    """The sample scenario as a dict, include paths made absolute, optionally with changes."""
    with open(SCENARIO, encoding="utf-8") as f:
        doc = yaml.load(f, Loader=Yaml12Loader)
    doc["rules"]["include"] = [os.path.normpath(os.path.join(SAMPLE, inc)) for inc in doc["rules"].get("include", [])]
    if extra_absence:
        who, start, end, reason = extra_absence
        for person in doc["staff"]:
            if person["id"] == who:
                person.setdefault("absences", []).append(
                    {"from": datetime.date.fromisoformat(start), "to": datetime.date.fromisoformat(end), "reason": reason})
    if extra_rule:
        doc["rules"].setdefault("list", []).append(extra_rule)
    return doc


def write_yaml(doc, name):
    path = os.path.join(WORK, name)
    with open(path, "w", encoding="utf-8") as f:
        yaml.safe_dump(doc, f, sort_keys=False, allow_unicode=True)
    return path


def minutes(text):
    h, m = text.split(":")
    return int(h) * 60 + int(m)


def main():
    shutil.rmtree(WORK, ignore_errors=True)
    os.makedirs(WORK)
    base = scenario_with()
    shifts = {s["id"]: (minutes(s["start"]), minutes(s["end"])) for s in base["shifts"]}
    for sid, (a, b) in shifts.items():
        if b <= a:
            shifts[sid] = (a, b + 1440)
    dates, published = read_roster(PUBLISHED)
    staff_ids = [p["id"] for p in base["staff"]]
    result(list(published) == staff_ids and dates[0] == "2027-03-01" and len(dates) == 31,
           "published.csv is a roster of the sample's staff and period", f"{list(published)[:3]}..., {dates[:1]}")
    first = dates.index(FROM)

    # The nurse who works most of the four sick days (first in staff order on a tie).
    nurses = [p["id"] for p in base["staff"] if "rn" in p["skills"]]
    sick = max(nurses, key=lambda s: (sum(1 for d in SICK_DAYS if published[s][d]), -nurses.index(s)))
    sick_worked = [d for d in SICK_DAYS if published[sick][d]]
    print(f"sick person: {sick}, published to work {len(sick_worked)} of the 4 days ({', '.join(sick_worked)})")

    # A fresh solve of the scenario with the same absence in it.
    fresh_yaml = write_yaml(scenario_with((sick, SICK_DAYS[0], SICK_DAYS[-1], "sick")), "fresh.yaml")
    fresh_out = os.path.join(WORK, "fresh")
    code, text = run(["solve", fresh_yaml, "--out", fresh_out] + SOLVE)
    result(code in (0, 1), "fresh solve with the absence in the scenario runs", text[-400:])
    fresh_hard = json.load(open(os.path.join(fresh_out, "report.json")))["summary"]["hard"] if code in (0, 1) else None
    _, fresh = read_roster(os.path.join(fresh_out, "roster.csv")) if code in (0, 1) else (None, {})
    fresh_changed = sum(1 for s in staff_ids for d in dates[first:] if fresh.get(s, {}).get(d) != published[s][d])
    fresh_changed_all = sum(1 for s in staff_ids for d in dates if fresh.get(s, {}).get(d) != published[s][d])

    # The re-plan.
    out = os.path.join(WORK, "replan")
    code, text = run(["replan", SCENARIO, "--roster", PUBLISHED, "--from", FROM,
                      "--absence", f"{sick}:{SICK_DAYS[0]}..{SICK_DAYS[-1]}:sick", "--out", out] + SOLVE)
    outputs = ["roster.csv", "changes.csv", "report.json", "report.txt", "roster.xlsx"]
    result(code in (0, 1) and all(os.path.exists(os.path.join(out, f)) for f in outputs),
           "replan runs and writes the usual files plus changes.csv", f"exit {code}: {text[-400:]}")
    if code not in (0, 1):
        return
    _, roster = read_roster(os.path.join(out, "roster.csv"))
    report = json.load(open(os.path.join(out, "report.json")))

    frozen_diff = [(s, d) for s in staff_ids for d in dates[:first] if roster[s][d] != published[s][d]]
    result(not frozen_diff, "every cell before --from is as published", frozen_diff[:5])
    result(all(roster[sick][d] == "" for d in SICK_DAYS), f"{sick} is off on the sick days",
           [roster[sick][d] for d in SICK_DAYS])

    hard = report["summary"]["hard"]
    cover_min = [v for v in report["violations"] if v["kind"] == "cover" and v["severity"] == "hard" and set(v["dates"]) & set(SICK_DAYS)]
    print(f"hard penalty: replan {hard}, fresh solve {fresh_hard}")
    # Where even a fresh solve cannot avoid a hard breach, the staff do not allow full cover.
    restored = (hard == 0 and not cover_min) if fresh_hard == 0 else True
    result(restored, "cover restored: no hard breach where a fresh solve has none", [v["message"] for v in report["violations"] if v["severity"] == "hard"][:4])
    result(code == (1 if hard > 0 else 0), "exit status follows the hard breaches", f"exit {code}, hard {hard}")

    # The seam: rest and forbidden sequences computed here, from the shift times, for every pair
    # of worked shifts whose later one is on or after --from (the earlier may be frozen).
    seam = []
    for s in staff_ids:
        worked = [(i, shift_of(roster[s][d])) for i, d in enumerate(dates) if roster[s][d]]
        for (i, a), (j, b) in zip(worked, worked[1:]):
            if j < first:
                continue
            rest = (j * 1440 + shifts[b][0]) - (i * 1440 + shifts[a][1])
            if rest < 11 * 60:
                seam.append(f"{s}: {rest / 60:.1f} h rest {a} {dates[i]} -> {b} {dates[j]}")
            if j == i + 1 and a == "N" and b in ("E", "L"):
                seam.append(f"{s}: {a} {dates[i]} then {b} {dates[j]}")
    spanning_hard = [v["message"] for v in report["violations"] if v["severity"] == "hard" and v["dates"]
                     and min(v["dates"]) < FROM <= max(v["dates"])]
    result(not seam and not spanning_hard, "the new part joins the frozen part without a hard breach at the seam", (seam + spanning_hard)[:5])

    # The frozen part is reported as it is and never made worse: its breaches are those of the
    # published roster (checked against the same scenario).
    check_out = os.path.join(WORK, "check-published")
    code_c, text_c = run(["check", SCENARIO, "--roster", PUBLISHED, "--out", check_out])
    before = set()
    if code_c in (0, 1):
        for v in json.load(open(os.path.join(check_out, "report.json")))["violations"]:
            if v["dates"] and max(v["dates"]) < FROM:
                before.add((v["rule"], v["staff"], tuple(v["dates"])))
    after = {(v["rule"], v["staff"], tuple(v["dates"])) for v in report["violations"] if v["dates"] and max(v["dates"]) < FROM}
    result(code_c in (0, 1) and after <= before, "breaches within the frozen days are only those of the published roster",
           sorted(after - before)[:4] or text_c[-300:])

    # changes.csv against the real diff; reasons; report.json, report.txt and the workbook agree.
    with open(os.path.join(out, "changes.csv"), newline="", encoding="utf-8") as f:
        rows = list(csv.DictReader(f))
    diff = {(s, d) for s in staff_ids for d in dates[first:] if roster[s][d] != published[s][d]}
    listed = {(r["person"], r["date"]) for r in rows}
    cells_ok = all(r["was"] == (published[r["person"]][r["date"]] or "off") and r["now"] == (roster[r["person"]][r["date"]] or "off")
                   for r in rows if r["person"] in published)
    result(listed == diff and len(rows) == len(diff) and cells_ok, "changes.csv lists exactly the changed cells",
           f"{len(rows)} rows, {len(diff)} changed; missing {sorted(diff - listed)[:3]}, extra {sorted(listed - diff)[:3]}")
    reasons = {(r["person"], r["date"]): r["reason"] for r in rows}
    absent_ok = all(reasons.get((sick, d)) == "absent (sick)" for d in sick_worked)
    covers = [r for r in rows if r["reason"].startswith(f"covers {sick}'s absence (")]
    covers_ok = all(r["date"] in sick_worked and shift_of(r["now"]) in {shift_of(published[sick][r["date"]])} for r in covers)
    result(absent_ok and covers and covers_ok and all(r["reason"] for r in rows),
           "reasons: 'absent (sick)', 'covers X's absence (S k)' on the shifts left open, else a chain or 'rebalanced ...'",
           [(r["person"], r["date"], r["was"], r["now"], r["reason"]) for r in rows][:8])
    people = len({r["person"] for r in rows})
    summary = report.get("changes", {})
    txt = open(os.path.join(out, "report.txt"), encoding="utf-8").read()
    line = f"{len(rows)} cell{'s' if len(rows) != 1 else ''} changed for {people} {'person' if people == 1 else 'people'}"
    result(summary.get("cells") == len(rows) and summary.get("people") == people and summary.get("from") == FROM
           and line in txt and len(summary.get("list", [])) == len(rows),
           "report.json changes {cells, people} and report.txt give the counts",
           f"json {summary.get('cells')}/{summary.get('people')}, expected {len(rows)}/{people}")
    book = openpyxl.load_workbook(os.path.join(out, "roster.xlsx"))
    sheet_rows = []
    if "Changes" in book.sheetnames:
        sheet_rows = [r for r in book["Changes"].iter_rows(min_row=4, values_only=True) if r[0]]
    ws = book["Roster"]
    col = {ws.cell(row=3, column=c).value.date().isoformat(): c for c in range(3, 3 + len(dates))}
    row_of = {ws.cell(row=r, column=2).value: r for r in range(4, 4 + len(staff_ids))}
    highlighted = {(s, d) for s in staff_ids for d in dates if ws.cell(row=row_of[s], column=col[d]).border.left.style == "double"}
    result({(r[0], r[2]) for r in sheet_rows} == diff and highlighted <= diff and len(highlighted) >= len(diff) // 2,
           "workbook: a Changes sheet with every change, changed cells highlighted on the Roster sheet",
           f"sheet {len(sheet_rows)} rows, {len(highlighted)} highlighted of {len(diff)}")

    # Stability: replan against a fresh solve with the same absence.
    print(f"changed cells from {FROM}: replan {len(diff)} (people {people}), fresh solve {fresh_changed} "
          f"(whole month {fresh_changed_all})")
    result(fresh_changed > 0 and len(diff) * 2 < fresh_changed, "replan changes fewer than half the cells a fresh solve changes",
           f"replan {len(diff)}, fresh {fresh_changed}")

    # A `changes` rule in the scenario replaces the default; the absence comes from the file.
    rule = {"id": "stability", "kind": "changes", "severity": "soft", "weight": 7, "early_days": 2, "early_weight": 40}
    own_yaml = write_yaml(scenario_with((sick, SICK_DAYS[0], SICK_DAYS[-1], "sick"), rule), "own-changes.yaml")
    own_out = os.path.join(WORK, "replan-own-rule")
    code, text = run(["replan", own_yaml, "--roster", PUBLISHED, "--from", FROM, "--out", own_out,
                      "--generations", "2", "--time-limit", "900", "--threads", "2", "--quiet", "--seed", "1"])
    ok, why = code in (0, 1), text[-300:]
    if ok:
        rep = json.load(open(os.path.join(own_out, "report.json")))
        kinds = [r for r in rep["by_rule"] if r["kind"] == "changes"]
        early = {dates[first], dates[first + 1]}
        wrong = [v for v in rep["violations"] if v["kind"] == "changes" and v["penalty"] != (40 if v["dates"][0] in early else 7)]
        with open(os.path.join(own_out, "changes.csv"), newline="", encoding="utf-8") as f:
            own_rows = list(csv.DictReader(f))
        ok = (len(kinds) == 1 and kinds[0]["rule"] == "stability" and not wrong and kinds[0]["count"] == len(own_rows)
              and all(r["reason"] == "absent (sick)" for r in own_rows if r["person"] == sick and r["date"] in SICK_DAYS))
        why = f"by_rule {kinds}, wrong penalties {wrong[:2]}"
    result(ok, "a changes rule in the scenario (weight 7, early_days 2, early_weight 40) is honoured", why)

    # A scenario cell fixed before --from that the published roster contradicts: the published
    # cell stays (those days have happened) and a note says so.
    doc = scenario_with()
    _, published_rows = read_roster(PUBLISHED)
    person = next(p for p in doc["staff"] if "fixed" not in p and any(published_rows[p["id"]][d] for d in dates[:first]))
    day = next(d for d in dates[:first] if published_rows[person["id"]][d])
    person["fixed"] = [{"date": datetime.date.fromisoformat(day), "off": True}]
    fixed_yaml = write_yaml(doc, "fixed-before-from.yaml")
    fixed_out = os.path.join(WORK, "replan-fixed-before-from")
    code, text = run(["replan", fixed_yaml, "--roster", PUBLISHED, "--from", FROM, "--out", fixed_out,
                      "--generations", "2", "--time-limit", "900", "--threads", "2", "--quiet", "--seed", "1"])
    note = f"note: {person['id']} on {day}: the scenario fixes off but the published roster has"
    kept = code in (0, 1) and read_roster(os.path.join(fixed_out, "roster.csv"))[1][person["id"]][day] == published_rows[person["id"]][day]
    result(note in text and kept, "a fixed cell before --from that the published roster contradicts is noted, the published cell kept",
           text[-300:])

    # Bad input: exit 2, a clear message, nothing written.
    april = os.path.join(WORK, "april.csv")
    with open(april, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["staff"] + [f"2027-04-{d:02d}" for d in range(1, 31)])
        for s in staff_ids:
            w.writerow([s] + [""] * 30)
    other_team = os.path.join(WORK, "other-team.csv")
    with open(PUBLISHED, encoding="utf-8") as f:
        lines = f.read().splitlines()
    with open(other_team, "w") as f:
        f.write("\n".join([lines[0]] + [("x-" + l if i < 4 else l) for i, l in enumerate(lines[1:])]) + "\n")
    absence = f"{sick}:{SICK_DAYS[0]}"
    cases = [
        ("absence of an unknown person", ["--from", FROM, "--absence", "nobody:2027-03-15"], PUBLISHED, "unknown staff id 'nobody'"),
        ("absence outside the period", ["--from", FROM, "--absence", f"{sick}:2027-03-30..2027-04-02"], PUBLISHED, "outside the period"),
        ("absence with a bad date", ["--from", FROM, "--absence", f"{sick}:2027-03-32"], PUBLISHED, "invalid date"),
        ("absence wholly before --from", ["--from", FROM, "--absence", f"{sick}:2027-03-02"], PUBLISHED, "before --from"),
        ("--from outside the period", ["--from", "2027-04-01", "--absence", absence], PUBLISHED, "outside the period"),
        ("--from not a date", ["--from", "15/03/2027", "--absence", absence], PUBLISHED, "invalid date"),
        ("published roster for another month", ["--from", FROM], april, "covers 2027-04-01 to 2027-04-30"),
        ("published roster for another staff list", ["--from", FROM], other_team, "different staff list"),
    ]
    bad = []
    for name, args, roster_path, words in cases:
        bad_out = os.path.join(WORK, "bad-" + name.replace(" ", "-").replace("/", ""))
        code, text = run(["replan", SCENARIO, "--roster", roster_path, "--out", bad_out] + args + SOLVE)
        if code != 2 or words not in text or os.path.exists(bad_out):
            bad.append(f"{name}: exit {code}, written {os.path.exists(bad_out)}, message {text.strip()[:160]!r}")
    result(not bad, f"bad input exits 2 with a clear message and writes nothing ({len(cases)} cases)", "; ".join(bad))


if __name__ == "__main__":
    try:
        main()
    except Exception as e:  # a crash of the script is a failure, not a pass
        result(False, "test script", repr(e))
    print(f"{passed} passed, {failed} failed")
    sys.exit(1 if failed else 0)
