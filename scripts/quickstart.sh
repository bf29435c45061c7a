#!/usr/bin/env bash
# Installs, builds, and solves the bundled clinic ward sample into out/clinic-ward.
set -euo pipefail
cd "$(dirname "$0")/.."
./scripts/build.sh
./build/rotaweave solve samples/clinic-ward/scenario.yaml --out out/clinic-ward --time-limit 30 --seed 1
