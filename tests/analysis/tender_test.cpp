// SPDX-License-Identifier: MIT
// Tender evaluation: warranty arithmetic against hand-derived cases, supplier-paid
// replacements, non-compliance, and one bid's cost lines against a hand calculation.
#include "optimiser/analysis/tender.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "catalog-schema/input_error.h"
#include "model/economics.h"
#include "test_paths.h"

using namespace stowage;

namespace {

const std::string kTender =
    std::string(STOWAGE_SOURCE_DIR) + "/studies/pier-nine-tender/tender.yaml";

const BidResult& bid(const TenderResult& r, const std::string& label) {
  for (const BidResult& b : r.bids) {
    if (b.label == label) return b;
  }
  FAIL("no bid " << label);
  return r.bids.front();
}

}  // namespace

TEST_CASE("the warranty ends at the first of its years, throughput and cycles",
          "[analysis][tender][warranty]") {
  WarrantyTerms terms;
  // Throughput first: 100 MWh at 12 MWh a year is reached after 100 / 12 = 8.333 years.
  terms.years = 10;
  terms.throughput_mwh = 100;
  WarrantyEnd end = warranty_end(terms, std::vector<double>(15, 12000), 500);
  CHECK(end.cause == WarrantyEnd::Cause::Throughput);
  CHECK(end.years == Approx(100.0 / 12.0));
  // Years first: 5 years before 8.333.
  terms.years = 5;
  end = warranty_end(terms, std::vector<double>(15, 12000), 500);
  CHECK(end.cause == WarrantyEnd::Cause::Years);
  CHECK(end.years == 5);
  // Uneven years: 10 MWh in year 1, then 15 of year 2's 20 MWh reach 25 MWh: 1.75 years.
  terms.years = 10;
  terms.throughput_mwh = 25;
  end = warranty_end(terms, {10000, 20000, 30000}, 500);
  CHECK(end.years == Approx(1.75));
  // Cycles: 300 equivalent full cycles of a 100 kWh bank = 30 MWh; at 36.5 MWh a year
  // (one full cycle a day) they are used after 30 / 36.5 = 0.8219 years.
  terms.throughput_mwh.reset();
  terms.equivalent_full_cycles = 300;
  end = warranty_end(terms, std::vector<double>(3, 36500), 100);
  CHECK(end.cause == WarrantyEnd::Cause::Cycles);
  CHECK(end.years == Approx(30.0 / 36.5));
  // A cap not reached within the evaluation does not end the warranty.
  terms.equivalent_full_cycles = 1e6;
  CHECK(warranty_end(terms, std::vector<double>(3, 36500), 100).years == 10);
}

TEST_CASE("a bank that wears out to its floor within the warranty is replaced by the supplier",
          "[analysis][tender]") {
  const TenderCase tender = load_tender_file(kTender);
  const TenderResult r = evaluate_tender(tender);
  const BidResult& a = bid(r, "Bid A");
  // Bid A's chemistry retires the bank at 70 % (its profile), at the warranty's floor, in a
  // year within its 20-year warranty: the supplier pays, so the buyer's NPC falls by exactly
  // the present value of that replacement and of the end of life of the bank removed.
  REQUIRE(a.supplier_paid_years.size() == 1);
  CHECK(a.buyer_paid_years.empty());
  const int y = a.supplier_paid_years.front();
  const double investment = 490680 + 90000;
  const double replacement = 0.80 * investment + 5 * a.design.bank.nameplate_kwh;
  CHECK(a.npc_without_warranty - a.design.npc ==
        Approx(replacement * present_worth_factor(0.07, y)).epsilon(1e-12));
  CHECK(a.design.present_value.replacements == 0);
}

TEST_CASE("a bid's investment and service lines equal a hand calculation", "[analysis][tender]") {
  const TenderResult r = evaluate_tender(load_tender_file(kTender));
  const BidResult& a = bid(r, "Bid A");
  // Investment at year 0: capex + installation. Service contract 8064 EUR a year for 15 years at
  // 7 %: 8064 x P/A(7 %, 15) = 8064 x 9.107914 (compound-interest tables, common practice).
  CHECK(a.design.present_value.investment == Approx(490680 + 90000).epsilon(1e-12));
  CHECK(a.design.present_value.fixed_om == Approx(8064 * 9.107914).epsilon(1e-6));
}

TEST_CASE("a bid short of a requirement is listed with the shortfall and not scored",
          "[analysis][tender]") {
  const TenderResult r = evaluate_tender(load_tender_file(kTender));
  const BidResult& d = bid(r, "Bid D");
  // Bid D: 400 x 2 V x 1250 Ah x 2 strings = 2000 kWh, operated at DoD 0.60, retired at 80 %:
  // 2000 x 0.60 x 0.80 = 960 kWh usable at its worst year-end, against 1200 required.
  REQUIRE(d.shortfalls.size() == 1);
  CHECK(d.shortfalls[0].kind == Shortfall::Kind::UsableEnergy);
  CHECK(d.shortfalls[0].offered == Approx(960).epsilon(1e-9));
  CHECK(d.shortfalls[0].required == 1200);
  CHECK(d.rank == 0);
  // The scored bids: price scores are 100 x least NPC / NPC, the best scores 100.
  double best = 0;
  for (std::size_t i : r.order) best = std::max(best, r.bids[i].price_score);
  CHECK(best == Approx(100));
  CHECK(r.order.size() == 3);
}

TEST_CASE("tender files with broken rules are refused at the field", "[analysis][tender]") {
  const std::string dir = std::string(STOWAGE_SOURCE_DIR) + "/tests/analysis/fixtures/";
  try {
    load_tender_file(dir + "weights-not-one.yaml");
    FAIL("expected InputError");
  } catch (const InputError& e) {
    CHECK_THAT(e.what(), Catch::Contains("tender.scoring"));
    CHECK_THAT(e.what(), Catch::Contains("sum to 1"));
  }
  try {
    load_tender_file(dir + "missing-score.yaml");
    FAIL("expected InputError");
  } catch (const InputError& e) {
    CHECK_THAT(e.what(), Catch::Contains("bid.technical_scores"));
    CHECK_THAT(e.what(), Catch::Contains("delivery"));
  }
}
