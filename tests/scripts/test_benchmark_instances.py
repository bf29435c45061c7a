#!/usr/bin/env python3
"""The solver against the open Employee Shift Scheduling Benchmark (Curtois and Qu, 2014;
instances read from the shared dataset folder, never copied into the repository):

- Instance 1 reaches its published optimum (607, proven by a matching lower bound; see
  src/bench/published_results.hpp for the sources) within 40 generations;
- Instances 2 and 3 reach their published optima (828 and 1001, both proven) within 48
  generations, Instance 2 with two seeds. The runs are fixed by seed and generation count, not
  by time (the pool's combination gets as long again as the rounds took, so a slower machine
  gives it as much more time). Measured when the test was last changed (2026-12-04, 2
  threads, the rounds stopping once their step has shrunk 4,096-fold): seeds 1-4 reach the
  optimum before the first generation, Instance 2 in about 2 s, Instance 3 in 8.5-11 s;
- on every instance, a roster without hard breaches never scores below the published lower
  bound: a lower score would mean our evaluator disagrees with the benchmark's definition.

Skipped, with a message, when the dataset folder is absent."""
import json
import os
import subprocess
import sys
from pathlib import Path

BENCH = os.environ["ROTAWEAVE_BENCH"]
DATASET = Path(os.environ.get("ROTAWEAVE_DATASET", ""))
passed = failed = 0


def check(ok, what):
    global passed, failed
    print(("ok   " if ok else "FAIL ") + what)
    passed, failed = passed + ok, failed + (not ok)


def run(instance, seconds, *extra):
    out = subprocess.run([BENCH, "run", str(DATASET / f"Instance{instance}.txt"), "--time-limit", str(seconds),
                          "--threads", "2", "--seed", "1", *extra], capture_output=True, text=True, timeout=seconds * 10 + 120)
    if out.returncode != 0:
        raise RuntimeError(out.stderr)
    return json.loads(out.stdout)


if not (DATASET / "Instance1.txt").exists():
    print(f"skipped: benchmark dataset not found at {DATASET}")
    print("0 passed, 0 failed, 1 skipped")
    sys.exit(0)

def by_generations(instance, seed, optimum):
    """A run fixed by seed and generation count; stops early at the optimum."""
    return run(instance, 900, "--seed", str(seed), "--generations", "48", "--target", str(optimum))


first = run(1, 900, "--generations", "40", "--target", "607")
check(first["best_hard"] == 0 and first["best_soft"] == 607,
      f"Instance1 reaches the published optimum 607 in {first['seconds']} s "
      f"(got hard {first['best_hard']}, soft {first['best_soft']})")

second = [by_generations(2, seed, 828) for seed in (1, 2)]
check(all(r["best_hard"] == 0 and r["best_soft"] == 828 for r in second),
      f"Instance2 reaches the published optimum 828 with seeds 1 and 2 (got {[r['best_soft'] for r in second]}, "
      f"in {[r['seconds'] for r in second]} s)")
third = by_generations(3, 1, 1001)
check(third["best_hard"] == 0 and third["best_soft"] == 1001,
      f"Instance3 reaches the published optimum 1001 in {third['seconds']} s (got hard {third['best_hard']}, soft {third['best_soft']})")

for n in range(1, 25):
    result = first if n == 1 else run(n, 2)
    bound = result["published"]["best_lower"] or result["published"]["optimum"]
    if result["best_hard"] == 0 and bound is not None:
        check(result["best_soft"] >= bound, f"Instance{n}: soft {result['best_soft']} >= published lower bound {bound}")
    else:
        print(f"note Instance{n}: hard {result['best_hard']}, soft {result['best_soft']} (no comparable bound)")

print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed else 0)
