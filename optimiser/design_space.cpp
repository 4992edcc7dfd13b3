// SPDX-License-Identifier: MIT
#include "optimiser/design_space.h"

#include <algorithm>
#include <cmath>
#include <limits>

#include "model/bank.h"
#include "model/costs.h"
#include "model/economics.h"
#include "model/sizing.h"

namespace stowage {

double string_nameplate_kwh(const ChemistryProfile& profile, double bus_voltage_v) {
  return bank_geometry(profile, bus_voltage_v, 1).nameplate_kwh;
}

double string_discharge_power_kw(const ChemistryProfile& profile, double bus_voltage_v) {
  const int cells = cells_in_series(profile, bus_voltage_v);
  return profile.max_discharge_c_rate * profile.cell_capacity_ah * cells *
         profile.mean_discharge_v / 1000.0;
}

double bank_investment(const ChemistryProfile& profile, double bus_voltage_v, int strings) {
  const BankGeometry bank = bank_geometry(profile, bus_voltage_v, strings);
  return DesignCosts(profile.costs, string_nameplate_kwh(profile, bus_voltage_v))
      .investment(bank.nameplate_kwh, strings);
}

double npc_lower_bound(const ChemistryProfile& profile, const Study& study, int strings,
                       double calendar_damage_per_year) {
  constexpr double kUnbounded = -std::numeric_limits<double>::infinity();
  const Economics& e = study.economics;
  const int n_years = e.project_years;
  const double i = e.real_discount_rate;
  const double bus_v = study.site.bus_voltage_v;
  const DesignCosts costs(profile.costs, string_nameplate_kwh(profile, bus_v));
  const double nameplate = bank_geometry(profile, bus_v, strings).nameplate_kwh;
  const double i0 = costs.investment(nameplate, strings);

  // The net cost of a replacement booked in year y (made at the end of one of its months,
  // docs/method.md 6): the new bank plus the end of life of the one removed. If it can be
  // negative (a salvage above the price of a new bank), more replacements lower the NPC without
  // limit and no finite bound holds. Replacements may fall in any year 1..N.
  auto replacement_pv = [&](double y) {
    return (costs.replacement_price(i0, y) + costs.replacement_end_of_life(nameplate)) *
           present_worth_factor(i, y);
  };
  for (int y = 1; y <= n_years; ++y) {
    if (replacement_pv(y) < 0) return kUnbounded;
  }

  double bound = i0;
  bound += costs.fixed_om_per_year(nameplate) * series_present_worth_factor(i, n_years);
  // Residual credit: at most the whole replacement price of year N (a bank with all its life
  // left), credited at N; the simulator values the remaining life at that same price.
  bound += costs.residual_value(i0, n_years, 1.0) * present_worth_factor(i, n_years);

  // The longest a bank can serve, in whole years. The simulator retires a bank when its damage
  // reaches 1 - 1e-9; asking for 1 - 1e-9 + 1e-7 here can only make Y later (a weaker bound)
  // when rounding in the simulator's year-by-year sum differs from y x cal.
  const double cal = calendar_damage_per_year * (1 - 1e-7);
  long life = std::numeric_limits<long>::max();
  if (calendar_damage_per_year > 0) {
    life = static_cast<long>(std::ceil((1.0 - 1e-9 + 1e-7) / calendar_damage_per_year));
  }
  if (profile.max_service_years) {
    life = std::min(life, static_cast<long>(std::ceil(*profile.max_service_years)));
  }
  life = std::max(life, 1L);

  // End of life of the last bank: at N + 1, or later when it has life left, but no later than
  // N + max(1, its longest remaining service): 1 / cal years of calendar ageing or
  // max_service_years (model/lifecycle.h). A cost (> 0) is bounded by its latest date, a
  // salvage credit (< 0) by its earliest.
  const double final_eol = costs.final_end_of_life(nameplate);
  if (final_eol < 0) {
    bound += final_eol * present_worth_factor(i, n_years + 1);
  } else if (calendar_damage_per_year > 0 || profile.max_service_years) {
    double longest = std::numeric_limits<double>::infinity();
    if (calendar_damage_per_year > 0) longest = 1 / cal;
    if (profile.max_service_years) longest = std::min(longest, *profile.max_service_years);
    bound += final_eol * present_worth_factor(i, n_years + std::max(1.0, longest));
  }

  // Forced replacements: the k-th comes no later than kY years into the project (each bank,
  // whenever in a year it went in, lasts at most Y years), so it is booked in some year y in
  // [1, kY]; its net cost is at least the least present value over those years. Only those with
  // kY < N are counted (fewer is still a lower bound).
  double least_so_far = std::numeric_limits<double>::infinity();
  long priced_to = 0;
  for (long year = life; year < n_years; year += life) {
    for (long y = priced_to + 1; y <= year; ++y) {
      least_so_far = std::min(least_so_far, replacement_pv(static_cast<double>(y)));
    }
    priced_to = year;
    bound += least_so_far;
  }
  return bound;
}

namespace {

// Least n >= 1 with design_usable_kwh(n) >= required, starting from the sizing rule's answer
// and correcting it both ways so the rule and the check cannot disagree by rounding.
int autonomy_strings(const ChemistryProfile& profile, const SiteConditions& site, double dod,
                     double required, int start, int ceiling) {
  int n = std::max(1, start);
  const double tol = 1e-9 * std::max(1.0, required);
  while (n <= ceiling && design_usable_kwh(profile, site, dod, n) + tol < required) ++n;
  while (n > 1 && design_usable_kwh(profile, site, dod, n - 1) + tol >= required) --n;
  return n;
}

// Least n >= 1 whose discharge power at the C-rate limit covers `peak_kw` at the terminals.
int peak_strings(const ChemistryProfile& profile, double bus_voltage_v, double peak_kw) {
  if (peak_kw <= 0) return 1;
  const double power = string_discharge_power_kw(profile, bus_voltage_v);
  return std::max(1, static_cast<int>(std::ceil(peak_kw / power * (1 - 1e-12))));
}

int cap_by(double limit, double per_string) {
  if (per_string <= 0) return std::numeric_limits<int>::max();
  const double n = std::floor(limit / per_string * (1 + 1e-12));
  return n > 1e9 ? std::numeric_limits<int>::max() : static_cast<int>(n);
}

}  // namespace

DesignSpace build_design_space(const StudyCase& study) {
  DesignSpace space;
  const SiteConditions& site = study.site;
  space.peak_discharge_terminal_kw = peak_discharge_terminal_kw(site);
  const SearchSettings& s = study.search;

  for (std::size_t p = 0; p < study.profiles.size(); ++p) {
    const ChemistryProfile& profile = study.profiles[p];
    const int cells = cells_in_series(profile, site.bus_voltage_v);
    // Upper caps independent of the setpoint.
    int cap_n = s.max_strings_parallel;
    StringCap cap = StringCap::MaxStrings;
    auto apply = [&](int n, StringCap why) {
      if (n < cap_n) {
        cap_n = n;
        cap = why;
      }
    };
    if (s.budget) {
      const double per_string =
          bank_investment(profile, site.bus_voltage_v, 1) - profile.costs.installation_fixed;
      apply(cap_by(*s.budget - profile.costs.installation_fixed, per_string), StringCap::Budget);
      if (*s.budget < profile.costs.installation_fixed) apply(0, StringCap::Budget);
    }
    if (s.max_mass_kg) {
      if (!profile.cell_mass_kg) {
        apply(0, StringCap::MissingMass);
        space.notes.push_back({p, ProfileNote::Kind::NoCellMass});
      } else {
        apply(cap_by(*s.max_mass_kg, *profile.cell_mass_kg * cells), StringCap::Mass);
      }
    }
    if (s.max_volume_l) {
      if (!profile.cell_volume_l) {
        apply(0, StringCap::MissingVolume);
        space.notes.push_back({p, ProfileNote::Kind::NoCellVolume});
      } else {
        apply(cap_by(*s.max_volume_l, *profile.cell_volume_l * cells), StringCap::Volume);
      }
    }
    const int c_rate_n =
        peak_strings(profile, site.bus_voltage_v, space.peak_discharge_terminal_kw);
    for (double dod : dod_ladder(s, profile)) {
      DesignChoice c;
      c.profile_index = p;
      c.dod_setpoint = dod;
      const AutonomySizing sizing = size_for_autonomy(profile, site, dod);
      c.required_usable_kwh = sizing.required_usable_kwh;
      // The search never looks past max(cap, max_strings), so neither does the sizing loop.
      const int ceiling = std::max({cap_n, s.max_strings_parallel, sizing.strings_parallel}) + 1;
      c.autonomy_strings = autonomy_strings(profile, site, dod, sizing.required_usable_kwh,
                                            sizing.strings_parallel, ceiling);
      c.c_rate_strings = c_rate_n;
      c.min_strings = std::max({1, c.autonomy_strings, c.c_rate_strings});
      c.max_strings = cap_n;
      c.cap = cap;
      space.choices.push_back(c);
    }
  }
  return space;
}

double peak_discharge_terminal_kw(const SiteConditions& site) {
  double peak = 0;
  for (std::size_t h = 0; h < site.load_kw.size(); ++h) {
    peak = std::max(peak, hour_balance(site, h).deficit_kwh);
  }
  return peak / site.inverter_efficiency;
}

RequirementCheck check_requirements(const ChemistryProfile& profile, const SiteConditions& site,
                                    double dod_setpoint, int strings) {
  RequirementCheck c;
  const AutonomySizing sizing = size_for_autonomy(profile, site, dod_setpoint);
  c.required_usable_kwh = sizing.required_usable_kwh;
  c.usable_kwh = design_usable_kwh(profile, site, dod_setpoint, strings);
  // Starts at the sizing rule's answer, so the search moves a string or two at most; the
  // ceiling only guards the loop.
  c.autonomy_strings =
      autonomy_strings(profile, site, dod_setpoint, sizing.required_usable_kwh,
                       sizing.strings_parallel, std::max(strings, sizing.strings_parallel) + 64);
  c.peak_kw = peak_discharge_terminal_kw(site);
  c.power_kw = string_discharge_power_kw(profile, site.bus_voltage_v) * strings;
  c.peak_strings = peak_strings(profile, site.bus_voltage_v, c.peak_kw);
  c.meets_autonomy = strings >= c.autonomy_strings;
  c.meets_peak = strings >= c.peak_strings;
  return c;
}

std::size_t DesignSpace::admissible_designs() const {
  std::size_t total = 0;
  for (const DesignChoice& c : choices) total += static_cast<std::size_t>(c.strings_count());
  return total;
}

std::size_t DesignSpace::admissible_choices() const {
  return static_cast<std::size_t>(std::count_if(
      choices.begin(), choices.end(), [](const DesignChoice& c) { return c.admissible(); }));
}

std::vector<UnmetRequirement> DesignSpace::diagnose(const StudyCase& study) const {
  std::vector<UnmetRequirement> unmet;
  if (admissible_choices() > 0) return unmet;
  if (choices.empty()) {
    unmet.push_back({Requirement::DodLadder, 0, 0, std::nullopt, false});
    return unmet;
  }
  const SiteConditions& site = study.site;
  const SearchSettings& search = study.search;
  // Pairs whose caps allow no bank at all.
  bool any_bank = false;
  for (const DesignChoice& c : choices) any_bank = any_bank || c.max_strings >= 1;
  if (!any_bank) {
    double cheapest = std::numeric_limits<double>::infinity();
    double lightest = cheapest, smallest = cheapest;
    bool missing_mass = false, missing_volume = false, budget = false, mass = false, volume = false;
    for (const DesignChoice& c : choices) {
      const ChemistryProfile& p = study.profiles[c.profile_index];
      const int cells = cells_in_series(p, site.bus_voltage_v);
      cheapest = std::min(cheapest, bank_investment(p, site.bus_voltage_v, 1));
      if (p.cell_mass_kg) lightest = std::min(lightest, *p.cell_mass_kg * cells);
      if (p.cell_volume_l) smallest = std::min(smallest, *p.cell_volume_l * cells);
      missing_mass |= c.cap == StringCap::MissingMass;
      missing_volume |= c.cap == StringCap::MissingVolume;
      budget |= c.cap == StringCap::Budget;
      mass |= c.cap == StringCap::Mass;
      volume |= c.cap == StringCap::Volume;
    }
    if (search.max_strings_parallel < 1) {
      unmet.push_back({Requirement::MaxStrings, 1, static_cast<double>(search.max_strings_parallel),
                       std::nullopt, false});
    }
    if (budget)
      unmet.push_back({Requirement::Budget, cheapest, *search.budget, std::nullopt, false});
    if (mass) {
      unmet.push_back({Requirement::Mass, lightest, *search.max_mass_kg, std::nullopt, false});
    }
    if (volume) {
      unmet.push_back({Requirement::Volume, smallest, *search.max_volume_l, std::nullopt, false});
    }
    if (missing_mass || missing_volume) {
      unmet.push_back({Requirement::MissingCellData, 0, 0, std::nullopt, missing_mass});
    }
    return unmet;
  }
  // Some bank is allowed, but too small: compare what is needed with the most allowed.
  double need_energy = 0, best_energy = 0, need_power = peak_discharge_terminal_kw, best_power = 0;
  std::optional<DesignRef> best_energy_at, best_power_at;
  bool energy_met = false, power_met = false;
  for (const DesignChoice& c : choices) {
    if (c.max_strings < 1) continue;
    const ChemistryProfile& p = study.profiles[c.profile_index];
    const double usable = design_usable_kwh(p, site, c.dod_setpoint, c.max_strings);
    need_energy = std::max(need_energy, c.required_usable_kwh);
    if (usable > best_energy) {
      best_energy = usable;
      best_energy_at = DesignRef{c.profile_index, c.dod_setpoint, c.max_strings, c.cap};
    }
    const double power = string_discharge_power_kw(p, site.bus_voltage_v) * c.max_strings;
    if (power > best_power) {
      best_power = power;
      best_power_at = DesignRef{c.profile_index, c.dod_setpoint, c.max_strings, c.cap};
    }
    energy_met |= c.autonomy_strings <= c.max_strings;
    power_met |= c.c_rate_strings <= c.max_strings;
  }
  if (energy_met && power_met) {
    unmet.push_back({Requirement::AutonomyAndPeak, need_energy, best_energy, std::nullopt, false});
  }
  if (!energy_met) {
    unmet.push_back({Requirement::Autonomy, need_energy, best_energy, best_energy_at, false});
  }
  if (!power_met) {
    unmet.push_back({Requirement::PeakDischarge, need_power, best_power, best_power_at, false});
  }
  return unmet;
}

}  // namespace stowage
