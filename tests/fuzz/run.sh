#!/usr/bin/env bash
# Builds the libFuzzer targets with clang into build-fuzz/ and runs each for SECONDS (default 30)
# on a copy of its seed corpus. Fails on any crash, sanitizer report, leak, timeout (5 s per
# input) or memory blow-up (2 GiB); the input that failed is left in build-fuzz/findings/.
set -euo pipefail
seconds="${1:-30}"
root="$(cd "$(dirname "$0")/../.." && pwd)"
build="${ROTAWEAVE_FUZZ_BUILD:-$root/build-fuzz}"
cxx="${CXX_FUZZ:-clang++}"
command -v "$cxx" >/dev/null || { echo "fuzz: $cxx not found (apt-get install clang libclang-rt-14-dev)" >&2; exit 1; }

# From the top level once it adds tests/fuzz, else the fuzz folder on its own.
if grep -q 'tests/fuzz' "$root/CMakeLists.txt"; then
  cmake -S "$root" -B "$build" -DCMAKE_CXX_COMPILER="$cxx" -DCMAKE_BUILD_TYPE=RelWithDebInfo \
    -DROTAWEAVE_FUZZ=ON -DROTAWEAVE_BUILD_TESTS=OFF -DROTAWEAVE_USE_OPENMP=OFF >/dev/null
else
  cmake -S "$root/tests/fuzz" -B "$build" -DCMAKE_CXX_COMPILER="$cxx" -DCMAKE_BUILD_TYPE=RelWithDebInfo >/dev/null
fi
cmake --build "$build" -j"${JOBS:-2}" --target fuzz_scenario fuzz_roster_csv fuzz_csv_shape fuzz_roster_xlsx >/dev/null
bin="$(dirname "$(find "$build" -name fuzz_scenario -type f -perm -u+x | head -n1)")"

status=0
for target in scenario:fuzz_scenario csv:fuzz_roster_csv csv:fuzz_csv_shape xlsx:fuzz_roster_xlsx; do
  seeds="${target%%:*}" exe="${target##*:}"
  work="$build/corpus/$seeds" findings="$build/findings/$seeds"
  mkdir -p "$work" "$findings"
  cp -n "$root/tests/fuzz/corpus/$seeds"/* "$work"/ 2>/dev/null || true
  max_len=8192
  [ "$seeds" = xlsx ] && max_len=65536  # whole workbooks among the seeds
  dict=()
  [ -f "$root/tests/fuzz/$seeds.dict" ] && dict=(-dict="$root/tests/fuzz/$seeds.dict")
  echo "fuzz: $exe for $seconds s"
  # Seeds first, so a regression input fails at once; then new inputs go to the working corpus.
  if ! ASAN_OPTIONS=detect_leaks=1:allocator_may_return_null=1 UBSAN_OPTIONS=print_stacktrace=1:halt_on_error=1 \
      "$bin/$exe" -max_total_time="$seconds" -timeout=5 -rss_limit_mb=2048 -max_len="$max_len" "${dict[@]}" \
      -artifact_prefix="$findings/" -print_final_stats=1 "$work" "$root/tests/fuzz/corpus/$seeds" \
      > "$build/$exe.log" 2>&1; then
    echo "fuzz: $exe FAILED; see $build/$exe.log and $findings/" >&2
    tail -n 40 "$build/$exe.log" >&2
    status=1
  else
    grep -E '^stat::number_of_executed_units|^#[0-9]+.*DONE' "$build/$exe.log" | tail -n 2 || true
  fi
done
exit $status
