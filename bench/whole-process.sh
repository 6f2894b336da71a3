#!/usr/bin/env bash
# Whole-process timings, as a user meets them (start-up, compilation, first touches of memory and
# writing included), against peers in the same session, runs alternating, medians and ratios:
#
#   bench/whole-process.sh pair [ROUNDS] [N ...]
#       `stratlink pair --pattern symmetric1 --path` against mlpy.dtw_std(dist_only=False) writing
#       its path too, on the same seeded random walks (N = 2,000, 5,000, 10,000 by default, 3 rounds):
#       wall seconds and peak memory (maximum resident set) of each, the ratios, and the relative
#       difference of the distances; then the in-process kernel against a plain C rolling-row loop
#       (gcc -O2) in ns per lattice cell.
#   bench/whole-process.sh build REV [ROUNDS]
#       a cold `stratlink build` by one built from git revision REV of REV's own demo project,
#       against this tree building that same project and today's demo (3 rounds by default):
#       medians of wall, CPU and peak memory, ratios, and which outputs of the shared project differ
#       (run.json apart from its stage timings).
#
# This tree's stratlink is published as the tool ships (ReadyToRun, linux-x64). Installs the Debian
# packages it drives when missing (time, python3-mlpy, gcc). The machine's load is printed before
# and after: on a shared machine compare the ratios, not the seconds.
set -euo pipefail
cd "$(dirname "$0")/.."
root=$PWD

need() {
  for pkg in "$@"; do
    dpkg-query -W -f='${Status}' "$pkg" 2>/dev/null | grep -q "install ok installed" && continue
    apt-get install -y -qq "$pkg" >/dev/null 2>&1 || { apt-get update -qq && apt-get install -y -qq "$pkg" >/dev/null; }
  done
}

work=$(mktemp -d /tmp/stratlink-whole-XXXXXX)
trap 'rm -rf "$work"' EXIT

publish() { dotnet publish "$root/src/StratLink.Cli" -c Release -r linux-x64 --self-contained false -o "$work/stratlink" -v q -nologo >/dev/null; }

# run LABEL CMD...: runs CMD under /usr/bin/time, appends "LABEL wall_s max_rss_kb cpu_s" to $work/times.
run() {
  local label=$1; shift
  /usr/bin/time -f "%e %M %U %S" -o "$work/t" "$@" >"$work/$label.out" 2>"$work/$label.err" || { cat "$work/$label.err" >&2; exit 1; }
  read -r wall rss user sys <"$work/t"
  echo "$label $wall $rss $(/usr/bin/python3 -c "import sys; print(float(sys.argv[1]) + float(sys.argv[2]))" "$user" "$sys")" >>"$work/times"
}

median() { /usr/bin/python3 -c 'import sys, statistics; print(statistics.median(float(v) for v in sys.argv[1:]))' "$@"; }
col() { awk -v l="$1" -v c="$2" '$1 == l { print $c }' "$work/times"; }

echo "load before: $(cut -d' ' -f1-3 /proc/loadavg), $(nproc) cores"
case "${1:-pair}" in
pair)
  need time python3-mlpy gcc
  rounds=${2:-3}
  sizes=("${@:3}")
  [ ${#sizes[@]} -gt 0 ] || sizes=(2000 5000 10000)
  publish
  cat >"$work/mlpy_pair.py" <<'EOF'
import sys, numpy as np, mlpy
x = np.loadtxt(sys.argv[1], skiprows=1); y = np.loadtxt(sys.argv[2], skiprows=1)
d, cost, path = mlpy.dtw_std(x, y, dist_only=False)
with open(sys.argv[3], "w", buffering=1 << 20) as f:
    f.write("index_a,index_b\n")
    np.savetxt(f, np.column_stack(path) + 1, fmt="%d", delimiter=",")
print(repr(float(d)))
EOF
  echo "symmetric1, |a - b|, full path written; median of $rounds alternating rounds; wall s, peak RSS MB"
  printf "%7s %9s %9s %7s %9s %9s %7s %11s\n" N ours_s mlpy_s wall MB_ours MB_mlpy memory "|d diff|/d"
  for n in "${sizes[@]}"; do
    /usr/bin/python3 - "$n" "$work/a$n.csv" "$work/b$n.csv" <<'EOF'
import sys, numpy as np
n = int(sys.argv[1]); rng = np.random.default_rng(n)
for name in sys.argv[2:4]:
    np.savetxt(name, np.cumsum(rng.random(n) - 0.5), fmt="%.17g", header="x", comments="")
EOF
    : >"$work/times"
    for r in $(seq "$rounds"); do
      ours=(run ours "$work/stratlink/stratlink" pair "$work/a$n.csv" "$work/b$n.csv" --pattern symmetric1 --signals x --path "$work/ours.csv")
      peer=(run mlpy /usr/bin/python3 "$work/mlpy_pair.py" "$work/a$n.csv" "$work/b$n.csv" "$work/mlpy.csv")
      if [ $((r % 2)) -eq 1 ]; then "${ours[@]}"; "${peer[@]}"; else "${peer[@]}"; "${ours[@]}"; fi
    done
    cmp -s "$work/ours.csv" "$work/mlpy.csv" || echo "  (the paths differ: ties broken differently)"
    d_ours=$(awk '$1 == "distance" { print $2 }' "$work/ours.out")
    d_mlpy=$(cat "$work/mlpy.out")
    /usr/bin/python3 - "$n" "$(median $(col ours 2))" "$(median $(col mlpy 2))" "$(median $(col ours 3))" "$(median $(col mlpy 3))" "$d_ours" "$d_mlpy" <<'EOF'
import sys
n, ts, tm, ms, mm, ds, dm = sys.argv[1], *map(float, sys.argv[2:])
print(f"{n:>7} {ts:9.2f} {tm:9.2f} {ts / tm:6.2f}x {ms / 1024:9.1f} {mm / 1024:9.1f} {ms / mm:6.2f}x {abs(ds - dm) / dm:11.1e}")
EOF
  done

  echo "in-process kernel against a plain C rolling-row loop (symmetric1, full path, N = 10,000; best of 3 each, median of 3 alternating rounds)"
  gcc -O2 -o "$work/rolling_row" "$root/bench/whole-process/rolling_row.c" -lm
  dotnet build "$root/bench/StratLink.Bench" -c Release -o "$work/bench" -v q -nologo >/dev/null
  : >"$work/kernel"
  for r in $(seq 3); do
    echo "c $("$work/rolling_row" 10000 1 | cut -d' ' -f2)" >>"$work/kernel"
    echo "ours $(dotnet "$work/bench/StratLink.Bench.dll" kernel 10000 1 | cut -d' ' -f2)" >>"$work/kernel"
  done
  c_ns=$(median $(awk '$1 == "c" { print $2 }' "$work/kernel"))
  ours_ns=$(median $(awk '$1 == "ours" { print $2 }' "$work/kernel"))
  /usr/bin/python3 -c "import sys; c, o = map(float, sys.argv[1:]); print(f'C {c:.2f} ns/cell, ours {o:.2f} ns/cell, ours/C {o / c:.2f}')" "$c_ns" "$ours_ns"
  ;;
build)
  need time
  rev=${2:?give the git revision to compare with, e.g. 9c6b142}
  rounds=${3:-3}
  publish
  mkdir -p "$work/old-src"
  git -C "$root" archive "$rev" | tar -x -C "$work/old-src"
  dotnet build "$work/old-src/src/StratLink.Cli" -c Release -o "$work/old" -v q -nologo >/dev/null
  # An older revision may not read today's demo keys, so it builds its own demo; this tree builds
  # that same project (the like-for-like pair, whose outputs are compared) and today's demo.
  old_project="$work/old-src/projects-demo/mirrowick-fjord.stratlink.yaml"
  new_project="$root/projects-demo/mirrowick-fjord.stratlink.yaml"
  : >"$work/times"
  for r in $(seq "$rounds"); do
    old=(run old "$work/old/stratlink" build "$old_project" --out "$work/out-old")
    same=(run same "$work/stratlink/stratlink" build "$old_project" --out "$work/out-same")
    today=(run today "$work/stratlink/stratlink" build "$new_project" --out "$work/out-today")
    if [ $((r % 2)) -eq 1 ]; then "${old[@]}"; "${same[@]}"; "${today[@]}"; else "${today[@]}"; "${same[@]}"; "${old[@]}"; fi
  done
  echo "cold build, median of $rounds alternating rounds; wall and CPU (user + system) seconds, peak RSS MB; ratio = this tree / $rev"
  /usr/bin/python3 - "$rev" "$(median $(col old 2))" "$(median $(col old 4))" "$(median $(col old 3))" \
    "$(median $(col same 2))" "$(median $(col same 4))" "$(median $(col same 3))" \
    "$(median $(col today 2))" "$(median $(col today 4))" "$(median $(col today 3))" <<'EOF'
import sys
rev = sys.argv[1]
ow, oc, om, sw, sc, sm, tw, tc, tm = map(float, sys.argv[2:])
print(f"{'':34} {'wall_s':>7} {'ratio':>6} {'cpu_s':>7} {'ratio':>6} {'RSS_MB':>7} {'ratio':>6}")
for label, w, c, m in ((f"{rev} on {rev}'s demo", ow, oc, om), (f"this tree on {rev}'s demo", sw, sc, sm), ("this tree on today's demo", tw, tc, tm)):
    print(f"{label:34} {w:7.2f} {w / ow:5.2f}x {c:7.2f} {c / oc:5.2f}x {m / 1024:7.1f} {m / om:5.2f}x")
print(f"speed-up on {rev}'s demo: {ow / sw:.2f}x wall, {oc / sc:.2f}x CPU; today's demo against it: {ow / tw:.2f}x wall, {oc / tc:.2f}x CPU")
EOF
  differ=0
  for f in $(cd "$work/out-old" && find . -type f | sort); do
    if [ ! -e "$work/out-same/$f" ]; then echo "  only $rev writes: $f"; differ=1; continue; fi
    if [ "$f" = ./run.json ]; then
      /usr/bin/python3 -c 'import json, sys; a, b = (json.load(open(f)) for f in sys.argv[1:]); a.pop("stages_seconds", None); b.pop("stages_seconds", None); sys.exit(a != b)' \
        "$work/out-old/$f" "$work/out-same/$f" && continue
    else
      cmp -s "$work/out-old/$f" "$work/out-same/$f" && continue
    fi
    echo "  differs: $f"; differ=1
  done
  for f in $(cd "$work/out-same" && find . -type f | sort); do
    [ -e "$work/out-old/$f" ] || { echo "  only this tree writes: $f"; differ=1; }
  done
  [ "$differ" -eq 1 ] || echo "outputs of $rev's demo identical between $rev and this tree (run.json apart from the stage timings)"
  ;;
*)
  echo "usage: $0 pair [ROUNDS] [N ...] | build REV [ROUNDS]" >&2; exit 2 ;;
esac
echo "load after: $(cut -d' ' -f1-3 /proc/loadavg)"
