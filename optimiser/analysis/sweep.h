// SPDX-License-Identifier: MIT
// Sensitivity sweeps over the variations of a study (catalog-schema/variations_loader.h).
//
// Tornado (one at a time): the base point (every input at its study value) and, per variation,
// the point with that input at its low and at its high end and every other input at base. Each
// point is re-optimised, or, with hold_designs, the base case's best design of each profile is
// evaluated as it is (scenario.h). Bars are sorted by their swing, |winner NPC at high - winner
// NPC at low|, largest first (ties: the order of the variations).
// Grid: one or two variations; each axis takes the variation's points (values or range) or,
// for the low/high form, `steps` evenly spaced values from low to high (whole-number paths:
// rounded, duplicates dropped). Points are row-major: the first axis varies slowest.
// Points run on `threads` threads (parallel.h); the result is the same for any thread count.
#pragma once

#include <string>
#include <vector>

#include "catalog-schema/variations_loader.h"
#include "optimiser/analysis/scenario.h"

namespace stowage {

struct SweepOptions {
  bool hold_designs = false;
  int threads = 0;  // <= 0: all cores
  int steps = 5;    // grid points of a low/high variation, >= 2
  OptimiseOptions optimise;
};

struct TornadoBar {
  Variation variation;
  PointOutcome low, high;
  double swing_npc = 0;         // |winner npc at high - at low|; NaN when an end has no winner
  bool winner_changes = false;  // the winning profile at low or high differs from the base's
};

struct TornadoResult {
  bool hold_designs = false;
  PointOutcome base;
  std::vector<TornadoBar> bars;
};

TornadoResult run_tornado(const StudyCase& study, const std::vector<Variation>& variations,
                          const SweepOptions& options);

struct GridResult {
  bool hold_designs = false;
  std::vector<Variation> axes;              // one or two
  std::vector<std::vector<double>> values;  // per axis
  std::vector<PointOutcome> points;         // row-major, first axis slowest
  PointOutcome base;
  const PointOutcome& at(std::size_t i, std::size_t j = 0) const {
    return points[i * (values.size() > 1 ? values[1].size() : 1) + j];
  }
};

// The values an axis takes (see above).
std::vector<double> axis_values(const Variation& variation, int steps);

GridResult run_grid(const StudyCase& study, const std::vector<Variation>& axes,
                    const SweepOptions& options);

// The base point and the options for every point of a run: with hold_designs, the base case is
// optimised once and its ranking's designs are held.
struct PreparedRun {
  PointOutcome base;
  PointOptions point;
};
PreparedRun prepare_run(const StudyCase& study, bool hold_designs, const OptimiseOptions& optimise);

}  // namespace stowage
