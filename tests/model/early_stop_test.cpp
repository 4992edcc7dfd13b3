// SPDX-License-Identifier: MIT
// Early stop of a lifecycle evaluation (LifecycleEvaluator::evaluate_unless_above). The
// reference is the full evaluation of the same design: the stop rule must never cut short a
// design whose NPC is within the limit, and its lower bound must never exceed the exact NPC.
#include <catch2/catch.hpp>
#include <cmath>
#include <limits>

#include "model/lifecycle.h"
#include "model_fixtures.h"

using namespace stowage;
using namespace stowage::testing;

namespace {

// A bank cycled daily to its floor with back-up for the rest of the load: costs accrue every
// year, so a low enough limit is passed well before the end of the project.
struct Case {
  ChemistryProfile profile = ideal_cell(100);
  SiteConditions site = quiet_site(48.0, 35.0);
  Economics economics;

  Case() {
    profile.cycle_life = CycleLifeCurve({{0.5, 3650}, {1.0, 1000}});
    profile.calendar_life_years = 40;
    profile.costs.capital_per_kwh = 300;
    profile.costs.installation_fixed = 2000;
    profile.costs.fixed_om_per_kwh_year = 5;
    profile.costs.replacement_share = 0.8;
    profile.costs.price_decline_per_year = 0.02;
    profile.costs.end_of_life_per_kwh = -10;  // a salvage value: a credit at the end
    every_day(site.load_kw, 2, 5, 100.0);
    every_day(site.source_kw, 8, 15, 100.0);
    site.charge_price_per_kwh.assign(kHoursPerYear, 0.05);
    site.backup_price_per_kwh = 0.5;
    economics.project_years = 20;
    economics.real_discount_rate = 0.06;
  }
};

double pw(double rate, double year) { return std::pow(1.0 + rate, -year); }

}  // namespace

TEST_CASE("without a limit, or with one above the NPC, the evaluation runs to the end unchanged",
          "[model][lifecycle][early-stop]") {
  Case c;
  c.profile.validate();
  c.site.validate();
  LifecycleEvaluator evaluator(c.profile, c.site, c.economics);
  const DesignResult full = evaluator.evaluate(0.5, 10);
  for (double limit : {std::numeric_limits<double>::infinity(), full.npc * (1 + 1e-6)}) {
    const auto b = evaluator.evaluate_unless_above(0.5, 10, limit);
    REQUIRE(b.result.has_value());
    CHECK(b.result->npc == full.npc);  // bit for bit
    CHECK(b.npc_lower_bound == full.npc);
    CHECK(b.years_simulated == 20);
  }
}

TEST_CASE(
    "a design stops at the first year-end where its cost so far less the credits to come "
    "passes the limit",
    "[model][lifecycle][early-stop]") {
  Case c;
  c.profile.validate();
  c.site.validate();
  LifecycleEvaluator evaluator(c.profile, c.site, c.economics);
  const DesignResult full = evaluator.evaluate(0.5, 10);
  REQUIRE(full.replacement_years == std::vector<int>{4, 8, 12, 16});

  // The rule of lifecycle.h, restated from the full run's yearly cash flows: credits to come =
  // P(N) PW(N) (residual value at most the year-N price) + |salvage| PW(N + 1).
  const double rate = 0.06;
  const double i0 = full.investment;
  const double p_n = i0 * 0.8 * std::pow(0.98, 20);
  const double credits = p_n * pw(rate, 20) + 10 * full.bank.nameplate_kwh * pw(rate, 21);
  for (double share : {0.3, 0.6, 0.9, 0.99}) {
    const double limit = share * full.npc;
    double so_far = i0;
    int expected_stop = 0;
    for (int y = 1; y < 20 && expected_stop == 0; ++y) {
      const YearRecord& rec = full.years[static_cast<std::size_t>(y - 1)];
      so_far += (rec.replacement + rec.fixed_om + rec.variable_om + rec.charging + rec.backup +
                 rec.unserved_penalty + rec.end_of_life) *
                pw(rate, y);
      if (so_far - credits > limit * (1 + 1e-9)) expected_stop = y;
    }
    INFO("limit " << share << " x NPC");
    const auto b = evaluator.evaluate_unless_above(0.5, 10, limit);
    if (expected_stop == 0) {
      REQUIRE(b.result.has_value());
      CHECK(b.result->npc == full.npc);
      continue;
    }
    CHECK_FALSE(b.result.has_value());
    CHECK(b.years_simulated == expected_stop);
    CHECK(b.npc_lower_bound > limit);
    CHECK(b.npc_lower_bound <= full.npc);  // rigorous: never above the exact NPC
  }
  // The lowest limit stops within the first bank's life; the highest one may not stop at all.
  CHECK(evaluator.evaluate_unless_above(0.5, 10, 0.3 * full.npc).years_simulated < 5);
}

TEST_CASE("a replacement that nets a credit disables the early stop",
          "[model][lifecycle][early-stop]") {
  // A trade-in worth more than the replacement bank costs: a later replacement lowers the NPC,
  // so no cost so far bounds it from below and the design must run to the end.
  Case c;
  c.profile.costs.replacement_share = 0.1;
  c.profile.costs.replacement_end_of_life_per_kwh = -200;
  c.profile.validate();
  c.site.validate();
  LifecycleEvaluator evaluator(c.profile, c.site, c.economics);
  const DesignResult full = evaluator.evaluate(0.5, 10);
  REQUIRE_FALSE(full.replacement_years.empty());
  const auto b = evaluator.evaluate_unless_above(0.5, 10, 0.0);
  REQUIRE(b.result.has_value());
  CHECK(b.result->npc == full.npc);
}
