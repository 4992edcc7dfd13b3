// SPDX-License-Identifier: MIT
// The tender report document: section order, the near-tie call-out, the case of no compliant
// bid, the chart's totals and the input-file table, on the Pier Nine demo tender (invented data:
// only structure and identities with the result object are checked here; the numbers against
// tender.json are checked by tests/e2e/tender_report.sh).
#include "optimiser/report/tender_document.h"

#include <catch2/catch.hpp>
#include <sstream>
#include <string>
#include <vector>

#include "model/contract.h"
#include "optimiser/report/number_format.h"
#include "optimiser/report/tender_report.h"
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

namespace {

// A sampled result built by hand for the demo's bids: `runner_up_first` of 20 samples have
// the runner-up ahead; the figures per bid are the deterministic ones.
TenderUncertainty hand_built(const TenderCase& tender, const TenderResult& result,
                             std::size_t runner_up_first) {
  TenderUncertainty u;
  Variation rate;
  rate.path = rate.label = "economics.real_discount_rate";
  rate.distribution = Distribution{};
  u.drawn = {rate};
  u.samples = 20;
  u.seed = 7;
  for (std::size_t k = 0; k < u.samples; ++k) {
    TenderSample s;
    for (const BidResult& b : result.bids) {
      s.npc.push_back(b.npc);
      s.lcos.push_back(b.lcos_per_kwh);
      s.compliant.push_back(b.compliant());
      s.total_score.push_back(b.total_score);
      s.rank.push_back(b.rank);
    }
    if (k < runner_up_first) s.total_score[result.order[1]] = 100;
    u.records.push_back(s);
  }
  for (const BidResult& b : result.bids) {
    BidUncertainty bu;
    bu.label = b.label;
    bu.npc.p10 = bu.npc.p50 = bu.npc.p90 = b.npc;
    u.bids.push_back(bu);
  }
  (void)tender;
  u.tie = near_tie_rule(u.records, result.order[0], result.order[1]);
  return u;
}

ReportDocument build_sampled(const TenderCase& tender, const TenderResult& result,
                             const TenderUncertainty& u) {
  TenderReportInputs in;
  in.tender = &tender;
  in.result = &result;
  in.uncertainty = &u;
  in.generated_at = "1970-01-01T00:00:00Z";
  return build_tender_report(in);
}

}  // namespace

TEST_CASE("with variations the samples make the near-tie call, not the tender's margins",
          "[report][tender][ties]") {
  TenderCase tender = load_tender_file(kTender);
  tender.scoring.near_tie_points = 20;  // the margins alone would call a near tie
  const TenderResult result = evaluate_tender(tender);
  REQUIRE(result.near_tie);
  // 0 of 20: 0 + 2 x 0 < 0.10, no tie, whatever the margins say.
  const TenderUncertainty clear = hand_built(tender, result, 0);
  REQUIRE_FALSE(clear.tie.near_tie);
  const ReportDocument doc = build_sampled(tender, result, clear);
  const ReportSection& decision = section(doc, "decision");
  CHECK(has_notice(decision, "No near tie from 20 samples of the tender's variations"));
  CHECK_FALSE(has_notice(decision, "Near tie: the two best bids"));
  std::vector<std::string> ids;
  for (const ReportSection& s : doc.sections) ids.push_back(s.id);
  REQUIRE(ids.size() > 2);
  CHECK(ids[2] == "uncertainty");  // right after the scoring
  // 3 of 20: q = 0.15 >= 0.10, a tie; the sentence names the rule and the share.
  const TenderUncertainty tie = hand_built(tender, result, 3);
  REQUIRE(tie.tie.near_tie);
  const std::string sentence = sampled_tie_sentence(tender, tie);
  CHECK(sentence.rfind("NEAR TIE from 20 samples", 0) == 0);
  CHECK(sentence.find("in 15.0 % of them") != std::string::npos);
  // sqrt(0.15 x 0.85 / 20) = 0.0798 (standard error of a proportion, common practice).
  CHECK(sentence.find("(standard error 8.0 %)") != std::string::npos);
  CHECK(sentence.find("plus 2 standard errors reaches 10.0 %") != std::string::npos);
  CHECK(has_notice(section(build_sampled(tender, result, tie), "decision"), "NEAR TIE from 20"));
}

TEST_CASE("the text report names the rule that made the near-tie call", "[report][tender][ties]") {
  TenderCase tender = load_tender_file(kTender);
  tender.scoring.near_tie_points = 20;
  const TenderResult result = evaluate_tender(tender);
  std::ostringstream margins, sampled;
  write_tender_text(margins, tender, result);
  CHECK(margins.str().find("(the tender's margins)") != std::string::npos);
  CHECK(margins.str().find("samples") == std::string::npos);
  const TenderUncertainty u = hand_built(tender, result, 0);
  write_tender_text(sampled, tender, result, &u);
  CHECK(sampled.str().find("(the tender's margins)") == std::string::npos);
  CHECK(sampled.str().find("No near tie from 20 samples") != std::string::npos);
  CHECK(sampled.str().find("Uncertainty over 20 samples of the tender's variations (seed 7") !=
        std::string::npos);
}
