// SPDX-License-Identifier: MIT
// Rainflow cycle counting, ASTM E1049-85 (reapproved 2017) clause 5.4.4, for a history that is
// not repeated: the series is first reduced to its reversals (peaks and valleys, with both ends
// kept as reversals), then the three-point rule counts a range Y as a full cycle when it is not
// the one holding the starting point, or as a half cycle when it is; what remains at the end
// (the residue) is counted as half cycles.
// Each cycle reports its depth (range), mean, count (1 or 0.5) and the indices in the input of
// the two reversals that bound it.
//
// Leg attribution (optional): given a weight w_i for every step i -> i+1 of the series (for
// ageing, the temperature acceleration of hour i), each cycle also reports the travel-weighted
// mean of w over the steps that make up the cycle itself, `leg_weight`:
//   leg_weight = sum over the cycle's level pieces p of w_p |dx_p| / sum |dx_p|,
// where the pieces are the parts of the history that rainflow assigns to the cycle: for a half
// cycle, the leg from one reversal to the other with the inner (already closed) cycles cut
// out; for a full cycle, that leg plus the part of the next leg that travels back over the same
// levels. Every piece of travel of the history belongs to exactly one counted cycle, so sum over
// cycles of (travel x leg_weight) = sum_i w_i |x_{i+1} - x_i|. Steps with no change (plateaus)
// carry no weight, so a cycle is weighted by the hours in which it moved, not by the hours its
// reversals happen to span. Unlike the mean over the span between the two reversals, the result
// does not jump when round-off decides how rainflow pairs equal reversals at the extremes of the
// history (every full charge at SOC 1, say): the pieces then only trade places between cycles of
// the same depth. Without weights every cycle reports leg_weight = 1.
#pragma once

#include <cstddef>
#include <vector>

namespace stowage {

struct RainflowCycle {
  double depth = 0;             // range |a - b|, in the series' units
  double mean = 0;              // (a + b) / 2
  double count = 0;             // 1.0 full cycle, 0.5 half cycle
  std::size_t first_index = 0;  // index of the earlier bounding reversal in the input
  std::size_t last_index = 0;   // index of the later bounding reversal
  double leg_weight = 1.0;      // travel-weighted mean step weight over the cycle's own pieces
};

// Indices of the reversals of `series[0..n)`; plateaus count once, both ends included.
// Writes into `out` (cleared first) to let hot loops reuse the buffer.
void find_reversals(const double* series, std::size_t n, std::vector<std::size_t>& out);

// A monotone part of the history between levels `from` and `to`, lying within the monotone run
// of points [lo, hi] (lo < hi); its weighted travel comes from prefix sums over the steps.
struct RainflowSegment {
  std::size_t lo = 0, hi = 0;
  double from = 0, to = 0;
};

// A leg of the rainflow stack: its segments in path order, those before `head` already used.
struct RainflowLeg {
  std::vector<RainflowSegment> segments;
  std::size_t head = 0;
};

// Rainflow counting of a history that grows point by point, as when a bank's SOC trace is
// produced month by month: extend() takes the points now present and emits every cycle they
// close; emit_residue() emits what closing the history at its latest point would add (the
// residue's half cycles) without changing the stream; close() emits it and ends the history.
// reset(x, w, start); extend(n); close() counts x[start..n) exactly as count_cycles() does, and
// after extend(m) the cycles emitted so far plus emit_residue() are what count_cycles() gives
// for the history up to m. The stream reads the points (and weights) from the caller's buffers:
// x[start..end) and, with weights, w[start..end - 1) must stay valid and unchanged while the
// history runs. Reuse one stream across histories: its memory is kept.
class RainflowStream {
 public:
  // Starts a history at x[start]; `w` is null (no leg attribution) or the step weights, w[i]
  // the weight of step i -> i+1.
  void reset(const double* x, const double* w, std::size_t start);
  // The history now holds x[start..end), end > start; emits the cycles this closes.
  template <typename Sink>
  void extend(std::size_t end, Sink&& sink);
  // Emits the cycles closing the history now would add; the stream is unchanged.
  template <typename Sink>
  void emit_residue(Sink&& sink);
  // Emits the residue and ends the history (reset() starts the next one).
  template <typename Sink>
  void close(Sink&& sink);

  // The stack and legs of the counting, copied whole by emit_residue().
  struct State {
    std::vector<std::size_t> stack;  // reversals not yet closed; stack[0] is the start point S
    // legs[j]: the pool entry of the leg between stack[j] and stack[j + 1]; `spare` lists
    // pool entries free for reuse.
    std::vector<std::size_t> legs;
    std::vector<RainflowLeg> pool;
    std::vector<std::size_t> spare;
  };

 private:
  template <typename Sink>
  void push_reversal(State& s, std::size_t r, Sink& sink) const;
  template <typename Sink>
  void finish(State& s, Sink& sink) const;

  const double* x_ = nullptr;
  const double* w_ = nullptr;
  std::size_t next_ = 0;         // first point not yet taken
  std::size_t last_ = 0;         // latest point that differs from its predecessor
  std::size_t last_pushed_ = 0;  // latest reversal pushed onto the stack
  int direction_ = 0;            // +1 rising, -1 falling, 0 not yet known
  std::vector<double> prefix_;   // prefix_[i]: sum of w_k |x_{k+1} - x_k| over start <= k < i
  State state_, shadow_;
};

// Working memory for count_cycles(), reused across calls so hot loops do not allocate.
using RainflowScratch = RainflowStream;

// Counts the cycles of `series[0..n)` and calls `sink(const RainflowCycle&)` for each, in the
// order they are closed. `step_weight` is null (no leg attribution) or has n - 1 values, the
// weight of each step i -> i+1.
template <typename Sink>
void count_cycles(const double* series, std::size_t n, RainflowScratch& scratch, Sink&& sink,
                  const double* step_weight = nullptr);

std::vector<RainflowCycle> rainflow(const std::vector<double>& series);
// With leg attribution; `step_weight` has series.size() - 1 values (none for an empty series).
std::vector<RainflowCycle> rainflow(const std::vector<double>& series,
                                    const std::vector<double>& step_weight);

}  // namespace stowage

#include "model/rainflow_impl.h"
