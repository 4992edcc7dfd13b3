#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `stowage cycles` on the ASTM E1049-85 clause 5.4.4 example, written as SOC: the history
# -2, 1, -3, 5, -1, 3, -4, 4, -2 mapped to SOC = (x + 5) / 10. Expected ranges /10 with counts
# 0.3 -> 0.5, 0.4 -> 1.5, 0.6 -> 0.5, 0.8 -> 1.0, 0.9 -> 0.5 (check-values.md 1.1, READ-3P),
# so equivalent full cycles = sum count x depth = 2.3.
source "$(dirname "$0")/common.bash"
"$PY" - "$WORK/soc.csv" "$WORK/soc_pct.csv" <<'PY'
import sys
history = [-2, 1, -3, 5, -1, 3, -4, 4, -2]
with open(sys.argv[1], "w") as f:
    f.write("# ASTM E1049-85 example as SOC\ntime,soc\n")
    for i, x in enumerate(history):
        f.write(f"{i},{(x + 5) / 10:g}\n")
with open(sys.argv[2], "w") as f:
    f.write("soc_pct\n")
    for x in history:
        f.write(f"{(x + 5) * 10:g}\n")
PY
check_json='
import json, math, sys
doc = json.load(open(sys.argv[1]))
by_depth = {}
for c in doc["cycles"]:
    k = round(c["depth"], 9)
    by_depth[k] = by_depth.get(k, 0) + c["count"]
want = {0.3: 0.5, 0.4: 1.5, 0.6: 0.5, 0.8: 1.0, 0.9: 0.5}
assert by_depth == want, by_depth
assert math.isclose(doc["equivalent_full_cycles"], 2.3, rel_tol=1e-9), doc["equivalent_full_cycles"]
if len(sys.argv) > 2:
    # Damage by Miner with N = 1000 D^-2 (the fixture profile, an exact power law):
    # sum count x D^2 / 1000.
    want_damage = sum(n * d * d / 1000.0 for d, n in want.items())
    assert math.isclose(doc["damage"], want_damage, rel_tol=1e-9), (doc["damage"], want_damage)
'
expect_exit 0 -- "$STOWAGE" cycles --format json "$WORK/soc.csv" && "$PY" -c "$check_json" "$WORK/out" || fail "fraction series"
expect_exit 0 -- "$STOWAGE" cycles --format json "$WORK/soc_pct.csv" && "$PY" -c "$check_json" "$WORK/out" || fail "percent series"
profile="$SRC/tests/e2e/fixtures/power-law-profile.yaml"
expect_exit 0 -- "$STOWAGE" cycles --format json --profile "$profile" "$WORK/soc.csv" && "$PY" -c "$check_json" "$WORK/out" damage || fail "damage with a profile"
expect_exit 0 -- "$STOWAGE" cycles --profile "$profile" "$WORK/soc.csv" && grep -q "Equivalent full cycles: 2.30" "$WORK/out" || fail "text report"
# The time column sets the spacing: the same history logged every 15 minutes (ISO 8601 times)
# is 0.25 h a sample, so its calendar damage is a quarter of the hourly log's (duty_damage:
# calendar damage is proportional to the logged hours), and the cycle damage is the same.
"$PY" - "$WORK/soc15.csv" <<'PY'
import sys
history = [-2, 1, -3, 5, -1, 3, -4, 4, -2]
with open(sys.argv[1], "w") as f:
    f.write("time,soc\n")
    for i, x in enumerate(history):
        f.write(f"2026-03-01T{i * 15 // 60:02d}:{i * 15 % 60:02d},{(x + 5) / 10:g}\n")
PY
expect_exit 0 -- "$STOWAGE" cycles --format json --profile "$profile" "$WORK/soc.csv" && cp "$WORK/out" "$WORK/hourly.json" || fail "hourly log"
expect_exit 0 -- "$STOWAGE" cycles --format json --profile "$profile" "$WORK/soc15.csv" && "$PY" - "$WORK/hourly.json" "$WORK/out" <<'PY' || fail "15-minute log uses its time column"
import json, math, sys
hourly, quarter = (json.load(open(p)) for p in sys.argv[1:3])
assert hourly["hours_per_sample"] == 1, hourly["hours_per_sample"]
assert math.isclose(quarter["hours_per_sample"], 0.25, rel_tol=1e-9), quarter["hours_per_sample"]
assert math.isclose(quarter["damage"], hourly["damage"], rel_tol=1e-12)
assert math.isclose(quarter["calendar_damage"], hourly["calendar_damage"] / 4, rel_tol=1e-9)
PY
expect_exit 0 -- "$STOWAGE" cycles "$WORK/soc15.csv" && grep -q "9 samples, 0.25 h apart" "$WORK/out" || fail "15-minute text report"
# Times that go back are bad input at their line and column.
printf 'time,soc\n0,0.5\n2,0.6\n1,0.7\n' >"$WORK/back.csv"
expect_exit 2 -- "$STOWAGE" cycles "$WORK/back.csv" && grep -q "back.csv:4:1: time: times must increase" "$WORK/err" || fail "decreasing time"
# --study counts the log the study names (study.soc_log) and, with --profile ID, ages it
# against that profile of the study: the same numbers as the log and profile file given
# directly (the ASTM example above, Miner's rule against the power-law profile).
FIXS="$SRC/tests/catalog-schema/fixtures"
cat >"$WORK/logged.yaml" <<EOF
study:
  title: Logged bank
  site: $FIXS/site.yaml
  profiles:
    - $FIXS/lfp-test.yaml
    - $profile
  soc_log: soc.csv
  economics: {project_years: 20, real_discount_rate: 0.06, currency: EUR}
EOF
expect_exit 0 -- "$STOWAGE" cycles --format json --study "$WORK/logged.yaml" && "$PY" -c "$check_json" "$WORK/out" || fail "--study count"
expect_exit 0 -- "$STOWAGE" cycles --format json --study "$WORK/logged.yaml" --profile power-law-test &&
  "$PY" -c "$check_json" "$WORK/out" damage && cmp -s "$WORK/out" "$WORK/hourly.json" ||
  fail "--study with --profile ID differs from the files given directly"
expect_exit 0 -- "$STOWAGE" cycles --study "$WORK/logged.yaml" && grep -qF "cycle count of $WORK/soc.csv" "$WORK/out" || fail "--study text names the log"
# An id not in the study is refused with the ids and a suggestion; a study without a log is
# refused at its study key; a file and --study together are refused.
expect_exit 2 -- "$STOWAGE" cycles --study "$WORK/logged.yaml" --profile power-law-tset &&
  { grep -qF "did you mean 'power-law-test'?" "$WORK/err" || fail "--study with an unknown profile id"; }
grep -v soc_log "$WORK/logged.yaml" >"$WORK/unlogged.yaml"
expect_exit 2 -- "$STOWAGE" cycles --study "$WORK/unlogged.yaml" &&
  { grep -qF "unlogged.yaml:1:1: study.soc_log: the study names no SOC log" "$WORK/err" || fail "--study without soc_log: $(cat "$WORK/err")"; }
expect_exit 2 -- "$STOWAGE" cycles --study "$WORK/logged.yaml" "$WORK/soc.csv" || fail "file and --study together"
expect_exit 2 -- "$STOWAGE" cycles || fail "neither a file nor --study"
# A series with a value out of range is bad input naming the file and line.
printf 'soc\n0.5\n1.7\n' >"$WORK/bad.csv"
expect_exit 2 -- "$STOWAGE" cycles "$WORK/bad.csv" && grep -q "bad.csv:3" "$WORK/err" || fail "out-of-range SOC"
finish
