#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `stowage report` and `optimise --report`: the output set is complete and checked by
# report_check.py (well-formed self-contained HTML, figures with data and labelled axes,
# numbers equal to result.json, input hashes equal to Python's hashlib, Markdown with the same
# content); reruns are byte-identical except the "Generated" line; headless Chromium renders it
# without console messages and prints it to PDF on Letter and A4, keeping a PNG screenshot
# under the build folder. Demo data is invented: only structure and identities are checked.
source "$(dirname "$0")/common.bash"
CHECK="$SRC/tests/e2e/report_check.py"
BUILD=$(cd "$(dirname "$STOWAGE")" && pwd)
study="$SRC/studies/sandglass-mast/study.yaml"

expect_exit 0 -- "$STOWAGE" report "$study" --out "$WORK/r1" || { finish; }
for f in report.html report.md result.json designs.csv cash-flows.csv \
  recommended-first-year.csv fig-breakdown.svg fig-soc.svg fig-rainflow.svg fig-life.svg \
  fig-cycle-life.svg fig-temperature.svg tornado.json tornado.csv fig-tornado.svg; do
  [ -s "$WORK/r1/$f" ] || fail "report: $f missing or empty"
done
"$PY" "$CHECK" "$WORK/r1" || fail "report_check on the sandglass report"
# Every profile value is echoed with its confidence label, as the profile file gives it, and the
# decision says whether a low-confidence input of the winner could cost it its lead.
"$PY" - "$WORK/r1" "$SRC/catalog-schema/profiles/sodium-ion.yaml" <<'PY' || fail "report: confidence labels"
import json, re, sys
md = open(sys.argv[1] + "/report.md").read()
prof = open(sys.argv[2]).read()
label = re.search(r"^    costs\.capital_per_kwh: (\S+)", prof.split("confidence:")[1], re.M).group(1)
row = [l for l in md.splitlines() if l.startswith("| costs.capital\\_per\\_kwh | 300 |")]
assert row and row[0].rstrip(" |").endswith(label), (row, label)
assert "| field | value | unit | source | confidence |" in md
lc = json.load(open(sys.argv[1] + "/result.json"))["low_confidence"]
assert ("CAUTION: the lead of" in md) == lc["exceeds_margin"], lc["exceeds_margin"]
PY

# The checker itself must catch a wrong number and a broken tag (so it can fail).
cp -r "$WORK/r1" "$WORK/tampered"
sed -i 's/data-key="best.npc" data-value="\([0-9]\)/data-key="best.npc" data-value="9\1/' \
  "$WORK/tampered/report.html"
"$PY" "$CHECK" "$WORK/tampered" >/dev/null 2>&1 && fail "report_check accepted a changed NPC"
cp "$WORK/r1/report.html" "$WORK/tampered/report.html"
sed -i '0,/<\/caption>/s/<\/caption>//' "$WORK/tampered/report.html"
"$PY" "$CHECK" "$WORK/tampered" >/dev/null 2>&1 && fail "report_check accepted malformed HTML"

# Reruns: identical except the Generated line (result.json also differs in solve_seconds).
expect_exit 0 -- "$STOWAGE" report "$study" --out "$WORK/r2"
for f in $(cd "$WORK/r1" && ls); do
  case "$f" in
    result.json)
      "$PY" - "$WORK/r1/$f" "$WORK/r2/$f" <<'PY' || fail "rerun: result.json differs beyond solve_seconds"
import json, sys
a, b = (json.load(open(p)) for p in sys.argv[1:])
a.pop("solve_seconds"); b.pop("solve_seconds")
assert a == b
PY
      ;;
    *)
      cmp -s <(grep -v '^Generated ' "$WORK/r1/$f") <(grep -v '^Generated ' "$WORK/r2/$f") ||
        fail "rerun: $f differs beyond the Generated line"
      ;;
  esac
done
grep -c '^Generated ' "$WORK/r1/report.html" | grep -qx 1 || fail "report.html: not one Generated line"
# With SOURCE_DATE_EPOCH the time stamp is fixed too, so the whole file is the same.
SOURCE_DATE_EPOCH=86400 "$STOWAGE" report "$study" --out "$WORK/e1" >/dev/null 2>&1
SOURCE_DATE_EPOCH=86400 "$STOWAGE" report "$study" --out "$WORK/e2" >/dev/null 2>&1
cmp -s "$WORK/e1/report.html" "$WORK/e2/report.html" || fail "SOURCE_DATE_EPOCH: report.html differs"
grep -q '^Generated 1970-01-02T00:00:00Z by stowage' "$WORK/e1/report.md" ||
  fail "SOURCE_DATE_EPOCH=86400 is not 1970-01-02T00:00:00Z"

# optimise --report writes the same report as `report`.
expect_exit 0 -- "$STOWAGE" optimise "$study" --report "$WORK/o1"
cmp -s <(grep -v '^Generated ' "$WORK/r1/report.html") <(grep -v '^Generated ' "$WORK/o1/report.html") ||
  fail "optimise --report differs from report"

# A second study with back-up energy and more profiles.
expect_exit 0 -- "$STOWAGE" report "$SRC/studies/tarnbeck-saddle/study.yaml" --out "$WORK/t1" &&
  { "$PY" "$CHECK" "$WORK/t1" || fail "report_check on the tarnbeck report"; }

# No feasible design: the report says why, and the exit code is 3.
sed -e "s|site: site.yaml|site: $SRC/studies/sandglass-mast/site.yaml|" \
  -e "s|\.\./\.\./catalog-schema|$SRC/catalog-schema|" \
  -e "s|max_strings_parallel: 20.*|max_strings_parallel: 20\n    budget: 10|" "$study" >"$WORK/poor.yaml"
expect_exit 3 -- "$STOWAGE" report "$WORK/poor.yaml" --out "$WORK/p1" && {
  "$PY" "$CHECK" "$WORK/p1" --infeasible || fail "report_check on the infeasible report"
  grep -q "budget" "$WORK/p1/report.md" || fail "infeasible report does not name the budget"
}

# Bad input: no --out, an --out that is a file; nothing written.
expect_exit 2 -- "$STOWAGE" report "$study" || true
touch "$WORK/occupied"
expect_exit 2 -- "$STOWAGE" report "$study" --out "$WORK/occupied" || true
expect_exit 2 -- "$STOWAGE" report "$WORK/missing.yaml" --out "$WORK/m1" &&
  grep -q "missing.yaml" "$WORK/err" || fail "missing study named"
[ -e "$WORK/m1" ] && [ -n "$(ls -A "$WORK/m1")" ] && fail "files written for a missing study"

# Headless Chromium: render, no console messages, print to PDF on Letter and A4.
CHROMIUM=$(command -v chromium || command -v chromium-browser || true)
if [ -z "$CHROMIUM" ]; then
  echo "SKIP: chromium is not installed here (.ci/setup installs it); browser checks not run"
else
  chrome() { timeout 120 "$CHROMIUM" --headless --no-sandbox --disable-gpu --hide-scrollbars \
    --no-first-run --user-data-dir="$WORK/chrome-profile" "$@"; }
  # The console check must see a console message when there is one.
  printf '<html><body><script>console.error("planted")</script></body></html>' >"$WORK/planted.html"
  chrome --enable-logging=stderr --v=0 --dump-dom "file://$WORK/planted.html" >/dev/null 2>"$WORK/planted.log"
  grep -q 'CONSOLE.*planted' "$WORK/planted.log" || fail "chromium console capture does not work"
  chrome --enable-logging=stderr --v=0 --dump-dom "file://$WORK/r1/report.html" >"$WORK/dom.html" 2>"$WORK/chrome.log"
  grep -q 'CONSOLE' "$WORK/chrome.log" && { fail "console messages:"; grep CONSOLE "$WORK/chrome.log" >&2; }
  grep -q 'fig-temperature' "$WORK/dom.html" || fail "chromium did not render the report"
  chrome --window-size=1000,1400 --screenshot="$BUILD/report-screenshot.png" \
    "file://$WORK/r1/report.html" >/dev/null 2>&1
  [ -s "$BUILD/report-screenshot.png" ] || fail "no screenshot"
  head -c 8 "$BUILD/report-screenshot.png" | od -An -c | grep -q 'P   N   G' || fail "screenshot is not a PNG"
  # Letter: the browser's default paper; A4: the same page with the paper named in @page.
  chrome --no-pdf-header-footer --print-to-pdf="$WORK/letter.pdf" "file://$WORK/r1/report.html" >/dev/null 2>&1
  sed 's/@page { margin/@page { size: A4; margin/' "$WORK/r1/report.html" >"$WORK/r1-a4.html"
  chrome --no-pdf-header-footer --print-to-pdf="$WORK/a4.pdf" "file://$WORK/r1-a4.html" >/dev/null 2>&1
  "$PY" - "$WORK/letter.pdf" "$WORK/a4.pdf" "$BUILD" <<'PY' || fail "PDF output"
import re, shutil, sys
# Page sizes in points: Letter 612 x 792, A4 595.28 x 841.89 (ISO 216).
for path, (w, h) in zip(sys.argv[1:3], [(612, 792), (595.28, 841.89)]):
    data = open(path, "rb").read()
    assert data.startswith(b"%PDF-"), path
    boxes = re.findall(rb"/MediaBox\s*\[\s*0 0 ([\d.]+) ([\d.]+)\s*\]", data)
    assert len(boxes) >= 3, f"{path}: {len(boxes)} pages"
    for bw, bh in boxes:
        assert abs(float(bw) - w) < 1 and abs(float(bh) - h) < 1, (path, bw, bh)
    shutil.copy(path, sys.argv[3] + "/report-" + path.rsplit("/", 1)[1])
PY
fi
finish
