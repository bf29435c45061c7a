#!/usr/bin/env python3
"""The outputs of a run are one set: never mixed, never lost, refused early.

1. Disk full, through the writer's test hook ROTAWEAVE_FAULT_DISK_BYTES (a simulated full disk
   after N bytes; no tmpfs is mounted, since the test may not run with the right to mount one):
   after a complete run, runs that fail at several points of writing exit 2, say the previous
   outputs were kept, and leave the previous set byte for byte, with nothing beside it; a first
   run that fails leaves no folder at all; a run that succeeds leaves a set whose files agree.
2. Two runs into one --out: while a solve holds it, a second solve and a check are refused with
   exit 2 and a message naming the first run; the first then finishes (SIGINT) with a whole set.
   Two short solves started together, four times: each writes a whole set or is refused, and
   the folder's roster.csv, report.json and calendars always agree.
3. A read-only --out is refused before the scenario is read (a broken scenario is not even
   reported) and before any search (an unbounded search is refused too), and left untouched.
4. Oversized input: a roster CSV of 1,000,000 rows, a staff list of 737,000 people and a 65 MB
   file are refused with exit 2; time and peak memory are printed (not asserted).
5. NUL bytes in a name (scenario and roster CSV): exit 2, file, line, column and
   "control character U+0000" in the message, and nothing written.

Solves are bounded by generations and local-search moves, never by time.
Environment: ROTAWEAVE (binary), ROTAWEAVE_SOURCE_DIR (repository), ROTAWEAVE_WORK (scratch).
"""
import csv
import json
import os
import shutil
import signal
import stat
import subprocess
import sys
import time

BINARY = os.path.abspath(os.environ.get("ROTAWEAVE", "build/rotaweave"))
SOURCE = os.environ.get("ROTAWEAVE_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-output-set")
SCENARIO = os.path.join(SOURCE, "samples", "clinic-ward", "scenario.yaml")
# A small, bounded solve: one generation, few moves, no relaxation.
FAST = ["--generations", "1", "--time-limit", "900", "--lagrangian-rounds", "0", "--column-share", "0",
        "--local-search", "2000", "--islands", "2", "--threads", "2", "--quiet"]

failures = []


def check(ok, what):
    print(("ok   " if ok else "FAIL ") + what)
    if not ok:
        failures.append(what)


def run(args, env=None, timeout=600):
    full = dict(os.environ)
    full.update(env or {})
    p = subprocess.run([BINARY] + args, capture_output=True, text=True, timeout=timeout, env=full)
    return p.returncode, p.stderr.strip()


def snapshot(folder):
    """{relative path: bytes} of every file under folder (None if it does not exist)."""
    if not os.path.exists(folder):
        return None
    files = {}
    for root, dirs, names in os.walk(folder):
        for n in names:
            path = os.path.join(root, n)
            with open(path, "rb") as f:
                files[os.path.relpath(path, folder)] = f.read()
    return files


def beside(folder):
    """Names in the folder's parent other than the folder itself (staging folders, locks)."""
    parent, name = os.path.split(os.path.abspath(folder))
    return sorted(n for n in os.listdir(parent) if n != name)


def set_agrees(folder, label):
    """roster.csv, report.json and calendars/ come from one run: a check of roster.csv scores as
    report.json says, and every person's calendar has one event per worked day."""
    out = os.path.join(WORK, "agree-" + label)
    shutil.rmtree(out, ignore_errors=True)
    code, err = run(["check", SCENARIO, "--roster", os.path.join(folder, "roster.csv"), "--out", out])
    if code not in (0, 1):
        check(False, f"{label}: check of roster.csv runs ({err[-300:]})")
        return
    with open(os.path.join(folder, "report.json"), encoding="utf-8") as f:
        written = json.load(f)["summary"]
    with open(os.path.join(out, "report.json"), encoding="utf-8") as f:
        checked = json.load(f)["summary"]
    same = all(written[k] == checked[k] for k in ("hard", "soft", "violations"))
    check(same, f"{label}: report.json scores roster.csv ({written['soft']} vs {checked['soft']})")
    with open(os.path.join(folder, "roster.csv"), encoding="utf-8") as f:
        rows = list(csv.reader(f))[1:]
    disagree = []
    for row in rows:
        ics = os.path.join(folder, "calendars", row[0] + ".ics")
        events = open(ics, encoding="utf-8").read().count("BEGIN:VEVENT") if os.path.isfile(ics) else -1
        if events != sum(1 for c in row[1:] if c):
            disagree.append(row[0])
    check(not disagree and len(os.listdir(os.path.join(folder, "calendars"))) == len(rows),
          f"{label}: every calendar agrees with roster.csv (disagree: {disagree})")


def disk_full():
    out = os.path.join(WORK, "disk", "out")
    os.makedirs(os.path.dirname(out))
    code, err = run(["solve", SCENARIO, "--out", out, "--seed", "1"] + FAST)
    check(code in (0, 1), f"disk full: the first, complete run succeeds ({err[-200:]})")
    before = snapshot(out)
    total = sum(len(v) for v in before.values())
    for budget in (0, 1000, 3000, total // 2, total - 1):
        code, err = run(["solve", SCENARIO, "--out", out, "--seed", "2"] + FAST,
                        env={"ROTAWEAVE_FAULT_DISK_BYTES": str(budget)})
        label = f"disk full after {budget} of {total} bytes"
        check(code == 2, f"{label}: exit 2 (got {code})")
        check("No space left on device" in err and "kept as they were" in err, f"{label}: the message says so: {err[-300:]}")
        check(snapshot(out) == before, f"{label}: the previous set is untouched, byte for byte")
        check(beside(out) == [], f"{label}: nothing left beside --out ({beside(out)})")
    # A first run that fails leaves nothing at all.
    fresh = os.path.join(WORK, "disk", "new", "out")
    code, err = run(["solve", SCENARIO, "--out", fresh, "--seed", "2"] + FAST, env={"ROTAWEAVE_FAULT_DISK_BYTES": "5000"})
    check(code == 2 and "no outputs were written" in err, f"disk full on a first run: exit 2, says so ({code}: {err[-200:]})")
    check(not os.path.exists(os.path.join(WORK, "disk", "new")), "disk full on a first run: no folder left behind")
    # With room enough, the new set replaces the old one whole.
    code, err = run(["solve", SCENARIO, "--out", out, "--seed", "2"] + FAST, env={"ROTAWEAVE_FAULT_DISK_BYTES": str(total * 4)})
    check(code in (0, 1), f"disk with room: the run succeeds ({err[-200:]})")
    set_agrees(out, "after the disk had room")


def concurrent_runs():
    out = os.path.join(WORK, "busy", "out")
    # The first run searches without a generation bound until it is interrupted.
    first = subprocess.Popen([BINARY, "solve", SCENARIO, "--out", out, "--seed", "3", "--time-limit", "3600",
                              "--stall", "0", "--quiet"], stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    staging = os.path.join(os.path.dirname(out), f".out.new-{first.pid}")
    for _ in range(600):  # it holds the lock once its staging folder exists
        if os.path.isdir(staging) or first.poll() is not None:
            break
        time.sleep(0.1)
    check(os.path.isdir(staging) and first.poll() is None, "two runs: the first holds --out")
    for label, args in [("solve", ["solve", SCENARIO, "--seed", "4"] + FAST),
                        ("check", ["check", SCENARIO, "--roster", os.path.join(SOURCE, "samples", "clinic-ward",
                                                                               "roster-handmade.csv")])]:
        started = time.monotonic()
        code, err = run(args + ["--out", out], timeout=120)
        took = time.monotonic() - started
        print(f"     second {label} refused after {took:.2f} s")
        check(code == 2, f"two runs: a second {label} exits 2 (got {code})")
        check("another rotaweave run" in err and f"process {first.pid}" in err and "--out" in err,
              f"two runs: the message names the first run: {err[-300:]}")
    first.send_signal(signal.SIGINT)
    try:
        first.communicate(timeout=120)
    except subprocess.TimeoutExpired:
        first.kill()
        first.communicate()
    check(first.returncode in (0, 1), f"two runs: the first finishes after SIGINT (exit {first.returncode})")
    check(beside(out) == [], f"two runs: nothing left beside --out ({beside(out)})")
    set_agrees(out, "the first of two runs")


def simultaneous_starts():
    """Two short solves started together, a few times: whichever way they overlap, each either
    writes a whole set or is refused, and the folder always holds one run's set."""
    out = os.path.join(WORK, "race", "out")
    for attempt in range(4):
        procs = [subprocess.Popen([BINARY, "solve", SCENARIO, "--out", out, "--seed", str(10 + attempt * 2 + k)] + FAST,
                                  stdout=subprocess.DEVNULL, stderr=subprocess.PIPE, text=True) for k in range(2)]
        results = [(p.wait(timeout=600), p.stderr.read()) for p in procs]
        for p in procs:
            p.stderr.close()
        fine = all(code in (0, 1) or (code == 2 and "another rotaweave run" in err) for code, err in results)
        check(fine and any(code in (0, 1) for code, _ in results),
              f"simultaneous starts {attempt + 1}: each run writes or is refused ({[c for c, _ in results]})")
        check(beside(out) == [], f"simultaneous starts {attempt + 1}: nothing left beside --out")
        set_agrees(out, f"simultaneous starts {attempt + 1}")


def read_only_folder():
    out = os.path.join(WORK, "readonly", "out")
    code, err = run(["solve", SCENARIO, "--out", out, "--seed", "1"] + FAST)
    before = snapshot(out)
    broken = os.path.join(WORK, "readonly", "broken.yaml")
    with open(broken, "w") as f:
        f.write("name: [unclosed\n")
    os.chmod(out, 0o555)
    try:
        code, err = run(["solve", broken, "--out", out] + FAST)
        check(code == 2 and "read-only" in err and "YAML" not in err,
              f"read-only: refused before the scenario is read ({code}: {err[-300:]})")
        # Without a generation bound the search would run for an hour: it must never start.
        code, err = run(["solve", SCENARIO, "--out", out, "--time-limit", "3600", "--stall", "0", "--quiet"], timeout=300)
        check(code == 2 and "read-only" in err and "chmod" in err, f"read-only: refused before the search ({code}: {err[-300:]})")
        code, err = run(["check", SCENARIO, "--roster", os.path.join(SOURCE, "samples", "clinic-ward", "roster-handmade.csv"),
                         "--out", out])
        check(code == 2 and "read-only" in err, f"read-only: check is refused too ({code})")
    finally:
        os.chmod(out, 0o755)
    check(snapshot(out) == before, "read-only: the folder is untouched")
    check(sorted(os.listdir(os.path.dirname(out))) == ["broken.yaml", "out"], "read-only: nothing written beside it")


def measured(label, args):
    """Runs the binary, prints wall time and peak memory (from wait4), returns (exit, stderr)."""
    started = time.monotonic()
    p = subprocess.Popen([BINARY] + args, stdout=subprocess.PIPE, stderr=subprocess.PIPE)
    _, status, usage = os.wait4(p.pid, 0)
    took = time.monotonic() - started
    err = p.stderr.read().decode("utf-8", "replace").strip()
    p.stdout.close()
    p.stderr.close()
    code = os.waitstatus_to_exitcode(status)
    print(f"     {label}: exit {code} after {took:.2f} s, peak memory {usage.ru_maxrss / 1024:.1f} MB")
    return code, err


def baseline_memory():
    """Peak memory of `rotaweave --version` measured the same way: wait4's figure includes the
    size of this Python process, which the child starts from, so compare against this."""
    p = subprocess.Popen([BINARY, "--version"], stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
    _, _, usage = os.wait4(p.pid, 0)
    print(f"     baseline (rotaweave --version): peak memory {usage.ru_maxrss / 1024:.1f} MB")


def oversized_inputs():
    folder = os.path.join(WORK, "big")
    os.makedirs(folder)
    baseline_memory()
    out = os.path.join(folder, "out")
    dates = [f"2027-03-{d:02d}" for d in range(1, 32)]
    big_csv = os.path.join(folder, "million.csv")
    with open(big_csv, "w") as f:
        f.write("staff," + ",".join(dates) + "\n")
        tail = "," * 31 + "\n"
        f.writelines(f"p{i}{tail}" for i in range(1_000_000))
    code, err = measured("roster CSV of 1,000,000 rows (%.0f MB)" % (os.path.getsize(big_csv) / 2**20),
                         ["check", SCENARIO, "--roster", big_csv, "--out", out])
    check(code == 2 and "more than 120 rows" in err and "20 people" in err, f"oversized CSV: exit 2, says why ({code}: {err[-300:]})")
    os.remove(big_csv)

    big_yaml = os.path.join(folder, "crowd.yaml")
    with open(big_yaml, "w") as f:
        f.write("name: crowd\nperiod: {start: 2027-03-01, end: 2027-03-31}\n"
                "shifts:\n  - {id: E, start: \"07:00\", end: \"15:00\"}\nskills: [rn]\nstaff:\n")
        f.writelines(f"  - {{id: p{i}, name: Person {i}, skills: [rn]}}\n" for i in range(737_000))
    code, err = measured("staff list of 737,000 people (%.0f MB)" % (os.path.getsize(big_yaml) / 2**20),
                         ["solve", big_yaml, "--out", out] + FAST)
    check(code == 2 and "more than 5000 people" in err and "crowd.yaml:5007:" in err,
          f"oversized staff list: exit 2, points at person 5,001 ({code}: {err[-300:]})")
    os.remove(big_yaml)

    huge = os.path.join(folder, "huge.yaml")
    with open(huge, "wb") as f:
        f.truncate(65 * 2**20)  # sparse: takes no disk space
    code, err = measured("65 MB scenario file", ["solve", huge, "--out", out] + FAST)
    check(code == 2 and "at most 64 MB" in err, f"file over 64 MB: exit 2 ({code}: {err[-200:]})")
    os.remove(huge)
    check(os.listdir(folder) == [], f"oversized input: nothing written ({os.listdir(folder)})")


def nul_bytes():
    folder = os.path.join(WORK, "nul")
    os.makedirs(folder)
    out = os.path.join(folder, "out")
    with open(SCENARIO, "rb") as f:
        text = f.read()
    name = b"Amara Osei-Lind"
    at = text.index(name)
    line = text[:at].count(b"\n") + 1
    column = at - text.rfind(b"\n", 0, at) + 3  # "Ama" then the NUL
    scenario = os.path.join(folder, "scenario.yaml")
    with open(scenario, "wb") as f:
        f.write(text.replace(name, b'"Ama\x00ra"', 1))
    # The quotes shift the NUL one column to the right.
    code, err = run(["solve", scenario, "--out", out] + FAST)
    check(code == 2 and "control character U+0000" in err and f"scenario.yaml:{line}:{column + 1}:" in err,
          f"NUL in a scenario name: exit 2 with file, line and column ({code}: {err[-300:]})")
    check("\x00" not in err, "NUL in a scenario name: the message holds no NUL")
    with open(os.path.join(SOURCE, "samples", "clinic-ward", "roster-handmade.csv"), "rb") as f:
        rows = f.read().split(b"\n")
    rows[3] = rows[3].replace(b",", b',"E\x00",', 1)
    roster = os.path.join(folder, "roster.csv")
    with open(roster, "wb") as f:
        f.write(b"\n".join(rows))
    code, err = run(["check", SCENARIO, "--roster", roster, "--out", out])
    check(code == 2 and "control character U+0000" in err and "roster.csv:4:" in err,
          f"NUL in a roster cell: exit 2 with file and line ({code}: {err[-300:]})")
    check("unknown shift" not in err and "\x00" not in err, "NUL in a roster cell: not an unknown shift cut at the NUL")
    check(sorted(os.listdir(folder)) == ["roster.csv", "scenario.yaml"], f"NUL bytes: nothing written ({os.listdir(folder)})")


def main():
    if os.path.exists(WORK):
        for root, dirs, _ in os.walk(WORK):
            for d in dirs:
                os.chmod(os.path.join(root, d), stat.S_IRWXU)
        shutil.rmtree(WORK)
    os.makedirs(WORK)
    disk_full()
    concurrent_runs()
    simultaneous_starts()
    read_only_folder()
    oversized_inputs()
    nul_bytes()
    print(f"{len(failures)} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
