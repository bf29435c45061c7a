#!/usr/bin/env python3
"""Replan reasons are true, changes stay near the absence, advice respects legal rules.

Checked with the script's own readers (csv, json, PyYAML), never rotaweave's:
  - clinic-ward sample, two people off sick from 2027-03-15: every "covers X's absence (S k)"
    is true (X was published to work S as k that day and is now absent and off; the person
    now works S as k and holds k); every "takes X's S k" names a slot X held and left; every
    reason is one of the documented forms;
  - the distance weight: the default replan changes no more cells far from the absences (more
    than 2 days from every absent day) than the same replan with far_weight = weight, and
    fewer than a third of its changes are far;
  - a chain on a small scenario: the one nurse who can cover an absent nurse's slot leaves
    her assistant slot, which a third person takes; the reasons name the chain;
  - advice after a breach of a rule marked `legal: true` never suggests relaxing it or making
    it soft, and the avoidable line names the people who could have taken the shift; the same
    rule without the mark may be suggested for relaxing.
Solver work is bounded by --generations, never by time.
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

import yaml

BINARY = os.path.abspath(os.environ.get("ROTAWEAVE", "build/rotaweave"))
SOURCE = os.path.abspath(os.environ.get("ROTAWEAVE_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", "..")))
WORK = os.path.abspath(os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-replan-reasons-test"))
SAMPLE = os.path.join(SOURCE, "samples", "clinic-ward")
SOLVE = ["--generations", "8", "--time-limit", "3600", "--threads", "2", "--quiet", "--seed", "1"]

passed, failed = 0, 0


def result(ok, name, why=""):
    global passed, failed
    if ok:
        passed += 1
        print(f"ok   {name}")
    else:
        failed += 1
        print(f"FAIL {name}: {why}")


def run(args):
    p = subprocess.run([BINARY] + args, capture_output=True, text=True, timeout=1800)
    return p.returncode, p.stdout + p.stderr


def read_roster(path):
    with open(path, newline="", encoding="utf-8-sig") as f:
        rows = list(csv.reader(f))
    return rows[0][1:], {r[0]: dict(zip(rows[0][1:], r[1:])) for r in rows[1:] if r}


def read_changes(path):
    with open(path, newline="", encoding="utf-8") as f:
        return list(csv.DictReader(f))


def skills_of(scenario_path):
    # Only staff ids and skills are read; YAML 1.1 booleans do not touch those keys.
    doc = yaml.safe_load(open(scenario_path, encoding="utf-8"))
    return {p["id"]: p["skills"] for p in doc["staff"]}


def role(cell, skills):
    """(shift, skill) of a roster cell: SHIFT/skill, or the person's first skill."""
    if not cell:
        return None
    shift, _, skill = cell.partition("/")
    return shift, skill or skills[0]


def span(a, b):
    a, b = datetime.date.fromisoformat(a), datetime.date.fromisoformat(b)
    return [(a + datetime.timedelta(n)).isoformat() for n in range((b - a).days + 1)]


COVERS = re.compile(r"^covers (\S+)'s absence \((\S+) (\S+)\)$")
TAKES = re.compile(r"^takes (\S+)'s (\S+) ([^\s;]+)(?: without holding [^\s;]+)?(?:;| \(|$)")
FORMS = [COVERS, TAKES, re.compile(r"^absent( \(.*\))?$"), re.compile(r"^fixed in the scenario$"),
         re.compile(r"^rebalanced (to meet rule '[^']+'|with the other changes)(; \S+ takes the \S+ \S+)*$")]


def check_reasons(label, rows, published, roster, skills, absent):
    """Every reason true: covers/takes name a slot the other person held and left."""
    wrong = []
    for r in rows:
        who, day, reason = r["person"], r["date"], r["reason"]
        if not any(f.match(reason) for f in FORMS):
            wrong.append(f"{who} {day}: unknown form {reason!r}")
            continue
        m = COVERS.match(reason) or TAKES.match(reason)
        if not m:
            continue
        x, shift, skill = m.groups()
        was_x = role(published[x][day], skills[x])
        now_x = role(roster[x][day], skills[x])
        now = role(roster[who][day], skills[who])
        if was_x != (shift, skill) or now_x == (shift, skill) or now != (shift, skill):
            wrong.append(f"{who} {day}: {reason!r} but {x} was {was_x}, is {now_x}; {who} is {now}")
        if COVERS.match(reason) and ((x, day) not in absent or roster[x][day] or skill not in skills[who]):
            wrong.append(f"{who} {day}: {reason!r} but {x} is not absent and off, or {who} lacks {skill}")
    result(not wrong, f"{label}: every reason is true ({len(rows)} changes)", wrong[:4])


def clinic():
    scenario = os.path.join(SAMPLE, "scenario.yaml")
    published_csv = os.path.join(SAMPLE, "published.csv")
    dates, published = read_roster(published_csv)
    skills = skills_of(scenario)
    sick = [("goran", span("2027-03-15", "2027-03-18")), ("dmitri", span("2027-03-17", "2027-03-19"))]
    absent = {(w, d) for w, days in sick for d in days}
    absences = sum((["--absence", f"{w}:{d[0]}..{d[-1]}:sick"] for w, d in sick), [])
    gap = sorted({dates.index(d) for w, days in sick for d in days if published[w][d]})

    def replan(name, scenario_path):
        out = os.path.join(WORK, name)
        code, text = run(["replan", scenario_path, "--roster", published_csv, "--from", "2027-03-15", "--out", out] + absences + SOLVE)
        if code not in (0, 1):
            result(False, f"replan {name} runs", text[-400:])
            return None
        _, roster = read_roster(os.path.join(out, "roster.csv"))
        return roster, read_changes(os.path.join(out, "changes.csv"))

    got = replan("clinic-default", scenario)
    if not got:
        return
    roster, rows = got
    check_reasons("clinic-ward, two people sick", rows, published, roster, skills, absent)
    result(any(COVERS.match(r["reason"]) for r in rows), "clinic-ward: some change covers an absence",
           [r["reason"] for r in rows][:5])

    # The same replan without the distance weight (a changes rule with far_weight = weight).
    text = open(scenario, encoding="utf-8").read()
    text = re.sub(r"\.\./\.\./rules/", os.path.join(SOURCE, "rules") + "/", text)
    text = text.replace("  list:\n", "  list:\n    - {id: changes, kind: changes, severity: soft, weight: 2, early_days: 3, "
                                     "early_weight: 10, far_weight: 2}\n", 1)
    flat = os.path.join(WORK, "clinic-no-distance.yaml")
    with open(flat, "w", encoding="utf-8") as f:
        f.write(text)
    got_flat = replan("clinic-no-distance", flat)
    if not got_flat:
        return

    def far(changes):
        return [r for r in changes if min(abs(dates.index(r["date"]) - g) for g in gap) > 2]

    near_far, flat_far = far(rows), far(got_flat[1])
    print(f"changes: default {len(rows)} ({len(near_far)} far), without the distance weight {len(got_flat[1])} ({len(flat_far)} far)")
    result(len(near_far) <= len(flat_far) and 3 * len(near_far) < max(1, len(rows)),
           "the distance weight keeps changes near the absences (no more far changes; under a third far)",
           f"far {len(near_far)} of {len(rows)}, without the weight {len(flat_far)} of {len(got_flat[1])}")


CHAIN = """name: chain
period: {start: 2027-05-03, end: 2027-05-09}
shifts:
  - {id: E, start: "07:00", end: "15:00"}
skills: [rn, hca]
staff:
  - {id: ana, skills: [rn]}
  - {id: bea, skills: [hca, rn]}
  - {id: cal, skills: [hca]}
demand:
  - {shift: E, skill: rn, min: 1, max: 1}
  - {shift: E, skill: hca, min: 1, max: 1}
"""


def chain():
    path = os.path.join(WORK, "chain.yaml")
    with open(path, "w", encoding="utf-8") as f:
        f.write(CHAIN)
    dates = span("2027-05-03", "2027-05-09")
    pub = os.path.join(WORK, "chain-published.csv")
    with open(pub, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["staff"] + dates)
        w.writerow(["ana"] + ["E"] * 7)
        w.writerow(["bea"] + ["E"] * 7)   # hca, her first skill
        w.writerow(["cal"] + [""] * 7)
    out = os.path.join(WORK, "chain-replan")
    code, text = run(["replan", path, "--roster", pub, "--from", "2027-05-05", "--absence", "ana:2027-05-05:sick", "--out", out,
                      "--generations", "4", "--time-limit", "3600", "--threads", "1", "--quiet", "--seed", "1"])
    if code not in (0, 1):
        result(False, "chain replan runs", text[-400:])
        return
    _, published = read_roster(pub)
    _, roster = read_roster(os.path.join(out, "roster.csv"))
    rows = read_changes(os.path.join(out, "changes.csv"))
    skills = {"ana": ["rn"], "bea": ["hca", "rn"], "cal": ["hca"]}
    check_reasons("chain scenario", rows, published, roster, skills, {("ana", "2027-05-05")})
    reason = {(r["person"], r["date"]): r["reason"] for r in rows}
    want_cal = "takes bea's E hca; bea moved to cover ana's absence (E rn)"
    want_bea = "covers ana's absence (E rn)"
    result(reason.get(("cal", "2027-05-05")) == want_cal and reason.get(("bea", "2027-05-05")) == want_bea,
           "a chain is named: cal takes bea's slot, bea covers ana's absence",
           f"cal: {reason.get(('cal', '2027-05-05'))!r}, bea: {reason.get(('bea', '2027-05-05'))!r}")


LEGAL = """name: legal advice
period: {start: 2027-05-03, end: 2027-05-09}
shifts:
  - {id: E, start: "07:00", end: "15:00"}
  - {id: L, start: "14:00", end: "22:00"}
skills: [rn]
staff:
  - {id: ana, skills: [rn]}
  - {id: bea, skills: [rn]}
  - {id: cal, skills: [rn]}
  - {id: dan, skills: [rn]}
demand:
  - {shift: E, skill: rn, min: 1}
  - {shift: L, skill: rn, min: 1}
rules:
  list:
    - {id: daily-rest, kind: min-rest, hours: 11, severity: hard%s}
"""


def legal():
    dates = span("2027-05-03", "2027-05-09")
    roster = os.path.join(WORK, "legal-roster.csv")
    with open(roster, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["staff"] + dates)
        # ana: L on 05-04 then E on 05-05 (9 h rest); bea and cal cover the other days.
        w.writerow(["ana", "", "L", "E", "", "", "", ""])
        w.writerow(["bea", "E", "E", "", "E", "E", "E", "E"])
        w.writerow(["cal", "L", "", "L", "L", "L", "L", "L"])
        w.writerow(["dan", "", "", "", "", "", "", ""])
    texts = {}
    for mark in ("", ", legal: true"):
        path = os.path.join(WORK, f"legal{'-marked' if mark else ''}.yaml")
        with open(path, "w", encoding="utf-8") as f:
            f.write(LEGAL % mark)
        out = os.path.join(WORK, "legal-check" + ("-marked" if mark else ""))
        code, text = run(["check", path, "--roster", roster, "--out", out])
        texts[mark] = open(os.path.join(out, "report.txt"), encoding="utf-8").read() if code == 1 else text
    marked, plain = texts[", legal: true"], texts[""]
    relax = re.compile(r"relax rule 'daily-rest'|make it soft")
    result("daily-rest" in marked and not relax.search(marked) and "marked legal" in marked,
           "advice never suggests relaxing a rule marked legal; it says the rule is legal",
           [l for l in marked.splitlines() if "daily-rest" in l or "help" in l][:4])
    result(bool(relax.search(plain)), "without the mark the same breach may be suggested for relaxing",
           [l for l in plain.splitlines() if "help" in l][:3])
    avoidable = [l for l in marked.splitlines() if l.strip().startswith("avoidable:")]
    # dan is off all week and breaks no hard rule by taking ana's early on 05-05.
    result(avoidable and all("dan" in l for l in avoidable),
           "the avoidable line names the people who could have taken the shift", avoidable[:3])
    # The mark also reaches the presets: daily rest, weekly rest and 48 h are marked legal.
    preset = yaml.safe_load(open(os.path.join(SOURCE, "rules", "working-time.yaml"), encoding="utf-8"))
    marked_ids = {r["id"] for r in preset["list"] if r.get("legal") is True}
    result({"daily-rest", "weekly-rest", "max-48h-in-7-days"} <= marked_ids, "working-time.yaml marks its legal rules",
           sorted(marked_ids))


def main():
    shutil.rmtree(WORK, ignore_errors=True)
    os.makedirs(WORK)
    chain()
    legal()
    clinic()


if __name__ == "__main__":
    try:
        main()
    except Exception as e:  # a crash of the script is a failure, not a pass
        result(False, "test script", repr(e))
    print(f"{passed} passed, {failed} failed")
    sys.exit(1 if failed else 0)
