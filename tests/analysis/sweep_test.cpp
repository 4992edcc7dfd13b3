// SPDX-License-Identifier: MIT
// Sweeps against direct runs: every tornado end and grid point must be exactly what optimise()
// (or, with designs held, the exact evaluator) gives on the changed study, for any thread count.
#include "optimiser/analysis/sweep.h"

#include <catch2/catch.hpp>

#include "analysis_fixtures.h"
#include "catalog-schema/parameter_paths.h"

using namespace stowage;

namespace {

Variation low_high(const StudyCase& study, const std::string& path, double low, double high) {
  const ParameterInfo info = find_parameter(study, path);
  Variation v;
  v.path = v.label = path;
  v.unit = info.unit;
  v.low = low;
  v.high = high;
  v.base = info.base;
  return v;
}

StudyCase changed(const StudyCase& study, const std::string& path, double value) {
  StudyCase copy = study;
  apply_parameter(copy, path, value);
  return copy;
}

}  // namespace

TEST_CASE("tornado ends equal direct optimise runs of the changed study", "[analysis][sweep]") {
  const StudyCase study = testing::three_profile_study();
  const std::string price = "profiles.sodium-ion.costs.capital_per_kwh";
  const std::string rate = "economics.real_discount_rate";
  const std::vector<Variation> vars{low_high(study, rate, 0.03, 0.09),
                                    low_high(study, price, 200, 500)};
  SweepOptions options;
  options.threads = 2;
  const TornadoResult t = run_tornado(study, vars, options);
  REQUIRE(t.bars.size() == 2);
  const OptimiseResult base = optimise(study);
  CHECK(t.base.winner().npc == base.best().npc);
  for (const TornadoBar& bar : t.bars) {
    INFO(bar.variation.path);
    const OptimiseResult lo = optimise(changed(study, bar.variation.path, bar.variation.low));
    const OptimiseResult hi = optimise(changed(study, bar.variation.path, bar.variation.high));
    CHECK(bar.low.winner().profile_id == lo.best().profile_id);
    CHECK(bar.low.winner().npc == lo.best().npc);
    CHECK(bar.low.winner().lcos_per_kwh == lo.best().lcos_per_kwh);
    CHECK(bar.high.winner().profile_id == hi.best().profile_id);
    CHECK(bar.high.winner().npc == hi.best().npc);
    CHECK(bar.swing_npc == std::fabs(hi.best().npc - lo.best().npc));
    CHECK(bar.winner_changes == (lo.best().profile_id != base.best().profile_id ||
                                 hi.best().profile_id != base.best().profile_id));
  }
  // Sorted by swing, largest first.
  CHECK(t.bars[0].swing_npc >= t.bars[1].swing_npc);
}

TEST_CASE("held designs are evaluated as they are at every point", "[analysis][sweep]") {
  const StudyCase study = testing::three_profile_study();
  const std::string offset = "site.hourly.temp_c_offset";
  SweepOptions options;
  options.hold_designs = true;
  options.threads = 2;
  const TornadoResult t = run_tornado(study, {low_high(study, offset, -5, 5)}, options);
  const OptimiseResult base = optimise(study);
  const StudyCase hot = changed(study, offset, 5);
  for (const DesignResult& d : base.ranking) {
    const std::size_t p = *hot.find_profile(d.profile_id);
    LifecycleEvaluator evaluator(hot.profiles[p], hot.site, hot.economics);
    const DesignResult direct = evaluator.evaluate(d.dod_setpoint, d.bank.strings_parallel);
    REQUIRE(t.bars[0].high.by_profile[p]);
    CHECK(t.bars[0].high.by_profile[p]->npc == direct.npc);
    CHECK(t.bars[0].high.by_profile[p]->strings_parallel == d.bank.strings_parallel);
  }
}

TEST_CASE("a 2-D grid matches direct runs and does not depend on the thread count",
          "[analysis][sweep]") {
  const StudyCase study = testing::three_profile_study();
  Variation price = low_high(study, "profiles.sodium-ion.costs.capital_per_kwh", 250, 400);
  Variation offset = low_high(study, "site.hourly.temp_c_offset", -4, 4);
  offset.points = {-4, 4};
  SweepOptions options;
  options.steps = 3;
  options.threads = 1;
  const GridResult one = run_grid(study, {price, offset}, options);
  options.threads = 2;
  const GridResult two = run_grid(study, {price, offset}, options);
  REQUIRE(one.values[0] == std::vector<double>{250, 325, 400});
  REQUIRE(one.values[1] == std::vector<double>{-4, 4});
  REQUIRE(one.points.size() == 6);
  for (std::size_t i = 0; i < one.points.size(); ++i) {
    REQUIRE(one.points[i].ranking.size() == two.points[i].ranking.size());
    for (std::size_t r = 0; r < one.points[i].ranking.size(); ++r) {
      CHECK(one.points[i].ranking[r].npc == two.points[i].ranking[r].npc);
      CHECK(one.points[i].ranking[r].profile_id == two.points[i].ranking[r].profile_id);
    }
  }
  StudyCase corner = changed(study, price.path, 400);
  apply_parameter(corner, offset.path, -4);
  const OptimiseResult direct = optimise(corner);
  CHECK(one.at(2, 0).winner().npc == direct.best().npc);
  CHECK(one.at(2, 0).winner().profile_id == direct.best().profile_id);
}

TEST_CASE("grid axes take whole numbers for whole-number paths", "[analysis][sweep]") {
  const StudyCase study = testing::three_profile_study();
  Variation years = low_high(study, "economics.project_years", 10, 20);
  years.whole_number = true;
  CHECK(axis_values(years, 4) == std::vector<double>{10, 13, 17, 20});
  CHECK(axis_values(years, 30).size() == 11);  // duplicates dropped
}
