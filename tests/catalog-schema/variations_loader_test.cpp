// SPDX-License-Identifier: MIT
// The study.variations block and --vary: each form read as written, defaults taken from the
// study, every refused value reported at its file, line and field.
#include "catalog-schema/variations_loader.h"

#include <algorithm>
#include <catch2/catch.hpp>
#include <sstream>

#include "catalog-schema/parameter_paths.h"
#include "catalog-schema/study_loader.h"
#include "catalog-schema/tender_loader.h"
#include "catalog_test_support.h"
#include "model/invalid_value.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::fixture_path;
using testing::line_of;
using testing::read_text;

const std::string kFixtures = testing::source_path("tests/catalog-schema/fixtures");
const std::string kName = "variations.yaml";

LoadedStudy load_with(const std::string& block) {
  const std::string text = read_text(fixture_path("study.yaml")) + block;
  std::istringstream in(text);
  return load_study_details(in, kName, kFixtures);
}

void expect_refused(const std::string& block, const std::string& needle, const std::string& field,
                    const std::string& words) {
  const std::string text = read_text(fixture_path("study.yaml")) + block;
  const InputError e =
      expect_input_error([&] { load_with(block); }, kName, line_of(text, needle), field);
  CHECK_THAT(e.message(), Catch::Matchers::Contains(words));
}

TEST_CASE("a study without variations has none", "[catalog][variations]") {
  CHECK(load_study_details_file(fixture_path("study.yaml")).variations.empty());
}

TEST_CASE("the three forms and the distributions are read as written", "[catalog][variations]") {
  const LoadedStudy loaded = load_with(
      "  variations:\n"
      "    - path: profiles.lfp-test.costs.capital_per_kwh\n"
      "      label: LFP price\n"
      "      low: 300\n"
      "      high: 500\n"
      "      unit: EUR/kWh\n"
      "      distribution: {kind: triangular}\n"
      "      source: an assumed range\n"
      "    - path: economics.real_discount_rate\n"
      "      range: {from: 0.02, to: 0.10, steps: 5}\n"
      "      distribution: {kind: normal, sd: 0.02}\n"
      "    - path: site.hourly.temp_c_offset\n"
      "      values: [4, -4, 0]\n"
      "      distribution: {kind: discrete, weights: [1, 1, 2]}\n"
      "    - path: design_space.max_strings_parallel\n"
      "      values: [8, 12, 16]\n"
      "    - path: profiles.lead-test.ageing.cycle_life_scale\n"
      "      low: 0.5\n"
      "      high: 1.5\n"
      "      distribution: {kind: lognormal, log_sd: 0.2}\n");
  REQUIRE(loaded.variations.size() == 5);
  const Variation& price = loaded.variations[0];
  CHECK(price.label == "LFP price");
  CHECK(price.unit == "EUR/kWh");
  CHECK(price.low == 300);
  CHECK(price.high == 500);
  CHECK(price.base == 400);  // lfp-test.yaml's capital_per_kwh
  CHECK(price.points.empty());
  CHECK(price.source == "an assumed range");
  REQUIRE(price.distribution);
  CHECK(price.distribution->kind == DistributionKind::Triangular);
  CHECK(price.distribution->mode == 400);
  // The entry's position: the line after "variations:", which follows the fixture's last line.
  const std::string fixture = read_text(fixture_path("study.yaml"));
  CHECK(price.at.file == kName);
  CHECK(price.at.line == static_cast<int>(std::count(fixture.begin(), fixture.end(), '\n')) + 2);

  const Variation& rate = loaded.variations[1];
  CHECK(rate.points == std::vector<double>{0.02, 0.04, 0.06, 0.08, 0.10});
  CHECK(rate.points[2] == Approx(0.06).epsilon(1e-15));
  CHECK(rate.base == 0.06);
  CHECK(rate.distribution->mean == 0.06);
  CHECK(rate.distribution->sd == 0.02);
  // Truncated to the path's range [0, 1).
  CHECK(rate.distribution->lower == 0);
  CHECK(rate.distribution->upper == 1);
  CHECK(rate.distribution->upper_open);
  CHECK_FALSE(rate.distribution->lower_open);

  const Variation& offset = loaded.variations[2];
  CHECK(offset.points == std::vector<double>{-4, 0, 4});
  CHECK(offset.low == -4);
  CHECK(offset.high == 4);
  CHECK(offset.base == 0);  // an offset's base
  CHECK(offset.distribution->values == std::vector<double>{-4, 0, 4});
  // weights [1, 1, 2] belong to the values as written: 4, -4, 0.
  CHECK(offset.distribution->probabilities == std::vector<double>{0.25, 0.5, 0.25});

  CHECK(loaded.variations[3].whole_number);
  CHECK(loaded.variations[3].base == 12);
  CHECK_FALSE(loaded.variations[3].distribution);

  const Variation& scale = loaded.variations[4];
  CHECK(scale.base == 1);
  CHECK(scale.distribution->median == 1);
  CHECK(scale.distribution->lower == 0);
  CHECK(scale.distribution->lower_open);
}

TEST_CASE("a bad variation is reported at its file, line and field", "[catalog][variations]") {
  expect_refused(
      "  variations:\n    - path: profiles.lfp-test.costs.capital_per_kwhh\n"
      "      low: 1\n      high: 2\n",
      "capital_per_kwhh", "study.variations[0].path", "did you mean");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.08\n      high: 0.04\n",
      "high: 0.04", "study.variations[0].high", "must exceed low");
  expect_refused(
      "  variations:\n    - path: profiles.lfp-test.costs.capital_per_kwh\n"
      "      low: -10\n      high: 500\n",
      "low: -10", "study.variations[0].low", "must lie in");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.02\n      high: 0.08\n      values: [0.03, 0.05]\n",
      "- path: economics", "study.variations[0]", "only one of");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.07\n      high: 0.09\n",
      "- path: economics", "study.variations[0].base", "must lie within");
  expect_refused(
      "  variations:\n    - path: profiles.lfp-test.costs.capital_per_kwh\n"
      "      low: 300\n      high: 500\n      unit: USD/kWh\n",
      "unit: USD", "study.variations[0].unit", "EUR/kWh");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.02\n      high: 0.08\n      distribution: {kind: discrete}\n",
      "distribution:", "study.variations[0].distribution.kind", "draws from values");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.02\n      high: 0.08\n      distribution: {kind: normal}\n",
      "distribution:", "study.variations[0].distribution.sd", "is required");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.02\n      high: 0.08\n"
      "      distribution: {kind: uniform, mode: 0.05}\n",
      "distribution:", "study.variations[0].distribution.mode", "triangular only");
  expect_refused(
      "  variations:\n    - path: economics.project_years\n"
      "      low: 10\n      high: 30\n      distribution: {kind: uniform}\n",
      "distribution:", "study.variations[0].distribution.kind", "whole numbers");
  expect_refused(
      "  variations:\n    - path: economics.project_years\n"
      "      range: {from: 10, to: 30, steps: 4}\n",
      "range:", "study.variations[0].range.steps", "whole numbers");
  expect_refused(
      "  variations:\n    - path: site.hourly.temp_c_offset\n"
      "      values: [-2, 2]\n      distribution: {kind: discrete, weights: [1]}\n",
      "distribution:", "study.variations[0].distribution.weights", "one weight");
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.02\n      high: 0.08\n"
      "    - path: economics.real_discount_rate\n      values: [0.03, 0.05, 0.06]\n",
      "- path: economics.real_discount_rate\n      values", "study.variations[1].path",
      "already varied");
  // The schema: an unknown key inside a distribution.
  expect_refused(
      "  variations:\n    - path: economics.real_discount_rate\n"
      "      low: 0.02\n      high: 0.08\n"
      "      distribution: {kind: normal, sd: 0.01, spread: 2}\n",
      "distribution:", "study.variations[0].distribution.spread", "");
}

TEST_CASE("--vary PATH=LOW:HIGH gives a variation or names the option", "[catalog][variations]") {
  const StudyCase study = load_study_file(fixture_path("study.yaml"));
  const Variation v = parse_vary_option("economics.real_discount_rate=0.03:0.09", study);
  CHECK(v.path == "economics.real_discount_rate");
  CHECK(v.low == 0.03);
  CHECK(v.high == 0.09);
  CHECK(v.base == 0.06);
  CHECK(v.unit == "fraction per year");
  CHECK_FALSE(v.distribution);
  const auto refused = [&](const std::string& text, const std::string& words) {
    try {
      parse_vary_option(text, study);
      FAIL("accepted " << text);
    } catch (const InvalidValue& e) {
      CHECK(e.field() == "--vary");
      CHECK_THAT(e.rule(), Catch::Matchers::Contains(words));
    }
  };
  refused("economics.real_discount_rate", "PATH=LOW:HIGH");
  refused("economics.real_discount_rate=0.03", "two numbers");
  refused("economics.real_discount_rate=0.09:0.03", "must be below");
  refused("economics.real_discount_rate=0.07:0.09", "outside");
  refused("economics.real_discount_rate=0.03:1.5", "must lie in");
  refused("economics.real_discount_rat=0.03:0.09", "did you mean");
  // A command-line entry replaces the file's entry for the same path.
  const std::vector<Variation> merged =
      merge_variations({v}, {parse_vary_option("economics.real_discount_rate=0."
                                               "01:0.1",
                                               study)});
  REQUIRE(merged.size() == 1);
  CHECK(merged[0].low == 0.01);
}

TEST_CASE("every parameter path is listed in docs/input-format.md", "[catalog][variations][docs]") {
  const std::string docs = read_text(testing::source_path("docs/input-format.md"));
  const StudyCase study = load_study_file(fixture_path("study.yaml"));
  for (const ParameterInfo& info : parameter_paths(study)) {
    std::string path = info.path;
    const std::string prefix = "profiles.lfp-test.";
    const std::string lead = "profiles.lead-test.";
    if (path.rfind(lead, 0) == 0) continue;  // the same keys as lfp-test
    if (path.rfind(prefix, 0) == 0) {
      const std::string key = path.substr(prefix.size());
      // Listed as profiles.<id>.<group>.<first> then .<more> of the same group.
      const bool full = docs.find("`profiles.<id>." + key + "`") != std::string::npos;
      const bool tail = docs.find("`." + key.substr(key.find('.') + 1) + "`") != std::string::npos;
      INFO(path);
      CHECK((full || tail));
    } else {
      INFO(path);
      CHECK(docs.find("`" + path + "`") != std::string::npos);
    }
  }
}

}  // namespace
}  // namespace stowage

namespace stowage {
namespace {

// A tender on the Pier Nine demo's site and two of its bids, with `block` appended.
std::string tender_text(const std::string& block) {
  const std::string demo = testing::source_path("studies/pier-nine-tender/");
  return "tender:\n"
         "  title: Variations of a tender\n"
         "  site: " +
         demo +
         "site.yaml\n"
         "  economics: {project_years: 15, real_discount_rate: 0.07, currency: EUR}\n"
         "  scoring: {price_weight: 0.7, criteria: {safety: 0.2, service: 0.1}}\n"
         "  bids:\n"
         "    - " +
         demo +
         "offer-a.yaml\n"
         "    - " +
         demo + "offer-b.yaml\n" + block;
}

TEST_CASE("a tender reads its variations with the tender's paths and the bids' values",
          "[catalog][variations][tender]") {
  const testing::TempDir dir;
  const std::string path = dir.write("tender.yaml", tender_text("  variations:\n"
                                                                "    - path: bids.Bid A.ageing."
                                                                "calendar_life_years\n"
                                                                "      low: 12\n"
                                                                "      high: 18\n"
                                                                "      distribution: {kind: "
                                                                "triangular}\n"
                                                                "    - path: site.backup.price_"
                                                                "per_kwh\n"
                                                                "      low: 0.20\n"
                                                                "      high: 0.40\n"
                                                                "      distribution: {kind: "
                                                                "uniform}\n"));
  const TenderCase tender = load_tender_file(path);
  REQUIRE(tender.variations.size() == 2);
  const Variation& life = tender.variations[0];
  CHECK(life.path == "bids.Bid A.ageing.calendar_life_years");
  CHECK(life.unit == "years");
  // The base is the bid's profile as loaded (studies/pier-nine-tender/bid-a.yaml: 15 years).
  CHECK(life.base == tender.bids[0].profile.calendar_life_years);
  REQUIRE(life.distribution.has_value());
  CHECK(life.distribution->mode == life.base);
  CHECK(tender.variations[1].unit == "EUR/kWh");
  CHECK(tender.variations[1].at.line == line_of(read_text(path), "- path: site.backup"));

  // The setter changes only the bid it names and keeps the bid's profile id.
  TenderCase changed = tender;
  apply_parameter(changed, "bids.Bid A.ageing.calendar_life_years", 12);
  CHECK(changed.bids[0].profile.calendar_life_years == 12);
  CHECK(changed.bids[0].profile.id == tender.bids[0].profile.id);
  CHECK(changed.bids[1].profile.calendar_life_years == tender.bids[1].profile.calendar_life_years);
  apply_parameter(changed, "economics.real_discount_rate", 0.05);
  CHECK(changed.economics.real_discount_rate == 0.05);
}

TEST_CASE("a tender reads rank correlations between its variations",
          "[catalog][variations][tender][correlation]") {
  const testing::TempDir dir;
  const std::string path = dir.write("tender.yaml", tender_text("  variations:\n"
                                                                "    - path: site.backup.price_"
                                                                "per_kwh\n"
                                                                "      label: diesel\n"
                                                                "      low: 0.20\n"
                                                                "      high: 0.40\n"
                                                                "      distribution: {kind: "
                                                                "uniform}\n"
                                                                "    - path: economics.real_"
                                                                "discount_rate\n"
                                                                "      low: 0.04\n"
                                                                "      high: 0.10\n"
                                                                "      distribution: {kind: "
                                                                "uniform}\n"
                                                                "      rank_correlations: "
                                                                "[{with: diesel, rho: 0.4}]\n"));
  const TenderCase tender = load_tender_file(path);
  REQUIRE(tender.variations.size() == 2);
  REQUIRE(tender.variations[0].rank_correlations.size() == 1);
  CHECK(tender.variations[0].rank_correlations[0].with == "economics.real_discount_rate");
  CHECK(tender.variations[1].rank_correlations[0].with == "site.backup.price_per_kwh");
  CHECK(tender.variations[1].rank_correlations[0].rho == 0.4);
  // Named by an unknown name: refused at the tender's field.
  const std::string bad = dir.write("bad.yaml", tender_text("  variations:\n"
                                                            "    - path: economics.real_"
                                                            "discount_rate\n"
                                                            "      low: 0.04\n"
                                                            "      high: 0.10\n"
                                                            "      distribution: {kind: "
                                                            "uniform}\n"
                                                            "      rank_correlations: "
                                                            "[{with: diesel, rho: 0.4}]\n"));
  const InputError e = expect_input_error([&] { load_tender_file(bad); }, bad,
                                          line_of(read_text(bad), "rank_correlations"),
                                          "tender.variations[0].rank_correlations[0].with");
  CHECK_THAT(e.message(), Catch::Matchers::Contains("neither the path nor the label"));
}

TEST_CASE("a tender refuses a variation the tender cannot take, at its file, line and field",
          "[catalog][variations][tender]") {
  const testing::TempDir dir;
  const auto refused = [&](const std::string& block, const std::string& needle,
                           const std::string& field, const std::string& words, int above = 0) {
    const std::string text = tender_text(block);
    const std::string path = dir.write("tender.yaml", text);
    const InputError e = expect_input_error([&] { load_tender_file(path); }, path,
                                            line_of(text, needle) - above, field);
    CHECK_THAT(e.message(), Catch::Matchers::Contains(words));
  };
  // A discount rate of 1.2 lies outside [0, 1) (the tender schema's own range).
  refused(
      "  variations:\n    - path: economics.real_discount_rate\n      low: 0.02\n"
      "      high: 1.2\n",
      "high: 1.2", "tender.variations[0].high", "must lie in [0, 1)");
  // A study-only path (the search) and a bid that is not in the tender.
  refused("  variations:\n    - path: design_space.budget\n      low: 1\n      high: 2\n",
          "design_space.budget", "tender.variations[0].path",
          "not a parameter path of this tender");
  refused(
      "  variations:\n    - path: bids.Bid Z.ageing.calendar_life_years\n      low: 1\n"
      "      high: 2\n",
      "Bid Z", "tender.variations[0].path", "not a parameter path of this tender");
  // The offered price is the bid's, not a tender parameter.
  refused(
      "  variations:\n    - path: bids.Bid B.costs.capital_per_kwh\n      low: 1\n"
      "      high: 2\n",
      "Bid B.costs", "tender.variations[0].path", "is fixed by the bid");
  // A tender only draws its variations, so each needs a distribution.
  refused(
      "  variations:\n    - path: economics.real_discount_rate\n      low: 0.02\n"
      "      high: 0.1\n",
      "- path: economics", "tender.variations[0].distribution", "is required in a tender");
  // The same path twice is refused at the second entry (its path, the line above low).
  refused(
      "  variations:\n    - path: economics.real_discount_rate\n      low: 0.02\n"
      "      high: 0.1\n    - path: economics.real_discount_rate\n      low: 0.03\n"
      "      high: 0.09\n",
      "low: 0.03", "tender.variations[1].path", "already varied by tender.variations[0]", 1);
}

}  // namespace
}  // namespace stowage

namespace stowage {
namespace {

const std::string kTwoDrawn =
    "  variations:\n"
    "    - path: profiles.lfp-test.costs.capital_per_kwh\n"
    "      label: LFP price\n"
    "      low: 300\n"
    "      high: 500\n"
    "      distribution: {kind: uniform}\n"
    "    - path: economics.real_discount_rate\n"
    "      low: 0.03\n"
    "      high: 0.09\n"
    "      distribution: {kind: uniform}\n";

TEST_CASE("rank correlations are read by path or label and stored on both sides",
          "[catalog][variations][correlation]") {
  const LoadedStudy loaded = load_with(kTwoDrawn +
                                       "      rank_correlations:\n"
                                       "        - {with: LFP price, rho: -0.4}\n");
  REQUIRE(loaded.variations.size() == 2);
  REQUIRE(loaded.variations[0].rank_correlations.size() == 1);
  CHECK(loaded.variations[0].rank_correlations[0].with == "economics.real_discount_rate");
  CHECK(loaded.variations[0].rank_correlations[0].rho == -0.4);
  REQUIRE(loaded.variations[1].rank_correlations.size() == 1);
  CHECK(loaded.variations[1].rank_correlations[0].with ==
        "profiles.lfp-test.costs.capital_per_kwh");
  // Given on both sides with one value is accepted.
  const LoadedStudy both = load_with(
      "  variations:\n"
      "    - path: profiles.lfp-test.costs.capital_per_kwh\n"
      "      low: 300\n"
      "      high: 500\n"
      "      distribution: {kind: uniform}\n"
      "      rank_correlations: [{with: economics.real_discount_rate, rho: 0.3}]\n"
      "    - path: economics.real_discount_rate\n"
      "      low: 0.03\n"
      "      high: 0.09\n"
      "      distribution: {kind: uniform}\n"
      "      rank_correlations: [{with: profiles.lfp-test.costs.capital_per_kwh, rho: 0.3}]\n");
  CHECK(both.variations[0].rank_correlations.size() == 1);
  CHECK(both.variations[1].rank_correlations.size() == 1);
  // A --vary entry replacing one side drops the pair: that input is no longer drawn.
  const StudyCase study = loaded.study;
  const std::vector<Variation> merged = merge_variations(
      loaded.variations, {parse_vary_option("economics.real_discount_rate=0.02:0.1", study)});
  CHECK(merged[0].rank_correlations.empty());
}

TEST_CASE("rank correlations that cannot be met are refused at their line",
          "[catalog][variations][correlation]") {
  expect_refused(
      kTwoDrawn +
          "      rank_correlations:\n        - {with: economics.real_discount_rate, rho: 0.2}\n",
      "{with: economics.real", "study.variations[1].rank_correlations[0].with",
      "names its own entry");
  expect_refused(kTwoDrawn +
                     "      rank_correlations:\n"
                     "        - {with: LFP price, rho: 0.2}\n"
                     "        - {with: profiles.lfp-test.costs.capital_per_kwh, rho: 0.2}\n",
                 "{with: profiles.lfp", "study.variations[1].rank_correlations[1].with",
                 "a second time");
  expect_refused(
      "  variations:\n"
      "    - path: profiles.lfp-test.costs.capital_per_kwh\n"
      "      low: 300\n"
      "      high: 500\n"
      "      rank_correlations: [{with: economics.real_discount_rate, rho: 0.3}]\n"
      "    - path: economics.real_discount_rate\n"
      "      low: 0.03\n"
      "      high: 0.09\n"
      "      distribution: {kind: uniform}\n",
      "rank_correlations:", "study.variations[0].rank_correlations", "not drawn");
  expect_refused(
      "  variations:\n"
      "    - path: profiles.lfp-test.costs.capital_per_kwh\n"
      "      low: 300\n"
      "      high: 500\n"
      "      distribution: {kind: uniform}\n"
      "      rank_correlations: [{with: economics.real_discount_rate, rho: 0.3}]\n"
      "    - path: economics.real_discount_rate\n"
      "      low: 0.03\n"
      "      high: 0.09\n",
      "rank_correlations:", "study.variations[0].rank_correlations[0].with", "no distribution");
  // A pair of exactly 1 leaves the matrix singular: Cholesky fails, so it is refused.
  expect_refused(kTwoDrawn + "      rank_correlations: [{with: LFP price, rho: 1}]\n",
                 "- path: profiles", "study.variations", "not positive definite");
}

}  // namespace
}  // namespace stowage
