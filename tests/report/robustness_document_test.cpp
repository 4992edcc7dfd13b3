// SPDX-License-Identifier: MIT
// The robustness report documents: the decision first and the shared sections after the
// analysis, the winner on each side of a break-even, and no empty table or figure when there
// is nothing to show. Result objects are made by hand on the robustness fixture (only its input
// files are read, for their SHA-256); the numbers against each command's JSON are checked by
// tests/e2e/robustness_report.sh.
#include "optimiser/report/robustness_document.h"

#include <catch2/catch.hpp>
#include <string>
#include <vector>

#include "test_paths.h"

using namespace stowage;
using namespace stowage::report;

namespace {

const LoadedStudy& fixture() {
  static const LoadedStudy loaded = load_study_details_file(
      std::string(STOWAGE_SOURCE_DIR) + "/tests/e2e/fixtures/robust-study.yaml");
  return loaded;
}

std::vector<std::string> section_ids(const ReportDocument& doc) {
  std::vector<std::string> ids;
  for (const ReportSection& s : doc.sections) ids.push_back(s.id);
  return ids;
}

// The text of the value cell of the decision table's row `quantity`.
std::string decision_value(const ReportDocument& doc, const std::string& quantity) {
  for (const ReportBlock& b : doc.sections.front().blocks) {
    if (b.kind != ReportBlock::Kind::Table) continue;
    for (const std::vector<ReportCell>& row : b.table.rows)
      if (row.front().text == quantity) return row.at(1).text;
  }
  return "";
}

BreakevenResult crossing(bool profile_wins_at_from) {
  BreakevenResult r;
  r.path = "profiles.sodium-ion.costs.capital_per_kwh";
  r.unit = "EUR/kWh";
  r.profile_id = "lfp";
  r.from = 240;
  r.to = 380;
  r.crossing = true;
  r.value = 330;
  r.bracket_low = 329;
  r.bracket_high = 331;
  r.profile_wins_at_from = profile_wins_at_from;
  for (double x : {240.0, 380.0}) {
    BreakevenProbe p;
    p.value = x;
    p.profile_npc = 1000;
    p.rival_npc = x * 3;
    p.rival_id = "sodium-ion";
    p.gap = p.profile_npc - p.rival_npc;
    r.scan.push_back(p);
  }
  r.at_low = r.scan.front();
  r.at_high = r.scan.back();
  return r;
}

}  // namespace

TEST_CASE("a break-even report leads with the decision and ends with the shared sections",
          "[robustness-document]") {
  const ReportDocument doc =
      build_breakeven_report(fixture(), crossing(false), "1970-01-01T00:00:00Z");
  const std::vector<std::string> want{"decision", "breakeven",       "reproduce", "analysis-method",
                                      "method",   "analysis-limits", "limits",    "safety"};
  CHECK(section_ids(doc) == want);
  CHECK(doc.generated_line.rfind("Generated 1970-01-01T00:00:00Z by stowage ", 0) == 0);
  REQUIRE(doc.figures().size() == 1);
  CHECK(doc.figures().front()->id == "fig-breakeven");
}

TEST_CASE("the break-even decision names the cheaper profile on each side",
          "[robustness-document]") {
  // The rival wins at the low end: it is cheaper below the break-even, the profile above.
  const ReportDocument rival_first =
      build_breakeven_report(fixture(), crossing(false), "1970-01-01T00:00:00Z");
  CHECK(decision_value(rival_first, "cheaper below the break-even") == "sodium-ion");
  CHECK(decision_value(rival_first, "cheaper above the break-even") == "lfp");
  const ReportDocument profile_first =
      build_breakeven_report(fixture(), crossing(true), "1970-01-01T00:00:00Z");
  CHECK(decision_value(profile_first, "cheaper below the break-even") == "lfp");
  CHECK(decision_value(profile_first, "cheaper above the break-even") == "sodium-ion");
  CHECK(decision_value(profile_first, "break-even value (EUR/kWh)") == "330");
}

TEST_CASE("an uncertainty report without profiles has no empty table and no figure",
          "[robustness-document]") {
  UncertaintyResult r;
  r.samples = 8;
  r.no_winner_probability = 1;
  const ReportDocument doc = build_uncertainty_report(fixture(), r, "1970-01-01T00:00:00Z");
  CHECK(doc.figures().empty());
  for (const ReportSection& s : doc.sections) {
    for (const ReportBlock& b : s.blocks) {
      if (b.kind == ReportBlock::Kind::Table) CHECK_FALSE(b.table.rows.empty());
    }
  }
  CHECK(doc.sections.front().id == "decision");
}
