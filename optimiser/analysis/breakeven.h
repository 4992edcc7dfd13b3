// SPDX-License-Identifier: MIT
// Break-even: the value of one input (a parameter path) in [from, to] at which the best design
// of one profile P ties the best design of every other profile, i.e. where
//   gap(x) = NPC of P's best design at x - lowest NPC of any other profile's best design at x
// changes sign (gap < 0: P wins). Every evaluation is exact: each point is re-optimised
// (or, with hold_designs, the base case's designs are evaluated as they are; scenario.h).
// A profile with no design meeting the study's limits at x has gap +inf (P cannot win) or, for
// the rivals, -inf.
// Method: bracketing, then bisection.
//   1. gap at from, to and `scan_points` evenly spaced values between them (in parallel);
//   2. the first adjacent pair, from `from` up, whose gaps have opposite signs (or one is 0)
//      brackets the crossing; none: no crossing in the range (a crossing and its return
//      between two scanned values can be missed; a finer scan finds them);
//   3. bisection of the bracket until its width is at most `tolerance` (whole-number paths:
//      until the ends are adjacent whole numbers);
//   4. the value reported is the zero of the straight line through the bracket's ends (the
//      bracket's lower end when either gap is infinite). gap is piecewise smooth: a
//      replacement moving by a year or a design change makes it jump. The result says `step`
//      when the gaps at the final bracket's ends differ by more than 0.1 % of the winner's NPC:
//      then the profiles swap places at a jump, not at a tie.
// The profile defaults to the runner-up of the base case (the base winner is then the rival).
// Progress: `progress`, when given, is called once after each exact evaluation (scan value or
// bisection step, not the base case), one call at a time, with the evaluations done so far and
// the total planned: during the scan, the scan's values plus the bisection steps one scan
// interval needs (they run only if the scan brackets a crossing); during the bisection, the
// evaluations done plus the steps the current bracket still needs (exact for a continuous path,
// an upper bound for a whole-number one). The last call of a run that finds a crossing has
// done == total. It is for display and must not touch the result.
#pragma once

#include <cstddef>
#include <functional>
#include <string>
#include <vector>

#include "optimiser/analysis/scenario.h"

namespace stowage {

struct BreakevenOptions {
  std::string path;
  double from = 0, to = 0;  // from < to, both applicable to the path
  std::string profile_id;   // empty: the base case's runner-up
  double tolerance = 0;     // > 0; 0: (to - from) x 1e-4
  int scan_points = 8;      // interior values of the bracketing scan, >= 0
  bool hold_designs = false;
  int threads = 0;
  OptimiseOptions optimise;
  std::function<void(std::size_t done, std::size_t total)> progress;  // may be empty
};

struct BreakevenProbe {
  double value = 0;
  double profile_npc = 0;  // NaN when the profile has no feasible design
  double rival_npc = 0;    // lowest other profile's NPC; NaN when none
  std::string rival_id;    // empty when none
  double gap = 0;          // profile_npc - rival_npc, +-inf as above
};

struct BreakevenResult {
  std::string path, unit, profile_id;
  double from = 0, to = 0, tolerance = 0;
  bool whole_number = false;
  bool hold_designs = false;
  std::vector<BreakevenProbe> scan;       // ascending value
  std::vector<BreakevenProbe> bisection;  // in the order evaluated
  bool crossing = false;
  double bracket_low = 0, bracket_high = 0;  // final bracket (crossing only)
  BreakevenProbe at_low, at_high;            // its ends
  double value = 0;                          // estimated break-even value (crossing only)
  bool step = false;                         // the gap jumps across the final bracket
  bool profile_wins_at_from = false;         // gap <= 0 at from
};

// Throws InvalidValue for a path or values the study refuses, an unknown profile id, or a
// base case with a single profile and no profile named; ContractViolation for bad options.
BreakevenResult find_breakeven(const StudyCase& study, const BreakevenOptions& options);

}  // namespace stowage
