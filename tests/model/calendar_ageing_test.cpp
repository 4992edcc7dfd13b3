// SPDX-License-Identifier: MIT
// Calendar ageing: the optional SOC stress (a multiplier against the hour's mean SOC) and the
// optional separate temperature law of calendar ageing (ageing.h).
#include <catch2/catch.hpp>
#include <cmath>

#include "model/ageing.h"
#include "model/duty_cycles.h"
#include "model_fixtures.h"

using namespace stowage;
using namespace stowage::testing;

namespace {
// A bank held at `soc` all year at `temp_c`, with a 10-year calendar life.
YearDamage held_year(const ChemistryProfile& p, double soc, double temp_c) {
  const std::vector<double> temp(kHoursPerYear, temp_c);
  const std::vector<double> trace(kHoursPerYear + 1, soc);
  const AccelerationSeries a = acceleration_series(p, temp);
  RainflowScratch scratch;
  return year_damage(p, a, trace, 0.0, scratch);
}
}  // namespace

TEST_CASE("calendar ageing kept at SOC 0.8 runs 1.36615 times faster under the Xu et al. stress",
          "[model][ageing]") {
  // Xu, Oudalov, Ulbig, Andersson & Kirschen (2018), IEEE Trans. Smart Grid 9(2):1131-1140:
  // S_sigma = exp(k_sigma (sigma - sigma_ref)), k_sigma = 1.04, sigma_ref = 0.5; S_sigma(0.8) =
  // 1.36615 (check-values.md 5.2, coefficients from a third-party reimplementation, value
  // computed). A year at the reference temperature against a 10-year life: 1.36615 / 10.
  ChemistryProfile p = ideal_cell(100);
  p.calendar_life_years = 10;
  p.calendar_soc_stress = CalendarSocStress{1.04, 0.5};
  CHECK(held_year(p, 0.8, 25.0).calendar == Approx(1.36615 / 10).epsilon(1e-5));
  CHECK(held_year(p, 0.5, 25.0).calendar == Approx(0.1).epsilon(1e-12));
  p.calendar_soc_stress.reset();  // default: no SOC dependence
  CHECK(held_year(p, 0.8, 25.0).calendar == Approx(0.1).epsilon(1e-12));
}

TEST_CASE("calendar ageing can follow its own temperature law", "[model][ageing]") {
  // Cycling halves life per 10 K (a = 2^0.8 = 1.7411 at 33 degC); calendar ageing halves per
  // 8 K, so at 33 degC it runs twice as fast: 10 years at 25 degC -> 5 at 33 degC (Battery
  // University BU-806a, check-values.md 4.2).
  ChemistryProfile p = ideal_cell(100);
  p.calendar_life_years = 10;
  TemperatureSpec t = p.temperature.spec();
  t.calendar_law = AgeingLaw::Halving;
  t.calendar_halving_interval_k = 8;
  p.temperature = TemperatureBehaviour(t);
  const AccelerationSeries a = acceleration_series(p, std::vector<double>(kHoursPerYear, 33.0));
  CHECK(a.per_hour[0] == Approx(std::pow(2.0, 0.8)).epsilon(1e-12));
  CHECK(a.calendar_per_hour[0] == Approx(2.0).epsilon(1e-12));
  CHECK(a.calendar_damage_per_year == Approx(1.0 / 5).epsilon(1e-9));
  // Without a calendar law both follow the cycling law.
  const ChemistryProfile same = ideal_cell(100);
  CHECK(same.temperature.calendar_acceleration(33.0) == same.temperature.ageing_acceleration(33.0));
}

TEST_CASE("a logged series carries the calendar law and the SOC stress", "[model][duty]") {
  // Two hours held at SOC 0.8 at 33 degC: calendar law 8 K (a = 2), SOC stress 1.36615 (Xu et
  // al. 2018 coefficients): 2 h x 2 x 1.36615 against a 10-year life.
  ChemistryProfile p = ideal_cell(100);
  p.calendar_life_years = 10;
  p.calendar_soc_stress = CalendarSocStress{1.04, 0.5};
  TemperatureSpec t = p.temperature.spec();
  t.calendar_law = AgeingLaw::Halving;
  t.calendar_halving_interval_k = 8;
  p.temperature = TemperatureBehaviour(t);
  const std::vector<double> soc{0.8, 0.8, 0.8};
  const DutyDamage d = duty_damage(p, summarise_cycles(soc), {33, 33, 33}, soc.size(), 1.0);
  CHECK(d.calendar == Approx(2 * 2 * 1.36615 / (10 * 8760.0)).epsilon(1e-5));
}
