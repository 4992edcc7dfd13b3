// SPDX-License-Identifier: MIT
// The tender report document: section order, the near-tie call-out, the case of no compliant
// bid, the chart's totals and the input-file table, on the Pier Nine demo tender (invented data:
// only structure and identities with the result object are checked here; the numbers against
// tender.json are checked by tests/e2e/tender_report.sh).
#include "optimiser/report/tender_document.h"

#include <catch2/catch.hpp>
#include <string>
#include <vector>

#include "model/contract.h"
#include "optimiser/report/number_format.h"
#include "test_paths.h"

using namespace stowage;
using namespace stowage::report;

namespace {

const std::string kTender =
    std::string(STOWAGE_SOURCE_DIR) + "/studies/pier-nine-tender/tender.yaml";

ReportDocument build(const TenderCase& tender, const TenderResult& result) {
  TenderReportInputs in;
  in.tender = &tender;
  in.result = &result;
  in.generated_at = "1970-01-01T00:00:00Z";
  return build_tender_report(in);
}

const ReportSection& section(const ReportDocument& doc, const std::string& id) {
  for (const ReportSection& s : doc.sections)
    if (s.id == id) return s;
  FAIL("no section " << id);
  return doc.sections.front();
}

bool has_notice(const ReportSection& s, const std::string& start) {
  for (const ReportBlock& b : s.blocks)
    if (b.kind == ReportBlock::Kind::Notice && b.text.rfind(start, 0) == 0) return true;
  return false;
}

std::size_t tables(const ReportSection& s) {
  std::size_t n = 0;
  for (const ReportBlock& b : s.blocks) n += b.kind == ReportBlock::Kind::Table;
  return n;
}

}  // namespace

TEST_CASE(
    "the tender report leads with the decision and ends with the reproduce and safety "
    "sections",
    "[report][tender]") {
  const TenderCase tender = load_tender_file(kTender);
  const ReportDocument doc = build(tender, evaluate_tender(tender));
  std::vector<std::string> ids;
  for (const ReportSection& s : doc.sections) ids.push_back(s.id);
  CHECK(ids == std::vector<std::string>{"decision", "scoring", "costs", "warranty", "compliance",
                                        "inputs", "reproduce", "method", "limits", "safety"});
  CHECK(doc.generated_line.rfind("Generated 1970-01-01T00:00:00Z by stowage ", 0) == 0);
  CHECK_FALSE(has_notice(section(doc, "decision"), "Near tie"));
}

TEST_CASE("a near tie by the tender's margin is called out in the decision", "[report][tender]") {
  TenderCase tender = load_tender_file(kTender);
  tender.scoring.near_tie_points = 20;  // Bid A leads Bid B by about 14 points
  const TenderResult result = evaluate_tender(tender);
  REQUIRE(result.near_tie);
  CHECK(has_notice(section(build(tender, result), "decision"), "Near tie: the two best bids"));
}

TEST_CASE("a tender no bid meets recommends none and has no scoring table", "[report][tender]") {
  TenderCase tender = load_tender_file(kTender);
  tender.requirements.min_usable_kwh = 99999;
  const TenderResult result = evaluate_tender(tender);
  REQUIRE(result.order.empty());
  const ReportDocument doc = build(tender, result);
  const ReportSection& decision = section(doc, "decision");
  REQUIRE(!decision.blocks.empty());
  CHECK(decision.blocks.front().text.rfind("No bid meets the tender's requirements", 0) == 0);
  CHECK(tables(section(doc, "scoring")) == 0);
  CHECK(tables(section(doc, "compliance")) == 1);
}

TEST_CASE("the bid chart prints each bid's buyer NPC and the hash table lists every input file",
          "[report][tender]") {
  const TenderCase tender = load_tender_file(kTender);
  const TenderResult result = evaluate_tender(tender);
  const ReportDocument doc = build(tender, result);
  const std::vector<const ReportFigure*> figures = doc.figures();
  REQUIRE(figures.size() == 1);
  CHECK(figures[0]->id == "fig-bids");
  for (const BidResult& b : result.bids)
    CHECK(figures[0]->svg.find(">" + format_amount(b.npc) + "<") != std::string::npos);
  // Tender, site and hourly series, then a bid file and a profile per bid.
  const ReportSection& reproduce = section(doc, "reproduce");
  std::size_t rows = 0;
  for (const ReportBlock& b : reproduce.blocks)
    if (b.kind == ReportBlock::Kind::Table) rows = b.table.rows.size();
  CHECK(rows == 3 + 2 * tender.bids.size());
}

TEST_CASE("the tender report refuses a result that is not the tender's", "[report][tender]") {
  const TenderCase tender = load_tender_file(kTender);
  TenderResult result = evaluate_tender(tender);
  result.bids.pop_back();
  CHECK_THROWS_AS(build(tender, result), ContractViolation);
}
