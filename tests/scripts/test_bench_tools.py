#!/usr/bin/env python3
"""The rotaweave-bench modes that check the CLI from outside and tabulate the benchmark print
what scripts expect: every result line parses as JSON with the documented fields.

- `limits --limits 2` on Instance1 and generated:20x14: a line per run (exit 0 or 1, all three
  outputs written, hard and soft read back) and a summary line;
- `interrupt --at 1` on generated:40x31: the child was signalled, exited 0 or 1, and left a
  roster with one row per person, a report.json that parses and a report.txt;
- `scaling` on Instance1 at 1 and 2 threads for 2 s: a line per thread count with the phases;
- `table` on a folder holding only Instance1 and Instance2 (links), one seed, 2 s: a JSON line
  per run whose re-scored soft equals the report's soft, and a markdown row per instance whose
  soft is that value.

Nothing here asserts a wall time or a solution quality: the figures depend on the machine. The
instance parts are skipped, with a message, when the benchmark dataset is absent.

Environment: ROTAWEAVE_BENCH (binary), ROTAWEAVE_DATASET (benchmark folder), ROTAWEAVE_WORK
(scratch folder to create).
"""
import json
import os
import shutil
import subprocess
import sys
from pathlib import Path

BENCH = os.path.abspath(os.environ.get("ROTAWEAVE_BENCH", "build/rotaweave-bench"))
DATASET = Path(os.environ.get("ROTAWEAVE_DATASET", "../shared/benchmarks/shift-scheduling"))
WORK = Path(os.environ.get("ROTAWEAVE_WORK", "/tmp/rotaweave-bench-tools"))
SOLVE_FIELDS = ["wall_s", "peak_rss_mb", "exit", "signal", "killed", "hard", "soft", "roster_csv", "report_json", "report_txt"]

failures = []


def check(ok, what):
    print(("ok   " if ok else "FAIL ") + what)
    if not ok:
        failures.append(what)


def bench(*args):
    """Runs a mode; returns its JSON lines and its other stdout lines."""
    p = subprocess.run([BENCH, *args], capture_output=True, text=True, timeout=600)
    check(p.returncode == 0, f"{args[0]}: exit 0 (got {p.returncode}; stderr: {p.stderr[-300:]})")
    records, other = [], []
    for line in p.stdout.splitlines():
        if line.startswith("{"):
            try:
                records.append(json.loads(line))
            except ValueError as e:
                check(False, f"{args[0]}: line parses as JSON ({e}): {line[:200]}")
        else:
            other.append(line)
    return records, other


def has_fields(record, fields, label):
    missing = [f for f in fields if f not in record]
    check(not missing, f"{label}: has {', '.join(fields)} (missing {missing})")
    return not missing


def is_number(value):
    return isinstance(value, (int, float)) and not isinstance(value, bool)


def check_solve_run(run, label):
    if not has_fields(run, SOLVE_FIELDS, label):
        return
    check(run["exit"] in (0, 1) and run["signal"] is None and run["killed"] is False,
          f"{label}: exit 0 or 1, not ended by a signal (exit {run['exit']}, signal {run['signal']})")
    check(run["roster_csv"] and run["report_json"] and run["report_txt"], f"{label}: roster.csv, report.json, report.txt written")
    check(is_number(run["hard"]) and is_number(run["soft"]), f"{label}: hard and soft read back from report.json")
    check(is_number(run["wall_s"]) and run["wall_s"] > 0 and is_number(run["peak_rss_mb"]) and run["peak_rss_mb"] > 0,
          f"{label}: wall time and peak memory measured")


def limits(items):
    records, _ = bench("limits", "--limits", "2", *items)
    runs = [r for r in records if "summary" not in r]
    summaries = [r for r in records if r.get("summary") == "limits"]
    check(len(runs) == len(items), f"limits: one line per item ({len(runs)} for {len(items)})")
    for run in runs:
        label = f"limits {run.get('item')}"
        check_solve_run(run, label)
        if has_fields(run, ["item", "limit", "threads", "over_s", "within"], label):
            check(run["limit"] == 2 and isinstance(run["within"], bool) and is_number(run["over_s"]),
                  f"{label}: limit 2, over_s a number, within a boolean")
    check(len(summaries) == 1 and records[-1] is summaries[0], "limits: ends with one summary line")
    if summaries:
        s = summaries[0]
        if has_fields(s, ["runs", "within", "complete", "worst_over_s", "worst_peak_rss_mb"], "limits summary"):
            check(s["runs"] == len(items) and s["complete"] == len(items) and 0 <= s["within"] <= s["runs"],
                  f"limits summary: {len(items)} runs, all complete (runs {s['runs']}, complete {s['complete']})")


def interrupt():
    records, _ = bench("interrupt", "--at", "1", "generated:40x31")
    runs = [r for r in records if "summary" not in r]
    check(len(runs) == 1 and records[-1].get("summary") == "interrupt", "interrupt: one run line and a summary line")
    if not runs:
        return
    run = runs[0]
    check_solve_run(run, "interrupt")
    if has_fields(run, ["at_s", "signalled", "latency_s", "exit_ok", "roster_rows_ok", "report_json_valid", "ok"], "interrupt"):
        check(run["signalled"] and is_number(run["latency_s"]) and run["latency_s"] >= 0,
              f"interrupt: signalled after {run['at_s']} s, latency measured")
        check(run["exit_ok"] and run["roster_rows_ok"] and run["report_json_valid"] and run["ok"],
              f"interrupt: exit 0 or 1, one roster row per person, report.json parses "
              f"({run.get('roster_error', '')}{run.get('report_error', '')})")
    summary = records[-1]
    has_fields(summary, ["runs", "ok", "worst_latency_s"], "interrupt summary")


def scaling(instance):
    records, _ = bench("scaling", str(instance), "--threads", "1,2", "--time-limit", "2")
    check([r.get("threads") for r in records] == [1, 2], f"scaling: a line for 1 and 2 threads (got {[r.get('threads') for r in records]})")
    for r in records:
        label = f"scaling {r.get('threads')} threads"
        if has_fields(r, ["islands", "generations", "best_hard", "best_soft", "wall_s", "cpu_per_wall", "phases"], label):
            check(list(r["phases"]) == ["starts", "populations", "generations"] and all(is_number(v) for v in r["phases"].values()),
                  f"{label}: phases starts, populations, generations with their seconds ({r['phases']})")
            check(is_number(r["cpu_per_wall"]) and r["cpu_per_wall"] > 0, f"{label}: CPU over wall measured")


def table():
    folder = WORK / "instances"
    folder.mkdir()
    for n in (1, 2):
        (folder / f"Instance{n}.txt").symlink_to((DATASET / f"Instance{n}.txt").resolve())
    records, other = bench("table", str(folder), "--seeds", "1", "--time-limit", "2", "--keep", str(WORK / "rosters"))
    check([r.get("instance") for r in records] == ["Instance1", "Instance2"],
          f"table: a JSON line per run, Instance1 and Instance2 (got {[r.get('instance') for r in records]})")
    rows = {}
    for line in other:
        cells = [c.strip() for c in line.strip().strip("|").split("|")]
        if line.startswith("|") and cells[0].isdigit():
            rows[int(cells[0])] = cells
    check(sorted(rows) == [1, 2], f"table: a markdown row per instance (got {sorted(rows)})")
    for r in records:
        label = f"table {r.get('instance')}"
        check_solve_run(r, label)
        if not has_fields(r, ["seed", "rescored_hard", "rescored_soft", "rescore_matches_report", "roster"], label):
            continue
        check(r["rescored_soft"] == r["soft"] and r["rescored_hard"] == r["hard"] and r["rescore_matches_report"],
              f"{label}: re-scored roster equals the report (hard {r['rescored_hard']} / {r['hard']}, "
              f"soft {r['rescored_soft']} / {r['soft']})")
        check(Path(r["roster"]).is_file(), f"{label}: roster kept at {r['roster']}")
        cells = rows.get(int(r["instance"][len("Instance"):]))
        if cells and len(cells) == 8:
            check(float(cells[3]) == r["soft"], f"{label}: markdown soft {cells[3]} equals the report's {r['soft']}")
            check(cells[5].isdigit() and cells[6].isdigit(), f"{label}: best known {cells[5]} and 10-minute {cells[6]} shown")
        else:
            check(False, f"{label}: markdown row has 8 cells ({cells})")


def main():
    if WORK.exists():
        shutil.rmtree(WORK)
    WORK.mkdir(parents=True)
    have_dataset = (DATASET / "Instance1.txt").is_file() and (DATASET / "Instance2.txt").is_file()
    if not have_dataset:
        print(f"skipped: the instance parts (benchmark dataset not found at {DATASET})")
    limits(([str(DATASET / "Instance1.txt")] if have_dataset else []) + ["generated:20x14"])
    interrupt()
    if have_dataset:
        scaling(DATASET / "Instance1.txt")
        table()
    print(f"{len(failures)} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
