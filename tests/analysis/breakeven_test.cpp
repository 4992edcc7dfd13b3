// SPDX-License-Identifier: MIT
// Break-even against crossings bracketed by hand: with designs held, NPC is linear in a
// profile's capital price (investment, replacements and residual value all scale with it), so
// the crossing follows from two direct evaluations in closed form; re-optimised, the two ends of
// the bracket found must show the two profiles swapping places in direct optimise runs.
#include "optimiser/analysis/breakeven.h"

#include <catch2/catch.hpp>
#include <vector>

#include "analysis_fixtures.h"
#include "catalog-schema/parameter_paths.h"
#include "model/invalid_value.h"

using namespace stowage;

namespace {

const std::string kPrice = "profiles.sodium-ion.costs.capital_per_kwh";

double held_npc(const StudyCase& study, const DesignResult& design, double price) {
  StudyCase copy = study;
  apply_parameter(copy, kPrice, price);
  const std::size_t p = *copy.find_profile(design.profile_id);
  LifecycleEvaluator evaluator(copy.profiles[p], copy.site, copy.economics);
  return evaluator.evaluate(design.dod_setpoint, design.bank.strings_parallel).npc;
}

}  // namespace

TEST_CASE("break-even with held designs meets the closed-form crossing", "[analysis][breakeven]") {
  const StudyCase study = testing::three_profile_study();
  const OptimiseResult base = optimise(study);
  REQUIRE(base.best().profile_id == "sodium-ion");
  REQUIRE(base.ranking[1].profile_id == "lfp");
  const DesignResult& sodium = base.ranking[0];
  const DesignResult& lfp = base.ranking[1];
  // Sodium-ion's NPC, linear in its price: a + b x from two exact evaluations; LFP's does not
  // move. The tie: a + b x = lfp.
  const double a0 = held_npc(study, sodium, 200), a1 = held_npc(study, sodium, 400);
  const double slope = (a1 - a0) / 200;
  const double crossing = 200 + (lfp.npc - a0) / slope;
  REQUIRE(crossing > 250);
  REQUIRE(crossing < 400);
  // Linearity itself, at a third price.
  CHECK(held_npc(study, sodium, 300) == Approx(a0 + 100 * slope).epsilon(1e-9));

  BreakevenOptions options;
  options.path = kPrice;
  options.from = 200;
  options.to = 500;
  options.hold_designs = true;
  options.tolerance = 0.01;
  options.threads = 2;
  const BreakevenResult r = find_breakeven(study, options);
  CHECK(r.profile_id == "lfp");  // the runner-up by default
  REQUIRE(r.crossing);
  CHECK_FALSE(r.step);
  CHECK(r.bracket_high - r.bracket_low <= 0.01);
  CHECK(r.bracket_low <= crossing);
  CHECK(r.bracket_high >= crossing);
  CHECK(r.value == Approx(crossing).margin(1e-6));
  CHECK_FALSE(r.profile_wins_at_from);
}

TEST_CASE("re-optimised break-even brackets a swap seen in direct runs", "[analysis][breakeven]") {
  const StudyCase study = testing::three_profile_study();
  BreakevenOptions options;
  options.path = kPrice;
  options.from = 250;
  options.to = 450;
  options.profile_id = "lfp";
  options.tolerance = 0.5;
  options.threads = 2;
  const BreakevenResult r = find_breakeven(study, options);
  REQUIRE(r.crossing);
  CHECK(r.bracket_high - r.bracket_low <= 0.5);
  StudyCase below = study, above = study;
  apply_parameter(below, kPrice, r.bracket_low);
  apply_parameter(above, kPrice, r.bracket_high);
  CHECK(optimise(below).best().profile_id == "sodium-ion");
  CHECK(optimise(above).best().profile_id == "lfp");
  CHECK(r.value >= r.bracket_low);
  CHECK(r.value <= r.bracket_high);
}

TEST_CASE("break-even says when there is no crossing in the range", "[analysis][breakeven]") {
  const StudyCase study = testing::three_profile_study();
  BreakevenOptions options;
  options.path = kPrice;
  options.from = 150;
  options.to = 250;  // sodium-ion stays cheapest throughout; vrla-gel never catches it
  options.profile_id = "vrla-gel";
  options.hold_designs = true;
  options.scan_points = 3;
  const BreakevenResult r = find_breakeven(study, options);
  CHECK_FALSE(r.crossing);
  CHECK(r.scan.size() == 5);
  CHECK(r.bisection.empty());
  for (const BreakevenProbe& p : r.scan) CHECK(p.gap > 0);
  options.profile_id = "no-such-profile";
  CHECK_THROWS_AS(find_breakeven(study, options), InvalidValue);
}

TEST_CASE("break-even progress is called once per evaluation, ending at its total",
          "[analysis][breakeven]") {
  const StudyCase study = testing::three_profile_study();
  BreakevenOptions options;
  options.path = kPrice;
  options.from = 200;
  options.to = 500;
  options.hold_designs = true;
  options.tolerance = 0.01;
  options.threads = 2;
  std::vector<std::size_t> dones, totals;
  options.progress = [&](std::size_t done, std::size_t total) {
    dones.push_back(done);
    totals.push_back(total);
  };
  const BreakevenResult r = find_breakeven(study, options);
  REQUIRE(r.crossing);
  REQUIRE_FALSE(r.bisection.empty());
  REQUIRE(dones.size() == r.scan.size() + r.bisection.size());
  for (std::size_t i = 0; i < dones.size(); ++i) {
    CHECK(dones[i] == i + 1);
    CHECK(totals[i] >= dones[i]);
  }
  CHECK(totals.back() == dones.back());
  // A 300-wide range scanned at 10 values is cut into 33.3-wide intervals; halving one to
  // 0.01 takes 12 steps (33.3 / 2^12 < 0.01 < 33.3 / 2^11), which the bisection then makes.
  CHECK(r.bisection.size() == 12);
  CHECK(totals.front() == r.scan.size() + 12);

  // No crossing: only the scan is evaluated, and only it is counted.
  options.from = 150;
  options.to = 250;
  options.profile_id = "vrla-gel";
  options.scan_points = 3;
  dones.clear();
  totals.clear();
  const BreakevenResult none = find_breakeven(study, options);
  REQUIRE_FALSE(none.crossing);
  CHECK(dones.size() == none.scan.size());
}
