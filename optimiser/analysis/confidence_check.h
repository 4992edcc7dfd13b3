// SPDX-License-Identifier: MIT
// How far the winner's lead rests on inputs nobody has checked. Every profile value carries a
// confidence label (catalog-schema/profile_loader.h: sourced, from-memory, illustrative). For
// the winning design of an optimisation, each of its profile's inputs that a user may vary
// (catalog-schema/parameter_paths.h) and that is labelled from-memory or illustrative is moved,
// one at a time, by its label's spread,
//   illustrative +-25 %, from-memory +-10 % (our convention, docs/method.md 10),
// of its value (of the factor 1 for a scale such as ageing.cycle_life_scale), clamped to the
// path's valid range; inputs in degC are left out (a relative spread of a temperature has no
// meaning). The design is held as it is (same DoD setpoint and strings) and evaluated exactly
// at both ends; the input's `npc_rise` is the larger increase of the winner's NPC, >= 0.
// The lead is the NPC of the next profile's best design less the winner's (infinite when no
// other profile has an admissible design). exceeds_margin() says that one low-confidence input
// alone, within its spread, could cost the winner more than its lead.
#pragma once

#include <limits>
#include <string>
#include <vector>

#include "catalog-schema/profile_loader.h"
#include "catalog-schema/study_case.h"
#include "optimiser/optimise.h"

namespace stowage {

struct LowConfidenceInput {
  std::string path;  // parameter path, profiles.<id>.<key>
  ValueConfidence confidence = ValueConfidence::Illustrative;
  double spread = 0;    // fraction moved each way
  double npc_rise = 0;  // the larger NPC increase of the winner's design at the two ends
};

struct ConfidenceCheck {
  std::string profile_id;  // the winner's
  double margin = std::numeric_limits<double>::infinity();
  std::vector<LowConfidenceInput> inputs;  // largest npc_rise first
  bool exceeds_margin() const { return !inputs.empty() && inputs.front().npc_rise > margin; }
};

// The relative spread a confidence label stands for (0 for sourced).
double confidence_spread(ValueConfidence confidence);

// Requires result.feasible() (ContractViolation otherwise); `profiles` in study order.
ConfidenceCheck check_low_confidence(const StudyCase& study,
                                     const std::vector<LoadedProfile>& profiles,
                                     const OptimiseResult& result);

}  // namespace stowage
