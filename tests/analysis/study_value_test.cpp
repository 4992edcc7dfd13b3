// SPDX-License-Identifier: MIT
// A StudyCase is a plain value: a copy can be changed through a parameter path and evaluated
// again while the original's result stays exactly what it was.
#include <catch2/catch.hpp>

#include "catalog-schema/parameter_paths.h"
#include "catalog-schema/study_loader.h"
#include "optimiser/analysis/evaluate_all.h"
#include "test_paths.h"

using namespace stowage;

TEST_CASE("changing a price on a copy of a study leaves the original's result unchanged",
          "[analysis][value]") {
  const StudyCase original =
      load_study_file(std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml");
  const std::vector<DesignResult> before = evaluate_all(original);
  StudyCase copy = original;
  const std::string path = "profiles." + original.profiles.front().id + ".costs.capital_per_kwh";
  apply_parameter(copy, path, 2 * original.profiles.front().costs.capital_per_kwh);
  const std::vector<DesignResult> changed = evaluate_all(copy);
  const std::vector<DesignResult> after = evaluate_all(original);
  REQUIRE(before.size() == after.size());
  for (std::size_t i = 0; i < before.size(); ++i) {
    CHECK(after[i].npc == before[i].npc);  // bit for bit
  }
  // The copy's first profile costs more to buy, so its first design's investment rises.
  CHECK(changed.front().investment > before.front().investment);
  CHECK(changed.front().npc > before.front().npc);
}
