// SPDX-License-Identifier: MIT
#include "model/cycle_life_curve.h"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <string>

#include "model/invalid_value.h"

namespace stowage {

namespace {
std::string point_field(std::size_t i, const char* member) {
  return "[" + std::to_string(i) + "]." + member;
}
}  // namespace

CycleLifeCurve::CycleLifeCurve(std::vector<CycleLifePoint> points) {
  if (points.size() < 2) throw InvalidValue("", "needs at least two (dod, cycles) points");
  for (std::size_t i = 0; i < points.size(); ++i) {
    const auto& p = points[i];
    if (!(p.dod > 0 && p.dod <= 1)) throw InvalidValue(point_field(i, "dod"), "must be in (0, 1]");
    if (!(p.cycles > 0) || !std::isfinite(p.cycles))
      throw InvalidValue(point_field(i, "cycles"), "must be a positive number");
  }
  // Validate in the caller's order so the message names the point as written.
  std::vector<std::size_t> order(points.size());
  for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
  std::sort(order.begin(), order.end(),
            [&](std::size_t a, std::size_t b) { return points[a].dod < points[b].dod; });
  for (std::size_t k = 1; k < order.size(); ++k) {
    const auto& lo = points[order[k - 1]];
    const auto& hi = points[order[k]];
    if (hi.dod == lo.dod)
      throw InvalidValue(point_field(order[k], "dod"), "the same DoD appears twice");
    if (!(hi.cycles < lo.cycles))
      throw InvalidValue(point_field(order[k], "cycles"),
                         "cycle life must decrease as DoD grows (" + std::to_string(hi.cycles) +
                             " cycles at DoD " + std::to_string(hi.dod) + " is not below " +
                             std::to_string(lo.cycles) + " at DoD " + std::to_string(lo.dod) + ")");
  }
  for (std::size_t i : order) points_.push_back(points[i]);
  for (const auto& p : points_) {
    log_dod_.push_back(std::log(p.dod));
    log_cycles_.push_back(std::log(p.cycles));
  }
  for (std::size_t k = 1; k < points_.size(); ++k)
    slope_.push_back((log_cycles_[k] - log_cycles_[k - 1]) / (log_dod_[k] - log_dod_[k - 1]));
}

double CycleLifeCurve::cycles_to_end_of_life(double depth) const {
  const double x = std::log(depth);
  if (x < log_dod_.front()) {
    // Below the table: the first segment's slope, but never flatter than constant charge
    // throughput (slope -1), or ever shallower cycles would do more damage per Ah moved.
    const double slope = std::min(slope_.front(), -1.0);
    return std::exp(log_cycles_.front() + slope * (x - log_dod_.front()));
  }
  // Segment k spans points k and k+1; above the table the last segment extends.
  std::size_t k = 0;
  const std::size_t last = slope_.size() - 1;
  while (k < last && x > log_dod_[k + 1]) ++k;
  return std::exp(log_cycles_[k] + slope_[k] * (x - log_dod_[k]));
}

double CycleLifeCurve::damage_per_cycle(double depth) const {
  if (!(depth > 0)) return 0.0;
  return 1.0 / cycles_to_end_of_life(depth);
}

PowerLawFit CycleLifeCurve::power_law_fit() const {
  // log N = log N100 - k log D, least squares over the points.
  const Eigen::Index n = static_cast<Eigen::Index>(points_.size());
  Eigen::MatrixXd a(n, 2);
  Eigen::VectorXd b(n);
  for (Eigen::Index i = 0; i < n; ++i) {
    a(i, 0) = 1.0;
    a(i, 1) = log_dod_[static_cast<std::size_t>(i)];
    b(i) = log_cycles_[static_cast<std::size_t>(i)];
  }
  const Eigen::Vector2d coef = a.colPivHouseholderQr().solve(b);
  return PowerLawFit{std::exp(coef(0)), -coef(1)};
}

}  // namespace stowage
