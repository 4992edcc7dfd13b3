#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `stowage check` reports every problem it can find in one run (catalog-schema/study_check.h),
# as text on stderr or as the JSON object docs/usage.md describes, and passes a valid study.
source "$(dirname "$0")/common.bash"
many="$SRC/tests/catalog-schema/check-many/study.yaml"
valid="$SRC/tests/catalog-schema/fixtures/study.yaml"

# Text: one line per problem, all on stderr, each "stowage: FILE:LINE:COL: FIELD: ...", then
# the count; nothing on stdout.
expect_exit 2 -- "$STOWAGE" check "$many" && {
  [ ! -s "$WORK/out" ] || fail "problems, yet stdout has: $(head -c 200 "$WORK/out")"
  [ "$(grep -c '^stowage: [^ ]*:[0-9]*:[0-9]*: [^ ]*: ' "$WORK/err")" -eq 8 ] ||
    fail "expected 8 located problems: $(cat "$WORK/err")"
  tail -1 "$WORK/err" | grep -q "^stowage: 8 problems found in $many$" || fail "no count line"
  for file in study.yaml site.yaml hourly.csv two-schema-problems.yaml dod-default-outside.yaml; do
    grep -q "/$file:" "$WORK/err" || fail "no problem reported in $file"
  done
  grep -qF "did you mean 'design_space'?" "$WORK/err" || fail "no suggestion for the key 'design_spce'"
}

# JSON: the documented shape, problems with 1-based positions, summary null.
expect_exit 2 -- "$STOWAGE" check --format json "$many" &&
  "$PY" - "$WORK/out" "$many" <<'PY' || fail "check --format json with problems"
import json, sys
d = json.load(open(sys.argv[1]))
assert set(d) == {"study", "valid", "problems", "notes", "summary"}, sorted(d)
assert d["study"] == sys.argv[2] and d["valid"] is False and d["summary"] is None
assert len(d["problems"]) == 8, len(d["problems"])
for p in d["problems"]:
    assert set(p) == {"file", "line", "column", "field", "message"}, p
    assert isinstance(p["line"], int) and p["line"] >= 1 and p["column"] >= 1, p
assert d["problems"][1]["field"] == "study.design_spce" and "did you mean 'design_space'?" in d["problems"][1]["message"]
PY

# A valid study: text summary on stdout, JSON with valid true and the summary.
expect_exit 0 -- "$STOWAGE" check "$valid" && {
  head -1 "$WORK/out" | grep -q "^$valid: valid$" || fail "valid study: $(head -1 "$WORK/out")"
}
expect_exit 0 -- "$STOWAGE" check --format json "$valid" &&
  "$PY" - "$WORK/out" <<'PY' || fail "check --format json of a valid study"
import json, sys
d = json.load(open(sys.argv[1]))
assert d["valid"] is True and d["problems"] == [], d
s = d["summary"]
assert s["title"] == "Loader test study" and s["economics"]["currency"] == "EUR"
assert s["economics"]["real_discount_rate"] == 0.06 and s["site"]["bus_voltage_v"] == 48
assert [p["id"] for p in s["profiles"]] == ["lfp-test", "lead-test"], s["profiles"]
assert all(isinstance(p["strings_for_autonomy"], int) and p["strings_for_autonomy"] >= 1 for p in s["profiles"])
assert s["designs_listed"] == 2
PY

# An unknown design profile with two letters swapped gets its suggestion ('lpf' -> 'lfp').
expect_exit 2 -- "$STOWAGE" check "$SRC/tests/catalog-schema/bad-inputs/75-design-profile-letters-swapped/study.yaml" &&
  { grep -qF "did you mean 'lfp'?" "$WORK/err" || fail "no suggestion for 'lpf'"; }

# Rules across files are all reported too (issue 8, item 4): fixture 78 breaks six, and the
# JSON lists each with its field.
expect_exit 2 -- "$STOWAGE" check --format json "$SRC/tests/catalog-schema/bad-inputs/78-cross-file-study-problems/study.yaml" &&
  "$PY" - "$WORK/out" <<'PY' || fail "check --format json of rules across files"
import json, sys
d = json.load(open(sys.argv[1]))
assert d["valid"] is False and d["summary"] is None
assert [p["field"] for p in d["problems"]] == [
    "study.designs[0].profile", "study.designs[1].dod_setpoint",
    "study.design_space.max_strings_parallel", "study.design_space.max_mass_kg",
    "study.variations[0].path", "study.variations[1].high"], d["problems"]
PY

# A missing study file is one problem, in both forms.
expect_exit 2 -- "$STOWAGE" check --format json "$WORK/missing.yaml" &&
  "$PY" -c 'import json,sys; d=json.load(open(sys.argv[1])); assert len(d["problems"]) == 1 and d["problems"][0]["field"] == "study"' "$WORK/out" ||
  fail "missing study in JSON"

# evaluate and optimise show the loader's notes on stderr as check does (issue 8, item 4):
# an extra column in the hourly CSV is ignored with a note, not silently.
mkdir -p "$WORK/notes" && cp "$SRC"/tests/catalog-schema/fixtures/*.yaml "$WORK/notes/" &&
  "$PY" - "$SRC/tests/catalog-schema/fixtures/hourly.csv" "$WORK/notes/hourly.csv" <<'PY'
import sys
rows = open(sys.argv[1]).read().splitlines()
out = []
header_done = False
for r in rows:
    if r.startswith("#") or not r.strip():
        out.append(r)
    elif not header_done:
        out.append(r + ",logger_status"); header_done = True
    else:
        out.append(r + ",0")
open(sys.argv[2], "w").write("\n".join(out) + "\n")
PY
for cmd in evaluate optimise; do
  expect_exit 0 -- "$STOWAGE" $cmd "$WORK/notes/study.yaml" &&
    { grep -q 'logger_status' "$WORK/err" || fail "$cmd shows no note for the ignored column: $(head -c 300 "$WORK/err")"; }
done
finish
