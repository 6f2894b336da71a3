#!/usr/bin/env bash
# End-to-end check of the dashboard in a real terminal (tmux), at 80x24 and at 160x48:
# open a copy of the demo, select a marker, add a tie, run the build and wait for its results,
# check the ages and composite screens show them, save, quit; then check that the project file
# holds the new tie, that a .bak was kept and that no recovery file is left.
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
    if $T capture-pane -p -t dash 2>/dev/null | grep -Eq "$pattern"; then return 0; fi
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
  wait_for "Add tie tie-1" "t did not add tie-1"
  wait_for "UNSAVED" "header does not show unsaved edits"
  [ -f "$dir/.$(basename "$name" .yaml).recovery.yaml" ] || fail "no recovery file after an edit"

  # Run: the build goes to the background with a progress bar; the results replace nothing until complete.
  local started=$SECONDS
  $T send-keys -t dash 'r'
  wait_for "Running|Run finished" "r gave no run feedback" 30
  wait_for "Run finished|failed" "the run did not end" 180
  $T capture-pane -p -t dash | grep -q "Run finished" || fail "the run failed"
  wait_for "results current" "header does not show current results"
  echo "   run: $((SECONDS - started)) s, $($T capture-pane -p -t dash | grep -Eo 'Run finished[^.]*')"

  # Ages: the modelled band and the controls with their calibrated 95 % ranges.
  $T send-keys -t dash '2'
  wait_for "Age model: age" "2 did not show the ages"
  wait_for "cal BP" "the ages screen has no age axis"
  wait_for "ash-1-age .* -?[0-9]+\\.\\.-?[0-9]+" "the ages screen lists no 95 % range for ash-1-age"
  # The demo's varve-dated band (about 20 yr over 3500 yr) can be narrower than the curve's own column at 80x24;
  # then the list must give each control's posterior 95 % range beside its prior.
  $T capture-pane -p -t dash | grep -q "▒" || $T capture-pane -p -t dash | grep -Eq "ash-1-age .* -?[0-9]+\.\.-?[0-9]+ +-?[0-9]+\.\.-?[0-9]+" \
    || fail "the ages screen draws no band and lists no posterior range"
  echo "   ages: $($T capture-pane -p -t dash | grep -Eo 'ash-1-age .*' | tr -s ' ' | head -c 70)"

  # Composite: the stacked record with its band and the splice legend.
  $T send-keys -t dash '3'
  wait_for "Composite [a-z_]+ \\(mean and 95% band\\)" "3 did not show the composite"
  wait_for "splice: A=MW19-" "the composite screen has no splice"
  echo "   composite: $($T capture-pane -p -t dash | grep -Eo 'splice: .*' | tr -s ' ')"
  $T send-keys -t dash '1'

  $T send-keys -t dash 's'
  wait_for "Saved $name" "s did not save"
  wait_for "│ saved │|\\| saved \\|" "header does not show saved"

  $T send-keys -t dash 'q'
  for _ in $(seq 100); do [ -f "$dir/exit" ] && break; sleep 0.2; done
  [ -f "$dir/exit" ] || fail "q did not quit"
  grep -q "EXIT=0" "$dir/exit" || fail "exit code $(cat "$dir/exit"); stderr: $(cat "$dir/stderr")"
  $T kill-session -t dash 2>/dev/null || true

  # The project file changed as intended: tie-1 joins the selected marker's depth in the first core.
  [ "$(cat "$project")" != "$original" ] || fail "the project file did not change"
  [ -f "$project.bak" ] || fail "no .bak kept"
  [ ! -f "$dir/.$(basename "$name" .yaml).recovery.yaml" ] || fail "recovery file left after save"
  local tie; tie="$(grep -A3 -E '^ *- id: tie-1$' "$project" | grep 'depths:' || true)"
  [ -n "$tie" ] || fail "tie-1 not in the saved project"
  echo "   saved: $tie"
  echo "$tie" | grep -Eq "$core1: ${depth1}([,}]|0*[,}])" || fail "tie-1 is not at $core1 $depth1: $tie"
  [ "$(echo "$tie" | grep -o "," | wc -l)" -eq 1 ] || fail "tie-1 does not join two cores: $tie"
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
run_size 160 48
echo "dashboard-tmux: all checks passed"
