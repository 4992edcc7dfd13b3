#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Exit codes (0 success, 2 bad input, 1 internal error) and output safety of the command line.
source "$(dirname "$0")/common.bash"
study="$SRC/studies/tarnbeck-saddle/study.yaml"
expect_exit 0 -- "$STOWAGE" --help || true
expect_exit 0 -- "$STOWAGE" --version && grep -q "stowage" "$WORK/out" || fail "--version"
expect_exit 2 -- "$STOWAGE" no-such-command || true
expect_exit 2 -- "$STOWAGE" evaluate || true
expect_exit 2 -- "$STOWAGE" evaluate "$WORK/missing.yaml" && grep -q "missing.yaml" "$WORK/err" || fail "missing study file"
expect_exit 2 -- "$STOWAGE" evaluate --format xml "$study" || true
# --out onto a path that is a file: bad input, and nothing half-written next to it.
touch "$WORK/occupied"
expect_exit 2 -- "$STOWAGE" evaluate --out "$WORK/occupied" "$study" && grep -q "occupied" "$WORK/err" || fail "--out onto a file"
ls "$WORK" | grep -q partial && fail "partial file left behind"
# A file that is present but unreadable as YAML.
printf 'study: [unclosed\n' >"$WORK/broken.yaml"
expect_exit 2 -- "$STOWAGE" check "$WORK/broken.yaml" && grep -q "broken.yaml:" "$WORK/err" || fail "broken YAML"
finish
