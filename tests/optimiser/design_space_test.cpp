// SPDX-License-Identifier: MIT
// The admissible strings of each (profile, setpoint) pair against hand calculations: the
// IEEE Std 1013 autonomy sizing (required nameplate = daily load x days x margin /
// (inverter efficiency x DoD x temperature factor x end-of-life capacity)), the peak-discharge
// C-rate at the terminals, and the budget and mass caps.
#include "optimiser/design_space.h"

#include <catch2/catch.hpp>
#include <cmath>

using namespace stowage;

namespace {

// A flat 1 kW load, no source, 20 degC everywhere, 48 V bus, 90 % inverter.
StudyCase hand_study() {
  StudyCase s;
  s.title = "hand-checked sizing";
  SiteConditions& site = s.site;
  site.name = "flat load";
  site.bus_voltage_v = 48;
  site.load_kw.assign(kHoursPerYear, 1.0);
  site.source_kw.assign(kHoursPerYear, 0.0);
  site.temp_c.assign(kHoursPerYear, 20.0);
  site.charge_price_per_kwh.assign(kHoursPerYear, 0.0);
  site.autonomy_days = 2;
  site.design_margin = 1.0;
  site.charger_efficiency = 0.95;
  site.inverter_efficiency = 0.9;
  site.backup_price_per_kwh = 0.5;
  site.validate();

  ChemistryProfile p;
  p.id = "hand-2v";
  p.family = "lead-acid";
  p.cell_nominal_v = 2.0;
  p.cell_capacity_ah = 100;
  p.mean_discharge_v = 1.95;
  p.mean_charge_v = 2.3;
  p.max_charge_c_rate = 0.2;
  p.max_discharge_c_rate = 0.1;
  p.cycle_life = CycleLifeCurve({{0.2, 5000}, {0.5, 2000}, {1.0, 800}});
  TemperatureSpec t;
  t.capacity_factor = {{-20, 1.0}, {40, 1.0}};  // no temperature derating
  p.temperature = TemperatureBehaviour(t);
  p.eol_capacity_fraction = 0.8;
  p.dod = {0.2, 1.0, 0.5};
  p.costs.capital_per_kwh = 200;
  p.costs.capital_per_string = 100;
  p.costs.installation_fixed = 1000;
  p.cell_mass_kg = 30;
  p.validate();
  s.profiles.push_back(p);
  s.economics.project_years = 10;
  s.economics.real_discount_rate = 0.05;
  s.search.dod_from = 0.5;
  s.search.dod_to = 0.5;
  s.search.dod_step = 0.05;
  s.search.max_strings_parallel = 40;
  return s;
}

}  // namespace

TEST_CASE("autonomy strings follow the IEEE 1013 sizing by hand", "[optimiser][space]") {
  const StudyCase s = hand_study();
  const DesignSpace space = build_design_space(s);
  REQUIRE(space.choices.size() == 1);
  const DesignChoice& c = space.choices[0];
  // 24 cells of 2 V x 100 Ah = 4.8 kWh a string (V x Ah, common practice).
  CHECK(string_nameplate_kwh(s.profiles[0], 48) == Approx(4.8));
  // IEEE 1013 sizes in ampere-hours at the bank's discharge voltage (24 cells x 1.95 V =
  // 46.8 V): 24,000 Wh/day x 2 days / (0.9 x 46.8 V x 0.5 x 1.0 x 0.8) = 2,849 Ah
  // -> ceil(2,849 / 100) = 29 strings.
  CHECK(c.required_usable_kwh == Approx(24.0 * 2 / 0.9));
  CHECK(c.autonomy_strings == 29);
  // Peak draw 1 kW / 0.9 = 1.111 kW at the terminals; a string gives
  // 0.1 C x 100 Ah x 24 cells x 1.95 V = 0.468 kW -> ceil(2.37) = 3 strings.
  CHECK(space.peak_discharge_terminal_kw == Approx(1.0 / 0.9));
  CHECK(c.c_rate_strings == 3);
  CHECK(c.min_strings == 29);
  CHECK(c.max_strings == 40);
  CHECK(c.cap == StringCap::MaxStrings);
  CHECK(space.admissible_designs() == 12);
}

TEST_CASE("without autonomy the discharge C-rate sets the least bank", "[optimiser][space]") {
  StudyCase s = hand_study();
  s.site.autonomy_days = 0;
  const DesignChoice c = build_design_space(s).choices.at(0);
  CHECK(c.min_strings == 3);
}

TEST_CASE("budget and mass caps give the largest bank by hand", "[optimiser][space]") {
  StudyCase s = hand_study();
  s.site.autonomy_days = 0;
  // I0(n) = 200 x 4.8 n + 100 n + 1000 = 1060 n + 1000 <= 12000 -> n <= 10.38 -> 10.
  s.search.budget = 12000;
  DesignChoice c = build_design_space(s).choices.at(0);
  CHECK(c.max_strings == 10);
  CHECK(c.cap == StringCap::Budget);
  CHECK(bank_investment(s.profiles[0], 48, 10) == Approx(11600));
  // 24 cells x 30 kg = 720 kg a string; 5000 kg -> 6 strings.
  s.search.max_mass_kg = 5000;
  c = build_design_space(s).choices.at(0);
  CHECK(c.max_strings == 6);
  CHECK(c.cap == StringCap::Mass);
}

TEST_CASE("a profile without a cell volume cannot meet a volume limit", "[optimiser][space]") {
  StudyCase s = hand_study();
  s.search.max_volume_l = 1e6;
  const DesignSpace space = build_design_space(s);
  CHECK_FALSE(space.choices.at(0).admissible());
  CHECK(space.choices.at(0).cap == StringCap::MissingVolume);
  REQUIRE(space.notes.size() == 1);
  CHECK(space.notes[0].kind == ProfileNote::Kind::NoCellVolume);
  const auto unmet = space.diagnose(s);
  REQUIRE_FALSE(unmet.empty());
  CHECK(unmet.back().requirement == Requirement::MissingCellData);
  CHECK_FALSE(unmet.back().missing_mass);
}

TEST_CASE("a design below the least admissible strings fails the requirement check",
          "[optimiser][space][requirements]") {
  // The same hand sizing as above: autonomy needs 29 strings (IEEE 1013 approach, by hand
  // above), the 1.111 kW peak 3 strings of 0.468 kW.
  const StudyCase s = hand_study();
  const ChemistryProfile& p = s.profiles[0];
  const RequirementCheck one = check_requirements(p, s.site, 0.5, 1);
  CHECK_FALSE(one.meets_autonomy);
  CHECK_FALSE(one.meets_peak);
  CHECK_FALSE(one.meets_all());
  CHECK(one.autonomy_strings == 29);
  CHECK(one.peak_strings == 3);
  CHECK(one.required_usable_kwh == Approx(24.0 * 2 / 0.9));
  CHECK(one.peak_kw == Approx(1.0 / 0.9));
  CHECK(one.power_kw == Approx(0.468));

  const RequirementCheck few = check_requirements(p, s.site, 0.5, 3);
  CHECK(few.meets_peak);
  CHECK_FALSE(few.meets_autonomy);
  CHECK(few.autonomy_strings == 29);  // not capped at the design's own strings + 1

  CHECK_FALSE(check_requirements(p, s.site, 0.5, 28).meets_autonomy);
  const RequirementCheck enough = check_requirements(p, s.site, 0.5, 29);
  CHECK(enough.meets_all());
  CHECK(enough.usable_kwh + 1e-9 >= enough.required_usable_kwh);
}
