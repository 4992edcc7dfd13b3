// SPDX-License-Identifier: MIT
// StudyCase: a study as a whole run sees it: the model's Study (site, profiles, economics,
// designs) plus the optimiser's search settings from the study file's `design_space` block. A plain
// value: copying it copies everything, and nothing points into it, so an analysis can copy a
// case, change an input by its parameter path (parameter_paths.h) and run it again.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/study.h"

namespace stowage {

// The `design_space` block, validated: the DoD ladder the optimiser tries (narrowed per profile to
// its allowed range) and the optional caps on a bank.
struct SearchSettings {
  double dod_from = 0.20, dod_to = 1.00, dod_step = 0.05;  // ladder, fractions, from <= to
  int max_strings_parallel = 40;                           // >= 1
  std::optional<double> budget;        // upper bound on year-0 investment, currency
  std::optional<double> max_mass_kg;   // needs cell_mass_kg in the profiles
  std::optional<double> max_volume_l;  // needs cell_volume_l in the profiles
};

// One entry of study.economics.exchange_rates: 1 unit of `currency` = `rate` units of the
// study's currency. The prices of the profiles in `profile_ids` (those priced in `currency`)
// were multiplied by `rate` when the study was loaded; an empty list means the rate is unused.
struct ExchangeRate {
  std::string currency;  // ISO 4217 code, not the study's own
  double rate = 1;       // study-currency units per unit of `currency`, > 0
  std::vector<std::string> profile_ids;
};

struct StudyCase : Study {
  SearchSettings search;
  std::vector<ExchangeRate> exchange_rates;  // in the order of the study file
};

// The DoD ladder of `design_space` restricted to the profile's allowed [dod.min, dod.max]; values
// are rounded to 1e-9 so 0.05 steps land on exact decimals.
std::vector<double> dod_ladder(const SearchSettings& search, const ChemistryProfile& profile);

}  // namespace stowage
