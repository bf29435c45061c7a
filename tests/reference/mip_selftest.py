#!/usr/bin/python3
"""Checks the MIP of mip_reference.py against exhaustive enumeration.

Tiny scenarios (two people, four to six days, a period that starts on a
Thursday so that a weekend falls inside it, three-day hour windows) are
generated the same way as the reference set; every roster is enumerated and
scored by the direct scorer, and the best (hard, soft) must equal CBC's
answer (independent reference: COIN-OR CBC via PuLP).
Prints one line per scenario and ends with "N passed, M failed".
"""

import datetime
import itertools
import sys

import mip_reference as ref

THURSDAY = datetime.date(2027, 3, 4)
MAX_ROSTERS = 20000
WANTED = 25


def tiny_scenarios():
    """The first WANTED seeds whose roster space is small enough to enumerate."""
    seed = 1
    while True:
        scn = ref.generate_scenario(seed, people=(2, 2), days=(4, 6), start=THURSDAY,
                                    window_days=3)
        pb = ref.Problem(scn)
        if space_size(pb) <= MAX_ROSTERS:
            yield scn, pb
        seed += 1


def cell_options(pb, person):
    return [None] + [(s, k) for s in pb.shifts for k in pb.skills_of[person]]


def space_size(pb):
    size = 1
    for person in pb.people:
        size *= len(cell_options(pb, person)) ** len(pb.dates)
    return size


def brute_force(pb):
    """Lowest (hard, soft) over every roster."""
    rows = {p: list(itertools.product(cell_options(pb, p), repeat=len(pb.dates)))
            for p in pb.people}
    best = None
    for combo in itertools.product(*(rows[p] for p in pb.people)):
        roster = {p: list(row) for p, row in zip(pb.people, combo)}
        hard, soft, _ = ref.score(pb, roster)
        if best is None or (hard, soft) < best:
            best = (hard, soft)
    return best


def main():
    passed = failed = 0
    for scn, pb in itertools.islice(tiny_scenarios(), WANTED):
        hard, soft = brute_force(pb)
        outcome, roster, objective = ref.solve_mip(pb)
        if outcome != "optimal":
            ok = outcome == "infeasible" and hard > 0
            line = "seed %d: enumeration hard %s, CBC %s" % (scn["seed"], float(hard), outcome)
        else:
            ok = hard == 0 and abs(float(soft) - objective) <= ref.TOLERANCE
            line = "seed %d: enumeration %s, CBC %s" % (scn["seed"], float(soft), objective)
        kinds = ",".join(r["kind"] + ("/hard" if r["hard"] else "/soft") for r in pb.rules)
        print("%s %s [%s]" % ("ok  " if ok else "FAIL", line, kinds))
        sys.stdout.flush()
        passed += ok
        failed += not ok
    print("%d passed, %d failed" % (passed, failed))
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
