// SPDX-License-Identifier: MIT
#include "optimiser/analysis/breakeven.h"

#include <cmath>
#include <limits>

#include "catalog-schema/parameter_paths.h"
#include "model/contract.h"
#include "model/invalid_value.h"
#include "optimiser/analysis/parallel.h"
#include "optimiser/analysis/sweep.h"

namespace stowage {

namespace {

constexpr double kInf = std::numeric_limits<double>::infinity();
constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();
constexpr double kStepShareOfNpc = 0.001;

BreakevenProbe probe_of(double value, const PointOutcome& p, const std::string& profile) {
  BreakevenProbe probe;
  probe.value = value;
  probe.profile_npc = kNaN;
  probe.rival_npc = kNaN;
  for (const DesignSummary& d : p.ranking) {
    if (d.profile_id == profile) {
      if (std::isnan(probe.profile_npc)) probe.profile_npc = d.npc;
    } else if (probe.rival_id.empty()) {
      probe.rival_id = d.profile_id;
      probe.rival_npc = d.npc;
    }
  }
  if (std::isnan(probe.profile_npc)) {
    probe.gap = kInf;
  } else if (probe.rival_id.empty()) {
    probe.gap = -kInf;
  } else {
    probe.gap = probe.profile_npc - probe.rival_npc;
  }
  return probe;
}

bool wins(const BreakevenProbe& p) { return p.gap <= 0; }

// Bisection steps that shrink a bracket of `width` to `tolerance` or less, the way the loop in
// find_breakeven() does: halving (whole numbers: the larger half, so an upper bound).
std::size_t bisection_steps(double width, double tolerance, bool whole_number) {
  std::size_t steps = 0;
  while (width > tolerance) {
    width = whole_number ? std::ceil(0.5 * width) : 0.5 * width;
    ++steps;
  }
  return steps;
}

}  // namespace

BreakevenResult find_breakeven(const StudyCase& study, const BreakevenOptions& options) {
  if (!(options.from < options.to)) throw ContractViolation("from", "must be below to");
  if (options.tolerance < 0) throw ContractViolation("tolerance", "must not be negative");
  if (options.scan_points < 0) throw ContractViolation("scan_points", "must not be negative");
  const ParameterInfo info = find_parameter(study, options.path);
  const PreparedRun run = prepare_run(study, options.hold_designs, options.optimise);
  BreakevenResult result;
  result.path = options.path;
  result.unit = info.unit;
  result.from = options.from;
  result.to = options.to;
  result.whole_number = info.whole_number;
  result.hold_designs = options.hold_designs;
  result.tolerance = options.tolerance > 0 ? options.tolerance : (options.to - options.from) * 1e-4;
  if (result.whole_number) result.tolerance = std::max(1.0, std::round(result.tolerance));
  result.profile_id = options.profile_id;
  if (result.profile_id.empty()) {
    if (run.base.ranking.size() < 2) {
      throw InvalidValue("profile",
                         "the base case has fewer than two profiles with a feasible design, so "
                         "there is no runner-up to follow; name a profile");
    }
    result.profile_id = run.base.ranking[1].profile_id;
  } else if (!study.find_profile(result.profile_id)) {
    std::string all;
    for (const ChemistryProfile& p : study.profiles) all += (all.empty() ? "" : ", ") + p.id;
    throw InvalidValue("profile", "'" + result.profile_id +
                                      "' is not a profile of the study; its profiles are: " + all);
  }

  const auto probe_at = [&](double x) {
    return probe_of(x, evaluate_point(with_settings(study, {{options.path, x}}), run.point),
                    result.profile_id);
  };

  std::vector<double> xs;
  const int n = options.scan_points + 2;
  for (int i = 0; i < n; ++i) {
    double x = i + 1 == n ? options.to : options.from + (options.to - options.from) * i / (n - 1);
    if (result.whole_number) x = std::round(x);
    if (xs.empty() || xs.back() != x) xs.push_back(x);
  }
  result.scan.resize(xs.size());
  DoneCallback scan_done;
  if (options.progress) {
    const double interval = xs.size() > 1 ? xs[1] - xs[0] : 0;
    const std::size_t planned =
        xs.size() + bisection_steps(interval, result.tolerance, result.whole_number);
    scan_done = [&options, planned](std::size_t done) { options.progress(done, planned); };
  }
  parallel_for(
      xs.size(), options.threads, [&](std::size_t i) { result.scan[i] = probe_at(xs[i]); },
      scan_done);
  result.profile_wins_at_from = wins(result.scan.front());

  for (std::size_t i = 0; i + 1 < result.scan.size(); ++i) {
    if (wins(result.scan[i]) == wins(result.scan[i + 1])) continue;
    result.crossing = true;
    BreakevenProbe lo = result.scan[i], hi = result.scan[i + 1];
    while (hi.value - lo.value > result.tolerance) {
      double mid = 0.5 * (lo.value + hi.value);
      if (result.whole_number) {
        mid = std::floor(mid);
        if (mid <= lo.value || mid >= hi.value) break;
      }
      const BreakevenProbe m = probe_at(mid);
      result.bisection.push_back(m);
      if (wins(m) == wins(lo)) {
        lo = m;
      } else {
        hi = m;
      }
      if (options.progress) {
        const std::size_t done = result.scan.size() + result.bisection.size();
        options.progress(done, done + bisection_steps(hi.value - lo.value, result.tolerance,
                                                      result.whole_number));
      }
    }
    result.bracket_low = lo.value;
    result.bracket_high = hi.value;
    result.at_low = lo;
    result.at_high = hi;
    if (std::isfinite(lo.gap) && std::isfinite(hi.gap) && lo.gap != hi.gap) {
      result.value = lo.value + (hi.value - lo.value) * (0 - lo.gap) / (hi.gap - lo.gap);
      result.value = std::min(hi.value, std::max(lo.value, result.value));
      const double scale = std::fabs(std::isfinite(lo.rival_npc) ? lo.rival_npc : lo.profile_npc);
      result.step = std::fabs(hi.gap - lo.gap) > kStepShareOfNpc * scale;
    } else {
      result.value = lo.gap == 0 ? lo.value : hi.gap == 0 ? hi.value : lo.value;
      result.step = !(std::isfinite(lo.gap) && std::isfinite(hi.gap));
    }
    // Whole numbers: the first value on the far side of the crossing.
    if (result.whole_number) result.value = hi.value;
    break;
  }
  return result;
}

}  // namespace stowage
