// SPDX-License-Identifier: MIT
// The first-year trace the report draws is the year the lifecycle priced: re-running the
// model's dispatch with the design's choices gives the same yearly totals, bit for bit.
#include "optimiser/analysis/design_trace.h"

#include <catch2/catch.hpp>

#include "catalog-schema/study_loader.h"
#include "model/contract.h"
#include "optimiser/analysis/evaluate_all.h"
#include "test_paths.h"

using namespace stowage;

TEST_CASE("the first-year trace has the lifecycle's first-year totals", "[analysis][trace]") {
  const StudyCase study =
      load_study_file(std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml");
  const std::vector<DesignResult> results = evaluate_all(study);
  REQUIRE(!results.empty());
  for (const DesignResult& design : results) {
    const DesignTrace trace = trace_first_year(study, design);
    const YearDispatch& priced = design.years.front().dispatch;
    CHECK(trace.soc.size() == 8761);
    CHECK(trace.first_year.discharged_terminal_kwh == priced.discharged_terminal_kwh);
    CHECK(trace.first_year.charged_terminal_kwh == priced.charged_terminal_kwh);
    CHECK(trace.first_year.unserved_kwh == priced.unserved_kwh);
    CHECK(trace.first_year.backup_kwh == priced.backup_kwh);
    CHECK(trace.first_year.equivalent_full_cycles == priced.equivalent_full_cycles);
    // The per-hour temperature effects are the profile's own functions of the site series.
    const ChemistryProfile& profile = study.profiles[*study.find_profile(design.profile_id)];
    REQUIRE(trace.capacity_factor.size() == 8760);
    CHECK(trace.capacity_factor[4000] ==
          profile.temperature.capacity_factor(study.site.temp_c[4000]));
    CHECK(trace.ageing_acceleration[4000] >= 1.0);  // floored at 1 (docs/method.md 3)
    // Every cycle counted lies in one of the 20 depth bins.
    double binned = 0;
    for (const DepthBin& bin : trace.cycles.histogram) binned += bin.count;
    double counted = 0;
    for (const RainflowCycle& c : trace.cycles.cycles) counted += c.count;
    CHECK(trace.cycles.histogram.size() == 20);
    CHECK(binned == Approx(counted));
  }
}

TEST_CASE("tracing a design of a profile the study lacks is a broken contract",
          "[analysis][trace]") {
  const StudyCase study =
      load_study_file(std::string(STOWAGE_SOURCE_DIR) + "/studies/tarnbeck-saddle/study.yaml");
  DesignResult design = evaluate_all(study).front();
  design.profile_id = "no-such-profile";
  CHECK_THROWS_AS(trace_first_year(study, design), ContractViolation);
}
