// SPDX-License-Identifier: MIT
#include <catch2/catch.hpp>

#include "model/ageing.h"
#include "model/bank.h"
#include "model/dispatch.h"
#include "model_fixtures.h"

using namespace stowage;
using namespace stowage::testing;

namespace {
YearDispatch run_year(const ChemistryProfile& p, const SiteConditions& s, int strings, double dod,
                      std::vector<double>& trace, double start_soc = 1.0) {
  DispatchInputs in;
  in.profile = &p;
  in.site = &s;
  in.bank = bank_geometry(p, s.bus_voltage_v, strings);
  in.dod_setpoint = dod;
  DispatchState state;
  state.soc = start_soc;
  return dispatch_year(in, state, trace);
}
}  // namespace

TEST_CASE("bank energy is nominal voltage times ampere-hours", "[model][bank]") {
  // Energy (Wh) = V x Ah (common practice): 24 cells of 2 V x 200 Ah = 9.6 kWh per string.
  auto p = ideal_cell(200);
  const auto g = bank_geometry(p, 48, 3);
  CHECK(g.cells_series == 24);
  CHECK(g.capacity_ah == 600);
  CHECK(g.nameplate_kwh == Approx(28.8));
  p.cell_nominal_v = 3.2;  // LiFePO4 on a 48 V bus: 15 cells (common practice)
  CHECK(cells_in_series(p, 48) == 15);
}

TEST_CASE("SOC plus DoD is one: drawing 2 Ah from 10 Ah leaves SOC 0.8", "[model][dispatch]") {
  // Common practice: a 10 Ah battery drained by 2 Ah is at SOC 80 %, DoD 20 %.
  const auto p = ideal_cell(10);
  auto s = quiet_site(2.0);           // one 2 V cell
  s.load_kw[0] = 2.0 * 2.0 / 1000.0;  // 2 Ah at 2.0 V in one hour
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 1.0, trace);
  CHECK(trace[1] == Approx(0.8));
  CHECK(y.equivalent_full_cycles == Approx(0.2));
}

TEST_CASE("the C-rate limits the hourly current", "[model][dispatch]") {
  // 1C on a 10 Ah battery is 10 A for one hour; 0.5C is 5 A, two hours to empty (common practice).
  auto p = ideal_cell(10);
  p.max_discharge_c_rate = 0.5;
  auto s = quiet_site(2.0);
  s.backup_price_per_kwh = 1.0;
  s.load_kw[0] = s.load_kw[1] = s.load_kw[2] = 1.0;  // far more than the bank can give
  std::vector<double> trace;
  run_year(p, s, 1, 1.0, trace);
  CHECK(trace[1] == Approx(0.5));  // 5 Ah of 10 in the first hour
  CHECK(trace[2] == Approx(0.0));  // empty after two hours
  CHECK(trace[3] == Approx(0.0));
}

TEST_CASE("round-trip efficiency is voltaic times coulombic efficiency", "[model][dispatch]") {
  // Common practice: 10 kWh in, 8 kWh out is 80 %; round trip = (V_dis / V_ch) x (Ah out / Ah in).
  auto p = ideal_cell(100);
  p.mean_charge_v = 2.25;
  p.mean_discharge_v = 2.0;
  p.coulombic_efficiency = 0.9;
  CHECK(p.round_trip_efficiency() == Approx(0.8));
  auto s = quiet_site(2.0);
  s.backup_price_per_kwh = 1.0;
  s.load_kw[0] = 1.0;    // empty the cell
  s.source_kw[5] = 1.0;  // refill it
  s.load_kw[10] = 1.0;   // empty it again
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 1.0, trace);
  const double second_discharge = 100 * 2.0 / 1000.0;
  const double charged = y.charged_terminal_kwh;
  CHECK(second_discharge / charged == Approx(0.8));
  CHECK(trace[6] == Approx(1.0));
}

TEST_CASE("Peukert's law: 100 Ah at C20 with k = 1.2 lasts 8.7055 h at 10 A", "[model][dispatch]") {
  // t = H (C / (I H))^k with C = 100 Ah, H = 20 h, k = 1.2, I = 10 A gives 8.7055 h, i.e.
  // 87.06 Ah delivered before cut-off (check-values.md section 6, CALC; the standard form of
  // Peukert's law).
  CHECK(100 * peukert_capacity_factor(10, 100.0 / 20, 1.2) / 10 == Approx(8.7055).epsilon(1e-4));
  CHECK(peukert_capacity_factor(5, 5, 1.2) == 1.0);  // no credit at or below the rated current
  auto p = ideal_cell(100);
  p.capacity_rate_hours = 20;
  p.peukert_exponent = 1.2;
  auto s = quiet_site(2.0);
  s.backup_price_per_kwh = 1.0;
  for (int h = 0; h < 12; ++h) s.load_kw[static_cast<std::size_t>(h)] = 10 * 2.0 / 1000.0;
  std::vector<double> trace;
  run_year(p, s, 1, 1.0, trace);
  // Eight full hours at 10 A draw 80 Ah; the ninth would pass the cut-off at 10 A (87.06 Ah),
  // so the current drops there.
  CHECK(trace[8] == Approx(0.2));
  CHECK(trace[8] - trace[9] < 0.1);
  // Whatever the current, the bank never passes its cut-off at that current.
  for (int h = 8; h < 12; ++h) {
    const auto i = static_cast<std::size_t>(h);
    const double amps = (trace[i] - trace[i + 1]) * 100;
    if (amps > 0) CHECK(trace[i + 1] >= 1 - peukert_capacity_factor(amps, 5, 1.2) - 1e-9);
  }
}

TEST_CASE("temperature swings neither create nor destroy stored charge", "[model][dispatch]") {
  // Charge conservation (common practice): what the cells store is what comes in times the
  // coulombic efficiency minus what goes out, whatever the temperature does in between.
  auto p = ideal_cell(100);
  p.coulombic_efficiency = 0.95;
  p.mean_charge_v = 2.3;
  TemperatureSpec t = p.temperature.spec();
  t.capacity_factor = {{-10, 0.6}, {25, 1.0}, {45, 1.2}};
  p.temperature = TemperatureBehaviour(t);
  auto s = quiet_site(2.0);
  s.backup_price_per_kwh = 1.0;
  for (int h = 0; h < kHoursPerYear; ++h) {
    const auto i = static_cast<std::size_t>(h);
    s.temp_c[i] = (h / 24) % 2 ? 45.0 : -10.0;  // alternate hot and cold days
    s.load_kw[i] = h % 24 == 20 ? 0.05 : 0.0;
    s.source_kw[i] = h % 24 == 12 ? 0.05 : 0.0;
  }
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.8, trace, 0.5);
  const double stored_ah = y.charged_terminal_kwh * 1000 / 2.3 * 0.95;
  const double drawn_ah = y.discharged_terminal_kwh * 1000 / 2.0;
  CHECK(stored_ah - drawn_ah == Approx((trace.back() - trace.front()) * 100).margin(1e-6));
  // Lossless round trip at the cells: charged hot, discharged cold or the other way round.
  CHECK(drawn_ah > 0);
}

TEST_CASE("energy is conserved hour by hour", "[model][dispatch]") {
  // Identity of the dispatch rules: demand = direct supply + battery + back-up (+ unserved),
  // source = direct supply + charging + curtailment.
  auto p = ideal_cell(100);
  p.coulombic_efficiency = 0.95;
  p.self_discharge_per_month = 0.03;
  auto s = quiet_site(48.0);
  s.charger_efficiency = 0.9;
  s.inverter_efficiency = 0.92;
  s.source_to_load_efficiency = 0.9 * 0.92;  // DC-coupled PV: charger and inverter in series
  s.backup_price_per_kwh = 0.5;
  for (int h = 0; h < kHoursPerYear; ++h) {
    s.load_kw[static_cast<std::size_t>(h)] = 1.0 + 0.5 * ((h * 7) % 5);
    s.source_kw[static_cast<std::size_t>(h)] = (h % 24 >= 9 && h % 24 <= 15) ? 6.0 : 0.0;
  }
  double source_total = 0;
  for (double v : s.source_kw) source_total += v;
  std::vector<double> trace;
  const auto y = run_year(p, s, 2, 0.6, trace);
  CHECK(y.demand_kwh == Approx(y.source_to_load_kwh + y.delivered_kwh + y.backup_kwh));
  CHECK(y.delivered_kwh == Approx(y.discharged_terminal_kwh * 0.92));
  // Source energy: what reached the load directly (before its conversion loss), what charged
  // the bank and what was curtailed.
  CHECK(source_total ==
        Approx(y.source_to_load_kwh / (0.9 * 0.92) + y.charge_source_kwh + y.curtailed_kwh));
  // The DoD window holds; only self-discharge (3 % a month, recharged daily) can take the SOC
  // below the floor, and by less than a month's worth.
  for (double soc : trace) {
    REQUIRE(soc >= 0.4 * (1 - 0.03));
    REQUIRE(soc <= 1.0);
  }
}

TEST_CASE("end of life is at 80 % of rated capacity by default", "[model][ageing]") {
  // Common practice (IEEE 450 replacement criterion): end of life at 80 % of rated capacity.
  const ChemistryProfile p;
  CHECK(p.eol_capacity_fraction == 0.80);
  CHECK(health_from_damage(p, 1.0) == Approx(0.80));
  CHECK(health_from_damage(p, 0.5) == Approx(0.90));
}

TEST_CASE("no charging outside the charging temperature limits", "[model][dispatch]") {
  // Common practice: lithium cells are not charged below about 0 degC.
  auto p = ideal_cell(100);
  TemperatureSpec t = p.temperature.spec();
  t.charge_min_c = 0;
  p.temperature = TemperatureBehaviour(t);
  auto s = quiet_site(2.0, -5.0);
  s.source_kw.assign(kHoursPerYear, 1.0);
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.5, trace, 0.5);
  CHECK(y.charged_terminal_kwh == 0.0);
  CHECK(trace.back() == Approx(0.5));
}

TEST_CASE("hours idle because of the temperature limits are counted", "[model][dispatch]") {
  // Hand count. Charging limit 0 degC, operating limit -40 degC (inclusive). Hours 0..99 at
  // -5 degC with a 1 kW surplus and the bank at SOC 0.5: 100 hours of surplus it had room for
  // but could not take. It then charges to full in one warm hour (0.1 kWh of room, 1 kW
  // offered). Hours 5000..5049 at -50 degC with a 0.01 kW deficit and a full bank: 50 hours it
  // could not serve. Hours 6000..6009 at -50 degC with a surplus and a full bank: no room, not
  // counted.
  auto p = ideal_cell(100);
  TemperatureSpec t = p.temperature.spec();
  t.charge_min_c = 0;
  p.temperature = TemperatureBehaviour(t);
  auto s = quiet_site(2.0, 25.0);
  s.source_kw.assign(kHoursPerYear, 1.0);
  s.backup_price_per_kwh = 0.5;
  for (std::size_t h = 0; h < 100; ++h) s.temp_c[h] = -5.0;
  for (std::size_t h = 5000; h < 5050; ++h) {
    s.temp_c[h] = -50.0;
    s.source_kw[h] = 0.0;
    s.load_kw[h] = 0.01;
  }
  for (std::size_t h = 6000; h < 6010; ++h) s.temp_c[h] = -50.0;
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.5, trace, 0.5);
  CHECK(y.charge_blocked_by_temperature_hours == 100.0);
  CHECK(y.discharge_blocked_by_temperature_hours == 50.0);
  CHECK(y.temperature_idle_hours() == 150.0);
  CHECK(y.delivered_kwh == 0.0);
  CHECK(y.backup_kwh == Approx(50 * 0.01));
}

TEST_CASE("an empty bank outside its operating range is not idle because of it",
          "[model][dispatch]") {
  // With the SOC at the setpoint floor (1 - 0.5) and no source, the bank has nothing to give
  // whatever the temperature: cold hours of deficit are not counted.
  auto p = ideal_cell(100);
  auto s = quiet_site(2.0, -50.0);
  s.load_kw.assign(kHoursPerYear, 0.01);
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.5, trace, 0.5);
  CHECK(y.discharge_blocked_by_temperature_hours == 0.0);
  // Full, the same bank is blocked in every hour.
  const auto full = run_year(p, s, 1, 0.5, trace, 1.0);
  CHECK(full.discharge_blocked_by_temperature_hours == kHoursPerYear);
}

TEST_CASE("a standing auxiliary load drains an idle bank to its setpoint floor, then is unmet",
          "[model][dispatch][auxiliary]") {
  // Hand derivation: 1 string of 1 x 2 V x 100 Ah = 0.2 kWh nameplate; 0.01 kW per kWh gives
  // 0.002 kWh an hour, 0.002 x 1000 / 2 V = 1 Ah = 0.01 of SOC. From SOC 1 with DoD 0.5 the
  // bank feeds it for 50 hours (0.1 kWh) and then sits at 0.5; the other 8710 hours
  // (17.42 kWh) are unmet. No source, so nothing comes from it.
  auto p = ideal_cell(100);
  p.auxiliary.standing_kw_per_kwh = 0.01;
  const auto s = quiet_site(2.0);
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.5, trace);
  CHECK(trace[1] == Approx(0.99));
  CHECK(trace[50] == Approx(0.5));
  CHECK(trace.back() == Approx(0.5));
  CHECK(y.auxiliary_kwh == Approx(8760 * 0.002));
  CHECK(y.auxiliary_bank_kwh == Approx(0.1));
  CHECK(y.auxiliary_unmet_kwh == Approx(8710 * 0.002));
  CHECK(y.auxiliary_source_kwh == 0.0);
  CHECK(y.discharged_terminal_kwh == 0.0);  // not a discharge to the load
}

TEST_CASE("auxiliary loads take spare source energy first, through the charger, at its price",
          "[model][dispatch][auxiliary]") {
  // Hand derivation: a full bank, 1 kW of source every hour, no load: the bank takes nothing,
  // so the 0.002 kWh standing load of every hour comes from the source through an 80 %
  // charger, 0.0025 kWh an hour, 21.9 kWh a year, at 0.2 a kWh = 4.38; the curtailed energy
  // falls by as much and the SOC stays at 1.
  auto p = ideal_cell(100);
  p.auxiliary.standing_kw_per_kwh = 0.01;
  auto s = quiet_site(2.0);
  s.source_kw.assign(kHoursPerYear, 1.0);
  s.charge_price_per_kwh.assign(kHoursPerYear, 0.2);
  s.charger_efficiency = 0.8;
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.5, trace);
  CHECK(y.auxiliary_source_kwh == Approx(21.9));
  CHECK(y.charge_cost == Approx(4.38));
  CHECK(y.curtailed_kwh == Approx(8760 - 21.9));
  CHECK(y.auxiliary_bank_kwh == 0.0);
  CHECK(y.auxiliary_unmet_kwh == 0.0);
  CHECK(trace.back() == 1.0);
}

TEST_CASE("pumps draw in proportion to the terminal throughput", "[model][dispatch][auxiliary]") {
  // Hand derivation: 2 V x 1000 Ah = 2 kWh; 0.1 kW of load, no source, ideal inverter: each
  // hour 0.1 kWh = 50 Ah out (0.05 of SOC) and pumps at 0.1 x 0.1 = 0.01 kWh = 5 Ah (0.005).
  // After 9 hours SOC = 1 - 9 x 0.055 = 0.505; in hour 10 the room above the 0.5 floor is
  // 5 Ah, all of it to the load (0.01 kWh), and its 0.001 kWh of pumping finds no room:
  // unmet. Then the bank is at its floor and moves nothing, so the pumps need nothing.
  auto p = ideal_cell(1000);
  p.auxiliary.pump_kw_per_kw = 0.1;
  auto s = quiet_site(2.0);
  s.load_kw.assign(kHoursPerYear, 0.1);
  s.backup_price_per_kwh = 1.0;
  std::vector<double> trace;
  const auto y = run_year(p, s, 1, 0.5, trace);
  CHECK(trace[1] == Approx(0.945));
  CHECK(trace[9] == Approx(0.505));
  CHECK(trace[10] == Approx(0.5));
  CHECK(y.delivered_kwh == Approx(0.91));
  CHECK(y.auxiliary_bank_kwh == Approx(0.09));
  CHECK(y.auxiliary_unmet_kwh == Approx(0.001));
  CHECK(y.auxiliary_kwh == Approx(0.091));
  // The load's balance is unchanged by the auxiliaries: demand = delivered + back-up.
  CHECK(y.backup_kwh == Approx(876 - 0.91));
}
