// SPDX-License-Identifier: MIT
// Study files: the study, its site and profiles load into a Study; rules across files are
// enforced and reported in the file that must change.
#include "catalog-schema/study_loader.h"

#include <catch2/catch.hpp>
#include <sstream>

#include "catalog_test_support.h"

namespace stowage {
namespace {

using testing::expect_input_error;
using testing::fixture_path;
using testing::line_of;
using testing::read_text;
using testing::replace_once;

const char* const kName = "bad-study.yaml";
const std::string kFixtures = testing::source_path("tests/catalog-schema/fixtures");

std::string study_text() { return read_text(fixture_path("study.yaml")); }

LoadedStudy load_text(const std::string& text, const std::string& base_dir = kFixtures) {
  std::istringstream in(text);
  return load_study_details(in, kName, base_dir);
}

std::string study_error(const std::string& text, const std::string& line_needle,
                        const std::string& field) {
  return expect_input_error([&] { load_text(text); }, kName, line_of(text, line_needle), field)
      .message();
}

TEST_CASE("a study loads its site, profiles, designs and design space", "[catalog][study]") {
  const LoadedStudy loaded = load_study_details_file(fixture_path("study.yaml"));
  const StudyCase& s = loaded.study;
  CHECK(s.title == "Loader test study");
  CHECK(loaded.site_path == fixture_path("site.yaml"));
  CHECK(loaded.hourly_path == fixture_path("hourly.csv"));
  CHECK(s.site.name == "Loader test hut");
  CHECK(s.site.load_kw.size() == 8760);
  REQUIRE(s.profiles.size() == 2);
  CHECK(s.profiles[0].id == "lfp-test");
  CHECK(s.profiles[1].id == "lead-test");
  CHECK(loaded.profile_paths[1] == fixture_path("lead-test.yaml"));
  CHECK(loaded.profiles[0].currency == "EUR");
  CHECK(s.economics.project_years == 20);
  CHECK(s.economics.real_discount_rate == 0.06);
  CHECK(s.economics.currency == "EUR");
  REQUIRE(s.designs.size() == 2);
  CHECK(s.designs[0].profile_id == "lfp-test");
  REQUIRE(s.designs[0].dod_setpoint);
  CHECK(*s.designs[0].dod_setpoint == 0.7);
  REQUIRE(s.designs[0].strings_parallel);
  CHECK(*s.designs[0].strings_parallel == 2);
  CHECK_FALSE(s.designs[1].dod_setpoint);
  CHECK_FALSE(s.designs[1].strings_parallel);
  CHECK(s.search.dod_from == 0.3);
  CHECK(s.search.dod_to == 0.9);
  CHECK(s.search.dod_step == 0.1);
  CHECK(s.search.max_strings_parallel == 12);
  REQUIRE(s.search.budget);
  CHECK(*s.search.budget == 50000);
  CHECK_FALSE(s.search.max_mass_kg);
  CHECK(s.find_profile("lead-test") == std::optional<std::size_t>(1));
  CHECK(load_study_file(fixture_path("study.yaml")).profiles.size() == 2);
}

TEST_CASE("a study without designs and search keeps the defaults", "[catalog][study]") {
  std::string text = study_text();
  text = text.substr(0, text.find("  designs:"));
  const StudyCase s = load_text(text).study;
  CHECK(s.designs.empty());
  const SearchSettings defaults;
  CHECK(s.search.dod_from == defaults.dod_from);
  CHECK(s.search.max_strings_parallel == defaults.max_strings_parallel);
  CHECK_FALSE(s.search.budget);
}

TEST_CASE("economics are range-checked", "[catalog][study][bad]") {
  CHECK_THAT(study_error(replace_once(study_text(), "project_years: 20", "project_years: 20.5"),
                         "project_years", "study.economics.project_years"),
             Catch::Contains("whole number"));
  CHECK_THAT(study_error(replace_once(study_text(), "project_years: 20", "project_years: 101"),
                         "project_years", "study.economics.project_years"),
             Catch::Contains("must be <= 100"));
  CHECK_THAT(
      study_error(replace_once(study_text(), "real_discount_rate: 0.06", "real_discount_rate: 6"),
                  "real_discount_rate", "study.economics.real_discount_rate"),
      Catch::Contains("must be < 1, found 6"));
}

TEST_CASE("the same profile id twice is refused", "[catalog][study][bad]") {
  const std::string text = replace_once(study_text(), "    - lead-test.yaml\n",
                                        "    - lead-test.yaml\n    - lfp-test.yaml\n");
  const std::string message =
      study_error(text, "    - lfp-test.yaml\n  economics", "study.profiles[2]");
  CHECK_THAT(message, Catch::Contains("'lfp-test'"));
  CHECK_THAT(message, Catch::Contains("already used by study.profiles[0]"));
}

TEST_CASE("a design must name a loaded profile", "[catalog][study][bad]") {
  const std::string text =
      replace_once(study_text(), "{profile: lead-test}", "{profile: lead-tset}");
  const std::string message = study_error(text, "lead-tset", "study.designs[1].profile");
  CHECK_THAT(message, Catch::Contains("did you mean 'lead-test'?"));
  CHECK_THAT(message, Catch::Contains("lfp-test, lead-test"));
}

TEST_CASE("a design's DoD must lie within its profile's range", "[catalog][study][bad]") {
  const std::string text = replace_once(study_text(), "dod_setpoint: 0.7", "dod_setpoint: 0.95");
  CHECK_THAT(study_error(text, "dod_setpoint", "study.designs[0].dod_setpoint"),
             Catch::Contains("[0.2, 0.9]"));
}

TEST_CASE("the profiles must price in the study's currency", "[catalog][study][bad]") {
  const std::string text = replace_once(study_text(), "currency: EUR", "currency: USD");
  const std::string profile = fixture_path("lfp-test.yaml");
  const InputError e =
      expect_input_error([&] { load_text(text); }, profile, 39, "profile.costs.currency");
  CHECK_THAT(e.message(), Catch::Contains("prices in EUR but the study is in USD"));
  CHECK_THAT(e.message(), Catch::Contains(std::string(kName) + ":" +
                                          std::to_string(line_of(text, "currency: USD"))));
}

TEST_CASE("a profile in another currency is converted once by the study's stated rate",
          "[catalog][study][currency]") {
  // A USD study whose profiles price in EUR, with 1 EUR = 1.1 USD. By hand, from the definition
  // of an exchange rate (x EUR = 1.1 x USD), lfp-test's prices become: capital 400 -> 440
  // USD/kWh, per string 200 -> 220, installation 1500 -> 1650, fixed O&M 2 -> 2.2, variable
  // O&M 1.5 -> 1.65 per MWh, end of life -5 -> -5.5 and at a replacement 3 -> 3.3 per kWh;
  // replacement_share 0.9 and price_decline_per_year 0.03 are ratios and stay.
  std::string text =
      replace_once(study_text(), "currency: EUR", "currency: USD\n    exchange_rates: {EUR: 1.1}");
  const LoadedStudy loaded = load_text(text);
  const ProfileCosts& c = loaded.study.profiles.at(0).costs;
  CHECK(loaded.study.profiles.at(0).id == "lfp-test");
  CHECK(c.capital_per_kwh == Approx(440).epsilon(1e-12));
  CHECK(c.capital_per_string == Approx(220).epsilon(1e-12));
  CHECK(c.installation_fixed == Approx(1650).epsilon(1e-12));
  CHECK(c.fixed_om_per_kwh_year == Approx(2.2).epsilon(1e-12));
  CHECK(c.variable_om_per_mwh == Approx(1.65).epsilon(1e-12));
  CHECK(c.end_of_life_per_kwh == Approx(-5.5).epsilon(1e-12));
  REQUIRE(c.replacement_end_of_life_per_kwh.has_value());
  CHECK(*c.replacement_end_of_life_per_kwh == Approx(3.3).epsilon(1e-12));
  CHECK(c.replacement_share == 0.9);
  CHECK(c.price_decline_per_year == 0.03);
  // lead-test: capital 150 EUR/kWh -> 165 USD/kWh.
  CHECK(loaded.study.profiles.at(1).costs.capital_per_kwh == Approx(165).epsilon(1e-12));
  // The rate and the profiles it served are kept for the reports; the source currency stays.
  REQUIRE(loaded.study.exchange_rates.size() == 1);
  CHECK(loaded.study.exchange_rates[0].currency == "EUR");
  CHECK(loaded.study.exchange_rates[0].rate == 1.1);
  CHECK(loaded.study.exchange_rates[0].profile_ids ==
        std::vector<std::string>{"lfp-test", "lead-test"});
  CHECK(loaded.profiles.at(0).currency == "EUR");
  CHECK(loaded.notes.empty());
}

TEST_CASE("a profile currency without a rate is refused at the profile", "[catalog][study][bad]") {
  const std::string text =
      replace_once(study_text(), "currency: EUR", "currency: USD\n    exchange_rates: {GBP: 1.27}");
  const InputError e = expect_input_error([&] { load_text(text); }, fixture_path("lfp-test.yaml"),
                                          39, "profile.costs.currency");
  CHECK_THAT(e.message(), Catch::Contains("exchange_rates gives no rate for EUR"));
  CHECK_THAT(e.message(), Catch::Contains("EUR: R means 1 EUR = R USD"));
}

TEST_CASE("exchange rate keys are other currencies' codes; an unused rate is noted",
          "[catalog][study][bad]") {
  const std::string own =
      replace_once(study_text(), "currency: EUR", "currency: EUR\n    exchange_rates: {EUR: 1}");
  CHECK_THAT(study_error(own, "exchange_rates", "study.economics.exchange_rates.EUR"),
             Catch::Contains("the study's own currency"));
  const std::string lower =
      replace_once(study_text(), "currency: EUR", "currency: EUR\n    exchange_rates: {usd: 1}");
  CHECK_THAT(study_error(lower, "exchange_rates", "study.economics.exchange_rates.usd"),
             Catch::Contains("three-letter currency code"));
  const std::string zero =
      replace_once(study_text(), "currency: EUR", "currency: EUR\n    exchange_rates: {USD: 0}");
  study_error(zero, "exchange_rates", "study.economics.exchange_rates.USD");
  const std::string unused =
      replace_once(study_text(), "currency: EUR", "currency: EUR\n    exchange_rates: {USD: 0.92}");
  const LoadedStudy loaded = load_text(unused);
  REQUIRE(loaded.notes.size() == 1);
  CHECK(loaded.notes[0].field == "study.economics.exchange_rates.USD");
  CHECK(loaded.notes[0].message == "no profile prices in USD; the rate is not used");
  CHECK(loaded.study.profiles.at(0).costs.capital_per_kwh == 400);  // nothing converted
}

TEST_CASE("search limits are checked against the profiles", "[catalog][study][bad]") {
  const std::string mass = replace_once(study_text(), "    budget: 50000\n",
                                        "    budget: 50000\n    max_mass_kg: 900\n");
  CHECK_THAT(study_error(mass, "max_mass_kg", "study.design_space.max_mass_kg"),
             Catch::Contains("lead-test"));
  const std::string ladder =
      replace_once(study_text(), "{from: 0.3, to: 0.9", "{from: 0.9, to: 0.3");
  CHECK_THAT(study_error(ladder, "dod_ladder", "study.design_space.dod_ladder.from"),
             Catch::Contains("must not exceed dod_ladder.to"));
  const std::string strings =
      replace_once(study_text(), "max_strings_parallel: 12", "max_strings_parallel: 0");
  study_error(strings, "max_strings_parallel", "study.design_space.max_strings_parallel");
}

TEST_CASE("errors inside referenced files name those files", "[catalog][study][bad]") {
  const testing::TempDir dir;
  const std::string bad_profile = replace_once(read_text(fixture_path("lead-test.yaml")),
                                               "capacity_ah: 200", "capacity_ah: -1");
  const std::string profile_path = dir.write("lead-bad.yaml", bad_profile);
  dir.write("site.yaml", read_text(fixture_path("site.yaml")));
  dir.write("hourly.csv", read_text(fixture_path("hourly.csv")));
  dir.write("lfp-test.yaml", read_text(fixture_path("lfp-test.yaml")));
  const std::string text = replace_once(study_text(), "lead-test.yaml", "lead-bad.yaml");
  expect_input_error([&] { load_text(text, dir.path()); }, profile_path,
                     line_of(bad_profile, "capacity_ah"), "profile.cell.capacity_ah");

  const std::string site =
      replace_once(read_text(fixture_path("site.yaml")), "bus_voltage_v: 48", "bus_voltage_v: 0");
  const std::string site_path = dir.write("site.yaml", site);
  const std::string lfp_only = replace_once(study_text(), "    - lead-test.yaml\n", "");
  expect_input_error([&] { load_text(lfp_only, dir.path()); }, site_path,
                     line_of(site, "bus_voltage_v"), "site.bus_voltage_v");
}

TEST_CASE("missing referenced files are reported at the key naming them", "[catalog][study][bad]") {
  const std::string site = replace_once(study_text(), "site: site.yaml", "site: nowhere.yaml");
  CHECK_THAT(study_error(site, "site: nowhere", "study.site"), Catch::Contains("No such file"));
  const std::string profile = replace_once(study_text(), "- lead-test.yaml", "- gone.yaml");
  CHECK_THAT(study_error(profile, "gone.yaml", "study.profiles[1]"), Catch::Contains("gone.yaml"));
  const std::string missing = fixture_path("no-such-study.yaml");
  expect_input_error([&] { load_study_file(missing); }, missing, 1, "study");
}

}  // namespace
}  // namespace stowage
