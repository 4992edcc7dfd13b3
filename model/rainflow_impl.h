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
  s.pool[i].segments.clear();
  s.pool[i].head = 0;
  s.spare.push_back(i);
}

// Weighted travel from the start of the monotone run [lo, hi] up to `level`: the prefix sum
// at the step that holds `level`, plus that step's weight times the part of it travelled.
inline double weighted_to(const double* x, const double* w, const std::vector<double>& prefix,
                          std::size_t lo, std::size_t hi, double level) {
  if (level == x[hi]) return prefix[hi];
  if (level == x[lo]) return prefix[lo];
  const bool rising = x[hi] > x[lo];
  // Last point h in [lo, hi) not beyond `level` in the run's direction.
  std::size_t a = lo, b = hi;  // invariant: x[a] not beyond level, x[b] beyond it
  while (b - a > 1) {
    const std::size_t mid = a + (b - a) / 2;
    const bool beyond = rising ? x[mid] > level : x[mid] < level;
    (beyond ? b : a) = mid;
  }
  return prefix[a] + w[a] * std::fabs(level - x[a]);
}

inline double segment_weighted(const double* x, const double* w, const std::vector<double>& prefix,
                               const RainflowSegment& s) {
  return std::fabs(weighted_to(x, w, prefix, s.lo, s.hi, s.to) -
                   weighted_to(x, w, prefix, s.lo, s.hi, s.from));
}

// Weighted travel and travel of a whole leg.
inline void leg_totals(const double* x, const double* w, const std::vector<double>& prefix,
                       const RainflowLeg& leg, double& weighted, double& travel) {
  for (std::size_t i = leg.head; i < leg.segments.size(); ++i) {
    const RainflowSegment& s = leg.segments[i];
    weighted += segment_weighted(x, w, prefix, s);
    travel += std::fabs(s.to - s.from);
  }
}

// Removes from the front of `leg` (which starts at the far end of the closed range and moves in
// direction `dir`) the travel up to level `until`, adding its weighted travel and travel.
inline void take_front(const double* x, const double* w, const std::vector<double>& prefix,
                       RainflowLeg& leg, double until, double dir, double& weighted,
                       double& travel) {
  while (leg.head < leg.segments.size()) {
    RainflowSegment& s = leg.segments[leg.head];
    if ((s.to - until) * dir <= 0) {
      weighted += segment_weighted(x, w, prefix, s);
      travel += std::fabs(s.to - s.from);
      ++leg.head;
      continue;
    }
    if ((s.from - until) * dir < 0) {
      // The segment crosses the closing level: the part before it belongs to the cycle.
      weighted += std::fabs(weighted_to(x, w, prefix, s.lo, s.hi, until) -
                            weighted_to(x, w, prefix, s.lo, s.hi, s.from));
      travel += std::fabs(until - s.from);
      s.from = until;
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
  const double* x = series;
  const double* w = step_weight;
  std::vector<double>& prefix = scratch.weighted_prefix;
  if (weighted) {
    prefix.resize(n);
    if (n > 0) prefix[0] = 0.0;
    for (std::size_t i = 0; i + 1 < n; ++i)
      prefix[i + 1] = prefix[i] + w[i] * std::fabs(x[i + 1] - x[i]);
  }
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
      // The new leg: the monotone run of the history from the previous reversal to this one.
      const std::size_t leg = rd::new_leg(scratch);
      scratch.pool[leg].segments.push_back({stack.back(), r, x[stack.back()], x[r]});
      legs.push_back(leg);
    }
    stack.push_back(r);
    while (stack.size() >= 3) {
      const std::size_t k = stack.size();
      const double dx = std::fabs(series[stack[k - 1]] - series[stack[k - 2]]);
      const double dy = std::fabs(series[stack[k - 2]] - series[stack[k - 3]]);
      if (dx < dy) break;
      double w_travel = 0, travel = 0;
      if (k == 3) {
        // Y holds the starting point: half cycle, and the start moves on.
        if (weighted) {
          rd::leg_totals(x, w, prefix, scratch.pool[legs[0]], w_travel, travel);
          rd::free_leg(scratch, legs[0]);
          legs.erase(legs.begin());
        }
        emit(stack[0], stack[1], 0.5, w_travel, travel);
        stack.erase(stack.begin());
      } else {
        if (weighted) {
          // Y is leg k-3; X (leg k-2) travels back over Y's levels first, and what it travels
          // beyond them continues the leg before Y, which now ends at X's end.
          RainflowLeg& leg_y = scratch.pool[legs[k - 3]];
          RainflowLeg& leg_x = scratch.pool[legs[k - 2]];
          const double dir = series[stack[k - 1]] > series[stack[k - 2]] ? 1.0 : -1.0;
          rd::leg_totals(x, w, prefix, leg_y, w_travel, travel);
          rd::take_front(x, w, prefix, leg_x, series[stack[k - 3]], dir, w_travel, travel);
          RainflowLeg& before = scratch.pool[legs[k - 4]];
          before.segments.insert(before.segments.end(),
                                 leg_x.segments.begin() + static_cast<std::ptrdiff_t>(leg_x.head),
                                 leg_x.segments.end());
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
    if (weighted) rd::leg_totals(x, w, prefix, scratch.pool[legs[i]], w_travel, travel);
    emit(stack[i], stack[i + 1], 0.5, w_travel, travel);
  }
}

}  // namespace stowage
