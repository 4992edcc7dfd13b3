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
# A tender whose requirement no bid meets: exit 3.
demo="$SRC/studies/pier-nine-tender"
sed -e 's/min_usable_kwh: 1200 .*/min_usable_kwh: 99999/' -e "s|site: site.yaml|site: $demo/site.yaml|" \
    -e "s|- offer-|- $demo/offer-|" "$tender" >"$WORK/unmeetable.yaml"
expect_exit 3 -- "$STOWAGE" tender "$WORK/unmeetable.yaml" && grep -q "No bid meets" "$WORK/out" || fail "no compliant bid"
finish
