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

std::vector<PointOutcome> evaluate_points(const StudyCase& study, const PointOptions& point,
                                          const PointList& points, std::size_t first,
                                          std::size_t last, int threads,
                                          const DoneCallback& progress) {
  if (first > last || last > points.size()) throw ContractViolation("last", "past the points");
  std::vector<PointOutcome> out(last - first);
  parallel_for(
      out.size(), threads,
      [&](std::size_t i) {
        out[i] = evaluate_point(with_settings(study, points[first + i]), point);
      },
      progress);
  return out;
}

PointList tornado_points(const std::vector<Variation>& variations) {
  PointList points;
  for (const Variation& v : variations) {
    points.push_back({{v.path, v.low}});
    points.push_back({{v.path, v.high}});
  }
  return points;
}

TornadoResult assemble_tornado(bool hold_designs, PointOutcome base,
                               const std::vector<Variation>& variations,
                               std::vector<PointOutcome> ends) {
  if (ends.size() != 2 * variations.size()) throw ContractViolation("ends", "two per variation");
  TornadoResult result;
  result.hold_designs = hold_designs;
  result.base = std::move(base);
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

TornadoResult run_tornado(const StudyCase& study, const std::vector<Variation>& variations,
                          const SweepOptions& options) {
  const PreparedRun run = prepare_run(study, options.hold_designs, options.optimise);
  const PointList points = tornado_points(variations);
  return assemble_tornado(options.hold_designs, run.base, variations,
                          evaluate_points(study, run.point, points, 0, points.size(),
                                          options.threads, options.progress));
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

void check_grid_axes(const std::vector<Variation>& axes) {
  if (axes.empty() || axes.size() > 2) throw ContractViolation("axes", "must be one or two");
  if (axes.size() == 2 && axes[0].path == axes[1].path) {
    throw ContractViolation("axes", "must name two different paths");
  }
}

PointList grid_points(const std::vector<Variation>& axes,
                      const std::vector<std::vector<double>>& values) {
  check_grid_axes(axes);
  PointList points;
  const std::size_t columns = axes.size() > 1 ? values[1].size() : 1;
  for (std::size_t i = 0; i < values[0].size() * columns; ++i) {
    std::vector<Setting> settings{{axes[0].path, values[0][i / columns]}};
    if (axes.size() > 1) settings.push_back({axes[1].path, values[1][i % columns]});
    points.push_back(std::move(settings));
  }
  return points;
}

GridResult assemble_grid(bool hold_designs, PointOutcome base, std::vector<Variation> axes,
                         std::vector<std::vector<double>> values,
                         std::vector<PointOutcome> points) {
  GridResult grid;
  grid.hold_designs = hold_designs;
  grid.axes = std::move(axes);
  grid.values = std::move(values);
  grid.base = std::move(base);
  grid.points = std::move(points);
  return grid;
}

GridResult run_grid(const StudyCase& study, const std::vector<Variation>& axes,
                    const SweepOptions& options) {
  check_grid_axes(axes);
  const PreparedRun run = prepare_run(study, options.hold_designs, options.optimise);
  std::vector<std::vector<double>> values;
  for (const Variation& v : axes) values.push_back(axis_values(v, options.steps));
  const PointList points = grid_points(axes, values);
  return assemble_grid(options.hold_designs, run.base, axes, values,
                       evaluate_points(study, run.point, points, 0, points.size(), options.threads,
                                       options.progress));
}

}  // namespace stowage
