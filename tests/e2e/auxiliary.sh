#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Auxiliary loads through the real binary: a copy of the LFP profile with a standing load and
# pumps. `check` shows the round trip with pumps, eta_RT (1 - a_p) / (1 + a_p) (docs/method.md
# 4, step 5); `evaluate` books a first-year standing load of a_s x nameplate x 8760 h, split
# into source, bank and unmet parts that add up (hand derivation, pumps off).
source "$(dirname "$0")/common.bash"

site="$SRC/studies/sandglass-mast/site.yaml"
sed 's/^  sources:/  auxiliary: {standing_kw_per_kwh: 0.002, pump_kw_per_kw: 0.0}\n  sources:/' \
  "$SRC/catalog-schema/profiles/lfp.yaml" >"$WORK/lfp-aux.yaml"
sed 's/pump_kw_per_kw: 0.0}/pump_kw_per_kw: 0.05}/' "$WORK/lfp-aux.yaml" >"$WORK/lfp-pumps.yaml"
grep -q "auxiliary:" "$WORK/lfp-aux.yaml" || fail "fixture: no auxiliary block written"
study() {
  cat <<YAML
study:
  title: auxiliary loads
  site: $site
  profiles: [$1]
  economics: {project_years: 15, real_discount_rate: 0.08, currency: EUR}
YAML
}
study "$WORK/lfp-aux.yaml" >"$WORK/aux.yaml"
study "$WORK/lfp-pumps.yaml" >"$WORK/pumps.yaml"

if expect_exit 0 -- "$STOWAGE" check "$WORK/pumps.yaml"; then
  "$PY" - "$WORK/out" "$SRC/catalog-schema/profiles/lfp.yaml" <<'PY' || fail "check: round trip with pumps"
import re, sys
text = open(sys.argv[1]).read()
prof = open(sys.argv[2]).read()
num = lambda key: float(re.search(r"\b" + key + r":\s*([0-9.eE+-]+)", prof).group(1))
eta = num("mean_discharge_v") / num("mean_charge_v") * num("coulombic_efficiency")
want = 100 * eta * (1 - 0.05) / (1 + 0.05)
got = float(re.search(r"round trip with pumps ([0-9.]+) %", text).group(1))
assert abs(got - want) <= 0.05 + 1e-9, (got, want)
PY
fi
if expect_exit 0 -- "$STOWAGE" evaluate --format json "$WORK/aux.yaml"; then
  "$PY" - "$WORK/out" "$site" <<'PY' || fail "evaluate: auxiliary energy"
import json, math, re, sys
d = json.load(open(sys.argv[1]))["designs"][0]
eta_ch = float(re.search(r"charger_efficiency:\s*([0-9.]+)", open(sys.argv[2]).read()).group(1))
want = 0.002 * d["nameplate_kwh"] * 8760
assert math.isclose(d["auxiliary_kwh_first_year"], want, rel_tol=1e-9), (d["auxiliary_kwh_first_year"], want)
# Source energy passes the charger; the three parts cover the demand exactly.
parts = (d["auxiliary_source_kwh_first_year"] * eta_ch + d["auxiliary_bank_kwh_first_year"]
         + d["auxiliary_unmet_kwh_first_year"])
assert math.isclose(parts, want, rel_tol=1e-9), (parts, want)
assert d["auxiliary_source_kwh_first_year"] > 0 and d["auxiliary_bank_kwh_first_year"] > 0
PY
fi
if expect_exit 0 -- "$STOWAGE" evaluate --out "$WORK/set" "$WORK/aux.yaml"; then
  "$PY" - "$WORK/set/cash-flows.csv" <<'PY' || fail "cash-flows.csv: auxiliary columns"
import csv, sys
rows = list(csv.reader(open(sys.argv[1])))
assert len({len(r) for r in rows}) == 1, "ragged cash-flows.csv"
recs = [dict(zip(rows[0], r)) for r in rows[1:]]
year1 = [r for r in recs if r["year"] == "1"][0]
assert float(year1["auxiliary_kwh"]) > 0 and float(year1["auxiliary_bank_kwh"]) > 0, year1
assert [r for r in recs if r["year"] == "0"][0]["auxiliary_kwh"] == ""
PY
fi
# The study report shows the recommended design's auxiliary energy, tagged with its JSON key, and
# says how long its temperature limits kept the bank idle.
if expect_exit 0 -- "$STOWAGE" report "$WORK/aux.yaml" --out "$WORK/report"; then
  "$PY" - "$WORK/report" <<'PY' || fail "report: auxiliary energy and idle hours"
import json, re, sys
d = sys.argv[1]
best = json.load(open(d + "/result.json"))["best"]
html = open(d + "/report.html").read()
md = open(d + "/report.md").read()
for key in ("auxiliary_kwh_first_year", "auxiliary_source_kwh_first_year",
            "auxiliary_bank_kwh_first_year", "auxiliary_unmet_kwh_first_year"):
    m = re.search(r'data-key="best\.' + key + r'" data-value="([^"]+)"', html)
    assert m, key
    assert abs(float(m.group(1)) - best[key]) <= 1e-9 * max(1.0, abs(best[key])), (key, m.group(1))
assert "auxiliary loads (battery management, climate, pumps)" in md
idle = (best["charge_blocked_by_temperature_hours_first_year"]
        + best["discharge_blocked_by_temperature_hours_first_year"])
if idle > 0:
    assert "kept the bank idle for" in md, "idle hours missing"
else:
    assert "never kept the bank idle" in md
PY
fi
finish
