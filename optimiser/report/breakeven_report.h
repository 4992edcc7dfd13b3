// SPDX-License-Identifier: MIT
// How a break-even search is shown (optimiser/analysis/breakeven.h): the question (which
// profile against which, over what range, how the points are evaluated), the bracketing scan
// as a table, then the answer: the value at which the profile ties the cheapest other profile
// with its bracket and tolerance, a note when the profiles swap at a jump rather than a tie,
// or that there is no crossing in the range and which side wins throughout.
// JSON (stable field names, docs/usage.md): path, unit, profile, from, to, tolerance,
// hold_designs, crossing, value (null without a crossing), bracket_low/high, step,
// profile_wins_at_from, scan and bisection (lists of {value, profile_npc, rival, rival_npc,
// gap}). CSV (probes.csv): one row per evaluated value, scan first, then bisection.
#pragma once

#include <ostream>

#include "catalog-schema/study_case.h"
#include "optimiser/analysis/breakeven.h"

namespace stowage::report {

void write_breakeven_text(std::ostream& out, const StudyCase& study, const BreakevenResult& r);
void write_breakeven_json(std::ostream& out, const StudyCase& study, const BreakevenResult& r);
void write_breakeven_csv(std::ostream& out, const BreakevenResult& r);

}  // namespace stowage::report
