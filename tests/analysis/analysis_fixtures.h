// SPDX-License-Identifier: MIT
// The study the analysis tests run on: the Tarnbeck Saddle demo with three of its profiles
// (LFP, sodium-ion, VRLA gel), so every re-optimised point takes a fraction of a second.
#pragma once

#include <algorithm>
#include <string>

#include "catalog-schema/study_loader.h"
#include "test_paths.h"

namespace stowage::testing {

inline StudyCase three_profile_study() {
  StudyCase study =
      load_study_file(std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml");
  std::vector<ChemistryProfile> kept;
  for (const ChemistryProfile& p : study.profiles) {
    if (p.id == "lfp" || p.id == "sodium-ion" || p.id == "vrla-gel") kept.push_back(p);
  }
  study.profiles = kept;
  return study;
}

}  // namespace stowage::testing
