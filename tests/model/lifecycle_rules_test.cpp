// SPDX-License-Identifier: MIT
// The lifecycle rules beyond the analytic case: residual value, service-age limit, several
// replacements in one year, partial-state-of-charge stress, logged-series damage, and the
// cycle-life curve below its table. Expected values are derived in each test.
#include <catch2/catch.hpp>
#include <cmath>

#include "model/duty_cycles.h"
#include "model/lifecycle.h"
#include "model_fixtures.h"

using namespace stowage;
using namespace stowage::testing;

namespace {
// A bank that hardly wears (calendar 1e9 years) doing one full-window cycle a day.
struct DailyCycle {
  ChemistryProfile profile = ideal_cell(100);
  SiteConditions site = quiet_site(48.0, 25.0);
  Economics economics;
  DailyCycle() {
    every_day(site.load_kw, 2, 5, 100.0);
    every_day(site.source_kw, 8, 15, 100.0);
    site.backup_price_per_kwh = 0.3;
    profile.costs.capital_per_kwh = 200;
    economics.project_years = 15;
    economics.real_discount_rate = 0.08;
  }
};
}  // namespace

TEST_CASE("a bank with life left at the end of the project is credited its residual value",
          "[model][lifecycle]") {
  // Service limit 30 years, project 15: half the life remains, so the residual value is half
  // the price, credited at year 15; the end-of-life flow falls when the remaining 15 years run
  // out, at year 30 (straight-line wear, docs/method.md 6).
  DailyCycle c;
  c.profile.max_service_years = 30;
  c.profile.costs.end_of_life_per_kwh = 10;
  LifecycleEvaluator ev(c.profile, c.site, c.economics);
  const DesignResult r = ev.evaluate(0.5, 10);
  const double price = 200 * r.bank.nameplate_kwh;
  CHECK(r.replacement_years.empty());
  CHECK(r.present_value.residual_value == Approx(-0.5 * price * std::pow(1.08, -15)));
  CHECK(r.final_end_of_life_year == Approx(30.0));
  CHECK(r.present_value.end_of_life == Approx(10 * r.bank.nameplate_kwh * std::pow(1.08, -30)));
}

TEST_CASE("the residual value is the replacement price of the last year, not the price paid",
          "[model][lifecycle]") {
  // Service limit 10 years in a 15-year project, replacement share 0.5, prices falling 4 % a
  // year: the bank bought at the end of year 10 cost I0 x 0.5 x 0.96^10 and has half its life
  // left at 15; that half is credited at what a bank costs in year 15, I0 x 0.5 x 0.96^15
  // (docs/method.md 6), discounted from 15.
  DailyCycle c;
  c.profile.max_service_years = 10;
  c.profile.costs.replacement_share = 0.5;
  c.profile.costs.price_decline_per_year = 0.04;
  LifecycleEvaluator ev(c.profile, c.site, c.economics);
  const DesignResult r = ev.evaluate(0.5, 10);
  const double i0 = 200 * r.bank.nameplate_kwh;
  REQUIRE(r.replacement_years == std::vector<int>{10});
  CHECK(r.years[9].replacement == Approx(i0 * 0.5 * std::pow(0.96, 10)));
  CHECK(r.present_value.residual_value ==
        Approx(-0.5 * i0 * 0.5 * std::pow(0.96, 15) * std::pow(1.08, -15)));
  // Schmidt et al.'s figure carries no residual value: it exceeds the LCOS by that credit.
  CHECK((r.lcos_schmidt_per_kwh - r.lcos_per_kwh) * r.discounted_delivered_kwh ==
        Approx(-r.present_value.residual_value));
}

TEST_CASE("the service-age limit replaces a bank that is not worn out", "[model][lifecycle]") {
  // max_service_years 5 in a 15-year project: replacements at the end of years 5 and 10, and
  // the last bank is exactly at its limit at year 15 (no residual, end of life at N + 1).
  DailyCycle c;
  c.profile.max_service_years = 5;
  c.profile.costs.replacement_share = 0.5;
  LifecycleEvaluator ev(c.profile, c.site, c.economics);
  const DesignResult r = ev.evaluate(0.5, 10);
  CHECK(r.replacement_years == std::vector<int>{5, 10});
  const double price = 200 * r.bank.nameplate_kwh * 0.5;
  CHECK(r.present_value.replacements == Approx(price * (std::pow(1.08, -5) + std::pow(1.08, -10))));
  CHECK(r.present_value.residual_value == Approx(0.0).margin(1e-9));
  CHECK(r.final_end_of_life_year == Approx(16.0));
}

TEST_CASE("a bank that wears out several times within a year is replaced in those months",
          "[model][lifecycle]") {
  // 365 cycles a year at DoD 0.5 against a cycle life of 100: damage 3.65 a year, about 0.30 a
  // month (arithmetic of this test). Health is updated monthly and a worn bank is replaced at
  // the end of the month its damage reaches 1, the wear beyond 1 carried into the new bank:
  // cumulative wear 1.22, 2.13, 3.04 at the ends of months 4, 7 and 10 of year 1 (3 banks, 0.65
  // carried into year 2); year 2 takes the sum from 3.65 to 7.30 (4 banks), year 3 to 10.95
  // (3), year 4 to 14.6 (4: 14 is passed in month 11; the last month ends the project and
  // replaces nothing).
  DailyCycle c;
  c.profile.cycle_life = CycleLifeCurve({{0.5, 100}, {1.0, 50}});
  c.economics.project_years = 4;
  LifecycleEvaluator ev(c.profile, c.site, c.economics);
  const DesignResult r = ev.evaluate(0.5, 10);
  REQUIRE(r.years.size() == 4);
  CHECK(r.years[0].replacements == 3);
  CHECK(r.years[0].replacement_months == std::vector<int>{4, 7, 10});
  CHECK(r.years[1].replacements == 4);
  CHECK(r.years[2].replacements == 3);
  CHECK(r.years[3].replacements == 4);
  CHECK(r.years[3].replacement_months.back() < 12);  // none at the project's end
  CHECK(r.replacement_years.size() == 14);
  CHECK(r.replacement_months.size() == r.replacement_years.size());
  // Year 2 starts with the wear of year 1 beyond its three banks, 3.65 - 3, to within one half
  // cycle (0.5 / 100 = 0.005): a new bank starts full, so its rainflow history differs from
  // the old bank's by the leg that was under way at the replacement.
  CHECK(r.years[1].health_start == Approx(1 - 0.2 * 0.65).margin(0.2 * 0.005 + 1e-9));
  // A replaced year's lowest health is at the end of life: damage_peak reaches 1.
  CHECK(r.years[0].damage_peak >= 1.0 - 1e-9);
  CHECK(r.years[0].replaced_worn_out);
}

TEST_CASE("a bank left without a full charge ages by the partial-charge stress",
          "[model][ageing]") {
  // Self-discharge takes the SOC below "full" in the first hour and nothing recharges it:
  // hours 168..8759 are beyond the 7-day grace period, 8592 h = 358 days, at 0.001 per day.
  auto p = ideal_cell(100);
  p.self_discharge_per_month = 0.01;
  p.partial_charge = PartialChargeStress{1.0, 7, 0.001};
  const SiteConditions s = quiet_site(48.0, 25.0);
  Economics e;
  e.project_years = 1;
  LifecycleEvaluator ev(p, s, e);
  const DesignResult r = ev.evaluate(0.5, 1);
  CHECK(r.years[0].damage_partial_charge == Approx(0.358));
}

TEST_CASE("a partial replacement removes only its own end-of-life value", "[model][lifecycle]") {
  // Flow-battery style: stacks replaced (10 per kWh disposal), electrolyte kept and sold at the
  // end (-40 per kWh).
  DailyCycle c;
  c.profile.max_service_years = 5;
  c.profile.costs.end_of_life_per_kwh = -40;
  c.profile.costs.replacement_end_of_life_per_kwh = 10;
  LifecycleEvaluator ev(c.profile, c.site, c.economics);
  const DesignResult r = ev.evaluate(0.5, 10);
  const double kwh = r.bank.nameplate_kwh;
  CHECK(r.present_value.end_of_life ==
        Approx(10 * kwh * (std::pow(1.08, -5) + std::pow(1.08, -10)) -
               40 * kwh * std::pow(1.08, -16)));
}

TEST_CASE("below its table the cycle-life curve never gets flatter than constant throughput",
          "[model][cycle-life]") {
  // A curve of slope -0.5 between DoD 0.2 and 0.8: below 0.2 it follows N(D) = N(0.2) 0.2 / D
  // (constant Ah throughput); a steeper table slope (-1.5) is kept as it is.
  const CycleLifeCurve flat({{0.2, 4000}, {0.8, 2000}});
  CHECK(flat.cycles_to_end_of_life(0.1) == Approx(8000));
  CHECK(flat.cycles_to_end_of_life(0.5) == Approx(4000 * std::pow(2.5, -0.5)));
  const CycleLifeCurve steep({{0.2, 1000 * std::pow(0.2, -1.5)}, {1.0, 1000}});
  CHECK(steep.cycles_to_end_of_life(0.1) == Approx(1000 * std::pow(0.1, -1.5)));
}

TEST_CASE("a logged series is aged by Miner's rule at its temperatures", "[model][duty]") {
  // SOC 1 -> 0.5 -> 1 logged hourly at 35 degC with a 10 K halving interval (ageing 2x):
  // two half cycles of depth 0.5, damage 2 x 0.5 x 2 / N(0.5); two hours of calendar ageing at
  // 2x against a 10-year life.
  auto p = ideal_cell(100);
  p.cycle_life = CycleLifeCurve({{0.5, 1000}, {1.0, 500}});
  p.calendar_life_years = 10;
  const std::vector<double> soc{1.0, 0.5, 1.0};
  const std::vector<double> temp{35, 35, 35};
  const auto summary = summarise_cycles(soc);
  CHECK(summary.equivalent_full_cycles == Approx(0.5));
  const DutyDamage d = duty_damage(p, summary, temp, soc.size(), 1.0);
  CHECK(d.cycle == Approx(2 * 0.5 * 2 / 1000.0));
  CHECK(d.calendar == Approx(2 * 2 / (10 * 8760.0)));
  CHECK(d.remaining_life_years == Approx((1 - d.total()) / (d.total() / 2) / 8760));
}
