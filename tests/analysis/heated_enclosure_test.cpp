// SPDX-License-Identifier: MIT
// A bank in a modelled enclosure: heating lets an LFP bank charge in cold hours that its
// charging limit blocked, and the conditioning energy of a constant ambient matches the hand
// calculation of the lumped-capacitance steady state (docs/method.md 11).
#include <catch2/catch.hpp>
#include <string>
#include <vector>

#include "catalog-schema/study_loader.h"
#include "model/dispatch.h"
#include "model/lifecycle.h"
#include "test_paths.h"

using namespace stowage;

namespace {
StudyCase heated_tarnbeck() {
  return load_study_file(std::string(STOWAGE_SOURCE_DIR) +
                         "/studies/tarnbeck-saddle/study-heated-shed.yaml");
}
const ChemistryProfile& lfp(const StudyCase& s) { return s.profiles[*s.find_profile("lfp")]; }
}  // namespace

TEST_CASE(
    "Heating on PV surplus lets LFP charge in hours its 0 degC limit blocked, so back-up falls") {
  const StudyCase heated = heated_tarnbeck();
  StudyCase unheated = heated;
  unheated.site.enclosure->heating.reset();
  set_enclosure_reference_temperature(unheated.site);

  LifecycleEvaluator with_heat(lfp(heated), heated.site, heated.economics);
  LifecycleEvaluator without(lfp(unheated), unheated.site, unheated.economics);
  const DesignResult h = with_heat.evaluate(0.8, 13);
  const DesignResult u = without.evaluate(0.8, 13);
  const YearDispatch& hy = h.years.front().dispatch;
  const YearDispatch& uy = u.years.front().dispatch;
  // Common practice: an unheated shed at about 1850 m spends many winter hours below 0 degC.
  CHECK(uy.charge_blocked_by_temperature_hours > 500);
  CHECK(hy.charge_blocked_by_temperature_hours < 0.5 * uy.charge_blocked_by_temperature_hours);
  CHECK(hy.backup_kwh < uy.backup_kwh);
  CHECK(hy.charged_terminal_kwh > uy.charged_terminal_kwh);
  // Charge-only heating is paid from surplus alone: nothing from the bank or back-up.
  CHECK(hy.heating_heat_kwh > 0);
  CHECK(hy.conditioning_bank_kwh == Approx(3e-3 * 8760).epsilon(0.5));  // the thermostat only
  CHECK(hy.conditioning_source_kwh > 0);
  CHECK(h.present_value.enclosure > heated.site.enclosure->capital);
}

TEST_CASE("Holding 5 degC at a constant -10 degC draws G x 15 K less the bank's own heat") {
  StudyCase s = heated_tarnbeck();
  SiteConditions& site = s.site;
  std::fill(site.ambient_c.begin(), site.ambient_c.end(), -10.0);
  std::fill(site.irradiance_w_m2.begin(), site.irradiance_w_m2.end(), 0.0);
  std::fill(site.load_kw.begin(), site.load_kw.end(), 0.0);
  std::fill(site.source_kw.begin(), site.source_kw.end(), 0.0);
  Enclosure& e = *site.enclosure;
  e.standing_kw = 0;
  e.heating = EnclosureHeating{5.0, 1.0, 1.0, false};
  set_enclosure_reference_temperature(site);

  DispatchInputs in;
  in.profile = &lfp(s);
  in.site = &site;
  in.bank = bank_geometry(lfp(s), site.bus_voltage_v, 13);
  in.dod_setpoint = 0.8;
  DispatchState state;
  state.temp_c = 5.0;  // starts at the setpoint
  std::vector<double> trace, temps(8760);
  in.temp_trace = temps.data();
  const YearDispatch y = dispatch_year(in, state, trace);
  // Hand calculation: each hour ends at 5 degC, so the heater gives G (5 - T_eq) with
  // T_eq = -10 + q / G: 12 W/K x 15 K = 0.18 kWh an hour, less the self-discharge heat q.
  const double g_kw_per_k = e.conductance_w_per_k / 1000.0;
  CHECK(y.heating_heat_kwh ==
        Approx(8760 * g_kw_per_k * 15.0 - y.bank_loss_heat_kwh).epsilon(1e-9));
  CHECK(y.conditioning_kwh == Approx(y.heating_heat_kwh).epsilon(1e-12));  // efficiency 1
  // Drawn from the bank down to its setpoint floor, then from back-up.
  CHECK(y.conditioning_bank_kwh + y.conditioning_backup_kwh == Approx(y.conditioning_kwh));
  CHECK(y.conditioning_backup_kwh > 0);
  CHECK(state.soc < 0.2 + 1e-9);  // at the floor, then self-discharge below it
  CHECK(temps[8759] == Approx(5.0).margin(1e-9));
}
