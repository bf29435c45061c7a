#!/usr/bin/python3
"""Independent exact reference for rotaweave: COIN-OR CBC via PuLP.

For a fixed list of seeds this script generates small rostering scenarios in
rotaweave's YAML format, builds its own mixed-integer model of the documented
semantics (binary x[person, day, shift, skill]), solves it to proven
optimality with CBC and then holds the rotaweave binary against that optimum:

  (a) `rotaweave check` on CBC's roster must report hard == 0 and a soft total
      equal to CBC's objective;
  (b) `rotaweave solve` must reach hard == 0, must never beat CBC's optimum,
      and on the smallest scenarios must reach it;
  (c) where its report proves a lower bound (summary.lower_bound), the bound
      never lies above CBC's optimum.

Besides CBC, a small direct scorer (run by run, window by window) re-scores
CBC's roster, so the MIP itself is checked against a second reading of the
rules.  No history is generated, so the period-edge rules apply: a run that
touches the first or last day is never too short, and nothing is judged
across the edges.

Usage: mip_reference.py --rotaweave PATH_TO_BINARY [--work DIR] [--only-check]
Needs Debian's python3-pulp and coinor-cbc; run it with /usr/bin/python3.
"""

import argparse
import datetime
import json
import math
import os
import random
import subprocess
import sys
import tempfile
import time
from fractions import Fraction

import pulp

CBC_PATH = "/usr/bin/cbc"
CBC_TIME_LIMIT = 30        # seconds per scenario; the chosen seeds need far less
SCENARIO_COUNT = 20
FIRST_SEED = 1000
EXACT_COUNT = 5            # the smallest scenarios must be solved to the optimum
# Solver work is bounded by generations (and stops early at CBC's optimum), never by time, so
# the outcome is the same on a slow or busy machine; the time limit is only a far cap.
EXACT_GENERATIONS = 16     # for those
OTHER_GENERATIONS = 4      # for the rest
TIME_CAP = 600
TOLERANCE = 1e-6

START = datetime.date(2027, 3, 1)          # a Monday
WEEKDAYS = ["mon", "tue", "wed", "thu", "fri", "sat", "sun"]
NAMES = ["ana", "ben", "cara", "dev", "eli", "fay", "gus", "hana"]

# Shift catalogues: id -> (start, end, break minutes).
SHIFT_SETS = [
    {"E": ("07:00", "15:00", 30), "L": ("14:30", "22:30", 30)},
    {"D": ("07:00", "19:00", 60), "N": ("19:00", "07:00", 60)},
    {"E": ("07:00", "15:00", 30), "L": ("14:30", "22:30", 30),
     "N": ("22:00", "07:30", 30)},
]
# Sequences worth forbidding for each catalogue ("off" = a day off).
SEQUENCES = [
    [["L", "E"], ["E", "off", "L"]],
    [["N", "D"], ["N", "off", "D"], ["D", "N", "D"]],
    [["N", "E"], ["N", "L"], ["L", "E"], ["N", "off", "E"]],
]
WEIGHTS = [1, 2, 3, 0.5, 1.5, 2.25]


# --------------------------------------------------------------------------
# Scenario generator
# --------------------------------------------------------------------------

def paid_minutes(start, end, break_minutes):
    def minutes(hhmm):
        h, m = hhmm.split(":")
        return int(h) * 60 + int(m)
    length = minutes(end) - minutes(start)
    if length <= 0:
        length += 24 * 60
    return length - break_minutes


def pick_severity(rng):
    """Returns the rule keys for severity: hard, soft with a weight, or the default (hard)."""
    roll = rng.random()
    if roll < 0.4:
        return {"severity": "hard"}
    if roll < 0.9:
        return {"severity": "soft", "weight": rng.choice(WEIGHTS)}
    return {}


def maybe_narrow(rng, staff_ids):
    if rng.random() < 0.3:
        return {"staff": sorted(rng.sample(staff_ids, rng.randint(1, len(staff_ids) - 1)),
                                key=staff_ids.index)}
    return {}


def generate_scenario(seed, people=(4, 8), days=(7, 14), start=START, window_days=7):
    """A random scenario (plain dicts and lists, shaped like the YAML file)."""
    rng = random.Random(seed)
    n_people = rng.randint(*people)
    n_days = rng.randint(*days)
    catalogue = rng.randrange(len(SHIFT_SETS))
    shifts = SHIFT_SETS[catalogue]
    skills = ["rn"] if rng.random() < 0.5 else ["rn", "hca"]
    dates = [start + datetime.timedelta(days=i) for i in range(n_days)]
    staff_ids = NAMES[:n_people]

    staff = []
    for i, sid in enumerate(staff_ids):
        if len(skills) == 1:
            held = ["rn"]
        elif i < 2:                       # every skill has at least one holder
            held = [skills[i]]
        else:
            held = rng.choice([["rn"], ["hca"], ["rn", "hca"], ["hca", "rn"]])
        requests = []
        for day in rng.sample(range(n_days), rng.randint(1, 3)):
            request = {"date": dates[day]}
            kind = rng.choice(["off", "shift", "not"])
            if kind == "off":
                request["off"] = True
            else:
                request[kind] = rng.choice(list(shifts))
            if rng.random() < 0.8:
                request["weight"] = rng.choice(WEIGHTS)
            requests.append(request)
        staff.append({"id": sid, "contract": "std", "skills": held, "requests": requests})

    demand = []
    hard_min_budget = max(1, n_people // 2)       # keeps most scenarios feasible
    for shift in shifts:
        for skill in skills:
            if rng.random() < 0.8:
                entry = {"shift": shift, "skill": skill}
                low = rng.choice([0, 1, 1])
                if low and rng.random() < 0.25:
                    entry["severity"] = "soft"
                    entry["min_weight"] = rng.choice(WEIGHTS)
                elif low:
                    if hard_min_budget == 0:
                        low = 0
                    hard_min_budget -= low
                entry["min"] = low
                entry["target"] = low + rng.choice([0, 1, 1, 2])
                entry["target_weight"] = rng.choice(WEIGHTS)
                if rng.random() < 0.5:
                    entry["max"] = entry["target"] + rng.choice([0, 1])
                    entry["max_weight"] = rng.choice(WEIGHTS)
                demand.append(entry)
            if rng.random() < 0.3:
                days_filter = rng.choice([["sat", "sun"], ["mon", "wed", "fri"]])
                entry = {"shift": shift, "skill": skill, "days": days_filter,
                         "min": 0, "target": rng.choice([0, 1, 2]),
                         "target_weight": rng.choice(WEIGHTS)}
                if rng.random() < 0.5:
                    entry["max"] = entry["target"] + rng.choice([0, 1])
                demand.append(entry)
            if rng.random() < 0.2:
                picked = sorted(rng.sample(dates, 2))
                demand.append({"shift": shift, "skill": skill, "dates": picked,
                               "min": 0, "target": 2, "max": 2,
                               "target_weight": rng.choice(WEIGHTS)})

    shift_ids = list(shifts)
    longest = max(paid_minutes(*shifts[s]) for s in shift_ids) / 60
    rules = []

    def add(kind, **keys):
        rule = {"kind": kind}
        rule.update(keys)
        rule.update(pick_severity(rng))
        rule.update(maybe_narrow(rng, staff_ids))
        rules.append(rule)

    if rng.random() < 0.7:
        add("forbid-sequence", sequence=rng.choice(SEQUENCES[catalogue]))
    shortest_run = rng.randint(2, 3)
    if rng.random() < 0.6:
        add("min-consecutive-days", days=shortest_run)
    if rng.random() < 0.6:
        add("max-consecutive-days", days=rng.randint(shortest_run + 1, 5))
    if rng.random() < 0.6:
        keys = {"count": rng.randint(1, n_days // 2)}
        if rng.random() < 0.7:
            keys["shift"] = rng.choice(shift_ids)
        add("max-count", **keys)
    if rng.random() < 0.6:
        add("max-weekends", count=rng.randint(0, 1))
    if rng.random() < 0.5:
        add("min-hours", hours=round(n_days * longest * rng.uniform(0.15, 0.35) * 2) / 2)
    if rng.random() < 0.5:
        add("max-hours", hours=round(n_days * longest * rng.uniform(0.35, 0.6) * 2) / 2)
    if rng.random() < 0.5:
        add("max-hours", hours=round(longest * window_days * rng.uniform(0.5, 0.75) * 2) / 2,
            window_days=window_days)
        if rules[-1].get("severity") == "soft":
            # merged window records are costly for the MIP: keep them to two people
            rules[-1]["staff"] = sorted(rng.sample(staff_ids, 2), key=staff_ids.index)
    seen = {}
    for rule in rules:                    # repeated kinds get distinct ids
        seen[rule["kind"]] = seen.get(rule["kind"], 0) + 1
        if seen[rule["kind"]] > 1 or rng.random() < 0.3:
            rule["id"] = "%s-%d" % (rule["kind"], seen[rule["kind"]])

    weekend = ["sat", "sun"] if rng.random() < 0.8 else ["fri", "sat", "sun"]
    return {
        "name": "reference seed %d" % seed,
        "seed": seed,
        "period": {"start": dates[0], "end": dates[-1]},
        "weekend": weekend,
        "shifts": [dict(id=s, start=a, end=b, break_minutes=m)
                   for s, (a, b, m) in shifts.items()],
        "skills": skills,
        "staff": staff,
        "demand": demand,
        "rules": rules,
    }


def flow(value):
    """One value in YAML flow style."""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, dict):
        return "{" + ", ".join("%s: %s" % (k, flow(v)) for k, v in value.items()) + "}"
    if isinstance(value, list):
        return "[" + ", ".join(flow(v) for v in value) + "]"
    if isinstance(value, datetime.date):
        return value.isoformat()
    if isinstance(value, str) and ":" in value:
        return '"%s"' % value
    return str(value)


def to_yaml(scn):
    lines = ["name: %s" % scn["name"],
             "period: %s" % flow(scn["period"]),
             "weekend: %s" % flow(scn["weekend"]),
             "shifts:"]
    lines += ["  - %s" % flow(s) for s in scn["shifts"]]
    lines += ["skills: %s" % flow(scn["skills"]),
              "contracts:",
              "  std: {}",
              "staff:"]
    for person in scn["staff"]:
        lines += ["  - id: %s" % person["id"],
                  "    contract: %s" % person["contract"],
                  "    skills: %s" % flow(person["skills"])]
        if person["requests"]:
            lines.append("    requests:")
            lines += ["      - %s" % flow(r) for r in person["requests"]]
    lines.append("demand:")
    lines += ["  - %s" % flow(d) for d in scn["demand"]]
    if scn["rules"]:
        lines += ["rules:", "  list:"]
        lines += ["    - %s" % flow(r) for r in scn["rules"]]
    return "\n".join(lines) + "\n"


# --------------------------------------------------------------------------
# Compiled problem: indices instead of names, shared by the MIP and the scorer
# --------------------------------------------------------------------------

class Problem:
    def __init__(self, scn):
        start, end = scn["period"]["start"], scn["period"]["end"]
        self.dates = [start + datetime.timedelta(days=i)
                      for i in range((end - start).days + 1)]
        self.days = range(len(self.dates))
        self.shifts = [s["id"] for s in scn["shifts"]]
        self.paid = {s["id"]: paid_minutes(s["start"], s["end"], s["break_minutes"])
                     for s in scn["shifts"]}
        self.people = [p["id"] for p in scn["staff"]]
        self.skills_of = {p["id"]: p["skills"] for p in scn["staff"]}
        self.requests = [(p["id"], self.dates.index(r["date"]), r)
                         for p in scn["staff"] for r in p["requests"]]
        self.cover = self._cover_cells(scn["demand"], scn["skills"])
        self.weekends = self._weekend_blocks(scn["weekend"])
        self.rules = [self._rule(r) for r in scn["rules"]]

    def _cover_cells(self, demand, skills):
        """(day, shift, skill) -> the demand entry that governs it (dates > days > every day)."""
        cells = {}
        for d, date in enumerate(self.dates):
            weekday = WEEKDAYS[date.weekday()]
            for s in self.shifts:
                for k in skills:
                    ranked = []
                    for entry in demand:
                        if entry["shift"] != s or entry["skill"] != k:
                            continue
                        if "dates" in entry:
                            if date in entry["dates"]:
                                ranked.append((2, entry))
                        elif "days" in entry:
                            if weekday in entry["days"]:
                                ranked.append((1, entry))
                        else:
                            ranked.append((0, entry))
                    if ranked:
                        cells[(d, s, k)] = max(ranked, key=lambda pair: pair[0])[1]
        return cells

    def _weekend_blocks(self, weekend):
        """Maximal runs of consecutive weekend days inside the period (day indices)."""
        blocks, current = [], []
        for d, date in enumerate(self.dates):
            if WEEKDAYS[date.weekday()] in weekend:
                current.append(d)
            elif current:
                blocks.append(current)
                current = []
        if current:
            blocks.append(current)
        return blocks

    def _rule(self, raw):
        rule = dict(raw)
        rule.setdefault("id", raw["kind"])
        rule["hard"] = raw.get("severity", "hard") == "hard"
        rule["weight"] = Fraction(str(raw.get("weight", 1)))
        rule["scope"] = raw.get("staff", self.people)
        return rule


def weight_of(entry, key):
    return Fraction(str(entry.get(key, 1)))


# --------------------------------------------------------------------------
# MIP builder and CBC solve (independent reference: COIN-OR CBC via PuLP)
# --------------------------------------------------------------------------

def build_mip(pb):
    """The exact model: hard rules as constraints, soft ones as penalty variables."""
    mip = pulp.LpProblem("roster", pulp.LpMinimize)
    counter = [0]

    def aux(upper=None):
        """A non-negative integer helper: every amount here is a whole number
        (persons, days, breaches, minutes), which lets CBC round its bounds."""
        counter[0] += 1
        return pulp.LpVariable("a%d" % counter[0], lowBound=0, upBound=upper, cat="Integer")

    x = {(p, d, s, k): pulp.LpVariable("x_%s_%d_%s_%s" % (p, d, s, k), cat="Binary")
         for p in pb.people for d in pb.days for s in pb.shifts for k in pb.skills_of[p]}
    y = {(p, d, s): pulp.lpSum(x[p, d, s, k] for k in pb.skills_of[p])
         for p in pb.people for d in pb.days for s in pb.shifts}
    w = {(p, d): pulp.lpSum(y[p, d, s] for s in pb.shifts) for p in pb.people for d in pb.days}
    minutes = {(p, d): pulp.lpSum(pb.paid[s] * y[p, d, s] for s in pb.shifts)
               for p in pb.people for d in pb.days}
    penalty = []                          # (weight, affine expression)

    for (p, d), worked in w.items():      # one task per person-day
        mip += worked <= 1

    def soft_excess(expr, weight):
        """Penalty weight * max(0, expr)."""
        v = aux()
        mip.addConstraint(v >= expr)
        penalty.append((weight, v))

    def bound(expr, limit, hard, weight):
        """expr <= limit, as a constraint or as a penalty on the excess."""
        if hard:
            mip.addConstraint(expr <= limit)
        else:
            soft_excess(expr - limit, weight)

    for (d, s, k), entry in pb.cover.items():
        count = pulp.lpSum(x[p, d, s, k] for p in pb.people if k in pb.skills_of[p])
        low = entry.get("min", 0)
        if low > 0:
            bound(low - count, 0, entry.get("severity", "hard") == "hard",
                  weight_of(entry, "min_weight"))
        target = entry.get("target", low)
        if target > 0:
            soft_excess(target - count, weight_of(entry, "target_weight"))
        if "max" in entry:
            soft_excess(count - entry["max"], weight_of(entry, "max_weight"))

    for p, d, req in pb.requests:
        weight = weight_of(req, "weight")
        if req.get("off"):
            penalty.append((weight, w[p, d]))
        elif "shift" in req:
            penalty.append((weight, 1 - y[p, d, req["shift"]]))
        else:
            penalty.append((weight, y[p, d, req["not"]]))

    last = len(pb.dates) - 1
    for rule in pb.rules:
        kind, hard, weight = rule["kind"], rule["hard"], rule["weight"]
        for p in rule["scope"]:
            if kind == "forbid-sequence":
                seq = rule["sequence"]
                for t in range(len(pb.dates) - len(seq) + 1):
                    match = pulp.lpSum(1 - w[p, t + i] if item == "off" else y[p, t + i, item]
                                       for i, item in enumerate(seq))
                    bound(match, len(seq) - 1, hard, weight)
            elif kind == "max-consecutive-days":
                # each day that closes days+1 worked days in a row is one day too many
                m = rule["days"]
                for t in range(m, last + 1):
                    bound(pulp.lpSum(w[p, i] for i in range(t - m, t + 1)), m, hard, weight)
            elif kind == "min-consecutive-days":
                # a run exactly [a, b], off on both sides, not touching the edges
                m = rule["days"]
                for a in range(1, last):
                    for length in range(1, m):
                        b = a + length - 1
                        if b > last - 1:
                            break
                        run = (pulp.lpSum(w[p, i] for i in range(a, b + 1))
                               - w[p, a - 1] - w[p, b + 1] - (length - 1))
                        bound(run, 0, hard, weight * (m - length))
            elif kind == "max-count":
                if "shift" in rule:
                    count = pulp.lpSum(y[p, d, rule["shift"]] for d in pb.days)
                else:
                    count = pulp.lpSum(w[p, d] for d in pb.days)
                bound(count, rule["count"], hard, weight)
            elif kind == "max-weekends":
                worked = []
                for block in pb.weekends:
                    ww = aux(upper=1)
                    for d in block:
                        mip += ww >= w[p, d]
                    worked.append(ww)
                bound(pulp.lpSum(worked), rule["count"], hard, weight)
            elif kind in ("min-hours", "max-hours") and "window_days" not in rule:
                total = pulp.lpSum(minutes[p, d] for d in pb.days)
                limit = int(rule["hours"] * 60)
                if kind == "min-hours":
                    bound(limit - total, 0, hard, weight / 60)
                else:
                    bound(total, limit, hard, weight / 60)
            elif kind == "max-hours":
                add_window_max_hours(mip, aux, penalty, pb, minutes, p, rule)
            else:
                raise ValueError("no MIP for rule kind %s" % kind)

    # Weights have at most 2 decimals and hours count in minutes, so scaling by the
    # common denominator makes the objective integral.
    scale = 1
    for weight, _ in penalty:
        scale = scale * weight.denominator // math.gcd(scale, weight.denominator)
    mip += pulp.lpSum(int(weight * scale) * expr for weight, expr in penalty)
    return mip, x, scale


def add_window_max_hours(mip, aux, penalty, pb, minutes, p, rule):
    """max-hours over every window of window_days days.

    Consecutive breaching window starts form one record whose amount is the
    largest excess among them: b[t] = window t breaches (exactly), r[t] = the
    amount of the record holding t (equal along a record), c[t] = that amount,
    charged once where a record starts.
    """
    span, limit = rule["window_days"], int(rule["hours"] * 60)
    starts = range(len(pb.dates) - span + 1)
    load = [pulp.lpSum(minutes[p, d] for d in range(t, t + span)) for t in starts]
    if rule["hard"]:
        for expr in load:
            mip += expr <= limit
        return
    most = span * max(pb.paid.values()) - limit      # largest possible excess
    if most <= 0:
        return
    b = [aux(upper=1) for _ in starts]
    r = [aux(upper=most) for _ in starts]
    charged = [aux(upper=most) for _ in starts]
    for t in starts:
        mip += load[t] - limit <= most * b[t]
        mip += load[t] - limit >= 1 - (limit + 1) * (1 - b[t])   # whole minutes
        mip += r[t] >= load[t] - limit
        mip += r[t] <= most * b[t]
        opens = b[t] - (b[t - 1] if t > 0 else 0)
        mip += charged[t] >= r[t] - most * (1 - opens)
        if t > 0:
            both_out = 2 - b[t] - b[t - 1]
            mip += r[t] - r[t - 1] <= most * both_out
            mip += r[t - 1] - r[t] <= most * both_out
        penalty.append((rule["weight"] / 60, charged[t]))
    for t in starts:                      # valid and tightening: all records >= any one
        mip += pulp.lpSum(charged) >= r[t]


def solve_mip(pb):
    """Returns (outcome, roster, objective); outcome is "optimal", "infeasible" (the
    hard rules cannot all hold) or "unproven" (no proof within CBC_TIME_LIMIT).

    roster[person][day] = (shift, skill) or None for a day off.
    """
    mip, x, scale = build_mip(pb)
    status = mip.solve(pulp.COIN_CMD(path=CBC_PATH, msg=False, gapRel=0,
                                     timeLimit=CBC_TIME_LIMIT))
    if status == pulp.LpStatusInfeasible:
        return "infeasible", None, None
    if mip.sol_status != pulp.LpSolutionOptimal:
        return "unproven", None, None
    roster = {p: [None] * len(pb.dates) for p in pb.people}
    for (p, d, s, k), var in x.items():
        if var.value() > 0.5:
            roster[p][d] = (s, k)
    return "optimal", roster, pulp.value(mip.objective) / scale


# --------------------------------------------------------------------------
# Direct scorer: a second, run-by-run reading of the same rules
# --------------------------------------------------------------------------

def runs(flags):
    """(first, last) of each maximal run of True."""
    found, begin = [], None
    for i, flag in enumerate(flags + [False]):
        if flag and begin is None:
            begin = i
        elif not flag and begin is not None:
            found.append((begin, i - 1))
            begin = None
    return found


def score(pb, roster):
    """(hard, soft, soft penalty per rule id) of a roster, as exact fractions."""
    hard, soft, by_rule = Fraction(0), Fraction(0), {}

    def charge(rule_id, is_hard, penalty):
        nonlocal hard, soft
        if penalty <= 0:
            return
        if is_hard:
            hard += penalty
        else:
            soft += penalty
            by_rule[rule_id] = by_rule.get(rule_id, 0) + penalty

    for (d, s, k), entry in pb.cover.items():
        count = sum(1 for p in pb.people if roster[p][d] == (s, k))
        low = entry.get("min", 0)
        charge("cover", entry.get("severity", "hard") == "hard",
               max(0, low - count) * weight_of(entry, "min_weight"))
        charge("cover", False,
               max(0, entry.get("target", low) - count) * weight_of(entry, "target_weight"))
        if "max" in entry:
            charge("cover", False, max(0, count - entry["max"]) * weight_of(entry, "max_weight"))

    for p, d, req in pb.requests:
        cell = roster[p][d]
        shift = cell[0] if cell else None
        if req.get("off"):
            broken = cell is not None
        elif "shift" in req:
            broken = shift != req["shift"]
        else:
            broken = shift == req["not"]
        charge("request", False, weight_of(req, "weight") * broken)

    last = len(pb.dates) - 1
    for rule in pb.rules:
        kind, rid, hard_rule, weight = rule["kind"], rule["id"], rule["hard"], rule["weight"]
        for p in rule["scope"]:
            shifts = [cell[0] if cell else "off" for cell in roster[p]]
            worked = [cell is not None for cell in roster[p]]
            hours = [Fraction(pb.paid[cell[0]], 60) if cell else 0 for cell in roster[p]]
            amount = 0
            if kind == "forbid-sequence":
                seq = rule["sequence"]
                amount = sum(1 for t in range(len(shifts) - len(seq) + 1)
                             if shifts[t:t + len(seq)] == seq)
            elif kind == "max-consecutive-days":
                amount = sum(max(0, b - a + 1 - rule["days"]) for a, b in runs(worked))
            elif kind == "min-consecutive-days":
                amount = sum(max(0, rule["days"] - (b - a + 1)) for a, b in runs(worked)
                             if a > 0 and b < last)
            elif kind == "max-count":
                count = sum(1 for s in shifts if s != "off" and s == rule.get("shift", s))
                amount = max(0, count - rule["count"])
            elif kind == "max-weekends":
                count = sum(1 for block in pb.weekends if any(worked[d] for d in block))
                amount = max(0, count - rule["count"])
            elif kind == "min-hours":
                amount = max(0, Fraction(str(rule["hours"])) - sum(hours))
            elif kind == "max-hours" and "window_days" not in rule:
                amount = max(0, sum(hours) - Fraction(str(rule["hours"])))
            elif kind == "max-hours":
                span = rule["window_days"]
                excess = [sum(hours[t:t + span]) - Fraction(str(rule["hours"]))
                          for t in range(len(hours) - span + 1)]
                amount = sum(max(excess[a:b + 1]) for a, b in runs([e > 0 for e in excess]))
            charge(rid, hard_rule, amount * weight)
    return hard, soft, by_rule


# --------------------------------------------------------------------------
# Runner: files on disk and the rotaweave binary
# --------------------------------------------------------------------------

def write_roster_csv(pb, roster, path):
    lines = [",".join(["staff"] + [d.isoformat() for d in pb.dates])]
    for p in pb.people:
        cells = []
        for cell in roster[p]:
            if cell is None:
                cells.append("")
            elif len(pb.skills_of[p]) > 1:
                cells.append("%s/%s" % cell)
            else:
                cells.append(cell[0])
        lines.append(",".join([p] + cells))
    with open(path, "w") as f:
        f.write("\n".join(lines) + "\n")


def run_rotaweave(binary, args, out_dir, timeout):
    """Runs one command; returns (exit code, report.json or None, stderr)."""
    try:
        done = subprocess.run([binary] + args + ["--out", out_dir], capture_output=True,
                              text=True, timeout=timeout)
    except subprocess.TimeoutExpired:
        return None, None, "no answer within %d s" % timeout
    report_path = os.path.join(out_dir, "report.json")
    report = None
    if os.path.exists(report_path):
        with open(report_path) as f:
            report = json.load(f)
    return done.returncode, report, done.stderr.strip()


def soft_by_rule(report):
    totals = {}
    for v in report["violations"]:
        if v["severity"] == "soft":
            totals[v["rule"]] = totals.get(v["rule"], 0) + v["penalty"]
    return totals


# --------------------------------------------------------------------------
# Comparison
# --------------------------------------------------------------------------

def compare_check(binary, scenario_path, csv_path, out_dir, optimum, expected_by_rule):
    """(a) rotaweave check on CBC's roster must agree with CBC's objective."""
    code, report, err = run_rotaweave(binary, ["check", scenario_path, "--roster", csv_path],
                                      out_dir, timeout=60)
    if report is None:
        return ["check exit %s, no report.json: %s" % (code, err)], None
    problems = []
    summary = report["summary"]
    if code != 0:
        problems.append("check exit code %d" % code)
    if summary["hard"] != 0:
        problems.append("check hard %s != 0" % summary["hard"])
        problems += ["  %s" % v["message"] for v in report["violations"]
                     if v["severity"] == "hard"]
    if abs(summary["soft"] - optimum) > TOLERANCE:
        problems.append("check soft %s != CBC %s" % (summary["soft"], optimum))
        seen = soft_by_rule(report)
        for rid in sorted(set(seen) | set(expected_by_rule)):
            mine, theirs = float(expected_by_rule.get(rid, 0)), seen.get(rid, 0)
            if abs(mine - theirs) > TOLERANCE:
                problems.append("  rule %s: reference %s, rotaweave %s" % (rid, mine, theirs))
    return problems, summary["soft"]


def compare_solve(binary, scenario_path, out_dir, optimum, generations, exact):
    """(b) rotaweave solve must be feasible, never beat CBC, and reach it when exact."""
    args = ["solve", scenario_path, "--seed", "1", "--generations", str(generations), "--target", "%.4f" % optimum,
            "--time-limit", str(TIME_CAP), "--threads", "2", "--quiet"]
    code, report, err = run_rotaweave(binary, args, out_dir, timeout=TIME_CAP + 60)
    if report is None:
        return ["solve exit %s, no report.json: %s" % (code, err)], None
    problems = []
    summary = report["summary"]
    if summary["hard"] != 0 or code != 0:
        problems.append("solve hard %s, exit %d" % (summary["hard"], code))
    if summary["soft"] < optimum - TOLERANCE:
        problems.append("solve soft %s beats the CBC optimum %s" % (summary["soft"], optimum))
    if exact and summary["soft"] > optimum + TOLERANCE:
        problems.append("solve soft %s misses the CBC optimum %s" % (summary["soft"], optimum))
    # The proven lower bound, where the report gives one, never lies above the optimum.
    bound = summary.get("lower_bound")
    if bound is not None and bound > optimum + TOLERANCE:
        problems.append("lower bound %s lies above the CBC optimum %s" % (bound, optimum))
    return problems, (summary["soft"], bound)


def feasible_scenarios():
    """The first SCENARIO_COUNT seeds from FIRST_SEED that CBC solves to proven
    optimality with every hard rule kept and some soft penalty left; the others
    are reported and skipped."""
    found, seed = [], FIRST_SEED
    while len(found) < SCENARIO_COUNT:
        scn = generate_scenario(seed)
        pb = Problem(scn)
        outcome, roster, objective = solve_mip(pb)
        if outcome == "optimal" and objective > TOLERANCE:
            found.append((scn, pb, roster, objective))
        elif outcome == "optimal":
            print("skip seed%d: CBC's optimum breaks nothing, too easy to tell anything" % seed)
        elif outcome == "infeasible":
            print("skip seed%d: the hard rules cannot all hold (CBC: infeasible)" % seed)
        else:
            print("skip seed%d: CBC did not prove optimality within %d s"
                  % (seed, CBC_TIME_LIMIT))
        sys.stdout.flush()
        seed += 1
    return found


def size(pb):
    return len(pb.people) * len(pb.dates) * len(pb.shifts)


def describe(rule):
    window = "/%dd" % rule["window_days"] if "window_days" in rule else ""
    return "%s%s:%s" % (rule["kind"], window, "hard" if rule["hard"] else "soft")


def main():
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rotaweave", required=True, help="path to the rotaweave binary")
    parser.add_argument("--work", help="directory for scenarios, rosters and outputs")
    parser.add_argument("--only-check", action="store_true", help="skip rotaweave solve")
    args = parser.parse_args()
    binary = os.path.abspath(args.rotaweave)
    work = args.work or tempfile.mkdtemp(prefix="rotaweave-mip-")
    os.makedirs(work, exist_ok=True)
    began = time.time()

    scenarios = feasible_scenarios()
    by_size = sorted(range(len(scenarios)), key=lambda i: (size(scenarios[i][1]), i))
    exact = set(by_size[:EXACT_COUNT])

    passed = failed = bounds = 0
    for i, (scn, pb, roster, objective) in enumerate(scenarios):
        name = "seed%d" % scn["seed"]
        base = os.path.join(work, name)
        os.makedirs(base, exist_ok=True)
        scenario_path = os.path.join(base, "scenario.yaml")
        csv_path = os.path.join(base, "cbc.csv")
        with open(scenario_path, "w") as f:
            f.write(to_yaml(scn))
        write_roster_csv(pb, roster, csv_path)

        # The MIP's objective must equal the direct scorer's reading of its roster.
        hard, soft, expected_by_rule = score(pb, roster)
        problems = []
        if hard != 0 or abs(float(soft) - objective) > TOLERANCE:
            problems.append("reference self-check: scorer hard %s soft %s, CBC %s"
                            % (hard, float(soft), objective))
        found, checked = compare_check(binary, scenario_path, csv_path,
                                       os.path.join(base, "check"), objective, expected_by_rule)
        problems += found
        line = "%s %dp %dd %dsh %dsk: CBC %g, check %s" % (
            name, len(pb.people), len(pb.dates), len(pb.shifts),
            len(scn["skills"]), objective, checked)
        if not args.only_check:
            generations = EXACT_GENERATIONS if i in exact else OTHER_GENERATIONS
            found, solved = compare_solve(binary, scenario_path, os.path.join(base, "solve"),
                                          objective, generations, i in exact)
            problems += found
            soft, bound = solved if solved else (None, None)
            bounds += bound is not None
            line += ", solve %s (%d generations%s), bound %s" % (soft, generations, ", must match" if i in exact else "", bound)
        line += " [%s]" % " ".join(describe(rule) for rule in pb.rules)
        if problems:
            failed += 1
            print("FAIL " + line)
            for problem in problems:
                print("     " + problem)
        else:
            passed += 1
            print("ok   " + line)
        sys.stdout.flush()

    print("work directory: %s; %.0f s; %d of %d solves proved a lower bound" % (work, time.time() - began, bounds, passed + failed))
    print("%d passed, %d failed" % (passed, failed))
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
