#!/usr/bin/env bash
# Installs the Debian packages rotaweave and its tests need (when run as root and any is
# missing) and builds it into build/.
set -euo pipefail
cd "$(dirname "$0")/.."
packages="cmake make g++ pkg-config libboost-program-options-dev libyaml-cpp-dev libxlsxwriter-dev libminizip-dev libexpat1-dev doctest-dev coinor-libcbc-dev coinor-libclp-dev
          libreoffice-calc-nogui python3 python3-yaml python3-openpyxl python3-icalendar python3-pulp coinor-cbc tzdata"
# shellcheck disable=SC2086
if [ "$(id -u)" = 0 ] && ! dpkg -s $packages >/dev/null 2>&1; then
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  # shellcheck disable=SC2086
  apt-get install -y -qq --no-install-recommends $packages >/dev/null
fi
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
if ! cmake --build build -j"$(nproc)" >build/build.log 2>&1; then
  tail -n 60 build/build.log
  echo "build failed; the full log is build/build.log" >&2
  exit 1
fi
echo "built build/rotaweave"
