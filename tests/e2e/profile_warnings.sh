#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# A profile whose cycle-life curve has lifetime throughput (cycles x DoD) falling toward shallow
# DoD still loads: the run succeeds and stderr carries one warning naming the file, the line and
# the field (constant Ah-throughput bound, common practice; docs/method.md 5). The exact power
# law N = 1000 D^-2 (throughput rising toward shallow DoD) gives no warning.
source "$(dirname "$0")/common.bash"
printf 'soc\n1.0\n0.5\n1.0\n' >"$WORK/soc.csv"
good="$SRC/tests/e2e/fixtures/power-law-profile.yaml"
expect_exit 0 -- "$STOWAGE" cycles --profile "$good" "$WORK/soc.csv" &&
  { [ -s "$WORK/err" ] && fail "sound curve: unexpected stderr: $(head -c 300 "$WORK/err")"; }
# Replace the curve by 15000 cycles at DoD 0.2 and 6000 at 0.8 (3000 vs 4800 full cycles).
"$PY" - "$good" "$WORK/dip.yaml" <<'PY'
import re, sys
text = open(sys.argv[1]).read()
curve = "    cycle_life:\n      - {dod: 0.2, cycles: 15000}\n      - {dod: 0.8, cycles: 6000}\n"
text, n = re.subn(r"    cycle_life:\n(      - [^\n]*\n)+", curve, text, count=1)
assert n == 1, "fixture has no cycle_life block"
open(sys.argv[2], "w").write(text)
PY
line=$(grep -n "cycles: 15000" "$WORK/dip.yaml" | cut -d: -f1)
expect_exit 0 -- "$STOWAGE" cycles --profile "$WORK/dip.yaml" "$WORK/soc.csv" && {
  [ "$(grep -c '^warning: ' "$WORK/err")" -eq 1 ] || fail "expected one warning: $(cat "$WORK/err")"
  grep -qF "warning: $WORK/dip.yaml:$line:" "$WORK/err" || fail "warning lacks file and line: $(cat "$WORK/err")"
  grep -qF "profile.ageing.cycle_life[0].cycles" "$WORK/err" || fail "warning lacks the field"
  grep -qF "more per kWh" "$WORK/err" || fail "warning does not say why it matters"
}
finish
