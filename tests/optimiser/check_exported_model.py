#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Solve a free-MPS model written by `stowage optimise --export-model` with two solvers that
share no code with GLPK -- COIN-OR CBC (the `cbc` binary) and HiGHS through SciPy's
scipy.optimize.milp -- and require both optima to equal GLPK's within a relative tolerance.

SciPy reads no model files, so this script parses the free MPS itself: NAME, ROWS (N/L/G/E),
COLUMNS with MARKER INTORG/INTEND, RHS (objective-row RHS = minus the objective constant),
RANGES (sign rules of the MPS format), BOUNDS (UP/LO/FX/BV/LI/UI/FR/MI/PL). Defaults follow the
format as GLPK writes it: a column is [0, +inf); an integer column between INTORG/INTEND with
no bounds is [0, 1] in GLPK's reading of MPS -- GLPK always writes explicit bounds for its
integer columns, so the script flags any integer column left without one.

CBC 2.10 reads the BOUNDS section of GLPK's free MPS as fixed-format MPS ("No match for
column"), so CBC is given the same model exported in CPLEX LP format (MODEL.lp, written by
`--export-model FILE.lp`) when one is passed; HiGHS always gets the free MPS via this parser.

Usage: check_exported_model.py GLPK_OBJECTIVE MODEL.mps [MODEL.lp] [--tol REL_TOL]
Exit 0 when both solvers agree with GLPK, 1 on a mismatch, 2 on a usage or solver error.
"""
import math
import re
import subprocess
import sys

import numpy as np
from scipy.optimize import Bounds, LinearConstraint, milp
from scipy.sparse import coo_matrix


def parse_free_mps(path):
    rows = {}          # name -> type
    row_order = []
    objective = None
    cols = {}          # name -> index
    col_names = []
    integer = []
    entries = []       # (row name, col index, value)
    rhs = {}
    ranges = {}
    lower = []
    upper = []
    bounded = []
    section = None
    in_int = False
    with open(path) as f:
        for raw in f:
            line = raw.rstrip("\n")
            if not line.strip() or line.startswith("*"):
                continue
            if not line[0].isspace():
                section = line.split()[0]
                continue
            tok = line.split()
            if section == "ROWS":
                kind, name = tok[0], tok[1]
                if kind == "N":
                    if objective is None:
                        objective = name
                    continue
                rows[name] = kind
                row_order.append(name)
            elif section == "COLUMNS":
                if len(tok) >= 3 and tok[1] == "'MARKER'":
                    in_int = tok[2] == "'INTORG'"
                    continue
                name = tok[0]
                if name not in cols:
                    cols[name] = len(col_names)
                    col_names.append(name)
                    integer.append(in_int)
                    lower.append(0.0)
                    upper.append(math.inf)
                    bounded.append(False)
                j = cols[name]
                for k in range(1, len(tok), 2):
                    entries.append((tok[k], j, float(tok[k + 1])))
            elif section == "RHS":
                body = tok[1:] if len(tok) % 2 == 1 else tok
                for k in range(0, len(body), 2):
                    rhs[body[k]] = float(body[k + 1])
            elif section == "RANGES":
                body = tok[1:] if len(tok) % 2 == 1 else tok
                for k in range(0, len(body), 2):
                    ranges[body[k]] = float(body[k + 1])
            elif section == "BOUNDS":
                kind = tok[0]
                name = tok[2] if len(tok) >= 3 and tok[2] in cols else tok[1]
                value = float(tok[-1]) if kind not in ("FR", "MI", "PL", "BV") else None
                j = cols[name]
                bounded[j] = True
                if kind == "UP":
                    upper[j] = value
                    if value < 0 and lower[j] == 0:
                        lower[j] = -math.inf
                elif kind == "LO":
                    lower[j] = value
                elif kind == "FX":
                    lower[j] = upper[j] = value
                elif kind == "FR":
                    lower[j], upper[j] = -math.inf, math.inf
                elif kind == "MI":
                    lower[j] = -math.inf
                elif kind == "PL":
                    upper[j] = math.inf
                elif kind == "BV":
                    lower[j], upper[j] = 0.0, 1.0
                    integer[j] = True
                elif kind == "LI":
                    lower[j] = value
                    integer[j] = True
                elif kind == "UI":
                    upper[j] = value
                    integer[j] = True
                else:
                    raise ValueError("unknown bound type " + kind)
    for j, is_int in enumerate(integer):
        if is_int and not bounded[j]:
            upper[j] = 1.0  # integer marker without bounds: binary in GLPK's reading
    n = len(col_names)
    c = np.zeros(n)
    row_index = {name: i for i, name in enumerate(row_order)}
    ri, ci, vi = [], [], []
    for row, j, v in entries:
        if row == objective:
            c[j] += v
        else:
            ri.append(row_index[row])
            ci.append(j)
            vi.append(v)
    m = len(row_order)
    lo = np.full(m, -np.inf)
    hi = np.full(m, np.inf)
    for name, i in row_index.items():
        b = rhs.get(name, 0.0)
        kind = rows[name]
        r = ranges.get(name)
        if kind == "E":
            if r is None:
                lo[i] = hi[i] = b
            elif r > 0:
                lo[i], hi[i] = b, b + abs(r)
            else:
                lo[i], hi[i] = b - abs(r), b
        elif kind == "L":
            hi[i] = b
            if r is not None:
                lo[i] = b - abs(r)
        elif kind == "G":
            lo[i] = b
            if r is not None:
                hi[i] = b + abs(r)
    constant = -rhs.get(objective, 0.0)
    a = coo_matrix((vi, (ri, ci)), shape=(m, n)).tocsr()
    return c, a, lo, hi, np.array(lower), np.array(upper), np.array(integer, dtype=int), constant


def solve_scipy(path):
    c, a, lo, hi, lb, ub, integrality, constant = parse_free_mps(path)
    res = milp(c, constraints=LinearConstraint(a, lo, hi), bounds=Bounds(lb, ub),
               integrality=integrality, options={"mip_rel_gap": 1e-9, "disp": False})
    if res.status != 0:
        raise RuntimeError("scipy.optimize.milp: " + res.message)
    return res.fun + constant


def solve_cbc(path):
    out = subprocess.run(["cbc", path, "-ratioGap", "1e-9", "-solve", "-quit"],
                         capture_output=True, text=True, timeout=600).stdout
    m = re.search(r"Objective value:\s*([-+0-9.eE]+)", out)
    if not m or "Optimal" not in out:
        raise RuntimeError("cbc did not report an optimum:\n" + out[-2000:])
    return float(m.group(1))


def main(argv):
    args = list(argv[1:])
    tol = 1e-6
    if "--tol" in args:
        k = args.index("--tol")
        tol = float(args[k + 1])
        del args[k:k + 2]
    if len(args) not in (2, 3):
        print(__doc__, file=sys.stderr)
        return 2
    expected, mps = float(args[0]), args[1]
    cbc_input = args[2] if len(args) == 3 else mps
    try:
        results = {"CBC": solve_cbc(cbc_input), "SciPy/HiGHS": solve_scipy(mps)}
    except Exception as e:  # a solver that fails is a failed check, with its reason
        print("error:", e, file=sys.stderr)
        return 2
    ok = True
    for solver, value in results.items():
        rel = abs(value - expected) / max(1.0, abs(expected))
        print(f"{solver}: {value:.10g}  GLPK: {expected:.10g}  relative difference {rel:.2e}")
        ok = ok and rel <= tol
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main(sys.argv))
