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
// A run can be split (shards.h): the points are listed first (tornado_points, grid_points),
// any slice of them is evaluated (evaluate_points), and the result is assembled from all of
// them (assemble_tornado, assemble_grid); run_tornado and run_grid do exactly that in one go.
#pragma once

#include <string>
#include <vector>

#include "catalog-schema/variations_loader.h"
#include "optimiser/analysis/parallel.h"
#include "optimiser/analysis/scenario.h"

namespace stowage {

struct SweepOptions {
  bool hold_designs = false;
  int threads = 0;  // <= 0: all cores
  int steps = 5;    // grid points of a low/high variation, >= 2
  OptimiseOptions optimise;
  DoneCallback progress;  // after each point (parallel.h); may be empty
};

// The settings of one point each.
using PointList = std::vector<std::vector<Setting>>;

// Evaluates points [first, last) of `points`, each applied to a copy of `study`, on `threads`
// threads; element i of the answer is point first + i.
std::vector<PointOutcome> evaluate_points(const StudyCase& study, const PointOptions& point,
                                          const PointList& points, std::size_t first,
                                          std::size_t last, int threads,
                                          const DoneCallback& progress = {});

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
// A tornado's points: per variation its low, then its high.
PointList tornado_points(const std::vector<Variation>& variations);
// The bars from the outcomes of tornado_points (same order).
TornadoResult assemble_tornado(bool hold_designs, PointOutcome base,
                               const std::vector<Variation>& variations,
                               std::vector<PointOutcome> ends);

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
// ContractViolation unless there are one or two axes on different paths.
void check_grid_axes(const std::vector<Variation>& axes);
// A grid's points, row-major (first axis slowest), from each axis's values.
PointList grid_points(const std::vector<Variation>& axes,
                      const std::vector<std::vector<double>>& values);
GridResult assemble_grid(bool hold_designs, PointOutcome base, std::vector<Variation> axes,
                         std::vector<std::vector<double>> values, std::vector<PointOutcome> points);

// The base point and the options for every point of a run: with hold_designs, the base case is
// optimised once and its ranking's designs are held.
struct PreparedRun {
  PointOutcome base;
  PointOptions point;
};
PreparedRun prepare_run(const StudyCase& study, bool hold_designs, const OptimiseOptions& optimise);

}  // namespace stowage
