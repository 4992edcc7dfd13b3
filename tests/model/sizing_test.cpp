// SPDX-License-Identifier: MIT
#include "model/sizing.h"

#include <catch2/catch.hpp>

#include "model_fixtures.h"

using namespace stowage;
using namespace stowage::testing;

TEST_CASE("autonomy sizing follows the IEEE Std 1013 adjustment chain", "[model][sizing]") {
  // IEEE Std 1013 method (check-values.md section 7, procedure from memory, arithmetic CALC):
  // 24 V, 100 Ah/day, 5 days autonomy, max DoD 0.8, lowest temperature 15.6 degC with the
  // IEEE Std 485 factor 1.11, design margin 1.10, ageing factor 1.25 (end of life at 80 %):
  // unadjusted 500 Ah, adjusted 763.1 Ah, with ageing 953.9 Ah; 12 cells of 2 V in series.
  auto p = ideal_cell(100);
  TemperatureSpec t = p.temperature.spec();
  t.capacity_factor = {{15.6, 1.0 / 1.11}, {25.0, 1.0}};
  p.temperature = TemperatureBehaviour(t);
  auto s = quiet_site(24.0, 15.6);
  s.load_kw.assign(kHoursPerYear, 100.0 * 24.0 / 1000.0 / 24.0);  // 100 Ah/day at 24 V
  s.autonomy_days = 5;
  s.design_margin = 1.10;
  const auto sizing = size_for_autonomy(p, s, 0.8);
  CHECK(sizing.cells_series == 12);
  CHECK(sizing.design_daily_load_kwh == Approx(2.4));
  CHECK(sizing.temperature_factor == Approx(1.0 / 1.11));
  const double required_ah = sizing.required_nameplate_kwh * 1000.0 / 24.0;
  CHECK(required_ah == Approx(953.9).epsilon(1e-4));
  CHECK(sizing.strings_parallel == 10);  // ceil(953.9 / 100)
  // The autonomy check used by the optimiser agrees with the sizing.
  CHECK(design_usable_kwh(p, s, 0.8, 10) >= sizing.required_usable_kwh);
  CHECK(design_usable_kwh(p, s, 0.8, 9) < sizing.required_usable_kwh);
}

TEST_CASE("sizing takes no capacity credit for heat", "[model][sizing]") {
  // IEEE Std 485 sizing practice (from memory): factors that would shrink the bank above
  // 25 degC are not used.
  auto p = ideal_cell(100);
  TemperatureSpec t = p.temperature.spec();
  t.capacity_factor = {{25.0, 1.0}, {40.0, 1.1}};
  p.temperature = TemperatureBehaviour(t);
  auto s = quiet_site(24.0, 40.0);
  s.load_kw.assign(kHoursPerYear, 0.1);
  s.autonomy_days = 2;
  CHECK(size_for_autonomy(p, s, 0.5).temperature_factor == 1.0);
}
