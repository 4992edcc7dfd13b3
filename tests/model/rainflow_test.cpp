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
