#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# `evaluate` says when a design cannot do its job: a 1-string bank at a site whose autonomy
# needs several strings (the demo Sandglass Mast site: optimise's least bank there is more
# than one string, docs/method.md 8) is marked in the text, the JSON and designs.csv, and an
# autonomy-sized design is not.
source "$(dirname "$0")/common.bash"

site="$SRC/studies/sandglass-mast/site.yaml"
profile="$SRC/catalog-schema/profiles/lfp.yaml"
cat >"$WORK/study.yaml" <<YAML
study:
  title: one string against the site's autonomy
  site: $site
  profiles: [$profile]
  economics: {project_years: 15, real_discount_rate: 0.08, currency: EUR}
  designs:
    - {profile: lfp, strings_parallel: 1}
    - {profile: lfp}
YAML

if expect_exit 0 -- "$STOWAGE" evaluate "$WORK/study.yaml"; then
  grep -q "FAILS         autonomy" "$WORK/out" || fail "text: no FAILS line for the 1-string bank"
  grep -q "1 of 2 designs fail" "$WORK/out" || fail "text: no closing count of failing designs"
fi
if expect_exit 0 -- "$STOWAGE" evaluate --format json "$WORK/study.yaml"; then
  "$PY" - "$WORK/out" <<'PY' || fail "json: requirement flags"
import json, sys
d = json.load(open(sys.argv[1]))["designs"]
one = [x for x in d if x["strings_parallel"] == 1][0]
sized = [x for x in d if x is not one][0]
assert one["meets_requirements"] is False and one["requirements"]["meets_autonomy"] is False, one
assert one["requirements"]["usable_kwh"] < one["requirements"]["required_usable_kwh"]
assert sized["meets_requirements"] is True, sized["requirements"]
assert sized["requirements"]["autonomy_strings"] == sized["strings_parallel"]
PY
fi
if expect_exit 0 -- "$STOWAGE" evaluate --out "$WORK/set" "$WORK/study.yaml"; then
  "$PY" - "$WORK/set/designs.csv" <<'PY' || fail "designs.csv: requirement columns"
import csv, sys
rows = list(csv.DictReader(open(sys.argv[1])))
flags = sorted((int(r["strings_parallel"]), r["meets_autonomy"]) for r in rows)
assert flags[0][1] == "false" and flags[1][1] == "true", flags
PY
fi
finish
