// SPDX-License-Identifier: MIT
#include "model/rainflow.h"

#include <algorithm>
#include <catch2/catch.hpp>
#include <map>
#include <utility>

using stowage::rainflow;

namespace {
// Total count per range, so the comparison does not depend on the order in which residue
// half cycles are emitted (it differs between implementations).
std::map<double, double> count_by_range(const std::vector<stowage::RainflowCycle>& cycles) {
  std::map<double, double> out;
  for (const auto& c : cycles) out[c.depth] += c.count;
  return out;
}
}  // namespace

TEST_CASE("rainflow reproduces the ASTM E1049-85 clause 5.4.4 worked example",
          "[model][rainflow]") {
  // ASTM E1049-85 (2017) Fig. 6 load history -2, 1, -3, 5, -1, 3, -4, 4, -2 and its counted
  // ranges: 3 -> 0.5, 4 -> 1.5, 6 -> 0.5, 8 -> 1.0, 9 -> 0.5 (check-values.md 1.1, READ-3P).
  const std::vector<double> history{-2, 1, -3, 5, -1, 3, -4, 4, -2};
  const auto cycles = rainflow(history);
  const std::map<double, double> expected{{3, 0.5}, {4, 1.5}, {6, 0.5}, {8, 1.0}, {9, 0.5}};
  CHECK(count_by_range(cycles) == expected);
  CHECK(cycles.size() == 7);  // 1 full + 6 half cycles
  double total = 0;
  for (const auto& c : cycles) total += c.count;
  CHECK(total == Approx(4.0));
}

TEST_CASE("rainflow gives the ASTM example's cycle means", "[model][rainflow]") {
  // Same example; (range, mean) events: full (4, 1); halves (3,-0.5), (4,-1), (8,1), (6,1),
  // (8,0), (9,0.5) (check-values.md 1.1, READ-3P from a library docstring citing 5.4.4).
  const auto cycles = rainflow({-2, 1, -3, 5, -1, 3, -4, 4, -2});
  std::vector<std::tuple<double, double, double>> got;
  for (const auto& c : cycles) got.emplace_back(c.depth, c.mean, c.count);
  std::vector<std::tuple<double, double, double>> expected{
      {4, 1, 1.0}, {3, -0.5, 0.5}, {4, -1, 0.5}, {8, 1, 0.5},
      {6, 1, 0.5}, {8, 0, 0.5},    {9, 0.5, 0.5}};
  std::sort(got.begin(), got.end());
  std::sort(expected.begin(), expected.end());
  CHECK(got == expected);
}

TEST_CASE("rainflow reduces a series to reversals before counting", "[model][rainflow]") {
  // Intermediate points on a monotone run and repeated values are not reversals
  // (ASTM E1049-85 counts peaks and valleys only).
  const auto dense = rainflow({-2, -1, 0, 1, 1, 0, -3, -3, 2, 5, 4, -1, 3, 0, -4, 4, -2});
  const auto sparse = rainflow({-2, 1, -3, 5, -1, 3, -4, 4, -2});
  CHECK(count_by_range(dense) == count_by_range(sparse));
}

TEST_CASE("rainflow reports the span of each cycle in the input", "[model][rainflow]") {
  const auto cycles = rainflow({0, 1, 0.5, 0.9, 0});
  // Full cycle 0.5 <-> 0.9 between indices 2 and 3.
  const auto full = std::find_if(cycles.begin(), cycles.end(),
                                 [](const stowage::RainflowCycle& c) { return c.count == 1.0; });
  REQUIRE(full != cycles.end());
  CHECK(full->first_index == 2);
  CHECK(full->last_index == 3);
  CHECK(full->depth == Approx(0.4));
}

TEST_CASE("a constant series has no cycles", "[model][rainflow]") {
  CHECK(rainflow({0.5, 0.5, 0.5}).empty());
  CHECK(rainflow({}).empty());
}

namespace {
// Weighted damage-like sum of a set of cycles: depth^2 x count x leg_weight, so that a cycle
// counted at a different depth, count or weight changes it.
double weighted_sum(const std::vector<stowage::RainflowCycle>& cycles) {
  double sum = 0;
  for (const auto& c : cycles) sum += c.depth * c.depth * c.count * c.leg_weight;
  return sum;
}
}  // namespace

TEST_CASE("a growing history's cycles so far plus its residue are those of its prefix",
          "[model][rainflow]") {
  // The streaming count (rainflow.h) against the whole-series count of each prefix: both are
  // the ASTM E1049-85 clause 5.4.4 count of the same points, so they agree exactly.
  std::vector<double> x{0.0};
  std::vector<double> w;
  unsigned state = 12345u;
  auto next = [&] {
    state = state * 1103515245u + 12345u;
    return static_cast<double>((state >> 8) % 1000u) / 1000.0;
  };
  for (int i = 0; i < 600; ++i) {
    x.push_back(i % 7 == 0 ? x.back() : next());  // with plateaus
    w.push_back(0.5 + next());
  }
  stowage::RainflowStream stream;
  stream.reset(x.data(), w.data(), 0);
  std::vector<stowage::RainflowCycle> closed;
  auto keep = [&](const stowage::RainflowCycle& c) { closed.push_back(c); };
  for (std::size_t end = 2; end <= x.size(); end += 37) {
    stream.extend(end, keep);
    std::vector<stowage::RainflowCycle> so_far = closed;
    stream.emit_residue([&](const stowage::RainflowCycle& c) { so_far.push_back(c); });
    const std::vector<double> prefix(x.begin(), x.begin() + static_cast<std::ptrdiff_t>(end));
    const std::vector<double> prefix_w(w.begin(), w.begin() + static_cast<std::ptrdiff_t>(end - 1));
    const auto whole = rainflow(prefix, prefix_w);
    INFO("prefix of " << end << " points");
    CHECK(so_far.size() == whole.size());
    CHECK(count_by_range(so_far) == count_by_range(whole));
    CHECK(weighted_sum(so_far) == Approx(weighted_sum(whole)).epsilon(1e-12));
  }
}

TEST_CASE("a history restarted part way counts only its own points", "[model][rainflow]") {
  // After reset at index 4, the stream sees the history x[4..], as a count of that slice.
  const std::vector<double> x{0, 5, -5, 5, 1, -3, 5, -1, 3, -4, 4, -2};
  stowage::RainflowStream stream;
  std::vector<stowage::RainflowCycle> got;
  auto keep = [&](const stowage::RainflowCycle& c) { got.push_back(c); };
  stream.reset(x.data(), nullptr, 0);
  stream.extend(5, keep);
  got.clear();
  stream.reset(x.data(), nullptr, 4);
  stream.extend(x.size(), keep);
  stream.close(keep);
  CHECK(count_by_range(got) == count_by_range(rainflow({1, -3, 5, -1, 3, -4, 4, -2})));
}
