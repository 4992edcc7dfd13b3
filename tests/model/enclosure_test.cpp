// SPDX-License-Identifier: MIT
// The enclosure's thermal node against the closed-form solutions of the lumped-capacitance
// model (Incropera, DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, 6th ed.,
// section 5.2: theta / theta_i = exp(-t / tau), tau = C / G; steady state T = T_a + P / G) and
// the conditioning of a constant ambient against a hand calculation.
#include "model/enclosure.h"

#include <catch2/catch.hpp>
#include <cmath>

#include "model/invalid_value.h"

using namespace stowage;

namespace {
// G = 10 W/K and C = 360 kJ/K: time constant C / G = 36,000 s = 10 h.
Enclosure ten_hour_node() {
  Enclosure e;
  e.id = "test";
  e.conductance_w_per_k = 10;
  e.thermal_mass_kj_per_k = 360;
  return e;
}
}  // namespace

TEST_CASE("A step of ambient decays with the time constant C / G (Incropera 5.2)") {
  const Enclosure e = ten_hour_node();
  double t = 20;  // starts at 20 degC, ambient steps to 0
  for (int h = 0; h < 10; ++h) t = thermal_hour(e, 360, t, 0.0, 0.0, true).end_c;
  CHECK(t == Approx(20 * std::exp(-1.0)).epsilon(1e-12));  // one time constant: 7.3576 degC
  for (int h = 10; h < 30; ++h) t = thermal_hour(e, 360, t, 0.0, 0.0, true).end_c;
  CHECK(t == Approx(20 * std::exp(-3.0)).epsilon(1e-12));
}

TEST_CASE("Constant ambient and internal heat settle at T_a + P / G, whatever the time step") {
  const Enclosure e = ten_hour_node();
  double t = -15;
  for (int h = 0; h < 400; ++h) t = thermal_hour(e, 360, t, 5.0, 0.2, true).end_c;
  CHECK(t == Approx(5.0 + 0.2 / 0.010).margin(1e-9));  // 25 degC
  // A node far faster than the hour (tau = 360 s, ten per hour) is still stable: one step is
  // the exact 25 + (40 - 25) exp(-10), no overshoot as an explicit Euler step would give.
  const double fast = thermal_hour(e, 3.6, 40.0, 5.0, 0.2, true).end_c;
  CHECK(fast == Approx(25.0 + 15.0 * std::exp(-10.0)).epsilon(1e-12));
}

TEST_CASE("Heating a node held at its setpoint in constant cold takes G x (to_c - T_a) - gain") {
  Enclosure e = ten_hour_node();
  e.heating = EnclosureHeating{5.0, 1.0, 0.9, false};
  // Hand calculation: at -10 degC outside, holding 5 degC loses 10 W/K x 15 K = 150 W; with
  // 30 W of internal heat the heater gives 120 W, drawing 120 / 0.9 = 133.3 W.
  const ThermalHour h = thermal_hour(e, 360, 5.0, -10.0, 0.030, true);
  CHECK(h.heat_kwh == Approx(0.120).epsilon(1e-12));
  CHECK(h.electricity_kwh == Approx(0.120 / 0.9).epsilon(1e-12));
  CHECK(settle_hour(e, 360, h, 1.0) == Approx(5.0).margin(1e-12));
  // Half the electricity: half the heat, the node ends below the setpoint.
  CHECK(settle_hour(e, 360, h, 0.5) < 5.0);
  // The heater's capacity caps the heat.
  e.heating->capacity_kw = 0.05;
  CHECK(thermal_hour(e, 360, 5.0, -10.0, 0.030, true).heat_kwh == Approx(0.05));
  // Charge-only heating that may not run this hour leaves the node free.
  CHECK(thermal_hour(e, 360, 5.0, -10.0, 0.030, false).heat_kwh == 0);
}

TEST_CASE("Cooling removes G x (T_a + P / G - to_c) at the COP of the hour's ambient") {
  Enclosure e = ten_hour_node();
  e.cooling = EnclosureCooling{30.0, 2.0, 3.0, 35.0, -0.05, 1.0};
  // Hand calculation: 40 degC outside, 30 degC held, no internal heat: 100 W removed; COP at
  // 40 degC is 3 - 0.05 x 5 = 2.75, so 100 / 2.75 = 36.4 W of electricity.
  const ThermalHour h = thermal_hour(e, 360, 30.0, 40.0, 0.0, true);
  CHECK(h.cool_kwh == Approx(0.100).epsilon(1e-12));
  CHECK(h.electricity_kwh == Approx(0.100 / 2.75).epsilon(1e-12));
  CHECK(e.cooling->cop_at(100.0) == 1.0);  // floored at cop_min
}

TEST_CASE("An enclosure with cooling below its heating setpoint is refused, naming the field") {
  Enclosure e = ten_hour_node();
  e.heating = EnclosureHeating{20.0, 1.0, 1.0, false};
  e.cooling = EnclosureCooling{15.0, 1.0, 3.0, 35.0, 0.0, 1.0};
  CHECK_THROWS_WITH(e.validate(), Catch::Contains("enclosure.cooling.to_c"));
  e.cooling.reset();
  e.conductance_w_per_k = 0;
  CHECK_THROWS_WITH(e.validate(), Catch::Contains("enclosure.conductance_w_per_k"));
}
