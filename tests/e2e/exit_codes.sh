#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Exit codes of the command line (the table in optimiser/cli/command.h): --help and
# docs/usage.md print the same table, and each code is reached where the table says. Exit 1
# (a bug) has no input that reaches it on purpose; tests/cli/error_channels_test.cpp maps a
# broken contract to it.
source "$(dirname "$0")/common.bash"
study="$SRC/studies/sandglass-mast/study.yaml"

# --- The table: --help and docs/usage.md agree, row by row, and cover the codes 0 to 4. -----
expect_exit 0 -- "$STOWAGE" --help || true
# The help's "Exit codes:" section, wrapped lines joined: "CODE|meaning" per row.
awk '/^Exit codes:/ { on = 1; next }
     on && /^  [0-9]+  / { if (row != "") print row; sub(/^  /, ""); n = $1; sub(/^[0-9]+  /, "");
                            row = n "|" $0; next }
     on && /^     / { sub(/^ +/, ""); row = row " " $0; next }
     on { exit }
     END { if (row != "") print row }' "$WORK/out" >"$WORK/help-table"
# The docs' table under "## Exit codes": "| CODE | meaning |" rows, backticks dropped.
awk '/^## Exit codes/ { on = 1; next } on && /^## / { exit }
     on && /^\| [0-9]+ \|/ { line = $0; gsub(/`/, "", line); sub(/^\| /, "", line);
                             sub(/ \|$/, "", line); sub(/ \| /, "|", line); print line }' \
  "$SRC/docs/usage.md" >"$WORK/docs-table"
[ "$(cut -d'|' -f1 "$WORK/help-table" | tr '\n' ' ')" = "0 1 2 3 4 " ] ||
  fail "--help exit-code table does not list 0 to 4: $(cat "$WORK/help-table")"
diff "$WORK/help-table" "$WORK/docs-table" >"$WORK/table-diff" ||
  fail "--help and docs/usage.md give different exit-code tables: $(cat "$WORK/table-diff")"

# --- 0: success. --------------------------------------------------------------------------
version=$(tr -d '[:space:]' <"$SRC/VERSION")
for flag in --version -V; do
  expect_exit 0 -- "$STOWAGE" "$flag" && [ "$(cat "$WORK/out")" = "stowage $version" ] ||
    fail "$flag prints '$(cat "$WORK/out")', not 'stowage $version'"
done
# `optimize` is the same command as `optimise`: the same answer.
expect_exit 0 -- "$STOWAGE" optimise "$study" --skip-proof --format json && cp "$WORK/out" "$WORK/uk.json"
expect_exit 0 -- "$STOWAGE" optimize "$study" --skip-proof --format json &&
  "$PY" - "$WORK/uk.json" "$WORK/out" <<'EOF' || fail "optimize and optimise give different best designs"
import json, sys
a, b = (json.load(open(p)) for p in sys.argv[1:])
key = lambda d: (d["best"]["profile"], d["best"]["dod_setpoint"], d["best"]["strings_parallel"])
sys.exit(0 if key(a) == key(b) else 1)
EOF
# --export-model writes the whole model and leaves no staging file beside it.
mkdir "$WORK/model"
expect_exit 0 -- "$STOWAGE" optimise "$study" --skip-proof --export-model "$WORK/model/space.mps" &&
  { grep -q '^ENDATA' "$WORK/model/space.mps" || fail "--export-model file has no ENDATA line"; }
[ "$(ls -A "$WORK/model")" = "space.mps" ] || fail "--export-model left $(ls -A "$WORK/model")"

# --- 2: bad input, every message line starting "stowage: ". -------------------------------
all_prefixed() { ! grep -qv '^stowage: ' "$WORK/err"; }
expect_exit 2 -- "$STOWAGE" no-such-command && { all_prefixed || fail "unknown command: $(cat "$WORK/err")"; }
expect_exit 2 -- "$STOWAGE" evaluate "$study" --no-such-option &&
  { all_prefixed && grep -q -- "--no-such-option" "$WORK/err" && grep -q -- "--help" "$WORK/err" ||
    fail "unknown option: $(cat "$WORK/err")"; }
expect_exit 2 -- "$STOWAGE" evaluate && { all_prefixed || fail "missing argument: $(cat "$WORK/err")"; }
expect_exit 2 -- "$STOWAGE" evaluate --format xml "$study" && { all_prefixed || fail "--format xml"; }
expect_exit 2 -- "$STOWAGE" evaluate "$WORK/missing.yaml" && grep -q "missing.yaml" "$WORK/err" ||
  fail "missing study file"
printf 'study: [unclosed\n' >"$WORK/broken.yaml"
expect_exit 2 -- "$STOWAGE" check "$WORK/broken.yaml" && grep -q "broken.yaml:" "$WORK/err" ||
  fail "broken YAML"
# Output paths are refused before the work starts: with a missing study as well, the message
# is about the output path (the study was never read).
touch "$WORK/occupied"
mkdir "$WORK/a-dir"
bad_out() {  # bad_out WORD-IN-MESSAGE command...
  local word=$1
  shift
  expect_exit 2 -- "$STOWAGE" "$@" && grep -qF -- "$word" "$WORK/err" && ! grep -q "missing.yaml" "$WORK/err" ||
    fail "$* (stderr: $(head -c 300 "$WORK/err"))"
}
for cmd in evaluate optimise tender; do
  bad_out "occupied" "$cmd" "$WORK/missing.yaml" --out "$WORK/occupied"
  bad_out "empty" "$cmd" "$WORK/missing.yaml" --out ""
  bad_out "no-parent" "$cmd" "$WORK/missing.yaml" --out "$WORK/no-parent/out"
done
bad_out "empty" report "$WORK/missing.yaml" --out ""
bad_out "--report: needs a directory name" optimise "$WORK/missing.yaml" --report ""
bad_out "no-parent" report "$WORK/missing.yaml" --out "$WORK/no-parent/out"
bad_out "empty" optimise "$WORK/missing.yaml" --export-model ""
bad_out "directory" optimise "$WORK/missing.yaml" --export-model "$WORK/a-dir"
bad_out "no-parent" optimise "$WORK/missing.yaml" --export-model "$WORK/no-parent/m.mps"
bad_out "same directory" optimise "$WORK/missing.yaml" --out "$WORK/o" --report "$WORK/o/"
ls -A "$WORK" | grep -q staging && fail "a staging file or folder was left behind"
[ -z "$(ls -A "$WORK/a-dir")" ] || fail "something was written into $WORK/a-dir"

# --- 3: no design meets the requirements (a budget no bank fits). --------------------------
sed -e "s|site: site.yaml|site: $SRC/studies/sandglass-mast/site.yaml|" \
  -e "s|\.\./\.\./catalog-schema|$SRC/catalog-schema|" \
  -e "s|max_strings_parallel: 20.*|max_strings_parallel: 20\n    budget: 10|" "$study" >"$WORK/poor.yaml"
expect_exit 3 -- "$STOWAGE" optimise "$WORK/poor.yaml" && grep -q "budget" "$WORK/out" ||
  fail "infeasible study: exit 3 and the budget named"
expect_exit 3 -- "$STOWAGE" optimize "$WORK/poor.yaml" --format json || true

# --- 4: the time limit passed before any feasible design (nothing known about feasibility). -
expect_exit 4 -- "$STOWAGE" optimise "$study" --time-limit 0.000001 && grep -qi "time limit" "$WORK/out" ||
  fail "time limit before any design: exit 4 and said so"
expect_exit 4 -- "$STOWAGE" optimise "$study" --time-limit 0.000001 --format json &&
  "$PY" -c 'import json,sys; d=json.load(open(sys.argv[1])); sys.exit(0 if d["best"] is None and d["time_limit_reached"] is True and d["unmet"] == [] else 1)' "$WORK/out" ||
  fail "time limit JSON: best null, time_limit_reached true, unmet empty"
# The infeasible study stays 3 under a generous limit: 4 is only for a limit that cut the search.
expect_exit 3 -- "$STOWAGE" optimise "$WORK/poor.yaml" --time-limit 600 || true
finish
