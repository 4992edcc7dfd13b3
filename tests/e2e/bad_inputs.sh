#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Every bad-input fixture (tests/catalog-schema/bad-inputs/NN-name/) must make `stowage check`
# exit 2 with a message holding each line of its expect.txt (file, line and field), within 30 s
# and 500 MB of address space (a hang or a memory blow-up fails the run, as does exit 1 or a
# signal); `stowage evaluate` must refuse it with exit 2 too, so check never passes a study
# that evaluate then refuses for the same input. A fixture with a tender.yaml instead must make
# `stowage tender` exit 2 the same way.
source "$(dirname "$0")/common.bash"
# Runs a command with at most 30 s and 500 MB of address space.
bounded() {
  timeout 30 bash -c 'ulimit -v 512000 && exec "$@"' bounded "$@"
}
count=0
for dir in "$SRC"/tests/catalog-schema/bad-inputs/*/; do
  dir=${dir%/}
  name=$(basename "$dir")
  if [ -f "$dir/tender.yaml" ]; then
    if expect_exit 2 -- bounded "$STOWAGE" tender "$dir/tender.yaml"; then
      while IFS= read -r want || [ -n "$want" ]; do
        [ -z "$want" ] && continue
        grep -qF -- "$want" "$WORK/err" || fail "$name: stderr lacks '$want': $(head -c 300 "$WORK/err")"
      done <"$dir/expect.txt"
      [ ! -s "$WORK/out" ] || fail "$name: printed to stdout despite the error"
    else
      fail "$name"
    fi
    continue
  fi
  [ -f "$dir/study.yaml" ] || continue
  count=$((count + 1))
  if expect_exit 2 -- bounded "$STOWAGE" check "$dir/study.yaml"; then
    while IFS= read -r want || [ -n "$want" ]; do
      [ -z "$want" ] && continue
      grep -qF -- "$want" "$WORK/err" || fail "$name: stderr lacks '$want': $(head -c 300 "$WORK/err")"
    done <"$dir/expect.txt"
    # Bad input never leaves a success line on stdout.
    [ ! -s "$WORK/out" ] || fail "$name: printed to stdout despite the error"
    expect_exit 2 -- bounded "$STOWAGE" evaluate "$dir/study.yaml" || fail "$name: evaluate"
  else
    fail "$name"
  fi
done
[ "$count" -ge 60 ] || fail "only $count bad-input fixtures, the suite needs at least 60"
finish
