#!/usr/bin/python3
"""@brief Checks that converted benchmark instances score rosters exactly as the benchmark defines.

For every InstanceN.txt (N = 1..24) in the dataset folder: convert it with
`BENCH convert INSTANCE.txt OUT.yaml`, write rosters with benchmark_score.py (for instances up to
--feasible-cells staff-days: uniform random, random keeping the days off, one meeting every
benchmark hard constraint and one-cell mutants of that; for larger ones, to keep the run short,
a single random roster, uniform or keeping the days off), run
`ROTAWEAVE check OUT.yaml --roster R.csv`, and compare report.json with the independent scorer:
  - soft: report summary.soft must equal the benchmark objective (requests + cover), for any roster;
  - hard: summary.hard == 0 and exit status 0 exactly when the benchmark finds no hard violation
    (amounts differ in unit: ours are hours and days, the benchmark counts breaches).
Prints one line per instance and ends with "N passed, M failed" (one unit per roster, plus one
per failed conversion); exits 1 on any failure. A missing dataset folder is skipped with a message.

Usage: benchmark_convert_check.py --bench PATH --rotaweave PATH --dataset DIR
           [--rosters N] [--seed S] [--feasible-cells C] [--work DIR] [--instances 1,2,...]
"""
import argparse
import json
import os
import subprocess
import sys
import tempfile
import time

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import benchmark_score  # noqa: E402  (sibling module, the independent scorer)


def run(cmd, timeout=120):
    return subprocess.run(cmd, capture_output=True, text=True, timeout=timeout)


def check_roster(args, yaml_path, csv_path, out_dir, expected):
    """Returns (disagreement messages, whether the hard record count equals the benchmark's count).
    The count is only informative: the contract does not fix how breaches split into records."""
    proc = run([args.rotaweave, "check", yaml_path, "--roster", csv_path, "--out", out_dir])
    if proc.returncode not in (0, 1):
        return [f"check exited {proc.returncode}: {proc.stderr.strip()[:300]}"], False
    with open(os.path.join(out_dir, "report.json"), encoding="utf-8") as f:
        report = json.load(f)
    summary = report["summary"]
    problems = []
    if abs(summary["soft"] - expected["soft"]) > 1e-6:
        ours = {}
        for v in report["violations"]:
            if v["severity"] == "soft":
                ours[v["kind"]] = ours.get(v["kind"], 0) + v["penalty"]
        problems.append(f"soft {summary['soft']} != benchmark {expected['soft']} "
                        f"(benchmark requests {expected['request']}, cover {expected['cover']}; ours {ours})")
    benchmark_clean = expected["hard"] == 0
    if (summary["hard"] == 0) != benchmark_clean or (proc.returncode == 0) != benchmark_clean:
        kinds = sorted({v["kind"] for v in report["violations"] if v["severity"] == "hard"})
        theirs = sorted({c for _, c, _ in expected["violations"]})
        problems.append(f"hard {summary['hard']} (exit {proc.returncode}, kinds {kinds}) but benchmark "
                        f"finds {expected['hard']} hard violations {theirs}")
    records = sum(1 for v in report["violations"] if v["severity"] == "hard")
    return problems, records == expected["hard"]


def check_instance(args, number, path, work):
    """Returns (passed, failed, line)."""
    name = f"Instance{number}"
    yaml_path = os.path.join(work, f"{name}.yaml")
    proc = run([args.bench, "convert", path, yaml_path])
    if proc.returncode != 0:
        return 0, 1, f"{name}: FAIL convert exited {proc.returncode}: {proc.stderr.strip()[:300]}"
    inst = benchmark_score.parse_instance(path)
    with_feasible = len(inst.staff) * inst.horizon <= args.feasible_cells
    kinds = benchmark_score.KINDS if with_feasible else benchmark_score.KINDS[number % 2:number % 2 + 1]
    count = args.rosters if with_feasible else 1
    passed, failed, notes, clean, same_count = 0, 0, [], 0, 0
    started = time.time()
    rosters = benchmark_score.random_rosters(inst, count, args.seed + number, kinds)
    for i, (kind, roster, suffix) in enumerate(rosters):
        csv_path = os.path.join(work, f"{name}-{i}-{kind}.csv")
        benchmark_score.write_roster(csv_path, inst, roster, suffix)
        expected = benchmark_score.score(inst, roster)
        clean += expected["hard"] == 0
        problems, same = check_roster(args, yaml_path, csv_path, os.path.join(work, f"{name}-{i}-out"), expected)
        same_count += same
        if problems:
            failed += 1
            notes += [f"    {os.path.basename(csv_path)}: {p}" for p in problems]
        else:
            passed += 1
    status = "ok" if failed == 0 else "FAIL"
    line = (f"{name}: {status} {passed}/{passed + failed} rosters agree "
            f"({clean} without benchmark hard violations; hard record count equal to the benchmark's "
            f"breach count in {same_count}), {time.time() - started:.1f} s")
    return passed, failed, "\n".join([line] + notes)


def main(argv):
    p = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    p.add_argument("--bench", required=True, help="rotaweave-bench (or any program with `convert IN OUT`)")
    p.add_argument("--rotaweave", required=True)
    p.add_argument("--dataset", required=True, help="folder holding Instance1.txt ... Instance24.txt")
    p.add_argument("--rosters", type=int, default=6,
                   help="rosters per instance up to --feasible-cells (default 6); larger ones get one")
    p.add_argument("--seed", type=int, default=2027)
    p.add_argument("--feasible-cells", type=int, default=10000,
                   help="build hard-feasible rosters only up to this many staff-days (default 10000)")
    p.add_argument("--work", help="keep files here instead of a temporary folder")
    p.add_argument("--instances", help="comma-separated instance numbers (default 1-24)")
    a = p.parse_args(argv)
    if not os.path.isdir(a.dataset):
        print(f"skip: dataset folder {a.dataset} not found; nothing checked")
        return 0
    for tool in (a.bench, a.rotaweave):
        if not os.access(tool, os.X_OK):
            print(f"error: {tool} is not an executable")
            return 2
    numbers = [int(x) for x in a.instances.split(",")] if a.instances else range(1, 25)
    started = time.time()
    passed = failed = 0
    with tempfile.TemporaryDirectory() as tmp:
        work = a.work or tmp
        os.makedirs(work, exist_ok=True)
        for number in numbers:
            path = os.path.join(a.dataset, f"Instance{number}.txt")
            if not os.path.isfile(path):
                print(f"Instance{number}: skip, {path} not found")
                continue
            ok, bad, line = check_instance(a, number, path, work)
            passed, failed = passed + ok, failed + bad
            print(line, flush=True)
    print(f"time {time.time() - started:.1f} s")
    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
