#!/usr/bin/env bash
# Times StratLink's DTW (symmetric1, full path) against mlpy.dtw_std on the same seeded random walks
# (N = 2,000, 5,000, 10,000), checks that the distances agree, prints ns per lattice cell and the
# ratio; then times a two-core alignment with ties and a 200-path ensemble.
# Needs Debian's python3-mlpy (apt-get install -y python3-mlpy). Run alone: it uses every core.
set -euo pipefail
cd "$(dirname "$0")/.."
dpkg-query -W -f='${Status}' python3-mlpy 2>/dev/null | grep -q "install ok installed" || {
  echo "python3-mlpy is missing: apt-get install -y python3-mlpy" >&2; exit 1; }
dotnet run -c Release --project bench/StratLink.Bench -- "$@"
