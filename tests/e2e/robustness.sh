#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `stowage sweep`, `breakeven` and `uncertainty` on a two-profile fixture: tornado ends against
# direct runs of the changed study, a break-even against the closed-form crossing of two
# straight lines, determinism across thread counts and shards, progress, output sets and bad
# input.
source "$(dirname "$0")/common.bash"
fixture="$SRC/tests/e2e/fixtures/robust-study.yaml"
price=profiles.sodium-ion.costs.capital_per_kwh

# The fixture with its paths made absolute, so changed copies can live in $WORK.
study_copy() {  # study_copy OUT [sed expressions...]
  local out=$1
  shift
  sed -e "s|\.\./\.\./\.\./|$SRC/|" "$@" "$fixture" >"$out"
}

# 1. Tornado with held designs: every end equals `evaluate` of the study changed by hand with
#    the base case's designs fixed (the definition of a held point, optimiser/analysis/scenario.h).
expect_exit 0 -- "$STOWAGE" sweep --hold-designs --format json --threads 2 "$fixture" || fail "held tornado"
cp "$WORK/out" "$WORK/held.json"
designs=$($PY - "$WORK/held.json" <<'PY'
import json, sys
doc = json.load(open(sys.argv[1]))
for d in doc["base"]["designs"]:
    print(f'    - {{profile: {d["profile"]}, dod_setpoint: {d["dod_setpoint"]}, strings_parallel: {d["strings_parallel"]}}}')
PY
)
with_designs() {  # with_designs IN OUT: adds the held designs to a study copy
  $PY - "$1" "$2" "$designs" <<'PY'
import sys
text = open(sys.argv[1]).read()
text = text.replace("  design_space:\n", "  designs:\n" + sys.argv[3] + "\n  design_space:\n", 1)
open(sys.argv[2], "w").write(text)
PY
}
# Discount rate at its low end (the study file holds it).
study_copy "$WORK/rate.yaml" -e 's/real_discount_rate: 0.06/real_discount_rate: 0.03/'
with_designs "$WORK/rate.yaml" "$WORK/rate-held.yaml"
# Sodium-ion capital price at its high end (its profile file holds it).
sed 's/capital_per_kwh: 300/capital_per_kwh: 380/' "$SRC/catalog-schema/profiles/sodium-ion.yaml" >"$WORK/sodium-380.yaml"
grep -q "capital_per_kwh: 380" "$WORK/sodium-380.yaml" || fail "price edit of the profile copy"
study_copy "$WORK/price.yaml" -e "s|- .*catalog-schema/profiles/sodium-ion.yaml|- $WORK/sodium-380.yaml|"
grep -q "$WORK/sodium-380.yaml" "$WORK/price.yaml" || fail "price study copy"
with_designs "$WORK/price.yaml" "$WORK/price-held.yaml"
expect_exit 0 -- "$STOWAGE" evaluate --format json "$WORK/rate-held.yaml" && cp "$WORK/out" "$WORK/rate-eval.json" || fail "evaluate rate"
expect_exit 0 -- "$STOWAGE" evaluate --format json "$WORK/price-held.yaml" && cp "$WORK/out" "$WORK/price-eval.json" || fail "evaluate price"
$PY - "$WORK/held.json" "$WORK/rate-eval.json" "$WORK/price-eval.json" "$price" <<'PY' || fail "held tornado ends against evaluate"
import json, sys
tornado = json.load(open(sys.argv[1]))
bars = {b["variation"]["path"]: b for b in tornado["bars"]}
def check(point, evaluated):
    direct = {d["profile"]: d for d in json.load(open(evaluated))["designs"]}
    for d in point["designs"]:
        e = direct[d["profile"]]
        assert abs(d["npc"] - e["npc"]) <= 1e-9 * abs(e["npc"]), (d, e["npc"])
        assert abs(d["lcos_per_kwh"] - e["lcos_per_kwh"]) <= 1e-9 * e["lcos_per_kwh"], (d, e)
check(bars["economics.real_discount_rate"]["low"], sys.argv[2])
check(bars[sys.argv[4]]["high"], sys.argv[3])
# Swing: |winner NPC at high - at low| (optimiser/analysis/sweep.h).
for b in tornado["bars"]:
    w = lambda p: next(d["npc"] for d in p["designs"] if d["profile"] == p["winner"])
    assert abs(b["swing_npc"] - abs(w(b["high"]) - w(b["low"]))) <= 1e-6 * b["swing_npc"]
PY

# 2. Re-optimised tornado: the high price end equals `optimise` of the changed study.
expect_exit 0 -- "$STOWAGE" sweep --format json --threads 1 "$fixture" && cp "$WORK/out" "$WORK/tornado1.json" || fail "tornado"
expect_exit 0 -- "$STOWAGE" optimise --format json "$WORK/price.yaml" && cp "$WORK/out" "$WORK/price-opt.json" || fail "optimise price"
$PY - "$WORK/tornado1.json" "$WORK/price-opt.json" "$price" <<'PY' || fail "tornado end against optimise"
import json, sys
tornado = json.load(open(sys.argv[1]))
best = json.load(open(sys.argv[2]))["best"]
high = next(b for b in tornado["bars"] if b["variation"]["path"] == sys.argv[3])["high"]
w = next(d for d in high["designs"] if d["profile"] == high["winner"])
assert high["winner"] == best["profile"], (high["winner"], best["profile"])
assert (w["dod_setpoint"], w["strings_parallel"]) == (best["dod_setpoint"], best["strings_parallel"])
assert abs(w["npc"] - best["npc"]) <= 1e-9 * best["npc"], (w["npc"], best["npc"])
PY
expect_exit 0 -- "$STOWAGE" sweep --format json --threads 2 "$fixture" || fail "tornado on 2 threads"
cmp -s "$WORK/out" "$WORK/tornado1.json" || fail "tornado JSON differs between 1 and 2 threads"
expect_exit 0 -- "$STOWAGE" sweep "$fixture" && grep -q "Verdict:" "$WORK/out" && grep -q "Caution:" "$WORK/out" || fail "tornado text"

# 3. A 2-D grid: text has the winner map; --out writes the set.
expect_exit 0 -- "$STOWAGE" sweep --grid "$price,economics.real_discount_rate" --steps 3 --out "$WORK/grid" "$fixture" || fail "grid"
grep -q "Winner map" "$WORK/out" || fail "winner map"
[ -s "$WORK/grid/sweep.json" ] && [ "$(wc -l <"$WORK/grid/grid.csv")" -eq 10 ] || fail "grid output set (9 points + header)"

# 4. Break-even with held designs: both NPCs are straight lines in the sodium-ion price (price
#    times a fixed nameplate, discounted), so the crossing is the zero of the line through any
#    two scanned gaps (hand derivation: gap(x) = g0 + s x, x* = -g0 / s).
expect_exit 0 -- "$STOWAGE" breakeven --format json --hold-designs --vary "$price" --between 250 400 "$fixture" || fail "breakeven"
$PY - "$WORK/out" <<'PY' || fail "breakeven against the line crossing"
import json, sys
r = json.load(open(sys.argv[1]))
assert r["crossing"] and r["profile"] == "lfp", r
a, b = r["scan"][0], r["scan"][-1]
s = (b["gap"] - a["gap"]) / (b["value"] - a["value"])
x = a["value"] - a["gap"] / s
assert abs(r["value"] - x) <= r["tolerance"], (r["value"], x, r["tolerance"])
assert r["bracket_low"] <= x <= r["bracket_high"] + r["tolerance"]
PY
# The range defaults to the study's variation; none in the range is said plainly.
expect_exit 0 -- "$STOWAGE" breakeven --vary "$price" --out "$WORK/be" "$fixture" && grep -q "Break-even: lfp ties sodium-ion" "$WORK/out" || fail "breakeven text"
[ -s "$WORK/be/breakeven.json" ] && [ -s "$WORK/be/probes.csv" ] || fail "breakeven output set"
expect_exit 0 -- "$STOWAGE" breakeven --vary "$price" --between 200 250 "$fixture" && grep -q "No crossing between" "$WORK/out" || fail "no crossing"

# 5. Uncertainty: identical JSON and samples for any thread count; win probabilities sum to 1.
expect_exit 0 -- "$STOWAGE" uncertainty --samples 40 --seed 11 --lhs --threads 1 --format json --out "$WORK/u1" "$fixture" && cp "$WORK/out" "$WORK/u1.json" || fail "uncertainty 1 thread"
expect_exit 0 -- "$STOWAGE" uncertainty --samples 40 --seed 11 --lhs --threads 2 --format json --out "$WORK/u2" "$fixture" || fail "uncertainty 2 threads"
cmp -s "$WORK/out" "$WORK/u1.json" || fail "uncertainty JSON differs between 1 and 2 threads"
cmp -s "$WORK/u1/samples.csv" "$WORK/u2/samples.csv" || fail "samples.csv differs between 1 and 2 threads"
[ ! -s "$WORK/err" ] || fail "progress written to a stderr that is not a terminal"
$PY - "$WORK/u1.json" <<'PY' || fail "win probabilities"
import json, sys
r = json.load(open(sys.argv[1]))
total = sum(p["win_probability"] for p in r["profiles"]) + r["no_winner_probability"]
assert abs(total - 1) <= 1e-12, total
assert r["samples"] == 40 and r["latin_hypercube"]
PY
expect_exit 0 -- "$STOWAGE" uncertainty --samples 20 "$fixture" && grep -q "Verdict: the base winner" "$WORK/out" || fail "uncertainty text"

# 6. Bad input: exit 2 with the field named, and an earlier output set left as it was.
expect_exit 2 -- "$STOWAGE" sweep --grid site.autonomy_days "$fixture" && grep -q -- "--grid" "$WORK/err" || fail "grid path without a variation"
expect_exit 2 -- "$STOWAGE" sweep --vary "site.autonomy_days=3" "$fixture" && grep -q -- "--vary" "$WORK/err" || fail "malformed --vary"
expect_exit 2 -- "$STOWAGE" breakeven --vary "$price" --between 400 250 "$fixture" || fail "reversed --between"
study_copy "$WORK/plain.yaml" -e '/distribution:/d'
expect_exit 2 -- "$STOWAGE" uncertainty --samples 10 --out "$WORK/u1" "$WORK/plain.yaml" && grep -q "variations" "$WORK/err" || fail "nothing to draw"
cmp -s "$WORK/u1/uncertainty.json" "$WORK/u1.json" || fail "a failed run changed the earlier output set"
mkdir -p "$WORK/mine" && echo keep >"$WORK/mine/notes.txt"
expect_exit 2 -- "$STOWAGE" sweep --out "$WORK/mine" "$fixture" || fail "foreign --out directory"
[ "$(cat "$WORK/mine/notes.txt")" = keep ] || fail "user file touched"

# 7. Shards: 4 slices run apart under GNU parallel (Debian package parallel, installed by
#    .ci/setup) and merged give the unsharded JSON and samples byte for byte, in any part order.
expect_exit 0 -- "$STOWAGE" uncertainty --samples 30 --seed 5 --format json --out "$WORK/whole" "$fixture" && cp "$WORK/out" "$WORK/whole.json" || fail "unsharded run"
shard() { "$STOWAGE" uncertainty --samples 30 --seed 5 --threads 1 --shard "$1/4" "$fixture" >"$WORK/part$1.txt"; }
command -v parallel >/dev/null || fail "GNU parallel is not installed (run .ci/setup)"
export -f shard && export STOWAGE fixture WORK
parallel --will-cite -j 2 shard ::: 1 2 3 4 || fail "shards under GNU parallel"
expect_exit 0 -- "$STOWAGE" merge --format json --out "$WORK/merged" "$WORK/part3.txt" "$WORK/part1.txt" "$WORK/part4.txt" "$WORK/part2.txt" || fail "merge"
cmp -s "$WORK/out" "$WORK/whole.json" || fail "merged JSON differs from the unsharded run"
cmp -s "$WORK/merged/samples.csv" "$WORK/whole/samples.csv" || fail "merged samples.csv differs"
expect_exit 2 -- "$STOWAGE" merge "$WORK/part1.txt" "$WORK/part2.txt" && grep -q "in no part" "$WORK/err" || fail "missing shard"
expect_exit 2 -- "$STOWAGE" merge "$WORK/part1.txt" "$WORK/part1.txt" "$WORK/part2.txt" "$WORK/part3.txt" "$WORK/part4.txt" && grep -q "overlap" "$WORK/err" || fail "doubled shard"
head -n 9 "$WORK/part2.txt" >"$WORK/cut.txt"
expect_exit 2 -- "$STOWAGE" merge "$WORK/cut.txt" && grep -q "cut.txt:10" "$WORK/err" || fail "truncated part"
expect_exit 2 -- "$STOWAGE" uncertainty --shard 5/4 "$fixture" && grep -q -- "--shard" "$WORK/err" || fail "bad --shard"

# 8. Progress only on a terminal (script(1) gives the run one), and not with --quiet.
if command -v script >/dev/null; then
  script -qec "$STOWAGE uncertainty --samples 200 --threads 1 --format json $fixture" /dev/null >"$WORK/tty.txt" 2>&1
  grep -aq "/ 200 samples" "$WORK/tty.txt" || fail "no progress on a terminal"
  script -qec "$STOWAGE uncertainty --samples 200 --threads 1 --quiet --format json $fixture" /dev/null >"$WORK/tty.txt" 2>&1
  grep -aq "/ 200 samples" "$WORK/tty.txt" && fail "progress despite --quiet"
  # Break-even: evaluations done of those planned; the last line has them equal.
  be="breakeven --hold-designs --vary $price --between 250 400 --threads 1 --format json"
  script -qec "$STOWAGE $be $fixture" /dev/null >"$WORK/tty.txt" 2>&1
  grep -aqE "([0-9]+) / \1 evaluations, .* per s" "$WORK/tty.txt" || fail "no break-even progress on a terminal"
  script -qec "$STOWAGE $be --quiet $fixture" /dev/null >"$WORK/tty.txt" 2>&1
  grep -aqE "[0-9]+ / [0-9]+ evaluations" "$WORK/tty.txt" && fail "break-even progress despite --quiet"
fi
# Break-even with a stderr that is not a terminal: nothing on it.
expect_exit 0 -- "$STOWAGE" breakeven --hold-designs --vary "$price" --between 250 400 --format json "$fixture" || fail "breakeven, stderr a file"
[ ! -s "$WORK/err" ] || fail "break-even wrote to a stderr that is not a terminal"

# 9. Sweep shards: a 4-shard 1-D grid (with a --vary axis) and a 4-shard tornado, run apart
#    under GNU parallel and merged in any part order, give the unsharded JSON and CSV byte for
#    byte (no timing fields in a sweep's output).
gridargs=(--grid economics.real_discount_rate --vary economics.real_discount_rate=0.03:0.09 --steps 7)
expect_exit 0 -- "$STOWAGE" sweep "${gridargs[@]}" --format json --out "$WORK/gwhole" "$fixture" && cp "$WORK/out" "$WORK/gwhole.json" || fail "unsharded grid"
gshard() { "$STOWAGE" sweep --grid economics.real_discount_rate --vary economics.real_discount_rate=0.03:0.09 --steps 7 --threads 1 --shard "$1/4" "$fixture" >"$WORK/gpart$1.txt"; }
tshard() { "$STOWAGE" sweep --hold-designs --threads 1 --shard "$1/4" --out "$WORK/tparts$1" "$fixture" >/dev/null; }
export -f gshard tshard
parallel --will-cite -j 2 gshard ::: 1 2 3 4 || fail "grid shards under GNU parallel"
expect_exit 0 -- "$STOWAGE" merge --format json --out "$WORK/gmerged" "$WORK/gpart4.txt" "$WORK/gpart2.txt" "$WORK/gpart1.txt" "$WORK/gpart3.txt" || fail "merge grid"
cmp -s "$WORK/out" "$WORK/gwhole.json" || fail "merged grid JSON differs from the unsharded run"
cmp -s "$WORK/gmerged/grid.csv" "$WORK/gwhole/grid.csv" || fail "merged grid.csv differs"
expect_exit 0 -- "$STOWAGE" merge "$WORK/gpart1.txt" "$WORK/gpart2.txt" "$WORK/gpart3.txt" "$WORK/gpart4.txt" && cp "$WORK/out" "$WORK/gmerged.txt" || fail "merge grid, text"
expect_exit 0 -- "$STOWAGE" sweep "${gridargs[@]}" "$fixture" && cmp -s "$WORK/out" "$WORK/gmerged.txt" || fail "merged grid text differs"
expect_exit 0 -- "$STOWAGE" sweep --hold-designs --format json "$fixture" && cp "$WORK/out" "$WORK/twhole.json" || fail "unsharded held tornado"
parallel --will-cite -j 2 tshard ::: 1 2 3 4 || fail "tornado shards under GNU parallel"
[ -s "$WORK/tparts3/part-3-of-4.txt" ] || fail "shard --out file"
expect_exit 0 -- "$STOWAGE" merge --format json "$WORK"/tparts{2,4,1,3}/part-*-of-4.txt || fail "merge tornado"
cmp -s "$WORK/out" "$WORK/twhole.json" || fail "merged tornado JSON differs from the unsharded run"
expect_exit 0 -- "$STOWAGE" merge --report "$WORK/grep" "$WORK"/gpart{1,2,3,4}.txt && [ -s "$WORK/grep/report.html" ] && [ -s "$WORK/grep/fig-sweep.svg" ] || fail "merge --report of sweep parts"
cmp -s "$WORK/grep/sweep.json" "$WORK/gwhole.json" || fail "merged report's sweep.json differs"
expect_exit 2 -- "$STOWAGE" merge "$WORK/gpart1.txt" "$WORK/gpart2.txt" "$WORK/gpart4.txt" && grep -q "in no part" "$WORK/err" || fail "missing sweep shard"
expect_exit 2 -- "$STOWAGE" merge "$WORK/gpart1.txt" "$WORK/tparts2/part-2-of-4.txt" && grep -q "differs from" "$WORK/err" || fail "parts of two sweeps"
expect_exit 2 -- "$STOWAGE" merge "$WORK/gpart1.txt" "$WORK/part2.txt" && grep -q "partial uncertainty result" "$WORK/err" || fail "a sweep part with an uncertainty part"
head -n 8 "$WORK/gpart2.txt" >"$WORK/gcut.txt"
expect_exit 2 -- "$STOWAGE" merge "$WORK/gcut.txt" && grep -q "gcut.txt:9" "$WORK/err" || fail "truncated sweep part"
expect_exit 2 -- "$STOWAGE" sweep --shard 0/4 "$fixture" && grep -q -- "--shard" "$WORK/err" || fail "bad sweep --shard"
expect_exit 2 -- "$STOWAGE" sweep --shard 1/4 --report "$WORK/nope" "$fixture" && grep -q -- "--report" "$WORK/err" || fail "sweep --report with --shard"
finish
