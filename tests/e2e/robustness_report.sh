#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `sweep`, `sweep --grid`, `uncertainty` and `breakeven` with --report DIR on the two-profile
# robustness fixture: each output set is complete and passes report_check.py --kind (well-formed
# self-contained HTML, every figure with data and labelled axes, every tagged number equal to the
# command's JSON, input hashes equal to Python's hashlib, Markdown with the same content, the
# safety cautions); the JSON in the set is what --format json prints; reruns are byte-identical
# except the "Generated" line; the figures show the run's numbers (win-probability labels, the
# winner map's letters, the break-even line) and the winners on each side of the break-even
# agree with the JSON's own scan; bad input writes nothing. The fixture's data are invented:
# only structure and identities are checked, never a value of the invented data.
source "$(dirname "$0")/common.bash"
CHECK="$SRC/tests/e2e/report_check.py"
BUILD=$(cd "$(dirname "$STOWAGE")" && pwd)
fixture="$SRC/tests/e2e/fixtures/robust-study.yaml"
price=profiles.sodium-ion.costs.capital_per_kwh
rate=economics.real_discount_rate

# run NAME JSON ARGS...: the command with --report $WORK/NAME, its report checked, its JSON
# compared with --format json of the same command.
run() {
  local name=$1 kind=$2 json=$3
  shift 3
  expect_exit 0 -- "$STOWAGE" "$@" --quiet --report "$WORK/$name" "$fixture" || return 1
  "$PY" "$CHECK" "$WORK/$name" --kind "$kind" || fail "report_check on the $name report"
  expect_exit 0 -- "$STOWAGE" "$@" --quiet --format json "$fixture" &&
    { cmp -s "$WORK/out" "$WORK/$name/$json" || fail "$name: $json differs from --format json"; }
  head -n 40 "$WORK/$name/report.md" | grep -q '^## Decision$' || fail "$name: the decision is not first"
  [ "$(grep -m1 '^## ' "$WORK/$name/report.md")" = "## Decision" ] || fail "$name: first section is not the decision"
}

run tornado sweep sweep.json sweep
for f in report.html report.md fig-tornado.svg sweep.json tornado.csv; do
  [ -s "$WORK/tornado/$f" ] || fail "sweep report: $f missing or empty"
done
grep -q '^## Sensitivity of the recommendation' "$WORK/tornado/report.md" || fail "no sensitivity section"

run grid1 grid sweep.json sweep --grid "$price" --steps 4
for f in report.html report.md fig-sweep.svg sweep.json grid.csv; do
  [ -s "$WORK/grid1/$f" ] || fail "1-D grid report: $f missing or empty"
done

run grid2 grid sweep.json sweep --grid "$price,$rate" --steps 3
for f in report.html report.md fig-winner-map.svg sweep.json grid.csv; do
  [ -s "$WORK/grid2/$f" ] || fail "2-D grid report: $f missing or empty"
done
# The winner map carries each point's winner as its letter (A, B in study profile order), row by
# row from the top in the first input's order, and the report's map table says the same.
"$PY" - "$WORK/grid2" <<'PY' || fail "winner map letters differ from sweep.json"
import json, sys, xml.etree.ElementTree as ET
d = sys.argv[1]
doc = json.load(open(d + "/sweep.json"))
svg = ET.parse(d + "/fig-winner-map.svg").getroot()
S = "{http://www.w3.org/2000/svg}"
cells = [t.text for g in svg.iter(S + "g") if g.get("data-series") == "winners" for t in g.iter(S + "text")]
key = {}
for t in svg.iter(S + "text"):
    if t.get("class") == "legend-text" and " = " in (t.text or "") and not t.text.startswith("-"):
        letter, name = t.text.split(" = ", 1)
        key[name] = letter
want = [key[p["winner"]] if p["winner"] else "-" for p in doc["points"]]
assert cells == want, (cells, want)
assert len(set(want)) >= 1 and len(want) == 9, want
md = open(d + "/report.md").read()
for row, first in zip(range(3), doc["axes"][0]["values"]):
    letters = want[3 * row:3 * row + 3]
    rows = [[c.strip() for c in l.strip().strip("|").split("|")] for l in md.splitlines()
            if l.startswith("| ")]
    row_cells = next(r for r in rows if r[0] == f"{first:g}" and len(r) == 4)
    assert row_cells[1:] == letters, (row_cells, letters)
PY

run uncertainty uncertainty uncertainty.json uncertainty --samples 40 --seed 3 --threads 2
for f in report.html report.md fig-npc-spread.svg fig-npc-ecdf.svg fig-lcos-spread.svg fig-win-probability.svg \
  uncertainty.json summary.csv samples.csv; do
  [ -s "$WORK/uncertainty/$f" ] || fail "uncertainty report: $f missing or empty"
done
# The win probabilities are the share of samples.csv's winners (a recount from the samples,
# independent of the summary), and the chart's value labels are those of the JSON.
"$PY" - "$WORK/uncertainty" <<'PY' || fail "win probabilities: samples, JSON and chart disagree"
import csv, json, math, sys, xml.etree.ElementTree as ET
d = sys.argv[1]
doc = json.load(open(d + "/uncertainty.json"))
rows = list(csv.DictReader(open(d + "/samples.csv")))
assert len(rows) == doc["samples"] == 40
S = "{http://www.w3.org/2000/svg}"
svg = ET.parse(d + "/fig-win-probability.svg").getroot()
labels = [t.text for t in svg.iter(S + "text") if t.get("class") == "value-label"]
for p, label in zip(doc["profiles"], labels):
    share = sum(r["winner"] == p["profile"] for r in rows) / len(rows)
    assert abs(share - p["win_probability"]) < 1e-12, (p["profile"], share)
    # Binomial standard error sqrt(p(1-p)/N) (closed form, common practice).
    assert abs(math.sqrt(share * (1 - share) / len(rows)) - p["win_probability_se"]) < 1e-12
    assert label == f"{100 * p['win_probability']:.1f} %", (label, p)
assert len(labels) == len(doc["profiles"])
# The spread chart's boxes run from each profile's P10 to its P90: their tooltips quote them.
svg = ET.parse(d + "/fig-npc-spread.svg").getroot()
tips = [t.text for t in svg.iter(S + "title") if t.text and ": P10 " in t.text]
for p, tip in zip(doc["profiles"], tips):
    assert tip == f"{p['profile']}: P10 {p['npc']['p10']:,.0f} EUR, P90 {p['npc']['p90']:,.0f} EUR", tip
assert len(tips) == len(doc["profiles"])
# The NPC distribution has one step line per profile, two vertices per sample with its design.
svg = ET.parse(d + "/fig-npc-ecdf.svg").getroot()
for p in doc["profiles"]:
    g = next(g for g in svg.iter(S + "g") if g.get("data-series") == p["profile"])
    path = next(g.iter(S + "path")).get("d")
    n = sum(r["npc_" + p["profile"]] != "" for r in rows)
    assert path.count("L") + 1 == 2 * n == 2 * p["samples"], (p["profile"], path.count("L"), n)
PY
# A changed percentage must be caught (so the check can fail).
cp -r "$WORK/uncertainty" "$WORK/tampered"
sed -i 's/\(data-key="profiles\[0\].win_probability" data-value="[^"]*">\)[0-9.]* %/\199.9 %/' \
  "$WORK/tampered/report.html"
grep -q 'win_probability" data-value="[^"]*">99.9 %' "$WORK/tampered/report.html" || fail "tampering did not apply"
"$PY" "$CHECK" "$WORK/tampered" --kind uncertainty >/dev/null 2>&1 && fail "report_check accepted a changed win probability"

run breakeven breakeven breakeven.json breakeven --vary "$price"
for f in report.html report.md fig-breakeven.svg breakeven.json probes.csv; do
  [ -s "$WORK/breakeven/$f" ] || fail "break-even report: $f missing or empty"
done
# The winner on each side, as the report states it, is the cheaper one at the range's ends by the
# JSON's own scan (gap < 0: the profile is cheaper), and the chart marks the break-even value.
"$PY" - "$WORK/breakeven" <<'PY' || fail "break-even sides or line differ from breakeven.json"
import json, re, sys
d = sys.argv[1]
doc = json.load(open(d + "/breakeven.json"))
assert doc["crossing"], "the fixture's range should hold a crossing"
def cheaper(probe):
    return doc["profile"] if probe["gap"] < 0 else probe["rival"]
md = open(d + "/report.md").read()
below = re.search(r"\| cheaper below the break-even \| (\S+) \|", md).group(1)
above = re.search(r"\| cheaper above the break-even \| (\S+) \|", md).group(1)
assert below == cheaper(doc["scan"][0]) and above == cheaper(doc["scan"][-1]), (below, above)
assert below != above
assert doc["bracket_low"] <= doc["value"] <= doc["bracket_high"]
svg = open(d + "/fig-breakeven.svg").read()
assert f"break-even {doc['value']:.7g} EUR/kWh" in svg, "no break-even line label"
PY
expect_exit 0 -- "$STOWAGE" breakeven --vary "$price" --between 200 250 --hold-designs --quiet --report "$WORK/nocross" "$fixture" && {
  "$PY" "$CHECK" "$WORK/nocross" --kind breakeven || fail "report_check on the no-crossing report"
  grep -q "^No crossing between 200 EUR/kWh and 250 EUR/kWh" "$WORK/nocross/report.md" || fail "no-crossing decision"
  grep -q 'class="reference"' "$WORK/nocross/fig-breakeven.svg" && fail "a break-even line without a crossing"
}

# No design within the budget: the reports say so and still pass the checks (sweep exits 3 as
# without --report); a break-even without a runner-up is refused and writes nothing.
sed -e "s|\.\./\.\./\.\./|$SRC/|" -e "s|max_strings_parallel: 30|max_strings_parallel: 30\n    budget: 10|" \
  "$fixture" >"$WORK/poor.yaml"
expect_exit 3 -- "$STOWAGE" sweep --quiet --report "$WORK/p1" "$WORK/poor.yaml" && {
  "$PY" "$CHECK" "$WORK/p1" --kind sweep || fail "report_check on the infeasible sweep report"
  grep -q "^No design meets the study's requirements in the base case" "$WORK/p1/report.md" ||
    fail "infeasible sweep decision"
}
expect_exit 3 -- "$STOWAGE" sweep --grid "$price" --steps 3 --quiet --report "$WORK/p2" "$WORK/poor.yaml" &&
  { "$PY" "$CHECK" "$WORK/p2" --kind grid || fail "report_check on the infeasible grid report"; }
# Sharded, the same: each shard exits 0 once its part is written, the merge exits 3 and its
# report equals the unsharded one but for the Generated line.
for i in 1 2; do
  expect_exit 0 -- "$STOWAGE" sweep --grid "$price" --steps 3 --quiet --shard "$i/2" "$WORK/poor.yaml" &&
    cp "$WORK/out" "$WORK/poor-part$i.txt" || fail "infeasible sweep shard $i"
done
expect_exit 3 -- "$STOWAGE" merge --report "$WORK/p2m" "$WORK/poor-part2.txt" "$WORK/poor-part1.txt" || fail "merge of infeasible sweep parts"
diff <(grep -v Generated "$WORK/p2/report.md") <(grep -v Generated "$WORK/p2m/report.md") >/dev/null || fail "merged infeasible grid report differs"
expect_exit 0 -- "$STOWAGE" uncertainty --samples 8 --quiet --report "$WORK/p3" "$WORK/poor.yaml" && {
  "$PY" "$CHECK" "$WORK/p3" --kind uncertainty || fail "report_check on the infeasible uncertainty report"
  grep -q "^The base case has no design meeting" "$WORK/p3/report.md" || fail "infeasible uncertainty decision"
}
expect_exit 2 -- "$STOWAGE" breakeven --vary "$price" --quiet --report "$WORK/p4" "$WORK/poor.yaml" || true
[ -e "$WORK/p4" ] && [ -n "$(ls -A "$WORK/p4")" ] && fail "files written for a refused break-even"

# Reruns: identical except the Generated line; fully identical with SOURCE_DATE_EPOCH (held
# designs where only the bytes matter, to keep the test quick).
expect_exit 0 -- "$STOWAGE" uncertainty --samples 40 --seed 3 --threads 1 --quiet --report "$WORK/u2" "$fixture"
for f in $(cd "$WORK/uncertainty" && ls); do
  cmp -s <(grep -v '^Generated ' "$WORK/uncertainty/$f") <(grep -v '^Generated ' "$WORK/u2/$f") ||
    fail "rerun on 1 thread: $f differs beyond the Generated line"
done
for name in breakeven grid2; do
  grep -c '^Generated ' "$WORK/$name/report.html" | grep -qx 1 || fail "$name: not one Generated line"
done
SOURCE_DATE_EPOCH=86400 "$STOWAGE" breakeven --vary "$price" --hold-designs --quiet --report "$WORK/e1" "$fixture" >/dev/null 2>&1
SOURCE_DATE_EPOCH=86400 "$STOWAGE" breakeven --vary "$price" --hold-designs --quiet --report "$WORK/e2" "$fixture" >/dev/null 2>&1
diff -r "$WORK/e1" "$WORK/e2" >/dev/null || fail "SOURCE_DATE_EPOCH: the break-even sets differ"
SOURCE_DATE_EPOCH=86400 "$STOWAGE" sweep --quiet --report "$WORK/e3" "$fixture" >/dev/null 2>&1
SOURCE_DATE_EPOCH=86400 "$STOWAGE" sweep --quiet --threads 1 --report "$WORK/e4" "$fixture" >/dev/null 2>&1
diff -r "$WORK/e3" "$WORK/e4" >/dev/null || fail "SOURCE_DATE_EPOCH: the sweep sets differ"

# The shards of a run joined by merge --report give the unsharded run's report (only the
# Generated line differs): the same result object, the same document.
for i in 1 2 3; do
  "$STOWAGE" uncertainty --samples 40 --seed 3 --threads 1 --quiet --shard "$i/3" "$fixture" >"$WORK/part$i.txt" ||
    fail "shard $i"
done
expect_exit 0 -- "$STOWAGE" merge --report "$WORK/merged" "$WORK/part2.txt" "$WORK/part3.txt" "$WORK/part1.txt" && {
  for f in $(cd "$WORK/uncertainty" && ls); do
    cmp -s <(grep -v '^Generated ' "$WORK/uncertainty/$f") <(grep -v '^Generated ' "$WORK/merged/$f") ||
      fail "merge --report: $f differs from the unsharded report"
  done
  [ "$(ls "$WORK/merged" | wc -l)" = "$(ls "$WORK/uncertainty" | wc -l)" ] || fail "merge --report: other files"
}

# --report beside --out: both sets written, the JSON the same.
expect_exit 0 -- "$STOWAGE" breakeven --vary "$price" --hold-designs --quiet --out "$WORK/o1" --report "$WORK/o2" "$fixture" &&
  { cmp -s "$WORK/o1/breakeven.json" "$WORK/o2/breakeven.json" || fail "--out and --report JSON differ"; }

# Bad input: --report with --shard, an --report that is a file, an empty --report, a missing
# study; nothing written.
expect_exit 2 -- "$STOWAGE" uncertainty --samples 8 --shard 1/2 --report "$WORK/s1" "$fixture" &&
  { grep -q -- "--report" "$WORK/err" || fail "--shard with --report: not named"; }
[ -e "$WORK/s1" ] && fail "--shard with --report wrote a directory"
expect_exit 2 -- "$STOWAGE" sweep --quiet --out "$WORK/same" --report "$WORK/same/" "$fixture" &&
  { grep -q -- "--out and --report name the same directory" "$WORK/err" || fail "same --out and --report"; }
[ -e "$WORK/same" ] && fail "same --out and --report wrote a directory"
touch "$WORK/occupied"
expect_exit 2 -- "$STOWAGE" breakeven --vary "$price" --report "$WORK/occupied" "$fixture" || true
expect_exit 2 -- "$STOWAGE" sweep --report "" "$fixture" && { grep -q -- "--report" "$WORK/err" || fail "empty --report not named"; }
expect_exit 2 -- "$STOWAGE" uncertainty --samples 8 --report "$WORK/m1" "$WORK/missing.yaml" &&
  { grep -q "missing.yaml" "$WORK/err" || fail "missing study not named"; }
[ -e "$WORK/m1" ] && [ -n "$(ls -A "$WORK/m1")" ] && fail "files written for a missing study"

# Headless Chromium renders every report without console messages and prints one to PDF.
CHROMIUM=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$CHROMIUM" ]; then
  echo "SKIP: chromium is not installed here (.ci/setup installs it); browser checks not run"
else
  chrome() { timeout 120 "$CHROMIUM" --headless --no-sandbox --disable-gpu --hide-scrollbars \
    --no-first-run --user-data-dir="$WORK/chrome-profile" "$@"; }
  for name in tornado grid1 grid2 uncertainty breakeven; do
    chrome --enable-logging=stderr --v=0 --dump-dom "file://$WORK/$name/report.html" >"$WORK/dom.html" 2>"$WORK/chrome.log"
    grep -q 'CONSOLE' "$WORK/chrome.log" && { fail "$name: console messages:"; grep CONSOLE "$WORK/chrome.log" >&2; }
    grep -q '<section id="decision"' "$WORK/dom.html" || fail "chromium did not render the $name report"
  done
  chrome --window-size=1000,1400 --screenshot="$BUILD/uncertainty-report-screenshot.png" \
    "file://$WORK/uncertainty/report.html" >/dev/null 2>&1
  [ -s "$BUILD/uncertainty-report-screenshot.png" ] || fail "no screenshot of the uncertainty report"
  chrome --no-pdf-header-footer --print-to-pdf="$WORK/breakeven.pdf" "file://$WORK/breakeven/report.html" >/dev/null 2>&1
  "$PY" - "$WORK/breakeven.pdf" <<'PY' || fail "break-even report: PDF output"
import re, sys
data = open(sys.argv[1], "rb").read()
assert data.startswith(b"%PDF-")
# Letter, 612 x 792 points: the browser's default paper.
boxes = re.findall(rb"/MediaBox\s*\[\s*0 0 ([\d.]+) ([\d.]+)\s*\]", data)
assert len(boxes) >= 2 and all(abs(float(w) - 612) < 1 and abs(float(h) - 792) < 1 for w, h in boxes), boxes
PY
fi
finish
