#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Rank correlations between drawn inputs (Iman-Conover, docs/robustness.md): on 1000 samples
# the achieved Spearman rank correlation of the drawn values in samples.csv, computed by
# scipy.stats.spearmanr (an independent implementation), is within sampling error of the
# targets; each input's draws are the same values as without correlations (only reordered);
# 4 shards merged equal the unsharded run byte for byte; bad correlations exit 2.
source "$(dirname "$0")/common.bash"
fixture="$SRC/tests/e2e/fixtures/robust-study.yaml"
plain="$WORK/plain.yaml"
correlated="$WORK/correlated.yaml"
sed -e "s|\.\./\.\./\.\./|$SRC/|" "$fixture" >"$plain"
$PY - "$plain" "$correlated" <<'PY' || fail "making the correlated study"
import sys
text = open(sys.argv[1]).read()
marker = "      distribution: {kind: triangular}\n"
assert text.count(marker) == 1
text = text.replace(marker, marker +
    "      rank_correlations:\n"
    "        - {with: profiles.sodium-ion.costs.capital_per_kwh, rho: -0.3}\n"
    "        - {with: lfp price, rho: 0.2}\n")
text += ("    - path: profiles.lfp.costs.capital_per_kwh\n"
         "      label: lfp price\n"
         "      low: 250\n"
         "      high: 420\n"
         "      distribution: {kind: uniform}\n"
         "      rank_correlations: [{with: profiles.sodium-ion.costs.capital_per_kwh, rho: 0.5}]\n")
open(sys.argv[2], "w").write(text)
PY
# The same three inputs without correlations, for the marginals.
$PY - "$correlated" "$WORK/independent.yaml" <<'PY' || fail "making the independent study"
import re, sys
text = open(sys.argv[1]).read()
text = re.sub(r"      rank_correlations:\n(        - .*\n)+", "", text)
text = re.sub(r"      rank_correlations: \[.*\]\n", "", text)
open(sys.argv[2], "w").write(text)
PY

expect_exit 0 -- "$STOWAGE" uncertainty --samples 1000 --seed 3 --threads 2 --format json --out "$WORK/c" "$correlated" || fail "correlated run"
cp "$WORK/out" "$WORK/c.json"
# The JSON states each drawn input's target rank correlations, on both sides of each pair.
$PY - "$WORK/c.json" <<'PY' || fail "JSON: rank_correlations of the drawn inputs"
import json, sys
drawn = {d["path"]: {c["with"]: c["rho"] for c in d["rank_correlations"]} for d in json.load(open(sys.argv[1]))["drawn"]}
s, r, l = "profiles.sodium-ion.costs.capital_per_kwh", "economics.real_discount_rate", "profiles.lfp.costs.capital_per_kwh"
assert drawn[r] == {s: -0.3, l: 0.2}, drawn[r]
assert drawn[s] == {r: -0.3, l: 0.5}, drawn[s]
assert drawn[l] == {r: 0.2, s: 0.5}, drawn[l]
PY
expect_exit 0 -- "$STOWAGE" uncertainty --samples 1000 --seed 3 --threads 2 --out "$WORK/i" "$WORK/independent.yaml" || fail "independent run"
$PY - "$WORK/c/samples.csv" "$WORK/i/samples.csv" <<'PY' || fail "achieved rank correlations or marginals"
import csv, sys
from scipy.stats import spearmanr
paths = ("profiles.sodium-ion.costs.capital_per_kwh", "economics.real_discount_rate",
         "profiles.lfp.costs.capital_per_kwh")
def columns(path):
    rows = list(csv.DictReader(open(path)))
    return {k: [float(r[k]) for r in rows] for k in paths}, len(rows)
c, n = columns(sys.argv[1])
i, _ = columns(sys.argv[2])
assert n == 1000, n
sodium, rate, lfp = (c[k] for k in paths)
# Targets and a tolerance of 0.05 (sampling error of a rank correlation ~ 1/sqrt(1000) = 0.03;
# Iman & Conover 1982 report achieved values within a few hundredths at this size).
for a, b, target in ((rate, sodium, -0.3), (rate, lfp, 0.2), (lfp, sodium, 0.5)):
    rho = spearmanr(a, b).correlation
    assert abs(rho - target) < 0.05, (target, rho)
# Marginals: each input drew the same values, only in another order.
for k in paths:
    assert sorted(c[k]) == sorted(i[k]), k
    assert c[k] != i[k], k
PY

# The text names the method and lists each pair once, instead of calling the inputs independent.
expect_exit 0 -- "$STOWAGE" uncertainty --samples 50 --seed 3 "$correlated" || fail "text run"
grep -q "rank-correlated where listed, by the Iman-Conover method" "$WORK/out" || fail "text heading"
[ "$(grep -c "rank correlation with" "$WORK/out")" = 3 ] || fail "text pairs: $(grep "rank correlation" "$WORK/out")"
! grep -q "independent of each other" "$WORK/out" || fail "text calls correlated inputs independent"

# Shards: every shard draws the whole 1000-sample matrix and keeps its slice.
for i in 1 2 3 4; do
  "$STOWAGE" uncertainty --samples 1000 --seed 3 --threads 1 --shard "$i/4" "$correlated" >"$WORK/part$i.txt" || fail "shard $i"
done
expect_exit 0 -- "$STOWAGE" merge --format json --out "$WORK/merged" "$WORK/part2.txt" "$WORK/part4.txt" "$WORK/part1.txt" "$WORK/part3.txt" || fail "merge"
cmp -s "$WORK/out" "$WORK/c.json" || fail "merged JSON differs from the unsharded correlated run"
cmp -s "$WORK/merged/samples.csv" "$WORK/c/samples.csv" || fail "merged samples.csv differs"

# Bad input: a correlation with an input that is not drawn names its file, line and field.
sed -e 's/with: lfp price, rho: 0.2/with: site.hourly.temp_c_offset, rho: 0.2/' "$correlated" >"$WORK/bad.yaml"
expect_exit 2 -- "$STOWAGE" uncertainty --samples 50 "$WORK/bad.yaml" && grep -q "bad.yaml:[0-9]*:.*rank_correlations\[1\].with" "$WORK/err" || fail "unknown name: $(head -c 300 "$WORK/err")"
# The report states how the inputs are linked: by the stated correlations, not "independently".
expect_exit 0 -- "$STOWAGE" uncertainty --samples 50 --seed 3 --report "$WORK/rep" "$correlated" || fail "report run"
grep -q "Only the stated rank correlations link the inputs" "$WORK/rep/report.md" || fail "report: correlations not stated"
grep -q "Inputs are drawn independently" "$WORK/rep/report.md" && fail "report: claims independent inputs"
grep -q "independently of the others" "$WORK/rep/report.md" && fail "report: section claims independent draws"
grep -q "with the rank correlations the study states between them" "$WORK/rep/report.md" || fail "report: section does not state the correlations"
expect_exit 0 -- "$STOWAGE" uncertainty --samples 50 --seed 3 --report "$WORK/rep-i" "$WORK/independent.yaml" || fail "independent report run"
grep -q "Inputs are drawn independently" "$WORK/rep-i/report.md" || fail "report: independence not stated"
finish
