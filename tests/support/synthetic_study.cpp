// SPDX-License-Identifier: MIT
#include "support/synthetic_study.h"

#include <algorithm>
#include <cmath>
#include <random>
#include <string>

namespace stowage {

namespace {

constexpr double kPi = 3.14159265358979323846;

// Uniform in [lo, hi) from the generator's raw 64-bit output: portable, unlike
// std::uniform_real_distribution whose algorithm the standard leaves open.
double uniform(std::mt19937_64& rng, double lo, double hi) {
  const double u = static_cast<double>(rng() >> 11) * (1.0 / 9007199254740992.0);
  return lo + (hi - lo) * u;
}

ChemistryProfile make_profile(std::mt19937_64& rng, int index, bool full_range) {
  ChemistryProfile p;
  p.id = "synthetic-" + std::to_string(index + 1);
  p.family = "synthetic";
  p.description = "randomised test profile, not a real product";
  const double volts[] = {1.2, 2.0, 3.2, 3.6};
  p.cell_nominal_v = volts[rng() % 4];
  p.cell_capacity_ah = std::round(uniform(rng, 40, 300));
  p.capacity_rate_hours = uniform(rng, 5, 20);
  p.coulombic_efficiency = uniform(rng, 0.90, 0.995);
  p.mean_discharge_v = p.cell_nominal_v * uniform(rng, 0.96, 1.0);
  p.mean_charge_v = p.cell_nominal_v * uniform(rng, 1.03, 1.12);
  p.max_charge_c_rate = uniform(rng, 0.15, 1.0);
  p.max_discharge_c_rate = uniform(rng, 0.3, 2.0);
  p.peukert_exponent = uniform(rng, 1.0, 1.25);
  p.self_discharge_per_month = uniform(rng, 0.01, 0.05);
  // N100 from 300 to 4000 cycles, exponent 0.7 to 1.8, tabulated at 0.1..1.0.
  const double n100 = uniform(rng, 300, 4000);
  const double k = uniform(rng, 0.7, 1.8);
  std::vector<CycleLifePoint> points;
  for (int i = 1; i <= 10; ++i) {
    const double dod = 0.1 * i;
    points.push_back({dod, n100 * std::pow(dod, -k)});
  }
  p.cycle_life = CycleLifeCurve(points);
  p.calendar_life_years = uniform(rng, 6, 20);
  if (rng() % 3 == 0) p.max_service_years = std::round(uniform(rng, 8, 15));
  TemperatureSpec t;
  t.reference_temp_c = 25;
  t.capacity_factor = {{-20, uniform(rng, 0.5, 0.8)},
                       {0, uniform(rng, 0.82, 0.92)},
                       {25, 1.0},
                       {40, uniform(rng, 1.0, 1.05)}};
  t.law = AgeingLaw::Halving;
  t.halving_interval_k = uniform(rng, 8, 12);
  t.operating_min_c = -30;
  t.operating_max_c = 60;
  t.charge_min_c = rng() % 2 ? -30 : 0;
  t.charge_max_c = 55;
  p.temperature = TemperatureBehaviour(t);
  p.eol_capacity_fraction = uniform(rng, 0.6, 0.8);
  p.dod.min = full_range ? 0.2 : std::round(uniform(rng, 2, 4)) / 10;
  p.dod.max = full_range ? 1.0 : std::round(uniform(rng, 6, 10)) / 10;
  p.dod.default_setpoint = std::round((p.dod.min + p.dod.max) * 10) / 20;
  p.costs.capital_per_kwh = uniform(rng, 150, 600);
  p.costs.capital_per_string = uniform(rng, 0, 400);
  p.costs.installation_fixed = uniform(rng, 300, 3000);
  p.costs.fixed_om_per_kwh_year = uniform(rng, 0, 8);
  p.costs.variable_om_per_mwh = uniform(rng, 0, 5);
  p.costs.replacement_share = uniform(rng, 0.7, 1.0);
  p.costs.price_decline_per_year = uniform(rng, 0, 0.03);
  p.costs.end_of_life_per_kwh = uniform(rng, -10, 20);
  p.cell_mass_kg = p.cell_capacity_ah * p.cell_nominal_v / 1000.0 * uniform(rng, 6, 35);
  p.cell_volume_l = *p.cell_mass_kg / uniform(rng, 1.5, 2.5);
  p.validate();
  return p;
}

}  // namespace

StudyCase make_synthetic_study(const SyntheticStudySpec& spec) {
  std::mt19937_64 rng(spec.seed);
  StudyCase s;
  s.title = "synthetic study, seed " + std::to_string(spec.seed);
  SiteConditions& site = s.site;
  site.name = "synthetic site";
  site.bus_voltage_v = 48;
  const double base = spec.daily_load_kwh / 24.0 / 1.15;
  const double winter_share = uniform(rng, 0.1, 0.4);
  const double pv_peak =
      spec.daily_load_kwh * uniform(rng, spec.backup ? 0.25 : 0.5, spec.backup ? 0.45 : 0.8);
  const double temp_mean = uniform(rng, 5, 22);
  const double temp_amplitude = uniform(rng, 5, 15);
  for (int day = 0; day < 365; ++day) {
    const double clearness = uniform(rng, 0.15, 1.0);
    const double season = std::cos(2 * kPi * (day - 15) / 365.0);
    for (int hour = 0; hour < 24; ++hour) {
      const bool evening = hour >= 18 && hour < 22;
      site.load_kw.push_back(base * (1 + winter_share * season) * (evening ? 1.6 : 1.0));
      const double sun =
          hour >= 6 && hour < 18 ? std::max(0.0, std::sin(kPi * (hour - 6) / 12.0)) : 0.0;
      site.source_kw.push_back(pv_peak * sun *
                               (0.75 + 0.25 * std::cos(2 * kPi * (day - 172) / 365.0)) * clearness);
      site.temp_c.push_back(temp_mean + temp_amplitude * std::sin(2 * kPi * (day - 105) / 365.0) +
                            3 * std::sin(2 * kPi * (hour - 9) / 24.0));
      site.charge_price_per_kwh.push_back(0.0);
    }
  }
  site.autonomy_days = spec.autonomy_days;
  site.design_margin = 1.0;
  site.charger_efficiency = 0.95;
  site.inverter_efficiency = 0.95;
  if (spec.backup) {
    site.backup_price_per_kwh = uniform(rng, 0.3, 0.9);
  } else {
    site.unserved_limit_fraction = 0.05;
    site.unserved_penalty_per_kwh = uniform(rng, 0.5, 2.0);
  }
  site.validate();
  for (int i = 0; i < spec.profiles; ++i) {
    s.profiles.push_back(make_profile(rng, i, spec.full_dod_range));
  }
  s.economics.project_years = spec.project_years;
  s.economics.real_discount_rate = uniform(rng, 0.03, 0.09);
  s.economics.currency = "EUR";
  s.economics.validate();
  s.search.dod_from = spec.dod_from;
  s.search.dod_to = spec.dod_to;
  s.search.dod_step = spec.dod_step;
  s.search.max_strings_parallel = spec.max_strings;
  return s;
}

}  // namespace stowage
