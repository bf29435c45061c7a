#!/usr/bin/python3
"""@brief Independent scorer of the Employee Shift Scheduling Benchmark model, read straight from an instance file.

Usage:
  benchmark_score.py INSTANCE.txt ROSTER.csv [--json] [--verbose]
      Prints "hard N" (number of hard-constraint violations in the benchmark's own sense)
      and "soft P" (the benchmark objective: request and cover penalties).
  benchmark_score.py INSTANCE.txt --random N --seed S --out DIR
      Writes N rosters DIR/roster-000.csv ... for tests: uniform random, random that keeps the
      days off, feasible (every hard constraint holds, when the construction succeeds), then
      copies of the feasible one with one cell changed.

Rosters use rotaweave's CSV layout: header "staff,DATE,...", one row per employee, cell = shift
id (optionally "SHIFT/skill"), empty = day off. Column k is benchmark day k; the first date must
be a Monday, as in the benchmark.

The model (hard constraints, counted one per breach):
  rotation      shift B on day d+1 after A on day d where B cannot follow A (one per pair)
  max-shifts    shifts of one type above the employee's MaxShifts limit (one per type)
  total-minutes worked minutes outside [MinTotalMinutes, MaxTotalMinutes] (one per employee)
  max-consecutive-shifts  a run of worked days longer than the bound (one per run)
  min-consecutive-shifts  a run of worked days shorter than the bound, not touching the
                          first or last day (one per run)
  min-consecutive-days-off  the same for runs of days off
  max-weekends  weekends (Saturday or Sunday worked) above the bound (one per employee)
  days-off      a shift on a listed day off (one per day)
Soft: shift-on request missed -> weight; shift-off request broken -> weight; cover row with x
employees on it -> (r - x) * under if x < r, (x - r) * over if x > r.
"""
import argparse
import csv
import datetime
import json
import os
import random
import sys

START_DATE = datetime.date(2027, 3, 1)  # a Monday, the start date of converted scenarios


# ------------------------------------------------------------------ instance

class Instance:
    def __init__(self):
        self.horizon = 0
        self.shifts = []          # ids in file order
        self.length = {}          # id -> minutes
        self.cannot_follow = {}   # id -> set of ids
        self.staff = []           # dicts, file order
        self.on_requests = []     # (staff, day, shift, weight)
        self.off_requests = []
        self.cover = []           # (day, shift, requirement, under, over)


def _sections(path):
    sections, current = {}, None
    with open(path, encoding="utf-8") as f:
        for number, raw in enumerate(f, 1):
            text = raw.strip()
            if not text or text.startswith("#"):
                continue
            if text.startswith("SECTION_"):
                current = sections.setdefault(text, [])
                continue
            if current is None:
                raise ValueError(f"{path}:{number}: data before the first section")
            current.append(text)
    return sections


def parse_instance(path):
    sec = _sections(path)
    inst = Instance()
    inst.horizon = int(sec["SECTION_HORIZON"][0])
    for row in sec["SECTION_SHIFTS"]:
        sid, length, follow = (x.strip() for x in row.split(","))
        inst.shifts.append(sid)
        inst.length[sid] = int(length)
        inst.cannot_follow[sid] = set(x for x in follow.split("|") if x)
    for row in sec["SECTION_STAFF"]:
        f = [x.strip() for x in row.split(",")]
        limits = {}
        for entry in filter(None, f[1].split("|")):
            sid, limit = entry.split("=")
            limits[sid.strip()] = int(limit)
        inst.staff.append({
            "id": f[0], "max_shifts": limits,
            "max_minutes": int(f[2]), "min_minutes": int(f[3]),
            "max_consecutive": int(f[4]), "min_consecutive": int(f[5]),
            "min_off": int(f[6]), "max_weekends": int(f[7]), "days_off": set(),
        })
    by_id = {s["id"]: s for s in inst.staff}
    for row in sec.get("SECTION_DAYS_OFF", []):
        f = [x.strip() for x in row.split(",")]
        by_id[f[0]]["days_off"].update(int(x) for x in f[1:] if x)
    for key, target in (("SECTION_SHIFT_ON_REQUESTS", inst.on_requests),
                        ("SECTION_SHIFT_OFF_REQUESTS", inst.off_requests)):
        for row in sec.get(key, []):
            e, d, s, w = (x.strip() for x in row.split(","))
            target.append((e, int(d), s, int(w)))
    for row in sec.get("SECTION_COVER", []):
        d, s, r, under, over = (x.strip() for x in row.split(","))
        inst.cover.append((int(d), s, int(r), int(under), int(over)))
    return inst


# ------------------------------------------------------------------ roster CSV

def read_roster(path, inst):
    """Returns {staff id: [shift id or None] * horizon}."""
    with open(path, encoding="utf-8-sig", newline="") as f:
        rows = list(csv.reader(f))
    header = rows[0]
    dates = [datetime.date.fromisoformat(x.strip()) for x in header[1:]]
    if len(dates) != inst.horizon:
        raise ValueError(f"{path}: {len(dates)} date columns, the instance has {inst.horizon} days")
    if dates[0].weekday() != 0 or any((b - a).days != 1 for a, b in zip(dates, dates[1:])):
        raise ValueError(f"{path}: dates must be consecutive and start on a Monday")
    roster = {}
    for row in rows[1:]:
        if not row or not any(c.strip() for c in row):
            continue
        cells = []
        for cell in row[1:]:
            sid = cell.strip().split("/")[0] or None
            if sid is not None and sid not in inst.length:
                raise ValueError(f"{path}: unknown shift '{sid}'")
            cells.append(sid)
        cells += [None] * (inst.horizon - len(cells))
        roster[row[0].strip()] = cells
    missing = [s["id"] for s in inst.staff if s["id"] not in roster]
    if missing:
        raise ValueError(f"{path}: no row for {', '.join(missing)}")
    return roster


def write_roster(path, inst, roster, role_suffix=frozenset()):
    """role_suffix: (staff, day) cells written as SHIFT/any."""
    with open(path, "w", encoding="utf-8", newline="") as f:
        w = csv.writer(f, lineterminator="\n")
        w.writerow(["staff"] + [(START_DATE + datetime.timedelta(days=d)).isoformat()
                                for d in range(inst.horizon)])
        for s in inst.staff:
            cells = roster[s["id"]]
            w.writerow([s["id"]] + [
                "" if c is None else (c + "/any" if (s["id"], d) in role_suffix else c)
                for d, c in enumerate(cells)])


# ------------------------------------------------------------------ scoring

def _runs(cells, worked):
    """(start, length) of maximal runs where (cell is not None) == worked."""
    runs, start = [], None
    for d, c in enumerate(cells + ["#end"]):
        inside = d < len(cells) and ((c is not None) == worked)
        if inside and start is None:
            start = d
        elif not inside and start is not None:
            runs.append((start, d - start))
            start = None
    return runs


def employee_violations(inst, s, cells):
    """Hard violations of one employee's row, as (constraint, detail) pairs."""
    out = []
    h = inst.horizon
    for d in range(h - 1):
        a, b = cells[d], cells[d + 1]
        if a is not None and b is not None and b in inst.cannot_follow[a]:
            out.append(("rotation", f"{b} on day {d + 1} after {a}"))
    for sid, limit in s["max_shifts"].items():
        n = sum(1 for c in cells if c == sid)
        if n > limit:
            out.append(("max-shifts", f"{n} x {sid}, limit {limit}"))
    minutes = sum(inst.length[c] for c in cells if c is not None)
    if not s["min_minutes"] <= minutes <= s["max_minutes"]:
        out.append(("total-minutes", f"{minutes} not in [{s['min_minutes']}, {s['max_minutes']}]"))
    for start, n in _runs(cells, True):
        if n > s["max_consecutive"]:
            out.append(("max-consecutive-shifts", f"{n} days from day {start}"))
        if n < s["min_consecutive"] and start > 0 and start + n < h:
            out.append(("min-consecutive-shifts", f"{n} days from day {start}"))
    for start, n in _runs(cells, False):
        if n < s["min_off"] and start > 0 and start + n < h:
            out.append(("min-consecutive-days-off", f"{n} days from day {start}"))
    weekends = sum(1 for w in range(0, h, 7)
                   if any(d < h and cells[d] is not None for d in (w + 5, w + 6)))
    if weekends > s["max_weekends"]:
        out.append(("max-weekends", f"{weekends} weekends, limit {s['max_weekends']}"))
    for d in sorted(s["days_off"]):
        if cells[d] is not None:
            out.append(("days-off", f"day {d}"))
    return out


def score(inst, roster):
    """Returns {"hard": count, "soft": penalty, "request": .., "cover": .., "violations": [...]}."""
    violations = []
    for s in inst.staff:
        violations += [(s["id"], c, d) for c, d in employee_violations(inst, s, roster[s["id"]])]
    request = sum(w for e, d, sid, w in inst.on_requests if roster[e][d] != sid)
    request += sum(w for e, d, sid, w in inst.off_requests if roster[e][d] == sid)
    cover = 0
    for d, sid, r, under, over in inst.cover:
        x = sum(1 for s in inst.staff if roster[s["id"]][d] == sid)
        cover += (r - x) * under if x < r else (x - r) * over
    return {"hard": len(violations), "soft": request + cover, "request": request, "cover": cover,
            "violations": violations}


# ------------------------------------------------------------------ random rosters

def random_row(inst, s, rng, keep_days_off):
    cells = []
    for d in range(inst.horizon):
        if (keep_days_off and d in s["days_off"]) or rng.random() < 0.35:
            cells.append(None)
        else:
            cells.append(rng.choice(inst.shifts))
    return cells


class _Pattern:
    """Work/off patterns of one employee: the run rules, weekends and days off, without shift types.

    A state (run, edge, weekends) holds the current run (> 0 worked days, < 0 days off, capped at
    MinConsecutiveDaysOff; 0 before day 0), whether that run began on day 0, and the weekends
    worked so far."""

    def __init__(self, inst, s):
        self.s, self.h = s, inst.horizon
        self.off_cap = max(s["min_off"], 1)
        self.memo = {}

    def step(self, d, state, work):
        """The state after day d, or None when that choice breaks a rule."""
        s, (run, edge, weekends) = self.s, state
        if not work:
            if 0 < run < s["min_consecutive"] and not edge:
                return None
            return (max(run - 1, -self.off_cap) if run < 0 else -1, edge if run < 0 else d == 0, weekends)
        if d in s["days_off"] or max(run, 0) + 1 > s["max_consecutive"]:
            return None
        if run < 0 and -run < s["min_off"] and not edge:
            return None
        if d % 7 == 5 or (d % 7 == 6 and run <= 0):
            weekends += 1
            if weekends > s["max_weekends"]:
                return None
        return (run + 1 if run > 0 else 1, edge if run > 0 else d == 0, weekends)

    def bounds(self, d, state):
        """(fewest, most) days that can still be worked from day d on, or None if no pattern is left."""
        key = (d, state)
        if key not in self.memo:
            if d == self.h:
                self.memo[key] = (0, 0)
            else:
                found = []
                for work in (False, True):
                    nxt = self.step(d, state, work)
                    rest = self.bounds(d + 1, nxt) if nxt is not None else None
                    if rest is not None:
                        found.append((rest[0] + work, rest[1] + work))
                self.memo[key] = (min(f[0] for f in found), max(f[1] for f in found)) if found else None
        return self.memo[key]


class _RowSearch:
    """Randomised depth-first search for one employee's row meeting every hard constraint,
    pruned by the pattern bounds on the days still to be worked."""

    def __init__(self, inst, s, pattern, rng, budget):
        self.inst, self.s, self.pattern, self.rng, self.budget = inst, s, pattern, rng, budget
        self.target = (s["min_minutes"] + s["max_minutes"]) / 2
        self.cells = [None] * inst.horizon
        self.counts = {sid: 0 for sid in inst.shifts}

    def run(self):
        try:
            return list(self.cells) if self._extend(0, 0, (0, True, 0)) else None
        except TimeoutError:
            return None

    def _options(self, d, minutes, state):
        """Candidate cells for day d, most promising first: weekends are rationed to the
        MaxWeekends budget, other days follow the pace towards the middle of the minutes range."""
        s, inst, h = self.s, self.inst, self.inst.horizon
        run, _, weekends = state
        shifts = [x for x in inst.shifts if s["max_shifts"].get(x, 10 ** 9) > self.counts[x]]
        self.rng.shuffle(shifts)
        if d % 7 == 5 or (d % 7 == 6 and run <= 0):
            want_work = (s["max_weekends"] - weekends) / max((h - d + 1) // 7, 1) - 0.5 * (d % 7 == 6)
        else:
            days_left = h - d
            want_work = (self.target - minutes) / (self.target / h * days_left * 1.2 + 1)
        if 0 < run < s["min_consecutive"]:
            want_work += 0.5
        return shifts + [None] if self.rng.random() < want_work else [None] + shifts

    def _minutes(self, days, longest):
        """Most (or fewest) minutes `days` more shifts can add within the MaxShifts limits."""
        total = 0
        for sid in sorted(self.inst.shifts, key=self.inst.length.get, reverse=longest):
            take = min(days, self.s["max_shifts"].get(sid, days) - self.counts[sid])
            total += take * self.inst.length[sid]
            days -= take
        return total if days <= 0 else (float("inf") if not longest else total)

    def _extend(self, d, minutes, state):
        self.budget -= 1
        if self.budget < 0:
            raise TimeoutError
        if d == self.inst.horizon:
            return True
        s, inst = self.s, self.inst
        prev = self.cells[d - 1] if d > 0 else None
        for v in self._options(d, minutes, state):
            nxt = self.pattern.step(d, state, v is not None)
            if nxt is None or (v is not None and prev is not None and v in inst.cannot_follow[prev]):
                continue
            new_minutes = minutes + (inst.length[v] if v is not None else 0)
            rest = self.pattern.bounds(d + 1, nxt)
            if v is not None:
                self.counts[v] += 1
            if (rest is None or new_minutes + self._minutes(rest[1], True) < s["min_minutes"]
                    or new_minutes + self._minutes(rest[0], False) > s["max_minutes"]):
                if v is not None:
                    self.counts[v] -= 1
                continue
            self.cells[d] = v
            if self._extend(d + 1, new_minutes, nxt):
                return True
            if v is not None:
                self.counts[v] -= 1
            self.cells[d] = None
        return False


def feasible_row(inst, s, rng, tries=20, budget=20000):
    """A row meeting every hard constraint of `s`, or None when none was found in time."""
    sys.setrecursionlimit(max(10000, 8 * inst.horizon))
    pattern = _Pattern(inst, s)
    for _ in range(tries):
        row = _RowSearch(inst, s, pattern, rng, budget).run()
        if row is not None:
            return row
    return None


def feasible_roster(inst, rng):
    """Every row feasible where the search succeeds; other rows keep the days off only."""
    roster = {}
    for s in inst.staff:
        roster[s["id"]] = feasible_row(inst, s, rng) or random_row(inst, s, rng, True)
    return roster


def mutate(inst, roster, rng):
    s = rng.choice(inst.staff)
    d = rng.randrange(inst.horizon)
    cells = list(roster[s["id"]])
    choices = [x for x in inst.shifts + [None] if x != cells[d]]
    cells[d] = rng.choice(choices)
    out = dict(roster)
    out[s["id"]] = cells
    return out


KINDS = ("uniform", "days-off-kept", "feasible", "feasible-mutant")


def random_rosters(inst, n, seed, kinds=KINDS):
    """Yields (kind, roster, role_suffix cells) for n rosters: one of each of `kinds` in order,
    then more of the last kind (further mutants of the same feasible roster)."""
    rng = random.Random(seed)
    feasible = None
    for i in range(n):
        kind = kinds[min(i, len(kinds) - 1)]
        suffix = frozenset()
        if kind == "uniform":
            roster = {s["id"]: random_row(inst, s, rng, False) for s in inst.staff}
        elif kind == "days-off-kept":
            roster = {s["id"]: random_row(inst, s, rng, True) for s in inst.staff}
            suffix = frozenset((s["id"], d) for s in inst.staff for d in range(inst.horizon)
                               if rng.random() < 0.1)
        else:
            if feasible is None:
                feasible = feasible_roster(inst, rng)
            roster = feasible if kind == "feasible" else mutate(inst, feasible, rng)
        yield kind, roster, suffix


def write_random(inst, n, seed, out_dir):
    os.makedirs(out_dir, exist_ok=True)
    paths = []
    for i, (kind, roster, suffix) in enumerate(random_rosters(inst, n, seed)):
        path = os.path.join(out_dir, f"roster-{i:03d}.csv")
        write_roster(path, inst, roster, suffix)
        paths.append((kind, path))
    return paths


# ------------------------------------------------------------------ command line

def main(argv):
    p = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    p.add_argument("instance")
    p.add_argument("roster", nargs="?")
    p.add_argument("--json", action="store_true", help="print the result as JSON")
    p.add_argument("--verbose", action="store_true", help="list every hard violation")
    p.add_argument("--random", type=int, metavar="N", help="write N random rosters")
    p.add_argument("--seed", type=int, default=1)
    p.add_argument("--out", default=".", help="folder for --random rosters")
    a = p.parse_args(argv)
    try:
        return run(p, a)
    except (OSError, ValueError, KeyError, IndexError) as e:
        print(f"error: {e}", file=sys.stderr)
        return 2


def run(p, a):
    inst = parse_instance(a.instance)
    if a.random is not None:
        for kind, path in write_random(inst, a.random, a.seed, a.out):
            print(f"{path} {kind}")
        return 0
    if a.roster is None:
        p.error("give a ROSTER.csv or --random N")
    result = score(inst, read_roster(a.roster, inst))
    if a.json:
        print(json.dumps(result))
        return 0
    print(f"hard {result['hard']}")
    print(f"soft {result['soft']}")
    if a.verbose:
        print(f"  requests {result['request']}, cover {result['cover']}")
        for staff, constraint, detail in result["violations"]:
            print(f"  {staff}: {constraint}: {detail}")
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
