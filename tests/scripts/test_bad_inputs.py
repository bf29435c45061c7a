#!/usr/bin/env python3
"""Hostile-input corpus: every case in tests/bad_inputs/cases.tsv must be rejected cleanly.

For each case the program runs with --out pointing at a fresh empty folder and must:
exit with status 2 (not 0/1, not 3 or more, not a signal), name the file (and the line where the
manifest gives one) in its message, contain the expected words, and write nothing at all into the
output folder. A few inputs that spreadsheets produce (byte-order mark, CRLF, quoted cells) and a
roster cell with a skill the person does not hold must instead be accepted.

Environment: ROTAWEAVE (binary), ROTAWEAVE_SOURCE_DIR (repository), ROTAWEAVE_WORK (scratch).
"""
import json
import os
import shlex
import shutil
import subprocess
import sys

BINARY = os.environ.get("ROTAWEAVE", "build/rotaweave")
SOURCE = os.environ.get("ROTAWEAVE_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
WORK = os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-bad-inputs")
TIMEOUT = 60

passed, failed = 0, 0


def report(ok, name, why=""):
    global passed, failed
    if ok:
        passed += 1
    else:
        failed += 1
        print(f"FAIL {name}: {why}")


def run(args, cwd, out):
    cmd = [os.path.abspath(BINARY)] + args + ["--out", out]
    try:
        p = subprocess.run(cmd, cwd=cwd, capture_output=True, timeout=TIMEOUT)
    except subprocess.TimeoutExpired:
        return None, "", f"timed out after {TIMEOUT} s"
    return p.returncode, p.stderr.decode("utf-8", "replace"), p.stdout.decode("utf-8", "replace")


def everything_under(path):
    found = []
    for root, dirs, files in os.walk(path):
        found += [os.path.relpath(os.path.join(root, x), path) for x in dirs + files]
    return sorted(found)


def load_manifest(path):
    cases = []
    with open(path, encoding="utf-8") as f:
        for number, raw in enumerate(f, 1):
            line = raw.rstrip("\n")
            if not line or line.startswith("#"):
                continue
            cols = line.split("\t")
            if len(cols) != 5:
                raise SystemExit(f"{path}:{number}: expected 5 tab-separated columns, found {len(cols)}")
            name, args, words, file, expected_line = cols
            cases.append((name, shlex.split(args), [w for w in words.split(";") if w], file, int(expected_line)))
    return cases


def check_bad(case, corpus, outs):
    name, args, words, file, line = case
    out = os.path.join(outs, name)
    os.makedirs(out)
    code, err, _ = run(args, corpus, out)
    if code is None:
        return report(False, name, err)
    problems = []
    if code < 0:
        problems.append(f"killed by signal {-code}")
    elif code != 2:
        problems.append(f"exit {code}, expected 2")
    if file not in err:
        problems.append(f"message does not name '{file}'")
    elif line and f"{file}:{line}" not in err:
        problems.append(f"message does not point at {file}:{line}")
    lower = err.lower()
    for w in words:
        if w.lower() not in lower:
            problems.append(f"message lacks '{w}'")
    if "internal error" in lower:
        problems.append("reported as an internal error")
    if len(err.strip().splitlines()) == 0:
        problems.append("no message at all")
    left = everything_under(out)
    if left:
        problems.append(f"wrote into the output folder: {left}")
    report(not problems, name, "; ".join(problems) + f"\n    stderr: {err.strip()[:400]}")


def check_accepted(corpus, outs):
    """Spreadsheet-style CSV is read; a skill the person lacks is a hard breach, not an input error."""
    for name, csv, want_code, want_rule in [
        ("accept_bom_crlf_quoted", "accepted/roster_bom_crlf_quoted.csv", None, None),
        ("accept_skill_not_held", "accepted/roster_skill_not_held.csv", 1, "skill"),
    ]:
        out = os.path.join(outs, name)
        code, err, _ = run(["check", "ok.yaml", "--roster", csv], corpus, out)
        problems = []
        if code not in (0, 1) or (want_code is not None and code != want_code):
            problems.append(f"exit {code}")
        for f in ("roster.csv", "report.json", "report.txt"):
            if not os.path.isfile(os.path.join(out, f)):
                problems.append(f"{f} missing")
        if not problems:
            with open(os.path.join(out, "report.json"), encoding="utf-8") as f:
                data = json.load(f)
            if want_rule and not any(v["kind"] == want_rule and v["severity"] == "hard" and v["staff"] == "ana"
                                     for v in data["violations"]):
                problems.append(f"no hard '{want_rule}' breach for ana in report.json")
            with open(os.path.join(out, "roster.csv"), encoding="utf-8") as f:
                rows = f.read().splitlines()
            if name == "accept_bom_crlf_quoted" and rows[2].split(",")[:4] != ["ben", "", "E/hca", "E/rn"]:
                problems.append(f"roster read back wrongly: {rows[2]}")
        report(not problems, name, "; ".join(problems) + f"\n    stderr: {err.strip()[:400]}")


def main():
    corpus_src = os.path.join(SOURCE, "tests", "bad_inputs")
    if os.path.exists(WORK):
        shutil.rmtree(WORK)
    corpus = os.path.join(WORK, "corpus")
    outs = os.path.join(WORK, "out")
    # Run on a copy, so a misbehaving binary can never touch the source tree.
    shutil.copytree(corpus_src, corpus)
    os.makedirs(outs)
    cases = load_manifest(os.path.join(corpus, "cases.tsv"))
    if len(cases) < 40:
        report(False, "manifest", f"only {len(cases)} cases")
    names = [c[0] for c in cases]
    if len(set(names)) != len(names):
        report(False, "manifest", "duplicate case names")
    for case in cases:
        check_bad(case, corpus, outs)
    check_accepted(corpus, outs)
    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
