#!/usr/bin/env python3
"""`rotaweave check --baseline`: HR checks an edited roster against the one it came from.

The clinic-ward sample's hand-made roster is edited here (three cells), then checked with
`--baseline` the original. Expected values are computed by this script with its own readers
(csv, json, openpyxl), not by rotaweave: the changed cells from the two CSV files, and the new
and gone breaches from two plain `check` runs (violations of the edited roster not in the
original's, and the reverse, compared as whole records). Checks all three outputs (report.txt
BASELINE section, report.json `baseline`, the workbook's Baseline sheet), that the same roster
as its own baseline shows no change, and that a bad baseline exits 2 and writes nothing.
Environment: ROTAWEAVE (binary), ROTAWEAVE_SOURCE_DIR (repository), ROTAWEAVE_WORK (scratch).
"""
import collections
import csv
import json
import os
import shutil
import subprocess
import sys

import openpyxl

BINARY = os.environ.get("ROTAWEAVE", "rotaweave")
SOURCE = os.environ.get("ROTAWEAVE_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-check-baseline")
SCENARIO = os.path.join(SOURCE, "samples", "clinic-ward", "scenario.yaml")
ORIGINAL = os.path.join(SOURCE, "samples", "clinic-ward", "roster-handmade.csv")

passed = failed = 0


def expect(name, ok, detail=""):
    global passed, failed
    if ok:
        passed += 1
        print(f"ok   {name}")
    else:
        failed += 1
        print(f"FAIL {name}: {detail}")


def check(out, *extra):
    return subprocess.run([BINARY, "check", SCENARIO, "--out", out, *extra], capture_output=True, text=True, timeout=300)


def read_rows(path):
    with open(path, newline="", encoding="utf-8-sig") as f:
        return list(csv.reader(f))


def records(report):
    return collections.Counter((v["rule"], v["severity"], v["staff"], tuple(v["dates"]), v["amount"], v["penalty"])
                               for v in report["violations"])


def record(v):
    return (v["rule"], v["severity"], v["staff"], tuple(v["dates"]), v["amount"], v["penalty"])


def main():
    shutil.rmtree(WORK, ignore_errors=True)
    os.makedirs(WORK)
    rows = read_rows(ORIGINAL)
    dates = rows[0][1:]
    edited_rows = [list(r) for r in rows]
    # Three edits: a night where there was none, a late taken away, an early added.
    edited_rows[1][1] = "N"
    edited_rows[1][2] = ""
    edited_rows[2][3] = "E"
    edited = os.path.join(WORK, "edited.csv")
    with open(edited, "w", newline="") as f:
        csv.writer(f).writerows(edited_rows)
    want_cells = sorted((edited_rows[r][0], dates[c - 1], rows[r][c] or "off", edited_rows[r][c] or "off")
                        for r in range(1, len(rows)) for c in range(1, len(rows[r])) if rows[r][c] != edited_rows[r][c])
    expect("the edit changes three cells", len(want_cells) == 3, want_cells)

    # Independent expectation: two plain checks, violations compared as whole records.
    plain = {}
    for name, roster in (("original", ORIGINAL), ("edited", edited)):
        out = os.path.join(WORK, "plain-" + name)
        run = check(out, "--roster", roster)
        expect(f"plain check of the {name} roster", run.returncode in (0, 1), run.stderr)
        with open(os.path.join(out, "report.json")) as f:
            plain[name] = json.load(f)
    new_records = records(plain["edited"]) - records(plain["original"])
    gone_records = records(plain["original"]) - records(plain["edited"])

    out = os.path.join(WORK, "out")
    run = check(out, "--roster", edited, "--baseline", ORIGINAL)
    expect("check --baseline runs with the exit status of the edited roster",
           run.returncode == (1 if plain["edited"]["summary"]["hard_violations"] else 0), (run.returncode, run.stderr))
    with open(os.path.join(out, "report.json")) as f:
        report = json.load(f)
    base = report.get("baseline")
    expect("report.json has a baseline object", isinstance(base, dict), list(report))
    if not isinstance(base, dict):
        return 1
    got_cells = sorted((c["staff"], c["date"], c["before"], c["after"]) for c in base["cells"])
    expect("report.json: changed cells with before and after", got_cells == want_cells, (got_cells, want_cells))
    expect("report.json: people with a changed cell", base["people"] == len({c[0] for c in want_cells}), base["people"])
    got_new = collections.Counter(record(v) for v in base["new"]) + collections.Counter(record(c["after"]) for c in base["changed"])
    got_gone = collections.Counter(record(v) for v in base["gone"]) + collections.Counter(record(c["before"]) for c in base["changed"])
    expect("report.json: new (and changed) breaches are those only the edited roster has", got_new == new_records,
           (got_new, new_records))
    expect("report.json: gone (and changed) breaches are those only the original has", got_gone == gone_records,
           (got_gone, gone_records))
    expect("the edit makes at least one new breach", sum(new_records.values()) > 0, new_records)
    expect("report.json: penalties before and after", base["before"] == {"hard": plain["original"]["summary"]["hard"],
                                                                          "soft": plain["original"]["summary"]["soft"]}
           and base["after"] == {"hard": plain["edited"]["summary"]["hard"], "soft": plain["edited"]["summary"]["soft"]}, base["before"])

    with open(os.path.join(out, "report.txt")) as f:
        text = f.read()
    section = text[text.find("BASELINE"):]
    expect("report.txt has a BASELINE section", text.find("BASELINE (against") >= 0, text[:300])
    expect("report.txt lists each changed cell", all(f"{s}  {d}  {b} -> {a}" in section for s, d, b, a in want_cells), section[:600])
    expect("report.txt counts new and gone breaches", f"{len(base['new'])} new breach" in section and f"{len(base['gone'])} gone" in section,
           section[:300])

    book = openpyxl.load_workbook(os.path.join(out, "roster.xlsx"), data_only=True)
    expect("the workbook has a Baseline sheet", "Baseline" in book.sheetnames, book.sheetnames)
    if "Baseline" in book.sheetnames:
        ws = book["Baseline"]
        rows_seen = [[c.value for c in row] for row in ws.iter_rows()]
        cells_head = next(i for i, r in enumerate(rows_seen) if r[:5] == ["Person", "Name", "Date", "Before", "After"])
        sheet_cells = []
        for r in rows_seen[cells_head + 1:]:
            if r[0] is None:
                break
            sheet_cells.append((r[0], r[2], r[3], r[4]))
        expect("Baseline sheet: changed cells", sorted(sheet_cells) == want_cells, sheet_cells)
        breach_head = next(i for i, r in enumerate(rows_seen) if r[:3] == ["Status", "Severity", "Rule"])
        statuses = collections.Counter(r[0] for r in rows_seen[breach_head + 1:] if r[0])
        expect("Baseline sheet: new, gone and changed breaches", statuses == collections.Counter(
            {"new": len(base["new"]), "gone": len(base["gone"]), "changed": len(base["changed"])}) - collections.Counter(), statuses)

    # The same roster as its own baseline: nothing changed.
    run = check(os.path.join(WORK, "same"), "--roster", ORIGINAL, "--baseline", ORIGINAL)
    with open(os.path.join(WORK, "same", "report.json")) as f:
        same = json.load(f)["baseline"]
    expect("a roster against itself: no cell, no new or gone breach",
           not same["cells"] and not same["new"] and not same["gone"] and not same["changed"], same)

    # A bad baseline is an input error: exit 2, nothing written.
    bad = os.path.join(WORK, "bad.csv")
    bad_rows = [list(r) for r in rows]
    bad_rows[3][4] = "Q"
    with open(bad, "w", newline="") as f:
        csv.writer(f).writerows(bad_rows)
    bad_out = os.path.join(WORK, "bad-out")
    run = check(bad_out, "--roster", edited, "--baseline", bad)
    expect("a baseline with an unknown shift exits 2, names the file and writes nothing",
           run.returncode == 2 and "bad.csv" in run.stderr and not os.path.exists(os.path.join(bad_out, "report.json")),
           (run.returncode, run.stderr))

    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
