"""Reads roster.xlsx back and compares it with roster.csv and report.json.

The workbook is read with openpyxl and the inputs with PyYAML and the csv module: readers
written independently of rotaweave (which writes with libxlsxwriter), so a mistake on
either side shows up as a mismatch. Runs `rotaweave solve` and `rotaweave check` on a small
scenario written here, and `solve` on every bundled sample.
Environment: ROTAWEAVE (binary), ROTAWEAVE_SOURCE_DIR, ROTAWEAVE_WORK (scratch folder).
"""
import csv
import datetime
import glob
import json
import os
import re
import shutil
import subprocess
import sys

import openpyxl
import yaml

BINARY = os.environ.get("ROTAWEAVE", "rotaweave")
SOURCE = os.environ.get("ROTAWEAVE_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-xlsx-readback")

SCENARIO = """\
name: "Readback ward, two weeks"
period: {start: 2027-03-01, end: 2027-03-14}
holidays: [2027-03-08]
shifts:
  - {id: E, label: Early, start: "07:00", end: "15:00", break_minutes: 30, colour: "#FFE699"}
  - {id: L, label: Late, start: "14:00", end: "22:00", break_minutes: 30}
  - {id: N, label: Night, start: "21:30", end: "07:00", break_minutes: 45}
skills: [rn, hca]
contracts:
  full: {hours: {min: 60, max: 80}}
staff:
  - {id: ana, name: "Ana Lee, RN", contract: full, skills: [rn], fixed: [{date: 2027-03-01, shift: N}]}
  - {id: ben, name: Ben Ortiz, contract: full, skills: [rn, hca]}
  - {id: cai, name: Cai Wu, contract: full, skills: [rn], absences: [{from: 2027-03-05, to: 2027-03-06}]}
  - {id: dee, name: "Dee; Park", contract: full, skills: [hca]}
  - {id: eli, name: Eli Moss, contract: full, skills: [hca, rn]}
  - {id: fay, name: Fay Nunez, contract: full, skills: [rn]}
demand:
  - {shift: E, skill: rn, min: 1, target: 2}
  - {shift: L, skill: rn, min: 1, target: 1}
  - {shift: N, skill: rn, min: 1, target: 1}
  - {shift: E, skill: hca, min: 1, target: 1, max: 1, days: [mon, tue, wed, thu, fri]}
rules:
  list:
    - {kind: min-rest, hours: 11, severity: hard}
    - {kind: forbid-sequence, sequence: [N, E], severity: hard}
    - {kind: max-consecutive-days, days: 5, severity: hard}
"""

# A hand-made roster that breaks hard rules: N then E, work while absent, short cover.
HAND_ROSTER = {
    "ana": {"2027-03-01": "N", "2027-03-02": "E"},
    "ben": {"2027-03-02": "E/hca", "2027-03-03": "L"},
    "cai": {"2027-03-05": "E"},
    "eli": {"2027-03-04": "E/rn", "2027-03-08": "E"},
}

SHEETS = ["Roster", "Cover", "Violations", "Summary", "Lists"]  # Lists is hidden (drop-down codes, shift hours)
ABSENCE_CODES = {"LV", "SK", "TR", "AB"}  # an absence day off shows its code (test_xlsx_live checks which)
passed = failed = 0


def expect(name, ok, detail=""):
    global passed, failed
    if ok:
        passed += 1
    else:
        failed += 1
        print(f"FAIL {name}: {detail}")


def run(*args):
    return subprocess.run([BINARY, *args], capture_output=True, text=True, timeout=900)


def read_csv(path):
    with open(path, newline="", encoding="utf-8-sig") as f:
        rows = list(csv.reader(f))
    return rows[0][1:], {row[0]: row[1:] for row in rows[1:]}, [row[0] for row in rows[1:]]


def iso(value):
    if isinstance(value, datetime.datetime):
        return value.date().isoformat()
    if isinstance(value, datetime.date):
        return value.isoformat()
    return str(value)


def blank(value):
    return "" if value is None else str(value)


def close(a, b):
    return a is not None and b is not None and abs(float(a) - float(b)) <= 0.5e-4 + 1e-9  # report.json gives amounts to 4 decimals; the workbook keeps them exact


def check_roster_sheet(tag, ws, dates, cells, order, scenario):
    expect(f"{tag} roster header", ws["A2"].value == "Name" and ws["B2"].value == "Id", (ws["A2"].value, ws["B2"].value))
    header = []
    col = 3
    while isinstance(ws.cell(row=3, column=col).value, (datetime.date, datetime.datetime)):
        header.append(iso(ws.cell(row=3, column=col).value))
        col += 1
    expect(f"{tag} roster date columns", header == dates, f"{header[:3]}... vs {dates[:3]}...")
    ids = [ws.cell(row=4 + i, column=2).value for i in range(len(order))]
    expect(f"{tag} one row per person", ids == order and ws.cell(row=4 + len(order), column=2).value is None, ids)
    mismatches = []
    for i, staff in enumerate(order):
        for d in range(len(dates)):
            got = blank(ws.cell(row=4 + i, column=3 + d).value)
            if got in ABSENCE_CODES and cells[staff][d] == "":
                got = ""
            if got != cells[staff][d]:
                mismatches.append((staff, dates[d], got, cells[staff][d]))
    expect(f"{tag} roster cells equal roster.csv", not mismatches, mismatches[:5])
    expect(f"{tag} frozen name column and header rows", ws.freeze_panes == "C4", ws.freeze_panes)
    # One or two weeks a page by column breaks (fit-to-page would override them), titles repeated.
    expect(f"{tag} print setup", ws.page_setup.orientation == "landscape" and len(ws.col_breaks.brk) >= 1
           and not ws.sheet_properties.pageSetUpPr.fitToPage and (ws.print_title_rows or "").replace("$", "") == "1:3"
           and (ws.print_title_cols or "").replace("$", "") == "A:B",
           (ws.page_setup.orientation, ws.col_breaks.brk, ws.print_title_rows, ws.print_title_cols))
    # Per-person hours beside the contract bounds, recomputed from the scenario's shift times.
    minutes = {}
    for s in scenario["shifts"]:
        start, end = (int(t[:2]) * 60 + int(t[3:]) for t in (s["start"], s["end"]))
        minutes[s["id"]] = end + (1440 if end <= start else 0) - start - s.get("break_minutes", 0)
    hours_col = 3 + len(dates) + 1
    expect(f"{tag} totals header", ws.cell(row=3, column=hours_col).value == "Hours", ws.cell(row=3, column=hours_col).value)
    wrong = []
    for i, staff in enumerate(order):
        paid = sum(minutes[c.split("/")[0]] for c in cells[staff] if c) / 60
        if not close(ws.cell(row=4 + i, column=hours_col).value, paid):
            wrong.append((staff, ws.cell(row=4 + i, column=hours_col).value, paid))
    expect(f"{tag} hours totals", not wrong, wrong[:5])


def assigned_counts(cells, order, scenario, dates):
    first_skill = {p["id"]: p["skills"][0] for p in scenario["staff"]}
    counts = {}
    for staff in order:
        for d, cell in enumerate(cells[staff]):
            if cell:
                shift, _, role = cell.partition("/")
                key = (dates[d], shift, role or first_skill[staff])
                counts[key] = counts.get(key, 0) + 1
    return counts


def check_cover_sheet(tag, ws, cells, order, scenario, dates, report):
    header = [ws.cell(row=2, column=c).value for c in range(1, 12)]
    expect(f"{tag} cover header", header[:8] == ["Date", "Day", "Shift", "Skill", "Min", "Target", "Max", "Assigned"], header)
    counts = assigned_counts(cells, order, scenario, dates)
    rows, bad = {}, []
    r = 3
    while ws.cell(row=r, column=1).value is not None:
        v = [ws.cell(row=r, column=c).value for c in range(1, 12)]
        key = (iso(v[0]), v[2], v[3])
        mn, tg, mx, got = v[4], v[5], v[6], v[7]
        short_min, short_target, over = v[8] or 0, v[9] or 0, v[10] or 0
        if got != counts.get(key, 0):
            bad.append(("assigned", key, got, counts.get(key, 0)))
        if short_min != max(0, mn - got) or short_target != max(0, tg - got) or over != (max(0, got - mx) if mx is not None else 0):
            bad.append(("gap", key, v))
        rows[key] = {"min": short_min, "target": short_target, "max": over}
        r += 1
    expect(f"{tag} cover rows consistent", rows and not bad, bad[:5])
    # Every shortfall or excess in the sheet is one cover violation in report.json, same amount.
    found = {}
    pattern = re.compile(r"^(\d{4}-\d\d-\d\d) (\S+) (\S+): (\d+) assigned, (at least|at most)?")
    for v in report["violations"]:
        if v["kind"] != "cover":
            continue
        m = pattern.match(v["message"])
        part = {"at least": "min", "at most": "max", None: "target"}[m.group(5)] if m else None
        found[((m.group(1), m.group(2), m.group(3)) if m else None, part)] = v["amount"]
    in_sheet = {(key, part): amount for key, parts in rows.items() for part, amount in parts.items() if amount}
    expect(f"{tag} cover gaps equal report.json cover violations", in_sheet == found,
           sorted(set(in_sheet.items()) ^ set(found.items()))[:5])


def check_violations_sheet(tag, ws, report, scenario):
    names = {p["id"]: p["name"] for p in scenario["staff"]}
    header = [ws.cell(row=1, column=c).value for c in range(1, 10)]
    expect(f"{tag} violations header", header == ["Severity", "Rule", "Kind", "Person", "Name", "Dates", "Amount", "Penalty", "Message"], header)
    rows = []
    r = 2
    while ws.cell(row=r, column=1).value is not None:
        rows.append([ws.cell(row=r, column=c).value for c in range(1, 10)])
        r += 1
    want = report["violations"]
    expect(f"{tag} one Violations row per report.json violation", len(rows) == len(want), (len(rows), len(want)))
    bad = []
    for got, v in zip(rows, want):
        if (got[0], got[1], got[2], blank(got[3]), got[8]) != (v["severity"], v["rule"], v["kind"], v["staff"] or "", v["message"]) \
                or not close(got[6], v["amount"]) or not close(got[7], v["penalty"]) \
                or (v["staff"] and got[4] != names[v["staff"]]):
            bad.append((got, v))
    expect(f"{tag} violation rows equal report.json", not bad, bad[:3])
    severities = [row[0] for row in rows]
    expect(f"{tag} hard breaches first", severities == sorted(severities, key=lambda s: s != "hard"), severities[:10])
    tables = list(ws.tables.values()) if hasattr(ws.tables, "values") else list(ws.tables)
    expect(f"{tag} violations table with filters", len(tables) == 1 and tables[0].ref.startswith("A1:I")
           and (tables[0].autoFilter is not None), [t.ref for t in tables])


def check_summary_sheet(tag, ws, report, command):
    values = {}
    texts = []
    for row in ws.iter_rows(min_col=1, max_col=2):
        if row[0].value is not None:
            values[row[0].value] = row[1].value
            texts.append(str(row[0].value))
    expect(f"{tag} summary totals", close(values.get("Hard penalty"), report["summary"]["hard"])
           and close(values.get("Soft penalty"), report["summary"]["soft"])
           and values.get("Scenario") == report["scenario"] and values.get("Command") == command, values)
    expect(f"{tag} summary caution", any(report["caution"] == t for t in texts), "caution text missing")
    charts = len(ws._charts)
    expect(f"{tag} progress chart", charts == (0 if command == "check" else 2), charts)


def check_outputs(tag, out, scenario, command, extra_checks=None):
    path = os.path.join(out, "roster.xlsx")
    if not os.path.exists(path):
        expect(f"{tag} roster.xlsx exists", False, path)
        return None
    # Totals and cover counts are formulas: read the values libxlsxwriter cached with them.
    book = openpyxl.load_workbook(path, data_only=True)
    expect(f"{tag} sheet names", book.sheetnames == SHEETS, book.sheetnames)
    if book.sheetnames != SHEETS:
        return None
    dates, cells, order = read_csv(os.path.join(out, "roster.csv"))
    with open(os.path.join(out, "report.json"), encoding="utf-8") as f:
        report = json.load(f)
    check_roster_sheet(tag, book["Roster"], dates, cells, order, scenario)
    check_cover_sheet(tag, book["Cover"], cells, order, scenario, dates, report)
    check_violations_sheet(tag, book["Violations"], report, scenario)
    check_summary_sheet(tag, book["Summary"], report, command)
    leftovers = [n for n in os.listdir(out) if n.startswith(".")]
    expect(f"{tag} no temporary files left", not leftovers, leftovers)
    return book, report, dates, order


def check_marks(tag, book, report, dates, order, days):
    """Cells named by a person's breach carry a comment with its message."""
    ws = book["Roster"]
    missing = []
    for v in report["violations"]:
        if not v["staff"] or not v["dates"] or len(v["dates"]) >= days:
            continue
        row = 4 + order.index(v["staff"])
        for date in v["dates"]:
            comment = ws.cell(row=row, column=3 + dates.index(date)).comment
            if comment is None or v["message"] not in comment.text:
                missing.append((v["staff"], date, v["message"]))
    expect(f"{tag} breach cells carry comments", not missing, missing[:3])
    hard = [v for v in report["violations"] if v["severity"] == "hard" and v["staff"] and v["dates"]]
    if hard:
        cell = ws.cell(row=4 + order.index(hard[0]["staff"]), column=3 + dates.index(hard[0]["dates"][0]))
        expect(f"{tag} hard breach marked", cell.font.b and cell.border.left.style is not None, (cell.font.b, cell.border.left.style))


def main():
    shutil.rmtree(WORK, ignore_errors=True)
    os.makedirs(WORK)
    scenario_path = os.path.join(WORK, "scenario.yaml")
    with open(scenario_path, "w", encoding="utf-8") as f:
        f.write(SCENARIO)
    scenario = yaml.safe_load(SCENARIO)

    out = os.path.join(WORK, "solve")
    p = run("solve", scenario_path, "--out", out, "--generations", "1", "--time-limit", "900", "--seed", "1", "--quiet")
    expect("solve runs", p.returncode in (0, 1), p.stderr)
    check_outputs("solve", out, scenario, "solve")

    # check on a hand-made roster with hard breaches
    dates = [(datetime.date(2027, 3, 1) + datetime.timedelta(days=i)).isoformat() for i in range(14)]
    hand = os.path.join(WORK, "hand.csv")
    with open(hand, "w", newline="", encoding="utf-8") as f:
        w = csv.writer(f)
        w.writerow(["staff", *dates])
        for person in scenario["staff"]:
            w.writerow([person["id"], *(HAND_ROSTER.get(person["id"], {}).get(d, "") for d in dates)])
    out = os.path.join(WORK, "check")
    p = run("check", scenario_path, "--roster", hand, "--out", out)
    expect("check reports hard breaches", p.returncode == 1, (p.returncode, p.stderr))
    result = check_outputs("check", out, scenario, "check")
    if result:
        book, report, csv_dates, order = result
        check_marks("check", book, report, csv_dates, order, len(dates))
        ws = book["Roster"]
        # The weekday header row keeps the day shading (the date row may carry a cover warning).
        holiday = ws.cell(row=2, column=3 + csv_dates.index("2027-03-08")).fill.fgColor.rgb
        workday = ws.cell(row=2, column=3 + csv_dates.index("2027-03-09")).fill.fgColor.rgb
        weekend = ws.cell(row=2, column=3 + csv_dates.index("2027-03-06")).fill.fgColor.rgb
        expect("check holiday and weekend shaded", len({holiday, workday, weekend}) == 3, (holiday, workday, weekend))

    for sample in sorted(glob.glob(os.path.join(SOURCE, "samples", "*", "scenario.yaml"))):
        name = os.path.basename(os.path.dirname(sample))
        with open(sample, encoding="utf-8") as f:
            data = yaml.safe_load(f)
        out = os.path.join(WORK, "sample-" + name)
        p = run("solve", sample, "--out", out, "--generations", "1", "--time-limit", "900", "--seed", "1", "--quiet")
        if p.returncode == 2:  # the sample itself is rejected: its loading is tested elsewhere
            print(f"SKIP {name}: rejected as input: {p.stderr.strip()}")
            continue
        expect(f"{name} solve runs", p.returncode in (0, 1), p.stderr)
        check_outputs(name, out, data, "solve")

    print(f"{passed} passed, {failed} failed")
    return 0 if failed == 0 else 1


if __name__ == "__main__":
    sys.exit(main())
