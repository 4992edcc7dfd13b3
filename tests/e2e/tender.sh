#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `stowage tender` on the Pier Nine demo: exit codes, the JSON a reader relies on, the output set.
source "$(dirname "$0")/common.bash"
tender="$SRC/studies/pier-nine-tender/tender.yaml"
expect_exit 0 -- "$STOWAGE" tender "$tender" && grep -q "Recommended: Bid A" "$WORK/out" || fail "text report"
grep -q "Caution:" "$WORK/out" || fail "safety notice"
grep -q "Bid D: usable energy 960 kWh" "$WORK/out" || fail "non-compliant bid named with its shortfall"
expect_exit 0 -- "$STOWAGE" tender --format json "$tender" || fail "json run"
python3 - "$WORK/out" <<'PY' || fail "json content"
import json, sys
doc = json.load(open(sys.argv[1]))
bids = {b["label"]: b for b in doc["bids"]}
assert doc["recommended"] == "Bid A", doc["recommended"]
assert not bids["Bid D"]["compliant"] and bids["Bid D"]["rank"] is None
assert bids["Bid A"]["supplier_paid_replacement_years"] == [11], bids["Bid A"]
for b in bids.values():
    # The supplier pays only within the warranty; the buyer's NPC adds the damages credit.
    assert all(y <= b["warranty_end_years"] + 1e-9 for y in b["supplier_paid_replacement_years"])
    assert abs(b["npc"] - b["design"]["npc"] - b["liquidated_damages"]) <= 1e-6 * b["npc"]
assert bids["Bid C"]["capacity_remedy"] == "liquidated_damages" and bids["Bid C"]["liquidated_damages"] < 0
assert bids["Bid A"]["top_up_kwh"] > 0
# The buyer's NPC is the simulator's less what the supplier pays: never more.
for b in bids.values():
    assert b["npc"] <= b["npc_without_warranty"] + 1e-6
    lines = b["design"]["breakdown"]
    assert abs(sum(lines.values()) - b["design"]["npc"]) <= 1e-6 * abs(b["design"]["npc"])
PY
expect_exit 0 -- "$STOWAGE" tender --out "$WORK/set" "$tender" || fail "--out run"
for f in bids.csv designs.csv cash-flows.csv; do [ -s "$WORK/set/$f" ] || fail "missing $f"; done
# Every designs.csv and cash-flows.csv row names the tender (its title) and no search method.
python3 - "$WORK/set" "$tender" <<'PY' || fail "tender CSV study and method columns"
import csv, re, sys
title = re.search(r"^\s*title:\s*(.+?)\s*$", open(sys.argv[2]).read(), re.M).group(1).strip("'\"")
for name in ("designs.csv", "cash-flows.csv"):
    rows = list(csv.DictReader(open(sys.argv[1] + "/" + name)))
    assert rows and all(r["study"] == title and r["method"] == "" for r in rows), (name, rows[0])
PY
# Without variations the tender's margins make the call and the JSON has no sampled fields.
expect_exit 0 -- "$STOWAGE" tender --format json "$tender" || fail "json run"
python3 -c 'import json,sys; d=json.load(open(sys.argv[1])); assert "uncertainty" not in d and "near_tie_rule" not in d' \
  "$WORK/out" 2>/dev/null || fail "deterministic JSON grew sampled fields"
# With variations: the samples make the call, said on screen; the JSON carries the sampled
# figures; --out adds bid-uncertainty.csv.
varied="$SRC/studies/pier-nine-tender/tender-variations.yaml"
expect_exit 0 -- "$STOWAGE" tender "$varied" --samples 40 --threads 2 --quiet || fail "varied text run"
grep -qi "near tie from 40 samples of the tender's variations" "$WORK/out" || fail "the rule that made the call is not named"
grep -q "^Uncertainty over 40 samples" "$WORK/out" || fail "no uncertainty table"
expect_exit 0 -- "$STOWAGE" tender "$varied" --samples 40 --threads 2 --quiet --format json || fail "varied json run"
python3 - "$WORK/out" <<'PY' || fail "sampled json content"
import json, math, sys
doc = json.load(open(sys.argv[1]))
assert doc["near_tie_rule"] == "samples", doc.get("near_tie_rule")
u = doc["uncertainty"]
n = u["samples"]
assert n == 40 and u["seed"] == "1"
assert [d["path"] for d in u["drawn"]][:2] == ["economics.real_discount_rate", "site.backup.price_per_kwh"]
assert u["leader"] == doc["recommended"] == "Bid A" and u["runner_up"] == "Bid B"
assert doc["near_tie"] == (u["runner_up_at_least_as_good_share"]
                           + u["near_tie_standard_errors"] * u["runner_up_at_least_as_good_share_se"]
                           >= u["near_tie_share"])
assert u["near_tie_share"] == 0.1 and u["near_tie_standard_errors"] == 2
assert u["margin_p10"] <= u["margin_p50"] <= u["margin_p90"]
total = u["no_winner_probability"]
for b in u["bids"]:
    for key in ("npc", "lcos_per_kwh"):
        s = b[key]
        assert s["p10"] <= s["p50"] <= s["p90"], (b["label"], key, s)
    p = b["win_probability"]
    # Standard error of a proportion, sqrt(p (1 - p) / n) (common practice).
    assert abs(b["win_probability_se"] - math.sqrt(p * (1 - p) / n)) <= 1e-9, b
    total += p
assert abs(total - 1) <= 1e-9, total
bids = {b["label"]: b for b in doc["bids"]}
# The deterministic NPC lies within the sampled spread of the bid (the base values lie inside
# every range drawn).
for b in u["bids"]:
    npc = bids[b["label"]]["npc"]
    assert b["npc"]["p10"] * 0.9 <= npc <= b["npc"]["p90"] * 1.1, (b["label"], npc, b["npc"])
PY
expect_exit 0 -- "$STOWAGE" tender "$varied" --samples 20 --quiet --out "$WORK/vset" || fail "varied --out run"
head -1 "$WORK/vset/bid-uncertainty.csv" | grep -q "^bid,samples,npc_mean" || fail "bid-uncertainty.csv"
[ "$(wc -l <"$WORK/vset/bid-uncertainty.csv")" -eq 5 ] || fail "bid-uncertainty.csv rows"
# Two near-equal bids (Bid A and a copy at 0.9 % more capex) with Bid A's variable O&M drawn
# from 0..2 EUR/MWh: Bid A leads at its base value 0, but the copy does at least as well in
# most samples, so the samples call a near tie, on screen and in the JSON.
demo="$SRC/studies/pier-nine-tender"
sed -e 's/label: Bid A/label: Bid E/' -e 's/capex: 490680/capex: 495000/' \
    -e "s|profile: bid-a.yaml|profile: $demo/bid-a.yaml|" "$demo/offer-a.yaml" >"$WORK/offer-e.yaml"
cat >"$WORK/tie.yaml" <<EOF
tender:
  title: Two near-equal bids
  site: $demo/site.yaml
  economics: {project_years: 15, real_discount_rate: 0.07, currency: EUR}
  scoring: {price_weight: 0.7, criteria: {safety: 0.2, service: 0.1}}
  bids:
    - $demo/offer-a.yaml
    - offer-e.yaml
  variations:
    - path: bids.Bid A.costs.variable_om_per_mwh
      low: 0
      high: 2
      distribution: {kind: uniform}
EOF
expect_exit 0 -- "$STOWAGE" tender "$WORK/tie.yaml" --samples 40 --quiet || fail "tie run"
grep -q "^NEAR TIE from 40 samples of the tender's variations: Bid E does at least as well as Bid A" "$WORK/out" ||
  fail "sampled near tie not called: $(grep -i 'tie' "$WORK/out" | head -2)"
expect_exit 0 -- "$STOWAGE" tender "$WORK/tie.yaml" --samples 40 --quiet --format json || fail "tie json"
python3 - "$WORK/out" <<'PY' || fail "tie json content"
import json, sys
doc = json.load(open(sys.argv[1]))
u = doc["uncertainty"]
assert doc["near_tie"] is True and doc["near_tie_rule"] == "samples"
assert u["near_tie_by_margins"] is True  # 0.2 points apart: the margins agree here
wins = {b["label"]: b["win_probability"] for b in u["bids"]}
assert abs(sum(wins.values()) - 1) <= 1e-12, wins
# Equal totals rank Bid A first but count for the runner-up, so q >= Bid E's win probability.
assert u["runner_up_at_least_as_good_share"] >= wins["Bid E"] > 0.1, (u, wins)
assert u["margin_p10"] < 0 < u["margin_p90"], u  # the margin's P10..P90 interval spans zero
PY
# A tender whose requirement no bid meets: exit 3.
demo="$SRC/studies/pier-nine-tender"
sed -e 's/min_usable_kwh: 1200 .*/min_usable_kwh: 99999/' -e "s|site: site.yaml|site: $demo/site.yaml|" \
    -e "s|- offer-|- $demo/offer-|" "$tender" >"$WORK/unmeetable.yaml"
expect_exit 3 -- "$STOWAGE" tender "$WORK/unmeetable.yaml" && grep -q "No bid meets" "$WORK/out" || fail "no compliant bid"
finish
