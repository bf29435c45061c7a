#!/usr/bin/env bash
# Installs the Debian packages rotaweave needs (when run as root) and builds it into build/.
set -euo pipefail
cd "$(dirname "$0")/.."
if [ "$(id -u)" = 0 ] && ! dpkg -s libxlsxwriter-dev libyaml-cpp-dev libboost-program-options-dev doctest-dev >/dev/null 2>&1; then
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq
  apt-get install -y -qq --no-install-recommends cmake make g++ pkg-config \
    libboost-program-options-dev libyaml-cpp-dev libxlsxwriter-dev doctest-dev \
    python3 python3-openpyxl python3-icalendar python3-pulp coinor-cbc >/dev/null
fi
cmake -S . -B build -DCMAKE_BUILD_TYPE=Release >/dev/null
cmake --build build -j"$(nproc)"
