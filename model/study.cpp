// SPDX-License-Identifier: MIT
#include "model/study.h"

#include <cmath>

#include "model/contract.h"
#include "model/sizing.h"

namespace stowage {

std::optional<std::size_t> Study::find_profile(const std::string& id) const {
  for (std::size_t i = 0; i < profiles.size(); ++i)
    if (profiles[i].id == id) return i;
  return std::nullopt;
}

std::vector<ResolvedDesign> resolve_designs(const Study& study) {
  std::vector<ResolvedDesign> out;
  auto resolve = [&](std::size_t index, const DesignSpec& spec) {
    const ChemistryProfile& p = study.profiles[index];
    ResolvedDesign d;
    d.profile_index = index;
    d.dod_setpoint = spec.dod_setpoint.value_or(p.dod.default_setpoint);
    d.strings_parallel = spec.strings_parallel
                             ? *spec.strings_parallel
                             : size_for_autonomy(p, study.site, d.dod_setpoint).strings_parallel;
    out.push_back(d);
  };
  if (study.designs.empty()) {
    for (std::size_t i = 0; i < study.profiles.size(); ++i) {
      resolve(i, DesignSpec{study.profiles[i].id, {}, {}});
    }
    return out;
  }
  for (std::size_t i = 0; i < study.designs.size(); ++i) {
    const DesignSpec& spec = study.designs[i];
    const std::optional<std::size_t> p = study.find_profile(spec.profile_id);
    if (!p)
      throw ContractViolation("designs[" + std::to_string(i) + "].profile",
                              "no profile with id '" + spec.profile_id + "' in the study");
    resolve(*p, spec);
  }
  return out;
}

}  // namespace stowage
