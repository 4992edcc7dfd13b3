// SPDX-License-Identifier: MIT
// CycleLifeCurve: cycles to end of life against depth of discharge, at the reference temperature.
//
// Input: points (DoD as a fraction in (0, 1], cycles > 0) that must be strictly decreasing in
// cycles as DoD grows; at least two points. Between points the curve is interpolated linearly in
// log-log space (a piecewise power law). Above the deepest point the last segment extends.
// Below the shallowest point the first segment extends, but never flatter than constant charge
// throughput N(D) = N(D_min) D_min / D: a flatter slope would make ever shallower cycles do more
// damage per ampere-hour, which no published cycle-life data show. `power_law_fit()` gives the
// least-squares fit N = N100 * DoD^-k in log-log space (the usual Woehler-type form), solved with
// Eigen. Damage of one full cycle of depth D is 1 / N(D) (Palmgren-Miner); a zero depth does no
// damage.
#pragma once

#include <vector>

namespace stowage {

struct CycleLifePoint {
  double dod = 0;     // depth of discharge, fraction in (0, 1]
  double cycles = 0;  // full cycles to end of life at that depth
};

struct PowerLawFit {
  double cycles_at_full_depth = 0;  // N100
  double exponent = 0;              // k in N = N100 * DoD^-k
};

class CycleLifeCurve {
 public:
  // Throws InvalidValue with fields "[i].dod" / "[i].cycles" naming the offending point.
  explicit CycleLifeCurve(std::vector<CycleLifePoint> points);

  // Cycles to end of life at `depth` (fraction, > 0).
  double cycles_to_end_of_life(double depth) const;
  // Miner damage of one full cycle of `depth`; 0 for depth <= 0.
  double damage_per_cycle(double depth) const;
  PowerLawFit power_law_fit() const;
  const std::vector<CycleLifePoint>& points() const { return points_; }

 private:
  std::vector<CycleLifePoint> points_;  // sorted by dod
  std::vector<double> log_dod_, log_cycles_, slope_;
};

}  // namespace stowage
