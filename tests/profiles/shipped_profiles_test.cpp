// SPDX-License-Identifier: MIT
// The shipped generic profiles agree with the published sources they cite.
#include <catch2/catch.hpp>
#include <string>

#include "catalog-schema/profile_loader.h"
#include "test_paths.h"

using namespace stowage;

namespace {
ChemistryProfile shipped(const std::string& name) {
  return load_profile_file(std::string(STOWAGE_SOURCE_DIR) + "/catalog-schema/profiles/" + name +
                           ".yaml");
}
}  // namespace

TEST_CASE("the flooded lead-acid profile reproduces the IEEE Std 485 temperature table",
          "[profiles][temperature]") {
  // IEEE Std 485 Table 1, cell-size correction factor K_T against electrolyte temperature
  // (vented cells, 1.215 SG), from memory, supported by a published cubic fit within 0.012
  // (check-values.md 4.1). Available capacity = 1 / K_T; tolerance 0.005 until the rows are
  // confirmed against the standard.
  const auto p = shipped("lead-acid-flooded-tubular");
  const std::pair<double, double> rows[] = {
      {-3.9, 1.520}, {-1.1, 1.430}, {4.4, 1.300},  {10.0, 1.190}, {15.6, 1.110},
      {18.3, 1.080}, {21.1, 1.040}, {23.9, 1.011}, {25.0, 1.000}, {26.7, 0.987},
      {32.2, 0.940}, {37.8, 0.910}, {43.3, 0.880}, {51.7, 0.850}};
  for (const auto& [temp_c, k_t] : rows) {
    INFO("temperature " << temp_c << " degC");
    CHECK(p.temperature.capacity_factor(temp_c) * k_t == Approx(1.0).margin(0.005));
  }
  // Midway between rows the table is interpolated (IEEE Std 485: interpolate between rows).
  CHECK(1.0 / p.temperature.capacity_factor(7.2) == Approx(1.245).margin(0.01));
}

TEST_CASE("the AGM profile halves its life every 8 degC above 25 degC", "[profiles][temperature]") {
  // Battery University BU-806a (check-values.md 4.2, READ): 10 years at 25 degC, 5 at 33 degC,
  // 2.5 at 41 degC for a VRLA battery.
  const auto p = shipped("vrla-agm");
  CHECK(p.temperature.life_at(10, 33) == Approx(5.0));
  CHECK(p.temperature.life_at(10, 41) == Approx(2.5));
}

TEST_CASE("shipped profiles keep the trade's nominal cell voltages", "[profiles]") {
  // Nominal cell voltages (common practice): lead-acid 2.0 V, LiFePO4 3.2 V, NMC 3.6-3.7 V,
  // NiCd 1.2 V, vanadium flow 1.4 V.
  CHECK(shipped("lead-acid-flooded-tubular").cell_nominal_v == Approx(2.0));
  CHECK(shipped("vrla-agm").cell_nominal_v == Approx(2.0));
  CHECK(shipped("vrla-gel").cell_nominal_v == Approx(2.0));
  CHECK(shipped("lfp").cell_nominal_v == Approx(3.2));
  const double nmc = shipped("nmc").cell_nominal_v;
  CHECK(nmc >= 3.6);
  CHECK(nmc <= 3.7);
  CHECK(shipped("nicd-pocket-plate").cell_nominal_v == Approx(1.2));
  CHECK(shipped("vanadium-flow").cell_nominal_v == Approx(1.4));
}

TEST_CASE("lithium profiles do not charge below freezing", "[profiles][temperature]") {
  // Common practice: no lithium charging below about 0 degC without heating.
  for (const char* name : {"lfp", "nmc"}) {
    INFO(name);
    const auto p = shipped(name);
    CHECK_FALSE(p.temperature.can_charge(-1.0));
    CHECK(p.temperature.can_charge(10.0));
  }
}

TEST_CASE("every shipped profile's cycle life falls with depth", "[profiles][cycle-life]") {
  // Shallower cycles give many more of them (common practice); the loader enforces it, this
  // pins that the shipped curves are real curves and not flat lines.
  for (const char* name : {"lead-acid-flooded-tubular", "vrla-agm", "vrla-gel", "lfp", "nmc",
                           "nicd-pocket-plate", "vanadium-flow", "sodium-ion"}) {
    INFO(name);
    const auto p = shipped(name);
    CHECK(p.cycle_life.cycles_to_end_of_life(0.2) > p.cycle_life.cycles_to_end_of_life(0.8));
    CHECK(p.round_trip_efficiency() > 0.5);
    CHECK(p.round_trip_efficiency() < 1.0);
  }
}

TEST_CASE("no shipped cycle-life curve wears shallow cycles more per kWh than deep ones",
          "[profiles][cycle-life]") {
  // Lifetime throughput in full cycles (cycles x DoD) must not fall toward shallow DoD: the
  // constant Ah-throughput bound (common practice; docs/method.md 5). Checked on the curve as
  // the model reads it, between the table's own points and below it.
  for (const char* name : {"lead-acid-flooded-tubular", "vrla-agm", "vrla-gel", "lfp", "nmc",
                           "nicd-pocket-plate", "vanadium-flow", "sodium-ion"}) {
    INFO(name);
    const auto curve = shipped(name).cycle_life;
    for (double d = 0.1; d < 0.999; d += 0.05) {
      INFO("DoD " << d);
      CHECK(curve.cycles_to_end_of_life(d) * d >=
            curve.cycles_to_end_of_life(d + 0.05) * (d + 0.05) * (1 - 1e-9));
    }
  }
}

TEST_CASE("the NMC curve has the DoD shape of Xu et al. 2018", "[profiles][cycle-life]") {
  // Xu et al. 2018 DoD stress (check-values.md 5.2: coefficients from a third-party
  // reimplementation, cycles computed): 31236 / 12315 / 5501 / 2787 cycles to 20 % loss at
  // 20 / 50 / 80 / 100 % DoD. The profile scales them to 3000 at 80 % (from memory) and rounds.
  const auto curve = shipped("nmc").cycle_life;
  const double at80 = curve.cycles_to_end_of_life(0.8);
  CHECK(curve.cycles_to_end_of_life(0.2) / at80 == Approx(31236.0 / 5501).epsilon(0.01));
  CHECK(curve.cycles_to_end_of_life(0.5) / at80 == Approx(12315.0 / 5501).epsilon(0.01));
  CHECK(curve.cycles_to_end_of_life(1.0) / at80 == Approx(2787.0 / 5501).epsilon(0.01));
}

TEST_CASE("the LFP curve keeps constant Ah throughput from 20 to 80 % DoD",
          "[profiles][cycle-life]") {
  // Wang et al. 2011 (J. Power Sources 196(8):3942-3948, Eq. 5 as reproduced by a third party,
  // check-values.md 5.3) give the capacity loss of graphite-LiFePO4 cells as a function of
  // ampere-hour throughput with no separate DoD term: equal throughput to end of life at every
  // depth, N x DoD = const.
  const auto curve = shipped("lfp").cycle_life;
  const double throughput = curve.cycles_to_end_of_life(0.8) * 0.8;
  for (double d : {0.2, 0.35, 0.5, 0.65})
    CHECK(curve.cycles_to_end_of_life(d) * d == Approx(throughput).epsilon(1e-9));
}

TEST_CASE("the vanadium-flow pumps take the published share of the power moved",
          "[profiles][auxiliary]") {
  // Garcia-Quismondo et al. 2019 (Batteries 5(3):52, abstract): the pumps of a 5 kW/5 kWh
  // vanadium flow battery take 8-9 % of rated power, and its full-cycle efficiency is about
  // 65 %. The profile takes the midpoint per kW moved; its round trip with pumps,
  // eta (1 - a_p) / (1 + a_p) (docs/method.md 4, step 5), then lands near the published 65 %
  // (from the abstract; a looser 0.05 because our figure is at the DC terminals).
  const auto p = shipped("vanadium-flow");
  CHECK(p.auxiliary.pump_kw_per_kw >= 0.08);
  CHECK(p.auxiliary.pump_kw_per_kw <= 0.09);
  CHECK(p.round_trip_with_pumps() == Approx(0.65).margin(0.05));
  CHECK(p.round_trip_with_pumps() < p.round_trip_efficiency());
}
