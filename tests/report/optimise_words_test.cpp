// SPDX-License-Identifier: MIT
// The optimiser returns data; the report words it. These pin the sentences a user reads when
// no design can meet the requirements.
#include <catch2/catch.hpp>

#include "optimiser/optimise.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/optimise_report.h"
#include "support/synthetic_study.h"

using namespace stowage;
using namespace stowage::report;

TEST_CASE("an unmet autonomy is worded with both figures and the shortfall", "[report][words]") {
  SyntheticStudySpec spec;
  spec.seed = 7;
  spec.max_strings = 2;
  spec.autonomy_days = 6;
  const StudyCase study = make_synthetic_study(spec);
  const OptimiseResult r = optimise(study);
  REQUIRE_FALSE(r.unmet.empty());
  const UnmetRequirement& u = r.unmet[0];
  CHECK(requirement_key(u) == "autonomy");
  const std::string text = describe_unmet(u, study);
  CHECK_THAT(text, Catch::Contains(format_general(u.needed, 4) + " kWh usable"));
  CHECK_THAT(text, Catch::Contains("short by " + format_general(u.needed - u.best_available, 4)));
  CHECK_THAT(text, Catch::Contains("capped by max_strings_parallel"));
}

TEST_CASE("a profile without a cell mass is named in the note", "[report][words]") {
  SyntheticStudySpec spec;
  spec.seed = 8;
  StudyCase study = make_synthetic_study(spec);
  for (ChemistryProfile& p : study.profiles) p.cell_mass_kg.reset();
  study.search.max_mass_kg = 1e6;
  const OptimiseResult r = optimise(study);
  REQUIRE_FALSE(r.notes.empty());
  CHECK(describe_note(r.notes[0], study) ==
        "profile " + study.profiles[0].id +
            " gives no cell_mass_kg, so it cannot be shown to meet max_mass_kg and is left out");
  REQUIRE_FALSE(r.unmet.empty());
  CHECK(requirement_key(r.unmet.back()) == "max_mass_kg");
}
