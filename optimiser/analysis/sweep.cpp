// SPDX-License-Identifier: MIT
#include "optimiser/analysis/sweep.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "model/contract.h"
#include "optimiser/analysis/parallel.h"

namespace stowage {

PreparedRun prepare_run(const StudyCase& study, bool hold_designs,
                        const OptimiseOptions& optimise_options) {
  PreparedRun run;
  run.point.optimise = optimise_options;
  run.point.optimise.progress = nullptr;  // points run on many threads
  if (hold_designs) {
    const OptimiseResult base = optimise(study, run.point.optimise);
    run.point.held = held_designs(base);
    run.point.hold_designs = true;
  }
  // Held: the base point evaluates the held designs, which are exactly optimise()'s ranking.
  run.base = evaluate_point(study, run.point);
  return run;
}

namespace {

const std::string& winner_id(const PointOutcome& p) {
  static const std::string none;
  return p.feasible() ? p.winner().profile_id : none;
}

}  // namespace

TornadoResult run_tornado(const StudyCase& study, const std::vector<Variation>& variations,
                          const SweepOptions& options) {
  const PreparedRun run = prepare_run(study, options.hold_designs, options.optimise);
  TornadoResult result;
  result.hold_designs = options.hold_designs;
  result.base = run.base;
  std::vector<PointOutcome> ends(2 * variations.size());
  parallel_for(ends.size(), options.threads, [&](std::size_t i) {
    const Variation& v = variations[i / 2];
    const double value = i % 2 == 0 ? v.low : v.high;
    ends[i] = evaluate_point(with_settings(study, {{v.path, value}}), run.point);
  });
  for (std::size_t k = 0; k < variations.size(); ++k) {
    TornadoBar bar;
    bar.variation = variations[k];
    bar.low = std::move(ends[2 * k]);
    bar.high = std::move(ends[2 * k + 1]);
    bar.swing_npc = bar.low.feasible() && bar.high.feasible()
                        ? std::fabs(bar.high.winner().npc - bar.low.winner().npc)
                        : std::numeric_limits<double>::quiet_NaN();
    bar.winner_changes = winner_id(bar.low) != winner_id(result.base) ||
                         winner_id(bar.high) != winner_id(result.base);
    result.bars.push_back(std::move(bar));
  }
  // NaN swings (an end with no feasible design) go last.
  std::stable_sort(result.bars.begin(), result.bars.end(),
                   [](const TornadoBar& a, const TornadoBar& b) {
                     const double x = std::isnan(a.swing_npc) ? -1 : a.swing_npc;
                     const double y = std::isnan(b.swing_npc) ? -1 : b.swing_npc;
                     return x > y;
                   });
  return result;
}

std::vector<double> axis_values(const Variation& v, int steps) {
  if (!v.points.empty()) return v.points;
  if (steps < 2) throw ContractViolation("steps", "must be at least 2");
  std::vector<double> out;
  for (int i = 0; i < steps; ++i) {
    double x = i + 1 == steps ? v.high : v.low + (v.high - v.low) * i / (steps - 1);
    if (v.whole_number) x = std::round(x);
    if (out.empty() || out.back() != x) out.push_back(x);
  }
  return out;
}

GridResult run_grid(const StudyCase& study, const std::vector<Variation>& axes,
                    const SweepOptions& options) {
  if (axes.empty() || axes.size() > 2) throw ContractViolation("axes", "must be one or two");
  if (axes.size() == 2 && axes[0].path == axes[1].path) {
    throw ContractViolation("axes", "must name two different paths");
  }
  const PreparedRun run = prepare_run(study, options.hold_designs, options.optimise);
  GridResult grid;
  grid.hold_designs = options.hold_designs;
  grid.axes = axes;
  grid.base = run.base;
  for (const Variation& v : axes) grid.values.push_back(axis_values(v, options.steps));
  const std::size_t columns = axes.size() > 1 ? grid.values[1].size() : 1;
  grid.points.resize(grid.values[0].size() * columns);
  parallel_for(grid.points.size(), options.threads, [&](std::size_t i) {
    std::vector<Setting> settings{{axes[0].path, grid.values[0][i / columns]}};
    if (axes.size() > 1) settings.push_back({axes[1].path, grid.values[1][i % columns]});
    grid.points[i] = evaluate_point(with_settings(study, settings), run.point);
  });
  return grid;
}

}  // namespace stowage
