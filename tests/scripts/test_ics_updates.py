"""Calendars in a time zone, and calendar updates after a replan, read back with icalendar.

The calendars are parsed by the icalendar package (python3-icalendar) and times converted to
UTC by it and by Python's zoneinfo: readers written independently of rotaweave's TZif reader
and VTIMEZONE writer, so a wrong offset or a wrong SEQUENCE on either side shows up as a
mismatch. Checks cite the RFC 5545 section they rest on.
Environment: ROTAWEAVE (binary), ROTAWEAVE_WORK (scratch folder).
"""
import datetime
import os
import shutil
import subprocess
import sys
import zoneinfo

import icalendar

BINARY = os.environ.get("ROTAWEAVE", "rotaweave")
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-ics-updates")
UTC = datetime.timezone.utc
BERLIN = zoneinfo.ZoneInfo("Europe/Berlin")

# A plant in Berlin across the end of summer time (2027-10-31 03:00 CEST -> 02:00 CET): ana
# works the night of 30/31 October, which is 9 h on the clock.
OCTOBER = """\
name: Plant, October 2027
timezone: Europe/Berlin
period: {start: 2027-10-25, end: 2027-11-03}
shifts:
  - {id: D, label: Day, start: "06:00", end: "14:00", break_minutes: 30}
  - {id: N, label: Night, start: "22:00", end: "06:00", break_minutes: 30}
skills: [op]
staff:
  - {id: ana, name: Ana, skills: [op], fixed: [{date: 2027-10-30, shift: N}]}
  - {id: ben, name: Ben, skills: [op]%s}
  - {id: cai, name: Cai, skills: [op]%s}
demand:
  - {shift: D, skill: op, min: 1, max: 1}
  - {shift: N, skill: op, min: 1, max: 1}
rules:
  list:
    - {kind: min-rest, hours: 11, severity: hard}
"""

# The start of summer time (2027-03-28 02:00 CET -> 03:00 CEST): the night of 27/28 March is 7 h.
MARCH = """\
name: Plant, March 2027
timezone: Europe/Berlin
period: {start: 2027-03-22, end: 2027-03-31}
shifts:
  - {id: N, label: Night, start: "22:00", end: "06:00", break_minutes: 30}
skills: [op]
staff:
  - {id: ana, name: Ana, skills: [op], fixed: [{date: 2027-03-27, shift: N}]}
  - {id: ben, name: Ben, skills: [op]}
demand:
  - {shift: N, skill: op, min: 1, max: 1}
"""

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


def write(name, text):
    path = os.path.join(WORK, name)
    with open(path, "w", encoding="utf-8") as f:
        f.write(text)
    return path


def solve(scenario, out):
    p = run("solve", scenario, "--out", out, "--generations", "1", "--seed", "1", "--quiet")
    expect(f"solve {os.path.basename(out)} runs", p.returncode in (0, 1), p.stderr)


def calendar(out, staff):
    with open(os.path.join(out, "calendars", staff + ".ics"), "rb") as f:
        return icalendar.Calendar.from_ical(f.read())


def events(out, staff):
    """UID -> (SEQUENCE, STATUS, start UTC, end UTC, SUMMARY, DESCRIPTION)."""
    found = {}
    for ev in calendar(out, staff).walk("VEVENT"):
        start, end = ev.decoded("DTSTART"), ev.decoded("DTEND")
        if start.tzinfo is None or end.tzinfo is None:
            expect("times carry a zone (RFC 5545 3.3.5 form 3)", False, (staff, ev.get("UID")))
            continue
        found[str(ev["UID"])] = (int(ev.get("SEQUENCE", 0)), str(ev.get("STATUS", "")), start.astimezone(UTC),
                                 end.astimezone(UTC), str(ev.get("SUMMARY")), str(ev.get("DESCRIPTION")))
    return found


def read_roster(out):
    with open(os.path.join(out, "roster.csv"), encoding="utf-8-sig") as f:
        rows = [line.rstrip("\n").split(",") for line in f]
    return rows[0][1:], {row[0]: row[1:] for row in rows[1:]}


def check_night(out, date, hours, utc_start, tag):
    evs = [e for e in events(out, "ana").values() if e[2].astimezone(BERLIN).date() == date]
    expect(f"{tag}: one night event", len(evs) == 1, evs)
    if evs:
        start, end = evs[0][2], evs[0][3]
        expect(f"{tag}: night starts {utc_start} UTC", start == utc_start, start)
        expect(f"{tag}: night is {hours} h by icalendar's UTC conversion", (end - start) == datetime.timedelta(hours=hours),
               end - start)
        expect(f"{tag}: description gives the clock length", f"{hours:.1f} h on the clock" in evs[0][5], evs[0][5])


def check_vtimezone(out, tag):
    """Our VTIMEZONE (RFC 5545 3.6.5), turned into a tzinfo by icalendar, agrees with zoneinfo."""
    tzs = list(calendar(out, "ana").walk("VTIMEZONE"))
    expect(f"{tag}: one VTIMEZONE, TZID Europe/Berlin", len(tzs) == 1 and str(tzs[0]["TZID"]) == "Europe/Berlin", tzs)
    if not tzs:
        return
    ours = tzs[0].to_tz()
    wrong = []
    start = datetime.datetime(2027, 3, 20, tzinfo=UTC) if "March" in tag else datetime.datetime(2027, 10, 24, tzinfo=UTC)
    for h in range(0, 24 * 12):
        t = start + datetime.timedelta(hours=h)
        if t.astimezone(ours).utcoffset() != t.astimezone(BERLIN).utcoffset():
            wrong.append(t)
    expect(f"{tag}: VTIMEZONE offsets match zoneinfo hour by hour", not wrong, wrong[:3])


def main():
    shutil.rmtree(WORK, ignore_errors=True)
    os.makedirs(WORK)

    # 1. Clock changes: 9 h in October, 7 h in March (RFC 5545 3.3.5: local time with TZID).
    october = write("october.yaml", OCTOBER % ("", ""))
    solve(october, os.path.join(WORK, "oct"))
    oct_out = os.path.join(WORK, "oct")
    check_night(oct_out, datetime.date(2027, 10, 30), 9, datetime.datetime(2027, 10, 30, 20, 0, tzinfo=UTC), "October")
    check_vtimezone(oct_out, "October")
    march = write("march.yaml", MARCH)
    solve(march, os.path.join(WORK, "mar"))
    check_night(os.path.join(WORK, "mar"), datetime.date(2027, 3, 27), 7, datetime.datetime(2027, 3, 27, 21, 0, tzinfo=UTC), "March")
    check_vtimezone(os.path.join(WORK, "mar"), "March")

    # 2. Replan: ben falls sick for three days, and cai is fixed to a different shift on a day
    #    (the scenario keeps its name, so UIDs stay the same).
    _, first = read_roster(oct_out)
    day = 8  # 2027-11-02
    other = "N" if first["cai"][day] != "N" else "D"
    changed = write("october-changed.yaml", OCTOBER % ("", f", fixed: [{{date: 2027-11-02, shift: {other}}}]"))
    r1 = os.path.join(WORK, "replan1")
    p = run("replan", changed, "--roster", os.path.join(oct_out, "roster.csv"), "--from", "2027-10-29",
            "--absence", "ben:2027-10-29..2027-10-31", "--out", r1, "--generations", "1", "--seed", "1", "--quiet")
    expect("replan runs", p.returncode in (0, 1), p.stderr)
    expect("replan finds the calendars beside the roster (no note)", "no calendars/" not in p.stderr, p.stderr)
    _, second = read_roster(r1)
    check_updates(oct_out, r1, first, second, "replan 1")

    # 3. A second replan from the first's output continues its SEQUENCE numbers, and carries
    #    the cancelled events as they are.
    r2 = os.path.join(WORK, "replan2")
    p = run("replan", changed, "--roster", os.path.join(r1, "roster.csv"), "--from", "2027-11-01",
            "--absence", "cai:2027-11-01..2027-11-03", "--out", r2, "--generations", "1", "--seed", "1", "--quiet")
    expect("second replan runs", p.returncode in (0, 1), p.stderr)
    _, third = read_roster(r2)
    check_updates(r1, r2, second, third, "replan 2", need_change=False)

    # 4. Without calendars beside the roster, the published roster stands for them (SEQUENCE 0).
    lone = os.path.join(WORK, "lone")
    os.makedirs(lone)
    shutil.copy(os.path.join(oct_out, "roster.csv"), lone)
    r3 = os.path.join(WORK, "replan3")
    p = run("replan", changed, "--roster", os.path.join(lone, "roster.csv"), "--from", "2027-10-29",
            "--absence", "ben:2027-10-29..2027-10-31", "--out", r3, "--generations", "1", "--seed", "1", "--quiet")
    expect("replan without calendars runs, with a note", p.returncode in (0, 1) and "no calendars/" in p.stderr, p.stderr)
    expect("same calendars as with the first publication's files",
           all(events(r3, s) == events(r1, s) for s in ("ana", "ben", "cai")), "differ")

    # 5. An unknown zone is an input error naming the file and line, with a suggestion.
    bad = write("bad.yaml", OCTOBER.replace("Europe/Berlin", "Europe/Berlni") % ("", ""))
    p = run("solve", bad, "--out", os.path.join(WORK, "bad"), "--generations", "1", "--quiet")
    expect("unknown zone: exit 2", p.returncode == 2, p.returncode)
    expect("unknown zone: file, line and hint", "bad.yaml:2" in p.stderr and "Europe/Berlin" in p.stderr, p.stderr)

    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


def check_updates(before_out, after_out, before, after, tag, need_change=True):
    """RFC 5545 3.8.7.4 (SEQUENCE) and 3.8.1.11 (STATUS) across one republication."""
    counts = {"cancelled": 0, "changed": 0, "unchanged": 0}
    for staff in before:
        old, new = events(before_out, staff), events(after_out, staff)
        expect(f"{tag} {staff}: every UID published before is published again", set(old) <= set(new), set(old) - set(new))
        worked = {d for d, c in enumerate(after[staff]) if c}
        live = [u for u, e in new.items() if e[1] != "CANCELLED"]
        expect(f"{tag} {staff}: one live event per worked day", len(live) == len(worked), (len(live), len(worked)))
        for uid, (seq, status, start, end, summary, desc) in new.items():
            if uid not in old:
                expect(f"{tag} {staff} {uid}: a new event starts at SEQUENCE 0", seq == 0 and status == "CONFIRMED", (seq, status))
                continue
            oseq, ostatus, ostart, oend, osummary, odesc = old[uid]
            if ostatus == "CANCELLED" and status == "CANCELLED":
                expect(f"{tag} {staff} {uid}: a cancelled event is carried as it was", seq == oseq, (oseq, seq))
            elif status == "CANCELLED":
                counts["cancelled"] += 1
                expect(f"{tag} {staff} {uid}: cancelled with a higher SEQUENCE", seq > oseq, (oseq, seq))
                expect(f"{tag} {staff} {uid}: cancelled event keeps its times", (start, end) == (ostart, oend), (start, ostart))
            elif (start, end, summary, desc) != (ostart, oend, osummary, odesc) or ostatus == "CANCELLED":
                counts["changed"] += 1
                expect(f"{tag} {staff} {uid}: changed with a higher SEQUENCE", seq > oseq, (oseq, seq))
            else:
                counts["unchanged"] += 1
                expect(f"{tag} {staff} {uid}: unchanged keeps its SEQUENCE", seq == oseq, (oseq, seq))
        for d, (was, now) in enumerate(zip(before[staff], after[staff])):
            if was and not now:
                gone = [u for u, e in new.items() if e[1] == "CANCELLED" and u in old and old[u][1] != "CANCELLED"
                        and e[2].astimezone(BERLIN).date() == datetime.date(2027, 10, 25) + datetime.timedelta(days=d)]
                expect(f"{tag} {staff} day {d}: the removed shift is cancelled", len(gone) == 1, gone)
    expect(f"{tag}: the update cancels (and changes) some events", counts["cancelled"] > 0 and (counts["changed"] > 0 or not need_change), counts)
    print(f"{tag}: {counts}")


if __name__ == "__main__":
    sys.exit(main())
