#!/usr/bin/env bash
# End-to-end check of the dashboard in a real terminal (tmux), at 80x24 and at 200x60:
# open a copy of the demo and check every core id is on the first screen; tie the first core to the
# last one (not neighbours) and check the tie is drawn and described; select a marker and add a tie
# between neighbours; run the build and wait for its results; check the ages screen; scroll the
# composite to its deepest part and zoom in; export and read the longest finding of checks.csv in
# full on the findings screen; save, quit with exit 0; then check that the project file holds both
# new ties, that a .bak was kept and that no recovery file is left.
# Also checks that without a terminal the dashboard refuses with exit code 2.
# Needs tmux and the .NET SDK on PATH; installs nothing. Exits non-zero on the first failure.
# Works without a terminal of its own (CI, a test runner): tmux provides the program's terminal.
# STRATLINK_CMD overrides the command that starts the program (default: the built Debug dll).
set -euo pipefail

# Test hosts set DisableRealDriverIO=1 for headless UI tests; the program under tmux must draw for
# real, so neither the tmux server nor the program may inherit it.
unset DisableRealDriverIO

ROOT="$(cd "$(dirname "${BASH_SOURCE[0]}")/../.." && pwd)"
DEMO="$ROOT/projects-demo"
command -v tmux >/dev/null || { echo "dashboard-tmux: tmux is not installed" >&2; exit 1; }
[ -d "$DEMO" ] || { echo "dashboard-tmux: no demo at $DEMO" >&2; exit 1; }

if [ -z "${STRATLINK_CMD:-}" ]; then
  DLL="$ROOT/src/StratLink.Cli/bin/Debug/net10.0/stratlink.dll"
  if [ ! -f "$DLL" ]; then dotnet build "$ROOT/src/StratLink.Cli" -v quiet -nologo >/dev/null; fi
  STRATLINK_CMD="dotnet $DLL"
fi

WORK="$(mktemp -d)"
SOCKET="stratlink-e2e-$$"
T="tmux -L $SOCKET"
cleanup() { $T kill-server 2>/dev/null || true; rm -rf "$WORK"; }
trap cleanup EXIT

fail() { echo "dashboard-tmux: FAIL: $*" >&2; echo "---- last screen" >&2; $T capture-pane -p -t dash 2>/dev/null >&2 || true; exit 1; }

# Waits until the screen matches a regular expression (default 20 s).
wait_for() {
  local pattern="$1" what="$2" limit="${3:-20}"
  for _ in $(seq $((limit * 5))); do
    if grep -Eq "$pattern" <<<"$($T capture-pane -p -t dash 2>/dev/null)"; then return 0; fi
    sleep 0.2
  done
  fail "$what (waited for /$pattern/)"
}

run_size() {
  local width="$1" height="$2"
  local dir="$WORK/${width}x${height}"
  mkdir -p "$dir"
  cp -r "$DEMO/." "$dir/"
  local project
  project="$(ls "$dir"/*.yaml | head -n 1)"
  local name; name="$(basename "$project")"
  local original; original="$(cat "$project")"
  echo "== ${width}x${height}: $name"

  $T new-session -d -s dash -x "$width" -y "$height" \
    "cd '$dir' && env -u DisableRealDriverIO LANG=C.UTF-8 XDG_CONFIG_HOME='$dir/config' $STRATLINK_CMD '$name' 2>'$dir/stderr'; echo EXIT=\$? > '$dir/exit'; sleep 60"
  wait_for "F1 Keys" "the dashboard did not start"
  wait_for "saved .*not run yet" "header without saved/not-run state"

  # Every core of the site is on the first screen, and the header says how many the logs show.
  local cores; cores="$(python3 -c "import re,sys; t=open(sys.argv[1]).read(); c=re.split(r'^[A-Za-z_]+:', t.split('\ncores:', 1)[1], maxsplit=1, flags=re.M)[0]; m=re.findall(r'^( *)- id: (\S+)', c, re.M); print(' '.join(i for d, i in m if d == m[0][0]))" "$project")"
  local n; n="$(echo "$cores" | wc -w)"
  local first="${cores%% *}" last="${cores##* }"
  local screen; screen="$($T capture-pane -p -t dash)"
  for core in $cores; do grep -q -- "$core" <<<"$screen" || fail "core $core is not on the first screen"; done
  grep -q "$n of $n cores shown" <<<"$screen" || fail "the header does not say $n of $n cores shown"
  echo "   cores on the first screen: $cores"

  # A tie between the first and the last log: the last log is made the partner (Space), then t.
  for _ in $(seq $((n - 1))); do $T send-keys -t dash Right; done
  $T send-keys -t dash Space
  wait_for "New ties go from the active log to $last" "Space did not make $last the partner"
  for _ in $(seq $((n - 1))); do $T send-keys -t dash Left; done
  $T send-keys -t dash Down Down Down
  $T send-keys -t dash 't'
  wait_for "Add tie tie-1" "t did not add tie-1 between $first and $last"
  wait_for "tie-1 other .*$first [0-9.]+, $last [0-9.]+" "the detail line does not describe tie-1 in $first and $last"
  [ "$($T capture-pane -p -t dash | grep -o "◈" | wc -l)" -ge 2 ] || fail "tie-1 is not marked in both logs"
  echo "   first-last tie: $($T capture-pane -p -t dash | grep -Eo "tie-1 other .*" | tr -s ' ' | head -c 90)"
  # Back to the neighbouring log as partner.
  for _ in $(seq $((n - 1))); do $T send-keys -t dash Right; done
  $T send-keys -t dash Space
  wait_for "New ties go to the neighbouring log" "Space again did not clear the partner"
  for _ in $(seq $((n - 1))); do $T send-keys -t dash Left; done

  # Move to a marker: ] selects the next tie below the cursor and reports its depths.
  $T send-keys -t dash ']'
  wait_for "Tie [^ ]+ \\(" "] did not select a tie"
  local line; line="$($T capture-pane -p -t dash | grep -Eo "Tie [^ ]+ \\([a-z]+\\): .*" | head -n 1)"
  local core1; core1="$(echo "$line" | sed -E 's/^Tie [^ ]+ \([a-z]+\): ([^ ,]+) .*/\1/')"
  local depth1; depth1="$(echo "$line" | sed -E 's/^Tie [^ ]+ \([a-z]+\): [^ ,]+ ([0-9.]+).*/\1/')"
  echo "   selected: $line"

  # Add a tie: the next log's cursor goes two rows down, back to the first log, t ties them.
  $T send-keys -t dash Right Down Down Left
  $T send-keys -t dash 't'
  wait_for "Add tie tie-2" "t did not add tie-2"
  wait_for "UNSAVED" "header does not show unsaved edits"
  [ -f "$dir/.$(basename "$name" .yaml).recovery.yaml" ] || fail "no recovery file after an edit"

  # Run: the build goes to the background with a progress bar; the results replace nothing until complete.
  local started=$SECONDS
  $T send-keys -t dash 'r'
  wait_for "Running|Run finished" "r gave no run feedback" 30
  wait_for "Run finished|failed" "the run did not end" 180
  grep -q "Run finished" <<<"$($T capture-pane -p -t dash)" || fail "the run failed"
  wait_for "results current" "header does not show current results"
  echo "   run: $((SECONDS - started)) s, $($T capture-pane -p -t dash | grep -Eo 'Run finished[^.]*')"

  # Ages: the modelled band and the controls with their calibrated 95 % ranges.
  $T send-keys -t dash '2'
  wait_for "Age model: age" "2 did not show the ages"
  wait_for "cal BP" "the ages screen has no age axis"
  wait_for "ash-1-age .* -?[0-9]+\\.\\.-?[0-9]+" "the ages screen lists no 95 % range for ash-1-age"
  # The demo's varve-dated band (about 20 yr over 3500 yr) can be narrower than the curve's own column at 80x24;
  # then the list must give each control's posterior 95 % range beside its prior.
  grep -q "▒" <<<"$($T capture-pane -p -t dash)" || grep -Eq "ash-1-age .* -?[0-9]+\.\.-?[0-9]+ +-?[0-9]+\.\.-?[0-9]+" <<<"$($T capture-pane -p -t dash)" \
    || fail "the ages screen draws no band and lists no posterior range"
  echo "   ages: $($T capture-pane -p -t dash | grep -Eo 'ash-1-age .*' | tr -s ' ' | head -c 70)"

  # Export: the tables the next checks compare the screens with.
  $T send-keys -t dash 'e'
  wait_for "Folder for the tables" "e did not ask for a folder"
  $T send-keys -t dash Enter
  wait_for "Exported " "the export did not finish"
  local out; out="$dir/$(basename "$name" .yaml)-outputs"
  [ -f "$out/composite.csv" ] && [ -f "$out/checks.csv" ] || fail "no composite.csv and checks.csv in $out"

  # Composite: the stacked record with its band and the splice legend; End goes to its deepest
  # part (the last composite depth of composite.csv), + zooms in around it.
  $T send-keys -t dash '3'
  wait_for "Composite [a-z_]+ \\(mean and 95% band\\)" "3 did not show the composite"
  wait_for "splice: A=MW19-" "the composite screen has no splice"
  echo "   composite: $($T capture-pane -p -t dash | grep -Eo 'splice: .*' | tr -s ' ')"
  local deepest; deepest="$(python3 -c "import csv,sys; r=list(csv.reader(open(sys.argv[1]))); v=[float(x[0]) for x in r[1:] if x and x[0]]; m=max(v); print(format(m,'.0f') if abs(m)>=100 else ('%.2f'%m).rstrip('0').rstrip('.'))" "$out/composite.csv")"
  $T send-keys -t dash End
  wait_for "▶ $deepest cm" "End did not go to the composite's deepest part ($deepest cm)"
  $T send-keys -t dash '+'
  wait_for "[0-9.]+ cm per row" "+ did not zoom the composite"
  local zoomed; zoomed="$($T capture-pane -p -t dash | grep -Eo '[0-9.]+ cm per row' | head -n 1)"
  $T send-keys -t dash '+'
  wait_for "[0-9.]+ cm per row" "+ did not zoom the composite again"
  local top_label; top_label="$($T capture-pane -p -t dash | sed -n 4p | grep -Eo '^ *-?[0-9.]+' | tr -d ' ')"
  [ -n "$top_label" ] && python3 -c "import sys; sys.exit(0 if float(sys.argv[1]) > 0 else 1)" "$top_label" \
    || fail "the zoomed composite is not scrolled down (top row label '$top_label')"
  grep -q "▶ $deepest cm" <<<"$($T capture-pane -p -t dash)" || fail "zooming lost the cursor at $deepest cm"
  echo "   composite deepest: $deepest cm, zoomed from $zoomed to $($T capture-pane -p -t dash | grep -Eo '[0-9.]+ cm per row' | head -n 1), top row at $top_label"

  # Findings: step down the list until the detail pane shows the longest message of checks.csv in full.
  local longest; longest="$(python3 -c "import csv,sys; r=list(csv.DictReader(open(sys.argv[1]))); print(max((x['message'] for x in r), key=len) if r else '')" "$out/checks.csv")"
  [ -n "$longest" ] || fail "checks.csv lists no finding"
  $T send-keys -t dash '4'
  wait_for "finding 1 of" "4 did not show the findings with a detail pane"
  local total; total="$($T capture-pane -p -t dash | grep -Eo 'finding 1 of [0-9]+' | grep -Eo '[0-9]+$')"
  local found=""
  for _ in $(seq "$total"); do
    if $T capture-pane -p -t dash | python3 -c "
import sys
lines = sys.stdin.read().split('\n')
start = next(i for i, l in enumerate(lines) if ' of ' in l and 'finding' in l and ('──' in l or '--' in l))
pane = ' '.join(l.strip() for l in lines[start + 1:])
sys.exit(0 if ' '.join(sys.argv[1].split()) in ' '.join(pane.split()) else 1)" "$longest"; then found=1; break; fi
    $T send-keys -t dash Down
    sleep 0.3
  done
  [ -n "$found" ] || fail "the longest finding was not shown in full: $longest"
  echo "   longest finding (${#longest} characters) read in full: ${longest:0:60}..."
  $T send-keys -t dash '1'

  $T send-keys -t dash 's'
  wait_for "Saved $name" "s did not save"
  wait_for "│ saved │|\\| saved \\|" "header does not show saved"

  $T send-keys -t dash 'q'
  for _ in $(seq 100); do [ -f "$dir/exit" ] && break; sleep 0.2; done
  [ -f "$dir/exit" ] || fail "q did not quit"
  grep -q "EXIT=0" "$dir/exit" || fail "exit code $(cat "$dir/exit"); stderr: $(cat "$dir/stderr")"
  $T kill-session -t dash 2>/dev/null || true

  # The project file changed as intended: tie-1 joins the first and the last core, tie-2 the
  # selected marker's depth in the first core to the second core.
  [ "$(cat "$project")" != "$original" ] || fail "the project file did not change"
  [ -f "$project.bak" ] || fail "no .bak kept"
  [ ! -f "$dir/.$(basename "$name" .yaml).recovery.yaml" ] || fail "recovery file left after save"
  local tie1; tie1="$(grep -A3 -E '^ *- id: tie-1$' "$project" | grep 'depths:' || true)"
  [ -n "$tie1" ] || fail "tie-1 not in the saved project"
  grep -q "$first:" <<<"$tie1" && grep -q "$last:" <<<"$tie1" || fail "tie-1 does not join $first and $last: $tie1"
  local tie; tie="$(grep -A3 -E '^ *- id: tie-2$' "$project" | grep 'depths:' || true)"
  [ -n "$tie" ] || fail "tie-2 not in the saved project"
  echo "   saved: tie-1 $tie1; tie-2 $tie"
  grep -Eq "$core1: ${depth1}([,}]|0*[,}])" <<<"$tie" || fail "tie-2 is not at $core1 $depth1: $tie"
  [ "$(echo "$tie" | grep -o "," | wc -l)" -eq 1 ] || fail "tie-2 does not join two cores: $tie"
}

# Without a terminal the dashboard must refuse at once with exit code 2, not hang.
set +e
env -u DisableRealDriverIO timeout 20 $STRATLINK_CMD "$DEMO/$(ls "$DEMO" | grep -m1 '\.yaml$')" </dev/null >"$WORK/notty.out" 2>"$WORK/notty.err"
code=$?
set -e
[ "$code" -eq 2 ] || fail "without a terminal: exit code $code (want 2)"
grep -q "needs a terminal" "$WORK/notty.err" || fail "without a terminal: no explanation"
echo "== no terminal: exit 2, '$(head -c 60 "$WORK/notty.err")...'"

run_size 80 24
run_size 200 60
echo "dashboard-tmux: all checks passed"
