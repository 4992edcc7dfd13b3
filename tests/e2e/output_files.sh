#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# The CSV output files follow their documented form (docs/usage.md, "Output files"): the
# header is the documented column list, booleans are true/false, lists are JSON, years are
# whole, the values equal the JSON report's, and each discount factor is the closed-form
# P/F = (1 + r)^-t at the row's discount time (present worth of a single sum, any engineering
# economics handbook).
source "$(dirname "$0")/common.bash"
study="$SRC/studies/tarnbeck-saddle/study.yaml"
expect_exit 0 -- "$STOWAGE" evaluate --format json --out "$WORK/set" "$study" &&
  "$PY" - "$WORK/out" "$WORK/set" "$SRC/docs/usage.md" <<'PY' || fail "CSV outputs against docs/usage.md and the JSON"
import csv, json, math, re, sys
report = json.load(open(sys.argv[1]))
out, usage = sys.argv[2], open(sys.argv[3]).read()
section = usage[usage.index("## Output files"):usage.index("## Exit codes")]
breakdown_keys = list(report["designs"][0]["breakdown"])

def documented(file_name):
    """Column names of the table after the paragraph naming file_name, in order."""
    start = section.index("`" + file_name + "`")
    table = section[section.index("| column |", start):]
    names = []
    for line in table.splitlines()[2:]:
        if not line.startswith("|"):
            break
        cell = line.split("|")[1]
        if "..." in cell:  # the pv_ block: one column per breakdown key
            names += ["pv_" + k for k in breakdown_keys]
        else:
            names += re.findall(r"`([a-z_]+)`", cell)
    return names

designs = list(csv.DictReader(open(f"{out}/designs.csv", newline="")))
with open(f"{out}/designs.csv", newline="") as f:
    assert next(csv.reader(f)) == documented("designs.csv"), "designs.csv header is not the documented list"
with open(f"{out}/cash-flows.csv", newline="") as f:
    assert next(csv.reader(f)) == documented("cash-flows.csv"), "cash-flows.csv header is not the documented list"
flows = list(csv.DictReader(open(f"{out}/cash-flows.csv", newline="")))

# designs.csv: the same values as the JSON, lists as JSON, booleans true/false, rank by NPC.
assert len(designs) == len(report["designs"])
best = min(float(d["npc"]) for d in designs)
for row, js in zip(designs, report["designs"]):
    for key in ("npc", "investment", "delivered_kwh_first_year", "nameplate_kwh", "lcos_per_kwh",
                "unserved_fraction_max"):
        assert math.isclose(float(row[key]), js[key], rel_tol=1e-9, abs_tol=1e-9), (key, row[key], js[key])
    assert json.loads(row["replacement_years"]) == js["replacement_years"], row["replacement_years"]
    assert row["meets_unserved_limit"] in ("true", "false")
    assert (row["meets_unserved_limit"] == "true") == js["meets_unserved_limit"]
    assert math.isclose(float(row["npc_difference_to_best"]), float(row["npc"]) - best, abs_tol=1e-8 * float(row["npc"]))  # 10 digits each
ranks = sorted(designs, key=lambda d: int(d["rank"]))
assert [int(d["rank"]) for d in ranks] == list(range(1, len(designs) + 1))
assert all(float(a["npc"]) <= float(b["npc"]) for a, b in zip(ranks, ranks[1:])), "rank is not NPC order"

# cash-flows.csv: whole years, row kinds, end-of-life timing in its own column, P/F closed form.
r = report["real_discount_rate"]
n = report["project_years"]
kinds = {}
for row in flows:
    assert re.fullmatch(r"[0-9]+", row["year"]), "year is not a whole number: " + row["year"]
    t = float(row["discount_time_years"])
    assert math.isclose(float(row["discount_factor"]), (1 + r) ** -t, rel_tol=1e-8), row
    assert row["replacements"] == "" or int(row["replacements"]) >= 0, row["replacements"]
    key = (row["profile"], row["dod_setpoint"], row["strings_parallel"])
    kinds.setdefault(key, []).append(row["row"])
    if row["row"] == "end_of_life":
        assert int(row["year"]) == math.ceil(t - 1e-9) and t >= n + 1 - 1e-9, row
    else:
        assert float(row["year"]) == t, row
# Replacements: the yearly counts and months add up to the design's lists in the JSON.
months_by_design = {}
for row in flows:
    if row["row"] == "operation":
        key = (row["profile"], float(row["dod_setpoint"]), int(row["strings_parallel"]))
        months = json.loads(row["replacement_months"])
        assert len(months) == int(row["replacements"]), row
        assert all(1 <= m <= 12 for m in months), row
        months_by_design.setdefault(key, []).extend(months)
for js in report["designs"]:
    key = (js["profile"], js["dod_setpoint"], js["strings_parallel"])
    assert months_by_design[key] == js["replacement_months"], (key, js["replacement_months"])
    assert len(js["replacement_months"]) == len(js["replacement_years"]), key
for key, seq in kinds.items():
    assert seq == ["investment"] + ["operation"] * n + ["end_of_life"], (key, seq)

# Both files carry the study title of the JSON on every row; evaluate runs no search, so its
# method is empty (no value).
for row in designs + flows:
    assert row["study"] == report["study"], row["study"]
    assert row["method"] == "", row["method"]
PY

# optimise: the same two columns carry the title and the JSON's search method; a title with a
# comma and quotes is quoted as RFC 4180 says, so the columns stay in place.
mkdir -p "$WORK/titled" && "$PY" - "$study" "$WORK/titled/study.yaml" <<'PY' || fail "could not write the titled study"
import os, re, sys
src, dst = sys.argv[1], sys.argv[2]
base = os.path.dirname(src)
text = open(src).read()
text = re.sub(r"(?m)^  title: .*$", '  title: "Saddle hut, \\"winter\\" case"', text, count=1)
# Paths relative to the demo's directory, made absolute for the copy.
text = re.sub(r"(?m)^(  site: |    - )(\S+\.yaml)$", lambda m: m.group(1) + os.path.join(base, m.group(2)), text)
open(dst, "w").write(text)
PY
expect_exit 0 -- "$STOWAGE" optimise --format json --out "$WORK/opt" "$WORK/titled/study.yaml" &&
  "$PY" - "$WORK/out" "$WORK/opt" <<'PY' || fail "optimise CSV study and method columns"
import csv, json, sys
report = json.load(open(sys.argv[1]))
assert report["study"] == 'Saddle hut, "winter" case', report["study"]
for name in ("designs.csv", "cash-flows.csv"):
    with open(f"{sys.argv[2]}/{name}", newline="") as f:
        rows = list(csv.reader(f))
    header = rows[0]
    assert header[-2:] == ["study", "method"], header[-2:]
    for r in rows[1:]:
        assert len(r) == len(header), (name, len(r), len(header))
        assert r[-2] == report["study"] and r[-1] == report["method"], (name, r[-2:])
    assert report["method"] in ("milp", "exhaustive", "bounded"), report["method"]
PY
finish
