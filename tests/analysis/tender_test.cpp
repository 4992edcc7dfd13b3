// SPDX-License-Identifier: MIT
// Tender evaluation: warranty arithmetic against hand-derived cases, supplier-paid
// replacements, non-compliance, and one bid's cost lines against a hand calculation.
#include "optimiser/analysis/tender.h"

#include <catch2/catch.hpp>
#include <cmath>
#include <string>

#include "catalog-schema/input_error.h"
#include "catalog-schema/profile_loader.h"
#include "model/ageing.h"
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

TEST_CASE("the warranty ends at its throughput cap when the cap comes before its years",
          "[analysis][tender][warranty]") {
  WarrantyTerms terms;
  terms.years = 10;
  terms.throughput_mwh = 100;
  // Hand derivation: 100 MWh at 12 MWh a year are delivered after 100 / 12 = 8.333 years,
  // before the 10 years.
  WarrantyEnd end = warranty_end(terms, std::vector<double>(15, 12000), 500);
  CHECK(end.cause == WarrantyEnd::Cause::Throughput);
  CHECK(end.years == Approx(100.0 / 12.0));
  // Uneven years: 10 MWh in year 1, then 15 of year 2's 20 MWh reach 25 MWh: 1 + 15/20 = 1.75.
  terms.throughput_mwh = 25;
  end = warranty_end(terms, {10000, 20000, 30000}, 500);
  CHECK(end.cause == WarrantyEnd::Cause::Throughput);
  CHECK(end.years == Approx(1.75));
}

TEST_CASE("the warranty ends at its years when they come before the throughput cap",
          "[analysis][tender][warranty]") {
  WarrantyTerms terms;
  terms.years = 5;
  terms.throughput_mwh = 100;
  // Hand derivation: by year 5 only 5 x 12 = 60 of the 100 MWh are delivered.
  WarrantyEnd end = warranty_end(terms, std::vector<double>(15, 12000), 500);
  CHECK(end.cause == WarrantyEnd::Cause::Years);
  CHECK(end.years == 5);
  // A cap not reached within the evaluation (3 years of 12 MWh) does not end the warranty.
  terms.years = 10;
  CHECK(warranty_end(terms, std::vector<double>(3, 12000), 500).years == 10);
}

TEST_CASE("the warranty ends at its equivalent full cycles when they come first",
          "[analysis][tender][warranty]") {
  WarrantyTerms terms;
  terms.years = 10;
  // 300 equivalent full cycles of a 100 kWh bank = 30 MWh; at 36.5 MWh a year (one full
  // cycle a day) they are used after 30 / 36.5 = 0.8219 years.
  terms.equivalent_full_cycles = 300;
  WarrantyEnd end = warranty_end(terms, std::vector<double>(3, 36500), 100);
  CHECK(end.cause == WarrantyEnd::Cause::Cycles);
  CHECK(end.years == Approx(30.0 / 36.5));
}

namespace {

// A retention curve of 96 % at year 2 and 80 % at year 10: r(t) = 1 - 0.02 t up to year 2
// (from 1 at year 0), then 0.96 - 0.02 (t - 2), i.e. 0.98, 0.96, 0.94, 0.92, 0.90 at the
// ends of years 1..5. A 1000 kWh bank with health 0.97, 0.94, 0.91 at the ends of years 1..3,
// replaced at the end of year 3 (new bank: 0.99 at the end of year 4), 0.86 at the end of
// year 5: shortfalls 10, 20, 30, none (0.99 > 0.92), 40 kWh.
WarrantyTerms retention_terms() {
  WarrantyTerms terms;
  terms.years = 20;
  terms.capacity_floor = 0.7;
  terms.retention = {{2, 0.96}, {10, 0.80}};
  return terms;
}
const std::vector<double> kHealth = {0.97, 0.94, 0.91, 0.99, 0.86};

}  // namespace

TEST_CASE("the retention curve runs linearly from full capacity through its points",
          "[analysis][tender][warranty]") {
  const WarrantyTerms terms = retention_terms();
  // Hand values: 1 - 0.02 x 1; the point itself; 0.96 - 0.02 x 4; held after the last point.
  CHECK(warranted_capacity(terms, 1) == Approx(0.98));
  CHECK(warranted_capacity(terms, 2) == Approx(0.96));
  CHECK(warranted_capacity(terms, 6) == Approx(0.88));
  CHECK(warranted_capacity(terms, 14) == Approx(0.80));
  WarrantyTerms flat;
  flat.capacity_floor = 0.75;
  CHECK(warranted_capacity(flat, 3) == 0.75);
}

TEST_CASE("a top-up restores the bank to the retention curve with modules added once",
          "[analysis][tender][warranty]") {
  WarrantyTerms terms = retention_terms();
  terms.capacity_remedy = CapacityRemedy::TopUp;
  // Hand derivation (see retention_terms): shortfalls 10, 20, 30 kWh at years 1-3, none at
  // year 4, 40 at year 5. Modules added stay: 10 at year 1, 10 more at year 2 (20 - 10), 10
  // at year 3, 10 at year 5 (40 - 30): 40 kWh in all.
  const auto claims = capacity_claims(terms, 20, 1000, kHealth);
  REQUIRE(claims.size() == 4);
  CHECK(claims[0].year == 1);
  CHECK(claims[0].warranted_kwh == Approx(980));
  CHECK(claims[0].modelled_kwh == Approx(970));
  CHECK(claims[3].year == 5);
  CHECK(claims[3].shortfall_kwh == Approx(40));
  double added = 0;
  for (const CapacityClaim& c : claims) {
    CHECK(c.top_up_kwh == Approx(10));
    CHECK(c.liquidated_damages == 0);
    added += c.top_up_kwh;
  }
  CHECK(added == Approx(40));
  // A warranty that ends at 3.5 years covers the year-ends 1-3 only.
  CHECK(capacity_claims(terms, 3.5, 1000, kHealth).size() == 3);
}

TEST_CASE("liquidated damages are paid per kWh short at every year-end within the warranty",
          "[analysis][tender][warranty]") {
  WarrantyTerms terms = retention_terms();
  terms.capacity_remedy = CapacityRemedy::LiquidatedDamages;
  terms.liquidated_damages_per_kwh = 50;
  // Hand derivation: 50 x the shortfalls 10, 20, 30, 40 kWh = 500, 1000, 1500, 2000; nothing
  // is added to the bank.
  const auto claims = capacity_claims(terms, 20, 1000, kHealth);
  REQUIRE(claims.size() == 4);
  const double expected[] = {500, 1000, 1500, 2000};
  for (std::size_t i = 0; i < 4; ++i) {
    CHECK(claims[i].liquidated_damages == Approx(expected[i]));
    CHECK(claims[i].top_up_kwh == 0);
  }
}

TEST_CASE("liquidated damages are a credit in the buyer's NPC at the year-end they are paid",
          "[analysis][tender][warranty]") {
  TenderCase tender = load_tender_file(kTender);
  for (Bid& b : tender.bids) b.warranty.availability.reset();
  Bid& c = tender.bids[2];
  REQUIRE(c.label == "Bid C");
  c.warranty.retention = {{25, 0.90}};
  c.warranty.capacity_remedy = CapacityRemedy::LiquidatedDamages;
  c.warranty.liquidated_damages_per_kwh = 60;
  const TenderResult with = evaluate_tender(tender);
  c.warranty.capacity_remedy = CapacityRemedy::None;
  const TenderResult without = evaluate_tender(tender);
  const BidResult& b = bid(with, "Bid C");
  REQUIRE(!b.capacity_claims.empty());
  // Each claim: 60 x (nameplate x (1 - 0.1 y / 25) - modelled kWh), discounted by
  // P/F(7 %, y) = 1.07^-y (compound interest, common practice).
  double pv = 0;
  for (const CapacityClaim& claim : b.capacity_claims) {
    const double warranted = b.design.bank.nameplate_kwh * (1.0 - 0.1 * claim.year / 25.0);
    CHECK(claim.warranted_kwh == Approx(warranted).epsilon(1e-12));
    pv += 60 * (warranted - claim.modelled_kwh) * std::pow(1.07, -claim.year);
  }
  CHECK(b.liquidated_damages_pv == Approx(-pv).epsilon(1e-9));
  CHECK(b.npc == Approx(bid(without, "Bid C").npc - pv).epsilon(1e-12));
  // The damages move money only: the bank ages the same.
  CHECK(b.design.years.back().damage_end == bid(without, "Bid C").design.years.back().damage_end);
}

TEST_CASE("a bid's LCOS under both conventions carries the damages credit in its numerator",
          "[analysis][tender][warranty]") {
  TenderCase tender = load_tender_file(kTender);
  Bid& c = tender.bids[2];
  REQUIRE(c.label == "Bid C");
  c.warranty.retention = {{25, 0.90}};
  c.warranty.capacity_remedy = CapacityRemedy::LiquidatedDamages;
  c.warranty.liquidated_damages_per_kwh = 60;
  const BidResult& b = bid(evaluate_tender(tender), "Bid C");
  REQUIRE(b.liquidated_damages_pv < 0);
  const DesignResult& d = b.design;
  const double delivered = d.discounted_delivered_kwh;
  // docs/tender.md rule 4: the credit adds to the storage costs, the denominator is unchanged.
  CHECK((b.lcos_per_kwh - d.lcos_per_kwh) * delivered ==
        Approx(b.liquidated_damages_pv).epsilon(1e-9));
  CHECK((b.lcos_schmidt_per_kwh - d.lcos_schmidt_per_kwh) * delivered ==
        Approx(b.liquidated_damages_pv).epsilon(1e-9));
  // docs/method.md 7, derived there: the two conventions differ by the residual value and by
  // moving the last end of life from t_final to N + 1 = 16, discounted at 7 % by hand here.
  const double moved =
      d.final_end_of_life * (std::pow(1.07, -16.0) - std::pow(1.07, -d.final_end_of_life_year));
  CHECK((b.lcos_schmidt_per_kwh - b.lcos_per_kwh) * delivered ==
        Approx(-d.present_value.residual_value + moved).epsilon(1e-9));
}

TEST_CASE("an availability guarantee buys the duty of the hours out of service as back-up",
          "[analysis][tender][warranty]") {
  TenderCase tender = load_tender_file(kTender);
  tender.bids[1].warranty.availability = 1.0;
  const TenderResult full = evaluate_tender(tender);
  tender.bids[1].warranty.availability = 0.97;
  const TenderResult part = evaluate_tender(tender);
  const BidResult& f = bid(full, "Bid B");
  const BidResult& p = bid(part, "Bid B");
  // Hand rule: out of service 3 % of every year, so 3 % of the energy the bank delivers is
  // bought at the back-up price (0.285 EUR/kWh, site.yaml) and 3 % of its charging energy
  // and variable O&M is saved, each discounted at the end of its year.
  double backup = 0, saved = 0;
  for (const YearRecord& rec : f.design.years) {
    backup += 0.03 * rec.dispatch.delivered_kwh * 0.285 * rec.discount_factor;
    saved += 0.03 * (rec.charging + rec.variable_om) * rec.discount_factor;
  }
  CHECK(p.design.present_value.backup - f.design.present_value.backup ==
        Approx(backup).epsilon(1e-9));
  CHECK(p.availability_pv == Approx(backup - saved).epsilon(1e-9));
  CHECK(p.npc - f.npc == Approx(backup - saved).epsilon(1e-9));
}

TEST_CASE("a profile re-expressed at a lower end of life keeps its health year by year",
          "[analysis][tender]") {
  const ChemistryProfile lfp =
      load_profile_file(std::string(STOWAGE_SOURCE_DIR) + "/catalog-schema/profiles/lfp.yaml");
  const ChemistryProfile at70 = profile_retiring_at(lfp, 0.70);
  // Linear fade: 20 % lost at damage 1 to 80 %, so 30 % is reached at damage 1.5; lives scale
  // by (1 - 0.7) / (1 - 0.8) = 1.5: 6000 cycles at DoD 0.8 -> 9000, 15 years -> 22.5.
  CHECK(at70.cycle_life.cycles_to_end_of_life(0.8) == Approx(9000));
  CHECK(at70.calendar_life_years == Approx(22.5));
  CHECK(at70.eol_capacity_fraction == 0.70);
  // The same wear in both: damage 0.6 on the 80 % scale (health 1 - 0.2 x 0.6 = 0.88) is
  // damage 0.4 on the 70 % scale (1 - 0.3 x 0.4 = 0.88).
  CHECK(health_from_damage(at70, 0.4) == Approx(health_from_damage(lfp, 0.6)));
  CHECK(health_from_damage(lfp, 0.6) == Approx(0.88));
}

TEST_CASE("a bank that wears out to its floor within the warranty is replaced by the supplier",
          "[analysis][tender]") {
  const TenderCase tender = load_tender_file(kTender);
  const TenderResult r = evaluate_tender(tender);
  const BidResult& a = bid(r, "Bid A");
  // Bid A's chemistry (lfp.yaml, re-expressed at the warranty's 70 % floor) wears the bank
  // to the floor in a year within its 20-year warranty: the supplier pays, so the buyer's NPC
  // falls by exactly the present value of that replacement and of the end of life of the bank
  // removed.
  REQUIRE(a.supplier_paid_years.size() == 1);
  CHECK(a.buyer_paid_years.empty());
  const int y = a.supplier_paid_years.front();
  const double investment = 490680 + 90000;
  const double replacement = 0.80 * investment + 5 * a.design.bank.nameplate_kwh;
  CHECK(a.npc_without_warranty - a.design.npc ==
        Approx(replacement * present_worth_factor(0.07, y)).epsilon(1e-12));
  CHECK(a.design.present_value.replacements == 0);
}

TEST_CASE("each Pier Nine bid ages as its shipped chemistry profile, not as its warranty",
          "[analysis][tender]") {
  const std::string profiles = std::string(STOWAGE_SOURCE_DIR) + "/catalog-schema/profiles/";
  const TenderCase tender = load_tender_file(kTender);
  const char* chemistry[] = {"lfp", "nmc", "vanadium-flow", "vrla-gel"};
  REQUIRE(tender.bids.size() == 4);
  for (std::size_t i = 0; i < 4; ++i) {
    INFO(tender.bids[i].label);
    const ChemistryProfile& bid = tender.bids[i].profile;
    const ChemistryProfile shipped = load_profile_file(profiles + chemistry[i] + ".yaml");
    CHECK(bid.family == shipped.family);
    CHECK(bid.calendar_life_years == shipped.calendar_life_years);
    CHECK(bid.eol_capacity_fraction == shipped.eol_capacity_fraction);
    CHECK(bid.max_service_years == shipped.max_service_years);
    REQUIRE(bid.cycle_life.points().size() == shipped.cycle_life.points().size());
    for (std::size_t k = 0; k < bid.cycle_life.points().size(); ++k) {
      CHECK(bid.cycle_life.points()[k].dod == shipped.cycle_life.points()[k].dod);
      CHECK(bid.cycle_life.points()[k].cycles == shipped.cycle_life.points()[k].cycles);
    }
    CHECK(bid.partial_charge.has_value() == shipped.partial_charge.has_value());
  }
}

TEST_CASE(
    "a bid whose duty stays inside both warranty limits and its modelled life has no "
    "replacement within the warranty",
    "[analysis][tender]") {
  TenderCase tender = load_tender_file(kTender);
  WarrantyTerms& terms = tender.bids[0].warranty;  // Bid A
  const TenderResult long_warranty = evaluate_tender(tender);
  const double life = bid(long_warranty, "Bid A").modelled_life_years;
  REQUIRE(life > 8);
  // A warranty of 8 years or 5400 equivalent full cycles: the duty uses well under 400 a year
  // (one evening cycle a day at most, 365 x 1 = 365 < 5400 / 8 = 675), so the years end it,
  // inside the bank's modelled life.
  terms.years = 8;
  const TenderResult r = evaluate_tender(tender);
  const BidResult& a = bid(r, "Bid A");
  CHECK(a.warranty.cause == WarrantyEnd::Cause::Years);
  CHECK(a.warranty.years == 8);
  CHECK_FALSE(a.warranty_exceeds_model);
  CHECK(a.supplier_paid_years.empty());
  for (int y : a.design.replacement_years) CHECK(y > 8);
  // The warranty moves money only: the bank's wear is the same under either warranty.
  const BidResult& a20 = bid(long_warranty, "Bid A");
  REQUIRE(a.design.years.size() == a20.design.years.size());
  for (std::size_t i = 0; i < a.design.years.size(); ++i) {
    CHECK(a.design.years[i].damage_end == a20.design.years[i].damage_end);
  }
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
  try {
    load_tender_file(dir + "rising-retention.yaml");
    FAIL("expected InputError");
  } catch (const InputError& e) {
    CHECK_THAT(e.what(), Catch::Contains("rising-retention-bid.yaml:11"));
    CHECK_THAT(e.what(), Catch::Contains("bid.warranty.retention[1].capacity"));
  }
  try {
    load_tender_file(dir + "damages-without-remedy.yaml");
    FAIL("expected InputError");
  } catch (const InputError& e) {
    CHECK_THAT(e.what(), Catch::Contains("bid.warranty"));
    CHECK_THAT(e.what(), Catch::Contains("capacity_remedy is not liquidated_damages"));
  }
}
