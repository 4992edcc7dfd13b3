#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Every bad-input fixture (tests/catalog-schema/bad-inputs/NN-name/) must make `stowage check`
# exit 2 with a message holding each line of its expect.txt (file, line and field).
source "$(dirname "$0")/common.bash"
count=0
for dir in "$SRC"/tests/catalog-schema/bad-inputs/*/; do
  dir=${dir%/}
  [ -f "$dir/study.yaml" ] || continue
  count=$((count + 1))
  name=$(basename "$dir")
  if expect_exit 2 -- "$STOWAGE" check "$dir/study.yaml"; then
    while IFS= read -r want || [ -n "$want" ]; do
      [ -z "$want" ] && continue
      grep -qF -- "$want" "$WORK/err" || fail "$name: stderr lacks '$want': $(head -c 300 "$WORK/err")"
    done <"$dir/expect.txt"
    # Bad input never leaves a success line on stdout.
    [ ! -s "$WORK/out" ] || fail "$name: printed to stdout despite the error"
  else
    fail "$name"
  fi
done
[ "$count" -ge 15 ] || fail "only $count bad-input fixtures, the suite needs at least 15"
finish
