// SPDX-License-Identifier: MIT
// Template body of count_cycles(); see rainflow.h for the contract.
#pragma once

#include <cmath>
#include <utility>

namespace stowage {

namespace rainflow_detail {

// Pool entry for a new, empty leg.
inline std::size_t new_leg(RainflowStream::State& s) {
  if (!s.spare.empty()) {
    const std::size_t i = s.spare.back();
    s.spare.pop_back();
    return i;
  }
  s.pool.emplace_back();
  return s.pool.size() - 1;
}

inline void free_leg(RainflowStream::State& s, std::size_t i) {
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

// One counted cycle between the reversals a and b of x.
inline RainflowCycle make_cycle(const double* x, std::size_t a, std::size_t b, double count,
                                bool weighted, double w_travel, double travel) {
  RainflowCycle c;
  c.depth = std::fabs(x[a] - x[b]);
  c.mean = 0.5 * (x[a] + x[b]);
  c.count = count;
  c.first_index = a < b ? a : b;
  c.last_index = a < b ? b : a;
  if (weighted && travel > 0) c.leg_weight = w_travel / travel;
  return c;
}

}  // namespace rainflow_detail

inline void RainflowStream::reset(const double* x, const double* w, std::size_t start) {
  namespace rd = rainflow_detail;
  x_ = x;
  w_ = w;
  for (std::size_t leg : state_.legs) rd::free_leg(state_, leg);
  state_.legs.clear();
  state_.stack.clear();
  next_ = start + 1;
  last_ = start;
  last_pushed_ = start;
  direction_ = 0;
  if (w_ != nullptr) {
    if (prefix_.size() < start + 1) prefix_.resize(start + 1);
    prefix_[start] = 0.0;
  }
  state_.stack.push_back(start);  // the first point is a reversal (clause 5.4.4)
}

template <typename Sink>
void RainflowStream::extend(std::size_t end, Sink&& sink) {
  if (w_ != nullptr) {
    if (prefix_.size() < end) prefix_.resize(end);
    for (std::size_t i = next_; i < end; ++i)
      prefix_[i] = prefix_[i - 1] + w_[i - 1] * std::fabs(x_[i] - x_[i - 1]);
  }
  for (std::size_t i = next_; i < end; ++i) {
    const double step = x_[i] - x_[last_];
    if (step == 0) continue;  // a plateau counts once
    const int s = step > 0 ? 1 : -1;
    if (direction_ != 0 && s != direction_) {
      push_reversal(state_, last_, sink);
      last_pushed_ = last_;
    }
    direction_ = s;
    last_ = i;
  }
  if (end > next_) next_ = end;
}

template <typename Sink>
void RainflowStream::emit_residue(Sink&& sink) {
  shadow_ = state_;
  finish(shadow_, sink);
}

template <typename Sink>
void RainflowStream::close(Sink&& sink) {
  finish(state_, sink);
  for (std::size_t leg : state_.legs) rainflow_detail::free_leg(state_, leg);
  state_.legs.clear();
  state_.stack.clear();
}

template <typename Sink>
void RainflowStream::finish(State& s, Sink& sink) const {
  namespace rd = rainflow_detail;
  // The latest point ends the history: it is a reversal unless it is the one last pushed.
  if (last_ != last_pushed_) push_reversal(s, last_, sink);
  const bool weighted = w_ != nullptr;
  for (std::size_t i = 0; i + 1 < s.stack.size(); ++i) {
    double w_travel = 0, travel = 0;
    if (weighted) rd::leg_totals(x_, w_, prefix_, s.pool[s.legs[i]], w_travel, travel);
    sink(rd::make_cycle(x_, s.stack[i], s.stack[i + 1], 0.5, weighted, w_travel, travel));
  }
}

template <typename Sink>
void RainflowStream::push_reversal(State& s, std::size_t r, Sink& sink) const {
  namespace rd = rainflow_detail;
  // The stack holds indices of reversals not yet closed; its bottom element is the current
  // starting point S of clause 5.4.4.
  const bool weighted = w_ != nullptr;
  const double* x = x_;
  const double* w = w_;
  std::vector<std::size_t>& stack = s.stack;
  std::vector<std::size_t>& legs = s.legs;
  if (weighted && !stack.empty()) {
    // The new leg: the monotone run of the history from the previous reversal to this one.
    const std::size_t leg = rd::new_leg(s);
    s.pool[leg].segments.push_back({stack.back(), r, x[stack.back()], x[r]});
    legs.push_back(leg);
  }
  stack.push_back(r);
  while (stack.size() >= 3) {
    const std::size_t k = stack.size();
    const double dx = std::fabs(x[stack[k - 1]] - x[stack[k - 2]]);
    const double dy = std::fabs(x[stack[k - 2]] - x[stack[k - 3]]);
    if (dx < dy) break;
    double w_travel = 0, travel = 0;
    if (k == 3) {
      // Y holds the starting point: half cycle, and the start moves on.
      if (weighted) {
        rd::leg_totals(x, w, prefix_, s.pool[legs[0]], w_travel, travel);
        rd::free_leg(s, legs[0]);
        legs.erase(legs.begin());
      }
      sink(rd::make_cycle(x, stack[0], stack[1], 0.5, weighted, w_travel, travel));
      stack.erase(stack.begin());
    } else {
      if (weighted) {
        // Y is leg k-3; X (leg k-2) travels back over Y's levels first, and what it travels
        // beyond them continues the leg before Y, which now ends at X's end.
        RainflowLeg& leg_y = s.pool[legs[k - 3]];
        RainflowLeg& leg_x = s.pool[legs[k - 2]];
        const double dir = x[stack[k - 1]] > x[stack[k - 2]] ? 1.0 : -1.0;
        rd::leg_totals(x, w, prefix_, leg_y, w_travel, travel);
        rd::take_front(x, w, prefix_, leg_x, x[stack[k - 3]], dir, w_travel, travel);
        RainflowLeg& before = s.pool[legs[k - 4]];
        before.segments.insert(before.segments.end(),
                               leg_x.segments.begin() + static_cast<std::ptrdiff_t>(leg_x.head),
                               leg_x.segments.end());
        rd::free_leg(s, legs[k - 3]);
        rd::free_leg(s, legs[k - 2]);
        legs.resize(k - 3);
      }
      sink(rd::make_cycle(x, stack[k - 3], stack[k - 2], 1.0, weighted, w_travel, travel));
      stack[k - 3] = stack[k - 1];
      stack.resize(k - 2);
    }
  }
}

template <typename Sink>
void count_cycles(const double* series, std::size_t n, RainflowScratch& scratch, Sink&& sink,
                  const double* step_weight) {
  if (n == 0) return;
  scratch.reset(series, step_weight, 0);
  scratch.extend(n, sink);
  scratch.close(sink);
}

}  // namespace stowage
