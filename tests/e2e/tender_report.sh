#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `stowage tender --report`: the output set is complete and passes report_check.py --tender
# (well-formed self-contained HTML, the figure with data and labelled axes, every tagged number
# equal to tender.json, input hashes equal to Python's hashlib, Markdown with the same content,
# the safety cautions); tender.json is what `tender --format json` prints; reruns are
# byte-identical except the "Generated" line; a near tie is called out; a tender no bid meets
# still gets its report (exit 3); bad input writes nothing. Demo data is invented: only
# structure and identities are checked.
source "$(dirname "$0")/common.bash"
CHECK="$SRC/tests/e2e/report_check.py"
BUILD=$(cd "$(dirname "$STOWAGE")" && pwd)
demo="$SRC/studies/pier-nine-tender"
tender="$demo/tender.yaml"

expect_exit 0 -- "$STOWAGE" tender "$tender" --report "$WORK/r1" || { finish; }
for f in report.html report.md fig-bids.svg tender.json bids.csv designs.csv cash-flows.csv; do
  [ -s "$WORK/r1/$f" ] || fail "tender report: $f missing or empty"
done
"$PY" "$CHECK" "$WORK/r1" --tender || fail "report_check on the Pier Nine tender report"
grep -q "Recommended: Bid A" "$WORK/r1/report.md" || fail "decision does not lead with Bid A"
grep -q "Claims to question in clarification" "$WORK/r1/report.md" || fail "no claims to question"
grep -q "| Bid D | min\\\\_usable\\\\_kwh | 1,200 | 960 | 240 kWh | 4 |" "$WORK/r1/report.md" ||
  fail "Bid D's shortfall row missing"
# The report's tender.json is the JSON the command prints: the same result object.
expect_exit 0 -- "$STOWAGE" tender --format json "$tender" &&
  { cmp -s "$WORK/out" "$WORK/r1/tender.json" || fail "tender.json differs from --format json"; }
# With variations: the report gains the sampled section (its numbers tagged and checked against
# tender.json by report_check.py), the call names the samples' rule, and tender.json is again
# what --format json prints for the same samples.
varied="$demo/tender-variations.yaml"
expect_exit 0 -- "$STOWAGE" tender "$varied" --samples 24 --quiet --report "$WORK/rv" || fail "varied report run"
"$PY" "$CHECK" "$WORK/rv" --tender || fail "report_check on the report with variations"
grep -q "^## Uncertainty of the ranking" "$WORK/rv/report.md" || fail "no uncertainty section"
grep -qi "near tie from 24 samples of the tender's variations" "$WORK/rv/report.md" || fail "sampled call not named"
grep -q 'data-key="uncertainty.bids\[0\].npc.p10"' "$WORK/rv/report.html" || fail "sampled numbers not tagged"
[ -s "$WORK/rv/bid-uncertainty.csv" ] || fail "bid-uncertainty.csv missing from the report set"
expect_exit 0 -- "$STOWAGE" tender "$varied" --samples 24 --quiet --format json &&
  { cmp -s "$WORK/out" "$WORK/rv/tender.json" || fail "varied tender.json differs from --format json"; }

# The margins quoted in prose are the differences of the JSON's numbers, to the digits shown.
"$PY" - "$WORK/r1" <<'PY' || fail "runner-up margins differ from tender.json"
import json, re, sys
doc = json.load(open(sys.argv[1] + "/tender.json"))
md = open(sys.argv[1] + "/report.md").read()
ranked = sorted((b for b in doc["bids"] if b["rank"] is not None), key=lambda b: b["rank"])
best, second = ranked[0], ranked[1]
m = re.search(r"Runner-up: (.+?), ([\d.]+) points behind in total score, \+([\d,]+) EUR", md)
assert m and m.group(1) == second["label"], m
assert abs(float(m.group(2)) - (best["total_score"] - second["total_score"])) <= 0.05
assert abs(float(m.group(3).replace(",", "")) - (second["npc"] - best["npc"])) <= 0.5
PY

# The checker must catch a changed number (so it can fail).
cp -r "$WORK/r1" "$WORK/tampered"
sed -i 's/data-key="bids\[0\].npc" data-value="\([0-9]\)/data-key="bids[0].npc" data-value="9\1/' \
  "$WORK/tampered/report.html"
"$PY" "$CHECK" "$WORK/tampered" --tender >/dev/null 2>&1 && fail "report_check accepted a changed NPC"

# Reruns: identical except the Generated line; fully identical with SOURCE_DATE_EPOCH.
expect_exit 0 -- "$STOWAGE" tender "$tender" --report "$WORK/r2"
for f in $(cd "$WORK/r1" && ls); do
  cmp -s <(grep -v '^Generated ' "$WORK/r1/$f") <(grep -v '^Generated ' "$WORK/r2/$f") ||
    fail "rerun: $f differs beyond the Generated line"
done
grep -c '^Generated ' "$WORK/r1/report.html" | grep -qx 1 || fail "report.html: not one Generated line"
SOURCE_DATE_EPOCH=86400 "$STOWAGE" tender "$tender" --report "$WORK/e1" >/dev/null 2>&1
SOURCE_DATE_EPOCH=86400 "$STOWAGE" tender "$tender" --report "$WORK/e2" >/dev/null 2>&1
diff -r "$WORK/e1" "$WORK/e2" >/dev/null || fail "SOURCE_DATE_EPOCH: the report sets differ"

# --out and --report naming one directory: refused before any work, as for optimise.
expect_exit 2 -- "$STOWAGE" tender "$tender" --out "$WORK/same" --report "$WORK/same" &&
  { grep -q -- "--out and --report name the same directory" "$WORK/err" || fail "same --out and --report"; }
# --report beside --out: both sets written.
expect_exit 0 -- "$STOWAGE" tender "$tender" --out "$WORK/o1" --report "$WORK/o2" &&
  { [ -s "$WORK/o1/bids.csv" ] && [ -s "$WORK/o2/report.html" ] || fail "--out with --report"; }

# A near tie by the tender's own margin: called out in the decision.
sed -e 's/price_weight: 0.7 /price_weight: 0.7\n    near_tie_points: 20/' \
  -e "s|site: site.yaml|site: $demo/site.yaml|" -e "s|- offer-|- $demo/offer-|" "$tender" \
  >"$WORK/near-tie.yaml"
expect_exit 0 -- "$STOWAGE" tender "$WORK/near-tie.yaml" --report "$WORK/n1" && {
  grep -q '"near_tie":true' "$WORK/n1/tender.json" || fail "near-tie variant is not a near tie"
  grep -q '^<p>Near tie: the two best bids lie within 20 points' \
    "$WORK/n1/report.html" || fail "near tie not called out in the report"
  "$PY" "$CHECK" "$WORK/n1" --tender || fail "report_check on the near-tie report"
}
grep -q 'Near tie' "$WORK/r1/report.html" && fail "near tie called out without one"

# No bid meets the requirements: the report says so, exit 3.
sed -e 's/min_usable_kwh: 1200 .*/min_usable_kwh: 99999/' -e "s|site: site.yaml|site: $demo/site.yaml|" \
  -e "s|- offer-|- $demo/offer-|" "$tender" >"$WORK/unmeetable.yaml"
expect_exit 3 -- "$STOWAGE" tender "$WORK/unmeetable.yaml" --report "$WORK/u1" && {
  grep -q "No bid meets the tender's requirements" "$WORK/u1/report.md" || fail "no-bid decision"
  "$PY" "$CHECK" "$WORK/u1" --tender || fail "report_check on the no-compliant-bid report"
}

# Bad input: an --report that is a file, a missing tender; nothing written.
touch "$WORK/occupied"
expect_exit 2 -- "$STOWAGE" tender "$tender" --report "$WORK/occupied" || true
expect_exit 2 -- "$STOWAGE" tender "$tender" --report "" &&
  { grep -q -- "--report" "$WORK/err" || fail "an empty --report is not refused under its own name"; }
expect_exit 2 -- "$STOWAGE" tender "$WORK/missing.yaml" --report "$WORK/m1" &&
  grep -q "missing.yaml" "$WORK/err" || fail "missing tender named"
[ -e "$WORK/m1" ] && [ -n "$(ls -A "$WORK/m1")" ] && fail "files written for a missing tender"

# Headless Chromium renders it without console messages; a screenshot is kept for people.
CHROMIUM=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$CHROMIUM" ]; then
  echo "SKIP: chromium is not installed here (.ci/setup installs it); browser checks not run"
else
  chrome() { timeout 120 "$CHROMIUM" --headless --no-sandbox --disable-gpu --hide-scrollbars \
    --no-first-run --user-data-dir="$WORK/chrome-profile" "$@"; }
  chrome --enable-logging=stderr --v=0 --dump-dom "file://$WORK/r1/report.html" >"$WORK/dom.html" 2>"$WORK/chrome.log"
  grep -q 'CONSOLE' "$WORK/chrome.log" && { fail "console messages:"; grep CONSOLE "$WORK/chrome.log" >&2; }
  grep -q 'fig-bids' "$WORK/dom.html" || fail "chromium did not render the tender report"
  chrome --window-size=1000,1400 --screenshot="$BUILD/tender-report-screenshot.png" \
    "file://$WORK/r1/report.html" >/dev/null 2>&1
  [ -s "$BUILD/tender-report-screenshot.png" ] || fail "no screenshot of the tender report"
fi
finish
