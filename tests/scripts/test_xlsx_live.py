#!/usr/bin/env python3
"""The workbook stays alive when edited, shows absences and prints legibly.

Independent references: openpyxl (a reader written apart from libxlsxwriter, which writes the
workbook) reads the formulas, the cached values, the drop-down lists, the comments and the
print setup; LibreOffice Calc (`soffice --headless --convert-to xlsx`) recalculates a workbook
edited with openpyxl, so the totals after an edit come from a real spreadsheet program. The
expected values are computed here from the scenario's shift times and the roster grid, not
taken from rotaweave.

Checks:
  - Roster totals (hours, per-shift counts, shifts, weekends) are formulas; their cached
    values equal what this script computes; Cover "Assigned" and the gaps are formulas over
    the Roster sheet with the right cached values;
  - after three edits (a shift cleared, a shift added on a weekend, a shift swapped for
    another with a /skill) LibreOffice's recalculated totals and cover counts follow the edit;
  - every roster cell has a list validation whose source holds exactly the person's codes;
  - absence cells hold LV/SK/TR with a comment naming the reason and the dates, in the
    absence fill; a scenario colour close to that fill is warned about on stderr;
  - print setup: landscape, title rows 1:3 and columns A:B repeated, column breaks with at
    most 14 days a page, a readable scale and no fit-to-page (which would override breaks).
Environment: ROTAWEAVE (binary), ROTAWEAVE_WORK (scratch folder).
"""
import csv
import datetime
import os
import shutil
import subprocess
import sys

import openpyxl

BINARY = os.environ.get("ROTAWEAVE", "rotaweave")
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-xlsx-live")

SHIFTS = {"E": ("07:00", "15:00", 30), "L": ("14:00", "22:00", 30), "N": ("21:30", "07:00", 45)}
START = datetime.date(2027, 3, 1)  # a Monday
DAYS = 21
DATES = [START + datetime.timedelta(days=d) for d in range(DAYS)]
SCENARIO = """\
name: "Live workbook ward"
period: {start: 2027-03-01, end: 2027-03-21}
holidays: [2027-03-10]
shifts:
  - {id: E, label: Early, start: "07:00", end: "15:00", break_minutes: 30, colour: "#FFE699"}
  - {id: L, label: Late, start: "14:00", end: "22:00", break_minutes: 30}
  - {id: N, label: Night, start: "21:30", end: "07:00", break_minutes: 45%(ncolour)s}
skills: [rn, hca]
contracts:
  full: {hours: {min: 60, max: 120}}
staff:
  - {id: ana, name: Ana Lee, contract: full, skills: [rn]}
  - {id: ben, name: Ben Ortiz, contract: full, skills: [rn, hca]}
  - {id: cai, name: Cai Wu, contract: full, skills: [rn], absences: [{from: 2027-03-08, to: 2027-03-12, reason: annual leave}]}
  - {id: dee, name: Dee Park, contract: full, skills: [hca], absences: [{from: 2027-03-03, to: 2027-03-04, reason: sick}]}
  - {id: eli, name: Eli Novak, contract: full, skills: [hca, rn], absences: [{date: 2027-03-17, reason: fire safety training}]}
demand:
  - {shift: E, skill: rn, min: 1}
  - {shift: L, skill: hca, min: 1}
  - {shift: N, skill: rn, min: 1}
rules:
  list:
    - {kind: max-consecutive-days, days: 6, severity: hard}
"""
SKILLS = {"ana": ["rn"], "ben": ["rn", "hca"], "cai": ["rn"], "dee": ["hca"], "eli": ["hca", "rn"]}
ABSENT = {"cai": ("LV", "annual leave", range(7, 12)), "dee": ("SK", "sick", range(2, 4)), "eli": ("TR", "fire safety training", range(16, 17))}
ABSENCE_FILL = "6E6E6E"

passed = failed = 0


def expect(name, ok, detail=""):
    global passed, failed
    if ok:
        passed += 1
        print(f"ok   {name}")
    else:
        failed += 1
        print(f"FAIL {name}: {detail}")


def paid_hours(shift):
    start, end, brk = SHIFTS[shift]
    s, e = (int(t[:2]) * 60 + int(t[3:]) for t in (start, end))
    return (e + (1440 if e <= s else 0) - s - brk) / 60


def roster_grid():
    """A hand-made roster: a regular pattern, nobody rostered on an absence day."""
    pattern = {"ana": "E", "ben": "N/rn", "cai": "E", "dee": "L", "eli": "L/hca"}
    grid = {}
    for i, staff in enumerate(pattern):
        row = []
        for d in range(DAYS):
            absent = staff in ABSENT and d in ABSENT[staff][2]
            works = (d + i) % 7 not in (5, 6) and not absent
            row.append(pattern[staff] if works else "")
        grid[staff] = row
    return grid


def write_csv(path, grid):
    with open(path, "w", newline="") as f:
        w = csv.writer(f)
        w.writerow(["staff"] + [d.isoformat() for d in DATES])
        for staff, row in grid.items():
            w.writerow([staff] + row)


def totals(row):
    """Hours, per-shift counts, shifts and weekends of one roster row (absence codes are off)."""
    counts = {s: 0 for s in SHIFTS}
    for cell in row:
        if cell and cell.split("/")[0] in SHIFTS:
            counts[cell.split("/")[0]] += 1
    hours = sum(counts[s] * paid_hours(s) for s in SHIFTS)
    weekends = 0
    for d in range(DAYS):
        if DATES[d].weekday() == 5:
            block = [c for c in row[d:d + 2] if c and c.split("/")[0] in SHIFTS]
            weekends += bool(block)
    return hours, counts, sum(counts.values()), weekends


def cover(grid, d, shift, skill):
    n = 0
    for staff, row in grid.items():
        cell = row[d]
        if not cell or cell.split("/")[0] != shift:
            continue
        role = cell.split("/")[1] if "/" in cell else SKILLS[staff][0]
        n += role == skill
    return n


def columns(ws):
    head = {ws.cell(row=3, column=c).value: c for c in range(3 + DAYS, ws.max_column + 1) if ws.cell(row=3, column=c).value}
    return head


def read_grid(ws):
    grid = {}
    r = 4
    while ws.cell(row=r, column=2).value in SKILLS:
        grid[ws.cell(row=r, column=2).value] = ["" if ws.cell(row=r, column=3 + d).value is None else str(ws.cell(row=r, column=3 + d).value)
                                               for d in range(DAYS)]
        r += 1
    return grid


def check_totals(tag, values, grid):
    """`values`: a Roster sheet read with data_only (cached or recalculated values)."""
    head = columns(values)
    wrong = []
    for i, (staff, row) in enumerate(grid.items()):
        hours, counts, shifts, weekends = totals(row)
        r = 4 + i
        got = (values.cell(row=r, column=head["Hours"]).value, [values.cell(row=r, column=head[s]).value for s in SHIFTS],
               values.cell(row=r, column=head["Shifts"]).value, values.cell(row=r, column=head["Wkends"]).value)
        want = (hours, [counts[s] for s in SHIFTS], shifts, weekends)
        if got[0] is None or abs(got[0] - want[0]) > 1e-6 or got[1:] != want[1:]:
            wrong.append((staff, got, want))
    expect(f"{tag}: Roster totals", not wrong, wrong[:3])


def check_cover(tag, cover_ws, grid):
    wrong = []
    r = 3
    while cover_ws.cell(row=r, column=1).value is not None:
        date = cover_ws.cell(row=r, column=1).value
        d = (date.date() - START).days
        shift, skill = cover_ws.cell(row=r, column=3).value, cover_ws.cell(row=r, column=4).value
        need = cover_ws.cell(row=r, column=5).value
        got = cover_ws.cell(row=r, column=8).value, cover_ws.cell(row=r, column=9).value
        want = cover(grid, d, shift, skill)
        if got != (want, max(0, need - want)):
            wrong.append((date.date().isoformat(), shift, skill, got, want))
        r += 1
    expect(f"{tag}: Cover assigned and short-of-min", not wrong and r > 3, wrong[:3])


def main():
    shutil.rmtree(WORK, ignore_errors=True)
    os.makedirs(WORK)
    scenario = os.path.join(WORK, "scenario.yaml")
    with open(scenario, "w") as f:
        f.write(SCENARIO % {"ncolour": ""})
    grid = roster_grid()
    roster = os.path.join(WORK, "roster.csv")
    write_csv(roster, grid)
    out = os.path.join(WORK, "out")
    run = subprocess.run([BINARY, "check", scenario, "--roster", roster, "--out", out], capture_output=True, text=True, timeout=300)
    expect("check runs", run.returncode in (0, 1), run.stderr)
    book = os.path.join(out, "roster.xlsx")

    formulas = openpyxl.load_workbook(book)
    ws = formulas["Roster"]
    head = columns(ws)
    hours_cell = ws.cell(row=4, column=head["Hours"]).value
    expect("hours are a formula over the shift counts and the Lists sheet", isinstance(hours_cell, str) and hours_cell.startswith("=")
           and "Lists!" in hours_cell, hours_cell)
    count_cell = ws.cell(row=4, column=head["E"]).value
    expect("shift counts are COUNTIF formulas over the row", isinstance(count_cell, str) and count_cell.startswith("=COUNTIF(C4:"), count_cell)
    weekend_cell = ws.cell(row=4, column=head["Wkends"]).value
    expect("weekends are a formula", isinstance(weekend_cell, str) and weekend_cell.startswith("=") and "COUNTA" in weekend_cell, weekend_cell)
    hours_letter = openpyxl.utils.get_column_letter(head["Hours"])
    hours_rules = [r.formula[0] for cf in ws.conditional_formatting for r in cf.rules if str(cf.sqref) == f"{hours_letter}4"]
    expect("hours are coloured against the contract bounds by conditional formats", any("<" in f for f in hours_rules), hours_rules)
    assigned = formulas["Cover"].cell(row=3, column=8).value
    expect("cover Assigned is a formula over the Roster sheet", isinstance(assigned, str) and "Roster!" in assigned, assigned)
    expect("the Lists sheet is hidden", formulas["Lists"].sheet_state == "hidden", formulas["Lists"].sheet_state)

    cached = openpyxl.load_workbook(book, data_only=True)
    shown = read_grid(cached["Roster"])
    expected_shown = {s: [ABSENT[s][0] if s in ABSENT and d in ABSENT[s][2] else grid[s][d] for d in range(DAYS)] for s in grid}
    expect("roster cells: the roster, with absence codes on absence days", shown == expected_shown,
           [(s, shown.get(s), expected_shown[s]) for s in grid if shown.get(s) != expected_shown[s]][:2])
    check_totals("cached values", cached["Roster"], grid)
    check_cover("cached values", cached["Cover"], grid)

    # Drop-down lists: one list validation per person row, its source the person's codes.
    lists = formulas["Lists"]
    found = {}
    for dv in ws.data_validations.dataValidation:
        ref = str(dv.sqref)
        row = int("".join(ch for ch in ref.split(":")[0] if ch.isdigit()))
        source = dv.formula1.replace("$", "").split("!")[1]
        first, last = source.split(":")
        codes = [cell[0].value for cell in lists[first:last] if cell[0].value is not None]
        # errorStyle may be left out: "stop" is the default of the file format.
        found[ws.cell(row=row, column=2).value] = (dv.type, dv.errorStyle or "stop", ref, sorted(codes))
    wrong = []
    last_col = openpyxl.utils.get_column_letter(2 + DAYS)
    for i, staff in enumerate(grid):
        skills = SKILLS[staff]
        want = sorted([s if len(skills) == 1 else f"{s}/{k}" for s in SHIFTS for k in skills] + ([ABSENT[staff][0]] if staff in ABSENT else []))
        got = found.get(staff)
        if got != ("list", "stop", f"C{4 + i}:{last_col}{4 + i}", want):
            wrong.append((staff, got, want))
    expect("every roster cell offers exactly the person's codes and stops anything else", not wrong, wrong[:2])

    # Absences: code, comment with reason and dates, the absence fill.
    wrong = []
    for i, staff in enumerate(grid):
        if staff not in ABSENT:
            continue
        code, reason, days = ABSENT[staff]
        for d in days:
            cell = ws.cell(row=4 + i, column=3 + d)
            text = cell.comment.text if cell.comment else ""
            dates = DATES[days[0]].isoformat()
            if cell.value != code or reason not in text or dates not in text or cell.fill.fgColor.rgb[-6:] != ABSENCE_FILL:
                wrong.append((staff, d, cell.value, text, cell.fill.fgColor.rgb))
    expect("absence cells: code, comment with reason and dates, absence fill", not wrong, wrong[:2])

    # Print setup.
    ps = ws.page_setup
    breaks = sorted(b.id for b in ws.col_breaks.brk)
    day_breaks = [b for b in breaks if b < 2 + DAYS]
    pages = [2] + day_breaks + [2 + DAYS]
    widest = max(b - a for a, b in zip(pages, pages[1:]))
    expect("print: landscape, titles repeated, one or two weeks a page, readable scale",
           ps.orientation == "landscape" and (ws.print_title_rows or "").replace("$", "") == "1:3"
           and (ws.print_title_cols or "").replace("$", "") == "A:B" and day_breaks and widest <= 14
           and (ps.scale or 100) >= 75 and not ws.sheet_properties.pageSetUpPr.fitToPage,
           (ps.orientation, ws.print_title_rows, ws.print_title_cols, breaks, ps.scale))

    # LibreOffice recalculates an edited workbook.
    soffice = shutil.which("soffice") or shutil.which("libreoffice")
    if not soffice:
        print("SKIP LibreOffice recalculation: soffice not installed (apt-get install libreoffice-calc-nogui)")
    else:
        edited = openpyxl.load_workbook(book)
        ews = edited["Roster"]
        saturday = next(d for d in range(DAYS) if DATES[d].weekday() == 5 and not grid["ana"][d])
        workday = next(d for d in range(DAYS) if grid["ana"][d])
        swap = next(d for d in range(DAYS) if grid["ben"][d])
        ews.cell(row=4, column=3 + workday).value = None        # ana: a shift cleared
        ews.cell(row=4, column=3 + saturday).value = "N"        # ana: a night on a free Saturday
        ews.cell(row=5, column=3 + swap).value = "E/hca"        # ben: N/rn becomes E/hca
        grid["ana"][workday], grid["ana"][saturday], grid["ben"][swap] = "", "N", "E/hca"
        edited_path = os.path.join(WORK, "edited.xlsx")
        edited.save(edited_path)
        lo_out = os.path.join(WORK, "lo")
        profile = "file://" + os.path.join(WORK, "lo-profile")
        conv = subprocess.run([soffice, f"-env:UserInstallation={profile}", "--headless", "--convert-to", "xlsx", "--outdir", lo_out, edited_path],
                              capture_output=True, text=True, timeout=600)
        recalculated = os.path.join(lo_out, "edited.xlsx")
        expect("LibreOffice converts the edited workbook", os.path.exists(recalculated), conv.stdout + conv.stderr)
        if os.path.exists(recalculated):
            values = openpyxl.load_workbook(recalculated, data_only=True)
            check_totals("LibreOffice after edits", values["Roster"], grid)
            check_cover("LibreOffice after edits", values["Cover"], grid)

    # A scenario colour close to the absence fill is warned about.
    with open(scenario, "w") as f:
        f.write(SCENARIO % {"ncolour": ', colour: "#707070"'})
    run = subprocess.run([BINARY, "check", scenario, "--roster", roster, "--out", os.path.join(WORK, "out-clash")],
                         capture_output=True, text=True, timeout=300)
    expect("a shift colour close to the absence fill is warned about", "warning: shift 'N' colour #707070 is close to the absence fill"
           in run.stderr, run.stderr)

    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
