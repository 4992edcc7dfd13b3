#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Issue 8, item 7. economics.exchange_rates: a profile priced in USD serves a EUR study through
# the stated rate, and the result equals that of the same profile with its prices converted by
# hand (definition of an exchange rate: x USD = 0.92 x EUR when 1 USD = 0.92 EUR); the rate is
# shown in the text header, the JSON and the report. profile.family is an open label: a
# chemistry of the user's own loads, and the label changes no number of the evaluation.
source "$(dirname "$0")/common.bash"
FIX="$SRC/tests/catalog-schema/fixtures"
mkdir -p "$WORK/s" && cp "$FIX/site.yaml" "$FIX/hourly.csv" "$FIX/lead-test.yaml" "$WORK/s/" &&
  "$PY" - "$FIX/lfp-test.yaml" "$WORK/s" <<'PY' || fail "could not write the test profiles"
import sys
src, out = sys.argv[1], sys.argv[2]
text = open(src).read()
# lfp-test's prices, in USD as given, and converted by hand at 0.92 EUR per USD.
given = {"capital_per_kwh: 400": "capital_per_kwh: 368", "capital_per_string: 200": "capital_per_string: 184",
         "installation_fixed: 1500": "installation_fixed: 1380", "fixed_om_per_kwh_year: 2": "fixed_om_per_kwh_year: 1.84",
         "variable_om_per_mwh: 1.5": "variable_om_per_mwh: 1.38", "end_of_life_per_kwh: -5": "end_of_life_per_kwh: -4.6",
         "replacement_end_of_life_per_kwh: 3": "replacement_end_of_life_per_kwh: 2.76"}
for k in given:
    assert text.count("    " + k + "\n") == 1, k
usd = text.replace("    currency: EUR\n", "    currency: USD\n")
assert usd != text
eur = text
for k, v in given.items():
    eur = eur.replace("    " + k + "\n", "    " + v + "\n")
open(f"{out}/lfp-usd.yaml", "w").write(usd)
open(f"{out}/lfp-by-hand.yaml", "w").write(eur)
own = text.replace("family: lithium-iron-phosphate", "family: lead-carbon")
assert own != text
open(f"{out}/lfp-own-family.yaml", "w").write(own)
open(f"{out}/lfp-test.yaml", "w").write(text)
PY
write_study() {  # write_study FILE PROFILE [EXTRA-ECONOMICS-LINE]
  cat >"$1" <<EOF
study:
  title: Currency and family test
  site: site.yaml
  profiles:
    - $2
    - lead-test.yaml
  economics:
    project_years: 20
    real_discount_rate: 0.06
    currency: EUR
${3:-}
  designs:
    - {profile: lfp-test, dod_setpoint: 0.7, strings_parallel: 2}
    - {profile: lead-test}
EOF
}
write_study "$WORK/s/usd.yaml" lfp-usd.yaml "    exchange_rates: {USD: 0.92}"
write_study "$WORK/s/by-hand.yaml" lfp-by-hand.yaml
write_study "$WORK/s/plain.yaml" lfp-test.yaml
write_study "$WORK/s/own-family.yaml" lfp-own-family.yaml
for name in usd by-hand plain own-family; do
  expect_exit 0 -- "$STOWAGE" evaluate --format json "$WORK/s/$name.yaml" && cp "$WORK/out" "$WORK/$name.json" ||
    fail "evaluate $name"
done
"$PY" - "$WORK/usd.json" "$WORK/by-hand.json" "$WORK/plain.json" "$WORK/own-family.json" <<'PY' || fail "converted prices differ from the prices converted by hand"
import json, math, sys
usd, hand, plain, own = (json.load(open(p)) for p in sys.argv[1:5])
assert usd["exchange_rates"] == [{"currency": "USD", "rate": 0.92, "profiles": ["lfp-test"]}], usd.get("exchange_rates")
assert "exchange_rates" not in hand, "a study without rates writes no exchange_rates"
for a, b in zip(usd["designs"], hand["designs"]):
    for key in ("npc", "investment", "lcos_per_kwh"):
        assert math.isclose(a[key], b[key], rel_tol=1e-12), (key, a[key], b[key])
    for key, value in a["breakdown"].items():
        assert math.isclose(value, b["breakdown"][key], rel_tol=1e-12, abs_tol=1e-9), (key, value, b["breakdown"][key])
# The conversion changed the money: the USD figures read as EUR would be another answer.
assert not math.isclose(usd["designs"][0]["investment"], plain["designs"][0]["investment"], rel_tol=1e-6)
# The family label changes nothing of the evaluation.
assert own["designs"] == plain["designs"], "family changed a result"
PY
expect_exit 0 -- "$STOWAGE" evaluate "$WORK/s/usd.yaml" &&
  { grep -qF "Exchange rate: 1 USD = 0.92 EUR, applied to the prices of profile lfp-test" "$WORK/out" ||
    fail "text header lacks the rate: $(head -5 "$WORK/out")"; }
expect_exit 0 -- "$STOWAGE" evaluate "$WORK/s/by-hand.yaml" &&
  { ! grep -q "Exchange rate" "$WORK/out" || fail "a study without rates shows one"; }
expect_exit 0 -- "$STOWAGE" check "$WORK/s/own-family.yaml" &&
  { grep -q "lead-carbon" "$WORK/out" || fail "check does not show the own family: $(cat "$WORK/out")"; }
expect_exit 0 -- "$STOWAGE" report --out "$WORK/rep" "$WORK/s/usd.yaml" &&
  { grep -qF "1 USD = 0.92 EUR, applied to the prices of profile lfp-test" "$WORK/rep/report.md" ||
    fail "report lacks the rate"; }
expect_exit 0 -- "$STOWAGE" check "$WORK/s/usd.yaml" &&
  { grep -qF "exchange  1 USD = 0.92 EUR, applied to the prices of profile lfp-test" "$WORK/out" ||
    fail "check summary lacks the rate: $(cat "$WORK/out")"; }
expect_exit 0 -- "$STOWAGE" check --format json "$WORK/s/usd.yaml" &&
  "$PY" -c 'import json,sys; e=json.load(open(sys.argv[1]))["summary"]["economics"]; assert e["exchange_rates"] == [{"currency": "USD", "rate": 0.92, "profiles": ["lfp-test"]}], e' "$WORK/out" ||
  fail "check JSON lacks the rate"
# Without the rate the USD profile is refused at its currency, exit 2, with the way out.
write_study "$WORK/s/no-rate.yaml" lfp-usd.yaml "    exchange_rates: {GBP: 1.15}"
expect_exit 2 -- "$STOWAGE" check "$WORK/s/no-rate.yaml" &&
  { grep -qF "lfp-usd.yaml:39:15: profile.costs.currency: prices in USD but the study is in EUR" "$WORK/err" &&
    grep -qF "exchange_rates gives no rate for USD" "$WORK/err" || fail "missing rate: $(cat "$WORK/err")"; }
finish
