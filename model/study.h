// SPDX-License-Identifier: MIT
// Study: everything one run works on, as validated values: the site, the candidate chemistry
// profiles, the economics and the designs to evaluate (the optimiser's search settings live
// with the loader: catalog-schema/study_case.h).
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

struct Study {
  std::string title;
  SiteConditions site;
  std::vector<ChemistryProfile> profiles;
  Economics economics;
  std::vector<DesignSpec> designs;  // empty: each profile at its default, autonomy-sized

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

}  // namespace stowage
