#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# docs/tutorial.md cannot rot: its files and commands are extracted and run in order, in an
# empty directory, with `stowage` the binary under test. The markers in the tutorial (HTML
# comments, invisible when rendered) say what each fenced block is:
#   <!-- tutorial-file: NAME -->   the next block is written to NAME
#   <!-- tutorial-run [exit=N] --> the next block runs in bash (set -e), and must end with exit
#                                  N (default 0)
#   <!-- tutorial-output -->       each line of the next block other than "..." must appear in
#                                  the output (stdout and stderr) of the run before it, in order
# Every yaml or python block must be a file and every block after the first sh block must be
# marked, so nothing shown to the reader goes untested. When a change of the model or of a
# shipped profile moves a number shown there, update the tutorial's text with it.
source "$(dirname "$0")/common.bash"
mkdir -p "$WORK/bin" "$WORK/tutorial" && ln -s "$(realpath "$STOWAGE")" "$WORK/bin/stowage"
PATH="$WORK/bin:$PATH" STOWAGE_PROFILES="$SRC/catalog-schema/profiles" \
  "$PY" - "$SRC/docs/tutorial.md" "$WORK/tutorial" <<'PY' || fail "docs/tutorial.md does not run as written"
import re, subprocess, sys
text = open(sys.argv[1]).read()
work = sys.argv[2]
blocks = list(re.finditer(r"(?:<!-- (tutorial-[a-z]+)(?::? ([^>]*?))? -->\n)?```([a-z]*)\n(.*?)^```$", text, re.S | re.M))
assert len(blocks) >= 10, f"only {len(blocks)} fenced blocks found"
failures = []
last_output = None
files = runs = outputs = 0
for i, m in enumerate(blocks):
    kind, arg, lang, body = m.group(1), (m.group(2) or "").strip(), m.group(3), m.group(4)
    where = f"docs/tutorial.md:{text.count(chr(10), 0, m.start()) + 1}"
    if kind is None:
        # Only the setup block (export, mkdir) stands unmarked; the script does its part.
        if i == 0 and lang == "sh":
            continue
        failures.append(f"{where}: a {lang or 'plain'} block without a tutorial marker")
        continue
    if kind == "tutorial-file":
        assert lang in ("yaml", "python", "csv", "text"), (where, lang)
        open(f"{work}/{arg}", "w").write(body)
        files += 1
    elif kind == "tutorial-run":
        want = int(arg.split("=")[1]) if arg.startswith("exit=") else 0
        done = subprocess.run(["bash", "-e", "-c", body], cwd=work, stdout=subprocess.PIPE,
                              stderr=subprocess.STDOUT, text=True, timeout=120)
        last_output = done.stdout
        runs += 1
        if done.returncode != want:
            failures.append(f"{where}: exit {done.returncode}, the tutorial says {want}:\n{body}{done.stdout[-1500:]}")
    elif kind == "tutorial-output":
        assert last_output is not None, f"{where}: output before any run"
        outputs += 1
        pos = 0
        for line in body.splitlines():
            line = line.rstrip()
            if not line or line == "...":
                continue
            at = last_output.find(line, pos)
            if at < 0:
                failures.append(f"{where}: the output lacks (in this order) the line\n  {line}\n"
                                f"the output was:\n{last_output[:3000]}")
                break
            pos = at + len(line)
    else:
        failures.append(f"{where}: unknown marker {kind}")
if not (files >= 4 and runs >= 6 and outputs >= 5):
    failures.append(f"too few marked blocks: {files} files, {runs} runs, {outputs} outputs")
for f in failures:
    print("FAIL:", f, file=sys.stderr)
sys.exit(1 if failures else 0)
PY
finish
