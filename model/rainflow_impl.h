// SPDX-License-Identifier: MIT
// Template body of count_cycles(); see rainflow.h for the contract.
#pragma once

#include <cmath>
#include <utility>

namespace stowage {

namespace rainflow_detail {

// Pool entry for a new, empty leg.
inline std::size_t new_leg(RainflowScratch& s) {
  if (!s.spare.empty()) {
    const std::size_t i = s.spare.back();
    s.spare.pop_back();
    return i;
  }
  s.pool.emplace_back();
  return s.pool.size() - 1;
}

inline void free_leg(RainflowScratch& s, std::size_t i) {
  s.pool[i].clear();
  s.spare.push_back(i);
}

// Weighted travel and travel of a whole leg.
inline void leg_totals(const std::deque<RainflowPiece>& leg, double& weighted, double& travel) {
  for (const RainflowPiece& p : leg) {
    const double dx = std::fabs(p.to - p.from);
    weighted += p.w * dx;
    travel += dx;
  }
}

// Removes from the front of `leg` (which starts at the far end of the closed range and moves in
// direction `dir`) the pieces up to level `until`, adding their weighted travel and travel.
inline void take_front(std::deque<RainflowPiece>& leg, double until, double dir, double& weighted,
                       double& travel) {
  while (!leg.empty()) {
    RainflowPiece& p = leg.front();
    if ((p.to - until) * dir <= 0) {
      const double dx = std::fabs(p.to - p.from);
      weighted += p.w * dx;
      travel += dx;
      leg.pop_front();
      continue;
    }
    if ((p.from - until) * dir < 0) {
      // The piece crosses the closing level: the part below it belongs to the cycle.
      const double dx = std::fabs(until - p.from);
      weighted += p.w * dx;
      travel += dx;
      p.from = until;
    }
    break;
  }
}

}  // namespace rainflow_detail

template <typename Sink>
void count_cycles(const double* series, std::size_t n, RainflowScratch& scratch, Sink&& sink,
                  const double* step_weight) {
  namespace rd = rainflow_detail;
  // The stack holds indices of reversals not yet closed; its bottom element is the current
  // starting point S of clause 5.4.4.
  find_reversals(series, n, scratch.reversals);
  std::vector<std::size_t>& stack = scratch.stack;
  std::vector<std::size_t>& legs = scratch.legs;
  stack.clear();
  for (std::size_t leg : legs) rd::free_leg(scratch, leg);
  legs.clear();
  const bool weighted = step_weight != nullptr;
  auto emit = [&](std::size_t a, std::size_t b, double count, double w_travel, double travel) {
    const std::size_t lo = a < b ? a : b, hi = a < b ? b : a;
    RainflowCycle c;
    c.depth = std::fabs(series[a] - series[b]);
    c.mean = 0.5 * (series[a] + series[b]);
    c.count = count;
    c.first_index = lo;
    c.last_index = hi;
    if (weighted && travel > 0) c.leg_weight = w_travel / travel;
    sink(c);
  };
  for (std::size_t r : scratch.reversals) {
    if (weighted && !stack.empty()) {
      // The new leg: the steps of the history from the previous reversal to this one.
      const std::size_t leg = rd::new_leg(scratch);
      for (std::size_t i = stack.back(); i < r; ++i) {
        if (series[i + 1] != series[i])
          scratch.pool[leg].push_back({series[i], series[i + 1], step_weight[i]});
      }
      legs.push_back(leg);
    }
    stack.push_back(r);
    while (stack.size() >= 3) {
      const std::size_t k = stack.size();
      const double x = std::fabs(series[stack[k - 1]] - series[stack[k - 2]]);
      const double y = std::fabs(series[stack[k - 2]] - series[stack[k - 3]]);
      if (x < y) break;
      double w_travel = 0, travel = 0;
      if (k == 3) {
        // Y holds the starting point: half cycle, and the start moves on.
        if (weighted) {
          rd::leg_totals(scratch.pool[legs[0]], w_travel, travel);
          rd::free_leg(scratch, legs[0]);
          legs.erase(legs.begin());
        }
        emit(stack[0], stack[1], 0.5, w_travel, travel);
        stack.erase(stack.begin());
      } else {
        if (weighted) {
          // Y is leg k-3; X (leg k-2) travels back over Y's levels first, and what it travels
          // beyond them continues the leg before Y, which now ends at X's end.
          std::deque<RainflowPiece>& leg_y = scratch.pool[legs[k - 3]];
          std::deque<RainflowPiece>& leg_x = scratch.pool[legs[k - 2]];
          const double dir = series[stack[k - 1]] > series[stack[k - 2]] ? 1.0 : -1.0;
          rd::leg_totals(leg_y, w_travel, travel);
          rd::take_front(leg_x, series[stack[k - 3]], dir, w_travel, travel);
          std::deque<RainflowPiece>& before = scratch.pool[legs[k - 4]];
          if (leg_x.size() > before.size()) {
            leg_x.insert(leg_x.begin(), before.begin(), before.end());
            before.swap(leg_x);
          } else {
            before.insert(before.end(), leg_x.begin(), leg_x.end());
          }
          rd::free_leg(scratch, legs[k - 3]);
          rd::free_leg(scratch, legs[k - 2]);
          legs.resize(k - 3);
        }
        emit(stack[k - 3], stack[k - 2], 1.0, w_travel, travel);
        stack[k - 3] = stack[k - 1];
        stack.resize(k - 2);
      }
    }
  }
  for (std::size_t i = 0; i + 1 < stack.size(); ++i) {
    double w_travel = 0, travel = 0;
    if (weighted) rd::leg_totals(scratch.pool[legs[i]], w_travel, travel);
    emit(stack[i], stack[i + 1], 0.5, w_travel, travel);
  }
}

}  // namespace stowage
