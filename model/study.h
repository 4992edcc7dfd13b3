// SPDX-License-Identifier: MIT
// Study: everything one run works on, as validated values: the site, the candidate chemistry
// profiles, the economics, the designs to evaluate and the optimiser's search space.
// A plain value: copying it copies everything, and nothing else points into it.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "model/chemistry_profile.h"
#include "model/economics.h"
#include "model/site.h"

namespace stowage {

struct DesignSpec {
  std::string profile_id;
  std::optional<double> dod_setpoint;   // unset: the profile's default
  std::optional<int> strings_parallel;  // unset: sized for autonomy
};

// The optimiser's search space and optional limits.
struct SearchSpace {
  double dod_from = 0.20, dod_to = 1.00, dod_step = 0.05;  // ladder, narrowed per profile
  int max_strings_parallel = 40;
  std::optional<double> budget;        // upper bound on year-0 investment
  std::optional<double> max_mass_kg;   // needs cell_mass_kg in the profiles
  std::optional<double> max_volume_l;  // needs cell_volume_l in the profiles
};

struct Study {
  std::string title;
  SiteConditions site;
  std::vector<ChemistryProfile> profiles;
  Economics economics;
  std::vector<DesignSpec> designs;  // empty: each profile at its default, autonomy-sized
  SearchSpace search;

  // The index into `profiles` of the profile with this id, if any.
  std::optional<std::size_t> find_profile(const std::string& id) const;
};

// A design with every choice made: the profile, the DoD setpoint and the strings in parallel.
// Holds an index, not a pointer, so a copied or changed Study keeps its designs valid.
struct ResolvedDesign {
  std::size_t profile_index = 0;  // into Study::profiles
  double dod_setpoint = 0;
  int strings_parallel = 0;
};

// The study's designs with defaults filled in: an unset DoD takes the profile's default, unset
// strings are sized for autonomy (sizing.h); with no designs listed, every profile once.
// Throws ContractViolation("designs[i].profile") for an unknown profile id.
std::vector<ResolvedDesign> resolve_designs(const Study& study);

// The DoD ladder from `search` restricted to the profile's allowed [dod.min, dod.max]; values
// are rounded to 1e-9 so 0.05 steps land on exact decimals.
std::vector<double> dod_ladder(const SearchSpace& search, const ChemistryProfile& profile);

}  // namespace stowage
