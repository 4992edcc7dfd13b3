#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Inputs that are not plain files, or are built to exhaust the program: each is refused with
# exit 2 naming the file, line and field, within 30 s and 500 MB of address space. FIFOs and
# large files are made here, not kept in the fixture corpus.
source "$(dirname "$0")/common.bash"
FIX="$SRC/tests/catalog-schema/fixtures"

bounded() {
  timeout 30 bash -c 'ulimit -v 512000 && exec "$@"' bounded "$@"
}

# A study whose site and profile are the shared fixtures, with `extra` appended.
write_study() {
  printf 'study:\n  title: hostile\n  site: %s\n  profiles:\n    - %s\n  economics: {project_years: 20, real_discount_rate: 0.06, currency: EUR}\n%s' \
    "$2" "$FIX/lfp-test.yaml" "${3:-}" >"$1"
}

# A FIFO blocked in open() until a writer came: now it is refused before it is opened.
mkfifo "$WORK/fifo.yaml" "$WORK/fifo.csv"
expect_exit 2 -- bounded "$STOWAGE" check "$WORK/fifo.yaml" &&
  grep -qF "fifo.yaml:1:1: study: '$WORK/fifo.yaml' is a FIFO" "$WORK/err" || fail "FIFO study"
expect_exit 2 -- bounded "$STOWAGE" cycles "$WORK/fifo.csv" &&
  grep -qF "fifo.csv:1:1: (file):" "$WORK/err" || fail "FIFO SOC series"
write_study "$WORK/soc-fifo.yaml" "$FIX/site.yaml" "  soc_log: fifo.csv
"
expect_exit 2 -- bounded "$STOWAGE" check "$WORK/soc-fifo.yaml" &&
  grep -qF "soc-fifo.yaml:7:12: study.soc_log: SOC log: " "$WORK/err" &&
  grep -qF "is a FIFO" "$WORK/err" || fail "FIFO as study.soc_log"
sed "s#hourly: hourly.csv#hourly: $WORK/fifo.csv#" "$FIX/site.yaml" >"$WORK/site-fifo.yaml"
write_study "$WORK/hourly-fifo.yaml" "$WORK/site-fifo.yaml"
expect_exit 2 -- bounded "$STOWAGE" check "$WORK/hourly-fifo.yaml" &&
  grep -qF "site-fifo.yaml:6:11: site.hourly: hourly CSV:" "$WORK/err" || fail "FIFO as site.hourly"

# Devices named on the command line.
expect_exit 2 -- bounded "$STOWAGE" cycles /dev/zero &&
  grep -qF "/dev/zero:1:1: (file): '/dev/zero' is a character device" "$WORK/err" || fail "/dev/zero"
expect_exit 2 -- bounded "$STOWAGE" check /dev/stdin </dev/zero || fail "/dev/stdin fed by /dev/zero"

# 2 MB of nested brackets once took about 280 MB: refused by its size before it is parsed, and
# 200 kB of them (within the size limit) by the nesting depth at the first line that passes it.
"$PY" -c 'import sys; open(sys.argv[1], "w").write("study: " + "[" * 1000000 + "]" * 1000000 + "\n")' "$WORK/deep2m.yaml"
expect_exit 2 -- bounded "$STOWAGE" check "$WORK/deep2m.yaml" &&
  grep -qF "deep2m.yaml:1:1: study: " "$WORK/err" && grep -qF "more than the 256 KiB" "$WORK/err" || fail "2 MB nested YAML"
"$PY" -c 'import sys; open(sys.argv[1], "w").write("study:\n  title: x\n  designs: " + "[" * 100000 + "]" * 100000 + "\n")' "$WORK/deep.yaml"
expect_exit 2 -- bounded "$STOWAGE" check "$WORK/deep.yaml" &&
  grep -qF "deep.yaml:3:30: study.designs: collections nest more than 20" "$WORK/err" || fail "200 kB nested YAML"

# A CSV far beyond the size limit, and one line of 1 MB in a small one.
sed "s#hourly: hourly.csv#hourly: big.csv#" "$FIX/site.yaml" >"$WORK/site-big.yaml"
truncate -s 65M "$WORK/big.csv"
write_study "$WORK/big.yaml" "$WORK/site-big.yaml"
expect_exit 2 -- bounded "$STOWAGE" check "$WORK/big.yaml" &&
  grep -qF "site.hourly: hourly CSV:" "$WORK/err" && grep -qF "more than the 64 MiB" "$WORK/err" || fail "65 MB CSV"
"$PY" -c 'import sys; open(sys.argv[1], "w").write("time,soc\n" + "1" * 1000000 + "\n")' "$WORK/wide.csv"
expect_exit 2 -- bounded "$STOWAGE" cycles "$WORK/wide.csv" &&
  grep -qF "wide.csv:2:1: (line): the line is longer than 64 KiB" "$WORK/err" || fail "1 MB line"
finish
