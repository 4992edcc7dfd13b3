// SPDX-License-Identifier: MIT
#include <catch2/catch.hpp>

#include "model/cycle_life_curve.h"
#include "model/invalid_value.h"
#include "model/temperature_behaviour.h"

using namespace stowage;

namespace {
TemperatureBehaviour halving(double interval_k, double ref_c = 25) {
  TemperatureSpec s;
  s.reference_temp_c = ref_c;
  s.capacity_factor = {{-20, 0.5}, {25, 1.0}, {45, 1.1}};
  s.law = AgeingLaw::Halving;
  s.halving_interval_k = interval_k;
  return TemperatureBehaviour(s);
}
}  // namespace

TEST_CASE("sealed lead-acid life halves for every 8 degC above 25 degC", "[model][temperature]") {
  // Battery University BU-806a: a VRLA battery good for 10 years at 25 degC lasts 5 years at
  // 33 degC and 2.5 years at 41 degC (check-values.md 4.2, READ).
  const auto t = halving(8.0);
  CHECK(t.life_at(10, 25) == Approx(10));
  CHECK(t.life_at(10, 33) == Approx(5));
  CHECK(t.life_at(10, 41) == Approx(2.5));
  // Same law at 35 and 45 degC: 4.204 and 1.768 years (check-values.md 4.2, CALC).
  CHECK(t.life_at(10, 35) == Approx(4.204).margin(5e-4));  // printed to 3 decimals
  CHECK(t.life_at(10, 45) == Approx(1.768).margin(5e-4));
}

TEST_CASE("an Arrhenius activation energy of 65.75 kJ/mol halves life at 33 degC",
          "[model][temperature]") {
  // check-values.md 4.2 (CALC): Ea = 65.75 kJ/mol is the Arrhenius equivalent of an 8 K halving
  // interval near 25 degC; 52.95 kJ/mol of a 10 K interval.
  TemperatureSpec s;
  s.capacity_factor = {{25, 1.0}};
  s.law = AgeingLaw::Arrhenius;
  s.activation_energy_j_per_mol = 65750;
  const TemperatureBehaviour a(s);
  CHECK(a.raw_acceleration(33) == Approx(2.0).epsilon(2e-3));
  s.activation_energy_j_per_mol = 52950;
  CHECK(TemperatureBehaviour(s).raw_acceleration(35) == Approx(2.0).epsilon(2e-3));
}

TEST_CASE("no life credit is taken below the reference temperature", "[model][temperature]") {
  // Model convention (docs/method.md): ageing acceleration is floored at 1.
  const auto t = halving(10.0);
  CHECK(t.ageing_acceleration(5) == 1.0);
  CHECK(t.raw_acceleration(15) == Approx(0.5));
}

TEST_CASE("available capacity is interpolated in the table and held beyond it",
          "[model][temperature]") {
  const auto t = halving(10.0);
  CHECK(t.capacity_factor(2.5) == Approx(0.75));
  CHECK(t.capacity_factor(-40) == Approx(0.5));
  CHECK(t.capacity_factor(60) == Approx(1.1));
}

TEST_CASE("temperature rows must increase", "[model][temperature]") {
  TemperatureSpec s;
  s.capacity_factor = {{25, 1.0}, {10, 0.9}};
  CHECK_THROWS_AS(TemperatureBehaviour(s), InvalidValue);
}

TEST_CASE("the least-squares power law matches the fit of the published NMC and LFP tables",
          "[model][cycle-life]") {
  // Battery University BU-808 DoD table (NMC / LFP, 100..10 % DoD) and its least-squares
  // log-log fit N100 = 302.4, k = 1.264 (NMC); 691.8, 1.439 (LFP) (check-values.md 5.4:
  // table READ-3P/from memory, fit CALC).
  const CycleLifeCurve nmc(
      {{1.0, 300}, {0.8, 400}, {0.6, 600}, {0.4, 1000}, {0.2, 2000}, {0.1, 6000}});
  const auto f = nmc.power_law_fit();
  CHECK(f.cycles_at_full_depth == Approx(302.4).epsilon(1e-3));
  CHECK(f.exponent == Approx(1.264).epsilon(1e-3));
  const CycleLifeCurve lfp(
      {{1.0, 600}, {0.8, 900}, {0.6, 1500}, {0.4, 3000}, {0.2, 9000}, {0.1, 15000}});
  CHECK(lfp.power_law_fit().cycles_at_full_depth == Approx(691.8).epsilon(1e-3));
  CHECK(lfp.power_law_fit().exponent == Approx(1.439).epsilon(1e-3));
}

TEST_CASE("log-log interpolation reproduces an exact power law", "[model][cycle-life]") {
  // N = 1000 D^-1.5 sampled at three points; between and beyond them the curve is the same
  // power law (the Woehler form, common practice).
  auto n = [](double d) { return 1000 * std::pow(d, -1.5); };
  const CycleLifeCurve c({{0.2, n(0.2)}, {0.5, n(0.5)}, {1.0, n(1.0)}});
  for (double d : {0.05, 0.3, 0.7, 1.0}) CHECK(c.cycles_to_end_of_life(d) == Approx(n(d)));
  CHECK(c.damage_per_cycle(0.0) == 0.0);
  CHECK(c.damage_per_cycle(1.0) == Approx(1e-3));
}

TEST_CASE("a cycle-life curve that does not decrease is refused", "[model][cycle-life]") {
  try {
    CycleLifeCurve({{0.2, 3000}, {0.5, 3500}, {0.8, 1000}});
    FAIL("expected InvalidValue");
  } catch (const InvalidValue& e) {
    CHECK(e.field() == "[1].cycles");
  }
  CHECK_THROWS_AS(CycleLifeCurve({{0.5, 1000}}), InvalidValue);
  CHECK_THROWS_AS(CycleLifeCurve({{0.0, 1000}, {0.5, 500}}), InvalidValue);
  CHECK_THROWS_AS(CycleLifeCurve({{0.5, 1000}, {1.2, 500}}), InvalidValue);
}
