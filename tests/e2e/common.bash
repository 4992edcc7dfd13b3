# SPDX-License-Identifier: MIT
# Shared helpers of the end-to-end scripts: each script gets the stowage binary as $1 and the
# source tree as $2, runs the real binary and fails (exit 1) with a message on the first
# broken expectation.
set -u
STOWAGE=$1
SRC=$2
PY=/usr/bin/python3
WORK=$(mktemp -d)
trap 'rm -rf "$WORK"' EXIT
failures=0

fail() {
  echo "FAIL: $*" >&2
  failures=$((failures + 1))
}

# expect_exit CODE -- command...: runs the command, keeps stdout/stderr in $WORK/out, $WORK/err.
expect_exit() {
  local want=$1
  shift 2
  "$@" >"$WORK/out" 2>"$WORK/err"
  local got=$?
  if [ "$got" -ne "$want" ]; then
    fail "exit $got (wanted $want): $*"
    sed 's/^/    stderr: /' "$WORK/err" | head -5 >&2
    return 1
  fi
  return 0
}

finish() {
  if [ "$failures" -gt 0 ]; then
    echo "$failures failure(s)" >&2
    exit 1
  fi
  echo "all checks passed"
  exit 0
}
